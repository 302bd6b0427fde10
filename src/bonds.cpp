// Bond perception from covalent radii, and bond-type counts for bond-additivity corrections.
#include "vibtherm/bonds.hpp"

#include <fmt/format.h>

#include <array>
#include <utility>

namespace vibtherm {
namespace {

// Covalent radii in Å, Cordero et al., "Covalent radii revisited", Dalton Trans. 2008,
// 2832-2838, Table 2 (carbon: the sp3 value); recalled, from memory.
constexpr std::array<std::pair<std::string_view, double>, 27> radii{{
    {"H", 0.31},  {"He", 0.28}, {"Li", 1.28}, {"Be", 0.96}, {"B", 0.84},  {"C", 0.76},  {"N", 0.71},
    {"O", 0.66},  {"F", 0.57},  {"Ne", 0.58}, {"Na", 1.66}, {"Mg", 1.41}, {"Al", 1.21}, {"Si", 1.11},
    {"P", 1.07},  {"S", 1.05},  {"Cl", 1.02}, {"Ar", 1.06}, {"K", 2.03},  {"Ca", 1.76}, {"Ga", 1.22},
    {"Ge", 1.20}, {"As", 1.19}, {"Se", 1.20}, {"Br", 1.20}, {"Kr", 1.16}, {"I", 1.39},
}};

}  // namespace

std::optional<double> covalent_radius_angstrom(std::string_view symbol) {
  for (const auto& [s, r] : radii)
    if (s == symbol) return r;
  return std::nullopt;
}

std::string bond_type(std::string_view a, std::string_view b) {
  if (b < a) std::swap(a, b);
  return fmt::format("{}-{}", a, b);
}

std::vector<std::array<int, 2>> species_bonds(const Species& species) {
  if (species.bonds) return *species.bonds;
  const auto& atoms = species.atoms;
  std::vector<double> r(atoms.size());
  for (std::size_t i = 0; i < atoms.size(); ++i) {
    const auto radius = covalent_radius_angstrom(atoms[i].symbol);
    if (!radius)
      fail(
          key_location(species, "atoms"),
          fmt::format("species '{}': no covalent radius for {} (atom {}) to perceive bonds, expected the key "
                      "'bonds' listing them",
                      species.name, atoms[i].symbol, i + 1));
    r[i] = *radius;
  }
  std::vector<std::array<int, 2>> bonds;
  for (std::size_t i = 0; i < atoms.size(); ++i)
    for (std::size_t j = i + 1; j < atoms.size(); ++j) {
      const double d = (atoms[i].position_angstrom - atoms[j].position_angstrom).norm();
      if (d <= bond_length_factor * (r[i] + r[j]))
        bonds.push_back({static_cast<int>(i), static_cast<int>(j)});
    }
  return bonds;
}

std::map<std::string, int> count_bond_types(const Species& species,
                                            const std::vector<std::array<int, 2>>& bonds) {
  std::map<std::string, int> counts;
  for (const auto& [a, b] : bonds)
    ++counts[bond_type(species.atoms[static_cast<std::size_t>(a)].symbol,
                       species.atoms[static_cast<std::size_t>(b)].symbol)];
  return counts;
}

}  // namespace vibtherm
