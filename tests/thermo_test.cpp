#include "vibtherm/thermo.hpp"

#include <doctest/doctest.h>

#include <Eigen/Geometry>
#include <cmath>
#include <fstream>
#include <iterator>

#include "test_species.hpp"
#include "vibtherm/constants.hpp"
#include "vibtherm/read_species.hpp"

using namespace vibtherm;
constexpr double R = constants::gas_constant_J_per_mol_K;

TEST_CASE("argon against CODATA") {
  const auto p = prepare_species(test::argon());
  const auto row = evaluate(p, 298.15);
  // S°(298.15 K, 1 bar) = 154.846 ± 0.003 J/(mol K) (CODATA Key Values, Cox, Wagman & Medvedev 1989).
  CHECK(row.S_J_per_mol_K == doctest::Approx(154.846).epsilon(0.01 / 154.846));
  // Monatomic ideal gas (common practice): Cp = 5/2 R exactly, at every temperature.
  for (double T : {200.0, 298.15, 6000.0})
    CHECK(evaluate(p, T).Cp_J_per_mol_K == doctest::Approx(2.5 * R).epsilon(1e-15));
  CHECK(row.H_minus_H298_J_per_mol == doctest::Approx(0.0));
  // H(T) − H(0) = 5/2 RT for a monatomic gas (common practice).
  CHECK(row.H_minus_H0_J_per_mol == doctest::Approx(2.5 * R * 298.15));
}

TEST_CASE("O2 and H2O against NIST-JANAF") {
  // O2: S° = 205.15 J/(mol K) (NIST-JANAF 4th ed., Chase 1998, in shared/reference.md);
  //     Cp°(298.15) = 29.376 J/(mol K) (NIST-JANAF, from memory).
  const auto o2 = evaluate(prepare_species(test::oxygen()), 298.15);
  CHECK(o2.S_J_per_mol_K == doctest::Approx(205.15).epsilon(0.5 / 205.15));
  CHECK(o2.Cp_J_per_mol_K == doctest::Approx(29.376).epsilon(0.5 / 29.376));
  // H2O: S° = 188.835, Cp° = 33.590 J/(mol K) (NIST-JANAF 4th ed., from memory);
  //      CODATA: 188.84 and 33.60 (shared/reference.md); H298 − H0 = 9.90 kJ/mol (CODATA),
  //      matched to 0.05 kJ/mol (the rigid-rotor harmonic model's error at this level).
  const auto h2o = evaluate(prepare_species(test::water()), 298.15);
  CHECK(h2o.S_J_per_mol_K == doctest::Approx(188.835).epsilon(0.5 / 188.835));
  CHECK(h2o.Cp_J_per_mol_K == doctest::Approx(33.590).epsilon(0.5 / 33.590));
  CHECK(h2o.H_minus_H0_J_per_mol == doctest::Approx(9.90e3).epsilon(0.05 / 9.90));
}

TEST_CASE("equipartition limits") {
  // High T (common practice): Cv → (3/2 + 1 + (3N−5)) R linear, (3/2 + 3/2 + (3N−6)) R nonlinear.
  const auto co2 = prepare_species(test::carbon_dioxide());
  // At the engine's upper limit, 1e5 K, each mode lacks about x²/12 ≤ 3e-4 of its R.
  CHECK(evaluate(co2, 1e5).Cv_J_per_mol_K / R == doctest::Approx(1.5 + 1 + 4).epsilon(1e-4));
  CHECK(classical_Cv_over_R(co2) == 6.5);
  const auto h2o = prepare_species(test::water());
  CHECK(evaluate(h2o, 1e5).Cv_J_per_mol_K / R == doctest::Approx(1.5 + 1.5 + 3).epsilon(2e-4));
  // Outside 1 K to 1e5 K the engine refuses (limits.hpp) instead of printing nonsense.
  CHECK_THROWS_AS(evaluate(h2o, 1e6), InputError);
  CHECK_THROWS_AS(evaluate(h2o, 1e-3), InputError);
  // Low T (common practice): vibrational Cv vanishes.
  CHECK(evaluate(h2o, 20.0).vibration.Cv_over_R < 1e-12);
  // Cp − Cv = R for an ideal gas (common practice).
  CHECK(evaluate(h2o, 700.0).Cp_J_per_mol_K - evaluate(h2o, 700.0).Cv_J_per_mol_K == doctest::Approx(R));
}

