// The `pile_types:` section (sections.hpp): section, stiffness, structure, given
// capacities, and the methods that compute capacities from the soil.
#include "cairn/input/sections.hpp"

#include <cmath>
#include <map>
#include <set>

#include <fmt/format.h>

#include "cairn/geotechnics/methods.hpp"

#include "cairn/geotechnics/capacity.hpp"

namespace cairn {
namespace {

using Need = ReadContext::Need;
using Sign = ReadContext::Sign;

void read_capacity_set(const Located& n, CapacitySet& set, ReadContext& ctx) {
  if (!ctx.expect_map(n)) return;
  ctx.check_keys(n, {"basis", "compression", "tension", "lateral", "factor_of_safety",
                     "factor_of_safety_tension", "resistance_factor", "resistance_factor_tension"});
  set.where = ctx.at(n);
  if (auto b = n.child("basis"); b.present()) {
    if (auto v = ctx.choice<CapacityBasis>(b, {{"allowable", CapacityBasis::allowable},
                                           {"factored", CapacityBasis::factored},
                                           {"ultimate", CapacityBasis::ultimate}}))
      set.basis = *v;
  }
  set.compression = ctx.number(n, "compression", Quantity::force, Need::optional);
  // 0 is a tension capacity too: any tension then fails the pile (checks.hpp).
  set.tension = ctx.number(n, "tension", Quantity::force, Need::optional, Sign::non_negative);
  set.lateral = ctx.number(n, "lateral", Quantity::force, Need::optional);
  set.factor_of_safety = ctx.number(n, "factor_of_safety", Quantity::number, Need::optional);
  set.factor_of_safety_tension =
      ctx.number(n, "factor_of_safety_tension", Quantity::number, Need::optional);
  set.resistance_factor = ctx.number(n, "resistance_factor", Quantity::number, Need::optional);
  set.resistance_factor_tension =
      ctx.number(n, "resistance_factor_tension", Quantity::number, Need::optional);
  const bool factors = set.factor_of_safety || set.factor_of_safety_tension ||
                       set.resistance_factor || set.resistance_factor_tension;
  if (factors && set.basis != CapacityBasis::ultimate)
    ctx.error(ctx.at(n), fmt::format("{}: factors of safety and resistance factors apply to "
                                   "capacities with basis: ultimate only",
                                   n.path));
  if (!set.compression && !set.tension && !set.lateral)
    ctx.error(ctx.at(n), fmt::format("{}: expected at least one of compression, tension, "
                                   "lateral",
                                   n.path));
}

void read_section(const Located& n, Section& section, ReadContext& ctx) {
  if (!ctx.expect_map(n)) return;
  const auto shape = ctx.text(n, "shape");
  if (shape == "square") {
    ctx.check_keys(n, {"shape", "width"});
    section.shape = SectionShape::square;
    section.width = ctx.number(n, "width", Quantity::length).value_or(0.0);
  } else if (shape == "round") {
    ctx.check_keys(n, {"shape", "diameter"});
    section.shape = SectionShape::round;
    section.width = ctx.number(n, "diameter", Quantity::length).value_or(0.0);
  } else if (shape) {
    ctx.error(ctx.at(n.child("shape")),
                fmt::format("{}.shape: expected 'square' or 'round', got '{}'", n.path, *shape));
  }
}

template <typename T>
void read_method(const Located& n, const std::map<std::string, T>& names,
                 std::optional<T>& for_clay, std::optional<T>& for_sand, ReadContext& ctx) {
  if (n.is_map()) {
    ctx.check_keys(n, {"clay", "sand"});
    if (auto c = n.child("clay"); c.present()) for_clay = ctx.choice<T>(c, names);
    if (auto s = n.child("sand"); s.present()) for_sand = ctx.choice<T>(s, names);
  } else if (auto v = ctx.choice<T>(n, names)) {
    // One name for both kinds of soil: used wherever the method applies.
    if (applies_to(*v, SoilKind::clay)) for_clay = v;
    if (applies_to(*v, SoilKind::sand)) for_sand = v;
  }
}

}  // namespace

std::vector<PileType> read_pile_types(const std::vector<NamedEntry>& entries,
                                      const Located& whole, ReadContext& ctx, bool has_soil) {
  return read_named_entries<PileType>(entries, whole, ctx, [&](const Located& n, PileType& type) {
    ctx.check_keys(n, {"section", "length", "elastic_modulus", "axial_stiffness",
                       "lateral_stiffness", "tension", "head", "head_restraint", "torsional_stiffness", "structure", "capacity", "installation", "tip_method",
                       "shaft_method", "critical_depth", "factor_of_safety",
                       "factor_of_safety_tip", "factor_of_safety_shaft", "factor_of_safety_tension",
                       "resistance_factor_tip", "resistance_factor_shaft",
                       "resistance_factor_uplift"});
    if (auto s = n.child("section"); s.present()) read_section(s, type.section, ctx);
    else ctx.error(ctx.at(n), fmt::format("{}.section: missing; expected {{shape: square, width: …}} "
                                        "or {{shape: round, diameter: …}}", n.path));
    type.length = ctx.number(n, "length", Quantity::length).value_or(0.0);
    type.elastic_modulus =
        ctx.number(n, "elastic_modulus", Quantity::pressure, Need::optional).value_or(0.0);
    type.axial_stiffness = ctx.number(n, "axial_stiffness", Quantity::stiffness, Need::optional);
    type.lateral_stiffness = ctx.number(n, "lateral_stiffness", Quantity::stiffness, Need::optional,
                                    Sign::non_negative);
    if (!type.axial_stiffness && type.elastic_modulus <= 0.0 &&
        !n.child("elastic_modulus").present())
      ctx.error(ctx.at(n), fmt::format("{}: needs elastic_modulus (for the default axial "
                                     "stiffness E·A/L) or axial_stiffness",
                                     n.path));
    type.tension = ctx.flag(n, "tension").value_or(true);
    if (auto st = n.child("structure"); st.present() && ctx.expect_map(st)) {
      ctx.check_keys(st, {"concrete_strength", "steel_yield", "steel_area", "yield_moment",
                          "allowable_factor", "resistance_factor", "wall_thickness", "bar_count",
                          "cover_to_bar_center", "bending_strength"});
      Structure structure;
      structure.where = ctx.at(st);
      structure.concrete_strength = ctx.number(st, "concrete_strength", Quantity::pressure, Need::optional);
      structure.steel_yield = ctx.number(st, "steel_yield", Quantity::pressure, Need::optional);
      structure.steel_area = ctx.number(st, "steel_area", Quantity::area, Need::optional, Sign::non_negative);
      structure.yield_moment = ctx.number(st, "yield_moment", Quantity::moment, Need::optional);
      structure.allowable_factor = ctx.number(st, "allowable_factor", Quantity::number, Need::optional);
      structure.resistance_factor = ctx.number(st, "resistance_factor", Quantity::number, Need::optional);
      // What the yield moment is computed from (section_moment.hpp).
      structure.wall_thickness = ctx.number(st, "wall_thickness", Quantity::length, Need::optional);
      if (const auto bars = ctx.number(st, "bar_count", Quantity::number, Need::optional)) {
        if (*bars == std::floor(*bars) && *bars <= 1000) structure.bar_count = static_cast<int>(*bars);
        else ctx.error(ctx.at(st.child("bar_count")),
                         fmt::format("{}.structure.bar_count: expected a whole number of bars, got '{}'",
                                     n.path, scalar_text(st.child("bar_count"))));
      }
      structure.cover_to_bar_center =
          ctx.number(st, "cover_to_bar_center", Quantity::length, Need::optional);
      structure.bending_strength = ctx.number(st, "bending_strength", Quantity::pressure, Need::optional);
      if (!structure.concrete_strength && !structure.steel_yield && !structure.bending_strength)
        ctx.error(ctx.at(st), fmt::format("{}.structure: expected concrete_strength (f'c), "
                                        "steel_yield (fy) or bending_strength (timber Fb)", n.path));
      // The factors scale the axial capacity, which a timber section (Fb only) does not get.
      if ((structure.concrete_strength || structure.steel_yield) &&
          !structure.allowable_factor && !structure.resistance_factor)
        ctx.error(ctx.at(st), fmt::format("{}.structure: expected allowable_factor (service) and/or "
                                        "resistance_factor (strength)", n.path));
      type.structure = structure;
    }
    if (auto h = n.child("head"); h.present())
      if (auto v = ctx.choice<HeadFixity>(h, {{"pinned", HeadFixity::pinned},
                                          {"fixed", HeadFixity::fixed},
                                          {"partial", HeadFixity::partial}}))
        type.head = *v;
    type.head_restraint =
        ctx.number(n, "head_restraint", Quantity::rotational_stiffness, Need::optional);
    type.torsional_stiffness =
        ctx.number(n, "torsional_stiffness", Quantity::rotational_stiffness, Need::optional);
    if ((type.head == HeadFixity::partial) != type.head_restraint.has_value())
      ctx.error(ctx.at(n), fmt::format("{}: {}", n.path, type.head == HeadFixity::partial
                                                           ? "head: partial needs head_restraint"
                                                           : "head_restraint is for head: partial"));
    if (auto c = n.child("capacity"); c.present()) {
      if (c.is_sequence()) {
        for (std::size_t i = 0; i < c.size(); ++i) {
          CapacitySet set;
          read_capacity_set(c.item(i), set, ctx);
          type.capacities.push_back(set);
        }
      } else {
        CapacitySet set;
        read_capacity_set(c, set, ctx);
        type.capacities.push_back(set);
      }
      // `tension: false` (compression only) and a tension capacity contradict each other;
      // 0 agrees with it.
      for (std::size_t i = 0; i < type.capacities.size() && !type.tension; ++i) {
        const Located t = (c.is_sequence() ? c.item(i) : c).child("tension");
        if (type.capacities[i].tension.value_or(0.0) > 0.0)
          ctx.error(ctx.at(t), fmt::format(
              "{}: expected 0 or no tension capacity with tension: false (the pile drops out "
              "of the cap rather than take tension), got '{}'; which did you mean: a pile "
              "that takes tension up to this capacity (remove 'tension: false') or a "
              "compression-only pile (remove {})?",
              t.path, scalar_text(t), t.path));
      }
      std::set<CapacityBasis> bases;
      for (const auto& set : type.capacities)
        if (!bases.insert(set.basis).second)
          ctx.error(set.where, fmt::format("{}.capacity: basis '{}' is given twice", n.path,
                                             to_string(set.basis)));
    }
    PileDesign& design = type.design;
    if (auto inst = n.child("installation"); inst.present())
      if (auto v = ctx.choice<Installation>(inst, {{"driven", Installation::driven},
                                               {"bored", Installation::bored}}))
        design.installation = *v;
    if (auto tip = n.child("tip_method"); tip.present())
      read_method<TipMethod>(tip, tip_method_choices(), design.tip_clay, design.tip_sand, ctx);
    if (auto shaft = n.child("shaft_method"); shaft.present())
      read_method<ShaftMethod>(shaft, shaft_method_choices(), design.shaft_clay, design.shaft_sand, ctx);
    design.critical_depth_diameters =
        ctx.number(n, "critical_depth", Quantity::number, Need::optional);
    design.safety_factor = ctx.number(n, "factor_of_safety", Quantity::number, Need::optional);
    design.safety_factor_tip = ctx.number(n, "factor_of_safety_tip", Quantity::number, Need::optional);
    design.safety_factor_shaft =
        ctx.number(n, "factor_of_safety_shaft", Quantity::number, Need::optional);
    design.safety_factor_tension =
        ctx.number(n, "factor_of_safety_tension", Quantity::number, Need::optional);
    design.phi_tip = ctx.number(n, "resistance_factor_tip", Quantity::number, Need::optional);
    design.phi_shaft = ctx.number(n, "resistance_factor_shaft", Quantity::number, Need::optional);
    design.phi_uplift = ctx.number(n, "resistance_factor_uplift", Quantity::number, Need::optional);
    for (const char* key : {"factor_of_safety", "factor_of_safety_tip", "factor_of_safety_shaft",
                            "factor_of_safety_tension"}) {
      const Located f = n.child(key);
      if (f.present() && f.is_scalar()) {
        const auto v = parse_quantity(f.scalar(), Quantity::number, ctx.units_of(n));
        if (v.si && *v.si < 1.0)
          ctx.error(ctx.at(f), fmt::format("{}: expected a factor of safety of at least 1, got '{}'",
                                         f.path, f.scalar()));
      }
    }
    for (const char* key : {"resistance_factor_tip", "resistance_factor_shaft",
                            "resistance_factor_uplift"}) {
      const Located f = n.child(key);
      if (f.present() && f.is_scalar()) {
        const auto v = parse_quantity(f.scalar(), Quantity::number, ctx.units_of(n));
        if (v.si && *v.si > 1.0)
          ctx.error(ctx.at(f), fmt::format("{}: expected a resistance factor φ from 0 to 1, got '{}'",
                                         f.path, f.scalar()));
      }
    }
    if (design.computes_capacity() && !has_soil)
      ctx.error(ctx.at(n), fmt::format("{}: tip_method and shaft_method need a soil profile "
                                     "(soil: {{layers: …}})",
                                     n.path));
    if (type.capacities.empty() && !design.computes_capacity())
      ctx.error(ctx.at(n), fmt::format("{}: no capacity; give capacity: {{compression: …, "
                                     "tension: …, lateral: …}} or tip_method and shaft_method "
                                     "with a soil profile",
                                     n.path));
    // Methods or default resistance factors that belong to the other installation.
    for (const auto& caution : installation_cautions(design))
      ctx.warn(ctx.at(n), fmt::format("{}: {}", n.path, caution));
  });
}

}  // namespace cairn
