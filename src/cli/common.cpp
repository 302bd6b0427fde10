#include "common.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>
#include <sys/stat.h>
#include <unistd.h>

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <iostream>

#include "vibtherm/error.hpp"
#include "vibtherm/formation.hpp"
#include "vibtherm/limits.hpp"
#include "vibtherm/read_method.hpp"
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
  sub.add_option("--symmetry-tolerance", o.symmetry_tolerance_angstrom,
                 "distance (angstrom) within which an atom's image must meet an equivalent atom when the "
                 "point group is detected")
      ->capture_default_str();
  sub.add_flag(
      "--racemic", o.racemic,
      "chiral species (no mirror plane, inversion centre or S2n axis) as racemic mixtures: S + R ln 2");
  sub.add_option(
         "--formation-reactions", o.formation_reactions,
         "reaction files (comma-separated or repeated), each with an 'unknown': that species' enthalpy of "
         "formation is the mean of its reactions")
      ->delimiter(',');
  sub.add_option("--method", o.method_file,
                 "method file (atomic energies, bond corrections, scale factors) for species with an "
                 "electronic_energy and no 'method' key of their own: gives their enthalpy of formation");
  add_jobs_option(sub, o.jobs);
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
  check_low_frequency_options(m.low_frequency);
  m.transition_state = o.transition_state;
  m.imaginary_as_real_below_cm1 = o.imaginary_as_real_below_cm1;
  m.mode_count_mismatch_is_warning = o.mode_count_warning;
  m.symmetry_tolerance_angstrom = o.symmetry_tolerance_angstrom;
  m.racemic = o.racemic;
  if (o.max_temperature_K > 0.0) m.max_temperature_K = o.max_temperature_K;
  check_model_options(m);
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

void add_jobs_option(CLI::App& sub, unsigned& jobs) {
  sub.add_option("-j,--jobs", jobs, "species processed at once (threads; default: every core)")
      ->check(CLI::Range(1u, 1024u));
}

unsigned thread_count(unsigned jobs) { return jobs == 0 ? default_thread_count() : jobs; }

std::vector<SpeciesSource> batch_paths(const CommonOptions& o) { return expand_species_paths(o.inputs); }

void emit_log(const std::vector<LogLine>& log) {
  for (const auto& line : log) spdlog::log(line.level, "{}", line.text);
}

PreparedSpecies read_and_prepare(const SpeciesSource& source, const ModelOptions& model,
                                 const std::string& method_file, std::string* bytes) {
  const Species species = read_species_source(source, bytes);
  const std::string& method_path = species.method_file.empty() ? method_file : species.method_file;
  std::optional<Method> method;
  if (!method_path.empty()) method = read_method_file(method_path);
  return prepare_with_method(species, model, method ? &*method : nullptr);
}

Reaction load_reaction(const ReactionFile& file, const ModelOptions& model, const std::string& method_file,
                       const ReactionFormations* formations) {
  Reaction r;
  r.name = file.name;
  r.origin = file.origin;
  for (const auto& term : file.terms) {
    PreparedSpecies p = read_and_prepare({term.path, {}, 0}, model, method_file);
    if (formations) {
      std::error_code ec;
      const auto it = formations->find(std::filesystem::weakly_canonical(term.path, ec).string());
      if (it != formations->end()) apply_reaction_formation(p, it->second.dfH298_J_per_mol, it->second.route);
    }
    for (const auto& w : p.warnings) spdlog::warn("{}: {}", p.species.name, w);
    r.terms.push_back({term.file, std::move(p), term.coefficient});
  }
  return r;
}

