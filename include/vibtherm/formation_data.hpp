// Reference data of the atomization route: the gaseous atoms' enthalpies of formation at
// 0 K and the elements' reference-state enthalpy increments H(298.15 K) − H(0), with sources.
#pragma once

#include <optional>
#include <span>
#include <string_view>

namespace vibtherm {

struct AtomFormationData {
  std::string_view symbol;
  double dfH0_atom_kJ_per_mol;           // ΔfH°(0 K) of the gaseous atom
  double dfH298_atom_kJ_per_mol;         // ΔfH°(298.15 K) of the gaseous atom (for checks)
  double H298_minus_H0_atom_kJ_per_mol;  // H°(298.15) − H°(0) of the gaseous atom
  // H°(298.15) − H°(0) of the element in its reference state, per atom (½ H2, C graphite, ...).
  double H298_minus_H0_element_kJ_per_mol;
  std::string_view reference_state;  // "H2(g)", "C(graphite)", ...
  std::string_view source;
};

// The table, H C N O F Si P S Cl Br (and more where a source was at hand).
std::span<const AtomFormationData> atom_formation_table();

// nullopt for an element without data.
std::optional<AtomFormationData> find_atom_formation_data(std::string_view symbol);

}  // namespace vibtherm
