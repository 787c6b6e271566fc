// nonlinear_cap.hpp — the rigid-cap equilibrium of a pile group on nonlinear soil: the cap's
// six displacements found by Newton iteration on the sum of the piles' nonlinear head
// responses (nonlinear_pile.hpp), in load steps, for one combination at a time (no
// superposition); and the group's pushover curve (pushover.hpp).
//
// Kinematics, as in cap_solver.hpp: the cap moves t (translation of the cap point at the
// reference point c) and r (rotation); a pile head at p moves
//     u = t + r × (p − c),   ω = r,
// the head movement (u, ω) = T·(t, r) with T = [[I, −[p − c]×], [0, I]]. Each pile answers
// with the action (F, M) of the cap on the pile at its head and its tangent K_i = ∂(F, M)/∂(u, ω).
// Equilibrium of the cap about c for a load (F_app, M_app) scaled by the load factor λ:
//     R(t, r) = λ·(F_app, M_app) − Σ Tᵢᵀ·(Fᵢ, Mᵢ) = 0,   Tᵀ·(F, M) = (F, (p − c) × F + M),
// solved by Newton's method with the tangent K = Σ Tᵢᵀ·Kᵢ·Tᵢ: K·Δ = R, then a backtracking
// line search on |R| (Δ, Δ/2, Δ/4, … while the residual does not fall). The unknowns are
// nondimensional as in CapSolver — rotations times the group's size L, moments over L — and
// the system is equilibrated to a unit diagonal before it is solved.
//
// Load steps: λ goes from 0 to 1 in `initial_steps` equal steps; a step whose Newton
// iteration does not converge (or in which a pile's own response does not) is halved, a step
// that converged in a few iterations is doubled for the next one; when the step falls below
// `smallest_step` the group has no equilibrium beyond the last λ reached: a mechanism (the
// soil along the piles or their axial resistance is exhausted), reported in plain words
// instead of numbers (CapSolution::overturns and ::failure).
//
// Convergence: the largest component of R — forces against the largest applied force,
// moments over L against the same — at most `tolerance` (default 1e-10) of the largest
// applied component. Where the piles' own responses are computed only to a coarser accuracy
// the iteration may stall above it; a stalled residual below `accept` (default 1e-6) is
// taken as converged and reported in CapSolution::residual.
//
// Reference point c: the heads' centroid weighted by their initial vertical stiffness (the
// elastic centre of the linear analysis, from the tangents at zero movement), rounded to a
// grid of about 1e-6 of the group's extent.
//
// Units: kN, m, kN·m, rad.
#pragma once

#include <array>
#include <cstddef>
#include <functional>
#include <memory>
#include <string>
#include <vector>

#include "cairn/solver/cap_solver.hpp"
#include "cairn/solver/nonlinear_pile.hpp"
#include "cairn/solver/pushover.hpp"

namespace cairn {

// The head response of pile `pile` (index) at head movement `movement` with its p-y curves
// scaled by `p_multiplier` (pile_head_response of nonlinear_pile.hpp, or any other model).
using PileResponseFunction =
    std::function<PileHeadResponse(std::size_t pile, const HeadMovement& movement, double p_multiplier)>;
// The pile's profile with depth at a head movement (pile_profile of nonlinear_pile.hpp).
using PileProfileFunction =
    std::function<PileProfile(std::size_t pile, const HeadMovement& movement, double p_multiplier)>;

// The piles of a group as the nonlinear cap sees them.
struct NonlinearGroup {
  std::vector<std::array<double, 3>> heads;  // m, global
  std::vector<std::array<double, 3>> axes;   // unit, head → toe
  std::vector<bool> tension;                 // false: the pile takes no tension
  PileResponseFunction response;
  PileProfileFunction profile;  // may be empty: no profile with depth in the results
  std::vector<std::string> names;  // pile ids for messages (may be empty: "pile 3")
  std::vector<std::string> curves;  // per pile: PileCurves::description, for the report
};

// The group of `specs` on pile_head_response and pile_profile (nonlinear_pile.hpp); each pile
// starts its own iteration from its last converged shape (DeflectedShape). Names and curves from
// the specs' order: give names after.
NonlinearGroup nonlinear_group(std::vector<NonlinearPileSpec> specs);

struct NonlinearSettings {
  double tolerance = 1e-10;   // relative residual for convergence (header)
  double accept = 1e-6;       // a stalled residual below this is taken as converged
  int iterations = 30;        // Newton iterations per load step
  int initial_steps = 1;      // equal load steps from λ = 0 to 1 to start with
  double smallest_step = 1.0 / 512.0;  // Δλ below which the group has no equilibrium
  // A cap translation (m), or rotation times L, above which the group is taken to have no
  // equilibrium (its movement runs away); 0: no limit.
  double movement_limit = 0.0;
};

// What the report needs of each pile beyond its PileForce.
struct NonlinearPileResult {
  double p_multiplier = 1.0;
  double head_deflection = 0.0;   // m, across the axis, resultant
  double max_moment = 0.0;        // kN·m, largest resultant moment along the pile
  double max_moment_depth = 0.0;  // m below the head
  bool profiled = false;          // the three above come from the pile's profile with depth
};

struct NonlinearCapResult {
  // Movement, pile forces (head_forces = the action of the cap on the pile at its head),
  // residual; overturns + failure when no equilibrium was found.
  CapSolution solution;
  std::vector<NonlinearPileResult> piles;
  double reached = 0.0;  // the largest λ with equilibrium (1 when it converged)
  int steps = 0;         // load steps taken (converged ones)
  int iterations = 0;    // Newton iterations in all
};

// Limits of a pushover beyond λ = 1.
struct PushoverLimits {
  double largest_factor = 5.0;  // λ at which the curve stops
  double displacement = 0.0;    // m along the load's direction; 0: none
  double step = 0.25;           // Δλ between the points beyond λ = 1
  UnitSystem units = UnitSystem::SI;  // for the numbers in the end reason only
};

class NonlinearCapSolver {
 public:
  // Requires group.response, and heads, axes and tension of the same size (≥ 1).
  explicit NonlinearCapSolver(NonlinearGroup group, NonlinearSettings settings = {});

  const std::array<double, 3>& reference() const { return reference_; }
  double size() const { return size_; }
  const NonlinearGroup& group() const { return group_; }
  // `about_origin` moved to the reference point.
  CapLoad from_origin(const Wrench& about_origin) const;

  // The cap under `load` (about the reference point), each pile's p-y curves scaled by its
  // p-multiplier (empty: all 1). `combination` names the load in the failure message.
  NonlinearCapResult solve(const CapLoad& load, const std::vector<double>& p_multipliers,
                           const std::string& combination) const;

  // The load of `load` scaled by λ from 0 through 1 and beyond until the group forms a
  // mechanism or a limit is reached.
  PushoverCurve pushover(const CapLoad& load, const std::vector<double>& p_multipliers,
                         const std::string& combination, const PushoverLimits& limits) const;

 private:
  struct State;
  struct Path;
  // Advances `path` from its λ to `target`; false when no equilibrium was found on the way.
  bool advance(Path& path, double target) const;
  NonlinearCapResult result_of(const Path& path, const std::string& combination) const;

  NonlinearGroup group_;
  NonlinearSettings settings_;
  std::shared_ptr<const State> rest_;  // the group at rest, its initial tangent
  std::array<double, 3> reference_{};
  double size_ = 1.0;
};

}  // namespace cairn
