// Tests of the calculation package (html_report.hpp) and the plan drawing (plan_svg.hpp).
// The inputs are built here as plain structs, so these tests exercise only the rendering.
#include <catch2/catch.hpp>

#include <array>
#include <cmath>
#include <limits>
#include <stdexcept>
#include <string>

#include "cairn/output/html_report.hpp"
#include "cairn/output/plan_svg.hpp"

#include "support.hpp"

using namespace cairn;

using cairn::test::count;

namespace {

// Three round piles 0.6 m wide at (0, 0), (1, 0) and (0, 1) m, the last battered 1:4 toward
// +y; one load case with one column load; one service combination.
struct Fixture {
  Project project;
  std::vector<PileTypeResistance> resistances;
  CheckResults results;
  CheckReport report;

  explicit Fixture(const std::vector<double>& utilizations = {0.3, 0.65, 1.2}) {
    project.file = "cap.yaml";
    project.title = "Cap <C4> & grid B";
    project.cap.thickness = 1.0;
    Outline outline;
    outline.polygon = {{-0.8, -0.8}, {1.8, -0.8}, {1.8, 1.8}, {-0.8, 1.8}};
    project.cap.outline = outline;
    PileType type;
    type.id = "D60";
    type.section = {SectionShape::round, 0.6};
    type.length = 12.0;
    project.pile_types.push_back(type);
    Pile p1;
    p1.id = "P1";
    Pile p2 = p1;
    p2.id = "P2";
    p2.x = 1.0;
    Pile p3 = p1;
    p3.id = "P3";
    p3.y = 1.0;
    p3.batter = Batter{4.0, 90.0};
    project.piles = {p1, p2, p3};
    LoadCase d;
    d.id = "D";
    d.kind = LoadKind::dead;
    PointLoad column;
    column.at = {0.4, 0.3, 1.0};
    column.load = {0, 0, -900, 0, 0, 0};
    column.note = "C4";
    d.loads.push_back(column);
    project.load_cases.push_back(d);
    Combination s1;
    s1.id = "S1";
    s1.factors = {{0, 1.0}};
    project.combinations.push_back(s1);

    PileTypeResistance r;
    r.allowable.compression = 500.0;
    r.allowable.tension = 100.0;
    r.allowable.source = "given in the file";
    resistances.push_back(r);

    CombinationCheck cc;
    cc.combination = 0;
    bool pass = true;
    for (std::size_t i = 0; i < utilizations.size(); ++i) {
      PileCheck pc;
      pc.axial = 500.0 * utilizations[i];
      pc.utilization = utilizations[i];
      pc.governing = Demand::compression;
      pc.pass = utilizations[i] <= 1.0;
      pass = pass && pc.pass;
      cc.piles.push_back(pc);
      PileEnvelope e;
      e.max_compression = {pc.axial, 0};
      e.max_utilization = {utilizations[i], 0};
      results.envelope.push_back(e);
    }
    cc.pass = pass;
    cc.max_utilization = utilizations.back();
    cc.governing_pile = utilizations.size() - 1;
    results.combinations.push_back(cc);
    results.summary.pass = pass;
    results.summary.max_utilization = cc.max_utilization;
    results.summary.pile = cc.governing_pile;
    results.summary.combination = 0;
    results.summary.failed_combinations = pass ? 0 : 1;

    report.project = &project;
    report.results = &results;
    report.resistances = &resistances;
    report.assumptions = {"The cap is rigid.", "Pile heads are pinned."};
    report.options = "report --out out";
  }
};

// The number in attribute `name` of the first element after `marker`.
double attribute_after(const std::string& text, const std::string& marker, const std::string& name) {
  const auto at = text.find(marker);
  REQUIRE(at != std::string::npos);
  const auto attr = text.find(" " + name + "=\"", at);
  REQUIRE(attr != std::string::npos);
  return std::stod(text.substr(attr + name.size() + 3));
}

// A sample Vesić tip in sand, with the intermediate values of the capacity module's output
// for the 0.45 m square, 18 m pile of the check fixture (dense sand, φ = 36°).
PileTypeCapacity vesic_sample() {
  PileTypeCapacity c;
  c.type = 0;
  c.geometry.width = 0.6;
  c.geometry.round = true;
  c.geometry.length = 12.0;
  c.geometry.head_depth = 1.5;
  TipDetails& d = c.result.tip_details;
  d.method = "vesic";
  d.tip_method = TipMethod::vesic;
  d.layer = "dense sand";
  d.depth = 13.5;
  d.area = c.geometry.area();
  d.q_prime = 213.1;
  d.k0 = 0.412;
  d.sigma_o = 129.6;
  d.n_sigma = 86.99;
  d.unit_tip = 129.6 * 86.99;
  c.result.tip = d.unit_tip * d.area;
  LayerShaft layer;
  layer.name = "soft clay";
  layer.method = "alpha-api";
  layer.shaft_method = ShaftMethod::alpha_api;
  layer.top = 1.5;
  layer.bottom = 8.0;
  layer.unit_average = 27.2;
  layer.shaft = 318.0;
  c.result.layers.push_back(layer);
  c.result.shaft = 318.0;
  c.result.ultimate_compression = c.result.tip + c.result.shaft;
  c.result.safety_factor_tip = c.result.safety_factor_shaft = 2.5;
  c.result.safety_factor_tension = 3.0;
  for (double length : {3.0, 6.0, 9.0, 12.0})
    c.depth_table.push_back({length, length + 1.5, 100.0 * length, 20.0 * length,
                             120.0 * length, 15.0 * length});
  return c;
}

}  // namespace

