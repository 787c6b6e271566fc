// Tests for pile_head.hpp and the head moments in the rigid cap's equilibrium: the 6×6 head
// stiffness of fixed and partially fixed piles, Hetényi's (1946) and Matlock & Reese's
// (1960) closed forms, the largest moment along the pile, and Σ (r × F + M) of the heads
// equal to every applied load on random groups.
#include <catch2/catch.hpp>

#include <array>
#include <cmath>
#include <numbers>
#include <random>
#include <string>
#include <vector>

#include "cairn/app/analysis.hpp"
#include "cairn/checks/explain.hpp"
#include "cairn/geotechnics/stiffness.hpp"
#include "cairn/geotechnics/lateral.hpp"
#include "cairn/solver/cap_solver.hpp"
#include "cairn/solver/pile_head.hpp"

using cairn::CapSolver;
using cairn::HeadBending;
using cairn::HeadRestraint;
using cairn::PileSpring;
using cairn::PlaneStiffness;
using cairn::Wrench;

namespace {

constexpr double kTight = 1e-12;

// A long concrete pile, D = 0.6 m, Ep = 30 GPa: EI = 30e6·π·0.6⁴/64 = 190 851.8 kN·m²; in a
// soil of kh = 20 MN/m³: k = kh·D = 12 000 kN/m², λ = [k/(4EI)]^(1/4) = 0.354084 1/m.
const double kEI = 30e6 * std::numbers::pi * std::pow(0.6, 4) / 64.0;
constexpr double kWinkler = 12000.0;

// Σ (p × F + M) of the heads' actions about the origin.
Wrench resultant_of_heads(const std::vector<PileSpring>& springs, const cairn::CapSolution& s) {
  Wrench total{};
  for (std::size_t i = 0; i < springs.size(); ++i) {
    const auto& p = springs[i].head;
    const auto& f = s.piles[i].head_forces;
    total[0] += f[0];
    total[1] += f[1];
    total[2] += f[2];
    total[3] += p[1] * f[2] - p[2] * f[1] + f[3];
    total[4] += p[2] * f[0] - p[0] * f[2] + f[4];
    total[5] += p[0] * f[1] - p[1] * f[0] + f[5];
  }
  return total;
}

// Largest miss: forces over the largest applied force, moments over it times `size`.
double relative_miss(const Wrench& got, const Wrench& applied, double size) {
  double force = 0.0, miss = 0.0;
  for (int i = 0; i < 6; ++i) force = std::max(force, std::abs(applied[i]) / (i < 3 ? 1.0 : size));
  for (int i = 0; i < 6; ++i) miss = std::max(miss, std::abs(got[i] - applied[i]) / (i < 3 ? 1.0 : size));
  return miss / force;
}

}  // namespace

TEST_CASE("pile head: Hetényi's long pile in uniform soil", "[pile_head][published]") {
  const PlaneStiffness k = cairn::hetenyi_long_pile(kEI, kWinkler);
  const double lambda = std::pow(kWinkler / (4.0 * kEI), 0.25);
  CHECK(lambda == Approx(0.354084).epsilon(1e-6));  // value computed from λ = [k/(4EI)]^(1/4)
  // Hetényi (1946), semi-infinite beam loaded at its end (from memory): k_hh = k/λ,
  // k_hm = −k/(2λ²), k_mm = k/(2λ³) — the same as 4EIλ³, −2EIλ², 2EIλ.
  CHECK(k.k_hh == Approx(kWinkler / lambda).epsilon(kTight));
  CHECK(k.k_hm == Approx(-kWinkler / (2.0 * lambda * lambda)).epsilon(kTight));
  CHECK(k.k_mm == Approx(kWinkler / (2.0 * lambda * lambda * lambda)).epsilon(kTight));
  // The same numbers as the semi-infinite beam solved in lateral.cpp.
  cairn::ElasticPile pile;
  pile.bending_stiffness = kEI;
  pile.subgrade_modulus = kWinkler / 0.6;
  pile.width = 0.6;
  pile.head = cairn::HeadFixity::fixed;
  const auto beam = cairn::lateral_head_stiffness(pile);
  CHECK(beam.k_hm == Approx(k.k_hm).epsilon(1e-10));
  CHECK(beam.k_mm == Approx(k.k_mm).epsilon(1e-10));
}

