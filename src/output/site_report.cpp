#include "cairn/output/site_report.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include "cairn/checks/checks.hpp"
#include "cairn/output/number_text.hpp"
#include "cairn/output/plan_svg.hpp"

namespace cairn {
namespace {

std::string util_text(double u) { return std::isinf(u) ? "unstable" : fixed_text(u, 3); }
nlohmann::json util_json(double u) {
  return std::isinf(u) ? nlohmann::json(nullptr) : nlohmann::json(u);
}

std::string head(const SiteStudyHeader& h, const std::string& what, Format format) {
  const Project& p = *h.project;
  if (format == Format::markdown)
    return fmt::format("# cairn {} — {}: {}\n\n- input: `{}`\n- command: `{}`\n\n", CAIRN_VERSION,
                       what, p.title, p.file, h.options);
  return fmt::format("cairn {} — {}: {}\ninput: {}\ncommand: {}\n\n", CAIRN_VERSION, what,
                     p.title, p.file, h.options);
}

std::string foot() { return std::string("\n") + kCaution + "\n"; }

nlohmann::json json_head(const SiteStudyHeader& h) {
  nlohmann::json j;
  j["tool"] = {{"name", "cairn"}, {"version", CAIRN_VERSION}};
  j["title"] = h.project->title;
  j["input"] = h.project->file;
  j["command"] = h.options;
  j["caution"] = kCaution;
  return j;
}

std::string combo_id(const Project& p, std::size_t c) {
  return c < p.combinations.size() ? p.combinations[c].id : "-";
}

// A plan: the outline, every pile as a square coloured by `value` (NaN: grey), crossed where
// `crossed`, extra points as blue rings.
std::string value_plan(const Project& p, const std::vector<double>& value,
                       const std::vector<char>& crossed,
                       const std::vector<std::array<double, 2>>& rings, const std::string& legend) {
  const PlanFrame f = plan_frame(p, 560.0);
  auto sx = [&](double x) { return f.origin_x + f.scale * x; };
  auto sy = [&](double y) { return f.origin_y - f.scale * y; };
  double top = kUtilizationScaleMin;
  for (double v : value)
    if (std::isfinite(v)) top = std::max(top, v);
  double lowest = -std::numeric_limits<double>::infinity();
  if (p.cap.outline)
    for (const auto& c : p.cap.outline->polygon) lowest = std::max(lowest, sy(c[1]));
  for (const Pile& pile : p.piles) lowest = std::max(lowest, sy(pile.y));
  const double legend_y = std::min(f.height, lowest + 30.0);
  std::string svg = fmt::format(
      "<svg xmlns=\"http://www.w3.org/2000/svg\" viewBox=\"0 0 {0:.1f} {1:.1f}\" width=\"{0:.0f}\" "
      "font-family=\"sans-serif\" font-size=\"11\">\n<rect width=\"100%\" height=\"100%\" "
      "fill=\"#fff\"/>\n",
      f.width, legend_y + 75.0);
  if (p.cap.outline) {
    std::string pts;
    for (const auto& c : p.cap.outline->polygon) pts += fmt::format("{:.1f},{:.1f} ", sx(c[0]), sy(c[1]));
    svg += "<polygon points=\"" + pts + "\" fill=\"#f4f4f4\" stroke=\"#555\"/>\n";
  }
  for (std::size_t i = 0; i < p.piles.size(); ++i) {
    const Pile& pile = p.piles[i];
    const double half = std::max(4.0, f.scale * p.pile_types[pile.type].section.width / 2);
    const double v = i < value.size() ? value[i] : std::nan("");
    svg += fmt::format("<rect x=\"{:.1f}\" y=\"{:.1f}\" width=\"{:.1f}\" height=\"{:.1f}\" "
                       "fill=\"{}\" stroke=\"#000\"><title>{} {}</title></rect>\n",
                       sx(pile.x) - half, sy(pile.y) - half, 2 * half, 2 * half,
                       utilization_colour(v, top), xml_escape(pile.id),
                       std::isnan(v) ? "" : util_text(v));
    if (i < crossed.size() && crossed[i])
      svg += fmt::format("<path d=\"M{0:.1f},{1:.1f} L{2:.1f},{3:.1f} M{0:.1f},{3:.1f} "
                         "L{2:.1f},{1:.1f}\" stroke=\"#b00020\" stroke-width=\"2.5\"/>\n",
                         sx(pile.x) - half - 3, sy(pile.y) - half - 3, sx(pile.x) + half + 3,
                         sy(pile.y) + half + 3);
    svg += fmt::format("<text x=\"{:.1f}\" y=\"{:.1f}\">{}{}</text>\n", sx(pile.x) + half + 2,
                       sy(pile.y) - half - 2, xml_escape(pile.id),
                       std::isnan(v) ? "" : " " + util_text(v));
  }
  for (const auto& r : rings)
    svg += fmt::format("<circle cx=\"{:.1f}\" cy=\"{:.1f}\" r=\"8\" fill=\"none\" "
                       "stroke=\"#0050b0\" stroke-width=\"2.5\"/>\n",
                       sx(r[0]), sy(r[1]));
  // The legend in lines of at most 80 characters.
  std::vector<std::string> lines(1);
  std::size_t start = 0;
  while (start < legend.size()) {
    std::size_t end = legend.find(' ', start);
    if (end == std::string::npos) end = legend.size();
    const std::string word = legend.substr(start, end - start);
    if (!lines.back().empty() && lines.back().size() + word.size() + 1 > 80) lines.emplace_back();
    lines.back() += (lines.back().empty() ? "" : " ") + word;
    start = end + 1;
  }
  for (std::size_t k = 0; k < lines.size(); ++k)
    svg += fmt::format("<text x=\"8\" y=\"{:.1f}\">{}</text>\n", legend_y + 16.0 + 15.0 * k,
                       xml_escape(lines[k]));
  return svg + "</svg>\n";
}

}  // namespace

std::string render_pile_loss(const SiteStudyHeader& h, const LossStudy& s, Format format) {
  const Project& p = *h.project;
  auto ids = [&](const LossCase& c) {
    std::string t;
    for (auto i : c.lost) t += (t.empty() ? "" : " + ") + p.piles[i].id;
    return t;
  };
  if (format == Format::json) {
    nlohmann::json j = json_head(h);
    j["intact"] = {{"max_utilization", util_json(s.intact.max_utilization)},
                   {"combination", combo_id(p, s.intact.combination)}};
    auto list = [&](const std::vector<LossCase>& cases) {
      nlohmann::json a = nlohmann::json::array();
      for (const auto& c : cases) {
        nlohmann::json lost = nlohmann::json::array();
        for (auto i : c.lost) lost.push_back(p.piles[i].id);
        a.push_back({{"lost", lost},
                     {"max_utilization", util_json(c.outcome.max_utilization)},
                     {"unstable", c.outcome.unstable},
                     {"combination", combo_id(p, c.outcome.combination)},
                     {"governing_pile", c.outcome.unstable ? nlohmann::json(nullptr)
                                                           : nlohmann::json(p.piles[c.governing_pile].id)},
                     {"pass", c.outcome.max_utilization <= 1.0}});
      }
      return a;
    };
    j["single"] = list(s.single);
    if (!s.pairs.empty()) j["pairs"] = list(s.pairs);
    if (s.worst_single) j["governing_loss"] = ids(s.single[*s.worst_single]);
    if (s.worst_pair) j["governing_pair"] = ids(s.pairs[*s.worst_pair]);
    return j.dump(2) + "\n";
  }
  Table t;
  t.title = "Each pile lost in turn";
  t.headers = {"lost", "max utilization", "combination", "governing pile", "result"};
  t.numeric = {false, true, false, false, false};
  auto rows = [&](const std::vector<LossCase>& cases, Table& table) {
    for (const auto& c : cases)
      table.rows.push_back({ids(c), util_text(c.outcome.max_utilization),
                            combo_id(p, c.outcome.combination),
                            c.outcome.unstable ? "-" : p.piles[c.governing_pile].id,
                            c.outcome.max_utilization <= 1.0 ? "pass" : "fail"});
  };
  rows(s.single, t);
  if (format == Format::csv) return render_table(t, Format::csv);
  std::string out = head(h, "each pile lost in turn", format);
  out += fmt::format("Intact: max utilization {} (combination {}).\n", util_text(s.intact.max_utilization),
                     combo_id(p, s.intact.combination));
  if (s.worst_single) {
    const auto& w = s.single[*s.worst_single];
    out += fmt::format("Governing loss: pile {} — max utilization {} in combination {}{}.\n",
                       ids(w), util_text(w.outcome.max_utilization),
                       combo_id(p, w.outcome.combination),
                       w.outcome.unstable ? " (the cap cannot hold the load)"
                                          : " (pile " + p.piles[w.governing_pile].id + ")");
    std::size_t failing = 0;
    for (const auto& c : s.single) failing += c.outcome.max_utilization > 1.0;
    out += fmt::format("{} of {} single losses leave a failing cap.\n", failing, s.single.size());
  }
  if (s.worst_pair) {
    const auto& w = s.pairs[*s.worst_pair];
    std::size_t failing = 0;
    for (const auto& c : s.pairs) failing += c.outcome.max_utilization > 1.0;
    out += fmt::format("Governing pair: {} — max utilization {} in combination {}; {} of {} "
                       "pairs leave a failing cap.\n",
                       ids(w), util_text(w.outcome.max_utilization),
                       combo_id(p, w.outcome.combination), failing, s.pairs.size());
  }
  out += "Linear rigid-cap analysis with the lost pile's stiffness taken out of the cap's; "
         "combinations where a compression-only pile would pull are solved again with the "
         "active-set solver.\n\n";
  out += render_table(t, format);
  if (!s.pairs.empty()) {
    Table pt = t;
    pt.title = "Each pair lost";
    pt.rows.clear();
    rows(s.pairs, pt);
    out += "\n" + render_table(pt, format);
  }
  return out + foot();
}

std::string render_pile_loss_svg(const Project& p, const LossStudy& s) {
  std::vector<double> v;
  for (const auto& c : s.single) v.push_back(c.outcome.max_utilization);
  return value_plan(p, v, {}, {},
                    "Each pile coloured by the cap's largest utilization when that pile is lost.");
}

std::string render_added_piles(const SiteStudyHeader& h, const SearchResult& r,
                               const std::vector<std::string>& standing, Format format) {
  const Project& p = *h.project;
  const UnitSystem u = p.units;
  const std::string len = unit_label(u, Quantity::length);
  auto at_text = [&](const Placement& pl) {
    std::string t;
    for (const auto& a : pl.at)
      t += (t.empty() ? "" : "; ") + fmt::format("({}, {})", fixed_text(from_si(u, Quantity::length, a[0]), 3),
                                               fixed_text(from_si(u, Quantity::length, a[1]), 3));
    return t;
  };
  auto gov = [&](const Placement& pl) {
    if (pl.outcome.unstable) return std::string("-");
    return pl.outcome.pile < standing.size() ? standing[pl.outcome.pile]
                                             : fmt::format("added {}", pl.outcome.pile - standing.size() + 1);
  };
  if (format == Format::json) {
    nlohmann::json j = json_head(h);
    j["before"] = {{"max_utilization", util_json(r.before.max_utilization)},
                   {"combination", combo_id(p, r.before.combination)}};
    j["candidates"] = r.candidates;
    j["added_piles"] = r.piles;
    j["found"] = !r.best.empty() && r.best.front().pass();
    nlohmann::json list = nlohmann::json::array();
    for (const auto& pl : r.best) {
      nlohmann::json at = nlohmann::json::array();
      for (const auto& a : pl.at)
        at.push_back({{"x", from_si(u, Quantity::length, a[0])}, {"y", from_si(u, Quantity::length, a[1])}});
      list.push_back({{"at", at},
                      {"max_utilization", util_json(pl.outcome.max_utilization)},
                      {"combination", combo_id(p, pl.outcome.combination)},
                      {"governing_pile", gov(pl)},
                      {"distance", from_si(u, Quantity::length, pl.distance)},
                      {"pass", pl.pass()}});
    }
    j["best"] = list;
    return j.dump(2) + "\n";
  }
  Table t;
  t.title = r.piles == 1 ? "Best positions for one added pile" : "Best positions for two added piles";
  t.headers = {"rank", fmt::format("at x, y ({})", len), "max utilization", "combination",
               "governing pile", fmt::format("distance ({})", len), "result"};
  t.numeric = {true, false, true, false, false, true, false};
  for (std::size_t i = 0; i < r.best.size(); ++i) {
    const auto& pl = r.best[i];
    t.rows.push_back({std::to_string(i + 1), at_text(pl), util_text(pl.outcome.max_utilization),
                      combo_id(p, pl.outcome.combination), gov(pl),
                      fixed_text(from_si(u, Quantity::length, pl.distance), 3),
                      pl.pass() ? "pass" : "fail"});
  }
  if (format == Format::csv) return render_table(t, Format::csv);
  std::string out = head(h, "added pile search", format);
  out += fmt::format("Before: max utilization {} (combination {}).\n",
                     util_text(r.before.max_utilization), combo_id(p, r.before.combination));
  out += fmt::format("{} grid positions keep the minimum spacing (to every pile in the ground, "
                     "lost ones included) and the edge distance; each was checked in every "
                     "combination{}.\n",
                     r.candidates,
                     r.piles == 2 ? "; no single pile was enough, so pairs among the best "
                                    "single positions were checked"
                                  : "");
  if (!r.best.empty() && r.best.front().pass())
    out += fmt::format("Found: {} added at {} gives max utilization {}.\n",
                       r.piles == 1 ? "one pile" : "two piles", at_text(r.best.front()),
                       util_text(r.best.front().outcome.max_utilization));
  else
    out += "Not found: no position on the grid makes every combination pass; consider another "
           "pile type, a finer step, or a redesign of the cap.\n";
  out += "Ranked by passing, then the largest utilization, then the distance from the lost "
         "pile(s). The added pile's stiffness is added to the cap's (one 6×6 term), not "
         "rebuilt.\n\n";
  out += render_table(t, format);
  return out + foot();
}

std::string render_added_piles_svg(const Project& p, const SearchResult& r,
                                   const std::vector<char>& keep) {
  std::vector<char> crossed(p.piles.size(), 0);
  for (std::size_t i = 0; i < keep.size(); ++i) crossed[i] = !keep[i];
  std::vector<std::array<double, 2>> rings;
  if (!r.best.empty()) rings = r.best.front().at;
  return value_plan(p, {}, crossed, rings,
                    "Crossed: lost piles (left in the ground). Blue rings: the best position(s) "
                    "for the added pile(s).");
}

std::string render_tolerance(const SiteStudyHeader& h, const ToleranceSettings& s,
                             const ToleranceStudy& st, Format format) {
  const Project& p = *h.project;
  const UnitSystem u = p.units;
  const std::string small = unit_label(u, Quantity::small_length);
  const std::string dist =
      s.normal ? fmt::format("normal, σ = {} {} per axis (the tolerance as two standard deviations)",
                             fixed_text(from_si(u, Quantity::small_length, s.plan / 2), 1), small)
               : fmt::format("uniform over a circle of radius {} {}",
                             fixed_text(from_si(u, Quantity::small_length, s.plan), 0), small);
  const std::string gov = st.governing_pile < p.piles.size() ? p.piles[st.governing_pile].id : "-";
  if (format == Format::json) {
    nlohmann::json j = json_head(h);
    j["trials"] = s.trials;
    j["seed"] = s.seed;
    j["distribution"] = s.normal ? "normal" : "uniform";
    j["plan_tolerance"] = from_si(u, Quantity::small_length, s.plan);
    j["batter_tolerance"] = s.batter ? nlohmann::json(fmt::format("1:{:g}", 1.0 / *s.batter))
                                     : nlohmann::json(nullptr);
    j["design"] = util_json(st.design);
    j["median"] = util_json(st.median);
    j["p95"] = util_json(st.p95);
    j["max"] = util_json(st.max);
    j["worst_found"] = util_json(st.worst_outcome.max_utilization);
    j["worst_combination"] = combo_id(p, st.worst_outcome.combination);
    j["governing_pile"] = gov;
    j["margin"] = util_json(st.margin);
    return j.dump(2) + "\n";
  }
  Table t;
  t.title = "Largest utilization of the cap";
  t.headers = {"", "max utilization"};
  t.numeric = {false, true};
  t.rows = {{"as designed", util_text(st.design)},
            {"median of the trials", util_text(st.median)},
            {"95th percentile", util_text(st.p95)},
            {"largest of the trials", util_text(st.max)},
            {"worst arrangement found", util_text(st.worst_outcome.max_utilization)}};
  if (format == Format::csv) return render_table(t, Format::csv);
  std::string out = head(h, "installation tolerance study", format);
  out += fmt::format("{} trials (seed {}): every pile's head {}{}.\n", s.trials, s.seed, dist,
                     s.batter ? fmt::format("; batter within 1 in {:g}", 1.0 / *s.batter) : "");
  out += fmt::format("Worst arrangement (random trials, then each pile pushed to the edge of its "
                     "tolerance circle where that raises the largest utilization): {} in "
                     "combination {}, pile {}.\n",
                     util_text(st.worst_outcome.max_utilization),
                     combo_id(p, st.worst_outcome.combination), gov);
  out += fmt::format("Margin to keep: {} of utilization (design {} → worst found {}); a design "
                     "utilization below {} keeps every arrangement found within capacity.\n\n",
                     util_text(st.margin), util_text(st.design),
                     util_text(std::max(st.max, st.worst_outcome.max_utilization)),
                     util_text(1.0 - st.margin));
  out += render_table(t, format);
  return out + foot();
}

}  // namespace cairn

