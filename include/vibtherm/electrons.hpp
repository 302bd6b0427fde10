// Electron count (Σ Z − charge) and the electronic ground state it allows: the default
// multiplicity from its parity, and the checks of a given multiplicity or level list.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "vibtherm/species.hpp"

namespace vibtherm {

// Σ Z over the atoms (or the formula) minus the charge; nullopt when the composition is unknown.
std::optional<int> electron_count(const Species& species);

struct ElectronicChoice {
  std::vector<ElectronicLevel> levels;  // the levels used
  std::vector<std::string> notes;
};

// Without `spin_multiplicity` and `electronic_levels` (species.electronic_levels empty):
// the lowest multiplicity the parity allows, 1 for an even and 2 for an odd electron count
// (said in a note). A `spin_multiplicity` (2S + 1, spin only) must have the other parity
// than the electron count and at most count + 1. Levels of `electronic_levels` may include
// orbital degeneracy (O2 a¹Δg has 2 with an even count), so only Kramers' theorem is
// checked there: with an odd count every level is an even-degenerate doublet at least.
// Adsorbates (bonded to a surface) take 1 and are not checked. Throws InputError at the key.
ElectronicChoice choose_electronic_levels(const Species& species);

}  // namespace vibtherm
