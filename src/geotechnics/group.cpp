// group.cpp — group layout, efficiency, block failure, uplift and settlement.
// Equations and their sources are in include/cairn/geotechnics/group.hpp and docs/methods-group.md.
#include "cairn/geotechnics/group.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <limits>
#include <numbers>
#include <stdexcept>

#include "cairn/core/quantity_format.hpp"
#include "cairn/core/units.hpp"

namespace cairn {
namespace {

constexpr double kPi = std::numbers::pi;
// Depths closer than this are the same depth (m); guards against round-off in layer sums.
constexpr double kDepthEpsilon = 1e-9;

std::string number(double value, int decimals = 3) { return fixed_text(value, decimals); }

// A length (m) in the project's units with its unit, for notes and reasons: three decimals
// in both systems (spacings and offsets quoted to the millimetre or the thousandth of a foot).
std::string length_text(double metres, UnitSystem units) {
  const QuantityFormat shown(units);
  return number(shown.value(Shown::length, metres)) + " " + shown.label(Shown::length);
}

void add_unique(std::vector<std::string>& notes, const std::string& note) {
  if (std::find(notes.begin(), notes.end(), note) == notes.end()) notes.push_back(note);
}

void require(bool condition, const char* message) {
  if (!condition) throw std::invalid_argument(message);
}

// ---- plan geometry ----------------------------------------------------------------------

double distance(PlanPoint a, PlanPoint b) { return std::hypot(a.x - b.x, a.y - b.y); }

double point_segment_distance(PlanPoint p, PlanPoint a, PlanPoint b) {
  const double dx = b.x - a.x, dy = b.y - a.y;
  const double length_squared = dx * dx + dy * dy;
  double t = length_squared > 0.0 ? ((p.x - a.x) * dx + (p.y - a.y) * dy) / length_squared : 0.0;
  t = std::clamp(t, 0.0, 1.0);
  return distance(p, {a.x + t * dx, a.y + t * dy});
}

double cross(PlanPoint o, PlanPoint a, PlanPoint b) {
  return (a.x - o.x) * (b.y - o.y) - (a.y - o.y) * (b.x - o.x);
}

bool segments_intersect(PlanPoint a, PlanPoint b, PlanPoint c, PlanPoint d) {
  const double d1 = cross(c, d, a), d2 = cross(c, d, b);
  const double d3 = cross(a, b, c), d4 = cross(a, b, d);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0)))
    return true;
  // Touching or collinear overlap: an end point lies on the other segment.
  constexpr double kTouch = 1e-12;
  return point_segment_distance(a, c, d) < kTouch || point_segment_distance(b, c, d) < kTouch ||
         point_segment_distance(c, a, b) < kTouch || point_segment_distance(d, a, b) < kTouch;
}

double segment_segment_distance(PlanPoint a, PlanPoint b, PlanPoint c, PlanPoint d) {
  if (segments_intersect(a, b, c, d)) return 0.0;
  return std::min({point_segment_distance(a, c, d), point_segment_distance(b, c, d),
                   point_segment_distance(c, a, b), point_segment_distance(d, a, b)});
}

// Ray casting; points on the boundary may fall either way, which the callers tolerate.
bool inside_polygon(PlanPoint p, const std::vector<PlanPoint>& polygon) {
  bool inside = false;
  for (std::size_t i = 0, j = polygon.size() - 1; i < polygon.size(); j = i++) {
    const PlanPoint& a = polygon[i];
    const PlanPoint& b = polygon[j];
    if ((a.y > p.y) != (b.y > p.y) && p.x < (b.x - a.x) * (p.y - a.y) / (b.y - a.y) + a.x)
      inside = !inside;
  }
  return inside;
}

double distance_to_boundary(PlanPoint p, const std::vector<PlanPoint>& polygon) {
  double best = std::numeric_limits<double>::infinity();
  for (std::size_t i = 0, j = polygon.size() - 1; i < polygon.size(); j = i++)
    best = std::min(best, point_segment_distance(p, polygon[j], polygon[i]));
  return best;
}

std::vector<PlanPoint> square_corners(const PilePlan& pile) {
  const double h = 0.5 * pile.width;
  return {{pile.x - h, pile.y - h}, {pile.x + h, pile.y - h}, {pile.x + h, pile.y + h},
          {pile.x - h, pile.y + h}};
}

// Clear distance from a square pile section to the outline; negative (the penetration)
// when the section crosses it.
double square_edge_distance(const PilePlan& pile, const std::vector<PlanPoint>& outline) {
  const std::vector<PlanPoint> square = square_corners(pile);
  double penetration = 0.0;
  for (const PlanPoint& corner : square)
    if (!inside_polygon(corner, outline))
      penetration = std::max(penetration, distance_to_boundary(corner, outline));
  for (const PlanPoint& corner : outline)
    if (inside_polygon(corner, square))
      penetration = std::max(penetration, distance_to_boundary(corner, square));
  if (penetration > 0.0) return -penetration;
  double best = std::numeric_limits<double>::infinity();
  for (std::size_t i = 0, j = square.size() - 1; i < square.size(); j = i++)
    for (std::size_t k = 0, l = outline.size() - 1; k < outline.size(); l = k++)
      best = std::min(best, segment_segment_distance(square[j], square[i], outline[l], outline[k]));
  return best;
}

