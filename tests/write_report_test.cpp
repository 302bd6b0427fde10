#include "vibtherm/write_report.hpp"

#include <doctest/doctest.h>

#include <string>

#include "test_species.hpp"

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

ReportHeader header() { return {"9.9.9", {"model <line> & more"}}; }

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
  // Two pictures per species: Cp(T) and the modes picture, both inline.
  CHECK(count_of(html, "<svg") == 4);
  CHECK(count_of(html, "</svg>") == 4);
  CHECK(count_of(html, "<pre class=\"nasa7\">") == 2);
  CHECK(html.find("<?xml") == std::string::npos);
  CHECK(html.find("<script") == std::string::npos);
  CHECK(html.find("http") == std::string::npos);
  // The modes pictures keep distinct gradient ids on one page.
  CHECK(html.find("id=\"s1-activation-ramp\"") != std::string::npos);
  CHECK(html.find("id=\"s2-activation-ramp\"") != std::string::npos);
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
  for (const auto& p : r.Cp_curve) CHECK_FALSE(p.fitted_Cp_J_per_mol_K.has_value());
  const auto html = write_report_html({r}, header());
  CHECK(html.find("Not fitted:") != std::string::npos);
  CHECK(html.find("<pre class=\"nasa7\">") == std::string::npos);
  CHECK(html.find("class=\"fitted\"") == std::string::npos);
}

TEST_CASE("Cp picture: engine and fitted curves, classical line, labelled axes on either scale") {
  const ReportSpecies r = gather_report_species(prepare_species(test::water()), options());
  // Water is nonlinear with 3 vibrations: classical Cv/R = 3/2 + 3/2 + 3, Cp = Cv + R
  // (equipartition, common practice).
  CHECK(r.classical_Cp_J_per_mol_K == doctest::Approx(7.0 * constants::gas_constant_J_per_mol_K));
  for (TemperatureAxis axis : {TemperatureAxis::log, TemperatureAxis::linear}) {
    const auto svg = Cp_curve_svg(r, axis);
    CHECK(svg.find("class=\"engine\"") != std::string::npos);
    CHECK(svg.find("class=\"fitted\"") != std::string::npos);
    CHECK(svg.find("class=\"classical\"") != std::string::npos);
    CHECK(svg.find("T / K") != std::string::npos);
    CHECK(svg.find("Cp / (J mol⁻¹ K⁻¹)") != std::string::npos);
    CHECK(svg.find(axis == TemperatureAxis::log ? "logarithmic" : "linear scale") != std::string::npos);
  }
  // The curve spans the fit range: 200 to 3000 K by default.
  CHECK(r.Cp_curve.front().T_K == doctest::Approx(200.0));
  CHECK(r.Cp_curve.back().T_K == doctest::Approx(3000.0));
}
