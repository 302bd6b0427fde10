// Normal-mode analysis of a Cartesian Hessian.
//
// Method (the standard harmonic normal-mode analysis; Wilson, Decius & Cross, Molecular
// Vibrations, McGraw-Hill 1955, ch. 2 and 4, from memory):
// 1. Mass-weight: F_ij = H_ij / sqrt(m_i m_j). The eigenvalues λ of F are the squared
//    angular frequencies ω² of the normal modes (SI: J/m² / kg = s^-2).
// 2. External motions: in mass-weighted coordinates the translation along axis α is
//    t_α(a) = sqrt(m_a) e_α, and the infinitesimal rotation about axis α through the centre
//    of mass is r_α(a) = sqrt(m_a) e_α × (x_a − x_com). About the centre of mass the two
//    sets are orthogonal; the Gram matrix of the rotations is the inertia tensor, so its
//    singular vectors are the rotations about the principal axes, and a linear molecule's
//    rotation about its own axis is the one with (near-)zero moment, which is left out.
//    The kept vectors, orthonormalised, span the external space E; the projector is
//    P = 1 − E Eᵀ.
// 3. Instead of diagonalising P F P and then guessing which of its near-zero eigenvalues
//    are the external ones (a soft torsion can be as small as the numerical noise), F is
//    written in an orthonormal basis D of the range of P (the complement of E, from a
//    Householder QR of E): the eigenvalues of Dᵀ F D are exactly the non-external
//    eigenvalues of P F P, and there are 3N − 6 (or 3N − 5, 3N − 3, 3N) of them.
// 4. ν̃ = sqrt(λ) / (2π c), in m^-1, divided by 100 for cm^-1 (ω = 2π c ν̃); λ < 0 gives
//    −sqrt(|λ|) / (2π c), the convention of design.md section 3 for imaginary modes.
// Constants (constants.hpp, CODATA 2018): atomic mass constant for amu → kg, c exact.
#include "vibtherm/hessian.hpp"

#include <fmt/format.h>

#include <Eigen/Eigenvalues>
#include <Eigen/QR>
#include <Eigen/SVD>
#include <cmath>

#include "vibtherm/constants.hpp"
#include "vibtherm/error.hpp"

namespace vibtherm {

namespace c = constants;

int external_motion_count(ExternalMotions external) {
  switch (external) {
    case ExternalMotions::none:
      return 0;
    case ExternalMotions::atom:
      return 3;
    case ExternalMotions::linear:
      return 5;
    case ExternalMotions::nonlinear:
      return 6;
  }
  return 0;
}

namespace {

// Orthonormal columns spanning the external motions in mass-weighted coordinates.
Eigen::MatrixXd external_basis(const std::vector<double>& masses_amu,
                               const std::vector<Eigen::Vector3d>& positions_angstrom,
                               ExternalMotions external) {
  const Eigen::Index atoms = static_cast<Eigen::Index>(masses_amu.size());
  const Eigen::Index n = 3 * atoms;
  const int rotations = external_motion_count(external) - 3;

  double total_mass = 0.0;
  Eigen::Vector3d com = Eigen::Vector3d::Zero();
  for (Eigen::Index a = 0; a < atoms; ++a) {
    total_mass += masses_amu[a];
    com += masses_amu[a] * positions_angstrom[a];
  }
  com /= total_mass;

  Eigen::MatrixXd basis(n, 3 + rotations);
  Eigen::MatrixXd rotation(n, 3);
  for (Eigen::Index a = 0; a < atoms; ++a) {
    const double root_m = std::sqrt(masses_amu[a]);
    const Eigen::Vector3d r = positions_angstrom[a] - com;
    for (int axis = 0; axis < 3; ++axis) {
      const Eigen::Vector3d e = Eigen::Vector3d::Unit(axis);
      for (int k = 0; k < 3; ++k) basis(3 * a + k, axis) = k == axis ? root_m : 0.0;
      rotation.block<3, 1>(3 * a, axis) = root_m * e.cross(r);
    }
  }
  // Translations are mutually orthogonal with norm sqrt(M).
  basis.leftCols(3) /= std::sqrt(total_mass);
  if (rotations > 0) {
    // Left singular vectors, by descending singular value sqrt(principal moment).
    Eigen::JacobiSVD<Eigen::MatrixXd> svd(rotation, Eigen::ComputeThinU);
    basis.rightCols(rotations) = svd.matrixU().leftCols(rotations);
  }
  return basis;
}

}  // namespace

std::vector<double> harmonic_wavenumbers_cm1(const Eigen::MatrixXd& hessian_J_per_m2,
                                             const std::vector<double>& masses_amu,
                                             const std::vector<Eigen::Vector3d>& positions_angstrom,
                                             ExternalMotions external) {
  const std::size_t atoms = masses_amu.size();
  const Eigen::Index n = static_cast<Eigen::Index>(3 * atoms);
  if (positions_angstrom.size() != atoms)
    fail({}, fmt::format("Hessian analysis: {} masses but {} positions, expected one of each per atom", atoms,
                         positions_angstrom.size()));
  if (hessian_J_per_m2.rows() != n || hessian_J_per_m2.cols() != n)
    fail({}, fmt::format("Hessian analysis: the Hessian is {}×{}, expected {}×{} for {} atoms",
                         hessian_J_per_m2.rows(), hessian_J_per_m2.cols(), n, n, atoms));
  for (double m : masses_amu)
    if (!(m > 0.0) || !std::isfinite(m))
      fail({}, fmt::format("Hessian analysis: atom mass {} amu, expected > 0", m));
  const int external_count = external_motion_count(external);
  if (external_count > n)
    fail({},
         fmt::format("Hessian analysis: {} external motions requested for {} atoms", external_count, atoms));

  Eigen::VectorXd inverse_root_mass(n);
  for (Eigen::Index i = 0; i < n; ++i)
    inverse_root_mass(i) =
        1.0 / std::sqrt(masses_amu[static_cast<std::size_t>(i / 3)] * c::atomic_mass_constant_kg);
  const Eigen::MatrixXd symmetric = 0.5 * (hessian_J_per_m2 + hessian_J_per_m2.transpose());
  const Eigen::MatrixXd weighted =
      inverse_root_mass.asDiagonal() * symmetric * inverse_root_mass.asDiagonal();

  Eigen::MatrixXd internal = weighted;
  if (external_count > 0) {
    const Eigen::MatrixXd E = external_basis(masses_amu, positions_angstrom, external);
    // The first columns of Q span E; the remaining n − k are an orthonormal basis of the
    // range of P = 1 − E Eᵀ.
    const Eigen::MatrixXd Q = Eigen::HouseholderQR<Eigen::MatrixXd>(E).householderQ();
    const Eigen::MatrixXd D = Q.rightCols(n - external_count);
    internal = D.transpose() * weighted * D;
  }

  Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> solver(internal, Eigen::EigenvaluesOnly);
  std::vector<double> out;
  out.reserve(static_cast<std::size_t>(internal.rows()));
  const double per_cm1 = 2.0 * c::pi * c::speed_of_light_m_s * 100.0;  // ω in s^-1 per cm^-1
  for (Eigen::Index i = 0; i < solver.eigenvalues().size(); ++i) {
    const double lambda = solver.eigenvalues()(i);  // ω², s^-2
    out.push_back(std::copysign(std::sqrt(std::abs(lambda)), lambda) / per_cm1);
  }
  return out;
}

}  // namespace vibtherm
