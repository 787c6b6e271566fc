// cli.hpp — the command line: options, and run(), the pipeline each command follows:
// read → validate → compute → check → render → write.
//
// Exit status: 0 all checks pass; 1 the tool ran but a check fails; 2 it could not run
// (usage, input or output problem). Only this module and main print to the terminal.
#pragma once

#include <cstdint>
#include <iosfwd>
#include <optional>
#include <string>
#include <vector>

#include "cairn/output/report.hpp"

namespace cairn {

enum class Command { check, capacity, springs, report, pile_loss, add_pile, tolerance, safe_region, diff, design };

struct Options {
  Command command = Command::check;
  std::vector<std::string> files;
  Format format = Format::text;
  std::optional<std::string> out_dir;
  std::optional<std::string> explain_pile;
  // check: how much the outputs show (report.hpp); full keeps every pile row in memory.
  Detail detail = Detail::full;
  // capacity: the capacity-with-depth table, in the project's length unit; defaults
  // 0.5 m or 1 ft for the step, 3 m or 10 ft for the shortest length.
  std::optional<double> depth_step;
  std::optional<double> min_length;
  // capacity: the shortest length carrying these forces (project's force unit) on the
  // allowable or factored basis (capacity_length.hpp).
  std::optional<double> need_compression;
  std::optional<double> need_tension;
  CapacityBasis need_basis = CapacityBasis::allowable;
  // report: also the plan alone as SVG, and the tables as CSV and Markdown.
  bool plan_svg = false;
  bool tables = false;
  // design: the chosen layout as a complete project file.
  std::optional<std::string> write_file;
  // The command as it was run (program name without its folder, then the arguments as
  // given, quoted where a shell would need it), shown in every report header. Empty when
  // run() is called without a command line: the header then shows the options rebuilt.
  std::string command_line;
  // check, report: the as-built survey (CSV) and its tolerances, in mm or in and as n of
  // 1:n (site/as_built.hpp; defaults 75 mm or 3 in, 1:50).
  std::optional<std::string> as_built;
  std::optional<double> plan_tolerance;
  std::optional<double> batter_tolerance;
  // Site studies (site/studies.hpp): pile-loss --pairs; add-pile --type, --step (mm or in),
  // --most, --lose; tolerance --trials, --seed, --normal.
  bool pairs = false;
  std::string added_type;
  std::optional<double> grid_step;
  int most_added = 2;
  std::vector<std::string> lose;
  std::size_t trials = 10000;
  std::uint64_t seed = 1;
  bool normal = false;
  int rays = 72;  // safe-region: rays of the traced region
  // check: the soil response, over the project's analysis.soil_response (linear, nonlinear).
  std::optional<SoilResponse> soil_response;
};

inline constexpr int kExitPass = 0;
inline constexpr int kExitFail = 1;
inline constexpr int kExitBadInput = 2;

// Runs one command; writes results to `out` and problems to `err`. Returns the exit status.
int run(const Options& options, std::ostream& out, std::ostream& err);

// Parses the command line (CLI11) and runs it. Returns the exit status.
int run_command_line(int argc, const char* const* argv, std::ostream& out, std::ostream& err);

}  // namespace cairn
