#include "vibtherm/thermo.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "vibtherm/hessian.hpp"
#include "vibtherm/limits.hpp"

namespace vibtherm {

namespace c = constants;

namespace {

std::string join_wavenumbers(const std::vector<double>& values) {
  std::string out;
  for (double v : values) out += (out.empty() ? "" : ", ") + fmt::format("{:.1f}i", std::abs(v));
  return out;
}

std::string count_rule(const Species& species, RotorType type) {
  if (species.phase == Phase::adsorbate) return "3N for an adsorbate";
  switch (type) {
    case RotorType::atom:
      return "none for an atom";
    case RotorType::linear:
      return "3N-5 for a linear molecule";
    case RotorType::nonlinear:
      return "3N-6 for a nonlinear molecule";
  }
  return "";
}

// Sorts out imaginary wavenumbers (negative input values) according to the options and
// fills the wavenumbers used.
void apply_imaginary_policy(PreparedSpecies& p, const std::vector<double>& scaled) {
  const bool ts = p.options.transition_state || p.species.transition_state;
  std::vector<double> imaginary;
  for (double v : scaled)
    if (v < 0.0) imaginary.push_back(v);
  int drop_index = -1;
  if (ts) {
    if (imaginary.empty())
      fail(p.species.origin, fmt::format("species '{}' is marked as a transition state but has no imaginary "
                                         "frequency (expected one negative wavenumber)",
                                         p.species.name));
    // The reaction coordinate is the imaginary mode of largest magnitude.
    auto it = std::min_element(scaled.begin(), scaled.end());
    drop_index = static_cast<int>(it - scaled.begin());
    p.notes.push_back(
        fmt::format("transition state: the imaginary mode {:.1f}i cm^-1 is the reaction "
                    "coordinate and is left out of the partition function",
                    std::abs(*it)));
  }
  std::vector<double> rejected;
  for (size_t i = 0; i < scaled.size(); ++i) {
    const double v = scaled[i];
    p.used_frequencies_cm1.push_back(v);
    if (static_cast<int>(i) == drop_index) continue;
    if (v > 0.0) {
      p.vibrations_cm1.push_back(v);
    } else if (v < 0.0 && -v < p.options.imaginary_as_real_below_cm1) {
      p.warnings.push_back(
          fmt::format("imaginary frequency {:.1f}i cm^-1 treated as a real mode of {:.1f} cm^-1", -v, -v));
      p.vibrations_cm1.push_back(-v);
      p.used_frequencies_cm1.back() = -v;
    } else if (v < 0.0) {
      rejected.push_back(v);
    } else {
      fail(p.species.origin, fmt::format("species '{}' has a zero frequency (mode {}); expected only the "
                                         "vibrations, without translations and rotations",
                                         p.species.name, i + 1));
    }
  }
  if (!rejected.empty())
    fail(p.species.origin,
         fmt::format("species '{}' has imaginary frequencies {} cm^-1; expected real ones (mark a transition "
                     "state with 'transition_state: true', or treat small ones as real with "
                     "--imaginary-as-real-below)",
                     p.species.name, join_wavenumbers(rejected)));
}

// Replaces the species' frequencies by the harmonic wavenumbers of its Hessian, with the
// external motions of its phase and rotor type projected out (hessian.hpp).
void frequencies_from_hessian(PreparedSpecies& p) {
  const Species& s = p.species;
  const std::size_t n = 3 * s.atoms.size();
  if (s.atoms.empty() || s.hessian_J_per_m2->size() != n * n)
    fail(s.origin, fmt::format("species '{}' has a Hessian of {} values for {} atoms, expected {} (3N×3N)",
                               s.name, s.hessian_J_per_m2->size(), s.atoms.size(), n * n));
  const Eigen::Index size = static_cast<Eigen::Index>(n);
  const Eigen::MatrixXd hessian =
      Eigen::Map<const Eigen::Matrix<double, Eigen::Dynamic, Eigen::Dynamic, Eigen::RowMajor>>(
          s.hessian_J_per_m2->data(), size, size);
  std::vector<double> masses_amu;
  std::vector<Eigen::Vector3d> positions_angstrom;
  for (const Atom& a : s.atoms) {
    masses_amu.push_back(a.mass_amu);
    positions_angstrom.push_back(a.position_angstrom);
  }
  ExternalMotions external = ExternalMotions::none;
  if (p.is_gas) {
    switch (p.rotor.type) {
      case RotorType::atom:
        external = ExternalMotions::atom;
        break;
      case RotorType::linear:
        external = ExternalMotions::linear;
        break;
      case RotorType::nonlinear:
        external = ExternalMotions::nonlinear;
        break;
    }
  }
  p.species.frequencies_cm1 = harmonic_wavenumbers_cm1(hessian, masses_amu, positions_angstrom, external);
  p.notes.push_back(
      fmt::format("{} harmonic frequencies from the Cartesian Hessian ({} external motions projected out)",
                  p.species.frequencies_cm1.size(), external_motion_count(external)));
}

// Takes each hindered rotor's torsional mode out of the vibrations and builds the rotor.
// The match is against the unscaled input wavenumbers (the file's `replaces` is copied
// from them) within replaces_tolerance_cm1; two rotors cannot replace one mode.
void replace_torsions(PreparedSpecies& p) {
  const Species& s = p.species;
  if (s.hindered_rotors.empty()) return;
  if (!p.is_gas || s.atoms.empty())
    fail(s.origin,
         fmt::format("species '{}' has hindered rotors, expected a gas-phase species given by 'atoms'",
                     s.name));
  std::vector<char> taken(p.vibrations_cm1.size(), 0);
  for (const HinderedRotor& r : s.hindered_rotors) {
    const double target = r.replaces_cm1 * p.options.frequency_scale;
    std::size_t best = p.vibrations_cm1.size();
    for (std::size_t i = 0; i < p.vibrations_cm1.size(); ++i)
      if (!taken[i] && (best == p.vibrations_cm1.size() ||
                        std::abs(p.vibrations_cm1[i] - target) < std::abs(p.vibrations_cm1[best] - target)))
        best = i;
    const double tolerance = replaces_tolerance_cm1 * p.options.frequency_scale;
    if (best == p.vibrations_cm1.size() || std::abs(p.vibrations_cm1[best] - target) > tolerance)
      fail(r.where,
           fmt::format("hindered rotor 'replaces' {:g} cm^-1 matches no remaining vibration within {:g} "
                       "cm^-1, expected one of the frequencies",
                       r.replaces_cm1, replaces_tolerance_cm1));
    taken[best] = 1;
    p.hindered_rotors.push_back(build_hindered_rotor(s, r));
    p.notes.push_back(
        fmt::format("hindered rotor about atoms {}-{} (symmetry {}, reduced moment {:.3f} amu A^2) replaces "
                    "the mode at {:.1f} "
                    "cm^-1",
                    r.bond_atoms[0] + 1, r.bond_atoms[1] + 1, r.symmetry,
                    p.hindered_rotors.back().reduced_moment_amu_A2, p.vibrations_cm1[best]));
  }
  std::vector<double> kept;
  for (std::size_t i = 0; i < p.vibrations_cm1.size(); ++i)
    if (!taken[i]) kept.push_back(p.vibrations_cm1[i]);
  p.vibrations_cm1 = std::move(kept);
}

// The species' temperature-independent parts, fixed once per evaluation run: the
// translation and rotation constants, the vibrations' characteristic temperatures and a
// single-level electronic term. Per temperature that leaves one ln T, one exp per mode and
// one log for all vibrations (plus the electronic levels and the hindered rotors).
class Evaluator {
 public:
  explicit Evaluator(const PreparedSpecies& p) : p_(p) {
    if (p.is_gas) {
      translation_ = p.options.standard_state == StandardState::molar
                         ? translation_law_concentration(p.rotor.mass_amu, 1000.0)
                         : translation_law(p.rotor.mass_amu, p.options.pressure_Pa);
      rotation_ = rigid_rotor_law(p.rotor.rotational_temperatures_K, p.species.symmetry_number);
    }
    theta_K_.reserve(p.vibrations_cm1.size());
    for (double v : p.vibrations_cm1) theta_K_.push_back(characteristic_temperature_K(v));
    const auto& levels = p.species.electronic_levels;
    single_level_ = levels.size() <= 1;
    if (single_level_) electronic_ = electronic_terms(levels, 1.0);  // ln g, the same at every T
  }

