#include "vibtherm/torsion_potential.hpp"

#include <fmt/format.h>

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>

#include "vibtherm/constants.hpp"
#include "vibtherm/error.hpp"

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
  // One cosine term (a barrier): c0 − |c_k| exactly.
  int terms = 0;
  std::size_t term = 0;
  for (std::size_t k = 1; k < cos_J_per_mol.size(); ++k) {
    if (sin_J_per_mol[k] != 0.0) terms = 2;
    if (cos_J_per_mol[k] != 0.0) ++terms, term = k;
  }
  if (terms == 0) return cos_J_per_mol.empty() ? 0.0 : cos_J_per_mol[0];
  if (terms == 1) return cos_J_per_mol[0] - std::abs(cos_J_per_mol[term]);
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

ScanFit fit_scan(const std::vector<ScanPoint>& scan, int symmetry, const SourceLocation& where) {
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
  ScanFit fit;
  fit.terms = order;
  TorsionPotential& v = fit.potential;
  const std::size_t size = static_cast<std::size_t>(order * symmetry) + 1;
  v.cos_J_per_mol.assign(size, 0.0);
  v.sin_J_per_mol.assign(size, 0.0);
  v.cos_J_per_mol[0] = x(0);
  for (int k = 1; k <= order; ++k) {
    v.cos_J_per_mol[static_cast<std::size_t>(k * symmetry)] = x(2 * k - 1);
    v.sin_J_per_mol[static_cast<std::size_t>(k * symmetry)] = x(2 * k);
  }
  const Eigen::VectorXd residual = A * x - b;
  fit.rms_residual_J_per_mol = std::sqrt(residual.squaredNorm() / static_cast<double>(rows));
  Eigen::Index worst = 0;
  fit.largest_residual_J_per_mol = residual.cwiseAbs().maxCoeff(&worst);
  fit.largest_residual_angle_deg = scan[static_cast<std::size_t>(worst)].angle_deg;
  // The period: points whose angles differ by a multiple of 360/σ (0.5 degree slack) must
  // have equal energies.
  for (std::size_t i = 0; i < scan.size(); ++i)
    for (std::size_t j = i + 1; j < scan.size(); ++j) {
      const double apart = std::abs(reduced[i] - reduced[j]);
      if (std::min(apart, period_deg - apart) > 0.5 ||
          std::abs(scan[i].angle_deg - scan[j].angle_deg) < 0.5)  // the same angle twice
        continue;
      const double diff = std::abs(scan[i].energy_J_per_mol - scan[j].energy_J_per_mol);
      if (!fit.period_checked || diff > fit.period_mismatch_J_per_mol) {
        fit.period_mismatch_J_per_mol = diff;
        fit.period_mismatch_angles_deg = {scan[i].angle_deg, scan[j].angle_deg};
      }
      fit.period_checked = true;
    }
  return fit;
}

std::string scan_fit_note(const ScanFit& fit, std::size_t points, std::string_view rotor) {
  return fmt::format(
      "{}: scan of {} points fitted with {} cosine/sine terms, residual RMS {:.3f} kJ/mol, "
      "largest {:.3f} kJ/mol at {:g} deg{}",
      rotor, points, fit.terms, fit.rms_residual_J_per_mol / 1e3, fit.largest_residual_J_per_mol / 1e3,
      fit.largest_residual_angle_deg,
      fit.period_checked ? "" : "; period not checked (no two points a period apart)");
}

std::vector<std::string> scan_fit_warnings(const ScanFit& fit, int symmetry, std::string_view rotor) {
  std::vector<std::string> out;
  if (fit.period_checked && fit.period_mismatch_J_per_mol > scan_residual_warning_J_per_mol)
    out.push_back(
        fmt::format("{}: the scan does not repeat every {:g} deg (symmetry {}): {:g} and {:g} deg "
                    "differ by {:.3f} kJ/mol (more than {:g}); check 'symmetry' and the scan",
                    rotor, 360.0 / symmetry, symmetry, fit.period_mismatch_angles_deg[0],
                    fit.period_mismatch_angles_deg[1], fit.period_mismatch_J_per_mol / 1e3,
                    scan_residual_warning_J_per_mol / 1e3));
  if (fit.largest_residual_J_per_mol > scan_residual_warning_J_per_mol)
    out.push_back(
        fmt::format("{}: the {}-term series misses the scan by up to {:.3f} kJ/mol at {:g} deg "
                    "(RMS {:.3f}; more than {:g}); the rotor's levels follow the series",
                    rotor, fit.terms, fit.largest_residual_J_per_mol / 1e3, fit.largest_residual_angle_deg,
                    fit.rms_residual_J_per_mol / 1e3, scan_residual_warning_J_per_mol / 1e3));
  return out;
}

}  // namespace vibtherm
