// Tests for cap_solver.hpp: the rigid-cap distribution of loads to piles.
//
// Sign conventions (cairn): x, y in plan, z up, pile heads at z = 0, loads on the cap at
// their points, moments right-hand rule, downward load negative Fz, axial force compression
// positive. Published tables write "Mx" as the moment that makes the load grow with y; in
// cairn that is −Mx (a positive Mx compresses the piles at negative y). Each published row
// below is converted and the conversion is written beside it.
#include <catch2/catch.hpp>

#include <algorithm>
#include <array>
#include <cmath>
#include <cstddef>
#include <numbers>
#include <optional>
#include <random>
#include <stdexcept>
#include <string>
#include <vector>

#include "cairn/solver/cap_solver.hpp"
#include "cairn/core/model.hpp"
#include "support.hpp"

using cairn::CapSolution;
using cairn::CapSolver;
using cairn::PileSpring;
using cairn::Project;
using cairn::Wrench;

using namespace cairn::test;  // close, batter_axis, spring, on_top, one_case_project, solve_project

namespace {

cairn::PileType pile_type(const std::string& id, double axial, double lateral = 0.0,
                          bool tension = true) {
  cairn::PileType type;
  type.id = id;
  type.section = {cairn::SectionShape::round, 0.6};
  type.length = 15.0;
  type.elastic_modulus = 30e6;
  type.axial_stiffness = axial;
  type.lateral_stiffness = lateral;
  type.tension = tension;
  return type;
}

cairn::Pile pile(double x, double y, std::size_t type = 0,
                 std::optional<cairn::Batter> batter = std::nullopt) {
  cairn::Pile p;
  p.id = "P" + std::to_string(x) + "," + std::to_string(y);
  p.x = x;
  p.y = y;
  p.type = type;
  p.batter = batter;
  return p;
}

// Grid of vertical piles at every (x, y) of the two coordinate lists, rows of y first.
std::vector<cairn::Pile> grid(const std::vector<double>& xs, const std::vector<double>& ys) {
  std::vector<cairn::Pile> piles;
  for (double y : ys)
    for (double x : xs) piles.push_back(pile(x, y));
  return piles;
}

// Index of the pile at (x, y).
std::size_t at(const Project& project, double x, double y) {
  for (std::size_t i = 0; i < project.piles.size(); ++i)
    if (std::abs(project.piles[i].x - x) < 1e-12 && std::abs(project.piles[i].y - y) < 1e-12)
      return i;
  FAIL("no pile at (" << x << ", " << y << ")");
  return 0;
}

// The force and moment about the origin that the piles take from the cap, rebuilt from the
// cap movement with the rigid-body kinematics u = t + r × p (written out here, not taken
// from the solver), the solver's axial forces along each axis and the lateral springs
// across it. Also checks each pile's reported axial and lateral force against k·u.
Wrench pile_reaction(const std::vector<PileSpring>& springs, const CapSolution& solution) {
  Wrench sum{};
  const auto& t = solution.movement.translation;
  const auto& r = solution.movement.rotation;
  for (std::size_t i = 0; i < springs.size(); ++i) {
    const auto& s = springs[i];
    const auto& p = s.head;
    const std::array<double, 3> u = {t[0] + r[1] * p[2] - r[2] * p[1],
                                     t[1] + r[2] * p[0] - r[0] * p[2],
                                     t[2] + r[0] * p[1] - r[1] * p[0]};
    const double along = u[0] * s.axis[0] + u[1] * s.axis[1] + u[2] * s.axis[2];
    const auto& force = solution.piles[i];
    // A pile that dropped out carries no axial force but keeps its lateral spring (the
    // soil still holds it across its axis).
    std::array<double, 3> f{};
    if (force.active)
      CHECK(force.axial == close(s.axial * along, 1e-9, 1e-9));
    else
      CHECK(force.axial == 0.0);
    double shear2 = 0.0;
    for (std::size_t j = 0; j < 3; ++j) {
      const double across = s.lateral * (u[j] - along * s.axis[j]);
      f[j] = force.axial * s.axis[j] + across;
      shear2 += across * across;
    }
    CHECK(force.lateral == close(std::sqrt(shear2), 1e-9, 1e-9));
    sum[0] += f[0];
    sum[1] += f[1];
    sum[2] += f[2];
    sum[3] += p[1] * f[2] - p[2] * f[1];
    sum[4] += p[2] * f[0] - p[0] * f[2];
    sum[5] += p[0] * f[1] - p[1] * f[0];
  }
  return sum;
}

// Equilibrium: the piles take exactly the applied load. `length` converts moments to forces
// so one relative margin serves all six components.
void check_equilibrium(const std::vector<PileSpring>& springs, const CapSolution& solution,
                       const Wrench& load, double length, double relative) {
  const Wrench sum = pile_reaction(springs, solution);
  double size = 0.0;
  for (std::size_t i = 0; i < 6; ++i) size = std::max(size, std::abs(load[i]) / (i < 3 ? 1 : length));
  for (std::size_t i = 0; i < 6; ++i) {
    INFO("component " << cairn::kWrenchNames[i]);
    const double scale = i < 3 ? 1.0 : length;
    CHECK(std::abs(sum[i] - load[i]) <= relative * size * scale);
  }
}

}  // namespace

// ---------------------------------------------------------------------------------------
// 1. Closed forms for vertical piles and rigid-cap statics (Poulos & Davis 1980; Hrennikoff 1949)
// ---------------------------------------------------------------------------------------

