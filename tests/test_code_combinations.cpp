// Tests for the code combinations that can govern piles (combinations.hpp) and the design
// resistances of their resistance sets (code_resistance.hpp): the ASCE 7 vertical seismic
// effect and resisting earth pressure, EN 1997-1 design approaches 1 and 2 with the partial
// resistance, correlation and model factors, and AASHTO LRFD's load combinations and
// extreme-event resistance factors. Each expected factor is typed from its standard as
// recalled (from memory); the standard, year and table or clause stand beside each check.
#include <catch2/catch.hpp>

#include <map>
#include <set>
#include <stdexcept>
#include <string>
#include <vector>

#include "cairn/checks/checks.hpp"
#include "cairn/geotechnics/code_resistance.hpp"
#include "cairn/input/combinations.hpp"
#include "cairn/input/input.hpp"

using cairn::CaseToCombine;
using cairn::CombinationSettings;
using cairn::En1997PileKind;
using cairn::GeneratedCombination;
using cairn::GeneratedCombinations;
using cairn::LimitState;
using cairn::LoadKind;
using cairn::ResistanceSet;

namespace {

using Factors = std::map<std::string, double>;

// Factors are exact decimals (products rounded to 1e-9 in the generator).
constexpr double kExact = 1e-9;
// Resistances are quotients of exact inputs: compare to a relative 1e-12.
constexpr double kQuotient = 1e-12;

const GeneratedCombination& find(const GeneratedCombinations& g, const std::string& id) {
  for (const auto& c : g.combinations)
    if (c.id == id) return c;
  FAIL("no combination " << id);
  return g.combinations.front();
}

Factors factors_of(const GeneratedCombination& c) {
  Factors f;
  for (const auto& [id, factor] : c.factors) f[id] += factor;
  return f;
}

void check_factors(const GeneratedCombinations& g, const std::string& id, const Factors& expected) {
  INFO("combination " << id);
  const Factors actual = factors_of(find(g, id));
  CHECK(actual.size() == expected.size());
  for (const auto& [case_id, factor] : expected) {
    INFO("load case " << case_id);
    REQUIRE(actual.count(case_id) == 1);
    CHECK(actual.at(case_id) == Approx(factor).margin(kExact));
  }
}

bool has(const GeneratedCombinations& g, const std::string& id) {
  for (const auto& c : g.combinations)
    if (c.id == id) return true;
  return false;
}

CombinationSettings with_sds(double sds) {
  CombinationSettings s;
  s.sds = sds;
  return s;
}

}  // namespace

// ---- ASCE 7 ---------------------------------------------------------------------------

