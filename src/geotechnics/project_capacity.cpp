#include "cairn/geotechnics/project_capacity.hpp"

#include <algorithm>
#include <set>
#include <cmath>

#include <fmt/format.h>

#include "cairn/core/quantity_format.hpp"
#include "cairn/geotechnics/code_resistance.hpp"
#include "cairn/core/diagnostics.hpp"
#include "cairn/geotechnics/lateral.hpp"

namespace cairn {
namespace {

// AASHTO LRFD Table 10.5.5.2.3-1: horizontal geotechnical resistance of a pile, φ = 1.0
// (from memory).
constexpr double kBromsResistanceFactor = 1.0;
// A lateral force below this is round-off of the cap solve (kN), as in the checks.
constexpr double kNoLateralForce = 1e-6;

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

// Broms in sand with the effective unit weight averaged over the depth the mechanism
// mobilizes (Broms 1964b: the soil reaction 3·Kp·γ'·z·D acts down to that depth): the whole
// embedded length for the short and intermediate mechanisms, the depth f of zero shear (the
// maximum moment, where the hinge forms) for the long one. From the profile's layers and water
// table, γ'avg = [σ'v(h + d) − σ'v(h)]/d, h the head's depth, d the mobilized depth (cut at the
// profile's base); iterated from the head layer's value until it changes by less than 1e-6
// kN/m³ (f depends on γ'). Throws std::invalid_argument when Broms or the stresses do.
struct SandBroms {
  BromsResult result;
  double unit_weight = 0.0;  // kN/m³, γ' used
  double depth = 0.0;        // m below the head, the mobilized depth it is averaged over
};
SandBroms broms_sand_averaged(const SoilColumn& soil, double head, BromsInput in) {
  SandBroms out;
  for (int i = 0; i < 50; ++i) {
    out.result = broms_ultimate_lateral(in);
    const double mobilized = out.result.mode == BromsMode::long_pile
                                 ? out.result.reaction_length
                                 : in.embedded_length;
    out.depth = std::min(mobilized, soil.depth() - head);
    out.unit_weight = in.effective_unit_weight;
    if (!(out.depth > 0.0)) break;
    double averaged = in.effective_unit_weight;
    try {
      averaged =
          (soil.effective_stress(head + out.depth) - soil.effective_stress(head)) / out.depth;
    } catch (const std::invalid_argument&) {
      out.depth = 0.0;  // a layer below lacks its unit weight: the head layer's γ' stays
      break;
    }
    if (std::abs(averaged - in.effective_unit_weight) < 1e-6) break;
    in.effective_unit_weight = averaged;
  }
  return out;
}

}  // namespace

DepthTableRange default_depth_table(UnitSystem units) {
  return units == UnitSystem::SI ? DepthTableRange{0.5, 3.0}
                                 : DepthTableRange{unit_si::foot, 10.0 * unit_si::foot};
}

DepthTableRange report_depth_table(const Project& project) {
  DepthTableRange range = default_depth_table(project.units);
  // A soil profile kilometres deep gets a longer step, not millions of rows.
  const double longest = project.soil ? project.soil->depth() : 0.0;
  range.step = std::max(range.step, (longest - range.from) / (kMaxDepthRows - 1));
  return range;
}

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

std::vector<std::optional<AxialRange>> axial_ranges(const Project& project,
                                                    const std::vector<CapSolution>& solutions) {
  std::vector<std::optional<AxialRange>> out(project.pile_types.size());
  for (const CapSolution& solution : solutions) {
    if (solution.overturns) continue;  // no pile forces to speak of
    for (std::size_t i = 0; i < solution.piles.size() && i < project.piles.size(); ++i) {
      const double p = solution.piles[i].axial;
      auto& range = out[project.piles[i].type];
      if (!range) range = AxialRange{p, p};
      range->least = std::min(range->least, p);
      range->greatest = std::max(range->greatest, p);
    }
  }
  return out;
}

std::vector<std::optional<LateralCapacity>> lateral_capacities(
    const Project& project, const std::vector<std::optional<AxialRange>>& axial) {
  std::vector<std::optional<LateralCapacity>> out(project.pile_types.size());
  if (!project.soil || project.soil->layers.empty()) return out;
  // The layer at the pile head governs the lateral mechanism near the top.
  const SoilProfile& soil = *project.soil;
  const SoilColumn column(soil);
  const std::size_t at_head = column.layer_at(project.cap.depth);
  const SoilLayer* layer = &column.layer(at_head);
  for (std::size_t t = 0; t < project.pile_types.size(); ++t) {
    const PileType& type = project.pile_types[t];
    BromsInput in;
    in.soil = layer->kind;
    in.width = type.section.width;
    in.embedded_length = type.length;
    // Broms' mechanisms know free and fixed heads; a partial restraint takes the free head's
    // (lower) resistance.
    in.head = type.head == HeadFixity::fixed ? HeadFixity::fixed : HeadFixity::pinned;
    if (layer->kind == SoilKind::clay) {
      if (!layer->undrained_strength) continue;
      in.undrained_strength = *layer->undrained_strength;
    } else {
      const bool wet = soil.water_table && *soil.water_table <= project.cap.depth;
      const auto gamma = column.unit_weight(at_head, wet);
      if (!gamma || !layer->friction_angle) continue;
      in.effective_unit_weight = wet ? *gamma - kWaterUnitWeight : *gamma;
      in.friction_angle = *layer->friction_angle;
    }
    const SectionYieldMoment my = section_yield_moment(
        type, t < axial.size() ? axial[t] : std::nullopt, project.units);
    if (!my.value) {
      LateralCapacity c;
      c.missing = my.missing;
      c.method = fmt::format("Broms (1964) in layer '{}': not computed, no yield moment ({})",
                             layer->name, my.missing);
      out[t] = c;
      continue;
    }
    in.yield_moment = my.value;
    try {
      std::optional<SandBroms> sand;  // γ' averaged with the water table
      if (layer->kind == SoilKind::sand) sand = broms_sand_averaged(column, project.cap.depth, in);
      const BromsResult b = sand ? sand->result : broms_ultimate_lateral(in);
      LateralCapacity c;
      c.ultimate = b.ultimate_load;
      c.allowable = allowable_lateral_load(b.ultimate_load);
      c.factored = kBromsResistanceFactor * b.ultimate_load;
      c.method = fmt::format("Broms (1964), {} pile, {} head, in layer '{}': H_ult = {}, "
                             "allowable H_ult/{:g}, factored {:g}·H_ult",
                             to_string(b.mode), to_string(type.head), layer->name,
                             QuantityFormat(project.units).text(Shown::force, b.ultimate_load),
                             kLateralFactorOfSafety,
                             kBromsResistanceFactor);
      c.method += "; " + my.basis;
      if (sand && sand->depth > 0.0)
        c.method += fmt::format(
            "; γ' = {} averaged over the top {} ({}), with the water table",
            QuantityFormat(project.units).text(Shown::unit_weight, sand->unit_weight),
            QuantityFormat(project.units).text(Shown::depth, sand->depth),
            sand->result.mode == BromsMode::long_pile ? "to the maximum moment"
                                                      : "the embedded length");
      out[t] = c;
    } catch (const std::invalid_argument&) {
      // Not enough data for Broms: the lateral check then needs a typed-in capacity.
    }
  }
  return out;
}

std::vector<Diagnostic> lateral_input_problems(
    const Project& project, const std::vector<std::optional<LateralCapacity>>& lateral,
    const std::vector<CapSolution>& solutions) {
  std::vector<Diagnostic> problems;
  // The capacities typed in, alone: where a basis lacks a lateral value, Broms is needed.
  const auto typed = resolve_resistances(project, {});
  // Types with a lateral force to check against a basis that has no typed-in value.
  std::set<std::size_t> needed;
  for (std::size_t c = 0; c < solutions.size() && c < project.combinations.size(); ++c) {
    const bool service = project.combinations[c].limit_state == LimitState::service;
    for (std::size_t i = 0; i < solutions[c].piles.size() && i < project.piles.size(); ++i) {
      const std::size_t t = project.piles[i].type;
      const Resistance& r = service ? typed[t].allowable : typed[t].factored;
      if (!r.lateral && solutions[c].piles[i].lateral > kNoLateralForce) needed.insert(t);
    }
  }
  for (std::size_t t : needed) {
    if (t >= lateral.size() || !lateral[t] || lateral[t]->missing.empty()) continue;
    const PileType& type = project.pile_types[t];
    const char* material = !type.structure                       ? ""
                           : type.structure->concrete_strength   ? "reinforced concrete "
                           : type.structure->steel_yield         ? "steel "
                                                                 : "timber ";
    problems.push_back(
        {type.structure ? type.structure->where : type.where,
         fmt::format("pile_types.{}: Broms' lateral capacity of this {}pile needs its yield "
                     "moment, but {}; give structure.yield_moment (or a lateral capacity)",
                     type.id, material, lateral[t]->missing)});
  }
  return problems;
}

std::vector<std::optional<ComputedResistance>> computed_resistances(
    const Project& project, const std::vector<PileTypeCapacity>& capacities,
    const std::vector<std::optional<LateralCapacity>>& lateral) {
  std::vector<std::optional<ComputedResistance>> out(project.pile_types.size());
  for (std::size_t t = 0; t < lateral.size() && t < out.size(); ++t) {
    if (!lateral[t] || !lateral[t]->missing.empty()) continue;
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
    for (std::size_t i = 0; i < c.result.limits.size(); ++i)
      r.method += (i == 0 ? "; limits that governed: " : ", ") + c.result.limits[i];
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