// ---- grid ---------------------------------------------------------------------------------

struct Cluster {
  double centre = 0.0;
  double spread = 0.0;
};

// Groups sorted coordinates: a gap larger than the tolerance starts a new line.
std::vector<Cluster> cluster(std::vector<double> values, double tolerance) {
  std::sort(values.begin(), values.end());
  std::vector<Cluster> clusters;
  std::size_t first = 0;
  for (std::size_t i = 1; i <= values.size(); ++i) {
    if (i == values.size() || values[i] - values[i - 1] > tolerance) {
      double sum = 0.0;
      for (std::size_t k = first; k < i; ++k) sum += values[k];
      clusters.push_back({sum / static_cast<double>(i - first), values[i - 1] - values[first]});
      first = i;
    }
  }
  return clusters;
}

std::size_t nearest(const std::vector<Cluster>& clusters, double value) {
  std::size_t best = 0;
  for (std::size_t i = 1; i < clusters.size(); ++i)
    if (std::abs(clusters[i].centre - value) < std::abs(clusters[best].centre - value)) best = i;
  return best;
}

// Uniform spacing of consecutive lines: returns the mean spacing, or explains why not.
std::optional<double> uniform_spacing(const std::vector<Cluster>& lines, double tolerance,
                                      const char* axis, std::string& reason, UnitSystem units) {
  if (lines.size() < 2) return 0.0;
  double low = std::numeric_limits<double>::infinity(), high = 0.0;
  for (std::size_t i = 1; i < lines.size(); ++i) {
    const double gap = lines[i].centre - lines[i - 1].centre;
    low = std::min(low, gap);
    high = std::max(high, gap);
  }
  if (high - low > tolerance) {
    reason = std::string("spacing along ") + axis + " is not uniform (" + length_text(low, units) +
             " to " + length_text(high, units) + ")";
    return std::nullopt;
  }
  return (lines.back().centre - lines.front().centre) / static_cast<double>(lines.size() - 1);
}

// ---- soil column --------------------------------------------------------------------------

// Layers, water and stresses come from the soil column (soil.hpp), with its rules for
// boundaries and missing unit weights.
using Segment = SoilColumn::Piece;

std::vector<Segment> segments(const SoilColumn& column, double from, double to, bool at_water) {
  return column.pieces(from, to, at_water);
}

std::string layer_label(const SoilLayer& layer) { return "layer '" + layer.name + "'"; }

void add_missing(std::vector<MissingField>& missing, const SoilLayer& layer, const char* field,
                 const std::string& purpose) {
  for (const MissingField& m : missing)
    if (m.layer == layer.name && m.field == field) return;
  missing.push_back({layer.name, layer.line, field,
                     layer_label(layer) + ": " + field + " is missing; " + purpose});
}

// γ' of layer i: γ above the water table, γsat − γw below (hydrostatic pore pressure), by
// the soil column's weights rule.
double effective_unit_weight(const SoilColumn& column, std::size_t i, bool below_water,
                             std::vector<MissingField>& missing, std::vector<std::string>& notes) {
  const std::optional<double> gamma = column.unit_weight(i, below_water);
  if (!gamma) {
    add_missing(missing, column.layer(i), "unit_weight", "effective stresses need it");
    return 0.0;
  }
  if (auto note = column.weight_substitution(i, below_water)) add_unique(notes, *note);
  return below_water ? *gamma - kWaterUnitWeight : *gamma;
}

// σ'v at depth z, kPa: Σ γ'·Δz from the ground surface.
double vertical_effective_stress(const SoilColumn& column, double z,
                                 std::vector<MissingField>& missing,
                                 std::vector<std::string>& notes) {
  double stress = 0.0;
  if (z <= 0.0) return stress;
  for (const Segment& s : segments(column, 0.0, z, true))
    stress += effective_unit_weight(column, s.layer, s.below_water, missing, notes) *
              (s.bottom - s.top);
  return stress;
}

void check_depths(const SoilColumn& column, const BlockPlan& plan, double head_depth,
                  double tip_depth) {
  require(plan.width > 0.0 && plan.length > 0.0, "block plan dimensions must be positive");
  require(head_depth >= 0.0, "pile head depth must not be negative");
  require(tip_depth > head_depth, "pile tips must lie below the pile heads");
  if (tip_depth > column.depth() + kDepthEpsilon)
    throw std::invalid_argument("pile tips at " + length_text(tip_depth, UnitSystem::SI) +
                                " lie below the soil profile, which ends at " +
                                length_text(column.depth(), UnitSystem::SI));
}

