// libFuzzer entry point for the manifest parser: malformed text ends in an InputError,
// every entry it returns is a non-empty path on a line of the text, and an inline species
// line reads as a species or ends in an InputError.
#include <cstddef>
#include <cstdint>
#include <string>

#include "species_checks.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/read_species.hpp"
#include "vibtherm/species_paths.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  try {
    for (const auto& e : vibtherm::parse_manifest(text, "fuzz.list")) {
      if (e.path.empty() || e.where.line < 1 || e.where.column < 1) __builtin_trap();
      if (e.path.find('\n') != std::string::npos) __builtin_trap();
      if (!e.overlay && e.path.find('#') != std::string::npos) __builtin_trap();  // comments are cut
      if (e.overlay) {  // an inline species: read as YAML, a malformed one is an InputError
        try {
          vibtherm::fuzz::check_species(vibtherm::read_species_source({"fuzz.list", e.path, e.where.line}));
        } catch (const vibtherm::InputError&) {
        }
      }
    }
  } catch (const vibtherm::InputError&) {
  }
  return 0;
}
