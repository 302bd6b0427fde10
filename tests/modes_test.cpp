#include "vibtherm/modes.hpp"

#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>

#include "test_species.hpp"
#include "vibtherm/constants.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/partition.hpp"

using namespace vibtherm;
constexpr double R = constants::gas_constant_J_per_mol_K;

namespace {

// CO X¹Σ⁺: r_e = 1.1283 Å, fundamental 2143 cm^-1 (Huber & Herzberg 1979, from memory).
Species carbon_monoxide() {
  Species s;
  s.name = "CO";
  s.atoms = {test::atom("C", test::mass_C12, 0, 0, 0), test::atom("O", test::mass_O16, 0, 0, 1.1283)};
  s.formula = {{"C", 1}, {"O", 1}};
  s.frequencies_cm1 = {2143.0};
  return s;
}

// A diatomic with any wavenumber, on the CO geometry: the checks below hold for any mass.
Species diatomic(double wavenumber_cm1) {
  Species s = carbon_monoxide();
  s.frequencies_cm1 = {wavenumber_cm1};
  return s;
}

// Adsorbate: water's atoms bound to a surface, 3N = 9 vibrations. The six frustrated
// translations and rotations are test parameters, not data of a real adsorbate: the checks
// (Dulong–Petit limit, no translation or rotation) hold for any positive set.
Species adsorbed_water() {
  Species s = test::water();
  s.name = "H2O*";
  s.phase = Phase::adsorbate;
  s.frequencies_cm1 = {3657.0, 1595.0, 3756.0, 700.0, 520.0, 400.0, 310.0, 120.0, 60.0};
  return s;
}

double max_theta_K(const PreparedSpecies& p) {
  return characteristic_temperature_K(*std::max_element(p.vibrations_cm1.begin(), p.vibrations_cm1.end()));
}

}  // namespace

TEST_CASE("Einstein function") {
  // E(1) = e/(e − 1)² = 0.920673... (exact identity, substituting x = 1 into x² eˣ/(eˣ − 1)²);
  // 0.92067 is the tabulated value at θ/T = 1 in statistical-mechanics texts (from memory).
  CHECK(std::abs(einstein_Cv_over_R(1.0) - 0.92067) < 5e-6);
  CHECK(einstein_Cv_over_R(1.0) ==
        doctest::Approx(std::exp(1.0) / std::pow(std::exp(1.0) - 1.0, 2)).epsilon(1e-15));
  // The engine's oscillator at T = θ is the same function.
  const double theta = characteristic_temperature_K(1000.0);
  CHECK(harmonic_oscillator_terms(1000.0, theta).Cv_over_R == doctest::Approx(0.920673594).epsilon(1e-9));
  // Limits (common practice): classical value 1 as x → 0, frozen as x → ∞, and the
  // series branch joins the closed form smoothly.
  CHECK(einstein_Cv_over_R(0.0) == 1.0);
  CHECK(einstein_Cv_over_R(0.99999e-4) == doctest::Approx(einstein_Cv_over_R(1.00001e-4)).epsilon(1e-12));
  CHECK(einstein_Cv_over_R(800.0) == 0.0);
  for (double x = 0.01; x < 50.0; x *= 1.3) CHECK(einstein_Cv_over_R(x * 1.3) < einstein_Cv_over_R(x));
  for (double x : {0.05, 0.7, 3.0, 12.0, 40.0})
    CHECK(einstein_Cv_over_R(x) ==
          doctest::Approx(harmonic_oscillator_terms(x / constants::second_radiation_cm_K, 1.0).Cv_over_R)
              .epsilon(1e-12));
}

