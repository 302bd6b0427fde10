#include "vibtherm/write_table.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <array>
#include <nlohmann/json.hpp>
#include <string_view>

#include "vibtherm/constants.hpp"
#include "vibtherm/markup.hpp"

namespace vibtherm {

namespace {

constexpr double R = constants::gas_constant_J_per_mol_K;

constexpr const auto& motions = motion_parts;

// Text breakdown columns carry the motion's name, as in CSV and JSON ("Cp.hindered_rotors").
std::size_t column_width(const MotionPart& m) {
  return std::max<std::size_t>(8, 3 + std::string_view(m.name).size());
}

}  // namespace

namespace {

std::string text_piece(const SpeciesTable& table, const TableWriteOptions& options) {
  std::string out;
  {
    const bool model = table.has_model_columns;
    const bool breakdown = options.breakdown && model;
    out += fmt::format("== {} ==\n", table.name);
    if (!table.caption.empty()) out += table.caption + '\n';
    // Headings and a units line; widths are fixed so columns line up across species.
    std::string head = fmt::format("{:>9} {:>9}", "T", "Cp");
    std::string units = fmt::format("{:>9} {:>9}", "K", "J/mol/K");
    const bool cv = model || table.has_cv;
    const bool absolute = table.H_J_per_mol.size() == table.rows.size() &&
                          table.G_J_per_mol.size() == table.rows.size() && !table.rows.empty();
    if (cv) head += fmt::format(" {:>9}", "Cv"), units += fmt::format(" {:>9}", "J/mol/K");
    head += fmt::format(" {:>9} {:>10}", "S", "H-H298");
    units += fmt::format(" {:>9} {:>10}", "J/mol/K", "kJ/mol");
    if (model) head += fmt::format(" {:>9}", "H-H0"), units += fmt::format(" {:>9}", "kJ/mol");
    head += fmt::format(" {:>10} {:>11}", "G-H298", "-(G-H298)/T");
    units += fmt::format(" {:>10} {:>11}", "kJ/mol", "J/mol/K");
    if (absolute) {
      head += fmt::format(" {:>11} {:>11}", "H", "G");
      units += fmt::format(" {:>11} {:>11}", "kJ/mol", "kJ/mol");
    }
    if (breakdown) {
      for (const auto& m : motions) {
        const std::size_t w = column_width(m);
        head +=
            fmt::format(" {:>{}} {:>{}}", fmt::format("Cp.{}", m.name), w, fmt::format("S.{}", m.name), w);
        units += fmt::format(" {:>{}} {:>{}}", "J/mol/K", w, "J/mol/K", w);
      }
    }
    const bool kappa = table.tunnelling.size() == table.rows.size() && !table.rows.empty();
    if (kappa) {
      head += fmt::format(" {:>11} {:>11}", "kappa.Wig", "kappa.Eck");
      units += fmt::format(" {:>11} {:>11}", "1", "1");
    }
    const bool populations = table.populations.size() == table.rows.size() && !table.rows.empty();
    if (populations)
      for (std::size_t j = 0; j < table.conformer_files.size(); ++j) {
        head += fmt::format(" {:>8}", fmt::format("pop.{}", j + 1));
        units += fmt::format(" {:>8}", "1");
      }
    out += head + '\n' + units + '\n';
    for (std::size_t i = 0; i < table.rows.size(); ++i) {
      const auto& r = table.rows[i];
      std::string line = fmt::format("{:>9.2f} {:>9.3f}", r.T_K, r.Cp_J_per_mol_K);
      if (cv) line += fmt::format(" {:>9.3f}", r.Cv_J_per_mol_K);
      line += fmt::format(" {:>9.3f} {:>10.3f}", r.S_J_per_mol_K, r.H_minus_H298_J_per_mol / 1e3);
      if (model) line += fmt::format(" {:>9.3f}", r.H_minus_H0_J_per_mol / 1e3);
      line +=
          fmt::format(" {:>10.3f} {:>11.3f}", r.G_minus_H298_J_per_mol / 1e3, r.gibbs_function_J_per_mol_K);
      if (absolute)
        line += fmt::format(" {:>11.3f} {:>11.3f}", table.H_J_per_mol[i] / 1e3, table.G_J_per_mol[i] / 1e3);
      if (breakdown)
        for (const auto& m : motions)
          line += fmt::format(" {:>{}.3f} {:>{}.3f}", (r.*m.terms).Cp_over_R * R, column_width(m),
                              (r.*m.terms).S_over_R * R, column_width(m));
      if (kappa) {
        const TunnellingPoint& k = table.tunnelling[i];
        line += fmt::format(" {:>11.5g} {:>11}", k.wigner, k.eckart ? fmt::format("{:.5g}", *k.eckart) : "-");
      }
      if (populations)
        for (double x : table.populations[i]) line += fmt::format(" {:>8.4f}", x);
      out += line + '\n';
    }
    if (populations)
      for (std::size_t j = 0; j < table.conformer_files.size(); ++j)
        out +=
            fmt::format("pop.{}: population of conformer {} ({})\n", j + 1, j + 1, table.conformer_files[j]);
  }
  return out;
}

std::string csv_header(const TableWriteOptions& options) {
  const bool breakdown = options.breakdown;
  std::string out =
      "species,T_K,Cp_J_per_mol_K,Cv_J_per_mol_K,S_J_per_mol_K,H_minus_H298_kJ_per_mol,H_minus_H0_kJ_per_mol,"
      "G_minus_H298_kJ_per_mol,minus_G_minus_H298_over_T_J_per_mol_K";
  if (breakdown)
    for (const auto& m : motions)
      out += fmt::format(",Cp_{0}_J_per_mol_K,S_{0}_J_per_mol_K,H_minus_H0_{0}_kJ_per_mol", m.name);
  if (options.absolute_columns) out += ",H_kJ_per_mol,G_kJ_per_mol";
  // Tunnelling corrections of transition states; empty for other species (the header comes
  // before the species are known).
  out += ",kappa_wigner,kappa_eckart\n";
  return out;
}

std::string csv_piece(const SpeciesTable& table, const TableWriteOptions& options) {
  const bool breakdown = options.breakdown;
  std::string out;
  {
    const std::string name = csv_field(table.name);  // RFC 4180
    for (std::size_t i = 0; i < table.rows.size(); ++i) {
      const auto& r = table.rows[i];
      const bool model = table.has_model_columns;
      out += fmt::format("{},{},{:.6f},{},{:.6f},{:.6f},{},{:.6f},{:.6f}", name, r.T_K, r.Cp_J_per_mol_K,
                         model || table.has_cv ? fmt::format("{:.6f}", r.Cv_J_per_mol_K) : "",
                         r.S_J_per_mol_K, r.H_minus_H298_J_per_mol / 1e3,
                         model ? fmt::format("{:.6f}", r.H_minus_H0_J_per_mol / 1e3) : "",
                         r.G_minus_H298_J_per_mol / 1e3, r.gibbs_function_J_per_mol_K);
      if (breakdown)
        for (const auto& m : motions) {
          const MotionTerms& t = r.*m.terms;
          out += model ? fmt::format(",{:.6f},{:.6f},{:.6f}", t.Cp_over_R * R, t.S_over_R * R,
                                     t.H_over_RT * R * r.T_K / 1e3)
                       : std::string(",,,");
        }
      if (options.absolute_columns)
        out += i < table.H_J_per_mol.size() && i < table.G_J_per_mol.size()
                   ? fmt::format(",{:.6f},{:.6f}", table.H_J_per_mol[i] / 1e3, table.G_J_per_mol[i] / 1e3)
                   : std::string(",,");
      {
        const TunnellingPoint* k = i < table.tunnelling.size() ? &table.tunnelling[i] : nullptr;
        out += k ? fmt::format(",{:.8g},{}", k->wigner, k->eckart ? fmt::format("{:.8g}", *k->eckart) : "")
                 : std::string(",,");
      }
      out += '\n';
    }
  }
  return out;
}

// `value` dumped with an indent of 2, every line after the first shifted by `indent`
// spaces: the text dump(2) gives it as a member at that depth.
std::string indented_json(const nlohmann::ordered_json& value, int indent) {
  std::string text = value.dump(2);
  const std::string pad(static_cast<std::size_t>(indent), ' ');
  std::string out;
  out.reserve(text.size() + text.size() / 8);
  for (char c : text) {
    out += c;
    if (c == '\n') out += pad;  // JSON strings hold no raw line breaks: every one is layout
  }
  return out;
}

std::string json_begin() {
  nlohmann::ordered_json units = {{"T", "K"},
                                  {"Cp", "J/(mol K)"},
                                  {"Cv", "J/(mol K)"},
                                  {"S", "J/(mol K)"},
                                  {"H_minus_H298", "kJ/mol"},
                                  {"H_minus_H0", "kJ/mol"},
                                  {"G_minus_H298", "kJ/mol"},
                                  {"minus_G_minus_H298_over_T", "J/(mol K)"}};
  return "{\n  \"units\": " + indented_json(units, 2) + ",\n  \"species\": [";
}

std::string json_piece(const SpeciesTable& table, const TableWriteOptions& options) {
  {
    nlohmann::ordered_json entry;
    entry["name"] = table.name;
    if (!table.notes.empty()) entry["notes"] = table.notes;
    if (!table.conformer_files.empty()) entry["conformers"] = table.conformer_files;
    entry["rows"] = nlohmann::ordered_json::array();
    for (std::size_t i = 0; i < table.rows.size(); ++i) {
      const auto& r = table.rows[i];
      nlohmann::ordered_json row;
      row["T"] = r.T_K;
      row["Cp"] = r.Cp_J_per_mol_K;
      if (table.has_model_columns || table.has_cv) row["Cv"] = r.Cv_J_per_mol_K;
      row["S"] = r.S_J_per_mol_K;
      row["H_minus_H298"] = r.H_minus_H298_J_per_mol / 1e3;
      if (table.has_model_columns) row["H_minus_H0"] = r.H_minus_H0_J_per_mol / 1e3;
      row["G_minus_H298"] = r.G_minus_H298_J_per_mol / 1e3;
      row["minus_G_minus_H298_over_T"] = r.gibbs_function_J_per_mol_K;
      if (i < table.H_J_per_mol.size() && i < table.G_J_per_mol.size()) {
        row["H"] = table.H_J_per_mol[i] / 1e3;
        row["G"] = table.G_J_per_mol[i] / 1e3;
      }
      if (options.breakdown && table.has_model_columns) {
        for (const auto& m : motions) {
          const MotionTerms& t = r.*m.terms;
          row["motions"][m.name] = {{"Cp", t.Cp_over_R * R},
                                    {"Cv", t.Cv_over_R * R},
                                    {"S", t.S_over_R * R},
                                    {"H_minus_H0", t.H_over_RT * R * r.T_K / 1e3},
                                    {"ln_q", t.ln_q}};
        }
        if (!table.conformer_files.empty()) {
          const MotionTerms& t = r.conformers;
          row["motions"]["conformers"] = {{"Cp", t.Cp_over_R * R},
                                          {"Cv", t.Cv_over_R * R},
                                          {"S", t.S_over_R * R},
                                          {"H_minus_H0", t.H_over_RT * R * r.T_K / 1e3},
                                          {"ln_q", t.ln_q}};
        }
      }
      if (i < table.populations.size()) row["populations"] = table.populations[i];
      if (i < table.tunnelling.size()) {
        row["kappa_wigner"] = table.tunnelling[i].wigner;
        if (table.tunnelling[i].eckart) row["kappa_eckart"] = *table.tunnelling[i].eckart;
      }
      entry["rows"].push_back(row);
    }
    return "\n    " + indented_json(entry, 4);
  }
}

}  // namespace

std::string table_begin(TableFormat format, const TableWriteOptions& options) {
  if (format == TableFormat::csv) return csv_header(options);
  if (format == TableFormat::json) return json_begin();
  return "";
}

std::string table_piece(TableFormat format, const SpeciesTable& table, const TableWriteOptions& options) {
  if (format == TableFormat::csv) return csv_piece(table, options);
  if (format == TableFormat::json) return json_piece(table, options);
  return text_piece(table, options);
}

std::string table_separator(TableFormat format) {
  if (format == TableFormat::json) return ",";
  if (format == TableFormat::text) return "\n";
  return "";
}

std::string table_end(TableFormat format, std::size_t count) {
  if (format != TableFormat::json) return "";
  return count == 0 ? "]\n}\n" : "\n  ]\n}\n";
}

std::string write_table(TableFormat format, const std::vector<SpeciesTable>& tables,
                        const TableWriteOptions& options) {
  std::string out = table_begin(format, options);
  for (std::size_t k = 0; k < tables.size(); ++k) {
    if (k > 0) out += table_separator(format);
    out += table_piece(format, tables[k], options);
  }
  return out + table_end(format, tables.size());
}

std::string table_text(const std::vector<SpeciesTable>& tables, const TableWriteOptions& options) {
  return write_table(TableFormat::text, tables, options);
}
std::string table_csv(const std::vector<SpeciesTable>& tables, const TableWriteOptions& options) {
  return write_table(TableFormat::csv, tables, options);
}
std::string table_json(const std::vector<SpeciesTable>& tables, const TableWriteOptions& options) {
  return write_table(TableFormat::json, tables, options);
}

}  // namespace vibtherm
