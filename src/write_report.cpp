#include "vibtherm/write_report.hpp"

#include <fmt/format.h>
#include <fmt/ranges.h>

#include <algorithm>
#include <numeric>

#include "vibtherm/markup.hpp"
#include "vibtherm/point_group.hpp"
#include "vibtherm/svg_plot.hpp"
#include "vibtherm/write_modes_svg.hpp"
#include "vibtherm/write_nasa7.hpp"
#include "vibtherm/write_thermo_svg.hpp"

namespace vibtherm {

namespace {

constexpr const char* style = R"(
body { font-family: "DejaVu Sans", Verdana, sans-serif; margin: 1.5em auto; max-width: 1000px; padding: 0 1em;
  color: #222; line-height: 1.4; }
h1 { margin-bottom: 0.2em; }
h2 { border-top: 2px solid #0072b2; padding-top: 0.6em; margin-top: 2.5em; }
table { border-collapse: collapse; margin: 0.6em 0; font-size: 0.92em; }
th, td { border: 1px solid #bbb; padding: 0.25em 0.6em; vertical-align: top; }
th { background: #eef2f7; text-align: left; }
td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
table.sortable th { cursor: pointer; }
table.sortable th[aria-sort=ascending]::after { content: " ▲"; }
table.sortable th[aria-sort=descending]::after { content: " ▼"; }
tr.has-warnings td:first-child { border-left: 4px solid #e69f00; }
.caution { border: 2px solid #b2182b; background: #fdf1ef; padding: 0.6em 1em; }
.warnings { background: #fff8e1; border-left: 4px solid #e69f00; padding: 0.3em 1em; }
.not-fitted { color: #b2182b; font-weight: bold; }
dl.facts { display: grid; grid-template-columns: max-content auto; gap: 0.15em 1.2em; }
dl.facts dt { font-weight: bold; }
dl.facts dd { margin: 0; overflow-wrap: anywhere; }
code { font-size: 0.9em; }
pre { background: #f4f4f4; padding: 0.6em; overflow-x: auto; font-size: 0.85em; }
svg { display: block; max-width: 100%; height: auto; margin: 0.5em 0; }
@media print { body { max-width: none; } section.species { break-before: page; } svg { break-inside: avoid; } }
)";

// Sorts the index table by the clicked column (again: reverse). The page is complete without
// it: the rows are already in their default order. Written without < and & so the page stays XML.
constexpr const char* sort_script = R"(
(function () {
  var table = document.getElementById("index");
  if (!table) return;
  table.className += " sortable";
  var body = table.tBodies[0], heads = table.tHead.rows[0].cells, current = -1, direction = 1;
  function key(row, col) {
    var cell = row.cells[col], v = cell.getAttribute("data-sort");
    return v === null ? cell.textContent : v;
  }
  function sortBy(col) {
    direction = current === col ? -direction : (heads[col].getAttribute("data-type") === "number" ? -1 : 1);
    current = col;
    var numeric = heads[col].getAttribute("data-type") === "number";
    var rows = Array.prototype.slice.call(body.rows);
    rows.sort(function (a, b) {
      var x = key(a, col), y = key(b, col);
      var d = numeric ? parseFloat(x) - parseFloat(y) : x.localeCompare(y);
      return direction * (d || 0);
    });
    rows.forEach(function (r) { body.appendChild(r); });
    for (var i = 0; i !== heads.length; i++)
      heads[i].setAttribute("aria-sort", i === col ? (direction === 1 ? "ascending" : "descending") : "none");
  }
  Array.prototype.forEach.call(heads, function (th, col) {
    th.title = "sort by this column";
    th.addEventListener("click", function () { sortBy(col); });
  });
})();
)";

std::string kJ(double J) { return fmt::format("{:.2f}", J / 1e3); }

// One way to write a wavenumber everywhere on the page: imaginary ones as 1450.0i.
std::string wavenumber(double cm1) {
  return cm1 < 0 ? fmt::format("{:.1f}i", -cm1) : fmt::format("{:.1f}", cm1);
}

void fact(std::string& out, std::string_view term, std::string_view value) {
  out += fmt::format("<dt>{}</dt><dd>{}</dd>\n", escape_markup(term), escape_markup(value));
}

void list_items(std::string& out, const char* css_class, const char* title,
                const std::vector<std::string>& items) {
  if (items.empty()) return;
  out += fmt::format("<div class=\"{}\"><p><strong>{}</strong></p><ul>\n", css_class, title);
  for (const auto& item : items) out += fmt::format("<li>{}</li>\n", escape_markup(item));
  out += "</ul></div>\n";
}

std::string worst_fit_text(const ReportSpecies& s) {
  if (!s.fit) return "<span class=\"not-fitted\">not fitted</span>";
  const RangeErrors* worst = &s.fit->fit.errors.front();
  for (const auto& e : s.fit->fit.errors)
    if (e.max_Cp_relative > worst->max_Cp_relative) worst = &e;
  return fmt::format("{:.3f} % at {:g} K", 100 * worst->max_Cp_relative, worst->T_at_max_Cp_K);
}

void index_table(std::string& out, const std::vector<ReportSpecies>& species) {
  out +=
      "<h2 id=\"index-heading\">Index</h2>\n<p>Species with warnings come first, then the largest fit error "
      "of Cp. With scripts on, a click on a column heading sorts by it.</p>\n"
      "<table id=\"index\" class=\"index\">\n<thead><tr><th data-type=\"text\">species</th>"
      "<th data-type=\"text\">formula</th><th data-type=\"number\">ΔfH°(298.15 K) / kJ mol⁻¹</th>"
      "<th data-type=\"number\">S°(298.15 K) / J mol⁻¹ K⁻¹</th>"
      "<th data-type=\"number\">Cp°(298.15 K) / J mol⁻¹ K⁻¹</th>"
      "<th data-type=\"number\">worst fit error (Cp)</th><th "
      "data-type=\"number\">warnings</th></tr></thead>\n"
      "<tbody>\n";
  for (const size_t i : index_order(species)) {
    const ReportSpecies& s = species[i];
    const bool has_hf = s.fit && !s.fit->enthalpy_of_formation_missing;
    std::string warnings = fmt::format("{}", s.warning_count);
    std::vector<std::string> all = s.facts.warnings;
    if (s.fit) all.insert(all.end(), s.fit->fit.warnings.begin(), s.fit->fit.warnings.end());
    if (!all.empty()) warnings += ": " + escape_markup(all.front()) + (all.size() > 1 ? " …" : "");
    out += fmt::format(
        "<tr{}><td><a href=\"#species-{}\">{}</a></td><td>{}</td><td class=\"num\" data-sort=\"{}\">{}</td>"
        "<td class=\"num\">{:.2f}</td><td class=\"num\">{:.2f}</td><td class=\"num\" data-sort=\"{}\">{}</td>"
        "<td data-sort=\"{}\">{}</td></tr>\n",
        s.warning_count > 0 ? " class=\"has-warnings\"" : "", i + 1, escape_markup(s.facts.name),
        escape_markup(s.facts.formula.empty() ? "—" : s.facts.formula),
        has_hf ? kJ(s.fit->enthalpy_of_formation_J_per_mol) : "-1e300",
        has_hf ? kJ(s.fit->enthalpy_of_formation_J_per_mol) : "not given", s.at_298.S_J_per_mol_K,
        s.at_298.Cp_J_per_mol_K, s.fit ? fmt::format("{:g}", s.worst_Cp_error) : "1e300", worst_fit_text(s),
        s.warning_count, warnings);
  }
  out += "</tbody>\n</table>\n";
}

void facts_list(std::string& out, const ReportSpecies& s) {
  const SpeciesFacts& f = s.facts;
  out += "<dl class=\"facts\">\n";
  if (!s.input_file.empty()) {
    fact(out, "input file", s.input_file);
    if (!s.input_sha256.empty()) fact(out, "input SHA-256", s.input_sha256);
  }
  fact(out, "formula", f.formula.empty() ? "unknown" : f.formula);
  if (f.molar_mass_g_per_mol > 0)
    fact(out, "molar mass",
         fmt::format("{:.4f} g/mol{}", f.molar_mass_g_per_mol,
                     f.isotope_labels ? " (isotope masses for labelled atoms)" : ""));
  fact(out, "phase", f.phase);
  // An adsorbate neither translates nor rotates: no rotor type, moments or constants.
  if (f.phase != "adsorbate") {
    fact(out, "rotor", rotor_type_name(f.rotor));
    if (f.rotor != RotorType::atom) {
      fact(out, "principal moments",
           fmt::format("{:.4f}, {:.4f}, {:.4f} amu Å²", f.moments_amu_A2[0], f.moments_amu_A2[1],
                       f.moments_amu_A2[2]));
      if (!f.rotational_constants_cm1.empty())
        fact(out, "rotational constants",
             fmt::format("{:.5g} cm⁻¹", fmt::join(f.rotational_constants_cm1, ", ")));
    }
    fact(out, "point group",
         f.point_group.empty() ? std::string("— (no geometry)")
                               : point_group_display(f.point_group) + (f.chiral ? " (chiral)" : ""));
    fact(out, "symmetry number σ",
         fmt::format("{}{}", f.symmetry_number, f.racemic ? " (racemic: + R ln 2)" : ""));
  }
  fact(out, "ground-level degeneracy", fmt::format("{}", f.ground_degeneracy));
  fact(
      out, "vibrational modes",
      fmt::format("{} given, {} expected, {} imaginary", f.given_modes, f.expected_modes, f.imaginary_modes));
  std::vector<std::string> used;
  for (const auto& m : s.modes.modes) used.push_back(wavenumber(m.wavenumber_cm1));
  for (double v : f.frequencies_cm1)
    if (v < 0) used.push_back(wavenumber(v) + " (reaction coordinate, left out)");
  if (!used.empty()) fact(out, "vibrations used, ascending", fmt::format("{} cm⁻¹", fmt::join(used, ", ")));
  for (const auto& r : s.modes.rotors)
    fact(out, fmt::format("hindered rotor {}", r.index),
         fmt::format("about atoms {}–{}, internal symmetry σ = {}; replaces the {} cm⁻¹ torsion", r.bond[0],
                     r.bond[1], r.symmetry, wavenumber(r.replaces_cm1)));
  fact(out, "zero-point energy", fmt::format("{} kJ/mol", kJ(f.zero_point_energy_J_per_mol)));
  out += "</dl>\n";
}

void thermo_table(std::string& out, const std::vector<ThermoPoint>& rows) {
  if (rows.empty()) return;
  out +=
      "<table class=\"thermo\">\n<thead><tr><th>T / K</th><th>Cp / J mol⁻¹ K⁻¹</th><th>S° / J mol⁻¹ K⁻¹</th>"
      "<th>H − H(298.15 K) / kJ mol⁻¹</th><th>−[G − H(298.15 K)]/T / J mol⁻¹ "
      "K⁻¹</th></tr></thead>\n<tbody>\n";
  for (const auto& r : rows)
    out += fmt::format(
        "<tr><td class=\"num\">{:g}</td><td class=\"num\">{:.3f}</td><td class=\"num\">{:.3f}</td>"
        "<td class=\"num\">{:.3f}</td><td class=\"num\">{:.3f}</td></tr>\n",
        r.T_K, r.Cp_J_per_mol_K, r.S_J_per_mol_K, r.H_minus_H298_J_per_mol / 1e3,
        r.gibbs_function_J_per_mol_K);
  out += "</tbody>\n</table>\n";
}

void nasa_part(std::string& out, const ReportSpecies& s) {
  out += "<h3>NASA-7 polynomial</h3>\n";
  if (!s.fit) {
    out += fmt::format("<p class=\"not-fitted\">Not fitted: {}.</p>\n", escape_markup(s.not_fitted_reason));
    return;
  }
  const SpeciesFit& f = *s.fit;
  out +=
      "<table class=\"fit-errors\">\n<thead><tr><th>range / K</th><th>max Cp error</th><th>at T / K</th>"
      "<th>rms Cp error</th><th>max H error / kJ mol⁻¹</th><th>max S error / J mol⁻¹ K⁻¹</th></tr></thead>\n"
      "<tbody>\n";
  for (const auto& e : f.fit.errors)
    out += fmt::format(
        "<tr><td>{:g}–{:g}</td><td class=\"num\">{:.3f} %</td><td class=\"num\">{:g}</td>"
        "<td class=\"num\">{:.3f} %</td><td class=\"num\">{:.4f}</td><td class=\"num\">{:.4f}</td></tr>\n",
        e.T_low_K, e.T_high_K, 100 * e.max_Cp_relative, e.T_at_max_Cp_K, 100 * e.rms_Cp_relative,
        e.max_H_J_per_mol / 1e3, e.max_S_J_per_mol_K);
  out += "</tbody>\n</table>\n";
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

void species_section(std::string& out, const ReportSpecies& s, size_t i, const ReportWriteOptions& options) {
  const bool log = options.axis == TemperatureAxis::log;
  out += fmt::format("<section class=\"species\" id=\"species-{}\">\n<h2>{}</h2>\n", i + 1,
                     escape_markup(s.facts.name));
  facts_list(out, s);
  list_items(out, "warnings", "Warnings", s.facts.warnings);
  list_items(out, "notes", "Model notes", s.facts.notes);
  out += "<h3>Computed and fitted functions</h3>\n";
  for (const ThermoQuantity q : {ThermoQuantity::Cp, ThermoQuantity::S, ThermoQuantity::H_minus_H298}) {
    out += thermo_svg(s, q, log);
    out += '\n';
  }
  out += "<h3>Mode activation</h3>\n";
  ModesSvgOptions modes;
  modes.standalone = false;
  modes.id_prefix = fmt::format("s{}-", i + 1);
  modes.species_titles = false;
  modes.logarithmic_axis = log;
  out += modes_to_svg({s.modes}, modes);
  out += "<h3>Thermochemistry at selected temperatures (computed)</h3>\n";
  thermo_table(out, s.table);
  nasa_part(out, s);
  out += "<p><a href=\"#index-heading\">back to the index</a></p>\n</section>\n";
}

}  // namespace

std::vector<size_t> index_order(const std::vector<ReportSpecies>& species) {
  std::vector<size_t> order(species.size());
  std::iota(order.begin(), order.end(), size_t{0});
  std::stable_sort(order.begin(), order.end(), [&](size_t a, size_t b) {
    const ReportSpecies &x = species[a], &y = species[b];
    if ((x.warning_count > 0) != (y.warning_count > 0)) return x.warning_count > 0;
    if (x.warning_count != y.warning_count) return x.warning_count > y.warning_count;
    return x.worst_Cp_error > y.worst_Cp_error;
  });
  return order;
}

std::string write_report_html(const std::vector<ReportSpecies>& species, const ReportHeader& header,
                              const ReportWriteOptions& options) {
  std::string out =
      "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n"
      "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n"
      "<title>vibtherm report</title>\n<style>";
  out += style;
  out += svg::style_rules();  // once for every picture on the page
  out += "\n</style>\n</head>\n<body>\n";
  out += fmt::format("<h1>Thermochemistry report</h1>\n<p class=\"generator\">vibtherm {}, {} species.</p>\n",
                     escape_markup(header.version), species.size());
  out +=
      "<div class=\"caution\"><p><strong>Caution.</strong> Every value here is computed from a model "
      "(rigid rotor, harmonic oscillator unless a species' model notes say otherwise) and carries its "
      "errors: "
      "often several kJ/mol in enthalpies, a few J/(mol K) in S and Cp for flexible molecules. Verify the "
      "values "
      "against evaluated data before using them in design, and defer to the applicable codes and licensed "
      "engineering practice for reactor, combustion and process-safety work.</p></div>\n";
  index_table(out, species);
  out += "<h2 id=\"run\">Model and options</h2>\n<ul class=\"model\">\n";
  for (const auto& line : header.model_summary) out += fmt::format("<li>{}</li>\n", escape_markup(line));
  out += "</ul>\n";
  if (!header.options.empty()) {
    out += "<table class=\"options\">\n<thead><tr><th>option</th><th>value used</th></tr></thead>\n<tbody>\n";
    for (const auto& [key, value] : header.options)
      out += fmt::format("<tr><td><code>{}</code></td><td>{}</td></tr>\n", escape_markup(key),
                         escape_markup(value));
    out += "</tbody>\n</table>\n";
  }
  for (size_t i = 0; i < species.size(); ++i) species_section(out, species[i], i, options);
  out += "<script>";
  out += sort_script;
  out += "</script>\n</body>\n</html>\n";
  return out;
}

}  // namespace vibtherm
