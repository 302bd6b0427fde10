#include "vibtherm/units.hpp"

#include <cctype>
#include <charconv>
#include <cmath>

#include "vibtherm/constants.hpp"
#include "vibtherm/error.hpp"

namespace vibtherm {
namespace {

using namespace constants;

struct UnitFactor {
  std::string_view name;
  double factor;  // multiply a value in this unit by it to get the target unit
};

// hc in J·cm: the energy of one cm^-1.
constexpr double hc_J_cm = planck_J_s * speed_of_light_m_s * 100.0;

// Wavenumber equivalents: ν̃ = ν/c for frequencies, E/(hc) for energies, kT/(hc) for
// temperatures (definitions; constants from CODATA 2018 via constants.hpp).
constexpr UnitFactor wavenumber_units[] = {
    {"cm^-1", 1.0},
    {"cm-1", 1.0},
    {"1/cm", 1.0},
    {"GHz", 1e9 / (speed_of_light_m_s * 100.0)},
    {"MHz", 1e6 / (speed_of_light_m_s * 100.0)},
    {"meV", 1e-3 * elementary_charge_C / hc_J_cm},
    {"K", boltzmann_J_per_K / hc_J_cm},
};

constexpr UnitFactor energy_units[] = {
    {"kJ/mol", 1e3},
    {"kcal/mol", 1e3 * calorie_J},
    {"J/mol", 1.0},
    {"eV", elementary_charge_C* avogadro_per_mol},
    {"hartree", hartree_J* avogadro_per_mol},
};

// Force constants (energy per length squared) to J/m² = N/m: hartree/bohr² from the CODATA
// 2018 hartree and Bohr radius; molar units per molecule through N_A; 1 Å = 1e-10 m.
constexpr UnitFactor force_constant_units[] = {
    {"hartree/bohr^2", hartree_J / (bohr_radius_m * bohr_radius_m)},
    {"kcal/mol/A^2", 1e3 * calorie_J / avogadro_per_mol / (angstrom_m * angstrom_m)},
    {"kJ/mol/A^2", 1e3 / avogadro_per_mol / (angstrom_m * angstrom_m)},
    {"J/m^2", 1.0},
};

constexpr UnitFactor pressure_units[] = {
    {"Pa", 1.0},
    {"hPa", 1e2},
    {"kPa", 1e3},
    {"MPa", 1e6},
    {"mbar", 1e-3 * bar_Pa},
    {"bar", bar_Pa},
    {"atm", atmosphere_Pa},
    {"Torr", atmosphere_Pa / 760.0},  // 1 Torr = 1/760 atm by definition
};

template <std::size_t N>
std::optional<double> factor_of(const UnitFactor (&table)[N], std::string_view unit) {
  for (const UnitFactor& u : table)
    if (u.name == unit) return u.factor;
  return std::nullopt;
}

template <std::size_t N>
std::string names_of(const UnitFactor (&table)[N]) {
  std::string out;
  for (const UnitFactor& u : table) {
    if (!out.empty()) out += ", ";
    out += u.name;
  }
  return out;
}

bool is_blank(char c) { return c == ' ' || c == '\t'; }

struct PressureParse {
  std::optional<double> value_Pa;
  std::string problem;  // set when value_Pa is empty
};

PressureParse parse_pressure(std::string_view text) {
  std::string quoted = "'" + std::string(text) + "'";
  while (!text.empty() && is_blank(text.front())) text.remove_prefix(1);
  while (!text.empty() && is_blank(text.back())) text.remove_suffix(1);
  // The number ends where the unit's letters begin; exponents ("1e5") are part of it.
  std::size_t split = 0;
  while (split < text.size()) {
    char c = text[split];
    bool exponent = (c == 'e' || c == 'E') && split > 0 && split + 1 < text.size() &&
                    (std::isdigit(static_cast<unsigned char>(text[split + 1])) || text[split + 1] == '-' ||
                     text[split + 1] == '+');
    if (std::isdigit(static_cast<unsigned char>(c)) || c == '.' || c == '-' || c == '+' || exponent) {
      split += exponent ? 2 : 1;
    } else {
      break;
    }
  }
  std::string_view number_text = text.substr(0, split);
  std::string_view unit = text.substr(split);
  while (!unit.empty() && is_blank(unit.front())) unit.remove_prefix(1);
  std::optional<double> value = parse_number(number_text);
  if (!value)
    return {std::nullopt, "cannot read pressure " + quoted +
                              ", expected a number and a unit such as 1bar, 1atm, 101325Pa or 100kPa"};
  if (unit.empty())
    return {std::nullopt, "pressure " + quoted + " has no unit, expected one of " + pressure_units_list() +
                              " (a bare number is ambiguous)"};
  std::optional<double> factor = factor_of(pressure_units, unit);
  if (!factor)
    return {std::nullopt, "unknown pressure unit '" + std::string(unit) + "' in " + quoted +
                              ", expected one of " + pressure_units_list()};
  double pascal = *value * *factor;
  if (!(pascal > 0.0) || !std::isfinite(pascal))
    return {std::nullopt, "pressure " + quoted + " must be positive and finite"};
  return {pascal, ""};
}

}  // namespace

std::optional<double> to_wavenumber_cm1(double value, std::string_view unit) {
  if (auto f = factor_of(wavenumber_units, unit)) return value * *f;
  return std::nullopt;
}

std::optional<double> to_energy_J_per_mol(double value, std::string_view unit) {
  if (auto f = factor_of(energy_units, unit)) return value * *f;
  return std::nullopt;
}

std::optional<double> to_force_constant_J_per_m2(double value, std::string_view unit) {
  if (auto f = factor_of(force_constant_units, unit)) return value * *f;
  return std::nullopt;
}

std::optional<double> parse_pressure_Pa(std::string_view text) { return parse_pressure(text).value_Pa; }

double parse_pressure_Pa_or_throw(std::string_view text) {
  PressureParse result = parse_pressure(text);
  if (!result.value_Pa) fail({}, result.problem);
  return *result.value_Pa;
}

std::optional<double> parse_number(std::string_view text) {
  // std::from_chars refuses a leading '+', which people and YAML files do write.
  if (!text.empty() && text.front() == '+') {
    text.remove_prefix(1);
    if (!text.empty() && (text.front() == '-' || text.front() == '+')) return std::nullopt;
  }
  if (text.empty()) return std::nullopt;
  double value = 0.0;
  auto [end, ec] = std::from_chars(text.data(), text.data() + text.size(), value, std::chars_format::general);
  if (ec != std::errc() || end != text.data() + text.size() || !std::isfinite(value)) return std::nullopt;
  return value;
}

std::string wavenumber_units_list() { return names_of(wavenumber_units); }
std::string energy_units_list() { return names_of(energy_units); }
std::string pressure_units_list() { return names_of(pressure_units); }
std::string force_constant_units_list() { return names_of(force_constant_units); }

}  // namespace vibtherm
