#include "cairn/cli.hpp"

#include <CLI/CLI.hpp>

#include <algorithm>
#include <ostream>

#include <fmt/format.h>

#include "cairn/cap_solver.hpp"
#include "cairn/capacity_report.hpp"
#include "cairn/checks.hpp"
#include "cairn/explain.hpp"
#include "cairn/group_checks.hpp"
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
                                                      : "springs";
  std::string text = fmt::format("{} --format {}", name, format_name(o.format));
  if (o.depth_step) text += fmt::format(" --step {:g}", *o.depth_step);
  if (o.min_length) text += fmt::format(" --from {:g}", *o.min_length);
  if (o.out_dir) text += " --out " + *o.out_dir;
  if (o.explain_pile) text += " --explain " + *o.explain_pile;
  return text;
}

// Everything `check` computes for one project file.
struct CheckRun {
  Project project;
  std::vector<PileTypeCapacity> capacities;
  std::vector<PileTypeStiffness> stiffness;
  std::vector<PileTypeResistance> resistances;
  CheckResults results;
  GroupResults group;
};

CheckRun check_project(const std::string& file) {
  CheckRun run;
  run.project = read_project(file);
  const Project& project = run.project;
  run.capacities = compute_capacities(project);
  run.stiffness = pile_type_stiffness(project, run.capacities);
  const CapSolver solver(pile_springs(project, run.stiffness));
  Diagnostics problems;
  for (const auto& u : unresisted_cases(project, solver)) {
    const LoadCase& lc = project.load_cases[u.load_case];
    problems.error(lc.where, fmt::format("load_cases.{}: {} cannot be resisted: {}", lc.id,
                                         u.load.component, u.load.reason));
  }
  run.resistances = resolve_resistances(project, computed_resistances(project, run.capacities));
  for (const auto& d : missing_resistances(project, run.resistances))
    problems.error(d.where, d.message);
  for (const auto& d : group_input_problems(project, run.capacities))
    problems.error(d.where, d.message);
  problems.raise_if_any();
  run.results = check_piles(project, solve_combinations(project, solver), run.resistances);
  run.group = evaluate_group(project, run.results, run.resistances, run.capacities);
  if (!run.group.pass) run.results.summary.pass = false;
  return run;
}

int run_check(const Options& options, std::ostream& out) {
  if (options.files.size() != 1)
    throw InputError({}, "check: expected one project file");
  CheckRun run = check_project(options.files.front());
  CheckReport report;
  report.project = &run.project;
  report.results = &run.results;
  report.resistances = &run.resistances;
  std::vector<std::pair<std::string, std::string>> sources;
  for (const auto& k : run.stiffness) sources.emplace_back(k.axial_source, k.lateral_source);
  report.assumptions = assumptions(run.project, run.resistances, sources);
  report.stiffness = &run.stiffness;
  report.group = &run.group;
  report.options = describe_options(options);
  if (options.explain_pile) {
    const auto& piles = run.project.piles;
    auto it = std::find_if(piles.begin(), piles.end(),
                           [&](const Pile& p) { return p.id == *options.explain_pile; });
    if (it == piles.end()) {
      std::vector<std::string> ids;
      for (const auto& p : piles) ids.push_back(p.id);
      const std::string near = closest_match(*options.explain_pile, ids);
      throw InputError({run.project.file, 0, 0},
                       fmt::format("--explain: pile '{}' does not exist{}", *options.explain_pile,
                                   near.empty() ? "" : "; did you mean '" + near + "'?"));
    }
    report.explain_pile = static_cast<std::size_t>(it - piles.begin());
    report.hand_checks = explain_pile(run.project, run.results, *report.explain_pile);
  }
  const std::string rendered = render_check(report, options.format);
  if (options.out_dir) write_files_atomically(*options.out_dir, check_files(report));
  out << rendered;
  return run.results.summary.pass ? kExitPass : kExitFail;
}

int run_capacity(const Options& options, std::ostream& out) {
  if (options.files.size() != 1) throw InputError({}, "capacity: expected one project file");
  const Project project = read_project(options.files.front());
  const UnitSystem u = project.units;
  const double step = options.depth_step ? *options.depth_step * to_si_factor(u, Quantity::length)
                                         : (u == UnitSystem::SI ? 0.5 : 0.3048);
  const double from = options.min_length ? *options.min_length * to_si_factor(u, Quantity::length)
                                         : (u == UnitSystem::SI ? 3.0 : 3.048);
  if (!(step > 0)) throw InputError({}, "--step: expected a positive length");
  const auto capacities = compute_capacities(project, step, from);
  out << render_capacities(project, capacities, options.format, describe_options(options));
  return kExitPass;
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
    }
    return kExitBadInput;
  } catch (const InputError& e) {
    for (const auto& d : e.diagnostics()) err << "cairn: " << d.format() << "\n";
    return kExitBadInput;
  } catch (const OutputError& e) {
    err << "cairn: error: " << e.what() << "\n";
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

  CLI::App* check = app.add_subcommand(
      "check", "Share the cap's loads among the piles and check each pile in every combination");
  check->add_option("file", options.files, "Project file (YAML)")->required();
  check->add_option("--format", format, "Output format: text, csv, markdown or json")
      ->check(CLI::IsMember(formats));
  check->add_option("--out", options.out_dir,
                    "Also write report.txt, report.md, results.json and CSV tables into DIR");
  check->add_option("--explain", options.explain_pile,
                    "Show the hand check (section properties, substituted formula) for PILE");
  CLI::App* capacity = app.add_subcommand(
      "capacity", "Compute each pile type's capacity from the soil profile, layer by layer and "
                  "with depth");
  capacity->add_option("file", options.files, "Project file (YAML)")->required();
  capacity->add_option("--format", format, "Output format: text, markdown or json")
      ->check(CLI::IsMember(std::vector<std::string>{"text", "markdown", "json"}));
  capacity->add_option("--step", options.depth_step,
                       "Length step of the capacity-with-depth table, in the project's length "
                       "unit (default 0.5 m or 1 ft)");
  capacity->add_option("--from", options.min_length,
                       "Shortest pile length in the table (default 3 m or 10 ft)");
  CLI::App* springs = app.add_subcommand(
      "springs", "Write each pile's head springs (axial and lateral stiffness) for the global "
                 "structural model");
  springs->add_option("file", options.files, "Project file (YAML)")->required();
  springs->add_option("--format", format, "Output format: text, csv, markdown or json")
      ->check(CLI::IsMember(formats));
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
  return run(options, out, err);
}

}  // namespace cairn
