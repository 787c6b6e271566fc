// Tests of input.hpp: project files (tests/data/*.yaml) read into a Project in SI units,
// includes merged, and every kind of bad input reported with its file, line and column.
//
// Unit conversions follow the exact definitions of NIST SP 811 (2008), Appendix B:
// 1 ft = 0.3048 m, 1 in = 0.0254 m, 1 lbf = 4.448 221 615 260 5 N, 1 kip = 1000 lbf.
// tests/test_units.cpp checks the factors themselves; here they only show that each value
// of a file lands in SI.
#include <catch2/catch.hpp>

#include <algorithm>
#include <string>
#include <vector>

#include "cairn/input/input.hpp"
#include "support.hpp"

using namespace cairn;

namespace {

const std::string kData = CAIRN_TEST_DATA;

// Exact definitions, NIST SP 811 Appendix B.
constexpr double kFoot = 0.3048;             // m
constexpr double kInch = 0.0254;             // m
constexpr double kKip = 4.4482216152605;     // kN
constexpr double kPcf = 4.4482216152605e-3 / (0.3048 * 0.3048 * 0.3048);  // kN/m³ per pcf
constexpr double kKsf = kKip / (kFoot * kFoot);                           // kPa per ksf

// Values are converted once with double factors; 1e-9 relative absorbs only rounding.
Approx near(double value) { return cairn::test::close(value, 1e-9, 1e-9); }

Project read(const std::string& name) { return read_project(kData + "/" + name); }

const PileType& type_named(const Project& p, const std::string& id) {
  auto it = std::find_if(p.pile_types.begin(), p.pile_types.end(),
                         [&](const PileType& t) { return t.id == id; });
  REQUIRE(it != p.pile_types.end());
  return *it;
}

const LoadCase& case_named(const Project& p, const std::string& id) {
  auto it = std::find_if(p.load_cases.begin(), p.load_cases.end(),
                         [&](const LoadCase& c) { return c.id == id; });
  REQUIRE(it != p.load_cases.end());
  return *it;
}

const Combination& combination_named(const Project& p, const std::string& id) {
  auto it = std::find_if(p.combinations.begin(), p.combinations.end(),
                         [&](const Combination& c) { return c.id == id; });
  REQUIRE(it != p.combinations.end());
  return *it;
}

// Factor of load case `id` in a combination, or 0 when the combination does not use it.
double factor_of(const Project& p, const Combination& c, const std::string& id) {
  for (const auto& [index, factor] : c.factors)
    if (p.load_cases.at(index).id == id) return factor;
  return 0.0;
}

// The message read_project raises for a fixture; '@' in `expected` stands for the data
// folder followed by '/', since messages name files as the user gave them.
std::string error_for(const std::string& name) {
  try {
    read(name);
  } catch (const InputError& e) {
    return e.what();
  }
  FAIL("no InputError for " << name);
  return {};
}

std::string with_folder(std::string expected) {
  std::string out;
  for (char c : expected) {
    if (c == '@') out += kData + "/";
    else out += c;
  }
  return out;
}

}  // namespace

