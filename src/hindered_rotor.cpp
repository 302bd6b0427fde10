#include "vibtherm/hindered_rotor.hpp"

#include <fmt/format.h>

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <complex>
#include <numeric>
#include <string_view>

#include "vector_exp.hpp"
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

// LAPACK (Debian's liblapack): eigenvalues of a symmetric tridiagonal matrix by the
// Pal–Walker–Kahan root-free QR, ascending in d; info ≠ 0 when it did not converge.
extern "C" void dsterf_(const int* n, double* d, double* e, int* info);

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

// max V − min V: 2 |c_k| for one cosine term (a barrier), else sampled every 0.05°.
double potential_range_J_per_mol(const TorsionPotential& v) {
  if (!needs_dense_solver(v)) {
    double range = 0.0;
    for (std::size_t k = 1; k < v.cos_J_per_mol.size(); ++k) range += 2.0 * std::abs(v.cos_J_per_mol[k]);
    return range;
  }
  double v_max = v.value_J_per_mol(0.0);
  for (int i = 1; i < 7200; ++i) v_max = std::max(v_max, v.value_J_per_mol(2.0 * c::pi * i / 7200.0));
  return v_max - v.minimum_J_per_mol();
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
  const double range = potential_range_J_per_mol(potential);
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
  const auto throw_unconverged = [&](Eigen::Index n) {
    fail({}, fmt::format("the eigenvalue solver did not converge on a block of {} rotor basis functions "
                         "(|m| <= {}), expected converged levels",
                         n, basis_max_m));
  };
  // <m|B m² + V|m'> of the real part of V (cos kφ = (e^{ikφ} + e^{−ikφ})/2).
  const auto element = [&](int m, int mp) {
    const int k = std::abs(m - mp);
    if (k == 0) return B_J_per_mol * double(m) * double(m) + potential.cos_J_per_mol[0];
    return k <= K ? 0.5 * potential.cos_J_per_mol[static_cast<std::size_t>(k)] : 0.0;
  };
  // Eigenvalues of the real symmetric matrix h(i, j) over basis functions i, j < n: a
  // tridiagonal QR with one cosine term (consecutive functions differ by g), else dense.
  const auto real_levels = [&](Eigen::Index n, const auto& h, std::vector<double>& out) {
    if (n == 0) return;
    if (n == 1) {
      out.push_back(h(0, 0));
      return;
    }
    if (cosine_terms <= 1) {
      // LAPACK's dsterf scales the matrix itself (Eigen 3.4's tridiagonal QR, unscaled,
      // did not converge for about 1 in 60 rotors and said so only through info()).
      std::vector<double> d(static_cast<std::size_t>(n)), e(static_cast<std::size_t>(n - 1));
      for (Eigen::Index i = 0; i < n; ++i) d[static_cast<std::size_t>(i)] = h(i, i);
      for (Eigen::Index i = 0; i + 1 < n; ++i) e[static_cast<std::size_t>(i)] = h(i + 1, i);
      const int size = static_cast<int>(n);
      int info = 0;
      dsterf_(&size, d.data(), e.data(), &info);
      if (info != 0) throw_unconverged(n);
      out.insert(out.end(), d.begin(), d.end());
      return;
    }
    Eigen::MatrixXd H = Eigen::MatrixXd::Zero(n, n);
    for (Eigen::Index i = 0; i < n; ++i)
      for (Eigen::Index j = std::max<Eigen::Index>(0, i - band); j < std::min(n, i + band + 1); ++j)
        H(i, j) = h(i, j);
    Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> solver(H, Eigen::EigenvaluesOnly);
    if (solver.info() != Eigen::Success) throw_unconverged(n);
    for (Eigen::Index i = 0; i < n; ++i) out.push_back(solver.eigenvalues()(i));
  };
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
    if (!has_sine && (r == 0 || 2 * r == g)) {
      // The block maps onto itself under m → −m: even functions (|m> + |−m>)/√2 (and |0>)
      // and odd ones (|m> − |−m>)/√2, m > 0, do not mix; two half-size problems. With
      // c(0) = 1/√2, c(m > 0) = 1: <even m|H|even m'> = c(m) c(m') (H(m, m') + H(m, −m')),
      // <odd m|H|odd m'> = H(m, m') − H(m, −m').
      std::vector<int> even, odd;
      for (int m : ms) {
        if (m >= 0) even.push_back(m);
        if (m > 0) odd.push_back(m);
      }
      const auto c = [](int m) { return m == 0 ? 1.0 / std::sqrt(2.0) : 1.0; };
      real_levels(
          static_cast<Eigen::Index>(even.size()),
          [&](Eigen::Index i, Eigen::Index j) {
            const int m = even[static_cast<std::size_t>(i)], mp = even[static_cast<std::size_t>(j)];
            return c(m) * c(mp) * (element(m, mp) + element(m, -mp));
          },
          out);
      real_levels(
          static_cast<Eigen::Index>(odd.size()),
          [&](Eigen::Index i, Eigen::Index j) {
            const int m = odd[static_cast<std::size_t>(i)], mp = odd[static_cast<std::size_t>(j)];
            return element(m, mp) - element(m, -mp);
          },
          out);
    } else if (!has_sine) {
      real_levels(
          n,
          [&](Eigen::Index i, Eigen::Index j) {
            return element(ms[static_cast<std::size_t>(i)], ms[static_cast<std::size_t>(j)]);
          },
          out);
    } else {
      // Sine terms: complex Hermitian, sin kφ = (e^{ikφ} − e^{−ikφ})/(2i).
      Eigen::MatrixXcd H = Eigen::MatrixXcd::Zero(n, n);
      for (Eigen::Index i = 0; i < n; ++i) {
        H(i, i) = element(ms[static_cast<std::size_t>(i)], ms[static_cast<std::size_t>(i)]);
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
      if (solver.info() != Eigen::Success) throw_unconverged(n);
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
  // Levels ascend: past x = 60 every weight is below e^-60 = 9e-27 of the ground level's
  // (and x² e^-x < 4e-23), far below double precision of the sums. Their weights go in
  // chunks through one vector exponential (vector_exp.hpp).
  const std::vector<double>& E = levels.energies_J_per_mol;
  const double inv_RT = 1.0 / RT;
  constexpr std::size_t chunk = 64;
  double x[chunk], w[chunk];
  for (std::size_t start = 0; start < E.size(); start += chunk) {
    std::size_t n = 0;
    while (n < chunk && start + n < E.size() && E[start + n] * inv_RT <= 60.0) {
      x[n] = E[start + n] * inv_RT;
      ++n;
    }
    detail::exp_of_negated(x, w, n);
    for (std::size_t i = 0; i < n; ++i) {
      q += w[i];
      e1 += w[i] * x[i];
      e2 += w[i] * x[i] * x[i];
    }
    if (n < chunk) break;
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

TorsionReplacement replace_torsional_modes(const Species& s, const std::vector<double>& vibrations_cm1,
                                           double frequency_scale, double max_temperature_K) {
  TorsionReplacement out;
  std::vector<char> taken(vibrations_cm1.size(), 0);
  for (const HinderedRotor& r : s.hindered_rotors) {
    const double target = r.replaces_cm1 * frequency_scale;
    std::size_t best = vibrations_cm1.size();
    for (std::size_t i = 0; i < vibrations_cm1.size(); ++i)
      if (!taken[i] && (best == vibrations_cm1.size() ||
                        std::abs(vibrations_cm1[i] - target) < std::abs(vibrations_cm1[best] - target)))
        best = i;
    const double tolerance = replaces_tolerance_cm1 * frequency_scale;
    if (best == vibrations_cm1.size() || std::abs(vibrations_cm1[best] - target) > tolerance)
      fail(r.where,
           fmt::format("hindered rotor 'replaces' {:g} cm^-1 matches no remaining vibration within {:g} "
                       "cm^-1, expected one of the frequencies",
                       r.replaces_cm1, replaces_tolerance_cm1));
    taken[best] = 1;
    out.rotors.push_back(build_hindered_rotor(s, r, max_temperature_K));
    const HinderedRotorModel& model = out.rotors.back();
    out.notes.push_back(fmt::format(
        "hindered rotor about atoms {}-{} (symmetry {}, reduced moment {:.4f} amu A^2 {}) replaces the mode "
        "at {:.1f} cm^-1",
        r.bond_atoms[0] + 1, r.bond_atoms[1] + 1, r.symmetry, model.reduced_moment_amu_A2,
        r.moment == RotorMoment::coupled
            ? fmt::format("coupled to the overall rotation; {:.4f} about the bond axis alone",
                          model.bond_axis_moment_amu_A2)
            : std::string("about the bond axis, I_A I_B/(I_A + I_B)"),
        vibrations_cm1[best]));
    if (model.scan_fit) {
      const std::string rotor =
          fmt::format("hindered rotor about atoms {}-{}", r.bond_atoms[0] + 1, r.bond_atoms[1] + 1);
      out.notes.push_back(scan_fit_note(*model.scan_fit, r.scan.size(), rotor));
      for (std::string& w : scan_fit_warnings(*model.scan_fit, r.symmetry, rotor))
        out.warnings.push_back(std::move(w));
    }
  }
  for (std::size_t i = 0; i < vibrations_cm1.size(); ++i)
    if (!taken[i]) out.kept_cm1.push_back(vibrations_cm1[i]);
  return out;
}

}  // namespace vibtherm
