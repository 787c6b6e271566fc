// Tests for combinations.hpp: the generated sets reproduce the published combination tables
// of ASCE/SEI 7-16 and EN 1990:2002 for a set of load cases, and directional cases never act
// together. The expected factors are typed from the standards as recalled (from memory);
// the clause is cited beside each row.
#include <catch2/catch.hpp>

#include <map>
#include <set>
#include <stdexcept>
#include <string>
#include <vector>

#include "cairn/input/combinations.hpp"

using cairn::CaseToCombine;
using cairn::GeneratedCombinations;
using cairn::LimitState;
using cairn::LoadKind;

namespace {

// SDS = 0 given: seismic cases are accepted and no vertical seismic effect is added.
const cairn::CombinationSettings kNoEv{0.0};

// Case ids → factor; the published row written out per load case.
using Factors = std::map<std::string, double>;

struct Row {
  std::string id;
  Factors factors;
};

// Two dead cases (they act together), live, roof live, snow, wind in two directions (each
// taken alone) and one seismic direction.
std::vector<CaseToCombine> building_cases(bool with_seismic) {
  std::vector<CaseToCombine> cases = {
      {"D1", LoadKind::dead, ""},      {"D2", LoadKind::dead, ""},
      {"L", LoadKind::live, ""},       {"Lr", LoadKind::roof_live, ""},
      {"S", LoadKind::snow, ""},       {"Wx+", LoadKind::wind, ""},
      {"Wx-", LoadKind::wind, ""},
  };
  if (with_seismic) cases.push_back({"E", LoadKind::seismic, "Ex"});
  return cases;
}

// Dead factor d on both dead cases, plus the other terms.
Factors dead(double d, Factors more) {
  more["D1"] = d;
  more["D2"] = d;
  return more;
}

// The generated set equals the expected rows: same ids, same factor on every case.
void check_table(const GeneratedCombinations& generated, const std::vector<Row>& expected) {
  std::map<std::string, Factors> got;
  for (const auto& c : generated.combinations) {
    Factors f;
    for (const auto& [id, factor] : c.factors) f[id] += factor;
    got[c.id] = f;
  }
  CHECK(got.size() == expected.size());
  for (const auto& row : expected) {
    INFO("combination " << row.id);
    REQUIRE(got.count(row.id) == 1);
    const Factors& actual = got[row.id];
    CHECK(actual.size() == row.factors.size());
    for (const auto& [id, factor] : row.factors) {
      INFO("load case " << id);
      REQUIRE(actual.count(id) == 1);
      CHECK(actual.at(id) == Approx(factor).margin(1e-12));  // factors are exact decimals
    }
  }
}

LimitState state_of(const GeneratedCombinations& g, const std::string& id) {
  for (const auto& c : g.combinations) {
    if (c.id == id) return c.limit_state;
  }
  FAIL("no combination " << id);
  return LimitState::service;
}

// No combination holds two wind directions, two seismic directions, or wind with seismic.
void check_directions_apart(const GeneratedCombinations& g,
                            const std::vector<std::set<std::string>>& directions) {
  for (const auto& c : g.combinations) {
    INFO(c.id);
    int present = 0;
    for (const auto& direction : directions) {
      bool any = false;
      for (const auto& [id, factor] : c.factors) any = any || direction.count(id) > 0;
      present += any ? 1 : 0;
    }
    CHECK(present <= 1);
  }
}

}  // namespace

