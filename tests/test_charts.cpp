// Tests for charts.hpp and html_nonlinear.hpp: round tick values, the depth diagrams of the
// governing piles (on the closed form of a long elastic pile), the pushover chart (on a
// bilinear curve made up for the test) and the package section that holds them.
#include <catch2/catch.hpp>

#include <cmath>
#include <numbers>
#include <random>
#include <string>
#include <vector>

#include "cairn/app/analysis.hpp"
#include "cairn/checks/checks.hpp"
#include "cairn/core/quantity_format.hpp"
#include "cairn/core/units.hpp"
#include "cairn/output/charts.hpp"
#include "cairn/output/html_nonlinear.hpp"
#include "cairn/output/html_package.hpp"

#include "support.hpp"

using namespace cairn;
using cairn::test::close;
using cairn::test::count;
using cairn::test::has;

namespace {

// A small check that `text` is well-formed markup: every tag closed in order, one root
// element, comments and declarations skipped, attribute values quoted, and every '&' the
// start of a character reference (XML 1.0 (Fifth Edition) §2.4, §3.1, §4.1).
std::string markup_problem(const std::string& text, bool one_root) {
  std::vector<std::string> open;
  int roots = 0;
  std::size_t at = 0;
  while (at < text.size()) {
    const char c = text[at];
    if (c == '&') {
      const std::size_t end = text.find(';', at);
      if (end == std::string::npos || end - at > 8) return "bare '&' at " + std::to_string(at);
      const std::string ref = text.substr(at + 1, end - at - 1);
      const bool named =
          ref == "amp" || ref == "lt" || ref == "gt" || ref == "quot" || ref == "apos";
      const bool numeric = ref.size() > 1 && ref[0] == '#' &&
                           ref.find_first_not_of("0123456789", 1) == std::string::npos;
      if (!named && !numeric) return "unknown reference &" + ref + ";";
      at = end + 1;
      continue;
    }
    if (c != '<') {
      ++at;
      continue;
    }
    if (text.compare(at, 4, "<!--") == 0) {
      at = text.find("-->", at);
      if (at == std::string::npos) return "unclosed comment";
      at += 3;
      continue;
    }
    if (text.compare(at, 2, "<!") == 0 || text.compare(at, 2, "<?") == 0) {
      at = text.find('>', at) + 1;
      continue;
    }
    const std::size_t end = text.find('>', at);
    if (end == std::string::npos) return "unclosed tag at " + std::to_string(at);
    std::string tag = text.substr(at + 1, end - at - 1);
    at = end + 1;
    if (count(tag, "\"") % 2 != 0) return "unbalanced quotes in <" + tag + ">";
    if (tag.front() == '/') {
      const std::string name = tag.substr(1);
      if (open.empty() || open.back() != name) return "</" + name + "> closes nothing open";
      open.pop_back();
      continue;
    }
    const bool empty_element = tag.back() == '/';
    const std::string name = tag.substr(0, tag.find_first_of(" \n/"));
    if (open.empty()) ++roots;
    if (!empty_element) open.push_back(name);
  }
  if (!open.empty()) return "<" + open.back() + "> never closed";
  if (one_root && roots != 1) return std::to_string(roots) + " root elements";
  return "";
}

// The numbers of a data attribute, e.g. data-plot="78.00 58.00 520.00 400.00".
std::vector<double> attribute_numbers(const std::string& svg, const std::string& name,
                                      std::size_t from = 0) {
  const std::string key = name + "=\"";
  const std::size_t at = svg.find(key, from);
  REQUIRE(at != std::string::npos);
  const std::size_t begin = at + key.size();
  const std::string value = svg.substr(begin, svg.find('"', begin) - begin);
  std::vector<double> numbers;
  std::size_t pos = 0;
  while (pos < value.size()) {
    std::size_t used = 0;
    numbers.push_back(std::stod(value.substr(pos), &used));
    pos += used;
  }
  return numbers;
}

// A long pile in uniform elastic soil with a lateral load H at a free head, no head moment:
// the closed form of the beam on an elastic foundation (Hetényi 1946, Beams on Elastic
// Foundation, the semi-infinite beam with an end force; the closed form from memory), with λ = (k/(4·EI))^¼ and k the
// soil's modulus per unit length of pile (kN/m²):
//     y(z) = (2·H·λ/k)·e^(−λz)·cos λz,   M(z) = (H/λ)·e^(−λz)·sin λz,
//     V(z) = dM/dz = H·e^(−λz)·(cos λz − sin λz).
// dM/dz = 0 gives tan λz = 1: the largest moment is at λz = π/4, M_max = (H/λ)·e^(−π/4)·sin(π/4)
// = 0.3224·H/λ (hand derivation from the closed form).
constexpr double kH = 100.0;      // kN
constexpr double kEI = 1.0e5;     // kN·m²
constexpr double kSoil = 4.0e4;   // kN/m²
constexpr double kLength = 20.0;  // m: λL = 11.2 > 4, a long pile
constexpr int kSegments = 400;    // dz = 0.05 m

double lambda() { return std::pow(kSoil / (4.0 * kEI), 0.25); }

PileProfile hetenyi_profile() {
  const double l = lambda();
  PileProfile p;
  p.converged = true;
  for (int i = 0; i <= kSegments; ++i) {
    const double z = kLength * i / kSegments;
    const double e = std::exp(-l * z);
    p.depth.push_back(z);
    p.deflection.push_back(2.0 * kH * l / kSoil * e * std::cos(l * z));
    p.moment.push_back(kH / l * e * std::sin(l * z));
    p.shear.push_back(kH * e * (std::cos(l * z) - std::sin(l * z)));
    p.axial.push_back(0.0);
  }
  // As the solver reports them: the largest moment found along the profile.
  for (std::size_t i = 0; i < p.moment.size(); ++i)
    if (std::abs(p.moment[i]) > std::abs(p.max_moment)) {
      p.max_moment = p.moment[i];
      p.max_moment_depth = p.depth[i];
    }
  p.head_deflection = p.deflection.front();
  return p;
}

// A bilinear load–displacement curve made up for these tests: 500 kN at λ = 1, linear at
// 25 000 kN/m up to λ = 1.2, then a tenth of that stiffness; the last step with equilibrium
// at λ = 1.75, then a mechanism.
PushoverCurve bilinear_curve(double step = 0.25) {
  PushoverCurve c;
  c.combination = "ULS-3";
  c.direction = {1.0, 0.0, 0.0};
  const double h = 500.0, k = 25000.0, yield_lambda = 1.2;
  for (double l = 0.0; l <= 1.75 + 1e-9; l += step) {
    PushoverPoint p;
    p.load_factor = l;
    p.load = l * h;
    p.displacement =
        l <= yield_lambda ? l * h / k : yield_lambda * h / k + (l - yield_lambda) * h / (0.1 * k);
    p.cap_movement[0] = p.displacement;
    c.points.push_back(p);
  }
  c.capacity_factor = c.points.back().load_factor;
  c.mechanism = true;
  c.end_reason = "no equilibrium at λ = 2.000";
  return c;
}

// Tick lists equal to rounding (0.6 computed as 3 × 0.2 is not the literal 0.6).
bool same(const std::vector<double>& a, const std::vector<double>& b) {
  if (a.size() != b.size()) return false;
  for (std::size_t i = 0; i < a.size(); ++i)
    if (std::abs(a[i] - b[i]) > 1e-12 * (1.0 + std::abs(b[i]))) return false;
  return true;
}

bool one_two_five(double step) {
  const double m = step / std::pow(10.0, std::floor(std::log10(step) + 1e-9));
  return std::abs(m - 1.0) < 1e-9 || std::abs(m - 2.0) < 1e-9 || std::abs(m - 5.0) < 1e-9;
}

// The SVG coordinate of attribute `name` ("cy") in the element after `marker`.
double coordinate_after(const std::string& svg, const std::string& marker,
                        const std::string& name) {
  const std::size_t at = svg.find(marker);
  REQUIRE(at != std::string::npos);
  return attribute_numbers(svg, name, at).front();
}

}  // namespace