TEST_CASE("code combinations: ASCE 7 vertical seismic effect adds and relieves",
          "[code_combinations][published]") {
  const std::vector<CaseToCombine> cases = {{"D", LoadKind::dead, ""},
                                            {"F", LoadKind::fluid, ""},
                                            {"L", LoadKind::live, ""},
                                            {"S", LoadKind::snow, ""},
                                            {"E", LoadKind::seismic, ""}};
  const auto lrfd = cairn::generate_combinations("asce7-lrfd", cases, with_sds(1.0));
  // Source: ASCE/SEI 7-16 §2.3.6 combination 6, 1.2D + Ev + Eh + L + 0.2S, with Ev = 0.2·SDS·D
  // (§12.4.2.2), from memory: SDS = 1.0 → 1.4D; F keeps D's basic factor 1.2 (§2.3.1).
  check_factors(lrfd, "LRFD-6(E)", {{"D", 1.4}, {"F", 1.2}, {"E", 1.0}, {"L", 1.0}, {"S", 0.2}});
  // Source: ASCE/SEI 7-16 §2.3.6 combination 7, 0.9D − Ev + Eh (from memory): 0.7D.
  check_factors(lrfd, "LRFD-7(E)", {{"D", 0.7}, {"F", 0.9}, {"E", 1.0}});
  CHECK(find(lrfd, "LRFD-7(E)").description == "0.9D + 0.9F − 0.2D(Ev) + 1.0E(E)");

  const auto asd = cairn::generate_combinations("asce7-asd", cases, with_sds(1.0));
  // Source: ASCE/SEI 7-16 §2.4.5 (from memory): 8. D + 0.7Ev + 0.7Eh → 1.14D;
  // 9. D + 0.525Ev + 0.525Eh + 0.75L + 0.75S → 1.105D; 10. 0.6D − 0.7Ev + 0.7Eh → 0.46D.
  check_factors(asd, "ASD-8(E)", {{"D", 1.14}, {"F", 1.0}, {"E", 0.7}});
  check_factors(asd, "ASD-9(E)",
                {{"D", 1.105}, {"F", 1.0}, {"E", 0.525}, {"L", 0.75}, {"S", 0.75}});
  check_factors(asd, "ASD-10(E)", {{"D", 0.46}, {"F", 0.6}, {"E", 0.7}});
  // Ev touches only the seismic combinations.
  check_factors(asd, "ASD-2", {{"D", 1.0}, {"F", 1.0}, {"L", 1.0}});

  // SDS = 0: Ev is left out and the note says so.
  const auto none = cairn::generate_combinations("asce7-lrfd", cases, with_sds(0.0));
  check_factors(none, "LRFD-7(E)", {{"D", 0.9}, {"F", 0.9}, {"E", 1.0}});

  // Seismic cases without SDS are refused, naming the case and the clause.
  try {
    cairn::generate_combinations("asce7-lrfd", cases);
    FAIL("expected an exception");
  } catch (const std::invalid_argument& e) {
    const std::string message = e.what();
    CHECK(message.find("load case 'E' is seismic") == 0);
    CHECK(message.find("§12.4.2.2") != std::string::npos);
  }
  // Without seismic cases SDS is not needed.
  CHECK_NOTHROW(cairn::generate_combinations("asce7-asd", {{"D", LoadKind::dead, ""}}));
}

TEST_CASE("code combinations: ASCE 7 earth pressure where it adds and where it resists",
          "[code_combinations][published]") {
  const std::vector<CaseToCombine> cases = {
      {"D", LoadKind::dead, ""}, {"H", LoadKind::earth, ""}, {"W", LoadKind::wind, ""}};
  // Source: ASCE/SEI 7-16 §2.3.1 (from memory): H at 1.6 where it adds to the primary variable
  // load, 0.9 where it resists and is permanent, 0 otherwise.
  const auto lrfd = cairn::generate_combinations("asce7-lrfd", cases);
  check_factors(lrfd, "LRFD-5(W)", {{"D", 0.9}, {"H", 1.6}, {"W", 1.0}});
  check_factors(lrfd, "LRFD-5(W)-Hr", {{"D", 0.9}, {"H", 0.9}, {"W", 1.0}});
  check_factors(lrfd, "LRFD-1-Hr", {{"D", 1.4}, {"H", 0.9}});
  // Source: ASCE/SEI 7-16 §2.4.1 (from memory): H at 1.0 where it adds, 0.6 where it resists.
  const auto asd = cairn::generate_combinations("asce7-asd", cases);
  check_factors(asd, "ASD-7(W)", {{"D", 0.6}, {"H", 1.0}, {"W", 0.6}});
  check_factors(asd, "ASD-7(W)-Hr", {{"D", 0.6}, {"H", 0.6}, {"W", 0.6}});
  // H not permanent: where it resists it is left out (factor 0).
  CombinationSettings variable;
  variable.earth_permanent = false;
  const auto lrfd0 = cairn::generate_combinations("asce7-lrfd", cases, variable);
  check_factors(lrfd0, "LRFD-5(W)-Hr", {{"D", 0.9}, {"W", 1.0}});
  // Without earth cases there is no second pass.
  const auto plain = cairn::generate_combinations("asce7-lrfd", {{"D", LoadKind::dead, ""}});
  CHECK(plain.combinations.size() == 1);
}

// ---- EN 1997-1 ------------------------------------------------------------------------

