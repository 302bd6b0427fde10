// NASA-7 writer: the fixed-column four-line records of NASA SP-273 / TM-4513, optionally
// wrapped in THERMO ALL ... END.
//
// What does not fit the format is an InputError, never truncated: a name longer than 18
// characters or containing blanks, a note longer than 6 characters, more than four
// elements (use NASA-9 or JSON), an element symbol longer than 2 characters, or a count
// that is not a whole number from 0 to 999.
#pragma once

#include <string>
#include <vector>

#include "vibtherm/nasa.hpp"

namespace vibtherm {

struct Nasa7WriteOptions {
  bool thermo_wrapper = true;                // THERMO ALL, default-temperature line, ..., END
  std::vector<std::string> header_comments;  // '!' lines at the top of the file
};

// One species: its comments as '!' lines, then the four 80-column lines.
std::string write_nasa7_record(const Nasa7& species);

std::string write_nasa7(const std::vector<Nasa7>& species, const Nasa7WriteOptions& options = {});

}  // namespace vibtherm
