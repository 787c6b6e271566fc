// read_design.hpp — the `design:` section of a project file, for `cairn design`.
//
// The section names the candidate pile types (existing types by name), the layout families,
// the limits (spacing in pile widths, edge distance, pile length, tilt, largest pile count),
// the cap's thickness rule and the cost model (design_spec.hpp; docs/design.md lists every
// key). Numbers are in the project's units, or written with a unit ("12 m"). Every problem is
// located and reported together, like read_project's.
#pragma once

#include <string>

#include "cairn/core/model.hpp"
#include "cairn/design/design_spec.hpp"

namespace cairn {

// Reads the `design:` section of the project file `path`, already read into `project`
// (read_project with Piles::optional). Throws InputError for a missing section, unknown
// keys, bad values and contradictory limits (smallest spacing above the largest, shortest
// pile above the longest, a pile type that does not exist).
DesignSpec read_design(const std::string& path, const Project& project);

}  // namespace cairn
