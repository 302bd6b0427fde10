// The Python module `vibtherm`: the library's readers, engine, mode analysis and NASA fits
// for notebooks, with results as NumPy arrays. Wiring only (like src/cli/); see README.md.
#include <fmt/format.h>
#include <pybind11/stl.h>

#include "convert.hpp"
#include "results.hpp"
#include "vibtherm/read_nasa.hpp"
#include "vibtherm/read_species.hpp"

namespace py = pybind11;
using namespace vibtherm;
using namespace vibtherm::python;

namespace {

// One NASA-7 or NASA-9 polynomial read from a file.
struct Polynomial {
  NasaPolynomial value;
};

// f(item) for each item of a list or tuple (a list back), or f(value) for a single value.
template <class F>
py::object each(const py::handle& value, F f) {
  if (py::isinstance<py::list>(value) || py::isinstance<py::tuple>(value)) {
    py::list out;
    for (const auto& item : value) out.append(f(item));
    return py::object(std::move(out));
  }
  return f(value);
}

const char* const default_table_temperatures = "298.15,300:3000:100";
const char* const default_modes_temperatures = "50,100,200,298.15,500,1000,2000,3000";

py::object temperatures_or(const py::object& value, const char* fallback) {
  return value.is_none() ? py::str(fallback) : value;
}

FitOptions fit_options(const std::string& form, const py::object& range, bool cp_slope, double grid_step,
                       bool allow_missing_hf) {
  FitOptions fit;
  if (form != "nasa7" && form != "nasa9")
    throw py::value_error(fmt::format("form '{}': expected nasa7 or nasa9", form));
  fit.form = form == "nasa9" ? NasaForm::nasa9 : NasaForm::nasa7;
  fit.range =
      range.is_none() ? default_fit_range(fit.form) : parse_fit_range(range.cast<std::string>(), fit.form);
  fit.Cp_slope_continuous = cp_slope;
  if (!(grid_step > 0.0))
    throw py::value_error(fmt::format("grid_step {}: expected a positive step in K", grid_step));
  fit.grid_step_K = grid_step;
  fit.allow_missing_hf = allow_missing_hf;
  return fit;
}

py::array_t<double> coordinates(const Species& s) {
  py::array_t<double> out({static_cast<py::ssize_t>(s.atoms.size()), py::ssize_t{3}});
  auto view = out.mutable_unchecked<2>();
  for (std::size_t i = 0; i < s.atoms.size(); ++i)
    for (int k = 0; k < 3; ++k) view(i, k) = s.atoms[i].position_angstrom[k];
  return out;
}

py::object hessian(const Species& s) {
  if (!s.hessian_J_per_m2) return py::none();
  const auto n = static_cast<py::ssize_t>(3 * s.atoms.size());
  py::array_t<double> out({n, n});
  std::copy(s.hessian_J_per_m2->begin(), s.hessian_J_per_m2->end(), out.mutable_data());
  return py::object(std::move(out));
}

std::string species_repr(const Species& s) {
  return fmt::format("<vibtherm.Species '{}': {} atoms, {} frequencies{}>", s.name, s.atoms.size(),
                     s.frequencies_cm1.size(), s.hessian_J_per_m2 ? ", Hessian" : "");
}

}  // namespace

