// The as-built survey's factors in a nonlinear run (analysis.hpp, TypeAdjustments; the curves
// scaled by scaled_curves, pile_soil_curves.hpp): a damaged pile's p-y, t-z and Q-z curves
// keep the share stiffness_factor of their resistance at every movement, as its springs do in
// a linear run. Checked against the rule itself, against the linear check with the same
// factors where the piles' head stiffness is proportional to the soil's (rigid piles: hand
// derivation below), and on a symmetric group. Soil data are invented.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <string>

#include <fmt/format.h>

#include "cairn/app/analysis.hpp"
#include "cairn/geotechnics/pile_soil_curves.hpp"
#include "cairn/input/input.hpp"
#include "cairn/input/survey_csv.hpp"
#include "cairn/site/as_built.hpp"
#include "nonlinear_support.hpp"
#include "support.hpp"

using cairn::test::close;

namespace {

const std::string kData = CAIRN_TEST_DATA;

// A 2×2 group of pinned piles 1.8 m apart (types P and Q, the same piles: Q is the one a
// survey can damage on its own) in one clay layer; `type` is the rest of each pile type's map.
std::string group_text(const std::string& type, const std::string& analysis) {
  std::string types;
  for (const char* id : {"P", "Q"})
    types += fmt::format(R"(  {}:
    section: {{shape: round, diameter: 0.6}}
    length: 5
    elastic_modulus: 3.0e7
    tip_method: meyerhof
    shaft_method: {{clay: alpha-api}}
    capacity: {{compression: 50000, tension: 50000, lateral: 50000}}
    {}
)",
                         id, type);
  return R"(title: Nonlinear as built
units: SI
cap: {thickness: 1.5, depth: 0.0}
soil:
  layers:
    - {name: clay, kind: clay, thickness: 40, unit_weight: 18, undrained_strength: 50, lateral_curve: soft_clay}
pile_types:
)" + types +
         R"(piles:
  - {id: A1, x: -0.9, y: -0.9, type: P}
  - {id: A2, x: 0.9, y: -0.9, type: P}
  - {id: B1, x: -0.9, y: 0.9, type: P}
  - {id: B2, x: 0.9, y: 0.9, type: Q}
load_cases:
  D: {kind: dead, loads: [{at: [0.3, 0.2, 0.0], Fx: 120, Fy: -50, Fz: -1200}]}
combinations:
  S1: {limit_state: service, factors: {D: 1.0}}
analysis: {)" +
         analysis + R"(}
)";
}

// Rigid piles on linear curves (hand derivation, statics of a rigid pile in a soil of
// modulus k = kh·b per unit length): a pinned head moved y₀ turns the pile by θ so that the
// soil's moment about the head vanishes, ∫k(y₀ + θz)z dz = 0 → θ = −3y₀/(2L), and the head
// force is H = ∫k(y₀ + θz)dz = k·L·y₀/4; axially a rigid bar on a tip spring k_Q. Both are
// proportional to the soil's modulus, so soil × f is head stiffness × f exactly.
constexpr double kSoil = 1.2e5;  // k = kh·b, kN/m² (kh = 2e5 kN/m³, b = 0.6 m)
constexpr double kLength = 5.0;  // m
constexpr double kTip = 4.0e5;   // k_Q, kN/m
constexpr double kLateral = kSoil * kLength / 4.0;  // 1.5e5 kN/m

void rigid_on_linear_curves(cairn::NonlinearPileSpec& s) {
  s.curves.lateral = [](double, double y) { return kSoil * y; };
  s.curves.shaft = [](double, double) { return 0.0; };
  s.curves.tip = [](double w) { return w > 0.0 ? kTip * w : 0.0; };
  s.bending_stiffness = 1.0e11;  // EI/(k·L⁴) ≈ 1e3: rigid to 1e-3
  s.axial_rigidity = 1.0e12;
}

const cairn::PileCheck& row(const cairn::CheckRun& run, std::size_t pile) {
  return run.results.combinations.at(0).piles.at(pile);
}

}  // namespace

