// Writers of `reaction` results: text, CSV and JSON (design.md section 5 pins the JSON
// keys; schemas/reaction.schema.json describes them).
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "vibtherm/reaction.hpp"

namespace vibtherm {

// A reaction solved for the ΔfH°(298.15 K) of one species.
struct UnknownResult {
  std::string species;  // its name
  std::string file;     // as written in the reaction file
  UnknownFormation value;
};

struct ReactionResult {
  ReactionTable table;
  std::optional<LnKFit> fit_Kp, fit_Kc;  // with --fit-lnk
  std::optional<UnknownResult> unknown;
};

// Several reactions solved for the same species (by file): each value, mean and spread.
struct UnknownSummary {
  std::string species;
  std::string path;                      // the species file as resolved
  std::vector<std::string> reactions;    // names, in input order
  std::vector<double> values_J_per_mol;  // ΔfH°(298.15 K) from each
  Spread spread;
};

struct ReactionReport {
  std::string standard_state;  // "p° = 1 bar", ...
  std::vector<ReactionResult> reactions;
  std::vector<UnknownSummary> unknowns;
};

std::string write_reaction_text(const ReactionReport& report);
// One line per reaction and temperature: reaction,T,delta_H,delta_S,delta_G,Kp,Kc.
std::string write_reaction_csv(const ReactionReport& report);
std::string write_reaction_json(const ReactionReport& report);

}  // namespace vibtherm