TEST_CASE("inverse Einstein function and half-activation temperature") {
  for (double target : {1e-6, 0.1, 0.5, 0.9, 0.999}) {
    const double x = einstein_x_at(target);
    CHECK(einstein_Cv_over_R(x) == doctest::Approx(target).epsilon(1e-12));
  }
  CHECK_THROWS_AS(einstein_x_at(0.0), InputError);
  CHECK_THROWS_AS(einstein_x_at(1.0), InputError);

  // By construction the mode holds exactly half its classical share at T_half; checked
  // through the engine's oscillator, not the solver's own function.
  const auto report = analyse_modes(prepare_species(test::water()), {298.15});
  REQUIRE(report.modes.size() == 3);
  for (const auto& m : report.modes) {
    CHECK(harmonic_oscillator_terms(m.wavenumber_cm1, m.half_active_at_K).Cv_over_R ==
          doctest::Approx(0.5).epsilon(1e-12));
    CHECK(harmonic_oscillator_terms(m.wavenumber_cm1, m.unfreezes_at_K).Cv_over_R ==
          doctest::Approx(0.1).epsilon(1e-12));
    CHECK(harmonic_oscillator_terms(m.wavenumber_cm1, m.active_at_K).Cv_over_R ==
          doctest::Approx(0.9).epsilon(1e-12));
    CHECK(m.unfreezes_at_K < m.half_active_at_K);
    CHECK(m.half_active_at_K < m.active_at_K);
    // θ/T_half is one constant for every mode.
    CHECK(m.theta_K / m.half_active_at_K == doctest::Approx(einstein_x_at(0.5)).epsilon(1e-14));
  }
}

TEST_CASE("mode constants") {
  const auto p = prepare_species(test::water());
  const auto report = analyse_modes(p, {});
  double zpe = 0.0, share = 0.0;
  for (const auto& m : report.modes) {
    CHECK(m.theta_K == doctest::Approx(m.wavenumber_cm1 * constants::second_radiation_cm_K).epsilon(1e-15));
    zpe += m.zero_point_energy_J_per_mol;
    share += m.zero_point_share;
  }
  CHECK(zpe == doctest::Approx(p.zero_point_energy_J_per_mol).epsilon(1e-14));
  CHECK(share == doctest::Approx(1.0).epsilon(1e-15));
  // Modes are numbered by ascending wavenumber; the input position is kept beside.
  CHECK(report.modes[0].index == 1);
  CHECK(report.modes[0].wavenumber_cm1 == 1595.0);
  CHECK(report.modes[0].input_position == 2);
  CHECK(report.modes[1].wavenumber_cm1 == 3657.0);
  CHECK(report.modes[1].input_position == 1);
  CHECK(report.modes[2].input_position == 3);
  CHECK(report.points.empty());
}

TEST_CASE("state thresholds") {
  const ActivationThresholds t;  // defaults 0.1, 0.9
  CHECK(classify_mode(0.0, t) == ModeState::frozen);
  CHECK(classify_mode(0.0999, t) == ModeState::frozen);
  CHECK(classify_mode(0.1, t) == ModeState::partial);  // bounds belong to `partial`
  CHECK(classify_mode(0.5, t) == ModeState::partial);
  CHECK(classify_mode(0.9, t) == ModeState::partial);
  CHECK(classify_mode(0.9001, t) == ModeState::active);
  CHECK(classify_mode(1.0, t) == ModeState::active);
  const ActivationThresholds strict{0.01, 0.99};
  CHECK(classify_mode(0.05, strict) == ModeState::partial);
  CHECK(classify_mode(0.95, strict) == ModeState::partial);
  CHECK(std::string(mode_state_name(ModeState::partial)) == "partial");

  CHECK_THROWS_AS(validate({0.9, 0.1}), InputError);
  CHECK_THROWS_AS(validate({0.5, 0.5}), InputError);
  CHECK_THROWS_AS(validate({0.0, 0.5}), InputError);
  CHECK_THROWS_AS(validate({0.5, 1.0}), InputError);
  CHECK_THROWS_AS(analyse_modes(prepare_species(test::water()), {300.0}, {0.6, 0.4}), InputError);
  CHECK_NOTHROW(validate(strict));

  // Just either side of a mode's threshold temperatures the state changes.
  const auto p = prepare_species(carbon_monoxide());
  const auto m = analyse_modes(p, {}).modes.at(0);
  const auto r = analyse_modes(
      p, {0.99 * m.unfreezes_at_K, 1.01 * m.unfreezes_at_K, 0.99 * m.active_at_K, 1.01 * m.active_at_K});
  CHECK(r.points[0].modes[0].state == ModeState::frozen);
  CHECK(r.points[1].modes[0].state == ModeState::partial);
  CHECK(r.points[2].modes[0].state == ModeState::partial);
  CHECK(r.points[3].modes[0].state == ModeState::active);
  CHECK(r.points[3].count(ModeState::active) == 1);
  CHECK(r.points[3].count(ModeState::frozen) == 0);
}