TEST_CASE("code combinations: EN 1997 design approach 1, combinations 1 and 2",
          "[code_combinations][published]") {
  const std::vector<CaseToCombine> cases = {
      {"G", LoadKind::dead, ""}, {"Q", LoadKind::live, ""}, {"W", LoadKind::wind, ""}};
  const auto g = cairn::generate_combinations("en1997-da1", cases);
  // Source: EN 1997-1:2004 Table A.3, set A1 (from memory): γG 1.35 unfavourable / 1.0
  // favourable, γQ 1.5; EN 1990:2002 Table A1.1: ψ0 = 0.7 imposed, 0.6 wind.
  check_factors(g, "DA1-C1-G", {{"G", 1.35}});
  check_factors(g, "DA1-C1-L+W(W)", {{"G", 1.35}, {"Q", 1.5}, {"W", 0.9}});
  check_factors(g, "DA1-C1-W(W)", {{"G", 1.35}, {"W", 1.5}, {"Q", 1.05}});
  // Favourable variable actions left out: permanent at γG,inf and the leading action alone.
  check_factors(g, "DA1-C1-W(W)-inf", {{"G", 1.0}, {"W", 1.5}});
  // Source: EN 1997-1:2004 Table A.4, set A2 (from memory): γG 1.0, γQ 1.3; 1.3 × 0.7 = 0.91,
  // 1.3 × 0.6 = 0.78.
  check_factors(g, "DA1-C2-G", {{"G", 1.0}});
  check_factors(g, "DA1-C2-L+W(W)", {{"G", 1.0}, {"Q", 1.3}, {"W", 0.78}});
  check_factors(g, "DA1-C2-W(W)", {{"G", 1.0}, {"W", 1.3}, {"Q", 0.91}});
  check_factors(g, "DA1-C2-W(W)-inf", {{"G", 1.0}, {"W", 1.3}});
  // EN 1997-1 §2.4.7.3.4.2: combination 1 with R1, combination 2 with R4; no service set.
  for (const auto& c : g.combinations) {
    INFO(c.id);
    CHECK(c.limit_state == LimitState::strength);
    CHECK(c.resistance_set == (c.id.rfind("DA1-C1", 0) == 0 ? ResistanceSet::en1997_r1
                                                             : ResistanceSet::en1997_r4));
  }
  CHECK(g.combinations.size() == 2 * 5);  // G, L+W, W, L-inf, W-inf in each

  // Set A2 has γG,inf = γG,sup: with nothing accompanying, '-inf' would repeat the combination.
  const auto alone = cairn::generate_combinations(
      "en1997-da1", {{"G", LoadKind::dead, ""}, {"Q", LoadKind::live, ""}});
  CHECK(has(alone, "DA1-C1-L-inf"));
  CHECK_FALSE(has(alone, "DA1-C2-L-inf"));
  CHECK(alone.combinations.size() == 5);

  const auto da2 = cairn::generate_combinations("en1997-da2", cases);
  // EN 1997-1 §2.4.7.3.4.3: A1 + M1 + R2.
  check_factors(da2, "DA2-L+W(W)", {{"G", 1.35}, {"Q", 1.5}, {"W", 0.9}});
  for (const auto& c : da2.combinations) CHECK(c.resistance_set == ResistanceSet::en1997_r2);

  // Design approach 3 (§2.4.7.3.4.4): A1 on structural actions, A2 on geotechnical ones (earth
  // pressure at γG = 1.0, Table A.4), checked with R3.
  const auto da3 = cairn::generate_combinations(
      "en1997-da3", {{"G", LoadKind::dead, ""}, {"H", LoadKind::earth, ""}, {"Q", LoadKind::live, ""}});
  check_factors(da3, "DA3-L", {{"G", 1.35}, {"H", 1.0}, {"Q", 1.5}});
  check_factors(da3, "DA3-L-inf", {{"G", 1.0}, {"H", 1.0}, {"Q", 1.5}});
  for (const auto& c : da3.combinations) CHECK(c.resistance_set == ResistanceSet::en1997_r3);
  // Seismic is not an EN 1990 eq. 6.10 action.
  CHECK_THROWS_AS(cairn::generate_combinations("en1997-da1", {{"E", LoadKind::seismic, ""}}),
                  std::invalid_argument);
}

