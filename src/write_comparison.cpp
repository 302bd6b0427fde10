#include "vibtherm/write_comparison.hpp"

#include <fmt/format.h>

#include <nlohmann/json.hpp>

#include "vibtherm/markup.hpp"

namespace vibtherm {

std::string comparison_text(const std::vector<CurveComparison>& rows, const std::string& reference,
                            const std::string& other) {
  std::string out = fmt::format("Largest differences, {} minus {}\n", other, reference);
  out += fmt::format("{:<18} {:>15} {:>9} {:>8} {:>8} {:>10} {:>8} {:>9} {:>8} {:>4}\n", "species", "range",
                     "points", "dCp", "at", "dH", "at", "dS", "at", "H");
  out += fmt::format("{:<18} {:>15} {:>9} {:>8} {:>8} {:>10} {:>8} {:>9} {:>8} {:>4}\n", "", "K", "",
                     "J/mol/K", "K", "kJ/mol", "K", "J/mol/K", "K", "");
  for (const auto& r : rows)
    out += fmt::format("{:<18} {:>15} {:>9} {:>8.3f} {:>8.1f} {:>10.4f} {:>8.1f} {:>9.4f} {:>8.1f} {:>4}\n",
                       r.name, fmt::format("{:g}-{:g}", r.T_min_K, r.T_max_K), r.points,
                       r.Cp_J_per_mol_K.difference, r.Cp_J_per_mol_K.T_K, r.H_J_per_mol.difference / 1e3,
                       r.H_J_per_mol.T_K, r.S_J_per_mol_K.difference, r.S_J_per_mol_K.T_K,
                       r.H_absolute ? "abs" : "rel");
  out += "H: abs = absolute enthalpies compared; rel = H - H(298.15 K) (H(298.15 K) unknown on one side)\n";
  return out;
}

std::string comparison_csv(const std::vector<CurveComparison>& rows) {
  std::string out =
      "species,T_min_K,T_max_K,points,dCp_J_per_mol_K,dCp_at_K,dH_kJ_per_mol,dH_at_K,dS_J_per_mol_K,dS_at_K,"
      "H_absolute\n";
  for (const auto& r : rows)
    out += fmt::format("{},{},{},{},{:.6f},{},{:.6f},{},{:.6f},{},{}\n", csv_field(r.name), r.T_min_K,
                       r.T_max_K, r.points, r.Cp_J_per_mol_K.difference, r.Cp_J_per_mol_K.T_K,
                       r.H_J_per_mol.difference / 1e3, r.H_J_per_mol.T_K, r.S_J_per_mol_K.difference,
                       r.S_J_per_mol_K.T_K, r.H_absolute ? "true" : "false");
  return out;
}

std::string comparison_json(const std::vector<CurveComparison>& rows, const std::string& reference,
                            const std::string& other) {
  nlohmann::ordered_json j;
  j["reference"] = reference;
  j["other"] = other;
  j["units"] = {{"T", "K"}, {"Cp", "J/(mol K)"}, {"H", "kJ/mol"}, {"S", "J/(mol K)"}};
  j["species"] = nlohmann::ordered_json::array();
  for (const auto& r : rows) {
    auto d = [](const LargestDifference& x, double scale) {
      return nlohmann::ordered_json{{"difference", x.difference / scale}, {"T", x.T_K}};
    };
    j["species"].push_back({{"name", r.name},
                            {"T_min", r.T_min_K},
                            {"T_max", r.T_max_K},
                            {"points", r.points},
                            {"Cp", d(r.Cp_J_per_mol_K, 1.0)},
                            {"H", d(r.H_J_per_mol, 1e3)},
                            {"S", d(r.S_J_per_mol_K, 1.0)},
                            {"H_absolute", r.H_absolute}});
  }
  return j.dump(2) + '\n';
}

}  // namespace vibtherm
