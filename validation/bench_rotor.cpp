// Benchmark of the hindered-rotor level solver: the time of torsion_levels for a reduced
// moment, a cosine barrier of 10 kJ/mol and σ = 3 in a basis |m| ≤ M (median of repeats).
// Absolute times depend on the machine; compare versions on one machine.
//
// Usage: bench_rotor [MOMENT_amu_A2=1000] [M=800] [REPEATS=5]
#include <fmt/format.h>

#include <algorithm>
#include <chrono>
#include <cstdlib>
#include <vector>

#include "vibtherm/hindered_rotor.hpp"

int main(int argc, char** argv) {
  const double I = argc > 1 ? std::atof(argv[1]) : 1000.0;
  const int M = argc > 2 ? std::atoi(argv[2]) : 800;
  const int repeats = argc > 3 ? std::max(1, std::atoi(argv[3])) : 5;
  const vibtherm::TorsionPotential v = vibtherm::cosine_barrier(10e3, 3);
  std::vector<double> seconds;
  double checksum = 0.0;
  for (int i = 0; i < repeats; ++i) {
    const auto start = std::chrono::steady_clock::now();
    const vibtherm::TorsionLevels levels = vibtherm::torsion_levels_in_basis(I, v, M);
    seconds.push_back(std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count());
    checksum += levels.energies_J_per_mol[10];
  }
  std::sort(seconds.begin(), seconds.end());
  fmt::print(
      "torsion_levels I = {:g} amu A^2, sigma = 3, V = 10 kJ/mol, |m| <= {}: median {:.4f} s "
      "over {} runs (level 10: {:.6f} J/mol)\n",
      I, M, seconds[seconds.size() / 2], repeats, checksum / repeats);
}