TEST_CASE("html_report: one self-contained document with plan, results and caution",
          "[html_report]") {
  Fixture f;
  const std::vector<PileTypeCapacity> none;
  HtmlReportInput input{&f.report, &none, {}};
  const std::string html = render_html_report(input);
  CHECK(html.rfind("<!DOCTYPE html>", 0) == 0);
  CHECK(html.find("</html>") != std::string::npos);
  CHECK(count(html, "<svg") == 1);  // the plan; no depth chart without a depth table
  CHECK(count(html, "<svg") == count(html, "</svg>"));
  CHECK(count(html, "<table") == count(html, "</table>"));
  CHECK(count(html, "<section") == count(html, "</section>"));
  CHECK(html.find(kCaution) != std::string::npos);
  for (const auto& pile : f.project.piles) {
    INFO(pile.id);
    CHECK(html.find("data-pile=\"" + pile.id + "\"") != std::string::npos);
    CHECK(html.find("<td>" + pile.id + "</td>") != std::string::npos);
  }
  // Self-contained: no scripts, no external styles, images or fonts.
  CHECK(html.find("<script") == std::string::npos);
  CHECK(html.find("<link") == std::string::npos);
  CHECK(html.find("src=") == std::string::npos);
  CHECK(html.find("@import") == std::string::npos);
  CHECK(html.find("@media print") != std::string::npos);
  // Assumptions and the failing pile are stated.
  CHECK(html.find("Pile heads are pinned.") != std::string::npos);
  CHECK(html.find("class=\"status fail\"") != std::string::npos);
  CHECK(html.find("class=\"status pass\"") == std::string::npos);
}

TEST_CASE("html_report: user text is escaped", "[html_report]") {
  Fixture f;
  f.project.load_cases[0].loads[0].note = "C<4>";
  HtmlReportInput input{&f.report, nullptr, {}};
  const std::string html = render_html_report(input);
  CHECK(html.find("<title>Pile cap check: Cap &lt;C4&gt; &amp; grid B</title>") != std::string::npos);
  CHECK(html.find("<C4>") == std::string::npos);
  CHECK(html.find("C&lt;4&gt;") != std::string::npos);
  CHECK(html.find("<4>") == std::string::npos);
  CHECK(xml_escape("a<b>&\"c'") == "a&lt;b&gt;&amp;&quot;c&#39;");
}

TEST_CASE("html_report: a passing check says so and extra sections come before the caution",
          "[html_report]") {
  Fixture f({0.2, 0.4, 0.7});
  HtmlReportInput input{&f.report, nullptr, {"<section id=\"group\"><h2>Group</h2></section>"}};
  const std::string html = render_html_report(input);
  CHECK(html.find("class=\"status pass\"") != std::string::npos);
  CHECK(html.find("class=\"status fail\"") == std::string::npos);
  const auto group = html.find("<section id=\"group\">");
  REQUIRE(group != std::string::npos);
  CHECK(group < html.find(kCaution));
}

TEST_CASE("html_report: an incomplete check report is refused", "[html_report]") {
  HtmlReportInput input;
  CHECK_THROWS_AS(render_html_report(input), std::invalid_argument);
}

