// Tests of checks.hpp: resistances on each basis, missing capacities, utilization per
// demand, envelope and summary. Projects and cap solutions are built by hand, so every
// pile force is known exactly and each utilization is a one-line hand calculation.
#include <catch2/catch.hpp>

#include <cmath>
#include <numbers>

#include "cairn/checks/checks.hpp"

using namespace cairn;

namespace {

// Relative margin for values computed from round inputs: only floating-point round-off
// separates the code from the hand calculation.
constexpr double kTight = 1e-9;
// Relative margin for comparisons with published values rounded to 4–5 digits.
constexpr double kPublished = 1e-3;

CapacitySet allowable_set(std::optional<double> c, std::optional<double> t,
                          std::optional<double> l) {
  CapacitySet set;
  set.basis = CapacityBasis::allowable;
  set.compression = c;
  set.tension = t;
  set.lateral = l;
  return set;
}

// A project with one pile type 'P' (square 0.45 m, 18 m), `piles` piles on the x axis and
// the combinations given as (id, limit state).
Project project_with(std::size_t piles,
                     std::vector<std::pair<std::string, LimitState>> combinations) {
  Project p;
  p.file = "test.yaml";
  PileType type;
  type.id = "P";
  type.section = {SectionShape::square, 0.45};
  type.length = 18.0;
  type.elastic_modulus = 3.0e7;
  p.pile_types.push_back(type);
  for (std::size_t i = 0; i < piles; ++i) {
    Pile pile;
    pile.id = "P" + std::to_string(i + 1);
    pile.x = 1.5 * static_cast<double>(i);
    p.piles.push_back(pile);
  }
  LoadCase d;
  d.id = "D";
  p.load_cases.push_back(d);
  for (const auto& [id, state] : combinations) {
    Combination c;
    c.id = id;
    c.where = {"test.yaml", 20, 3};
    c.limit_state = state;
    c.factors = {{0, 1.0}};
    p.combinations.push_back(c);
  }
  return p;
}

// A solution with the given pile forces (axial compression positive, lateral).
CapSolution solution(std::vector<std::pair<double, double>> forces) {
  CapSolution s;
  for (const auto& [axial, lateral] : forces) s.piles.push_back({axial, lateral, true});
  return s;
}

PileTypeResistance allowable_only(std::optional<double> c, std::optional<double> t,
                                  std::optional<double> l) {
  PileTypeResistance r;
  r.allowable.compression = c;
  r.allowable.tension = t;
  r.allowable.lateral = l;
  return r;
}

}  // namespace

TEST_CASE("checks: typed-in capacities win value by value over computed ones", "[checks]") {
  Project p = project_with(1, {{"S1", LimitState::service}});
  // Typed: compression only. Computed: compression, tension and lateral.
  p.pile_types[0].capacities.push_back(allowable_set(1000.0, std::nullopt, std::nullopt));
  ComputedResistance computed;
  computed.allowable_compression = 800.0;
  computed.allowable_tension = 300.0;
  computed.factored_compression = 1100.0;
  computed.factored_tension = 400.0;
  computed.allowable_lateral = 50.0;
  computed.factored_lateral = 125.0;
  computed.method = "tip vesic, shaft beta";
  computed.lateral_method = "Broms (1964)";
  const auto r = resolve_resistances(p, {computed});
  REQUIRE(r.size() == 1);
  CHECK(*r[0].allowable.compression == 1000.0);  // typed in: wins
  CHECK(*r[0].allowable.tension == 300.0);       // not typed: computed fills it
  CHECK(*r[0].allowable.lateral == 50.0);
  CHECK(*r[0].factored.compression == 1100.0);   // no factored typed in: all computed
  CHECK(*r[0].factored.tension == 400.0);
  CHECK(*r[0].factored.lateral == 125.0);
  CHECK(r[0].factored.source ==
        "computed from the soil: tip vesic, shaft beta; lateral by Broms (1964)");
  CHECK(r[0].allowable.source.find("allowable values given") != std::string::npos);
}

