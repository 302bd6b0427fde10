// The YAML species reader (design.md section 4): one species per file, every malformed
// input an InputError with its line and column.
#pragma once

#include <string>
#include <vector>

#include "vibtherm/species.hpp"

namespace vibtherm {

// Reads a species from YAML text; `file_name` is used for error locations.
Species read_species_yaml(const std::string& text, const std::string& file_name);

// The keys of the YAML format that this version reads, for schema checks and help.
const std::vector<std::string>& yaml_species_keys();

}  // namespace vibtherm
