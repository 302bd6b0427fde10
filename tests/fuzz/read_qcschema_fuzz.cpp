// libFuzzer entry point for the QCSchema reader. A malformed input must end in an
// InputError (the located one-line message); any other exception, a crash or a sanitizer
// report is a bug. Both modes are tried: a full result and geometry only (`from:`).
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <string>

#include "vibtherm/error.hpp"
#include "vibtherm/read_qcschema.hpp"

namespace {

void check_species(const vibtherm::Species& s) {
  if (s.name.empty() || s.atoms.empty()) __builtin_trap();
  for (const vibtherm::ElectronicLevel& level : s.electronic_levels)  // may be empty: spin from electrons
    if (level.degeneracy < 1 || !(level.energy_cm1 >= 0.0)) __builtin_trap();
  for (const vibtherm::Atom& a : s.atoms)
    if (!(a.mass_amu > 0.0) || !a.position_angstrom.allFinite()) __builtin_trap();
  if (s.hessian_J_per_m2) {
    const std::size_t n = 3 * s.atoms.size();
    if (s.hessian_J_per_m2->size() != n * n) __builtin_trap();
    for (double v : *s.hessian_J_per_m2)
      if (!std::isfinite(v)) __builtin_trap();
  }
  if (s.electronic_energy_J_per_mol && !std::isfinite(*s.electronic_energy_J_per_mol)) __builtin_trap();
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  for (bool geometry_only : {false, true}) {
    try {
      check_species(vibtherm::read_species_qcschema(text, "fuzz.json", geometry_only));
    } catch (const vibtherm::InputError&) {
    }
  }
  return 0;
}
