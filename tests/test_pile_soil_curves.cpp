// Tests for pile_soil_curves.hpp: a project's pile on its soil curves for the nonlinear soil
// response (the layer's p-y model at the depth below the ground, the batter, t_max from the
// shaft method, Q_p from the tip method), the defaults, the problems the nonlinear mode
// reports, and the soil keys lateral_curve and strain_50 in the project file.
#include <catch2/catch.hpp>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <numbers>
#include <string>

#include "cairn/core/diagnostics.hpp"
#include "cairn/geotechnics/axial_curves.hpp"
#include "cairn/geotechnics/capacity.hpp"
#include "cairn/geotechnics/pile_soil_curves.hpp"
#include "cairn/geotechnics/py_curves.hpp"
#include "cairn/input/input.hpp"
#include "support.hpp"

using cairn::test::close;

namespace {

// A cap 1.5 m below the ground on 3 m of soft clay over sand, water at 3.0 m; one vertical
// pile and one battered 1:4 toward +x. (Invented data.)
std::string project_text(const std::string& clay_extra, const std::string& sand_extra) {
  return R"(title: Nonlinear soil fixture
units: SI
cap: {thickness: 1.2, depth: 1.5}
soil:
  water_table: 3.0
  layers:
    - {name: soft clay, kind: clay, thickness: 8, unit_weight: 17.5, saturated_unit_weight: 18.5, undrained_strength: 45)" +
         clay_extra + R"(}
    - {name: dense sand, kind: sand, thickness: 20, saturated_unit_weight: 20.0, friction_angle: 36, soil_modulus: 60000, shaft_k: 1.0, shaft_delta: 27)" +
         sand_extra + R"(}
pile_types:
  PC45:
    section: {shape: square, width: 0.45}
    length: 18
    elastic_modulus: 3.0e7
    head: fixed
    tip_method: vesic
    shaft_method: {clay: alpha-api, sand: beta}
piles:
  - {id: A1, x: -0.7, y: 0.0, type: PC45}
  - {id: A2, x: 0.7, y: 0.0, type: PC45, batter: {ratio: 4, toward: 0}}
load_cases:
  D: {kind: dead, loads: [{at: [0, 0], Fz: -1000}]}
combinations:
  S1: {limit_state: service, factors: {D: 1.0}}
)";
}

cairn::Project read_text(const std::string& text, const std::string& name) {
  const auto path = std::filesystem::temp_directory_path() / ("cairn-test-nl-" + name + ".yaml");
  std::ofstream(path) << text;
  return cairn::read_project(path.string());
}

std::string input_error(const std::string& text, const std::string& name) {
  try {
    read_text(text, name);
  } catch (const cairn::InputError& e) {
    return e.what();
  }
  return "";
}

}  // namespace

