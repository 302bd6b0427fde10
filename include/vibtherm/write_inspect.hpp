// Writers for `inspect`: a readable text summary, CSV (one row per species) and JSON with
// the pinned keys (name, rotor, mass, moments_of_inertia, symmetry_number, frequencies, zpe).
#pragma once

#include <string>
#include <vector>

#include "vibtherm/facts.hpp"

namespace vibtherm {

std::string inspect_text(const std::vector<SpeciesFacts>& facts);
std::string inspect_csv(const std::vector<SpeciesFacts>& facts);
std::string inspect_json(const std::vector<SpeciesFacts>& facts);

}  // namespace vibtherm
