#include "cairn/design/search.hpp"

#include <algorithm>
#include <atomic>
#include <cmath>
#include <limits>
#include <map>
#include <mutex>
#include <optional>
#include <thread>

#include <Eigen/Dense>
#include <fmt/format.h>

#include "cairn/app/analysis.hpp"
#include "cairn/checks/checks.hpp"
#include "cairn/core/diagnostics.hpp"
#include "cairn/geotechnics/project_capacity.hpp"
#include "cairn/geotechnics/stiffness.hpp"
#include "cairn/solver/cap_solver.hpp"

namespace cairn {
namespace {

constexpr double kInfinity = std::numeric_limits<double>::infinity();
constexpr double kCubicYard = 0.764554857984;  // m³ (exact: 0.9144³)

// Rejection reasons, the words of the output.
const char* const kReasonLength = "pile capacity: no length up to design.length.max carries the load";
const char* const kReasonCapacity =
    "pile capacity: the load exceeds the typed-in capacity (the pile type keeps its length)";
const char* const kReasonTension = "tension in a pile type without tension capacity";
const char* const kReasonStructural = "structural capacity of the pile section";
const char* const kReasonLateral = "lateral capacity of the pile";
const char* const kReasonOverturns = "no equilibrium: the compression-only piles cannot hold the cap";
const char* const kReasonUnresisted =
    "a load no pile can resist (a moment on one pile or two in line, or a horizontal load "
    "with no batter and no lateral springs)";
const char* const kReasonSoil = "no capacity from the soil at any allowed length";
const char* const kReasonTilt = "tilt of the cap above design.tilt_limit";

// The project without the cap's self-weight (read_project added it for the given outline).
Project strip_self_weight(Project p) {
  for (auto& lc : p.load_cases)
    lc.loads.erase(std::remove_if(lc.loads.begin(), lc.loads.end(),
                                  [](const PointLoad& l) { return l.note == "cap self-weight"; }),
                   lc.loads.end());
  p.piles.clear();
  return p;
}

double cap_thickness(const Project& base, const DesignSpec& spec, const Layout& layout) {
  if (!spec.thickness) return base.cap.thickness;
  const double unit = spec.layout_unit;
  // Computed in the file's unit and converted like a written number.
  const double spacing_file = layout.spacing / unit;
  const double width_file = base.pile_types[layout.type].section.width / unit;
  ThicknessRule rule = *spec.thickness;
  rule.base /= unit;
  rule.minimum /= unit;
  const double h = std::ceil(rule.thickness(spacing_file, width_file) * 1e3 - 1e-6) / 1e3;
  return file_length_to_si(h, base.units);
}

const Resistance& resistance_for(const PileTypeResistance& r, const Combination& c) {
  if (c.resistance_set != ResistanceSet::basis) {
    const auto it = r.by_set.find(c.resistance_set);
    if (it != r.by_set.end()) return it->second;
  }
  return c.limit_state == LimitState::service ? r.allowable : r.factored;
}

// Per pile type: the length grid and, per length, the check's resistances and springs.
struct TypeTable {
  std::vector<double> lengths;  // m
  std::vector<std::optional<PileTypeResistance>> resistance;
  std::vector<PileTypeStiffness> stiffness;
};

TypeTable type_table(const Project& base, const DesignSpec& spec, std::size_t t) {
  TypeTable table;
  bool from_soil = false;
  if (base.soil) {
    try {
      for (const auto& c : compute_capacities(base))
        if (c.type == t) from_soil = true;
    } catch (const InputError&) {
      from_soil = true;  // the type's own length may be beyond the profile: still from soil
    } catch (const std::invalid_argument&) {
      from_soil = true;
    }
  }
  const double unit = spec.layout_unit;
  if (from_soil) {
    const double step = spec.length_step / unit;
    for (long k = static_cast<long>(std::ceil(spec.min_length / unit / step - 1e-9));
         k * step <= spec.max_length / unit * (1 + 1e-9); ++k)
      table.lengths.push_back(file_length_to_si(std::round(k * step * 1e4) / 1e4, base.units));
  } else {
    table.lengths.push_back(base.pile_types[t].length);
  }
  // A length may fail where the tip leaves the profile; a type no length works for lacks
  // data (a method's soil property): that is the file's problem, reported as `check` would.
  std::optional<InputError> problem;
  std::optional<std::string> refused;
  for (double length : table.lengths) {
    Project p = base;
    p.pile_types[t].length = length;
    try {
      const auto caps = compute_capacities(p);
      auto resolved = resolve_resistances(p, computed_resistances(p, caps));
      table.resistance.push_back(resolved.at(t));
      table.stiffness.push_back(pile_type_stiffness(p, caps).at(t));
    } catch (const InputError& e) {
      if (!problem) problem = e;
      table.resistance.push_back(std::nullopt);
      table.stiffness.push_back({});
    } catch (const std::invalid_argument& e) {
      if (!refused) refused = e.what();
      table.resistance.push_back(std::nullopt);
      table.stiffness.push_back({});
    }
  }
  const bool none = std::none_of(table.resistance.begin(), table.resistance.end(),
                                 [](const auto& r) { return r.has_value(); });
  if (none && problem) throw *problem;
  if (none && refused) throw std::invalid_argument(*refused);
  return table;
}

// The loads of every combination without the cap's weight, about the origin, and the
// factor each combination puts on the self-weight case.
// Loads on the top of the cap move with its thickness h: W(h) = loads + h·per_height.
struct CombinationLoads {
  std::vector<Wrench> loads;       // loads on top taken at z = 0
  std::vector<Wrench> per_height;  // change of the wrench per metre of thickness
  std::vector<double> self_weight_factor;
};

Project loads_on_top_at(Project p, double z) {
  for (auto& lc : p.load_cases)
    for (auto& l : lc.loads)
      if (l.on_top) l.at[2] = z;
  return p;
}

CombinationLoads combination_loads(const Project& stripped) {
  CombinationLoads c;
  std::optional<std::size_t> weight_case;
  if (stripped.cap.self_weight)
    for (std::size_t i = 0; i < stripped.load_cases.size(); ++i)
      if (stripped.load_cases[i].id == stripped.cap.self_weight->load_case) weight_case = i;
  const Project at_zero = loads_on_top_at(stripped, 0.0);
  const Project at_one = loads_on_top_at(stripped, 1.0);
  for (const auto& combo : stripped.combinations) {
    c.loads.push_back(combination_load(at_zero, combo));
    Wrench delta = combination_load(at_one, combo);
    for (std::size_t i = 0; i < 6; ++i) delta[i] -= c.loads.back()[i];
    c.per_height.push_back(delta);
    double f = 0.0;
    for (const auto& [index, factor] : combo.factors)
      if (weight_case && index == *weight_case) f += factor;
    c.self_weight_factor.push_back(f);
  }
  return c;
}

struct Screened {
  const char* reason = nullptr;  // null: passes the screen
  std::size_t length_index = 0;
  double utilization = 0.0;
};

// Largest demands of one combination over the piles.
struct Demands {
  double compression = 0.0, tension = 0.0, lateral = 0.0;
};

class Screen {
 public:
  Screen(const Project& stripped, const DesignSpec& spec, const CombinationLoads& loads)
      : project_(stripped), spec_(spec), loads_(loads) {}

