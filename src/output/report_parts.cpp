#include "report_parts.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <set>

#include <fmt/format.h>

#include "cairn/output/number_text.hpp"

namespace cairn::report_detail {


// Display width of a UTF-8 string (counts code points; our symbols are all one column).
std::size_t width(const std::string& s) {
  std::size_t n = 0;
  for (unsigned char c : s)
    if ((c & 0xC0) != 0x80) ++n;
  return n;
}

std::string pad(const std::string& s, std::size_t w, bool right) {
  const std::size_t have = width(s);
  if (have >= w) return s;
  return right ? std::string(w - have, ' ') + s : s + std::string(w - have, ' ');
}

std::string csv_cell(const std::string& s) {
  if (s.find_first_of(",\"\n") == std::string::npos) return s;
  std::string quoted = "\"";
  for (char c : s) {
    if (c == '"') quoted += '"';
    quoted += c;
  }
  return quoted + "\"";
}


std::string utilization_text(double u) { return QuantityFormat::utilization(u); }

// A pile's result in a combination: "pass" or "fail", the words of the combination verdict.
const char* result_text(const PileCheck& p) { return p.pass ? "pass" : "fail"; }

// Ids of the overturned combinations, "S1, S3".
std::string overturned_ids(const CheckReport& r) {
  std::string ids;
  for (auto c : r.results->summary.overturned)
    ids += (ids.empty() ? "" : ", ") + r.project->combinations[c].id;
  return ids;
}

const std::string& combo_id(const CheckReport& r, std::optional<std::size_t> c) {
  static const std::string none = "-";
  return c ? r.project->combinations[*c].id : none;
}

json number_or_null(double v) { return std::isfinite(v) ? json(v) : json(nullptr); }

double axial_stiffness(const CheckReport& r, std::size_t type) {
  return r.stiffness ? (*r.stiffness)[type].axial
                     : r.project->pile_types[type].axial_stiffness_used();
}
double lateral_stiffness(const CheckReport& r, std::size_t type) {
  return r.stiffness ? (*r.stiffness)[type].lateral
                     : r.project->pile_types[type].lateral_stiffness_used();
}
bool any_fixed_head(const CheckReport& r) {
  if (!r.stiffness) return false;
  for (const auto& k : *r.stiffness)
    if (k.head_moment_per_shear > 0 || k.influence) return true;
  return false;
}

// Reach of the cap for the rotations' display resolution: the farthest pile head from the
// origin, at least 1 m (m).
double cap_reach(const Project& p) {
  double reach = 1.0;
  for (const Pile& pile : p.piles) reach = std::max(reach, std::hypot(pile.x, pile.y));
  return reach;
}
// The displacements are printed to 0.001 mm (SI) or 0.001 in (US): a rotation that moves no
// pile head by half of that is round-off and prints as 0.
double displacement_resolution(UnitSystem u) {
  return 1e-3 * to_si_factor(u, Quantity::small_length);
}

// The cap's tilt as "1 in N"; "0" below the rotations' display resolution.
std::string tilt_text(const Project& p, double tilt) {
  if (rotation_value(tilt, cap_reach(p), displacement_resolution(p.units)) == 0.0) return "0";
  return fmt::format("1 in {:.0f}", 1.0 / tilt);
}

std::string mm_or_dash(const QuantityFormat& u, std::optional<double> v) {
  return v ? u.small(*v) : std::string("-");
}

GroupParts make_group_parts(const CheckReport& r) {
  const GroupResults& g = *r.group;
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  GroupParts parts;
  auto& before = parts.layout;
  before.push_back(fmt::format("Block plan Bg × Lg = {} × {} {} (outer faces).", u.length(g.plan.width),
                               u.length(g.plan.length), u.label(Quantity::length)));
  const auto& grid = g.efficiencies.grid;
  before.push_back(grid.regular ? fmt::format("Layout: rectangular grid, {} × {}, spacing "
                                              "x {} / y {} {}.",
                                              count_text(grid.rows, "row"),
                                              count_text(grid.columns, "column"), u.length(grid.spacing_x),
                                              u.length(grid.spacing_y), u.label(Quantity::length))
                                : fmt::format("Layout: irregular ({}).", grid.reason));
  Table& eff = parts.efficiency;
  eff.title = "Group efficiency, every method";
  eff.headers = {"method", "η", "note"};
  eff.numeric = {false, true, false};
  for (const auto& e : g.efficiencies.all)
    eff.rows.push_back({std::string(to_string(e.method)) +
                            (e.method == g.applied.method ? " (applied)" : ""),
                        e.value ? QuantityFormat::factor(*e.value) : std::string("-"), e.note});
  const std::string f = u.label(Quantity::force);
  auto& checks = parts.checks;
  if (g.block)
    checks.push_back(fmt::format("Block failure (clay): Q_block = Bg·Lg·cu·Nc + 2(Bg + Lg)·Σcu·ΔL = {} + "
                                 "{} = {} {} (Skempton Nc = {}, cu at base {} {}).",
                                 u.force(g.block->base), u.force(g.block->perimeter),
                                 u.force(g.block->capacity), f, QuantityFormat::plain(Shown::bearing_factor, g.block->nc),
                                 u.pressure(g.block->base_strength),
                                 u.label(Quantity::pressure)));
  if (g.capacity_allowable)
    checks.push_back(fmt::format("Group capacity, allowable: {} {}", u.force(*g.capacity_allowable), f) +
                     (g.capacity_factored ? fmt::format("; factored: {} {}", u.force(*g.capacity_factored), f) : "") +
                     fmt::format(" (governed by {}).", g.governing));
  else if (g.capacity_factored)
    checks.push_back(fmt::format("Group capacity, factored: {} {} (governed by {}).",
                                 u.force(*g.capacity_factored), f, g.governing));
  checks.push_back(fmt::format("Spacing: smallest centre-to-centre {} {} (minimum {:g} pile widths{}); {}.",
                               u.length(g.spacing.smallest), u.label(Quantity::length),
                               p.group.min_spacing_factor,
                               p.group.min_spacing > 0 ? ", at least " + u.length(p.group.min_spacing) + " " + u.label(Quantity::length) : "",
                               g.spacing.violations.empty() ? "ok" : "FAIL"));
  for (const auto& v : g.spacing.violations)
    checks.push_back(
        v.depth ? fmt::format("FAIL: battered piles {} and {} come within {} {} of each other at "
                              "{} {} below the pile heads, less than {} {}.",
                              v.first, v.second, u.length(v.distance), u.label(Quantity::length),
                              u.length(*v.depth), u.label(Quantity::length),
                              u.length(v.required), u.label(Quantity::length))
                : fmt::format("FAIL: piles {} and {} are {} {} apart, less than {} {}.", v.first,
                              v.second, u.length(v.distance), u.label(Quantity::length),
                              u.length(v.required), u.label(Quantity::length)));
  if (g.edge) {
    checks.push_back(fmt::format("Edge distance (pile face to cap edge, minimum {} {}): {}.",
                                 u.length(g.edge->minimum), u.label(Quantity::length),
                                 g.edge->offenders.empty() ? "ok" : "FAIL"));
    for (const auto& e : g.edge->piles)
      if (!e.ok)
        checks.push_back(fmt::format("FAIL: pile {} is {} {} from the edge.", e.id,
                                     u.length(e.distance), u.label(Quantity::length)));
  }
  Table& t = parts.demand;
  t.title = "Group demand per combination";
  t.headers = {"combination", "Σ compression (" + f + ")", "group capacity (" + f + ")", "utilization",
               "Σ tension (" + f + ")", "uplift capacity (" + f + ")", "uplift utilization", "tilt"};
  t.numeric = {false, true, true, true, true, true, true, true};
  if (g.settlement_asked) {
    const std::string mm = u.label(Quantity::small_length);
    for (const auto* h : {"single pile", "group (Vesić)", "equivalent footing", "settlement"})
      t.headers.push_back(std::string(h) + " (" + mm + ")");
    for (int i = 0; i < 4; ++i) t.numeric.push_back(true);
  }
  t.headers.push_back("status");
  t.numeric.push_back(false);
  for (const auto& gc : g.per_combination) {
    std::vector<std::string> row = {
        p.combinations[gc.combination].id, u.force(gc.compression),
        gc.capacity ? u.force(*gc.capacity) : "-",
        gc.utilization ? QuantityFormat::utilization(*gc.utilization) : "-", u.force(gc.tension),
        gc.uplift_capacity ? u.force(*gc.uplift_capacity) : "-",
        gc.uplift_utilization ? QuantityFormat::utilization(*gc.uplift_utilization) : "-",
        tilt_text(p, gc.tilt)};
    if (g.settlement_asked) {
      row.push_back(mm_or_dash(u, gc.single_settlement));
      row.push_back(mm_or_dash(u, gc.group_settlement));
      row.push_back(mm_or_dash(u, gc.footing_settlement));
      row.push_back(mm_or_dash(u, gc.settlement));
    }
    // A cap that overturns has no pile forces to sum: its row must not read "ok".
    const bool overturns = std::any_of(
        r.results->combinations.begin(), r.results->combinations.end(), [&](const auto& cc) {
          return cc.combination == gc.combination && cc.solution.overturns;
        });
    row.push_back(to_string(overturns ? Verdict::overturned : gc.pass ? Verdict::pass : Verdict::fail));
    t.rows.push_back(row);
  }
  if (g.settlement_asked)
    parts.notes.push_back(fmt::format("Tolerable settlement: {} {}.", u.small(g.settlement_limit),
                                      u.label(Quantity::small_length)));
  for (const auto& n : g.notes) parts.notes.push_back("Note: " + n);
  return parts;
}

std::string group_block(const CheckReport& r, Format format) {
  const GroupParts parts = make_group_parts(r);
  const bool md = format == Format::markdown;
  const Format tf = md ? Format::markdown : Format::text;
  const std::string in = md ? "- " : "  ";
  std::string out = md ? "## Group checks\n\n" : "Group checks\n";
  for (const auto& line : parts.layout) out += in + line + "\n";
  out += "\n" + render_table(parts.efficiency, tf);
  for (const auto& line : parts.checks) out += in + line + "\n";
  out += "\n" + render_table(parts.demand, tf);
  for (const auto& line : parts.notes) out += in + line + "\n";
  return out + "\n";
}

json group_json(const CheckReport& r) {
  const GroupResults& g = *r.group;
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  auto opt = [&](std::optional<double> v, Quantity q) {
    return v ? json(u.value(q, *v)) : json(nullptr);
  };
  json all = json::object();
  for (const auto& e : g.efficiencies.all)
    all[to_string(e.method)] = {{"value", e.value ? json(*e.value) : json(nullptr)}, {"note", e.note}};
  json spacing = json::array();
  for (const auto& v : g.spacing.violations)
    spacing.push_back({{"piles", {v.first, v.second}},
                       {"distance", u.value(Quantity::length, v.distance)},
                       {"required", u.value(Quantity::length, v.required)},
                       {"depth", v.depth ? json(u.value(Quantity::length, *v.depth)) : json(nullptr)}});
  json per = json::array();
  for (const auto& gc : g.per_combination)
    per.push_back({{"combination", p.combinations[gc.combination].id},
                   {"compression", u.value(Quantity::force, gc.compression)},
                   {"capacity", opt(gc.capacity, Quantity::force)},
                   {"utilization", gc.utilization ? json(*gc.utilization) : json(nullptr)},
                   {"tension", u.value(Quantity::force, gc.tension)},
                   {"uplift_capacity", opt(gc.uplift_capacity, Quantity::force)},
                   {"uplift_utilization", gc.uplift_utilization ? json(*gc.uplift_utilization) : json(nullptr)},
                   {"tilt", rotation_value(gc.tilt, cap_reach(p), displacement_resolution(p.units))},
                   {"single", opt(gc.single_settlement, Quantity::small_length)},
                   {"group", opt(gc.group_settlement, Quantity::small_length)},
                   {"footing", opt(gc.footing_settlement, Quantity::small_length)},
                   {"settlement", opt(gc.settlement, Quantity::small_length)},
                   {"pass", gc.pass}});
  json edge = nullptr;
  if (g.edge) {
    json offenders = g.edge->offenders;
    edge = {{"minimum", u.value(Quantity::length, g.edge->minimum)}, {"offenders", offenders}};
  }
  return {{"efficiency",
           {{"method", to_string(g.applied.method)},
            {"value", g.applied.value.value_or(1.0)},
            {"all", all}}},
          {"block_capacity", g.block ? json(u.value(Quantity::force, g.block->capacity)) : json(nullptr)},
          {"capacity_allowable", opt(g.capacity_allowable, Quantity::force)},
          {"capacity_factored", opt(g.capacity_factored, Quantity::force)},
          {"governing", g.governing},
          {"uplift", per},
          {"spacing", spacing},
          {"edge_distance", edge},
          {"settlement",
           {{"asked", g.settlement_asked},
            {"method", "Vesić (1977) single pile with s_g = s·√(Bg/D); equivalent footing at 2/3 "
                       "of the length in the bearing stratum, 2V:1H"},
            {"limit", u.value(Quantity::small_length, g.settlement_limit)},
            {"per_combination", per}}},
          {"notes", g.notes},
          {"pass", g.pass}};
}

Table pile_types_table(const CheckReport& r) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  Table t;
  t.title = "Pile types";
  t.headers = {"type", "section", "length (" + u.label(Quantity::length) + ")",
               "k axial (" + u.label(Quantity::stiffness) + ")",
               "k lateral (" + u.label(Quantity::stiffness) + ")", "tension",
               "allowable C/T/L (" + u.label(Quantity::force) + ")",
               "factored C/T/L (" + u.label(Quantity::force) + ")"};
  t.numeric = {false, false, true, true, true, false, false, false};
  for (std::size_t i = 0; i < p.pile_types.size(); ++i) {
    const PileType& type = p.pile_types[i];
    auto set = [&](const Resistance& res) {
      auto one = [&](std::optional<double> v) { return v ? u.force(*v) : std::string("-"); };
      return one(res.compression) + " / " + one(res.tension) + " / " + one(res.lateral);
    };
    t.rows.push_back({type.id,
                      fmt::format("{} {} {}", to_string(type.section.shape), u.length(type.section.width),
                                  u.label(Quantity::length)),
                      u.length(type.length), u.stiffness(axial_stiffness(r, i)),
                      u.stiffness(lateral_stiffness(r, i)), type.tension ? "yes" : "no",
                      set((*r.resistances)[i].allowable), set((*r.resistances)[i].factored)});
  }
  return t;
}

