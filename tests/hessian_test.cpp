#include "vibtherm/hessian.hpp"

#include <doctest/doctest.h>

#include <Eigen/Geometry>
#include <algorithm>
#include <cmath>

#include "vibtherm/constants.hpp"
#include "vibtherm/elements.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/geometry.hpp"

using namespace vibtherm;
namespace c = vibtherm::constants;

namespace {

double mass_of(const char* label) { return find_isotope(label)->mass_amu; }

// ν̃ = sqrt(k/μ) / (2π c) of a harmonic diatomic (textbook identity, common practice), cm^-1.
double diatomic_wavenumber_cm1(double k_N_per_m, double m1_amu, double m2_amu) {
  const double mu_kg = m1_amu * m2_amu / (m1_amu + m2_amu) * c::atomic_mass_constant_kg;
  return std::sqrt(k_N_per_m / mu_kg) / (2.0 * c::pi * c::speed_of_light_m_s) / 100.0;
}

// Hessian of V = k/2 (r − r0)² at r = r0: k u uᵀ in the diagonal blocks and −k u uᵀ off
// them, u the bond direction (the second derivative of a harmonic bond, common practice).
Eigen::MatrixXd diatomic_hessian(double k_N_per_m, const Eigen::Vector3d& u) {
  const Eigen::Matrix3d block = k_N_per_m * u.normalized() * u.normalized().transpose();
  Eigen::MatrixXd h(6, 6);
  h << block, -block, -block, block;
  return h;
}

// A water-like model: the geometry of tests/data/water.yaml and a simple valence force
// field V = k_r/2 (Δr1² + Δr2²) + k_θ/2 Δθ². Both force constants are test parameters
// (magnitudes typical of an O-H bond and an H-O-H bend), not data.
constexpr double test_k_r_N_per_m = 845.0;
constexpr double test_k_theta_J_per_rad2 = 0.76e-18;

std::vector<Eigen::Vector3d> water_positions_angstrom() {
  return {{0.0, 0.0, 0.065569}, {0.0, 0.756950, -0.520313}, {0.0, -0.756950, -0.520313}};
}

double bend_angle(const std::vector<Eigen::Vector3d>& x) {
  const Eigen::Vector3d a = x[1] - x[0], b = x[2] - x[0];
  return std::atan2(a.cross(b).norm(), a.dot(b));
}

// Wilson B-matrix rows (∂q/∂x, x in metres) of the two O-H stretches and the bend
// (Wilson, Decius & Cross, Molecular Vibrations, 1955, ch. 4; from memory; the bend row
// is checked against a finite difference below).
Eigen::MatrixXd water_B(const std::vector<Eigen::Vector3d>& x_angstrom) {
  std::vector<Eigen::Vector3d> x;
  for (const auto& p : x_angstrom) x.push_back(p * c::angstrom_m);
  Eigen::MatrixXd B = Eigen::MatrixXd::Zero(3, 9);
  const Eigen::Vector3d d1 = x[1] - x[0], d2 = x[2] - x[0];
  const double r1 = d1.norm(), r2 = d2.norm();
  const Eigen::Vector3d e1 = d1 / r1, e2 = d2 / r2;
  B.block<1, 3>(0, 3) = e1.transpose();
  B.block<1, 3>(0, 0) = -e1.transpose();
  B.block<1, 3>(1, 6) = e2.transpose();
  B.block<1, 3>(1, 0) = -e2.transpose();
  const double cos_t = e1.dot(e2), sin_t = std::sqrt(1.0 - cos_t * cos_t);
  const Eigen::Vector3d s1 = (cos_t * e1 - e2) / (r1 * sin_t);
  const Eigen::Vector3d s2 = (cos_t * e2 - e1) / (r2 * sin_t);
  B.block<1, 3>(2, 3) = s1.transpose();
  B.block<1, 3>(2, 6) = s2.transpose();
  B.block<1, 3>(2, 0) = -(s1 + s2).transpose();
  return B;
}

// H = Bᵀ F B with F = diag(k_r, k_r, k_θ): the Cartesian Hessian of the valence force field
// at its minimum (Wilson, Decius & Cross 1955, ch. 4; from memory).
Eigen::MatrixXd water_hessian(const std::vector<Eigen::Vector3d>& x_angstrom) {
  const Eigen::MatrixXd B = water_B(x_angstrom);
  const Eigen::Vector3d F(test_k_r_N_per_m, test_k_r_N_per_m, test_k_theta_J_per_rad2);
  return B.transpose() * F.asDiagonal() * B;
}

double product(const std::vector<double>& v) {
  double p = 1.0;
  for (double x : v) p *= x;
  return p;
}

}  // namespace

