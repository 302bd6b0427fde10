// Element data: symbols, most-abundant-isotope masses, selected other isotopes, and
// standard atomic weights. Isotope labels: "D" and "T" for hydrogen-2/-3, or the
// symbol followed by the mass number ("C13", "O18", "Cl37").
#pragma once

#include <optional>
#include <string>
#include <string_view>

namespace vibtherm {

struct ElementInfo {
  int atomic_number;
  std::string_view symbol;
  int mass_number;               // most abundant isotope
  double isotope_mass_amu;       // mass of that isotope
  double standard_atomic_weight; // IUPAC/CIAAW conventional value
};

struct IsotopeChoice {
  std::string symbol;  // element symbol ("H" for "D")
  int mass_number;
  double mass_amu;
};

// Case-sensitive lookup ("Cl", not "CL"); nullopt when unknown.
std::optional<ElementInfo> find_element(std::string_view symbol);

// Resolves an isotope label ("D", "C13") or a plain symbol (most abundant isotope).
// nullopt when the element or the isotope is unknown.
std::optional<IsotopeChoice> find_isotope(std::string_view label);

// The closest known element symbol, for did-you-mean messages ("" if none is close).
std::string closest_element_symbol(std::string_view symbol);

}  // namespace vibtherm
