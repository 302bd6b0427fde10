#include "results.hpp"

#include <fmt/format.h>

#include <array>

#include "vibtherm/checksum.hpp"
#include "vibtherm/constants.hpp"
#include "vibtherm/facts.hpp"
#include "vibtherm/write_fit_json.hpp"
#include "vibtherm/write_nasa7.hpp"
#include "vibtherm/write_nasa9.hpp"

namespace vibtherm::python {

namespace {

constexpr double R = constants::gas_constant_J_per_mol_K;

constexpr const auto& motions = motion_parts;

// One column of `rows`, computed as the JSON writers compute it, so the numbers are the
// same doubles.
template <class Row, class F>
py::array_t<double> column(const std::vector<Row>& rows, F value) {
  py::array_t<double> out(static_cast<py::ssize_t>(rows.size()));
  double* data = out.mutable_data();
  for (std::size_t i = 0; i < rows.size(); ++i) data[i] = value(rows[i]);
  return out;
}

py::dict rows_dict(const std::vector<ThermoPoint>& rows, bool model_columns) {
  py::dict d;
  d["T"] = column(rows, [](const ThermoPoint& r) { return r.T_K; });
  d["Cp"] = column(rows, [](const ThermoPoint& r) { return r.Cp_J_per_mol_K; });
  if (model_columns) d["Cv"] = column(rows, [](const ThermoPoint& r) { return r.Cv_J_per_mol_K; });
  d["S"] = column(rows, [](const ThermoPoint& r) { return r.S_J_per_mol_K; });
  d["H_minus_H298"] = column(rows, [](const ThermoPoint& r) { return r.H_minus_H298_J_per_mol / 1e3; });
  if (model_columns)
    d["H_minus_H0"] = column(rows, [](const ThermoPoint& r) { return r.H_minus_H0_J_per_mol / 1e3; });
  d["G_minus_H298"] = column(rows, [](const ThermoPoint& r) { return r.G_minus_H298_J_per_mol / 1e3; });
  d["minus_G_minus_H298_over_T"] =
      column(rows, [](const ThermoPoint& r) { return r.gibbs_function_J_per_mol_K; });
  return d;
}

py::list texts(const std::vector<std::string>& lines) {
  py::list out;
  for (const auto& line : lines) out.append(line);
  return out;
}

}  // namespace

py::dict table_dict(const PreparedSpecies& prepared, const std::vector<double>& temperatures_K,
                    bool breakdown) {
  const std::vector<ThermoPoint> rows = tabulate(prepared, temperatures_K);
  py::dict d = rows_dict(rows, true);
  if (breakdown) {
    py::dict by_motion;
    for (const auto& m : motions) {
      const auto terms = m.terms;
      py::dict t;
      t["Cp"] = column(rows, [terms](const ThermoPoint& r) { return (r.*terms).Cp_over_R * R; });
      t["Cv"] = column(rows, [terms](const ThermoPoint& r) { return (r.*terms).Cv_over_R * R; });
      t["S"] = column(rows, [terms](const ThermoPoint& r) { return (r.*terms).S_over_R * R; });
      t["H_minus_H0"] =
          column(rows, [terms](const ThermoPoint& r) { return (r.*terms).H_over_RT * R * r.T_K / 1e3; });
      t["ln_q"] = column(rows, [terms](const ThermoPoint& r) { return (r.*terms).ln_q; });
      by_motion[m.name] = t;
    }
    d["motions"] = by_motion;
  }
  return d;
}

py::dict polynomial_table_dict(const NasaPolynomial& polynomial, const std::vector<double>& temperatures_K) {
  std::vector<ThermoPoint> rows;
  for (double T : temperatures_K) rows.push_back(polynomial_table_row(polynomial, T));
  py::dict d = rows_dict(rows, false);
  // As `eval`: Cv = Cp − R for a gas, and the polynomial's absolute H and G = H − TS.
  if (polynomial_is_gas(polynomial))
    d["Cv"] = column(rows, [](const ThermoPoint& r) { return r.Cv_J_per_mol_K; });
  d["H"] = column(rows,
                  [&](const ThermoPoint& r) { return polynomial_at(polynomial, r.T_K).H_J_per_mol() / 1e3; });
  d["G"] = column(rows, [&](const ThermoPoint& r) {
    return (polynomial_at(polynomial, r.T_K).H_J_per_mol() - r.T_K * r.S_J_per_mol_K) / 1e3;
  });
  return d;
}

py::dict modes_dict(const ModesReport& r) {
  const std::size_t nT = r.points.size(), nm = r.modes.size();
  py::dict d;
  d["name"] = r.name;
  d["phase"] = r.is_gas ? "gas" : "adsorbate";
  d["rotor"] = rotor_type_name(r.rotor);
  d["T"] = column(r.points, [](const ModesPoint& p) { return p.T_K; });
  d["wavenumber"] = column(r.modes, [](const ModeConstants& m) { return m.wavenumber_cm1; });
  d["theta"] = column(r.modes, [](const ModeConstants& m) { return m.theta_K; });
  d["zpe"] = column(r.modes, [](const ModeConstants& m) { return m.zero_point_energy_J_per_mol / 1000.0; });
  d["zpe_share"] = column(r.modes, [](const ModeConstants& m) { return m.zero_point_share; });
  d["T_unfreeze"] = column(r.modes, [](const ModeConstants& m) { return m.unfreezes_at_K; });
  d["T_half"] = column(r.modes, [](const ModeConstants& m) { return m.half_active_at_K; });
  d["T_active"] = column(r.modes, [](const ModeConstants& m) { return m.active_at_K; });
  py::array_t<double> cv({static_cast<py::ssize_t>(nT), static_cast<py::ssize_t>(nm)});
  auto view = cv.mutable_unchecked<2>();
  py::list states;
  for (std::size_t t = 0; t < nT; ++t) {
    py::list row;
    for (std::size_t i = 0; i < nm; ++i) {
      view(t, i) = r.points[t].modes[i].Cv_over_R;
      row.append(mode_state_name(r.points[t].modes[i].state));
    }
    states.append(row);
  }
  d["Cv_over_R"] = cv;  // [temperature, mode]
  d["state"] = states;  // [temperature][mode]: frozen, partial, active
  py::dict dof, classical;
  dof["translation"] = column(r.points, [](const ModesPoint& p) { return p.dof.translation; });
  dof["rotation"] = column(r.points, [](const ModesPoint& p) { return p.dof.rotation; });
  dof["vibration"] = column(r.points, [](const ModesPoint& p) { return p.dof.vibration; });
  dof["hindered_rotors"] = column(r.points, [](const ModesPoint& p) { return p.dof.hindered_rotors; });
  dof["total"] = column(r.points, [](const ModesPoint& p) { return p.dof.total; });
  dof["electronic"] = column(r.points, [](const ModesPoint& p) { return p.dof.electronic; });
  d["dof"] = dof;
  classical["translation"] = r.classical.translation;
  classical["rotation"] = r.classical.rotation;
  classical["vibration"] = r.classical.vibration;
  classical["hindered_rotors"] = r.classical.hindered_rotors;
  classical["total"] = r.classical.total;
  d["classical_dof"] = classical;
  d["thresholds"] = py::dict(py::arg("frozen_below") = r.thresholds.frozen_below_Cv_over_R,
                             py::arg("active_above") = r.thresholds.active_above_Cv_over_R);
  return d;
}

py::dict facts_dict(const PreparedSpecies& prepared) {
  const SpeciesFacts f = describe_species(prepared);
  py::dict d;
  d["name"] = f.name;
  d["formula"] = f.formula;
  d["mass"] = f.mass_amu;
  d["molar_mass"] = f.molar_mass_g_per_mol;
  // An adsorbate neither translates nor rotates: its rotor facts are None, as the
  // command line's JSON leaves them out.
  if (f.phase == "adsorbate") {
    for (const char* key : {"rotor", "moments_of_inertia", "rotational_constants", "rotational_temperatures"})
      d[key] = py::none();
  } else {
    d["rotor"] = rotor_type_name(f.rotor);
    d["moments_of_inertia"] = array({f.moments_amu_A2.begin(), f.moments_amu_A2.end()});
    d["rotational_constants"] = array(f.rotational_constants_cm1);
    d["rotational_temperatures"] = array(f.rotational_temperatures_K);
  }
  d["symmetry_number"] = f.symmetry_number;
  d["point_group"] = f.point_group.empty() ? py::object(py::none()) : py::object(py::str(f.point_group));
  d["atoms"] = f.atom_count;
  d["expected_modes"] = f.expected_modes;
  d["given_modes"] = f.given_modes;
  d["imaginary_modes"] = f.imaginary_modes;
  d["frequencies"] = array(f.frequencies_cm1);
  d["zpe"] = f.zero_point_energy_J_per_mol / 1e3;
  d["phase"] = f.phase;
  d["ground_degeneracy"] = f.ground_degeneracy;
  d["warnings"] = texts(f.warnings);
  d["notes"] = texts(f.notes);
  return d;
}

py::dict fit_dict(const SpeciesFit& fit, const FitOptions& options, const std::string& input_file) {
  const FitProvenance provenance{input_file, "", {}};
  const py::object json = py::module_::import("json");
  py::dict doc = json.attr("loads")(write_fit_json({FitRecord{fit, provenance}}, options));
  py::dict d = py::list(doc["species"])[0].cast<py::dict>();
  py::list coefficients;
  for (const Nasa9Range& r : fit.fit.ranges) {
    if (fit.fit.form == NasaForm::nasa7)
      coefficients.append(array({r.a[2], r.a[3], r.a[4], r.a[5], r.a[6], r.b1, r.b2}));
    else
      coefficients.append(array({r.a[0], r.a[1], r.a[2], r.a[3], r.a[4], r.a[5], r.a[6], r.b1, r.b2}));
  }
  d["coefficients"] = coefficients;
  // A name the fixed columns cannot hold fails the record only, as the JSON form allows it.
  d["record"] = py::none();
  try {
    if (const auto* n7 = std::get_if<Nasa7>(&fit.polynomial))
      d["record"] = write_nasa7_record(*n7);
    else
      d["record"] = write_nasa9_record(std::get<Nasa9>(fit.polynomial));
  } catch (const InputError& e) {
    d["record_error"] = e.message();
  }
  return d;
}

}  // namespace vibtherm::python
