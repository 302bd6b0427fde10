// Uses the installed library: argon at 298.15 K must give S° = 154.846 J/(mol K) within
// 0.01 (CODATA Key Values, Cox, Wagman & Medvedev 1989).
#include <cmath>
#include <cstdio>

#include "vibtherm/thermo.hpp"

int main() {
  vibtherm::Species argon;
  argon.name = "Ar";
  vibtherm::Atom atom;
  atom.symbol = "Ar";
  atom.mass_amu = 39.9623831237;  // 40Ar, AME2020 (from memory)
  argon.atoms = {atom};
  argon.formula = {{"Ar", 1}};
  const double S = vibtherm::evaluate(vibtherm::prepare_species(argon), 298.15).S_J_per_mol_K;
  std::printf("S(Ar, 298.15 K) = %.4f J/(mol K)\n", S);
  return std::abs(S - 154.846) < 0.01 ? 0 : 1;
}