std::array<std::array<double, 6>, 6> cap_stiffness_values(const CheckReport& r) {
  const QuantityFormat u(r.project->units);
  std::array<std::array<double, 6>, 6> out{};
  if (!r.cap_stiffness) return out;
  const auto& k = *r.cap_stiffness;
  // Rows in the project's force (Fx…Fz) or moment (Mx…Mz) unit, columns per the project's
  // length unit (ux…uz) or per radian (rx…rz): kN/m, kN/rad, kN·m/m, kN·m/rad in SI; kip/ft,
  // kip/rad, kip·ft/ft, kip·ft/rad in US units. Couplings below 1e-12 of the geometric mean
  // of their diagonal terms (in consistent units) are round-off: 0.
  const double per_length = u.value(Quantity::length, 1.0);  // project lengths in 1 m
  for (std::size_t i = 0; i < 6; ++i)
    for (std::size_t j = 0; j < 6; ++j) {
      const double scale = std::sqrt(std::abs(k[i][i] * k[j][j]));
      const double v = std::abs(k[i][j]) <= 1e-12 * scale ? 0.0 : k[i][j];
      const double row = u.value(i < 3 ? Quantity::force : Quantity::moment, v);
      out[i][j] = j < 3 ? row / per_length : row;
    }
  return out;
}

