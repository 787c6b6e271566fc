// check_fold.hpp (private to src/checks/) — the checks of one combination folded into each
// pile's envelope and governing checks in one pass over arrays of the piles' values.
//
// For a pile with axial force N (compression positive) and lateral shear V, against its
// capacities Cc, Ct, Cl on the combination's basis (checks.hpp):
//     u = the largest of N/Cc (N > tol), −N/Ct (−N > tol), V/Cl (V > tol); ∞ without a capacity
// and the envelope keeps, per pile, the largest of N, −N, V and u over the combinations with
// the first combination that reaches it (a later one must exceed it). The pass is the same
// sequence of IEEE operations and comparisons as the row-by-row code in checks.cpp, written
// as selections instead of branches so that the compiler computes several piles at once;
// the results are the same to the last bit (for forces that are numbers: a NaN force against
// a missing capacity would give NaN here and ∞ there; the solver returns none). Piles with a structural check or a moment along
// the pile are left to the row-by-row code.
#pragma once

#include <array>
#include <cstddef>
#include <cstdint>
#include <vector>

namespace cairn::detail {

// Each pile's envelope and governing checks as arrays (structure of arrays). A value of 0
// with combination −1 is "none yet": every value kept is above zero (checks.hpp, Extreme).
struct FoldState {
  std::vector<double> compression, tension, lateral, utilization;            // largest so far
  std::vector<std::int64_t> compression_at, tension_at, lateral_at, utilization_at;  // −1: none
  std::vector<double> governing;  // Demand of the largest utilization, as a number
  std::vector<std::int64_t> failed;     // 1: failed in some combination
  // Per check (Demand − 1): the largest utilization of that check alone, where, its demand.
  std::array<std::vector<double>, 4> check_value, check_demand;
  std::array<std::vector<std::int64_t>, 4> check_at;

  void resize(std::size_t n);
};

// Capacities of every pile on one basis, kN; 0 where there is none (or it is not positive).
struct PileCapacities {
  std::vector<double> compression, tension, lateral;
};

// Folds combination `c` for the piles [0, n): axial[i], lateral[i] the forces (demands at
// or below `tolerance`, kN, are no demand), the
// utilization and governing Demand of each pile written to utilization[i], governing[i].
// Returns true when some pile fails (u > 1, or not a number).
bool fold_piles(std::size_t n, const double* axial, const double* lateral,
                const PileCapacities& capacity, double tolerance, std::int64_t c, FoldState& state,
                double* utilization, double* governing);

}  // namespace cairn::detail
