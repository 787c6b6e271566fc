// project_capacity.hpp — the single-pile capacities of a project's pile types, computed
// from its soil profile (capacity.hpp), for `cairn capacity` and `cairn check`.
//
// A pile type gets computed capacities when it names a tip_method or shaft_method and the
// project has a soil profile. The pile is taken vertical, with its head at cap.depth below
// the ground and its type's length; capacities typed in by the geotechnical engineer win
// over computed ones, value by value (checks.hpp: resolve_resistances). Units: kN, m.
#pragma once

#include <optional>
#include <vector>

#include "cairn/capacity.hpp"
#include "cairn/checks.hpp"
#include "cairn/model.hpp"

namespace cairn {

struct PileTypeCapacity {
  std::size_t type = 0;
  PileGeometry geometry;
  CapacityResult result;
  std::vector<DepthRow> depth_table;  // empty unless asked for
};

// Computes the capacity of every pile type that asks for it. `depth_step` > 0 adds the
// capacity-with-depth table from `min_length` (m) to the profile's base. Throws InputError
// naming the pile type and layer when a method lacks a property or the pile is too long.
std::vector<PileTypeCapacity> compute_capacities(const Project& project, double depth_step = 0.0,
                                                 double min_length = 0.0);

// Broms' (1964) ultimate lateral resistance of each pile type from the soil layer at the
// pile head (uniform soil assumed; free or fixed head; the structure's yield moment for
// long piles, else the short-pile mechanism only), with FS 2.5 for service (common
// practice) and φ = 1.0 for strength (AASHTO LRFD 10.5.5.2.3, horizontal geotechnical
// resistance, from memory). Empty optional where there is no soil.
// In sand γ' is averaged over the depth the mechanism mobilizes (the embedded length; the
// depth of maximum moment for a long pile), from the profile's layers and water table.
struct LateralCapacity {
  double ultimate = 0.0, allowable = 0.0, factored = 0.0;  // kN
  std::string method;  // plain words: mode, soil, notes
};
std::vector<std::optional<LateralCapacity>> lateral_capacities(const Project& project);

// The computed capacities as the check's resistances (indexed like Project::pile_types).
std::vector<std::optional<ComputedResistance>> computed_resistances(
    const Project& project, const std::vector<PileTypeCapacity>& capacities,
    const std::vector<std::optional<LateralCapacity>>& lateral = {});

}  // namespace cairn