TEST_CASE("cap_solver: a 3x3 grid under load and moment gives P/n ± M·y/Σy² (Poulos & Davis 1980)",
          "[cap_solver][published]") {
  // Rigid cap on equal vertical piles: P_i = P/n + M_y·x_i/Σx² − M_x·y_i/Σy² in cairn's
  // signs. Source: USACE EM 1110-2-2906 (1991) ch. 4 and Poulos & Davis (1980), the elastic
  // rigid-cap formula (common practice; formula from memory), values computed
  // from the formula.
  std::vector<cairn::Pile> piles = grid({-1.2, 0.0, 1.2}, {-1.2, 0.0, 1.2});
  SECTION("P = 5400 kN, published-sign Mx = 720 kN·m from a horizontal load on the cap top") {
    // Mx = 720 in the published sign (load grows with y) is cairn Mx = −720 kN·m. It comes from Fy = 480 kN at
    // the top of the 1.5 m cap: Mx = −z·Fy = −1.5·480 = −720 kN·m at the pile heads.
    const Project project = one_case_project({pile_type("V", 2e5, 1e4)}, piles,
                                             {on_top(0, 0, {0, 0, -5400}), on_top(0, 0, {0, 480, 0})});
    const CapSolution s = solve_project(project);
    for (double x : {-1.2, 0.0, 1.2}) {
      // Source: USACE EM 1110-2-2906 / Poulos & Davis (1980), computed:
      // rows y = +1.2 / 0 / −1.2 carry 700 / 600 / 500 kN.
      CHECK(s.piles[at(project, x, 1.2)].axial == close(700.0, 1e-9));
      CHECK(s.piles[at(project, x, 0.0)].axial == close(600.0, 1e-9));
      CHECK(s.piles[at(project, x, -1.2)].axial == close(500.0, 1e-9));
    }
    // Equal lateral springs share the shear equally: 480/9 kN each (common practice).
    for (const auto& p : s.piles) CHECK(p.lateral == close(480.0 / 9.0, 1e-9));
  }
  SECTION("the same with My = 360 kN·m from Fx = 240 kN on the cap top") {
    // My = z·Fx = 1.5·240 = 360 kN·m: same sign in the published convention and in cairn (it compresses +x).
    const Project project =
        one_case_project({pile_type("V", 2e5, 1e4)}, piles,
                         {on_top(0, 0, {0, 0, -5400}), on_top(0, 0, {0, 480, 0}),
                          on_top(0, 0, {240, 0, 0})});
    const CapSolution s = solve_project(project);
    // Source: USACE EM 1110-2-2906 / Poulos & Davis (1980), computed from the formula.
    const std::vector<std::array<double, 3>> expected = {
        {-1.2, 1.2, 650}, {0, 1.2, 700},  {1.2, 1.2, 750},  {-1.2, 0, 550},  {0, 0, 600},
        {1.2, 0, 650},    {-1.2, -1.2, 450}, {0, -1.2, 500}, {1.2, -1.2, 550}};
    for (const auto& [x, y, axial] : expected) {
      INFO("pile at (" << x << ", " << y << ")");
      CHECK(s.piles[at(project, x, y)].axial == close(axial, 1e-9));
    }
    for (const auto& p : s.piles) CHECK(p.lateral == close(std::hypot(240.0, 480.0) / 9.0, 1e-9));
  }
}

TEST_CASE("cap_solver: a 2x4 group under an eccentric column load",
          "[cap_solver][published]") {
  // P = 4000 kN, Mx = 300 (published sign: load grows with y), My = 900 kN·m. In cairn: the
  // column at (0.225, 0.075) on the cap top: My = −x·Fz = 900, Mx = y·Fz = −300 kN·m.
  const Project project = one_case_project(
      {pile_type("V", 3e5)}, grid({-2.25, -0.75, 0.75, 2.25}, {-0.75, 0.75}),
      {on_top(0.225, 0.075, {0, 0, -4000})});
  const CapSolution s = solve_project(project);
  const std::array<double, 4> xs = {-2.25, -0.75, 0.75, 2.25};
  const std::array<double, 4> upper = {460, 520, 580, 640};
  const std::array<double, 4> lower = {360, 420, 480, 540};
  for (std::size_t i = 0; i < 4; ++i) {
    // Source: USACE EM 1110-2-2906 / Poulos & Davis (1980), computed from the formula
    // (Σx² = 22.5, Σy² = 4.5 m²).
    CHECK(s.piles[at(project, xs[i], 0.75)].axial == close(upper[i], 1e-9));
    CHECK(s.piles[at(project, xs[i], -0.75)].axial == close(lower[i], 1e-9));
  }
}