namespace cairn {

std::string render_safe_regions(const SiteStudyHeader& h, const SafeRegions& r, Format format) {
  const Project& p = *h.project;
  const UnitSystem u = p.units;
  const std::string len = unit_label(u, Quantity::length);
  auto L = [&](double m) { return from_si(u, Quantity::length, m); };
  if (format == Format::json) {
    nlohmann::json j = json_head(h);
    nlohmann::json list = nlohmann::json::array();
    for (const auto& c : r.combinations) {
      auto poly = [&](const Polygon& pg) {
        nlohmann::json a = nlohmann::json::array();
        for (const auto& v : pg) a.push_back({L(v[0]), L(v[1])});
        return a;
      };
      list.push_back({{"combination", p.combinations[c.combination].id},
                      {"load", from_si(u, Quantity::force, c.load)},
                      {"upward", c.upward},
                      {"resultant", {L(c.resultant[0]), L(c.resultant[1])}},
                      {"linear_region", poly(c.linear)},
                      {"traced_region", poly(c.traced)},
                      {"margin", c.upward || !std::isfinite(c.margin) ? nlohmann::json(nullptr)
                                                                      : nlohmann::json(L(c.margin))},
                      {"inside", c.inside}});
    }
    j["combinations"] = list;
    j["smallest_margin"] = r.smallest ? nlohmann::json(p.combinations[r.combinations[*r.smallest].combination].id)
                                      : nlohmann::json(nullptr);
    return j.dump(2) + "\n";
  }
  Table t;
  t.title = "Safe region of each combination's vertical load";
  t.headers = {"combination", fmt::format("P ({})", unit_label(u, Quantity::force)),
               fmt::format("resultant x, y ({})", len), fmt::format("margin ({})", len),
               fmt::format("region area ({}²)", len), "result"};
  t.numeric = {false, true, false, true, true, false};
  for (const auto& c : r.combinations) {
    const Polygon& used = c.traced.empty() ? c.linear : c.traced;
    if (c.upward) {
      t.rows.push_back({p.combinations[c.combination].id,
                        fixed_text(from_si(u, Quantity::force, c.load), 1), "-", "-", "-",
                        "uplift: no region"});
      continue;
    }
    t.rows.push_back({p.combinations[c.combination].id,
                      fixed_text(from_si(u, Quantity::force, c.load), 1),
                      fmt::format("({}, {})", fixed_text(L(c.resultant[0]), 3), fixed_text(L(c.resultant[1]), 3)),
                      std::isfinite(c.margin) ? fixed_text(L(c.margin), 3) : "-",
                      fixed_text(area(used) / std::pow(to_si_factor(u, Quantity::length), 2), 3),
                      c.inside ? "inside" : "outside"});
  }
  if (format == Format::csv) return render_table(t, Format::csv);
  std::string out = head(h, "safe region of the resultant", format);
  if (r.smallest) {
    const auto& c = r.combinations[*r.smallest];
    out += fmt::format("Smallest margin: {} {} in combination {} ({}).\n",
                       std::isfinite(c.margin) ? fixed_text(L(c.margin), 3) : "-", len,
                       p.combinations[c.combination].id,
                       c.inside ? "inside its region" : "outside its region: a pile fails");
  }
  out += "Each combination's vertical load P placed anywhere in plan: the region where every "
         "pile passes (compression, tension, and staying in contact where no tension is "
         "taken) is the exact intersection of half-planes while the piles act linearly; where "
         "compression-only piles may drop out it is traced along rays by bisection with the "
         "active-set solver, and the traced region is the one used. The resultant stands at "
         "x = −My/Fz, y = Mx/Fz (about the origin).\n\n";
  out += render_table(t, format);
  return out + foot();
}

std::string render_safe_regions_svg(const Project& p, const SafeRegions& r) {
  std::vector<std::array<double, 2>> none;
  std::string svg = value_plan(p, {}, {}, none,
                               "Green: the safe region of the combination with the smallest "
                               "margin (dashed: every pile in contact). Dots: resultants "
                               "inside their region; red rings: outside.");
  // Overlay before the closing tag, in the plan's frame.
  const PlanFrame f = plan_frame(p, 560.0);
  auto sx = [&](double x) { return f.origin_x + f.scale * x; };
  auto sy = [&](double y) { return f.origin_y - f.scale * y; };
  std::string overlay;
  auto poly = [&](const Polygon& pg, const char* style) {
    if (pg.size() < 3) return;
    std::string pts;
    for (const auto& v : pg) pts += fmt::format("{:.1f},{:.1f} ", sx(v[0]), sy(v[1]));
    overlay += fmt::format("<polygon points=\"{}\" {}/>\n", pts, style);
  };
  if (r.smallest) {
    const auto& c = r.combinations[*r.smallest];
    poly(c.linear, "fill=\"none\" stroke=\"#1a7f37\" stroke-dasharray=\"5,3\"");
    poly(c.traced.empty() ? c.linear : c.traced, "fill=\"#1a7f37\" fill-opacity=\"0.18\" stroke=\"#1a7f37\"");
  }
  for (const auto& c : r.combinations) {
    if (c.upward) continue;
    overlay += c.inside ? fmt::format("<circle cx=\"{:.1f}\" cy=\"{:.1f}\" r=\"3\" fill=\"#000\"><title>{}</title></circle>\n",
                                      sx(c.resultant[0]), sy(c.resultant[1]), xml_escape(p.combinations[c.combination].id))
                        : fmt::format("<circle cx=\"{:.1f}\" cy=\"{:.1f}\" r=\"6\" fill=\"none\" stroke=\"#b00020\" stroke-width=\"2\"><title>{}</title></circle>\n",
                                      sx(c.resultant[0]), sy(c.resultant[1]), xml_escape(p.combinations[c.combination].id));
  }
  const auto end = svg.rfind("</svg>");
  return svg.substr(0, end) + overlay + "</svg>\n";
}

}  // namespace cairn
