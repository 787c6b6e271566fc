#include "cairn/site/revision_diff.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

namespace cairn {
namespace {

// Changes smaller than these are not changes: round-off of the solve (kN) and of the
// utilization, and a millimetre of position.
constexpr double kForceChange = 0.05;
constexpr double kUtilizationChange = 0.0005;
constexpr double kMove = 0.001;

std::string number(double v) { return fmt::format("{:.6g}", std::abs(v) < 1e-12 ? 0.0 : v); }

}  // namespace

std::map<std::string, std::string> input_keys(const Project& p) {
  std::map<std::string, std::string> k;
  const UnitSystem u = p.units;
  auto len = [&](double m) {
    return number(from_si(u, Quantity::length, m)) + " " + unit_label(u, Quantity::length);
  };
  auto force = [&](double kn) {
    return number(from_si(u, Quantity::force, kn)) + " " + unit_label(u, Quantity::force);
  };
  k["title"] = p.title;
  k["units"] = u == UnitSystem::SI ? "SI" : "US";
  k["cap.thickness"] = len(p.cap.thickness);
  k["cap.depth"] = len(p.cap.depth);
  if (p.cap.outline) {
    std::string corners;
    for (const auto& c : p.cap.outline->polygon)
      corners += (corners.empty() ? "" : " ") + fmt::format("({}, {})", number(from_si(u, Quantity::length, c[0])),
                                                           number(from_si(u, Quantity::length, c[1])));
    k["cap.outline"] = corners;
  }
  for (const PileType& t : p.pile_types) {
    const std::string b = "pile_types." + t.id + ".";
    k[b + "section"] = fmt::format("{} {}", to_string(t.section.shape), len(t.section.width));
    k[b + "length"] = len(t.length);
    k[b + "elastic_modulus"] = number(t.elastic_modulus) + " kPa";
    if (t.axial_stiffness) k[b + "axial_stiffness"] = number(*t.axial_stiffness) + " kN/m";
    if (t.lateral_stiffness) k[b + "lateral_stiffness"] = number(*t.lateral_stiffness) + " kN/m";
    k[b + "tension"] = t.tension ? "true" : "false";
    for (const CapacitySet& c : t.capacities) {
      const std::string cb = b + "capacity." + to_string(c.basis) + ".";
      if (c.compression) k[cb + "compression"] = force(*c.compression);
      if (c.tension) k[cb + "tension"] = force(*c.tension);
      if (c.lateral) k[cb + "lateral"] = force(*c.lateral);
    }
  }
  for (const Pile& pile : p.piles) {
    const std::string b = "piles." + pile.id + ".";
    k[b + "x"] = len(pile.x);
    k[b + "y"] = len(pile.y);
    k[b + "type"] = p.pile_types[pile.type].id;
    if (pile.batter)
      k[b + "batter"] = fmt::format("1:{} toward {}°", number(pile.batter->ratio), number(pile.batter->toward_deg));
  }
  for (const LoadCase& lc : p.load_cases) {
    const Wrench w = resultant_about_origin(lc);
    for (std::size_t i = 0; i < 6; ++i) {
      const bool moment = i >= 3;
      const double v = moment ? from_si(u, Quantity::moment, w[i]) : from_si(u, Quantity::force, w[i]);
      if (std::abs(v) < 1e-9) continue;
      k["load_cases." + lc.id + "." + kWrenchNames[i]] =
          number(v) + " " + unit_label(u, moment ? Quantity::moment : Quantity::force);
    }
  }
  for (const Combination& c : p.combinations) {
    std::string f;
    for (const auto& [i, factor] : c.factors)
      f += (f.empty() ? "" : " + ") + number(factor) + "·" + p.load_cases[i].id;
    k["combinations." + c.id] = std::string(to_string(c.limit_state)) + ": " + f;
  }
  k["group.min_spacing_factor"] = number(p.group.min_spacing_factor);
  k["group.min_edge_distance"] = len(p.group.min_edge_distance);
  return k;
}

RevisionDiff diff_revisions(const CheckRun& a, const CheckRun& b) {
  RevisionDiff d;
  const Project& pa = a.project;
  const Project& pb = b.project;
  auto find_pile = [](const Project& p, const std::string& id) -> std::optional<std::size_t> {
    for (std::size_t i = 0; i < p.piles.size(); ++i)
      if (p.piles[i].id == id) return i;
    return std::nullopt;
  };
  for (const Pile& p : pb.piles)
    if (!find_pile(pa, p.id)) d.added_piles.push_back(p.id);
  for (const Pile& p : pa.piles) {
    const auto j = find_pile(pb, p.id);
    if (!j) {
      d.removed_piles.push_back(p.id);
      continue;
    }
    const Pile& q = pb.piles[*j];
    if (std::hypot(q.x - p.x, q.y - p.y) > kMove) d.moved_piles.push_back({p.id, q.x - p.x, q.y - p.y});
  }
  const auto ka = input_keys(pa), kb = input_keys(pb);
  for (const auto& [key, value] : ka) {
    const auto it = kb.find(key);
    if (it == kb.end()) d.inputs.push_back({key, value, std::nullopt});
    else if (it->second != value) d.inputs.push_back({key, value, it->second});
  }
  for (const auto& [key, value] : kb)
    if (!ka.count(key)) d.inputs.push_back({key, std::nullopt, value});
  std::sort(d.inputs.begin(), d.inputs.end(), [](const KeyChange& x, const KeyChange& y) { return x.key < y.key; });
  for (std::size_t ca = 0; ca < pa.combinations.size(); ++ca) {
    const std::string& id = pa.combinations[ca].id;
    std::optional<std::size_t> cb;
    for (std::size_t j = 0; j < pb.combinations.size(); ++j)
      if (pb.combinations[j].id == id) cb = j;
    if (!cb) continue;
    const auto& ra = a.results.combinations[ca];
    const auto& rb = b.results.combinations[*cb];
    if (ra.pass && !rb.pass) d.newly_failing.push_back("combination " + id);
    if (ra.solution.overturns || rb.solution.overturns) continue;
    for (std::size_t i = 0; i < pa.piles.size(); ++i) {
      const auto j = find_pile(pb, pa.piles[i].id);
      if (!j) continue;
      const PileCheck& x = ra.piles[i];
      const PileCheck& y = rb.piles[*j];
      if (std::abs(y.axial - x.axial) < kForceChange &&
          std::abs(y.utilization - x.utilization) < kUtilizationChange)
        continue;
      d.forces.push_back({pa.piles[i].id, id, x.axial, y.axial, x.utilization, y.utilization});
    }
  }
  if (a.group.pass && !b.group.pass) d.newly_failing.push_back("group checks");
  d.old_pass = a.results.summary.pass;
  d.new_pass = b.results.summary.pass;
  if (d.old_pass && !d.new_pass && d.newly_failing.empty()) d.newly_failing.push_back("the cap");
  return d;
}

}  // namespace cairn
