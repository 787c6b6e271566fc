// as_built.hpp — the cap as the piles were installed: the design project and the survey
// (input/survey_csv.hpp) make an as-built project, checked by the same pipeline, and the two
// are compared pile by pile.
//
// Each design pile takes its surveyed head position and, where measured, its batter; a
// rejected or abandoned pile is left out of the as-built group (it carries nothing, but stays
// in the ground: the spacing of the other piles to it is checked); a pile added on site
// joins with its type. A pile whose length or condition changed gets its own pile type,
// derived from the design type: a new length (installed_length, or cut-off and tip levels on
// the project's datum, soil.ground_level) changes E·A/L and, where the capacity is computed
// from the soil, the capacity; a capacity typed in by hand is never scaled for length — the
// survey must give capacity_factor or the check refuses. A damaged pile keeps
// capacity_factor × every resistance and stiffness_factor × its springs.
//
// Tolerances: plan position 75 mm (3 in in a US project) and batter 1 in 50 (deviation of
// the axis' horizontal slope) are common practice defaults for driven and bored piles; both
// are options. The verdict per cap:
//   accept as built                        every pile within tolerance, as designed, and
//                                          every check passes as built;
//   accept, deviations taken by the piles  some pile out of tolerance, rejected, damaged,
//                                          short or added, and every check passes;
//   remedial work needed                   some check fails as built.
// The cap's own structural design (bending, shear, punching with the moved piles) is not
// checked by cairn. Units: SI inside (m, kN).
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "cairn/app/analysis.hpp"
#include "cairn/core/model.hpp"
#include "cairn/input/survey_csv.hpp"

namespace cairn {

struct SiteTolerances {
  double plan = 0.075;         // m; US default 3 in
  double batter = 1.0 / 50.0;  // horizontal per vertical
};
// 75 mm and 1:50 (SI), 3 in and 1:50 (US): common practice.
SiteTolerances default_tolerances(UnitSystem units);

struct AsBuiltPile {
  std::string id;
  PileStatus status = PileStatus::accepted;
  bool added = false;                     // not in the design
  std::optional<std::size_t> design;      // index into the design's piles
  std::optional<std::size_t> as_built;    // index into the as-built project's piles
  std::size_t type = 0;                   // design pile type (as-built: the derived one)
  double design_x = 0.0, design_y = 0.0;  // m
  double x = 0.0, y = 0.0;                // m, as built (rejected: where it stands)
  double offset = 0.0;                    // m
  double direction_deg = 0.0;             // of the offset, degrees from +x
  std::optional<double> batter_deviation; // horizontal per vertical, when measured
  std::optional<double> design_length, length;  // m, when the installed length is known
  std::optional<double> capacity_factor, stiffness_factor;
  bool out_of_tolerance = false;
  std::vector<std::string> remarks;       // plain words: why flagged
};

struct AsBuiltProject {
  Project project;  // the as-built group: design with surveyed piles; derived pile types
  TypeAdjustments adjust;
  std::vector<AsBuiltPile> piles;  // design order, then added piles in survey order
  SiteTolerances tolerances;
  std::string survey_file;
  std::optional<SiteGrid> grid;
};

// The as-built project from the design and the survey rows of cap `cap_name` (all rows when
// the survey has no `cap` column: an empty row cap matches any cap). Throws InputError (file,
// row, column of the survey) for anything it cannot read or will not guess.
AsBuiltProject build_as_built(const Project& design, const Survey& survey,
                              const std::string& cap_name, const SiteTolerances& tolerances);

enum class SiteVerdict { accept, accept_with_deviations, remedial };
// "accept as built", "accept, deviations taken by the piles", "remedial work needed".
const char* to_string(SiteVerdict);

struct AsBuiltComparison {
  SiteVerdict verdict = SiteVerdict::accept;
  std::optional<std::size_t> governing_combination;  // as built
  std::optional<std::size_t> design_governing_combination;
  // Per AsBuiltPile: largest utilization over all combinations (none: not in that group).
  std::vector<std::optional<double>> design_utilization, as_built_utilization;
  double design_max = 0.0, as_built_max = 0.0;
  bool any_out_of_tolerance = false;
  bool any_deviation = false;  // out of tolerance, rejected, damaged, short or added
};

AsBuiltComparison compare_as_built(const AsBuiltProject& model, const CheckRun& design,
                                   const CheckRun& as_built);

inline constexpr const char* kCapNotChecked =
    "The cap's own structural design (bending, shear and punching with the moved piles) is "
    "not checked by cairn.";

}  // namespace cairn
