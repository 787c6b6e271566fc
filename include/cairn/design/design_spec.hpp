// design_spec.hpp — what the engineer gives `cairn design`: the choices (pile types,
// layout families, batter) and the limits (cap outline, spacing, edge distance, pile length,
// tilt) of the search, and the cost model it ranks layouts by.
//
// Read from the project file's top-level `design:` section (read_design.hpp; docs/design.md
// is the reference). Lengths in m inside; `layout_unit` keeps the factor from the file's
// length unit to m, because the search places piles on a grid of round numbers in the
// file's own unit, so that the chosen layout written back to a file reads as the very same
// numbers (layouts.hpp).
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "cairn/core/model.hpp"

namespace cairn {

// The layout families practice uses (layouts.hpp draws each one).
enum class Family { single, pair, grid, staggered, ring, ring_centre };
const char* to_string(Family family);

// The cap's thickness: fixed, or growing with the spacing s and the pile width D,
//     h = max(minimum, base + per_spacing·s + per_width·D)
// (all lengths in m; per_spacing and per_width are plain numbers).
struct ThicknessRule {
  double base = 0.0;         // m
  double per_spacing = 0.0;  // –
  double per_width = 0.0;    // –
  double minimum = 0.0;      // m
  double thickness(double spacing, double pile_width) const {
    const double h = base + per_spacing * spacing + per_width * pile_width;
    return h > minimum ? h : minimum;
  }
};

// The engineer's own prices, in any currency: per pile, per length of pile (per m, or per
// ft in a US project) and per volume of cap (per m³, or per yd³ in a US project). The
// layouts are ranked by cost + utilization_weight × (largest utilization).
struct CostModel {
  double per_pile = 0.0;
  double per_length = 0.0;      // per project length unit of pile
  double per_cap_volume = 0.0;  // per m³ (SI) or yd³ (US)
  double utilization_weight = 0.0;
  std::string currency;         // printed beside costs, may be empty
};

struct DesignSpec {
  SourceLocation where;                 // the `design:` key
  std::vector<std::size_t> pile_types;  // candidates, indices into Project::pile_types
  std::vector<Family> families;
  bool outline_fixed = false;  // true: the cap is the project's outline; false: the cap is
                               // fitted around the piles, inside that outline if one is given
  std::optional<ThicknessRule> thickness;  // absent: the project's cap.thickness, fixed
  // The fitted cap is never smaller than this (m, along x and y): it must carry the column
  // or pedestal standing on it.
  double min_cap_width = 0.0, min_cap_length = 0.0;
  // Spacing, centre to centre, in pile widths; and the step of the spacings tried (m).
  double min_spacing_factor = 3.0;
  double max_spacing_factor = 6.0;
  double spacing_step = 0.1;  // m (0.25 ft in a US project)
  // Pile face to cap edge, m. Absent: the group check's minimum (group.min_edge_distance).
  std::optional<double> edge_distance;
  // Pile lengths: from min_length to max_length in steps of length_step, m.
  double min_length = 3.0;
  double max_length = 30.0;
  double length_step = 0.5;
  std::size_t max_piles = 25;
  // Batter of the outer piles (1 horizontal in `batter_ratio` vertical), tried beside the
  // vertical layouts when given.
  std::optional<double> batter_ratio;
  bool shift_to_resultant = true;
  std::optional<double> tilt_limit;  // rad, service combinations
  CostModel cost;
  std::size_t keep = 5;  // candidates in the table
  // Factor from the file's length unit to m (1 or 0.3048): the layout grid's unit.
  double layout_unit = 1.0;
};

}  // namespace cairn
