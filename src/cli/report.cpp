// vibtherm report: one self-contained HTML page for one or many species.
#include "vibtherm/report.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <iostream>
#include <memory>

#include "common.hpp"
#include "vibtherm/checksum.hpp"
#include "vibtherm/fit_advice.hpp"
#include "vibtherm/write_modes_svg.hpp"
#include "vibtherm/write_report.hpp"

namespace vibtherm::cli {

namespace {

struct ReportCliOptions {
  CommonOptions common;
  std::string range;
  std::string axis = "log";
  bool allow_missing_hf = false;
};

// Thermo table rows when --temps is absent: the reference point and a few combustion-range values.
std::vector<double> default_report_temperatures() { return {298.15, 500.0, 1000.0, 1500.0, 2000.0, 3000.0}; }

std::string standard_state_text(const ModelOptions& m) {
  if (m.standard_state == StandardState::molar) return "c° = 1 mol/L";
  if (m.pressure_Pa == constants::bar_Pa) return "p° = 1 bar";
  if (m.pressure_Pa == constants::atmosphere_Pa) return "p° = 1 atm";
  return fmt::format("p = {:g} Pa", m.pressure_Pa);
}

}  // namespace

void setup_report(CLI::App& sub) {
  auto o = std::make_shared<ReportCliOptions>();
  o->common.output = "report.html";
  add_common_options(sub, o->common, true, {});
  sub.add_option("--range", o->range,
                 "NASA-7 fit breakpoints TLOW:TMID:THIGH in K (default 200:1000:3000; TMID may be 'auto')");
  sub.add_option("--t-axis", o->axis, "temperature axis of the Cp(T) pictures")
      ->check(CLI::IsMember({"log", "linear"}))
      ->capture_default_str();
  sub.add_flag("--allow-missing-hf", o->allow_missing_hf,
               "report species without enthalpy_of_formation, their NASA part marked as not fitted");
  sub.footer("Writes report.html unless -o says otherwise ('-' = standard output).");
  sub.callback([o] {
    ReportOptions report;
    report.temperatures_K = temperatures_or(o->common, default_report_temperatures());
    report.fit.form = NasaForm::nasa7;
    report.fit.range =
        o->range.empty() ? default_fit_range(NasaForm::nasa7) : parse_fit_range(o->range, NasaForm::nasa7);
    report.fit.allow_missing_hf = o->allow_missing_hf;
    // The pictures span the table temperatures and the fit range, widened to a decade.
    std::vector<double> wanted = report.temperatures_K;
    wanted.push_back(report.fit.range.breakpoints_K.front());
    wanted.push_back(report.fit.range.breakpoints_K.back());
    o->common.max_temperature_K =
        std::max(svg_temperature_span_K(wanted).second, *std::max_element(wanted.begin(), wanted.end()));

    const auto paths = batch_paths(o->common);
    check_output_is_not_input(o->common.output, o->common, paths, "-o");
    OutputSet outputs;
    const std::size_t out = outputs.add(o->common.output);
    std::vector<ReportSpecies> species;
    const std::optional<FitPlan> searched =
        searched_breakpoint_plan(report.fit);  // for the Cp-warning advice
    const BatchSummary batch = for_each_species<ReportSpecies>(
        o->common, paths,
        [&](const SpeciesInput& in, std::vector<LogLine>& log) {
          ReportSpecies r = gather_report_species(in.prepared, report);
          r.input_file = in.path;
          r.input_sha256 = sha256_hex(in.bytes);
          if (r.fit && searched)
            if (auto advice = searched_breakpoint_advice(in.prepared, *r.fit, *searched)) {
              r.fit->fit.warnings.push_back(*advice);
              ++r.warning_count;
              log.push_back({spdlog::level::warn, *advice});
            }
          if (r.fit) r.fit->input = {};  // the samples served the advice; the batch keeps only results
          if (!r.fit)
            log.push_back(
                {spdlog::level::warn, fmt::format("{}: {}", in.prepared.species.name, r.not_fitted_reason)});
          return r;
        },
        [&](ReportSpecies& r) { species.push_back(std::move(r)); });
    const ModelOptions model = model_options(o->common);
    const auto& bp = report.fit.range.breakpoints_K;
    ReportHeader header{
        VIBTHERM_VERSION,
        {"model: ideal gas (adsorbates: harmonic modes only), rigid rotor, harmonic oscillators, "
         "vibrational energies counted from the zero-point level",
         fmt::format("standard state: {}; frequency scale factor {:g}", standard_state_text(model),
                     model.frequency_scale),
         fmt::format(
             "NASA-7 fit: {:g} to {:g} K, breakpoint {}; H(298.15 K) = ΔfH° from the input", bp.front(),
             bp.back(),
             report.fit.range.auto_index >= 0 ? std::string("searched") : fmt::format("{:g} K", bp[1]))},
        {{"--temps", o->common.temps_text.empty() ? "default: 298.15, 500, 1000, 1500, 2000, 3000 K"
                                                  : o->common.temps_text},
         {"--range", o->range.empty() ? "default: 200:1000:3000" : o->range},
         {"--standard-state", o->common.standard_state},
         {"--pressure", o->common.pressure_text.empty() ? "the standard state" : o->common.pressure_text},
         {"--scale", fmt::format("{:g}", o->common.frequency_scale)},
         {"--transition-state", o->common.transition_state ? "on" : "off"},
         {"--imaginary-as-real-below", fmt::format("{:g} cm⁻¹", o->common.imaginary_as_real_below_cm1)},
         {"--allow-mode-count-mismatch", o->common.mode_count_warning ? "on" : "off"},
         {"--allow-missing-hf", o->allow_missing_hf ? "on" : "off"},
         {"--t-axis", o->axis}}};
    outputs.write(out,
                  write_report_html(species, header,
                                    {o->axis == "linear" ? TemperatureAxis::linear : TemperatureAxis::log}));
    throw Exit{finish_batch(batch, outputs)};
  });
}

}  // namespace vibtherm::cli