TEST_CASE("charts: nice ticks step by 1, 2 or 5 × 10^k and cover the range", "[charts]") {
  // The 1-2-5 series of round numbers for axis labels: common practice.
  CHECK(nice_tick_step(1.0, 5) == Approx(0.2));
  CHECK(nice_tick_step(0.6, 6) == Approx(0.1));
  CHECK(nice_tick_step(57.33, 6) == Approx(10.0));
  CHECK(nice_tick_step(9.3, 6) == Approx(2.0));
  CHECK(nice_tick_step(0.0031, 6) == Approx(0.001));
  CHECK(same(nice_ticks(0.0, 9.3, 6), {0, 2, 4, 6, 8, 10}));
  CHECK(same(nice_ticks(0.0, 1.0, 5), {0, 0.2, 0.4, 0.6, 0.8, 1.0}));
  CHECK(same(nice_ticks(-3.2, 7.1, 6), {-4, -2, 0, 2, 4, 6, 8}));
  // 0.5 to 6.4 needs 7 steps of 1 (0 … 7): too many for 6, so steps of 2.
  CHECK(same(nice_ticks(0.5, 6.4, 6), {0, 2, 4, 6, 8}));
  // A range of zero width still gets an axis.
  CHECK(same(nice_ticks(0.0, 0.0, 6), {0, 0.2, 0.4, 0.6, 0.8, 1.0}));
  CHECK(nice_ticks(5.0, 5.0, 4).size() >= 2);
  CHECK_THROWS_AS(nice_ticks(0.0, INFINITY, 6), std::invalid_argument);
  CHECK_THROWS_AS(nice_tick_step(0.0, 6), std::invalid_argument);
  // Printed with the decimals the step needs, without binary noise or "-0".
  CHECK(tick_text(0.1 + 0.2, 0.1) == "0.3");
  CHECK(tick_text(-0.0, 1.0) == "0");
  CHECK(tick_text(10.0, 5.0) == "10");
  CHECK(tick_text(0.05, 0.05) == "0.05");
  CHECK(tick_text(2.5, 0.5) == "2.5");

  // Property: on random ranges the ticks are multiples of a 1-2-5 step, cover the range and
  // number at most `intervals` steps.
  std::mt19937 random(15);
  std::uniform_real_distribution<double> exponent(-4.0, 5.0), unit(-1.0, 1.0);
  for (int trial = 0; trial < 2000; ++trial) {
    const double scale = std::pow(10.0, exponent(random));
    double lo = unit(random) * scale, hi = unit(random) * scale;
    if (lo > hi) std::swap(lo, hi);
    if (hi - lo < 1e-9 * scale) continue;
    const int intervals = 3 + trial % 8;
    const auto ticks = nice_ticks(lo, hi, intervals);
    CAPTURE(lo, hi, intervals);
    REQUIRE(ticks.size() >= 2);
    const double step = ticks[1] - ticks[0];
    CHECK(one_two_five(step));
    CHECK(static_cast<int>(ticks.size()) - 1 <= intervals);
    CHECK(ticks.front() <= lo + 1e-9 * scale);
    CHECK(ticks.back() >= hi - 1e-9 * scale);
    CHECK(std::abs(ticks.front() / step - std::round(ticks.front() / step)) < 1e-6);
  }
}

