// plan_svg.hpp — the pile cap drawn in plan to scale, as a standalone SVG string.
//
// The drawing shows the cap outline (when the file gives one), every pile at its section
// size (square or round, width in m) labelled with its id, batter arrows pointing toward the
// direction the toe moves (length proportional to 1/ratio, labelled "1:n"), the points where
// load cases apply loads (columns, self-weight), the global axes with +x and +y arrows at the
// origin, a scale bar in the project's length unit and, when check results are given, each
// pile filled by its largest utilization over all combinations with a legend.
//
// Geometry is in m (SI inside, as everywhere in cairn); the drawing maps plan (x, y) to SVG
// user units (px) with one uniform scale, y flipped so that +y points up the page:
//     X = origin_x + scale·x,   Y = origin_y − scale·y      (scale in px per m)
// Nothing is written to files here: the functions return strings.
#pragma once

#include <string>
#include <string_view>
#include <vector>

#include "cairn/checks.hpp"
#include "cairn/model.hpp"

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

// Utilization bands of the plan's legend (common practice for colour-coded results):
// below 0.5, 0.5–0.8, 0.8–1.0 and over 1.0 (red). An infinite utilization (a demand with no
// capacity) is over 1.0. Returns a CSS colour "#rrggbb".
std::string utilization_colour(double utilization);

// Colour of a pile with no check results.
inline constexpr const char* kUncheckedColour = "#d9d9d9";

// The plan as one SVG document (<svg xmlns=…>…</svg>), usable inline in HTML or alone.
// `results` and `resistances` may be null: piles are then drawn grey and without tooltips
// of their capacity. Requires every pile's type index to be valid.
std::string render_plan_svg(const Project& project, const CheckResults* results,
                            const std::vector<PileTypeResistance>* resistances);

// `text` with &, <, >, " and ' replaced by character references, for XML and HTML.
std::string xml_escape(std::string_view text);

}  // namespace cairn
