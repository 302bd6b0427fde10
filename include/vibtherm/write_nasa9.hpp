// NASA-9 writer in the record layout of McBride, Zehe & Gordon, NASA/TP-2002-211556
// (summarised in shared/reference.md), optionally wrapped in `thermo` ... `END PRODUCTS` /
// `END REACTANTS` as in the published data file.
//
// What does not fit is an InputError, never truncated: a name longer than 18 characters
// or containing blanks, a comment longer than 62 characters, more than five elements,
// more than nine ranges, or a value too wide for its field.
#pragma once

#include <string>
#include <vector>

#include "vibtherm/nasa.hpp"

namespace vibtherm {

struct Nasa9WriteOptions {
  bool thermo_wrapper = true;
  std::vector<std::string> header_comments;  // '!' lines at the top of the file
};

std::string write_nasa9_record(const Nasa9& species);
std::string write_nasa9(const std::vector<Nasa9>& species, const Nasa9WriteOptions& options = {});

}  // namespace vibtherm
