#include "vibtherm/species_format.hpp"

#include <doctest/doctest.h>

#include "vibtherm/error.hpp"

using namespace vibtherm;

namespace {

std::string format_error(const std::string& text, const std::string& path) {
  try {
    detect_species_format(text, path);
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

}  // namespace

TEST_CASE("the format comes from the content first, the extension second") {
  const std::string json = "\n {\"schema_name\": \"qcschema_output\"}";
  CHECK(detect_species_format(json, "a.json") == SpeciesFormat::qcschema);
  CHECK(detect_species_format(json, "a.xyz") == SpeciesFormat::qcschema);
  CHECK(detect_species_format(json, "a.yaml") == SpeciesFormat::qcschema);
  CHECK(detect_species_format("{name: x, atoms: [[Ar, 0, 0, 0]]}", "a.yaml") == SpeciesFormat::yaml);
  CHECK(detect_species_format("[1, 2]", "a.json") == SpeciesFormat::qcschema);
  CHECK(detect_species_format("\n[Molden Format]\n[FREQ]\n", "a.yaml") == SpeciesFormat::molden);
  CHECK(detect_species_format("[molden format]\n", "modes") == SpeciesFormat::molden);
  CHECK(detect_species_format("[FREQ]\n100\n", "a.molden") == SpeciesFormat::molden);
  CHECK(detect_species_format("3\nwater\n", "a.yaml") == SpeciesFormat::yaml);
  CHECK(detect_species_format("name: x\n", "a.xyz") == SpeciesFormat::xyz);
  CHECK(detect_species_format("# comment\n3\nwater\n", "water.txt") == SpeciesFormat::xyz);
  CHECK(detect_species_format("# comment\nname: water\n", "water") == SpeciesFormat::yaml);
  CHECK(species_format_name(SpeciesFormat::molden) == "Molden");
}

TEST_CASE("an unsupported kind is named in one line") {
  CHECK(
      format_error("THERMO\n   300.000  1000.000  5000.000\n", "therm.txt") ==
      "therm.txt: error: recognised a NASA polynomial file, which 'vibtherm eval' reads; expected a species "
      "file: YAML (.yaml, .yml), XYZ with frequencies (.xyz), QCSchema JSON (.json) or Molden normal modes "
      "(.molden)");
  CHECK(format_error("hello world\n", "notes.txt") ==
        "notes.txt: error: content not recognised as a species file (first line 'hello world', file type "
        "'.txt'), expected YAML (.yaml, .yml), XYZ with frequencies (.xyz), QCSchema JSON (.json) or Molden "
        "normal modes (.molden)");
  CHECK(
      format_error("# only a comment\n", "x") ==
      "x: error: content not recognised as a species file (only comments, file type '(none)'), expected YAML "
      "(.yaml, .yml), XYZ with frequencies (.xyz), QCSchema JSON (.json) or Molden normal modes (.molden)");
}
