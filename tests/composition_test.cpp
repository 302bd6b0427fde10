#include "vibtherm/composition.hpp"

#include <doctest/doctest.h>

#include <string>
#include <vector>

#include "test_species.hpp"
#include "vibtherm/read_species.hpp"
#include "vibtherm/species_builder.hpp"

using namespace vibtherm;

namespace {

// Atoms from labels as a species file writes them ("O", "D", "C13"), through the readers' resolver.
Species from_labels(const std::vector<std::string>& labels) {
  Species s;
  s.name = "labelled";
  double x = 0.0;
  for (const std::string& label : labels) {
    Atom a = atom_of(resolve_label(label, SourceLocation{}));
    a.position_angstrom.x() = x += 1.0;
    s.atoms.push_back(a);
  }
  s.formula = formula_of(s.atoms);
  return s;
}

// Masses used below: D 2.014101778 u, C-13 13.003354835 u (CODATA 2018 / AME2020, from
// memory); standard atomic weights H 1.008, C 12.011, O 15.999 (IUPAC/CIAAW conventional
// values, common practice).
constexpr double mass_D = 2.014101778, mass_C13 = 13.003354835;
constexpr double weight_H = 1.008, weight_C = 12.011, weight_O = 15.999;

double count_of(const std::vector<ElementAmount>& comp, const std::string& symbol) {
  for (const ElementAmount& e : comp)
    if (e.symbol == symbol) return e.count;
  return 0.0;
}

}  // namespace

TEST_CASE("heavy water: formula D2O and 20.03 g/mol") {
  const Species d2o = from_labels({"O", "D", "D"});
  CHECK(species_formula(d2o) == "D2O");
  // 2 × 2.014101778 + 15.999 = 20.0272 g/mol (CODATA/AME isotope mass, IUPAC standard weight).
  CHECK(species_molar_mass_g_per_mol(d2o) == doctest::Approx(2 * mass_D + weight_O).epsilon(1e-8));
  CHECK(species_molar_mass_g_per_mol(d2o) == doctest::Approx(20.03).epsilon(0.005 / 20.03));
  CHECK(has_isotope_labels(d2o));
  const auto comp = species_composition(d2o);
  REQUIRE(comp.size() == 2);
  CHECK(comp[0].symbol == "D");
  CHECK(comp[0].count == 2.0);
  CHECK(comp[1].symbol == "O");
  // The hydrogen-2 label written as H2 is deuterium too.
  CHECK(species_formula(from_labels({"O", "H2", "H2"})) == "D2O");
  CHECK(species_composition(from_labels({"O", "H2", "H2"}))[0].symbol == "D");
}

TEST_CASE("heavy water through the reader: atom labels and the isotopes key agree") {
  const std::string dir = VIBTHERM_TEST_DATA;
  for (const char* file : {"/heavy-water.yaml", "/heavy-water-from-qcschema.yaml"}) {
    CAPTURE(file);
    const Species s = read_species_file(dir + file);
    CHECK(species_formula(s) == "D2O");
    CHECK(species_molar_mass_g_per_mol(s) == doctest::Approx(2 * mass_D + weight_O).epsilon(1e-8));
  }
}

TEST_CASE("natural water is unchanged: H2O and 18.015 g/mol") {
  const Species h2o = test::water();
  CHECK(species_formula(h2o) == "H2O");
  CHECK_FALSE(has_isotope_labels(h2o));
  // 2 × 1.008 + 15.999 = 18.015 (IUPAC/CIAAW standard atomic weights, common practice).
  CHECK(species_molar_mass_g_per_mol(h2o) == doctest::Approx(2 * weight_H + weight_O).epsilon(1e-12));
}

TEST_CASE("CH3D: Hill order with D after H") {
  const Species s = from_labels({"C", "H", "D", "H", "H"});
  CHECK(species_formula(s) == "CH3D");
  CHECK(species_molar_mass_g_per_mol(s) == doctest::Approx(weight_C + 3 * weight_H + mass_D).epsilon(1e-10));
  const auto comp = species_composition(s);
  REQUIRE(comp.size() == 3);
  CHECK(comp[0].symbol == "C");
  CHECK(comp[1].symbol == "H");
  CHECK(comp[1].count == 3.0);
  CHECK(comp[2].symbol == "D");
  CHECK(comp[2].count == 1.0);
}

TEST_CASE("carbon-13 methane: label in brackets, C in the NASA composition") {
  const Species s = from_labels({"H", "C13", "H", "H", "H"});
  CHECK(species_formula(s) == "[C13]H4");
  CHECK(species_molar_mass_g_per_mol(s) == doctest::Approx(mass_C13 + 4 * weight_H).epsilon(1e-10));
  // A NASA record's symbol fields are two characters: carbon-13 is counted as C.
  const auto comp = species_composition(s);
  REQUIRE(comp.size() == 2);
  CHECK(comp[0].symbol == "C");
  CHECK(comp[1].symbol == "H");
  CHECK(comp[1].count == 4.0);
  // Unlabelled atoms of an element come before its isotopes, which ascend by mass number.
  CHECK(species_formula(from_labels({"C13", "C", "C14", "H", "T", "D", "H"})) == "C[C13][C14]H2DT");
}

TEST_CASE("formula order without carbon is alphabetical, isotopes beside their element") {
  CHECK(species_formula(from_labels({"O", "H", "D"})) == "HDO");
  CHECK(species_formula(from_labels({"Cl", "D"})) == "ClD");
  CHECK(species_formula(from_labels({"N", "H", "H", "D"})) == "H2DN");
  CHECK(species_formula(from_labels({"O", "H", "O18", "H"})) == "H2O[O18]");
  // With carbon, C and H lead and the rest follow alphabetically (Hill, J. Am. Chem. Soc. 22, 478 (1900);
  // from memory).
  CHECK(species_formula(from_labels({"O", "C", "H", "Cl"})) == "CHClO");
}

TEST_CASE("formula-only species and adsorbate site") {
  Species co = test::carbon_dioxide();
  co.atoms.clear();
  co.formula = {{"O", 2}, {"C", 1}};
  CHECK(species_formula(co) == "CO2");
  CHECK(species_molar_mass_g_per_mol(co) == doctest::Approx(weight_C + 2 * weight_O).epsilon(1e-12));
  Species none;
  CHECK(species_formula(none).empty());
  CHECK(species_molar_mass_g_per_mol(none) == 0.0);
  // The surface site is in the NASA composition only (surface-kinetics convention, common practice).
  Species ads = test::water();
  ads.phase = Phase::adsorbate;
  ads.surface_site = "Pt";
  CHECK(species_formula(ads) == "H2O");
  CHECK(count_of(species_composition(ads), "Pt") == 1.0);
  CHECK(species_molar_mass_g_per_mol(ads) == doctest::Approx(2 * weight_H + weight_O).epsilon(1e-12));
}
