// Tests for explain.hpp: the hand check of one pile's axial force (P/n ± M·x/I with the
// product of inertia), against published rows and against the rigid-cap solver.
#include <catch2/catch.hpp>

#include <array>
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "cairn/solver/cap_solver.hpp"
#include "cairn/checks/checks.hpp"
#include "cairn/checks/explain.hpp"
#include "cairn/core/model.hpp"
#include "support.hpp"

using namespace cairn::test;  // close, on_top, one_case_project, kCapThickness

namespace {

cairn::PileType pile_type(const std::string& id, std::optional<double> axial,
                          bool tension = true) {
  cairn::PileType type;
  type.id = id;
  type.section = {cairn::SectionShape::round, 0.6};
  type.length = 15.0;
  type.elastic_modulus = 30e6;
  type.axial_stiffness = axial;
  type.lateral_stiffness = 1e4;
  type.tension = tension;
  return type;
}

// Vertical piles at every (x, y), rows of y first (in the order given), x ascending.
std::vector<cairn::Pile> grid(const std::vector<double>& xs, const std::vector<double>& ys) {
  std::vector<cairn::Pile> piles;
  for (double y : ys)
    for (double x : xs) {
      cairn::Pile p;
      p.id = "P" + std::to_string(piles.size() + 1);
      p.x = x;
      p.y = y;
      piles.push_back(p);
    }
  return piles;
}

// Solves the project and wraps the solutions as check results (only the fields the hand
// check reads: the solution and each pile's axial force).
cairn::CheckResults solved(const cairn::Project& project) {
  const cairn::CapSolver solver(cairn::pile_springs(project));
  REQUIRE(cairn::unresisted_cases(project, solver).empty());
  const auto solutions = cairn::solve_combinations(project, solver);
  cairn::CheckResults results;
  for (std::size_t c = 0; c < solutions.size(); ++c) {
    cairn::CombinationCheck cc;
    cc.combination = c;
    cc.solution = solutions[c];
    for (const auto& force : solutions[c].piles) {
      cairn::PileCheck check;
      check.axial = force.axial;
      check.lateral = force.lateral;
      check.active = force.active;
      cc.piles.push_back(check);
    }
    results.combinations.push_back(cc);
  }
  return results;
}

}  // namespace

TEST_CASE("explain: the as-built 3x3 group with a product of inertia",
          "[explain][published]") {
  // Pile (1.2, 1.2) of the 3x3 grid at 1.2 m built at (1.275, 1.2); P = 5400 kN at (0, 0).
  std::vector<cairn::Pile> piles = grid({-1.2, 0.0, 1.2}, {1.2, 0.0, -1.2});
  piles[2].x = 1.275;
  const cairn::Project project =
      one_case_project({pile_type("V", 2.5e5)}, piles, {on_top(0, 0, {0, 0, -5400})});
  const cairn::CheckResults results = solved(project);
  // Source: USACE EM 1110-2-2906 (1991) / Poulos & Davis (1980), the rigid-cap formula with
  // the product term (common practice; from memory), values computed from it
  // to 3 decimals (half a unit of the last place is < 1e-6 relative).
  const std::array<double, 9> expected = {606.226, 600.106, 593.604, 606.162, 600.042,
                                          593.923, 606.098, 599.979, 593.859};
  for (std::size_t i = 0; i < piles.size(); ++i) {
    INFO("pile " << i);
    const auto checks = cairn::explain_pile(project, results, i);
    REQUIRE(checks.size() == 1);
    const cairn::HandCheck& h = checks[0];
    REQUIRE(h.available);
    // Source: computed from the section of the grid: x̄ = 0.008333 m, Ixx = 8.64, Iyy = 8.825,
    // Ixy = 0.09 m² (exact: 0.075/9, and sums of the grid's squares).
    CHECK(h.section.count == 9);
    CHECK(h.section.centroid_x == close(0.075 / 9.0, 1e-12));
    CHECK(h.section.centroid_y == close(0.0, 0.0, 1e-15));
    CHECK(h.section.ixx == close(8.64, 1e-12));
    CHECK(h.section.iyy == close(8.825, 1e-12));
    CHECK(h.section.ixy == close(0.09, 1e-12));
    CHECK(h.vertical == close(5400.0, 1e-12));
    CHECK(h.direct == close(600.0, 1e-12));
    CHECK(h.axial == close(expected[i], 1e-6));
    // The hand formula is exact here: it must equal the 6-dof solver to rounding.
    CHECK(h.axial == close(h.solver_axial, 1e-9));
    CHECK(h.solver_axial == close(expected[i], 1e-6));
  }
}

