#include "vibtherm/partition.hpp"

#include <doctest/doctest.h>

#include <cmath>
#include <vector>

#include "vibtherm/constants.hpp"

using namespace vibtherm;

TEST_CASE("Einstein function at theta/T = 1") {
  // Cv/R = x² eˣ/(eˣ−1)² at x = 1 equals e/(e−1)² = 0.920673... (Einstein 1907; textbook identity).
  const double T = characteristic_temperature_K(1000.0);
  const auto v = harmonic_oscillator_terms(1000.0, T);
  CHECK(v.Cv_over_R == doctest::Approx(0.920673).epsilon(1e-6));
  CHECK(v.Cv_over_R == doctest::Approx(std::exp(1.0) / std::pow(std::exp(1.0) - 1.0, 2)).epsilon(1e-14));
}

TEST_CASE("harmonic oscillator limits") {
  // Classical limit (common practice): Cv/R → 1, U/RT → 1 as T/θ → ∞.
  const auto hot = harmonic_oscillator_terms(10.0, 1e5);
  CHECK(hot.Cv_over_R == doctest::Approx(1.0).epsilon(1e-6));
  CHECK(hot.U_over_RT == doctest::Approx(1.0).epsilon(1e-3));
  // Frozen (common practice): nothing at T ≪ θ, and no overflow far past it.
  const auto cold = harmonic_oscillator_terms(4000.0, 10.0);
  CHECK(cold.Cv_over_R < 1e-200);
  CHECK(cold.S_over_R < 1e-200);
  // S = U/T + k ln q (textbook identity).
  const auto mid = harmonic_oscillator_terms(500.0, 300.0);
  CHECK(mid.S_over_R == doctest::Approx(mid.U_over_RT + mid.ln_q).epsilon(1e-14));
}

TEST_CASE("Cv is the temperature derivative of U (numerical check)") {
  // d(U)/dT = Cv (thermodynamic identity) for each motion with T-dependent U.
  const double h = 1e-3;
  for (double T : {50.0, 300.0, 2000.0}) {
    auto u = [&](double t) { return harmonic_oscillator_terms(800.0, t).U_over_RT * t; };
    CHECK(harmonic_oscillator_terms(800.0, T).Cv_over_R ==
          doctest::Approx((u(T + h) - u(T - h)) / (2 * h)).epsilon(1e-6));
    const std::vector<ElectronicLevel> levels{{0.0, 2}, {139.7, 2}};
    auto ue = [&](double t) { return electronic_terms(levels, t).U_over_RT * t; };
    CHECK(electronic_terms(levels, T).Cv_over_R ==
          doctest::Approx((ue(T + h) - ue(T - h)) / (2 * h)).epsilon(1e-6));
  }
}

TEST_CASE("translation: Sackur–Tetrode") {
  // Monatomic ideal gas (common practice): Cv = 3/2 R, Cp = 5/2 R.
  const auto t = translation_terms(39.9623831237, 298.15, 1e5);
  CHECK(t.Cv_over_R == 1.5);
  CHECK(t.Cp_over_R == 2.5);
  // Argon S°(298.15 K, 1 bar) = 154.846 J/(mol K) (CODATA Key Values, Cox, Wagman & Medvedev 1989);
  // the 40Ar mass instead of the average atomic weight changes S by +0.005 J/(mol K).
  CHECK(t.S_over_R * constants::gas_constant_J_per_mol_K == doctest::Approx(154.846).epsilon(0.01 / 154.846));
  // 1 atm instead of 1 bar lowers S by R ln(1.01325) (ideal-gas identity).
  const auto t_atm = translation_terms(39.9623831237, 298.15, constants::atmosphere_Pa);
  CHECK((t.S_over_R - t_atm.S_over_R) == doctest::Approx(std::log(1.01325)).epsilon(1e-12));
  // 1 mol/L equals the pressure c R T (ideal-gas law).
  const auto t_molar = translation_terms_concentration(39.9623831237, 298.15, 1000.0);
  const auto t_cRT =
      translation_terms(39.9623831237, 298.15, 1000.0 * constants::gas_constant_J_per_mol_K * 298.15);
  CHECK(t_molar.S_over_R == doctest::Approx(t_cRT.S_over_R).epsilon(1e-12));
}

TEST_CASE("rigid rotor and electronic levels") {
  // Linear rotor (common practice): Cv = R, S = R (ln q + 1).
  const std::vector<double> theta_linear{2.0};
  const auto lin = rigid_rotor_terms(theta_linear, 2, 300.0);
  CHECK(lin.Cv_over_R == 1.0);
  CHECK(lin.ln_q == doctest::Approx(std::log(300.0 / 4.0)));
  const std::vector<double> theta_nonlinear{40.0, 20.9, 13.4};
  CHECK(rigid_rotor_terms(theta_nonlinear, 2, 300.0).Cv_over_R == 1.5);
  // Degenerate ground level only: S = R ln g (Boltzmann), no heat capacity.
  const std::vector<ElectronicLevel> triplet{{0.0, 3}};
  const auto e = electronic_terms(triplet, 500.0);
  CHECK(e.S_over_R == doctest::Approx(std::log(3.0)));
  CHECK(e.Cv_over_R == 0.0);
  // Two levels at T → ∞: S → R ln(g0 + g1) (Boltzmann limit).
  const std::vector<ElectronicLevel> pair{{0.0, 2}, {100.0, 2}};
  CHECK(electronic_terms(pair, 1e7).S_over_R == doctest::Approx(std::log(4.0)).epsilon(1e-4));
}

TEST_CASE("a set of oscillators: one log for all, no underflow of the product") {
  // Σ ln(1 − e^{−x_i}) over 5000 modes at x = 1e-5 is about −57,600: the product itself
  // (1e-25000) is far below the smallest double, the rescaled one is not.
  std::vector<double> theta(5000, 1.0);
  double ln_q = 0.0, U = 0.0;
  for (double t : theta) {
    ln_q += harmonic_oscillator_terms(t / constants::second_radiation_cm_K, 1e5).ln_q;
    U += harmonic_oscillator_terms(t / constants::second_radiation_cm_K, 1e5).U_over_RT;
  }
  const auto all = harmonic_oscillators_terms(theta, 1e5);
  CHECK(std::isfinite(all.ln_q));
  CHECK(all.ln_q == doctest::Approx(ln_q).epsilon(1e-12));
  CHECK(all.U_over_RT == doctest::Approx(U).epsilon(1e-12));
  // Nearly frozen modes: ln q ≈ Σ e^{−x} ~ 1e-9 keeps its relative digits (log1p path).
  const std::vector<double> cold{4000.0, 4200.0, 4500.0};
  double ln_cold = 0.0;
  for (double t : cold)
    ln_cold += harmonic_oscillator_terms(t / constants::second_radiation_cm_K, 200.0).ln_q;
  CHECK(harmonic_oscillators_terms(cold, 200.0).ln_q == doctest::Approx(ln_cold).epsilon(1e-12));
  CHECK(harmonic_oscillators_terms({}, 300.0).ln_q == 0.0);
}
