#include "cairn/solver/nonlinear_cap.hpp"

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <limits>
#include <memory>
#include <stdexcept>

#include <fmt/format.h>

#include "cairn/core/quantity_format.hpp"

namespace cairn {
namespace {

using Matrix6 = Eigen::Matrix<double, 6, 6>;
using Vector6 = Eigen::Matrix<double, 6, 1>;

Eigen::Vector3d to_vector3(const std::array<double, 3>& v) { return {v[0], v[1], v[2]}; }
std::array<double, 3> to_array(const Eigen::Vector3d& v) { return {v(0), v(1), v(2)}; }

// A step that converged in this many Newton iterations or fewer lets the next one be twice
// as long (the response is nearly linear there).
constexpr int kEasyStep = 4;
// Halvings of the Newton correction tried by the line search before the step is given up.
constexpr int kLineSearchHalvings = 8;

// T̂ = [[I, −[ρ]×], [0, I/L]] (ρ = (p − c)/L) taking Û = (t, L·r) to the head's (u, ω);
// T̂ᵀ·(F, M) = (F, ρ × F + M/L).
Matrix6 map_of(const Eigen::Vector3d& rho, double size) {
  Eigen::Matrix3d skew;
  skew << 0, -rho(2), rho(1), rho(2), 0, -rho(0), -rho(1), rho(0), 0;
  Matrix6 map = Matrix6::Zero();
  map.block<3, 3>(0, 0).setIdentity();
  map.block<3, 3>(0, 3) = -skew;
  map.block<3, 3>(3, 3) = Eigen::Matrix3d::Identity() / size;
  return map;
}

}  // namespace

// The piles' response at one cap movement: the generalized force Σ T̂ᵀ·(F, M) the piles
// exert back (nondimensional, like the load), its tangent, and the piles' own answers.
struct NonlinearCapSolver::State {
  Vector6 movement = Vector6::Zero();  // Û = (t, L·r)
  Vector6 resisted = Vector6::Zero();  // Σ T̂ᵢᵀ·(Fᵢ, Mᵢ) = Σ (F, (d × F + M)/L)
  Matrix6 tangent = Matrix6::Zero();   // Σ T̂ᵢᵀ·Kᵢ·T̂ᵢ
  std::vector<PileHeadResponse> piles;
  bool valid = false;   // every pile's response converged and is finite
  std::string message;  // the first pile that did not, in plain words
};

struct NonlinearCapSolver::Path {
  Vector6 load = Vector6::Zero();  // F̂ at λ = 1
  std::vector<double> multipliers;
  double lambda = 0.0;
  double step = 1.0;
  State state;  // converged at lambda
  double residual = 0.0;
  int steps = 0, iterations = 0;
  std::string failure;
};

NonlinearCapSolver::NonlinearCapSolver(NonlinearGroup group, NonlinearSettings settings)
    : group_(std::move(group)), settings_(settings) {
  const std::size_t n = group_.heads.size();
  if (n == 0 || group_.axes.size() != n || group_.tension.size() != n || !group_.response)
    throw std::logic_error("NonlinearCapSolver: a group needs piles, axes, tension flags and a response");
  // Elastic centre from the initial vertical stiffness (the tangents at zero movement), taken
  // from the first head so that every p − c is a difference of nearby numbers.
  const Eigen::Vector3d first = to_vector3(group_.heads[0]);
  std::vector<double> weight(n, 0.0);
  double total = 0.0;
  std::vector<PileHeadResponse> initial(n);
  for (std::size_t i = 0; i < n; ++i) {
    const PileHeadResponse& r = initial[i] = group_.response(i, HeadMovement{}, 1.0);
    const double k = r.tangent[2][2];
    weight[i] = std::isfinite(k) && k > 0.0 ? k : 0.0;
    total += weight[i];
  }
  if (!(total > 0.0)) {
    weight.assign(n, 1.0);
    total = static_cast<double>(n);
  }
  Eigen::Vector3d shift = Eigen::Vector3d::Zero();
  double extent = 0.0;
  for (std::size_t i = 0; i < n; ++i) {
    shift += (weight[i] / total) * (to_vector3(group_.heads[i]) - first);
    extent = std::max(extent, (to_vector3(group_.heads[i]) - first).norm());
  }
  Eigen::Vector3d c = first + shift;
  if (extent > 0.0 && std::isfinite(extent)) {
    const double grid = std::ldexp(1.0, std::ilogb(extent) - 20);
    for (int j = 0; j < 3; ++j) c(j) = std::round(c(j) / grid) * grid;
  }
  reference_ = to_array(c);
  double reach = 0.0;
  for (const auto& h : group_.heads) reach = std::max(reach, (to_vector3(h) - c).norm());
  size_ = reach > 0.0 ? reach : 1.0;
  // The group at rest: no action, the initial tangent K̂₀ = Σ T̂ᵢᵀ·Kᵢ(0)·T̂ᵢ (multipliers 1).
  auto rest = std::make_shared<State>();
  rest->piles.assign(n, PileHeadResponse{});
  for (auto& p : rest->piles) p.converged = true;
  rest->valid = true;
  for (std::size_t i = 0; i < n; ++i) {
    const Eigen::Vector3d rho = (to_vector3(group_.heads[i]) - c) / size_;
    Matrix6 k;
    for (int a = 0; a < 6; ++a)
      for (int b = 0; b < 6; ++b)
        k(a, b) = initial[i].tangent[static_cast<std::size_t>(a)][static_cast<std::size_t>(b)];
    if (!k.allFinite()) continue;
    rest->tangent += map_of(rho, size_).transpose() * k * map_of(rho, size_);
  }
  rest_ = std::move(rest);
}

NonlinearGroup nonlinear_group(std::vector<NonlinearPileSpec> specs) {
  NonlinearGroup g;
  for (const auto& s : specs) {
    g.heads.push_back(s.head);
    g.axes.push_back(s.axis);
    g.tension.push_back(s.tension);
    g.curves.push_back(s.curves.description);
  }
  // The piles' last converged shapes, shared by the copies of the functions: one solver
  // calls them in turn (a group is not solved from two threads at once).
  auto shared = std::make_shared<const std::vector<NonlinearPileSpec>>(std::move(specs));
  auto states = std::make_shared<std::vector<DeflectedShape>>(shared->size());
  g.response = [shared, states](std::size_t i, const HeadMovement& m, double pm) {
    PileHeadResponse r = pile_head_response((*shared)[i], m, pm, &(*states)[i]);
    if (r.converged) return r;
    // A start far from this movement (the last combination's) can fail where a start from
    // rest does not: try again from rest.
    DeflectedShape fresh;
    r = pile_head_response((*shared)[i], m, pm, &fresh);
    if (r.converged) (*states)[i] = std::move(fresh);
    return r;
  };
  g.profile = [shared](std::size_t i, const HeadMovement& m, double pm) {
    return pile_profile((*shared)[i], m, pm);
  };
  return g;
}

CapLoad NonlinearCapSolver::from_origin(const Wrench& w) const {
  const Eigen::Vector3d c = to_vector3(reference_);
  const Eigen::Vector3d force(w[0], w[1], w[2]);
  const Eigen::Vector3d moment = Eigen::Vector3d(w[3], w[4], w[5]) + (-c).cross(force);
  return CapLoad({w[0], w[1], w[2], moment(0), moment(1), moment(2)});
}

namespace {

// The largest component of λ·F̂ − resisted over the largest of λ·F̂ (CapSolution::residual).
double relative_residual(const Vector6& miss, const Vector6& applied) {
  if (!miss.allFinite()) return std::numeric_limits<double>::infinity();
  const double a = applied.cwiseAbs().maxCoeff();
  const double m = miss.cwiseAbs().maxCoeff();
  if (a == 0.0) return m == 0.0 ? 0.0 : std::numeric_limits<double>::infinity();
  return m / a;
}

}  // namespace

bool NonlinearCapSolver::advance(Path& path, double target) const {
  const std::size_t n = group_.heads.size();
  const double size = size_;
  const Eigen::Vector3d c = to_vector3(reference_);
  auto multiplier = [&](std::size_t i) {
    return i < path.multipliers.size() ? path.multipliers[i] : 1.0;
  };
  // The piles at cap movement Û.
  auto evaluate = [&](const Vector6& movement) {
    State s;
    s.movement = movement;
    s.piles.resize(n);
    s.valid = true;
    const Eigen::Vector3d t = movement.head<3>();
    const Eigen::Vector3d r = movement.tail<3>() / size;
    for (std::size_t i = 0; i < n; ++i) {
      const Eigen::Vector3d d = to_vector3(group_.heads[i]) - c;
      const Eigen::Vector3d u = t + r.cross(d);
      const HeadMovement m = {u(0), u(1), u(2), r(0), r(1), r(2)};
      PileHeadResponse& p = s.piles[i];
      p = group_.response(i, m, multiplier(i));
      bool finite = true;
      for (double v : p.action) finite = finite && std::isfinite(v);
      for (const auto& row : p.tangent)
        for (double v : row) finite = finite && std::isfinite(v);
      if (!p.converged || !finite) {
        if (s.valid)
          s.message = fmt::format("{}: {}", i < group_.names.size() ? "pile '" + group_.names[i] + "'"
                                                                    : fmt::format("pile {}", i + 1),
                                  p.message.empty() ? "its own response did not converge" : p.message);
        s.valid = false;
        return s;
      }
      const Matrix6 map = map_of(d / size, size);
      Vector6 action;
      Matrix6 k;
      for (int a = 0; a < 6; ++a) {
        action(a) = p.action[static_cast<std::size_t>(a)];
        for (int b = 0; b < 6; ++b)
          k(a, b) = p.tangent[static_cast<std::size_t>(a)][static_cast<std::size_t>(b)];
      }
      s.resisted += map.transpose() * action;
      s.tangent += map.transpose() * k * map;
    }
    return s;
  };
  // From rest: the piles carry nothing at zero movement; the first Newton step takes the
  // initial tangent (a modified Newton step, the line search guarding it).
  if (path.state.piles.empty()) path.state = *rest_;
  // Newton iteration at load factor λ from the converged state `from`.
  auto newton = [&](const State& from, double lambda, State& out, int& used) {
    const Vector6 applied = lambda * path.load;
    State s = from;
    double rel = relative_residual(applied - s.resisted, applied);
    for (used = 0; used < settings_.iterations; ++used) {
      if (rel <= settings_.tolerance) break;
      // Equilibrated solve: D·K̂·D·y = D·R̂, Û += D·y.
      const Vector6 miss = applied - s.resisted;
      Vector6 d;
      for (int j = 0; j < 6; ++j) {
        const double kjj = s.tangent(j, j);
        d(j) = kjj > 0.0 && std::isfinite(kjj) ? 1.0 / std::sqrt(kjj) : 0.0;
      }
      if (d.minCoeff() == 0.0) return false;  // a direction with no stiffness left
      const Matrix6 scaled = d.asDiagonal() * s.tangent * d.asDiagonal();
      const Eigen::FullPivLU<Matrix6> lu(scaled);
      if (!lu.isInvertible() || lu.rcond() < 1e-14) return false;
      const Vector6 delta = d.asDiagonal() * lu.solve(d.asDiagonal() * miss);
      if (!delta.allFinite()) return false;
      // Backtracking: the first of Δ, Δ/2, … that lowers the residual.
      const double norm = miss.norm();
      bool lowered = false;
      double alpha = 1.0;
      for (int h = 0; h <= kLineSearchHalvings; ++h, alpha *= 0.5) {
        State trial = evaluate(s.movement + alpha * delta);
        if (!trial.valid) {
          out.message = trial.message;
          continue;
        }
        if (settings_.movement_limit > 0.0 &&
            trial.movement.cwiseAbs().maxCoeff() > settings_.movement_limit)
          continue;
        if ((applied - trial.resisted).norm() < norm) {
          s = std::move(trial);
          lowered = true;
          break;
        }
      }
      if (!lowered) break;  // stalled
      rel = relative_residual(applied - s.resisted, applied);
    }
    path.iterations += used;
    if (!(rel <= settings_.accept)) return false;
    path.residual = rel;
    out = std::move(s);
    return true;
  };
  while (path.lambda < target) {
    const double lambda = std::min(path.lambda + path.step, target);
    State next;
    int used = 0;
    if (newton(path.state, lambda, next, used)) {
      path.lambda = lambda;
      path.state = std::move(next);
      ++path.steps;
      if (used <= kEasyStep) path.step = std::min(2.0 * path.step, 1.0);
      continue;
    }
    path.step *= 0.5;
    if (path.step < settings_.smallest_step) {
      path.failure = next.message;
      return false;
    }
  }
  return true;
}

NonlinearCapResult NonlinearCapSolver::result_of(const Path& path,
                                                 const std::string& combination) const {
  const std::size_t n = group_.heads.size();
  NonlinearCapResult result;
  result.reached = path.lambda;
  result.steps = path.steps;
  result.iterations = path.iterations;
  result.piles.resize(n);
  for (std::size_t i = 0; i < n; ++i)
    result.piles[i].p_multiplier = i < path.multipliers.size() ? path.multipliers[i] : 1.0;
  CapSolution& solution = result.solution;
  solution.iterations = path.iterations;
  const Eigen::Vector3d c = to_vector3(reference_);
  solution.movement.reference = reference_;
  const Eigen::Vector3d t = path.state.movement.head<3>();
  const Eigen::Vector3d r = path.state.movement.tail<3>() / size_;
  solution.movement.translation_at_reference = to_array(t);
  solution.movement.rotation = to_array(r);
  solution.movement.translation = to_array(t - r.cross(c));
  solution.piles.assign(n, PileForce{});
  if (!path.failure.empty() || path.lambda < 1.0) {
    solution.overturns = true;
    solution.residual = 0.0;
    solution.failure = fmt::format(
        "the group found no equilibrium beyond λ = {:.3f} of combination '{}': the piles "
        "cannot carry more of its load (a mechanism: the soil's resistance along the piles, or "
        "their axial resistance, is used up); the load steps were halved to Δλ = {:.2g} without "
        "convergence{}",
        path.lambda, combination, path.step, path.failure.empty() ? "" : " (" + path.failure + ")");
    return result;
  }
  solution.residual = path.residual;
  for (std::size_t i = 0; i < n; ++i) {
    const Eigen::Vector3d d = to_vector3(group_.heads[i]) - c;
    const Eigen::Vector3d u = t + r.cross(d);
    const Eigen::Vector3d a = to_vector3(group_.axes[i]);
    const auto& action = path.state.piles[i].action;
    const Eigen::Vector3d f(action[0], action[1], action[2]);
    const Eigen::Vector3d m(action[3], action[4], action[5]);
    PileForce& pile = solution.piles[i];
    pile.head_forces = action;
    pile.axial = a.dot(f);
    pile.lateral = (f - a.dot(f) * a).norm();
    pile.head_moment = (m - a.dot(m) * a).norm();
    // A pile that takes no tension and is pulled away from the cap has dropped out.
    pile.active = group_.tension[i] || a.dot(u) >= 0.0;
    if (!pile.active) solution.dropped.push_back(i);
    NonlinearPileResult& extra = result.piles[i];
    extra.head_deflection = (u - a.dot(u) * a).norm();
    extra.max_moment = pile.head_moment;
    if (group_.profile) {
      const HeadMovement hm = {u(0), u(1), u(2), r(0), r(1), r(2)};
      const PileProfile profile = group_.profile(i, hm, extra.p_multiplier);
      if (profile.converged) {
        extra.profiled = true;
        extra.max_moment = std::max(profile.max_moment, pile.head_moment);
        extra.max_moment_depth = profile.max_moment >= pile.head_moment ? profile.max_moment_depth : 0.0;
        extra.head_deflection = profile.head_deflection;
      }
    }
  }
  return result;
}

NonlinearCapResult NonlinearCapSolver::solve(const CapLoad& load,
                                             const std::vector<double>& p_multipliers,
                                             const std::string& combination) const {
  Path path;
  for (int i = 0; i < 6; ++i)
    path.load(i) = load.about_reference[static_cast<std::size_t>(i)] / (i < 3 ? 1.0 : size_);
  path.multipliers = p_multipliers;
  path.step = 1.0 / std::max(1, settings_.initial_steps);
  advance(path, 1.0);
  return result_of(path, combination);
}

PushoverCurve NonlinearCapSolver::pushover(const CapLoad& load,
                                           const std::vector<double>& p_multipliers,
                                           const std::string& combination,
                                           const PushoverLimits& limits) const {
  PushoverCurve curve;
  curve.combination = combination;
  Path path;
  for (int i = 0; i < 6; ++i)
    path.load(i) = load.about_reference[static_cast<std::size_t>(i)] / (i < 3 ? 1.0 : size_);
  path.multipliers = p_multipliers;
  path.step = 1.0 / std::max(1, settings_.initial_steps);
  // The load plotted: the horizontal resultant, else the vertical one.
  const auto& w = load.about_reference;
  const double horizontal = std::hypot(w[0], w[1]);
  double magnitude = 0.0;
  if (horizontal > 1e-9 * std::abs(w[2]) && horizontal > 0.0) {
    curve.direction = {w[0] / horizontal, w[1] / horizontal, 0.0};
    magnitude = horizontal;
  } else {
    curve.direction = {0.0, 0.0, w[2] < 0.0 ? -1.0 : 1.0};
    magnitude = std::abs(w[2]);
  }
  auto point = [&] {
    PushoverPoint p;
    p.load_factor = path.lambda;
    const Eigen::Vector3d t = path.state.movement.head<3>();
    const Eigen::Vector3d r = path.state.movement.tail<3>() / size_;
    p.cap_movement = {t(0), t(1), t(2), r(0), r(1), r(2)};
    p.displacement = t.dot(to_vector3(curve.direction));
    p.load = path.lambda * magnitude;
    return p;
  };
  curve.points.push_back(point());
  const double step = limits.step > 0.0 ? limits.step : 0.25;
  const double last = std::max(limits.largest_factor, 1.0);
  const int count = static_cast<int>(std::ceil(last / step - 1e-9));
  for (int k = 1; k <= count; ++k) {
    const double target = std::min(k * step, last);
    if (!advance(path, target)) {
      if (path.lambda > curve.points.back().load_factor) curve.points.push_back(point());
      curve.mechanism = true;
      curve.end_reason = fmt::format(
          "no equilibrium beyond λ = {:.3f}: the group forms a mechanism{}", path.lambda,
          path.failure.empty() ? "" : " (" + path.failure + ")");
      break;
    }
    curve.points.push_back(point());
    if (limits.displacement > 0.0 && curve.points.back().displacement >= limits.displacement) {
      curve.end_reason =
          fmt::format("the displacement limit of {} is reached at λ = {:.3f}",
                      QuantityFormat(limits.units).text(Shown::displacement, limits.displacement),
                      path.lambda);
      break;
    }
  }
  if (curve.end_reason.empty())
    curve.end_reason = fmt::format("the largest load factor asked for, λ = {:.3g}, is reached", last);
  curve.capacity_factor = path.lambda;
  return curve;
}

}  // namespace cairn
