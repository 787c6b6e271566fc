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
#include "cairn/solver/nonlinear_combinations.hpp"

namespace cairn {

struct CheckRun {
  Project project;
  std::vector<PileTypeCapacity> capacities;  // with depth tables when asked (AnalysisOptions)
  std::vector<PileTypeStiffness> stiffness;
  std::vector<PileTypeResistance> resistances;
  CheckResults results;
  GroupResults group;
  std::vector<std::string> assumptions;
  // The cap's stiffness about the origin for the global structural model (every pile active).
  std::array<std::array<double, 6>, 6> cap_stiffness{};
  // A nonlinear run (analysis.soil_response: nonlinear, or --soil-response nonlinear): what
  // it adds per combination and pile, and the pushover curve. Absent for a linear run.
  std::optional<NonlinearRun> nonlinear;
};

// What the analysis builds beyond the check. With `depth_tables`, each computed pile type's
// capacity-with-depth table over report_depth_table() (project_capacity.hpp), built once here
// for the calculation package's chart; the renderers only render it.
struct AnalysisOptions {
  bool depth_tables = false;
  // With pile_rows false the results keep no row per pile and combination
  // (CheckResults::pile_rows): memory grows with piles + combinations (without a soil
  // profile; with one, the pile forces are kept for Broms' yield moment).
  bool pile_rows = true;
  // When given, called with (combinations checked, combinations) every 1,000 combinations.
  std::function<void(std::size_t done, std::size_t total)> progress{};
  // `check --soil-response`: overrides the project's analysis.soil_response when given.
  std::optional<SoilResponse> soil_response{};
  // The piles on nonlinear soil for a nonlinear run; empty: the project's own, from its soil
  // profile's curves. Another pile model can be given here (tests); it is used as given, so
  // it cannot take the stiffness factors of TypeAdjustments (analyse throws logic_error).
  std::function<NonlinearGroup(const Project&)> nonlinear_piles{};
  // When given, changes each pile's model on the project's soil curves before the stiffness
  // factors of TypeAdjustments scale them (tests: a linear p-y curve).
  std::function<void(NonlinearPileSpec&)> nonlinear_pile_change{};
};

// Reads and checks one project file. Throws InputError for any input problem (nothing is
// computed from a file with problems); a method that refuses the file's data (outside its
// range of validity) is one too, named with the file: "file: error: cannot compute: …".
CheckRun analyse_project(const std::string& file, const AnalysisOptions& options = {});

// Changes to pile types made after the fact (a damaged pile's type, site/as_built.hpp):
// factors on the springs and on every resistance, indexed like Project::pile_types
// (missing entries = 1). In a nonlinear run the stiffness factor scales the pile's p-y, t-z
// and Q-z curves instead of its springs (scaled_curves, pile_soil_curves.hpp); the capacity
// factor scales the resistances of the checks in both.
struct TypeAdjustments {
  std::vector<double> stiffness_factor;
  std::vector<double> capacity_factor;
};

// The same pipeline on a project already read: the as-built project of a survey, a
// candidate layout of `cairn design`. Throws InputError as above.
CheckRun analyse(Project project, const TypeAdjustments& adjust = {},
                 const AnalysisOptions& options = {});

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
    const std::vector<std::string>& files, unsigned threads, const AnalysisOptions& options = {},
    const std::function<void(std::size_t done, std::size_t total)>& progress = {},
    const std::function<void(CapOutcome&)>& reduce = {});

// A report over a run. `explain_pile` names a pile for the hand check; throws InputError
// when it does not exist. The report points into `run`, which must outlive it.
CheckReport make_check_report(const CheckRun& run, const std::string& options,
                              const std::optional<std::string>& explain_pile);

}  // namespace cairn
