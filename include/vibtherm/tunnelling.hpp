// Tunnelling corrections κ(T) for a transition state's reaction coordinate: Wigner's
// leading quantum correction and the transmission through an unsymmetrical Eckart barrier
// integrated over a Boltzmann distribution of energies.
#pragma once

#include <optional>
#include <string>
#include <vector>

namespace vibtherm {

// Wigner, Z. Phys. Chem. B 19, 203 (1932): κ = 1 + (h c ν̃‡ / k T)² / 24, ν̃‡ the magnitude
// of the imaginary wavenumber.
double wigner_kappa(double imaginary_wavenumber_cm1, double T_K);

// An Eckart barrier V(x) = A y/(1+y) + B y/(1+y)², y = exp(2π x / L) (Eckart, Phys. Rev. 35,
// 1303 (1930)), fixed by the forward and reverse barrier heights V1, V2 (J/mol, from the
// reactant and product sides, zero-point corrected if the user wants that) and the
// curvature at the top from the imaginary wavenumber: A = V1 − V2, B = (√V1 + √V2)²,
// and h ν‡ relates L through F‡ = 8π² V1 V2 / (L² B) = 4π² m ν‡².
struct EckartBarrier {
  double forward_J_per_mol = 0.0;
  double reverse_J_per_mol = 0.0;
  double imaginary_wavenumber_cm1 = 0.0;  // magnitude
};

// Throws InputError unless both heights and the wavenumber are positive and finite.
void check_eckart_barrier(const EckartBarrier& barrier);

// Transmission probability P(E) through the Eckart barrier for a molar energy E above the
// reactant asymptote (Eckart 1930, exact): with C = (h ν‡)² B / (16 V1 V2) (molar),
// α = ½ √(E/C), β = ½ √((E − A)/C), δ = ½ √((B − C)/C),
// P = [cosh 2π(α+β) − cosh 2π(α−β)] / [cosh 2π(α+β) + cosh 2πδ] (cos 2π|δ| when B < C);
// zero below the higher asymptote. This is the form Johnston & Heicklen (J. Phys. Chem. 66,
// 532 (1962)) integrate, with their α1,2 = 2π V1,2 / (h ν‡). Evaluated in logarithms.
double eckart_transmission(const EckartBarrier& barrier, double energy_J_per_mol);

// κ(T) = e^{V1/RT} / RT ∫ P(E) e^{−E/RT} dE over E from max(0, V1 − V2) upward, by composite
// Gauss–Legendre quadrature refined until two successive results agree to 1e-10 relative.
// Returns nothing when κ exceeds 1e300 (far below any sensible temperature for the barrier).
std::optional<double> eckart_kappa(const EckartBarrier& barrier, double T_K);

// What a transition state's tables report: the reaction coordinate and, when the barrier
// heights are given, the Eckart barrier.
struct TransitionStateTunnelling {
  double imaginary_wavenumber_cm1 = 0.0;  // magnitude, as used (scaled)
  std::optional<EckartBarrier> eckart;
};

struct TunnellingPoint {
  double T_K = 0.0;
  double wigner = 1.0;
  std::optional<double> eckart;  // absent without barriers, or when κ exceeds 1e300
};

std::vector<TunnellingPoint> tunnelling_table(const TransitionStateTunnelling& ts,
                                              const std::vector<double>& temperatures_K);

// One-line model note: the corrections reported and their sources.
std::string tunnelling_note(const TransitionStateTunnelling& ts);

}  // namespace vibtherm
