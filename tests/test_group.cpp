// Tests for group.hpp: layout, efficiency, block failure, uplift, settlement, stiffness.
// Published values are cited beside each check: each assertion names the underlying
// source (author, year, equation). Tolerances: the computed values are rounded to 4–5
// significant figures, so relative 1e-3 unless said otherwise.
#include <catch2/catch.hpp>

#include <cmath>
#include <numbers>
#include <stdexcept>
#include <string>

#include "cairn/geotechnics/group.hpp"

namespace {

using cairn::PilePlan;

// Piles on a rows × columns grid centred on the origin, ids "P1", "P2", … row by row.
std::vector<PilePlan> grid_piles(int rows, int columns, double spacing_x, double spacing_y,
                                 double width, bool round = true) {
  std::vector<PilePlan> piles;
  for (int i = 0; i < rows; ++i)
    for (int j = 0; j < columns; ++j)
      piles.push_back({"P" + std::to_string(piles.size() + 1),
                       (j - 0.5 * (columns - 1)) * spacing_x, (i - 0.5 * (rows - 1)) * spacing_y,
                       width, round});
  return piles;
}

double efficiency(cairn::EfficiencyMethod method, const std::vector<PilePlan>& piles) {
  const cairn::Efficiency e = cairn::group_efficiency(method, piles);
  REQUIRE(e.value.has_value());
  return *e.value;
}

cairn::SoilLayer clay(const std::string& name, double thickness, double cu) {
  cairn::SoilLayer layer;
  layer.name = name;
  layer.kind = cairn::SoilKind::clay;
  layer.thickness = thickness;
  layer.undrained_strength = cu;
  layer.unit_weight = 18.0;
  layer.saturated_unit_weight = 19.0;
  return layer;
}

cairn::SoilLayer sand(const std::string& name, double thickness, double phi) {
  cairn::SoilLayer layer;
  layer.name = name;
  layer.kind = cairn::SoilKind::sand;
  layer.thickness = thickness;
  layer.friction_angle = phi;
  layer.unit_weight = 18.0;
  layer.saturated_unit_weight = 20.0;
  return layer;
}

constexpr double kPi = std::numbers::pi;

}  // namespace

// ---- layout -------------------------------------------------------------------------------

TEST_CASE("group: a full rectangular grid is detected with its rows, columns and spacings",
          "[group]") {
  SECTION("3 × 3 at 1.2 m") {
    const cairn::GridLayout grid = cairn::detect_grid(grid_piles(3, 3, 1.2, 1.2, 0.4));
    CHECK(grid.regular);
    CHECK(grid.rows == 3);
    CHECK(grid.columns == 3);
    CHECK(grid.spacing_x == Approx(1.2).margin(1e-9));
    CHECK(grid.spacing_y == Approx(1.2).margin(1e-9));
  }
  SECTION("2 rows × 4 columns, 1.5 m along x and 1.2 m along y") {
    const cairn::GridLayout grid = cairn::detect_grid(grid_piles(2, 4, 1.5, 1.2, 0.4));
    CHECK(grid.regular);
    CHECK(grid.rows == 2);
    CHECK(grid.columns == 4);
    CHECK(grid.spacing_x == Approx(1.5).margin(1e-9));
    CHECK(grid.spacing_y == Approx(1.2).margin(1e-9));
  }
  SECTION("positions off by 5 mm stay within the 10 mm tolerance") {
    auto piles = grid_piles(3, 3, 1.2, 1.2, 0.4);
    piles[4].x += 0.005;
    piles[8].y -= 0.004;
    CHECK(cairn::detect_grid(piles).regular);
  }
  SECTION("a single pile and a single row are grids") {
    const auto one = cairn::detect_grid(grid_piles(1, 1, 0.0, 0.0, 0.4));
    CHECK(one.regular);
    CHECK(one.rows * one.columns == 1);
    const auto row = cairn::detect_grid(grid_piles(1, 3, 1.2, 0.0, 0.4));
    CHECK(row.regular);
    CHECK(row.columns == 3);
    CHECK(row.spacing_y == 0.0);
  }
}

