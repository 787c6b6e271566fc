// Tests for nonlinear_pile.hpp: one pile's head action and tangent on soil curves, checked
// against closed forms on linear curves (Hetényi 1946; Matlock & Reese 1960; a bar on a
// uniform elastic shaft spring with a tip spring, hand derivation), the curves' initial
// slopes at small movements, invariance under rotation and batter, the resultant-deflection
// rule, Broms' (1964) rigid-plastic short pile at large movements, and the failures.
#include <catch2/catch.hpp>

#include <algorithm>
#include <array>
#include <cmath>
#include <numbers>

#include "cairn/geotechnics/axial_curves.hpp"
#include "cairn/geotechnics/py_curves.hpp"
#include "cairn/solver/nonlinear_pile.hpp"
#include "cairn/solver/pile_head.hpp"
#include "support.hpp"

using cairn::HeadMovement;
using cairn::HeadRestraint;
using cairn::Matrix6Rows;
using cairn::NonlinearPileSpec;
using cairn::test::close;

namespace {

// A long concrete pile, D = 0.6 m, E = 30 GPa: EI = 30e6·π·0.6⁴/64 = 190 851.8 kN·m²,
// EA = 30e6·π·0.6²/4 = 8 482 300 kN; 30 m long.
const double kEI = 30e6 * std::numbers::pi * std::pow(0.6, 4) / 64.0;
const double kEA = 30e6 * std::numbers::pi * 0.36 / 4.0;
constexpr double kLength = 30.0;

NonlinearPileSpec linear_pile(double winkler, HeadRestraint restraint, int segments = 60) {
  NonlinearPileSpec pile;
  pile.axis = {0.0, 0.0, -1.0};
  pile.length = kLength;
  pile.bending_stiffness = kEI;
  pile.axial_rigidity = kEA;
  pile.width = 0.6;
  pile.restraint = restraint;
  pile.segments = segments;
  pile.curves.lateral = [winkler](double, double y) { return winkler * y; };
  pile.curves.shaft = [](double, double w) { return 20000.0 * w; };
  pile.curves.tip = [](double w) { return w > 0.0 ? 300000.0 * w : 0.0; };
  return pile;
}

// Hand derivation: a bar of rigidity EA on a uniform shaft spring c (kN/m per m) with a tip
// spring k_tip, head stiffness N0/w0. EA·w'' = c·w, w(0) = w0, −EA·w'(L) = k_tip·w(L):
// w = A·cosh βz + B·sinh βz, β = √(c/EA), Ω = k_tip/(EA·β),
// k_a = EA·β·(tanh βL + Ω)/(1 + Ω·tanh βL).
double bar_on_springs(double ea, double c, double k_tip, double length) {
  const double beta = std::sqrt(c / ea), omega = k_tip / (ea * beta), t = std::tanh(beta * length);
  return ea * beta * (t + omega) / (1.0 + omega * t);
}

// Every entry of `got` against `want`, within `relative` of the largest entry of its 3×3 block.
void require_matrix(const Matrix6Rows& got, const Matrix6Rows& want, double relative) {
  for (int bi = 0; bi < 2; ++bi)
    for (int bj = 0; bj < 2; ++bj) {
      double scale = 0.0;
      for (int i = 0; i < 3; ++i)
        for (int j = 0; j < 3; ++j) scale = std::max(scale, std::abs(want[3 * bi + i][3 * bj + j]));
      for (int i = 0; i < 3; ++i)
        for (int j = 0; j < 3; ++j) {
          CAPTURE(3 * bi + i, 3 * bj + j);
          REQUIRE(got[3 * bi + i][3 * bj + j] ==
                  close(want[3 * bi + i][3 * bj + j], relative, relative * scale + 1e-9));
        }
    }
}

HeadRestraint pinned() { return {}; }
HeadRestraint fixed() { return {HeadRestraint::Kind::fixed, 0.0}; }
HeadRestraint partial(double k) { return {HeadRestraint::Kind::partial, k}; }

// Rotation matrix about the unit vector n by angle t (Rodrigues' formula).
std::array<std::array<double, 3>, 3> rotation(std::array<double, 3> n, double t) {
  const double c = std::cos(t), s = std::sin(t);
  std::array<std::array<double, 3>, 3> r{};
  const double k[3][3] = {{0, -n[2], n[1]}, {n[2], 0, -n[0]}, {-n[1], n[0], 0}};
  for (int i = 0; i < 3; ++i)
    for (int j = 0; j < 3; ++j) {
      double kk = 0.0;
      for (int m = 0; m < 3; ++m) kk += k[i][m] * k[m][j];
      r[i][j] = (i == j ? 1.0 : 0.0) + s * k[i][j] + (1.0 - c) * kk;
    }
  return r;
}

std::array<double, 3> apply(const std::array<std::array<double, 3>, 3>& r, const double* v) {
  return {r[0][0] * v[0] + r[0][1] * v[1] + r[0][2] * v[2],
          r[1][0] * v[0] + r[1][1] * v[1] + r[1][2] * v[2],
          r[2][0] * v[0] + r[2][1] * v[1] + r[2][2] * v[2]};
}

}  // namespace

