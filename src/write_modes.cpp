#include "vibtherm/write_modes.hpp"

#include <fmt/format.h>
#include <fmt/ranges.h>

#include <algorithm>
#include <array>
#include <cmath>
#include <nlohmann/json.hpp>
#include <numeric>
#include <tuple>

#include "vibtherm/geometry.hpp"
#include "vibtherm/markup.hpp"

namespace vibtherm {

namespace {

const char* phase_name(const ModesReport& r) { return r.is_gas ? "gas" : "adsorbate"; }

// One character per state, so the grid reads as a picture: frozen cells recede.
char state_mark(ModeState state) {
  switch (state) {
    case ModeState::frozen:
      return '.';
    case ModeState::partial:
      return '~';
    case ModeState::active:
      return '#';
  }
  return '?';
}

std::string kind_of_species(const ModesReport& r) {
  if (!r.is_gas) return "adsorbate";
  switch (r.rotor) {
    case RotorType::atom:
      return "gas, atom";
    case RotorType::linear:
      return "gas, linear molecule";
    case RotorType::nonlinear:
      return "gas, nonlinear molecule";
  }
  return "gas";
}

std::string temperature_label(double T_K) { return fmt::format("{:g} K", T_K); }

// Classical limits are whole numbers of quadratic terms; print them without decimals.
std::string whole(double value) { return fmt::format("{:.0f}", value); }

std::string classical_breakdown(const ModesReport& r) {
  std::vector<std::string> parts;
  if (r.classical.translation > 0) parts.push_back("translation " + whole(r.classical.translation));
  if (r.classical.rotation > 0) parts.push_back("rotation " + whole(r.classical.rotation));
  if (r.classical.vibration > 0) parts.push_back("vibration " + whole(r.classical.vibration));
  if (r.classical.hindered_rotors > 0)
    parts.push_back("hindered rotors " + whole(r.classical.hindered_rotors));
  return fmt::format("{}{}", fmt::join(parts, " + "), r.is_gas ? "" : ", all 3N motions vibrate");
}

}  // namespace

std::string modes_to_text(const std::vector<ModesReport>& reports) {
  std::string out;
  for (const ModesReport& r : reports) {
    if (!out.empty()) out += '\n';
    out += fmt::format("{}: {}, {} vibration{}\n", r.name, kind_of_species(r), r.modes.size(),
                       r.modes.size() == 1 ? "" : "s");
    out += fmt::format("  classical limit F = {} ({}); F = 2 Cv/R counts the active quadratic terms\n",
                       whole(r.classical.total), classical_breakdown(r));
    if (!r.rotors.empty())
      out += fmt::format(
          "  hindered rotors: each counts 2 quadratic terms while it oscillates in its well (low T) and 1 "
          "once it rotates freely (high T), passing 2 briefly near the barrier; the classical limit counts 1 "
          "per rotor\n");
    if (!r.modes.empty()) {
      out += "  modes are numbered by ascending wavenumber; 'input' is the position in the species file\n";
      out += fmt::format(
          "  cells: state and Cv/R of the mode as % of its classical value; '.' frozen below {:g} %, "
          "'~' partial, '#' active above {:g} %\n\n",
          100.0 * r.thresholds.frozen_below_Cv_over_R, 100.0 * r.thresholds.active_above_Cv_over_R);
      std::vector<std::string> headers;
      std::vector<size_t> widths;
      for (const ModesPoint& p : r.points) {
        headers.push_back(temperature_label(p.T_K));
        widths.push_back(std::max<size_t>(6, headers.back().size()));
      }
      out += fmt::format("  {:>4} {:>5} {:>9} {:>8} {:>6} {:>8} |", "mode", "input", "cm^-1", "theta K",
                         "ZPE %", "half K");
      for (size_t j = 0; j < headers.size(); ++j) out += fmt::format(" {:>{}}", headers[j], widths[j]);
      out += '\n';
      for (size_t i = 0; i < r.modes.size(); ++i) {
        const ModeConstants& m = r.modes[i];
        out += fmt::format("  {:>4} {:>5} {:>9.1f} {:>8.1f} {:>6.1f} {:>8.1f} |", m.index,
                           m.input_position > 0 ? fmt::format("#{}", m.input_position) : std::string("-"),
                           m.wavenumber_cm1, m.theta_K, 100.0 * m.zero_point_share, m.half_active_at_K);
        for (size_t j = 0; j < r.points.size(); ++j) {
          const ModeActivation& a = r.points[j].modes[i];
          const std::string cell = fmt::format("{}{:>4.0f}%", state_mark(a.state), 100.0 * a.Cv_over_R);
          out += fmt::format(" {:>{}}", cell, widths[j]);
        }
        out += '\n';
      }
      std::string changed, treatment;
      for (const ModeConstants& m : r.modes) {
        if (m.treatment.empty()) continue;
        treatment = m.treatment;
        changed += changed.empty() ? "" : ", ";
        changed += m.treatment == "qrrho" ? fmt::format("{} (w = {:.3f})", m.index, m.qrrho_weight)
                                          : fmt::format("{} (raised to {:g} cm^-1)", m.index, m.floor_cm1);
      }
      if (!changed.empty())
        out += fmt::format("  changed by the low-frequency treatment ({}): mode {}\n", treatment, changed);
      out += '\n';
    }
    size_t label_width = 0;
    for (const ModesPoint& p : r.points)
      label_width = std::max(label_width, temperature_label(p.T_K).size() + 1);
    for (const ModesPoint& p : r.points) {
      // Motions without classical terms (rotation of an atom, translation of an adsorbate) are left out.
      std::vector<std::string> parts;
      if (r.classical.translation > 0) parts.push_back(fmt::format("translation {:.2f}", p.dof.translation));
      if (r.classical.rotation > 0) parts.push_back(fmt::format("rotation {:.2f}", p.dof.rotation));
      if (r.classical.vibration > 0)
        parts.push_back(fmt::format("vibration {:.2f} of {}", p.dof.vibration, whole(r.classical.vibration)));
      if (r.classical.hindered_rotors > 0)
        parts.push_back(fmt::format("hindered rotors {:.2f} (from {} as oscillators to {} as free rotors)",
                                    p.dof.hindered_rotors, whole(2.0 * r.classical.hindered_rotors),
                                    whole(r.classical.hindered_rotors)));
      out += fmt::format("  at {:<{}} F = {:5.2f} of {} classical ({})", temperature_label(p.T_K) + ':',
                         label_width, p.dof.total, whole(r.classical.total), fmt::join(parts, ", "));
      if (!r.modes.empty())
        out += fmt::format("; modes {} frozen, {} partial, {} active", p.count(ModeState::frozen),
                           p.count(ModeState::partial), p.count(ModeState::active));
      if (p.dof.electronic >= 0.005)
        out += fmt::format("; electronic 2Cv/R {:.2f}, not in F", p.dof.electronic);
      out += '\n';
    }
  }
  return out;
}

std::string modes_to_csv(const std::vector<ModesReport>& reports) {
  std::string out = "species,T_K,item,mode,wavenumber_cm1,theta_K,Cv_over_R,dof,classical_dof,state\n";
  for (const ModesReport& r : reports) {
    const std::string name = csv_field(r.name);
    for (const ModesPoint& p : r.points) {
      const std::array<std::tuple<const char*, double, double>, 4> motions{{
          {"translation", p.dof.translation, r.classical.translation},
          {"rotation", p.dof.rotation, r.classical.rotation},
          {"vibration", p.dof.vibration, r.classical.vibration},
          {"total", p.dof.total, r.classical.total},
      }};
      for (const auto& [item, dof, classical] : motions)
        out += fmt::format("{},{},{},,,,{},{},{},\n", name, p.T_K, item, dof / 2.0, dof, classical);
      // Only species with hindered rotors get their row, so rigid-rotor output is unchanged.
      if (r.classical.hindered_rotors > 0)
        out += fmt::format("{},{},hindered_rotors,,,,{},{},{},\n", name, p.T_K, p.dof.hindered_rotors / 2.0,
                           p.dof.hindered_rotors, r.classical.hindered_rotors);
      // The electronic part has no classical limit: that field stays empty.
      out +=
          fmt::format("{},{},electronic,,,,{},{},,\n", name, p.T_K, p.dof.electronic / 2.0, p.dof.electronic);
      for (size_t i = 0; i < r.modes.size(); ++i) {
        const ModeConstants& m = r.modes[i];
        const ModeActivation& a = p.modes[i];
        out += fmt::format("{},{},mode,{},{},{},{},{},2,{}\n", name, p.T_K, m.index, m.wavenumber_cm1,
                           m.theta_K, a.Cv_over_R, 2.0 * a.Cv_over_R, mode_state_name(a.state));
      }
    }
  }
  return out;
}

std::string modes_to_json(const std::vector<ModesReport>& reports) {
  using nlohmann::ordered_json;
  ordered_json root;
  root["units"] = {{"T", "K"},
                   {"wavenumber", "cm^-1"},
                   {"theta", "K"},
                   {"zpe", "kJ/mol"},
                   {"dof", "2 Cv/R (number of active quadratic terms)"},
                   {"Cv_over_R", "1 (classical value of one mode: 1)"}};
  ordered_json species = ordered_json::array();
  for (const ModesReport& r : reports) {
    ordered_json s;
    s["name"] = r.name;
    s["phase"] = phase_name(r);
    s["rotor"] = rotor_type_name(r.rotor);
    s["thresholds"] = {{"frozen_below", r.thresholds.frozen_below_Cv_over_R},
                       {"active_above", r.thresholds.active_above_Cv_over_R}};
    s["classical_dof"] = {{"translation", r.classical.translation},
                          {"rotation", r.classical.rotation},
                          {"vibration", r.classical.vibration},
                          {"total", r.classical.total}};
    if (r.classical.hindered_rotors > 0) s["classical_dof"]["hindered_rotors"] = r.classical.hindered_rotors;
    ordered_json vibrations = ordered_json::array();
    for (const ModeConstants& m : r.modes)
      vibrations.push_back({{"index", m.index},
                            {"input_position", m.input_position},
                            {"wavenumber", m.wavenumber_cm1},
                            {"theta", m.theta_K},
                            {"zpe", m.zero_point_energy_J_per_mol / 1000.0},
                            {"zpe_share", m.zero_point_share},
                            {"T_unfreeze", m.unfreezes_at_K},
                            {"T_half", m.half_active_at_K},
                            {"T_active", m.active_at_K}});
    for (std::size_t i = 0; i < r.modes.size(); ++i) {
      const ModeConstants& m = r.modes[i];
      if (m.treatment.empty()) continue;
      vibrations[i]["treatment"] = m.treatment;
      if (m.treatment == "qrrho") vibrations[i]["qrrho_weight"] = m.qrrho_weight;
      if (m.treatment == "floor") vibrations[i]["floor_wavenumber"] = m.floor_cm1;
    }
    s["vibrations"] = std::move(vibrations);
    ordered_json temperatures = ordered_json::array();
    for (const ModesPoint& p : r.points) {
      ordered_json t;
      t["T"] = p.T_K;
      t["dof"] = {{"translation", p.dof.translation},
                  {"rotation", p.dof.rotation},
                  {"vibration", p.dof.vibration},
                  {"total", p.dof.total},
                  {"electronic", p.dof.electronic}};
      if (r.classical.hindered_rotors > 0) t["dof"]["hindered_rotors"] = p.dof.hindered_rotors;
      t["counts"] = {{"frozen", p.count(ModeState::frozen)},
                     {"partial", p.count(ModeState::partial)},
                     {"active", p.count(ModeState::active)}};
      ordered_json modes = ordered_json::array();
      for (size_t i = 0; i < r.modes.size(); ++i)
        modes.push_back({{"index", r.modes[i].index},
                         {"wavenumber", r.modes[i].wavenumber_cm1},
                         {"Cv_over_R", p.modes[i].Cv_over_R},
                         {"state", mode_state_name(p.modes[i].state)}});
      t["modes"] = std::move(modes);
      temperatures.push_back(std::move(t));
    }
    s["temperatures"] = std::move(temperatures);
    species.push_back(std::move(s));
  }
  root["species"] = std::move(species);
  return root.dump(1) + '\n';
}

}  // namespace vibtherm
