// Tests that cairn makes no unsafe default choice: Broms' yield moment comes from the section
// or is asked for (never the short-pile mechanism alone), battered piles keep their spacing
// at depth, the two `tension` keys mean one thing each, and the group-efficiency note says
// only what is true for the project. Fixtures in tests/data/defaults/.
#include <catch2/catch.hpp>

#include <cmath>
#include <functional>
#include <numbers>
#include <string>
#include <vector>

#include "cairn/app/analysis.hpp"
#include "cairn/checks/group_checks.hpp"
#include "cairn/input/input.hpp"
#include "cairn/geotechnics/lateral.hpp"
#include "cairn/geotechnics/section_moment.hpp"
#include "support.hpp"

using namespace cairn;

namespace {

const std::string kData = std::string(CAIRN_TEST_DATA) + "/defaults/";
constexpr double kPi = std::numbers::pi;

// Closed forms agree to round-off; 1e-9 relative.
Approx exact(double value) { return cairn::test::close(value, 1e-9, 1e-12); }

// The messages of an InputError, formatted, with the fixture folder shown as '@'.
std::string error_of(const std::function<void()>& run) {
  try {
    run();
  } catch (const InputError& e) {
    std::string text;
    for (const auto& d : e.diagnostics()) {
      std::string line = d.format();
      if (const auto at = line.find(kData); at != std::string::npos)
        line.replace(at, kData.size(), "@");
      text += (text.empty() ? "" : "\n") + line;
    }
    return text;
  }
  return "no error";
}

}  // namespace

// ---- the yield moment from the section ------------------------------------------------

TEST_CASE("lateral: plastic and elastic section moduli", "[lateral][published]") {
  // Plastic modulus of a pipe: Z = (D³ − (D − 2t)³)/6 (from memory; the thin-walled limit
  // is D²·t). D = 0.61 m, t = 0.019 m: (0.226981 − 0.187149248)/6 = 6.63862533e-3 m³.
  CHECK(plastic_modulus(SectionShape::round, 0.61, 0.019) == exact(6.63862533e-3));
  // Solid square b³/4 and solid round D³/6 (from memory): b = 0.4 m → 0.016 m³; D = 0.6 m →
  // 0.036 m³. Hollow square (b³ − (b − 2t)³)/4: b = 0.4, t = 0.02 → (0.064 − 0.046656)/4.
  CHECK(plastic_modulus(SectionShape::square, 0.4) == exact(0.016));
  CHECK(plastic_modulus(SectionShape::round, 0.6) == exact(0.036));
  CHECK(plastic_modulus(SectionShape::square, 0.4, 0.02) == exact(0.004336));
  // Elastic moduli (from memory): square b³/6, round πD³/32, pipe π(D⁴ − d⁴)/(32D).
  CHECK(elastic_modulus(SectionShape::square, 0.4) == exact(0.064 / 6.0));
  CHECK(elastic_modulus(SectionShape::round, 0.6) == exact(kPi * 0.216 / 32.0));
  CHECK(elastic_modulus(SectionShape::round, 0.61, 0.019) ==
        exact(kPi * (std::pow(0.61, 4) - std::pow(0.572, 4)) / (32.0 * 0.61)));
  // About the diagonal of a solid square (from memory): Z = b³/(3√2) (two triangles b²/2 with
  // centroids (b/√2)/3 from the axis), S = √2·b³/12 (I = b⁴/12 about any axis, c = b/√2).
  CHECK(plastic_modulus(SectionShape::square, 0.4, 0.0, BendingAxis::diagonal) ==
        exact(0.064 / (3.0 * std::sqrt(2.0))));
  CHECK(elastic_modulus(SectionShape::square, 0.4, 0.0, BendingAxis::diagonal) ==
        exact(std::sqrt(2.0) * 0.064 / 12.0));
  // Shape factors Z/S: 1.5 for a solid square, 16/(3π) = 1.698 for a solid round (from
  // memory).
  CHECK(plastic_modulus(SectionShape::square, 0.4) / elastic_modulus(SectionShape::square, 0.4) ==
        exact(1.5));
  CHECK(plastic_modulus(SectionShape::round, 0.6) / elastic_modulus(SectionShape::round, 0.6) ==
        exact(16.0 / (3.0 * kPi)));
}

