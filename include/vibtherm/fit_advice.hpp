// Completes the warning of a NASA-7 fit with a fixed middle breakpoint: whether searching that
// breakpoint (`--range TLOW:auto:THIGH`) would bring the largest Cp error under its threshold.
#pragma once

#include <optional>
#include <string>

#include "vibtherm/fit_plan.hpp"

namespace vibtherm {

// The plan with the middle breakpoint searched, for a NASA-7 fit whose three breakpoints are
// all fixed; nullopt otherwise (NASA-9, or `auto` already asked for). Build once per run.
std::optional<FitPlan> searched_breakpoint_plan(const FitOptions& options);

// One line for a fit whose Cp error warns: what the searched breakpoint gives, and whether it
// would warn. nullopt when the fit's Cp error is within its threshold.
std::optional<std::string> searched_breakpoint_advice(const PreparedSpecies& prepared, const SpeciesFit& fit,
                                                      const FitPlan& searched);

}  // namespace vibtherm