TEST_CASE("html_report: the capacity breakdown substitutes the sample's numbers",
          "[html_report]") {
  Fixture f;
  const std::vector<PileTypeCapacity> capacities{vesic_sample()};
  HtmlReportInput input{&f.report, &capacities, {}};
  const std::string html = render_html_report(input);
  // Vesić (1977): q_p = σ'o·N*σ; the product of the displayed values 129.6·86.99 = 11273.9.
  CHECK(html.find("q_p = σ&#39;o·N*σ = 129.6·86.99 = 11273.9 kPa") != std::string::npos);
  CHECK(html.find("Q_tip = q_p·A_tip = 11273.9·0.2827") != std::string::npos);
  CHECK(html.find("e.g. &#39;soft clay&#39;: Q_s = f̄·p·ΔL = 27.2·1.885·6.500 = 318.0 kN") !=
        std::string::npos);
  // The depth chart: a second SVG with both curves and labelled axes in project units.
  CHECK(count(html, "<svg") == 2);
  CHECK(html.find("class=\"compression\"") != std::string::npos);
  CHECK(html.find("class=\"tension\"") != std::string::npos);
  CHECK(html.find("ultimate capacity (kN)") != std::string::npos);
  CHECK(html.find("pile length, head to tip (m)") != std::string::npos);
}

TEST_CASE("html_report: tables mark numbers, utilizations and failing states",
          "[html_report]") {
  Table t;
  t.title = "Combination <S1>";
  t.headers = {"pile", "utilization", "check", "state", "result"};
  t.numeric = {false, true, false, false, false};
  t.rows = {{"P1", "0.300", "compression", "in contact", "pass"},
            {"P2", "1.200", "compression", "in contact", "fail"},
            {"P3", "-", "none", "overturned", "fail"}};
  const std::string html = render_table_html(t);
  CHECK(html.find("<caption>Combination &lt;S1&gt;</caption>") != std::string::npos);
  // Utilization cells carry the plan's colour, with text that reads on it.
  CHECK(html.find("<td class=\"num\" style=\"background:" + utilization_colour(0.3) + ";color:" +
                  utilization_text_colour(0.3) + "\">0.300</td>") != std::string::npos);
  CHECK(html.find("<td class=\"num\" style=\"background:" + utilization_colour(1.2) + ";color:" +
                  utilization_text_colour(1.2) + "\">1.200</td>") != std::string::npos);
  CHECK(html.find("<td class=\"fail\">overturned</td>") != std::string::npos);
  CHECK(count(html, std::string("<td class=\"fail\">fail</td>")) == 2);
  CHECK(html.find("<td class=\"ok\">pass</td>") != std::string::npos);
}

TEST_CASE("plan_svg: piles are drawn to scale relative to the origin", "[html_report]") {
  Fixture f;
  const std::string svg = render_plan_svg(f.project, &f.results, &f.resistances);
  const PlanFrame frame = plan_frame(f.project);
  CHECK(attribute_after(svg, "<svg", "data-px-per-m") == Approx(frame.scale).epsilon(1e-6));
  const double ox = attribute_after(svg, "id=\"origin\"", "cx");
  const double oy = attribute_after(svg, "id=\"origin\"", "cy");
  // Coordinates are printed to 0.01 px, hence the 0.01 px margin.
  const double margin = 0.011;
  // P1 at (0, 0) m sits on the origin marker.
  CHECK(attribute_after(svg, "data-pile=\"P1\"", "cx") == Approx(ox).margin(margin));
  CHECK(attribute_after(svg, "data-pile=\"P1\"", "cy") == Approx(oy).margin(margin));
  // P2 at x = 1 m is one metre to the right: scale px further along +x, same height.
  CHECK(attribute_after(svg, "data-pile=\"P2\"", "cx") - ox == Approx(frame.scale).margin(margin));
  CHECK(attribute_after(svg, "data-pile=\"P2\"", "cy") == Approx(oy).margin(margin));
  // P3 at y = 1 m is up the page (SVG y grows downward).
  CHECK(oy - attribute_after(svg, "data-pile=\"P3\"", "cy") == Approx(frame.scale).margin(margin));
  // Drawn at the section size: radius 0.3 m.
  CHECK(attribute_after(svg, "data-pile=\"P2\"", "r") == Approx(0.3 * frame.scale).margin(margin));
  // The scale bar's length in px is its labelled length times the scale.
  const double bar_m = attribute_after(svg, "id=\"scale-bar\"", "data-length");
  CHECK(attribute_after(svg, "id=\"scale-bar\"", "width") == Approx(bar_m * frame.scale).margin(margin));
  // Everything fits: the outline's corners lie inside the drawing.
  CHECK(ox + 1.8 * frame.scale < frame.width);
  CHECK(ox - 0.8 * frame.scale > 0.0);
  CHECK(oy - 1.8 * frame.scale > 0.0);
  CHECK(svg.find("+x</text>") != std::string::npos);
  CHECK(svg.find("+y</text>") != std::string::npos);
  // The column, by its own load.
  CHECK(svg.find(">L1 at (0.400, 0.300) m: D C4: Fz -900.0 kN</text>") != std::string::npos);
  CHECK(attribute_after(svg, "class=\"load-point\"", "cx") - ox == Approx(0.4 * frame.scale).margin(margin));
}

