// libFuzzer entry point for the XYZ-plus-frequencies species reader (read_xyz). A
// malformed input must end in an InputError; any other exception, a crash or a sanitizer
// report is a bug.
#include <cstddef>
#include <cstdint>
#include <string>

#include "species_checks.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/read_xyz.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  try {
    vibtherm::fuzz::check_species(vibtherm::read_species_xyz(text, "fuzz.xyz"));
  } catch (const vibtherm::InputError&) {
  }
  return 0;
}
