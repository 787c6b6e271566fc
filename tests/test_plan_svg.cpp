// Tests for plan_svg.hpp: the cap drawn in plan to scale, piles coloured by utilization on
// the viridis scale, failing piles marked by shape too.
#include <catch2/catch.hpp>

#include <cmath>
#include <limits>
#include <stdexcept>
#include <string>

#include "cairn/app/analysis.hpp"
#include "cairn/output/plan_svg.hpp"
#include "support.hpp"

using namespace cairn;
using cairn::test::close;
using cairn::test::contains;
using cairn::test::occurrences;

namespace {

CheckRun run_of(const std::string& name) {
  return analyse_project(std::string(CAIRN_TEST_DATA) + "/" + name);
}

}  // namespace

TEST_CASE("plan_svg: the colour scale runs from viridis' first entry to its last",
          "[plan_svg][published]") {
  // van der Walt & Smith (2015), mpl-colormaps, viridis: entry 0 #440154, entry 255 #fde725.
  CHECK(utilization_colour(0.0) == "#440154");
  CHECK(utilization_colour(1.2) == "#fde725");
  CHECK(utilization_colour(2.0, 2.0) == "#fde725");
  // Above the top and a demand with no capacity take the top colour; NaN is unchecked.
  CHECK(utilization_colour(5.0) == "#fde725");
  CHECK(utilization_colour(std::numeric_limits<double>::infinity()) == "#fde725");
  CHECK(utilization_colour(std::nan("")) == kUncheckedColour);
  // Dark at the bottom of the scale, light at the top: white ink below, black above.
  CHECK(std::string(utilization_text_colour(0.0)) != utilization_text_colour(1.2));
}

TEST_CASE("plan_svg: the colour bar's top is at least 1.2 and covers the largest utilization",
          "[plan_svg]") {
  CHECK(utilization_scale_max(nullptr) == kUtilizationScaleMin);
  const CheckRun fail = run_of("t8/fail.yaml");
  // Hand check in the fixture (P/n ± M·x/Σx²): 1533.33/1400 = 1.0952 < 1.2, so the bar
  // stays at 1.2.
  CHECK(utilization_scale_max(&fail.results) == kUtilizationScaleMin);
}

TEST_CASE("plan_svg: every pile is drawn once, failing piles marked by shape", "[plan_svg]") {
  const CheckRun run = run_of("t8/fail.yaml");
  const std::string svg = render_plan_svg(run.project, &run.results, &run.resistances);
  CHECK(svg.rfind("<svg xmlns=\"http://www.w3.org/2000/svg\"", 0) == 0);
  CHECK(occurrences(svg, "<svg") == 1);
  CHECK(occurrences(svg, "</svg>") == 1);
  for (const auto& pile : run.project.piles) {
    INFO(pile.id);
    CHECK(occurrences(svg, "data-pile=\"" + pile.id + "\"") == 1);
  }
  // The fixture's hand check (P/n ± M·x/Σx²): 1500 ± 33.33 kN on piles of 1400 kN, so all
  // four are over capacity (1466.7 and 1533.3 kN).
  CHECK(occurrences(svg, "class=\"pile failing\"") == 4);
  // One cross on each failing pile and one in the legend's key.
  CHECK(occurrences(svg, "class=\"fail-mark\"") == 5);
  CHECK(contains(svg, "class=\"pile failing\" data-pile=\"A2\""));
  CHECK(contains(svg, "class=\"pile failing\" data-pile=\"B1\""));
  CHECK(contains(svg, "class=\"outline\""));  // the file gives the cap's outline
  CHECK(contains(svg, "class=\"scale-bar\""));
  CHECK(contains(svg, "class=\"colour-bar\""));
}

TEST_CASE("plan_svg: without results the piles are grey and nothing fails", "[plan_svg]") {
  const CheckRun run = run_of("t8/pass.yaml");
  const std::string svg = render_plan_svg(run.project, nullptr, nullptr);
  CHECK(occurrences(svg, "data-utilization-colour=\"" + std::string(kUncheckedColour) + "\"") ==
        run.project.piles.size());
  CHECK_FALSE(contains(svg, "fail-mark"));
}

TEST_CASE("plan_svg: the frame maps metres to the drawing with one scale", "[plan_svg]") {
  const CheckRun run = run_of("t8/fail.yaml");
  for (double width : {320.0, 640.0}) {
    INFO(width);
    const PlanFrame f = plan_frame(run.project, width);
    CHECK(f.scale > 0.0);
    CHECK(f.width == width);
    // X = origin_x + scale·x, Y = origin_y − scale·y (the header's mapping): every pile
    // head and the origin land inside the drawing, +y up the page.
    for (const auto& pile : run.project.piles) {
      const double x = f.origin_x + f.scale * pile.x, y = f.origin_y - f.scale * pile.y;
      CHECK((x > 0.0 && x < f.width));
      CHECK((y > 0.0 && y < f.height));
    }
    CHECK((f.origin_x > 0.0 && f.origin_x < f.width));
    const Pile& a1 = run.project.piles[0];  // A1 at (−1.35, −1.35) m: left of and below B2
    const Pile& b2 = run.project.piles[3];
    CHECK(f.origin_x + f.scale * a1.x < f.origin_x + f.scale * b2.x);
    CHECK(f.origin_y - f.scale * a1.y > f.origin_y - f.scale * b2.y);
  }
  CHECK_THROWS_AS(plan_frame(run.project, 1.0), std::invalid_argument);
}

TEST_CASE("plan_svg: text is escaped for XML", "[plan_svg]") {
  CHECK(xml_escape("P<1> & \"A\" 'B'") == "P&lt;1&gt; &amp; &quot;A&quot; &#39;B&#39;");
  CHECK(xml_escape("plain") == "plain");
}
