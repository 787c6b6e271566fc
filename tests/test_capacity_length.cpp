// Tests of the shortest pile length meeting a required capacity (capacity_length.hpp).
//
// The hand calculation the checks use (docs/verification.md): a round pile, D = 0.5 m, head
// at the ground, in dry sand with γ = 18 kN/m³, a β shaft with K = 1, δ = 30° and no tip
// method. β method (Burland 1973, common practice): f = K·σ'v·tanδ = 18·tan30°·z kPa, so
//   Qs(L) = K·tanδ·γ·πD·L²/2 = 8.1621·L² kN.
// Allowable compression Qs/2.5 = 3.26484·L² (FS 2.5, the default, common practice).
// Tension: 2/3 of the shaft in sand (the default, common practice, from memory) plus the
// pile's weight 24·πD²/4·L, over FS 3: Ta(L) = 1.81380·L² + 1.57080·L.
// Factored compression: φ = 0.25 for the β method on a driven pile (AASHTO LRFD Table
// 10.5.5.2.3-1, from memory): 2.04053·L².
#include <catch2/catch.hpp>
#include <cmath>
#include <numbers>

#include "cairn/geotechnics/capacity_length.hpp"
#include "cairn/core/diagnostics.hpp"

using namespace cairn;

namespace {

constexpr double kPi = std::numbers::pi;

SoilLayer beta_sand(double thickness) {
  SoilLayer layer;
  layer.name = "sand";
  layer.kind = SoilKind::sand;
  layer.thickness = thickness;
  layer.unit_weight = 18.0;
  layer.saturated_unit_weight = 20.0;
  layer.friction_angle = 30.0;
  layer.shaft_k = 1.0;
  layer.shaft_delta = 30.0;
  layer.spt_n60 = 30.0;
  // The engineer's limit, far above the 10–105 kPa of this sand, so that the hand calculation
  // (no limit) holds whatever default limit the β method gets.
  layer.max_unit_shaft = 500.0;
  return layer;
}

SoilLayer soft_clay(double thickness) {
  SoilLayer layer;
  layer.name = "soft clay";
  layer.kind = SoilKind::clay;
  layer.thickness = thickness;
  layer.unit_weight = 16.0;
  layer.saturated_unit_weight = 16.0;
  layer.undrained_strength = 20.0;
  return layer;
}

SoilProfile sand_over_clay() {
  SoilProfile profile;
  profile.layers = {beta_sand(10.0), soft_clay(10.0)};
  return profile;
}

PileGeometry pile() {
  PileGeometry g;
  g.width = 0.5;
  g.round = true;
  g.length = 3.0;
  return g;
}

PileDesign beta_shaft() {
  PileDesign d;
  d.shaft_sand = ShaftMethod::beta;
  return d;
}

// Closed forms of the header's hand calculation, kN.
double shaft(double length) {
  return 1.0 * std::tan(30.0 * kPi / 180.0) * 18.0 * kPi * 0.5 * length * length / 2.0;
}
double allowable_tension(double length) {
  return (2.0 / 3.0 * shaft(length) + 24.0 * kPi * 0.25 / 4.0 * length) / 3.0;
}

}  // namespace

TEST_CASE("capacity_length: the table's rows match the hand-calculated beta shaft",
          "[capacity_length]") {
  const auto rows = capacity_with_depth(sand_over_clay(), pile(), beta_shaft(), 0.5, 3.0);
  REQUIRE(rows.size() > 5);
  const DepthRow& row = rows[5];  // L = 5.5 m
  REQUIRE(row.length == Approx(5.5));
  // Hand calculation in this file's header (β method, Burland 1973; FS 2.5 and 3, common
  // practice; φ = 0.25, AASHTO LRFD Table 10.5.5.2.3-1, from memory). Quadrature of a
  // linear f is exact, so a relative 1e-9 holds.
  CHECK(row.ultimate == Approx(shaft(5.5)).epsilon(1e-9));
  CHECK(row.allowable_compression == Approx(shaft(5.5) / 2.5).epsilon(1e-9));
  CHECK(row.allowable_tension == Approx(allowable_tension(5.5)).epsilon(1e-9));
  CHECK(row.factored_compression == Approx(0.25 * shaft(5.5)).epsilon(1e-9));
  CHECK(row.factored_tension == Approx(0.20 * 2.0 / 3.0 * shaft(5.5)).epsilon(1e-9));
}