  // Thermal functions at T without the H(298.15) reference.
  ThermoPoint terms(double T_K) const {
    ThermoPoint point;
    point.T_K = T_K;
    if (p_.is_gas) {
      const double ln_T = std::log(T_K);
      point.translation = translation_.at(ln_T);
      point.rotation = rotation_.at(ln_T);
    }
    point.vibration = harmonic_oscillators_terms(theta_K_, T_K);
    point.electronic = single_level_ ? electronic_ : electronic_terms(p_.species.electronic_levels, T_K);
    for (const HinderedRotorModel& r : p_.hindered_rotors)
      point.internal_rotation += hindered_rotor_terms(r.levels, r.input.symmetry, T_K);

    MotionTerms total = point.translation;
    total += point.internal_rotation;
    total += point.rotation;
    total += point.vibration;
    total += point.electronic;
    const double R = c::gas_constant_J_per_mol_K;
    point.Cv_J_per_mol_K = R * total.Cv_over_R;
    point.Cp_J_per_mol_K = R * total.Cp_over_R;
    point.S_J_per_mol_K = R * total.S_over_R;
    point.H_minus_H0_J_per_mol = R * T_K * total.H_over_RT;
    return point;
  }

  ThermoPoint point(double T_K) const {
    limits::check_temperature(T_K, "temperature");
    ThermoPoint point = terms(T_K);
    point.H_minus_H298_J_per_mol = point.H_minus_H0_J_per_mol - p_.H298_minus_H0_J_per_mol;
    point.G_minus_H298_J_per_mol = point.H_minus_H298_J_per_mol - T_K * point.S_J_per_mol_K;
    point.gibbs_function_J_per_mol_K = -point.G_minus_H298_J_per_mol / T_K;
    check_finite(point);
    return point;
  }

