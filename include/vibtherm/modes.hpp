// Frozen-out modes: how far each vibration and each motion is from its classical
// (equipartition) share at a temperature, as the Einstein heat capacity of every mode and
// the effective number of quadratic degrees of freedom F(T) = 2·Cv/R per motion.
#pragma once

#include <array>
#include <string>
#include <vector>

#include "vibtherm/thermo.hpp"

namespace vibtherm {

enum class ModeState { frozen, partial, active };
const char* mode_state_name(ModeState state);  // "frozen", "partial", "active"

// A mode is `frozen` while Cv/R < frozen_below, `active` once Cv/R > active_above, and
// `partial` in between (bounds included). 0.1 and 0.9 are our choice: symmetric about the
// half-activation point and wide enough that `partial` covers a factor of about 5 in T.
struct ActivationThresholds {
  double frozen_below_Cv_over_R = 0.1;
  double active_above_Cv_over_R = 0.9;
};

// Throws InputError unless 0 < frozen_below < active_above < 1.
void validate(const ActivationThresholds& thresholds);

ModeState classify_mode(double Cv_over_R, const ActivationThresholds& thresholds);

// Einstein heat-capacity function E(x) = x² eˣ/(eˣ − 1)² with x = θ/T (Einstein 1907):
// Cv/R of one harmonic oscillator, 1 in the classical limit x → 0.
double einstein_Cv_over_R(double x);

// The x = θ/T at which E(x) equals `Cv_over_R` (which must lie in (0, 1)). E falls
// monotonically from 1 to 0, so the root is unique; found by bisection to machine precision.
double einstein_x_at(double Cv_over_R);

// Characteristic quantities of one vibration, independent of temperature.
struct ModeConstants {
  int index = 0;           // 1-based, by ascending wavenumber (stable whatever rotors replace)
  int input_position = 0;  // 1-based position in the input's frequency list; 0 when unknown
  double wavenumber_cm1 = 0.0;
  double theta_K = 0.0;                      // θ = h c ν̃ / k
  double zero_point_energy_J_per_mol = 0.0;  // h c ν̃ N_A / 2
  double zero_point_share = 0.0;             // fraction of the species' vibrational zero-point energy
  double unfreezes_at_K = 0.0;               // Cv/R reaches the `frozen` threshold
  double half_active_at_K = 0.0;             // Cv/R = 1/2: half of its classical share
  double active_at_K = 0.0;                  // Cv/R reaches the `active` threshold
  // The low-frequency treatment (low_frequency.hpp) that changes this mode, "" when none;
  // the activation temperatures above are those of the harmonic oscillator.
  std::string treatment;
  int vibration = 0;          // 0-based position in PreparedSpecies::vibrations_cm1
  double qrrho_weight = 1.0;  // under qrrho: w(ν̃)
  double floor_cm1 = 0.0;     // under floor: the wavenumber used for S, Cp and H
};

// Effective quadratic degrees of freedom 2·Cv/R of each motion. `total` is translation +
// rotation + vibration + hindered rotors; the electronic part is not a set of quadratic terms and is apart.
struct DegreesOfFreedom {
  double translation = 0.0;
  double rotation = 0.0;
  double vibration = 0.0;
  double hindered_rotors = 0.0;  // classical limit 1 per rotor (free rotor); may exceed it near the barrier
  double total = 0.0;
  double electronic = 0.0;
};

struct ModeActivation {
  double Cv_over_R = 0.0;  // the mode's share of its classical value (1)
  ModeState state = ModeState::frozen;
};

// A hindered rotor as a row beside the vibrations: it runs from 2 quadratic terms (a
// torsional oscillator, Cv/R → 1) at low T to 1 (a free rotor, Cv/R → ½) at high T.
struct RotorConstants {
  int index = 0;              // 1-based, in input order
  std::array<int, 2> bond{};  // 1-based atoms of the axis
  int symmetry = 1;           // internal symmetry number
  double replaces_cm1 = 0.0;  // the torsional mode it replaces
};

struct ModesPoint {
  double T_K = 0.0;
  DegreesOfFreedom dof;                  // from the engine's per-motion terms at T
  std::vector<ModeActivation> modes;     // same order as ModesReport::modes; Cv/R under the treatment
  std::vector<double> rotors_Cv_over_R;  // same order as ModesReport::rotors
  int count(ModeState state) const;
};

struct ModesReport {
  std::string name;
  bool is_gas = true;
  RotorType rotor = RotorType::atom;
  ActivationThresholds thresholds;
  DegreesOfFreedom classical;        // equipartition limits; electronic is 0 (no classical limit)
  std::vector<ModeConstants> modes;  // ascending wavenumber
  std::vector<RotorConstants> rotors;
  std::vector<ModesPoint> points;  // one per temperature, in the order given
};

// Per-mode activation and per-motion degrees of freedom at each temperature. The motion
// values are the engine's (evaluate), so dof.total + dof.electronic equals
// 2·ThermoPoint::Cv_J_per_mol_K / R. An adsorbate has no translation or rotation.
ModesReport analyse_modes(const PreparedSpecies& prepared, const std::vector<double>& temperatures_K,
                          const ActivationThresholds& thresholds = {});

// `count` temperatures evenly spaced in ln T from low to high, both included (count ≥ 2):
// the sampling for pictures on a logarithmic temperature axis.
std::vector<double> log_spaced_temperatures(double low_K, double high_K, int count);

}  // namespace vibtherm