std::string missing_text(const std::vector<MissingField>& missing) {
  std::string text;
  for (const MissingField& m : missing) text += (text.empty() ? "" : "; ") + m.message;
  return text;
}

// One-dimensional consolidation of a clay sublayer (Terzaghi; e.g. Das, Principles of
// Foundation Engineering, §11 — common practice):
//   NC:            s = Cc·H/(1+e0)·log10(σ'f/σ'0)
//   OC, σ'f ≤ σ'p: s = Cr·H/(1+e0)·log10(σ'f/σ'0)
//   OC, σ'f > σ'p: s = Cr·H/(1+e0)·log10(σ'p/σ'0) + Cc·H/(1+e0)·log10(σ'f/σ'p)
double consolidation(double cc, double cr, double e0, double sigma_p, double sigma_0,
                     double delta, double thickness, std::string& branch) {
  const double sigma_f = sigma_0 + delta;
  const double h = thickness / (1.0 + e0);
  if (sigma_p <= sigma_0) {
    branch = "virgin";
    return cc * h * std::log10(sigma_f / sigma_0);
  }
  if (sigma_f <= sigma_p) {
    branch = "recompression";
    return cr * h * std::log10(sigma_f / sigma_0);
  }
  branch = "recompression + virgin";
  return cr * h * std::log10(sigma_p / sigma_0) + cc * h * std::log10(sigma_f / sigma_p);
}

}  // namespace

// ---- layout -------------------------------------------------------------------------------

GridLayout detect_grid(const std::vector<PilePlan>& piles, double tolerance, UnitSystem units) {
  require(!piles.empty(), "no piles to arrange in a grid");
  require(tolerance > 0.0, "grid tolerance must be positive");
  GridLayout grid;
  std::vector<double> xs, ys;
  for (const PilePlan& p : piles) {
    xs.push_back(p.x);
    ys.push_back(p.y);
  }
  const std::vector<Cluster> columns = cluster(xs, tolerance);
  const std::vector<Cluster> rows = cluster(ys, tolerance);
  grid.rows = rows.size();
  grid.columns = columns.size();
  for (const auto* lines : {&columns, &rows})
    for (const Cluster& c : *lines)
      if (c.spread > tolerance) {
        grid.reason = "piles on one line scatter by " + length_text(c.spread, units) +
                      ", more than the tolerance of " + length_text(tolerance, units);
        return grid;
      }
  if (rows.size() * columns.size() != piles.size()) {
    grid.reason = std::to_string(piles.size()) + " piles do not fill the " +
                  std::to_string(rows.size()) + " × " + std::to_string(columns.size()) +
                  " crossings of their rows and columns";
    return grid;
  }
  std::vector<std::size_t> occupant(rows.size() * columns.size(), piles.size());
  for (std::size_t k = 0; k < piles.size(); ++k) {
    const std::size_t cell = nearest(rows, piles[k].y) * columns.size() + nearest(columns, piles[k].x);
    if (occupant[cell] != piles.size()) {
      grid.reason = "piles '" + piles[occupant[cell]].id + "' and '" + piles[k].id +
                    "' share one grid point";
      return grid;
    }
    occupant[cell] = k;
  }
  const auto sx = uniform_spacing(columns, tolerance, "x", grid.reason, units);
  if (!sx) return grid;
  const auto sy = uniform_spacing(rows, tolerance, "y", grid.reason, units);
  if (!sy) return grid;
  grid.spacing_x = *sx;
  grid.spacing_y = *sy;
  grid.regular = true;
  return grid;
}

SpacingCheck check_spacing(const std::vector<PilePlan>& piles, double factor,
                           double absolute_minimum, UnitSystem units) {
  require(factor > 0.0, "spacing factor must be positive");
  require(absolute_minimum >= 0.0, "minimum spacing must not be negative");
  SpacingCheck check;
  double smallest = std::numeric_limits<double>::infinity();
  for (std::size_t i = 0; i < piles.size(); ++i)
    for (std::size_t j = i + 1; j < piles.size(); ++j) {
      const double d = distance({piles[i].x, piles[i].y}, {piles[j].x, piles[j].y});
      smallest = std::min(smallest, d);
      const double required =
          std::max(factor * std::max(piles[i].width, piles[j].width), absolute_minimum);
      if (d < required) check.violations.push_back({piles[i].id, piles[j].id, d, required, std::nullopt});
    }
  check.smallest = piles.size() < 2 ? 0.0 : smallest;
  check.notes.push_back("minimum spacing " + number(factor, 2) +
                        " × pile width (larger width of each pair)" +
                        (absolute_minimum > 0.0 ? ", at least " + length_text(absolute_minimum, units) : ""));
  return check;
}

