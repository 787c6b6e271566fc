// report.hpp — renders check results as text, CSV, Markdown or JSON, in the project's units.
//
// Every rendering is a string built in memory (nothing is written here; output_files.hpp
// writes files atomically). Each output opens with the tool version, the input file and the
// command as it was run, states the assumptions in one place, and ends with the caution that
// results are for checking by a qualified engineer.
//
// One vocabulary in every format (checks.hpp): each pile row gives its governing check
// (to_string(Demand)), its state (to_string(PileState)) and its result (pass / fail); each
// combination its verdict (to_string(Verdict)). An overturned combination shows no pile
// forces ("-", JSON null), fails every pile, is left out of the envelope and is named in the
// summary's reason. Numbers go through number_text.hpp: no "-0.000", rotations below the
// displacements' printed precision as 0, counts that agree with their noun.
#pragma once

#include <cstddef>
#include <optional>
#include <ostream>
#include <string>
#include <utility>
#include <vector>

#include <nlohmann/json.hpp>

#include "cairn/output/output_files.hpp"

#include "cairn/checks/checks.hpp"
#include "cairn/checks/explain.hpp"
#include "cairn/checks/group_checks.hpp"
#include "cairn/geotechnics/stiffness.hpp"
#include "cairn/core/model.hpp"

namespace cairn {

struct NonlinearRun;

enum class Format { text, csv, markdown, json };

// How much of a check the outputs show (`cairn check --detail`):
//   full       every table, one row per pile and combination (the default)
//   envelope   per pile over all combinations
//   governing  per pile and check (compression, tension, lateral, structural), the
//              combination that governs it
//   summary    the verdict lines and the summary row
// Overturned or unstable combinations are listed at every level.
enum class Detail { full, envelope, governing, summary };
const char* to_string(Detail);

// A table with a header row; cells are already formatted.
struct Table {
  std::string title;
  std::vector<std::string> headers;
  std::vector<std::vector<std::string>> rows;
  std::vector<bool> numeric;  // per column: right-align in text
};

std::string render_table(const Table& table, Format format);

// Everything a check report shows.
struct CheckReport {
  const Project* project = nullptr;
  const CheckResults* results = nullptr;
  const std::vector<PileTypeResistance>* resistances = nullptr;
  std::vector<std::string> assumptions;
  // The command as it was run (Options::command_line), else the options rebuilt: shown as
  // "command:" in every report header and as "command" in JSON.
  std::string options;
  std::optional<std::size_t> explain_pile;
  std::vector<HandCheck> hand_checks;  // when explain_pile is set
  const std::vector<PileTypeStiffness>* stiffness = nullptr;  // springs per pile type
  const GroupResults* group = nullptr;                        // group checks
  // The cap's 6×6 stiffness about the origin, every pile active (CapSolver::stiffness_about):
  // kN/m, kN/rad, kN·m/m, kN·m/rad. Absent: not written.
  std::optional<std::array<std::array<double, 6>, 6>> cap_stiffness;
  // Below full, the renderers need no pile rows (CheckResults::pile_rows may be false).
  Detail detail = Detail::full;
  // A nonlinear run (solver/nonlinear_combinations.hpp): its notes, per-pile values and
  // pushover are shown; absent for a linear run, whose outputs it leaves unchanged.
  const NonlinearRun* nonlinear = nullptr;
};

std::string render_check(const CheckReport& report, Format format);
// The same written as a stream, piece by piece (JSON included: no tree of the whole
// document is built), for big runs.
void write_check(const CheckReport& report, Format format, std::ostream& out);
nlohmann::json check_json(const CheckReport& report);

// Files for `--out DIR`: report.txt, report.md, results.json, summary.csv, then by detail:
// envelope.csv (full and envelope), governing.csv (governing) and results.csv (full: one long
// table, a row per combination and pile). (name, content) pairs.
std::vector<std::pair<std::string, std::string>> check_files(const CheckReport& report);

// The long table of every combination and pile (CSV: combination, pile, axial, lateral,
// [head moment,] utilization, check, state, result), then the assumptions and the caution.
std::string render_long_csv(const CheckReport& report);
void write_long_csv(const CheckReport& report, std::ostream& out);

// check_files() as streamed outputs for write_files_atomically (output_files.hpp); the
// report must outlive them.
std::vector<OutputFile> check_outputs(const CheckReport& report);

// The governing combination of each pile and check (Detail::governing) as a table.
Table governing_table(const CheckReport& report);

// The group checks section alone (text or Markdown); empty when the report has none.
std::string render_group(const CheckReport& report, Format format);

// The group checks as pieces, for renderers of their own (HTML): lines of text about the
// layout, the efficiency table, lines about capacity, spacing and edge distance, the
// demand-per-combination table, and notes.
struct GroupParts {
  std::vector<std::string> layout;
  Table efficiency;
  std::vector<std::string> checks;
  Table demand;
  std::vector<std::string> notes;
};
GroupParts group_parts(const CheckReport& report);

// The pile-head springs of every pile, for the global structural model (`cairn springs`).
std::string render_springs(const Project& project, const std::vector<PileTypeStiffness>& stiffness,
                           Format format, const std::string& options);

// One cap of a foundation checked in one run (`cairn check caps/*.yaml`).
struct CapSummaryRow {
  std::string file, title;
  UnitSystem units = UnitSystem::SI;
  std::size_t piles = 0, combinations = 0;
  double max_utilization = 0.0;
  std::string pile, combination, check;  // where the maximum occurs
  std::optional<double> settlement;      // m, largest service settlement when computed
  bool pass = true;
  std::string status;  // "pass", "fail", "overturns", "group checks fail"
};

// The summary table of several caps, then the count of failing caps and the caution.
std::string render_cap_summary(const std::vector<CapSummaryRow>& rows, Format format,
                               const std::string& options);

// "1.0·D + 0.6·W"
std::string combination_formula(const Project& project, const Combination& combination);

// The one summary line: "PASS: …" or "FAIL: …".
std::string summary_line(const CheckReport& report);

}  // namespace cairn

namespace cairn {

// The tables render_check shows, as data, for other renderings (the HTML package).
struct CheckTables {
  Table pile_types;
  Table piles;
  Table combinations;
  std::vector<Table> per_combination;              // indexed like CheckResults::combinations
  std::vector<std::string> per_combination_notes;  // cap movement, dropped piles, pass/fail
  Table envelope;
  Table summary;
};

// The tables of `report`, cells formatted in the project's units. Requires project, results
// and resistances to be set.
CheckTables check_tables(const CheckReport& report);

// The hand check of report.explain_pile as plain text, as render_check prints it; empty when
// explain_pile is not set.
std::string hand_check_text(const CheckReport& report);

}  // namespace cairn
