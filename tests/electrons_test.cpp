#include "vibtherm/electrons.hpp"

#include <doctest/doctest.h>

#include "test_species.hpp"

using namespace vibtherm;

namespace {

// CH3, planar, r(CH) 1.079 Å (from memory); the check needs only the composition.
Species methyl() {
  Species s;
  s.name = "CH3";
  s.atoms = {test::atom("C", test::mass_C12, 0, 0, 0), test::atom("H", test::mass_H1, 1.079, 0, 0),
             test::atom("H", test::mass_H1, -0.5395, 0.934441, 0),
             test::atom("H", test::mass_H1, -0.5395, -0.934441, 0)};
  s.formula = {{"C", 1}, {"H", 3}};
  return s;
}

}  // namespace

TEST_CASE("electron count: sum of Z minus the charge") {
  CHECK(electron_count(test::water()) == 10);
  Species hydroxide = test::water();
  hydroxide.charge = -1;
  CHECK(electron_count(hydroxide) == 11);
  CHECK(electron_count(methyl()) == 9);
  Species unknown;
  CHECK_FALSE(electron_count(unknown).has_value());
}

TEST_CASE("default multiplicity from the parity (common practice)") {
  const ElectronicChoice ch3 = choose_electronic_levels(methyl());
  REQUIRE(ch3.levels.size() == 1);
  CHECK(ch3.levels[0].degeneracy == 2);  // 9 electrons: doublet
  REQUIRE(ch3.notes.size() == 1);
  CHECK(ch3.notes[0].find("spin multiplicity 2 (doublet) from the electron count 9") != std::string::npos);
  Species water = test::water();
  water.electronic_levels.clear();
  CHECK(choose_electronic_levels(water).levels[0].degeneracy == 1);
  Species cation = methyl();
  cation.charge = 1;  // CH3+: 8 electrons, singlet
  CHECK(choose_electronic_levels(cation).levels[0].degeneracy == 1);
}

TEST_CASE("a given multiplicity must fit the parity") {
  Species singlet = methyl();
  singlet.electronic_levels = {{0.0, 1}};
  singlet.key_locations["spin_multiplicity"] = {"ch3.yaml", 7, 1};
  CHECK_THROWS_WITH_AS(
      choose_electronic_levels(singlet),
      "ch3.yaml:7:1: error: spin_multiplicity 1 does not fit species 'CH3' with 9 electrons (odd, "
      "charge 0), expected 2, 4, ... (2S + 1 is even for an odd electron count)",
      InputError);
  Species too_high = methyl();  // 2S + 1 = 10 needs all 9 electrons unpaired: 12 is impossible
  too_high.electronic_levels = {{0.0, 12}};
  too_high.key_locations["spin_multiplicity"] = {"ch3.yaml", 7, 1};
  CHECK_THROWS_AS(choose_electronic_levels(too_high), InputError);
  // O2 X³Σg⁻: 16 electrons, triplet (Huber & Herzberg 1979, from memory): accepted.
  Species o2 = test::oxygen();
  o2.key_locations["spin_multiplicity"] = {"o2.yaml", 5, 1};
  CHECK(choose_electronic_levels(o2).levels[0].degeneracy == 3);
}

TEST_CASE("electronic levels: Kramers for odd counts, orbital degeneracy allowed for even ones") {
  Species doublet = methyl();
  doublet.electronic_levels = {{0.0, 2}, {5000.0, 4}};
  CHECK(choose_electronic_levels(doublet).levels.size() == 2);
  doublet.electronic_levels = {{0.0, 2}, {5000.0, 1}};
  CHECK_THROWS_AS(choose_electronic_levels(doublet), InputError);
  // O2 with a¹Δg (g = 2, orbitally degenerate) above X³Σg⁻ (g = 3): an even count allows both.
  Species o2 = test::oxygen();
  o2.electronic_levels = {{0.0, 3}, {7918.1, 2}};
  CHECK(choose_electronic_levels(o2).levels.size() == 2);
}

TEST_CASE("more electrons removed than the atoms have") {
  Species s = test::water();
  s.charge = 11;
  CHECK_THROWS_AS(choose_electronic_levels(s), InputError);
}