TEST_CASE("pile head: Matlock & Reese long pile, modulus growing with depth",
          "[pile_head][published]") {
  const double nh = 5000.0;  // kN/m³
  const double t = std::pow(kEI / nh, 0.2);
  const PlaneStiffness k = cairn::matlock_reese_long_pile(kEI, nh);
  // Matlock & Reese (1960), long pile with the head fixed against rotation (from memory):
  // y0 = Fy·H·T³/EI with Fy = 0.93 and M0 = Fm·H·T with Fm = −0.93. Fixed head: y0 = H/k_hh,
  // M0 = k_hm·y0. Two-digit published coefficients: 1 %.
  CHECK(kEI / (k.k_hh * t * t * t) == Approx(0.93).epsilon(0.01));
  CHECK(k.k_hm / k.k_hh / t == Approx(-0.93).epsilon(0.01));
  // Free head: y0 = 2.435·H·T³/EI by construction (the flexibility inverted back).
  CHECK(1.0 / (k.k_hh - k.k_hm * k.k_hm / k.k_mm) == Approx(2.435 * t * t * t / kEI).epsilon(1e-12));
}

TEST_CASE("pile head: the rotational restraint condensed", "[pile_head]") {
  const PlaneStiffness k = cairn::hetenyi_long_pile(kEI, kWinkler);
  const double lambda = std::pow(kWinkler / (4.0 * kEI), 0.25);
  const auto pinned = cairn::restrained_head(k, {HeadRestraint::Kind::pinned, 0.0});
  const auto fixed = cairn::restrained_head(k, {HeadRestraint::Kind::fixed, 0.0});
  // Hetényi (1946): free head k/(2λ), fixed head k/λ (from memory).
  CHECK(pinned.lateral == Approx(kWinkler / (2.0 * lambda)).epsilon(kTight));
  CHECK_FALSE(pinned.bending.any());
  CHECK(fixed.lateral == Approx(kWinkler / lambda).epsilon(kTight));
  CHECK(fixed.bending.coupling == k.k_hm);
  CHECK(fixed.bending.rotational == k.k_mm);
  // Hand derivation (springs in series): k_r = k_mm halves the rotational term; very stiff
  // and very soft restraints approach the fixed and pinned heads.
  const auto half = cairn::restrained_head(k, {HeadRestraint::Kind::partial, k.k_mm});
  CHECK(half.bending.rotational == Approx(0.5 * k.k_mm).epsilon(kTight));
  CHECK(half.bending.coupling == Approx(0.5 * k.k_hm).epsilon(kTight));
  CHECK(half.lateral == Approx(k.k_hh - k.k_hm * k.k_hm / (2.0 * k.k_mm)).epsilon(kTight));
  const auto stiff = cairn::restrained_head(k, {HeadRestraint::Kind::partial, 1e9 * k.k_mm});
  CHECK(stiff.lateral == Approx(fixed.lateral).epsilon(1e-8));
  const auto soft = cairn::restrained_head(k, {HeadRestraint::Kind::partial, 1e-9 * k.k_mm});
  CHECK(soft.lateral == Approx(pinned.lateral).epsilon(1e-8));
}

TEST_CASE("pile head: the 6×6 matrix, symmetric, signs of a vertical fixed pile", "[pile_head]") {
  const PlaneStiffness k = cairn::hetenyi_long_pile(kEI, kWinkler);
  const HeadBending b{k.k_hm, k.k_mm, 500.0};
  const std::array<double, 3> axis = {0.3, -0.2, -std::sqrt(1.0 - 0.13)};
  const auto m = cairn::head_stiffness_matrix(axis, 1e6, k.k_hh, b);
  for (int i = 0; i < 6; ++i)
    for (int j = 0; j < 6; ++j) CHECK(m[i][j] == Approx(m[j][i]).margin(1e-9 * k.k_hh));
  // The matrix and the action agree (force and moment of the bending terms).
  const double u[3] = {0.01, -0.004, 0.002}, w[3] = {0.001, 0.003, -0.002};
  double f[3], mo[3];
  cairn::head_bending_action<double>(axis, b, u, w, f, mo);
  const auto mb = cairn::head_stiffness_matrix(axis, 0.0, 0.0, b);
  for (int i = 0; i < 3; ++i) {
    double fi = 0.0, mi = 0.0;
    for (int j = 0; j < 3; ++j) {
      fi += mb[i][j] * u[j] + mb[i][j + 3] * w[j];
      mi += mb[i + 3][j] * u[j] + mb[i + 3][j + 3] * w[j];
    }
    CHECK(f[i] == Approx(fi).margin(1e-9));
    CHECK(mo[i] == Approx(mi).margin(1e-9));
  }
  // Vertical pile, head pushed along +x and held against rotation: the cap holds it with a
  // moment −k_hm·… about y of the sign of k_hm < 0 (it would turn by +ry when free; hand
  // derivation from Hetényi's convention, pile_head.hpp).
  const auto v = cairn::head_stiffness_matrix({0.0, 0.0, -1.0}, 1e6, k.k_hh, b);
  CHECK(v[4][0] == Approx(k.k_hm).epsilon(kTight));  // My per ux
  CHECK(v[3][1] == Approx(-k.k_hm).epsilon(kTight)); // Mx per uy
  CHECK(v[3][3] == Approx(k.k_mm).epsilon(kTight));
  CHECK(v[5][5] == Approx(500.0).epsilon(kTight));
}

