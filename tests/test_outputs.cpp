// Tests of what every output says: one verdict for an overturned combination in text, CSV,
// Markdown, JSON and HTML; one list of check words and one of pile states; numbers without
// "-0.000" or round-off rotations; counts that agree with their noun; no combination named for
// a zero force; the utilization colour scale and the failing-pile mark of the plan; the
// command as it was run in the report header.
//
// Fixture: tests/data/outputs/mixed.yaml (its header carries the hand check of S1).
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <limits>
#include <sstream>
#include <string>
#include <vector>

#include "cairn/app/analysis.hpp"
#include "cairn/app/cli.hpp"
#include "cairn/output/html_report.hpp"
#include "cairn/output/number_text.hpp"
#include "cairn/output/plan_svg.hpp"
#include "cairn/output/report.hpp"

#include "support.hpp"

using namespace cairn;

using cairn::test::has;
using cairn::test::count;

namespace {

const std::string kMixed = std::string(CAIRN_TEST_DATA) + "/outputs/mixed.yaml";

std::vector<std::string> lines_of(const std::string& text) {
  std::vector<std::string> lines;
  std::istringstream in(text);
  for (std::string line; std::getline(in, line);) lines.push_back(line);
  return lines;
}

// The lines of `text` between the line that starts with `first` and the next empty line.
std::vector<std::string> block(const std::string& text, const std::string& first) {
  std::vector<std::string> out;
  bool inside = false;
  for (const auto& line : lines_of(text)) {
    if (!inside && line.rfind(first, 0) == 0) inside = true;
    if (inside && line.empty()) break;
    if (inside) out.push_back(line);
  }
  return out;
}

// sRGB "#rrggbb" → relative luminance (WCAG 2.x definition).
double luminance(const std::string& hex) {
  double y = 0.0;
  const double weight[3] = {0.2126, 0.7152, 0.0722};
  for (int c = 0; c < 3; ++c) {
    const double v = std::stoi(hex.substr(1 + 2 * c, 2), nullptr, 16) / 255.0;
    y += weight[c] * (v <= 0.04045 ? v / 12.92 : std::pow((v + 0.055) / 1.055, 2.4));
  }
  return y;
}

struct Mixed {
  CheckRun run = analyse_project(kMixed);
  CheckReport report = make_check_report(run, "cairn check mixed.yaml", std::nullopt);
};

}  // namespace

TEST_CASE("outputs: the words for checks, states and verdicts come from one list each",
          "[report]") {
  CHECK(std::string(to_string(Demand::compression)) == "compression");
  CHECK(std::string(to_string(Demand::tension)) == "tension");
  CHECK(std::string(to_string(Demand::lateral)) == "lateral");
  CHECK(std::string(to_string(Demand::structural)) == "structural");
  CHECK(std::string(to_string(Demand::none)) == "none");
  CHECK(std::string(to_string(PileState::in_contact)) == "in contact");
  CHECK(std::string(to_string(PileState::dropped_out)) == "dropped out");
  CHECK(std::string(to_string(PileState::overturned)) == "overturned");
  CHECK(std::string(to_string(Verdict::pass)) == "pass");
  CHECK(std::string(to_string(Verdict::fail)) == "fail");
  CHECK(std::string(to_string(Verdict::overturned)) == "overturned");
}

TEST_CASE("outputs: the checks decide each pile's state; an overturned combination fails "
          "every pile", "[report]") {
  const Mixed m;
  const auto& s1 = m.run.results.combinations[0];
  const auto& s2 = m.run.results.combinations[1];
  // S1: B1 drops out, the others carry the load (hand, tests/data/outputs/mixed.yaml:
  // P_A2 = 3200/2.7 = 1185.2 kN, P_A1 = P_B2 = 407.4 kN).
  CHECK(verdict(s1) == Verdict::pass);
  CHECK(s1.piles[2].state == PileState::dropped_out);
  CHECK(s1.piles[1].state == PileState::in_contact);
  CHECK(s1.piles[1].axial == Approx(3200.0 / 2.7).epsilon(1e-9));
  CHECK(s1.piles[0].axial == Approx((2000.0 - 3200.0 / 2.7) / 2.0).epsilon(1e-9));
  CHECK(s1.piles[1].governing == Demand::compression);
  // S2 overturns: no pile passes, whatever the solver left in its forces.
  CHECK(verdict(s2) == Verdict::overturned);
  for (const auto& p : s2.piles) {
    CHECK(p.state == PileState::overturned);
    CHECK_FALSE(p.pass);
  }
  // The envelope leaves S2 out, and every pile fails in it.
  for (const auto& e : m.run.results.envelope) CHECK_FALSE(e.pass);
}