  Screened run(const Layout& layout, const TypeTable& table, double thickness) const {
    Screened out;
    const PileType& type = project_.pile_types[layout.type];
    std::size_t li = 0;
    while (li < table.lengths.size() && !table.resistance[li]) ++li;
    if (li == table.lengths.size()) return {kReasonSoil, 0, 0.0};
    // Self-weight about the origin.
    Wrench weight{};
    if (project_.cap.self_weight) {
      const auto c = layout.outline.centroid();
      const double fz = -project_.cap.self_weight->unit_weight * layout.outline.area() * thickness;
      weight = {0, 0, fz, c[1] * fz, -c[0] * fz, 0};
    }
    std::vector<std::size_t> seen;
    for (int iteration = 0; iteration < 8; ++iteration) {
      std::vector<Demands> demands;
      if (const char* why = solve(layout, type, table.stiffness[li], weight, thickness, demands))
        return {why, li, 0.0};
      // The shortest usable length carrying every combination's demand.
      std::optional<std::size_t> needed;
      const char* why = kReasonLength;
      double util_at = 0.0;
      for (std::size_t k = 0; k < table.lengths.size() && !needed; ++k) {
        if (!table.resistance[k]) continue;
        const auto [u, reason] = utilization(*table.resistance[k], demands);
        if (u <= 1.0) {
          needed = k;
          util_at = u;
        } else {
          why = reason;
        }
      }
      if (!needed) {
        // The utilization at the longest usable length, for the explanation.
        double closest = kInfinity;
        for (std::size_t k = table.lengths.size(); k-- > 0;)
          if (table.resistance[k]) {
            closest = utilization(*table.resistance[k], demands).first;
            break;
          }
        return {why, li, closest};
      }
      if (*needed == li) return {nullptr, li, util_at};
      if (std::find(seen.begin(), seen.end(), *needed) != seen.end()) {
        // Cycling between lengths: take the longer of the two and accept it if it carries
        // its own demand.
        li = std::max(li, *needed);
        std::vector<Demands> again;
        if (const char* w = solve(layout, type, table.stiffness[li], weight, thickness, again)) return {w, li, 0.0};
        const auto [u, reason] = utilization(*table.resistance[li], again);
        return u <= 1.0 ? Screened{nullptr, li, u} : Screened{reason, li, 0.0};
      }
      seen.push_back(li);
      li = *needed;
    }
    return {kReasonLength, li, 0.0};
  }

