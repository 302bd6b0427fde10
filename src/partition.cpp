#include "vibtherm/partition.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>

#include "vector_exp.hpp"
#include "vibtherm/constants.hpp"

namespace vibtherm {

namespace c = constants;

MotionTerms& MotionTerms::operator+=(const MotionTerms& other) {
  ln_q += other.ln_q;
  U_over_RT += other.U_over_RT;
  H_over_RT += other.H_over_RT;
  Cv_over_R += other.Cv_over_R;
  Cp_over_R += other.Cp_over_R;
  S_over_R += other.S_over_R;
  return *this;
}

namespace {

// ln[(2π m k T / h²)^{3/2} · volume_per_molecule], the translational ln(q/N).
double ln_translational_q_per_molecule(double mass_amu, double T_K, double volume_per_molecule_m3) {
  const double m = mass_amu * c::atomic_mass_constant_kg;
  const double thermal = 2.0 * c::pi * m * c::boltzmann_J_per_K * T_K / (c::planck_J_s * c::planck_J_s);
  return 1.5 * std::log(thermal) + std::log(volume_per_molecule_m3);
}

MotionTerms translation_from_ln_q(double ln_q) {
  MotionTerms t;
  t.ln_q = ln_q;
  t.U_over_RT = 1.5;
  t.H_over_RT = 2.5;  // U + pV, pV = RT per mole of ideal gas
  t.Cv_over_R = 1.5;
  t.Cp_over_R = 2.5;
  t.S_over_R = ln_q + 2.5;  // Sackur–Tetrode: ln(q/N) + 1 (Stirling) + 3/2
  return t;
}

}  // namespace

MotionTerms translation_terms(double mass_amu, double T_K, double pressure_Pa) {
  return translation_from_ln_q(
      ln_translational_q_per_molecule(mass_amu, T_K, c::boltzmann_J_per_K * T_K / pressure_Pa));
}

MotionTerms translation_terms_concentration(double mass_amu, double T_K, double concentration_mol_per_m3) {
  return translation_from_ln_q(
      ln_translational_q_per_molecule(mass_amu, T_K, 1.0 / (concentration_mol_per_m3 * c::avogadro_per_mol)));
}

MotionTerms rigid_rotor_terms(std::span<const double> rotational_temperatures_K, int symmetry_number,
                              double T_K) {
  MotionTerms r;
  if (rotational_temperatures_K.empty()) return r;
  const double ln_sigma = std::log(static_cast<double>(symmetry_number));
  if (rotational_temperatures_K.size() == 1) {
    // Linear rigid rotor, high-temperature limit: q = T / (σ θ).
    r.ln_q = std::log(T_K / rotational_temperatures_K[0]) - ln_sigma;
    r.U_over_RT = r.H_over_RT = 1.0;
    r.Cv_over_R = r.Cp_over_R = 1.0;
  } else {
    // Nonlinear: q = √π / σ · T^{3/2} / √(θA θB θC).
    double ln_theta_product = 0.0;
    for (double theta : rotational_temperatures_K) ln_theta_product += std::log(theta);
    r.ln_q = 0.5 * std::log(c::pi) + 1.5 * std::log(T_K) - 0.5 * ln_theta_product - ln_sigma;
    r.U_over_RT = r.H_over_RT = 1.5;
    r.Cv_over_R = r.Cp_over_R = 1.5;
  }
  r.S_over_R = r.ln_q + r.U_over_RT;
  return r;
}

double characteristic_temperature_K(double wavenumber_cm1) {
  return wavenumber_cm1 * c::second_radiation_cm_K;
}

MotionTerms harmonic_oscillator_terms(double wavenumber_cm1, double T_K) {
  MotionTerms v;
  const double x = characteristic_temperature_K(wavenumber_cm1) / T_K;
  // Past x ≈ 700, e^{-x} underflows: the mode is frozen and contributes nothing.
  if (x > 700.0) return v;
  // Written with e^{−x} and 1 − e^{−x} (expm1: accurate for small x) so that neither
  // overflows: x/(eˣ−1) = x e^{−x}/(1−e^{−x}), x² eˣ/(eˣ−1)² = x² e^{−x}/(1−e^{−x})².
  const double e = std::exp(-x);
  const double one_minus_e = -std::expm1(-x);
  v.ln_q = -std::log(one_minus_e);
  v.U_over_RT = v.H_over_RT = x * e / one_minus_e;
  v.Cv_over_R = v.Cp_over_R = x * x * e / (one_minus_e * one_minus_e);
  v.S_over_R = v.U_over_RT + v.ln_q;
  return v;
}

MotionTerms harmonic_oscillators_terms(std::span<const double> theta_K, double T_K) {
  MotionTerms v;
  const double inv_T = 1.0 / T_K;
  double product = 1.0;  // Π(1 − e^{−x}) = product · 2^exponent
  int exponent = 0;
  double deficit = 0.0;  // 1 − Π, accurate while no rescaling happened
  double U = 0.0, Cv = 0.0;
  // Chunks of modes: their exponentials in one vector call (vector_exp.hpp).
  constexpr std::size_t chunk = 64;
  double x[chunk], e[chunk], small_x[chunk];
  std::size_t small_index[chunk];
  for (std::size_t start = 0; start < theta_K.size(); start += chunk) {
    const std::size_t n = std::min(chunk, theta_K.size() - start);
    std::size_t small = 0;  // the modes with x < 0.5 also get expm1
    for (std::size_t i = 0; i < n; ++i) {
      x[i] = theta_K[start + i] * inv_T;
      if (x[i] < 0.5) small_index[small] = i, small_x[small++] = x[i];
    }
    detail::exp_of_negated(x, e, n);
    detail::expm1_of_negated(small_x, small_x, small);
    // e^{−x} and 1 − e^{−x}: below x = 0.5 from expm1, which keeps the digits of 1 − e^{−x},
    // and e^{−x} = 1 + expm1 ≥ 0.6 loses none; above, e^{−x} ≤ 0.61 and 1 − e^{−x} ≥ 0.39
    // lose none either. Past x = 700 the mode is frozen (e^{−x} underflows, as in
    // harmonic_oscillator_terms): weight 0 and factor 1 add nothing.
    double one_minus_e[chunk];
    for (std::size_t i = 0; i < n; ++i) {
      one_minus_e[i] = x[i] > 700.0 ? 1.0 : 1.0 - e[i];
      e[i] = x[i] > 700.0 ? 0.0 : e[i];
    }
    for (std::size_t k = 0; k < small; ++k) {
      const std::size_t j = small_index[k];
      one_minus_e[j] = -small_x[k];
      e[j] = 1.0 + small_x[k];
    }
    // U/RT = Σ x e/(1 − e), Cv/R = Σ x² e/(1 − e)², two accumulators each.
    const auto add = [&](std::size_t i, double& u, double& cv) {
      const double inv = 1.0 / one_minus_e[i];
      const double xr = x[i] * e[i] * inv;
      u += xr;
      cv += xr * x[i] * inv;
    };
    double U0 = 0.0, U1 = 0.0, Cv0 = 0.0, Cv1 = 0.0;
    std::size_t i = 0;
    for (; i + 2 <= n; i += 2) add(i, U0, Cv0), add(i + 1, U1, Cv1);
    if (i < n) add(i, U0, Cv0);
    U += U0 + U1;
    Cv += Cv0 + Cv1;
    for (std::size_t i = 0; i < n; ++i) {
      if (exponent == 0) deficit += e[i] * product;  // 1 − Π(1−e) grows by e·Π
      product *= one_minus_e[i];
      if (product < 0x1p-500) {  // rescale long before the smallest normal double
        int shift = 0;
        product = std::frexp(product, &shift);
        exponent += shift;
      }
    }
  }
  const double ln_product = exponent == 0 && deficit < 0.5 ? std::log1p(-deficit)
                                                           : std::log(product) + exponent * std::numbers::ln2;
  v.ln_q = -ln_product;
  v.U_over_RT = v.H_over_RT = U;
  v.Cv_over_R = v.Cp_over_R = Cv;
  v.S_over_R = U + v.ln_q;
  return v;
}

MotionTerms LogLinearTerms::at(double ln_T) const {
  MotionTerms t = fixed;
  t.ln_q = ln_q_at_1K + power * ln_T;
  t.S_over_R = t.ln_q + t.H_over_RT;  // translation: ln(q/N) + 1 + U/RT; rotation: ln q + U/RT
  return t;
}

namespace {

// ln[(2π m k / h²)^{3/2}] + ln(V/N at 1 K) with V/N ∝ T^{power − 3/2}.
LogLinearTerms translation_law_with(double mass_amu, double ln_volume_at_1K, double volume_power) {
  const double m = mass_amu * c::atomic_mass_constant_kg;
  const double thermal_per_K = 2.0 * c::pi * m * c::boltzmann_J_per_K / (c::planck_J_s * c::planck_J_s);
  LogLinearTerms t;
  t.ln_q_at_1K = 1.5 * std::log(thermal_per_K) + ln_volume_at_1K;
  t.power = 1.5 + volume_power;
  t.fixed = translation_from_ln_q(0.0);
  return t;
}

}  // namespace

LogLinearTerms translation_law(double mass_amu, double pressure_Pa) {
  return translation_law_with(mass_amu, std::log(c::boltzmann_J_per_K / pressure_Pa), 1.0);
}

LogLinearTerms translation_law_concentration(double mass_amu, double concentration_mol_per_m3) {
  return translation_law_with(mass_amu, -std::log(concentration_mol_per_m3 * c::avogadro_per_mol), 0.0);
}

LogLinearTerms rigid_rotor_law(std::span<const double> rotational_temperatures_K, int symmetry_number) {
  LogLinearTerms r;
  if (rotational_temperatures_K.empty()) return r;
  const double ln_sigma = std::log(static_cast<double>(symmetry_number));
  if (rotational_temperatures_K.size() == 1) {
    r.ln_q_at_1K = -std::log(rotational_temperatures_K[0]) - ln_sigma;
    r.power = 1.0;
  } else {
    double ln_theta_product = 0.0;
    for (double theta : rotational_temperatures_K) ln_theta_product += std::log(theta);
    r.ln_q_at_1K = 0.5 * std::log(c::pi) - 0.5 * ln_theta_product - ln_sigma;
    r.power = 1.5;
  }
  r.fixed.U_over_RT = r.fixed.H_over_RT = r.power;
  r.fixed.Cv_over_R = r.fixed.Cp_over_R = r.power;
  return r;
}

MotionTerms electronic_terms(std::span<const ElectronicLevel> levels, double T_K) {
  MotionTerms e;
  if (levels.empty()) return e;
  double lowest = levels[0].energy_cm1;
  for (const auto& level : levels) lowest = std::min(lowest, level.energy_cm1);
  // With y_i = (ε_i − ε_0)/kT and w_i = g_i e^{−y_i}: q = Σ w_i, U/RT = ⟨y⟩, Cv/R = ⟨y²⟩ − ⟨y⟩².
  double q = 0.0, sum_y = 0.0, sum_y2 = 0.0;
  for (const auto& level : levels) {
    const double y = characteristic_temperature_K(level.energy_cm1 - lowest) / T_K;
    const double w = level.degeneracy * std::exp(-y);
    q += w;
    sum_y += w * y;
    sum_y2 += w * y * y;
  }
  const double mean_y = sum_y / q;
  e.ln_q = std::log(q);
  e.U_over_RT = e.H_over_RT = mean_y;
  e.Cv_over_R = e.Cp_over_R = std::max(0.0, sum_y2 / q - mean_y * mean_y);
  e.S_over_R = e.ln_q + e.U_over_RT;
  return e;
}

}  // namespace vibtherm
