// Tests of reactions_csv.hpp: support reactions read from CSV, and the project reader's use
// of them (column names mapped, factored combinations imported, warnings).
//
// The CSV rules checked are those of RFC 4180 (Shafranovich, 2005, "Common Format and MIME
// Type for Comma-Separated Values (CSV) Files", §2): records end in CRLF (a plain LF is
// accepted too, common practice); a cell holding the delimiter, a quote or a line break is
// quoted; a quote inside a quoted cell is doubled. Unit factors are the exact definitions of
// NIST SP 811 (2008), Appendix B: 1 kip = 4.448 221 615 260 5 kN, 1 ft = 0.3048 m.
// Bad files are pinned verbatim with their file:row:column (tests/data/reactions/bad_*).
#include <catch2/catch.hpp>

#include <cmath>
#include <fstream>
#include <random>
#include <sstream>
#include <string>
#include <vector>

#include "cairn/checks/checks.hpp"
#include "cairn/input/input.hpp"
#include "cairn/input/reactions_csv.hpp"
#include "support.hpp"

using namespace cairn;

namespace {

const std::string kData = std::string(CAIRN_TEST_DATA) + "/reactions/";

constexpr double kKip = 4.4482216152605;  // kN, NIST SP 811 Appendix B
constexpr double kFoot = 0.3048;          // m, NIST SP 811 Appendix B

// Values pass through one multiplication; 1e-12 relative absorbs only its rounding.
Approx near(double value) { return cairn::test::close(value, 1e-12, 1e-12); }

std::string file_text(const std::string& name) {
  std::ifstream in(kData + name, std::ios::binary);
  REQUIRE(in);
  std::stringstream buffer;
  buffer << in.rdbuf();
  return buffer.str();
}

// The messages of reading `text` as `file`, formatted as the command line prints them.
std::vector<std::string> problems_of(const std::string& text, const std::string& file,
                                     const ReactionsLayout& layout = {}) {
  Diagnostics diagnostics;
  read_reactions_csv(text, file, layout, diagnostics);
  std::vector<std::string> messages;
  for (const auto& d : diagnostics.list()) messages.push_back(d.format());
  return messages;
}

const std::string kHeader = "support,case,Fx,Fy,Fz,Mx,My,Mz\n";

}  // namespace

TEST_CASE("reactions_csv: quoted cells follow RFC 4180", "[reactions_csv]") {
  Diagnostics d;
  // RFC 4180 §2 rules 6 and 7: delimiter, line break and doubled quote inside quotes.
  const auto records =
      parse_csv("a,\"b,1\",\"say \"\"hi\"\"\"\r\n\"two\r\nlines\",  x  ,\r\n", "f.csv", ',', d);
  REQUIRE(d.empty());
  REQUIRE(records.size() == 2);
  REQUIRE(records[0].cells.size() == 3);
  CHECK(records[0].cells[1].text == "b,1");
  CHECK(records[0].cells[2].text == "say \"hi\"");
  CHECK(records[0].cells[2].column == 9);
  REQUIRE(records[1].cells.size() == 3);
  CHECK(records[1].line == 2);
  CHECK(records[1].cells[0].text == "two\nlines");
  CHECK(records[1].cells[1].text == "x");  // unquoted cells are trimmed
  CHECK(records[1].cells[1].line == 3);
  CHECK(records[1].cells[1].column == 10);
  CHECK(records[1].cells[2].text.empty());
}

TEST_CASE("reactions_csv: a byte-order mark, CRLF and blank lines are accepted",
          "[reactions_csv]") {
  Diagnostics d;
  const auto records = parse_csv("\xEF\xBB\xBFsupport,case\r\n\r\n1,D\r\n", "f.csv", ',', d);
  REQUIRE(d.empty());
  REQUIRE(records.size() == 2);
  CHECK(records[0].cells[0].text == "support");
  CHECK(records[0].cells[0].column == 1);
  CHECK(records[1].line == 3);
}