TEST_CASE("group: irregular layouts are reported with the reason", "[group]") {
  SECTION("a 3 × 3 grid with one pile left out") {
    auto piles = grid_piles(3, 3, 1.2, 1.2, 0.4);
    piles.erase(piles.begin() + 4);
    const auto grid = cairn::detect_grid(piles);
    CHECK_FALSE(grid.regular);
    CHECK(grid.reason == "8 piles do not fill the 3 × 3 crossings of their rows and columns");
  }
  SECTION("uneven spacing") {
    std::vector<PilePlan> piles{{"A", 0.0, 0.0, 0.4, true}, {"B", 1.2, 0.0, 0.4, true},
                                {"C", 2.7, 0.0, 0.4, true}};
    const auto grid = cairn::detect_grid(piles);
    CHECK_FALSE(grid.regular);
    CHECK(grid.reason == "spacing along x is not uniform (1.200 m to 1.500 m)");
  }
  SECTION("two piles on one point") {
    std::vector<PilePlan> piles{{"A", 0.0, 0.0, 0.4, true}, {"B", 0.0, 0.0, 0.4, true}};
    const auto grid = cairn::detect_grid(piles);
    CHECK_FALSE(grid.regular);
    CHECK(grid.reason == "2 piles do not fill the 1 × 1 crossings of their rows and columns");
  }
  SECTION("grid-based efficiencies do not apply; η = 1 still does") {
    auto piles = grid_piles(3, 3, 1.2, 1.2, 0.4);
    piles.erase(piles.begin() + 4);
    const cairn::EfficiencySummary all = cairn::all_efficiencies(piles);
    REQUIRE(all.all.size() == 5);
    CHECK(all.all[0].value == 1.0);
    for (std::size_t k = 1; k < all.all.size(); ++k) {
      CAPTURE(cairn::to_string(all.all[k].method));
      CHECK_FALSE(all.all[k].value.has_value());
      CHECK(all.all[k].note.rfind("does not apply: irregular layout (8 piles", 0) == 0);
    }
  }
}

TEST_CASE("group: minimum spacing check names the offending pairs", "[group][published]") {
  const auto piles = grid_piles(3, 3, 1.2, 1.2, 0.4);
  // Source: 2.5 × width, common practice (AASHTO LRFD 10.7.1.2, from
  // memory). s = 1.2 m ≥ 2.5 × 0.4 = 1.0 m: no violation.
  const cairn::SpacingCheck ok = cairn::check_spacing(piles);
  CHECK(ok.violations.empty());
  CHECK(ok.smallest == Approx(1.2).margin(1e-9));
  // A factor of 3.5 asks for 1.4 m: the 12 orthogonal neighbour pairs (at 1.2 m) fail, the
  // diagonals (1.697 m) pass.
  const cairn::SpacingCheck tight = cairn::check_spacing(piles, 3.5);
  CHECK(tight.violations.size() == 12);
  CHECK(tight.violations.front().first == "P1");
  CHECK(tight.violations.front().second == "P2");
  CHECK(tight.violations.front().required == Approx(1.4).margin(1e-9));
  // Source: AASHTO LRFD 10.7.1.2 absolute minimum 750 mm for driven piles (from memory):
  // 0.25 m piles at 0.70 m pass 2.5D = 0.625 m but fail 0.75 m.
  const auto small = grid_piles(1, 2, 0.70, 0.0, 0.25);
  CHECK(cairn::check_spacing(small).violations.empty());
  const auto absolute = cairn::check_spacing(small, 2.5, 0.75);
  REQUIRE(absolute.violations.size() == 1);
  CHECK(absolute.violations[0].distance == Approx(0.70).margin(1e-9));
}

