// design_command.hpp — `cairn design FILE [--write BEST.yaml]`: reads the design file, runs
// the layout search (search.hpp) with a progress bar on a terminal for searches longer than
// a second, prints the result (design_report.hpp) and writes the chosen layout as a project
// file (chosen_file.hpp), atomically and never over the design file.
// Exit status: 0 a layout passes, 1 none does, 2 bad input.
#pragma once

#include <iosfwd>

#include "cairn/app/cli.hpp"
#include "cairn/design/search.hpp"
#include "cairn/input/chosen_file.hpp"

namespace cairn {

// The chosen candidate as chosen_project_text writes it: lengths in the file's unit where
// they read back as the same doubles, else in m with the unit written.
ChosenLayout chosen_layout(const Project& project, const std::string& file, const Candidate& c);

// Throws InputError / OutputError like the other commands; run() turns them into exit 2.
int run_design(const Options& options, std::ostream& out, std::ostream& err);

}  // namespace cairn
