// Text, CSV and JSON forms of reaction thermochemistry.
#include "vibtherm/write_reaction.hpp"

#include <fmt/format.h>

#include <nlohmann/json.hpp>

#include "vibtherm/markup.hpp"

namespace vibtherm {
namespace {

std::string fit_text(const char* which, const LnKFit& f) {
  return fmt::format(
      "  ln {} = ln A + n ln T - E/(RT): A = {:.6e}, n = {:.5f}, E = {:.4f} kJ/mol (largest |ln {} - fit| "
      "{:.2e})\n",
      which, f.A, f.n, f.E_J_per_mol / 1e3, which, f.max_abs_deviation_ln);
}

nlohmann::ordered_json fit_json(const LnKFit& f) {
  return {{"A", f.A}, {"n", f.n}, {"E", f.E_J_per_mol / 1e3}, {"max_deviation_ln", f.max_abs_deviation_ln}};
}

}  // namespace

std::string write_reaction_text(const ReactionReport& report) {
  std::string out;
  for (const auto& r : report.reactions) {
    const ReactionTable& t = r.table;
    out += fmt::format("== {} ==\n{}\n", t.name, t.equation);
    out += fmt::format(
        "enthalpy basis: {}; delta n (gas) = {:g}; standard state {}; Kp relative to {:g} Pa, Kc to "
        "1 mol/L\n",
        enthalpy_basis_name(t.basis), t.delta_n, report.standard_state, t.Kp_reference_Pa);
    out += fmt::format("{:>9} {:>12} {:>12} {:>12} {:>13} {:>13}\n", "T", "dH", "dS", "dG", "Kp", "Kc");
    out += fmt::format("{:>9} {:>12} {:>12} {:>12} {:>13} {:>13}\n", "K", "kJ/mol", "J/mol/K", "kJ/mol", "1",
                       "1");
    for (const auto& row : t.rows)
      out += fmt::format("{:>9.2f} {:>12.4f} {:>12.4f} {:>12.4f} {:>13.6e} {:>13.6e}\n", row.T_K,
                         row.delta_H_J_per_mol / 1e3, row.delta_S_J_per_mol_K, row.delta_G_J_per_mol / 1e3,
                         row.Kp, row.Kc);
    if (r.fit_Kp) out += fit_text("Kp", *r.fit_Kp);
    if (r.fit_Kc) out += fit_text("Kc", *r.fit_Kc);
    if (r.unknown)
      out += fmt::format(
          "unknown {}: delta_rH(298.15 K) = {:.3f} kJ/mol gives its enthalpy of formation {:.3f} kJ/mol\n",
          r.unknown->species, r.unknown->value.delta_rH298_J_per_mol / 1e3,
          r.unknown->value.dfH298_J_per_mol / 1e3);
    out += '\n';
  }
  for (const auto& u : report.unknowns) {
    out += fmt::format("== enthalpy of formation of {} (298.15 K) from {} reaction{} ==\n", u.species,
                       u.reactions.size(), u.reactions.size() == 1 ? "" : "s");
    for (std::size_t i = 0; i < u.reactions.size(); ++i)
      out += fmt::format("  {:<40} {:>12.3f} kJ/mol\n", u.reactions[i], u.values_J_per_mol[i] / 1e3);
    out += fmt::format("  mean {:.3f} kJ/mol, standard deviation {:.3f}, range {:.3f} to {:.3f} kJ/mol\n\n",
                       u.spread.mean / 1e3, u.spread.standard_deviation / 1e3, u.spread.min / 1e3,
                       u.spread.max / 1e3);
  }
  return out;
}

std::string write_reaction_csv(const ReactionReport& report) {
  std::string out = "reaction,T_K,delta_H_kJ_per_mol,delta_S_J_per_mol_K,delta_G_kJ_per_mol,Kp,Kc\n";
  for (const auto& r : report.reactions)
    for (const auto& row : r.table.rows)
      out += fmt::format("{},{:.2f},{:.6f},{:.6f},{:.6f},{:.10e},{:.10e}\n", csv_field(r.table.name), row.T_K,
                         row.delta_H_J_per_mol / 1e3, row.delta_S_J_per_mol_K, row.delta_G_J_per_mol / 1e3,
                         row.Kp, row.Kc);
  return out;
}

std::string write_reaction_json(const ReactionReport& report) {
  nlohmann::ordered_json doc;
  doc["units"] = {{"T", "K"},
                  {"delta_H", "kJ/mol"},
                  {"delta_S", "J/(mol K)"},
                  {"delta_G", "kJ/mol"},
                  {"standard_state", report.standard_state},
                  {"Kp", "relative to the standard pressure of each reaction's Kp_reference_Pa"},
                  {"Kc", "relative to c° = 1 mol/L"},
                  {"E", "kJ/mol"}};
  doc["reactions"] = nlohmann::ordered_json::array();
  for (const auto& r : report.reactions) {
    const ReactionTable& t = r.table;
    nlohmann::ordered_json e;
    e["name"] = t.name;
    e["equation"] = t.equation;
    e["enthalpy_basis"] = enthalpy_basis_name(t.basis);
    e["delta_n"] = t.delta_n;
    e["Kp_reference_Pa"] = t.Kp_reference_Pa;
    e["rows"] = nlohmann::ordered_json::array();
    for (const auto& row : t.rows)
      e["rows"].push_back({{"T", row.T_K},
                           {"delta_H", row.delta_H_J_per_mol / 1e3},
                           {"delta_S", row.delta_S_J_per_mol_K},
                           {"delta_G", row.delta_G_J_per_mol / 1e3},
                           {"Kp", row.Kp},
                           {"Kc", row.Kc},
                           {"ln_Kp", row.ln_Kp},
                           {"ln_Kc", row.ln_Kc}});
    if (r.fit_Kp) e["ln_K_fit"]["Kp"] = fit_json(*r.fit_Kp);
    if (r.fit_Kc) e["ln_K_fit"]["Kc"] = fit_json(*r.fit_Kc);
    if (r.unknown)
      e["unknown"] = {{"species", r.unknown->species},
                      {"file", r.unknown->file},
                      {"delta_H_298", r.unknown->value.delta_rH298_J_per_mol / 1e3},
                      {"enthalpy_of_formation", r.unknown->value.dfH298_J_per_mol / 1e3}};
    doc["reactions"].push_back(e);
  }
  if (!report.unknowns.empty()) {
    doc["enthalpies_of_formation"] = nlohmann::ordered_json::array();
    for (const auto& u : report.unknowns) {
      nlohmann::ordered_json values = nlohmann::ordered_json::array();
      for (double v : u.values_J_per_mol) values.push_back(v / 1e3);
      doc["enthalpies_of_formation"].push_back({{"species", u.species},
                                                {"file", u.path},
                                                {"reactions", u.reactions},
                                                {"values", values},
                                                {"mean", u.spread.mean / 1e3},
                                                {"standard_deviation", u.spread.standard_deviation / 1e3},
                                                {"min", u.spread.min / 1e3},
                                                {"max", u.spread.max / 1e3}});
    }
  }
  return doc.dump(2) + '\n';
}

}  // namespace vibtherm
