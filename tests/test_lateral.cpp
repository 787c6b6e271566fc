// Tests for lateral.hpp: Hetényi head stiffness, Broms' ultimate lateral resistance, section
// capacity. Reference values are computed from the published formulas (Hetényi 1946; Broms
// 1964a/b); the source of each formula is named beside each check.
#include <catch2/catch.hpp>

#include <cmath>
#include <numbers>
#include <optional>
#include <stdexcept>

#include "cairn/geotechnics/lateral.hpp"
#include "support.hpp"

using cairn::BromsInput;
using cairn::BromsMode;
using cairn::ElasticPile;
using cairn::HeadFixity;
using cairn::SoilKind;

namespace {

// Check values are printed to 4–5 significant figures; 1e-3 relative covers their rounding.
Approx near(double value) { return cairn::test::close(value, 1e-3, 0.0); }

// Pile of the Hetényi checks: D = 0.6 m round, Ep = 30 GPa → EI = 190 851.8 kN·m²,
// kh = 20 MN/m³.
ElasticPile row_7_11_pile(HeadFixity head, double length) {
  return ElasticPile{190851.8, 20000.0, 0.6, length, head};
}

BromsInput clay(double cu, double d, double l, double e, std::optional<double> my, HeadFixity head) {
  BromsInput in;
  in.soil = SoilKind::clay;
  in.undrained_strength = cu;
  in.width = d;
  in.embedded_length = l;
  in.eccentricity = e;
  in.yield_moment = my;
  in.head = head;
  return in;
}

BromsInput sand(double gamma, double phi, double d, double l, double e, std::optional<double> my,
                HeadFixity head) {
  BromsInput in;
  in.soil = SoilKind::sand;
  in.effective_unit_weight = gamma;
  in.friction_angle = phi;
  in.width = d;
  in.embedded_length = l;
  in.eccentricity = e;
  in.yield_moment = my;
  in.head = head;
  return in;
}

}  // namespace

TEST_CASE("lateral: Hetényi long-pile head stiffness, free and fixed head",
          "[lateral][published]") {
  // Source: Hetényi (1946), Beams on Elastic Foundation, semi-infinite beam loaded at its end
  // (from memory, standard result); values computed from it.
  const auto pinned = cairn::lateral_head_stiffness(row_7_11_pile(HeadFixity::pinned, 20.0));
  CHECK(pinned.winkler_modulus == near(12000.0));      // k = kh·D, kN/m²
  CHECK(pinned.lambda == near(0.354084));              // 1/m
  CHECK(pinned.long_pile_length == near(8.872));       // π/λ, m
  CHECK(pinned.long_pile);
  CHECK(pinned.lateral_stiffness == near(16945.0));    // k/(2λ), kN/m
  CHECK(pinned.k_hh == near(33890.0));                 // k/λ
  CHECK(pinned.k_hm == near(-47856.0));                // −k/(2λ²), sign per the header
  CHECK(pinned.k_mm == near(135155.0));                // k/(2λ³), kN·m/rad
  CHECK(pinned.head_moment_per_shear == 0.0);
  CHECK(pinned.notes.empty());

  const auto fixed = cairn::lateral_head_stiffness(row_7_11_pile(HeadFixity::fixed, 20.0));
  CHECK(fixed.lateral_stiffness == near(33890.0));     // k/λ, kN/m
  CHECK(fixed.head_moment_per_shear == near(1.0 / (2.0 * 0.354084)));  // M0 = H/(2λ)
}

TEST_CASE("lateral: Hetényi long-pile response to a head shear of 100 kN",
          "[lateral][published]") {
  // Source: Hetényi (1946), semi-infinite beam (from memory, standard result): free head
  // y0 = 2Hλ/k, θ0 = 2Hλ²/k, Mmax = 0.3224·H/λ at π/(4λ); fixed head y0 = Hλ/k, M0 = H/(2λ).
  // Values computed from these closed forms.
  const auto pinned = cairn::lateral_head_response(row_7_11_pile(HeadFixity::pinned, 20.0), 100.0);
  CHECK(pinned.deflection * 1000.0 == near(5.901));     // mm
  CHECK(pinned.rotation == near(0.0020896));            // rad
  CHECK(pinned.max_moment == near(91.05));              // kN·m
  CHECK(pinned.max_moment_depth == near(2.218));        // m
  CHECK(pinned.head_moment == 0.0);

  const auto fixed = cairn::lateral_head_response(row_7_11_pile(HeadFixity::fixed, 20.0), 100.0);
  CHECK(fixed.deflection * 1000.0 == near(2.951));      // mm
  CHECK(fixed.head_moment == near(141.21));             // kN·m
  CHECK(fixed.max_moment == near(141.21));              // largest at the head
  CHECK(fixed.max_moment_depth == Approx(0.0).margin(1e-9));
  CHECK(fixed.rotation == 0.0);
}

