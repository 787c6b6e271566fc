#include "cairn/cap_solver.hpp"

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <set>
#include <stdexcept>

#include <fmt/format.h>

namespace cairn {
namespace {

using Matrix6 = Eigen::Matrix<double, 6, 6>;
using Vector6 = Eigen::Matrix<double, 6, 1>;
using Matrix36 = Eigen::Matrix<double, 3, 6>;

// u_head = T·U with U = (t, r): u = t + r × p = t − [p]×·r.
Matrix36 head_map(const std::array<double, 3>& p) {
  Matrix36 t = Matrix36::Zero();
  t.block<3, 3>(0, 0).setIdentity();
  Eigen::Matrix3d skew;
  skew << 0, -p[2], p[1], p[2], 0, -p[0], -p[1], p[0], 0;
  t.block<3, 3>(0, 3) = -skew;
  return t;
}

Eigen::Matrix3d pile_matrix(const PileSpring& s) {
  const Eigen::Vector3d a(s.axis[0], s.axis[1], s.axis[2]);
  const Eigen::Matrix3d aa = a * a.transpose();
  return s.axial * aa + s.lateral * (Eigen::Matrix3d::Identity() - aa);
}

Vector6 to_vector(const Wrench& w) {
  Vector6 v;
  for (int i = 0; i < 6; ++i) v(i) = w[static_cast<std::size_t>(i)];
  return v;
}

}  // namespace

// Per pile: the head map T and pile stiffness, kept for assembling any active subset.
struct CapSolver::Impl {
  std::vector<Matrix36> maps;
  std::vector<Eigen::Matrix3d> stiffness;
  std::vector<Matrix6> contributions;  // Tᵀ·K_pile·T, summed over the active piles
  // A pile that dropped out (it takes no tension) keeps its lateral spring: the soil still
  // holds it across its axis. Its lateral-only stiffness and contribution:
  std::vector<Eigen::Matrix3d> lateral_only;
  std::vector<Matrix6> lateral_contributions;
  double length_scale = 1.0;  // m; rotations are scaled by it so all six dofs compare
  Eigen::Matrix<double, 6, 1> scale;

  // Scaled stiffness of the active piles, its eigen-decomposition, and its null space.
  struct Decomposition {
    Eigen::SelfAdjointEigenSolver<Matrix6> eigen;
    std::vector<int> null;  // indices of eigenvalues taken as zero
  };

  Decomposition decompose(const std::vector<bool>& active) const {
    Matrix6 k = Matrix6::Zero();
    for (std::size_t i = 0; i < maps.size(); ++i) {
      k += active[i] ? contributions[i] : lateral_contributions[i];
    }
    const Matrix6 d = scale.asDiagonal();
    Decomposition result{Eigen::SelfAdjointEigenSolver<Matrix6>(d * k * d), {}};
    const auto& values = result.eigen.eigenvalues();
    const double largest = std::max(values.cwiseAbs().maxCoeff(), 1e-300);
    for (int i = 0; i < 6; ++i)
      if (values(i) <= 1e-10 * largest) result.null.push_back(i);
    return result;
  }

  // Loaded null directions of a decomposition: (component index, share of the load).
  std::vector<int> loaded_null(const Decomposition& dec, const Vector6& load) const {
    std::vector<int> components;
    const Vector6 scaled = scale.asDiagonal() * load;
    const double size = scaled.norm();
    if (size == 0.0) return components;
    for (int i : dec.null) {
      const Vector6 v = dec.eigen.eigenvectors().col(i);
      if (std::abs(v.dot(scaled)) > 1e-9 * size) {
        int component = 0;
        v.cwiseAbs().maxCoeff(&component);
        // The loaded component along this direction: the largest |v_j·F_j|.
        Vector6 share = v.cwiseProduct(scaled).cwiseAbs();
        share.maxCoeff(&component);
        components.push_back(component);
      }
    }
    return components;
  }

