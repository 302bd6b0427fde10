#include "vibtherm/read_nasa.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cctype>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <unordered_map>

#include "nasa_text.hpp"
#include "vibtherm/species_format.hpp"

namespace vibtherm {

using namespace nasa_text;

namespace {

enum class Keyword { none, elements, species, thermo, reactions, end };

// Section keywords of thermo and mechanism files, in any case, abbreviated to at least
// four letters (ELEM, SPEC, THER(M), REAC).
Keyword keyword_of(const std::string& line) {
  const std::string token = upper(first_token(strip_comment(line)));
  if (token == "END") return Keyword::end;
  if (token.size() < 4) return Keyword::none;
  const std::pair<const char*, Keyword> words[] = {{"ELEMENTS", Keyword::elements},
                                                   {"SPECIES", Keyword::species},
                                                   {"THERMO", Keyword::thermo},
                                                   {"REACTIONS", Keyword::reactions}};
  for (const auto& [word, kind] : words)
    if (std::string_view(word).substr(0, token.size()) == token) return kind;
  return Keyword::none;
}

bool has_end_token(const std::string& line) {
  std::istringstream in(upper(strip_comment(line)));
  std::string t;
  while (in >> t)
    if (t == "END") return true;
  return false;
}

class Reader {
 public:
  Reader(const std::string& text, std::string file) : file_(std::move(file)) {
    std::istringstream in(text);
    std::string s;
    int n = 0;
    while (std::getline(in, s)) {
      ++n;
      if (!s.empty() && s.back() == '\r') s.pop_back();
      std::replace(s.begin(), s.end(), '\t', ' ');
      lines_.push_back(Line{n, std::move(s)});
    }
  }

  NasaFile run() {
    Cursor cur{lines_, file_, 0};
    // In a mechanism file only the THERMO section holds records.
    bool mechanism = false;
    for (const auto& l : lines_) {
      const Keyword k = keyword_of(l.text);
      if (k == Keyword::elements || k == Keyword::species || k == Keyword::reactions) mechanism = true;
    }
    bool in_thermo = !mechanism;
    while (cur.next_content()) {
      const Line& line = lines_[cur.i];
      const Keyword k = keyword_of(line.text);
      if (k == Keyword::elements || k == Keyword::species) {
        if (!has_end_token(
                line.text.substr(first_token(line.text).size() + line.text.find_first_not_of(' '))))
          while (++cur.i < lines_.size() && !has_end_token(lines_[cur.i].text)) {
          }
        ++cur.i;
        continue;
      }
      if (k == Keyword::reactions) {
        while (++cur.i < lines_.size() && keyword_of(lines_[cur.i].text) != Keyword::end) {
        }
        ++cur.i;
        continue;
      }
      if (k == Keyword::thermo) {
        ++cur.i;
        in_thermo = true;
        read_default_temperatures(cur);
        continue;
      }
      if (k == Keyword::end || upper(first_token(line.text)).rfind("END", 0) == 0) {
        const std::string key = upper(trim(line.text));
        // END PRODUCTS / END REACTANTS divide the NASA database; they do not end it.
        if (key.find("PRODUCTS") == std::string::npos && key.find("REACTANTS") == std::string::npos)
          in_thermo = false;
        ++cur.i;
        continue;
      }
      if (!in_thermo) {
        ++cur.i;
        continue;
      }
      read_one(cur);
    }
    if (out_.species.empty() && out_.errors.empty())
      fail({file_, 0, 0}, "no NASA-7 or NASA-9 species records found");
    return std::move(out_);
  }

 private:
  std::string file_;
  std::vector<Line> lines_;
  std::optional<double> default_T_mid_K_;
  NasaFile out_;
  std::unordered_map<std::string, std::size_t> seen_;        // name → index in out_.species
  std::unordered_map<std::string, std::vector<int>> again_;  // name → later record lines

