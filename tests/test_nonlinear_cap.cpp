// Tests for nonlinear_cap.hpp: the rigid cap on piles whose head response is nonlinear,
// solved by Newton iteration in load steps, and its pushover curve.
//
// The piles here are analytic head models given to the solver as its response function (the
// solver takes any; the project's piles use the beam-column on p-y curves): the linear head
// stiffness of pile_head.hpp, and a head whose lateral and axial forces saturate as
// P_u·tanh(k·s/P_u) (a smooth elastic–plastic spring with initial slope k and capacity P_u).
#include <catch2/catch.hpp>

#include <array>
#include <cmath>
#include <cstddef>
#include <random>
#include <sstream>
#include <string>
#include <vector>

#include "cairn/app/analysis.hpp"
#include "cairn/geotechnics/stiffness.hpp"
#include "cairn/solver/cap_solver.hpp"
#include "cairn/solver/head_forces.hpp"
#include "cairn/solver/nonlinear_cap.hpp"
#include "cairn/solver/pile_head.hpp"
#include "support.hpp"

using cairn::CapLoad;
using cairn::CapSolver;
using cairn::HeadMovement;
using cairn::NonlinearCapSolver;
using cairn::NonlinearGroup;
using cairn::PileHeadResponse;
using cairn::PileSpring;
using cairn::Wrench;
using cairn::test::batter_axis;
using cairn::test::close;

namespace {

// The linear head of pile_head.hpp as a response: action = K·(u, ω), tangent K.
NonlinearGroup linear_group(const std::vector<PileSpring>& springs) {
  NonlinearGroup g;
  std::vector<cairn::Matrix6Rows> k;
  for (const auto& s : springs) {
    g.heads.push_back(s.head);
    g.axes.push_back(s.axis);
    g.tension.push_back(true);
    k.push_back(cairn::head_stiffness_matrix(s.axis, s.axial, s.lateral, s.bending));
  }
  g.response = [k](std::size_t i, const HeadMovement& m, double) {
    PileHeadResponse r;
    r.converged = true;
    r.tangent = k[i];
    for (std::size_t a = 0; a < 6; ++a)
      for (std::size_t b = 0; b < 6; ++b) r.action[a] += k[i][a][b] * m[b];
    return r;
  };
  return g;
}

// Saturating springs at the head: axial N = Nu·tanh(ka·w/Nu) along a (w = a·u), lateral
// H = Hu·tanh(kl·s/Hu) along the head's deflection across the axis (s = |u⊥|), scaled by the
// p-multiplier; plus the linear bending terms of `bending` (fixed heads). The tangent is the
// exact derivative.
struct SaturatingPile {
  std::array<double, 3> head, axis;
  double ka, axial_capacity, kl, lateral_capacity;
  cairn::HeadBending bending{};
};

NonlinearGroup saturating_group(const std::vector<SaturatingPile>& piles) {
  NonlinearGroup g;
  for (const auto& p : piles) {
    g.heads.push_back(p.head);
    g.axes.push_back(p.axis);
    g.tension.push_back(true);
  }
  g.response = [piles](std::size_t i, const HeadMovement& m, double pm) {
    const SaturatingPile& p = piles[i];
    const auto& a = p.axis;
    PileHeadResponse r;
    r.converged = true;
    const double w = a[0] * m[0] + a[1] * m[1] + a[2] * m[2];
    std::array<double, 3> perp{};
    for (std::size_t j = 0; j < 3; ++j) perp[j] = m[j] - w * a[j];
    const double s = std::sqrt(perp[0] * perp[0] + perp[1] * perp[1] + perp[2] * perp[2]);
    const double nu = p.axial_capacity, hu = pm * p.lateral_capacity, kl = pm * p.kl;
    const double n = nu * std::tanh(p.ka * w / nu);
    const double dn = p.ka / std::pow(std::cosh(p.ka * w / nu), 2);
    const double h = hu * std::tanh(kl * s / hu);
    const double dh = kl / std::pow(std::cosh(kl * s / hu), 2);
    const double secant = s > 0.0 ? h / s : kl;  // H/s → k as s → 0
    for (std::size_t j = 0; j < 3; ++j) {
      r.action[j] = n * a[j] + secant * perp[j];
      for (std::size_t l = 0; l < 3; ++l) {
        const double aa = a[j] * a[l], pp = (j == l ? 1.0 : 0.0) - aa;
        const double ee = s > 0.0 ? perp[j] * perp[l] / (s * s) : 0.0;
        r.tangent[j][l] = dn * aa + secant * (pp - ee) + (s > 0.0 ? dh : kl) * ee;
      }
    }
    // Bending terms, linear.
    const cairn::Matrix6Rows kb = cairn::head_stiffness_matrix(a, 0.0, 0.0, p.bending);
    for (std::size_t j = 0; j < 6; ++j)
      for (std::size_t l = 0; l < 6; ++l) {
        r.action[j] += kb[j][l] * m[l];
        r.tangent[j][l] += kb[j][l];
      }
    return r;
  };
  return g;
}

// A fixed head on Hetényi's long pile: EI = 2e5 kN·m², k = 2e4 kN/m² (a 0.6 m pile in
// medium soil, invented for the test).
cairn::RestrainedHead fixed_head() {
  return cairn::restrained_head(cairn::hetenyi_long_pile(2e5, 2e4),
                                {cairn::HeadRestraint::Kind::fixed, 0.0});
}

}  // namespace

