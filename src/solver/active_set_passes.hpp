// active_set_passes.hpp (private to src/solver/) — the passes over every pile that the
// compression-only active set makes for each trial movement, over the arrays of the piles'
// values (pinned_forces.hpp's PinnedPiles).
//
// For the movement Û = (t, θ) of the cap at its reference point and a head at ρ with unit
// axis a (cap_solver.hpp):
//     u = t + θ × ρ,   s = a·u          (the head's movement along the pile)
// head_movements_along() gives every s and the largest |u|, from which the active set decides
// which compression-only piles are stretched (s < −10⁻¹²·max |u|) or closed again.
// pinned_imbalance() gives F̂ − Σ T̂ᵀ·f_i for pinned heads, f_i the force on pile i
// (N·a + k_l·(u − s·a), N = k_a·s or 0 when it dropped out), summed in pile order.
// sum_stiffness() is the per-entry sum of the piles' 6×6 terms. All are the same IEEE
// operations in the same order as the per-pile code in cap_solver.cpp
// (Eigen's cross, dot and norm of 3-vectors), so their results are the same to the last bit;
// the per-pile terms are computed several piles at a time (AVX2 without FMA, or the
// processor's baseline, chosen at start-up), the sum stays in pile order.
#pragma once

#include <cstddef>
#include <cstdint>
#include <vector>

#include "pinned_forces.hpp"

namespace cairn::detail {

// along[i] = a_i·u_i for every pile (along holds piles.size() values); returns max |u_i|
// (0 for no piles; NaNs are passed over, as std::max does).
double head_movements_along(const PinnedPiles& piles, const double movement[6], double* along);

// A pile's state in the active set: it takes tension (never changes), in contact, dropped
// out, or left out for good (dropped out, never added again: cap_solver.cpp's cycles).
inline constexpr std::uint8_t kTakesTension = 0, kInContact = 1, kDroppedOut = 2, kLeftOut = 3;

// moves[i] = 1 where pile i changes state at these head movements along the piles, 0
// elsewhere: in contact and stretched (along[i] < −tolerance) or dropped out and closed again
// (along[i] > tolerance). Returns whether any pile changes.
bool active_set_moves(std::size_t n, const double* along, const std::uint8_t* state,
                      double tolerance, std::uint8_t* moves);

// out[e] = Σ_i (active[i] ? with[36·i + e] : without[36·i + e]) for e < 36, summed from 0 in
// pile order: the 6×6 stiffness of an active set from each pile's terms (36 values each,
// stored one pile after the other), each entry the same sum as Eigen's k += … per pile.
void sum_stiffness(std::size_t n, const double* with, const double* without,
                   const std::vector<bool>& active, double out[36]);

// sum[0..5] = load[0..5] − Σ_i (f_i, ρ_i × f_i + 0) in pile order: the imbalance of pinned
// heads (no head bending). active[i] false: pile i carries no axial force.
void pinned_imbalance(const PinnedPiles& piles, const double movement[6],
                      const std::vector<bool>& active, const double load[6], double sum[6]);

}  // namespace cairn::detail
