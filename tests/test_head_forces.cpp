// Tests of the solver's pile-head actions (PileForce::head_forces) of pinned heads and of their
// balance about a point (head_forces.hpp) behind the package's equilibrium table: statically
// determinate groups whose forces follow by hand.
#include <catch2/catch.hpp>

#include <array>
#include <cmath>
#include <vector>

#include "cairn/solver/head_forces.hpp"

using namespace cairn;

namespace {

PileSpring spring(double x, double y, std::array<double, 3> axis, double axial, double lateral = 0.0) {
  PileSpring s;
  s.head = {x, y, 0.0};
  const double n = std::sqrt(axis[0] * axis[0] + axis[1] * axis[1] + axis[2] * axis[2]);
  s.axis = {axis[0] / n, axis[1] / n, axis[2] / n};
  s.axial = axial;
  s.lateral = lateral;
  return s;
}

}  // namespace

TEST_CASE("head_forces: two battered piles meeting at the load point", "[head_forces]") {
  // Heads at x = ±0.375 m, battered 1H:4V outward, axes meeting at (0, 0, 1.5) where
  // V = 1000 kN down and H = 100 kN along +x act. Statics (hand-derived, the cap's free body):
  // N1 = 175·√17 = 721.54 kN, N2 = 75·√17 = 309.23 kN; each head force is N·a, so its
  // horizontal part is N/√17: 175 and −75 kN, summing to H = 100 kN.
  const std::vector<PileSpring> springs = {spring(0.375, 0, {1, 0, -4}, 2e5),
                                           spring(-0.375, 0, {-1, 0, -4}, 2e5)};
  const CapSolver solver(springs);
  // The load about the origin: F = (100, 0, −1000), M = (0, 0, 1.5) × F = (0, 150, 0).
  const Wrench load = {100, 0, -1000, 0, 150, 0};
  const CapSolution s = solver.solve(load);
  const auto& f0 = s.piles[0].head_forces;
  const auto& f1 = s.piles[1].head_forces;
  CHECK(f0[0] == Approx(175.0));
  CHECK(f1[0] == Approx(-75.0));
  CHECK(f0[2] == Approx(-700.0));  // −4·175
  CHECK(f1[2] == Approx(-300.0));
  // Pinned heads: no head moments.
  for (int k = 3; k < 6; ++k) CHECK(f0[k] == 0.0);
  // The sum is the applied load, forces and moments about the origin.
  std::array<double, 6> sum{};
  for (std::size_t i = 0; i < springs.size(); ++i) {
    const auto& f = s.piles[i].head_forces;
    const auto& p = springs[i].head;
    sum[0] += f[0], sum[1] += f[1], sum[2] += f[2];
    sum[3] += p[1] * f[2] - p[2] * f[1];
    sum[4] += p[2] * f[0] - p[0] * f[2];
    sum[5] += p[0] * f[1] - p[1] * f[0];
  }
  for (int k = 0; k < 6; ++k) CHECK(sum[k] == Approx(load[k]).margin(1e-9));
  // head_balance sums the same and leaves no residual.
  const HeadBalance b = head_balance(springs, s, load);
  for (int k = 0; k < 6; ++k) CHECK(b.sum[k] == Approx(sum[k]).margin(1e-12));
  CHECK(b.relative < 1e-12);
  CHECK(b.lever == Approx(0.375));
  // The axial part agrees with the solver's axial force.
  CHECK(-f0[2] * std::sqrt(17.0) / 4.0 == Approx(s.piles[0].axial));
}

TEST_CASE("head_forces: vertical piles share V/n and lateral springs share H", "[head_forces]") {
  // Four equal vertical piles at (±1, ±1) with equal lateral springs, V = 800 kN and
  // H = 40 kN along y at the heads' level: by symmetry (hand-derived) each takes 200 kN down
  // and 10 kN along y.
  std::vector<PileSpring> springs;
  for (double x : {-1.0, 1.0})
    for (double y : {-1.0, 1.0}) springs.push_back(spring(x, y, {0, 0, -1}, 1e5, 5e3));
  const CapSolver solver(springs);
  const CapSolution s = solver.solve(Wrench{0, 40, -800, 0, 0, 0});
  for (const auto& pile : s.piles) {
    const auto& f = pile.head_forces;
    CHECK(f[0] == Approx(0.0).margin(1e-9));
    CHECK(f[1] == Approx(10.0));
    CHECK(f[2] == Approx(-200.0));
  }
}

TEST_CASE("head_forces: an overturned cap has no forces to sum", "[head_forces]") {
  CapSolution s;
  s.overturns = true;
  const std::vector<PileSpring> springs = {spring(0, 0, {0, 0, -1}, 1e5)};
  const HeadBalance b = head_balance(springs, s, Wrench{0, 0, -100, 0, 0, 0});
  REQUIRE(b.piles.size() == 1);
  CHECK(b.piles[0] == Wrench{});
  CHECK(b.sum == Wrench{});
  CHECK(b.residual[2] == 100.0);  // Σ − applied with nothing on the piles
  CHECK(b.relative == 1.0);
}
