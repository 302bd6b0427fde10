#include "vibtherm/fit_advice.hpp"

#include <doctest/doctest.h>
#include <fmt/format.h>

#include <algorithm>
#include <string>

#include "test_species.hpp"

using namespace vibtherm;

namespace {

double worst(const FitResult& fit) {
  double w = 0.0;
  for (const auto& e : fit.errors) w = std::max(w, e.max_Cp_relative);
  return w;
}

}  // namespace

TEST_CASE("searched-breakpoint advice: only for a fixed NASA-7 middle breakpoint") {
  FitOptions nasa7;
  CHECK(searched_breakpoint_plan(nasa7).has_value());
  FitOptions searched = nasa7;
  searched.range = parse_fit_range("200:auto:3000", NasaForm::nasa7);
  CHECK_FALSE(searched_breakpoint_plan(searched).has_value());
  FitOptions nine;
  nine.form = NasaForm::nasa9;
  nine.range = default_fit_range(NasaForm::nasa9);
  CHECK_FALSE(searched_breakpoint_plan(nine).has_value());
}

TEST_CASE("searched-breakpoint advice quotes the searched fit, and is silent without a Cp warning") {
  const PreparedSpecies water = prepare_species(test::water());
  FitOptions options;
  const SpeciesFit fixed = fit_species(water, options);
  // A threshold just under the fixed fit's error makes it warn.
  options.thresholds.Cp_relative = 0.9 * worst(fixed.fit);
  const auto plan = searched_breakpoint_plan(options);
  REQUIRE(plan.has_value());
  const auto advice = searched_breakpoint_advice(water, fixed, *plan);
  REQUIRE(advice.has_value());
  CHECK(advice->find("--range 200:auto:3000") != std::string::npos);
  // The percentage quoted is that of the searched fit computed directly.
  FitOptions direct = options;
  direct.range = parse_fit_range("200:auto:3000", NasaForm::nasa7);
  const SpeciesFit auto_fit = fit_species(water, direct);
  CHECK(advice->find(fmt::format("{:.3f} %", 100 * worst(auto_fit.fit))) != std::string::npos);
  CHECK((worst(auto_fit.fit) <= options.thresholds.Cp_relative) ==
        (advice->find("would not warn") != std::string::npos));
  options.thresholds.Cp_relative = 1.1 * worst(fixed.fit);
  CHECK_FALSE(searched_breakpoint_advice(water, fixed, *searched_breakpoint_plan(options)).has_value());
}
