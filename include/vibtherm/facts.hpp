// Derived facts of a prepared species for `inspect`: formula, masses, rotor, symmetry,
// zero-point energy and mode counts. Pure computation; writers format it.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "vibtherm/thermo.hpp"

namespace vibtherm {

// One conformer of an ensemble, with its populations at SpeciesFacts::population_temperatures_K.
struct ConformerFacts {
  std::string file;
  double relative_energy_J_per_mol = 0.0;  // as given
  double zero_point_energy_J_per_mol = 0.0;
  double level_J_per_mol = 0.0;  // zero-point level above the ensemble's lowest
  std::vector<double> populations;
};

struct SpeciesFacts {
  std::string name;
  std::string formula;                // composition.hpp: Hill order with isotope labels, e.g. "CH4O", "D2O"
  double mass_amu = 0.0;              // isotopic mass used by the model
  double molar_mass_g_per_mol = 0.0;  // composition.hpp: isotope masses for labelled atoms (0 when unknown)
  bool isotope_labels = false;        // some atom carries an isotope label
  RotorType rotor = RotorType::atom;
  std::array<double, 3> moments_amu_A2{};
  std::vector<double> rotational_constants_cm1;
  std::vector<double> rotational_constants_GHz;
  std::vector<double> rotational_temperatures_K;
  int symmetry_number = 1;  // the one used
  std::string point_group;  // Schoenflies label (point_group.hpp); empty without a geometry
  bool chiral = false;
  bool racemic = false;  // R ln 2 added for the two enantiomers
  int atom_count = 0;
  int expected_modes = 0;
  int given_modes = 0;
  int imaginary_modes = 0;
  std::vector<double> frequencies_cm1;  // used (scaled), negative = imaginary reaction coordinate
  double zero_point_energy_J_per_mol = 0.0;
  std::string phase;  // "gas" or "adsorbate"
  int ground_degeneracy = 1;
  std::vector<std::string> warnings;
  std::vector<std::string> notes;
  std::string computed_with;                      // the QC exchange file's method/basis; empty: not recorded
  std::vector<double> population_temperatures_K;  // 298.15, 500, 1000 K for ensembles
  std::vector<ConformerFacts> conformers;
  std::optional<double> wigner_kappa_298;                 // transition states
  std::optional<double> eckart_kappa_298;                 // with barrier heights
  std::optional<double> enthalpy_of_formation_J_per_mol;  // ΔfH°(298.15 K), given or computed
  std::string enthalpy_of_formation_route;                // "given", or how it was computed
};

SpeciesFacts describe_species(const PreparedSpecies& prepared);

}  // namespace vibtherm