TEST_CASE("nonlinear pile: linear p-y on a long pile gives Hetényi's head stiffness",
          "[nonlinear_pile][published]") {
  constexpr double kWinkler = 12000.0;  // kN/m², λ = 0.354 1/m, λL = 10.6: a long pile
  const double k_a = bar_on_springs(kEA, 20000.0, 300000.0, kLength);
  for (const HeadRestraint& restraint : {pinned(), fixed(), partial(80000.0)}) {
    CAPTURE(static_cast<int>(restraint.kind));
    NonlinearPileSpec pile = linear_pile(kWinkler, restraint);
    pile.torsional = 5000.0;
    const auto response =
        cairn::pile_head_response(pile, {0.004, -0.002, -0.003, 0.001, 0.0005, 0.0});
    REQUIRE(response.converged);
    // Source: Hetényi (1946), semi-infinite beam on elastic foundation: k_hh = 4EIλ³,
    // k_hm = −2EIλ², k_mm = 2EIλ (hetenyi_long_pile); the restraint condensed by
    // restrained_head (hand derivation); the axial term by bar_on_springs (hand derivation).
    // 1 %: the soil springs lumped at the nodes (λh = 0.18 at 60 segments).
    const auto head = cairn::restrained_head(cairn::hetenyi_long_pile(kEI, kWinkler), restraint);
    cairn::HeadBending bending = head.bending;
    bending.torsional = 5000.0;
    const Matrix6Rows want = cairn::head_stiffness_matrix(pile.axis, k_a, head.lateral, bending);
    require_matrix(response.tangent, want, 1e-2);
    // Linear curves and no axial force (no P-Δ): the action is the tangent times the movement.
    const HeadMovement m{0.004, -0.002, 0.0, 0.001, 0.0005, 0.0};
    const auto flat = cairn::pile_head_response(pile, m);
    for (int i = 0; i < 6; ++i) {
      double expected = 0.0;
      for (int j = 0; j < 6; ++j) expected += flat.tangent[i][j] * m[j];
      REQUIRE(flat.action[i] == close(expected, 1e-7, 1e-6));
    }
  }
}

TEST_CASE("nonlinear pile: the finite-element head stiffness converges on Hetényi's",
          "[nonlinear_pile][published]") {
  constexpr double kWinkler = 12000.0;
  // Source: Hetényi (1946), as above; at 400 segments (λh = 0.027) within 0.05 %.
  const auto head = cairn::restrained_head(cairn::hetenyi_long_pile(kEI, kWinkler), fixed());
  const auto response =
      cairn::pile_head_response(linear_pile(kWinkler, fixed(), 400), {0.001, 0, 0, 0, 0, 0});
  REQUIRE(response.converged);
  REQUIRE(response.tangent[0][0] == close(head.lateral, 5e-4));
  REQUIRE(response.tangent[4][4] == close(head.bending.rotational, 5e-4));
  // The coupling: F = K_lr·(a × ω), a = −z: F_x = K_lr·ω_y, so T[0][4] = K_lr.
  REQUIRE(response.tangent[0][4] == close(head.bending.coupling, 5e-4));
}

