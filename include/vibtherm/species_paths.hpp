// From command-line arguments to species files: files as given, directories to the
// species files in them, manifests to the files they list.
#pragma once

#include <cstddef>
#include <string>
#include <vector>

#include "vibtherm/error.hpp"

namespace vibtherm {

// The extension of `path` in lower case, with its dot (".yaml"); empty when it has none.
std::string lowercase_extension(const std::string& path);

// True for the extensions of species files (.yaml, .yml, .xyz, .json, .molden): the files a
// directory argument expands to.
bool is_species_extension(const std::string& extension);

// Limits of the expansion: manifests listing manifests at most this deep, and at most
// this many species paths and manifest reads in all (a manifest listing itself, directly or not, is an error
// of its own).
inline constexpr int max_manifest_depth = 16;
inline constexpr std::size_t max_species_paths = 1000000;
inline constexpr std::size_t max_manifests = 10000;  // manifest files read in one run

// One species to read: a file, or a manifest line that is an inline YAML species in flow
// style (`{from: water.json, symmetry_number: 2}`), read like a species file standing where
// the manifest stands, with the manifest's line and columns in its errors.
struct SpeciesSource {
  std::string path;     // the species file; for an inline species, the manifest holding it
  std::string overlay;  // the manifest line of an inline species (empty: the whole file)
  int line = 0;         // that line (1-based)
  // What names it in messages and provenance: the path, or "MANIFEST:LINE".
  std::string label() const;
};

// Expands the command-line arguments: files as given, directories to their species
// files (sorted by name, not recursive), manifests (*.list: one path per line, relative
// to the manifest, '#' comments; or a line starting with '{', an inline species) to what
// they list.
std::vector<SpeciesSource> expand_species_paths(const std::vector<std::string>& args);

// The manifests the expansion of `args` reads, each once, in the order first read: inputs
// too, which an output must not replace.
std::vector<std::string> manifest_paths(const std::vector<std::string>& args);

// The file paths of sources (an inline species gives its manifest).
std::vector<std::string> source_paths(const std::vector<SpeciesSource>& sources);

// One line of a manifest: the path as written (or the whole line of an inline species,
// `overlay` set) and where it stands.
struct ManifestEntry {
  std::string path;
  SourceLocation where;
  bool overlay = false;
};
// The entries of a manifest's text (no file system access); InputError when it lists none.
std::vector<ManifestEntry> parse_manifest(const std::string& text, const std::string& file_name);

}  // namespace vibtherm