ReactionFormations formations_from_reactions(const CommonOptions& o, const ModelOptions& model) {
  struct Collected {
    std::vector<std::string> names;
    std::vector<double> values;
  };
  std::map<std::string, Collected> by_path;
  for (const std::string& path : o.formation_reactions) {
    const ReactionFile file = read_reaction_file(path);
    if (!file.unknown)
      fail(file.origin,
           fmt::format("reaction '{}' has no 'unknown', expected the species file whose enthalpy of "
                       "formation it solves for (--formation-reactions)",
                       file.name));
    const Reaction reaction = load_reaction(file, model, o.method_file);
    std::error_code ec;
    Collected& c = by_path[std::filesystem::weakly_canonical(file.terms[*file.unknown].path, ec).string()];
    c.names.push_back(file.name);
    c.values.push_back(solve_unknown_formation(reaction, *file.unknown).dfH298_J_per_mol);
  }
  ReactionFormations out;
  for (const auto& [path, c] : by_path) {
    const Spread s = spread_of(c.values);
    std::string names;
    for (const auto& n : c.names) names += (names.empty() ? "" : ", ") + n;
    out[path] = {s.mean, fmt::format("reaction set {} (mean of {}, standard deviation {:.2f} kJ/mol)", names,
                                     c.values.size(), s.standard_deviation / 1e3)};
  }
  return out;
}

std::optional<InputError> run_species(const SpeciesSource& source, const ModelOptions& model,
                                      const RawProducer& work, std::vector<LogLine>& log,
                                      const std::string& method_file, const ReactionFormations* formations) {
  const std::string path = source.label();
  try {
    std::string bytes;
    PreparedSpecies p = read_and_prepare(source, model, method_file, &bytes);
    if (formations && !formations->empty() && source.overlay.empty()) {
      std::error_code ec;
      const auto it = formations->find(std::filesystem::weakly_canonical(source.path, ec).string());
      if (it != formations->end()) apply_reaction_formation(p, it->second.dfH298_J_per_mol, it->second.route);
    }
    for (const auto& w : p.warnings)
      log.push_back({spdlog::level::warn, fmt::format("{}: {}", p.species.name, w)});
    for (const auto& n : p.notes)
      log.push_back({spdlog::level::info, fmt::format("{}: {}", p.species.name, n)});
    work(SpeciesInput{path, bytes, p}, log);
  } catch (const InputError& e) {
    if (e.where().file.empty()) return InputError({source.path, source.line, 0}, e.message());
    return e;
  }
  return std::nullopt;
}

int finish_batch(const BatchSummary& batch, OutputSet& outputs) {
  if (batch.failures.empty()) {
    outputs.commit();
    return exit_ok;
  }
  spdlog::error("{} species failed:", batch.failures.size());
  for (const auto& f : batch.failures) spdlog::error("  {}", f);
  if (batch.done == 0)
    spdlog::error("no species succeeded: no output written (an existing output file is left as it was)");
  else
    outputs.commit();
  return exit_some_failed;
}

namespace fs = std::filesystem;

struct OutputSet::Item {
  std::string path;
  fs::path target;  // the file finally written (a symbolic link resolved)
  fs::path temp;
  std::FILE* file = nullptr;
  bool is_stdout = false;
};

OutputSet::OutputSet() = default;

OutputSet::~OutputSet() {
  for (auto& item : items_) {
    if (item->file) std::fclose(item->file);
    if (!item->temp.empty()) {
      std::error_code ignored;
      fs::remove(item->temp, ignored);
    }
  }
}

