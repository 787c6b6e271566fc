#include "cairn/checks/group_checks.hpp"

#include "cairn/core/quantity_format.hpp"
#include "cairn/geotechnics/code_resistance.hpp"

#include <algorithm>
#include <cmath>
#include <map>
#include <stdexcept>

#include <fmt/format.h>

namespace cairn {
namespace {

// Block failure resistance factors, AASHTO LRFD Tables 10.5.5.2.3-1 (driven piles, 0.60)
// and 10.5.5.2.4-1 (drilled shafts, 0.55); group uplift 0.50 / 0.45 (from memory).
constexpr double kPhiBlockDriven = 0.60, kPhiBlockBored = 0.55;
constexpr double kPhiGroupUpliftDriven = 0.50, kPhiGroupUpliftBored = 0.45;
// Lengths closer than this are equal (m): coordinates are given to the millimetre at best.
constexpr double kSpacingTolerance = 1e-9;

std::vector<PilePlan> plans_of(const Project& project) {
  std::vector<PilePlan> plans;
  for (const Pile& p : project.piles) {
    const Section& s = project.pile_types[p.type].section;
    plans.push_back({p.id, p.x, p.y, s.width, s.shape == SectionShape::round});
  }
  return plans;
}

std::vector<PlanPoint> outline_points(const Outline& outline) {
  std::vector<PlanPoint> points;
  for (const auto& c : outline.polygon) points.push_back({c[0], c[1]});
  return points;
}

// The pile type most piles use: it stands for the group in the single-pile settlement.
std::size_t main_type(const Project& project) {
  std::map<std::size_t, int> count;
  for (const Pile& p : project.piles) ++count[p.type];
  return std::max_element(count.begin(), count.end(),
                          [](auto& a, auto& b) { return a.second < b.second; })
      ->first;
}

double tip_depth(const Project& project) {
  double deepest = 0.0;
  for (const Pile& p : project.piles)
    deepest = std::max(deepest, project.pile_types[p.type].length * -p.axis()[2]);
  return project.cap.depth + deepest;
}

const PileTypeCapacity* capacity_of(const std::vector<PileTypeCapacity>& list, std::size_t type) {
  for (const auto& c : list)
    if (c.type == type) return &c;
  return nullptr;
}

// What η = 1 means for this project's piles and soil, added to the method's own note: the
// common-practice reason (driving densifies sand) is given only where it holds.
std::string no_reduction_context(const Project& project) {
  if (!project.soil)
    return "; the project has no soil profile, so whether the piles interact is not judged "
           "here: confirm that the single-pile capacities allow for group action";
  for (const Pile& p : project.piles)
    if (project.pile_types[p.type].design.installation == Installation::bored)
      return "; bored piles do not densify the soil between them: confirm that group action "
             "does not reduce the capacity (an efficiency method, or block failure in clay)";
  double top = 0.0;
  const double tip = tip_depth(project);
  for (const SoilLayer& layer : project.soil->layers) {
    if (layer.kind == SoilKind::clay && top < tip && top + layer.thickness > project.cap.depth)
      return "; the piles pass through clay, where a close group can fail as a block: see the "
             "block-failure check where it applies";
    top += layer.thickness;
  }
  return "; common practice for driven piles in sand, where driving densifies the soil "
         "between the piles";
}

}  // namespace

std::vector<Diagnostic> group_input_problems(const Project& project,
                                             const std::vector<PileTypeCapacity>& capacities) {
  std::vector<Diagnostic> problems;
  const auto plans = plans_of(project);
  const GroupSettings& g = project.group;
  if (auto method = efficiency_method_from_string(g.efficiency);
      method && *method != EfficiencyMethod::none) {
    const Efficiency e = group_efficiency(*method, plans, kGridTolerance, project.units);
    if (!e.value)
      problems.push_back({g.where, fmt::format("group.efficiency: '{}' {}", g.efficiency, e.note)});
  }
  if (project.cap.outline) {
    for (const Pile& p : project.piles)
      if (!project.cap.outline->contains(p.x, p.y))
        problems.push_back({p.where, fmt::format("piles: pile '{}' at ({:g}, {:g}) {} lies outside "
                                                 "the cap outline",
                                                 p.id, from_si(project.units, Quantity::length, p.x),
                                                 from_si(project.units, Quantity::length, p.y),
                                                 unit_label(project.units, Quantity::length))});
  }
  if (g.settlement) {
    if (!project.soil) {
      problems.push_back({g.where, "group.settlement: settlement needs a soil profile (soil: …)"});
      return problems;
    }
    std::vector<std::string> missing;
    vesic_pile(project, main_type(project), &missing);
    const std::size_t t = main_type(project);
    if (!project.group.tip_share && !capacity_of(capacities, t))
      missing.push_back(fmt::format("pile type '{}' needs tip_method and shaft_method (to split "
                                    "the load between tip and shaft) or group.settlement.tip_share",
                                    project.pile_types[t].id));
    const double tip = tip_depth(project);
    if (tip > project.soil->depth())
      missing.push_back("the piles reach below the soil profile's base");
    else {
      // The summation stops where Δσ < 10 % of σ'v0, and Δσ grows with the load: look as
      // deep as the largest service load will (a token load would stop at the first
      // sublayer and miss the data of every layer below it).
      double largest = 0.0;
      for (const Combination& combo : project.combinations)
        if (combo.limit_state == LimitState::service)
          largest = std::max(largest, -combination_load(project, combo)[2]);
      EquivalentFootingOptions options;
      options.units = project.units;
      const auto footing = equivalent_footing_settlement(*project.soil, block_plan(plans),
                                                         project.cap.depth, tip,
                                                         std::max(largest, 1.0), options);
      for (const auto& m : footing.missing) missing.push_back(m.message);
    }
    std::sort(missing.begin(), missing.end());
    missing.erase(std::unique(missing.begin(), missing.end()), missing.end());
    for (const auto& m : missing)
      problems.push_back({g.where, "group.settlement: " + m});
  }
  return problems;
}

GroupResults evaluate_group(const Project& project, const CheckResults& results,
                            const std::vector<PileTypeResistance>& resistances,
                            const std::vector<PileTypeCapacity>& capacities) {
  GroupResults out;
  const GroupSettings& g = project.group;
  const auto plans = plans_of(project);
  out.plan = block_plan(plans);
  out.efficiencies = all_efficiencies(plans, kGridTolerance, project.units);
  const EfficiencyMethod method =
      efficiency_method_from_string(g.efficiency).value_or(EfficiencyMethod::none);
  out.applied = group_efficiency(method, plans, kGridTolerance, project.units);
  const std::string context = no_reduction_context(project);
  for (Efficiency& e : out.efficiencies.all)
    if (e.method == EfficiencyMethod::none) e.note += context;
  if (method == EfficiencyMethod::none) out.applied.note += context;
  const double eta = out.applied.value.value_or(1.0);
  out.spacing = check_spacing(plans, g.min_spacing_factor, g.min_spacing, project.units);
  for (SpacingViolation& v : battered_spacing_violations(project))
    out.spacing.violations.push_back(std::move(v));
  if (!out.spacing.violations.empty()) out.pass = false;
  if (project.cap.outline) {
    out.edge = check_edge_distance(plans, outline_points(*project.cap.outline), g.min_edge_distance);
    if (!out.edge->offenders.empty()) out.pass = false;
  }

  // Σ single-pile capacities after efficiency, per basis.
  double sum_allowable = 0.0, sum_factored = 0.0;
  bool have_allowable = true, have_factored = true;
  bool split_known = true;
  std::vector<double> pile_factors;  // 1 − share·(1 − η), per pile
  for (const Pile& p : project.piles) {
    const auto& r = resistances[p.type];
    double share = 1.0;  // fraction of the capacity η reduces
    if (g.efficiency_shaft_only) {
      if (const auto* c = capacity_of(capacities, p.type); c && c->result.ultimate_compression > 0)
        share = c->result.shaft / c->result.ultimate_compression;
      else
        split_known = false;
    }
    const double factor = 1.0 - share * (1.0 - eta);
    pile_factors.push_back(factor);
    if (r.allowable.compression) sum_allowable += factor * *r.allowable.compression;
    else have_allowable = false;
    if (r.factored.compression) sum_factored += factor * *r.factored.compression;
    else have_factored = false;
  }
  if (g.efficiency_shaft_only && !split_known)
    out.notes.push_back("η applied to the whole capacity of pile types without a computed "
                        "tip/shaft split.");
  const std::size_t t = main_type(project);
  const PileType& type = project.pile_types[t];
  const bool bored = type.design.installation == Installation::bored;
  out.block_factor_of_safety = type.design.safety_factor.value_or(kDefaultBlockSafety);
  out.block_resistance_factor = bored ? kPhiBlockBored : kPhiBlockDriven;
  const double tip = tip_depth(project);
  if (project.soil && tip <= project.soil->depth() + 1e-9) {
    try {
      BlockCapacity block = block_capacity_clay(*project.soil, out.plan, project.cap.depth, tip);
      if (block.applies) out.block = block;
      else
        for (const auto& n : block.notes) out.notes.push_back(n);
    } catch (const std::invalid_argument& e) {
      out.notes.push_back(std::string("Block failure not checked: ") + e.what());
    }
  }
  out.governing = "efficiency";
  if (have_allowable) {
    out.capacity_allowable = sum_allowable;
    if (out.block && out.block->capacity / out.block_factor_of_safety < sum_allowable) {
      out.capacity_allowable = out.block->capacity / out.block_factor_of_safety;
      out.governing = "block";
    }
  }
  if (have_factored) {
    out.capacity_factored = sum_factored;
    if (out.block && out.block->capacity * out.block_resistance_factor < sum_factored) {
      out.capacity_factored = out.block->capacity * out.block_resistance_factor;
      out.governing = "block";
    }
  }
  if (out.block)
    out.notes.push_back(fmt::format(
        "Block capacity is divided by FS {:g} for service and multiplied by φ {} for strength "
        "(AASHTO LRFD Table 10.5.5.2.{}-1, from memory).",
        out.block_factor_of_safety, QuantityFormat::code_factor(out.block_resistance_factor), bored ? 4 : 3));

  out.settlement_asked = g.settlement && project.soil.has_value();
  out.settlement_limit = g.settlement_limit.value_or(kDefaultSettlementLimit);
  if (out.settlement_asked && !g.settlement_limit)
    out.notes.push_back(fmt::format(
        "Tolerable settlement {} (default, 25 mm; common practice for buildings).",
        QuantityFormat(project.units).text(Shown::displacement, kDefaultSettlementLimit)));
  std::optional<VesicPile> single;
  if (out.settlement_asked) single = vesic_pile(project, t, nullptr);
  if (out.settlement_asked && project.pile_types.size() > 1)
    out.notes.push_back(fmt::format("Single-pile settlement uses pile type {} (most of the piles).",
                                    type.id));

  const double uplift_fs = type.design.safety_factor_tension.value_or(kDefaultSafetyTension);
  const double uplift_phi = bored ? kPhiGroupUpliftBored : kPhiGroupUpliftDriven;
  for (const CombinationCheck& cc : results.combinations) {
    const Combination& combo = project.combinations[cc.combination];
    const bool service = combo.limit_state == LimitState::service;
    GroupCombination gc;
    gc.combination = cc.combination;
    gc.compression = cc.total_compression;
    gc.tension = cc.total_tension;
    const auto& rot = cc.solution.movement.rotation;
    gc.tilt = std::hypot(rot[0], rot[1]);
    gc.capacity = service ? out.capacity_allowable : out.capacity_factored;
    const ResistanceSet set = combo.resistance_set;
    if (set != ResistanceSet::basis) {
      // A code resistance set (code_resistance.hpp): η·Σ of the set's pile resistances, and
      // the block with the set's factors.
      gc.capacity.reset();
      double sum = 0.0;
      bool complete = true;
      for (std::size_t i = 0; i < project.piles.size(); ++i) {
        const auto& by_set = resistances[project.piles[i].type].by_set;
        const auto it = by_set.find(set);
        if (it == by_set.end() || !it->second.compression) complete = false;
        else sum += pile_factors[i] * *it->second.compression;
      }
      if (complete) gc.capacity = sum;
      if (complete && out.block)
        gc.capacity = std::min(sum, out.block->capacity /
                                        code_set_soil_divisor(project, type, set, false));
    }
    if (gc.capacity && *gc.capacity > 0) {
      gc.utilization = gc.compression / *gc.capacity;
      if (*gc.utilization > 1.0) gc.pass = false;
    }
    if (gc.tension > 1e-6 && project.soil && tip <= project.soil->depth() + 1e-9) {
      try {
        const GroupUplift uplift =
            group_uplift(*project.soil, out.plan, project.cap.depth, tip, gc.tension);
        gc.uplift_capacity = set != ResistanceSet::basis
                                 ? uplift.resistance / code_set_soil_divisor(project, type, set, true)
                             : service ? uplift.resistance / uplift_fs
                                       : uplift.resistance * uplift_phi;
        gc.uplift_utilization = gc.tension / *gc.uplift_capacity;
        if (*gc.uplift_utilization > 1.0) gc.pass = false;
      } catch (const std::invalid_argument&) {
        // Soil data for the uplift block is missing: not checked (noted once below).
      }
    }
    if (service && single && !cc.solution.overturns) {
      const Wrench load = combination_load(project, combo);
      const double vertical = -load[2];
      if (vertical > 0) {
        const double per_pile = vertical / static_cast<double>(project.piles.size());
        const auto* c = capacity_of(capacities, t);
        const double tip_share =
            g.tip_share ? *g.tip_share
                        : (c && c->result.ultimate_compression > 0
                               ? c->result.tip / c->result.ultimate_compression
                               : 0.5);
        const auto split = split_working_load(per_pile, tip_share, 1.0 - tip_share);
        const double s = vesic_settlement(*single, split).total;
        gc.single_settlement = s;
        gc.group_settlement = vesic_group_settlement(s, out.plan.width, type.section.width);
        EquivalentFootingOptions options;
        options.units = project.units;
        const auto footing = equivalent_footing_settlement(*project.soil, out.plan,
                                                           project.cap.depth, tip, vertical, options);
        gc.footing_settlement = footing.total;
        gc.settlement = std::max(*gc.group_settlement, footing.total.value_or(0.0));
        if (*gc.settlement > out.settlement_limit) gc.pass = false;
      }
    }
    if (!gc.pass) out.pass = false;
    out.per_combination.push_back(gc);
  }
  return out;
}

SegmentApproach closest_approach(const std::array<double, 3>& p1, const std::array<double, 3>& q1,
                                 const std::array<double, 3>& p2, const std::array<double, 3>& q2) {
  using Point = std::array<double, 3>;
  const auto minus = [](const Point& a, const Point& b) {
    return Point{a[0] - b[0], a[1] - b[1], a[2] - b[2]};
  };
  const auto dot = [](const Point& a, const Point& b) {
    return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
  };
  const auto along = [](const Point& a, const Point& d, double f) {
    return Point{a[0] + f * d[0], a[1] + f * d[1], a[2] + f * d[2]};
  };
  // Ericson (2005) §5.1.9, with d1, d2 the segments' directions and r = P1 − P2.
  const Point d1 = minus(q1, p1), d2 = minus(q2, p2), r = minus(p1, p2);
  const double a = dot(d1, d1), e = dot(d2, d2), f = dot(d2, r);
  constexpr double kTiny = 1e-24;  // m², a segment of no length
  double s = 0.0, t = 0.0;
  if (a <= kTiny && e <= kTiny) {
    // Two points.
  } else if (a <= kTiny) {
    t = std::clamp(f / e, 0.0, 1.0);
  } else {
    const double c = dot(d1, r);
    if (e <= kTiny) {
      s = std::clamp(-c / a, 0.0, 1.0);
    } else {
      const double b = dot(d1, d2);
      const double denom = a * e - b * b;  // ≥ 0; 0 for parallel segments (any s will do)
      s = denom > 0.0 ? std::clamp((b * f - c * e) / denom, 0.0, 1.0) : 0.0;
      t = (b * s + f) / e;
      if (t < 0.0) {
        t = 0.0;
        s = std::clamp(-c / a, 0.0, 1.0);
      } else if (t > 1.0) {
        t = 1.0;
        s = std::clamp((b - c) / a, 0.0, 1.0);
      }
    }
  }
  SegmentApproach out;
  out.first = along(p1, d1, s);
  out.second = along(p2, d2, t);
  const Point gap = minus(out.first, out.second);
  out.distance = std::sqrt(dot(gap, gap));
  return out;
}

std::vector<SpacingViolation> battered_spacing_violations(const Project& project) {
  std::vector<SpacingViolation> out;
  const GroupSettings& g = project.group;
  // Only pairs with a battered pile can come closer below the heads: loop over those.
  std::vector<std::size_t> battered;
  for (std::size_t i = 0; i < project.piles.size(); ++i)
    if (project.piles[i].batter) battered.push_back(i);
  const auto tip_depth_of = [&](const Pile& p) {
    return project.pile_types[p.type].length * -p.axis()[2];
  };
  for (std::size_t i : battered) {
    for (std::size_t j = 0; j < project.piles.size(); ++j) {
      if (j == i || (project.piles[j].batter && j < i)) continue;  // each pair once
      const Pile& a = project.piles[i];
      const Pile& b = project.piles[j];
      const double wa = project.pile_types[a.type].section.width;
      const double wb = project.pile_types[b.type].section.width;
      const double required = std::max(g.min_spacing_factor * std::max(wa, wb), g.min_spacing);
      if (std::hypot(a.x - b.x, a.y - b.y) < required) continue;  // the plan check's
      // Both axes from the head (z = 0) down to the shallower tip.
      const double depth = std::min(tip_depth_of(a), tip_depth_of(b));
      const auto end = [&](const Pile& p) {
        const auto u = p.axis();
        const double along = depth / -u[2];
        return std::array<double, 3>{p.x + along * u[0], p.y + along * u[1], along * u[2]};
      };
      const SegmentApproach c =
          closest_approach({a.x, a.y, 0.0}, end(a), {b.x, b.y, 0.0}, end(b));
      if (c.distance < required - kSpacingTolerance) {
        const double at = -0.5 * (c.first[2] + c.second[2]);
        // Listed with the earlier pile of the file first, as the plan check does.
        const bool ordered = i < j;
        out.push_back({ordered ? a.id : b.id, ordered ? b.id : a.id, c.distance, required, at});
      }
    }
  }
  return out;
}

}  // namespace cairn