TEST_CASE("cap_solver: unequal axial stiffness and a pile with no stiffness (Hrennikoff 1949)",
          "[cap_solver][published]") {
  // General rigid cap on axial springs (derived from equilibrium and
  // compatibility; Hrennikoff 1949, Saul 1968): Σk_i[1, y_i, x_i]ᵀ[1, y_i, x_i]·(w, a, b) =
  // (P, Mx, My), w_i = w + a·y_i + b·x_i downward.
  constexpr double k = 1e5;  // kN/m, the unit stiffness k of the cases below
  SECTION("k = 1, 1, 1, 2 at (−1,−1), (1,−1), (−1,1), (1,1); P = 1000 kN at (0,0)") {
    const std::vector<PileSpring> springs = {spring(-1, -1, k), spring(1, -1, k),
                                             spring(-1, 1, k), spring(1, 1, 2 * k)};
    const CapSolver solver(springs);
    const Wrench load = {0, 0, -1000, 0, 0, 0};
    const CapSolution s = solver.solve_linear(load);
    // Source: computed from the rigid-cap equations above (equilibrium and compatibility, after
    // Hrennikoff 1949): R = 285.714, 214.286, 214.286, 285.714 kN (rounded to 6 digits).
    CHECK(s.piles[0].axial == close(285.714, 2e-6));
    CHECK(s.piles[1].axial == close(214.286, 2e-6));
    CHECK(s.piles[2].axial == close(214.286, 2e-6));
    CHECK(s.piles[3].axial == close(285.714, 2e-6));
    // w = 214.286/k down, a = b = −35.714/k. In cairn's axes the cap moves t_z = −w, and the
    // downward movement at (x, y) is −t_z − r_x·y + r_y·x, so r_x = −a and r_y = b.
    CHECK(s.movement.translation[2] == close(-214.286 / k, 2e-6));
    CHECK(s.movement.rotation[0] == close(35.714 / k, 2e-5));
    CHECK(s.movement.rotation[1] == close(-35.714 / k, 2e-5));
    check_equilibrium(springs, s, load, 1.0, 1e-9);
  }
  SECTION("the pile at (1,1) lost") {
    // Source: statics, computed (statically determinate three-pile cap):
    // R = 0, 500, 500, 0 kN — the diagonal pair carries all.
    SECTION("pile removed") {
      const CapSolver solver({spring(-1, -1, k), spring(1, -1, k), spring(-1, 1, k)});
      const CapSolution s = solver.solve_linear({0, 0, -1000, 0, 0, 0});
      CHECK(s.piles[0].axial == close(0.0, 0.0, 1e-9));
      CHECK(s.piles[1].axial == close(500.0, 1e-9));
      CHECK(s.piles[2].axial == close(500.0, 1e-9));
    }
    SECTION("pile kept with a stiffness of 1e-9 k") {
      // k → 0 as a limit: the fourth pile's share is of order 1e-9 of the load, hence the
      // absolute margin of 1e-5 kN.
      const CapSolver solver(
          {spring(-1, -1, k), spring(1, -1, k), spring(-1, 1, k), spring(1, 1, 1e-9 * k)});
      const CapSolution s = solver.solve_linear({0, 0, -1000, 0, 0, 0});
      CHECK(s.piles[0].axial == close(0.0, 0.0, 1e-5));
      CHECK(s.piles[1].axial == close(500.0, 1e-7, 1e-5));
      CHECK(s.piles[2].axial == close(500.0, 1e-7, 1e-5));
      CHECK(s.piles[3].axial == close(0.0, 0.0, 1e-5));
    }
  }
}

TEST_CASE("cap_solver: an as-built 3x3 group with a product of inertia",
          "[cap_solver][published]") {
  // Pile (1.2, 1.2) of the 3x3 grid built at (1.275, 1.2): x̄ = 0.008333, Ixx = 8.64,
  // Iyy = 8.825, Ixy = 0.09 m². P = 5400 kN at (0, 0) on the cap top.
  std::vector<cairn::Pile> piles = grid({-1.2, 0.0, 1.2}, {1.2, 0.0, -1.2});
  piles[2].x = 1.275;
  const Project project =
      one_case_project({pile_type("V", 2.5e5)}, piles, {on_top(0, 0, {0, 0, -5400})});
  const CapSolution s = solve_project(project);
  // Source: USACE EM 1110-2-2906 / Poulos & Davis (1980), the formula with the Ixy term,
  // values computed from it (rows y = 1.2, 0, −1.2; x ascending). The values
  // have 3 decimals: half a unit of the last place is < 1e-6 of these values.
  const std::array<double, 9> expected = {606.226, 600.106, 593.604, 606.162, 600.042,
                                          593.923, 606.098, 599.979, 593.859};
  for (std::size_t i = 0; i < 9; ++i) {
    INFO("pile " << i << " at (" << piles[i].x << ", " << piles[i].y << ")");
    CHECK(s.piles[i].axial == close(expected[i], 1e-6));
  }
  // Without Ixy the corner (−1.2, 1.2) would get 606.161 kN: the check must tell them apart.
  CHECK(std::abs(s.piles[0].axial - 606.161) > 0.05);
}

TEST_CASE("cap_solver: two battered piles meeting at one point share V and H by statics "
          "(statics of a pin-headed pair)",
          "[cap_solver][published]") {
  // Heads at x = ±0.375 m, each battered 1H:4V outward, so the axes meet at (0, 0, 1.5): the
  // top of the cap, where V = 1000 kN and H = 100 kN act. Axial only.
  // Statics (battered pin-headed piles, axial only): (N1 + N2)·cos α = V, (N1 − N2)·sin α = H,
  // sin α = 1/√17, cos α = 4/√17 → N1 = 175·√17 = 721.543, N2 = 75·√17 = 309.233 kN.
  const Project project = one_case_project(
      {pile_type("B", 2e5)},
      {pile(0.375, 0.0, 0, cairn::Batter{4.0, 0.0}), pile(-0.375, 0.0, 0, cairn::Batter{4.0, 180.0})},
      {on_top(0, 0, {100, 0, -1000})});
  const auto springs = cairn::pile_springs(project);
  const auto expected_axis = batter_axis(4.0, 0.0);
  for (std::size_t j = 0; j < 3; ++j) CHECK(springs[0].axis[j] == close(expected_axis[j], 1e-12));
  const CapSolution s = solve_project(project);
  // Source: statics, computed (statically determinate; values to 2 decimals):
  // N1 = 721.54, N2 = 309.23 kN compression.
  CHECK(s.piles[0].axial == close(721.54, 2e-5));
  CHECK(s.piles[1].axial == close(309.23, 2e-5));
  // The same, unrounded, from the two equilibrium equations above.
  CHECK(s.piles[0].axial == close(175.0 * std::sqrt(17.0), 1e-9));
  CHECK(s.piles[1].axial == close(75.0 * std::sqrt(17.0), 1e-9));
  check_equilibrium(springs, s, cairn::combination_load(project, project.combinations[0]),
                    kCapThickness, 1e-9);
}

