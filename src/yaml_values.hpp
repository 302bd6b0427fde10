// Internal to the library: checked access to the values of a YAML document (numbers,
// whole numbers, booleans, text, maps with allowed keys, values with units), every failure
// an InputError at the node's line and column. Shared by the YAML readers (species,
// method and reaction files).
#pragma once

#include <yaml-cpp/yaml.h>

#include <map>
#include <string>
#include <vector>

#include "vibtherm/error.hpp"
#include "vibtherm/species.hpp"

namespace vibtherm {

// Parses `text` as exactly one YAML document. An empty document gives a null node; two
// documents, or a text yaml-cpp cannot parse, fail with `expected` (e.g. "expected a YAML
// map of species keys") appended to the message.
YAML::Node load_single_yaml_document(const std::string& text, const std::string& file_name,
                                     const std::string& expected, const std::string& one_per_file);

// The text of a small input file (method or reaction file, `what` names it in messages):
// a regular, readable, non-empty file of at most 32 MiB, else InputError at the path.
std::string read_input_text_file(const std::string& path, const std::string& what);

class YamlValues {
 public:
  explicit YamlValues(const std::string& file_name) : file_(file_name) {}

  struct Entry {
    YAML::Node key;
    YAML::Node value;
  };
  using Entries = std::map<std::string, Entry>;

  // A value with the node it came from, so later checks can point at it.
  struct Located {
    double value;
    YAML::Node node;
  };

  const std::string& file() const { return file_; }
  SourceLocation at(const YAML::Node& node) const;
  [[noreturn]] void error(const YAML::Node& node, const std::string& message) const;
  // "a list", "a map", "nothing" or the quoted scalar.
  static std::string describe(const YAML::Node& node);

  // The keys of a map, each checked against `allowed` (did-you-mean on a near miss) and
  // against duplicates. `what` names the map in messages ("the species", "hindered rotor 2").
  Entries entries(const YAML::Node& map, const std::string& what,
                  const std::vector<std::string>& allowed) const;
  static const YAML::Node* find(const Entries& e, const std::string& key) {
    auto it = e.find(key);
    return it == e.end() ? nullptr : &it->second.value;
  }

  double number(const YAML::Node& node, const std::string& what) const;  // finite
  double positive_number(const YAML::Node& node, const std::string& what) const;
  int positive_integer(const YAML::Node& node, const std::string& what) const;
  bool boolean(const YAML::Node& node, const std::string& what) const;
  std::string text(const YAML::Node& node, const std::string& what) const;

  // The text of a `unit` entry, or cm^-1 when there is none.
  std::string unit_of(const Entries& e) const;
  // A wavenumber: a bare number in cm^-1, or {value, unit} in any wavenumber unit.
  double wavenumber_value(const YAML::Node& node, const std::string& what) const;
  // A list of wavenumbers: [numbers or {value, unit}], or {values: [...], unit} or
  // {value, unit}; a bare number too when `allow_single`. Converted to cm^-1.
  std::vector<Located> wavenumbers(const YAML::Node& node, const std::string& what, bool allow_single) const;
  // An energy per mole: a bare number in `bare_unit` (kJ/mol unless said), or {value, unit}
  // in any energy unit (the unit defaults to `bare_unit` too). J/mol.
  double energy_J_per_mol(const YAML::Node& node, const std::string& what,
                          const std::string& bare_unit = "kJ/mol") const;
  // Frequency scale factors per quantity, the map {zpe, enthalpy, entropy} (each optional,
  // positive) of a species file's or a method file's `scale` (design.md section 4).
  ScaleFactors scale_factors(const YAML::Node& node, const std::string& what) const;

 private:
  std::string file_;
};

}  // namespace vibtherm
