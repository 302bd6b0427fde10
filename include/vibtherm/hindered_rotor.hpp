// One-dimensional hindered internal rotors (torsions): reduced moment of inertia about a
// bond, the quantum levels of the periodic torsional potential, and their thermal terms.
#pragma once

#include <limits>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "vibtherm/partition.hpp"
#include "vibtherm/species.hpp"
#include "vibtherm/torsion_potential.hpp"

namespace vibtherm {

// A `replaces` wavenumber matches a given frequency when they differ by at most this much:
// both are normally copied from one frequency job, so only print rounding separates them.
inline constexpr double replaces_tolerance_cm1 = 1.0;

// The atoms (0-based) on the side of `atom_a` when the bond a–b is cut; bonded means
// closer than 1.25 × the sum of covalent radii. Throws InputError when a and b stay
// connected (a ring) or an element has no tabulated radius.
std::vector<int> top_by_connectivity(const std::vector<Atom>& atoms, int atom_a, int atom_b,
                                     const SourceLocation& where);

// Reduced moment of the internal rotation about the a–b axis, the two tops' moments about
// the bond axis combined as I_A I_B / (I_A + I_B) (East & Radom, J. Chem. Phys. 106, 6655
// (1997), their uncoupled type; from memory). `top_a` lists the atoms (0-based) of the side
// of atom a; the other atoms form the second top.
double reduced_moment_amu_A2(const std::vector<Atom>& atoms, int atom_a, int atom_b,
                             const std::vector<int>& top_a);

// The reduced moment coupled to the overall motion (Pitzer, J. Chem. Phys. 14, 239 (1946);
// East & Radom's coupled type; both from memory): the top turns about the bond axis while
// the molecule's total linear and angular momenta stay zero, I_red = A − |Σ m u|²/M −
// Lᵀ I⁻¹ L with u = e × (r − r_a) over the top's atoms, A = Σ m |u|², L = Σ m r × u (r from
// the centre of mass), I the molecule's inertia tensor. Symmetric in the two tops; equal to
// I_A I_B/(I_A + I_B) when both tops are symmetric about the axis and the axis is a
// principal one (ethane), below it for an off-axis top (methanol's OH: 6.5 %).
double coupled_reduced_moment_amu_A2(const std::vector<Atom>& atoms, int atom_a, int atom_b,
                                     const std::vector<int>& top_a);

// Eigenvalues of H = −B d²/dφ² + V(φ), B = ħ²/(2 I_red), in the free-rotor basis e^{imφ},
// |m| ≤ M, sorted, in J/mol (absolute, on the scale of V).
struct TorsionLevels {
  std::vector<double> energies_J_per_mol;    // above the ground level
  double zero_point_energy_J_per_mol = 0.0;  // ground level − V_min
  int basis_max_m = 0;
  // The level sum is converged up to this temperature (hindered_rotor_terms refuses a
  // higher one); an explicit basis (torsion_levels_in_basis) is the caller's choice: ∞.
  double max_temperature_K = std::numeric_limits<double>::infinity();
};

// The basis rule: the highest level kept must weigh less than this relative to the level
// sum at the highest temperature asked (its levels are then far below the truncation).
inline constexpr double rotor_top_level_weight = 1e-12;
// The largest basis |m| ≤ M tried: about 3 s for one cosine term, σ = 3 (the tridiagonal
// QR is O(n²): 14 s at 20000) on a 2-core machine; σ = 1 at T_max = 3000 K reaches it near
// I = 2e4 amu Å². Several cosine or sine terms
// (a scan) use a dense solver; with those, a block above max_rotor_dense_block functions is refused.
inline constexpr int max_rotor_basis_m = 10000;
inline constexpr int max_rotor_dense_block = 3000;

// Levels converged at `max_temperature_K`: M starts where B M² reaches the potential's
// range plus 40 RT_max (at least 20) and grows by half until the highest level kept weighs
// less than rotor_top_level_weight at T_max. Reaching max_rotor_basis_m (or, for a scan,
// max_rotor_dense_block), or a first estimate above twice it, throws InputError at `where`,
// naming `rotor`, the reduced moment and T_max. Cost: the Hamiltonian splits into blocks of m modulo the
// potential's period g, banded within a block; one cosine term gives real tridiagonal blocks (QR on the
// tridiagonal, O(n²)), several cosine terms real dense blocks, sine terms complex ones;
// without sine terms block g − r repeats block r (m → −m) and is not diagonalised again,
// and the blocks that map onto themselves (r = 0, r = g/2) split into even and odd halves.
// A solver that does not converge is an error, never a silent level list.
TorsionLevels torsion_levels(double reduced_moment_amu_A2, const TorsionPotential& potential,
                             double max_temperature_K, const SourceLocation& where = {},
                             std::string_view rotor = "hindered rotor");
// The same in a given basis |m| ≤ basis_max_m, without the convergence check.
TorsionLevels torsion_levels_in_basis(double reduced_moment_amu_A2, const TorsionPotential& potential,
                                      int basis_max_m);

// Thermal terms from the level sum counted from the ground level, every level of the full
// 2π ring summed and then divided by the internal symmetry number: ln q − ln σ_int
// (Pitzer & Gwinn, J. Chem. Phys. 10, 428 (1942), from memory, for the role of σ_int).
MotionTerms hindered_rotor_terms(const TorsionLevels& levels, int symmetry, double T_K);

// A rotor of a species, ready for the engine.
struct HinderedRotorModel {
  HinderedRotor input;
  std::vector<int> top_atoms;            // 0-based, the side of bond atom 1
  double reduced_moment_amu_A2 = 0.0;    // of the definition `input.moment` names
  double bond_axis_moment_amu_A2 = 0.0;  // I_A I_B / (I_A + I_B), shown beside a coupled one
  TorsionPotential potential;
  std::optional<ScanFit> scan_fit;  // a rotor given by a scan
  TorsionLevels levels;
};

// `max_temperature_K`: the highest temperature the rotor's terms will be evaluated at.
HinderedRotorModel build_hindered_rotor(const Species& species, const HinderedRotor& rotor,
                                        double max_temperature_K);

// The species' rotors built and their torsional modes taken out of `vibrations_cm1` (the
// scaled wavenumbers): each `replaces` is matched against the unscaled input wavenumbers
// (the file's value is copied from them) within replaces_tolerance_cm1; two rotors cannot
// replace one mode (InputError at the rotor).
struct TorsionReplacement {
  std::vector<HinderedRotorModel> rotors;
  std::vector<double> kept_cm1;  // the vibrations left, in their order
  std::vector<std::string> notes, warnings;
};
TorsionReplacement replace_torsional_modes(const Species& species, const std::vector<double>& vibrations_cm1,
                                           double frequency_scale, double max_temperature_K);

}  // namespace vibtherm
