// nonlinear_combinations.hpp — every combination of a project solved on nonlinear soil
// (nonlinear_cap.hpp), each on its own: the loads of a nonlinear run do not superpose, so each
// combination's own loads (factored for strength, service loads for service, as the
// combination gives them) are applied in load steps from zero.
//
// Group action: each combination's p-multipliers (geotechnics/p_multipliers.hpp) follow the
// plan direction of its horizontal resultant (the leading row is the row farthest along it);
// with `reversing`, each pile takes the smaller of its multipliers for that direction and the
// opposite one (loads that reverse); with `none`, every multiplier is 1. A combination with
// no horizontal load (below 1e-9 of its vertical load) takes 1 for every pile: no row leads.
// The width in the spacing ratio is the widest pile section of the group.
//
// Units: kN, m, kN·m, rad.
#pragma once

#include <cstddef>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "cairn/core/model.hpp"
#include "cairn/solver/nonlinear_cap.hpp"
#include "cairn/solver/pushover.hpp"

namespace cairn {

// What a nonlinear run adds to one combination's CapSolution.
struct NonlinearCombination {
  double reached = 1.0;            // the largest λ with equilibrium (1 when converged)
  int steps = 0, iterations = 0;   // load steps and Newton iterations
  std::optional<double> direction; // rad from +x, the horizontal resultant's plan direction
  std::vector<NonlinearPileResult> piles;  // per pile, as Project::piles
};

// One pile's profile with depth (deflection, moment, shear, axial) in one combination, for
// the report's diagrams.
struct NonlinearProfile {
  std::size_t pile = 0;         // index into Project::piles
  std::size_t combination = 0;  // index into Project::combinations
  std::string why;              // "largest utilization", "largest moment", "largest deflection"
  PileProfile profile;          // SI: m, kN, kN·m
};

// Everything a nonlinear run adds to the check, for the outputs.
struct NonlinearRun {
  GroupMultipliers rule = GroupMultipliers::by_direction;
  // The group's first plan axis for the rows of the p-multipliers, radians from +x
  // (p_multiplier_axis; the second is 90° from it).
  double multiplier_axis = 0.0;
  std::vector<std::string> curves;   // per pile type: PileCurves::description (empty: unused)
  std::vector<NonlinearCombination> combinations;  // as Project::combinations
  std::optional<PushoverCurve> pushover;
  // The governing piles' profiles: the pile and combination of the largest utilization, of
  // the largest moment along a pile and of the largest head deflection (each pair once).
  std::vector<NonlinearProfile> profiles;
};

// The profile of pile `pile` when the cap has moved `movement` (its solution's), with its
// p-y curves scaled by `p_multiplier`. Not converged (with a message) when the group has no
// profile function.
PileProfile pile_profile_at(const NonlinearCapSolver& solver, std::size_t pile,
                            const CapMovement& movement, double p_multiplier);

// The project's piles on the nonlinear curves of its soil profile (pile_soil_curves.hpp), in
// the order of Project::piles, named by their ids. `stiffness_factor`, indexed like
// Project::pile_types (missing entries = 1), scales the curves of each pile of that type
// (scaled_curves: an as-built damaged pile); `change`, when given, changes each pile's model
// before that (tests: a linear p-y curve). Throws InputError naming every layer or pile type
// that cannot give them (require_nonlinear_soil).
NonlinearGroup project_nonlinear_group(const Project& project,
                                       const std::vector<double>& stiffness_factor = {},
                                       const std::function<void(NonlinearPileSpec&)>& change = {});

// The first plan axis of the project's pile group for the rows of the p-multipliers, radians
// from +x (p_multiplier_axis over the pile heads and the widest section; 0 for one pile).
double project_multiplier_axis(const Project& project);

// The p-multipliers of the project's piles for a load (about any point: only its horizontal
// force counts) under `rule`; `direction` receives the plan direction of the horizontal
// force, none when there is none.
std::vector<double> combination_multipliers(const Project& project, const Wrench& load,
                                            GroupMultipliers rule,
                                            std::optional<double>* direction = nullptr);

// Solves every combination of `project` on `solver` (its group in the order of the piles),
// handing each solution to `each` (index, solution) in order, and fills run.combinations.
void solve_nonlinear_combinations(const Project& project, const NonlinearCapSolver& solver,
                                  GroupMultipliers rule, NonlinearRun& run,
                                  const std::function<void(std::size_t, CapSolution&&)>& each);

// The pushover curve of combination `c` (its own p-multipliers), up to `settings`' limits.
PushoverCurve push_combination(const Project& project, const NonlinearCapSolver& solver,
                               GroupMultipliers rule, std::size_t c,
                               const AnalysisSettings& settings);

}  // namespace cairn