TEST_CASE("code combinations: EN 1997 partial resistance factors for piles",
          "[code_combinations][published]") {
  struct Expected {
    En1997PileKind kind;
    ResistanceSet set;
    double base, shaft, total, tension;
  };
  using K = En1997PileKind;
  using R = ResistanceSet;
  // Source: EN 1997-1:2004 Annex A, recommended values (from memory): Table A.6 driven piles,
  // Table A.7 bored piles, Table A.8 CFA piles; columns γb, γs, γt, γs;t.
  const std::vector<Expected> table = {
      {K::driven, R::en1997_r1, 1.00, 1.00, 1.00, 1.25},
      {K::driven, R::en1997_r2, 1.10, 1.10, 1.10, 1.15},
      {K::driven, R::en1997_r3, 1.00, 1.00, 1.00, 1.10},
      {K::driven, R::en1997_r4, 1.30, 1.30, 1.30, 1.60},
      {K::bored, R::en1997_r1, 1.25, 1.00, 1.15, 1.25},
      {K::bored, R::en1997_r2, 1.10, 1.10, 1.10, 1.15},
      {K::bored, R::en1997_r3, 1.00, 1.00, 1.00, 1.10},
      {K::bored, R::en1997_r4, 1.60, 1.30, 1.50, 1.60},
      {K::cfa, R::en1997_r1, 1.10, 1.00, 1.10, 1.25},
      {K::cfa, R::en1997_r2, 1.10, 1.10, 1.10, 1.15},
      {K::cfa, R::en1997_r3, 1.00, 1.00, 1.00, 1.10},
      {K::cfa, R::en1997_r4, 1.45, 1.30, 1.40, 1.60},
  };
  for (const auto& row : table) {
    INFO(cairn::to_string(row.kind) << " " << cairn::to_string(row.set));
    const auto f = cairn::en1997_pile_factors(row.kind, row.set);
    CHECK(f.base == row.base);
    CHECK(f.shaft == row.shaft);
    CHECK(f.total == row.total);
    CHECK(f.shaft_tension == row.tension);
  }
  CHECK_THROWS_AS(cairn::en1997_pile_factors(K::driven, R::basis), std::logic_error);
}

TEST_CASE("code combinations: EN 1997 correlation factors by the number of test profiles",
          "[code_combinations][published]") {
  // Source: EN 1997-1:2004 Table A.10 (from memory), n = 1, 2, 3, 4, 5, 7, 10.
  const std::vector<int> n = {1, 2, 3, 4, 5, 7, 10};
  const std::vector<double> xi3 = {1.40, 1.35, 1.33, 1.31, 1.29, 1.27, 1.25};
  const std::vector<double> xi4 = {1.40, 1.27, 1.23, 1.20, 1.15, 1.12, 1.08};
  for (std::size_t i = 0; i < n.size(); ++i) {
    INFO("n = " << n[i]);
    CHECK(cairn::en1997_xi3(n[i]) == xi3[i]);
    CHECK(cairn::en1997_xi4(n[i]) == xi4[i]);
  }
  // Between tabulated n, the smaller n's value (conservative; common practice).
  CHECK(cairn::en1997_xi3(6) == 1.29);
  CHECK(cairn::en1997_xi4(9) == 1.12);
  CHECK(cairn::en1997_xi3(25) == 1.25);

  cairn::En1997Settings en;
  CHECK(cairn::en1997_correlation_factor(en) == 1.0);  // no profiles: no ξ
  CHECK(cairn::en1997_model_factor(en) == 1.4);        // UK NA to BS EN 1997-1, from memory
  en.test_profiles = 3;
  // One computed profile is both mean and minimum: max(ξ3, ξ4) = ξ3 = 1.33.
  CHECK(cairn::en1997_correlation_factor(en) == Approx(1.33).epsilon(kQuotient));
  CHECK(cairn::en1997_model_factor(en) == 1.0);
  // EN 1997-1 §7.6.2.3(7): ξ ÷ 1.1 where the structure redistributes load (rigid cap).
  en.rigid_cap = true;
  CHECK(cairn::en1997_correlation_factor(en) == Approx(1.33 / 1.1).epsilon(kQuotient));
  en.model_factor = 1.2;
  CHECK(cairn::en1997_model_factor(en) == 1.2);
}

