// Tests of the solver core's pile forces (cap_solver.cpp with its vectorized pass over the
// piles, src/solver/pinned_forces.hpp) on random groups: compression-only piles, battered
// piles, fixed and partially fixed heads mixed with pinned ones.
//
// The checks are identities derived by hand from the rigid-cap kinematics and statics
// (cap_solver.hpp; Hrennikoff 1949): every head at p moves u = t + r × (p − c) with the cap,
// so a pinned pile's
//     N = k_a·(a·u)  (zero when it dropped out),  V = k_l·|u − (a·u)·a|,
//     F = N·a + k_l·(u − (a·u)·a),  no head moment;
// the head actions balance the load about c, Σ F = F_load, Σ (p − c) × F + M = M_load; and
// the solution is linear in the load when every pile is active (superposition). The
// reference values are recomputed here in long double from the reported movement, with none
// of the solver's code, and must agree to 1e-12 of the largest force.
#include <catch2/catch.hpp>

#include <algorithm>
#include <array>
#include <cmath>
#include <cstddef>
#include <random>
#include <utility>
#include <vector>

#include "cairn/solver/cap_solver.hpp"

using cairn::CapLoad;
using cairn::CapSolution;
using cairn::CapSolver;
using cairn::PileSpring;
using cairn::Wrench;

namespace {

using Real = long double;
using Vec = std::array<Real, 3>;

Vec cross(const Vec& a, const Vec& b) {
  return {a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]};
}
Real dot(const Vec& a, const Vec& b) { return a[0] * b[0] + a[1] * b[1] + a[2] * b[2]; }

struct Kinds {
  bool compression_only = false;  // about half the piles take no tension
  bool battered = false;          // most piles battered, in random directions
  bool fixed_heads = false;       // about a third of the piles with head bending
};

// A random group of 40 to 160 piles on a plan of about 12 m × 9 m, invented for the test.
std::vector<PileSpring> random_group(std::mt19937& random, const Kinds& kinds) {
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  const int n = 40 + static_cast<int>(120 * unit(random));
  std::vector<PileSpring> springs;
  for (int i = 0; i < n; ++i) {
    PileSpring s;
    s.head = {12.0 * unit(random) - 6.0, 9.0 * unit(random) - 4.5, 0.0};
    if (kinds.battered && unit(random) < 0.8) {
      const double ratio = 3.0 + 9.0 * unit(random);  // 1H:3V to 1H:12V
      const double toward = 2.0 * 3.141592653589793 * unit(random);
      const double h = 1.0 / ratio;
      const double length = std::sqrt(1.0 + h * h);
      s.axis = {h * std::cos(toward) / length, h * std::sin(toward) / length, -1.0 / length};
    } else {
      s.axis = {0.0, 0.0, -1.0};
    }
    s.axial = 1e5 + 4e5 * unit(random);
    s.lateral = unit(random) < 0.2 ? 0.0 : 5e3 + 2e4 * unit(random);
    s.tension = !(kinds.compression_only && unit(random) < 0.5);
    if (kinds.fixed_heads && unit(random) < 0.35 && s.lateral > 0.0) {
      // Hetényi-like head terms of a long pile (negative coupling), invented values.
      s.bending = {-(1e3 + 4e3 * unit(random)), 2e3 + 8e3 * unit(random),
                   unit(random) < 0.5 ? 0.0 : 500.0 * unit(random)};
    }
    springs.push_back(s);
  }
  return springs;
}

// A random load on the group: a large downward force, horizontal forces and moments that
// lift some compression-only piles, and a torsion when the group resists it.
Wrench random_load(std::mt19937& random, std::size_t piles) {
  std::uniform_real_distribution<double> pm(-1.0, 1.0);
  const double p = 800.0 * static_cast<double>(piles);
  return {0.03 * p * pm(random), 0.03 * p * pm(random), -p * (1.0 + 0.2 * pm(random)),
          0.8 * p * pm(random),  0.8 * p * pm(random),  0.02 * p * pm(random)};
}

