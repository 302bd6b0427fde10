#include "vibtherm/write_fit_json.hpp"

#include <doctest/doctest.h>

#include <nlohmann/json.hpp>

#include "test_species.hpp"

using namespace vibtherm;

TEST_CASE("JSON form carries coefficients, errors and provenance") {
  FitOptions opt;
  opt.form = NasaForm::nasa9;
  opt.range = default_fit_range(NasaForm::nasa9);
  FitRecord rec{fit_species(prepare_species(test::water()), opt),
                {"water.yaml", "abc123", {{"frequency_scale", "1"}}}};
  const auto j = nlohmann::json::parse(write_fit_json({rec}, opt));
  CHECK(j["tool"]["version"] == VIBTHERM_VERSION);
  CHECK(j["fit_options"]["form"] == "nasa9");
  const auto& s = j["species"][0];
  CHECK(s["name"] == "H2O");
  CHECK(s["composition"]["H"] == 2.0);
  CHECK(s["composition"]["O"] == 1.0);
  CHECK(s["phase"] == "gas");
  // Standard atomic weights H 1.008, O 15.999 (IUPAC/CIAAW conventional values, common practice).
  CHECK(s["molar_mass_g_per_mol"].get<double>() == doctest::Approx(2 * 1.008 + 15.999));
  CHECK(s["enthalpy_of_formation_J_per_mol"] == -241.826e3);
  CHECK(s["breakpoints_K"] == nlohmann::json::array({200.0, 1000.0, 6000.0}));
  REQUIRE(s["ranges"].size() == 2);
  CHECK(s["ranges"][0]["coefficients"].size() == 7);
  CHECK(s["ranges"][1]["coefficients"][2].get<double>() ==
        std::get<Nasa9>(rec.fit.polynomial).ranges[1].a[2]);
  CHECK(s["ranges"][0]["errors"]["max_Cp_relative"].get<double>() < 0.005);
  CHECK(s["provenance"]["input_sha256"] == "abc123");
  CHECK(s["provenance"]["model_options"]["frequency_scale"] == "1");
  CHECK(s["bounds"]["upper_Cp_over_R"] == 7.0);  // 3N − 2 for nonlinear H2O (common practice)
  CHECK(s["bounds"]["lower_Cp_over_R"] == 4.0);
}
