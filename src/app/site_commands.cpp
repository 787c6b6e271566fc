#include "cairn/app/site_commands.hpp"

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <optional>
#include <ostream>

#include <fmt/format.h>

#include "cairn/input/input.hpp"
#include "cairn/output/output_files.hpp"
#include "cairn/output/plan_svg.hpp"
#include "cairn/output/site_report.hpp"
#include "cairn/site/safe_region.hpp"
#include "cairn/site/studies.hpp"
#include "cairn/site/revision_diff.hpp"
#include "cairn/output/diff_report.hpp"

namespace cairn {

AsBuiltReport AsBuiltRun::report(const std::string& options) const {
  AsBuiltReport r;
  r.model = &model;
  r.design = &design;
  r.as_built = &as_built;
  r.comparison = &comparison;
  r.options = options;
  return r;
}

std::unique_ptr<AsBuiltRun> as_built_run(CheckRun design, const std::string& survey_path,
                                         const Options& options, const AnalysisOptions& analysis) {
  auto run = std::make_unique<AsBuiltRun>();
  run->design = std::move(design);
  const Project& project = run->design.project;
  const UnitSystem u = project.units;
  SiteTolerances tolerances = default_tolerances(u);
  if (options.plan_tolerance) {
    if (!(*options.plan_tolerance > 0) || *options.plan_tolerance > 1e4)
      throw InputError({}, fmt::format("--plan-tolerance: expected a positive length in {}, got "
                                       "'{:g}'",
                                       unit_label(u, Quantity::small_length),
                                       *options.plan_tolerance));
    tolerances.plan = *options.plan_tolerance * to_si_factor(u, Quantity::small_length);
  }
  if (options.batter_tolerance) {
    if (!(*options.batter_tolerance >= 1) || *options.batter_tolerance > 1e6)
      throw InputError({}, fmt::format("--batter-tolerance: expected n of a tolerance 1 in n "
                                       "(n ≥ 1), got '{:g}'",
                                       *options.batter_tolerance));
    tolerances.batter = 1.0 / *options.batter_tolerance;
  }
  const Survey survey = read_survey_file(survey_path, u);
  const std::string cap = std::filesystem::path(project.file).stem().string();
  run->model = build_as_built(project, survey, cap, tolerances);
  try {
    run->as_built = analyse(run->model.project, run->model.adjust, analysis);
  } catch (const InputError& e) {
    // The as-built cap cannot be analysed (a load no remaining pile resists, say): say so.
    std::vector<Diagnostic> problems = e.diagnostics();
    for (auto& d : problems) d.message = "as built (survey " + survey_path + "): " + d.message;
    throw InputError(problems);
  }
  run->comparison = compare_as_built(run->model, run->design, run->as_built);
  return run;
}

int run_as_built_check(const Options& options, const std::string& described, std::ostream& out,
                       std::ostream& err) {
  std::vector<std::string> files;
  for (const auto& f : options.files)
    for (const auto& cap : expand_foundation(f)) files.push_back(cap);
  std::vector<std::unique_ptr<AsBuiltRun>> runs;
  // The design and the as-built cap on the same soil response (--soil-response over the
  // project's analysis.soil_response).
  const AnalysisOptions analysis{.soil_response = options.soil_response};
  for (const auto& file : files) {
    CheckRun design = analyse_project(file, analysis);
    for (const auto& w : design.project.warnings) err << "cairn: " << format_warning(w) << "\n";
    runs.push_back(as_built_run(std::move(design), *options.as_built, options, analysis));
  }
  bool remedial = false;
  std::string rendered;
  std::vector<std::pair<std::string, std::string>> written;
  nlohmann::json caps = nlohmann::json::array();
  for (const auto& run : runs) {
    const AsBuiltReport report = run->report(described);
    remedial = remedial || run->comparison.verdict == SiteVerdict::remedial;
    if (options.format == Format::json) caps.push_back(as_built_json(report));
    else rendered += (rendered.empty() ? "" : "\n") + render_as_built(report, options.format);
    if (options.out_dir) {
      const std::string stem = std::filesystem::path(run->design.project.file).stem().string();
      const std::string prefix = runs.size() == 1 ? "" : stem + "/";
      written.emplace_back(prefix + "as-built.txt", render_as_built(report, Format::text));
      written.emplace_back(prefix + "as-built.md", render_as_built(report, Format::markdown));
      written.emplace_back(prefix + "as-built.json", render_as_built(report, Format::json));
      written.emplace_back(prefix + "as-built.csv", render_as_built(report, Format::csv));
    }
  }
  if (options.format == Format::json)
    rendered = (caps.size() == 1 ? caps.front() : nlohmann::json{{"caps", caps}}).dump(2) + "\n";
  if (options.out_dir) write_files_atomically(*options.out_dir, written);
  out << rendered;
  return remedial ? kExitFail : kExitPass;
}

}  // namespace cairn

