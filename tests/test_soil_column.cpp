// Tests of the soil column (soil.hpp) and of what capacity, springs, settlement and block
// failure take from it: one tip layer for a tip on a boundary, continuity across a boundary
// (Meyerhof's 1976 transitions, the tip's zone of influence), and the default limits on
// unit tip and shaft resistance with their sources.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <string>

#include "cairn/geotechnics/capacity.hpp"
#include "cairn/output/capacity_report.hpp"
#include "cairn/geotechnics/group.hpp"
#include "cairn/geotechnics/project_capacity.hpp"
#include "cairn/geotechnics/soil.hpp"
#include "cairn/geotechnics/stiffness.hpp"
#include "support.hpp"

using namespace cairn;
using cairn::test::contains;
using cairn::test::round_pile;

namespace {

// Hand calculations repeated from the same formulas: round-off of the hand figures (5 digits).
Approx rel(double value) { return cairn::test::close(value, 1e-4, 0.0); }

SoilLayer clay(const std::string& name, double thickness, double gamma, double cu) {
  SoilLayer layer;
  layer.name = name;
  layer.kind = SoilKind::clay;
  layer.thickness = thickness;
  layer.unit_weight = gamma;
  layer.undrained_strength = cu;
  return layer;
}

SoilLayer sand(const std::string& name, double thickness, double gamma, double phi) {
  SoilLayer layer;
  layer.name = name;
  layer.kind = SoilKind::sand;
  layer.thickness = thickness;
  layer.unit_weight = gamma;
  layer.friction_angle = phi;
  return layer;
}

// Soft clay 0–6 m over dense sand 6–20 m, no water; every property the capacity, the spring
// and the settlement need (invented data for the continuity checks).
SoilProfile clay_over_sand() {
  SoilLayer soft = clay("soft clay", 6.0, 18.0, 40.0);
  soft.soil_modulus = 12000.0;
  SoilLayer dense = sand("dense sand", 14.0, 20.0, 36.0);
  dense.soil_modulus = 60000.0;
  dense.shaft_k = 1.0;
  dense.shaft_delta = 27.0;
  SoilProfile profile;
  profile.layers = {soft, dense};
  return profile;
}

PileDesign vesic_design() {
  PileDesign design;
  design.tip_clay = design.tip_sand = TipMethod::vesic;
  design.shaft_clay = ShaftMethod::alpha_api;
  design.shaft_sand = ShaftMethod::beta;
  return design;
}

// One round pile of length L under a cap at the ground, with the design above.
Project one_pile_project(const SoilProfile& soil, double length) {
  Project p;
  p.soil = soil;
  PileType type;
  type.id = "B";
  type.section = {SectionShape::round, 0.4};
  type.length = length;
  type.elastic_modulus = 3.0e7;
  type.design = vesic_design();
  p.pile_types.push_back(type);
  Pile pile;
  pile.id = "P1";
  p.piles.push_back(pile);
  return p;
}

}  // namespace

// ---- The column's rules ----------------------------------------------------------------

TEST_CASE("soil column: a depth on a boundary belongs to the layer below", "[soil]") {
  // The rule is cairn's (soil.hpp): a tip standing on a boundary bears on the layer below.
  const SoilProfile profile = clay_over_sand();
  const SoilColumn column(profile);
  CHECK(column.layer_at(0.0) == 0);
  CHECK(column.layer_at(5.999) == 0);
  CHECK(column.layer_at(6.0) == 1);
  CHECK(column.layer_at(6.0 - 1e-9) == 1);  // round-off in a sum of thicknesses
  CHECK(column.layer_at(6.001) == 1);
  CHECK(column.layer_at(20.0) == 1);  // the base belongs to the last layer
  CHECK(column.depth() == 20.0);
  // σv = 18·6 + 20·2 = 148 kPa at 8 m (hand, no water).
  CHECK(column.effective_stress(8.0) == rel(148.0));
  CHECK_THROWS_AS(column.effective_stress(20.5), std::invalid_argument);
}

TEST_CASE("soil column: one unit weight serves both sides of the water table", "[soil]") {
  // The weights rule (soil.hpp). Water at 2 m; γ = 18 only. σv(5) = 18·5 = 90 kPa,
  // u = 9.81·3 = 29.43 kPa, σ'v = 60.57 kPa (hand).
  SoilProfile profile;
  profile.water_table = 2.0;
  profile.layers = {sand("sand", 10.0, 18.0, 32.0)};
  const SoilColumn column(profile);
  CHECK(column.total_stress(5.0) == rel(90.0));
  CHECK(column.effective_stress(5.0) == rel(60.57));
  REQUIRE(column.weight_substitutions(5.0).size() == 1);
  CHECK(column.weight_substitutions(5.0)[0] ==
        "layer 'sand': no saturated_unit_weight, unit_weight used below the water table");
  CHECK(column.weight_substitutions(1.0).empty());  // above the water, γ is the layer's own
}

