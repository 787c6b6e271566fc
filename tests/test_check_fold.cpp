// The checks folded over the piles as arrays (src/checks/check_fold.hpp) against the
// row-by-row checks and against a reference written here from the definition in checks.hpp:
// a pile's utilization is the largest of N/Cc, −N/Ct, V/Cl over the demands above the force
// tolerance (∞ without a capacity), and each envelope value is the largest over the
// combinations of the same per-combination values, named by the first combination that
// reaches it (hand-derived identity: max over combinations of the same values). Random
// groups with compression-only piles that drop out, typed capacities (some missing, some
// zero), demands at the tolerance and ties (repeated combinations).
#include <catch2/catch.hpp>

#include <array>
#include <cmath>
#include <cstring>
#include <cstddef>
#include <limits>
#include <optional>
#include <random>
#include <string>
#include <vector>

#include "cairn/checks/checks.hpp"

using namespace cairn;

namespace {

constexpr double kTolerance = 1e-6;  // kN: checks.cpp's force tolerance (no demand at or below)
constexpr double kInf = std::numeric_limits<double>::infinity();

struct Case {
  Project project;
  std::vector<PileTypeResistance> resistances;
  std::vector<CapSolution> solutions;
};

// `piles` piles of `types` pile types; `combinations` combinations, some repeated exactly (a
// tie in every value), some overturned; compression-only piles dropped out in a third of them.
Case random_case(std::mt19937_64& rng, std::size_t piles, std::size_t types,
                 std::size_t combinations, bool structural) {
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  Case k;
  Project& p = k.project;
  p.file = "fold.yaml";
  for (std::size_t t = 0; t < types; ++t) {
    PileType type;
    type.id = "T" + std::to_string(t);
    type.tension = t % 2 == 0;
    p.pile_types.push_back(type);
    // Capacities: some missing (no capacity: ∞ utilization), some zero, the rest 100–2000 kN.
    auto capacity = [&]() -> std::optional<double> {
      const double r = unit(rng);
      if (r < 0.1) return std::nullopt;
      if (r < 0.15) return 0.0;
      return 100.0 + 1900.0 * unit(rng);
    };
    PileTypeResistance r;
    r.allowable.compression = 500.0 + 1500.0 * unit(rng);
    r.allowable.tension = capacity();
    r.allowable.lateral = capacity();
    r.factored.compression = 800.0 + 2000.0 * unit(rng);
    r.factored.tension = capacity();
    r.factored.lateral = capacity();
    // A structural check on the factored basis of one type: strength combinations are then
    // checked pile by pile, service ones as arrays, in the same run.
    if (structural && t == 0) r.factored.structural_axial = 3000.0;
    k.resistances.push_back(r);
  }
  for (std::size_t i = 0; i < piles; ++i) {
    Pile pile;
    pile.id = "P" + std::to_string(i + 1);
    pile.x = 1.5 * static_cast<double>(i % 20);
    pile.y = 1.5 * static_cast<double>(i / 20);
    pile.type = i % types;
    p.piles.push_back(pile);
  }
  LoadCase d;
  d.id = "D";
  p.load_cases.push_back(d);
  for (std::size_t c = 0; c < combinations; ++c) {
    Combination combo;
    combo.id = "C" + std::to_string(c + 1);
    combo.limit_state = unit(rng) < 0.5 ? LimitState::service : LimitState::strength;
    combo.factors = {{0, 1.0}};
    if (c > 0 && unit(rng) < 0.2) {
      // The same combination again: every value ties with an earlier one.
      const std::size_t earlier = static_cast<std::size_t>(unit(rng) * static_cast<double>(c));
      combo.limit_state = p.combinations[earlier].limit_state;
      p.combinations.push_back(combo);
      k.solutions.push_back(k.solutions[earlier]);
      continue;
    }
    p.combinations.push_back(combo);
    CapSolution s;
    s.overturns = unit(rng) < 0.04;
    const bool lifts = unit(rng) < 0.33;
    for (std::size_t i = 0; i < piles; ++i) {
      PileForce f;
      const double r = unit(rng);
      f.axial = r < 0.05   ? kTolerance          // at the tolerance: no demand
                : r < 0.08 ? -kTolerance
                : r < 0.10 ? 0.0
                           : -800.0 + 3000.0 * unit(rng);
      f.lateral = unit(rng) < 0.1 ? 0.5 * kTolerance : 150.0 * unit(rng);
      if (lifts && !p.pile_types[p.piles[i].type].tension && f.axial < 0) {
        f.axial = 0.0;  // dropped out: an exact zero axial force (cap_solver.hpp)
        f.active = false;
      }
      s.piles.push_back(f);
    }
    k.solutions.push_back(s);
  }
  return k;
}

CheckResults run(const Case& k, bool rows, bool row_by_row) {
  CheckAccumulator a(k.project, k.resistances, {}, rows);
  a.fold_row_by_row(row_by_row);
  for (std::size_t c = 0; c < k.solutions.size(); ++c) a.add(c, k.solutions[c]);
  return a.finish();
}

void same_extreme(const Extreme& a, const Extreme& b) {
  CHECK(a.combination == b.combination);
  CHECK(std::memcmp(&a.value, &b.value, sizeof(double)) == 0);  // the same bits
}

// Every number of two runs' results, bit for bit.
void same_results(const CheckResults& a, const CheckResults& b) {
  REQUIRE(a.envelope.size() == b.envelope.size());
  for (std::size_t i = 0; i < a.envelope.size(); ++i) {
    INFO("pile " << i);
    same_extreme(a.envelope[i].max_compression, b.envelope[i].max_compression);
    same_extreme(a.envelope[i].max_tension, b.envelope[i].max_tension);
    same_extreme(a.envelope[i].max_lateral, b.envelope[i].max_lateral);
    same_extreme(a.envelope[i].max_utilization, b.envelope[i].max_utilization);
    CHECK(a.envelope[i].governing == b.envelope[i].governing);
    CHECK(a.envelope[i].pass == b.envelope[i].pass);
    for (std::size_t k = 0; k < 4; ++k) {
      same_extreme(a.governing[i][k].utilization, b.governing[i][k].utilization);
      CHECK(a.governing[i][k].demand == b.governing[i][k].demand);
    }
  }
  REQUIRE(a.combinations.size() == b.combinations.size());
  for (std::size_t c = 0; c < a.combinations.size(); ++c) {
    INFO("combination " << c);
    const auto &x = a.combinations[c], &y = b.combinations[c];
    CHECK(x.pass == y.pass);
    CHECK(x.max_utilization == y.max_utilization);
    CHECK(x.governing_pile == y.governing_pile);
    CHECK(x.governing == y.governing);
    CHECK(x.total_compression == y.total_compression);
    CHECK(x.total_tension == y.total_tension);
    REQUIRE(x.piles.size() == y.piles.size());
    for (std::size_t i = 0; i < x.piles.size(); ++i) {
      CHECK(x.piles[i].axial == y.piles[i].axial);
      CHECK(x.piles[i].lateral == y.piles[i].lateral);
      CHECK(x.piles[i].utilization == y.piles[i].utilization);
      CHECK(x.piles[i].governing == y.piles[i].governing);
      CHECK(x.piles[i].state == y.piles[i].state);
      CHECK(x.piles[i].pass == y.piles[i].pass);
      CHECK(x.piles[i].head_moment == y.piles[i].head_moment);
    }
  }
  CHECK(a.summary.pass == b.summary.pass);
  CHECK(a.summary.max_utilization == b.summary.max_utilization);
  CHECK(a.summary.pile == b.summary.pile);
  CHECK(a.summary.combination == b.summary.combination);
  CHECK(a.summary.check == b.summary.check);
  CHECK(a.summary.failed_combinations == b.summary.failed_combinations);
  CHECK(a.summary.overturned == b.summary.overturned);
}

}  // namespace

