// Temperature lists from the command line: "298.15,500,1000" or "300:3000:100"
// (start:stop:step, stop included when it falls on the grid), or a mix of both.
#pragma once

#include <string_view>
#include <vector>

namespace vibtherm {

// Throws InputError (no file) on malformed text or non-positive temperatures.
std::vector<double> parse_temperatures(std::string_view text);

}  // namespace vibtherm
