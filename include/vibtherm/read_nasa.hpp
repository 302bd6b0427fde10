// Reader for NASA-7 and NASA-9 thermo text as published files write it: bare record lists,
// THERMO/THERM sections and whole mechanism files; one bad record is reported and the rest
// are still read. Record parsing lives in src/nasa7_record.cpp and src/nasa9_record.cpp.
#pragma once

#include <cstddef>
#include <string>
#include <vector>

#include "vibtherm/error.hpp"
#include "vibtherm/nasa.hpp"

namespace vibtherm {

// T_mid used for a NASA-7 record that leaves columns 66-73 blank when the file gives no
// THERMO default-temperature line: 1000 K, the conventional common temperature (common practice).
inline constexpr double default_nasa7_T_mid_K = 1000.0;

// What a thermo file holds. Accepted beyond the pinned layout (design.md section 6):
// - the keyword THERMO, THERM, THERMO ALL in any case, with an optional default-temperature
//   line (T_low T_mid T_high; NASA-9: breakpoints and a date), and END, END PRODUCTS,
//   END REACTANTS;
// - a mechanism file: ELEMENTS, SPECIES, THERMO, REACTIONS sections (any case, abbreviated
//   to four letters); only the THERMO section is read;
// - NASA-7 line 1: a digit in column 79 beside the 1 in column 80, a fifth element field
//   in columns 74-78 (blank, "    0" or "AR  1"), T_mid written to column 78, free
//   spacing, an '&' at its end announcing continuation lines of "SYMBOL COUNT" pairs;
// - NASA-7 line 4: a fifth number in columns 61-75 (an H(298.15)/R field, ignored);
// - numbers with D exponents, lowercase e, an exponent without its sign ("1.2e 01"),
//   glued fields ("1.0E+00-2.0E+00"), '!' comments, blank lines, CR LF line ends;
// - a blank T_mid: the THERMO default, clamped into the species' own range (a single-range
//   species may lie wholly on one side of it), else 1000 K;
// - NASA-9 in the published layout of NASA/TP-2002-211556 and of the NASA database
//   (interval count glued to T_high: "1000.0007 -2.0"; species with 0 intervals, which
//   carry no polynomial, are skipped with a warning).
struct NasaFile {
  std::vector<NasaPolynomial> species;  // the first record of each name, in file order
  std::vector<int> lines;               // line 1 of each species' record
  std::vector<InputError> errors;       // the bad records, in file order, each naming its species
  std::vector<std::string> warnings;    // "FILE:LINE: ..." (duplicate names, skipped species)
};

// `file_name` is used for locations and, when no record could be read, for telling a
// species file by its extension. Never throws for a bad record (see `errors`). InputError
// (one line) for a text without any record and without errors, for a species file (YAML,
// XYZ, QCSchema, Molden: "this is a species file ..., not a NASA polynomial file") and for
// text with neither a THERMO keyword nor any number with an exponent, of which nothing
// could be read.
NasaFile read_nasa_records(const std::string& text, const std::string& file_name);
// A regular file (not /dev/zero or a FIFO) of at most max_nasa_file_bytes, else InputError.
NasaFile read_nasa_records_file(const std::string& path);
// 64 MiB: about 200,000 NASA-7 records (a 10,000-species thermo file has about 3 MB).
inline constexpr std::size_t max_nasa_file_bytes = 64u << 20;

// Strict forms: the species of a file that has no bad record; else its first error.
std::vector<NasaPolynomial> read_nasa(const std::string& text, const std::string& file_name);
std::vector<NasaPolynomial> read_nasa_file(const std::string& path);

}  // namespace vibtherm
