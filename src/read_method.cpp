// The method-file reader: label, the free atoms' energies (hartree when bare) with optional
// spin–orbit corrections, bond-additivity corrections (kJ/mol per bond) and scale factors.
#include "vibtherm/read_method.hpp"

#include <fmt/format.h>
#include <yaml-cpp/yaml.h>

#include <cmath>

#include "vibtherm/bonds.hpp"
#include "vibtherm/elements.hpp"
#include "vibtherm/limits.hpp"
#include "vibtherm/species_builder.hpp"
#include "yaml_values.hpp"

namespace vibtherm {
namespace {

const std::vector<std::string> method_keys = {"label", "elements", "bond_corrections", "scale"};

// An element symbol of the method file, with did-you-mean for a near miss.
std::string element_symbol(const YamlValues& y, const YAML::Node& node, const std::string& symbol,
                           const std::string& what) {
  if (find_element(symbol)) return symbol;
  const std::string close = closest_element_symbol(symbol);
  y.error(node, "unknown element " + quote(symbol) + " in " + what +
                    (close.empty() ? ", expected an element symbol such as C or Cl"
                                   : ", expected an element symbol (did you mean " + quote(close) + "?)"));
}

}  // namespace

Method read_method_yaml(const std::string& text, const std::string& file_name) {
  const YAML::Node root = load_single_yaml_document(
      text, file_name, "expected a YAML map with 'label' and 'elements'", "expected one method per file");
  YamlValues y(file_name);
  if (!root.IsDefined() || root.IsNull())
    fail({file_name, 0, 0}, "file holds no method, expected a YAML map with 'label' and 'elements'");
  if (!root.IsMap())
    y.error(root,
            "top level is " + YamlValues::describe(root) + ", expected a map with 'label' and 'elements'");
  const YamlValues::Entries e = y.entries(root, "the method", method_keys);
  Method method;
  method.origin = y.at(root);
  const YAML::Node* label = YamlValues::find(e, "label");
  if (!label)
    y.error(root, "missing required key 'label', expected the method's name, e.g. 'B3LYP/6-31G(d)'");
  method.label = y.text(*label, "'label'");
  const YAML::Node* elements = YamlValues::find(e, "elements");
  if (!elements)
    y.error(root,
            "missing required key 'elements', expected the free atoms' energies, e.g. {H: {energy: -0.5}}");
  if (!elements->IsMap() || elements->size() == 0)
    y.error(*elements, "'elements' is " + YamlValues::describe(*elements) +
                           ", expected a map such as {H: {energy: -0.500273}}");
  for (const auto& item : *elements) {
    const std::string symbol =
        element_symbol(y, item.first, y.text(item.first, "an element of 'elements'"), "'elements'");
    if (method.elements.count(symbol))
      y.error(item.first, "element " + quote(symbol) + " given twice in 'elements'");
    const std::string what = "element " + symbol;
    if (!item.second.IsMap())
      y.error(item.second, what + " is " + YamlValues::describe(item.second) +
                               ", expected {energy: hartree, spin_orbit: hartree (optional)}");
    const YamlValues::Entries a = y.entries(item.second, what, {"energy", "spin_orbit"});
    const YAML::Node* energy = YamlValues::find(a, "energy");
    if (!energy) y.error(item.second, what + " has no 'energy', expected the free atom's electronic energy");
    MethodAtom atom;
    atom.where = y.at(item.first);
    // Bounded so that every sum of them stays finite: no atom is below about −3e4 hartree.
    const auto bounded = [&](const YAML::Node& node, const std::string& key) {
      const double e = y.energy_J_per_mol(node, what + " '" + key + "'", "hartree");
      if (!(std::abs(e) <= limits::max_atomic_energy_J_per_mol))
        y.error(node,
                fmt::format("{} '{}' lies beyond +-{:g} hartree, expected a free atom's energy (H about "
                            "-0.5, the heaviest atoms about -3e4 hartree)",
                            what, key, limits::max_atomic_energy_hartree));
      return e;
    };
    atom.energy_J_per_mol = bounded(*energy, "energy");
    if (const YAML::Node* so = YamlValues::find(a, "spin_orbit"))
      atom.spin_orbit_J_per_mol = bounded(*so, "spin_orbit");
    method.elements[symbol] = atom;
  }
  if (const YAML::Node* bonds = YamlValues::find(e, "bond_corrections")) {
    if (!bonds->IsMap() || bonds->size() == 0)
      y.error(*bonds, "'bond_corrections' is " + YamlValues::describe(*bonds) +
                          ", expected a map such as {C-H: -0.11, O-H: 0.30} in kJ/mol per bond");
    for (const auto& item : *bonds) {
      const std::string name = y.text(item.first, "a bond of 'bond_corrections'");
      const auto dash = name.find('-');
      if (dash == std::string::npos || dash == 0 || dash + 1 == name.size() ||
          name.find('-', dash + 1) != std::string::npos)
        y.error(item.first, "bond " + quote(name) + " in 'bond_corrections' is not two element symbols " +
                                "joined by '-', expected e.g. C-H");
      const std::string a = element_symbol(y, item.first, name.substr(0, dash), "bond " + quote(name));
      const std::string b = element_symbol(y, item.first, name.substr(dash + 1), "bond " + quote(name));
      const std::string type = bond_type(a, b);
      if (method.bond_corrections_J_per_mol.count(type))
        y.error(item.first, "bond " + quote(name) + " given twice in 'bond_corrections' (as " + quote(type) +
                                " and its reverse)");
      method.bond_corrections_J_per_mol[type] = y.energy_J_per_mol(item.second, "bond " + quote(name));
      method.bond_correction_where[type] = y.at(item.first);
    }
  }
  if (const YAML::Node* s = YamlValues::find(e, "scale")) method.scale = y.scale_factors(*s, "'scale'");
  return method;
}

Method read_method_file(const std::string& path) {
  return read_method_yaml(read_input_text_file(path, "a method file (YAML)"), path);
}

}  // namespace vibtherm
