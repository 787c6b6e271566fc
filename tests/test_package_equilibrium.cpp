// Tests of the calculation package's equilibrium table (html_equilibrium.cpp) with fixed and
// partially fixed pile heads: the solver's head actions (forces and head moments, head_forces)
// summed about the origin against the applied resultant, which is derived here by hand from
// the input files (statics of the cap's free body: Σ F and Σ (r × F + M) of every load, load
// heights and the cap's self-weight included).
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <map>
#include <string>

#include "cairn/app/analysis.hpp"
#include "cairn/checks/explain.hpp"
#include "cairn/geotechnics/stiffness.hpp"
#include "cairn/output/html_package.hpp"
#include "cairn/solver/head_forces.hpp"

#include "support.hpp"

using namespace cairn;

using cairn::test::has;

namespace {

const std::string kData = std::string(CAIRN_TEST_DATA) + "/";
const std::string kDemo = std::string(CAIRN_DEMO_DIR) + "/";

// The largest component of `miss` over the largest of `applied`, moments over `lever` (m).
double relative(const Wrench& miss, const Wrench& applied, double lever) {
  double off = 0.0, largest = 0.0;
  for (std::size_t k = 0; k < 6; ++k) {
    const double scale = k < 3 ? 1.0 : 1.0 / lever;
    off = std::max(off, std::abs(miss[k]) * scale);
    largest = std::max(largest, std::abs(applied[k]) * scale);
  }
  return off / largest;
}

// Checks every combination of `run`: the piles' actions about the origin, summed here from
// the solver's head_forces and by the package's head_balance, against the hand resultant.
void check_balance(const CheckRun& run, const std::map<std::string, Wrench>& hand) {
  const auto springs = pile_springs(run.project, run.stiffness);
  double lever = 0.0;
  for (const auto& s : springs) lever = std::max(lever, std::hypot(s.head[0], s.head[1]));
  bool moments = false;
  for (const auto& cc : run.results.combinations) {
    const std::string& id = run.project.combinations[cc.combination].id;
    INFO("combination " << id);
    REQUIRE(hand.count(id) == 1);
    const Wrench& applied = hand.at(id);
    REQUIRE_FALSE(cc.solution.overturns);
    // Σ (p × F + M) over the piles, from the solver's actions of the cap on the piles.
    Wrench sum{};
    for (std::size_t i = 0; i < springs.size(); ++i) {
      const Wrench& a = cc.solution.piles[i].head_forces;
      const auto& p = springs[i].head;
      sum[0] += a[0], sum[1] += a[1], sum[2] += a[2];
      sum[3] += p[1] * a[2] - p[2] * a[1] + a[3];
      sum[4] += p[2] * a[0] - p[0] * a[2] + a[4];
      sum[5] += p[0] * a[1] - p[1] * a[0] + a[5];
      if (std::hypot(a[3], a[4]) > 1.0) moments = true;  // kN·m: the heads take moments
    }
    Wrench miss{};
    for (std::size_t k = 0; k < 6; ++k) miss[k] = sum[k] - applied[k];
    CHECK(relative(miss, applied, lever) <= 1e-9);  // statics, hand derivation
    // The package's residual: its applied resultant is the hand one, and it balances.
    const HeadBalance b =
        head_balance(springs, cc.solution, combination_load(run.project, run.project.combinations[cc.combination]));
    for (std::size_t k = 0; k < 6; ++k) CHECK(b.applied[k] == Approx(applied[k]).margin(1e-9));
    CHECK(b.relative <= 1e-9);  // statics, hand derivation
    CHECK(b.lever == Approx(lever));
  }
  CHECK(moments);
}

}  // namespace

