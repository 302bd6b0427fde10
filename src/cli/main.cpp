// vibtherm: the table of subcommands and the one place where errors become exit codes.
#include <spdlog/sinks/stdout_color_sinks.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <cstdio>
#include <iostream>

#include "common.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/spelling.hpp"

namespace {

struct SubcommandEntry {
  const char* name;
  const char* description;
  const char* temperatures;  // what --help says about the default temperatures
  void (*setup)(CLI::App&);
};

constexpr const char* exit_codes =
    "Exit status: 0 success; 1 some species failed under --keep-going (the others are written); 2 usage or "
    "input error (one line FILE:LINE:COL: error: ..., nothing written).";
constexpr const char* quiet_text =
    "-q, --quiet (before or after the subcommand): errors only on standard error.";

constexpr SubcommandEntry subcommands[] = {
    {"inspect", "derived facts: formula, mass, moments, rotor type, symmetry, ZPE, mode counts",
     "Temperatures: none (facts do not depend on T).", vibtherm::cli::setup_inspect},
    {"table", "thermodynamic functions (Cp, S, H, G) versus temperature",
     "Default temperatures: 298.15 K, then 300 to 3000 K every 100 K.", vibtherm::cli::setup_table},
    {"fit", "NASA-7 or NASA-9 polynomials by constrained least squares, with fit errors",
     "Temperatures: the fit grid from --range (NASA-7 200:1000:3000 K, NASA-9 200:1000:6000 K) every "
     "--grid-step K.",
     vibtherm::cli::setup_fit},
    {"eval", "tabulate the species of an existing NASA-7 / NASA-9 file",
     "Default temperatures: 298.15 K, then 300 to 3000 K every 100 K (inside each polynomial's range).",
     vibtherm::cli::setup_eval},
    {"modes", "per-mode activation and effective quadratic degrees of freedom F = 2 Cv/R versus temperature",
     "Default temperatures: 50, 100, 200, 298.15, 500, 1000, 2000, 3000 K.", vibtherm::cli::setup_modes},
    {"report",
     "self-contained HTML page for one or many species: index, Cp/S/H computed and fitted, modes, NASA-7",
     "Default table temperatures: 298.15, 500, 1000, 1500, 2000, 3000 K; pictures span the fit range.",
     vibtherm::cli::setup_report},
    {"reaction",
     "reaction files: dH, dS, dG, Kp, Kc versus temperature; solves a reaction for one unknown enthalpy of "
     "formation",
     "Default temperatures: 298.15 K, then 300 to 3000 K every 100 K.", vibtherm::cli::setup_reaction},
};

}  // namespace

int main(int argc, char** argv) {
  auto logger = spdlog::stderr_color_mt("vibtherm");
  spdlog::set_default_logger(logger);
  spdlog::set_pattern("vibtherm: %^%l%$: %v");

  CLI::App app{"vibtherm: ideal-gas and surface thermochemistry from frequency calculations"};
  app.require_subcommand(1);
  app.set_version_flag("--version", std::string("vibtherm ") + VIBTHERM_VERSION);
  bool quiet = false;
  app.add_flag("-q,--quiet", quiet, "show errors only");
  for (const auto& entry : subcommands) {
    CLI::App* sub = app.add_subcommand(entry.name, entry.description);
    sub->fallthrough();  // global options such as -q work after the subcommand too
    entry.setup(*sub);
    const std::string own = sub->get_footer();
    sub->footer((own.empty() ? "" : own + "\n") + entry.temperatures + "\n" + quiet_text + "\n" + exit_codes);
  }
  app.footer(std::string(exit_codes) + "\nvibtherm SUBCOMMAND --help describes each subcommand.");
  app.parse_complete_callback([&] {
    if (quiet) spdlog::set_level(spdlog::level::err);
  });
  // A misspelt subcommand gets a suggestion, like a misspelt input key.
  if (argc > 1 && argv[1][0] != '-') {
    std::vector<std::string> names;
    for (const auto& entry : subcommands) names.emplace_back(entry.name);
    const std::string word = argv[1];
    if (std::find(names.begin(), names.end(), word) == names.end()) {
      const std::string near = vibtherm::closest_word(word, names);
      std::cerr << "error: unknown subcommand '" << word << "'"
                << (near.empty() ? ", expected one of inspect, table, fit, eval, modes, report"
                                 : ", did you mean '" + near + "'?")
                << " (see vibtherm --help)\n";
      return vibtherm::cli::exit_input_error;
    }
  }
  try {
    app.parse(argc, argv);
  } catch (const CLI::CallForHelp& e) {
    return app.exit(e);
  } catch (const CLI::CallForAllHelp& e) {
    return app.exit(e);
  } catch (const CLI::CallForVersion& e) {
    return app.exit(e);
  } catch (const CLI::ParseError& e) {
    // One line, like every other input error.
    std::cerr << "error: " << e.what() << " (see vibtherm --help)\n";
    return vibtherm::cli::exit_input_error;
  } catch (const vibtherm::cli::Exit& e) {
    return e.status;
  } catch (const vibtherm::InputError& e) {
    std::fflush(stdout);
    std::cerr << e.what() << '\n';
    return vibtherm::cli::exit_input_error;
  }
  return vibtherm::cli::exit_ok;
}
