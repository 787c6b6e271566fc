// nonlinear_profiles.hpp — the governing piles of a nonlinear run and their deflection,
// moment and shear along their length, for the calculation package's diagrams
// (output/html_nonlinear.hpp).
//
// Two piles are shown, each under the combination that governs it:
//   - bending: the pile and combination of the largest structural utilization (the section's
//     axial–moment check with the largest moment along the pile); when no pile has a
//     structural check, the largest moment along any pile in any combination;
//   - deflection: the pile and combination of the largest head deflection (resultant across
//     the pile's axis).
// One entry when both are the same pile in the same combination. Combinations without
// equilibrium are left out (they have no movement to profile).
//
// Each profile is the pile's own at its converged head movement in that combination: the cap
// moved t at its reference point c and turned r (CapSolution::movement), so the head at p
// moved u = t + r × (p − c) and turned ω = r (nonlinear_cap.hpp), with the pile's
// p-multiplier of that combination.
//
// Units: SI (m, kN, kN·m) as nonlinear_pile.hpp gives them.
#pragma once

#include <vector>

#include "cairn/checks/checks.hpp"
#include "cairn/core/model.hpp"
#include "cairn/output/charts.hpp"
#include "cairn/solver/nonlinear_cap.hpp"
#include "cairn/solver/nonlinear_combinations.hpp"

namespace cairn {

// The governing piles' profiles, bending first. Empty when the group gives no profile
// function or no combination reached equilibrium.
std::vector<GoverningPileProfile> governing_pile_profiles(const Project& project,
                                                          const CheckResults& results,
                                                          const NonlinearRun& run,
                                                          const NonlinearGroup& group);

}  // namespace cairn
