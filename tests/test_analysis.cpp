// Tests of analysis.hpp: the whole check of small projects in tests/data/t8/, end to end,
// their input errors, and the parallel run of several caps.
#include <catch2/catch.hpp>

#include <string>
#include <vector>

#include "cairn/app/analysis.hpp"

using namespace cairn;

namespace {

const std::string kData = std::string(CAIRN_TEST_DATA) + "/t8/";

// The rigid-cap pile forces below are exact up to the solver's round-off (its equilibrium
// residual is checked at 1e-6 of the load).
constexpr double kSolver = 1e-6;

std::vector<std::string> formatted(const InputError& e) {
  std::vector<std::string> out;
  for (const auto& d : e.diagnostics()) out.push_back(d.format());
  return out;
}

}  // namespace

TEST_CASE("analysis: a passing cap, end to end", "[analysis][published]") {
  const CheckRun run = analyse_project(kData + "pass.yaml");
  REQUIRE(run.results.combinations.size() == 2);
  // Rigid cap with equal vertical piles (common practice, e.g. Poulos & Davis 1980; converted to
  // cairn's signs): P = V/n + My·x/Σx². S1: 3000/4 ± 180·1.35/7.29 = 750 ± 33.333 kN;
  // S2: 1000 ± 33.333 kN, and Fx = 40 kN shared equally by the lateral springs: 10 kN.
  const auto& s1 = run.results.combinations[0];
  CHECK(s1.piles[0].axial == Approx(716.667).epsilon(kSolver));  // A1 at x = −1.35
  CHECK(s1.piles[1].axial == Approx(783.333).epsilon(kSolver));  // A2 at x = +1.35
  const auto& s2 = run.results.combinations[1];
  CHECK(s2.piles[3].axial == Approx(1033.333).epsilon(kSolver));
  CHECK(s2.piles[3].lateral == Approx(10.0).epsilon(kSolver));
  CHECK(run.results.summary.pass);
  CHECK(run.results.summary.max_utilization == Approx(1033.333 / 1400.0).epsilon(kSolver));
  CHECK(*run.results.summary.combination == 1);
  CHECK(run.results.summary.check == Demand::compression);
  // Group checks ran: 2.7 m spacing ≥ 2.5 × 0.45 m; edge 2.1 − 1.35 − 0.225 = 0.525 m ≥ 0.225 m.
  CHECK(run.group.pass);
  REQUIRE(run.group.edge);
  CHECK(run.group.edge->offenders.empty());
  CHECK(run.stiffness[0].axial == Approx(3.0e7 * 0.2025 / 18.0).epsilon(1e-9));  // E·A/L
  CHECK_FALSE(run.assumptions.empty());
}

TEST_CASE("analysis: an overloaded cap fails", "[analysis][published]") {
  const CheckRun run = analyse_project(kData + "fail.yaml");
  // Hand (common practice, rigid cap): 6000/4 + 180·1.35/7.29 = 1533.33 kN > 1400 kN.
  CHECK_FALSE(run.results.summary.pass);
  CHECK(run.results.summary.max_utilization == Approx(1533.333 / 1400.0).epsilon(kSolver));
  CHECK(run.results.summary.failed_combinations == 1);
}

TEST_CASE("analysis: a cap that overturns fails", "[analysis]") {
  const CheckRun run = analyse_project(kData + "overturn.yaml");
  CHECK_FALSE(run.results.summary.pass);
  REQUIRE(run.results.summary.overturned.size() == 1);
  CHECK(run.results.combinations[0].solution.overturns);
}

TEST_CASE("analysis: a load nothing resists is an input error", "[analysis]") {
  try {
    analyse_project(kData + "unresisted.yaml");
    FAIL("expected an InputError");
  } catch (const InputError& e) {
    CHECK(formatted(e) == std::vector<std::string>{
                              kData + "unresisted.yaml:19:27: error: load_cases.W: Fx cannot be "
                                      "resisted: no battered piles and no lateral stiffness"});
  }
}

TEST_CASE("analysis: a strength combination without factored capacity is an input error",
          "[analysis]") {
  try {
    analyse_project(kData + "missing_factored.yaml");
    FAIL("expected an InputError");
  } catch (const InputError& e) {
    CHECK(formatted(e) ==
          std::vector<std::string>{
              kData + "missing_factored.yaml:21:3: error: combinations.U1: a strength "
                      "combination is compared with factored capacities, but pile type 'PC45' "
                      "has no factored compression capacity; give capacity with basis: factored "
                      "(or basis: ultimate with resistance_factor)"});
  }
}

TEST_CASE("analysis: caps analysed in parallel give the results of one by one", "[analysis]") {
  const std::vector<std::string> files = {
      kData + "pass.yaml",       kData + "fail.yaml", kData + "us.yaml",
      kData + "unresisted.yaml", kData + "overturn.yaml", kData + "missing_factored.yaml",
      kData + "pass.yaml",       kData + "us.yaml"};
  const auto serial = analyse_projects(files, 1);
  const auto parallel = analyse_projects(files, 4);
  REQUIRE(serial.size() == files.size());
  REQUIRE(parallel.size() == files.size());
  for (std::size_t i = 0; i < files.size(); ++i) {
    INFO(files[i]);
    const CapOutcome& a = serial[i];
    const CapOutcome& b = parallel[i];
    CHECK(a.file == files[i]);
    CHECK(b.file == files[i]);
    REQUIRE(a.run.has_value() == b.run.has_value());
    CHECK(a.problems.size() == b.problems.size());
    for (std::size_t k = 0; k < a.problems.size() && k < b.problems.size(); ++k)
      CHECK(a.problems[k].format() == b.problems[k].format());
    if (!a.run) continue;
    const CheckResults& x = a.run->results;
    const CheckResults& y = b.run->results;
    CHECK(x.summary.pass == y.summary.pass);
    CHECK(x.summary.max_utilization == y.summary.max_utilization);
    REQUIRE(x.combinations.size() == y.combinations.size());
    for (std::size_t c = 0; c < x.combinations.size(); ++c)
      for (std::size_t p = 0; p < x.combinations[c].piles.size(); ++p) {
        CHECK(x.combinations[c].piles[p].axial == y.combinations[c].piles[p].axial);
        CHECK(x.combinations[c].piles[p].lateral == y.combinations[c].piles[p].lateral);
      }
  }
  // And each matches a run of its own.
  CHECK(serial[2].run->results.summary.max_utilization ==
        analyse_project(files[2]).results.summary.max_utilization);
  CHECK_FALSE(serial[3].run);
  CHECK_FALSE(serial[5].run);
  CHECK(serial[0].run->results.summary.pass);
  CHECK_FALSE(serial[1].run->results.summary.pass);
}