TEST_CASE("harmonic diatomic: nu = sqrt(k/mu) / (2 pi c)") {
  const double k = 516.0;  // N/m, test parameter
  const double mH = mass_of("H"), mCl = mass_of("Cl");
  const std::vector<Eigen::Vector3d> x{{0.1, -0.2, 0.3}, {0.1, -0.2, 0.3 + 1.27}};
  const std::vector<double> nu =
      harmonic_wavenumbers_cm1(diatomic_hessian(k, {0, 0, 1}), {mH, mCl}, x, ExternalMotions::linear);
  REQUIRE(nu.size() == 1);
  CHECK(nu[0] == doctest::Approx(diatomic_wavenumber_cm1(k, mH, mCl)).epsilon(1e-10));

  SUBCASE("an adsorbate keeps all 3N motions: five are zero, one is the stretch") {
    const std::vector<double> all =
        harmonic_wavenumbers_cm1(diatomic_hessian(k, {0, 0, 1}), {mH, mCl}, x, ExternalMotions::none);
    REQUIRE(all.size() == 6);
    for (int i = 0; i < 5; ++i) CHECK(std::abs(all[i]) < 1e-3);
    CHECK(all[5] == doctest::Approx(nu[0]).epsilon(1e-10));
  }
  SUBCASE("isotope ratio sqrt(mu_H / mu_D) (textbook identity, common practice)") {
    const double mD = mass_of("D");
    const std::vector<double> nu_D =
        harmonic_wavenumbers_cm1(diatomic_hessian(k, {0, 0, 1}), {mD, mCl}, x, ExternalMotions::linear);
    const double mu_H = mH * mCl / (mH + mCl), mu_D = mD * mCl / (mD + mCl);
    CHECK(nu_D[0] / nu[0] == doctest::Approx(std::sqrt(mu_H / mu_D)).epsilon(1e-10));
  }
  SUBCASE("a negative force constant gives a negative (imaginary) wavenumber") {
    const std::vector<double> im =
        harmonic_wavenumbers_cm1(diatomic_hessian(-k, {0, 0, 1}), {mH, mCl}, x, ExternalMotions::linear);
    CHECK(im[0] == doctest::Approx(-nu[0]).epsilon(1e-10));
  }
}

TEST_CASE("the bend row of the B-matrix is the derivative of the angle") {
  const std::vector<Eigen::Vector3d> x = water_positions_angstrom();
  const Eigen::MatrixXd B = water_B(x);
  const double h = 1e-6;  // Å, central difference
  for (int i = 0; i < 9; ++i) {
    std::vector<Eigen::Vector3d> plus = x, minus = x;
    plus[i / 3](i % 3) += h;
    minus[i / 3](i % 3) -= h;
    const double derivative = (bend_angle(plus) - bend_angle(minus)) / (2 * h * c::angstrom_m);
    CHECK(B(2, i) == doctest::Approx(derivative).epsilon(1e-6).scale(1e9));
  }
}

TEST_CASE("water-like valence force field: 3 vibrations, 6 zero external modes") {
  const std::vector<Eigen::Vector3d> x = water_positions_angstrom();
  const std::vector<double> m{mass_of("O"), mass_of("H"), mass_of("H")};
  const Eigen::MatrixXd H = water_hessian(x);
  const std::vector<double> nu = harmonic_wavenumbers_cm1(H, m, x, ExternalMotions::nonlinear);
  REQUIRE(nu.size() == 3);
  CHECK(nu[0] > 1000.0);  // the bend; every mode is a real vibration
  CHECK(std::is_sorted(nu.begin(), nu.end()));

  // Without projection the force field's own invariance leaves six zeros, and the three
  // vibrations are those of the projected analysis.
  const std::vector<double> all = harmonic_wavenumbers_cm1(H, m, x, ExternalMotions::none);
  REQUIRE(all.size() == 9);
  std::vector<double> magnitudes;
  for (double v : all) magnitudes.push_back(std::abs(v));
  std::sort(magnitudes.begin(), magnitudes.end());
  for (int i = 0; i < 6; ++i) CHECK(magnitudes[i] < 0.01);
  for (int i = 0; i < 3; ++i) CHECK(magnitudes[6 + i] == doctest::Approx(nu[i]).epsilon(1e-9));
}

