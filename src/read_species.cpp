// Reading a species file of any supported format: the dispatcher over the readers.
#include "vibtherm/read_species.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <sstream>

#include "vibtherm/species_builder.hpp"
#include "vibtherm/species_format.hpp"

namespace vibtherm {

namespace fs = std::filesystem;

namespace {

// The text of a species file, after the checks every format shares (a regular, readable,
// non-empty file within the size limit).
std::string read_text(const std::string& path) {
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
  return text;
}

void check_size(const Species& species) {
  if (species.atoms.size() > max_species_atoms)
    fail(species.origin, fmt::format("species has {} atoms, more than the {} this version accepts",
                                     species.atoms.size(), max_species_atoms));
  if (species.frequencies_cm1.size() > max_species_frequencies)
    fail(species.origin, fmt::format("species has {} frequencies, more than the {} this version accepts",
                                     species.frequencies_cm1.size(), max_species_frequencies));
}

}  // namespace

Species read_species_text(const std::string& text, const std::string& path) {
  switch (detect_species_format(text, path)) {
    case SpeciesFormat::xyz:
      return read_species_xyz(text, path);
    case SpeciesFormat::qcschema:
      return read_species_qcschema(text, path);
    case SpeciesFormat::molden:
      return read_species_molden(text, path);
    case SpeciesFormat::yaml:
      break;
  }
  return read_species_yaml(text, path);
}

Species read_species_file(const std::string& path, std::string* bytes) {
  std::string text = read_text(path);
  Species species = read_species_text(text, path);
  check_size(species);
  if (bytes) *bytes = std::move(text);
  return species;
}

Species read_species_source(const SpeciesSource& source, std::string* bytes) {
  if (source.overlay.empty()) return read_species_file(source.path, bytes);
  // Blank lines before it keep the reader's line numbers those of the manifest.
  const std::string text =
      std::string(static_cast<std::size_t>(std::max(source.line - 1, 0)), '\n') + source.overlay + '\n';
  Species species = read_species_yaml(text, source.path);
  check_size(species);
  if (bytes) *bytes = source.overlay;
  return species;
}

Species read_exchange_file(const std::string& path, std::string* bytes) {
  std::string text = read_text(path);
  const SpeciesFormat format = detect_species_format(text, path);
  if (format != SpeciesFormat::qcschema && format != SpeciesFormat::molden)
    fail({path, 0, 0},
         "is a " + std::string(species_format_name(format)) +
             " species file, expected a QC exchange file (QCSchema JSON or Molden normal modes)");
  Species species = format == SpeciesFormat::qcschema ? read_species_qcschema(text, path, true)
                                                      : read_species_molden(text, path, true);
  check_size(species);
  if (bytes) *bytes = std::move(text);
  return species;
}

}  // namespace vibtherm
