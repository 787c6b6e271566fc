#include "cairn/solver/cap_solver.hpp"

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <cstdint>
#include <limits>
#include <optional>
#include <unordered_map>
#include <unordered_set>
#include <stdexcept>
#include <type_traits>

#include <fmt/format.h>

#include "active_set_passes.hpp"
#include "pinned_forces.hpp"

namespace cairn {
namespace {

using Matrix6 = Eigen::Matrix<double, 6, 6>;
// The piles' 6×6 terms are summed as 36 doubles each, one pile after the other (decompose).
static_assert(sizeof(Matrix6) == 36 * sizeof(double));
using Vector6 = Eigen::Matrix<double, 6, 1>;
using Matrix36 = Eigen::Matrix<double, 3, 6>;
// The dofs that have stiffness: at most six, kept on the stack.
using MatrixKept = Eigen::Matrix<double, Eigen::Dynamic, Eigen::Dynamic, 0, 6, 6>;
using VectorKept = Eigen::Matrix<double, Eigen::Dynamic, 1, 0, 6, 1>;

// A direction is taken to have no stiffness when its unit-spring stiffness is below this
// share of the largest: pile heads within 1e-5·L of one line, an axis within 1e-5 rad of a
// plane. It is a statement about geometry, so the piles' stiffness values do not enter.
constexpr double kNullShare = 1e-10;
// A load is along a direction with no stiffness when its component there exceeds this share
// of the (nondimensional) load; below it, the component is round-off of the load's moment.
constexpr double kLoadedShare = 1e-9;
// A compression-only pile is in tension when its head moves away from the cap by more than
// this share of the largest head movement (round-off is ~1e-16 of it).
constexpr double kTensionShare = 1e-12;

// Nondimensional kinematics: the cap moves Û = (t, θ) with θ = L·r, and a head at
// ρ = (p − c)/L moves u = t + θ × ρ = T̂·Û with T̂ = [I | −[ρ]×].
Matrix36 head_map(const Eigen::Vector3d& rho) {
  Matrix36 t = Matrix36::Zero();
  t.block<3, 3>(0, 0).setIdentity();
  Eigen::Matrix3d skew;
  skew << 0, -rho(2), rho(1), rho(2), 0, -rho(0), -rho(1), rho(0), 0;
  t.block<3, 3>(0, 3) = -skew;
  return t;
}

Eigen::Matrix3d spring_matrix(const Eigen::Vector3d& a, double axial, double lateral) {
  const Eigen::Matrix3d aa = a * a.transpose();
  return axial * aa + lateral * (Eigen::Matrix3d::Identity() - aa);
}

Eigen::Vector3d to_vector3(const std::array<double, 3>& v) { return {v[0], v[1], v[2]}; }

// The head-bending terms of a fixed or partially fixed pile (pile_head.hpp) in the
// nondimensional cap coordinates: T̂ᵀ·K_b·T̂ with T̂ = [[I, −[ρ]×], [0, I/L]] taking Û = (t, θ)
// to the head's (u, ω).
Matrix6 bending_contribution(const Eigen::Vector3d& rho, double size,
                             const std::array<double, 3>& axis, const HeadBending& bending) {
  const Matrix6Rows rows = head_stiffness_matrix(axis, 0.0, 0.0, bending);
  Matrix6 k;
  for (int i = 0; i < 6; ++i)
    for (int j = 0; j < 6; ++j) k(i, j) = rows[static_cast<std::size_t>(i)][static_cast<std::size_t>(j)];
  Matrix6 t = Matrix6::Zero();
  t.block<3, 6>(0, 0) = head_map(rho);
  t.block<3, 3>(3, 3) = Eigen::Matrix3d::Identity() / size;
  return t.transpose() * k * t;
}

std::array<double, 3> to_array(const Eigen::Vector3d& v) { return {v(0), v(1), v(2)}; }

}  // namespace

// Per pile: the head map, offset, axis and springs, kept for assembling any active subset
// and for the pile forces.
struct CapSolver::Impl {
  Eigen::Vector3d reference = Eigen::Vector3d::Zero();  // c, m
  std::array<double, 3> reference_point{};               // the same, as the model writes it
  double size = 1.0;                                     // L, m
  std::vector<Matrix36> maps;                            // T̂ (nondimensional)
  std::vector<Eigen::Vector3d> offsets;                  // ρ = (p − c)/L
  std::vector<Eigen::Vector3d> axes;
  std::vector<double> axial, lateral;                    // kN/m
  std::vector<HeadBending> bending;                      // fixed and partially fixed heads
  detail::PinnedPiles pinned;       // every pile's springs as arrays, for the forces in double
  std::vector<std::size_t> bent;    // the piles with head bending (bending[i].any())
  std::vector<Matrix6> contributions;                    // T̂ᵀ·K_pile·T̂, kN/m
  // A pile that dropped out (it takes no tension) keeps its lateral spring: the soil still
  // holds it across its axis. Its lateral-only contribution:
  std::vector<Matrix6> lateral_contributions;
  // The same with every existing spring of stiffness 1: its null space is the stiffness's
  // (K = Σ of positive semidefinite terms, so K·v = 0 exactly when every spring is idle),
  // and it is as well conditioned as the geometry, whatever the stiffness ratios.
  std::vector<Matrix6> pattern, lateral_pattern;
  // K̂ of every pile active (Σ contributions), for the equilibrium check in 6-space.
  Matrix6 stiffness_all = Matrix6::Zero();
  // All spring values within a factor of 1e3 of each other: rounding in the pile forces is
  // then that of the 6×6 system, and equilibrium can be checked in 6-space (K̂·Û = F̂).
  bool well_conditioned = false;
  bool any_compression_only = false;
  std::vector<std::size_t> compression_only;  // the piles that take no tension
  // Over the compression-only piles, per component: the least and largest of the axis a and
  // of h = ρ × a, and the largest |ρ|₁ (for surely_closed).
  Eigen::Vector3d axis_low = Eigen::Vector3d::Zero(), axis_high = Eigen::Vector3d::Zero();
  Eigen::Vector3d lever_low = Eigen::Vector3d::Zero(), lever_high = Eigen::Vector3d::Zero();
  double reach_one = 0.0;

