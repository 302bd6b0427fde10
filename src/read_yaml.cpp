// The YAML species reader (design.md section 4): checks form and units and converts to
// the Species model; physics checks (mode counts, rotor type) belong to the engine.
#include "vibtherm/read_yaml.hpp"

#include <fmt/format.h>
#include <yaml-cpp/yaml.h>

#include <algorithm>
#include <cctype>
#include <cmath>
#include <filesystem>
#include <set>

#include "vibtherm/constants.hpp"
#include "vibtherm/elements.hpp"
#include "vibtherm/hindered_rotor.hpp"
#include "vibtherm/read_species.hpp"
#include "vibtherm/species_builder.hpp"
#include "vibtherm/spelling.hpp"
#include "vibtherm/units.hpp"
#include "yaml_values.hpp"

namespace vibtherm {
namespace {

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
                                            "hessian_unit",
                                            "low_frequency",
                                            "scale",
                                            "tunnelling",
                                            "conformers",
                                            "conformer_energies",
                                            "surface_site",
                                            "electronic_energy",
                                            "method",
                                            "bonds"};

// Keys an ensemble file may hold besides `conformers`: the rest comes from the conformers.
const std::vector<std::string> ensemble_keys = {
    "name", "conformers", "conformer_energies", "enthalpy_of_formation", "low_frequency", "scale"};

class YamlReader : public YamlValues {
 public:
  explicit YamlReader(const std::string& file_name) : YamlValues(file_name) {}

  Species read(const std::string& text);

