// Verification of the nonlinear soil response against results from outside the project:
//   - a short rigid free-head pile in clay whose p-y curves plateau at p_u = 9·c·b: its head
//     load at large deflection against the limit equilibrium of a rigid pile (hand derivation
//     from statics) and Broms (1964);
//   - a long fixed-head pile in uniform elastic soil, through the whole project route (file →
//     check, nonlinear mode): Hetényi's (1946) closed form; a long free-head pile on its own;
//   - a 2×2 group at small loads: the nonlinear check equals the linear check whose springs are
//     the curves' initial slopes;
//   - a 3×3 group's pushover: p-multipliers lower the capacity.
// The piles come from the project file through pile_soil_curves.hpp; where a check needs a
// curve the soil keys do not give (linear, or a plateau at 9·c·b from the surface down), the
// pile's p-y curve is replaced by it and the test says so. Soil data are invented.
#include <catch2/catch.hpp>

#include <cmath>
#include <numbers>
#include <string>

#include <fmt/format.h>

#include "cairn/app/analysis.hpp"
#include "cairn/input/input.hpp"
#include "cairn/solver/nonlinear_pile.hpp"
#include "nonlinear_support.hpp"
#include "support.hpp"

using cairn::test::close;

namespace {

// One pile type in one soil layer under a cap (invented data). `layer` is the rest of the
// layer's map, `type` the rest of the pile type's, `piles` the piles' list, `loads` the load
// case D's loads, `analysis` the analysis section's map.
std::string project_text(const std::string& layer, const std::string& type,
                         const std::string& piles, const std::string& loads,
                         const std::string& analysis) {
  return R"(title: Nonlinear verification
units: SI
cap: {thickness: 1.5, depth: 0.0}
soil:
  layers:
    - {name: clay, kind: clay, thickness: 40, unit_weight: 18, undrained_strength: 50, lateral_curve: soft_clay, )" +
         layer + R"(}
pile_types:
  P:
    section: {shape: round, diameter: 0.6}
    tip_method: meyerhof
    shaft_method: {clay: alpha-api}
    capacity: {compression: 50000, tension: 50000, lateral: 50000}
    )" + type + R"(
piles:
)" + piles + R"(
load_cases:
  D: {kind: dead, loads: [)" +
         loads + R"(]}
combinations:
  S1: {limit_state: service, factors: {D: 1.0}}
analysis: {)" + analysis + R"(}
)";
}

// Head forces of the cap on pile i of a combination's solution.
const cairn::PileForce& pile_force(const cairn::CheckRun& run, std::size_t c, std::size_t i) {
  return run.results.combinations.at(c).solution.piles.at(i);
}

}  // namespace

