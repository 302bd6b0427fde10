// Shared wiring for the subcommands: common options, loading species in batches,
// atomic output, exit codes. No science here.
#pragma once

#include <CLI/CLI.hpp>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "vibtherm/thermo.hpp"

namespace vibtherm::cli {

// Exit status, documented once: 0 ok, 1 some species failed under --keep-going, 2 usage or input error.
inline constexpr int exit_ok = 0;
inline constexpr int exit_some_failed = 1;
inline constexpr int exit_input_error = 2;

// Thrown by a subcommand callback to end with a status after printing what it must.
struct Exit {
  int status;
};

struct CommonOptions {
  std::vector<std::string> inputs;
  std::string temps_text;
  std::string pressure_text;
  std::string standard_state = "bar";
  std::string format = "text";
  std::string output = "-";
  bool keep_going = false;
  double frequency_scale = 1.0;
  std::optional<double> scale_zpe, scale_enthalpy, scale_entropy;
  std::string low_frequency;  // empty: the species' key, else harmonic
  double qrrho_omega0_cm1 = LowFrequencyOptions{}.qrrho_omega0_cm1;
  double floor_cm1 = LowFrequencyOptions{}.floor_cm1;
  double soft_mode_warning_below_cm1 = LowFrequencyOptions{}.soft_mode_warning_below_cm1;
  bool transition_state = false;
  double imaginary_as_real_below_cm1 = 0.0;
  bool mode_count_warning = false;
};

// Adds FILE..., --pressure, --standard-state, -o, --keep-going and the model options.
// `with_temps` adds --temps, `formats` the allowed --format values (none: no --format).
void add_common_options(CLI::App& sub, CommonOptions& options, bool with_temps,
                        const std::vector<std::string>& formats);

ModelOptions model_options(const CommonOptions& options);

// Temperatures from --temps, or the default list when it is empty.
std::vector<double> temperatures_or(const CommonOptions& options, const std::vector<double>& fallback);

// Default table temperatures: 298.15 K, then 300 to 3000 K in steps of 100 K.
std::vector<double> default_table_temperatures();

struct Batch {
  std::vector<PreparedSpecies> species;  // in input order
  std::vector<std::string> failures;     // formatted one-line errors (only with --keep-going)
};

// Expands paths, reads and prepares every species. Without --keep-going the first error
// propagates as InputError; with it, failures are logged and collected.
Batch load_batch(const CommonOptions& options);

// Writes `content` to `path` ("-" = stdout) through a temporary file renamed into place.
void write_output(const std::string& path, const std::string& content);

// Logs warnings and notes of each prepared species to stderr (spdlog).
void log_species_diagnostics(const Batch& batch);

// Ends the subcommand: exit_some_failed if the batch had failures, else exit_ok.
int batch_status(const Batch& batch);

// Each subcommand file provides one of these; main.cpp lists them in a table.
void setup_inspect(CLI::App& sub);
void setup_table(CLI::App& sub);
void setup_fit(CLI::App& sub);
void setup_eval(CLI::App& sub);
void setup_modes(CLI::App& sub);
void setup_report(CLI::App& sub);

}  // namespace vibtherm::cli
