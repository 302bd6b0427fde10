// Composition of a species from its atoms (or its `formula`): the formula string with
// isotope labels, the element counts of a NASA record and the molar mass. Every writer
// (inspect, report, fit JSON, NASA-7/9) takes formula and molar mass from here.
#pragma once

#include <string>
#include <vector>

#include "vibtherm/nasa.hpp"
#include "vibtherm/species.hpp"

namespace vibtherm {

// One element or isotope in a formula: every atom of `element` with this mass number.
struct FormulaPart {
  std::string element;  // element symbol ("H" for D)
  int mass_number = 0;  // 0: no label (standard atomic weight for the molar mass)
  int count = 0;
  std::string text() const;  // "H", "D", "T", or the label in brackets: "[C13]"
};

// Formula order (Hill system, extended to isotopes): with carbon, C then H, then the other
// elements alphabetically by symbol; without carbon, alphabetically throughout. Within one
// element the unlabelled atoms come first, then each isotope by ascending mass number
// (H, D, T; C, [C13], [C14]). From `atoms` when given (an atom with an isotope label counts
// as that isotope, with D and T for hydrogen-2 and -3), else from `formula`.
std::vector<FormulaPart> formula_parts(const Species& species);

// The formula string: each part's text followed by its count when above 1, e.g. "D2O",
// "CH3D", "[C13]H4". Empty when the species has neither atoms nor a formula. The surface
// site of an adsorbate is not part of it.
std::string species_formula(const Species& species);

// Element counts of a NASA-7/9 record, in formula order: D and T by their labels; other
// isotopes under their element (the record's symbol fields are two characters wide); an
// adsorbate's surface site counted once.
std::vector<ElementAmount> species_composition(const Species& species);

// Molar mass in g/mol: the isotope mass for each labelled atom, the standard atomic weight
// (IUPAC/CIAAW) for the others. 0 when the species has neither atoms nor a formula.
double species_molar_mass_g_per_mol(const Species& species);

// True when some atom carries an isotope label (the molar mass is then not the
// natural-abundance one).
bool has_isotope_labels(const Species& species);

}  // namespace vibtherm
