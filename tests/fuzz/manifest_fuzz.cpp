// libFuzzer entry point for the manifest parser: malformed text ends in an InputError,
// every entry it returns is a non-empty path on a line of the text.
#include <cstddef>
#include <cstdint>
#include <string>

#include "vibtherm/error.hpp"
#include "vibtherm/species_paths.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  try {
    for (const auto& e : vibtherm::parse_manifest(text, "fuzz.list")) {
      if (e.path.empty() || e.where.line < 1 || e.where.column < 1) __builtin_trap();
      if (e.path.find('#') != std::string::npos || e.path.find('\n') != std::string::npos) __builtin_trap();
    }
  } catch (const vibtherm::InputError&) {
  }
  return 0;
}
