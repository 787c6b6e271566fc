// cap_solver.hpp — the rigid-cap equilibrium of a pile group.
//
// The cap is a rigid body with six degrees of freedom: the translation t of the cap point at
// a reference point c and the rotation r. Each pile head, at its true position and along its
// true axis (batter included), is a pair of linear springs: an axial spring k_a along the
// unit axis a (pointing from head to toe) and a lateral spring k_l across it (pinned head).
// A pile head at p moves u = t + r × (p − c); its force on the cap is
//     R = −[k_a·a·aᵀ + k_l·(I − a·aᵀ)]·u
// and the cap stiffness is the sum of Tᵀ·K_pile·T with T = [I | −[p − c]×]. Solving K·U = F
// for the applied force and moment F (about c) gives U, then each pile's
//     axial force  N = k_a·(a·u)   (compression positive: the cap pushes the pile along a)
//     lateral shear V = k_l·|u − (a·u)·a|.
// This is the classical rigid-cap analysis of pile groups with battered piles (Hrennikoff
// 1949; Saul 1968); for vertical piles of equal stiffness it reduces to
//     P_i = P/n ± M_y·x_i/Σx² ± M_x·y_i/Σy² (with the product term for unsymmetric groups).
//
// Precision. The reference point c is the group's elastic centre (the pile heads' centroid
// weighted by their vertical stiffness; the plain centroid for equal piles), so a group far
// from the origin (survey grid coordinates) loses no digits: every lever arm is a
// difference of input coordinates (p − c, load point − c), never a moment about the origin.
// The system is solved nondimensionally — rotations times the group's size L (the largest
// |p − c|), stiffness equilibrated to a unit diagonal — and whether a direction has no
// stiffness is decided from the geometry and which springs exist (a unit-spring copy of the
// stiffness), relative to its largest value, so stiff and soft piles together (ratios of
// 1e10) do not make a stable group look unstable; where such piles leave an imbalance above
// 1e-13 of the load, the solution is refined with the imbalance in long double (docs/methods.md
// §2 gives the tolerances). Results are reported about the user's
// origin: the rotation is the same about every point; the translation at the origin,
// t₀ = t − r × c, is computed from t and r for display only (superposition and the pile
// forces use t at c).
//
// Piles that take no tension are handled by an active set: piles in tension drop out (their
// axial spring is removed; the lateral spring stays, since the soil still holds the pile
// across its axis), the cap is solved again, and dropped piles that would close again come
// back, until the set settles. When the remaining piles cannot hold the load the combination overturns.
//
// Units: kN, m, kN·m, kN/m, radians.
#pragma once

#include <array>
#include <cstddef>
#include <functional>
#include <memory>
#include <string>
#include <vector>

#include "cairn/core/model.hpp"
#include "cairn/solver/pile_head.hpp"

namespace cairn {

struct PileSpring {
  std::array<double, 3> head{};  // m
  std::array<double, 3> axis{};  // unit vector, head → toe
  double axial = 0.0;            // kN/m
  double lateral = 0.0;          // kN/m
  bool tension = true;           // false: compression only
  HeadBending bending{};         // fixed or partially fixed heads (pile_head.hpp); zero: pinned
};

// Springs of every pile of the project, in the order of Project::piles.
std::vector<PileSpring> pile_springs(const Project& project);

struct PileForce {
  double axial = 0.0;    // kN, compression positive
  double lateral = 0.0;  // kN, resultant shear across the pile axis
  bool active = true;    // false: dropped out (would be in tension, takes none); its
                         // lateral spring still acts
  // The action of the cap on the pile at its head, global axes: Fx, Fy, Fz (kN), Mx, My, Mz
  // (kN·m about the head). A compression pile has Fz < 0. Σ (p × F + M) over the piles is
  // the load on the cap.
  Wrench head_forces{};
  double head_moment = 0.0;  // kN·m, the bending moment at the head, |M| across the axis
};

struct CapMovement {
  std::array<double, 3> translation{};  // m, of the cap point at the origin (for display:
                                        // t₀ = t − r × c, large when c is far away)
  std::array<double, 3> rotation{};     // rad, about the global axes (the same about any point)
  std::array<double, 3> reference{};    // m, the solver's reference point c
  std::array<double, 3> translation_at_reference{};  // m, t: the cap point at c
};

struct CapSolution {
  CapMovement movement;
  std::vector<PileForce> piles;
  bool overturns = false;  // no equilibrium with the compression-only piles left
  std::string failure;     // plain words, when overturns
  std::vector<std::size_t> dropped;  // piles that dropped out (indices)
  int iterations = 0;                // solves of the active-set loop (1 = linear)
  // Equilibrium about the reference point: the largest component of Σ pile forces + load,
  // moments over L, divided by the largest applied component (moments over L): forces
  // against the largest applied force, moments against it times the group's size L.
  double residual = 0.0;
};

// A load component the piles cannot resist at all.
struct UnresistedLoad {
  std::string component;  // "Fx", …, "Mz"
  std::string reason;     // e.g. "no battered piles and no lateral stiffness"
};

// A load as the solver takes it: forces (kN) and moments (kN·m) about the solver's
// reference point. Build it from the loads' points (resultant_about, combination_load with
// the reference point) so that no digits are lost far from the origin. The constructor is
// explicit so that a braced list of six numbers always means a Wrench about the origin.
struct CapLoad {
  CapLoad() = default;
  explicit CapLoad(const Wrench& about) : about_reference(about) {}
  Wrench about_reference{};
};

// Rigid-cap solver for one set of pile springs. Construction assembles and decomposes the
// stiffness of the full group once; each solve is then cheap.
//
// Each solving function takes a CapLoad (about the reference point), or a Wrench about the
// origin, which is moved to the reference point first (M_c = M₀ − c × F: exact near the
// origin; far from it, build a CapLoad from the loads' points instead).
class CapSolver {
 public:
  explicit CapSolver(std::vector<PileSpring> springs);
  ~CapSolver();
  CapSolver(CapSolver&&) noexcept;
  CapSolver& operator=(CapSolver&&) noexcept;