TEST_CASE("group: edge distance from the pile face to the cap outline", "[group][published]") {
  const std::vector<cairn::PlanPoint> square_cap{{-2.1, -2.1}, {2.1, -2.1}, {2.1, 2.1}, {-2.1, 2.1}};
  SECTION("rectangle, round and square piles; the default minimum is 225 mm") {
    // Source: AASHTO LRFD 10.7.1.2, 225 mm from the side of the pile (from memory).
    // Geometry by hand: pile at 1.2 m, edge at 2.1 m, half width 0.2 m.
    auto piles = grid_piles(3, 3, 1.2, 1.2, 0.4);
    piles.push_back({"Q", 1.8, 0.6, 0.4, true});  // face 0.1 m from the edge x = 2.1
    const cairn::EdgeCheck check = cairn::check_edge_distance(piles, square_cap);
    CHECK(check.minimum == Approx(0.225));
    CHECK(check.piles[0].distance == Approx(0.7).margin(1e-9));
    CHECK(check.piles[9].distance == Approx(0.1).margin(1e-9));
    REQUIRE(check.offenders.size() == 1);
    CHECK(check.offenders[0] == "Q");
    const auto squares = cairn::check_edge_distance(grid_piles(3, 3, 1.2, 1.2, 0.4, false), square_cap);
    CHECK(squares.piles[8].distance == Approx(0.7).margin(1e-9));
    CHECK(squares.offenders.empty());
  }
  SECTION("L-shaped cap: the re-entrant corner governs, measured exactly") {
    const std::vector<cairn::PlanPoint> l_cap{{0, 0}, {4, 0}, {4, 2}, {2, 2}, {2, 4}, {0, 4}};
    // Square pile 0.4 m at (1.5, 1.5): corner (1.7, 1.7) to the re-entrant corner (2, 2) is
    // 0.3·√2 = 0.42426 m (by hand); a round pile: √(0.5² + 0.5²) − 0.2 = 0.50711 m.
    const auto square = cairn::check_edge_distance({{"S", 1.5, 1.5, 0.4, false}}, l_cap);
    CHECK(square.piles[0].distance == Approx(0.3 * std::sqrt(2.0)).epsilon(1e-9));
    const auto round = cairn::check_edge_distance({{"R", 1.5, 1.5, 0.4, true}}, l_cap);
    CHECK(round.piles[0].distance == Approx(std::sqrt(0.5) - 0.2).epsilon(1e-9));
  }
  SECTION("a square pile crossing the edge has a negative distance") {
    const auto check = cairn::check_edge_distance({{"X", 2.0, 0.0, 0.4, false}}, square_cap);
    CHECK(check.piles[0].distance == Approx(-0.1).margin(1e-9));
    CHECK_FALSE(check.piles[0].ok);
  }
  SECTION("a pile outside the outline is refused, by name") {
    REQUIRE_THROWS_WITH(cairn::check_edge_distance({{"Z", 3.0, 0.0, 0.4, true}}, square_cap),
                        "pile 'Z' at (3.000, 0.000) lies outside the cap outline");
  }
}

// ---- efficiency ---------------------------------------------------------------------------

TEST_CASE("group: Converse-Labarre efficiency for several grids", "[group][published]") {
  using cairn::EfficiencyMethod;
  const auto cl = EfficiencyMethod::converse_labarre;
  // Source: Converse–Labarre formula (from memory); values computed
  // from it. D = 0.4 m, s = 2.5D / 3D / 4D.
  CHECK(efficiency(cl, grid_piles(3, 3, 1.0, 1.0, 0.4)) == Approx(0.6770).epsilon(1e-3));
  CHECK(efficiency(cl, grid_piles(3, 3, 1.2, 1.2, 0.4)) == Approx(0.7269).epsilon(1e-3));
  CHECK(efficiency(cl, grid_piles(3, 3, 1.6, 1.6, 0.4)) == Approx(0.7921).epsilon(1e-3));
  CHECK(efficiency(cl, grid_piles(2, 4, 1.0, 1.0, 0.4)) == Approx(0.6972).epsilon(1e-3));
  CHECK(efficiency(cl, grid_piles(2, 4, 1.2, 1.2, 0.4)) == Approx(0.7440).epsilon(1e-3));
  CHECK(efficiency(cl, grid_piles(2, 4, 1.6, 1.6, 0.4)) == Approx(0.8051).epsilon(1e-3));
  CHECK(efficiency(cl, grid_piles(2, 2, 1.2, 1.2, 0.4)) == Approx(0.7952).epsilon(1e-3));
  CHECK(efficiency(cl, grid_piles(4, 4, 1.2, 1.2, 0.4)) == Approx(0.6928).epsilon(1e-3));
}

TEST_CASE("group: Los Angeles efficiency for several grids", "[group][published]") {
  const auto la = cairn::EfficiencyMethod::los_angeles;
  // Source: Los Angeles Group Action formula (from memory), computed.
  CHECK(efficiency(la, grid_piles(3, 3, 1.0, 1.0, 0.4)) == Approx(0.7502).epsilon(1e-3));
  CHECK(efficiency(la, grid_piles(3, 3, 1.2, 1.2, 0.4)) == Approx(0.7918).epsilon(1e-3));
  CHECK(efficiency(la, grid_piles(3, 3, 1.6, 1.6, 0.4)) == Approx(0.8439).epsilon(1e-3));
  CHECK(efficiency(la, grid_piles(2, 4, 1.0, 1.0, 0.4)) == Approx(0.7733).epsilon(1e-3));
  CHECK(efficiency(la, grid_piles(2, 4, 1.2, 1.2, 0.4)) == Approx(0.8111).epsilon(1e-3));
  CHECK(efficiency(la, grid_piles(2, 4, 1.6, 1.6, 0.4)) == Approx(0.8583).epsilon(1e-3));
}

