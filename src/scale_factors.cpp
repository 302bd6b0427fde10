#include "vibtherm/scale_factors.hpp"

#include <fmt/format.h>

#include <cmath>

#include "vibtherm/error.hpp"

namespace vibtherm {

ResolvedScaleFactors resolve_scale_factors(const ScaleFactors& command_line, const ScaleFactors& species_file,
                                           double one_for_all, const SourceLocation& where) {
  const auto pick = [&](const std::optional<double>& cli, const std::optional<double>& file,
                        const char* what) {
    const double f = cli ? *cli : file ? *file : one_for_all;
    if (!(f > 0.0) || !std::isfinite(f))
      fail(
          cli || !file ? SourceLocation{} : where,
          fmt::format("frequency scale factor for the {} must be a positive finite number, got {}", what, f));
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
