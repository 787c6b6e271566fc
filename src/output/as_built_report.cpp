#include "cairn/output/as_built_report.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>

#include <fmt/format.h>

#include "cairn/output/html_report.hpp"
#include "cairn/output/number_text.hpp"
#include "cairn/output/plan_svg.hpp"

namespace cairn {
namespace {

void require(const AsBuiltReport& r) {
  if (!r.model || !r.design || !r.as_built || !r.comparison)
    throw std::invalid_argument("as-built report: model, runs and comparison are required");
}

std::string opt_text(const std::optional<double>& v, int decimals = 3) {
  return v ? fixed_text(*v, decimals) : "-";
}

std::string status_text(const AsBuiltPile& a) {
  std::string s = to_string(a.status);
  if (a.added) s += ", added";
  return s;
}

Table pile_table(const AsBuiltReport& r) {
  const UnitSystem u = r.design->project.units;
  const std::string len = unit_label(u, Quantity::length);
  const std::string small = unit_label(u, Quantity::small_length);
  Table t;
  t.title = "Piles as built";
  t.headers = {"pile",         "status",          fmt::format("design x ({})", len),
               fmt::format("design y ({})", len), fmt::format("x ({})", len),
               fmt::format("y ({})", len),        fmt::format("offset ({})", small),
               "direction (°)", "tolerance",      "utilization design",
               "utilization as built",            "change",          "remarks"};
  t.numeric = {false, false, true, true, true, true, true, true, false, true, true, true, false};
  const auto& c = *r.comparison;
  for (std::size_t i = 0; i < r.model->piles.size(); ++i) {
    const AsBuiltPile& a = r.model->piles[i];
    const auto& d = c.design_utilization[i];
    const auto& b = c.as_built_utilization[i];
    std::string change = "-";
    if (d && b) change = fixed_text(*b - *d, 3);
    std::string remarks;
    for (const auto& m : a.remarks) remarks += (remarks.empty() ? "" : "; ") + m;
    t.rows.push_back({a.id, status_text(a),
                      a.added ? "-" : fixed_text(from_si(u, Quantity::length, a.design_x), 3),
                      a.added ? "-" : fixed_text(from_si(u, Quantity::length, a.design_y), 3),
                      fixed_text(from_si(u, Quantity::length, a.x), 3),
                      fixed_text(from_si(u, Quantity::length, a.y), 3),
                      a.added ? "-" : fixed_text(from_si(u, Quantity::small_length, a.offset), 0),
                      a.added || fixed_text(from_si(u, Quantity::small_length, a.offset), 0) == "0"
                          ? "-"
                          : fixed_text(a.direction_deg, 0),
                      a.added || !a.as_built ? "-" : a.out_of_tolerance ? "out" : "within",
                      opt_text(d), opt_text(b), change, remarks.empty() ? "-" : remarks});
  }
  return t;
}

// Per combination: each pile's forces and utilization, design beside as built.
Table combination_table(const AsBuiltReport& r, std::size_t c) {
  const UnitSystem u = r.design->project.units;
  const std::string force = unit_label(u, Quantity::force);
  const Project& p = r.design->project;
  const auto& dc = r.design->results.combinations[c];
  const auto& bc = r.as_built->results.combinations[c];
  Table t;
  t.title = fmt::format("Combination {} ({}): {} — as built {}", p.combinations[c].id,
                        to_string(p.combinations[c].limit_state),
                        combination_formula(p, p.combinations[c]), to_string(verdict(bc)));
  t.headers = {"pile", fmt::format("axial design ({})", force),
               fmt::format("axial as built ({})", force), fmt::format("lateral design ({})", force),
               fmt::format("lateral as built ({})", force), "utilization design",
               "utilization as built", "change", "result"};
  t.numeric = {false, true, true, true, true, true, true, true, false};
  auto f = [&](double v) { return fixed_text(from_si(u, Quantity::force, v), 1); };
  for (const AsBuiltPile& a : r.model->piles) {
    const PileCheck* d = a.design && !dc.solution.overturns ? &dc.piles[*a.design] : nullptr;
    const PileCheck* b = a.as_built && !bc.solution.overturns ? &bc.piles[*a.as_built] : nullptr;
    t.rows.push_back({a.id, d ? f(d->axial) : "-", b ? f(b->axial) : a.as_built ? "-" : "0.0",
                      d ? f(d->lateral) : "-", b ? f(b->lateral) : a.as_built ? "-" : "0.0",
                      d ? fixed_text(d->utilization, 3) : "-",
                      b ? fixed_text(b->utilization, 3) : "-",
                      d && b ? fixed_text(b->utilization - d->utilization, 3) : "-",
                      !a.as_built ? std::string(to_string(a.status))
                      : b         ? (b->pass ? "pass" : "fail")
                                  : "fail"});
  }
  return t;
}

std::string verdict_line(const AsBuiltReport& r) {
  const auto& c = *r.comparison;
  const Project& p = r.design->project;
  const auto& s = r.as_built->results.summary;
  std::string line = fmt::format("Verdict: {}", to_string(c.verdict));
  if (c.governing_combination) {
    line += fmt::format(" — governing combination {}", p.combinations[*c.governing_combination].id);
    if (s.pile && !r.as_built->results.combinations[*c.governing_combination].solution.overturns)
      line += fmt::format(" (max utilization {} as built, pile {}, {}; {} as designed)",
                          fixed_text(c.as_built_max, 3), r.as_built->project.piles[*s.pile].id,
                          to_string(s.check), fixed_text(c.design_max, 3));
    else if (r.as_built->results.combinations[*c.governing_combination].solution.overturns)
      line += " (no equilibrium as built: the cap overturns)";
  }
  return line + ".";
}

std::string tolerance_line(const AsBuiltReport& r) {
  const UnitSystem u = r.design->project.units;
  const auto& t = r.model->tolerances;
  return fmt::format("Tolerances: plan position {:.0f} {}, batter 1 in {:.0f} (common practice "
                     "defaults; set with --plan-tolerance and --batter-tolerance).",
                     from_si(u, Quantity::small_length, t.plan),
                     unit_label(u, Quantity::small_length), 1.0 / t.batter);
}

std::vector<std::string> grid_lines(const AsBuiltReport& r) {
  std::vector<std::string> lines;
  if (r.model->grid) {
    const UnitSystem u = r.design->project.units;
    lines.push_back(fmt::format(
        "Survey on a site grid: the project's origin at E {:.3f}, N {:.3f} {}, its x axis "
        "turned {:g}° counter-clockwise from the grid's E axis.",
        from_si(u, Quantity::length, r.model->grid->origin_e),
        from_si(u, Quantity::length, r.model->grid->origin_n), unit_label(u, Quantity::length),
        r.model->grid->rotation_deg));
  }
  return lines;
}

}  // namespace

nlohmann::json as_built_json(const AsBuiltReport& r) {
  require(r);
  const UnitSystem u = r.design->project.units;
  const Project& p = r.design->project;
  const auto& c = *r.comparison;
  nlohmann::json j;
  j["tool"] = {{"name", "cairn"}, {"version", CAIRN_VERSION}};
  j["title"] = p.title;
  j["input"] = p.file;
  j["survey"] = r.model->survey_file;
  j["command"] = r.options;
  j["units"] = {{"system", u == UnitSystem::SI ? "SI" : "US"},
                {"length", unit_label(u, Quantity::length)},
                {"offset", unit_label(u, Quantity::small_length)},
                {"force", unit_label(u, Quantity::force)}};
  j["tolerances"] = {{"plan", from_si(u, Quantity::small_length, r.model->tolerances.plan)},
                     {"batter", fmt::format("1:{:g}", 1.0 / r.model->tolerances.batter)}};
  j["verdict"] = to_string(c.verdict);
  j["pass"] = r.as_built->results.summary.pass;
  j["governing_combination"] =
      c.governing_combination ? nlohmann::json(p.combinations[*c.governing_combination].id)
                              : nlohmann::json(nullptr);
  j["max_utilization"] = {{"design", c.design_max}, {"as_built", c.as_built_max}};
  auto& piles = j["piles"] = nlohmann::json::array();
  for (std::size_t i = 0; i < r.model->piles.size(); ++i) {
    const AsBuiltPile& a = r.model->piles[i];
    nlohmann::json row;
    row["id"] = a.id;
    row["status"] = to_string(a.status);
    row["added"] = a.added;
    row["design"] = a.added ? nlohmann::json(nullptr)
                            : nlohmann::json{{"x", from_si(u, Quantity::length, a.design_x)},
                                             {"y", from_si(u, Quantity::length, a.design_y)}};
    row["as_built"] = {{"x", from_si(u, Quantity::length, a.x)},
                       {"y", from_si(u, Quantity::length, a.y)}};
    row["offset"] = from_si(u, Quantity::small_length, a.offset);
    row["direction_deg"] = a.direction_deg;
    row["out_of_tolerance"] = a.out_of_tolerance;
    row["batter_deviation"] = a.batter_deviation ? nlohmann::json(*a.batter_deviation)
                                                 : nlohmann::json(nullptr);
    const auto& d = c.design_utilization[i];
    const auto& b = c.as_built_utilization[i];
    row["utilization"] = {{"design", d ? nlohmann::json(*d) : nlohmann::json(nullptr)},
                          {"as_built", b ? nlohmann::json(*b) : nlohmann::json(nullptr)},
                          {"change", d && b ? nlohmann::json(*b - *d) : nlohmann::json(nullptr)}};
    row["remarks"] = a.remarks;
    piles.push_back(row);
  }
  auto& combos = j["combinations"] = nlohmann::json::array();
  for (std::size_t k = 0; k < p.combinations.size(); ++k) {
    const auto& dc = r.design->results.combinations[k];
    const auto& bc = r.as_built->results.combinations[k];
    nlohmann::json cj;
    cj["id"] = p.combinations[k].id;
    cj["verdict"] = to_string(verdict(bc));
    cj["design_verdict"] = to_string(verdict(dc));
    cj["max_utilization"] = bc.max_utilization;
    cj["design_max_utilization"] = dc.max_utilization;
    auto& rows = cj["piles"] = nlohmann::json::array();
    auto force = [&](const PileCheck* pc, double PileCheck::*m) {
      return pc ? nlohmann::json(from_si(u, Quantity::force, pc->*m)) : nlohmann::json(nullptr);
    };
    for (const AsBuiltPile& a : r.model->piles) {
      const PileCheck* d = a.design && !dc.solution.overturns ? &dc.piles[*a.design] : nullptr;
      const PileCheck* b = a.as_built && !bc.solution.overturns ? &bc.piles[*a.as_built] : nullptr;
      nlohmann::json row;
      row["id"] = a.id;
      if (a.as_built) {
        row["axial"] = force(b, &PileCheck::axial);
        row["lateral"] = force(b, &PileCheck::lateral);
        row["utilization"] = b ? nlohmann::json(b->utilization) : nlohmann::json(nullptr);
        row["state"] = b ? to_string(b->state) : to_string(PileState::overturned);
        row["pass"] = b && b->pass;
      } else {
        row["axial"] = 0.0;  // a rejected or abandoned pile carries nothing
        row["lateral"] = 0.0;
        row["utilization"] = 0.0;
        row["state"] = to_string(a.status);
        row["pass"] = true;
      }
      row["design_axial"] = force(d, &PileCheck::axial);
      row["design_lateral"] = force(d, &PileCheck::lateral);
      row["design_utilization"] = d ? nlohmann::json(d->utilization) : nlohmann::json(nullptr);
      rows.push_back(row);
    }
    combos.push_back(cj);
  }
  j["notes"] = grid_lines(r);
  j["notes"].push_back(kCapNotChecked);
  j["assumptions"] = r.as_built->assumptions;
  j["caution"] = kCaution;
  return j;
}

std::string render_as_built(const AsBuiltReport& r, Format format) {
  require(r);
  if (format == Format::json) return as_built_json(r).dump(2) + "\n";
  const Project& p = r.design->project;
  if (format == Format::csv) return render_table(pile_table(r), Format::csv);
  const bool md = format == Format::markdown;
  std::string out;
  if (md)
    out += fmt::format("# cairn {} — as-built check: {}\n\n- input: `{}`\n- survey: `{}`\n- "
                       "command: `{}`\n\n",
                       CAIRN_VERSION, p.title, p.file, r.model->survey_file, r.options);
  else
    out += fmt::format("cairn {} — as-built check: {}\ninput: {}\nsurvey: {}\ncommand: {}\n\n",
                       CAIRN_VERSION, p.title, p.file, r.model->survey_file, r.options);
  out += verdict_line(r) + "\n";
  out += std::string(kCapNotChecked) + "\n";
  out += tolerance_line(r) + "\n";
  for (const auto& l : grid_lines(r)) out += l + "\n";
  out += "\n" + render_table(pile_table(r), format) + "\n";
  for (std::size_t k = 0; k < p.combinations.size(); ++k)
    out += render_table(combination_table(r, k), format) + "\n";
  out += md ? "## Assumptions (as built)\n\n" : "Assumptions (as built)\n";
  for (const auto& a : r.as_built->assumptions) out += (md ? "- " : "  - ") + a + "\n";
  out += "\n" + std::string(kCaution) + "\n";
  return out;
}

std::string render_as_built_plan_svg(const AsBuiltReport& r, double exaggeration) {
  require(r);
  const Project& design = r.design->project;
  const UnitSystem u = design.units;
  // The frame of the design, widened to hold every as-built head.
  Project extent = design;
  for (const AsBuiltPile& a : r.model->piles) {
    Pile p;
    p.x = a.x;
    p.y = a.y;
    extent.piles.push_back(p);
  }
  const PlanFrame f = plan_frame(extent, 560.0);
  auto sx = [&](double x) { return f.origin_x + f.scale * x; };
  auto sy = [&](double y) { return f.origin_y - f.scale * y; };
  const double scale_max = utilization_scale_max(&r.as_built->results);
  // The drawing ends below its lowest point (outline or exaggerated head); the legend follows.
  double lowest = -std::numeric_limits<double>::infinity();
  if (design.cap.outline)
    for (const auto& c : design.cap.outline->polygon) lowest = std::max(lowest, sy(c[1]));
  for (const AsBuiltPile& a : r.model->piles)
    lowest = std::max({lowest, sy(a.design_y + exaggeration * (a.y - a.design_y)), sy(a.y)});
  const double legend_y = std::min(f.height, lowest + 40.0);
  std::string svg = fmt::format(
      "<svg xmlns=\"http://www.w3.org/2000/svg\" viewBox=\"0 0 {:.1f} {:.1f}\" width=\"{:.0f}\" "
      "role=\"img\" aria-label=\"As-built plan\" font-family=\"sans-serif\" font-size=\"11\">\n"
      "<defs><marker id=\"ab-arrow\" viewBox=\"0 0 10 10\" refX=\"9\" refY=\"5\" "
      "markerWidth=\"6\" markerHeight=\"6\" orient=\"auto-start-reverse\"><path d=\"M0,0 L10,5 "
      "L0,10 z\" fill=\"#b00020\"/></marker></defs>\n",
      f.width, legend_y + 70.0, f.width);
  if (design.cap.outline) {
    std::string pts;
    for (const auto& c : design.cap.outline->polygon)
      pts += fmt::format("{:.1f},{:.1f} ", sx(c[0]), sy(c[1]));
    svg += "<polygon points=\"" + pts + "\" fill=\"#f4f4f4\" stroke=\"#555\"/>\n";
  }
  for (const AsBuiltPile& a : r.model->piles) {
    const double w = design.pile_types[a.type].section.width;
    const double half = std::max(3.0, f.scale * w / 2.0);
    const bool round = design.pile_types[a.type].section.shape == SectionShape::round;
    auto shape = [&](double x, double y, const std::string& style) {
      return round ? fmt::format("<circle cx=\"{:.1f}\" cy=\"{:.1f}\" r=\"{:.1f}\" {}/>\n", sx(x),
                                 sy(y), half, style)
                   : fmt::format("<rect x=\"{:.1f}\" y=\"{:.1f}\" width=\"{:.1f}\" "
                                 "height=\"{:.1f}\" {}/>\n",
                                 sx(x) - half, sy(y) - half, 2 * half, 2 * half, style);
    };
    if (!a.added)  // the design position, faint
      svg += shape(a.design_x, a.design_y,
                   "fill=\"none\" stroke=\"#999\" stroke-dasharray=\"3,2\" opacity=\"0.7\"");
    // Offsets exaggerated from the design position.
    const double ex = a.design_x + exaggeration * (a.x - a.design_x);
    const double ey = a.design_y + exaggeration * (a.y - a.design_y);
    const double drawn_x = a.added ? a.x : ex, drawn_y = a.added ? a.y : ey;
    if (!a.added && a.offset > 0)
      svg += fmt::format("<line x1=\"{:.1f}\" y1=\"{:.1f}\" x2=\"{:.1f}\" y2=\"{:.1f}\" "
                         "stroke=\"#b00020\" stroke-width=\"1.5\" marker-end=\"url(#ab-arrow)\"/>\n",
                         sx(a.design_x), sy(a.design_y), sx(ex), sy(ey));
    const auto& util = r.comparison->as_built_utilization[&a - r.model->piles.data()];
    const std::string fill = util ? utilization_colour(*util, scale_max) : kUncheckedColour;
    svg += shape(drawn_x, drawn_y,
                 fmt::format("fill=\"{}\" stroke=\"{}\" stroke-width=\"{}\"", fill,
                             a.out_of_tolerance ? "#b00020" : "#000",
                             a.out_of_tolerance ? 2.5 : 1.0));
    if (!a.as_built)  // rejected or abandoned: crossed out
      svg += fmt::format("<path d=\"M{0:.1f},{1:.1f} L{2:.1f},{3:.1f} M{0:.1f},{3:.1f} "
                         "L{2:.1f},{1:.1f}\" stroke=\"#b00020\" stroke-width=\"2.5\"/>\n",
                         sx(drawn_x) - half - 3, sy(drawn_y) - half - 3, sx(drawn_x) + half + 3,
                         sy(drawn_y) + half + 3);
    if (a.added)
      svg += fmt::format("<circle cx=\"{:.1f}\" cy=\"{:.1f}\" r=\"{:.1f}\" fill=\"none\" "
                         "stroke=\"#0050b0\" stroke-width=\"2\" stroke-dasharray=\"4,2\"/>\n",
                         sx(drawn_x), sy(drawn_y), half + 6);
    svg += fmt::format("<text x=\"{:.1f}\" y=\"{:.1f}\">{}{}</text>\n", sx(drawn_x) + half + 3,
                       sy(drawn_y) - half - 2, xml_escape(a.id), a.added ? " (added)" : "");
  }
  const std::vector<std::string> legend = {
      "Design positions dashed; as-built heads filled by utilization.",
      fmt::format("Offsets drawn {:g}× true size, as arrows from the design position.", exaggeration),
      "Crossed: rejected or abandoned (left in the ground). Blue ring: added on site.",
      fmt::format("Red outline: out of tolerance. Lengths in {}.", unit_label(u, Quantity::length))};
  for (std::size_t k = 0; k < legend.size(); ++k)
    svg += fmt::format("<text x=\"8\" y=\"{:.1f}\">{}</text>\n", legend_y + 12.0 + 15.0 * k,
                       xml_escape(legend[k]));
  return svg + "</svg>\n";
}

std::string as_built_section_html(const AsBuiltReport& r) {
  require(r);
  std::string html = "<section id=\"as-built\"><h2>As built</h2>\n";
  html += "<p><strong>" + xml_escape(verdict_line(r)) + "</strong></p>\n";
  html += "<p>" + xml_escape(kCapNotChecked) + "</p>\n";
  html += "<p>Survey: " + xml_escape(r.model->survey_file) + ". " + xml_escape(tolerance_line(r)) +
          "</p>\n";
  for (const auto& l : grid_lines(r)) html += "<p>" + xml_escape(l) + "</p>\n";
  html += "<figure>" + render_as_built_plan_svg(r) +
          "<figcaption>As-built plan.</figcaption></figure>\n";
  html += render_table_html(pile_table(r));
  for (std::size_t k = 0; k < r.design->project.combinations.size(); ++k)
    html += render_table_html(combination_table(r, k));
  return html + "</section>";
}

}  // namespace cairn
