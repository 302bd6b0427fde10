#include "vibtherm/geometry.hpp"

#include <doctest/doctest.h>

#include <Eigen/Geometry>

#include "test_species.hpp"

using namespace vibtherm;

TEST_CASE("rotor types and mode counts") {
  CHECK(analyse_rotor(test::argon()).type == RotorType::atom);
  CHECK(analyse_rotor(test::oxygen()).type == RotorType::linear);
  CHECK(analyse_rotor(test::carbon_dioxide()).type == RotorType::linear);
  CHECK(analyse_rotor(test::water()).type == RotorType::nonlinear);
  // 3N−5 / 3N−6 (common practice).
  CHECK(expected_vibration_count(test::carbon_dioxide(), RotorType::linear) == 4);
  CHECK(expected_vibration_count(test::water(), RotorType::nonlinear) == 3);
  auto surface = test::water();
  surface.phase = Phase::adsorbate;
  CHECK(expected_vibration_count(surface, RotorType::nonlinear) == 9);
}

TEST_CASE("water rotational constants") {
  // Ground-state A, B, C of H2O: 27.877, 14.512, 9.285 cm^-1 (Herzberg 1966, in shared/reference.md).
  // Ours come from the equilibrium structure; vibrational averaging (the inertial defect,
  // common practice) makes them differ by up to 3 %, most for C.
  const auto rotor = analyse_rotor(test::water());
  REQUIRE(rotor.rotational_constants_cm1.size() == 3);
  CHECK(rotor.rotational_constants_cm1[0] == doctest::Approx(27.877).epsilon(0.03));
  CHECK(rotor.rotational_constants_cm1[1] == doctest::Approx(14.512).epsilon(0.03));
  CHECK(rotor.rotational_constants_cm1[2] == doctest::Approx(9.285).epsilon(0.03));
  // GHz = cm^-1 × c (definition).
  CHECK(rotor.rotational_constants_GHz[0] == doctest::Approx(rotor.rotational_constants_cm1[0] * 29.9792458));
  // Planar molecule: I_c = I_a + I_b (perpendicular-axis theorem).
  CHECK(rotor.moments_amu_A2[2] == doctest::Approx(rotor.moments_amu_A2[0] + rotor.moments_amu_A2[1]));
}

TEST_CASE("moments are invariant under rotation, translation and atom order") {
  // Rigid-body invariance (common practice).
  const Species base = test::water();
  const auto reference = analyse_rotor(base);
  Species moved = base;
  const Eigen::Matrix3d rot =
      (Eigen::AngleAxisd(0.7, Eigen::Vector3d(1, 2, 3).normalized())).toRotationMatrix();
  for (auto& a : moved.atoms)
    a.position_angstrom = rot * a.position_angstrom + Eigen::Vector3d(5.0, -3.0, 11.0);
  std::swap(moved.atoms[0], moved.atoms[2]);
  const auto other = analyse_rotor(moved);
  for (int i = 0; i < 3; ++i)
    CHECK(other.moments_amu_A2[i] == doctest::Approx(reference.moments_amu_A2[i]).epsilon(1e-12));
}

TEST_CASE("rigid-rotor data instead of atoms") {
  Species s;
  s.name = "X";
  s.rotor_data = RigidRotorData{28.0, {8.7}, true};
  s.formula = {{"N", 2}};
  const auto rotor = analyse_rotor(s);
  CHECK(rotor.type == RotorType::linear);
  CHECK(rotor.rotational_moments_amu_A2.size() == 1);
  CHECK(expected_vibration_count(s, rotor.type) == 1);
  // B·I = h/(8π²c) = 16.8576 amu Å² cm^-1 (CODATA 2018 constants; common practice).
  CHECK(rotational_constant_cm1(8.7) * 8.7 == doctest::Approx(16.857629).epsilon(1e-6));
}
