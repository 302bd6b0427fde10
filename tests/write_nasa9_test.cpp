#include "vibtherm/write_nasa9.hpp"

#include <doctest/doctest.h>

#include <limits>
#include <sstream>

#include "test_text.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/read_nasa.hpp"

using namespace vibtherm;

namespace {

using test::cols;
using test::lines_of;

// Numbers of realistic magnitude used only to exercise the layout; not physical data.
Nasa9 sample() {
  Nasa9 n;
  n.name = "CH4";
  n.comment = "test record";
  n.date_code = "RRHO";
  n.composition = {{"C", 1}, {"H", 4}};
  n.molar_mass_g_per_mol = 16.04246;
  n.enthalpy_of_formation_J_per_mol = -74600.0;
  n.H298_minus_H0_J_per_mol = 10016.0;
  n.ranges = {{200.0,
               1000.0,
               {-1.766850998e5, 2.786181020e3, -1.202577850e1, 3.917619290e-2, -3.619054430e-5,
                2.026853043e-8, -4.976705490e-12},
               -2.331314360e4,
               8.904322750e1},
              {1000.0,
               6000.0,
               {3.730042760e6, -1.383501485e4, 2.049107091e1, -1.961974759e-3, 4.727313040e-7,
                -3.728814690e-11, 1.623737207e-15},
               7.532066910e4,
               -1.219124889e2}};
  return n;
}

}  // namespace

TEST_CASE("NASA-9 record layout (NASA/TP-2002-211556, shared/reference.md)") {
  const auto lines = lines_of(write_nasa9({sample()}));
  REQUIRE(lines.size() == 2 + 2 + 3 * 2 + 2);
  CHECK(lines[0] == "thermo");
  CHECK(lines[1] == "   200.000  1000.000  6000.000");
  CHECK(lines[2] == "CH4               test record");
  const auto& r2 = lines[3];
  REQUIRE(r2.size() == 80);
  CHECK(cols(r2, 1, 2) == " 2");
  CHECK(cols(r2, 4, 9) == "RRHO  ");
  CHECK(cols(r2, 11, 26) == "C   1.00H   4.00");
  CHECK(cols(r2, 27, 50) == "    0.00    0.00    0.00");
  CHECK(cols(r2, 51, 52) == " 0");
  CHECK(cols(r2, 53, 65) == "   16.0424600");
  CHECK(cols(r2, 66, 80) == "   -74600.00000");
  const auto& t = lines[4];
  REQUIRE(t.size() == 80);
  CHECK(cols(t, 2, 21) == "   200.000  1000.000");
  CHECK(t[22] == '7');
  CHECK(cols(t, 24, 63) == " -2.0 -1.0  0.0  1.0  2.0  3.0  4.0  0.0");
  CHECK(cols(t, 66, 80) == "      10016.000");
  CHECK(lines[5].size() == 80);
  CHECK(cols(lines[5], 1, 16) == "-1.766850998D+05");
  CHECK(cols(lines[6], 33, 48) == std::string(16, ' '));
  CHECK(cols(lines[6], 49, 64) == "-2.331314360D+04");
  CHECK(lines[10] == "END PRODUCTS");
  CHECK(lines[11] == "END REACTANTS");
  for (const auto& l : lines) CHECK(l.size() <= 80);
}

TEST_CASE("NASA-9 text reads back to the same numbers") {
  // Two records (a repeated name would be dropped as a duplicate: the first record wins).
  Nasa9 second = sample();
  second.name = "CH4-copy";
  const auto back = read_nasa(write_nasa9({sample(), second}), "n9");
  REQUIRE(back.size() == 2);
  const auto& n = std::get<Nasa9>(back[1]);
  const Nasa9 s = sample();
  CHECK(n.name == "CH4-copy");
  CHECK(n.comment == "test record");
  CHECK(n.molar_mass_g_per_mol == s.molar_mass_g_per_mol);
  CHECK(n.enthalpy_of_formation_J_per_mol == s.enthalpy_of_formation_J_per_mol);
  CHECK(n.H298_minus_H0_J_per_mol == s.H298_minus_H0_J_per_mol);
  REQUIRE(n.ranges.size() == 2);
  for (int r = 0; r < 2; ++r) {
    CHECK(n.ranges[r].a == s.ranges[r].a);  // 10 significant digits written, these have 10
    CHECK(n.ranges[r].b1 == s.ranges[r].b1);
    CHECK(n.ranges[r].b2 == s.ranges[r].b2);
  }
}

TEST_CASE("NASA-9 overflows are errors") {
  Nasa9 n = sample();
  n.comment = std::string(63, 'x');
  CHECK_THROWS_AS(write_nasa9_record(n), InputError);
  n = sample();
  n.composition = {{"C", 1}, {"H", 1}, {"O", 1}, {"N", 1}, {"S", 1}, {"Cl", 1}};
  CHECK_THROWS_WITH_AS(write_nasa9_record(n),
                       "error: species 'CH4' has 6 elements; the NASA-9 record holds five: use --form json",
                       InputError);
  n = sample();
  n.name = std::string(19, 'N');
  CHECK_THROWS_AS(write_nasa9_record(n), InputError);
}

// Issue 8: a non-finite coefficient is an error naming the species, never nan in the file.
TEST_CASE("NASA-9: a coefficient that is not finite is an error") {
  Nasa9 n = sample();
  n.ranges[0].a[3] = std::numeric_limits<double>::quiet_NaN();
  CHECK_THROWS_WITH_AS(write_nasa9_record(n), "error: species 'CH4': coefficient nan cannot be written",
                       InputError);
  n = sample();
  n.ranges[0].b2 = std::numeric_limits<double>::infinity();
  CHECK_THROWS_WITH_AS(write_nasa9_record(n), "error: species 'CH4': coefficient inf cannot be written",
                       InputError);
}

TEST_CASE("NASA-9: an 18-character name with a comment reads back as the name") {
  // As for NASA-7 (readers take the name up to the first blank): the comment then starts
  // one column later instead of running into the name.
  Nasa9 n = sample();
  n.name = "frequencies:ethane";
  const auto back = read_nasa(write_nasa9({n}), "n9");
  REQUIRE(back.size() == 1);
  CHECK(std::get<Nasa9>(back[0]).name == "frequencies:ethane");
  CHECK(std::get<Nasa9>(back[0]).comment == "test record");
}
