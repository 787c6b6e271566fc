#include "cairn/solver/head_forces.hpp"

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

std::vector<std::array<double, 3>> pile_head_forces(const std::vector<PileSpring>& springs,
                                                    const CapSolution& solution) {
  std::vector<std::array<double, 3>> forces(springs.size(), std::array<double, 3>{});
  if (solution.overturns) return forces;
  if (solution.piles.size() != springs.size())
    throw std::logic_error("pile_head_forces: one force per spring expected");
  for (std::size_t i = 0; i < springs.size(); ++i) {
    const PileSpring& s = springs[i];
    const auto u = head_displacement(s, solution.movement);
    const auto& a = s.axis;
    const double along = a[0] * u[0] + a[1] * u[1] + a[2] * u[2];
    const double axial = solution.piles[i].active ? s.axial : 0.0;
    for (int k = 0; k < 3; ++k)
      forces[i][k] = axial * along * a[k] + s.lateral * (u[k] - along * a[k]);
  }
  return forces;
}

}  // namespace cairn