TEST_CASE("nonlinear pile: p = nh·z·y gives Matlock & Reese's long-pile head stiffness",
          "[nonlinear_pile][published]") {
  constexpr double kGradient = 5000.0;  // nh, kN/m³: T = (EI/nh)^(1/5) = 2.07 m, L/T = 14.5
  for (const HeadRestraint& restraint : {pinned(), fixed()}) {
    CAPTURE(static_cast<int>(restraint.kind));
    NonlinearPileSpec pile = linear_pile(0.0, restraint, 120);
    pile.curves.lateral = [](double z, double y) { return kGradient * z * y; };
    const auto response = cairn::pile_head_response(pile, {0.002, 0, 0, 0, 0, 0});
    REQUIRE(response.converged);
    // Source: Matlock & Reese (1960), long pile, head coefficients Ay = 2.435, By = As = 1.623,
    // Bs = 1.750 (from memory; matlock_reese_long_pile). 1 %: the coefficients' 4 digits and
    // the lumped springs.
    const auto head =
        cairn::restrained_head(cairn::matlock_reese_long_pile(kEI, kGradient), restraint);
    REQUIRE(response.tangent[0][0] == close(head.lateral, 1e-2));
    REQUIRE(response.tangent[1][1] == close(head.lateral, 1e-2));
    REQUIRE(response.tangent[0][4] == close(head.bending.coupling, 1e-2, 1e-6));
    REQUIRE(response.tangent[4][4] == close(head.bending.rotational, 1e-2, 1e-6));
  }
}

TEST_CASE("nonlinear pile: the axial bar on linear t-z and tip springs", "[nonlinear_pile]") {
  // Hand derivation (bar_on_springs above), against 60 and 400 segments: the lumped shaft
  // springs are second-order accurate.
  for (int segments : {60, 400}) {
    NonlinearPileSpec pile = linear_pile(12000.0, pinned(), segments);
    const auto response = cairn::pile_head_response(pile, {0, 0, -0.005, 0, 0, 0});
    REQUIRE(response.converged);
    const double k_a = bar_on_springs(kEA, 20000.0, 300000.0, kLength);
    REQUIRE(response.tangent[2][2] == close(k_a, segments == 60 ? 2e-3 : 1e-4));
    // Pushed into the ground (a = −z, u_z = −0.005): F·a = k_a·0.005 > 0, F_z < 0.
    REQUIRE(response.action[2] == close(-k_a * 0.005, segments == 60 ? 2e-3 : 1e-4));
  }
}

TEST_CASE("nonlinear pile: a pile that takes no tension leaves the cap when pulled",
          "[nonlinear_pile]") {
  NonlinearPileSpec pile = linear_pile(12000.0, pinned());
  pile.tension = false;
  const auto pulled = cairn::pile_head_response(pile, {0, 0, 0.002, 0, 0, 0});
  REQUIRE(pulled.converged);
  REQUIRE(pulled.action[2] == 0.0);
  REQUIRE(pulled.tangent[2][2] == 0.0);
  pile.tension = true;
  const auto held = cairn::pile_head_response(pile, {0, 0, 0.002, 0, 0, 0});
  REQUIRE(held.action[2] > 0.0);  // the cap pulls the pile up: F along +z
}

TEST_CASE(
    "nonlinear pile: at small movements the tangent is the linear response with the "
    "curves' initial slopes",
    "[nonlinear_pile]") {
  // API sand (O'Neill & Murchison 1983): p = A·pu·tanh(k·z·y/(A·pu)), initial slope k·z.
  // API t-z sand: linear up to 2.5 mm; Q-z: 0.25·Qp at z = 0.002·D (initial slope).
  cairn::SandApiPy sand;
  sand.friction_angle = 35.0;
  sand.effective_unit_weight = 10.0;
  sand.width = 0.6;
  sand.initial_modulus = 20000.0;
  constexpr double kShaftMax = 60.0 * std::numbers::pi * 0.6;  // t_max·perimeter, kN/m
  constexpr double kTipMax = 2000.0;                           // Q_p, kN
  NonlinearPileSpec curved = linear_pile(0.0, fixed());
  curved.curves.lateral = [sand](double z, double y) { return sand.resistance(z, y); };
  curved.curves.shaft = [](double, double w) {
    return kShaftMax * cairn::shaft_transfer(cairn::AxialSoil::sand, 0.6, w);
  };
  curved.curves.tip = [](double w) { return kTipMax * cairn::tip_transfer(0.6, w); };
  NonlinearPileSpec straight = curved;
  straight.curves.lateral = [](double z, double y) { return 20000.0 * z * y; };
  straight.curves.shaft = [](double, double w) { return kShaftMax / 0.0025 * w; };
  straight.curves.tip = [](double w) { return w > 0 ? kTipMax * 0.25 / (0.002 * 0.6) * w : 0.0; };
  const HeadMovement small{1e-5, 0.5e-5, -1e-5, 0.0, 0.0, 0.0};
  const auto a = cairn::pile_head_response(curved, small);
  const auto b = cairn::pile_head_response(straight, small);
  REQUIRE(a.converged);
  REQUIRE(b.converged);
  // 1e-3: tanh's departure from its slope at k·z·y/(A·pu) ≈ 0.005 is ~1e-5 (hand estimate).
  require_matrix(a.tangent, b.tangent, 1e-3);
  for (int i = 0; i < 6; ++i) REQUIRE(a.action[i] == close(b.action[i], 1e-3, 1e-6));
}