TEST_CASE("input: the example of the specification loads as written, in SI", "[input]") {
  const Project p = read("spec/cap.yaml");
  CHECK(p.title == "Example cap");
  CHECK(p.units == UnitSystem::SI);
  CHECK(p.file == kData + "/spec/cap.yaml");

  // cap
  CHECK(p.cap.thickness == near(1.2));
  REQUIRE(p.cap.outline);
  CHECK(p.cap.outline->polygon.size() == 4);
  REQUIRE(p.cap.self_weight);
  CHECK(p.cap.self_weight->unit_weight == near(24.0));
  CHECK(p.cap.self_weight->load_case == "D");

  // pile types: PC45 of the project file wins over the included one; RD60 comes from the
  // included file only.
  REQUIRE(p.pile_types.size() == 2);
  const PileType& pc45 = type_named(p, "PC45");
  CHECK(pc45.section.shape == SectionShape::square);
  CHECK(pc45.section.width == near(0.45));
  CHECK(pc45.length == near(18.0));
  CHECK(pc45.elastic_modulus == near(3.0e7));
  REQUIRE(pc45.axial_stiffness);
  CHECK(*pc45.axial_stiffness == near(2.0e5));
  REQUIRE(pc45.lateral_stiffness);
  CHECK(*pc45.lateral_stiffness == near(6.0e3));
  CHECK(pc45.tension);
  REQUIRE(pc45.capacities.size() == 1);
  const CapacitySet& cap = pc45.capacities.front();
  CHECK(cap.basis == CapacityBasis::allowable);
  CHECK(*cap.compression == near(1400.0));
  CHECK(*cap.tension == near(350.0));
  CHECK(*cap.lateral == near(60.0));
  CHECK(pc45.where.file == kData + "/spec/cap.yaml");
  CHECK(pc45.where.line == 12);

  const PileType& rd60 = type_named(p, "RD60");
  CHECK(rd60.section.shape == SectionShape::round);
  CHECK(rd60.section.width == near(0.6));
  CHECK_FALSE(rd60.tension);
  CHECK_FALSE(rd60.axial_stiffness);
  CHECK(rd60.where.file == kData + "/common/pile-types.yaml");

  // piles
  REQUIRE(p.piles.size() == 2);
  const Pile& a1 = p.piles[0];
  CHECK(a1.id == "A1");
  CHECK(a1.x == near(-1.35));
  CHECK(a1.y == near(-1.35));
  CHECK(p.pile_types.at(a1.type).id == "PC45");
  CHECK_FALSE(a1.batter);
  CHECK(a1.where.line == 21);
  CHECK(a1.where.column == 5);
  const Pile& b2 = p.piles[1];
  CHECK(b2.id == "B2");
  CHECK(b2.x == near(0.0));
  REQUIRE(b2.batter);
  CHECK(b2.batter->ratio == near(6.0));
  CHECK(b2.batter->toward_deg == near(90.0));

  // load cases: z of `at` defaults to the top of the cap; the cap's self-weight is added to
  // D at the outline's centroid, mid-thickness.
  REQUIRE(p.load_cases.size() == 2);
  const LoadCase& d = case_named(p, "D");
  CHECK(d.kind == LoadKind::dead);
  REQUIRE(d.loads.size() == 2);
  CHECK(d.loads[0].at[0] == near(0.0));
  CHECK(d.loads[0].at[2] == near(1.2));
  CHECK(d.loads[0].load[2] == near(-2400.0));
  CHECK(d.loads[0].load[4] == near(180.0));
  CHECK(d.loads[0].load[0] == near(0.0));
  // Cap weight W = γ·B·L·t = 24 × 4.2 × 4.2 × 1.2 = 508.032 kN (common practice: weight of
  // a prism of reinforced concrete).
  CHECK(d.loads[1].load[2] == near(-508.032));
  CHECK(d.loads[1].at[2] == near(0.6));
  CHECK(d.loads[1].note == "cap self-weight");

  const LoadCase& w = case_named(p, "W");
  CHECK(w.kind == LoadKind::wind);
  REQUIRE(w.loads.size() == 1);
  CHECK(w.loads[0].at == std::array<double, 3>{0.3, 0.0, 2.0});
  CHECK(w.loads[0].load[0] == near(120.0));
  CHECK(w.loads[0].load[3] == near(-40.0));

  // combinations
  REQUIRE(p.combinations.size() == 2);
  const Combination& s1 = combination_named(p, "S1");
  CHECK(s1.limit_state == LimitState::service);
  CHECK(s1.factors.size() == 1);
  CHECK(factor_of(p, s1, "D") == near(1.0));
  const Combination& s2 = combination_named(p, "S2");
  CHECK(factor_of(p, s2, "D") == near(1.0));
  CHECK(factor_of(p, s2, "W") == near(0.6));
}