TEST_CASE("outputs: an overturned combination has one verdict in every format", "[report]") {
  const Mixed m;
  SECTION("text") {
    const std::string text = render_check(m.report, Format::text);
    const auto rows = block(text, "Combination S2 ");
    REQUIRE(rows.size() == 8);  // title, header, rule, four piles, the note
    CHECK(has(rows[0], "— overturned"));
    for (std::size_t i = 3; i < 7; ++i) {
      INFO(rows[i]);
      CHECK(has(rows[i], " none  overturned fail"));
      CHECK_FALSE(has(rows[i], "pass"));
    }
    CHECK(has(text, "FAIL (overturned): the cap overturns"));
    CHECK(has(text, "FAIL: 1 of 2 combinations fails; the cap overturns in S2"));
    // S1's dropped pile is named by its state word.
    CHECK(has(text, "  B1   -1.350  1.350        0.0          0.0       0.000 none        dropped out pass"));
  }
  SECTION("CSV") {
    const std::string csv = render_check(m.report, Format::csv);
    CHECK(has(csv, "status,reason,max utilization,pile,combination,check,failed combinations,"
                   "combinations,piles\nfail,the cap overturns in S2,0.847,A2,S1,compression,1,2,4\n"));
    CHECK(has(csv, "# Combination S2 (service): 0.25·D + 1.0·O — overturned\n"
                   "pile,x (m),y (m),axial (kN),lateral (kN),utilization,check,state,result\n"
                   "A1,-1.350,-1.350,-,-,-,none,overturned,fail\n"));
    // The long results table and summary.csv of --out say the same.
    for (const auto& [name, content] : check_files(m.report)) {
      if (name == "summary.csv") CHECK(has(content, "fail,the cap overturns in S2,"));
      if (name == "results.csv") {
        CHECK(count(content, "\nS2,") == 4);
        CHECK(count(content, ",-,-,-,none,overturned,fail\n") == 4);
      }
    }
  }
  SECTION("Markdown") {
    const std::string md = render_check(m.report, Format::markdown);
    CHECK(has(md, "## Combination S2 (service): 0.25·D + 1.0·O — overturned\n"));
    CHECK(has(md, "| A1 | -1.350 | -1.350 | - | - | - | none | overturned | fail |\n"));
    CHECK(has(md, "| B1 | -1.350 | 1.350 | 0.0 | 0.0 | 0.000 | none | dropped out | pass |\n"));
  }
  SECTION("JSON") {
    const auto doc = check_json(m.report);
    const auto& s2 = doc["combinations"][1];
    CHECK(s2["status"] == "overturned");
    for (const auto& p : s2["piles"]) {
      CHECK(p["state"] == "overturned");
      CHECK(p["pass"] == false);
      CHECK(p["axial"].is_null());
      CHECK(p["utilization"].is_null());
    }
    CHECK(doc["combinations"][0]["status"] == "pass");
    CHECK(doc["combinations"][0]["piles"][2]["state"] == "dropped out");
    CHECK(doc["combinations"][0]["piles"][1]["governing"] == "compression");
    CHECK(doc["summary"]["pass"] == false);
    CHECK(doc["summary"]["reasons"][0] == "the cap overturns in S2");
    CHECK(doc["command"] == "cairn check mixed.yaml");
  }
  SECTION("HTML") {
    HtmlReportInput input;
    input.check = &m.report;
    const std::string html = render_html_report(input);
    // The title block names the overturned combination under the verdict.
    CHECK(has(html, "id=\"overturned\">Overturned: S2 — "));
    CHECK(has(html, "<p class=\"status fail\" id=\"status\">FAIL: 1 of 2 combinations fails; the cap overturns in S2"));
    // The plan: a banner, and every pile marked as failing by shape.
    CHECK(has(html, "class=\"overturned\""));
    CHECK(count(html, "<g class=\"pile failing\"") == 4);
    // The S2 table: four failing rows, the state overturned.
    CHECK(count(html, "<td class=\"fail\">overturned</td>") == 4);
    CHECK(has(html, "<tr><th>command</th><td><code>cairn check mixed.yaml</code></td></tr>"));
  }
}

