#include "vibtherm/hindered_rotor.hpp"

#include <doctest/doctest.h>

#include <cmath>

#include "test_species.hpp"
#include "vibtherm/constants.hpp"
#include "vibtherm/thermo.hpp"

using namespace vibtherm;
namespace c = vibtherm::constants;

namespace {

constexpr double amu_A2_kg_m2 = c::atomic_mass_constant_kg * c::angstrom_m * c::angstrom_m;

// B = ħ²/(2I) in J/mol for a moment in amu Å².
double rotational_constant_J_per_mol(double I_amu_A2) {
  const double hbar = c::planck_J_s / (2.0 * c::pi);
  return hbar * hbar / (2.0 * I_amu_A2 * amu_A2_kg_m2) * c::avogadro_per_mol;
}

// Test geometry (not a measured structure): two carbons on z, three hydrogens on each at
// 1 Å from the axis, staggered, 1.5 Å apart.
std::vector<Atom> ethane_like() {
  using test::atom;
  std::vector<Atom> atoms = {atom("C", test::mass_C12, 0, 0, 0.75), atom("C", test::mass_C12, 0, 0, -0.75)};
  for (int i = 0; i < 3; ++i) {
    const double up = 2.0 * c::pi * i / 3.0, down = up + c::pi / 3.0;
    atoms.push_back(atom("H", test::mass_H1, std::cos(up), std::sin(up), 1.1));
    atoms.push_back(atom("H", test::mass_H1, std::cos(down), std::sin(down), -1.1));
  }
  return atoms;
}

}  // namespace

TEST_CASE("reduced moment of two identical tops is half of one top's moment") {
  const std::vector<Atom> atoms = ethane_like();
  const std::vector<int> top = top_by_connectivity(atoms, 0, 1, {});
  CHECK(top == std::vector<int>{0, 2, 4, 6});
  // Each top: three H at 1 Å from the axis, I_A = 3 m_H (textbook sum m r²); identical
  // tops give I_A² / (2 I_A) = I_A / 2.
  CHECK(reduced_moment_amu_A2(atoms, 0, 1, top) == doctest::Approx(1.5 * test::mass_H1).epsilon(1e-12));
  // A top given on the other side of the bond yields the same reduced moment.
  CHECK(reduced_moment_amu_A2(atoms, 1, 0, {1, 3, 5, 7}) ==
        doctest::Approx(1.5 * test::mass_H1).epsilon(1e-12));
}

TEST_CASE("a ring bond cannot be split into two tops") {
  using test::atom;
  // Test geometry: a triangle of carbons 1.5 Å apart.
  const std::vector<Atom> ring = {atom("C", 12, 0, 0, 0), atom("C", 12, 1.5, 0, 0),
                                  atom("C", 12, 0.75, 1.299, 0)};
  CHECK_THROWS_AS(top_by_connectivity(ring, 0, 1, {}), InputError);
}

TEST_CASE("zero barrier: the free internal rotor") {
  const double I = 1.5;  // amu Å², test parameter
  const TorsionLevels levels = torsion_levels(I, cosine_barrier(0.0, 3));
  // Free rotor levels B m², each |m| > 0 twice (textbook).
  const double B = rotational_constant_J_per_mol(I);
  REQUIRE(levels.energies_J_per_mol.size() >= 5);
  CHECK(levels.energies_J_per_mol[1] == doctest::Approx(B).epsilon(1e-10));
  CHECK(levels.energies_J_per_mol[2] == doctest::Approx(B).epsilon(1e-10));
  CHECK(levels.energies_J_per_mol[3] == doctest::Approx(4.0 * B).epsilon(1e-10));
  CHECK(levels.zero_point_energy_J_per_mol == doctest::Approx(0.0));
  // Classical free internal rotor q = √(8π³ I k T) / (σ h) (Pitzer & Gwinn 1942, textbook
  // form, from memory); the quantum sum agrees to exponentially small terms once B ≪ kT.
  for (double T : {300.0, 1000.0}) {
    const MotionTerms t = hindered_rotor_terms(levels, 3, T);
    const double q = std::sqrt(8.0 * std::pow(c::pi, 3) * I * amu_A2_kg_m2 * c::boltzmann_J_per_K * T) /
                     (3.0 * c::planck_J_s);
    CHECK(std::exp(t.ln_q) == doctest::Approx(q).epsilon(1e-9));
    // Classical Cv/R = ½ (equipartition, one quadratic term).
    CHECK(t.Cv_over_R == doctest::Approx(0.5).epsilon(1e-6));
  }
}

