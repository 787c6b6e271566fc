// design_command.hpp — `cairn design FILE [--write BEST.yaml]`: reads the design file, runs
// the layout search (search.hpp) with a progress bar on a terminal for searches longer than
// a second, prints the result (design_report.hpp) and writes the chosen layout as a project
// file (chosen_file.hpp), atomically and never over the design file.
// Exit status: 0 a layout passes, 1 none does, 2 bad input.
#pragma once

#include <iosfwd>

#include "cairn/app/cli.hpp"

namespace cairn {

// Throws InputError / OutputError like the other commands; run() turns them into exit 2.
int run_design(const Options& options, std::ostream& out, std::ostream& err);

}  // namespace cairn
