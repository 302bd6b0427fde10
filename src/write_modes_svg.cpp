#include "vibtherm/write_modes_svg.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <numeric>

#include "vibtherm/markup.hpp"
#include "vibtherm/svg_plot.hpp"

namespace vibtherm {

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

using svg::font_label;
using svg::font_tick;
using svg::font_title;
using svg::plot_left;
using svg::plot_right;

constexpr double dof_height = 220.0;
constexpr const char* total_colour = "#222222";
constexpr const char* rotor_colour = "#d55e00";       // Okabe–Ito vermillion
constexpr const char* electronic_colour = "#0072b2";  // Okabe–Ito blue
constexpr const char* plateau_colour = "#666666";

std::string whole(double value) { return fmt::format("{:.0f}", value); }

struct Sampling {
  std::vector<size_t> order;  // points by ascending T
  double low = 0.0, high = 0.0;
  bool log = true;
  const char* axis_title() const {
    return log ? "temperature T / K (logarithmic scale)" : "temperature T / K";
  }
};

Sampling sampling_of(const ModesReport& r) {
  Sampling s;
  s.order.resize(r.points.size());
  std::iota(s.order.begin(), s.order.end(), size_t{0});
  std::sort(s.order.begin(), s.order.end(),
            [&](size_t a, size_t b) { return r.points[a].T_K < r.points[b].T_K; });
  s.low = r.points[s.order.front()].T_K;
  s.high = r.points[s.order.back()].T_K;
  if (!(s.high > s.low)) {  // one temperature: show a decade around it
    s.low /= std::sqrt(10.0);
    s.high = s.low * 10.0;
  }
  return s;
}

// Horizontal colour bar with the state thresholds; returns the height used.
double colour_bar(std::string& out, const ModesReport& r, const std::string& ramp_id, double top) {
  constexpr double width = 400.0, height = 12.0;
  out += svg::text(plot_left, top + 12,
                   fmt::format("Cv/R (1 = classical oscillator); frozen < {:g}, active > {:g}; ring: 0.5",
                               r.thresholds.frozen_below_Cv_over_R, r.thresholds.active_above_Cv_over_R),
                   font_tick);
  const double bar_top = top + 20;
  out += fmt::format(R"~(<rect x="{}" y="{}" width="{:g}" height="{:g}" fill="url(#{})" stroke="#333"/>)~",
                     svg::num(plot_left), svg::num(bar_top), width, height, escape_markup(ramp_id));
  const std::vector<std::pair<double, std::string>> marks{
      {0.0, "0"},
      {r.thresholds.frozen_below_Cv_over_R, fmt::format("{:g}", r.thresholds.frozen_below_Cv_over_R)},
      {0.5, "0.5"},
      {r.thresholds.active_above_Cv_over_R, fmt::format("{:g}", r.thresholds.active_above_Cv_over_R)},
      {1.0, "1"}};
  double right_edge = -1e300;
  for (const auto& [value, label] : marks) {
    const double x = plot_left + width * value;
    const double w = svg::text_width(label, font_tick);
    out += svg::line(x, bar_top + height, x, bar_top + height + 4, "#333");
    if (x - 0.5 * w < right_edge + 4) continue;
    out += svg::text(x, bar_top + height + 17, label, font_tick, "middle");
    right_edge = x + 0.5 * w;
  }
  return 20 + height + 24;
}

// On a logarithmic axis every harmonic row is one picture, shifted: its Cv/R is the Einstein
// function of θ/T, so its colours depend on ln T − ln θ only. The shared gradient is that
// function drawn for θ = the axis' low end from T/θ = 1/12 (Cv/R below 0.001) to 8 (above
// 0.998), padded beyond by its end colours; a row then needs only its shift ln θ − ln low.
struct HarmonicTemplate {
  std::string id;
  bool used = false;
  static constexpr double from = 1.0 / 12.0, to = 8.0;
};

std::string harmonic_gradient(const std::string& id, const svg::Axis& x) {
  std::vector<double> xs, values;
  constexpr int samples = 400;
  for (int k = 0; k <= samples; ++k) {
    const double ratio = HarmonicTemplate::from * std::pow(HarmonicTemplate::to / HarmonicTemplate::from,
                                                           static_cast<double>(k) / samples);
    xs.push_back(x(x.low() * ratio));
    values.push_back(einstein_Cv_over_R(1.0 / ratio));
  }
  return svg::viridis_gradient(id, xs, values, xs.front(), xs.back(), 1.0 / 48.0);
}

// Whether a row's sampled values are the shifted template's (within a fraction of a colour step):
// harmonic modes are; a mode under a low-frequency treatment or scaled otherwise is drawn from its samples.
bool is_harmonic_row(const ModesReport& r, size_t i, const Sampling& s) {
  const ModeConstants& m = r.modes[i];
  if (!s.log || !m.treatment.empty() || !(m.theta_K > 0.0)) return false;
  for (size_t j : s.order)
    if (std::abs(einstein_Cv_over_R(m.theta_K / r.points[j].T_K) - r.points[j].modes[i].Cv_over_R) > 2e-3)
      return false;
  return true;
}

// Heat map of Cv/R per vibration and per hindered rotor; returns the height used.
double heat_map(std::string& out, svg::GradientBook& book, HarmonicTemplate& shape, const ModesReport& r,
                const Sampling& s, double top) {
  const svg::Axis x(s.low, s.high, s.log, plot_left, plot_right);
  const size_t n = r.modes.size() + r.rotors.size();
  // Whole pixels per row (no seams); at least 16 so every 12 px label has its own row.
  const double row = std::clamp(std::round(300.0 / static_cast<double>(n)), 16.0, 28.0);
  out += svg::text(plot_left, top + 14,
                   r.rotors.empty()
                       ? "Activation of each vibration, by ascending wavenumber"
                       : "Activation of each vibration (by ascending wavenumber) and hindered rotor",
                   font_title, "start", R"(font-weight="bold")");
  out += svg::text(plot_left - 6, top + 14, "mode · cm⁻¹ · input #", font_tick, "end", R"(fill="#555")");
  const double map_top = top + 24;
  std::vector<double> xs;
  for (size_t j : s.order) xs.push_back(x(r.points[j].T_K));
  out += R"(<g class="heat-map" shape-rendering="crispEdges">)";
  out += '\n';
  for (size_t i = 0; i < n; ++i) {
    const double y = map_top + row * static_cast<double>(i);
    const bool is_mode = i < r.modes.size();
    if (is_mode && is_harmonic_row(r, i, s)) {
      shape.used = true;
      out +=
          svg::shifted_heat_row(shape.id, x(r.modes[i].theta_K) - plot_left, plot_left, plot_right, y, row);
    } else {
      std::vector<double> values;
      for (size_t j : s.order)
        values.push_back(is_mode ? r.points[j].modes[i].Cv_over_R
                                 : r.points[j].rotors_Cv_over_R[i - r.modes.size()]);
      out += svg::heat_row(book, xs, values, plot_left, plot_right, y, row);
    }
    out += '\n';
  }
  // Row labels share their anchor, the half-activation rings their style, through their group.
  out += "</g>\n<g class=\"row-labels\" text-anchor=\"end\">";
  std::string rings;
  for (size_t i = 0; i < n; ++i) {
    const double y = map_top + row * static_cast<double>(i);
    std::string label;
    if (i < r.modes.size()) {
      const ModeConstants& m = r.modes[i];
      label = m.input_position > 0
                  ? fmt::format("{} · {:.0f} · #{}", m.index, m.wavenumber_cm1, m.input_position)
                  : fmt::format("{} · {:.0f}", m.index, m.wavenumber_cm1);
    } else {
      const RotorConstants& rot = r.rotors[i - r.modes.size()];
      label = fmt::format("rotor {}–{}, σ = {}", rot.bond[0], rot.bond[1], rot.symmetry);
    }
    out += svg::text(plot_left - 6, y + 0.5 * row + 4.5, label, font_tick);
    if (i < r.modes.size()) {
      const double half = r.modes[i].half_active_at_K;
      if (half >= s.low && half <= s.high)
        rings += fmt::format(R"(<circle cx="{}" cy="{}" r="{}"/>)", svg::num(x(half)),
                             svg::num(y + 0.5 * row), svg::num(std::min(4.0, 0.3 * row)));
    }
  }
  out += "</g>\n";
  if (!rings.empty())
    out += R"(<g class="half-active" fill="none" stroke="white" stroke-width="1.5">)" + rings + "</g>\n";
  const double bottom = map_top + row * static_cast<double>(n);
  out += fmt::format(R"(<rect x="{}" y="{}" width="{}" height="{}" fill="none" stroke="#333"/>)",
                     svg::num(plot_left), svg::num(map_top), svg::num(plot_right - plot_left),
                     svg::num(bottom - map_top));
  std::string ticks;
  for (double t : x.ticks()) ticks += "M" + svg::num(x(t)) + " " + svg::num(map_top) + "V" + svg::num(bottom);
  out += fmt::format(R"(<path d="{}" stroke="#fff" stroke-width=".6" stroke-dasharray="2 4"/>)", ticks);
  out += '\n';
  double used = bottom - top;
  used += svg::x_axis_labels(out, x, bottom, s.axis_title());
  used += colour_bar(out, r, book.id_prefix + "ramp", top + used);
  return used;
}

// F(T) = 2 Cv/R with the classical plateaus; returns the height used.
double dof_curve(std::string& out, const ModesReport& r, const Sampling& s, double top) {
  bool electronic = false;
  for (const ModesPoint& p : r.points) electronic = electronic || p.dof.electronic >= 1e-3;
  double y_max = r.classical.total;
  // A hindered rotor's 2Cv/R passes its free-rotor value near the barrier crossing.
  for (const ModesPoint& p : r.points)
    y_max = std::max({y_max, p.dof.total, electronic ? p.dof.electronic : 0.0});
  const auto [y_low, y_high] = svg::nice_interval(0.0, std::max(1.0, 1.06 * y_max), 5);
  out += svg::text(plot_left, top + 14, "Effective quadratic degrees of freedom F(T) = 2 Cv/R", font_title,
                   "start", R"(font-weight="bold")");
  const double box_top = top + 24, bottom = box_top + dof_height;
  const svg::Axis x(s.low, s.high, s.log, plot_left, plot_right);
  const svg::Axis y(y_low, y_high, false, bottom, box_top);
  svg::plot_box(out, x, y, box_top, bottom, "F = 2 Cv/R");

  // Plateaus: the classical value of each set of motions in the order they become active;
  // each label sits just above its line, or higher when it would touch the label below.
  std::vector<std::pair<double, std::string>> plateaus;
  if (r.is_gas) {
    plateaus.emplace_back(r.classical.translation,
                          fmt::format("{} translation", whole(r.classical.translation)));
    if (r.classical.rotation > 0)
      plateaus.emplace_back(
          r.classical.translation + r.classical.rotation,
          fmt::format("{} translation + rotation", whole(r.classical.translation + r.classical.rotation)));
  }
  if (r.classical.vibration > 0 || r.classical.hindered_rotors > 0)
    plateaus.emplace_back(r.classical.total,
                          fmt::format("{} all motions classical", whole(r.classical.total)));
  out += R"(<g class="plateaus">)";
  double last_label = 1e300;
  for (const auto& [value, label] : plateaus) {
    const double py = y(value);
    out += svg::line(plot_left, py, plot_right, py, plateau_colour, 1.2, "6 4");
    const double ly = std::min(py - 5, last_label - (font_tick + 3));
    out += svg::text(plot_right - 6, ly, label, font_tick, "end", R"(class="halo")");
    last_label = ly;
  }
  out += "</g>\n";

  auto curve = [&](auto value_of, const char* colour, double width, const char* dash, const char* css) {
    std::vector<std::pair<double, double>> points;
    for (size_t j : s.order) points.emplace_back(x(r.points[j].T_K), y(value_of(r.points[j])));
    out += svg::polyline(points, css, colour, width, dash);
  };
  curve([](const ModesPoint& p) { return p.dof.total; }, total_colour, 2.5, "", "total");
  std::vector<svg::LegendEntry> entries{
      {total_colour, 2.5, "", "F(T), all motions but the electronic", false}};
  if (!r.rotors.empty()) {
    curve([](const ModesPoint& p) { return p.dof.hindered_rotors; }, rotor_colour, 2.0, "",
          "hindered-rotors");
    entries.push_back({rotor_colour, 2.0, "",
                       fmt::format("hindered rotors: 2 per rotor as oscillators → 1 as free rotors ({} here)",
                                   whole(r.classical.hindered_rotors)),
                       false});
  }
  if (electronic) {
    curve([](const ModesPoint& p) { return p.dof.electronic; }, electronic_colour, 2.0, "2 3", "electronic");
    entries.push_back({electronic_colour, 2.0, "2 3", "electronic 2Cv/R (not in F)", false});
  }
  entries.push_back({plateau_colour, 1.2, "6 4", "classical plateau", false});
  double used = bottom - top;
  used += svg::x_axis_labels(out, x, bottom, s.axis_title());
  used += svg::legend(out, entries, plot_left, top + used);
  return used;
}

std::string ramp_gradient(const std::string& id) {
  std::string out = fmt::format(R"(<linearGradient id="{}" x1="0" y1="0" x2="1" y2="0">)", escape_markup(id));
  for (int k = 0; k <= 16; ++k)
    out += fmt::format(R"(<stop offset="{:g}" stop-color="{}"/>)", k / 16.0, svg::viridis_hex(k / 16.0));
  return out + "</linearGradient>\n";
}

}  // namespace

std::string modes_to_svg(const std::vector<ModesReport>& reports, const ModesSvgOptions& options) {
  std::string body;
  svg::GradientBook book{options.id_prefix, {}, {}};
  std::string shapes;  // one harmonic template per species: the axis, hence the shift origin, is its own
  double y = 8.0;
  bool any_map = false;
  for (const ModesReport& r : reports) {
    if (r.points.empty()) continue;
    Sampling s = sampling_of(r);
    s.log = options.logarithmic_axis;
    body += fmt::format(R"(<g class="species" data-name="{}">)", escape_markup(r.name));
    body += '\n';
    if (options.species_titles) {
      body += svg::text(12, y + 18,
                        fmt::format("{} ({}, classical F = {})", r.name, r.is_gas ? "gas" : "adsorbate",
                                    whole(r.classical.total)),
                        16, "start", R"(font-weight="bold")");
      body += '\n';
      y += 34;
    }
    if (!r.modes.empty() || !r.rotors.empty()) {
      HarmonicTemplate shape{fmt::format("{}h{}", options.id_prefix, &r - reports.data() + 1)};
      y += heat_map(body, book, shape, r, s, y) + 12;
      if (shape.used)
        shapes += harmonic_gradient(shape.id, svg::Axis(s.low, s.high, s.log, plot_left, plot_right));
      any_map = true;
    }
    y += dof_curve(body, r, s, y) + 16;
    body += "</g>\n";
  }
  std::string out =
      svg::open_svg(std::max(y, 40.0), options.standalone, "modes-plot",
                    "vibtherm modes: activation of vibrations and effective degrees of freedom");
  if (any_map)
    out += "<defs>\n" + ramp_gradient(options.id_prefix + "ramp") + shapes + book.defs + "</defs>\n";
  out += body;
  out += "</svg>\n";
  return out;
}

}  // namespace vibtherm