EdgeCheck check_edge_distance(const std::vector<PilePlan>& piles,
                              const std::vector<PlanPoint>& outline, double minimum) {
  require(outline.size() >= 3, "a cap outline needs at least 3 corners");
  require(minimum >= 0.0, "minimum edge distance must not be negative");
  EdgeCheck check;
  check.minimum = minimum;
  for (const PilePlan& pile : piles) {
    if (!inside_polygon({pile.x, pile.y}, outline))
      throw std::invalid_argument("pile '" + pile.id + "' at (" + number(pile.x) + ", " +
                                  number(pile.y) + ") lies outside the cap outline");
    const double d = pile.round ? distance_to_boundary({pile.x, pile.y}, outline) - 0.5 * pile.width
                                : square_edge_distance(pile, outline);
    const bool ok = d >= minimum - kDepthEpsilon;
    check.piles.push_back({pile.id, d, ok});
    if (!ok) check.offenders.push_back(pile.id);
  }
  return check;
}

BlockPlan block_plan(const std::vector<PilePlan>& piles) {
  require(!piles.empty(), "no piles for the block");
  double x0 = std::numeric_limits<double>::infinity(), y0 = x0;
  double x1 = -x0, y1 = -x0;
  for (const PilePlan& p : piles) {
    const double h = 0.5 * p.width;
    x0 = std::min(x0, p.x - h);
    x1 = std::max(x1, p.x + h);
    y0 = std::min(y0, p.y - h);
    y1 = std::max(y1, p.y + h);
  }
  return {std::min(x1 - x0, y1 - y0), std::max(x1 - x0, y1 - y0)};
}

// ---- efficiency ---------------------------------------------------------------------------

// From the method table (methods.hpp).
const char* to_string(EfficiencyMethod method) { return method_info(method).name; }

std::optional<EfficiencyMethod> efficiency_method_from_string(const std::string& name) {
  return find_efficiency_method(name);
}

namespace {

Efficiency efficiency_on_grid(EfficiencyMethod method, const std::vector<PilePlan>& piles,
                              const GridLayout& grid, double tolerance, UnitSystem units) {
  Efficiency result{method, std::nullopt, {}};
  if (method == EfficiencyMethod::none) {
    result.value = 1.0;
    // What the choice assumes; evaluate_group() adds what the project's piles and soil say.
    result.note = "η = 1: no reduction for group action (the group capacity is the sum of the "
                  "single-pile capacities)";
    return result;
  }
  if (!grid.regular) {
    result.note = "does not apply: irregular layout (" + grid.reason + ")";
    return result;
  }
  for (const PilePlan& p : piles)
    if (std::abs(p.width - piles.front().width) > tolerance || p.round != piles.front().round) {
      result.note = "does not apply: the piles differ in size or shape";
      return result;
    }
  const double width = piles.front().width;
  const double rows = static_cast<double>(grid.rows);
  const double columns = static_cast<double>(grid.columns);
  const double count = rows * columns;
  if (piles.size() == 1) {
    result.value = 1.0;
    result.note = "single pile: η = 1";
    return result;
  }
  double spacing = 0.0;
  if (grid.spacing_x > 0.0 && grid.spacing_y > 0.0) {
    spacing = std::min(grid.spacing_x, grid.spacing_y);
    if (std::abs(grid.spacing_x - grid.spacing_y) > tolerance)
      result.note = "spacings differ along x and y: the smaller, " + length_text(spacing, units) + ", is used";
  } else {
    spacing = std::max(grid.spacing_x, grid.spacing_y);
  }
  switch (method) {
    case EfficiencyMethod::converse_labarre: {
      // θ = arctan(D/s) in degrees; η = 1 − θ[(n1−1)n2 + (n2−1)n1]/(90 n1 n2).
      const double theta = std::atan(width / spacing) * 180.0 / kPi;
      result.value = 1.0 - theta * ((rows - 1.0) * columns + (columns - 1.0) * rows) / (90.0 * count);
      break;
    }
    case EfficiencyMethod::los_angeles:
      // η = 1 − D/(π s m n)·[m(n−1) + n(m−1) + √2 (m−1)(n−1)].
      result.value = 1.0 - width / (kPi * spacing * count) *
                               (rows * (columns - 1.0) + columns * (rows - 1.0) +
                                std::sqrt(2.0) * (rows - 1.0) * (columns - 1.0));
      break;
    case EfficiencyMethod::feld: {
      // Each pile loses 1/16 of its capacity per neighbour, orthogonal or diagonal.
      double lost = 0.0;
      for (std::size_t i = 0; i < grid.rows; ++i)
        for (std::size_t j = 0; j < grid.columns; ++j) {
          const std::size_t di = (i > 0) + (i + 1 < grid.rows) + 1;
          const std::size_t dj = (j > 0) + (j + 1 < grid.columns) + 1;
          lost += static_cast<double>(di * dj - 1) / 16.0;
        }
      result.value = 1.0 - lost / count;
      break;
    }
    case EfficiencyMethod::block_perimeter: {
      // Shaft friction of the block perimeter against the sum over the piles, η ≤ 1.
      const BlockPlan plan = block_plan(piles);
      const double pile_perimeter = piles.front().round ? kPi * width : 4.0 * width;
      const double raw = 2.0 * (plan.width + plan.length) / (count * pile_perimeter);
      result.value = std::min(1.0, raw);
      if (raw > 1.0) result.note = "block perimeter exceeds the piles' perimeters: η = 1";
      break;
    }
    case EfficiencyMethod::none:
      break;
  }
  return result;
}

}  // namespace

