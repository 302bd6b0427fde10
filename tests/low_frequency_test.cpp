#include "vibtherm/low_frequency.hpp"

#include <doctest/doctest.h>
#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "test_species.hpp"
#include "vibtherm/constants.hpp"
#include "vibtherm/hindered_rotor.hpp"
#include "vibtherm/thermo.hpp"

using namespace vibtherm;

namespace {

constexpr double R = constants::gas_constant_J_per_mol_K;

// Water's geometry with chosen wavenumbers: a model input for identities, not data.
Species water_with(std::vector<double> wavenumbers_cm1) {
  Species s = test::water();
  s.frequencies_cm1 = std::move(wavenumbers_cm1);
  return s;
}

ModelOptions with_method(LowFrequencyMethod method) {
  ModelOptions o;
  o.low_frequency_method = method;
  return o;
}

void check_same_rows(const PreparedSpecies& a, const PreparedSpecies& b, double T, double relative) {
  const ThermoPoint x = evaluate(a, T), y = evaluate(b, T);
  CHECK(x.S_J_per_mol_K == doctest::Approx(y.S_J_per_mol_K).epsilon(relative));
  CHECK(x.Cp_J_per_mol_K == doctest::Approx(y.Cp_J_per_mol_K).epsilon(relative));
  CHECK(x.H_minus_H0_J_per_mol == doctest::Approx(y.H_minus_H0_J_per_mol).epsilon(relative));
  CHECK(x.G_minus_H298_J_per_mol == doctest::Approx(y.G_minus_H298_J_per_mol).epsilon(relative));
}

}  // namespace

TEST_CASE("qrrho weighting is exactly 1/2 at omega0") {
  // Grimme, Chem. Eur. J. 18, 9955 (2012), eq. 8: w(ω₀) = 1/(1 + 1) for any α.
  CHECK(qrrho_weight(100.0, 100.0, 4.0) == 0.5);
  CHECK(qrrho_weight(150.0, 150.0, 4.0) == 0.5);
  // (ω₀/ω)^4 = 16 at ω = ω₀/2 (the same equation).
  CHECK(qrrho_weight(50.0, 100.0, 4.0) == doctest::Approx(1.0 / 17.0).epsilon(1e-15));
}

TEST_CASE("qrrho free-rotor entropy against the quantum free rotor of the hindered-rotor module") {
  // Grimme eqs. 4–6 with B_av so large that μ' = μ: the classical 1-D free rotor of moment
  // μ = h/(8π² c ν̃), S/R = 1/2 + ln √(8π³ μ k T)/h (common practice). The independent value
  // is the level sum of a rotor with no barrier (hindered_rotor.hpp), classical at T ≫ B/k.
  const double nu_cm1 = 50.0, T = 298.15;
  const double mu_kg_m2 = constants::planck_J_s / (8.0 * constants::pi * constants::pi *
                                                   constants::speed_of_light_m_s * 100.0 * nu_cm1);
  const double mu_amu_A2 = mu_kg_m2 / (constants::atomic_mass_constant_kg * 1e-20);
  const TorsionLevels levels = torsion_levels(mu_amu_A2, cosine_barrier(0.0, 1), 6000.0);
  const double quantum = hindered_rotor_terms(levels, 1, T).S_over_R;
  CHECK(free_rotor_entropy_over_R(nu_cm1, T, 1e-30) == doctest::Approx(quantum).epsilon(1e-6));
  // With B_av = 1e-44 kg m² the effective moment is smaller, so the entropy is lower.
  CHECK(free_rotor_entropy_over_R(nu_cm1, T, 1e-44) < quantum);
}

TEST_CASE("qrrho equals harmonic when every wavenumber is at least 2000 cm^-1") {
  // Grimme 2012: w → 1 far above ω₀ (at 2000 cm^-1, 1 − w = 6.25e-6); required to 1e-6 relative.
  const Species s = water_with({2000.0, 3657.0, 3756.0});
  const PreparedSpecies harmonic = prepare_species(s);
  const PreparedSpecies qrrho = prepare_species(s, with_method(LowFrequencyMethod::qrrho));
  for (double T : {298.15, 1000.0, 3000.0}) check_same_rows(qrrho, harmonic, T, 1e-6);
}

TEST_CASE("qrrho: a 10 cm^-1 mode has a finite entropy below the harmonic one") {
  const Species s = water_with({10.0, 1595.0, 3756.0});
  const ThermoPoint h = evaluate(prepare_species(s), 298.15);
  const ThermoPoint q = evaluate(prepare_species(s, with_method(LowFrequencyMethod::qrrho)), 298.15);
  CHECK(std::isfinite(q.S_J_per_mol_K));
  CHECK(q.vibration.S_over_R < h.vibration.S_over_R);
  // At w ≈ 1e-4 the mode is nearly the bounded free rotor: S/R → 1/2 + ½ ln(8π³μ'kT/h²) (Grimme eq. 5).
  AdjustedMode m;
  m.entropy_cm1 = m.enthalpy_cm1 = 10.0;
  m.qrrho_weight = qrrho_weight(10.0, 100.0, 4.0);
  LowFrequencyOptions o;
  o.method = LowFrequencyMethod::qrrho;
  CHECK(adjusted_mode_terms(o, m, 298.15).S_over_R ==
        doctest::Approx(free_rotor_entropy_over_R(10.0, 298.15, 1e-44)).epsilon(1e-3));
}

