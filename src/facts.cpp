#include "vibtherm/facts.hpp"

#include <algorithm>

#include "vibtherm/composition.hpp"

namespace vibtherm {

SpeciesFacts describe_species(const PreparedSpecies& p) {
  SpeciesFacts f;
  f.name = p.species.name;
  f.formula = species_formula(p.species);
  f.mass_amu = p.rotor.mass_amu;
  f.molar_mass_g_per_mol = species_molar_mass_g_per_mol(p.species);
  f.isotope_labels = has_isotope_labels(p.species);
  f.rotor = p.rotor.type;
  f.moments_amu_A2 = p.rotor.moments_amu_A2;
  f.rotational_constants_cm1 = p.rotor.rotational_constants_cm1;
  f.rotational_constants_GHz = p.rotor.rotational_constants_GHz;
  f.rotational_temperatures_K = p.rotor.rotational_temperatures_K;
  f.symmetry_number = p.species.symmetry_number.value_or(1);
  if (p.point_group) f.point_group = p.point_group->label;
  f.chiral = p.point_group && p.point_group->chiral;
  f.racemic = p.racemic;
  f.atom_count = atom_count(p.species);
  f.expected_modes = expected_vibration_count(p.species, p.rotor.type);
  f.given_modes = static_cast<int>(p.species.frequencies_cm1.size());
  f.imaginary_modes = static_cast<int>(std::count_if(
      p.species.frequencies_cm1.begin(), p.species.frequencies_cm1.end(), [](double v) { return v < 0; }));
  f.frequencies_cm1 = p.used_frequencies_cm1;
  f.zero_point_energy_J_per_mol = p.zero_point_energy_J_per_mol;
  f.phase = p.is_gas ? "gas" : "adsorbate";
  int ground = 0;
  double lowest = p.species.electronic_levels.empty() ? 0.0 : p.species.electronic_levels[0].energy_cm1;
  for (const auto& level : p.species.electronic_levels) lowest = std::min(lowest, level.energy_cm1);
  for (const auto& level : p.species.electronic_levels)
    if (level.energy_cm1 == lowest) ground += level.degeneracy;
  f.ground_degeneracy = ground;
  f.warnings = p.warnings;
  f.notes = p.notes;
  f.computed_with = p.species.computed_with;
  f.enthalpy_of_formation_J_per_mol = p.species.enthalpy_of_formation_J_per_mol;
  if (f.enthalpy_of_formation_J_per_mol)
    f.enthalpy_of_formation_route =
        p.enthalpy_of_formation_route.empty() ? std::string("given") : p.enthalpy_of_formation_route;
  if (!p.conformers.empty()) {
    f.population_temperatures_K = {298.15, 500.0, 1000.0};
    for (const ConformerMember& m : p.conformers)
      f.conformers.push_back({m.file,
                              m.relative_energy_J_per_mol,
                              m.prepared.zero_point_energy_J_per_mol,
                              m.level_J_per_mol,
                              {}});
    for (double T : f.population_temperatures_K) {
      const std::vector<double> populations = conformer_populations(p, T);
      for (std::size_t i = 0; i < populations.size(); ++i)
        f.conformers[i].populations.push_back(populations[i]);
    }
  }
  if (p.tunnelling) {
    f.wigner_kappa_298 = wigner_kappa(p.tunnelling->imaginary_wavenumber_cm1, 298.15);
    if (p.tunnelling->eckart) f.eckart_kappa_298 = eckart_kappa(*p.tunnelling->eckart, 298.15);
  }
  return f;
}

}  // namespace vibtherm
