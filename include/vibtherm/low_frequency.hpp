// Low-frequency vibrations and per-quantity frequency scaling: Grimme's qRRHO entropy with
// the Li–Head-Gordon enthalpy, the Truhlar wavenumber floor, and the modes they change, as a
// correction the engine adds to its harmonic vibrational sum.
#pragma once

#include <span>
#include <string>
#include <vector>

#include "vibtherm/partition.hpp"
#include "vibtherm/species.hpp"

namespace vibtherm {

const char* low_frequency_method_name(LowFrequencyMethod method);  // "harmonic", "qrrho", "floor"

struct LowFrequencyOptions {
  LowFrequencyMethod method = LowFrequencyMethod::harmonic;
  // qRRHO (Grimme, Chem. Eur. J. 18, 9955 (2012)): damping w = 1/(1 + (ω₀/ω)^α) with
  // ω₀ = 100 cm^-1, α = 4, and the average moment B_av = 1e-44 kg m² of eq. 6.
  double qrrho_omega0_cm1 = 100.0;
  double qrrho_exponent = 4.0;
  double qrrho_average_moment_kg_m2 = 1e-44;
  // Floor (Ribeiro, Marenich, Cramer & Truhlar, J. Phys. Chem. B 115, 14556 (2011)).
  double floor_cm1 = 100.0;
  // Modes below this wavenumber left harmonic are reported with their share of S°(298.15 K).
  double soft_mode_warning_below_cm1 = 50.0;
};

// Throws InputError for non-positive or non-finite parameters.
void check_low_frequency_options(const LowFrequencyOptions& options);

// Grimme's damping function w(ω) = 1 / (1 + (ω₀/ω)^α) (eq. 8): 1/2 at ω = ω₀.
double qrrho_weight(double wavenumber_cm1, double omega0_cm1, double exponent);

// Entropy of the free rotor that replaces a mode of this wavenumber (Grimme eqs. 4–6):
// μ = h / (8π² c ν̃), μ' = μ B_av / (μ + B_av), S/R = 1/2 + ln[(8π³ μ' k T / h²)^{1/2}].
double free_rotor_entropy_over_R(double wavenumber_cm1, double T_K, double average_moment_kg_m2);

// One vibration whose terms differ from the harmonic oscillator at `entropy_cm1` (the
// wavenumber the engine's harmonic sum uses): by the treatment, or because the enthalpy is
// computed at another scale factor (`enthalpy_cm1`).
struct AdjustedMode {
  int index = 0;              // 0-based, in PreparedSpecies::vibrations_cm1
  double entropy_cm1 = 0.0;   // wavenumber for S, Cp and ln q
  double enthalpy_cm1 = 0.0;  // wavenumber for the thermal enthalpy
  bool treated = false;       // the low-frequency treatment changes it (shown by `modes`, `report`)
  double qrrho_weight = 1.0;  // w(entropy_cm1) under qrrho, else 1
  double floor_cm1 = 0.0;     // the raised wavenumber under floor, else 0
};

struct VibrationAdjustment {
  LowFrequencyOptions options;
  std::vector<AdjustedMode> modes;  // ascending index
  const AdjustedMode* find(int index) const;
};

// qrrho interpolates every mode (w < 1 for all ω); `treated` marks those with w < 0.99
// (ω below 3.15 ω₀), the ones whose share visibly moves. floor raises the modes below the
// cutoff. Modes are also listed when the enthalpy wavenumber differs from the entropy one.
VibrationAdjustment plan_vibration_adjustment(const LowFrequencyOptions& options,
                                              std::span<const double> entropy_cm1,
                                              std::span<const double> enthalpy_cm1);

// The terms of one adjusted mode under the treatment: S, Cv, ln q from entropy_cm1; the
// thermal energy from enthalpy_cm1. qrrho: S = w S_HO + (1 − w) S_FR (Grimme eq. 7);
// U = w U_HO + (1 − w) RT/2 (Li, Gomes, Sharada, Bell & Head-Gordon, J. Phys. Chem. C 119,
// 1840 (2015)), applied to the thermal part above the zero-point level; Cv = dU/dT at the
// same wavenumber = w Cv_HO + (1 − w) R/2, since w does not depend on T. floor: the harmonic
// oscillator at max(ν̃, cutoff) for S, Cv and U. ln q = S/R − U/RT keeps G = H − TS.
MotionTerms adjusted_mode_terms(const LowFrequencyOptions& options, const AdjustedMode& mode, double T_K);

// Σ over the adjusted modes of (adjusted terms − harmonic terms at entropy_cm1): what the
// engine adds to its harmonic vibrational sum. Zero when there is nothing to adjust.
MotionTerms vibration_adjustment_terms(const VibrationAdjustment& adjustment, double T_K);

// A vibration below the warning threshold that stays a harmonic oscillator.
struct SoftMode {
  int index = 0;  // 0-based in vibrations_cm1
  double wavenumber_cm1 = 0.0;
  double S298_J_per_mol_K = 0.0;  // its harmonic entropy at 298.15 K
};

std::vector<SoftMode> soft_harmonic_modes(const VibrationAdjustment& adjustment,
                                          std::span<const double> vibrations_cm1);

// One-line warning for a soft mode, with its share of the species' S°(298.15 K).
std::string soft_mode_warning(const SoftMode& mode, double threshold_cm1, double total_S298_J_per_mol_K);

// One-line model note describing the treatment and the modes it changes ("" for harmonic).
std::string low_frequency_note(const VibrationAdjustment& adjustment);

}  // namespace vibtherm