TEST_CASE("capacity_length: shortest length for a compression, a tension and both",
          "[capacity_length]") {
  const SoilProfile profile = sand_over_clay();
  LengthNeed need;
  SECTION("100 kN allowable compression") {
    // 3.26484·L² = 100 → L = 5.5344 m; on the 1 cm grid 5.54 m (5.53 m gives 99.84 kN).
    need.compression = 100.0;
    const LengthChoice c = shortest_length(profile, pile(), beta_shaft(), need, 0.5, 3.0, 0.01);
    REQUIRE(c.length);
    CHECK(*c.length == Approx(5.54).margin(1e-9));
    CHECK(shaft(*c.length) / 2.5 >= 100.0);
    CHECK(shaft(*c.length - 0.01) / 2.5 < 100.0);
    CHECK_FALSE(c.at_shortest);
    CHECK(c.tip_layer == "sand");
    REQUIRE(c.next_boundary);
    CHECK(*c.next_boundary == Approx(10.0));
    CHECK(c.next_layer == "soft clay");
    CHECK_FALSE(c.tip_layer_top);  // the sand starts at the ground
  }
  SECTION("50 kN allowable tension") {
    // 1.81380·L² + 1.57080·L = 50 → L = 4.8352 m → 4.84 m.
    need.tension = 50.0;
    const LengthChoice c = shortest_length(profile, pile(), beta_shaft(), need, 0.5, 3.0, 0.01);
    REQUIRE(c.length);
    CHECK(*c.length == Approx(4.84).margin(1e-9));
    CHECK(allowable_tension(4.83) < 50.0);
  }
  SECTION("both: the longer of the two governs") {
    need.compression = 100.0;
    need.tension = 50.0;
    const LengthChoice c = shortest_length(profile, pile(), beta_shaft(), need, 0.5, 3.0, 0.01);
    REQUIRE(c.length);
    CHECK(*c.length == Approx(5.54).margin(1e-9));
  }
  SECTION("factored basis") {
    // 2.04053·L² = 100 → L = 7.0005 m → 7.01 m (7.00 m gives 99.99 kN).
    need.compression = 100.0;
    need.basis = CapacityBasis::factored;
    const LengthChoice c = shortest_length(profile, pile(), beta_shaft(), need, 0.5, 3.0, 0.01);
    REQUIRE(c.length);
    CHECK(*c.length == Approx(7.01).margin(1e-9));
  }
  SECTION("met at the shortest length searched") {
    need.compression = 1.0;
    const LengthChoice c = shortest_length(profile, pile(), beta_shaft(), need, 0.5, 3.0, 0.01);
    REQUIRE(c.length);
    CHECK(c.at_shortest);
    CHECK(*c.length == Approx(3.0));
  }
  SECTION("not met within the profile") {
    // The whole 10 m of sand gives 816 kN ultimate; the clay adds nothing (no method).
    need.compression = 1000.0;
    const LengthChoice c = shortest_length(profile, pile(), beta_shaft(), need, 0.5, 3.0, 0.01);
    CHECK_FALSE(c.length);
    CHECK_FALSE(c.at);
    REQUIRE(c.longest);
    CHECK(c.longest->length == Approx(20.0));
  }
  SECTION("a table off the resolution's grid: the answer is rounded up to it") {
    // Rows 3.005, 3.505, …: 5.505 m falls short, 6.005 m meets; bisection between them on
    // 5.505 + j·0.01 finds 5.535 m, rounded up to 5.54 m (as from the grid).
    need.compression = 100.0;
    const LengthChoice c = shortest_length(profile, pile(), beta_shaft(), need, 0.5, 3.005, 0.01);
    REQUIRE(c.length);
    CHECK(*c.length == Approx(5.54).margin(1e-9));
  }
  SECTION("a step finer than the resolution: the row found, rounded up to the resolution") {
    need.compression = 100.0;
    const LengthChoice c = shortest_length(profile, pile(), beta_shaft(), need, 0.25, 3.0, 0.5);
    REQUIRE(c.length);
    CHECK(*c.length == Approx(6.0));  // 5.75 m, the first 0.25 m row with ≥ 100 kN, → 6.0 m
  }
}

