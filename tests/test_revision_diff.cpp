// Tests of revision_diff.hpp: two revisions of the diamond of tests/data/site/diamond.yaml.
// Hand derivation (P/n ± M·x/Σx², as in test_as_built.cpp): pile E moved 100 mm outward and
// the load raised to 1100 kN: x̄ = 0.025 m, Σ(x − x̄)² = 2.2075 m², so E carries
// 1.1 × (250 − 1000·0.025·1.075/2.2075) = 261.61 kN and W 1.1 × 261.61 = 287.77 kN.
#include <catch2/catch.hpp>

#include <string>

#include "cairn/app/analysis.hpp"
#include "cairn/site/revision_diff.hpp"

using namespace cairn;

namespace {
const std::string kData = std::string(CAIRN_TEST_DATA) + "/site/";
}  // namespace

TEST_CASE("a moved pile and a larger load, key by key and pile by pile", "[revision_diff]") {
  const CheckRun a = analyse_project(kData + "diamond.yaml");
  const CheckRun b = analyse_project(kData + "diamond_rev.yaml");
  const RevisionDiff d = diff_revisions(a, b);
  REQUIRE(d.moved_piles.size() == 1);
  CHECK(d.moved_piles[0].id == "E");
  CHECK(d.moved_piles[0].dx == Approx(0.1));
  REQUIRE(d.inputs.size() == 2);
  CHECK(d.inputs[0].key == "load_cases.D.Fz");
  CHECK(*d.inputs[0].after == "-1100 kN");
  CHECK(d.inputs[1].key == "piles.E.x");
  const double xbar = 0.025, sum = 1.21 + 1.0 - 4 * xbar * xbar;
  for (const auto& f : d.forces) {
    if (f.pile == "E") CHECK(f.axial_after == Approx(1.1 * (250 - 1000 * xbar * (1.1 - xbar) / sum)));
    if (f.pile == "W") CHECK(f.axial_after == Approx(1.1 * (250 + 1000 * xbar * (1 + xbar) / sum)));
  }
  CHECK(d.newly_failing.empty());
}

TEST_CASE("a revision failing what passed is named", "[revision_diff]") {
  const CheckRun a = analyse_project(kData + "diamond.yaml");
  const CheckRun b = analyse_project(kData + "diamond_fail.yaml");  // 2100 kN: 525 kN > 500 kN
  const RevisionDiff d = diff_revisions(a, b);
  REQUIRE(!d.newly_failing.empty());
  CHECK(d.newly_failing[0] == "combination S1");
  CHECK(diff_revisions(b, a).newly_failing.empty());
}