TEST_CASE("adsorbate: all 3N motions are vibrations") {
  Species s = test::water();
  s.phase = Phase::adsorbate;
  s.frequencies_cm1 = {3657.0, 1595.0, 3756.0, 450.0, 380.0, 300.0, 210.0, 150.0, 90.0};
  const auto p = prepare_species(s);
  CHECK_FALSE(p.is_gas);
  const auto row = evaluate(p, 10.0 * characteristic_temperature_K(3756.0));
  // Dulong–Petit (1819; common practice): Cv → 3N R; no pV term, so Cp = Cv.
  CHECK(row.Cv_J_per_mol_K / R == doctest::Approx(9.0).epsilon(0.01));
  CHECK(row.Cp_J_per_mol_K == row.Cv_J_per_mol_K);
  CHECK(row.translation.S_over_R == 0.0);
}

TEST_CASE("invariance under rigid motion and atom order") {
  // Rigid-body invariance (common practice).
  const auto ref = evaluate(prepare_species(test::water()), 1000.0);
  Species moved = test::water();
  const Eigen::Matrix3d rot =
      Eigen::AngleAxisd(2.1, Eigen::Vector3d(0.3, -1, 0.2).normalized()).toRotationMatrix();
  for (auto& a : moved.atoms) a.position_angstrom = rot * a.position_angstrom + Eigen::Vector3d(-7, 2, 0.5);
  std::swap(moved.atoms[0], moved.atoms[1]);
  const auto row = evaluate(prepare_species(moved), 1000.0);
  CHECK(row.S_J_per_mol_K == doctest::Approx(ref.S_J_per_mol_K).epsilon(1e-12));
  CHECK(row.H_minus_H298_J_per_mol == doctest::Approx(ref.H_minus_H298_J_per_mol).epsilon(1e-12));
}

TEST_CASE("imaginary frequencies and mode counts") {
  Species ts = test::water();
  ts.frequencies_cm1 = {-1200.0, 1595.0, 3756.0};
  CHECK_THROWS_AS(prepare_species(ts), InputError);
  ts.transition_state = true;
  const auto p = prepare_species(ts);
  CHECK(p.vibrations_cm1.size() == 2);
  CHECK(p.used_frequencies_cm1.front() == -1200.0);
  CHECK_FALSE(p.notes.empty());

  Species soft = test::water();
  soft.frequencies_cm1 = {-25.0, 1595.0, 3756.0};
  ModelOptions options;
  options.imaginary_as_real_below_cm1 = 50.0;
  const auto q = prepare_species(soft, options);
  CHECK(q.vibrations_cm1.front() == 25.0);
  // One warning for the imaginary mode made real, one for a harmonic mode below 50 cm^-1.
  REQUIRE(q.warnings.size() == 2);
  CHECK(q.warnings[0].find("treated as a real mode") != std::string::npos);

  Species short_list = test::water();
  short_list.frequencies_cm1 = {1595.0, 3756.0};
  CHECK_THROWS_WITH_AS(prepare_species(short_list),
                       doctest::Contains("has 2 vibrational frequencies, expected 3"), InputError);
  options = {};
  options.mode_count_mismatch_is_warning = true;
  CHECK(prepare_species(short_list, options).warnings.size() == 1);
}

TEST_CASE("zero-point energy and scaling") {
  // ZPE = ½ Σ h c ν̃ N_A (harmonic oscillator, textbook identity).
  const auto p = prepare_species(test::water());
  CHECK(p.zero_point_energy_J_per_mol ==
        doctest::Approx(0.5 * (3657.0 + 1595.0 + 3756.0) * 11.962656).epsilon(1e-6));
  ModelOptions options;
  options.frequency_scale = 0.5;
  CHECK(prepare_species(test::water(), options).zero_point_energy_J_per_mol ==
        doctest::Approx(0.5 * p.zero_point_energy_J_per_mol));
}

TEST_CASE("Gibbs functions are consistent") {
  // G = H − TS (definition); −(G − H298)/T = S − (H − H298)/T.
  const auto row = evaluate(prepare_species(test::water()), 1500.0);
  CHECK(row.gibbs_function_J_per_mol_K ==
        doctest::Approx(row.S_J_per_mol_K - row.H_minus_H298_J_per_mol / 1500.0).epsilon(1e-12));
  CHECK_THROWS_AS(evaluate(prepare_species(test::water()), 0.0), InputError);
}

