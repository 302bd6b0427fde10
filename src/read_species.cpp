// Species readers. They check form and units and convert to the Species model; physics
// checks (mode counts, rotor type) belong to the engine.
#include "vibtherm/read_species.hpp"

#include <fmt/format.h>
#include <yaml-cpp/eventhandler.h>
#include <yaml-cpp/yaml.h>

#include <algorithm>
#include <charconv>
#include <cmath>
#include <filesystem>
#include <fstream>
#include <set>
#include <sstream>

#include "vibtherm/constants.hpp"
#include "vibtherm/elements.hpp"
#include "vibtherm/hindered_rotor.hpp"
#include "vibtherm/spelling.hpp"
#include "vibtherm/units.hpp"

namespace vibtherm {
namespace {

namespace fs = std::filesystem;

// ---------------------------------------------------------------------------------------
// Shared helpers

std::string quote(std::string_view text) {
  constexpr std::size_t max_shown = 40;
  std::string shown;
  for (char c : text.substr(0, max_shown)) {
    // Keep the one-line promise even when the offending text holds control characters.
    if (static_cast<unsigned char>(c) < 0x20 || c == 0x7f)
      shown += '?';
    else
      shown += c;
  }
  if (text.size() > max_shown) shown += "...";
  return "'" + shown + "'";
}

std::string join(const std::vector<std::string>& words) {
  std::string out;
  for (const std::string& w : words) out += (out.empty() ? "" : ", ") + w;
  return out;
}

// Returns the 1-based line and column of the first NUL byte or invalid UTF-8 sequence,
// or {0, 0} when the text is clean.
std::pair<int, int> find_binary_content(const std::string& text) {
  int line = 1;
  int column = 1;
  for (std::size_t i = 0; i < text.size();) {
    auto byte = static_cast<unsigned char>(text[i]);
    std::size_t length = 0;
    if (byte == 0) return {line, column};
    if (byte < 0x80) {
      length = 1;
    } else if (byte >= 0xC2 && byte <= 0xDF) {
      length = 2;
    } else if (byte >= 0xE0 && byte <= 0xEF) {
      length = 3;
    } else if (byte >= 0xF0 && byte <= 0xF4) {
      length = 4;
    } else {
      return {line, column};
    }
    if (i + length > text.size()) return {line, column};
    for (std::size_t k = 1; k < length; ++k)
      if ((static_cast<unsigned char>(text[i + k]) & 0xC0) != 0x80) return {line, column};
    // Overlong 3- and 4-byte forms, UTF-16 surrogates and code points above U+10FFFF
    // (Unicode 15, table 3-7 "well-formed UTF-8 byte sequences").
    auto second = static_cast<unsigned char>(length > 1 ? text[i + 1] : 0);
    if ((byte == 0xE0 && second < 0xA0) || (byte == 0xED && second > 0x9F) ||
        (byte == 0xF0 && second < 0x90) || (byte == 0xF4 && second > 0x8F))
      return {line, column};
    if (byte == '\n') {
      ++line;
      column = 1;
    } else {
      ++column;
    }
    i += length;
  }
  return {0, 0};
}

void require_text(const std::string& text, const std::string& file_name) {
  auto [line, column] = find_binary_content(text);
  if (line > 0)
    fail({file_name, line, column},
         "not a text file (NUL byte or invalid UTF-8), expected a UTF-8 species description");
}

struct AtomLabel {
  std::string symbol;
  std::string isotope;  // the label when it names a specific isotope
  int mass_number = 0;
  double mass_amu = 0.0;
};

// An atom of that element and isotope, placed at the origin; both readers set the position.
Atom atom_of(const AtomLabel& label) {
  Atom atom;
  atom.symbol = label.symbol;
  atom.isotope = label.isotope;
  atom.mass_number = label.mass_number;
  atom.mass_amu = label.mass_amu;
  return atom;
}

// Resolves an element symbol or isotope label, or says what went wrong.
AtomLabel resolve_label(std::string_view label, const SourceLocation& where) {
  if (std::optional<IsotopeChoice> iso = find_isotope(label)) {
    AtomLabel out{iso->symbol, "", iso->mass_number, iso->mass_amu};
    if (label != iso->symbol) out.isotope = std::string(label);
    return out;
  }
  std::size_t digits = label.find_first_of("0123456789");
  std::string_view symbol = label.substr(0, digits);
  if (digits != std::string_view::npos && find_element(symbol))
    fail(where,
         "unknown isotope " + quote(label) + ", expected one of " + join(known_isotope_labels(symbol)));
  std::string suggestion = closest_element_symbol(symbol.empty() ? label : symbol);
  std::string message = "unknown element symbol " + quote(label);
  if (!suggestion.empty())
    message += ", did you mean '" + suggestion + "'?";
  else
    message += ", expected an element symbol such as C or Cl, or an isotope label such as D or C13";
  fail(where, message);
}

// Parses "CH4", "C2H5OH" into element counts; repeated elements add up.
std::map<std::string, int> parse_formula_text(std::string_view text, const SourceLocation& where) {
  std::map<std::string, int> counts;
  std::size_t i = 0;
  if (text.empty()) fail(where, "empty formula, expected element symbols with counts such as CH4");
  while (i < text.size()) {
    if (!std::isupper(static_cast<unsigned char>(text[i])))
      fail(where, "cannot read formula " + quote(text) + " at " + quote(text.substr(i, 1)) +
                      ", expected element symbols with counts such as CH4 or C2H5OH");
    std::size_t start = i++;
    while (i < text.size() && std::islower(static_cast<unsigned char>(text[i]))) ++i;
    std::string symbol(text.substr(start, i - start));
    if (!find_element(symbol)) {
      std::string suggestion = closest_element_symbol(symbol);
      fail(where, "unknown element " + quote(symbol) + " in formula " + quote(text) +
                      (suggestion.empty() ? ", expected element symbols such as C, H, O"
                                          : ", did you mean '" + suggestion + "'?"));
    }
    int count = 1;
    std::size_t digits_start = i;
    while (i < text.size() && std::isdigit(static_cast<unsigned char>(text[i]))) ++i;
    if (i > digits_start) {
      auto [end, ec] = std::from_chars(text.data() + digits_start, text.data() + i, count);
      if (ec != std::errc() || count <= 0 || count > 100000)
        fail(where, "bad count in formula " + quote(text) + ", expected a positive whole number");
    }
    counts[symbol] += count;
    if (counts[symbol] > 100000) fail(where, "formula " + quote(text) + " has too many atoms");
  }
  return counts;
}

std::string formula_text(const std::map<std::string, int>& formula) {
  std::string out;
  for (const auto& [symbol, count] : formula) out += symbol + (count > 1 ? std::to_string(count) : "");
  return out;
}

// Atoms closer than this (Å) are a copy-and-paste slip, not a molecule.
constexpr double coincident_atoms_angstrom = 1e-3;

void check_atoms_apart(const std::vector<Atom>& atoms, const std::vector<SourceLocation>& where) {
  // Quadratic, but species have at most a few hundred atoms.
  for (std::size_t i = 0; i < atoms.size(); ++i)
    for (std::size_t j = 0; j < i; ++j)
      if ((atoms[i].position_angstrom - atoms[j].position_angstrom).norm() < coincident_atoms_angstrom)
        fail(where[i], "atoms " + std::to_string(j + 1) + " and " + std::to_string(i + 1) +
                           " are at the same position, expected distinct coordinates in ångström");
}

std::map<std::string, int> formula_of(const std::vector<Atom>& atoms) {
  std::map<std::string, int> formula;
  for (const Atom& a : atoms) ++formula[a.symbol];
  return formula;
}

// I = h / (8 π² c B): moment of inertia from a rotational constant (common practice;
// e.g. Herzberg, Molecular Spectra and Molecular Structure II, 1945). B in cm^-1 → amu Å².
double moment_from_rotational_constant_amu_A2(double B_cm1) {
  using namespace constants;
  double B_per_m = B_cm1 * 100.0;
  double I_kg_m2 = planck_J_s / (8.0 * pi * pi * speed_of_light_m_s * B_per_m);
  return I_kg_m2 / (atomic_mass_constant_kg * angstrom_m * angstrom_m);
}

// ---------------------------------------------------------------------------------------
// YAML

const std::vector<std::string> yaml_keys = {"name",
                                            "atoms",
                                            "frequencies",
                                            "symmetry_number",
                                            "spin_multiplicity",
                                            "electronic_levels",
                                            "enthalpy_of_formation",
                                            "phase",
                                            "transition_state",
                                            "isotopes",
                                            "mass",
                                            "rotational_constants",
                                            "moments_of_inertia",
                                            "linear",
                                            "formula",
                                            "hindered_rotors",
                                            "hessian",
                                            "hessian_unit"};

// A full Hessian may differ from its transpose by this much, relative to its largest
// element, and is then symmetrised: finite-difference Hessians and values printed to five
// or six significant digits are slightly asymmetric, while a misordered or transposed
// block is asymmetric at the size of the elements themselves.
constexpr double hessian_symmetry_tolerance = 1e-4;

// Records where the documents of a YAML text start, through yaml-cpp's event parser.
// yaml-cpp 0.7 never consumes a ',' where a document's root node should start (", 1",
// "--- ,"): YAML::LoadAll then yields empty documents forever at that position until
// memory runs out (found by fuzzing). Two documents starting at one mark reveal it.
class DocumentCounter : public YAML::EventHandler {
 public:
  std::vector<YAML::Mark> starts;
  void OnDocumentStart(const YAML::Mark& mark) override { starts.push_back(mark); }
  void OnDocumentEnd() override {}
  void OnNull(const YAML::Mark&, YAML::anchor_t) override {}
  void OnAlias(const YAML::Mark&, YAML::anchor_t) override {}
  void OnScalar(const YAML::Mark&, const std::string&, YAML::anchor_t, const std::string&) override {}
  void OnSequenceStart(const YAML::Mark&, const std::string&, YAML::anchor_t,
                       YAML::EmitterStyle::value) override {}
  void OnSequenceEnd() override {}
  void OnMapStart(const YAML::Mark&, const std::string&, YAML::anchor_t, YAML::EmitterStyle::value) override {
  }
  void OnMapEnd() override {}
};

class YamlReader {
 public:
  explicit YamlReader(const std::string& file_name) : file_(file_name) {}

