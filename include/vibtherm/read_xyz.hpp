// The XYZ-plus-frequencies species reader: a standard XYZ block, key=value pairs on the
// comment line, and a frequency section.
#pragma once

#include <string>

#include "vibtherm/species.hpp"

namespace vibtherm {

// The XYZ-plus-frequencies format
// -------------------------------
// A standard XYZ block followed by a frequency section:
//
//     3
//     name=water symmetry_number=2 enthalpy_of_formation=-241.826
//     O   0.000000   0.000000   0.117300
//     H   0.000000   0.757200  -0.469200
//     H   0.000000  -0.757200  -0.469200
//     frequencies cm^-1
//     1594.7, 3657.1
//     3755.9
//
// - Line 1: the number of atoms N. Blank lines and `#` comment lines may precede it.
// - Line 2: the comment line. If it contains `=`, it is read as blank-separated
//   `key=value` pairs (values may be double-quoted to hold blanks: name="iso butane"):
//   name, symmetry_number, spin_multiplicity, enthalpy_of_formation (kJ/mol),
//   phase (gas|adsorbate), transition_state (true|false). Otherwise the line is free text
//   and ignored. Without `name=` the species is named after the file (stem).
// - N atom lines `Symbol x y z` in ångström; the symbol may be an isotope label (D, C13).
//   A `#` starts a comment to the end of any line after line 2.
// - Then a line `frequencies`, optionally followed by a wavenumber unit (cm^-1 is the
//   default; see wavenumber_units_list()), and the wavenumbers separated by blanks,
//   commas or line breaks, over any number of lines, negative meaning imaginary.
//   A single atom needs no frequency section.

// Reads a species from XYZ text; `file_name` is used for error locations and as the
// default name (its stem).
Species read_species_xyz(const std::string& text, const std::string& file_name);

}  // namespace vibtherm
