// Recognising the format of a species file; see species_format.hpp.
#include "vibtherm/species_format.hpp"

#include <algorithm>
#include <cctype>

#include "vibtherm/error.hpp"
#include "vibtherm/read_qcschema.hpp"
#include "vibtherm/species_builder.hpp"
#include "vibtherm/species_paths.hpp"

namespace vibtherm {
namespace {

std::string_view trimmed(std::string_view line) {
  const std::size_t first = line.find_first_not_of(" \t\r");
  if (first == std::string_view::npos) return {};
  return line.substr(first, line.find_last_not_of(" \t\r") - first + 1);
}

std::string lower(std::string_view text) {
  std::string out(text);
  std::transform(out.begin(), out.end(), out.begin(),
                 [](char c) { return static_cast<char>(std::tolower(static_cast<unsigned char>(c))); });
  return out;
}

// The first line that is not blank (nor a '#' comment when `skip_comments`), trimmed.
std::string_view first_line(std::string_view text, bool skip_comments) {
  if (text.substr(0, 3) == "\xEF\xBB\xBF") text.remove_prefix(3);
  std::size_t start = 0;
  while (start < text.size()) {
    std::size_t end = text.find('\n', start);
    if (end == std::string_view::npos) end = text.size();
    const std::string_view line = trimmed(text.substr(start, end - start));
    if (!line.empty() && !(skip_comments && line[0] == '#')) return line;
    start = end + 1;
  }
  return {};
}

bool is_nasa_file(std::string_view text) {
  if (lower(first_line(text, false)).rfind("thermo", 0) == 0) return true;
  std::size_t start = 0;
  for (int lines = 0; start < text.size() && lines < 8; ++lines) {
    std::size_t end = text.find('\n', start);
    if (end == std::string_view::npos) end = text.size();
    std::string_view line = text.substr(start, end - start);
    if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
    if (line.size() == 80 && line[79] == '1') return true;
    start = end + 1;
  }
  return false;
}

}  // namespace

std::string_view species_format_name(SpeciesFormat format) {
  switch (format) {
    case SpeciesFormat::yaml:
      return "YAML";
    case SpeciesFormat::xyz:
      return "XYZ";
    case SpeciesFormat::qcschema:
      return "QCSchema JSON";
    case SpeciesFormat::molden:
      return "Molden";
  }
  return "unknown";
}

std::string accepted_species_formats() {
  return "YAML (.yaml, .yml), XYZ with frequencies (.xyz), QCSchema JSON (.json) or Molden normal modes "
         "(.molden)";
}

SpeciesFormat detect_species_format(std::string_view text, const std::string& path) {
  const std::string ext = lowercase_extension(path);
  const bool yaml_ext = ext == ".yaml" || ext == ".yml";
  const std::string_view first = first_line(text, false);
  if (looks_like_json(text) && (!yaml_ext || text.find("\"schema_name\"") != std::string_view::npos))
    return SpeciesFormat::qcschema;
  if (ext == ".json" && !first.empty() && first[0] == '[') return SpeciesFormat::qcschema;
  if (lower(first) == "[molden format]" || (!first.empty() && first[0] == '[' && !yaml_ext && ext != ".xyz"))
    return SpeciesFormat::molden;
  if (is_nasa_file(text))
    fail({path, 0, 0},
         "recognised a NASA polynomial file, which 'vibtherm eval' reads; expected a species file: " +
             accepted_species_formats());
  if (yaml_ext) return SpeciesFormat::yaml;
  if (ext == ".xyz") return SpeciesFormat::xyz;
  const std::string_view line = first_line(text, true);
  if (!line.empty() && std::all_of(line.begin(), line.end(),
                                   [](char c) { return std::isdigit(static_cast<unsigned char>(c)); }))
    return SpeciesFormat::xyz;
  const std::size_t colon = line.find(':');
  if (colon != std::string_view::npos && colon > 0 &&
      std::all_of(line.begin(), line.begin() + static_cast<std::ptrdiff_t>(colon),
                  [](char c) { return std::isalnum(static_cast<unsigned char>(c)) || c == '_'; }))
    return SpeciesFormat::yaml;
  const std::string seen = looks_like_json(text) ? "a JSON document"
                           : line.empty()        ? "only comments"
                                                 : "first line " + quote(line);
  fail({path, 0, 0}, "content not recognised as a species file (" + seen + ", file type " +
                         quote(ext.empty() ? "(none)" : ext) + "), expected " + accepted_species_formats());
}

}  // namespace vibtherm