TEST_CASE("explain: the terms of P/n ± M·x/Σx² for the 3x3 grid",
          "[explain][published]") {
  // P = 5400 kN at the origin; Fy = 480 and Fx = 240 kN on the top of the 1.5 m cap give
  // Mx = −720 and My = +360 kN·m at the pile heads (table: Mx = 720, My = 360 in its signs).
  const cairn::Project project = one_case_project(
      {pile_type("V", 2e5)}, grid({-1.2, 0.0, 1.2}, {-1.2, 0.0, 1.2}),
      {on_top(0, 0, {0, 0, -5400}), on_top(0, 0, {0, 480, 0}), on_top(0, 0, {240, 0, 0})});
  const cairn::CheckResults results = solved(project);
  const std::size_t corner = 8;  // (1.2, 1.2)
  const cairn::HandCheck h = cairn::explain_pile(project, results, corner)[0];
  REQUIRE(h.available);
  CHECK(h.moment_x == close(-720.0, 1e-12));
  CHECK(h.moment_y == close(360.0, 1e-12));
  // e_x = My/V = 360/5400, e_y = −Mx/V = 720/5400 m.
  CHECK(h.eccentricity_x == close(360.0 / 5400.0, 1e-12));
  CHECK(h.eccentricity_y == close(720.0 / 5400.0, 1e-12));
  // Source: USACE EM 1110-2-2906 / Poulos & Davis (1980), computed: the
  // corner (1.2, 1.2) carries 750 kN = 600 + 360·1.2/8.64 + 720·1.2/8.64 = 600 + 50 + 100.
  CHECK(h.direct == close(600.0, 1e-12));
  CHECK(h.from_moment_y == close(50.0, 1e-9));
  CHECK(h.from_moment_x == close(100.0, 1e-9));
  CHECK(h.axial == close(750.0, 1e-9));
  CHECK(h.solver_axial == close(750.0, 1e-9));
}