TEST_CASE("nonlinear verification: a short rigid free-head pile reaches the limit equilibrium "
          "of a uniform p_u = 9·c·b",
          "[nonlinear_verification][published]") {
  // A rigid pile (EI far above the soil's) of length L and width b, free head, loaded at the
  // ground surface, in clay whose p-y curve plateaus at p_u = 9·c·b at every depth (the
  // curve p = p_u·tanh(k₀·y/p_u): reaches 0.995·p_u at y = 3·p_u/k₀ = 1.6 mm).
  const double c = 50.0, b = 0.6, length = 3.0, pu = 9.0 * c * b;  // kPa, m, m, kN/m
  cairn::NonlinearPileSpec pile;
  pile.head = {0.0, 0.0, 0.0};
  pile.axis = {0.0, 0.0, -1.0};
  pile.length = length;
  pile.bending_stiffness = 1.0e9;  // kN·m²: λL = (k₀/4EI)^¼·L = 0.05, rigid
  pile.axial_rigidity = 1.0e9;
  pile.width = b;
  pile.restraint.kind = cairn::HeadRestraint::Kind::pinned;
  pile.segments = 120;
  pile.deflection_limit = 2.0;  // m: well beyond the deflections used here
  const double k0 = 5.0e5;      // kN/m², initial slope
  pile.curves.lateral = [=](double, double y) { return pu * std::tanh(k0 * y / pu); };
  pile.curves.shaft = [](double, double w) { return 1.0e4 * w; };
  pile.curves.tip = [](double w) { return w > 0.0 ? 1.0e5 * w : 0.0; };
  pile.curves.description = "p_u·tanh(k₀·y/p_u), p_u = 9·c·b";
  const auto response = cairn::pile_head_response(pile, {0.5, 0.0, 0.0, 0.0, 0.0, 0.0});
  REQUIRE(response.converged);
  const double head_load = std::abs(response.action[0]);

  // Limit equilibrium of a rigid free-head pile with a uniform p_u, loaded at its head (hand
  // derivation from statics): it turns about a point at depth f; p_u resists over 0…f and
  // acts the other way over f…L. Moments about the head: p_u·f²/2 = p_u·(L² − f²)/2, so
  // f = L/√2; forces: H = p_u·(2f − L) = (√2 − 1)·p_u·L.
  const double limit = (std::sqrt(2.0) - 1.0) * pu * length;  // 335.5 kN
  REQUIRE(head_load == close(limit, 0.01));  // hand derivation from statics (above)
  // The plateau is approached from below, to the finite differences' accuracy (h = L/120).
  REQUIRE(head_load <= limit * (1.0 + 1e-3));

  // Broms (1964), short free-head pile in cohesive soil, load at the surface (e = 0): no
  // resistance over the top 1.5·b, 9·c·b below; L = 1.5b + f + g, f = H/(9cb),
  // H·(1.5b + f/2) = 2.25·b·c·g² (Broms 1964, "Lateral resistance of piles in cohesive
  // soils", the short free-head case; from memory). Solved for H by bisection.
  auto broms = [&](double top) {
    double lo = 0.0, hi = pu * length;
    for (int i = 0; i < 200; ++i) {
      const double h = 0.5 * (lo + hi);
      const double f = h / pu;
      const double g = length - top - f;
      const double miss = g <= 0.0 ? 1.0 : h * (top + 0.5 * f) - 2.25 * b * c * g * g;
      (miss > 0.0 ? hi : lo) = h;
    }
    return 0.5 * (lo + hi);
  };
  // Without the top 1.5·b, Broms' diagram is the same statics: 2.25·b·c·g² is the moment of
  // 9·c·b over the lower g/2 about the point of largest moment (hand derivation), and it
  // gives (√2 − 1)·p_u·L exactly.
  REQUIRE(broms(0.0) == close(limit, 1e-9));  // hand derivation from Broms' (1964) diagram
  // How they differ: Broms leaves out the top 1.5·b because near the surface the clay fails
  // in a wedge at less than 9·c·b (Matlock's p_u grows from 3·c·b at the surface); the
  // uniform plateau here does not. With the top 1.5·b (0.9 m, 30 % of this short pile) left
  // out, Broms' load is much lower:
  // 143.0 kN, 0.43 of the full plateau's (hand arithmetic): the loss of the top zone also
  // shortens the lever of the resistance below it.
  REQUIRE(broms(1.5 * b) < head_load);         // Broms (1964): the top 1.5·b carries nothing
  REQUIRE(broms(1.5 * b) / limit == close(0.4261, 0.001));  // hand arithmetic of the above
}

TEST_CASE("nonlinear verification: a long fixed-head pile in uniform elastic soil matches "
          "Hetényi's closed form through the project file",
          "[nonlinear_verification][published]") {
  // A single round pile D = 0.6 m, E = 3e7 kPa, L = 25 m in a soil of modulus kh = 20 000
  // kN/m³ (k = kh·b = 12 000 kN/m²), nonlinear mode, loaded at the head by H = 100 kN and the
  // moment that holds the cap level. The soil keys give no linear p-y curve, so the pile's
  // curve is replaced by p = k·y (the rest of the pile — EI, length, head fixity, t-z and Q-z
  // — comes from the file).
  const double d = 0.6, e = 3.0e7, kh = 2.0e4, h = 100.0;
  const double ei = e * std::numbers::pi * std::pow(d, 4) / 64.0;  // 190 852 kN·m²
  const double k = kh * d;
  const double lambda = std::pow(k / (4.0 * ei), 0.25);  // 0.3541 1/m; λL = 8.9: long
  // Hetényi (1946), beam on an elastic foundation, infinitely long, head held against
  // rotation (hand derivation from Hetényi's semi-infinite beam, closed form from memory):
  // y₀ = H·λ/k,
  // M₀ = H/(2λ). The cap carries the head moment: the load on the cap is H and −M₀ about y.
  const double y0 = h * lambda / k, m0 = h / (2.0 * lambda);  // 2.951 mm, 141.2 kN·m
  const std::string text = project_text(
      "subgrade_modulus: 20000",
      "length: 25\n    elastic_modulus: 3.0e7\n    head: fixed\n    torsional_stiffness: 1.0e5",
      "  - {id: A, x: 0, y: 0, type: P}", fmt::format("{{at: [0, 0, 0], Fx: {}, My: {}}}", h, -m0),
      "soil_response: nonlinear, p_multipliers: none, pushover_limit: 1");
  const std::string path = cairn::test::write_project_file(text, "nl-hetenyi");
  cairn::AnalysisOptions options;
  options.nonlinear_piles = [&](const cairn::Project& p) {
    cairn::NonlinearSoilOptions soil;
    soil.segments = 200;
    return cairn::test::spec_group(
        p, [&](cairn::NonlinearPileSpec& s) { s.curves.lateral = [k](double, double y) { return k * y; }; },
        soil);
  };
  const cairn::CheckRun run = cairn::analyse_project(path, options);
  REQUIRE(run.nonlinear);
  const cairn::CapSolution& solution = run.results.combinations.at(0).solution;
  REQUIRE_FALSE(solution.overturns);
  // Hetényi (1946), fixed head: y₀ = H·λ/k (hand derivation, above).
  REQUIRE(solution.movement.translation[0] == close(y0, 0.005));
  // Hetényi (1946), fixed head: the head held level by M₀ = H/(2λ) (hand derivation).
  REQUIRE(std::abs(solution.movement.rotation[1]) < 0.005 * y0 * lambda);
  REQUIRE(pile_force(run, 0, 0).head_moment == close(m0, 0.005));
  REQUIRE(pile_force(run, 0, 0).lateral == close(h, 1e-6));  // statics
  // The profile's head deflection and its largest moment, at the head (Hetényi: the moment
  // of a fixed head is largest there).
  const auto& extra = run.nonlinear->combinations.at(0).piles.at(0);
  REQUIRE(extra.head_deflection == close(y0, 0.005));
  REQUIRE(extra.max_moment == close(m0, 0.005));
  REQUIRE(extra.max_moment_depth == close(0.0, 0.0, 1e-9));
}

