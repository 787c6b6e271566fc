// analysis_keys.hpp — the `analysis:` section of a project file: how `check` models the soil
// around the piles.
//
//   analysis:
//     soil_response: nonlinear       # linear (default) | nonlinear
//     p_multipliers: by_direction    # by_direction (default) | reversing | none
//     pushover: ULS-3                # the combination pushed; default the governing one
//     pushover_limit: 4              # the largest load factor λ (default 5)
//     pushover_displacement: 150 mm  # the cap's movement that ends the curve (default none)
//
// Every key is optional. `pushover` names a combination of the project (given or
// generated), so the section is read after them. `cairn check --soil-response` overrides
// soil_response.
#pragma once

#include "cairn/core/model.hpp"
#include "cairn/input/yaml_core.hpp"

namespace cairn {

// Reads `node` (the value of `analysis:`) into project.analysis; problems go to `ctx`.
void read_analysis_settings(const Located& node, Project& project, ReadContext& ctx);

}  // namespace cairn