TEST_CASE("lateral: a steel section's plastic moment under axial force", "[lateral][published]") {
  const double fy = 345000.0;  // kPa
  // P = 0: fy·Z exactly.
  CHECK(steel_plastic_moment(SectionShape::round, 0.61, 0.019, fy, 0.0) ==
        Approx(fy * 6.63862533e-3).epsilon(1e-9));
  // Solid rectangle: M = Mp·(1 − n²), n = P/Py (Neal, The Plastic Methods of Structural
  // Analysis, 1977, ch. 6; from memory). The same in tension and compression.
  const double b = 0.4, py = fy * b * b, mp = fy * b * b * b / 4.0;
  for (double n : {0.1, 0.3, 0.6, 0.9}) {
    CAPTURE(n);
    CHECK(steel_plastic_moment(SectionShape::square, b, 0.0, fy, n * py) ==
          Approx(mp * (1.0 - n * n)).epsilon(1e-9));
    CHECK(steel_plastic_moment(SectionShape::square, b, 0.0, fy, -n * py) ==
          Approx(mp * (1.0 - n * n)).epsilon(1e-9));
  }
  // Thin-walled tube: M = Mp·cos(πn/2) (Neal 1977, from memory), exact as t/D → 0; for
  // D/t = 32 within 0.2 %.
  const double area = kPi * (0.61 * 0.61 - 0.572 * 0.572) / 4.0;
  const double pipe_mp = fy * 6.63862533e-3;
  for (double n : {0.2, 0.5}) {
    CAPTURE(n);
    CHECK(steel_plastic_moment(SectionShape::round, 0.61, 0.019, fy, n * fy * area) ==
          Approx(pipe_mp * std::cos(kPi * n / 2.0)).epsilon(2e-3));
  }
  CHECK(steel_plastic_moment(SectionShape::round, 0.61, 0.019, fy, 1.01 * fy * area) == 0.0);
  // Diagonal of a solid square: fy·b³/(3√2) at P = 0; under P the diamond's neutral axis moves
  // to y0 with (h − y0)² = A(1 − n)/2, h = b/√2, and M = 2fy·(h³/3 − h·y0² + (2/3)y0³)
  // (hand integration of the width 2(h − |y|)). n = 0.5: y0 = h(1 − √0.5).
  CHECK(steel_plastic_moment(SectionShape::square, b, 0.0, fy, 0.0, BendingAxis::diagonal) ==
        Approx(fy * b * b * b / (3.0 * std::sqrt(2.0))).epsilon(1e-9));
  const double hd = b / std::sqrt(2.0), y0 = hd * (1.0 - std::sqrt(0.5));
  CHECK(steel_plastic_moment(SectionShape::square, b, 0.0, fy, 0.5 * py, BendingAxis::diagonal) ==
        Approx(2.0 * fy * (hd * hd * hd / 3.0 - hd * y0 * y0 + 2.0 / 3.0 * y0 * y0 * y0)).epsilon(1e-9));
}

