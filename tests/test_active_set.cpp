// The compression-only active set's passes over the piles (src/solver/active_set_passes.hpp)
// against the per-pile code they replace, and solve_combinations (the active sets'
// decompositions kept from one combination to the next, the superposed forces of a
// combination that lifts piles never formed) against superpose, needs_redistribution and
// solve called one combination at a time, and the piles' forces handed over as arrays (and
// the checks folded from them) against the pile rows (and the checks of the rows). Random groups invented for the test: vertical and
// battered piles, some without lateral springs, about half compression-only, some with head
// bending.
//
// The per-pile reference is the rigid-cap kinematics written with Eigen's 3-vectors, as
// cap_solver.cpp wrote it before the passes (cap_solver.hpp; Hrennikoff 1949):
//     u = t + θ × ρ,  s = a·u,  f = (k_a·s or 0)·a + k_l·(u − s·a),
//     imbalance = F̂ − Σ (f, ρ × f + 0) in pile order;
// the passes must give the same numbers to the last bit (==, not a tolerance), since the
// outputs are to stay the same byte for byte.
#include <catch2/catch.hpp>

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <random>
#include <string>
#include <utility>
#include <vector>

#include "../src/solver/active_set_passes.hpp"
#include "cairn/checks/checks.hpp"
#include "cairn/core/model.hpp"
#include "cairn/solver/cap_solver.hpp"

using namespace cairn;

namespace {

struct RandomPiles {
  detail::PinnedPiles arrays;
  std::vector<Eigen::Vector3d> offsets, axes;
  std::vector<double> axial, lateral;
};

// 1 to 300 piles (so that the blocks of 128 and the lanes of 4 end anywhere), heads within
// about one group size of the reference point, axes vertical or battered.
RandomPiles random_piles(std::mt19937_64& rng) {
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  const std::size_t n = 1 + static_cast<std::size_t>(300 * unit(rng));
  RandomPiles p;
  for (std::size_t i = 0; i < n; ++i) {
    const Eigen::Vector3d rho(2 * unit(rng) - 1, 2 * unit(rng) - 1, unit(rng) < 0.2 ? 0.1 * unit(rng) : 0.0);
    Eigen::Vector3d axis(0.0, 0.0, -1.0);
    if (unit(rng) < 0.5) axis = Eigen::Vector3d(0.3 * unit(rng) - 0.15, 0.3 * unit(rng) - 0.15, -1.0).normalized();
    const double ka = 1e5 + 4e5 * unit(rng);
    const double kl = unit(rng) < 0.2 ? 0.0 : 5e3 + 2e4 * unit(rng);
    const double r[3] = {rho(0), rho(1), rho(2)};
    const double a[3] = {axis(0), axis(1), axis(2)};
    p.arrays.add(r, a, ka, kl);
    p.offsets.push_back(rho);
    p.axes.push_back(axis);
    p.axial.push_back(ka);
    p.lateral.push_back(kl);
  }
  return p;
}

// A movement Û = (t, θ) of mixed signs and sizes (some components exactly zero).
std::array<double, 6> random_movement(std::mt19937_64& rng) {
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  std::array<double, 6> m{};
  for (double& v : m) v = unit(rng) < 0.15 ? 0.0 : (2 * unit(rng) - 1) * std::pow(10.0, -6 + 3 * unit(rng));
  return m;
}

Eigen::Vector3d head_movement(const RandomPiles& p, std::size_t i, const std::array<double, 6>& m) {
  const Eigen::Vector3d t(m[0], m[1], m[2]), theta(m[3], m[4], m[5]);
  return t + theta.cross(p.offsets[i]);
}

}  // namespace

