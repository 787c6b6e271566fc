// Tests of survey_csv.hpp and as_built.hpp: the pile survey read against the design, the
// as-built cap checked by the same pipeline and compared pile by pile.
//
// Hand-derived closed form (rigid cap, equal vertical piles, the classical P/n ± M·x/Σx²):
// with the centroid of the piles at x̄ and a vertical load P at x = 0, each pile carries
//   P_i = P/n − P·x̄·(x_i − x̄)/Σ(x − x̄)²   (Σ(x − x̄)(y − ȳ) = 0 in the groups used here).
// The diamond of tests/data/site/diamond.yaml has piles at (±1, 0) and (0, ±1), P = 1000 kN.
#include <catch2/catch.hpp>

#include <cmath>
#include <string>

#include "cairn/app/analysis.hpp"
#include "cairn/input/input.hpp"
#include "cairn/input/survey_csv.hpp"
#include "cairn/output/as_built_report.hpp"
#include "cairn/site/as_built.hpp"

using namespace cairn;

namespace {

const std::string kData = std::string(CAIRN_TEST_DATA) + "/site/";

struct Site {
  CheckRun design;
  AsBuiltProject model;
  CheckRun built;
  AsBuiltComparison comparison;
};

Site site(const std::string& survey, SiteTolerances tolerances = {}) {
  Site s;
  s.design = analyse_project(kData + "diamond.yaml");
  s.model = build_as_built(s.design.project, read_survey_file(kData + survey, UnitSystem::SI), "",
                           tolerances);
  s.built = analyse(s.model.project, s.model.adjust);
  s.comparison = compare_as_built(s.model, s.design, s.built);
  return s;
}

double axial(const Site& s, const std::string& id) {
  for (const auto& a : s.model.piles)
    if (a.id == id && a.as_built) return s.built.results.combinations[0].piles[*a.as_built].axial;
  FAIL("no pile " << id);
  return 0.0;
}

std::string problems_of(const std::string& survey) {
  try {
    site(survey);
  } catch (const InputError& e) {
    std::string all;
    for (const auto& d : e.diagnostics()) all += d.format() + "\n";
    return all;
  }
  return "";
}

}  // namespace

TEST_CASE("a pile moved 100 mm outward gives the P/n ± M·x/Σx² change", "[as_built]") {
  const Site s = site("moved.csv");
  // Hand derivation: x̄ = 0.1/4 = 0.025 m, Σ(x − x̄)² = 1.1² + 1 − 4·0.025² = 2.2075 m².
  const double xbar = 0.025, sum = 1.21 + 1.0 - 4 * xbar * xbar;
  CHECK(axial(s, "E") == Approx(250.0 - 1000.0 * xbar * (1.1 - xbar) / sum));   // 237.83 kN
  CHECK(axial(s, "W") == Approx(250.0 - 1000.0 * xbar * (-1.0 - xbar) / sum));  // 261.61 kN
  CHECK(axial(s, "N") == Approx(250.0 - 1000.0 * xbar * (0.0 - xbar) / sum));   // 250.28 kN
  CHECK(s.model.piles[0].offset == Approx(0.1));
  CHECK(s.model.piles[0].direction_deg == Approx(0.0).margin(1e-9));
  CHECK(s.model.piles[0].out_of_tolerance);  // 100 mm > 75 mm (common practice default)
  CHECK(s.comparison.verdict == SiteVerdict::accept_with_deviations);
  CHECK(*s.comparison.design_utilization[2] == Approx(0.5));  // 250 / 500
  CHECK(*s.comparison.as_built_utilization[2] == Approx(axial(s, "W") / 500.0));
}

TEST_CASE("piles within tolerance are accepted as built", "[as_built]") {
  const Site s = site("within.csv");
  CHECK_FALSE(s.comparison.any_out_of_tolerance);
  CHECK(s.comparison.verdict == SiteVerdict::accept);
  CHECK(std::string(to_string(s.comparison.verdict)) == "accept as built");
}

TEST_CASE("a rejected pile carries nothing and an added pile takes its place", "[as_built]") {
  const Site s = site("rejected.csv");
  REQUIRE(s.model.piles.size() == 5);
  CHECK_FALSE(s.model.piles[0].as_built);  // E, rejected
  CHECK(s.model.piles[4].added);
  // Hand derivation: piles at 1.4, 0, −1, 0 → x̄ = 0.1, Σ(x − x̄)² = 1.3² + 2·0.1² + 1.1² = 2.92.
  CHECK(axial(s, "E2") == Approx(250.0 - 1000.0 * 0.1 * 1.3 / 2.92));  // 205.48 kN
  CHECK(axial(s, "W") == Approx(250.0 + 1000.0 * 0.1 * 1.1 / 2.92));   // 287.67 kN
  // E2 stands 0.4 m from the rejected pile, inside 2.5 widths (0.75 m).
  bool spacing = false;
  for (const auto& r : s.model.piles[4].remarks) spacing = spacing || r.find("rejected pile E") != std::string::npos;
  CHECK(spacing);
  const AsBuiltReport report{&s.model, &s.design, &s.built, &s.comparison, "test"};
  const auto j = as_built_json(report);
  const auto& row = j["combinations"][0]["piles"][0];
  CHECK(row["axial"] == 0.0);
  CHECK(row["state"] == "rejected");
  CHECK(row["design_axial"].get<double>() == Approx(250.0));
}

TEST_CASE("a site grid turned 90° maps onto the project's axes", "[as_built]") {
  const Site s = site("grid.csv");
  for (const auto& a : s.model.piles) CHECK(a.offset == Approx(0.0).margin(1e-9));
  CHECK(s.comparison.verdict == SiteVerdict::accept);
}

TEST_CASE("a short pile with a typed-in capacity needs a capacity factor", "[as_built]") {
  CHECK(problems_of("bad_short.csv") ==
        kData + "bad_short.csv:2:16: error: row 2, column 'installed_length': pile 'E' was "
                "installed 2.50 m short of its design length of 12.00 m, and the capacity of "
                "pile type 'P' was typed in by hand (not computed from the soil): give "
                "capacity_factor, the share of the design capacity the short pile keeps; cairn "
                "does not guess it\n");
  const Site s = site("short_reduced.csv");
  // Capacity halved: 250 kN on 250 kN; the shorter pile is stiffer (E·A/L), so it takes more.
  CHECK(*s.comparison.as_built_utilization[0] > 1.0);
  CHECK(s.comparison.verdict == SiteVerdict::remedial);
}

TEST_CASE("survey problems name file, row and column", "[as_built]") {
  CHECK(problems_of("bad_status.csv") ==
        kData + "bad_status.csv:3:7: error: row 3, column 'status': expected accepted, damaged, "
                "rejected or abandoned, got 'acepted'\n" +
        kData + "bad_status.csv:5:5: error: row 5, column 'y': expected a length in m, got 'x1'\n");
  CHECK(problems_of("bad_missing.csv") ==
        kData + "bad_missing.csv:3:1: error: pile 'N' is damaged: expected capacity_factor "
                "and/or stiffness_factor (the share of the design capacity and stiffness it "
                "keeps); cairn does not guess them\n" +
        kData + "bad_missing.csv:1:1: error: pile 'S' of the design has no row in the survey; "
                "expected one row per pile (status accepted, damaged, rejected or abandoned)\n");
  CHECK(problems_of("bad_header.csv") ==
        kData + "bad_header.csv:1:1: error: header: expected the surveyed head as columns 'x' "
                "and 'y', or offsets from the design position as 'dx' and 'dy'; found: pile, "
                "east, north, status\n");
}
