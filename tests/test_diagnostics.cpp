// Tests for diagnostics.hpp: located input problems, collected and raised together;
// warnings as the terminal and the reports show them; the closest-name suggestion.
#include <catch2/catch.hpp>

#include <string>
#include <vector>

#include "cairn/core/diagnostics.hpp"

using namespace cairn;

TEST_CASE("diagnostics: a problem is printed location first, as compilers print them",
          "[diagnostics]") {
  const Diagnostic d{{"project.yaml", 14, 9}, "piles[3].x: expected a length in m, got 'abc'"};
  CHECK(d.format() == "project.yaml:14:9: error: piles[3].x: expected a length in m, got 'abc'");
  // A location without a column, and one without a file.
  CHECK(Diagnostic{{"loads.csv", 3, 0}, "row 3"}.format() == "loads.csv:3: error: row 3");
  CHECK(Diagnostic{{"", 0, 0}, "no file"}.format() == "<input>: error: no file");
}

TEST_CASE("diagnostics: problems are collected and raised together, in order", "[diagnostics]") {
  Diagnostics diagnostics;
  CHECK(diagnostics.empty());
  CHECK_NOTHROW(diagnostics.raise_if_any());
  diagnostics.error({"a.yaml", 2, 3}, "first");
  diagnostics.error({"a.yaml", 5, 1}, "second");
  CHECK_FALSE(diagnostics.empty());
  REQUIRE(diagnostics.list().size() == 2);
  try {
    diagnostics.raise_if_any();
    FAIL("raise_if_any did not throw");
  } catch (const InputError& e) {
    REQUIRE(e.diagnostics().size() == 2);
    CHECK(e.diagnostics()[0].message == "first");
    CHECK(e.diagnostics()[1].message == "second");
    // what(): one line per problem.
    CHECK(std::string(e.what()) == "a.yaml:2:3: error: first\na.yaml:5:1: error: second");
  }
  const InputError one({"b.yaml", 1, 1}, "only");
  REQUIRE(one.diagnostics().size() == 1);
  CHECK(std::string(one.what()) == "b.yaml:1:1: error: only");
}

TEST_CASE("diagnostics: warnings on the terminal and in the reports' notes", "[diagnostics]") {
  Warning w;
  w.where = {"cap.yaml", 7, 5};
  w.message = "load case 'W' is in no combination";
  CHECK(format_warning(w) == "cap.yaml:7:5: warning: load case 'W' is in no combination");
  CHECK(warning_note(w) == "Warning: load case 'W' is in no combination (cap.yaml:7:5)");
}

TEST_CASE("diagnostics: the closest name is suggested only when it is close", "[diagnostics]") {
  const std::vector<std::string> keys = {"efficiency", "efficiency_on", "min_spacing",
                                         "settlement"};
  CHECK(closest_match("efficency", keys) == "efficiency");     // one letter left out
  CHECK(closest_match("min_spacnig", keys) == "min_spacing");  // two letters swapped
  CHECK(closest_match("colour", keys).empty());
  CHECK(closest_match("anything", {}).empty());
  // A suggestion shares at least half of the longer name: 'W' is not a typo of 'D', 'PC54'
  // may be one of 'PC45'.
  CHECK(closest_match("W", {"D"}).empty());
  CHECK(closest_match("PC54", {"PC45", "HP14"}) == "PC45");
}