TEST_CASE("rotating and translating the molecule leaves the wavenumbers unchanged") {
  const std::vector<Eigen::Vector3d> x = water_positions_angstrom();
  const std::vector<double> m{mass_of("O"), mass_of("H"), mass_of("H")};
  const Eigen::MatrixXd H = water_hessian(x);
  const std::vector<double> nu = harmonic_wavenumbers_cm1(H, m, x, ExternalMotions::nonlinear);

  const Eigen::Matrix3d R = Eigen::AngleAxisd(0.7, Eigen::Vector3d(1, 2, 3).normalized()).toRotationMatrix();
  const Eigen::Vector3d shift(1.5, -2.0, 0.25);
  std::vector<Eigen::Vector3d> x_rotated;
  for (const auto& p : x) x_rotated.push_back(R * p + shift);
  Eigen::MatrixXd H_rotated(9, 9);
  for (int a = 0; a < 3; ++a)
    for (int b = 0; b < 3; ++b)
      H_rotated.block<3, 3>(3 * a, 3 * b) = R * H.block<3, 3>(3 * a, 3 * b) * R.transpose();
  const std::vector<double> nu_rotated =
      harmonic_wavenumbers_cm1(H_rotated, m, x_rotated, ExternalMotions::nonlinear);
  REQUIRE(nu_rotated.size() == 3);
  for (int i = 0; i < 3; ++i) CHECK(nu_rotated[i] == doctest::Approx(nu[i]).epsilon(1e-10));
  // And the force field built directly at the rotated geometry agrees too.
  const std::vector<double> nu_direct =
      harmonic_wavenumbers_cm1(water_hessian(x_rotated), m, x_rotated, ExternalMotions::nonlinear);
  for (int i = 0; i < 3; ++i) CHECK(nu_direct[i] == doctest::Approx(nu[i]).epsilon(1e-10));
}

TEST_CASE("D2O: isotope shift and the Teller-Redlich product rule") {
  const std::vector<Eigen::Vector3d> x = water_positions_angstrom();
  const Eigen::MatrixXd H = water_hessian(x);
  const std::vector<double> m_H{mass_of("O"), mass_of("H"), mass_of("H")};
  const std::vector<double> m_D{mass_of("O"), mass_of("D"), mass_of("D")};
  const std::vector<double> nu_H = harmonic_wavenumbers_cm1(H, m_H, x, ExternalMotions::nonlinear);
  const std::vector<double> nu_D = harmonic_wavenumbers_cm1(H, m_D, x, ExternalMotions::nonlinear);
  REQUIRE(nu_D.size() == 3);
  // Every mode moves mostly hydrogen: the ratio lies between 1/sqrt(2) (infinitely heavy
  // oxygen) and 1 (common practice).
  for (int i = 0; i < 3; ++i) {
    CHECK(nu_D[i] / nu_H[i] > 1.0 / std::sqrt(2.0));
    CHECK(nu_D[i] / nu_H[i] < 0.76);
  }

  // Teller-Redlich product rule for the complete set of vibrations of a nonlinear molecule
  // (Redlich, Z. phys. Chem. B 28, 371 (1935); Wilson, Decius & Cross 1955, the product rule; from
  // memory): ∏ ν'/ν = ∏_atoms (m/m')^{3/2} · (M'/M)^{3/2} · (I'x I'y I'z / Ix Iy Iz)^{1/2}.
  auto atoms_with = [&](const std::vector<double>& m) {
    std::vector<Atom> atoms(3);
    for (int a = 0; a < 3; ++a) {
      atoms[a].mass_amu = m[a];
      atoms[a].position_angstrom = x[a];
    }
    return atoms;
  };
  const double det_I_H = inertia_tensor_amu_A2(atoms_with(m_H)).determinant();
  const double det_I_D = inertia_tensor_amu_A2(atoms_with(m_D)).determinant();
  double expected = std::pow(m_H[1] / m_D[1], 3.0);  // two hydrogens, each (m/m')^{3/2}
  const double M_H = m_H[0] + m_H[1] + m_H[2], M_D = m_D[0] + m_D[1] + m_D[2];
  expected *= std::pow(M_D / M_H, 1.5) * std::sqrt(det_I_D / det_I_H);
  CHECK(product(nu_D) / product(nu_H) == doctest::Approx(expected).epsilon(1e-6));
}

TEST_CASE("sizes that do not agree are refused") {
  const std::vector<Eigen::Vector3d> x{{0, 0, 0}, {0, 0, 1}};
  CHECK_THROWS_AS(
      harmonic_wavenumbers_cm1(Eigen::MatrixXd::Zero(5, 5), {1.0, 1.0}, x, ExternalMotions::linear),
      InputError);
  CHECK_THROWS_AS(harmonic_wavenumbers_cm1(Eigen::MatrixXd::Zero(6, 6), {1.0}, x, ExternalMotions::linear),
                  InputError);
  CHECK_THROWS_AS(
      harmonic_wavenumbers_cm1(Eigen::MatrixXd::Zero(6, 6), {1.0, 0.0}, x, ExternalMotions::linear),
      InputError);
  CHECK(external_motion_count(ExternalMotions::none) == 0);
  CHECK(external_motion_count(ExternalMotions::atom) == 3);
  CHECK(external_motion_count(ExternalMotions::linear) == 5);
  CHECK(external_motion_count(ExternalMotions::nonlinear) == 6);
}
