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

double TorsionPotential::value_J_per_mol(double phi_rad) const {
  double v = cos_J_per_mol[0];
  for (std::size_t k = 1; k < cos_J_per_mol.size(); ++k) {
    const double kd = static_cast<double>(k);
    v += cos_J_per_mol[k] * std::cos(kd * phi_rad) + sin_J_per_mol[k] * std::sin(kd * phi_rad);
  }
  return v;
}

double TorsionPotential::minimum_J_per_mol() const {
  double lowest = value_J_per_mol(0.0);
  for (int i = 1; i < 7200; ++i) lowest = std::min(lowest, value_J_per_mol(2.0 * c::pi * i / 7200.0));
  return lowest;
}

TorsionPotential cosine_barrier(double barrier_J_per_mol, int symmetry) {
  TorsionPotential v;
  v.cos_J_per_mol.assign(static_cast<std::size_t>(symmetry) + 1, 0.0);
  v.sin_J_per_mol.assign(static_cast<std::size_t>(symmetry) + 1, 0.0);
  v.cos_J_per_mol[0] = 0.5 * barrier_J_per_mol;
  v.cos_J_per_mol[static_cast<std::size_t>(symmetry)] = -0.5 * barrier_J_per_mol;
  return v;
}

TorsionPotential fit_scan(const std::vector<ScanPoint>& scan, int symmetry, const SourceLocation& where) {
  const double period_deg = 360.0 / symmetry;
  std::vector<double> reduced;
  for (const ScanPoint& p : scan) {
    double a = std::fmod(p.angle_deg, period_deg);
    if (a < 0.0) a += period_deg;
    reduced.push_back(a);
  }
  std::vector<double> sorted = reduced;
  std::sort(sorted.begin(), sorted.end());
  // Angles 1e-6 degree apart count as one (0 and 360/σ fold onto each other).
  std::vector<double> distinct;
  for (double a : sorted)
    if (distinct.empty() || a - distinct.back() > 1e-6) distinct.push_back(a);
  if (distinct.size() > 1 && distinct.front() + period_deg - distinct.back() <= 1e-6) distinct.pop_back();
  double widest = distinct.empty() ? period_deg : distinct.front() + period_deg - distinct.back();
  for (std::size_t i = 1; i < distinct.size(); ++i) widest = std::max(widest, distinct[i] - distinct[i - 1]);
  if (distinct.size() < 3 || widest > period_deg / 4.0 + 1e-9)
    fail(where,
         fmt::format("'scan' has {} distinct angles modulo {:g} deg with a gap of {:g} deg, expected "
                     "points over a whole period 0-{:g} deg (360/symmetry) with no gap wider than {:g} deg",
                     distinct.size(), period_deg, widest, period_deg, period_deg / 4.0));
  const int order = std::min(6, static_cast<int>(distinct.size() - 1) / 2);
  const Eigen::Index rows = static_cast<Eigen::Index>(scan.size());
  Eigen::MatrixXd A(rows, 1 + 2 * order);
  Eigen::VectorXd b(rows);
  for (Eigen::Index i = 0; i < rows; ++i) {
    const double phi = scan[static_cast<std::size_t>(i)].angle_deg * c::pi / 180.0;
    A(i, 0) = 1.0;
    for (int k = 1; k <= order; ++k) {
      A(i, 2 * k - 1) = std::cos(k * symmetry * phi);
      A(i, 2 * k) = std::sin(k * symmetry * phi);
    }
    b(i) = scan[static_cast<std::size_t>(i)].energy_J_per_mol;
  }
  const Eigen::VectorXd x = A.colPivHouseholderQr().solve(b);
  TorsionPotential v;
  const std::size_t size = static_cast<std::size_t>(order * symmetry) + 1;
  v.cos_J_per_mol.assign(size, 0.0);
  v.sin_J_per_mol.assign(size, 0.0);
  v.cos_J_per_mol[0] = x(0);
  for (int k = 1; k <= order; ++k) {
    v.cos_J_per_mol[static_cast<std::size_t>(k * symmetry)] = x(2 * k - 1);
    v.sin_J_per_mol[static_cast<std::size_t>(k * symmetry)] = x(2 * k);
  }
  return v;
}

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

namespace {

int potential_period(const TorsionPotential& v) {
  int g = 0;
  for (std::size_t k = 1; k < v.cos_J_per_mol.size(); ++k)
    if (v.cos_J_per_mol[k] != 0.0 || v.sin_J_per_mol[k] != 0.0) g = std::gcd(g, static_cast<int>(k));
  return g == 0 ? 1 : g;
}

}  // namespace

