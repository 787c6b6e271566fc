// Tests of the capacity-with-depth tables the analysis builds for the calculation package
// (analysis.hpp, AnalysisOptions; project_capacity.hpp, report_depth_table): built once with
// the check, with the same capacities as the check's, and never without being asked.
#include <catch2/catch.hpp>

#include <string>

#include "cairn/app/analysis.hpp"
#include "cairn/core/units.hpp"
#include "cairn/geotechnics/project_capacity.hpp"

using namespace cairn;

namespace {
const std::string kCap = std::string(CAIRN_TEST_DATA) + "/html/cap.yaml";
}  // namespace

TEST_CASE("depth tables: the default lengths of the table", "[depth_tables]") {
  // 0.5 m from 3 m; 1 ft from 10 ft with 1 ft = 0.3048 m exactly (NIST SP 811 (2008),
  // Appendix B). The lengths themselves are cairn's choice (common practice).
  const DepthTableRange si = default_depth_table(UnitSystem::SI);
  CHECK(si.step == 0.5);
  CHECK(si.from == 3.0);
  const DepthTableRange us = default_depth_table(UnitSystem::US);
  CHECK(us.step == 0.3048);
  CHECK(us.from == Approx(3.048).epsilon(1e-15));
}

TEST_CASE("depth tables: the analysis builds them only when asked", "[depth_tables]") {
  const CheckRun plain = analyse_project(kCap);
  REQUIRE(!plain.capacities.empty());
  for (const auto& c : plain.capacities) CHECK(c.depth_table.empty());

  const CheckRun with = analyse_project(kCap, AnalysisOptions{.depth_tables = true});
  REQUIRE(with.capacities.size() == plain.capacities.size());
  const DepthTableRange range = report_depth_table(with.project);
  for (std::size_t i = 0; i < with.capacities.size(); ++i) {
    const PileTypeCapacity& c = with.capacities[i];
    REQUIRE(!c.depth_table.empty());
    // The table starts at the report's shortest length and steps by its step.
    CHECK(c.depth_table.front().length == Approx(range.from).margin(1e-9));
    if (c.depth_table.size() > 1)
      CHECK(c.depth_table[1].length - c.depth_table[0].length == Approx(range.step).margin(1e-9));
    // The check's capacities are the same with or without the table.
    CHECK(c.result.ultimate_compression == plain.capacities[i].result.ultimate_compression);
    CHECK(c.result.allowable_compression == plain.capacities[i].result.allowable_compression);
  }
  // And so is the check itself.
  CHECK(with.results.summary.max_utilization == plain.results.summary.max_utilization);
}

TEST_CASE("depth tables: several caps in parallel carry their tables", "[depth_tables]") {
  const auto outcomes = analyse_projects({kCap, kCap}, 2, AnalysisOptions{.depth_tables = true});
  REQUIRE(outcomes.size() == 2);
  for (const auto& o : outcomes) {
    REQUIRE(o.run);
    REQUIRE(!o.run->capacities.empty());
    CHECK(!o.run->capacities.front().depth_table.empty());
  }
}
