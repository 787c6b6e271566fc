#include "cairn/cli.hpp"

#include <CLI/CLI.hpp>

#include <algorithm>
#include <filesystem>
#include <set>
#include <thread>
#include <ostream>

#include <fmt/format.h>

#include "cairn/analysis.hpp"
#include "cairn/cap_solver.hpp"
#include "cairn/capacity_report.hpp"
#include "cairn/checks.hpp"
#include "cairn/explain.hpp"
#include "cairn/group_checks.hpp"
#include "cairn/html_report.hpp"
#include "cairn/plan_svg.hpp"
#include "cairn/stiffness.hpp"
#include "cairn/input.hpp"
#include "cairn/output_files.hpp"

namespace cairn {
namespace {

const char* format_name(Format f) {
  switch (f) {
    case Format::text: return "text";
    case Format::csv: return "csv";
    case Format::markdown: return "markdown";
    case Format::json: return "json";
  }
  return "text";
}

std::string describe_options(const Options& o) {
  const char* name = o.command == Command::check      ? "check"
                     : o.command == Command::capacity ? "capacity"
                     : o.command == Command::report   ? "report"
                                                      : "springs";
  std::string text = fmt::format("{} --format {}", name, format_name(o.format));
  if (o.depth_step) text += fmt::format(" --step {:g}", *o.depth_step);
  if (o.min_length) text += fmt::format(" --from {:g}", *o.min_length);
  if (o.out_dir) text += " --out " + *o.out_dir;
  if (o.explain_pile) text += " --explain " + *o.explain_pile;
  return text;
}

// Every cap of the files given (foundation files expanded), analysed on all cores. Input
// problems in any cap stop the run before anything is written.
std::vector<CapOutcome> analyse_all(const std::vector<std::string>& given) {
  std::vector<std::string> files;
  for (const auto& f : given)
    for (const auto& cap : expand_foundation(f)) files.push_back(cap);
  auto outcomes = analyse_projects(files, std::max(1u, std::thread::hardware_concurrency()));
  std::vector<Diagnostic> problems;
  for (const auto& o : outcomes) problems.insert(problems.end(), o.problems.begin(), o.problems.end());
  if (!problems.empty()) throw InputError(problems);
  return outcomes;
}

// A file's stem for output names, made unique among the caps of one run (a.yaml, a-2, …).
std::string unique_stem(const std::string& file, std::set<std::string>& used) {
  const std::string stem = std::filesystem::path(file).stem().string();
  std::string name = stem;
  for (int n = 2; !used.insert(name).second; ++n) name = stem + "-" + std::to_string(n);
  return name;
}

CapSummaryRow summary_row(const CheckRun& run) {
  const Project& p = run.project;
  const CheckSummary& s = run.results.summary;
  CapSummaryRow row;
  row.file = p.file;
  row.title = p.title;
  row.units = p.units;
  row.piles = p.piles.size();
  row.combinations = p.combinations.size();
  row.max_utilization = s.max_utilization;
  row.pile = s.pile ? p.piles[*s.pile].id : "-";
  row.combination = s.combination ? p.combinations[*s.combination].id : "-";
  row.check = to_string(s.check);
  for (const auto& gc : run.group.per_combination)
    if (gc.settlement) row.settlement = std::max(row.settlement.value_or(0.0), *gc.settlement);
  row.pass = s.pass;
  row.status = !s.overturned.empty()          ? "overturns"
               : s.failed_combinations > 0     ? "fail"
               : !run.group.pass               ? "group checks fail"
                                               : "pass";
  return row;
}

// Several caps: every file is checked (in parallel), then one summary table. Input
// problems in any file stop the run before anything is written.
int run_batch(const Options& options, std::ostream& out) {
  if (options.explain_pile) throw InputError({}, "--explain: give a single project file");
  const auto outcomes = analyse_all(options.files);
  std::vector<CapSummaryRow> rows;
  std::vector<std::pair<std::string, std::string>> written;
  bool pass = true;
  std::set<std::string> stems;
  const std::string described = describe_options(options);
  for (const auto& o : outcomes) {
    rows.push_back(summary_row(*o.run));
    pass = pass && rows.back().pass;
    if (options.out_dir) {
      const CheckReport report = make_check_report(*o.run, described, std::nullopt);
      const std::string stem = unique_stem(o.file, stems);
      for (auto& [name, content] : check_files(report)) written.emplace_back(stem + "/" + name, content);
    }
  }
  const std::string rendered = render_cap_summary(rows, options.format, described);
  if (options.out_dir) {
    written.emplace_back("summary.txt", render_cap_summary(rows, Format::text, described));
    written.emplace_back("summary.csv", render_cap_summary(rows, Format::csv, described));
    written.emplace_back("summary.json", render_cap_summary(rows, Format::json, described));
    write_files_atomically(*options.out_dir, written);
  }
  out << rendered;
  return pass ? kExitPass : kExitFail;
}

int run_check(const Options& options, std::ostream& out) {
  // Several files, or a foundation file listing caps: the batch summary.
  if (options.files.size() != 1) return run_batch(options, out);
  const auto caps = expand_foundation(options.files.front());
  if (caps.size() != 1 || caps.front() != options.files.front()) return run_batch(options, out);
  const CheckRun run = analyse_project(options.files.front());
  const CheckReport report = make_check_report(run, describe_options(options), options.explain_pile);
  const std::string rendered = render_check(report, options.format);
  if (options.out_dir) write_files_atomically(*options.out_dir, check_files(report));
  out << rendered;
  return run.results.summary.pass ? kExitPass : kExitFail;
}

// The capacity-with-depth table's default step and shortest length, m: 0.5 m from 3 m, or
// 1 ft from 10 ft in a US project.
struct DepthTable {
  double step, from;
};
DepthTable default_depth_table(UnitSystem u) {
  return u == UnitSystem::SI ? DepthTable{0.5, 3.0} : DepthTable{0.3048, 3.048};
}

int run_capacity(const Options& options, std::ostream& out) {
  if (options.files.size() != 1) throw InputError({}, "capacity: expected one project file");
  const Project project = read_project(options.files.front());
  const UnitSystem u = project.units;
  const DepthTable table = default_depth_table(u);
  const double step = options.depth_step ? *options.depth_step * to_si_factor(u, Quantity::length)
                                         : table.step;
  const double from = options.min_length ? *options.min_length * to_si_factor(u, Quantity::length)
                                         : table.from;
  if (!(step > 0)) throw InputError({}, "--step: expected a positive length");
  const auto capacities = compute_capacities(project, step, from);
  out << render_capacities(project, capacities, options.format, describe_options(options));
  return kExitPass;
}

// The group checks and settlement as an HTML section of the calculation package.
std::string group_section_html(const CheckReport& report) {
  const GroupParts parts = group_parts(report);
  std::string html = "<section id=\"group\"><h2>Group checks and settlement</h2>\n";
  auto lines = [&](const std::vector<std::string>& list) {
    if (list.empty()) return;
    html += "<ul>\n";
    for (const auto& line : list) html += "<li>" + xml_escape(line) + "</li>\n";
    html += "</ul>\n";
  };
  lines(parts.layout);
  html += render_table_html(parts.efficiency);
  lines(parts.checks);
  html += render_table_html(parts.demand);
  lines(parts.notes);
  return html + "</section>";
}

// The calculation package: one self-contained HTML file per cap (plus, when asked, the
// plan alone as SVG and the tables as CSV and Markdown), all written at once.
int run_report(const Options& options, std::ostream& out) {
  if (!options.out_dir) throw InputError({}, "report: expected --out DIR for the report files");
  const auto outcomes = analyse_all(options.files);
  const std::string described = describe_options(options);
  std::vector<std::pair<std::string, std::string>> written;
  std::string listing;
  bool pass = true;
  std::set<std::string> stems;
  for (const auto& o : outcomes) {
    const CheckRun& run = *o.run;
    pass = pass && run.results.summary.pass;
    const CheckReport report = make_check_report(run, described, std::nullopt);
    const UnitSystem u = run.project.units;
    // Capacities again, with the capacity-with-depth table for the chart.
    const DepthTable table = default_depth_table(u);
    const auto capacities = compute_capacities(run.project, table.step, table.from);
    HtmlReportInput input;
    input.check = &report;
    input.capacities = &capacities;
    input.extra_sections_html.push_back(group_section_html(report));
    const std::string stem = unique_stem(o.file, stems);
    written.emplace_back(stem + ".html", render_html_report(input));
    if (options.plan_svg)
      written.emplace_back(stem + "-plan.svg",
                           render_plan_svg(run.project, &run.results, &run.resistances));
    if (options.tables)
      for (auto& [name, content] : check_files(report)) written.emplace_back(stem + "/" + name, content);
    listing += fmt::format("{}: {} — {}\n", o.file, summary_line(report),
                           (std::filesystem::path(*options.out_dir) / (stem + ".html")).string());
  }
  // Nothing is said about the files until all of them are in place.
  write_files_atomically(*options.out_dir, written);
  out << listing;
  return pass ? kExitPass : kExitFail;
}

int run_springs(const Options& options, std::ostream& out) {
  if (options.files.size() != 1) throw InputError({}, "springs: expected one project file");
  const Project project = read_project(options.files.front());
  const auto stiffness = pile_type_stiffness(project, compute_capacities(project));
  out << render_springs(project, stiffness, options.format, describe_options(options));
  return kExitPass;
}

}  // namespace

int run(const Options& options, std::ostream& out, std::ostream& err) {
  try {
    switch (options.command) {
      case Command::check: return run_check(options, out);
      case Command::capacity: return run_capacity(options, out);
      case Command::springs: return run_springs(options, out);
      case Command::report: return run_report(options, out);
    }
    return kExitBadInput;
  } catch (const InputError& e) {
    for (const auto& d : e.diagnostics()) err << "cairn: " << d.format() << "\n";
    return kExitBadInput;
  } catch (const OutputError& e) {
    err << "cairn: error: " << e.what() << "\n";
    return kExitBadInput;
  } catch (const std::invalid_argument& e) {
    // A method refused its data (outside its range of validity).
    err << "cairn: error: cannot compute: " << e.what() << "\n";
    return kExitBadInput;
  } catch (const std::exception& e) {
    // Our own bugs (std::logic_error and anything unexpected).
    err << "cairn: internal error: " << e.what() << "\n";
    return kExitBadInput;
  }
}

int run_command_line(int argc, const char* const* argv, std::ostream& out, std::ostream& err) {
  CLI::App app{"cairn — checks that no pile under a rigid cap is overloaded, for every load "
               "combination. Results are for checking by a qualified engineer; local codes and "
               "licensed practice govern."};
  app.set_version_flag("--version", std::string("cairn ") + CAIRN_VERSION);
  app.require_subcommand(1);
  Options options;
  std::string format = "text";
  const std::vector<std::string> formats = {"text", "csv", "markdown", "json"};

  // The project file(s) and --format, which every command takes.
  auto add_files_and_format = [&](CLI::App* command, const std::string& name,
                                  const std::string& files_help,
                                  const std::vector<std::string>& allowed) {
    command->add_option(name, options.files, files_help)->required();
    std::string names;
    for (std::size_t i = 0; i < allowed.size(); ++i)
      names += (i == 0 ? "" : i + 1 == allowed.size() ? " or " : ", ") + allowed[i];
    command->add_option("--format", format, "Output format: " + names)
        ->check(CLI::IsMember(allowed));
  };

  CLI::App* check = app.add_subcommand(
      "check", "Share the cap's loads among the piles and check each pile in every combination");
  add_files_and_format(check, "files",
                       "Project file (YAML); several files, or a foundation file listing caps, "
                       "check every cap and print one summary table",
                       formats);
  check->add_option("--out", options.out_dir,
                    "Also write report.txt, report.md, results.json and CSV tables into DIR");
  check->add_option("--explain", options.explain_pile,
                    "Show the hand check (section properties, substituted formula) for PILE");
  CLI::App* capacity = app.add_subcommand(
      "capacity", "Compute each pile type's capacity from the soil profile, layer by layer and "
                  "with depth");
  add_files_and_format(capacity, "file", "Project file (YAML)", {"text", "markdown", "json"});
  capacity->add_option("--step", options.depth_step,
                       "Length step of the capacity-with-depth table, in the project's length "
                       "unit (default 0.5 m or 1 ft)");
  capacity->add_option("--from", options.min_length,
                       "Shortest pile length in the table (default 3 m or 10 ft)");
  CLI::App* springs = app.add_subcommand(
      "springs", "Write each pile's head springs (axial and lateral stiffness) for the global "
                 "structural model");
  add_files_and_format(springs, "file", "Project file (YAML)", formats);
  CLI::App* report = app.add_subcommand(
      "report", "Write the calculation package: a self-contained HTML report per cap, for a "
                "checking engineer");
  report->add_option("files", options.files, "Project files or a foundation file")->required();
  report->add_option("--out", options.out_dir, "Folder for the report files")->required();
  report->add_flag("--svg", options.plan_svg, "Also write the cap plan alone as SVG");
  report->add_flag("--tables", options.tables,
                   "Also write the tables as CSV and Markdown (report.md, *.csv per cap)");
  try {
    app.parse(argc, argv);
  } catch (const CLI::CallForHelp& e) {
    out << app.help();
    return kExitPass;
  } catch (const CLI::CallForVersion& e) {
    out << e.what() << "\n";
    return kExitPass;
  } catch (const CLI::ParseError& e) {
    err << "cairn: error: " << e.what() << "\n";
    if (e.get_name() == "RequiredError" || e.get_name() == "ExtrasError" ||
        e.get_name() == "CallForAllHelp")
      err << "Run 'cairn --help' for usage.\n";
    return kExitBadInput;
  }
  if (format == "csv") options.format = Format::csv;
  else if (format == "markdown") options.format = Format::markdown;
  else if (format == "json") options.format = Format::json;
  if (check->parsed()) options.command = Command::check;
  if (capacity->parsed()) options.command = Command::capacity;
  if (springs->parsed()) options.command = Command::springs;
  if (report->parsed()) options.command = Command::report;
  return run(options, out, err);
}

}  // namespace cairn
