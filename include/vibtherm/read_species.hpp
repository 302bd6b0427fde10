// Readers for species files: YAML (design.md section 4) and XYZ-plus-frequencies.
// Both produce the same Species; every malformed input is an InputError with its location.
#pragma once

#include <string>
#include <vector>

#include "vibtherm/species.hpp"

namespace vibtherm {

// Reads a species from text; `file_name` is used for error locations only.
Species read_species_yaml(const std::string& text, const std::string& file_name);
Species read_species_xyz(const std::string& text, const std::string& file_name);

// Reads a file, choosing the reader by extension (.yaml/.yml, .xyz).
Species read_species_file(const std::string& path);

// Expands the command-line arguments: files as given, directories to their species
// files (sorted by name), manifests (*.list: one path per line, relative to the manifest,
// '#' comments) to the files they list.
std::vector<std::string> expand_species_paths(const std::vector<std::string>& args);

}  // namespace vibtherm
