// Benchmark of the engine: evaluates a batch of synthetic species on a temperature grid
// and reports throughput, with a reference run in the same process: the bare Einstein
// function over the same modes and temperatures (the arithmetic floor). The ratio
// engine/reference is what to compare between versions; absolute times depend on the
// machine. Also reports peak memory (getrusage).
//
// Usage: bench_engine [SPECIES=1000] [ATOMS=20] [TEMPERATURES=300]
#include <fmt/format.h>
#include <sys/resource.h>

#include <chrono>
#include <cmath>
#include <cstdlib>
#include <vector>

#include "vibtherm/constants.hpp"
#include "vibtherm/thermo.hpp"

namespace {

// A nonlinear chain-like molecule of `atoms` atoms with a spread of wavenumbers; the
// numbers are synthetic (a load, not chemistry).
vibtherm::Species synthetic_species(int index, int atoms) {
  vibtherm::Species s;
  s.name = fmt::format("bench-{}", index);
  for (int i = 0; i < atoms; ++i) {
    vibtherm::Atom a;
    a.symbol = i % 3 == 0 ? "C" : "H";
    a.mass_amu = i % 3 == 0 ? 12.0 : 1.00782503223;
    a.position_angstrom = {1.2 * i, 0.4 * std::sin(i + index), 0.3 * std::cos(1.7 * i)};
    s.atoms.push_back(a);
    s.formula[a.symbol] += 1;
  }
  const int modes = 3 * atoms - 6;
  for (int k = 0; k < modes; ++k) s.frequencies_cm1.push_back(80.0 + 3200.0 * k / modes + index % 7);
  return s;
}

double seconds_since(std::chrono::steady_clock::time_point start) {
  return std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
}

}  // namespace

int main(int argc, char** argv) {
  const int species_count = argc > 1 ? std::atoi(argv[1]) : 1000;
  const int atoms = argc > 2 ? std::atoi(argv[2]) : 20;
  const int temperature_count = argc > 3 ? std::atoi(argv[3]) : 300;
  std::vector<double> temps;
  for (int i = 0; i < temperature_count; ++i) temps.push_back(200.0 + 5800.0 * i / temperature_count);

  std::vector<vibtherm::Species> batch;
  for (int i = 0; i < species_count; ++i) batch.push_back(synthetic_species(i, atoms));

  auto start = std::chrono::steady_clock::now();
  double checksum = 0.0;
  for (const auto& s : batch) {
    const auto prepared = vibtherm::prepare_species(s);
    for (const auto& row : vibtherm::tabulate(prepared, temps)) checksum += row.S_J_per_mol_K;
  }
  const double engine_s = seconds_since(start);

  start = std::chrono::steady_clock::now();
  double reference_sum = 0.0;
  for (const auto& s : batch)
    for (double T : temps)
      for (double v : s.frequencies_cm1) {
        const double x = v * vibtherm::constants::second_radiation_cm_K / T;
        reference_sum += x * x * std::exp(-x) / std::pow(-std::expm1(-x), 2);
      }
  const double reference_s = seconds_since(start);

  rusage usage{};
  getrusage(RUSAGE_SELF, &usage);
  const double evaluations = static_cast<double>(species_count) * temperature_count;
  fmt::print("species {}  atoms {}  temperatures {}  (checksums {:.6g} {:.6g})\n", species_count, atoms,
             temperature_count, checksum, reference_sum);
  fmt::print("engine:    {:.3f} s  {:.3g} species-temperatures/s\n", engine_s, evaluations / engine_s);
  fmt::print("reference: {:.3f} s  (bare Einstein function, same modes and temperatures)\n", reference_s);
  fmt::print("ratio engine/reference: {:.2f}\n", engine_s / reference_s);
  fmt::print("peak resident memory: {:.1f} MiB\n", usage.ru_maxrss / 1024.0);
  return 0;
}
