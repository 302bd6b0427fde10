#include "vibtherm/write_fit_json.hpp"

#include <nlohmann/json.hpp>

namespace vibtherm {

namespace {

using nlohmann::ordered_json;

const char* form_key(NasaForm form) { return form == NasaForm::nasa7 ? "nasa7" : "nasa9"; }

ordered_json errors_json(const RangeErrors& e) {
  return ordered_json{{"samples", e.samples},
                      {"max_Cp_relative", e.max_Cp_relative},
                      {"rms_Cp_relative", e.rms_Cp_relative},
                      {"T_at_max_Cp_K", e.T_at_max_Cp_K},
                      {"max_Cp_over_R", e.max_Cp_over_R},
                      {"rms_Cp_over_R", e.rms_Cp_over_R},
                      {"max_H_over_RT", e.max_H_over_RT},
                      {"rms_H_over_RT", e.rms_H_over_RT},
                      {"max_S_over_R", e.max_S_over_R},
                      {"rms_S_over_R", e.rms_S_over_R},
                      {"max_H_J_per_mol", e.max_H_J_per_mol},
                      {"max_S_J_per_mol_K", e.max_S_J_per_mol_K}};
}

ordered_json species_json(const FitRecord& rec) {
  const SpeciesFit& sf = rec.fit;
  const FitResult& fit = sf.fit;
  ordered_json s;
  s["name"] = fit.name;
  ordered_json composition = ordered_json::object();
  const auto& comp = std::visit(
      [](const auto& p) -> const std::vector<ElementAmount>& { return p.composition; }, sf.polynomial);
  for (const auto& e : comp) composition[e.symbol] = e.count;
  s["composition"] = composition;
  if (const auto* n7 = std::get_if<Nasa7>(&sf.polynomial))
    s["phase"] = n7->phase == 'G' ? "gas" : "adsorbate";
  else
    s["phase"] = std::get<Nasa9>(sf.polynomial).phase == 0 ? "gas" : "adsorbate";
  s["molar_mass_g_per_mol"] = sf.molar_mass_g_per_mol;
  s["enthalpy_of_formation_J_per_mol"] = sf.enthalpy_of_formation_J_per_mol;
  s["enthalpy_of_formation_missing"] = sf.enthalpy_of_formation_missing;
  s["S298_J_per_mol_K"] = sf.S298_J_per_mol_K;
  s["H298_minus_H0_J_per_mol"] = sf.H298_minus_H0_J_per_mol;
  s["form"] = form_key(fit.form);
  s["breakpoints_K"] = fit.breakpoints_K;
  if (fit.searched_index >= 0)
    s["searched_breakpoint"] = {{"index", fit.searched_index},
                                {"T_K", fit.breakpoints_K[fit.searched_index]},
                                {"max_Cp_relative", fit.searched_max_Cp_relative}};
  ordered_json ranges = ordered_json::array();
  for (std::size_t r = 0; r < fit.ranges.size(); ++r) {
    const Nasa9Range& range = fit.ranges[r];
    ordered_json j{{"T_low_K", range.T_low_K}, {"T_high_K", range.T_high_K}};
    if (fit.form == NasaForm::nasa7) {
      // a1..a7 of NASA-7: the T⁰..T⁴ terms, then a6 (H) and a7 (S).
      j["coefficients"] = {range.a[2], range.a[3], range.a[4], range.a[5], range.a[6], range.b1, range.b2};
    } else {
      j["coefficients"] = range.a;
      j["b1"] = range.b1;
      j["b2"] = range.b2;
    }
    j["errors"] = errors_json(fit.errors[r]);
    ranges.push_back(j);
  }
  s["ranges"] = ranges;
  ordered_json exc = ordered_json::array();
  for (const auto& x : fit.excursions)
    exc.push_back({{"T_from_K", x.T_from_K},
                   {"T_to_K", x.T_to_K},
                   {"side", x.above ? "above" : "below"},
                   {"worst_Cp_over_R", x.worst_Cp_over_R},
                   {"bound_Cp_over_R", x.bound_over_R}});
  s["bounds"] = {{"lower_Cp_over_R", fit.bounds.lower_over_R},
                 {"upper_Cp_over_R", fit.bounds.upper_over_R},
                 {"excursions", exc}};
  s["warnings"] = fit.warnings;
  s["notes"] = sf.notes;
  ordered_json model = ordered_json::object();
  for (const auto& [k, v] : rec.provenance.model_options) model[k] = v;
  s["provenance"] = {{"input_file", rec.provenance.input_file},
                     {"input_sha256", rec.provenance.input_sha256},
                     {"model_options", model}};
  return s;
}

}  // namespace

std::string write_fit_json(const std::vector<FitRecord>& records, const FitOptions& options) {
  ordered_json root;
  root["tool"] = {{"name", "vibtherm"}, {"version", VIBTHERM_VERSION}};
  root["units"] = {{"T", "K"},
                   {"Cp_over_R", "dimensionless (coefficients give Cp/R with T in K)"},
                   {"enthalpy", "J/mol"},
                   {"entropy", "J/(mol K)"},
                   {"molar_mass", "g/mol"}};
  root["fit_options"] = {{"form", form_key(options.form)},
                         {"Cp_slope_continuous", options.Cp_slope_continuous},
                         {"grid_step_K", options.grid_step_K},
                         {"objective", "sum of squared relative Cp errors on the grid"},
                         {"constraints",
                          "Cp, H, S continuous at joints; H(298.15 K) = enthalpy of formation; "
                          "S(298.15 K) = computed entropy"},
                         {"thresholds",
                          {{"Cp_relative", options.thresholds.Cp_relative},
                           {"H_J_per_mol", options.thresholds.H_J_per_mol},
                           {"S_J_per_mol_K", options.thresholds.S_J_per_mol_K}}}};
  ordered_json species = ordered_json::array();
  for (const auto& r : records) species.push_back(species_json(r));
  root["species"] = species;
  return root.dump(2) + "\n";
}

}  // namespace vibtherm
