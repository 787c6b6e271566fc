// layouts.hpp — the pile layouts `cairn design` tries, family by family, for one pile type:
// one pile; two piles (along x or y); rectangular grids of rows × columns at spacings sx, sy;
// staggered grids (every other row shifted by half a spacing, one pile fewer); rings of n
// piles, with or without a centre pile. Each layout can also be shifted so that the group's
// centroid moves toward the resultant of the governing combination, and its outer piles can
// lean outward (1 horizontal in `batter` vertical: grids along their outer row's outward
// normal, rings radially).
//
// Every coordinate is a round number in the project file's length unit (spacings on the
// grid of design.spacing.step), converted to m exactly as the file reader converts it, so
// that the layout written back to a file reads as the same doubles. The cap is fitted
// around the piles (rectangle; octagon for rings) with the edge distance from the pile
// faces, its sides rounded up to the spacing step, inside the project's cap outline when
// one is given — or is the project's outline itself (design.cap.outline: fixed).
//
// Limits applied here: centre-to-centre spacing between min and max pile widths (the
// smallest pair distance of the layout; staggered and ring layouts measured as built), pile
// count up to max_piles, the cap inside the outline limit. Units: m.
#pragma once

#include <array>
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "cairn/core/model.hpp"
#include "cairn/design/design_spec.hpp"

namespace cairn {

struct LayoutPile {
  double x = 0.0, y = 0.0;  // m
  std::optional<Batter> batter;
};

struct Layout {
  Family family = Family::grid;
  std::size_t type = 0;  // pile type index
  std::vector<LayoutPile> piles;
  std::size_t rows = 0, columns = 0;  // grid and staggered; ring: piles on the ring
  double spacing = 0.0;      // m, the spacing named in tables (smallest c/c of the layout)
  double spacing_x = 0.0, spacing_y = 0.0;  // m, as laid out (ring: radius in spacing_y)
  bool battered = false;
  bool shifted = false;
  double shift_x = 0.0, shift_y = 0.0;  // m, centroid of the piles
  Outline outline;                      // the cap, m
  bool outline_given = false;           // the project's own outline (fixed)
  // The cap as written back to a file, in the file's length unit: rectangle width, length,
  // centre; or the polygon's corners.
  double width_file = 0.0, length_file = 0.0, center_x_file = 0.0, center_y_file = 0.0;
  std::vector<std::array<double, 2>> polygon_file;
  std::vector<std::array<double, 2>> piles_file;  // pile heads in the file's length unit
  std::string describe() const;  // "grid 3×4 @ 1.50 × 1.80 m", "ring 8 + centre"
};

// Why generated layouts were left out before any analysis, by reason.
struct LayoutCounts {
  std::size_t outside_outline = 0;   // the cap (or a pile) leaves the outline limit
  std::size_t too_many_piles = 0;    // (not generated: counted for the explanation)
  std::size_t spacing = 0;           // smallest spacing below the minimum or above the max
  bool truncated = false;            // stopped at kMaxLayoutsPerType
};

// The most layouts generated for one pile type (memory and time stay bounded: about 0.2 GB
// and 20 s for layouts of 25 piles); the output says when the search stopped there.
inline constexpr std::size_t kMaxLayoutsPerType = 200000;

// The point (m, in plan) the shifted layouts move their centroid toward: the resultant of
// the combination with the largest downward load, x = −My/Fz, y = Mx/Fz about the origin.
std::array<double, 2> resultant_point(const Project& project);

// All layouts of the families in `spec` for pile type `type`. `toward` is the shift target
// (resultant_point); `counts` gathers the layouts left out.
std::vector<Layout> generate_layouts(const Project& project, const DesignSpec& spec,
                                     std::size_t type, const std::array<double, 2>& toward,
                                     LayoutCounts& counts);

// A length in the file's unit to m, exactly as the project reader converts a plain number.
double file_length_to_si(double value, UnitSystem units);

}  // namespace cairn