TEST_CASE("qrrho heat capacity is the temperature derivative of its enthalpy") {
  // Cp = dH/dT (definition), by a central difference of the engine's own H(T).
  const PreparedSpecies q =
      prepare_species(water_with({35.0, 1595.0, 3756.0}), with_method(LowFrequencyMethod::qrrho));
  for (double T : {100.0, 298.15, 1500.0}) {
    const double dT = 1e-3 * T;
    const double slope =
        (evaluate(q, T + dT).H_minus_H0_J_per_mol - evaluate(q, T - dT).H_minus_H0_J_per_mol) / (2 * dT);
    CHECK(evaluate(q, T).Cp_J_per_mol_K == doctest::Approx(slope).epsilon(1e-6));
  }
}

TEST_CASE("floor at 100 cm^-1 equals a harmonic run with that wavenumber set to 100") {
  // Ribeiro, Marenich, Cramer & Truhlar, J. Phys. Chem. B 115, 14556 (2011): modes below the
  // cutoff are raised to it; identity with the harmonic species at 100 cm^-1 (definition).
  const PreparedSpecies floor =
      prepare_species(water_with({12.0, 1595.0, 3756.0}), with_method(LowFrequencyMethod::floor));
  const PreparedSpecies raised = prepare_species(water_with({100.0, 1595.0, 3756.0}));
  for (double T : {50.0, 298.15, 2000.0}) check_same_rows(floor, raised, T, 1e-12);
  // The zero-point energy stays that of the given wavenumbers.
  CHECK(floor.zero_point_energy_J_per_mol ==
        doctest::Approx(0.5 * (12.0 + 1595.0 + 3756.0) * constants::wavenumber_J_per_mol));
  REQUIRE(floor.vibration_adjustment.modes.size() == 1);
  CHECK(floor.vibration_adjustment.modes[0].treated);
  // A cutoff given as an option.
  ModelOptions o = with_method(LowFrequencyMethod::floor);
  o.low_frequency.floor_cm1 = 150.0;
  check_same_rows(prepare_species(water_with({12.0, 1595.0, 3756.0}), o),
                  prepare_species(water_with({150.0, 1595.0, 3756.0})), 298.15, 1e-12);
}

TEST_CASE("harmonic soft modes are warned about with their share of S(298.15)") {
  const Species s = water_with({12.0, 1595.0, 3756.0});
  const PreparedSpecies harmonic = prepare_species(s);
  REQUIRE(harmonic.warnings.size() == 1);
  CHECK(harmonic.warnings[0].find("vibration 1 at 12.0 cm^-1") != std::string::npos);
  // The share is the oscillator's S(298.15)/R = x/(eˣ−1) − ln(1 − e^{−x}) (Einstein 1907).
  const double x = 12.0 * constants::second_radiation_cm_K / 298.15;
  const double S = R * (x / std::expm1(x) - std::log(-std::expm1(-x)));
  CHECK(harmonic.warnings[0].find(fmt::format("{:.2f} J/(mol K)", S)) != std::string::npos);
  // Treated modes are not warned about; the threshold is an option.
  CHECK(prepare_species(s, with_method(LowFrequencyMethod::qrrho)).warnings.empty());
  CHECK(prepare_species(s, with_method(LowFrequencyMethod::floor)).warnings.empty());
  ModelOptions quiet;
  quiet.low_frequency.soft_mode_warning_below_cm1 = 10.0;
  CHECK(prepare_species(s, quiet).warnings.empty());
}

TEST_CASE("scale factors per quantity") {
  // ZPE from the ZPE factor, S and Cp from the entropy factor, H − H0 from the enthalpy factor.
  const Species s = test::water();
  ModelOptions o;
  o.scale = {0.9, 0.95, 0.97};
  const PreparedSpecies p = prepare_species(s, o);
  CHECK(p.zero_point_energy_J_per_mol ==
        doctest::Approx(0.5 * 0.9 * (3657.0 + 1595.0 + 3756.0) * constants::wavenumber_J_per_mol)
            .epsilon(1e-13));
  ModelOptions entropy_only, enthalpy_only;
  entropy_only.frequency_scale = 0.97;
  enthalpy_only.frequency_scale = 0.95;
  const ThermoPoint a = evaluate(p, 700.0);
  const ThermoPoint e = evaluate(prepare_species(s, entropy_only), 700.0);
  const ThermoPoint h = evaluate(prepare_species(s, enthalpy_only), 700.0);
  CHECK(a.S_J_per_mol_K == doctest::Approx(e.S_J_per_mol_K).epsilon(1e-13));
  CHECK(a.Cp_J_per_mol_K == doctest::Approx(e.Cp_J_per_mol_K).epsilon(1e-13));
  CHECK(a.H_minus_H0_J_per_mol == doctest::Approx(h.H_minus_H0_J_per_mol).epsilon(1e-13));
  // The file's factors apply unless the command line sets that quantity; --scale fills the rest.
  Species f = s;
  f.scale.zpe = 0.8;
  ModelOptions cli;
  cli.frequency_scale = 0.97;
  cli.scale.enthalpy = 0.95;
  const PreparedSpecies q = prepare_species(f, cli);
  CHECK(q.scale.zpe == 0.8);
  CHECK(q.scale.enthalpy == 0.95);
  CHECK(q.scale.entropy == 0.97);
  CHECK(std::any_of(q.notes.begin(), q.notes.end(), [](const std::string& n) {
    return n.find("zero-point energy 0.8, thermal enthalpy 0.95, entropy and heat capacity 0.97") !=
           std::string::npos;
  }));
  f.scale.zpe = -1.0;
  CHECK_THROWS_AS(prepare_species(f), InputError);
}