TEST_CASE("nonlinear cap on linear heads equals the linear rigid-cap solution", "[nonlinear_cap]") {
  // A battered, fixed-head, unsymmetric group of five piles, far enough from the origin to
  // need the reference point.
  const auto head = fixed_head();
  std::vector<PileSpring> springs;
  const std::vector<std::array<double, 4>> layout = {  // x, y, batter ratio (0: plumb), toward°
      {100.0, 50.0, 0.0, 0.0}, {103.0, 50.0, 4.0, 0.0}, {100.0, 52.5, 5.0, 90.0},
      {104.5, 53.0, 3.0, 225.0}, {101.0, 55.0, 0.0, 0.0}};
  for (const auto& [x, y, ratio, toward] : layout) {
    PileSpring s;
    s.head = {x, y, 0.0};
    s.axis = ratio > 0.0 ? batter_axis(ratio, toward) : std::array<double, 3>{0.0, 0.0, -1.0};
    s.axial = 2.0e5 + 1.0e4 * x - 1.0e6;  // unequal piles
    s.lateral = head.lateral;
    s.bending = head.bending;
    s.bending.torsional = 5e3;
    springs.push_back(s);
  }
  const CapSolver linear(springs);
  const NonlinearCapSolver nonlinear(linear_group(springs));
  const Wrench load = {120.0, -80.0, -3000.0, 400.0, -650.0, 90.0};
  const auto expected = linear.solve_linear(load);
  const auto got = nonlinear.solve(nonlinear.from_origin(load), {}, "C1");
  REQUIRE_FALSE(got.solution.overturns);
  // The same stiffness-weighted centroid (the linear solver's elastic centre).
  for (std::size_t j = 0; j < 3; ++j)
    CHECK(nonlinear.reference()[j] == close(linear.reference()[j], 1e-12));
  // The issue's verification "matches the linear one at small loads": linear curves make
  // Newton's first step exact; 1e-6 relative (hand derivation: the same equations).
  for (std::size_t j = 0; j < 3; ++j) {
    CHECK(got.solution.movement.rotation[j] == close(expected.movement.rotation[j], 1e-6, 1e-14));
    CHECK(got.solution.movement.translation_at_reference[j] ==
          close(expected.movement.translation_at_reference[j], 1e-6, 1e-12));
  }
  for (std::size_t i = 0; i < springs.size(); ++i) {
    CHECK(got.solution.piles[i].axial == close(expected.piles[i].axial, 1e-6, 1e-6));
    CHECK(got.solution.piles[i].lateral == close(expected.piles[i].lateral, 1e-6, 1e-6));
    CHECK(got.solution.piles[i].head_moment == close(expected.piles[i].head_moment, 1e-6, 1e-6));
    for (std::size_t j = 0; j < 6; ++j)
      CHECK(got.solution.piles[i].head_forces[j] ==
            close(expected.piles[i].head_forces[j], 1e-6, 1e-6));
  }
  CHECK(got.reached == 1.0);
}

