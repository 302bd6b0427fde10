// The reaction-file reader.
#include "vibtherm/read_reaction.hpp"

#include <doctest/doctest.h>

#include <filesystem>

using namespace vibtherm;

TEST_CASE("a reaction file with name and unknown") {
  const ReactionFile r = read_reaction_yaml(
      "name: w\nspecies:\n  - {file: h2o.yaml, coefficient: -1}\n  - {file: h2.yaml, coefficient: 1}\n"
      "  - {file: o2.yaml, coefficient: 0.5}\nunknown: ./h2o.yaml\n",
      "dir/r.yaml");
  CHECK(r.name == "w");
  REQUIRE(r.terms.size() == 3);
  CHECK(r.terms[2].coefficient == 0.5);
  CHECK(std::filesystem::path(r.terms[0].path) == std::filesystem::path("dir") / "h2o.yaml");
  REQUIRE(r.unknown);
  CHECK(*r.unknown == 0);
  CHECK(read_reaction_yaml("species: [{file: a.yaml, coefficient: -1}, {file: b.yaml, coefficient: 2}]\n",
                           "x/dimer.yaml")
            .name == "dimer");
}

TEST_CASE("malformed reaction files") {
  const auto bad = [](const std::string& text, const std::string& part) {
    CHECK_THROWS_WITH_AS(read_reaction_yaml(text, "r.yaml"), doctest::Contains(part.c_str()), InputError);
  };
  bad("name: x\n", "missing required key 'species'");
  bad("species: [{file: a.yaml, coefficient: -1}]\n", "at least two");
  bad("species: [{file: a.yaml, coefficient: 0}, {file: b.yaml, coefficient: 1}]\n",
      "expected a nonzero number");
  bad("species: [{file: a.yaml, coefficient: -1}, {file: a.yaml, coefficient: 1}]\n", "repeats the file");
  bad("species: [{file: a.yaml, coefficient: -1}, {file: b.yaml}]\n", "has no 'coefficient'");
  bad("species: [{file: a.yaml, coefficient: -1}, {file: b.yaml, coefficient: 1}]\nunknown: c.yaml\n",
      "not among the reaction's species files");
  bad("species: [{file: a.yaml, coefficient: -1}, {file: b.yaml, coefficient: 1}]\nunkown: a.yaml\n",
      "unkown");
}