TEST_CASE("package equilibrium: the fixed-head pier balances with its head moments",
          "[package_equilibrium]") {
  const CheckRun run = analyse_project(kDemo + "pier-fixed-heads/cap.yaml");
  // Statics, hand derivation from cap.yaml: every load acts at (0, 0, 5.2); the self-weight
  // 25 × 4.8 × 4.8 × 1.2 = 691.2 kN at the outline's centroid (0, 0, 0.6), no moment.
  // D: Fz = −1650 − 691.2 = −2341.2. L: Fz = −900. W: Fx = 180 at z = 5.2 → My = 5.2 × 180 =
  // 936, and Mz = 40.
  const std::map<std::string, Wrench> hand = {
      {"S1", {0, 0, -3241.2, 0, 0, 0}},            // D + L
      {"W1", {180, 0, -2341.2, 0, 936, 40}},       // D + W
      {"W2", {180, 0, -1404.72, 0, 936, 40}},      // 0.6 D + W
      {"W3", {135, 0, -3016.2, 0, 702, 30}}};      // D + 0.75 L + 0.75 W
  check_balance(run, hand);

  // The table has the head moment columns and no caveat; the hand check of the governing
  // pile subtracts the heads' moments and reproduces the solver's axial force.
  const CheckReport report = make_check_report(run, "test", std::nullopt);
  const std::string html = render_equilibrium_section_html(report);
  CHECK(has(html, "head Mx (kN·m)"));
  CHECK(has(html, "head My (kN·m)"));
  CHECK(has(html, "p × F + M"));
  CHECK(has(html, "The pile's reaction on the cap is the opposite"));
  CHECK_FALSE(has(html, "not part of this sum"));
  CHECK(has(html, "cairn check --explain"));
  CHECK(has(html, "heads held by the cap (fixed or partially fixed): the cap puts Mx = "));
  REQUIRE(run.results.summary.pile);
  REQUIRE(run.results.summary.combination);
  for (const HandCheck& h : explain_pile(run.project, run.results, *run.results.summary.pile)) {
    REQUIRE(h.available);
    // Hand-derived closed form P = V/n + My·x'/Σx'² − Mx·y'/Σy'² (Bowles, Foundation Analysis
    // and Design, 5th ed., §18-14) with the applied moments less the heads' moments (statics
    // of the cap's free body): it gives the solver's axial force.
    CHECK(h.axial == Approx(h.solver_axial).epsilon(1e-9).margin(1e-9));
  }
}

TEST_CASE("package equilibrium: battered fixed and partially fixed heads balance",
          "[package_equilibrium]") {
  const CheckRun run = analyse_project(kData + "bending/fixed_heads.yaml");
  // Statics, hand derivation from fixed_heads.yaml (r × F = (y·Fz − z·Fy, z·Fx − x·Fz,
  // x·Fy − y·Fx); loads given at [x, y] act on the top of the cap, z = 1.4):
  //   D: −3000 at (0.3, −0.2, 1.4) → Mx = 600, My = 900, plus My = 150; self-weight
  //      25 × 6 × 4 × 1.4 = 840 at (0, 0, 0.7), no moment. D = (0, 0, −3840; 600, 1050, 0).
  //   W: (180, −90, 0) at (0.5, 0.4, 6.0) → Mx = 540, My = 1080, Mz = −117, plus Mz = 60;
  //      Fz = 200 at (−1, 0, 1.4) → My = 200, plus Mx = −40. W = (180, −90, 200; 500, 1280, −57).
  const std::map<std::string, Wrench> hand = {
      {"S1", {180, -90, -3640, 1100, 2330, -57}},             // D + W
      {"S2", {288, -144, -3520, 1400, 3098, -91.2}},          // D + 1.6 W
      {"S3", {-288, 144, -3776, -260, -1103, 91.2}}};         // 0.9 D − 1.6 W
  check_balance(run, hand);

  const CheckReport report = make_check_report(run, "test", std::nullopt);
  const std::string html = render_equilibrium_section_html(report);
  CHECK(has(html, "head Mz (kN·m)"));
  CHECK_FALSE(has(html, "not part of this sum"));
  // Battered piles: no closed form; the general equations carry the held head's terms.
  CHECK_FALSE(has(html, "cairn check --explain"));
  CHECK(has(html, "held head: F = k_a·(a·u)·a"));
}

TEST_CASE("package equilibrium: pinned heads keep the forces-only table",
          "[package_equilibrium]") {
  const CheckRun run = analyse_project(kDemo + "crane-rail-footing/cap.yaml");
  const CheckReport report = make_check_report(run, "test", std::nullopt);
  const std::string html = render_equilibrium_section_html(report);
  CHECK_FALSE(has(html, "head Mx"));
  CHECK(has(html, "Σ piles"));
}
