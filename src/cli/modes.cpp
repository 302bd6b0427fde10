// vibtherm modes: per-mode activation and effective quadratic degrees of freedom versus T.
#include "vibtherm/modes.hpp"

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
  sub.footer("Default temperatures: 50, 100, 200, 298.15, 500, 1000, 2000, 3000 K.");
  sub.callback([options, thresholds, svg_path] {
    validate(*thresholds);
    const auto temps = temperatures_or(*options, default_modes_temperatures());
    const Batch batch = load_batch(*options);
    log_species_diagnostics(batch);
    std::vector<ModesReport> reports;
    for (const auto& p : batch.species) reports.push_back(analyse_modes(p, temps, *thresholds));
    const std::string& f = options->format;
    const std::string content = f == "json"  ? modes_to_json(reports)
                                : f == "csv" ? modes_to_csv(reports)
                                             : modes_to_text(reports);
    std::string picture;
    if (!svg_path->empty()) {
      const auto [low, high] = svg_temperature_span_K(temps);
      const auto samples = log_spaced_temperatures(low, high, svg_samples_per_species);
      std::vector<ModesReport> dense;
      for (const auto& p : batch.species) dense.push_back(analyse_modes(p, samples, *thresholds));
      picture = modes_to_svg(dense);
    }
    // Both outputs are complete before either is written.
    write_output(options->output, content);
    if (!svg_path->empty()) write_output(*svg_path, picture);
    throw Exit{batch_status(batch)};
  });
}

}  // namespace vibtherm::cli