// ---- A tip on a boundary, 1 mm above and 1 mm below -----------------------------------

TEST_CASE("soil column: capacity, spring, settlement and block agree on the tip layer and "
          "change smoothly across a boundary",
          "[soil][capacity][stiffness]") {
  const SoilProfile profile = clay_over_sand();
  const SoilColumn column(profile);
  struct Case {
    double length;
    const char* layer;
  };
  std::vector<double> tip, ultimate, spring;
  for (const Case c : {Case{5.999, "soft clay"}, Case{6.0, "dense sand"},
                       Case{6.001, "dense sand"}}) {
    CAPTURE(c.length);
    const Project project = one_pile_project(profile, c.length);
    const auto capacities = compute_capacities(project);
    REQUIRE(capacities.size() == 1);
    const CapacityResult& r = capacities[0].result;
    // The same tip layer everywhere: the column, the capacity, block failure and the
    // equivalent footing's bearing stratum.
    CHECK(column.layer(column.layer_at(c.length)).name == c.layer);
    CHECK(r.tip_details.layer == c.layer);
    const BlockCapacity block = block_capacity_clay(profile, {1.6, 1.6}, 0.0, c.length);
    CHECK(block.applies == (std::string(c.layer) == "soft clay"));
    EquivalentFootingOptions options;
    options.level = FootingLevel::bearing_stratum;
    const auto footing =
        equivalent_footing_settlement(profile, {1.6, 1.6}, 0.0, c.length, 1000.0, options);
    CHECK(contains(footing.notes.front(), std::string("'") + c.layer + "'"));

    const auto k = pile_type_stiffness(project, capacities);
    tip.push_back(r.tip);
    ultimate.push_back(r.ultimate_compression);
    spring.push_back(k[0].axial);
  }
  // Within 1 % of each other (the issue asks for a few percent; before the soil column, the
  // tip 1 mm into the sand took the sand's full resistance, +116 %, and a 6× stiffer spring).
  for (std::size_t i = 1; i < tip.size(); ++i) {
    CAPTURE(i);
    CHECK(tip[i] == Approx(tip[0]).epsilon(0.01));
    CHECK(ultimate[i] == Approx(ultimate[0]).epsilon(0.01));
    CHECK(spring[i] == Approx(spring[0]).epsilon(0.01));
  }
}

TEST_CASE("soil column: Es at the tip is the mean over 1.5 D above and below the tip",
          "[soil][stiffness]") {
  // Zone of influence of the tip: 1.5·D above and below (the LCPC method's zone, Bustamante
  // & Gianeselli 1982, from memory). D = 0.4 m → 0.6 m each side. Tip on the boundary at
  // 6 m: half in Es = 12 MPa, half in 60 MPa → 36 MPa; tip at 6.3 m: 0.3 m of 12 MPa and
  // 0.9 m of 60 MPa → (0.3·12 + 0.9·60)/1.2 = 48 MPa (hand).
  const SoilProfile profile = clay_over_sand();
  const auto on = vesic_pile(one_pile_project(profile, 6.0), 0);
  REQUIRE(on);
  CHECK(on->soil_modulus_tip == rel(36000.0));
  CHECK(on->soil_modulus_shaft == rel(12000.0));
  const auto below = vesic_pile(one_pile_project(profile, 6.3), 0);
  REQUIRE(below);
  CHECK(below->soil_modulus_tip == rel(48000.0));
  // μs: 0.3 where a layer gives none (common practice).
  CHECK(below->poisson_ratio == rel(0.3));
}

// ---- Meyerhof's (1976) transitions ------------------------------------------------------