TEST_CASE("high barrier: the torsional oscillator") {
  const double I = 3.0, V = 200e3;  // amu Å², J/mol: test parameters
  const int n = 3;
  const TorsionLevels levels = torsion_levels(I, cosine_barrier(V, n));
  // Small oscillations of V/2 (1 − cos nφ) ≈ V n² φ²/4 have ω = n √(V/(2I)), so
  // ħω = n √(V B) with B = ħ²/(2I) (derived). First-order perturbation by the quartic term
  // −V n⁴ φ⁴/48 lowers the first spacing by n² B / 4 (derived). The n levels of each
  // well are degenerate to tunnelling splittings, so the first excited one is level n.
  const double B = rotational_constant_J_per_mol(I);
  const double hw = n * std::sqrt(V * B);
  const double spacing = levels.energies_J_per_mol[n] - levels.energies_J_per_mol[0];
  CHECK(levels.energies_J_per_mol[n - 1] < 1e-6 * hw);
  CHECK(spacing == doctest::Approx(hw - n * n * B / 4.0).epsilon(3e-3));
  CHECK(std::abs(spacing - hw) > 1e-2 * hw);  // the anharmonic shift is resolved
  CHECK(levels.zero_point_energy_J_per_mol == doctest::Approx(hw / 2.0).epsilon(2e-2));
  // Between ħω/k (1.3e3 K) and V/R (2.4e4 K) the torsion is a classical oscillator,
  // Cv/R ≈ 1 (Pitzer & Gwinn 1942, from memory).
  CHECK(hindered_rotor_terms(levels, n, 3000.0).Cv_over_R == doctest::Approx(1.0).epsilon(0.08));
  // Far below ħω/k it is frozen.
  CHECK(hindered_rotor_terms(levels, n, 100.0).Cv_over_R < 1e-3);
}

TEST_CASE("low barrier: the free-rotor limit at T >> V/k") {
  const double I = 1.5;                                                    // amu Å², test parameter
  const TorsionLevels levels = torsion_levels(I, cosine_barrier(2e3, 3));  // V/R = 240 K
  // Classical hindered rotor (Pitzer & Gwinn 1942, from memory): Cv/R → ½ as V/kT → 0.
  CHECK(hindered_rotor_terms(levels, 3, 5000.0).Cv_over_R == doctest::Approx(0.5).epsilon(5e-3));
  // Near the barrier-crossing temperature Cv/R exceeds its free-rotor value.
  CHECK(hindered_rotor_terms(levels, 3, 150.0).Cv_over_R > 0.5);
}

TEST_CASE("internal symmetry number divides q") {
  const TorsionLevels levels = torsion_levels(1.5, cosine_barrier(12e3, 3));
  const MotionTerms one = hindered_rotor_terms(levels, 1, 500.0),
                    three = hindered_rotor_terms(levels, 3, 500.0);
  // ln q − ln σ_int (textbook): S drops by R ln 3, energies and Cv unchanged.
  CHECK(one.S_over_R - three.S_over_R == doctest::Approx(std::log(3.0)).epsilon(1e-12));
  CHECK(one.Cv_over_R == doctest::Approx(three.Cv_over_R).epsilon(1e-14));
  CHECK(one.U_over_RT == doctest::Approx(three.U_over_RT).epsilon(1e-14));
}

TEST_CASE("a cosine potential given as a scan gives the barrier's levels") {
  const double V = 12e3;  // J/mol, test parameter
  std::vector<ScanPoint> scan;
  for (int deg = 0; deg < 120; deg += 10)
    scan.push_back({deg + 0.0, 0.5 * V * (1.0 - std::cos(3.0 * deg * c::pi / 180.0))});
  const TorsionLevels a = torsion_levels(1.5, cosine_barrier(V, 3));
  const TorsionLevels b = torsion_levels(1.5, fit_scan(scan, 3, {}));
  REQUIRE(a.energies_J_per_mol.size() == b.energies_J_per_mol.size());
  for (std::size_t i = 1; i < 40; ++i)
    CHECK(b.energies_J_per_mol[i] == doctest::Approx(a.energies_J_per_mol[i]).epsilon(1e-6));
  CHECK(b.zero_point_energy_J_per_mol == doctest::Approx(a.zero_point_energy_J_per_mol).epsilon(1e-6));
  // A scan over the whole circle, shifted by 60°, has the same levels (a phase shift).
  std::vector<ScanPoint> full;
  for (int deg = 0; deg < 360; deg += 15)
    full.push_back({deg + 0.0, 0.5 * V * (1.0 - std::cos(3.0 * (deg + 60.0) * c::pi / 180.0))});
  const TorsionLevels d = torsion_levels(1.5, fit_scan(full, 3, {}));
  for (std::size_t i = 1; i < 40; ++i)
    CHECK(d.energies_J_per_mol[i] == doctest::Approx(a.energies_J_per_mol[i]).epsilon(1e-6));
}

