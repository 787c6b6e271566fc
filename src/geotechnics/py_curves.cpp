#include "cairn/geotechnics/py_curves.hpp"

#include <algorithm>
#include <array>
#include <cstddef>
#include <cmath>
#include <numbers>
#include <stdexcept>
#include <string>

namespace cairn {
namespace {

void require_positive(double v, const char* what) {
  if (!(v > 0.0) || !std::isfinite(v))
    throw std::invalid_argument(std::string(what) + " must be a positive number");
}
void require_depth(double z) {
  if (!(z >= 0.0) || !std::isfinite(z)) throw std::invalid_argument("depth must be ≥ 0");
}
double radians(double degrees) { return degrees * std::numbers::pi / 180.0; }
double sign_of(double y) { return y < 0.0 ? -1.0 : 1.0; }

// The clay curves' ultimate resistance per length at depth z: the lesser of the wedge
// (3 + γ'z/c + J·z/b)·c·b and the flow around the pile 9·c·b; J = 0.5 for stiff clay.
double clay_ultimate(double c, double gamma, double b, double j, double z) {
  require_positive(c, "undrained strength c");
  require_positive(gamma, "effective unit weight γ'");
  require_positive(b, "pile width b");
  require_depth(z);
  return std::min((3.0 + gamma * z / c + j * z / b) * c * b, 9.0 * c * b);
}
// The clay curves' deflection at half the ultimate resistance, y50 = 2.5·ε50·b.
double clay_y50(double strain_50, double b) {
  require_positive(strain_50, "ε50");
  require_positive(b, "pile width b");
  return 2.5 * strain_50 * b;
}

// The wedge and flow coefficients of Reese, Cox & Koop (1974) at φ' (degrees), with K0 = 0.4:
// the sand's theoretical resistance is min[(C1·z + C2·b)·γ'·z, C3·b·γ'·z].
struct SandCoefficients {
  double c1, c2, c3;
};
SandCoefficients sand_coefficients(double friction_angle) {
  if (!(friction_angle > 0.0 && friction_angle < 90.0))
    throw std::invalid_argument("friction angle must lie between 0 and 90 degrees");
  const double phi = radians(friction_angle), a = phi / 2.0, b = radians(45.0) + phi / 2.0;
  const double ka = std::pow(std::tan(radians(45.0) - phi / 2.0), 2);
  constexpr double k0 = 0.4;
  return {k0 * std::tan(phi) * std::sin(b) / (std::tan(b - phi) * std::cos(a)) +
              std::pow(std::tan(b), 2) * std::tan(a) / std::tan(b - phi) +
              k0 * std::tan(b) * (std::tan(phi) * std::sin(b) - std::tan(a)),
          std::tan(b) / std::tan(b - phi) - ka,
          ka * (std::pow(std::tan(b), 8) - 1.0) + k0 * std::tan(phi) * std::pow(std::tan(b), 4)};
}
double sand_theoretical(double friction_angle, double gamma, double b, double z) {
  require_positive(gamma, "effective unit weight γ'");
  require_positive(b, "pile width b");
  require_depth(z);
  const auto c = sand_coefficients(friction_angle);
  return std::min((c.c1 * z + c.c2 * b) * gamma * z, c.c3 * b * gamma * z);
}

// A factor read from a chart against z/b: straight lines between the tabulated points, the
// last value held beyond the table.
struct ChartPoint {
  double depth_over_width, value;
};
template <std::size_t N>
double read_chart(const std::array<ChartPoint, N>& chart, double depth_over_width) {
  if (depth_over_width <= chart.front().depth_over_width) return chart.front().value;
  for (std::size_t i = 1; i < N; ++i) {
    if (depth_over_width <= chart[i].depth_over_width) {
      const auto& lo = chart[i - 1];
      const auto& hi = chart[i];
      const double t = (depth_over_width - lo.depth_over_width) /
                       (hi.depth_over_width - lo.depth_over_width);
      return lo.value + t * (hi.value - lo.value);
    }
  }
  return chart.back().value;
}

// Reese, Cox & Koop (1974), the empirical factors against z/b (from memory of the paper's
// chart, to about ±0.1; the paper gives A = 0.88, B_s = 0.50, B_c = 0.55 below z/b = 5).
constexpr std::array<ChartPoint, 11> kSandAStatic{{{0.0, 2.85}, {0.5, 2.45}, {1.0, 2.05},
    {1.5, 1.72}, {2.0, 1.45}, {2.5, 1.25}, {3.0, 1.10}, {3.5, 1.00}, {4.0, 0.93}, {4.5, 0.89},
    {5.0, 0.88}}};
constexpr std::array<ChartPoint, 11> kSandACyclic{{{0.0, 2.20}, {0.5, 1.90}, {1.0, 1.62},
    {1.5, 1.40}, {2.0, 1.22}, {2.5, 1.10}, {3.0, 1.00}, {3.5, 0.94}, {4.0, 0.90}, {4.5, 0.88},
    {5.0, 0.88}}};
constexpr std::array<ChartPoint, 11> kSandBStatic{{{0.0, 2.15}, {0.5, 1.85}, {1.0, 1.55},
    {1.5, 1.30}, {2.0, 1.10}, {2.5, 0.93}, {3.0, 0.80}, {3.5, 0.68}, {4.0, 0.59}, {4.5, 0.53},
    {5.0, 0.50}}};
constexpr std::array<ChartPoint, 11> kSandBCyclic{{{0.0, 1.90}, {0.5, 1.65}, {1.0, 1.42},
    {1.5, 1.22}, {2.0, 1.06}, {2.5, 0.93}, {3.0, 0.83}, {3.5, 0.74}, {4.0, 0.66}, {4.5, 0.60},
    {5.0, 0.55}}};

// Reese, Cox & Koop (1975), A_s and A_c against z/b (from memory of the paper's chart: both
// 0.2 at the surface, A_c reaching 0.3 by about z/b = 1.5, A_s reaching 0.6 by about 5).
constexpr std::array<ChartPoint, 9> kClayAStatic{{{0.0, 0.20}, {0.5, 0.32}, {1.0, 0.42},
    {1.5, 0.49}, {2.0, 0.54}, {3.0, 0.58}, {4.0, 0.59}, {5.0, 0.60}, {6.0, 0.60}}};
constexpr std::array<ChartPoint, 9> kClayACyclic{{{0.0, 0.20}, {0.5, 0.26}, {1.0, 0.29},
    {1.5, 0.30}, {2.0, 0.30}, {3.0, 0.30}, {4.0, 0.30}, {5.0, 0.30}, {6.0, 0.30}}};

// A value given per class of strength at the classes' middles: straight lines between them,
// the end values held outside.
double by_strength_class(double c, const std::array<double, 3>& values) {
  constexpr std::array<double, 3> middles{75.0, 150.0, 300.0};  // kPa: 50–100, 100–200, 200–400
  if (c <= middles[0]) return values[0];
  if (c >= middles[2]) return values[2];
  const std::size_t i = c <= middles[1] ? 0 : 1;
  return values[i] + (c - middles[i]) / (middles[i + 1] - middles[i]) * (values[i + 1] - values[i]);
}

// The papers print these rounded (0.411 and 0.936); the exact values of the expressions they
// round keep the stiff-clay curves continuous at 6·A_s·y50 and 0.6·y_p: 0.055·5^1.25 and
// 1 − (1/3)^2.5.
const double kDrop = 0.055 * std::pow(5.0, 1.25);
const double kShoulder = 1.0 - std::pow(1.0 / 3.0, 2.5);

}  // namespace

double SoftClayPy::ultimate(double z) const {
  return clay_ultimate(undrained_strength, effective_unit_weight, width, j, z);
}

double SoftClayPy::y50() const { return clay_y50(strain_50, width); }

double SoftClayPy::transition_depth() const {
  return 6.0 * undrained_strength * width / (effective_unit_weight * width + j * undrained_strength);
}

double SoftClayPy::resistance(double z, double y) const {
  const double pu = ultimate(z), y50v = y50(), r = std::abs(y) / y50v;
  double p = 0.0;
  if (loading == PyLoading::static_load) {
    p = r >= 8.0 ? pu : 0.5 * pu * std::cbrt(r);
  } else if (r <= 3.0) {
    p = 0.5 * pu * std::cbrt(r);
  } else {
    const double zr = transition_depth();
    // 0.5·3^(1/3) = 0.7211: Matlock's 0.72·pu is the static curve at 3·y50.
    const double top = 0.5 * pu * std::cbrt(3.0);
    if (z >= zr) {
      p = top;
    } else {
      const double bottom = top * z / zr;
      p = r >= 15.0 ? bottom : top + (bottom - top) * (r - 3.0) / 12.0;
    }
  }
  return sign_of(y) * p;
}

double StiffClayDryPy::ultimate(double z) const {
  return clay_ultimate(undrained_strength, effective_unit_weight, width, 0.5, z);
}

double StiffClayDryPy::y50() const { return clay_y50(strain_50, width); }

double StiffClayDryPy::deflection(double z, double p) const {
  if (!(cycles >= 1.0)) throw std::invalid_argument("cycles must be at least 1");
  const double ratio = std::clamp(p / ultimate(z), 0.0, 1.0);
  // Static: y = y50·(2·p/pu)⁴ (p = 0.5·pu·(y/y50)^(1/4) inverted); cyclic adds 9.6·(p/pu)⁴·y50·log N.
  return y50() * (std::pow(2.0 * ratio, 4) + 9.6 * std::pow(ratio, 4) * std::log10(cycles));
}

double StiffClayDryPy::resistance(double z, double y) const {
  const double pu = ultimate(z), target = std::abs(y);
  if (target >= deflection(z, pu)) return sign_of(y) * pu;
  // The deflection grows with p as (p/pu)⁴·(16 + 9.6·log N)·y50: invert it in closed form.
  const double scale = y50() * (16.0 + 9.6 * std::log10(cycles));
  return sign_of(y) * pu * std::pow(target / scale, 0.25);
}

double SandApiPy::c1() const { return sand_coefficients(friction_angle).c1; }
double SandApiPy::c2() const { return sand_coefficients(friction_angle).c2; }
double SandApiPy::c3() const { return sand_coefficients(friction_angle).c3; }

double SandApiPy::ultimate(double z) const {
  return sand_theoretical(friction_angle, effective_unit_weight, width, z);
}

double SandApiPy::factor(double z) const {
  if (loading == PyLoading::cyclic) return 0.9;
  return std::max(3.0 - 0.8 * z / width, 0.9);
}

double SandApiPy::resistance(double z, double y) const {
  require_positive(initial_modulus, "initial modulus k");
  const double pu = ultimate(z);
  if (pu <= 0.0) return 0.0;  // at the surface
  const double ap = factor(z) * pu;
  return ap * std::tanh(initial_modulus * z * y / ap);
}

double SandApiPy::initial_slope(double z) const {
  require_positive(initial_modulus, "initial modulus k");
  require_depth(z);
  return initial_modulus * z;
}

double SandReesePy::theoretical(double z) const {
  return sand_theoretical(friction_angle, effective_unit_weight, width, z);
}

double SandReesePy::factor_a(double z) const {
  require_positive(width, "pile width b");
  return read_chart(loading == PyLoading::static_load ? kSandAStatic : kSandACyclic, z / width);
}

double SandReesePy::factor_b(double z) const {
  require_positive(width, "pile width b");
  return read_chart(loading == PyLoading::static_load ? kSandBStatic : kSandBCyclic, z / width);
}

double SandReesePy::ultimate(double z) const { return factor_a(z) * theoretical(z); }
double SandReesePy::y_m() const { return width / 60.0; }
double SandReesePy::y_u() const { return 3.0 * width / 80.0; }

double SandReesePy::initial_slope(double z) const {
  require_positive(initial_modulus, "initial modulus k");
  require_depth(z);
  return initial_modulus * z;
}

double SandReesePy::resistance(double z, double y) const {
  const double k_z = initial_slope(z), ps = theoretical(z);
  if (ps <= 0.0) return 0.0;  // at the surface
  const double pu = factor_a(z) * ps, pm = factor_b(z) * ps, ym = y_m(), yu = y_u();
  const double a = std::abs(y);
  double p = pu;
  if (a < ym) {
    // The parabola p = C̄·y^(1/n) through (y_m, p_m) with the slope m of the next line there.
    // n ≤ 1 (A ≥ 2.25·B) would make it convex and leave no intersection with the initial line:
    // not reached with the paper's factors; the straight chord is used then.
    const double m = (pu - pm) / (yu - ym), n = m > 0.0 ? pm / (m * ym) : 0.0;
    p = n > 1.0 ? pm * std::pow(a / ym, 1.0 / n) : pm * a / ym;
  } else if (a < yu) {
    p = pm + (pu - pm) * (a - ym) / (yu - ym);
  }
  return sign_of(y) * std::min(p, k_z * a);
}

double sand_subgrade_modulus(SandDensity density, bool below_water_table) {
  // Reese, Cox & Koop (1974), from memory: 20, 60, 125 and 25, 90, 225 lb/in³ (× 271.45 to kN/m³).
  constexpr std::array<double, 3> below{5400.0, 16300.0, 34000.0};
  constexpr std::array<double, 3> above{6800.0, 24400.0, 61000.0};
  const auto i = static_cast<std::size_t>(density);
  return below_water_table ? below[i] : above[i];
}

double StiffClayWetPy::strength(double z) const {
  require_positive(undrained_strength, "undrained strength c");
  if (!(strength_gradient >= 0.0) || !std::isfinite(strength_gradient))
    throw std::invalid_argument("strength gradient must be ≥ 0");
  require_depth(z);
  return undrained_strength + strength_gradient * z;
}

double StiffClayWetPy::average_strength(double z) const {
  return 0.5 * (strength(0.0) + strength(z));
}

double StiffClayWetPy::ultimate(double z) const {
  require_positive(effective_unit_weight, "effective unit weight γ'");
  require_positive(width, "pile width b");
  const double ca = average_strength(z), c = strength(z), b = width;
  return std::min(2.0 * ca * b + effective_unit_weight * b * z + 2.83 * ca * z, 11.0 * c * b);
}

double StiffClayWetPy::y50() const {
  require_positive(strain_50, "ε50");
  require_positive(width, "pile width b");
  return strain_50 * width;
}

double StiffClayWetPy::factor_a(double z) const {
  require_positive(width, "pile width b");
  return read_chart(loading == PyLoading::static_load ? kClayAStatic : kClayACyclic, z / width);
}

double StiffClayWetPy::initial_slope(double z) const {
  require_positive(initial_modulus, "initial modulus k");
  require_depth(z);
  if (loading == PyLoading::static_load) return initial_modulus * z;
  // The cyclic parabola starts with a finite slope, 2.5·A_c·p_c/(0.45·y_p) = 2.5·p_c/(1.845·y50):
  // where the initial line is steeper the parabola is the curve from y = 0.
  return std::min(initial_modulus * z, 2.5 * ultimate(z) / (1.845 * y50()));
}

double StiffClayWetPy::resistance(double z, double y) const {
  require_positive(initial_modulus, "initial modulus k");
  require_depth(z);
  const double k_z = initial_modulus * z, pc = ultimate(z), y50v = y50(), a_factor = factor_a(z);
  const double a = std::abs(y);
  double p = 0.0;
  if (loading == PyLoading::static_load) {
    const double as = a_factor, r = a / y50v;
    if (a <= as * y50v) {
      p = 0.5 * pc * std::sqrt(r);
    } else if (a <= 6.0 * as * y50v) {
      p = 0.5 * pc * std::sqrt(r) - 0.055 * pc * std::pow((a - as * y50v) / (as * y50v), 1.25);
    } else if (a <= 18.0 * as * y50v) {
      p = 0.5 * pc * std::sqrt(6.0 * as) - kDrop * pc - 0.0625 * pc * (a - 6.0 * as * y50v) / y50v;
    } else {
      p = pc * (0.5 * std::sqrt(6.0 * as) - kDrop - 0.75 * as);  // the paper's 1.225·√A_s
    }
    // Near the surface (A_s < 0.223) the residual line falls below zero: resistance never
    // pushes the pile the way it moves, so cairn holds it at 0.
    p = std::max(p, 0.0);
  } else {
    const double ac = a_factor, yp = 4.1 * ac * y50v;
    if (a <= 0.6 * yp) {
      p = ac * pc * (1.0 - std::pow(std::abs((a - 0.45 * yp) / (0.45 * yp)), 2.5));
    } else if (a <= 1.8 * yp) {
      p = kShoulder * ac * pc - 0.085 * pc * (a - 0.6 * yp) / y50v;
    } else {
      p = kShoulder * ac * pc - 0.102 * pc * yp / y50v;
    }
  }
  return sign_of(y) * std::min(p, k_z * a);
}

double stiff_clay_subgrade_modulus(double average_strength, PyLoading loading) {
  require_positive(average_strength, "average undrained strength c_a");
  // Reese, Cox & Koop (1975), from memory: 500, 1000, 2000 lb/in³ static and 200, 400, 800
  // cyclic (× 271.45 to kN/m³).
  return loading == PyLoading::static_load
             ? by_strength_class(average_strength, {135000.0, 270000.0, 540000.0})
             : by_strength_class(average_strength, {55000.0, 110000.0, 217000.0});
}

double stiff_clay_strain_50(double average_strength) {
  require_positive(average_strength, "average undrained strength c_a");
  return by_strength_class(average_strength, {0.007, 0.005, 0.004});
}

}  // namespace cairn
