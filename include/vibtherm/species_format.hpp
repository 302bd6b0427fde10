// Which reader a species file needs: recognised from its content first (QCSchema JSON,
// Molden normal modes, XYZ, YAML), its extension second; other kinds refused in one line.
#pragma once

#include <string>
#include <string_view>

namespace vibtherm {

enum class SpeciesFormat { yaml, xyz, qcschema, molden };

// "YAML", "XYZ", "QCSchema JSON", "Molden".
std::string_view species_format_name(SpeciesFormat format);

// The rule, in order:
// 1. A JSON object (first character '{') is QCSchema; in a .yaml/.yml file only when it
//    holds "schema_name" (else it is a YAML flow map); so is anything in a .json file
//    starting with '[' (the QCSchema reader then says what is wrong).
// 2. A first line `[Molden Format]` (any case), or any first line `[...]` outside a
//    .yaml/.yml/.xyz file, is Molden.
// 3. A NASA polynomial file (a first line THERMO, or a line of 80 columns ending in 1) is
//    refused: it is read by `vibtherm eval`, not as a species.
// 4. The extension .yaml/.yml or .xyz decides.
// 5. Otherwise the first line that is neither blank nor a '#' comment: a whole number is
//    XYZ, `key:` is YAML.
// Anything else fails with one line naming what was seen and the formats accepted.
SpeciesFormat detect_species_format(std::string_view text, const std::string& path);

// "YAML (.yaml, .yml), XYZ with frequencies (.xyz), QCSchema JSON (.json) or Molden
// normal modes (.molden)", for messages.
std::string accepted_species_formats();

}  // namespace vibtherm