Table cap_stiffness_table(const CheckReport& r) {
  const QuantityFormat u(r.project->units);
  Table t;
  t.title = "Cap stiffness about the origin, every pile active (for the structural model)";
  const std::string f = u.label(Quantity::force), l = u.label(Quantity::length),
                    m = u.label(Quantity::moment);
  t.headers = {"", "ux (" + l + ")", "uy (" + l + ")", "uz (" + l + ")", "rx (rad)", "ry (rad)",
               "rz (rad)"};
  t.numeric = {false, true, true, true, true, true, true};
  const auto k = cap_stiffness_values(r);
  for (std::size_t i = 0; i < 6; ++i) {
    std::vector<std::string> row = {std::string(kWrenchNames[i]) + " (" + (i < 3 ? f : m) + ")"};
    for (std::size_t j = 0; j < 6; ++j) row.push_back(fmt::format("{:.6g}", k[i][j]));
    t.rows.push_back(row);
  }
  return t;
}

Table piles_table(const CheckReport& r) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  const std::string length = " (" + u.label(Quantity::length) + ")";
  Table t{.title = "Piles",
          .headers = {"pile", "type", "x" + length, "y" + length, "batter"},
          .rows = {},
          .numeric = {false, false, true, true, false}};
  for (const Pile& pile : p.piles) {
    t.rows.push_back({pile.id, p.pile_types[pile.type].id, u.length(pile.x), u.length(pile.y),
                      pile.batter ? fmt::format("1:{:g} toward {:g}°", pile.batter->ratio,
                                                pile.batter->toward_deg)
                                  : std::string("vertical")});
  }
  return t;
}