struct Reference {
  Real axial = 0, lateral = 0;
  Vec force{};
};

// The pinned pile's forces from the reported movement (the identities above).
Reference pinned_reference(const PileSpring& s, const CapSolution& solution, bool active) {
  const auto& m = solution.movement;
  const Vec t = {m.translation_at_reference[0], m.translation_at_reference[1],
                 m.translation_at_reference[2]};
  const Vec r = {m.rotation[0], m.rotation[1], m.rotation[2]};
  const Vec arm = {Real(s.head[0]) - m.reference[0], Real(s.head[1]) - m.reference[1],
                   Real(s.head[2]) - m.reference[2]};
  const Vec turn = cross(r, arm);
  const Vec u = {t[0] + turn[0], t[1] + turn[1], t[2] + turn[2]};
  const Vec a = {s.axis[0], s.axis[1], s.axis[2]};
  const Real along = dot(a, u);
  const Vec w = {u[0] - along * a[0], u[1] - along * a[1], u[2] - along * a[2]};
  Reference ref;
  ref.axial = active ? s.axial * along : 0;
  ref.lateral = s.lateral * std::sqrt(dot(w, w));
  for (int j = 0; j < 3; ++j) ref.force[j] = ref.axial * a[j] + s.lateral * w[j];
  return ref;
}

double largest_force(const CapSolution& s) {
  double largest = 0.0;
  for (const auto& p : s.piles) largest = std::max({largest, std::abs(p.axial), p.lateral});
  return largest;
}

// Every pinned pile against the reference to 1e-12 of the largest force; dropped piles carry
// an exact +0 axial force; the head actions balance the load about c to 1e-10 of it.
void check_solution(const std::vector<PileSpring>& springs, const CapSolution& s,
                    const Wrench& load_about_origin) {
  REQUIRE(s.piles.size() == springs.size());
  const double scale = largest_force(s);
  REQUIRE(scale > 0.0);
  const auto& c = s.movement.reference;
  std::array<Real, 6> sum{};
  for (std::size_t i = 0; i < springs.size(); ++i) {
    const auto& p = s.piles[i];
    const auto& f = p.head_forces;
    if (!springs[i].bending.any()) {
      const Reference ref = pinned_reference(springs[i], s, p.active);
      CHECK(std::abs(p.axial - static_cast<double>(ref.axial)) <= 1e-12 * scale);
      CHECK(std::abs(p.lateral - static_cast<double>(ref.lateral)) <= 1e-12 * scale);
      for (int j = 0; j < 3; ++j)
        CHECK(std::abs(f[static_cast<std::size_t>(j)] - static_cast<double>(ref.force[j])) <=
              1e-12 * scale);
      CHECK(f[3] == 0.0);
      CHECK(f[4] == 0.0);
      CHECK(f[5] == 0.0);
      CHECK(p.head_moment == 0.0);
    }
    if (!p.active) {
      CHECK(p.axial == 0.0);
      CHECK_FALSE(std::signbit(p.axial));
      CHECK_FALSE(springs[i].tension);
    }
    const Vec arm = {Real(springs[i].head[0]) - c[0], Real(springs[i].head[1]) - c[1],
                     Real(springs[i].head[2]) - c[2]};
    const Vec force = {f[0], f[1], f[2]};
    const Vec moment = cross(arm, force);
    for (int j = 0; j < 3; ++j) {
      sum[static_cast<std::size_t>(j)] += force[j];
      sum[static_cast<std::size_t>(j + 3)] += moment[j] + f[static_cast<std::size_t>(j + 3)];
    }
  }
  // The load about c: M_c = M₀ − c × F.
  const Vec applied_force = {load_about_origin[0], load_about_origin[1], load_about_origin[2]};
  const Vec shift = cross({c[0], c[1], c[2]}, applied_force);
  Real largest_load = 0;
  for (std::size_t j = 0; j < 6; ++j)
    largest_load = std::max(largest_load, std::abs(Real(load_about_origin[j])));
  for (std::size_t j = 0; j < 6; ++j) {
    const Real applied = j < 3 ? Real(load_about_origin[j]) : load_about_origin[j] - shift[j - 3];
    CHECK(std::abs(static_cast<double>(sum[j] - applied)) <= 1e-10 * static_cast<double>(largest_load));
  }
}

}  // namespace

