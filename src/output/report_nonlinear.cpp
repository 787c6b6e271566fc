// The parts of a check report that only a nonlinear run has (report.hpp): each pile's
// p-multiplier, head deflection and largest moment along it per combination, the
// combinations without equilibrium, and the pushover curve.
#include "report_parts.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <stdexcept>

#include "cairn/solver/nonlinear_combinations.hpp"

namespace cairn {

using namespace report_detail;

namespace {

std::string direction_text(const std::optional<double>& direction) {
  if (!direction) return "no horizontal load";
  double degrees = *direction * 180.0 / std::numbers::pi;
  if (degrees < 0.0) degrees += 360.0;
  return fixed_text(degrees, 1) + "° from +x";
}

}  // namespace

Table report_detail::nonlinear_piles_table(const CheckReport& r) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  Table t;
  t.title = "Nonlinear soil response: piles in each combination";
  t.headers = {"Combination", "Load direction", "Pile", "p-multiplier",
               "Head deflection (" + u.label(Shown::displacement) + ")",
               "Max moment (" + u.label(Shown::moment) + ")",
               "at depth (" + u.label(Shown::depth) + ")"};
  t.numeric = {false, false, false, true, true, true, true};
  const NonlinearRun& run = *r.nonlinear;
  for (const CombinationCheck& cc : r.results->combinations) {
    const NonlinearCombination& nc = run.combinations[cc.combination];
    const std::string& id = p.combinations[cc.combination].id;
    for (std::size_t i = 0; i < p.piles.size() && i < nc.piles.size(); ++i) {
      const NonlinearPileResult& pile = nc.piles[i];
      const bool none = cc.solution.overturns;
      t.rows.push_back({id, direction_text(nc.direction), p.piles[i].id,
                        QuantityFormat::fixed(pile.p_multiplier, 2),
                        none ? "-" : u.small(pile.head_deflection),
                        none ? "-" : u.moment(pile.max_moment),
                        none ? "-" : u.depth(pile.max_moment_depth)});
    }
  }
  return t;
}

std::vector<std::string> report_detail::nonlinear_csv_headers(const CheckReport& r,
                                                              bool with_moment) {
  if (!r.nonlinear) return {};
  const QuantityFormat u(r.project->units);
  std::vector<std::string> headers;
  if (with_moment) {
    headers.push_back("largest moment (" + u.label(Quantity::moment) + ")");
    headers.push_back("at depth (" + u.label(Quantity::length) + ")");
  }
  headers.push_back("head deflection (" + u.label(Shown::displacement) + ")");
  headers.push_back("p-multiplier");
  return headers;
}

std::vector<std::string> report_detail::nonlinear_csv_cells(const CheckReport& r,
                                                            const CombinationCheck& cc,
                                                            std::size_t pile, bool with_moment) {
  if (!r.nonlinear) return {};
  const QuantityFormat u(r.project->units);
  const bool none = cc.solution.overturns || pile >= cc.piles.size() ||
                    cc.piles[pile].state == PileState::overturned;
  const auto& piles = r.nonlinear->combinations.at(cc.combination).piles;
  const NonlinearPileResult extra = pile < piles.size() ? piles[pile] : NonlinearPileResult{};
  const std::string dash = "-";
  std::vector<std::string> cells;
  // The moment and its depth as the combination's table shows them (the pile check's, which
  // in a nonlinear run is the profile's largest moment).
  if (with_moment) {
    cells.push_back(none ? dash : u.moment(cc.piles[pile].max_moment));
    cells.push_back(none ? dash : u.length(cc.piles[pile].max_moment_depth));
  }
  cells.push_back(none ? dash : u.small(extra.head_deflection));
  // Three decimals: the AASHTO multipliers between 3B and 5B are interpolated.
  cells.push_back(QuantityFormat::fixed(extra.p_multiplier, 3));
  return cells;
}

Table report_detail::with_nonlinear_columns(const CheckReport& r, const CombinationCheck& cc,
                                            Table t) {
  if (!r.nonlinear) return t;
  const auto at = std::find(t.headers.begin(), t.headers.end(), "utilization");
  if (at == t.headers.end())
    throw std::logic_error("with_nonlinear_columns: no utilization column");
  const auto column = static_cast<std::size_t>(at - t.headers.begin());
  // Fixed heads: the table has the largest moment and its depth already.
  const bool with_moment = !any_fixed_head(r);
  const std::vector<std::string> headers = nonlinear_csv_headers(r, with_moment);
  t.headers.insert(t.headers.begin() + static_cast<std::ptrdiff_t>(column), headers.begin(),
                   headers.end());
  t.numeric.insert(t.numeric.begin() + static_cast<std::ptrdiff_t>(column), headers.size(), true);
  for (std::size_t i = 0; i < t.rows.size(); ++i) {
    const std::vector<std::string> cells = nonlinear_csv_cells(r, cc, i, with_moment);
    t.rows[i].insert(t.rows[i].begin() + static_cast<std::ptrdiff_t>(column), cells.begin(),
                     cells.end());
  }
  return t;
}

