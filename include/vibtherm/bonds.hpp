// Bonds of a structure for bond-additivity corrections: perceived from interatomic
// distances with covalent radii (Cordero et al., Dalton Trans. 2008, 2832), or as given.
#pragma once

#include <array>
#include <map>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "vibtherm/species.hpp"

namespace vibtherm {

// Two atoms are bonded when their distance is at most this factor times the sum of their
// covalent radii (common practice; 1.2 keeps C–H 1.09, C–C 1.54 and S–S 2.05 Å bonds and
// excludes the 1,3 contacts of ordinary molecules).
inline constexpr double bond_length_factor = 1.2;

// Covalent radius in ångström (Cordero et al. 2008, Table 2; C sp3), nullopt if not tabulated.
std::optional<double> covalent_radius_angstrom(std::string_view symbol);

// The bond type key of two elements: the symbols in alphabetical order joined by '-'
// ("C-H", "H-O"), so that "O-H" and "H-O" name the same correction.
std::string bond_type(std::string_view a, std::string_view b);

// The bonds of a species: `species.bonds` when given, else perceived from the atoms.
// Throws InputError (at the species file) for an element without a covalent radius.
std::vector<std::array<int, 2>> species_bonds(const Species& species);

// bond_type() -> number of such bonds.
std::map<std::string, int> count_bond_types(const Species& species,
                                            const std::vector<std::array<int, 2>>& bonds);

}  // namespace vibtherm
