// vibtherm eval --against: a NASA file compared with another NASA file or with the
// engine's tables for species files (matched by name).
#include "eval_compare.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <filesystem>
#include <map>

#include "common.hpp"
#include "vibtherm/nasa_compare.hpp"
#include "vibtherm/species_paths.hpp"
#include "vibtherm/write_comparison.hpp"

namespace vibtherm::cli {

namespace {

bool is_species_source(const std::string& path) {
  const std::string ext = lowercase_extension(path);
  return std::filesystem::is_directory(path) || is_species_extension(ext) || ext == ".list";
}

}  // namespace

std::vector<std::string> eval_inputs(const EvalOptions& o) {
  std::vector<std::string> files{o.file};
  if (o.against.empty()) return files;
  files.push_back(o.against);
  std::error_code ec;
  if (!o.output.empty() && o.output != "-" && std::filesystem::exists(o.output, ec) &&
      is_species_source(o.against)) {
    for (std::string& path : source_paths(expand_species_paths({o.against})))
      files.push_back(std::move(path));
    for (std::string& path : manifest_paths({o.against})) files.push_back(std::move(path));
  }
  return files;
}

std::string compare_output(const EvalOptions& o, const std::vector<const NasaPolynomial*>& chosen,
                           const std::vector<double>& asked) {
  std::vector<CurveComparison> rows;
  std::vector<std::string> unmatched;
  if (!is_species_source(o.against)) {
    const NasaFile other = read_for_eval(o.against, o.keep_going);
    std::map<std::string, const NasaPolynomial*> by_name;
    for (const auto& p : other.species) by_name.emplace(polynomial_name(p), &p);
    for (const NasaPolynomial* p : chosen) {
      const auto it = by_name.find(polynomial_name(*p));
      if (it == by_name.end()) {
        unmatched.push_back(polynomial_name(*p));
        continue;
      }
      const double lo = std::max(polynomial_T_min_K(*p), polynomial_T_min_K(*it->second));
      const double hi = std::min(polynomial_T_max_K(*p), polynomial_T_max_K(*it->second));
      const std::vector<double> grid = asked.empty() ? comparison_grid(lo, hi) : asked;
      if (grid.empty()) {
        spdlog::warn("{}: the two polynomials' ranges do not overlap: not compared", polynomial_name(*p));
        continue;
      }
      rows.push_back(compare_curves(polynomial_curve(*p, grid), polynomial_curve(*it->second, grid)));
    }
  } else {
    std::map<std::string, const NasaPolynomial*> by_name;
    for (const NasaPolynomial* p : chosen) by_name.emplace(polynomial_name(*p), p);
    std::map<std::string, CurveComparison> found;
    const ModelOptions model;
    for (const auto& path : expand_species_paths({o.against})) {
      std::vector<LogLine> log;
      const auto error = run_species(
          path, model,
          [&](const SpeciesInput& in, std::vector<LogLine>&) {
            const auto it = by_name.find(in.prepared.species.name);
            if (it == by_name.end() || found.count(it->first)) return;
            const NasaPolynomial& p = *it->second;
            const std::vector<double> grid =
                asked.empty() ? comparison_grid(polynomial_T_min_K(p), polynomial_T_max_K(p)) : asked;
            const ThermoCurve engine = table_curve(it->first, tabulate(in.prepared, grid),
                                                   in.prepared.species.enthalpy_of_formation_J_per_mol);
            found.emplace(it->first, compare_curves(polynomial_curve(p, grid), engine));
          },
          log);
      if (error) {
        if (!o.keep_going) throw *error;
        spdlog::error("{}", error->what());
      }
    }
    for (const NasaPolynomial* p : chosen) {
      const auto it = found.find(polynomial_name(*p));
      if (it == found.end())
        unmatched.push_back(polynomial_name(*p));
      else
        rows.push_back(it->second);
    }
  }
  for (const auto& name : unmatched) spdlog::warn("{}: not in {}: not compared", name, o.against);
  if (o.format == "json") return comparison_json(rows, o.file, o.against);
  if (o.format == "csv") return comparison_csv(rows);
  return comparison_text(rows, o.file, o.against);
}

}  // namespace vibtherm::cli
