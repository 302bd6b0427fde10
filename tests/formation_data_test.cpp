// The atomic data table: coverage and internal consistency.
#include "vibtherm/formation_data.hpp"

#include <doctest/doctest.h>

#include <cmath>

using namespace vibtherm;

TEST_CASE("atomic data cover H C N O F Si P S Cl Br, each with its source") {
  for (const char* s : {"H", "C", "N", "O", "F", "Si", "P", "S", "Cl", "Br"}) {
    const auto row = find_atom_formation_data(s);
    REQUIRE(row);
    CHECK(!row->source.empty());
  }
  CHECK(!find_atom_formation_data("Xx"));
}

TEST_CASE("each row obeys ΔfH°(298) = ΔfH°(0) + [H298−H0](atom) − [H298−H0](element)") {
  // Textbook identity (Kirchhoff's law through the reference state), to the 0.01 kJ/mol
  // of the tabulated digits.
  for (const auto& row : atom_formation_table())
    CHECK(std::abs(row.dfH0_atom_kJ_per_mol + row.H298_minus_H0_atom_kJ_per_mol -
                   row.H298_minus_H0_element_kJ_per_mol - row.dfH298_atom_kJ_per_mol) < 0.01);
}