 private:
  // Pile demands per combination for the springs of one length; a reason when the layout
  // cannot hold the loads at all.
  const char* solve(const Layout& layout, const PileType& type, const PileTypeStiffness& k,
                    const Wrench& weight, double thickness, std::vector<Demands>& demands) const {
    std::vector<PileSpring> springs;
    springs.reserve(layout.piles.size());
    for (const auto& p : layout.piles) {
      Pile pile;
      pile.batter = p.batter;
      springs.push_back({{p.x, p.y, 0.0}, pile.axis(), k.axial, k.lateral, type.tension});
    }
    const CapSolver solver(std::move(springs));
    const auto& sp = solver.springs();
    const auto& c = solver.reference();
    // Flexibility: movement of the reference point per unit load component.
    Eigen::Matrix<double, 6, 6> flexibility = Eigen::Matrix<double, 6, 6>::Zero();
    std::array<bool, 6> free{};
    bool any_free = false;
    for (int i = 0; i < 6; ++i) {
      Wrench unit{};
      unit[static_cast<std::size_t>(i)] = 1.0;
      const CapLoad load(unit);
      if (!solver.unresisted(load).empty()) {
        free[static_cast<std::size_t>(i)] = any_free = true;
        continue;
      }
      const CapSolution s = solver.solve_linear(load);
      for (int j = 0; j < 3; ++j) {
        flexibility(j, i) = s.movement.translation_at_reference[static_cast<std::size_t>(j)];
        flexibility(j + 3, i) = s.movement.rotation[static_cast<std::size_t>(j)];
      }
    }
    const std::size_t n = sp.size();
    demands.assign(project_.combinations.size(), {});
    for (std::size_t k2 = 0; k2 < project_.combinations.size(); ++k2) {
      Wrench w = loads_.loads[k2];
      const double f = loads_.self_weight_factor[k2];
      for (std::size_t i = 0; i < 6; ++i) w[i] += f * weight[i] + thickness * loads_.per_height[k2][i];
      const CapLoad load = solver.from_origin(w);
      if (any_free) {
        double largest = 0.0;
        for (double v : load.about_reference) largest = std::max(largest, std::abs(v));
        for (std::size_t i = 0; i < 6; ++i)
          if (free[i] && std::abs(load.about_reference[i]) > 1e-9 * std::max(largest, 1.0))
            return kReasonUnresisted;
      }
      Eigen::Matrix<double, 6, 1> f6;
      for (int i = 0; i < 6; ++i) f6(i) = load.about_reference[static_cast<std::size_t>(i)];
      const Eigen::Matrix<double, 6, 1> u = flexibility * f6;
      Demands& d = demands[k2];
      bool lifted = false;
      for (std::size_t p = 0; p < n; ++p) {
        const auto& s = sp[p];
        const double rx = s.head[0] - c[0], ry = s.head[1] - c[1], rz = s.head[2] - c[2];
        // u_p = t + θ × r
        const double ux = u(0) + u(4) * rz - u(5) * ry;
        const double uy = u(1) + u(5) * rx - u(3) * rz;
        const double uz = u(2) + u(3) * ry - u(4) * rx;
        const double along = ux * s.axis[0] + uy * s.axis[1] + uz * s.axis[2];
        const double axial = s.axial * along;
        if (!s.tension && axial < 0.0) lifted = true;
        const double lx = ux - along * s.axis[0], ly = uy - along * s.axis[1],
                     lz = uz - along * s.axis[2];
        const double lateral = s.lateral * std::sqrt(lx * lx + ly * ly + lz * lz);
        d.compression = std::max(d.compression, axial);
        d.tension = std::max(d.tension, -axial);
        d.lateral = std::max(d.lateral, lateral);
      }
      if (lifted) {
        const CapSolution s = solver.solve(load);
        if (s.overturns) return kReasonOverturns;
        d = {};
        for (const auto& pf : s.piles) {
          d.compression = std::max(d.compression, pf.axial);
          d.tension = std::max(d.tension, -pf.axial);
          d.lateral = std::max(d.lateral, pf.lateral);
        }
      }
    }
    return nullptr;
  }

