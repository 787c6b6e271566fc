// studies.hpp — what-if studies of a pile group on site, on the fast rigid-cap analysis of
// fast_group.hpp:
//
//   each pile lost in turn   every pile (optionally every pair) removed; the largest
//                            utilization over all combinations, and which loss governs;
//   added pile search        an exhaustive grid over the cap outline for one added pile of
//                            a chosen type (then two) that makes every combination pass,
//                            keeping the minimum spacing to every pile (rejected piles left
//                            in the ground included) and the edge distance;
//   installation tolerance   seeded random trials of every pile landing within the plan
//                            tolerance of its position (uniform over the circle, or normal
//                            with the tolerance as two standard deviations), and a local
//                            search for the worst arrangement.
//
// All positions in m, SI; pure functions (no printing).
#pragma once

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "cairn/site/fast_group.hpp"

namespace cairn {

// ---- each pile lost in turn ----
struct LossCase {
  std::vector<std::size_t> lost;  // base pile indices (one, or two for pairs)
  StudyOutcome outcome;           // outcome.pile indexes the remaining piles
  std::size_t governing_pile = 0; // base pile index of outcome.pile
};
struct LossStudy {
  std::vector<LossCase> single;  // one per pile, in pile order
  std::vector<LossCase> pairs;   // when asked: every pair
  std::optional<std::size_t> worst_single, worst_pair;  // indices into the lists
  StudyOutcome intact;
};
LossStudy each_pile_lost(const FastGroup& group, bool pairs);

// ---- added pile search ----
struct ObstaclePile {  // a pile already in the ground (standing or lost)
  double x = 0.0, y = 0.0, width = 0.0;
};
struct SearchSettings {
  std::size_t type = 0;           // pile type of the added pile
  double step = 0.05;             // m, grid step
  int most = 2;                   // try one pile, then two
  Outline outline;                // the cap outline
  double edge_distance = 0.0;     // m, pile face to cap edge
  double spacing_factor = 2.5;    // minimum c/c spacing in pile widths
  double min_spacing = 0.0;       // m
  double width = 0.0;             // m, of the added type
  std::vector<ObstaclePile> in_ground;  // every pile to keep clear of
  std::vector<std::array<double, 2>> lost;  // positions to rank by distance from
  std::size_t pairs_from = 300;   // two piles: pairs among this many best single positions
};
struct Placement {
  std::vector<std::array<double, 2>> at;  // m
  StudyOutcome outcome;
  double distance = 0.0;  // m, from the nearest lost pile (sum over placed piles)
  bool pass() const { return outcome.max_utilization <= 1.0; }
};
struct SearchResult {
  std::size_t candidates = 0;        // grid positions that keep spacing and edge distance
  std::vector<Placement> best;       // ranked: passing first, then utilization, then distance
  int piles = 0;                     // 1 or 2: how many were placed in `best`
  StudyOutcome before;
};
// `keep` selects the base piles standing (empty: all). Ranks at most `keep_best` results.
SearchResult search_added_piles(const FastGroup& group, const std::vector<char>& keep,
                                const SearchSettings& settings, std::size_t keep_best = 10);

// ---- installation tolerance ----
struct ToleranceSettings {
  double plan = 0.075;                   // m
  std::optional<double> batter;          // horizontal per vertical; none: as designed
  bool normal = false;                   // normal with σ = tolerance / 2 (else uniform disc)
  std::size_t trials = 10000;
  std::uint64_t seed = 1;
  int search_rounds = 3;                 // local search sweeps for the worst arrangement
};
struct ToleranceStudy {
  double design = 0.0;
  double median = 0.0, p95 = 0.0, max = 0.0;
  std::vector<double> samples;  // sorted
  StudyOutcome worst_random;
  std::vector<StudyPile> worst;  // the worst arrangement found by the local search
  StudyOutcome worst_outcome;
  std::size_t governing_pile = 0;  // of the worst arrangement
  double margin = 0.0;  // worst found − design: the utilization margin to keep
};
ToleranceStudy tolerance_study(const FastGroup& group, const ToleranceSettings& settings);

}  // namespace cairn