TEST_CASE("pile head: a fixed-head pile under the cap matches Hetényi's closed form",
          "[pile_head][published]") {
  const double lambda = std::pow(kWinkler / (4.0 * kEI), 0.25);
  const PlaneStiffness k = cairn::hetenyi_long_pile(kEI, kWinkler);
  const auto fixed = cairn::restrained_head(k, {HeadRestraint::Kind::fixed, 0.0});
  const double h = 100.0;  // kN
  SECTION("one pile, the cap held against rotation by the moment that keeps it level") {
    PileSpring s{{0.0, 0.0, 0.0}, {0.0, 0.0, -1.0}, 1e6, fixed.lateral, true, fixed.bending};
    s.bending.torsional = 1000.0;
    const CapSolver solver({s});
    // Hetényi (1946), fixed head (from memory): y0 = Hλ/k and M0 = H/(2λ), the cap supplying
    // −M0 about y (the pile would turn by +ry).
    const double m0 = h / (2.0 * lambda);
    const auto sol = solver.solve(Wrench{h, 0.0, 0.0, 0.0, -m0, 0.0});
    CHECK(sol.movement.translation[0] == Approx(h * lambda / kWinkler).epsilon(1e-9));
    CHECK(sol.movement.rotation[1] == Approx(0.0).margin(1e-15));
    CHECK(sol.piles[0].head_moment == Approx(m0).epsilon(1e-9));  // 141.21 kN·m
    CHECK(m0 == Approx(141.21).epsilon(1e-4));
    CHECK(sol.piles[0].head_forces[4] == Approx(-m0).epsilon(1e-9));
  }
  SECTION("two piles far apart on very stiff axial springs hold the cap level") {
    const std::vector<PileSpring> springs = {
        {{-5.0, 0.0, 0.0}, {0.0, 0.0, -1.0}, 1e12, fixed.lateral, true, fixed.bending},
        {{5.0, 0.0, 0.0}, {0.0, 0.0, -1.0}, 1e12, fixed.lateral, true, fixed.bending}};
    const CapSolver solver(springs);
    const auto sol = solver.solve(Wrench{2.0 * h, 0.0, 0.0, 0.0, 0.0, 0.0});
    CHECK(sol.movement.translation[0] == Approx(h * lambda / kWinkler).epsilon(1e-6));
    CHECK(sol.piles[0].head_moment == Approx(h / (2.0 * lambda)).epsilon(1e-6));
    CHECK(sol.piles[0].lateral == Approx(h).epsilon(1e-9));
  }
}

TEST_CASE("pile head: the largest moment along the pile", "[pile_head][published]") {
  cairn::ElasticPile pile;
  pile.bending_stiffness = kEI;
  pile.subgrade_modulus = kWinkler / 0.6;
  pile.width = 0.6;
  const double lambda = std::pow(kWinkler / (4.0 * kEI), 0.25);
  const auto influence = cairn::moment_influence(pile);
  const double h = 100.0;
  // Free head (Hetényi 1946, from memory): Mmax = 0.3224·H/λ at z = π/(4λ), whatever the
  // direction of H across a vertical pile.
  for (double angle : {0.0, 0.7, 2.0}) {
    const auto peak = cairn::largest_moment_along(
        influence, {0.0, 0.0, -1.0}, {h * std::cos(angle), h * std::sin(angle), 0, 0, 0, 0});
    CHECK(peak.value == Approx(0.3224 * h / lambda).epsilon(2e-4));
    CHECK(peak.depth == Approx(std::numbers::pi / (4.0 * lambda)).epsilon(1e-3));
    CHECK(peak.head == Approx(0.0).margin(1e-9));
  }
  // Fixed head: the largest moment is the head's, H/(2λ), the cap's moment −H/(2λ) about y.
  const auto fixed = cairn::largest_moment_along(influence, {0.0, 0.0, -1.0},
                                                 {h, 0, 0, 0, -h / (2.0 * lambda), 0});
  CHECK(fixed.value == Approx(h / (2.0 * lambda)).epsilon(1e-9));
  CHECK(fixed.depth == 0.0);
}