  void read_default_temperatures(Cursor& cur) {
    std::size_t j = cur.i;
    Cursor look{lines_, file_, j};
    if (!look.next_content()) return;
    int stop = 0;
    const auto nums = scan_numbers(strip_comment(lines_[look.i].text), 1, stop);
    if (nums.size() < 3 || (stop != 0 && nums.size() == 0)) return;
    if (nums.size() == 3 && stop == 0) default_T_mid_K_ = nums[1].value;
    cur.i = look.i + 1;
  }

  void read_one(Cursor& cur) {
    const std::size_t start = cur.i;
    const Line& line = lines_[start];
    try {
      std::size_t j = start + 1;
      Cursor look{lines_, file_, j};
      if (!look.next_content())
        cur.fail_at(line, 1,
                    "species record '" + first_token(line.text) +
                        "' ends after its first line (expected its coefficient lines)");
      if (is_nasa9_second_record(lines_[look.i].text)) {
        auto sp = read_nasa9_record(cur);
        if (!sp) {
          out_.warnings.push_back(
              fmt::format("{}:{}: species '{}' has no temperature intervals (an "
                          "assigned-enthalpy reactant): skipped",
                          file_, line.number, first_token(line.text)));
          return;
        }
        add(std::move(*sp), line.number);
      } else {
        add(read_nasa7_record(cur, default_T_mid_K_.value_or(default_nasa7_T_mid_K)), line.number);
      }
    } catch (const InputError& e) {
      out_.errors.push_back(e);
      resync(cur, start);
    }
  }

  // After a bad record: on to the next line that can start one (not a numbers line, not
  // numbered 2-4 in column 80, not an '&' continuation), or a keyword.
  void resync(Cursor& cur, std::size_t start) {
    cur.i = start + 1;
    bool after_ampersand = !trim(strip_comment(lines_[start].text)).empty() &&
                           trim(strip_comment(lines_[start].text)).back() == '&';
    for (; cur.i < lines_.size(); ++cur.i) {
      const std::string& s = lines_[cur.i].text;
      if (is_comment_or_blank(s)) continue;
      if (after_ampersand) {
        after_ampersand = !trim(strip_comment(s)).empty() && trim(strip_comment(s)).back() == '&';
        continue;
      }
      if (keyword_of(s) != Keyword::none) return;
      if (s.size() >= 80 && (s[79] == '2' || s[79] == '3' || s[79] == '4')) continue;
      if (starts_with_number(s)) continue;
      // A record's first line is followed by numbers (NASA-7 coefficients, the NASA-9
      // interval count) or announces an '&' continuation.
      const std::string code = strip_comment(s);
      const auto t = trim(code);
      Cursor look{lines_, file_, cur.i + 1};
      if ((!t.empty() && t.back() == '&') || (look.next_content() && starts_with_number(lines_[look.i].text)))
        return;
    }
  }

  void add(NasaPolynomial p, int line) {
    const std::string& name = polynomial_name(p);
    if (auto it = seen_.find(name); it != seen_.end()) {
      auto& later = again_[name];
      if (later.empty()) order_.push_back(name);
      later.push_back(line);
      return;
    }
    seen_.emplace(name, out_.species.size());
    out_.species.push_back(std::move(p));
    out_.lines.push_back(line);
  }

 public:
  std::vector<std::string> order_;  // duplicate names in order of their first repeat

  void duplicate_warnings() {
    for (const auto& name : order_) {
      const auto& later = again_[name];
      std::string at;
      for (std::size_t k = 0; k < later.size(); ++k) at += (k ? ", " : "") + std::to_string(later[k]);
      out_.warnings.push_back(fmt::format(
          "{}:{}: species '{}' is defined more than once (line {}, again at line{} {}): the first "
          "record is used",
          file_, later.front(), name, out_.lines[seen_[name]], later.size() > 1 ? "s" : "", at));
    }
  }

