// Tests for p_multipliers.hpp: the AASHTO LRFD table of p-multipliers by row and spacing, and
// the rows formed across the direction of loading, counted from the leading side.
#include <catch2/catch.hpp>

#include <array>
#include <cmath>
#include <numbers>
#include <stdexcept>
#include <vector>

#include "cairn/geotechnics/p_multipliers.hpp"

namespace {

using Heads = std::vector<std::array<double, 2>>;

// A 3×3 group at `pitch` (m) centre to centre, centred on the origin; pile i·3 + j sits at
// x = (i − 1)·pitch, y = (j − 1)·pitch.
Heads grid3x3(double pitch) {
  Heads h;
  for (int i = 0; i < 3; ++i)
    for (int j = 0; j < 3; ++j) h.push_back({(i - 1) * pitch, (j - 1) * pitch});
  return h;
}

Approx exact(double v) { return Approx(v).margin(1e-12); }  // table values, rounding noise only

}  // namespace

TEST_CASE("p-multipliers: the AASHTO LRFD table at 3B and 5B", "[p_multipliers][published]") {
  // Source: AASHTO LRFD Bridge Design Specifications, Table 10.7.2.4-1 (4th ed. 2007 on,
  // from memory): 3B: 0.8, 0.4, 0.3; 5B: 1.0, 0.85, 0.7 for rows 1, 2, 3 and higher.
  CHECK(cairn::p_multiplier_row(1, 3.0) == exact(0.80));
  CHECK(cairn::p_multiplier_row(2, 3.0) == exact(0.40));
  CHECK(cairn::p_multiplier_row(3, 3.0) == exact(0.30));
  CHECK(cairn::p_multiplier_row(7, 3.0) == exact(0.30));  // "row 3 and higher"
  CHECK(cairn::p_multiplier_row(1, 5.0) == exact(1.00));
  CHECK(cairn::p_multiplier_row(2, 5.0) == exact(0.85));
  CHECK(cairn::p_multiplier_row(3, 5.0) == exact(0.70));
  CHECK(cairn::p_multiplier_row(4, 5.0) == exact(0.70));
}

TEST_CASE("p-multipliers: straight lines between 3B and 5B, and outside the table",
          "[p_multipliers][published]") {
  // Linear interpolation: AASHTO LRFD Table 10.7.2.4-1 (from memory); the later editions'
  // 4B column 0.9, 0.625, 0.5 is the midpoint of the lines.
  CHECK(cairn::p_multiplier_row(1, 4.0) == exact(0.90));
  CHECK(cairn::p_multiplier_row(2, 4.0) == exact(0.625));
  CHECK(cairn::p_multiplier_row(3, 4.0) == exact(0.50));
  // Hand interpolation at 3.5B: 0.8 + 0.25·0.2 = 0.85; 0.4 + 0.25·0.45 = 0.5125; 0.3 + 0.25·0.4 = 0.4.
  CHECK(cairn::p_multiplier_row(1, 3.5) == exact(0.85));
  CHECK(cairn::p_multiplier_row(2, 3.5) == exact(0.5125));
  CHECK(cairn::p_multiplier_row(3, 3.5) == exact(0.40));
  // Below 3B: the 3B values held and flagged as outside the table (cairn's choice).
  CHECK(cairn::p_multiplier_row(2, 2.0) == exact(0.40));
  CHECK_FALSE(cairn::p_multiplier_in_table(2.5));
  CHECK(cairn::p_multiplier_in_table(3.0));
  // Beyond 5B: the lines continued to 1 (cairn's choice): row 2 at 5 + 0.15/0.225 = 5.667B,
  // rows 3+ at 5 + 0.3/0.2 = 6.5B; at 6B row 3 is 0.7 + 0.2 = 0.9.
  CHECK(cairn::p_multiplier_row(1, 8.0) == exact(1.0));
  CHECK(cairn::p_multiplier_row(2, 6.0) == exact(1.0));
  CHECK(cairn::p_multiplier_row(3, 6.0) == exact(0.90));
  CHECK(cairn::p_multiplier_row(3, 6.5) == exact(1.0));
  CHECK(cairn::p_multiplier_row(3, 20.0) == exact(1.0));
  // Never a jump and never falling as the spacing grows (fine grid, common practice: group
  // effects fade with spacing).
  for (int row = 1; row <= 3; ++row) {
    double previous = cairn::p_multiplier_row(row, 1.0);
    for (double s = 1.0; s <= 10.0; s += 0.01) {
      const double now = cairn::p_multiplier_row(row, s);
      CAPTURE(row, s);
      CHECK(now >= previous - 1e-12);
      CHECK(now - previous <= 0.0125 + 1e-12);  // slope at most 0.225 per B, step 0.01B·…
      previous = now;
    }
  }
  CHECK_THROWS_AS(cairn::p_multiplier_row(0, 3.0), std::invalid_argument);
  CHECK_THROWS_AS(cairn::p_multiplier_row(1, 0.0), std::invalid_argument);
  CHECK_THROWS_AS(cairn::p_multiplier_row(1, std::nan("")), std::invalid_argument);
}

