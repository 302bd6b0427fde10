#include "vibtherm/tunnelling.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <array>
#include <cmath>

#include "vibtherm/constants.hpp"
#include "vibtherm/error.hpp"

namespace vibtherm {

namespace c = constants;

double wigner_kappa(double imaginary_wavenumber_cm1, double T_K) {
  // Wigner 1932: the first quantum correction, u = h ν‡ / k T.
  const double u = std::abs(imaginary_wavenumber_cm1) * c::second_radiation_cm_K / T_K;
  return 1.0 + u * u / 24.0;
}

void check_eckart_barrier(const EckartBarrier& b) {
  const auto check = [](double v, const char* what) {
    if (!(v > 0.0) || !std::isfinite(v))
      fail({}, fmt::format("Eckart tunnelling needs a positive {}, got {}", what, v));
  };
  check(b.forward_J_per_mol, "forward barrier");
  check(b.reverse_J_per_mol, "reverse barrier");
  check(b.imaginary_wavenumber_cm1, "imaginary wavenumber");
}

namespace {

// ln sinh x and ln cosh x for x ≥ 0 without overflow.
double ln_sinh(double x) {
  return x > 20.0 ? x - std::log(2.0) + std::log1p(-std::exp(-2.0 * x)) : std::log(std::sinh(x));
}
double ln_cosh(double x) {
  x = std::abs(x);
  return x - std::log(2.0) + std::log1p(std::exp(-2.0 * x));
}
double log_add_exp(double a, double b) {
  const double m = std::max(a, b);
  return m + std::log1p(std::exp(-std::abs(a - b)));
}

// The barrier's constants in molar energies: A = V1 − V2, B = (√V1 + √V2)², C.
struct EckartShape {
  double A, B, C;
};

EckartShape shape_of(const EckartBarrier& b) {
  const double V1 = b.forward_J_per_mol, V2 = b.reverse_J_per_mol;
  const double h_nu = b.imaginary_wavenumber_cm1 * c::wavenumber_J_per_mol;
  const double B = std::pow(std::sqrt(V1) + std::sqrt(V2), 2);
  return {V1 - V2, B, h_nu * h_nu * B / (16.0 * V1 * V2)};
}

// ln P(E), −inf where nothing is transmitted.
double ln_transmission(const EckartShape& s, double E) {
  if (!(E > 0.0) || !(E > s.A)) return -INFINITY;
  const double two_pi = 2.0 * c::pi;
  const double alpha = 0.5 * std::sqrt(E / s.C), beta = 0.5 * std::sqrt((E - s.A) / s.C);
  // cosh(x+y) − cosh(x−y) = 2 sinh x sinh y, so the numerator never cancels.
  const double ln_num = std::log(2.0) + ln_sinh(two_pi * alpha) + ln_sinh(two_pi * beta);
  const double ln_cosh_sum = ln_cosh(two_pi * (alpha + beta));
  double ln_den;
  if (s.B >= s.C) {
    ln_den = log_add_exp(ln_cosh_sum, ln_cosh(two_pi * 0.5 * std::sqrt((s.B - s.C) / s.C)));
  } else {
    const double cos_d = std::cos(two_pi * 0.5 * std::sqrt((s.C - s.B) / s.C));
    ln_den = ln_cosh_sum + std::log1p(cos_d * std::exp(-ln_cosh_sum));
  }
  return std::min(0.0, ln_num - ln_den);
}

// 8-point Gauss–Legendre nodes and weights on [−1, 1] (Abramowitz & Stegun, Table 25.4).
constexpr std::array<double, 4> gl_nodes{0.1834346424956498, 0.5255324099163290, 0.7966664774136267,
                                         0.9602898564975363};
constexpr std::array<double, 4> gl_weights{0.3626837833783620, 0.3137066458778873, 0.2223810344533745,
                                           0.1012285362903763};

// ∫_a^b f over n equal panels.
template <class F>
double gauss_legendre(F&& f, double a, double b, int n) {
  const double h = (b - a) / n;
  double sum = 0.0;
  for (int i = 0; i < n; ++i) {
    const double mid = a + (i + 0.5) * h, half = 0.5 * h;
    for (std::size_t k = 0; k < gl_nodes.size(); ++k)
      sum += gl_weights[k] * half * (f(mid - half * gl_nodes[k]) + f(mid + half * gl_nodes[k]));
  }
  return sum;
}

// Doubles the panel count until two results agree to 1e-10 relative (or 2^16 panels).
template <class F>
double converged_integral(F&& f, double a, double b) {
  double previous = gauss_legendre(f, a, b, 16);
  for (int n = 32; n <= (1 << 16); n *= 2) {
    const double next = gauss_legendre(f, a, b, n);
    if (std::abs(next - previous) <= 1e-10 * std::abs(next)) return next;
    previous = next;
  }
  return previous;
}

}  // namespace

double eckart_transmission(const EckartBarrier& barrier, double energy_J_per_mol) {
  check_eckart_barrier(barrier);
  return std::exp(ln_transmission(shape_of(barrier), energy_J_per_mol));
}

std::optional<double> eckart_kappa(const EckartBarrier& barrier, double T_K) {
  check_eckart_barrier(barrier);
  if (!(T_K > 0.0) || !std::isfinite(T_K))
    fail({}, fmt::format("temperature must be positive, got {} K", T_K));
  const EckartShape s = shape_of(barrier);
  const double V1 = barrier.forward_J_per_mol, RT = c::gas_constant_J_per_mol_K * T_K;
  const double E0 = std::max(0.0, s.A);
  // Integrand P(E) e^{−(E − V1)/RT} / RT in units of its largest value on a coarse scan, so
  // deep tunnelling at low T neither overflows nor underflows.
  const auto ln_g = [&](double E) { return ln_transmission(s, E) - (E - V1) / RT; };
  const double top = V1 + 60.0 * RT;
  double ln_max = -INFINITY;
  for (int i = 1; i <= 400; ++i) ln_max = std::max(ln_max, ln_g(E0 + (top - E0) * i / 400.0));
  const auto g = [&](double E) { return std::exp(ln_g(E) - ln_max); };
  // Below the top E = E0 + t², which removes the √(E − E0) edge of P; above it P → 1 smoothly.
  const double below =
      converged_integral([&](double t) { return 2.0 * t * g(E0 + t * t); }, 0.0, std::sqrt(V1 - E0));
  const double above = converged_integral(g, V1, top);
  const double ln_kappa = ln_max + std::log((below + above) / RT);
  if (!(ln_kappa < std::log(1e300))) return std::nullopt;
  return std::exp(ln_kappa);
}

std::vector<TunnellingPoint> tunnelling_table(const TransitionStateTunnelling& ts,
                                              const std::vector<double>& temperatures_K) {
  std::vector<TunnellingPoint> rows;
  for (double T : temperatures_K) {
    TunnellingPoint p{T, wigner_kappa(ts.imaginary_wavenumber_cm1, T), std::nullopt};
    if (ts.eckart) p.eckart = eckart_kappa(*ts.eckart, T);
    rows.push_back(p);
  }
  return rows;
}

std::string tunnelling_note(const TransitionStateTunnelling& ts) {
  std::string note =
      fmt::format("tunnelling: Wigner correction (Wigner 1932) for the reaction coordinate {:.1f}i cm^-1",
                  ts.imaginary_wavenumber_cm1);
  if (ts.eckart)
    note += fmt::format(
        "; unsymmetrical Eckart correction (Johnston & Heicklen 1962) for barriers {:.3f} kJ/mol forward and "
        "{:.3f} kJ/mol reverse",
        ts.eckart->forward_J_per_mol / 1e3, ts.eckart->reverse_J_per_mol / 1e3);
  else
    note += "; give 'tunnelling: {forward_barrier, reverse_barrier}' for the Eckart correction";
  const double T = c::reference_temperature_K;
  note += fmt::format("; kappa(298.15 K): Wigner {:.4f}", wigner_kappa(ts.imaginary_wavenumber_cm1, T));
  if (ts.eckart) {
    const auto eckart = eckart_kappa(*ts.eckart, T);
    note += eckart ? fmt::format(", Eckart {:.4f}", *eckart) : std::string(", Eckart above 1e300");
  }
  return note + " (reported beside the thermochemistry, not applied to it)";
}

}  // namespace vibtherm
