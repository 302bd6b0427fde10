// What every species reader shares: quoting of offending text in messages, the text-file
// check, element and isotope labels, formulas, and the checks that turn parsed atoms into
// a valid Species. Each format's reader (read_yaml, read_xyz, ...) parses; this builds.
#pragma once

#include <map>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "vibtherm/error.hpp"
#include "vibtherm/species.hpp"

namespace vibtherm {

// 'text' in single quotes for an error message: at most 40 characters (then "..."),
// control characters shown as '?', so a message stays one line.
std::string quote(std::string_view text);

// "a, b, c".
std::string join(const std::vector<std::string>& words);

// The 1-based line and column of the first NUL byte or invalid UTF-8 sequence, or {0, 0}.
std::pair<int, int> find_binary_content(const std::string& text);

// Fails at the first NUL byte or invalid UTF-8 sequence: species files are UTF-8 text.
void require_text(const std::string& text, const std::string& file_name);

// An element symbol or isotope label resolved to its element and isotope mass.
struct AtomLabel {
  std::string symbol;
  std::string isotope;  // the label when it names a specific isotope
  int mass_number = 0;
  double mass_amu = 0.0;
};

// Resolves "C", "D", "C13"..., or fails with a did-you-mean suggestion.
AtomLabel resolve_label(std::string_view label, const SourceLocation& where);

// An atom of that element and isotope at the origin; the reader sets the position.
Atom atom_of(const AtomLabel& label);

// Parses "CH4", "C2H5OH" into element counts; repeated elements add up.
std::map<std::string, int> parse_formula_text(std::string_view text, const SourceLocation& where);

// "CH4" from {C: 1, H: 4} (elements in alphabetical order).
std::string formula_text(const std::map<std::string, int>& formula);

// Element counts of a list of atoms (isotopes count as their element).
std::map<std::string, int> formula_of(const std::vector<Atom>& atoms);

// Atoms closer than this (Å) are a copy-and-paste slip, not a molecule.
constexpr double coincident_atoms_angstrom = 1e-3;

// Fails at the second of two atoms closer than coincident_atoms_angstrom; `where[i]`
// locates atom i.
void check_atoms_apart(const std::vector<Atom>& atoms, const std::vector<SourceLocation>& where);

// I = h / (8 π² c B): moment of inertia (amu Å²) from a rotational constant (cm^-1).
double moment_from_rotational_constant_amu_A2(double B_cm1);

}  // namespace vibtherm
