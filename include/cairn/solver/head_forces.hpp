// head_forces.hpp — the force each pile head takes from the cap, as a vector in global axes,
// for the equilibrium table of the calculation package.
//
// From the cap's movement (cap_solver.hpp): the head of pile i at p_i moves
//     u_i = t + r × (p_i − c)
// and takes from the cap the force
//     F_i = K_i·u_i,   K_i = k_a·a·aᵀ + k_l·(I − a·aᵀ)
// (a dropped-out pile keeps only its lateral spring). Its axial part k_a·(a·u_i)·a is the
// axial force N_i along the pile (compression positive, a pointing from head to toe), so a
// battered pile's axial force has horizontal components. The forces balance the applied
// load: Σ F_i = F and Σ (p_i − c) × F_i = M_c (Hrennikoff 1949; hand-derived from K·U = F).
//
// Units: kN, m.
#pragma once

#include <array>
#include <vector>

#include "cairn/solver/cap_solver.hpp"

namespace cairn {

// The force on each pile head (kN, global axes), in the order of `springs`. An overturned
// solution has no forces: every entry is zero. Requires solution.piles.size() ==
// springs.size() unless the solution overturned.
std::vector<std::array<double, 3>> pile_head_forces(const std::vector<PileSpring>& springs,
                                                    const CapSolution& solution);

// The head displacement u_i = t + r × (p_i − c) of one pile (m).
std::array<double, 3> head_displacement(const PileSpring& spring, const CapMovement& movement);

}  // namespace cairn
