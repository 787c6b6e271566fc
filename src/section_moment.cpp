// section_moment.cpp — yield moments of pile sections. Equations and sources in
// section_moment.hpp and docs/methods-lateral.md.
#include "cairn/section_moment.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <stdexcept>
#include <vector>

#include <fmt/format.h>

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

// Area and first moment about the centroid of the part of a solid square (side b) or circle
// (diameter b) above the line y = y0 (y from the centroid, toward the compression face).
// Circle, half-width R: A = R²·acos(y0/R) − y0·√(R² − y0²), Q = (2/3)(R² − y0²)^(3/2).
// Square: A = b(b/2 − y0), Q = b(b²/4 − y0²)/2.
struct Part {
  double area = 0.0;
  double moment = 0.0;
};

Part solid_above(SectionShape shape, double width, double y0) {
  const double h = 0.5 * width;
  const double y = std::clamp(y0, -h, h);
  if (shape == SectionShape::square) return {width * (h - y), 0.5 * width * (h * h - y * y)};
  const double root = std::sqrt(std::max(h * h - y * y, 0.0));
  return {h * h * std::acos(y / h) - y * root, 2.0 / 3.0 * root * root * root};
}

// The same for a hollow section: outer part less inner part.
Part above(SectionShape shape, double width, double wall, double y0) {
  Part outer = solid_above(shape, width, y0);
  if (wall > 0.0) {
    const Part inner = solid_above(shape, width - 2.0 * wall, y0);
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

// Bar centres as distances from the compression face, m.
std::vector<double> bar_depths(const ReinforcedSection& s, bool turned) {
  std::vector<double> depths;
  const double n = s.bar_count;
  if (s.shape == SectionShape::round) {
    const double radius = 0.5 * s.width - s.cover_to_bar_center;
    const double offset = turned ? kPi / n : 0.0;
    for (int i = 0; i < s.bar_count; ++i)
      depths.push_back(0.5 * s.width - radius * std::cos(2.0 * kPi * i / n + offset));
    return depths;
  }
  // Square: evenly along the perimeter of the square through the bar centres, from a corner.
  const double side = s.width - 2.0 * s.cover_to_bar_center;
  for (int i = 0; i < s.bar_count; ++i) {
    const double along = 4.0 * side * i / n;  // distance round the perimeter
    const int edge = static_cast<int>(along / side);
    const double t = along - edge * side;
    // Edges in order: top (depth 0), right (going down), bottom, left (going up).
    double depth = 0.0;
    switch (edge) {
      case 0: depth = 0.0; break;
      case 1: depth = t; break;
      case 2: depth = side; break;
      default: depth = side - t; break;
    }
    depths.push_back(s.cover_to_bar_center + depth);
  }
  return depths;
}

// Axial force (kN) and moment about the centroid (kN·m) at neutral-axis depth c (m).
std::pair<double, double> concrete_forces(const ReinforcedSection& s,
                                          const std::vector<double>& depths, double c) {
  const double h = 0.5 * s.width;
  const double a = std::min(stress_block_beta1(s.concrete_strength) * c, s.width);
  const double stress = 0.85 * s.concrete_strength;
  const Part block = above(s.shape, s.width, 0.0, h - a);
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

double concrete_moment_one_layout(const ReinforcedSection& s, const std::vector<double>& depths,
                                  double axial) {
  const auto force = [&](double c) { return concrete_forces(s, depths, c).first; };
  // c → 0: every bar yields in tension; c large: the whole section in compression.
  const double lo = 1e-9 * s.width, hi = 1e3 * s.width;
  if (axial <= force(lo) || axial >= force(hi)) return 0.0;
  const double c = solve_increasing(force, lo, hi, axial);
  return std::max(concrete_forces(s, depths, c).second, 0.0);
}

std::string number(UnitSystem units, Quantity q, double si) {
  return fmt::format("{:.1f} {}", from_si(units, q, si), unit_label(units, q));
}

}  // namespace

double section_area(SectionShape shape, double width, double wall) {
  check_shape(width, wall);
  const auto solid = [&](double b) { return shape == SectionShape::square ? b * b : kPi * b * b / 4.0; };
  return solid(width) - (wall > 0.0 ? solid(width - 2.0 * wall) : 0.0);
}

double plastic_modulus(SectionShape shape, double width, double wall) {
  check_shape(width, wall);
  // Z = 2·Q(0): square b³/4, round D³/6, hollow = outer − inner.
  const auto solid = [&](double b) { return shape == SectionShape::square ? b * b * b / 4.0 : b * b * b / 6.0; };
  return solid(width) - (wall > 0.0 ? solid(width - 2.0 * wall) : 0.0);
}

double elastic_modulus(SectionShape shape, double width, double wall) {
  check_shape(width, wall);
  // S = I/(b/2): I = b⁴/12 (square), πD⁴/64 (round); hollow = outer I − inner I.
  const auto inertia = [&](double b) {
    return shape == SectionShape::square ? b * b * b * b / 12.0 : kPi * b * b * b * b / 64.0;
  };
  return (inertia(width) - (wall > 0.0 ? inertia(width - 2.0 * wall) : 0.0)) / (0.5 * width);
}

double steel_plastic_moment(SectionShape shape, double width, double wall, double yield_stress,
                            double axial) {
  check_shape(width, wall);
  if (!(yield_stress > 0.0)) throw std::invalid_argument("steel yield fy must be positive");
  const double area = section_area(shape, width, wall);
  // Compression on the part above y0: fy·(2·A_above − A) = |P| (the sign of P only mirrors
  // the stress distribution).
  const double target = 0.5 * (area + std::abs(axial) / yield_stress);
  if (target >= area) return 0.0;
  const double h = 0.5 * width;
  // A_above falls as y0 rises: solve on −y0.
  const double y0 = -solve_increasing(
      [&](double minus_y) { return above(shape, width, wall, -minus_y).area; }, -h, h, target);
  return yield_stress * 2.0 * above(shape, width, wall, y0).moment;
}

double stress_block_beta1(double concrete_strength) {
  const double mpa = concrete_strength / 1000.0;
  return std::clamp(0.85 - 0.05 * (mpa - 28.0) / 7.0, 0.65, 0.85);
}

double concrete_moment_capacity(const ReinforcedSection& s, double axial) {
  check_shape(s.width, 0.0);
  if (!(s.concrete_strength > 0.0 && s.steel_yield > 0.0 && s.steel_area > 0.0))
    throw std::invalid_argument("f'c, fy and As must be positive");
  if (s.bar_count < (s.shape == SectionShape::square ? 4 : 2))
    throw std::invalid_argument("too few bars for the section");
  if (!(s.cover_to_bar_center > 0.0 && s.cover_to_bar_center < 0.5 * s.width))
    throw std::invalid_argument("bar cover must lie in (0, width/2)");
  double m = concrete_moment_one_layout(s, bar_depths(s, false), axial);
  if (s.shape == SectionShape::round)
    m = std::min(m, concrete_moment_one_layout(s, bar_depths(s, true), axial));
  return m;
}

SectionYieldMoment section_yield_moment(const PileType& type,
                                        const std::optional<AxialRange>& axial,
                                        UnitSystem units) {
  SectionYieldMoment out;
  const auto moment_text = [&](double si) { return number(units, Quantity::moment, si); };
  const auto force_text = [&](double si) { return number(units, Quantity::force, si); };
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
  const auto at_range = [&](auto moment_at) {
    const double low = moment_at(range.least), high = moment_at(range.greatest);
    out.axial = low <= high ? range.least : range.greatest;
    return std::min(low, high);
  };
  const auto place = [&] {
    return axial ? fmt::format("at P = {}, the least favourable axial force of all combinations "
                               "(range {} to {}, compression positive)",
                               force_text(out.axial), force_text(range.least),
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
      const double m = at_range([&](double p) { return concrete_moment_capacity(rc, p); });
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
                            "ACI 318-19 rectangular stress block (β1 = {:.2f}), {}",
                            moment_text(*out.value), *st.bar_count,
                            stress_block_beta1(*st.concrete_strength), place());
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
      return steel_plastic_moment(shape, width, wall, *st.steel_yield, p);
    });
    if (!(m > 0.0)) {
      out.missing = fmt::format("the steel section has no moment capacity at P = {}",
                                force_text(out.axial));
      return out;
    }
    out.value = m;
    out.basis = fmt::format("My = {} for the {} steel section: fy·Z = {} with the plastic "
                            "modulus Z, reduced for the axial force {}",
                            moment_text(m), kind,
                            moment_text(*st.steel_yield * plastic_modulus(shape, width, wall)),
                            place());
    return out;
  }
  if (st.bending_strength) {
    const double s = elastic_modulus(shape, width, 0.0);
    out.value = *st.bending_strength * s;
    out.basis = fmt::format("My = Fb·S = {} for the {} timber section (elastic modulus S; the "
                            "axial force is not included)",
                            moment_text(*out.value), shape_name);
    return out;
  }
  out.missing = "the structure gives no material strength for bending";
  return out;
}

}  // namespace cairn
