// The atomization route to enthalpies of formation.
#include "vibtherm/formation.hpp"

#include <fmt/format.h>

#include "vibtherm/bonds.hpp"
#include "vibtherm/formation_data.hpp"
#include "vibtherm/limits.hpp"

namespace vibtherm {

FormationEnthalpy formation_from_atomization_energy(const std::map<std::string, int>& formula,
                                                    double D0_J_per_mol, double H298_minus_H0_J_per_mol,
                                                    const SourceLocation& where) {
  FormationEnthalpy out;
  out.D0_J_per_mol = D0_J_per_mol;
  double atoms0 = 0.0, elements = 0.0;
  for (const auto& [symbol, count] : formula) {
    const auto data = find_atom_formation_data(symbol);
    if (!data)
      fail(where,
           fmt::format("no atomic enthalpy of formation for {} in this version (known: H C N O F Si P S Cl "
                       "Br), expected 'enthalpy_of_formation' given instead",
                       symbol));
    atoms0 += count * data->dfH0_atom_kJ_per_mol * 1e3;
    elements += count * data->H298_minus_H0_element_kJ_per_mol * 1e3;
  }
  out.dfH0_J_per_mol = atoms0 - D0_J_per_mol;
  out.dfH298_J_per_mol = out.dfH0_J_per_mol + H298_minus_H0_J_per_mol - elements;
  return out;
}

FormationEnthalpy atomization_formation_enthalpy(const PreparedSpecies& prepared, const Method& method) {
  const Species& s = prepared.species;
  if (!s.electronic_energy_J_per_mol)
    fail(s.origin,
         fmt::format("species '{}' has no 'electronic_energy', expected one (hartree) to compute its "
                     "enthalpy of formation with method '{}'",
                     s.name, method.label));
  if (const int charge = s.charge; charge != 0)
    fail(s.origin,
         fmt::format("species '{}' has charge {:+d}: the atomization route here is for neutral species, "
                     "expected 'enthalpy_of_formation' or a reaction (--formation-reactions) for an ion",
                     s.name, charge));
  double atoms = 0.0;
  for (const auto& [symbol, count] : s.formula) {
    const auto it = method.elements.find(symbol);
    if (it == method.elements.end())
      fail(method.origin,
           fmt::format("method '{}' has no energy for element {} (needed by species '{}'), expected "
                       "an entry {}: {{energy: ...}} under 'elements'",
                       method.label, symbol, s.name, symbol));
    atoms += count * (it->second.energy_J_per_mol + it->second.spin_orbit_J_per_mol);
  }
  const double D0 = atoms - *s.electronic_energy_J_per_mol - prepared.zero_point_energy_J_per_mol;
  FormationEnthalpy out = formation_from_atomization_energy(s.formula, D0, prepared.H298_minus_H0_J_per_mol,
                                                            key_location(s, "method"));
  if (!method.bond_corrections_J_per_mol.empty() && !s.atoms.empty()) {
    for (const auto& [type, count] : count_bond_types(s, species_bonds(s))) {
      const auto it = method.bond_corrections_J_per_mol.find(type);
      if (it == method.bond_corrections_J_per_mol.end()) {
        out.notes.push_back(
            fmt::format("method '{}' has no bond correction for {} ({} bonds)", method.label, type, count));
        continue;
      }
      out.bond_correction_J_per_mol += count * it->second;
    }
    out.dfH0_J_per_mol += out.bond_correction_J_per_mol;
    out.dfH298_J_per_mol += out.bond_correction_J_per_mol;
  }
  out.route = fmt::format("atomization with method '{}'", method.label);
  // Every energy is finite, their sum need not be (an element energy of 1e308 hartree gave
  // ΔfH° = -inf): a computed ΔfH° keeps the bound of a given one.
  limits::check_range(out.dfH298_J_per_mol / 1e3, -limits::max_enthalpy_of_formation_J_per_mol / 1e3,
                      limits::max_enthalpy_of_formation_J_per_mol / 1e3,
                      fmt::format("species '{}': enthalpy of formation computed with method '{}'",
                                  limits::display_name(s.name), limits::display_name(method.label)),
                      "kJ/mol", s.origin);
  return out;
}

PreparedSpecies prepare_with_method(const Species& species, const ModelOptions& options,
                                    const Method* method) {
  if (!method) return prepare_species(species, options);
  Species s = species;
  s.scale = merge_scale_factors(species.scale, method->scale);
  PreparedSpecies p = prepare_species(s, options);
  if (!p.species.electronic_energy_J_per_mol) return p;
  const FormationEnthalpy f = atomization_formation_enthalpy(p, *method);
  for (const auto& n : f.notes) p.notes.push_back(n);
  const std::string detail =
      fmt::format("{:.2f} kJ/mol ({}; D0 {:.2f} kJ/mol, ΔfH°(0 K) {:.2f} kJ/mol{})", f.dfH298_J_per_mol / 1e3,
                  f.route, f.D0_J_per_mol / 1e3, f.dfH0_J_per_mol / 1e3,
                  f.bond_correction_J_per_mol != 0.0
                      ? fmt::format(", bond corrections {:.2f} kJ/mol", f.bond_correction_J_per_mol / 1e3)
                      : std::string());
  if (p.species.enthalpy_of_formation_J_per_mol) {
    p.notes.push_back(fmt::format("enthalpy of formation {:.2f} kJ/mol as given; computed {}",
                                  *p.species.enthalpy_of_formation_J_per_mol / 1e3, detail));
    return p;
  }
  p.species.enthalpy_of_formation_J_per_mol = f.dfH298_J_per_mol;
  p.enthalpy_of_formation_route = f.route;
  p.notes.push_back("enthalpy of formation " + detail);
  return p;
}

void apply_reaction_formation(PreparedSpecies& p, double dfH298_J_per_mol, const std::string& route) {
  limits::check_range(
      dfH298_J_per_mol / 1e3, -limits::max_enthalpy_of_formation_J_per_mol / 1e3,
      limits::max_enthalpy_of_formation_J_per_mol / 1e3,
      fmt::format("species '{}': enthalpy of formation from {}", limits::display_name(p.species.name), route),
      "kJ/mol", p.species.origin);
  auto& h = p.species.enthalpy_of_formation_J_per_mol;
  if (h && p.enthalpy_of_formation_route.empty()) {
    p.notes.push_back(fmt::format("enthalpy of formation {:.2f} kJ/mol as given; {} gives {:.2f} kJ/mol",
                                  *h / 1e3, route, dfH298_J_per_mol / 1e3));
    return;
  }
  if (h)
    p.notes.push_back(
        fmt::format("enthalpy of formation from {} ({:.2f} kJ/mol) replaces the {} value {:.2f} kJ/mol",
                    route, dfH298_J_per_mol / 1e3, p.enthalpy_of_formation_route, *h / 1e3));
  else
    p.notes.push_back(
        fmt::format("enthalpy of formation {:.2f} kJ/mol from {}", dfH298_J_per_mol / 1e3, route));
  h = dfH298_J_per_mol;
  p.enthalpy_of_formation_route = route;
}

}  // namespace vibtherm
