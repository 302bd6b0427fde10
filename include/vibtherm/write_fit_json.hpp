// JSON form of NASA fits: coefficients, ranges, composition, molar mass, fit errors,
// physical-bounds excursions, warnings and provenance (tool version, input checksum,
// model and fit options). Schema: schemas/fit.schema.json.
#pragma once

#include <string>
#include <utility>
#include <vector>

#include "vibtherm/fit_nasa.hpp"

namespace vibtherm {

struct FitProvenance {
  std::string input_file;
  std::string input_sha256;
  std::vector<std::pair<std::string, std::string>> model_options;  // name, value as given
};

struct FitRecord {
  SpeciesFit fit;
  FitProvenance provenance;
};

std::string write_fit_json(const std::vector<FitRecord>& records, const FitOptions& options);

}  // namespace vibtherm
