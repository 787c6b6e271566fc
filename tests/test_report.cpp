// Tests of report.hpp: tables in text, Markdown and CSV, the combination formula, the
// summary line, the JSON document, the caution at the end of every output and the file
// names of `--out`. Reports are made from small projects in tests/data/t8/, analysed with
// analysis.hpp; their pile forces are hand-checked in those files' headers.
#include <catch2/catch.hpp>

#include <algorithm>
#include <string>

#include "cairn/app/analysis.hpp"
#include "cairn/output/report.hpp"

using namespace cairn;

namespace {

const std::string kData = std::string(CAIRN_TEST_DATA) + "/t8/";

bool ends_with(const std::string& text, const std::string& tail) {
  return text.size() >= tail.size() && text.compare(text.size() - tail.size(), tail.size(), tail) == 0;
}

Table small_table() {
  Table t;
  t.title = "T";
  t.headers = {"name", "value"};
  t.rows = {{"a", "1.5"}, {"long name", "22.25"}};
  t.numeric = {false, true};
  return t;
}

Project two_cases() {
  Project p;
  LoadCase d, w;
  d.id = "D";
  w.id = "W";
  p.load_cases = {d, w};
  return p;
}

}  // namespace

TEST_CASE("report: tables render as aligned text, Markdown and CSV", "[report]") {
  const Table t = small_table();
  // Text: numeric columns right-aligned, a rule under the header, a blank line after.
  CHECK(render_table(t, Format::text) ==
        "T\n"
        "  name      value\n"
        "  ---------------\n"
        "  a           1.5\n"
        "  long name 22.25\n"
        "\n");
  CHECK(render_table(t, Format::markdown) ==
        "## T\n\n"
        "| name | value |\n"
        "| --- | ---: |\n"
        "| a | 1.5 |\n"
        "| long name | 22.25 |\n"
        "\n");
  // CSV carries no title.
  CHECK(render_table(t, Format::csv) == "name,value\na,1.5\nlong name,22.25\n");
}

TEST_CASE("report: CSV cells with commas, quotes or line breaks are quoted",
          "[report][published]") {
  Table t;
  t.headers = {"pile", "note"};
  t.rows = {{"A1", "1:6 toward 90°, battered"}, {"A2", "say \"ok\""}, {"A3", "two\nlines"}};
  // Source: RFC 4180 (2005), §2 rules 6 and 7: fields with commas, double quotes or line
  // breaks are enclosed in double quotes; a double quote inside is doubled.
  CHECK(render_table(t, Format::csv) ==
        "pile,note\n"
        "A1,\"1:6 toward 90°, battered\"\n"
        "A2,\"say \"\"ok\"\"\"\n"
        "A3,\"two\nlines\"\n");
}

TEST_CASE("report: the combination formula lists factors and load cases", "[report]") {
  const Project p = two_cases();
  Combination c;
  c.factors = {{0, 1.0}, {1, 0.6}};
  CHECK(combination_formula(p, c) == "1.0·D + 0.6·W");
  c.factors = {{0, 0.9}, {1, -1.0}};
  CHECK(combination_formula(p, c) == "0.9·D − 1.0·W");
  c.factors = {{1, -0.6}, {0, 1.2}};
  CHECK(combination_formula(p, c) == "−0.6·W + 1.2·D");
  c.factors = {{0, 1.35}, {1, 1.5}};
  CHECK(combination_formula(p, c) == "1.35·D + 1.5·W");
}

