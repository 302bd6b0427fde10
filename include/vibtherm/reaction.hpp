// Reaction thermochemistry of species: element balance, ΔrH°, ΔrS°, ΔrG°, Kp and Kc versus
// T, a fit of ln K to A·Tⁿ·exp(−E/RT), and solving a reaction for one unknown ΔfH°.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "vibtherm/thermo.hpp"

namespace vibtherm {

struct ReactionTerm {
  std::string file;  // as written in the reaction file
  PreparedSpecies prepared;
  double coefficient = 0.0;  // negative: reactant
};

struct Reaction {
  std::string name;
  SourceLocation origin;
  std::vector<ReactionTerm> terms;
};

// Where the species' absolute enthalpies come from: electronic energies plus ZPE and
// thermal enthalpy (every species has `electronic_energy`), or ΔfH°(298.15 K) plus the
// thermal enthalpy above 298.15 K (every species has an enthalpy of formation).
enum class EnthalpyBasis { electronic, formation };
const char* enthalpy_basis_name(EnthalpyBasis basis);  // "electronic energies", "enthalpies of formation"

// "H2O = H2 + 0.5 O2" from the species' names.
std::string reaction_equation(const Reaction& reaction);

// Refuses (InputError at the reaction file) a reaction whose elements or charges do not
// balance, naming each element's surplus or the charge surplus, and one with an adsorbate.
void check_reaction_balance(const Reaction& reaction);

// Electronic energies when every species has one, else enthalpies of formation when every
// species has one; else InputError naming the species that has neither.
EnthalpyBasis choose_enthalpy_basis(const Reaction& reaction);

struct ReactionRow {
  double T_K = 0.0;
  double delta_H_J_per_mol = 0.0;
  double delta_S_J_per_mol_K = 0.0;
  double delta_G_J_per_mol = 0.0;
  double Kp = 0.0;                  // relative to p° = 1 bar (or 1 atm for that standard state)
  double Kc = 0.0;                  // relative to c° = 1 mol/L
  double ln_Kp = 0.0, ln_Kc = 0.0;  // finite where Kp or Kc over- or underflow
};

struct ReactionTable {
  std::string name;
  std::string equation;
  EnthalpyBasis basis = EnthalpyBasis::formation;
  double delta_n = 0.0;          // Σ ν of the gas species
  double Kp_reference_Pa = 0.0;  // pressure Kp is relative to
  std::vector<ReactionRow> rows;
};

// The species must have been prepared under one standard state (their options).
// Kp = exp(−ΔrG°/RT) · (p_state/p_ref)^Δn, p_state the standard state's pressure at T
// (c°RT for 1 mol/L, p_ref then 1 bar), and Kc = Kp (p_ref/(R T c°))^Δn with c° = 1 mol/L
// (e.g. Atkins' Physical Chemistry, ch. 6, the relation of Kc and Kp).
ReactionTable reaction_table(const Reaction& reaction, const std::vector<double>& temperatures_K);

// ln K = ln A + n ln T − E/(R T) by linear least squares over the rows (at least three
// distinct temperatures), for Kp or Kc.
struct LnKFit {
  double A = 0.0;
  double n = 0.0;
  double E_J_per_mol = 0.0;
  double max_abs_deviation_ln = 0.0;  // largest |ln K − fit| over the rows
};
LnKFit fit_ln_K(const std::vector<ReactionRow>& rows, bool concentration);

// ΔfH°(298.15 K) of `terms[unknown]` from ΔrH°(298.15 K) on the electronic-energy basis
// and the known ΔfH° of every other species: ΔfH°_u = (ΔrH° − Σ_{i≠u} ν_i ΔfH°_i) / ν_u.
// Throws InputError naming a species without `electronic_energy` or, among the known
// ones, without an enthalpy of formation.
struct UnknownFormation {
  double delta_rH298_J_per_mol = 0.0;
  double dfH298_J_per_mol = 0.0;
};
UnknownFormation solve_unknown_formation(const Reaction& reaction, std::size_t unknown);

// Mean, sample standard deviation (0 for one value), smallest and largest.
struct Spread {
  double mean = 0.0, standard_deviation = 0.0, min = 0.0, max = 0.0;
};
Spread spread_of(const std::vector<double>& values);

}  // namespace vibtherm