TEST_CASE("reactions_csv: unclosed quotes and text after a quote are located",
          "[reactions_csv]") {
  Diagnostics d;
  parse_csv("a,b\n1,\"open\n", "f.csv", ',', d);
  REQUIRE(d.list().size() == 1);
  CHECK(d.list()[0].format() == "f.csv:2:3: error: row 2: the quote opened here is never closed");
  Diagnostics e;
  parse_csv("a,b\n\"1\"x,2\n", "f.csv", ',', e);
  REQUIRE(e.list().size() == 1);
  CHECK(e.list()[0].format() ==
        "f.csv:2:4: error: row 2: unexpected 'x' after a closing quote; a quote inside a quoted "
        "cell is written twice (\"\")");
}

TEST_CASE("reactions_csv: values in the file's units, returned in SI", "[reactions_csv]") {
  ReactionsLayout us;
  us.units = UnitSystem::US;
  Diagnostics d;
  const auto rows = read_reactions_csv(kHeader + "7,D,1,-2,3.5e2,4,5,-6\n", "f.csv", us, d);
  REQUIRE(d.empty());
  REQUIRE(rows.size() == 1);
  CHECK(rows[0].support == "7");
  CHECK(rows[0].load_case == "D");
  CHECK(rows[0].where.line == 2);
  CHECK(rows[0].values[0] == near(1 * kKip));
  CHECK(rows[0].values[1] == near(-2 * kKip));
  CHECK(rows[0].values[2] == near(350 * kKip));
  CHECK(rows[0].values[3] == near(4 * kKip * kFoot));
  CHECK(rows[0].values[5] == near(-6 * kKip * kFoot));
}

TEST_CASE("reactions_csv: headers match without regard to case and spaces, or as mapped",
          "[reactions_csv]") {
  Diagnostics d;
  auto rows = read_reactions_csv(" SUPPORT , Case ,fx,FY,fz,MX,my,Mz,note\n7,D,0,0,10,0,0,0,x\n",
                                 "f.csv", {}, d);
  REQUIRE(d.empty());
  REQUIRE(rows.size() == 1);
  CHECK(rows[0].values[2] == near(10.0));

  ReactionsLayout mapped;
  mapped.headers = {{"support", "Node"}, {"case", "Load Combo"}, {"Fz", "F3"}};
  rows = read_reactions_csv("node,LOAD COMBO,Fx,Fy,F3,Mx,My,Mz\n7,U1,0,0,10,0,0,0\n", "f.csv",
                            mapped, d);
  REQUIRE(d.empty());
  REQUIRE(rows.size() == 1);
  CHECK(rows[0].load_case == "U1");
  CHECK(rows[0].values[2] == near(10.0));
}

TEST_CASE("reactions_csv: a missing column lists the columns found", "[reactions_csv]") {
  CHECK(problems_of("support,case,Fx,Fy,Fz,Mx,My\n", "f.csv") ==
        std::vector<std::string>{
            "f.csv:1:1: error: header: missing column 'Mz'; found: support, case, Fx, Fy, Fz, "
            "Mx, My; name the file's own columns with loads_from.headers, e.g. headers: "
            "{support: Node, case: Load Case}"});
  CHECK(problems_of("support,case,Fx,Fy,Fz,Mx,My,Mz,FZ\n", "f.csv") ==
        std::vector<std::string>{
            "f.csv:1:32: error: header: column 'Fz' appears 2 times; expected once"});
}