TEST_CASE("nonlinear verification: a 2×2 group at small loads equals the linear check on the "
          "curves' initial slopes",
          "[nonlinear_verification][published]") {
  // Four fixed-head piles 1.8 m apart, L = 25 m, in a soil of kh = 20 000 kN/m³; the linear
  // check takes Hetényi's head springs from kh and the given axial spring; the nonlinear one
  // the piles' own beam-columns on p = p_u·tanh(kh·b·y/p_u) (initial slope kh·b, p_u large
  // enough that the loads stay on the straight part) with a tip spring of the same axial
  // stiffness and a rigid shaft-free pile (EA large), p-multipliers off.
  const double kh = 2.0e4, d = 0.6, axial = 4.0e5;
  const std::string piles =
      "  - {id: A1, x: -0.9, y: -0.9, type: P}\n  - {id: A2, x: 0.9, y: -0.9, type: P}\n"
      "  - {id: B1, x: -0.9, y: 0.9, type: P}\n  - {id: B2, x: 0.9, y: 0.9, type: P}";
  const std::string type =
      "length: 25\n    elastic_modulus: 3.0e7\n    head: fixed\n    axial_stiffness: 400000";
  const std::string loads = "{at: [0.3, 0.2, 2.0], Fx: 60, Fy: -25, Fz: -1600, Mz: 15}";
  const std::string linear_path = cairn::test::write_project_file(
      project_text("subgrade_modulus: 20000", type, piles, loads, "soil_response: linear"),
      "nl-2x2-linear");
  const std::string nonlinear_path = cairn::test::write_project_file(
      project_text("subgrade_modulus: 20000", type, piles, loads,
                   "soil_response: nonlinear, p_multipliers: none, pushover_limit: 1"),
      "nl-2x2-nonlinear");
  const cairn::CheckRun linear = cairn::analyse_project(linear_path);
  cairn::AnalysisOptions options;
  options.nonlinear_piles = [&](const cairn::Project& p) {
    cairn::NonlinearSoilOptions soil;
    soil.segments = 200;
    return cairn::test::spec_group(
        p,
        [&](cairn::NonlinearPileSpec& s) {
          const double k = kh * d, pu = 1.0e4;
          s.curves.lateral = [k, pu](double, double y) { return pu * std::tanh(k * y / pu); };
          s.curves.shaft = [](double, double) { return 0.0; };
          s.curves.tip = [axial](double w) { return w > 0.0 ? axial * w : 0.0; };
          s.axial_rigidity = 1.0e12;
        },
        soil);
  };
  const cairn::CheckRun nonlinear = cairn::analyse_project(nonlinear_path, options);
  REQUIRE(nonlinear.nonlinear);
  const auto& a = linear.results.combinations.at(0).solution;
  const auto& b = nonlinear.results.combinations.at(0).solution;
  REQUIRE_FALSE(b.overturns);
  // The linear check is Hetényi's long pile (docs/methods-bending.md); the nonlinear pile on
  // the same initial slope is the same beam to the finite differences' accuracy (about
  // (λh)²/12 = 2e-4 with h = L/200) and the axial load's P-Δ (P/(2·√(k·EI)) ≈ 0.4 %).
  for (std::size_t j = 0; j < 3; ++j) {
    REQUIRE(b.movement.translation[j] == close(a.movement.translation[j], 0.01, 1e-7));
    REQUIRE(b.movement.rotation[j] == close(a.movement.rotation[j], 0.01, 1e-8));
  }
  for (std::size_t i = 0; i < 4; ++i) {
    REQUIRE(b.piles[i].axial == close(a.piles[i].axial, 0.01));  // hand check: P/n ± M·x/Σx²
    REQUIRE(b.piles[i].lateral == close(a.piles[i].lateral, 0.01));
    REQUIRE(b.piles[i].head_moment == close(a.piles[i].head_moment, 0.01, 0.05));
  }
}

