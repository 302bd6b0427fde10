#include "vibtherm/read_nasa.hpp"

#include <doctest/doctest.h>

#include "vibtherm/error.hpp"

using namespace vibtherm;

namespace {

// The GRI-Mech 3.0 O2 record (coefficients from memory, see tests/data/o2_gri30_from_memory.dat).
const std::string o2_fixed =
    "O2                TPIS89O   2               G   200.000  3500.000  1000.000    1\n"
    " 3.28253784E+00 1.48308754E-03-7.57966669E-07 2.09470555E-10-2.16717794E-14    2\n"
    "-1.08845772E+03 5.45323129E+00 3.78245636E+00-2.99673416E-03 9.84730201E-06    3\n"
    "-9.68129509E-09 3.24372837E-12-1.06394356E+03 3.65767573E+00                   4\n";

void check_o2(const NasaPolynomial& p, double T_mid) {
  const auto& n = std::get<Nasa7>(p);
  CHECK(n.name == "O2");
  CHECK(n.T_low_K == 200.0);
  CHECK(n.T_high_K == 3500.0);
  CHECK(n.T_mid_K == T_mid);
  CHECK(n.high[0] == 3.28253784);
  CHECK(n.high[6] == 5.45323129);
  CHECK(n.low[0] == 3.78245636);
  CHECK(n.low[3] == -9.68129509E-09);
  CHECK(n.low[6] == 3.65767573);
}

}  // namespace

TEST_CASE("fixed columns, with and without the wrapper") {
  check_o2(read_nasa(o2_fixed, "a").at(0), 1000.0);
  const auto w =
      read_nasa("THERMO ALL\n   300.000  1000.000  5000.000\n" + o2_fixed + "END\nREACTIONS\n", "b");
  REQUIRE(w.size() == 1);
  check_o2(w[0], 1000.0);
}

TEST_CASE("tolerated variations") {
  SUBCASE("free spacing, D exponents, no line numbers, comments and blank lines") {
    const std::string text =
        "! a comment\n"
        "thermo\n"
        "300 1000 5000\n"
        "O2   TPIS89  O 2   G  200.0   3500.0   1000.0\n"
        "\n"
        "  3.28253784D+00  1.48308754D-03 -7.57966669D-07  2.09470555D-10 -2.16717794D-14\n"
        "   ! comment inside a record\n"
        " -1.08845772e+03  5.45323129e+00  3.78245636e+00 -2.99673416e-03  9.84730201e-06  3\n"
        " -9.68129509E-09  3.24372837E-12 -1.06394356E+03  3.65767573E+00 ! trailing\n"
        "end\n";
    const auto r = read_nasa(text, "c");
    REQUIRE(r.size() == 1);
    check_o2(r[0], 1000.0);
    CHECK(std::get<Nasa7>(r[0]).phase == 'G');
  }
  SUBCASE("missing T_mid takes the THERMO default, else 1000 K") {
    std::string line1 = o2_fixed.substr(0, 81);
    line1.replace(65, 10, std::string(10, ' '));
    const std::string rest = o2_fixed.substr(81);
    check_o2(read_nasa("THERMO\n   300.000  1400.000  5000.000\n" + line1 + rest + "END\n", "d").at(0),
             1400.0);
    check_o2(read_nasa(line1 + rest, "e").at(0), default_nasa7_T_mid_K);
  }
  SUBCASE("CRLF line ends and tabs") {
    std::string text;
    for (char c : o2_fixed) {
      if (c == '\n') text += '\r';
      text += c;
    }
    check_o2(read_nasa(text, "f").at(0), 1000.0);
  }
}

TEST_CASE("malformed blocks name their line") {
  auto error_of = [](const std::string& text) {
    try {
      read_nasa(text, "bad.dat");
    } catch (const InputError& e) {
      return std::string(e.what());
    }
    return std::string("no error");
  };
  std::string garbled = o2_fixed;
  garbled.replace(81 + 16, 14, "1.4830875xE-03");
  CHECK(
      error_of(garbled) ==
      "bad.dat:2:26: error: species 'O2': unreadable coefficient on line 2 of its record (expected 5 numbers "
      "in E15.8 fields)");
  CHECK(error_of(o2_fixed.substr(0, 3 * 81)) ==
        "bad.dat:3: error: species 'O2': file ends inside its NASA-7 record (expected line 4)");
  std::string short_line = o2_fixed;
  short_line.replace(2 * 81 + 60, 15, std::string(15, ' '));
  CHECK(error_of(short_line) ==
        "bad.dat:3:1: error: species 'O2': line 3 of its record has 4 numbers, expected 5 "
        "coefficients");
  std::string bad_t = o2_fixed;
  bad_t.replace(55, 10, "   100.000");
  CHECK(error_of(bad_t) ==
        "bad.dat:1:46: error: species 'O2': temperatures T_low 200, T_mid 1000, T_high 100 K are "
        "not positive and ascending");
  CHECK(error_of("O2 something without a phase\n 1.0E+00 2.0E+00\n") ==
        "bad.dat:1:45: error: species 'O2': expected the phase (G, L or S) in column 45 followed by T_low, "
        "T_high and "
        "T_mid");
  CHECK(error_of("! only a comment\n") == "bad.dat: error: no NASA-7 or NASA-9 species records found");
  CHECK(error_of("O2   G 300 5000 1000\n") ==
        "bad.dat:1:1: error: species record 'O2' ends after its first line (expected its coefficient lines)");
}

TEST_CASE("NASA-9 malformed interval") {
  const std::string text =
      "CH4               x\n"
      " 1 RRHO   C   1.00H   4.00    0.00    0.00    0.00 0   16.0424600     -74600.000\n"
      "    200.000  1000.000 7 -2.0 -1.0  0.0  1.0  2.0  3.0  5.0  0.0        10016.000\n";
  try {
    read_nasa(text, "n9.dat");
    FAIL("expected an error");
  } catch (const InputError& e) {
    CHECK(std::string(e.what()) ==
          "n9.dat:3:56: error: species 'CH4': interval 1: T exponents must be -2 -1 0 1 2 3 4, found 5 at "
          "position 7");
  }
}
