// site_commands.hpp — the commands and options of the site work (site/): the as-built
// re-check of `check --as-built` and `report --as-built`.
#pragma once

#include <iosfwd>
#include <memory>
#include <string>

#include "cairn/app/analysis.hpp"
#include "cairn/app/cli.hpp"
#include "cairn/output/as_built_report.hpp"
#include "cairn/site/as_built.hpp"

namespace cairn {

// One cap's design run, its as-built model and run, and their comparison. Held by pointer
// so that the report's pointers stay valid.
struct AsBuiltRun {
  CheckRun design;
  AsBuiltProject model;
  CheckRun as_built;
  AsBuiltComparison comparison;
  AsBuiltReport report(const std::string& options) const;
};

// The as-built check of `design` from the survey at `survey_path` (its `cap` column matched
// against the cap file's stem), with the tolerances of `options`; the as-built cap is analysed
// with `analysis` (give the design run's soil response, so that both are linear or both
// nonlinear). Throws InputError.
std::unique_ptr<AsBuiltRun> as_built_run(CheckRun design, const std::string& survey_path,
                                         const Options& options,
                                         const AnalysisOptions& analysis = {});

// `cairn check CAP.yaml --as-built SURVEY.csv`: exit 1 when remedial work is needed.
int run_as_built_check(const Options& options, const std::string& described, std::ostream& out,
                       std::ostream& err);

// `cairn pile-loss CAP.yaml [--pairs]`: exit 1 when losing some pile leaves a failing cap.
int run_pile_loss(const Options& options, const std::string& described, std::ostream& out,
                  std::ostream& err);
// `cairn add-pile CAP.yaml --type T [--as-built S.csv | --lose P]`: exit 1 when no position
// on the grid makes every combination pass.
int run_add_pile(const Options& options, const std::string& described, std::ostream& out,
                 std::ostream& err);
// `cairn tolerance CAP.yaml [--trials N --seed S --normal]`: exit 1 when the worst
// arrangement found within the tolerance fails.
int run_tolerance(const Options& options, const std::string& described, std::ostream& out,
                  std::ostream& err);

// `cairn safe-region CAP.yaml [--rays N]`: exit 1 when some combination's resultant lies
// outside its safe region.
int run_safe_region(const Options& options, const std::string& described, std::ostream& out,
                    std::ostream& err);

// `cairn diff OLD NEW`: exit 1 when NEW fails a check OLD passed.
int run_diff(const Options& options, const std::string& described, std::ostream& out,
             std::ostream& err);

}  // namespace cairn
