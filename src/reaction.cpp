// Reaction thermochemistry: balance, tables of ΔrH°, ΔrS°, ΔrG°, Kp, Kc, the ln K fit and
// the reaction route to an unknown enthalpy of formation.
#include "vibtherm/reaction.hpp"

#include <fmt/format.h>

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <map>

#include "vibtherm/constants.hpp"

namespace vibtherm {
namespace {

constexpr double standard_concentration_mol_per_m3 = 1000.0;  // c° = 1 mol/L

std::string number_text(double v) { return fmt::format("{:g}", v); }

// The pressure of the species' standard state at T, and the pressure Kp refers to.
std::pair<double, double> state_and_reference_Pa(const ModelOptions& o, double T_K) {
  if (o.standard_state == StandardState::molar)
    return {standard_concentration_mol_per_m3 * constants::gas_constant_J_per_mol_K * T_K, constants::bar_Pa};
  return {o.pressure_Pa, o.pressure_Pa};
}

}  // namespace

const char* enthalpy_basis_name(EnthalpyBasis basis) {
  return basis == EnthalpyBasis::electronic ? "electronic energies" : "enthalpies of formation";
}

std::string reaction_equation(const Reaction& reaction) {
  std::string left, right;
  for (const auto& t : reaction.terms) {
    std::string& side = t.coefficient < 0 ? left : right;
    const double n = std::abs(t.coefficient);
    if (!side.empty()) side += " + ";
    side += (n == 1.0 ? std::string() : number_text(n) + " ") + t.prepared.species.name;
  }
  return left + " = " + right;
}

void check_reaction_balance(const Reaction& reaction) {
  std::map<std::string, double> surplus;
  double scale = 0.0;
  for (const auto& t : reaction.terms) {
    const Species& s = t.prepared.species;
    if (s.phase == Phase::adsorbate)
      fail(reaction.origin,
           fmt::format("reaction '{}': species '{}' is an adsorbate, expected gas-phase species "
                       "only (surface reactions are not supported)",
                       reaction.name, s.name));
    for (const auto& [element, count] : s.formula) {
      surplus[element] += t.coefficient * count;
      scale = std::max(scale, std::abs(t.coefficient * count));
    }
  }
  double charge = 0.0;
  for (const auto& t : reaction.terms) charge += t.coefficient * t.prepared.species.charge;
  if (std::abs(charge) > 1e-9 * std::max(1.0, scale))
    fail(reaction.origin,
         fmt::format("reaction '{}' does not balance in charge: products minus reactants {:+g} e, "
                     "expected equal charge on both sides",
                     reaction.name, charge));
  std::string off;
  for (const auto& [element, n] : surplus)
    if (std::abs(n) > 1e-9 * std::max(1.0, scale))
      off += fmt::format("{}{} {:+g}", off.empty() ? "" : ", ", element, n);
  if (!off.empty())
    fail(reaction.origin,
         fmt::format("reaction '{}' does not balance: products minus reactants {}, expected every "
                     "element to balance (check the coefficients)",
                     reaction.name, off));
}

EnthalpyBasis choose_enthalpy_basis(const Reaction& reaction) {
  const auto all = [&](auto has) {
    return std::all_of(reaction.terms.begin(), reaction.terms.end(),
                       [&](const ReactionTerm& t) { return has(t); });
  };
  if (all([](const ReactionTerm& t) { return t.prepared.species.electronic_energy_J_per_mol.has_value(); }))
    return EnthalpyBasis::electronic;
  if (all([](const ReactionTerm& t) {
        return t.prepared.species.enthalpy_of_formation_J_per_mol.has_value();
      }))
    return EnthalpyBasis::formation;
  for (const auto& t : reaction.terms) {
    const Species& s = t.prepared.species;
    if (!s.electronic_energy_J_per_mol && !s.enthalpy_of_formation_J_per_mol)
      fail(s.origin, fmt::format("species '{}' (reaction '{}') has neither 'electronic_energy' nor "
                                 "'enthalpy_of_formation', expected one of them for the reaction enthalpy",
                                 s.name, reaction.name));
  }
  fail(reaction.origin,
       fmt::format("reaction '{}' mixes species with only 'electronic_energy' and species with only "
                   "'enthalpy_of_formation', expected one basis for all (give every species an "
                   "enthalpy of formation, or every one an electronic energy)",
                   reaction.name));
}

ReactionTable reaction_table(const Reaction& reaction, const std::vector<double>& temperatures_K) {
  check_reaction_balance(reaction);
  ReactionTable table;
  table.name = reaction.name;
  table.equation = reaction_equation(reaction);
  table.basis = choose_enthalpy_basis(reaction);
  for (const auto& t : reaction.terms) table.delta_n += t.coefficient;
  const double R = constants::gas_constant_J_per_mol_K;
  for (double T : temperatures_K) {
    ReactionRow row;
    row.T_K = T;
    double p_state = 0.0, p_ref = 0.0;
    for (const auto& t : reaction.terms) {
      const ThermoPoint point = evaluate(t.prepared, T);
      const Species& s = t.prepared.species;
      const double H = table.basis == EnthalpyBasis::electronic
                           ? *s.electronic_energy_J_per_mol + t.prepared.zero_point_energy_J_per_mol +
                                 point.H_minus_H0_J_per_mol
                           : *s.enthalpy_of_formation_J_per_mol + point.H_minus_H298_J_per_mol;
      row.delta_H_J_per_mol += t.coefficient * H;
      row.delta_S_J_per_mol_K += t.coefficient * point.S_J_per_mol_K;
      std::tie(p_state, p_ref) = state_and_reference_Pa(t.prepared.options, T);
    }
    row.delta_G_J_per_mol = row.delta_H_J_per_mol - T * row.delta_S_J_per_mol_K;
    const double ln_K_state = -row.delta_G_J_per_mol / (R * T);
    const double ln_Kp = ln_K_state + table.delta_n * std::log(p_state / p_ref);
    row.ln_Kp = ln_Kp;
    row.ln_Kc = ln_Kp + table.delta_n * std::log(p_ref / (R * T * standard_concentration_mol_per_m3));
    row.Kp = std::exp(row.ln_Kp);
    row.Kc = std::exp(row.ln_Kc);
    table.Kp_reference_Pa = p_ref;
    table.rows.push_back(row);
  }
  return table;
}

LnKFit fit_ln_K(const std::vector<ReactionRow>& rows, bool concentration) {
  std::vector<double> Ts;
  for (const auto& r : rows) Ts.push_back(r.T_K);
  std::sort(Ts.begin(), Ts.end());
  if (std::unique(Ts.begin(), Ts.end()) - Ts.begin() < 3)
    fail({}, "the ln K fit needs at least three different temperatures, expected e.g. --temps 300:2000:100");
  const double R = constants::gas_constant_J_per_mol_K;
  Eigen::MatrixXd X(static_cast<Eigen::Index>(rows.size()), 3);
  Eigen::VectorXd y(static_cast<Eigen::Index>(rows.size()));
  for (std::size_t i = 0; i < rows.size(); ++i) {
    const double T = rows[i].T_K;
    const auto k = static_cast<Eigen::Index>(i);
    X(k, 0) = 1.0;
    X(k, 1) = std::log(T);
    X(k, 2) = -1.0 / (R * T) * 1e3;  // E in kJ/mol keeps the columns of similar size
    y(k) = concentration ? rows[i].ln_Kc : rows[i].ln_Kp;
  }
  const Eigen::Vector3d c = X.colPivHouseholderQr().solve(y);
  LnKFit fit;
  fit.A = std::exp(c(0));
  fit.n = c(1);
  fit.E_J_per_mol = c(2) * 1e3;
  fit.max_abs_deviation_ln = (X * c - y).cwiseAbs().maxCoeff();
  return fit;
}

UnknownFormation solve_unknown_formation(const Reaction& reaction, std::size_t unknown) {
  check_reaction_balance(reaction);
  for (const auto& t : reaction.terms)
    if (!t.prepared.species.electronic_energy_J_per_mol)
      fail(t.prepared.species.origin,
           fmt::format("species '{}' has no 'electronic_energy', expected one: reaction '{}' solves for an "
                       "enthalpy of formation from electronic energies",
                       t.prepared.species.name, reaction.name));
  UnknownFormation out;
  double known = 0.0;
  for (std::size_t i = 0; i < reaction.terms.size(); ++i) {
    const auto& t = reaction.terms[i];
    const Species& s = t.prepared.species;
    out.delta_rH298_J_per_mol +=
        t.coefficient * (*s.electronic_energy_J_per_mol + t.prepared.zero_point_energy_J_per_mol +
                         t.prepared.H298_minus_H0_J_per_mol);
    if (i == unknown) continue;
    if (!s.enthalpy_of_formation_J_per_mol)
      fail(s.origin,
           fmt::format("species '{}' has no 'enthalpy_of_formation', expected a known value: only the "
                       "unknown of reaction '{}' may lack one",
                       s.name, reaction.name));
    known += t.coefficient * *s.enthalpy_of_formation_J_per_mol;
  }
  out.dfH298_J_per_mol = (out.delta_rH298_J_per_mol - known) / reaction.terms[unknown].coefficient;
  return out;
}

Spread spread_of(const std::vector<double>& values) {
  Spread s;
  if (values.empty()) return s;
  s.min = *std::min_element(values.begin(), values.end());
  s.max = *std::max_element(values.begin(), values.end());
  for (double v : values) s.mean += v;
  s.mean /= static_cast<double>(values.size());
  if (values.size() > 1) {
    double ss = 0.0;
    for (double v : values) ss += (v - s.mean) * (v - s.mean);
    s.standard_deviation = std::sqrt(ss / static_cast<double>(values.size() - 1));
  }
  return s;
}

}  // namespace vibtherm
