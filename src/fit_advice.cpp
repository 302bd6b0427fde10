#include "vibtherm/fit_advice.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <limits>

namespace vibtherm {

namespace {

double worst_Cp_error(const FitResult& fit) {
  double worst = 0.0;
  for (const auto& e : fit.errors) worst = std::max(worst, e.max_Cp_relative);
  return worst;
}

}  // namespace

std::optional<FitPlan> searched_breakpoint_plan(const FitOptions& options) {
  if (options.form != NasaForm::nasa7 || options.range.auto_index >= 0 ||
      options.range.breakpoints_K.size() != 3)
    return std::nullopt;
  FitOptions searched = options;
  searched.range.breakpoints_K[1] = std::numeric_limits<double>::quiet_NaN();
  searched.range.auto_index = 1;
  return FitPlan(searched);
}

std::optional<std::string> searched_breakpoint_advice(const PreparedSpecies& prepared, const SpeciesFit& fit,
                                                      const FitPlan& searched) {
  const double threshold = searched.options().thresholds.Cp_relative;
  const double worst = worst_Cp_error(fit.fit);
  if (worst <= threshold) return std::nullopt;
  // The searched plan differs only in the middle breakpoint, so its grid is the fit's own:
  // the samples already tabulated are fitted again (the engine is not run twice).
  bool same_grid = searched.grid_K().size() == fit.input.samples.size();
  for (std::size_t i = 0; same_grid && i < fit.input.samples.size(); ++i)
    same_grid = fit.input.samples[i].T_K == searched.grid_K()[i];
  const FitResult other = same_grid ? fit_samples(fit.input, searched) : fit_species(prepared, searched).fit;
  const double best = worst_Cp_error(other);
  const auto& bp = other.breakpoints_K;
  const std::string range = fmt::format("--range {:g}:auto:{:g}", bp.front(), bp.back());
  if (best <= threshold)
    return fmt::format(
        "{}: {} would not warn: largest Cp error {:.3f} % with the middle breakpoint at {:g} K (against "
        "{:.3f} % "
        "at {:g} K)",
        fit.fit.name, range, 100 * best, bp[1], 100 * worst, fit.fit.breakpoints_K[1]);
  return fmt::format(
      "{}: {} does not clear the Cp warning either: {:.3f} % at best, middle breakpoint {:g} K", fit.fit.name,
      range, 100 * best, bp[1]);
}

}  // namespace vibtherm
