// pinned_forces.hpp (private to src/solver/) — the forces of every pile head for one cap
// movement, as springs alone (pinned heads), in one pass over arrays of the piles' values.
//
// For the movement Û = (t, θ) of the cap at its reference point (nondimensional: θ = L·r) and
// a head at ρ = (p − c)/L with unit axis a, axial spring k_a and lateral spring k_l:
//     u = t + θ × ρ,   s = a·u,   w = u − s·a
//     axial N = k_a·s (zero when the pile dropped out),  lateral V = k_l·|w|
//     force on the pile F = N·a + k_l·w,  moment about the head 0
// (cap_solver.hpp; Hrennikoff 1949). The operations and their order are those of the
// per-pile code in cap_solver.cpp (Eigen's cross, dot and norm of 3-vectors), so the results
// are the same to the last bit; kept as separate arrays (structure of arrays) so the
// compiler computes several piles at once. Piles with head bending are then overwritten by
// the per-pile code.
#pragma once

#include <cstddef>
#include <vector>

#include "cairn/solver/cap_solver.hpp"

namespace cairn::detail {

struct PinnedPiles {
  std::vector<double> rho_x, rho_y, rho_z;     // (p − c)/L
  std::vector<double> axis_x, axis_y, axis_z;  // unit axis, head → toe
  std::vector<double> axial, lateral;          // kN/m

  void add(const double rho[3], const double axis[3], double k_axial, double k_lateral);
  std::size_t size() const { return axial.size(); }
};

// Replaces `out` by the piles' rows for the movement (t, θ) = movement[0..5]. (*active)[i]
// false: the pile dropped out and carries no axial force; no `active`: every pile is active.
void pinned_forces(const PinnedPiles& piles, const double movement[6],
                   const std::vector<bool>* active, std::vector<PileForce>& out);

// The axial and lateral forces alone, axial[i] and lateral[i] (kN) for pile i: the same
// numbers as pinned_forces' rows (an exact 0 axial force for a pile that dropped out),
// nothing else formed.
void pinned_axial_lateral(const PinnedPiles& piles, const double movement[6],
                          const std::vector<bool>* active, double* axial, double* lateral);

}  // namespace cairn::detail
