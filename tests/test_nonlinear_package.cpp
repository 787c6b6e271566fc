// Tests of the nonlinear section of the calculation package (app/package.cpp, from
// NonlinearRun::profiles): a nonlinear run's page shows the governing piles' diagrams and the
// pushover curve; a linear run's page has no such section and does not change.
#include <catch2/catch.hpp>

#include <algorithm>
#include <string>

#include "cairn/app/analysis.hpp"
#include "cairn/app/package.hpp"
#include "nonlinear_support.hpp"
#include "support.hpp"

using cairn::test::close;
using cairn::test::contains;

namespace {

// A 2×2 cap of fixed-head steel pipes in soft clay over sand (invented data), with a wind
// load across it; `analysis` is the analysis section ("" for none).
std::string project_text(const std::string& analysis) {
  return R"(title: Nonlinear package fixture
units: SI
cap: {thickness: 1.2, depth: 1.0, outline: {width: 4.0, length: 4.0}}
soil:
  water_table: 2.0
  layers:
    - {name: soft clay, kind: clay, thickness: 6, unit_weight: 17.5, saturated_unit_weight: 18, undrained_strength: 30, subgrade_modulus: 8000, lateral_curve: soft_clay}
    - {name: dense sand, kind: sand, thickness: 30, saturated_unit_weight: 20, friction_angle: 36, shaft_k: 1.0, shaft_delta: 27, lateral_curve: sand_api}
pile_types:
  PIPE:
    section: {shape: round, diameter: 0.508}
    length: 16
    elastic_modulus: 3.0e7
    head: fixed
    tip_method: meyerhof
    shaft_method: {clay: alpha-api, sand: beta}
    structure: {steel_yield: 355000, wall_thickness: 0.0127, allowable_factor: 0.5}
    capacity: {compression: 1500, tension: 500, lateral: 150}
piles:
  - {id: A1, x: -1.2, y: -1.2, type: PIPE}
  - {id: A2, x: 1.2, y: -1.2, type: PIPE}
  - {id: B1, x: -1.2, y: 1.2, type: PIPE}
  - {id: B2, x: 1.2, y: 1.2, type: PIPE}
load_cases:
  D: {kind: dead, loads: [{at: [0, 0, 3], Fz: -1800}]}
  W: {kind: wind, loads: [{at: [0, 0, 3], Fx: 160, Fy: 40}]}
combinations:
  S1: {limit_state: service, factors: {D: 1.0}}
  W1: {limit_state: service, factors: {D: 1.0, W: 1.0}}
  W2: {limit_state: service, factors: {D: 0.6, W: 1.0}}
)" + analysis;
}

cairn::AnalysisOptions spec_piles() {
  cairn::AnalysisOptions options;
  options.nonlinear_piles = [](const cairn::Project& p) {
    cairn::NonlinearSoilOptions soil;
    soil.segments = 40;
    return cairn::test::spec_group(p, {}, soil);
  };
  return options;
}

std::string page_of(const cairn::CheckRun& run, const std::string& file) {
  std::vector<cairn::CapOutcome> outcomes(1);
  outcomes[0].file = file;
  outcomes[0].run = run;
  cairn::PackageRequest request;
  request.command = "cairn report fixture.yaml";
  const cairn::PackageFiles files = cairn::package_files(outcomes, request);
  for (const auto& [name, content] : files.files)
    if (name.ends_with(".html")) return content;
  return "";
}

}  // namespace

TEST_CASE("nonlinear package: a nonlinear run shows the governing piles and the pushover",
          "[nonlinear_package]") {
  const std::string path = cairn::test::write_project_file(
      project_text("analysis: {soil_response: nonlinear, pushover_limit: 3}\n"), "nl-package");
  const cairn::CheckRun run = cairn::analyse_project(path, spec_piles());
  REQUIRE(run.nonlinear);
  REQUIRE(run.nonlinear->pushover);
  const auto& profiles = run.nonlinear->profiles;
  REQUIRE_FALSE(profiles.empty());
  // Every governing pile was profiled at its converged movement: its head deflection and
  // largest moment are those the check found for it in that combination.
  for (const auto& g : profiles) {
    REQUIRE(g.profile.converged);
    REQUIRE_FALSE(g.profile.depth.empty());
    const auto& found = run.nonlinear->combinations.at(g.combination).piles.at(g.pile);
    REQUIRE(g.profile.head_deflection == close(found.head_deflection, 1e-9, 1e-12));
    const double head = run.results.combinations.at(g.combination).solution.piles.at(g.pile).head_moment;
    REQUIRE(std::max(g.profile.max_moment, head) == close(found.max_moment, 1e-9, 1e-9));
  }
  // The largest head deflection of all is among them.
  double largest = 0.0;
  for (const auto& c : run.nonlinear->combinations)
    for (const auto& q : c.piles) largest = std::max(largest, q.head_deflection);
  REQUIRE(std::any_of(profiles.begin(), profiles.end(), [&](const auto& g) {
    return g.profile.head_deflection == close(largest, 1e-9, 1e-12);
  }));

  // The page holds the section with each governing pile and combination by name, the three
  // depth diagrams and the pushover chart.
  const std::string page = page_of(run, path);
  REQUIRE(contains(page, "id=\"nonlinear\""));
  const std::string section = page.substr(page.find("id=\"nonlinear\""));
  REQUIRE(cairn::test::occurrences(section.substr(0, section.find("</section>")), "<svg") == 4);
  for (const auto& g : profiles) {
    REQUIRE(contains(section, "<td>" + run.project.piles[g.pile].id + "</td>"));
    REQUIRE(contains(section, "<td>" + run.project.combinations[g.combination].id + "</td>"));
  }
}

TEST_CASE("nonlinear package: a linear run's page has no nonlinear section and is unchanged",
          "[nonlinear_package]") {
  const std::string path = cairn::test::write_project_file(project_text(""), "nl-package-linear");
  const cairn::CheckRun run = cairn::analyse_project(path);
  REQUIRE_FALSE(run.nonlinear);
  const std::string page = page_of(run, path);
  REQUIRE_FALSE(contains(page, "id=\"nonlinear\""));
  REQUIRE_FALSE(contains(page, "Nonlinear soil response"));
  // The same page as the package renderer gives without nonlinear data, byte for byte: the
  // nonlinear run's section, had it been given, is the only difference.
  const cairn::CheckRun nonlinear = cairn::analyse_project(
      cairn::test::write_project_file(project_text("analysis: {soil_response: nonlinear}\n"),
                                      "nl-package-other"),
      spec_piles());
  REQUIRE(nonlinear.nonlinear);
  REQUIRE(contains(page_of(nonlinear, path), "id=\"nonlinear\""));
  REQUIRE(page_of(run, path) == page);
}