TEST_CASE("charts: the moment diagram of a long pile marks Hetényi's maximum at λz = π/4",
          "[charts][published]") {
  const PileProfile p = hetenyi_profile();
  const double l = lambda();
  // Source: Hetényi 1946, semi-infinite beam with an end force (hand derivation above):
  // M_max = 0.3224·H/λ at z = π/(4λ). The profile's grid (dz = 0.05 m) finds the depth to
  // within half a segment and the value to 1e-3 (the curve is flat at its top; 0.3224 is
  // rounded to 4 digits).
  CHECK(p.max_moment_depth == Approx(std::numbers::pi / (4.0 * l)).margin(0.025));
  CHECK(p.max_moment == close(0.3224 * kH / l, 1e-3));
  CHECK(p.max_moment ==
        close(kH / l * std::exp(-std::numbers::pi / 4) * std::sin(std::numbers::pi / 4), 1e-4));

  // The recalled closed form solves the beam on elastic foundation, EI·y⁗ + k·y = 0, with
  // the moment EI·y″ (sign as plotted) and the shear dM/dz: checked by central differences
  // (h = 1e-2 m, error of order h² ≈ 1e-4 relative), and the head is free (M(0) = 0, V(0) = H).
  const auto y = [&](double z) {
    return 2.0 * kH * l / kSoil * std::exp(-l * z) * std::cos(l * z);
  };
  const double h = 1e-2;
  for (double z : {0.5, 1.0, 2.0, 3.5}) {
    CAPTURE(z);
    const double d2 = (y(z + h) - 2.0 * y(z) + y(z - h)) / (h * h);
    const double d4 =
        (y(z + 2 * h) - 4 * y(z + h) + 6 * y(z) - 4 * y(z - h) + y(z - 2 * h)) / std::pow(h, 4);
    CHECK(kEI * d4 + kSoil * y(z) == Approx(0.0).margin(1e-3 * kSoil * std::abs(y(0.0))));
    const double moment = kH / l * std::exp(-l * z) * std::sin(l * z);
    CHECK(kEI * d2 == close(moment, 1e-3));
  }
  CHECK(p.moment.front() == Approx(0.0).margin(1e-12));
  CHECK(p.shear.front() == close(kH, 1e-12));

  const std::vector<GoverningPileProfile> piles = {{"P1", "ULS-2", p}};
  const std::string svg = render_profile_chart_svg(ProfileQuantity::moment, piles, UnitSystem::SI);
  INFO(svg);
  CHECK(markup_problem(svg, true).empty());
  CHECK(svg.rfind("<svg xmlns=\"http://www.w3.org/2000/svg\"", 0) == 0);
  CHECK(has(svg, "<title>Bending moment with depth, pile P1 (ULS-2)</title>"));
  CHECK(has(svg, "<desc>"));
  CHECK(has(svg, "bending moment (kN·m)</text>"));
  CHECK(has(svg, "depth below the pile head (m)</text>"));
  CHECK(count(svg, "class=\"max-moment\"") == 1);
  // λ = 0.5623/m: M_max = 57.33 kN·m at 1.3966 m, found on the grid at 1.40 m.
  CHECK(has(svg, "data-moment=\"57.3\" data-depth=\"1.40\""));
  CHECK(has(svg, "P1: max 57.3 kN·m at 1.40 m</text>"));
  CHECK(count(svg, "class=\"zero\"") == 1);
  // The marker sits at its depth on the plot: Y = top + height·z / (axis bottom).
  const auto plot = attribute_numbers(svg, "data-plot");
  const auto depth_axis = attribute_numbers(svg, "data-depth-axis");
  const auto value_axis = attribute_numbers(svg, "data-value-axis");
  REQUIRE(plot.size() == 4);
  CHECK(depth_axis[0] == 0.0);
  CHECK(depth_axis[1] == 20.0);  // the pile's 20 m on a round axis
  // Below λz = π the moment changes sign (down to −2.5 kN·m): −10 … 60 kN·m in steps of 10.
  CHECK(value_axis[0] == -10.0);
  CHECK(value_axis[1] == 60.0);
  const double cy = coordinate_after(svg, "class=\"max-moment\"", "cy");
  const double cx = coordinate_after(svg, "class=\"max-moment\"", "cx");
  CHECK(cy == Approx(plot[1] + plot[3] * p.max_moment_depth / depth_axis[1]).margin(0.01));
  CHECK(cx ==
        Approx(plot[0] + plot[2] * (p.max_moment - value_axis[0]) / (value_axis[1] - value_axis[0]))
            .margin(0.01));

  // In US units: kN·m → kip·ft and m → ft with 1 kip = 4.4482216152605 kN and
  // 1 ft = 0.3048 m (NIST SP 811 (2008), Appendix B): 57.33 kN·m = 42.29 kip·ft, 1.40 m = 4.6 ft.
  const std::string us = render_profile_chart_svg(ProfileQuantity::moment, piles, UnitSystem::US);
  CHECK(markup_problem(us, true).empty());
  const double kip_ft = 4.4482216152605 * 0.3048;
  CHECK(has(us, "max " + fixed_text(p.max_moment / kip_ft, 2) + " kip·ft at " +
                    fixed_text(p.max_moment_depth / 0.3048, 1) + " ft"));
  CHECK(fixed_text(p.max_moment / kip_ft, 2) == "42.29");
  CHECK(has(us, "bending moment (kip·ft)</text>"));
  CHECK(has(us, "depth below the pile head (ft)</text>"));
  // 20 m = 65.6 ft: the depth axis runs to 70 ft in steps of 10.
  CHECK(attribute_numbers(us, "data-depth-axis")[1] == 70.0);
  CHECK(has(us, ">70</text>"));
}

