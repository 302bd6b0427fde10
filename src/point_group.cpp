#include "vibtherm/point_group.hpp"

#include <fmt/format.h>

#include <Eigen/Geometry>
#include <Eigen/SVD>
#include <algorithm>
#include <cmath>
#include <map>
#include <numeric>
#include <set>
#include <utility>

namespace vibtherm {

namespace {

// The first atom assignment of a candidate operation accepts images this far from an
// atom (Å); the least-squares refinement and the strict tolerance then decide. Equivalent
// atoms closer than twice this do not occur in molecules (H2 is 0.74 Å).
constexpr double assignment_radius_angstrom = 0.3;

struct Operation {
  Eigen::Matrix3d matrix;
  int det = 1;
  std::vector<int> permutation;  // atom i goes to permutation[i]
  int order = 1;
};

struct Centred {
  std::vector<Eigen::Vector3d> r;  // about the centre of mass
  std::vector<int> kind;           // same element and mass number: same kind
};

Centred centre(const std::vector<Atom>& atoms) {
  Centred c;
  std::map<std::pair<std::string, int>, int> kinds;
  Eigen::Vector3d com = Eigen::Vector3d::Zero();
  double mass = 0.0;
  for (const Atom& a : atoms) {
    com += a.mass_amu * a.position_angstrom;
    mass += a.mass_amu;
    c.kind.push_back(
        kinds.try_emplace({a.symbol, a.mass_number}, static_cast<int>(kinds.size())).first->second);
  }
  if (mass > 0.0) com /= mass;
  for (const Atom& a : atoms) c.r.push_back(a.position_angstrom - com);
  return c;
}

// The atom of kind `kind` nearest to `x`, or -1 when none is within `radius`.
int nearest(const Centred& c, const Eigen::Vector3d& x, int kind, double radius) {
  int best = -1;
  double best_d = radius;
  for (std::size_t j = 0; j < c.r.size(); ++j) {
    if (c.kind[j] != kind) continue;
    const double d = (c.r[j] - x).norm();
    if (d <= best_d) best = static_cast<int>(j), best_d = d;
  }
  return best;
}

// The permutation `matrix` induces (each image to its nearest equivalent atom), or empty
// when an image has no partner or two images share one.
std::vector<int> assign(const Centred& c, const Eigen::Matrix3d& matrix, double radius) {
  std::vector<int> perm(c.r.size(), -1);
  std::vector<char> used(c.r.size(), 0);
  for (std::size_t i = 0; i < c.r.size(); ++i) {
    const int j = nearest(c, matrix * c.r[i], c.kind[i], radius);
    if (j < 0 || used[static_cast<std::size_t>(j)]) return {};
    used[static_cast<std::size_t>(j)] = 1;
    perm[i] = j;
  }
  return perm;
}

// Least-squares orthogonal map with determinant `det` sending r_i to r_perm(i) (Kabsch).
Eigen::Matrix3d refine(const Centred& c, const std::vector<int>& perm, int det) {
  Eigen::Matrix3d m = Eigen::Matrix3d::Zero();
  for (std::size_t i = 0; i < c.r.size(); ++i)
    m += c.r[static_cast<std::size_t>(perm[i])] * c.r[i].transpose();
  Eigen::JacobiSVD<Eigen::Matrix3d> svd(m, Eigen::ComputeFullU | Eigen::ComputeFullV);
  const Eigen::Matrix3d u = svd.matrixU();
  const Eigen::Matrix3d v = svd.matrixV();
  Eigen::Matrix3d d = Eigen::Matrix3d::Identity();
  d(2, 2) = (u * v.transpose()).determinant() * det > 0 ? 1.0 : -1.0;
  return u * d * v.transpose();
}

double largest_deviation(const Centred& c, const Eigen::Matrix3d& matrix, const std::vector<int>& perm) {
  double worst = 0.0;
  for (std::size_t i = 0; i < c.r.size(); ++i)
    worst = std::max(worst, (matrix * c.r[i] - c.r[static_cast<std::size_t>(perm[i])]).norm());
  return worst;
}

int permutation_order(const std::vector<int>& perm) {
  std::vector<char> seen(perm.size(), 0);
  int order = 1;
  for (std::size_t i = 0; i < perm.size(); ++i) {
    int length = 0;
    for (std::size_t j = i; !seen[j]; j = static_cast<std::size_t>(perm[j])) seen[j] = 1, ++length;
    if (length > 0) order = std::lcm(order, length);
  }
  return order;
}

Eigen::Matrix3d frame(const Eigen::Vector3d& u, const Eigen::Vector3d& v, int handedness) {
  const Eigen::Vector3d e1 = u.normalized();
  const Eigen::Vector3d e2 = (v - v.dot(e1) * e1).normalized();
  Eigen::Matrix3d f;
  f.col(0) = e1;
  f.col(1) = e2;
  f.col(2) = handedness * e1.cross(e2);
  return f;
}

// Two reference atoms: `a` of the rarest kind-and-radius, `b` making a wide angle with it,
// so that the images of the pair fix an operation up to its determinant.
std::vector<std::vector<int>> partners(const Centred& c, double tolerance) {
  std::vector<std::vector<int>> out(c.r.size());
  for (std::size_t i = 0; i < c.r.size(); ++i)
    for (std::size_t j = 0; j < c.r.size(); ++j)
      if (c.kind[i] == c.kind[j] && std::abs(c.r[i].norm() - c.r[j].norm()) <= 2 * tolerance)
        out[i].push_back(static_cast<int>(j));
  return out;
}

std::vector<Operation> find_operations(const Centred& c, double tolerance) {
  const auto candidates = partners(c, tolerance);
  std::vector<int> unmoved(c.r.size());
  std::iota(unmoved.begin(), unmoved.end(), 0);
  const Operation identity{Eigen::Matrix3d::Identity(), 1, unmoved, 1};
  // Reference atoms well off the centre and off the axis through the first; a nearly
  // linear frame (every atom within 5 tolerances of that axis, yet not collinear) takes
  // the farthest atoms instead, so the pair is always defined.
  double away = 5 * tolerance;
  double farthest = 0.0;
  for (const Eigen::Vector3d& x : c.r) farthest = std::max(farthest, x.norm());
  if (!(farthest > 0.0)) return {identity};
  away = std::min(away, 0.5 * farthest);
  int a = -1;
  for (std::size_t i = 0; i < c.r.size(); ++i) {
    if (c.r[i].norm() <= away) continue;
    if (a < 0 || candidates[i].size() < candidates[static_cast<std::size_t>(a)].size() ||
        (candidates[i].size() == candidates[static_cast<std::size_t>(a)].size() &&
         c.r[i].norm() > c.r[static_cast<std::size_t>(a)].norm()))
      a = static_cast<int>(i);
  }
  const Eigen::Vector3d u = c.r[static_cast<std::size_t>(a)];
  const auto spread = [&](const Eigen::Vector3d& x) { return u.normalized().cross(x).norm(); };
  double widest = 0.0;  // distance of the farthest atom from the axis through a
  for (const Eigen::Vector3d& x : c.r) widest = std::max(widest, spread(x));
  if (!(widest > 0.0)) return {identity};
  const double off_axis = std::min(away, 0.5 * widest);
  int b = -1;
  double b_score = 0.0;
  for (std::size_t j = 0; j < c.r.size(); ++j) {
    if (spread(c.r[j]) <= off_axis) continue;
    // Fewer partners first; among those, the wider spread conditions the frame better.
    const double score = spread(c.r[j]) / static_cast<double>(candidates[j].size());
    if (b < 0 || score > b_score) b = static_cast<int>(j), b_score = score;
  }
  const Eigen::Vector3d v = c.r[static_cast<std::size_t>(b)];
  const double ab = (u - v).norm();
  std::vector<Operation> ops;
  std::set<std::pair<std::vector<int>, int>> seen;
  for (int a2 : candidates[static_cast<std::size_t>(a)])
    for (int b2 : candidates[static_cast<std::size_t>(b)]) {
      const Eigen::Vector3d u2 = c.r[static_cast<std::size_t>(a2)];
      const Eigen::Vector3d v2 = c.r[static_cast<std::size_t>(b2)];
      if (a2 == b2 || std::abs((u2 - v2).norm() - ab) > 4 * tolerance) continue;
      if (u2.normalized().cross(v2).norm() <= off_axis) continue;
      for (int det : {1, -1}) {
        const Eigen::Matrix3d guess = frame(u2, v2, det) * frame(u, v, 1).transpose();
        const std::vector<int> perm = assign(c, guess, assignment_radius_angstrom);
        if (perm.empty() || seen.count({perm, det})) continue;
        const Eigen::Matrix3d matrix = refine(c, perm, det);
        if (largest_deviation(c, matrix, perm) > tolerance) continue;
        seen.insert({perm, det});
        ops.push_back({matrix, det, perm, std::lcm(permutation_order(perm), det < 0 ? 2 : 1)});
      }
    }
  return ops;
}

struct Axis {
  Eigen::Vector3d direction;
  int order = 1;  // highest rotation order about it
};

Eigen::Vector3d rotation_axis(const Eigen::Matrix3d& m) {
  const Eigen::Vector3d skew(m(2, 1) - m(1, 2), m(0, 2) - m(2, 0), m(1, 0) - m(0, 1));
  if (skew.norm() > 1e-2) return skew.normalized();
  // A half turn: m + I = 2 a aᵀ.
  const Eigen::Matrix3d p = m + Eigen::Matrix3d::Identity();
  Eigen::Index k = 0;
  p.colwise().norm().maxCoeff(&k);
  return p.col(k).normalized();
}

bool parallel(const Eigen::Vector3d& x, const Eigen::Vector3d& y) { return std::abs(x.dot(y)) > 0.99; }

std::string name_group(const std::vector<Operation>& ops) {
  std::vector<Axis> axes;
  std::vector<Eigen::Vector3d> mirror_normals;
  bool improper = false, inversion = false;
  for (const Operation& op : ops) {
    const double trace = op.matrix.trace();
    if (op.det < 0) {
      improper = true;
      if (trace < -2.9) inversion = true;
      if (std::abs(trace - 1.0) < 0.1 && op.order == 2)
        mirror_normals.push_back(rotation_axis(-op.matrix));  // −σ is the half turn about the normal
      continue;
    }
    if (op.order == 1) continue;
    const Eigen::Vector3d axis = rotation_axis(op.matrix);
    auto it =
        std::find_if(axes.begin(), axes.end(), [&](const Axis& x) { return parallel(x.direction, axis); });
    if (it == axes.end())
      axes.push_back({axis, op.order});
    else
      it->order = std::max(it->order, op.order);
  }
  const int high =
      static_cast<int>(std::count_if(axes.begin(), axes.end(), [](const Axis& x) { return x.order >= 3; }));
  int n = 1;
  for (const Axis& x : axes) n = std::max(n, x.order);
  if (high >= 2) {  // cubic and icosahedral groups
    if (n >= 5) return improper ? "Ih" : "I";
    if (n == 4) return improper ? "Oh" : "O";
    return inversion ? "Th" : improper ? "Td" : "T";
  }
  if (axes.empty()) return inversion ? "Ci" : improper ? "Cs" : "C1";
  const Axis& principal = *std::max_element(axes.begin(), axes.end(),
                                            [](const Axis& x, const Axis& y) { return x.order < y.order; });
  const bool perpendicular_c2 = std::any_of(axes.begin(), axes.end(), [&](const Axis& x) {
    return x.order % 2 == 0 && std::abs(x.direction.dot(principal.direction)) < 0.01;
  });
  const bool horizontal_mirror =
      std::any_of(mirror_normals.begin(), mirror_normals.end(),
                  [&](const Eigen::Vector3d& m) { return parallel(m, principal.direction); });
  const std::string order = std::to_string(n);
  if (perpendicular_c2) return "D" + order + (horizontal_mirror ? "h" : !mirror_normals.empty() ? "d" : "");
  if (horizontal_mirror) return "C" + order + "h";
  if (!mirror_normals.empty()) return "C" + order + "v";
  if (improper) return "S" + std::to_string(2 * n);
  return "C" + order;
}

// Every atom within `tolerance` of the line through the centre along the farthest atom.
bool collinear(const Centred& c, double tolerance) {
  std::size_t far = 0;
  for (std::size_t i = 0; i < c.r.size(); ++i)
    if (c.r[i].norm() > c.r[far].norm()) far = i;
  if (c.r[far].norm() <= tolerance) return true;
  const Eigen::Vector3d axis = c.r[far].normalized();
  return std::all_of(c.r.begin(), c.r.end(),
                     [&](const Eigen::Vector3d& x) { return axis.cross(x).norm() <= tolerance; });
}

}  // namespace

PointGroup detect_point_group(const std::vector<Atom>& atoms, double tolerance_angstrom) {
  if (atoms.size() == 1) return {"Kh", 0, 1, false};
  const Centred c = centre(atoms);
  if (collinear(c, tolerance_angstrom)) {
    const std::vector<int> perm = assign(c, -Eigen::Matrix3d::Identity(), tolerance_angstrom);
    return perm.empty() ? PointGroup{"Cinfv", 0, 1, false} : PointGroup{"Dinfh", 0, 2, false};
  }
  const std::vector<Operation> ops = find_operations(c, tolerance_angstrom);
  PointGroup g;
  g.label = name_group(ops);
  g.order = static_cast<int>(ops.size());
  g.symmetry_number =
      static_cast<int>(std::count_if(ops.begin(), ops.end(), [](const Operation& op) { return op.det > 0; }));
  g.chiral = g.order == g.symmetry_number;
  return g;
}

SymmetryChoice choose_symmetry_number(const Species& species, double tolerance_angstrom) {
  SymmetryChoice out;
  const std::optional<int>& given = species.symmetry_number;
  out.symmetry_number = given.value_or(1);
  if (species.phase == Phase::adsorbate) return out;
  if (species.atoms.empty()) {
    if (!given) {
      const char* key = species.key_locations.count("moments_of_inertia")     ? "moments_of_inertia"
                        : species.key_locations.count("rotational_constants") ? "rotational_constants"
                                                                              : "mass";
      fail(key_location(species, key),
           fmt::format("species '{}' has '{}' but no 'symmetry_number', expected one (without 'atoms' it "
                       "cannot be detected)",
                       species.name, key));
    }
    return out;
  }
  const PointGroup g = detect_point_group(species.atoms, tolerance_angstrom);
  out.point_group = g;
  const std::string label = point_group_display(g.label);
  if (!given) {
    out.symmetry_number = g.symmetry_number;
    out.notes.push_back(
        fmt::format("symmetry number {} from the point group {} of the geometry (tolerance {:g} A)",
                    g.symmetry_number, label, tolerance_angstrom));
  } else if (*given != g.symmetry_number) {
    out.warnings.push_back(
        fmt::format("symmetry_number {} given, but the geometry's point group {} has {} "
                    "(tolerance {:g} A); the given {} is used",
                    *given, label, g.symmetry_number, tolerance_angstrom, *given));
  }
  return out;
}

std::string point_group_display(const std::string& label) {
  if (label == "Cinfv") return "C∞v";
  if (label == "Dinfh") return "D∞h";
  return label;
}

}  // namespace vibtherm
