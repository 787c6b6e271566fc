#include "cairn/design/layouts.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include <fmt/format.h>

#include "cairn/core/plan.hpp"
#include "cairn/solver/cap_solver.hpp"

namespace cairn {
namespace {

constexpr double kPi = 3.14159265358979323846;

// Coordinates in the file's unit are kept to 0.1 mm (or 0.0001 ft): fine enough for any
// layout, short enough to print exactly.
double tidy(double v) {
  const double r = std::round(v * 1e4) / 1e4;
  return r == 0.0 ? 0.0 : r;
}

// Rounds a length up to a multiple of `step` (file units).
double up_to(double v, double step) { return tidy(std::ceil(v / step - 1e-9) * step); }

struct Context {
  const Project& project;
  const DesignSpec& spec;
  std::size_t type;
  double width;          // pile width, m
  double width_file;     // the same in the file's unit
  double edge;           // pile face to cap edge, m
  double edge_file;
  double step_file;      // spacing step, file unit
  double min_spacing;    // m
  double max_spacing;    // m
  std::array<double, 2> center_file;  // unshifted centroid
  double box_width = 0.0, box_length = 0.0;  // file unit: the outline limit's extents (or ∞)
  LayoutCounts& counts;
  std::vector<Layout>& out;
};

double to_si(const Context& c, double file_value) {
  return file_length_to_si(file_value, c.project.units);
}

// Finishes a layout from its pile heads in file units (relative to the centroid): applies
// the shift, converts, fits the cap, checks spacing and the outline; keeps it when it fits.
void finish(Context& c, Layout layout, std::vector<std::array<double, 2>> heads,
            std::vector<std::optional<double>> toward, double sx, double sy,
            std::array<double, 2> centre, bool octagon) {
  if (c.out.size() >= kMaxLayoutsPerType) {
    c.counts.truncated = true;
    return;
  }
  layout.type = c.type;
  layout.piles.clear();
  layout.piles_file.clear();
  for (std::size_t i = 0; i < heads.size(); ++i) {
    const double xf = tidy(heads[i][0] + centre[0]);
    const double yf = tidy(heads[i][1] + centre[1]);
    layout.piles_file.push_back({xf, yf});
    LayoutPile p;
    p.x = to_si(c, xf);
    p.y = to_si(c, yf);
    if (toward[i] && c.spec.batter_ratio) p.batter = Batter{*c.spec.batter_ratio, *toward[i]};
    layout.piles.push_back(p);
  }
  layout.battered = std::any_of(layout.piles.begin(), layout.piles.end(),
                                [](const LayoutPile& p) { return p.batter.has_value(); });
  // Cheap test first: the piles' extent with the edge distance must fit the limit's extents.
  if (c.project.cap.outline) {
    const auto [x0, x1, y0, y1] = bounding_box(layout.piles_file);
    const double reach = 2 * (c.width_file / 2 + c.edge_file);
    if (x1 - x0 + reach > c.box_width * (1 + 1e-9) || y1 - y0 + reach > c.box_length * (1 + 1e-9)) {
      ++c.counts.outside_outline;
      return;
    }
  }
  // Smallest centre-to-centre distance.
  double smallest = std::numeric_limits<double>::infinity();
  for (std::size_t i = 0; i < layout.piles.size(); ++i)
    for (std::size_t j = i + 1; j < layout.piles.size(); ++j)
      smallest = std::min(smallest, std::hypot(layout.piles[i].x - layout.piles[j].x,
                                               layout.piles[i].y - layout.piles[j].y));
  if (layout.piles.size() > 1) {
    if (smallest < c.min_spacing * (1 - 1e-9) || smallest > c.max_spacing * (1 + 1e-9)) {
      ++c.counts.spacing;
      return;
    }
    layout.spacing = smallest;
  }
  layout.spacing_x = to_si(c, sx);
  layout.spacing_y = to_si(c, sy);
  layout.shift_x = to_si(c, centre[0]);
  layout.shift_y = to_si(c, centre[1]);
  const double clear = c.width / 2 + c.edge;
  if (c.spec.outline_fixed) {
    layout.outline = *c.project.cap.outline;
    layout.outline_given = true;
    for (const auto& p : layout.piles)
      if (!layout.outline.contains(p.x, p.y) ||
          layout.outline.distance_to_edge(p.x, p.y) < clear * (1 - 1e-9)) {
        ++c.counts.outside_outline;
        return;
      }
  } else {
    const auto [x0, x1, y0, y1] = bounding_box(layout.piles_file);
    const double reach = c.width_file / 2 + c.edge_file;  // pile centre to cap edge
    Outline outline;
    if (octagon) {
      // Regular octagon whose inscribed circle clears every pile: apothem = ring radius +
      // pile half-width + edge distance, rounded up to the step.
      const double radius = std::max(x1 - centre[0], y1 - centre[1]);
      const double least = std::max(c.spec.min_cap_width, c.spec.min_cap_length) /
                           c.spec.layout_unit / 2;
      const double apothem = up_to(std::max(radius + reach, least), c.step_file);
      const double corner = apothem / std::cos(kPi / 8);
      layout.polygon_file.clear();
      for (int k = 0; k < 8; ++k) {
        const double a = kPi / 8 + k * kPi / 4;
        layout.polygon_file.push_back(
            {tidy(centre[0] + corner * std::cos(a)), tidy(centre[1] + corner * std::sin(a))});
      }
      outline.rectangle = false;
      for (const auto& p : layout.polygon_file)
        outline.polygon.push_back({to_si(c, p[0]), to_si(c, p[1])});
    } else {
      // The reader's rectangle: corners centre ± width/2, length/2, all in m.
      layout.width_file =
          up_to(std::max(x1 - x0 + 2 * reach, c.spec.min_cap_width / c.spec.layout_unit), c.step_file);
      layout.length_file =
          up_to(std::max(y1 - y0 + 2 * reach, c.spec.min_cap_length / c.spec.layout_unit), c.step_file);
      layout.center_x_file = tidy((x0 + x1) / 2);
      layout.center_y_file = tidy((y0 + y1) / 2);
      const double w = to_si(c, layout.width_file), l = to_si(c, layout.length_file);
      const double cx = to_si(c, layout.center_x_file), cy = to_si(c, layout.center_y_file);
      outline.polygon = {{cx - w / 2, cy - l / 2},
                         {cx + w / 2, cy - l / 2},
                         {cx + w / 2, cy + l / 2},
                         {cx - w / 2, cy + l / 2}};
    }
    if (c.project.cap.outline) {
      const Outline& limit = *c.project.cap.outline;
      const auto mid = outline.centroid();
      for (const auto& p : outline.polygon) {
        // Corners pulled 1 µm toward the middle: a cap exactly on the limit fits.
        const double dx = mid[0] - p[0], dy = mid[1] - p[1];
        const double d = std::hypot(dx, dy);
        const double k = d > 0 ? 1e-6 / d : 0.0;
        if (!limit.contains(p[0] + k * dx, p[1] + k * dy)) {
          ++c.counts.outside_outline;
          return;
        }
      }
    }
    layout.outline = outline;
  }
  c.out.push_back(std::move(layout));
}

// Batter direction of a grid pile from the sides of the grid it lies on (degrees), none
// for an inner pile.
std::optional<double> outward(bool left, bool right, bool bottom, bool top) {
  double dx = (right ? 1.0 : 0.0) - (left ? 1.0 : 0.0);
  double dy = (top ? 1.0 : 0.0) - (bottom ? 1.0 : 0.0);
  if (dx == 0.0 && dy == 0.0) return std::nullopt;
  double deg = std::atan2(dy, dx) * 180.0 / kPi;
  if (deg < 0) deg += 360.0;
  return tidy(deg);
}

void add_variants(Context& c, const Layout& layout, const std::vector<std::array<double, 2>>& heads,
                  const std::vector<std::optional<double>>& toward, double sx, double sy,
                  const std::vector<std::array<double, 2>>& centres, bool octagon) {
  const std::vector<std::optional<double>> vertical(heads.size());
  for (std::size_t k = 0; k < centres.size(); ++k) {
    Layout l = layout;
    l.shifted = k > 0;
    finish(c, l, heads, vertical, sx, sy, centres[k], octagon);
    const bool any = std::any_of(toward.begin(), toward.end(),
                                 [](const std::optional<double>& t) { return t.has_value(); });
    if (c.spec.batter_ratio && any) finish(c, l, heads, toward, sx, sy, centres[k], octagon);
  }
}

}  // namespace

double file_length_to_si(double value, UnitSystem units) {
  const auto parsed = parse_quantity(fmt::format("{}", value), Quantity::length, units);
  return parsed.si ? *parsed.si : value * to_si_factor(units, Quantity::length);
}

std::string Layout::describe() const {
  switch (family) {
    case Family::single: return "single pile";
    case Family::pair: return spacing_y > 0 ? "pair along y" : "pair along x";
    case Family::grid: return fmt::format("grid {}×{}", rows, columns);
    case Family::staggered: return fmt::format("staggered {} rows of {}/{}", rows, columns, columns - 1);
    case Family::ring: return fmt::format("ring of {}", columns);
    case Family::ring_centre: return fmt::format("ring of {} + centre", columns);
  }
  return "";
}

std::array<double, 2> resultant_point(const Project& project) {
  double best = 0.0;
  std::array<double, 2> point{0.0, 0.0};
  for (const auto& combo : project.combinations) {
    const Wrench w = combination_load(project, combo);
    if (w[2] < best) {  // downward load, Fz < 0
      best = w[2];
      point = {-w[4] / w[2], w[3] / w[2]};
    }
  }
  return point;
}

std::vector<Layout> generate_layouts(const Project& project, const DesignSpec& spec,
                                     std::size_t type, const std::array<double, 2>& toward_point,
                                     LayoutCounts& counts) {
  std::vector<Layout> out;
  const UnitSystem u = project.units;
  const double unit = to_si_factor(u, Quantity::length);
  const double width = project.pile_types[type].section.width;
  const double edge = spec.edge_distance.value_or(project.group.min_edge_distance);
  const double min_spacing =
      std::max({spec.min_spacing_factor * width, project.group.min_spacing_factor * width,
                project.group.min_spacing});
  const double max_spacing = std::max(spec.max_spacing_factor * width, min_spacing);
  std::array<double, 2> centre{0.0, 0.0};
  if (project.cap.outline) {
    const auto m = project.cap.outline->centroid();
    centre = {tidy(m[0] / unit), tidy(m[1] / unit)};
  }
  double box_width = 1e300, box_length = 1e300;
  if (project.cap.outline) {
    const auto [x0, x1, y0, y1] = bounding_box(project.cap.outline->polygon);
    box_width = (x1 - x0) / unit;
    box_length = (y1 - y0) / unit;
  }
  Context c{project, spec, type, width, width / unit, edge, edge / unit,
            spec.spacing_step / unit, min_spacing, max_spacing, centre, box_width, box_length,
            counts, out};
  // Whether a row of n piles at spacing s (file unit) can fit the outline limit at all.
  const double reach = width / unit + 2 * edge / unit;
  auto too_wide = [&](std::size_t n, double s, double limit) {
    return (static_cast<double>(n) - 1) * s + reach > limit * (1 + 1e-9);
  };
  // Spacings tried: multiples of the step from the smallest to the largest allowed.
  std::vector<double> spacings;
  const double step = c.step_file;
  for (long k = static_cast<long>(std::ceil(min_spacing / unit / step - 1e-9));
       k * step <= max_spacing / unit * (1 + 1e-9) && spacings.size() < 400; ++k)
    spacings.push_back(tidy(k * step));
  // Centres: the unshifted one, and the one moved toward the resultant (on the step grid).
  std::vector<std::array<double, 2>> centres = {centre};
  if (spec.shift_to_resultant) {
    const std::array<double, 2> target = {tidy(std::round(toward_point[0] / unit / step) * step),
                                          tidy(std::round(toward_point[1] / unit / step) * step)};
    if (std::hypot(target[0] - centre[0], target[1] - centre[1]) > step / 2) centres.push_back(target);
  }
  const std::size_t variants = centres.size() * (spec.batter_ratio ? 2 : 1);
  const std::size_t max_piles = spec.max_piles;
  auto has = [&](Family f) {
    return std::find(spec.families.begin(), spec.families.end(), f) != spec.families.end();
  };
  if (has(Family::single)) {
    Layout l;
    l.family = Family::single;
    l.rows = l.columns = 1;
    add_variants(c, l, {{0.0, 0.0}}, {std::nullopt}, 0.0, 0.0, centres, false);
  }
  if (has(Family::pair) && max_piles >= 2)
    for (double s : spacings) {
      Layout l;
      l.family = Family::pair;
      l.rows = 1;
      l.columns = 2;
      add_variants(c, l, {{-s / 2, 0.0}, {s / 2, 0.0}}, {180.0, 0.0}, s, 0.0, centres, false);
      l.rows = 2;
      l.columns = 1;
      add_variants(c, l, {{0.0, -s / 2}, {0.0, s / 2}}, {270.0, 90.0}, 0.0, s, centres, false);
    }
  // Rows of piles centred on the cap, rows sy apart and piles sx apart along a row: a grid has
  // cols piles in every row; a staggered layout cols and cols − 1 alternately, the short rows
  // centred between. A pile leans outward at the ends of a full row and in the first and last row.
  auto add_rows = [&](Family family, std::size_t rows, std::size_t cols, double sx, double sy) {
    Layout l;
    l.family = family;
    l.rows = rows;
    l.columns = cols;
    std::vector<std::array<double, 2>> heads;
    std::vector<std::optional<double>> toward;
    for (std::size_t i = 0; i < rows; ++i) {
      const bool full_row = family != Family::staggered || i % 2 == 0;
      const std::size_t m = full_row ? cols : cols - 1;
      for (std::size_t j = 0; j < m; ++j) {
        heads.push_back({(static_cast<double>(j) - (m - 1) / 2.0) * sx,
                         (static_cast<double>(i) - (rows - 1) / 2.0) * sy});
        toward.push_back(outward(full_row && cols > 1 && j == 0, full_row && cols > 1 && j + 1 == m,
                                 rows > 1 && i == 0, rows > 1 && i + 1 == rows));
      }
    }
    add_variants(c, l, heads, toward, sx, sy, centres, false);
  };
  if (has(Family::grid))
    for (std::size_t rows = 1; rows <= max_piles; ++rows)
      for (std::size_t cols = 1; rows * cols <= max_piles; ++cols) {
        if (rows * cols < 3) continue;  // one and two piles are their own families
        const std::vector<double> along_x = cols > 1 ? spacings : std::vector<double>{0.0};
        const std::vector<double> along_y = rows > 1 ? spacings : std::vector<double>{0.0};
        for (double sx : along_x) {
          if (too_wide(cols, sx, box_width)) {  // and every larger spacing too
            counts.outside_outline += along_y.size() * variants;
            continue;
          }
          for (double sy : along_y) {
            if (too_wide(rows, sy, box_length)) {
              counts.outside_outline += variants;
              continue;
            }
            add_rows(Family::grid, rows, cols, sx, sy);
          }
        }
      }
  if (has(Family::staggered))
    for (std::size_t rows = 2; rows <= max_piles; ++rows)
      for (std::size_t cols = 2; cols <= max_piles; ++cols) {
        // Rows of cols and cols − 1 piles alternately, the short rows centred between.
        const std::size_t n = (rows + 1) / 2 * cols + rows / 2 * (cols - 1);
        if (n > max_piles) break;
        for (double sx : spacings)
          for (double sy : spacings) {
            if (sy >= sx) break;  // a row spacing as large as the pile spacing is a grid
            if (too_wide(cols, sx, box_width) || too_wide(rows, sy, box_length)) {
              counts.outside_outline += variants;
              continue;
            }
            add_rows(Family::staggered, rows, cols, sx, sy);
          }
      }
  for (Family f : {Family::ring, Family::ring_centre}) {
    if (!has(f)) continue;
    const std::size_t extra = f == Family::ring_centre ? 1 : 0;
    for (std::size_t n = f == Family::ring ? 4 : 5; n + extra <= max_piles && n <= 16; ++n) {
      double last = -1.0;
      for (double s : spacings) {
        // Radius for a chord s between neighbours, rounded up to the step: R = s / (2 sin(π/n)).
        double radius = up_to(s / (2 * std::sin(kPi / static_cast<double>(n))), step);
        if (extra && radius < s) radius = up_to(s, step);
        if (radius == last) continue;
        last = radius;
        Layout l;
        l.family = f;
        l.rows = 1;
        l.columns = n;
        std::vector<std::array<double, 2>> heads;
        std::vector<std::optional<double>> toward;
        for (std::size_t k = 0; k < n; ++k) {
          const double a = 2 * kPi * static_cast<double>(k) / static_cast<double>(n);
          heads.push_back({tidy(radius * std::cos(a)), tidy(radius * std::sin(a))});
          toward.push_back(tidy(360.0 * static_cast<double>(k) / static_cast<double>(n)));
        }
        if (extra) {
          heads.push_back({0.0, 0.0});
          toward.push_back(std::nullopt);
        }
        add_variants(c, l, heads, toward, s, radius, centres, true);
      }
    }
  }
  return out;
}

}  // namespace cairn
