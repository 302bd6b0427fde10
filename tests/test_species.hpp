// Species built directly in code for unit tests, with the sources of their data.
#pragma once

#include <cmath>

#include "vibtherm/species.hpp"

namespace vibtherm::test {

// Isotope masses, AME2020 (Wang et al., Chin. Phys. C 45, 030003 (2021)), from memory.
inline constexpr double mass_H1 = 1.00782503223;
inline constexpr double mass_C12 = 12.0;
inline constexpr double mass_O16 = 15.99491461957;
inline constexpr double mass_Ar40 = 39.9623831237;

inline Atom atom(const char* symbol, double mass, double x, double y, double z) {
  Atom a;
  a.symbol = symbol;
  a.mass_amu = mass;
  a.position_angstrom = {x, y, z};
  return a;
}

inline Species argon() {
  Species s;
  s.name = "Ar";
  s.atoms = {atom("Ar", mass_Ar40, 0, 0, 0)};
  s.formula = {{"Ar", 1}};
  return s;
}

// H2O: r(OH) = 0.9572 Å, ∠HOH = 104.52° (Hoy & Bunker 1979 equilibrium structure, from
// memory); fundamentals 3657, 1595 cm^-1 (Shimanouchi, NSRDS-NBS 39, 1972) and
// 3756 cm^-1 (Huber & Herzberg 1979), as listed in shared/reference.md.
inline Species water() {
  Species s;
  s.name = "H2O";
  const double r = 0.9572, half = 104.52 / 2.0 * 3.14159265358979323846 / 180.0;
  s.atoms = {atom("O", mass_O16, 0, 0, 0), atom("H", mass_H1, 0, r * std::sin(half), r * std::cos(half)),
             atom("H", mass_H1, 0, -r * std::sin(half), r * std::cos(half))};
  s.formula = {{"H", 2}, {"O", 1}};
  s.frequencies_cm1 = {3657.0, 1595.0, 3756.0};
  s.symmetry_number = 2;
  s.enthalpy_of_formation_J_per_mol = -241.826e3;  // CODATA Key Values (Cox, Wagman & Medvedev 1989)
  return s;
}

// O2 X³Σg⁻: r_e = 1.20752 Å, ω_e = 1580.19 cm^-1 (Huber & Herzberg 1979, from memory);
// low-lying a¹Δg at 7918.1 cm^-1 (Huber & Herzberg 1979, from memory) left out here.
inline Species oxygen() {
  Species s;
  s.name = "O2";
  s.atoms = {atom("O", mass_O16, 0, 0, 0), atom("O", mass_O16, 0, 0, 1.20752)};
  s.formula = {{"O", 2}};
  s.frequencies_cm1 = {1580.19};
  s.symmetry_number = 2;
  s.electronic_levels = {{0.0, 3}};
  s.enthalpy_of_formation_J_per_mol = 0.0;  // element in its reference state (definition)
  return s;
}

// CO2: r(CO) = 1.1600 Å; ν1 1333, ν2 667 (×2), ν3 2349 cm^-1 (Shimanouchi 1972, from memory).
inline Species carbon_dioxide() {
  Species s;
  s.name = "CO2";
  s.atoms = {atom("O", mass_O16, 0, 0, -1.16), atom("C", mass_C12, 0, 0, 0), atom("O", mass_O16, 0, 0, 1.16)};
  s.formula = {{"C", 1}, {"O", 2}};
  s.frequencies_cm1 = {667.4, 667.4, 1333.0, 2349.0};
  s.symmetry_number = 2;
  return s;
}

}  // namespace vibtherm::test