TEST_CASE("pile head: heads' forces and moments add up to the load on random groups",
          "[pile_head]") {
  std::mt19937 random(20261202);
  std::uniform_real_distribution<double> unit(-1.0, 1.0), positive(0.2, 1.0);
  const PlaneStiffness k = cairn::hetenyi_long_pile(kEI, kWinkler);
  double worst = 0.0;
  for (int trial = 0; trial < 200; ++trial) {
    const int n = 3 + trial % 9;
    std::vector<PileSpring> springs;
    const double far = trial % 3 == 0 ? 1e4 : 0.0;  // some groups far from the origin
    for (int i = 0; i < n; ++i) {
      std::array<double, 3> axis = {0.0, 0.0, -1.0};
      if (i % 2 == 1) {
        const double ratio = 3.0 + 6.0 * positive(random), toward = 3.2 * unit(random);
        const double norm = std::sqrt(1.0 + ratio * ratio);
        axis = {std::cos(toward) / norm, std::sin(toward) / norm, -ratio / norm};
      }
      HeadRestraint r{HeadRestraint::Kind::fixed, 0.0};
      if (i % 3 == 2) r = {HeadRestraint::Kind::partial, k.k_mm * 2.0 * positive(random)};
      auto head = cairn::restrained_head(k, r);
      head.bending.torsional = i % 4 == 0 ? 800.0 * positive(random) : 0.0;
      springs.push_back({{far + 6.0 * unit(random), far + 4.0 * unit(random), 0.0},
                         axis,
                         1e5 * std::pow(10.0, 2.0 * positive(random)),
                         head.lateral * positive(random),
                         true,
                         head.bending});
    }
    const CapSolver solver(springs);
    // A load at a point above the cap (a column at height), moved to the origin.
    const std::array<double, 3> at = {far + 2.0 * unit(random), far + 2.0 * unit(random),
                                      1.5 + 4.0 * positive(random)};
    const std::array<double, 6> f = {300 * unit(random), 300 * unit(random), -3000 * positive(random),
                                     200 * unit(random), 200 * unit(random), 100 * unit(random)};
    const Wrench load = {f[0], f[1], f[2],
                         f[3] + at[1] * f[2] - at[2] * f[1],
                         f[4] + at[2] * f[0] - at[0] * f[2],
                         f[5] + at[0] * f[1] - at[1] * f[0]};
    const auto sol = solver.solve(load);
    REQUIRE_FALSE(sol.overturns);
    double size = 0.0;
    for (const auto& s : springs)
      size = std::max(size, std::hypot(s.head[0] - solver.reference()[0], s.head[1] - solver.reference()[1]));
    // About the origin far away, the moments carry the lever arm: compared relative to
    // the load's size at the group (|F|·(far + size)).
    const double arm = size + std::hypot(solver.reference()[0], solver.reference()[1]);
    worst = std::max(worst, relative_miss(resultant_of_heads(springs, sol), load, arm));
  }
  // Equilibrium of a rigid body (common practice), to 1e-9 of the load.
  CHECK(worst < 1e-9);
}

TEST_CASE("pile head: a project with fixed and partial heads, self-weight and a high load",
          "[pile_head]") {
  const auto run = cairn::analyse_project(std::string(CAIRN_TEST_DATA) + "/bending/fixed_heads.yaml");
  const auto& p = run.project;
  for (std::size_t c = 0; c < p.combinations.size(); ++c) {
    const auto& check = run.results.combinations[c];
    Wrench total{};
    double size = 0.0;
    for (std::size_t i = 0; i < p.piles.size(); ++i) {
      const auto& f = check.solution.piles[i].head_forces;
      const double x = p.piles[i].x, y = p.piles[i].y;
      size = std::max(size, std::hypot(x, y));
      total[0] += f[0];
      total[1] += f[1];
      total[2] += f[2];
      total[3] += y * f[2] + f[3];
      total[4] += -x * f[2] + f[4];
      total[5] += x * f[1] - y * f[0] + f[5];
      // A compression pile has Fz < 0 (the cap pushes it down).
      if (check.piles[i].axial > 1.0) CHECK(f[2] < 0.0);
    }
    // Every load: the column at 6 m above the heads, the cap's self-weight (6 × 4 × 1.4 × 25
    // = 840 kN, added by cairn) — the combination's resultant about the origin.
    const Wrench applied = cairn::combination_load(p, p.combinations[c]);
    CHECK(relative_miss(total, applied, size) < 1e-9);
    // Fixed heads take moments; the largest moment along the pile is at least the head's.
    CHECK(check.piles[0].head_moment > 0.0);
    CHECK(check.piles[0].max_moment >= check.piles[0].head_moment);
  }
  // The self-weight is among the loads of D.
  const Wrench d = cairn::combination_load(p, p.combinations[0]);
  CHECK(d[2] == Approx(-3000.0 - 840.0 + 200.0).epsilon(1e-12));  // hand sum of S1's Fz
  // The cap stiffness about the origin is symmetric.
  for (int i = 0; i < 6; ++i)
    for (int j = 0; j < 6; ++j)
      CHECK(run.cap_stiffness[i][j] ==
            Approx(run.cap_stiffness[j][i]).margin(1e-9 * std::abs(run.cap_stiffness[i][i])));
}

