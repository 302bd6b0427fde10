// Atomic enthalpies of formation and element enthalpy increments. Every number below is
// from the NIST-JANAF Thermochemical Tables, 4th ed. (M. W. Chase, J. Phys. Chem. Ref.
// Data Monograph 9, 1998), recalled rather than read from the tables (`from memory`); each
// row satisfies ΔfH°(298.15, atom) = ΔfH°(0, atom) + [H298 − H0](atom) − [H298 − H0](element)
// to 0.02 kJ/mol, which the unit test checks. The Active Thermochemical Tables (Ruscic et
// al.) differ from JANAF by up to 0.3 kJ/mol for C and 1–4 kJ/mol for Si, P and S.
#include "vibtherm/formation_data.hpp"

#include <array>

namespace vibtherm {
namespace {

constexpr const char* janaf = "NIST-JANAF 4th ed. (Chase 1998), from memory";

// symbol, ΔfH°(0 K), ΔfH°(298.15 K), [H298 − H0] atom, [H298 − H0] element per atom (kJ/mol)
constexpr std::array<AtomFormationData, 10> table{{
    {"H", 216.035, 217.999, 6.197, 4.234, "H2(g)", janaf},
    {"C", 711.185, 716.670, 6.536, 1.051, "C(graphite)", janaf},
    {"N", 470.820, 472.680, 6.197, 4.335, "N2(g)", janaf},
    {"O", 246.790, 249.173, 6.725, 4.341, "O2(g)", janaf},
    {"F", 77.284, 79.390, 6.518, 4.412, "F2(g)", janaf},
    {"Si", 445.668, 450.000, 7.550, 3.217, "Si(cr)", janaf},
    {"P", 315.663, 316.500, 6.197, 5.360, "P(cr, white)", janaf},
    {"S", 274.924, 277.170, 6.657, 4.412, "S(cr, rhombic)", janaf},
    {"Cl", 119.621, 121.302, 6.272, 4.591, "Cl2(g)", janaf},
    {"Br", 117.926, 111.870, 6.197, 12.253, "Br2(l at 298.15 K)", janaf},
}};

}  // namespace

std::span<const AtomFormationData> atom_formation_table() { return table; }

std::optional<AtomFormationData> find_atom_formation_data(std::string_view symbol) {
  for (const auto& row : table)
    if (row.symbol == symbol) return row;
  return std::nullopt;
}

}  // namespace vibtherm
