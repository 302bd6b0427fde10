// Plausibility checks of a NASA polynomial read from a file: jumps at the breakpoints,
// heat capacity below the ideal-gas floor, implausible entropy, inverted or empty ranges.
#pragma once

#include <string>
#include <vector>

#include "vibtherm/nasa.hpp"

namespace vibtherm {

// Tolerances (the thresholds of our own fit warnings, README "NASA fits"): at a breakpoint
// the two sides may differ by at most 0.5 % of Cp, 0.1 kJ/mol in H and 0.1 J/(mol K) in S.
inline constexpr double nasa_joint_Cp_relative = 0.005;
inline constexpr double nasa_joint_H_J_per_mol = 100.0;
inline constexpr double nasa_joint_S_J_per_mol_K = 0.1;
// A gas has Cp ≥ 5/2 R, the monatomic ideal-gas value (translation alone; common practice);
// checked with a margin of 0.1 % on a grid of 50 points per range and the range ends.
inline constexpr double nasa_gas_Cp_floor_over_R = 2.5 * (1.0 - 1e-3);
// S must be positive and at most 10,000 J/(mol K) in range (about five times the entropy
// of a C30 alkane at 3000 K; a bound against garbled coefficients, common practice).
inline constexpr double nasa_S_max_J_per_mol_K = 1.0e4;

// One line per finding, without the file location (the caller adds it), e.g.
// "Cp jumps by 1.2 % at T_mid 1000 K (tolerance 0.5 %)". Empty for a sound polynomial.
std::vector<std::string> nasa_sanity_warnings(const NasaPolynomial& polynomial);

}  // namespace vibtherm
