#include "cairn/output/design_report.hpp"

#include <cmath>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include "cairn/checks/checks.hpp"
#include "cairn/core/plan.hpp"
#include "cairn/output/number_text.hpp"

namespace cairn {
namespace {

double in_units(const Project& p, double metres) { return from_si(p.units, Quantity::length, metres); }

std::string cap_text(const Project& p, const Candidate& c) {
  const auto& o = c.layout.outline;
  const auto [x0, x1, y0, y1] = bounding_box(o.polygon);
  return fmt::format("{} × {} × {}{}", fixed_text(in_units(p, x1 - x0), 2),
                     fixed_text(in_units(p, y1 - y0), 2), fixed_text(in_units(p, c.thickness), 2),
                     o.polygon.size() == 8 ? " (octagon)" : "");
}

std::string layout_text(const Candidate& c) {
  std::string t = c.layout.describe();
  if (c.layout.battered) t += ", outer battered";
  if (c.layout.shifted) t += ", shifted";
  return t;
}

Table candidates_table(const DesignReport& r, const std::vector<Candidate>& list,
                       const std::string& title) {
  const Project& p = *r.project;
  const char* len = unit_label(p.units, Quantity::length);
  Table t;
  t.title = title;
  t.headers = {"#", "cost", "piles", "type", fmt::format("length ({})", len), "layout",
               fmt::format("spacing ({})", len), fmt::format("cap w × l × h ({})", len),
               "max utilization", "governs"};
  t.numeric = {true, true, true, false, true, false, true, false, true, false};
  for (std::size_t i = 0; i < list.size(); ++i) {
    const Candidate& c = list[i];
    t.rows.push_back({std::to_string(i + 1), fixed_text(c.cost, 0),
                      std::to_string(c.layout.piles.size()), p.pile_types[c.layout.type].id,
                      fixed_text(in_units(p, c.length), 2), layout_text(c),
                      c.layout.piles.size() > 1 ? fixed_text(in_units(p, c.layout.spacing), 2) : "-",
                      cap_text(p, c), fixed_text(c.max_utilization, 3), c.governs});
  }
  return t;
}

Table rejected_table(const DesignReport& r) {
  Table t;
  t.title = "Layouts rejected, by reason";
  t.headers = {"layouts", "reason"};
  t.numeric = {true, false};
  for (const auto& [reason, count] : r.outcome->rejected) t.rows.push_back({std::to_string(count), reason});
  return t;
}

nlohmann::json candidate_json(const Project& p, const Candidate& c) {
  nlohmann::json piles = nlohmann::json::array();
  for (std::size_t i = 0; i < c.layout.piles.size(); ++i) {
    const auto& q = c.layout.piles[i];
    nlohmann::json j = {{"id", fmt::format("P{}", i + 1)}, {"x", in_units(p, q.x)}, {"y", in_units(p, q.y)}};
    if (q.batter) j["batter"] = {{"ratio", q.batter->ratio}, {"toward", q.batter->toward_deg}};
    piles.push_back(j);
  }
  return {{"cost", c.cost},
          {"score", c.score},
          {"piles", c.layout.piles.size()},
          {"pile_type", p.pile_types[c.layout.type].id},
          {"length", in_units(p, c.length)},
          {"family", to_string(c.layout.family)},
          {"layout", layout_text(c)},
          {"spacing", in_units(p, c.layout.spacing)},
          {"cap_thickness", in_units(p, c.thickness)},
          {"cap_area", from_si(p.units, Quantity::length, from_si(p.units, Quantity::length, c.layout.outline.area()))},
          {"max_utilization", c.max_utilization},
          {"governs", c.governs},
          {"tilt", c.tilt},
          {"pile_heads", piles}};
}

}  // namespace

std::string render_design(const DesignReport& r, Format format) {
  const Project& p = *r.project;
  const DesignOutcome& o = *r.outcome;
  const bool found = !o.best.empty();
  const std::string tried = fmt::format(
      "Tried {} × {}: {} passed the screen, {} checked in full.",
      count_text(o.layouts, "layout"), count_text(o.combinations, "combination"),
      o.passed_screen, count_text(o.checked_fully, "candidate"));
  std::string verdict;
  if (found) {
    verdict = fmt::format("Best layout: {} {} piles {} {} long, {}; cost {}{}.",
                          o.best.front().layout.piles.size(), p.pile_types[o.best.front().layout.type].id,
                          fixed_text(in_units(p, o.best.front().length), 2),
                          unit_label(p.units, Quantity::length), layout_text(o.best.front()),
                          fixed_text(o.best.front().cost, 0),
                          r.spec->cost.currency.empty() ? "" : " " + r.spec->cost.currency);
  } else {
    verdict = "No layout passes every check.";
    if (!o.rejected.empty())
      verdict += fmt::format(" The limit that rejects most layouts: {} ({} of them).",
                             o.rejected.front().first, o.rejected.front().second);
    if (o.closest_utilization && std::isfinite(*o.closest_utilization))
      verdict += fmt::format(" The closest, {}, reaches a utilization of {} at the longest pile "
                             "allowed ({} {}).",
                             o.closest_layout, fixed_text(*o.closest_utilization, 3),
                             general_text(in_units(p, r.spec->max_length)),
                             unit_label(p.units, Quantity::length));
  }
  std::vector<std::string> notes = {kCapNotSearched};
  if (o.truncated)
    notes.push_back(fmt::format("The search stopped at {} layouts per pile type; narrow the "
                                "spacing range, raise design.spacing.step or lower "
                                "design.max_piles to search them all.",
                                kMaxLayoutsPerType));
  if (o.passed_screen > o.checked_fully)
    notes.push_back("Layouts that passed the screen but cost more than those shown were not "
                    "checked in full.");
  if (r.written) notes.push_back("The chosen layout (#1) is written to " + *r.written +
                                 "; run `cairn check` and `cairn report` on it.");
  notes.push_back(kCaution);
  if (format == Format::json) {
    nlohmann::json j;
    j["title"] = p.title;
    j["units"] = to_string(p.units);
    j["command"] = r.options;
    j["found"] = found;
    j["basis"] = r.basis;
    j["layouts_tried"] = o.layouts;
    j["combinations"] = o.combinations;
    j["passed_screen"] = o.passed_screen;
    j["checked_fully"] = o.checked_fully;
    j["best"] = nlohmann::json::array();
    for (const auto& c : o.best) j["best"].push_back(candidate_json(p, c));
    j["pareto_front"] = nlohmann::json::array();
    for (const auto& c : o.front) j["pareto_front"].push_back({{"cost", c.cost}, {"max_utilization", c.max_utilization}, {"layout", layout_text(c)}, {"piles", c.layout.piles.size()}});
    j["rejected"] = nlohmann::json::array();
    for (const auto& [reason, count] : o.rejected) j["rejected"].push_back({{"reason", reason}, {"layouts", count}});
    j["verdict"] = verdict;
    if (o.closest_utilization && std::isfinite(*o.closest_utilization))
      j["closest"] = {{"layout", o.closest_layout}, {"max_utilization", *o.closest_utilization}};
    j["notes"] = notes;
    if (r.written) j["written"] = *r.written;
    return j.dump(2) + "\n";
  }
  const Table best = candidates_table(r, o.best, "Best layouts (each checked in full as `cairn check` does)");
  Table front = candidates_table(r, o.front, "Pareto front: cost against largest utilization");
  if (format == Format::csv) {
    std::string text = render_table(best, Format::csv);
    return text;
  }
  const bool md = format == Format::markdown;
  std::string out;
  out += md ? fmt::format("# cairn design — {}\n\n`{}`\n\n", p.title, r.options)
            : fmt::format("cairn design — {}\n{}\n\n", p.title, r.options);
  out += md ? "## Search basis\n\n" : "Search basis\n";
  for (const auto& line : r.basis) out += (md ? "- " : "  ") + line + "\n";
  out += "\n" + tried + "\n" + verdict + "\n\n";
  if (found) {
    out += render_table(best, format) + "\n";
    out += render_table(front, format) + "\n";
  }
  if (!o.rejected.empty()) out += render_table(rejected_table(r), format) + "\n";
  out += md ? "## Notes\n\n" : "Notes\n";
  for (const auto& n : notes) out += (md ? "- " : "  ") + n + "\n";
  return out;
}

}  // namespace cairn
