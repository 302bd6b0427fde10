// vibtherm report: one self-contained HTML page for one or many species.
#include "vibtherm/report.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <iostream>
#include <memory>

#include "common.hpp"
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
  sub.footer(
      "Writes report.html unless -o says otherwise ('-' = standard output). Default table temperatures: "
      "298.15, 500, 1000, 1500, 2000, 3000 K.");
  sub.callback([o] {
    ReportOptions report;
    report.temperatures_K = temperatures_or(o->common, default_report_temperatures());
    report.fit.form = NasaForm::nasa7;
    report.fit.range =
        o->range.empty() ? default_fit_range(NasaForm::nasa7) : parse_fit_range(o->range, NasaForm::nasa7);
    report.fit.allow_missing_hf = o->allow_missing_hf;

    Batch batch = load_batch(o->common);
    log_species_diagnostics(batch);
    std::vector<ReportSpecies> species;
    for (const auto& p : batch.species) {
      try {
        species.push_back(gather_report_species(p, report));
        if (!species.back().input_file.empty())
          species.back().input_sha256 = file_sha256(species.back().input_file);
        if (!species.back().fit) spdlog::warn("{}: {}", p.species.name, species.back().not_fitted_reason);
      } catch (const InputError& e) {
        if (!o->common.keep_going) throw;
        batch.failures.push_back(e.what());
        std::cerr << e.what() << '\n';
      }
    }
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
    write_output(o->common.output,
                 write_report_html(species, header,
                                   {o->axis == "linear" ? TemperatureAxis::linear : TemperatureAxis::log}));
    throw Exit{batch_status(batch)};
  });
}

}  // namespace vibtherm::cli
