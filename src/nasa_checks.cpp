#include "vibtherm/nasa_checks.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "vibtherm/constants.hpp"

namespace vibtherm {

namespace {

constexpr double R = constants::gas_constant_J_per_mol_K;

struct Piece {  // one range as a function of T
  double T_low_K, T_high_K;
  NasaProperties (*eval)(const void*, double);
  const void* data;
};

NasaProperties eval7(const void* a, double T) {
  return nasa7_properties(*static_cast<const std::array<double, 7>*>(a), T);
}
NasaProperties eval9(const void* r, double T) {
  return nasa9_properties(*static_cast<const Nasa9Range*>(r), T);
}

void joint(std::vector<std::string>& out, const Piece& below, const Piece& above, double T,
           const char* label) {
  const NasaProperties a = below.eval(below.data, T), b = above.eval(above.data, T);
  const double cp_a = a.Cp_J_per_mol_K(), cp_b = b.Cp_J_per_mol_K();
  const double dcp = std::abs(cp_a - cp_b) / std::max(std::abs(cp_a), 1e-30);
  if (dcp > nasa_joint_Cp_relative)
    out.push_back(fmt::format("Cp jumps by {:.3g} % at {} {:g} K (tolerance {:g} %)", 100 * dcp, label, T,
                              100 * nasa_joint_Cp_relative));
  const double dh = std::abs(a.H_J_per_mol() - b.H_J_per_mol());
  if (dh > nasa_joint_H_J_per_mol)
    out.push_back(fmt::format("H jumps by {:.3g} kJ/mol at {} {:g} K (tolerance {:g} kJ/mol)", dh / 1e3,
                              label, T, nasa_joint_H_J_per_mol / 1e3));
  const double ds = std::abs(a.S_J_per_mol_K() - b.S_J_per_mol_K());
  if (ds > nasa_joint_S_J_per_mol_K)
    out.push_back(fmt::format("S jumps by {:.3g} J/(mol K) at {} {:g} K (tolerance {:g} J/(mol K))", ds,
                              label, T, nasa_joint_S_J_per_mol_K));
}

void sample(std::vector<std::string>& out, const std::vector<Piece>& pieces, bool gas) {
  double cp_min = 1e300, cp_min_T = 0, s_min = 1e300, s_min_T = 0, s_max = -1e300, s_max_T = 0;
  for (const auto& p : pieces) {
    if (!(p.T_high_K > p.T_low_K)) continue;
    for (int k = 0; k <= 50; ++k) {
      const double T = p.T_low_K + (p.T_high_K - p.T_low_K) * k / 50.0;
      const NasaProperties v = p.eval(p.data, T);
      if (!(v.Cp_over_R >= cp_min)) cp_min = v.Cp_over_R, cp_min_T = T;
      if (!(v.S_over_R >= s_min)) s_min = v.S_over_R, s_min_T = T;
      if (!(v.S_over_R <= s_max)) s_max = v.S_over_R, s_max_T = T;
    }
  }
  if (cp_min == 1e300) return;
  if (!(cp_min >= 0))
    out.push_back(fmt::format("Cp is negative ({:.4g} J/(mol K)) at {:g} K", cp_min * R, cp_min_T));
  else if (gas && cp_min < nasa_gas_Cp_floor_over_R)
    out.push_back(
        fmt::format("Cp {:.4g} J/(mol K) at {:g} K is below 5/2 R = {:.4g} J/(mol K), the monatomic "
                    "ideal-gas value",
                    cp_min * R, cp_min_T, 2.5 * R));
  if (!(s_min > 0))
    out.push_back(fmt::format("S is not positive ({:.4g} J/(mol K)) at {:g} K", s_min * R, s_min_T));
  if (!(s_max * R <= nasa_S_max_J_per_mol_K))
    out.push_back(fmt::format("S {:.4g} J/(mol K) at {:g} K is implausibly large (bound {:g} J/(mol K))",
                              s_max * R, s_max_T, nasa_S_max_J_per_mol_K));
}

}  // namespace

std::vector<std::string> nasa_sanity_warnings(const NasaPolynomial& polynomial) {
  std::vector<std::string> out;
  std::vector<Piece> pieces;
  bool gas = true;
  if (const auto* n7 = std::get_if<Nasa7>(&polynomial)) {
    gas = n7->phase == 'G';
    if (!(n7->T_high_K > n7->T_low_K)) {
      out.push_back(fmt::format("temperature range {:g}-{:g} K is {}", n7->T_low_K, n7->T_high_K,
                                n7->T_high_K == n7->T_low_K ? "empty" : "inverted"));
      return out;
    }
    if (n7->T_mid_K < n7->T_low_K || n7->T_mid_K > n7->T_high_K)
      out.push_back(fmt::format("T_mid {:g} K lies outside its range {:g}-{:g} K", n7->T_mid_K, n7->T_low_K,
                                n7->T_high_K));
    const double mid = std::clamp(n7->T_mid_K, n7->T_low_K, n7->T_high_K);
    pieces.push_back({n7->T_low_K, mid, eval7, &n7->low});
    pieces.push_back({mid, n7->T_high_K, eval7, &n7->high});
    if (mid > n7->T_low_K && mid < n7->T_high_K) joint(out, pieces[0], pieces[1], mid, "T_mid");
  } else {
    const auto& n9 = std::get<Nasa9>(polynomial);
    gas = n9.phase == 0;
    for (std::size_t k = 0; k < n9.ranges.size(); ++k) {
      const auto& r = n9.ranges[k];
      if (!(r.T_high_K > r.T_low_K))
        out.push_back(fmt::format("interval {} ({:g}-{:g} K) is {}", k + 1, r.T_low_K, r.T_high_K,
                                  r.T_high_K == r.T_low_K ? "empty" : "inverted"));
      pieces.push_back({r.T_low_K, r.T_high_K, eval9, &r});
    }
    for (std::size_t k = 1; k < pieces.size(); ++k)
      joint(out, pieces[k - 1], pieces[k], n9.ranges[k].T_low_K, "breakpoint");
  }
  sample(out, pieces, gas);
  return out;
}

}  // namespace vibtherm
