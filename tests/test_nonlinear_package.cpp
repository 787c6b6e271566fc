// Tests of the nonlinear section of the calculation package (app/nonlinear_profiles.hpp,
// app/package.cpp): a nonlinear run's page shows the governing piles' diagrams and the
// pushover curve; a linear run's page has no such section and does not change.
#include <catch2/catch.hpp>

#include <algorithm>
#include <string>

#include "cairn/app/analysis.hpp"
#include "cairn/app/nonlinear_profiles.hpp"
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
  REQUIRE_FALSE(run.nonlinear_profiles.empty());
  REQUIRE(run.nonlinear_profiles.size() <= 2);
  // Every governing pile was profiled at its converged movement: its head deflection and
  // largest moment are those the check found for it in that combination.
  const cairn::Project& p = run.project;
  for (const auto& g : run.nonlinear_profiles) {
    REQUIRE(g.profile.converged);
    REQUIRE_FALSE(g.profile.depth.empty());
    const auto pile = static_cast<std::size_t>(
        std::find_if(p.piles.begin(), p.piles.end(), [&](const auto& q) { return q.id == g.pile; }) -
        p.piles.begin());
    const auto combo = static_cast<std::size_t>(
        std::find_if(p.combinations.begin(), p.combinations.end(),
                     [&](const auto& q) { return q.id == g.combination; }) -
        p.combinations.begin());
    REQUIRE(pile < p.piles.size());
    REQUIRE(combo < p.combinations.size());
    const auto& found = run.nonlinear->combinations[combo].piles[pile];
    REQUIRE(g.profile.head_deflection == close(found.head_deflection, 1e-9, 1e-12));
    REQUIRE(std::max(g.profile.max_moment, run.results.combinations[combo].solution.piles[pile].head_moment) ==
            close(found.max_moment, 1e-9, 1e-9));
  }
  // The second entry, when there is one, is the largest head deflection of all.
  double largest = 0.0;
  for (const auto& c : run.nonlinear->combinations)
    for (const auto& q : c.piles) largest = std::max(largest, q.head_deflection);
  REQUIRE(run.nonlinear_profiles.back().profile.head_deflection == close(largest, 1e-9, 1e-12));

  const std::string page = page_of(run, path);
  REQUIRE(contains(page, "id=\"nonlinear\""));
  REQUIRE(contains(page, "<svg"));
  REQUIRE(contains(page, run.nonlinear_profiles.front().pile));
}

TEST_CASE("nonlinear package: a linear run's page has no nonlinear section and is unchanged",
          "[nonlinear_package]") {
  const std::string path = cairn::test::write_project_file(project_text(""), "nl-package-linear");
  cairn::CheckRun run = cairn::analyse_project(path);
  REQUIRE_FALSE(run.nonlinear);
  REQUIRE(run.nonlinear_profiles.empty());
  const std::string page = page_of(run, path);
  REQUIRE_FALSE(contains(page, "id=\"nonlinear\""));
  // Only a nonlinear run places the section: profiles left in a linear run change nothing,
  // byte for byte.
  const cairn::CheckRun nonlinear = cairn::analyse_project(
      cairn::test::write_project_file(project_text("analysis: {soil_response: nonlinear}\n"),
                                      "nl-package-other"),
      spec_piles());
  run.nonlinear_profiles = nonlinear.nonlinear_profiles;
  REQUIRE_FALSE(run.nonlinear_profiles.empty());
  REQUIRE(page_of(run, path) == page);
  // The profiles builder gives nothing without a profile function.
  cairn::NonlinearGroup group;
  REQUIRE(cairn::governing_pile_profiles(nonlinear.project, nonlinear.results,
                                         *nonlinear.nonlinear, group)
              .empty());
}