TEST_CASE("p-multipliers: a 3×3 group at 3B loaded along +x, −x and at 45°", "[p_multipliers]") {
  const double b = 0.6;
  const auto heads = grid3x3(3.0 * b);
  SECTION("along +x: the leading row is the one at the largest x") {
    const auto pm = cairn::p_multipliers(heads, b, 0.0, false);
    REQUIRE(pm.size() == 9);
    for (int j = 0; j < 3; ++j) {
      CAPTURE(j);
      CHECK(pm[6 + j] == exact(0.80));  // x = +1.8: row 1
      CHECK(pm[3 + j] == exact(0.40));  // x = 0: row 2
      CHECK(pm[0 + j] == exact(0.30));  // x = −1.8: row 3
    }
  }
  SECTION("along −x: the rows swap") {
    const auto pm = cairn::p_multipliers(heads, b, std::numbers::pi, false);
    for (int j = 0; j < 3; ++j) {
      CHECK(pm[0 + j] == exact(0.80));
      CHECK(pm[3 + j] == exact(0.40));
      CHECK(pm[6 + j] == exact(0.30));
    }
  }
  SECTION("along +y: rows are the lines of constant y") {
    const auto pm = cairn::p_multipliers(heads, b, std::numbers::pi / 2.0, false);
    for (int i = 0; i < 3; ++i) {
      CHECK(pm[3 * i + 2] == exact(0.80));
      CHECK(pm[3 * i + 1] == exact(0.40));
      CHECK(pm[3 * i + 0] == exact(0.30));
    }
  }
  SECTION("at 45°: across the anti-diagonals, five rows 3B/√2 = 2.12B apart") {
    // The rows of one direction (p_multiplier_rows), before the skewed-load rule.
    const auto rows = cairn::p_multiplier_rows(heads, b, std::numbers::pi / 4.0);
    // Projections (x + y)/√2: the corner (+1.8, +1.8) leads alone; then the two next to it.
    CHECK(rows[8].row == 1);
    CHECK(rows[7].row == 2);
    CHECK(rows[5].row == 2);
    CHECK(rows[4].row == 3);
    CHECK(rows[2].row == 3);
    CHECK(rows[6].row == 3);
    CHECK(rows[1].row == 4);
    CHECK(rows[3].row == 4);
    CHECK(rows[0].row == 5);
    CHECK(rows[4].spacing_over_width == Approx(3.0 / std::sqrt(2.0)));
    CHECK_FALSE(cairn::p_multiplier_in_table(rows[4].spacing_over_width));
  }
  SECTION("at 45°: the mean of the rows along x and along y (the skewed-load rule)") {
    REQUIRE(cairn::p_multiplier_axis(heads, b) == 0.0);  // the grid's axes are the cap's
    const auto pm = cairn::p_multipliers(heads, b, std::numbers::pi / 4.0, false);
    // P_m = P_x·cos²45° + P_y·sin²45°, P_x and P_y from the table's 3B column (hand derivation).
    CHECK(pm[8] == exact(0.80));               // leading both ways
    CHECK(pm[7] == exact((0.80 + 0.40) / 2));  // x leading, y second
    CHECK(pm[6] == exact((0.80 + 0.30) / 2));  // x leading, y trailing
    CHECK(pm[4] == exact(0.40));               // second both ways
    CHECK(pm[0] == exact(0.30));               // trailing both ways
    const auto rev = cairn::p_multipliers(heads, b, std::numbers::pi / 4.0, true);
    CHECK(rev[8] == exact(0.30));              // leading one way, trailing the other, both axes
    CHECK(rev[7] == exact((0.30 + 0.40) / 2));
    CHECK(rev[4] == exact(0.40));
  }
  SECTION("reversing along x: each pile the smaller of +x and −x") {
    const auto pm = cairn::p_multipliers(heads, b, 0.0, true);
    for (int j = 0; j < 3; ++j) {
      CHECK(pm[0 + j] == exact(0.30));  // leading one way, trailing the other
      CHECK(pm[3 + j] == exact(0.40));  // the middle row is row 2 both ways
      CHECK(pm[6 + j] == exact(0.30));
    }
  }
}