TEST_CASE("active set: head movements along the piles and the largest, as the per-pile code",
          "[active_set]") {
  std::mt19937_64 rng(20261202);
  for (int trial = 0; trial < 200; ++trial) {
    const RandomPiles p = random_piles(rng);
    const auto m = random_movement(rng);
    const std::size_t n = p.axial.size();
    std::vector<double> along(n);
    const double largest = detail::head_movements_along(p.arrays, m.data(), along.data());
    double expected_largest = 0.0;
    for (std::size_t i = 0; i < n; ++i) {
      const Eigen::Vector3d u = head_movement(p, i, m);
      INFO("trial " << trial << ", pile " << i << " of " << n);
      CHECK(along[i] == p.axes[i].dot(u));
      expected_largest = std::max(expected_largest, u.norm());
    }
    INFO("trial " << trial);
    CHECK(largest == expected_largest);
  }
}

TEST_CASE("active set: the imbalance of pinned heads, as the per-pile sum", "[active_set]") {
  std::mt19937_64 rng(77);
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  for (int trial = 0; trial < 200; ++trial) {
    const RandomPiles p = random_piles(rng);
    const auto m = random_movement(rng);
    const std::size_t n = p.axial.size();
    std::vector<bool> active(n);
    for (std::size_t i = 0; i < n; ++i) active[i] = unit(rng) < 0.7;
    const double load[6] = {1e3 * unit(rng), -2e3 * unit(rng), -5e4, 1e3 * unit(rng), -1e3, 0.0};
    double sum[6];
    detail::pinned_imbalance(p.arrays, m.data(), active, load, sum);
    Eigen::Matrix<double, 6, 1> expected;
    for (int j = 0; j < 6; ++j) expected(j) = load[j];
    for (std::size_t i = 0; i < n; ++i) {
      const Eigen::Vector3d u = head_movement(p, i, m);
      const Eigen::Vector3d& a = p.axes[i];
      const double s = a.dot(u);
      const Eigen::Vector3d f = (active[i] ? p.axial[i] * s : 0.0) * a + p.lateral[i] * (u - s * a);
      const Eigen::Vector3d moment = Eigen::Vector3d::Zero();
      expected.head<3>() -= f;
      expected.tail<3>() -= p.offsets[i].cross(f) + moment / 1.0;
    }
    for (int j = 0; j < 6; ++j) {
      INFO("trial " << trial << ", component " << j);
      CHECK(sum[j] == expected(j));
    }
  }
}

TEST_CASE("active set: the piles that change state, in contact or dropped out or left out",
          "[active_set]") {
  std::mt19937_64 rng(5);
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  for (int trial = 0; trial < 100; ++trial) {
    const std::size_t n = 1 + static_cast<std::size_t>(200 * unit(rng));
    std::vector<double> along(n);
    std::vector<std::uint8_t> state(n), moves(n);
    const double tolerance = 1e-12;
    for (std::size_t i = 0; i < n; ++i) {
      // Movements at and around the tolerance, and clearly either side.
      const double pick = unit(rng);
      along[i] = pick < 0.1 ? tolerance : pick < 0.2 ? -tolerance : pick < 0.25 ? 0.0 : 2 * unit(rng) - 1;
      state[i] = static_cast<std::uint8_t>(4 * unit(rng));
    }
    const bool any = detail::active_set_moves(n, along.data(), state.data(), tolerance, moves.data());
    bool expected_any = false;
    for (std::size_t i = 0; i < n; ++i) {
      const bool drop = state[i] == detail::kInContact && along[i] < -tolerance;
      const bool add = state[i] == detail::kDroppedOut && along[i] > tolerance;
      INFO("trial " << trial << ", pile " << i);
      CHECK(moves[i] == ((drop || add) ? 1 : 0));
      expected_any = expected_any || drop || add;
    }
    CHECK(any == expected_any);
  }
}

