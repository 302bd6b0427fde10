#include "vibtherm/electrons.hpp"

#include <fmt/format.h>

#include "vibtherm/elements.hpp"

namespace vibtherm {

std::optional<int> electron_count(const Species& species) {
  long total = 0;
  if (!species.atoms.empty()) {
    for (const Atom& a : species.atoms) {
      const auto e = find_element(a.symbol);
      if (!e) return std::nullopt;
      total += e->atomic_number;
    }
  } else if (!species.formula.empty()) {
    for (const auto& [symbol, count] : species.formula) {
      const auto e = find_element(symbol);
      if (!e) return std::nullopt;
      total += static_cast<long>(e->atomic_number) * count;
    }
  } else {
    return std::nullopt;
  }
  return static_cast<int>(total - species.charge);
}

ElectronicChoice choose_electronic_levels(const Species& species) {
  ElectronicChoice out;
  out.levels = species.electronic_levels;
  const std::optional<int> electrons = electron_count(species);
  if (electrons && *electrons < 0)
    fail(key_location(species, "charge"),
         fmt::format("species '{}' has charge {} but only {} protons, expected a charge that leaves a "
                     "non-negative electron count",
                     species.name, species.charge, *electrons + species.charge));
  const bool given = !out.levels.empty();
  if (species.phase == Phase::adsorbate || !electrons) {
    if (!given) {
      out.levels = {{0.0, 1}};
      if (species.phase == Phase::gas)
        out.notes.push_back("ground-level degeneracy 1 assumed: no atoms or formula to count the electrons");
    }
    return out;
  }
  const int n = *electrons;
  const bool odd = n % 2 != 0;
  if (!given) {
    out.levels = {{0.0, odd ? 2 : 1}};
    out.notes.push_back(
        fmt::format("spin multiplicity {} ({}) from the electron count {} ({}, charge {}), the "
                    "lowest its parity allows",
                    odd ? 2 : 1, odd ? "doublet" : "singlet", n, odd ? "odd" : "even", species.charge));
    return out;
  }
  if (species.key_locations.count("spin_multiplicity") && out.levels.size() == 1) {
    const int m = out.levels[0].degeneracy;
    if ((m % 2 == 0) != odd)
      fail(key_location(species, "spin_multiplicity"),
           fmt::format("spin_multiplicity {} does not fit species '{}' with {} electrons ({}, charge {}), "
                       "expected {} (2S + 1 is {} for an {} electron count)",
                       m, species.name, n, odd ? "odd" : "even", species.charge,
                       odd ? "2, 4, ..." : "1, 3, ...", odd ? "even" : "odd", odd ? "odd" : "even"));
    if (m > n + 1)
      fail(key_location(species, "spin_multiplicity"),
           fmt::format("spin_multiplicity {} needs {} unpaired electrons, species '{}' has {} electrons, "
                       "expected at most {}",
                       m, m - 1, species.name, n, n + 1));
    return out;
  }
  if (odd)
    for (std::size_t i = 0; i < out.levels.size(); ++i)
      if (out.levels[i].degeneracy % 2 != 0)
        fail(key_location(species, "electronic_levels"),
             fmt::format(
                 "electronic level {} of species '{}' has degeneracy {}, but {} electrons (odd, charge "
                 "{}) make every level at least doubly degenerate (Kramers), expected an even degeneracy",
                 i + 1, species.name, out.levels[i].degeneracy, n, species.charge));
  return out;
}

}  // namespace vibtherm