TEST_CASE("cap_solver: with no lateral stiffness the battered pile takes all of H",
          "[cap_solver][published]") {
  // Vertical piles at x = ±1, a pile at x = 0 battered 1H:4V toward +x; equal axial k, no
  // lateral stiffness. H = 60 kN on the cap top makes My = 1.5·60 = 90 kN·m at the heads; the
  // column (900 kN) at x = −0.1 gives My = −90, so M = 0 about (0, 0) (hand-derived).
  const Project project = one_case_project(
      {pile_type("A", 2e5)},
      {pile(-1.0, 0.0), pile(1.0, 0.0), pile(0.0, 0.0, 0, cairn::Batter{4.0, 0.0})},
      {on_top(0, 0, {60, 0, 0}), on_top(-0.1, 0, {0, 0, -900})});
  const CapSolution s = solve_project(project);
  // Source: statics of a rigid cap with a battered pile, computed:
  // N = 330.0, 330.0 and 60·√17 = 247.386 kN.
  CHECK(s.piles[0].axial == close(330.0, 1e-9));
  CHECK(s.piles[1].axial == close(330.0, 1e-9));
  CHECK(s.piles[2].axial == close(60.0 * std::sqrt(17.0), 1e-9));
  CHECK(s.piles[2].axial == close(247.386, 2e-6));
  for (const auto& p : s.piles) CHECK(p.lateral == 0.0);
}

// ---------------------------------------------------------------------------------------
// 2. A battered group worked by hand
// ---------------------------------------------------------------------------------------

TEST_CASE("cap_solver: four piles, two battered 1H:3V, under V, H and M match a hand "
          "calculation",
          "[cap_solver][published]") {
  // Method: rigid cap on pin-headed axial springs (battered piles; after
  // Hrennikoff 1949). Plane x–z, z down in this hand calculation, unknowns u (x), w (down), θ.
  // Pile i shortens δ_i = u·s_i + (w + θ·x_i)·c_i with (s_i, c_i) its axis (horizontal,
  // vertical); N_i = k·δ_i; K = k·Σ v_i·v_iᵀ with v_i = (s_i, c_i, c_i·x_i).
  //
  //   pile  x     batter           s          c          v_i
  //   1    −1.5   1H:3V toward −x  −1/√10     3/√10      (−1/√10, 3/√10, −4.5/√10)
  //   2    −0.5   vertical          0          1          (0, 1, −0.5)
  //   3    +0.5   vertical          0          1          (0, 1, +0.5)
  //   4    +1.5   1H:3V toward +x  +1/√10     3/√10      (+1/√10, 3/√10, +4.5/√10)
  //
  //   K/k:  K_uu = 0.1 + 0.1 = 0.2        K_uw = −0.3 + 0.3 = 0
  //         K_uθ = 0.45 + 0.45 = 0.9      K_ww = 0.9 + 1 + 1 + 0.9 = 3.8
  //         K_wθ = 0                      K_θθ = 0.9·(2.25 + 2.25) + 0.25 + 0.25 = 4.55
  //
  // Load: Fx = 100 kN and Fz = −1900 kN at (0.2, 0, 1.0) on the top of a 1.0 m cap:
  //   H = 100, V = 1900, M = z·Fx − x·Fz = 1.0·100 + 0.2·1900 = 480 kN·m (compresses +x).
  //
  // Solve: k·w = 1900/3.8 = 500.
  //   [0.2 0.9; 0.9 4.55]⁻¹ = (1/0.1)·[4.55 −0.9; −0.9 0.2] = [45.5 −9; −9 2]
  //   k·u = 45.5·100 − 9·480 = 230;  k·θ = −9·100 + 2·480 = 60.
  // Forces:
  //   N1 = (−230 + 3·(500 − 1.5·60))/√10 = 1000/√10 = 316.228 kN
  //   N2 = 500 − 0.5·60 = 470 kN;  N3 = 500 + 0.5·60 = 530 kN
  //   N4 = (230 + 3·(500 + 1.5·60))/√10 = 2000/√10 = 632.456 kN
  // Check: ΣN·s = (−316.228 + 632.456)/√10 = 100 ✓; ΣN·c = 0.94868·948.683 + 1000 = 1900 ✓;
  //        ΣN·c·x = 0.94868·1.5·316.228 + 0.5·60 = 450 + 30 = 480 ✓.
  // In cairn's axes: t_x = u, t_z = −w, r_y = θ (downward movement at x is −t_z + r_y·x).
  constexpr double k = 1e5;
  Project project = one_case_project(
      {pile_type("A", k)},
      {pile(-1.5, 0.0, 0, cairn::Batter{3.0, 180.0}), pile(-0.5, 0.0), pile(0.5, 0.0),
       pile(1.5, 0.0, 0, cairn::Batter{3.0, 0.0})},
      {});
  project.cap.thickness = 1.0;
  cairn::PointLoad column;
  column.at = {0.2, 0.0, 1.0};
  column.load = {100, 0, -1900, 0, 0, 0};
  project.load_cases[0].loads = {column};
  const CapSolution s = solve_project(project);
  // Source: hand calculation above (method: Hrennikoff 1949).
  CHECK(s.piles[0].axial == close(1000.0 / std::sqrt(10.0), 1e-9));
  CHECK(s.piles[1].axial == close(470.0, 1e-9));
  CHECK(s.piles[2].axial == close(530.0, 1e-9));
  CHECK(s.piles[3].axial == close(2000.0 / std::sqrt(10.0), 1e-9));
  CHECK(s.movement.translation[0] == close(230.0 / k, 1e-9));
  CHECK(s.movement.translation[2] == close(-500.0 / k, 1e-9));
  CHECK(s.movement.rotation[1] == close(60.0 / k, 1e-9));
  CHECK(s.movement.rotation[0] == close(0.0, 0.0, 1e-15));
  CHECK(s.movement.rotation[2] == close(0.0, 0.0, 1e-15));
}