TEST_CASE("reactions_csv: rows of the wrong width are errors with the reason", "[reactions_csv]") {
  // The reproducers kept as files (also a seed corpus for fuzzing).
  const std::string thousands = kData + "bad_thousands.csv";
  CHECK(problems_of(file_text("bad_thousands.csv"), thousands) ==
        std::vector<std::string>{
            thousands +
            ":2:11: error: row 2: found 9 cells, expected 8 as in the header; '1,850.0' looks "
            "like one number written with a thousands separator; export numbers without "
            "thousands separators, or quote the cell"});
  const std::string unquoted = kData + "bad_2400.csv";
  CHECK(problems_of(file_text("bad_2400.csv"), unquoted) ==
        std::vector<std::string>{
            unquoted +
            ":2:11: error: row 2: found 9 cells, expected 8 as in the header; '2,400' looks "
            "like one number written with a thousands separator; export numbers without "
            "thousands separators, or quote the cell"});
  const std::string trailing = kData + "bad_trailing_comma.csv";
  CHECK(problems_of(file_text("bad_trailing_comma.csv"), trailing) ==
        std::vector<std::string>{
            trailing +
            ":3:22: error: row 3: found 9 cells, expected 8 as in the header; the row ends with "
            "a trailing ','; remove it (or add a column to the header)"});
  const std::string short_row = kData + "bad_short_row.csv";
  CHECK(problems_of(file_text("bad_short_row.csv"), short_row) ==
        std::vector<std::string>{short_row +
                                 ":3:1: error: row 3: found 7 cells, expected 8 as in the "
                                 "header; a cell is missing"});
  // A row of another width is refused even when its support belongs to another cap: the
  // reader cannot know which cell is the support once the cells have shifted.
  CHECK(problems_of(kHeader + "9000,D,0,0,5,000,0,0,0\n", "f.csv").size() == 1);
}

TEST_CASE("reactions_csv: numbers with separators or the other decimal mark are refused",
          "[reactions_csv]") {
  struct Row {
    const char* cell;
    const char* hint;
  };
  const std::vector<Row> table = {
      {"\"1,850.0\"", "a number with a thousands separator (or a decimal comma) is not read"},
      {"\"12 400\"", "a number with a thousands separator is not read"},
      {"\"2,5\"", "a decimal comma is not read with loads_from.decimal '.'"},
      {"abc", ""},
      {"1e400", ""},
      {"2e12", "expected at most 1e12 in magnitude"},
      {"", ""},
      {"0x10", ""},
      {"nan", ""},
      {"inf", ""},
  };
  for (const auto& row : table) {
    INFO("cell " << row.cell);
    const auto messages = problems_of(kHeader + "7,D,0,0," + row.cell + ",0,0,0\n", "f.csv");
    REQUIRE(messages.size() == 1);
    CHECK(messages[0].find("f.csv:2:9: error: row 2, column 'Fz': expected a number (a force "
                           "in kN), got '") == 0);
    CHECK(messages[0].find(row.hint) != std::string::npos);
  }
  // Plain numbers of every form are read.
  Diagnostics d;
  const auto rows = read_reactions_csv(kHeader + "7,D,+1,-2.,.5,1E3,-0.25e-1,0\n", "f.csv", {}, d);
  REQUIRE(d.empty());
  REQUIRE(rows.size() == 1);
  CHECK(rows[0].values == Wrench{1, -2, 0.5, 1000, -0.025, 0});
}

