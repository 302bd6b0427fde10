// The thermochemistry engine: prepares a species under the model options (rotor analysis,
// mode-count and imaginary-frequency policy, scaling) and evaluates the ideal-gas (or
// adsorbate) functions at any temperature, with the per-motion breakdown.
#pragma once

#include <array>
#include <optional>
#include <string>
#include <vector>

#include "vibtherm/constants.hpp"
#include "vibtherm/geometry.hpp"
#include "vibtherm/hindered_rotor.hpp"
#include "vibtherm/low_frequency.hpp"
#include "vibtherm/partition.hpp"
#include "vibtherm/point_group.hpp"
#include "vibtherm/scale_factors.hpp"
#include "vibtherm/species.hpp"
#include "vibtherm/tunnelling.hpp"

namespace vibtherm {

enum class StandardState { bar, atm, molar };  // 1 bar (IUPAC default), 1 atm, 1 mol/L

struct ModelOptions {
  StandardState standard_state = StandardState::bar;
  double pressure_Pa = constants::bar_Pa;  // used for bar/atm; overrides if set explicitly
  double frequency_scale = 1.0;            // multiplies every wavenumber (one for all quantities)
  ScaleFactors scale;                      // per quantity; each overrides frequency_scale and the file
  std::optional<LowFrequencyMethod> low_frequency_method;  // overrides the species' low_frequency
  LowFrequencyOptions low_frequency;                       // parameters; its method is set from the two above
  bool transition_state = false;                           // drop one imaginary mode as reaction coordinate
  double imaginary_as_real_below_cm1 = 0.0;  // |ν̃| below this: treated as real, with a warning
  bool mode_count_mismatch_is_warning = false;
  double linear_tolerance_amu_A2 = default_linear_tolerance_amu_A2;
  double symmetry_tolerance_angstrom = default_symmetry_tolerance_angstrom;  // point-group detection
  bool racemic = false;  // a chiral species as a racemic mixture: S + R ln 2 (optical isomers)
  // The highest temperature the prepared species will be evaluated at: hindered-rotor level
  // sums are converged up to it (at least 298.15 K) and refused above it. Each subcommand
  // sets it from its temperatures and fit range; the default covers the default NASA-9 range.
  double max_temperature_K = 6000.0;
};

struct ConformerMember;

struct PreparedSpecies {
  Species species;
  ModelOptions options;
  RotorAnalysis rotor;
  std::optional<PointGroup> point_group;  // of the geometry (absent without atoms, or an adsorbate)
  bool racemic = false;                   // R ln 2 added to S (options.racemic and a chiral geometry)
  bool is_gas = true;
  std::vector<double> vibrations_cm1;  // real wavenumbers used, scaled, input order,
                                       // without the torsions replaced by hindered rotors
  std::vector<HinderedRotorModel> hindered_rotors;
  ResolvedScaleFactors scale;                           // factors used (vibrations_cm1 carry the entropy one)
  VibrationAdjustment vibration_adjustment;             // low-frequency treatment and enthalpy scaling
  std::optional<TransitionStateTunnelling> tunnelling;  // transition states: κ(T) reported beside
  std::vector<double> used_frequencies_cm1;  // as reported: includes a dropped reaction coordinate (negative)
  double zero_point_energy_J_per_mol = 0.0;  // harmonic ½hcν̃ sum plus the rotors' own ZPE
  double H298_minus_H0_J_per_mol = 0.0;      // thermal enthalpy at 298.15 K, the table's reference
  std::vector<std::string> warnings;         // things the user must see
  std::vector<std::string> notes;            // model choices worth stating
  // How species.enthalpy_of_formation was computed (formation.hpp), e.g. "atomization with
  // method 'X'"; empty when it was given or is absent.
  std::string enthalpy_of_formation_route;
  // An ensemble (species.conformers): its members; the fields above then describe the
  // member with the lowest zero-point level, except name, origin, ΔfH°, ZPE and H298.
  std::vector<ConformerMember> conformers;
};

struct ConformerMember {
  std::string file;                        // as given in the ensemble file
  PreparedSpecies prepared;                // prepared on its own under the same options
  double relative_energy_J_per_mol = 0.0;  // as given (electronic, or ZPE-inclusive)
  double level_J_per_mol = 0.0;            // its zero-point level above the ensemble's lowest
};

// Boltzmann populations of an ensemble's conformers at T (empty for a single structure).
std::vector<double> conformer_populations(const PreparedSpecies& prepared, double T_K);

// Refuses options outside limits.hpp (scale factor, pressure, imaginary threshold).
void check_model_options(const ModelOptions& options);

// Validates and prepares. Throws InputError (located at the species file) for imaginary
// frequencies not allowed by the options and for a wrong mode count unless downgraded.
PreparedSpecies prepare_species(const Species& species, const ModelOptions& options = {});

struct ThermoPoint {
  double T_K = 0.0;
  MotionTerms translation, rotation, vibration, electronic;  // dimensionless, per motion
  MotionTerms internal_rotation;                             // all hindered rotors together
  MotionTerms conformers;  // ensembles: mixing and level terms beyond the population-weighted motions
  double Cv_J_per_mol_K = 0.0;
  double Cp_J_per_mol_K = 0.0;
  double S_J_per_mol_K = 0.0;
  double H_minus_H0_J_per_mol = 0.0;  // thermal enthalpy above the 0 K (zero-point) level
  double H_minus_H298_J_per_mol = 0.0;
  double G_minus_H298_J_per_mol = 0.0;
  double gibbs_function_J_per_mol_K = 0.0;  // −[G(T) − H(298.15 K)] / T
};

// The motions of a ThermoPoint by their output name, in output order (every writer's
// per-motion breakdown uses this one list, so a part has one name everywhere).
struct MotionPart {
  const char* name;
  const MotionTerms ThermoPoint::*terms;
};
inline constexpr std::array<MotionPart, 5> motion_parts{{{"translation", &ThermoPoint::translation},
                                                         {"rotation", &ThermoPoint::rotation},
                                                         {"vibration", &ThermoPoint::vibration},
                                                         {"hindered_rotors", &ThermoPoint::internal_rotation},
                                                         {"electronic", &ThermoPoint::electronic}}};

ThermoPoint evaluate(const PreparedSpecies& prepared, double T_K);
std::vector<ThermoPoint> tabulate(const PreparedSpecies& prepared, const std::vector<double>& temperatures_K);

// Classical (equipartition) limit of Cv/R: translation 3/2, rotation 1 or 3/2, one per
// vibration, ½ per hindered rotor (its free-rotor limit); for an adsorbate 3N.
double classical_Cv_over_R(const PreparedSpecies& prepared);

}  // namespace vibtherm
