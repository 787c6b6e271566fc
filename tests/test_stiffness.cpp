// Tests of stiffness.hpp: pile-head springs typed in, E·A/L, the Vesić settlement secant,
// and Hetényi's lateral spring with kh given, from Vesić (1961) or from Davisson.
#include <catch2/catch.hpp>

#include <cmath>
#include <numbers>

#include "cairn/geotechnics/group.hpp"
#include "cairn/geotechnics/stiffness.hpp"

using namespace cairn;

namespace {

// Values computed from published formulas are rounded to 4–5 digits.
constexpr double kPublished = 1e-3;
// Hand calculations repeated here from the same formula: round-off only.
constexpr double kTight = 1e-9;

// One pile type (round, D, L, Ep) under a cap at the ground surface, one pile.
Project one_pile(double diameter, double length, double modulus) {
  Project p;
  PileType type;
  type.id = "B";
  type.section = {SectionShape::round, diameter};
  type.length = length;
  type.elastic_modulus = modulus;
  p.pile_types.push_back(type);
  Pile pile;
  pile.id = "P1";
  p.piles.push_back(pile);
  return p;
}

SoilProfile one_layer(SoilLayer layer) {
  SoilProfile soil;
  soil.layers.push_back(std::move(layer));
  return soil;
}

}  // namespace

TEST_CASE("stiffness: without soil the axial spring is E·A/L and the lateral one 0",
          "[stiffness][published]") {
  Project p = one_pile(0.45, 18.0, 3.0e7);
  p.pile_types[0].section = {SectionShape::square, 0.45};
  const auto k = pile_type_stiffness(p, {});
  REQUIRE(k.size() == 1);
  // Source: common practice, elastic shortening of a column k = E·A/L;
  // 3.0e7 kPa × 0.2025 m² / 18 m = 337 500 kN/m (hand).
  CHECK(k[0].axial == Approx(337500.0).epsilon(kTight));
  CHECK(k[0].lateral == 0.0);
  CHECK(k[0].axial_source == "E·A/L (elastic shortening of the whole pile, no soil)");
  CHECK(k[0].lateral_source == "0 (axial-only pile, the classical assumption)");

  SECTION("values typed in win") {
    p.pile_types[0].axial_stiffness = 2.0e5;
    p.pile_types[0].lateral_stiffness = 6.0e3;
    const auto given = pile_type_stiffness(p, {});
    CHECK(given[0].axial == 2.0e5);
    CHECK(given[0].lateral == 6.0e3);
    CHECK(given[0].axial_source == "given");
    CHECK(given[0].lateral_source == "given");
  }
  SECTION("pile springs carry the type's values and the pile's axis") {
    const auto springs = pile_springs(p, k);
    REQUIRE(springs.size() == 1);
    CHECK(springs[0].axial == Approx(337500.0).epsilon(kTight));
    CHECK(springs[0].axis[2] == Approx(-1.0));  // vertical, pointing down
  }
}

TEST_CASE("stiffness: section inertia of square and round sections", "[stiffness]") {
  // Common practice: I = b⁴/12 (square), πD⁴/64 (round).
  CHECK(section_inertia({SectionShape::square, 0.45}) == Approx(std::pow(0.45, 4) / 12.0).epsilon(kTight));
  // Computed (πD⁴/64): D = 0.6, Ep = 30 GPa gives EI = 190 851.8 kN·m².
  CHECK(3.0e7 * section_inertia({SectionShape::round, 0.6}) == Approx(190851.8).epsilon(kPublished));
}