TEST_CASE("nonlinear pile: a pile rotated in plan or battered gives the rotated action",
          "[nonlinear_pile]") {
  // Common practice (frame invariance): the same pile and soil turned by R, moved by R·(u, ω),
  // act with R·(F, M). Matlock's soft clay (1970) makes it nonlinear.
  cairn::SoftClayPy clay;
  clay.undrained_strength = 30.0;
  clay.effective_unit_weight = 8.0;
  clay.width = 0.6;
  clay.strain_50 = 0.01;
  NonlinearPileSpec pile = linear_pile(0.0, partial(50000.0));
  pile.curves.lateral = [clay](double z, double y) { return clay.resistance(z, y); };
  pile.torsional = 3000.0;
  const double u[3] = {0.03, -0.02, -0.004}, w[3] = {0.002, 0.001, 0.0007};
  const auto base = cairn::pile_head_response(pile, {u[0], u[1], u[2], w[0], w[1], w[2]});
  REQUIRE(base.converged);
  for (const auto& [n, angle] :
       {std::pair<std::array<double, 3>, double>{{0.0, 0.0, 1.0}, 0.7},              // in plan
        std::pair<std::array<double, 3>, double>{{0.6, 0.8, 0.0}, std::atan(0.25)},  // 1:4 batter
        std::pair<std::array<double, 3>, double>{{0.48, 0.6, 0.64}, 1.1}}) {
    const auto r = rotation(n, angle);
    NonlinearPileSpec turned = pile;
    const double axis[3] = {pile.axis[0], pile.axis[1], pile.axis[2]};
    turned.axis = apply(r, axis);
    const auto ru = apply(r, u), rw = apply(r, w);
    const auto got = cairn::pile_head_response(turned, {ru[0], ru[1], ru[2], rw[0], rw[1], rw[2]});
    REQUIRE(got.converged);
    const auto f = apply(r, base.action.data()), m = apply(r, base.action.data() + 3);
    for (int i = 0; i < 3; ++i) {
      REQUIRE(got.action[i] == close(f[i], 1e-7, 1e-6));
      REQUIRE(got.action[i + 3] == close(m[i], 1e-7, 1e-6));
    }
  }
}

TEST_CASE("nonlinear pile: a skewed deflection acts on the resultant", "[nonlinear_pile]") {
  // The p-y curve is applied to the resultant deflection, p along it (common practice for
  // round piles): a head deflection d at any angle in plan gives the same force along it.
  cairn::SoftClayPy clay;
  clay.undrained_strength = 25.0;
  clay.effective_unit_weight = 7.0;
  clay.width = 0.6;
  NonlinearPileSpec pile = linear_pile(0.0, fixed());
  pile.curves.lateral = [clay](double z, double y) { return clay.resistance(z, y); };
  const double d = 0.05;
  const auto along_x = cairn::pile_head_response(pile, {d, 0, 0, 0, 0, 0});
  REQUIRE(along_x.converged);
  const double t = 0.6;
  const auto skewed =
      cairn::pile_head_response(pile, {d * std::cos(t), d * std::sin(t), 0, 0, 0, 0});
  REQUIRE(skewed.converged);
  REQUIRE(skewed.action[0] == close(along_x.action[0] * std::cos(t), 1e-7));
  REQUIRE(skewed.action[1] == close(along_x.action[0] * std::sin(t), 1e-7));
  // Two planes solved apart would give each plane its own smaller deflection, a stiffer
  // response: the resultant force here is that of the pile pushed along x.
  REQUIRE(std::hypot(skewed.action[0], skewed.action[1]) == close(along_x.action[0], 1e-7));
}

