// fast_group.hpp — the rigid-cap analysis of a pile group rearranged many times over: a
// pile lost, a pile added, every pile moved. Used by the site studies (lost pile search,
// each pile lost in turn, installation tolerance).
//
// The method is the solver's (cap_solver.hpp: K = Σ Tᵢᵀ·kᵢ·Tᵢ, K·U = F, Nᵢ = k_a·aᵢ·uᵢ,
// Vᵢ = k_l·|uᵢ − (aᵢ·uᵢ)·aᵢ|), arranged for speed: the 6×6 stiffness of the whole group is
// assembled once; losing or adding a pile changes it by that pile's 6×6 term (a rank-one
// term for an axial-only pile), and the cap movements of all combinations come from one
// 6×6 solve, then all pile forces from one matrix product (piles × 6 × combinations).
// Directions with no stiffness (a symmetric eigen-decomposition of the equilibrated K, below
// 1e-10 of the largest) are left out; a combination loading one of them is unstable and
// fails (utilization infinite).
//
// Linear: every pile takes tension. Where a compression-only pile would be in tension, the
// combination is solved again with the active-set solver (CapSolver::solve) for that
// arrangement, so the results equal the full check's pile utilizations. The utilization is
// the check's (checks.hpp): compression, tension, lateral and the structural axial capacity;
// the combined axial + head moment check of fixed-head piles is left out of these studies.
//
// Units: SI (m, kN).
#pragma once

#include <array>
#include <cstddef>
#include <limits>
#include <memory>
#include <optional>
#include <vector>

#include "cairn/app/analysis.hpp"

namespace cairn {

// A pile of the study: its head in plan, its axis and the type it is of (the run's types).
struct StudyPile {
  double x = 0.0, y = 0.0;  // m
  std::optional<Batter> batter;
  std::size_t type = 0;
};

// The largest utilization of an arrangement over all combinations, and where it occurs.
struct StudyOutcome {
  double max_utilization = 0.0;  // infinity when unstable or a demand has no capacity
  std::size_t combination = 0;
  std::size_t pile = 0;     // index into the arrangement's piles (base piles, then extra)
  bool unstable = false;    // some combination loads a direction with no stiffness
  std::size_t resolved = 0; // combinations solved again with the active-set solver
};

class FastGroup {
 public:
  // The piles and combinations of a checked run (springs, loads and resistances as checked).
  explicit FastGroup(const CheckRun& run);
  ~FastGroup();
  FastGroup(FastGroup&&) noexcept;

  std::size_t piles() const;
  std::size_t combinations() const;

  // The group with the piles where `keep` is true (all when empty) and the `extra` piles
  // added. The base piles keep their positions.
  StudyOutcome evaluate(const std::vector<char>& keep, const std::vector<StudyPile>& extra) const;
  // Every base pile moved to `moved` (same count, same types).
  StudyOutcome evaluate_moved(const std::vector<StudyPile>& moved) const;
  // Per pile of the arrangement: its largest utilization over all combinations (for the plan).
  std::vector<double> pile_utilizations(const std::vector<char>& keep,
                                        const std::vector<StudyPile>& extra) const;

  const std::vector<StudyPile>& base() const;

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

}  // namespace cairn
