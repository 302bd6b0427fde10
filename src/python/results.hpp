// Results of the library as Python values for the `vibtherm` module: thermo tables and
// mode analyses as dicts of NumPy arrays (keys and units of the command line's JSON),
// facts and fits as dicts. Wiring only.
#pragma once

#include "convert.hpp"
#include "vibtherm/fit_nasa.hpp"

namespace vibtherm::python {

// Keys of the `table` JSON rows: T, Cp, Cv, S, H_minus_H298, H_minus_H0, G_minus_H298,
// minus_G_minus_H298_over_T (J/(mol K), kJ/mol); with `breakdown`, "motions" maps each
// motion to its Cp, Cv, S, H_minus_H0 and ln_q arrays.
py::dict table_dict(const PreparedSpecies& prepared, const std::vector<double>& temperatures_K,
                    bool breakdown);
// The columns a NASA polynomial determines (no Cv, H_minus_H0 or motions).
py::dict polynomial_table_dict(const NasaPolynomial& polynomial, const std::vector<double>& temperatures_K);

py::dict modes_dict(const ModesReport& report);
py::dict facts_dict(const PreparedSpecies& prepared);

// The fit's JSON document (as `fit --form json` writes it for this species) as a dict, plus
// "coefficients" (one NumPy array per range: NASA-7 a1..a7, NASA-9 a1..a7 b1 b2) and
// "record" (the NASA-7 or NASA-9 text record).
py::dict fit_dict(const SpeciesFit& fit, const FitOptions& options, const std::string& input_file);

}  // namespace vibtherm::python
