// Harmonic vibrational analysis of a Cartesian Hessian: mass-weighting, removal of the
// external motions (translations and rotations about the centre of mass) by projection, and
// diagonalisation to wavenumbers. Pure computation, no I/O.
#pragma once

#include <Eigen/Core>
#include <vector>

namespace vibtherm {

// Which rigid-body motions are not vibrations: none for an adsorbate (all 3N motions are
// vibrations), the 3 translations for a free atom, 3 translations + 2 rotations for a
// linear molecule, 3 + 3 for a nonlinear one.
enum class ExternalMotions { none, atom, linear, nonlinear };
int external_motion_count(ExternalMotions external);

// Harmonic wavenumbers in cm^-1, ascending, negative for an imaginary frequency (design.md
// section 3); 3N minus external_motion_count(external) of them.
// - hessian_J_per_m2: the 3N×3N Cartesian Hessian (second derivatives of the energy per
//   molecule, J/m² = N/m), coordinates ordered x1 y1 z1 x2 ...; it is symmetrised here.
// - masses_amu, positions_angstrom: one entry per atom (the positions locate the centre of
//   mass and the rotation axes of the projection).
// Throws InputError when the sizes do not agree or a mass is not positive.
std::vector<double> harmonic_wavenumbers_cm1(const Eigen::MatrixXd& hessian_J_per_m2,
                                             const std::vector<double>& masses_amu,
                                             const std::vector<Eigen::Vector3d>& positions_angstrom,
                                             ExternalMotions external);

}  // namespace vibtherm
