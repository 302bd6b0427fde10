// Conversions of unit-bearing input values to SI at the edges of the library.
#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace vibtherm {

// Wavenumber-like quantities: "cm^-1" (also "cm-1", "1/cm"), "GHz", "meV", "K".
// Returns the value in cm^-1, or nullopt for an unknown unit.
std::optional<double> to_wavenumber_cm1(double value, std::string_view unit);

// Molar energies: "kJ/mol", "kcal/mol", "J/mol", "eV", "hartree" (per particle for eV and hartree).
// Returns J/mol, or nullopt for an unknown unit.
std::optional<double> to_energy_J_per_mol(double value, std::string_view unit);

// Pressure text such as "1bar", "1 atm", "101325Pa", "100kPa". nullopt if unreadable.
std::optional<double> parse_pressure_Pa(std::string_view text);

// Comma-separated list of units accepted by each function above, for error messages.
std::string wavenumber_units_list();
std::string energy_units_list();

}  // namespace vibtherm
