#include "cairn/core/model.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <numbers>

#include "cairn/core/enum_names.hpp"
#include "cairn/core/plan.hpp"

namespace cairn {

double Section::area() const {
  return shape == SectionShape::square ? width * width : std::numbers::pi * width * width / 4.0;
}

double Section::perimeter() const {
  return shape == SectionShape::square ? 4.0 * width : std::numbers::pi * width;
}

namespace {
// The inner width of a hollow section (structure.wall_thickness below half the width), else 0.
double inner_width(const PileType& type) {
  if (!type.structure || !type.structure->wall_thickness) return 0.0;
  const double t = *type.structure->wall_thickness;
  return t > 0.0 && t < 0.5 * type.section.width ? type.section.width - 2.0 * t : 0.0;
}
}  // namespace

double PileType::material_area() const {
  const double b = section.width, bi = inner_width(*this);
  return section.shape == SectionShape::square ? b * b - bi * bi
                                               : std::numbers::pi * (b * b - bi * bi) / 4.0;
}

double PileType::material_inertia() const {
  const double b4 = std::pow(section.width, 4), bi4 = std::pow(inner_width(*this), 4);
  return section.shape == SectionShape::square ? (b4 - bi4) / 12.0
                                               : std::numbers::pi * (b4 - bi4) / 64.0;
}

double PileType::axial_stiffness_used() const {
  // Default: elastic shortening of the whole pile, E·A/L (a column fixed at the toe).
  if (axial_stiffness) return *axial_stiffness;
  return elastic_modulus * material_area() / length;
}

double PileType::lateral_stiffness_used() const { return lateral_stiffness.value_or(0.0); }

std::array<double, 3> Pile::axis() const {
  if (!batter) return {0.0, 0.0, -1.0};
  const double h = 1.0 / batter->ratio;  // horizontal per unit vertical
  const double a = batter->toward_deg * std::numbers::pi / 180.0;
  const double n = std::sqrt(1.0 + h * h);
  return {h * std::cos(a) / n, h * std::sin(a) / n, -1.0 / n};
}

double Outline::area() const { return polygon_area(polygon); }

std::array<double, 2> Outline::centroid() const {
  double twice = 0.0, cx = 0.0, cy = 0.0;
  for (std::size_t i = 0; i < polygon.size(); ++i) {
    const auto& p = polygon[i];
    const auto& q = polygon[(i + 1) % polygon.size()];
    const double cross = p[0] * q[1] - q[0] * p[1];
    twice += cross;
    cx += (p[0] + q[0]) * cross;
    cy += (p[1] + q[1]) * cross;
  }
  if (twice == 0.0) return {0.0, 0.0};
  return {cx / (3.0 * twice), cy / (3.0 * twice)};
}

bool Outline::contains(double x, double y) const {
  // Ray casting; points on an edge count as inside.
  if (distance_to_edge(x, y) < 1e-9) return true;
  bool inside = false;
  for (std::size_t i = 0, j = polygon.size() - 1; i < polygon.size(); j = i++) {
    const auto& a = polygon[i];
    const auto& b = polygon[j];
    if ((a[1] > y) != (b[1] > y) && x < (b[0] - a[0]) * (y - a[1]) / (b[1] - a[1]) + a[0])
      inside = !inside;
  }
  return inside;
}

double Outline::distance_to_edge(double x, double y) const {
  double best = std::numeric_limits<double>::infinity();
  for (std::size_t i = 0; i < polygon.size(); ++i) {
    const auto& a = polygon[i];
    const auto& b = polygon[(i + 1) % polygon.size()];
    const double dx = b[0] - a[0], dy = b[1] - a[1];
    const double len2 = dx * dx + dy * dy;
    double t = len2 > 0 ? ((x - a[0]) * dx + (y - a[1]) * dy) / len2 : 0.0;
    t = std::clamp(t, 0.0, 1.0);
    best = std::min(best, std::hypot(x - (a[0] + t * dx), y - (a[1] + t * dy)));
  }
  return best;
}

// Names in the order the enum declares its values (enum_names.hpp).
constexpr const char* kLimitStateNames[] = {"service", "strength", "seismic-overstrength"};
const char* to_string(LimitState s) { return name_in(kLimitStateNames, s); }

constexpr const char* kCapacityBasisNames[] = {"allowable", "factored", "ultimate"};
const char* to_string(CapacityBasis b) { return name_in(kCapacityBasisNames, b); }

constexpr const char* kLoadKindNames[] = {
    "dead",           "live",     "roof_live", "snow",        "rain",  "wind",
    "seismic",        "earth",    "fluid",     "temperature", "other", "wearing_surface",
    "vertical_earth", "collision"};
const char* to_string(LoadKind k) { return name_in(kLoadKindNames, k); }

constexpr const char* kResistanceSetNames[] = {"basis",      "EN 1997 R1", "EN 1997 R2",
                                               "EN 1997 R3", "EN 1997 R4", "AASHTO extreme event"};
const char* to_string(ResistanceSet r) { return name_in(kResistanceSetNames, r); }

constexpr const char* kEn1997PileKindNames[] = {"driven", "bored", "cfa"};
const char* to_string(En1997PileKind k) { return name_in(kEn1997PileKindNames, k); }

const char* to_string(SectionShape s) { return s == SectionShape::square ? "square" : "round"; }

constexpr const char* kSoilResponseNames[] = {"linear", "nonlinear"};
const char* to_string(SoilResponse r) { return name_in(kSoilResponseNames, r); }

constexpr const char* kGroupMultipliersNames[] = {"by_direction", "reversing", "none"};
const char* to_string(GroupMultipliers m) { return name_in(kGroupMultipliersNames, m); }
constexpr const char* kLateralLoadingNames[] = {"static", "cyclic"};
const char* to_string(LateralLoading l) { return name_in(kLateralLoadingNames, l); }

Wrench resultant_about(const LoadCase& load_case, const std::array<double, 3>& point) {
  Wrench total{};
  for (const auto& load : load_case.loads) {
    // The lever arm as differences of input coordinates: exact for nearby numbers, so a
    // group far from the origin keeps every digit of its moments.
    const std::array<double, 3> r = {load.at[0] - point[0], load.at[1] - point[1],
                                     load.at[2] - point[2]};
    const auto& f = load.load;
    total[0] += f[0];
    total[1] += f[1];
    total[2] += f[2];
    // M = r × F + M_applied
    total[3] += r[1] * f[2] - r[2] * f[1] + f[3];
    total[4] += r[2] * f[0] - r[0] * f[2] + f[4];
    total[5] += r[0] * f[1] - r[1] * f[0] + f[5];
  }
  return total;
}

Wrench resultant_about_origin(const LoadCase& load_case) {
  return resultant_about(load_case, {0.0, 0.0, 0.0});
}

}  // namespace cairn
