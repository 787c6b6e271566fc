// group_checks.hpp — the group as a whole, for a project: layout (spacing, edge distance),
// efficiency (every method side by side, one applied), block failure in clay, the group's
// capacity and uplift against each combination's demand, and settlement per service
// combination (Vesić single pile and group rule; equivalent footing with 2V:1H spread and
// elastic compression or consolidation), with the cap's tilt from the rigid-cap solution.
//
// The formulas live in group.hpp; this module applies them to a Project and its results.
// Units: kN, m, kPa. Failed group checks fail the project (exit status 1).
#pragma once

#include <array>
#include <optional>
#include <string>
#include <vector>

#include "cairn/geotechnics/project_capacity.hpp"
#include "cairn/checks/checks.hpp"
#include "cairn/core/diagnostics.hpp"
#include "cairn/geotechnics/group.hpp"
#include "cairn/core/model.hpp"
#include "cairn/geotechnics/stiffness.hpp"

namespace cairn {

struct GroupCombination {
  std::size_t combination = 0;
  double compression = 0.0;  // kN, Σ axial compression of the piles
  double tension = 0.0;      // kN, Σ axial tension of the piles (magnitude)
  std::optional<double> capacity;           // kN, group capacity on the combination's basis
  std::optional<double> utilization;        // compression / capacity
  std::optional<double> uplift_capacity;    // kN, block uplift resistance on the basis
  std::optional<double> uplift_utilization;
  double tilt = 0.0;  // rad, rotation of the cap about a horizontal axis
  // Settlement, service combinations when asked for (m).
  std::optional<double> single_settlement, group_settlement, footing_settlement;
  std::optional<double> settlement;  // the larger of the group estimates
  bool pass = true;
};

struct GroupResults {
  BlockPlan plan;
  EfficiencySummary efficiencies;
  Efficiency applied;  // the method the file names (η = 1 for none)
  std::optional<BlockCapacity> block;
  double block_factor_of_safety = kDefaultBlockSafety;  // for service; φ for strength below
  double block_resistance_factor = 0.60;
  std::optional<double> capacity_allowable, capacity_factored;  // kN, min(η·Σ, block)
  std::string governing;  // "efficiency" or "block"
  SpacingCheck spacing;
  std::optional<EdgeCheck> edge;
  bool settlement_asked = false;
  double settlement_limit = kDefaultSettlementLimit;  // m
  std::vector<GroupCombination> per_combination;
  std::vector<std::string> notes;
  bool pass = true;
};

// Input problems only the group checks can see (exit 2): an efficiency method that needs
// a grid on an irregular layout, a cap outline that does not contain every pile, soil data
// missing for the settlement asked for (naming the layer and field).
std::vector<Diagnostic> group_input_problems(const Project& project,
                                             const std::vector<PileTypeCapacity>& capacities);

// The group checks for every combination. Requires group_input_problems() to be empty.
GroupResults evaluate_group(const Project& project, const CheckResults& results,
                            const std::vector<PileTypeResistance>& resistances,
                            const std::vector<PileTypeCapacity>& capacities);

// Closest approach of two line segments in 3D (Ericson, Real-Time Collision Detection, 2005,
// §5.1.9: the closest points minimise |P(s) − Q(t)| over s, t ∈ [0, 1], clamped to the
// segments' ends; exact up to round-off). Points in m.
struct SegmentApproach {
  double distance = 0.0;                 // m
  std::array<double, 3> first{}, second{};  // the closest points on each segment
};
SegmentApproach closest_approach(const std::array<double, 3>& first_start,
                                 const std::array<double, 3>& first_end,
                                 const std::array<double, 3>& second_start,
                                 const std::array<double, 3>& second_end);

// Spacing of battered piles below the cap (common practice: the minimum spacing applies at
// every depth, not only at the heads). For every pair with at least one battered pile, the
// axes from the heads down to the depth of the shallower tip must stay the pair's required
// spacing apart (max(factor·larger width, absolute minimum), as at the heads); a pair that
// comes closer below the heads than allowed is a violation carrying the depth (below the
// pile heads) midway between its two closest points. Pairs already too close at the heads
// are left to the plan check.
std::vector<SpacingViolation> battered_spacing_violations(const Project& project);

}  // namespace cairn
