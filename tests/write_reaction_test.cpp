// Reaction writers: the pinned JSON keys, CSV columns and the text layout's content.
#include "vibtherm/write_reaction.hpp"

#include <doctest/doctest.h>

#include <nlohmann/json.hpp>

using namespace vibtherm;

namespace {

ReactionReport sample() {
  // Arbitrary numbers: the writers only format them.
  ReactionReport r;
  r.standard_state = "p° = 1 bar";
  ReactionResult x;
  x.table.name = "r1";
  x.table.equation = "A = 2 B";
  x.table.delta_n = 1.0;
  x.table.Kp_reference_Pa = 1e5;
  x.table.rows.push_back({300.0, 1500.0, 2.5, 750.0, 0.74, 0.03, -0.3, -3.5});
  x.fit_Kp = LnKFit{2.0, 1.5, 3000.0, 1e-6};
  x.unknown = UnknownResult{"A", "a.yaml", {1500.0, -2000.0}};
  r.reactions.push_back(x);
  r.unknowns.push_back({"A", "dir/a.yaml", {"r1"}, {-2000.0}, {-2000.0, 0.0, -2000.0, -2000.0}});
  return r;
}

}  // namespace

TEST_CASE("reaction JSON has the pinned keys in kJ/mol and J/(mol K)") {
  const auto doc = nlohmann::json::parse(write_reaction_json(sample()));
  const auto& row = doc["reactions"][0]["rows"][0];
  CHECK(doc["reactions"][0]["name"] == "r1");
  CHECK(row["T"] == 300.0);
  CHECK(row["delta_H"] == 1.5);
  CHECK(row["delta_S"] == 2.5);
  CHECK(row["delta_G"] == 0.75);
  CHECK(row["Kp"] == 0.74);
  CHECK(row["Kc"] == 0.03);
  CHECK(doc["units"]["standard_state"] == "p° = 1 bar");
  CHECK(doc["reactions"][0]["ln_K_fit"]["Kp"]["E"] == 3.0);
  CHECK(doc["reactions"][0]["unknown"]["enthalpy_of_formation"] == -2.0);
  CHECK(doc["enthalpies_of_formation"][0]["mean"] == -2.0);
}

TEST_CASE("reaction CSV and text") {
  const std::string csv = write_reaction_csv(sample());
  CHECK(csv.rfind("reaction,T_K,delta_H_kJ_per_mol,delta_S_J_per_mol_K,delta_G_kJ_per_mol,Kp,Kc\n", 0) == 0);
  CHECK(csv.find("r1,300.00,1.500000,2.500000,0.750000,") != std::string::npos);
  const std::string text = write_reaction_text(sample());
  CHECK(text.find("A = 2 B") != std::string::npos);
  CHECK(text.find("standard state p° = 1 bar") != std::string::npos);
  CHECK(text.find("mean -2.000 kJ/mol") != std::string::npos);
}
