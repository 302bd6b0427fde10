// Internal to the NASA fit (fit_nasa.cpp, fit_plan.cpp): the scaled-temperature basis of
// one Cp term and the range bookkeeping of a breakpoint list.
#pragma once

#include <cmath>
#include <vector>

#include "vibtherm/fit_nasa.hpp"

namespace vibtherm::fit_detail {

inline constexpr double kScale_K = 1000.0;
inline constexpr double kJointTolerance_K = 1e-9;

inline std::vector<int> exponents_of(NasaForm form) {
  if (form == NasaForm::nasa7) return {0, 1, 2, 3, 4};
  return {-2, -1, 0, 1, 2, 3, 4};
}

// Cp/R, its τ derivative, ∫Cp/R dτ (the H/R basis in units of 1000 K) and ∫Cp/(Rτ) dτ
// (the S/R basis) of one term τ^e.
inline double cp_term(int e, double tau) { return std::pow(tau, e); }
inline double dcp_term(int e, double tau) { return e == 0 ? 0.0 : e * std::pow(tau, e - 1); }
inline double h_term(int e, double tau) { return e == -1 ? std::log(tau) : std::pow(tau, e + 1) / (e + 1); }
inline double s_term(int e, double tau) { return e == 0 ? std::log(tau) : std::pow(tau, e) / e; }

inline int range_index_of(const std::vector<double>& bp, double T_K) {
  const int n = static_cast<int>(bp.size()) - 1;
  for (int r = 0; r < n; ++r)
    if (T_K <= bp[r + 1]) return r;
  return n - 1;
}

inline bool in_range(const std::vector<double>& bp, int r, double T_K) {
  return T_K >= bp[r] - kJointTolerance_K && T_K <= bp[r + 1] + kJointTolerance_K;
}

}  // namespace vibtherm::fit_detail
