// Reaction reference runner: reads validation/reaction_reference_values.csv, computes Kp of
// each reaction file from its species, prints ours beside the published log10 Kp with the
// difference (also as ΔrG°), and fails (exit 1) past a stated tolerance.
#include <fmt/format.h>

#include <cmath>
#include <cstdio>
#include <fstream>
#include <sstream>
#include <string>
#include <vector>

#include "csv_lines.hpp"
#include "vibtherm/constants.hpp"
#include "vibtherm/reaction.hpp"
#include "vibtherm/read_reaction.hpp"
#include "vibtherm/read_species.hpp"

int main(int argc, char** argv) {
  if (argc != 2) {
    std::fprintf(stderr, "usage: compare_reactions VALIDATION_DIR\n");
    return 2;
  }
  const std::string dir = argv[1];
  std::ifstream in(dir + "/reaction_reference_values.csv");
  if (!in) {
    std::fprintf(stderr, "cannot read %s/reaction_reference_values.csv\n", dir.c_str());
    return 2;
  }
  int failures = 0, cases = 0;
  fmt::print("{:<20} {:>8} {:>10} {:>10} {:>8} {:>10} {:>6}  {:<4} {}\n", "reaction", "T/K", "log10Kp",
             "published", "diff", "dG diff", "tol", "ok", "source");
  std::string line;
  while (std::getline(in, line)) {
    if (line.empty() || line[0] == '#') continue;
    const auto f = vibtherm::validation::split_csv(line);
    if (f.size() != 5) {
      std::fprintf(stderr, "malformed line: %s\n", line.c_str());
      return 2;
    }
    try {
      const vibtherm::ReactionFile file = vibtherm::read_reaction_file(dir + "/reactions/" + f[0]);
      vibtherm::Reaction reaction{file.name, file.origin, {}};
      for (const auto& t : file.terms)
        reaction.terms.push_back(
            {t.file, vibtherm::prepare_species(vibtherm::read_species_file(t.path)), t.coefficient});
      const double T = std::stod(f[1]), published = std::stod(f[2]), tolerance = std::stod(f[3]);
      const vibtherm::ReactionRow row = vibtherm::reaction_table(reaction, {T}).rows.at(0);
      const double ours = row.ln_Kp / std::log(10.0);
      const double diff = ours - published;
      // The same difference as ΔrG° in kJ/mol: −RT ln 10 · Δlog10 Kp.
      const double dG = -vibtherm::constants::gas_constant_J_per_mol_K * T * std::log(10.0) * diff / 1e3;
      const bool ok = std::abs(diff) <= tolerance;
      ++cases;
      if (!ok) ++failures;
      fmt::print("{:<20} {:>8.2f} {:>10.4f} {:>10.4f} {:>+8.4f} {:>+10.3f} {:>6.3f}  {:<4} {}\n", file.name,
                 T, ours, published, diff, dG, tolerance, ok ? "ok" : "FAIL", f[4]);
    } catch (const std::exception& e) {
      std::fprintf(stderr, "%s\n", e.what());
      return 2;
    }
  }
  // The reaction route: several reactions for one unknown, their values, mean and spread.
  std::ifstream hf(dir + "/formation_reference_values.csv");
  if (!hf) {
    std::fprintf(stderr, "cannot read %s/formation_reference_values.csv\n", dir.c_str());
    return 2;
  }
  fmt::print("\n{:<28} {:>10} {:>10} {:>8} {:>6}  {:<4} {}\n", "enthalpy of formation", "kJ/mol", "published",
             "diff", "tol", "ok", "source");
  while (std::getline(hf, line)) {
    if (line.empty() || line[0] == '#') continue;
    const auto f = vibtherm::validation::split_csv(line);
    if (f.size() != 4) {
      std::fprintf(stderr, "malformed line: %s\n", line.c_str());
      return 2;
    }
    try {
      std::vector<double> values;
      std::string unknown;
      std::stringstream files(f[0]);
      std::string name;
      while (std::getline(files, name, ';')) {
        const vibtherm::ReactionFile file = vibtherm::read_reaction_file(dir + "/formation/" + name);
        vibtherm::Reaction reaction{file.name, file.origin, {}};
        for (const auto& t : file.terms)
          reaction.terms.push_back(
              {t.file, vibtherm::prepare_species(vibtherm::read_species_file(t.path)), t.coefficient});
        const double v =
            vibtherm::solve_unknown_formation(reaction, file.unknown.value()).dfH298_J_per_mol / 1e3;
        unknown = reaction.terms[*file.unknown].prepared.species.name;
        fmt::print("  {:<26} {:>10.3f}\n", file.name, v);
        values.push_back(v);
      }
      const vibtherm::Spread spread = vibtherm::spread_of(values);
      const double published = std::stod(f[1]), tolerance = std::stod(f[2]);
      const double diff = spread.mean - published;
      const bool ok = std::abs(diff) <= tolerance;
      ++cases;
      if (!ok) ++failures;
      fmt::print("{:<28} {:>10.3f} {:>10.3f} {:>+8.3f} {:>6.2f}  {:<4} {}\n",
                 fmt::format("{} mean (sd {:.2f})", unknown, spread.standard_deviation), spread.mean,
                 published, diff, tolerance, ok ? "ok" : "FAIL", f[3]);
    } catch (const std::exception& e) {
      std::fprintf(stderr, "%s\n", e.what());
      return 2;
    }
  }
  fmt::print("\n{} passed, {} failed\n", cases - failures, failures);
  return failures == 0 && cases > 0 ? 0 : 1;
}
