// capacity_length.hpp — choosing a pile's length from the soil: the shortest length whose
// computed capacity meets a required compression and tension, on the allowable (service)
// or factored (strength) basis, and the next layer boundary below its tip to watch.
//
// Method: capacity_with_depth (capacity.hpp) is scanned from the shortest length at the
// given step; between the last tabulated length that falls short and the first that meets
// the need, the length is refined by bisection to a resolution (1 cm in SI, 0.1 ft in US
// projects, the precision lengths are printed with). The answer is the first length met in
// that scan; longer tabulated lengths that fall short again (a tip entering a weaker layer)
// are reported, not hidden. Units: kN, m (depths below the ground surface).
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "cairn/geotechnics/capacity.hpp"
#include "cairn/core/model.hpp"
#include "cairn/geotechnics/project_capacity.hpp"

namespace cairn {

// What the pile must carry, kN, on one basis. At least one of compression and tension.
struct LengthNeed {
  std::optional<double> compression;  // kN, required capacity in compression
  std::optional<double> tension;      // kN, required capacity in tension
  CapacityBasis basis = CapacityBasis::allowable;  // allowable or factored (or ultimate)
};

struct LengthChoice {
  LengthNeed need;
  std::optional<double> length;  // m, shortest length that meets the need; none: no length
                                 // within the profile does
  std::optional<DepthRow> at;    // the capacities at that length
  std::optional<DepthRow> longest;  // when no length meets the need: the longest tabulated
  bool at_shortest = false;      // the shortest length searched already meets the need
  double resolution = 0.0;       // m, the bisection's resolution
  std::string tip_layer;         // layer the tip ends in at that length
  std::optional<double> next_boundary;  // m below the ground, first layer boundary below the tip
  std::string next_layer;               // the layer below that boundary
  std::optional<double> tip_layer_top;  // m below the ground, top of the tip's layer (none:
                                        // the tip's layer starts at the ground)
  std::optional<double> falls_short_again;  // m, a longer tabulated length that does not meet
                                            // the need (the first one), if any
};

// Capacity of a table row on a basis, kN.
double compression_on(const DepthRow& row, CapacityBasis basis);
double tension_on(const DepthRow& row, CapacityBasis basis);
// Whether a row meets every part of the need.
bool meets(const DepthRow& row, const LengthNeed& need);

// The shortest length of `pile` (its head_depth used, its length ignored) meeting `need`,
// searched from min_length at `step` down to the profile's base and refined to
// `resolution` (m). Requires what capacity_with_depth requires, a need with a compression
// or tension, and resolution > 0; throws std::invalid_argument otherwise.
LengthChoice shortest_length(const SoilProfile& profile, PileGeometry pile,
                             const PileDesign& design, const LengthNeed& need, double step,
                             double min_length, double resolution);

// The resolution lengths are chosen to: 0.01 m in SI, 0.1 ft in US projects.
double length_resolution(UnitSystem units);

// Tip elevation on the soil profile's datum, m, when the profile gives ground_level.
std::optional<double> tip_elevation(const SoilProfile& profile, double tip_depth);

struct PileTypeLength {
  std::size_t type = 0;  // index in Project::pile_types
  LengthChoice choice;
};

// shortest_length for every pile type of `capacities` (compute_capacities), at the
// project's resolution.
std::vector<PileTypeLength> choose_lengths(const Project& project,
                                           const std::vector<PileTypeCapacity>& capacities,
                                           const LengthNeed& need, double step,
                                           double min_length);

// Throws InputError (exit 2) when the capacity-with-depth table would be empty: the
// shortest length `min_length` (m, from --from) puts the tip below the soil profile's
// base. `option` names the option in the message ("--from").
void require_table_within_profile(const Project& project, double min_length,
                                  const std::string& option);

}  // namespace cairn
