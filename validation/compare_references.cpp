// Reference-case runner: reads validation/reference_values.csv, computes each quantity
// with the engine from the species file, prints a comparison table and fails (exit 1)
// when any difference exceeds its stated tolerance.
#include <fmt/format.h>

#include <cmath>
#include <cstdio>
#include <fstream>
#include <sstream>
#include <string>
#include <vector>

#include "csv_lines.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/read_species.hpp"
#include "vibtherm/thermo.hpp"

namespace {

using vibtherm::validation::split_csv;

double quantity(const vibtherm::ThermoPoint& row, const std::string& name) {
  if (name == "S") return row.S_J_per_mol_K;
  if (name == "Cp") return row.Cp_J_per_mol_K;
  if (name == "H_minus_H0") return row.H_minus_H0_J_per_mol / 1e3;
  if (name == "H_minus_H298") return row.H_minus_H298_J_per_mol / 1e3;
  throw std::runtime_error("unknown quantity " + name);
}

}  // namespace

int main(int argc, char** argv) {
  if (argc != 2) {
    std::fprintf(stderr, "usage: compare_references VALIDATION_DIR\n");
    return 2;
  }
  const std::string dir = argv[1];
  std::ifstream in(dir + "/reference_values.csv");
  if (!in) {
    std::fprintf(stderr, "cannot read %s/reference_values.csv\n", dir.c_str());
    return 2;
  }
  int failures = 0, cases = 0;
  fmt::print("{:<8} {:<10} {:<9} {:>8} {:>11} {:>11} {:>9} {:>7}  {:<4} {}\n", "species", "quantity", "unit",
             "T/K", "ours", "published", "diff", "tol", "ok", "source");
  std::string line;
  while (std::getline(in, line)) {
    if (line.empty() || line[0] == '#') continue;
    const auto f = split_csv(line);
    if (f.size() != 7) {
      std::fprintf(stderr, "malformed line: %s\n", line.c_str());
      return 2;
    }
    try {
      const auto prepared = vibtherm::prepare_species(vibtherm::read_species_file(dir + "/species/" + f[0]));
      const double T = std::stod(f[2]), published = std::stod(f[3]), tolerance = std::stod(f[4]);
      const double ours = quantity(vibtherm::evaluate(prepared, T), f[1]);
      const double diff = ours - published;
      const bool ok = std::abs(diff) <= tolerance;
      ++cases;
      if (!ok) ++failures;
      fmt::print("{:<8} {:<10} {:<9} {:>8.2f} {:>11.4f} {:>11.4f} {:>+9.4f} {:>7.3f}  {:<4} {}\n",
                 prepared.species.name, f[1], f[5], T, ours, published, diff, tolerance, ok ? "ok" : "FAIL",
                 f[6]);
    } catch (const std::exception& e) {
      std::fprintf(stderr, "%s\n", e.what());
      return 2;
    }
  }
  fmt::print("\n{} passed, {} failed\n", cases - failures, failures);
  return failures == 0 && cases > 0 ? 0 : 1;
}
