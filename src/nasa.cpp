#include "vibtherm/nasa.hpp"

#include <cmath>

#include "vibtherm/constants.hpp"

namespace vibtherm {

namespace {
constexpr double R = constants::gas_constant_J_per_mol_K;
}

double NasaProperties::Cp_J_per_mol_K() const { return Cp_over_R * R; }
double NasaProperties::H_J_per_mol() const { return H_over_RT * R * T_K; }
double NasaProperties::S_J_per_mol_K() const { return S_over_R * R; }

// NASA SP-273 / TM-4513 NASA-7 expressions (see nasa.hpp), Horner form.
NasaProperties nasa7_properties(const std::array<double, 7>& a, double T) {
  NasaProperties p;
  p.T_K = T;
  p.Cp_over_R = a[0] + T * (a[1] + T * (a[2] + T * (a[3] + T * a[4])));
  p.H_over_RT = a[0] + T * (a[1] / 2 + T * (a[2] / 3 + T * (a[3] / 4 + T * a[4] / 5))) + a[5] / T;
  p.S_over_R = a[0] * std::log(T) + T * (a[1] + T * (a[2] / 2 + T * (a[3] / 3 + T * a[4] / 4))) + a[6];
  return p;
}

NasaProperties Nasa7::at(double T_K) const { return nasa7_properties(T_K <= T_mid_K ? low : high, T_K); }

// NASA/TP-2002-211556 NASA-9 expressions (see nasa.hpp).
NasaProperties nasa9_properties(const Nasa9Range& r, double T) {
  const auto& a = r.a;
  const double lnT = std::log(T);
  NasaProperties p;
  p.T_K = T;
  p.Cp_over_R = a[0] / (T * T) + a[1] / T + a[2] + T * (a[3] + T * (a[4] + T * (a[5] + T * a[6])));
  p.H_over_RT = -a[0] / (T * T) + a[1] * lnT / T + a[2] +
                T * (a[3] / 2 + T * (a[4] / 3 + T * (a[5] / 4 + T * a[6] / 5))) + r.b1 / T;
  p.S_over_R = -a[0] / (2 * T * T) - a[1] / T + a[2] * lnT +
               T * (a[3] + T * (a[4] / 2 + T * (a[5] / 3 + T * a[6] / 4))) + r.b2;
  return p;
}

NasaProperties Nasa9::at(double T_K) const {
  if (ranges.empty()) return NasaProperties{T_K, 0.0, 0.0, 0.0};
  for (const auto& r : ranges)
    if (T_K <= r.T_high_K) return nasa9_properties(r, T_K);
  return nasa9_properties(ranges.back(), T_K);
}

bool Nasa9::in_range(double T_K) const { return !ranges.empty() && T_K >= T_min_K() && T_K <= T_max_K(); }
double Nasa9::T_min_K() const { return ranges.empty() ? 0.0 : ranges.front().T_low_K; }
double Nasa9::T_max_K() const { return ranges.empty() ? 0.0 : ranges.back().T_high_K; }

const std::string& polynomial_name(const NasaPolynomial& p) {
  return std::visit([](const auto& x) -> const std::string& { return x.name; }, p);
}
NasaProperties polynomial_at(const NasaPolynomial& p, double T_K) {
  return std::visit([T_K](const auto& x) { return x.at(T_K); }, p);
}
bool polynomial_in_range(const NasaPolynomial& p, double T_K) {
  return std::visit([T_K](const auto& x) { return x.in_range(T_K); }, p);
}
double polynomial_T_min_K(const NasaPolynomial& p) {
  if (const auto* n7 = std::get_if<Nasa7>(&p)) return n7->T_low_K;
  return std::get<Nasa9>(p).T_min_K();
}
double polynomial_T_max_K(const NasaPolynomial& p) {
  if (const auto* n7 = std::get_if<Nasa7>(&p)) return n7->T_high_K;
  return std::get<Nasa9>(p).T_max_K();
}

bool polynomial_is_gas(const NasaPolynomial& p) {
  if (const auto* n7 = std::get_if<Nasa7>(&p)) return n7->phase == 'G';
  return std::get<Nasa9>(p).phase == 0;
}

ThermoPoint polynomial_table_row(const NasaPolynomial& p, double T_K) {
  const NasaProperties at = polynomial_at(p, T_K);
  const double H298 = polynomial_at(p, constants::reference_temperature_K).H_J_per_mol();
  ThermoPoint row;
  row.T_K = T_K;
  row.Cp_J_per_mol_K = at.Cp_J_per_mol_K();
  row.S_J_per_mol_K = at.S_J_per_mol_K();
  if (polynomial_is_gas(p)) row.Cv_J_per_mol_K = row.Cp_J_per_mol_K - R;  // Cp − Cv = R (ideal gas)
  row.H_minus_H298_J_per_mol = at.H_J_per_mol() - H298;
  // G = H − TS (common practice).
  row.G_minus_H298_J_per_mol = row.H_minus_H298_J_per_mol - T_K * row.S_J_per_mol_K;
  row.gibbs_function_J_per_mol_K = -row.G_minus_H298_J_per_mol / T_K;
  return row;
}

}  // namespace vibtherm