  // True when no compression-only pile can be in tension at the movement Û = (t, θ), shown
  // without a pass over the piles: a·u = a·t + θ·(ρ × a) ≥ Σ_j min(a_j·t_j) + Σ_j min(h_j·θ_j)
  // over the ranges of a and h, and when that bound exceeds 1e-9 of ‖t‖₁ + ‖θ‖₁·max |ρ|₁
  // (rounding in a·u is ~1e-15 of it) every computed a·u is positive, so the pass would drop
  // none (its test is a·u < −1e-12·max |u| ≤ 0). Exact on a rectangular grid of vertical
  // piles; false (the pass decides) when in doubt or not a number.
  bool surely_closed(const Vector6& movement) const {
    double bound = 0.0, scale = 0.0;
    for (int j = 0; j < 3; ++j) {
      const double t = movement(j), theta = movement(j + 3);
      bound += std::min(axis_low(j) * t, axis_high(j) * t);
      bound += std::min(lever_low(j) * theta, lever_high(j) * theta);
      scale += std::abs(t) + std::abs(theta) * reach_one;
    }
    return bound > 1e-9 * scale;
  }
  // The unit-spring copy of every pile active (Σ pattern) and each pile's axial part of it
  // (pattern − lateral_pattern): an active set's copy, less the dropped piles' parts, decides
  // its directions without stiffness without a sum over every pile (decompose).
  Matrix6 pattern_all = Matrix6::Zero();
  std::vector<Matrix6> axial_pattern;

  // Adds pile i's head-bending terms to its contributions (active or dropped out: the soil
  // holds the pile across its axis either way) and to the unit-spring copies (unit rotational
  // stiffness in the nondimensional rotations θ = L·r, none coupling).
  void add_bending(std::size_t i) {
    const std::array<double, 3> a = {axes[i](0), axes[i](1), axes[i](2)};
    const Matrix6 b = bending_contribution(offsets[i], size, a, bending[i]);
    contributions[i] += b;
    lateral_contributions[i] += b;
    const double unit = size * size;
    const Matrix6 u = bending_contribution(
        offsets[i], size, a, {0.0, bending[i].rotational > 0.0 ? unit : 0.0,
                              bending[i].torsional > 0.0 ? unit : 0.0});
    pattern[i] += u;
    lateral_pattern[i] += u;
  }

  // The head-bending part of pile i's action at head movement u and cap movement Û: adds
  // its force to `force` and returns its moment about the head (zero for a pinned head).
  template <typename Real>
  Eigen::Matrix<Real, 3, 1> add_bending_action(std::size_t i, const Eigen::Matrix<Real, 3, 1>& u,
                                               const Eigen::Matrix<Real, 6, 1>& movement,
                                               Eigen::Matrix<Real, 3, 1>& force) const {
    Eigen::Matrix<Real, 3, 1> moment = Eigen::Matrix<Real, 3, 1>::Zero();
    if (!bending[i].any()) return moment;
    const Real uu[3] = {u(0), u(1), u(2)};
    const Real s = static_cast<Real>(size);
    const Real w[3] = {movement(3) / s, movement(4) / s, movement(5) / s};
    Real f[3], m[3];
    head_bending_action<Real>({axes[i](0), axes[i](1), axes[i](2)}, bending[i], uu, w, f, m);
    for (int j = 0; j < 3; ++j) {
      force(j) += f[j];
      moment(j) = m[j];
    }
    return moment;
  }

  // The solvable part of the stiffness of one active set.
  struct Decomposition {
    std::vector<int> kept;        // dofs with stiffness, in order
    std::vector<Vector6> null;    // unit directions with none (Û coordinates)
    VectorKept equilibration;     // D = diag(1/√K_jj) over the kept dofs
    Eigen::LDLT<MatrixKept> factor;  // of D·K·D + Σ m·mᵀ (m: null directions among kept)
  };
  Decomposition all_active;

  Decomposition decompose(const std::vector<bool>& active) const {
    // Σ (active ? contributions : lateral_contributions) in pile order, entry by entry
    // (active_set_passes.hpp: the same sums as Eigen's k += … pile by pile).
    Matrix6 k = Matrix6::Zero();
    if (!maps.empty())
      detail::sum_stiffness(maps.size(), contributions.front().data(),
                            lateral_contributions.front().data(), active, k.data());
    // The unit-spring copy only decides which directions have no stiffness. Taken from the
    // whole group's less the dropped piles' axial parts (a few terms instead of a sum over
    // every pile), it decides as the sum would whenever it decides with a margin of 100 on
    // either side of each threshold (its rounding is ~1e-13 of its size); otherwise the
    // sum is taken pile by pile.
    Matrix6 unit = pattern_all;
    for (std::size_t i = 0; i < maps.size(); ++i)
      if (!active[i]) unit -= axial_pattern[i];
    if (auto decided = factorized(k, unit, true)) return std::move(*decided);
    unit.setZero();
    for (std::size_t i = 0; i < maps.size(); ++i)
      unit += active[i] ? pattern[i] : lateral_pattern[i];
    return std::move(*factorized(k, unit, false));
  }