namespace {

cairn::Project one_pile_type(cairn::Installation installation) {
  cairn::Project p;
  cairn::PileType type;
  type.id = "P";
  type.design.installation = installation;
  p.pile_types.push_back(type);
  cairn::Pile pile;
  pile.id = "1";
  p.piles.push_back(pile);
  return p;
}

}  // namespace

TEST_CASE("code combinations: EN 1997 set M2 factors the soil's strength for design approach 3",
          "[code_combinations][published]") {
  cairn::SoilProfile profile;
  cairn::SoilLayer sand;
  sand.kind = cairn::SoilKind::sand;
  sand.friction_angle = 35.0;
  sand.shaft_delta = 26.0;
  sand.spt_n60 = 30.0;
  cairn::SoilLayer clay;
  clay.kind = cairn::SoilKind::clay;
  clay.undrained_strength = 100.0;
  profile.layers = {sand, clay};
  const auto m2 = cairn::en1997_m2_profile(profile);
  // Source: EN 1997-1:2004 Table A.4, set M2 (from memory): γφ' = 1.25 on tan φ', γcu = 1.4.
  // atan(tan 35° / 1.25) = 29.256°; atan(tan 26° / 1.25) = 21.315°; 100/1.4 = 71.43 kPa (hand).
  CHECK(*m2.layers[0].friction_angle == Approx(29.2561).epsilon(1e-5));
  CHECK(*m2.layers[0].shaft_delta == Approx(21.3150).epsilon(1e-5));
  CHECK(*m2.layers[0].spt_n60 == 30.0);  // not a strength parameter of M2
  CHECK(*m2.layers[1].undrained_strength == Approx(100.0 / 1.4).epsilon(kQuotient));
  // SPT-based methods have no φ' or cu to factor.
  cairn::PileDesign design;
  design.tip_sand = cairn::TipMethod::vesic;
  design.shaft_sand = cairn::ShaftMethod::beta;
  CHECK(cairn::en1997_m2_applies(design));
  design.shaft_sand = cairn::ShaftMethod::beta_fhwa;
  CHECK_FALSE(cairn::en1997_m2_applies(design));

  // R3 takes the M2 components; a typed-in resistance is not used (it holds no M2).
  auto project = one_pile_type(cairn::Installation::driven);
  cairn::ComputedResistance computed;
  computed.m2_tip = 800.0;
  computed.m2_shaft = 1200.0;
  computed.m2_uplift = 990.0;
  const auto r = cairn::code_set_resistance(project, 0, ResistanceSet::en1997_r3, computed,
                                            cairn::Resistance{});
  // Table A.6 R3 (from memory): γb = γs = 1.0, γs;t = 1.1; γRd 1.4 (no test profiles).
  CHECK(*r.compression == Approx(2000.0 / 1.4).epsilon(kQuotient));
  CHECK(*r.tension == Approx(990.0 / (1.1 * 1.4)).epsilon(kQuotient));
  cairn::CapacitySet typed;
  typed.basis = cairn::CapacityBasis::ultimate;
  typed.compression = 3000.0;
  project.pile_types[0].capacities.push_back(typed);
  CHECK_FALSE(cairn::code_set_resistance(project, 0, ResistanceSet::en1997_r3, std::nullopt,
                                         cairn::Resistance{})
                  .compression);
}