TEST_CASE("input: a US project is converted to SI", "[input][published]") {
  // Source: NIST SP 811 (2008), Appendix B, exact definitions of ft, in and lbf.
  const Project p = read("us/cap.yaml");
  CHECK(p.units == UnitSystem::US);
  CHECK(p.cap.thickness == near(4 * kFoot));  // 1.2192 m
  REQUIRE(p.cap.outline);
  CHECK(p.cap.outline->area() == near(144 * kFoot * kFoot));
  REQUIRE(p.cap.self_weight);
  CHECK(p.cap.self_weight->unit_weight == near(150 * kPcf));  // 23.563 kN/m³

  const PileType& hp = type_named(p, "HP14");
  CHECK(hp.section.width == near(14 * kInch));  // written "14 in": 0.3556 m
  CHECK(hp.length == near(60 * kFoot));         // 18.288 m
  CHECK(hp.elastic_modulus == near(4176000 * kKsf));  // 29 000 ksi = 199.95 GPa
  CHECK(hp.elastic_modulus == Approx(1.9995e8).epsilon(1e-4));
  CHECK(*hp.axial_stiffness == near(1500 * kKip / kInch));
  CHECK(*hp.lateral_stiffness == near(20 * kKip / kInch));
  CHECK(*hp.capacities.front().compression == near(300 * kKip));
  CHECK(*hp.capacities.front().tension == near(100 * kKip));
  CHECK(*hp.capacities.front().lateral == near(15 * kKip));

  REQUIRE(p.piles.size() == 4);
  CHECK(p.piles[0].x == near(-4 * kFoot));
  CHECK(p.piles[3].y == near(4 * kFoot));

  const LoadCase& d = case_named(p, "D");
  REQUIRE(d.loads.size() == 2);
  CHECK(d.loads[0].load[2] == near(-600 * kKip));
  CHECK(d.loads[0].load[4] == near(200 * kKip * kFoot));
  CHECK(d.loads[0].at[2] == near(4 * kFoot));
  // Self-weight: 150 pcf × 12 ft × 12 ft × 4 ft = 86 400 lbf = 86.4 kip.
  CHECK(d.loads[1].load[2] == near(-86.4 * kKip));
  const LoadCase& w = case_named(p, "W");
  CHECK(w.loads[0].load[0] == near(20 * kKip));
  CHECK(w.loads[0].load[3] == near(-50 * kKip * kFoot));
}

TEST_CASE("input: includes merge, the including file winning entry by entry", "[input]") {
  const Project p = read("includes/main.yaml");
  // Whole sections: the project file's cap replaces the included one; the title is only in
  // an included file.
  CHECK(p.title == "Shared title");
  CHECK(p.cap.thickness == near(1.0));

  SECTION("pile_types: H1 from the project file, T14 from an included US file") {
    REQUIRE(p.pile_types.size() == 2);
    const PileType& h1 = type_named(p, "H1");
    CHECK(h1.section.width == near(0.3));
    CHECK(h1.length == near(10.0));
    CHECK(h1.where.file == kData + "/includes/main.yaml");
    const PileType& t14 = type_named(p, "T14");
    CHECK(t14.where.file == kData + "/includes/shared/types-us.yaml");
    CHECK(t14.section.shape == SectionShape::round);
    CHECK(t14.section.width == near(14 * kInch));
    CHECK(t14.length == near(50 * kFoot));  // plain number in the included file's US units
    CHECK(*t14.axial_stiffness == near(1000 * kKip / kInch));
    CHECK(*t14.lateral_stiffness == near(5 * kKip / kInch));
    CHECK_FALSE(t14.tension);
    CHECK(*t14.capacities.front().compression == near(100 * kKip));
    CHECK(p.pile_types.at(p.piles[1].type).id == "T14");
  }
  SECTION("load_cases: D from the project file, L and E from two levels of includes") {
    REQUIRE(p.load_cases.size() == 3);
    const LoadCase& d = case_named(p, "D");
    REQUIRE(d.loads.size() == 1);
    CHECK(d.loads[0].load[2] == near(-600.0));
    // cases.yaml says no units: its plain numbers are the project's (SI).
    const LoadCase& l = case_named(p, "L");
    CHECK(l.kind == LoadKind::live);
    CHECK(l.loads[0].at[0] == near(0.5));
    CHECK(l.loads[0].load[2] == near(-300.0));
    CHECK(l.loads[0].load[4] == near(20.0));
    // combos.yaml, two folders down, says US: ft and kip.
    const LoadCase& e = case_named(p, "E");
    CHECK(e.kind == LoadKind::seismic);
    CHECK(e.loads[0].at[0] == near(kFoot));
    CHECK(e.loads[0].at[2] == near(2 * kFoot));
    CHECK(e.loads[0].load[0] == near(10 * kKip));
    CHECK(e.where.file == kData + "/includes/shared/deeper/combos.yaml");
  }
  SECTION("combinations: C1 from the project file (service, not the included strength C1), "
          "C2 from the deepest include") {
    REQUIRE(p.combinations.size() == 2);
    const Combination& c1 = combination_named(p, "C1");
    CHECK(c1.limit_state == LimitState::service);
    CHECK(c1.factors.size() == 2);
    CHECK(factor_of(p, c1, "D") == near(1.0));
    CHECK(factor_of(p, c1, "L") == near(1.0));
    const Combination& c2 = combination_named(p, "C2");
    CHECK(c2.limit_state == LimitState::service);
    CHECK(factor_of(p, c2, "D") == near(1.0));
    CHECK(factor_of(p, c2, "L") == near(0.75));
    CHECK(factor_of(p, c2, "E") == near(0.7));
  }
}