TEST_CASE("capacity: the tip develops over 10 D into a stronger layer", "[capacity][published]") {
  // Source: Meyerhof (1976), "Bearing capacity and settlement of pile foundations", JGED
  // 102(GT3), the transition into a dense layer: qp = q0 + (q1 − q0)·Db/(10·D) ≤ q1
  // (from memory). Hand calculation: soft clay 0–6 m (γ 18, cu 40) over dense sand 6–20 m
  // (γ 20, φ 35°, N*q = 143 given), D = 0.4 m, tip at 8 m (Db = 2 m, 10·D = 4 m):
  //   q0 = 9·cu = 360 kPa (Meyerhof clay tip at the boundary)
  //   q1 = min(q'·N*q, 0.5·pa·N*q·tanφ) = min(148·143, 0.5·101.325·143·0.700208)
  //      = min(21164, 5072.82) = 5072.82 kPa
  //   qp = 360 + (5072.82 − 360)·2/4 = 2716.41 kPa
  SoilProfile profile;
  SoilLayer dense = sand("dense sand", 14.0, 20.0, 35.0);
  dense.meyerhof_nq = 143.0;
  profile.layers = {clay("soft clay", 6.0, 18.0, 40.0), dense};
  PileDesign design;
  design.tip_clay = design.tip_sand = TipMethod::meyerhof;
  const CapacityResult r = pile_capacity(profile, round_pile(0.4, 8.0), design);
  CHECK(*r.tip_details.layer_unit_tip == rel(5072.82));
  CHECK(r.tip_details.unit_tip == rel(2716.41));
  CHECK(*r.tip_details.penetration == rel(2.0));
  CHECK_FALSE(r.tip_details.limited);  // below the layer's limit, which no longer governs
  CHECK(contains(r.tip_details.transition, "Meyerhof 1976"));
  // On the boundary the tip is the clay's; at 10·D into the sand the sand's own value.
  CHECK(pile_capacity(profile, round_pile(0.4, 6.0), design).tip_details.unit_tip == rel(360.0));
  CHECK(pile_capacity(profile, round_pile(0.4, 10.0), design).tip_details.unit_tip ==
        rel(5072.82));

  SECTION("the depth table marks the rows a transition shapes") {
    const auto rows = capacity_with_depth(profile, round_pile(0.4, 8.0), design, 1.0, 5.0);
    for (const DepthRow& row : rows) {
      CAPTURE(row.length);
      const bool inside = row.tip_depth >= 6.0 && row.tip_depth < 10.0;
      CHECK(contains(row.note, "Db < 10·D") == inside);
    }
  }
}

TEST_CASE("capacity: a weaker layer within 10 D below the tip reduces it",
          "[capacity][published]") {
  // Source: Meyerhof (1976), JGED 102(GT3): for a tip at H < 10·D above a weak layer,
  // qp = q2 + (q1 − q2)·H/(10·D) (from memory). Hand calculation: dense sand 0–10 m (γ 20,
  // φ 35°, N*q = 143) over soft clay (cu 40), D = 0.4 m, tip at 8.5 m (H = 1.5 m):
  //   q1 = min(170·143, 5072.82) = 5072.82 kPa; q2 = 9·40 = 360 kPa
  //   qp = 360 + (5072.82 − 360)·1.5/4 = 2127.31 kPa
  SoilProfile profile;
  SoilLayer dense = sand("dense sand", 10.0, 20.0, 35.0);
  dense.meyerhof_nq = 143.0;
  profile.layers = {dense, clay("soft clay", 10.0, 18.0, 40.0)};
  PileDesign design;
  design.tip_clay = design.tip_sand = TipMethod::meyerhof;
  const CapacityResult r = pile_capacity(profile, round_pile(0.4, 8.5), design);
  CHECK(r.tip_details.unit_tip == rel(2127.31));
  CHECK(contains(r.tip_details.transition, "weaker layer 'soft clay'"));
  // 1 mm above the boundary: 360 + 4712.82·0.001/4 = 361.18 kPa; on it, the clay's 360 kPa.
  CHECK(pile_capacity(profile, round_pile(0.4, 9.999), design).tip_details.unit_tip ==
        rel(361.18));
  CHECK(pile_capacity(profile, round_pile(0.4, 10.0), design).tip_details.unit_tip == rel(360.0));
}

TEST_CASE("capacity: Meyerhof's SPT tip is the transition from the layer above",
          "[capacity][published]") {
  // Source: Meyerhof (1976): qp = 0.4·pa·N60·Db/D ≤ 4·pa·N60 in a homogeneous sand, i.e. the
  // 10·D development from q0 = 0. With a layer above that has a tip method, from its value:
  // clay cu 30 over sand N60 20, D = 0.4 m, tip 2 m into the sand:
  //   q0 = 9·30 = 270 kPa; q1 = 4·101.325·20 = 8106 kPa; qp = 270 + 7836·0.5 = 4188 kPa.
  SoilProfile profile;
  SoilLayer bearing = sand("sand", 10.0, 19.0, 34.0);
  bearing.spt_n60 = 20.0;
  profile.layers = {clay("clay", 5.0, 17.0, 30.0), bearing};
  PileDesign design;
  design.tip_sand = TipMethod::meyerhof_spt;
  design.tip_clay = TipMethod::meyerhof;
  CHECK(pile_capacity(profile, round_pile(0.4, 7.0), design).tip_details.unit_tip == rel(4188.0));
  // 10·D or more into the sand: the limit 4·pa·N60 governs and is named.
  const CapacityResult deep = pile_capacity(profile, round_pile(0.4, 9.5), design);
  CHECK(deep.tip_details.unit_tip == rel(8106.0));
  CHECK(deep.tip_details.governed_by == "Meyerhof (1976) limit 4·pa·N60");
}