namespace {

// A random project: piles of three types (vertical taking tension; compression-only; battered
// compression-only, some with fixed heads through `bending`), six load cases, combinations
// that lift piles in a good share (large moments) and repeat earlier ones (the same active
// set met again).
Project random_project(std::mt19937_64& rng) {
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  Project project;
  auto type = [](const std::string& id, double axial, double lateral, bool tension) {
    PileType t;
    t.id = id;
    t.section = {SectionShape::square, 0.4};
    t.length = 20.0;
    t.elastic_modulus = 30e6;
    t.axial_stiffness = axial;
    t.lateral_stiffness = lateral;
    t.tension = tension;
    return t;
  };
  project.pile_types = {type("T", 3e5, 1e4, true), type("C", 2.5e5, 8e3, false),
                        type("B", 2e5, 0.0, false)};
  const int columns = 3 + static_cast<int>(8 * unit(rng)), rows = 2 + static_cast<int>(8 * unit(rng));
  for (int r = 0; r < rows; ++r)
    for (int c = 0; c < columns; ++c) {
      Pile pile;
      pile.id = "P" + std::to_string(r * columns + c + 1);
      pile.x = 1.5 * c + 0.2 * unit(rng) + 4000.0;  // survey coordinates
      pile.y = 1.5 * r + 0.2 * unit(rng);
      const double pick = unit(rng);
      pile.type = pick < 0.2 ? 0 : pick < 0.8 ? 1 : 2;
      if (pile.type == 2) pile.batter = Batter{4.0 + 8.0 * unit(rng), 360.0 * unit(rng)};
      project.piles.push_back(pile);
    }
  const double n = static_cast<double>(project.piles.size());
  const double cx = 4000.0 + 0.75 * columns, cy = 0.75 * rows;
  auto at = [&](double x, double y, Wrench w) {
    PointLoad p;
    p.at = {cx + x, cy + y, 2.0};
    p.load = w;
    return p;
  };
  auto load_case = [](const std::string& id, LoadKind kind, PointLoad p) {
    LoadCase lc;
    lc.id = id;
    lc.kind = kind;
    lc.loads = {p};
    return lc;
  };
  project.load_cases = {
      load_case("D", LoadKind::dead, at(0.3, -0.2, {0, 0, -600 * n, 0, 0, 0})),
      load_case("L", LoadKind::live, at(-0.5, 0.4, {0, 0, -150 * n, 15 * n, 0, 0})),
      load_case("WX", LoadKind::wind, at(0, 0, {100 * n, 0, 0, 0, 400 * n * columns, 0})),
      load_case("WY", LoadKind::wind, at(0, 0, {0, 100 * n, 0, -400 * n * rows, 0, 0})),
      load_case("EX", LoadKind::seismic, at(0, 0, {80 * n, 0, 0, 0, 500 * n * columns, 8 * n})),
      load_case("EY", LoadKind::seismic, at(0, 0, {0, 80 * n, 0, -500 * n * rows, 0, 0})),
  };
  const std::size_t count = 60 + static_cast<std::size_t>(60 * unit(rng));
  for (std::size_t c = 0; c < count; ++c) {
    if (c > 5 && unit(rng) < 0.2) {  // an earlier combination again
      Combination again = project.combinations[static_cast<std::size_t>(unit(rng) * c)];
      again.id = "C" + std::to_string(c + 1);
      project.combinations.push_back(again);
      continue;
    }
    Combination combo;
    combo.id = "C" + std::to_string(c + 1);
    combo.factors.emplace_back(0, 1.0);
    for (std::size_t lc = 1; lc < 6; ++lc)
      if (unit(rng) < 0.6) combo.factors.emplace_back(lc, std::round(200 * unit(rng) - 100) / 100);
    project.combinations.push_back(combo);
  }
  return project;
}

bool same_bits(const CapSolution& a, const CapSolution& b) {
  if (a.overturns != b.overturns || a.dropped != b.dropped || a.iterations != b.iterations ||
      a.residual != b.residual || a.piles.size() != b.piles.size() ||
      a.movement.translation != b.movement.translation ||
      a.movement.rotation != b.movement.rotation ||
      a.movement.translation_at_reference != b.movement.translation_at_reference)
    return false;
  for (std::size_t i = 0; i < a.piles.size(); ++i) {
    const PileForce &p = a.piles[i], &q = b.piles[i];
    if (p.axial != q.axial || p.lateral != q.lateral || p.active != q.active ||
        p.head_forces != q.head_forces || p.head_moment != q.head_moment)
      return false;
  }
  return true;
}

}  // namespace