  // Largest utilization over the combinations with the resistances of one length.
  std::pair<double, const char*> utilization(const PileTypeResistance& r,
                                             const std::vector<Demands>& demands) const {
    double worst = 0.0;
    const char* reason = kReasonLength;
    for (std::size_t k = 0; k < demands.size(); ++k) {
      const Resistance& res = resistance_for(r, project_.combinations[k]);
      const Demands& d = demands[k];
      auto take = [&](double u, const char* why) {
        if (u > worst) {
          worst = u;
          reason = why;
        }
      };
      if (d.compression > 1e-9) {
        take(res.compression ? d.compression / *res.compression : kInfinity, kReasonLength);
        if (res.structural_axial) take(d.compression / *res.structural_axial, kReasonStructural);
      }
      if (d.tension > 1e-9)
        take(res.tension ? d.tension / *res.tension : kInfinity,
             res.tension ? kReasonLength : kReasonTension);
      if (d.lateral > 1e-9 && res.lateral) take(d.lateral / *res.lateral, kReasonLateral);
    }
    return {worst, reason};
  }

  const Project& project_;
  const DesignSpec& spec_;
  const CombinationLoads& loads_;
};

// Why a full check failed, in the words of the rejection counts.
std::string full_check_reason(const CheckRun& run) {
  const CheckSummary& s = run.results.summary;
  if (!s.overturned.empty()) return kReasonOverturns;
  if (s.failed_combinations > 0) {
    switch (s.check) {
      case Demand::compression: return "check: pile compression capacity";
      case Demand::tension: return "check: pile tension capacity";
      case Demand::lateral: return "check: pile lateral capacity";
      case Demand::structural: return "check: structural capacity of the pile";
      case Demand::none: return "check: a pile fails";
    }
  }
  const GroupResults& g = run.group;
  if (!g.spacing.violations.empty()) return "check: pile spacing (battered piles below the cap)";
  if (g.edge && !g.edge->offenders.empty()) return "check: edge distance";
  for (const auto& gc : g.per_combination) {
    if (gc.utilization && *gc.utilization > 1.0) return "check: group capacity (efficiency or block)";
    if (gc.uplift_utilization && *gc.uplift_utilization > 1.0) return "check: group uplift";
    if (gc.settlement && *gc.settlement > g.settlement_limit) return "check: settlement";
  }
  return "check: group checks";
}

struct FullResult {
  bool pass = false;
  std::string reason;
};

// The full check of a candidate; fills its utilization, governing check and tilt.
FullResult full_check(const Project& base, const DesignSpec& spec, Candidate& c) {
  const CheckRun run = analyse(candidate_project(base, spec, c));
  c.checked_fully = true;
  const CheckSummary& s = run.results.summary;
  c.max_utilization = s.max_utilization;
  c.governs = fmt::format("{}{}{}", to_string(s.check),
                          s.pile ? ", pile " + run.project.piles[*s.pile].id : "",
                          s.combination ? ", " + run.project.combinations[*s.combination].id : "");
  for (const auto& gc : run.group.per_combination) {
    if (run.project.combinations[gc.combination].limit_state == LimitState::service)
      c.tilt = std::max(c.tilt, gc.tilt);
    if (gc.utilization && *gc.utilization > c.max_utilization) {
      c.max_utilization = *gc.utilization;
      c.governs = "group capacity, " + run.project.combinations[gc.combination].id;
    }
  }
  c.score = c.cost + spec.cost.utilization_weight * c.max_utilization;
  if (!s.pass) return {false, full_check_reason(run)};
  if (spec.tilt_limit && c.tilt > *spec.tilt_limit) return {false, kReasonTilt};
  return {true, ""};
}

}  // namespace

double candidate_cost(const Project& base, const DesignSpec& spec, std::size_t piles,
                      double length, double cap_volume) {
  const double volume = base.units == UnitSystem::SI ? cap_volume : cap_volume / kCubicYard;
  return spec.cost.per_pile * static_cast<double>(piles) +
         spec.cost.per_length * static_cast<double>(piles) * (length / spec.layout_unit) +
         spec.cost.per_cap_volume * volume;
}

Project candidate_project(const Project& base, const DesignSpec& spec, const Candidate& c) {
  (void)spec;
  Project p = strip_self_weight(base);
  const Layout& layout = c.layout;
  p.cap.thickness = c.thickness;
  // Loads and columns given without a height stand on the top of the cap, as the reader
  // puts them at the thickness the file gives.
  for (auto& lc : p.load_cases)
    for (auto& l : lc.loads)
      if (l.on_top) l.at[2] = c.thickness;
  for (auto& col : p.columns)
    if (col.on_top) col.at[2] = c.thickness;
  p.cap.outline = layout.outline;
  p.pile_types[layout.type].length = c.length;
  for (std::size_t i = 0; i < layout.piles.size(); ++i) {
    Pile pile;
    pile.id = fmt::format("P{}", i + 1);
    pile.where = {base.file, 0, 0};
    pile.x = layout.piles[i].x;
    pile.y = layout.piles[i].y;
    pile.type = layout.type;
    pile.batter = layout.piles[i].batter;
    p.piles.push_back(pile);
  }
  // As the reader adds it: at the outline's centroid, mid-thickness, the last load of its case.
  if (p.cap.self_weight)
    for (auto& lc : p.load_cases)
      if (lc.id == p.cap.self_weight->load_case) {
        const auto m = p.cap.outline->centroid();
        PointLoad weight;
        weight.where = p.cap.self_weight->where;
        weight.at = {m[0], m[1], p.cap.thickness / 2.0};
        weight.load = {0, 0, -p.cap.self_weight->unit_weight * p.cap.outline->area() * p.cap.thickness,
                       0, 0, 0};
        weight.note = "cap self-weight";
        lc.loads.push_back(weight);
        break;
      }
  return p;
}

std::vector<std::string> design_basis(const Project& base, const DesignSpec& spec) {
  const UnitSystem u = base.units;
  const char* len = unit_label(u, Quantity::length);
  const double unit = spec.layout_unit;
  std::vector<std::string> lines;
  std::string types, families;
  for (auto t : spec.pile_types) types += (types.empty() ? "" : ", ") + base.pile_types[t].id;
  for (auto f : spec.families) families += (families.empty() ? "" : ", ") + std::string(to_string(f));
  lines.push_back("Pile types: " + types);
  lines.push_back(fmt::format("Families: {}{}{}", families,
                              spec.batter_ratio ? fmt::format("; outer piles also battered 1:{:g}", *spec.batter_ratio) : "",
                              spec.shift_to_resultant ? "; also shifted toward the resultant" : ""));
  lines.push_back(fmt::format("Spacing {:g} to {:g} pile widths in steps of {:g} {}; pile face to "
                              "cap edge {:g} {}; at most {} piles",
                              spec.min_spacing_factor, spec.max_spacing_factor,
                              spec.spacing_step / unit, len,
                              spec.edge_distance.value_or(base.group.min_edge_distance) / unit, len,
                              spec.max_piles));
  lines.push_back(fmt::format("Pile length {:g} to {:g} {} in steps of {:g} {} (pile types with "
                              "typed-in capacities keep their own length)",
                              spec.min_length / unit, spec.max_length / unit, len,
                              spec.length_step / unit, len));
  if (spec.thickness)
    lines.push_back(fmt::format("Cap thickness max({:g} {}, {:g} {} + {:g}·spacing + {:g}·pile width), "
                                "rounded up to 1 mm (0.001 ft); outline {}",
                                spec.thickness->minimum / unit, len, spec.thickness->base / unit, len,
                                spec.thickness->per_spacing, spec.thickness->per_width,
                                spec.outline_fixed ? "fixed" : "fitted around the piles"));
  else
    lines.push_back(fmt::format("Cap thickness {:g} {} (cap.thickness); outline {}",
                                base.cap.thickness / unit, len,
                                spec.outline_fixed ? "fixed" : "fitted around the piles"));
  const std::string cur = spec.cost.currency.empty() ? "" : " " + spec.cost.currency;
  lines.push_back(fmt::format("Cost: {:g}{} per pile + {:g}{} per {} of pile + {:g}{} per {} of cap"
                              "{}",
                              spec.cost.per_pile, cur, spec.cost.per_length, cur, len,
                              spec.cost.per_cap_volume, cur, u == UnitSystem::SI ? "m³" : "yd³",
                              spec.cost.utilization_weight > 0
                                  ? fmt::format("; ranked by cost + {:g} × largest utilization",
                                                spec.cost.utilization_weight)
                                  : ""));
  if (spec.tilt_limit) lines.push_back(fmt::format("Tilt limit {:g} rad (service combinations)", *spec.tilt_limit));
  return lines;
}

DesignOutcome search_layouts(const Project& read, const DesignSpec& spec, unsigned threads,
                             const DesignProgress& progress) {
  const Project base = strip_self_weight(read);
  DesignOutcome outcome;
  outcome.combinations = base.combinations.size();
  const CombinationLoads loads = combination_loads(base);
  const std::array<double, 2> toward = resultant_point(base);
  std::map<std::string, std::size_t> rejected;
  struct Work {
    Layout layout;
    double thickness;
  };
  std::vector<Work> work;
  std::vector<TypeTable> tables(base.pile_types.size());
  for (std::size_t t : spec.pile_types) {
    tables[t] = type_table(base, spec, t);
    LayoutCounts counts;
    for (auto& l : generate_layouts(base, spec, t, toward, counts)) {
      const double h = cap_thickness(base, spec, l);
      work.push_back({std::move(l), h});
    }
    outcome.truncated = outcome.truncated || counts.truncated;
    rejected["cap larger than cap.outline allows"] += counts.outside_outline;
    rejected["spacing outside design.spacing"] += counts.spacing;
  }
  outcome.layouts = work.size();
  const Screen screen(base, spec, loads);
  std::vector<Candidate> feasible;
  std::mutex lock;
  std::atomic<std::size_t> next{0}, done{0};
  auto worker = [&] {
    std::vector<Candidate> mine;
    std::map<std::string, std::size_t> why;
    std::pair<double, std::string> closest{kInfinity, ""};
    for (std::size_t i = next++; i < work.size(); i = next++) {
      const Work& w = work[i];
      const TypeTable& table = tables[w.layout.type];
      const Screened s = screen.run(w.layout, table, w.thickness);
      if (s.reason) {
        ++why[s.reason == kReasonLength && table.lengths.size() == 1 ? kReasonCapacity : s.reason];
        if (s.reason == kReasonLength && table.lengths.size() > 1 && s.utilization < closest.first)
          closest = {s.utilization, w.layout.describe() + " of " + base.pile_types[w.layout.type].id};
      } else {
        Candidate c;
        c.layout = w.layout;
        c.length = table.lengths[s.length_index];
        c.thickness = w.thickness;
        c.cap_volume = w.layout.outline.area() * w.thickness;
        c.max_utilization = s.utilization;
        c.cost = candidate_cost(base, spec, w.layout.piles.size(), c.length, c.cap_volume);
        c.score = c.cost + spec.cost.utilization_weight * c.max_utilization;
        mine.push_back(std::move(c));
      }
      const std::size_t d = ++done;
      if (progress && d % 256 == 0) progress(d, work.size());
    }
    std::lock_guard<std::mutex> guard(lock);
    for (auto& c : mine) feasible.push_back(std::move(c));
    for (auto& [k, v] : why) rejected[k] += v;
    if (closest.first < outcome.closest_utilization.value_or(kInfinity) ||
        (closest.first == outcome.closest_utilization.value_or(kInfinity) &&
         closest.second < outcome.closest_layout)) {
      outcome.closest_utilization = closest.first;
      outcome.closest_layout = closest.second;
    }
  };
  std::vector<std::thread> pool;
  const unsigned n = std::max(1u, threads);
  for (unsigned t = 1; t < n; ++t) pool.emplace_back(worker);
  worker();
  for (auto& t : pool) t.join();
  if (progress) progress(work.size(), work.size());
  outcome.passed_screen = feasible.size();
  // A fixed order whatever the threads did: score, then fewer piles, then the layout's text.
  auto order = [](const Candidate& a, const Candidate& b) {
    if (a.score != b.score) return a.score < b.score;
    if (a.layout.piles.size() != b.layout.piles.size()) return a.layout.piles.size() < b.layout.piles.size();
    if (a.max_utilization != b.max_utilization) return a.max_utilization < b.max_utilization;
    if (a.cap_volume != b.cap_volume) return a.cap_volume < b.cap_volume;
    if (a.layout.type != b.layout.type) return a.layout.type < b.layout.type;
    if (a.layout.piles_file != b.layout.piles_file) return a.layout.piles_file < b.layout.piles_file;
    return a.layout.battered < b.layout.battered;
  };
  std::sort(feasible.begin(), feasible.end(), order);
  // Full checks, best first; a candidate failing only there is tried at longer lengths.
  std::vector<Candidate> passed;
  auto check_fully = [&](Candidate c) -> std::optional<Candidate> {
    const TypeTable& table = tables[c.layout.type];
    auto it = std::find(table.lengths.begin(), table.lengths.end(), c.length);
    std::string first_reason;
    for (int tries = 0; tries < 12 && it != table.lengths.end(); ++tries, ++it) {
      if (!table.resistance[static_cast<std::size_t>(it - table.lengths.begin())]) continue;
      Candidate trial = c;
      trial.length = *it;
      trial.cost = candidate_cost(base, spec, c.layout.piles.size(), trial.length, trial.cap_volume);
      ++outcome.checked_fully;
      const FullResult r = full_check(read, spec, trial);
      if (r.pass) return trial;
      if (first_reason.empty()) first_reason = r.reason;
      // Only what a longer pile can mend is tried again at the next length.
      const bool mended_by_length =
          r.reason == "check: pile compression capacity" || r.reason == "check: pile tension capacity" ||
          r.reason == "check: group capacity (efficiency or block)" ||
          r.reason == "check: group uplift" || r.reason == "check: settlement" ||
          (r.reason == "check: pile lateral capacity" && tries < 2);
      if (!mended_by_length) break;
    }
    ++rejected[first_reason.empty() ? kReasonLength : first_reason];
    return std::nullopt;
  };
  std::size_t next_candidate = 0;
  for (; next_candidate < feasible.size() && passed.size() < spec.keep; ++next_candidate) {
    // A candidate whose screened score already exceeds the keep-th passing one cannot enter.
    if (auto c = check_fully(feasible[next_candidate])) passed.push_back(*c);
  }
  // The Pareto front of the screen (cheapest for each lower utilization), checked in full.
  double lowest = kInfinity;
  std::size_t front_checked = 0;
  for (std::size_t i = next_candidate; i < feasible.size() && front_checked < 20; ++i)
    if (feasible[i].max_utilization < lowest - 1e-9) {
      lowest = feasible[i].max_utilization;
      ++front_checked;
      if (auto c = check_fully(feasible[i])) passed.push_back(*c);
    }
  std::sort(passed.begin(), passed.end(), order);
  for (const auto& c : passed) {
    if (outcome.best.size() < spec.keep) outcome.best.push_back(c);
  }
  // Front: by cost, keep those with lower utilization than every cheaper one.
  std::vector<Candidate> by_cost = passed;
  std::stable_sort(by_cost.begin(), by_cost.end(),
                   [](const Candidate& a, const Candidate& b) { return a.cost < b.cost; });
  double best_util = kInfinity;
  for (const auto& c : by_cost)
    if (c.max_utilization < best_util - 1e-12) {
      best_util = c.max_utilization;
      outcome.front.push_back(c);
    }
  for (auto& [k, v] : rejected)
    if (v > 0) outcome.rejected.emplace_back(k, v);
  std::stable_sort(outcome.rejected.begin(), outcome.rejected.end(),
                   [](const auto& a, const auto& b) { return a.second > b.second; });
  return outcome;
}

}  // namespace cairn