  // The decomposition of stiffness k whose unit-spring copy is `unit`. `approximate`: unit
  // is not the exact sum; no decomposition when a decision about directions without
  // stiffness is within a factor 100 of its threshold, or when the copy might have such a
  // direction among the kept dofs (then the exact sum decides).
  std::optional<Decomposition> factorized(const Matrix6& k, const Matrix6& unit,
                                          bool approximate) const {
    constexpr double kMargin = 100.0;
    Decomposition result;
    // Dofs with no stiffness at all (vertical piles without lateral springs: ux, uy, rz)
    // are set aside whole, so the equilibration below works on the others undisturbed.
    const double largest_diagonal = unit.diagonal().maxCoeff();
    for (int j = 0; j < 6; ++j) {
      if (approximate && !(unit(j, j) > kMargin * kNullShare * largest_diagonal) &&
          !(unit(j, j) < kNullShare / kMargin * largest_diagonal))
        return std::nullopt;
      if (unit(j, j) > kNullShare * largest_diagonal && k(j, j) > 0.0) {
        result.kept.push_back(j);
      } else {
        result.null.push_back(Vector6::Unit(j));
      }
    }
    const int n = static_cast<int>(result.kept.size());
    MatrixKept kept_k(n, n), kept_unit(n, n);
    result.equilibration.resize(n);
    for (int a = 0; a < n; ++a) {
      result.equilibration(a) = 1.0 / std::sqrt(k(result.kept[a], result.kept[a]));
      for (int b = 0; b < n; ++b) {
        kept_k(a, b) = k(result.kept[a], result.kept[b]);
        kept_unit(a, b) = unit(result.kept[a], result.kept[b]);
      }
    }
    const auto& d = result.equilibration;
    MatrixKept equilibrated = d.asDiagonal() * kept_k * d.asDiagonal();
    // Couplings that are round-off of sums cancelling to zero (Σ k·x over a symmetric group)
    // are zero: with a unit diagonal every coupling lies within ±1, and one of 1e-12 changes
    // no result beyond its twelfth digit. A symmetric group under a symmetric load then
    // moves exactly as symmetrically (zero rotations stay exact zeros).
    constexpr double kCancelled = 1e-12;
    for (int a = 0; a < n; ++a)
      for (int b = 0; b < n; ++b)
        if (a != b && std::abs(equilibrated(a, b)) < kCancelled) equilibrated(a, b) = 0.0;
    // Directions with no stiffness that mix the kept dofs (piles on a line askew to x and
    // y): found on the unit-spring copy, then made stiff (unit stiffness, the scale of the
    // equilibrated matrix) so the factorization sees a definite matrix. A load has no
    // component along them (checked before solving), so they move nothing.
    if (n > 0 && approximate) {
      // No such direction for certain when the smallest eigenvalue of the copy exceeds
      // 100·kNullShare times its largest: λ_min ≥ 1/trace(A⁻¹) and λ_max ≤ trace(A) (A
      // positive definite, its Cholesky factor A = L·Lᵀ, trace(A⁻¹) = Σ‖L⁻¹·e_j‖²).
      const Eigen::LLT<MatrixKept> cholesky(kept_unit);
      if (cholesky.info() != Eigen::Success) return std::nullopt;
      const MatrixKept inverse_factor =
          cholesky.matrixL().solve(MatrixKept::Identity(n, n));
      const double inverse_trace = inverse_factor.squaredNorm();
      if (!(1.0 / inverse_trace > kMargin * kNullShare * kept_unit.trace())) return std::nullopt;
    } else if (n > 0) {
      const Eigen::SelfAdjointEigenSolver<MatrixKept> eigen(kept_unit);
      const double largest = eigen.eigenvalues().cwiseAbs().maxCoeff();
      for (int i = 0; i < n; ++i) {
        if (eigen.eigenvalues()(i) > kNullShare * largest) continue;
        const VectorKept direction = eigen.eigenvectors().col(i);
        Vector6 full = Vector6::Zero();
        for (int a = 0; a < n; ++a) full(result.kept[a]) = direction(a);
        result.null.push_back(full);
        // In the equilibrated unknowns y = D⁻¹·Û the same direction is D⁻¹·v.
        const VectorKept m = direction.cwiseQuotient(d).normalized();
        equilibrated += m * m.transpose();
      }
    }
    result.factor.compute(equilibrated);
    return result;
  }

  // Loaded directions with no stiffness: the component names (index 0–5) that carry them.
  std::vector<int> loaded_null(const Decomposition& dec, const Vector6& load) const {
    std::vector<int> components;
    const double size = load.norm();
    if (size == 0.0) return components;
    for (const Vector6& v : dec.null) {
      if (std::abs(v.dot(load)) > kLoadedShare * size) {
        // The loaded component along this direction: the largest |v_j·F_j|.
        int component = 0;
        v.cwiseProduct(load).cwiseAbs().maxCoeff(&component);
        components.push_back(component);
      }
    }
    return components;
  }

  // Û solving K̂·Û = F̂ over the dofs with stiffness (zero along the others).
  Vector6 solve(const Decomposition& dec, const Vector6& load) const {
    const int n = static_cast<int>(dec.kept.size());
    VectorKept right(n);
    for (int a = 0; a < n; ++a) right(a) = dec.equilibration(a) * load(dec.kept[a]);
    const VectorKept y = dec.factor.solve(right);
    Vector6 movement = Vector6::Zero();
    for (int a = 0; a < n; ++a) movement(dec.kept[a]) = dec.equilibration(a) * y(a);
    return movement;
  }

  // F̂ = (F, M/L): the load nondimensional like Û.
  Vector6 scaled(const CapLoad& load) const {
    Vector6 v;
    for (int i = 0; i < 6; ++i)
      v(i) = load.about_reference[static_cast<std::size_t>(i)] / (i < 3 ? 1.0 : size);
    return v;
  }

  // The movement Û of a reported solution.
  Vector6 movement_of(const CapMovement& m) const {
    Vector6 u;
    for (int i = 0; i < 3; ++i) {
      u(i) = m.translation_at_reference[static_cast<std::size_t>(i)];
      u(i + 3) = m.rotation[static_cast<std::size_t>(i)] * size;
    }
    return u;
  }

  // Head movement along each pile axis, and the largest head movement of all.
  // (One pass over the piles' arrays, active_set_passes.hpp: the same bits as
  // axes[i].dot(head_movement(i, movement)) and the largest of their norms.)
  std::vector<double> along(const Vector6& movement, double& largest) const {
    std::vector<double> result(maps.size());
    largest = along_into(movement, result);
    return result;
  }
  // The same into `result` (resized to the piles), returning the largest head movement.
  double along_into(const Vector6& movement, std::vector<double>& result) const {
    result.resize(maps.size());
    const double m[6] = {movement(0), movement(1), movement(2),
                         movement(3), movement(4), movement(5)};
    return detail::head_movements_along(pinned, m, result.data());
  }

