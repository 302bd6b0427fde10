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

// One point of the Cp(T) picture: the engine's Cp and, inside the fit range, the fitted one.
struct CpCurvePoint {
  double T_K = 0.0;
  double engine_Cp_J_per_mol_K = 0.0;
  std::optional<double> fitted_Cp_J_per_mol_K;  // absent outside the fit range or when not fitted
};

struct ReportSpecies {
  SpeciesFacts facts;
  ThermoPoint at_298;                     // the engine at 298.15 K (summary columns)
  std::vector<ThermoPoint> table;         // at the requested temperatures
  std::vector<CpCurvePoint> Cp_curve;     // ascending T, dense in ln T
  double classical_Cp_J_per_mol_K = 0.0;  // equipartition limit (Cv limit + R for a gas)
  ModesReport modes;                      // sampled densely for the picture
  std::optional<SpeciesFit> fit;          // NASA-7; absent when not fitted
  std::string not_fitted_reason;          // why `fit` is absent
};

struct ReportOptions {
  std::vector<double> temperatures_K;  // rows of the short thermo table
  FitOptions fit;                      // NASA-7 fit; `allow_missing_hf` is read as below
  ActivationThresholds thresholds;
  int curve_samples = 161;
};

// A species without an enthalpy of formation is reported with its NASA part marked as not
// fitted when options.fit.allow_missing_hf is set (the polynomial would carry an invented
// H(298.15 K)); otherwise fit_species' InputError propagates. The Cp picture spans the fit
// range widened to the requested temperatures.
ReportSpecies gather_report_species(const PreparedSpecies& prepared, const ReportOptions& options);

}  // namespace vibtherm