// ---------------------------------------------------------------------------------------
// 3. Properties: equilibrium, superposition, combinations
// ---------------------------------------------------------------------------------------

namespace {

// A random group: 3–40 piles in a 10 m square, about half battered (1H:3V to 1H:12V, any
// direction), axial 5e4–1e6 kN/m, about half with lateral springs 1e3–5e4 kN/m.
std::vector<PileSpring> random_group(std::mt19937& random, bool some_compression_only) {
  std::uniform_int_distribution<int> count(3, 40);
  std::uniform_real_distribution<double> coordinate(-5.0, 5.0), unit(0.0, 1.0);
  const int n = count(random);
  std::vector<PileSpring> springs;
  for (int i = 0; i < n; ++i) {
    std::array<double, 3> axis = {0.0, 0.0, -1.0};
    if (unit(random) < 0.5) axis = batter_axis(3.0 + 9.0 * unit(random), 360.0 * unit(random));
    const double axial = 5e4 + (1e6 - 5e4) * unit(random);
    const double lateral = unit(random) < 0.5 ? 1e3 + 4.9e4 * unit(random) : 0.0;
    const bool tension = !(some_compression_only && unit(random) < 0.3);
    springs.push_back(spring(coordinate(random), coordinate(random), axial, lateral, tension, axis));
  }
  // At least two lateral springs so that Fx, Fy and Mz are always resisted.
  springs[0].lateral = std::max(springs[0].lateral, 1e4);
  springs[1].lateral = std::max(springs[1].lateral, 1e4);
  return springs;
}

Wrench random_load(std::mt19937& random) {
  std::uniform_real_distribution<double> force(-2000.0, 2000.0), moment(-5000.0, 5000.0);
  return {force(random), force(random), -5000.0 + force(random),
          moment(random), moment(random), moment(random)};
}

double largest_axial(const CapSolution& s) {
  double m = 0.0;
  for (const auto& p : s.piles) m = std::max(m, std::abs(p.axial));
  return m;
}

}  // namespace

TEST_CASE("cap_solver: random groups are in equilibrium with the load", "[cap_solver]") {
  // Cheap invariant (common practice): the pile forces sum to the applied load and balance
  // its moment about the cap origin. Rounding only, hence 1e-9 of the load.
  std::mt19937 random(20240611);
  for (int trial = 0; trial < 200; ++trial) {
    const auto springs = random_group(random, false);
    const CapSolver solver(springs);
    const Wrench load = random_load(random);
    INFO("trial " << trial << ", " << springs.size() << " piles");
    REQUIRE(solver.unresisted(load).empty());
    const CapSolution s = solver.solve_linear(load);
    check_equilibrium(springs, s, load, 5.0, 1e-9);
    CHECK(s.residual < 1e-9);
  }
}

TEST_CASE("cap_solver: linear solutions superpose", "[cap_solver]") {
  // Linearity of K·U = F: solve(a·F1 + b·F2) = a·solve(F1) + b·solve(F2), to rounding.
  std::mt19937 random(7);
  std::uniform_real_distribution<double> factor(-2.0, 2.0);
  for (int trial = 0; trial < 100; ++trial) {
    const auto springs = random_group(random, false);
    const CapSolver solver(springs);
    const Wrench f1 = random_load(random), f2 = random_load(random);
    const double a = factor(random), b = factor(random);
    Wrench combined{};
    for (std::size_t i = 0; i < 6; ++i) combined[i] = a * f1[i] + b * f2[i];
    const CapSolution s1 = solver.solve_linear(f1), s2 = solver.solve_linear(f2);
    const CapSolution direct = solver.solve_linear(combined);
    const CapSolution summed = solver.superpose({{&s1, a}, {&s2, b}}, combined);
    INFO("trial " << trial);
    const double scale = std::max({largest_axial(direct), largest_axial(s1), largest_axial(s2)});
    for (std::size_t i = 0; i < springs.size(); ++i) {
      CHECK(summed.piles[i].axial == close(direct.piles[i].axial, 0.0, 1e-9 * scale));
      CHECK(a * s1.piles[i].axial + b * s2.piles[i].axial ==
            close(direct.piles[i].axial, 0.0, 1e-9 * scale));
      CHECK(summed.piles[i].lateral == close(direct.piles[i].lateral, 0.0, 1e-9 * scale));
    }
    CHECK(summed.residual < 1e-9);
  }
}

