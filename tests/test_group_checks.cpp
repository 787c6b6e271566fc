// Tests of group_checks.hpp: the group checks of a 3×3 group under a rigid cap, run through
// the same steps as analysis.cpp (capacities → springs → solve → pile checks → group).
#include <catch2/catch.hpp>

#include <cmath>

#include "cairn/solver/cap_solver.hpp"
#include "cairn/checks/checks.hpp"
#include "cairn/checks/group_checks.hpp"
#include "cairn/geotechnics/project_capacity.hpp"
#include "cairn/geotechnics/stiffness.hpp"

using namespace cairn;

namespace {

// Values computed from published formulas are rounded to 4–5 digits.
constexpr double kPublished = 1e-3;
// Hand calculations from exact inputs: round-off only.
constexpr double kTight = 1e-9;

// A 3×3 grid of round piles, diameter D, spacing s, length L, with typed springs (axial
// 1e5 kN/m, lateral 5e3 kN/m) and one load case D = `load` applied at the origin.
Project grid(double diameter, double spacing, double length, Wrench load) {
  Project p;
  p.file = "grid.yaml";
  PileType type;
  type.id = "B";
  type.section = {SectionShape::round, diameter};
  type.length = length;
  type.elastic_modulus = 3.0e7;
  type.axial_stiffness = 1.0e5;
  type.lateral_stiffness = 5.0e3;
  p.pile_types.push_back(type);
  int n = 0;
  for (int row = -1; row <= 1; ++row)
    for (int column = -1; column <= 1; ++column) {
      Pile pile;
      pile.id = "P" + std::to_string(++n);
      pile.x = column * spacing;
      pile.y = row * spacing;
      p.piles.push_back(pile);
    }
  LoadCase d;
  d.id = "D";
  PointLoad point;
  point.load = load;
  d.loads.push_back(point);
  p.load_cases.push_back(d);
  Combination s1, u1;
  s1.id = "S1";
  s1.limit_state = LimitState::service;
  s1.factors = {{0, 1.0}};
  u1.id = "U1";
  u1.limit_state = LimitState::strength;
  u1.factors = {{0, 1.4}};
  p.combinations = {s1, u1};
  p.group.where = {"grid.yaml", 30, 1};
  return p;
}

void typed_capacity(Project& p, double allowable, double factored) {
  CapacitySet a, f;
  a.basis = CapacityBasis::allowable;
  a.compression = allowable;
  a.tension = allowable / 2.0;
  a.lateral = 100.0;
  f.basis = CapacityBasis::factored;
  f.compression = factored;
  f.tension = factored / 2.0;
  f.lateral = 150.0;
  p.pile_types[0].capacities = {a, f};
}

struct Run {
  std::vector<PileTypeCapacity> capacities;
  std::vector<PileTypeResistance> resistances;
  CheckResults results;
  GroupResults group;
};

// The pipeline of analysis.cpp, on a Project built in code.
Run run(const Project& p) {
  Run r;
  r.capacities = compute_capacities(p);
  const auto stiffness = pile_type_stiffness(p, r.capacities);
  const CapSolver solver(pile_springs(p, stiffness));
  REQUIRE(unresisted_cases(p, solver).empty());
  r.resistances =
      resolve_resistances(p, computed_resistances(p, r.capacities, lateral_capacities(p)));
  REQUIRE(missing_resistances(p, r.resistances).empty());
  REQUIRE(group_input_problems(p, r.capacities).empty());
  r.results = check_piles(p, solve_combinations(p, solver), r.resistances);
  r.group = evaluate_group(p, r.results, r.resistances, r.capacities);
  return r;
}

std::vector<std::string> messages(const std::vector<Diagnostic>& list) {
  std::vector<std::string> out;
  for (const auto& d : list) out.push_back(d.message);
  return out;
}

SoilLayer layer(const std::string& name, SoilKind kind, double thickness) {
  SoilLayer l;
  l.name = name;
  l.kind = kind;
  l.thickness = thickness;
  l.unit_weight = 18.0;
  l.saturated_unit_weight = 19.0;
  return l;
}

}  // namespace

