// Expansion of command-line arguments into species files: directories and manifests.
#include "vibtherm/species_paths.hpp"

#include <algorithm>
#include <cctype>
#include <filesystem>
#include <fstream>
#include <sstream>

#include "vibtherm/species_builder.hpp"

namespace vibtherm {

namespace fs = std::filesystem;

std::string lowercase_extension(const std::string& path) {
  std::string ext = fs::path(path).extension().string();
  std::transform(ext.begin(), ext.end(), ext.begin(),
                 [](char c) { return static_cast<char>(std::tolower(static_cast<unsigned char>(c))); });
  return ext;
}

bool is_species_extension(const std::string& ext) {
  return ext == ".yaml" || ext == ".yml" || ext == ".xyz" || ext == ".json" || ext == ".molden";
}

namespace {

struct Expansion {
  std::vector<std::string> open;  // the manifests being expanded, outermost first
  std::size_t manifests_read = 0;
  std::vector<std::string>* manifests = nullptr;  // when set, receives each manifest read
};

std::string too_many() {
  return "more than " + std::to_string(max_species_paths) + " species files in one run, expected fewer";
}

void expand_one(const std::string& arg, const SourceLocation& where, int depth, Expansion& state,
                std::vector<SpeciesSource>& out) {
  std::error_code ec;
  if (fs::is_directory(arg, ec)) {
    std::vector<std::string> found;
    for (const fs::directory_entry& entry : fs::directory_iterator(arg, ec)) {
      std::error_code file_ec;
      if (entry.is_regular_file(file_ec) && is_species_extension(lowercase_extension(entry.path().string())))
        found.push_back(entry.path().string());
    }
    if (ec)
      fail(where.file.empty() ? SourceLocation{arg, 0, 0} : where, "cannot list directory: " + ec.message());
    if (found.empty())
      fail(where.file.empty() ? SourceLocation{arg, 0, 0} : where,
           "directory holds no species files, expected files ending in .yaml, .yml, .xyz, .json or .molden");
    std::sort(found.begin(), found.end());
    if (out.size() + found.size() > max_species_paths)
      fail(where.file.empty() ? SourceLocation{arg, 0, 0} : where, too_many());
    for (std::string& f : found) out.push_back({std::move(f), {}, 0});
    return;
  }
  if (lowercase_extension(arg) != ".list") {
    if (out.size() >= max_species_paths)
      fail(where.file.empty() ? SourceLocation{arg, 0, 0} : where, too_many());
    out.push_back({arg, {}, 0});
    return;
  }
  if (depth > max_manifest_depth)
    fail({arg, 0, 0}, "manifests nested more than " + std::to_string(max_manifest_depth) +
                          " deep, expected no manifest to list itself");
  const fs::path canonical = fs::weakly_canonical(arg, ec);
  const std::string key = ec ? arg : canonical.string();
  if (++state.manifests_read > max_manifests)
    fail(where.file.empty() ? SourceLocation{arg, 0, 0} : where,
         "more than " + std::to_string(max_manifests) + " manifests read in one run, expected fewer");
  std::vector<std::string>& open = state.open;
  if (std::find(open.begin(), open.end(), key) != open.end())
    fail(where.file.empty() ? SourceLocation{arg, 0, 0} : where,
         "manifest lists itself (directly or through other manifests), expected no cycle");
  if (!fs::is_regular_file(arg, ec))
    fail(where.file.empty() ? SourceLocation{arg, 0, 0} : where,
         "manifest is missing or not a regular file, expected a readable file listing species files");
  std::ifstream in(arg, std::ios::binary);
  if (!in) fail({arg, 0, 0}, "cannot read manifest, expected a readable file listing species files");
  std::stringstream buffer;
  buffer << in.rdbuf();
  const std::vector<ManifestEntry> entries = parse_manifest(buffer.str(), arg);
  fs::path base = fs::path(arg).parent_path();
  if (state.manifests &&
      std::find(state.manifests->begin(), state.manifests->end(), arg) == state.manifests->end())
    state.manifests->push_back(arg);
  open.push_back(key);
  for (const ManifestEntry& entry : entries) {
    if (entry.overlay) {
      if (out.size() >= max_species_paths) fail(entry.where, too_many());
      out.push_back({arg, entry.path, entry.where.line});
      continue;
    }
    fs::path path(entry.path);
    if (path.is_relative()) path = base / path;
    if (!fs::exists(path, ec)) fail(entry.where, "listed file " + quote(entry.path) + " does not exist");
    expand_one(path.string(), entry.where, depth + 1, state, out);
  }
  open.pop_back();
}

}  // namespace

std::string SpeciesSource::label() const {
  return overlay.empty() ? path : path + ":" + std::to_string(line);
}

std::vector<std::string> source_paths(const std::vector<SpeciesSource>& sources) {
  std::vector<std::string> out;
  for (const SpeciesSource& s : sources) out.push_back(s.path);
  return out;
}

std::vector<SpeciesSource> expand_species_paths(const std::vector<std::string>& args) {
  std::vector<SpeciesSource> out;
  Expansion state;
  for (const std::string& arg : args) expand_one(arg, {}, 0, state, out);
  return out;
}

std::vector<std::string> manifest_paths(const std::vector<std::string>& args) {
  std::vector<SpeciesSource> sources;
  std::vector<std::string> manifests;
  Expansion state;
  state.manifests = &manifests;
  for (const std::string& arg : args) expand_one(arg, {}, 0, state, sources);
  return manifests;
}

std::vector<ManifestEntry> parse_manifest(const std::string& text, const std::string& file_name) {
  require_text(text, file_name);
  std::vector<ManifestEntry> out;
  std::istringstream lines(text);
  std::string line;
  int line_number = 0;
  while (std::getline(lines, line)) {
    ++line_number;
    // An inline species keeps its line whole (YAML reads its comments and quoted '#').
    const std::size_t start = line.find_first_not_of(" \t\r");
    const bool overlay = start != std::string::npos && line[start] == '{';
    std::size_t hash = overlay ? std::string::npos : line.find('#');
    if (hash != std::string::npos) line.erase(hash);
    std::size_t first = line.find_first_not_of(" \t\r");
    if (first == std::string::npos) continue;
    std::size_t last = line.find_last_not_of(" \t\r");
    if (out.size() >= max_species_paths)
      fail({file_name, line_number, 1},
           "manifest lists more than " + std::to_string(max_species_paths) + " files, expected fewer");
    if (overlay) {
      if (!line.empty() && line.back() == '\r') line.pop_back();
      out.push_back({line, {file_name, line_number, static_cast<int>(first) + 1}, true});
      continue;
    }
    out.push_back(
        {line.substr(first, last - first + 1), {file_name, line_number, static_cast<int>(first) + 1}});
  }
  if (out.empty())
    fail({file_name, 0, 0}, "manifest lists no files, expected one species file path per line");
  return out;
}

}  // namespace vibtherm
