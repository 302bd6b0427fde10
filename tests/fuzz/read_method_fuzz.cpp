// libFuzzer entry point for the method-file reader. A malformed input must end in an
// InputError; any other exception, a crash or a sanitizer report is a bug. An accepted
// method has a label and at least one element with a finite energy.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <string>

#include "vibtherm/error.hpp"
#include "vibtherm/read_method.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  try {
    const vibtherm::Method m = vibtherm::read_method_yaml(text, "fuzz.yaml");
    if (m.elements.empty()) __builtin_trap();
    for (const auto& [symbol, atom] : m.elements)
      if (!std::isfinite(atom.energy_J_per_mol + atom.spin_orbit_J_per_mol)) __builtin_trap();
  } catch (const vibtherm::InputError&) {
  }
  return 0;
}