TEST_CASE("checks: ultimate capacities are divided by default factors of safety 2.5 and 3.0",
          "[checks][published]") {
  Project p = project_with(1, {{"S1", LimitState::service}});
  CapacitySet set;
  set.basis = CapacityBasis::ultimate;
  set.compression = 1000.0;
  set.tension = 1000.0;
  set.lateral = 100.0;
  p.pile_types[0].capacities.push_back(set);
  const auto r = resolve_resistances(p, {});
  // Source: common practice, single-pile ultimate ÷ FS 2.5–3.0 from static calculation,
  // tension with the higher factor (from memory); computed: Qult = 1000 kN
  // → Qall = 400 kN (FS 2.5) and 333.33 kN (FS 3.0).
  CHECK(*r[0].allowable.compression == Approx(400.0).epsilon(kPublished));
  CHECK(*r[0].allowable.tension == Approx(333.33).epsilon(kPublished));
  CHECK(*r[0].allowable.lateral == Approx(40.0).epsilon(kTight));  // 100 / 2.5, hand
  // Without resistance factors nothing is factored.
  CHECK_FALSE(r[0].factored.compression);
  CHECK(r[0].allowable.source == "ultimate given ÷ factor of safety 2.5 (tension 3)");

  SECTION("factors of safety given") {
    p.pile_types[0].capacities[0].factor_of_safety = 2.0;
    p.pile_types[0].capacities[0].factor_of_safety_tension = 2.5;
    const auto g = resolve_resistances(p, {});
    // Common practice, computed: FS = 2.0 → 500 kN; FS = 2.5 → 400 kN.
    CHECK(*g[0].allowable.compression == Approx(500.0).epsilon(kPublished));
    CHECK(*g[0].allowable.tension == Approx(400.0).epsilon(kPublished));
  }
}

TEST_CASE("checks: ultimate capacities times resistance factors give factored resistances",
          "[checks]") {
  Project p = project_with(1, {{"U1", LimitState::strength}});
  CapacitySet set;
  set.basis = CapacityBasis::ultimate;
  set.compression = 2000.0;
  set.tension = 800.0;
  set.lateral = 150.0;
  set.resistance_factor = 0.45;
  set.resistance_factor_tension = 0.35;
  p.pile_types[0].capacities.push_back(set);
  const auto r = resolve_resistances(p, {});
  // Hand: φ·R = 0.45 × 2000 = 900; 0.35 × 800 = 280; 0.45 × 150 = 67.5 kN.
  CHECK(*r[0].factored.compression == Approx(900.0).epsilon(kTight));
  CHECK(*r[0].factored.tension == Approx(280.0).epsilon(kTight));
  CHECK(*r[0].factored.lateral == Approx(67.5).epsilon(kTight));
  CHECK(r[0].factored.source == "ultimate given × resistance factor 0.45");
}

