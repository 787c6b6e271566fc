// Tests of the calculation package (html_package.hpp, app/package.hpp), the markup helper
// (markup.hpp) and the package: keys (package_keys.hpp), on the test fixtures and the demo
// projects analysed end to end.
#include <catch2/catch.hpp>

#include <algorithm>
#include <string>
#include <vector>

#include "cairn/app/analysis.hpp"
#include "cairn/app/package.hpp"
#include "cairn/input/input.hpp"
#include "cairn/output/html_package.hpp"
#include "cairn/output/markup.hpp"
#include "cairn/output/output_files.hpp"

#include "support.hpp"

using namespace cairn;

using cairn::test::has;
using cairn::test::count;

namespace {

const std::string kData = std::string(CAIRN_TEST_DATA) + "/";
const std::string kDemo = std::string(CAIRN_DEMO_DIR) + "/";

std::vector<std::string> formatted(const InputError& e) {
  std::vector<std::string> out;
  for (const auto& d : e.diagnostics()) out.push_back(d.format());
  return out;
}

}  // namespace

TEST_CASE("markup: escaping for content, attributes and CSS strings", "[markup]") {
  CHECK(html_escape("a<b>&\"c'") == "a&lt;b&gt;&amp;&quot;c&#39;");
  CHECK(attribute_escape("x\"y\nz\tw") == "x&quot;y&#10;z&#9;w");
  CHECK(css_string_escape("say \"hi\"\\\n</style>") == "say \\\"hi\\\"\\\\\\A \\3C /style>");
}

TEST_CASE("markup: the colour scale's ends are viridis' first and last entries",
          "[markup][published]") {
  // van der Walt & Smith 2015, mpl-colormaps, viridis entries 0 (0.267004, 0.004874,
  // 0.329415) and 255 (0.993248, 0.906157, 0.143936), rounded to bytes.
  CHECK(utilization_colour(0.0, 1.2) == "#440154");
  CHECK(utilization_colour(1.2, 1.2) == "#fde725");
  CHECK(utilization_colour(5.0, 1.2) == "#fde725");
  CHECK(std::string(utilization_text_colour(0.0, 1.2)) == "#ffffff");
  CHECK(std::string(utilization_text_colour(1.2, 1.2)) == "#000000");
}

TEST_CASE("package_keys: the sign-off block and the combinations shown are read",
          "[package]") {
  const Project p = read_project(kData + "package/good_package.yaml");
  CHECK(p.package.revision == "C");
  CHECK(p.package.date == "2026-12-01");
  CHECK(p.package.prepared_by == "A. Engineer");
  CHECK(p.package.checked_by == "B. Checker");
  CHECK(p.package.show_combinations == std::vector<std::string>{"S1"});
  REQUIRE(!p.input_files.empty());
  CHECK(p.input_files.front() == kData + "package/good_package.yaml");
}

TEST_CASE("package_keys: an unknown key, a list for text and an unknown combination",
          "[package]") {
  const std::string file = kData + "package/bad_package.yaml";
  try {
    read_project(file);
    FAIL("expected an InputError");
  } catch (const InputError& e) {
    CHECK(formatted(e) ==
          std::vector<std::string>{
              file + ":25:3: error: package.revison: unknown key; did you mean 'revision'?",
              file + ":26:16: error: package.prepared_by: expected text, got a list",
              file + ":27:27: error: package.show_combinations: combination 'S2' does not "
                     "exist; did you mean 'S1'?"});
  }
}

TEST_CASE("package: page names from the title, else the folder, else the file", "[package]") {
  Project titled, same, untitled, bare;
  titled.file = "east/cap.yaml";
  titled.title = "Pier 4 / North cap";
  same = titled;
  same.file = "west/cap.yaml";
  untitled.file = "bents/bent-7/cap.yaml";
  untitled.title = "cap";  // no title key: the reader titles a project by its file's stem
  bare.file = "p12.yaml";
  bare.title = "p12";
  const auto names = package_page_names({&titled, &same, &untitled, &bare});
  CHECK(names == std::vector<std::string>{"pier-4-north-cap", "pier-4-north-cap-2", "bent-7", "p12"});
}