Efficiency group_efficiency(EfficiencyMethod method, const std::vector<PilePlan>& piles,
                            double tolerance, UnitSystem units) {
  return efficiency_on_grid(method, piles, detect_grid(piles, tolerance, units), tolerance, units);
}

EfficiencySummary all_efficiencies(const std::vector<PilePlan>& piles, double tolerance,
                                   UnitSystem units) {
  EfficiencySummary summary;
  summary.grid = detect_grid(piles, tolerance, units);
  for (const EfficiencyMethodInfo& row : efficiency_methods())
    summary.all.push_back(efficiency_on_grid(row.method, piles, summary.grid, tolerance, units));
  return summary;
}

double efficient_capacity(double sum_tip, double sum_shaft, double efficiency,
                          EfficiencyApplies applies) {
  require(sum_tip >= 0.0 && sum_shaft >= 0.0, "capacity sums must not be negative");
  require(efficiency > 0.0, "efficiency must be positive");
  return applies == EfficiencyApplies::whole ? efficiency * (sum_tip + sum_shaft)
                                             : sum_tip + efficiency * sum_shaft;
}

// ---- block failure, group capacity, uplift ------------------------------------------------

double skempton_nc(double width_over_length, double depth_over_width) {
  require(width_over_length >= 0.0 && width_over_length <= 1.0 + 1e-12,
          "Skempton's Nc needs 0 ≤ B/L ≤ 1");
  require(depth_over_width >= 0.0, "Skempton's Nc needs D/B ≥ 0");
  // Skempton (1951): Nc = 5(1 + 0.2 B/L)(1 + 0.2 D/B), D/B ≤ 2.5 (Nc = 7.5(1 + 0.2 B/L) deeper).
  return 5.0 * (1.0 + 0.2 * width_over_length) * (1.0 + 0.2 * std::min(depth_over_width, 2.5));
}

BlockCapacity block_capacity_clay(const SoilProfile& profile, const BlockPlan& plan,
                                  double head_depth, double tip_depth) {
  const SoilColumn column(profile);
  check_depths(column, plan, head_depth, tip_depth);
  BlockCapacity block;
  double sum_cu_dl = 0.0;
  for (const Segment& s : segments(column, head_depth, tip_depth, false)) {
    const SoilLayer& layer = profile.layers[s.layer];
    if (layer.kind != SoilKind::clay) {
      add_unique(block.notes, layer_label(layer) + " is sand: its shear on the block "
                                                   "perimeter is not counted");
      continue;
    }
    if (!layer.undrained_strength)
      throw std::invalid_argument(layer_label(layer) +
                                  ": undrained_strength is missing; block failure needs it");
    sum_cu_dl += *layer.undrained_strength * (s.bottom - s.top);
  }
  if (tip_depth >= column.depth() - kDepthEpsilon)
    block.notes.push_back("the profile ends at the pile tips: the last layer is taken to "
                          "continue below them");
  const SoilLayer& base = profile.layers[column.layer_at(tip_depth)];
  if (base.kind != SoilKind::clay) {
    block.notes.push_back("block failure in clay does not apply: " + layer_label(base) +
                          " below the pile tips is sand");
    return block;
  }
  if (!base.undrained_strength)
    throw std::invalid_argument(layer_label(base) +
                                ": undrained_strength is missing; block failure needs it");
  block.applies = true;
  block.base_strength = *base.undrained_strength;
  block.nc = skempton_nc(plan.width / plan.length, tip_depth / plan.width);
  if (tip_depth / plan.width > 2.5)
    block.notes.push_back("Skempton Nc: D/B = " + number(tip_depth / plan.width, 2) +
                          " capped at 2.5 (D = depth of the pile tips below ground)");
  block.base = plan.width * plan.length * block.base_strength * block.nc;
  block.perimeter = 2.0 * (plan.width + plan.length) * sum_cu_dl;
  block.capacity = block.base + block.perimeter;
  return block;
}

GroupCapacity group_capacity(double efficient_sum, const BlockCapacity& block) {
  require(efficient_sum >= 0.0, "group capacity sum must not be negative");
  GroupCapacity group;
  group.efficient_sum = efficient_sum;
  group.capacity = efficient_sum;
  if (block.applies) {
    group.block = block.capacity;
    if (block.capacity < efficient_sum) {
      group.capacity = block.capacity;
      group.governs = GroupGoverning::block;
    }
  }
  return group;
}

