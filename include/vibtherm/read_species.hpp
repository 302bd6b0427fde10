// Reading species files of every supported format into the same Species: the
// dispatcher, and the headers of the format readers and of path expansion.
#pragma once

#include <string>

#include "vibtherm/read_xyz.hpp"
#include "vibtherm/read_yaml.hpp"
#include "vibtherm/species.hpp"
#include "vibtherm/species_paths.hpp"

namespace vibtherm {

// Reads a file, choosing the reader by extension (.yaml/.yml, .xyz).
Species read_species_file(const std::string& path);

}  // namespace vibtherm