TEST_CASE("nonlinear as built: scaled curves are the curves times the factor",
          "[nonlinear_as_built]") {
  const cairn::Project project = cairn::read_project(kData + "/nonlinear/lateral_si.yaml");
  const cairn::NonlinearPileSpec spec = cairn::nonlinear_pile_spec(project, 0);
  const cairn::PileCurves same = cairn::scaled_curves(spec.curves, 1.0);
  const cairn::PileCurves damaged = cairn::scaled_curves(spec.curves, 0.6);
  for (const double z : {0.5, 4.0, 12.0})
    for (const double y : {-0.02, 0.001, 0.01, 0.2}) {
      CAPTURE(z, y);
      // The rule (docs/methods-nonlinear.md §7): p_f = f·p, t_f = f·t, Q_f = f·Q.
      CHECK(same.lateral(z, y) == spec.curves.lateral(z, y));
      CHECK(damaged.lateral(z, y) == close(0.6 * spec.curves.lateral(z, y), 1e-15, 1e-12));
      CHECK(damaged.shaft(z, y) == close(0.6 * spec.curves.shaft(z, y), 1e-15, 1e-12));
      CHECK(damaged.tip(y) == close(0.6 * spec.curves.tip(y), 1e-15, 1e-12));
    }
  CHECK(same.description == spec.curves.description);
  CHECK(cairn::test::has(damaged.description, "p, t and Q × 0.6 (as built: stiffness_factor)"));
}

TEST_CASE("nonlinear as built: a damaged pile is its sound self scaled by the factor",
          "[nonlinear_as_built]") {
  // The pile and its soil scaled together (EI, EA, k_t, k_r and every p, t, Q by f): the
  // beam-column's equations, EI·y⁗ − (N·y′)′ + p(y) = 0 with the bar's EA·w″ = t(w), are
  // homogeneous in the stiffnesses, so the same deflected shape carries f times every force
  // (the axial force N of the P-Δ term included): hand derivation from the equations of
  // docs/methods-nonlinear.md §1. A long flexible fixed-head pile (not the rigid pile of the
  // test below: here the soil alone scaled would give f^¾ laterally, Hetényi 1946), moved far
  // enough to reach its curves' nonlinear range.
  const cairn::Project project = cairn::read_project(kData + "/nonlinear/lateral_si.yaml");
  const cairn::NonlinearPileSpec sound = cairn::nonlinear_pile_spec(project, 0);
  const double f = 0.45;
  const cairn::NonlinearPileSpec damaged = cairn::scaled_pile(sound, f);
  CHECK(damaged.bending_stiffness == close(f * sound.bending_stiffness, 1e-15));
  CHECK(cairn::test::has(damaged.curves.description, "× 0.45 (as built: stiffness_factor)"));
  for (const cairn::HeadMovement& m :
       {cairn::HeadMovement{0.004, -0.002, 0.003, 0.0, 0.0, 0.0},
        cairn::HeadMovement{0.03, 0.01, 0.008, 0.001, -0.002, 0.0005}}) {
    const cairn::PileHeadResponse a = cairn::pile_head_response(sound, m, 0.7);
    const cairn::PileHeadResponse b = cairn::pile_head_response(damaged, m, 0.7);
    REQUIRE(a.converged);
    REQUIRE(b.converged);
    double largest = 0.0;
    for (const double v : a.action) largest = std::max(largest, std::abs(v));
    for (std::size_t k = 0; k < 6; ++k) {
      CAPTURE(k);
      CHECK(b.action[k] == close(f * a.action[k], 1e-7, 1e-9 * largest));
    }
  }
  CHECK(cairn::scaled_pile(sound, 1.0).bending_stiffness == sound.bending_stiffness);
}

TEST_CASE("nonlinear as built: stiffness and capacity factors of 1 change nothing",
          "[nonlinear_as_built]") {
  const std::string file = kData + "/nonlinear/lateral_si.yaml";
  const cairn::CheckRun plain = cairn::analyse_project(file);
  cairn::TypeAdjustments ones;
  ones.stiffness_factor = {1.0};
  ones.capacity_factor = {1.0};
  const cairn::CheckRun adjusted = cairn::analyse(cairn::read_project(file), ones);
  REQUIRE(adjusted.nonlinear);
  for (std::size_t c = 0; c < plain.results.combinations.size(); ++c)
    for (std::size_t i = 0; i < plain.project.piles.size(); ++i) {
      CAPTURE(c, i);
      const auto& a = plain.results.combinations[c].piles[i];
      const auto& b = adjusted.results.combinations[c].piles[i];
      // The same computation: the same bits.
      CHECK(b.axial == a.axial);
      CHECK(b.lateral == a.lateral);
      CHECK(b.utilization == a.utilization);
      CHECK(adjusted.nonlinear->combinations[c].piles[i].head_deflection ==
            plain.nonlinear->combinations[c].piles[i].head_deflection);
    }
  CHECK(adjusted.nonlinear->curves == plain.nonlinear->curves);
}