TEST_CASE("report: the summary line says PASS or FAIL with where the maximum occurs",
          "[report]") {
  SECTION("pass") {
    const CheckRun run = analyse_project(kData + "pass.yaml");
    const CheckReport report = make_check_report(run, "", std::nullopt);
    const std::string line = summary_line(report);
    INFO(line);
    // Hand (pass.yaml): max utilization 1033.33/1400 = 0.738 in S2, piles at x = +1.35
    // (A2 and B2 carry the same load; the tie may go either way).
    CHECK(line.rfind("PASS: 4 piles in 2 combinations; max utilization 0.738 (pile ", 0) == 0);
    CHECK(ends_with(line, ", combination S2, compression)"));
  }
  SECTION("fail") {
    const CheckRun run = analyse_project(kData + "fail.yaml");
    const std::string line = summary_line(make_check_report(run, "", std::nullopt));
    INFO(line);
    // Hand (fail.yaml): 1533.33/1400 = 1.095; the group is overloaded too (Σ 6000 kN
    // against 4 × 1400 = 5600 kN with η = 1).
    CHECK(line.rfind("FAIL: 1 of 1 combination fails; max utilization 1.095 (pile ", 0) == 0);
    CHECK(ends_with(line, ", combination S1, compression); group checks fail (see Group checks)"));
  }
  SECTION("overturns") {
    const CheckRun run = analyse_project(kData + "overturn.yaml");
    const std::string line = summary_line(make_check_report(run, "", std::nullopt));
    INFO(line);
    // The only combination overturns: no pile governs, so none is named.
    CHECK(line == "FAIL: 1 of 1 combination fails; the cap overturns in S1");
  }
}

TEST_CASE("report: the JSON document has the keys of the results format", "[report]") {
  const CheckRun run = analyse_project(kData + "pass.yaml");
  const nlohmann::json doc = check_json(make_check_report(run, "--format json", std::nullopt));
  REQUIRE(doc.contains("combinations"));
  REQUIRE(doc["combinations"].size() == 2);
  for (const auto& c : doc["combinations"]) {
    INFO(c.dump());
    for (const char* key : {"id", "limit_state", "status", "cap", "piles", "max_utilization"})
      CHECK(c.contains(key));
    CHECK(c["cap"]["translation"].size() == 3);
    CHECK(c["cap"]["rotation"].size() == 3);
    REQUIRE(c["piles"].size() == 4);
    for (const auto& pile : c["piles"])
      for (const char* key : {"id", "axial", "lateral", "active", "utilization"})
        CHECK(pile.contains(key));
  }
  const auto& s2 = doc["combinations"][1];
  CHECK(s2["id"] == "S2");
  CHECK(s2["limit_state"] == "service");
  CHECK(s2["status"] == "pass");
  // Hand (pass.yaml): S2 compresses the piles at x = −1.35 with 1000 − 33.33 kN and shears
  // each with 40/4 = 10 kN.
  CHECK(s2["piles"][0]["id"] == "A1");
  CHECK(s2["piles"][0]["axial"].get<double>() == Approx(966.667).epsilon(1e-6));
  CHECK(s2["piles"][0]["lateral"].get<double>() == Approx(10.0).epsilon(1e-6));
  CHECK(s2["piles"][0]["active"] == true);
  CHECK(s2["max_utilization"].get<double>() == Approx(1033.333 / 1400.0).epsilon(1e-6));
  CHECK(doc["envelope"].size() == 4);
  const auto& summary = doc["summary"];
  CHECK(summary["pass"] == true);
  CHECK(summary["max_utilization"].get<double>() == Approx(1033.333 / 1400.0).epsilon(1e-6));
  CHECK(summary["governing"]["combination"] == "S2");
  CHECK(summary["governing"]["check"] == "compression");
  CHECK(summary["governing"].contains("pile"));
  CHECK(doc["units"]["system"] == "SI");
  CHECK(doc["units"]["force"] == "kN");
  CHECK(doc["caution"] == kCaution);
}