TEST_CASE("checks: structural capacity is Po of ACI 318-19 times the factor given",
          "[checks][published]") {
  Project p = project_with(1, {{"S1", LimitState::service}});
  PileType& type = p.pile_types[0];
  type.section = {SectionShape::round, 0.6};
  type.capacities.push_back(allowable_set(1000.0, 300.0, 50.0));
  Structure st;
  st.concrete_strength = 35000.0;  // 35 MPa
  st.steel_yield = 420000.0;       // 420 MPa
  st.steel_area = 0.0025;
  st.yield_moment = 250.0;
  st.allowable_factor = 0.33;
  st.resistance_factor = 0.65;
  type.structure = st;
  const auto r = resolve_resistances(p, {});
  // Source: ACI 318-19 eq. 22.4.2.2, Po = 0.85·f'c·(Ag − As) + fy·As (from memory).
  // Hand: Ag = π·0.6²/4 = 0.282743 m²; Po = 0.85·35000·0.280243 + 420000·0.0025
  //       = 8337.24 + 1050.00 = 9387.24 kN; × 0.33 = 3097.79; × 0.65 = 6101.71 kN.
  CHECK(*r[0].allowable.structural_axial == Approx(3097.79).epsilon(1e-5));
  CHECK(*r[0].factored.structural_axial == Approx(6101.71).epsilon(1e-5));
  CHECK(*r[0].allowable.structural_moment == Approx(0.33 * 250.0).epsilon(kTight));
  CHECK(*r[0].factored.structural_moment == Approx(0.65 * 250.0).epsilon(kTight));

  SECTION("steel section: fy·A of the gross area") {
    Structure steel;
    steel.steel_yield = 345000.0;  // 345 MPa
    steel.allowable_factor = 0.5;
    type.section = {SectionShape::square, 0.3};
    type.structure = steel;
    const auto s = resolve_resistances(p, {});
    // Hand: 0.5 × 345000 × 0.09 = 15525 kN (common practice: allowable 0.5·fy).
    CHECK(*s[0].allowable.structural_axial == Approx(15525.0).epsilon(kTight));
    CHECK_FALSE(s[0].factored.structural_axial);
  }
}

TEST_CASE("checks: a strength combination without factored capacity is an input problem",
          "[checks]") {
  Project p = project_with(2, {{"S1", LimitState::service}, {"U1", LimitState::strength}});
  p.pile_types[0].capacities.push_back(allowable_set(1000.0, 300.0, 50.0));
  const auto r = resolve_resistances(p, {});
  const auto problems = missing_resistances(p, r);
  REQUIRE(problems.size() == 1);
  CHECK(problems[0].where.line == 20);
  CHECK(problems[0].message ==
        "combinations.U1: a strength combination is compared with factored capacities, but "
        "pile type 'P' has no factored compression capacity; give capacity with basis: "
        "factored (or basis: ultimate with resistance_factor)");

  SECTION("an ultimate set with a resistance factor covers both bases") {
    CapacitySet set;
    set.basis = CapacityBasis::ultimate;
    set.compression = 2000.0;
    set.resistance_factor = 0.5;
    p.pile_types[0].capacities = {set};
    CHECK(missing_resistances(p, resolve_resistances(p, {})).empty());
  }
  SECTION("a pile type no pile uses is not asked for") {
    PileType unused = p.pile_types[0];
    unused.id = "Q";
    unused.capacities.clear();
    p.pile_types.push_back(unused);
    CHECK(missing_resistances(p, resolve_resistances(p, {})).size() == 1);
  }
}

TEST_CASE("checks: utilization is the largest demand over capacity", "[checks]") {
  Project p = project_with(4, {{"S1", LimitState::service}});
  const std::vector<PileTypeResistance> r = {allowable_only(1000.0, 300.0, 60.0)};
  // P1 compression, P2 tension, P3 lateral governs, P4 unloaded.
  const auto results =
      check_piles(p, {solution({{700.0, 15.0}, {-150.0, 6.0}, {200.0, 45.0}, {0.0, 0.0}})}, r);
  const auto& piles = results.combinations[0].piles;
  // Hand: 700/1000, 150/300, 45/60.
  CHECK(piles[0].utilization == Approx(0.70).epsilon(kTight));
  CHECK(piles[0].governing == Demand::compression);
  CHECK(piles[1].utilization == Approx(0.50).epsilon(kTight));
  CHECK(piles[1].governing == Demand::tension);
  CHECK(piles[2].utilization == Approx(0.75).epsilon(kTight));
  CHECK(piles[2].governing == Demand::lateral);
  CHECK(piles[3].utilization == 0.0);
  CHECK(piles[3].governing == Demand::none);
  CHECK(results.combinations[0].pass);
  CHECK(results.combinations[0].max_utilization == Approx(0.75).epsilon(kTight));
  CHECK(*results.combinations[0].governing_pile == 2);
  CHECK(results.combinations[0].governing == Demand::lateral);
}

