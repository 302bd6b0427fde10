#include "vibtherm/write_report.hpp"

#include <fmt/format.h>
#include <fmt/ranges.h>

#include <algorithm>
#include <cmath>

#include "vibtherm/constants.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/markup.hpp"
#include "vibtherm/write_modes.hpp"
#include "vibtherm/write_nasa7.hpp"

namespace vibtherm {

namespace {

// Picture geometry in SVG user units.
constexpr double width = 900.0, height = 380.0;
constexpr double left = 90.0, right = 660.0, top = 30.0, bottom = 320.0;

class Axis {
 public:
  Axis(double low, double high, bool log) : log_(log), low_(f(low)), high_(f(high)) {}
  double x(double T) const { return left + (f(T) - low_) / (high_ - low_) * (right - left); }

 private:
  double f(double T) const { return log_ ? std::log(T) : T; }
  bool log_;
  double low_, high_;
};

// A step of 1, 2 or 5 × 10^k giving at most `max_ticks` intervals over `span` (> 0).
double nice_step(double span, int max_ticks) {
  double scale = std::pow(10.0, std::floor(std::log10(span / max_ticks)));
  for (;; scale *= 10.0)
    for (double m : {1.0, 2.0, 5.0})
      if (span / (m * scale) <= max_ticks) return m * scale;
}

std::vector<double> temperature_ticks(double low, double high, bool log) {
  std::vector<double> ticks;
  if (log) {
    for (int k = static_cast<int>(std::floor(std::log10(low)));
         k <= static_cast<int>(std::ceil(std::log10(high))); ++k)
      for (double m : {1.0, 2.0, 5.0}) {
        const double t = m * std::pow(10.0, k);
        if (t >= low * (1 - 1e-9) && t <= high * (1 + 1e-9)) ticks.push_back(t);
      }
  } else {
    const double step = nice_step(high - low, 8);
    for (double t = std::ceil(low / step) * step; t <= high * (1 + 1e-9); t += step) ticks.push_back(t);
  }
  return ticks;
}

std::string polyline(const std::vector<std::pair<double, double>>& points, const char* css_class,
                     const char* colour, const char* dash, double stroke_width = 2.0) {
  std::string out =
      fmt::format(R"(<polyline class="{}" fill="none" stroke="{}" stroke-width="{:g}"{} points=")", css_class,
                  colour, stroke_width, dash);
  for (size_t i = 0; i < points.size(); ++i)
    out += fmt::format("{}{:.1f},{:.1f}", i ? " " : "", points[i].first, points[i].second);
  return out + "\"/>\n";
}

}  // namespace