  // No NaN or inf leaves the engine: the inputs are bounded (limits.hpp), so one here is
  // a defect, reported with the species and the quantity rather than written out.
  void check_finite(const ThermoPoint& point) const {
    const std::pair<const char*, double> values[] = {{"Cp", point.Cp_J_per_mol_K},
                                                     {"Cv", point.Cv_J_per_mol_K},
                                                     {"S", point.S_J_per_mol_K},
                                                     {"H-H0", point.H_minus_H0_J_per_mol},
                                                     {"H-H298", point.H_minus_H298_J_per_mol},
                                                     {"G-H298", point.G_minus_H298_J_per_mol}};
    for (const auto& [what, value] : values)
      if (!std::isfinite(value))
        fail(p_.species.origin,
             fmt::format("species '{}': {} at {:g} K is {}, expected a finite value (please report "
                         "the input)",
                         limits::display_name(p_.species.name), what, point.T_K, value));
  }

 private:
  const PreparedSpecies& p_;
  LogLinearTerms translation_, rotation_;
  std::vector<double> theta_K_;
  bool single_level_ = true;
  MotionTerms electronic_;
};

}  // namespace

void check_model_options(const ModelOptions& options) {
  limits::check_range(options.frequency_scale, limits::min_frequency_scale, limits::max_frequency_scale,
                      "frequency scale factor", "");
  if (options.standard_state != StandardState::molar)
    limits::check_range(options.pressure_Pa, limits::min_pressure_Pa, limits::max_pressure_Pa, "pressure",
                        "Pa");
  limits::check_range(options.imaginary_as_real_below_cm1, 0.0, limits::max_wavenumber_cm1,
                      "--imaginary-as-real-below", "cm^-1");
}

PreparedSpecies prepare_species(const Species& species, const ModelOptions& options) {
  PreparedSpecies p;
  p.species = species;
  p.options = options;
  p.is_gas = species.phase == Phase::gas;
  check_model_options(options);
  limits::check_species(species);
  if (species.symmetry_number < 1)
    fail(species.origin,
         fmt::format("symmetry number must be a positive integer, got {}", species.symmetry_number));
  p.rotor = analyse_rotor(species, options.linear_tolerance_amu_A2);
  if (species.hessian_J_per_m2) {
    frequencies_from_hessian(p);
    for (double v : p.species.frequencies_cm1)
      limits::check_range(
          std::abs(v), limits::min_wavenumber_cm1, limits::max_wavenumber_cm1,
          fmt::format("species '{}': |wavenumber| from the Hessian", limits::display_name(species.name)),
          "cm^-1", species.origin);
  }

  std::vector<double> scaled;
  for (double v : p.species.frequencies_cm1) scaled.push_back(v * options.frequency_scale);
  if (options.frequency_scale != 1.0)
    p.notes.push_back(fmt::format("wavenumbers scaled by {}", options.frequency_scale));

  const int expected = expected_vibration_count(species, p.rotor.type);
  const int given = static_cast<int>(p.species.frequencies_cm1.size());
  if (expected >= 0 && given != expected) {
    const std::string message =
        fmt::format("species '{}' has {} vibrational frequencies, expected {} ({}, N = {})", species.name,
                    given, expected, count_rule(species, p.rotor.type), atom_count(species));
    if (!options.mode_count_mismatch_is_warning)
      fail(species.origin, message + "; --allow-mode-count-mismatch accepts it");
    p.warnings.push_back(message);
  }
  apply_imaginary_policy(p, scaled);

  replace_torsions(p);

  double sum_cm1 = 0.0;
  for (double v : p.vibrations_cm1) sum_cm1 += v;
  p.zero_point_energy_J_per_mol = 0.5 * sum_cm1 * c::wavenumber_J_per_mol;
  for (const HinderedRotorModel& r : p.hindered_rotors)
    p.zero_point_energy_J_per_mol += r.levels.zero_point_energy_J_per_mol;
  if (!p.is_gas) p.notes.push_back("adsorbate: all 3N motions treated as harmonic vibrations");
  p.H298_minus_H0_J_per_mol = Evaluator(p).terms(c::reference_temperature_K).H_minus_H0_J_per_mol;
  return p;
}

ThermoPoint evaluate(const PreparedSpecies& prepared, double T_K) { return Evaluator(prepared).point(T_K); }

std::vector<ThermoPoint> tabulate(const PreparedSpecies& prepared,
                                  const std::vector<double>& temperatures_K) {
  const Evaluator evaluator(prepared);
  std::vector<ThermoPoint> rows;
  rows.reserve(temperatures_K.size());
  for (double T : temperatures_K) rows.push_back(evaluator.point(T));
  return rows;
}

double classical_Cv_over_R(const PreparedSpecies& prepared) {
  const double vibrations = static_cast<double>(prepared.vibrations_cm1.size());
  if (!prepared.is_gas) return vibrations;
  double rotation = 0.0;
  if (prepared.rotor.type == RotorType::linear) rotation = 1.0;
  if (prepared.rotor.type == RotorType::nonlinear) rotation = 1.5;
  return 1.5 + rotation + vibrations + 0.5 * static_cast<double>(prepared.hindered_rotors.size());
}

}  // namespace vibtherm