TEST_CASE("nonlinear cap: the head actions balance the load to 1e-9 on random fixed-head groups",
          "[nonlinear_cap]") {
  // Statics of the cap's free body (hand derivation): Σ (p − o) × F + M over the heads equals
  // the applied resultant about o, here the origin and the solver's reference point.
  std::mt19937 random(15);
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  const auto head = fixed_head();
  for (int trial = 0; trial < 10; ++trial) {
    std::vector<SaturatingPile> piles;
    std::vector<PileSpring> springs;
    const int n = 3 + trial % 6;
    for (int i = 0; i < n; ++i) {
      SaturatingPile p;
      p.head = {500.0 + 6.0 * unit(random), 300.0 + 6.0 * unit(random), 0.0};
      p.axis = unit(random) < 0.5 ? std::array<double, 3>{0.0, 0.0, -1.0}
                                  : batter_axis(3.0 + 3.0 * unit(random), 360.0 * unit(random));
      p.ka = 3e5 * (0.5 + unit(random));
      p.axial_capacity = 2500.0;
      p.kl = head.lateral;
      p.lateral_capacity = 300.0;
      p.bending = head.bending;
      piles.push_back(p);
      springs.push_back({p.head, p.axis, p.ka, p.kl, true});
    }
    const NonlinearCapSolver solver(saturating_group(piles));
    // The load at a point among the heads, 1.5 m up (the top of a cap), about the origin:
    // M₀ = M + q × F.
    const std::array<double, 3> f = {150.0 * unit(random), -150.0 * unit(random), -400.0 * n};
    const std::array<double, 3> q = {502.0 + 2.0 * unit(random), 302.0 + 2.0 * unit(random), 1.5};
    const std::array<double, 3> m = {-100.0 * n, 200.0, 50.0};
    const Wrench load = {f[0], f[1], f[2], m[0] + q[1] * f[2] - q[2] * f[1],
                         m[1] + q[2] * f[0] - q[0] * f[2], m[2] + q[0] * f[1] - q[1] * f[0]};
    const CapLoad about_c = solver.from_origin(load);
    const auto got = solver.solve(about_c, {}, "R");
    INFO(got.solution.failure);
    REQUIRE_FALSE(got.solution.overturns);
    CHECK(got.solution.residual <= 1e-10);
    const auto origin = cairn::head_balance(springs, got.solution, load);
    CHECK(origin.relative <= 1e-9);
    const auto at_c = cairn::head_balance(springs, got.solution, about_c.about_reference,
                                          solver.reference());
    CHECK(at_c.relative <= 1e-9);
  }
}

TEST_CASE("nonlinear cap: a symmetric four-pile group under a vertical load carries P/n each",
          "[nonlinear_cap]") {
  // Hand derivation: by symmetry the cap settles without rotating and each pile takes P/4,
  // whatever the (equal) piles' load–settlement curve; the settlement is the w of
  // Nu·tanh(ka·w/Nu) = P/4.
  std::vector<SaturatingPile> piles;
  for (const auto& [x, y] : std::vector<std::array<double, 2>>{{-1.5, -1.5}, {1.5, -1.5}, {1.5, 1.5}, {-1.5, 1.5}})
    piles.push_back({{x, y, 0.0}, {0.0, 0.0, -1.0}, 2e5, 1500.0, 1e4, 200.0});
  const NonlinearCapSolver solver(saturating_group(piles));
  const double p = 4000.0;  // 4 × 1000 kN of 1500 kN capacity: well into the curve
  const auto got = solver.solve(CapLoad({0.0, 0.0, -p, 0.0, 0.0, 0.0}), {}, "D");
  REQUIRE_FALSE(got.solution.overturns);
  for (const auto& pile : got.solution.piles) {
    CHECK(pile.axial == close(p / 4.0, 1e-9));
    CHECK(pile.head_forces[2] == close(-p / 4.0, 1e-9));
  }
  const double settlement = 1500.0 / 2e5 * std::atanh(1000.0 / 1500.0);
  CHECK(-got.solution.movement.translation_at_reference[2] == close(settlement, 1e-9));
  for (double r : got.solution.movement.rotation) CHECK(r == close(0.0, 1e-9, 1e-14));
}