std::string Cp_curve_svg(const ReportSpecies& s, TemperatureAxis axis) {
  const auto& curve = s.Cp_curve;
  std::string out =
      fmt::format(R"(<svg class="cp-plot" width="{0:.0f}" height="{1:.0f}" viewBox="0 0 {0:.0f} {1:.0f}" )"
                  R"(font-family="sans-serif" role="img">)"
                  "\n<title>Cp(T) of {2}: engine, fitted NASA-7 polynomial and classical limit</title>\n"
                  R"(<rect width="100%" height="100%" fill="white"/>)"
                  "\n",
                  width, height, escape_markup(s.facts.name));
  if (curve.size() < 2) return out + "</svg>";
  const bool log = axis == TemperatureAxis::log;
  const double T_low = curve.front().T_K, T_high = curve.back().T_K;
  const Axis ax(T_low, T_high, log);
  double y_max = s.classical_Cp_J_per_mol_K;
  for (const auto& p : curve) {
    y_max = std::max({y_max, p.engine_Cp_J_per_mol_K, p.fitted_Cp_J_per_mol_K.value_or(0.0)});
  }
  const double y_step = nice_step(y_max * 1.05, 6);
  y_max = std::ceil(y_max * 1.05 / y_step) * y_step;
  auto y = [&](double Cp) { return bottom - Cp / y_max * (bottom - top); };

  out += R"(<g class="grid" stroke="#dddddd">)";
  for (double t : temperature_ticks(T_low, T_high, log))
    out +=
        fmt::format(R"(<line x1="{0:.1f}" y1="{1:.1f}" x2="{0:.1f}" y2="{2:.1f}"/>)", ax.x(t), top, bottom);
  for (double v = y_step; v < y_max * (1 + 1e-9); v += y_step)
    out += fmt::format(R"(<line x1="{0:.1f}" y1="{1:.1f}" x2="{2:.1f}" y2="{1:.1f}"/>)", left, y(v), right);
  out += "</g>\n";
  out += fmt::format(R"(<g class="x-axis" font-size="11" text-anchor="middle">)");
  for (double t : temperature_ticks(T_low, T_high, log))
    out += fmt::format(R"(<text x="{:.1f}" y="{:.1f}">{:g}</text>)", ax.x(t), bottom + 16, t);
  out += fmt::format(R"(<text x="{:.1f}" y="{:.1f}" font-size="12">T / K ({} scale)</text></g>)",
                     0.5 * (left + right), bottom + 36, log ? "logarithmic" : "linear");
  out += '\n';
  out += R"(<g class="y-axis" font-size="11" text-anchor="end">)";
  for (double v = 0.0; v < y_max * (1 + 1e-9); v += y_step)
    out += fmt::format(R"(<text x="{:.1f}" y="{:.1f}">{:g}</text>)", left - 6, y(v) + 4, v);
  out += fmt::format(
      R"~(<text transform="translate(24,{:.1f}) rotate(-90)" text-anchor="middle" font-size="12">)~"
      "Cp / (J mol⁻¹ K⁻¹)</text></g>\n",
      0.5 * (top + bottom));

  // Joints of the fitted polynomial, where its pieces meet.
  if (s.fit)
    for (double b : s.fit->fit.breakpoints_K)
      if (b > T_low && b < T_high)
        out += fmt::format(
            R"(<line class="joint" x1="{0:.1f}" y1="{1:.1f}" x2="{0:.1f}" y2="{2:.1f}" stroke="#999999" )"
            R"(stroke-dasharray="2 3"/><text x="{0:.1f}" y="{3:.1f}" font-size="10" text-anchor="middle" )"
            R"(fill="#666666">{4:g} K</text>)"
            "\n",
            ax.x(b), top, bottom, top - 6, b);

  out += polyline({{left, y(s.classical_Cp_J_per_mol_K)}, {right, y(s.classical_Cp_J_per_mol_K)}},
                  "classical", "#555555", R"( stroke-dasharray="8 5")");
  std::vector<std::pair<double, double>> engine, fitted;
  for (const auto& p : curve) {
    engine.emplace_back(ax.x(p.T_K), y(p.engine_Cp_J_per_mol_K));
    if (p.fitted_Cp_J_per_mol_K) fitted.emplace_back(ax.x(p.T_K), y(*p.fitted_Cp_J_per_mol_K));
  }
  // The fit usually lies on the engine curve: a wide engine line under a narrow dashed
  // fitted one keeps both visible.
  out += polyline(engine, "engine", "#6fa8dc", "", 4.0);
  if (!fitted.empty()) out += polyline(fitted, "fitted", "#d35400", R"( stroke-dasharray="6 4")", 1.5);
  out += fmt::format(
      R"(<rect x="{:.1f}" y="{:.1f}" width="{:.1f}" height="{:.1f}" fill="none" stroke="black"/>)", left, top,
      right - left, bottom - top);
  out += '\n';

  // Legend to the right of the plot.
  const double lx = right + 20;
  struct Entry {
    const char* colour;
    const char* dash;
    std::string label;
  };
  std::vector<Entry> entries{{"#6fa8dc", "", "engine (RRHO model)"}};
  if (!fitted.empty()) entries.push_back({"#d35400", R"( stroke-dasharray="6 4")", "fitted NASA-7"});
  entries.push_back({"#555555", R"( stroke-dasharray="8 5")",
                     fmt::format("classical limit {:.1f}", s.classical_Cp_J_per_mol_K)});
  out += R"(<g class="legend" font-size="11">)";
  for (size_t i = 0; i < entries.size(); ++i) {
    const double ly = top + 14 + 20.0 * static_cast<double>(i);
    out += fmt::format(
        R"(<line x1="{:.1f}" y1="{:.1f}" x2="{:.1f}" y2="{:.1f}" stroke="{}" stroke-width="2"{}/>)"
        R"(<text x="{:.1f}" y="{:.1f}">{}</text>)",
        lx, ly, lx + 28, ly, entries[i].colour, entries[i].dash, lx + 34, ly + 4,
        escape_markup(entries[i].label));
  }
  if (!s.fit)
    out += fmt::format(R"(<text x="{:.1f}" y="{:.1f}">no NASA fit (see below)</text>)", lx,
                       top + 18 + 20.0 * static_cast<double>(entries.size()));
  out += "</g>\n</svg>";
  return out;
}

