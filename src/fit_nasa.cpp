// Constrained least squares for NASA polynomials.
//
// Method: every range r has unknowns α_k (Cp coefficients in the scaled temperature
// τ = T / 1000 K, exponents e_k = 0..4 for NASA-7 and −2..4 for NASA-9) and two
// integration constants β_H, β_S. Cp/R, H/R and S/R are all linear in these unknowns,
// so the fit is a linear least-squares problem with linear equality constraints, solved
// by the nullspace method (Golub & Van Loan, Matrix Computations, 4th ed., §6.2): a QR
// factorisation of the constraint matrix gives a particular solution and a basis of its
// nullspace, and the remaining unconstrained problem is solved by column-pivoted QR.
// The constraints therefore hold to rounding, unlike a penalty.
//
// Why these choices:
// - τ = T/1000 K keeps the columns of the design matrix within a few orders of magnitude
//   of each other (T⁴ at 6000 K is 1.3e15; τ⁴ is 1296); coefficients are converted back
//   to kelvin afterwards.
// - The objective is the relative Cp error, Σ [(Cp_fit − Cp)/Cp]², because the warning
//   threshold and the users' tolerance are relative; Cp/R is floored at 0.5 in the weight
//   so that a nearly frozen adsorbate at low T does not dominate the fit.
// - H and S are not in the objective: they follow from Cp by integration, and their two
//   constants per range are fixed exactly by the joint and 298.15 K constraints.
#include "vibtherm/fit_nasa.hpp"

#include <fmt/format.h>

#include <Eigen/Dense>
#include <algorithm>
#include <charconv>
#include <cmath>
#include <limits>

#include "fit_terms.hpp"
#include "vibtherm/composition.hpp"
#include "vibtherm/constants.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/fit_plan.hpp"
#include "vibtherm/limits.hpp"