TEST_CASE("p-multipliers: a single pile, a single row across the load, rows within tolerance",
          "[p_multipliers]") {
  const double b = 0.5;
  CHECK(cairn::p_multipliers({{4.0, -2.0}}, b, 0.3, false) == std::vector<double>{1.0});
  CHECK(cairn::p_multipliers({{4.0, -2.0}}, b, 0.3, true) == std::vector<double>{1.0});
  CHECK(cairn::p_multipliers({}, b, 0.0, false).empty());
  // A row of four piles along y, loaded along x: one row, all leading, nothing ahead or behind.
  const Heads row{{0.0, 0.0}, {0.0, 1.5}, {0.0, 3.0}, {0.0, 4.5}};
  for (const double pm : cairn::p_multipliers(row, b, 0.0, true)) CHECK(pm == exact(1.0));
  // Piles staggered by less than half a width along the load are still one row.
  const Heads staggered{{0.0, 0.0}, {0.1, 1.5}, {-0.1, 3.0}};  // 0.2 m < b/2 = 0.25 m apart
  for (const double pm : cairn::p_multipliers(staggered, b, 0.0, false)) CHECK(pm == exact(1.0));
  // Loaded along that row (along y): four rows 3B apart: 0.8, 0.4, 0.3, 0.3 from the +y end.
  const auto along = cairn::p_multipliers(row, b, std::numbers::pi / 2.0, false);
  CHECK(along[3] == exact(0.80));
  CHECK(along[2] == exact(0.40));
  CHECK(along[1] == exact(0.30));
  CHECK(along[0] == exact(0.30));
  // Two rows 4B apart along x: row 1 0.9, row 2 0.625 (the table's 4B values).
  const Heads two{{0.0, 0.0}, {2.0, 0.0}, {0.0, 2.0}, {2.0, 2.0}};
  const auto pm = cairn::p_multipliers(two, b, 0.0, false);
  CHECK(pm[1] == exact(0.90));
  CHECK(pm[0] == exact(0.625));
  // Reversing: both rows are leading one way and second the other: 0.625 each.
  for (const double m : cairn::p_multipliers(two, b, 0.0, true)) CHECK(m == exact(0.625));
  CHECK_THROWS_AS(cairn::p_multipliers(two, 0.0, 0.0, false), std::invalid_argument);
}