TEST_CASE("nonlinear cap: a lateral load above the group's capacity finds no equilibrium",
          "[nonlinear_cap]") {
  // Pinned plumb piles resist a horizontal load only across their axes, each at most Hu:
  // the group's capacity is n·Hu (hand derivation: the sum of the piles' ultimate shears).
  std::vector<SaturatingPile> piles;
  for (const auto& [x, y] : std::vector<std::array<double, 2>>{{-1.5, -1.5}, {1.5, -1.5}, {1.5, 1.5}, {-1.5, 1.5}})
    piles.push_back({{x, y, 0.0}, {0.0, 0.0, -1.0}, 2e5, 1500.0, 1e4, 200.0});
  const NonlinearCapSolver solver(saturating_group(piles));
  SECTION("below capacity each pile takes H/n") {
    const auto got = solver.solve(CapLoad({600.0, 0.0, -2000.0, 0.0, 0.0, 0.0}), {}, "W");
    REQUIRE_FALSE(got.solution.overturns);
    for (const auto& pile : got.solution.piles) CHECK(pile.lateral == close(150.0, 1e-9));
    // Head deflection from H = Hu·tanh(k·y/Hu).
    CHECK(got.piles[0].head_deflection == close(200.0 / 1e4 * std::atanh(0.75), 1e-8));
  }
  SECTION("above capacity: the message, no numbers") {
    const auto got = solver.solve(CapLoad({900.0, 0.0, -2000.0, 0.0, 0.0, 0.0}), {}, "W-ULT");
    CHECK(got.solution.overturns);
    CHECK(cairn::test::has(got.solution.failure, "no equilibrium"));
    CHECK(cairn::test::has(got.solution.failure, "combination 'W-ULT'"));
    CHECK(cairn::test::has(got.solution.failure, "mechanism"));
    // It was carried up to the capacity: λ = 800/900 at most.
    CHECK(got.reached < 800.0 / 900.0);
    CHECK(got.reached > 0.8);
  }
  SECTION("p-multipliers scale the capacity of each pile") {
    // Multipliers 1, 1, 0.5, 0.5: capacity 2·200 + 2·100 = 600 kN (hand derivation).
    const auto ok = solver.solve(CapLoad({560.0, 0.0, -2000.0, 0.0, 0.0, 0.0}), {1.0, 1.0, 0.5, 0.5}, "W");
    CHECK_FALSE(ok.solution.overturns);
    CHECK(ok.piles[2].p_multiplier == 0.5);
    const auto failed = solver.solve(CapLoad({620.0, 0.0, -2000.0, 0.0, 0.0, 0.0}), {1.0, 1.0, 0.5, 0.5}, "W");
    CHECK(failed.solution.overturns);
  }
}

TEST_CASE("nonlinear cap: the pushover curve rises to the group's capacity", "[nonlinear_cap]") {
  std::vector<SaturatingPile> piles;
  for (const auto& [x, y] : std::vector<std::array<double, 2>>{{-1.5, -1.5}, {1.5, -1.5}, {1.5, 1.5}, {-1.5, 1.5}})
    piles.push_back({{x, y, 0.0}, {0.0, 0.0, -1.0}, 2e5, 1500.0, 1e4, 200.0});
  const NonlinearCapSolver solver(saturating_group(piles));
  // 400 kN horizontal: capacity 800 kN, so λ → 2 (hand derivation as above).
  const auto curve = solver.pushover(CapLoad({0.0, 400.0, -2000.0, 0.0, 0.0, 0.0}), {}, "W",
                                     cairn::PushoverLimits{});
  CHECK(curve.mechanism);
  CHECK(curve.capacity_factor > 1.9);
  CHECK(curve.capacity_factor <= 2.0);  // tanh reaches 1 in double precision
  CHECK(curve.direction[1] == 1.0);
  REQUIRE(curve.points.size() >= 8);
  CHECK(curve.points.front().load_factor == 0.0);
  for (std::size_t k = 1; k < curve.points.size(); ++k) {
    CHECK(curve.points[k].load_factor > curve.points[k - 1].load_factor);
    CHECK(curve.points[k].displacement > curve.points[k - 1].displacement);
    CHECK(curve.points[k].load == close(400.0 * curve.points[k].load_factor, 1e-12));
  }
  // At λ = 1 each pile carries 100 kN: y = Hu/k·atanh(0.5) (the curve's own point).
  CHECK(curve.points[4].load_factor == 1.0);
  CHECK(curve.points[4].displacement == close(200.0 / 1e4 * std::atanh(0.5), 1e-8));
  SECTION("a displacement limit stops it first") {
    cairn::PushoverLimits limits;
    limits.displacement = 0.02;
    const auto short_curve = solver.pushover(CapLoad({0.0, 400.0, -2000.0, 0.0, 0.0, 0.0}), {}, "W", limits);
    CHECK_FALSE(short_curve.mechanism);
    CHECK(short_curve.points.back().displacement >= 0.02);
    CHECK(cairn::test::has(short_curve.end_reason, "displacement limit"));
  }
}

