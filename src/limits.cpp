#include "vibtherm/limits.hpp"

#include <fmt/format.h>

#include <cmath>

#include "vibtherm/constants.hpp"

namespace vibtherm::limits {

void check_range(double value, double low, double high, std::string_view what, std::string_view unit,
                 const SourceLocation& where) {
  if (std::isfinite(value) && value >= low && value <= high) return;
  fail(where, fmt::format("{} is {:g}, expected {:g} to {:g}{}{}", what, value, low, high,
                          unit.empty() ? "" : " ", unit));
}

void check_temperature(double T_K, std::string_view what, const SourceLocation& where) {
  check_range(T_K, min_temperature_K, max_temperature_K, what, "K", where);
}

std::string display_name(std::string_view name) {
  if (name.size() <= 60) return std::string(name);
  return fmt::format("{}... ({} characters)", name.substr(0, 57), name.size());
}

void check_species(const Species& s) {
  const SourceLocation& at = s.origin;
  const std::string who = fmt::format("species '{}': ", display_name(s.name));
  for (std::size_t i = 0; i < s.atoms.size(); ++i) {
    const Atom& a = s.atoms[i];
    check_range(a.mass_amu, min_mass_amu, max_mass_amu, fmt::format("{}atom {} mass", who, i + 1), "amu", at);
    for (int k = 0; k < 3; ++k)
      check_range(a.position_angstrom[k], -max_coordinate_angstrom, max_coordinate_angstrom,
                  fmt::format("{}atom {} coordinate {}", who, i + 1, "xyz"[k]), "angstrom", at);
  }
  if (s.rotor_data) {
    check_range(s.rotor_data->mass_amu, min_mass_amu, max_mass_amu, who + "mass", "amu", at);
    for (double m : s.rotor_data->moments_amu_A2)
      check_range(m, min_moment_amu_A2, max_moment_amu_A2, who + "moment of inertia", "amu A^2", at);
  }
  for (std::size_t i = 0; i < s.frequencies_cm1.size(); ++i)
    check_range(std::abs(s.frequencies_cm1[i]), min_wavenumber_cm1, max_wavenumber_cm1,
                fmt::format("{}|wavenumber {}|", who, i + 1), "cm^-1", at);
  if (s.hessian_J_per_m2)
    for (double h : *s.hessian_J_per_m2)
      if (!std::isfinite(h)) fail(at, who + "the Hessian holds a value that is not finite");
  if (s.symmetry_number > max_symmetry_number)
    fail(at, fmt::format("{}symmetry number is {}, expected 1 to {}", who, *s.symmetry_number,
                         max_symmetry_number));
  for (const ElectronicLevel& level : s.electronic_levels) {
    check_range(level.energy_cm1, 0.0, max_electronic_energy_cm1, who + "electronic level energy", "cm^-1",
                at);
    if (level.degeneracy < 1 || level.degeneracy > max_degeneracy)
      fail(at, fmt::format("{}electronic level degeneracy is {}, expected 1 to {}", who, level.degeneracy,
                           max_degeneracy));
  }
  if (s.electronic_energy_J_per_mol)
    check_range(*s.electronic_energy_J_per_mol / (constants::hartree_J * constants::avogadro_per_mol),
                -max_molecular_energy_hartree, max_molecular_energy_hartree, who + "electronic energy",
                "hartree", key_location(s, "electronic_energy"));
  if (s.enthalpy_of_formation_J_per_mol)
    check_range(*s.enthalpy_of_formation_J_per_mol / 1e3, -max_enthalpy_of_formation_J_per_mol / 1e3,
                max_enthalpy_of_formation_J_per_mol / 1e3, who + "enthalpy of formation", "kJ/mol", at);
  for (const HinderedRotor& r : s.hindered_rotors) {
    const SourceLocation& rw = r.where.file.empty() ? at : r.where;
    if (r.symmetry < 1 || r.symmetry > max_rotor_symmetry)
      fail(rw, fmt::format("{}hindered rotor symmetry is {}, expected 1 to {}", who, r.symmetry,
                           max_rotor_symmetry));
    if (r.barrier_J_per_mol)
      check_range(*r.barrier_J_per_mol / 1e3, 0.0, max_rotor_energy_J_per_mol / 1e3,
                  who + "hindered rotor barrier", "kJ/mol", rw);
    for (const ScanPoint& p : r.scan) {
      check_range(p.energy_J_per_mol / 1e3, -max_rotor_energy_J_per_mol / 1e3,
                  max_rotor_energy_J_per_mol / 1e3, who + "hindered rotor scan energy", "kJ/mol", rw);
      check_range(p.angle_deg, -3600.0, 3600.0, who + "hindered rotor scan angle", "deg", rw);
    }
    check_range(r.replaces_cm1, min_wavenumber_cm1, max_wavenumber_cm1, who + "hindered rotor 'replaces'",
                "cm^-1", rw);
  }
}

}  // namespace vibtherm::limits