GroupUplift group_uplift(const SoilProfile& profile, const BlockPlan& plan, double head_depth,
                         double tip_depth, double tension) {
  const SoilColumn column(profile);
  check_depths(column, plan, head_depth, tip_depth);
  require(tension >= 0.0, "group tension must not be negative");
  GroupUplift uplift;
  std::vector<MissingField> missing;
  double weight_per_area = 0.0;  // Σ γ'·Δz, kPa
  double shear_per_length = 0.0;  // Σ τ·Δz, kN/m
  for (const Segment& s : segments(column, head_depth, tip_depth, true)) {
    const SoilLayer& layer = profile.layers[s.layer];
    const double dz = s.bottom - s.top;
    weight_per_area += effective_unit_weight(column, s.layer, s.below_water, missing, uplift.notes) * dz;
    if (layer.kind == SoilKind::clay) {
      if (layer.undrained_strength) shear_per_length += *layer.undrained_strength * dz;
      else add_missing(missing, layer, "undrained_strength", "group uplift needs it");
    } else if (layer.friction_angle) {
      // Soil on soil: K0 = 1 − sinφ' (Jaky) and δ = φ'; σ'v is linear within a segment.
      const double phi = *layer.friction_angle * kPi / 180.0;
      const double mean_stress =
          0.5 * (vertical_effective_stress(column, s.top, missing, uplift.notes) +
                 vertical_effective_stress(column, s.bottom, missing, uplift.notes));
      shear_per_length += (1.0 - std::sin(phi)) * std::tan(phi) * mean_stress * dz;
      add_unique(uplift.notes, "sand on the block perimeter: τ = K0·σ'v·tanφ' with K0 = 1 − sinφ'");
    } else {
      add_missing(missing, layer, "friction_angle", "group uplift needs it");
    }
  }
  if (!missing.empty()) throw std::invalid_argument(missing_text(missing));
  uplift.weight = plan.width * plan.length * weight_per_area;
  uplift.perimeter_shear = 2.0 * (plan.width + plan.length) * shear_per_length;
  uplift.resistance = uplift.weight + uplift.perimeter_shear;
  uplift.tension = tension;
  if (tension > 0.0) uplift.factor_of_safety = uplift.resistance / tension;
  uplift.notes.push_back("block from the pile heads to the tips; the piles' weight in excess "
                         "of the soil they replace is ignored (conservative)");
  return uplift;
}

// ---- settlement ---------------------------------------------------------------------------

WorkingLoadSplit split_working_load(double working_load, double ultimate_tip,
                                    double ultimate_shaft) {
  require(working_load >= 0.0, "working load must not be negative");
  require(ultimate_tip >= 0.0 && ultimate_shaft >= 0.0 && ultimate_tip + ultimate_shaft > 0.0,
          "ultimate tip and shaft capacities must not be negative and must not both be zero");
  const double tip = working_load * ultimate_tip / (ultimate_tip + ultimate_shaft);
  return {tip, working_load - tip};
}

namespace {

void check_vesic(const VesicPile& pile, const WorkingLoadSplit& load) {
  require(pile.width > 0.0 && pile.length > 0.0, "pile width and length must be positive");
  require(pile.pile_modulus > 0.0, "pile modulus must be positive");
  require(pile.poisson_ratio >= 0.0 && pile.poisson_ratio < 0.5,
          "soil Poisson's ratio must be in [0, 0.5)");
  require(pile.xi >= 0.0 && pile.xi <= 1.0, "ξ must be in [0, 1]");
  require(load.tip >= 0.0 && load.shaft >= 0.0, "tip and shaft loads must not be negative");
}

double area(const VesicPile& pile) {
  return pile.round ? 0.25 * kPi * pile.width * pile.width : pile.width * pile.width;
}

double perimeter(const VesicPile& pile) {
  return pile.round ? kPi * pile.width : 4.0 * pile.width;
}

// s1 = (Qwp + ξ Qws)·L/(Ap·Ep), Vesić (1977).
VesicSettlement shortening(const VesicPile& pile, const WorkingLoadSplit& load) {
  VesicSettlement s;
  s.tip_load = load.tip;
  s.shaft_load = load.shaft;
  const double material = pile.material_area > 0.0 ? pile.material_area : area(pile);
  s.shortening = (load.tip + pile.xi * load.shaft) * pile.length / (material * pile.pile_modulus);
  s.notes.push_back("ξ = " + number(pile.xi, 2) + " for the distribution of shaft friction");
  return s;
}

}  // namespace

