#include "vibtherm/elements.hpp"

#include <doctest/doctest.h>

#include <cmath>

using namespace vibtherm;

TEST_CASE("element table covers H to Xe and Pt, Au, Hg, Pb") {
  auto table = all_elements();
  CHECK(table.size() == 58);
  CHECK(table.front().symbol == "H");
  CHECK(table[53].symbol == "Xe");
  CHECK(table.back().symbol == "Pb");
  CHECK(table.back().atomic_number == 82);
  for (const ElementInfo& e : table) {
    CAPTURE(e.symbol);
    // Typing guard: an isotope's mass lies within 0.1 amu of its mass number
    // (nuclear binding, common practice), and the standard atomic weight within 2.5 amu
    // of the most abundant isotope's mass for every element in the table.
    CHECK(std::abs(e.isotope_mass_amu - e.mass_number) < 0.1);
    CHECK(std::abs(e.standard_atomic_weight - e.isotope_mass_amu) < 2.5);
    REQUIRE(find_element(e.symbol).has_value());
    CHECK(find_element(e.symbol)->atomic_number == e.atomic_number);
    CHECK(find_element_by_number(e.atomic_number)->symbol == e.symbol);
  }
}

TEST_CASE("most abundant isotope masses") {
  // AME2020 (Wang et al., Chinese Phys. C 45, 030003 (2021)), from memory.
  CHECK(find_element("H")->isotope_mass_amu == doctest::Approx(1.00782503223).epsilon(1e-12));
  CHECK(find_element("O")->isotope_mass_amu == doctest::Approx(15.99491461957).epsilon(1e-12));
  CHECK(find_element("Cl")->isotope_mass_amu == doctest::Approx(34.968852682).epsilon(1e-11));
  CHECK(find_element("Cl")->mass_number == 35);
  // 12 exactly: definition of the unified atomic mass unit.
  CHECK(find_element("C")->isotope_mass_amu == 12.0);
}

TEST_CASE("standard atomic weights") {
  // IUPAC/CIAAW conventional values (CIAAW 2021), from memory.
  CHECK(find_element("C")->standard_atomic_weight == 12.011);
  CHECK(find_element("O")->standard_atomic_weight == 15.999);
  CHECK(find_element("Cl")->standard_atomic_weight == 35.45);
  CHECK(find_element("Fe")->standard_atomic_weight == 55.845);
}

TEST_CASE("symbols are case-sensitive") {
  CHECK_FALSE(find_element("CL").has_value());
  CHECK_FALSE(find_element("cl").has_value());
  CHECK_FALSE(find_element("").has_value());
  CHECK_FALSE(find_element("Xx").has_value());
}

TEST_CASE("isotope labels") {
  auto d = find_isotope("D");
  REQUIRE(d.has_value());
  CHECK(d->symbol == "H");
  CHECK(d->mass_number == 2);
  CHECK(d->mass_amu == doctest::Approx(2.01410177812).epsilon(1e-12));  // AME2020, from memory
  auto h2 = find_isotope("H2");
  REQUIRE(h2.has_value());
  CHECK(h2->mass_amu == d->mass_amu);
  CHECK(find_isotope("T")->mass_number == 3);
  CHECK(find_isotope("C13")->mass_amu ==
        doctest::Approx(13.00335483507).epsilon(1e-12));  // AME2020, from memory
  CHECK(find_isotope("O18")->mass_amu ==
        doctest::Approx(17.99915961286).epsilon(1e-12));  // AME2020, from memory
  CHECK(find_isotope("N15")->mass_number == 15);
  CHECK(find_isotope("Cl37")->symbol == "Cl");
  CHECK(find_isotope("Br81")->mass_number == 81);
  CHECK(find_isotope("S34")->mass_number == 34);
  // A plain symbol, or the symbol with its most abundant mass number, is the default.
  CHECK(find_isotope("C")->mass_amu == 12.0);
  CHECK(find_isotope("C12")->mass_amu == 12.0);
  CHECK(find_isotope("Cl35")->mass_number == 35);
}

TEST_CASE("unknown isotope labels") {
  CHECK_FALSE(find_isotope("C15").has_value());
  CHECK_FALSE(find_isotope("C013").has_value());
  CHECK_FALSE(find_isotope("Xx12").has_value());
  CHECK_FALSE(find_isotope("13C").has_value());
  CHECK_FALSE(find_isotope("C13x").has_value());
  CHECK_FALSE(find_isotope("").has_value());
  CHECK_FALSE(find_isotope("C99999999999999999999").has_value());
}

TEST_CASE("known isotope labels for messages") {
  std::vector<std::string> carbon = known_isotope_labels("C");
  CHECK(carbon == std::vector<std::string>{"C12", "C13", "C14"});
  std::vector<std::string> hydrogen = known_isotope_labels("H");
  CHECK(hydrogen == std::vector<std::string>{"H1", "H2", "H3", "D", "T"});
  CHECK(known_isotope_labels("Qq").empty());
}

TEST_CASE("did-you-mean element symbols") {
  CHECK(closest_element_symbol("CL") == "Cl");
  CHECK(closest_element_symbol("cl") == "Cl");
  CHECK(closest_element_symbol("BR") == "Br");
  CHECK(closest_element_symbol("Cll") == "Cl");
  CHECK(closest_element_symbol("Hx") == "H");
  CHECK(closest_element_symbol("Qq") == "");
  CHECK(closest_element_symbol("") == "");
}