  Species read(const std::string& text);

 private:
  struct Entry {
    YAML::Node key;
    YAML::Node value;
  };
  using Entries = std::map<std::string, Entry>;

  SourceLocation at(const YAML::Node& node) const {
    YAML::Mark mark = node.Mark();
    if (mark.is_null()) return {file_, 0, 0};
    return {file_, mark.line + 1, mark.column + 1};
  }
  [[noreturn]] void error(const YAML::Node& node, const std::string& message) const {
    fail(at(node), message);
  }

  static std::string describe(const YAML::Node& node) {
    if (node.IsSequence()) return "a list";
    if (node.IsMap()) return "a map";
    if (node.IsNull()) return "nothing";
    if (node.IsScalar()) return quote(node.Scalar());
    return "something undefined";
  }

  Entries entries(const YAML::Node& map, const std::string& what,
                  const std::vector<std::string>& allowed) const;
  static const YAML::Node* find(const Entries& e, const std::string& key) {
    auto it = e.find(key);
    return it == e.end() ? nullptr : &it->second.value;
  }

  double number(const YAML::Node& node, const std::string& what) const;
  double positive_number(const YAML::Node& node, const std::string& what) const;
  int positive_integer(const YAML::Node& node, const std::string& what) const;
  bool boolean(const YAML::Node& node, const std::string& what) const;
  std::string text(const YAML::Node& node, const std::string& what) const;