TEST_CASE("pile soil curves: a pile's p-y, t-z and Q-z curves from the project",
          "[pile_soil_curves]") {
  const cairn::Project project =
      read_text(project_text(", lateral_curve: soft_clay", ", lateral_curve: sand_api"), "good");
  REQUIRE(cairn::nonlinear_soil_problems(project).empty());
  const cairn::NonlinearPileSpec spec = cairn::nonlinear_pile_spec(project, 0);
  // E·I and E·A of the square section (hand arithmetic): 3e7·0.45⁴/12, 3e7·0.45².
  REQUIRE(spec.bending_stiffness == close(3.0e7 * std::pow(0.45, 4) / 12.0, 1e-12));
  REQUIRE(spec.axial_rigidity == close(3.0e7 * 0.45 * 0.45, 1e-12));
  REQUIRE(spec.restraint.kind == cairn::HeadRestraint::Kind::fixed);
  REQUIRE(spec.head[0] == -0.7);
  REQUIRE(spec.segments == 60);

  // At the head (1.5 m below the ground, above the water): Matlock (1970) with γ' = 17.5,
  // ε50 = 0.010 for cu = 45 kPa (the default table, from memory).
  cairn::SoftClayPy clay;
  clay.undrained_strength = 45.0;
  clay.effective_unit_weight = 17.5;
  clay.width = 0.45;
  clay.strain_50 = 0.010;
  REQUIRE(spec.curves.lateral(0.0, 0.01) == close(clay.resistance(1.5, 0.01), 1e-12));
  // 3.0 m down the pile (4.5 m below the ground, 1.5 m below the water): γ' = σ'v/d.
  const double sigma = 3.0 * 17.5 + 1.5 * (18.5 - 9.81);
  clay.effective_unit_weight = sigma / 4.5;
  REQUIRE(spec.curves.lateral(3.0, 0.02) == close(clay.resistance(4.5, 0.02), 1e-9));
  // In the sand (15 m down, 16.5 m below the ground): API sand with k from φ' = 36° below
  // water (60 lb/in³ = 16 287 kN/m³, from memory).
  cairn::SandApiPy sand;
  sand.friction_angle = 36.0;
  sand.width = 0.45;
  sand.initial_modulus = 60.0 * 271.447;
  sand.effective_unit_weight = (3.0 * 17.5 + 5.0 * (18.5 - 9.81) + 8.5 * (20.0 - 9.81)) / 16.5;
  REQUIRE(spec.curves.lateral(15.0, 0.005) == close(sand.resistance(16.5, 0.005), 1e-9));
  // The same away from the nodes (the curve built on the spot).
  REQUIRE(spec.curves.lateral(15.01, 0.005) > 0.0);

  // Axial: API t-z with t_max = α·cu·perimeter (API RP 2GEO α, by the capacity code), tension
  // the same in clay (uplift factor 1); Q-z with the Vesić tip of pile_capacity.
  cairn::PileGeometry g;
  g.width = 0.45;
  g.round = false;
  g.length = 18.0;
  g.head_depth = 1.5;
  const double f = cairn::unit_shaft_at(*project.soil, g, project.pile_types[0].design, {4.5})[0];
  REQUIRE(f == close(cairn::api_alpha(45.0 / sigma) * 45.0, 1e-12));
  const double t_max = f * 1.8;
  REQUIRE(spec.curves.shaft(3.0, 0.002) ==
          close(t_max * cairn::shaft_transfer(cairn::AxialSoil::clay, 0.45, 0.002), 1e-9));
  REQUIRE(spec.curves.shaft(3.0, -0.002) == close(-spec.curves.shaft(3.0, 0.002), 1e-12));
  // Sand: in tension 2/3 of the compression friction (default_uplift_factor).
  REQUIRE(spec.curves.shaft(15.0, -0.001) ==
          close(-2.0 / 3.0 * spec.curves.shaft(15.0, 0.001), 1e-12));
  const double tip = cairn::pile_capacity(*project.soil, g, project.pile_types[0].design).tip;
  REQUIRE(spec.curves.tip(0.45 * 0.1) == close(tip, 1e-12));  // Q_p at z = 0.1·D
  REQUIRE(spec.curves.tip(-0.01) == 0.0);
  // The sum of t_max along the pile is the shaft capacity (trapezoid rule over 60 segments;
  // 1 %: the kinks at the water table and the layer boundary fall between nodes).
  double sum = 0.0;
  const double h = 18.0 / 60;
  for (int i = 0; i <= 60; ++i) {
    const double t =
        spec.curves.shaft(i * h, 1.0);  // far along the curve: t_max (sand, clay residual 0.9)
    sum += (i == 0 || i == 60 ? 0.5 : 1.0) * h * t;
  }
  const double shaft = cairn::pile_capacity(*project.soil, g, project.pile_types[0].design).shaft;
  REQUIRE(sum > 0.85 * shaft);
  REQUIRE(sum < 1.01 * shaft);

  // The whole pile answers.
  const auto response = cairn::pile_head_response(spec, {0.01, 0.0, -0.005, 0.0, 0.0, 0.0});
  REQUIRE(response.converged);
  REQUIRE(response.action[0] > 0.0);
}

TEST_CASE("pile soil curves: a battered pile meets the soil at its depth below the ground",
          "[pile_soil_curves]") {
  const cairn::Project project =
      read_text(project_text(", lateral_curve: soft_clay", ", lateral_curve: sand_api"), "batter");
  const cairn::NonlinearPileSpec spec = cairn::nonlinear_pile_spec(project, 1);
  // Batter 1:4: cos i = 4/√17; 3.0 m along the pile is 1.5 + 3·4/√17 = 4.4104 m deep.
  const double d = 1.5 + 3.0 * 4.0 / std::sqrt(17.0);
  cairn::SoftClayPy clay;
  clay.undrained_strength = 45.0;
  clay.width = 0.45;
  clay.strain_50 = 0.010;
  clay.effective_unit_weight = (3.0 * 17.5 + (d - 3.0) * (18.5 - 9.81)) / d;
  REQUIRE(spec.curves.lateral(3.0, 0.02) == close(clay.resistance(d, 0.02), 1e-9));
  REQUIRE(spec.axis[0] == close(1.0 / std::sqrt(17.0), 1e-12));
}