TEST_CASE("group_checks: Converse–Labarre efficiency reduces the group capacity",
          "[group_checks][published]") {
  // 3×3, D = 0.4 m, s = 1.2 m (s/D = 3); 600 kN per pile in S1.
  Project p = grid(0.4, 1.2, 15.0, {0, 0, -5400.0, 0, 0, 0});
  typed_capacity(p, 1000.0, 1500.0);
  p.group.efficiency = "converse-labarre";
  const Run r = run(p);
  // Source: Converse–Labarre formula (from memory), computed: 3×3 with
  // s/D = 3 → Eg = 0.7269.
  REQUIRE(r.group.applied.value);
  CHECK(*r.group.applied.value == Approx(0.7269).epsilon(kPublished));
  // Group capacity = η·Σ (UFC 3-220-20 (2025) Eq. 6-37): 0.7269 × 9 × 1000 = 6542 kN.
  CHECK(*r.group.capacity_allowable == Approx(0.7269 * 9000.0).epsilon(kPublished));
  CHECK(*r.group.capacity_factored == Approx(0.7269 * 13500.0).epsilon(kPublished));
  CHECK(r.group.governing == "efficiency");
  // The other methods side by side (computed): Los Angeles 0.7918; Feld 0.7222.
  for (const auto& e : r.group.efficiencies.all) {
    if (e.method == EfficiencyMethod::los_angeles) CHECK(*e.value == Approx(0.7918).epsilon(kPublished));
    if (e.method == EfficiencyMethod::feld) CHECK(*e.value == Approx(0.7222).epsilon(kPublished));
  }
  // Demand per combination: Σ compression = 5400 kN (S1) and 7560 kN (U1, × 1.4).
  REQUIRE(r.group.per_combination.size() == 2);
  const auto& s1 = r.group.per_combination[0];
  CHECK(s1.compression == Approx(5400.0).epsilon(1e-9));
  CHECK(*s1.utilization == Approx(5400.0 / (0.72689 * 9000.0)).epsilon(kPublished));
  CHECK(r.group.per_combination[1].compression == Approx(7560.0).epsilon(1e-9));
  CHECK(r.group.pass);

  SECTION("s/D = 2.5 and 4") {
    for (const auto& [spacing, published] : {std::pair{1.0, 0.6770}, std::pair{1.6, 0.7921}}) {
      CAPTURE(spacing);
      Project q = grid(0.4, spacing, 15.0, {0, 0, -5400.0, 0, 0, 0});
      typed_capacity(q, 1000.0, 1500.0);
      q.group.efficiency = "converse-labarre";
      // Source: Converse–Labarre formula (from memory), computed.
      CHECK(*run(q).group.capacity_allowable == Approx(published * 9000.0).epsilon(kPublished));
    }
  }
  SECTION("without a method η = 1") {
    p.group.efficiency = "none";
    CHECK(*run(p).group.capacity_allowable == Approx(9000.0).epsilon(kTight));
  }
}