TEST_CASE("a Hessian gives the frequencies once the rotor type is known") {
  const std::string path = std::string(VIBTHERM_TEST_DATA) + "/water-model-hessian.yaml";
  const PreparedSpecies h2o = prepare_species(read_species_file(path));
  REQUIRE(h2o.species.frequencies_cm1.size() == 3);  // 3N − 6 for a nonlinear molecule
  CHECK(h2o.vibrations_cm1 == h2o.species.frequencies_cm1);
  for (double v : h2o.vibrations_cm1) CHECK(v > 1000.0);  // the model has no soft mode
  CHECK(h2o.zero_point_energy_J_per_mol > 0.0);

  // The same Hessian with deuterium masses: every wavenumber falls by a factor between
  // 1/sqrt(2) (infinitely heavy oxygen) and 1 (common practice), and so does the ZPE.
  std::ifstream in(path);
  const std::string text((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
  const PreparedSpecies d2o = prepare_species(read_species_yaml(text + "isotopes: {2: D, 3: D}\n", path));
  REQUIRE(d2o.vibrations_cm1.size() == 3);
  for (int i = 0; i < 3; ++i) {
    CHECK(d2o.vibrations_cm1[i] / h2o.vibrations_cm1[i] > 1.0 / std::sqrt(2.0));
    CHECK(d2o.vibrations_cm1[i] / h2o.vibrations_cm1[i] < 1.0);
  }
  CHECK(d2o.zero_point_energy_J_per_mol < h2o.zero_point_energy_J_per_mol);
  // Cp at 1000 K rises with the softer modes (more of each is active).
  CHECK(evaluate(d2o, 1000.0).Cp_J_per_mol_K > evaluate(h2o, 1000.0).Cp_J_per_mol_K);
}

namespace {

// The straightforward sum over motions (partition.hpp's one-motion functions, one exp, one
// expm1 and one log per mode and temperature), the reference for the engine's hoisted loop.
double straightforward(const PreparedSpecies& p, double T, int which) {
  MotionTerms total;
  if (p.is_gas) {
    total += p.options.standard_state == StandardState::molar
                 ? translation_terms_concentration(p.rotor.mass_amu, T, 1000.0)
                 : translation_terms(p.rotor.mass_amu, T, p.options.pressure_Pa);
    total += rigid_rotor_terms(p.rotor.rotational_temperatures_K, *p.species.symmetry_number, T);
  }
  for (double v : p.vibrations_cm1) total += harmonic_oscillator_terms(v, T);
  total += electronic_terms(p.species.electronic_levels, T);
  switch (which) {
    case 0:
      return R * total.Cp_over_R;
    case 1:
      return R * total.S_over_R;
    default:
      return R * T * total.H_over_RT;
  }
}

}  // namespace

TEST_CASE("the engine's hoisted loop equals the per-mode formulas to 1e-12") {
  // 60 modes log-spaced over 12..3900 cm^-1 on a nonlinear 22-atom frame, two electronic
  // levels; water (nonlinear), CO2 (linear), the molar standard state and an adsorbate.
  Species big = test::water();
  big.name = "big";
  big.atoms.clear();
  for (int i = 0; i < 22; ++i)
    big.atoms.push_back(test::atom("C", test::mass_C12, 1.3 * i, 0.7 * (i % 3), 0.4 * (i % 5)));
  big.frequencies_cm1.clear();
  for (int i = 0; i < 60; ++i) big.frequencies_cm1.push_back(12.0 * std::pow(325.0, i / 59.0));
  big.electronic_levels = {{0.0, 2}, {139.7, 2}};
  std::vector<PreparedSpecies> cases;
  ModelOptions free_count;
  free_count.mode_count_mismatch_is_warning = true;
  cases.push_back(prepare_species(big, free_count));
  cases.push_back(prepare_species(test::water()));
  cases.push_back(prepare_species(test::carbon_dioxide()));
  ModelOptions molar;
  molar.standard_state = StandardState::molar;
  cases.push_back(prepare_species(test::water(), molar));
  Species surface = big;
  surface.phase = Phase::adsorbate;
  cases.push_back(prepare_species(surface, free_count));
  const std::vector<double> temps{1.0, 5.0, 50.0, 298.15, 1000.0, 6000.0, 1e5};
  for (const PreparedSpecies& p : cases) {
    const auto rows = tabulate(p, temps);
    for (std::size_t i = 0; i < temps.size(); ++i) {
      CAPTURE(p.species.name);
      CAPTURE(temps[i]);
      CHECK(rows[i].Cp_J_per_mol_K == doctest::Approx(straightforward(p, temps[i], 0)).epsilon(1e-12));
      CHECK(rows[i].S_J_per_mol_K == doctest::Approx(straightforward(p, temps[i], 1)).epsilon(1e-12));
      CHECK(rows[i].H_minus_H0_J_per_mol == doctest::Approx(straightforward(p, temps[i], 2)).epsilon(1e-12));
    }
  }
}