  // The reference point c (m): the pile heads' centroid weighted by vertical stiffness.
  const std::array<double, 3>& reference() const;
  // The group's size L (m): the largest distance of a pile head from c (1 m for one pile).
  double size() const;
  // `about_origin` moved to the reference point.
  CapLoad from_origin(const Wrench& about_origin) const;

  // Components of `load` that act along a direction with no stiffness (empty when none).
  std::vector<UnresistedLoad> unresisted(const CapLoad& load) const;
  std::vector<UnresistedLoad> unresisted(const Wrench& about_origin) const;

  // Linear solution with every pile active (tension allowed in all). Requires
  // unresisted(load) to be empty.
  CapSolution solve_linear(const CapLoad& load) const;
  CapSolution solve_linear(const Wrench& about_origin) const;

  // Solution honouring compression-only piles (the active-set iteration). A load that the
  // remaining piles cannot hold gives a solution with `overturns` set.
  CapSolution solve(const CapLoad& load) const;
  CapSolution solve(const Wrench& about_origin) const;

  // Superposes linear solutions: Σ factor_i·solution_i (movements and pile forces).
  CapSolution superpose(const std::vector<std::pair<const CapSolution*, double>>& parts,
                        const CapLoad& load) const;
  CapSolution superpose(const std::vector<std::pair<const CapSolution*, double>>& parts,
                        const Wrench& about_origin) const;

  // True when some compression-only pile is in tension in `solution` (its head moves away
  // from the cap by more than 1e-12 of the largest head movement, the same test that drops
  // a pile in solve()).
  bool needs_redistribution(const CapSolution& solution) const;

  const std::vector<PileSpring>& springs() const { return springs_; }

  // The cap's 6×6 stiffness about `point` with every pile active (tension allowed), row-major:
  // (Fx, Fy, Fz, Mx, My, Mz) = K·(ux, uy, uz, rx, ry, rz) for the cap point at `point`;
  // kN/m, kN/rad, kN·m/m, kN·m/rad. For the global structural model.
  std::array<std::array<double, 6>, 6> stiffness_about(const std::array<double, 3>& point) const;

 private:
  struct Impl;
  struct DecompositionCache;
  // solve() with the decompositions of the active sets met kept in `cache` (none: not kept).
  // With `axial` (and `lateral`), the piles' axial and lateral forces are written there, one
  // per pile, instead of the pile rows (except for an overturned combination).
  CapSolution solve_active(const CapLoad& load, DecompositionCache* cache, double* axial,
                           double* lateral) const;
  // superpose() followed by solve_active() when a compression-only pile would be in tension.
  CapSolution solve_superposed(const std::vector<std::pair<const CapSolution*, double>>& parts,
                               const CapLoad& load, DecompositionCache& cache, double* axial,
                               double* lateral) const;
  friend void solve_combinations(
      const Project& project, const CapSolver& solver,
      const std::function<bool(std::size_t)>& rows,
      const std::function<void(std::size_t, CapSolution&&, const double*, const double*)>& each);
  std::vector<PileSpring> springs_;
  std::unique_ptr<Impl> impl_;
};

// Load cases that push along a direction nothing resists, as messages located at the load
// case ("load case 'W': Fx cannot be resisted: no battered piles and no lateral stiffness").
struct UnresistedCase {
  std::size_t load_case = 0;
  UnresistedLoad load;
};
std::vector<UnresistedCase> unresisted_cases(const Project& project, const CapSolver& solver);

// Solves every combination of the project: each load case once, superposed by the factors;
// a combination in which a compression-only pile would be in tension is solved again on its
// own with the active-set iteration. Loads are taken about the solver's reference point from
// their points. Requires unresisted_cases() to be empty.
// Throws std::logic_error when equilibrium is missed by more than 1e-6 (CapSolution::residual).
std::vector<CapSolution> solve_combinations(const Project& project, const CapSolver& solver);
// The same, handing each combination's solution to `each` (index, solution) in order instead
// of keeping them all.
void solve_combinations(const Project& project, const CapSolver& solver,
                        const std::function<void(std::size_t, CapSolution&&)>& each);
// The same for a consumer of the piles' axial and lateral forces: `rows(c)` says whether
// combination c needs its pile rows (CapSolution::piles). When it does not, the forces are
// handed over as arrays instead, axial[i] and lateral[i] (kN) for pile i, valid during the
// call, written by a pass that forms nothing else, and CapSolution::piles is empty; the
// numbers are the rows' to the last bit. When the solution has its rows (asked for, or an
// overturned combination: each pile's state) the arrays are null.
void solve_combinations(
    const Project& project, const CapSolver& solver,
    const std::function<bool(std::size_t)>& rows,
    const std::function<void(std::size_t, CapSolution&&, const double* axial,
                             const double* lateral)>& each);


// Total load of a combination as a wrench about the origin (for display).
Wrench combination_load(const Project& project, const Combination& combination);
// Total load of a combination as a wrench about `point` (lever arms as above).
Wrench combination_load(const Project& project, const Combination& combination,
                        const std::array<double, 3>& point);

}  // namespace cairn