  NasaFile finish() {
    NasaFile f = run();
    out_ = std::move(f);
    duplicate_warnings();
    return std::move(out_);
  }
};

// The first line that is neither blank nor a '#' or '!' comment (1-based; 1 if none).
int first_content_line(const std::string& text) {
  std::istringstream in(text);
  std::string s;
  for (int n = 1; std::getline(in, s); ++n) {
    const std::string_view t = trim(s);
    if (!t.empty() && t[0] != '#' && t[0] != '!') return n;
  }
  return 1;
}

// Thermo text has a THERMO keyword, a number with an exponent (every coefficient field has
// one) or a line of three or more numbers (a record's temperatures).
bool looks_like_thermo_text(const std::string& text) {
  std::istringstream in(text);
  std::string s;
  while (std::getline(in, s)) {
    if (keyword_of(s) == Keyword::thermo) return true;
    for (std::size_t k = 1; k + 1 < s.size(); ++k) {
      const char e = static_cast<char>(s[k] | 0x20);
      if ((e == 'e' || e == 'd') && std::isdigit(static_cast<unsigned char>(s[k - 1])) &&
          (std::isdigit(static_cast<unsigned char>(s[k + 1])) || s[k + 1] == '+' || s[k + 1] == '-'))
        return true;
    }
    std::istringstream words(s);
    std::string w;
    int numbers = 0;
    while (words >> w)
      if (to_number(w)) ++numbers;
    if (numbers >= 3) return true;
  }
  return false;
}

// A text of which no record could be read is often not thermo text at all: say so in one
// line instead of reporting its first line as a broken record. A species file is named as
// one (species_format.hpp); other text without any sign of NASA records is refused as such.
void refuse_if_not_thermo_text(const std::string& text, const std::string& file_name) {
  const SourceLocation where{file_name, first_content_line(text), 1};
  std::string species_kind;
  try {
    species_kind = std::string(species_format_name(detect_species_format(text, file_name)));
  } catch (const InputError&) {
    // Not a species file (or recognised as NASA text): decided below.
  }
  if (!species_kind.empty())
    fail(where, fmt::format("this is a species file ({}), not a NASA polynomial file: 'vibtherm eval' reads "
                            "NASA-7/NASA-9 thermo text; species files go to table, fit or report",
                            species_kind));
  if (!looks_like_thermo_text(text))
    fail(where,
         "not a NASA polynomial file: no THERMO keyword, no number with an exponent (such as "
         "3.29812431E+00) and no line of numbers, expected NASA-7 or NASA-9 thermo text");
}

}  // namespace

NasaFile read_nasa_records(const std::string& text, const std::string& file_name) {
  NasaFile f = Reader(text, file_name).finish();
  if (f.species.empty() && !f.errors.empty()) refuse_if_not_thermo_text(text, file_name);
  return f;
}

NasaFile read_nasa_records_file(const std::string& path) {
  namespace fs = std::filesystem;
  std::error_code ec;
  const fs::file_status status = fs::status(path, ec);
  if (fs::is_directory(status)) fail({path, 0, 0}, "is a directory, expected a NASA polynomial file");
  if (fs::exists(status) && !fs::is_regular_file(status))
    fail({path, 0, 0}, "is not a regular file (a device, FIFO or socket), expected a NASA polynomial file");
  std::ifstream in(path, std::ios::binary);
  if (!in) fail({path, 0, 0}, "cannot open the file for reading");
  const auto size = fs::file_size(path, ec);
  if (!ec && size > max_nasa_file_bytes)
    fail({path, 0, 0}, fmt::format("file has {} bytes, more than the {} MiB a NASA polynomial file may have",
                                   size, max_nasa_file_bytes >> 20));
  std::ostringstream ss;
  ss << in.rdbuf();
  return read_nasa_records(ss.str(), path);
}

std::vector<NasaPolynomial> read_nasa(const std::string& text, const std::string& file_name) {
  NasaFile f = read_nasa_records(text, file_name);
  if (!f.errors.empty()) throw f.errors.front();
  return std::move(f.species);
}

std::vector<NasaPolynomial> read_nasa_file(const std::string& path) {
  NasaFile f = read_nasa_records_file(path);
  if (!f.errors.empty()) throw f.errors.front();
  return std::move(f.species);
}

}  // namespace vibtherm
