// HTML report for one or many species: one self-contained HTML5 file (inline CSS and SVG,
// no scripts, no external resources, XHTML-compatible markup so XML tools read it).
// Formatting only: every number comes from report.hpp.
#pragma once

#include <string>
#include <string_view>
#include <vector>

#include "vibtherm/report.hpp"

namespace vibtherm {

struct ReportHeader {
  std::string version;                     // tool version; no date, so reruns give the same file
  std::vector<std::string> model_summary;  // one line each: model, standard state, scaling, fit
};

enum class TemperatureAxis { log, linear };

struct ReportWriteOptions {
  TemperatureAxis axis = TemperatureAxis::log;  // of the Cp(T) picture
};

// The whole page: header, caution, summary table, one <section> per species.
std::string write_report_html(const std::vector<ReportSpecies>& species, const ReportHeader& header,
                              const ReportWriteOptions& options = {});

// Cp(T) of one species as an inline <svg> element: the engine's curve, the fitted
// NASA polynomial over its range and the classical (equipartition) limit.
std::string Cp_curve_svg(const ReportSpecies& species, TemperatureAxis axis);

}  // namespace vibtherm
