// The species-independent half of the constrained least squares of fit_nasa.cpp (method
// and reasons there): the Cp basis on the grid and the QR factorisation of the
// constraints, whose nullspace basis N turns the fit into an unconstrained one.
#include "vibtherm/fit_plan.hpp"

#include <fmt/format.h>

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <limits>
#include <numeric>

#include "fit_terms.hpp"
#include "vibtherm/constants.hpp"
#include "vibtherm/error.hpp"
#include "vibtherm/limits.hpp"

namespace vibtherm {

using namespace fit_detail;

struct FitPlan::System {
  std::vector<double> bp;
  int m = 0, per = 0, nr = 0, n = 0, p = 0;
  std::vector<std::pair<int, int>> rows;  // (sample, range), one row per range holding the sample
  Eigen::MatrixXd basis;                  // unweighted Cp basis, rows × n
  Eigen::MatrixXd Q1, R1, N;              // Cᵀ P = Q [R1; 0], Q = [Q1 N]
  Eigen::MatrixXd basis_N, basis_Q1;      // basis · N and basis · Q1: a species only weights rows
  Eigen::PermutationMatrix<Eigen::Dynamic, Eigen::Dynamic> P;
};

namespace {

std::unique_ptr<const FitPlan::System> build_system(const std::vector<double>& grid,
                                                    const std::vector<double>& bp, NasaForm form,
                                                    bool slope_continuous) {
  auto s = std::make_unique<FitPlan::System>();
  s->bp = bp;
  const std::vector<int> ex = exponents_of(form);
  const int m = s->m = static_cast<int>(ex.size());
  const int per = s->per = m + 2;  // α_0..α_{m-1}, β_H, β_S
  const int nr = s->nr = static_cast<int>(bp.size()) - 1;
  const int n = s->n = nr * per;

  for (int i = 0; i < static_cast<int>(grid.size()); ++i)
    for (int r = 0; r < nr; ++r)
      if (in_range(bp, r, grid[i])) s->rows.emplace_back(i, r);
  for (int r = 0; r < nr; ++r) {
    const auto count =
        std::count_if(s->rows.begin(), s->rows.end(), [r](const auto& row) { return row.second == r; });
    if (count < m)
      fail({}, fmt::format("fit range {:g}-{:g} K holds {} grid points, fewer than its {} coefficients: "
                           "widen the range or refine the grid",
                           bp[r], bp[r + 1], count, m));
  }
  s->basis = Eigen::MatrixXd::Zero(static_cast<Eigen::Index>(s->rows.size()), n);
  for (std::size_t j = 0; j < s->rows.size(); ++j) {
    const int r = s->rows[j].second;
    const double tau = grid[s->rows[j].first] / kScale_K;
    for (int k = 0; k < m; ++k) s->basis(j, r * per + k) = cp_term(ex[k], tau);
  }

  // Equality constraints: at every joint Cp (and dCp/dT), H and S equal on both sides;
  // at 298.15 K, H and S take the species' values (the right-hand side, per species).
  std::vector<Eigen::VectorXd> crow;
  auto joint = [&](int r, double tau, auto basis, int beta) {
    Eigen::VectorXd c = Eigen::VectorXd::Zero(n);
    for (int k = 0; k < m; ++k) {
      c(r * per + k) = basis(ex[k], tau);
      c((r + 1) * per + k) = -basis(ex[k], tau);
    }
    if (beta >= 0) {
      c(r * per + m + beta) = 1.0;
      c((r + 1) * per + m + beta) = -1.0;
    }
    crow.push_back(c);
  };
  for (int r = 0; r + 1 < nr; ++r) {
    const double tau = bp[r + 1] / kScale_K;
    joint(r, tau, cp_term, -1);
    if (slope_continuous) joint(r, tau, dcp_term, -1);
    joint(r, tau, h_term, 0);
    joint(r, tau, s_term, 1);
  }
  {
    const double T0 = constants::reference_temperature_K;
    const int r = range_index_of(bp, T0);
    const double tau = T0 / kScale_K;
    Eigen::VectorXd ch = Eigen::VectorXd::Zero(n), cs = Eigen::VectorXd::Zero(n);
    for (int k = 0; k < m; ++k) {
      ch(r * per + k) = h_term(ex[k], tau);
      cs(r * per + k) = s_term(ex[k], tau);
    }
    ch(r * per + m) = 1.0;
    cs(r * per + m + 1) = 1.0;
    crow.push_back(ch);
    crow.push_back(cs);
  }
  const int p = s->p = static_cast<int>(crow.size());
  Eigen::MatrixXd Ct(n, p);
  for (int i = 0; i < p; ++i) Ct.col(i) = crow[i];

  // Nullspace method (Golub & Van Loan, §6.2): Cᵀ P = Q [R1; 0]; x = Q1 R1⁻ᵀ Pᵀ d + N z.
  Eigen::ColPivHouseholderQR<Eigen::MatrixXd> cqr(Ct);
  if (cqr.rank() < p) fail({}, "NASA fit: the continuity and 298.15 K constraints are linearly dependent");
  const Eigen::MatrixXd Q = cqr.householderQ();
  s->R1 = cqr.matrixR().topLeftCorner(p, p).triangularView<Eigen::Upper>();
  s->P = cqr.colsPermutation();
  s->Q1 = Q.leftCols(p);
  s->N = Q.rightCols(n - p);
  s->basis_N = s->basis * s->N;
  s->basis_Q1 = s->basis * s->Q1;
  return s;
}

std::vector<double> grid_of(const FitOptions& options) {
  const auto& bp = options.range.breakpoints_K;
  const double T_lo = bp.front(), T_hi = bp.back();
  limits::check_range(options.grid_step_K, limits::min_grid_step_K, T_hi - T_lo, "--grid-step", "K");
  if ((T_hi - T_lo) / options.grid_step_K > static_cast<double>(limits::max_grid_points))
    fail({},
         fmt::format(
             "--grid-step {:g} K gives more than {} grid points over {:g}-{:g} K, expected a coarser step",
             options.grid_step_K, limits::max_grid_points, T_lo, T_hi));
  std::vector<double> grid;
  for (double t = T_lo; t < T_hi; t += options.grid_step_K) grid.push_back(t);
  for (double t : bp)
    if (!std::isnan(t)) grid.push_back(t);
  std::sort(grid.begin(), grid.end());
  grid.erase(std::unique(grid.begin(), grid.end(), [](double a, double b) { return std::abs(a - b) < 1e-9; }),
             grid.end());
  return grid;
}

}  // namespace

FitPlan::FitPlan(const FitOptions& options) : FitPlan(options, grid_of(options)) {}

FitPlan::FitPlan(const FitOptions& options, std::vector<double> grid_K)
    : options_(options), grid_K_(std::move(grid_K)) {
  std::vector<double> bp = options.range.breakpoints_K;
  const int ai = options.range.auto_index;
  if (ai < 0) {
    candidates_.push_back(bp);
  } else {
    // The `auto` breakpoint's candidates, every auto_step_K with margins to its neighbours.
    const double lo = bp[ai - 1] + options.auto_margin_K;
    const double hi = bp[ai + 1] - options.auto_margin_K;
    for (double t = std::ceil(lo / options.auto_step_K) * options.auto_step_K; t <= hi + 1e-9;
         t += options.auto_step_K) {
      bp[ai] = t;
      candidates_.push_back(bp);
    }
    if (candidates_.empty())
      fail({}, fmt::format("--range: no 'auto' candidate between {} and {} K (need {} K margins)", bp[ai - 1],
                           bp[ai + 1], options.auto_margin_K));
  }
  if (static_cast<double>(candidates_.size()) * static_cast<double>(grid_K_.size()) > 4e6)
    fail({},
         fmt::format(
             "--range: searching 'auto' over {} candidates on {} grid points is too much work, expected a "
             "narrower range or a coarser --grid-step",
             candidates_.size(), grid_K_.size()));
  for (const auto& c : candidates_)
    systems_.push_back(build_system(grid_K_, c, options.form, options.Cp_slope_continuous));
}

FitPlan::~FitPlan() = default;
FitPlan::FitPlan(FitPlan&&) noexcept = default;
FitPlan& FitPlan::operator=(FitPlan&&) noexcept = default;

std::vector<Nasa9Range> FitPlan::solve(std::size_t candidate, const FitInput& in) const {
  return solve(candidate, in, nullptr);
}

double FitPlan::worst_Cp_relative(std::size_t candidate, const FitInput& in) const {
  double worst = 0.0;
  solve(candidate, in, &worst);
  return worst;
}

std::vector<Nasa9Range> FitPlan::solve(std::size_t candidate, const FitInput& in, double* worst_Cp) const {
  const System& s = *systems_[candidate];
  if (in.samples.size() != grid_K_.size())
    fail({}, fmt::format("NASA fit: {} samples for a plan of {} grid temperatures", in.samples.size(),
                         grid_K_.size()));
  const std::vector<int> ex = exponents_of(options_.form);
  const int m = s.m, per = s.per;
  constexpr double kWeightFloor_Cp_over_R = 0.5;  // see fit_nasa.cpp
  Eigen::VectorXd d = Eigen::VectorXd::Zero(s.p);
  d(s.p - 2) = in.H298_over_R / kScale_K;
  d(s.p - 1) = in.S298_over_R;
  const Eigen::VectorXd Ptd = s.P.transpose() * d;
  const Eigen::VectorXd u = s.R1.transpose().triangularView<Eigen::Lower>().solve(Ptd);
  const Eigen::VectorXd x0 = s.Q1 * u;
  // Weighted rows: A = W basis, so A N = W (basis N) and A x0 = W (basis Q1) u.
  const Eigen::VectorXd fixed = s.basis_Q1 * u;
  Eigen::VectorXd w(s.basis.rows()), rhs(s.basis.rows());
  for (std::size_t j = 0; j < s.rows.size(); ++j) {
    const auto i = static_cast<Eigen::Index>(j);
    const double Cp = in.samples[s.rows[j].first].Cp_over_R;
    w(i) = 1.0 / std::max(Cp, kWeightFloor_Cp_over_R);
    rhs(i) = w(i) * (Cp - fixed(i));
  }
  Eigen::ColPivHouseholderQR<Eigen::MatrixXd> lsq(w.asDiagonal() * s.basis_N);
  const Eigen::VectorXd z = lsq.solve(rhs);
  const Eigen::VectorXd x = x0 + s.N * z;
  if (worst_Cp) {
    // The largest |Cp_fit − Cp|/Cp over the rows, from the scaled basis (no coefficients).
    const Eigen::VectorXd fitted = s.basis * x;
    *worst_Cp = 0.0;
    for (std::size_t j = 0; j < s.rows.size(); ++j) {
      const double Cp = in.samples[s.rows[j].first].Cp_over_R;
      *worst_Cp = std::max(
          *worst_Cp, std::abs(fitted(static_cast<Eigen::Index>(j)) - Cp) / std::max(std::abs(Cp), 1e-300));
    }
    return {};
  }

  // Back to kelvin: a_k = α_k / 1000^e_k; the ln T terms shift the constants
  // (H/R: e = −1 term α s ln τ = a ln T − a ln s; S/R: e = 0 term likewise).
  std::vector<Nasa9Range> out(s.nr);
  const double ln_s = std::log(kScale_K);
  for (int r = 0; r < s.nr; ++r) {
    Nasa9Range& range = out[r];
    range.T_low_K = s.bp[r];
    range.T_high_K = s.bp[r + 1];
    double bH = kScale_K * x(r * per + m);
    double bS = x(r * per + m + 1);
    for (int k = 0; k < m; ++k) {
      const double alpha = x(r * per + k);
      range.a[ex[k] + 2] = alpha / std::pow(kScale_K, ex[k]);
      if (ex[k] == -1) bH -= kScale_K * alpha * ln_s;
      if (ex[k] == 0) bS -= alpha * ln_s;
    }
    range.b1 = bH;
    range.b2 = bS;
  }
  return out;
}

namespace {

// The triangular factor R and Qᵀb of rows added one at a time (Givens rotations; Golub &
// Van Loan §5.1.8): min ‖A a − b‖ over the rows so far is min ‖R a − Qᵀb‖.
struct RowFactor {
  Eigen::MatrixXd R;
  Eigen::VectorXd q;
  explicit RowFactor(Eigen::Index m) : R(Eigen::MatrixXd::Zero(m, m)), q(Eigen::VectorXd::Zero(m)) {}
  void add(Eigen::VectorXd v, double y) {
    const Eigen::Index m = R.rows();
    for (Eigen::Index k = 0; k < m; ++k) {
      if (v(k) == 0.0) continue;
      const double r = std::hypot(R(k, k), v(k));
      const double c = R(k, k) / r, s = v(k) / r;
      for (Eigen::Index j = k; j < m; ++j) {
        const double a = R(k, j), b = v(j);
        R(k, j) = c * a + s * b;
        v(j) = c * b - s * a;
      }
      const double a = q(k);
      q(k) = c * a + s * y;
      y = c * y - s * a;
    }
  }
};

}  // namespace

std::size_t FitPlan::best_candidate(const FitInput& in, double& worst, std::size_t shortlist) const {
  const std::size_t count = candidates_.size();
  std::vector<std::size_t> order(count);
  std::iota(order.begin(), order.end(), std::size_t{0});
  const std::size_t n_grid = grid_K_.size();
  const int nr = count ? systems_[0]->nr : 0;
  // Each candidate's rows of range r are a run [first, last) of the grid (in_range).
  std::vector<std::vector<std::pair<std::size_t, std::size_t>>> span(count);
  for (std::size_t c = 0; c < count; ++c)
    for (int r = 0; r < nr; ++r) {
      std::size_t first = n_grid, last = 0;
      for (std::size_t i = 0; i < n_grid; ++i)
        if (in_range(candidates_[c], r, grid_K_[i])) first = std::min(first, i), last = i + 1;
      span[c].push_back({first, last});
    }
  // A range's runs share their start (grown forward) or their end (grown backward).
  std::vector<int> direction(static_cast<std::size_t>(nr), 0);  // +1 forward, −1 backward, 0 neither
  for (int r = 0; r < nr; ++r) {
    bool same_first = true, same_last = true;
    for (std::size_t c = 0; c < count; ++c) {
      same_first = same_first && span[c][r].first == span[0][r].first && span[c][r].first < span[c][r].second;
      same_last = same_last && span[c][r].second == span[0][r].second && span[c][r].first < span[c][r].second;
    }
    direction[static_cast<std::size_t>(r)] = same_first ? 1 : same_last ? -1 : 0;
  }
  // NASA-7 only: the NASA-9 basis (τ^−2 … τ^4 up to 6000 K) is too ill-conditioned for the
  // estimates to rank reliably, and its candidates are all solved exactly.
  const bool estimable = options_.form == NasaForm::nasa7 && count > shortlist &&
                         in.samples.size() == n_grid &&
                         std::none_of(direction.begin(), direction.end(), [](int d) { return d == 0; });
  if (estimable) {
    // Every candidate from the factors of its ranges' weighted rows, gathered in one pass per
    // range, then a constrained least squares of a few rows (stable: rotations only).
    const std::vector<int> ex = exponents_of(options_.form);
    const auto m = static_cast<Eigen::Index>(ex.size());
    constexpr double kWeightFloor_Cp_over_R = 0.5;  // see fit_nasa.cpp
    Eigen::MatrixXd terms(static_cast<Eigen::Index>(n_grid), m);
    for (std::size_t i = 0; i < n_grid; ++i)
      for (Eigen::Index k = 0; k < m; ++k)
        terms(static_cast<Eigen::Index>(i), k) =
            cp_term(ex[static_cast<std::size_t>(k)], grid_K_[i] / kScale_K);
    const auto weight = [&](std::size_t i) {
      return 1.0 / std::max(in.samples[i].Cp_over_R, kWeightFloor_Cp_over_R);
    };
    // factor[c][r]: the factor of candidate c's rows in range r.
    std::vector<std::vector<RowFactor>> factor(count);
    for (std::size_t c = 0; c < count; ++c) factor[c].assign(static_cast<std::size_t>(nr), RowFactor(m));
    for (int r = 0; r < nr; ++r) {
      std::vector<std::size_t> by_end(count);
      std::iota(by_end.begin(), by_end.end(), std::size_t{0});
      const bool forward = direction[static_cast<std::size_t>(r)] > 0;
      // The varying end, nearest first.
      const auto end_of = [&](std::size_t c) { return forward ? span[c][r].second : span[c][r].first; };
      std::sort(by_end.begin(), by_end.end(), [&](std::size_t a, std::size_t b) {
        return forward ? end_of(a) < end_of(b) : end_of(a) > end_of(b);
      });
      RowFactor running(m);
      std::size_t next =
          forward ? span[0][r].first : span[0][r].second;  // rows [first, next) or [next, last) done
      for (std::size_t c : by_end) {
        const std::size_t stop = end_of(c);
        while (forward ? next < stop : next > stop) {
          const std::size_t i = forward ? next++ : --next;
          const double w = weight(i);
          running.add(w * terms.row(static_cast<Eigen::Index>(i)).transpose(), w * in.samples[i].Cp_over_R);
        }
        factor[c][static_cast<std::size_t>(r)] = running;
      }
    }
    std::vector<double> estimate(count, std::numeric_limits<double>::infinity());
    for (std::size_t c = 0; c < count; ++c) {
      const System& s = *systems_[c];
      Eigen::MatrixXd S = Eigen::MatrixXd::Zero(nr * m, s.n);
      Eigen::VectorXd q(nr * m);
      for (int r = 0; r < nr; ++r) {
        S.block(r * m, r * s.per, m, m) = factor[c][static_cast<std::size_t>(r)].R;
        q.segment(r * m, m) = factor[c][static_cast<std::size_t>(r)].q;
      }
      Eigen::VectorXd d = Eigen::VectorXd::Zero(s.p);
      d(s.p - 2) = in.H298_over_R / kScale_K;
      d(s.p - 1) = in.S298_over_R;
      const Eigen::VectorXd u = s.R1.transpose().triangularView<Eigen::Lower>().solve(s.P.transpose() * d);
      const Eigen::VectorXd x0 = s.Q1 * u;
      const Eigen::ColPivHouseholderQR<Eigen::MatrixXd> small(S * s.N);
      // A nearly singular system (a range of a few grid points) is solved exactly instead.
      const Eigen::VectorXd diagonal = small.matrixR().diagonal().cwiseAbs();
      if (!(diagonal.minCoeff() > 1e-11 * diagonal.maxCoeff())) continue;
      const Eigen::VectorXd x = x0 + s.N * small.solve(q - S * x0);
      if (!x.allFinite()) continue;
      double largest = 0.0;
      for (int r = 0; r < nr; ++r)
        for (std::size_t i = span[c][r].first; i < span[c][r].second; ++i) {
          const double Cp = in.samples[i].Cp_over_R;
          const double fitted = terms.row(static_cast<Eigen::Index>(i)).dot(x.segment(r * s.per, m));
          largest = std::max(largest, std::abs(fitted - Cp) / std::max(std::abs(Cp), 1e-300));
        }
      estimate[c] = largest;
    }
    // The estimates rank; the shortlist, and any candidate without an estimate, decide
    // exactly (stable: ties keep the lower candidate).
    std::stable_sort(order.begin(), order.end(),
                     [&](std::size_t a, std::size_t b) { return estimate[a] < estimate[b]; });
    // Near ties (the largest error sits in a range the breakpoint barely moves) all go to
    // the exact comparison: within 1e-6 of the best estimate, far above the estimates' error.
    std::vector<std::size_t> kept(order.begin(), order.begin() + static_cast<std::ptrdiff_t>(shortlist));
    const double tie = estimate[order.front()] * (1.0 + 1e-6);
    for (std::size_t k = shortlist; k < count; ++k)
      if (!std::isfinite(estimate[order[k]]) || estimate[order[k]] <= tie) kept.push_back(order[k]);
    std::sort(kept.begin(), kept.end());
    // The exact errors of the shortlist check the estimates: one off by more than 1e-7 (a
    // range of a few grid points, nearly singular) and every candidate is solved exactly.
    std::size_t chosen = kept.front();
    worst = std::numeric_limits<double>::infinity();
    bool reliable = true;
    for (std::size_t c : kept) {
      const double e = worst_Cp_relative(c, in);
      reliable = reliable && std::abs(e - estimate[c]) <= 1e-7 * e;
      if (e < worst) worst = e, chosen = c;
    }
    if (reliable) return chosen;
  }
  std::size_t chosen = 0;
  worst = std::numeric_limits<double>::infinity();
  for (std::size_t c : order) {
    const double e = worst_Cp_relative(c, in);
    if (e < worst) worst = e, chosen = c;
  }
  return chosen;
}

}  // namespace vibtherm
