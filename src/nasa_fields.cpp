// Fixed-column field parsing for the NASA reader (see nasa_text.hpp).
#include <fmt/format.h>

#include <algorithm>
#include <cctype>
#include <charconv>
#include <cmath>

#include "nasa_text.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/limits.hpp"

namespace vibtherm::nasa_text {

namespace {
bool is_digit(char c) { return std::isdigit(static_cast<unsigned char>(c)) != 0; }
bool is_space(char c) { return std::isspace(static_cast<unsigned char>(c)) != 0; }
}  // namespace

std::string_view trim(std::string_view s) {
  while (!s.empty() && is_space(s.front())) s.remove_prefix(1);
  while (!s.empty() && is_space(s.back())) s.remove_suffix(1);
  return s;
}

std::string upper(std::string_view s) {
  std::string out(s);
  for (char& c : out) c = static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
  return out;
}

std::string first_token(const std::string& s) {
  const auto t = trim(s);
  return std::string(t.substr(0, t.find_first_of(" \t")));
}

std::string strip_comment(const std::string& s) {
  const auto bang = s.find('!');
  return bang == std::string::npos ? s : s.substr(0, bang);
}

bool is_comment_or_blank(const std::string& s) {
  const auto t = trim(s);
  return t.empty() || t.front() == '!';
}

std::string column_text(const std::string& s, int first, int last) {
  if (static_cast<int>(s.size()) < first) return {};
  return s.substr(static_cast<std::size_t>(first - 1), static_cast<std::size_t>(last - first + 1));
}

std::string normalise_exponents(std::string t) {
  for (std::size_t k = 0; k < t.size(); ++k) {
    char& c = t[k];
    if (c != 'D' && c != 'd' && c != 'E' && c != 'e') continue;
    // Only an exponent letter: after a digit or a point (not inside a name).
    if (k == 0 || !(is_digit(t[k - 1]) || t[k - 1] == '.')) continue;
    c = 'E';
    // "E 01" (blank for +, NASA SP-273 Fortran E format read with blanks as zero or plus).
    if (k + 2 < t.size() && t[k + 1] == ' ' && is_digit(t[k + 2])) t[k + 1] = '+';
  }
  return t;
}

std::optional<double> to_number(std::string_view s) {
  std::string t = normalise_exponents(std::string(trim(s)));
  if (t.empty()) return std::nullopt;
  if (t.front() == '+') t.erase(0, 1);
  double v = 0.0;
  auto [ptr, ec] = std::from_chars(t.data(), t.data() + t.size(), v);
  if (ec != std::errc() || ptr != t.data() + t.size() || !std::isfinite(v)) return std::nullopt;
  return v;
}

std::vector<Number> scan_numbers(std::string_view text, int first_column, int& stop_column) {
  const std::string t = normalise_exponents(std::string(text));
  std::vector<Number> out;
  std::size_t p = 0;
  stop_column = 0;
  while (true) {
    while (p < t.size() && is_space(t[p])) ++p;
    if (p >= t.size()) return out;
    const std::size_t start = p;
    if (t[p] == '+') ++p;
    double v = 0.0;
    auto [ptr, ec] = std::from_chars(t.data() + p, t.data() + t.size(), v);
    if (ec != std::errc() || (p > start && t[p] == '-') || !std::isfinite(v)) {
      stop_column = first_column + static_cast<int>(start);
      return out;
    }
    const std::size_t end = static_cast<std::size_t>(ptr - t.data());
    const std::string_view written(t.data() + start, end - start);
    out.push_back(Number{v, first_column + static_cast<int>(start),
                         written.find_first_of(".eE") == std::string_view::npos});
    p = end;
  }
}

bool starts_with_number(const std::string& s) {
  const std::string token = first_token(s);
  if (token.empty()) return false;
  int stop = 0;
  const auto nums = scan_numbers(token, 1, stop);
  return !nums.empty() && stop == 0;
}

std::optional<std::vector<ElementAmount>> composition_fields(const std::string& s, int first, int count,
                                                             int sym_width, int num_width) {
  std::vector<ElementAmount> out;
  const int w = sym_width + num_width;
  for (int k = 0; k < count; ++k) {
    const int c = first + k * w;
    const std::string sym_column = column_text(s, c, c + sym_width - 1);
    const auto sym = trim(sym_column);
    const std::string num_column = column_text(s, c + sym_width, c + w - 1);
    const auto num = to_number(num_column);
    if (sym.empty()) {
      // An empty field: blank, or a zero count ("    0").
      if (!trim(num_column).empty() && (!num || *num != 0.0)) return std::nullopt;
      continue;
    }
    if (!num || !std::isalpha(static_cast<unsigned char>(sym.front())) || *num < 0) return std::nullopt;
    if (*num != 0.0) out.push_back({std::string(sym), *num});
  }
  return out;
}

bool Cursor::next_content() {
  while (i < lines.size() && is_comment_or_blank(lines[i].text)) ++i;
  return i < lines.size();
}

void Cursor::fail_at(const Line& line, int column, const std::string& message) const {
  fail({file, line.number, column}, message);
}

void check_coefficients(const Cursor& cur, const Line& line, const std::vector<double>& values,
                        const std::string& name) {
  for (double v : values)
    if (!(std::abs(v) <= max_coefficient_magnitude))
      cur.fail_at(line, 1,
                  fmt::format("species '{}': coefficient {:g} is out of range (at most {:g} in magnitude)",
                              name, v, max_coefficient_magnitude));
}

bool within_temperature_limits(std::initializer_list<double> temperatures_K) {
  return std::all_of(temperatures_K.begin(), temperatures_K.end(), [](double T) {
    return T >= limits::min_temperature_K && T <= limits::max_temperature_K;
  });
}

bool is_nasa9_second_record(const std::string& s) {
  const auto t = trim(s);
  const auto token = t.substr(0, t.find(' '));
  return !token.empty() && token.size() <= 2 &&
         std::all_of(token.begin(), token.end(), [](char c) { return is_digit(c); });
}

}  // namespace vibtherm::nasa_text