  // Pile forces and the equilibrium check are written for double and for long double
  // (64-bit significand on x86-64). A pile 1e10 times stiffer than the others moves 1e-10 of
  // their movement along its axis; in double, a·u keeps only ~1e-6 of that, and so would its
  // force. Groups whose imbalance in double shows this are settled in long double.
  template <typename Real>
  using Vector6R = Eigen::Matrix<Real, 6, 1>;
  template <typename Real>
  using Vector3R = Eigen::Matrix<Real, 3, 1>;

  // Force of the cap on pile i at head movement u: k_a·(a·u)·a + k_l·(u − (a·u)·a), written
  // with a·u (never a rounded 3×3 matrix times u, which would lose the small axial movement
  // of a stiff pile moving mostly across its axis).
  template <typename Real>
  Vector3R<Real> pile_force(std::size_t i, bool active, const Vector3R<Real>& u) const {
    const Vector3R<Real> a = axes[i].cast<Real>();
    const Real along = a.dot(u);
    return (active ? static_cast<Real>(axial[i]) * along : Real(0)) * a +
           static_cast<Real>(lateral[i]) * (u - along * a);
  }

  // Head movement of pile i: u = t + θ × ρ (= T̂·Û).
  template <typename Real>
  Vector3R<Real> head_movement(std::size_t i, const Vector6R<Real>& movement) const {
    const Vector3R<Real> t = movement.template head<3>();
    const Vector3R<Real> theta = movement.template tail<3>();
    return t + theta.cross(offsets[i].cast<Real>());
  }

  // F̂ − Σ T̂ᵀ·f_i: the load the piles leave unbalanced, about c, moments over L
  // (T̂ᵀ·f = (f, ρ × f)).
  template <typename Real>
  Vector6R<Real> imbalance(const std::vector<bool>& active, const Vector6R<Real>& movement,
                           const Vector6& load) const {
    if constexpr (std::is_same_v<Real, double>) {
      if (bent.empty()) {
        // Every head pinned: one pass over the piles' arrays (active_set_passes.hpp), the
        // same operations in the same order as the loop below.
        const double m[6] = {movement(0), movement(1), movement(2),
                             movement(3), movement(4), movement(5)};
        const double f[6] = {load(0), load(1), load(2), load(3), load(4), load(5)};
        double sum[6];
        detail::pinned_imbalance(pinned, m, active, f, sum);
        Vector6 result;
        for (int j = 0; j < 6; ++j) result(j) = sum[j];
        return result;
      }
    }
    Vector6R<Real> sum = load.cast<Real>();
    for (std::size_t i = 0; i < offsets.size(); ++i) {
      const Vector3R<Real> u = head_movement<Real>(i, movement);
      Vector3R<Real> f = pile_force<Real>(i, active[i], u);
      const Vector3R<Real> moment = add_bending_action<Real>(i, u, movement, f);
      sum.template head<3>() -= f;
      sum.template tail<3>() -= offsets[i].cast<Real>().cross(f) + moment / static_cast<Real>(size);
    }
    return sum;
  }

  // The largest component of an imbalance over the largest component of F̂: forces over the
  // largest applied force, moments over L times it. Not a number when either is not finite.
  template <typename Real>
  static double relative(const Vector6R<Real>& miss, const Vector6& load) {
    if (!miss.allFinite() || !load.allFinite()) return std::numeric_limits<double>::quiet_NaN();
    const double applied = load.cwiseAbs().maxCoeff();
    const double missed = static_cast<double>(miss.cwiseAbs().maxCoeff());
    if (applied == 0.0) return missed == 0.0 ? 0.0 : std::numeric_limits<double>::infinity();
    return missed / applied;
  }

  // The solution for movement Û (forces, reported movement, relative imbalance). A movement
  // whose imbalance exceeds 1e-13 of the load — rounding in a well-conditioned group is
  // ~1e-16 — is refined in long double (iterative refinement, Û += K̂⁻¹·(F̂ − K̂·Û), while
  // the imbalance falls): piles of stiffness ratio R start near 1e-16·R and settle in a step
  // or two, to ~1e-19·R.
  // `whole_group`: dec is all_active and every pile active, reached without the active
  // set (the active set's solves take the imbalance pile by pile even when no pile dropped).
  CapSolution settled(const Decomposition& dec, const std::vector<bool>& active,
                      const Vector6& load, const Vector6& first, bool whole_group) const {
    return forces_of(settle(dec, active, load, first, whole_group), active, whole_group);
  }

  // The settled movement (settled() before its forces): in double, or refined in long double.
  struct Settled {
    Vector6 movement = Vector6::Zero();
    Vector6R<long double> refined = Vector6R<long double>::Zero();
    bool is_refined = false;
    double residual = 0.0;
  };
  Settled settle(const Decomposition& dec, const std::vector<bool>& active,
                 const Vector6& load, const Vector6& first, bool whole_group) const {
    constexpr double kSettled = 1e-13;
    // Every pile active in a well-conditioned group: F̂ − K̂·Û in 6-space is the imbalance
    // Σ T̂ᵀ·f_i would give (to rounding far below kSettled), in 36 operations instead of a
    // pass over the piles.
    if (whole_group && well_conditioned) {
      const double residual = relative<double>(load - stiffness_all * first, load);
      if (residual <= kSettled) return {first, {}, false, residual};
    }
    const double residual = relative(imbalance<double>(active, first, load), load);
    if (!(residual > kSettled)) return {first, {}, false, residual};
    Vector6R<long double> movement = first.cast<long double>();
    Vector6R<long double> miss = imbalance<long double>(active, movement, load);
    double refined = relative(miss, load);
    for (int step = 0; step < 4 && refined > kSettled; ++step) {
      const Vector6R<long double> next =
          movement + solve(dec, miss.cast<double>()).cast<long double>();
      const Vector6R<long double> next_miss = imbalance<long double>(active, next, load);
      const double next_refined = relative(next_miss, load);
      if (!(next_refined < refined)) break;
      movement = next;
      miss = next_miss;
      refined = next_refined;
    }
    return {Vector6::Zero(), movement, true, refined};
  }

  CapSolution forces_of(const Settled& s, const std::vector<bool>& active,
                        bool every_active) const {
    return s.is_refined ? forces_from<long double>(s.refined, active, every_active, s.residual)
                        : forces_from<double>(s.movement, active, every_active, s.residual);
  }

