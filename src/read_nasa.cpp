#include "vibtherm/read_nasa.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cctype>
#include <charconv>
#include <cmath>
#include <fstream>
#include <optional>
#include <sstream>

#include "vibtherm/error.hpp"

namespace vibtherm {

namespace {

struct Line {
  int number = 0;  // 1-based
  std::string text;
};

struct Number {
  double value = 0.0;
  int column = 0;         // 1-based column of its first character
  bool integral = false;  // written without '.', exponent or sign-less digits only
};

std::string_view trim(std::string_view s) {
  while (!s.empty() && std::isspace(static_cast<unsigned char>(s.front()))) s.remove_prefix(1);
  while (!s.empty() && std::isspace(static_cast<unsigned char>(s.back()))) s.remove_suffix(1);
  return s;
}

std::string upper(std::string_view s) {
  std::string out(s);
  for (char& c : out) c = static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
  return out;
}

std::optional<double> to_number(std::string_view s) {
  s = trim(s);
  if (s.empty()) return std::nullopt;
  std::string t(s);
  std::replace(t.begin(), t.end(), 'D', 'E');
  std::replace(t.begin(), t.end(), 'd', 'e');
  if (t.front() == '+') t.erase(0, 1);
  double v = 0.0;
  auto [ptr, ec] = std::from_chars(t.data(), t.data() + t.size(), v);
  if (ec != std::errc() || ptr != t.data() + t.size() || !std::isfinite(v)) return std::nullopt;
  return v;
}

// Reads consecutive numbers, glued or spaced ("1.0E+00-2.0E+00" is two). Stops at the
// first character that cannot start a number; `stop_column` is its 1-based column (0 at
// the end of the text).
std::vector<Number> scan_numbers(std::string_view text, int first_column, int& stop_column) {
  std::string t(text);
  std::replace(t.begin(), t.end(), 'D', 'E');
  std::replace(t.begin(), t.end(), 'd', 'e');
  std::vector<Number> out;
  std::size_t p = 0;
  stop_column = 0;
  while (true) {
    while (p < t.size() && std::isspace(static_cast<unsigned char>(t[p]))) ++p;
    if (p >= t.size()) return out;
    std::size_t start = p;
    if (t[p] == '+') ++p;
    double v = 0.0;
    auto [ptr, ec] = std::from_chars(t.data() + p, t.data() + t.size(), v);
    if (ec != std::errc() || (p > start && t[p] == '-') || !std::isfinite(v)) {  // nan/inf: not numbers
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

std::string column_text(const std::string& s, int first, int last) {  // 1-based, inclusive
  if (static_cast<int>(s.size()) < first) return {};
  return s.substr(first - 1, last - first + 1);
}

class Parser {
 public:
  Parser(const std::string& text, std::string file) : file_(std::move(file)) {
    std::istringstream in(text);
    std::string s;
    int n = 0;
    while (std::getline(in, s)) {
      ++n;
      if (!s.empty() && s.back() == '\r') s.pop_back();
      std::replace(s.begin(), s.end(), '\t', ' ');
      lines_.push_back(Line{n, s});
    }
  }

  std::vector<NasaPolynomial> run() {
    std::vector<NasaPolynomial> out;
    std::size_t i = 0;
    while (next_content(i)) {
      const Line& line = lines_[i];
      const std::string key = upper(trim(line.text));
      if (key.rfind("THERMO", 0) == 0) {
        ++i;
        read_default_temperatures(i);
        continue;
      }
      if (key.rfind("END", 0) == 0) {
        if (key.find("PRODUCTS") != std::string::npos) {
          ++i;
          continue;
        }
        break;
      }
      std::size_t j = i + 1;
      if (!next_content(j))
        fail_at(line, 1,
                "species record '" + first_token(line.text) +
                    "' ends after its first line (expected its coefficient lines)");
      if (is_nasa9_second_record(lines_[j].text))
        out.emplace_back(read_nasa9(i));
      else
        out.emplace_back(read_nasa7(i));
    }
    if (out.empty()) fail({file_, 0, 0}, "no NASA-7 or NASA-9 species records found");
    return out;
  }

 private:
  std::string file_;
  std::vector<Line> lines_;
  std::optional<double> default_T_mid_K_;

  [[noreturn]] void fail_at(const Line& line, int column, const std::string& message) const {
    fail({file_, line.number, column}, message);
  }

  static bool is_comment_or_blank(const std::string& s) {
    const auto t = trim(s);
    return t.empty() || t.front() == '!';
  }

  // Advances i to the next line with content; false at the end of the text.
  bool next_content(std::size_t& i) const {
    while (i < lines_.size() && is_comment_or_blank(lines_[i].text)) ++i;
    return i < lines_.size();
  }

  static std::string first_token(const std::string& s) {
    const auto t = trim(s);
    return std::string(t.substr(0, t.find(' ')));
  }

  static std::string strip_comment(const std::string& s) {
    const auto bang = s.find('!');
    return bang == std::string::npos ? s : s.substr(0, bang);
  }

  // The line after THERMO (NASA-7: T_low T_mid T_high) or thermo (NASA-9: breakpoints and
  // a date); consumed only if it starts with numbers.
  void read_default_temperatures(std::size_t& i) {
    std::size_t j = i;
    if (!next_content(j)) return;
    int stop = 0;
    const auto nums = scan_numbers(lines_[j].text, 1, stop);
    if (nums.size() < 3) return;
    if (nums.size() == 3 && stop == 0) default_T_mid_K_ = nums[1].value;
    i = j + 1;
  }

  static bool is_nasa9_second_record(const std::string& s) {
    const auto t = trim(s);
    const auto token = t.substr(0, t.find(' '));
    return !token.empty() && token.size() <= 2 && std::all_of(token.begin(), token.end(), [](char c) {
      return std::isdigit(static_cast<unsigned char>(c));
    });
  }

  // Coefficients of one line: `expected` numbers, optionally followed by the line number.
  std::vector<double> coefficients(const Line& line, std::size_t expected, int line_number,
                                   const std::string& name) const {
    std::string text = strip_comment(line.text);
    // The fixed-column line number (column 80) is not a coefficient.
    if (text.size() >= 80 && std::isdigit(static_cast<unsigned char>(text[79])) && text[78] == ' ')
      text.resize(79);
    int stop = 0;
    auto nums = scan_numbers(text, 1, stop);
    if (stop != 0)
      fail_at(line, stop,
              fmt::format("species '{}': unreadable coefficient on line {} of its record "
                          "(expected {} numbers in E15.8 fields)",
                          name, line_number, expected));
    // A free-format line number: a bare integer equal to the line's place in the record
    // (coefficients are always written with a point or an exponent).
    if (!nums.empty() && nums.back().integral && nums.back().value == line_number) nums.pop_back();
    if (nums.size() != expected)
      fail_at(line, 1,
              fmt::format("species '{}': line {} of its record has {} numbers, expected {} coefficients",
                          name, line_number, nums.size(), expected));
    std::vector<double> out;
    for (const auto& n : nums) out.push_back(n.value);
    return out;
  }

  static std::vector<ElementAmount> composition_fields(const std::string& s, int first, int count,
                                                       int sym_width, int num_width) {
    std::vector<ElementAmount> out;
    const int w = sym_width + num_width;
    for (int k = 0; k < count; ++k) {
      const int c = first + k * w;
      const std::string sym_column = column_text(s, c, c + sym_width - 1);
      const auto sym = trim(sym_column);
      const auto num = to_number(column_text(s, c + sym_width, c + w - 1));
      if (sym.empty()) continue;
      if (!num || !std::isalpha(static_cast<unsigned char>(sym.front()))) return {};  // not fixed-column
      if (*num != 0.0) out.push_back({std::string(sym), *num});
    }
    return out;
  }

  Nasa7 read_nasa7(std::size_t& i) {
    const Line& l1 = lines_[i];
    Nasa7 sp;
    std::string text = l1.text;
    if (auto bang = text.find('!'); bang != std::string::npos && bang > 0) text.resize(bang);
    sp.name = first_token(text);
    // Columns 19-24 hold the note only when the name keeps to columns 1-18.
    if (sp.name.size() <= 18 && text.rfind(sp.name, 0) == 0) {
      sp.note = std::string(trim(column_text(text, 19, 24)));
      if (sp.note.find(' ') != std::string::npos) sp.note.clear();
    }

    std::optional<double> lo, hi, mid;
    bool fixed = false;
    if (text.size() >= 55 && std::isalpha(static_cast<unsigned char>(text[44]))) {
      const auto a = to_number(column_text(text, 46, 55));
      const auto b = to_number(column_text(text, 56, 65));
      // The pinned layout puts T_mid in columns 66-73; circulated files often write it as
      // F10.3 reaching column 75, so everything up to column 79 is read.
      const std::string mid_column = column_text(text, 66, 79);
      const auto mid_text = trim(mid_column);
      const auto c = to_number(mid_text);
      if (a && b && (mid_text.empty() || c)) {
        fixed = true;
        sp.phase = static_cast<char>(std::toupper(static_cast<unsigned char>(text[44])));
        lo = a;
        hi = b;
        mid = c;
        sp.composition = composition_fields(text, 25, 4, 2, 3);
      }
    }
    if (!fixed) {
      // Free-spaced line: the temperatures follow the last token that is a phase letter.
      std::size_t pos = std::string::npos;
      for (std::size_t k = sp.name.size() + (text.find(sp.name)); k < text.size(); ++k) {
        const char c = static_cast<char>(std::toupper(static_cast<unsigned char>(text[k])));
        const bool token_start = k == 0 || std::isspace(static_cast<unsigned char>(text[k - 1])) ||
                                 std::isdigit(static_cast<unsigned char>(text[k - 1]));
        const char next = k + 1 < text.size() ? text[k + 1] : ' ';
        if (token_start && (c == 'G' || c == 'L' || c == 'S' || c == 'C') &&
            (std::isspace(static_cast<unsigned char>(next)) ||
             std::isdigit(static_cast<unsigned char>(next))))
          pos = k;
      }
      if (pos == std::string::npos)
        fail_at(
            l1, 45,
            fmt::format("species '{}': expected the phase (G, L or S) in column 45 followed by T_low, T_high "
                        "and T_mid",
                        sp.name));
      sp.phase = static_cast<char>(std::toupper(static_cast<unsigned char>(text[pos])));
      int stop = 0;
      auto nums = scan_numbers(std::string_view(text).substr(pos + 1), static_cast<int>(pos) + 2, stop);
      if (stop != 0)
        fail_at(l1, stop,
                fmt::format("species '{}': unreadable temperature after the phase letter", sp.name));
      if (nums.size() >= 3 && nums.back().integral && nums.back().value == 1.0) nums.pop_back();
      if (nums.size() < 2 || nums.size() > 3)
        fail_at(l1, static_cast<int>(pos) + 2,
                fmt::format("species '{}': expected T_low T_high [T_mid] after the phase, found {} numbers",
                            sp.name, nums.size()));
      lo = nums[0].value;
      hi = nums[1].value;
      if (nums.size() == 3) mid = nums[2].value;
    }
    sp.T_low_K = *lo;
    sp.T_high_K = *hi;
    sp.T_mid_K = mid ? *mid : default_T_mid_K_.value_or(default_nasa7_T_mid_K);
    if (!(sp.T_low_K > 0 && sp.T_low_K <= sp.T_mid_K && sp.T_mid_K <= sp.T_high_K))
      fail_at(l1, 46,
              fmt::format("species '{}': temperatures T_low {:g}, T_mid {:g}, T_high {:g} K are not "
                          "positive and ascending",
                          sp.name, sp.T_low_K, sp.T_mid_K, sp.T_high_K));

    std::vector<double> c;
    const std::size_t expected[] = {5, 5, 4};
    for (int k = 0; k < 3; ++k) {
      ++i;
      if (!next_content(i))
        fail_at(lines_.back(), 0,
                fmt::format("species '{}': file ends inside its NASA-7 record (expected line {})", sp.name,
                            k + 2));
      const auto v = coefficients(lines_[i], expected[k], k + 2, sp.name);
      c.insert(c.end(), v.begin(), v.end());
    }
    ++i;
    std::copy(c.begin(), c.begin() + 7, sp.high.begin());
    std::copy(c.begin() + 7, c.end(), sp.low.begin());
    return sp;
  }

  Nasa9 read_nasa9(std::size_t& i) {
    const Line& r1 = lines_[i];
    Nasa9 sp;
    sp.name = first_token(r1.text);
    sp.comment = std::string(trim(column_text(r1.text, 19, 80)));
    ++i;
    next_content(i);
    const Line& r2 = lines_[i];
    const int nranges = static_cast<int>(
        to_number(column_text(r2.text, 1, 2)).value_or(to_number(first_token(r2.text)).value_or(0)));
    if (nranges < 1 || nranges > 9)
      fail_at(r2, 1,
              fmt::format("species '{}': expected the number of temperature intervals (1-9) in columns 1-2",
                          sp.name));
    sp.date_code = std::string(trim(column_text(r2.text, 4, 9)));
    sp.composition = composition_fields(r2.text, 11, 5, 2, 6);
    const auto phase = to_number(column_text(r2.text, 51, 52));
    const auto mw = to_number(column_text(r2.text, 53, 65));
    const auto hf = to_number(column_text(r2.text, 66, 80));
    if (!phase || !mw || !hf)
      fail_at(r2, 51,
              fmt::format("species '{}': expected phase (cols 51-52), molecular weight (53-65) and "
                          "enthalpy of formation (66-80)",
                          sp.name));
    sp.phase = static_cast<int>(*phase);
    sp.molar_mass_g_per_mol = *mw;
    sp.enthalpy_of_formation_J_per_mol = *hf;
    for (int r = 0; r < nranges; ++r) {
      ++i;
      if (!next_content(i))
        fail_at(lines_.back(), 0,
                fmt::format("species '{}': file ends inside its NASA-9 record (interval {} of {})", sp.name,
                            r + 1, nranges));
      const Line& tl = lines_[i];
      int stop = 0;
      const auto nums = scan_numbers(strip_comment(tl.text), 1, stop);
      if (stop != 0 || nums.size() < 10)
        fail_at(
            tl, stop ? stop : 1,
            fmt::format("species '{}': expected T_low, T_high, the coefficient count and the T exponents of "
                        "interval {}",
                        sp.name, r + 1));
      Nasa9Range range;
      range.T_low_K = nums[0].value;
      range.T_high_K = nums[1].value;
      if (nums[2].value != 7)
        fail_at(tl, nums[2].column,
                fmt::format("species '{}': interval {} has {} coefficients; only 7 are supported", sp.name,
                            r + 1, nums[2].value));
      for (int k = 0; k < 7; ++k)
        if (nums[3 + k].value != k - 2)
          fail_at(tl, nums[3 + k].column,
                  fmt::format("species '{}': interval {}: T exponents must be -2 -1 0 1 2 3 4, found {:g} at "
                              "position {}",
                              sp.name, r + 1, nums[3 + k].value, k + 1));
      if (r == 0 && nums.size() >= 11) {
        const auto h = tl.text.size() >= 80 ? to_number(column_text(tl.text, 66, 80)) : std::nullopt;
        sp.H298_minus_H0_J_per_mol = h ? *h : nums.back().value;
      }
      ++i;
      if (!next_content(i))
        fail_at(lines_.back(), 0, fmt::format("species '{}': file ends inside its record", sp.name));
      const auto a = coefficients(lines_[i], 5, 0, sp.name);
      ++i;
      if (!next_content(i))
        fail_at(lines_.back(), 0, fmt::format("species '{}': file ends inside its record", sp.name));
      const Line& bl = lines_[i];
      auto b = scan_numbers(strip_comment(bl.text), 1, stop);
      if (stop != 0 || (b.size() != 4 && b.size() != 5))
        fail_at(
            bl, stop ? stop : 1,
            fmt::format("species '{}': interval {}: expected a6, a7, b1, b2 (D16.9, columns 1-32 and 49-80)",
                        sp.name, r + 1));
      if (b.size() == 5) b.erase(b.begin() + 2);  // the unused field written as a number
      std::copy(a.begin(), a.end(), range.a.begin());
      range.a[5] = b[0].value;
      range.a[6] = b[1].value;
      range.b1 = b[2].value;
      range.b2 = b[3].value;
      if (!(range.T_low_K > 0 && range.T_high_K > range.T_low_K) ||
          (!sp.ranges.empty() && std::abs(range.T_low_K - sp.ranges.back().T_high_K) > 1e-6))
        fail_at(tl, 1,
                fmt::format("species '{}': interval {} ({:g}-{:g} K) is not ascending and contiguous",
                            sp.name, r + 1, range.T_low_K, range.T_high_K));
      sp.ranges.push_back(range);
    }
    ++i;
    return sp;
  }
};

}  // namespace

std::vector<NasaPolynomial> read_nasa(const std::string& text, const std::string& file_name) {
  return Parser(text, file_name).run();
}

std::vector<NasaPolynomial> read_nasa_file(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  if (!in) fail({path, 0, 0}, "cannot open the file for reading");
  std::ostringstream ss;
  ss << in.rdbuf();
  return read_nasa(ss.str(), path);
}

}  // namespace vibtherm
