#include "cairn/app/cli.hpp"

#include <CLI/CLI.hpp>

#include <cctype>
#include <deque>
#include <functional>
#include <chrono>
#include <unistd.h>
#include <algorithm>
#include <filesystem>
#include <set>
#include <string_view>
#include <thread>
#include <ostream>

#include <fmt/format.h>

#include "cairn/app/analysis.hpp"
#include "cairn/app/package.hpp"
#include "cairn/app/progress.hpp"
#include "cairn/app/design_command.hpp"
#include "cairn/solver/cap_solver.hpp"
#include "cairn/geotechnics/capacity_length.hpp"
#include "cairn/output/capacity_report.hpp"
#include "cairn/checks/checks.hpp"
#include "cairn/checks/explain.hpp"
#include "cairn/checks/group_checks.hpp"
#include "cairn/geotechnics/stiffness.hpp"
#include "cairn/input/input.hpp"
#include "cairn/input/package_keys.hpp"
#include "cairn/output/output_files.hpp"
#include "cairn/app/site_commands.hpp"

namespace cairn {
namespace {

// The words of --format and --detail, in the order of their enums (report.hpp).
const std::vector<std::string> kFormats = {"text", "csv", "markdown", "json"};
const std::vector<std::string> kDetails = {"full", "envelope", "governing", "summary"};

const char* format_name(Format f) { return kFormats[static_cast<std::size_t>(f)].c_str(); }

// The value of the word CLI11 has checked to be one of `words`.
template <class E>
E chosen(const std::vector<std::string>& words, const std::string& word) {
  return static_cast<E>(std::find(words.begin(), words.end(), word) - words.begin());
}

const char* command_name(Command command);  // from the table of subcommands below

std::string describe_options(const Options& o) {
  if (!o.command_line.empty()) return o.command_line;
  std::string text =
      fmt::format("cairn {} --format {}", command_name(o.command), format_name(o.format));
  if (o.depth_step) text += fmt::format(" --step {:g}", *o.depth_step);
  if (o.min_length) text += fmt::format(" --from {:g}", *o.min_length);
  if (o.need_compression) text += fmt::format(" --need-compression {:g}", *o.need_compression);
  if (o.need_tension) text += fmt::format(" --need-tension {:g}", *o.need_tension);
  if (o.need_compression || o.need_tension)
    text += fmt::format(" --need-basis {}", to_string(o.need_basis));
  if (o.detail != Detail::full) text += std::string(" --detail ") + to_string(o.detail);
  if (o.out_dir) text += " --out " + *o.out_dir;
  if (o.explain_pile) text += " --explain " + *o.explain_pile;
  if (o.as_built) text += " --as-built " + *o.as_built;
  if (o.soil_response) text += std::string(" --soil-response ") + to_string(*o.soil_response);
  return text;
}

// One argument as a POSIX shell would need it written: as is when it holds only safe
// characters, else in single quotes.
std::string shell_word(const std::string& word) {
  const bool safe = !word.empty() && std::all_of(word.begin(), word.end(), [](unsigned char c) {
    return std::isalnum(c) || std::string_view("-_./=:,+@%").find(static_cast<char>(c)) !=
                                  std::string_view::npos;
  });
  if (safe) return word;
  std::string quoted = "'";
  for (char c : word) quoted += c == '\'' ? std::string("'\\''") : std::string(1, c);
  return quoted + "'";
}

// The command line as it was run, for report headers: the program's file name (its folder
// would tie the outputs to one machine) and every argument.
std::string command_line_text(int argc, const char* const* argv) {
  std::string text =
      argc > 0 && argv[0] ? std::filesystem::path(argv[0]).filename().string() : "cairn";
  for (int i = 1; i < argc; ++i) text += " " + shell_word(argv[i]);
  return text;
}

// Every cap of the files given (foundation files expanded), analysed on all cores. Input
// problems in any cap stop the run before anything is written.
// Progress goes to stderr only when it is a terminal, and only once a run has taken more
// than a second: "cairn: 120 of 500 caps checked", rewritten in place, cleared at the end.
std::vector<CapOutcome> analyse_all(const std::vector<std::string>& given,
                                    const AnalysisOptions& options, std::ostream& err,
                                    const std::function<void(CapOutcome&)>& reduce = {}) {
  std::vector<std::string> files;
  for (const auto& f : given)
    for (const auto& cap : expand_foundation(f)) files.push_back(cap);
  Progress progress(err, "caps");
  auto outcomes = analyse_projects(files, std::max(1u, std::thread::hardware_concurrency()),
                                   options, progress.callback(), reduce);
  progress.clear();
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
  row.status = !s.overturned.empty()          ? to_string(Verdict::overturned)
               : s.failed_combinations > 0     ? "fail"
               : !run.group.pass               ? "group checks fail"
                                               : "pass";
  return row;
}

// Warnings never change the exit status: they go to stderr (and into the reports' notes).
void print_warnings(const Project& project, std::ostream& err) {
  for (const auto& w : project.warnings) err << "cairn: " << format_warning(w) << "\n";
}

// Several caps: every file is checked (in parallel), then one summary table. Input
// problems in any file stop the run before anything is written.
int run_batch(const Options& options, std::ostream& out, std::ostream& err) {
  if (options.explain_pile) throw InputError({}, "--explain: give a single project file");
  // The summary table needs no pile rows; the files under --out do at full detail.
  // Without --out only the summary row and the warnings of each cap are kept, as soon as
  // the cap is done.
  std::function<void(CapOutcome&)> reduce;
  if (!options.out_dir)
    reduce = [](CapOutcome& o) {
      if (!o.run) return;
      o.summary = summary_row(*o.run);
      o.warnings = std::move(o.run->project.warnings);
      o.run.reset();
    };
  const auto outcomes =
      analyse_all(options.files,
                  AnalysisOptions{.pile_rows = options.out_dir && options.detail == Detail::full,
                                  .soil_response = options.soil_response},
                  err, reduce);
  std::vector<CapSummaryRow> rows;
  std::vector<OutputFile> written;
  std::deque<CheckReport> reports;  // the streamed files point into them
  bool pass = true;
  std::set<std::string> stems;
  const std::string described = describe_options(options);
  for (const auto& o : outcomes)
    for (const auto& w : o.run ? o.run->project.warnings : o.warnings)
      err << "cairn: " << format_warning(w) << "\n";
  for (const auto& o : outcomes) {
    rows.push_back(o.run ? summary_row(*o.run) : *o.summary);
    pass = pass && rows.back().pass;
    if (options.out_dir) {
      reports.push_back(make_check_report(*o.run, described, std::nullopt));
      reports.back().detail = options.detail;
      const std::string stem = unique_stem(o.file, stems);
      for (auto& file : check_outputs(reports.back()))
        written.push_back({stem + "/" + file.name, std::move(file.write)});
    }
  }
  const std::string rendered = render_cap_summary(rows, options.format, described);
  if (options.out_dir) {
    for (const Format f : {Format::text, Format::csv, Format::json}) {
      const char* name = f == Format::text ? "summary.txt" : f == Format::csv ? "summary.csv" : "summary.json";
      written.push_back({name, [text = render_cap_summary(rows, f, described)](std::ostream& o) { o << text; }});
    }
    write_files_atomically(*options.out_dir, written);
  }
  out << rendered;
  return pass ? kExitPass : kExitFail;
}

int run_check(const Options& options, std::ostream& out, std::ostream& err) {
  if (options.as_built) return run_as_built_check(options, describe_options(options), out, err);
  // Several files, or a foundation file listing caps: the batch summary.
  if (options.files.size() != 1) return run_batch(options, out, err);
  const auto caps = expand_foundation(options.files.front());
  if (caps.size() != 1 || caps.front() != options.files.front()) return run_batch(options, out, err);
  // Below full detail no pile rows are kept (the hand check of --explain needs them).
  // Progress as for many caps: on a terminal only, after a second (progress.hpp).
  Progress progress(err, "combinations");
  progress.phase("reading " + options.files.front());
  AnalysisOptions analysis;
  analysis.pile_rows = options.detail == Detail::full || options.explain_pile.has_value();
  analysis.soil_response = options.soil_response;
  analysis.progress = progress.callback();
  const CheckRun run = analyse_project(options.files.front(), analysis);
  progress.clear();
  print_warnings(run.project, err);
  CheckReport report = make_check_report(run, describe_options(options), options.explain_pile);
  report.detail = options.detail;
  // The files first (all or nothing), then the output streamed to the terminal or pipe.
  if (options.out_dir) {
    Progress writing(err, "");
    writing.phase("writing " + *options.out_dir);
    write_files_atomically(*options.out_dir, check_outputs(report));
  }
  write_check(report, options.format, out);
  return run.results.summary.pass ? kExitPass : kExitFail;
}

// Refuses a --step or --from that is not a plausible length, or a table longer than
// kMaxDepthRows rows (a step of 1e-9 m would otherwise run for days).
void check_depth_table(const Project& project, const Options& options, double step, double from) {
  const UnitSystem u = project.units;
  const char* unit = unit_label(u, Quantity::length);
  const double largest = largest_plausible(Quantity::length);
  if (!(step > 0) || !(step <= largest))
    throw InputError({}, fmt::format("--step: expected a positive length in {} no larger than "
                                     "{:g}, got '{:g}'",
                                     unit, from_si(u, Quantity::length, largest),
                                     *options.depth_step));
  if (!(from > 0) || !(from <= largest))
    throw InputError({}, fmt::format("--from: expected a positive length in {} no larger than "
                                     "{:g}, got '{:g}'",
                                     unit, from_si(u, Quantity::length, largest),
                                     *options.min_length));
  if (!project.soil) return;
  const double longest = project.soil->depth();
  const double rows = depth_table_rows(longest, step, from);
  if (rows <= static_cast<double>(kMaxDepthRows)) return;
  const double shortest_step = (longest - from) / static_cast<double>(kMaxDepthRows - 1);
  throw InputError({}, fmt::format("--step: a table from {:g} {} to the base of the soil at "
                                   "{:g} {} in steps of {:g} {} would have {:.0f} rows, more "
                                   "than {}; use a step of at least {:.3g} {}",
                                   from_si(u, Quantity::length, from), unit,
                                   from_si(u, Quantity::length, longest), unit,
                                   from_si(u, Quantity::length, step), unit, rows, kMaxDepthRows,
                                   from_si(u, Quantity::length, shortest_step), unit));
}

int run_capacity(const Options& options, std::ostream& out, std::ostream& err) {
  if (options.files.size() != 1) throw InputError({}, "capacity: expected one project file");
  const Project project = read_project(options.files.front());
  print_warnings(project, err);
  const UnitSystem u = project.units;
  const DepthTableRange table = default_depth_table(u);
  const double step = options.depth_step ? *options.depth_step * to_si_factor(u, Quantity::length)
                                         : table.step;
  const double from = options.min_length ? *options.min_length * to_si_factor(u, Quantity::length)
                                         : table.from;
  check_depth_table(project, options, step, from);
  require_table_within_profile(project, from, "--from");
  const auto capacities = compute_capacities(project, step, from);
  std::vector<PileTypeLength> lengths;
  if (options.need_compression || options.need_tension) {
    const double force = to_si_factor(u, Quantity::force);
    for (const auto& [value, name] : {std::pair{options.need_compression, "--need-compression"},
                                      std::pair{options.need_tension, "--need-tension"}})
      if (value && !(*value > 0))
        throw InputError({}, fmt::format("{}: expected a positive force in {}, got '{:g}'", name,
                                         unit_label(u, Quantity::force), *value));
    LengthNeed need;
    if (options.need_compression) need.compression = *options.need_compression * force;
    if (options.need_tension) need.tension = *options.need_tension * force;
    need.basis = options.need_basis;
    lengths = choose_lengths(project, capacities, need, step, from);
  }
  out << render_capacities(project, capacities, options.format, describe_options(options),
                           lengths);
  // A required capacity that no length within the profile gives is a failed check.
  for (const auto& l : lengths)
    if (!l.choice.length) return kExitFail;
  return kExitPass;
}

// The calculation package: one self-contained HTML file per cap (plus, when asked, the
// plan alone as SVG and the tables as CSV and Markdown), and index.html for several caps,
// all written at once (app/package.hpp).
int run_report(const Options& options, std::ostream& out, std::ostream& err) {
  if (!options.out_dir) throw InputError({}, "report: expected --out DIR for the report files");
  // The analysis builds the capacity-with-depth tables of the chart with the check; the
  // package shows every pile in every combination.
  auto outcomes = analyse_all(
      options.files,
      AnalysisOptions{.depth_tables = true, .soil_response = options.soil_response}, err);
  for (const auto& o : outcomes) print_warnings(o.run->project, err);
  PackageRequest request;
  request.command = describe_options(options);
  request.out_dir = *options.out_dir;
  request.plan_svg = options.plan_svg;
  request.tables = options.tables;
  // A foundation file names the project on every page.
  if (options.files.size() == 1 && outcomes.size() > 1) {
    request.foundation_title = foundation_title(options.files.front());
    if (request.foundation_title.empty())
      request.foundation_title = std::filesystem::path(options.files.front()).filename().string();
  }
  // --as-built: each cap's page is the as-built cap's, with the as-built section, and the
  // survey joins the input echo.
  if (options.as_built) {
    request.extra_inputs.push_back({*options.as_built, "pile survey"});
    for (auto& o : outcomes) {
      const auto site = as_built_run(
          std::move(*o.run), *options.as_built, options,
          AnalysisOptions{.depth_tables = true, .soil_response = options.soil_response});
      request.extra_sections.push_back({as_built_section_html(site->report(request.command))});
      request.pass_override.push_back(site->comparison.verdict != SiteVerdict::remedial);
      o.run = std::move(site->as_built);  // the section above is already rendered
    }
  }
  const PackageFiles package = package_files(outcomes, request);
  // Nothing is said about the files until all of them are in place.
  write_files_atomically(*options.out_dir, package.files);
  out << package.listing;
  return package.pass ? kExitPass : kExitFail;
}

int run_springs(const Options& options, std::ostream& out, std::ostream& err) {
  if (options.files.size() != 1) throw InputError({}, "springs: expected one project file");
  const Project project = read_project(options.files.front());
  print_warnings(project, err);
  const auto stiffness = pile_type_stiffness(project, compute_capacities(project));
  out << render_springs(project, stiffness, options.format, describe_options(options));
  return kExitPass;
}

// What the command line fills in before it becomes Options: the options themselves, and the
// choices given as words.
struct CommandLine {
  Options options;
  std::string format = "text";
  std::string detail = "full";
  std::string soil_response;
  std::string need_basis = "allowable";
};

// The project file(s) and --format, which every command but report takes.
void add_files_and_format(CLI::App* command, CommandLine& line, const std::string& name,
                          const std::string& files_help) {
  command->add_option(name, line.options.files, files_help)->required();
  std::string names;
  for (std::size_t i = 0; i < kFormats.size(); ++i)
    names += (i == 0 ? "" : i + 1 == kFormats.size() ? " or " : ", ") + kFormats[i];
  command->add_option("--format", line.format, "Output format: " + names)
      ->check(CLI::IsMember(kFormats));
}

// check and report: the soil's response, overriding the project's analysis.soil_response.
void add_soil_response(CLI::App* command, CommandLine& line) {
  command
      ->add_option("--soil-response", line.soil_response,
                   "How the soil holds the piles: linear (springs, default) or nonlinear (p-y, "
                   "t-z and Q-z curves, each combination on its own); overrides the project's "
                   "analysis.soil_response")
      ->check(CLI::IsMember({"linear", "nonlinear"}));
}

// check, report and the site studies: the as-built re-check of a survey (site/as_built.hpp).
void add_as_built(CLI::App* command, CommandLine& line) {
  command->add_option("--as-built", line.options.as_built,
                      "Re-check the cap as installed, from the pile survey SURVEY.csv");
  command->add_option("--plan-tolerance", line.options.plan_tolerance,
                      "With --as-built: plan position tolerance in mm (SI) or in (US); "
                      "default 75 mm or 3 in (common practice)");
  command->add_option("--batter-tolerance", line.options.batter_tolerance,
                      "With --as-built: batter tolerance 1 in N; default 50 (common practice)");
}

// The site studies (site/studies.hpp) end with --as-built and --out.
void add_study_options(CLI::App* command, CommandLine& line) {
  add_as_built(command, line);
  command->add_option("--out", line.options.out_dir,
                      "Also write the result and its plan (SVG) into DIR");
}

void check_options(CLI::App* check, CommandLine& line) {
  check->add_option("--out", line.options.out_dir,
                    "Also write report.txt, report.md, results.json and CSV tables (summary.csv, "
                    "envelope.csv, results.csv: one row per combination and pile) into DIR");
  check
      ->add_option("--detail", line.detail,
                   "How much to show: full (every pile in every combination, default), envelope "
                   "(per pile over all combinations), governing (per pile and check, the "
                   "governing combination) or summary (the verdict and the summary row)")
      ->check(CLI::IsMember(kDetails));
  check->add_option("--explain", line.options.explain_pile,
                    "Show the hand check (section properties, substituted formula) for PILE");
  add_soil_response(check, line);
  add_as_built(check, line);
}

void capacity_options(CLI::App* capacity, CommandLine& line) {
  capacity->add_option("--step", line.options.depth_step,
                       "Length step of the capacity-with-depth table, in the project's length "
                       "unit (default 0.5 m or 1 ft)");
  capacity->add_option("--from", line.options.min_length,
                       "Shortest pile length in the table (default 3 m or 10 ft)");
  capacity->add_option("--need-compression", line.options.need_compression,
                       "Find the shortest length carrying this compression, in the project's "
                       "force unit");
  capacity->add_option("--need-tension", line.options.need_tension,
                       "Find the shortest length carrying this tension, in the project's force "
                       "unit");
  capacity
      ->add_option("--need-basis", line.need_basis,
                   "Basis of --need-compression/--need-tension: allowable (service loads, "
                   "default) or factored (strength loads)")
      ->check(CLI::IsMember({"allowable", "factored"}));
}

void report_options(CLI::App* report, CommandLine& line) {
  report->add_option("files", line.options.files, "Project files or a foundation file")->required();
  report->add_option("--out", line.options.out_dir, "Folder for the report files")->required();
  report->add_flag("--svg", line.options.plan_svg, "Also write the cap plan alone as SVG");
  report->add_flag("--tables", line.options.tables,
                   "Also write the tables as CSV and Markdown (report.md, *.csv per cap)");
  add_soil_response(report, line);
  add_as_built(report, line);
}

void pile_loss_options(CLI::App* pile_loss, CommandLine& line) {
  pile_loss->add_flag("--pairs", line.options.pairs, "Also remove every pair of piles");
}

void add_pile_options(CLI::App* add_pile, CommandLine& line) {
  add_pile->add_option("--type", line.options.added_type, "Pile type of the added pile")
      ->required();
  add_pile->add_option("--step", line.options.grid_step,
                       "Grid step in mm (SI) or in (US); default 50 mm or 2 in");
  add_pile->add_option("--most", line.options.most_added, "Most piles to add: 1 or 2 (default 2)");
  add_pile->add_option("--lose", line.options.lose, "Take this pile out first (may repeat)");
}

void tolerance_options(CLI::App* tolerance, CommandLine& line) {
  tolerance->add_option("--trials", line.options.trials, "Number of random trials (default 10000)");
  tolerance->add_option("--seed", line.options.seed, "Seed of the random trials (default 1)");
  tolerance->add_flag("--normal", line.options.normal,
                      "Normal offsets with the tolerance as two standard deviations (default: "
                      "uniform over the tolerance circle)");
}

void safe_region_options(CLI::App* safe_region, CommandLine& line) {
  safe_region->add_option("--rays", line.options.rays,
                          "Rays traced where piles may drop out (default 72; 0: linear only)");
}

void diff_options(CLI::App* diff, CommandLine& line) {
  diff->add_option("--out", line.options.out_dir, "Also write diff.md and diff.json into DIR");
}

void design_options(CLI::App* design, CommandLine& line) {
  design->add_option("--write", line.options.write_file,
                     "Write the chosen layout as a complete project file BEST.yaml");
}

// A site command, which also takes the command line as described for its report headers.
template <int (*Run)(const Options&, const std::string&, std::ostream&, std::ostream&)>
int with_description(const Options& options, std::ostream& out, std::ostream& err) {
  return Run(options, describe_options(options), out, err);
}

// One subcommand: its name and description (as --help shows them, in this order), how its
// options are added (the file argument and --format first unless `files` is null, then its
// own, then those of a site study), and what runs it.
struct Subcommand {
  Command command;
  const char* name;
  const char* description;
  const char* files;
  const char* files_help;
  void (*add_options)(CLI::App*, CommandLine&);
  bool site_study;
  int (*run)(const Options&, std::ostream&, std::ostream&);
};

const char* const kOneFile = "Project file (YAML)";

const Subcommand kSubcommands[] = {
    {Command::check, "check",
     "Share the cap's loads among the piles and check each pile in every combination", "files",
     "Project file (YAML); several files, or a foundation file listing caps, check every cap and "
     "print one summary table",
     check_options, false, run_check},
    {Command::capacity, "capacity",
     "Compute each pile type's capacity from the soil profile, layer by layer and with depth",
     "file", kOneFile, capacity_options, false, run_capacity},
    {Command::springs, "springs",
     "Write each pile's head springs (axial and lateral stiffness) for the global structural "
     "model",
     "file", kOneFile, nullptr, false, run_springs},
    {Command::report, "report",
     "Write the calculation package: a self-contained HTML report per cap, for a checking "
     "engineer",
     nullptr, nullptr, report_options, false, run_report},
    {Command::pile_loss, "pile-loss",
     "Remove each pile in turn (or each pair) and report the cap's largest utilization", "file",
     kOneFile, pile_loss_options, true, with_description<run_pile_loss>},
    {Command::add_pile, "add-pile",
     "Search the cap outline for one (then two) added piles that make every combination pass",
     "file", kOneFile, add_pile_options, true, with_description<run_add_pile>},
    {Command::tolerance, "tolerance",
     "Random installation offsets within the plan tolerance: the distribution of the cap's "
     "largest utilization",
     "file", kOneFile, tolerance_options, true, with_description<run_tolerance>},
    {Command::safe_region, "safe-region",
     "Where each combination's vertical load may stand in plan with every pile passing, and "
     "the smallest margin",
     "file", kOneFile, safe_region_options, true, with_description<run_safe_region>},
    {Command::diff, "diff",
     "Compare two revisions of a cap: piles, inputs, forces and utilizations", "files",
     "OLD and NEW project files (YAML)", diff_options, false, with_description<run_diff>},
    {Command::design, "design",
     "Search pile layouts and lengths for the cheapest that passes every check", "file",
     "Project file (YAML) with a design: section", design_options, false, run_design},
};

const Subcommand* find_subcommand(Command command) {
  for (const Subcommand& s : kSubcommands)
    if (s.command == command) return &s;
  return nullptr;
}

const char* command_name(Command command) {
  const Subcommand* s = find_subcommand(command);
  return s ? s->name : "check";
}

}  // namespace

int run(const Options& options, std::ostream& out, std::ostream& err) {
  try {
    const Subcommand* s = find_subcommand(options.command);
    return s ? s->run(options, out, err) : kExitBadInput;
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
    err << "cairn: internal error: " << e.what()
        << " (a fault in cairn, not in the input; please report it with the project file)\n";
    return kExitBadInput;
  }
}

int run_command_line(int argc, const char* const* argv, std::ostream& out, std::ostream& err) {
  CLI::App app{"cairn — checks that no pile under a rigid cap is overloaded, for every load "
               "combination. Results are for checking by a qualified engineer; local codes and "
               "licensed practice govern."};
  app.set_version_flag("--version", std::string("cairn ") + CAIRN_VERSION);
  app.require_subcommand(1);
  CommandLine line;
  Options& options = line.options;
  std::vector<std::pair<const Subcommand*, CLI::App*>> commands;
  for (const Subcommand& s : kSubcommands) {
    CLI::App* command = app.add_subcommand(s.name, s.description);
    if (s.files) add_files_and_format(command, line, s.files, s.files_help);
    if (s.add_options) s.add_options(command, line);
    if (s.site_study) add_study_options(command, line);
    commands.push_back({&s, command});
  }
  // CLI11 takes an unknown command for a stray argument ("A subcommand is required");
  // name it and suggest the nearest command instead.
  if (argc > 1 && argv[1][0] != '-') {
    std::vector<std::string> names;
    for (const Subcommand& s : kSubcommands) names.push_back(s.name);
    const std::string given = argv[1];
    if (std::find(names.begin(), names.end(), given) == names.end()) {
      const std::string near = closest_match(given, names);
      std::string list;
      for (const auto& name : names) list += (list.empty() ? "" : ", ") + name;
      err << "cairn: error: unknown command '" << given << "'; "
          << (near.empty() ? "expected one of: " + list : "did you mean '" + near + "'?") << "\n"
          << "Run 'cairn --help' for usage.\n";
      return kExitBadInput;
    }
  }
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
  options.command_line = command_line_text(argc, argv);
  options.format = chosen<Format>(kFormats, line.format);
  options.detail = chosen<Detail>(kDetails, line.detail);
  if (!line.soil_response.empty())
    options.soil_response =
        line.soil_response == "nonlinear" ? SoilResponse::nonlinear : SoilResponse::linear;
  if (line.need_basis == "factored") options.need_basis = CapacityBasis::factored;
  for (const auto& [s, command] : commands)
    if (command->parsed()) options.command = s->command;
  return run(options, out, err);
}

}  // namespace cairn
