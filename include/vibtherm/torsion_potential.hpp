// The potential of a torsion: a cosine barrier or a Fourier series fitted to a scan, with
// the fit's residuals and a check of the scan's period.
#pragma once

#include <array>
#include <string>
#include <string_view>
#include <vector>

#include "vibtherm/species.hpp"

namespace vibtherm {

// V(φ) = c0 + Σ_k [cos_k cos(kφ) + sin_k sin(kφ)], k = 1..K, in J/mol; index 0 of
// `sin_J_per_mol` is unused (kept 0) so both vectors are indexed by k.
struct TorsionPotential {
  std::vector<double> cos_J_per_mol{0.0};
  std::vector<double> sin_J_per_mol{0.0};
  double value_J_per_mol(double phi_rad) const;
  double minimum_J_per_mol() const;  // exact for one cosine term, else on a 1/20 degree grid
};

// V(φ) = V/2 (1 − cos(σφ)) (design.md section 4).
TorsionPotential cosine_barrier(double barrier_J_per_mol, int symmetry);

// Least-squares fit of a scan (degrees, J/mol) to the series in cos/sin(kσφ), k = 1..K,
// K = min(6, (distinct angles modulo 360/σ − 1) / 2), with how well it fits. Throws
// InputError (at `where`) unless the angles cover a whole period 360/σ with no gap wider
// than a quarter of it.
struct ScanFit {
  TorsionPotential potential;
  int terms = 0;                        // K
  double rms_residual_J_per_mol = 0.0;  // fit − scan over the points
  double largest_residual_J_per_mol = 0.0;
  double largest_residual_angle_deg = 0.0;
  // Points 360/σ (or a multiple) apart, which the period makes equal: the largest energy
  // difference between two of them (within 0.5 degree), and the two angles; no such pair
  // (a scan over one period only) leaves `period_checked` false.
  bool period_checked = false;
  double period_mismatch_J_per_mol = 0.0;
  std::array<double, 2> period_mismatch_angles_deg{0.0, 0.0};
};
ScanFit fit_scan(const std::vector<ScanPoint>& scan, int symmetry, const SourceLocation& where);

// A scan fit or its period mismatch above this deserves a warning: the series then misses
// the scan's shape by more than the accuracy of a torsional scan's energies.
inline constexpr double scan_residual_warning_J_per_mol = 200.0;

// One-line note on a scan fit ("scan of N points, K terms: RMS ..., largest ... at ... deg")
// and the warnings it deserves (a residual or a period mismatch above the threshold), each
// naming `rotor`.
std::string scan_fit_note(const ScanFit& fit, std::size_t points, std::string_view rotor);
std::vector<std::string> scan_fit_warnings(const ScanFit& fit, int symmetry, std::string_view rotor);

}  // namespace vibtherm