TEST_CASE("cap_solver: solve_combinations agrees with solving each combination directly",
          "[cap_solver]") {
  // Superposing the load cases (and re-solving the ones that lift a pile) must give what a
  // direct solve of the combined load gives.
  std::mt19937 random(99);
  std::uniform_real_distribution<double> factor(0.0, 1.6), unit(0.0, 1.0);
  int redistributed = 0;
  for (int trial = 0; trial < 20; ++trial) {
    const auto springs = random_group(random, true);
    Project project;
    project.cap.thickness = kCapThickness;
    for (std::size_t i = 0; i < springs.size(); ++i) {
      project.pile_types.push_back(pile_type("T" + std::to_string(i), springs[i].axial,
                                             springs[i].lateral, springs[i].tension));
      project.piles.push_back(pile(springs[i].head[0], springs[i].head[1], i));
      // Batter toward the direction of the axis, ratio from its slope.
      const double horizontal = std::hypot(springs[i].axis[0], springs[i].axis[1]);
      if (horizontal > 0.0)
        project.piles.back().batter =
            cairn::Batter{-springs[i].axis[2] / horizontal,
                          std::atan2(springs[i].axis[1], springs[i].axis[0]) * 180.0 /
                              std::numbers::pi};
    }
    for (int c = 0; c < 4; ++c) {
      cairn::LoadCase lc;
      lc.id = "LC" + std::to_string(c);
      const Wrench w = random_load(random);
      lc.loads = {on_top(unit(random), unit(random), {w[0], w[1], w[2]}, {w[3], w[4], w[5]})};
      project.load_cases.push_back(lc);
    }
    for (int c = 0; c < 6; ++c) {
      cairn::Combination combination;
      combination.id = "C" + std::to_string(c);
      for (std::size_t lc = 0; lc < 4; ++lc)
        if (lc == 0 || unit(random) < 0.6) combination.factors.emplace_back(lc, factor(random));
      project.combinations.push_back(combination);
    }
    const CapSolver solver(cairn::pile_springs(project));
    REQUIRE(cairn::unresisted_cases(project, solver).empty());
    const auto solutions = cairn::solve_combinations(project, solver);
    REQUIRE(solutions.size() == project.combinations.size());
    for (std::size_t c = 0; c < solutions.size(); ++c) {
      INFO("trial " << trial << ", combination " << c);
      const Wrench load = cairn::combination_load(project, project.combinations[c]);
      const CapSolution direct = solver.solve(load);
      REQUIRE(solutions[c].overturns == direct.overturns);
      CHECK(solutions[c].dropped == direct.dropped);
      redistributed += direct.dropped.empty() ? 0 : 1;
      const double scale = std::max(1.0, largest_axial(direct));
      for (std::size_t i = 0; i < springs.size(); ++i)
        CHECK(solutions[c].piles[i].axial == close(direct.piles[i].axial, 0.0, 1e-9 * scale));
      if (!direct.overturns) check_equilibrium(solver.springs(), direct, load, 5.0, 1e-9);
    }
  }
  CHECK(redistributed > 0);  // the compression-only path was exercised
}

// ---------------------------------------------------------------------------------------
// 4. Compression-only piles
// ---------------------------------------------------------------------------------------

