// The Molden normal-mode reader: the geometry and wavenumbers of a `[Molden Format]` file
// into a Species, near-zero external-motion entries dropped by a stated rule; every
// malformed input an InputError with its line and column.
#pragma once

#include <string>

#include "vibtherm/species.hpp"

namespace vibtherm {

// What is read
// ------------
// Sections start with a line `[NAME]` (any case); unknown sections (orbitals, basis set,
// convergence, ...) are skipped.
// - `[Molden Format]` must come first.
// - `[FR-COORD]`: `symbol x y z` per atom, in bohr: the geometry of the frequencies.
// - `[Atoms] AU` or `[Atoms] Angs`: `label index atomic-number x y z` per atom; the geometry
//   when there is no [FR-COORD] (with both, the atom counts and elements must agree).
// - `[FREQ]`: one wavenumber (cm^-1) per line, negative meaning imaginary.
// - `[FR-NORM-COORD]` (optional): a line `vibration K` then N lines of three displacements
//   per mode; checked for counts and numbers, not used (thermochemistry needs only the
//   wavenumbers). `[INT]` (optional): one intensity per mode (extra columns allowed); checked
//   the same way, not used.
// Masses are those of the most abundant isotopes (a species file's `isotopes` changes them).
//
// External motions. Some programs list all 3N entries, the 3 translations and 3 rotations
// (2 for a linear molecule: all atoms on one line within 1e-3 Å) at near zero. When [FREQ]
// has more than the 3N − 6 (3N − 5) vibrations, the surplus entries of smallest |wavenumber|
// are dropped, each of which must be below molden_external_mode_cm1 (else the file is
// refused: a real vibration would be lost); a note says how many were dropped. More than
// 3N entries are refused.
inline constexpr double molden_external_mode_cm1 = 50.0;

// Reads a species from Molden text; `file_name` is used for error locations and as the
// name (its stem). Without [FREQ] the file is refused unless `geometry_only` (a species
// file's `from:`, which then gives the frequencies).
Species read_species_molden(const std::string& text, const std::string& file_name,
                            bool geometry_only = false);

}  // namespace vibtherm
