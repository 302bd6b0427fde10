// libFuzzer entry point for the species readers. A malformed input must end in an
// InputError (the located one-line message); any other exception, a crash or a sanitizer
// report is a bug. Both readers see every input: a YAML-looking file is a fine XYZ
// stress test and the other way round.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <string>

#include "vibtherm/error.hpp"
#include "vibtherm/read_species.hpp"

namespace {

void check_species(const vibtherm::Species& s) {
  // Whatever a reader accepts must be usable without further checks of its form.
  if (s.name.empty()) __builtin_trap();
  if (s.atoms.empty() && !s.rotor_data) __builtin_trap();
  if (s.symmetry_number < 1 || s.electronic_levels.empty()) __builtin_trap();
  for (const vibtherm::ElectronicLevel& level : s.electronic_levels)
    if (level.degeneracy < 1 || !(level.energy_cm1 >= 0.0)) __builtin_trap();
  for (const vibtherm::Atom& a : s.atoms)
    if (!(a.mass_amu > 0.0) || !a.position_angstrom.allFinite()) __builtin_trap();
  for (double nu : s.frequencies_cm1)
    if (nu == 0.0 || !std::isfinite(nu)) __builtin_trap();
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  try {
    check_species(vibtherm::read_species_yaml(text, "fuzz.yaml"));
  } catch (const vibtherm::InputError&) {
  }
  try {
    check_species(vibtherm::read_species_xyz(text, "fuzz.xyz"));
  } catch (const vibtherm::InputError&) {
  }
  return 0;
}