TEST_CASE("cap_solver: compression-only piles lift off and the rest carry the load",
          "[cap_solver][published]") {
  // Method: rigid cap on equal vertical springs that take no tension (common-practice
  // elastic formula; a lifted pile carries nothing and the formula is applied to the rest).
  constexpr double k = 2e5;
  SECTION("2x2 group: a biaxial eccentricity lifts the far corner") {
    // P = 1000 kN at (0.6, 0.6) on the cap top, piles at (±1, ±1).
    // Linear: R = P/4·(1 + 0.6·x + 0.6·y) → (−1,−1): −50 kN (tension), (1,1): 550 kN.
    // With (−1,−1) out, three piles are statically determinate:
    //   R_a + R_b + R_c = 1000, Σ R·x = R_a − R_b + R_c = 600, Σ R·y = −R_a + R_b + R_c = 600
    //   → R_c (1,1) = 600, R_a (1,−1) = R_b (−1,1) = 200 kN.
    // Plane through w = R/k: w = (200 + 200·x + 200·y)/k, so (−1,−1) rises by 200/k: it stays
    // out. In cairn's axes t_z = −200/k, r_y = 200/k, r_x = −200/k.
    const std::vector<PileSpring> springs = {spring(-1, -1, k, 0, false), spring(1, -1, k, 0, false),
                                             spring(-1, 1, k, 0, false), spring(1, 1, k, 0, false)};
    const CapSolver solver(springs);
    const Wrench load = {0, 0, -1000, 0.6 * -1000, -0.6 * -1000, 0};  // Mx = y·Fz, My = −x·Fz
    const CapSolution linear = solver.solve_linear(load);
    CHECK(linear.piles[0].axial == close(-50.0, 1e-9));
    CHECK(linear.piles[3].axial == close(550.0, 1e-9));
    CHECK(solver.needs_redistribution(linear));
    const CapSolution s = solver.solve(load);
    REQUIRE_FALSE(s.overturns);
    CHECK(s.dropped == std::vector<std::size_t>{0});
    CHECK_FALSE(s.piles[0].active);
    CHECK(s.piles[0].axial == 0.0);
    CHECK(s.piles[1].axial == close(200.0, 1e-9));
    CHECK(s.piles[2].axial == close(200.0, 1e-9));
    CHECK(s.piles[3].axial == close(600.0, 1e-9));
    CHECK(s.movement.translation[2] == close(-200.0 / k, 1e-9));
    CHECK(s.movement.rotation[0] == close(-200.0 / k, 1e-9));
    CHECK(s.movement.rotation[1] == close(200.0 / k, 1e-9));
    CHECK(s.iterations == 2);
    check_equilibrium(springs, s, load, 1.0, 1e-9);
  }
  SECTION("2x3 group: a moment lifts the row x = −1") {
    // Rows x = −1, 0, 1 of two piles (y = ±1); P = 1200 kN at x = 0.8 on the cap top.
    // Linear: R = P·(1/6 + 0.8·x/4) → row x = −1: 1200·(1/6 − 0.2) = −40 kN each.
    // Rows 0 and 1 left: the resultant at 0.8 splits by the lever rule, 0.2·P = 240 kN on
    // row 0 and 0.8·P = 960 kN on row 1: 120 and 480 kN a pile. Their line w(x) = (120 +
    // 360·x)/k is −240/k at x = −1: the lifted row stays out.
    const Project project = one_case_project({pile_type("C", k, 0.0, false)},
                                             grid({-1, 0, 1}, {-1, 1}),
                                             {on_top(0.8, 0, {0, 0, -1200})});
    const CapSolver solver(cairn::pile_springs(project));
    const CapSolution s = cairn::solve_combinations(project, solver)[0];
    REQUIRE_FALSE(s.overturns);
    CHECK(s.dropped == std::vector<std::size_t>{at(project, -1, -1), at(project, -1, 1)});
    for (double y : {-1.0, 1.0}) {
      CHECK(s.piles[at(project, 0, y)].axial == close(120.0, 1e-9));
      CHECK(s.piles[at(project, 1, y)].axial == close(480.0, 1e-9));
      CHECK(s.piles[at(project, -1, y)].axial == 0.0);
    }
    check_equilibrium(solver.springs(), s,
                      cairn::combination_load(project, project.combinations[0]), kCapThickness,
                      1e-9);
  }
  SECTION("a pile dropped in the first pass comes back") {
    // Piles at (0,0), (1,0), (2,0), (−1,−1), (1,2); P = 1000 kN at (−0.6, −0.8).
    // Linear (all five): x̄ = 0.6, ȳ = 0.2, Ixx = 4.8, Iyy = 5.2, Ixy = 2.4, det = 19.2;
    //   about the centroid My = 1000·(−1.2) = −1200, Mx = −1000·(−1.0) = 1000 kN·m;
    //   R = 200 − 175·x' − 120.833·y' → (2,0): −20.833 kN, (1,2): −87.5 kN: both drop first.
    // Final, with (1,2) out only: w = A + B·x + C·y over the four others,
    //   4A + 2B − C = 1000;  2A + 6B + C = −600;  −A + B + C = −800
    //   → B = 0, A = 66.667, C = −733.333: (0,0), (1,0), (2,0) carry 66.667 kN, (−1,−1) 800 kN;
    //   w(1,2) = 66.667 − 1466.667 < 0, so (1,2) stays out and (2,0) was re-admitted.
    const std::vector<PileSpring> springs = {spring(0, 0, k, 0, false), spring(1, 0, k, 0, false),
                                             spring(2, 0, k, 0, false), spring(-1, -1, k, 0, false),
                                             spring(1, 2, k, 0, false)};
    const CapSolver solver(springs);
    const Wrench load = {0, 0, -1000, -0.8 * -1000, 0.6 * -1000, 0};
    const CapSolution linear = solver.solve_linear(load);
    CHECK(linear.piles[2].axial == close(-20.8333333, 1e-7));
    CHECK(linear.piles[4].axial == close(-87.5, 1e-9));
    const CapSolution s = solver.solve(load);
    REQUIRE_FALSE(s.overturns);
    CHECK(s.dropped == std::vector<std::size_t>{4});
    CHECK(s.piles[0].axial == close(200.0 / 3.0, 1e-9));
    CHECK(s.piles[1].axial == close(200.0 / 3.0, 1e-9));
    CHECK(s.piles[2].axial == close(200.0 / 3.0, 1e-9));
    CHECK(s.piles[3].axial == close(800.0, 1e-9));
    CHECK(s.iterations >= 3);  // drop two, re-admit one, settle
    check_equilibrium(springs, s, load, 1.0, 1e-9);
  }
}

TEST_CASE("cap_solver: a resultant beyond the compression-only piles overturns the cap",
          "[cap_solver]") {
  // P at x = 1.2 lies outside the 2x2 group at x = ±1: no set of piles in compression can hold
  // it (the resultant must lie within the piles' reach; common practice).
  const std::vector<PileSpring> springs = {spring(-1, -1, 2e5, 0, false), spring(1, -1, 2e5, 0, false),
                                           spring(-1, 1, 2e5, 0, false), spring(1, 1, 2e5, 0, false)};
  const CapSolver solver(springs);
  const CapSolution s = solver.solve({0, 0, -1000, 0, -1.2 * -1000, 0});
  CHECK(s.overturns);
  CHECK(s.failure.rfind("the cap overturns:", 0) == 0);
  for (const auto& p : s.piles) CHECK(p.axial == 0.0);
}

TEST_CASE("cap_solver: with no pile in tension the compression-only solve is the linear one",
          "[cap_solver]") {
  const std::vector<PileSpring> springs = {spring(-1, -1, 2e5, 0, false), spring(1, -1, 2e5, 0, false),
                                           spring(-1, 1, 2e5, 0, false), spring(1, 1, 2e5, 0, false)};
  const CapSolver solver(springs);
  const Wrench load = {0, 0, -1000, 0.1 * -1000, -0.2 * -1000, 0};
  const CapSolution linear = solver.solve_linear(load);
  CHECK_FALSE(solver.needs_redistribution(linear));
  const CapSolution s = solver.solve(load);
  CHECK_FALSE(s.overturns);
  CHECK(s.dropped.empty());
  CHECK(s.iterations == 1);
  for (std::size_t i = 0; i < 4; ++i) CHECK(s.piles[i].axial == linear.piles[i].axial);
}

