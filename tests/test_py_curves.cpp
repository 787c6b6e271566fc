// Tests for py_curves.hpp (p-y curves) and beam_column.hpp (a pile as a beam-column on them):
// the curves' key points from the papers' own equations, and the finite-difference pile
// against Hetényi's (1946) and Matlock & Reese's (1960) closed forms.
#include <catch2/catch.hpp>

#include <cmath>
#include <numbers>

#include "cairn/geotechnics/axial_curves.hpp"
#include "cairn/geotechnics/py_curves.hpp"
#include "cairn/solver/beam_column.hpp"
#include "cairn/solver/pile_head.hpp"

namespace {

cairn::SoftClayPy soft_clay(cairn::PyLoading loading = cairn::PyLoading::static_load) {
  cairn::SoftClayPy c;
  c.undrained_strength = 20.0;     // kPa
  c.effective_unit_weight = 7.0;   // kN/m³
  c.width = 0.6;
  c.strain_50 = 0.02;
  c.j = 0.5;
  c.loading = loading;
  return c;
}

const double kEI = 30e6 * std::numbers::pi * std::pow(0.6, 4) / 64.0;  // kN·m²

}  // namespace

TEST_CASE("p-y: Matlock (1970) soft clay, static and cyclic key points", "[py_curves][published]") {
  const auto c = soft_clay();
  // Matlock (1970), from memory: pu = (3 + γ'z/c + Jz/b)·c·b up to 9·c·b; y50 = 2.5·ε50·b.
  CHECK(c.ultimate(0.0) == Approx(3.0 * 20.0 * 0.6));
  CHECK(c.ultimate(2.0) == Approx((3.0 + 7.0 * 2.0 / 20.0 + 0.5 * 2.0 / 0.6) * 20.0 * 0.6));
  CHECK(c.ultimate(50.0) == Approx(9.0 * 20.0 * 0.6));
  CHECK(c.y50() == Approx(2.5 * 0.02 * 0.6));
  const double z = 3.0, pu = c.ultimate(z), y50 = c.y50();
  // p/pu = 0.5·(y/y50)^(1/3): 0.5 at y50, 1.0 at 8·y50 and beyond (Matlock 1970).
  CHECK(c.resistance(z, y50) / pu == Approx(0.5));
  CHECK(c.resistance(z, 8.0 * y50) / pu == Approx(1.0));
  CHECK(c.resistance(z, 20.0 * y50) / pu == Approx(1.0));
  CHECK(c.resistance(z, -y50) == Approx(-0.5 * pu));  // odd in y
  // Cyclic (Matlock 1970): 0.72·pu from 3·y50 below zr = 6cb/(γ'b + Jc); above it down to
  // 0.72·pu·z/zr at 15·y50.
  const auto cyc = soft_clay(cairn::PyLoading::cyclic);
  const double zr = cyc.transition_depth();
  CHECK(zr == Approx(6.0 * 20.0 * 0.6 / (7.0 * 0.6 + 0.5 * 20.0)));
  CHECK(cyc.resistance(zr + 1.0, 10.0 * y50) / cyc.ultimate(zr + 1.0) == Approx(0.72).epsilon(2e-3));
  const double shallow = 0.5 * zr;
  CHECK(cyc.resistance(shallow, 15.0 * y50) / cyc.ultimate(shallow) ==
        Approx(0.72 * shallow / zr).epsilon(2e-3));
  CHECK(cyc.resistance(shallow, y50) == Approx(c.resistance(shallow, y50)));
}

TEST_CASE("p-y: API RP 2GEO sand, the hyperbolic tangent and C1, C2, C3", "[py_curves][published]") {
  cairn::SandApiPy s;
  s.friction_angle = 30.0;
  s.effective_unit_weight = 10.0;
  s.width = 0.6;
  s.initial_modulus = 10000.0;  // kN/m³
  // Values computed from Reese, Cox & Koop's (1974) wedge and flow expressions at φ' = 30°
  // (hand calculation: C1 = 0.3586 + 1.3923 + 0.1608, C2 = 3 − 1/3, C3 = 80/3 + 0.4·tan30°·9);
  // API RP 2GEO's chart reads about 1.9, 2.7 and 29 there (from memory).
  CHECK(s.c1() == Approx(1.9117).epsilon(1e-3));
  CHECK(s.c2() == Approx(2.6667).epsilon(1e-4));
  CHECK(s.c3() == Approx(28.745).epsilon(1e-4));
  const double z = 2.0;
  const double pu = std::min((s.c1() * z + s.c2() * 0.6) * 10.0 * z, s.c3() * 0.6 * 10.0 * z);
  CHECK(s.ultimate(z) == Approx(pu));
  // A = 3 − 0.8·z/b ≥ 0.9 static, 0.9 cyclic (API RP 2GEO, O'Neill & Murchison 1983).
  CHECK(s.factor(z) == Approx(0.9));
  CHECK(s.factor(0.3) == Approx(3.0 - 0.8 * 0.3 / 0.6));
  // Initial slope k·z; the curve tends to A·pu.
  const double tiny = 1e-9;
  CHECK(s.resistance(z, tiny) / tiny == Approx(10000.0 * z).epsilon(1e-6));
  CHECK(s.resistance(z, 1.0) == Approx(0.9 * pu).epsilon(1e-6));
}

