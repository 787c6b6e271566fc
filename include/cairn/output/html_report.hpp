// html_report.hpp — the calculation package: one self-contained HTML document a checking
// engineer can read, print (A4 or Letter) and verify by hand.
//
// The document holds, in order: a title block (tool version, input file, the command as it
// was run, units, pass/fail, and any overturned combination named on its own line), the basis (units and axes, capacities with their basis and source, methods,
// assumptions), the cap plan drawn to scale (plan_svg.hpp), load cases and combinations,
// per-pile results per combination and the envelope, the capacity breakdown of one sample
// pile type with the equations written out and the numbers substituted (Vesić 1977, Meyerhof
// 1976, O'Neill & Reese 1999 as capacity.hpp computes them), a capacity-with-depth chart,
// the hand check when one was asked for, any extra sections (group checks, settlement) and
// the caution that results are for review by a qualified engineer.
//
// Numbers are shown in the project's units (SI: kN, m, kPa, kN·m; US: kip, ft, ksf, kip·ft);
// nothing is recomputed here beyond the arithmetic that displays a substituted equation.
// Self-contained: styles inline, drawings as inline SVG, no scripts, no network. Every piece
// of user text (titles, ids, notes) is escaped. Nothing is written to files here.
#pragma once

#include <string>
#include <vector>

#include "cairn/geotechnics/project_capacity.hpp"
#include "cairn/output/report.hpp"

namespace cairn {

struct HtmlReportInput {
  const CheckReport* check = nullptr;  // required, with project, results and resistances set
  // Computed single-pile capacities (may be null or empty: the capacity sections then say
  // that capacities were typed in). The first entry is the sample pile type; its
  // depth_table, when filled, gives the capacity-with-depth chart.
  const std::vector<PileTypeCapacity>* capacities = nullptr;
  // Further sections, each a complete "<section>…</section>" already escaped, placed after
  // the results and before the caution (group checks, settlement: html_package.hpp).
  std::vector<std::string> extra_sections_html;
  // Sections placed right after the title block, before section 1 (the package's sign-off,
  // contents and design basis: html_package.hpp).
  std::vector<std::string> front_sections_html;
  // More style rules, appended to the built-in style sheet (the package's print rules).
  std::string extra_style;
  // Which combinations get their own table in section 4, indexed like
  // CheckResults::combinations (empty: all); `omitted_note` then says where the others are.
  std::vector<bool> show_combination;
  std::string omitted_note;
};

// The whole calculation package as one HTML document ("<!DOCTYPE html>…</html>").
// Throws std::invalid_argument when input.check or its project, results or resistances is null.
std::string render_html_report(const HtmlReportInput& input);

// One table as an HTML <table> with its title as <caption>; numeric columns right-aligned,
// utilization cells tinted with the plan's colour scale (0 to `scale_max`, plan_svg.hpp) and
// failing cells of a "state", "status" or "result" column ("fail", "overturned") marked.
std::string render_table_html(const Table& table, double scale_max = 1.2);

// The capacity-with-depth chart of one pile type as an inline SVG: ultimate compression and
// tension (horizontal axis, project force unit) against pile length (vertical axis, down,
// project length unit), the type's length marked. Empty string when depth_table is empty.
std::string render_depth_chart_svg(const Project& project, const PileTypeCapacity& capacity);

}  // namespace cairn