std::size_t OutputSet::add(const std::string& path) {
  auto item = std::make_unique<Item>();
  item->path = path;
  if (path == "-") {
    item->is_stdout = true;
    item->file = std::tmpfile();
    if (!item->file) fail({}, "cannot create a temporary file for the standard output");
  } else {
    std::error_code ec;
    fs::path target(path);
    if (fs::is_symlink(fs::symlink_status(target, ec))) {
      target = fs::weakly_canonical(target, ec);
      if (ec) fail({path, 0, 0}, "cannot resolve the symbolic link of the output file");
    }
    if (fs::exists(target, ec) && !fs::is_regular_file(target, ec))
      fail({path, 0, 0}, "output is not a regular file, expected a file path or '-'");
    const fs::path dir = target.has_parent_path() ? target.parent_path() : fs::path(".");
    std::string pattern = (dir / ("." + target.filename().string() + ".tmp-XXXXXX")).string();
    const int fd = ::mkstemp(pattern.data());
    if (fd < 0)
      fail({path, 0, 0}, fmt::format("cannot create the output file (directory '{}' missing or not writable)",
                                     dir.string()));
    // Keep the mode of a file being replaced; a new one gets 0666 less the umask.
    struct stat old {};
    mode_t mode = 0;
    if (::stat(target.c_str(), &old) == 0) {
      mode = old.st_mode & 07777;
    } else {
      const mode_t mask = ::umask(0);
      ::umask(mask);
      mode = 0666 & ~mask;
    }
    ::fchmod(fd, mode);
    item->target = target;
    item->temp = pattern;
    item->file = ::fdopen(fd, "wb");
    if (!item->file) {
      ::close(fd);
      fail({path, 0, 0}, "cannot open the output file for writing");
    }
  }
  items_.push_back(std::move(item));
  return items_.size() - 1;
}

void OutputSet::write(std::size_t which, std::string_view text) {
  Item& item = *items_[which];
  if (std::fwrite(text.data(), 1, text.size(), item.file) != text.size())
    fail({item.is_stdout ? "" : item.path, 0, 0}, "could not write the output file completely");
}

void OutputSet::commit() {
  for (auto& item : items_) {
    if (std::fflush(item->file) != 0 || std::ferror(item->file))
      fail({item->is_stdout ? "" : item->path, 0, 0}, "could not write the output file completely");
  }
  for (auto& item : items_) {
    if (item->is_stdout) {
      std::rewind(item->file);
      char buffer[1 << 16];
      std::size_t n = 0;
      while ((n = std::fread(buffer, 1, sizeof buffer, item->file)) > 0) std::fwrite(buffer, 1, n, stdout);
      std::fflush(stdout);
      std::fclose(item->file);
      item->file = nullptr;
      continue;
    }
    const int closed = std::fclose(item->file);
    item->file = nullptr;
    if (closed != 0) fail({item->path, 0, 0}, "could not write the output file completely");
  }
  for (auto& item : items_) {
    if (item->is_stdout) continue;
    std::error_code ec;
    fs::rename(item->temp, item->target, ec);
    if (ec) fail({item->path, 0, 0}, "could not move the finished output into place");
    item->temp.clear();
  }
}

void check_output_is_not_input(const std::string& output, const std::vector<std::string>& inputs,
                               const std::string& what) {
  if (output.empty() || output == "-") return;
  std::error_code ec;
  if (!fs::exists(output, ec)) return;
  for (const auto& input : inputs) {
    std::error_code e2;
    if (fs::equivalent(output, input, e2))
      fail({output, 0, 0},
           fmt::format("{} names the input file '{}', expected a different output file", what, input));
  }
}

void check_output_is_not_input(const std::string& output, const CommonOptions& options,
                               const std::vector<SpeciesSource>& inputs, const std::string& what) {
  std::error_code ec;
  if (output.empty() || output == "-" || !fs::exists(output, ec)) return;
  std::vector<std::string> files = source_paths(inputs);
  for (std::string& manifest : manifest_paths(options.inputs)) files.push_back(std::move(manifest));
  if (!options.method_file.empty()) files.push_back(options.method_file);
  files.insert(files.end(), options.formation_reactions.begin(), options.formation_reactions.end());
  check_output_is_not_input(output, files, what);
}

std::vector<std::string> files_read_for(const PreparedSpecies& prepared) {
  const Species& s = prepared.species;
  std::vector<std::string> files{s.origin.file};
  if (!s.method_file.empty()) files.push_back(s.method_file);
  files.insert(files.end(), s.source_files.begin(), s.source_files.end());
  for (const ConformerMember& m : prepared.conformers)
    for (std::string& f : files_read_for(m.prepared)) files.push_back(std::move(f));
  return files;
}

void write_output(const std::string& path, const std::string& content) {
  OutputSet outputs;
  outputs.write(outputs.add(path), content);
  outputs.commit();
}

}  // namespace vibtherm::cli