TEST_CASE("active set: solve_combinations gives each combination's solve, bit for bit",
          "[active_set]") {
  std::mt19937_64 rng(11);
  std::size_t lifted = 0, total = 0;
  for (int trial = 0; trial < 12; ++trial) {
    Project project = random_project(rng);
    std::vector<PileSpring> springs = pile_springs(project);
    if (trial % 3 == 2)  // fixed heads on the battered piles (the per-pile code's path)
      for (std::size_t i = 0; i < springs.size(); ++i)
        if (project.piles[i].type == 2) springs[i].bending = {-2e3, 6e3, 0.0};
    if (trial % 4 == 3)  // stiff battered piles among soft ones: movements refined in long double
      for (std::size_t i = 0; i < springs.size(); ++i)
        if (project.piles[i].type == 2) springs[i].axial *= 1e10;
    const CapSolver solver(springs);
    if (!unresisted_cases(project, solver).empty()) continue;
    std::vector<CapSolution> per_case;
    for (const auto& lc : project.load_cases)
      per_case.push_back(solver.solve_linear(CapLoad(resultant_about(lc, solver.reference()))));
    std::size_t c = 0;
    solve_combinations(project, solver, [&](std::size_t index, CapSolution&& solution) {
      REQUIRE(index == c);
      const Combination& combo = project.combinations[c];
      const CapLoad load(combination_load(project, combo, solver.reference()));
      std::vector<std::pair<const CapSolution*, double>> parts;
      for (const auto& [lc, factor] : combo.factors) parts.emplace_back(&per_case[lc], factor);
      CapSolution expected = solver.superpose(parts, load);
      if (solver.needs_redistribution(expected)) expected = solver.solve(load);
      INFO("trial " << trial << ", combination " << combo.id);
      CHECK(same_bits(solution, expected));
      lifted += solution.dropped.empty() ? 0 : 1;
      ++total;
      ++c;
    });
  }
  // The groups are meant to lift piles in a good share of the combinations.
  CHECK(lifted > total / 10);
}

