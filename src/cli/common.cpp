#include "common.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>
#include <unistd.h>

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <iostream>

#include "vibtherm/error.hpp"
#include "vibtherm/read_species.hpp"
#include "vibtherm/temperatures.hpp"
#include "vibtherm/units.hpp"

namespace vibtherm::cli {

void add_common_options(CLI::App& sub, CommonOptions& o, bool with_temps,
                        const std::vector<std::string>& formats) {
  sub.add_option("files", o.inputs,
                 "species files (.yaml, .yml, .xyz), directories of them, or manifests (.list)")
      ->required();
  if (with_temps)
    sub.add_option("--temps", o.temps_text,
                   "temperatures in K: list '298.15,500' and/or ranges 'START:STOP:STEP'");
  sub.add_option("--pressure", o.pressure_text,
                 "pressure for translation, e.g. 1bar, 1atm, 101325Pa (default: the standard state)");
  sub.add_option("--standard-state", o.standard_state,
                 "standard state: bar (1 bar, IUPAC), atm (1 atm), molar (1 mol/L)")
      ->check(CLI::IsMember({"bar", "atm", "molar"}));
  if (!formats.empty())
    sub.add_option("--format", o.format, "output format")
        ->check(CLI::IsMember(formats))
        ->capture_default_str();
  sub.add_option("-o,--output", o.output, "output file ('-' = standard output)")->capture_default_str();
  sub.add_flag("--keep-going", o.keep_going, "finish the good species, list the failures, exit 1");
  sub.add_option("--scale", o.frequency_scale, "multiply every wavenumber by this factor")
      ->capture_default_str();
  sub.add_option("--scale-zpe", o.scale_zpe,
                 "scale factor for the zero-point energy (overrides --scale and the file)");
  sub.add_option("--scale-enthalpy", o.scale_enthalpy,
                 "scale factor for the thermal enthalpy H(T)-H(0) (overrides --scale and the file)");
  sub.add_option("--scale-entropy", o.scale_entropy,
                 "scale factor for the entropy and heat capacity (overrides --scale and the file)");
  sub.add_option(
         "--low-freq", o.low_frequency,
         "low-frequency treatment: harmonic, qrrho (Grimme entropy, Li-Head-Gordon enthalpy) or floor "
         "(raise to --low-freq-floor); overrides the species' low_frequency (default harmonic)")
      ->check(CLI::IsMember({"harmonic", "qrrho", "floor"}));
  sub.add_option("--qrrho-omega0", o.qrrho_omega0_cm1, "qrrho: wavenumber where the weighting is 1/2, cm^-1")
      ->capture_default_str();
  sub.add_option("--low-freq-floor", o.floor_cm1, "floor: wavenumbers below this (cm^-1) are raised to it")
      ->capture_default_str();
  sub.add_option("--soft-mode-warning", o.soft_mode_warning_below_cm1,
                 "warn about harmonic modes below this wavenumber (cm^-1), with their share of S(298.15 K)")
      ->capture_default_str();
  sub.add_flag(
      "--transition-state", o.transition_state,
      "treat every species as a transition state: drop one imaginary mode (the reaction coordinate)");
  sub.add_option("--imaginary-as-real-below", o.imaginary_as_real_below_cm1,
                 "treat imaginary wavenumbers smaller than this (cm^-1) as real, with a warning");
  sub.add_flag("--allow-mode-count-mismatch", o.mode_count_warning,
               "warn instead of failing when the number of frequencies is not 3N-6 / 3N-5");
}

ModelOptions model_options(const CommonOptions& o) {
  ModelOptions m;
  if (o.standard_state == "atm") {
    m.standard_state = StandardState::atm;
    m.pressure_Pa = constants::atmosphere_Pa;
  } else if (o.standard_state == "molar") {
    m.standard_state = StandardState::molar;
  }
  if (!o.pressure_text.empty()) {
    const auto p = parse_pressure_Pa(o.pressure_text);
    if (!p || !(*p > 0.0))
      fail({}, fmt::format("--pressure '{}': expected a positive pressure such as 1bar, 1atm or 101325Pa",
                           o.pressure_text));
    if (m.standard_state == StandardState::molar)
      fail({}, "--pressure cannot be combined with --standard-state molar");
    m.pressure_Pa = *p;
  }
  m.frequency_scale = o.frequency_scale;
  m.scale = {o.scale_zpe, o.scale_enthalpy, o.scale_entropy};
  if (o.low_frequency == "harmonic") m.low_frequency_method = LowFrequencyMethod::harmonic;
  if (o.low_frequency == "qrrho") m.low_frequency_method = LowFrequencyMethod::qrrho;
  if (o.low_frequency == "floor") m.low_frequency_method = LowFrequencyMethod::floor;
  m.low_frequency.qrrho_omega0_cm1 = o.qrrho_omega0_cm1;
  m.low_frequency.floor_cm1 = o.floor_cm1;
  m.low_frequency.soft_mode_warning_below_cm1 = o.soft_mode_warning_below_cm1;
  validate(m.low_frequency);
  m.transition_state = o.transition_state;
  m.imaginary_as_real_below_cm1 = o.imaginary_as_real_below_cm1;
  m.mode_count_mismatch_is_warning = o.mode_count_warning;
  return m;
}

std::vector<double> default_table_temperatures() {
  std::vector<double> temps{298.15};
  for (int T = 300; T <= 3000; T += 100) temps.push_back(T);
  return temps;
}

std::vector<double> temperatures_or(const CommonOptions& o, const std::vector<double>& fallback) {
  return o.temps_text.empty() ? fallback : parse_temperatures(o.temps_text);
}

Batch load_batch(const CommonOptions& o) {
  const ModelOptions model = model_options(o);
  Batch batch;
  const auto paths = expand_species_paths(o.inputs);
  // Progress only for people: a terminal, a large batch, and not --quiet.
  const bool progress =
      ::isatty(STDERR_FILENO) && paths.size() >= 200 && spdlog::get_level() <= spdlog::level::info;
  for (const auto& path : paths) {
    if (progress && batch.species.size() % 100 == 0)
      std::cerr << fmt::format("\rreading species {}/{}", batch.species.size() + batch.failures.size(),
                               paths.size())
                << std::flush;
    try {
      batch.species.push_back(prepare_species(read_species_file(path), model));
    } catch (const InputError& e) {
      if (!o.keep_going) throw;
      batch.failures.push_back(e.what());
      std::cerr << e.what() << '\n';
    }
  }
  if (progress) std::cerr << "\r\033[K" << std::flush;  // clear the progress line
  return batch;
}

void write_output(const std::string& path, const std::string& content) {
  if (path == "-") {
    std::fwrite(content.data(), 1, content.size(), stdout);
    std::fflush(stdout);
    return;
  }
  namespace fs = std::filesystem;
  const fs::path target(path);
  fs::path temp = target;
  temp += fmt::format(".tmp-{}", static_cast<long>(::getpid()));
  {
    std::ofstream out(temp, std::ios::binary | std::ios::trunc);
    if (!out) fail({path, 0, 0}, "cannot open the output file for writing");
    out.write(content.data(), static_cast<std::streamsize>(content.size()));
    out.close();
    if (!out) {
      std::error_code ignored;
      fs::remove(temp, ignored);
      fail({path, 0, 0}, "could not write the output file completely");
    }
  }
  std::error_code ec;
  fs::rename(temp, target, ec);
  if (ec) {
    fs::remove(temp, ec);
    fail({path, 0, 0}, "could not move the finished output into place");
  }
}

void log_species_diagnostics(const Batch& batch) {
  for (const auto& p : batch.species) {
    for (const auto& w : p.warnings) spdlog::warn("{}: {}", p.species.name, w);
    for (const auto& n : p.notes) spdlog::info("{}: {}", p.species.name, n);
  }
}

int batch_status(const Batch& batch) {
  if (batch.failures.empty()) return exit_ok;
  spdlog::error("{} species failed:", batch.failures.size());
  for (const auto& f : batch.failures) spdlog::error("  {}", f);
  return exit_some_failed;
}

}  // namespace vibtherm::cli
