// Tests for methods.hpp: the tables of tip, shaft and efficiency methods are complete and
// are what the input reader, the capacity code and the group code read.
#include <catch2/catch.hpp>

#include <set>
#include <string>

#include "cairn/geotechnics/capacity.hpp"
#include "cairn/geotechnics/group.hpp"
#include "cairn/geotechnics/methods.hpp"
#include "support.hpp"

using namespace cairn;

TEST_CASE("methods: one row per method, each name unique and found again", "[methods]") {
  std::set<std::string> names;
  for (const auto& row : tip_methods()) {
    CHECK(names.insert(row.name).second);
    CHECK(find_tip_method(row.name) == row.method);
    CHECK(std::string(to_string(row.method)) == row.name);
    CHECK(&method_info(row.method) == &row);
    CHECK((row.clay || row.sand));
    if (row.clay) CHECK(std::string(row.formula_clay).rfind("q_p = ", 0) == 0);
    if (row.sand) CHECK(std::string(row.formula_sand).rfind("q_p = ", 0) == 0);
  }
  CHECK(tip_methods().size() == 4);
  names.clear();
  for (const auto& row : shaft_methods()) {
    CHECK(names.insert(row.name).second);
    CHECK(find_shaft_method(row.name) == row.method);
    CHECK(std::string(to_string(row.method)) == row.name);
    CHECK((row.clay || row.sand));
    CHECK(std::string(row.formula).rfind("f = ", 0) == 0);
  }
  CHECK(shaft_methods().size() == 6);
  names.clear();
  for (const auto& row : efficiency_methods()) {
    CHECK(names.insert(row.name).second);
    CHECK(efficiency_method_from_string(row.name) == row.method);
    CHECK(std::string(to_string(row.method)) == row.name);
  }
  CHECK(efficiency_method_names() == std::vector<std::string>{"none", "converse-labarre",
                                                              "los-angeles", "feld",
                                                              "block-perimeter"});
  CHECK_FALSE(find_tip_method("Vesic"));
  CHECK_FALSE(find_shaft_method(""));
  CHECK_FALSE(find_efficiency_method("converse labarre"));
}

TEST_CASE("methods: the input's choices and the capacity code's names are the table's",
          "[methods]") {
  CHECK(tip_method_choices().size() == tip_methods().size());
  CHECK(shaft_method_choices().size() == shaft_methods().size());
  CHECK(tip_method_names() ==
        std::vector<std::string>{"vesic", "meyerhof", "meyerhof-spt", "fhwa"});
  CHECK(shaft_method_names() == std::vector<std::string>{"beta", "alpha-api", "alpha-fhwa",
                                                         "lambda", "beta-fhwa", "meyerhof-spt"});
  for (const auto& row : shaft_methods()) {
    CHECK(applies_to(row.method, SoilKind::clay) == row.clay);
    CHECK(applies_to(row.method, SoilKind::sand) == row.sand);
  }
  // meyerhof-spt is an SPT method for sand (Meyerhof 1976); alpha methods are for clay
  // (API RP 2GEO; O'Neill & Reese 1999).
  CHECK_FALSE(applies_to(TipMethod::meyerhof_spt, SoilKind::clay));
  CHECK_FALSE(applies_to(ShaftMethod::alpha_api, SoilKind::sand));
}

