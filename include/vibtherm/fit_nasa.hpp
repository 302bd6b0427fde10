// Constrained least-squares fits of NASA-7 and NASA-9 polynomials to the engine's
// thermochemistry, with exact continuity and 298.15 K anchors, fit errors per range and
// a physical-bounds check on the fitted Cp.
#pragma once

#include <string>
#include <string_view>
#include <vector>

#include "vibtherm/nasa.hpp"
#include "vibtherm/thermo.hpp"

namespace vibtherm {

enum class NasaForm { nasa7, nasa9 };

// Temperature breakpoints from "TLOW:TMID:THIGH" (NASA-7) or "T0:T1:...:Tn" (NASA-9);
// at most one inner breakpoint may be `auto` (searched, see FitOptions).
struct FitRange {
  std::vector<double> breakpoints_K;  // ascending; the `auto` entry holds NaN
  int auto_index = -1;                // index of the `auto` breakpoint, -1 if none
};
// Throws InputError (no file) on malformed text, wrong count for the form, or
// non-ascending breakpoints.
FitRange parse_fit_range(std::string_view text, NasaForm form);
FitRange default_fit_range(NasaForm form);  // NASA-7 200:1000:3000, NASA-9 200:1000:6000

// Documented defaults of the fit (see fit_nasa.cpp for the reasoning):
// - grid: every `grid_step_K` from T_low to T_high, plus every breakpoint; a sample at a
//   joint belongs to both ranges;
// - objective: Σ [(Cp_fit − Cp)/Cp]², relative Cp error, unweighted otherwise;
// - equality constraints at every joint: Cp, dCp/dT (if asked), H and S equal on
//   both sides; at 298.15 K: H = ΔfH°(298.15 K), S = engine S°(298.15 K);
// - warnings when a range's max error passes the thresholds below.
struct FitThresholds {
  double Cp_relative = 0.005;  // 0.5 % of Cp
  double H_J_per_mol = 100.0;  // 0.1 kJ/mol
  double S_J_per_mol_K = 0.1;
};

struct FitOptions {
  NasaForm form = NasaForm::nasa7;
  FitRange range = default_fit_range(NasaForm::nasa7);
  // Off by default: with T_mid at the conventional 1000 K the slope constraint raises the
  // largest Cp error of the example species from ~0.45 % to ~0.75 % (at 200 K).
  bool Cp_slope_continuous = false;
  double grid_step_K = 5.0;
  double auto_step_K = 50.0;     // spacing of the `auto` candidates
  double auto_margin_K = 100.0;  // candidates keep this far from the neighbouring breakpoints
  bool allow_missing_hf = false;
  FitThresholds thresholds;
};

// One engine value on the fit grid, dimensionless; H absolute (ΔfH° + H(T) − H(298.15)).
struct FitSample {
  double T_K = 0.0;
  double Cp_over_R = 0.0;
  double H_over_R = 0.0;  // in K
  double S_over_R = 0.0;
  double electronic_Cp_over_R =
      0.0;  // allowance above the classical limit (electronic and hindered-rotor excess)
};

// Physical bounds of Cp/R (common practice, from equipartition): lower = translation +
// rotation (5/2 atom, 7/2 linear, 4 nonlinear; 0 adsorbate); upper = classical limit
// (3N − 3/2 linear, 3N − 2 nonlinear, 3N adsorbate) plus the electronic Cp of each sample.
// Every grid stretch outside them is listed; a warning is raised when the departure is
// larger than the Cp threshold times the bound (smaller ones are the fit error near an asymptote).
struct CpBounds {
  double lower_over_R = 0.0;
  double upper_over_R = 0.0;
};

struct FitInput {
  std::string name;
  std::vector<FitSample> samples;  // ascending T, covering the fit range
  double H298_over_R = 0.0;        // ΔfH°(298.15 K) / R, in K
  double S298_over_R = 0.0;
  CpBounds bounds;
};

struct RangeErrors {
  double T_low_K = 0.0, T_high_K = 0.0;
  int samples = 0;
  double max_Cp_relative = 0.0, rms_Cp_relative = 0.0;
  double T_at_max_Cp_K = 0.0;
  double max_Cp_over_R = 0.0, rms_Cp_over_R = 0.0;  // absolute errors
  double max_H_over_RT = 0.0, rms_H_over_RT = 0.0;
  double max_S_over_R = 0.0, rms_S_over_R = 0.0;
  double max_H_J_per_mol = 0.0;
  double max_S_J_per_mol_K = 0.0;
};

// A stretch of the grid where the fitted Cp leaves its bounds.
struct BoundsExcursion {
  double T_from_K = 0.0, T_to_K = 0.0;
  bool above = false;  // above the classical limit (else below the lower one)
  double worst_Cp_over_R = 0.0;
  double bound_over_R = 0.0;
};

struct FitResult {
  std::string name;
  NasaForm form = NasaForm::nasa7;
  std::vector<double> breakpoints_K;      // as used (the `auto` one resolved)
  int searched_index = -1;                // breakpoint chosen by the search, -1 if none
  double searched_max_Cp_relative = 0.0;  // the search's criterion at the chosen value
  std::vector<Nasa9Range> ranges;         // every form in NASA-9 notation (NASA-7: a1 = a2 = 0)
  std::vector<RangeErrors> errors;        // one per range
  CpBounds bounds;
  std::vector<BoundsExcursion> excursions;
  std::vector<std::string> warnings;
};

// The fit on given samples (no engine involved).
FitResult fit_samples(const FitInput& input, const FitOptions& options);

// Everything a writer needs for one species.
struct SpeciesFit {
  FitResult fit;
  NasaPolynomial polynomial;
  bool enthalpy_of_formation_missing = false;
  double enthalpy_of_formation_J_per_mol = 0.0;
  double S298_J_per_mol_K = 0.0;
  double H298_minus_H0_J_per_mol = 0.0;
  double molar_mass_g_per_mol = 0.0;
  std::vector<std::string> notes;  // also written into the output's note/comment field
  FitInput input;                  // the samples fitted: another plan on the same grid reuses them
};

// Tabulates the engine on the grid and fits. Throws InputError (at the species file)
// when enthalpy_of_formation is missing and options.allow_missing_hf is false.
SpeciesFit fit_species(const PreparedSpecies& prepared, const FitOptions& options);

}  // namespace vibtherm
