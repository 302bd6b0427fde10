// Physical constants in SI units, one place for the whole library.
// Source: CODATA 2018 recommended values (Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021));
// h, c, k_B, N_A and e are exact by the 2019 SI definition.
#pragma once

namespace vibtherm::constants {

inline constexpr double planck_J_s = 6.62607015e-34;            // exact (SI 2019)
inline constexpr double speed_of_light_m_s = 299792458.0;       // exact
inline constexpr double boltzmann_J_per_K = 1.380649e-23;       // exact (SI 2019)
inline constexpr double avogadro_per_mol = 6.02214076e23;       // exact (SI 2019)
inline constexpr double elementary_charge_C = 1.602176634e-19;  // exact (SI 2019)
inline constexpr double gas_constant_J_per_mol_K = avogadro_per_mol * boltzmann_J_per_K;
inline constexpr double atomic_mass_constant_kg = 1.66053906660e-27;  // CODATA 2018
inline constexpr double hartree_J = 4.3597447222071e-18;              // CODATA 2018
inline constexpr double bohr_radius_m = 5.29177210903e-11;            // CODATA 2018
inline constexpr double pi = 3.14159265358979323846;

inline constexpr double calorie_J = 4.184;  // thermochemical calorie (exact)
inline constexpr double angstrom_m = 1e-10;
inline constexpr double atmosphere_Pa = 101325.0;  // exact by definition
inline constexpr double bar_Pa = 1e5;
inline constexpr double reference_temperature_K = 298.15;

// hc/k in cm·K: converts a wavenumber in cm^-1 to a characteristic temperature in K.
inline constexpr double second_radiation_cm_K = planck_J_s * speed_of_light_m_s * 100.0 / boltzmann_J_per_K;
// hc·N_A in J/mol per cm^-1: molar energy of one wavenumber.
inline constexpr double wavenumber_J_per_mol = planck_J_s * speed_of_light_m_s * 100.0 * avogadro_per_mol;

}  // namespace vibtherm::constants