TEST_CASE("stiffness: the axial spring is the Vesić (1977) settlement secant Q/s",
          "[stiffness][published]") {
  // Computed from Vesić's (1977) settlement formulas: Qwp = 200, Qws = 400 kN, D = 0.4 m round, L = 15 m, Ep = 30 GPa,
  // Es = 30 MPa, μs = 0.3, ξ = 0.5 → s = 1.592 + 16.414 + 1.067 = 19.073 mm.
  Project p = one_pile(0.4, 15.0, 3.0e7);
  SoilLayer sand;
  sand.name = "sand";
  sand.kind = SoilKind::sand;
  sand.thickness = 30.0;
  sand.soil_modulus = 30000.0;
  sand.poisson_ratio = 0.3;
  p.soil = one_layer(sand);
  // A computed capacity whose allowable load is 600 kN and whose ultimate tip and shaft
  // split it 1 : 2, so the working load is 200 kN at the tip and 400 kN on the shaft.
  PileTypeCapacity capacity;
  capacity.type = 0;
  capacity.result.tip = 500.0;
  capacity.result.shaft = 1000.0;
  capacity.result.ultimate_compression = 1500.0;
  capacity.result.allowable_compression = 600.0;
  const auto k = pile_type_stiffness(p, {capacity});
  // Source: Vesić (1977), NCHRP Synthesis 42, settlement of a single pile (from memory,
  // computed): s = 19.073 mm, so k = 600 / 0.019073 = 31 458 kN/m.
  CHECK(k[0].axial == Approx(600.0 / 0.019073).epsilon(kPublished));
  CHECK(k[0].axial_source.rfind("secant Q/s from Vesić (1977) settlement at the allowable load: "
                                "600.0 kN over 19.073 mm",
                                0) == 0);
  // The same number from group.hpp's vesic_settlement, entered by hand.
  VesicPile pile;
  pile.width = 0.4;
  pile.length = 15.0;
  pile.pile_modulus = 3.0e7;
  pile.soil_modulus_tip = 30000.0;
  pile.soil_modulus_shaft = 30000.0;
  pile.poisson_ratio = 0.3;
  const double s = vesic_settlement(pile, {200.0, 400.0}).total;
  CHECK(s == Approx(0.019073).epsilon(kPublished));
  CHECK(k[0].axial == Approx(600.0 / s).epsilon(kTight));

  SECTION("a profile without soil_modulus falls back to E·A/L and says why") {
    p.soil->layers[0].soil_modulus.reset();
    const auto fallback = pile_type_stiffness(p, {capacity});
    CHECK(fallback[0].axial == Approx(3.0e7 * std::numbers::pi * 0.04 / 15.0).epsilon(kTight));
    CHECK(fallback[0].axial_source.find("lacks soil_modulus") != std::string::npos);
  }
}

TEST_CASE("stiffness: lateral spring by Hetényi with kh given, pinned and fixed heads",
          "[stiffness][published]") {
  // Computed from Hetényi's closed form: D = 0.6, Ep = 30 GPa (EI = 190 851.8 kN·m²), kh = 20 MN/m³
  // (k = 12 000 kN/m²) → λ = 0.354084 1/m, long if L > 8.872 m; free KH = k/(2λ) =
  // 16 945 kN/m; fixed KH = k/λ = 33 890 kN/m. Source: Hetényi (1946), Beams on Elastic
  // Foundation, semi-infinite beam (from memory).
  Project p = one_pile(0.6, 20.0, 3.0e7);
  SoilLayer clay;
  clay.name = "stiff clay";
  clay.kind = SoilKind::clay;
  clay.thickness = 30.0;
  clay.subgrade_modulus = 20000.0;
  p.soil = one_layer(clay);
  const auto pinned = pile_type_stiffness(p, {});
  CHECK(pinned[0].lateral == Approx(16945.0).epsilon(kPublished));
  CHECK(pinned[0].head_moment_per_shear == 0.0);
  CHECK(pinned[0].lateral_source ==
        "Hetényi (1946) beam on elastic foundation, pinned head, kh = 20000 kN/m³ given for "
        "layer 'stiff clay'");

  p.pile_types[0].head = HeadFixity::fixed;
  const auto fixed = pile_type_stiffness(p, {});
  CHECK(fixed[0].lateral == Approx(33890.0).epsilon(kPublished));
  // Computed from Hetényi's closed form: fixed head moment 141.21 kN·m under H = 100 kN, i.e. 1/(2λ) m.
  CHECK(fixed[0].head_moment_per_shear * 100.0 == Approx(141.21).epsilon(kPublished));
  CHECK(fixed[0].head == HeadFixity::fixed);
}

TEST_CASE("stiffness: kh from Vesić (1961) when the layer gives Es", "[stiffness][published]") {
  Project p = one_pile(0.6, 20.0, 3.0e7);
  SoilLayer sand;
  sand.name = "sand";
  sand.kind = SoilKind::sand;
  sand.thickness = 30.0;
  sand.soil_modulus = 30000.0;
  sand.poisson_ratio = 0.3;
  p.soil = one_layer(sand);
  const auto k = pile_type_stiffness(p, {});
  // Source: Vesić (1961), beams on elastic subgrade: k = 0.65·(Es·D⁴/(Ep·Ip))^(1/12)·Es/(1 − μs²)
  // (from memory). Hand, Es = 30 000 kPa, D = 0.6 m, EpIp = 190 851.75 kN·m², μs = 0.3:
  //   Es·D⁴/EI = 30 000 × 0.1296 / 190 851.75 = 0.0203718; ^(1/12) = 0.722930;
  //   Es/(1 − 0.09) = 32 967.03; k = 0.65 × 0.722930 × 32 967.03 = 15 491.0 kN/m²;
  //   kh = k/D = 25 818 kN/m³. Hetényi pinned head: λ = (k/(4EI))^(1/4) = 0.377433 1/m
  //   (π/λ = 8.32 m < L = 20 m, long), KH = k/(2λ) = 20 522 kN/m.
  CHECK(k[0].lateral == Approx(20522.0).epsilon(kPublished));
  CHECK(k[0].lateral_source.find("kh = 25818 kN/m³ from Vesić (1961) with Es of layer 'sand'") !=
        std::string::npos);
}

