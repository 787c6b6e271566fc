// p_multipliers.hpp — group action on lateral resistance: the p-y curves of a pile in a group
// are scaled by a p-multiplier P_m (p_group(y) = P_m·p_single(y)) that depends on the pile's
// row counted from the leading side of the group in the direction of the lateral load, and on
// the centre-to-centre spacing of the piles in that direction in pile widths.
//
// Values: AASHTO LRFD Bridge Design Specifications, Table 10.7.2.4-1 "Pile P-Multipliers,
// Pm, for Multiple Row Shading" (4th edition 2007 and later; from memory):
//
//     spacing in the direction of loading   row 1 (leading)   row 2   row 3 and higher
//     3B                                    0.80              0.40    0.30
//     5B                                    1.00              0.85    0.70
//
// straight lines between 3B and 5B (the later editions print 4B as 0.90, 0.625, 0.50: the
// same lines). Outside the table (cairn's choices, stated in docs/methods-lateral.md):
//  - below 3B the 3B values are held (the table does not go closer; a group that close is
//    outside the published range and the caller should say so: see p_multiplier_in_table);
//  - beyond 5B each row's straight line is continued until it reaches 1 (row 1 at 5B, row 2
//    at 5.67B, rows 3+ at 6.5B) and is 1 after, so that P_m never jumps as spacing grows.
//
// Rows (the rule of p_multipliers): piles whose plan positions projected on the direction of
// loading lie within half a pile width of the row's foremost pile form one row, across the
// load. The leading row is the one farthest in the direction of loading (the side the load
// pushes the group toward: its piles push into soil no other pile has disturbed); rows are
// counted 1, 2, 3, ... from there backward. The spacing of a row is the distance along the
// direction of loading between the mean projections of that row and the row ahead of it (for
// the leading row: the row behind it), in widths; a group of one row has no row ahead or
// behind and every pile gets 1. For a skewed load the direction is that of the resultant
// horizontal load on the cap; for loads that reverse (cyclic or two-way), each pile takes the
// smaller of its multipliers for the two opposite directions.
//
// Units: m, radians.
#pragma once

#include <array>
#include <vector>

namespace cairn {

// The spacings the published table covers, in pile widths.
inline constexpr double kPMultiplierSmallestSpacing = 3.0;  // AASHTO LRFD Table 10.7.2.4-1
inline constexpr double kPMultiplierLargestSpacing = 5.0;   // AASHTO LRFD Table 10.7.2.4-1

// P_m for row `row` (1: leading, 2: second, 3 and beyond: trailing) at a spacing of
// `spacing_over_width` pile widths in the direction of loading. Requires row ≥ 1 and
// spacing_over_width > 0; throws std::invalid_argument otherwise.
double p_multiplier_row(int row, double spacing_over_width);

// True when `spacing_over_width` is not below the table's smallest spacing (3B): below it
// p_multiplier_row holds the 3B values, which the table does not support.
bool p_multiplier_in_table(double spacing_over_width);

// One p-multiplier per pile head (plan positions, m) for a lateral load in the plan direction
// `direction` (radians from +x, counter-clockwise), piles of width `width` (m). Rows are
// formed across the direction of loading (the rule above); `reversing`: the smaller of the
// two directions. A single pile, a single row across the load, or rows farther apart than
// the lines above reach 1, get 1. Requires width > 0 and finite positions and direction;
// throws std::invalid_argument otherwise.
std::vector<double> p_multipliers(const std::vector<std::array<double, 2>>& heads, double width,
                                  double direction, bool reversing);

// The same for each pile, with the row number (1: leading) and the row's spacing in widths
// used (0 for a group of one row), for the report.
struct PMultiplierRow {
  int row = 1;
  double spacing_over_width = 0.0;
  double multiplier = 1.0;
};
std::vector<PMultiplierRow> p_multiplier_rows(const std::vector<std::array<double, 2>>& heads,
                                              double width, double direction);

}  // namespace cairn
