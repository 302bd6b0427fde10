// The checked parts of a YAML species file; see yaml_species_parts.hpp.
#include "yaml_species_parts.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <set>

#include "vibtherm/constants.hpp"
#include "vibtherm/elements.hpp"
#include "vibtherm/hindered_rotor.hpp"
#include "vibtherm/limits.hpp"
#include "vibtherm/species_builder.hpp"
#include "vibtherm/spelling.hpp"
#include "vibtherm/units.hpp"

namespace vibtherm {

std::vector<Atom> SpeciesYamlValues::atoms(const YAML::Node& node, std::vector<SourceLocation>& where) const {
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

void SpeciesYamlValues::apply_isotopes(const YAML::Node& node, std::vector<Atom>& atoms) const {
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

std::vector<ElectronicLevel> SpeciesYamlValues::electronic_levels(const YAML::Node& node) const {
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

std::vector<double> SpeciesYamlValues::positive_list(const YAML::Node& node, const std::string& what) const {
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

std::map<std::string, int> SpeciesYamlValues::formula(const YAML::Node& node) const {
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
std::vector<double> SpeciesYamlValues::hessian(const YAML::Node& node, const YAML::Node* unit_node,
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
  if (values.size() == triangle) return hessian_from_lower_triangle(values, n, factor);
  if (const auto ij = hessian_asymmetry(values, n)) {
    const auto [i, j] = *ij;
    error(nodes[i * n + j], "'hessian' is not symmetric: row " + std::to_string(i + 1) + ", column " +
                                std::to_string(j + 1) + " is " + quote(nodes[i * n + j].Scalar()) +
                                " but row " + std::to_string(j + 1) + ", column " + std::to_string(i + 1) +
                                " is " + quote(nodes[j * n + i].Scalar()) +
                                ", expected equal values (within 1e-4 of the largest element)");
  }
  return symmetrised_hessian(values, n, factor);
}

int SpeciesYamlValues::atom_index(const YAML::Node& node, const std::string& what,
                                  std::size_t atom_count) const {
  const int index = positive_integer(node, what);
  if (static_cast<std::size_t>(index) > atom_count)
    error(node, what + " is atom " + std::to_string(index) + ", expected an atom number from 1 to " +
                    std::to_string(atom_count));
  return index - 1;
}

std::vector<HinderedRotor> SpeciesYamlValues::hindered_rotors(const YAML::Node& node,
                                                              const Species& species) const {
  if (!node.IsSequence() || node.size() == 0)
    error(node, "'hindered_rotors' is " + describe(node) +
                    ", expected a list of {bond: [i, j], symmetry, barrier or scan, replaces}");
  std::vector<HinderedRotor> out;
  for (const YAML::Node& item : node) {
    const std::string which = "hindered rotor " + std::to_string(out.size() + 1);
    if (!item.IsMap())
      error(item, which + " is " + describe(item) +
                      ", expected {bond: [i, j], symmetry, barrier or scan, replaces}");
    Entries e = entries(item, which, {"bond", "symmetry", "barrier", "scan", "replaces", "top", "moment"});
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
    if (r.symmetry > limits::max_rotor_symmetry)
      error(*symmetry, fmt::format("{} 'symmetry' is {}, expected the period of the torsional potential, "
                                   "1 to {} (real torsions have 1 to 6)",
                                   which, r.symmetry, limits::max_rotor_symmetry));
    const YAML::Node* barrier = find(e, "barrier");
    const YAML::Node* scan = find(e, "scan");
    if (barrier && scan) error(e["scan"].key, which + " has both 'barrier' and 'scan', expected one of them");
    if (!barrier && !scan)
      error(item, which + " has neither 'barrier' nor 'scan', expected a barrier in kJ/mol or a scan");
    if (barrier) {
      // A bare number in kJ/mol or {value, unit}; the message quotes the number given,
      // which for a map is its 'value' (a map has no scalar text of its own).
      const double V = energy_J_per_mol(*barrier, which + " 'barrier'");
      if (V < 0.0) {
        YAML::Node given = *barrier;
        if (barrier->IsMap())
          for (auto it = barrier->begin(); it != barrier->end(); ++it)
            if (it->first.IsScalar() && it->first.Scalar() == "value") given.reset(it->second);
        error(given, which + " 'barrier' is " + quote(given.Scalar()) +
                         ", expected a barrier height >= 0 (kJ/mol or {value, unit})");
      }
      r.barrier_J_per_mol = V;
    } else {
      // {value: [[degrees, E], ...], unit: U} gives the energies in another unit.
      YAML::Node points = *scan;
      double J_per_unit = 1e3;
      if (scan->IsMap()) {
        Entries se = entries(*scan, which + " 'scan'", {"value", "values", "unit"});
        const YAML::Node* list = find(se, "value") ? find(se, "value") : find(se, "values");
        if (!list)
          error(*scan, which + " 'scan' has no 'value', expected {value: [[degrees, E], ...], unit: U}");
        points.reset(*list);  // reset, not =: assigning would overwrite the scan node itself
        if (const YAML::Node* unit = find(se, "unit")) {
          const std::string u = text(*unit, "'unit'");
          const std::optional<double> factor = to_energy_J_per_mol(1.0, u);
          if (!factor)
            error(*unit, "unknown energy unit " + quote(u) + ", expected one of " + energy_units_list());
          J_per_unit = *factor;
        }
      }
      if (!points.IsSequence())
        error(*scan, which + " 'scan' is " + describe(*scan) + ", expected a list of [degrees, kJ/mol]");
      for (const YAML::Node& point : points) {
        if (!point.IsSequence() || point.size() != 2)
          error(point, which + " scan point is " + describe(point) + ", expected [degrees, kJ/mol]");
        r.scan.push_back(
            {number(point[0], which + " scan angle"), number(point[1], which + " scan energy") * J_per_unit});
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
    if (const YAML::Node* moment = find(e, "moment")) {
      const std::string m = text(*moment, which + " 'moment'");
      if (m == "coupled")
        r.moment = RotorMoment::coupled;
      else if (m == "bond_axis")
        r.moment = RotorMoment::bond_axis;
      else
        error(*moment, which + " 'moment' is " + quote(m) +
                           ", expected coupled (to the overall rotation, the default) or bond_axis");
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

}  // namespace vibtherm
