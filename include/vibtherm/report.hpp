// What the HTML report shows for one species, gathered from the engine, the modes
// analysis, the species facts and the NASA-7 fit. Pure computation; write_report.hpp formats it.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "vibtherm/facts.hpp"
#include "vibtherm/fit_nasa.hpp"
#include "vibtherm/modes.hpp"
#include "vibtherm/thermo.hpp"

namespace vibtherm {

// One temperature of the pictures: the engine's Cp, S and H − H(298.15 K) and, inside the
// fit range, the fitted polynomial's.
struct ThermoSample {
  double Cp_J_per_mol_K = 0.0;
  double S_J_per_mol_K = 0.0;
  double H_minus_H298_J_per_mol = 0.0;
};
struct CurvePoint {
  double T_K = 0.0;
  ThermoSample engine;
  std::optional<ThermoSample> fitted;  // absent outside the fit range or when not fitted
};

// The page shows facts.notes as the species' "model notes", one line per model choice or
// source of a number, so a new treatment that records a note appears without a layout change.
struct ReportSpecies {
  SpeciesFacts facts;
  std::string input_file;                 // as given on the command line (empty: built in memory)
  std::string input_sha256;               // of the file's bytes (empty when unknown)
  ThermoPoint at_298;                     // the engine at 298.15 K (summary columns)
  std::vector<ThermoPoint> table;         // at the requested temperatures
  std::vector<CurvePoint> curve;          // ascending T, dense in ln T, spanning T_low..T_high
  double T_low_K = 0.0, T_high_K = 0.0;   // one temperature axis for every picture of the species
  double classical_Cp_J_per_mol_K = 0.0;  // equipartition limit (Cv limit + R for a gas)
  ModesReport modes;                      // sampled on the same axis as `curve`
  std::optional<SpeciesFit> fit;          // NASA-7; absent when not fitted
  std::string not_fitted_reason;          // why `fit` is absent
  FitThresholds thresholds;               // the fit's warning thresholds, drawn in the residual panels
  double worst_Cp_error = 0.0;            // largest relative Cp error of the fit over its ranges (0: none)
  int warning_count = 0;                  // species and fit warnings
};

struct ReportOptions {
  std::vector<double> temperatures_K;  // rows of the short thermo table
  FitOptions fit;                      // NASA-7 fit; `allow_missing_hf` is read as below
  ActivationThresholds thresholds;
  int curve_samples = 97;  // in ln T: smooth curves, and a stop wherever a heat-map row changes
};

// A species without an enthalpy of formation is reported with its NASA part marked as not
// fitted when options.fit.allow_missing_hf is set (the polynomial would carry an invented
// H(298.15 K)); otherwise fit_species' InputError propagates. Every picture spans the fit
// range widened to the requested temperatures (and to at least one decade).
ReportSpecies gather_report_species(const PreparedSpecies& prepared, const ReportOptions& options);

}  // namespace vibtherm
