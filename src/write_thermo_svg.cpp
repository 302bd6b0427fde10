#include "vibtherm/write_thermo_svg.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "vibtherm/svg_plot.hpp"

namespace vibtherm {

namespace {

using svg::font_tick;
using svg::font_title;
using svg::plot_left;
using svg::plot_right;

constexpr const char* engine_colour = "#0072b2";     // Okabe–Ito blue
constexpr const char* fitted_colour = "#d55e00";     // Okabe–Ito vermillion
constexpr const char* threshold_colour = "#cc79a7";  // Okabe–Ito reddish purple
constexpr const char* classical_colour = "#666666";
constexpr double main_height = 190.0, residual_height = 84.0, panel_gap = 18.0;

struct Quantity {
  const char* title;
  const char* y_title;
  const char* residual_title;
  const char* unit_text;  // for the threshold label
  double threshold;       // in residual units
  double (*value)(const ThermoSample&);
  double (*residual)(const ThermoSample& fitted, const ThermoSample& engine);
};

Quantity quantity_of(ThermoQuantity q, const FitThresholds& t) {
  switch (q) {
    case ThermoQuantity::Cp:
      return {"Heat capacity Cp(T)",
              "Cp / (J mol⁻¹ K⁻¹)",
              "fit − computed / %",
              "%",
              100.0 * t.Cp_relative,
              [](const ThermoSample& s) { return s.Cp_J_per_mol_K; },
              [](const ThermoSample& f, const ThermoSample& e) {
                return 100.0 * (f.Cp_J_per_mol_K - e.Cp_J_per_mol_K) / e.Cp_J_per_mol_K;
              }};
    case ThermoQuantity::S:
      return {"Entropy S°(T)",
              "S° / (J mol⁻¹ K⁻¹)",
              "fit − computed / J mol⁻¹ K⁻¹",
              "J/(mol K)",
              t.S_J_per_mol_K,
              [](const ThermoSample& s) { return s.S_J_per_mol_K; },
              [](const ThermoSample& f, const ThermoSample& e) { return f.S_J_per_mol_K - e.S_J_per_mol_K; }};
    case ThermoQuantity::H_minus_H298:
      break;
  }
  return {"Enthalpy H(T) − H(298.15 K)",
          "H − H(298.15 K) / (kJ mol⁻¹)",
          "fit − computed / kJ mol⁻¹",
          "kJ/mol",
          t.H_J_per_mol / 1e3,
          [](const ThermoSample& s) { return s.H_minus_H298_J_per_mol / 1e3; },
          [](const ThermoSample& f, const ThermoSample& e) {
            return (f.H_minus_H298_J_per_mol - e.H_minus_H298_J_per_mol) / 1e3;
          }};
}

// Vertical dotted lines where the polynomial's pieces meet, labelled in the upper panel.
void joints(std::string& out, const ReportSpecies& s, const svg::Axis& x, double top, double bottom,
            bool label) {
  if (!s.fit) return;
  const auto& bp = s.fit->fit.breakpoints_K;
  for (size_t i = 1; i + 1 < bp.size(); ++i) {
    if (bp[i] <= x.low() || bp[i] >= x.high()) continue;
    out += svg::line(x(bp[i]), top, x(bp[i]), bottom, "#888888", 1.2, "2 3");
    if (label)
      out += svg::text(x(bp[i]) + 4, top + 15, fmt::format("joint {:g} K", bp[i]), font_tick, "start",
                       R"(class="halo")");
  }
}

}  // namespace

std::string thermo_svg(const ReportSpecies& s, ThermoQuantity which, bool logarithmic) {
  const Quantity q = quantity_of(which, s.thresholds);
  const svg::Axis x(s.T_low_K, s.T_high_K, logarithmic, plot_left, plot_right);
  std::string out;

  // Upper panel: computed and fitted values.
  double low = 1e300, high = -1e300;
  for (const auto& p : s.curve) {
    for (const double v : {q.value(p.engine), p.fitted ? q.value(*p.fitted) : q.value(p.engine)}) {
      low = std::min(low, v);
      high = std::max(high, v);
    }
  }
  const bool is_Cp = which == ThermoQuantity::Cp;
  if (is_Cp) {
    low = 0.0;
    high = std::max(high, s.classical_Cp_J_per_mol_K);
  }
  const auto [y_low, y_high] = svg::nice_interval(low, high + 0.04 * (high - low), 5);
  const double top = 28.0, bottom = top + main_height;
  const svg::Axis y(y_low, y_high, false, bottom, top);
  out += svg::text(plot_left, 18, q.title, font_title, "start", R"(font-weight="bold")");
  svg::plot_box(out, x, y, top, bottom, q.y_title);
  joints(out, s, x, top, bottom, true);
  std::vector<svg::LegendEntry> entries{{engine_colour, 2.5, "", "computed (this model)", false}};
  if (is_Cp) {
    out += svg::line(plot_left, y(s.classical_Cp_J_per_mol_K), plot_right, y(s.classical_Cp_J_per_mol_K),
                     classical_colour, 1.2, "8 5");
    entries.push_back({classical_colour, 1.2, "8 5",
                       fmt::format("classical limit {:.1f} J mol⁻¹ K⁻¹", s.classical_Cp_J_per_mol_K), false});
  }
  std::vector<std::pair<double, double>> engine, fitted, residual;
  double worst = 0.0;
  for (const auto& p : s.curve) {
    engine.emplace_back(x(p.T_K), y(q.value(p.engine)));
    if (p.fitted) {
      fitted.emplace_back(x(p.T_K), y(q.value(*p.fitted)));
      const double r = q.residual(*p.fitted, p.engine);
      worst = std::max(worst, std::abs(r));
      residual.emplace_back(p.T_K, r);
    }
  }
  out += svg::polyline(engine, "engine", engine_colour, 2.5);
  if (!fitted.empty()) {
    out += svg::polyline(fitted, "fitted", fitted_colour, 2.0, "7 4");
    entries.push_back({fitted_colour, 2.0, "7 4", "fitted NASA-7", false});
  }

  // Lower panel: fit − computed with the warning thresholds.
  const double r_top = bottom + panel_gap, r_bottom = r_top + residual_height;
  double r_bottom_edge = bottom;
  if (!residual.empty()) {
    const double span = 1.3 * std::max(worst, q.threshold);
    const auto [r_low, r_high] = svg::nice_interval(-span, span, 4);
    const svg::Axis ry(r_low, r_high, false, r_bottom, r_top);
    svg::plot_box(out, x, ry, r_top, r_bottom, "fit − computed");
    joints(out, s, x, r_top, r_bottom, false);
    for (const double t : {q.threshold, -q.threshold})
      out += svg::line(plot_left, ry(t), plot_right, ry(t), threshold_colour, 1.5, "5 3");
    std::vector<std::pair<double, double>> points;
    for (const auto& [T, r] : residual) points.emplace_back(x(T), ry(r));
    out += svg::polyline(points, "residual", fitted_colour, 2.0);
    out += svg::text(
        plot_right - 6, r_top + 15,
        fmt::format("{} (largest |fit − computed| {:.3g} {})", q.residual_title, worst, q.unit_text),
        font_tick, "end", R"(class="halo")");
    entries.push_back({threshold_colour, 1.5, "5 3",
                       fmt::format("warning threshold ±{:g} {}", q.threshold, q.unit_text), false});
    r_bottom_edge = r_bottom;
  } else {
    entries.push_back(
        {"#ffffff", 0.0, "", s.fit ? "fit range outside this axis" : "not fitted: no residual", false});
  }
  double height = r_bottom_edge;
  height += svg::x_axis_labels(out, x, r_bottom_edge,
                               logarithmic ? "temperature T / K (logarithmic scale)" : "temperature T / K");
  height += svg::legend(out, entries, plot_left, height) + 8;
  return svg::open_svg(height, false, "thermo-plot",
                       fmt::format("{} of {}: computed, fitted and fit − computed", q.title, s.facts.name)) +
         out + "</svg>";
}

}  // namespace vibtherm
