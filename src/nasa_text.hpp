// Internal to the NASA reader: the text of a thermo file as numbered lines, fixed-column
// field parsing, and the parsers of one NASA-7 or NASA-9 record (read_nasa.cpp drives them).
#pragma once

#include <cstddef>
#include <initializer_list>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "vibtherm/nasa.hpp"

namespace vibtherm::nasa_text {

struct Line {
  int number = 0;  // 1-based
  std::string text;
};

struct Number {
  double value = 0.0;
  int column = 0;         // 1-based column of its first character
  bool integral = false;  // written without '.' or exponent
};

std::string_view trim(std::string_view s);
std::string upper(std::string_view s);
std::string first_token(const std::string& s);
std::string strip_comment(const std::string& s);
bool is_comment_or_blank(const std::string& s);
// Columns first..last (1-based, inclusive); shorter when the line is.
std::string column_text(const std::string& s, int first, int last);

// Fortran-style number: D or d exponents, lowercase e, and an exponent written without its
// sign ("1.29044479e 01", blank for +). Empty or unreadable text: nothing.
std::optional<double> to_number(std::string_view s);
// The same exponent forms made readable in place, column for column: D→E, "e 01"→"e+01".
std::string normalise_exponents(std::string s);
// Consecutive numbers, glued or spaced ("1.0E+00-2.0E+00" is two). Stops at the first
// character that cannot start a number; `stop_column` is its 1-based column (0: none).
std::vector<Number> scan_numbers(std::string_view text, int first_column, int& stop_column);
// True when the first blank-delimited token of the line is made of numbers only.
bool starts_with_number(const std::string& s);

// Element/count pairs in fixed fields: `count` fields of `sym_width` + `num_width`
// columns from column `first`. Empty when the columns do not hold such fields.
std::optional<std::vector<ElementAmount>> composition_fields(const std::string& s, int first, int count,
                                                             int sym_width, int num_width);

// The lines of one thermo section, with the reader's position in them.
struct Cursor {
  const std::vector<Line>& lines;
  std::string file;
  std::size_t i = 0;
  // Advances i to the next line with content; false at the end of the text.
  bool next_content();
  [[noreturn]] void fail_at(const Line& line, int column, const std::string& message) const;
};

// Coefficients beyond ±1e30 (published ones stay below 1e10 in magnitude) would overflow
// the evaluation; they are an error at `line`.
inline constexpr double max_coefficient_magnitude = 1e30;
// True when every temperature is finite and within limits.hpp's 1 to 1e5 K: a record's
// ranges beyond them (T_high 1e300) would be evaluated to inf by the plausibility checks.
bool within_temperature_limits(std::initializer_list<double> temperatures_K);
void check_coefficients(const Cursor& cursor, const Line& line, const std::vector<double>& values,
                        const std::string& name);

// A NASA-7 record starting at cursor.i (line 1); leaves cursor.i after its line 4.
// `default_T_mid_K` is the file's (THERMO line) or the conventional one.
Nasa7 read_nasa7_record(Cursor& cursor, double default_T_mid_K);
// A NASA-9 record starting at cursor.i (record 1). Nothing for a species with no
// temperature intervals (an assigned-enthalpy reactant of the NASA database).
std::optional<Nasa9> read_nasa9_record(Cursor& cursor);
// True when the line is the second record of a NASA-9 species (its interval count).
bool is_nasa9_second_record(const std::string& s);

}  // namespace vibtherm::nasa_text