TEST_CASE("active set: the forces as arrays are the rows' forces, and the checks folded from them "
          "the checks of the rows", "[active_set]") {
  std::mt19937_64 rng(23);
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  // Both ways met: forces as arrays, and rows (a structural check; refined movements).
  std::size_t as_arrays = 0, with_rows = 0;
  for (int trial = 0; trial < 8; ++trial) {
    Project project = random_project(rng);
    for (std::size_t c = 0; c < project.combinations.size(); ++c)
      project.combinations[c].limit_state = c % 3 ? LimitState::service : LimitState::strength;
    std::vector<PileSpring> springs = pile_springs(project);
    if (trial % 2 == 1)  // fixed heads on the battered piles (redone by the per-pile code)
      for (std::size_t i = 0; i < springs.size(); ++i)
        if (project.piles[i].type == 2) springs[i].bending = {-2e3, 6e3, 0.0};
    if (trial % 4 == 3)  // stiff battered piles among soft ones: movements refined in long double
      for (std::size_t i = 0; i < springs.size(); ++i)
        if (project.piles[i].type == 2) springs[i].axial *= 1e10;
    const CapSolver solver(springs);
    if (!unresisted_cases(project, solver).empty()) continue;
    // Capacities invented for the test; a structural check on the strength basis of one type
    // in half the trials (its combinations then checked pile by pile, from the rows).
    std::vector<PileTypeResistance> resistances(project.pile_types.size());
    for (auto& r : resistances) {
      for (Resistance* basis : {&r.allowable, &r.factored}) {
        basis->compression = 500.0 + 3000.0 * unit(rng);
        if (unit(rng) < 0.7) basis->tension = 200.0 + 800.0 * unit(rng);
        basis->lateral = 20.0 + 200.0 * unit(rng);
      }
    }
    if (trial % 4 < 2) resistances[1].factored.structural_axial = 4000.0;

    std::vector<CapSolution> rows = solve_combinations(project, solver);
    CheckAccumulator from_rows(project, resistances, {}, false);
    for (std::size_t c = 0; c < rows.size(); ++c) from_rows.add(c, rows[c]);
    const CheckResults expected = from_rows.finish();

    CheckAccumulator from_arrays(project, resistances, {}, false);

    solve_combinations(
        project, solver, [&](std::size_t c) { return from_arrays.needs_rows(c); },
        [&](std::size_t c, CapSolution&& solution, const double* axial, const double* lateral) {
          const CapSolution& row = rows[c];
          INFO("trial " << trial << ", combination " << c);
          CHECK(solution.overturns == row.overturns);
          CHECK(solution.dropped == row.dropped);
          CHECK(solution.residual == row.residual);
          CHECK(solution.movement.rotation == row.movement.rotation);
          CHECK(solution.movement.translation == row.movement.translation);
          if (axial) {
            ++as_arrays;
            CHECK(solution.piles.empty());
            for (std::size_t i = 0; i < row.piles.size(); ++i) {
              INFO("pile " << i);
              CHECK(axial[i] == row.piles[i].axial);
              CHECK(lateral[i] == row.piles[i].lateral);
            }
          } else {
            ++with_rows;
            CHECK(same_bits(solution, row));
          }
          from_arrays.add(c, std::move(solution), axial, lateral);
        });
    const CheckResults got = from_arrays.finish();

    REQUIRE(got.envelope.size() == expected.envelope.size());
    for (std::size_t i = 0; i < got.envelope.size(); ++i) {
      INFO("trial " << trial << ", pile " << i);
      const PileEnvelope &a = got.envelope[i], &b = expected.envelope[i];
      for (const auto& [x, y] : {std::pair{a.max_compression, b.max_compression},
                                 std::pair{a.max_tension, b.max_tension},
                                 std::pair{a.max_lateral, b.max_lateral},
                                 std::pair{a.max_utilization, b.max_utilization}}) {
        CHECK(x.value == y.value);
        CHECK(x.combination == y.combination);
      }
      CHECK(a.governing == b.governing);
      CHECK(a.pass == b.pass);
      for (std::size_t k = 0; k < 4; ++k) {
        CHECK(got.governing[i][k].utilization.value == expected.governing[i][k].utilization.value);
        CHECK(got.governing[i][k].utilization.combination ==
              expected.governing[i][k].utilization.combination);
        CHECK(got.governing[i][k].demand == expected.governing[i][k].demand);
      }
    }
    REQUIRE(got.combinations.size() == expected.combinations.size());
    for (std::size_t c = 0; c < got.combinations.size(); ++c) {
      INFO("trial " << trial << ", combination " << c);
      const CombinationCheck &a = got.combinations[c], &b = expected.combinations[c];
      CHECK(a.pass == b.pass);
      CHECK(a.max_utilization == b.max_utilization);
      CHECK(a.governing_pile == b.governing_pile);
      CHECK(a.governing == b.governing);
      CHECK(a.total_compression == b.total_compression);
      CHECK(a.total_tension == b.total_tension);
    }
    CHECK(got.summary.max_utilization == expected.summary.max_utilization);
    CHECK(got.summary.combination == expected.summary.combination);
    CHECK(got.summary.pile == expected.summary.pile);
    CHECK(got.summary.failed_combinations == expected.summary.failed_combinations);
    CHECK(got.summary.overturned == expected.summary.overturned);
  }
  CHECK(as_arrays > 100);
  CHECK(with_rows > 100);
}