TEST_CASE("beam-column: linear springs match Hetényi's long pile, free and fixed head",
          "[beam_column][published]") {
  const double k = 12000.0;  // kN/m², uniform
  const double lambda = std::pow(k / (4.0 * kEI), 0.25);
  cairn::BeamColumnPile pile;
  pile.bending_stiffness = kEI;
  pile.length = 4.0 * std::numbers::pi / lambda;  // long
  pile.segments = 400;
  pile.soil = [k](double, double y) { return k * y; };
  const double h = 100.0;
  // Hetényi (1946), from memory: free head y0 = 2Hλ/k, Mmax = 0.3224·H/λ at π/(4λ); fixed
  // head y0 = Hλ/k, M0 = H/(2λ). Finite differences with h = L/400: within 0.5 %.
  const auto free = cairn::solve_beam_column(pile, {h, false, 0.0, 0.0});
  REQUIRE(free.converged);
  CHECK(free.head_deflection == Approx(2.0 * h * lambda / k).epsilon(5e-3));
  CHECK(free.max_moment == Approx(0.3224 * h / lambda).epsilon(5e-3));
  CHECK(free.max_moment_depth == Approx(std::numbers::pi / (4.0 * lambda)).epsilon(2e-2));
  const auto fixed = cairn::solve_beam_column(pile, {h, true, 0.0, 0.0});
  REQUIRE(fixed.converged);
  CHECK(fixed.head_deflection == Approx(h * lambda / k).epsilon(5e-3));
  CHECK(std::abs(fixed.head_moment) == Approx(h / (2.0 * lambda)).epsilon(5e-3));
  // P-Δ: a compressive axial load makes the pile softer.
  pile.axial = 2000.0;
  const auto with_axial = cairn::solve_beam_column(pile, {h, false, 0.0, 0.0});
  REQUIRE(with_axial.converged);
  CHECK(with_axial.head_deflection > free.head_deflection);
}

TEST_CASE("beam-column: API sand at small loads matches Matlock & Reese's linear modulus",
          "[beam_column][published]") {
  // At small deflection the tanh curve is p = k·z·y: a modulus growing linearly with depth,
  // nh = k. Matlock & Reese (1960), long pile, free head (from memory): y0 = 2.435·H·T³/EI.
  cairn::SandApiPy s;
  s.friction_angle = 35.0;
  s.effective_unit_weight = 10.0;
  s.width = 0.6;
  s.initial_modulus = 20000.0;
  const double t = std::pow(kEI / s.initial_modulus, 0.2);
  cairn::BeamColumnPile pile;
  pile.bending_stiffness = kEI;
  pile.length = 8.0 * t;
  pile.segments = 400;
  pile.soil = [&s](double z, double y) { return s.resistance(z, y); };
  const double h = 0.5;  // kN: the curves stay on their initial slope
  const auto r = cairn::solve_beam_column(pile, {h, false, 0.0, 0.0});
  REQUIRE(r.converged);
  CHECK(r.head_deflection == Approx(2.435 * h * t * t * t / kEI).epsilon(1e-2));
  // The same as the linear pile-head stiffness the cap uses (pile_head.hpp).
  const auto k = cairn::matlock_reese_long_pile(kEI, s.initial_modulus);
  CHECK(r.head_deflection == Approx(1.0 / (k.k_hh - k.k_hm * k.k_hm / k.k_mm) * h).epsilon(1e-2));
  // Larger loads: the soil softens, the pile deflects more than in proportion.
  const auto big = cairn::solve_beam_column(pile, {1000.0, false, 0.0, 0.0});
  REQUIRE(big.converged);
  CHECK(big.head_deflection / 1000.0 > 1.2 * r.head_deflection / h);
}

