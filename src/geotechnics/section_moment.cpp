// section_moment.cpp — yield moments of pile sections. Equations and sources in
// section_moment.hpp and docs/methods-lateral.md.
#include "cairn/geotechnics/section_moment.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <numbers>
#include <stdexcept>
#include <vector>

#include <fmt/format.h>

#include "cairn/core/quantity_format.hpp"

namespace cairn {
namespace {

constexpr double kPi = std::numbers::pi;
// Ultimate concrete strain, ACI 318-19 22.2.2.1 (from memory).
constexpr double kConcreteStrain = 0.003;
// A steel_area within 2 % of the shape's own area is taken to describe that shape (round-off
// of areas copied from tables); beyond it the section is some other shape (an H-pile, say).
constexpr double kAreaTolerance = 0.02;

void check_shape(double width, double wall) {
  if (!(width > 0.0) || !std::isfinite(width))
    throw std::invalid_argument("section width must be positive");
  if (!(wall >= 0.0 && wall < 0.5 * width))
    throw std::invalid_argument("wall thickness must lie in [0, width/2)");
}

// Distance from the centroid to the extreme fibre, m: b/2, or b/√2 for a square bent about
// its diagonal.
double half_depth(SectionShape shape, double width, BendingAxis axis) {
  return shape == SectionShape::square && axis == BendingAxis::diagonal ? width / std::sqrt(2.0)
                                                                         : 0.5 * width;
}

// Area and first moment about the centroid of the part of a solid section above the line
// y = y0 (y from the centroid, toward the compression face). h = half depth.
//   circle (R = h):     A = R²·acos(y0/R) − y0·√(R² − y0²),  Q = (2/3)(R² − y0²)^(3/2)
//   square, side axis:  A = b(h − y0),                        Q = b(h² − y0²)/2
//   square, diagonal:   A = (h − y0)² for y0 ≥ 0, 2h² − (h + y0)² below;
//                       Q = h³/3 − h·y0² + (2/3)|y0|³   (width 2(h − |y|))
struct Part {
  double area = 0.0;
  double moment = 0.0;
};

Part solid_above(SectionShape shape, double width, double y0, BendingAxis axis) {
  const double h = half_depth(shape, width, axis);
  const double y = std::clamp(y0, -h, h);
  if (shape == SectionShape::square && axis == BendingAxis::diagonal) {
    const double area = y >= 0.0 ? (h - y) * (h - y) : 2.0 * h * h - (h + y) * (h + y);
    const double ay = std::abs(y);
    return {area, h * h * h / 3.0 - h * y * y + 2.0 / 3.0 * ay * ay * ay};
  }
  if (shape == SectionShape::square) return {width * (h - y), 0.5 * width * (h * h - y * y)};
  const double root = std::sqrt(std::max(h * h - y * y, 0.0));
  return {h * h * std::acos(y / h) - y * root, 2.0 / 3.0 * root * root * root};
}

// The same for a hollow section: outer part less inner part (same centre, same axis).
Part above(SectionShape shape, double width, double wall, double y0, BendingAxis axis) {
  Part outer = solid_above(shape, width, y0, axis);
  if (wall > 0.0) {
    const Part inner = solid_above(shape, width - 2.0 * wall, y0, axis);
    outer.area -= inner.area;
    outer.moment -= inner.moment;
  }
  return outer;
}

// Bisection for a monotonically increasing f on [lo, hi] with f(lo) ≤ target ≤ f(hi).
template <typename F>
double solve_increasing(F f, double lo, double hi, double target) {
  for (int i = 0; i < 200 && hi - lo > 1e-14 * std::max(1.0, std::abs(hi)); ++i) {
    const double mid = 0.5 * (lo + hi);
    (f(mid) < target ? lo : hi) = mid;
  }
  return 0.5 * (lo + hi);
}

// Bar centres in the plane of the section, m, from its centre: evenly on a circle (round,
// optionally turned by half a spacing) or round the perimeter of the square through the bar
// centres, from a corner.
std::vector<std::array<double, 2>> bar_positions(const ReinforcedSection& s, bool turned) {
  std::vector<std::array<double, 2>> bars;
  const double n = s.bar_count;
  if (s.shape == SectionShape::round) {
    const double radius = 0.5 * s.width - s.cover_to_bar_center;
    const double offset = turned ? kPi / n : 0.0;
    for (int i = 0; i < s.bar_count; ++i) {
      const double angle = 2.0 * kPi * i / n + offset;
      bars.push_back({radius * std::sin(angle), radius * std::cos(angle)});
    }
    return bars;
  }
  const double side = s.width - 2.0 * s.cover_to_bar_center;
  const double half = 0.5 * side;
  for (int i = 0; i < s.bar_count; ++i) {
    const double along = 4.0 * side * i / n;  // distance round the perimeter
    const int edge = std::min(static_cast<int>(along / side), 3);
    const double t = along - edge * side;
    // Edges in order: top (left to right), right (down), bottom (right to left), left (up).
    switch (edge) {
      case 0: bars.push_back({-half + t, half}); break;
      case 1: bars.push_back({half, half - t}); break;
      case 2: bars.push_back({half - t, -half}); break;
      default: bars.push_back({-half, -half + t}); break;
    }
  }
  return bars;
}

// Bar depths below the compression face for bending about `axis`, m; `mirrored` puts the
// compression on the opposite face (bar layouts need not be symmetric).
std::vector<double> bar_depths(const ReinforcedSection& s, bool turned, BendingAxis axis,
                               bool mirrored) {
  const double h = half_depth(s.shape, s.width, axis);
  std::vector<double> depths;
  for (const auto& [x, y] : bar_positions(s, turned)) {
    const double up = s.shape == SectionShape::square && axis == BendingAxis::diagonal
                          ? (x + y) / std::sqrt(2.0)
                          : y;
    depths.push_back(h - (mirrored ? -up : up));
  }
  return depths;
}

// Axial force (kN) and moment about the centroid (kN·m) at neutral-axis depth c (m).
std::pair<double, double> concrete_forces(const ReinforcedSection& s, BendingAxis axis,
                                          const std::vector<double>& depths, double c) {
  const double h = half_depth(s.shape, s.width, axis);
  const double a = std::min(stress_block_beta1(s.concrete_strength) * c, 2.0 * h);
  const double stress = 0.85 * s.concrete_strength;
  const Part block = above(s.shape, s.width, 0.0, h - a, axis);
  double force = stress * block.area;
  double moment = stress * block.moment;
  const double bar = s.steel_area / s.bar_count;
  for (double d : depths) {
    const double strain = kConcreteStrain * (c - d) / c;
    double fs = std::clamp(kSteelModulus * strain, -s.steel_yield, s.steel_yield);
    if (d < a) fs -= stress;  // the bar displaces concrete counted in the block
    force += bar * fs;
    moment += bar * fs * (h - d);
  }
  return {force, moment};
}

double concrete_moment_one_layout(const ReinforcedSection& s, BendingAxis axis,
                                  const std::vector<double>& depths, double axial) {
  const auto force = [&](double c) { return concrete_forces(s, axis, depths, c).first; };
  // c → 0: every bar yields in tension; c large: the whole section in compression.
  const double lo = 1e-9 * s.width, hi = 1e3 * s.width;
  if (axial <= force(lo) || axial >= force(hi)) return 0.0;
  const double c = solve_increasing(force, lo, hi, axial);
  return std::max(concrete_forces(s, axis, depths, c).second, 0.0);
}

std::string number(UnitSystem units, Shown q, double si) { return QuantityFormat(units).text(q, si); }

}  // namespace

double section_area(SectionShape shape, double width, double wall) {
  check_shape(width, wall);
  const auto solid = [&](double b) { return shape == SectionShape::square ? b * b : kPi * b * b / 4.0; };
  return solid(width) - (wall > 0.0 ? solid(width - 2.0 * wall) : 0.0);
}

double plastic_modulus(SectionShape shape, double width, double wall, BendingAxis axis) {
  check_shape(width, wall);
  // Z = 2·Q(0): square b³/4 (side axis) or b³/(3√2) (diagonal), round D³/6; hollow = outer −
  // inner.
  const auto solid = [&](double b) {
    if (shape == SectionShape::round) return b * b * b / 6.0;
    return axis == BendingAxis::diagonal ? b * b * b / (3.0 * std::sqrt(2.0)) : b * b * b / 4.0;
  };
  return solid(width) - (wall > 0.0 ? solid(width - 2.0 * wall) : 0.0);
}

double elastic_modulus(SectionShape shape, double width, double wall, BendingAxis axis) {
  check_shape(width, wall);
  // S = I/c: I = b⁴/12 (square, any axis), πD⁴/64 (round); hollow = outer I − inner I;
  // c = b/2, or b/√2 about a square's diagonal.
  const auto inertia = [&](double b) {
    return shape == SectionShape::square ? b * b * b * b / 12.0 : kPi * b * b * b * b / 64.0;
  };
  return (inertia(width) - (wall > 0.0 ? inertia(width - 2.0 * wall) : 0.0)) /
         half_depth(shape, width, axis);
}

double steel_plastic_moment(SectionShape shape, double width, double wall, double yield_stress,
                            double axial, BendingAxis axis) {
  check_shape(width, wall);
  if (!(yield_stress > 0.0)) throw std::invalid_argument("steel yield fy must be positive");
  const double area = section_area(shape, width, wall);
  // Compression on the part above y0: fy·(2·A_above − A) = |P| (the sign of P only mirrors
  // the stress distribution).
  const double target = 0.5 * (area + std::abs(axial) / yield_stress);
  if (target >= area) return 0.0;
  const double h = half_depth(shape, width, axis);
  // A_above falls as y0 rises: solve on −y0.
  const double y0 = -solve_increasing(
      [&](double minus_y) { return above(shape, width, wall, -minus_y, axis).area; }, -h, h,
      target);
  return yield_stress * 2.0 * above(shape, width, wall, y0, axis).moment;
}

double stress_block_beta1(double concrete_strength) {
  const double mpa = concrete_strength / 1000.0;
  return std::clamp(0.85 - 0.05 * (mpa - 28.0) / 7.0, 0.65, 0.85);
}

double concrete_moment_capacity(const ReinforcedSection& s, double axial, BendingAxis axis) {
  check_shape(s.width, 0.0);
  if (!(s.concrete_strength > 0.0 && s.steel_yield > 0.0 && s.steel_area > 0.0))
    throw std::invalid_argument("f'c, fy and As must be positive");
  if (s.bar_count < (s.shape == SectionShape::square ? 4 : 2))
    throw std::invalid_argument("too few bars for the section");
  if (!(s.cover_to_bar_center > 0.0 && s.cover_to_bar_center < 0.5 * s.width))
    throw std::invalid_argument("bar cover must lie in (0, width/2)");
  double m = std::numeric_limits<double>::infinity();
  for (bool turned : {false, true}) {
    if (turned && s.shape == SectionShape::square) continue;
    for (bool mirrored : {false, true})
      m = std::min(m, concrete_moment_one_layout(s, axis, bar_depths(s, turned, axis, mirrored),
                                                 axial));
  }
  return m;
}

SectionYieldMoment section_yield_moment(const PileType& type,
                                        const std::optional<AxialRange>& axial,
                                        UnitSystem units) {
  SectionYieldMoment out;
  const auto moment_text = [&](double si) { return number(units, Shown::moment, si); };
  const auto force_text = [&](double si) { return number(units, Shown::force, si); };
  if (type.structure && type.structure->yield_moment) {
    out.value = type.structure->yield_moment;
    out.basis = "My = " + moment_text(*out.value) + " (structure.yield_moment)";
    return out;
  }
  if (!type.structure) {
    out.missing = "the pile type gives no structure (concrete_strength with steel_area, "
                  "steel_yield, bar_count and cover_to_bar_center; steel_yield for steel; "
                  "bending_strength for timber)";
    return out;
  }
  const Structure& st = *type.structure;
  const SectionShape shape = type.section.shape;
  const double width = type.section.width;
  const char* shape_name = shape == SectionShape::square ? "square" : "round";
  // The least favourable of the two ends of the axial range (M(P) is concave in P).
  const AxialRange range = axial.value_or(AxialRange{});
  // A pile's lateral load may come from any direction: a square is bent about the weaker of
  // its side and diagonal axes (a round section is the same about any).
  BendingAxis weak = BendingAxis::side;
  const auto weakest = [&](auto moment_about) {
    double m = moment_about(BendingAxis::side);
    if (shape == SectionShape::square) {
      const double diagonal = moment_about(BendingAxis::diagonal);
      if (diagonal < m) {
        m = diagonal;
        weak = BendingAxis::diagonal;
      }
    }
    return m;
  };
  const auto axis_words = [&] {
    if (shape != SectionShape::square) return std::string();
    return std::string(weak == BendingAxis::diagonal ? ", about the diagonal (weaker than a side)"
                                                     : ", about an axis parallel to a side (weaker than the diagonal)");
  };
  const auto at_range = [&](auto moment_at) {
    const double low = moment_at(range.least), high = moment_at(range.greatest);
    out.axial = low <= high ? range.least : range.greatest;
    return std::min(low, high);
  };
  const auto place = [&] {
    return axial ? fmt::format("at P = {}{}, the least favourable axial force of all "
                               "combinations (range {} to {}, compression positive)",
                               force_text(out.axial), out.axial < 0.0 ? " (tension)" : "",
                               force_text(range.least),
                               force_text(range.greatest))
                 : std::string("at P = 0 (axial forces not known)");
  };
  if (st.concrete_strength) {
    std::vector<std::string> need;
    if (!st.steel_area || *st.steel_area <= 0.0) need.push_back("steel_area");
    if (!st.steel_yield) need.push_back("steel_yield");
    if (!st.bar_count) need.push_back("bar_count");
    if (!st.cover_to_bar_center) need.push_back("cover_to_bar_center");
    if (!need.empty()) {
      out.missing = "the concrete section's reinforcement is not fully given (structure." +
                    fmt::format("{}", fmt::join(need, ", structure.")) + ")";
      return out;
    }
    ReinforcedSection rc{shape, width, *st.concrete_strength, *st.steel_yield, *st.steel_area,
                         *st.bar_count, *st.cover_to_bar_center};
    try {
      const double m = at_range([&](double p) {
        return weakest([&](BendingAxis axis) { return concrete_moment_capacity(rc, p, axis); });
      });
      if (!(m > 0.0)) {
        out.missing = fmt::format("the reinforced section has no moment capacity at P = {} "
                                  "(outside −As·fy … the largest compression)",
                                  force_text(out.axial));
        return out;
      }
      out.value = m;
    } catch (const std::invalid_argument& e) {
      out.missing = std::string("the reinforcement cannot be laid out: ") + e.what();
      return out;
    }
    out.basis = fmt::format("My = Mn = {} from f'c and {} bars by strain compatibility with the "
                            "ACI 318-19 rectangular stress block (β1 = {}){}, {}",
                            moment_text(*out.value), *st.bar_count,
                            QuantityFormat::code_factor(stress_block_beta1(*st.concrete_strength)), axis_words(), place());
    return out;
  }
  if (st.steel_yield) {
    const double wall = st.wall_thickness.value_or(0.0);
    if (!(wall < 0.5 * width)) {
      out.missing = "structure.wall_thickness is not less than half the section's width";
      return out;
    }
    const double area = section_area(shape, width, wall);
    const char* kind = wall > 0.0 ? (shape == SectionShape::round ? "pipe" : "hollow square")
                                  : (shape == SectionShape::round ? "solid round" : "solid square");
    if (st.steel_area && std::abs(*st.steel_area - area) > kAreaTolerance * area) {
      out.missing = fmt::format(
          "steel_area differs from the {} section's own area by more than {:g} %, so the "
          "section is some other shape (an H-pile?){}",
          kind, 100 * kAreaTolerance,
          wall > 0.0 ? "" : "; for a pipe or hollow section give structure.wall_thickness");
      return out;
    }
    if (wall > 0.0) {
      // Compactness in flexure, AISC 360-16 Table B4.1b (from memory): round HSS D/t ≤
      // 0.07·E/fy (case 20); square HSS flange b/t ≤ 1.12·√(E/fy) (case 17), b the flat width,
      // taken as b − 3t.
      const double fy = *st.steel_yield;
      const bool compact = shape == SectionShape::round
                               ? width / wall <= 0.07 * kSteelModulus / fy
                               : (width - 3.0 * wall) / wall <= 1.12 * std::sqrt(kSteelModulus / fy);
      if (!compact) {
        out.missing = fmt::format("the {} wall is too slender to reach its plastic moment "
                                  "(AISC 360-16 Table B4.1b)",
                                  kind);
        return out;
      }
    }
    const double m = at_range([&](double p) {
      return weakest([&](BendingAxis axis) {
        return steel_plastic_moment(shape, width, wall, *st.steel_yield, p, axis);
      });
    });
    if (!(m > 0.0)) {
      out.missing = fmt::format("the steel section has no moment capacity at P = {}",
                                force_text(out.axial));
      return out;
    }
    out.value = m;
    out.basis = fmt::format("My = {} for the {} steel section: fy·Z = {} with the plastic "
                            "modulus Z{}, reduced for the axial force {}",
                            moment_text(m), kind,
                            moment_text(*st.steel_yield * plastic_modulus(shape, width, wall, weak)),
                            axis_words(), place());
    return out;
  }
  if (st.bending_strength) {
    const double s = weakest([&](BendingAxis axis) { return elastic_modulus(shape, width, 0.0, axis); });
    out.value = *st.bending_strength * s;
    out.basis = fmt::format("My = Fb·S = {} for the {} timber section (elastic modulus S{}; the "
                            "axial force is not included)",
                            moment_text(*out.value), shape_name, axis_words());
    return out;
  }
  out.missing = "the structure gives no material strength for bending";
  return out;
}

}  // namespace cairn
