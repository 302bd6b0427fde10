#include "vibtherm/nasa_compare.hpp"

#include <cmath>

#include "vibtherm/constants.hpp"

namespace vibtherm {

ThermoCurve polynomial_curve(const NasaPolynomial& p, const std::vector<double>& temperatures_K) {
  ThermoCurve c;
  c.name = polynomial_name(p);
  const double H298 = polynomial_at(p, constants::reference_temperature_K).H_J_per_mol();
  c.H298_J_per_mol = H298;  // a NASA polynomial's H is absolute (design.md section 6)
  for (double T : temperatures_K) {
    const NasaProperties v = polynomial_at(p, T);
    c.T_K.push_back(T);
    c.Cp_J_per_mol_K.push_back(v.Cp_J_per_mol_K());
    c.S_J_per_mol_K.push_back(v.S_J_per_mol_K());
    c.H_minus_H298_J_per_mol.push_back(v.H_J_per_mol() - H298);
  }
  return c;
}

ThermoCurve table_curve(const std::string& name, const std::vector<ThermoPoint>& rows,
                        std::optional<double> enthalpy_of_formation_J_per_mol) {
  ThermoCurve c;
  c.name = name;
  c.H298_J_per_mol = enthalpy_of_formation_J_per_mol;
  for (const auto& r : rows) {
    c.T_K.push_back(r.T_K);
    c.Cp_J_per_mol_K.push_back(r.Cp_J_per_mol_K);
    c.S_J_per_mol_K.push_back(r.S_J_per_mol_K);
    c.H_minus_H298_J_per_mol.push_back(r.H_minus_H298_J_per_mol);
  }
  return c;
}

namespace {
void track(LargestDifference& d, double diff, double T) {
  if (std::abs(diff) > std::abs(d.difference) || d.T_K == 0.0) d = {diff, T};
}
}  // namespace

CurveComparison compare_curves(const ThermoCurve& a, const ThermoCurve& b) {
  CurveComparison out;
  out.name = a.name;
  out.points = std::min(a.T_K.size(), b.T_K.size());
  out.H_absolute = a.H298_J_per_mol && b.H298_J_per_mol;
  const double dH298 = out.H_absolute ? *b.H298_J_per_mol - *a.H298_J_per_mol : 0.0;
  for (std::size_t k = 0; k < out.points; ++k) {
    const double T = a.T_K[k];
    if (k == 0) out.T_min_K = T;
    out.T_max_K = T;
    track(out.Cp_J_per_mol_K, b.Cp_J_per_mol_K[k] - a.Cp_J_per_mol_K[k], T);
    track(out.S_J_per_mol_K, b.S_J_per_mol_K[k] - a.S_J_per_mol_K[k], T);
    track(out.H_J_per_mol, b.H_minus_H298_J_per_mol[k] - a.H_minus_H298_J_per_mol[k] + dH298, T);
  }
  return out;
}

std::vector<double> comparison_grid(double lo, double hi, double step) {
  std::vector<double> out;
  if (!(step > 0) || !(hi >= lo)) return out;
  for (int k = 0;; ++k) {
    const double T = lo + k * step;
    if (T >= hi - 1e-9 * step) break;
    out.push_back(T);
  }
  out.push_back(hi);
  return out;
}

}  // namespace vibtherm