TEST_CASE("a scan must cover a whole period") {
  std::vector<ScanPoint> half;
  for (int deg = 0; deg <= 60; deg += 10) half.push_back({deg + 0.0, 1e3 * deg});
  CHECK_THROWS_AS(fit_scan(half, 3, {}), InputError);
}

TEST_CASE("basis size converges the levels") {
  // The automatic basis against one twice as large: the thermally reachable levels agree.
  const TorsionPotential v = cosine_barrier(12e3, 3);
  const TorsionLevels automatic = torsion_levels(1.5, v);
  const TorsionLevels larger = torsion_levels(1.5, v, 2 * automatic.basis_max_m);
  for (std::size_t i = 1; i < 100; ++i)
    CHECK(automatic.energies_J_per_mol[i] == doctest::Approx(larger.energies_J_per_mol[i]).epsilon(1e-10));
  const MotionTerms a = hindered_rotor_terms(automatic, 3, 3000.0),
                    b = hindered_rotor_terms(larger, 3, 3000.0);
  CHECK(a.S_over_R == doctest::Approx(b.S_over_R).epsilon(1e-10));
}

TEST_CASE("engine: the rotor replaces its torsion") {
  Species s;
  s.name = "ethane-like test species";
  s.atoms = ethane_like();
  s.formula = {{"C", 2}, {"H", 6}};
  s.symmetry_number = 6;
  // Test wavenumbers (not measured): 18 modes, the torsion at 300.
  s.frequencies_cm1 = {300,  800,  800,  1000, 1200, 1200, 1400, 1400, 1400,
                       1450, 1450, 1450, 1450, 2900, 2950, 2950, 3000, 3000};
  HinderedRotor r;
  r.bond_atoms = {0, 1};
  r.symmetry = 3;
  r.barrier_J_per_mol = 12e3;
  r.replaces_cm1 = 300.4;
  s.hindered_rotors = {r};
  const PreparedSpecies harmonic = prepare_species([&] {
    Species h = s;
    h.hindered_rotors.clear();
    return h;
  }());
  const PreparedSpecies p = prepare_species(s);
  CHECK(p.vibrations_cm1.size() == 17);
  REQUIRE(p.hindered_rotors.size() == 1);
  // ZPE: the harmonic ½hcν̃ of the torsion is exchanged for the rotor's own (definition).
  CHECK(p.zero_point_energy_J_per_mol ==
        doctest::Approx(harmonic.zero_point_energy_J_per_mol - 150.0 * c::wavenumber_J_per_mol +
                        p.hindered_rotors[0].levels.zero_point_energy_J_per_mol)
            .epsilon(1e-12));
  // Classical limit: ½ for the rotor instead of 1 for the oscillator.
  CHECK(classical_Cv_over_R(p) == doctest::Approx(classical_Cv_over_R(harmonic) - 0.5));
  const ThermoPoint t = evaluate(p, 800.0);
  const double R = c::gas_constant_J_per_mol_K;
  const double sum_Cv = t.translation.Cv_over_R + t.rotation.Cv_over_R + t.vibration.Cv_over_R +
                        t.internal_rotation.Cv_over_R + t.electronic.Cv_over_R;
  CHECK(t.Cv_J_per_mol_K == doctest::Approx(R * sum_Cv).epsilon(1e-12));
  CHECK(t.internal_rotation.Cv_over_R > 0.5);

  Species wrong = s;
  wrong.hindered_rotors[0].replaces_cm1 = 310.0;
  CHECK_THROWS_AS(prepare_species(wrong), InputError);

  // A symmetry above limits::max_rotor_symmetry once crashed the solver (empty blocks) or
  // exhausted memory (2147483647): refused by the builder too, for species built in code.
  for (int sigma : {13, 200, 2147483647}) {
    Species big = s;
    big.hindered_rotors[0].symmetry = sigma;
    CHECK_THROWS_WITH_AS(prepare_species(big), doctest::Contains("symmetry is"), InputError);
  }
}
