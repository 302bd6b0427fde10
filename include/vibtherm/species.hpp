// The species model: what a frequency job tells us about one molecule, radical,
// transition state or adsorbate, in SI-friendly units, independent of the input format.
#pragma once

#include <Eigen/Core>
#include <array>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "vibtherm/error.hpp"

namespace vibtherm {

enum class Phase { gas, adsorbate };

// Treatment of low-frequency vibrations (low_frequency.hpp): harmonic oscillators,
// Grimme's quasi-rigid-rotor-harmonic-oscillator interpolation, or a wavenumber floor.
enum class LowFrequencyMethod { harmonic, qrrho, floor };

// Frequency scale factors per quantity, as given (input key `scale`, or a method file);
// an absent factor falls back to the one-for-all --scale.
struct ScaleFactors {
  std::optional<double> zpe;       // zero-point energy
  std::optional<double> enthalpy;  // thermal enthalpy H(T) - H(0)
  std::optional<double> entropy;   // entropy and heat capacity
  bool empty() const { return !zpe && !enthalpy && !entropy; }
};

struct Atom {
  std::string symbol;     // element symbol, e.g. "C"
  std::string isotope;    // isotope label as given ("D", "C13"); empty = most abundant
  int mass_number = 0;    // mass number of the isotope used
  double mass_amu = 0.0;  // mass of the isotope used
  Eigen::Vector3d position_angstrom = Eigen::Vector3d::Zero();
};

struct ElectronicLevel {
  double energy_cm1 = 0.0;  // above the ground level
  int degeneracy = 1;
};

// One point of a torsional scan: dihedral change in degrees, energy in J/mol.
struct ScanPoint {
  double angle_deg = 0.0;
  double energy_J_per_mol = 0.0;
};

// A hindered internal rotor as given (design.md section 4); hindered_rotor.hpp builds it.
// How a rotor's reduced moment is defined (hindered_rotor.hpp).
enum class RotorMoment { coupled, bond_axis };

struct HinderedRotor {
  SourceLocation where;                       // the rotor's entry in the species file
  std::array<int, 2> bond_atoms{0, 1};        // 0-based atoms of the rotation axis
  int symmetry = 1;                           // internal symmetry number, period of V
  std::optional<double> barrier_J_per_mol;    // V(φ) = V/2 (1 − cos(symmetry·φ)), or
  std::vector<ScanPoint> scan;                // a scan instead
  std::vector<int> top_atoms;                 // 0-based side of bond atom 1; empty = by connectivity
  RotorMoment moment = RotorMoment::coupled;  // input key `moment`
  double replaces_cm1 = 0.0;                  // wavenumber of the torsional mode replaced
};

// Barrier heights of a transition state for the Eckart tunnelling correction (tunnelling.hpp).
struct TunnellingBarriers {
  SourceLocation where;
  double forward_J_per_mol = 0.0;  // from the reactant side
  double reverse_J_per_mol = 0.0;  // from the product side
};

// Alternative to atoms: the rigid-rotor data given directly.
struct RigidRotorData {
  double mass_amu = 0.0;
  std::vector<double> moments_amu_A2;  // 1 value (linear) or 3; empty for an atom
  bool linear = false;
};

struct Conformer;

struct Species {
  std::string name;
  SourceLocation origin;  // file the species came from
  // Where each top-level key was given (YAML), so checks made after reading point at the key
  // at fault; key_location() falls back to `origin`.
  std::map<std::string, SourceLocation> key_locations;
  std::vector<Atom> atoms;  // empty when `rotor_data` is used
  std::optional<RigidRotorData> rotor_data;
  std::map<std::string, int> formula;   // element -> count; from atoms or `formula`
  std::vector<double> frequencies_cm1;  // as given; negative = imaginary
  // Cartesian Hessian instead of frequencies: 3N×3N, row-major, x1 y1 z1 x2 ..., in J/m²
  // (energy per molecule). prepare_species (thermo.hpp) turns it into frequencies once the
  // phase and rotor type are known, with the atoms' (isotope) masses.
  std::optional<std::vector<double>> hessian_J_per_m2;
  // External symmetry number as given; absent: detected from `atoms` (point_group.hpp). After
  // prepare_species it holds the one used.
  std::optional<int> symmetry_number;
  // As given (`spin_multiplicity` or `electronic_levels`); empty: from the electron count's
  // parity (electrons.hpp). After prepare_species it holds the levels used.
  std::vector<ElectronicLevel> electronic_levels;
  std::optional<double> enthalpy_of_formation_J_per_mol;  // ΔfH°(298.15 K)
  // Total electronic energy at the equilibrium geometry (input key `electronic_energy`,
  // hartree when bare; or a QC exchange file), molar: formation.hpp turns it into ΔfH°.
  std::optional<double> electronic_energy_J_per_mol;
  // Method file (input key `method`, resolved against the species file's folder; empty: none)
  // whose atomic energies make `electronic_energy` an enthalpy of formation (method.hpp).
  std::string method_file;
  // Files read besides `origin` for this species (a `from` file), as opened.
  std::vector<std::string> source_files;
  // Bonds for bond-additivity corrections (input key `bonds`, 0-based atom pairs); when
  // absent they are perceived from the geometry (bonds.hpp).
  std::optional<std::vector<std::array<int, 2>>> bonds;
  int charge = 0;  // net charge in elementary charges (input key `charge`, or a QC exchange file)
  // What the reader wants the user told (a QC file's method and basis, modes it dropped):
  // prepare_species passes them on as notes.
  std::vector<std::string> reader_notes;
  std::string computed_with;  // a QC exchange file's method/basis ("B3LYP/def2-TZVP"); empty: unknown
  Phase phase = Phase::gas;
  // Adsorbate only: the site's element symbol (e.g. "Pt"), added once to the composition of
  // the NASA record as surface-kinetics files expect; not part of the molar mass. Empty: none.
  std::string surface_site;
  bool transition_state = false;
  std::vector<HinderedRotor> hindered_rotors;
  std::optional<LowFrequencyMethod> low_frequency;  // input key; --low-freq overrides
  ScaleFactors scale;                               // input key `scale`
  std::optional<TunnellingBarriers> tunnelling;     // input key `tunnelling` (transition states)
  // A Boltzmann ensemble of conformers instead of one structure (conformers.hpp); each
  // brings its own geometry, symmetry number, frequencies and zero-point energy.
  std::vector<Conformer> conformers;
  bool conformer_energies_include_zpe = false;  // `conformer_energies: zero_point_inclusive`
};

struct Conformer {
  SourceLocation where;                    // the entry in the ensemble's file
  std::string file;                        // as written (relative to the ensemble's file)
  Species species;                         // read from `file`
  double relative_energy_J_per_mol = 0.0;  // electronic (or ZPE-inclusive), relative to the lowest
};

inline SourceLocation key_location(const Species& species, const std::string& key) {
  const auto it = species.key_locations.find(key);
  return it == species.key_locations.end() ? species.origin : it->second;
}

}  // namespace vibtherm
