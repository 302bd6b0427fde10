#include "vibtherm/modes.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <limits>

#include "vibtherm/constants.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/partition.hpp"

namespace vibtherm {

const char* mode_state_name(ModeState state) {
  switch (state) {
    case ModeState::frozen:
      return "frozen";
    case ModeState::partial:
      return "partial";
    case ModeState::active:
      return "active";
  }
  return "";
}

void validate(const ActivationThresholds& thresholds) {
  const double low = thresholds.frozen_below_Cv_over_R;
  const double high = thresholds.active_above_Cv_over_R;
  if (!(low > 0.0 && low < 1.0) || !(high > 0.0 && high < 1.0) || !(low < high))
    fail({}, fmt::format("activation thresholds must satisfy 0 < frozen-below < active-above < 1 (Cv/R of a "
                         "mode), got frozen-below {} and active-above {}",
                         low, high));
}

ModeState classify_mode(double Cv_over_R, const ActivationThresholds& thresholds) {
  if (Cv_over_R < thresholds.frozen_below_Cv_over_R) return ModeState::frozen;
  if (Cv_over_R > thresholds.active_above_Cv_over_R) return ModeState::active;
  return ModeState::partial;
}

double einstein_Cv_over_R(double x) {
  // Series E(x) = 1 − x²/12 + x⁴/240 − … (expansion of the Einstein function, common
  // practice) where the closed form loses digits to 0/0.
  if (x < 1e-4) return 1.0 - x * x / 12.0;
  // x² e^{−x}/(1 − e^{−x})², the same value as x² eˣ/(eˣ − 1)² without overflow at large x.
  const double one_minus_e = -std::expm1(-x);
  return x * x * std::exp(-x) / (one_minus_e * one_minus_e);
}

double einstein_x_at(double Cv_over_R) {
  if (!(Cv_over_R > 0.0 && Cv_over_R < 1.0))
    fail({}, fmt::format("Cv/R of a harmonic mode lies between 0 and 1, got {}", Cv_over_R));
  // E(x) < 1e-300 past x ≈ 700; the bracket [0, 750] holds every representable target.
  double low = 0.0, high = 750.0;  // E(low) > target > E(high)
  for (int i = 0; i < 200 && high - low > 4 * std::numeric_limits<double>::epsilon() * high; ++i) {
    const double mid = 0.5 * (low + high);
    (einstein_Cv_over_R(mid) > Cv_over_R ? low : high) = mid;
  }
  return 0.5 * (low + high);
}

int ModesPoint::count(ModeState state) const {
  return static_cast<int>(std::count_if(modes.begin(), modes.end(),
                                        [state](const ModeActivation& m) { return m.state == state; }));
}

namespace {

DegreesOfFreedom classical_limits(const PreparedSpecies& prepared, RotorType rotor) {
  // Equipartition (common practice): ½ R per quadratic term, i.e. 3 terms for translation,
  // 2 or 3 for a linear or nonlinear rotor, 2 (kinetic + potential) per harmonic vibration.
  DegreesOfFreedom c;
  if (prepared.is_gas) {
    c.translation = 3.0;
    c.rotation = rotor == RotorType::linear ? 2.0 : rotor == RotorType::nonlinear ? 3.0 : 0.0;
  }
  c.vibration = 2.0 * static_cast<double>(prepared.vibrations_cm1.size());
  // A hindered rotor tends to a free rotor at high T: one quadratic (kinetic) term.
  c.hindered_rotors = static_cast<double>(prepared.hindered_rotors.size());
  c.total = c.translation + c.rotation + c.vibration + c.hindered_rotors;
  return c;
}

}  // namespace

ModesReport analyse_modes(const PreparedSpecies& prepared, const std::vector<double>& temperatures_K,
                          const ActivationThresholds& thresholds) {
  validate(thresholds);
  ModesReport report;
  report.name = prepared.species.name;
  report.is_gas = prepared.is_gas;
  report.rotor = prepared.rotor.type;
  report.thresholds = thresholds;
  report.classical = classical_limits(prepared, prepared.rotor.type);

  // T at which a mode reaches a given Cv/R is θ/x with x a constant of the Einstein function.
  const double x_unfreeze = einstein_x_at(thresholds.frozen_below_Cv_over_R);
  const double x_half = einstein_x_at(0.5);
  const double x_active = einstein_x_at(thresholds.active_above_Cv_over_R);
  double sum_cm1 = 0.0;
  for (double v : prepared.vibrations_cm1) sum_cm1 += v;
  // Input positions: each vibration is the first unclaimed wavenumber of the reported list
  // with its value (a treated-as-real imaginary mode is listed with its real value).
  std::vector<char> claimed(prepared.used_frequencies_cm1.size(), 0);
  for (size_t k = 0; k < prepared.vibrations_cm1.size(); ++k) {
    const double v = prepared.vibrations_cm1[k];
    ModeConstants m;
    m.vibration = static_cast<int>(k);
    for (size_t j = 0; j < claimed.size(); ++j)
      if (!claimed[j] && prepared.used_frequencies_cm1[j] == v) {
        claimed[j] = 1;
        m.input_position = static_cast<int>(j) + 1;
        break;
      }
    m.wavenumber_cm1 = v;
    m.theta_K = characteristic_temperature_K(m.wavenumber_cm1);
    // Zero-point energy of a harmonic oscillator, h c ν̃ / 2 per molecule (common practice).
    m.zero_point_energy_J_per_mol = 0.5 * m.wavenumber_cm1 * constants::wavenumber_J_per_mol;
    m.zero_point_share = sum_cm1 > 0.0 ? m.wavenumber_cm1 / sum_cm1 : 0.0;
    m.unfreezes_at_K = m.theta_K / x_unfreeze;
    m.half_active_at_K = m.theta_K / x_half;
    m.active_at_K = m.theta_K / x_active;
    if (const AdjustedMode* a = prepared.vibration_adjustment.find(m.vibration); a && a->treated) {
      m.treatment = low_frequency_method_name(prepared.vibration_adjustment.options.method);
      m.qrrho_weight = a->qrrho_weight;
      m.floor_cm1 = a->floor_cm1;
    }
    report.modes.push_back(m);
  }
  std::stable_sort(
      report.modes.begin(), report.modes.end(),
      [](const ModeConstants& a, const ModeConstants& b) { return a.wavenumber_cm1 < b.wavenumber_cm1; });
  for (size_t i = 0; i < report.modes.size(); ++i) report.modes[i].index = static_cast<int>(i) + 1;
  for (size_t i = 0; i < prepared.hindered_rotors.size(); ++i) {
    const HinderedRotor& in = prepared.hindered_rotors[i].input;
    report.rotors.push_back({static_cast<int>(i) + 1,
                             {in.bond_atoms[0] + 1, in.bond_atoms[1] + 1},
                             in.symmetry,
                             in.replaces_cm1});
  }

  report.points.reserve(temperatures_K.size());
  for (double T : temperatures_K) {
    const ThermoPoint terms = evaluate(prepared, T);
    ModesPoint point;
    point.T_K = T;
    point.dof.translation = 2.0 * terms.translation.Cv_over_R;
    point.dof.rotation = 2.0 * terms.rotation.Cv_over_R;
    point.dof.vibration = 2.0 * terms.vibration.Cv_over_R;
    point.dof.hindered_rotors = 2.0 * terms.internal_rotation.Cv_over_R;
    point.dof.electronic = 2.0 * terms.electronic.Cv_over_R;
    point.dof.total =
        point.dof.translation + point.dof.rotation + point.dof.vibration + point.dof.hindered_rotors;
    point.modes.reserve(report.modes.size());
    for (const ModeConstants& m : report.modes) {
      // The engine's own oscillator (or its low-frequency treatment, or the enthalpy-scaled
      // mode), so the modes add up to its vibrational term.
      const AdjustedMode* a = prepared.vibration_adjustment.find(m.vibration);
      const double share = a ? adjusted_mode_terms(prepared.vibration_adjustment.options, *a, T).Cv_over_R
                             : harmonic_oscillator_terms(m.wavenumber_cm1, T).Cv_over_R;
      point.modes.push_back({share, classify_mode(share, thresholds)});
    }
    for (const HinderedRotorModel& r : prepared.hindered_rotors)
      point.rotors_Cv_over_R.push_back(hindered_rotor_terms(r.levels, r.input.symmetry, T).Cv_over_R);
    report.points.push_back(std::move(point));
  }
  return report;
}

std::vector<double> log_spaced_temperatures(double low_K, double high_K, int count) {
  if (!(low_K > 0.0) || !(high_K > low_K) || count < 2)
    fail({},
         fmt::format("log-spaced temperatures need 0 < low < high and at least 2 points, got {} K to {} K, "
                     "{} points",
                     low_K, high_K, count));
  std::vector<double> temperatures(static_cast<size_t>(count));
  const double ln_low = std::log(low_K), step = (std::log(high_K) - ln_low) / (count - 1);
  for (int i = 0; i < count; ++i) temperatures[static_cast<size_t>(i)] = std::exp(ln_low + step * i);
  temperatures.front() = low_K;  // exact ends, free of exp/log rounding
  temperatures.back() = high_K;
  return temperatures;
}

}  // namespace vibtherm