TEST_CASE("active set: the stiffness of an active set summed entry by entry, as Eigen's sum",
          "[active_set]") {
  std::mt19937_64 rng(3);
  std::uniform_real_distribution<double> unit(-1.0, 1.0);
  for (int trial = 0; trial < 50; ++trial) {
    const std::size_t n = static_cast<std::size_t>(300 * (unit(rng) + 1.0) / 2.0) + 1;
    using Matrix6 = Eigen::Matrix<double, 6, 6>;
    std::vector<Matrix6> with(n), without(n);
    std::vector<bool> active(n);
    for (std::size_t i = 0; i < n; ++i) {
      // Terms of mixed signs and sizes, some exact zeros and negative zeros.
      for (int e = 0; e < 36; ++e) {
        with[i](e) = unit(rng) * std::pow(10.0, 6 * unit(rng));
        without[i](e) = unit(rng) < -0.6 ? -0.0 : unit(rng) * std::pow(10.0, 4 * unit(rng));
      }
      active[i] = unit(rng) < 0.4;
    }
    Matrix6 expected = Matrix6::Zero();
    for (std::size_t i = 0; i < n; ++i) expected += active[i] ? with[i] : without[i];
    Matrix6 got;
    detail::sum_stiffness(n, with.front().data(), without.front().data(), active, got.data());
    for (int e = 0; e < 36; ++e) {
      INFO("trial " << trial << ", entry " << e);
      CHECK(std::signbit(got(e)) == std::signbit(expected(e)));
      CHECK(got(e) == expected(e));
    }
  }
}

TEST_CASE("active set: a combination lifts piles exactly when the head movements say so",
          "[active_set]") {
  // needs_redistribution (with its shortcut: a bound over the ranges of the axes and of ρ × a
  // that shows no pile can be in tension) against the definition, pile by pile in long
  // double from the reported movement: some compression-only pile has a·u < −1e-12·max |u|.
  std::mt19937_64 rng(41);
  std::size_t lifting = 0, closed = 0;
  for (int trial = 0; trial < 12; ++trial) {
    const Project project = random_project(rng);
    const CapSolver solver(pile_springs(project));
    if (!unresisted_cases(project, solver).empty()) continue;
    std::vector<CapSolution> per_case;
    for (const auto& lc : project.load_cases)
      per_case.push_back(solver.solve_linear(CapLoad(resultant_about(lc, solver.reference()))));
    const auto& springs = solver.springs();
    const auto& c = solver.reference();
    for (const Combination& combo : project.combinations) {
      std::vector<std::pair<const CapSolution*, double>> parts;
      for (const auto& [lc, factor] : combo.factors) parts.emplace_back(&per_case[lc], factor);
      const CapSolution s =
          solver.superpose(parts, CapLoad(combination_load(project, combo, solver.reference())));
      const auto& t = s.movement.translation_at_reference;
      const auto& r = s.movement.rotation;
      long double largest = 0.0L;
      std::vector<long double> along(springs.size());
      for (std::size_t i = 0; i < springs.size(); ++i) {
        long double u[3];
        const long double p[3] = {springs[i].head[0] - c[0], springs[i].head[1] - c[1],
                                  springs[i].head[2] - c[2]};
        u[0] = t[0] + (r[1] * p[2] - r[2] * p[1]);
        u[1] = t[1] + (r[2] * p[0] - r[0] * p[2]);
        u[2] = t[2] + (r[0] * p[1] - r[1] * p[0]);
        along[i] = springs[i].axis[0] * u[0] + springs[i].axis[1] * u[1] + springs[i].axis[2] * u[2];
        largest = std::max(largest, std::sqrt(u[0] * u[0] + u[1] * u[1] + u[2] * u[2]));
      }
      bool expected = false;
      for (std::size_t i = 0; i < springs.size(); ++i)
        if (!springs[i].tension && along[i] < -1e-12L * largest) expected = true;
      INFO("trial " << trial << ", combination " << combo.id);
      CHECK(solver.needs_redistribution(s) == expected);
      (expected ? lifting : closed) += 1;
    }
  }
  CHECK(lifting > 20);  // both answers met often
  CHECK(closed > 20);
}
