// checks.hpp — each pile's demand against its capacity, per combination, with envelopes
// and the governing pile and combination.
//
// Service combinations are compared with allowable capacities (ultimate / factor of
// safety); strength combinations with factored resistances (φ·R). The two bases are never
// mixed: a combination whose basis a pile type lacks is an input problem, reported before
// anything is computed.
//
// Utilization of a pile in a combination is the largest of
//     compression / allowable compression   (axial > 0)
//     tension / allowable tension            (axial < 0)
//     lateral shear / allowable lateral
// and the pile passes when it is at most 1. A demand with no capacity to compare against
// (tension in a pile type without a tension capacity, say) fails: it cannot be shown safe.
//
// Units: kN.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "cairn/cap_solver.hpp"
#include "cairn/diagnostics.hpp"
#include "cairn/model.hpp"

namespace cairn {

// Capacities of one pile type on one basis, after factors were applied. kN.
struct Resistance {
  std::optional<double> compression, tension, lateral;
  // Structural: the section's axial capacity (kN) and moment capacity (kN·m) on this basis.
  std::optional<double> structural_axial, structural_moment;
  std::string source;  // where the numbers came from, for the report
};

struct PileTypeResistance {
  Resistance allowable;  // for service combinations
  Resistance factored;   // for strength combinations
};

// Capacity computed from the soil for one pile type (see capacity.hpp), kN.
struct ComputedResistance {
  std::optional<double> allowable_compression, allowable_tension;
  std::optional<double> factored_compression, factored_tension;
  std::string method;  // e.g. "vesic tip + beta shaft"
  // Lateral by Broms (1964) from the soil at the pile head, when computed.
  std::optional<double> allowable_lateral, factored_lateral;
  std::string lateral_method;
};

// Default factors of safety for capacities given as ultimate (common practice: 2.5 in
// compression and lateral, 3.0 in tension; see docs/methods.md).
inline constexpr double kDefaultSafetyCompression = 2.5;
inline constexpr double kDefaultSafetyTension = 3.0;

// Resistances per pile type: typed-in capacities win, value by value, over computed ones
// (`computed` is indexed like Project::pile_types; an empty optional = nothing computed).
std::vector<PileTypeResistance> resolve_resistances(
    const Project& project, const std::vector<std::optional<ComputedResistance>>& computed);

// Combinations that need a basis some pile type in use lacks; empty when all can be checked.
std::vector<Diagnostic> missing_resistances(const Project& project,
                                            const std::vector<PileTypeResistance>& resistances);

enum class Demand { none, compression, tension, lateral, structural };
const char* to_string(Demand);

struct PileCheck {
  double axial = 0.0;    // kN, compression positive
  double lateral = 0.0;  // kN
  double head_moment = 0.0;  // kN·m, fixed heads (0 for pinned)
  bool active = true;    // false: dropped out, takes no tension
  double utilization = 0.0;   // infinity when a demand has no capacity
  Demand governing = Demand::none;
  bool pass = true;
};

struct CombinationCheck {
  std::size_t combination = 0;  // index into Project::combinations
  CapSolution solution;
  std::vector<PileCheck> piles;
  bool pass = true;
  double max_utilization = 0.0;
  std::optional<std::size_t> governing_pile;
  Demand governing = Demand::none;
};

// The largest value of a quantity over all combinations and where it occurs.
struct Extreme {
  double value = 0.0;
  std::optional<std::size_t> combination;
};

struct PileEnvelope {
  Extreme max_compression;  // kN, ≥ 0
  Extreme max_tension;      // kN, ≥ 0 (magnitude)
  Extreme max_lateral;      // kN
  Extreme max_utilization;
  Demand governing = Demand::none;  // the check that gives max_utilization
};

struct CheckSummary {
  bool pass = true;
  double max_utilization = 0.0;
  std::optional<std::size_t> pile, combination;
  Demand check = Demand::none;
  std::size_t failed_combinations = 0;
  std::vector<std::size_t> overturned;  // combinations with no equilibrium
};

struct CheckResults {
  std::vector<CombinationCheck> combinations;
  std::vector<PileEnvelope> envelope;  // per pile
  CheckSummary summary;
};

// Checks every pile in every combination. `solutions` is indexed like the combinations.
// `head_moment_per_shear` (m, per pile type; empty = all pinned) gives fixed heads their
// head moment M = V·(moment per shear) for the combined axial + bending check
// |P|/Pc + |M|/Mc ≤ 1 (common practice; lateral.hpp).
CheckResults check_piles(const Project& project, const std::vector<CapSolution>& solutions,
                         const std::vector<PileTypeResistance>& resistances,
                         const std::vector<double>& head_moment_per_shear = {});

// The assumptions behind the results, in plain words, for every output; the warnings found
// while reading (project.warnings) come first, as "Warning: … (file:line:col)".
// `stiffness` gives each pile type's springs and their sources (stiffness.hpp); it is
// declared there, so only the sources are passed here: (axial source, lateral source).
std::vector<std::string> assumptions(
    const Project& project, const std::vector<PileTypeResistance>& resistances,
    const std::vector<std::pair<std::string, std::string>>& stiffness_sources);

inline constexpr const char* kCaution =
    "Results are for checking by a qualified engineer; local codes and licensed practice "
    "govern.";

}  // namespace cairn