// ---- Default limits ---------------------------------------------------------------------

TEST_CASE("capacity: default limits on Vesic's tip and the beta shaft apply and are printed",
          "[capacity][published]") {
  // Sand φ' = 36°, γ = 19, no water, D = 0.4 m, L = 27 m: Vesić's tip alone would exceed
  // 15 MPa and the β shaft (K = 1, δ = 30°) reaches 19·27·tan30° = 296 kPa at the tip.
  SoilLayer layer = sand("sand", 30.0, 19.0, 36.0);
  layer.soil_modulus = 80000.0;
  layer.shaft_k = 1.0;
  layer.shaft_delta = 30.0;
  SoilProfile profile;
  profile.layers = {layer};
  Project project = one_pile_project(profile, 27.0);
  project.pile_types[0].design.tip_sand = TipMethod::vesic;
  const auto capacities = compute_capacities(project);
  const CapacityResult& r = capacities.at(0).result;
  // Source: Meyerhof (1976) limiting unit tip ql = 0.5·pa·N*q·tanφ, N*q(36°) = 168 from his
  // chart as tabulated (from memory): 0.5·101.325·168·tan36° = 6183.9 kPa.
  CHECK(r.tip_details.limited);
  CHECK(r.tip_details.limit_default);
  CHECK(r.tip_details.unit_tip == rel(6183.9));
  CHECK(r.tip_details.governed_by == "default: Meyerhof (1976) limit 0.5·pa·N*q·tanφ");
  // Source: Meyerhof (1976) limiting unit shaft friction of driven piles in sand, 1 tsf =
  // 95.76 kPa (from memory), the default for β.
  REQUIRE(r.layers.size() == 1);
  CHECK(r.layers[0].limited);
  CHECK(r.layers[0].limit_default);
  CHECK(*r.layers[0].limit == rel(95.76));
  // Printed: the breakdown names the limit that governed, in text and JSON; check's notes too.
  const std::string text = render_capacities(project, capacities, Format::text, "");
  CHECK(contains(text, "(limited by default: Meyerhof (1976) limit 0.5·pa·N*q·tanφ)"));
  CHECK(contains(text, "Shaft limit in 'sand': unit friction ≤ 95.8 kPa (default: Meyerhof "
                       "(1976) limit 1 tsf for driven piles in sand, from memory); governed"));
  const auto json = capacities_json(project, capacities, "");
  CHECK(json["pile_types"][0]["tip_details"]["governed_by"] ==
        "default: Meyerhof (1976) limit 0.5·pa·N*q·tanφ");
  CHECK(json["pile_types"][0]["layers"][0]["limit_default"] == true);
  const auto resistances = computed_resistances(project, capacities);
  CHECK(contains(resistances[0]->method, "limits that governed: unit tip in layer 'sand' "
                                         "limited to 6184 kPa"));

  SECTION("max_unit_tip and max_unit_shaft override the defaults, with the reason quoted") {
    project.soil->layers[0].max_unit_tip = 12000.0;
    project.soil->layers[0].max_unit_tip_reason = "load tests on site";
    project.soil->layers[0].max_unit_shaft = 120.0;
    const auto over = compute_capacities(project);
    const CapacityResult& o = over.at(0).result;
    CHECK(o.tip_details.unit_tip == rel(12000.0));
    CHECK(o.tip_details.governed_by == "max_unit_tip given, reason: 'load tests on site'");
    CHECK(*o.layers[0].limit == rel(120.0));
    CHECK(o.layers[0].limit_source == "max_unit_shaft given, no reason stated");
    CHECK(contains(render_capacities(project, over, Format::text, ""), "load tests on site"));
  }
}

TEST_CASE("capacity: the drilled-shaft methods keep O'Neill & Reese's own limits",
          "[capacity][published]") {
  // Source: O'Neill & Reese (1999), FHWA-IF-99-025: sand tip 0.6·N60 tsf ≤ 30 tsf
  // (2872.8 kPa, from memory); N60 = 55 gives 33 tsf, so the limit governs.
  SoilLayer layer = sand("sand", 20.0, 19.0, 36.0);
  layer.spt_n60 = 55.0;
  SoilProfile profile;
  profile.layers = {layer};
  PileDesign design;
  design.installation = Installation::bored;
  design.tip_sand = TipMethod::fhwa;
  const CapacityResult r = pile_capacity(profile, round_pile(1.0, 15.0), design);
  CHECK(r.tip_details.unit_tip == rel(2872.8));
  CHECK(r.tip_details.governed_by == "O'Neill & Reese (1999) limit 30 tsf");
  CHECK_FALSE(r.tip_details.limit_default);
}
