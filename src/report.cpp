#include "vibtherm/report.hpp"

#include <algorithm>

#include "vibtherm/constants.hpp"
#include "vibtherm/write_modes_svg.hpp"

namespace vibtherm {

ReportSpecies gather_report_species(const PreparedSpecies& prepared, const ReportOptions& options) {
  ReportSpecies out;
  out.facts = describe_species(prepared);
  out.input_file = prepared.species.origin.file;
  out.at_298 = evaluate(prepared, constants::reference_temperature_K);
  out.table = tabulate(prepared, options.temperatures_K);
  out.classical_Cp_J_per_mol_K =
      (classical_Cv_over_R(prepared) + (prepared.is_gas ? 1.0 : 0.0)) * constants::gas_constant_J_per_mol_K;
  out.thresholds = options.fit.thresholds;

  if (prepared.species.enthalpy_of_formation_J_per_mol || !options.fit.allow_missing_hf) {
    FitOptions fit = options.fit;
    fit.form = NasaForm::nasa7;
    out.fit = fit_species(prepared, fit);
    for (const auto& e : out.fit->fit.errors)
      out.worst_Cp_error = std::max(out.worst_Cp_error, e.max_Cp_relative);
  } else {
    out.not_fitted_reason =
        "no enthalpy of formation in the species file: a NASA polynomial needs H(298.15 K) = ΔfH°, "
        "so none is fitted (add enthalpy_of_formation to the species file)";
  }
  out.warning_count =
      static_cast<int>(out.facts.warnings.size() + (out.fit ? out.fit->fit.warnings.size() : 0));

  // One span for every picture: the fit range and the requested temperatures, widened to a decade.
  const auto& bp = out.fit ? out.fit->fit.breakpoints_K : options.fit.range.breakpoints_K;
  std::vector<double> wanted = options.temperatures_K;
  wanted.push_back(bp.front());
  wanted.push_back(bp.back());
  std::tie(out.T_low_K, out.T_high_K) = svg_temperature_span_K(wanted);
  const auto samples = log_spaced_temperatures(out.T_low_K, out.T_high_K, options.curve_samples);
  for (const double T : samples) {
    const ThermoPoint e = evaluate(prepared, T);
    CurvePoint point{T, {e.Cp_J_per_mol_K, e.S_J_per_mol_K, e.H_minus_H298_J_per_mol}, std::nullopt};
    if (out.fit && polynomial_in_range(out.fit->polynomial, T)) {
      const ThermoPoint f = polynomial_table_row(out.fit->polynomial, T);
      point.fitted = ThermoSample{f.Cp_J_per_mol_K, f.S_J_per_mol_K, f.H_minus_H298_J_per_mol};
    }
    out.curve.push_back(point);
  }
  out.modes = analyse_modes(prepared, samples, options.thresholds);
  return out;
}

}  // namespace vibtherm
