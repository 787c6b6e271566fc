#include "cairn/output/plan_svg.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <map>
#include <numbers>
#include <stdexcept>

#include <fmt/format.h>

#include "cairn/output/number_text.hpp"

namespace cairn {
namespace {

// Room around the plan for batter arrows and labels (px).
constexpr double kMargin = 75.0;
// Below the plan: scale bar and colour bar, the failing-pile key and the notes (px), plus one
// line per legend line of the load points.
constexpr double kLegendHeight = 118.0;
constexpr double kLegendLine = 14.0;
// Load-point legend lines are wrapped at about this many characters (10.5 px text in 600 px).
constexpr std::size_t kLegendLineChars = 104;
// A batter of 1:n is drawn as an arrow kBatterArrow/n px long; 1:3 → 60 px.
constexpr double kBatterArrow = 180.0;
// Longest plan side in px relative to the drawing width, so tall caps still fit a page.
constexpr double kMaxHeightRatio = 1.25;
// Smallest plan extent drawn (m), so a single pile at the origin still gets a frame.
constexpr double kMinExtent = 1.0;

struct Box {
  double min_x = std::numeric_limits<double>::infinity();
  double min_y = std::numeric_limits<double>::infinity();
  double max_x = -std::numeric_limits<double>::infinity();
  double max_y = -std::numeric_limits<double>::infinity();
  void add(double x, double y) {
    min_x = std::min(min_x, x);
    min_y = std::min(min_y, y);
    max_x = std::max(max_x, x);
    max_y = std::max(max_y, y);
  }
};

Box plan_box(const Project& p) {
  Box box;
  box.add(0.0, 0.0);  // the origin, where the axes are drawn
  if (p.cap.outline)
    for (const auto& c : p.cap.outline->polygon) box.add(c[0], c[1]);
  for (const Pile& pile : p.piles) {
    const double half = p.pile_types.at(pile.type).section.width / 2.0;
    box.add(pile.x - half, pile.y - half);
    box.add(pile.x + half, pile.y + half);
  }
  for (const LoadCase& lc : p.load_cases)
    for (const PointLoad& l : lc.loads) box.add(l.at[0], l.at[1]);
  // Keep at least kMinExtent in each direction, centred on what is there.
  for (auto [lo, hi] : {std::pair{&box.min_x, &box.max_x}, std::pair{&box.min_y, &box.max_y}}) {
    if (*hi - *lo < kMinExtent) {
      const double mid = (*hi + *lo) / 2.0;
      *lo = mid - kMinExtent / 2.0;
      *hi = mid + kMinExtent / 2.0;
    }
  }
  return box;
}

std::string num(double v) { return fixed_text(v, 2); }  // no "-0.00"

// A length of 1, 2 or 5 × 10^k (in the project's unit) near `target`.
double nice_length(double target) {
  const double power = std::pow(10.0, std::floor(std::log10(target)));
  const double m = target / power;
  return (m < 1.5 ? 1.0 : m < 3.5 ? 2.0 : m < 7.5 ? 5.0 : 10.0) * power;
}

std::string nice_number_text(double v) { return general_text(v); }

struct LoadPoint {
  double x = 0.0, y = 0.0;  // m
  // The loads applied here, each as "case name: components", in the order of the file.
  std::vector<std::string> loads;
};

// One load as the legend shows it: its case, its name and its non-zero components in the
// project's units ("D column C1: Fz −1200.0 kN, My 35.0 kN·m").
std::string load_text(const Project& p, const LoadCase& lc, const PointLoad& l) {
  const char* names[6] = {"Fx", "Fy", "Fz", "Mx", "My", "Mz"};
  const QuantityFormat u(p.units);
  std::string components;
  for (int k = 0; k < 6; ++k) {
    const Shown q = k < 3 ? Shown::force : Shown::moment;
    const std::string value = u.number(q, l.load[k]);
    if (value.find_first_not_of("0.") == std::string::npos) continue;  // zero as printed
    components += fmt::format("{}{} {} {}", components.empty() ? "" : ", ", names[k], value,
                              u.label(q));
  }
  return fmt::format("{}{}: {}", lc.id, l.note.empty() ? "" : " " + l.note,
                     components.empty() ? "no load" : components);
}

// Load application points, merged when within a millimetre of each other.
std::vector<LoadPoint> load_points(const Project& p) {
  std::vector<LoadPoint> points;
  for (const LoadCase& lc : p.load_cases) {
    for (const PointLoad& l : lc.loads) {
      auto it = std::find_if(points.begin(), points.end(), [&](const LoadPoint& q) {
        return std::abs(q.x - l.at[0]) < 1e-3 && std::abs(q.y - l.at[1]) < 1e-3;
      });
      if (it == points.end()) {
        points.push_back({l.at[0], l.at[1], {}});
        it = points.end() - 1;
      }
      it->loads.push_back(load_text(p, lc, l));
    }
  }
  return points;
}

// "L<k> at (x, y) m: load; load; …", wrapped into lines of about kLegendLineChars.
std::vector<std::string> load_point_lines(const Project& p, std::size_t k, const LoadPoint& lp) {
  const QuantityFormat u(p.units);
  std::vector<std::string> lines = {fmt::format("L{} at ({}, {}) {}:", k + 1, u.length(lp.x),
                                                u.length(lp.y), u.label(Shown::length))};
  for (std::size_t i = 0; i < lp.loads.size(); ++i) {
    const std::string piece = " " + lp.loads[i] + (i + 1 < lp.loads.size() ? ";" : "");
    if (lines.back().size() + piece.size() > kLegendLineChars && lines.back().size() > 12)
      lines.push_back("    " + piece.substr(1));
    else
      lines.back() += piece;
  }
  return lines;
}

std::vector<std::string> legend_lines(const Project& p) {
  std::vector<std::string> all;
  const auto points = load_points(p);
  for (std::size_t k = 0; k < points.size(); ++k)
    for (auto& line : load_point_lines(p, k, points[k])) all.push_back(line);
  return all;
}

// The mark of a failing pile: a cross over its centre, `size` px across, black on a white
// halo so that it reads on every fill.
std::string failing_cross(double cx, double cy, double size) {
  const double h = size * 0.42;
  const std::string d = fmt::format("M{},{} L{},{} M{},{} L{},{}", num(cx - h), num(cy - h),
                                    num(cx + h), num(cy + h), num(cx - h), num(cy + h),
                                    num(cx + h), num(cy - h));
  return fmt::format("<path class=\"fail-mark\" d=\"{0}\" stroke=\"#ffffff\" stroke-width=\"4.5\" "
                     "fill=\"none\"/><path d=\"{0}\" stroke=\"#000000\" stroke-width=\"2\" "
                     "fill=\"none\"/>",
                     d);
}

}  // namespace

double utilization_scale_max(const CheckResults* results) {
  double top = kUtilizationScaleMin;
  if (results)
    for (const auto& e : results->envelope)
      if (std::isfinite(e.max_utilization.value)) top = std::max(top, e.max_utilization.value);
  return top;
}

PlanFrame plan_frame(const Project& p, double plan_width) {
  if (!(plan_width > 2.0 * kMargin)) throw std::invalid_argument("plan_frame: drawing too narrow");
  const Box box = plan_box(p);
  const double dx = box.max_x - box.min_x, dy = box.max_y - box.min_y;
  const double avail_w = plan_width - 2.0 * kMargin;
  const double avail_h = kMaxHeightRatio * plan_width - 2.0 * kMargin;
  PlanFrame f;
  f.scale = std::min(avail_w / dx, avail_h / dy);
  const double plan_h = dy * f.scale;
  f.origin_x = kMargin + (avail_w - dx * f.scale) / 2.0 - box.min_x * f.scale;
  f.origin_y = kMargin + box.max_y * f.scale;
  f.width = plan_width;
  f.height = 2.0 * kMargin + plan_h + kLegendHeight + kLegendLine * legend_lines(p).size();
  return f;
}

std::string render_plan_svg(const Project& p, const CheckResults* results,
                            const std::vector<PileTypeResistance>* resistances) {
  const PlanFrame f = plan_frame(p);
  auto X = [&](double x) { return f.origin_x + f.scale * x; };
  auto Y = [&](double y) { return f.origin_y - f.scale * y; };
  const QuantityFormat shown(p.units);
  const std::string length_unit = shown.label(Shown::length);
  const double to_m = to_si_factor(p.units, Quantity::length);
  const double scale_max = utilization_scale_max(results);
  std::string overturned;  // ids of the overturned combinations
  if (results)
    for (auto c : results->summary.overturned)
      if (c < p.combinations.size()) overturned += (overturned.empty() ? "" : ", ") + p.combinations[c].id;

  std::string s = fmt::format(
      "<svg xmlns=\"http://www.w3.org/2000/svg\" class=\"plan\" width=\"{0}\" height=\"{1}\" "
      "viewBox=\"0 0 {0} {1}\" font-family=\"Helvetica, Arial, sans-serif\" font-size=\"12\" "
      "data-px-per-m=\"{2:.6f}\" data-origin-x=\"{3:.6f}\" data-origin-y=\"{4:.6f}\" "
      "role=\"img\" aria-label=\"Plan of the pile cap, to scale\">\n",
      num(f.width), num(f.height), f.scale, f.origin_x, f.origin_y);
  s += "<title>" + xml_escape(p.title) + " — plan</title>\n";
  s += "<defs><marker id=\"plan-arrow\" viewBox=\"0 0 10 10\" refX=\"9\" refY=\"5\" "
       "markerWidth=\"7\" markerHeight=\"7\" orient=\"auto-start-reverse\">"
       "<path d=\"M0,0 L10,5 L0,10 z\" fill=\"context-stroke\"/></marker></defs>\n";
  s += fmt::format("<rect x=\"0\" y=\"0\" width=\"{}\" height=\"{}\" fill=\"#ffffff\"/>\n",
                   num(f.width), num(f.height));

  // Cap outline.
  if (p.cap.outline && !p.cap.outline->polygon.empty()) {
    std::string points;
    for (const auto& c : p.cap.outline->polygon)
      points += (points.empty() ? "" : " ") + num(X(c[0])) + "," + num(Y(c[1]));
    s += "<polygon class=\"outline\" points=\"" + points +
         "\" fill=\"#f4f1ea\" stroke=\"#333333\" stroke-width=\"2\"/>\n";
  }

  // The origin, marked where it is, and the axes drawn as a small key in the lower-left
  // corner, clear of the piles (a pile often stands at the origin).
  const double ox = f.origin_x, oy = f.origin_y, axis = 40.0;
  const std::vector<std::string> legend = legend_lines(p);
  const double kx = 22.0, ky = f.height - kLegendHeight - kLegendLine * legend.size() - 14.0;
  s += "<g class=\"axes\" stroke=\"#555555\" stroke-width=\"1.5\">\n";
  s += fmt::format("<line x1=\"{}\" y1=\"{}\" x2=\"{}\" y2=\"{}\" marker-end=\"url(#plan-arrow)\"/>\n",
                   num(kx), num(ky), num(kx + axis), num(ky));
  s += fmt::format("<line x1=\"{}\" y1=\"{}\" x2=\"{}\" y2=\"{}\" marker-end=\"url(#plan-arrow)\"/>\n",
                   num(kx), num(ky), num(kx), num(ky - axis));
  s += "</g>\n";
  s += fmt::format("<text x=\"{}\" y=\"{}\" fill=\"#555555\">+x</text>\n", num(kx + axis + 4),
                   num(ky + 4));
  s += fmt::format("<text x=\"{}\" y=\"{}\" fill=\"#555555\" text-anchor=\"middle\">+y</text>\n",
                   num(kx), num(ky - axis - 6));
  // Piles.
  const std::vector<LoadPoint> points = load_points(p);
  s += "<g class=\"piles\">\n";
  for (std::size_t i = 0; i < p.piles.size(); ++i) {
    const Pile& pile = p.piles[i];
    const PileType& type = p.pile_types.at(pile.type);
    const double size = type.section.width * f.scale;  // px
    const double cx = X(pile.x), cy = Y(pile.y);
    std::string fill = kUncheckedColour;
    std::string ink = "#000000";  // the id's colour inside the pile
    bool failing = false;
    std::string tip = fmt::format("{} (type {}) at ({}, {}) {}", pile.id, type.id,
                                  shown.length(pile.x), shown.length(pile.y), length_unit);
    if (results && i < results->envelope.size()) {
      const PileEnvelope& e = results->envelope[i];
      const Extreme& u = e.max_utilization;
      fill = utilization_colour(u.value, scale_max);
      ink = utilization_text_colour(u.value, scale_max);
      failing = !e.pass || u.value > 1.0;
      tip += ", max utilization " + QuantityFormat::utilization(u.value);
      if (u.combination && *u.combination < p.combinations.size())
        tip += " (" + p.combinations[*u.combination].id + ")";
      if (failing) tip += overturned.empty() ? ", FAILS" : ", FAILS (the cap overturns in " + overturned + ")";
    }
    if (resistances && pile.type < resistances->size()) {
      const auto& a = (*resistances)[pile.type].allowable;
      if (a.compression)
        tip += ", allowable compression " + shown.text(Shown::force, *a.compression);
    }
    s += fmt::format("<g class=\"pile{}\" data-pile=\"{}\" data-utilization-colour=\"{}\">",
                     failing ? " failing" : "", xml_escape(pile.id), fill);
    s += "<title>" + xml_escape(tip) + "</title>";
    // A failing pile is marked by shape as well as colour: a bold outline and a cross.
    const char* outline = failing ? "stroke=\"#000000\" stroke-width=\"3.5\"" : "stroke=\"#222222\" stroke-width=\"1.2\"";
    if (type.section.shape == SectionShape::round)
      s += fmt::format("<circle cx=\"{}\" cy=\"{}\" r=\"{}\" fill=\"{}\" {}/>", num(cx), num(cy),
                       num(size / 2.0), fill, outline);
    else
      s += fmt::format("<rect x=\"{}\" y=\"{}\" width=\"{}\" height=\"{}\" fill=\"{}\" {}/>",
                       num(cx - size / 2.0), num(cy - size / 2.0), num(size), num(size), fill,
                       outline);
    if (failing) s += failing_cross(cx, cy, std::max(size, 12.0));
    // The id sits inside the pile when it fits and no marker (origin, load point) is drawn
    // over the pile; otherwise just outside its top-left corner.
    const double half = type.section.width / 2.0;
    auto inside = [&](double x, double y) {
      return std::abs(x - pile.x) <= half && std::abs(y - pile.y) <= half;
    };
    bool crowded = failing || inside(0.0, 0.0);  // a cross is drawn over a failing pile
    for (const LoadPoint& lp : points) crowded = crowded || inside(lp.x, lp.y);
    const double font = std::clamp(size * 0.42, 9.0, 13.0);
    if (size >= 22.0 && !crowded)
      s += fmt::format("<text x=\"{}\" y=\"{}\" text-anchor=\"middle\" font-size=\"{}\" "
                       "font-weight=\"bold\" fill=\"{}\">{}</text>",
                       num(cx), num(cy + font * 0.35), num(font), ink, xml_escape(pile.id));
    else
      s += fmt::format("<text x=\"{}\" y=\"{}\" text-anchor=\"end\" font-size=\"12\" "
                       "font-weight=\"bold\" paint-order=\"stroke\" stroke=\"#ffffff\" "
                       "stroke-width=\"3\">{}</text>",
                       num(cx - size / 2.0 - 2.0), num(cy - size / 2.0 - 2.0),
                       xml_escape(pile.id));
    if (pile.batter && pile.batter->ratio > 0.0) {
      const double angle = pile.batter->toward_deg * std::numbers::pi / 180.0;
      const double ux = std::cos(angle), uy = -std::sin(angle);  // SVG y points down
      const double start = size / 2.0 * (type.section.shape == SectionShape::round
                                             ? 1.0
                                             : 1.0 / std::max(std::abs(std::cos(angle)),
                                                              std::abs(std::sin(angle))));
      const double length = kBatterArrow / pile.batter->ratio;
      const double x1 = cx + ux * start, y1 = cy + uy * start;
      const double x2 = x1 + ux * length, y2 = y1 + uy * length;
      s += fmt::format("<line class=\"batter\" x1=\"{}\" y1=\"{}\" x2=\"{}\" y2=\"{}\" "
                       "stroke=\"#1a1a1a\" stroke-width=\"1.8\" marker-end=\"url(#plan-arrow)\"/>",
                       num(x1), num(y1), num(x2), num(y2));
      s += fmt::format("<text x=\"{}\" y=\"{}\" font-size=\"10\" text-anchor=\"middle\" "
                       "paint-order=\"stroke\" stroke=\"#ffffff\" stroke-width=\"3\">1:{:g}</text>",
                       num(x2 + ux * 14.0), num(y2 + uy * 14.0 + 3.5), pile.batter->ratio);
    }
    s += "</g>\n";
  }
  s += "</g>\n";

  // Load points (columns, self-weight), tagged L1, L2 … and listed under the plan.
  std::vector<std::string> point_labels;
  s += "<g class=\"loads\">\n";
  for (std::size_t k = 0; k < points.size(); ++k) {
    const LoadPoint& lp = points[k];
    const double x = X(lp.x), y = Y(lp.y);
    std::string label;
    for (const auto& line : load_point_lines(p, k, lp))
      label += (label.empty() ? "" : " ") + line.substr(line.find_first_not_of(' '));
    point_labels.push_back(label);
    s += fmt::format("<g class=\"load-point\"><title>{}</title>"
                     "<circle cx=\"{}\" cy=\"{}\" r=\"6\" fill=\"none\" stroke=\"#1f4e9a\" stroke-width=\"1.6\"/>"
                     "<path d=\"M{},{} h12 M{},{} v12\" stroke=\"#1f4e9a\" stroke-width=\"1.6\"/>"
                     "<text x=\"{}\" y=\"{}\" fill=\"#1f4e9a\" font-size=\"11\" font-weight=\"bold\" "
                     "paint-order=\"stroke\" stroke=\"#ffffff\" stroke-width=\"3\">L{}</text></g>\n",
                     xml_escape(point_labels.back()), num(x), num(y), num(x - 6), num(y), num(x),
                     num(y - 6), num(x + 7), num(y - 7), k + 1);
  }
  s += "</g>\n";

  // The origin on top of everything: a small cross in a ring.
  s += fmt::format("<g class=\"origin\"><title>origin (0, 0)</title><circle cx=\"{0}\" cy=\"{1}\" "
                   "r=\"6\" fill=\"none\" stroke=\"#000000\" stroke-width=\"1.2\"/><circle "
                   "id=\"origin\" cx=\"{0}\" cy=\"{1}\" r=\"2.5\" fill=\"#000000\"/></g>\n",
                   num(ox), num(oy));

  // Scale bar in the project's length unit, about a quarter of the plan's width.
  const double legend_top = f.height - kLegendHeight - kLegendLine * legend.size() + 8.0;
  const double bar_units = nice_length((f.width - 2.0 * kMargin) / 4.0 / f.scale / to_m);
  const double bar_px = bar_units * to_m * f.scale;
  const double bx = 20.0, by = legend_top + 10.0;
  s += fmt::format("<g class=\"scale-bar\"><rect id=\"scale-bar\" x=\"{}\" y=\"{}\" width=\"{}\" "
                   "height=\"6\" fill=\"#222222\" data-length=\"{:g}\" data-unit=\"{}\"/>",
                   num(bx), num(by), num(bar_px), bar_units, length_unit);
  s += fmt::format("<rect x=\"{}\" y=\"{}\" width=\"{}\" height=\"6\" fill=\"#ffffff\" "
                   "stroke=\"#222222\"/>",
                   num(bx + bar_px / 2.0), num(by), num(bar_px / 2.0));
  s += fmt::format("<text x=\"{}\" y=\"{}\" text-anchor=\"middle\">0</text>", num(bx), num(by + 20));
  s += fmt::format("<text x=\"{}\" y=\"{}\" text-anchor=\"middle\">{} {}</text></g>\n",
                   num(bx + bar_px), num(by + 20), nice_number_text(bar_units), length_unit);

  // The colour bar of the utilization scale, 0 to scale_max, with 1.0 marked.
  const double lx = std::max(bx + bar_px + 40.0, 170.0);
  const double cbx = lx + 100.0;
  const double cbw = std::clamp(f.width - 30.0 - cbx, 120.0, 300.0);
  auto at = [&](double u) { return cbx + cbw * u / scale_max; };
  s += "<g class=\"legend\">";
  if (results) {
    s += fmt::format("<text x=\"{}\" y=\"{}\">max utilization</text>", num(lx), num(by + 8));
    s += "<defs><linearGradient id=\"utilization-scale\" x1=\"0\" y1=\"0\" x2=\"1\" y2=\"0\">";
    for (int k = 0; k <= 8; ++k)
      s += fmt::format("<stop offset=\"{}\" stop-color=\"{}\"/>", general_text(k / 8.0),
                       utilization_colour(scale_max * k / 8.0, scale_max));
    s += "</linearGradient></defs>";
    s += fmt::format("<rect class=\"colour-bar\" x=\"{}\" y=\"{}\" width=\"{}\" height=\"12\" "
                     "fill=\"url(#utilization-scale)\" stroke=\"#222222\" data-min=\"0\" "
                     "data-max=\"{}\"/>",
                     num(cbx), num(by - 2), num(cbw), fixed_text(scale_max, 3));
    auto tick = [&](double u, const std::string& label, bool strong) {
      s += fmt::format("<line x1=\"{0}\" y1=\"{1}\" x2=\"{0}\" y2=\"{2}\" stroke=\"#000000\" "
                       "stroke-width=\"{3}\"/><text x=\"{0}\" y=\"{4}\" text-anchor=\"middle\"{5}>{6}"
                       "</text>",
                       num(at(u)), num(by - (strong ? 6 : 2)), num(by + (strong ? 14 : 12)),
                       strong ? "2.5" : "1", num(by + 25), strong ? " font-weight=\"bold\"" : "",
                       xml_escape(label));
    };
    tick(0.0, "0", false);
    tick(0.5, "0.5", false);
    tick(1.0, "1.0", true);
    tick(scale_max, fixed_text(scale_max, 2), false);
  } else {
    s += fmt::format("<rect x=\"{}\" y=\"{}\" width=\"14\" height=\"14\" fill=\"{}\" "
                     "stroke=\"#222222\"/><text x=\"{}\" y=\"{}\">not checked</text>",
                     num(lx), num(by - 3), kUncheckedColour, num(lx + 18), num(by + 8));
  }
  // The key of the failing-pile mark.
  const double fy = by + 40.0;
  if (results) {
    s += fmt::format("<rect x=\"26\" y=\"{}\" width=\"14\" height=\"14\" fill=\"#ffffff\" "
                     "stroke=\"#000000\" stroke-width=\"3.5\"/>",
                     num(fy - 11));
    s += failing_cross(33.0, fy - 4.0, 14.0);
    s += fmt::format("<text x=\"50\" y=\"{}\" font-size=\"10.5\">fails in some combination "
                     "(utilization over 1.0, a demand with no capacity, or the cap overturns): "
                     "bold outline and a cross</text>",
                     num(fy));
  }
  s += "</g>\n";
  if (results)
    s += fmt::format("<text x=\"20\" y=\"{}\" font-size=\"10.5\" fill=\"#444444\">Colour: each "
                     "pile's largest utilization over all combinations, on a continuous scale "
                     "from 0 to {} (viridis, van der Walt &amp; Smith 2015).</text>\n",
                     num(fy + 18), fixed_text(scale_max, 2));
  s += fmt::format("<text x=\"20\" y=\"{}\" font-size=\"10.5\" fill=\"#444444\">Piles drawn at "
                   "their section size; arrows show the batter direction of the toe, length "
                   "∝ 1/ratio; ⊕ load points; ◉ the origin (0, 0).</text>\n",
                   num(fy + 32));
  s += fmt::format("<text x=\"20\" y=\"{}\" font-size=\"10.5\" fill=\"#444444\">Plan to scale, "
                   "coordinates in {}, +x right, +y up. Loads at each point, by load case:</text>\n",
                   num(fy + 46), length_unit);
  for (std::size_t k = 0; k < legend.size(); ++k)
    s += fmt::format("<text x=\"20\" y=\"{}\" font-size=\"10.5\" fill=\"#1f4e9a\" "
                     "xml:space=\"preserve\">{}</text>\n",
                     num(fy + 46 + kLegendLine * (k + 1)), xml_escape(legend[k]));
  // An overturned combination, at a glance: a banner across the top of the drawing.
  if (!overturned.empty())
    s += fmt::format("<g class=\"overturned\"><rect x=\"8\" y=\"6\" width=\"{}\" height=\"22\" "
                     "fill=\"#fbe9e7\" stroke=\"#b3261e\" stroke-width=\"2\"/><text x=\"{}\" "
                     "y=\"21\" text-anchor=\"middle\" font-weight=\"bold\" fill=\"#b3261e\">The cap "
                     "overturns in {}: no equilibrium, no pile forces; every pile fails.</text></g>\n",
                     num(f.width - 16.0), num(f.width / 2.0), xml_escape(overturned));
  s += "</svg>\n";
  return s;
}

}  // namespace cairn
