#include "vibtherm/write_report.hpp"

#include <doctest/doctest.h>

#include <string>

#include "svg_layout.hpp"
#include "test_species.hpp"
#include "vibtherm/write_thermo_svg.hpp"

using namespace vibtherm;

namespace {

size_t count_of(const std::string& text, const std::string& what) {
  size_t n = 0;
  for (size_t at = text.find(what); at != std::string::npos; at = text.find(what, at + what.size())) ++n;
  return n;
}

ReportOptions options() {
  ReportOptions o;
  o.temperatures_K = {298.15, 1000.0};
  o.curve_samples = 41;
  return o;
}

ReportHeader header() { return {"9.9.9", {"model <line> & more"}, {{"--scale", "1"}}}; }

}  // namespace

TEST_CASE("species names with markup characters are escaped everywhere") {
  Species s = test::water();
  s.name = "W<&>";
  const auto html = write_report_html({gather_report_species(prepare_species(s), options())}, header());
  CHECK(html.find("W<&>") == std::string::npos);
  CHECK(count_of(html, "W&lt;&amp;&gt;") >= 3);  // summary row, section heading, picture titles
  CHECK(html.find("model &lt;line&gt; &amp; more") != std::string::npos);
}

TEST_CASE("a name the NASA-7 columns cannot hold keeps the fit and says why the record is missing") {
  Species s = test::water();
  s.name = "water <with blanks>";
  const auto html = write_report_html({gather_report_species(prepare_species(s), options())}, header());
  CHECK(html.find("The NASA-7 record cannot be written") != std::string::npos);
  CHECK(html.find("<pre class=\"nasa7\">") == std::string::npos);
  CHECK(html.find("class=\"fit-errors\"") != std::string::npos);
  CHECK(html.find("<with") == std::string::npos);
}

TEST_CASE("page structure: one section per species, caution, inline pictures, no scripts") {
  const auto o = options();
  const std::vector<ReportSpecies> species{gather_report_species(prepare_species(test::water()), o),
                                           gather_report_species(prepare_species(test::oxygen()), o)};
  const auto html = write_report_html(species, header());
  CHECK(html.rfind("<!DOCTYPE html>", 0) == 0);
  CHECK(count_of(html, "<section class=\"species\"") == 2);
  CHECK(count_of(html, "</section>") == 2);
  CHECK(html.find("id=\"species-2\"") != std::string::npos);
  CHECK(html.find("Verify the values against evaluated data") != std::string::npos);
  CHECK(html.find("licensed engineering practice") != std::string::npos);
  // Four pictures per species: Cp, S, H − H(298.15) with residual panels, and the modes picture.
  CHECK(count_of(html, "<svg") == 8);
  CHECK(count_of(html, "</svg>") == 8);
  CHECK(count_of(html, "class=\"residual\"") == 6);
  CHECK(count_of(html, "<pre class=\"nasa7\">") == 2);
  CHECK(html.find("<?xml") == std::string::npos);
  // One inline script (index sorting), nothing loaded from elsewhere.
  CHECK(count_of(html, "<script") == 1);
  CHECK(html.find("<script src") == std::string::npos);
  CHECK(html.find("http") == std::string::npos);
  // The modes pictures keep distinct gradient ids on one page.
  CHECK(html.find("id=\"s1-ramp\"") != std::string::npos);
  CHECK(html.find("id=\"s2-ramp\"") != std::string::npos);
  CHECK(html.find("9.9.9") != std::string::npos);
}

TEST_CASE("a species without enthalpy of formation is reported, its NASA part not fitted") {
  Species s = test::water();
  s.enthalpy_of_formation_J_per_mol.reset();
  ReportOptions o = options();
  CHECK_THROWS_AS(gather_report_species(prepare_species(s), o), InputError);
  o.fit.allow_missing_hf = true;
  const ReportSpecies r = gather_report_species(prepare_species(s), o);
  CHECK_FALSE(r.fit.has_value());
  CHECK_FALSE(r.not_fitted_reason.empty());
  for (const auto& p : r.curve) CHECK_FALSE(p.fitted.has_value());
  const auto html = write_report_html({r}, header());
  CHECK(html.find("Not fitted:") != std::string::npos);
  CHECK(html.find("<pre class=\"nasa7\">") == std::string::npos);
  CHECK(html.find("class=\"fitted\"") == std::string::npos);
}

TEST_CASE("thermo pictures: engine, fitted and residual curves with thresholds, on either scale") {
  const ReportSpecies r = gather_report_species(prepare_species(test::water()), options());
  // Water is nonlinear with 3 vibrations: classical Cv/R = 3/2 + 3/2 + 3, Cp = Cv + R
  // (equipartition, common practice).
  CHECK(r.classical_Cp_J_per_mol_K == doctest::Approx(7.0 * constants::gas_constant_J_per_mol_K));
  for (const bool log : {true, false})
    for (const ThermoQuantity q : {ThermoQuantity::Cp, ThermoQuantity::S, ThermoQuantity::H_minus_H298}) {
      const auto svg = thermo_svg(r, q, log);
      CHECK(svg.find("class=\"engine\"") != std::string::npos);
      CHECK(svg.find("class=\"fitted\"") != std::string::npos);
      CHECK(svg.find("class=\"residual\"") != std::string::npos);
      CHECK(svg.find("warning threshold ±") != std::string::npos);
      CHECK(svg.find(log ? "(logarithmic scale)" : "temperature T / K<") != std::string::npos);
      const auto boxes = test::text_boxes(svg);
      CHECK(test::overlaps(boxes).empty());
      for (const auto& b : boxes) {
        CHECK(b.font >= 12.0);
        CHECK(b.x1 <= svg::figure_width);
        CHECK(b.y1 <= test::svg_height(svg));
      }
    }
  CHECK(thermo_svg(r, ThermoQuantity::Cp, true).find("±0.5 %") != std::string::npos);
  CHECK(thermo_svg(r, ThermoQuantity::S, true).find("±0.1 J/(mol K)") != std::string::npos);
  CHECK(thermo_svg(r, ThermoQuantity::H_minus_H298, true).find("±0.1 kJ/mol") != std::string::npos);
  // Every picture spans the fit range widened to the requested temperatures: 200 to 3000 K,
  // and the modes analysis uses the same samples, so the heat map lines up with the curves.
  CHECK(r.curve.front().T_K == doctest::Approx(200.0));
  CHECK(r.curve.back().T_K == doctest::Approx(3000.0));
  CHECK(r.modes.points.front().T_K == r.curve.front().T_K);
  CHECK(r.modes.points.back().T_K == r.curve.back().T_K);
}

TEST_CASE("index: warnings first, then the worst fit; rows link to their sections") {
  ReportOptions o = options();
  std::vector<ReportSpecies> species{gather_report_species(prepare_species(test::water()), o),
                                     gather_report_species(prepare_species(test::oxygen()), o)};
  species[0].worst_Cp_error = 0.001;
  species[1].worst_Cp_error = 0.004;
  CHECK(index_order(species) == std::vector<size_t>{1, 0});
  species[0].warning_count = 1;
  CHECK(index_order(species) == std::vector<size_t>{0, 1});
  const auto html = write_report_html(species, header());
  CHECK(html.find("<table id=\"index\"") != std::string::npos);
  CHECK(html.find("<tr class=\"has-warnings\"><td><a href=\"#species-1\">") != std::string::npos);
  CHECK(html.find("href=\"#species-2\"") != std::string::npos);
}
