#include "cairn/app/package.hpp"

#include <algorithm>
#include <cctype>
#include <filesystem>
#include <fstream>
#include <set>
#include <sstream>

#include <fmt/format.h>

#include "cairn/output/html_package.hpp"
#include "cairn/output/plan_svg.hpp"

namespace cairn {
namespace {

namespace fs = std::filesystem;

// Letters and digits in lower case, other runs as one '-', at most 60 characters cut at a
// word.
std::string slug(const std::string& text) {
  std::string s;
  for (unsigned char c : text) {
    if (std::isalnum(c)) s += static_cast<char>(std::tolower(c));
    else if (!s.empty() && s.back() != '-') s += '-';
  }
  while (!s.empty() && s.back() == '-') s.pop_back();
  if (s.size() > 60) {
    const std::size_t cut = s.rfind('-', 60);
    s = s.substr(0, cut == std::string::npos || cut < 20 ? 60 : cut);
  }
  return s;
}

std::string read_text(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  std::ostringstream buffer;
  buffer << in.rdbuf();
  return buffer.str();
}

std::vector<InputFileText> input_files(const Project& p) {
  std::vector<InputFileText> list;
  for (std::size_t i = 0; i < p.input_files.size(); ++i)
    list.push_back({p.input_files[i], i == 0 ? "project file" : "include",
                    read_text(p.input_files[i])});
  if (list.empty()) list.push_back({p.file, "project file", read_text(p.file)});
  if (!p.loads_file.empty()) list.push_back({p.loads_file, "reactions CSV", read_text(p.loads_file)});
  return list;
}

std::string verdict_text(const CheckRun& run) {
  const CheckSummary& s = run.results.summary;
  return !s.overturned.empty()           ? to_string(Verdict::overturned)
         : s.failed_combinations > 0     ? "fail"
         : !run.group.pass               ? "group checks fail"
                                         : "pass";
}

}  // namespace

std::vector<std::string> package_page_names(const std::vector<const Project*>& projects) {
  std::vector<std::string> names;
  for (const Project* p : projects) {
    const fs::path file(p->file);
    // A project without a title key is titled by its file's stem (input.hpp).
    const bool titled = p->title != file.stem().string();
    std::string name = titled ? slug(p->title) : "";
    if (name.empty()) name = slug(file.parent_path().filename().string());
    if (name.empty() || name == "-") name = slug(file.stem().string());
    if (name.empty()) name = "cap";
    names.push_back(name);
  }
  std::set<std::string> used;
  for (auto& name : names) {
    const std::string base = name;
    for (int n = 2; !used.insert(name).second; ++n) name = base + "-" + std::to_string(n);
  }
  return names;
}

PackageFiles package_files(const std::vector<CapOutcome>& outcomes, const PackageRequest& request) {
  PackageFiles out;
  const bool many = outcomes.size() > 1;
  std::vector<std::string> names;
  if (many) {
    std::vector<const Project*> projects;
    for (const auto& o : outcomes) projects.push_back(&o.run->project);
    names = package_page_names(projects);
  } else {
    for (const auto& o : outcomes) names.push_back(fs::path(o.file).stem().string());
  }
  std::vector<PackageIndexRow> rows;
  for (std::size_t i = 0; i < outcomes.size(); ++i) {
    const CheckRun& run = *outcomes[i].run;
    const Project& p = run.project;
    const bool cap_pass =
        i < request.pass_override.size() ? request.pass_override[i] : run.results.summary.pass;
    out.pass = out.pass && cap_pass;
    const CheckReport report = make_check_report(run, request.command, std::nullopt);
    // The capacity-with-depth tables of the chart come with the run (AnalysisOptions); a run
    // made without them (the as-built cap of a survey) gets them here.
    const bool tabled = std::any_of(run.capacities.begin(), run.capacities.end(),
                                    [](const auto& c) { return !c.depth_table.empty(); });
    const auto capacities = tabled || run.capacities.empty()
                                ? run.capacities
                                : [&] {
                                    const DepthTableRange range = report_depth_table(p);
                                    return compute_capacities(p, range.step, range.from);
                                  }();
    const std::string& name = names[i];
    CapPackageInput input;
    input.report.check = &report;
    input.report.capacities = &capacities;
    input.inputs = input_files(p);
    for (const auto& [path, role] : request.extra_inputs) input.inputs.push_back({path, role, read_text(path)});
    if (i < request.extra_sections.size())
      for (const auto& section : request.extra_sections[i]) input.report.extra_sections_html.push_back(section);
    input.project_name = !request.foundation_title.empty()
                             ? request.foundation_title
                             : outcomes[i].file;
    const auto shown = combinations_shown(p, run.results);
    if (std::find(shown.begin(), shown.end(), false) != shown.end()) {
      input.all_combinations_file = name + "-all-combinations.csv";
      out.files.emplace_back(input.all_combinations_file, all_combinations_csv(report));
    }
    // A nonlinear run's diagrams of the governing piles and its pushover curve; nothing for a
    // linear run, whose page stays as it was.
    if (run.nonlinear) {
      NonlinearSection section;
      for (const NonlinearProfile& g : run.nonlinear->profiles)
        section.piles.push_back({p.piles.at(g.pile).id, p.combinations.at(g.combination).id, g.profile});
      section.pushover = run.nonlinear->pushover;
      if (has_content(section)) input.nonlinear = std::move(section);
    }
    out.files.emplace_back(name + ".html", render_cap_package_html(input));
    if (request.plan_svg)
      out.files.emplace_back(name + "-plan.svg",
                             render_plan_svg(p, &run.results, &run.resistances));
    if (request.tables)
      for (auto& [file, content] : check_files(report)) out.files.emplace_back(name + "/" + file, content);
    out.listing += fmt::format("{}: {} — {}\n", outcomes[i].file, summary_line(report),
                               (fs::path(request.out_dir) / (name + ".html")).string());
    PackageIndexRow row;
    row.page = name + ".html";
    row.source = outcomes[i].file;
    row.title = p.title;
    row.verdict = verdict_text(run);
    row.max_utilization = run.results.summary.max_utilization;
    row.pile = run.results.summary.pile ? p.piles[*run.results.summary.pile].id : "-";
    row.combination =
        run.results.summary.combination ? p.combinations[*run.results.summary.combination].id : "-";
    row.pass = cap_pass;
    rows.push_back(row);
  }
  if (many) {
    out.files.emplace_back("index.html", render_package_index_html(rows, request.command));
    out.listing += "index: " + (fs::path(request.out_dir) / "index.html").string() + "\n";
  }
  return out;
}

}  // namespace cairn
