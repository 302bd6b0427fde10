// vibtherm reaction: reaction thermochemistry of reaction files (design.md section 5), and
// the reaction route to an unknown enthalpy of formation.
#include "vibtherm/reaction.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <filesystem>
#include <memory>

#include "common.hpp"
#include "vibtherm/read_reaction.hpp"
#include "vibtherm/write_reaction.hpp"

namespace vibtherm::cli {

namespace {

struct ReactionCliOptions {
  CommonOptions common;
  bool fit_ln_K = false;
};

std::string standard_state_text(const ModelOptions& m) {
  if (m.standard_state == StandardState::molar) return "c° = 1 mol/L";
  if (m.pressure_Pa == constants::bar_Pa) return "p° = 1 bar";
  if (m.pressure_Pa == constants::atmosphere_Pa) return "p° = 1 atm";
  return fmt::format("p° = {:g} Pa", m.pressure_Pa);
}

}  // namespace

void setup_reaction(CLI::App& sub) {
  auto o = std::make_shared<ReactionCliOptions>();
  add_common_options(sub, o->common, true, {"text", "csv", "json"});
  sub.add_flag("--fit-lnk", o->fit_ln_K,
               "fit ln K = ln A + n ln T - E/(RT) to Kp and Kc over the temperatures (at least three)");
  sub.callback([o] {
    const auto temps = temperatures_or(o->common, default_table_temperatures());
    o->common.max_temperature_K = *std::max_element(temps.begin(), temps.end());
    const CommonOptions& c = o->common;
    const ModelOptions model = model_options(c);
    if (std::error_code ec; c.output != "-" && std::filesystem::exists(c.output, ec)) {
      // The reaction files, the species files they name, --method and --formation-reactions.
      std::vector<std::string> inputs = c.inputs;
      for (const std::string& path : c.inputs)
        for (const ReactionFileTerm& term : read_reaction_file(path).terms) inputs.push_back(term.path);
      if (!c.method_file.empty()) inputs.push_back(c.method_file);
      inputs.insert(inputs.end(), c.formation_reactions.begin(), c.formation_reactions.end());
      check_output_is_not_input(c.output, inputs, "-o");
    }
    const ReactionFormations formations = formations_from_reactions(c, model);
    ReactionReport report;
    report.standard_state = standard_state_text(model);
    for (const std::string& path : c.inputs) {
      const ReactionFile file = read_reaction_file(path);
      const Reaction reaction = load_reaction(file, model, c.method_file, &formations);
      ReactionResult result{reaction_table(reaction, temps), {}, {}, {}};
      if (o->fit_ln_K) {
        result.fit_Kp = fit_ln_K(result.table.rows, false);
        result.fit_Kc = fit_ln_K(result.table.rows, true);
      }
      if (file.unknown) {
        const std::size_t u = *file.unknown;
        const ReactionTerm& term = reaction.terms[u];
        result.unknown =
            UnknownResult{term.prepared.species.name, term.file, solve_unknown_formation(reaction, u)};
        const std::string& key = file.terms[u].path;
        auto it = std::find_if(report.unknowns.begin(), report.unknowns.end(),
                               [&](const UnknownSummary& s) { return s.path == key; });
        if (it == report.unknowns.end()) {
          report.unknowns.push_back({term.prepared.species.name, key, {}, {}, {}});
          it = report.unknowns.end() - 1;
        }
        it->reactions.push_back(reaction.name);
        it->values_J_per_mol.push_back(result.unknown->value.dfH298_J_per_mol);
      }
      report.reactions.push_back(std::move(result));
    }
    for (auto& u : report.unknowns) u.spread = spread_of(u.values_J_per_mol);
    const std::string text = c.format == "json"  ? write_reaction_json(report)
                             : c.format == "csv" ? write_reaction_csv(report)
                                                 : write_reaction_text(report);
    write_output(c.output, text);
    throw Exit{exit_ok};
  });
}

}  // namespace vibtherm::cli