PYBIND11_MODULE(vibtherm, m) {
  m.doc() =
      "vibtherm: ideal-gas and surface thermochemistry from frequency calculations.\n"
      "Species come from files (vibtherm.read) or Python data (vibtherm.species); model options are\n"
      "keyword arguments named like the command-line options; results are dicts of NumPy arrays with\n"
      "the keys and units of the command line's JSON output.";
  m.attr("__version__") = VIBTHERM_VERSION;
  register_input_error(m);

  py::class_<Species>(m, "Species", "A species as read, before the model options are applied.")
      .def_property_readonly("name", [](const Species& s) { return s.name; })
      .def_property_readonly("file", [](const Species& s) { return s.origin.file; })
      .def_property_readonly("symbols",
                             [](const Species& s) {
                               std::vector<std::string> out;
                               for (const auto& a : s.atoms) out.push_back(a.symbol);
                               return out;
                             })
      .def_property_readonly(
          "isotopes",
          [](const Species& s) {
            std::vector<std::string> out;
            for (const auto& a : s.atoms) out.push_back(a.isotope);
            return out;
          },
          "isotope labels as given ('' = most abundant isotope)")
      .def_property_readonly(
          "masses",
          [](const Species& s) {
            std::vector<double> out;
            for (const auto& a : s.atoms) out.push_back(a.mass_amu);
            return array(out);
          },
          "atomic masses used, amu")
      .def_property_readonly("coordinates", &coordinates, "N×3 Cartesian coordinates, ångström")
      .def_property_readonly("formula", [](const Species& s) { return s.formula; })
      .def_property_readonly(
          "frequencies", [](const Species& s) { return array(s.frequencies_cm1); },
          "wavenumbers as given, cm^-1 (negative = imaginary); empty when a Hessian is given")
      .def_property_readonly("hessian", &hessian, "3N×3N Cartesian Hessian in J/m² (= N/m), or None")
      .def_property_readonly("symmetry_number", [](const Species& s) { return s.symmetry_number; })
      .def_property_readonly(
          "electronic_levels",
          [](const Species& s) {
            std::vector<std::pair<double, int>> out;
            for (const auto& l : s.electronic_levels) out.push_back({l.energy_cm1, l.degeneracy});
            return out;
          },
          "(energy cm^-1 above the ground level, degeneracy) pairs")
      .def_property_readonly(
          "enthalpy_of_formation",
          [](const Species& s) -> py::object {
            if (!s.enthalpy_of_formation_J_per_mol) return py::none();
            return py::float_(*s.enthalpy_of_formation_J_per_mol / 1e3);
          },
          "ΔfH°(298.15 K) in kJ/mol, or None")
      .def_property_readonly("phase",
                             [](const Species& s) { return s.phase == Phase::gas ? "gas" : "adsorbate"; })
      .def_property_readonly("transition_state", [](const Species& s) { return s.transition_state; })
      .def_property_readonly("hindered_rotor_count",
                             [](const Species& s) { return s.hindered_rotors.size(); })
      .def("__repr__", &species_repr);

  py::class_<PreparedSpecies>(m, "PreparedSpecies",
                              "A species prepared under model options (vibtherm.prepare).")
      .def_property_readonly("species", [](const PreparedSpecies& p) { return p.species; })
      .def_property_readonly("name", [](const PreparedSpecies& p) { return p.species.name; })
      .def_property_readonly("rotor", [](const PreparedSpecies& p) { return rotor_type_name(p.rotor.type); })
      .def_property_readonly(
          "frequencies", [](const PreparedSpecies& p) { return array(p.used_frequencies_cm1); },
          "wavenumbers used, cm^-1 (scaled; a dropped reaction coordinate is negative)")
      .def_property_readonly(
          "vibrations", [](const PreparedSpecies& p) { return array(p.vibrations_cm1); },
          "the real wavenumbers treated as harmonic vibrations, cm^-1")
      .def_property_readonly(
          "zpe", [](const PreparedSpecies& p) { return p.zero_point_energy_J_per_mol / 1e3; },
          "zero-point energy, kJ/mol")
      .def_property_readonly("warnings", [](const PreparedSpecies& p) { return p.warnings; })
      .def_property_readonly("notes", [](const PreparedSpecies& p) { return p.notes; })
      .def("__repr__", [](const PreparedSpecies& p) {
        return fmt::format("<vibtherm.PreparedSpecies '{}': {} rotor, {} vibrations>", p.species.name,
                           rotor_type_name(p.rotor.type), p.vibrations_cm1.size());
      });

  py::class_<Polynomial>(m, "NasaPolynomial",
                         "A NASA-7 or NASA-9 polynomial read from a file (vibtherm.read_nasa).")
      .def_property_readonly("name", [](const Polynomial& p) { return polynomial_name(p.value); })
      .def_property_readonly(
          "form",
          [](const Polynomial& p) { return std::holds_alternative<Nasa7>(p.value) ? "nasa7" : "nasa9"; })
      .def_property_readonly("T_min", [](const Polynomial& p) { return polynomial_T_min_K(p.value); })
      .def_property_readonly("T_max", [](const Polynomial& p) { return polynomial_T_max_K(p.value); })
      .def(
          "table",
          [](const Polynomial& p, const py::object& temperatures) {
            return polynomial_table_dict(p.value, python::temperatures(temperatures));
          },
          py::arg("temperatures"),
          "Cp, Cv (gas), S, H_minus_H298, G_minus_H298, minus_G_minus_H298_over_T, H, G at each T")
      .def("__repr__", [](const Polynomial& p) {
        return fmt::format("<vibtherm.NasaPolynomial '{}' ({}, {:g}-{:g} K)>", polynomial_name(p.value),
                           std::holds_alternative<Nasa7>(p.value) ? "NASA-7" : "NASA-9",
                           polynomial_T_min_K(p.value), polynomial_T_max_K(p.value));
      });

  m.def(
      "read",
      [](const py::object& paths) {
        std::vector<std::string> args;
        if (py::isinstance<py::str>(paths) || py::hasattr(paths, "__fspath__"))
          args.push_back(py::str(paths).cast<std::string>());
        else
          for (const auto& p : paths) args.push_back(py::str(p).cast<std::string>());
        std::vector<Species> out;
        for (const auto& source : expand_species_paths(args)) out.push_back(read_species_source(source));
        return out;
      },
      py::arg("path"),
      "Species from a species file, a directory of them or a manifest (or a list of those), in the "
      "order the command line reads them.");

  m.def(
      "species", [](const py::kwargs& keys) { return species_from_keys(keys); },
      "A species from Python data: the keys of the YAML species format (name, atoms or symbols with "
      "coordinates, frequencies or hessian, symmetry_number, ...), checked by the same reader.");

  m.def(
      "prepare",
      [](const Species& s, const py::kwargs& options) { return prepare_species(s, model_options(options)); },
      py::arg("species"),
      "The species under the model options (keywords: standard_state, pressure, scale, transition_state, "
      "imaginary_as_real_below, allow_mode_count_mismatch).");

  m.def(
      "table",
      [](const py::object& species, const py::object& temps, bool breakdown, const py::kwargs& options) {
        const std::vector<double> T = temperatures(temperatures_or(temps, default_table_temperatures));
        return each(species, [&](const py::handle& s) -> py::object {
          if (py::isinstance<Polynomial>(s)) {
            if (!options.empty() || breakdown)
              throw py::type_error("a NASA polynomial takes no model options and has no breakdown");
            return polynomial_table_dict(s.cast<const Polynomial&>().value, T);
          }
          return table_dict(prepared(s, options), T, breakdown);
        });
      },
      py::arg("species"), py::arg("temperatures") = py::none(), py::arg("breakdown") = false,
      "Thermodynamic functions at each temperature as a dict of NumPy arrays (T, Cp, Cv, S, H_minus_H298, "
      "H_minus_H0, G_minus_H298, minus_G_minus_H298_over_T; J/(mol K) and kJ/mol), for a species, a "
      "prepared species or a NASA polynomial; a list gives a list. Default temperatures: 298.15 K and "
      "300-3000 K every 100 K; text such as '300:3000:100' is accepted.");

  m.def(
      "modes",
      [](const py::object& species, const py::object& temps, double frozen_below, double active_above,
         const py::kwargs& options) {
        const std::vector<double> T = temperatures(temperatures_or(temps, default_modes_temperatures));
        const ActivationThresholds thresholds{frozen_below, active_above};
        validate(thresholds);
        return each(species, [&](const py::handle& s) {
          return modes_dict(analyse_modes(prepared(s, options), T, thresholds));
        });
      },
      py::arg("species"), py::arg("temperatures") = py::none(), py::arg("frozen_below") = 0.1,
      py::arg("active_above") = 0.9,
      "Per-mode activation: wavenumber, theta, zpe, T_half... per mode; Cv_over_R [T, mode] and state; "
      "dof per motion (2 Cv/R) at each T.");

  m.def(
      "inspect",
      [](const py::object& species, const py::kwargs& options) {
        return each(species, [&](const py::handle& s) { return facts_dict(prepared(s, options)); });
      },
      py::arg("species"),
      "Derived facts: formula, mass, moments, rotor, symmetry number, frequencies, ZPE, warnings.");

  m.def(
      "fit",
      [](const py::object& species, const std::string& form, const py::object& range, bool cp_slope,
         double grid_step, bool allow_missing_hf, const py::kwargs& options) {
        const FitOptions fit = fit_options(form, range, cp_slope, grid_step, allow_missing_hf);
        return each(species, [&](const py::handle& s) {
          const PreparedSpecies p = prepared(s, options);
          return fit_dict(fit_species(p, fit), fit, p.species.origin.file);
        });
      },
      py::arg("species"), py::arg("form") = "nasa7", py::arg("range") = py::none(),
      py::arg("cp_slope") = false, py::arg("grid_step") = 5.0, py::arg("allow_missing_hf") = false,
      "NASA-7 or NASA-9 fit: the `fit --form json` entry of the species as a dict, plus 'coefficients' "
      "(NumPy arrays per range) and 'record' (the fixed-column text).");

  m.def(
      "read_nasa",
      [](const std::string& path) {
        std::vector<Polynomial> out;
        for (auto& p : read_nasa_file(path)) out.push_back({std::move(p)});
        return out;
      },
      py::arg("path"), "The NASA-7 / NASA-9 polynomials of a thermo file, in file order.");
}
