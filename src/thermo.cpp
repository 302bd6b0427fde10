#include "vibtherm/thermo.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "vibtherm/conformers.hpp"
#include "vibtherm/electrons.hpp"
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
      fail(key_location(p.species, "transition_state"),
           fmt::format("species '{}' is marked as a transition state but has no imaginary "
                       "frequency (expected one negative wavenumber)",
                       p.species.name));
    // The reaction coordinate is the imaginary mode of largest magnitude.
    auto it = std::min_element(scaled.begin(), scaled.end());
    drop_index = static_cast<int>(it - scaled.begin());
    p.notes.push_back(
        fmt::format("transition state: the imaginary mode {:.1f}i cm^-1 is the reaction "
                    "coordinate and is left out of the partition function",
                    std::abs(*it)));
    p.tunnelling = TransitionStateTunnelling{std::abs(*it), std::nullopt};
    if (const auto& b = p.species.tunnelling) {
      p.tunnelling->eckart = EckartBarrier{b->forward_J_per_mol, b->reverse_J_per_mol, std::abs(*it)};
      check_eckart_barrier(*p.tunnelling->eckart);
    }
    p.notes.push_back(tunnelling_note(*p.tunnelling));
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
      fail(key_location(p.species, "frequencies"),
           fmt::format("species '{}' has a zero frequency (mode {}); expected only the "
                       "vibrations, without translations and rotations",
                       p.species.name, i + 1));
    }
  }
  if (!rejected.empty() && ts)
    fail(key_location(p.species, "frequencies"),
         fmt::format(
             "species '{}' is a transition state with {} imaginary frequencies ({}, {} cm^-1); expected "
             "exactly one, the reaction coordinate (re-optimise the structure, or treat small ones as "
             "real with --imaginary-as-real-below)",
             p.species.name, rejected.size() + 1, join_wavenumbers({scaled[static_cast<size_t>(drop_index)]}),
             join_wavenumbers(rejected)));
  if (!rejected.empty())
    fail(key_location(p.species, "frequencies"),
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

// Takes each hindered rotor's torsional mode out of the vibrations (hindered_rotor.hpp).
void replace_torsions(PreparedSpecies& p) {
  const Species& s = p.species;
  if (s.hindered_rotors.empty()) return;
  if (!p.is_gas || s.atoms.empty())
    fail(s.origin,
         fmt::format("species '{}' has hindered rotors, expected a gas-phase species given by 'atoms'",
                     s.name));
  TorsionReplacement r =
      replace_torsional_modes(s, p.vibrations_cm1, p.options.frequency_scale,
                              std::max(p.options.max_temperature_K, constants::reference_temperature_K));
  p.hindered_rotors = std::move(r.rotors);
  p.vibrations_cm1 = std::move(r.kept_cm1);
  p.notes.insert(p.notes.end(), r.notes.begin(), r.notes.end());
  p.warnings.insert(p.warnings.end(), r.warnings.begin(), r.warnings.end());
}

// The symmetry number used and the point group (point_group.hpp); a racemic mixture when
// asked for and the geometry is chiral.
void choose_symmetry(PreparedSpecies& p) {
  SymmetryChoice choice = choose_symmetry_number(p.species, p.options.symmetry_tolerance_angstrom);
  p.species.symmetry_number = choice.symmetry_number;
  p.point_group = choice.point_group;
  p.notes.insert(p.notes.end(), choice.notes.begin(), choice.notes.end());
  p.warnings.insert(p.warnings.end(), choice.warnings.begin(), choice.warnings.end());
  if (!p.options.racemic || !p.is_gas) return;
  if (!p.point_group)
    p.warnings.push_back("--racemic ignored: without 'atoms' the chirality is unknown");
  else if (p.point_group->chiral) {
    p.racemic = true;
    p.notes.push_back(
        fmt::format("racemic mixture (--racemic): the point group {} is chiral, S + R ln 2 "
                    "and G - RT ln 2 for the two enantiomers",
                    point_group_display(p.point_group->label)));
  } else
    p.notes.push_back(fmt::format("--racemic changes nothing: the point group {} is not chiral",
                                  point_group_display(p.point_group->label)));
}

// Chooses the low-frequency treatment (option, else the species key, else harmonic) and
// lists the modes it or a separate enthalpy scale factor changes.
void plan_low_frequency(PreparedSpecies& p) {
  LowFrequencyOptions lf = p.options.low_frequency;
  lf.method =
      p.options.low_frequency_method.value_or(p.species.low_frequency.value_or(LowFrequencyMethod::harmonic));
  std::vector<double> enthalpy_cm1;
  for (double v : p.vibrations_cm1) enthalpy_cm1.push_back(v * (p.scale.enthalpy / p.scale.entropy));
  p.vibration_adjustment = plan_vibration_adjustment(lf, p.vibrations_cm1, enthalpy_cm1);
  if (const std::string note = low_frequency_note(p.vibration_adjustment); !note.empty())
    p.notes.push_back(note);
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
      rotation_ = rigid_rotor_law(p.rotor.rotational_temperatures_K, p.species.symmetry_number.value_or(1));
    }
    theta_K_.reserve(p.vibrations_cm1.size());
    for (double v : p.vibrations_cm1) theta_K_.push_back(characteristic_temperature_K(v));
    const auto& levels = p.species.electronic_levels;
    single_level_ = levels.size() <= 1;
    if (single_level_) electronic_ = electronic_terms(levels, 1.0);  // ln g, the same at every T
    for (const ConformerMember& m : p.conformers) {
      members_.emplace_back(m.prepared);
      levels_J_per_mol_.push_back(m.level_J_per_mol);
    }
  }

  // An ensemble's thermal functions from its members' (conformers.hpp).
  ThermoPoint ensemble_terms(double T_K, std::vector<double>* populations) const {
    std::vector<ThermoPoint> points;
    points.reserve(members_.size());
    for (const Evaluator& m : members_) points.push_back(m.terms(T_K));
    return combine_conformers(points, levels_J_per_mol_, T_K, populations);
  }

  // Thermal functions at T without the H(298.15) reference.
  ThermoPoint terms(double T_K) const {
    if (!members_.empty()) return ensemble_terms(T_K, nullptr);
    ThermoPoint point;
    point.T_K = T_K;
    if (p_.is_gas) {
      const double ln_T = std::log(T_K);
      point.translation = translation_.at(ln_T);
      point.rotation = rotation_.at(ln_T);
      // Two optical isomers count like a halved symmetry number: q_rot × 2 (common practice).
      if (p_.racemic) point.rotation.ln_q += std::log(2.0), point.rotation.S_over_R += std::log(2.0);
    }
    point.vibration = harmonic_oscillators_terms(theta_K_, T_K);
    // The one hook of the low-frequency module: its correction to the harmonic sum.
    if (!p_.vibration_adjustment.modes.empty())
      point.vibration += vibration_adjustment_terms(p_.vibration_adjustment, T_K);
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
  std::vector<Evaluator> members_;
  std::vector<double> levels_J_per_mol_;
};