TEST_CASE("pile soil curves: the layer's own values replace the defaults", "[pile_soil_curves]") {
  const cairn::Project project =
      read_text(project_text(", lateral_curve: stiff_clay_dry, strain_50: 0.004",
                             ", lateral_curve: sand_api, modulus_gradient: 30000"),
                "own");
  const cairn::NonlinearPileSpec spec = cairn::nonlinear_pile_spec(project, 0);
  cairn::StiffClayDryPy clay;  // Welch & Reese (1972)
  clay.undrained_strength = 45.0;
  clay.effective_unit_weight = 17.5;
  clay.width = 0.45;
  clay.strain_50 = 0.004;
  REQUIRE(spec.curves.lateral(0.0, 0.003) == close(clay.resistance(1.5, 0.003), 1e-12));
  cairn::SandApiPy sand;
  sand.friction_angle = 36.0;
  sand.width = 0.45;
  sand.initial_modulus = 30000.0;
  sand.effective_unit_weight = (3.0 * 17.5 + 5.0 * (18.5 - 9.81) + 8.5 * (20.0 - 9.81)) / 16.5;
  REQUIRE(spec.curves.lateral(15.0, 0.005) == close(sand.resistance(16.5, 0.005), 1e-9));
}

TEST_CASE("pile soil curves: defaults from memory", "[pile_soil_curves]") {
  // Reese & Van Impe (2001) ε50 by consistency (from memory).
  REQUIRE(cairn::default_strain_50(20.0) == 0.020);
  REQUIRE(cairn::default_strain_50(45.0) == 0.010);
  REQUIRE(cairn::default_strain_50(60.0) == 0.007);
  REQUIRE(cairn::default_strain_50(150.0) == 0.005);
  REQUIRE(cairn::default_strain_50(300.0) == 0.004);
  // API RP 2GEO k by relative density (from memory), lb/in³ × 271.447 kN/m³.
  REQUIRE(cairn::default_sand_modulus(28.0, true) == close(20.0 * 271.447, 1e-12));
  REQUIRE(cairn::default_sand_modulus(33.0, false) == close(90.0 * 271.447, 1e-12));
  REQUIRE(cairn::default_sand_modulus(38.0, true) == close(125.0 * 271.447, 1e-12));
  REQUIRE(cairn::parse_lateral_curve("soft_clay") == cairn::LateralCurve::soft_clay);
  REQUIRE_FALSE(cairn::parse_lateral_curve("clay"));
}

TEST_CASE("pile soil curves: what the nonlinear mode lacks is reported where it is missing",
          "[pile_soil_curves]") {
  const cairn::Project project = read_text(project_text("", ", lateral_curve: sand_api"), "lacks");
  const auto problems = cairn::nonlinear_soil_problems(project);
  REQUIRE(problems.size() == 1);
  REQUIRE(problems[0].where.line == 7);  // the layer's line
  REQUIRE(problems[0].message ==
          "soil.layers[0] ('soft clay').lateral_curve: missing; the nonlinear soil response "
          "needs the p-y curve of every layer the piles cross, one of soft_clay, stiff_clay_dry, "
          "sand_api");
  try {
    cairn::require_nonlinear_soil(project);
    FAIL("no input error");
  } catch (const cairn::InputError& e) {
    // file:line: error: key path: what is expected (the house format, no column for a layer).
    REQUIRE(cairn::test::has(e.what(),
                             "cairn-test-nl-lacks.yaml:7: error: soil.layers[0] "
                             "('soft clay').lateral_curve: missing;"));
  }
  REQUIRE_THROWS_AS(cairn::nonlinear_pile_spec(project, 0), std::invalid_argument);
}

TEST_CASE("pile soil curves: the soil keys are read and checked", "[pile_soil_curves]") {
  REQUIRE(cairn::test::has(input_error(project_text(", lateral_curve: sand_api", ""), "wrong_soil"),
                           "soil.layers[0] ('soft clay').lateral_curve: 'sand_api' is a curve for "
                           "sand layers, this layer is clay"));
  REQUIRE(cairn::test::has(input_error(project_text(", lateral_curve: mud", ""), "unknown"),
                           "lateral_curve"));
  REQUIRE(cairn::test::has(input_error(project_text(", strain_50: 0.5", ""), "strain"),
                           "strain_50: expected a strain below 0.1"));
  const cairn::Project project =
      read_text(project_text(", lateral_curve: soft_clay, strain_50: 0.015", ""), "keys");
  REQUIRE(project.soil->layers[0].lateral_curve == cairn::LateralCurve::soft_clay);
  REQUIRE(project.soil->layers[0].strain_50 == 0.015);
}
