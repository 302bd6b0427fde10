// vibtherm fit: NASA-7 / NASA-9 polynomials (or their JSON form) for one or many species.
#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <iostream>
#include <memory>

#include "common.hpp"
#include "vibtherm/checksum.hpp"
#include "vibtherm/fit_advice.hpp"
#include "vibtherm/fit_nasa.hpp"
#include "vibtherm/fit_plan.hpp"
#include "vibtherm/write_fit_json.hpp"
#include "vibtherm/write_nasa7.hpp"
#include "vibtherm/write_nasa9.hpp"

namespace vibtherm::cli {

namespace {

struct FitCliOptions {
  CommonOptions common;
  std::string form = "nasa7";
  std::string range;
  bool allow_missing_hf = false;
  bool cp_slope = false;
  double grid_step_K = 5.0;
  bool no_wrapper = false;
};

std::vector<std::pair<std::string, std::string>> model_option_list(const FitCliOptions& o) {
  return {{"standard_state", o.common.standard_state},
          {"pressure", o.common.pressure_text.empty() ? "standard state" : o.common.pressure_text},
          {"frequency_scale", fmt::format("{:g}", o.common.frequency_scale)},
          {"transition_state", o.common.transition_state ? "true" : "false"},
          {"imaginary_as_real_below_cm1", fmt::format("{:g}", o.common.imaginary_as_real_below_cm1)},
          {"allow_missing_hf", o.allow_missing_hf ? "true" : "false"},
          {"symmetry_tolerance_angstrom", fmt::format("{:g}", o.common.symmetry_tolerance_angstrom)}};
}

void log_fit(const SpeciesFit& f, std::vector<LogLine>& log) {
  const FitResult& r = f.fit;
  std::string ranges;
  for (const auto& e : r.errors)
    ranges += fmt::format(
        "; {:g}-{:g} K: Cp max {:.3f} % rms {:.3f} %, H max {:.3f} kJ/mol, S max {:.4f} J/(mol K)", e.T_low_K,
        e.T_high_K, 100 * e.max_Cp_relative, 100 * e.rms_Cp_relative, e.max_H_J_per_mol / 1e3,
        e.max_S_J_per_mol_K);
  log.push_back({spdlog::level::info, fmt::format("{}: fit{}", r.name, ranges)});
  if (r.searched_index >= 0)
    log.push_back({spdlog::level::info,
                   fmt::format("{}: breakpoint searched: {:g} K (largest Cp error {:.3f} %)", r.name,
                               r.breakpoints_K[r.searched_index], 100 * r.searched_max_Cp_relative)});
  for (const auto& w : r.warnings) log.push_back({spdlog::level::warn, w});
  for (const auto& n : f.notes) log.push_back({spdlog::level::warn, fmt::format("{}: {}", r.name, n)});
}

}  // namespace

void setup_fit(CLI::App& sub) {
  auto o = std::make_shared<FitCliOptions>();
  add_common_options(sub, o->common, false, {});
  sub.add_option("--form", o->form, "polynomial form written")
      ->check(CLI::IsMember({"nasa7", "nasa9", "json"}))
      ->capture_default_str();
  sub.add_option("--range", o->range,
                 "breakpoints in K: TLOW:TMID:THIGH (NASA-7, default 200:1000:3000) or T0:T1:...:Tn (NASA-9, "
                 "default 200:1000:6000); one inner value may be 'auto'");
  sub.add_flag("--allow-missing-hf", o->allow_missing_hf,
               "write H(298.15 K) = 0 for species without enthalpy_of_formation (noted in the output)");
  sub.add_flag("--cp-slope", o->cp_slope,
               "make dCp/dT continuous at the joints too (default: Cp value only)");
  sub.add_option("--grid-step", o->grid_step_K, "spacing of the fit grid in K")->capture_default_str();
  sub.add_flag("--no-wrapper", o->no_wrapper, "omit the THERMO ... END (NASA-9: thermo ... END) wrapper");
  sub.callback([o] {
    FitOptions fit;
    // JSON carries NASA-7 coefficients unless a NASA-9 range (more than 3 breakpoints) is asked for.
    const bool nine = o->form == "nasa9";
    fit.form = nine ? NasaForm::nasa9 : NasaForm::nasa7;
    if (o->form == "json" && !o->range.empty() && std::count(o->range.begin(), o->range.end(), ':') != 2)
      fit.form = NasaForm::nasa9;
    fit.range = o->range.empty() ? default_fit_range(fit.form) : parse_fit_range(o->range, fit.form);
    fit.allow_missing_hf = o->allow_missing_hf;
    o->common.max_temperature_K = fit.range.breakpoints_K.back();
    fit.Cp_slope_continuous = o->cp_slope;
    if (!(o->grid_step_K > 0.0))
      fail({}, fmt::format("--grid-step {}: expected a positive step in K", o->grid_step_K));
    fit.grid_step_K = o->grid_step_K;

    const auto paths = batch_paths(o->common);
    check_output_is_not_input(o->common.output, o->common, paths, "-o");
    OutputSet outputs;
    const std::size_t out = outputs.add(o->common.output);
    const FitPlan plan(fit);  // grid, basis and constraint factorisation shared by every species
    const std::optional<FitPlan> searched = searched_breakpoint_plan(fit);  // for the Cp-warning advice
    const auto options_list = model_option_list(*o);
    // NASA forms keep only each species' polynomial for the file (the records' notes and
    // provenance go only into JSON): about 0.3 kB per species instead of 4 kB.
    std::vector<FitRecord> records;
    std::vector<Nasa7> polys7;
    std::vector<Nasa9> polys9;
    const BatchSummary batch = for_each_species<FitRecord>(
        o->common, paths,
        [&](const SpeciesInput& in, std::vector<LogLine>& log) {
          SpeciesFit f = fit_species(in.prepared, plan);
          if (searched)
            if (auto advice = searched_breakpoint_advice(in.prepared, f, *searched))
              f.fit.warnings.push_back(*advice);
          f.input = {};  // the samples served the advice; the batch keeps only results
          // Check that the record fits its format now, so one bad name fails one species.
          if (o->form == "nasa7") write_nasa7_record(std::get<Nasa7>(f.polynomial));
          if (o->form == "nasa9") write_nasa9_record(std::get<Nasa9>(f.polynomial));
          log_fit(f, log);
          // The factors and the treatment this species used (options, its file's keys, --scale).
          auto species_options = options_list;
          const PreparedSpecies& p = in.prepared;
          species_options.push_back({"scale_zpe", fmt::format("{:g}", p.scale.zpe)});
          species_options.push_back({"scale_enthalpy", fmt::format("{:g}", p.scale.enthalpy)});
          species_options.push_back({"scale_entropy", fmt::format("{:g}", p.scale.entropy)});
          species_options.push_back(
              {"low_frequency", low_frequency_method_name(p.vibration_adjustment.options.method)});
          species_options.push_back(
              {"symmetry_number", fmt::format("{}", p.species.symmetry_number.value_or(1))});
          if (p.point_group) species_options.push_back({"point_group", p.point_group->label});
          species_options.push_back({"racemic", p.racemic ? "true" : "false"});
          if (!p.species.computed_with.empty())
            species_options.push_back({"computed_with", p.species.computed_with});
          if (!p.conformers.empty())
            species_options.push_back({"conformers", fmt::format("{}", p.conformers.size())});
          return FitRecord{std::move(f), {in.path, sha256_hex(in.bytes), std::move(species_options)}};
        },
        [&](FitRecord& r) {
          if (o->form == "nasa7")
            polys7.push_back(std::move(std::get<Nasa7>(r.fit.polynomial)));
          else if (o->form == "nasa9")
            polys9.push_back(std::move(std::get<Nasa9>(r.fit.polynomial)));
          else
            records.push_back(std::move(r));
        });
    const std::vector<std::string> header = {
        fmt::format("vibtherm {}: rigid-rotor harmonic-oscillator model, constrained fit", VIBTHERM_VERSION),
        fmt::format("standard state {}, frequency scale {:g}", o->common.standard_state,
                    o->common.frequency_scale)};
    std::string text;
    if (o->form == "json") {
      text = write_fit_json(records, fit);
    } else if (o->form == "nasa9") {
      text = write_nasa9(polys9, Nasa9WriteOptions{!o->no_wrapper, header});
    } else {
      text = write_nasa7(polys7, Nasa7WriteOptions{!o->no_wrapper, header});
    }
    outputs.write(out, text);
    throw Exit{finish_batch(batch, outputs)};
  });
}

}  // namespace vibtherm::cli
