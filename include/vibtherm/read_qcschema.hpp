// The QCSchema reader (MolSSI's open JSON schema for quantum-chemistry results): a Hessian
// result, or a molecule document, into a Species; every malformed input an InputError with
// its line and column.
#pragma once

#include <string>
#include <string_view>

#include "vibtherm/species.hpp"

namespace vibtherm {

// What is read
// ------------
// - `schema_name` `qcschema_output` or `qcschema_result` (also the older spelling
//   `qc_schema_output`): a result. `driver` `hessian` gives `return_result`, the 3N×3N
//   Cartesian Hessian in hartree/bohr², as a flat row-major list or a list of 3N rows
//   (symmetrised when within species_builder's hessian_symmetry_tolerance, refused
//   otherwise). `properties.return_energy` (hartree) becomes the electronic energy; `model`
//   `method` and `basis` are recorded as a note; `success: false` is refused.
// - `schema_name` `qcschema_molecule` (or a result's `molecule`): `symbols`, `geometry` (3N
//   numbers in bohr, flat or as N triples), optional `masses` (amu; each must be an isotope
//   mass within isotope_mass_tolerance_amu, which names the isotope), `mass_numbers`,
//   `molecular_charge`, `molecular_multiplicity`, `name` (else the file's stem); `real`
//   false (a ghost atom) is refused. Other keys are ignored.
// A result of driver `energy`, `gradient` or `properties`, and a molecule document, hold no
// vibrations: refused unless `geometry_only` (a species file's `from:`, which then gives the
// frequencies). The symmetry number is left at 1 (the species file's `symmetry_number`, or
// detection from the geometry, supplies it).

// Reads a species from QCSchema JSON text; `file_name` is used for error locations and as
// the default name (its stem).
Species read_species_qcschema(const std::string& text, const std::string& file_name,
                              bool geometry_only = false);

// True when the first character other than blanks (and a UTF-8 byte-order mark) is '{'.
bool looks_like_json(std::string_view text);

}  // namespace vibtherm
