// vibtherm eval: tabulates the species of an existing NASA-7 / NASA-9 file with the
// `table` columns a polynomial determines (plus absolute H and G), or compares the file
// with another NASA file or with species files (--against).
#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <iostream>
#include <memory>

#include "common.hpp"
#include "eval_compare.hpp"
#include "vibtherm/nasa.hpp"
#include "vibtherm/nasa_checks.hpp"
#include "vibtherm/read_nasa.hpp"
#include "vibtherm/temperatures.hpp"
#include "vibtherm/write_table.hpp"

namespace vibtherm::cli {

namespace {

std::string caption(const NasaPolynomial& p) {
  if (const auto* n7 = std::get_if<Nasa7>(&p))
    return fmt::format("NASA-7 polynomial, {:g}-{:g}-{:g} K, phase {}", n7->T_low_K, n7->T_mid_K,
                       n7->T_high_K, n7->phase);
  const auto& n9 = std::get<Nasa9>(p);
  std::string bp = fmt::format("{:g}", n9.T_min_K());
  for (const auto& r : n9.ranges) bp += fmt::format("-{:g}", r.T_high_K);
  return fmt::format("NASA-9 polynomial, {} K", bp);
}

}  // namespace

NasaFile read_for_eval(const std::string& path, bool keep_going) {
  NasaFile file = read_nasa_records_file(path);
  for (const auto& w : file.warnings) spdlog::warn("{}", w);
  for (std::size_t k = 0; k < file.species.size(); ++k)
    for (const auto& w : nasa_sanity_warnings(file.species[k]))
      spdlog::warn("{}:{}: species '{}': {}", path, file.lines[k], polynomial_name(file.species[k]), w);
  if (!file.errors.empty() && !keep_going) {
    // One error line (design.md section 7): the first bad record, and how many more there are.
    const InputError& first = file.errors.front();
    if (file.errors.size() == 1) throw first;
    throw InputError(first.where(), fmt::format("{} (and {} more bad record{}: --keep-going lists them and "
                                                "tabulates the good ones)",
                                                first.message(), file.errors.size() - 1,
                                                file.errors.size() == 2 ? "" : "s"));
  }
  for (const auto& e : file.errors) std::cerr << e.what() << '\n';
  if (file.species.empty()) {
    spdlog::error("{}: no species could be read: no output written", path);
    throw Exit{exit_some_failed};
  }
  return file;
}

std::vector<const NasaPolynomial*> choose_species(const NasaFile& file, const std::vector<std::string>& names,
                                                  const std::string& path) {
  std::vector<const NasaPolynomial*> chosen;
  const auto& all = file.species;
  if (names.empty()) {
    for (const auto& p : all) chosen.push_back(&p);
    return chosen;
  }
  for (const auto& name : names) {
    const NasaPolynomial* found = nullptr;
    for (const auto& p : all)  // duplicates are already dropped: the first record
      if (!found && polynomial_name(p) == name) found = &p;
    if (!found) {
      std::string list;
      for (std::size_t k = 0; k < all.size() && k < 10; ++k)
        list += (k ? ", " : "") + polynomial_name(all[k]);
      fail({path, 0, 0}, fmt::format("--species '{}': not in the file (it holds {}{})", name, list,
                                     all.size() > 10 ? ", ..." : ""));
    }
    chosen.push_back(found);
  }
  return chosen;
}

void setup_eval(CLI::App& sub) {
  auto o = std::make_shared<EvalOptions>();
  sub.add_option("file", o->file, "NASA-7 or NASA-9 thermo file (or a mechanism file with a THERMO section)")
      ->required();
  sub.add_option("--species", o->species, "species to tabulate (repeatable; default: all, in file order)");
  sub.add_option(
      "--temps", o->temps_text,
      "temperatures in K: list '298.15,500' and/or ranges 'START:STOP:STEP' (default: 298.15 K and "
      "300-3000 K every 100 K, within each polynomial's range; with --against: the common range every 10 K)");
  sub.add_option("--against", o->against,
                 "compare with another NASA file, or with species files (.yaml, .yml, .xyz, a directory or a "
                 "manifest) computed by the engine: per species the largest differences in Cp, H and S");
  sub.add_option("--format", o->format, "output format")
      ->check(CLI::IsMember({"text", "csv", "json"}))
      ->capture_default_str();
  sub.add_option("-o,--output", o->output, "output file ('-' = standard output)")->capture_default_str();
  sub.add_flag("--keep-going", o->keep_going,
               "tabulate the good records of a file with bad ones (each bad record is reported), exit 1");
  add_jobs_option(sub, o->jobs);
  sub.callback([o] {
    check_output_is_not_input(o->output, eval_inputs(*o), "-o");
    OutputSet outputs;
    const std::size_t out = outputs.add(o->output);
    const NasaFile file = read_for_eval(o->file, o->keep_going);
    const auto chosen = choose_species(file, o->species, o->file);
    const std::vector<double> asked =
        o->temps_text.empty() ? std::vector<double>{} : parse_temperatures(o->temps_text);
    if (!o->against.empty()) {
      outputs.write(out, compare_output(*o, chosen, asked));
    } else {
      std::vector<SpeciesTable> tables;
      for (const NasaPolynomial* p : chosen) {
        const std::string& name = polynomial_name(*p);
        std::vector<double> temps;
        if (asked.empty()) {
          for (double T : default_table_temperatures())
            if (polynomial_in_range(*p, T)) temps.push_back(T);
        } else {
          temps = asked;
          for (double T : temps)
            if (!polynomial_in_range(*p, T))
              spdlog::warn("{}: {:g} K is outside the polynomial's range {:g}-{:g} K (extrapolated)", name, T,
                           polynomial_T_min_K(*p), polynomial_T_max_K(*p));
        }
        SpeciesTable table;
        table.name = name;
        table.caption = caption(*p);
        table.has_model_columns = false;
        table.has_cv = polynomial_is_gas(*p);
        for (double T : temps) {
          const ThermoPoint row = polynomial_table_row(*p, T);
          // The polynomial's enthalpy is absolute (H(298.15 K) = ΔfH°, design.md section 6).
          const double H = polynomial_at(*p, T).H_J_per_mol();
          table.rows.push_back(row);
          table.H_J_per_mol.push_back(H);
          table.G_J_per_mol.push_back(H - T * row.S_J_per_mol_K);  // G = H − TS
        }
        tables.push_back(std::move(table));
      }
      const std::string& f = o->format;
      TableWriteOptions options;
      options.absolute_columns = true;
      outputs.write(out, f == "json"  ? table_json(tables, options)
                         : f == "csv" ? table_csv(tables, options)
                                      : table_text(tables, options));
    }
    if (!file.errors.empty()) {
      spdlog::error("{}: {} bad record{} left out; {} species read", o->file, file.errors.size(),
                    file.errors.size() == 1 ? "" : "s", file.species.size());
      outputs.commit();
      throw Exit{exit_some_failed};
    }
    outputs.commit();
  });
}

}  // namespace vibtherm::cli