  // Where the solver writes the piles' forces as arrays (one value per pile, kN).
  struct ForceArrays {
    double* axial;
    double* lateral;
  };

  // The same solution with the piles' axial and lateral forces written to the arrays
  // `forces` instead of pile rows (CapSolution::piles left empty): the same numbers. A
  // movement refined in long double (stiff and soft piles together, rare) keeps its rows.
  CapSolution arrays_of(const Settled& s, const std::vector<bool>& active, bool every_active,
                        const ForceArrays& forces) const {
    if (s.is_refined) return forces_of(s, active, every_active);
    CapSolution solution = with_movement<double>(s.movement);
    solution.residual = s.residual;
    const double m[6] = {s.movement(0), s.movement(1), s.movement(2),
                         s.movement(3), s.movement(4), s.movement(5)};
    detail::pinned_axial_lateral(pinned, m, every_active ? nullptr : &active, forces.axial,
                                 forces.lateral);
    for (const std::size_t i : bent) {
      PileForce row;
      pile_forces_of<double>(i, s.movement, active[i], row);
      forces.axial[i] = row.axial;
      forces.lateral[i] = row.lateral;
    }
    return solution;
  }

  // Û as the solution of a settled movement reports it (movement_of of its CapMovement:
  // the rotation divided by L, rounded to double, and multiplied again).
  Vector6 reported(const Settled& s) const {
    Vector6 u;
    for (int i = 0; i < 3; ++i) {
      if (s.is_refined) {
        u(i) = static_cast<double>(s.refined(i));
        u(i + 3) = static_cast<double>(s.refined(i + 3) / static_cast<long double>(size)) * size;
      } else {
        u(i) = s.movement(i);
        u(i + 3) = (s.movement(i + 3) / size) * size;
      }
    }
    return u;
  }

  // True when a compression-only pile, active in `active` (every pile when null), is in
  // tension at the movement Û: its head moves away from the cap by more than kTensionShare
  // of the largest head movement.
  bool lifts(const Vector6& movement, const std::vector<bool>* active) const {
    if (!any_compression_only) return false;
    if (surely_closed(movement)) return false;
    double largest = 0.0;
    const std::vector<double> a = along(movement, largest);
    for (const std::size_t i : compression_only)
      if ((!active || (*active)[i]) && a[i] < -kTensionShare * largest) return true;
    return false;
  }

  // A solution with the reported movement of the nondimensional movement Û, no piles yet.
  template <typename Real>
  CapSolution with_movement(const Vector6R<Real>& movement) const {
    CapSolution solution;
    const Eigen::Vector3d t = movement.template head<3>().template cast<double>();
    const Eigen::Vector3d r =
        (movement.template tail<3>() / static_cast<Real>(size)).template cast<double>();
    solution.movement.reference = to_array(reference);
    solution.movement.translation_at_reference = to_array(t);
    solution.movement.rotation = to_array(r);
    // t₀ = t + r × (0 − c): the cap point at the origin, for display.
    solution.movement.translation = to_array(t - r.cross(reference));
    return solution;
  }

  // Pile forces and the reported movement from the nondimensional movement Û.
  // `every_active`: no pile dropped out (active is all true).
  template <typename Real>
  CapSolution forces_from(const Vector6R<Real>& movement, const std::vector<bool>& active,
                          bool every_active, double residual) const {
    CapSolution solution = with_movement<Real>(movement);
    if constexpr (std::is_same_v<Real, double>) {
      // Every pile as springs alone in one vectorized pass (the same operations as below,
      // pinned_forces.hpp), then the piles with head bending by the code below.
      const double m[6] = {movement(0), movement(1), movement(2),
                           movement(3), movement(4), movement(5)};
      detail::pinned_forces(pinned, m, every_active ? nullptr : &active, solution.piles);
      for (const std::size_t i : bent) pile_forces_of<Real>(i, movement, active[i], solution.piles[i]);
    } else {
      solution.piles.resize(maps.size());
      for (std::size_t i = 0; i < maps.size(); ++i)
        pile_forces_of<Real>(i, movement, active[i], solution.piles[i]);
    }
    solution.residual = residual;
    return solution;
  }

  // Pile i's forces and head actions at the movement Û.
  template <typename Real>
  void pile_forces_of(std::size_t i, const Vector6R<Real>& movement, bool is_active,
                      PileForce& pile) const {
    {
      const Vector3R<Real> u = head_movement<Real>(i, movement);
      const Vector3R<Real> a = axes[i].cast<Real>();
      const Real along = a.dot(u);
      pile.active = is_active;
      // An inactive pile carries no axial force: report zero.
      pile.axial = is_active ? static_cast<double>(axial[i] * along) : 0.0;
      pile.lateral = static_cast<double>(lateral[i] * (u - along * a).norm());
      Vector3R<Real> f = pile_force<Real>(i, is_active, u);
      const Vector3R<Real> moment = add_bending_action<Real>(i, u, movement, f);
      for (int j = 0; j < 3; ++j) {
        pile.head_forces[static_cast<std::size_t>(j)] = static_cast<double>(f(j));
        pile.head_forces[static_cast<std::size_t>(j + 3)] = static_cast<double>(moment(j));
      }
      if (bending[i].any()) {
        // The lateral shear includes the coupling force of a fixed head.
        pile.lateral = static_cast<double>((f - a.dot(f) * a).norm());
        pile.head_moment = static_cast<double>((moment - a.dot(moment) * a).norm());
      }
    }
  }
};

// Decompositions of the active sets met while solving many combinations, by set (the same
// set gives the same decomposition, so reusing it changes no result). Owned by one
// solve_combinations call, never shared between threads.
struct CapSolver::DecompositionCache {
  static constexpr std::size_t kLimit = 4096;  // about 2.5 MB; emptied when full
  std::unordered_map<std::vector<bool>, Impl::Decomposition> sets;