TEST_CASE("group: Feld's rule counts orthogonal and diagonal neighbours", "[group][published]") {
  const auto feld = cairn::EfficiencyMethod::feld;
  // Source: Feld's rule, 1/16 per adjacent pile (from memory), computed.
  CHECK(efficiency(feld, grid_piles(3, 3, 1.2, 1.2, 0.4)) == Approx(65.0 / 90.0).epsilon(1e-9));
  CHECK(efficiency(feld, grid_piles(2, 4, 1.2, 1.2, 0.4)) == Approx(0.7500).epsilon(1e-9));
  CHECK(efficiency(feld, grid_piles(2, 2, 1.2, 1.2, 0.4)) == Approx(0.8125).epsilon(1e-9));
  CHECK(efficiency(feld, grid_piles(4, 4, 1.2, 1.2, 0.4)) == Approx(0.6719).epsilon(1e-3));
}

TEST_CASE("group: block-perimeter rule for sand, none, and unequal spacings", "[group][published]") {
  // Source: Das, Principles of Foundation Engineering, group efficiency η = [2(n1 + n2 − 2)d
  // + 4D]/(p n1 n2) (from memory). By hand for 3 × 3, d = 1.2 m, D = 0.4 m round:
  // (2·4·1.2 + 1.6)/(9·π·0.4) = 11.2/11.3097 = 0.99030.
  const auto piles = grid_piles(3, 3, 1.2, 1.2, 0.4);
  CHECK(efficiency(cairn::EfficiencyMethod::block_perimeter, piles) ==
        Approx(11.2 / (9.0 * kPi * 0.4)).epsilon(1e-9));
  // Wider spacing: the block perimeter exceeds the piles' perimeters, so η is capped at 1.
  CHECK(efficiency(cairn::EfficiencyMethod::block_perimeter, grid_piles(3, 3, 2.0, 2.0, 0.4)) == 1.0);
  const auto none = cairn::group_efficiency(cairn::EfficiencyMethod::none, piles);
  CHECK(none.value == 1.0);
  // The method alone does not know the piles or soil: no claim about driven piles in sand.
  CHECK(none.note.find("no reduction for group action") != std::string::npos);
  CHECK(none.note.find("sand") == std::string::npos);
  // Unequal spacings: the smaller (1.2 m) is used, so η equals the 1.2 × 1.2 m grid's.
  const auto uneven = cairn::group_efficiency(cairn::EfficiencyMethod::converse_labarre,
                                              grid_piles(3, 3, 1.6, 1.2, 0.4));
  CHECK(*uneven.value == Approx(0.7269).epsilon(1e-3));  // Converse–Labarre, s/D = 3
  CHECK(uneven.note == "spacings differ along x and y: the smaller, 1.200 m, is used");
  CHECK(cairn::efficiency_method_from_string("los-angeles") == cairn::EfficiencyMethod::los_angeles);
  CHECK_FALSE(cairn::efficiency_method_from_string("seiler").has_value());
}

TEST_CASE("group: efficiency on the shaft only leaves the tip whole", "[group]") {
  // Invariant: η(Qp + Qs) for the whole, Qp + ηQs for the shaft only.
  CHECK(cairn::efficient_capacity(100.0, 300.0, 0.8) == Approx(320.0));
  CHECK(cairn::efficient_capacity(100.0, 300.0, 0.8, cairn::EfficiencyApplies::shaft_only) ==
        Approx(340.0));
}

// ---- block failure ------------------------------------------------------------------------

TEST_CASE("group: Skempton's Nc with the depth ratio capped at 2.5", "[group][published]") {
  // Source: Skempton (1951), reported in Smith, Elements of Soil Mechanics;
  // values computed from it.
  CHECK(cairn::skempton_nc(1.0, 0.0) == Approx(6.0).epsilon(1e-9));
  CHECK(cairn::skempton_nc(1.0, 1.0) == Approx(7.2).epsilon(1e-9));
  CHECK(cairn::skempton_nc(1.0, 2.5) == Approx(9.0).epsilon(1e-9));
  CHECK(cairn::skempton_nc(1.0, 5.0) == Approx(9.0).epsilon(1e-9));
  CHECK(cairn::skempton_nc(0.5, 5.0) == Approx(8.25).epsilon(1e-9));
  CHECK(cairn::skempton_nc(0.0, 5.0) == Approx(7.5).epsilon(1e-9));
}