TEST_CASE("charts: deflection and shear diagrams, several piles told apart by dashes", "[charts]") {
  PileProfile second = hetenyi_profile();
  for (auto& v : second.deflection) v *= 0.5;
  for (auto& v : second.moment) v *= 0.5;
  for (auto& v : second.shear) v *= 0.5;
  PileProfile failed;
  failed.message = "no convergence after 50 iterations";
  const std::vector<GoverningPileProfile> piles = {
      {"P1", "ULS-2", hetenyi_profile()}, {"P7", "ULS-5", second}, {"P9", "ULS-5", failed}};
  for (auto what : {ProfileQuantity::deflection, ProfileQuantity::moment, ProfileQuantity::shear}) {
    const std::string svg = render_profile_chart_svg(what, piles, UnitSystem::SI);
    CHECK(markup_problem(svg, true).empty());
    // Two converged piles drawn (P9 did not converge), with different dash patterns.
    CHECK(count(svg, "<path class=\"series\"") == 2);
    CHECK(has(svg, "data-series=\"pile P1 (ULS-2)\""));
    CHECK(has(svg, "data-series=\"pile P7 (ULS-5)\""));
    CHECK_FALSE(has(svg, "P9"));
    CHECK(count(svg, "stroke-dasharray=\"9 4\"") == 2);  // P7's line and its legend sample
    CHECK(has(svg, "<title>"));
    CHECK(has(svg, "<desc>"));
  }
  // Units of the deflection (mm, in) and shear (kN, kip) axes. The head deflection
  // 2·H·λ/k = 2.812 mm (Hetényi 1946, closed form above) is 0.111 in (1 in = 25.4 mm,
  // NIST SP 811 (2008), Appendix B).
  const std::string si =
      render_profile_chart_svg(ProfileQuantity::deflection, piles, UnitSystem::SI);
  const std::string us =
      render_profile_chart_svg(ProfileQuantity::deflection, piles, UnitSystem::US);
  CHECK(has(si, "deflection across the pile (mm)</text>"));
  CHECK(has(us, "deflection across the pile (in)</text>"));
  CHECK(attribute_numbers(si, "data-value-axis")[1] == 3.0);           // 2.812 mm on a round axis
  CHECK(attribute_numbers(us, "data-value-axis")[1] == Approx(0.12));  // 0.111 in, steps of 0.02
  CHECK(has(render_profile_chart_svg(ProfileQuantity::shear, piles, UnitSystem::SI),
            "shear force (kN)</text>"));
  const std::string shear_us =
      render_profile_chart_svg(ProfileQuantity::shear, piles, UnitSystem::US);
  CHECK(has(shear_us, "shear force (kip)</text>"));
  // The shear changes sign below the head (cos λz − sin λz < 0 for λz > π/4): the axis holds
  // negative values and the zero line inside the plot.
  CHECK(attribute_numbers(shear_us, "data-value-axis")[0] < 0.0);
  // Two maxima at the same depth: their labels are set apart instead of overprinting.
  const std::string moments =
      render_profile_chart_svg(ProfileQuantity::moment, piles, UnitSystem::SI);
  const std::size_t first_mark = moments.find("class=\"max-moment\"");
  const std::size_t second_mark = moments.find("class=\"max-moment\"", first_mark + 1);
  REQUIRE(second_mark != std::string::npos);
  const double label1 = attribute_numbers(moments, "y", moments.find("<text", first_mark)).front();
  const double label2 = attribute_numbers(moments, "y", moments.find("<text", second_mark)).front();
  CHECK(std::abs(label2 - label1) >= 13.0);
  // Gaps in the data (a non-finite point) break the line; an unknown maximum is not marked;
  // nothing prints "nan".
  PileProfile gappy = hetenyi_profile();
  gappy.moment[10] = std::nan("");
  gappy.max_moment = std::nan("");
  const std::string gap_svg =
      render_profile_chart_svg(ProfileQuantity::moment, {{"P2", "C", gappy}}, UnitSystem::SI);
  CHECK(markup_problem(gap_svg, true).empty());
  CHECK_FALSE(has(gap_svg, "nan"));
  CHECK_FALSE(has(gap_svg, "class=\"max-moment\""));
  CHECK(count(gap_svg, " M") == 1);  // the path starts again once, after the gap
  // Nothing to draw: no string.
  CHECK(render_profile_chart_svg(ProfileQuantity::moment, {{"P9", "C", failed}}, UnitSystem::SI)
            .empty());
  CHECK(render_profile_chart_svg(ProfileQuantity::moment, {}, UnitSystem::SI).empty());
}

