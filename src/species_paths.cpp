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

bool is_species_extension(const std::string& ext) { return ext == ".yaml" || ext == ".yml" || ext == ".xyz"; }

namespace {

// Manifests may list manifests; this bounds a cycle.
constexpr int max_manifest_depth = 16;

void expand_one(const std::string& arg, const SourceLocation& where, int depth,
                std::vector<std::string>& out) {
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
           "directory holds no species files, expected files ending in .yaml, .yml or .xyz");
    std::sort(found.begin(), found.end());
    out.insert(out.end(), found.begin(), found.end());
    return;
  }
  if (lowercase_extension(arg) != ".list") {
    out.push_back(arg);
    return;
  }
  if (depth > max_manifest_depth)
    fail({arg, 0, 0}, "manifests nested more than " + std::to_string(max_manifest_depth) +
                          " deep, expected no manifest to list itself");
  std::ifstream in(arg, std::ios::binary);
  if (!in) fail({arg, 0, 0}, "cannot read manifest, expected a readable file listing species files");
  std::stringstream buffer;
  buffer << in.rdbuf();
  std::string text = buffer.str();
  require_text(text, arg);
  fs::path base = fs::path(arg).parent_path();
  std::istringstream lines(text);
  std::string line;
  int line_number = 0;
  bool any = false;
  while (std::getline(lines, line)) {
    ++line_number;
    std::size_t hash = line.find('#');
    if (hash != std::string::npos) line.erase(hash);
    std::size_t first = line.find_first_not_of(" \t\r");
    if (first == std::string::npos) continue;
    std::size_t last = line.find_last_not_of(" \t\r");
    std::string entry = line.substr(first, last - first + 1);
    fs::path path(entry);
    if (path.is_relative()) path = base / path;
    SourceLocation entry_where{arg, line_number, static_cast<int>(first) + 1};
    if (!fs::exists(path, ec)) fail(entry_where, "listed file " + quote(entry) + " does not exist");
    expand_one(path.string(), entry_where, depth + 1, out);
    any = true;
  }
  if (!any) fail({arg, 0, 0}, "manifest lists no files, expected one species file path per line");
}

}  // namespace

std::vector<std::string> expand_species_paths(const std::vector<std::string>& args) {
  std::vector<std::string> out;
  for (const std::string& arg : args) expand_one(arg, {}, 0, out);
  return out;
}

}  // namespace vibtherm