Table combinations_table(const CheckReport& r) {
  Table t;
  t.title = "Combinations";
  t.headers = {"combination", "limit state", "factors", "source"};
  t.numeric = {false, false, false, false};
  for (const Combination& c : r.project->combinations)
    t.rows.push_back({c.id, to_string(c.limit_state), combination_formula(*r.project, c),
                      c.generator.empty() ? "given" : "generated: " + c.generator});
  return t;
}

Table combination_table(const CheckReport& r, const CombinationCheck& cc) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  Table t;
  const Combination& combo = p.combinations[cc.combination];
  t.title = fmt::format("Combination {} ({}): {} — {}", combo.id, to_string(combo.limit_state),
                        combination_formula(p, combo), to_string(verdict(cc)));
  t.headers = {"pile", "x (" + u.label(Quantity::length) + ")",
               "y (" + u.label(Quantity::length) + ")", "axial (" + u.label(Quantity::force) + ")",
               "lateral (" + u.label(Quantity::force) + ")", "utilization", "check", "state",
               "result"};
  t.numeric = {false, true, true, true, true, true, false, false, false};
  const bool moments = any_fixed_head(r);
  if (moments) {
    t.headers.insert(t.headers.begin() + 5, "head moment (" + u.label(Quantity::moment) + ")");
    t.headers.insert(t.headers.begin() + 6, "largest moment (" + u.label(Quantity::moment) + ")");
    t.headers.insert(t.headers.begin() + 7, "at depth (" + u.label(Quantity::length) + ")");
    t.numeric.insert(t.numeric.begin() + 5, 3, true);
  }
  for (std::size_t i = 0; i < p.piles.size(); ++i) {
    const PileCheck& pc = cc.piles[i];
    // An overturned cap has no pile forces: dashes, not zeros that would read as computed.
    const bool none = pc.state == PileState::overturned;
    const std::string dash = "-";
    std::vector<std::string> row = {p.piles[i].id, u.length(p.piles[i].x), u.length(p.piles[i].y),
                                    none ? dash : u.force(pc.axial), none ? dash : u.force(pc.lateral),
                                    none ? dash : utilization_text(pc.utilization),
                                    to_string(pc.governing), to_string(pc.state), result_text(pc)};
    if (moments) {
      row.insert(row.begin() + 5, none ? dash : u.moment(pc.head_moment));
      row.insert(row.begin() + 6, none ? dash : u.moment(pc.max_moment));
      row.insert(row.begin() + 7, none ? dash : u.length(pc.max_moment_depth));
    }
    t.rows.push_back(row);
  }
  return t;
}