TEST_CASE("package: with many combinations only those that matter get a table", "[package]") {
  const CheckRun run = analyse_project(kDemo + "conveyor-pier-us/cap.yaml");
  const auto& results = run.results;
  REQUIRE(results.combinations.size() > kFullCombinationsLimit);
  const auto shown = combinations_shown(run.project, results);
  const auto n = static_cast<std::size_t>(std::count(shown.begin(), shown.end(), true));
  CHECK(n < results.combinations.size());
  CHECK(shown[*results.summary.combination]);  // the governing one
  // Named in package.show_combinations.
  for (std::size_t i = 0; i < results.combinations.size(); ++i)
    if (run.project.combinations[i].id == "ASD-2") CHECK(shown[i]);
  // Each pile's governing combination.
  for (const auto& e : results.envelope)
    if (e.max_utilization.combination) CHECK(shown[*e.max_utilization.combination]);
  // The full table: one row per pile and combination, a header and the trailer.
  const CheckReport report = make_check_report(run, "test", std::nullopt);
  const std::string csv = all_combinations_csv(report);
  CHECK(count(csv, "\n") ==
        1 + results.combinations.size() * run.project.piles.size() + run.assumptions.size() + 1);
  CHECK(csv.rfind(std::string("# ") + kCaution + "\n") != std::string::npos);
}

TEST_CASE("package: few combinations all get a table", "[package]") {
  const CheckRun run = analyse_project(kDemo + "crane-rail-footing/cap.yaml");
  const auto shown = combinations_shown(run.project, run.results);
  CHECK(std::all_of(shown.begin(), shown.end(), [](bool s) { return s; }));
}

TEST_CASE("package: one cap's page holds sign-off, contents, equilibrium, inputs", "[package]") {
  const CheckRun run = analyse_project(kDemo + "conveyor-pier-us/cap.yaml");
  const CheckReport report = make_check_report(run, "cairn report cap.yaml --out x", std::nullopt);
  CapPackageInput input;
  input.report.check = &report;
  input.inputs = {{run.project.file, "project file", "title: a\n"}};
  input.project_name = "demo";
  input.all_combinations_file = "cap-all-combinations.csv";
  const std::string html = render_cap_package_html(input);
  CHECK(has(html, "<td>R. Alvarez</td>"));
  CHECK(has(html, "<td>M. Chen</td>"));
  // The contents link every section.
  for (const char* id : {"sign-off", "design-basis", "basis", "plan", "loads", "results",
                         "capacity", "group", "equilibrium", "inputs", "appendix"})
    CHECK(has(html, std::string("<li><a href=\"#") + id + "\">"));
  // Equilibrium: a table per governing combination with the residual; the closed form for
  // this group of equal vertical piles.
  CHECK(count(html, "<td>residual</td>") == governing_combinations(run.results).size());
  CHECK(has(html, "cairn check --explain A6"));
  // The input echo: the digest of the content given.
  CHECK(has(html, sha256_hex("title: a\n")));
  CHECK(has(html, "cap-all-combinations.csv, beside this page"));
  // The loads say where they were read.
  CHECK(has(html, "<td>reactions.csv:4</td>"));
  // Print: the running header and the caution in the page margins.
  CHECK(has(html, "@top-left { content: \"demo\""));
  CHECK(has(html, "counter(page)"));
  CHECK(has(html, std::string("@bottom-center { content: \"") + kCaution));
}

TEST_CASE("package: battered piles get the general equations with numbers", "[package]") {
  const CheckRun run = analyse_project(kDemo + "crane-rail-footing/cap.yaml");
  const CheckReport report = make_check_report(run, "test", std::nullopt);
  const std::string html = render_equilibrium_section_html(report);
  CHECK(has(html, "K_cap = Σ T_iᵀ·K_i·T_i"));
  CHECK(has(html, "N = k_a·(a·u)"));
  CHECK(!has(html, "cairn check --explain"));
}

TEST_CASE("package: the index links each page and names its source", "[package]") {
  PackageIndexRow row;
  row.page = "pier-<4>.html";
  row.source = "caps/p4.yaml";
  row.title = "Pier 4";
  row.verdict = "fail";
  row.max_utilization = 1.25;
  row.pile = "A1";
  row.combination = "S1";
  row.pass = false;
  const std::string html = render_package_index_html({row}, "cairn report caps.yaml --out x");
  CHECK(has(html, "<a href=\"pier-&lt;4&gt;.html\">"));
  CHECK(has(html, "<code class=\"source\">caps/p4.yaml</code>"));
  CHECK(has(html, "<td class=\"fail\">fail</td>"));
  CHECK(has(html, "1 (1 failing)"));
  CHECK(has(html, kCaution));
}
