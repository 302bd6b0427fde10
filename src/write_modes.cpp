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
    if (!r.modes.empty()) {
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
      out += fmt::format("  {:>4} {:>9} {:>8} {:>6} {:>8} |", "mode", "cm^-1", "theta K", "ZPE %", "half K");
      for (size_t j = 0; j < headers.size(); ++j) out += fmt::format(" {:>{}}", headers[j], widths[j]);
      out += '\n';
      for (size_t i = 0; i < r.modes.size(); ++i) {
        const ModeConstants& m = r.modes[i];
        out += fmt::format("  {:>4} {:>9.1f} {:>8.1f} {:>6.1f} {:>8.1f} |", m.index, m.wavenumber_cm1,
                           m.theta_K, 100.0 * m.zero_point_share, m.half_active_at_K);
        for (size_t j = 0; j < r.points.size(); ++j) {
          const ModeActivation& a = r.points[j].modes[i];
          const std::string cell = fmt::format("{}{:>4.0f}%", state_mark(a.state), 100.0 * a.Cv_over_R);
          out += fmt::format(" {:>{}}", cell, widths[j]);
        }
        out += '\n';
      }
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
        parts.push_back(fmt::format("hindered rotors {:.2f} of {}", p.dof.hindered_rotors,
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
                            {"wavenumber", m.wavenumber_cm1},
                            {"theta", m.theta_K},
                            {"zpe", m.zero_point_energy_J_per_mol / 1000.0},
                            {"zpe_share", m.zero_point_share},
                            {"T_unfreeze", m.unfreezes_at_K},
                            {"T_half", m.half_active_at_K},
                            {"T_active", m.active_at_K}});
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

// ---------------------------------------------------------------------------------------
// SVG

std::pair<double, double> svg_temperature_span_K(const std::vector<double>& requested_K) {
  double low = *std::min_element(requested_K.begin(), requested_K.end());
  double high = *std::max_element(requested_K.begin(), requested_K.end());
  if (high < 10.0 * low) {
    const double centre = std::sqrt(low * high);
    low = centre / std::sqrt(10.0);
    high = centre * std::sqrt(10.0);
  }
  return {low, high};
}

namespace {

struct Rgb {
  double r, g, b;
};

// Cold-to-warm colour ramp for Cv/R from 0 (frozen) to 1 (classical).
constexpr std::array<std::pair<double, Rgb>, 5> ramp{{
    {0.0, {236, 241, 247}},
    {0.1, {189, 215, 238}},
    {0.5, {240, 160, 75}},
    {0.9, {192, 57, 43}},
    {1.0, {110, 20, 16}},
}};

std::string ramp_colour(double value) {
  value = std::clamp(value, 0.0, 1.0);
  size_t k = 1;
  while (k + 1 < ramp.size() && value > ramp[k].first) ++k;
  const auto& [v0, c0] = ramp[k - 1];
  const auto& [v1, c1] = ramp[k];
  const double f = (value - v0) / (v1 - v0);
  auto mix = [f](double a, double b) { return static_cast<int>(std::lround(a + f * (b - a))); };
  return fmt::format("#{:02x}{:02x}{:02x}", mix(c0.r, c1.r), mix(c0.g, c1.g), mix(c0.b, c1.b));
}

// Tick values 1, 2, 5 × 10^k inside [low, high] for a logarithmic axis.
std::vector<double> log_ticks(double low, double high) {
  std::vector<double> ticks;
  for (int k = static_cast<int>(std::floor(std::log10(low)));
       k <= static_cast<int>(std::ceil(std::log10(high))); ++k)
    for (double m : {1.0, 2.0, 5.0}) {
      const double t = m * std::pow(10.0, k);
      if (t >= low * (1 - 1e-9) && t <= high * (1 + 1e-9)) ticks.push_back(t);
    }
  return ticks;
}

// A step of 1, 2 or 5 × 10^k giving at most `max_ticks` intervals from 0 to `top` (> 0).
double linear_step(double top, int max_ticks) {
  for (double scale = 1.0;; scale *= 10.0)
    for (double m : {1.0, 2.0, 5.0})
      if (top / (m * scale) <= max_ticks) return m * scale;
}

constexpr double canvas_width = 900.0;
constexpr double plot_left = 120.0;
constexpr double plot_right = 620.0;
constexpr double legend_left = 650.0;
constexpr double fdof_height = 200.0;

class SvgPanel {
 public:
  SvgPanel(double low_K, double high_K) : ln_low_(std::log(low_K)), ln_high_(std::log(high_K)) {}
  double x(double T_K) const {
    return plot_left + (std::log(T_K) - ln_low_) / (ln_high_ - ln_low_) * (plot_right - plot_left);
  }

 private:
  double ln_low_, ln_high_;
};

// Ticks at 1, 2, 5 × 10^k; `grid` draws light vertical lines up to y_top as well.
void temperature_axis(std::string& out, const SvgPanel& panel, double low, double high, double y_top,
                      double y_axis, bool grid) {
  out += fmt::format(
      R"(<g class="x-axis"><line x1="{:.1f}" y1="{:.1f}" x2="{:.1f}" y2="{:.1f}" stroke="black"/>)",
      plot_left, y_axis, plot_right, y_axis);
  for (double t : log_ticks(low, high)) {
    const double x = panel.x(t);
    if (grid)
      out += fmt::format(R"(<line x1="{:.1f}" y1="{:.1f}" x2="{:.1f}" y2="{:.1f}" stroke="#cccccc"/>)", x,
                         y_top, x, y_axis);
    out += fmt::format(R"(<line x1="{:.1f}" y1="{:.1f}" x2="{:.1f}" y2="{:.1f}" stroke="black"/>)", x, y_axis,
                       x, y_axis + 4);
    out += fmt::format(R"(<text x="{:.1f}" y="{:.1f}" text-anchor="middle" font-size="10">{:g}</text>)", x,
                       y_axis + 15, t);
  }
  out += fmt::format(R"(<text x="{:.1f}" y="{:.1f}" text-anchor="middle" font-size="11">)"
                     R"(temperature T / K (logarithmic scale)</text></g>)",
                     0.5 * (plot_left + plot_right), y_axis + 30);
  out += '\n';
}

// Heat map of Cv/R per mode; returns the height used.
double svg_heat_map(std::string& out, const ModesReport& r, const std::vector<size_t>& order, double low,
                    double high, double top, const std::string& id_prefix) {
  const SvgPanel panel(low, high);
  const size_t n = r.modes.size();
  const double row = std::clamp(260.0 / static_cast<double>(n), 5.0, 26.0);
  const double height = row * static_cast<double>(n);
  out += fmt::format(R"(<g class="heat-map"><text x="{:.1f}" y="{:.1f}" font-size="12">)"
                     R"(Activation of each vibration: Cv/R of the mode (classical value 1)</text>)",
                     plot_left, top - 8);
  out += '\n';
  // Column edges halfway (in ln T) between neighbouring samples.
  std::vector<double> edges{panel.x(low)};
  for (size_t j = 1; j < order.size(); ++j)
    edges.push_back(panel.x(std::sqrt(r.points[order[j - 1]].T_K * r.points[order[j]].T_K)));
  edges.push_back(panel.x(high));
  const size_t label_every = static_cast<size_t>(std::ceil(10.0 / row));
  for (size_t i = 0; i < n; ++i) {
    const double y = top + row * static_cast<double>(i);
    for (size_t j = 0; j < order.size(); ++j) {
      const ModesPoint& p = r.points[order[j]];
      out += fmt::format(R"(<rect x="{:.2f}" y="{:.2f}" width="{:.2f}" height="{:.2f}" fill="{}"/>)",
                         edges[j], y, edges[j + 1] - edges[j] + 0.3, row, ramp_colour(p.modes[i].Cv_over_R));
    }
    const ModeConstants& m = r.modes[i];
    if (i % label_every == 0)
      out += fmt::format(
          R"(<text x="{:.1f}" y="{:.1f}" text-anchor="end" font-size="{:.0f}">{} · {:.0f} cm⁻¹</text>)",
          plot_left - 6, y + 0.5 * row + 3.5, std::min(10.0, row + 1), m.index, m.wavenumber_cm1);
    if (m.half_active_at_K >= low && m.half_active_at_K <= high)
      out += fmt::format(R"(<circle cx="{:.1f}" cy="{:.1f}" r="{:.1f}" fill="none" stroke="black"/>)",
                         panel.x(m.half_active_at_K), y + 0.5 * row, std::min(3.0, 0.35 * row));
    out += '\n';
  }
  out += fmt::format(
      R"(<rect x="{:.1f}" y="{:.1f}" width="{:.1f}" height="{:.1f}" fill="none" stroke="black"/>)", plot_left,
      top, plot_right - plot_left, height);
  out += fmt::format(
      R"~(<text transform="translate(16,{:.1f}) rotate(-90)" text-anchor="middle" font-size="11">)~"
      R"(mode · wavenumber</text>)",
      top + 0.5 * height);
  temperature_axis(out, panel, low, high, top, top + height, false);
  out += "</g>\n";

  // Colour bar with the state thresholds.
  const double bar_top = top, bar_height = std::max(height, 150.0);
  out += fmt::format(R"(<g class="legend"><text x="{:.1f}" y="{:.1f}" font-size="11">Cv/R of a mode</text>)",
                     legend_left, bar_top - 8);
  out += fmt::format(
      R"~(<rect x="{:.1f}" y="{:.1f}" width="14" height="{:.1f}" fill="url(#{}activation-ramp)" )~"
      R"(stroke="black"/>)",
      legend_left, bar_top, bar_height, escape_markup(id_prefix));
  const std::array<std::pair<double, std::string>, 5> marks{{
      {0.0, "0"},
      {r.thresholds.frozen_below_Cv_over_R,
       fmt::format("{:g} frozen below", r.thresholds.frozen_below_Cv_over_R)},
      {0.5, "0.5"},
      {r.thresholds.active_above_Cv_over_R,
       fmt::format("{:g} active above", r.thresholds.active_above_Cv_over_R)},
      {1.0, "1 classical"},
  }};
  for (const auto& [value, label] : marks) {
    const double y = bar_top + bar_height * (1.0 - value);
    out += fmt::format(R"(<line x1="{:.1f}" y1="{:.1f}" x2="{:.1f}" y2="{:.1f}" stroke="black"/>)",
                       legend_left + 14, y, legend_left + 18, y);
    out += fmt::format(R"(<text x="{:.1f}" y="{:.1f}" font-size="10">{}</text>)", legend_left + 21, y + 3.5,
                       escape_markup(label));
  }
  out +=
      fmt::format(R"(<circle cx="{:.1f}" cy="{:.1f}" r="3" fill="none" stroke="black"/>)"
                  R"(<text x="{:.1f}" y="{:.1f}" font-size="10">Cv/R = 0.5 (half active)</text></g>)",
                  legend_left + 7, bar_top + bar_height + 16, legend_left + 16, bar_top + bar_height + 19.5);
  out += '\n';
  return std::max(height, bar_height + 20.0);
}

// F(T) = 2 Cv/R with the classical plateaus; returns the height used.
double svg_dof_curve(std::string& out, const ModesReport& r, const std::vector<size_t>& order, double low,
                     double high, double top) {
  const SvgPanel panel(low, high);
  bool electronic = false;
  for (const ModesPoint& p : r.points) electronic = electronic || p.dof.electronic >= 1e-3;
  double y_max = r.classical.total;
  // A hindered rotor's 2Cv/R passes its free-rotor value near the barrier crossing.
  for (const ModesPoint& p : r.points) y_max = std::max(y_max, p.dof.total);
  if (electronic)
    for (const ModesPoint& p : r.points) y_max = std::max(y_max, p.dof.electronic);
  y_max = std::max(1.0, 1.08 * y_max);
  const double bottom = top + fdof_height;
  auto y = [&](double value) { return bottom - value / y_max * fdof_height; };

  out += fmt::format(R"(<g class="dof-curve"><text x="{:.1f}" y="{:.1f}" font-size="12">)"
                     R"(Effective quadratic degrees of freedom F(T) = 2 Cv/R</text>)",
                     plot_left, top - 8);
  out += '\n';
  const double step = linear_step(y_max, 8);
  out += fmt::format(R"(<line x1="{:.1f}" y1="{:.1f}" x2="{:.1f}" y2="{:.1f}" stroke="black"/>)", plot_left,
                     top, plot_left, bottom);
  for (double v = 0.0; v <= y_max + 1e-9; v += step) {
    out += fmt::format(R"(<line x1="{:.1f}" y1="{:.1f}" x2="{:.1f}" y2="{:.1f}" stroke="black"/>)",
                       plot_left - 4, y(v), plot_left, y(v));
    out += fmt::format(R"(<text x="{:.1f}" y="{:.1f}" text-anchor="end" font-size="10">{:g}</text>)",
                       plot_left - 7, y(v) + 3.5, v);
  }
  out += fmt::format(
      R"~(<text transform="translate(16,{:.1f}) rotate(-90)" text-anchor="middle" font-size="11">)~"
      R"(F = 2 Cv/R</text>)",
      top + 0.5 * fdof_height);
  temperature_axis(out, panel, low, high, top, bottom, true);

  // Plateaus: the classical value of each set of motions in the order they become active.
  std::vector<std::pair<double, std::string>> plateaus;
  if (r.is_gas) {
    plateaus.emplace_back(r.classical.translation,
                          fmt::format("{} translation", whole(r.classical.translation)));
    if (r.classical.rotation > 0)
      plateaus.emplace_back(
          r.classical.translation + r.classical.rotation,
          fmt::format("{} + rotation", whole(r.classical.translation + r.classical.rotation)));
  }
  if (r.classical.vibration > 0)
    plateaus.emplace_back(r.classical.total, fmt::format("{} all classical", whole(r.classical.total)));
  out += R"(<g class="plateaus">)";
  for (const auto& [value, label] : plateaus) {
    out += fmt::format(R"(<line x1="{:.1f}" y1="{:.1f}" x2="{:.1f}" y2="{:.1f}" stroke="#555555" )"
                       R"(stroke-dasharray="6 4"/>)",
                       plot_left, y(value), plot_right, y(value));
    out += fmt::format(R"(<text x="{:.1f}" y="{:.1f}" font-size="10" fill="#555555">{}</text>)",
                       plot_right + 4, y(value) + 3.5, escape_markup(label));
  }
  out += "</g>\n";

  auto polyline = [&](auto value_of, const char* colour, const char* dash, const char* css_class) {
    out += fmt::format(R"(<polyline class="{}" fill="none" stroke="{}" stroke-width="2"{} points=")",
                       css_class, colour, dash);
    for (size_t j : order)
      out += fmt::format("{:.2f},{:.2f} ", panel.x(r.points[j].T_K), y(value_of(r.points[j])));
    out += "\"/>\n";
  };
  polyline([](const ModesPoint& p) { return p.dof.total; }, "#b2182b", "", "total");
  if (electronic)
    polyline([](const ModesPoint& p) { return p.dof.electronic; }, "#2166ac", R"( stroke-dasharray="2 3")",
             "electronic");
  out += fmt::format(
      R"(<rect x="{:.1f}" y="{:.1f}" width="{:.1f}" height="{:.1f}" fill="none" stroke="black"/>)", plot_left,
      top, plot_right - plot_left, fdof_height);

  // Legend.
  double ly = top + 12;
  out += R"(<g class="legend">)";
  out += fmt::format(
      R"(<line x1="{:.1f}" y1="{:.1f}" x2="{:.1f}" y2="{:.1f}" stroke="#b2182b" stroke-width="2"/>)"
      R"(<text x="{:.1f}" y="{:.1f}" font-size="10">F(T), electronic excluded</text>)",
      legend_left + 75, ly + 60, legend_left + 100, ly + 60, legend_left + 105, ly + 63.5);
  out += fmt::format(
      R"(<line x1="{:.1f}" y1="{:.1f}" x2="{:.1f}" y2="{:.1f}" stroke="#555555" )"
      R"(stroke-dasharray="6 4"/><text x="{:.1f}" y="{:.1f}" font-size="10">classical plateau</text>)",
      legend_left + 75, ly + 76, legend_left + 100, ly + 76, legend_left + 105, ly + 79.5);
  if (electronic)
    out += fmt::format(
        R"(<line x1="{:.1f}" y1="{:.1f}" x2="{:.1f}" y2="{:.1f}" stroke="#2166ac" stroke-width="2" )"
        R"(stroke-dasharray="2 3"/><text x="{:.1f}" y="{:.1f}" font-size="10">)"
        R"(electronic 2Cv/R (not in F)</text>)",
        legend_left + 75, ly + 92, legend_left + 100, ly + 92, legend_left + 105, ly + 95.5);
  out += "</g></g>\n";
  return fdof_height + 36.0;
}

}  // namespace

std::string modes_to_svg(const std::vector<ModesReport>& reports, const ModesSvgOptions& options) {
  std::string body;
  double y = 0.0;
  for (const ModesReport& r : reports) {
    if (r.points.empty()) continue;
    std::vector<size_t> order(r.points.size());
    std::iota(order.begin(), order.end(), size_t{0});
    std::sort(order.begin(), order.end(),
              [&](size_t a, size_t b) { return r.points[a].T_K < r.points[b].T_K; });
    double low = r.points[order.front()].T_K, high = r.points[order.back()].T_K;
    if (!(high > low)) {  // one temperature: show a decade around it
      low /= std::sqrt(10.0);
      high = low * 10.0;
    }
    body += fmt::format(R"(<g class="species" data-name="{}">)", escape_markup(r.name));
    body += fmt::format(R"(<text x="{:.1f}" y="{:.1f}" font-size="15" font-weight="bold">{} ({}, classical )"
                        R"(F = {})</text>)",
                        20.0, y + 26, escape_markup(r.name), phase_name(r), whole(r.classical.total));
    body += '\n';
    y += 58;
    if (!r.modes.empty()) y += svg_heat_map(body, r, order, low, high, y, options.id_prefix) + 64;
    y += svg_dof_curve(body, r, order, low, high, y) + 24;
    body += "</g>\n";
  }
  std::string out;
  if (options.standalone) out = "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n";
  out += fmt::format(R"(<svg{2} width="{0:.0f}" height="{1:.0f}" )"
                     R"(viewBox="0 0 {0:.0f} {1:.0f}" font-family="sans-serif">)",
                     canvas_width, std::max(y, 40.0),
                     options.standalone ? R"( xmlns="http://www.w3.org/2000/svg")" : "");
  out += "\n<title>vibtherm modes: activation of vibrations and effective degrees of freedom</title>\n";
  out += R"(<defs><linearGradient id=")";
  out += escape_markup(options.id_prefix);
  out += R"(activation-ramp" x1="0" y1="1" x2="0" y2="0">)";
  for (const auto& stop : ramp)
    out += fmt::format(R"(<stop offset="{:g}" stop-color="{}"/>)", stop.first, ramp_colour(stop.first));
  out += "</linearGradient></defs>\n";
  out += R"(<rect width="100%" height="100%" fill="white"/>)";
  out += '\n';
  out += body;
  out += "</svg>\n";
  return out;
}

}  // namespace vibtherm
