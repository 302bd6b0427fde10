#include "vibtherm/nasa.hpp"

#include <doctest/doctest.h>

#include <cmath>

#include "test_nasa.hpp"
#include "vibtherm/read_nasa.hpp"

using namespace vibtherm;

namespace {
Nasa7 o2() { return test::o2_gri30_record(); }
}  // namespace

TEST_CASE("NASA-7 evaluation of a published O2 record") {
  const Nasa7 n = o2();
  const auto p = n.at(298.15);
  // H(298.15 K) = ΔfH°(O2) = 0 by definition of the element reference state.
  CHECK(std::abs(p.H_J_per_mol()) < 1.0);
  // S°(298.15 K) = 205.15 J/(mol K) (NIST-JANAF 4th ed., Chase 1998, shared/reference.md).
  CHECK(p.S_J_per_mol_K() == doctest::Approx(205.15).epsilon(0.01 / 205.15));
  // Cp°(298.15 K) = 29.376 J/(mol K) (NIST-JANAF 4th ed., from memory); the record's own fit error is ~0.01.
  CHECK(p.Cp_J_per_mol_K() == doctest::Approx(29.376).epsilon(0.01 / 29.376));
  CHECK(n.in_range(200.0));
  CHECK_FALSE(n.in_range(3600.0));
  // The lower set is used at T_mid itself.
  CHECK(n.at(1000.0).Cp_over_R == nasa7_properties(n.low, 1000.0).Cp_over_R);
}

TEST_CASE("thermodynamic identities: dH/dT = Cp, dS/dT = Cp/T") {
  // Exact identities (common practice) hold for any coefficients; checked by central differences.
  const Nasa9Range r{200.0, 6000.0, {1.2e4, -350.0, 6.1, 1.1e-3, -2.2e-7, 3.0e-11, -1.5e-15}, 2.0e4, -12.0};
  const Nasa7 n = o2();
  for (double T : {250.0, 700.0, 1500.0, 3000.0}) {
    const double h = 1e-4 * T;
    auto check = [&](auto f) {
      const auto p = f(T), a = f(T - h), b = f(T + h);
      const double dH = (b.H_over_RT * (T + h) - a.H_over_RT * (T - h)) / (2 * h);
      const double dS = (b.S_over_R - a.S_over_R) / (2 * h);
      CHECK(dH == doctest::Approx(p.Cp_over_R).epsilon(1e-7));
      CHECK(dS == doctest::Approx(p.Cp_over_R / T).epsilon(1e-7));
    };
    check([&](double t) { return nasa9_properties(r, t); });
    check([&](double t) { return nasa7_properties(n.low, t); });
  }
}

TEST_CASE("a NASA-7 range written as NASA-9 gives the same values") {
  const Nasa7 n = o2();
  Nasa9Range r{200.0, 1000.0, {0, 0, n.low[0], n.low[1], n.low[2], n.low[3], n.low[4]}, n.low[5], n.low[6]};
  for (double T : {200.0, 298.15, 800.0}) {
    const auto a = nasa7_properties(n.low, T), b = nasa9_properties(r, T);
    CHECK(a.Cp_over_R == doctest::Approx(b.Cp_over_R).epsilon(1e-14));
    CHECK(a.H_over_RT == doctest::Approx(b.H_over_RT).epsilon(1e-14));
    CHECK(a.S_over_R == doctest::Approx(b.S_over_R).epsilon(1e-14));
  }
}

TEST_CASE("NASA-9 range choice and variant helpers") {
  Nasa9 n;
  n.name = "X";
  n.ranges = {{200.0, 1000.0, {0, 0, 3.5, 0, 0, 0, 0}, 0, 0},
              {1000.0, 6000.0, {0, 0, 4.5, 0, 0, 0, 0}, 0, 0}};
  CHECK(n.at(1000.0).Cp_over_R == 3.5);
  CHECK(n.at(1000.1).Cp_over_R == 4.5);
  CHECK(n.at(100.0).Cp_over_R == 3.5);   // extrapolated from the first range
  CHECK(n.at(7000.0).Cp_over_R == 4.5);  // and the last
  const NasaPolynomial p = n;
  CHECK(polynomial_name(p) == "X");
  CHECK(polynomial_T_min_K(p) == 200.0);
  CHECK(polynomial_T_max_K(p) == 6000.0);
  CHECK_FALSE(polynomial_in_range(p, 199.0));
}

TEST_CASE("the O2 data file reads to the same record") {
  const auto all = read_nasa_file(std::string(VIBTHERM_TEST_DATA) + "/o2_gri30_from_memory.dat");
  REQUIRE(all.size() == 1);
  const auto& n = std::get<Nasa7>(all[0]);
  CHECK(n.high == o2().high);
  CHECK(n.low == o2().low);
  CHECK(n.note == "TPIS89");
  REQUIRE(n.composition.size() == 1);
  CHECK(n.composition[0].symbol == "O");
  CHECK(n.composition[0].count == 2.0);
}
