// NASA polynomials: the 7-coefficient (two ranges) and 9-coefficient (any number of
// ranges) forms, and their evaluation to Cp/R, H/RT and S/R and to dimensional values.
#pragma once

#include <array>
#include <string>
#include <variant>
#include <vector>

#include "vibtherm/thermo.hpp"

namespace vibtherm {

struct ElementAmount {
  std::string symbol;  // as written in the file ("C", "H", "D", "E" for electrons)
  double count = 0.0;  // NASA-9 allows fractional counts
};

// Dimensionless values at one temperature; H is absolute (H(298.15 K) = ΔfH°).
struct NasaProperties {
  double T_K = 0.0;
  double Cp_over_R = 0.0;
  double H_over_RT = 0.0;
  double S_over_R = 0.0;

  double Cp_J_per_mol_K() const;
  double H_J_per_mol() const;
  double S_J_per_mol_K() const;
};

// NASA-7 (Gordon & McBride, NASA SP-273, 1971; McBride, Gordon & Reno, NASA TM-4513, 1993):
//   Cp/R = a1 + a2 T + a3 T² + a4 T³ + a5 T⁴
//   H/RT = a1 + a2 T/2 + a3 T²/3 + a4 T³/4 + a5 T⁴/5 + a6/T
//   S/R  = a1 ln T + a2 T + a3 T²/2 + a4 T³/3 + a5 T⁴/4 + a7
struct Nasa7 {
  std::string name;
  std::string note;  // columns 19-24 of line 1 (date code or note), at most 6 characters
  std::vector<ElementAmount> composition;
  char phase = 'G';  // G gas, L liquid, S solid (we write S for adsorbates)
  double T_low_K = 300.0;
  double T_mid_K = 1000.0;
  double T_high_K = 5000.0;
  std::array<double, 7> low{};        // T_low..T_mid
  std::array<double, 7> high{};       // T_mid..T_high
  std::vector<std::string> comments;  // written as '!' lines above the record

  // The lower set is used up to and including T_mid. Outside [T_low, T_high] the nearer
  // set is extrapolated; callers that care check in_range().
  NasaProperties at(double T_K) const;
  bool in_range(double T_K) const { return T_K >= T_low_K && T_K <= T_high_K; }
};

NasaProperties nasa7_properties(const std::array<double, 7>& a, double T_K);

// NASA-9 (McBride, Zehe & Gordon, NASA/TP-2002-211556, 2002, eqs. 1-3 of the format description):
//   Cp/R = a1 T⁻² + a2 T⁻¹ + a3 + a4 T + a5 T² + a6 T³ + a7 T⁴
//   H/RT = −a1 T⁻² + a2 T⁻¹ ln T + a3 + a4 T/2 + a5 T²/3 + a6 T³/4 + a7 T⁴/5 + b1/T
//   S/R  = −a1 T⁻²/2 − a2 T⁻¹ + a3 ln T + a4 T + a5 T²/2 + a6 T³/3 + a7 T⁴/4 + b2
struct Nasa9Range {
  double T_low_K = 0.0;
  double T_high_K = 0.0;
  std::array<double, 7> a{};
  double b1 = 0.0;
  double b2 = 0.0;
};

NasaProperties nasa9_properties(const Nasa9Range& range, double T_K);

struct Nasa9 {
  std::string name;
  std::string comment;                     // record 1, columns 19-80
  std::string date_code;                   // record 2, columns 4-9
  std::vector<ElementAmount> composition;  // at most five elements
  int phase = 0;                           // 0 gas, nonzero condensed (the published convention)
  double molar_mass_g_per_mol = 0.0;
  double enthalpy_of_formation_J_per_mol = 0.0;  // ΔfH°(298.15 K)
  double H298_minus_H0_J_per_mol = 0.0;
  std::vector<Nasa9Range> ranges;  // ascending, contiguous

  // The range containing T (the lower one at a joint); outside, the nearer end range.
  NasaProperties at(double T_K) const;
  bool in_range(double T_K) const;
  double T_min_K() const;
  double T_max_K() const;
};

// What a NASA file holds for one species.
using NasaPolynomial = std::variant<Nasa7, Nasa9>;

const std::string& polynomial_name(const NasaPolynomial& polynomial);
NasaProperties polynomial_at(const NasaPolynomial& polynomial, double T_K);
bool polynomial_in_range(const NasaPolynomial& polynomial, double T_K);
double polynomial_T_min_K(const NasaPolynomial& polynomial);
double polynomial_T_max_K(const NasaPolynomial& polynomial);

// Gas phase: NASA-7 phase G, NASA-9 phase 0.
bool polynomial_is_gas(const NasaPolynomial& polynomial);

// The table row of a polynomial at T: Cp, S, H − H(298.15 K), G − H(298.15 K) and
// −[G − H(298.15 K)]/T from the polynomial, and for a gas Cv = Cp − R (ideal gas, common
// practice); the model-only fields (H − H0, motions) stay zero, so writers show them as unknown.
ThermoPoint polynomial_table_row(const NasaPolynomial& polynomial, double T_K);

}  // namespace vibtherm