TEST_CASE("input: plain numbers of an included file without units are the project's",
          "[input]") {
  // The same shared/cases.yaml as above, included from a US project: kip and ft.
  const Project p = read("includes/us-project.yaml");
  CHECK(p.units == UnitSystem::US);
  const LoadCase& l = case_named(p, "L");
  CHECK(l.loads[0].at[0] == near(0.5 * kFoot));
  CHECK(l.loads[0].load[2] == near(-300 * kKip));
  CHECK(l.loads[0].load[4] == near(20 * kKip * kFoot));
  const LoadCase& d = case_named(p, "D");  // from the included file, nothing overrides it
  CHECK(d.loads[0].load[2] == near(-5 * kKip));
  CHECK(p.cap.thickness == near(3 * kFoot));
  CHECK(p.title == "US project with includes");
}

TEST_CASE("input: every bad input is reported with file, line, column and key", "[input]") {
  struct Row {
    const char* file;
    const char* message;  // '@' = the data folder and '/'
  };
  const Row rows[] = {
      // Malformed YAML: yaml-cpp's own words, at the place it stopped.
      {"bad_malformed.yaml", "@bad_malformed.yaml:17:3: error: malformed YAML: illegal block entry"},
      {"bad_malformed_indent.yaml",
       "@bad_malformed_indent.yaml:11:4: error: malformed YAML: end of map not found"},
      // Empty file, or nothing but comments.
      {"bad_empty.yaml",
       "@bad_empty.yaml:1:1: error: the file is empty; expected a project (title, units, cap, "
       "pile_types, piles, load_cases, combinations)"},
      {"bad_comments_only.yaml",
       "@bad_comments_only.yaml:1:1: error: the file is empty; expected a project (title, "
       "units, cap, pile_types, piles, load_cases, combinations)"},
      // Unknown keys, with a suggestion; the missing key is reported at its parent.
      {"bad_unknown_key.yaml",
       "@bad_unknown_key.yaml:10:5: error: pile_types.PC45.lenght: unknown key; did you mean "
       "'length'?\n"
       "@bad_unknown_key.yaml:9:5: error: pile_types.PC45.length: missing; expected a positive "
       "length in m"},
      {"bad_unknown_top_key.yaml",
       "@bad_unknown_top_key.yaml:18:1: error: load_case: unknown key; did you mean "
       "'load_cases'?"},
      {"bad_units_value.yaml",
       "@bad_units_value.yaml:3:8: error: units: expected 'SI' or 'US', got 'metric'"},
      {"bad_missing_units.yaml",
       "@bad_missing_units.yaml:1:1: error: units: missing; expected 'SI' (kN, m, kPa) or 'US' "
       "(kip, ft, ksf)"},
      // A key given twice in one map: YAML 1.2, section 3.2.1.1 (mapping keys are unique).
      {"bad_duplicate_key.yaml",
       "@bad_duplicate_key.yaml:15:5: error: pile_types.PC45.length: given twice (first at "
       "line 13)\n"
       "@bad_duplicate_key.yaml:17:3: error: pile_types.PC45: given twice (first at line 11)\n"
       "@bad_duplicate_key.yaml:31:56: error: combinations.S1.factors.D: given twice (first at "
       "line 31)"},
      // A pile whose type does not exist.
      {"bad_pile_type.yaml",
       "@bad_pile_type.yaml:17:38: error: piles[3].type: pile type 'PC54' does not exist; did "
       "you mean 'PC45'?"},
      // Two piles at one position, or closer than their width.
      {"bad_same_position.yaml",
       "@bad_same_position.yaml:17:5: error: piles[3]: pile 'B2' is at the same position as "
       "pile 'B1'"},
      {"bad_too_close.yaml",
       "@bad_too_close.yaml:15:5: error: piles[1]: piles 'A1' and 'A2' overlap: centres 0.300 m "
       "apart, closer than their width (0.450 m)"},
      // Negative stiffness, zero axial stiffness.
      {"bad_negative_stiffness.yaml",
       "@bad_negative_stiffness.yaml:12:24: error: pile_types.PC45.lateral_stiffness: expected "
       "a non-negative stiffness in kN/m, got '-6000'"},
      {"bad_zero_axial_stiffness.yaml",
       "@bad_zero_axial_stiffness.yaml:12:22: error: pile_types.PC45.axial_stiffness: expected "
       "a positive stiffness in kN/m, got '0'"},
      {"bad_negative_axial_stiffness.yaml",
       "@bad_negative_axial_stiffness.yaml:12:22: error: pile_types.PC45.axial_stiffness: "
       "expected a positive stiffness in kN/m, got '-200 MN/m'"},
      // Negative or zero length or dimension.
      {"bad_negative_length.yaml",
       "@bad_negative_length.yaml:10:13: error: pile_types.PC45.length: expected a positive "
       "length in m, got '-18'"},
      {"bad_zero_length.yaml",
       "@bad_zero_length.yaml:10:13: error: pile_types.PC45.length: expected a positive length "
       "in m, got '0'"},
      {"bad_zero_width.yaml",
       "@bad_zero_width.yaml:9:37: error: pile_types.PC45.section.width: expected a positive "
       "length in m, got '0'"},
      {"bad_negative_diameter.yaml",
       "@bad_negative_diameter.yaml:9:39: error: pile_types.PC45.section.diameter: expected a "
       "positive length in m, got '-0.6'"},
      {"bad_zero_thickness.yaml",
       "@bad_zero_thickness.yaml:5:14: error: cap.thickness: expected a positive length in m, "
       "got '0'"},
      // A non-numeric value; a unit cairn does not know; a unit of the wrong kind.
      {"bad_non_numeric.yaml",
       "@bad_non_numeric.yaml:15:17: error: piles[1].x: expected a length in m, got 'abc'"},
      {"bad_unknown_unit.yaml",
       "@bad_unknown_unit.yaml:12:29: error: pile_types.PC45.capacity.compression: unknown unit "
       "'ton' (did not understand 'ton'); known: N kN MN lb lbf kip tonf (US short ton, 2000 "
       "lbf) tf (metric tonne-force) mm cm m in ft Pa kPa MPa GPa psf ksf psi ksi tsf pcf kcf, "
       "joined with '·', '-', '*' or '/'"},
      {"bad_wrong_unit_kind.yaml",
       "@bad_wrong_unit_kind.yaml:10:13: error: pile_types.PC45.length: expected a length in m, "
       "got a force unit 'kip'"},
      // A combination naming a load case that does not exist.
      {"bad_combination_case.yaml",
       "@bad_combination_case.yaml:22:48: error: combinations.S1.factors.LL: load case 'LL' "
       "does not exist; did you mean 'L'?\n"
       "@bad_combination_case.yaml:22:57: error: combinations.S1.factors.W: load case 'W' does "
       "not exist (known: D, L)"},
      // An include that does not exist, or includes itself directly or through another file.
      {"bad_include_missing.yaml",
       "@bad_include_missing.yaml:4:11: error: include: cannot open "
       "'@shared/no-such-file.yaml'"},
      {"bad_include_self.yaml",
       "@bad_include_self.yaml:4:10: error: include: '@bad_include_self.yaml' includes itself "
       "(@bad_include_self.yaml → @bad_include_self.yaml)"},
      {"cycle/a.yaml",
       "@cycle/b.yaml:2:11: error: include: '@cycle/a.yaml' includes itself (@cycle/a.yaml → "
       "@cycle/b.yaml → @cycle/a.yaml)"},
      // Several problems in one run, in the order they were found.
      {"bad_several.yaml",
       "@bad_several.yaml:10:13: error: pile_types.PC45.length: expected a positive length in "
       "m, got '-18'\n"
       "@bad_several.yaml:15:17: error: piles[1].x: expected a length in m, got 'abc'\n"
       "@bad_several.yaml:17:38: error: piles[3].type: pile type 'PC54' does not exist; did "
       "you mean 'PC45'?\n"
       "@bad_several.yaml:22:48: error: combinations.S1.factors.Q: load case 'Q' does not "
       "exist (known: D, L)"},
      // The project file itself does not exist.
      {"no-such-project.yaml",
       "@no-such-project.yaml: error: cannot open the project file (does it exist?)"},
  };
  for (const Row& row : rows) {
    INFO("fixture tests/data/" << row.file);
    CHECK(error_for(row.file) == with_folder(row.message));
  }
}