TEST_CASE("plan_svg: the batter arrow points toward the toe, length proportional to 1/ratio",
          "[html_report]") {
  Fixture f;
  std::string svg = render_plan_svg(f.project, nullptr, nullptr);
  auto arrow = [&](const std::string& drawing) {
    const double x1 = attribute_after(drawing, "class=\"batter\"", "x1");
    const double y1 = attribute_after(drawing, "class=\"batter\"", "y1");
    const double x2 = attribute_after(drawing, "class=\"batter\"", "x2");
    const double y2 = attribute_after(drawing, "class=\"batter\"", "y2");
    return std::array<double, 2>{x2 - x1, y2 - y1};
  };
  const auto toward_y = arrow(svg);
  CHECK(toward_y[0] == Approx(0.0).margin(0.011));
  CHECK(toward_y[1] < 0.0);  // toward +y is up the page
  CHECK(svg.find(">1:4</text>") != std::string::npos);
  f.project.piles[2].batter = Batter{8.0, 0.0};
  svg = render_plan_svg(f.project, nullptr, nullptr);
  const auto toward_x = arrow(svg);
  CHECK(toward_x[0] > 0.0);
  CHECK(toward_x[1] == Approx(0.0).margin(0.011));
  // Half the slope, half the length.
  CHECK(toward_x[0] == Approx(-toward_y[1] / 2.0).margin(0.03));
}

TEST_CASE("plan_svg: piles are coloured by their largest utilization", "[html_report]") {
  // The continuous scale (viridis) is pinned in tests/test_outputs.cpp; here: ordered and
  // different along the bar, the same above its top.
  CHECK(utilization_colour(0.3) != utilization_colour(0.6));
  CHECK(utilization_colour(0.6) != utilization_colour(0.9));
  CHECK(utilization_colour(0.9) != utilization_colour(1.2));
  CHECK(utilization_colour(1.2) == utilization_colour(std::numeric_limits<double>::infinity()));

  Fixture f({0.3, 0.9, 1.2});
  const std::string svg = render_plan_svg(f.project, &f.results, &f.resistances);
  CHECK(svg.find("data-pile=\"P1\" data-utilization-colour=\"" + utilization_colour(0.3)) != std::string::npos);
  CHECK(svg.find("data-pile=\"P2\" data-utilization-colour=\"" + utilization_colour(0.9)) != std::string::npos);
  CHECK(svg.find("data-pile=\"P3\" data-utilization-colour=\"" + utilization_colour(1.2)) != std::string::npos);
  CHECK(svg.find("max utilization</text>") != std::string::npos);  // the legend
  // Without results every pile is grey.
  const std::string plain = render_plan_svg(f.project, nullptr, nullptr);
  CHECK(count(plain, std::string("data-utilization-colour=\"") + kUncheckedColour) == 3);
}

TEST_CASE("plan_svg: US projects get a scale bar in feet", "[html_report]") {
  Fixture f;
  f.project.units = UnitSystem::US;
  const std::string svg = render_plan_svg(f.project, nullptr, nullptr);
  const PlanFrame frame = plan_frame(f.project);
  const double bar_ft = attribute_after(svg, "id=\"scale-bar\"", "data-length");
  CHECK(svg.find("data-unit=\"ft\"") != std::string::npos);
  // 1 ft = 0.3048 m exactly (international foot, NIST SP 811).
  CHECK(attribute_after(svg, "id=\"scale-bar\"", "width") ==
        Approx(bar_ft * 0.3048 * frame.scale).margin(0.011));
}
