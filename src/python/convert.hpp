// Conversions between Python values and the library's types for the `vibtherm` module:
// keyword options, temperature lists, species keys, NumPy arrays. Wiring only.
#pragma once

#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>

#include <string>
#include <vector>

#include "vibtherm/modes.hpp"
#include "vibtherm/nasa.hpp"
#include "vibtherm/thermo.hpp"

namespace vibtherm::python {

namespace py = pybind11;

// Model options from keyword arguments named like the command-line options (dashes become
// underscores): standard_state, pressure, scale, transition_state, imaginary_as_real_below,
// allow_mode_count_mismatch. An unknown keyword is a TypeError naming the accepted ones.
ModelOptions model_options(const py::dict& keywords);
const std::vector<std::string>& model_option_names();

// Removes and returns the keywords in `names` from `keywords` (for functions that take
// their own keywords beside the model options).
py::dict take(py::dict& keywords, const std::vector<std::string>& names);

// Temperatures from a CLI-style text ("298.15,300:3000:100"), a number, or a sequence / NumPy
// array of numbers; every value positive and finite.
std::vector<double> temperatures(const py::handle& value);

// A species from the keys of the YAML format (design.md section 4), given as Python values;
// `symbols` with `coordinates` (N×3, ångström) may stand for `atoms`. The keys go through
// the YAML reader itself, so every check and every key it knows apply unchanged.
Species species_from_keys(const py::dict& keys);

py::array_t<double> array(const std::vector<double>& values);

// The species to work on: a PreparedSpecies as it is (no options allowed then), a Species
// prepared under `options`.
PreparedSpecies prepared(const py::handle& species, const py::dict& options);

// Raises the Python InputError for an InputError (file, line, column, message attributes).
void register_input_error(py::module_& m);

}  // namespace vibtherm::python
