#include "vibtherm/report.hpp"

#include <algorithm>

#include "vibtherm/constants.hpp"
#include "vibtherm/write_modes.hpp"

namespace vibtherm {

ReportSpecies gather_report_species(const PreparedSpecies& prepared, const ReportOptions& options) {
  ReportSpecies out;
  out.facts = describe_species(prepared);
  out.at_298 = evaluate(prepared, constants::reference_temperature_K);
  out.table = tabulate(prepared, options.temperatures_K);
  out.classical_Cp_J_per_mol_K =
      (classical_Cv_over_R(prepared) + (prepared.is_gas ? 1.0 : 0.0)) * constants::gas_constant_J_per_mol_K;

  if (prepared.species.enthalpy_of_formation_J_per_mol || !options.fit.allow_missing_hf) {
    FitOptions fit = options.fit;
    fit.form = NasaForm::nasa7;
    out.fit = fit_species(prepared, fit);
  } else {
    out.not_fitted_reason =
        "no enthalpy of formation in the species file: a NASA polynomial needs H(298.15 K) = ΔfH°, "
        "so none is fitted (add enthalpy_of_formation to the species file)";
  }

  const auto& bp = out.fit ? out.fit->fit.breakpoints_K : options.fit.range.breakpoints_K;
  double low = bp.front(), high = bp.back();
  for (double t : options.temperatures_K) {
    low = std::min(low, t);
    high = std::max(high, t);
  }
  for (const double T : log_spaced_temperatures(low, high, options.curve_samples)) {
    CpCurvePoint point{T, evaluate(prepared, T).Cp_J_per_mol_K, std::nullopt};
    if (out.fit && polynomial_in_range(out.fit->polynomial, T))
      point.fitted_Cp_J_per_mol_K = polynomial_at(out.fit->polynomial, T).Cp_J_per_mol_K();
    out.Cp_curve.push_back(point);
  }

  std::vector<double> modes_temps = options.temperatures_K;
  if (modes_temps.empty()) modes_temps = {low, high};
  const auto [mlow, mhigh] = svg_temperature_span_K(modes_temps);
  out.modes = analyse_modes(prepared, log_spaced_temperatures(mlow, mhigh, options.curve_samples),
                            options.thresholds);
  return out;
}

}  // namespace vibtherm
