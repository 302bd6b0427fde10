#include "vibtherm/conformers.hpp"

#include <doctest/doctest.h>

#include <cmath>

#include "test_species.hpp"
#include "vibtherm/constants.hpp"
#include "vibtherm/thermo.hpp"

using namespace vibtherm;

namespace {

constexpr double R = constants::gas_constant_J_per_mol_K;

Species ensemble_of(std::vector<std::pair<Species, double>> members) {
  Species e;
  e.name = "ensemble";
  for (auto& [s, energy] : members) {
    Conformer c;
    c.file = s.name + ".yaml";
    c.species = s;
    c.relative_energy_J_per_mol = energy;
    e.conformers.push_back(c);
  }
  return e;
}

}  // namespace

TEST_CASE("two identical conformers: S larger by exactly R ln 2, the same Cp") {
  // Q = 2q for two equal terms (common practice: a degenerate pair of structures).
  const PreparedSpecies one = prepare_species(test::water());
  const PreparedSpecies two = prepare_species(ensemble_of({{test::water(), 0.0}, {test::water(), 0.0}}));
  for (double T : {100.0, 298.15, 1500.0}) {
    const ThermoPoint a = evaluate(one, T), b = evaluate(two, T);
    CHECK(b.S_J_per_mol_K - a.S_J_per_mol_K == doctest::Approx(R * std::log(2.0)).epsilon(1e-12));
    CHECK(b.Cp_J_per_mol_K == doctest::Approx(a.Cp_J_per_mol_K).epsilon(1e-13));
    CHECK(b.H_minus_H298_J_per_mol == doctest::Approx(a.H_minus_H298_J_per_mol).epsilon(1e-12));
    const auto populations = conformer_populations(two, T);
    REQUIRE(populations.size() == 2);
    CHECK(populations[0] == doctest::Approx(0.5).epsilon(1e-15));
  }
  CHECK(two.zero_point_energy_J_per_mol == doctest::Approx(one.zero_point_energy_J_per_mol).epsilon(1e-15));
}

TEST_CASE("a conformer 100 kJ/mol higher changes nothing at 300 K") {
  // Its population is e^{−100 kJ/mol / RT} ≈ 4e-18 at 300 K (Boltzmann, common practice).
  const PreparedSpecies one = prepare_species(test::water());
  const PreparedSpecies two = prepare_species(ensemble_of({{test::water(), 0.0}, {test::water(), 100e3}}));
  const ThermoPoint a = evaluate(one, 300.0), b = evaluate(two, 300.0);
  CHECK(std::abs(b.S_J_per_mol_K - a.S_J_per_mol_K) <= 1e-9 * a.S_J_per_mol_K);
  CHECK(std::abs(b.Cp_J_per_mol_K - a.Cp_J_per_mol_K) <= 1e-9 * a.Cp_J_per_mol_K);
  CHECK(std::abs(b.H_minus_H298_J_per_mol - a.H_minus_H298_J_per_mol) <=
        1e-9 * std::abs(a.H_minus_H0_J_per_mol));
}

TEST_CASE("conformers with their own structures and ZPE") {
  // Two different structures: S is the population-weighted entropy plus −R Σ p ln p, and Cp
  // is dH/dT (definitions); the ZPE difference enters the levels for electronic energies.
  Species b = test::water();
  b.name = "water-b";
  b.frequencies_cm1 = {1400.0, 3657.0, 3756.0};  // a model second conformer, not data
  const PreparedSpecies e = prepare_species(ensemble_of({{test::water(), 0.0}, {b, 2e3}}));
  const double T = 500.0;
  const ThermoPoint x = evaluate(e, T);
  const ThermoPoint pa = evaluate(prepare_species(test::water()), T), pb = evaluate(prepare_species(b), T);
  const auto p = conformer_populations(e, T);
  const double zpe_a = 0.5 * (1595.0 + 3657.0 + 3756.0) * constants::wavenumber_J_per_mol;
  const double zpe_b = 0.5 * (1400.0 + 3657.0 + 3756.0) * constants::wavenumber_J_per_mol;
  // Levels: ΔE + ZPE; conformer b lies 2 kJ/mol − 97.5 cm^-1 above a.
  const double lowest = std::min(zpe_a, 2e3 + zpe_b);
  CHECK(e.zero_point_energy_J_per_mol == doctest::Approx(lowest).epsilon(1e-13));
  CHECK(x.S_J_per_mol_K == doctest::Approx(p[0] * pa.S_J_per_mol_K + p[1] * pb.S_J_per_mol_K -
                                           R * (p[0] * std::log(p[0]) + p[1] * std::log(p[1])))
                               .epsilon(1e-12));
  const double dT = 0.5;
  const double slope =
      (evaluate(e, T + dT).H_minus_H0_J_per_mol - evaluate(e, T - dT).H_minus_H0_J_per_mol) / (2 * dT);
  CHECK(x.Cp_J_per_mol_K == doctest::Approx(slope).epsilon(1e-6));
  // Zero-point-inclusive energies: the ZPE is not added again.
  Species zi = ensemble_of({{test::water(), 0.0}, {b, 2e3}});
  zi.conformer_energies_include_zpe = true;
  const PreparedSpecies z = prepare_species(zi);
  CHECK(z.conformers[1].level_J_per_mol == doctest::Approx(2e3).epsilon(1e-13));
  // Conformers of another composition are refused.
  CHECK_THROWS_AS(prepare_species(ensemble_of({{test::water(), 0.0}, {test::oxygen(), 1e3}})), InputError);
}
