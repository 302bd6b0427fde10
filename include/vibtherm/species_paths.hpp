// From command-line arguments to species files: files as given, directories to the
// species files in them, manifests to the files they list.
#pragma once

#include <string>
#include <vector>

namespace vibtherm {

// The extension of `path` in lower case, with its dot (".yaml"); empty when it has none.
std::string lowercase_extension(const std::string& path);

// True for the extensions of species files (.yaml, .yml, .xyz).
bool is_species_extension(const std::string& extension);

// Expands the command-line arguments: files as given, directories to their species
// files (sorted by name, not recursive), manifests (*.list: one path per line, relative
// to the manifest, '#' comments) to the files they list.
std::vector<std::string> expand_species_paths(const std::vector<std::string>& args);

}  // namespace vibtherm