TEST_CASE("check fold: arrays and row by row give the same bits", "[check_fold]") {
  std::mt19937_64 rng(20261202);
  // 300 piles: more than one block of the pass (256) and not a multiple of four.
  for (const std::size_t piles : {1u, 7u, 300u}) {
    for (const bool structural : {false, true}) {
      const Case k = random_case(rng, piles, 3, 120, structural);
      INFO(piles << " piles, structural " << structural);
      for (const bool rows : {true, false}) same_results(run(k, rows, false), run(k, rows, true));
      // Full detail and the envelope-only run fold to the same envelope.
      same_results(run(k, false, false), [&] {
        CheckResults r = run(k, true, false);
        for (auto& c : r.combinations) c.piles.clear();
        return r;
      }());
    }
  }
}

TEST_CASE("check fold: the envelope is the largest value over the combinations, first on a tie",
          "[check_fold]") {
  std::mt19937_64 rng(11);
  const Case k = random_case(rng, 45, 4, 200, false);
  const CheckResults folded = run(k, false, false);
  const Project& p = k.project;
  std::size_t ties = 0;  // later combinations equal to the largest so far: the earlier stays
  for (std::size_t i = 0; i < p.piles.size(); ++i) {
    INFO("pile " << i);
    // The reference, from checks.hpp's definition (hand-derived: max over combinations).
    Extreme compression, tension, lateral, utilization;
    std::array<Extreme, 3> check;
    bool pass = true;
    for (std::size_t c = 0; c < p.combinations.size(); ++c) {
      if (k.solutions[c].overturns) {
        pass = false;  // an overturned combination fails every pile
        continue;
      }
      const PileForce& f = k.solutions[c].piles[i];
      const PileTypeResistance& type = k.resistances[p.piles[i].type];
      const Resistance& r =
          p.combinations[c].limit_state == LimitState::service ? type.allowable : type.factored;
      auto ratio = [](double demand, std::optional<double> capacity) {
        return capacity && *capacity > 0 ? demand / *capacity : kInf;
      };
      const double demand[3] = {f.axial, -f.axial, f.lateral};
      const std::optional<double> capacity[3] = {r.compression, r.tension, r.lateral};
      double u = 0.0;
      for (std::size_t j = 0; j < 3; ++j) {
        if (demand[j] <= kTolerance) continue;
        const double uj = ratio(demand[j], capacity[j]);
        u = std::max(u, uj);
        // The first combination of the largest: a later one must exceed it.
        if (check[j].combination && uj == check[j].value) ++ties;
        if (!check[j].combination || uj > check[j].value) check[j] = {uj, c};
      }
      if (u > 1.0) pass = false;
      auto raise = [&](Extreme& x, double v, double tolerance) {
        if (v <= tolerance) return;
        if (!x.combination || v > x.value) x = {v, c};
      };
      raise(compression, f.axial, kTolerance);
      raise(tension, -f.axial, kTolerance);
      raise(lateral, f.lateral, kTolerance);
      raise(utilization, u, 0.0);
    }
    const PileEnvelope& e = folded.envelope[i];
    CHECK(e.max_compression.combination == compression.combination);
    CHECK(e.max_compression.value == compression.value);
    CHECK(e.max_tension.combination == tension.combination);
    CHECK(e.max_tension.value == tension.value);
    CHECK(e.max_lateral.combination == lateral.combination);
    CHECK(e.max_lateral.value == lateral.value);
    CHECK(e.max_utilization.combination == utilization.combination);
    CHECK(e.max_utilization.value == utilization.value);
    CHECK(e.pass == pass);
    for (std::size_t j = 0; j < 3; ++j) {
      CHECK(folded.governing[i][j].utilization.combination == check[j].combination);
      CHECK(folded.governing[i][j].utilization.value == check[j].value);
    }
  }
  CHECK(ties > 0);
}