VesicSettlement vesic_settlement(const VesicPile& pile, const WorkingLoadSplit& load) {
  check_vesic(pile, load);
  require(pile.soil_modulus_tip > 0.0 && pile.soil_modulus_shaft > 0.0,
          "soil moduli at the tip and along the shaft must be positive");
  constexpr double kIwp = 0.85;  // Vesić (1977) influence factor for the tip
  const double iws = 2.0 + 0.35 * std::sqrt(pile.length / pile.width);
  const double mu = 1.0 - pile.poisson_ratio * pile.poisson_ratio;
  VesicSettlement s = shortening(pile, load);
  const double unit_tip_load = load.tip / area(pile);
  s.tip = unit_tip_load * pile.width * mu * kIwp / pile.soil_modulus_tip;
  s.shaft = load.shaft / (perimeter(pile) * pile.length) * (pile.width / pile.soil_modulus_shaft) *
            mu * iws;
  s.total = s.shortening + s.tip + s.shaft;
  s.notes.push_back("Vesić (1977) elastic route: Iwp = 0.85, Iws = 2 + 0.35·√(L/D) = " +
                    number(iws, 3));
  return s;
}

VesicSettlement vesic_settlement_empirical(const VesicPile& pile, const WorkingLoadSplit& load,
                                           double cp, double unit_tip_resistance) {
  check_vesic(pile, load);
  require(cp > 0.0, "Cp must be positive");
  require(unit_tip_resistance > 0.0, "unit tip resistance must be positive");
  const double cs = (0.93 + 0.16 * std::sqrt(pile.length / pile.width)) * cp;
  VesicSettlement s = shortening(pile, load);
  s.tip = load.tip * cp / (pile.width * unit_tip_resistance);
  s.shaft = load.shaft * cs / (pile.length * unit_tip_resistance);
  s.total = s.shortening + s.tip + s.shaft;
  s.notes.push_back("Vesić (1977) empirical route: Cp = " + number(cp, 3) + ", Cs = " +
                    number(cs, 4));
  return s;
}

double vesic_group_settlement(double single_settlement, double group_width, double pile_width) {
  require(single_settlement >= 0.0, "settlement must not be negative");
  require(group_width > 0.0 && pile_width > 0.0, "group and pile widths must be positive");
  return single_settlement * std::sqrt(group_width / pile_width);
}

double spread_stress(double load, const BlockPlan& plan, double depth_below_footing) {
  require(load >= 0.0, "group load must not be negative");
  require(depth_below_footing >= 0.0, "depth below the footing must not be negative");
  require(plan.width > 0.0 && plan.length > 0.0, "block plan dimensions must be positive");
  return load / ((plan.width + depth_below_footing) * (plan.length + depth_below_footing));
}