TEST_CASE(
    "nonlinear as built: a damaged pile on linear curves equals the linear check with "
    "its springs times the factor",
    "[nonlinear_as_built]") {
  // The linear check takes the rigid piles' head springs (kL/4 laterally, k_Q axially, hand
  // derivation above) typed in; the nonlinear one the same piles as beam-columns on the
  // curves. Pile B2 (type Q) keeps 0.5 of its stiffness and 0.8 of its capacity in both.
  const std::string springs =
      fmt::format("axial_stiffness: {}\n    lateral_stiffness: {}", kTip, kLateral);
  const std::string linear_path = cairn::test::write_project_file(
      group_text(springs, "soil_response: linear"), "nl-as-built-linear");
  const std::string nonlinear_path = cairn::test::write_project_file(
      group_text(springs, "soil_response: nonlinear, p_multipliers: none, pushover_limit: 1"),
      "nl-as-built-nonlinear");
  cairn::TypeAdjustments damaged;
  damaged.stiffness_factor = {1.0, 0.5};
  damaged.capacity_factor = {1.0, 0.8};
  cairn::AnalysisOptions options;
  options.nonlinear_pile_change = rigid_on_linear_curves;
  for (const auto& adjust : {cairn::TypeAdjustments{}, damaged}) {
    const bool is_damaged = !adjust.stiffness_factor.empty();
    CAPTURE(is_damaged);
    const cairn::CheckRun linear = cairn::analyse(cairn::read_project(linear_path), adjust);
    const cairn::CheckRun nonlinear =
        cairn::analyse(cairn::read_project(nonlinear_path), adjust, options);
    REQUIRE(nonlinear.nonlinear);
    REQUIRE_FALSE(nonlinear.results.combinations.at(0).solution.overturns);
    for (std::size_t i = 0; i < 4; ++i) {
      CAPTURE(i);
      // Rigid to 1e-3 (EI against k·L⁴), P-Δ N/(k·L²) ≈ 1e-4, the soil lumped at 60 nodes
      // (trapezoid rule on z², 5e-5): 2e-3 of the force.
      CHECK(row(nonlinear, i).axial == close(row(linear, i).axial, 2e-3, 0.05));
      CHECK(row(nonlinear, i).lateral == close(row(linear, i).lateral, 2e-3, 0.05));
      // The capacity factor scales the resistance in both: the same utilization.
      CHECK(row(nonlinear, i).utilization == close(row(linear, i).utilization, 2e-3, 1e-6));
    }
    if (is_damaged)
      CHECK(cairn::test::has(nonlinear.nonlinear->curves.at(1),
                             "× 0.5 (as built: stiffness_factor)"));
  }
  // And the damage matters: B2 sheds load to the others. Under a centric load alone a
  // square of four springs with one halved gives that pile P/5 instead of P/4 (hand
  // derivation: symmetry about the diagonal through it, w = a + b·(x + y), a = 6b, 20b = P),
  // 0.8 of its share; this load is eccentric and lateral too, so the test asks for less
  // than 0.9 of it.
  const cairn::CheckRun sound = cairn::analyse(cairn::read_project(nonlinear_path), {}, options);
  const cairn::CheckRun weak =
      cairn::analyse(cairn::read_project(nonlinear_path), damaged, options);
  CHECK(row(weak, 3).axial < 0.9 * row(sound, 3).axial);
  CHECK(row(weak, 3).lateral < 0.9 * row(sound, 3).lateral);
}