// An ensemble: every conformer prepared on its own (inheriting the ensemble's model keys
// it does not set), placed at its zero-point level, then described by the lowest one.
PreparedSpecies prepare_ensemble(const Species& species, const ModelOptions& options) {
  std::vector<ConformerMember> members;
  for (const Conformer& c : species.conformers) {
    // 1e308 kJ/mol once gave NaN weights; a relative energy stays within the rotor bound.
    limits::check_range(
        c.relative_energy_J_per_mol / 1e3, -limits::max_conformer_energy_J_per_mol / 1e3,
        limits::max_conformer_energy_J_per_mol / 1e3,
        fmt::format("conformer {} ('{}') relative energy", members.size() + 1, limits::display_name(c.file)),
        "kJ/mol", c.where.file.empty() ? species.origin : c.where);
    Species s = c.species;
    if (!s.low_frequency) s.low_frequency = species.low_frequency;
    if (s.scale.empty()) s.scale = species.scale;
    ConformerMember m{c.file, prepare_species(s, options), c.relative_energy_J_per_mol, 0.0};
    const PreparedSpecies& first = members.empty() ? m.prepared : members.front().prepared;
    if (m.prepared.species.formula != first.species.formula || m.prepared.is_gas != first.is_gas)
      fail(c.where, fmt::format("conformer {} ('{}') has another composition or phase than conformer 1, "
                                "expected conformers of one species",
                                members.size() + 1, c.file));
    // Electronic energies: the zero-point level is ΔE + ZPE; ZPE-inclusive ones are that already.
    m.level_J_per_mol =
        c.relative_energy_J_per_mol +
        (species.conformer_energies_include_zpe ? 0.0 : m.prepared.zero_point_energy_J_per_mol);
    members.push_back(std::move(m));
  }
  std::size_t ground = 0;
  for (std::size_t i = 0; i < members.size(); ++i)
    if (members[i].level_J_per_mol < members[ground].level_J_per_mol) ground = i;
  const double lowest = members[ground].level_J_per_mol;
  std::size_t reference = 0;  // the conformer the relative energies are counted from
  for (std::size_t i = 0; i < members.size(); ++i)
    if (members[i].relative_energy_J_per_mol < members[reference].relative_energy_J_per_mol) reference = i;

  PreparedSpecies p = members[ground].prepared;
  p.species.name = species.name;
  p.species.origin = species.origin;
  p.species.enthalpy_of_formation_J_per_mol = species.enthalpy_of_formation_J_per_mol;
  p.tunnelling.reset();
  // The ensemble's 0 K level above the electronic energy of the reference conformer.
  p.zero_point_energy_J_per_mol = species.conformer_energies_include_zpe
                                      ? members[reference].prepared.zero_point_energy_J_per_mol + lowest -
                                            members[reference].relative_energy_J_per_mol
                                      : lowest - members[reference].relative_energy_J_per_mol;
  p.warnings.clear();
  p.notes.clear();
  p.notes.push_back(fmt::format(
      "conformer ensemble of {}: Boltzmann-weighted sum of partition functions, each conformer with its own "
      "structure, symmetry number, frequencies and ZPE; relative energies {}; facts and modes shown are "
      "those "
      "of the lowest zero-point level, conformer {} ('{}')",
      members.size(),
      species.conformer_energies_include_zpe ? "given including the zero-point energy"
                                             : "electronic, each conformer's ZPE added",
      ground + 1, members[ground].file));
  for (std::size_t i = 0; i < members.size(); ++i) {
    members[i].level_J_per_mol -= lowest;
    for (const std::string& w : members[i].prepared.warnings)
      p.warnings.push_back(fmt::format("conformer {} ('{}'): {}", i + 1, members[i].file, w));
    for (const std::string& n : members[i].prepared.notes)
      p.notes.push_back(fmt::format("conformer {} ('{}'): {}", i + 1, members[i].file, n));
  }
  p.conformers = std::move(members);
  p.H298_minus_H0_J_per_mol = Evaluator(p).terms(c::reference_temperature_K).H_minus_H0_J_per_mol;
  return p;
}

}  // namespace