TEST_CASE("lateral: a finite beam tends to Hetényi's long pile and to a rigid pile",
          "[lateral][published]") {
  SECTION("very long finite beam equals the semi-infinite closed form") {
    // Source: Hetényi (1946) closed form (computed). With λL = 20π the far
    // end's influence is e^(−20π) ≈ 1e-27, so the two agree to round-off; 1e-6 allows for it.
    const auto finite = cairn::finite_pile_head_stiffness(
        row_7_11_pile(HeadFixity::pinned, 20.0 * std::numbers::pi));
    CHECK(finite.k_hh == Approx(33890.3).epsilon(1e-5));
    CHECK(finite.k_hm == Approx(-47856.3).epsilon(1e-5));
    CHECK(finite.k_mm == Approx(135155.1).epsilon(1e-5));
  }
  SECTION("short stiff beam equals a rigid pile on springs") {
    // Hand derivation (statics, docs/methods-lateral.md §1.3): a rigid pile y = y0 − θ·x on
    // springs k gives k_hh = kL, k_hm = −kL²/2, k_mm = kL³/3. Here k = 1000 kN/m², L = 2 m,
    // EI = 1e9 kN·m² (λL = 0.045); the flexural correction is of order (λL)⁴, so 1e-5.
    const ElasticPile stiff{1e9, 1000.0, 1.0, 2.0, HeadFixity::pinned};
    const auto rigid = cairn::finite_pile_head_stiffness(stiff);
    CHECK(rigid.k_hh == Approx(2000.0).epsilon(1e-5));
    CHECK(rigid.k_hm == Approx(-2000.0).epsilon(1e-5));
    CHECK(rigid.k_mm == Approx(2666.667).epsilon(1e-5));
  }
  SECTION("finite beam with free ends, end load: Hetényi's closed form") {
    // Source: Hetényi (1946), finite beam with free ends loaded by P at one end (from
    // memory): y_A = (2Pλ/k)·(sinh λL·cosh λL − sin λL·cos λL)/(sinh² λL − sin² λL).
    // Our solver is independent of this formula; agreement to 1e-6 is round-off.
    for (const double length : {2.0, 4.0, 6.0, 8.0}) {
      CAPTURE(length);
      const auto pile = row_7_11_pile(HeadFixity::pinned, length);
      const auto stiffness = cairn::lateral_head_stiffness(pile);
      const double lam = stiffness.lambda;
      const double k = stiffness.winkler_modulus;
      const double x = lam * length;
      const double expected = 2.0 * lam / k * (std::sinh(x) * std::cosh(x) - std::sin(x) * std::cos(x)) /
                              (std::sinh(x) * std::sinh(x) - std::sin(x) * std::sin(x));
      CHECK(cairn::lateral_head_response(pile, 1.0).deflection == Approx(expected).epsilon(1e-6));
      CHECK(1.0 / stiffness.lateral_stiffness == Approx(expected).epsilon(1e-6));
    }
  }
}

TEST_CASE("lateral: a pile that is not long is noted and solved as a finite beam", "[lateral]") {
  const auto short_pile = cairn::lateral_head_stiffness(row_7_11_pile(HeadFixity::pinned, 6.0));
  CHECK_FALSE(short_pile.long_pile);
  REQUIRE(short_pile.notes.size() == 1);
  CHECK(short_pile.notes[0].find("finite beam") != std::string::npos);
  // A shorter pile on the same soil is softer than the long one (a free tip can move).
  CHECK(short_pile.lateral_stiffness < 16945.0);

  const auto unknown = cairn::lateral_head_stiffness(row_7_11_pile(HeadFixity::fixed, 0.0));
  CHECK(unknown.long_pile);
  REQUIRE(unknown.notes.size() == 1);
  CHECK(unknown.notes[0].find("not given") != std::string::npos);
}

