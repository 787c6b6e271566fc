#include "cairn/project_capacity.hpp"

#include <fmt/format.h>

#include "cairn/diagnostics.hpp"

namespace cairn {
namespace {

PileGeometry geometry_of(const Project& project, const PileType& type) {
  PileGeometry g;
  g.width = type.section.width;
  g.round = type.section.shape == SectionShape::round;
  g.length = type.length;
  g.head_depth = project.cap.depth;
  return g;
}

std::string method_summary(const PileDesign& d) {
  auto tip = [](std::optional<TipMethod> m) { return m ? to_string(*m) : "none"; };
  auto shaft = [](std::optional<ShaftMethod> m) { return m ? to_string(*m) : "none"; };
  return fmt::format("tip {} (clay) / {} (sand), shaft {} (clay) / {} (sand)", tip(d.tip_clay),
                     tip(d.tip_sand), shaft(d.shaft_clay), shaft(d.shaft_sand));
}

}  // namespace

std::vector<PileTypeCapacity> compute_capacities(const Project& project, double depth_step,
                                                 double min_length) {
  std::vector<PileTypeCapacity> list;
  Diagnostics problems;
  for (std::size_t t = 0; t < project.pile_types.size(); ++t) {
    const PileType& type = project.pile_types[t];
    if (!type.design.computes_capacity() || !project.soil) continue;
    PileTypeCapacity c;
    c.type = t;
    c.geometry = geometry_of(project, type);
    const auto table_from = depth_step > 0 ? std::optional<double>(min_length) : std::nullopt;
    const auto found = validate_design(*project.soil, c.geometry, type.design, table_from);
    for (const auto& message : found)
      problems.error(type.where, fmt::format("pile_types.{}: {}", type.id, message));
    if (!found.empty()) continue;
    c.result = pile_capacity(*project.soil, c.geometry, type.design);
    if (depth_step > 0)
      c.depth_table = capacity_with_depth(*project.soil, c.geometry, type.design, depth_step,
                                          min_length);
    list.push_back(std::move(c));
  }
  problems.raise_if_any();
  return list;
}

std::vector<std::optional<ComputedResistance>> computed_resistances(
    const Project& project, const std::vector<PileTypeCapacity>& capacities) {
  std::vector<std::optional<ComputedResistance>> out(project.pile_types.size());
  for (const auto& c : capacities) {
    ComputedResistance r;
    r.allowable_compression = c.result.allowable_compression;
    r.allowable_tension = c.result.allowable_tension;
    r.factored_compression = c.result.factored_compression;
    r.factored_tension = c.result.factored_tension;
    r.method = method_summary(project.pile_types[c.type].design);
    out[c.type] = r;
  }
  return out;
}

}  // namespace cairn