TEST_CASE("charts: the pushover chart marks λ = 1, the capacity and why the curve ends",
          "[charts]") {
  const PushoverCurve curve = bilinear_curve();
  const PushoverMarks marks = pushover_marks(curve);
  // The made-up curve: 500 kN at λ = 1, reached at 500/25 000 = 0.020 m; capacity at the last
  // point, λ = 1.75 (hand arithmetic on the curve's definition).
  REQUIRE(marks.factored_load);
  CHECK(*marks.factored_load == close(500.0, 1e-12));
  REQUIRE(marks.factored_displacement);
  CHECK(*marks.factored_displacement == close(0.020, 1e-12));
  REQUIRE(marks.capacity_point);
  CHECK(*marks.capacity_point == curve.points.size() - 1);
  // λ = 1 between two points (steps of 0.3): interpolated on the straight part.
  const PushoverMarks between = pushover_marks(bilinear_curve(0.3));
  REQUIRE(between.factored_displacement);
  CHECK(*between.factored_displacement == close(0.020, 1e-9));

  const std::string svg = render_pushover_chart_svg(curve, UnitSystem::SI);
  INFO(svg);
  CHECK(markup_problem(svg, true).empty());
  CHECK(has(svg, "<title>Load–displacement (pushover) curve of the group, ULS-3</title>"));
  CHECK(has(svg, "<desc>"));
  CHECK(has(svg, "cap displacement along the load (mm)</text>"));
  CHECK(has(svg, "horizontal load (kN)</text>"));
  CHECK(has(svg, "factored load (λ = 1): 500.0 kN at 20.000 mm"));
  CHECK(has(svg, "class=\"factored\" data-load=\"500.0\""));
  // Capacity 1.75 × 500 = 875 kN at 0.024 + 0.55 × 500/2500 = 0.134 m.
  CHECK(has(svg, "capacity λ = 1.750: 875.0 kN at 134.000 mm"));
  CHECK(has(svg, "class=\"capacity\" data-load-factor=\"1.750\" data-load=\"875.0\""));
  CHECK(has(svg, "The curve ends at a mechanism"));
  CHECK(has(svg, "no equilibrium at λ = 2.000"));
  // The λ = 1 level sits at 500 kN on the load axis (0 … 1000 kN, bottom to top).
  const auto plot = attribute_numbers(svg, "data-plot");
  const auto y_axis = attribute_numbers(svg, "data-y-axis");
  CHECK(y_axis[1] == 1000.0);
  CHECK(coordinate_after(svg, "class=\"factored\"", "y1") ==
        Approx(plot[1] + plot[3] * (1.0 - 500.0 / y_axis[1])).margin(0.01));

  // US: 500 kN = 112.40 kip, 20 mm = 0.787 in (1 kip = 4.4482216152605 kN, 1 in = 25.4 mm:
  // NIST SP 811 (2008), Appendix B).
  const std::string us = render_pushover_chart_svg(curve, UnitSystem::US);
  CHECK(markup_problem(us, true).empty());
  CHECK(has(us, "factored load (λ = 1): 112.40 kip at 0.787 in"));
  CHECK(has(us, "cap displacement along the load (in)</text>"));
  CHECK(has(us, "horizontal load (kip)</text>"));

  // A curve that stops before λ = 1 at a stated limit.
  PushoverCurve short_curve = bilinear_curve();
  short_curve.points.resize(4);  // λ = 0 … 0.75
  short_curve.capacity_factor = 0.75;
  short_curve.mechanism = false;
  short_curve.end_reason = "the cap's displacement limit of 150 mm";
  const std::string stopped = render_pushover_chart_svg(short_curve, UnitSystem::SI);
  CHECK(markup_problem(stopped, true).empty());
  CHECK(has(stopped, "factored load (λ = 1): 500.0 kN, not reached"));
  CHECK(has(stopped, "capacity λ = 0.750: 375.0 kN"));
  CHECK(has(stopped, "The curve ends at a stated limit: the cap&#39;s displacement limit"));
  // Fewer than two points: nothing to draw.
  short_curve.points.resize(1);
  CHECK(render_pushover_chart_svg(short_curve, UnitSystem::SI).empty());
}

