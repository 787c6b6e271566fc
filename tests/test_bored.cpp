// Tests of bored (drilled) piles computed with methods derived for driven piles: Meyerhof's
// (1976) reduction of the sand tip, the base held to its resistance at a settlement of about
// 5 % of the base width for wide bases (O'Neill & Reese 1999), and resistance factors from
// the AASHTO table that holds the method. Tag [capacity].
#include <catch2/catch.hpp>
#include <string>

#include "cairn/geotechnics/capacity.hpp"
#include "cairn/core/units.hpp"
#include "support.hpp"

using namespace cairn;
using cairn::test::contains;
using cairn::test::round_pile;

namespace {

constexpr double kPa = kAtmosphericPressure;

SoilProfile uniform_sand() {
  SoilLayer layer;
  layer.name = "sand";
  layer.kind = SoilKind::sand;
  layer.thickness = 20.0;
  layer.unit_weight = 18.0;
  layer.saturated_unit_weight = 20.0;
  layer.friction_angle = 34.0;
  layer.soil_modulus = 40000.0;
  layer.shaft_k = 1.0;
  layer.shaft_delta = 25.0;
  layer.spt_n60 = 20.0;
  SoilProfile profile;
  profile.layers = {layer};
  return profile;
}

SoilProfile uniform_clay() {
  SoilLayer layer;
  layer.name = "clay";
  layer.kind = SoilKind::clay;
  layer.thickness = 20.0;
  layer.unit_weight = 18.0;
  layer.saturated_unit_weight = 18.0;
  layer.undrained_strength = 100.0;
  SoilProfile profile;
  profile.layers = {layer};
  return profile;
}

PileDesign design(Installation installation, TipMethod tip, ShaftMethod shaft) {
  PileDesign d;
  d.installation = installation;
  d.tip_sand = tip;
  d.tip_clay = TipMethod::meyerhof;
  d.shaft_sand = shaft;
  return d;
}

}  // namespace

TEST_CASE("bored: a driven-pile sand tip on a bored pile is one third of the driven value",
          "[capacity][published]") {
  const SoilProfile soil = uniform_sand();
  const PileGeometry pile = round_pile(0.5, 3.0);
  const auto driven = pile_capacity(soil, pile, design(Installation::driven,
                                                       TipMethod::meyerhof_spt, ShaftMethod::beta));
  const auto bored = pile_capacity(soil, pile, design(Installation::bored,
                                                      TipMethod::meyerhof_spt, ShaftMethod::beta));
  // Meyerhof (1976), SPT tip: qp = 0.4·pa·N60·Db/D = 0.4·101.325·20·3/0.5 = 4863.6 kPa
  // (≤ 4·pa·N60 = 8106 kPa) for the driven pile; a bored pile's unit tip in sand is about 1/3
  // of it (Meyerhof 1976, from memory): 1621.2 kPa.
  CHECK(driven.tip_details.unit_tip == Approx(0.4 * kPa * 20.0 * 3.0 / 0.5).epsilon(1e-9));
  CHECK(bored.tip_details.unit_tip == Approx(0.4 * kPa * 20.0 * 3.0 / 0.5 / 3.0).epsilon(1e-9));
  REQUIRE(bored.tip_details.bored_factor);
  CHECK(*bored.tip_details.bored_factor == Approx(1.0 / 3.0));
  CHECK_FALSE(driven.tip_details.bored_factor);
  CHECK(contains(bored.notes, "taken as 1/3 of the driven value (Meyerhof 1976"));

  SECTION("the Vesic and Meyerhof tips are reduced alike") {
    for (TipMethod tip : {TipMethod::vesic, TipMethod::meyerhof}) {
      CAPTURE(to_string(tip));
      const auto d = pile_capacity(soil, pile, design(Installation::driven, tip, ShaftMethod::beta));
      const auto b = pile_capacity(soil, pile, design(Installation::bored, tip, ShaftMethod::beta));
      CHECK(b.tip == Approx(d.tip / 3.0).epsilon(1e-9));  // Meyerhof (1976), from memory
    }
  }
}

TEST_CASE("bored: a wide base is held to its resistance at 5 % of a 1.27 m base",
          "[capacity][published]") {
  // O'Neill & Reese (1999), FHWA-IF-99-025: base resistance at a settlement of 5 % of the base
  // width; for Bb > 1.27 m (50 in) qp × 1.27/Bb (from memory). D = 1.5 m: 0.84667.
  // Driven value (Meyerhof 1976 SPT tip): 0.4·pa·20·3/1.5 = 1621.2 kPa; bored:
  // 1621.2/3 × 1.27/1.5 = 457.56 kPa.
  const SoilProfile soil = uniform_sand();
  const PileGeometry pile = round_pile(1.5, 3.0);
  const auto bored = pile_capacity(soil, pile, design(Installation::bored,
                                                      TipMethod::meyerhof_spt, ShaftMethod::beta));
  CHECK(bored.tip_details.unit_tip ==
        Approx(0.4 * kPa * 20.0 * 3.0 / 1.5 / 3.0 * 1.27 / 1.5).epsilon(1e-9));
  REQUIRE(bored.tip_details.reduction);
  CHECK(*bored.tip_details.reduction == Approx(1.27 / 1.5));
}

