#include "cairn/output/charts.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>

#include <fmt/format.h>

#include "cairn/core/quantity_format.hpp"
#include "cairn/output/markup.hpp"

namespace cairn {
namespace {

// The drawing: 640 px wide (the column of the package at 100 %), the plot inside margins
// that hold the tick labels and axis titles.
constexpr double kWidth = 640.0;
constexpr double kLeft = 78.0;  // px, left edge of the plot: depth ticks and axis title
constexpr double kTop = 58.0;   // px, top of the plot: value ticks and axis title above
constexpr double kPlotWidth = 520.0;
constexpr double kPlotHeight = 400.0;
constexpr double kLine = 16.0;             // px, one legend or caption line
constexpr std::size_t kCaptionChars = 96;  // about one line of 11 px text in 600 px

// Series styles: a dash pattern each, so the lines part in black-and-white print; the inks
// only help on screen (dark enough to print as near-black).
constexpr const char* kDash[kSeriesStyles] = {"", "9 4", "2 3", "12 3 2 3", "5 5"};
constexpr const char* kInk[kSeriesStyles] = {"#000000", "#1f4e9a", "#b3261e", "#1e7b34", "#6a3d9a"};

std::string num(double v) { return fixed_text(v, 2); }  // px, no "-0.00"

// Rounds away the binary noise of k·step (0.30000000000000004 → 0.3).
double tick_value(long long k, double step) {
  const double v = static_cast<double>(k) * step;
  const double unit = std::pow(10.0, std::floor(std::log10(step)) - 6.0);
  return std::round(v / unit) * unit;
}

double next_nice(double step) {
  const double power = std::pow(10.0, std::floor(std::log10(step) + 1e-9));
  const double m = step / power;
  return (m < 1.5 ? 2.0 : m < 3.5 ? 5.0 : 10.0) * power;
}

std::string dash_attribute(std::size_t k) {
  const char* dash = kDash[k % kSeriesStyles];
  return *dash ? fmt::format(" stroke-dasharray=\"{}\"", dash) : std::string();
}

std::string series_stroke(std::size_t k) {
  // A second round of the patterns is drawn thinner, so that it still differs.
  return fmt::format("stroke=\"{}\" stroke-width=\"{}\"{}", kInk[k % kSeriesStyles],
                     k < kSeriesStyles ? "2" : "1.2", dash_attribute(k));
}

// `text` in lines of about `width` characters, broken at spaces.
std::vector<std::string> wrap(const std::string& text, std::size_t width) {
  std::vector<std::string> lines;
  std::string line, word;
  auto flush_word = [&] {
    if (word.empty()) return;
    if (!line.empty() && line.size() + 1 + word.size() > width) {
      lines.push_back(line);
      line.clear();
    }
    line += (line.empty() ? "" : " ") + word;
    word.clear();
  };
  for (char c : text) {
    if (c == ' ' || c == '\n')
      flush_word();
    else
      word += c;
  }
  flush_word();
  if (!line.empty()) lines.push_back(line);
  return lines;
}

// A linear map from a displayed value range onto a pixel range.
struct Axis {
  std::vector<double> ticks;  // displayed unit
  double px0 = 0.0, px1 = 1.0;
  double lo() const { return ticks.front(); }
  double hi() const { return ticks.back(); }
  double step() const { return ticks.size() > 1 ? ticks[1] - ticks[0] : 1.0; }
  double operator()(double v) const { return px0 + (px1 - px0) * (v - lo()) / (hi() - lo()); }
};

// The SVG's opening, title, description and white page.
std::string open_svg(const char* cls, double height, const std::string& title,
                     const std::string& desc, const std::string& data) {
  std::string s = fmt::format(
      "<svg xmlns=\"http://www.w3.org/2000/svg\" class=\"chart {0}\" width=\"{1}\" "
      "height=\"{2}\" viewBox=\"0 0 {1} {2}\" font-family=\"Helvetica, Arial, sans-serif\" "
      "font-size=\"11\" role=\"img\"{3}>\n",
      cls, num(kWidth), num(height), data);
  s += "<title>" + xml_escape(title) + "</title>\n";
  s += "<desc>" + xml_escape(desc) + "</desc>\n";
  s += fmt::format("<rect x=\"0\" y=\"0\" width=\"{}\" height=\"{}\" fill=\"#ffffff\"/>\n",
                   num(kWidth), num(height));
  return s;
}

// Grid, frame, tick labels and axis titles. The x ticks go above the plot when `x_on_top`
// (depth charts: depth grows downward from the top edge), else below.
std::string axes(const Axis& x, const Axis& y, bool x_on_top, const std::string& x_title,
                 const std::string& y_title) {
  const double left = std::min(x.px0, x.px1), right = std::max(x.px0, x.px1);
  const double top = std::min(y.px0, y.px1), bottom = std::max(y.px0, y.px1);
  std::string s = "<g class=\"grid\" stroke=\"#d0d0d0\" stroke-width=\"0.8\">\n";
  for (double v : x.ticks)
    s += fmt::format("<line x1=\"{0}\" y1=\"{1}\" x2=\"{0}\" y2=\"{2}\"/>\n", num(x(v)), num(top),
                     num(bottom));
  for (double v : y.ticks)
    s += fmt::format("<line x1=\"{1}\" y1=\"{0}\" x2=\"{2}\" y2=\"{0}\"/>\n", num(y(v)), num(left),
                     num(right));
  s += "</g>\n";
  s += fmt::format(
      "<rect class=\"frame\" x=\"{}\" y=\"{}\" width=\"{}\" height=\"{}\" "
      "fill=\"none\" stroke=\"#000000\" stroke-width=\"1\"/>\n",
      num(left), num(top), num(right - left), num(bottom - top));
  s += "<g class=\"ticks\" fill=\"#000000\">\n";
  const double tick_y = x_on_top ? top - 6.0 : bottom + 15.0;
  for (double v : x.ticks)
    s += fmt::format("<text x=\"{}\" y=\"{}\" text-anchor=\"middle\">{}</text>\n", num(x(v)),
                     num(tick_y), tick_text(v, x.step()));
  for (double v : y.ticks)
    s += fmt::format("<text x=\"{}\" y=\"{}\" text-anchor=\"end\">{}</text>\n", num(left - 6.0),
                     num(y(v) + 4.0), tick_text(v, y.step()));
  s += "</g>\n";
  const double title_y = x_on_top ? top - 26.0 : bottom + 34.0;
  s += fmt::format(
      "<text class=\"axis-label\" x=\"{}\" y=\"{}\" text-anchor=\"middle\" "
      "font-size=\"12\">{}</text>\n",
      num((left + right) / 2.0), num(title_y), xml_escape(x_title));
  const double ty = (top + bottom) / 2.0;
  s += fmt::format(
      "<text class=\"axis-label\" x=\"20\" y=\"{0}\" text-anchor=\"middle\" "
      "font-size=\"12\" transform=\"rotate(-90 20 {0})\">{1}</text>\n",
      num(ty), xml_escape(y_title));
  return s;
}

// A path through (x[i], y[i]) in px; a non-finite point breaks the line.
std::string path_data(const std::vector<double>& xs, const std::vector<double>& ys) {
  std::string d;
  bool pen_down = false;
  for (std::size_t i = 0; i < xs.size() && i < ys.size(); ++i) {
    if (!std::isfinite(xs[i]) || !std::isfinite(ys[i])) {
      pen_down = false;
      continue;
    }
    d += fmt::format("{}{},{}", d.empty() ? "M" : pen_down ? " L" : " M", num(xs[i]), num(ys[i]));
    pen_down = true;
  }
  return d;
}

struct ProfileView {
  Shown shown;
  const char* cls;
  const char* name;       // in the title and description
  const char* axis_name;  // before the unit in the axis title
  const std::vector<double>& (*values)(const PileProfile&);
};

ProfileView profile_view(ProfileQuantity what) {
  switch (what) {
    case ProfileQuantity::deflection:
      return {Shown::displacement, "deflection", "Deflection", "deflection across the pile",
              [](const PileProfile& p) -> const std::vector<double>& { return p.deflection; }};
    case ProfileQuantity::moment:
      return {Shown::moment, "moment", "Bending moment", "bending moment",
              [](const PileProfile& p) -> const std::vector<double>& { return p.moment; }};
    case ProfileQuantity::shear:
      return {Shown::force, "shear", "Shear force", "shear force",
              [](const PileProfile& p) -> const std::vector<double>& { return p.shear; }};
  }
  throw std::logic_error("profile_view: unknown quantity");
}

std::string series_name(const GoverningPileProfile& g) {
  return "pile " + g.pile + (g.combination.empty() ? std::string() : " (" + g.combination + ")");
}

// Whether the profile's largest moment can be marked (finite value and depth).
bool marked(const PileProfile& p) {
  return std::isfinite(p.max_moment) && std::isfinite(p.max_moment_depth);
}

// The y of each marker's label: at its marker, moved down where it would sit closer than
// `gap` px to the label above it, so that labels at the same depth do not overprint.
std::vector<double> label_rows(const std::vector<double>& wanted, double gap) {
  std::vector<std::size_t> order(wanted.size());
  for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
  std::stable_sort(order.begin(), order.end(),
                   [&](std::size_t a, std::size_t b) { return wanted[a] < wanted[b]; });
  std::vector<double> rows(wanted.size());
  double last = -std::numeric_limits<double>::infinity();
  for (std::size_t i : order) {
    rows[i] = std::max(wanted[i], last + gap);
    last = rows[i];
  }
  return rows;
}

bool drawable(const GoverningPileProfile& g, const ProfileView& view) {
  return g.profile.converged && !g.profile.depth.empty() && !view.values(g.profile).empty();
}

}  // namespace

double nice_tick_step(double span, int intervals) {
  if (!(span > 0.0) || !std::isfinite(span) || intervals < 1)
    throw std::invalid_argument("nice_tick_step: needs a positive finite span and intervals >= 1");
  const double raw = span / intervals;
  const double power = std::pow(10.0, std::floor(std::log10(raw)));
  const double m = raw / power;
  constexpr double tol = 1.0 + 1e-12;  // 0.6/6 is 0.09999…: still a step of 0.1
  return (m <= 1.0 * tol ? 1.0 : m <= 2.0 * tol ? 2.0 : m <= 5.0 * tol ? 5.0 : 10.0) * power;
}

std::vector<double> nice_ticks(double low, double high, int intervals) {
  if (!std::isfinite(low) || !std::isfinite(high) || intervals < 1)
    throw std::invalid_argument("nice_ticks: needs finite ends and intervals >= 1");
  if (high < low) std::swap(low, high);
  if (high - low <= 1e-12 * std::max(std::abs(low), std::abs(high))) {
    if (low == 0.0 && high == 0.0) {
      low = 0.0, high = 1.0;
    } else {
      const double mid = (low + high) / 2.0;
      low = mid - 1.0, high = mid + 1.0;
      if (std::abs(mid) > 1.0) low = mid - std::abs(mid) * 0.1, high = mid + std::abs(mid) * 0.1;
    }
  }
  double step = nice_tick_step(high - low, intervals);
  for (;;) {
    const auto first = static_cast<long long>(std::floor(low / step + 1e-9));
    const auto last = static_cast<long long>(std::ceil(high / step - 1e-9));
    if (last - first <= intervals) {
      std::vector<double> ticks;
      for (long long k = first; k <= last; ++k) ticks.push_back(tick_value(k, step));
      if (ticks.size() == 1) ticks.push_back(tick_value(last + 1, step));
      return ticks;
    }
    step = next_nice(step);
  }
}

std::string tick_text(double value, double step) {
  const int decimals =
      step > 0.0 ? std::clamp(static_cast<int>(-std::floor(std::log10(step) + 1e-9)), 0, 12) : 0;
  return fixed_text(value, decimals);
}

std::string render_profile_chart_svg(ProfileQuantity what,
                                     const std::vector<GoverningPileProfile>& piles,
                                     UnitSystem units) {
  const ProfileView view = profile_view(what);
  const QuantityFormat shown(units);
  std::vector<const GoverningPileProfile*> drawn;
  for (const auto& g : piles)
    if (drawable(g, view)) drawn.push_back(&g);
  if (drawn.empty()) return "";

  // Ranges in the displayed units; the value axis always holds 0 (the zero line).
  double vmin = 0.0, vmax = 0.0, dmax = 0.0;
  for (const auto* g : drawn) {
    const auto& values = view.values(g->profile);
    const auto& depth = g->profile.depth;
    for (std::size_t i = 0; i < values.size() && i < depth.size(); ++i) {
      if (!std::isfinite(values[i]) || !std::isfinite(depth[i])) continue;
      vmin = std::min(vmin, shown.value(view.shown, values[i]));
      vmax = std::max(vmax, shown.value(view.shown, values[i]));
      dmax = std::max(dmax, shown.value(Shown::depth, depth[i]));
    }
    // The marked maximum lies inside the plot even where the solver found it between points.
    if (what == ProfileQuantity::moment && marked(g->profile)) {
      vmin = std::min(vmin, shown.value(Shown::moment, g->profile.max_moment));
      vmax = std::max(vmax, shown.value(Shown::moment, g->profile.max_moment));
      dmax = std::max(dmax, shown.value(Shown::depth, g->profile.max_moment_depth));
    }
  }
  Axis x{nice_ticks(vmin, vmax, 8), kLeft, kLeft + kPlotWidth};
  Axis y{nice_ticks(0.0, dmax, 8), kTop, kTop + kPlotHeight};

  const std::string value_unit = shown.label(view.shown);
  const std::string depth_unit = shown.label(Shown::depth);
  const bool marks = what == ProfileQuantity::moment;
  std::vector<std::string> names;
  for (const auto* g : drawn) names.push_back(series_name(*g));

  std::string title = std::string(view.name) + " with depth, ";
  for (std::size_t k = 0; k < names.size(); ++k) title += (k ? ", " : "") + names[k];
  std::string desc = fmt::format(
      "{} of {} against depth below the pile head (down, {}), from the nonlinear analysis; "
      "values across in {}.",
      view.name, drawn.size() == 1 ? "one pile" : std::to_string(drawn.size()) + " piles",
      depth_unit, value_unit);
  if (marks)
    for (const auto* g : drawn)
      if (marked(g->profile))
        desc += fmt::format(" Pile {}: largest moment {} at {} depth.", g->pile,
                            shown.text(Shown::moment, g->profile.max_moment),
                            shown.text(Shown::depth, g->profile.max_moment_depth));

  const double legend_top = kTop + kPlotHeight + 26.0;
  const double height = legend_top + kLine * static_cast<double>(drawn.size()) + 14.0;
  std::string s = open_svg(
      view.cls, height, title, desc,
      fmt::format(" data-plot=\"{} {} {} {}\" data-value-axis=\"{} {}\" data-depth-axis=\"{} {}\"",
                  num(kLeft), num(kTop), num(kPlotWidth), num(kPlotHeight), general_text(x.lo()),
                  general_text(x.hi()), general_text(y.lo()), general_text(y.hi())));
  s += axes(x, y, true, fmt::format("{} ({})", view.axis_name, value_unit),
            fmt::format("depth below the pile head ({})", depth_unit));
  // The zero line, heavier than the grid.
  s += fmt::format(
      "<line class=\"zero\" x1=\"{0}\" y1=\"{1}\" x2=\"{0}\" y2=\"{2}\" "
      "stroke=\"#000000\" stroke-width=\"1.2\"/>\n",
      num(x(0.0)), num(kTop), num(kTop + kPlotHeight));

  for (std::size_t k = 0; k < drawn.size(); ++k) {
    const PileProfile& p = drawn[k]->profile;
    const auto& values = view.values(p);
    std::vector<double> xs, ys;
    for (std::size_t i = 0; i < values.size() && i < p.depth.size(); ++i) {
      xs.push_back(x(shown.value(view.shown, values[i])));
      ys.push_back(y(shown.value(Shown::depth, p.depth[i])));
    }
    s += fmt::format(
        "<path class=\"series\" data-series=\"{}\" d=\"{}\" fill=\"none\" "
        "stroke-linejoin=\"round\" {}><title>{}</title></path>\n",
        attribute_escape(names[k]), path_data(xs, ys), series_stroke(k), xml_escape(names[k]));
  }

  // The largest moment of each pile: a ring on the curve, its value and depth beside it.
  if (marks) {
    std::vector<double> wanted;
    for (const auto* g : drawn)
      wanted.push_back(marked(g->profile)
                           ? y(shown.value(Shown::depth, g->profile.max_moment_depth)) + 4.0
                           : 0.0);
    const std::vector<double> rows = label_rows(wanted, 13.0);
    for (std::size_t k = 0; k < drawn.size(); ++k) {
      const PileProfile& p = drawn[k]->profile;
      if (!marked(p)) continue;
      const double mx = x(shown.value(Shown::moment, p.max_moment));
      const double my = y(shown.value(Shown::depth, p.max_moment_depth));
      const std::string label =
          fmt::format("{}: max {} at {}", drawn[k]->pile, shown.text(Shown::moment, p.max_moment),
                      shown.text(Shown::depth, p.max_moment_depth));
      const bool left_of = mx > kLeft + kPlotWidth * 0.6;
      s += fmt::format(
          "<g class=\"max-moment\" data-pile=\"{}\" data-moment=\"{}\" data-depth=\"{}\">"
          "<circle cx=\"{}\" cy=\"{}\" r=\"4.5\" fill=\"#ffffff\" stroke=\"{}\" "
          "stroke-width=\"2\"/>"
          "<text x=\"{}\" y=\"{}\" text-anchor=\"{}\" font-weight=\"bold\" paint-order=\"stroke\" "
          "stroke=\"#ffffff\" stroke-width=\"3\">{}</text></g>\n",
          attribute_escape(drawn[k]->pile), shown.number(Shown::moment, p.max_moment),
          shown.number(Shown::depth, p.max_moment_depth), num(mx), num(my), kInk[k % kSeriesStyles],
          num(left_of ? mx - 8.0 : mx + 8.0), num(rows[k]), left_of ? "end" : "start",
          xml_escape(label));
    }
  }

  // Legend: a sample of each line and its name (with the largest moment on the moment chart).
  s += "<g class=\"legend\">\n";
  for (std::size_t k = 0; k < drawn.size(); ++k) {
    const double ly = legend_top + kLine * static_cast<double>(k);
    std::string text = names[k];
    if (marks && marked(drawn[k]->profile))
      text += fmt::format(": max {} at {}", shown.text(Shown::moment, drawn[k]->profile.max_moment),
                          shown.text(Shown::depth, drawn[k]->profile.max_moment_depth));
    s += fmt::format(
        "<line x1=\"{0}\" y1=\"{1}\" x2=\"{2}\" y2=\"{1}\" {3}/><text x=\"{4}\" "
        "y=\"{5}\">{6}</text>\n",
        num(kLeft), num(ly), num(kLeft + 40.0), series_stroke(k), num(kLeft + 48.0), num(ly + 4.0),
        xml_escape(text));
  }
  s += "</g>\n</svg>\n";
  return s;
}

PushoverMarks pushover_marks(const PushoverCurve& curve) {
  PushoverMarks m;
  const auto& pts = curve.points;
  for (auto it = pts.rbegin(); it != pts.rend(); ++it)
    if (it->load_factor > 0.0 && std::isfinite(it->load)) {
      m.factored_load = it->load / it->load_factor;
      break;
    }
  for (std::size_t i = 0; i + 1 < pts.size(); ++i) {
    const double a = pts[i].load_factor, b = pts[i + 1].load_factor;
    if (a <= 1.0 && b >= 1.0 && b > a) {
      const double t = (1.0 - a) / (b - a);
      m.factored_displacement =
          pts[i].displacement + t * (pts[i + 1].displacement - pts[i].displacement);
      break;
    }
  }
  if (!m.factored_displacement)
    for (const auto& p : pts)
      if (p.load_factor == 1.0) m.factored_displacement = p.displacement;
  if (curve.capacity_factor > 0.0) {
    const double limit = curve.capacity_factor * (1.0 + 1e-9);
    for (std::size_t i = 0; i < pts.size(); ++i)
      if (pts[i].load_factor <= limit &&
          (!m.capacity_point || pts[i].load_factor >= pts[*m.capacity_point].load_factor))
        m.capacity_point = i;
  }
  return m;
}

std::string pushover_end_text(const PushoverCurve& curve) {
  const std::string why = curve.end_reason.empty() ? std::string() : ": " + curve.end_reason;
  return curve.mechanism
             ? "The curve ends at a mechanism, where the next load step found no equilibrium" + why
             : "The curve ends at a stated limit" + why;
}

std::string render_pushover_chart_svg(const PushoverCurve& curve, UnitSystem units) {
  std::vector<const PushoverPoint*> pts;
  for (const auto& p : curve.points)
    if (std::isfinite(p.displacement) && std::isfinite(p.load)) pts.push_back(&p);
  if (pts.size() < 2) return "";
  const QuantityFormat shown(units);
  const PushoverMarks marks = pushover_marks(curve);

  double xmin = 0.0, xmax = 0.0, ymin = 0.0, ymax = 0.0;
  for (const auto* p : pts) {
    xmin = std::min(xmin, shown.value(Shown::displacement, p->displacement));
    xmax = std::max(xmax, shown.value(Shown::displacement, p->displacement));
    ymin = std::min(ymin, shown.value(Shown::force, p->load));
    ymax = std::max(ymax, shown.value(Shown::force, p->load));
  }
  if (marks.factored_load) ymax = std::max(ymax, shown.value(Shown::force, *marks.factored_load));
  const double bottom = kTop + kPlotHeight;
  Axis x{nice_ticks(xmin, xmax, 7), kLeft, kLeft + kPlotWidth};
  Axis y{nice_ticks(ymin, ymax, 6), bottom, kTop};

  const bool vertical = std::abs(curve.direction[2]) > 0.99;
  const std::string load_name = vertical ? "vertical load" : "horizontal load";
  const std::string disp_unit = shown.label(Shown::displacement);
  const std::string force_unit = shown.label(Shown::force);
  const std::string end_text = pushover_end_text(curve);
  const std::string lambda_cap = QuantityFormat::factor(curve.capacity_factor);

  std::string factored_text, capacity_text;
  if (marks.factored_load) {
    factored_text = "factored load (λ = 1): " + shown.text(Shown::force, *marks.factored_load);
    factored_text += marks.factored_displacement
                         ? " at " + shown.text(Shown::displacement, *marks.factored_displacement)
                         : ", not reached";
  }
  if (marks.capacity_point) {
    const PushoverPoint& c = curve.points[*marks.capacity_point];
    capacity_text =
        fmt::format("capacity λ = {}: {} at {}", lambda_cap, shown.text(Shown::force, c.load),
                    shown.text(Shown::displacement, c.displacement));
  }
  const std::string title = "Load–displacement (pushover) curve of the group" +
                            (curve.combination.empty() ? std::string() : ", " + curve.combination);
  std::string desc = fmt::format(
      "The {} ({}) against the cap's displacement along it ({}) as "
      "the combination's loads grow by the factor λ.",
      load_name, force_unit, disp_unit);
  if (!factored_text.empty()) desc += " Marked: the " + factored_text + ".";
  if (!capacity_text.empty()) desc += " Marked: the " + capacity_text + ".";
  desc += " " + end_text + ".";

  const std::vector<std::string> caption = wrap(end_text + ".", kCaptionChars);
  const double legend_top = bottom + 56.0;
  const double height = legend_top + kLine * (2.0 + static_cast<double>(caption.size())) + 10.0;
  std::string s = open_svg(
      "pushover", height, title, desc,
      fmt::format(" data-plot=\"{} {} {} {}\" data-x-axis=\"{} {}\" data-y-axis=\"{} {}\"",
                  num(kLeft), num(kTop), num(kPlotWidth), num(kPlotHeight), general_text(x.lo()),
                  general_text(x.hi()), general_text(y.lo()), general_text(y.hi())));
  s += axes(x, y, false, fmt::format("cap displacement along the load ({})", disp_unit),
            fmt::format("{} ({})", load_name, force_unit));
  std::vector<double> xs, ys;
  for (const auto* p : pts) {
    xs.push_back(x(shown.value(Shown::displacement, p->displacement)));
    ys.push_back(y(shown.value(Shown::force, p->load)));
  }
  s += fmt::format(
      "<path class=\"series\" data-series=\"pushover\" d=\"{}\" fill=\"none\" "
      "stroke=\"#000000\" stroke-width=\"2\" stroke-linejoin=\"round\"/>\n",
      path_data(xs, ys));
  for (std::size_t i = 0; i < xs.size(); ++i)
    s += fmt::format("<circle class=\"step\" cx=\"{}\" cy=\"{}\" r=\"1.8\" fill=\"#000000\"/>\n",
                     num(xs[i]), num(ys[i]));

  // λ = 1: a dashed level across the plot, and a ring where the curve reaches it.
  if (marks.factored_load) {
    const double fy = y(shown.value(Shown::force, *marks.factored_load));
    s += fmt::format(
        "<g class=\"factored\" data-load=\"{0}\"><line x1=\"{1}\" y1=\"{2}\" "
        "x2=\"{3}\" y2=\"{2}\" stroke=\"#000000\" stroke-width=\"1.2\" "
        "stroke-dasharray=\"7 4\"/>",
        shown.number(Shown::force, *marks.factored_load), num(kLeft), num(fy),
        num(kLeft + kPlotWidth));
    if (marks.factored_displacement)
      s += fmt::format(
          "<circle cx=\"{}\" cy=\"{}\" r=\"5\" fill=\"#ffffff\" stroke=\"#000000\" "
          "stroke-width=\"2\" data-displacement=\"{}\"/>",
          num(x(shown.value(Shown::displacement, *marks.factored_displacement))), num(fy),
          shown.number(Shown::displacement, *marks.factored_displacement));
    s += fmt::format(
        "<text x=\"{}\" y=\"{}\" text-anchor=\"end\" paint-order=\"stroke\" "
        "stroke=\"#ffffff\" stroke-width=\"3\">{}</text></g>\n",
        num(kLeft + kPlotWidth - 6.0), num(fy + 14.0), xml_escape(factored_text));
  }
  // The capacity: a filled square on the last point with equilibrium.
  if (marks.capacity_point) {
    const PushoverPoint& c = curve.points[*marks.capacity_point];
    const double cx = x(shown.value(Shown::displacement, c.displacement));
    const double cy = y(shown.value(Shown::force, c.load));
    s += fmt::format(
        "<g class=\"capacity\" data-load-factor=\"{}\" data-load=\"{}\"><rect x=\"{}\" "
        "y=\"{}\" width=\"10\" height=\"10\" fill=\"#000000\"/><text x=\"{}\" y=\"{}\" "
        "text-anchor=\"end\" font-weight=\"bold\" paint-order=\"stroke\" "
        "stroke=\"#ffffff\" stroke-width=\"3\">{}</text></g>\n",
        lambda_cap, shown.number(Shown::force, c.load), num(cx - 5.0), num(cy - 5.0),
        num(std::max(cx - 10.0, kLeft + 200.0)), num(cy - 10.0), xml_escape(capacity_text));
  }
  // Key and caption under the plot.
  s += "<g class=\"legend\">\n";
  double ly = legend_top;
  if (!factored_text.empty()) {
    s += fmt::format(
        "<line x1=\"{0}\" y1=\"{1}\" x2=\"{2}\" y2=\"{1}\" stroke=\"#000000\" "
        "stroke-width=\"1.2\" stroke-dasharray=\"7 4\"/><text x=\"{3}\" y=\"{4}\">"
        "{5}</text>\n",
        num(kLeft), num(ly), num(kLeft + 40.0), num(kLeft + 48.0), num(ly + 4.0),
        xml_escape(factored_text));
    ly += kLine;
  }
  if (!capacity_text.empty()) {
    s += fmt::format(
        "<rect x=\"{}\" y=\"{}\" width=\"10\" height=\"10\" fill=\"#000000\"/>"
        "<text x=\"{}\" y=\"{}\">{}</text>\n",
        num(kLeft + 15.0), num(ly - 5.0), num(kLeft + 48.0), num(ly + 4.0),
        xml_escape(capacity_text));
    ly += kLine;
  }
  s += "</g>\n<g class=\"caption\">\n";
  for (const auto& line : caption) {
    s += fmt::format("<text x=\"{}\" y=\"{}\" font-style=\"italic\">{}</text>\n", num(kLeft),
                     num(ly + 4.0), xml_escape(line));
    ly += kLine;
  }
  s += "</g>\n</svg>\n";
  return s;
}

}  // namespace cairn