TEST_CASE("outputs: no combination is named for a zero force", "[report]") {
  const Mixed m;
  // No pile is ever in tension and none carries shear (the piles take no lateral load).
  for (const auto& e : m.run.results.envelope) {
    CHECK_FALSE(e.max_tension.combination.has_value());
    CHECK_FALSE(e.max_lateral.combination.has_value());
  }
  // B1 carries nothing in S1 (dropped out) and S2 has no forces: no combination at all.
  CHECK_FALSE(m.run.results.envelope[2].max_compression.combination.has_value());
  CHECK_FALSE(m.run.results.envelope[2].max_utilization.combination.has_value());
  const std::string text = render_check(m.report, Format::text);
  CHECK(has(text, "  A2                 1185.2 S1                       0.0 -                        0.0 -"));
  CHECK(has(text, "  B1                    0.0 -                        0.0 -                        0.0 -"));
  const auto doc = check_json(m.report);
  CHECK(doc["envelope"][0]["max_tension"]["combination"].is_null());
}

TEST_CASE("outputs: a value that rounds to zero prints without a minus sign", "[report]") {
  CHECK(fixed_text(-0.0, 3) == "0.000");
  CHECK(fixed_text(-0.0004, 3) == "0.000");
  CHECK(fixed_text(-0.04, 1) == "0.0");
  CHECK(fixed_text(-0.0006, 3) == "-0.001");  // a value that does not round to zero keeps it
  CHECK(fixed_text(2.5e-7, 0) == "0");
  CHECK(general_text(-0.0) == "0");
  // In a report: pile coordinates of -0.0 and round-off in the pile-head axes.
  Mixed m;
  m.run.project.piles[0].x = -0.0;
  m.run.project.piles[0].y = -1e-12;
  const std::string text = render_check(m.report, Format::text);
  CHECK_FALSE(has(text, "-0.0 "));
  CHECK_FALSE(has(text, "-0.000"));
  const std::string springs = render_springs(m.run.project, m.run.stiffness, Format::csv, "");
  CHECK_FALSE(has(springs, "-0.0000"));
  const std::string svg = render_plan_svg(m.run.project, &m.run.results, &m.run.resistances);
  CHECK_FALSE(has(svg, "\"-0.00\""));
  CHECK(has(svg, "A1 (type PC45) at (0.000, 0.000) m"));
}

TEST_CASE("outputs: rotations below the display resolution print as 0", "[report]") {
  // Displacements print to 0.001 mm: a rotation that moves no pile head (reach 5 m) by half
  // of that is round-off.
  CHECK(rotation_text(4.1e-19, 5.0, 1e-6) == "0");
  CHECK(rotation_text(-9.9e-8, 5.0, 1e-6) == "0");
  CHECK(rotation_text(1.53851e-5, 5.0, 1e-6) == "1.539e-05");
  CHECK(rotation_text(-1.53851e-5, 5.0, 1e-6) == "-1.539e-05");
  CHECK(rotation_value(4.1e-19, 5.0, 1e-6) == 0.0);
  // The crane-rail demo under its dead load alone rotates about y only; the other two
  // rotations are round-off of the solve and print as 0.
  const CheckRun run = analyse_project(std::string(CAIRN_DEMO_DIR) + "/crane-rail-footing/cap.yaml");
  const std::string text = render_check(make_check_report(run, "", std::nullopt), Format::text);
  CHECK(has(text, "rotation (0, 1.539e-05, 0) rad"));
  for (const auto& line : lines_of(text)) {
    if (!has(line, "rotation (")) continue;
    const std::string rotation = line.substr(line.find("rotation ("));
    INFO(rotation);
    CHECK_FALSE(has(rotation.substr(0, rotation.find(')')), "e-1"));  // no 1e-19 and the like
    CHECK_FALSE(has(rotation.substr(0, rotation.find(')')), "e-2"));
  }
}