TEST_CASE(
    "nonlinear as built: a damaged pile of a symmetric group takes less load, through "
    "the survey",
    "[nonlinear_as_built]") {
  // The six-pile cap on soft clay over sand (its own curves from the file), wind along x: A2
  // (0, −0.8) and B2 (0, 0.8) are mirror images about the load's line, so as designed they
  // carry the same (symmetry, common practice). The survey damages B2 (stiffness 0.5,
  // capacity 0.7): it must carry less than A2 in every combination, on nonlinear soil as on
  // linear springs.
  const std::string file = kData + "/nonlinear/lateral_si.yaml";
  const cairn::Project design = cairn::read_project(file);
  const std::string survey_text =
      "pile,x,y,status,stiffness_factor,capacity_factor\n"
      "A1,-1.6,-0.8,accepted,,\nA2,0.0,-0.8,accepted,,\nA3,1.6,-0.8,accepted,,\n"
      "B1,-1.6,0.8,accepted,,\nB2,0.0,0.8,damaged,0.5,0.7\nB3,1.6,0.8,accepted,,\n";
  cairn::Diagnostics problems;
  const cairn::Survey survey =
      cairn::read_survey_csv(survey_text, "survey.csv", cairn::UnitSystem::SI, problems);
  REQUIRE(problems.empty());
  const cairn::AsBuiltProject model =
      cairn::build_as_built(design, survey, "", cairn::default_tolerances(cairn::UnitSystem::SI));
  const cairn::CheckRun as_designed = cairn::analyse_project(file);
  const cairn::CheckRun as_built = cairn::analyse(model.project, model.adjust);
  REQUIRE(as_built.nonlinear);
  const std::size_t a2 = 1, b2 = 4;
  REQUIRE(as_built.project.piles[b2].id == "B2");
  for (std::size_t c = 0; c < as_built.results.combinations.size(); ++c) {
    CAPTURE(c);
    const auto& designed = as_designed.results.combinations[c].piles;
    const auto& built = as_built.results.combinations[c].piles;
    CHECK(designed[b2].axial == close(designed[a2].axial, 1e-6, 1e-6));  // symmetry
    CHECK(built[b2].axial < 0.9 * built[a2].axial);
    CHECK(built[b2].lateral < 0.9 * built[a2].lateral);
    // The load it sheds goes to the others: the vertical forces still balance (statics).
    double sum_designed = 0.0, sum_built = 0.0;
    for (std::size_t i = 0; i < built.size(); ++i) {
      sum_designed += designed[i].axial;
      sum_built += built[i].axial;
    }
    CHECK(sum_built == close(sum_designed, 1e-6, 1e-6));
    // The heads move together with the rigid cap; on its softer soil the damaged pile bends
    // less for the same head movement (a fixed head's moment grows with the soil's modulus:
    // M₀ = 2·EI·λ²·y₀, λ⁴ = k/(4·EI), Hetényi 1946, hand derivation).
    CHECK(as_built.nonlinear->combinations[c].piles[b2].max_moment <
          as_built.nonlinear->combinations[c].piles[a2].max_moment);
  }
  // The capacity factor scales its resistances as in a linear run.
  const auto& t = as_built.resistances.at(as_built.project.piles[b2].type);
  const auto& t0 = as_designed.resistances.at(0);
  REQUIRE(t.factored.compression);
  CHECK(*t.factored.compression == close(0.7 * *t0.factored.compression, 1e-12));
}

TEST_CASE("nonlinear as built: a pile model given by the caller refuses stiffness factors",
          "[nonlinear_as_built]") {
  const std::string file = kData + "/nonlinear/lateral_si.yaml";
  cairn::AnalysisOptions options;
  options.nonlinear_piles = [](const cairn::Project& p) { return cairn::test::spec_group(p); };
  cairn::TypeAdjustments adjust;
  adjust.stiffness_factor = {0.5};
  CHECK_THROWS_AS(cairn::analyse(cairn::read_project(file), adjust, options), std::logic_error);
}

TEST_CASE(
    "as built on linear springs: a held head keeps the share f of its whole head "
    "stiffness",
    "[nonlinear_as_built]") {
  // The linear counterpart of the rule: a damaged pile's springs × f, the coupling and
  // rotational terms of fixed and partially fixed heads with them. With the same f on every
  // pile the cap's stiffness is f·K, so the pile forces are those of the sound cap and its
  // movement 1/f of it (hand derivation: (f·K)·(U/f) = F). f = 0.4 < 1/2: scaling the lateral
  // term alone would leave a fixed head's Hetényi matrix indefinite (K_ll·K_rr < K_lr², with
  // K_ll = 4EIλ³, K_lr = −2EIλ², K_rr = 2EIλ; Hetényi 1946, from memory).
  const std::string file = kData + "/bending/fixed_heads.yaml";
  const cairn::CheckRun sound = cairn::analyse_project(file);
  const double f = 0.4;
  cairn::TypeAdjustments adjust;
  adjust.stiffness_factor.assign(sound.project.pile_types.size(), f);
  const cairn::CheckRun damaged = cairn::analyse(cairn::read_project(file), adjust);
  for (std::size_t c = 0; c < sound.results.combinations.size(); ++c) {
    const auto& a = sound.results.combinations[c];
    const auto& b = damaged.results.combinations[c];
    for (std::size_t i = 0; i < a.piles.size(); ++i) {
      CAPTURE(c, i);
      CHECK(b.piles[i].axial == close(a.piles[i].axial, 1e-9, 1e-9));
      CHECK(b.piles[i].lateral == close(a.piles[i].lateral, 1e-9, 1e-9));
      CHECK(b.piles[i].head_moment == close(a.piles[i].head_moment, 1e-9, 1e-9));
      CHECK(b.piles[i].max_moment == close(a.piles[i].max_moment, 1e-9, 1e-9));
    }
    for (std::size_t j = 0; j < 3; ++j)
      CHECK(b.solution.movement.translation[j] ==
            close(a.solution.movement.translation[j] / f, 1e-9, 1e-12));
  }
}