TEST_CASE("combinations: ASCE 7-16 allowable stress design table", "[combinations][published]") {
  // SDS = 0: no vertical seismic effect, the table as printed (Ev: test_code_combinations.cpp).
  const auto g = cairn::generate_combinations("asce7-asd", building_cases(true), kNoEv);
  // Source: ASCE/SEI 7-16, Minimum Design Loads, §2.4.1 (1–7) and §2.4.5 (8–10), from memory.
  const std::vector<Row> expected = {
      {"ASD-1", dead(1.0, {})},                                               // §2.4.1 (1) D
      {"ASD-2", dead(1.0, {{"L", 1.0}})},                                     // (2) D + L
      {"ASD-3(Lr)", dead(1.0, {{"Lr", 1.0}})},                                // (3) D + (Lr or S or R)
      {"ASD-3(S)", dead(1.0, {{"S", 1.0}})},                                  // (3)
      {"ASD-4(Lr)", dead(1.0, {{"L", 0.75}, {"Lr", 0.75}})},                  // (4) D + 0.75L + 0.75(Lr or S or R)
      {"ASD-4(S)", dead(1.0, {{"L", 0.75}, {"S", 0.75}})},                    // (4)
      {"ASD-5(Wx+)", dead(1.0, {{"Wx+", 0.6}})},                              // (5) D + 0.6W
      {"ASD-5(Wx-)", dead(1.0, {{"Wx-", 0.6}})},                              // (5)
      {"ASD-6(Wx+,Lr)", dead(1.0, {{"L", 0.75}, {"Wx+", 0.45}, {"Lr", 0.75}})},  // (6) D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R)
      {"ASD-6(Wx+,S)", dead(1.0, {{"L", 0.75}, {"Wx+", 0.45}, {"S", 0.75}})},    // (6)
      {"ASD-6(Wx-,Lr)", dead(1.0, {{"L", 0.75}, {"Wx-", 0.45}, {"Lr", 0.75}})},  // (6)
      {"ASD-6(Wx-,S)", dead(1.0, {{"L", 0.75}, {"Wx-", 0.45}, {"S", 0.75}})},    // (6)
      {"ASD-7(Wx+)", dead(0.6, {{"Wx+", 0.6}})},                              // (7) 0.6D + 0.6W
      {"ASD-7(Wx-)", dead(0.6, {{"Wx-", 0.6}})},                              // (7)
      {"ASD-8(Ex)", dead(1.0, {{"E", 0.7}})},                                 // §2.4.5 (8) D + 0.7E
      {"ASD-9(Ex)", dead(1.0, {{"E", 0.525}, {"L", 0.75}, {"S", 0.75}})},     // (9) D + 0.525E + 0.75L + 0.75S
      {"ASD-10(Ex)", dead(0.6, {{"E", 0.7}})},                                // (10) 0.6D + 0.7E
  };
  check_table(g, expected);
  for (const auto& c : g.combinations) CHECK(c.limit_state == LimitState::service);
  check_directions_apart(g, {{"Wx+"}, {"Wx-"}, {"E"}});
}