TEST_CASE("outputs: counts agree with their noun", "[report]") {
  CHECK(count_text(0, "combination") == "0 combinations");
  CHECK(count_text(1, "combination") == "1 combination");
  CHECK(count_text(2, "combination") == "2 combinations");
  CHECK(count_text(1, "pile") == "1 pile");
  CHECK(count_text(3, "cap") == "3 caps");
  const CheckRun one = analyse_project(std::string(CAIRN_TEST_DATA) + "/t8/fail.yaml");
  CHECK(summary_line(make_check_report(one, "", std::nullopt)).rfind("FAIL: 1 of 1 combination fails;", 0) == 0);
  CapSummaryRow pass_row, fail_row;
  pass_row.title = "A";
  fail_row.title = "B";
  fail_row.pass = false;
  CHECK(has(render_cap_summary({pass_row}, Format::text, ""), "PASS: the cap passes\n"));
  CHECK(has(render_cap_summary({pass_row, pass_row}, Format::text, ""), "PASS: all 2 caps pass\n"));
  CHECK(has(render_cap_summary({pass_row, fail_row}, Format::text, ""), "FAIL: 1 of 2 caps fails\n"));
  CHECK(has(render_cap_summary({fail_row, fail_row}, Format::text, ""), "FAIL: 2 of 2 caps fail\n"));
}

TEST_CASE("outputs: every Markdown table is followed by a blank line", "[report]") {
  for (const std::string file : {kMixed, std::string(CAIRN_DEMO_DIR) + "/water-tank-ring/cap.yaml"}) {
    const CheckRun run = analyse_project(file);
    const auto lines = lines_of(render_check(make_check_report(run, "", std::nullopt), Format::markdown));
    for (std::size_t i = 1; i < lines.size(); ++i) {
      INFO(file << " line " << i + 1 << ": " << lines[i]);
      if (lines[i - 1].rfind("|", 0) == 0) CHECK((lines[i].empty() || lines[i].rfind("|", 0) == 0));
    }
  }
}

TEST_CASE("outputs: the utilization colour scale is viridis from 0 to the bar's top",
          "[report]") {
  // Source: van der Walt & Smith (2015), viridis colour map (mpl-colormaps, CC0), 256-entry
  // table: entry 0 = (0.267004, 0.004874, 0.329415) → #440154; entry 128 = (0.127568,
  // 0.566949, 0.550556) → #21918c; entry 255 = (0.993248, 0.906157, 0.143936) → #fde725.
  CHECK(utilization_colour(0.0) == "#440154");
  CHECK(utilization_colour(0.6) == "#21918c");  // half way along a 0–1.2 bar
  CHECK(utilization_colour(1.2) == "#fde725");
  // Above the top, and a demand with no capacity, take the top colour.
  CHECK(utilization_colour(5.0) == "#fde725");
  CHECK(utilization_colour(std::numeric_limits<double>::infinity()) == "#fde725");
  CHECK(utilization_colour(std::nan("")) == kUncheckedColour);
  // The bar stretches to the largest utilization when that exceeds 1.2.
  CHECK(utilization_colour(2.0, 2.0) == "#fde725");
  CHECK(utilization_colour(1.0, 2.0) == "#21918c");
  // Lightness rises along the whole scale, so the order survives grayscale printing
  // (the design property of viridis, van der Walt & Smith 2015).
  double previous = -1.0;
  for (int k = 0; k <= 48; ++k) {
    const double y = luminance(utilization_colour(1.2 * k / 48.0));
    INFO("step " << k);
    CHECK(y > previous);
    previous = y;
  }
  // Text on the scale: white on the dark end, black on the light end.
  CHECK(std::string(utilization_text_colour(0.0)) == "#ffffff");
  CHECK(std::string(utilization_text_colour(1.2)) == "#000000");
}

