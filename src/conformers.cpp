#include "vibtherm/conformers.hpp"

#include <algorithm>
#include <cmath>

#include "vibtherm/constants.hpp"

namespace vibtherm {

namespace {

constexpr double R = constants::gas_constant_J_per_mol_K;

MotionTerms scaled(const MotionTerms& t, double f) {
  MotionTerms out;
  out.ln_q = f * t.ln_q;
  out.U_over_RT = f * t.U_over_RT;
  out.H_over_RT = f * t.H_over_RT;
  out.Cv_over_R = f * t.Cv_over_R;
  out.Cp_over_R = f * t.Cp_over_R;
  out.S_over_R = f * t.S_over_R;
  return out;
}

}  // namespace

double total_ln_q(const ThermoPoint& p) {
  return p.translation.ln_q + p.rotation.ln_q + p.vibration.ln_q + p.electronic.ln_q +
         p.internal_rotation.ln_q;
}

ThermoPoint combine_conformers(std::span<const ThermoPoint> points, std::span<const double> levels_J_per_mol,
                               double T_K, std::vector<double>* populations) {
  const std::size_t n = points.size();
  const double RT = R * T_K;
  // ln of q_i e^{−ε_i/RT}, shifted by their largest value before exponentiating.
  std::vector<double> ln_w(n), p(n);
  for (std::size_t i = 0; i < n; ++i) ln_w[i] = total_ln_q(points[i]) - levels_J_per_mol[i] / RT;
  const double top = *std::max_element(ln_w.begin(), ln_w.end());
  double sum = 0.0;
  for (std::size_t i = 0; i < n; ++i) sum += (p[i] = std::exp(ln_w[i] - top));
  for (double& x : p) x /= sum;
  const double ln_Q = top + std::log(sum);

  ThermoPoint out;
  out.T_K = T_K;
  double mean_ln_q = 0.0, mean_h = 0.0, mean_h2 = 0.0, mean_eps = 0.0, entropy = 0.0;
  for (std::size_t i = 0; i < n; ++i) {
    const ThermoPoint& x = points[i];
    out.translation += scaled(x.translation, p[i]);
    out.rotation += scaled(x.rotation, p[i]);
    out.vibration += scaled(x.vibration, p[i]);
    out.electronic += scaled(x.electronic, p[i]);
    out.internal_rotation += scaled(x.internal_rotation, p[i]);
    out.Cv_J_per_mol_K += p[i] * x.Cv_J_per_mol_K;
    out.Cp_J_per_mol_K += p[i] * x.Cp_J_per_mol_K;
    out.S_J_per_mol_K += p[i] * x.S_J_per_mol_K;
    out.H_minus_H0_J_per_mol += p[i] * x.H_minus_H0_J_per_mol;
    const double h = (x.H_minus_H0_J_per_mol + levels_J_per_mol[i]) / RT;
    mean_ln_q += p[i] * total_ln_q(x);
    mean_h += p[i] * h;
    mean_h2 += p[i] * h * h;
    mean_eps += p[i] * levels_J_per_mol[i] / RT;
    if (p[i] > 0.0) entropy -= p[i] * std::log(p[i]);
  }
  MotionTerms& mix = out.conformers;
  mix.S_over_R = entropy;
  mix.U_over_RT = mix.H_over_RT = mean_eps;
  mix.Cv_over_R = mix.Cp_over_R = std::max(0.0, mean_h2 - mean_h * mean_h);
  mix.ln_q = ln_Q - mean_ln_q;
  out.Cv_J_per_mol_K += R * mix.Cv_over_R;
  out.Cp_J_per_mol_K += R * mix.Cp_over_R;
  out.S_J_per_mol_K += R * mix.S_over_R;
  out.H_minus_H0_J_per_mol += RT * mix.H_over_RT;
  if (populations) *populations = std::move(p);
  return out;
}

}  // namespace vibtherm
