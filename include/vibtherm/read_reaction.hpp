// The reaction-file reader (YAML, design.md section 5; schemas/reaction_file.schema.json):
// species files with stoichiometric coefficients, an optional name and unknown.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "vibtherm/error.hpp"

namespace vibtherm {

struct ReactionFileTerm {
  SourceLocation where;      // the entry in the reaction file
  std::string file;          // as written
  std::string path;          // resolved against the reaction file's folder
  double coefficient = 0.0;  // negative: reactant
};

struct ReactionFile {
  SourceLocation origin;
  std::string name;  // `name`, or the file's stem
  std::vector<ReactionFileTerm> terms;
  std::optional<std::size_t> unknown;  // index into terms of `unknown: FILE`
};

// Reads a reaction from YAML text; `file_name` locates errors and resolves the paths.
ReactionFile read_reaction_yaml(const std::string& text, const std::string& file_name);

ReactionFile read_reaction_file(const std::string& path);

}  // namespace vibtherm