TEST_CASE("nonlinear check on linear heads gives the linear check's pile forces",
          "[nonlinear_cap]") {
  // The whole pipeline (analyse) with soil_response nonlinear and each pile's response the
  // linear head of its springs: every combination's forces equal the linear run's, which
  // superposes load cases and solves once (hand derivation: the same equations). Fixed and
  // partially fixed heads, two battered piles, loads high above the cap.
  const std::string file = std::string(CAIRN_TEST_DATA) + "/bending/fixed_heads.yaml";
  const cairn::CheckRun linear = cairn::analyse_project(file);
  cairn::AnalysisOptions options;
  options.soil_response = cairn::SoilResponse::nonlinear;
  options.nonlinear_piles = [&linear](const cairn::Project& project) {
    return linear_group(cairn::pile_springs(project, linear.stiffness));
  };
  const cairn::CheckRun nonlinear = cairn::analyse_project(file, options);
  REQUIRE(nonlinear.nonlinear);
  REQUIRE_FALSE(linear.nonlinear);
  const auto& a = linear.results.combinations;
  const auto& b = nonlinear.results.combinations;
  REQUIRE(a.size() == b.size());
  for (std::size_t c = 0; c < a.size(); ++c) {
    REQUIRE_FALSE(b[c].solution.overturns);
    CHECK(b[c].solution.residual <= 1e-10);
    for (std::size_t i = 0; i < a[c].piles.size(); ++i) {
      CHECK(b[c].piles[i].axial == close(a[c].piles[i].axial, 1e-6, 1e-6));
      CHECK(b[c].piles[i].lateral == close(a[c].piles[i].lateral, 1e-6, 1e-6));
      CHECK(b[c].piles[i].utilization == close(a[c].piles[i].utilization, 1e-6, 1e-9));
      for (std::size_t j = 0; j < 6; ++j)
        CHECK(b[c].solution.piles[i].head_forces[j] ==
              close(a[c].solution.piles[i].head_forces[j], 1e-6, 1e-6));
    }
  }
  // The multipliers of the run are reported (this group's rows by the wind's direction).
  CHECK(nonlinear.nonlinear->combinations[0].piles.size() == nonlinear.project.piles.size());
  REQUIRE(nonlinear.nonlinear->pushover);
  CHECK(nonlinear.nonlinear->pushover->points.size() >= 5);
}

TEST_CASE("nonlinear check on the soil's curves: the governing piles' profiles", "[nonlinear_cap]") {
  // The SI cap of the end-to-end cases: the profiles handed to the report belong to the
  // piles and combinations they are named for, and agree with the pile rows (the same
  // pile solved at the same head movement: consistency).
  const cairn::CheckRun run =
      cairn::analyse_project(std::string(CAIRN_TEST_DATA) + "/nonlinear/lateral_si.yaml");
  REQUIRE(run.nonlinear);
  const auto& nl = *run.nonlinear;
  REQUIRE_FALSE(nl.profiles.empty());
  CHECK(nl.profiles.front().why == "largest utilization");
  CHECK(nl.profiles.front().pile == *run.results.summary.pile);
  for (const auto& p : nl.profiles) {
    REQUIRE(p.profile.converged);
    const auto& row = nl.combinations[p.combination].piles[p.pile];
    CHECK(p.profile.max_moment == close(row.max_moment, 1e-9));
    CHECK(p.profile.head_deflection == close(row.head_deflection, 1e-9));
    CHECK(p.profile.depth.size() == p.profile.moment.size());
  }
  REQUIRE(nl.pushover);
  CHECK(nl.pushover->combination == "U1");
  // The streamed JSON is the document tree written piece by piece (report.hpp), nonlinear
  // members included, at every detail.
  for (const auto detail : {cairn::Detail::full, cairn::Detail::envelope, cairn::Detail::summary}) {
    cairn::CheckReport report = cairn::make_check_report(run, "check", std::nullopt);
    report.detail = detail;
    std::ostringstream streamed;
    cairn::write_check(report, cairn::Format::json, streamed);
    CHECK(streamed.str() == cairn::check_json(report).dump(2) + "\n");
    const auto doc = cairn::check_json(report);
    CHECK(doc["analysis"]["soil_response"] == "nonlinear");
    if (detail == cairn::Detail::full)
      CHECK(doc["combinations"][0]["piles"][0].contains("p_multiplier"));
  }
  // Each combination converged to the tolerance, and the heads balance the load about the
  // origin to 1e-9 (statics of the cap's free body, head_balance).
  const auto springs = cairn::pile_springs(run.project);
  for (const auto& cc : run.results.combinations) {
    CHECK(cc.solution.residual <= 1e-10);
    const auto balance = cairn::head_balance(
        springs, cc.solution,
        cairn::combination_load(run.project, run.project.combinations[cc.combination]));
    CHECK(balance.relative <= 1e-9);
  }
}
