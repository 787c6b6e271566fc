// plan_svg.hpp — the pile cap drawn in plan to scale, as a standalone SVG string.
//
// The drawing shows the cap outline (when the file gives one), every pile at its section
// size (square or round, width in m) labelled with its id, batter arrows pointing toward the
// direction the toe moves (length proportional to 1/ratio, labelled "1:n"), the points where
// load cases apply loads (columns, self-weight), the global axes with +x and +y arrows at the
// origin, a scale bar in the project's length unit and, when check results are given, each
// pile filled by its largest utilization over all combinations on a continuous colour scale
// with its colour bar (0 to max(1.2, largest utilization), 1.0 marked). A pile that fails in
// any combination (over capacity, a demand with no capacity, or the cap overturned) is also
// marked by shape — a bold outline and a cross — so that the plan reads in grayscale and
// for colour-blind readers; an overturned combination is named in a banner above the plan.
// The legend lists each load point with its own loads (case, name, non-zero components).
//
// Geometry is in m (SI inside, as everywhere in cairn); the drawing maps plan (x, y) to SVG
// user units (px) with one uniform scale, y flipped so that +y points up the page:
//     X = origin_x + scale·x,   Y = origin_y − scale·y      (scale in px per m)
// Nothing is written to files here: the functions return strings.
#pragma once

#include <string>
#include <string_view>
#include <vector>

#include "cairn/checks/checks.hpp"
#include "cairn/core/model.hpp"
#include "cairn/output/markup.hpp"

namespace cairn {

// Where the plan's origin (0, 0) lands in the SVG and how many SVG units one metre spans.
struct PlanFrame {
  double scale = 1.0;     // px per m
  double origin_x = 0.0;  // px, SVG coordinate of plan x = 0
  double origin_y = 0.0;  // px, SVG coordinate of plan y = 0
  double width = 0.0;     // px, whole drawing including legend
  double height = 0.0;    // px
};

// The frame render_plan_svg uses for `project`: the outline, piles, load points and the
// origin fit in a drawing `plan_width` px wide with margins for arrows and labels.
PlanFrame plan_frame(const Project& project, double plan_width = 640.0);

// The utilization colour scale (utilization_colour, utilization_text_colour) and the
// escaping of text (xml_escape) are in markup.hpp.

// The top of the colour bar: the larger of 1.2 and the largest finite utilization of any pile
// in `results` (null: 1.2), so that 1.0 always sits inside the bar.
double utilization_scale_max(const CheckResults* results);

// The smallest top of the colour bar.
inline constexpr double kUtilizationScaleMin = 1.2;

// The plan as one SVG document (<svg xmlns=…>…</svg>), usable inline in HTML or alone.
// `results` and `resistances` may be null: piles are then drawn grey and without tooltips
// of their capacity. Requires every pile's type index to be valid.
std::string render_plan_svg(const Project& project, const CheckResults* results,
                            const std::vector<PileTypeResistance>* resistances);

}  // namespace cairn