std::string combination_note(const CheckReport& r, const CombinationCheck& cc) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  const auto& m = cc.solution.movement;
  std::string text;
  if (cc.solution.overturns) {
    const Wrench f = combination_load(p, p.combinations[cc.combination]);
    return fmt::format("FAIL (overturned): {}; no pile forces exist and every pile fails "
                       "(resultant about the origin: Fz = {} {}, Mx = {} {}, My = {} {})",
                       cc.solution.failure, u.force(f[2]), u.label(Quantity::force),
                       u.moment(f[3]), u.label(Quantity::moment), u.moment(f[4]),
                       u.label(Quantity::moment));
  }
  const double reach = cap_reach(p), resolution = displacement_resolution(p.units);
  text = fmt::format("Cap movement: translation ({}, {}, {}) {}, rotation ({}, {}, {}) rad.",
                     u.small(m.translation[0]), u.small(m.translation[1]),
                     u.small(m.translation[2]), u.label(Quantity::small_length),
                     rotation_text(m.rotation[0], reach, resolution),
                     rotation_text(m.rotation[1], reach, resolution),
                     rotation_text(m.rotation[2], reach, resolution));
  if (!cc.solution.dropped.empty()) {
    std::string ids;
    for (auto i : cc.solution.dropped) ids += (ids.empty() ? "" : ", ") + p.piles[i].id;
    text += fmt::format(" Dropped out (would be in tension, take none): {} — load redistributed "
                        "in {}.",
                        ids, count_text(static_cast<std::size_t>(std::max(cc.solution.iterations, 0)), "solve"));
  }
  text += cc.pass ? fmt::format(" Pass: max utilization {} (pile {}, {}).",
                                utilization_text(cc.max_utilization),
                                cc.governing_pile ? p.piles[*cc.governing_pile].id : "-",
                                to_string(cc.governing))
                  : fmt::format(" FAIL: max utilization {} (pile {}, {}).",
                                utilization_text(cc.max_utilization),
                                cc.governing_pile ? p.piles[*cc.governing_pile].id : "-",
                                to_string(cc.governing));
  return text;
}

