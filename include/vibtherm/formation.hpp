// Enthalpies of formation from computed energies by the atomization route:
// ΔfH°(0 K) = Σ ΔfH°(0 K, atoms) − D0, then ΔfH°(298.15 K) with the thermal enthalpies.
#pragma once

#include <map>
#include <string>
#include <vector>

#include "vibtherm/method.hpp"
#include "vibtherm/thermo.hpp"

namespace vibtherm {

struct FormationEnthalpy {
  double dfH0_J_per_mol = 0.0;             // ΔfH°(0 K)
  double dfH298_J_per_mol = 0.0;           // ΔfH°(298.15 K)
  double D0_J_per_mol = 0.0;               // atomization energy at 0 K (ZPE included)
  double bond_correction_J_per_mol = 0.0;  // Σ bond-additivity corrections (in both values)
  std::string route;                       // "atomization with method LABEL", for notes and provenance
  std::vector<std::string> notes;          // e.g. bond types without a correction
};

// The identities of the route, given D0: ΔfH°(0) = Σ n_X ΔfH°(0, X) − D0 and
// ΔfH°(298.15) = ΔfH°(0) + [H298 − H0](species) − Σ n_X [H298 − H0](X, reference state)
// (e.g. Curtiss et al., J. Chem. Phys. 106, 1063 (1997), eqs. 4–7). Throws InputError at
// `where` for an element without data in formation_data.hpp.
FormationEnthalpy formation_from_atomization_energy(const std::map<std::string, int>& formula,
                                                    double D0_J_per_mol, double H298_minus_H0_J_per_mol,
                                                    const SourceLocation& where);

// The route for a prepared species: D0 = Σ (E_atom + spin–orbit) − E_el − ZPE with the
// method's atoms, plus the method's bond corrections for the species' bonds (bonds.hpp).
// Throws InputError naming the species without `electronic_energy`, or the element the
// method lacks.
FormationEnthalpy atomization_formation_enthalpy(const PreparedSpecies& prepared, const Method& method);

// Prepares a species under a method (nullptr: none): the method's scale factors complete
// the species file's own, then, when the species has `electronic_energy`, ΔfH° by the
// atomization route. A given `enthalpy_of_formation` wins and the computed value is stated
// beside it in a note; else the computed value becomes the species' ΔfH° and
// `enthalpy_of_formation_route` records the route.
PreparedSpecies prepare_with_method(const Species& species, const ModelOptions& options,
                                    const Method* method);

// Applies a ΔfH°(298.15 K) from the reaction route (`route` e.g. "reaction set r1, r2 (mean
// of 2 ...)"): a given `enthalpy_of_formation` wins (the reaction value is noted beside it);
// otherwise it replaces an atomization value (noted) or fills the missing one.
void apply_reaction_formation(PreparedSpecies& prepared, double dfH298_J_per_mol, const std::string& route);

}  // namespace vibtherm
