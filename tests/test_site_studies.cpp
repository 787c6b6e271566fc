// Tests of fast_group.hpp and studies.hpp: each pile lost in turn, the added pile search and
// the installation tolerance study.
//
// Hand-derived closed forms (rigid cap, equal vertical piles, P/n ± M·x/Σx² about the
// centroid of the piles that remain; the products Σx'y' vanish in the groups used):
// the diamond of tests/data/site/diamond.yaml has piles E (1, 0), N (0, 1), W (−1, 0),
// S (0, −1) and 1000 kN down at the centre; allowable compression 500 kN.
#include <catch2/catch.hpp>

#include <cmath>
#include <string>

#include "cairn/app/analysis.hpp"
#include "cairn/site/fast_group.hpp"
#include "cairn/site/studies.hpp"

using namespace cairn;

namespace {
const std::string kData = std::string(CAIRN_TEST_DATA) + "/site/";
const std::string kDemo = std::string(CAIRN_DEMO_DIR) + "/";
}  // namespace

TEST_CASE("losing one pile of the diamond: the three left take P/n ± M·x/Σx²", "[site_studies]") {
  const CheckRun run = analyse_project(kData + "diamond.yaml");
  const FastGroup group(run);
  CHECK(group.evaluate({}, {}).max_utilization == Approx(0.5));  // 250 / 500
  const LossStudy study = each_pile_lost(group, true);
  REQUIRE(study.single.size() == 4);
  // Lose E: x̄ = −1/3, Σ(x − x̄)² = 2/3; N and S carry 1000/3 + (1000/3)(1/3)/(2/3) = 500 kN,
  // W carries 1000/3 − (1000/3)(2/3)/(2/3) = 0 (hand derivation).
  CHECK(study.single[0].outcome.max_utilization == Approx(1.0));
  // Lose two opposite piles (E and W): the line N–S cannot hold... it can: the load is on it.
  // Lose two neighbours (E and N): W and S on a line, the load off it: unstable.
  bool neighbours_unstable = false;
  for (const auto& c : study.pairs)
    if (c.lost == std::vector<std::size_t>{0, 1}) neighbours_unstable = c.outcome.unstable;
  CHECK(neighbours_unstable);
}

TEST_CASE("the fast analysis of a lost pile equals the full check without it", "[site_studies]") {
  // The crane-rail demo (battered piles): drop P2 and compare with the pipeline's own check.
  const CheckRun run = analyse_project(kDemo + "crane-rail-footing/cap.yaml");
  const FastGroup group(run);
  std::vector<char> keep(run.project.piles.size(), 1);
  keep[1] = 0;
  const StudyOutcome fast = group.evaluate(keep, {});
  Project without = run.project;
  without.piles.erase(without.piles.begin() + 1);
  const CheckRun full = analyse(without);
  CHECK(fast.max_utilization == Approx(full.results.summary.max_utilization).epsilon(1e-9));
  CHECK(fast.combination == *full.results.summary.combination);
  // And the intact group, the same as the check.
  CHECK(group.evaluate({}, {}).max_utilization ==
        Approx(run.results.summary.max_utilization).epsilon(1e-9));
}

TEST_CASE("an added pile replaces a lost one, clear of it and of the edge", "[site_studies]") {
  const CheckRun run = analyse_project(kData + "diamond.yaml");
  const FastGroup group(run);
  SearchSettings s;
  s.type = 0;
  s.step = 0.05;
  s.outline = *run.project.cap.outline;
  s.edge_distance = run.project.group.min_edge_distance;  // 0.225 m
  s.width = 0.3;
  for (const auto& p : run.project.piles) s.in_ground.push_back({p.x, p.y, 0.3});
  s.lost = {{1.0, 0.0}};
  std::vector<char> keep = {0, 1, 1, 1};  // E lost
  const SearchResult r = search_added_piles(group, keep, s);
  REQUIRE(!r.best.empty());
  CHECK(r.piles == 1);
  CHECK(r.best.front().pass());
  const auto at = r.best.front().at.front();
  CHECK(std::hypot(at[0] - 1.0, at[1]) >= 0.75 - 1e-9);      // 2.5 × 0.3 m from the lost pile
  CHECK(1.8 - std::abs(at[0]) >= 0.225 + 0.15 - 1e-9);        // face 0.225 m from the edge
  // The search's figure is the full check's with the pile added where it says.
  Project with = run.project;
  with.piles.erase(with.piles.begin());
  Pile added;
  added.id = "A";
  added.x = at[0];
  added.y = at[1];
  with.piles.push_back(added);
  const CheckRun full = analyse(with);
  CHECK(r.best.front().outcome.max_utilization ==
        Approx(full.results.summary.max_utilization).epsilon(1e-9));
}

TEST_CASE("the tolerance study is reproducible and bounded by the design", "[site_studies]") {
  const CheckRun run = analyse_project(kData + "diamond.yaml");
  const FastGroup group(run);
  ToleranceSettings s;
  s.trials = 2000;
  s.seed = 7;
  const ToleranceStudy a = tolerance_study(group, s);
  const ToleranceStudy b = tolerance_study(group, s);
  CHECK(a.samples == b.samples);
  CHECK(a.design == Approx(0.5));
  CHECK(a.median >= 0.5 - 1e-12);  // the load at the centroid is the least eccentric
  CHECK(a.p95 >= a.median);
  CHECK(a.worst_outcome.max_utilization >= a.max - 1e-12);
  // Hand derivation: E moved 75 mm outward alone (x̄ = 0.075/4, Σ(x − x̄)² = 1.075² + 1 − 4x̄²)
  // puts 250 + 1000·x̄·(1 + x̄)/Σ = 258.87 kN on W; the worst arrangement is at least as bad.
  const double xbar = 0.075 / 4, sum = 1.075 * 1.075 + 1 - 4 * xbar * xbar;
  CHECK(a.worst_outcome.max_utilization >= (250 + 1000 * xbar * (1 + xbar) / sum) / 500 - 1e-9);
  s.plan = 1e-9;
  CHECK(tolerance_study(group, s).max == Approx(0.5).epsilon(1e-6));
}