TEST_CASE("report: a US project reports kip, ft and in", "[report]") {
  const CheckRun run = analyse_project(kData + "us.yaml");
  const nlohmann::json doc = check_json(make_check_report(run, "", std::nullopt));
  CHECK(doc["units"]["system"] == "US");
  CHECK(doc["units"]["force"] == "kip");
  CHECK(doc["units"]["length"] == "ft");
  CHECK(doc["units"]["moment"] == "kip·ft");
  CHECK(doc["units"]["displacement"] == "in");
  const auto& piles = doc["combinations"][0]["piles"];
  // Hand (us.yaml): 800/4 ± 200·4/(4·4²) = 200 ± 12.5 kip; piles B and D at x = +4 ft.
  CHECK(piles[0]["id"] == "A");
  CHECK(piles[0]["axial"].get<double>() == Approx(187.5).epsilon(1e-6));
  CHECK(piles[1]["axial"].get<double>() == Approx(212.5).epsilon(1e-6));
  CHECK(doc["summary"]["max_utilization"].get<double>() == Approx(212.5 / 300.0).epsilon(1e-6));
  // Settlement of the cap, in inches: E·A/L springs (EA/L = 4176000 ksf × (14/12)² ft² / 60 ft
  // = 94 733 kip/ft); uz = −200/94 733 ft = −0.025334 in (hand).
  const double uz = doc["combinations"][0]["cap"]["translation"][2].get<double>();
  CHECK(uz == Approx(-200.0 / (4176000.0 * (14.0 / 12.0) * (14.0 / 12.0) / 60.0) * 12.0).epsilon(1e-6));
  // The text report labels its columns in US units.
  const std::string text = render_check(make_check_report(run, "", std::nullopt), Format::text);
  CHECK(text.find("axial (kip)") != std::string::npos);
  CHECK(text.find("units: US (kip, ft, ksf, kip·ft)") != std::string::npos);
}

TEST_CASE("report: every output ends with the caution", "[report]") {
  const CheckRun run = analyse_project(kData + "pass.yaml");
  const CheckReport report = make_check_report(run, "", std::nullopt);
  const std::string caution = kCaution;
  CHECK(ends_with(render_check(report, Format::text), caution + "\n"));
  CHECK(ends_with(render_check(report, Format::markdown), "_" + caution + "_\n"));
  CHECK(ends_with(render_check(report, Format::csv), "# " + caution + "\n"));
  const auto json = nlohmann::json::parse(render_check(report, Format::json));
  CHECK(json["caution"] == caution);
  for (const auto& [name, content] : check_files(report)) {
    INFO(name);
    if (ends_with(name, ".json"))
      CHECK(nlohmann::json::parse(content)["caution"] == caution);
    else if (ends_with(name, ".md"))
      CHECK(ends_with(content, "_" + caution + "_\n"));
    else
      CHECK(ends_with(content, caution + "\n"));
  }
  for (Format f : {Format::text, Format::markdown, Format::csv}) {
    CHECK(render_springs(run.project, run.stiffness, f, "").find(caution) != std::string::npos);
    CHECK(ends_with(render_springs(run.project, run.stiffness, f, ""), caution + "\n"));
  }
  CHECK(nlohmann::json::parse(render_springs(run.project, run.stiffness, Format::json, ""))["caution"] ==
        caution);
  CapSummaryRow row;
  row.file = "pass.yaml";
  row.title = "cap";
  CHECK(ends_with(render_cap_summary({row}, Format::text, ""), caution + "\n"));
  CHECK(ends_with(render_cap_summary({row}, Format::markdown, ""), "_" + caution + "_\n"));
  CHECK(ends_with(render_cap_summary({row}, Format::csv, ""), caution + "\n"));
}

TEST_CASE("report: check_files names one file per output and one long results table", "[report]") {
  const CheckRun run = analyse_project(kData + "pass.yaml");
  std::vector<std::string> names;
  for (const auto& [name, content] : check_files(make_check_report(run, "", std::nullopt)))
    names.push_back(name);
  CHECK(names == std::vector<std::string>{"report.txt", "report.md", "results.json", "summary.csv",
                                          "envelope.csv", "results.csv"});
}
