#include "report_parts.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <set>

#include "cairn/solver/nonlinear_combinations.hpp"

namespace cairn {

using namespace report_detail;

namespace {

// A nonlinear run's values of pile i in combination cc, or none (a linear run).
const NonlinearPileResult* nonlinear_pile(const CheckReport& r, const CombinationCheck& cc,
                                          std::size_t i) {
  if (!r.nonlinear || cc.combination >= r.nonlinear->combinations.size()) return nullptr;
  const auto& piles = r.nonlinear->combinations[cc.combination].piles;
  return i < piles.size() ? &piles[i] : nullptr;
}

// One combination of the JSON document ("combinations" holds them in order); below full
// detail only overturned combinations are listed, without pile rows.
// With_piles false: without the "piles" member (written on its own by the stream).
json combination_entry(const CheckReport& r, const CombinationCheck& cc, double reach,
                       double resolution, bool with_piles = true) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  const bool rows = r.detail == Detail::full && with_piles;
  const Combination& c = p.combinations[cc.combination];
  json factors = json::object();
  for (const auto& [index, factor] : c.factors) factors[p.load_cases[index].id] = factor;
  json piles = json::array();
  for (std::size_t i = 0; rows && i < p.piles.size(); ++i) {
    const PileCheck& pc = cc.piles[i];
    // An overturned cap has no pile forces: null, not zeros that would read as computed.
    const bool none = pc.state == PileState::overturned;
    json pile = {{"id", p.piles[i].id},
                 {"axial", none ? json(nullptr) : json(u.value(Quantity::force, pc.axial))},
                 {"lateral", none ? json(nullptr) : json(u.value(Quantity::force, pc.lateral))},
                 {"active", pc.active},
                 {"utilization", none ? json(nullptr) : number_or_null(pc.utilization)},
                 {"governing", to_string(pc.governing)},
                 {"state", to_string(pc.state)},
                 {"pass", pc.pass},
                 {"axial_stiffness", u.value(Quantity::stiffness, axial_stiffness(r, p.piles[i].type))},
                 {"lateral_stiffness",
                  u.value(Quantity::stiffness, lateral_stiffness(r, p.piles[i].type))}};
    // The action of the cap on the pile at its head (x, y, 0), global axes: a compression
    // pile has Fz < 0; Σ (r × F + M) is the load on the cap.
    json head = json::array();
    const Wrench& hf = cc.solution.piles.empty() ? Wrench{} : cc.solution.piles[i].head_forces;
    for (std::size_t k = 0; k < 6; ++k)
      head.push_back(none ? json(nullptr)
                          : json(u.value(k < 3 ? Quantity::force : Quantity::moment, hf[k])));
    pile["head_forces"] = head;
    const NonlinearPileResult* extra = nonlinear_pile(r, cc, i);
    if (extra) {
      pile["head_deflection"] =
          none ? json(nullptr) : json(u.value(Quantity::small_length, extra->head_deflection));
      pile["p_multiplier"] = extra->p_multiplier;
    }
    if (extra || (r.stiffness && (*r.stiffness)[p.piles[i].type].head != HeadFixity::pinned)) {
      pile["head_moment"] = none ? json(nullptr) : json(u.value(Quantity::moment, pc.head_moment));
      pile["max_moment"] = none ? json(nullptr) : json(u.value(Quantity::moment, pc.max_moment));
      pile["max_moment_depth"] =
          none ? json(nullptr) : json(u.value(Quantity::length, pc.max_moment_depth));
    }
    piles.push_back(pile);
  }
  const auto& m = cc.solution.movement;
  json dropped = json::array();
  for (auto i : cc.solution.dropped) dropped.push_back(p.piles[i].id);
  json entry = {
      {"id", c.id},
      {"limit_state", to_string(c.limit_state)},
      {"factors", factors},
      {"source", c.generator.empty() ? std::string("given") : "generated: " + c.generator},
      {"status", to_string(verdict(cc))},
      {"cap",
       {{"translation",
         {u.value(Quantity::small_length, m.translation[0]),
          u.value(Quantity::small_length, m.translation[1]),
          u.value(Quantity::small_length, m.translation[2])}},
        {"rotation",
         {rotation_value(m.rotation[0], reach, resolution),
          rotation_value(m.rotation[1], reach, resolution),
          rotation_value(m.rotation[2], reach, resolution)}}}},
      {"piles", rows ? piles : json(nullptr)},
      {"dropped", dropped},
      {"max_utilization", number_or_null(cc.max_utilization)},
      {"governing_pile", cc.governing_pile ? json(p.piles[*cc.governing_pile].id) : json(nullptr)}};
  if (cc.solution.overturns) entry["message"] = cc.solution.failure;
  if (!with_piles) entry.erase("piles");
  return entry;
}

bool listed(const CheckReport& r, const CombinationCheck& cc) {
  return r.detail == Detail::full || cc.solution.overturns;
}

}  // namespace

