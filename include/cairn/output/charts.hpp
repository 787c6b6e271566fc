// charts.hpp — the charts of the nonlinear soil response, drawn as standalone SVG strings for
// the calculation package: the deflection, bending moment and shear of the governing piles
// against depth, and the load–displacement (pushover) curve of the group.
//
// Data come in SI (nonlinear_pile.hpp, pushover.hpp: m, kN, kN·m) and are converted only
// for display, through the one formatter (quantity_format.hpp): depths in m / ft, deflections
// and displacements in mm / in, moments in kN·m / kip·ft, shears and loads in kN / kip.
// Tick values are round numbers in the displayed unit: steps of 1, 2 or 5 × 10^k
// (nice_ticks).
//
// Depth charts put depth on the vertical axis, downward from the pile head (0 at the top),
// the quantity across, with a zero line; several piles are overlaid, each a labelled series
// told apart by its dash pattern (and by its ink on screen), so the chart reads in black and
// white. The moment chart marks each pile's largest moment with its value and depth.
// The pushover chart puts the cap's displacement along the load's direction on x and the load
// on y, marks the factored load (λ = 1) and the capacity (the largest λ with equilibrium), and
// says in a caption why the curve ends (a mechanism or a stated limit).
//
// Each drawing carries <title> and <desc> (SVG 1.1 §5.4, read as its accessible name and
// description with role="img"), axis labels with units, a white background and black axes, so
// it prints as it shows. User text (pile ids, combination names, reasons) is escaped
// (markup.hpp). Nothing is written to files here: the functions return strings.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "cairn/core/units.hpp"
#include "cairn/solver/nonlinear_pile.hpp"
#include "cairn/solver/pushover.hpp"

namespace cairn {

// Round tick values covering [low, high]: a step of 1, 2 or 5 × 10^k chosen so that the
// range spans at most `intervals` steps (and as many as possible), the first tick at or below
// `low` and the last at or above `high`, both multiples of the step. A range of zero width
// (or reversed ends) is widened to [low − 1, low + 1] around a value, [0, 1] when it is 0.
// Requires: intervals ≥ 1; finite ends (std::invalid_argument otherwise).
std::vector<double> nice_ticks(double low, double high, int intervals = 6);

// The step nice_ticks uses for a span: the smallest 1, 2 or 5 × 10^k with span / step ≤
// intervals. Requires: span > 0, intervals ≥ 1.
double nice_tick_step(double span, int intervals);

// A tick value as printed: as many decimals as its step needs (step 0.5 → 1, 0.05 → 2, 5 → 0),
// without "-0".
std::string tick_text(double value, double step);

// One governing pile of the nonlinear analysis, as the report names it.
struct GoverningPileProfile {
  std::string pile;         // pile id, as in the project file
  std::string combination;  // the combination it governs in
  PileProfile profile;      // SI: m, kN, kN·m (nonlinear_pile.hpp)
};

// What a depth chart plots.
enum class ProfileQuantity { deflection, moment, shear };

// One depth chart of `what` for the converged piles of `piles`, overlaid, in the units of
// `units`; the moment chart marks each pile's max_moment at max_moment_depth. Empty string
// when no pile has a converged profile with points.
std::string render_profile_chart_svg(ProfileQuantity what,
                                     const std::vector<GoverningPileProfile>& piles,
                                     UnitSystem units);

// What the pushover chart marks, found from the curve's points (SI).
struct PushoverMarks {
  // The load at λ = 1 (kN): load / λ of the last point with λ > 0 (the load grows in
  // proportion to λ); absent when no point has λ > 0.
  std::optional<double> factored_load;
  // The displacement at λ = 1 (m), interpolated linearly between the points either side;
  // absent when the curve stops before λ = 1.
  std::optional<double> factored_displacement;
  // The point of the capacity: the point of largest λ not above capacity_factor (with a
  // round-off allowance of 1e-9); absent when capacity_factor ≤ 0 or no point qualifies.
  std::optional<std::size_t> capacity_point;
};
PushoverMarks pushover_marks(const PushoverCurve& curve);

// The sentence saying why the curve ends: "a mechanism: …" or "a stated limit: …", with the
// curve's end_reason (unescaped).
std::string pushover_end_text(const PushoverCurve& curve);

// The pushover chart of `curve` in the units of `units`. Empty string when the curve has
// fewer than two points.
std::string render_pushover_chart_svg(const PushoverCurve& curve, UnitSystem units);

// The number of dash patterns the depth charts cycle through; the series k gets pattern
// k mod kSeriesStyles (a chart of more piles repeats patterns with a different width).
inline constexpr int kSeriesStyles = 5;

}  // namespace cairn
