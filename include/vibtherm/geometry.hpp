// Rigid-body facts of a species: mass, centre of mass, inertia tensor, principal moments
// and axes, rotor type, rotational constants and temperatures, expected mode count.
#pragma once

#include <Eigen/Core>
#include <array>
#include <map>
#include <string>
#include <vector>

#include "vibtherm/species.hpp"

namespace vibtherm {

enum class RotorType { atom, linear, nonlinear };
const char* rotor_type_name(RotorType type);  // "atom", "linear", "nonlinear"

// A molecule is linear when its smallest principal moment is below this (amu Å²) and
// the other two agree to 1e-3 relative; an atom when all three are below it.
inline constexpr double default_linear_tolerance_amu_A2 = 1e-3;

struct RotorAnalysis {
  RotorType type = RotorType::atom;
  double mass_amu = 0.0;
  Eigen::Vector3d centre_of_mass_angstrom = Eigen::Vector3d::Zero();
  std::array<double, 3> moments_amu_A2{};                        // ascending
  Eigen::Matrix3d principal_axes = Eigen::Matrix3d::Identity();  // columns, same order
  // The moments that count for rotation: none (atom), one (linear), three (nonlinear).
  std::vector<double> rotational_moments_amu_A2;
  std::vector<double> rotational_constants_cm1;
  std::vector<double> rotational_constants_GHz;
  std::vector<double> rotational_temperatures_K;
};

double total_mass_amu(const Species& species);
Eigen::Matrix3d inertia_tensor_amu_A2(const std::vector<Atom>& atoms);  // about the centre of mass

// Throws InputError when `rotor_data` and atoms are both absent or inconsistent.
RotorAnalysis analyse_rotor(const Species& species,
                            double linear_tolerance_amu_A2 = default_linear_tolerance_amu_A2);

// Rotational constant B = h / (8 π² c I) in cm^-1 from a moment in amu Å².
double rotational_constant_cm1(double moment_amu_A2);

// Number of vibrational modes expected: 3N-6, 3N-5, 0 for gas; 3N for an adsorbate.
// For rotor data without atoms the atom count comes from the formula (-1 if unknown).
int expected_vibration_count(const Species& species, RotorType type);

int atom_count(const Species& species);  // from atoms or the formula

}  // namespace vibtherm