TEST_CASE("explain: the hand check says why it does not apply", "[explain]") {
  const std::vector<cairn::Pile> square = grid({-1.0, 1.0}, {-1.0, 1.0});
  SECTION("battered piles") {
    std::vector<cairn::Pile> piles = square;
    piles[0].batter = cairn::Batter{6.0, 225.0};
    const cairn::Project project =
        one_case_project({pile_type("V", 2e5)}, piles, {on_top(0, 0, {0, 0, -1000})});
    const auto h = cairn::explain_pile(project, solved(project), 1)[0];
    CHECK_FALSE(h.available);
    CHECK(h.why_not.find("battered") != std::string::npos);
  }
  SECTION("unequal typed stiffness") {
    std::vector<cairn::Pile> piles = square;
    piles[3].type = 1;
    const cairn::Project project = one_case_project({pile_type("A", 2e5), pile_type("B", 4e5)}, piles,
                                              {on_top(0, 0, {0, 0, -1000})});
    const auto h = cairn::explain_pile(project, solved(project), 0)[0];
    CHECK_FALSE(h.available);
    CHECK(h.why_not.find("unequal axial stiffness") != std::string::npos);
  }
  SECTION("two types whose springs would come from the soil") {
    // Equal E·A/L, but with a soil profile and no typed stiffness the solver's springs are
    // estimated from the soil per type (stiffness.hpp) and need not be equal.
    std::vector<cairn::Pile> piles = square;
    piles[3].type = 1;
    cairn::Project project = one_case_project({pile_type("A", std::nullopt), pile_type("B", std::nullopt)},
                                        piles, {on_top(0, 0, {0, 0, -1000})});
    const cairn::CheckResults results = solved(project);  // springs E·A/L: no soil yet
    project.soil = cairn::SoilProfile{};
    const auto h = cairn::explain_pile(project, results, 0)[0];
    CHECK_FALSE(h.available);
    CHECK(h.why_not.find("from the soil") != std::string::npos);
  }
  SECTION("one type with springs from the soil is still equal") {
    cairn::Project project =
        one_case_project({pile_type("A", std::nullopt)}, square, {on_top(0.1, 0, {0, 0, -1000})});
    const cairn::CheckResults results = solved(project);
    project.soil = cairn::SoilProfile{};
    const auto h = cairn::explain_pile(project, results, 0)[0];
    CHECK(h.available);
    CHECK(h.axial == close(h.solver_axial, 1e-9));
  }
  SECTION("a pile that dropped out, and the formula over the piles left") {
    // P = 1000 kN at (0.6, 0.6) lifts the compression-only corner (−1, −1); the three left
    // are statically determinate: 200, 200, 600 kN (worked in test_cap_solver.cpp).
    const cairn::Project project = one_case_project({pile_type("C", 2e5, false)}, square,
                                              {on_top(0.6, 0.6, {0, 0, -1000})});
    const cairn::CheckResults results = solved(project);
    const auto lifted = cairn::explain_pile(project, results, 0)[0];
    CHECK_FALSE(lifted.available);
    CHECK(lifted.why_not == "the pile dropped out (it takes no tension)");
    const auto corner = cairn::explain_pile(project, results, 3)[0];
    REQUIRE(corner.available);
    CHECK(corner.section.count == 3);
    CHECK(corner.axial == close(600.0, 1e-9));
    CHECK(corner.solver_axial == close(600.0, 1e-9));
  }
  SECTION("an overturned cap") {
    const cairn::Project project = one_case_project({pile_type("C", 2e5, false)}, square,
                                              {on_top(1.5, 0, {0, 0, -1000})});
    const cairn::CheckResults results = solved(project);
    REQUIRE(results.combinations[0].solution.overturns);
    const auto h = cairn::explain_pile(project, results, 3)[0];
    CHECK_FALSE(h.available);
    CHECK(h.why_not == "the cap overturns in this combination");
  }
}

TEST_CASE("explain: a two-pile cap uses the one-way form", "[explain][published]") {
  // Two piles meant at x = ±0.9 m; the pile at +0.9 is driven 75 mm outward (x = 0.975).
  // Column P = 2000 kN at (0, 0). Hand: x̄ = 0.0375 m, x' = ∓0.9375 m, Iyy = 2·0.9375² =
  // 1.7578 m², My about the centroid = 0.0375·(−2000) = −75 kN·m, so
  // P = 1000 ∓ (−75)·0.9375/1.7578 = 1040 / 960 kN.
  std::vector<cairn::Pile> piles = grid({-0.9, 0.975}, {0.0});
  const cairn::Project project =
      one_case_project({pile_type("V", 2.5e5)}, piles, {on_top(0, 0, {0, 0, -2000})});
  const cairn::CheckResults results = solved(project);
  // Source: computed from the rigid-cap formula (common practice):
  // outward 75 mm → 1040.0 / 960.0 kN.
  const std::array<double, 2> expected = {1040.0, 960.0};
  for (std::size_t i = 0; i < 2; ++i) {
    INFO("pile " << i);
    const auto checks = cairn::explain_pile(project, results, i);
    REQUIRE(checks.size() == 1);
    const cairn::HandCheck& h = checks[0];
    REQUIRE(h.available);
    CHECK(h.form == cairn::HandCheck::Form::line_x);
    CHECK(h.section.iyy == close(2.0 * 0.9375 * 0.9375, 1e-12));
    CHECK(h.axial == close(expected[i], 1e-9));
    CHECK(h.axial == close(h.solver_axial, 1e-9));
  }
}