Table envelope_table(const CheckReport& r) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  const std::string f = u.label(Quantity::force);
  Table t;
  t.title = "Envelope per pile";
  // Overturned combinations have no pile forces to take the largest of.
  if (!r.results->summary.overturned.empty())
    t.title += " (overturned, without pile forces, left out: " + overturned_ids(r) + ")";
  t.headers = {"pile",          "max compression (" + f + ")", "combination",
               "max tension (" + f + ")", "combination", "max lateral (" + f + ")",
               "combination",   "max utilization",          "combination", "check", "result"};
  t.numeric = {false, true, false, true, false, true, false, true, false, false, false};
  for (std::size_t i = 0; i < p.piles.size(); ++i) {
    const PileEnvelope& e = r.results->envelope[i];
    t.rows.push_back({p.piles[i].id, u.force(e.max_compression.value),
                      combo_id(r, e.max_compression.combination), u.force(e.max_tension.value),
                      combo_id(r, e.max_tension.combination), u.force(e.max_lateral.value),
                      combo_id(r, e.max_lateral.combination),
                      utilization_text(e.max_utilization.value),
                      combo_id(r, e.max_utilization.combination), to_string(e.governing),
                      e.pass ? "pass" : "fail"});
  }
  return t;
}

// Why the check fails, in plain words, one item per cause; empty when it passes.
std::vector<std::string> failure_reasons(const CheckReport& r) {
  const Project& p = *r.project;
  const CheckSummary& s = r.results->summary;
  std::vector<std::string> reasons;
  if (!s.overturned.empty())
    reasons.push_back((r.nonlinear ? "no equilibrium (a mechanism) in " : "the cap overturns in ") +
                      overturned_ids(r));
  if (s.combination && s.pile && s.max_utilization > 1.0) {
    const std::string pile = p.piles[*s.pile].id, combo = p.combinations[*s.combination].id;
    reasons.push_back(std::isinf(s.max_utilization)
                          ? fmt::format("pile {} has no {} capacity (combination {})", pile,
                                        to_string(s.check), combo)
                          : fmt::format("pile {} over capacity: utilization {} > 1 in {} ({})",
                                        pile, utilization_text(s.max_utilization), combo,
                                        to_string(s.check)));
  }
  if (r.group && !r.group->pass) reasons.push_back("group checks fail");
  if (reasons.empty() && !s.pass) reasons.push_back("a check fails");
  return reasons;
}