TEST_CASE("bored: drilled-shaft methods and clay tips are not reduced again", "[capacity]") {
  SECTION("fhwa sand tip on a bored pile: O'Neill & Reese's own value") {
    // O'Neill & Reese (1999): qp = 0.6·N60 tsf = 12 tsf = 1149.1 kPa (from memory).
    const auto r = pile_capacity(uniform_sand(), round_pile(0.9, 10.0),
                                 design(Installation::bored, TipMethod::fhwa, ShaftMethod::beta_fhwa));
    CHECK_FALSE(r.tip_details.bored_factor);
    CHECK(r.tip_details.unit_tip == Approx(oneill_reese_sand_tip(20.0)).epsilon(1e-9));
  }
  SECTION("clay tip 9cu on a bored pile") {
    // Meyerhof (1976) / Skempton (1951): qp = 9·cu = 900 kPa, bored or driven.
    PileDesign d = design(Installation::bored, TipMethod::meyerhof, ShaftMethod::beta);
    d.shaft_clay = ShaftMethod::alpha_fhwa;
    const auto r = pile_capacity(uniform_clay(), round_pile(0.9, 10.0), d);
    CHECK_FALSE(r.tip_details.bored_factor);
    CHECK(r.tip_details.unit_tip == Approx(900.0));
  }
}

TEST_CASE("bored: resistance factors come from the table that holds the method",
          "[capacity][published]") {
  // AASHTO LRFD Bridge Design Specifications, Table 10.5.5.2.4-1 (drilled shafts, O'Neill &
  // Reese 1999 methods): side clay 0.45, tip clay 0.40, side sand 0.55, tip sand 0.50, uplift
  // clay 0.35, sand 0.45. Table 10.5.5.2.3-1 (driven piles): β 0.25 (uplift 0.20), α 0.35,
  // SPT 0.30, Nordlund/Thurman static analysis 0.45. All from memory.
  const auto bored = Installation::bored;
  const auto driven = Installation::driven;
  CHECK(aashto_phi_tip(TipMethod::fhwa, SoilKind::sand, bored) == 0.50);
  CHECK(aashto_phi_tip(TipMethod::fhwa, SoilKind::clay, bored) == 0.40);
  CHECK(aashto_phi_shaft(ShaftMethod::beta_fhwa, SoilKind::sand, bored) == 0.55);
  CHECK(aashto_phi_shaft(ShaftMethod::alpha_fhwa, SoilKind::clay, bored) == 0.45);
  CHECK(aashto_phi_uplift(ShaftMethod::beta_fhwa, SoilKind::sand, bored) == 0.45);
  CHECK(aashto_phi_uplift(ShaftMethod::alpha_fhwa, SoilKind::clay, bored) == 0.35);
  // Driven-pile methods on a bored pile take the driven table's row for the method.
  CHECK(aashto_phi_tip(TipMethod::vesic, SoilKind::sand, bored) == 0.45);
  CHECK(aashto_phi_tip(TipMethod::meyerhof_spt, SoilKind::sand, bored) == 0.30);
  CHECK(aashto_phi_shaft(ShaftMethod::beta, SoilKind::sand, bored) == 0.25);
  CHECK(aashto_phi_uplift(ShaftMethod::beta, SoilKind::sand, bored) == 0.20);
  CHECK(aashto_phi_shaft(ShaftMethod::alpha_api, SoilKind::clay, bored) == 0.35);
  // Unchanged for driven piles.
  CHECK(aashto_phi_tip(TipMethod::vesic, SoilKind::sand, driven) == 0.45);
  CHECK(aashto_phi_shaft(ShaftMethod::beta, SoilKind::sand, driven) == 0.25);
  CHECK(aashto_calibrated(TipMethod::fhwa, bored));
  CHECK_FALSE(aashto_calibrated(TipMethod::vesic, bored));
  CHECK_FALSE(aashto_calibrated(ShaftMethod::beta_fhwa, driven));
}

TEST_CASE("bored: cautions where a method or its factor belongs to the other installation",
          "[capacity]") {
  SECTION("bored pile, driven-pile methods, default factors") {
    const auto cautions =
        installation_cautions(design(Installation::bored, TipMethod::vesic, ShaftMethod::beta));
    REQUIRE(cautions.size() == 3);  // tip clay (meyerhof), tip sand (vesic), shaft sand (beta)
    CHECK(cautions[1] ==
          "tip method 'vesic' (sand) on a bored pile: the method was developed for driven "
          "piles; its unit tip is taken as 1/3 of the driven value (Meyerhof 1976); its default "
          "resistance factor comes from AASHTO LRFD Table 10.5.5.2.3-1 (driven piles), "
          "calibrated on driven piles, not for this installation; give the resistance factor "
          "from a load test or local calibration");
  }
  SECTION("resistance factors given: the method is still named, the factor is not") {
    PileDesign d = design(Installation::bored, TipMethod::vesic, ShaftMethod::beta);
    d.phi_tip = 0.4;
    d.phi_shaft = 0.4;
    d.phi_uplift = 0.3;
    const auto cautions = installation_cautions(d);
    REQUIRE(cautions.size() == 3);
    CHECK_FALSE(contains(cautions, "resistance factor"));
  }
  SECTION("bored pile with O'Neill & Reese's methods: nothing to say") {
    PileDesign d = design(Installation::bored, TipMethod::fhwa, ShaftMethod::beta_fhwa);
    d.tip_clay = TipMethod::fhwa;
    d.shaft_clay = ShaftMethod::alpha_fhwa;
    CHECK(installation_cautions(d).empty());
  }
  SECTION("driven pile with a drilled-shaft method") {
    const auto cautions = installation_cautions(
        design(Installation::driven, TipMethod::meyerhof, ShaftMethod::beta_fhwa));
    REQUIRE(cautions.size() == 1);
    CHECK(cautions[0].starts_with("shaft method 'beta-fhwa' (sand) on a driven pile: the method "
                                  "was developed for bored (drilled-shaft) piles"));
  }
}
