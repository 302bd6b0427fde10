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
  // An inverted range is read and reported by the sanity checks (nasa_checks_test.cpp).
  CHECK(error_of(bad_t) == "no error");
  std::string zero_t = o2_fixed;
  zero_t.replace(45, 10, "     0.000");
  CHECK(error_of(zero_t) ==
        "bad.dat:1:46: error: species 'O2': temperatures T_low 0, T_mid 1000, T_high 3500 K, expected 1 to "
        "100000 K");
  CHECK(error_of("O2 something without a phase\n 1.0E+00 2.0E+00\n") ==
        "bad.dat:1:45: error: species 'O2': expected the phase (G, L or S) in column 45 followed by T_low, "
        "T_high and "
        "T_mid");
  CHECK(error_of("! only a comment\n") == "bad.dat: error: no NASA-7 or NASA-9 species records found");
  CHECK(error_of("O2   G 300 5000 1000\n") ==
        "bad.dat:1:1: error: species record 'O2' ends after its first line (expected its coefficient lines)");
}

TEST_CASE("a file of which no record is read: a species file or other text is named as such") {
  // A YAML species file under a thermo-file name; YAML detection: species_format.hpp.
  CHECK_THROWS_WITH_AS(
      read_nasa_records("# water\nname: water\natoms: []\n", "w.dat"),
      doctest::Contains("w.dat:2:1: error: this is a species file (YAML), not a NASA polynomial file"),
      InputError);
  CHECK_THROWS_WITH_AS(read_nasa_records("{\"schema_name\": \"qcschema_output\"}\n", "w.json"),
                       doctest::Contains("w.json:1:1: error: this is a species file (QCSchema JSON)"),
                       InputError);
  CHECK_THROWS_WITH_AS(read_nasa_records("some notes\nabout thermo\n", "n.txt"),
                       doctest::Contains("n.txt:1:1: error: not a NASA polynomial file"), InputError);
  // A file with one good record and one bad one stays a NASA file with a bad record.
  const NasaFile f = read_nasa_records(std::string(o2_fixed) + "name: water\n", "mix.dat");
  CHECK(f.species.size() == 1);
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

namespace {

NasaFile quirk_file(const std::string& name) {
  return read_nasa_records_file(std::string(VIBTHERM_TEST_DATA) + "/nasa/" + name);
}

// Cp(298.15 K) and S°(298.15 K, 1 bar) of O2: 29.376 J/(mol K) and 205.152 J/(mol K)
// (NIST-JANAF 4th ed., Chase 1998, Cp from memory; S from CODATA Key Values, reference.md);
// the GRI-Mech record gives them to about 0.01.
void check_o2_values(const NasaPolynomial& p) {
  const auto v = polynomial_at(p, 298.15);
  CHECK(v.Cp_J_per_mol_K() == doctest::Approx(29.376).epsilon(0.001));
  CHECK(v.S_J_per_mol_K() == doctest::Approx(205.152).epsilon(0.0005));
}

}  // namespace

TEST_CASE("each published quirk file reads to the plain record's coefficients") {
  for (const char* name : {"line4_fifth_number.dat", "column79_digit.dat", "exponent_forms.dat",
                           "keyword_therm.dat", "keyword_therm_lower.dat", "keyword_therm_all.dat",
                           "mechanism.dat", "ampersand_continuation.dat", "fifth_element_field.dat"}) {
    CAPTURE(name);
    const NasaFile f = quirk_file(name);
    CHECK(f.errors.empty());
    CHECK(f.warnings.empty());
    REQUIRE(!f.species.empty());
    check_o2(f.species[0], 1000.0);
    check_o2_values(f.species[0]);
    CHECK(std::get<Nasa7>(f.species[0]).composition.size() == 1);
    CHECK(std::get<Nasa7>(f.species[0]).composition[0].symbol == "O");
    CHECK(std::get<Nasa7>(f.species[0]).composition[0].count == 2.0);
  }
  SUBCASE("mechanism file: the thermo section only, both species") {
    const NasaFile f = quirk_file("mechanism.dat");
    REQUIRE(f.species.size() == 2);
    CHECK(polynomial_name(f.species[1]) == "AR");
  }
  SUBCASE("filled fifth element field") {
    const NasaFile f = quirk_file("fifth_element_field.dat");
    REQUIRE(f.species.size() == 2);
    const auto& ar = std::get<Nasa7>(f.species[1]);
    REQUIRE(ar.composition.size() == 1);
    CHECK(ar.composition[0].symbol == "AR");
    CHECK(ar.T_mid_K == 1000.0);
    // Ar S°(298.15 K) 154.846 J/(mol K) (CODATA Key Values, reference.md); the record gives 154.73.
    CHECK(ar.at(298.15).S_J_per_mol_K() == doctest::Approx(154.846).epsilon(0.001));
    // Cp = 5/2 R exactly for a monatomic gas (common practice): 20.786 J/(mol K) (NIST-JANAF).
    CHECK(ar.at(2000).Cp_J_per_mol_K() == doctest::Approx(20.786).epsilon(1e-4));
  }
}

TEST_CASE("single-range species and a default T_mid outside their range") {
  const NasaFile f = quirk_file("single_range.dat");
  REQUIRE(f.species.size() == 2);
  CHECK(f.errors.empty());
  const auto& cold = std::get<Nasa7>(f.species[0]);
  const auto& hot = std::get<Nasa7>(f.species[1]);
  CHECK(cold.T_mid_K == 800.0);  // clamped to the range's end
  CHECK(hot.T_mid_K == 1500.0);
  CHECK(cold.at(500).Cp_over_R == 2.5);
  CHECK(hot.at(3000).Cp_over_R == 2.5);
}

TEST_CASE("NASA-9 published layout evaluates as the same coefficients in our layout") {
  const NasaFile pub = quirk_file("nasa9_published.dat");
  const NasaFile ours = quirk_file("nasa9_ours.dat");
  const NasaFile db = quirk_file("nasa_database_layout.dat");
  REQUIRE(pub.species.size() == 1);
  REQUIRE(ours.species.size() == 1);
  REQUIRE(db.species.size() == 1);
  CHECK(db.warnings.size() == 1);  // the reactant with no temperature intervals
  const auto& a = std::get<Nasa9>(pub.species[0]);
  REQUIRE(a.ranges.size() == 2);
  CHECK(a.ranges[1].T_low_K == 1000.0);
  CHECK(a.ranges[1].T_high_K == 6000.0);
  CHECK(a.H298_minus_H0_J_per_mol == 8680.104);
  for (double T : {200.0, 298.15, 700.0, 1000.0, 2500.0, 6000.0}) {
    const auto x = polynomial_at(pub.species[0], T), y = polynomial_at(ours.species[0], T),
               z = polynomial_at(db.species[0], T);
    CHECK(x.Cp_over_R == y.Cp_over_R);
    CHECK(x.H_over_RT == y.H_over_RT);
    CHECK(x.S_over_R == y.S_over_R);
    CHECK(x.S_over_R == z.S_over_R);
  }
  check_o2_values(pub.species[0]);
}

TEST_CASE("a bad record is reported and the others are read; duplicates keep the first") {
  const NasaFile mix = read_nasa_records_file(std::string(VIBTHERM_TEST_DATA) + "/nasa_quirk_mix.dat");
  REQUIRE(mix.errors.size() == 1);
  CHECK(std::string(mix.errors[0].what()).find("species 'BAD-O2'") != std::string::npos);
  CHECK(mix.errors[0].where().line == 19);
  REQUIRE(mix.species.size() == 5);
  for (const char* n : {"O2-A", "O2-B", "AR", "O2-C", "O2-D"}) {
    bool found = false;
    for (const auto& p : mix.species) found = found || polynomial_name(p) == n;
    CHECK_MESSAGE(found, n);
  }
  std::string twice = o2_fixed;
  std::string other = o2_fixed;
  other.replace(46 + 2, 3, "300");  // T_low 300 K in the second O2
  const NasaFile d = read_nasa_records(twice + other + other, "dup.dat");
  REQUIRE(d.species.size() == 1);
  CHECK(std::get<Nasa7>(d.species[0]).T_low_K == 200.0);
  REQUIRE(d.warnings.size() == 1);
  CHECK(d.warnings[0] ==
        "dup.dat:5: species 'O2' is defined more than once (line 1, again at lines 5, 9): the first record "
        "is used");
  CHECK_THROWS_AS(read_nasa(o2_fixed + "X  bad\n 1.0\n", "x.dat"), InputError);
}

TEST_CASE("field parsing: exponents without sign, D and lowercase") {
  const std::string sign_less =
      "O2                TPIS89O   2               G   200.000  3500.000  1000.000    1\n"
      " 3.28253784e 00 1.48308754e-03-7.57966669d-07 2.09470555D-10-2.16717794E-14    2\n"
      "-1.08845772e 03 5.45323129E 00 3.78245636E+00-2.99673416E-03 9.84730201E-06    3\n"
      "-9.68129509E-09 3.24372837E-12-1.06394356E+03 3.65767573E+00 0.00000000E 00    4\n";
  check_o2(read_nasa(sign_less, "s.dat").at(0), 1000.0);
}
