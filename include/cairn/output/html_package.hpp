// html_package.hpp — the calculation package a reviewer signs: the HTML report of one cap
// (html_report.hpp) with the sections that let a checking engineer sign it without
// re-running the tool, and the index of a package of several caps.
//
// One cap's page holds, beyond the report: a sign-off block (revision, date, prepared by,
// checked by: the project's `package:` keys, blank lines to fill in otherwise), a table of
// contents with links, a design-basis page (codes and editions, load and resistance factors
// used, defaults taken, warnings), the equilibrium of the governing combinations with the
// hand check, the input echo (every file that fed the run with its path relative to the
// project, size and SHA-256, the tool version and the command) and the input text itself in
// an appendix; when the nonlinear analysis gives them, the diagrams of the governing piles and the
// group's pushover curve (html_nonlinear.hpp); a print style sheet (A4 and Letter, a running header
// with project, cap and page number, the caution on every page). With more than
// kFullCombinationsLimit combinations only the combinations that matter get their own table (see
// combinations_shown); the full table goes beside the page as CSV.
//
// Every function returns escaped HTML (or CSS, or CSV) and writes nothing.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "cairn/output/html_nonlinear.hpp"
#include "cairn/output/html_report.hpp"
#include "cairn/output/report.hpp"

namespace cairn {

// The group checks and settlement (group_checks.hpp) as a section; empty when report.group
// is null.
std::string render_group_section_html(const CheckReport& report);

// The combinations whose equilibrium the package shows (indices into results.combinations,
// ascending): the largest utilization's, the largest compression's, tension's and lateral
// force's over all piles, and every overturned one.
std::vector<std::size_t> governing_combinations(const CheckResults& results);

// For the governing combinations, the solver's actions of the cap on the pile heads (global
// axes, battered piles' horizontal components included; head moments of fixed and partially
// fixed heads in columns of their own) and their moments about the origin, p × F + M, summed
// beside the applied resultant (combination_load) with the residual (head_forces.hpp); then the hand check of the
// governing pile: the closed form of explain.hpp where it is exact, else the rigid cap's
// general 6-DOF equations with the numbers substituted. Empty when nothing was checked.
std::string render_equilibrium_section_html(const CheckReport& report);

// One file that fed the run, as read.
struct InputFileText {
  std::string path;     // as opened (relative to the working folder, or absolute)
  std::string role;     // "project file", "include", "reactions CSV"
  std::string content;  // the bytes read
};

// `path` relative to the folder of project.file (lexically; "cap.yaml",
// "../common/piles.yaml"), as every page of the package names files.
std::string relative_to_project(const Project& project, const std::string& path);

// Up to this many combinations, every combination gets its own table in the package.
inline constexpr std::size_t kFullCombinationsLimit = 20;

// Which combinations get their own table (indexed like results.combinations): all of them
// up to kFullCombinationsLimit; beyond it the governing combination of each pile and of each
// check (compression, tension, lateral, structural, utilization), every failing or
// overturned combination, and those named in project.package.show_combinations.
std::vector<bool> combinations_shown(const Project& project, const CheckResults& results);

// Every pile in every combination as one CSV table (combination, limit state, pile, forces,
// utilization, check, state, result), in the project's units, ending with the caution.
std::string all_combinations_csv(const CheckReport& report);

// The package of one cap.
struct CapPackageInput {
  HtmlReportInput report;              // check and capacities; extra sections kept
  std::vector<InputFileText> inputs;   // the project file first
  std::string project_name;            // running header: the foundation, else the cap
  std::string all_combinations_file;   // the full CSV's name beside the page, when written
  // The nonlinear soil response (html_nonlinear.hpp), placed after the equilibrium section
  // when it holds a governing pile or a pushover curve; absent for a linear run.
  std::optional<NonlinearSection> nonlinear;
};

// The whole page of one cap ("<!DOCTYPE html>…").
std::string render_cap_package_html(const CapPackageInput& input);

// The sign-off block, the design basis with warnings, the input echo and the input-text
// appendix, each on its own (render_cap_package_html places them).
std::string render_sign_off_html(const Project& project);
std::string render_design_basis_html(const CheckReport& report);
std::string render_input_echo_html(const CheckReport& report,
                                   const std::vector<InputFileText>& inputs);
std::string render_input_appendix_html(const CheckReport& report,
                                       const std::vector<InputFileText>& inputs);

// The print style sheet with the running header for `project_name` and `cap`.
std::string package_print_css(const std::string& project_name, const std::string& cap);

// A table of contents linking every "<section … id=…>" of `html` by its first <h2>.
std::string table_of_contents_html(const std::string& html);

// One row of the index of a package of several caps.
struct PackageIndexRow {
  std::string page;    // the cap's page, relative to the index ("bent-3.html")
  std::string source;  // the cap's project file as given
  std::string title;
  std::string verdict;  // "pass", "fail", "overturned", "group checks fail"
  double max_utilization = 0.0;
  std::string pile, combination;  // where the largest utilization occurs ("-": none)
  bool pass = true;
};

// index.html: one row per cap, linked to its page, with the command and the caution.
std::string render_package_index_html(const std::vector<PackageIndexRow>& rows,
                                      const std::string& command);

}  // namespace cairn