TEST_CASE("code combinations: EN 1997 design resistances from the soil and typed in",
          "[code_combinations][published]") {
  cairn::ComputedResistance computed;
  computed.ultimate_tip = 1000.0;
  computed.ultimate_shaft = 2000.0;
  computed.ultimate_uplift = 1500.0;
  const cairn::Resistance factored;

  SECTION("driven, R1, from the soil parameters: model factor 1.4") {
    const auto project = one_pile_type(cairn::Installation::driven);
    const auto r = cairn::code_set_resistance(project, 0, ResistanceSet::en1997_r1, computed,
                                              factored);
    // EN 1997-1 eq. 7.6/7.7 with Table A.6 R1 (γb = γs = 1.0, γs;t = 1.25), γRd 1.4:
    // (1000 + 2000)/1.4 = 2142.857 kN; 1500/(1.25 × 1.4) = 857.143 kN (hand calculation).
    CHECK(*r.compression == Approx(3000.0 / 1.4).epsilon(kQuotient));
    CHECK(*r.tension == Approx(1500.0 / (1.25 * 1.4)).epsilon(kQuotient));
  }
  SECTION("bored, R4, three test profiles and a rigid cap") {
    auto project = one_pile_type(cairn::Installation::bored);
    project.en1997.test_profiles = 3;
    project.en1997.rigid_cap = true;
    const auto r = cairn::code_set_resistance(project, 0, ResistanceSet::en1997_r4, computed,
                                              factored);
    // Table A.7 R4: γb 1.6, γs 1.3, γs;t 1.6; ξ = 1.33/1.1 (Table A.10, §7.6.2.3(7)); γRd 1.0.
    const double xi = 1.33 / 1.1;
    CHECK(*r.compression == Approx((1000.0 / 1.6 + 2000.0 / 1.3) / xi).epsilon(kQuotient));
    CHECK(*r.tension == Approx(1500.0 / (1.6 * xi)).epsilon(kQuotient));
  }
  SECTION("CFA (given for all types), R2, typed in as characteristic") {
    auto project = one_pile_type(cairn::Installation::bored);
    project.en1997.pile_kind = En1997PileKind::cfa;
    cairn::CapacitySet typed;
    typed.basis = cairn::CapacityBasis::ultimate;
    typed.compression = 3000.0;
    typed.tension = 1000.0;
    typed.lateral = 200.0;
    project.pile_types[0].capacities.push_back(typed);
    for (const auto& [set, total, tension] :
         {std::tuple{ResistanceSet::en1997_r2, 1.10, 1.15},
          std::tuple{ResistanceSet::en1997_r4, 1.40, 1.60}}) {
      // Table A.8 (from memory): R2 γt 1.1, γs;t 1.15; R4 γt 1.4, γs;t 1.6.
      const auto r = cairn::code_set_resistance(project, 0, set, std::nullopt, factored);
      CHECK(*r.compression == Approx(3000.0 / total).epsilon(kQuotient));
      CHECK(*r.tension == Approx(1000.0 / tension).epsilon(kQuotient));
      CHECK(*r.lateral == Approx(200.0 / total).epsilon(kQuotient));
      CHECK(r.source.find("Table A.8") != std::string::npos);
    }
  }
}

// ---- AASHTO LRFD ----------------------------------------------------------------------

