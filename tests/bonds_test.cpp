// Bond perception from covalent radii.
#include "vibtherm/bonds.hpp"

#include <doctest/doctest.h>

#include "test_species.hpp"

using namespace vibtherm;

TEST_CASE("bond types are order independent") {
  CHECK(bond_type("O", "H") == "H-O");
  CHECK(bond_type("C", "H") == "C-H");
  // Cordero et al., Dalton Trans. 2008, 2832, Table 2 (from memory).
  CHECK(*covalent_radius_angstrom("C") == doctest::Approx(0.76));
  CHECK(!covalent_radius_angstrom("Pt"));
}

TEST_CASE("water has two O-H bonds and no H...H bond") {
  const Species w = test::water();
  const auto bonds = species_bonds(w);
  CHECK(bonds.size() == 2);
  const auto counts = count_bond_types(w, bonds);
  CHECK(counts.size() == 1);
  CHECK(counts.at("H-O") == 2);
}

TEST_CASE("given bonds are used as given; a missing radius asks for them") {
  Species w = test::water();
  w.bonds = std::vector<std::array<int, 2>>{{0, 1}};
  CHECK(species_bonds(w).size() == 1);
  Species pt;
  pt.name = "PtH";
  pt.atoms = {test::atom("Pt", 195.0, 0, 0, 0), test::atom("H", test::mass_H1, 0, 0, 1.5)};
  CHECK_THROWS_WITH_AS(species_bonds(pt), doctest::Contains("no covalent radius for Pt"), InputError);
}