  const Impl::Decomposition& get(const Impl& impl, const std::vector<bool>& active) {
    auto found = sets.find(active);
    if (found != sets.end()) return found->second;
    if (sets.size() >= kLimit) sets.clear();
    return sets.emplace(active, impl.decompose(active)).first->second;
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
  Impl& m = *impl_;
  // Elastic centre: c = p₀ + Σ w_i·(p_i − p₀)/Σ w_i with w_i the vertical stiffness
  // k_a·a_z² + k_l·(1 − a_z²). Taken from the first head so that c stays among the heads
  // and every p_i − c is an exact difference of nearby numbers. Equal weights when no pile
  // has vertical stiffness.
  if (!springs_.empty()) {
    const Eigen::Vector3d first = to_vector3(springs_[0].head);
    std::vector<double> weight;
    double total = 0.0;
    for (const auto& s : springs_) {
      const double vertical = s.axis[2] * s.axis[2];
      weight.push_back(s.axial * vertical + s.lateral * (1.0 - vertical));
      total += weight.back();
    }
    if (!(total > 0.0)) {
      weight.assign(springs_.size(), 1.0);
      total = static_cast<double>(springs_.size());
    }
    Eigen::Vector3d shift = Eigen::Vector3d::Zero();
    for (std::size_t i = 0; i < springs_.size(); ++i)
      shift += (weight[i] / total) * (to_vector3(springs_[i].head) - first);
    m.reference = first + shift;
    // Rounded to a grid of about 1e-6 of the group's extent (a power of two, so the rounding
    // is exact): a symmetric group about the origin gets c = 0 exactly instead of ~1e-16, and
    // its symmetric results stay exact zeros. c only needs to lie near the elastic centre.
    double extent = 0.0;
    for (const auto& s : springs_) extent = std::max(extent, (to_vector3(s.head) - first).norm());
    if (extent > 0.0 && std::isfinite(extent)) {
      const double grid = std::ldexp(1.0, std::ilogb(extent) - 20);
      for (int j = 0; j < 3; ++j) m.reference(j) = std::round(m.reference(j) / grid) * grid;
    }
  }
  m.reference_point = to_array(m.reference);
  double reach = 0.0;
  for (const auto& s : springs_) reach = std::max(reach, (to_vector3(s.head) - m.reference).norm());
  m.size = reach > 0.0 ? reach : 1.0;
  for (const auto& s : springs_) {
    const Eigen::Vector3d a = to_vector3(s.axis);
    m.offsets.push_back((to_vector3(s.head) - m.reference) / m.size);
    m.maps.push_back(head_map(m.offsets.back()));
    m.axes.push_back(a);
    m.axial.push_back(s.axial);
    m.lateral.push_back(s.lateral);
    const Matrix36& t = m.maps.back();
    m.contributions.push_back(t.transpose() * spring_matrix(a, s.axial, s.lateral) * t);
    m.lateral_contributions.push_back(t.transpose() * spring_matrix(a, 0.0, s.lateral) * t);
    const double has_lateral = s.lateral > 0.0 ? 1.0 : 0.0;
    m.pattern.push_back(t.transpose() *
                        spring_matrix(a, s.axial > 0.0 ? 1.0 : 0.0, has_lateral) * t);
    m.lateral_pattern.push_back(t.transpose() * spring_matrix(a, 0.0, has_lateral) * t);
    m.axial_pattern.push_back(m.pattern.back() - m.lateral_pattern.back());
    m.bending.push_back(s.bending);
    if (s.bending.any()) {
      m.add_bending(m.contributions.size() - 1);
      m.bent.push_back(m.contributions.size() - 1);
    }
    const Eigen::Vector3d& rho = m.offsets.back();
    const double rho_array[3] = {rho(0), rho(1), rho(2)};
    m.pinned.add(rho_array, s.axis.data(), s.axial, s.lateral);
  }
  double stiffest = 0.0, softest = std::numeric_limits<double>::infinity();
  for (std::size_t i = 0; i < springs_.size(); ++i) {
    m.stiffness_all += m.contributions[i];
    m.pattern_all += m.pattern[i];
    m.any_compression_only = m.any_compression_only || !springs_[i].tension;
    if (!springs_[i].tension) {
      const Eigen::Vector3d lever = m.offsets[i].cross(m.axes[i]);
      if (m.compression_only.empty()) {
        m.axis_low = m.axis_high = m.axes[i];
        m.lever_low = m.lever_high = lever;
      }
      m.axis_low = m.axis_low.cwiseMin(m.axes[i]);
      m.axis_high = m.axis_high.cwiseMax(m.axes[i]);
      m.lever_low = m.lever_low.cwiseMin(lever);
      m.lever_high = m.lever_high.cwiseMax(lever);
      m.reach_one = std::max(m.reach_one, m.offsets[i].lpNorm<1>());
      m.compression_only.push_back(i);
    }
    for (const double k : {springs_[i].axial, springs_[i].lateral})
      if (k > 0.0) stiffest = std::max(stiffest, k), softest = std::min(softest, k);
  }
  m.all_active = m.decompose(std::vector<bool>(springs_.size(), true));
  m.well_conditioned = stiffest > 0.0 && stiffest <= 1e3 * softest && std::isfinite(stiffest);
}

CapSolver::~CapSolver() = default;
CapSolver::CapSolver(CapSolver&&) noexcept = default;
CapSolver& CapSolver::operator=(CapSolver&&) noexcept = default;

const std::array<double, 3>& CapSolver::reference() const { return impl_->reference_point; }

std::array<std::array<double, 6>, 6> CapSolver::stiffness_about(
    const std::array<double, 3>& point) const {
  const Impl& m = *impl_;
  Matrix6 k = Matrix6::Zero();
  for (const auto& c : m.contributions) k += c;
  // Physical units about c: (F, M) = S·K̂·S·(t, r) with S = diag(1, 1, 1, L, L, L).
  Vector6 s;
  s << 1.0, 1.0, 1.0, m.size, m.size, m.size;
  const Matrix6 about_reference = s.asDiagonal() * k * s.asDiagonal();
  // The cap point at c moves t_c = t_p + r × (c − p): (t_c, r) = A·(t_p, r), K_p = Aᵀ·K_c·A.
  const Eigen::Vector3d d = m.reference - to_vector3(point);
  Matrix6 a = Matrix6::Identity();
  Eigen::Matrix3d skew;
  skew << 0, -d(2), d(1), d(2), 0, -d(0), -d(1), d(0), 0;
  a.block<3, 3>(0, 3) = -skew;
  const Matrix6 result = a.transpose() * about_reference * a;
  std::array<std::array<double, 6>, 6> out{};
  for (int i = 0; i < 6; ++i)
    for (int j = 0; j < 6; ++j)
      out[static_cast<std::size_t>(i)][static_cast<std::size_t>(j)] = result(i, j);
  return out;
}

double CapSolver::size() const { return impl_->size; }

CapLoad CapSolver::from_origin(const Wrench& w) const {
  // M_c = M₀ + (0 − c) × F.
  const Eigen::Vector3d c = impl_->reference;
  const Eigen::Vector3d force(w[0], w[1], w[2]);
  const Eigen::Vector3d moment = Eigen::Vector3d(w[3], w[4], w[5]) + (-c).cross(force);
  return CapLoad({w[0], w[1], w[2], moment(0), moment(1), moment(2)});
}

std::vector<UnresistedLoad> CapSolver::unresisted(const CapLoad& load) const {
  std::vector<UnresistedLoad> result;
  bool battered = false, lateral = false;
  for (const auto& s : springs_) {
    battered = battered || std::abs(s.axis[2] + 1.0) > 1e-12;
    lateral = lateral || s.lateral > 0.0;
  }
  for (int component : impl_->loaded_null(impl_->all_active, impl_->scaled(load))) {
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

std::vector<UnresistedLoad> CapSolver::unresisted(const Wrench& about_origin) const {
  return unresisted(from_origin(about_origin));
}

CapSolution CapSolver::solve_linear(const CapLoad& load) const {
  const std::vector<bool> all(springs_.size(), true);
  const Vector6 f = impl_->scaled(load);
  CapSolution solution =
      impl_->settled(impl_->all_active, all, f, impl_->solve(impl_->all_active, f), true);
  solution.iterations = 1;
  return solution;
}

CapSolution CapSolver::solve_linear(const Wrench& about_origin) const {
  return solve_linear(from_origin(about_origin));
}

bool CapSolver::needs_redistribution(const CapSolution& solution) const {
  if (!impl_->any_compression_only) return false;
  std::vector<bool> active(springs_.size());
  for (std::size_t i = 0; i < springs_.size(); ++i) active[i] = solution.piles[i].active;
  return impl_->lifts(impl_->movement_of(solution.movement), &active);
}

CapSolution CapSolver::superpose(const std::vector<std::pair<const CapSolution*, double>>& parts,
                                 const CapLoad& load) const {
  Vector6 u = Vector6::Zero();
  for (const auto& [part, factor] : parts) u += factor * impl_->movement_of(part->movement);
  const std::vector<bool> all(springs_.size(), true);
  // The parts were settled against their own loads; the sum is settled against the
  // combination's (for very stiff piles the rounded parts do not add up to it).
  CapSolution solution = impl_->settled(impl_->all_active, all, impl_->scaled(load), u, true);
  solution.iterations = 0;
  return solution;
}

CapSolution CapSolver::superpose(const std::vector<std::pair<const CapSolution*, double>>& parts,
                                 const Wrench& about_origin) const {
  return superpose(parts, from_origin(about_origin));
}

CapSolution CapSolver::solve_superposed(
    const std::vector<std::pair<const CapSolution*, double>>& parts, const CapLoad& load,
    DecompositionCache& cache, double* axial, double* lateral) const {
  // superpose(), then solve() when needs_redistribution(): the same results, without the
  // superposed forces of a combination that lifts piles (decided from its movement alone)
  // and with the active sets' decompositions kept for the next combinations.
  Vector6 u = Vector6::Zero();
  for (const auto& [part, factor] : parts) u += factor * impl_->movement_of(part->movement);
  const std::vector<bool> all(springs_.size(), true);
  const Impl::Settled settled =
      impl_->settle(impl_->all_active, all, impl_->scaled(load), u, true);
  if (impl_->lifts(impl_->reported(settled), nullptr))
    return solve_active(load, &cache, axial, lateral);
  CapSolution solution = axial ? impl_->arrays_of(settled, all, true, {axial, lateral})
                               : impl_->forces_of(settled, all, true);
  solution.iterations = 0;
  return solution;
}

CapSolution CapSolver::solve(const Wrench& about_origin) const {
  return solve(from_origin(about_origin));
}

CapSolution CapSolver::solve(const CapLoad& load) const {
  return solve_active(load, nullptr, nullptr, nullptr);
}

CapSolution CapSolver::solve_active(const CapLoad& load, DecompositionCache* cache,
                                    double* axial, double* lateral) const {
  const std::size_t n = springs_.size();
  const Vector6 f = impl_->scaled(load);
  std::vector<bool> active(n, true);
  std::unordered_set<std::vector<bool>> seen, slow_seen;  // sets met (hashed by word)
  bool one_at_a_time = false;
  // Piles left out for good: see the one-at-a-time steps below.
  std::vector<bool> left_out(n, false);
  const int limit = static_cast<int>(4 * n + 20);
  std::vector<double> along;
  std::vector<std::size_t> drop, add;
  // Each pile's state as active_set_passes.hpp reads it (active, left_out and whether the
  // pile takes tension, kept beside them), and the piles whose state the step changes.
  std::vector<std::uint8_t> state(n, detail::kTakesTension), moves(n);
  for (const std::size_t i : impl_->compression_only) state[i] = detail::kInContact;
  auto set_active = [&](std::size_t i, bool on) {
    if (i >= n) throw std::logic_error("the active set changed a pile it does not hold");
    active[i] = on;
    state[i] = on ? detail::kInContact : detail::kDroppedOut;
  };
  for (int iteration = 1; iteration <= limit; ++iteration) {
    const bool all = std::find(active.begin(), active.end(), false) == active.end();
    std::optional<Impl::Decomposition> own;
    const Impl::Decomposition& dec = all      ? impl_->all_active
                                     : cache ? cache->get(*impl_, active)
                                             : own.emplace(impl_->decompose(active));
    const auto loaded = impl_->loaded_null(dec, f);
    const bool any_active = std::find(active.begin(), active.end(), true) != active.end();
    if (!loaded.empty() || !any_active) {
      CapSolution failed;
      failed.piles.assign(n, PileForce{0.0, 0.0, false});
      for (std::size_t i = 0; i < n; ++i) {
        failed.piles[i].active = active[i];
        if (!active[i]) failed.dropped.push_back(i);
      }
      failed.movement.reference = to_array(impl_->reference);
      failed.overturns = true;
      failed.iterations = iteration;
      failed.failure =
          "the cap overturns: the piles that take no tension cannot hold the resultant of the "
          "loads; it lies outside the reach of the piles left in compression";
      return failed;
    }
    const Vector6 u = impl_->solve(dec, f);
    // Would-be axial movement of every pile head, active or not.
    const double largest = impl_->along_into(u, along);
    const double tol = kTensionShare * largest;
    drop.clear();
    add.clear();
    // The active piles in tension (dropped) and the dropped piles closed again (added), in
    // pile order.
    if (detail::active_set_moves(n, along.data(), state.data(), tol, moves.data()))
      for (std::size_t i = 0; i < n; ++i)
        if (moves[i]) (state[i] == detail::kInContact ? drop : add).push_back(i);
    if (drop.empty() && add.empty()) {
      const Impl::Settled settled = impl_->settle(dec, active, f, u, false);
      CapSolution solution = axial ? impl_->arrays_of(settled, active, false, {axial, lateral})
                                   : impl_->forces_of(settled, active, false);
      for (std::size_t i = 0; i < n; ++i)
        if (!active[i]) solution.dropped.push_back(i);
      solution.iterations = iteration;
      return solution;
    }
    if (one_at_a_time) {
      // Change one pile at a time: the most stretched active pile, else the most closed one.
      std::size_t changed = 0;
      if (!drop.empty()) {
        changed = *std::min_element(drop.begin(), drop.end(),
                                    [&](auto a, auto b) { return along[a] < along[b]; });
        set_active(changed, false);
      } else {
        changed = *std::max_element(add.begin(), add.end(),
                                    [&](auto a, auto b) { return along[a] < along[b]; });
        set_active(changed, true);
      }
      // A dropped pile loses its lateral spring as well as its axial one, so a
      // compression-only pile with a lateral spring can have no consistent state: out, the
      // cap closes on it; back in, its own lateral spring pulls it into tension (its axial
      // force is near zero either way). One pile at a time, the steps are fixed by the
      // state, so returning to a state met on this path is a cycle: the pile that closes it
      // is left out for good (it carries nothing; the others hold the load).
      if (!slow_seen.insert(active).second) {
        set_active(changed, false);
        left_out[changed] = true;
        state[changed] = detail::kLeftOut;
      }
    } else {
      for (auto i : drop) set_active(i, false);
      for (auto i : add) set_active(i, true);
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
    for (const auto& u :
         solver.unresisted(CapLoad(resultant_about(project.load_cases[c], solver.reference()))))
      result.push_back({c, u});
  return result;
}

Wrench combination_load(const Project& project, const Combination& combination,
                        const std::array<double, 3>& point) {
  Wrench total{};
  for (const auto& [index, factor] : combination.factors) {
    const Wrench w = resultant_about(project.load_cases[index], point);
    for (std::size_t i = 0; i < 6; ++i) total[i] += factor * w[i];
  }
  return total;
}

Wrench combination_load(const Project& project, const Combination& combination) {
  return combination_load(project, combination, {0.0, 0.0, 0.0});
}

std::vector<CapSolution> solve_combinations(const Project& project, const CapSolver& solver) {
  std::vector<CapSolution> result;
  result.reserve(project.combinations.size());
  solve_combinations(project, solver,
                     [&](std::size_t, CapSolution&& solution) { result.push_back(std::move(solution)); });
  return result;
}

void solve_combinations(const Project& project, const CapSolver& solver,
                        const std::function<void(std::size_t, CapSolution&&)>& each) {
  solve_combinations(project, solver, [](std::size_t) { return true; },
                     [&](std::size_t c, CapSolution&& solution, const double*, const double*) {
                       each(c, std::move(solution));
                     });
}

void solve_combinations(
    const Project& project, const CapSolver& solver,
    const std::function<bool(std::size_t)>& rows,
    const std::function<void(std::size_t, CapSolution&&, const double*, const double*)>& each) {
  std::vector<CapSolution> per_case;
  per_case.reserve(project.load_cases.size());
  for (const auto& lc : project.load_cases)
    per_case.push_back(solver.solve_linear(CapLoad(resultant_about(lc, solver.reference()))));
  // Each load case's resultant about the reference point, once (combination_load sums the
  // same terms in the same order).
  std::vector<Wrench> case_loads;
  case_loads.reserve(project.load_cases.size());
  for (const auto& lc : project.load_cases) case_loads.push_back(resultant_about(lc, solver.reference()));
  constexpr double kResidualLimit = 1e-6;
  CapSolver::DecompositionCache cache;
  std::vector<double> axial(solver.springs().size()), lateral(solver.springs().size());
  for (std::size_t c = 0; c < project.combinations.size(); ++c) {
    const Combination& combo = project.combinations[c];
    Wrench total{};
    for (const auto& [index, factor] : combo.factors)
      for (std::size_t i = 0; i < 6; ++i) total[i] += factor * case_loads[index][i];
    const CapLoad load(total);
    std::vector<std::pair<const CapSolution*, double>> parts;
    for (const auto& [index, factor] : combo.factors) parts.emplace_back(&per_case[index], factor);
    const bool as_rows = rows(c);
    CapSolution solution =
        solver.solve_superposed(parts, load, cache, as_rows ? nullptr : axial.data(),
                                as_rows ? nullptr : lateral.data());
    if (!solution.overturns && !(solution.residual <= kResidualLimit))  // NaN fails too
      throw std::logic_error(fmt::format(
          "combination '{}' misses equilibrium by {:.3g} of the load", combo.id,
          solution.residual));
    // Rows formed (asked for, or an overturned combination): no arrays.
    const bool arrays = solution.piles.empty();
    each(c, std::move(solution), arrays ? axial.data() : nullptr,
         arrays ? lateral.data() : nullptr);
  }
}

}  // namespace cairn