static json check_json_head(const CheckReport& r) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  json doc;
  doc["tool"] = {{"name", "cairn"}, {"version", CAIRN_VERSION}};
  doc["input"] = p.file;
  doc["title"] = p.title;
  doc["command"] = r.options;
  doc["units"] = {{"system", to_string(p.units)},
                  {"force", u.label(Quantity::force)},
                  {"length", u.label(Quantity::length)},
                  {"moment", u.label(Quantity::moment)},
                  {"displacement", u.label(Quantity::small_length)},
                  {"rotation", "rad"}};
  if (r.detail != Detail::full) doc["detail"] = to_string(r.detail);
  json envelope = json::array();
  for (std::size_t i = 0; i < p.piles.size(); ++i) {
    const PileEnvelope& e = r.results->envelope[i];
    auto extreme = [&](const Extreme& x, Quantity q) {
      return json{{"value", q == Quantity::number ? number_or_null(x.value)
                                                  : json(u.value(q, x.value))},
                  {"combination", x.combination ? json(p.combinations[*x.combination].id)
                                                : json(nullptr)}};
    };
    envelope.push_back({{"pile", p.piles[i].id},
                        {"max_compression", extreme(e.max_compression, Quantity::force)},
                        {"max_tension", extreme(e.max_tension, Quantity::force)},
                        {"max_lateral", extreme(e.max_lateral, Quantity::force)},
                        {"max_utilization", extreme(e.max_utilization, Quantity::number)},
                        {"governing", to_string(e.governing)},
                        {"pass", e.pass}});
  }
  if (r.detail == Detail::full || r.detail == Detail::envelope) doc["envelope"] = envelope;
  if (r.cap_stiffness) {
    const QuantityFormat& uu = u;
    doc["cap_stiffness"] = {
        {"about", {0.0, 0.0, 0.0}},
        {"units", {{"force_per_length", uu.label(Quantity::force) + "/" + uu.label(Quantity::length)},
                   {"force_per_rotation", uu.label(Quantity::force) + "/rad"},
                   {"moment_per_length", uu.label(Quantity::moment) + "/" + uu.label(Quantity::length)},
                   {"moment_per_rotation", uu.label(Quantity::moment) + "/rad"}}},
        {"matrix", cap_stiffness_values(r)}};
  }
  if (r.detail == Detail::governing) {
    json governing = json::array();
    for (std::size_t i = 0; i < p.piles.size(); ++i) {
      const PileGoverning& g = r.results->governing[i];
      for (std::size_t k = 0; k < g.size(); ++k) {
        if (!g[k].utilization.combination) continue;
        governing.push_back({{"pile", p.piles[i].id},
                             {"check", to_string(static_cast<Demand>(k + 1))},
                             {"demand", u.value(Quantity::force, g[k].demand)},
                             {"utilization", number_or_null(g[k].utilization.value)},
                             {"combination", p.combinations[*g[k].utilization.combination].id},
                             {"pass", g[k].utilization.value <= 1.0}});
      }
    }
    doc["governing"] = governing;
  }
  if (r.group) doc["group"] = group_json(r);
  const CheckSummary& s = r.results->summary;
  json overturned = json::array();
  for (auto c : s.overturned) overturned.push_back(p.combinations[c].id);
  doc["summary"] = {
      {"pass", s.pass},
      {"status", s.pass ? "pass" : "fail"},
      {"reasons", failure_reasons(r)},
      {"max_utilization", number_or_null(s.max_utilization)},
      {"failed_combinations", s.failed_combinations},
      {"overturned", overturned},
      {"governing",
       {{"pile", s.pile ? json(p.piles[*s.pile].id) : json(nullptr)},
        {"combination", s.combination ? json(p.combinations[*s.combination].id) : json(nullptr)},
        {"check", to_string(s.check)}}},
      {"line", summary_line(r)}};
  if (r.explain_pile) {
    json hand = json::array();
    for (const HandCheck& h : r.hand_checks) {
      json e = {{"combination", p.combinations[h.combination].id}, {"available", h.available}};
      if (!h.available) {
        e["why_not"] = h.why_not;
      } else {
        const double lf = to_si_factor(p.units, Quantity::length);
        e["n"] = h.section.count;
        e["centroid"] = {u.value(Quantity::length, h.section.centroid_x),
                         u.value(Quantity::length, h.section.centroid_y)};
        // + 0.0 turns a negative zero (Ixy of a symmetric group) into 0.
        e["Ixx"] = h.section.ixx / (lf * lf) + 0.0;
        e["Iyy"] = h.section.iyy / (lf * lf) + 0.0;
        e["Ixy"] = h.section.ixy / (lf * lf) + 0.0;
        e["V"] = u.value(Quantity::force, h.vertical);
        e["Mx"] = u.value(Quantity::moment, h.moment_x);
        e["My"] = u.value(Quantity::moment, h.moment_y);
        if (h.heads_moment_x != 0.0 || h.heads_moment_y != 0.0) {
          // Fixed heads: Mx, My above are the applied moments less the heads' moments.
          e["heads_Mx"] = u.value(Quantity::moment, h.heads_moment_x);
          e["heads_My"] = u.value(Quantity::moment, h.heads_moment_y);
        }
        e["eccentricity"] = {u.value(Quantity::length, h.eccentricity_x),
                             u.value(Quantity::length, h.eccentricity_y)};
        e["axial"] = u.value(Quantity::force, h.axial);
      }
      e["solver_axial"] = u.value(Quantity::force, h.solver_axial);
      hand.push_back(e);
    }
    doc["explain"] = {{"pile", p.piles[*r.explain_pile].id}, {"combinations", hand}};
  }
  if (r.nonlinear) doc["analysis"] = nonlinear_json(r);
  doc["assumptions"] = r.assumptions;  // the warnings among them, as notes
  nlohmann::json warnings = nlohmann::json::array();
  for (const auto& w : p.warnings)
    warnings.push_back({{"file", w.where.file}, {"line", w.where.line},
                        {"column", w.where.column}, {"message", w.message}});
  doc["warnings"] = warnings;
  doc["caution"] = kCaution;
  return doc;
}

}  // namespace cairn

