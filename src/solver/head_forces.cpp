#include "cairn/solver/head_forces.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>

namespace cairn {

std::array<double, 3> head_displacement(const PileSpring& s, const CapMovement& m) {
  const auto& t = m.translation_at_reference;
  const auto& r = m.rotation;
  const std::array<double, 3> d = {s.head[0] - m.reference[0], s.head[1] - m.reference[1],
                                   s.head[2] - m.reference[2]};
  return {t[0] + r[1] * d[2] - r[2] * d[1], t[1] + r[2] * d[0] - r[0] * d[2],
          t[2] + r[0] * d[1] - r[1] * d[0]};
}

HeadBalance head_balance(const std::vector<PileSpring>& springs, const CapSolution& solution,
                         const Wrench& applied, const std::array<double, 3>& point) {
  HeadBalance b;
  b.applied = applied;
  b.piles.assign(springs.size(), Wrench{});
  double lever = 0.0;
  for (const auto& s : springs)
    lever = std::max(lever, std::hypot(s.head[0] - point[0], s.head[1] - point[1],
                                       s.head[2] - point[2]));
  if (lever > 0.0) b.lever = lever;
  if (!solution.overturns) {
    if (solution.piles.size() != springs.size())
      throw std::logic_error("head_balance: one pile force per spring expected");
    for (std::size_t i = 0; i < springs.size(); ++i) {
      const Wrench& a = solution.piles[i].head_forces;
      const std::array<double, 3> d = {springs[i].head[0] - point[0],
                                       springs[i].head[1] - point[1],
                                       springs[i].head[2] - point[2]};
      const Wrench w = {a[0], a[1], a[2], d[1] * a[2] - d[2] * a[1] + a[3],
                        d[2] * a[0] - d[0] * a[2] + a[4], d[0] * a[1] - d[1] * a[0] + a[5]};
      b.piles[i] = w;
      for (int k = 0; k < 6; ++k) b.sum[k] += w[k];
    }
  }
  double largest = 0.0, off = 0.0;
  for (int k = 0; k < 6; ++k) {
    b.residual[k] = b.sum[k] - applied[k];
    const double scale = k < 3 ? 1.0 : 1.0 / b.lever;
    largest = std::max(largest, std::abs(applied[k]) * scale);
    off = std::max(off, std::abs(b.residual[k]) * scale);
  }
  b.relative = largest > 0.0 ? off / largest : (off == 0.0 ? 0.0 : std::numeric_limits<double>::infinity());
  return b;
}

}  // namespace cairn