TEST_CASE("checks: service combinations use allowable, strength ones factored capacities",
          "[checks]") {
  Project p = project_with(1, {{"S1", LimitState::service}, {"U1", LimitState::strength}});
  PileTypeResistance r = allowable_only(1000.0, 300.0, 60.0);
  r.factored.compression = 2000.0;
  const auto results = check_piles(p, {solution({{800.0, 0.0}}), solution({{800.0, 0.0}})}, {r});
  CHECK(results.combinations[0].piles[0].utilization == Approx(0.8).epsilon(kTight));
  CHECK(results.combinations[1].piles[0].utilization == Approx(0.4).epsilon(kTight));
}

TEST_CASE("checks: tension without a tension capacity fails with infinite utilization",
          "[checks]") {
  Project p = project_with(2, {{"S1", LimitState::service}});
  const std::vector<PileTypeResistance> r = {allowable_only(1000.0, std::nullopt, 60.0)};
  const auto results = check_piles(p, {solution({{500.0, 0.0}, {-20.0, 0.0}})}, r);
  const PileCheck& pile = results.combinations[0].piles[1];
  CHECK(std::isinf(pile.utilization));
  CHECK(pile.governing == Demand::tension);
  CHECK_FALSE(pile.pass);
  CHECK_FALSE(results.combinations[0].pass);
  CHECK_FALSE(results.summary.pass);
  CHECK(*results.summary.pile == 1);
  CHECK(results.summary.check == Demand::tension);
  CHECK(results.summary.failed_combinations == 1);

  SECTION("a lateral shear without a lateral capacity fails the same way") {
    const std::vector<PileTypeResistance> no_lateral = {allowable_only(1000.0, 300.0, std::nullopt)};
    const auto lateral = check_piles(p, {solution({{500.0, 5.0}, {100.0, 0.0}})}, no_lateral);
    CHECK(std::isinf(lateral.combinations[0].piles[0].utilization));
    CHECK(lateral.combinations[0].piles[0].governing == Demand::lateral);
    CHECK(lateral.combinations[0].piles[1].pass);
  }
}

TEST_CASE("checks: structural check of fixed heads adds |P|/Pc and |M|/Mc", "[checks]") {
  Project p = project_with(1, {{"U1", LimitState::strength}});
  PileTypeResistance r;
  r.factored.compression = 5000.0;
  r.factored.lateral = 500.0;
  r.factored.structural_axial = 4000.0;
  r.factored.structural_moment = 200.0;
  // Fixed head, long pile: M = V/(2λ); with 1/(2λ) = 1.412 m (computed from Hetényi's closed form: a
  // 100 kN shear gives a head moment of 141.21 kN·m, Hetényi 1946, from memory).
  const std::vector<double> moment_per_shear = {1.41209};
  const auto results = check_piles(p, {solution({{1200.0, 50.0}})}, {r}, moment_per_shear);
  const PileCheck& pile = results.combinations[0].piles[0];
  // Hand: M = 50 × 1.41209 = 70.60 kN·m; u = 1200/4000 + 70.60/200 = 0.300 + 0.353 = 0.653,
  // above the geotechnical 1200/5000 = 0.24 and 50/500 = 0.1 (linear interaction: common
  // practice).
  CHECK(pile.head_moment == Approx(70.6045).epsilon(kTight));
  CHECK(pile.utilization == Approx(0.3 + 70.6045 / 200.0).epsilon(kTight));
  CHECK(pile.governing == Demand::structural);

  SECTION("pinned heads: axial alone against Pc") {
    const auto pinned = check_piles(p, {solution({{-3000.0, 50.0}})}, {r});
    // Hand: |−3000|/4000 = 0.75 (no tension capacity given would also be infinite; give one).
    PileTypeResistance with_tension = r;
    with_tension.factored.tension = 6000.0;
    const auto t = check_piles(p, {solution({{-3000.0, 50.0}})}, {with_tension});
    CHECK(t.combinations[0].piles[0].utilization == Approx(0.75).epsilon(kTight));
    CHECK(t.combinations[0].piles[0].governing == Demand::structural);
    CHECK(std::isinf(pinned.combinations[0].piles[0].utilization));
  }
}