TEST_CASE("lateral: reinforced concrete Mn by the ACI stress block", "[lateral][published]") {
  // β1, ACI 318-19 Table 22.2.2.4.3 (from memory): 0.85 up to 28 MPa, 0.80 at 35 MPa,
  // 0.65 from 56 MPa.
  CHECK(stress_block_beta1(28000) == exact(0.85));
  CHECK(stress_block_beta1(35000) == exact(0.80));
  CHECK(stress_block_beta1(70000) == exact(0.65));

  // Hand calculation (docs/methods-lateral.md), procedure of ACI 318-19 22.2 as taught for
  // doubly reinforced sections (Wight & MacGregor, Reinforced Concrete: Mechanics and Design,
  // 6th ed., ch. 5; from memory). 500 mm square, 4 bars of 510 mm² at the corners, centres
  // 60 mm in (d = 440, d' = 60 mm), f'c = 28 MPa, fy = 420 MPa, Es = 200 GPa, P = 0.
  // Trial: the bottom bars yield; the top bars lie below a, elastic:
  //   0.85·28·0.85·500·c + 1020·600·(c − 60)/c − 1020·420 = 0
  //   → 10115c² + 183600c − 36 720 000 = 0 → c = 51.856 mm, a = 44.077 mm;
  //   top bars ε = −0.000471 (−94.2 MPa, tension), bottom ε = 0.02246 > 0.0021 (yield).
  //   Cc = 524.52 kN at a/2; Ts' = 96.12 kN at 60 mm; T = 428.40 kN at 440 mm.
  //   Mn = 524.52·(0.25 − 0.022039) + (−96.12)·0.19 + 428.40·0.19 = 182.70 kN·m.
  ReinforcedSection square{SectionShape::square, 0.5, 28000, 420000, 4 * 510e-6, 4, 0.06};
  CHECK(concrete_moment_capacity(square, 0.0) == Approx(182.703).epsilon(1e-5));
  // Tension lowers Mn, moderate compression raises it (below the balanced point).
  CHECK(concrete_moment_capacity(square, -200.0) < concrete_moment_capacity(square, 0.0));
  CHECK(concrete_moment_capacity(square, 1000.0) > concrete_moment_capacity(square, 0.0));
  // The ends of the axial range: −As·fy (all bars yield in tension) and
  // Po = 0.85·f'c·(Ag − As) + fy·As (ACI 318-19 eq. 22.4.2.2): no moment capacity.
  const double as_fy = 4 * 510e-6 * 420000;
  const double po = 0.85 * 28000 * (0.25 - 4 * 510e-6) + as_fy;
  CHECK(concrete_moment_capacity(square, -as_fy) == 0.0);
  CHECK(concrete_moment_capacity(square, po) == 0.0);
  CHECK(concrete_moment_capacity(square, 0.999 * po) > 0.0);
  CHECK(concrete_moment_capacity(square, -0.999 * as_fy) > 0.0);
  // The same section bent about its diagonal (hand calculation, same procedure): bars at
  // depths 84.85, 353.55 (two) and 622.25 mm below the compression corner; the block is the
  // triangle of area a², centroid 2a/3 down. With the top bar elastic inside the block and
  // the others yielding in tension: 0.85·28·(0.85c)² + 510·(600(c − 84.85)/c − 23.8)
  // − 3·510·420 = 0 → c = 170.67 mm (iterated by hand), a = 145.07 mm, top bar 301.7 MPa;
  // Mn = 500.87 kN·(353.55 − 96.71) mm + 141.73 kN·268.70 mm + 2·214.2 kN·0 + 214.2 kN·268.70 mm
  // = 224.28 kN·m — more than about a side, so a side governs this layout.
  CHECK(concrete_moment_capacity(square, 0.0, BendingAxis::diagonal) == Approx(224.28).epsilon(1e-4));
  // Round section: Mn(P) concave over the range, so the lesser end governs (invariant).
  ReinforcedSection round{SectionShape::round, 0.6, 35000, 420000, 8 * 387e-6, 8, 0.075};
  const double m0 = concrete_moment_capacity(round, 0.0);
  const double m_tension = concrete_moment_capacity(round, -500.0);
  const double m_mid = concrete_moment_capacity(round, -250.0);
  CHECK(m_tension < m_mid);
  CHECK(m_mid < m0);
  CHECK(m_mid >= 0.5 * (m0 + m_tension) - 1e-6);
}

TEST_CASE("lateral: which yield moment a pile type gets", "[lateral]") {
  PileType type;
  type.id = "P";
  type.section = {SectionShape::round, 0.61};
  // No structure: nothing to compute from, and the reason names what to give.
  CHECK_FALSE(section_yield_moment(type, std::nullopt, UnitSystem::SI).value);
  Structure st;
  st.steel_yield = 345000;
  st.wall_thickness = 0.019;
  type.structure = st;
  const auto pipe = section_yield_moment(type, AxialRange{-300.0, 1000.0}, UnitSystem::SI);
  REQUIRE(pipe.value);
  // Tension −300 kN is the smaller |P| here: 1000 kN compression governs.
  CHECK(pipe.axial == 1000.0);
  CHECK(*pipe.value == Approx(steel_plastic_moment(SectionShape::round, 0.61, 0.019, 345000,
                                                   1000.0)));
  CHECK(pipe.basis.find("plastic modulus Z") != std::string::npos);
  // An H-pile typed as round with its own steel area: not a solid or hollow round section.
  type.structure->wall_thickness.reset();
  type.structure->steel_area = 0.0168;
  const auto h_pile = section_yield_moment(type, std::nullopt, UnitSystem::SI);
  CHECK_FALSE(h_pile.value);
  CHECK(h_pile.missing.find("H-pile") != std::string::npos);
  // A slender pipe (D/t = 48 > 0.07·E/fy = 40.6) does not reach its plastic moment.
  type.structure->steel_area.reset();
  type.structure->wall_thickness = 0.0127;
  CHECK(section_yield_moment(type, std::nullopt, UnitSystem::SI).missing.find("slender") !=
        std::string::npos);
  // The given value wins.
  type.structure->yield_moment = 900.0;
  CHECK(*section_yield_moment(type, std::nullopt, UnitSystem::SI).value == 900.0);
  // A solid steel square: the diagonal is the weaker axis, b³/(3√2) < b³/4.
  Structure square_steel;
  square_steel.steel_yield = 345000;
  PileType square = type;
  square.section = {SectionShape::square, 0.4};
  square.structure = square_steel;
  const auto sq = section_yield_moment(square, std::nullopt, UnitSystem::SI);
  CHECK(*sq.value == Approx(345000 * 0.064 / (3.0 * std::sqrt(2.0))).epsilon(1e-9));
  CHECK(sq.basis.find("about the diagonal") != std::string::npos);
  // Timber: Fb·S with the elastic modulus, S = πD³/32; Fb = 20 MPa, D = 0.3 m.
  Structure timber;
  timber.bending_strength = 20000;
  type.structure = timber;
  type.section = {SectionShape::round, 0.3};
  CHECK(*section_yield_moment(type, std::nullopt, UnitSystem::SI).value ==
        exact(20000 * kPi * 0.027 / 32.0));
}