namespace cairn {
namespace {

// The one cap of a site study: its design run and, with --as-built, the as-built run, which
// the study then works on. Built in place, so that the runs never move.
// The studies re-solve the rigid cap on its linear springs (site/fast_group.hpp), so both
// runs are linear; a project whose analysis asks for nonlinear soil is told so in a warning
// rather than shown linear numbers as if they were its nonlinear ones.
struct StudyCap {
  std::optional<CheckRun> design;
  std::unique_ptr<AsBuiltRun> site;
  StudyCap(const Options& options, std::ostream& err, const char* command) {
    if (options.files.size() != 1)
      throw InputError({}, fmt::format("{}: expected one project file", command));
    const AnalysisOptions linear{.soil_response = SoilResponse::linear};
    design = analyse_project(options.files.front(), linear);
    Project& project = design->project;
    if (project.analysis.soil_response == SoilResponse::nonlinear)
      project.warnings.push_back(
          {project.analysis.where,
           fmt::format("analysis.soil_response: nonlinear; {} studies the cap on its linear "
                       "springs (the nonlinear soil response is for check and report)",
                       command)});
    for (const auto& w : project.warnings) err << "cairn: " << format_warning(w) << "\n";
    if (options.as_built) site = as_built_run(*design, *options.as_built, options, linear);
  }
  const CheckRun& run() const { return site ? site->as_built : *design; }
};

// The files under --out (all or none), then the result on `out`.
void show_outputs(const Options& options, const std::string& name, const std::string& rendered,
                  const std::string& svg, std::ostream& out) {
  if (options.out_dir) {
    const char* ext = options.format == Format::json       ? ".json"
                      : options.format == Format::csv      ? ".csv"
                      : options.format == Format::markdown ? ".md"
                                                           : ".txt";
    write_files_atomically(*options.out_dir, {{name + ext, rendered}, {name + ".svg", svg}});
  }
  out << rendered;
}

}  // namespace

int run_pile_loss(const Options& options, const std::string& described, std::ostream& out,
                  std::ostream& err) {
  const StudyCap cap(options, err, "pile-loss");
  const CheckRun& run = cap.run();
  const FastGroup group(run);
  const LossStudy study = each_pile_lost(group, options.pairs);
  const SiteStudyHeader header{&run.project, described};
  const std::string rendered = render_pile_loss(header, study, options.format);
  show_outputs(options, "pile-loss", rendered, render_pile_loss_svg(run.project, study), out);
  for (const auto& c : study.single)
    if (c.outcome.max_utilization > 1.0) return kExitFail;
  return kExitPass;
}

int run_add_pile(const Options& options, const std::string& described, std::ostream& out,
                 std::ostream& err) {
  const StudyCap cap(options, err, "add-pile");
  const CheckRun& run = cap.run();
  const Project& p = run.project;
  const UnitSystem u = p.units;
  if (!p.cap.outline)
    throw InputError({p.file, 0, 0}, "add-pile: the search needs the cap's outline (cap.outline)");
  SearchSettings s;
  std::vector<std::string> ids;
  for (const auto& t : p.pile_types) ids.push_back(t.id);
  const auto type = std::find(ids.begin(), ids.end(), options.added_type);
  if (type == ids.end()) {
    const std::string near = closest_match(options.added_type, ids);
    throw InputError({}, fmt::format("--type: no pile type '{}' in {}{}", options.added_type,
                                     p.file, near.empty() ? "" : "; did you mean '" + near + "'?"));
  }
  s.type = static_cast<std::size_t>(type - ids.begin());
  s.width = p.pile_types[s.type].section.width;
  const double unit = to_si_factor(u, Quantity::small_length);
  s.step = options.grid_step ? *options.grid_step * unit : (u == UnitSystem::SI ? 0.05 : 0.0508);
  const double extent = std::sqrt(p.cap.outline->area());
  if (!(s.step > 0) || extent / s.step > 2000)
    throw InputError({}, fmt::format("--step: expected a positive step in {} giving at most 2000 "
                                     "positions along the cap, got '{:g}'",
                                     unit_label(u, Quantity::small_length),
                                     options.grid_step.value_or(0.0)));
  if (options.most_added < 1 || options.most_added > 2)
    throw InputError({}, fmt::format("--most: expected 1 or 2, got '{}'", options.most_added));
  s.most = options.most_added;
  s.outline = *p.cap.outline;
  s.edge_distance = p.group.min_edge_distance;
  s.spacing_factor = p.group.min_spacing_factor;
  s.min_spacing = p.group.min_spacing;
  std::vector<char> keep(p.piles.size(), 1);
  for (const auto& id : options.lose) {
    std::vector<std::string> pile_ids;
    for (const auto& pile : p.piles) pile_ids.push_back(pile.id);
    const auto it = std::find(pile_ids.begin(), pile_ids.end(), id);
    if (it == pile_ids.end()) {
      const std::string near = closest_match(id, pile_ids);
      throw InputError({}, fmt::format("--lose: no pile '{}'{}", id,
                                       near.empty() ? "" : "; did you mean '" + near + "'?"));
    }
    keep[static_cast<std::size_t>(it - pile_ids.begin())] = 0;
  }
  for (std::size_t i = 0; i < p.piles.size(); ++i) {
    const Pile& pile = p.piles[i];
    s.in_ground.push_back({pile.x, pile.y, p.pile_types[pile.type].section.width});
    if (!keep[i]) s.lost.push_back({pile.x, pile.y});
  }
  if (cap.site)
    for (const AsBuiltPile& a : cap.site->model.piles) {
      if (!a.as_built)
        s.in_ground.push_back({a.x, a.y, cap.site->design.project.pile_types[a.type].section.width});
      if (!a.as_built || a.status == PileStatus::damaged) s.lost.push_back({a.x, a.y});
    }
  const FastGroup group(run);
  const SearchResult result = search_added_piles(group, keep, s);
  std::vector<std::string> standing;
  for (std::size_t i = 0; i < p.piles.size(); ++i)
    if (keep[i]) standing.push_back(p.piles[i].id);
  const SiteStudyHeader header{&p, described};
  const std::string rendered = render_added_piles(header, result, standing, options.format);
  show_outputs(options, "add-pile", rendered, render_added_piles_svg(p, result, keep), out);
  return !result.best.empty() && result.best.front().pass() ? kExitPass : kExitFail;
}

int run_tolerance(const Options& options, const std::string& described, std::ostream& out,
                  std::ostream& err) {
  const StudyCap cap(options, err, "tolerance");
  const CheckRun& run = cap.run();
  const UnitSystem u = run.project.units;
  ToleranceSettings s;
  s.plan = default_tolerances(u).plan;
  if (options.plan_tolerance) {
    if (!(*options.plan_tolerance > 0) || *options.plan_tolerance > 1e4)
      throw InputError({}, fmt::format("--plan-tolerance: expected a positive length in {}, got "
                                       "'{:g}'",
                                       unit_label(u, Quantity::small_length), *options.plan_tolerance));
    s.plan = *options.plan_tolerance * to_si_factor(u, Quantity::small_length);
  }
  if (options.batter_tolerance) {
    if (!(*options.batter_tolerance >= 1))
      throw InputError({}, fmt::format("--batter-tolerance: expected n of a tolerance 1 in n "
                                       "(n ≥ 1), got '{:g}'",
                                       *options.batter_tolerance));
    s.batter = 1.0 / *options.batter_tolerance;
  }
  if (options.trials < 1 || options.trials > 10000000)
    throw InputError({}, fmt::format("--trials: expected 1 to 10000000, got '{}'", options.trials));
  s.trials = options.trials;
  s.seed = options.seed;
  s.normal = options.normal;
  const FastGroup group(run);
  const ToleranceStudy study = tolerance_study(group, s);
  const SiteStudyHeader header{&run.project, described};
  const std::string rendered = render_tolerance(header, s, study, options.format);
  show_outputs(options, "tolerance", rendered, render_plan_svg(run.project, &run.results, &run.resistances), out);
  return std::max(study.max, study.worst_outcome.max_utilization) > 1.0 ? kExitFail : kExitPass;
}

int run_safe_region(const Options& options, const std::string& described, std::ostream& out,
                    std::ostream& err) {
  const StudyCap cap(options, err, "safe-region");
  const CheckRun& run = cap.run();
  if (options.rays < 0 || options.rays > 3600)
    throw InputError({}, fmt::format("--rays: expected 0 to 3600, got '{}'", options.rays));
  const SafeRegions regions = safe_regions(run, options.rays);
  const SiteStudyHeader header{&run.project, described};
  const std::string rendered = render_safe_regions(header, regions, options.format);
  show_outputs(options, "safe-region", rendered, render_safe_regions_svg(run.project, regions), out);
  for (const auto& c : regions.combinations)
    if (!c.upward && !c.inside) return kExitFail;
  return kExitPass;
}

int run_diff(const Options& options, const std::string& described, std::ostream& out,
             std::ostream& err) {
  if (options.files.size() != 2) throw InputError({}, "diff: expected two project files, OLD and NEW");
  for (const auto& f : options.files)
    if (std::filesystem::path(f).extension() == ".json")
      throw InputError({f, 0, 0}, "diff: a results JSON file does not carry the resolved input it "
                                  "came from; give the two project files (YAML)");
  const CheckRun old_run = analyse_project(options.files[0]);
  const CheckRun new_run = analyse_project(options.files[1]);
  for (const CheckRun* r : {&old_run, &new_run})
    for (const auto& w : r->project.warnings) err << "cairn: " << format_warning(w) << "\n";
  const RevisionDiff diff = diff_revisions(old_run, new_run);
  const std::string rendered = render_diff(old_run, new_run, diff, described, options.format);
  if (options.out_dir)
    write_files_atomically(*options.out_dir,
                           {{"diff.md", render_diff(old_run, new_run, diff, described, Format::markdown)},
                            {"diff.json", render_diff(old_run, new_run, diff, described, Format::json)}});
  out << rendered;
  return diff.newly_failing.empty() ? kExitPass : kExitFail;
}

}  // namespace cairn