TEST_CASE("pile head: a layer with a modulus gradient takes Matlock & Reese's terms",
          "[pile_head][published]") {
  cairn::Project p;
  cairn::PileType type;
  type.id = "B";
  type.section = {cairn::SectionShape::round, 0.6};
  type.elastic_modulus = 3.0e7;
  type.head = cairn::HeadFixity::fixed;
  const double nh = 8000.0;                     // kN/m³
  const double t = std::pow(kEI / nh, 0.2);     // T = (EI/nh)^(1/5), m
  type.length = 8.0 * t;                        // long: L ≥ 5T
  p.pile_types.push_back(type);
  cairn::Pile pile;
  pile.id = "P1";
  p.piles.push_back(pile);
  cairn::SoilLayer sand;
  sand.name = "loose sand";
  sand.kind = cairn::SoilKind::sand;
  sand.thickness = 40.0;
  sand.modulus_gradient = nh;
  cairn::SoilProfile soil;
  soil.layers.push_back(sand);
  p.soil = soil;
  const auto fixed = cairn::pile_type_stiffness(p, {});
  // Matlock & Reese (1960), fixed head (from memory): y0 = 0.93·H·T³/EI, so the lateral spring
  // is EI/(0.93·T³), within the coefficients' two digits.
  CHECK(fixed[0].lateral == Approx(kEI / (0.93 * t * t * t)).epsilon(0.01));
  CHECK(fixed[0].bending.any());
  REQUIRE(fixed[0].influence);
  // The moment along the pile from the finite-difference beam: a fixed head held level under
  // H has M0 = 0.93·H·T at the head (Matlock & Reese's Fm, from memory), the largest moment.
  const double h = 100.0;
  const auto k = cairn::matlock_reese_long_pile(kEI, nh);
  const auto peak = cairn::largest_moment_along(*fixed[0].influence, {0.0, 0.0, -1.0},
                                                {h, 0, 0, 0, k.k_hm / k.k_hh * h, 0});
  CHECK(peak.head == Approx(0.93 * h * t).epsilon(0.01));
  CHECK(peak.value == Approx(peak.head).epsilon(1e-9));
  // A short pile (L = 3T) takes the finite-difference beam; with a free head it is softer.
  p.pile_types[0].length = 3.0 * t;
  p.pile_types[0].head = cairn::HeadFixity::pinned;
  const auto short_pinned = cairn::pile_type_stiffness(p, {});
  // Matlock & Reese's free-head long pile: y0 = 2.435·H·T³/EI; a short pile deflects more.
  CHECK(short_pinned[0].lateral < kEI / (2.435 * t * t * t));
  CHECK_FALSE(short_pinned[0].influence);
  CHECK(short_pinned[0].lateral_source.find("finite-difference") != std::string::npos);
}

TEST_CASE("pile head: the hand check of a fixed-head pile takes off the heads' moments",
          "[pile_head]") {
  // The demo's nine vertical piles of one type: P = V/n + (My − ΣMy_heads)·x'/Σx'² (hand
  // derivation: moment equilibrium of the cap about the centroid at the heads, the heads'
  // moments included) equals the solver's axial force.
  const auto run =
      cairn::analyse_project(std::string(CAIRN_DEMO_DIR) + "/pier-fixed-heads/cap.yaml");
  for (std::size_t pile = 0; pile < run.project.piles.size(); ++pile) {
    for (const auto& h : cairn::explain_pile(run.project, run.results, pile)) {
      REQUIRE(h.available);
      CHECK(h.axial == Approx(h.solver_axial).epsilon(1e-9));
    }
  }
  const auto w1 = cairn::explain_pile(run.project, run.results, 0)[1];
  CHECK(w1.heads_moment_y < 0.0);  // the cap holds the heads against turning with the wind
}
