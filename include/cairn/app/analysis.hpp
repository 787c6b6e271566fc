// analysis.hpp — the whole check of one cap, as the pipeline the commands share:
// read → capacities → springs → validate → solve → check piles → check the group.
//
// Everything a report needs is kept in one CheckRun; several caps are analysed
// independently (in parallel) for a foundation.
#pragma once

#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "cairn/checks/checks.hpp"
#include "cairn/core/diagnostics.hpp"
#include "cairn/checks/group_checks.hpp"
#include "cairn/core/model.hpp"
#include "cairn/geotechnics/project_capacity.hpp"
#include "cairn/output/report.hpp"
#include "cairn/geotechnics/stiffness.hpp"

namespace cairn {

struct CheckRun {
  Project project;
  std::vector<PileTypeCapacity> capacities;
  std::vector<PileTypeStiffness> stiffness;
  std::vector<PileTypeResistance> resistances;
  CheckResults results;
  GroupResults group;
  std::vector<std::string> assumptions;
};

// Reads and checks one project file. Throws InputError for any input problem (nothing is
// computed from a file with problems). With pile_rows false the results keep no row per
// pile and combination (CheckResults::pile_rows): memory grows with piles + combinations
// (without a soil profile; with one, the pile forces are kept for Broms' yield moment).
// `progress`, when given, is called with (combinations checked, combinations) every 1,000
// combinations of a big table.
CheckRun analyse_project(const std::string& file, bool pile_rows = true,
                         const std::function<void(std::size_t done, std::size_t total)>& progress = {});

// Analyses several files on up to `threads` threads. Each entry holds the run or the
// input problems of its file, in the order of `files`.
struct CapOutcome {
  std::string file;
  std::optional<CheckRun> run;
  std::vector<Diagnostic> problems;
  // What a caller kept of the run when its `reduce` (below) let the run go.
  std::optional<CapSummaryRow> summary;
  std::vector<Warning> warnings;
};
// `progress`, when given, is called (from any thread, one call at a time) with the number
// of caps done after each. `reduce`, when given, is called on each outcome in the thread
// that analysed it, as soon as it is done: it may keep what it needs (summary, warnings) and
// reset the run, so that many caps need the memory of a summary each, not of a run each.
std::vector<CapOutcome> analyse_projects(
    const std::vector<std::string>& files, unsigned threads, bool pile_rows = true,
    const std::function<void(std::size_t done, std::size_t total)>& progress = {},
    const std::function<void(CapOutcome&)>& reduce = {});

// A report over a run. `explain_pile` names a pile for the hand check; throws InputError
// when it does not exist. The report points into `run`, which must outlive it.
CheckReport make_check_report(const CheckRun& run, const std::string& options,
                              const std::optional<std::string>& explain_pile);

}  // namespace cairn