TEST_CASE("p-multipliers: a skewed load moves them continuously from one axis to the other",
          "[p_multipliers]") {
  // The fault of rows formed across a skewed load: at 39.5° on a 2 × 3 grid every pile stood
  // in a row of its own, 0.30 each. With the rule of p_multipliers each pile's multiplier is
  // a weighted mean of its values along the two axes (cairn's rule, docs/methods-nonlinear.md).
  const double b = 0.762;
  Heads heads;  // three columns along x at 3.0 m, two rows along y at 3.0 m (3.94B)
  for (int i = 0; i < 3; ++i)
    for (int j = 0; j < 2; ++j) heads.push_back({(i - 1) * 3.0, (j - 0.5) * 3.0});
  REQUIRE(cairn::p_multiplier_axis(heads, b) == 0.0);
  const double deg = std::numbers::pi / 180.0;
  for (const bool reversing : {false, true}) {
    const auto px = cairn::p_multipliers(heads, b, 0.0, reversing);
    const auto py = cairn::p_multipliers(heads, b, 90.0 * deg, reversing);
    std::vector<double> last = px;
    for (int k = 1; k <= 180; ++k) {  // 0° to 90° in steps of half a degree
      const double theta = 0.5 * k * deg;
      const auto pm = cairn::p_multipliers(heads, b, theta, reversing);
      for (std::size_t i = 0; i < heads.size(); ++i) {
        CAPTURE(reversing, k, i);
        // Between the two axes' values, and moving by at most (P_x − P_y)·sin 2θ·Δθ per step.
        CHECK(pm[i] >= std::min(px[i], py[i]) - 1e-12);
        CHECK(pm[i] <= std::max(px[i], py[i]) + 1e-12);
        CHECK(std::abs(pm[i] - last[i]) <= std::abs(px[i] - py[i]) * 0.5 * deg + 1e-12);
        CHECK(pm[i] == exact(px[i] * std::cos(theta) * std::cos(theta) +
                             py[i] * std::sin(theta) * std::sin(theta)));
      }
      last = pm;
    }
    for (std::size_t i = 0; i < heads.size(); ++i) CHECK(last[i] == exact(py[i]));
  }
  // 39.5°, by direction: the leading corner (x = +3, y = +1.5) leads both ways, 1 × cos² +
  // 0.9..·sin²; no pile is at the 0.30 the rows across the load gave.
  const auto pm = cairn::p_multipliers(heads, b, 39.5 * deg, false);
  for (const double m : pm) CHECK(m > 0.5);
}

TEST_CASE("p-multipliers: a grid turned in plan keeps its rows", "[p_multipliers]") {
  const double b = 0.6, pitch = 3.0 * b;
  const auto square = grid3x3(pitch);
  const double deg = std::numbers::pi / 180.0;
  for (const double turn : {20.0 * deg, -35.0 * deg, 45.0 * deg}) {
    Heads turned;
    for (const auto& h : square)
      turned.push_back({h[0] * std::cos(turn) - h[1] * std::sin(turn),
                        h[0] * std::sin(turn) + h[1] * std::cos(turn)});
    double expected = std::fmod(turn, std::numbers::pi / 2.0);
    if (expected < 0.0) expected += std::numbers::pi / 2.0;
    CAPTURE(turn);
    CHECK(cairn::p_multiplier_axis(turned, b) == Approx(expected).margin(1e-9));
    // The turned group under the turned load = the square group under the load (frame
    // invariance, common practice), along its axes and between them.
    for (const double theta : {0.0, 30.0 * deg, 90.0 * deg, 200.0 * deg})
      for (const bool reversing : {false, true}) {
        const auto a = cairn::p_multipliers(square, b, theta, reversing);
        const auto t = cairn::p_multipliers(turned, b, theta + turn, reversing);
        for (std::size_t i = 0; i < a.size(); ++i) CHECK(t[i] == Approx(a[i]).margin(1e-9));
      }
  }
  // Two piles at one point and a line of piles: no failure, the line's own axis.
  CHECK(cairn::p_multiplier_axis({{0.0, 0.0}, {0.0, 0.0}}, b) == 0.0);
  CHECK(cairn::p_multiplier_axis({{0.0, 0.0}, {1.0, 1.0}, {2.0, 2.0}}, b) ==
        Approx(std::numbers::pi / 4.0));
  CHECK_THROWS_AS(cairn::p_multiplier_axis({{0.0, 0.0}, {1.0, std::nan("")}}, b),
                  std::invalid_argument);
}