TEST_CASE(
    "nonlinear pile: at large movements a short rigid pile reaches Broms' ultimate "
    "load",
    "[nonlinear_pile][published]") {
  // Broms (1964), "Lateral resistance of piles in cohesive soils", JSMFD 90(SM2): a short
  // free-head pile in clay, no resistance over the top 1.5·D, 9·cu·D below; H·(e + 1.5D +
  // 0.5f) = 2.25·D·g²·cu with f = H/(9·cu·D), L = 1.5D + f + g (e = 0).
  constexpr double kCu = 50.0, kD = 0.5, kL = 6.0, kYield = 0.0005;
  NonlinearPileSpec pile;
  pile.axis = {0, 0, -1};
  pile.length = kL;
  pile.bending_stiffness = 1e7;  // rigid against the soil
  pile.axial_rigidity = 1e7;
  pile.width = kD;
  pile.segments = 240;
  pile.curves.lateral = [](double z, double y) {
    if (z < 1.5 * kD) return 0.0;
    return 9.0 * kCu * kD * std::clamp(y / kYield, -1.0, 1.0);
  };
  pile.curves.shaft = [](double, double w) { return 1000.0 * w; };
  double lo = 0.0, hi = 9.0 * kCu * kD * kL;
  for (int i = 0; i < 200; ++i) {
    const double h = 0.5 * (lo + hi), f = h / (9.0 * kCu * kD), g = kL - 1.5 * kD - f;
    (h * (1.5 * kD + 0.5 * f) < 2.25 * kD * g * g * kCu ? lo : hi) = h;
  }
  const double broms = lo;  // 405.3 kN
  const auto response = cairn::pile_head_response(pile, {0.3, 0, 0, 0, 0, 0});
  INFO(response.message);
  REQUIRE(response.converged);
  // 1 %: the springs near the turning point are still elastic (within ~1 cm of it) and the
  // reactions are lumped at the nodes (h = 2.5 cm: the node at 1.5·D takes half a step of
  // resistance Broms leaves out: 407.6 kN against 405.3, +0.6 %).
  REQUIRE(response.action[0] == close(broms, 1e-2));
}

TEST_CASE("nonlinear pile: failures come back as messages", "[nonlinear_pile]") {
  SECTION("a head deflection far beyond the lateral capacity") {
    // Matlock (1970): pu is reached at 8·y50 = 8·2.5·ε50·b = 0.24 m for b = 0.6 m, ε50 = 0.02;
    // a head pushed 1 m (more than the width) is past it: no result, a message.
    cairn::SoftClayPy clay;
    clay.undrained_strength = 20.0;
    clay.effective_unit_weight = 7.0;
    clay.width = 0.6;
    NonlinearPileSpec pile = linear_pile(0.0, pinned());
    pile.curves.lateral = [clay](double z, double y) { return clay.resistance(z, y); };
    const auto response = cairn::pile_head_response(pile, {0.8, 0.6, 0, 0, 0, 0});
    REQUIRE_FALSE(response.converged);
    REQUIRE(cairn::test::has(response.message, "lateral capacity"));
    // Just inside the width it still answers (the soil at its ultimate near the head).
    REQUIRE(cairn::pile_head_response(pile, {0.55, 0, 0, 0, 0, 0}).converged);
  }
  SECTION("an axial load above the buckling load") {
    // Hetényi (1946): a long beam on an elastic foundation buckles at P = 2·√(k·EI):
    // k = 10 kN/m², EI = 1000 kN·m² → 200 kN; the head pushed to carry about 1000 kN.
    NonlinearPileSpec pile;
    pile.axis = {0, 0, -1};
    pile.length = 40.0;
    pile.bending_stiffness = 1000.0;
    pile.axial_rigidity = 1e6;
    pile.segments = 80;
    pile.curves.lateral = [](double, double y) { return 10.0 * y; };
    pile.curves.tip = [](double w) { return w > 0 ? 1e6 * w : 0.0; };
    const auto response = cairn::pile_head_response(pile, {0.01, 0, -0.04, 0, 0, 0});
    REQUIRE_FALSE(response.converged);
    REQUIRE(cairn::test::has(response.message, "buckling"));
    const auto profile = cairn::pile_profile(pile, {0.01, 0, -0.04, 0, 0, 0});
    REQUIRE_FALSE(profile.converged);
  }
  SECTION("malformed specs throw") {
    NonlinearPileSpec pile = linear_pile(1000.0, pinned());
    pile.length = 0.0;
    REQUIRE_THROWS_AS(cairn::pile_head_response(pile, {}), std::invalid_argument);
    pile = linear_pile(1000.0, partial(0.0));
    REQUIRE_THROWS_AS(cairn::pile_head_response(pile, {}), std::invalid_argument);
  }
}