void check_model_options(const ModelOptions& options) {
  limits::check_range(options.frequency_scale, limits::min_frequency_scale, limits::max_frequency_scale,
                      "frequency scale factor", "");
  // The per-quantity options are checked here, before any species, so that the error
  // names the option rather than the first species file.
  const std::pair<const std::optional<double>&, const char*> per_quantity[] = {
      {options.scale.zpe, "--scale-zpe (the zero-point energy's frequency scale factor)"},
      {options.scale.enthalpy, "--scale-enthalpy (the thermal enthalpy's frequency scale factor)"},
      {options.scale.entropy, "--scale-entropy (the entropy's frequency scale factor)"}};
  for (const auto& [factor, what] : per_quantity)
    if (factor)
      limits::check_range(*factor, limits::min_frequency_scale, limits::max_frequency_scale, what, "");
  if (options.standard_state != StandardState::molar)
    limits::check_range(options.pressure_Pa, limits::min_pressure_Pa, limits::max_pressure_Pa, "pressure",
                        "Pa");
  limits::check_range(options.imaginary_as_real_below_cm1, 0.0, limits::max_wavenumber_cm1,
                      "--imaginary-as-real-below", "cm^-1");
  limits::check_range(options.symmetry_tolerance_angstrom, 1e-6, 0.25, "--symmetry-tolerance", "angstrom");
  limits::check_temperature(options.max_temperature_K, "highest temperature of the run");
}

