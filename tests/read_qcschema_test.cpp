#include "vibtherm/read_qcschema.hpp"

#include <doctest/doctest.h>

#include <cmath>
#include <fstream>
#include <iterator>

#include "vibtherm/constants.hpp"
#include "vibtherm/electrons.hpp"
#include "vibtherm/read_species.hpp"
#include "vibtherm/thermo.hpp"

using namespace vibtherm;

namespace {

const std::string data_dir = VIBTHERM_TEST_DATA;

std::string qc_error(const std::string& text, bool geometry_only = false) {
  try {
    read_species_qcschema(text, "in.json", geometry_only);
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

// A two-atom result with an n×n Hessian `hessian` (JSON text) and driver `driver`.
std::string result(const std::string& driver, const std::string& extra) {
  return "{\"schema_name\": \"qcschema_output\",\n \"molecule\": {\"symbols\": [\"H\", \"H\"], \"geometry\": "
         "[0, 0, 0, 0, 0, 1.4]},\n \"driver\": \"" +
         driver + "\"" + extra + "}";
}

}  // namespace

// The same species typed as YAML (tests/data/water-model-hessian-full.yaml, the model force
// field, not data) and written as a QCSchema Hessian result (water-model-hessian.json, made
// from it by tests/data/make_water_exchange_files.py): everything agrees.
TEST_CASE("QCSchema: a Hessian result reads as the same species as the YAML Hessian") {
  const Species yaml = read_species_file(data_dir + "/water-model-hessian-full.yaml");
  Species qc = read_species_file(data_dir + "/water-model-hessian.json");
  CHECK(qc.name == "water-model-hessian");
  REQUIRE(qc.atoms.size() == 3);
  for (std::size_t i = 0; i < 3; ++i) {
    CHECK(qc.atoms[i].symbol == yaml.atoms[i].symbol);
    CHECK(qc.atoms[i].mass_amu == yaml.atoms[i].mass_amu);
    CHECK((qc.atoms[i].position_angstrom - yaml.atoms[i].position_angstrom).norm() < 1e-12);
  }
  REQUIRE(qc.hessian_J_per_m2.has_value());
  REQUIRE(qc.hessian_J_per_m2->size() == 81);
  for (std::size_t k = 0; k < 81; ++k)
    CHECK((*qc.hessian_J_per_m2)[k] == doctest::Approx((*yaml.hessian_J_per_m2)[k]).epsilon(1e-15));
  CHECK(qc.charge == 0);
  CHECK(choose_electronic_levels(qc).levels[0].degeneracy == 1);
  REQUIRE(qc.electronic_energy_J_per_mol.has_value());
  // -76.0 hartree (the file's placeholder) times E_h N_A (CODATA 2018).
  CHECK(*qc.electronic_energy_J_per_mol ==
        doctest::Approx(-76.0 * constants::hartree_J * constants::avogadro_per_mol).epsilon(1e-15));
  CHECK(qc.computed_with == "model-force-field/none");

  Species yaml2 = yaml;
  yaml2.symmetry_number = qc.symmetry_number = 2;
  const PreparedSpecies a = prepare_species(yaml2);
  const PreparedSpecies b = prepare_species(qc);
  REQUIRE(a.vibrations_cm1.size() == 3);
  REQUIRE(b.vibrations_cm1.size() == 3);
  for (std::size_t i = 0; i < 3; ++i) CHECK(std::abs(a.vibrations_cm1[i] - b.vibrations_cm1[i]) < 1e-6);
  for (double T : {200.0, 298.15, 1000.0, 3000.0}) {
    const ThermoPoint p = evaluate(a, T);
    const ThermoPoint q = evaluate(b, T);
    CHECK(q.Cp_J_per_mol_K == doctest::Approx(p.Cp_J_per_mol_K).epsilon(1e-9));
    CHECK(q.S_J_per_mol_K == doctest::Approx(p.S_J_per_mol_K).epsilon(1e-9));
    CHECK(q.H_minus_H0_J_per_mol == doctest::Approx(p.H_minus_H0_J_per_mol).epsilon(1e-9));
  }
  CHECK(b.notes.front() == "QCSchema result computed with model-force-field/none (driver hessian)");
}

TEST_CASE("QCSchema: flat Hessian, masses, charge and multiplicity") {
  // H2 at 1.4 bohr with a made-up 6×6 stretch Hessian k = 0.37 hartree/bohr² (form only).
  const std::string k = "0.37";
  const std::string flat = "[0,0,0,0,0,0, 0,0,0,0,0,0, 0,0," + k + ",0,0,-" + k +
                           ", 0,0,0,0,0,0, 0,0,0,0,0,0, 0,0,-" + k + ",0,0," + k + "]";
  const Species s = read_species_qcschema(result("hessian", ", \"return_result\": " + flat), "dir/h2.json");
  CHECK(s.name == "h2");  // the file's stem without a molecule name
  REQUIRE(s.hessian_J_per_m2.has_value());
  CHECK((*s.hessian_J_per_m2)[2 * 6 + 2] > 0.0);
  CHECK(s.atoms[1].position_angstrom.z() ==
        doctest::Approx(1.4 * constants::bohr_radius_m / constants::angstrom_m));

  // Masses name isotopes (AME2016 deuterium mass, as in src/elements.cpp); charge and
  // multiplicity are read; without a multiplicity the lowest the electrons allow.
  const std::string hd =
      "{\"schema_name\": \"qcschema_molecule\", \"name\": \"HD+\", \"symbols\": [\"h\", \"H\"], "
      "\"geometry\": [0, 0, 0, 0, 0, 2.0], \"masses\": [1.00782503223, 2.01410177812], "
      "\"molecular_charge\": 1, \"molecular_multiplicity\": 2}";
  const Species m = read_species_qcschema(hd, "hd.json", true);
  CHECK(m.name == "HD+");
  CHECK(m.atoms[0].isotope.empty());
  CHECK(m.atoms[1].isotope == "D");
  CHECK(m.atoms[1].mass_number == 2);
  CHECK(m.charge == 1);
  CHECK(m.electronic_levels[0].degeneracy == 2);
  // No multiplicity: the reader leaves the levels to the parity rule, 9 electrons give a
  // doublet (QCSchema's default too).
  const Species oh = read_species_qcschema(
      "{\"schema_name\": \"qcschema_molecule\", \"symbols\": [\"O\", \"H\"], \"geometry\": [[0, 0, 0], [0, "
      "0, 1.8]]}",
      "oh.json", true);
  CHECK(oh.electronic_levels.empty());
  CHECK(choose_electronic_levels(oh).levels[0].degeneracy == 2);
}

TEST_CASE("QCSchema: errors are located") {
  CHECK(qc_error("{\"schema_name\": \"qcschema_output\",\n \"molecule\": [1, 2") ==
        "in.json:2:19: error: malformed JSON (syntax error while parsing array - unexpected end of input; "
        "expected ']'), expected a QCSchema result (schema_name qcschema_output or qcschema_result) or "
        "molecule (qcschema_molecule)");
  CHECK(qc_error("{\"schema_name\": \"qcschema_input\"}") ==
        "in.json:1:17: error: 'schema_name' is 'qcschema_input' (a job's input, not its result), expected a "
        "QCSchema result (schema_name qcschema_output or qcschema_result) or molecule (qcschema_molecule)");
  CHECK(
      qc_error(result("energy", ", \"return_result\": -1.1")) ==
      "in.json:3:12: error: 'driver' is 'energy': this result holds no Hessian, expected a result of driver "
      "'hessian' (or name this file with 'from:' in a species file that gives 'frequencies')");
  CHECK(qc_error(result("energy", ", \"return_result\": -1.1"), true) == "no error");
  CHECK(qc_error(result("hessian", ",\n \"return_result\": [[1, 2], [3, 4]]")) ==
        "in.json:4:19: error: 'return_result' has 2 rows, expected 6 rows of 6 (the 6×6 Cartesian Hessian in "
        "hartree/bohr^2 for N = 2 atoms)");
  CHECK(
      qc_error("{\"schema_name\": \"qcschema_molecule\", \"symbols\": [\"H\", \"H\"],\n \"geometry\": [0, 0, "
               "0, 0, 0, 1e999]}",
               true) ==
      "in.json:2:30: error: malformed JSON (number overflow parsing '1e999'), expected a QCSchema result "
      "(schema_name qcschema_output or qcschema_result) or molecule (qcschema_molecule)");
  CHECK(qc_error(
            "{\"schema_name\": \"qcschema_molecule\", \"symbols\": [\"H\", \"Q\"], \"geometry\": [0, 0, 0, "
            "0, 0, 1]}",
            true)
            .rfind("in.json:1:55: error: unknown element symbol 'Q'", 0) == 0);
  CHECK(qc_error("{\"schema_name\": \"qcschema_molecule\", \"symbols\": [\"C\"], \"geometry\": [0, 0, 0], "
                 "\"masses\": [12.011]}",
                 true) ==
        "in.json:1:90: error: mass 12.011 of atom 1 (C) is no isotope mass of C within 5e-05 amu, expected "
        "one of "
        "C12, C13, C14 (isotope masses, not average atomic weights)");
  CHECK(
      qc_error(
          "{\"schema_name\": \"qcschema_molecule\", \"symbols\": [\"H\", \"H\"], \"geometry\": [0, 0, 0, 0, "
          "0, 1]}") ==
      "in.json:1:17: error: a QCSchema molecule holds no vibrations, expected a result of driver 'hessian' "
      "(or "
      "name this file with 'from:' in a species file that gives 'frequencies')");
  CHECK(qc_error("[1]") ==
        "in.json:1:1: error: top level is a list, expected a QCSchema result (schema_name qcschema_output or "
        "qcschema_result) or molecule (qcschema_molecule)");
  CHECK(qc_error(result("hessian", ", \"success\": false")) ==
        "in.json:3:34: error: 'success' is false: the job failed, expected the result of a finished job");
}

// `from:` in a YAML file: the QCSchema result's geometry and Hessian with deuterium put on
// top (tests/data/heavy-water-from-qcschema.yaml) equal the YAML Hessian with the same
// isotopes, so the D2O wavenumbers of the model agree to 1e-6 cm^-1.
TEST_CASE("from: a QCSchema result with isotopes on top gives the D2O of the YAML Hessian") {
  std::ifstream in(data_dir + "/water-model-hessian-full.yaml");
  const std::string text((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
  const PreparedSpecies yaml = prepare_species(
      read_species_yaml(text + "isotopes: {2: D, 3: D}\n", data_dir + "/water-model-hessian-full.yaml"));
  const Species s = read_species_file(data_dir + "/heavy-water-from-qcschema.yaml");
  CHECK(s.name == "heavy-water-model");
  CHECK(s.symmetry_number == 2);
  CHECK(s.atoms[1].isotope == "D");
  REQUIRE(s.electronic_energy_J_per_mol.has_value());
  const PreparedSpecies qc = prepare_species(s);
  REQUIRE(qc.vibrations_cm1.size() == 3);
  for (std::size_t i = 0; i < 3; ++i) CHECK(std::abs(qc.vibrations_cm1[i] - yaml.vibrations_cm1[i]) < 1e-6);
  for (double T : {298.15, 1000.0}) {
    CHECK(evaluate(qc, T).S_J_per_mol_K == doctest::Approx(evaluate(yaml, T).S_J_per_mol_K).epsilon(1e-9));
    CHECK(evaluate(qc, T).Cp_J_per_mol_K == doctest::Approx(evaluate(yaml, T).Cp_J_per_mol_K).epsilon(1e-9));
  }
}

TEST_CASE("from: what the YAML may not redefine, and a file without vibrations") {
  const std::string dir = data_dir + "/x.yaml";
  try {
    read_species_yaml("from: water-model-hessian.json\natoms: [[H, 0, 0, 0]]\n", dir);
    FAIL("no error");
  } catch (const InputError& e) {
    CHECK(std::string(e.what()) ==
          dir +
              ":2:1: error: key 'atoms' cannot be combined with 'from' (the file gives the "
              "geometry and force field), expected 'frequencies' or 'isotopes' to change them");
  }
  CHECK_THROWS_WITH_AS(
      read_species_yaml("from: missing.json\n", dir),
      (dir + ":1:7: error: 'from' file 'missing.json' does not exist (paths are relative to this "
             "file)")
          .c_str(),
      InputError);
  // Frequencies given here replace the file's Hessian.
  const Species f =
      read_species_yaml("from: water-model-hessian.json\nfrequencies: [1595, 3657, 3756]\n", dir);
  CHECK_FALSE(f.hessian_J_per_m2.has_value());
  CHECK(f.frequencies_cm1 == std::vector<double>{1595.0, 3657.0, 3756.0});
  CHECK(f.name == "water-model-hessian");
}