TEST_CASE("group: block failure in clay and which capacity governs", "[group][published]") {
  cairn::SoilProfile profile;
  SECTION("the efficiency sum governs") {
    profile.layers = {clay("soft", 15.0, 50.0), clay("stiff", 10.0, 80.0)};
    const auto piles = grid_piles(3, 3, 1.2, 1.2, 0.4);
    const cairn::BlockPlan plan = cairn::block_plan(piles);
    CHECK(plan.width == Approx(2.8));  // outer to outer: 2·1.2 + 0.4
    const cairn::BlockCapacity block = cairn::block_capacity_clay(profile, plan, 0.0, 15.0);
    REQUIRE(block.applies);
    // Source: block equation UFC 3-220-20 (2025) Eq. 6-38 with Skempton (1951) Nc, computed:
    // Nc = 9.0, Qblock = 8400 + 5644.8 = 14044.8 kN.
    CHECK(block.nc == Approx(9.0).epsilon(1e-9));
    CHECK(block.perimeter == Approx(8400.0).epsilon(1e-3));
    CHECK(block.base == Approx(5644.8).epsilon(1e-3));
    CHECK(block.capacity == Approx(14044.8).epsilon(1e-3));
    // Single pile: Qs = 0.7·50·π·0.4·15 = 659.73 kN, Qp = 9·80·π·0.2² = 90.48 kN.
    const double single = 0.7 * 50.0 * kPi * 0.4 * 15.0 + 9.0 * 80.0 * kPi * 0.04;
    const cairn::GroupCapacity group = cairn::group_capacity(9.0 * single, block);
    CHECK(group.capacity == Approx(6751.9).epsilon(1e-3));  // 9Qi = 6751.9 kN
    CHECK(group.governs == cairn::GroupGoverning::efficiency);
  }
  SECTION("the block governs") {
    profile.layers = {clay("soft", 15.0, 20.0), clay("firm", 10.0, 30.0)};
    const cairn::BlockPlan plan = cairn::block_plan(grid_piles(3, 3, 0.8, 0.8, 0.4));
    CHECK(plan.width == Approx(2.0));
    const cairn::BlockCapacity block = cairn::block_capacity_clay(profile, plan, 0.0, 15.0);
    // Source: UFC 3-220-20 (2025) Eq. 6-38 / 6-37 with Skempton Nc, computed: Qblock = 2400 +
    // 1080 = 3480 kN < 9Qi = 3698.3 kN, ratio 0.9410.
    CHECK(block.capacity == Approx(3480.0).epsilon(1e-3));
    const double single = 1.0 * 20.0 * kPi * 0.4 * 15.0 + 9.0 * 30.0 * kPi * 0.04;
    const cairn::GroupCapacity group = cairn::group_capacity(9.0 * single, block);
    CHECK(group.efficient_sum == Approx(3698.3).epsilon(1e-3));
    CHECK(group.capacity == Approx(3480.0).epsilon(1e-3));
    CHECK(group.governs == cairn::GroupGoverning::block);
    CHECK(group.capacity / group.efficient_sum == Approx(0.9410).epsilon(1e-3));
  }
  SECTION("tips in sand: block failure in clay does not apply") {
    profile.layers = {clay("soft", 10.0, 20.0), sand("dense", 10.0, 36.0)};
    const auto block = cairn::block_capacity_clay(profile, {2.8, 2.8}, 0.0, 12.0);
    CHECK_FALSE(block.applies);
    CHECK(cairn::group_capacity(5000.0, block).governs == cairn::GroupGoverning::efficiency);
  }
  SECTION("tips below the profile are refused") {
    profile.layers = {clay("soft", 10.0, 20.0)};
    CHECK_THROWS_AS(cairn::block_capacity_clay(profile, {2.8, 2.8}, 0.0, 12.0),
                    std::invalid_argument);
  }
}

TEST_CASE("group: uplift of the soil block with the water table", "[group]") {
  cairn::SoilProfile profile;
  profile.water_table = 2.0;
  profile.layers = {clay("clay", 20.0, 50.0)};
  // By hand: heads at 1 m, tips at 16 m, block 2.8 × 2.8 m. γ'·Δz = 18·1 + (19 − 9.81)·14 =
  // 146.66 kPa, weight = 7.84·146.66 = 1149.81 kN; shear = 11.2·50·15 = 8400 kN;
  // resistance 9549.81 kN; against 3000 kN, FS = 3.1833.
  const cairn::GroupUplift u = cairn::group_uplift(profile, {2.8, 2.8}, 1.0, 16.0, 3000.0);
  CHECK(u.weight == Approx(1149.81).epsilon(1e-5));
  CHECK(u.perimeter_shear == Approx(8400.0).epsilon(1e-9));
  CHECK(u.resistance == Approx(9549.81).epsilon(1e-5));
  CHECK(*u.factor_of_safety == Approx(3.18327).epsilon(1e-5));
  // Sand, no water: σ'v mean over 0–10 m = 90 kPa, K0 = 1 − sin30° = 0.5, tan30° = 0.57735:
  // shear = 11.2·0.5·0.57735·90·10 = 2909.85 kN; weight = 7.84·180 = 1411.2 kN.
  cairn::SoilProfile dry;
  dry.layers = {sand("sand", 12.0, 30.0)};
  const auto s = cairn::group_uplift(dry, {2.8, 2.8}, 0.0, 10.0, 0.0);
  CHECK(s.weight == Approx(1411.2).epsilon(1e-9));
  CHECK(s.perimeter_shear == Approx(11.2 * 0.5 * std::tan(kPi / 6.0) * 900.0).epsilon(1e-9));
  CHECK_FALSE(s.factor_of_safety.has_value());
  // Missing data names the layer and the field.
  dry.layers[0].unit_weight.reset();
  dry.layers[0].saturated_unit_weight.reset();
  REQUIRE_THROWS_WITH(cairn::group_uplift(dry, {2.8, 2.8}, 0.0, 10.0, 100.0),
                      "layer 'sand': unit_weight is missing; effective stresses need it");
}