TEST_CASE("nonlinear pile: the profile's moment and shear at the head match the action",
          "[nonlinear_pile]") {
  // Hetényi (1946), fixed long pile: the head moment is k_hm·y0 (hand check through the
  // tangent, linear curves), and the largest moment is at the fixed head.
  NonlinearPileSpec pile = linear_pile(12000.0, fixed(), 200);
  const HeadMovement m{0.01, 0, 0, 0, 0, 0};
  const auto response = cairn::pile_head_response(pile, m);
  const auto profile = cairn::pile_profile(pile, m);
  REQUIRE(profile.converged);
  REQUIRE(profile.head_deflection == close(0.01, 1e-12));
  REQUIRE(profile.moment.front() == close(std::abs(response.action[4]), 1e-6));
  REQUIRE(profile.shear.front() == close(std::abs(response.action[0]), 1e-2));
  REQUIRE(profile.max_moment_depth == 0.0);
  REQUIRE(profile.deflection.back() < 1e-4 * profile.deflection.front());
  // Pinned: no moment at the head.
  const auto free_head = cairn::pile_profile(linear_pile(12000.0, pinned(), 200), m);
  REQUIRE(free_head.moment.front() == close(0.0, 0.0, 1e-6));
  REQUIRE(free_head.max_moment > 0.0);
  // Hetényi (1946), free head: the largest moment lies at λz = π/4 (0.785/λ = 2.22 m).
  const double lambda = std::pow(12000.0 / (4.0 * kEI), 0.25);
  REQUIRE(free_head.max_moment_depth == close(std::numbers::pi / 4.0 / lambda, 0.1));
  // Hetényi (1946), free head: M_max = e^(−π/4)·sin(π/4)·H/λ = 0.3224·H/λ (1 %: the nodes
  // 0.15 m apart and the lumped springs).
  const auto free_action = cairn::pile_head_response(linear_pile(12000.0, pinned(), 200), m);
  REQUIRE(free_head.max_moment == close(0.3224 * free_action.action[0] / lambda, 1e-2));
}

TEST_CASE("nonlinear pile: a call started from a nearby state gives the same answer",
          "[nonlinear_pile]") {
  // Common practice (Newton's method): the solution does not depend on the starting point.
  cairn::SoftClayPy clay;
  clay.undrained_strength = 30.0;
  clay.effective_unit_weight = 8.0;
  clay.width = 0.6;
  NonlinearPileSpec pile = linear_pile(0.0, fixed());
  pile.curves.lateral = [clay](double z, double y) { return clay.resistance(z, y); };
  cairn::DeflectedShape state;
  REQUIRE(
      cairn::pile_head_response(pile, {0.02, 0.01, -0.004, 0, 0.002, 0}, 1.0, &state).converged);
  REQUIRE_FALSE(state.lateral.empty());
  const HeadMovement next{0.025, 0.008, -0.005, 0.0005, 0.0015, 0};
  const auto warm = cairn::pile_head_response(pile, next, 1.0, &state);
  const auto cold = cairn::pile_head_response(pile, next);
  REQUIRE(warm.converged);
  for (int i = 0; i < 6; ++i) {
    REQUIRE(warm.action[i] == close(cold.action[i], 1e-7, 1e-6));
    for (int j = 0; j < 6; ++j)
      REQUIRE(warm.tangent[i][j] == close(cold.tangent[i][j], 1e-6, 1e-3));
  }
}