namespace vibtherm {

using namespace fit_detail;

namespace {

constexpr double kBoundsTolerance_Cp_over_R = 1e-6;
constexpr double R = constants::gas_constant_J_per_mol_K;

const char* form_name(NasaForm form) { return form == NasaForm::nasa7 ? "NASA-7" : "NASA-9"; }

std::vector<RangeErrors> errors_of(const FitInput& in, const std::vector<Nasa9Range>& ranges) {
  std::vector<RangeErrors> out;
  std::vector<double> bp;
  for (const auto& r : ranges) bp.push_back(r.T_low_K);
  bp.push_back(ranges.back().T_high_K);
  for (int r = 0; r < static_cast<int>(ranges.size()); ++r) {
    RangeErrors e;
    e.T_low_K = bp[r];
    e.T_high_K = bp[r + 1];
    double s_cp_rel = 0, s_cp = 0, s_h = 0, s_s = 0;
    for (const FitSample& s : in.samples) {
      if (!in_range(bp, r, s.T_K)) continue;
      const NasaProperties p = nasa9_properties(ranges[r], s.T_K);
      const double dcp = p.Cp_over_R - s.Cp_over_R;
      const double rel = std::abs(dcp) / std::max(std::abs(s.Cp_over_R), 1e-300);
      const double dh = p.H_over_RT - s.H_over_R / s.T_K;
      const double ds = p.S_over_R - s.S_over_R;
      ++e.samples;
      if (rel > e.max_Cp_relative) {
        e.max_Cp_relative = rel;
        e.T_at_max_Cp_K = s.T_K;
      }
      e.max_Cp_over_R = std::max(e.max_Cp_over_R, std::abs(dcp));
      e.max_H_over_RT = std::max(e.max_H_over_RT, std::abs(dh));
      e.max_S_over_R = std::max(e.max_S_over_R, std::abs(ds));
      e.max_H_J_per_mol = std::max(e.max_H_J_per_mol, std::abs(dh) * R * s.T_K);
      s_cp_rel += rel * rel;
      s_cp += dcp * dcp;
      s_h += dh * dh;
      s_s += ds * ds;
    }
    e.max_S_J_per_mol_K = e.max_S_over_R * R;
    if (e.samples > 0) {
      e.rms_Cp_relative = std::sqrt(s_cp_rel / e.samples);
      e.rms_Cp_over_R = std::sqrt(s_cp / e.samples);
      e.rms_H_over_RT = std::sqrt(s_h / e.samples);
      e.rms_S_over_R = std::sqrt(s_s / e.samples);
    }
    out.push_back(e);
  }
  return out;
}

double worst_Cp_relative(const std::vector<RangeErrors>& errors) {
  double worst = 0.0;
  for (const auto& e : errors) worst = std::max(worst, e.max_Cp_relative);
  return worst;
}

std::vector<BoundsExcursion> excursions_of(const FitInput& in, const std::vector<Nasa9Range>& ranges) {
  std::vector<BoundsExcursion> out;
  std::vector<double> bp;
  for (const auto& r : ranges) bp.push_back(r.T_low_K);
  bp.push_back(ranges.back().T_high_K);
  BoundsExcursion* open = nullptr;
  for (const FitSample& s : in.samples) {
    if (s.T_K < bp.front() - kJointTolerance_K || s.T_K > bp.back() + kJointTolerance_K) continue;
    const double cp = nasa9_properties(ranges[range_index_of(bp, s.T_K)], s.T_K).Cp_over_R;
    const double upper = in.bounds.upper_over_R + s.electronic_Cp_over_R;
    const double lower = in.bounds.lower_over_R;
    int side = 0;
    if (cp > upper + kBoundsTolerance_Cp_over_R) side = 1;
    if (cp < lower - kBoundsTolerance_Cp_over_R) side = -1;
    if (side == 0) {
      open = nullptr;
      continue;
    }
    if (open == nullptr || open->above != (side > 0)) {
      out.push_back(BoundsExcursion{s.T_K, s.T_K, side > 0, cp, side > 0 ? upper : lower});
      open = &out.back();
    }
    open->T_to_K = s.T_K;
    if ((side > 0 && cp > open->worst_Cp_over_R) || (side < 0 && cp < open->worst_Cp_over_R)) {
      open->worst_Cp_over_R = cp;
      open->bound_over_R = side > 0 ? upper : lower;
    }
  }
  return out;
}

double parse_number(std::string_view text, std::string_view whole) {
  double value = 0.0;
  const char* end = text.data() + text.size();
  auto [ptr, ec] = std::from_chars(text.data(), end, value);
  if (ec != std::errc() || ptr != end || !std::isfinite(value))
    fail({}, fmt::format("--range '{}': '{}' is not a temperature in K (expected e.g. 200:1000:3000)", whole,
                         text));
  return value;
}

}  // namespace

FitRange default_fit_range(NasaForm form) {
  if (form == NasaForm::nasa7) return FitRange{{200.0, 1000.0, 3000.0}, -1};
  return FitRange{{200.0, 1000.0, 6000.0}, -1};
}

FitRange parse_fit_range(std::string_view text, NasaForm form) {
  FitRange out;
  std::size_t start = 0;
  while (true) {
    const std::size_t colon = text.find(':', start);
    std::string_view part = text.substr(start, colon == std::string_view::npos ? text.npos : colon - start);
    while (!part.empty() && part.front() == ' ') part.remove_prefix(1);
    while (!part.empty() && part.back() == ' ') part.remove_suffix(1);
    if (part == "auto") {
      if (out.auto_index >= 0) fail({}, fmt::format("--range '{}': only one breakpoint may be 'auto'", text));
      out.auto_index = static_cast<int>(out.breakpoints_K.size());
      out.breakpoints_K.push_back(std::numeric_limits<double>::quiet_NaN());
    } else {
      out.breakpoints_K.push_back(parse_number(part, text));
    }
    if (colon == std::string_view::npos) break;
    start = colon + 1;
  }
  const auto n = out.breakpoints_K.size();
  if (form == NasaForm::nasa7 && n != 3)
    fail({}, fmt::format("--range '{}': NASA-7 needs TLOW:TMID:THIGH (3 values), got {}", text, n));
  if (n < 2) fail({}, fmt::format("--range '{}': need at least TLOW:THIGH", text));
  if (out.auto_index == 0 || out.auto_index == static_cast<int>(n) - 1)
    fail({}, fmt::format("--range '{}': only an inner breakpoint may be 'auto'", text));
  double last = 0.0;
  for (std::size_t i = 0; i < n; ++i) {
    const double t = out.breakpoints_K[i];
    if (std::isnan(t)) continue;
    if (t <= 0.0 || t <= last)
      fail({}, fmt::format("--range '{}': temperatures must be positive and ascending", text));
    limits::check_temperature(t,
                              fmt::format("--range '{}': breakpoint {}", limits::display_name(text), i + 1));
    last = t;
  }
  return out;
}

FitResult fit_samples(const FitInput& input, const FitOptions& options) {
  std::vector<double> temperatures;
  for (const FitSample& s : input.samples) temperatures.push_back(s.T_K);
  return fit_samples(input, FitPlan(options, std::move(temperatures)));
}

FitResult fit_samples(const FitInput& input, const FitPlan& plan) {
  const FitOptions& options = plan.options();
  for (std::size_t i = 0; i < input.samples.size() && i < plan.grid_K().size(); ++i)
    if (std::abs(input.samples[i].T_K - plan.grid_K()[i]) > kJointTolerance_K)
      fail({}, fmt::format("NASA fit: sample {} at {:g} K is off the plan's grid ({:g} K)", i + 1,
                           input.samples[i].T_K, plan.grid_K()[i]));
  FitResult result;
  result.name = input.name;
  result.form = options.form;
  result.bounds = input.bounds;
  std::size_t chosen = 0;
  if (options.range.auto_index >= 0) {
    // Search the `auto` breakpoint on its candidates for the smallest maximum relative Cp error.
    double best = 0.0;
    chosen = plan.best_candidate(input, best);
    result.searched_index = options.range.auto_index;
  }
  result.breakpoints_K = plan.breakpoints_K(chosen);
  result.ranges = plan.solve(chosen, input);
  for (const Nasa9Range& r : result.ranges) {
    bool ok = std::isfinite(r.b1) && std::isfinite(r.b2);
    for (double a : r.a) ok = ok && std::isfinite(a);
    if (!ok)
      fail({}, fmt::format("species '{}': the NASA fit {:g}-{:g} K gave a coefficient that is not finite",
                           limits::display_name(input.name), r.T_low_K, r.T_high_K));
  }
  result.errors = errors_of(input, result.ranges);
  if (options.range.auto_index >= 0) result.searched_max_Cp_relative = worst_Cp_relative(result.errors);
  result.excursions = excursions_of(input, result.ranges);

  const FitThresholds& th = options.thresholds;
  for (const auto& e : result.errors) {
    if (e.max_Cp_relative > th.Cp_relative)
      result.warnings.push_back(
          fmt::format("{}: {} fit {:g}-{:g} K: max Cp error {:.3f} % at {:g} K exceeds {:g} %", input.name,
                      form_name(options.form), e.T_low_K, e.T_high_K, 100 * e.max_Cp_relative,
                      e.T_at_max_Cp_K, 100 * th.Cp_relative));
    if (e.max_H_J_per_mol > th.H_J_per_mol)
      result.warnings.push_back(fmt::format(
          "{}: {} fit {:g}-{:g} K: max H error {:.3f} kJ/mol exceeds {:g} kJ/mol", input.name,
          form_name(options.form), e.T_low_K, e.T_high_K, e.max_H_J_per_mol / 1000, th.H_J_per_mol / 1000));
    if (e.max_S_J_per_mol_K > th.S_J_per_mol_K)
      result.warnings.push_back(
          fmt::format("{}: {} fit {:g}-{:g} K: max S error {:.3f} J/(mol K) exceeds {:g}", input.name,
                      form_name(options.form), e.T_low_K, e.T_high_K, e.max_S_J_per_mol_K, th.S_J_per_mol_K));
  }
  // Every excursion is listed; one within the Cp threshold of its bound is the fit's own
  // error near an asymptote (Cp → 4R at low T) rather than ringing, so only larger ones warn.
  for (const auto& x : result.excursions) {
    if (std::abs(x.worst_Cp_over_R - x.bound_over_R) <= th.Cp_relative * x.bound_over_R) continue;
    result.warnings.push_back(fmt::format(
        "{}: fitted Cp/R {} its {} bound between {:g} and {:g} K (worst {:.4f}, bound {:.4f})", input.name,
        x.above ? "exceeds" : "falls below", x.above ? "classical (upper)" : "translation+rotation (lower)",
        x.T_from_K, x.T_to_K, x.worst_Cp_over_R, x.bound_over_R));
  }
  return result;
}

SpeciesFit fit_species(const PreparedSpecies& prepared, const FitOptions& options) {
  return fit_species(prepared, FitPlan(options));
}

SpeciesFit fit_species(const PreparedSpecies& prepared, const FitPlan& plan) {
  const FitOptions& options = plan.options();
  const Species& sp = prepared.species;
  SpeciesFit out;
  // The key is missing, so the error names the file, not a line of it.
  if (!sp.enthalpy_of_formation_J_per_mol && !options.allow_missing_hf)
    fail({sp.origin.file, 0, 0},
         fmt::format(
             "species '{}' has no enthalpy of formation, which a NASA polynomial needs "
             "(H(298.15 K) = ΔfH°): add `enthalpy_of_formation: VALUE` (kJ/mol, or {{value, unit}}) "
             "to the species file, give 'electronic_energy' with a method file (--method) or reactions "
             "(--formation-reactions) to compute it, or pass --allow-missing-hf to write H(298.15 K) = 0",
             sp.name));
  out.enthalpy_of_formation_missing = !sp.enthalpy_of_formation_J_per_mol.has_value();
  out.enthalpy_of_formation_J_per_mol = sp.enthalpy_of_formation_J_per_mol.value_or(0.0);
  if (out.enthalpy_of_formation_missing)
    out.notes.push_back("enthalpy of formation missing: H(298.15 K) set to 0 (--allow-missing-hf)");
  if (!prepared.enthalpy_of_formation_route.empty())
    out.notes.push_back("enthalpy of formation from " + prepared.enthalpy_of_formation_route);

  const ThermoPoint ref = evaluate(prepared, constants::reference_temperature_K);
  // A hindered rotor's Cv/R passes its free-rotor limit ½ near the barrier-crossing
  // temperature (Pitzer & Gwinn 1942, from memory); that excess joins the allowance.
  const double rotor_limit = 0.5 * static_cast<double>(prepared.hindered_rotors.size());
  const auto rotor_excess = [rotor_limit](const ThermoPoint& p) {
    return std::max(0.0, p.internal_rotation.Cp_over_R - rotor_limit);
  };
  out.S298_J_per_mol_K = ref.S_J_per_mol_K;
  out.H298_minus_H0_J_per_mol = ref.H_minus_H0_J_per_mol;

  FitInput in;
  in.name = sp.name;
  in.H298_over_R = out.enthalpy_of_formation_J_per_mol / R;
  in.S298_over_R = ref.S_J_per_mol_K / R;
  for (const ThermoPoint& p : tabulate(prepared, plan.grid_K())) {
    in.samples.push_back(FitSample{p.T_K, p.Cp_J_per_mol_K / R,
                                   (out.enthalpy_of_formation_J_per_mol + p.H_minus_H298_J_per_mol) / R,
                                   p.S_J_per_mol_K / R, p.electronic.Cp_over_R + rotor_excess(p)});
  }
  // Equipartition bounds (common practice): Cp = Cv + R for an ideal gas; the lower
  // bound is translation (3/2) + rotation (0, 1, 3/2) + 1.
  const double rotation = prepared.rotor.type == RotorType::atom     ? 0.0
                          : prepared.rotor.type == RotorType::linear ? 1.0
                                                                     : 1.5;
  in.bounds.lower_over_R = prepared.is_gas ? 2.5 + rotation : 0.0;
  in.bounds.upper_over_R = classical_Cv_over_R(prepared) + (prepared.is_gas ? 1.0 : 0.0);

  out.fit = fit_samples(in, plan);
  out.input = std::move(in);
  out.molar_mass_g_per_mol = species_molar_mass_g_per_mol(sp);
  const auto composition = species_composition(sp);

  if (options.form == NasaForm::nasa7) {
    Nasa7 n;
    n.name = sp.name;
    n.note = out.enthalpy_of_formation_missing ? "noHf" : prepared.hindered_rotors.empty() ? "RRHO" : "RRHR";
    n.composition = composition;
    n.phase = prepared.is_gas ? 'G' : 'S';
    n.T_low_K = out.fit.breakpoints_K[0];
    n.T_mid_K = out.fit.breakpoints_K[1];
    n.T_high_K = out.fit.breakpoints_K[2];
    for (int k = 0; k < 5; ++k) {
      n.low[k] = out.fit.ranges[0].a[k + 2];
      n.high[k] = out.fit.ranges[1].a[k + 2];
    }
    n.low[5] = out.fit.ranges[0].b1;
    n.low[6] = out.fit.ranges[0].b2;
    n.high[5] = out.fit.ranges[1].b1;
    n.high[6] = out.fit.ranges[1].b2;
    n.comments = out.notes;
    out.polynomial = n;
  } else {
    Nasa9 n;
    n.name = sp.name;
    // Record 1 leaves 62 columns for the comment, so the note is stated briefly here and
    // in full in the JSON form.
    n.comment = "vibtherm " VIBTHERM_VERSION " RRHO fit";
    if (out.enthalpy_of_formation_missing) n.comment += "; H298=0: enthalpy of formation missing";
    n.date_code = out.enthalpy_of_formation_missing  ? "noHf"
                  : prepared.hindered_rotors.empty() ? "RRHO"
                                                     : "RRHR";
    n.composition = composition;
    n.phase = prepared.is_gas ? 0 : 1;
    n.molar_mass_g_per_mol = out.molar_mass_g_per_mol;
    n.enthalpy_of_formation_J_per_mol = out.enthalpy_of_formation_J_per_mol;
    n.H298_minus_H0_J_per_mol = out.H298_minus_H0_J_per_mol;
    n.ranges = out.fit.ranges;
    out.polynomial = n;
  }
  return out;
}

}  // namespace vibtherm