// ---- settlement ---------------------------------------------------------------------------

namespace {

// The pile of the Vesić (1977) settlement check below.
cairn::VesicPile row_6_1_pile() {
  cairn::VesicPile pile;
  pile.width = 0.4;
  pile.round = true;
  pile.length = 15.0;
  pile.pile_modulus = 30.0e6;
  pile.soil_modulus_tip = 30.0e3;
  pile.soil_modulus_shaft = 30.0e3;
  pile.poisson_ratio = 0.3;
  pile.xi = 0.5;
  return pile;
}

}  // namespace

TEST_CASE("group: Vesic single-pile settlement, elastic and empirical routes",
          "[group][published]") {
  const cairn::VesicPile pile = row_6_1_pile();
  // Source: Vesić (1977), NCHRP Synthesis 42, three-part method (outline in NAVFAC DM 7.02;
  // coefficients from memory); values computed from it:
  // s1 = 1.592, s2 = 16.414, s3 = 1.067, total 19.073 mm.
  const cairn::VesicSettlement s = cairn::vesic_settlement(pile, {200.0, 400.0});
  CHECK(s.shortening * 1000.0 == Approx(1.592).epsilon(1e-3));
  CHECK(s.tip * 1000.0 == Approx(16.414).epsilon(1e-3));
  CHECK(s.shaft * 1000.0 == Approx(1.067).epsilon(1e-3));
  CHECK(s.total * 1000.0 == Approx(19.073).epsilon(1e-3));
  // Computed, empirical route with Cp = 0.03, qp = 5000 kPa: s2 = 3.000, s3 = 0.306 mm.
  const auto e = cairn::vesic_settlement_empirical(pile, {200.0, 400.0}, 0.03, 5000.0);
  CHECK(e.tip * 1000.0 == Approx(3.000).epsilon(1e-3));
  CHECK(e.shaft * 1000.0 == Approx(0.306).epsilon(2e-3));  // row rounded to 3 figures
  CHECK(e.shortening == Approx(s.shortening));
  // Computed, Vesić group rule (from memory) sg = s·√(Bg/D): 19.073 mm, Bg = 2.8 m, D = 0.4 m → 50.46 mm.
  CHECK(cairn::vesic_group_settlement(0.019073, 2.8, 0.4) * 1000.0 == Approx(50.46).epsilon(1e-3));
}

TEST_CASE("group: working load split and secant axial stiffness", "[group][published]") {
  // Ultimate tip : shaft = 1 : 2 splits 600 kN into 200 + 400 kN, the loads of the Vesić settlement check.
  const cairn::WorkingLoadSplit split = cairn::split_working_load(600.0, 600.0, 1200.0);
  CHECK(split.tip == Approx(200.0));
  CHECK(split.shaft == Approx(400.0));
  // Source: computed from Vesić (1977)'s settlement formulas (s = 19.073 mm at 600 kN):
  // k = 600/0.019073 = 31 458 kN/m.
  const cairn::SecantStiffness k = cairn::axial_head_stiffness(row_6_1_pile(), 600.0, 600.0, 1200.0);
  CHECK(k.settlement * 1000.0 == Approx(19.073).epsilon(1e-3));
  CHECK(k.stiffness == Approx(600.0 / 0.019073).epsilon(1e-3));
  // Vesić's method is linear: the secant does not depend on the load level.
  CHECK(cairn::axial_head_stiffness(row_6_1_pile(), 300.0, 600.0, 1200.0).stiffness ==
        Approx(k.stiffness).epsilon(1e-12));
}

