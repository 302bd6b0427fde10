// The method-file reader (YAML, design.md section 4; schemas/method.schema.json): every
// malformed input an InputError at its line and column.
#pragma once

#include <string>

#include "vibtherm/method.hpp"

namespace vibtherm {

// Reads a method from YAML text; `file_name` is used for error locations.
Method read_method_yaml(const std::string& text, const std::string& file_name);

// Reads a method file (at most max_species_file_bytes).
Method read_method_file(const std::string& path);

}  // namespace vibtherm
