// Reading the reference-value tables of validation/: comma-separated fields, '#' comments.
#pragma once

#include <sstream>
#include <string>
#include <vector>

namespace vibtherm::validation {

inline std::vector<std::string> split_csv(const std::string& line) {
  std::vector<std::string> fields;
  std::stringstream stream(line);
  std::string field;
  while (std::getline(stream, field, ',')) fields.push_back(field);
  return fields;
}

}  // namespace vibtherm::validation
