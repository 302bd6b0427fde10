// Shared wiring for the subcommands: common options, loading species in batches,
// atomic output, exit codes. No science here.
#pragma once

#include <spdlog/spdlog.h>

#include <CLI/CLI.hpp>
#include <functional>
#include <iostream>
#include <map>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "vibtherm/error.hpp"
#include "vibtherm/ordered_map.hpp"
#include "vibtherm/reaction.hpp"
#include "vibtherm/read_reaction.hpp"
#include "vibtherm/species_paths.hpp"
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
  double symmetry_tolerance_angstrom = default_symmetry_tolerance_angstrom;
  bool racemic = false;
  unsigned jobs = 0;                             // 0: every core
  std::string method_file;                       // --method: for species without their own `method` key
  std::vector<std::string> formation_reactions;  // --formation-reactions: reaction files with `unknown`
  // Set by the subcommand, not an option: the highest temperature it evaluates (table rows,
  // fit range), so hindered-rotor bases are sized for it; 0 keeps ModelOptions' default.
  double max_temperature_K = 0.0;
};

// ΔfH°(298.15 K) of species solved for by reaction files (--formation-reactions), keyed by
// the species file's canonical path: the mean over the reactions, and the route text.
struct ReactionFormation {
  double dfH298_J_per_mol = 0.0;
  std::string route;
};
using ReactionFormations = std::map<std::string, ReactionFormation>;

// Adds -j/--jobs (species processed at once; default every core) to a subcommand.
void add_jobs_option(CLI::App& sub, unsigned& jobs);
// The thread count for -j: `jobs`, or every core when it is 0.
unsigned thread_count(unsigned jobs);

// Adds FILE..., --pressure, --standard-state, -o, --keep-going and the model options.
// `with_temps` adds --temps, `formats` the allowed --format values (none: no --format).
void add_common_options(CLI::App& sub, CommonOptions& options, bool with_temps,
                        const std::vector<std::string>& formats);

ModelOptions model_options(const CommonOptions& options);

// Temperatures from --temps, or the default list when it is empty.
std::vector<double> temperatures_or(const CommonOptions& options, const std::vector<double>& fallback);

// Default table temperatures: 298.15 K, then 300 to 3000 K in steps of 100 K.
std::vector<double> default_table_temperatures();

// The outputs of one run: each is written to a temporary file beside its target (or, for
// standard output, to an anonymous one) and all are moved into place together by commit(),
// so that an error leaves every old output as it was. A replaced file keeps its mode, and
// a symbolic link is written through (its target replaced), not replaced by a file.
class OutputSet {
 public:
  OutputSet();
  ~OutputSet();  // removes the temporaries of an uncommitted run
  OutputSet(const OutputSet&) = delete;
  OutputSet& operator=(const OutputSet&) = delete;
  // Opens a temporary for `path` ("-" = standard output); returns its index.
  std::size_t add(const std::string& path);
  void write(std::size_t which, std::string_view text);
  void commit();

 private:
  struct Item;
  std::vector<std::unique_ptr<Item>> items_;
};

// Refuses an output path that names one of the input files (or the same file by another
// path): `what` is the option, e.g. "-o".
void check_output_is_not_input(const std::string& output, const std::vector<std::string>& inputs,
                               const std::string& what);
// For a batch: the sources' files, the manifests that listed them (nested ones too), the
// --method file and the --formation-reactions files.
void check_output_is_not_input(const std::string& output, const CommonOptions& options,
                               const std::vector<SpeciesSource>& inputs, const std::string& what);

// Writes `content` to `path` ("-" = stdout) through a temporary file renamed into place.
void write_output(const std::string& path, const std::string& content);

// A species read and prepared on a worker thread, with the bytes of its file.
struct SpeciesInput {
  const std::string& path;
  const std::string& bytes;
  const PreparedSpecies& prepared;
};

struct LogLine {
  spdlog::level::level_enum level;
  std::string text;
};

// What a species' work leaves for the in-order consumer.
template <class Piece>
struct Outcome {
  std::optional<Piece> piece;
  std::optional<InputError> error;
  std::vector<LogLine> log;  // its warnings and notes, then what the work adds
};