TEST_CASE("solver core: pile forces of random groups against the hand-derived rigid-cap identities",
          "[solver_core]") {
  std::mt19937 random(20261202);
  const std::array<Kinds, 5> kinds = {Kinds{false, false, false}, Kinds{true, false, false},
                                      Kinds{false, true, false}, Kinds{true, true, false},
                                      Kinds{true, true, true}};
  int dropped_seen = 0, bent_seen = 0;
  for (const Kinds& k : kinds) {
    for (int group = 0; group < 6; ++group) {
      const std::vector<PileSpring> springs = random_group(random, k);
      const CapSolver solver(springs);
      for (const auto& s : springs) bent_seen += s.bending.any() ? 1 : 0;
      for (int trial = 0; trial < 4; ++trial) {
        const Wrench load = random_load(random, springs.size());
        if (!solver.unresisted(load).empty()) continue;
        const CapSolution linear = solver.solve_linear(load);
        check_solution(springs, linear, load);
        const CapSolution solved = solver.solve(load);
        if (solved.overturns) continue;
        dropped_seen += static_cast<int>(solved.dropped.size());
        check_solution(springs, solved, load);
      }
    }
  }
  CHECK(dropped_seen > 0);  // the active set was exercised
  CHECK(bent_seen > 0);     // so were fixed heads beside pinned ones
}

TEST_CASE("solver core: superposed combinations equal the solution of the summed load",
          "[solver_core]") {
  // Linearity with every pile active (hand-derived: K·Σ f_k·U_k = Σ f_k·F_k): the superposed
  // movement and pile forces equal those of one solve of the combined load to 1e-12.
  std::mt19937 random(11);
  std::uniform_real_distribution<double> factor(-1.5, 1.5);
  for (const Kinds& k : {Kinds{false, false, false}, Kinds{false, true, true}}) {
    const std::vector<PileSpring> springs = random_group(random, k);
    const CapSolver solver(springs);
    std::vector<CapSolution> cases;
    std::vector<Wrench> loads;
    for (int c = 0; c < 4; ++c) {
      loads.push_back(random_load(random, springs.size()));
      REQUIRE(solver.unresisted(loads.back()).empty());
      cases.push_back(solver.solve_linear(loads.back()));
    }
    for (int combination = 0; combination < 10; ++combination) {
      Wrench total{};
      std::vector<std::pair<const CapSolution*, double>> parts;
      for (std::size_t c = 0; c < cases.size(); ++c) {
        const double f = factor(random);
        parts.emplace_back(&cases[c], f);
        for (std::size_t j = 0; j < 6; ++j) total[j] += f * loads[c][j];
      }
      const CapSolution superposed = solver.superpose(parts, total);
      const CapSolution direct = solver.solve_linear(total);
      const double scale = largest_force(direct);
      REQUIRE(superposed.piles.size() == direct.piles.size());
      for (std::size_t i = 0; i < direct.piles.size(); ++i) {
        CHECK(std::abs(superposed.piles[i].axial - direct.piles[i].axial) <= 1e-12 * scale);
        CHECK(std::abs(superposed.piles[i].lateral - direct.piles[i].lateral) <= 1e-12 * scale);
        for (std::size_t j = 0; j < 6; ++j)
          CHECK(std::abs(superposed.piles[i].head_forces[j] - direct.piles[i].head_forces[j]) <=
                1e-12 * scale);
      }
      check_solution(springs, superposed, total);
    }
  }
}
