#include "vibtherm/composition.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <tuple>

#include "vibtherm/elements.hpp"

namespace vibtherm {

std::string FormulaPart::text() const {
  if (mass_number == 0) return element;
  if (element == "H" && mass_number == 2) return "D";
  if (element == "H" && mass_number == 3) return "T";
  // Brackets keep the mass number apart from the count: [C13]H4 is one carbon-13.
  return fmt::format("[{}{}]", element, mass_number);
}

std::vector<FormulaPart> formula_parts(const Species& species) {
  std::vector<FormulaPart> parts;
  auto add = [&](const std::string& element, int mass_number, int count) {
    for (FormulaPart& p : parts)
      if (p.element == element && p.mass_number == mass_number) {
        p.count += count;
        return;
      }
    parts.push_back({element, mass_number, count});
  };
  if (!species.atoms.empty()) {
    for (const Atom& a : species.atoms) add(a.symbol, a.isotope.empty() ? 0 : a.mass_number, 1);
  } else {
    for (const auto& [symbol, n] : species.formula) add(symbol, 0, n);
  }
  const bool has_carbon =
      std::any_of(parts.begin(), parts.end(), [](const FormulaPart& p) { return p.element == "C"; });
  // Hill rank: with carbon, C (0) and H (1) lead; everything else (2) is alphabetical.
  auto rank = [&](const FormulaPart& p) {
    if (!has_carbon) return 2;
    return p.element == "C" ? 0 : p.element == "H" ? 1 : 2;
  };
  std::sort(parts.begin(), parts.end(), [&](const FormulaPart& x, const FormulaPart& y) {
    return std::make_tuple(rank(x), x.element, x.mass_number) <
           std::make_tuple(rank(y), y.element, y.mass_number);
  });
  return parts;
}

std::string species_formula(const Species& species) {
  std::string out;
  for (const FormulaPart& p : formula_parts(species)) {
    out += p.text();
    if (p.count != 1) out += std::to_string(p.count);
  }
  return out;
}

std::vector<ElementAmount> species_composition(const Species& species) {
  std::vector<ElementAmount> out;
  auto add = [&](const std::string& symbol, double count) {
    for (ElementAmount& e : out)
      if (e.symbol == symbol) {
        e.count += count;
        return;
      }
    out.push_back({symbol, count});
  };
  for (const FormulaPart& p : formula_parts(species)) {
    const bool hydrogen_label = p.element == "H" && (p.mass_number == 2 || p.mass_number == 3);
    add(hydrogen_label ? p.text() : p.element, p.count);
  }
  if (!species.surface_site.empty()) add(species.surface_site, 1.0);
  return out;
}

double species_molar_mass_g_per_mol(const Species& species) {
  auto weight = [&](const std::string& symbol) {
    const auto info = find_element(symbol);
    if (!info)
      fail(species.origin, fmt::format("unknown element '{}' in species '{}'", symbol, species.name));
    return info->standard_atomic_weight;
  };
  double total = 0.0;
  if (!species.atoms.empty()) {
    for (const Atom& a : species.atoms) total += a.isotope.empty() ? weight(a.symbol) : a.mass_amu;
  } else {
    for (const auto& [symbol, n] : species.formula) total += n * weight(symbol);
  }
  return total;  // amu per molecule = g/mol
}

bool has_isotope_labels(const Species& species) {
  return std::any_of(species.atoms.begin(), species.atoms.end(),
                     [](const Atom& a) { return !a.isotope.empty(); });
}

}  // namespace vibtherm
