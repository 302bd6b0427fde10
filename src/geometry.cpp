#include "vibtherm/geometry.hpp"

#include <fmt/format.h>

#include <Eigen/Eigenvalues>
#include <algorithm>
#include <cmath>

#include "vibtherm/constants.hpp"

namespace vibtherm {

namespace c = constants;

const char* rotor_type_name(RotorType type) {
  switch (type) {
    case RotorType::atom:
      return "atom";
    case RotorType::linear:
      return "linear";
    case RotorType::nonlinear:
      return "nonlinear";
  }
  return "unknown";
}

double total_mass_amu(const Species& species) {
  if (species.atoms.empty() && species.rotor_data) return species.rotor_data->mass_amu;
  double mass = 0.0;
  for (const auto& atom : species.atoms) mass += atom.mass_amu;
  return mass;
}

int atom_count(const Species& species) {
  if (!species.atoms.empty()) return static_cast<int>(species.atoms.size());
  if (species.formula.empty()) return -1;
  int n = 0;
  for (const auto& [symbol, count] : species.formula) n += count;
  return n;
}

Eigen::Matrix3d inertia_tensor_amu_A2(const std::vector<Atom>& atoms) {
  Eigen::Vector3d com = Eigen::Vector3d::Zero();
  double mass = 0.0;
  for (const auto& atom : atoms) {
    com += atom.mass_amu * atom.position_angstrom;
    mass += atom.mass_amu;
  }
  if (mass > 0.0) com /= mass;
  Eigen::Matrix3d inertia = Eigen::Matrix3d::Zero();
  for (const auto& atom : atoms) {
    const Eigen::Vector3d r = atom.position_angstrom - com;
    inertia += atom.mass_amu * (r.squaredNorm() * Eigen::Matrix3d::Identity() - r * r.transpose());
  }
  return inertia;
}

double rotational_constant_cm1(double moment_amu_A2) {
  // B = h / (8 π² c I), with c in cm/s so that B is in cm^-1.
  const double moment_kg_m2 = moment_amu_A2 * c::atomic_mass_constant_kg * c::angstrom_m * c::angstrom_m;
  return c::planck_J_s / (8.0 * c::pi * c::pi * c::speed_of_light_m_s * 100.0 * moment_kg_m2);
}

namespace {

RotorType classify(const std::array<double, 3>& moments, double tolerance) {
  if (moments[2] < tolerance) return RotorType::atom;
  if (moments[0] < tolerance) return RotorType::linear;
  return RotorType::nonlinear;
}

void fill_rotational_constants(RotorAnalysis& rotor) {
  for (double moment : rotor.rotational_moments_amu_A2) {
    const double b_cm1 = rotational_constant_cm1(moment);
    rotor.rotational_constants_cm1.push_back(b_cm1);
    rotor.rotational_constants_GHz.push_back(b_cm1 * c::speed_of_light_m_s * 100.0 * 1e-9);
    rotor.rotational_temperatures_K.push_back(b_cm1 * c::second_radiation_cm_K);
  }
}

}  // namespace

RotorAnalysis analyse_rotor(const Species& species, double linear_tolerance_amu_A2) {
  RotorAnalysis rotor;
  rotor.mass_amu = total_mass_amu(species);
  if (species.atoms.empty()) {
    if (!species.rotor_data)
      fail(species.origin, "species '" + species.name + "' has neither atoms nor rigid-rotor data");
    const auto& data = *species.rotor_data;
    std::vector<double> moments = data.moments_amu_A2;
    std::sort(moments.begin(), moments.end());
    if (moments.empty()) {
      rotor.type = RotorType::atom;
    } else if (data.linear) {
      if (moments.size() != 1 &&
          !(moments.size() == 2 && std::abs(moments[0] - moments[1]) <= 1e-6 * moments[1]))
        fail(species.origin, fmt::format("linear species '{}' needs one moment of inertia, got {}",
                                         species.name, moments.size()));
      rotor.type = RotorType::linear;
      rotor.moments_amu_A2 = {0.0, moments.back(), moments.back()};
      rotor.rotational_moments_amu_A2 = {moments.back()};
    } else {
      if (moments.size() != 3)
        fail(species.origin, fmt::format("nonlinear species '{}' needs three moments of inertia, got {}",
                                         species.name, moments.size()));
      rotor.type = RotorType::nonlinear;
      rotor.moments_amu_A2 = {moments[0], moments[1], moments[2]};
      rotor.rotational_moments_amu_A2 = moments;
    }
    fill_rotational_constants(rotor);
    return rotor;
  }

  Eigen::Vector3d com = Eigen::Vector3d::Zero();
  for (const auto& atom : species.atoms) com += atom.mass_amu * atom.position_angstrom;
  rotor.centre_of_mass_angstrom = com / rotor.mass_amu;
  const Eigen::SelfAdjointEigenSolver<Eigen::Matrix3d> solver(inertia_tensor_amu_A2(species.atoms));
  // Eigen returns eigenvalues in increasing order; round-off can make a zero slightly negative.
  for (int i = 0; i < 3; ++i) rotor.moments_amu_A2[i] = std::max(0.0, solver.eigenvalues()[i]);
  rotor.principal_axes = solver.eigenvectors();
  rotor.type = classify(rotor.moments_amu_A2, linear_tolerance_amu_A2);
  if (species.atoms.size() == 1) rotor.type = RotorType::atom;
  switch (rotor.type) {
    case RotorType::atom:
      break;
    case RotorType::linear:
      rotor.rotational_moments_amu_A2 = {rotor.moments_amu_A2[2]};
      break;
    case RotorType::nonlinear:
      rotor.rotational_moments_amu_A2.assign(rotor.moments_amu_A2.begin(), rotor.moments_amu_A2.end());
      break;
  }
  fill_rotational_constants(rotor);
  return rotor;
}

int expected_vibration_count(const Species& species, RotorType type) {
  const int n = atom_count(species);
  if (n < 0) return -1;
  if (species.phase == Phase::adsorbate) return 3 * n;
  switch (type) {
    case RotorType::atom:
      return 0;
    case RotorType::linear:
      return 3 * n - 5;
    case RotorType::nonlinear:
      return 3 * n - 6;
  }
  return -1;
}

}  // namespace vibtherm