TEST_CASE("lateral: Broms, cohesive soil, free and fixed head", "[lateral][published]") {
  // Source: Broms (1964a), JSMFD 90(SM2); clay formulas as given in the CAUL open textbook
  // §6.24: f = H/(9cu·D), Mmax = H(e + 1.5D + 0.5f) = 2.25·D·g²·cu. Values computed
  // from these formulas.
  SECTION("free head, short (e = 0.5 m)") {
    const auto r = cairn::broms_ultimate_lateral(clay(50, 0.5, 6, 0.5, std::nullopt, HeadFixity::pinned));
    CHECK(r.mode == BromsMode::short_pile);
    CHECK(r.ultimate_load == near(362.44));
    CHECK(r.reaction_length == near(1.6108));
    CHECK(r.max_moment == near(744.95));
    CHECK(r.max_moment_depth == near(0.75 + 1.6108));  // 1.5D + f
    CHECK(r.notes.size() == 1);  // My not given
  }
  SECTION("free head, short (e = 0)") {
    const auto r = cairn::broms_ultimate_lateral(clay(50, 0.5, 6, 0.0, 5000.0, HeadFixity::pinned));
    CHECK(r.mode == BromsMode::short_pile);
    CHECK(r.ultimate_load == near(405.30));
    CHECK(r.reaction_length == near(1.8013));
    CHECK(r.max_moment == near(669.01));
  }
  SECTION("free head, long (My = 300 kN·m, e = 0.5 m)") {
    const auto r = cairn::broms_ultimate_lateral(clay(50, 0.5, 6, 0.5, 300.0, HeadFixity::pinned));
    CHECK(r.mode == BromsMode::long_pile);
    CHECK(r.ultimate_load == near(181.46));
    CHECK(r.reaction_length == near(0.8065));
    CHECK(r.max_moment == near(300.0));
  }
  SECTION("fixed head, short") {
    const auto r = cairn::broms_ultimate_lateral(clay(50, 0.5, 6, 0.0, 5000.0, HeadFixity::fixed));
    CHECK(r.mode == BromsMode::short_pile);
    CHECK(r.ultimate_load == near(1181.25));
    CHECK(r.max_moment == near(3986.72));
  }
  SECTION("fixed head, long (My = 300 kN·m)") {
    const auto r = cairn::broms_ultimate_lateral(clay(50, 0.5, 6, 0.0, 300.0, HeadFixity::fixed));
    CHECK(r.mode == BromsMode::long_pile);
    CHECK(r.ultimate_load == near(377.58));
    CHECK(r.reaction_length == near(1.6781));
  }
}

TEST_CASE("lateral: Broms, cohesionless soil, free and fixed head", "[lateral][published]") {
  // Source: Broms (1964b), JSMFD 90(SM3), reaction 3Kp·γ'·D·z (from memory, high confidence);
  // values computed from these formulas. γ' = 10 kN/m³, D = 0.5 m, L = 6 m,
  // φ' = 30° (Kp = 3).
  SECTION("passive coefficient") {
    const auto r30 = cairn::broms_ultimate_lateral(sand(10, 30, 0.5, 6, 0, std::nullopt, HeadFixity::pinned));
    const auto r35 = cairn::broms_ultimate_lateral(sand(10, 35, 0.5, 6, 0, std::nullopt, HeadFixity::pinned));
    CHECK(r30.passive_coefficient == near(3.0));
    CHECK(r35.passive_coefficient == near(3.6902));
  }
  SECTION("free head, short") {
    const auto r = cairn::broms_ultimate_lateral(sand(10, 30, 0.5, 6, 0, 5000.0, HeadFixity::pinned));
    CHECK(r.mode == BromsMode::short_pile);
    CHECK(r.ultimate_load == near(270.0));
    CHECK(r.reaction_length == near(3.4641));
    CHECK(r.max_moment == near(623.54));
    const auto e1 = cairn::broms_ultimate_lateral(sand(10, 30, 0.5, 6, 1.0, 5000.0, HeadFixity::pinned));
    CHECK(e1.ultimate_load == near(231.43));  // computed, e = 1 m
    CHECK(e1.max_moment == near(726.24));
  }
  SECTION("fixed head, short") {
    const auto r = cairn::broms_ultimate_lateral(sand(10, 30, 0.5, 6, 0, 5000.0, HeadFixity::fixed));
    CHECK(r.mode == BromsMode::short_pile);
    CHECK(r.ultimate_load == near(810.0));
    CHECK(r.max_moment == near(3240.0));
  }
  SECTION("free head, long (My = 300 kN·m)") {
    const auto r = cairn::broms_ultimate_lateral(sand(10, 30, 0.5, 6, 0, 300.0, HeadFixity::pinned));
    CHECK(r.mode == BromsMode::long_pile);
    CHECK(r.ultimate_load == near(165.78));
    CHECK(r.reaction_length == near(2.7144));
  }
  SECTION("fixed head, long (My = 300 kN·m)") {
    const auto r = cairn::broms_ultimate_lateral(sand(10, 30, 0.5, 6, 0, 300.0, HeadFixity::fixed));
    CHECK(r.mode == BromsMode::long_pile);
    CHECK(r.ultimate_load == near(263.16));
    CHECK(r.reaction_length == near(3.4200));
  }
}

