// What a NASA fit shares between species: the grid, and for each breakpoint set it may use
// the Cp basis on that grid and the factorised continuity and 298.15 K constraints. Built
// once per run, then read (by any number of threads) for every species.
#pragma once

#include <memory>
#include <vector>

#include "vibtherm/fit_nasa.hpp"

namespace vibtherm {

class FitPlan {
 public:
  // The grid of the options (every grid_step_K from T_low to T_high plus every breakpoint).
  explicit FitPlan(const FitOptions& options);
  // Given sample temperatures (ascending), e.g. samples that do not come from the engine.
  FitPlan(const FitOptions& options, std::vector<double> grid_K);
  ~FitPlan();
  FitPlan(FitPlan&&) noexcept;
  FitPlan& operator=(FitPlan&&) noexcept;

  const FitOptions& options() const { return options_; }
  const std::vector<double>& grid_K() const { return grid_K_; }
  // Breakpoint sets: one, or one per `auto` candidate in ascending order.
  std::size_t candidate_count() const { return candidates_.size(); }
  const std::vector<double>& breakpoints_K(std::size_t candidate) const { return candidates_[candidate]; }
  // Least-squares solution for one breakpoint set; input.samples are on grid_K().
  std::vector<Nasa9Range> solve(std::size_t candidate, const FitInput& input) const;
  // The largest relative Cp error over the grid of that solution (what `auto` minimises),
  // without converting it to coefficients.
  double worst_Cp_relative(std::size_t candidate, const FitInput& input) const;
  // The candidate (index) whose solution has the smallest largest relative Cp error: every
  // candidate estimated from Givens factors of its ranges' weighted rows, gathered in one
  // pass per range (a few thousand operations each), then the `shortlist` best of those, and any within
  // 1e-6 of the best estimate, solved by QR as in worst_Cp_relative and compared exactly.
  // Estimates that disagree with the exact errors, a nearly singular candidate and the
  // NASA-9 form fall back to solving every candidate exactly. `worst` receives the chosen
  // one's error.
  std::size_t best_candidate(const FitInput& input, double& worst, std::size_t shortlist = 4) const;

  struct System;

 private:
  std::vector<Nasa9Range> solve(std::size_t candidate, const FitInput& input, double* worst_Cp) const;
  FitOptions options_;
  std::vector<double> grid_K_;
  std::vector<std::vector<double>> candidates_;
  std::vector<std::unique_ptr<const System>> systems_;
};

// The fit of fit_nasa.hpp on a plan built once for many species; identical results.
FitResult fit_samples(const FitInput& input, const FitPlan& plan);
SpeciesFit fit_species(const PreparedSpecies& prepared, const FitPlan& plan);

}  // namespace vibtherm
