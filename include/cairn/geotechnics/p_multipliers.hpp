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
// Rows (the rule of p_multiplier_rows): piles whose plan positions projected on a direction
// lie within half a pile width of the row's foremost pile form one row, across that
// direction. The leading row is the one farthest in the direction (the side the load pushes
// the group toward: its piles push into soil no other pile has disturbed); rows are counted
// 1, 2, 3, ... from there backward. The spacing of a row is the distance along the direction
// between the mean projections of that row and the row ahead of it (for the leading row: the
// row behind it), in widths; a group of one row has no row ahead or behind and every pile
// gets 1.
//
// Skewed loads (the rule of p_multipliers; cairn's, stated in docs/methods-nonlinear.md): the
// table is for a load along the rows of a group. Rows formed across an arbitrary direction
// fall apart in a grid loaded at an odd angle (every pile its own "row", a fraction of a width
// behind the next, the multipliers jumping with the angle), so the rows are formed along the
// group's own two plan axes, at α and α + 90° (p_multiplier_axis: the pair of perpendicular
// directions along which the rows gather the most piles, the cap's x and y when they do as
// well as any), and for a load at ψ from the first axis each pile takes
//     P_m = P_a·cos²ψ + P_b·sin²ψ,
// P_a and P_b its multipliers for loads along the two axes, each toward the side the load's
// component along that axis pushes. Along an axis this is the table's value exactly; between
// them it moves continuously with the angle, and it is never above the larger of the two
// (at 45° on a square grid it is their mean; the diagonal lanes, whose piles stand √2 times
// farther apart, would give more). For loads that reverse (cyclic or two-way), P_a and P_b are
// each the smaller of the two opposite directions along their axis, so every pile takes the
// smaller of its multipliers for the load's direction and the opposite one.
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

// The first plan axis α ∈ [0, 90°) of the group (radians from +x, counter-clockwise): of the
// directions from each pile to its nearest neighbours (and the cap's x axis), the one along
// which, with its perpendicular, the rows of p_multiplier_rows are fewest; ties go to the
// direction nearest the cap's axes. 0 for fewer than two piles. Requires width > 0 and finite
// positions; throws std::invalid_argument otherwise.
double p_multiplier_axis(const std::vector<std::array<double, 2>>& heads, double width);

// One p-multiplier per pile head (plan positions, m) for a lateral load in the plan direction
// `direction` (radians from +x, counter-clockwise), piles of width `width` (m), by the skewed
// load rule above with the group's axis `axis` (p_multiplier_axis); `reversing`: the smaller
// of the two opposite directions. A single pile, a single row across the load, or rows
// farther apart than the lines above reach 1, get 1. Requires width > 0 and finite positions,
// direction and axis; throws std::invalid_argument otherwise.
std::vector<double> p_multipliers(const std::vector<std::array<double, 2>>& heads, double width,
                                  double direction, double axis, bool reversing);
// The same with the group's own axis (p_multiplier_axis).
std::vector<double> p_multipliers(const std::vector<std::array<double, 2>>& heads, double width,
                                  double direction, bool reversing);

// The rows across one direction (the rule above): each pile's row number (1: leading), its
// row's spacing in widths (0 for a group of one row) and the table's multiplier for them.
struct PMultiplierRow {
  int row = 1;
  double spacing_over_width = 0.0;
  double multiplier = 1.0;
};
std::vector<PMultiplierRow> p_multiplier_rows(const std::vector<std::array<double, 2>>& heads,
                                              double width, double direction);

}  // namespace cairn