TEST_CASE("combinations: ASCE 7-16 strength design table", "[combinations][published]") {
  const auto g = cairn::generate_combinations("asce7-lrfd", building_cases(true), kNoEv);
  // Source: ASCE/SEI 7-16, §2.3.1 (1–5) and §2.3.6 (6–7), from memory; L at 1.0 in 3, 4, 6.
  const std::vector<Row> expected = {
      {"LRFD-1", dead(1.4, {})},                                               // §2.3.1 (1) 1.4D
      {"LRFD-2(Lr)", dead(1.2, {{"L", 1.6}, {"Lr", 0.5}})},                    // (2) 1.2D + 1.6L + 0.5(Lr or S or R)
      {"LRFD-2(S)", dead(1.2, {{"L", 1.6}, {"S", 0.5}})},                      // (2)
      {"LRFD-3(Lr,L)", dead(1.2, {{"Lr", 1.6}, {"L", 1.0}})},                  // (3) 1.2D + 1.6(Lr or S or R) + (L or 0.5W)
      {"LRFD-3(Lr,Wx+)", dead(1.2, {{"Lr", 1.6}, {"Wx+", 0.5}})},              // (3)
      {"LRFD-3(Lr,Wx-)", dead(1.2, {{"Lr", 1.6}, {"Wx-", 0.5}})},              // (3)
      {"LRFD-3(S,L)", dead(1.2, {{"S", 1.6}, {"L", 1.0}})},                    // (3)
      {"LRFD-3(S,Wx+)", dead(1.2, {{"S", 1.6}, {"Wx+", 0.5}})},                // (3)
      {"LRFD-3(S,Wx-)", dead(1.2, {{"S", 1.6}, {"Wx-", 0.5}})},                // (3)
      {"LRFD-4(Wx+,Lr)", dead(1.2, {{"Wx+", 1.0}, {"L", 1.0}, {"Lr", 0.5}})},  // (4) 1.2D + 1.0W + L + 0.5(Lr or S or R)
      {"LRFD-4(Wx+,S)", dead(1.2, {{"Wx+", 1.0}, {"L", 1.0}, {"S", 0.5}})},    // (4)
      {"LRFD-4(Wx-,Lr)", dead(1.2, {{"Wx-", 1.0}, {"L", 1.0}, {"Lr", 0.5}})},  // (4)
      {"LRFD-4(Wx-,S)", dead(1.2, {{"Wx-", 1.0}, {"L", 1.0}, {"S", 0.5}})},    // (4)
      {"LRFD-5(Wx+)", dead(0.9, {{"Wx+", 1.0}})},                              // (5) 0.9D + 1.0W
      {"LRFD-5(Wx-)", dead(0.9, {{"Wx-", 1.0}})},                              // (5)
      {"LRFD-6(Ex)", dead(1.2, {{"E", 1.0}, {"L", 1.0}, {"S", 0.2}})},         // §2.3.6 (6) 1.2D + E + L + 0.2S
      {"LRFD-7(Ex)", dead(0.9, {{"E", 1.0}})},                                 // (7) 0.9D + E
  };
  check_table(g, expected);
  for (const auto& c : g.combinations) CHECK(c.limit_state == LimitState::strength);
  check_directions_apart(g, {{"Wx+"}, {"Wx-"}, {"E"}});
  // The formula in words, as the output prints it.
  for (const auto& c : g.combinations) {
    if (c.id == "LRFD-5(Wx+)") CHECK(c.description == "0.9D + 1.0W(Wx+)");
    if (c.id == "LRFD-4(Wx-,S)") CHECK(c.description == "1.2D + 1.0W(Wx-) + 1.0L + 0.5S");
  }
}

TEST_CASE("combinations: EN 1990 eq. 6.10 and 6.14b table", "[combinations][published]") {
  // Roof imposed load is left out here; its exclusions are tested below.
  auto cases = building_cases(false);
  cases.erase(cases.begin() + 3);
  const auto g = cairn::generate_combinations("en1990-str-geo", cases);
  // Source: EN 1990:2002 eq. 6.10 with Table A1.2(B): γG,sup 1.35, γG,inf 1.00, γQ 1.50;
  // ψ0 Table A1.1: imposed (A–D) 0.7, snow (≤ 1000 m) 0.5, wind 0.6 — all from memory; the
  // γ values also appear in EN 1997-1 Annex A, Table A.3.
  // γQ·ψ0: imposed 1.05, snow 0.75, wind 0.9.
  const std::vector<Row> uls = {
      {"EN-6.10-G", dead(1.35, {})},                                                    // 6.10, no variable action
      {"EN-6.10-L+W(Wx+)", dead(1.35, {{"L", 1.5}, {"Wx+", 0.9}, {"S", 0.75}})},        // 6.10, L leading
      {"EN-6.10-L+W(Wx-)", dead(1.35, {{"L", 1.5}, {"Wx-", 0.9}, {"S", 0.75}})},
      {"EN-6.10-L-inf", dead(1.0, {{"L", 1.5}})},                                       // γG,inf = 1.0
      {"EN-6.10-S+W(Wx+)", dead(1.35, {{"S", 1.5}, {"Wx+", 0.9}, {"L", 1.05}})},        // S leading
      {"EN-6.10-S+W(Wx-)", dead(1.35, {{"S", 1.5}, {"Wx-", 0.9}, {"L", 1.05}})},
      {"EN-6.10-S-inf", dead(1.0, {{"S", 1.5}})},
      {"EN-6.10-W(Wx+)", dead(1.35, {{"Wx+", 1.5}, {"L", 1.05}, {"S", 0.75}})},         // W leading
      {"EN-6.10-W(Wx+)-inf", dead(1.0, {{"Wx+", 1.5}})},                                // uplift
      {"EN-6.10-W(Wx-)", dead(1.35, {{"Wx-", 1.5}, {"L", 1.05}, {"S", 0.75}})},
      {"EN-6.10-W(Wx-)-inf", dead(1.0, {{"Wx-", 1.5}})},
  };
  // Source: EN 1990:2002 eq. 6.14b, characteristic: G + Q1 + Σψ0·Qi (from memory).
  const std::vector<Row> sls = {
      {"EN-6.14b-G", dead(1.0, {})},
      {"EN-6.14b-L+W(Wx+)", dead(1.0, {{"L", 1.0}, {"Wx+", 0.6}, {"S", 0.5}})},
      {"EN-6.14b-L+W(Wx-)", dead(1.0, {{"L", 1.0}, {"Wx-", 0.6}, {"S", 0.5}})},
      {"EN-6.14b-S+W(Wx+)", dead(1.0, {{"S", 1.0}, {"Wx+", 0.6}, {"L", 0.7}})},
      {"EN-6.14b-S+W(Wx-)", dead(1.0, {{"S", 1.0}, {"Wx-", 0.6}, {"L", 0.7}})},
      {"EN-6.14b-W(Wx+)", dead(1.0, {{"Wx+", 1.0}, {"L", 0.7}, {"S", 0.5}})},
      {"EN-6.14b-W(Wx-)", dead(1.0, {{"Wx-", 1.0}, {"L", 0.7}, {"S", 0.5}})},
  };
  std::vector<Row> all = uls;
  all.insert(all.end(), sls.begin(), sls.end());
  check_table(g, all);
  for (const auto& row : uls) CHECK(state_of(g, row.id) == LimitState::strength);
  for (const auto& row : sls) CHECK(state_of(g, row.id) == LimitState::service);
  check_directions_apart(g, {{"Wx+"}, {"Wx-"}});
}

