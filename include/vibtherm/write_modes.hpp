// Writers for the frozen-out-modes diagnostics (modes.hpp): a grid a person reads at a
// glance, CSV in long form, JSON with the keys pinned in design.md section 5, and an SVG
// picture drawn here without a plotting library. Writers format; they compute no physics.
#pragma once

#include <string>
#include <utility>
#include <vector>

#include "vibtherm/modes.hpp"

namespace vibtherm {

// Per species: a header with the classical limits, one row per mode (wavenumber, θ,
// zero-point share, half-activation temperature, then state and Cv/R share at each
// temperature), and one summary line per temperature.
std::string modes_to_text(const std::vector<ModesReport>& reports);

// One row per (species, temperature, item), item being a motion, the total, or a mode.
std::string modes_to_csv(const std::vector<ModesReport>& reports);

// {"units", "thresholds", "species": [{"name", "phase", "rotor", "classical_dof", "vibrations",
//   "temperatures": [{"T", "dof", "modes": [{"index", "wavenumber", "Cv_over_R", "state"}]}]}]}
// Indented with 1 space per level; one trailing newline.
std::string modes_to_json(const std::vector<ModesReport>& reports);

// Per species: a heat map of each mode's Cv/R versus T (log axis) and the curve F(T) with
// the classical plateaus. The reports should be sampled densely in ln T (see
// log_spaced_temperatures); each point becomes one column of the heat map.
struct ModesSvgOptions {
  // false: an <svg> element to place inside an HTML page, without the XML declaration
  // and namespace attribute (the HTML parser supplies the namespace).
  bool standalone = true;
  std::string id_prefix;  // prepended to element ids, unique when several pictures share a page
};
std::string modes_to_svg(const std::vector<ModesReport>& reports, const ModesSvgOptions& options = {});

// The temperature span a picture shows for the requested temperatures: their range,
// widened geometrically about its centre to at least one decade so the activation of a
// mode (a factor of about 5 in T from 10 % to 90 % of its share) stays visible.
std::pair<double, double> svg_temperature_span_K(const std::vector<double>& requested_K);
inline constexpr int svg_samples_per_species = 161;

}  // namespace vibtherm
