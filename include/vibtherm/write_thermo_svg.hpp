// Pictures of Cp, S and H − H(298.15 K) versus T for the report: the engine's curve, the
// fitted polynomial, and under each a residual panel (fit − computed) with the fit's warning
// thresholds drawn, on the temperature axis the modes picture uses (svg_plot.hpp).
#pragma once

#include <string>

#include "vibtherm/report.hpp"

namespace vibtherm {

enum class ThermoQuantity { Cp, S, H_minus_H298 };

// An inline <svg> element (no XML declaration); `logarithmic` selects the temperature axis.
std::string thermo_svg(const ReportSpecies& species, ThermoQuantity quantity, bool logarithmic);

}  // namespace vibtherm