TEST_CASE("code combinations: AASHTO LRFD strength, service and extreme-event combinations",
          "[code_combinations][published]") {
  const std::vector<CaseToCombine> cases = {
      {"DC", LoadKind::dead, ""},           {"DW", LoadKind::wearing_surface, ""},
      {"EH", LoadKind::earth, ""},          {"EV", LoadKind::vertical_earth, ""},
      {"LL", LoadKind::live, ""},           {"WA", LoadKind::fluid, ""},
      {"TU", LoadKind::temperature, ""},    {"WS", LoadKind::wind, ""},
      {"EQ", LoadKind::seismic, ""},        {"CV", LoadKind::collision, ""}};
  const auto g = cairn::generate_combinations("aashto-lrfd", cases);
  // Source: AASHTO LRFD Bridge Design Specifications, 7th ed. (2014), Table 3.4.1-2 (from
  // memory): γp max/min DC 1.25/0.90, DW 1.50/0.65, EH active 1.50/0.90, EV retaining walls
  // and abutments 1.35/1.00.
  const Factors max = {{"DC", 1.25}, {"DW", 1.50}, {"EH", 1.50}, {"EV", 1.35}};
  const Factors min = {{"DC", 0.90}, {"DW", 0.65}, {"EH", 0.90}, {"EV", 1.00}};
  auto plus = [](Factors f, const Factors& more) {
    for (const auto& [k, v] : more) f[k] = v;
    return f;
  };
  // Source: AASHTO LRFD 7th ed. (2014) Table 3.4.1-1 (from memory):
  // Strength I: LL 1.75, WA 1.0, TU 0.50 (the smaller value, force effects).
  check_factors(g, "STR-I-max", plus(max, {{"LL", 1.75}, {"WA", 1.0}, {"TU", 0.5}}));
  check_factors(g, "STR-I-min", plus(min, {{"LL", 1.75}, {"WA", 1.0}, {"TU", 0.5}}));
  // Strength III: WS 1.4, no LL.
  check_factors(g, "STR-III-max(WS)", plus(max, {{"WA", 1.0}, {"TU", 0.5}, {"WS", 1.4}}));
  check_factors(g, "STR-III-min(WS)", plus(min, {{"WA", 1.0}, {"TU", 0.5}, {"WS", 1.4}}));
  // Strength V: LL 1.35, WS 0.4.
  check_factors(g, "STR-V-max(WS)",
                plus(max, {{"LL", 1.35}, {"WA", 1.0}, {"TU", 0.5}, {"WS", 0.4}}));
  // Service I: permanent 1.0, LL 1.0, WA 1.0, WS 0.3, TU 1.0.
  check_factors(g, "SER-I(WS)", {{"DC", 1.0}, {"DW", 1.0}, {"EH", 1.0}, {"EV", 1.0},
                                 {"LL", 1.0}, {"WA", 1.0}, {"WS", 0.3}, {"TU", 1.0}});
  // Extreme Event I: γp, LL γEQ (0.5 here, C3.4.1), WA 1.0, EQ 1.0.
  check_factors(g, "EXT-I-min(EQ)", plus(min, {{"LL", 0.5}, {"WA", 1.0}, {"EQ", 1.0}}));
  // Extreme Event II: γp, LL 0.5, WA 1.0, CT/CV 1.0.
  check_factors(g, "EXT-II-max(CV)", plus(max, {{"LL", 0.5}, {"WA", 1.0}, {"CV", 1.0}}));
  CHECK(g.combinations.size() == 2 + 2 + 2 + 1 + 2 + 2);

  for (const auto& c : g.combinations) {
    INFO(c.id);
    const bool extreme = c.id.rfind("EXT", 0) == 0;
    CHECK(c.limit_state == (c.id.rfind("SER", 0) == 0 ? LimitState::service : LimitState::strength));
    CHECK(c.resistance_set == (extreme ? ResistanceSet::aashto_extreme : ResistanceSet::basis));
  }
  // γEQ is the project's choice.
  CombinationSettings settings;
  settings.gamma_eq = 0.0;
  const auto no_live = cairn::generate_combinations("aashto-lrfd", cases, settings);
  CHECK(factors_of(find(no_live, "EXT-I-max(EQ)")).count("LL") == 0);
  // Without wind, Strength III and V are not generated; Service I still is.
  const auto calm = cairn::generate_combinations(
      "aashto-lrfd", {{"DC", LoadKind::dead, ""}, {"LL", LoadKind::live, ""}});
  CHECK_FALSE(has(calm, "STR-III-max"));
  CHECK(has(calm, "SER-I"));
  // Building loads have no AASHTO column.
  CHECK_THROWS_WITH(cairn::generate_combinations("aashto-lrfd", {{"S", LoadKind::snow, ""}}),
                    Catch::Contains("kind 'snow'"));
}

TEST_CASE("code combinations: AASHTO extreme-event resistance factors",
          "[code_combinations][published]") {
  auto project = one_pile_type(cairn::Installation::driven);
  cairn::CapacitySet typed;
  typed.basis = cairn::CapacityBasis::ultimate;
  typed.compression = 1000.0;
  typed.tension = 500.0;
  project.pile_types[0].capacities.push_back(typed);
  const auto r = cairn::code_set_resistance(project, 0, ResistanceSet::aashto_extreme,
                                            std::nullopt, cairn::Resistance{});
  // Source: AASHTO LRFD 7th ed. (2014) §10.5.5.3.3 (from memory): φ = 1.0, uplift 0.80.
  CHECK(*r.compression == Approx(1000.0).epsilon(kQuotient));
  CHECK(*r.tension == Approx(400.0).epsilon(kQuotient));
  // From the soil: tip + shaft at 1.0, shaft uplift at 0.80.
  cairn::ComputedResistance computed;
  computed.ultimate_tip = 300.0;
  computed.ultimate_shaft = 700.0;
  computed.ultimate_uplift = 600.0;
  const auto soil = cairn::code_set_resistance(one_pile_type(cairn::Installation::driven), 0,
                                               ResistanceSet::aashto_extreme, computed,
                                               cairn::Resistance{});
  CHECK(*soil.compression == Approx(1000.0).epsilon(kQuotient));
  CHECK(*soil.tension == Approx(480.0).epsilon(kQuotient));
}