TEST_CASE("lateral: Broms with the yield moment of a steel pipe", "[lateral][published]") {
  const CheckRun run = analyse_project(kData + "pipe_in_clay.yaml");
  // My at P = 1000 kN: the thin-tube rule Mp·cos(πn/2) = 2290.33·cos(π·0.08217/2) =
  // 2271.28 kN·m (Neal 1977, from memory; exact to 0.2 % for D/t = 32).
  const double my = 345000 * 6.63862533e-3 * std::cos(kPi / 2 * 1000 / (345000 * kPi *
                                                          (0.61 * 0.61 - 0.572 * 0.572) / 4));
  // Broms (1964a), free-headed long pile in clay, e = 0: My = H(1.5D + 0.5f), f = H/(9cu·D):
  // H²/(18cu·D) + 1.5D·H − My = 0.
  const double a = 1.0 / (18 * 75 * 0.61), b = 1.5 * 0.61;
  const double h_ult = (-b + std::sqrt(b * b + 4 * a * my)) / (2 * a);
  REQUIRE(run.resistances[0].allowable.lateral);
  CHECK(*run.resistances[0].allowable.lateral == Approx(h_ult / 2.5).epsilon(2e-3));
  CHECK(run.resistances[0].allowable.source.find("long pile") != std::string::npos);
}

TEST_CASE("lateral: a concrete pile's yield moment at its tension", "[lateral]") {
  // tests/data/defaults/concrete_in_sand.yaml: by hand (rigid cap, two piles) the axial
  // forces range from −200 kN (S2, tension) to 600 kN; Mn(P) is lower in tension.
  const CheckRun run = analyse_project(kData + "concrete_in_sand.yaml");
  const ReinforcedSection rc{SectionShape::round, 0.6, 35000, 420000, 0.0031, 8, 0.075};
  const double my = concrete_moment_capacity(rc, -200.0);
  CHECK(my < concrete_moment_capacity(rc, 0.0));
  CHECK(my < concrete_moment_capacity(rc, 600.0));
  BromsInput in;
  in.soil = SoilKind::sand;
  in.effective_unit_weight = 19.0;
  in.friction_angle = 32.0;
  in.width = 0.6;
  in.embedded_length = 15.0;
  in.yield_moment = my;
  REQUIRE(run.resistances[0].allowable.lateral);
  CHECK(*run.resistances[0].allowable.lateral ==
        Approx(broms_ultimate_lateral(in).ultimate_load / 2.5).epsilon(1e-6));
  CHECK(run.resistances[0].allowable.source.find(
            "at P = -200.0 kN (tension), the least favourable axial force of all combinations") !=
        std::string::npos);
}

TEST_CASE("lateral: no yield moment where Broms is needed is an input error",
          "[lateral][input]") {
  CHECK(error_of([] { analyse_project(kData + "bad_no_yield_moment.yaml"); }) ==
        "@bad_no_yield_moment.yaml:15:16: error: pile_types.PC45: Broms' lateral capacity of "
        "this reinforced concrete pile needs its yield moment, but the concrete section's "
        "reinforcement is not fully given (structure.bar_count, structure.cover_to_bar_center); "
        "give structure.yield_moment (or a lateral capacity)");
}

// ---- the two tension keys --------------------------------------------------------------