TEST_CASE("group: 2V:1H stress spread below the equivalent footing", "[group][published]") {
  // Source: FHWA (1996) equivalent footing, 2V:1H spread (also UFC 3-220-20 (2025) Eq.
  // 6-51), computed: Q = 3000 kN, Bg = Lg = 2.8 m.
  const cairn::BlockPlan plan{2.8, 2.8};
  CHECK(cairn::spread_stress(3000.0, plan, 0.0) == Approx(382.65).epsilon(1e-3));
  CHECK(cairn::spread_stress(3000.0, plan, 2.0) == Approx(130.21).epsilon(1e-3));
  CHECK(cairn::spread_stress(3000.0, plan, 5.0) == Approx(49.31).epsilon(1e-3));
  CHECK(cairn::spread_stress(3000.0, plan, 8.0) == Approx(25.72).epsilon(1e-3));
}

TEST_CASE("group: equivalent-footing settlement with sand and over-consolidated clay",
          "[group][published]") {
  // Worked by hand (methods: FHWA 1996 equivalent footing with 2V:1H spread;
  // Terzaghi one-dimensional consolidation, common practice):
  //   Profile: sand 0–12 m (γ = 18, γsat = 20 kN/m³, Es = 40 MPa), clay 12–14 m (γsat = 19,
  //   Cc = 0.30, Cr = 0.05, e0 = 0.90, σ'p = 170 kPa), water table 3 m, nothing below 14 m.
  //   Piles: heads at 0, tips at 9 m in the sand; Bg = Lg = 2.8 m; Q = 3000 kN.
  //   Footing at 2/3·9 = 6 m. Sublayers of at most 3 m: sand 6–9, 9–12; clay 12–14.
  //   Sand 6–9:  z = 1.5, Δσ = 3000/4.3² = 162.250 kPa, s = 162.250·3/40000 = 12.169 mm
  //   Sand 9–12: z = 4.5, Δσ = 3000/7.3² = 56.296 kPa,  s = 56.296·3/40000  =  4.222 mm
  //   Clay 12–14, middle 13 m: σ'v0 = 18·3 + 10.19·9 + 9.19·1 = 154.90 kPa;
  //     z = 7, Δσ = 3000/9.8² = 31.237 kPa, σ'f = 186.137 kPa > σ'p = 170 kPa, so
  //     s = 0.05·2/1.9·log10(170/154.90) + 0.30·2/1.9·log10(186.137/170)
  //       = 2.126 + 12.437 = 14.563 mm
  //   Total = 12.169 + 4.222 + 14.563 = 30.954 mm (> 25 mm tolerable).
  cairn::SoilProfile profile;
  profile.water_table = 3.0;
  cairn::SoilLayer upper = sand("sand", 12.0, 34.0);
  upper.soil_modulus = 40.0e3;
  cairn::SoilLayer lower = clay("clay", 2.0, 60.0);
  lower.compression_index = 0.30;
  lower.recompression_index = 0.05;
  lower.void_ratio = 0.90;
  lower.preconsolidation = 170.0;
  profile.layers = {upper, lower};
  cairn::EquivalentFootingOptions options;
  options.sublayer_thickness = 3.0;
  options.stress_ratio_cutoff = 0.0;

  const auto result =
      cairn::equivalent_footing_settlement(profile, {2.8, 2.8}, 0.0, 9.0, 3000.0, options);
  REQUIRE(result.missing.empty());
  REQUIRE(result.sublayers.size() == 3);
  CHECK(result.footing_depth == Approx(6.0));
  CHECK(result.sublayers[0].settlement * 1000.0 == Approx(12.169).epsilon(1e-3));
  CHECK(result.sublayers[1].settlement * 1000.0 == Approx(4.222).epsilon(1e-3));
  CHECK(result.sublayers[2].initial_stress == Approx(154.90).epsilon(1e-4));
  CHECK(result.sublayers[2].added_stress == Approx(31.237).epsilon(1e-4));
  CHECK(result.sublayers[2].branch == "recompression + virgin");
  CHECK(result.sublayers[2].settlement * 1000.0 == Approx(14.563).epsilon(1e-3));
  REQUIRE(result.total.has_value());
  CHECK(*result.total * 1000.0 == Approx(30.954).epsilon(1e-3));
  // Source: tolerable settlement 25 mm, common practice (Terzaghi & Peck, from memory).
  const cairn::SettlementCheck check = cairn::check_settlement(*result.total);
  CHECK(check.limit == Approx(0.025));
  CHECK_FALSE(check.ok);
  CHECK(check.notes.size() == 1);
  CHECK(cairn::check_settlement(*result.total, 0.050).ok);

  SECTION("normally consolidated: σ'p below σ'v0 uses Cc only") {
    profile.layers[1].preconsolidation = 100.0;
    const auto nc =
        cairn::equivalent_footing_settlement(profile, {2.8, 2.8}, 0.0, 9.0, 3000.0, options);
    // By hand: 0.30·2/1.9·log10(186.137/154.90) = 25.199 mm.
    CHECK(nc.sublayers[2].branch == "virgin");
    CHECK(nc.sublayers[2].settlement * 1000.0 ==
          Approx(0.30 * 2.0 / 1.9 * std::log10(186.137 / 154.90) * 1000.0).epsilon(1e-4));
  }
  SECTION("the stress-ratio cutoff stops the summation") {
    // Cutoff 25 %: sand 9–12 m keeps going (56.3 ≥ 0.25·130.4 kPa), the clay stops it
    // (31.2 < 0.25·154.9 kPa).
    options.stress_ratio_cutoff = 0.25;
    const auto cut =
        cairn::equivalent_footing_settlement(profile, {2.8, 2.8}, 0.0, 9.0, 3000.0, options);
    CHECK(cut.sublayers.size() == 2);
    CHECK(cut.bottom == Approx(12.0));
  }
  SECTION("footing at 2/3 of the bearing stratum when the tips enter a lower layer") {
    cairn::SoilProfile two = profile;
    two.layers = {clay("fill", 4.0, 20.0), upper};
    two.layers[1].thickness = 10.0;
    // Tips at 10 m: bearing stratum from 4 to 10 m, footing at 4 + 2/3·6 = 8 m;
    // by embedment it is at 2/3·10 = 6.667 m.
    const auto b = cairn::equivalent_footing_settlement(two, {2.8, 2.8}, 0.0, 10.0, 1000.0);
    CHECK(b.footing_depth == Approx(8.0));
    options.level = cairn::FootingLevel::embedment;
    const auto e = cairn::equivalent_footing_settlement(two, {2.8, 2.8}, 0.0, 10.0, 1000.0, options);
    CHECK(e.footing_depth == Approx(20.0 / 3.0));
  }
}

