// p_multipliers.hpp — group action on lateral resistance: the p-y curves of a pile in a group
// are scaled by a p-multiplier P_m (p_group(y) = P_m·p_single(y)) that depends on the pile's
// row counted from the leading side of the group in the direction of the lateral load, and on
// the centre-to-centre spacing of the piles in that direction in pile widths.
//
// Values: AASHTO LRFD Bridge Design Specifications, the table of p-multipliers by row position
// and spacing (interpolated between spacings; from memory where the edition is not at hand).
// The leading row is chosen from the direction of the resultant horizontal load on the cap;
// for loads that reverse (cyclic or two-way), each pile takes the smaller of its multipliers
// for the two opposite directions.
//
// Units: m, radians.
#pragma once

#include <array>
#include <vector>

namespace cairn {

// P_m for row `row` (1: leading, 2: second, 3 and beyond: trailing) at a spacing of
// `spacing_over_width` pile widths in the direction of loading. Requires row ≥ 1 and
// spacing_over_width > 0.
double p_multiplier_row(int row, double spacing_over_width);

// One p-multiplier per pile head (plan positions, m) for a lateral load in the plan direction
// `direction` (radians from +x, counter-clockwise), piles of width `width` (m). Rows are
// formed along the direction of loading; `reversing`: the smaller of the two directions.
// A single pile, or piles farther apart than the table's largest spacing, get 1.
std::vector<double> p_multipliers(const std::vector<std::array<double, 2>>& heads, double width,
                                  double direction, bool reversing);

}  // namespace cairn
