// Compile-time checks on the derived constants (values from memory of CODATA 2018 tables).
#include "vibtherm/constants.hpp"

namespace vibtherm::constants {
static_assert(gas_constant_J_per_mol_K > 8.3144626 && gas_constant_J_per_mol_K < 8.3144627);
static_assert(second_radiation_cm_K > 1.4387768 && second_radiation_cm_K < 1.4387769);
}  // namespace vibtherm::constants
