#include "vibtherm/nasa_compare.hpp"

#include <doctest/doctest.h>

#include "vibtherm/constants.hpp"

using namespace vibtherm;

TEST_CASE("largest differences of two polynomials") {
  Nasa7 a;
  a.name = "AR";
  a.T_low_K = 300;
  a.T_high_K = 5000;
  a.low = {2.5, 0, 0, 0, 0, -745.375, 4.366};  // Cp/R = 5/2 (common practice)
  a.high = a.low;
  Nasa7 b = a;
  b.low[1] = b.high[1] = 1e-5;  // Cp/R grows by 1e-5 T
  const auto grid = comparison_grid(300, 5000, 10);
  CHECK(grid.front() == 300);
  CHECK(grid.back() == 5000);
  CHECK(grid.size() == 471);
  const auto c = compare_curves(polynomial_curve(a, grid), polynomial_curve(b, grid));
  const double R = constants::gas_constant_J_per_mol_K;
  CHECK(c.Cp_J_per_mol_K.T_K == 5000);
  CHECK(c.Cp_J_per_mol_K.difference == doctest::Approx(1e-5 * 5000 * R));
  // H/RT gains a2 T/2: H gains R a2 T²/2 (NASA-7 identity).
  CHECK(c.H_J_per_mol.difference == doctest::Approx(R * 1e-5 * 5000.0 * 5000.0 / 2));
  CHECK(c.S_J_per_mol_K.difference == doctest::Approx(R * 1e-5 * 5000));
  CHECK(c.H_absolute);
  ThermoCurve rel = polynomial_curve(b, grid);
  rel.H298_J_per_mol.reset();
  CHECK(!compare_curves(polynomial_curve(a, grid), rel).H_absolute);
}