TEST_CASE("nonlinear pile: the condensed tangent is the derivative of the head action",
          "[nonlinear_pile]") {
  // Hand check (calculus): central differences of the action over each movement component
  // agree with the analytic tangent on nonlinear curves (Matlock 1970 soft clay; API sand t-z
  // and Q-z), for each head restraint, with P-Δ from the axial force.
  cairn::SoftClayPy clay;
  clay.undrained_strength = 30.0;
  clay.effective_unit_weight = 8.0;
  clay.width = 0.6;
  clay.strain_50 = 0.01;
  for (const HeadRestraint& restraint : {pinned(), fixed(), partial(60000.0)}) {
    CAPTURE(static_cast<int>(restraint.kind));
    NonlinearPileSpec pile = linear_pile(0.0, restraint);
    pile.curves.lateral = [clay](double z, double y) { return clay.resistance(z, y); };
    pile.curves.shaft = [](double, double w) {
      return 100.0 * cairn::shaft_transfer(cairn::AxialSoil::sand, 0.6, w);
    };
    pile.curves.tip = [](double w) { return 1500.0 * cairn::tip_transfer(0.6, w); };
    pile.torsional = 2000.0;
    const HeadMovement m{0.015, -0.01, -0.002, 0.001, 0.0015, 0.0003};
    const auto at = cairn::pile_head_response(pile, m);
    REQUIRE(at.converged);
    for (int j = 0; j < 6; ++j) {
      const double step = j < 3 ? 1e-6 : 1e-7;
      HeadMovement plus = m, minus = m;
      plus[j] += step;
      minus[j] -= step;
      const auto a = cairn::pile_head_response(pile, plus),
                 b = cairn::pile_head_response(pile, minus);
      for (int i = 0; i < 6; ++i) {
        CAPTURE(i, j);
        const double numeric = (a.action[i] - b.action[i]) / (2.0 * step);
        // 1e-3 of the column's largest term: the differences' truncation and the solves'
        // convergence tolerance. The P-Δ coupling (the lateral action changing with the axial
        // force, ∂F_x/∂u_z) is part of the tangent.
        double scale = 0.0;
        for (int k = 0; k < 6; ++k) scale = std::max(scale, std::abs(at.tangent[k][j]));
        REQUIRE(at.tangent[i][j] == close(numeric, 1e-3, 1e-3 * scale));
      }
    }
  }
}

TEST_CASE("nonlinear pile: the p-multiplier scales every p-y spring",
          "[nonlinear_pile][published]") {
  // Source: Hetényi (1946) with k·P_m: a long fixed-head pile with P_m = 0.5 on k = 12 000 kN/m²
  // has the head terms of k = 6 000 kN/m² (1 %: the lumped springs, as above).
  const auto half =
      cairn::pile_head_response(linear_pile(12000.0, fixed()), {0.01, 0, 0, 0, 0, 0}, 0.5);
  REQUIRE(half.converged);
  const auto head = cairn::restrained_head(cairn::hetenyi_long_pile(kEI, 6000.0), fixed());
  REQUIRE(half.tangent[0][0] == close(head.lateral, 1e-2));
  REQUIRE(half.tangent[4][4] == close(head.bending.rotational, 1e-2));
  REQUIRE(half.action[0] == close(half.tangent[0][0] * 0.01, 1e-9));
}

TEST_CASE("nonlinear pile: softening curves converge", "[nonlinear_pile]") {
  // Matlock (1970) cyclic soft clay: above zr the resistance falls beyond 3·y50 (y50 = 15 mm
  // here), so near the head the tangent is negative; the iteration still settles and the
  // tangent is still the derivative of the action (central differences, hand check).
  cairn::SoftClayPy clay;
  clay.undrained_strength = 20.0;
  clay.effective_unit_weight = 6.0;
  clay.width = 0.6;
  clay.strain_50 = 0.01;
  clay.loading = cairn::PyLoading::cyclic;
  NonlinearPileSpec pile = linear_pile(0.0, fixed());
  pile.curves.lateral = [clay](double z, double y) { return clay.resistance(z, y); };
  for (double d : {0.05, 0.15, 0.3}) {
    CAPTURE(d);
    const auto at = cairn::pile_head_response(pile, {d, 0, 0, 0, 0, 0});
    INFO(at.message);
    REQUIRE(at.converged);
    const double step = 1e-6;
    const auto a = cairn::pile_head_response(pile, {d + step, 0, 0, 0, 0, 0});
    const auto b = cairn::pile_head_response(pile, {d - step, 0, 0, 0, 0, 0});
    REQUIRE(at.tangent[0][0] == close((a.action[0] - b.action[0]) / (2 * step), 1e-3));
  }
}