TEST_CASE("checks: the envelope and summary name the right pile and combination", "[checks]") {
  Project p = project_with(3, {{"S1", LimitState::service},
                               {"S2", LimitState::service},
                               {"S3", LimitState::service}});
  const std::vector<PileTypeResistance> r = {allowable_only(1000.0, 400.0, 100.0)};
  const std::vector<CapSolution> solutions = {
      solution({{600.0, 10.0}, {500.0, 10.0}, {400.0, 10.0}}),
      solution({{900.0, 30.0}, {450.0, 80.0}, {-100.0, 20.0}}),
      solution({{300.0, 50.0}, {-200.0, 40.0}, {700.0, 5.0}})};
  const auto results = check_piles(p, solutions, r);
  const auto& e = results.envelope;
  REQUIRE(e.size() == 3);
  CHECK(e[0].max_compression.value == 900.0);
  CHECK(*e[0].max_compression.combination == 1);
  CHECK(e[0].max_tension.value == 0.0);
  CHECK(e[0].max_lateral.value == 50.0);
  CHECK(*e[0].max_lateral.combination == 2);
  CHECK(e[1].max_tension.value == 200.0);
  CHECK(*e[1].max_tension.combination == 2);
  CHECK(e[1].max_utilization.value == Approx(0.8).epsilon(kTight));  // 80/100 in S2
  CHECK(*e[1].max_utilization.combination == 1);
  CHECK(e[2].max_compression.value == 700.0);
  CHECK(*e[2].max_compression.combination == 2);
  CHECK(e[2].max_tension.value == 100.0);
  CHECK(*e[2].max_tension.combination == 1);
  // Summary: the largest utilization is 900/1000 = 0.9 at P1 in S2.
  CHECK(results.summary.pass);
  CHECK(results.summary.max_utilization == Approx(0.9).epsilon(kTight));
  CHECK(*results.summary.pile == 0);
  CHECK(*results.summary.combination == 1);
  CHECK(results.summary.check == Demand::compression);
  CHECK(results.summary.failed_combinations == 0);
}

TEST_CASE("checks: an overturned combination fails even with small pile forces", "[checks]") {
  Project p = project_with(2, {{"S1", LimitState::service}, {"S2", LimitState::service}});
  const std::vector<PileTypeResistance> r = {allowable_only(1000.0, 300.0, 60.0)};
  CapSolution overturned;
  overturned.overturns = true;
  overturned.failure = "the cap overturns";
  overturned.piles.assign(2, PileForce{0.0, 0.0, false});
  const auto results = check_piles(p, {solution({{100.0, 0.0}, {100.0, 0.0}}), overturned}, r);
  CHECK(results.combinations[0].pass);
  CHECK_FALSE(results.combinations[1].pass);
  CHECK_FALSE(results.summary.pass);
  CHECK(results.summary.failed_combinations == 1);
  REQUIRE(results.summary.overturned.size() == 1);
  CHECK(results.summary.overturned[0] == 1);
}

TEST_CASE("checks: assumptions state the structural capacity and the bases", "[checks]") {
  Project p = project_with(1, {{"S1", LimitState::service}});
  p.pile_types[0].capacities.push_back(allowable_set(1000.0, 300.0, 50.0));
  const auto list = assumptions(p, resolve_resistances(p, {}), {{"given", "given"}});
  auto has = [&](const std::string& text) {
    for (const auto& a : list)
      if (a == text) return true;
    return false;
  };
  CHECK(has("Pile type P: axial stiffness given."));
  CHECK(has("Pile type P: allowable capacities: allowable values given."));
  CHECK(has("Service combinations are checked against allowable capacities, strength "
            "combinations against factored resistances."));
}
