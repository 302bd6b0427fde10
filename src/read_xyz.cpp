// The XYZ-plus-frequencies species reader; the format is described in read_xyz.hpp.
#include "vibtherm/read_xyz.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <charconv>
#include <cstdint>
#include <filesystem>
#include <set>

#include "vibtherm/read_species.hpp"
#include "vibtherm/species_builder.hpp"
#include "vibtherm/spelling.hpp"
#include "vibtherm/units.hpp"

namespace vibtherm {
namespace {

struct Token {
  std::string_view text;
  int column;  // 1-based
};

// Splits a line into tokens at blanks (and commas when `commas`), dropping a `#` comment;
// at most `max_tokens` of them (a line of millions of numbers stops there).
std::vector<Token> tokenize(std::string_view line, bool commas, std::size_t max_tokens = SIZE_MAX) {
  std::vector<Token> tokens;
  std::size_t i = 0;
  auto separator = [&](char c) { return c == ' ' || c == '\t' || c == '\r' || (commas && c == ','); };
  while (i < line.size() && tokens.size() < max_tokens) {
    if (line[i] == '#') break;
    if (separator(line[i])) {
      ++i;
      continue;
    }
    std::size_t start = i;
    while (i < line.size() && !separator(line[i]) && line[i] != '#') ++i;
    tokens.push_back({line.substr(start, i - start), static_cast<int>(start) + 1});
  }
  return tokens;
}

constexpr std::size_t max_xyz_lines = 100000;

const std::vector<std::string> xyz_keys = {
    "name", "symmetry_number", "spin_multiplicity", "enthalpy_of_formation", "phase", "transition_state"};

class XyzReader {
 public:
  explicit XyzReader(const std::string& file_name) : file_(file_name) {}
  Species read(const std::string& text);

 private:
  [[noreturn]] void error(int line, int column, const std::string& message) const {
    fail({file_, line, column}, message);
  }
  void read_comment_line(std::string_view line, int line_number, Species& species) const;
  double number(const Token& token, int line, const std::string& what) const {
    std::optional<double> value = parse_number(token.text);
    if (!value) error(line, token.column, what + " is " + quote(token.text) + ", expected a number");
    return *value;
  }