TEST_CASE("reactions_csv: semicolons and decimal commas read when declared, refused when not",
          "[reactions_csv]") {
  const std::string text = "support;case;Fx;Fy;Fz;Mx;My;Mz\n7;D;0;0;2400,5;0;-1,25;0\n";
  CHECK(problems_of(text, "f.csv") ==
        std::vector<std::string>{
            "f.csv:1:1: error: header: the columns are separated by ';', not ','; set "
            "loads_from.delimiter: ';' (and loads_from.decimal: ',' if the numbers use a "
            "decimal comma)"});
  ReactionsLayout semicolon;
  semicolon.delimiter = ';';
  const auto messages = problems_of(text, "f.csv", semicolon);
  REQUIRE(messages.size() == 2);
  CHECK(messages[0] ==
        "f.csv:2:9: error: row 2, column 'Fz': expected a number (a force in kN), got '2400,5'; "
        "a decimal comma is not read with loads_from.decimal '.'; set loads_from.decimal: ',' "
        "(and loads_from.delimiter: ';')");
  ReactionsLayout european = semicolon;
  european.decimal = ',';
  Diagnostics d;
  const auto rows = read_reactions_csv(text, "f.csv", european, d);
  REQUIRE(d.empty());
  REQUIRE(rows.size() == 1);
  CHECK(rows[0].values[2] == near(2400.5));
  CHECK(rows[0].values[4] == near(-1.25));
  // With a decimal comma, a point is a thousands separator or a mistake: refused.
  CHECK(problems_of("support;case;Fx;Fy;Fz;Mx;My;Mz\n7;D;0;0;2.400;0;0;0\n", "f.csv", european)
            .size() == 1);
  // A tab-separated export read with the default delimiter.
  CHECK(problems_of("support\tcase\tFx\tFy\tFz\tMx\tMy\tMz\n", "f.csv")[0] ==
        "f.csv:1:1: error: header: the columns are separated by a tab, not ','; set "
        "loads_from.delimiter: 'tab'");
}

TEST_CASE("reactions_csv: patterns for combination names", "[reactions_csv]") {
  struct Row {
    const char* pattern;
    const char* name;
    bool match;
  };
  const std::vector<Row> table = {
      {"ULS*", "ULS-1", true},   {"ULS*", "ULS", true},    {"ULS*", "SLS-1", false},
      {"*-CHAR", "SLS-CHAR", true}, {"SLS-?", "SLS-1", true}, {"SLS-?", "SLS-10", false},
      {"U*S*1", "ULS-1", true},  {"ULS-1", "ULS-1", true}, {"ULS-1", "uls-1", false},
      {"*", "", true},           {"?", "", false},
  };
  for (const auto& row : table) {
    INFO(row.pattern << " ~ " << row.name);
    CHECK(matches_pattern(row.pattern, row.name) == row.match);
  }
}

TEST_CASE("reactions_csv: factored combinations imported with the typed cases' factors",
          "[reactions_csv]") {
  const Project p = read_project(kData + "combos.yaml");
  REQUIRE(p.combinations.size() == 4);
  const std::vector<std::string> ids = {"ULS-1", "ULS-2", "SLS-1", "SLS-CHAR"};
  for (std::size_t i = 0; i < ids.size(); ++i) {
    INFO(ids[i]);
    const Combination& c = p.combinations[i];
    CHECK(c.id == ids[i]);
    CHECK(c.limit_state == (i < 2 ? LimitState::strength : LimitState::service));
    // Its own reactions at 1.0, then SW and PIPE at the factor of its limit state.
    REQUIRE(c.factors.size() == 3);
    CHECK(p.load_cases[c.factors[0].first].id == ids[i]);
    CHECK(c.factors[0].second == 1.0);
    CHECK(p.load_cases[c.factors[1].first].id == "SW");
    CHECK(c.factors[1].second == (i < 2 ? 1.2 : 1.0));
    CHECK(p.load_cases[c.factors[2].first].id == "PIPE");
  }
  // Vertical load of ULS-1 on the cap: the reactions reversed (3240 + 405 kN) plus 1.2 × the
  // cap's weight (24 kN/m³ × 3.6 m × 4.0 m × 1.0 m = 345.6 kN) plus 1.2 × the 40 kN pipe load
  // (arithmetic of the fixture).
  double fz = 0.0;
  for (const auto& [index, factor] : p.combinations[0].factors)
    fz += factor * resultant_about_origin(p.load_cases[index])[2];
  CHECK(fz == near(-(3240.0 + 405.0) - 1.2 * 345.6 - 1.2 * 40.0));
  CHECK(p.warnings.empty());
  // What was imported and what was added is stated among the assumptions.
  REQUIRE(p.notes.size() == 1);
  CHECK(p.notes[0] == "SLS-1, SLS-CHAR, ULS-1, ULS-2 imported from " + kData +
                          "combos.csv as already factored (reactions at 1.0); added to each "
                          "service combination: 1·SW + 1·PIPE; added to each strength "
                          "combination: 1.2·SW + 1.2·PIPE.");
}

