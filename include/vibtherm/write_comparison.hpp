// Writer for `eval --against`: per species the largest differences in Cp, H and S, as
// aligned text, CSV or JSON. Formatting only.
#pragma once

#include <string>
#include <vector>

#include "vibtherm/nasa_compare.hpp"

namespace vibtherm {

// `reference` and `other` name the two sources (file paths) in the heading.
std::string comparison_text(const std::vector<CurveComparison>& rows, const std::string& reference,
                            const std::string& other);
std::string comparison_csv(const std::vector<CurveComparison>& rows);
std::string comparison_json(const std::vector<CurveComparison>& rows, const std::string& reference,
                            const std::string& other);

}  // namespace vibtherm