std::string joined(const std::vector<std::string>& items, const char* separator) {
  std::string text;
  for (const auto& item : items) text += (text.empty() ? "" : separator) + item;
  return text;
}

Table summary_table(const CheckReport& r) {
  const Project& p = *r.project;
  const CheckSummary& s = r.results->summary;
  Table t;
  t.title = "Summary";
  t.headers = {"status", "reason", "max utilization", "pile", "combination", "check",
               "failed combinations", "combinations", "piles"};
  t.numeric = {false, false, true, false, false, false, true, true, true};
  const auto reasons = failure_reasons(r);
  t.rows.push_back({s.pass ? "pass" : "fail", reasons.empty() ? "-" : joined(reasons, "; "),
                    s.combination ? utilization_text(s.max_utilization) : "-",
                    s.pile ? p.piles[*s.pile].id : "-", combo_id(r, s.combination),
                    to_string(s.check), std::to_string(s.failed_combinations),
                    std::to_string(p.combinations.size()), std::to_string(p.piles.size())});
  return t;
}

std::string header(const CheckReport& r, Format format) {
  const Project& p = *r.project;
  const std::string units =
      p.units == UnitSystem::SI ? "SI (kN, m, kPa, kN·m)" : "US (kip, ft, ksf, kip·ft)";
  if (format == Format::markdown)
    return fmt::format("# Pile check: {}\n\n- tool: cairn {}\n- input: `{}`\n- units: {}\n- "
                       "command: `{}`\n\n",
                       p.title, CAIRN_VERSION, p.file, units, r.options);
  return fmt::format("cairn {} — pile check: {}\ninput: {}\nunits: {}\ncommand: {}\n\n",
                     CAIRN_VERSION, p.title, p.file, units, r.options);
}

std::string assumptions_block(const CheckReport& r, Format format) {
  std::string text = format == Format::markdown ? "## Assumptions\n\n" : "Assumptions\n";
  for (const auto& a : r.assumptions)
    text += (format == Format::markdown ? "- " : "  - ") + a + "\n";
  return text + "\n";
}