TEST_CASE("input: tension: false with a tension capacity asks which was meant", "[input]") {
  CHECK(error_of([] { read_project(kData + "bad_tension_contradiction.yaml"); }) ==
        "@bad_tension_contradiction.yaml:11:44: error: pile_types.PC45.capacity.tension: "
        "expected 0 or no tension capacity with tension: false (the pile drops out of the cap "
        "rather than take tension), got '350'; which did you mean: a pile that takes tension "
        "up to this capacity (remove 'tension: false') or a compression-only pile (remove "
        "pile_types.PC45.capacity.tension)?");
}

TEST_CASE("input: a tension capacity of 0 is accepted and fails any tension", "[input]") {
  const Project project = read_project(kData + "tension_zero.yaml");
  REQUIRE(project.pile_types.size() == 2);
  CHECK(project.pile_types[0].tension);
  CHECK(*project.pile_types[0].capacities[0].tension == 0.0);
  CHECK_FALSE(project.pile_types[1].tension);
  CHECK(*project.pile_types[1].capacities[0].tension == 0.0);
  const CheckRun run = analyse_project(kData + "tension_zero.yaml");
  // Rigid cap, two piles 2.7 m apart (common practice): S1 P = 500 ± 333.33 kN, both in
  // compression, passes; S2 P = 500 ± 666.67 kN, one pile in 166.67 kN tension, fails.
  const auto& s1 = run.results.combinations[0];
  const auto& s2 = run.results.combinations[1];
  CHECK(s1.pass);
  CHECK_FALSE(s2.pass);
  double tension = 0.0;
  for (const auto& p : s2.piles) tension = std::max(tension, -p.axial);
  CHECK(tension == Approx(166.667).epsilon(1e-5));
  CHECK(s2.governing == Demand::tension);
}

TEST_CASE("checks: a compression-only pile does not use the uplift computed from the soil",
          "[input]") {
  // tests/data/e2e/soil.yaml: tension: false, capacities computed from clay over sand.
  const CheckRun run = analyse_project(std::string(CAIRN_TEST_DATA) + "/e2e/soil.yaml");
  REQUIRE(run.capacities.size() == 1);
  CHECK(run.capacities[0].result.allowable_tension > 0.0);  // computed...
  CHECK_FALSE(run.resistances[0].allowable.tension);         // ...but not used
  CHECK_FALSE(run.resistances[0].factored.tension);
  bool said = false;
  for (const auto& a : run.assumptions)
    said = said || a.find("the uplift capacity computed from the soil is not used") !=
                       std::string::npos;
  CHECK(said);
}

// ---- the group-efficiency note ---------------------------------------------------------

TEST_CASE("group_checks: the η = 1 note says what holds for the project", "[group_checks]") {
  const auto note = [](const std::string& file) {
    return analyse_project(kData + file).group.applied.note;
  };
  // No soil profile: no claim about driven piles in sand.
  const std::string no_soil = note("tension_zero.yaml");
  CHECK(no_soil.find("no soil profile") != std::string::npos);
  CHECK(no_soil.find("driven") == std::string::npos);
  const std::string bored = note("bored_in_sand.yaml");
  CHECK(bored.find("bored piles do not densify") != std::string::npos);
  CHECK(bored.find("common practice") == std::string::npos);
  const std::string clay = note("pipe_in_clay.yaml");
  CHECK(clay.find("clay") != std::string::npos);
  CHECK(clay.find("driven piles in sand") == std::string::npos);
}

// ---- battered piles keep their spacing at depth ----------------------------------------

namespace {

// Piles 0.4 m wide (required spacing 2.5 × 0.4 = 1.0 m, common practice), type 0 12 m long,
// type 1 6 m long.
Project battered_project(std::vector<Pile> piles) {
  Project p;
  PileType long_type, short_type;
  long_type.id = "L12";
  long_type.section = {SectionShape::round, 0.4};
  long_type.length = 12.0;
  short_type = long_type;
  short_type.id = "S6";
  short_type.length = 6.0;
  p.pile_types = {long_type, short_type};
  p.piles = std::move(piles);
  return p;
}

Pile pile(const std::string& id, double x, double y, std::size_t type,
          std::optional<Batter> batter = std::nullopt) {
  Pile p;
  p.id = id;
  p.x = x;
  p.y = y;
  p.type = type;
  p.batter = batter;
  return p;
}

}  // namespace