TEST_CASE("outputs: the plan has a colour bar and marks failing piles by shape", "[report]") {
  Mixed m;
  // Every pile fails (S2 overturns): each has the bold outline and the cross, and the
  // legend shows the mark once more.
  std::string svg = render_plan_svg(m.run.project, &m.run.results, &m.run.resistances);
  CHECK(count(svg, "<g class=\"pile failing\"") == 4);
  CHECK(count(svg, "class=\"fail-mark\"") == 5);
  CHECK(has(svg, "stroke=\"#000000\" stroke-width=\"3.5\""));
  CHECK(has(svg, "bold outline and a cross"));
  CHECK(has(svg, "The cap overturns in S2"));
  // The bar runs 0 to 1.2 (largest utilization 0.847) with 1.0 marked.
  CHECK(has(svg, "class=\"colour-bar\""));
  CHECK(has(svg, "data-min=\"0\" data-max=\"1.200\""));
  CHECK(has(svg, ">1.0</text>"));
  CHECK(has(svg, "viridis, van der Walt &amp; Smith 2015"));
  // Without the overturned combination: no pile fails, none is marked, no banner.
  m.run.project.combinations.pop_back();
  m.run.results.combinations.pop_back();
  m.run.results.summary.overturned.clear();
  for (auto& e : m.run.results.envelope) e.pass = true;
  svg = render_plan_svg(m.run.project, &m.run.results, &m.run.resistances);
  CHECK(count(svg, "<g class=\"pile failing\"") == 0);
  CHECK(count(svg, "class=\"fail-mark\"") == 1);  // the legend's key only
  CHECK_FALSE(has(svg, "class=\"overturned\""));
  // A utilization above 1.2 stretches the bar to it; that pile is marked as failing.
  m.run.results.envelope[1].max_utilization.value = 1.73;
  CHECK(utilization_scale_max(&m.run.results) == 1.73);
  svg = render_plan_svg(m.run.project, &m.run.results, &m.run.resistances);
  CHECK(has(svg, "data-max=\"1.730\""));
  CHECK(count(svg, "<g class=\"pile failing\" data-pile=\"A2\"") == 1);
}

TEST_CASE("outputs: the plan legend describes each load point by its own loads", "[report]") {
  const Mixed m;
  const std::string svg = render_plan_svg(m.run.project, &m.run.results, &m.run.resistances);
  // One point (the column at the origin) with three loads, one per case, in kN and kN·m.
  CHECK(has(svg, "L1 at (0.000, 0.000) m: D column C1: Fz -2000.0 kN; E column C1: Mx 1600.0 "
                 "kN·m, My 1600.0 kN·m;"));
  CHECK(has(svg, "O column C1: My 3000.0 kN·m</text>"));
}

TEST_CASE("outputs: the report header shows the command as it was run", "[report]") {
  std::ostringstream out, err;
  const std::string file = kMixed;
  const char* argv[] = {"/usr/local/bin/cairn", "check", file.c_str(), "--format", "json"};
  CHECK(run_command_line(5, argv, out, err) == kExitFail);
  const auto doc = nlohmann::json::parse(out.str());
  // The program's folder is left out (it would tie the outputs to one machine).
  CHECK(doc["command"] == "cairn check " + file + " --format json");
  std::ostringstream text, err2;
  const char* argv2[] = {"cairn", "check", file.c_str()};
  run_command_line(3, argv2, text, err2);
  CHECK(has(text.str(), "\ncommand: cairn check " + file + "\n"));
}
