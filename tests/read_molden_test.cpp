#include "vibtherm/read_molden.hpp"

#include <doctest/doctest.h>

#include <cmath>

#include "vibtherm/constants.hpp"
#include "vibtherm/read_species.hpp"
#include "vibtherm/thermo.hpp"

using namespace vibtherm;

namespace {

const std::string data_dir = VIBTHERM_TEST_DATA;

std::string molden_error(const std::string& text) {
  try {
    read_species_molden(text, "in.molden");
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

const std::string h2_coord = "[FR-COORD]\nH 0 0 0\nH 0 0 1.4\n";

}  // namespace

// tests/data/water-model*.molden are the normal modes of the model force field of
// water-model-hessian-full.yaml (not data), written by tests/data/make_water_exchange_files.py;
// one lists the 3 vibrations, the other all 9 entries. Both give the YAML's thermochemistry.
TEST_CASE("Molden: with and without the six near-zero modes, the same thermochemistry as the YAML Hessian") {
  Species yaml = read_species_file(data_dir + "/water-model-hessian-full.yaml");
  const PreparedSpecies reference = prepare_species(yaml);
  for (const char* name : {"water-model.molden", "water-model-all-modes.molden"}) {
    CAPTURE(name);
    Species m = read_species_file(data_dir + "/" + name);
    CHECK(m.name == std::string(name).substr(0, std::string(name).size() - 7));
    REQUIRE(m.atoms.size() == 3);
    for (std::size_t i = 0; i < 3; ++i)
      CHECK((m.atoms[i].position_angstrom - yaml.atoms[i].position_angstrom).norm() < 1e-11);
    REQUIRE(m.frequencies_cm1.size() == 3);
    m.symmetry_number = 2;  // as in the YAML file
    const PreparedSpecies p = prepare_species(m);
    for (std::size_t i = 0; i < 3; ++i)
      CHECK(std::abs(p.vibrations_cm1[i] - reference.vibrations_cm1[i]) < 1e-6);
    for (double T : {200.0, 298.15, 1000.0, 3000.0}) {
      const ThermoPoint a = evaluate(reference, T);
      const ThermoPoint b = evaluate(p, T);
      CHECK(b.Cp_J_per_mol_K == doctest::Approx(a.Cp_J_per_mol_K).epsilon(1e-9));
      CHECK(b.S_J_per_mol_K == doctest::Approx(a.S_J_per_mol_K).epsilon(1e-9));
      CHECK(b.H_minus_H0_J_per_mol == doctest::Approx(a.H_minus_H0_J_per_mol).epsilon(1e-9));
    }
    CHECK(p.zero_point_energy_J_per_mol ==
          doctest::Approx(reference.zero_point_energy_J_per_mol).epsilon(1e-9));
    const bool all = std::string(name).find("all") != std::string::npos;
    CHECK(m.reader_notes.size() == (all ? 1u : 0u));
    if (all)
      CHECK(m.reader_notes[0] ==
            "Molden file: dropped 6 near-zero [FREQ] entries (|wavenumber| <= 0.0192 cm^-1) as translations "
            "and "
            "rotations, keeping 3 vibrations");
  }
}

TEST_CASE("Molden: [Atoms] in AU or Angs, a linear molecule's five external entries") {
  const std::string au = "[Molden Format]\n[Atoms] AU\nH 1 1 0 0 0\nH 2 1 0 0 1.4\n[FREQ]\n4401\n";
  const std::string angs = "[MOLDEN FORMAT]\n[ATOMS] Angs\nH 1 1 0 0 0\nH 2 1 0 0 0.74\n[FREQ]\n4401\n";
  const Species a = read_species_molden(au, "h2.molden");
  const Species b = read_species_molden(angs, "h2.molden");
  CHECK(a.atoms[1].position_angstrom.z() ==
        doctest::Approx(1.4 * constants::bohr_radius_m / constants::angstrom_m));
  CHECK(b.atoms[1].position_angstrom.z() == 0.74);
  CHECK(a.frequencies_cm1 == std::vector<double>{4401.0});
  // Six entries for a diatomic (3N = 6): the five smallest are translations and rotations.
  const Species c = read_species_molden(
      "[Molden Format]\n" + h2_coord + "[FREQ]\n-0.5\n0.1\n0.2\n4401\n3.0\n-4\n", "h2.molden");
  CHECK(c.frequencies_cm1 == std::vector<double>{4401.0});
}

TEST_CASE("Molden: errors are located") {
  CHECK(molden_error("[FREQ]\n100\n") ==
        "in.molden:1:1: error: first section is '[FREQ]', expected a Molden file to start with [Molden "
        "Format]");
  CHECK(molden_error("[Molden Format]\n[Atoms] Bohr\nH 1 1 0 0 0\nH 2 1 0 0 1.4\n[FREQ]\n4401\n") ==
        "in.molden:2:9: error: [Atoms] unit is 'Bohr', expected AU (bohr) or Angs (ångström) after [Atoms]");
  CHECK(molden_error("[Molden Format]\n" + h2_coord) ==
        "in.molden:1:1: error: no [FREQ] section: this Molden file holds no normal modes, expected [FREQ] "
        "(or name "
        "this file with 'from:' in a species file that gives 'frequencies')");
  CHECK(molden_error("[Molden Format]\n" + h2_coord + "[FREQ]\nnan\n") ==
        "in.molden:6:1: error: [FREQ] entry 1 is 'nan', expected a finite number");
  CHECK(
      molden_error("[Molden Format]\n" + h2_coord + "[FREQ]\n4401\n120\n") ==
      "in.molden:7:1: error: [FREQ] entry 2 is 120 cm^-1: the file lists 2 entries for 1 vibrations and this "
      "would be dropped as a translation or rotation, expected those 1 entries below 50 cm^-1");
  CHECK(
      molden_error("[Molden Format]\n" + h2_coord + "[FREQ]\n4401\n[FR-NORM-COORD]\nvibration 1\n0 0 1\n") ==
      "in.molden:8:1: error: [FR-NORM-COORD] vibration 1 has 1 atom lines, expected 2");
  CHECK(molden_error("[Molden Format]\n[FR-COORD]\nH 0 0\n") ==
        "in.molden:3:1: error: [FR-COORD] atom 1 has 3 fields, expected 4 (symbol x y z in bohr)");
  CHECK(molden_error("[Molden Format]\n" + h2_coord + "[FREQ]\n4401\n[INT]\n1\n2\n") ==
        "in.molden:7:1: error: [INT] has 2 lines, expected 1 (one per [FREQ] wavenumber)");
}

TEST_CASE("from: a Molden file with the YAML's symmetry number and enthalpy equals the YAML") {
  // tests/data/water-from-molden.yaml adds σ = 2 and ΔfH° of water.yaml to the model's modes.
  const Species s = read_species_file(data_dir + "/water-from-molden.yaml");
  CHECK(s.name == "water-model-all-modes");
  CHECK(s.symmetry_number == 2);
  REQUIRE(s.enthalpy_of_formation_J_per_mol.has_value());
  CHECK(*s.enthalpy_of_formation_J_per_mol == doctest::Approx(-241826.0));
  const PreparedSpecies a = prepare_species(s);
  const PreparedSpecies b = prepare_species(read_species_file(data_dir + "/water-model-hessian-full.yaml"));
  for (double T : {200.0, 1000.0})
    CHECK(evaluate(a, T).S_J_per_mol_K == doctest::Approx(evaluate(b, T).S_J_per_mol_K).epsilon(1e-9));
  CHECK(a.notes.front().rfind("Molden file: dropped 6", 0) == 0);
}