TEST_CASE("html_nonlinear: the section escapes user text and lists each governing pile",
          "[charts][package]") {
  NonlinearSection section;
  CHECK(render_nonlinear_section_html(section, UnitSystem::SI).empty());
  PileProfile failed;
  failed.message = "iteration <stalled>";
  section.piles = {{"<P1>", "ULS & 2", hetenyi_profile()}, {"P\"9", "ULS-5", failed}};
  section.pushover = bilinear_curve();
  section.pushover->combination = "<ULS-3>";
  const std::string html = render_nonlinear_section_html(section, UnitSystem::SI);
  INFO(html);
  CHECK(markup_problem(html, true).empty());
  CHECK(html.rfind("<section class=\"nonlinear\" id=\"nonlinear\">", 0) == 0);
  CHECK(has(html, "<h2>Nonlinear soil response"));
  CHECK(has(html, std::string("<p class=\"caution\">") + kCaution + "</p>"));
  // Ids and names escaped in the table, the charts and their attributes.
  CHECK_FALSE(has(html, "<P1>"));
  CHECK_FALSE(has(html, "<ULS-3>"));
  CHECK(has(html, "<td>&lt;P1&gt;</td>"));
  CHECK(has(html, "<td>ULS &amp; 2</td>"));
  CHECK(has(html, "data-series=\"pile &lt;P1&gt; (ULS &amp; 2)\""));
  CHECK(has(html, "iteration &lt;stalled&gt;"));
  CHECK(has(html, "Pile P&quot;9 in ULS-5: the pile's solution did not converge"));
  // The table: max moment, its depth, head deflection (2·H·λ/k = 2.812 mm, Hetényi 1946).
  CHECK(has(html,
            "<th>max moment (kN·m)</th><th>depth of max moment (m)</th><th>head "
            "deflection (mm)</th>"));
  CHECK(has(html,
            "<td class=\"num\">57.3</td><td class=\"num\">1.40</td><td "
            "class=\"num\">2.812</td>"));
  // Three depth diagrams and the pushover chart, each in a figure.
  CHECK(count(html, "<div class=\"figure\">") == 4);
  CHECK(count(html, "<svg ") == 4);
  CHECK(has(html, "Capacity: λ = 1.750, 875.0 kN at 134.000 mm."));
  // US units in the table: 57.3 kN·m = 42.29 kip·ft, 1.40 m = 4.6 ft, 2.812 mm = 0.111 in
  // (NIST SP 811 (2008), Appendix B factors).
  const std::string us = render_nonlinear_section_html(section, UnitSystem::US);
  CHECK(has(us,
            "<td class=\"num\">42.29</td><td class=\"num\">4.6</td><td "
            "class=\"num\">0.111</td>"));
  // Only a curve, or only piles.
  NonlinearSection only_curve;
  only_curve.pushover = bilinear_curve();
  CHECK(count(render_nonlinear_section_html(only_curve, UnitSystem::SI), "<svg ") == 1);
}

