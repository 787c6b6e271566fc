#include "cairn/geotechnics/axial_curves.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <stdexcept>

namespace cairn {
namespace {

template <std::size_t N>
double interpolate(const std::array<double, N>& x, const std::array<double, N>& y, double at) {
  if (at <= x.front()) return y.front();
  for (std::size_t i = 1; i < N; ++i)
    if (at <= x[i]) return y[i - 1] + (y[i] - y[i - 1]) * (at - x[i - 1]) / (x[i] - x[i - 1]);
  return y.back();
}

// API RP 2GEO (from memory): the clay t-z points and the Q-z points, in z/D.
constexpr std::array<double, 7> kClayZ = {0.0, 0.0016, 0.0031, 0.0057, 0.0080, 0.0100, 0.0200};
constexpr std::array<double, 5> kClayT = {0.0, 0.30, 0.50, 0.75, 0.90};
constexpr std::array<double, 6> kTipZ = {0.0, 0.002, 0.013, 0.042, 0.073, 0.100};
constexpr std::array<double, 6> kTipQ = {0.0, 0.25, 0.50, 0.75, 0.90, 1.00};
constexpr double kSandPeak = 0.0025;  // m: 0.1 in

}  // namespace

double shaft_transfer(AxialSoil soil, double diameter, double movement, double residual) {
  if (!(diameter > 0.0)) throw std::invalid_argument("t-z: the diameter must be positive");
  const double sign = movement < 0.0 ? -1.0 : 1.0, z = std::abs(movement);
  if (soil == AxialSoil::sand) return sign * std::min(z / kSandPeak, 1.0);
  if (!(residual > 0.0 && residual <= 1.0))
    throw std::invalid_argument("t-z: the residual share must lie in (0, 1]");
  const std::array<double, 7> t = {kClayT[0], kClayT[1], kClayT[2], kClayT[3], kClayT[4], 1.0,
                                   residual};
  return sign * interpolate(kClayZ, t, z / diameter);
}

double tip_transfer(double diameter, double movement) {
  if (!(diameter > 0.0)) throw std::invalid_argument("Q-z: the diameter must be positive");
  if (movement <= 0.0) return 0.0;
  return interpolate(kTipZ, kTipQ, movement / diameter);
}

}  // namespace cairn