namespace {

constexpr const char* style = R"(
body { font-family: sans-serif; margin: 2em auto; max-width: 1000px; color: #222; line-height: 1.4; }
h1 { margin-bottom: 0.2em; }
h2 { border-top: 2px solid #2166ac; padding-top: 0.6em; margin-top: 2.5em; }
table { border-collapse: collapse; margin: 0.6em 0; font-size: 0.92em; }
th, td { border: 1px solid #bbb; padding: 0.25em 0.6em; }
th { background: #eef2f7; }
td.num { text-align: right; font-variant-numeric: tabular-nums; }
.caution { border: 2px solid #b2182b; background: #fdf1ef; padding: 0.6em 1em; }
.warnings { background: #fff8e1; border-left: 4px solid #e08214; padding: 0.3em 1em; }
.not-fitted { color: #b2182b; font-weight: bold; }
dl.facts { display: grid; grid-template-columns: max-content auto; gap: 0.15em 1.2em; }
dl.facts dt { font-weight: bold; }
dl.facts dd { margin: 0; }
pre { background: #f4f4f4; padding: 0.6em; overflow-x: auto; font-size: 0.85em; }
svg { display: block; max-width: 100%; height: auto; margin: 0.5em 0; }
)";

void fact(std::string& out, std::string_view term, std::string_view value) {
  out += fmt::format("<dt>{}</dt><dd>{}</dd>\n", escape_markup(term), escape_markup(value));
}

int warning_count(const ReportSpecies& s) {
  return static_cast<int>(s.facts.warnings.size() + (s.fit ? s.fit->fit.warnings.size() : 0));
}

double max_Cp_error(const SpeciesFit& f) {
  double worst = 0.0;
  for (const auto& e : f.fit.errors) worst = std::max(worst, e.max_Cp_relative);
  return worst;
}

std::string kJ(double J) { return fmt::format("{:.2f}", J / 1e3); }

void summary_table(std::string& out, const std::vector<ReportSpecies>& species) {
  out +=
      "<h2 id=\"summary\">Summary</h2>\n<table class=\"summary\">\n<tr><th>species</th><th>formula</th>"
      "<th>rotor</th><th>σ</th><th>ZPE / kJ mol⁻¹</th><th>S°(298.15 K) / J mol⁻¹ K⁻¹</th>"
      "<th>Cp(298.15 K) / J mol⁻¹ K⁻¹</th><th>ΔfH°(298.15 K) / kJ mol⁻¹</th>"
      "<th>fit: max Cp error</th><th>warnings</th></tr>\n";
  for (size_t i = 0; i < species.size(); ++i) {
    const ReportSpecies& s = species[i];
    const auto& f = s.facts;
    std::string fit = s.fit ? fmt::format("{:.3f} %", 100 * max_Cp_error(*s.fit))
                            : std::string("<span class=\"not-fitted\">not fitted</span>");
    const bool has_hf = s.fit && !s.fit->enthalpy_of_formation_missing;
    out += fmt::format(
        "<tr><td><a href=\"#species-{}\">{}</a></td><td>{}</td><td>{}</td><td class=\"num\">{}</td>"
        "<td class=\"num\">{}</td><td class=\"num\">{:.2f}</td><td class=\"num\">{:.2f}</td>"
        "<td class=\"num\">{}</td><td class=\"num\">{}</td><td class=\"num\">{}</td></tr>\n",
        i + 1, escape_markup(f.name), escape_markup(f.formula.empty() ? "—" : f.formula),
        rotor_type_name(f.rotor), f.symmetry_number, kJ(f.zero_point_energy_J_per_mol),
        s.at_298.S_J_per_mol_K, s.at_298.Cp_J_per_mol_K,
        has_hf ? kJ(s.fit->enthalpy_of_formation_J_per_mol) : "not given", fit, warning_count(s));
  }
  out += "</table>\n";
}

void facts_list(std::string& out, const SpeciesFacts& f) {
  out += "<dl class=\"facts\">\n";
  fact(out, "formula", f.formula.empty() ? "unknown" : f.formula);
  if (f.molar_mass_g_per_mol > 0)
    fact(out, "molar mass", fmt::format("{:.4f} g/mol", f.molar_mass_g_per_mol));
  fact(out, "phase", f.phase);
  fact(out, "rotor", rotor_type_name(f.rotor));
  if (f.rotor != RotorType::atom) {
    fact(out, "principal moments",
         fmt::format("{:.4f}, {:.4f}, {:.4f} amu Å²", f.moments_amu_A2[0], f.moments_amu_A2[1],
                     f.moments_amu_A2[2]));
    if (!f.rotational_constants_cm1.empty())
      fact(out, "rotational constants",
           fmt::format("{:.5g} cm⁻¹", fmt::join(f.rotational_constants_cm1, ", ")));
  }
  fact(out, "symmetry number σ", fmt::format("{}", f.symmetry_number));
  fact(out, "ground-level degeneracy", fmt::format("{}", f.ground_degeneracy));
  fact(
      out, "vibrational modes",
      fmt::format("{} given, {} expected, {} imaginary", f.given_modes, f.expected_modes, f.imaginary_modes));
  if (!f.frequencies_cm1.empty())
    fact(out, "wavenumbers used", fmt::format("{:.1f} cm⁻¹", fmt::join(f.frequencies_cm1, ", ")));
  fact(out, "zero-point energy", fmt::format("{} kJ/mol", kJ(f.zero_point_energy_J_per_mol)));
  out += "</dl>\n";
}

void list_items(std::string& out, const char* css_class, const char* title,
                const std::vector<std::string>& items) {
  if (items.empty()) return;
  out += fmt::format("<div class=\"{}\"><p><strong>{}</strong></p><ul>\n", css_class, title);
  for (const auto& item : items) out += fmt::format("<li>{}</li>\n", escape_markup(item));
  out += "</ul></div>\n";
}

void thermo_table(std::string& out, const std::vector<ThermoPoint>& rows) {
  if (rows.empty()) return;
  out +=
      "<table class=\"thermo\">\n<tr><th>T / K</th><th>Cp / J mol⁻¹ K⁻¹</th><th>S° / J mol⁻¹ K⁻¹</th>"
      "<th>H − H(298.15 K) / kJ mol⁻¹</th><th>−[G − H(298.15 K)]/T / J mol⁻¹ K⁻¹</th></tr>\n";
  for (const auto& r : rows)
    out += fmt::format(
        "<tr><td class=\"num\">{:g}</td><td class=\"num\">{:.3f}</td><td class=\"num\">{:.3f}</td>"
        "<td class=\"num\">{:.3f}</td><td class=\"num\">{:.3f}</td></tr>\n",
        r.T_K, r.Cp_J_per_mol_K, r.S_J_per_mol_K, r.H_minus_H298_J_per_mol / 1e3,
        r.gibbs_function_J_per_mol_K);
  out += "</table>\n";
}

void nasa_part(std::string& out, const ReportSpecies& s) {
  out += "<h3>NASA-7 polynomial</h3>\n";
  if (!s.fit) {
    out += fmt::format("<p class=\"not-fitted\">Not fitted: {}.</p>\n", escape_markup(s.not_fitted_reason));
    return;
  }
  const SpeciesFit& f = *s.fit;
  out +=
      "<table class=\"fit-errors\">\n<tr><th>range / K</th><th>max Cp error</th><th>at T / K</th>"
      "<th>rms Cp error</th><th>max H error / kJ mol⁻¹</th><th>max S error / J mol⁻¹ K⁻¹</th></tr>\n";
  for (const auto& e : f.fit.errors)
    out += fmt::format(
        "<tr><td>{:g}–{:g}</td><td class=\"num\">{:.3f} %</td><td class=\"num\">{:g}</td>"
        "<td class=\"num\">{:.3f} %</td><td class=\"num\">{:.4f}</td><td class=\"num\">{:.4f}</td></tr>\n",
        e.T_low_K, e.T_high_K, 100 * e.max_Cp_relative, e.T_at_max_Cp_K, 100 * e.rms_Cp_relative,
        e.max_H_J_per_mol / 1e3, e.max_S_J_per_mol_K);
  out += "</table>\n";
  list_items(out, "warnings", "Fit warnings", f.fit.warnings);
  list_items(out, "notes", "Fit notes", f.notes);
  try {
    out += fmt::format("<pre class=\"nasa7\">{}</pre>\n",
                       escape_markup(write_nasa7_record(std::get<Nasa7>(f.polynomial))));
  } catch (const InputError& e) {
    // The fit is sound but the fixed-column format cannot hold it (e.g. a long name).
    out += fmt::format("<p class=\"not-fitted\">The NASA-7 record cannot be written: {}</p>\n",
                       escape_markup(e.what()));
  }
}

}  // namespace

std::string write_report_html(const std::vector<ReportSpecies>& species, const ReportHeader& header,
                              const ReportWriteOptions& options) {
  std::string out =
      "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n"
      "<title>vibtherm report</title>\n<style>";
  out += style;
  out += "</style>\n</head>\n<body>\n";
  out += fmt::format("<h1>Thermochemistry report</h1>\n<p class=\"generator\">vibtherm {}, {} species.</p>\n",
                     escape_markup(header.version), species.size());
  out += "<ul class=\"model\">\n";
  for (const auto& line : header.model_summary) out += fmt::format("<li>{}</li>\n", escape_markup(line));
  out += "</ul>\n";
  out +=
      "<div class=\"caution\"><p><strong>Caution.</strong> Every value here is computed from a model "
      "(rigid rotor, harmonic oscillator) and carries its errors: often several kJ/mol in enthalpies, "
      "a few J/(mol K) in S and Cp for flexible molecules. Verify the values against evaluated data "
      "before using them in design, and defer to the applicable codes and licensed engineering practice "
      "for reactor, combustion and process-safety work.</p></div>\n";
  summary_table(out, species);
  for (size_t i = 0; i < species.size(); ++i) {
    const ReportSpecies& s = species[i];
    out += fmt::format("<section class=\"species\" id=\"species-{}\">\n<h2>{}</h2>\n", i + 1,
                       escape_markup(s.facts.name));
    facts_list(out, s.facts);
    list_items(out, "warnings", "Warnings", s.facts.warnings);
    list_items(out, "notes", "Model notes", s.facts.notes);
    out += "<h3>Heat capacity</h3>\n";
    out += Cp_curve_svg(s, options.axis);
    out += '\n';
    out += "<h3>Mode activation</h3>\n";
    out += modes_to_svg({s.modes}, ModesSvgOptions{false, fmt::format("s{}-", i + 1)});
    out += "<h3>Thermochemistry at selected temperatures</h3>\n";
    thermo_table(out, s.table);
    nasa_part(out, s);
    out += "</section>\n";
  }
  out += "</body>\n</html>\n";
  return out;
}

}  // namespace vibtherm