  Vector6 solve(const Decomposition& dec, const Vector6& load) const {
    const Vector6 scaled = scale.asDiagonal() * load;
    Vector6 y = Vector6::Zero();
    const auto& values = dec.eigen.eigenvalues();
    for (int i = 0; i < 6; ++i) {
      if (std::find(dec.null.begin(), dec.null.end(), i) != dec.null.end()) continue;
      const Vector6 v = dec.eigen.eigenvectors().col(i);
      y += v * (v.dot(scaled) / values(i));
    }
    return scale.asDiagonal() * y;
  }
};

std::vector<PileSpring> pile_springs(const Project& project) {
  std::vector<PileSpring> springs;
  springs.reserve(project.piles.size());
  for (const auto& pile : project.piles) {
    const auto& type = project.pile_types.at(pile.type);
    springs.push_back({{pile.x, pile.y, 0.0}, pile.axis(), type.axial_stiffness_used(),
                       type.lateral_stiffness_used(), type.tension});
  }
  return springs;
}

CapSolver::CapSolver(std::vector<PileSpring> springs)
    : springs_(std::move(springs)), impl_(std::make_unique<Impl>()) {
  double reach = 0.0;
  for (const auto& s : springs_) {
    impl_->maps.push_back(head_map(s.head));
    impl_->stiffness.push_back(pile_matrix(s));
    impl_->contributions.push_back(impl_->maps.back().transpose() * impl_->stiffness.back() *
                                   impl_->maps.back());
    PileSpring lateral = s;
    lateral.axial = 0.0;
    impl_->lateral_only.push_back(pile_matrix(lateral));
    impl_->lateral_contributions.push_back(impl_->maps.back().transpose() *
                                           impl_->lateral_only.back() * impl_->maps.back());
    reach = std::max(reach, std::hypot(s.head[0], s.head[1]));
  }
  impl_->length_scale = std::max(reach, 1.0);
  const double inv = 1.0 / impl_->length_scale;
  impl_->scale << 1, 1, 1, inv, inv, inv;
}

CapSolver::~CapSolver() = default;
CapSolver::CapSolver(CapSolver&&) noexcept = default;
CapSolver& CapSolver::operator=(CapSolver&&) noexcept = default;

std::vector<UnresistedLoad> CapSolver::unresisted(const Wrench& load) const {
  const std::vector<bool> all(springs_.size(), true);
  const auto dec = impl_->decompose(all);
  std::vector<UnresistedLoad> result;
  bool battered = false, lateral = false;
  for (const auto& s : springs_) {
    battered = battered || std::abs(s.axis[2] + 1.0) > 1e-12;
    lateral = lateral || s.lateral > 0.0;
  }
  for (int component : impl_->loaded_null(dec, to_vector(load))) {
    std::string reason;
    if (springs_.empty()) {
      reason = "the cap has no piles";
    } else if (!battered && !lateral && (component <= 1 || component == 5)) {
      reason = "no battered piles and no lateral stiffness";
    } else {
      reason = "the piles' axes and lateral springs give no stiffness in this direction";
    }
    const std::string name = kWrenchNames[static_cast<std::size_t>(component)];
    const bool seen = std::any_of(result.begin(), result.end(),
                                  [&](const UnresistedLoad& u) { return u.component == name; });
    if (!seen) result.push_back({name, reason});
  }
  return result;
}

namespace {

CapSolution forces_from(const std::vector<PileSpring>& springs, const std::vector<Matrix36>& maps,
                        const Vector6& movement, const std::vector<bool>& active) {
  CapSolution solution;
  for (int i = 0; i < 3; ++i) {
    solution.movement.translation[static_cast<std::size_t>(i)] = movement(i);
    solution.movement.rotation[static_cast<std::size_t>(i)] = movement(i + 3);
  }
  solution.piles.resize(springs.size());
  for (std::size_t i = 0; i < springs.size(); ++i) {
    const auto& s = springs[i];
    const Eigen::Vector3d u = maps[i] * movement;
    const Eigen::Vector3d a(s.axis[0], s.axis[1], s.axis[2]);
    const double along = a.dot(u);
    auto& pile = solution.piles[i];
    pile.active = active[i];
    // An inactive pile keeps its would-be axial force for the closing test, but carries
    // nothing: report zero.
    pile.axial = active[i] ? s.axial * along : 0.0;
    pile.lateral = s.lateral * (u - along * a).norm();
  }
  return solution;
}

// |Σ R + F| / |F| with moments scaled by the length scale, R the pile forces on the cap.
double equilibrium_residual(const std::vector<Matrix36>& maps,
                            const std::vector<Eigen::Matrix3d>& stiffness,
                            const std::vector<Eigen::Matrix3d>& lateral_only,
                            const std::vector<bool>& active, const Vector6& movement,
                            const Vector6& load, const Vector6& scale) {
  Vector6 sum = load;
  for (std::size_t i = 0; i < maps.size(); ++i) {
    const Eigen::Matrix3d& k = active[i] ? stiffness[i] : lateral_only[i];
    const Eigen::Vector3d r = -k * (maps[i] * movement);  // pile force on the cap
    sum += maps[i].transpose() * r;  // Tᵀ·R = (R, p × R): the wrench of R about the origin
  }
  const Vector6 scaled_sum = scale.asDiagonal() * sum;
  const Vector6 scaled_load = scale.asDiagonal() * load;
  return scaled_sum.norm() / std::max(scaled_load.norm(), 1e-12);
}

}  // namespace

CapSolution CapSolver::solve_linear(const Wrench& load) const {
  const std::vector<bool> all(springs_.size(), true);
  const auto dec = impl_->decompose(all);
  const Vector6 f = to_vector(load);
  const Vector6 u = impl_->solve(dec, f);
  CapSolution solution = forces_from(springs_, impl_->maps, u, all);
  solution.iterations = 1;
  solution.residual =
      equilibrium_residual(impl_->maps, impl_->stiffness, impl_->lateral_only, all, u, f, impl_->scale);
  return solution;
}

bool CapSolver::needs_redistribution(const CapSolution& solution) const {
  for (std::size_t i = 0; i < springs_.size(); ++i) {
    if (!springs_[i].tension && solution.piles[i].active &&
        solution.piles[i].axial < -1e-9 * std::max(1.0, springs_[i].axial * 1e-6))
      return true;
  }
  return false;
}

CapSolution CapSolver::superpose(const std::vector<std::pair<const CapSolution*, double>>& parts,
                                 const Wrench& load) const {
  Vector6 u = Vector6::Zero();
  for (const auto& [part, factor] : parts) {
    for (int i = 0; i < 3; ++i) {
      u(i) += factor * part->movement.translation[static_cast<std::size_t>(i)];
      u(i + 3) += factor * part->movement.rotation[static_cast<std::size_t>(i)];
    }
  }
  const std::vector<bool> all(springs_.size(), true);
  CapSolution solution = forces_from(springs_, impl_->maps, u, all);
  solution.iterations = 0;
  solution.residual = equilibrium_residual(impl_->maps, impl_->stiffness, impl_->lateral_only, all, u, to_vector(load),
                                           impl_->scale);
  return solution;
}

CapSolution CapSolver::solve(const Wrench& load) const {
  const std::size_t n = springs_.size();
  const Vector6 f = to_vector(load);
  std::vector<bool> active(n, true);
  std::set<std::vector<bool>> seen, slow_seen;
  bool one_at_a_time = false;
  // Piles left out for good: see the one-at-a-time steps below.
  std::vector<bool> left_out(n, false);
  const int limit = static_cast<int>(4 * n + 20);
  for (int iteration = 1; iteration <= limit; ++iteration) {
    const auto dec = impl_->decompose(active);
    const auto loaded = impl_->loaded_null(dec, f);
    const bool any_active = std::find(active.begin(), active.end(), true) != active.end();
    if (!loaded.empty() || !any_active) {
      CapSolution failed;
      failed.piles.assign(n, PileForce{0.0, 0.0, false});
      for (std::size_t i = 0; i < n; ++i) {
        failed.piles[i].active = active[i];
        if (!active[i]) failed.dropped.push_back(i);
      }
      failed.overturns = true;
      failed.iterations = iteration;
      failed.failure =
          "the cap overturns: the piles that take no tension cannot hold the resultant of the "
          "loads; it lies outside the reach of the piles left in compression";
      return failed;
    }
    const Vector6 u = impl_->solve(dec, f);
    // Would-be axial displacement of every pile, active or not.
    std::vector<double> along(n);
    for (std::size_t i = 0; i < n; ++i) {
      const Eigen::Vector3d a(springs_[i].axis[0], springs_[i].axis[1], springs_[i].axis[2]);
      along[i] = a.dot(impl_->maps[i] * u);
    }
    const double tol = 1e-12 * std::max(1.0, u.cwiseAbs().maxCoeff());
    std::vector<std::size_t> drop, add;
    for (std::size_t i = 0; i < n; ++i) {
      if (springs_[i].tension) continue;
      if (active[i] && along[i] < -tol) drop.push_back(i);
      if (!active[i] && !left_out[i] && along[i] > tol) add.push_back(i);
    }
    if (drop.empty() && add.empty()) {
      CapSolution solution = forces_from(springs_, impl_->maps, u, active);
      for (std::size_t i = 0; i < n; ++i)
        if (!active[i]) solution.dropped.push_back(i);
      solution.iterations = iteration;
      solution.residual =
          equilibrium_residual(impl_->maps, impl_->stiffness, impl_->lateral_only, active, u, f, impl_->scale);
      return solution;
    }
    if (one_at_a_time) {
      // Change one pile at a time: the most stretched active pile, else the most closed one.
      std::size_t changed = 0;
      if (!drop.empty()) {
        changed = *std::min_element(drop.begin(), drop.end(),
                                    [&](auto a, auto b) { return along[a] < along[b]; });
        active[changed] = false;
      } else {
        changed = *std::max_element(add.begin(), add.end(),
                                    [&](auto a, auto b) { return along[a] < along[b]; });
        active[changed] = true;
      }
      // A dropped pile loses its lateral spring as well as its axial one, so a
      // compression-only pile with a lateral spring can have no consistent state: out, the
      // cap closes on it; back in, its own lateral spring pulls it into tension (its axial
      // force is near zero either way). One pile at a time, the steps are fixed by the
      // state, so returning to a state met on this path is a cycle: the pile that closes it
      // is left out for good (it carries nothing; the others hold the load).
      if (!slow_seen.insert(active).second) {
        active[changed] = false;
        left_out[changed] = true;
      }
    } else {
      for (auto i : drop) active[i] = false;
      for (auto i : add) active[i] = true;
      if (!seen.insert(active).second) {  // a cycle: go slowly
        one_at_a_time = true;
        slow_seen.insert(active);
      }
    }
  }
  throw std::logic_error("the compression-only iteration did not settle");
}

}  // namespace cairn

