// The documented ranges of every number vibtherm accepts (README "Limits"): a value
// outside them is refused with a located one-line error instead of reaching the engine,
// where it would overflow, underflow or exhaust memory.
#pragma once

#include <string>
#include <string_view>

#include "vibtherm/error.hpp"
#include "vibtherm/species.hpp"

namespace vibtherm::limits {

inline constexpr double min_temperature_K = 1.0;    // below it the classical rotor and the
inline constexpr double max_temperature_K = 1e5;    // rigid models are meaningless anyway
inline constexpr double min_wavenumber_cm1 = 1e-2;  // |ν̃|, after scaling
inline constexpr double max_wavenumber_cm1 = 1e5;
inline constexpr double min_frequency_scale = 0.1;
inline constexpr double max_frequency_scale = 10.0;
inline constexpr double min_pressure_Pa = 1e-6;
inline constexpr double max_pressure_Pa = 1e9;
inline constexpr double max_electronic_energy_cm1 = 1e6;  // about 124 eV
inline constexpr int max_degeneracy = 1000000;
inline constexpr double min_mass_amu = 0.5;  // a species' or an atom's mass
inline constexpr double max_mass_amu = 1e6;
inline constexpr double max_coordinate_angstrom = 1e4;
inline constexpr double min_moment_amu_A2 = 1e-6;
inline constexpr double max_moment_amu_A2 = 1e12;
inline constexpr double max_enthalpy_of_formation_J_per_mol = 1e8;  // |ΔfH°| ≤ 100,000 kJ/mol
inline constexpr double max_rotor_energy_J_per_mol = 1e6;           // barrier and scan, 1000 kJ/mol
inline constexpr double max_conformer_energy_J_per_mol = 1e6;       // |relative energy|, 1000 kJ/mol
// |free-atom energy| in a method file: the heaviest atoms lie near −3e4 hartree.
inline constexpr double max_atomic_energy_hartree = 1e5;
inline constexpr double max_atomic_energy_J_per_mol =
    max_atomic_energy_hartree * 2625499.6394799;  // CODATA 2018 Eh N_A
// |molecular electronic energy|: a thousand of the heaviest atoms stay below 3e7 hartree.
inline constexpr double max_molecular_energy_hartree = 1e8;
inline constexpr int max_symmetry_number = 1000;
// A hindered rotor's internal symmetry number, the period of its torsional potential: real
// torsions have 1 to 6 (a methyl top 3, a C6 ring about its axis 6); 12 leaves room for a
// symmetric top on a symmetric frame (3 × 4) while keeping every block of the level basis
// (hindered_rotor.hpp) well filled. Above it the basis and the potential's series grow
// with σ without bound.
inline constexpr int max_rotor_symmetry = 12;
inline constexpr double min_grid_step_K = 0.1;
inline constexpr std::size_t max_grid_points = 200000;

// Refuses a species whose numbers leave the ranges above (location: the species file).
void check_species(const Species& species);

// `value` must be finite and within [low, high]; else InputError at `where` saying
// "<what> is <value>, expected <low> to <high> <unit>".
void check_range(double value, double low, double high, std::string_view what, std::string_view unit,
                 const SourceLocation& where = {});

// A temperature of a table, a fit grid or a breakpoint.
void check_temperature(double T_K, std::string_view what, const SourceLocation& where = {});

// `name` for a message: at most 60 characters, then "..." and the count.
std::string display_name(std::string_view name);

}  // namespace vibtherm::limits