PreparedSpecies prepare_species(const Species& species, const ModelOptions& options) {
  if (!species.conformers.empty()) return prepare_ensemble(species, options);
  PreparedSpecies p;
  p.species = species;
  p.options = options;
  p.is_gas = species.phase == Phase::gas;
  p.notes = species.reader_notes;
  check_model_options(options);
  limits::check_species(species);
  if (species.symmetry_number && *species.symmetry_number < 1)
    fail(key_location(species, "symmetry_number"),
         fmt::format("symmetry number must be a positive integer, got {}", *species.symmetry_number));
  p.rotor = analyse_rotor(species, options.linear_tolerance_amu_A2);
  choose_symmetry(p);
  ElectronicChoice electronic = choose_electronic_levels(p.species);
  p.species.electronic_levels = std::move(electronic.levels);
  p.notes.insert(p.notes.end(), electronic.notes.begin(), electronic.notes.end());
  if (species.hessian_J_per_m2) {
    frequencies_from_hessian(p);
    for (double v : p.species.frequencies_cm1)
      limits::check_range(
          std::abs(v), limits::min_wavenumber_cm1, limits::max_wavenumber_cm1,
          fmt::format("species '{}': |wavenumber| from the Hessian", limits::display_name(species.name)),
          "cm^-1", species.origin);
  }

  p.scale = resolve_scale_factors(options.scale, species.scale, options.frequency_scale, species.origin);
  p.options.frequency_scale = p.scale.entropy;  // the factor of vibrations_cm1
  std::vector<double> scaled;
  for (double v : p.species.frequencies_cm1) scaled.push_back(v * p.scale.entropy);
  if (const std::string note = scale_factors_note(p.scale); !note.empty()) p.notes.push_back(note);

  const int expected = expected_vibration_count(species, p.rotor.type);
  const int given = static_cast<int>(p.species.frequencies_cm1.size());
  if (expected >= 0 && given != expected) {
    const std::string message =
        fmt::format("species '{}' has {} vibrational frequencies, expected {} ({}, N = {})", species.name,
                    given, expected, count_rule(species, p.rotor.type), atom_count(species));
    if (!options.mode_count_mismatch_is_warning)
      fail(key_location(species, species.hessian_J_per_m2 ? "hessian" : "frequencies"),
           message + "; --allow-mode-count-mismatch accepts it");
    p.warnings.push_back(message);
  }
  apply_imaginary_policy(p, scaled);
  if (species.tunnelling && !p.tunnelling)
    p.warnings.push_back("'tunnelling' barriers ignored: the species is not treated as a transition state");

  replace_torsions(p);
  plan_low_frequency(p);

  double sum_cm1 = 0.0;
  for (double v : p.vibrations_cm1) sum_cm1 += v;
  p.zero_point_energy_J_per_mol = 0.5 * sum_cm1 * (p.scale.zpe / p.scale.entropy) * c::wavenumber_J_per_mol;
  for (const HinderedRotorModel& r : p.hindered_rotors)
    p.zero_point_energy_J_per_mol += r.levels.zero_point_energy_J_per_mol;
  if (!p.is_gas) p.notes.push_back("adsorbate: all 3N motions treated as harmonic vibrations");
  const ThermoPoint at298 = Evaluator(p).terms(c::reference_temperature_K);
  p.H298_minus_H0_J_per_mol = at298.H_minus_H0_J_per_mol;
  for (const SoftMode& m : soft_harmonic_modes(p.vibration_adjustment, p.vibrations_cm1))
    p.warnings.push_back(soft_mode_warning(m, p.vibration_adjustment.options.soft_mode_warning_below_cm1,
                                           at298.S_J_per_mol_K));
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

std::vector<double> conformer_populations(const PreparedSpecies& prepared, double T_K) {
  std::vector<double> populations;
  if (!prepared.conformers.empty()) Evaluator(prepared).ensemble_terms(T_K, &populations);
  return populations;
}

}  // namespace vibtherm