TEST_CASE("capacity_length: a longer pile that falls short again is reported",
          "[capacity_length]") {
  // A tip in sand (Meyerhof SPT tip) over soft clay with no clay tip method: the tip drops
  // to 0 once it enters the clay, so lengths just beyond 10 m fall short again.
  PileDesign design = beta_shaft();
  design.tip_sand = TipMethod::meyerhof_spt;
  LengthNeed need;
  need.compression = 500.0;
  const LengthChoice c =
      shortest_length(sand_over_clay(), pile(), design, need, 0.5, 3.0, 0.01);
  REQUIRE(c.length);
  CHECK(*c.length < 10.0);
  CHECK_FALSE(c.tip_layer_top);
  REQUIRE(c.falls_short_again);
  // A tip exactly on the boundary bears on the clay below (the soil column's boundary rule),
  // so 10.0 m already falls short.
  CHECK(*c.falls_short_again >= 10.0);
}

TEST_CASE("capacity_length: tip elevation from the ground level", "[capacity_length]") {
  SoilProfile profile = sand_over_clay();
  CHECK_FALSE(tip_elevation(profile, 5.0));
  profile.ground_level = 102.5;
  REQUIRE(tip_elevation(profile, 5.0));
  CHECK(*tip_elevation(profile, 5.0) == Approx(97.5));  // elevation = ground level − depth
}

TEST_CASE("capacity_length: a table starting below the profile is an input error",
          "[capacity_length]") {
  Project project;
  project.soil = sand_over_clay();  // 20 m deep
  project.cap.depth = 1.5;          // the longest pile is 18.5 m
  CHECK_NOTHROW(require_table_within_profile(project, 18.5, "--from"));
  try {
    require_table_within_profile(project, 19.0, "--from");
    FAIL("expected an InputError");
  } catch (const InputError& e) {
    REQUIRE(e.diagnostics().size() == 1);
    CHECK(e.diagnostics().front().message ==
          "--from: expected a pile length whose tip lies within the soil profile (at most 18.5 "
          "m: profile 20 m deep, pile heads 1.5 m below the ground), got '19'");
  }
}

TEST_CASE("capacity_length: the top of the bearing layer above the tip is reported",
          "[capacity_length]") {
  // 4 m of soft clay (γ = 16, no clay method) over the header's sand: σ'v = 64 + 18·(z − 4)
  // = 18z − 8 kPa, Qs = tan30°·π·0.5·(9L² − 8L − 112) = 0.90690·(9L² − 8L − 112) kN;
  // allowable Qs/2.5 ≥ 50 kN → 9L² − 8L − 249.83 = 0 → L = 5.7318 m → 5.74 m (hand
  // calculation as in the header: β method, Burland 1973; FS 2.5 common practice).
  SoilProfile profile;
  profile.layers = {soft_clay(4.0), beta_sand(16.0)};
  LengthNeed need;
  need.compression = 50.0;
  const LengthChoice c = shortest_length(profile, pile(), beta_shaft(), need, 0.5, 3.0, 0.01);
  REQUIRE(c.length);
  CHECK(*c.length == Approx(5.74).margin(1e-9));
  CHECK(c.tip_layer == "sand");
  REQUIRE(c.tip_layer_top);
  CHECK(*c.tip_layer_top == Approx(4.0));
  CHECK_FALSE(c.next_boundary);  // the sand reaches the profile's base
}
