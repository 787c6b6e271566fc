// revision_diff.hpp — what changed between two revisions of a cap: piles added, removed and
// moved; inputs changed, key by key; per pile and combination the change of axial force and
// utilization; the governing pile and combination before and after; and whether the new
// revision fails a check the old one passed.
//
// Inputs are compared as resolved (after includes, units converted to SI and back to the
// project's units for display), so a value written "45 ft" in one and "13.716 m" in the
// other is the same. Piles and combinations are matched by id. Units: SI inside.
#pragma once

#include <cstddef>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "cairn/app/analysis.hpp"

namespace cairn {

struct KeyChange {
  std::string key;
  std::optional<std::string> before, after;  // none: the key is absent in that revision
};

struct PileMove {
  std::string id;
  double dx = 0.0, dy = 0.0;  // m
};

struct ForceChange {
  std::string pile, combination;
  double axial_before = 0.0, axial_after = 0.0;  // kN
  double utilization_before = 0.0, utilization_after = 0.0;
};

struct RevisionDiff {
  std::vector<std::string> added_piles, removed_piles;
  std::vector<PileMove> moved_piles;  // moved by more than 1 mm
  std::vector<KeyChange> inputs;
  std::vector<ForceChange> forces;    // piles and combinations in both, changed
  std::vector<std::string> newly_failing;  // "combination S3" / "group checks" failing only in NEW
  bool old_pass = true, new_pass = true;
};

// The inputs of a project as (key, value in the project's units) pairs, for comparison.
std::map<std::string, std::string> input_keys(const Project& project);

RevisionDiff diff_revisions(const CheckRun& old_run, const CheckRun& new_run);

}  // namespace cairn