TEST_CASE("combinations: EN 1990 roof imposed load has ψ0 = 0 and excludes snow and wind",
          "[combinations][published]") {
  // Source: EN 1990:2002 Table A1.1, category H roofs ψ0 = 0; EN 1991-1-1 §3.3.2(1): imposed
  // roof loads are not applied together with snow or wind (both from memory).
  const auto g = cairn::generate_combinations(
      "en1990-str-geo", {{"G", LoadKind::dead, ""}, {"Q", LoadKind::live, ""},
                         {"H", LoadKind::roof_live, ""}, {"S", LoadKind::snow, ""},
                         {"W", LoadKind::wind, ""}, {"T", LoadKind::temperature, ""}});
  bool found_temperature = false;
  for (const auto& c : g.combinations) {
    INFO(c.id);
    std::map<std::string, double> f(c.factors.begin(), c.factors.end());
    const bool roof_leads = f.count("H") > 0;
    if (roof_leads) {
      CHECK(f.count("S") == 0);
      CHECK(f.count("W") == 0);
      // Only the roof load leads with a full factor; it is never an accompanying action.
      CHECK(f.at("H") == Approx(c.limit_state == LimitState::strength ? 1.5 : 1.0));
    }
    // Temperature accompanies at γQ·ψ0 = 1.5 × 0.6 = 0.9 (Table A1.1, from memory).
    if (c.id == "EN-6.10-L+W(W)") {
      CHECK(f.at("T") == Approx(0.9).margin(1e-12));
      found_temperature = true;
    }
  }
  CHECK(found_temperature);
}

TEST_CASE("combinations: cases sharing a direction act together, others one at a time",
          "[combinations]") {
  const std::vector<CaseToCombine> cases = {
      {"D", LoadKind::dead, ""},
      {"Wx+ext", LoadKind::wind, "X+"}, {"Wx+int", LoadKind::wind, "X+"},
      {"Wy+", LoadKind::wind, ""},
      {"Ex", LoadKind::seismic, ""}, {"Ey", LoadKind::seismic, ""},
  };
  for (const auto& name : cairn::generator_names()) {
    if (name.rfind("en199", 0) == 0) continue;  // no seismic there
    INFO(name);
    const auto g = cairn::generate_combinations(name, cases, kNoEv);
    check_directions_apart(g, {{"Wx+ext", "Wx+int"}, {"Wy+"}, {"Ex"}, {"Ey"}});
    bool together = false;
    for (const auto& c : g.combinations) {
      std::set<std::string> ids;
      for (const auto& [id, factor] : c.factors) ids.insert(id);
      if (ids.count("Wx+ext")) {
        CHECK(ids.count("Wx+int") == 1);  // one direction: both its cases
        together = true;
      }
    }
    CHECK(together);
  }
  // Without live or roof loads no combination is generated that needs them.
  const auto asd = cairn::generate_combinations("asce7-asd", cases, kNoEv);
  for (const auto& c : asd.combinations) {
    CHECK(c.id.rfind("ASD-2", 0) == std::string::npos);
    CHECK(c.id.rfind("ASD-3", 0) == std::string::npos);
  }
}

