#include "vibtherm/scale_factors.hpp"

#include <fmt/format.h>

#include <cmath>

#include "vibtherm/error.hpp"
#include "vibtherm/limits.hpp"

namespace vibtherm {

ResolvedScaleFactors resolve_scale_factors(const ScaleFactors& command_line, const ScaleFactors& species_file,
                                           double one_for_all, const SourceLocation& where) {
  const auto pick = [&](const std::optional<double>& cli, const std::optional<double>& file,
                        const char* what) {
    const double f = cli ? *cli : file ? *file : one_for_all;
    // The bounds of --scale (limits.hpp): 1e308 once gave an infinite ZPE, 1e-320 a NaN Cp.
    if (!(f >= limits::min_frequency_scale && f <= limits::max_frequency_scale))
      fail(cli || !file ? SourceLocation{} : where,
           fmt::format("frequency scale factor for the {} is {:g}, expected {:g} to {:g}", what, f,
                       limits::min_frequency_scale, limits::max_frequency_scale));
    return f;
  };
  ResolvedScaleFactors r;
  r.zpe = pick(command_line.zpe, species_file.zpe, "zero-point energy");
  r.enthalpy = pick(command_line.enthalpy, species_file.enthalpy, "enthalpy");
  r.entropy = pick(command_line.entropy, species_file.entropy, "entropy");
  return r;
}

std::string scale_factors_note(const ResolvedScaleFactors& f) {
  if (f.zpe == 1.0 && f.enthalpy == 1.0 && f.entropy == 1.0) return "";
  if (f.uniform()) return fmt::format("wavenumbers scaled by {:g}", f.entropy);
  return fmt::format(
      "frequency scale factors: zero-point energy {:g}, thermal enthalpy {:g}, entropy and heat capacity "
      "{:g} "
      "(the wavenumbers shown are scaled by the entropy factor)",
      f.zpe, f.enthalpy, f.entropy);
}

}  // namespace vibtherm