  std::string file_;
};

void XyzReader::read_comment_line(std::string_view line, int line_number, Species& species) const {
  if (line.find('=') == std::string_view::npos) return;  // free text
  std::size_t i = 0;
  std::set<std::string> seen;
  while (i < line.size()) {
    if (line[i] == ' ' || line[i] == '\t' || line[i] == '\r') {
      ++i;
      continue;
    }
    int column = static_cast<int>(i) + 1;
    std::size_t equals = line.find('=', i);
    std::size_t blank = line.find_first_of(" \t\r", i);
    if (equals == std::string_view::npos || (blank != std::string_view::npos && blank < equals))
      error(line_number, column,
            "comment line token " +
                quote(line.substr(i, blank == std::string_view::npos ? line.npos : blank - i)) +
                " is not key=value, expected only key=value pairs on a comment line that has any");
    std::string key(line.substr(i, equals - i));
    std::size_t value_start = equals + 1;
    std::string value;
    int value_column = static_cast<int>(value_start) + 1;
    if (value_start < line.size() && line[value_start] == '"') {
      std::size_t close = line.find('"', value_start + 1);
      if (close == std::string_view::npos)
        error(line_number, value_column, "unterminated \" in value of " + quote(key));
      value = std::string(line.substr(value_start + 1, close - value_start - 1));
      i = close + 1;
    } else {
      std::size_t end = line.find_first_of(" \t\r", value_start);
      if (end == std::string_view::npos) end = line.size();
      value = std::string(line.substr(value_start, end - value_start));
      i = end;
    }
    if (std::find(xyz_keys.begin(), xyz_keys.end(), key) == xyz_keys.end()) {
      std::string suggestion = closest_word(key, xyz_keys);
      error(line_number, column,
            "unknown key " + quote(key) + " on the comment line" +
                (suggestion.empty() ? ", expected one of " + join(xyz_keys)
                                    : ", did you mean '" + suggestion + "'?"));
    }
    if (!seen.insert(key).second)
      error(line_number, column, "duplicate key " + quote(key) + ", expected each key once");
    if (value.empty()) error(line_number, value_column, "key " + quote(key) + " has no value");
    auto positive_integer = [&]() {
      int v = 0;
      auto [end, ec] = std::from_chars(value.data(), value.data() + value.size(), v);
      if (ec != std::errc() || end != value.data() + value.size() || v <= 0)
        error(line_number, value_column,
              quote(key) + " is " + quote(value) + ", expected a positive whole number");
      return v;
    };
    if (key == "name") {
      for (char c : value)
        if (static_cast<unsigned char>(c) < 0x20 || c == 0x7f)
          error(line_number, value_column, "'name' contains a control character, expected a one-line label");
      species.name = value;
    } else if (key == "symmetry_number") {
      species.symmetry_number = positive_integer();
    } else if (key == "spin_multiplicity") {
      species.electronic_levels = {{0.0, positive_integer()}};
      species.key_locations["spin_multiplicity"] = {file_, line_number, value_column};
    } else if (key == "enthalpy_of_formation") {
      std::optional<double> v = parse_number(value);
      if (!v)
        error(line_number, value_column,
              quote(key) + " is " + quote(value) + ", expected a number in kJ/mol");
      species.enthalpy_of_formation_J_per_mol = *v * 1e3;
    } else if (key == "phase") {
      if (value == "gas")
        species.phase = Phase::gas;
      else if (value == "adsorbate")
        species.phase = Phase::adsorbate;
      else
        error(line_number, value_column, "'phase' is " + quote(value) + ", expected gas or adsorbate");
    } else {  // transition_state
      if (value == "true")
        species.transition_state = true;
      else if (value == "false")
        species.transition_state = false;
      else
        error(line_number, value_column,
              "'transition_state' is " + quote(value) + ", expected true or false");
    }
  }
}

Species XyzReader::read(const std::string& text) {
  require_text(text, file_);
  std::vector<std::string_view> lines;
  std::string_view rest(text);
  // A UTF-8 byte-order mark, as some Windows editors write, is not part of the count line.
  if (rest.starts_with("\xEF\xBB\xBF")) rest.remove_prefix(3);
  while (!rest.empty()) {
    std::size_t newline = rest.find('\n');
    // 2,000 atom lines and 6,000 frequencies leave a real file far below this; 32 MiB of
    // blank lines once held 600 MB of line views.
    if (lines.size() >= max_xyz_lines)
      fail({file_, static_cast<int>(lines.size()) + 1, 1},
           fmt::format("file has more than {} lines, expected an XYZ species file (2,000 atoms at most)",
                       max_xyz_lines));
    lines.push_back(rest.substr(0, newline));
    if (newline == std::string_view::npos) break;
    rest.remove_prefix(newline + 1);
  }
  std::size_t index = 0;
  auto line_number = [&](std::size_t i) { return static_cast<int>(i) + 1; };
  // Leading blank and comment lines.
  while (index < lines.size() && tokenize(lines[index], false).empty()) ++index;
  if (index == lines.size())
    fail({file_, 0, 0}, "file holds no species, expected an XYZ block: atom count, comment line, atom lines");

  std::vector<Token> count_tokens = tokenize(lines[index], false);
  int count_line = line_number(index);
  if (count_tokens.size() != 1)
    error(count_line, count_tokens[1].column,
          "extra text after the atom count, expected only the number of atoms");
  int atom_count = 0;
  {
    std::string_view t = count_tokens[0].text;
    auto [end, ec] = std::from_chars(t.data(), t.data() + t.size(), atom_count);
    if (ec != std::errc() || end != t.data() + t.size() || atom_count <= 0 || atom_count > 100000)
      error(count_line, count_tokens[0].column,
            "atom count is " + quote(t) + ", expected a positive whole number (first line of an XYZ file)");
  }
  ++index;
  if (index == lines.size()) error(count_line, 1, "file ends after the atom count, expected a comment line");

  Species species;
  species.origin = {file_, count_line, 1};
  species.name = std::filesystem::path(file_).stem().string();
  read_comment_line(lines[index], line_number(index), species);
  if (species.name.empty()) species.name = "species";
  ++index;

  std::vector<SourceLocation> where;
  for (int a = 0; a < atom_count; ++a, ++index) {
    if (index >= lines.size())
      error(line_number(std::min(index, lines.size()) - 1), 1,
            "file ends after " + std::to_string(a) + " atom line(s), expected " + std::to_string(atom_count) +
                " (the atom count)");
    int ln = line_number(index);
    std::vector<Token> tokens = tokenize(lines[index], false);
    std::string which = "atom " + std::to_string(a + 1);
    if (tokens.size() != 4)
      error(ln, tokens.empty() ? 1 : tokens.front().column,
            which + " line has " + std::to_string(tokens.size()) +
                " field(s), expected: symbol x y z (ångström)");
    Atom atom = atom_of(resolve_label(tokens[0].text, {file_, ln, tokens[0].column}));
    for (int k = 0; k < 3; ++k)
      atom.position_angstrom[k] = number(tokens[static_cast<std::size_t>(k) + 1], ln,
                                         which + " coordinate " + std::string(1, "xyz"[k]));
    where.push_back({file_, ln, tokens[0].column});
    species.atoms.push_back(std::move(atom));
  }
  check_atoms_apart(species.atoms, where);
  species.formula = formula_of(species.atoms);

  // Frequency section.
  while (index < lines.size() && tokenize(lines[index], false).empty()) ++index;
  if (index == lines.size()) {
    if (atom_count > 1)
      error(line_number(lines.size() - 1), 1,
            "missing 'frequencies' section after the atoms, expected a line 'frequencies' and the "
            "wavenumbers in cm^-1");
    return species;
  }
  std::vector<Token> header = tokenize(lines[index], false);
  int header_line = line_number(index);
  if (header[0].text != "frequencies")
    error(header_line, header[0].column,
          "found " + quote(header[0].text) + " after the " + std::to_string(atom_count) +
              " atom line(s), expected a line 'frequencies' (is the atom count right?)");
  std::string unit = "cm^-1";
  if (header.size() > 2)
    error(header_line, header[2].column,
          "extra text after the frequency unit, expected 'frequencies [unit]'");
  if (header.size() == 2) {
    unit = std::string(header[1].text);
    if (!to_wavenumber_cm1(1.0, unit))
      error(header_line, header[1].column,
            "unknown wavenumber unit " + quote(unit) + ", expected one of " + wavenumber_units_list());
  }
  for (++index; index < lines.size(); ++index) {
    int ln = line_number(index);
    // One token more than the limit allows, so that the error below can point at it.
    const std::size_t room = max_species_frequencies + 1 - species.frequencies_cm1.size();
    for (const Token& token : tokenize(lines[index], true, room)) {
      double value = number(token, ln, "frequency");
      if (value == 0.0)
        error(ln, token.column, "frequency is 0, expected a non-zero wavenumber (negative for imaginary)");
      if (species.frequencies_cm1.size() >= max_species_frequencies)
        error(
            ln, token.column,
            fmt::format("more than {} frequencies, more than this version accepts", max_species_frequencies));
      species.frequencies_cm1.push_back(*to_wavenumber_cm1(value, unit));
    }
  }
  return species;
}

}  // namespace

Species read_species_xyz(const std::string& text, const std::string& file_name) {
  return XyzReader(file_name).read(text);
}

}  // namespace vibtherm