TEST_CASE("diatomic: F = 5 with the vibration frozen, 7 when it is active") {
  const auto p = prepare_species(carbon_monoxide());
  const auto r = analyse_modes(p, {300.0, 5.0 * characteristic_temperature_K(2143.0)});
  // Common practice: a diatomic with a stiff bond at room temperature has translation (3)
  // and rotation (2) active and its vibration frozen, F ≈ 5 (Cv ≈ 5/2 R).
  CHECK(r.points[0].dof.total == doctest::Approx(5.0).epsilon(0.01 / 5.0));
  CHECK(r.points[0].dof.translation == 3.0);
  CHECK(r.points[0].dof.rotation == 2.0);
  CHECK(r.points[0].modes[0].state == ModeState::frozen);
  // At T = 5θ the vibration adds its two terms (common practice): F within 0.1 of 7.
  CHECK(r.points[1].dof.total == doctest::Approx(7.0).epsilon(0.1 / 7.0));
  CHECK(r.points[1].modes[0].state == ModeState::active);
  CHECK(r.classical.total == 7.0);

  // The 0.01 margin needs ν̃ above about 2100 cm^-1 at 300 K: at 1500 cm^-1 the vibration
  // still adds 2·E(x = 7.19) = 0.0779 (the Einstein function evaluated by hand), and at
  // 2000 cm^-1 it adds 0.0126.
  const auto soft = analyse_modes(prepare_species(diatomic(1500.0)), {300.0});
  CHECK(soft.points[0].dof.total - 5.0 == doctest::Approx(0.0779).epsilon(0.001 / 0.0779));
  const auto stiffer = analyse_modes(prepare_species(diatomic(2100.0)), {300.0});
  CHECK(stiffer.points[0].dof.total - 5.0 < 0.01);
}

TEST_CASE("nonlinear triatomic: F = 6 with its vibrations frozen") {
  // Common practice: translation 3 + rotation 3 when every vibration is frozen. The
  // wavenumbers are test parameters on water's geometry, all above 2200 cm^-1, where each
  // mode adds less than 0.006 at 300 K.
  Species model = test::water();
  model.frequencies_cm1 = {2250.0, 3657.0, 3756.0};
  const auto r = analyse_modes(prepare_species(model), {300.0});
  CHECK(r.points[0].dof.total == doctest::Approx(6.0).epsilon(0.02 / 6.0));
  CHECK(r.points[0].count(ModeState::frozen) == 3);
  CHECK(r.classical.total == 12.0);

  // Real water (fundamentals from shared/reference.md): its bend at 1595 cm^-1 is not quite
  // frozen at 298.15 K. CODATA Key Values give Cp° = 33.60 J/(mol K), so F = 2(Cp/R − 1) = 6.082
  // (Cp − Cv = R for an ideal gas, common practice); the rigid-rotor harmonic model gives
  // 6.054, within 0.05.
  const auto w = analyse_modes(prepare_species(test::water()), {298.15});
  CHECK(w.points[0].dof.total == doctest::Approx(2.0 * (33.60 / R - 1.0)).epsilon(0.05 / 6.08));
  CHECK(w.points[0].dof.total > 6.02);
}

TEST_CASE("monatomic gas: F = 3 at every temperature") {
  // Common practice: Cv = 3/2 R for a monatomic ideal gas.
  const auto r = analyse_modes(prepare_species(test::argon()), {10.0, 298.15, 5000.0, 20000.0});
  CHECK(r.modes.empty());
  CHECK(r.classical.total == 3.0);
  CHECK(r.classical.rotation == 0.0);
  for (const auto& point : r.points) {
    CHECK(point.dof.total == 3.0);
    CHECK(point.dof.rotation == 0.0);
    CHECK(point.dof.vibration == 0.0);
    CHECK(point.modes.empty());
  }
}

