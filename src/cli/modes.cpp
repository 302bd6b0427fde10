// vibtherm modes: per-mode activation and effective quadratic degrees of freedom versus T.
#include "vibtherm/modes.hpp"

#include <algorithm>
#include <memory>

#include "common.hpp"
#include "vibtherm/write_modes.hpp"
#include "vibtherm/write_modes_svg.hpp"

namespace vibtherm::cli {

namespace {

// Default temperatures: from where nearly every vibration is frozen to combustion temperatures.
std::vector<double> default_modes_temperatures() {
  return {50.0, 100.0, 200.0, 298.15, 500.0, 1000.0, 2000.0, 3000.0};
}

}  // namespace

void setup_modes(CLI::App& sub) {
  auto options = std::make_shared<CommonOptions>();
  auto thresholds = std::make_shared<ActivationThresholds>();
  auto svg_path = std::make_shared<std::string>();
  add_common_options(sub, *options, true, {"text", "csv", "json"});
  sub.add_option("--frozen-below", thresholds->frozen_below_Cv_over_R,
                 "a mode is frozen while its Cv/R is below this (fraction of its classical value)")
      ->capture_default_str();
  sub.add_option("--active-above", thresholds->active_above_Cv_over_R,
                 "a mode is active once its Cv/R is above this; partial in between")
      ->capture_default_str();
  sub.add_option(
      "--svg", *svg_path,
      "also draw a heat map of mode activation and the curve F(T) to this SVG file ('-' = standard "
      "output); it spans the requested temperatures, widened to at least one decade");
  sub.callback([options, thresholds, svg_path] {
    validate(*thresholds);
    const auto temps = temperatures_or(*options, default_modes_temperatures());
    const auto paths = batch_paths(*options);
    check_output_is_not_input(options->output, *options, paths, "-o");
    check_output_is_not_input(*svg_path, *options, paths, "--svg");
    if (!svg_path->empty() && *svg_path == options->output)
      fail({}, "-o and --svg name the same file, expected two different outputs");
    // Both outputs are opened first and moved into place together at the end.
    OutputSet outputs;
    const std::size_t out = outputs.add(options->output);
    const std::size_t svg = svg_path->empty() ? 0 : outputs.add(*svg_path);
    const auto [low, high] = svg_temperature_span_K(temps);
    options->max_temperature_K = std::max(high, *std::max_element(temps.begin(), temps.end()));
    const auto samples = log_spaced_temperatures(low, high, svg_samples_per_species);
    std::vector<ModesReport> reports, dense;
    using Pair = std::pair<ModesReport, std::optional<ModesReport>>;
    const BatchSummary batch = for_each_species<Pair>(
        *options, paths,
        [&](const SpeciesInput& in, std::vector<LogLine>&) {
          Pair p{analyse_modes(in.prepared, temps, *thresholds), std::nullopt};
          if (!svg_path->empty()) p.second = analyse_modes(in.prepared, samples, *thresholds);
          return p;
        },
        [&](Pair& p) {
          reports.push_back(std::move(p.first));
          if (p.second) dense.push_back(std::move(*p.second));
        });
    const std::string& f = options->format;
    outputs.write(out, f == "json"  ? modes_to_json(reports)
                       : f == "csv" ? modes_to_csv(reports)
                                    : modes_to_text(reports));
    if (!svg_path->empty()) outputs.write(svg, modes_to_svg(dense));
    throw Exit{finish_batch(batch, outputs)};
  });
}

}  // namespace vibtherm::cli