 private:
  std::string name(const YAML::Node& node) const;
  std::vector<Atom> atoms(const YAML::Node& node, std::vector<SourceLocation>& where) const;
  void apply_isotopes(const YAML::Node& node, std::vector<Atom>& atoms) const;
  std::vector<ElectronicLevel> electronic_levels(const YAML::Node& node) const;
  std::vector<double> positive_list(const YAML::Node& node, const std::string& what) const;
  std::map<std::string, int> formula(const YAML::Node& node) const;
  std::vector<double> hessian(const YAML::Node& node, const YAML::Node* unit_node,
                              std::size_t atom_count) const;
  std::vector<HinderedRotor> hindered_rotors(const YAML::Node& node, const Species& species) const;
  int atom_index(const YAML::Node& node, const std::string& what, std::size_t atom_count) const;
  void ensemble(const Entries& e, Species& species) const;
  void read_model_keys(const Entries& e, Species& species) const;
  void read_energy_keys(const Entries& e, Species& species) const;
};

// electronic_energy (hartree when bare), method (a file beside this one), bonds (1-based pairs).
void YamlReader::read_energy_keys(const Entries& e, Species& species) const {
  if (const YAML::Node* n = find(e, "electronic_energy"))
    species.electronic_energy_J_per_mol = energy_J_per_mol(*n, "'electronic_energy'", "hartree");
  if (const YAML::Node* m = find(e, "method")) {
    const std::filesystem::path given = YamlValues::text(*m, "'method'");
    species.method_file =
        (given.is_absolute() ? given : std::filesystem::path(file()).parent_path() / given).string();
  }
  if (const YAML::Node* b = find(e, "bonds")) {
    if (!b->IsSequence())
      error(*b, "'bonds' is " + describe(*b) + ", expected a list of atom pairs such as [[1, 2], [1, 3]]");
    std::vector<std::array<int, 2>> bonds;
    for (std::size_t i = 0; i < b->size(); ++i) {
      const YAML::Node pair = (*b)[i];
      const std::string what = fmt::format("bond {}", i + 1);
      if (!pair.IsSequence() || pair.size() != 2)
        error(pair, what + " is " + describe(pair) + ", expected two 1-based atom numbers [i, j]");
      const int a = atom_index(pair[0], what, species.atoms.size());
      const int c = atom_index(pair[1], what, species.atoms.size());
      if (a == c)
        error(pair,
              what + " joins atom " + std::to_string(a + 1) + " to itself, expected two different atoms");
      bonds.push_back({a, c});
    }
    species.bonds = std::move(bonds);
  }
}

// The model keys a species file and an ensemble file share: low_frequency, scale.
void YamlReader::read_model_keys(const Entries& e, Species& species) const {
  if (const YAML::Node* l = find(e, "low_frequency")) {
    const std::string method = YamlValues::text(*l, "'low_frequency'");
    if (method == "harmonic")
      species.low_frequency = LowFrequencyMethod::harmonic;
    else if (method == "qrrho")
      species.low_frequency = LowFrequencyMethod::qrrho;
    else if (method == "floor")
      species.low_frequency = LowFrequencyMethod::floor;
    else
      error(*l, "'low_frequency' is " + quote(method) + ", expected harmonic, qrrho or floor");
  }
  if (const YAML::Node* f = find(e, "scale")) species.scale = scale_factors(*f, "'scale'");
}

// Reads the conformer files of an ensemble (paths relative to this file), each a species
// file of its own without `conformers`.
void YamlReader::ensemble(const Entries& e, Species& species) const {
  for (const auto& [key, entry] : e)
    if (std::find(ensemble_keys.begin(), ensemble_keys.end(), key) == ensemble_keys.end())
      error(entry.key, "key " + quote(key) + " cannot be combined with 'conformers' (each conformer file " +
                           "gives its own structure and frequencies), expected only " + join(ensemble_keys));
  const YAML::Node& list = *find(e, "conformers");
  if (!list.IsSequence() || list.size() == 0)
    error(list, "'conformers' is " + describe(list) +
                    ", expected a list of {file, relative_energy} entries, one per conformer");
  if (const YAML::Node* b = find(e, "conformer_energies")) {
    const std::string basis = text(*b, "'conformer_energies'");
    if (basis == "zero_point_inclusive")
      species.conformer_energies_include_zpe = true;
    else if (basis != "electronic")
      error(*b, "'conformer_energies' is " + quote(basis) + ", expected electronic or zero_point_inclusive");
  }
  const std::filesystem::path here = std::filesystem::path(file()).parent_path();
  for (std::size_t i = 0; i < list.size(); ++i) {
    const std::string what = "conformer " + std::to_string(i + 1);
    if (!list[i].IsMap())
      error(list[i], what + " is " + describe(list[i]) + ", expected {file, relative_energy}");
    const Entries ce = entries(list[i], what, {"file", "relative_energy"});
    const YAML::Node* f = find(ce, "file");
    const YAML::Node* energy = find(ce, "relative_energy");
    if (!f || !energy)
      error(list[i], what + " needs 'file' and 'relative_energy' (kJ/mol, relative to the lowest)");
    Conformer c;
    c.where = at(list[i]);
    c.file = text(*f, what + " 'file'");
    c.relative_energy_J_per_mol = energy_J_per_mol(*energy, what + " 'relative_energy'");
    const std::string path = (here / c.file).string();
    if (!std::filesystem::is_regular_file(path))
      error(*f, what + " file " + quote(c.file) + " does not exist (paths are relative to this file)");
    c.species = read_species_file(path);
    if (!c.species.conformers.empty())
      error(*f, what + " file " + quote(c.file) + " is itself an ensemble, expected one structure");
    species.conformers.push_back(std::move(c));
  }
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

Species YamlReader::read(const std::string& text) {
  require_text(text, file());
  YAML::Node root = load_single_yaml_document(text, file(), "expected a YAML map of species keys",
                                              "expected one species per file");
  if (!root.IsDefined() || root.IsNull())
    fail({file(), 0, 0}, "file holds no species, expected a YAML map with at least 'name' and 'atoms'");
  if (!root.IsMap())
    error(root,
          "top level is " + describe(root) + ", expected a map of species keys such as 'name' and 'atoms'");

  Entries e = entries(root, "the species", yaml_keys);

  Species species;
  species.origin = {file(), 0, 0};
  const YAML::Node* name_node = find(e, "name");
  if (!name_node) error(root, "missing required key 'name', expected a label for the species");
  species.name = name(*name_node);
  species.origin = at(root);
  for (const auto& [key, entry] : e) species.key_locations[key] = at(entry.key);
  if (find(e, "conformers")) {
    ensemble(e, species);
    if (const YAML::Node* h = find(e, "enthalpy_of_formation"))
      species.enthalpy_of_formation_J_per_mol = energy_J_per_mol(*h, "'enthalpy_of_formation'");
  } else if (const YAML::Node* b = find(e, "conformer_energies")) {
    error(*b, "'conformer_energies' needs 'conformers', expected it only in an ensemble file");
  }
  if (find(e, "conformers")) {
    read_model_keys(e, species);
    return species;
  }

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
    species.enthalpy_of_formation_J_per_mol = energy_J_per_mol(*h, "'enthalpy_of_formation'");
  read_energy_keys(e, species);
  if (const YAML::Node* p = find(e, "phase")) {
    std::string phase = YamlValues::text(*p, "'phase'");
    if (phase == "gas")
      species.phase = Phase::gas;
    else if (phase == "adsorbate")
      species.phase = Phase::adsorbate;
    else
      error(*p, "'phase' is " + quote(phase) + ", expected gas or adsorbate");
  }
  if (const YAML::Node* site = find(e, "surface_site")) {
    const std::string symbol = YamlValues::text(*site, "'surface_site'");
    const bool shaped = (symbol.size() == 1 || symbol.size() == 2) &&
                        std::isupper(static_cast<unsigned char>(symbol[0])) &&
                        (symbol.size() == 1 || std::islower(static_cast<unsigned char>(symbol[1])));
    if (!shaped)
      error(*site,
            "'surface_site' is " + quote(symbol) + ", expected an element symbol of the site such as Pt");
    if (species.phase != Phase::adsorbate)
      error(e["surface_site"].key, "'surface_site' is for an adsorbate, expected 'phase: adsorbate' with it");
    species.surface_site = symbol;
  }
  if (const YAML::Node* t = find(e, "transition_state"))
    species.transition_state = boolean(*t, "'transition_state'");
  read_model_keys(e, species);
  if (const YAML::Node* t = find(e, "tunnelling")) {
    if (!t->IsMap())
      error(*t, "'tunnelling' is " + describe(*t) + ", expected a map {forward_barrier, reverse_barrier}");
    const Entries te = entries(*t, "'tunnelling'", {"forward_barrier", "reverse_barrier"});
    const YAML::Node* forward = find(te, "forward_barrier");
    const YAML::Node* reverse = find(te, "reverse_barrier");
    if (!forward || !reverse)
      error(*t,
            "'tunnelling' needs both 'forward_barrier' and 'reverse_barrier' (energies above the reactants "
            "and the products), expected e.g. {forward_barrier: 45.2, reverse_barrier: 80.1} in kJ/mol");
    TunnellingBarriers b{at(*t), energy_J_per_mol(*forward, "'forward_barrier'"),
                         energy_J_per_mol(*reverse, "'reverse_barrier'")};
    if (!(b.forward_J_per_mol > 0.0))
      error(*forward, "'forward_barrier' must be positive, expected the barrier above the reactants");
    if (!(b.reverse_J_per_mol > 0.0))
      error(*reverse, "'reverse_barrier' must be positive, expected the barrier above the products");
    species.tunnelling = b;
  }
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
      const double V = energy_J_per_mol(*barrier, which + " 'barrier'") / 1e3;
      if (V < 0.0)
        error(*barrier, which + " 'barrier' is " + quote(barrier->Scalar()) +
                            ", expected a barrier height >= 0 in kJ/mol");
      r.barrier_J_per_mol = V * 1e3;
    } else {
      // {value: [[degrees, E], ...], unit: U} gives the energies in another unit.
      YAML::Node points = *scan;
      double J_per_unit = 1e3;
      if (scan->IsMap()) {
        Entries se = entries(*scan, which + " 'scan'", {"value", "values", "unit"});
        const YAML::Node* list = find(se, "value") ? find(se, "value") : find(se, "values");
        if (!list)
          error(*scan, which + " 'scan' has no 'value', expected {value: [[degrees, E], ...], unit: U}");
        points = *list;
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

}  // namespace

Species read_species_yaml(const std::string& text, const std::string& file_name) {
  return YamlReader(file_name).read(text);
}

const std::vector<std::string>& yaml_species_keys() { return yaml_keys; }

}  // namespace vibtherm
