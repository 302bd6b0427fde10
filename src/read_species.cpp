// Reading a species file of any supported format: the dispatcher over the readers.
#include "vibtherm/read_species.hpp"

#include <filesystem>
#include <fstream>
#include <sstream>

#include "vibtherm/species_builder.hpp"

namespace vibtherm {

namespace fs = std::filesystem;

Species read_species_file(const std::string& path) {
  std::string ext = lowercase_extension(path);
  if (!is_species_extension(ext))
    fail({path, 0, 0}, "unknown file type " + quote(ext.empty() ? "(none)" : ext) +
                           ", expected a species file ending in .yaml, .yml or .xyz");
  std::error_code ec;
  if (fs::is_directory(path, ec)) fail({path, 0, 0}, "is a directory, expected a species file");
  std::ifstream in(path, std::ios::binary);
  if (!in) fail({path, 0, 0}, "cannot read file (missing or not readable), expected a species file");
  std::stringstream buffer;
  buffer << in.rdbuf();
  if (in.bad()) fail({path, 0, 0}, "error while reading file");
  std::string text = buffer.str();
  if (text.find_first_not_of(" \t\r\n") == std::string::npos)
    fail({path, 0, 0}, "file is empty, expected a species description");
  return ext == ".xyz" ? read_species_xyz(text, path) : read_species_yaml(text, path);
}

}  // namespace vibtherm