TEST_CASE("methods: default resistance factors read from the table", "[methods]") {
  // AASHTO LRFD Table 10.5.5.2.3-1 (driven piles), from memory: SPT tip 0.30, α shaft 0.35
  // in compression and 0.25 in tension.
  CHECK(aashto_phi_tip(TipMethod::meyerhof_spt, SoilKind::sand, Installation::driven) == 0.30);
  CHECK(aashto_phi_shaft(ShaftMethod::alpha_api, SoilKind::clay, Installation::driven) == 0.35);
  CHECK(aashto_phi_uplift(ShaftMethod::alpha_api, SoilKind::clay, Installation::driven) == 0.25);
  // AASHTO LRFD Table 10.5.5.2.4-1 (drilled shafts), from memory: tip in sand 0.50, side in
  // clay 0.45, side in tension in sand 0.45.
  CHECK(aashto_phi_tip(TipMethod::fhwa, SoilKind::sand, Installation::bored) == 0.50);
  CHECK(aashto_phi_shaft(ShaftMethod::alpha_fhwa, SoilKind::clay, Installation::bored) == 0.45);
  CHECK(aashto_phi_uplift(ShaftMethod::beta_fhwa, SoilKind::sand, Installation::bored) == 0.45);
  // Only O'Neill & Reese's (1999) methods are calibrated for drilled shafts.
  for (const auto& row : tip_methods())
    CHECK(aashto_calibrated(row.method, Installation::bored) == (row.method == TipMethod::fhwa));
  for (const auto& row : shaft_methods())
    CHECK(aashto_calibrated(row.method, Installation::bored) ==
          (row.method == ShaftMethod::alpha_fhwa || row.method == ShaftMethod::beta_fhwa));
}

TEST_CASE("methods: what a method needs is asked of the layer", "[methods]") {
  SoilProfile profile;
  SoilLayer sand;
  sand.name = "sand";
  sand.kind = SoilKind::sand;
  sand.thickness = 20.0;
  sand.unit_weight = 19.0;
  sand.friction_angle = 32.0;
  profile.layers.push_back(sand);
  PileGeometry pile;
  pile.width = 0.5;
  pile.length = 10.0;
  PileDesign design;
  design.tip_sand = TipMethod::vesic;
  design.shaft_sand = ShaftMethod::beta;
  const auto problems = validate_design(profile, pile, design);
  // Every value the rows list, in the table's order.
  CHECK(problems == std::vector<std::string>{"layer 'sand': method 'vesic' needs soil_modulus",
                                             "layer 'sand': method 'beta' needs shaft_k",
                                             "layer 'sand': method 'beta' needs shaft_delta"});
}

TEST_CASE("methods: 1 tsf in kPa", "[methods][published]") {
  // NIST SP 811 (2008), Appendix B: 1 lbf = 4.4482216152605 N, 1 ft = 0.3048 m, so
  // 1 tsf = 2000 lbf/ft² = 95.760518 kPa.
  CHECK(kTsf == Approx(95.760518).epsilon(1e-8));
}

TEST_CASE("methods: the capacity result names its methods and the values it used", "[methods]") {
  SoilLayer clay;
  clay.name = "clay";
  clay.kind = SoilKind::clay;
  clay.thickness = 10.0;
  clay.unit_weight = 18.0;
  clay.undrained_strength = 50.0;
  clay.lambda = 0.2;
  SoilLayer sand;
  sand.name = "sand";
  sand.kind = SoilKind::sand;
  sand.thickness = 20.0;
  sand.unit_weight = 19.0;
  sand.friction_angle = 34.0;
  sand.spt_n60 = 25.0;
  SoilProfile profile;
  profile.layers = {clay, sand};
  PileDesign design;
  design.tip_sand = TipMethod::meyerhof_spt;
  design.shaft_clay = ShaftMethod::lambda;
  design.shaft_sand = ShaftMethod::meyerhof_spt;
  const CapacityResult r = pile_capacity(profile, cairn::test::round_pile(0.5, 20.0), design);
  const TipDetails& t = r.tip_details;
  CHECK(t.tip_method == TipMethod::meyerhof_spt);
  CHECK(t.method == method_info(TipMethod::meyerhof_spt).name);
  // The bearing layer's own values, as given.
  CHECK(t.friction_angle == 34.0);
  CHECK(t.spt_n60 == 25.0);
  CHECK_FALSE(t.undrained_strength);
  REQUIRE(r.layers.size() == 2);
  CHECK(r.layers[0].shaft_method == ShaftMethod::lambda);
  CHECK(r.layers[0].lambda == 0.2);  // given in the layer
  CHECK(r.layers[1].shaft_method == ShaftMethod::meyerhof_spt);
  CHECK_FALSE(r.layers[1].lambda);
}