TEST_CASE("input: all problems of a file come in one InputError, each located", "[input]") {
  try {
    read("bad_several.yaml");
    FAIL("expected an InputError");
  } catch (const InputError& e) {
    const auto& list = e.diagnostics();
    REQUIRE(list.size() == 4);
    for (const auto& d : list) {
      CHECK(d.where.file == kData + "/bad_several.yaml");
      CHECK(d.where.line > 0);
      CHECK(d.where.column > 0);
    }
    CHECK(list[1].where.line == 15);
    CHECK(list[1].where.column == 17);
    CHECK(list[1].message == "piles[1].x: expected a length in m, got 'abc'");
  }
}

TEST_CASE("input: the fixture every bad file starts from is itself valid", "[input]") {
  // Guards the bad_*.yaml fixtures: each differs from base.yaml by the one problem it names.
  const Project p = read("base.yaml");
  CHECK(p.piles.size() == 4);
  CHECK(p.combinations.size() == 1);
}

TEST_CASE("input: suggestions are offered only for names that are close", "[input]") {
  const std::vector<std::string> cases = {"D", "L", "W1", "load_cases"};
  CHECK(closest_match("LL", cases) == "L");
  CHECK(closest_match("load_case", cases) == "load_cases");
  CHECK(closest_match("W", cases) == "W1");
  CHECK(closest_match("Q", cases).empty());   // one letter off a one-letter name is no typo
  CHECK(closest_match("E", {"D", "L"}).empty());
  CHECK(closest_match("lenght", {"length", "width"}) == "length");
  CHECK(closest_match("diameter", {"length", "width"}).empty());
}

TEST_CASE("input: a diagnostic prints location first, compiler style", "[input]") {
  CHECK((Diagnostic{{"cap.yaml", 14, 9}, "piles[3].x: expected a length in m, got 'abc'"})
            .format() == "cap.yaml:14:9: error: piles[3].x: expected a length in m, got 'abc'");
  CHECK((Diagnostic{{"cap.yaml", 0, 0}, "cannot open"}).format() == "cap.yaml: error: cannot open");
  CHECK((Diagnostic{{}, "check: expected one project file"}).format() ==
        "<input>: error: check: expected one project file");
}
