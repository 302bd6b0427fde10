// Helpers for tests of fixed-column text: split into lines, cut 1-based columns.
#pragma once

#include <sstream>
#include <string>
#include <vector>

namespace vibtherm::test {

inline std::vector<std::string> lines_of(const std::string& text) {
  std::vector<std::string> out;
  std::istringstream in(text);
  for (std::string s; std::getline(in, s);) out.push_back(s);
  return out;
}

// Columns first..last, 1-based and inclusive, as the NASA formats number them.
inline std::string cols(const std::string& s, int first, int last) {
  return s.substr(first - 1, last - first + 1);
}

}  // namespace vibtherm::test
