// Reading a species file of any supported format: the dispatcher over the readers.
#include "vibtherm/read_species.hpp"

#include <fmt/format.h>

#include <filesystem>
#include <fstream>
#include <iterator>
#include <sstream>

#include "vibtherm/species_builder.hpp"

namespace vibtherm {

namespace fs = std::filesystem;

Species read_species_file(const std::string& path, std::string* bytes) {
  std::string ext = lowercase_extension(path);
  if (!is_species_extension(ext))
    fail({path, 0, 0}, "unknown file type " + quote(ext.empty() ? "(none)" : ext) +
                           ", expected a species file ending in .yaml, .yml or .xyz");
  std::error_code ec;
  const fs::file_status status = fs::status(path, ec);
  if (fs::is_directory(status)) fail({path, 0, 0}, "is a directory, expected a species file");
  if (fs::exists(status) && !fs::is_regular_file(status))
    fail({path, 0, 0}, "is not a regular file (a device, FIFO or socket), expected a species file");
  std::ifstream in(path, std::ios::binary);
  if (!in) fail({path, 0, 0}, "cannot read file (missing or not readable), expected a species file");
  const auto size = fs::file_size(path, ec);
  if (!ec && size > max_species_file_bytes)
    fail({path, 0, 0}, fmt::format("file has {} bytes, more than the {} MiB a species file may have", size,
                                   max_species_file_bytes >> 20));
  std::string text;
  if (!ec) text.reserve(static_cast<std::size_t>(size));
  text.assign(std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>());
  if (in.bad()) fail({path, 0, 0}, "error while reading file");
  if (text.size() > max_species_file_bytes)
    fail({path, 0, 0},
         fmt::format("file has more than the {} MiB a species file may have", max_species_file_bytes >> 20));
  if (text.find_first_not_of(" \t\r\n") == std::string::npos)
    fail({path, 0, 0}, "file is empty, expected a species description");
  Species species = ext == ".xyz" ? read_species_xyz(text, path) : read_species_yaml(text, path);
  if (species.atoms.size() > max_species_atoms)
    fail(species.origin, fmt::format("species has {} atoms, more than the {} this version accepts",
                                     species.atoms.size(), max_species_atoms));
  if (species.frequencies_cm1.size() > max_species_frequencies)
    fail(species.origin, fmt::format("species has {} frequencies, more than the {} this version accepts",
                                     species.frequencies_cm1.size(), max_species_frequencies));
  if (bytes) *bytes = std::move(text);
  return species;
}

}  // namespace vibtherm
