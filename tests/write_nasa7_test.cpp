#include "vibtherm/write_nasa7.hpp"

#include <doctest/doctest.h>

#include <fstream>
#include <limits>
#include <sstream>

#include "test_nasa.hpp"
#include "test_text.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/read_nasa.hpp"

using namespace vibtherm;

namespace {

using test::cols;
using test::lines_of;

Nasa7 o2_record() { return test::o2_gri30_record(); }

}  // namespace

TEST_CASE("writes the O2 record of the data file byte for byte") {
  std::ifstream in(std::string(VIBTHERM_TEST_DATA) + "/o2_gri30_from_memory.dat");
  std::vector<std::string> file;
  for (std::string s; std::getline(in, s);) file.push_back(s);
  REQUIRE(file.size() == 11);
  const auto lines = lines_of(write_nasa7_record(o2_record()));
  REQUIRE(lines.size() == 4);
  // Line 1 up to T_high; that file writes T_mid as F10.3 (columns 66-75), the pinned
  // layout puts it in columns 66-73, with a blank in front.
  CHECK(lines[0].substr(0, 65) == file[6].substr(0, 65));
  CHECK(lines[0].substr(65) == " 1000.00      1");
  for (int k = 1; k < 4; ++k) CHECK(lines[k] == file[6 + k]);
}

TEST_CASE("fixed-column conformance") {
  Nasa7 n = o2_record();
  n.name = "CH3OCH3";
  n.note = "";
  n.composition = {{"C", 2}, {"H", 6}, {"O", 1}};
  n.T_low_K = 250.0;
  n.T_mid_K = 1350.0;
  n.T_high_K = 4000.0;
  n.comments = {"a note"};
  const auto lines = lines_of(write_nasa7({n, o2_record()}, Nasa7WriteOptions{true, {"header"}}));
  REQUIRE(lines.size() == 1 + 2 + 1 + 4 + 4 + 1);
  CHECK(lines[0] == "! header");
  CHECK(lines[1] == "THERMO ALL");  // converters read the default-temperature line only after THERMO ALL
  CHECK(lines[2] == "   200.000  1350.000  4000.000");  // widest range, most common T_mid (first on a tie)
  CHECK(lines[3] == "! a note");
  CHECK(lines.back() == "END");
  for (const auto& l : lines) CHECK(l.size() <= 80);
  const auto& l1 = lines[4];
  REQUIRE(l1.size() == 80);
  CHECK(cols(l1, 1, 18) == "CH3OCH3           ");
  CHECK(cols(l1, 25, 44) == "C   2H   6O   1     ");
  CHECK(l1[44] == 'G');
  CHECK(cols(l1, 46, 55) == "   250.000");
  CHECK(cols(l1, 56, 65) == "  4000.000");
  CHECK(cols(l1, 66, 73) == " 1350.00");
  for (int k = 0; k < 4; ++k) {
    CHECK(lines[4 + k].size() == 80);
    CHECK(lines[4 + k][79] == static_cast<char>('1' + k));
  }
  // E15.8 fields in columns 1-75 of lines 2-3 and 1-60 of line 4.
  CHECK(cols(lines[5], 1, 15) == " 3.28253784E+00");
  CHECK(cols(lines[6], 61, 75) == " 9.84730201E-06");
  CHECK(cols(lines[7], 46, 60) == " 3.65767573E+00");
  CHECK(cols(lines[7], 61, 79) == std::string(19, ' '));
}

TEST_CASE("no wrapper, adsorbate phase") {
  Nasa7 n = o2_record();
  n.phase = 'S';
  const auto text = write_nasa7({n}, Nasa7WriteOptions{false, {}});
  const auto lines = lines_of(text);
  REQUIRE(lines.size() == 4);
  CHECK(lines[0][44] == 'S');
}

TEST_CASE("what does not fit is an error, not a truncation") {
  Nasa7 n = o2_record();
  n.name = "a-name-of-19-chars!";
  CHECK_THROWS_WITH_AS(
      write_nasa7_record(n),
      "error: species 'a-name-of-19-chars!': name has 19 characters; NASA-7 allows 18 (columns "
      "1-18): give a shorter `name` in the species file",
      InputError);
  n = o2_record();
  n.composition = {{"C", 1}, {"H", 3}, {"O", 1}, {"N", 1}, {"Cl", 1}};
  CHECK_THROWS_WITH_AS(
      write_nasa7_record(n),
      "error: species 'O2' has 5 elements; the NASA-7 record holds four: use --form nasa9 (five) or "
      "--form json",
      InputError);
  n = o2_record();
  n.composition = {{"C", 1000}};
  CHECK_THROWS_AS(write_nasa7_record(n), InputError);
  n = o2_record();
  n.note = "toolong";
  CHECK_THROWS_AS(write_nasa7_record(n), InputError);
  n = o2_record();
  n.name = "two words";
  CHECK_THROWS_AS(write_nasa7_record(n), InputError);
}

// Issue 8: a non-finite coefficient once reached the writer and came back as "coefficient
// -nan cannot be written" with neither species nor file; now the message names the species
// and the quantity, and the command line adds the species file (cli/common.cpp run_species).
TEST_CASE("a coefficient that is not finite is an error, never nan or inf in the file") {
  Nasa7 n = o2_record();
  n.low[2] = std::numeric_limits<double>::quiet_NaN();
  CHECK_THROWS_WITH_AS(write_nasa7_record(n), "error: species 'O2': coefficient nan cannot be written",
                       InputError);
  n = o2_record();
  n.high[6] = -std::numeric_limits<double>::infinity();
  CHECK_THROWS_WITH_AS(write_nasa7({n}), "error: species 'O2': coefficient -inf cannot be written",
                       InputError);
}

TEST_CASE("an 18-character name with a note reads back as the name") {
  // The pipeline fuzz target's round trip: 'frequencies:ethane' followed at once by the
  // note 'noHf' read back as 'frequencies:ethanenoHf' (readers take the name up to the
  // first blank, NASA SP-273 practice). The note moves one column right.
  Nasa7 n = o2_record();
  n.name = "frequencies:ethane";
  n.note = "noHf";
  const std::string text = write_nasa7({n});
  const auto back = read_nasa(text, "t.dat");
  REQUIRE(back.size() == 1);
  CHECK(polynomial_name(back[0]) == "frequencies:ethane");
  CHECK(cols(lines_of(text)[2], 19, 24) == " noHf ");
  n.note = "ABCDEF";  // six characters no longer fit after the blank
  CHECK_THROWS_AS(write_nasa7_record(n), InputError);
}
