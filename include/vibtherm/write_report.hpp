// HTML report for one or many species: one self-contained HTML5 file (inline CSS and SVG, one
// small inline script that only sorts the index table, no external resources, XHTML-compatible
// markup so XML tools read it). Formatting only: every number comes from report.hpp.
#pragma once

#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "vibtherm/report.hpp"

namespace vibtherm {

struct ReportHeader {
  std::string version;                     // tool version; no date, so reruns give the same file
  std::vector<std::string> model_summary;  // one line each: model, standard state, scaling, fit
  std::vector<std::pair<std::string, std::string>> options;  // every option that shapes a number, as used
};

enum class TemperatureAxis { log, linear };

struct ReportWriteOptions {
  TemperatureAxis axis = TemperatureAxis::log;  // of every picture
};

// The whole page: run and options, caution, the index table (species with warnings first,
// then by worst fit error), one <section> per species.
std::string write_report_html(const std::vector<ReportSpecies>& species, const ReportHeader& header,
                              const ReportWriteOptions& options = {});

// Index of the rows in the default order of the index table: warnings first (most first),
// then the largest Cp fit error, then input order.
std::vector<size_t> index_order(const std::vector<ReportSpecies>& species);

}  // namespace vibtherm
