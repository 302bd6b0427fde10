#include "vibtherm/write_modes.hpp"

#include <doctest/doctest.h>

#include <nlohmann/json.hpp>
#include <sstream>

#include "test_species.hpp"

using namespace vibtherm;

namespace {

std::vector<ModesReport> water_and_argon(const std::vector<double>& temps) {
  return {analyse_modes(prepare_species(test::water()), temps),
          analyse_modes(prepare_species(test::argon()), temps)};
}

size_t count_of(const std::string& text, const std::string& what) {
  size_t n = 0;
  for (size_t at = text.find(what); at != std::string::npos; at = text.find(what, at + what.size())) ++n;
  return n;
}

}  // namespace

TEST_CASE("JSON carries the pinned keys and the report's numbers") {
  const std::vector<double> temps{100.0, 298.15, 3000.0};
  const auto reports = water_and_argon(temps);
  const auto json = nlohmann::json::parse(modes_to_json(reports));
  REQUIRE(json["species"].size() == 2);
  const auto& water = json["species"][0];
  CHECK(water["name"] == "H2O");
  REQUIRE(water["temperatures"].size() == 3);
  for (size_t j = 0; j < temps.size(); ++j) {
    const auto& t = water["temperatures"][j];
    CHECK(t["T"].get<double>() == temps[j]);
    for (const char* key : {"translation", "rotation", "vibration", "total"}) CHECK(t["dof"].contains(key));
    // Written with round-trip precision: the numbers are the report's, bit for bit.
    CHECK(t["dof"]["total"].get<double>() == reports[0].points[j].dof.total);
    REQUIRE(t["modes"].size() == 3);
    for (size_t i = 0; i < 3; ++i) {
      const auto& m = t["modes"][i];
      CHECK(m["wavenumber"].get<double>() == reports[0].modes[i].wavenumber_cm1);
      CHECK(m["Cv_over_R"].get<double>() == reports[0].points[j].modes[i].Cv_over_R);
      CHECK(m["state"] == mode_state_name(reports[0].points[j].modes[i].state));
    }
  }
  CHECK(water["temperatures"][0]["modes"][0]["state"] == "frozen");
  CHECK(water["temperatures"][2]["modes"][0]["state"] == "active");  // 1595 cm^-1 at 3000 K
  CHECK(water["vibrations"][0]["input_position"] == 2);
  CHECK(water["classical_dof"]["total"].get<double>() == 12.0);
  CHECK(water["vibrations"][1]["T_half"].get<double>() == reports[0].modes[1].half_active_at_K);
  CHECK(json["species"][1]["temperatures"][0]["modes"].empty());
  CHECK(json["species"][1]["rotor"] == "atom");
}

TEST_CASE("CSV: one row per motion, total, electronic and mode") {
  const auto csv = modes_to_csv(water_and_argon({298.15, 1000.0}));
  std::istringstream lines(csv);
  std::string line;
  std::getline(lines, line);
  CHECK(line == "species,T_K,item,mode,wavenumber_cm1,theta_K,Cv_over_R,dof,classical_dof,state");
  int rows = 0;
  while (std::getline(lines, line)) {
    ++rows;
    CHECK(count_of(line, ",") == 9);
  }
  // Water: 2 temperatures × (5 motion rows + 3 modes); argon: 2 × 5.
  CHECK(rows == 2 * 8 + 2 * 5);
  CHECK(count_of(csv, "H2O,298.15,total,,,,") == 1);
  CHECK(count_of(csv, "Ar,1000,total,,,,1.5,3,3,") == 1);

  auto odd = analyse_modes(prepare_species(test::argon()), {300.0});
  odd.name = "Ar, \"cold\"";
  CHECK(modes_to_csv({odd}).find("\"Ar, \"\"cold\"\"\",300,total") != std::string::npos);
}

TEST_CASE("text: a grid of modes and one summary line per temperature") {
  const auto text = modes_to_text(water_and_argon({50.0, 298.15, 3000.0}));
  CHECK(text.find("H2O: gas, nonlinear molecule, 3 vibrations") != std::string::npos);
  CHECK(text.find("classical limit F = 12 (translation 3 + rotation 3 + vibration 6)") != std::string::npos);
  CHECK(text.find("298.15 K") != std::string::npos);
  // F(298.15 K) of water is 6.05 (modes_test.cpp); argon 3 at every T.
  CHECK(text.find(
            "at 298.15 K: F =  6.05 of 12 classical (translation 3.00, rotation 3.00, vibration 0.05 of 6); "
            "modes 3 frozen, 0 partial, 0 active") != std::string::npos);
  CHECK(count_of(text, "at 3000 K:   F =  3.00 of 3 classical (translation 3.00)\n") == 1);
  // 3 mode rows for water: the 1595 cm^-1 bend is frozen at 50 K and active at 3000 K.
  CHECK(text.find(".   0%") != std::string::npos);
  CHECK(count_of(text, "\n     1    #2    1595.0") == 1);
  const auto bend = text.substr(text.find("\n     1    #2    1595.0"));
  CHECK(bend.substr(0, bend.find('\n', 1)).find('#') != std::string::npos);
  CHECK(text.find("Ar: gas, atom, 0 vibrations") != std::string::npos);
}
