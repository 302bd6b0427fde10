// NASA polynomial cases: a published NASA-7 record and our own rigid-rotor
// harmonic-oscillator fit, both against NIST-JANAF Cp (validation/nasa_reference_values.csv).
// Prints kind, T, polynomial Cp, published Cp, difference, tolerance and, for our fit, the
// fit's own error against the engine; fails (exit 1) past a tolerance.
#include <fmt/format.h>

#include <cmath>
#include <cstdio>
#include <fstream>
#include <sstream>
#include <string>
#include <vector>

#include "csv_lines.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/fit_nasa.hpp"
#include "vibtherm/read_nasa.hpp"
#include "vibtherm/read_species.hpp"

namespace {

using vibtherm::validation::split_csv;

}  // namespace

int main(int argc, char** argv) {
  if (argc != 2) {
    std::fprintf(stderr, "usage: compare_nasa VALIDATION_DIR\n");
    return 2;
  }
  const std::string dir = argv[1];
  std::ifstream in(dir + "/nasa_reference_values.csv");
  if (!in) {
    std::fprintf(stderr, "cannot read %s/nasa_reference_values.csv\n", dir.c_str());
    return 2;
  }
  int failures = 0, cases = 0;
  fmt::print("{:<9} {:<7} {:>7} {:>9} {:>9} {:>8} {:>5} {:>9}  {:<4} {}\n", "kind", "species", "T/K",
             "Cp poly", "JANAF", "diff", "tol", "fit err", "ok", "source");
  std::string line;
  try {
    while (std::getline(in, line)) {
      if (line.empty() || line[0] == '#') continue;
      const auto f = split_csv(line);
      if (f.size() != 6) {
        std::fprintf(stderr, "malformed line: %s\n", line.c_str());
        return 2;
      }
      const double T = std::stod(f[2]), published = std::stod(f[3]), tolerance = std::stod(f[4]);
      double ours = 0.0;
      std::string name, fit_error = "";
      if (f[0] == "published") {
        const auto colon = f[1].find(':');
        name = f[1].substr(colon + 1);
        for (const auto& p : vibtherm::read_nasa_file(dir + "/" + f[1].substr(0, colon)))
          if (vibtherm::polynomial_name(p) == name) ours = vibtherm::polynomial_at(p, T).Cp_J_per_mol_K();
      } else if (f[0] == "rrho_fit") {
        const auto prepared = vibtherm::prepare_species(vibtherm::read_species_file(dir + "/" + f[1]));
        name = prepared.species.name;
        const auto fit = vibtherm::fit_species(prepared, vibtherm::FitOptions{});
        ours = vibtherm::polynomial_at(fit.polynomial, T).Cp_J_per_mol_K();
        fit_error = fmt::format("{:+.4f}", ours - vibtherm::evaluate(prepared, T).Cp_J_per_mol_K);
      } else {
        std::fprintf(stderr, "unknown kind: %s\n", f[0].c_str());
        return 2;
      }
      const double diff = ours - published;
      const bool ok = ours > 0.0 && std::abs(diff) <= tolerance;
      ++cases;
      if (!ok) ++failures;
      fmt::print("{:<9} {:<7} {:>7.1f} {:>9.3f} {:>9.3f} {:>+8.3f} {:>5.2f} {:>9}  {:<4} {}\n", f[0], name, T,
                 ours, published, diff, tolerance, fit_error, ok ? "ok" : "FAIL", f[5]);
    }
  } catch (const std::exception& e) {
    std::fprintf(stderr, "%s\n", e.what());
    return 2;
  }
  fmt::print("\n{} passed, {} failed (Cp in J/(mol K); 'fit err' = our polynomial minus our engine)\n",
             cases - failures, failures);
  return failures == 0 && cases > 0 ? 0 : 1;
}
