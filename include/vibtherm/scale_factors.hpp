// Frequency scale factors per quantity (zero-point energy, thermal enthalpy, entropy and
// heat capacity): which factor applies, from the command line, the species file or the
// one-for-all --scale, and the model note that records it.
#pragma once

#include <string>

#include "vibtherm/species.hpp"

namespace vibtherm {

struct ResolvedScaleFactors {
  double zpe = 1.0;
  double enthalpy = 1.0;
  double entropy = 1.0;  // also the heat capacity and the wavenumbers shown as "used"
  bool uniform() const { return zpe == enthalpy && enthalpy == entropy; }
};

// Each quantity takes the first factor set among: the command line's per-quantity option,
// the species file's `scale`, the one-for-all `--scale`. Throws InputError (located at
// `where`) for a factor that is not positive and finite.
ResolvedScaleFactors resolve_scale_factors(const ScaleFactors& command_line, const ScaleFactors& species_file,
                                           double one_for_all, const SourceLocation& where);

// "frequency scale factors: ZPE 0.98, enthalpy 0.99, entropy/Cp 1 (...)"; "" when all are 1.
std::string scale_factors_note(const ResolvedScaleFactors& factors);

}  // namespace vibtherm
