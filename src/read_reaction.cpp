// The reaction-file reader: `species: [{file, coefficient}]`, optional `name` and `unknown`.
#include "vibtherm/read_reaction.hpp"

#include <fmt/format.h>
#include <yaml-cpp/yaml.h>

#include <cmath>
#include <filesystem>

#include "vibtherm/species_builder.hpp"
#include "yaml_values.hpp"

namespace vibtherm {

namespace fs = std::filesystem;

ReactionFile read_reaction_yaml(const std::string& text, const std::string& file_name) {
  const std::string expected = "expected a YAML map with 'species: [{file, coefficient}, ...]'";
  const YAML::Node root =
      load_single_yaml_document(text, file_name, expected, "expected one reaction per file");
  YamlValues y(file_name);
  if (!root.IsDefined() || root.IsNull()) fail({file_name, 0, 0}, "file holds no reaction, " + expected);
  if (!root.IsMap()) y.error(root, "top level is " + YamlValues::describe(root) + ", " + expected);
  const YamlValues::Entries e = y.entries(root, "the reaction", {"name", "species", "unknown"});
  ReactionFile r;
  r.origin = y.at(root);
  r.name = fs::path(file_name).stem().string();
  if (const YAML::Node* n = YamlValues::find(e, "name")) r.name = y.text(*n, "'name'");
  const YAML::Node* list = YamlValues::find(e, "species");
  if (!list) y.error(root, "missing required key 'species', " + expected);
  if (!list->IsSequence() || list->size() < 2)
    y.error(*list, "'species' is " + YamlValues::describe(*list) +
                       ", expected a list of at least two {file, coefficient} entries");
  const fs::path here = fs::path(file_name).parent_path();
  for (std::size_t i = 0; i < list->size(); ++i) {
    const YAML::Node item = (*list)[i];
    const std::string what = fmt::format("species {}", i + 1);
    if (!item.IsMap())
      y.error(item,
              what + " is " + YamlValues::describe(item) + ", expected {file: FILE, coefficient: NUMBER}");
    const YamlValues::Entries t = y.entries(item, what, {"file", "coefficient"});
    const YAML::Node* file = YamlValues::find(t, "file");
    const YAML::Node* coefficient = YamlValues::find(t, "coefficient");
    if (!file) y.error(item, what + " has no 'file', expected the species file's path");
    if (!coefficient)
      y.error(item,
              what + " has no 'coefficient', expected a stoichiometric coefficient (negative for reactants)");
    ReactionFileTerm term;
    term.where = y.at(item);
    term.file = y.text(*file, what + " 'file'");
    const fs::path given(term.file);
    term.path = (given.is_absolute() ? given : here / given).lexically_normal().string();
    term.coefficient = y.number(*coefficient, what + " 'coefficient'");
    if (term.coefficient == 0.0 || std::abs(term.coefficient) > 1e6)
      y.error(*coefficient,
              what + " 'coefficient' is " + YamlValues::describe(*coefficient) +
                  ", expected a nonzero number (negative for reactants) of magnitude at most 1e6");
    for (const auto& other : r.terms)
      if (other.path == term.path)
        y.error(*file, what + " repeats the file " + quote(term.file) + ", expected each species once");
    r.terms.push_back(std::move(term));
  }
  if (const YAML::Node* u = YamlValues::find(e, "unknown")) {
    const std::string file = y.text(*u, "'unknown'");
    const fs::path given(file);
    const std::string path = (given.is_absolute() ? given : here / given).lexically_normal().string();
    for (std::size_t i = 0; i < r.terms.size(); ++i)
      if (r.terms[i].path == path) r.unknown = i;
    if (!r.unknown)
      y.error(*u, "'unknown' is " + quote(file) +
                      ", which is not among the reaction's species files, expected one of them");
  }
  return r;
}

ReactionFile read_reaction_file(const std::string& path) {
  return read_reaction_yaml(read_input_text_file(path, "a reaction file (YAML)"), path);
}

}  // namespace vibtherm
