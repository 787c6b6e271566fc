#include "cairn/project_capacity.hpp"

#include <algorithm>

#include <fmt/format.h>

#include "cairn/code_resistance.hpp"
#include "cairn/diagnostics.hpp"
#include "cairn/lateral.hpp"

namespace cairn {
namespace {

// AASHTO LRFD Table 10.5.5.2.3-1: horizontal geotechnical resistance of a pile, φ = 1.0
// (from memory).
constexpr double kBromsResistanceFactor = 1.0;

PileGeometry geometry_of(const Project& project, const PileType& type) {
  PileGeometry g;
  g.width = type.section.width;
  g.round = type.section.shape == SectionShape::round;
  g.length = type.length;
  g.head_depth = project.cap.depth;
  g.units = project.units;
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

std::vector<std::optional<LateralCapacity>> lateral_capacities(const Project& project) {
  std::vector<std::optional<LateralCapacity>> out(project.pile_types.size());
  if (!project.soil || project.soil->layers.empty()) return out;
  // The layer at the pile head governs the lateral mechanism near the top.
  const SoilProfile& soil = *project.soil;
  const SoilLayer* layer = &soil.layers.back();
  double top = 0.0;
  for (const auto& l : soil.layers) {
    if (project.cap.depth < top + l.thickness) {
      layer = &l;
      break;
    }
    top += l.thickness;
  }
  for (std::size_t t = 0; t < project.pile_types.size(); ++t) {
    const PileType& type = project.pile_types[t];
    BromsInput in;
    in.soil = layer->kind;
    in.width = type.section.width;
    in.embedded_length = type.length;
    in.head = type.head;
    if (type.structure && type.structure->yield_moment) in.yield_moment = type.structure->yield_moment;
    if (layer->kind == SoilKind::clay) {
      if (!layer->undrained_strength) continue;
      in.undrained_strength = *layer->undrained_strength;
    } else {
      const bool wet = soil.water_table && *soil.water_table <= project.cap.depth;
      const auto gamma = wet ? layer->saturated_unit_weight : layer->unit_weight;
      if (!gamma || !layer->friction_angle) continue;
      in.effective_unit_weight = wet ? *gamma - kWaterUnitWeight : *gamma;
      in.friction_angle = *layer->friction_angle;
    }
    try {
      const BromsResult b = broms_ultimate_lateral(in);
      LateralCapacity c;
      c.ultimate = b.ultimate_load;
      c.allowable = allowable_lateral_load(b.ultimate_load);
      c.factored = kBromsResistanceFactor * b.ultimate_load;
      c.method = fmt::format("Broms (1964), {} pile, {} head, in layer '{}': H_ult = {:.1f} {}, "
                             "allowable H_ult/{:g}, factored {:g}·H_ult",
                             to_string(b.mode), to_string(type.head), layer->name,
                             from_si(project.units, Quantity::force, b.ultimate_load),
                             unit_label(project.units, Quantity::force), kLateralFactorOfSafety,
                             kBromsResistanceFactor);
      if (!in.yield_moment) c.method += " (no yield_moment given: short-pile mechanism only)";
      out[t] = c;
    } catch (const std::invalid_argument&) {
      // Not enough data for Broms: the lateral check then needs a typed-in capacity.
    }
  }
  return out;
}

std::vector<std::optional<ComputedResistance>> computed_resistances(
    const Project& project, const std::vector<PileTypeCapacity>& capacities,
    const std::vector<std::optional<LateralCapacity>>& lateral) {
  std::vector<std::optional<ComputedResistance>> out(project.pile_types.size());
  for (std::size_t t = 0; t < lateral.size() && t < out.size(); ++t) {
    if (!lateral[t]) continue;
    ComputedResistance r;
    r.allowable_lateral = lateral[t]->allowable;
    r.factored_lateral = lateral[t]->factored;
    r.ultimate_lateral = lateral[t]->ultimate;
    r.lateral_method = lateral[t]->method;
    out[t] = r;
  }
  for (const auto& c : capacities) {
    ComputedResistance r = out[c.type].value_or(ComputedResistance{});
    r.allowable_compression = c.result.allowable_compression;
    r.allowable_tension = c.result.allowable_tension;
    r.factored_compression = c.result.factored_compression;
    r.factored_tension = c.result.factored_tension;
    r.method = method_summary(project.pile_types[c.type].design);
    r.ultimate_tip = c.result.tip;
    r.ultimate_shaft = c.result.shaft;
    r.ultimate_uplift = c.result.uplift_shaft;
    const PileDesign& d = project.pile_types[c.type].design;
    r.aashto_phi = !d.phi_tip || !d.phi_shaft || !d.phi_uplift;
    // EN 1997 design approach 3: the capacity again with set M2 (code_resistance.hpp).
    const bool m2_needed = std::any_of(
        project.combinations.begin(), project.combinations.end(),
        [](const Combination& combo) { return combo.resistance_set == ResistanceSet::en1997_r3; });
    if (m2_needed && project.soil && en1997_m2_applies(d)) {
      const SoilProfile m2 = en1997_m2_profile(*project.soil);
      if (validate_design(m2, c.geometry, d).empty()) {
        const CapacityResult m2_result = pile_capacity(m2, c.geometry, d);
        r.m2_tip = m2_result.tip;
        r.m2_shaft = m2_result.shaft;
        r.m2_uplift = m2_result.uplift_shaft;
      }
    }
    out[c.type] = r;
  }
  return out;
}

}  // namespace cairn