TEST_CASE("adsorbate: all 3N motions vibrate, Dulong–Petit limit") {
  const auto p = prepare_species(adsorbed_water());
  const double T_high = 10.0 * max_theta_K(p);
  const auto r = analyse_modes(p, {20.0, T_high});
  const int N = 3;
  CHECK_FALSE(r.is_gas);
  CHECK(r.modes.size() == 3 * N);
  CHECK(r.classical.translation == 0.0);
  CHECK(r.classical.rotation == 0.0);
  CHECK(r.classical.total == 6.0 * N);
  for (const auto& point : r.points) {
    CHECK(point.dof.translation == 0.0);
    CHECK(point.dof.rotation == 0.0);
  }
  // Dulong–Petit law (1819; common practice): Cv → 3N R, F → 6N, within 1 % at 10·max θ.
  const auto row = evaluate(p, T_high);
  CHECK(row.Cv_J_per_mol_K == doctest::Approx(3.0 * N * R).epsilon(0.01));
  CHECK(r.points[1].dof.total == doctest::Approx(6.0 * N).epsilon(0.01));
  CHECK(r.points[1].count(ModeState::active) == 3 * N);
  // At 20 K only the softest frustrated motion (60 cm^-1, θ ≈ 86 K, Cv/R ≈ 0.26) stirs.
  CHECK(r.points[0].count(ModeState::frozen) == 3 * N - 1);
  CHECK(r.points[0].count(ModeState::partial) == 1);
  CHECK(r.modes[0].wavenumber_cm1 == 60.0);  // ascending order
  CHECK(r.points[0].modes[0].state == ModeState::partial);
}

TEST_CASE("per-motion values agree with the engine") {
  // O2 with its a¹Δg level at 7918.1 cm^-1 (Huber & Herzberg 1979, from memory), so the
  // electronic part is non-zero and must stay out of F.
  Species o2 = test::oxygen();
  o2.electronic_levels = {{0.0, 3}, {7918.1, 2}};
  const std::vector<double> temps{50.0, 298.15, 1000.0, 3000.0, 6000.0};
  for (const Species& s : {test::water(), test::carbon_dioxide(), o2, test::argon(), adsorbed_water()}) {
    CAPTURE(s.name);
    const auto p = prepare_species(s);
    const auto r = analyse_modes(p, temps);
    REQUIRE(r.points.size() == temps.size());
    for (size_t j = 0; j < temps.size(); ++j) {
      const auto& point = r.points[j];
      const auto row = evaluate(p, temps[j]);
      // Sum over motions, electronic included, against the engine's total Cv.
      const double sum =
          point.dof.translation + point.dof.rotation + point.dof.vibration + point.dof.electronic;
      CHECK(sum == doctest::Approx(2.0 * row.Cv_J_per_mol_K / R).epsilon(1e-9));
      CHECK(point.dof.total ==
            doctest::Approx(point.dof.translation + point.dof.rotation + point.dof.vibration).epsilon(1e-15));
      double modes = 0.0;
      for (const auto& m : point.modes) modes += 2.0 * m.Cv_over_R;
      CHECK(modes == doctest::Approx(point.dof.vibration).epsilon(1e-12));
      CHECK(point.dof.total <= r.classical.total + 1e-12);
    }
    // The per-motion classical limits add up to the engine's equipartition value.
    CHECK(r.classical.total == doctest::Approx(2.0 * classical_Cv_over_R(p)).epsilon(1e-15));
  }
  const auto r = analyse_modes(prepare_species(o2), {3000.0});
  CHECK(r.points[0].dof.electronic > 0.01);
}

TEST_CASE("log-spaced temperatures") {
  const auto t = log_spaced_temperatures(30.0, 3000.0, 5);
  REQUIRE(t.size() == 5);
  CHECK(t.front() == 30.0);
  CHECK(t.back() == 3000.0);
  CHECK(t[2] == doctest::Approx(300.0).epsilon(1e-14));
  for (size_t i = 1; i < t.size(); ++i)
    CHECK(t[i] / t[i - 1] == doctest::Approx(std::sqrt(10.0)).epsilon(1e-14));
  CHECK_THROWS_AS(log_spaced_temperatures(300.0, 30.0, 5), InputError);
  CHECK_THROWS_AS(log_spaced_temperatures(0.0, 30.0, 5), InputError);
  CHECK_THROWS_AS(log_spaced_temperatures(3.0, 30.0, 1), InputError);
}
