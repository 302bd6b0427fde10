// The method-file reader.
#include "vibtherm/read_method.hpp"

#include <doctest/doctest.h>

#include "vibtherm/constants.hpp"

using namespace vibtherm;

TEST_CASE("a method file with every key") {
  const Method m = read_method_yaml(
      "label: B3LYP/6-31G(d)\n"
      "elements:\n"
      "  H: {energy: -0.500273}\n"
      "  O: {energy: {value: -75.060623, unit: hartree}, spin_orbit: -0.000355}\n"
      "bond_corrections: {O-H: 0.30, C-H: {value: -0.11, unit: kJ/mol}}\n"
      "scale: {zpe: 0.98}\n",
      "m.yaml");
  const double Eh = constants::hartree_J * constants::avogadro_per_mol;  // CODATA 2018
  CHECK(m.label == "B3LYP/6-31G(d)");
  CHECK(m.elements.at("H").energy_J_per_mol == doctest::Approx(-0.500273 * Eh));
  CHECK(m.elements.at("O").spin_orbit_J_per_mol == doctest::Approx(-0.000355 * Eh));
  CHECK(m.bond_corrections_J_per_mol.at("H-O") == doctest::Approx(300.0));
  CHECK(m.bond_corrections_J_per_mol.at("C-H") == doctest::Approx(-110.0));
  CHECK(*m.scale.zpe == 0.98);
  CHECK(!m.scale.entropy);
}

TEST_CASE("malformed method files") {
  CHECK_THROWS_WITH_AS(read_method_yaml("label: x\nelements: {Xq: {energy: 1}}\n", "m.yaml"),
                       doctest::Contains("m.yaml:2:12: error: unknown element 'Xq'"), InputError);
  CHECK_THROWS_WITH_AS(read_method_yaml("elements: {H: {energy: 1}}\n", "m.yaml"),
                       doctest::Contains("missing required key 'label'"), InputError);
  CHECK_THROWS_WITH_AS(
      read_method_yaml("label: x\nelements: {H: {energy: 1}}\nbond_corrections: {C-H: 1, H-C: 2}\n",
                       "m.yaml"),
      doctest::Contains("given twice"), InputError);
  CHECK_THROWS_WITH_AS(
      read_method_yaml("label: x\nelements: {H: {energy: 1}}\nbond_corrections: {CH: 1}\n", "m.yaml"),
      doctest::Contains("not two element symbols"), InputError);
  CHECK_THROWS_WITH_AS(read_method_yaml("label: x\nelements: {H: {spin_orbit: 1}}\n", "m.yaml"),
                       doctest::Contains("has no 'energy'"), InputError);
  CHECK_THROWS_WITH_AS(read_method_yaml("label: x\nelements: {H: {energy: 1}}\nscales: {}\n", "m.yaml"),
                       doctest::Contains("scales"), InputError);
}
