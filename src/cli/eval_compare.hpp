// vibtherm eval wiring shared by its two files: the options, reading the NASA file with
// its report of bad records, and the comparison mode (--against).
#pragma once

#include <string>
#include <vector>

#include "vibtherm/nasa.hpp"
#include "vibtherm/read_nasa.hpp"

namespace vibtherm::cli {

struct EvalOptions {
  std::string file;
  std::vector<std::string> species;
  std::string temps_text;
  std::string against;
  std::string format = "text";
  std::string output = "-";
  bool keep_going = false;
  unsigned jobs = 0;
};

// Reads `path`, printing its warnings and sanity findings. Bad records: without
// `keep_going` an InputError (the first, with the count of the others: one error line);
// with it each is printed, and Exit(1) when no species could be read.
NasaFile read_for_eval(const std::string& path, bool keep_going);

// The files eval reads: FILE, and with --against the other NASA file or the species files
// (and manifests) it names. An output must not replace any of them.
std::vector<std::string> eval_inputs(const EvalOptions& options);

// The output of `eval FILE --against OTHER`: the chosen species of FILE compared with the
// species of the same name in OTHER, at `asked` (empty: every 10 K over the common range).
std::string compare_output(const EvalOptions& options, const std::vector<const NasaPolynomial*>& chosen,
                           const std::vector<double>& asked);

}  // namespace vibtherm::cli
