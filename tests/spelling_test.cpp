#include "vibtherm/spelling.hpp"

#include <doctest/doctest.h>

using namespace vibtherm;

TEST_CASE("edit distance") {
  // Levenshtein's classic example: kitten -> sitting takes 3 edits.
  CHECK(edit_distance("kitten", "sitting") == 3);
  CHECK(edit_distance("", "abc") == 3);
  CHECK(edit_distance("abc", "abc") == 0);
  CHECK(edit_distance("CL", "Cl") == 1);
  CHECK(edit_distance("CL", "Cl", LetterCase::ignored) == 0);
}

TEST_CASE("closest word") {
  const std::vector<std::string> keys{"frequencies", "symmetry_number", "atoms", "name"};
  CHECK(closest_word("frequncies", keys) == "frequencies");
  CHECK(closest_word("atom", keys) == "atoms");
  CHECK(closest_word("temperature", keys).empty());
}