TEST_CASE("beam-column: soft clay beyond its capacity is a mechanism, not a number",
          "[beam_column]") {
  const auto c = soft_clay();
  cairn::BeamColumnPile pile;
  pile.bending_stiffness = kEI;
  pile.length = 3.0;  // a short pile: the soil's capacity is about Σ pu·dz
  pile.segments = 60;
  pile.soil = [&c](double z, double y) { return c.resistance(z, y); };
  const auto held = cairn::solve_beam_column(pile, {20.0, false, 0.0, 0.0});
  CHECK(held.converged);
  const auto failed = cairn::solve_beam_column(pile, {2000.0, false, 0.0, 0.0});
  CHECK_FALSE(failed.converged);
  CHECK_FALSE(failed.message.empty());
}

TEST_CASE("p-y: Welch & Reese (1972) stiff clay without free water", "[py_curves][published]") {
  cairn::StiffClayDryPy c;
  c.undrained_strength = 100.0;
  c.effective_unit_weight = 19.0;
  c.width = 0.9;
  c.strain_50 = 0.005;
  const double z = 4.0, pu = c.ultimate(z), y50 = c.y50();
  // Welch & Reese (1972), from memory: p/pu = 0.5·(y/y50)^(1/4), pu from 16·y50 on.
  CHECK(pu == Approx((3.0 + 19.0 * 4.0 / 100.0 + 0.5 * 4.0 / 0.9) * 100.0 * 0.9));
  CHECK(c.resistance(z, y50) / pu == Approx(0.5));
  CHECK(c.resistance(z, 16.0 * y50) / pu == Approx(1.0));
  CHECK(c.resistance(z, 40.0 * y50) / pu == Approx(1.0));
  CHECK(c.resistance(z, 3.0 * y50) / pu == Approx(0.5 * std::pow(3.0, 0.25)));
  // Cyclic, N = 100: at p = 0.5·pu the deflection is y50 + 9.6·0.5⁴·y50·log10(100) = 2.2·y50.
  c.cycles = 100.0;
  CHECK(c.deflection(z, 0.5 * pu) == Approx(2.2 * y50));
  CHECK(c.resistance(z, 2.2 * y50) / pu == Approx(0.5));
}

TEST_CASE("t-z and Q-z: API RP 2GEO's points", "[py_curves][published]") {
  using cairn::AxialSoil;
  const double d = 0.6;
  // API RP 2GEO t-z for clay (from memory): t/tmax 0.30 at z/D = 0.0016, 0.50 at 0.0031, 1.0 at
  // 0.01, the residual 0.9 from 0.02 on; odd in z.
  CHECK(cairn::shaft_transfer(AxialSoil::clay, d, 0.0016 * d) == Approx(0.30));
  CHECK(cairn::shaft_transfer(AxialSoil::clay, d, 0.0031 * d) == Approx(0.50));
  CHECK(cairn::shaft_transfer(AxialSoil::clay, d, 0.0100 * d) == Approx(1.00));
  CHECK(cairn::shaft_transfer(AxialSoil::clay, d, 0.0500 * d) == Approx(0.90));
  CHECK(cairn::shaft_transfer(AxialSoil::clay, d, 0.0500 * d, 0.7) == Approx(0.70));
  CHECK(cairn::shaft_transfer(AxialSoil::clay, d, -0.0031 * d) == Approx(-0.50));
  // Sand: t_max at 0.1 in = 2.54 mm (API RP 2GEO, from memory; cairn uses 2.5 mm).
  CHECK(cairn::shaft_transfer(AxialSoil::sand, d, 0.00125) == Approx(0.5));
  CHECK(cairn::shaft_transfer(AxialSoil::sand, d, 0.01) == Approx(1.0));
  // Q-z (from memory): 0.25 at z/D = 0.002, 0.50 at 0.013, 0.75 at 0.042, 0.90 at 0.073, 1.0
  // at 0.10; no tension at the tip.
  CHECK(cairn::tip_transfer(d, 0.002 * d) == Approx(0.25));
  CHECK(cairn::tip_transfer(d, 0.013 * d) == Approx(0.50));
  CHECK(cairn::tip_transfer(d, 0.042 * d) == Approx(0.75));
  CHECK(cairn::tip_transfer(d, 0.073 * d) == Approx(0.90));
  CHECK(cairn::tip_transfer(d, 0.2 * d) == Approx(1.00));
  CHECK(cairn::tip_transfer(d, -0.01) == 0.0);
}