  std::string name(const YAML::Node& node) const;
  std::vector<Atom> atoms(const YAML::Node& node, std::vector<SourceLocation>& where) const;
  void apply_isotopes(const YAML::Node& node, std::vector<Atom>& atoms) const;
  // A value with the node it came from, so later checks can point at it.
  struct Located {
    double value;
    YAML::Node node;
  };
  std::vector<Located> wavenumbers(const YAML::Node& node, const std::string& what, bool allow_single) const;
  double wavenumber_value(const YAML::Node& node, const std::string& what) const;
  std::string unit_of(const Entries& e) const;
  std::vector<ElectronicLevel> electronic_levels(const YAML::Node& node) const;
  double enthalpy(const YAML::Node& node) const;
  std::vector<double> positive_list(const YAML::Node& node, const std::string& what) const;
  std::map<std::string, int> formula(const YAML::Node& node) const;
  std::vector<double> hessian(const YAML::Node& node, const YAML::Node* unit_node,
                              std::size_t atom_count) const;
  std::vector<HinderedRotor> hindered_rotors(const YAML::Node& node, const Species& species) const;
  int atom_index(const YAML::Node& node, const std::string& what, std::size_t atom_count) const;

  std::string file_;
};

YamlReader::Entries YamlReader::entries(const YAML::Node& map, const std::string& what,
                                        const std::vector<std::string>& allowed) const {
  Entries out;
  for (auto it = map.begin(); it != map.end(); ++it) {
    // A copy: the iterator's pair is a temporary, a reference to its member would dangle.
    const YAML::Node key = it->first;
    if (!key.IsScalar()) error(key, "a key of " + what + " is " + describe(key) + ", expected a plain name");
    const std::string& k = key.Scalar();
    if (std::find(allowed.begin(), allowed.end(), k) == allowed.end()) {
      std::string suggestion = closest_word(k, allowed);
      if (!suggestion.empty())
        error(key, "unknown key " + quote(k) + " in " + what + ", did you mean '" + suggestion + "'?");
      error(key, "unknown key " + quote(k) + " in " + what + ", expected one of " + join(allowed));
    }
    if (out.count(k)) {
      error(key, "duplicate key " + quote(k) + " in " + what + " (first at line " +
                     std::to_string(at(out[k].key).line) + "), expected each key once");
    }
    out[k] = Entry{key, it->second};
  }
  return out;
}

double YamlReader::number(const YAML::Node& node, const std::string& what) const {
  if (node.IsNull()) error(node, what + " has no value, expected a number");
  if (!node.IsScalar()) error(node, what + " is " + describe(node) + ", expected a number");
  const std::string& s = node.Scalar();
  // A quoted scalar ("1.0") carries the non-specific tag "!": it is text, not a number.
  if (node.Tag() == "!") error(node, what + " is the quoted text " + quote(s) + ", expected a number");
  static const std::set<std::string> non_finite = {".nan",  ".NaN",  ".NAN",  ".inf",  ".Inf",  ".INF",
                                                   "-.inf", "-.Inf", "-.INF", "+.inf", "+.Inf", "+.INF"};
  if (non_finite.count(s) || s == "nan" || s == "inf" || s == "-inf")
    error(node, what + " is " + quote(s) + ", expected a finite number");
  std::optional<double> value = parse_number(s);
  if (!value) error(node, what + " is " + quote(s) + ", expected a number");
  return *value;
}

double YamlReader::positive_number(const YAML::Node& node, const std::string& what) const {
  double value = number(node, what);
  if (!(value > 0.0)) error(node, what + " is " + quote(node.Scalar()) + ", expected a positive number");
  return value;
}

int YamlReader::positive_integer(const YAML::Node& node, const std::string& what) const {
  if (node.IsNull()) error(node, what + " has no value, expected a positive whole number");
  if (!node.IsScalar() || node.Tag() == "!")
    error(node, what + " is " + describe(node) + ", expected a positive whole number");
  const std::string& s = node.Scalar();
  int value = 0;
  auto [end, ec] = std::from_chars(s.data(), s.data() + s.size(), value);
  if (ec != std::errc() || end != s.data() + s.size() || value <= 0)
    error(node, what + " is " + quote(s) + ", expected a positive whole number");
  return value;
}

bool YamlReader::boolean(const YAML::Node& node, const std::string& what) const {
  if (node.IsScalar() && node.Tag() != "!") {
    const std::string& s = node.Scalar();
    // YAML 1.2 core schema booleans only: "yes"/"no"/"on" are too easy to mistype.
    if (s == "true" || s == "True" || s == "TRUE") return true;
    if (s == "false" || s == "False" || s == "FALSE") return false;
  }
  error(node, what + " is " + describe(node) + ", expected true or false");
}

std::string YamlReader::text(const YAML::Node& node, const std::string& what) const {
  if (node.IsNull()) error(node, what + " has no value, expected text");
  if (!node.IsScalar()) error(node, what + " is " + describe(node) + ", expected text");
  return node.Scalar();
}

std::string YamlReader::name(const YAML::Node& node) const {
  std::string s = text(node, "'name'");
  if (s.empty()) error(node, "'name' is empty, expected a label for the species");
  for (char c : s)
    if (static_cast<unsigned char>(c) < 0x20 || c == 0x7f)
      error(node, "'name' contains a control character, expected a one-line label");
  return s;
}

std::vector<Atom> YamlReader::atoms(const YAML::Node& node, std::vector<SourceLocation>& where) const {
  if (!node.IsSequence() || node.size() == 0)
    error(node,
          "'atoms' is " + describe(node) + ", expected a non-empty list of [symbol, x, y, z] in ångström");
  std::vector<Atom> out;
  for (const YAML::Node& item : node) {
    std::string which = "atom " + std::to_string(out.size() + 1);
    if (!item.IsSequence() || item.size() != 4)
      error(item, which + " is " + describe(item) +
                      (item.IsSequence() ? " of " + std::to_string(item.size()) : "") +
                      ", expected [symbol, x, y, z] with coordinates in ångström");
    const YAML::Node& label = item[0];
    if (!label.IsScalar())
      error(label,
            which + " has symbol " + describe(label) + ", expected an element symbol or isotope label");
    Atom atom = atom_of(resolve_label(label.Scalar(), at(label)));
    for (int k = 0; k < 3; ++k)
      atom.position_angstrom[k] = number(item[k + 1], which + " coordinate " + std::string(1, "xyz"[k]));
    where.push_back(at(item));
    out.push_back(std::move(atom));
  }
  return out;
}

void YamlReader::apply_isotopes(const YAML::Node& node, std::vector<Atom>& atoms) const {
  if (!node.IsMap())
    error(node, "'isotopes' is " + describe(node) +
                    ", expected a map from 1-based atom index to label, e.g. {2: D}");
  std::set<int> seen;
  for (auto it = node.begin(); it != node.end(); ++it) {
    int index = positive_integer(it->first, "isotope atom index");
    if (index > static_cast<int>(atoms.size()))
      error(it->first, "isotope atom index " + std::to_string(index) +
                           " is past the last atom, expected 1 to " + std::to_string(atoms.size()));
    if (!seen.insert(index).second)
      error(it->first, "duplicate isotope atom index " + std::to_string(index) + ", expected each atom once");
    std::string label = text(it->second, "isotope label");
    AtomLabel resolved = resolve_label(label, at(it->second));
    Atom& atom = atoms[static_cast<std::size_t>(index - 1)];
    if (resolved.symbol != atom.symbol)
      error(it->second, "isotope " + quote(label) + " is not an isotope of atom " + std::to_string(index) +
                            " (" + atom.symbol + "), expected one of " +
                            join(known_isotope_labels(atom.symbol)));
    atom.isotope = resolved.isotope.empty() ? label : resolved.isotope;
    atom.mass_number = resolved.mass_number;
    atom.mass_amu = resolved.mass_amu;
  }
}

std::string YamlReader::unit_of(const Entries& e) const {
  const YAML::Node* unit = find(e, "unit");
  return unit ? text(*unit, "'unit'") : std::string("cm^-1");
}

double YamlReader::wavenumber_value(const YAML::Node& node, const std::string& what) const {
  if (node.IsMap()) {
    Entries e = entries(node, what, {"value", "unit"});
    const YAML::Node* value = find(e, "value");
    if (!value) error(node, what + " has no 'value', expected {value: number, unit: text}");
    double v = number(*value, what);
    std::string unit = unit_of(e);
    std::optional<double> cm1 = to_wavenumber_cm1(v, unit);
    if (!cm1)
      error(*find(e, "unit"),
            "unknown wavenumber unit " + quote(unit) + ", expected one of " + wavenumber_units_list());
    return *cm1;
  }
  return number(node, what);
}

std::vector<YamlReader::Located> YamlReader::wavenumbers(const YAML::Node& node, const std::string& what,
                                                         bool allow_single) const {
  std::vector<Located> out;
  if (node.IsMap()) {
    Entries e = entries(node, what, {"values", "value", "unit"});
    const YAML::Node* values = find(e, "values");
    const YAML::Node* value = find(e, "value");
    if (values && value) error(node, what + " has both 'values' and 'value', expected one of them");
    if (!values && !value) error(node, what + " has no 'values', expected {values: [numbers], unit: text}");
    std::string unit = unit_of(e);
    if (!to_wavenumber_cm1(1.0, unit))
      error(*find(e, "unit"),
            "unknown wavenumber unit " + quote(unit) + ", expected one of " + wavenumber_units_list());
    if (value) {
      out.push_back({*to_wavenumber_cm1(number(*value, what), unit), *value});
    } else {
      if (!values->IsSequence())
        error(*values, what + " 'values' is " + describe(*values) + ", expected a list of numbers");
      for (const YAML::Node& item : *values)
        out.push_back({*to_wavenumber_cm1(number(item, what + " value"), unit), item});
    }
    return out;
  }
  if (node.IsSequence()) {
    for (const YAML::Node& item : node)
      out.push_back({wavenumber_value(item, what + " entry " + std::to_string(out.size() + 1)), item});
    return out;
  }
  if (allow_single && node.IsScalar()) return {{number(node, what), node}};
  error(node, what + " is " + describe(node) +
                  ", expected a list of numbers in cm^-1 or {values: [...], unit: ...}");
}

std::vector<ElectronicLevel> YamlReader::electronic_levels(const YAML::Node& node) const {
  if (!node.IsSequence() || node.size() == 0)
    error(node, "'electronic_levels' is " + describe(node) +
                    ", expected a non-empty list of {energy: cm^-1, degeneracy: integer}");
  std::vector<ElectronicLevel> out;
  double lowest = 0.0;
  for (const YAML::Node& item : node) {
    std::string which = "electronic level " + std::to_string(out.size() + 1);
    if (!item.IsMap())
      error(item, which + " is " + describe(item) + ", expected {energy: cm^-1, degeneracy: integer}");
    Entries e = entries(item, which, {"energy", "degeneracy"});
    const YAML::Node* energy = find(e, "energy");
    const YAML::Node* degeneracy = find(e, "degeneracy");
    if (!energy) error(item, which + " has no 'energy', expected energy above the ground level in cm^-1");
    if (!degeneracy) error(item, which + " has no 'degeneracy', expected a positive whole number");
    ElectronicLevel level;
    if (energy->IsMap()) {
      Entries ee = entries(*energy, which + " energy", {"value", "unit"});
      const YAML::Node* value = find(ee, "value");
      if (!value) error(*energy, which + " energy has no 'value', expected {value: number, unit: text}");
      double v = number(*value, which + " energy");
      std::string unit = unit_of(ee);
      if (std::optional<double> cm1 = to_wavenumber_cm1(v, unit)) {
        level.energy_cm1 = *cm1;
      } else if (std::optional<double> J_per_mol = to_energy_J_per_mol(v, unit)) {
        level.energy_cm1 = *J_per_mol / constants::wavenumber_J_per_mol;
      } else {
        error(*find(ee, "unit"), "unknown energy unit " + quote(unit) + ", expected one of " +
                                     wavenumber_units_list() + ", " + energy_units_list());
      }
    } else {
      level.energy_cm1 = number(*energy, which + " energy");
    }
    if (level.energy_cm1 < 0.0)
      error(*energy, which + " energy is negative, expected an energy above the ground level (>= 0)");
    level.degeneracy = positive_integer(*degeneracy, which + " degeneracy");
    lowest = out.empty() ? level.energy_cm1 : std::min(lowest, level.energy_cm1);
    out.push_back(level);
  }
  if (lowest != 0.0)
    error(node,
          "'electronic_levels' has no level at energy 0, expected the ground level at 0 and the others above "
          "it");
  return out;
}

double YamlReader::enthalpy(const YAML::Node& node) const {
  const std::string what = "'enthalpy_of_formation'";
  if (node.IsMap()) {
    Entries e = entries(node, what, {"value", "unit"});
    const YAML::Node* value = find(e, "value");
    const YAML::Node* unit = find(e, "unit");
    if (!value) error(node, what + " has no 'value', expected {value: number, unit: kJ/mol}");
    double v = number(*value, what);
    if (!unit) return v * 1e3;
    std::string u = text(*unit, "'unit'");
    std::optional<double> J_per_mol = to_energy_J_per_mol(v, u);
    if (!J_per_mol)
      error(*unit, "unknown energy unit " + quote(u) + ", expected one of " + energy_units_list());
    return *J_per_mol;
  }
  return number(node, what) * 1e3;  // bare number: kJ/mol (design.md section 4)
}

std::vector<double> YamlReader::positive_list(const YAML::Node& node, const std::string& what) const {
  std::vector<double> out;
  if (node.IsScalar()) {
    out.push_back(positive_number(node, what));
  } else if (node.IsSequence()) {
    for (const YAML::Node& item : node) out.push_back(positive_number(item, what + " value"));
  } else {
    error(node, what + " is " + describe(node) + ", expected a number or a list of 1 or 3 numbers");
  }
  if (out.size() != 1 && out.size() != 3)
    error(node, what + " has " + std::to_string(out.size()) +
                    " values, expected 1 (linear molecule) or 3 (nonlinear molecule)");
  return out;
}

std::map<std::string, int> YamlReader::formula(const YAML::Node& node) const {
  if (node.IsScalar() && !node.Scalar().empty()) return parse_formula_text(node.Scalar(), at(node));
  if (!node.IsMap())
    error(node,
          "'formula' is " + describe(node) + ", expected text such as CH4 or a map such as {C: 1, H: 4}");
  std::map<std::string, int> out;
  for (auto it = node.begin(); it != node.end(); ++it) {
    std::string symbol = text(it->first, "formula element");
    if (!find_element(symbol)) {
      std::string suggestion = closest_element_symbol(symbol);
      error(it->first, "unknown element " + quote(symbol) + " in 'formula'" +
                           (suggestion.empty() ? ", expected element symbols such as C, H, O"
                                               : ", did you mean '" + suggestion + "'?"));
    }
    if (out.count(symbol)) error(it->first, "duplicate element " + quote(symbol) + " in 'formula'");
    out[symbol] = positive_integer(it->second, "count of " + symbol);
  }
  return out;
}

// The flat `hessian` list: the full 3N×3N matrix row-major, or its lower triangle row by
// row (H11, H21, H22, H31, ...). Returns the full matrix, row-major, in J/m².
std::vector<double> YamlReader::hessian(const YAML::Node& node, const YAML::Node* unit_node,
                                        std::size_t atom_count) const {
  double factor = *to_force_constant_J_per_m2(1.0, "hartree/bohr^2");
  if (unit_node) {
    std::string unit = text(*unit_node, "'hessian_unit'");
    std::optional<double> f = to_force_constant_J_per_m2(1.0, unit);
    if (!f)
      error(*unit_node,
            "unknown Hessian unit " + quote(unit) + ", expected one of " + force_constant_units_list());
    factor = *f;
  }
  if (!node.IsSequence())
    error(node, "'hessian' is " + describe(node) +
                    ", expected a flat list of numbers (full 3N×3N matrix row-major, or its lower triangle)");
  const std::size_t n = 3 * atom_count;
  const std::size_t full = n * n;
  const std::size_t triangle = n * (n + 1) / 2;
  if (node.size() != full && node.size() != triangle)
    error(node, "'hessian' has " + std::to_string(node.size()) + " values, expected " + std::to_string(full) +
                    " (full 3N×3N matrix, row-major) or " + std::to_string(triangle) +
                    " (lower triangle, row by row) for N = " + std::to_string(atom_count) + " atoms");
  std::vector<double> values;
  std::vector<YAML::Node> nodes;
  for (const YAML::Node& item : node) {
    values.push_back(number(item, "Hessian value " + std::to_string(values.size() + 1)));
    nodes.push_back(item);
  }
  std::vector<double> out(full);
  if (values.size() == triangle) {
    std::size_t k = 0;
    for (std::size_t i = 0; i < n; ++i)
      for (std::size_t j = 0; j <= i; ++j, ++k) out[i * n + j] = out[j * n + i] = values[k] * factor;
    return out;
  }
  double largest = 0.0;
  for (double v : values) largest = std::max(largest, std::abs(v));
  for (std::size_t i = 0; i < n; ++i)
    for (std::size_t j = 0; j < i; ++j) {
      const double lower = values[i * n + j];
      const double upper = values[j * n + i];
      if (std::abs(lower - upper) > hessian_symmetry_tolerance * largest)
        error(nodes[i * n + j], "'hessian' is not symmetric: row " + std::to_string(i + 1) + ", column " +
                                    std::to_string(j + 1) + " is " + quote(nodes[i * n + j].Scalar()) +
                                    " but row " + std::to_string(j + 1) + ", column " +
                                    std::to_string(i + 1) + " is " + quote(nodes[j * n + i].Scalar()) +
                                    ", expected equal values (within 1e-4 of the largest element)");
      out[i * n + j] = out[j * n + i] = 0.5 * (lower + upper) * factor;
    }
  for (std::size_t i = 0; i < n; ++i) out[i * n + i] = values[i * n + i] * factor;
  return out;
}

Species YamlReader::read(const std::string& text) {
  require_text(text, file_);
  YAML::Node root;
  try {
    std::istringstream stream(text);
    YAML::Parser parser(stream);
    DocumentCounter counter;
    while (counter.starts.size() < 3 && parser.HandleNextDocument(counter)) {
    }
    if (counter.starts.size() == 3 && counter.starts[1].pos == counter.starts[2].pos) {
      const YAML::Mark& stuck = counter.starts[1];
      fail({file_, stuck.line + 1, stuck.column + 1},
           "malformed YAML: a document cannot start with ',', expected a YAML map of species keys");
    }
    if (counter.starts.size() > 1) {
      const YAML::Mark& second = counter.starts[1];
      fail({file_, second.line + 1, second.column + 1},
           "file holds more than one YAML document, expected one species per file");
    }
    root = YAML::Load(text);
  } catch (const YAML::Exception& e) {
    SourceLocation where{file_, 0, 0};
    if (!e.mark.is_null()) where = {file_, e.mark.line + 1, e.mark.column + 1};
    fail(where, "malformed YAML: " + e.msg + ", expected a YAML map of species keys");
  }
  if (!root.IsDefined() || root.IsNull())
    fail({file_, 0, 0}, "file holds no species, expected a YAML map with at least 'name' and 'atoms'");
  if (!root.IsMap())
    error(root,
          "top level is " + describe(root) + ", expected a map of species keys such as 'name' and 'atoms'");

  Entries e = entries(root, "the species", yaml_keys);

  Species species;
  species.origin = {file_, 0, 0};
  const YAML::Node* name_node = find(e, "name");
  if (!name_node) error(root, "missing required key 'name', expected a label for the species");
  species.name = name(*name_node);
  species.origin = at(root);

  const YAML::Node* atoms_node = find(e, "atoms");
  const YAML::Node* mass_node = find(e, "mass");
  const YAML::Node* constants_node = find(e, "rotational_constants");
  const YAML::Node* moments_node = find(e, "moments_of_inertia");
  const YAML::Node* linear_node = find(e, "linear");
  bool monatomic = false;
  if (atoms_node) {
    for (const char* key : {"mass", "rotational_constants", "moments_of_inertia", "linear"})
      if (find(e, key))
        error(e[key].key, "key '" + std::string(key) + "' is for species given without 'atoms', " +
                              "expected either 'atoms' or 'mass' with rotational data, not both");
    std::vector<SourceLocation> where;
    species.atoms = atoms(*atoms_node, where);
    if (const YAML::Node* iso = find(e, "isotopes")) apply_isotopes(*iso, species.atoms);
    check_atoms_apart(species.atoms, where);
    species.formula = formula_of(species.atoms);
    if (const YAML::Node* f = find(e, "formula")) {
      std::map<std::string, int> given = formula(*f);
      if (given != species.formula)
        error(*f, "'formula' " + formula_text(given) + " does not match the atoms (" +
                      formula_text(species.formula) +
                      "), expected the composition of the atoms or no 'formula'");
    }
    monatomic = species.atoms.size() == 1;
  } else if (mass_node) {
    if (find(e, "isotopes"))
      error(e["isotopes"].key,
            "'isotopes' needs 'atoms', expected isotopic masses folded into 'mass' instead");
    RigidRotorData rotor;
    rotor.mass_amu = positive_number(*mass_node, "'mass'");
    if (constants_node && moments_node)
      error(e["moments_of_inertia"].key,
            "both 'rotational_constants' and 'moments_of_inertia' given, expected one of them");
    if (constants_node) {
      std::vector<Located> B_cm1 = wavenumbers(*constants_node, "'rotational_constants'", true);
      if (B_cm1.size() != 1 && B_cm1.size() != 3)
        error(*constants_node, "'rotational_constants' has " + std::to_string(B_cm1.size()) +
                                   " values, expected 1 (linear molecule) or 3 (nonlinear molecule)");
      for (const Located& B : B_cm1) {
        if (!(B.value > 0.0))
          error(B.node, "rotational constant is zero or negative, expected a positive constant");
        rotor.moments_amu_A2.push_back(moment_from_rotational_constant_amu_A2(B.value));
      }
    } else if (moments_node) {
      rotor.moments_amu_A2 = positive_list(*moments_node, "'moments_of_inertia'");
    }
    std::sort(rotor.moments_amu_A2.begin(), rotor.moments_amu_A2.end());
    const YAML::Node* rotational = constants_node ? constants_node : moments_node;
    rotor.linear = rotor.moments_amu_A2.size() == 1;
    if (linear_node) {
      if (!rotational)
        error(e["linear"].key,
              "'linear' without 'rotational_constants' or 'moments_of_inertia', " +
                  std::string("expected rotational data (a species with only 'mass' is an atom)"));
      bool linear = boolean(*linear_node, "'linear'");
      if (linear != rotor.linear)
        error(*linear_node, std::string("'linear' is ") + (linear ? "true" : "false") + " but " +
                                std::to_string(rotor.moments_amu_A2.size()) +
                                " rotational value(s) are given, " +
                                "expected 1 value for a linear molecule and 3 for a nonlinear one");
    }
    monatomic = rotor.moments_amu_A2.empty();
    species.rotor_data = rotor;
    if (const YAML::Node* f = find(e, "formula")) species.formula = formula(*f);
  } else {
    for (const char* key : {"rotational_constants", "moments_of_inertia", "linear"})
      if (find(e, key))
        error(e[key].key, "key '" + std::string(key) + "' needs 'mass', expected 'mass' in amu beside it");
    error(root, "missing 'atoms', expected a list of [symbol, x, y, z] in ångström " +
                    std::string("(or 'mass' with 'rotational_constants' or 'moments_of_inertia')"));
  }

  const YAML::Node* hessian_node = find(e, "hessian");
  const YAML::Node* hessian_unit = find(e, "hessian_unit");
  if (hessian_node && find(e, "frequencies"))
    error(
        e["hessian"].key,
        "both 'frequencies' and 'hessian' given, expected one of them (the Hessian yields the frequencies)");
  if (hessian_unit && !hessian_node)
    error(e["hessian_unit"].key, "'hessian_unit' without 'hessian', expected a 'hessian' list beside it");
  if (hessian_node) {
    if (species.atoms.empty())
      error(e["hessian"].key,
            "'hessian' needs 'atoms', expected Cartesian coordinates of the atoms the Hessian refers to");
    species.hessian_J_per_m2 = hessian(*hessian_node, hessian_unit, species.atoms.size());
  } else if (const YAML::Node* f = find(e, "frequencies")) {
    for (const Located& nu : wavenumbers(*f, "'frequencies'", false)) {
      if (nu.value == 0.0)
        error(nu.node, "frequency " + std::to_string(species.frequencies_cm1.size() + 1) +
                           " is 0, expected a non-zero wavenumber (negative for imaginary)");
      species.frequencies_cm1.push_back(nu.value);
    }
  } else if (!monatomic) {
    error(root, "missing required key 'frequencies', expected a list of wavenumbers in cm^-1 " +
                    std::string("or a 'hessian' (only a single atom has neither)"));
  }

  if (const YAML::Node* s = find(e, "symmetry_number"))
    species.symmetry_number = positive_integer(*s, "'symmetry_number'");
  const YAML::Node* spin = find(e, "spin_multiplicity");
  const YAML::Node* levels = find(e, "electronic_levels");
  if (spin && levels)
    error(e["spin_multiplicity"].key,
          "both 'spin_multiplicity' and 'electronic_levels' given, expected one of them " +
              std::string("(the ground level's degeneracy in 'electronic_levels' includes the spin)"));
  if (spin) species.electronic_levels = {{0.0, positive_integer(*spin, "'spin_multiplicity'")}};
  if (levels) species.electronic_levels = electronic_levels(*levels);
  if (const YAML::Node* h = find(e, "enthalpy_of_formation"))
    species.enthalpy_of_formation_J_per_mol = enthalpy(*h);
  if (const YAML::Node* p = find(e, "phase")) {
    std::string phase = YamlReader::text(*p, "'phase'");
    if (phase == "gas")
      species.phase = Phase::gas;
    else if (phase == "adsorbate")
      species.phase = Phase::adsorbate;
    else
      error(*p, "'phase' is " + quote(phase) + ", expected gas or adsorbate");
  }
  if (const YAML::Node* t = find(e, "transition_state"))
    species.transition_state = boolean(*t, "'transition_state'");
  if (const YAML::Node* h = find(e, "hindered_rotors")) {
    if (species.atoms.empty())
      error(
          e["hindered_rotors"].key,
          "'hindered_rotors' needs 'atoms', expected Cartesian coordinates to find the rotor axis and tops");
    species.hindered_rotors = hindered_rotors(*h, species);
  }
  return species;
}

int YamlReader::atom_index(const YAML::Node& node, const std::string& what, std::size_t atom_count) const {
  const int index = positive_integer(node, what);
  if (static_cast<std::size_t>(index) > atom_count)
    error(node, what + " is atom " + std::to_string(index) + ", expected an atom number from 1 to " +
                    std::to_string(atom_count));
  return index - 1;
}

std::vector<HinderedRotor> YamlReader::hindered_rotors(const YAML::Node& node, const Species& species) const {
  if (!node.IsSequence() || node.size() == 0)
    error(node, "'hindered_rotors' is " + describe(node) +
                    ", expected a list of {bond: [i, j], symmetry, barrier or scan, replaces}");
  std::vector<HinderedRotor> out;
  for (const YAML::Node& item : node) {
    const std::string which = "hindered rotor " + std::to_string(out.size() + 1);
    if (!item.IsMap())
      error(item, which + " is " + describe(item) +
                      ", expected {bond: [i, j], symmetry, barrier or scan, replaces}");
    Entries e = entries(item, which, {"bond", "symmetry", "barrier", "scan", "replaces", "top"});
    HinderedRotor r;
    r.where = at(item);
    const YAML::Node* bond = find(e, "bond");
    if (!bond) error(item, which + " has no 'bond', expected the two 1-based atoms of the rotation axis");
    if (!bond->IsSequence() || bond->size() != 2)
      error(*bond, which + " 'bond' is " + describe(*bond) + ", expected two atom numbers [i, j]");
    const std::size_t n = species.atoms.size();
    r.bond_atoms = {atom_index((*bond)[0], which + " bond", n), atom_index((*bond)[1], which + " bond", n)};
    if (r.bond_atoms[0] == r.bond_atoms[1])
      error(*bond, which + " 'bond' names atom " + std::to_string(r.bond_atoms[0] + 1) +
                       " twice, expected two different atoms");
    const YAML::Node* symmetry = find(e, "symmetry");
    if (!symmetry)
      error(item, which + " has no 'symmetry', expected the internal symmetry number (1, 2, 3, ...)");
    r.symmetry = positive_integer(*symmetry, which + " 'symmetry'");
    const YAML::Node* barrier = find(e, "barrier");
    const YAML::Node* scan = find(e, "scan");
    if (barrier && scan) error(e["scan"].key, which + " has both 'barrier' and 'scan', expected one of them");
    if (!barrier && !scan)
      error(item, which + " has neither 'barrier' nor 'scan', expected a barrier in kJ/mol or a scan");
    if (barrier) {
      const double V = number(*barrier, which + " 'barrier'");
      if (V < 0.0)
        error(*barrier, which + " 'barrier' is " + quote(barrier->Scalar()) +
                            ", expected a barrier height >= 0 in kJ/mol");
      r.barrier_J_per_mol = V * 1e3;
    } else {
      if (!scan->IsSequence())
        error(*scan, which + " 'scan' is " + describe(*scan) + ", expected a list of [degrees, kJ/mol]");
      for (const YAML::Node& point : *scan) {
        if (!point.IsSequence() || point.size() != 2)
          error(point, which + " scan point is " + describe(point) + ", expected [degrees, kJ/mol]");
        r.scan.push_back(
            {number(point[0], which + " scan angle"), number(point[1], which + " scan energy") * 1e3});
      }
    }
    if (const YAML::Node* top = find(e, "top")) {
      if (!top->IsSequence() || top->size() == 0)
        error(*top, which + " 'top' is " + describe(*top) +
                        ", expected a list of the atoms on the side of bond atom " +
                        std::to_string(r.bond_atoms[0] + 1));
      for (const YAML::Node& a : *top) r.top_atoms.push_back(atom_index(a, which + " 'top'", n));
      const auto has = [&r](int i) {
        return std::find(r.top_atoms.begin(), r.top_atoms.end(), i) != r.top_atoms.end();
      };
      if (!has(r.bond_atoms[0]) || has(r.bond_atoms[1]))
        error(*top, which + " 'top' must hold bond atom " + std::to_string(r.bond_atoms[0] + 1) +
                        " and not atom " + std::to_string(r.bond_atoms[1] + 1) +
                        ", expected the atoms on the side of the first bond atom");
    }
    const YAML::Node* replaces = find(e, "replaces");
    if (!replaces)
      error(item, which + " has no 'replaces', expected the wavenumber of the torsional mode it replaces");
    r.replaces_cm1 = positive_number(*replaces, which + " 'replaces'");
    if (!species.frequencies_cm1.empty()) {
      const auto closest = std::min_element(
          species.frequencies_cm1.begin(), species.frequencies_cm1.end(),
          [&r](double a, double b) { return std::abs(a - r.replaces_cm1) < std::abs(b - r.replaces_cm1); });
      if (std::abs(*closest - r.replaces_cm1) > replaces_tolerance_cm1)
        error(*replaces,
              fmt::format("{} 'replaces' {:g} cm^-1 matches no frequency within {:g} cm^-1, expected a "
                          "given frequency (closest: {:g})",
                          which, r.replaces_cm1, replaces_tolerance_cm1, *closest));
    }
    out.push_back(std::move(r));
  }
  return out;
}

// ---------------------------------------------------------------------------------------
// XYZ plus frequencies

struct Token {
  std::string_view text;
  int column;  // 1-based
};

// Splits a line into tokens at blanks (and commas when `commas`), dropping a `#` comment.
std::vector<Token> tokenize(std::string_view line, bool commas) {
  std::vector<Token> tokens;
  std::size_t i = 0;
  auto separator = [&](char c) { return c == ' ' || c == '\t' || c == '\r' || (commas && c == ','); };
  while (i < line.size()) {
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
  species.name = fs::path(file_).stem().string();
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
    for (const Token& token : tokenize(lines[index], true)) {
      double value = number(token, ln, "frequency");
      if (value == 0.0)
        error(ln, token.column, "frequency is 0, expected a non-zero wavenumber (negative for imaginary)");
      species.frequencies_cm1.push_back(*to_wavenumber_cm1(value, unit));
    }
  }
  return species;
}

std::string lowercase_extension(const std::string& path) {
  std::string ext = fs::path(path).extension().string();
  std::transform(ext.begin(), ext.end(), ext.begin(),
                 [](char c) { return static_cast<char>(std::tolower(static_cast<unsigned char>(c))); });
  return ext;
}

bool is_species_extension(const std::string& ext) { return ext == ".yaml" || ext == ".yml" || ext == ".xyz"; }

// Manifests may list manifests; this bounds a cycle.
constexpr int max_manifest_depth = 16;

void expand_one(const std::string& arg, const SourceLocation& where, int depth,
                std::vector<std::string>& out) {
  std::error_code ec;
  if (fs::is_directory(arg, ec)) {
    std::vector<std::string> found;
    for (const fs::directory_entry& entry : fs::directory_iterator(arg, ec)) {
      std::error_code file_ec;
      if (entry.is_regular_file(file_ec) && is_species_extension(lowercase_extension(entry.path().string())))
        found.push_back(entry.path().string());
    }
    if (ec)
      fail(where.file.empty() ? SourceLocation{arg, 0, 0} : where, "cannot list directory: " + ec.message());
    if (found.empty())
      fail(where.file.empty() ? SourceLocation{arg, 0, 0} : where,
           "directory holds no species files, expected files ending in .yaml, .yml or .xyz");
    std::sort(found.begin(), found.end());
    out.insert(out.end(), found.begin(), found.end());
    return;
  }
  if (lowercase_extension(arg) != ".list") {
    out.push_back(arg);
    return;
  }
  if (depth > max_manifest_depth)
    fail({arg, 0, 0}, "manifests nested more than " + std::to_string(max_manifest_depth) +
                          " deep, expected no manifest to list itself");
  std::ifstream in(arg, std::ios::binary);
  if (!in) fail({arg, 0, 0}, "cannot read manifest, expected a readable file listing species files");
  std::stringstream buffer;
  buffer << in.rdbuf();
  std::string text = buffer.str();
  require_text(text, arg);
  fs::path base = fs::path(arg).parent_path();
  std::istringstream lines(text);
  std::string line;
  int line_number = 0;
  bool any = false;
  while (std::getline(lines, line)) {
    ++line_number;
    std::size_t hash = line.find('#');
    if (hash != std::string::npos) line.erase(hash);
    std::size_t first = line.find_first_not_of(" \t\r");
    if (first == std::string::npos) continue;
    std::size_t last = line.find_last_not_of(" \t\r");
    std::string entry = line.substr(first, last - first + 1);
    fs::path path(entry);
    if (path.is_relative()) path = base / path;
    SourceLocation entry_where{arg, line_number, static_cast<int>(first) + 1};
    if (!fs::exists(path, ec)) fail(entry_where, "listed file " + quote(entry) + " does not exist");
    expand_one(path.string(), entry_where, depth + 1, out);
    any = true;
  }
  if (!any) fail({arg, 0, 0}, "manifest lists no files, expected one species file path per line");
}

}  // namespace

Species read_species_yaml(const std::string& text, const std::string& file_name) {
  return YamlReader(file_name).read(text);
}

Species read_species_xyz(const std::string& text, const std::string& file_name) {
  return XyzReader(file_name).read(text);
}

Species read_species_file(const std::string& path) {
  std::string ext = lowercase_extension(path);
  if (!is_species_extension(ext))
    fail({path, 0, 0}, "unknown file type " + quote(ext.empty() ? "(none)" : ext) +
                           ", expected a species file ending in .yaml, .yml or .xyz");
  std::error_code ec;
  if (fs::is_directory(path, ec)) fail({path, 0, 0}, "is a directory, expected a species file");
  std::ifstream in(path, std::ios::binary);
  if (!in) fail({path, 0, 0}, "cannot read file (missing or not readable), expected a species file");
  std::stringstream buffer;
  buffer << in.rdbuf();
  if (in.bad()) fail({path, 0, 0}, "error while reading file");
  std::string text = buffer.str();
  if (text.find_first_not_of(" \t\r\n") == std::string::npos)
    fail({path, 0, 0}, "file is empty, expected a species description");
  return ext == ".xyz" ? read_species_xyz(text, path) : read_species_yaml(text, path);
}

std::vector<std::string> expand_species_paths(const std::vector<std::string>& args) {
  std::vector<std::string> out;
  for (const std::string& arg : args) expand_one(arg, {}, 0, out);
  return out;
}

const std::vector<std::string>& yaml_species_keys() { return yaml_keys; }

}  // namespace vibtherm