TEST_CASE("cap_solver: compression-only piles with lateral springs settle", "[cap_solver]") {
  // A dropped pile loses its lateral spring too, so a compression-only pile with one can
  // have no consistent state (out: the cap closes on it; in: its lateral spring pulls it
  // into tension). The iteration must still settle, in equilibrium. Random battered groups
  // of such piles under large overturning loads exercise this.
  std::mt19937 random(31);
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  int lifted = 0;
  for (int trial = 0; trial < 300; ++trial) {
    std::vector<PileSpring> springs;
    for (int i = -3; i <= 3; ++i)
      for (int j = -3; j <= 3; ++j) {
        const bool edge = std::abs(i) == 3 || std::abs(j) == 3;
        const auto axis = edge ? batter_axis(6.0, std::atan2(j, i) * 180.0 / std::numbers::pi)
                               : std::array<double, 3>{0.0, 0.0, -1.0};
        springs.push_back(spring(1.2 * i, 1.2 * j, 3e5, edge ? 1.5e4 : 2e4, !edge, axis));
      }
    const CapSolver solver(springs);
    const Wrench load = {2000 * (unit(random) - 0.5), 2000 * (unit(random) - 0.5), -8000,
                         30000 * (unit(random) - 0.5), 30000 * (unit(random) - 0.5),
                         2000 * (unit(random) - 0.5)};
    INFO("trial " << trial);
    CapSolution s;
    REQUIRE_NOTHROW(s = solver.solve(load));
    if (s.overturns) continue;
    lifted += s.dropped.empty() ? 0 : 1;
    check_equilibrium(springs, s, load, 3.6, 1e-9);
    for (std::size_t i = 0; i < springs.size(); ++i)
      if (!springs[i].tension) CHECK(s.piles[i].axial >= -1e-6);
  }
  CHECK(lifted > 0);
}

// ---------------------------------------------------------------------------------------
// 5. Loads nothing resists
// ---------------------------------------------------------------------------------------

TEST_CASE("cap_solver: vertical piles with no lateral stiffness cannot resist Fx or Mz",
          "[cap_solver]") {
  const CapSolver solver({spring(-1, -1, 2e5), spring(1, -1, 2e5), spring(-1, 1, 2e5),
                          spring(1, 1, 2e5)});
  SECTION("Fx, applied on the cap top (its moment My is resisted)") {
    const auto u = solver.unresisted({100, 0, 0, 0, kCapThickness * 100, 0});
    REQUIRE(u.size() == 1);
    CHECK(u[0].component == "Fx");
    CHECK(u[0].reason == "no battered piles and no lateral stiffness");
  }
  SECTION("Mz") {
    const auto u = solver.unresisted({0, 0, 0, 0, 0, 250});
    REQUIRE(u.size() == 1);
    CHECK(u[0].component == "Mz");
    CHECK(u[0].reason == "no battered piles and no lateral stiffness");
  }
  SECTION("a load with no Fx, Fy or Mz is resisted") {
    CHECK(solver.unresisted({0, 0, -1000, 300, -200, 0}).empty());
  }
  SECTION("the project-level check names the load case") {
    Project project = one_case_project({pile_type("V", 2e5)}, grid({-1, 1}, {-1, 1}),
                                       {on_top(0, 0, {0, 0, -1000})});
    cairn::LoadCase wind;
    wind.id = "W";
    wind.loads = {on_top(0, 0, {50, 0, 0})};
    project.load_cases.push_back(wind);
    const CapSolver project_solver(cairn::pile_springs(project));
    const auto cases = cairn::unresisted_cases(project, project_solver);
    REQUIRE(cases.size() == 1);
    CHECK(cases[0].load_case == 1);
    CHECK(cases[0].load.component == "Fx");
  }
}

// ---------------------------------------------------------------------------------------
// 6. Symmetry
// ---------------------------------------------------------------------------------------

TEST_CASE("cap_solver: a symmetric group under a centric load shares it equally",
          "[cap_solver]") {
  // Eight piles on a circle of radius 2 m, battered 1H:5V radially outward, compression-only.
  // Cheap invariant (common practice): symmetric layout + centric load → equal pile forces.
  const double pi = std::numbers::pi;
  for (double lateral : {0.0, 1e4}) {
    INFO("lateral stiffness " << lateral);
    std::vector<PileSpring> springs;
    for (int i = 0; i < 8; ++i) {
      const double angle = 45.0 * i;
      springs.push_back(spring(2 * std::cos(angle * pi / 180), 2 * std::sin(angle * pi / 180), 3e5,
                               lateral, false, batter_axis(5.0, angle)));
    }
    const CapSolver solver(springs);
    const Wrench load = {0, 0, -4000, 0, 0, 0};
    if (lateral == 0.0) REQUIRE(solver.unresisted(load).empty());
    const CapSolution s = solver.solve(load);
    REQUIRE_FALSE(s.overturns);
    for (const auto& p : s.piles) {
      CHECK(p.axial == close(s.piles[0].axial, 1e-9));
      CHECK(p.lateral == close(s.piles[0].lateral, 1e-9, 1e-9));
    }
    // Without lateral springs, statics alone: 8·N·cos α = 4000 with cos α = 5/√26,
    // N = 100·√26 kN.
    if (lateral == 0.0) CHECK(s.piles[0].axial == close(100.0 * std::sqrt(26.0), 1e-9));
    check_equilibrium(springs, s, load, 2.0, 1e-9);
  }
}

TEST_CASE("cap_solver: a solution that is not a number is refused, never reported",
          "[cap_solver]") {
  // A pile at 1e308 m overflows the stiffness (k·x² = inf) and the solve returns NaN forces.
  // NaN compares false with the equilibrium limit, so the check must be written to catch it:
  // an internal error, not a table of 'nan' utilizations.
  const Project project = one_case_project({pile_type("T", 3e5)}, {pile(0.0, 0.0), pile(1e308, 0.0)},
                                           {on_top(0.5, 0.0, {0.0, 0.0, -100.0})});
  const CapSolver solver(cairn::pile_springs(project));
  CHECK_THROWS_AS(cairn::solve_combinations(project, solver), std::logic_error);
}