TEST_CASE("group: missing consolidation data names the layer and the field", "[group]") {
  cairn::SoilProfile profile;
  cairn::SoilLayer upper = sand("sand", 10.0, 34.0);
  upper.soil_modulus = 40.0e3;
  cairn::SoilLayer lower = clay("grey clay", 5.0, 60.0);
  lower.line = 27;
  lower.recompression_index = 0.05;
  profile.layers = {upper, lower};
  cairn::EquivalentFootingOptions options;
  options.stress_ratio_cutoff = 0.0;
  const auto result =
      cairn::equivalent_footing_settlement(profile, {2.8, 2.8}, 0.0, 9.0, 3000.0, options);
  CHECK_FALSE(result.total.has_value());
  REQUIRE(result.missing.size() == 3);
  CHECK(result.missing[0].layer == "grey clay");
  CHECK(result.missing[0].line == 27);
  CHECK(result.missing[0].field == "compression_index");
  CHECK(result.missing[0].message ==
        "layer 'grey clay': compression_index is missing; consolidation settlement needs Cc, "
        "e0 and σ'p (and Cr when over-consolidated)");
  CHECK(result.missing[1].field == "void_ratio");
  CHECK(result.missing[2].field == "preconsolidation");
}

TEST_CASE("group: notes quote lengths and the default settlement limit in the project's units",
          "[group]") {
  // A 2 × 2 grid at 1.2 m by 1.5 m: the smaller spacing is used and quoted.
  std::vector<PilePlan> piles;
  for (double x : {0.0, 1.2})
    for (double y : {0.0, 1.5}) piles.push_back({"P", x, y, 0.4, true});
  const cairn::Efficiency si = cairn::group_efficiency(cairn::EfficiencyMethod::converse_labarre, piles);
  CHECK(si.note == "spacings differ along x and y: the smaller, 1.200 m, is used");
  const cairn::Efficiency us =
      cairn::group_efficiency(cairn::EfficiencyMethod::converse_labarre, piles, cairn::kGridTolerance, cairn::UnitSystem::US);
  // 1.2 m = 3.937 ft (1 ft = 0.3048 m exactly, NIST SP 811 2008).
  CHECK(us.note == "spacings differ along x and y: the smaller, 3.937 ft, is used");
  // Default tolerable settlement 25 mm = 0.98 in, printed 1.0 in (common practice value).
  const cairn::SettlementCheck s = cairn::check_settlement(0.010, std::nullopt, cairn::UnitSystem::US);
  REQUIRE(s.notes.size() == 1);
  CHECK(s.notes[0].starts_with("tolerable settlement 1.0 in (25 mm;"));
}
