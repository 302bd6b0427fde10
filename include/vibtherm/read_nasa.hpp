// Reader for NASA-7 and NASA-9 thermo text. Tolerant of the variations found in
// circulated files (spacing, glued E-format fields, D exponents, missing T_mid, '!'
// comments, THERMO/END and thermo/END PRODUCTS wrappers); a malformed block is an
// InputError at FILE:LINE:COL.
#pragma once

#include <string>
#include <vector>

#include "vibtherm/nasa.hpp"

namespace vibtherm {

// T_mid used for a NASA-7 record that leaves columns 66-73 blank when the file gives no
// THERMO default-temperature line: 1000 K, the conventional common temperature (common practice).
inline constexpr double default_nasa7_T_mid_K = 1000.0;

// Each record is NASA-7 or NASA-9, decided by its second line (NASA-9: it starts with the
// integer count of intervals; NASA-7: with an E-format coefficient). `file_name` is used
// for error locations only.
std::vector<NasaPolynomial> read_nasa(const std::string& text, const std::string& file_name);

std::vector<NasaPolynomial> read_nasa_file(const std::string& path);

}  // namespace vibtherm
