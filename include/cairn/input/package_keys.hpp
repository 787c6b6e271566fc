// package_keys.hpp — the `package:` section of a project file: what the calculation package
// (`cairn report`) prints in its sign-off block, and the combinations it always shows in full.
//
//   package:
//     revision: B
//     date: 2026-12-02
//     prepared_by: A. Engineer
//     checked_by: B. Checker
//     show_combinations: [S1, LRFD-6(Ex+)]
//
// Every key is optional; values are text as written. show_combinations names combinations
// of the project (given or generated), so it is read after them.
#pragma once

#include <string>

#include "cairn/core/diagnostics.hpp"
#include "cairn/core/model.hpp"
#include "cairn/input/yaml_core.hpp"

namespace cairn {

// Reads `node` (the value of `package:` in `file`) into project.package; problems (an
// unknown key, a value that is not text, a combination that does not exist) go to
// `diagnostics`, located in `file`.
void read_package_settings(const Located& node, Project& project, Diagnostics& diagnostics);

// The `title:` of a foundation file (a file with `caps:`), else "" (not a foundation file,
// no title, or a file that cannot be read: read_project reports those).
std::string foundation_title(const std::string& path);

}  // namespace cairn
