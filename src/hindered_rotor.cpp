#include "vibtherm/hindered_rotor.hpp"

#include <fmt/format.h>

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <complex>
#include <numeric>
#include <string_view>

#include "vibtherm/constants.hpp"
#include "vibtherm/limits.hpp"

namespace vibtherm {

namespace c = constants;

namespace {

// Single-bond covalent radii in ångström, Cordero et al., Dalton Trans. 2008, 2832 (from
// memory; carbon sp3). Only the elements of common organic torsions.
double covalent_radius_A(std::string_view symbol) {
  struct Radius {
    std::string_view symbol;
    double r;
  };
  static constexpr Radius table[] = {{"H", 0.31},  {"B", 0.84},  {"C", 0.76},  {"N", 0.71}, {"O", 0.66},
                                     {"F", 0.57},  {"Si", 1.11}, {"P", 1.07},  {"S", 1.05}, {"Cl", 1.02},
                                     {"Br", 1.20}, {"I", 1.39},  {"Se", 1.20}, {"Ge", 1.20}};
  for (const Radius& r : table)
    if (r.symbol == symbol) return r.r;
  return -1.0;
}

}  // namespace

std::vector<int> top_by_connectivity(const std::vector<Atom>& atoms, int atom_a, int atom_b,
                                     const SourceLocation& where) {
  const int n = static_cast<int>(atoms.size());
  std::vector<double> radius;
  for (const Atom& a : atoms) {
    const double r = covalent_radius_A(a.symbol);
    if (r < 0.0)
      fail(where, fmt::format("no covalent radius for element {} to split the molecule at the rotor bond, "
                              "expected a 'top' list of the atoms on one side",
                              a.symbol));
    radius.push_back(r);
  }
  std::vector<int> seen(static_cast<std::size_t>(n), 0);
  std::vector<int> stack{atom_a};
  seen[static_cast<std::size_t>(atom_a)] = 1;
  while (!stack.empty()) {
    const int i = stack.back();
    stack.pop_back();
    for (int j = 0; j < n; ++j) {
      if (seen[static_cast<std::size_t>(j)] || (i == atom_a && j == atom_b)) continue;
      const auto ui = static_cast<std::size_t>(i), uj = static_cast<std::size_t>(j);
      const double d = (atoms[ui].position_angstrom - atoms[uj].position_angstrom).norm();
      if (d < 1.25 * (radius[ui] + radius[uj])) {
        seen[uj] = 1;
        stack.push_back(j);
      }
    }
  }
  if (seen[static_cast<std::size_t>(atom_b)])
    fail(where, fmt::format("atoms {} and {} stay connected when their bond is cut (a ring), expected a "
                            "bond whose cut splits the molecule in two, or a 'top' list",
                            atom_a + 1, atom_b + 1));
  std::vector<int> top;
  for (int i = 0; i < n; ++i)
    if (seen[static_cast<std::size_t>(i)]) top.push_back(i);
  return top;
}

double reduced_moment_amu_A2(const std::vector<Atom>& atoms, int atom_a, int atom_b,
                             const std::vector<int>& top_a) {
  const Eigen::Vector3d origin = atoms[static_cast<std::size_t>(atom_a)].position_angstrom;
  const Eigen::Vector3d axis =
      (atoms[static_cast<std::size_t>(atom_b)].position_angstrom - origin).normalized();
  double I_A = 0.0, I_B = 0.0;
  for (std::size_t i = 0; i < atoms.size(); ++i) {
    const Eigen::Vector3d r = atoms[i].position_angstrom - origin;
    const double d2 = (r - r.dot(axis) * axis).squaredNorm();  // squared distance from the axis
    const bool in_a = std::find(top_a.begin(), top_a.end(), static_cast<int>(i)) != top_a.end();
    (in_a ? I_A : I_B) += atoms[i].mass_amu * d2;
  }
  if (!(I_A > 0.0) || !(I_B > 0.0)) return 0.0;
  return I_A * I_B / (I_A + I_B);
}

double coupled_reduced_moment_amu_A2(const std::vector<Atom>& atoms, int atom_a, int atom_b,
                                     const std::vector<int>& top_a) {
  const Eigen::Vector3d origin = atoms[static_cast<std::size_t>(atom_a)].position_angstrom;
  const Eigen::Vector3d axis =
      (atoms[static_cast<std::size_t>(atom_b)].position_angstrom - origin).normalized();
  double M = 0.0;
  Eigen::Vector3d centre = Eigen::Vector3d::Zero();
  for (const Atom& a : atoms) {
    M += a.mass_amu;
    centre += a.mass_amu * a.position_angstrom;
  }
  centre /= M;
  Eigen::Matrix3d inertia = Eigen::Matrix3d::Zero();
  for (const Atom& a : atoms) {
    const Eigen::Vector3d r = a.position_angstrom - centre;
    inertia += a.mass_amu * (r.squaredNorm() * Eigen::Matrix3d::Identity() - r * r.transpose());
  }
  double A = 0.0;
  Eigen::Vector3d momentum = Eigen::Vector3d::Zero(), angular = Eigen::Vector3d::Zero();
  for (int i : top_a) {
    const Atom& a = atoms[static_cast<std::size_t>(i)];
    const Eigen::Vector3d u = axis.cross(a.position_angstrom - origin);  // velocity per unit dφ/dt
    A += a.mass_amu * u.squaredNorm();
    momentum += a.mass_amu * u;
    angular += a.mass_amu * (a.position_angstrom - centre).cross(u);
  }
  // Lᵀ I⁻¹ L over the principal axes; a vanishing principal moment (a linear frame) carries
  // no rotation to couple to.
  const Eigen::SelfAdjointEigenSolver<Eigen::Matrix3d> principal(inertia);
  const double largest = principal.eigenvalues().maxCoeff();
  double coupling = 0.0;
  for (int k = 0; k < 3; ++k)
    if (principal.eigenvalues()(k) > 1e-10 * largest)
      coupling += std::pow(principal.eigenvectors().col(k).dot(angular), 2) / principal.eigenvalues()(k);
  const double I_red = A - momentum.squaredNorm() / M - coupling;
  return I_red > 1e-12 * A ? I_red : 0.0;
}

namespace {

int potential_period(const TorsionPotential& v) {
  int g = 0;
  for (std::size_t k = 1; k < v.cos_J_per_mol.size(); ++k)
    if (v.cos_J_per_mol[k] != 0.0 || v.sin_J_per_mol[k] != 0.0) g = std::gcd(g, static_cast<int>(k));
  return g == 0 ? 1 : g;
}

}  // namespace

namespace {

double rotational_constant_J_per_mol(double reduced_moment_amu_A2) {
  const double I_kg_m2 = reduced_moment_amu_A2 * c::atomic_mass_constant_kg * c::angstrom_m * c::angstrom_m;
  const double hbar = c::planck_J_s / (2.0 * c::pi);
  return hbar * hbar / (2.0 * I_kg_m2) * c::avogadro_per_mol;
}

// Several cosine terms or any sine term: the blocks need a dense solver.
bool needs_dense_solver(const TorsionPotential& v) {
  int cosine_terms = 0;
  for (std::size_t k = 1; k < v.cos_J_per_mol.size(); ++k) {
    if (v.sin_J_per_mol[k] != 0.0) return true;
    cosine_terms += v.cos_J_per_mol[k] != 0.0 ? 1 : 0;
  }
  return cosine_terms > 1;
}

// Weight of the highest level relative to the level sum at T (levels from the ground, 0).
double top_level_weight(const std::vector<double>& energies_J_per_mol, double T_K) {
  const double RT = c::gas_constant_J_per_mol_K * T_K;
  double q = 0.0;
  for (double e : energies_J_per_mol) q += std::exp(-e / RT);
  return std::exp(-energies_J_per_mol.back() / RT) / q;
}

}  // namespace

TorsionLevels torsion_levels(double reduced_moment_amu_A2, const TorsionPotential& potential,
                             double max_temperature_K, const SourceLocation& where, std::string_view rotor) {
  const double B = rotational_constant_J_per_mol(reduced_moment_amu_A2);
  double v_max = potential.value_J_per_mol(0.0);
  for (int i = 1; i < 7200; ++i) v_max = std::max(v_max, potential.value_J_per_mol(2.0 * c::pi * i / 7200.0));
  const double range = v_max - potential.minimum_J_per_mol();
  const double RT = c::gas_constant_J_per_mol_K * max_temperature_K;
  // First guess: free-rotor levels B m² reach the potential's range plus 40 RT_max; the
  // check after diagonalising decides. Clamped as a double: no overflow converting to int.
  const double wanted = std::ceil(std::sqrt((range + 40.0 * RT) / B));
  int M = static_cast<int>(std::clamp(std::isfinite(wanted) ? wanted : double(max_rotor_basis_m), 20.0,
                                      double(max_rotor_basis_m)));
  // With a dense solver the cap is on the block size, (2M + 1)/g functions.
  const int g = potential_period(potential);
  const int cap = needs_dense_solver(potential)
                      ? std::min(max_rotor_basis_m, (max_rotor_dense_block * g - 1) / 2)
                      : max_rotor_basis_m;
  // A first estimate beyond twice the cap cannot converge within it: no diagonalisation
  // (a heavy top's blocks are the slowest to diagonalise).
  const bool hopeless = !(wanted <= 2.0 * cap);
  M = std::min(M, cap);
  for (;;) {
    if (!hopeless) {
      TorsionLevels levels = torsion_levels_in_basis(reduced_moment_amu_A2, potential, M);
      levels.max_temperature_K = max_temperature_K;
      if (top_level_weight(levels.energies_J_per_mol, max_temperature_K) < rotor_top_level_weight)
        return levels;
    }
    if (hopeless || M >= cap)
      fail(where, fmt::format("{}: the level sum at {:g} K is not converged in the largest basis |m| <= {} "
                              "(reduced moment {:g} amu A^2), expected a lower highest temperature or a "
                              "lighter top",
                              rotor, max_temperature_K, cap, reduced_moment_amu_A2));
    M = std::min(cap, M + M / 2);
  }
}

TorsionLevels torsion_levels_in_basis(double reduced_moment_amu_A2, const TorsionPotential& potential,
                                      int basis_max_m) {
  const double B_J_per_mol = rotational_constant_J_per_mol(reduced_moment_amu_A2);
  const int K = static_cast<int>(potential.cos_J_per_mol.size()) - 1;
  // V couples m only to m ± k with k a multiple of the potential's period g, so the
  // basis splits into g independent blocks of m ≡ r (mod g); within a block (m = r + g j)
  // the matrix is banded, bandwidth K/g.
  const int g = potential_period(potential);
  const int band = K / g;
  bool has_sine = false;
  int cosine_terms = 0;
  for (int k = 1; k <= K; ++k) {
    const auto uk = static_cast<std::size_t>(k);
    has_sine = has_sine || potential.sin_J_per_mol[uk] != 0.0;
    cosine_terms += potential.cos_J_per_mol[uk] != 0.0 ? 1 : 0;
  }
  std::vector<std::vector<double>> blocks(static_cast<std::size_t>(g));
  for (int r = 0; r < g; ++r) {
    std::vector<double>& out = blocks[static_cast<std::size_t>(r)];
    // An even potential (no sine) commutes with m → −m, which maps block r onto block
    // g − r: their levels are equal, so the second is copied.
    if (!has_sine && r > g - r) {
      out = blocks[static_cast<std::size_t>(g - r)];
      continue;
    }
    std::vector<int> ms;
    for (int m = -basis_max_m; m <= basis_max_m; ++m)
      if (((m % g) + g) % g == r) ms.push_back(m);
    const Eigen::Index n = static_cast<Eigen::Index>(ms.size());
    if (n == 0) continue;
    if ((has_sine || cosine_terms > 1) && n > max_rotor_dense_block)
      fail({}, fmt::format("a block of {} basis functions exceeds the dense solver's {}", n,
                           max_rotor_dense_block));
    const auto diagonal = [&](Eigen::Index i) {
      const double m = ms[static_cast<std::size_t>(i)];
      return B_J_per_mol * m * m + potential.cos_J_per_mol[0];
    };
    if (!has_sine && cosine_terms <= 1) {
      // One cosine term (k = g): <m|V|m ± g> = cos_g / 2, a real tridiagonal block.
      Eigen::VectorXd d(n);
      Eigen::VectorXd e = Eigen::VectorXd::Constant(
          std::max<Eigen::Index>(n - 1, 0), 0.5 * potential.cos_J_per_mol[static_cast<std::size_t>(g)]);
      for (Eigen::Index i = 0; i < n; ++i) d(i) = diagonal(i);
      if (n == 1) {
        out.push_back(d(0));
        continue;
      }
      Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> solver;
      solver.computeFromTridiagonal(d, e, Eigen::EigenvaluesOnly);
      for (Eigen::Index i = 0; i < n; ++i) out.push_back(solver.eigenvalues()(i));
    } else if (!has_sine) {
      // Several cosine terms: real symmetric (cos kφ = (e^{ikφ} + e^{−ikφ})/2).
      Eigen::MatrixXd H = Eigen::MatrixXd::Zero(n, n);
      for (Eigen::Index i = 0; i < n; ++i) {
        H(i, i) = diagonal(i);
        for (Eigen::Index j = std::max<Eigen::Index>(0, i - band); j < std::min(n, i + band + 1); ++j)
          if (j != i) H(i, j) = 0.5 * potential.cos_J_per_mol[static_cast<std::size_t>(std::abs(i - j) * g)];
      }
      Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> solver(H, Eigen::EigenvaluesOnly);
      for (Eigen::Index i = 0; i < n; ++i) out.push_back(solver.eigenvalues()(i));
    } else {
      // Sine terms: complex Hermitian, sin kφ = (e^{ikφ} − e^{−ikφ})/(2i).
      Eigen::MatrixXcd H = Eigen::MatrixXcd::Zero(n, n);
      for (Eigen::Index i = 0; i < n; ++i) {
        H(i, i) = diagonal(i);
        for (Eigen::Index j = std::max<Eigen::Index>(0, i - band); j < std::min(n, i + band + 1); ++j) {
          const int k = ms[static_cast<std::size_t>(i)] - ms[static_cast<std::size_t>(j)];  // <m_i|V|m_j>
          if (k == 0) continue;
          const auto uk = static_cast<std::size_t>(std::abs(k));
          const double sign = k > 0 ? 1.0 : -1.0;
          H(i, j) = std::complex<double>(0.5 * potential.cos_J_per_mol[uk],
                                         -0.5 * sign * potential.sin_J_per_mol[uk]);
        }
      }
      Eigen::SelfAdjointEigenSolver<Eigen::MatrixXcd> solver(H, Eigen::EigenvaluesOnly);
      for (Eigen::Index i = 0; i < n; ++i) out.push_back(solver.eigenvalues()(i));
    }
  }
  std::vector<double> all;
  for (const std::vector<double>& b : blocks) all.insert(all.end(), b.begin(), b.end());
  std::sort(all.begin(), all.end());
  TorsionLevels out;
  out.basis_max_m = basis_max_m;
  out.zero_point_energy_J_per_mol = all.front() - potential.minimum_J_per_mol();
  for (double e : all) out.energies_J_per_mol.push_back(e - all.front());
  return out;
}

MotionTerms hindered_rotor_terms(const TorsionLevels& levels, int symmetry, double T_K) {
  // Above the temperature the basis was converged for, the truncated level sum would be
  // silently wrong (1e-9 of slack for a T_max that went through a text round trip).
  if (T_K > levels.max_temperature_K * (1.0 + 1e-9))
    fail({}, fmt::format("hindered rotor levels are converged up to {:g} K, asked at {:g} K, expected the "
                         "run's highest temperature to size the basis (ModelOptions::max_temperature_K)",
                         levels.max_temperature_K, T_K));
  const double RT = c::gas_constant_J_per_mol_K * T_K;
  // Levels are counted from the ground level (0), so every weight is ≤ 1: no overflow.
  double q = 0.0, e1 = 0.0, e2 = 0.0;
  for (double e : levels.energies_J_per_mol) {
    const double x = e / RT;
    const double w = std::exp(-x);
    q += w;
    e1 += w * x;
    e2 += w * x * x;
  }
  MotionTerms t;
  const double mean = e1 / q;
  t.ln_q = std::log(q) - std::log(static_cast<double>(symmetry));
  t.U_over_RT = mean;
  t.H_over_RT = mean;
  t.Cv_over_R = e2 / q - mean * mean;
  t.Cp_over_R = t.Cv_over_R;
  t.S_over_R = t.ln_q + mean;
  return t;
}

HinderedRotorModel build_hindered_rotor(const Species& species, const HinderedRotor& rotor,
                                        double max_temperature_K) {
  HinderedRotorModel m;
  m.input = rotor;
  // Checked here too for species built in code: a period above the basis' block count
  // leaves empty blocks, and a huge one exhausts memory in the potential's series.
  if (rotor.symmetry < 1 || rotor.symmetry > limits::max_rotor_symmetry)
    fail(rotor.where, fmt::format("hindered rotor symmetry is {}, expected 1 to {}", rotor.symmetry,
                                  limits::max_rotor_symmetry));
  const int a = rotor.bond_atoms[0], b = rotor.bond_atoms[1];
  m.top_atoms =
      rotor.top_atoms.empty() ? top_by_connectivity(species.atoms, a, b, rotor.where) : rotor.top_atoms;
  m.bond_axis_moment_amu_A2 = reduced_moment_amu_A2(species.atoms, a, b, m.top_atoms);
  m.reduced_moment_amu_A2 = rotor.moment == RotorMoment::coupled
                                ? coupled_reduced_moment_amu_A2(species.atoms, a, b, m.top_atoms)
                                : m.bond_axis_moment_amu_A2;
  if (!(m.bond_axis_moment_amu_A2 > 0.0))
    fail(rotor.where,
         fmt::format("the rotor about atoms {} and {} has a top with no moment about the bond axis, "
                     "expected atoms off the axis on both sides",
                     a + 1, b + 1));
  if (!(m.reduced_moment_amu_A2 > 0.0))
    fail(rotor.where, fmt::format("the rotor about atoms {} and {} has no coupled reduced moment left once "
                                  "the overall rotation is removed, expected a top that turns "
                                  "independently of the frame (or 'moment: bond_axis')",
                                  a + 1, b + 1));
  if (rotor.barrier_J_per_mol)
    m.potential = cosine_barrier(*rotor.barrier_J_per_mol, rotor.symmetry);
  else {
    m.scan_fit = fit_scan(rotor.scan, rotor.symmetry, rotor.where);
    m.potential = m.scan_fit->potential;
  }
  m.levels = torsion_levels(m.reduced_moment_amu_A2, m.potential, max_temperature_K, rotor.where,
                            fmt::format("hindered rotor about atoms {}-{}", a + 1, b + 1));
  return m;
}

}  // namespace vibtherm
