#include "cairn/geotechnics/py_curves.hpp"

#include <algorithm>
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

double SandApiPy::c1() const {
  const double phi = radians(friction_angle), a = phi / 2.0, b = radians(45.0) + phi / 2.0;
  constexpr double k0 = 0.4;
  return k0 * std::tan(phi) * std::sin(b) / (std::tan(b - phi) * std::cos(a)) +
         std::pow(std::tan(b), 2) * std::tan(a) / std::tan(b - phi) +
         k0 * std::tan(b) * (std::tan(phi) * std::sin(b) - std::tan(a));
}

double SandApiPy::c2() const {
  const double phi = radians(friction_angle), b = radians(45.0) + phi / 2.0;
  const double ka = std::pow(std::tan(radians(45.0) - phi / 2.0), 2);
  return std::tan(b) / std::tan(b - phi) - ka;
}

double SandApiPy::c3() const {
  const double phi = radians(friction_angle), b = radians(45.0) + phi / 2.0;
  const double ka = std::pow(std::tan(radians(45.0) - phi / 2.0), 2);
  constexpr double k0 = 0.4;
  return ka * (std::pow(std::tan(b), 8) - 1.0) + k0 * std::tan(phi) * std::pow(std::tan(b), 4);
}

double SandApiPy::ultimate(double z) const {
  if (!(friction_angle > 0.0 && friction_angle < 90.0))
    throw std::invalid_argument("friction angle must lie between 0 and 90 degrees");
  require_positive(effective_unit_weight, "effective unit weight γ'");
  require_positive(width, "pile width b");
  require_depth(z);
  const double g = effective_unit_weight;
  return std::min((c1() * z + c2() * width) * g * z, c3() * width * g * z);
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

}  // namespace cairn
