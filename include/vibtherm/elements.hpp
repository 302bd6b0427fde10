// Element data: symbols, most-abundant-isotope masses, selected other isotopes, and
// standard atomic weights. Isotope labels: "D" and "T" for hydrogen-2/-3, or the
// symbol followed by the mass number ("C13", "O18", "Cl37").
#pragma once

#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

namespace vibtherm {

struct ElementInfo {
  int atomic_number;
  std::string_view symbol;
  int mass_number;                // most abundant isotope
  double isotope_mass_amu;        // mass of that isotope
  double standard_atomic_weight;  // IUPAC/CIAAW conventional value
};

struct IsotopeChoice {
  std::string symbol;  // element symbol ("H" for "D")
  int mass_number;
  double mass_amu;
};

// The whole table, ordered by atomic number: H to Xe, then Pt, Au, Hg, Pb.
std::span<const ElementInfo> all_elements();

// Case-sensitive lookup ("Cl", not "CL"); nullopt when unknown.
std::optional<ElementInfo> find_element(std::string_view symbol);

// Resolves an isotope label ("D", "C13") or a plain symbol (most abundant isotope).
// nullopt when the element or the isotope is unknown.
std::optional<IsotopeChoice> find_isotope(std::string_view label);

std::optional<ElementInfo> find_element_by_number(int atomic_number);

// Labels accepted for an element ("C12", "C13", "C14"; "H1", "H2", "H3", "D", "T"),
// for error messages; empty for an unknown element.
std::vector<std::string> known_isotope_labels(std::string_view symbol);

// The closest known element symbol, for did-you-mean messages ("" if none is close).
std::string closest_element_symbol(std::string_view symbol);

}  // namespace vibtherm