EquivalentFootingSettlement equivalent_footing_settlement(
    const SoilProfile& profile, const BlockPlan& plan, double head_depth, double tip_depth,
    double load, const EquivalentFootingOptions& options) {
  const SoilColumn column(profile);
  check_depths(column, plan, head_depth, tip_depth);
  require(load >= 0.0, "group load must not be negative");
  require(options.sublayer_thickness > 0.0, "sublayer thickness must be positive");
  require(options.stress_ratio_cutoff >= 0.0, "stress ratio cutoff must not be negative");
  require(!options.max_depth || *options.max_depth > 0.0, "maximum depth must be positive");

  EquivalentFootingSettlement result;
  result.width = plan.width;
  result.length = plan.length;
  if (options.level == FootingLevel::bearing_stratum) {
    // The bearing stratum is the layer the tip ends in, by the soil column's rule (a tip on
    // a boundary bears on the layer below, with no penetration into it).
    const std::size_t i = column.layer_at(tip_depth);
    const double top = std::max(column.top(i), head_depth);
    result.footing_depth = top + 2.0 / 3.0 * (tip_depth - top);
    result.notes.push_back("equivalent footing at 2/3 of the pile length in the bearing stratum " +
                           layer_label(profile.layers[i]) + " (" + length_text(top, options.units) + " to " +
                           length_text(tip_depth, options.units) + "): " + length_text(result.footing_depth, options.units) +
                           " below ground (FHWA 1996)");
  } else {
    result.footing_depth = head_depth + 2.0 / 3.0 * (tip_depth - head_depth);
    result.notes.push_back("equivalent footing at 2/3 of the embedded length: " +
                           length_text(result.footing_depth, options.units) + " below ground");
  }
  result.notes.push_back("load spread 2V:1H below the footing: Δσ = Q/((Bg + z)(Lg + z))");

  double end = column.depth();
  if (options.max_depth) end = std::min(end, result.footing_depth + *options.max_depth);

  // Sublayer boundaries: layer boundaries and water table, then equal parts ≤ the thickness.
  std::vector<double> bounds;
  for (const Segment& s : segments(column, result.footing_depth, end, true)) {
    const int parts = std::max(1, static_cast<int>(std::ceil((s.bottom - s.top) /
                                                             options.sublayer_thickness - 1e-9)));
    for (int k = 0; k < parts; ++k)
      bounds.push_back(s.top + (s.bottom - s.top) * k / parts);
  }
  bounds.push_back(end);

  bool cut_off = false;
  result.bottom = end;
  for (std::size_t k = 1; k < bounds.size(); ++k) {
    const double top = bounds[k - 1], bottom = bounds[k];
    const double mid = 0.5 * (top + bottom);
    const double z = mid - result.footing_depth;
    const SoilLayer& layer = profile.layers[column.layer_at(mid)];
    Sublayer sub;
    sub.layer = layer.name;
    sub.kind = layer.kind;
    sub.top = top;
    sub.bottom = bottom;
    sub.initial_stress = vertical_effective_stress(column, mid, result.missing, result.notes);
    sub.added_stress = spread_stress(load, plan, z);
    if (sub.added_stress < options.stress_ratio_cutoff * sub.initial_stress) {
      result.bottom = top;
      result.notes.push_back("summation stopped at " + length_text(top, options.units) + " below ground, where Δσ "
                             "falls below " + number(100.0 * options.stress_ratio_cutoff, 0) +
                             " % of σ'v0");
      cut_off = true;
      break;
    }
    const double h = bottom - top;
    if (layer.kind == SoilKind::sand) {
      sub.branch = "elastic";
      if (layer.soil_modulus && *layer.soil_modulus > 0.0)
        sub.settlement = sub.added_stress * h / *layer.soil_modulus;
      else
        add_missing(result.missing, layer, "soil_modulus", "elastic compression of sand needs Es");
    } else {
      const char* purpose = "consolidation settlement needs Cc, e0 and σ'p (and Cr when "
                            "over-consolidated)";
      const bool over_consolidated =
          layer.preconsolidation && *layer.preconsolidation > sub.initial_stress;
      if (!layer.compression_index) add_missing(result.missing, layer, "compression_index", purpose);
      if (!layer.void_ratio) add_missing(result.missing, layer, "void_ratio", purpose);
      if (!layer.preconsolidation) add_missing(result.missing, layer, "preconsolidation", purpose);
      if (over_consolidated && !layer.recompression_index)
        add_missing(result.missing, layer, "recompression_index", purpose);
      const bool complete = layer.compression_index && layer.void_ratio &&
                            layer.preconsolidation &&
                            (!over_consolidated || layer.recompression_index);
      if (complete && sub.initial_stress > 0.0) {
        if (*layer.preconsolidation < sub.initial_stress)
          add_unique(result.notes, layer_label(layer) + ": σ'p below σ'v0, taken as normally "
                                                        "consolidated");
        sub.settlement = consolidation(*layer.compression_index, layer.recompression_index.value_or(0.0),
                                       *layer.void_ratio, *layer.preconsolidation,
                                       sub.initial_stress, sub.added_stress, h, sub.branch);
      }
    }
    result.sublayers.push_back(sub);
  }
  if (!cut_off) {
    if (end < column.depth() - kDepthEpsilon)
      result.notes.push_back("summation stopped at the given depth, " + length_text(end, options.units) + " below ground");
    else
      result.notes.push_back("the soil profile ends at " + length_text(end, options.units) +
                             ": the ground below is taken as incompressible");
  }
  result.notes.push_back("sand: Δs = Δσ·h/Es; pile shortening above the footing is not included");
  if (result.missing.empty()) {
    double total = 0.0;
    for (const Sublayer& s : result.sublayers) total += s.settlement;
    result.total = total;
  }
  return result;
}

SettlementCheck check_settlement(double settlement, std::optional<double> limit,
                                 UnitSystem units) {
  require(settlement >= 0.0, "settlement must not be negative");
  require(!limit || *limit > 0.0, "tolerable settlement must be positive");
  SettlementCheck check;
  check.settlement = settlement;
  check.limit = limit.value_or(kDefaultSettlementLimit);
  if (!limit)
    check.notes.push_back("tolerable settlement " +
                          number(from_si(units, Quantity::small_length, kDefaultSettlementLimit), 1) +
                          " " + unit_label(units, Quantity::small_length) +
                          " (25 mm; common practice, Terzaghi & Peck); not given in the project");
  check.ok = settlement <= check.limit;
  return check;
}

// ---- stiffness ----------------------------------------------------------------------------

SecantStiffness axial_head_stiffness(const VesicPile& pile, double service_load,
                                     double ultimate_tip, double ultimate_shaft) {
  require(service_load > 0.0, "service load must be positive");
  const VesicSettlement s =
      vesic_settlement(pile, split_working_load(service_load, ultimate_tip, ultimate_shaft));
  SecantStiffness k;
  k.load = service_load;
  k.settlement = s.total;
  k.stiffness = service_load / s.total;
  k.notes = s.notes;
  k.notes.push_back("axial stiffness k = Q/s, secant from Vesić's single-pile settlement with "
                    "the load split by the ultimate tip and shaft capacities; the method is "
                    "linear, so k does not vary with Q");
  return k;
}

}  // namespace cairn