TEST_CASE("group_checks: block failure governs in soft clay", "[group_checks][published]") {
  // Computed from the block equation and α method: 3×3, D = 0.4, s = 0.8 (Bg = 2.0 m), L = 15 m, c̄u = 20 kPa along
  // the piles, cu = 30 kPa below the tips, α = 1.0: Qi = 376.99 + 33.93 = 410.92 kN,
  // 9Qi = 3698.3 kN, Qblock = 2400 + 1080 = 3480.0 kN → block governs (ratio 0.9410).
  // Sources: Terzaghi & Peck block failure (UFC 3-220-20 (2025) Eq. 6-38) with Skempton (1951) Nc = 9.0
  // (D/B = 7.5 > 2.5, B/L = 1; Skempton as reported in Smith, Elements of Soil Mechanics).
  Project p = grid(0.4, 0.8, 15.0, {0, 0, -1200.0, 0, 0, 0});
  p.group.min_spacing_factor = 2.0;  // s = 2D here; keep the spacing check out of the way
  SoilLayer upper = layer("soft clay", SoilKind::clay, 15.0);
  upper.undrained_strength = 20.0;
  SoilLayer lower = layer("firm clay", SoilKind::clay, 10.0);
  lower.undrained_strength = 30.0;
  p.soil = SoilProfile{std::nullopt, {upper, lower}};
  CapacitySet ultimate;
  ultimate.basis = CapacityBasis::ultimate;
  ultimate.compression = 410.92;  // the single-pile Qi computed above, typed in
  ultimate.tension = 376.99;
  ultimate.lateral = 100.0;
  ultimate.resistance_factor = 0.7;
  ultimate.resistance_factor_tension = 0.7;
  p.pile_types[0].capacities = {ultimate};
  const Run r = run(p);
  REQUIRE(r.group.block);
  CHECK(r.group.block->perimeter == Approx(2400.0).epsilon(kPublished));
  CHECK(r.group.block->base == Approx(1080.0).epsilon(kPublished));
  CHECK(r.group.block->nc == Approx(9.0).epsilon(kPublished));
  CHECK(r.group.block->capacity == Approx(3480.0).epsilon(kPublished));
  // Allowable basis: Σ Qi/2.5 = 3698.3/2.5 = 1479.3 kN against Qblock/2.5 = 1392.0 kN; the
  // same factor of safety on both keeps the computed ratio 0.9410.
  CHECK(r.group.governing == "block");
  CHECK(*r.group.capacity_allowable == Approx(3480.0 / 2.5).epsilon(kPublished));
  CHECK(*r.group.capacity_allowable / (9.0 * 410.92 / 2.5) == Approx(0.9410).epsilon(kPublished));
  // Factored: Qblock × φ 0.60 (AASHTO LRFD Table 10.5.5.2.3-1, driven piles, from memory)
  // = 2088 kN, below Σ 0.7·Qi = 2588.8 kN.
  CHECK(*r.group.capacity_factored == Approx(3480.0 * 0.60).epsilon(kPublished));
  // S1: Σ compression 1200 kN against 1392 kN.
  CHECK(*r.group.per_combination[0].utilization == Approx(1200.0 / 1392.0).epsilon(kPublished));
}

