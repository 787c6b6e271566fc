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

#include "cairn/geotechnics/capacity.hpp"
#include "cairn/checks/checks.hpp"
#include "cairn/core/model.hpp"
#include "cairn/geotechnics/section_moment.hpp"

namespace cairn {

struct PileTypeCapacity {
  std::size_t type = 0;
  PileGeometry geometry;
  CapacityResult result;
  std::vector<DepthRow> depth_table;  // empty unless asked for
};

// The lengths of a capacity-with-depth table, m: from `from` in steps of `step`.
struct DepthTableRange {
  double step = 0.0, from = 0.0;
};

// The table's default lengths: 0.5 m from 3 m, or 1 ft from 10 ft in a US project (common
// practice: a pile length is chosen to the half metre or the foot).
DepthTableRange default_depth_table(UnitSystem units);

// The default lengths for a report's chart, the step lengthened where a soil profile is so
// deep that the default would give more than kMaxDepthRows rows.
DepthTableRange report_depth_table(const Project& project);

// Computes the capacity of every pile type that asks for it. `depth_step` > 0 adds the
// capacity-with-depth table from `min_length` (m) to the profile's base. Throws InputError
// naming the pile type and layer when a method lacks a property or the pile is too long.
std::vector<PileTypeCapacity> compute_capacities(const Project& project, double depth_step = 0.0,
                                                 double min_length = 0.0);

// Broms' (1964) ultimate lateral resistance of each pile type from the soil layer at the
// pile head (uniform soil assumed; free or fixed head), with FS 2.5 for service (common
// practice) and φ = 1.0 for strength (AASHTO LRFD 10.5.5.2.3, horizontal geotechnical
// resistance, from memory). Empty optional where there is no soil or the soil lacks what
// Broms needs. The yield moment comes from section_yield_moment() at the pile type's
// `axial` range (indexed like Project::pile_types; empty = P = 0); without one there is no
// Broms value at all (`missing` says why) — never the short-pile mechanism alone, which can
// overstate the capacity of a long pile several times.
// In sand γ' is averaged over the depth the mechanism mobilizes (the embedded length; the
// depth of maximum moment for a long pile), from the profile's layers and water table.
struct LateralCapacity {
  double ultimate = 0.0, allowable = 0.0, factored = 0.0;  // kN (0 when `missing`)
  std::string method;   // plain words: mode, soil, yield moment and where it came from
  std::string missing;  // non-empty: no yield moment, so no capacity; the reason
};
std::vector<std::optional<LateralCapacity>> lateral_capacities(
    const Project& project, const std::vector<std::optional<AxialRange>>& axial = {});

// The least and greatest axial force of each pile type over the combinations that did not
// overturn (indexed like Project::pile_types; empty optional for a type no pile uses).
std::vector<std::optional<AxialRange>> axial_ranges(const Project& project,
                                                    const std::vector<CapSolution>& solutions);

// Pile types whose Broms capacity is needed — a pile of the type carries a lateral force in a
// combination (`solutions`, indexed like the combinations) whose basis (allowable for
// service, factored for strength) has no lateral capacity typed in — but whose yield moment
// the section does not define: one located problem per type, naming it and asking for
// structure.yield_moment or what the section lacks.
std::vector<Diagnostic> lateral_input_problems(
    const Project& project, const std::vector<std::optional<LateralCapacity>>& lateral,
    const std::vector<CapSolution>& solutions);

// The computed capacities as the check's resistances (indexed like Project::pile_types).
std::vector<std::optional<ComputedResistance>> computed_resistances(
    const Project& project, const std::vector<PileTypeCapacity>& capacities,
    const std::vector<std::optional<LateralCapacity>>& lateral = {});

}  // namespace cairn
