// One NASA-7 record (NASA SP-273; NASA TM-4513): line 1 in fixed columns or free spacing,
// three coefficient lines; the variations of circulated files are listed in read_nasa.hpp.
#include <fmt/format.h>

#include <algorithm>
#include <cctype>
#include <cmath>

#include "nasa_text.hpp"
#include "vibtherm/limits.hpp"

namespace vibtherm::nasa_text {

namespace {

bool is_alpha(char c) { return std::isalpha(static_cast<unsigned char>(c)) != 0; }
bool is_digit(char c) { return std::isdigit(static_cast<unsigned char>(c)) != 0; }

// The record's place number in column 80 (and a digit in column 79 beside it, a record
// counter some files write) is not part of the data.
std::string without_line_number(std::string text) {
  while (!text.empty() && text.back() == ' ') text.pop_back();
  if (text.size() != 80 || !is_digit(text[79])) return text;
  if (text[78] == ' ' || (is_digit(text[78]) && text[77] == ' ')) text.resize(78);
  return text;
}

// Coefficients of one line: `expected` numbers (`optional_extra` more allowed and
// dropped: the H(298.15)/R field of line 4, columns 61-75), in E15.8 fields or spaced.
std::vector<double> coefficients(const Cursor& cur, const Line& line, std::size_t expected,
                                 std::size_t optional_extra, int line_number, const std::string& name) {
  const std::string text = without_line_number(strip_comment(line.text));
  std::vector<double> out;
  // Fixed E15.8 fields first: they read exponents without a sign ("1.2e 01").
  bool fixed = text.size() >= 15 * expected;
  for (std::size_t k = 0; fixed && k < expected; ++k) {
    const auto v = to_number(column_text(text, static_cast<int>(15 * k + 1), static_cast<int>(15 * k + 15)));
    if (!v)
      fixed = false;
    else
      out.push_back(*v);
  }
  if (fixed) {
    const std::string rest = column_text(text, static_cast<int>(15 * expected + 1), 79);
    const auto extra = optional_extra ? to_number(column_text(text, static_cast<int>(15 * expected + 1),
                                                              static_cast<int>(15 * expected + 15)))
                                      : std::nullopt;
    const std::string after = column_text(text, static_cast<int>(15 * expected + 16), 79);
    if (trim(rest).empty() || (extra && trim(after).empty())) return out;
  }
  out.clear();
  int stop = 0;
  auto nums = scan_numbers(text, 1, stop);
  if (stop != 0)
    cur.fail_at(line, stop,
                fmt::format("species '{}': unreadable coefficient on line {} of its record "
                            "(expected {} numbers in E15.8 fields)",
                            name, line_number, expected));
  // A free-format line number: a bare integer equal to the line's place in the record.
  if (!nums.empty() && nums.back().integral && nums.back().value == line_number) nums.pop_back();
  if (nums.size() < expected || nums.size() > expected + optional_extra)
    cur.fail_at(line, 1,
                fmt::format("species '{}': line {} of its record has {} numbers, expected {} coefficients",
                            name, line_number, nums.size(), expected));
  for (std::size_t k = 0; k < expected; ++k) out.push_back(nums[k].value);
  return out;
}

// Extended composition on a continuation line: "SYM COUNT SYM COUNT ..." (spaced). True
// when the line ends in '&' itself (another continuation line follows).
bool read_continuation(const Cursor& cur, const Line& line, Nasa7& sp) {
  const std::string text = strip_comment(line.text);
  std::vector<std::pair<std::string, int>> tokens;  // text, 1-based column
  for (std::size_t p = text.find_first_not_of(' '); p != std::string::npos;
       p = text.find_first_not_of(' ', p)) {
    const std::size_t e = std::min(text.find(' ', p), text.size());
    tokens.emplace_back(text.substr(p, e - p), static_cast<int>(p) + 1);
    p = e;
  }
  bool more = false;
  if (!tokens.empty() && tokens.back().first == "&") {
    more = true;
    tokens.pop_back();
  }
  for (std::size_t k = 0; k < tokens.size(); k += 2) {
    const std::string& sym = tokens[k].first;
    double count = -1.0;
    if (k + 1 < tokens.size()) count = to_number(tokens[k + 1].first).value_or(-1.0);
    if (!is_alpha(sym.front()) || sym.size() > 2 || count < 0)
      cur.fail_at(line, tokens[k].second,
                  fmt::format("species '{}': expected element symbol and count pairs on the '&' "
                              "continuation line, found '{}'",
                              sp.name, sym));
    if (count != 0.0) sp.composition.push_back({sym, count});
  }
  return more;
}

}  // namespace

Nasa7 read_nasa7_record(Cursor& cur, double default_T_mid_K) {
  const Line& l1 = cur.lines[cur.i];
  Nasa7 sp;
  std::string text = l1.text;
  if (auto bang = text.find('!'); bang != std::string::npos && bang > 0) text.resize(bang);
  sp.name = first_token(text);
  // An '&' at the end of line 1 announces composition continuation lines.
  bool continued = false;
  if (const auto t = trim(text); !t.empty() && t.back() == '&') {
    continued = true;
    text[text.find_last_of('&')] = ' ';
  }
  if (sp.name.size() <= 18 && text.rfind(sp.name, 0) == 0) {
    sp.note = std::string(trim(column_text(text, 19, 24)));
    if (sp.note.find(' ') != std::string::npos) sp.note.clear();
  }

  std::optional<double> lo, hi, mid;
  bool fixed = false;
  text = without_line_number(text);
  if (text.size() >= 55 && is_alpha(text[44])) {
    const auto a = to_number(column_text(text, 46, 55));
    const auto b = to_number(column_text(text, 56, 65));
    // T_mid in columns 66-73, a fifth element field in 74-78 (blank, "    0" or "AR  1");
    // else T_mid written wider (F10.3 to column 75 is common), read to column 78.
    auto fifth = composition_fields(text, 74, 1, 2, 3);
    const std::string narrow = column_text(text, 66, 73);
    std::optional<double> c = to_number(narrow);
    bool mid_ok = fifth.has_value() && (c || trim(narrow).empty());
    if (!mid_ok) {
      fifth = std::vector<ElementAmount>{};
      const std::string wide = column_text(text, 66, 78);
      c = to_number(wide);
      mid_ok = c || trim(wide).empty();
    }
    auto four = composition_fields(text, 25, 4, 2, 3);
    if (a && b && mid_ok && four) {
      fixed = true;
      sp.phase = static_cast<char>(std::toupper(static_cast<unsigned char>(text[44])));
      lo = a;
      hi = b;
      mid = c;
      sp.composition = *four;
      sp.composition.insert(sp.composition.end(), fifth->begin(), fifth->end());
    }
  }
  if (!fixed) {
    // Free-spaced line: the temperatures follow the last token that is a phase letter.
    std::size_t pos = std::string::npos;
    for (std::size_t k = sp.name.size() + text.find(sp.name); k < text.size(); ++k) {
      const char c = static_cast<char>(std::toupper(static_cast<unsigned char>(text[k])));
      const bool token_start = k == 0 || text[k - 1] == ' ' || is_digit(text[k - 1]);
      const char next = k + 1 < text.size() ? text[k + 1] : ' ';
      if (token_start && (c == 'G' || c == 'L' || c == 'S' || c == 'C') && (next == ' ' || is_digit(next)))
        pos = k;
    }
    if (pos == std::string::npos)
      cur.fail_at(l1, 45,
                  fmt::format("species '{}': expected the phase (G, L or S) in column 45 followed by T_low, "
                              "T_high and T_mid",
                              sp.name));
    sp.phase = static_cast<char>(std::toupper(static_cast<unsigned char>(text[pos])));
    int stop = 0;
    auto nums = scan_numbers(std::string_view(text).substr(pos + 1), static_cast<int>(pos) + 2, stop);
    if (stop != 0)
      cur.fail_at(l1, stop,
                  fmt::format("species '{}': unreadable temperature after the phase letter", sp.name));
    if (nums.size() >= 3 && nums.back().integral && nums.back().value == 1.0) nums.pop_back();
    if (nums.size() < 2 || nums.size() > 3)
      cur.fail_at(l1, static_cast<int>(pos) + 2,
                  fmt::format("species '{}': expected T_low T_high [T_mid] after the phase, found {} numbers",
                              sp.name, nums.size()));
    lo = nums[0].value;
    hi = nums[1].value;
    if (nums.size() == 3) mid = nums[2].value;
  }
  sp.T_low_K = *lo;
  sp.T_high_K = *hi;
  if (mid) {
    sp.T_mid_K = *mid;
  } else {
    // A single-range species may lie wholly on one side of the file's default T_mid: then
    // the breakpoint is its range's end, and one set of coefficients covers the range.
    sp.T_mid_K =
        std::clamp(default_T_mid_K, std::min(sp.T_low_K, sp.T_high_K), std::max(sp.T_low_K, sp.T_high_K));
  }
  if (!within_temperature_limits({sp.T_low_K, sp.T_mid_K, sp.T_high_K}))
    cur.fail_at(
        l1, 46,
        fmt::format("species '{}': temperatures T_low {:g}, T_mid {:g}, T_high {:g} K, expected {:g} to "
                    "{:g} K",
                    sp.name, sp.T_low_K, sp.T_mid_K, sp.T_high_K, limits::min_temperature_K,
                    limits::max_temperature_K));

  if (continued) {
    ++cur.i;
    if (!cur.next_content())
      cur.fail_at(cur.lines.back(), 0,
                  fmt::format("species '{}': file ends after line 1, which announces a '&' continuation line",
                              sp.name));
    while (read_continuation(cur, cur.lines[cur.i], sp)) {
      ++cur.i;
      if (!cur.next_content())
        cur.fail_at(cur.lines.back(), 0,
                    fmt::format("species '{}': file ends after a '&' continuation line", sp.name));
    }
  }

  std::vector<double> c;
  for (int k = 0; k < 3; ++k) {
    ++cur.i;
    if (!cur.next_content())
      cur.fail_at(
          cur.lines.back(), 0,
          fmt::format("species '{}': file ends inside its NASA-7 record (expected line {})", sp.name, k + 2));
    const auto v = coefficients(cur, cur.lines[cur.i], k == 2 ? 4 : 5, k == 2 ? 1 : 0, k + 2, sp.name);
    check_coefficients(cur, cur.lines[cur.i], v, sp.name);
    c.insert(c.end(), v.begin(), v.end());
  }
  ++cur.i;
  std::copy(c.begin(), c.begin() + 7, sp.high.begin());
  std::copy(c.begin() + 7, c.end(), sp.low.begin());
  return sp;
}

}  // namespace vibtherm::nasa_text
