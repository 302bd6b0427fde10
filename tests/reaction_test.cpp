// Reaction thermochemistry: exact identities (ΔG = ΔH − TΔS, ln K = −ΔG/RT, Kc = Kp
// (p°/RTc°)^Δn, reverse reaction), balance errors, the ln K fit and the unknown ΔfH°.
#include "vibtherm/reaction.hpp"

#include <doctest/doctest.h>

#include <cmath>

#include "test_species.hpp"
#include "vibtherm/constants.hpp"
#include "vibtherm/formation.hpp"
#include "vibtherm/read_method.hpp"

using namespace vibtherm;

namespace {

constexpr double R = constants::gas_constant_J_per_mol_K;

// H2: r_e = 0.74144 Å, fundamental 4161.17 cm^-1 (Huber & Herzberg 1979, from memory).
Species hydrogen() {
  Species s;
  s.name = "H2";
  s.atoms = {test::atom("H", test::mass_H1, 0, 0, 0), test::atom("H", test::mass_H1, 0, 0, 0.74144)};
  s.formula = {{"H", 2}};
  s.frequencies_cm1 = {4161.17};
  s.symmetry_number = 2;
  s.enthalpy_of_formation_J_per_mol = 0.0;  // element in its reference state (definition)
  return s;
}

Reaction water_dissociation(const ModelOptions& o = {}, double sign = 1.0) {
  Reaction r;
  r.name = "w";
  r.terms = {{"h2o.yaml", prepare_species(test::water(), o), -sign},
             {"h2.yaml", prepare_species(hydrogen(), o), sign},
             {"o2.yaml", prepare_species(test::oxygen(), o), 0.5 * sign}};
  return r;
}

bool close(double a, double b, double rel) {
  return std::abs(a - b) <= rel * std::max(std::abs(a), std::abs(b));
}

}  // namespace

TEST_CASE("reaction identities hold to 1e-12") {
  const Reaction r = water_dissociation();
  CHECK(reaction_equation(r) == "H2O = H2 + 0.5 O2");
  const ReactionTable t = reaction_table(r, {298.15, 1000.0, 1500.0, 2000.0});
  CHECK(t.basis == EnthalpyBasis::formation);
  CHECK(t.delta_n == 0.5);
  CHECK(t.Kp_reference_Pa == constants::bar_Pa);
  for (const auto& row : t.rows) {
    // Textbook identities: ΔG = ΔH − TΔS; ln Kp = −ΔG°/RT at p° = 1 bar; Kc = Kp (p°/RTc°)^Δn.
    CHECK(close(row.delta_G_J_per_mol, row.delta_H_J_per_mol - row.T_K * row.delta_S_J_per_mol_K, 1e-12));
    CHECK(close(std::log(row.Kp), -row.delta_G_J_per_mol / (R * row.T_K), 1e-12));
    CHECK(close(row.Kc, row.Kp * std::pow(constants::bar_Pa / (R * row.T_K * 1000.0), 0.5), 1e-12));
  }
  // At 298.15 K, ΔrH° = −ΔfH°(H2O) exactly on the formation basis (CODATA value of the species).
  CHECK(t.rows[0].delta_H_J_per_mol == doctest::Approx(241.826e3).epsilon(1e-12));
}

TEST_CASE("the reverse reaction gives opposite ΔG and reciprocal K") {
  const ReactionTable f = reaction_table(water_dissociation(), {500.0, 2000.0});
  const ReactionTable b = reaction_table(water_dissociation({}, -1.0), {500.0, 2000.0});
  for (std::size_t i = 0; i < f.rows.size(); ++i) {
    CHECK(close(f.rows[i].delta_G_J_per_mol, -b.rows[i].delta_G_J_per_mol, 1e-12));
    CHECK(close(f.rows[i].Kp * b.rows[i].Kp, 1.0, 1e-12));
    CHECK(close(f.rows[i].Kc * b.rows[i].Kc, 1.0, 1e-12));
  }
}

TEST_CASE("Kp and Kc do not depend on the standard state the species were prepared in") {
  // Thermodynamic identity: changing the standard state shifts ΔG° by Δn RT ln(p2/p1) and
  // the stated Kp converts back (common practice).
  ModelOptions atm;
  atm.standard_state = StandardState::atm;
  atm.pressure_Pa = constants::atmosphere_Pa;
  ModelOptions molar;
  molar.standard_state = StandardState::molar;
  const ReactionTable bar = reaction_table(water_dissociation(), {1500.0});
  const ReactionTable a = reaction_table(water_dissociation(atm), {1500.0});
  const ReactionTable m = reaction_table(water_dissociation(molar), {1500.0});
  CHECK(a.Kp_reference_Pa == constants::atmosphere_Pa);
  CHECK(close(a.rows[0].Kp, bar.rows[0].Kp * std::pow(constants::atmosphere_Pa / constants::bar_Pa, -0.5),
              1e-10));
  CHECK(close(m.rows[0].Kp, bar.rows[0].Kp, 1e-10));
  CHECK(close(m.rows[0].Kc, bar.rows[0].Kc, 1e-10));
  CHECK(close(a.rows[0].Kc, bar.rows[0].Kc, 1e-10));
}

