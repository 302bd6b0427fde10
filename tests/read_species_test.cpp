#include "vibtherm/read_species.hpp"

#include <doctest/doctest.h>

#include <clocale>
#include <cmath>
#include <filesystem>
#include <fstream>

#include "vibtherm/constants.hpp"

using namespace vibtherm;

namespace {

const std::string data_dir = VIBTHERM_TEST_DATA;

std::string yaml_error(const std::string& text) {
  try {
    read_species_yaml(text, "in.yaml");
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

std::string xyz_error(const std::string& text) {
  try {
    read_species_xyz(text, "in.xyz");
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

const std::string water_atoms =
    "atoms:\n"
    "  - [O, 0.0, 0.0, 0.065569]\n"
    "  - [H, 0.0, 0.756950, -0.520313]\n"
    "  - [H, 0.0, -0.756950, -0.520313]\n";

void check_water(const Species& s) {
  CHECK(s.name == "water");
  REQUIRE(s.atoms.size() == 3);
  CHECK(s.atoms[0].symbol == "O");
  CHECK(s.atoms[0].mass_number == 16);
  CHECK(s.atoms[1].symbol == "H");
  CHECK(s.atoms[1].isotope.empty());
  CHECK(s.atoms[1].position_angstrom.y() == 0.756950);
  CHECK(s.atoms[2].position_angstrom.z() == -0.520313);
  CHECK(s.formula == std::map<std::string, int>{{"H", 2}, {"O", 1}});
  CHECK(s.frequencies_cm1 == std::vector<double>{1595.0, 3657.0, 3756.0});  // Shimanouchi, see water.yaml
  CHECK(s.symmetry_number == 2);
  REQUIRE(s.electronic_levels.size() == 1);
  CHECK(s.electronic_levels[0].degeneracy == 1);
  REQUIRE(s.enthalpy_of_formation_J_per_mol.has_value());
  CHECK(*s.enthalpy_of_formation_J_per_mol == doctest::Approx(-241826.0));
  CHECK(s.phase == Phase::gas);
  CHECK_FALSE(s.transition_state);
  CHECK_FALSE(s.rotor_data.has_value());
}

}  // namespace

TEST_CASE("YAML: water") {
  Species s = read_species_file(data_dir + "/water.yaml");
  check_water(s);
  CHECK(s.origin.file == data_dir + "/water.yaml");
}

TEST_CASE("XYZ: water reads the same as YAML") {
  Species s = read_species_file(data_dir + "/water.xyz");
  check_water(s);
}

TEST_CASE("YAML: O2 triplet and argon") {
  Species o2 = read_species_file(data_dir + "/oxygen.yaml");
  CHECK(o2.name == "O2");
  CHECK(o2.electronic_levels[0].degeneracy == 3);
  CHECK(o2.frequencies_cm1.size() == 1);
  Species ar = read_species_file(data_dir + "/argon.yaml");
  CHECK(ar.atoms.size() == 1);
  CHECK(ar.frequencies_cm1.empty());
  CHECK(ar.formula == std::map<std::string, int>{{"Ar", 1}});
}

TEST_CASE("YAML: rigid-rotor data instead of atoms") {
  Species co = read_species_file(data_dir + "/carbon_monoxide_rotor.yaml");
  REQUIRE(co.rotor_data.has_value());
  CHECK(co.atoms.empty());
  CHECK(co.rotor_data->linear);
  CHECK(co.rotor_data->mass_amu == 27.99491461957);
  REQUIRE(co.rotor_data->moments_amu_A2.size() == 1);
  // B [cm^-1] · I [amu Å²] = 16.857629 (h / 8π²c in these units; common practice, digits from memory).
  CHECK(co.rotor_data->moments_amu_A2[0] == doctest::Approx(16.857629 / 1.93128).epsilon(1e-6));
  CHECK(co.formula == std::map<std::string, int>{{"C", 1}, {"O", 1}});
  CHECK(*co.enthalpy_of_formation_J_per_mol == doctest::Approx(-110530.0));

  Species ch4 = read_species_yaml(
      "name: CH4\nmass: 16.0313\nmoments_of_inertia: [3.2, 3.2, 3.2]\nlinear: false\n"
      "formula: {C: 1, H: 4}\nfrequencies: [1306, 1306, 1306, 1534, 1534, 2917, 3019, 3019, 3019]\n",
      "ch4.yaml");
  CHECK(ch4.rotor_data->moments_amu_A2.size() == 3);
  CHECK_FALSE(ch4.rotor_data->linear);
  CHECK(ch4.formula == std::map<std::string, int>{{"C", 1}, {"H", 4}});

  // Rotational constants in GHz, as microwave spectroscopists give them.
  Species ghz = read_species_yaml(
      "name: x\nmass: 28\nrotational_constants: {values: [57.6, 57.6, 30], unit: GHz}\nfrequencies: [1000]\n",
      "x.yaml");
  REQUIRE(ghz.rotor_data->moments_amu_A2.size() == 3);
  // Sorted ascending: the largest constant (57.6 GHz) gives the smallest moment.
  CHECK(ghz.rotor_data->moments_amu_A2[0] == doctest::Approx(16.857629 / (57.6 / 29.9792458)).epsilon(1e-6));

  Species atom = read_species_yaml("name: Ne\nmass: 19.99244\n", "ne.yaml");
  CHECK(atom.rotor_data->moments_amu_A2.empty());
}

TEST_CASE("YAML: units, isotopes, levels and flags") {
  Species s = read_species_yaml("name: heavy water\n" + water_atoms +
                                    "isotopes: {2: D, 3: H2}\n"
                                    "frequencies: {values: [34.8, 82.2, 100], unit: meV}\n"
                                    "electronic_levels:\n"
                                    "  - {energy: 0, degeneracy: 2}\n"
                                    "  - {energy: {value: 1, unit: kJ/mol}, degeneracy: 2}\n"
                                    "  - {energy: {value: 100, unit: K}, degeneracy: 1}\n"
                                    "enthalpy_of_formation: {value: -1, unit: eV}\n"
                                    "phase: adsorbate\n"
                                    "transition_state: true\n",
                                "d2o.yaml");
  CHECK(s.atoms[1].isotope == "D");
  CHECK(s.atoms[1].mass_number == 2);
  CHECK(s.atoms[2].isotope == "H2");
  CHECK(s.atoms[2].mass_amu == s.atoms[1].mass_amu);
  CHECK(s.formula == std::map<std::string, int>{{"H", 2}, {"O", 1}});
  CHECK(s.frequencies_cm1[0] ==
        doctest::Approx(34.8 * 8.065543937));  // 1 meV = 8.065543937 cm^-1, from memory
  REQUIRE(s.electronic_levels.size() == 3);
  CHECK(s.electronic_levels[1].energy_cm1 ==
        doctest::Approx(83.593472));  // 1 kJ/mol = 83.593472 cm^-1, from memory
  CHECK(s.electronic_levels[2].energy_cm1 ==
        doctest::Approx(69.5034800));  // 1 K = 0.6950348 cm^-1, from memory
  CHECK(*s.enthalpy_of_formation_J_per_mol == doctest::Approx(-96485.33212));
  CHECK(s.phase == Phase::adsorbate);
  CHECK(s.transition_state);

  Species mixed = read_species_yaml(
      "name: m\n" + water_atoms + "frequencies: [1595, {value: 3657, unit: cm-1}, {value: 3756}]\n",
      "m.yaml");
  CHECK(mixed.frequencies_cm1 == std::vector<double>{1595.0, 3657.0, 3756.0});

  Species isotope_atoms = read_species_yaml(
      "name: c\natoms: [[C13, 0, 0, 0], [O18, 0, 0, 1.128]]\nfrequencies: [2000]\n", "c.yaml");
  CHECK(isotope_atoms.atoms[0].symbol == "C");
  CHECK(isotope_atoms.atoms[0].isotope == "C13");
  CHECK(isotope_atoms.atoms[1].mass_number == 18);
}

TEST_CASE("YAML: error messages carry line and column") {
  CHECK(yaml_error("name: w\n" + water_atoms + "frequncies: [1, 2, 3]\n") ==
        "in.yaml:6:1: error: unknown key 'frequncies' in the species, did you mean 'frequencies'?");
  CHECK(yaml_error("name: w\natoms:\n  - [Xq, 0, 0, 0]\n") ==
        "in.yaml:3:6: error: unknown element symbol 'Xq', did you mean 'Xe'?");
  CHECK(yaml_error("name: w\natoms:\n  - [CL, 0, 0, 0]\n") ==
        "in.yaml:3:6: error: unknown element symbol 'CL', did you mean 'Cl'?");
  CHECK(yaml_error("name: w\natoms:\n  - [C15, 0, 0, 0]\n") ==
        "in.yaml:3:6: error: unknown isotope 'C15', expected one of C12, C13, C14");
  CHECK(yaml_error("name: w\natoms: [[Ar, 0, 0, .nan]]\n") ==
        "in.yaml:2:20: error: atom 1 coordinate z is '.nan', expected a finite number");
  CHECK(yaml_error("name: w\n" + water_atoms + "frequencies: [1, 2, 3]\nsymmetry_number: 0\n") ==
        "in.yaml:7:18: error: 'symmetry_number' is '0', expected a positive whole number");
  CHECK(yaml_error("name: w\n" + water_atoms + "frequencies: [1, '2', 3]\n") ==
        "in.yaml:6:18: error: 'frequencies' entry 2 is the quoted text '2', expected a number");
  CHECK(yaml_error("name: w\nname: v\n") ==
        "in.yaml:2:1: error: duplicate key 'name' in the species (first at line 1), expected each key once");
  CHECK(yaml_error("name: [w\n").rfind("in.yaml:", 0) == 0);
  CHECK(yaml_error("") ==
        "in.yaml: error: file holds no species, expected a YAML map with at least 'name' and 'atoms'");
  CHECK(yaml_error("- a\n- b\n") ==
        "in.yaml:1:1: error: top level is a list, expected a map of species keys such as 'name' and 'atoms'");
  CHECK(
      yaml_error("name: w\nmass: 4\nhessian: [1, 2]\n") ==
      "in.yaml:3:1: error: 'hessian' needs 'atoms', expected Cartesian coordinates of the atoms the Hessian "
      "refers to");
  CHECK(yaml_error(std::string("name: w\0\n", 9)) ==
        "in.yaml:1:8: error: not a text file (NUL byte or invalid UTF-8), expected a UTF-8 species "
        "description");
  CHECK(yaml_error("name: \xff\n") ==
        "in.yaml:1:7: error: not a text file (NUL byte or invalid UTF-8), expected a UTF-8 species "
        "description");
  CHECK(yaml_error("name: w\n" + water_atoms) ==
        "in.yaml:1:1: error: missing required key 'frequencies', expected a list of wavenumbers in cm^-1 "
        "or a 'hessian' (only a single atom has neither)");
  CHECK(yaml_error("name: w\nmass: -4\n") ==
        "in.yaml:2:7: error: 'mass' is '-4', expected a positive number");
  CHECK(yaml_error("name: w\n---\nname: v\n") ==
        "in.yaml:2:1: error: file holds more than one YAML document, expected one species per file");
}

TEST_CASE("XYZ: keys, units and errors") {
  Species s = read_species_xyz(
      "2\nname=\"carbon monoxide\" symmetry_number=1\nC 0 0 0\nO 0 0 1.128\nfrequencies GHz\n"
      "65000\n",
      "co.xyz");
  CHECK(s.name == "carbon monoxide");
  CHECK(s.frequencies_cm1[0] == doctest::Approx(65000 / 29.9792458));
  Species free_text = read_species_xyz("1\nEnergy: -527.1 from some job\nAr 0 0 0\n", "dir/argon.xyz");
  CHECK(free_text.name == "argon");
  CHECK(free_text.frequencies_cm1.empty());
  Species bom = read_species_xyz(
      "\xEF\xBB\xBF"
      "1\nname=Ar\nAr 0 0 0\n",
      "bom.xyz");
  CHECK(bom.name == "Ar");

  CHECK(xyz_error("3\n\nO 0 0 0\nH 0 0.76 -0.52\n") ==
        "in.xyz:4:1: error: file ends after 2 atom line(s), expected 3 (the atom count)");
  CHECK(
      xyz_error("2\nsymetry_number=2\nO 0 0 0\nO 0 0 1.2\nfrequencies\n1580\n") ==
      "in.xyz:2:1: error: unknown key 'symetry_number' on the comment line, did you mean 'symmetry_number'?");
  CHECK(xyz_error("2\n\nO 0 0 0\nO 0 0 1.2x\nfrequencies\n1580\n") ==
        "in.xyz:4:7: error: atom 2 coordinate z is '1.2x', expected a number");
  CHECK(xyz_error("2\n\nO 0 0 0\nO 0 0 1.2\nfrequencies\n1580, abc\n") ==
        "in.xyz:6:7: error: frequency is 'abc', expected a number");
  CHECK(xyz_error("2\n\nO 0 0 0\nO 0 0 1.2\n") ==
        "in.xyz:4:1: error: missing 'frequencies' section after the atoms, expected a line 'frequencies' and "
        "the "
        "wavenumbers in cm^-1");
  CHECK(
      xyz_error("two\n") ==
      "in.xyz:1:1: error: atom count is 'two', expected a positive whole number (first line of an XYZ file)");
  CHECK(xyz_error("1\n\nQ 0 0 0\n") ==
        "in.xyz:3:1: error: unknown element symbol 'Q', expected an element symbol such as C or Cl, or an "
        "isotope "
        "label such as D or C13");
}

TEST_CASE("reading files and expanding paths") {
  namespace fs = std::filesystem;
  fs::path dir = fs::temp_directory_path() / "vibtherm_read_species_test";
  fs::remove_all(dir);
  fs::create_directories(dir / "set");
  for (const char* name : {"b.yaml", "a.xyz", "c.YML", "notes.txt"}) std::ofstream(dir / "set" / name) << "x";
  std::ofstream(dir / "batch.list") << "# two species\nset/a.xyz\n\n  set/b.yaml  # trailing comment\n";
  std::vector<std::string> from_dir = source_paths(expand_species_paths({(dir / "set").string()}));
  CHECK(from_dir == std::vector<std::string>{(dir / "set" / "a.xyz").string(),
                                             (dir / "set" / "b.yaml").string(),
                                             (dir / "set" / "c.YML").string()});
  std::vector<std::string> from_list =
      source_paths(expand_species_paths({(dir / "batch.list").string(), "plain.yaml"}));
  CHECK(from_list == std::vector<std::string>{(dir / "set" / "a.xyz").string(),
                                              (dir / "set" / "b.yaml").string(), "plain.yaml"});
  std::ofstream(dir / "bad.list") << "set/a.xyz\nset/missing.yaml\n";
  CHECK_THROWS_WITH_AS(
      expand_species_paths({(dir / "bad.list").string()}),
      ((dir / "bad.list").string() + ":2:1: error: listed file 'set/missing.yaml' does not exist").c_str(),
      InputError);
  CHECK_THROWS_WITH_AS(
      read_species_file((dir / "set" / "notes.txt").string()),
      ((dir / "set" / "notes.txt").string() +
       ": error: content not recognised as a species file (first line 'x', file type '.txt'), expected YAML "
       "(.yaml, .yml), XYZ with frequencies (.xyz), QCSchema JSON (.json) or Molden normal modes (.molden)")
          .c_str(),
      InputError);
  CHECK_THROWS_AS(read_species_file((dir / "nothing.yaml").string()), InputError);
  fs::remove_all(dir);
}

TEST_CASE("numbers do not depend on the C locale") {
  // A decimal-comma locale would make strtod stop at the '.'; from_chars ignores it.
  const char* previous = std::setlocale(LC_NUMERIC, nullptr);
  std::string saved = previous ? previous : "C";
  bool switched = std::setlocale(LC_NUMERIC, "de_DE.UTF-8") || std::setlocale(LC_NUMERIC, "fr_FR.UTF-8");
  Species s = read_species_file(data_dir + "/water.yaml");
  CHECK(s.frequencies_cm1[0] == 1595.0);
  CHECK(s.atoms[1].position_angstrom.y() == 0.756950);
  std::setlocale(LC_NUMERIC, saved.c_str());
  if (!switched) MESSAGE("no decimal-comma locale installed; checked in the C locale only");
}

TEST_CASE("YAML: a Hessian, as lower triangle or full matrix, read the same") {
  const Species triangle = read_species_file(data_dir + "/water-model-hessian.yaml");
  const Species full = read_species_file(data_dir + "/water-model-hessian-full.yaml");
  REQUIRE(triangle.hessian_J_per_m2.has_value());
  REQUIRE(full.hessian_J_per_m2.has_value());
  CHECK(triangle.frequencies_cm1.empty());
  REQUIRE(triangle.hessian_J_per_m2->size() == 81);
  CHECK(*triangle.hessian_J_per_m2 == *full.hessian_J_per_m2);
  // Row 2, column 2 as written (hartree/bohr²), converted with CODATA 2018 E_h / a0².
  const double hartree_per_bohr2 =
      constants::hartree_J / (constants::bohr_radius_m * constants::bohr_radius_m);
  CHECK((*triangle.hessian_J_per_m2)[1 * 9 + 1] ==
        doctest::Approx(0.6788241823 * hartree_per_bohr2).epsilon(1e-15));
  // Lower triangle mirrored: row 5, column 2 is row 2, column 5.
  CHECK((*triangle.hessian_J_per_m2)[4 * 9 + 1] == (*triangle.hessian_J_per_m2)[1 * 9 + 4]);
}

TEST_CASE("YAML: Hessian units and errors") {
  const std::string one_atom = "name: x\natoms:\n  - [Ar, 0, 0, 0]\n";
  const std::string triangle = "hessian: [1, 0, 2, 0, 0, 3]\n";
  const Species hartree = read_species_yaml(one_atom + triangle, "in.yaml");
  const Species kJ = read_species_yaml(one_atom + triangle + "hessian_unit: kJ/mol/A^2\n", "in.yaml");
  const Species si = read_species_yaml(one_atom + triangle + "hessian_unit: J/m^2\n", "in.yaml");
  CHECK((*si.hessian_J_per_m2)[8] == 3.0);
  // 1 kJ/mol/Å² = 1e3 / N_A / 1e-20 J/m² (definition; N_A exact).
  CHECK((*kJ.hessian_J_per_m2)[8] ==
        doctest::Approx(3e3 / constants::avogadro_per_mol / 1e-20).epsilon(1e-14));
  CHECK((*hartree.hessian_J_per_m2)[4] ==
        doctest::Approx(2.0 * constants::hartree_J / std::pow(constants::bohr_radius_m, 2)).epsilon(1e-14));

  CHECK(yaml_error(one_atom + "hessian: [1, 2]\n") ==
        "in.yaml:4:10: error: 'hessian' has 2 values, expected 9 (full 3N×3N matrix, row-major) or 6 (lower "
        "triangle, row by row) for N = 1 atoms");
  CHECK(
      yaml_error(one_atom + "hessian: [1, 0, 0, 0.5, 2, 0, 0, 0, 3]\n") ==
      "in.yaml:4:20: error: 'hessian' is not symmetric: row 2, column 1 is '0.5' but row 1, column 2 is '0', "
      "expected equal values (within 1e-4 of the largest element)");
  CHECK(yaml_error(one_atom + "hessian: [1, 0, .nan, 0, 0, 3]\n") ==
        "in.yaml:4:17: error: Hessian value 3 is '.nan', expected a finite number");
  CHECK(yaml_error(one_atom + triangle + "hessian_unit: mdyn/A\n") ==
        "in.yaml:5:15: error: unknown Hessian unit 'mdyn/A', expected one of hartree/bohr^2, kcal/mol/A^2, "
        "kJ/mol/A^2, J/m^2");
  CHECK(
      yaml_error(one_atom + "frequencies: [100]\n" + triangle) ==
      "in.yaml:5:1: error: both 'frequencies' and 'hessian' given, expected one of them (the Hessian yields "
      "the frequencies)");
  CHECK(yaml_error(one_atom + "hessian_unit: J/m^2\n") ==
        "in.yaml:4:1: error: 'hessian_unit' without 'hessian', expected a 'hessian' list beside it");
}

TEST_CASE("hindered rotors are read with barrier, scan and top") {
  // Test geometry and wavenumbers (not a measured molecule): two CH3-like tops on z.
  const std::string head =
      "name: x\natoms:\n  - [C, 0, 0, 0.75]\n  - [C, 0, 0, -0.75]\n  - [H, 1, 0, 1.1]\n  - [H, 1, 0, -1.1]\n"
      "frequencies: [300, 800, 900, 1000, 1100, 1200]\n";
  const Species a = read_species_yaml(
      head + "hindered_rotors:\n  - {bond: [1, 2], symmetry: 3, barrier: 12.5, replaces: 300.5}\n", "a.yaml");
  REQUIRE(a.hindered_rotors.size() == 1);
  const HinderedRotor& r = a.hindered_rotors[0];
  CHECK(r.bond_atoms == std::array<int, 2>{0, 1});
  CHECK(r.symmetry == 3);
  CHECK(*r.barrier_J_per_mol == doctest::Approx(12500.0));
  CHECK(r.replaces_cm1 == doctest::Approx(300.5));
  CHECK(r.top_atoms.empty());
  CHECK(r.where.line == 9);  // the entry, below the key on line 8

  const Species b = read_species_yaml(
      head +
          "hindered_rotors:\n  - bond: [2, 1]\n    symmetry: 1\n    top: [2, 4]\n    replaces: 300\n"
          "    scan: [[0, 0.0], [90, 1.5], [180, 3.0], [270, 1.5]]\n",
      "b.yaml");
  REQUIRE(b.hindered_rotors.size() == 1);
  CHECK(b.hindered_rotors[0].top_atoms == std::vector<int>{1, 3});
  REQUIRE(b.hindered_rotors[0].scan.size() == 4);
  CHECK(b.hindered_rotors[0].scan[2].angle_deg == 180.0);
  CHECK(b.hindered_rotors[0].scan[2].energy_J_per_mol == doctest::Approx(3000.0));
  CHECK_FALSE(b.hindered_rotors[0].barrier_J_per_mol);

  // A top that holds the far bond atom is refused.
  CHECK_THROWS_WITH_AS(
      read_species_yaml(head + "hindered_rotors:\n  - {bond: [1, 2], symmetry: 3, barrier: 1, top: [1, 2], "
                               "replaces: 300}\n",
                        "c.yaml"),
      doctest::Contains("'top' must hold bond atom 1 and not atom 2"), InputError);
}

TEST_CASE("unit maps hold lists and rotor energies; species keys keep their locations") {
  const Species s = read_species_yaml(
      "name: w\n"
      "atoms:\n  - [O, 0.0, 0.0, 0.065569]\n  - [H, 0.0, 0.756950, -0.520313]\n  - [H, 0.0, -0.756950, "
      "-0.520313]\n"
      "frequencies: {value: [1595.0, 3657.0, 3756.0], unit: cm^-1}\n",
      "in.yaml");
  CHECK(s.frequencies_cm1 == std::vector<double>{1595.0, 3657.0, 3756.0});
  CHECK(key_location(s, "frequencies").line == 6);
  CHECK(key_location(s, "atoms").line == 2);
  CHECK(key_location(s, "no such key").line == s.origin.line);
  const Species e = read_species_yaml(
      "name: e\n"
      "atoms:\n  - [C, 0, 0, 0.7650]\n  - [C, 0, 0, -0.7650]\n  - [H, 1.0192, 0, 1.1573]\n"
      "  - [H, -0.5096, 0.8826, 1.1573]\n  - [H, -0.5096, -0.8826, 1.1573]\n  - [H, -1.0192, 0, -1.1573]\n"
      "  - [H, 0.5096, 0.8826, -1.1573]\n  - [H, 0.5096, -0.8826, -1.1573]\n"
      "frequencies: [289, 822, 822, 995, 1190, 1190, 1379, 1388, 1468, 1468, 1469, 1469, 2896, 2954, 2969, "
      "2969, "
      "2985, 2985]\n"
      "hindered_rotors:\n  - {bond: [1, 2], symmetry: 3, barrier: {value: 2.87, unit: kcal/mol}, replaces: "
      "289}\n",
      "in.yaml");
  REQUIRE(e.hindered_rotors.size() == 1);
  // 1 kcal/mol = 4.184 kJ/mol (thermochemical calorie, common practice).
  CHECK(*e.hindered_rotors[0].barrier_J_per_mol == doctest::Approx(2.87 * 4184.0));
  std::string text =
      "name: e\natoms:\n  - [C, 0, 0, 0.7650]\n  - [C, 0, 0, -0.7650]\n  - [H, 1.0192, 0, 1.1573]\n"
      "  - [H, -0.5096, 0.8826, 1.1573]\n  - [H, -0.5096, -0.8826, 1.1573]\n"
      "  - [H, -1.0192, 0, -1.1573]\n  - [H, 0.5096, 0.8826, -1.1573]\n  - [H, 0.5096, -0.8826, -1.1573]\n"
      "frequencies: [289, 822, 822, 995, 1190, 1190, 1379, 1388, 1468, 1468, 1469, 1469, 2896, 2954, "
      "2969, 2969, 2985, 2985]\n"
      "hindered_rotors:\n  - {bond: [1, 2], symmetry: 3, replaces: 289,\n"
      "     scan: {value: [[0, 0.0], [30, 1.435], [60, 2.87], [90, 1.435]], unit: kcal/mol}}\n";
  const Species scanned = read_species_yaml(text, "in.yaml");
  REQUIRE(scanned.hindered_rotors[0].scan.size() == 4);
  CHECK(scanned.hindered_rotors[0].scan[2].energy_J_per_mol == doctest::Approx(2.87 * 4184.0));
}

TEST_CASE("YAML: electronic_energy, method and bonds") {
  const std::string base =
      "name: w\natoms:\n  - [O, 0, 0, 0.1173]\n  - [H, 0, 0.7572, -0.4692]\n  - [H, 0, -0.7572, -0.4692]\n"
      "frequencies: [1595, 3657, 3756]\n";
  const double Eh = constants::hartree_J * constants::avogadro_per_mol;  // CODATA 2018
  Species s = read_species_yaml(
      base + "electronic_energy: -76.4089\nmethod: b3lyp.yaml\nbonds: [[1, 2], [1, 3]]\n", "dir/w.yaml");
  CHECK(*s.electronic_energy_J_per_mol == doctest::Approx(-76.4089 * Eh));
  CHECK(std::filesystem::path(s.method_file) == std::filesystem::path("dir") / "b3lyp.yaml");
  REQUIRE(s.bonds);
  CHECK(s.bonds->size() == 2);
  CHECK((*s.bonds)[1][1] == 2);
  s = read_species_yaml(base + "electronic_energy: {value: -200000, unit: kJ/mol}\n", "w.yaml");
  CHECK(*s.electronic_energy_J_per_mol == doctest::Approx(-2e8));
  CHECK(yaml_error(base + "bonds: [[1, 1]]\n").find("joins atom 1 to itself") != std::string::npos);
  CHECK(yaml_error(base + "bonds: [[1, 4]]\n").find("expected an atom number from 1 to 3") !=
        std::string::npos);
  CHECK(yaml_error(base + "electronic_energy: {value: 1, unit: Eh}\n").find("unknown energy unit 'Eh'") !=
        std::string::npos);
}

TEST_CASE("a manifest line may be an inline species: a from: overlay with its own keys") {
  namespace fs = std::filesystem;
  const fs::path dir = fs::temp_directory_path() / "vibtherm_inline_manifest_test";
  fs::remove_all(dir);
  fs::create_directories(dir);
  std::ofstream(dir / "argon.yaml") << "name: Ar\natoms: [[Ar, 0, 0, 0]]\n";
  std::ofstream(dir / "set.list") << "argon.yaml\n# comment\n  {name: argon-2, atoms: [[Ar, 0, 0, 0]], "
                                     "enthalpy_of_formation: 1.5}  # inline\n{name: x, atoms: oops}\n";
  const std::vector<SpeciesSource> sources = expand_species_paths({(dir / "set.list").string()});
  REQUIRE(sources.size() == 3);
  CHECK(sources[0].overlay.empty());
  CHECK(sources[1].line == 3);
  CHECK(sources[1].label() == (dir / "set.list").string() + ":3");
  std::string bytes;
  const Species inline_species = read_species_source(sources[1], &bytes);
  CHECK(inline_species.name == "argon-2");
  CHECK(inline_species.enthalpy_of_formation_J_per_mol == doctest::Approx(1500.0));
  CHECK(bytes.find("argon-2") != std::string::npos);
  // Its errors carry the manifest's line and the column within it.
  const std::string located = (dir / "set.list").string() + ":4:";
  CHECK_THROWS_WITH_AS(read_species_source(sources[2]), doctest::Contains(located.c_str()), InputError);
  fs::remove_all(dir);
}