TEST_CASE("code combinations: checks use the combination's resistance set",
          "[code_combinations]") {
  auto project = one_pile_type(cairn::Installation::driven);
  cairn::CapacitySet typed;
  typed.basis = cairn::CapacityBasis::ultimate;
  typed.compression = 1300.0;
  typed.tension = 800.0;
  typed.resistance_factor = 0.5;
  typed.resistance_factor_tension = 0.5;
  project.pile_types[0].capacities.push_back(typed);
  cairn::Combination r4;
  r4.id = "DA1-C2-G";
  r4.limit_state = LimitState::strength;
  r4.resistance_set = ResistanceSet::en1997_r4;
  cairn::Combination basis;
  basis.id = "U";
  basis.limit_state = LimitState::strength;
  project.combinations = {r4, basis};
  const auto resistances = cairn::resolve_resistances(project, {});
  REQUIRE(resistances[0].by_set.count(ResistanceSet::en1997_r4) == 1);
  // Driven R4 γt 1.3 (Table A.6, from memory): 1300/1.3 = 1000 kN; the basis stays φ·R.
  CHECK(*resistances[0].by_set.at(ResistanceSet::en1997_r4).compression ==
        Approx(1000.0).epsilon(kQuotient));
  CHECK(*resistances[0].factored.compression == Approx(650.0).epsilon(kQuotient));
  CHECK(cairn::missing_resistances(project, resistances).empty());
  const auto notes = cairn::code_resistance_assumptions(project, resistances);
  bool characteristic = false;
  for (const auto& n : notes) characteristic = characteristic || n.find("characteristic") != std::string::npos;
  CHECK(characteristic);

  // A pile type with nothing to derive the set from is reported before any check.
  project.pile_types[0].capacities.clear();
  const auto none = cairn::resolve_resistances(project, {});
  const auto problems = cairn::missing_resistances(project, none);
  REQUIRE(problems.size() == 2);
  CHECK(problems[0].message.find("combinations.DA1-C2-G: a combination checked with EN 1997 R4 "
                                 "resistances") == 0);
}

TEST_CASE("code combinations: generator keys are read from the file and checked",
          "[code_combinations]") {
  const std::string data = CAIRN_TEST_DATA;
  try {
    cairn::read_project(data + "/bad_generate_keys.yaml");
    FAIL("expected an InputError");
  } catch (const cairn::InputError& e) {
    const std::string text = e.what();
    const std::string file = data + "/bad_generate_keys.yaml";
    CHECK_THAT(text, Catch::Contains(file + ":18:46: error: combinations.generate.pile_kind: "
                                            "expected one of bored, cfa, driven, got 'screw'"));
    CHECK_THAT(text, Catch::Contains(file + ":18:68: error: combinations.generate.test_profiles: "
                                            "expected a whole number of profiles of ground tests "
                                            "(1 or more), got '0'"));
    CHECK_THAT(text, Catch::Contains(file + ":18:85: error: combinations.generate.model_factor: "
                                            "expected a factor of 1.0 or more, got '0.9'"));
    CHECK_THAT(text, Catch::Contains(file + ":18:100: error: combinations.generate.gamma_eq: "
                                            "applies to the aashto-* generators only, and codes "
                                            "lists none of them"));
    CHECK_THAT(text, Catch::Contains("combinations.generate.sds: applies to the asce7-*"));
  }
  // The map form carries its settings into the project and the combinations.
  const auto project = cairn::read_project(data + "/e2e/en1997.yaml");
  CHECK(project.en1997.pile_kind == En1997PileKind::cfa);
  CHECK(project.en1997.test_profiles == 3);
  CHECK(project.en1997.rigid_cap);
  CHECK_FALSE(project.en1997.model_factor);
  std::set<ResistanceSet> sets;
  for (const auto& c : project.combinations) sets.insert(c.resistance_set);
  CHECK(sets == std::set<ResistanceSet>{ResistanceSet::en1997_r1, ResistanceSet::en1997_r4});
}