TEST_CASE("group_checks: input problems only the group checks can see", "[group_checks]") {
  SECTION("Converse–Labarre on an irregular layout") {
    Project p = grid(0.4, 1.2, 15.0, {0, 0, -5400.0, 0, 0, 0});
    typed_capacity(p, 1000.0, 1500.0);
    p.group.efficiency = "converse-labarre";
    p.piles[4].x = 0.3;  // the centre pile off its grid line
    const auto problems = group_input_problems(p, {});
    REQUIRE(problems.size() == 1);
    CHECK(problems[0].where.line == 30);
    CHECK(problems[0].message.rfind(
              "group.efficiency: 'converse-labarre' does not apply: irregular layout (", 0) == 0);
  }
  SECTION("a pile outside the cap outline") {
    Project p = grid(0.4, 1.2, 15.0, {0, 0, -5400.0, 0, 0, 0});
    typed_capacity(p, 1000.0, 1500.0);
    Outline outline;
    outline.polygon = {{-1.8, -1.8}, {1.8, -1.8}, {1.8, 1.8}, {-1.8, 1.8}};
    p.cap.outline = outline;
    p.piles[8].x = 2.4;
    p.piles[8].where = {"grid.yaml", 12, 5};
    const auto problems = group_input_problems(p, {});
    REQUIRE(problems.size() == 1);
    CHECK(problems[0].where.line == 12);
    CHECK(problems[0].message == "piles: pile 'P9' at (2.4, 1.2) m lies outside the cap outline");
    SECTION("in a US project the position is quoted in ft") {
      p.units = UnitSystem::US;
      const auto us = group_input_problems(p, {});
      REQUIRE(us.size() == 1);
      // 2.4 m = 7.87402 ft, 1.2 m = 3.93701 ft (1 ft = 0.3048 m exactly, NIST SP 811 2008).
      CHECK(us[0].message == "piles: pile 'P9' at (7.87402, 3.93701) ft lies outside the cap outline");
    }
  }
  SECTION("settlement without the soil's modulus names layer and field") {
    Project p = grid(0.4, 1.2, 15.0, {0, 0, -5400.0, 0, 0, 0});
    typed_capacity(p, 1000.0, 1500.0);
    p.group.settlement = true;
    p.group.tip_share = 0.3;
    p.soil = SoilProfile{std::nullopt, {layer("sand", SoilKind::sand, 30.0)}};
    p.soil->layers[0].friction_angle = 32.0;
    const auto found = messages(group_input_problems(p, {}));
    CHECK(found == std::vector<std::string>{
                       "group.settlement: layer 'sand' needs soil_modulus",
                       "group.settlement: layer 'sand': soil_modulus is missing; elastic "
                       "compression of sand needs Es"});
  }
  SECTION("settlement without consolidation data of a clay the load reaches") {
    // Sand to 16 m holds the tips (L = 15 m); soft clay below. The equivalent footing sits
    // at 10 m; under S1's 5400 kN the 2V:1H stress at 16.25 m, 5400/(2.8 + 6.25)² = 65.9 kPa,
    // is well above 10 % of σ'v0 (≈ 29 kPa), so the clay's consolidation counts.
    Project p = grid(0.4, 1.2, 15.0, {0, 0, -5400.0, 0, 0, 0});
    typed_capacity(p, 1000.0, 1500.0);
    p.group.settlement = true;
    p.group.tip_share = 0.3;
    SoilLayer sand = layer("sand", SoilKind::sand, 16.0);
    sand.soil_modulus = 40000.0;
    SoilLayer clay = layer("soft clay", SoilKind::clay, 14.0);
    clay.undrained_strength = 25.0;
    clay.soil_modulus = 5000.0;
    p.soil = SoilProfile{std::nullopt, {sand, clay}};
    const auto found = messages(group_input_problems(p, {}));
    const std::string purpose = "consolidation settlement needs Cc, e0 and σ'p (and Cr when "
                                "over-consolidated)";
    CHECK(found == std::vector<std::string>{
                       "group.settlement: layer 'soft clay': compression_index is missing; " + purpose,
                       "group.settlement: layer 'soft clay': preconsolidation is missing; " + purpose,
                       "group.settlement: layer 'soft clay': void_ratio is missing; " + purpose});
  }
  SECTION("settlement without a soil profile") {
    Project p = grid(0.4, 1.2, 15.0, {0, 0, -5400.0, 0, 0, 0});
    p.group.settlement = true;
    CHECK(messages(group_input_problems(p, {})) ==
          std::vector<std::string>{"group.settlement: settlement needs a soil profile (soil: …)"});
  }
}

TEST_CASE("group_checks: piles closer than the minimum spacing fail the group",
          "[group_checks][published]") {
  // s = 0.8 m for D = 0.4 m: 2D, below 2.5D (AASHTO LRFD 10.7.1.2, from
  // memory).
  Project p = grid(0.4, 0.8, 15.0, {0, 0, -1800.0, 0, 0, 0});
  typed_capacity(p, 1000.0, 1500.0);
  const Run r = run(p);
  CHECK_FALSE(r.group.pass);
  CHECK(r.group.spacing.smallest == Approx(0.8).epsilon(kTight));
  // 12 orthogonal neighbour pairs at 0.8 m; the diagonals (1.13 m) pass 1.0 m.
  CHECK(r.group.spacing.violations.size() == 12);
  CHECK(r.group.spacing.violations[0].required == Approx(1.0).epsilon(kTight));
  // The piles themselves pass: 200 kN of 1000.
  CHECK(r.results.summary.pass);
  for (const auto& gc : r.group.per_combination) CHECK(gc.pass);
}