TEST_CASE("combinations: ASCE earth and fluid loads follow §2.3.1 and §2.4.1",
          "[combinations][published]") {
  // Source: ASCE/SEI 7-16 §2.3.1 and §2.4.1 (from memory): F with the same factor as D; H
  // where it adds to the effect at 1.6 (strength) or 1.0 (allowable stress); the same
  // combinations with H resisting ('-Hr') are checked in test_code_combinations.cpp.
  const std::vector<CaseToCombine> cases = {
      {"D", LoadKind::dead, ""}, {"F", LoadKind::fluid, ""}, {"H", LoadKind::earth, ""},
      {"W", LoadKind::wind, ""}};
  const auto lrfd = cairn::generate_combinations("asce7-lrfd", cases);
  const auto asd = cairn::generate_combinations("asce7-asd", cases);
  for (const auto& [g, earth] : {std::pair{&lrfd, 1.6}, std::pair{&asd, 1.0}}) {
    for (const auto& c : g->combinations) {
      INFO(c.id);
      if (c.id.find("-Hr") != std::string::npos) continue;
      std::map<std::string, double> f(c.factors.begin(), c.factors.end());
      CHECK(f.at("F") == Approx(f.at("D")).margin(1e-12));
      CHECK(f.at("H") == Approx(earth).margin(1e-12));
    }
    CHECK(g->notes.size() >= 3);  // the H and F choices are stated
  }
}

TEST_CASE("combinations: unknown generators and kinds are refused with a plain message",
          "[combinations]") {
  const std::vector<CaseToCombine> dead_only = {{"D", LoadKind::dead, ""}};
  try {
    cairn::generate_combinations("asce7-2022", dead_only);
    FAIL("expected an exception");
  } catch (const std::invalid_argument& e) {
    CHECK(std::string(e.what()) ==
          "unknown combination generator 'asce7-2022' (valid: asce7-asd, asce7-lrfd, "
          "en1990-str-geo, en1997-da1, en1997-da2, en1997-da3, aashto-lrfd)");
  }
  try {
    cairn::generate_combinations("asce7-lrfd", {{"D", LoadKind::dead, ""}, {"T1", LoadKind::temperature, ""}});
    FAIL("expected an exception");
  } catch (const std::invalid_argument& e) {
    const std::string message = e.what();
    CHECK(message.find("load case 'T1' has kind 'temperature'") == 0);
    CHECK(message.find("'asce7-lrfd'") != std::string::npos);
  }
  CHECK_THROWS_AS(cairn::generate_combinations("en1990-str-geo", {{"R", LoadKind::rain, ""}}),
                  std::invalid_argument);
  CHECK_THROWS_AS(cairn::generate_combinations("en1990-str-geo", {{"E", LoadKind::seismic, ""}}),
                  std::invalid_argument);
  CHECK_THROWS_AS(cairn::generate_combinations("asce7-asd", {{"X", LoadKind::other, ""}}),
                  std::invalid_argument);
  CHECK_THROWS_AS(cairn::generate_combinations("asce7-asd", {{"D", LoadKind::dead, ""}, {"D", LoadKind::live, ""}}),
                  std::invalid_argument);
  CHECK(cairn::generator_names() ==
        std::vector<std::string>{"asce7-asd", "asce7-lrfd", "en1990-str-geo", "en1997-da1",
                                 "en1997-da2", "en1997-da3", "aashto-lrfd"});
}
