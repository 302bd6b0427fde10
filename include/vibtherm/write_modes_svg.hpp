// The mode-activation picture shared by `modes --svg` and the HTML report: per species a
// heat map of Cv/R of every vibration and hindered rotor versus T, and the curve F(T) = 2 Cv/R
// with its classical plateaus, drawn with svg_plot.hpp on one temperature axis.
#pragma once

#include <string>
#include <utility>
#include <vector>

#include "vibtherm/modes.hpp"

namespace vibtherm {

struct ModesSvgOptions {
  // false: an <svg> element to place inside an HTML page, without the XML declaration
  // and namespace attribute (the HTML parser supplies the namespace).
  bool standalone = true;
  std::string id_prefix;         // prepended to element ids, unique when several pictures share a page
  bool species_titles = true;    // the report has its own heading per species
  bool logarithmic_axis = true;  // temperature axis; the report follows its --t-axis
};

// The reports should be sampled densely in ln T (log_spaced_temperatures); the axis spans
// their first to last temperature, so a report sampled on the span of its other pictures
// lines up with them (svg_plot.hpp keeps the plot box at the same x).
std::string modes_to_svg(const std::vector<ModesReport>& reports, const ModesSvgOptions& options = {});

// The temperature span a picture shows for the requested temperatures: their range,
// widened geometrically about its centre to at least one decade so the activation of a
// mode (a factor of about 5 in T from 10 % to 90 % of its share) stays visible.
std::pair<double, double> svg_temperature_span_K(const std::vector<double>& requested_K);
inline constexpr int svg_samples_per_species = 161;

}  // namespace vibtherm