TEST_CASE("group_checks: settlement per service combination by Vesić's single pile and "
          "group rule",
          "[group_checks][published]") {
  // Computed from Vesić's formulas: Qwp = 200, Qws = 400 kN, D = 0.4 m, L = 15 m, Ep = 30 GPa,
  // Es = 30 MPa, μs = 0.3, ξ = 0.5 → s = 19.073 mm; group rule: Bg = 2.8 m → sg = s·√(Bg/D)
  // = 50.46 mm. Source: Vesić (1977), NCHRP Synthesis 42 (from memory).
  Project p = grid(0.4, 1.2, 15.0, {0, 0, -5400.0, 0, 0, 0});  // 600 kN per pile
  typed_capacity(p, 1000.0, 1500.0);
  SoilLayer sand = layer("sand", SoilKind::sand, 30.0);
  sand.friction_angle = 34.0;
  sand.soil_modulus = 30000.0;
  sand.poisson_ratio = 0.3;
  p.soil = SoilProfile{std::nullopt, {sand}};
  p.group.settlement = true;
  p.group.tip_share = 1.0 / 3.0;  // 200 of 600 kN at the tip
  p.group.settlement_limit = 0.100;
  const Run r = run(p);
  CHECK(r.group.settlement_asked);
  CHECK(r.group.plan.width == Approx(2.8).epsilon(kTight));
  const auto& s1 = r.group.per_combination[0];
  REQUIRE(s1.single_settlement);
  CHECK(*s1.single_settlement == Approx(0.019073).epsilon(kPublished));
  CHECK(*s1.group_settlement == Approx(0.05046).epsilon(kPublished));
  REQUIRE(s1.footing_settlement);
  CHECK(*s1.settlement == std::max(*s1.group_settlement, *s1.footing_settlement));
  CHECK(s1.pass);
  // The strength combination gets no settlement.
  const auto& u1 = r.group.per_combination[1];
  CHECK_FALSE(u1.settlement);
  CHECK_FALSE(u1.single_settlement);

  SECTION("a settlement above the limit fails the group") {
    p.group.settlement_limit = 0.040;
    const Run tight = run(p);
    CHECK_FALSE(tight.group.per_combination[0].pass);
    CHECK_FALSE(tight.group.pass);
  }
}

TEST_CASE("group_checks: the tilt is the rotation of the rigid cap", "[group_checks]") {
  // Equal axial springs k = 1e5 kN/m at x, y ∈ {−1.2, 0, 1.2}: Σx² = Σy² = 8.64 m². Rigid
  // cap (common practice): ry = My/(k·Σx²) = 864/(1e5 × 8.64) = 1.0e-3 rad,
  // rx = Mx/(k·Σy²) = 5.0e-4 rad; tilt = √(rx² + ry²) = 1.1180e-3 rad.
  Project p = grid(0.4, 1.2, 15.0, {0, 0, -5400.0, 432.0, 864.0, 0});
  typed_capacity(p, 1000.0, 1500.0);
  const Run r = run(p);
  const auto& s1 = r.group.per_combination[0];
  const auto& rotation = r.results.combinations[0].solution.movement.rotation;
  CHECK(s1.tilt == Approx(std::hypot(rotation[0], rotation[1])).epsilon(kTight));
  CHECK(std::abs(rotation[0]) == Approx(5.0e-4).epsilon(1e-9));
  CHECK(std::abs(rotation[1]) == Approx(1.0e-3).epsilon(1e-9));
  CHECK(s1.tilt == Approx(std::sqrt(1.25e-6)).epsilon(1e-9));
  // U1 carries 1.4 times the load: 1.4 times the tilt.
  CHECK(r.group.per_combination[1].tilt == Approx(1.4 * std::sqrt(1.25e-6)).epsilon(1e-9));
}