TEST_CASE("nonlinear verification: p-multipliers lower a 3×3 group's pushover capacity",
          "[nonlinear_verification]") {
  // Nine fixed-head piles at 3 widths (1.8 m) in soft clay (Matlock 1970 curves from the file),
  // pushed along +x (2500 kN, mostly lateral) until the group finds no equilibrium (a pile's
  // head deflection passes its width, the end of its curves) or λ = 4: the group with the
  // AASHTO LRFD p-multipliers (0.8, 0.4, 0.3 at 3b, from memory) is softer than without, so
  // its capacity is no larger (common practice: the multipliers reduce every curve of the
  // trailing rows, the group's resistance can only fall).
  std::string piles;
  for (int row = 0; row < 3; ++row)
    for (int col = 0; col < 3; ++col)
      piles += fmt::format("  - {{id: P{}{}, x: {}, y: {}, type: P}}\n", row, col, 1.8 * (col - 1),
                           1.8 * (row - 1));
  const std::string type = "length: 12\n    elastic_modulus: 3.0e7\n    head: fixed";
  const std::string loads = "{at: [0, 0, 0], Fx: 2500, Fz: -900}";
  auto capacity = [&](const std::string& rule) {
    const std::string path = cairn::test::write_project_file(
        project_text("", type, piles, loads,
                     "soil_response: nonlinear, p_multipliers: " + rule + ", pushover_limit: 4"),
        "nl-3x3-" + rule);
    // The whole project route: the piles on their soil curves as `check` builds them.
    const cairn::CheckRun run = cairn::analyse_project(path);
    REQUIRE(run.nonlinear);
    REQUIRE(run.nonlinear->pushover);
    return run.nonlinear->pushover->capacity_factor;
  };
  const double with = capacity("by_direction"), without = capacity("none");
  REQUIRE(with > 0.0);
  REQUIRE(with <= without);
  REQUIRE(with < 0.98 * without);  // the trailing rows' multipliers of 0.4 and 0.3 tell
  // No more than the smallest multiplier takes away: scaling a pile's p-y curves by m ≥ 0.3
  // scales its lateral resistance at a given deflection by no less than m (a long pile's
  // stiffness k/λ grows as k^¾, Hetényi 1946; at the plateau, as m) — hand derivation.
  REQUIRE(with >= 0.3 * without);
}

TEST_CASE("nonlinear verification: a long free-head pile on a linear curve matches Hetényi's "
          "free-head closed form",
          "[nonlinear_verification][published]") {
  // EI = 700 800 kN·m² (the river pier demo's pipe), k = 5 000 kN/m², H = 68 kN at the head,
  // L = 38 m (λL = 7.6: long), pinned head, no axial load.
  const double ei = 700800.0, k = 5000.0, h = 68.0, length = 38.0;
  const double lambda = std::pow(k / (4.0 * ei), 0.25);  // 0.2055 1/m
  cairn::NonlinearPileSpec pile;
  pile.head = {0.0, 0.0, 0.0};
  pile.axis = {0.0, 0.0, -1.0};
  pile.length = length;
  pile.bending_stiffness = ei;
  pile.axial_rigidity = 1.0e7;
  pile.width = 0.762;
  pile.restraint.kind = cairn::HeadRestraint::Kind::pinned;
  pile.segments = 200;
  pile.curves.lateral = [k](double, double y) { return k * y; };
  pile.curves.shaft = [](double, double w) { return 1.0e4 * w; };
  pile.curves.tip = [](double w) { return w > 0.0 ? 1.0e5 * w : 0.0; };
  // Hetényi (1946), semi-infinite beam with an end force (closed form from memory):
  // y₀ = 2·H·λ/k, largest moment 0.3224·H/λ at λz = π/4 (hand derivation from it).
  const double y0 = 2.0 * h * lambda / k;
  const auto profile = cairn::pile_profile(pile, {y0, 0.0, 0.0, 0.0, 0.0, 0.0});
  REQUIRE(profile.converged);
  const auto response = cairn::pile_head_response(pile, {y0, 0.0, 0.0, 0.0, 0.0, 0.0});
  REQUIRE(response.converged);
  REQUIRE(std::abs(response.action[0]) == close(h, 0.005));              // Hetényi (1946), y₀
  REQUIRE(profile.max_moment == close(0.3224 * h / lambda, 0.005));       // Hetényi (1946)
  REQUIRE(profile.max_moment_depth == close(std::numbers::pi / (4.0 * lambda), 0.05));
}
