// libFuzzer entry point for the reaction-file reader. A malformed input must end in an
// InputError; any other exception, a crash or a sanitizer report is a bug. An accepted
// reaction has at least two species with nonzero finite coefficients.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <string>

#include "vibtherm/error.hpp"
#include "vibtherm/read_reaction.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  try {
    const vibtherm::ReactionFile r = vibtherm::read_reaction_yaml(text, "fuzz.yaml");
    if (r.terms.size() < 2) __builtin_trap();
    for (const auto& t : r.terms)
      if (!std::isfinite(t.coefficient) || t.coefficient == 0.0) __builtin_trap();
    if (r.unknown && *r.unknown >= r.terms.size()) __builtin_trap();
  } catch (const vibtherm::InputError&) {
  }
  return 0;
}
