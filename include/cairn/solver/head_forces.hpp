// head_forces.hpp — the pile heads' actions summed about a point, for the equilibrium table of
// the calculation package: a view over the solver's PileForce::head_forces (cap_solver.hpp),
// which it does not compute again.
//
// The solver gives each pile the action of the cap on the pile at its head p_i, global axes:
// a force F_i and, for fixed and partially fixed heads, a moment M_i (zero for a pinned head;
// docs/methods-bending.md). The pile's reaction on the cap is the opposite, so the cap is in
// equilibrium when the actions balance the applied load:
//     Σ F_i = F,   Σ [(p_i − o) × F_i + M_i] = M_o
// with F and M_o the resultant of the applied loads about the point o (each load's force and
// its moment (at − o) × F + M: load heights and the cap's self-weight included). Statics of
// the cap's free body (hand derivation).
//
// Units: kN, m, kN·m.
#pragma once

#include <array>
#include <vector>

#include "cairn/solver/cap_solver.hpp"

namespace cairn {

struct HeadBalance {
  // Per pile: F_i and (p_i − o) × F_i + M_i (its action and moment about o).
  std::vector<Wrench> piles;
  Wrench sum{};       // Σ over the piles
  Wrench applied{};   // the applied resultant about o, as given
  Wrench residual{};  // sum − applied
  double lever = 1.0; // L, m: the largest distance of a pile head from o (1 m if none)
  // The largest residual component over the largest applied one, moments over L (so forces
  // and moments compare in one unit, whatever the project's units). 0 when nothing is applied
  // and nothing is left over.
  double relative = 0.0;
};

// The balance of `solution` (one entry per spring; an overturned solution has no actions and
// sums to zero) about `point` against `applied` (about the same point). Requires
// solution.piles.size() == springs.size() unless the solution overturned.
HeadBalance head_balance(const std::vector<PileSpring>& springs, const CapSolution& solution,
                         const Wrench& applied, const std::array<double, 3>& point = {0, 0, 0});

// The head displacement u_i = t + r × (p_i − c) of one pile (m), for the hand check's
// substituted equations.
std::array<double, 3> head_displacement(const PileSpring& spring, const CapMovement& movement);

}  // namespace cairn