TEST_CASE("lateral: Broms fixed head, intermediate mechanism", "[lateral]") {
  // Hand calculations in docs/methods-lateral.md §2.4 (Broms 1964a/b equilibrium with yield
  // at the head). Same soils as the fixed-head short checks above, with My = 1500 kN·m.
  SECTION("cohesive: H(1.5D + 0.5f) − My = 2.25·cu·D·g², H = 728.9 kN") {
    const auto r = cairn::broms_ultimate_lateral(clay(50, 0.5, 6, 0.0, 1500.0, HeadFixity::fixed));
    CHECK(r.mode == BromsMode::intermediate);
    CHECK(r.ultimate_load == near(728.9));
    const double f = r.reaction_length;
    const double g = 6.0 - 0.75 - f;
    CHECK(r.ultimate_load * (0.75 + 0.5 * f) - 1500.0 == Approx(2.25 * 50 * 0.5 * g * g).epsilon(1e-9));
  }
  SECTION("cohesionless: H·L − My = 0.5·γ'·D·L³·Kp, H = 520.0 kN") {
    const auto r = cairn::broms_ultimate_lateral(sand(10, 30, 0.5, 6, 0, 1500.0, HeadFixity::fixed));
    CHECK(r.mode == BromsMode::intermediate);
    CHECK(r.ultimate_load == near(520.0));
    CHECK(r.max_moment == near(1500.0));
  }
  SECTION("the ultimate load does not jump between mechanisms") {
    // Invariant: as My rises to the short-pile head moment, H rises continuously to the
    // short-pile value (computed above: 1181.25 and 810 kN).
    const auto c = cairn::broms_ultimate_lateral(clay(50, 0.5, 6, 0.0, 3986.72 * 0.99999, HeadFixity::fixed));
    CHECK(c.ultimate_load == near(1181.25));
    const auto s = cairn::broms_ultimate_lateral(sand(10, 30, 0.5, 6, 0, 3240.0 * 0.99999, HeadFixity::fixed));
    CHECK(s.ultimate_load == near(810.0));
  }
}

TEST_CASE("lateral: Broms relative stiffness and classification", "[lateral][published]") {
  // Source: Broms (1964a/b) classification (from memory): cohesive
  // βL < 1.5 short, > 2.5 long; cohesionless ηL < 2 short, > 4 long. β and η values computed
  // from these definitions for EI = 190 851.8 kN·m², D = 0.6 m.
  const double ei = 190851.8;
  CHECK(cairn::broms_beta(10000, 0.6, ei) == near(0.29775));
  CHECK(cairn::broms_beta(20000, 0.6, ei) == near(0.35408));
  CHECK(2.5 / cairn::broms_beta(10000, 0.6, ei) == near(8.396));
  CHECK(1.5 / cairn::broms_beta(20000, 0.6, ei) == near(4.236));
  CHECK(cairn::broms_eta(2000, ei) == near(0.40185));
  CHECK(cairn::broms_eta(10000, ei) == near(0.55445));
  CHECK(4.0 / cairn::broms_eta(2000, ei) == near(9.954));
  CHECK(2.0 / cairn::broms_eta(10000, ei) == near(3.607));

  using cairn::PileLengthClass;
  CHECK(cairn::classify_cohesive(1.4) == PileLengthClass::short_pile);
  CHECK(cairn::classify_cohesive(2.0) == PileLengthClass::intermediate);
  CHECK(cairn::classify_cohesive(2.6) == PileLengthClass::long_pile);
  CHECK(cairn::classify_cohesionless(1.9) == PileLengthClass::short_pile);
  CHECK(cairn::classify_cohesionless(3.0) == PileLengthClass::intermediate);
  CHECK(cairn::classify_cohesionless(4.1) == PileLengthClass::long_pile);
}

