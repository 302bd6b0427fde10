// A computational method as a method file describes it (design.md section 4): the free
// atoms' energies, spin–orbit corrections, bond-additivity corrections and scale factors.
#pragma once

#include <map>
#include <string>

#include "vibtherm/error.hpp"
#include "vibtherm/species.hpp"

namespace vibtherm {

struct MethodAtom {
  SourceLocation where;
  double energy_J_per_mol = 0.0;      // electronic energy of the free atom, molar
  double spin_orbit_J_per_mol = 0.0;  // added to `energy` (negative: lowers the atom)
};

struct Method {
  std::string label;  // free text, echoed in notes and provenance
  SourceLocation origin;
  std::map<std::string, MethodAtom> elements;                // element symbol -> atom
  std::map<std::string, double> bond_corrections_J_per_mol;  // bond_type() key -> per bond
  std::map<std::string, SourceLocation> bond_correction_where;
  ScaleFactors scale;  // frequency scale factors; the species file's own take precedence
};

// Species scale factors completed by the method's: a factor the species file gives wins.
inline ScaleFactors merge_scale_factors(const ScaleFactors& species_file, const ScaleFactors& method) {
  ScaleFactors out = species_file;
  if (!out.zpe) out.zpe = method.zpe;
  if (!out.enthalpy) out.enthalpy = method.enthalpy;
  if (!out.entropy) out.entropy = method.entropy;
  return out;
}

}  // namespace vibtherm
