// libFuzzer entry point for the Molden normal-mode reader. A malformed input must end in
// an InputError (the located one-line message); any other exception, a crash or a
// sanitizer report is a bug. Both modes are tried: with [FREQ] required and geometry only.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <string>

#include "vibtherm/error.hpp"
#include "vibtherm/read_molden.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  for (bool geometry_only : {false, true}) {
    try {
      const vibtherm::Species s = vibtherm::read_species_molden(text, "fuzz.molden", geometry_only);
      if (s.name.empty() || s.atoms.empty()) __builtin_trap();
      for (const vibtherm::Atom& a : s.atoms)
        if (!(a.mass_amu > 0.0) || !a.position_angstrom.allFinite()) __builtin_trap();
      if (s.frequencies_cm1.size() > 3 * s.atoms.size()) __builtin_trap();
      for (double nu : s.frequencies_cm1)
        if (nu == 0.0 || !std::isfinite(nu)) __builtin_trap();
    } catch (const vibtherm::InputError&) {
    }
  }
  return 0;
}