namespace cairn {

std::vector<UnresistedCase> unresisted_cases(const Project& project, const CapSolver& solver) {
  std::vector<UnresistedCase> result;
  for (std::size_t c = 0; c < project.load_cases.size(); ++c)
    for (const auto& u : solver.unresisted(resultant_about_origin(project.load_cases[c])))
      result.push_back({c, u});
  return result;
}

Wrench combination_load(const Project& project, const Combination& combination) {
  Wrench total{};
  for (const auto& [index, factor] : combination.factors) {
    const Wrench w = resultant_about_origin(project.load_cases[index]);
    for (std::size_t i = 0; i < 6; ++i) total[i] += factor * w[i];
  }
  return total;
}

std::vector<CapSolution> solve_combinations(const Project& project, const CapSolver& solver) {
  std::vector<CapSolution> per_case;
  per_case.reserve(project.load_cases.size());
  for (const auto& lc : project.load_cases)
    per_case.push_back(solver.solve_linear(resultant_about_origin(lc)));
  constexpr double kResidualLimit = 1e-6;
  std::vector<CapSolution> result;
  result.reserve(project.combinations.size());
  for (const auto& combo : project.combinations) {
    const Wrench load = combination_load(project, combo);
    std::vector<std::pair<const CapSolution*, double>> parts;
    for (const auto& [index, factor] : combo.factors) parts.emplace_back(&per_case[index], factor);
    CapSolution solution = solver.superpose(parts, load);
    if (solver.needs_redistribution(solution)) solution = solver.solve(load);
    if (!solution.overturns && !(solution.residual <= kResidualLimit))  // NaN fails too
      throw std::logic_error(fmt::format(
          "combination '{}' misses equilibrium by {:.3g} of the load", combo.id,
          solution.residual));
    result.push_back(std::move(solution));
  }
  return result;
}

}  // namespace cairn