Table report_detail::pushover_table(const CheckReport& r) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  const PushoverCurve& curve = *r.nonlinear->pushover;
  Table t;
  t.title = fmt::format("Pushover of combination {}: its loads times λ", curve.combination);
  t.headers = {"λ", "Load (" + u.label(Shown::force) + ")",
               "Displacement (" + u.label(Shown::displacement) + ")"};
  t.numeric = {true, true, true};
  for (const PushoverPoint& point : curve.points)
    t.rows.push_back({QuantityFormat::fixed(point.load_factor, 3), u.force(point.load),
                      u.small(point.displacement)});
  return t;
}

std::string report_detail::nonlinear_block(const CheckReport& r, Format format) {
  if (!r.nonlinear) return {};
  const Project& p = *r.project;
  const NonlinearRun& run = *r.nonlinear;
  std::string out;
  auto line = [&](const std::string& text) {
    out += (format == Format::markdown ? text + "\n\n" : text + "\n");
  };
  if (format == Format::markdown) out += "## Nonlinear soil response\n\n";
  else out += "Nonlinear soil response\n";
  line(fmt::format("Soil response: nonlinear; p-multipliers: {}.", to_string(run.rule)));
  for (std::size_t t = 0; t < p.pile_types.size() && t < run.curves.size(); ++t)
    if (!run.curves[t].empty())
      line(fmt::format("Curves of pile type {}: {}.", p.pile_types[t].id, run.curves[t]));
  for (const CombinationCheck& cc : r.results->combinations)
    if (cc.solution.overturns)
      line(fmt::format("Combination {}: no equilibrium: {}.", p.combinations[cc.combination].id,
                       cc.solution.failure));
  if (format != Format::markdown) out += "\n";
  if (r.detail == Detail::full && r.results->pile_rows)
    out += render_table(nonlinear_piles_table(r), format);
  if (run.pushover) {
    out += render_table(pushover_table(r), format);
    line(fmt::format("The curve ends: {}. Largest load factor with equilibrium: λ = {}.",
                     run.pushover->end_reason,
                     QuantityFormat::fixed(run.pushover->capacity_factor, 3)));
    if (format != Format::markdown) out += "\n";
  }
  return out;
}

json report_detail::nonlinear_json(const CheckReport& r) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  const NonlinearRun& run = *r.nonlinear;
  json curves = json::object();
  for (std::size_t t = 0; t < p.pile_types.size() && t < run.curves.size(); ++t)
    if (!run.curves[t].empty()) curves[p.pile_types[t].id] = run.curves[t];
  json combos = json::array();
  for (std::size_t c = 0; c < run.combinations.size(); ++c) {
    const NonlinearCombination& nc = run.combinations[c];
    combos.push_back({{"id", p.combinations[c].id},
                      {"load_factor_reached", nc.reached},
                      {"load_steps", nc.steps},
                      {"iterations", nc.iterations},
                      {"load_direction", nc.direction ? json(*nc.direction * 180.0 / std::numbers::pi)
                                                      : json(nullptr)}});
  }
  json doc = {{"soil_response", "nonlinear"},
              {"p_multipliers", to_string(run.rule)},
              {"p_multiplier_axis", run.multiplier_axis * 180.0 / std::numbers::pi},
              {"lateral_loading", to_string(p.analysis.lateral_loading)},
              {"curves", curves},
              {"combinations", combos}};
  if (p.analysis.load_cycles) doc["load_cycles"] = *p.analysis.load_cycles;
  if (run.pushover) {
    const PushoverCurve& curve = *run.pushover;
    json points = json::array();
    for (const PushoverPoint& point : curve.points)
      points.push_back({{"load_factor", point.load_factor},
                        {"load", u.value(Quantity::force, point.load)},
                        {"displacement", u.value(Quantity::small_length, point.displacement)}});
    doc["pushover"] = {{"combination", curve.combination},
                       {"direction", {curve.direction[0], curve.direction[1], curve.direction[2]}},
                       {"points", points},
                       {"mechanism", curve.mechanism},
                       {"end_reason", curve.end_reason},
                       {"capacity_factor", curve.capacity_factor}};
  }
  return doc;
}

}  // namespace cairn