TorsionLevels torsion_levels(double reduced_moment_amu_A2, const TorsionPotential& potential) {
  const double I_kg_m2 = reduced_moment_amu_A2 * c::atomic_mass_constant_kg * c::angstrom_m * c::angstrom_m;
  const double hbar = c::planck_J_s / (2.0 * c::pi);
  const double B_cm1 = hbar * hbar / (2.0 * I_kg_m2) * c::avogadro_per_mol / c::wavenumber_J_per_mol;
  double v_max = potential.value_J_per_mol(0.0);
  for (int i = 1; i < 7200; ++i) v_max = std::max(v_max, potential.value_J_per_mol(2.0 * c::pi * i / 7200.0));
  const double range_cm1 = (v_max - potential.minimum_J_per_mol()) / c::wavenumber_J_per_mol;
  // Clamped as a double first: a huge barrier must not overflow the conversion to int.
  const double wanted = std::ceil(std::sqrt((range_cm1 + 1e5) / B_cm1));
  const int M = static_cast<int>(std::clamp(std::isfinite(wanted) ? wanted : 800.0, 20.0, 800.0));
  return torsion_levels(reduced_moment_amu_A2, potential, M);
}

TorsionLevels torsion_levels(double reduced_moment_amu_A2, const TorsionPotential& potential,
                             int basis_max_m) {
  const double I_kg_m2 = reduced_moment_amu_A2 * c::atomic_mass_constant_kg * c::angstrom_m * c::angstrom_m;
  const double hbar = c::planck_J_s / (2.0 * c::pi);
  const double B_J_per_mol = hbar * hbar / (2.0 * I_kg_m2) * c::avogadro_per_mol;
  const int K = static_cast<int>(potential.cos_J_per_mol.size()) - 1;
  // V couples m only to m ± k with k a multiple of the potential's period g, so the
  // basis splits into g independent blocks of m ≡ r (mod g).
  const int g = potential_period(potential);
  std::vector<double> all;
  for (int r = 0; r < g; ++r) {
    std::vector<int> ms;
    for (int m = -basis_max_m; m <= basis_max_m; ++m)
      if (((m % g) + g) % g == r) ms.push_back(m);
    const Eigen::Index n = static_cast<Eigen::Index>(ms.size());
    Eigen::MatrixXcd H = Eigen::MatrixXcd::Zero(n, n);
    for (Eigen::Index i = 0; i < n; ++i) {
      const double m = ms[static_cast<std::size_t>(i)];
      H(i, i) = B_J_per_mol * m * m + potential.cos_J_per_mol[0];
      for (Eigen::Index j = 0; j < n; ++j) {
        const int k = ms[static_cast<std::size_t>(i)] - ms[static_cast<std::size_t>(j)];  // <m_i|V|m_j>
        if (k == 0 || std::abs(k) > K) continue;
        const auto uk = static_cast<std::size_t>(std::abs(k));
        // cos kφ = (e^{ikφ} + e^{−ikφ})/2, sin kφ = (e^{ikφ} − e^{−ikφ})/(2i).
        const double sign = k > 0 ? 1.0 : -1.0;
        H(i, j) = std::complex<double>(0.5 * potential.cos_J_per_mol[uk],
                                       -0.5 * sign * potential.sin_J_per_mol[uk]);
      }
    }
    Eigen::SelfAdjointEigenSolver<Eigen::MatrixXcd> solver(H, Eigen::EigenvaluesOnly);
    for (Eigen::Index i = 0; i < n; ++i) all.push_back(solver.eigenvalues()(i));
  }
  std::sort(all.begin(), all.end());
  TorsionLevels out;
  out.basis_max_m = basis_max_m;
  out.zero_point_energy_J_per_mol = all.front() - potential.minimum_J_per_mol();
  for (double e : all) out.energies_J_per_mol.push_back(e - all.front());
  return out;
}

MotionTerms hindered_rotor_terms(const TorsionLevels& levels, int symmetry, double T_K) {
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

HinderedRotorModel build_hindered_rotor(const Species& species, const HinderedRotor& rotor) {
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
  m.reduced_moment_amu_A2 = reduced_moment_amu_A2(species.atoms, a, b, m.top_atoms);
  if (!(m.reduced_moment_amu_A2 > 0.0))
    fail(rotor.where,
         fmt::format("the rotor about atoms {} and {} has a top with no moment about the bond axis, "
                     "expected atoms off the axis on both sides",
                     a + 1, b + 1));
  m.potential = rotor.barrier_J_per_mol ? cosine_barrier(*rotor.barrier_J_per_mol, rotor.symmetry)
                                        : fit_scan(rotor.scan, rotor.symmetry, rotor.where);
  m.levels = torsion_levels(m.reduced_moment_amu_A2, m.potential);
  return m;
}

}  // namespace vibtherm
