// Reading species files of every supported format into the same Species: the
// dispatcher, and the headers of the format readers and of path expansion.
#pragma once

#include <cstddef>
#include <string>

#include "vibtherm/read_molden.hpp"
#include "vibtherm/read_qcschema.hpp"
#include "vibtherm/read_xyz.hpp"
#include "vibtherm/read_yaml.hpp"
#include "vibtherm/species.hpp"
#include "vibtherm/species_paths.hpp"

namespace vibtherm {

// Limits of one species file, beyond which it is refused before or after parsing: its
// size, its atoms and its frequencies (a 2,000-atom adsorbate has 6,000 modes).
inline constexpr std::size_t max_species_file_bytes = 32u << 20;  // 32 MiB
inline constexpr std::size_t max_species_atoms = 2000;
inline constexpr std::size_t max_species_frequencies = 6000;
// Values (list entries, keys, scalars) in one YAML file, counted before the document is
// built: yaml-cpp's tree costs about 550 bytes per value, so this bounds it near 550 MB.
// A full Hessian for up to 333 atoms (its lower triangle for up to 471) fits.
inline constexpr std::size_t max_yaml_values = 1000000;
// The same for a QCSchema JSON file (a 32 MiB array of 16 million numbers took 658 MB).
inline constexpr std::size_t max_json_values = 1000000;

// Reads a file, choosing the reader by content and extension (species_format.hpp). Only
// regular files are read (not /dev/zero, a FIFO or a directory). When `bytes` is given it
// receives the file's content, e.g. for a checksum without reading the file again.
Species read_species_file(const std::string& path, std::string* bytes = nullptr);

// The same for a text already read; `path` names it in errors and decides by extension.
Species read_species_text(const std::string& text, const std::string& path);

// Reads a species source: a file (as read_species_file), or a manifest's inline species (its
// line read as YAML at its line and columns, paths relative to the manifest; `bytes` gets
// the line).
Species read_species_source(const SpeciesSource& source, std::string* bytes = nullptr);

// Reads a QC exchange file (QCSchema JSON or Molden normal modes) named by a species file's
// `from:`: its vibrations may be missing, the species file then gives them. Other formats
// are refused.
Species read_exchange_file(const std::string& path, std::string* bytes = nullptr);

}  // namespace vibtherm