TEST_CASE("group_checks: closest approach of two segments", "[group_checks]") {
  // Hand geometry: the x axis from 0 to 2 and a segment parallel to y at x = 1, z = 1: they
  // come within 1 m at (1, 0, 0) and (1, 0, 1).
  const auto c = closest_approach({0, 0, 0}, {2, 0, 0}, {1, -1, 1}, {1, 1, 1});
  CHECK(c.distance == Approx(1.0).epsilon(1e-12));
  CHECK(c.first[0] == Approx(1.0).epsilon(1e-12));
  CHECK(c.second[2] == Approx(1.0).epsilon(1e-12));
  // The closest point lies beyond an end: clamped to it. (0,0,0)–(1,0,0) and (3,−1,0)–(3,1,0):
  // 2 m, from (1, 0, 0).
  const auto d = closest_approach({0, 0, 0}, {1, 0, 0}, {3, -1, 0}, {3, 1, 0});
  CHECK(d.distance == Approx(2.0).epsilon(1e-12));
  // Parallel segments: the distance between the lines.
  CHECK(closest_approach({0, 0, 0}, {0, 0, -5}, {0.7, 0, 0}, {0.7, 0, -5}).distance ==
        Approx(0.7).epsilon(1e-12));
}

TEST_CASE("group_checks: battered piles keep the minimum spacing at every depth",
          "[group_checks]") {
  SECTION("two piles battered 1:4 toward each other cross at 4 m") {
    // Heads 2 m apart; each axis moves 0.25 m per metre of depth toward the other: the
    // horizontal gap is 2 − 0.5·z, zero at z = 4 m (above the tips at 12/√1.0625 = 11.64 m).
    const auto v = battered_spacing_violations(battered_project(
        {pile("A1", -1.0, 0.0, 0, Batter{4.0, 0.0}), pile("A2", 1.0, 0.0, 0, Batter{4.0, 180.0})}));
    REQUIRE(v.size() == 1);
    CHECK(v[0].first == "A1");
    CHECK(v[0].second == "A2");
    CHECK(v[0].distance == Approx(0.0).margin(1e-9));
    CHECK(*v[0].depth == Approx(4.0).epsilon(1e-9));
    CHECK(v[0].required == Approx(1.0).epsilon(1e-12));
  }
  SECTION("a battered pile passing a vertical one") {
    // A1 at (−1, 0) battered 1:4 toward +x; A2 vertical at (1, 0.8): the gap at depth z is
    // √((2 − 0.25z)² + 0.8²), least at z = 8 m: 0.8 m < 1.0 m.
    const auto v = battered_spacing_violations(battered_project(
        {pile("A1", -1.0, 0.0, 0, Batter{4.0, 0.0}), pile("A2", 1.0, 0.8, 0)}));
    REQUIRE(v.size() == 1);
    CHECK(v[0].distance == Approx(0.8).epsilon(1e-9));
    CHECK(*v[0].depth == Approx(8.0).epsilon(1e-9));
  }
  SECTION("only down to the shallower tip") {
    // The same with A2 at y = 0.9 and 6 m long: at its tip the gap is √(0.5² + 0.9²) =
    // 1.0296 m ≥ 1.0 m, so the pair passes, although the full axes would come within 0.9 m.
    CHECK(battered_spacing_violations(battered_project(
              {pile("A1", -1.0, 0.0, 0, Batter{4.0, 0.0}), pile("A2", 1.0, 0.9, 1)}))
              .empty());
    // At y = 0.8 the gap at 6 m is √(0.25 + 0.64) = 0.9434 m: fails at the short pile's tip.
    const auto v = battered_spacing_violations(battered_project(
        {pile("A1", -1.0, 0.0, 0, Batter{4.0, 0.0}), pile("A2", 1.0, 0.8, 1)}));
    REQUIRE(v.size() == 1);
    CHECK(v[0].distance == Approx(std::sqrt(0.89)).epsilon(1e-9));
    CHECK(*v[0].depth == Approx(6.0).epsilon(1e-9));
  }
  SECTION("battered apart, or parallel, passes") {
    CHECK(battered_spacing_violations(battered_project(
              {pile("A1", -1.0, 0.0, 0, Batter{4.0, 180.0}), pile("A2", 1.0, 0.0, 0, Batter{4.0, 0.0})}))
              .empty());
    CHECK(battered_spacing_violations(battered_project(
              {pile("A1", -1.0, 0.0, 0, Batter{4.0, 90.0}), pile("A2", 1.0, 0.0, 0, Batter{4.0, 90.0})}))
              .empty());
  }
}