struct BatchSummary {
  std::size_t done = 0;               // species that succeeded
  std::vector<std::string> failures;  // formatted one-line errors (only with --keep-going)
};

// Every file a prepared species was read from: its own, its method file, a `from` file, and
// those of its conformers.
std::vector<std::string> files_read_for(const PreparedSpecies& prepared);

// Outcome<Piece> for one species: read, prepare, then `work` (on a worker thread). An
// InputError without a file gets the species' file.
using RawProducer = std::function<void(const SpeciesInput&, std::vector<LogLine>&)>;
// Reads a species file and prepares it, under its own `method` file or else `method_file`
// (--method, may be empty); `bytes` receives the file's content when given.
PreparedSpecies read_and_prepare(const SpeciesSource& source, const ModelOptions& model,
                                 const std::string& method_file, std::string* bytes = nullptr);

// The species files of a reaction file, read and prepared (their warnings logged once each).
// `formations` (--formation-reactions, may be null) gives the species its reaction-set ΔfH°.
Reaction load_reaction(const ReactionFile& file, const ModelOptions& model, const std::string& method_file,
                       const ReactionFormations* formations = nullptr);

// Solves every reaction of options.formation_reactions (each needs `unknown`).
ReactionFormations formations_from_reactions(const CommonOptions& options, const ModelOptions& model);

// `method_file` (--method) applies to species without a `method` key of their own.
std::optional<InputError> run_species(const SpeciesSource& source, const ModelOptions& model,
                                      const RawProducer& work, std::vector<LogLine>& log,
                                      const std::string& method_file = "",
                                      const ReactionFormations* formations = nullptr);
void emit_log(const std::vector<LogLine>& log);

// Expands the paths, then reads, prepares and runs `work` on every species on o.jobs
// threads; `consume` gets the pieces on this thread in input order (memory stays bounded
// by the thread count). Without --keep-going the first error in input order propagates as
// InputError; with it, failures are printed and collected.
template <class Piece>
BatchSummary for_each_species(const CommonOptions& o, const std::vector<SpeciesSource>& paths,
                              const std::function<Piece(const SpeciesInput&, std::vector<LogLine>&)>& work,
                              const std::function<void(Piece&)>& consume) {
  const ModelOptions model = model_options(o);
  const ReactionFormations formations = formations_from_reactions(o, model);
  BatchSummary summary;
  ordered_map<Outcome<Piece>>(
      paths.size(), thread_count(o.jobs),
      [&](std::size_t i) {
        Outcome<Piece> out;
        out.error = run_species(
            paths[i], model,
            [&](const SpeciesInput& in, std::vector<LogLine>& log) {
              // A file read through the species file (conformers, 'from', method) is an input too.
              check_output_is_not_input(o.output, files_read_for(in.prepared), "-o");
              out.piece = work(in, log);
            },
            out.log, o.method_file, &formations);
        return out;
      },
      [&](std::size_t, Outcome<Piece>& out) {
        emit_log(out.log);
        if (out.error) {
          if (!o.keep_going) throw *out.error;
          summary.failures.push_back(out.error->what());
          std::cerr << out.error->what() << '\n';
          return;
        }
        ++summary.done;
        consume(*out.piece);
      });
  return summary;
}

// The species files of the batch (expanded arguments).
std::vector<SpeciesSource> batch_paths(const CommonOptions& options);

// Ends the subcommand: exit_some_failed if the batch had failures, else exit_ok. With
// failures and no species done, the outputs are not replaced (an empty file would hide
// the old results) and that is said.
int finish_batch(const BatchSummary& batch, OutputSet& outputs);

// Each subcommand file provides one of these; main.cpp lists them in a table.
void setup_inspect(CLI::App& sub);
void setup_table(CLI::App& sub);
void setup_fit(CLI::App& sub);
void setup_eval(CLI::App& sub);
void setup_modes(CLI::App& sub);
void setup_report(CLI::App& sub);
void setup_reaction(CLI::App& sub);

}  // namespace vibtherm::cli
