// Conversions of unit-bearing input values to SI at the edges of the library, and the
// locale-independent number parsing every reader uses.
#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace vibtherm {

// Wavenumber-like quantities: "cm^-1" (also "cm-1", "1/cm"), "GHz", "MHz", "meV", "K".
// Returns the value in cm^-1, or nullopt for an unknown unit.
std::optional<double> to_wavenumber_cm1(double value, std::string_view unit);

// Molar energies: "kJ/mol", "kcal/mol" (thermochemical calorie), "J/mol", "eV", "hartree"
// (per particle for eV and hartree, multiplied by N_A). Returns J/mol, or nullopt for an
// unknown unit.
std::optional<double> to_energy_J_per_mol(double value, std::string_view unit);

// Force constants (Hessian elements), energy per length squared: "hartree/bohr^2",
// "kcal/mol/A^2", "kJ/mol/A^2" (molar energies per molecule), "J/m^2" (SI, = N/m).
// Returns J/m², or nullopt for an unknown unit.
std::optional<double> to_force_constant_J_per_m2(double value, std::string_view unit);

// Pressure text: a number, optional blanks, and a unit, as in "1bar", "1 atm",
// "101325Pa", "100kPa", "1e5 Pa". Units: Pa, hPa, kPa, MPa, mbar, bar, atm, Torr.
// A bare number is refused rather than guessed: "1" could mean 1 bar or 1 Pa, five
// orders of magnitude apart. nullopt if unreadable, not finite, or not positive.
std::optional<double> parse_pressure_Pa(std::string_view text);

// As parse_pressure_Pa, but throws InputError (no location) saying what was wrong.
double parse_pressure_Pa_or_throw(std::string_view text);

// A whole string as a finite decimal number ("1", "-2.5", "+3e-4"), independent of the
// C++ locale (std::from_chars). Surrounding blanks are not allowed; nullopt otherwise,
// including for "nan" and "inf".
std::optional<double> parse_number(std::string_view text);

// Comma-separated list of units accepted by each function above, for error messages.
std::string wavenumber_units_list();
std::string energy_units_list();
std::string pressure_units_list();
std::string force_constant_units_list();

}  // namespace vibtherm