TEST_CASE("html_nonlinear: the package shows the section only when it is given",
          "[charts][package]") {
  const CheckRun run = analyse_project(std::string(CAIRN_DEMO_DIR) + "/conveyor-pier-us/cap.yaml");
  const CheckReport report = make_check_report(run, "cairn report cap.yaml --out x", std::nullopt);
  CapPackageInput input;
  input.report.check = &report;
  input.project_name = "demo";
  const std::string linear = render_cap_package_html(input);
  CHECK_FALSE(has(linear, "id=\"nonlinear\""));
  input.nonlinear = NonlinearSection{};  // given but empty: the page does not change
  CHECK(render_cap_package_html(input) == linear);
  input.nonlinear->piles = {{"A6", "U-2", hetenyi_profile()}};
  input.nonlinear->pushover = bilinear_curve();
  const std::string nonlinear = render_cap_package_html(input);
  CHECK(has(nonlinear, "<section class=\"nonlinear\" id=\"nonlinear\">"));
  CHECK(has(nonlinear, "<li><a href=\"#nonlinear\">"));
  // After the equilibrium section, in the project's units (this demo is US).
  CHECK(nonlinear.find("id=\"nonlinear\"") > nonlinear.find("id=\"equilibrium\""));
  CHECK(has(nonlinear, "bending moment (kip·ft)"));
}
