#include "vibtherm/low_frequency.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "vibtherm/constants.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/limits.hpp"

namespace vibtherm {

namespace c = constants;

const char* low_frequency_method_name(LowFrequencyMethod method) {
  switch (method) {
    case LowFrequencyMethod::harmonic:
      return "harmonic";
    case LowFrequencyMethod::qrrho:
      return "qrrho";
    case LowFrequencyMethod::floor:
      return "floor";
  }
  return "";
}

void check_low_frequency_options(const LowFrequencyOptions& o) {
  const auto check = [](double value, const char* what) {
    if (!(value > 0.0) || !std::isfinite(value))
      fail({}, fmt::format("{} must be a positive finite number, got {}", what, value));
  };
  check(o.qrrho_exponent, "the qRRHO damping exponent");
  check(o.qrrho_average_moment_kg_m2, "the qRRHO average moment of inertia");
  // Wavenumbers within the range accepted for vibrations (limits.hpp).
  limits::check_range(o.qrrho_omega0_cm1, limits::min_wavenumber_cm1, limits::max_wavenumber_cm1,
                      "the qRRHO reference wavenumber (--qrrho-omega0)", "cm^-1");
  limits::check_range(o.floor_cm1, limits::min_wavenumber_cm1, limits::max_wavenumber_cm1,
                      "the wavenumber floor (--low-freq-floor)", "cm^-1");
  limits::check_range(o.soft_mode_warning_below_cm1, 0.0, limits::max_wavenumber_cm1,
                      "the soft-mode warning threshold (--soft-mode-warning)", "cm^-1");
}

double qrrho_weight(double wavenumber_cm1, double omega0_cm1, double exponent) {
  // Grimme 2012, eq. 8. At ω = ω₀ the ratio is exactly 1, so w is exactly 1/2.
  return 1.0 / (1.0 + std::pow(omega0_cm1 / wavenumber_cm1, exponent));
}

double free_rotor_entropy_over_R(double wavenumber_cm1, double T_K, double average_moment_kg_m2) {
  // Grimme 2012, eqs. 4–6: the moment of a free rotor with the mode's frequency,
  // μ = h / (8π² ν), ν = c ν̃, bounded by the average molecular moment B_av.
  const double nu_Hz = c::speed_of_light_m_s * 100.0 * wavenumber_cm1;
  const double mu = c::planck_J_s / (8.0 * c::pi * c::pi * nu_Hz);
  const double mu_eff = mu * average_moment_kg_m2 / (mu + average_moment_kg_m2);
  const double arg =
      8.0 * c::pi * c::pi * c::pi * mu_eff * c::boltzmann_J_per_K * T_K / (c::planck_J_s * c::planck_J_s);
  return 0.5 + 0.5 * std::log(arg);
}

const AdjustedMode* VibrationAdjustment::find(int index) const {
  auto it = std::lower_bound(modes.begin(), modes.end(), index,
                             [](const AdjustedMode& m, int i) { return m.index < i; });
  return it != modes.end() && it->index == index ? &*it : nullptr;
}

VibrationAdjustment plan_vibration_adjustment(const LowFrequencyOptions& options,
                                              std::span<const double> entropy_cm1,
                                              std::span<const double> enthalpy_cm1) {
  check_low_frequency_options(options);
  VibrationAdjustment plan;
  plan.options = options;
  for (std::size_t i = 0; i < entropy_cm1.size(); ++i) {
    AdjustedMode m;
    m.index = static_cast<int>(i);
    m.entropy_cm1 = entropy_cm1[i];
    m.enthalpy_cm1 = i < enthalpy_cm1.size() ? enthalpy_cm1[i] : entropy_cm1[i];
    bool listed = m.enthalpy_cm1 != m.entropy_cm1;
    if (options.method == LowFrequencyMethod::qrrho) {
      m.qrrho_weight = qrrho_weight(m.entropy_cm1, options.qrrho_omega0_cm1, options.qrrho_exponent);
      m.treated = m.qrrho_weight < 0.99;
      listed = true;  // every mode is interpolated
    } else if (options.method == LowFrequencyMethod::floor &&
               std::min(m.entropy_cm1, m.enthalpy_cm1) < options.floor_cm1) {
      m.floor_cm1 = options.floor_cm1;
      m.treated = true;
      listed = true;
    }
    if (listed) plan.modes.push_back(m);
  }
  return plan;
}

MotionTerms adjusted_mode_terms(const LowFrequencyOptions& options, const AdjustedMode& mode, double T_K) {
  MotionTerms t;
  switch (options.method) {
    case LowFrequencyMethod::harmonic: {
      t = harmonic_oscillator_terms(mode.entropy_cm1, T_K);
      const double U = harmonic_oscillator_terms(mode.enthalpy_cm1, T_K).U_over_RT;
      t.U_over_RT = t.H_over_RT = U;
      break;
    }
    case LowFrequencyMethod::floor: {
      t = harmonic_oscillator_terms(std::max(mode.entropy_cm1, options.floor_cm1), T_K);
      const double U =
          harmonic_oscillator_terms(std::max(mode.enthalpy_cm1, options.floor_cm1), T_K).U_over_RT;
      t.U_over_RT = t.H_over_RT = U;
      break;
    }
    case LowFrequencyMethod::qrrho: {
      const MotionTerms ho = harmonic_oscillator_terms(mode.entropy_cm1, T_K);
      const double w = mode.qrrho_weight;
      const double S_rotor =
          free_rotor_entropy_over_R(mode.entropy_cm1, T_K, options.qrrho_average_moment_kg_m2);
      t.S_over_R = w * ho.S_over_R + (1.0 - w) * S_rotor;
      // A free rotor's thermal energy and heat capacity are ½RT and ½R.
      t.Cv_over_R = t.Cp_over_R = w * ho.Cv_over_R + (1.0 - w) * 0.5;
      const double wH = qrrho_weight(mode.enthalpy_cm1, options.qrrho_omega0_cm1, options.qrrho_exponent);
      const double U_ho = mode.enthalpy_cm1 == mode.entropy_cm1
                              ? ho.U_over_RT
                              : harmonic_oscillator_terms(mode.enthalpy_cm1, T_K).U_over_RT;
      t.U_over_RT = t.H_over_RT = wH * U_ho + (1.0 - wH) * 0.5;
      break;
    }
  }
  t.ln_q = t.S_over_R - t.U_over_RT;
  return t;
}

MotionTerms vibration_adjustment_terms(const VibrationAdjustment& adjustment, double T_K) {
  MotionTerms sum;
  for (const AdjustedMode& m : adjustment.modes) {
    const MotionTerms adjusted = adjusted_mode_terms(adjustment.options, m, T_K);
    const MotionTerms harmonic = harmonic_oscillator_terms(m.entropy_cm1, T_K);
    sum.ln_q += adjusted.ln_q - harmonic.ln_q;
    sum.U_over_RT += adjusted.U_over_RT - harmonic.U_over_RT;
    sum.H_over_RT += adjusted.H_over_RT - harmonic.H_over_RT;
    sum.Cv_over_R += adjusted.Cv_over_R - harmonic.Cv_over_R;
    sum.Cp_over_R += adjusted.Cp_over_R - harmonic.Cp_over_R;
    sum.S_over_R += adjusted.S_over_R - harmonic.S_over_R;
  }
  return sum;
}

std::vector<SoftMode> soft_harmonic_modes(const VibrationAdjustment& adjustment,
                                          std::span<const double> vibrations_cm1) {
  std::vector<SoftMode> soft;
  const double R = c::gas_constant_J_per_mol_K;
  for (std::size_t i = 0; i < vibrations_cm1.size(); ++i) {
    const double v = vibrations_cm1[i];
    if (!(v < adjustment.options.soft_mode_warning_below_cm1)) continue;
    const AdjustedMode* m = adjustment.find(static_cast<int>(i));
    if (m && m->treated) continue;
    soft.push_back(
        {static_cast<int>(i), v, R * harmonic_oscillator_terms(v, c::reference_temperature_K).S_over_R});
  }
  return soft;
}

std::string soft_mode_warning(const SoftMode& mode, double threshold_cm1, double total_S298_J_per_mol_K) {
  return fmt::format(
      "vibration {} at {:.1f} cm^-1 (below {:g} cm^-1) is treated as a harmonic oscillator and gives "
      "{:.2f} J/(mol K), {:.1f} % of S°(298.15 K); consider --low-freq qrrho or floor, or a hindered rotor",
      mode.index + 1, mode.wavenumber_cm1, threshold_cm1, mode.S298_J_per_mol_K,
      100.0 * mode.S298_J_per_mol_K / total_S298_J_per_mol_K);
}

std::string low_frequency_note(const VibrationAdjustment& a) {
  const LowFrequencyOptions& o = a.options;
  std::string changed;
  for (const AdjustedMode& m : a.modes) {
    if (!m.treated) continue;
    changed += changed.empty() ? "" : ", ";
    changed += o.method == LowFrequencyMethod::qrrho
                   ? fmt::format("{} ({:.1f} cm^-1, w = {:.3f})", m.index + 1, m.entropy_cm1, m.qrrho_weight)
                   : fmt::format("{} ({:.1f} cm^-1)", m.index + 1, m.entropy_cm1);
  }
  if (changed.empty()) changed = "none";
  switch (o.method) {
    case LowFrequencyMethod::harmonic:
      return "";
    case LowFrequencyMethod::qrrho:
      return fmt::format(
          "low-frequency treatment qrrho: entropy interpolated between harmonic oscillator and free rotor "
          "(Grimme 2012; omega0 {:g} cm^-1, alpha {:g}, B_av {:g} kg m^2), thermal enthalpy likewise "
          "(Li et al. 2015), zero-point energy harmonic; vibrations with weight below 0.99: {}",
          o.qrrho_omega0_cm1, o.qrrho_exponent, o.qrrho_average_moment_kg_m2, changed);
    case LowFrequencyMethod::floor:
      return fmt::format(
          "low-frequency treatment floor: wavenumbers below {:g} cm^-1 raised to it for S, Cp and the "
          "thermal "
          "enthalpy (Ribeiro et al. 2011), zero-point energy at the given wavenumbers; vibrations raised: {}",
          o.floor_cm1, changed);
  }
  return "";
}

}  // namespace vibtherm
