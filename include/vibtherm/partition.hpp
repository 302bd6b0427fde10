// Partition functions of the separate motions and their temperature derivatives, as
// dimensionless molar quantities. Each returns ln q and the thermal parts of U, H, Cv, Cp
// and S divided by R or RT; energies are counted from the lowest level (the zero-point
// level for vibrations), so the zero-point energy is reported apart.
#pragma once

#include <span>

#include "vibtherm/species.hpp"

namespace vibtherm {

struct MotionTerms {
  double ln_q = 0.0;       // ln of the (molecular) partition function
  double U_over_RT = 0.0;  // [U(T) - U(0)] / RT
  double H_over_RT = 0.0;  // [H(T) - H(0)] / RT; differs from U only for translation (+1)
  double Cv_over_R = 0.0;
  double Cp_over_R = 0.0;  // differs from Cv only for translation (+1)
  double S_over_R = 0.0;

  MotionTerms& operator+=(const MotionTerms& other);
};

// Ideal-gas translation, Sackur–Tetrode (Sackur 1911; Tetrode 1912):
// S/R = ln[(2π m k T / h²)^{3/2} · V/N] + 5/2 with V/N = kT/p, or, for a concentration
// standard state, V/N = 1/(c N_A).
MotionTerms translation_terms(double mass_amu, double T_K, double pressure_Pa);
MotionTerms translation_terms_concentration(double mass_amu, double T_K, double concentration_mol_per_m3);

// Classical rigid rotor (high-temperature limit), symmetry number sigma.
// Linear: q = T / (σ θ). Nonlinear: q = √π / σ · T^{3/2} / √(θA θB θC).
MotionTerms rigid_rotor_terms(std::span<const double> rotational_temperatures_K, int symmetry_number,
                              double T_K);

// One quantum harmonic oscillator counted from its zero-point level (Einstein 1907):
// with x = θ/T, ln q = −ln(1 − e^{−x}), Cv/R = x² eˣ/(eˣ − 1)².
MotionTerms harmonic_oscillator_terms(double wavenumber_cm1, double T_K);

// A set of harmonic oscillators with characteristic temperatures θ_i (K): the same terms as
// the sum of harmonic_oscillator_terms over the set, with one exp (expm1 below x = 0.5)
// per mode and one log for the whole set, ln q = −ln Π(1 − e^{−x_i}); the product is kept
// as mantissa and binary exponent so that it cannot underflow, and near 1 it is carried as
// 1 − Π so that log1p keeps its relative accuracy.
MotionTerms harmonic_oscillators_terms(std::span<const double> theta_K, double T_K);

// Translation and classical rigid rotation have ln q = ln_q_at_1K + power · ln T and
// temperature-independent U, H, Cv and Cp: a species fixes the constants once, and an
// evaluation over many temperatures costs one ln T shared by both.
struct LogLinearTerms {
  double ln_q_at_1K = 0.0;
  double power = 0.0;  // d ln q / d ln T
  MotionTerms fixed;   // U, H, Cv, Cp; ln q and S are filled by at()
  MotionTerms at(double ln_T) const;
};
LogLinearTerms translation_law(double mass_amu, double pressure_Pa);
LogLinearTerms translation_law_concentration(double mass_amu, double concentration_mol_per_m3);
LogLinearTerms rigid_rotor_law(std::span<const double> rotational_temperatures_K, int symmetry_number);

// Characteristic temperature θ = h c ν̃ / k of a wavenumber in cm^-1.
double characteristic_temperature_K(double wavenumber_cm1);

// Discrete electronic levels (energies in cm^-1, degeneracies), Boltzmann sum in log
// form, counted from the lowest level.
MotionTerms electronic_terms(std::span<const ElectronicLevel> levels, double T_K);

}  // namespace vibtherm