std::string explain_block(const CheckReport& r, Format format) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  const std::size_t pile = *r.explain_pile;
  const std::string f = u.label(Quantity::force), m = u.label(Quantity::moment),
                    l = u.label(Quantity::length), a = u.area_label();
  const bool md = format == Format::markdown;
  std::string text = md ? fmt::format("## Hand check of pile {}\n\n", p.piles[pile].id)
                        : fmt::format("Hand check of pile {}\n", p.piles[pile].id);
  text += fmt::format(
      "{}P = V/n + (My·Ixx + Mx·Ixy)/(Ixx·Iyy − Ixy²)·x' − (Mx·Iyy + My·Ixy)/(Ixx·Iyy − Ixy²)·y'\n"
      "{}with Ixx = Σy'², Iyy = Σx'², Ixy = Σx'y' over the active piles, x' = x − x̄, y' = y − ȳ,\n"
      "{}V = −ΣFz and Mx, My the applied moments about the centroid at the pile heads.\n",
      md ? "    " : "  ", md ? "    " : "  ", md ? "    " : "  ");
  for (const HandCheck& h : r.hand_checks) {
    const Combination& c = p.combinations[h.combination];
    text += md ? fmt::format("\n### {} ({})\n\n", c.id, to_string(c.limit_state))
               : fmt::format("\n  {} ({}):\n", c.id, to_string(c.limit_state));
    const std::string in = md ? "- " : "    ";
    if (!h.available) {
      text += fmt::format("{}not available: {}; the rigid-cap solver gives P = {} {}\n", in,
                          h.why_not, u.force(h.solver_axial), f);
      continue;
    }
    const GroupSection& s = h.section;
    text += fmt::format("{}n = {}, centroid (x̄, ȳ) = ({}, {}) {}\n", in, s.count,
                        u.length(s.centroid_x), u.length(s.centroid_y), l);
    text += fmt::format("{}Ixx = {} {}, Iyy = {} {}, Ixy = {} {}\n", in, u.area(s.ixx), a,
                        u.area(s.iyy), a, u.area(s.ixy), a);
    if (h.heads_moment_x != 0.0 || h.heads_moment_y != 0.0)
      text += fmt::format("{}heads held by the cap (fixed or partially fixed): the cap puts Mx = {} {}, My = {} {} on the pile heads; Mx and My "
                          "below are the applied moments less these\n",
                          in, u.moment(h.heads_moment_x), m, u.moment(h.heads_moment_y), m);
    text += fmt::format("{}V = {} {}, Mx = {} {}, My = {} {}; eccentricity ex = {} {}, ey = {} {}\n",
                        in, u.force(h.vertical), f, u.moment(h.moment_x), m, u.moment(h.moment_y),
                        m, u.length(h.eccentricity_x), l, u.length(h.eccentricity_y), l);
    const double det = s.ixx * s.iyy - s.ixy * s.ixy;
    const double lf = to_si_factor(p.units, Quantity::length);
    if (h.form != HandCheck::Form::general) {
      // Piles on one line: the one-way form.
      const bool along_x = h.form == HandCheck::Form::line_x;
      text += fmt::format(
          "{}piles on one line along {}: P = V/n {} {}·{}'/{}\n{}x' = {} {}, y' = {} {}\n"
          "{}P = {}/{} {} {}·{}/{} = {} + {} = {} {}   (solver: {} {})\n",
          in, along_x ? "x" : "y", along_x ? "+" : "−", along_x ? "My" : "Mx", along_x ? "x" : "y",
          along_x ? "Iyy" : "Ixx", in, u.length(h.x_local), l, u.length(h.y_local), l, in,
          u.force(h.vertical), s.count, along_x ? "+" : "−",
          u.moment(along_x ? h.moment_y : h.moment_x),
          u.length(along_x ? h.x_local : h.y_local), u.area(along_x ? s.iyy : s.ixx),
          u.force(h.direct), u.force(along_x ? h.from_moment_y : h.from_moment_x),
          u.force(h.axial), f, u.force(h.solver_axial), f);
      continue;
    }
    text += fmt::format(
        "{}x' = {} {}, y' = {} {}\n{}P = {}/{} + ({}·{} + {}·{})/{}·{} − ({}·{} + {}·{})/{}·{}\n"
        "{}  = {} + {} + {} = {} {}   (solver: {} {})\n",
        in, u.length(h.x_local), l, u.length(h.y_local), l, in, u.force(h.vertical), s.count,
        u.moment(h.moment_y), u.area(s.ixx), u.moment(h.moment_x), u.area(s.ixy),
        fixed_text(det / std::pow(lf, 4), 4), u.length(h.x_local), u.moment(h.moment_x),
        u.area(s.iyy), u.moment(h.moment_y), u.area(s.ixy),
        fixed_text(det / std::pow(lf, 4), 4), u.length(h.y_local), in, u.force(h.direct),
        u.force(h.from_moment_y), u.force(h.from_moment_x), u.force(h.axial), f,
        u.force(h.solver_axial), f);
  }
  return text + "\n";
}

}  // namespace cairn::report_detail