TEST_CASE("unbalanced reactions and missing enthalpies are named") {
  Reaction r = water_dissociation();
  r.terms[2].coefficient = 1.0;
  CHECK_THROWS_WITH_AS(reaction_table(r, {300.0}),
                       doctest::Contains("does not balance: products minus reactants O +1"), InputError);
  r = water_dissociation();
  r.terms[0].prepared.species.enthalpy_of_formation_J_per_mol.reset();
  CHECK_THROWS_WITH_AS(reaction_table(r, {300.0}),
                       doctest::Contains("species 'H2O' (reaction 'w') has neither"), InputError);
  CHECK_THROWS_WITH_AS(solve_unknown_formation(water_dissociation(), 0),
                       doctest::Contains("species 'H2O' has no 'electronic_energy'"), InputError);
}

TEST_CASE("charge balance") {
  // H2O = H2 + ½O2 with one side charged: the elements balance, the charge does not.
  Reaction r = water_dissociation();
  r.terms[1].prepared.species.charge = 1;
  CHECK_THROWS_WITH_AS(reaction_table(r, {300.0}),
                       doctest::Contains("does not balance in charge: products minus reactants +1 e"),
                       InputError);
  // The atomization route is for neutral species.
  PreparedSpecies ion = prepare_species(test::water());
  ion.species.charge = 1;
  ion.species.electronic_energy_J_per_mol = -76.0;
  CHECK_THROWS_WITH_AS(
      atomization_formation_enthalpy(
          ion, read_method_yaml("label: m\nelements: {H: {energy: 0}, O: {energy: 0}}\n", "m")),
      doctest::Contains("has charge +1"), InputError);
}

TEST_CASE("electronic basis and the unknown ΔfH° (hand computation)") {
  Reaction r = water_dissociation();
  const double Eh = constants::hartree_J * constants::avogadro_per_mol;
  const double E[] = {-76.4, -1.17, -150.3};  // arbitrary: the identity holds for any energies
  for (std::size_t i = 0; i < 3; ++i) r.terms[i].prepared.species.electronic_energy_J_per_mol = E[i] * Eh;
  CHECK(choose_enthalpy_basis(r) == EnthalpyBasis::electronic);
  double dH = 0.0;
  for (std::size_t i = 0; i < 3; ++i) {
    const auto& p = r.terms[i].prepared;
    dH += r.terms[i].coefficient * (E[i] * Eh + p.zero_point_energy_J_per_mol + p.H298_minus_H0_J_per_mol);
  }
  const UnknownFormation u = solve_unknown_formation(r, 0);
  CHECK(u.delta_rH298_J_per_mol == doctest::Approx(dH).epsilon(1e-12));
  // ΔrH = ΔfH(H2) + ½ΔfH(O2) − ΔfH(H2O), both elements 0: ΔfH(H2O) = −ΔrH.
  CHECK(u.dfH298_J_per_mol == doctest::Approx(-dH).epsilon(1e-12));
  const ReactionTable t = reaction_table(r, {298.15});
  CHECK(t.rows[0].delta_H_J_per_mol == doctest::Approx(dH).epsilon(1e-12));
}

TEST_CASE("ln K fit recovers A, n and E of an exact modified-Arrhenius form") {
  std::vector<ReactionRow> rows;
  for (double T = 300; T <= 2000; T += 100) {
    ReactionRow row;
    row.T_K = T;
    row.Kp = 3.5 * std::pow(T, 1.7) * std::exp(-45e3 / (R * T));
    row.Kc = 2.0 * row.Kp;
    row.ln_Kp = std::log(row.Kp);
    row.ln_Kc = std::log(row.Kc);
    rows.push_back(row);
  }
  const LnKFit f = fit_ln_K(rows, false);
  CHECK(f.A == doctest::Approx(3.5).epsilon(1e-8));
  CHECK(f.n == doctest::Approx(1.7).epsilon(1e-8));
  CHECK(f.E_J_per_mol == doctest::Approx(45e3).epsilon(1e-8));
  CHECK(f.max_abs_deviation_ln < 1e-8);
  CHECK(fit_ln_K(rows, true).A == doctest::Approx(7.0).epsilon(1e-8));
  rows.resize(2);
  CHECK_THROWS_AS(fit_ln_K(rows, false), InputError);
}

TEST_CASE("spread of several results") {
  const Spread s = spread_of({1.0, 2.0, 3.0});
  CHECK(s.mean == 2.0);
  CHECK(s.standard_deviation == doctest::Approx(1.0));
  CHECK(s.min == 1.0);
  CHECK(s.max == 3.0);
  CHECK(spread_of({5.0}).standard_deviation == 0.0);
}