TEST_CASE("reactions_csv: a missing factor for a limit state that occurs is an error",
          "[reactions_csv]") {
  try {
    read_project(kData + "bad_combination_pattern.yaml");
    FAIL("expected an InputError");
  } catch (const InputError& e) {
    REQUIRE(e.diagnostics().size() == 2);
    CHECK(e.diagnostics()[0].format() ==
          kData + "combos.csv:8:1: error: row 8: combination 'SLS-CHAR' matches nothing in "
                  "loads_from.combinations.limit_state (ULS-*, SLS-1); add its name or a pattern "
                  "with its limit state");
    CHECK(e.diagnostics()[1].format() ==
          kData + "bad_combination_pattern.yaml:28:17: error: "
                  "loads_from.combinations.factors.strength.PIPE: missing; expected a "
                  "non-negative number");
  }
}

TEST_CASE("reactions_csv: a load case no combination uses is a warning in the notes",
          "[reactions_csv]") {
  const Project p = read_project(kData + "unused_case.yaml");
  REQUIRE(p.warnings.size() == 1);
  CHECK(format_warning(p.warnings[0]) ==
        kData + "unused_case.yaml:17:3: warning: load_cases.W: no combination uses this load "
                "case; its loads are not checked");
  const auto notes = assumptions(p, {}, {});
  REQUIRE(!notes.empty());
  CHECK(notes.front() == "Warning: load_cases.W: no combination uses this load case; its "
                         "loads are not checked (" +
                             kData + "unused_case.yaml:17:3)");
  CHECK(read_project(kData + "reactions.yaml").warnings.empty());
}

TEST_CASE("reactions_csv: mutated files never throw; every problem is located, every value finite",
          "[reactions_csv]") {
  // Property test over byte-level mutations of the fixtures (a fixed seed, so a failure
  // reproduces): every input ends in rows or in located problems, nothing else.
  std::mt19937 random(20261202);
  const std::vector<std::string> seeds = {file_text("reactions.csv"), file_text("mapped.csv"),
                                          file_text("semicolon.csv"), file_text("combos.csv"),
                                          file_text("bad_2400.csv")};
  const std::string alphabet = ",;\"\r\n \t0123456789.-eE\xEF\xBB\xBFx";
  std::size_t read = 0, refused = 0;
  for (int trial = 0; trial < 3000; ++trial) {
    std::string text = seeds[static_cast<std::size_t>(trial) % seeds.size()];
    const int edits = 1 + static_cast<int>(random() % 4);
    for (int e = 0; e < edits && !text.empty(); ++e) {
      const std::size_t at = random() % text.size();
      const char c = alphabet[random() % alphabet.size()];
      switch (random() % 3) {
        case 0: text[at] = c; break;
        case 1: text.insert(at, 1, c); break;
        default: text.erase(at, 1); break;
      }
    }
    ReactionsLayout layout;
    if (trial % 5 == 2) layout.delimiter = ';', layout.decimal = ',';
    if (trial % 5 == 3) layout.headers = {{"support", "Node"}, {"case", "Combination"}};
    Diagnostics d;
    std::vector<ReactionRow> rows;
    REQUIRE_NOTHROW(rows = read_reactions_csv(text, "f.csv", layout, d));
    for (const auto& diagnostic : d.list()) {
      INFO(diagnostic.format());
      CHECK(diagnostic.where.line >= 1);
      CHECK(diagnostic.where.column >= 1);
    }
    for (const auto& row : rows)
      for (double v : row.values) CHECK(std::isfinite(v));
    (d.empty() ? read : refused) += 1;
  }
  CAPTURE(read, refused);
  CHECK(read > 0);
  CHECK(refused > 0);
}
