// Internal to the library: the checked parts of a YAML species file (atoms, isotopes,
// electronic levels, formula, Hessian, hindered rotors), shared by the species reader and
// its `from:` overlay. Each failure an InputError at the node's line and column.
#pragma once

#include <map>
#include <string>
#include <vector>

#include "vibtherm/species.hpp"
#include "yaml_values.hpp"

namespace vibtherm {

class SpeciesYamlValues : public YamlValues {
 public:
  explicit SpeciesYamlValues(const std::string& file_name) : YamlValues(file_name) {}

  // [symbol, x, y, z] in ångström per atom; `where` receives each atom's location.
  std::vector<Atom> atoms(const YAML::Node& node, std::vector<SourceLocation>& where) const;
  // `isotopes`: {1-based atom index: label}.
  void apply_isotopes(const YAML::Node& node, std::vector<Atom>& atoms) const;
  std::vector<ElectronicLevel> electronic_levels(const YAML::Node& node) const;
  // A positive number or a list of 1 or 3 (moments of inertia).
  std::vector<double> positive_list(const YAML::Node& node, const std::string& what) const;
  std::map<std::string, int> formula(const YAML::Node& node) const;
  // The flat `hessian` list (full or lower triangle) in `hessian_unit`, as the full matrix in J/m².
  std::vector<double> hessian(const YAML::Node& node, const YAML::Node* unit_node,
                              std::size_t atom_count) const;
  std::vector<HinderedRotor> hindered_rotors(const YAML::Node& node, const Species& species) const;
  // A 1-based atom number from 1 to atom_count, returned 0-based.
  int atom_index(const YAML::Node& node, const std::string& what, std::size_t atom_count) const;
};

}  // namespace vibtherm
