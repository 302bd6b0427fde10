// Conformer ensembles: the Boltzmann-weighted sum of the conformers' partition functions,
// each counted from its own zero-point level placed at its energy in the ensemble.
#pragma once

#include <span>
#include <vector>

#include "vibtherm/thermo.hpp"

namespace vibtherm {

// With ε_i the zero-point level of conformer i above the lowest one and q_i its partition
// function counted from that level, Q = Σ q_i e^{−ε_i/RT} and the populations are
// p_i = q_i e^{−ε_i/RT} / Q (common practice, e.g. McQuarrie, Statistical Mechanics, 1976).
// The ensemble's motion terms are the population-weighted means of the conformers'; the
// rest goes to `conformers`: S/R = −Σ p_i ln p_i, U/RT = H/RT = Σ p_i ε_i/RT,
// Cv/R = Cp/R = Σ p_i h_i² − (Σ p_i h_i)² with h_i = (H_i + ε_i)/RT, and ln q = ln Q −
// Σ p_i ln q_i, so the totals are S = Σ p_i S_i − R Σ p_i ln p_i, H = Σ p_i (H_i + ε_i)
// and Cp = dH/dT exactly. `populations` (if given) receives the p_i.
ThermoPoint combine_conformers(std::span<const ThermoPoint> points, std::span<const double> levels_J_per_mol,
                               double T_K, std::vector<double>* populations = nullptr);

// Total ln q of one evaluated point (every motion).
double total_ln_q(const ThermoPoint& point);

}  // namespace vibtherm
