#include "cairn/app/site_commands.hpp"

#include <filesystem>
#include <ostream>

#include <fmt/format.h>

#include "cairn/input/input.hpp"
#include "cairn/output/output_files.hpp"

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
                                         const Options& options) {
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
  run->as_built = analyse(run->model.project, run->model.adjust);
  run->comparison = compare_as_built(run->model, run->design, run->as_built);
  return run;
}

int run_as_built_check(const Options& options, const std::string& described, std::ostream& out,
                       std::ostream& err) {
  std::vector<std::string> files;
  for (const auto& f : options.files)
    for (const auto& cap : expand_foundation(f)) files.push_back(cap);
  std::vector<std::unique_ptr<AsBuiltRun>> runs;
  for (const auto& file : files) {
    CheckRun design = analyse_project(file);
    for (const auto& w : design.project.warnings) err << "cairn: " << format_warning(w) << "\n";
    runs.push_back(as_built_run(std::move(design), *options.as_built, options));
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
