// libFuzzer entry point for the whole path a species takes: read (YAML and XYZ), prepare,
// tabulate, fit NASA-7, write the record and read it back. A malformed input must end in
// an InputError; whatever is accepted must give only finite numbers, and a written record
// must read back under the same name. Anything else (a crash, a sanitizer report, another
// exception, a NaN or inf) is a bug.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <string>
#include <vector>

#include "vibtherm/error.hpp"
#include "vibtherm/fit_plan.hpp"
#include "vibtherm/read_nasa.hpp"
#include "vibtherm/read_species.hpp"
#include "vibtherm/thermo.hpp"
#include "vibtherm/write_nasa7.hpp"

namespace {

void finite(double x) {
  if (!std::isfinite(x)) __builtin_trap();
}

void check_point(const vibtherm::ThermoPoint& p) {
  for (double x : {p.Cp_J_per_mol_K, p.Cv_J_per_mol_K, p.S_J_per_mol_K, p.H_minus_H0_J_per_mol,
                   p.H_minus_H298_J_per_mol, p.G_minus_H298_J_per_mol, p.gibbs_function_J_per_mol_K})
    finite(x);
}

const vibtherm::FitPlan& plan() {
  static const vibtherm::FitPlan shared = [] {
    vibtherm::FitOptions options;
    options.allow_missing_hf = true;
    options.grid_step_K = 25.0;  // coarser than the default: more inputs per second
    return vibtherm::FitPlan(options);
  }();
  return shared;
}

void run(const vibtherm::Species& species) {
  vibtherm::ModelOptions model;
  model.mode_count_mismatch_is_warning = true;  // reach the engine with odd mode counts too
  const vibtherm::PreparedSpecies prepared = vibtherm::prepare_species(species, model);
  finite(prepared.zero_point_energy_J_per_mol);
  finite(prepared.H298_minus_H0_J_per_mol);
  for (const auto& p : vibtherm::tabulate(prepared, {1.0, 10.0, 298.15, 1000.0, 6000.0, 1e5})) check_point(p);
  const vibtherm::SpeciesFit fit = vibtherm::fit_species(prepared, plan());
  for (const auto& r : fit.fit.ranges) {
    for (double a : r.a) finite(a);
    finite(r.b1);
    finite(r.b2);
  }
  const auto& n7 = std::get<vibtherm::Nasa7>(fit.polynomial);
  const std::string record = vibtherm::write_nasa7_record(n7);
  const auto back =
      vibtherm::read_nasa("THERMO\n   200.000  1000.000  3000.000\n" + record + "END\n", "fuzz.dat");
  if (back.size() != 1 || vibtherm::polynomial_name(back[0]) != n7.name) __builtin_trap();
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  for (bool yaml : {true, false}) {
    try {
      run(yaml ? vibtherm::read_species_yaml(text, "fuzz.yaml")
               : vibtherm::read_species_xyz(text, "fuzz.xyz"));
    } catch (const vibtherm::InputError&) {
    }
  }
  return 0;
}
