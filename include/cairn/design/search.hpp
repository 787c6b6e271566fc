// search.hpp — the search of `cairn design`: the cheapest pile layout that passes every check
// of `cairn check`.
//
// For each candidate pile type, the layouts of layouts.hpp are screened, then the best are
// checked in full:
//   1. Screen. The cap's stiffness is assembled once per layout and length, and its
//      flexibility found from six unit loads (rigid-cap method, cap_solver.hpp), so that every
//      combination costs one 6×6 product and one dot product per pile (superposition; a
//      combination that lifts a compression-only pile is solved again with the active set).
//      The pile length is the shortest on the length grid whose capacity (the same resolved
//      resistances as the check, computed once per type and length) carries the largest
//      compression and tension of every combination; the springs follow the length, so the
//      distribution is solved again until length and demand agree. A layout stops at its
//      first failing reason.
//   2. Full check. The survivors, cheapest first (cost + weight × utilization), are written
//      as a complete Project and run through analyse_project (the pipeline of `check`:
//      capacities, Broms lateral, structural, group efficiency and block, uplift, settlement,
//      spacing at depth, edge distance), plus the design's tilt limit. A layout that fails only
//      there is tried again at the next longer lengths. The first `keep` that pass are the
//      answer; the cheapest-for-its-utilization ones (Pareto front) are checked in full too.
//
// The cap's self-weight (cap.self_weight) is recomputed for every candidate from its outline
// and thickness. The cap's own structural design (bending, shear, punching) is not part of the
// search. Units: m, kN; costs in the engineer's currency.
#pragma once

#include <cstddef>
#include <functional>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "cairn/core/model.hpp"
#include "cairn/design/design_spec.hpp"
#include "cairn/design/layouts.hpp"

namespace cairn {

struct Candidate {
  Layout layout;
  double length = 0.0;       // m, pile head to tip along the axis
  double thickness = 0.0;    // m, cap
  double cap_volume = 0.0;   // m³
  double cost = 0.0;         // engineer's currency
  double score = 0.0;        // cost + utilization_weight × max_utilization
  double max_utilization = 0.0;
  std::string governs;       // "compression, pile P3, combination S2"
  double tilt = 0.0;         // rad, largest of the service combinations (full check)
  bool checked_fully = false;
};

struct DesignOutcome {
  std::vector<Candidate> best;   // passing every check, best score first (at most keep)
  std::vector<Candidate> front;  // Pareto front of cost against largest utilization, by cost
  std::vector<std::pair<std::string, std::size_t>> rejected;  // reason, count; most first
  std::size_t layouts = 0;         // layouts × pile types screened
  std::size_t passed_screen = 0;
  std::size_t checked_fully = 0;
  std::size_t combinations = 0;
  // Among the layouts no allowed length makes strong enough: the smallest utilization
  // reached at the longest length, and that layout ("grid 2×3 of PC45").
  std::optional<double> closest_utilization;
  std::string closest_layout;
  bool truncated = false;  // some pile type had more layouts than kMaxLayoutsPerType
};

// Called now and then from the searching threads with (done, total) screened layouts.
using DesignProgress = std::function<void(std::size_t done, std::size_t total)>;

// Runs the search on `base` (read_project with Piles::optional; its piles are ignored) on up
// to `threads` threads. Throws InputError when the file lacks data every candidate's check
// needs (as `check` would report it).
DesignOutcome search_layouts(const Project& base, const DesignSpec& spec, unsigned threads,
                             const DesignProgress& progress = {});

// The project of one candidate: the base with its piles, cap outline and thickness, the pile
// type's length and the cap's self-weight in place, exactly as reading the file that
// write_design_project (design_file.hpp) writes for it gives.
Project candidate_project(const Project& base, const DesignSpec& spec, const Candidate& c);

// Cost of a candidate by the spec's cost model (currency).
double candidate_cost(const Project& base, const DesignSpec& spec, std::size_t piles,
                      double length, double cap_volume);

// The search's basis in plain words (families, ranges, cost model) for the output.
std::vector<std::string> design_basis(const Project& base, const DesignSpec& spec);

}  // namespace cairn
