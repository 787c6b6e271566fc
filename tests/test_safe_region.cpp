// Tests of safe_region.hpp: the region of plan positions of a vertical load's resultant in
// which every pile passes.
//
// Closed form (hand derivation from P/n ± M·x/Σx²): four equal vertical piles at (±a, ±a)
// carry Nᵢ = P/4 + P·x·xᵢ/Σx² + P·y·yᵢ/Σy² = P/4·(1 + (x·sᵢ + y·tᵢ)/a) (Σx² = 4a², xᵢ = sᵢ·a),
// so all stay in compression exactly when |x| + |y| ≤ a: the kern of the square group, a
// square turned 45° with corners at (±a, 0) and (0, ±a) and area 2a².
#include <catch2/catch.hpp>

#include <cmath>
#include <string>

#include "cairn/app/analysis.hpp"
#include "cairn/site/safe_region.hpp"

using namespace cairn;

namespace {
const std::string kData = std::string(CAIRN_TEST_DATA) + "/site/";
}  // namespace

TEST_CASE("the safe region of a four-pile square group is its kern", "[safe_region]") {
  const CheckRun run = analyse_project(kData + "square4.yaml");
  const SafeRegions r = safe_regions(run, 0);
  REQUIRE(r.combinations.size() == 2);
  const Polygon& kern = r.combinations[0].linear;
  CHECK(area(kern) == Approx(2.0));  // 2a², a = 1 m
  for (const auto& v : kern) CHECK(std::abs(v[0]) + std::abs(v[1]) == Approx(1.0));
  // The centre is a/√2 from each edge of the kern.
  CHECK(r.combinations[0].margin == Approx(1.0 / std::sqrt(2.0)));
  // S2 stands at (0.3, 0.2): |x| + |y| = 0.5, margin (1 − 0.5)/√2.
  CHECK(r.combinations[1].resultant[0] == Approx(0.3));
  CHECK(r.combinations[1].resultant[1] == Approx(0.2));
  CHECK(r.combinations[1].margin == Approx(0.5 / std::sqrt(2.0)));
  CHECK(*r.smallest == 1);
}

TEST_CASE("with piles dropping out the traced region holds the kern", "[safe_region]") {
  const CheckRun run = analyse_project(kData + "square4.yaml");
  const SafeRegions r = safe_regions(run, 36);
  const auto& c = r.combinations[0];
  REQUIRE(c.traced.size() == 36);
  // Every point of the kern is safe, and the traced region reaches at least as far.
  CHECK(area(c.traced) >= area(c.linear) - 0.01);
  // Along +x: with the two piles at x = −1 dropped out, B and C carry P/2 each up to x = 1
  // (2 × 5000 kN capacity is not reached), so the traced edge is at the piles' line x = a.
  CHECK(c.traced[0][0] == Approx(1.0).margin(0.002));
}
