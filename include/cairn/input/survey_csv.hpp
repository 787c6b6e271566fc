// survey_csv.hpp — the as-built survey of a pile cap, read from CSV as a surveyor delivers it.
//
// A header row, then one row per pile. Columns are found by name, compared without regard to
// case and surrounding spaces (the RFC 4180 record reader of reactions_csv.hpp splits the
// text). Required: `pile` and `status` (accepted, damaged, rejected, abandoned), and either
// the surveyed head `x`, `y` or its offsets `dx`, `dy` from the design position. Optional:
//   batter, batter_toward   measured batter, 1 horizontal in `batter` vertical, toward the
//                           plan direction in degrees from +x ("plumb" or 0: vertical)
//   cutoff_level, tip_level as-built levels on the project's elevation datum
//   installed_length        as-installed length, head to tip along the pile
//   capacity_factor         share of the design capacity a damaged or short pile keeps (0–1]
//   stiffness_factor        share of the design stiffness a damaged pile keeps (0–1]
//   type                    pile type of a pile added on site (any pile may name its type)
//   cap                     the cap a row belongs to, for a foundation file of several caps
// Other columns (date, rig, remarks) are read past. Lengths and levels are in the project's
// length unit (m or ft). Lines starting with `#` are notes; two of them set a site grid:
//   # grid_origin: E0, N0        the project's origin in site grid coordinates
//   # grid_rotation: θ           degrees from the site grid's first axis to the project's x,
//                                counter-clockwise
// and survey coordinates (x, y, dx, dy, batter_toward) are then on the site grid.
//
// Every problem is located (file:row:column, 1-based) and reported together.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "cairn/core/diagnostics.hpp"
#include "cairn/core/model.hpp"
#include "cairn/core/units.hpp"

namespace cairn {

enum class PileStatus { accepted, damaged, rejected, abandoned };
const char* to_string(PileStatus);

struct SurveyRow {
  SourceLocation where;  // the row's first cell
  std::string cap;
  std::string pile;
  PileStatus status = PileStatus::accepted;
  std::optional<double> x, y;    // m, surveyed head, project axes (grid already applied)
  std::optional<double> dx, dy;  // m, offsets, project axes
  std::optional<Batter> batter;  // measured; ratio 0 = plumb
  std::optional<double> cutoff_level, tip_level, installed_length;  // m
  std::optional<double> capacity_factor, stiffness_factor;
  std::string type;
  // Where each optional value came from, for messages about its meaning.
  SourceLocation where_position, where_length, where_type;
  std::string length_column;  // the column the installed length came from
  int row = 0;                // 1-based row of the file (the header is row 1)
};

// The site grid of a survey: a point (E, N) on the grid is at project coordinates
//   x =  cos θ·(E − E0) + sin θ·(N − N0),   y = −sin θ·(E − E0) + cos θ·(N − N0).
struct SiteGrid {
  double origin_e = 0.0, origin_n = 0.0;  // m
  double rotation_deg = 0.0;
};

struct Survey {
  std::string file;
  std::optional<SiteGrid> grid;
  std::vector<SurveyRow> rows;
};

// The survey in `text` (named `file` in messages), numbers in `units`. Problems go to
// `diagnostics`; rows with a problem are left out.
Survey read_survey_csv(const std::string& text, const std::string& file, UnitSystem units,
                       Diagnostics& diagnostics);

// Reads the file at `path`; throws InputError for any problem.
Survey read_survey_file(const std::string& path, UnitSystem units);

}  // namespace cairn
