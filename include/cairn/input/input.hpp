// input.hpp — reads a project file (YAML) into a validated Project.
//
// The file describes one pile cap: title, units, includes, cap, pile types, piles, soil,
// load cases and combinations (docs/input.md is the reference). Every problem found is
// collected with its file, line and column and raised together as one InputError, so the
// user can fix them all at once; nothing is computed from a file with problems.
//
// Units: plain numbers are in the units of the file they are written in (`units: SI | US`,
// the project file's when an included file says nothing); a number written with a unit as
// a string ("45 ft") is converted. The Project holds SI values only.
#pragma once

#include <string>
#include <vector>

#include "cairn/core/diagnostics.hpp"
#include "cairn/core/model.hpp"

namespace cairn {

// Reads and validates the project file at `path`, following its includes.
// Throws InputError listing every problem found.
// `piles: optional` is for `cairn design`, whose search places the piles; every other
// command needs them. A top-level `design:` section is accepted and left to read_design.hpp.
enum class Piles { required, optional };
Project read_project(const std::string& path, Piles piles = Piles::required);

// The cap files a foundation file lists (`caps: [a.yaml, b.yaml]`, paths relative to it);
// a project file stands for itself. Throws InputError for a foundation file with problems.
std::vector<std::string> expand_foundation(const std::string& path);

}  // namespace cairn