namespace cairn {

json check_json(const CheckReport& r) {
  json doc = check_json_head(r);
  json combos = json::array();
  const double reach = cap_reach(*r.project), resolution = displacement_resolution(r.project->units);
  for (const CombinationCheck& cc : r.results->combinations)
    if (listed(r, cc)) combos.push_back(combination_entry(r, cc, reach, resolution));
  doc["combinations"] = std::move(combos);
  return doc;
}

// The document of check_json(r).dump(2) written piece by piece: the small members through
// nlohmann's own serializer (the same numbers, escaping and indentation), the combinations
// one at a time, so no tree of the whole output is held in memory.
void report_detail::write_check_json(const CheckReport& r, std::ostream& out) {
  using Serializer = nlohmann::detail::serializer<json>;
  Serializer serializer(nlohmann::detail::output_adapter<char>(out), ' ');
  auto dump = [&](const json& value, unsigned indent) {
    serializer.dump(value, true, false, 2, indent);
  };
  const json head = check_json_head(r);
  const double reach = cap_reach(*r.project), resolution = displacement_resolution(r.project->units);
  bool first = true;
  auto key = [&](const std::string& name) {
    out << (first ? "{\n  " : ",\n  ");
    first = false;
    dump(json(name), 2);
    out << ": ";
  };
  // The pile rows, the bulk of a full document, are written member by member (the keys in
  // the tree's sorted order) with their words and stiffnesses escaped once.
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  std::vector<std::string> ids, axial_k, lateral_k;
  for (const Pile& pile : p.piles) ids.push_back(json(pile.id).dump());
  for (std::size_t t = 0; t < p.pile_types.size(); ++t) {
    axial_k.push_back(json(u.value(Quantity::stiffness, axial_stiffness(r, t))).dump());
    lateral_k.push_back(json(u.value(Quantity::stiffness, lateral_stiffness(r, t))).dump());
  }
  auto word = [](const char* w) { return json(w).dump(); };
  const std::array<std::string, 5> demands = {word(to_string(Demand::none)),
                                              word(to_string(Demand::compression)),
                                              word(to_string(Demand::tension)),
                                              word(to_string(Demand::lateral)),
                                              word(to_string(Demand::structural))};
  const std::array<std::string, 3> states = {word(to_string(PileState::in_contact)),
                                             word(to_string(PileState::dropped_out)),
                                             word(to_string(PileState::overturned))};
  auto number = [&](double v) {
    if (std::isfinite(v)) dump(json(v), 0);
    else out << "null";
  };
  auto piles = [&](const CombinationCheck& cc) {
    if (p.piles.empty()) {
      out << "[]";
      return;
    }
    for (std::size_t i = 0; i < p.piles.size(); ++i) {
      const PileCheck& pc = cc.piles[i];
      const bool none = pc.state == PileState::overturned;
      const std::size_t type = p.piles[i].type;
      const char* in = "\n          ";
      out << (i ? ",\n        {" : "[\n        {") << in << "\"active\": " << (pc.active ? "true" : "false");
      out << "," << in << "\"axial\": ";
      if (none) out << "null";
      else number(u.value(Quantity::force, pc.axial));
      out << "," << in << "\"axial_stiffness\": " << axial_k[type];
      out << "," << in << "\"governing\": " << demands[static_cast<std::size_t>(pc.governing)];
      const NonlinearPileResult* extra = nonlinear_pile(r, cc, i);
      if (extra) {
        out << "," << in << "\"head_deflection\": ";
        if (none) out << "null";
        else number(u.value(Quantity::small_length, extra->head_deflection));
      }
      out << "," << in << "\"head_forces\": ";
      {
        json head = json::array();
        const Wrench& hf = cc.solution.piles.empty() ? Wrench{} : cc.solution.piles[i].head_forces;
        for (std::size_t k = 0; k < 6; ++k)
          head.push_back(none ? json(nullptr)
                              : json(u.value(k < 3 ? Quantity::force : Quantity::moment, hf[k])));
        dump(head, 10);
      }
      const bool bends = extra || (r.stiffness && (*r.stiffness)[type].head != HeadFixity::pinned);
      if (bends) {
        out << "," << in << "\"head_moment\": ";
        if (none) out << "null";
        else number(u.value(Quantity::moment, pc.head_moment));
      }
      out << "," << in << "\"id\": " << ids[i];
      out << "," << in << "\"lateral\": ";
      if (none) out << "null";
      else number(u.value(Quantity::force, pc.lateral));
      out << "," << in << "\"lateral_stiffness\": " << lateral_k[type];
      if (bends) {
        out << "," << in << "\"max_moment\": ";
        if (none) out << "null";
        else number(u.value(Quantity::moment, pc.max_moment));
        out << "," << in << "\"max_moment_depth\": ";
        if (none) out << "null";
        else number(u.value(Quantity::length, pc.max_moment_depth));
      }
      if (extra) {
        out << "," << in << "\"p_multiplier\": ";
        number(extra->p_multiplier);
      }
      out << "," << in << "\"pass\": " << (pc.pass ? "true" : "false");
      out << "," << in << "\"state\": " << states[static_cast<std::size_t>(pc.state)];
      out << "," << in << "\"utilization\": ";
      if (none) out << "null";
      else number(pc.utilization);
      out << "\n        }";
    }
    out << "\n      ]";
  };
  auto entry = [&](const CombinationCheck& cc) {
    if (r.detail != Detail::full) return dump(combination_entry(r, cc, reach, resolution), 4);
    const json head_of_entry = combination_entry(r, cc, reach, resolution, false);
    bool first_member = true, placed = false;
    auto member = [&](const std::string& name) {
      out << (first_member ? "{\n      " : ",\n      ");
      first_member = false;
      dump(json(name), 6);
      out << ": ";
    };
    for (const auto& [name, value] : head_of_entry.items()) {
      if (!placed && std::string("piles") < name) {
        member("piles");
        piles(cc);
        placed = true;
      }
      member(name);
      dump(value, 6);
    }
    if (!placed) {
      member("piles");
      piles(cc);
    }
    out << "\n    }";
  };
  auto combinations = [&] {
    key("combinations");
    bool none = true;
    for (const CombinationCheck& cc : r.results->combinations) {
      if (!listed(r, cc)) continue;
      out << (none ? "[\n    " : ",\n    ");
      none = false;
      entry(cc);
    }
    out << (none ? "[]" : "\n  ]");
  };
  // Members in the order of the tree's (sorted) keys, "combinations" in its place.
  bool written = false;
  for (const auto& [name, value] : head.items()) {
    if (!written && std::string("combinations") < name) {
      combinations();
      written = true;
    }
    key(name);
    dump(value, 2);
  }
  if (!written) combinations();
  out << "\n}\n";
}

}  // namespace cairn
