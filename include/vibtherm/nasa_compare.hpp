// Comparison of two sets of thermodynamic functions on one temperature grid: a NASA file
// against another, or against the engine's tables; per species the largest differences.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "vibtherm/nasa.hpp"
#include "vibtherm/thermo.hpp"

namespace vibtherm {

// Cp, S and H − H(298.15 K) on a grid, and H(298.15 K) itself when it is known.
struct ThermoCurve {
  std::string name;
  std::vector<double> T_K, Cp_J_per_mol_K, S_J_per_mol_K, H_minus_H298_J_per_mol;
  std::optional<double> H298_J_per_mol;
};

ThermoCurve polynomial_curve(const NasaPolynomial& polynomial, const std::vector<double>& temperatures_K);
// From the engine's rows; `enthalpy_of_formation_J_per_mol` (ΔfH°(298.15 K)) is H(298.15 K).
ThermoCurve table_curve(const std::string& name, const std::vector<ThermoPoint>& rows,
                        std::optional<double> enthalpy_of_formation_J_per_mol);

// `other` − `reference` at the temperature where |difference| is largest.
struct LargestDifference {
  double difference = 0.0;
  double T_K = 0.0;
};

struct CurveComparison {
  std::string name;
  double T_min_K = 0.0, T_max_K = 0.0;
  std::size_t points = 0;
  LargestDifference Cp_J_per_mol_K, S_J_per_mol_K, H_J_per_mol;
  bool H_absolute = false;  // H compared as absolute (both know H(298.15 K)), else as H − H(298.15 K)
};

// Both curves on the same grid (same T_K); InputError-free: callers build them so.
CurveComparison compare_curves(const ThermoCurve& reference, const ThermoCurve& other);

// T_low, T_low + step, ..., and T_high itself (step > 0).
std::vector<double> comparison_grid(double T_low_K, double T_high_K, double step_K = 10.0);

}  // namespace vibtherm
