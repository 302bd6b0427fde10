// What every accepted species must satisfy, shared by the species-reader fuzz targets:
// whatever a reader accepts must be usable without further checks of its form.
#pragma once
#include <cmath>

#include "vibtherm/species.hpp"

namespace vibtherm::fuzz {

inline void check_species(const Species& s) {
  if (s.name.empty()) __builtin_trap();
  if (s.atoms.empty() && !s.rotor_data) __builtin_trap();
  // The symmetry number and the electronic levels may both be absent: the pipeline fills them
  // from the point group and the electron count.
  if (s.symmetry_number && *s.symmetry_number < 1) __builtin_trap();
  for (const ElectronicLevel& level : s.electronic_levels)
    if (level.degeneracy < 1 || !(level.energy_cm1 >= 0.0)) __builtin_trap();
  for (const Atom& a : s.atoms)
    if (!(a.mass_amu > 0.0) || !a.position_angstrom.allFinite()) __builtin_trap();
  for (double nu : s.frequencies_cm1)
    if (nu == 0.0 || !std::isfinite(nu)) __builtin_trap();
}

}  // namespace vibtherm::fuzz
