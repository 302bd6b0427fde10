// What every species reader shares: quoting of offending text in messages, the text-file
// check, element and isotope labels, formulas, and the checks that turn parsed atoms into
// a valid Species. Each format's reader (read_yaml, read_xyz, ...) parses; this builds.
#pragma once

#include <cstddef>
#include <map>
#include <optional>
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

// The isotope of `symbol` (an element symbol) whose mass is within
// isotope_mass_tolerance_amu of `mass_amu`, labelled as a species file would write it (the
// plain symbol for the most abundant isotope, D and T for hydrogen); nullopt when none is.
// Readers of files that give masses (QCSchema) use it, so average atomic weights are refused.
constexpr double isotope_mass_tolerance_amu = 5e-5;
std::optional<AtomLabel> isotope_with_mass(std::string_view symbol, double mass_amu);

// A full Cartesian Hessian may differ from its transpose by this much, relative to its
// largest element, and is then symmetrised: finite-difference Hessians and values printed to
// five or six significant digits are slightly asymmetric, while a misordered or transposed
// block is asymmetric at the size of the elements themselves.
constexpr double hessian_symmetry_tolerance = 1e-4;

// The first element (row, column), row > column, of the n×n row-major `full` that differs
// from its mirror by more than hessian_symmetry_tolerance × the largest |element|; nullopt
// when there is none.
std::optional<std::pair<std::size_t, std::size_t>> hessian_asymmetry(const std::vector<double>& full,
                                                                     std::size_t n);

// (H + Hᵀ)/2 × factor, row-major.
std::vector<double> symmetrised_hessian(const std::vector<double>& full, std::size_t n, double factor);

// The full n×n row-major matrix of a lower triangle given row by row (H11, H21, H22, ...),
// times factor.
std::vector<double> hessian_from_lower_triangle(const std::vector<double>& triangle, std::size_t n,
                                                double factor);

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