TEST_CASE("stiffness: kh = 67·cu/D (Davisson) in clay with cu only", "[stiffness][published]") {
  Project p = one_pile(0.6, 20.0, 3.0e7);
  SoilLayer clay;
  clay.name = "clay";
  clay.kind = SoilKind::clay;
  clay.thickness = 30.0;
  clay.undrained_strength = 50.0;
  p.soil = one_layer(clay);
  const auto k = pile_type_stiffness(p, {});
  // Source: Davisson (1970), kh ≈ 67·cu/D for stiff clay (from memory). Hand, cu = 50 kPa,
  // D = 0.6 m: kh = 5583.3 kN/m³, k = kh·D = 3350 kN/m²; λ = (3350/(4 × 190 851.75))^(1/4)
  // = 0.257382 1/m (π/λ = 12.2 m < 20 m); pinned KH = k/(2λ) = 6507.9 kN/m.
  CHECK(k[0].lateral == Approx(6507.9).epsilon(kPublished));
  CHECK(k[0].lateral_source.find("kh = 67·cu/D = 5583 kN/m³ (Davisson 1970, from memory)") !=
        std::string::npos);

  SECTION("nothing to go on: 0 and the reason") {
    p.soil->layers[0].undrained_strength.reset();
    const auto none = pile_type_stiffness(p, {});
    CHECK(none[0].lateral == 0.0);
    CHECK(none[0].lateral_source.find("gives no subgrade_modulus, soil_modulus or "
                                      "undrained_strength") != std::string::npos);
  }
}

TEST_CASE("stiffness: the layer at the pile head gives kh, below the cap's depth",
          "[stiffness]") {
  Project p = one_pile(0.6, 20.0, 3.0e7);
  SoilLayer fill, clay;
  fill.name = "fill";
  fill.thickness = 2.0;
  fill.subgrade_modulus = 5000.0;
  clay.name = "stiff clay";
  clay.kind = SoilKind::clay;
  clay.thickness = 30.0;
  clay.subgrade_modulus = 20000.0;
  p.soil = SoilProfile{std::nullopt, {fill, clay}};
  p.cap.depth = 2.0;  // pile heads at the top of the clay
  const auto k = pile_type_stiffness(p, {});
  // Hetényi's closed form again (computed): 16 945 kN/m with the clay's kh, not the fill's.
  CHECK(k[0].lateral == Approx(16945.0).epsilon(kPublished));
}

TEST_CASE("A hollow section's stiffness is its wall's: pipe and hollow square", "[stiffness]") {
  // Hand formulas of a ring and a hollow square (common practice): A = π/4·(D² − d²),
  // I = π/64·(D⁴ − d⁴); A = b² − bi², I = (b⁴ − bi⁴)/12, d = D − 2t, bi = b − 2t.
  cairn::PileType pipe;
  pipe.section = {cairn::SectionShape::round, 0.762};
  pipe.length = 38.0;
  pipe.elastic_modulus = 2.0e8;
  pipe.structure = cairn::Structure{};
  pipe.structure->wall_thickness = 0.022;
  const double d = 0.762 - 0.044;
  CHECK(pipe.material_area() == Approx(std::numbers::pi / 4.0 * (0.762 * 0.762 - d * d)).epsilon(1e-12));
  CHECK(pipe.material_inertia() ==
        Approx(std::numbers::pi / 64.0 * (std::pow(0.762, 4) - std::pow(d, 4))).epsilon(1e-12));
  CHECK(pipe.material_inertia() == Approx(3.504e-3).epsilon(1e-3));  // hand arithmetic
  CHECK(pipe.axial_stiffness_used() == Approx(2.0e8 * pipe.material_area() / 38.0).epsilon(1e-12));
  cairn::PileType box = pipe;
  box.section = {cairn::SectionShape::square, 0.4};
  box.structure->wall_thickness = 0.02;
  CHECK(box.material_area() == Approx(0.4 * 0.4 - 0.36 * 0.36).epsilon(1e-12));
  CHECK(box.material_inertia() == Approx((std::pow(0.4, 4) - std::pow(0.36, 4)) / 12.0).epsilon(1e-12));
  // Without a wall (or a wall of half the width or more) the section is solid.
  cairn::PileType solid = pipe;
  solid.structure->wall_thickness.reset();
  CHECK(solid.material_area() == Approx(solid.section.area()).epsilon(1e-15));
  CHECK(solid.material_inertia() == Approx(cairn::section_inertia(solid.section)).epsilon(1e-15));
  solid.structure->wall_thickness = 0.5;
  CHECK(solid.material_area() == Approx(solid.section.area()).epsilon(1e-15));
}