TEST_CASE("lateral: allowable lateral load divides by the factor of safety",
          "[lateral][published]") {
  // Source: common practice, FS 2.0–3.0, computed: 1000 kN / 2.5.
  CHECK(cairn::allowable_lateral_load(1000.0) == near(400.0));
  CHECK(cairn::allowable_lateral_load(1000.0, 2.0) == near(500.0));
  CHECK_THROWS_AS(cairn::allowable_lateral_load(1000.0, 0.5), std::invalid_argument);
}

TEST_CASE("lateral: section axial capacity and the axial + bending check",
          "[lateral][published]") {
  // Source: ACI 318-19 eq. 22.4.2.2, Po = 0.85·f'c·(Ag − Ast) + fy·Ast (from memory). Hand
  // calculation (docs/methods-lateral.md §3): D = 0.6 m round, Ag = 0.282743 m²; 8 bars of
  // 25 mm, Ast = 0.003927 m²; f'c = 30 MPa, fy = 420 MPa →
  // Po = 25 500 × 0.278816 + 420 000 × 0.003927 = 7109.8 + 1649.3 = 8759.1 kN.
  const cairn::ConcreteSection section{0.2827433, 0.0039270, 30000.0, 420000.0};
  CHECK(cairn::concrete_nominal_axial_strength(section) == near(8759.1));
  // Tied column, φ = 0.65 and Pn,max = 0.80·Po (ACI 318-19 Table 22.4.2.1, 21.2.2; from
  // memory): 0.52 × 8759.1 = 4554.7 kN.
  CHECK(cairn::concrete_axial_capacity(section, 0.65 * 0.80) == near(4554.7));
  // Steel: A = 0.01 m², fy = 345 MPa, allowable 0.5·fy (common practice) → 1725 kN.
  CHECK(cairn::steel_axial_capacity(0.01, 345000.0, 0.5) == near(1725.0));
  // Linear interaction P/Pc + M/Mc (common practice): 1000/4000 + 150/300 = 0.75.
  CHECK(cairn::axial_bending_utilization(-1000.0, 4000.0, 150.0, 300.0) == near(0.75));
  CHECK_THROWS_AS(cairn::concrete_axial_capacity(section, 1.2), std::invalid_argument);
  CHECK_THROWS_AS(cairn::axial_bending_utilization(1.0, 0.0, 1.0, 1.0), std::invalid_argument);
}

TEST_CASE("lateral: invalid arguments are refused", "[lateral]") {
  CHECK_THROWS_AS(cairn::lateral_head_stiffness(ElasticPile{0.0, 20000, 0.6, 10, HeadFixity::pinned}),
                  std::invalid_argument);
  CHECK_THROWS_AS(cairn::lateral_head_stiffness(ElasticPile{1e5, 20000, 0.6, -1, HeadFixity::pinned}),
                  std::invalid_argument);
  CHECK_THROWS_AS(cairn::broms_ultimate_lateral(clay(50, 0.5, 0.7, 0, std::nullopt, HeadFixity::pinned)),
                  std::invalid_argument);  // L ≤ 1.5D
  CHECK_THROWS_AS(cairn::broms_ultimate_lateral(sand(10, 95, 0.5, 6, 0, std::nullopt, HeadFixity::pinned)),
                  std::invalid_argument);
  CHECK_THROWS_AS(cairn::broms_ultimate_lateral(clay(50, 0.5, 6, -1, std::nullopt, HeadFixity::pinned)),
                  std::invalid_argument);
}
