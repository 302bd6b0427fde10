// Writers for thermodynamic tables: aligned text, CSV with units in the header, and JSON
// with the pinned keys (T, Cp, S, H_minus_H298, ...). Formatting only, no physics.
#pragma once

#include <cstddef>
#include <string>
#include <vector>

#include "vibtherm/thermo.hpp"
#include "vibtherm/tunnelling.hpp"

namespace vibtherm {

struct SpeciesTable {
  std::string name;
  std::string caption;  // one line shown above the text table (model summary)
  std::vector<ThermoPoint> rows;
  bool has_model_columns = true;  // Cv, H−H0 and the per-motion breakdown are known
  std::vector<TunnellingPoint> tunnelling;
  std::vector<std::string> notes;                // model notes (JSON "notes"): scale factors, treatments
  std::vector<std::string> conformer_files;      // ensembles: the conformers, in input order
  std::vector<std::vector<double>> populations;  // ensembles: per row, one population per conformer  //
                                                 // transition states: κ(T) per row, else empty
  bool has_cv = false;  // Cv known without the model columns (a gas polynomial: Cp − R)
  // Absolute H and G = H − TS per row (J/mol) when H(298.15 K) is known; else empty.
  std::vector<double> H_J_per_mol{}, G_J_per_mol{};
};

struct TableWriteOptions {
  bool breakdown = false;         // per-motion Cp, S, H−H0 (translation, rotation, vibration, electronic)
  bool absolute_columns = false;  // CSV header: H and G columns (filled where a table has them)
};

std::string table_text(const std::vector<SpeciesTable>& tables, const TableWriteOptions& options = {});
std::string table_csv(const std::vector<SpeciesTable>& tables, const TableWriteOptions& options = {});
std::string table_json(const std::vector<SpeciesTable>& tables, const TableWriteOptions& options = {});

// Streaming form, for batches too large to hold: table_begin, then one table_piece per
// species with table_separator between two pieces, then table_end(number of pieces). The
// functions above are exactly that, so both give the same bytes.
enum class TableFormat { text, csv, json };
std::string table_begin(TableFormat format, const TableWriteOptions& options = {});
std::string table_piece(TableFormat format, const SpeciesTable& table, const TableWriteOptions& options = {});
std::string table_separator(TableFormat format);
std::string table_end(TableFormat format, std::size_t count);
std::string write_table(TableFormat format, const std::vector<SpeciesTable>& tables,
                        const TableWriteOptions& options = {});

}  // namespace vibtherm
