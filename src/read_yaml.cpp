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
#include "vibtherm/limits.hpp"
#include "vibtherm/read_species.hpp"
#include "vibtherm/species_builder.hpp"
#include "vibtherm/spelling.hpp"
#include "vibtherm/units.hpp"
#include "yaml_species_parts.hpp"

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
                                            "bonds",
                                            "from",
                                            "charge"};

// Keys that would redefine what a `from:` file gives (its geometry and force field).
const std::vector<std::string> not_with_from = {"atoms",
                                                "hessian",
                                                "hessian_unit",
                                                "mass",
                                                "rotational_constants",
                                                "moments_of_inertia",
                                                "linear",
                                                "formula",
                                                "conformers",
                                                "conformer_energies"};

// Keys an ensemble file may hold besides `conformers`: the rest comes from the conformers.
const std::vector<std::string> ensemble_keys = {
    "name", "conformers", "conformer_energies", "enthalpy_of_formation", "low_frequency", "scale"};

class YamlReader : public SpeciesYamlValues {
 public:
  explicit YamlReader(const std::string& file_name) : SpeciesYamlValues(file_name) {}

  Species read(const std::string& text);

 private:
  std::string name(const YAML::Node& node) const;
  void ensemble(const Entries& e, Species& species) const;
  void read_model_keys(const Entries& e, Species& species) const;
  Species from_file(const Entries& e, const YAML::Node& node) const;
  void read_energy_keys(const Entries& e, Species& species) const;
};

// electronic_energy (hartree when bare), method (a file beside this one), bonds (1-based pairs).
void YamlReader::read_energy_keys(const Entries& e, Species& species) const {
  if (const YAML::Node* n = find(e, "electronic_energy")) {
    species.electronic_energy_J_per_mol = energy_J_per_mol(*n, "'electronic_energy'", "hartree");
    limits::check_range(
        *species.electronic_energy_J_per_mol / (constants::hartree_J * constants::avogadro_per_mol),
        -limits::max_molecular_energy_hartree, limits::max_molecular_energy_hartree, "'electronic_energy'",
        "hartree", at(*n));
  }
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
      error(*f,
            what + " file " + quote(c.file) +
                (std::filesystem::exists(path)
                     ? " is not a regular file (a directory, device, FIFO or socket), expected a species file"
                     : " does not exist (paths are relative to this file)"));
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

// The species of a `from:` QC exchange file (path relative to this file), checked against
// the keys that cannot be combined with it.
Species YamlReader::from_file(const Entries& e, const YAML::Node& node) const {
  for (const std::string& key : not_with_from)
    if (find(e, key))
      error(e.at(key).key, "key " + quote(key) +
                               " cannot be combined with 'from' (the file gives the geometry " +
                               "and force field), expected 'frequencies' or 'isotopes' to change them");
  const std::string given = text(node, "'from'");
  const std::filesystem::path path = std::filesystem::path(given).is_absolute()
                                         ? std::filesystem::path(given)
                                         : std::filesystem::path(file()).parent_path() / given;
  if (!std::filesystem::is_regular_file(path))
    error(node, "'from' file " + quote(given) +
                    (std::filesystem::exists(path) ? " is not a regular file (a directory, device, FIFO or "
                                                     "socket), expected a QCSchema or Molden file"
                                                   : " does not exist (paths are relative to this file)"));
  Species species = read_exchange_file(path.string());
  species.source_files.push_back(path.string());
  return species;
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

  const YAML::Node* from_node = find(e, "from");
  Species species = from_node ? from_file(e, *from_node) : Species{};
  const YAML::Node* name_node = find(e, "name");
  if (!name_node && !from_node) error(root, "missing required key 'name', expected a label for the species");
  if (name_node) species.name = name(*name_node);
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
  } else if (from_node) {
    if (const YAML::Node* iso = find(e, "isotopes")) apply_isotopes(*iso, species.atoms);
    monatomic = species.atoms.size() == 1;
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
    species.hessian_J_per_m2.reset();  // frequencies here replace a `from:` file's Hessian or modes
    species.frequencies_cm1.clear();
    for (const Located& nu : wavenumbers(*f, "'frequencies'", false)) {
      if (nu.value == 0.0)
        error(nu.node, "frequency " + std::to_string(species.frequencies_cm1.size() + 1) +
                           " is 0, expected a non-zero wavenumber (negative for imaginary)");
      species.frequencies_cm1.push_back(nu.value);
    }
  } else if (from_node && !monatomic && !species.hessian_J_per_m2 && species.frequencies_cm1.empty()) {
    error(*from_node, "'from' file " + quote(from_node->Scalar()) +
                          " gives no Hessian or frequencies (a molecule, or an energy or gradient result), " +
                          "expected 'frequencies' here");
  } else if (!monatomic && !from_node) {
    error(root, "missing required key 'frequencies', expected a list of wavenumbers in cm^-1 " +
                    std::string("or a 'hessian' (only a single atom has neither)"));
  }

  if (const YAML::Node* s = find(e, "symmetry_number"))
    species.symmetry_number = positive_integer(*s, "'symmetry_number'");
  if (const YAML::Node* q = find(e, "charge")) {
    const double charge = number(*q, "'charge'");
    if (charge != std::floor(charge) || std::abs(charge) > 1000)
      error(*q, "'charge' is " + quote(q->Scalar()) + ", expected a whole number of elementary charges");
    species.charge = static_cast<int>(charge);
  }
  const YAML::Node* spin = find(e, "spin_multiplicity");
  const YAML::Node* levels = find(e, "electronic_levels");
  if (spin && levels)
    error(e["spin_multiplicity"].key,
          "both 'spin_multiplicity' and 'electronic_levels' given, expected one of them " +
              std::string("(the ground level's degeneracy in 'electronic_levels' includes the spin)"));
  if (spin) species.electronic_levels = {{0.0, positive_integer(*spin, "'spin_multiplicity'")}};
  if (levels) {
    species.electronic_levels = electronic_levels(*levels);
    species.key_locations.erase("spin_multiplicity");  // a `from:` file's multiplicity is replaced
  }
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

}  // namespace

Species read_species_yaml(const std::string& text, const std::string& file_name) {
  return YamlReader(file_name).read(text);
}

const std::vector<std::string>& yaml_species_keys() { return yaml_keys; }

}  // namespace vibtherm
