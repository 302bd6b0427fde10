// vibtherm: the table of subcommands and the one place where errors become exit codes.
#include <spdlog/sinks/stdout_color_sinks.h>
#include <spdlog/spdlog.h>

#include <cstdio>
#include <iostream>

#include "common.hpp"
#include "vibtherm/error.hpp"

namespace {

struct SubcommandEntry {
  const char* name;
  const char* description;
  void (*setup)(CLI::App&);
};

constexpr SubcommandEntry subcommands[] = {
    {"inspect", "derived facts: formula, mass, moments, rotor type, symmetry, ZPE, mode counts",
     vibtherm::cli::setup_inspect},
    {"table", "thermodynamic functions (Cp, S, H, G) versus temperature", vibtherm::cli::setup_table},
    {"fit", "NASA-7 or NASA-9 polynomials by constrained least squares, with fit errors",
     vibtherm::cli::setup_fit},
    {"eval", "tabulate the species of an existing NASA-7 / NASA-9 file", vibtherm::cli::setup_eval},
    {"modes", "per-mode activation and effective quadratic degrees of freedom F = 2 Cv/R versus temperature",
     vibtherm::cli::setup_modes},
    {"report",
     "self-contained HTML page (inline SVG plots) for one or many species: facts, Cp(T), modes, NASA-7",
     vibtherm::cli::setup_report},
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
  }
  app.parse_complete_callback([&] {
    if (quiet) spdlog::set_level(spdlog::level::err);
  });
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
