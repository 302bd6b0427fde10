// Point group of a geometry: the Schoenflies label, the order of its rotational subgroup
// (the external symmetry number σ) and chirality, found within a distance tolerance.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "vibtherm/species.hpp"

namespace vibtherm {

// An atom's image under a symmetry operation must lie within this distance of an atom of
// the same element and isotope (ångström). 0.01 Å accepts the ~1e-3 Å noise of optimised
// geometries and rejects real distortions, which move atoms by 0.05 Å or more.
inline constexpr double default_symmetry_tolerance_angstrom = 0.01;

struct PointGroup {
  // Schoenflies label in ASCII: "C1", "Cs", "Ci", "C2v", "D3h", "S4", "Td", "Oh", "Ih";
  // "Cinfv" and "Dinfh" for linear molecules, "Kh" for a single atom.
  std::string label;
  int order = 1;            // operations found (0 for the infinite groups of linear molecules and atoms)
  int symmetry_number = 1;  // order of the rotational subgroup: C∞v 1, D∞h 2, an atom 1
  bool chiral = false;      // no improper operation (no mirror plane, no inversion centre, no S2n)
};

// Finds every operation (orthogonal map about the centre of mass that sends each atom to an
// equivalent one within `tolerance_angstrom`, after a least-squares refinement) and names
// the group they form. Equivalent atoms share element and mass number. Needs at least one atom.
PointGroup detect_point_group(const std::vector<Atom>& atoms,
                              double tolerance_angstrom = default_symmetry_tolerance_angstrom);

// The symmetry number a species is computed with: the given one (a detected σ that disagrees
// is a warning), else the detected one (said in a note). Rotational-constant input has no
// geometry, so there `symmetry_number` is required (InputError). An adsorbate does not
// rotate: no detection, σ stays as given (or 1).
struct SymmetryChoice {
  std::optional<PointGroup> point_group;  // absent without a geometry and for adsorbates
  int symmetry_number = 1;
  std::vector<std::string> notes, warnings;
};
SymmetryChoice choose_symmetry_number(const Species& species, double tolerance_angstrom);

// "C∞v"-style label for people (text and HTML): subscripts stay plain, ∞ for "inf".
std::string point_group_display(const std::string& label);

}  // namespace vibtherm
