// The project file: its includes merged (includes.hpp), then each section read by its
// reader (sections.hpp) in a fixed order, and the Project assembled from what they return.
#include "cairn/input/input.hpp"

#include <algorithm>
#include <filesystem>

#include <fmt/format.h>

#include "cairn/input/includes.hpp"
#include "cairn/input/analysis_keys.hpp"
#include "cairn/input/package_keys.hpp"
#include "cairn/input/sections.hpp"
#include "cairn/input/yaml_core.hpp"

namespace cairn {
namespace {

namespace fs = std::filesystem;

const DocumentShape kProjectShape = {
    {"title", "units", "include", "cap", "pile_types", "piles", "soil", "load_cases",
     "combinations", "columns", "loads_from", "group", "package", "design", "analysis"},
    {"pile_types", "load_cases", "combinations"}};

// A load case no combination takes (with a factor other than 0) is never checked: say so.
void warn_unused_load_cases(Project& project) {
  std::vector<bool> used(project.load_cases.size(), false);
  for (const auto& combo : project.combinations)
    for (const auto& [index, factor] : combo.factors)
      if (factor != 0.0) used[index] = true;
  for (std::size_t i = 0; i < project.load_cases.size(); ++i)
    if (!used[i])
      project.warnings.push_back(
          {project.load_cases[i].where,
           fmt::format("load_cases.{}: no combination uses this load case; its loads are not "
                       "checked",
                       project.load_cases[i].id)});
}

// The cap's own weight, added to its load case at the outline's centroid, mid-thickness.
void add_self_weight(Project& project, Diagnostics& diag) {
  const Cap& cap = project.cap;
  if (!cap.self_weight || !cap.outline) return;
  auto it = std::find_if(project.load_cases.begin(), project.load_cases.end(),
                         [&](const LoadCase& lc) { return lc.id == cap.self_weight->load_case; });
  if (it == project.load_cases.end()) {
    diag.error(cap.self_weight->where, fmt::format("cap.self_weight.case: load case '{}' does "
                                                   "not exist",
                                                   cap.self_weight->load_case));
    return;
  }
  const auto c = cap.outline->centroid();
  PointLoad weight;
  weight.where = cap.self_weight->where;
  weight.at = {c[0], c[1], cap.thickness / 2.0};
  weight.load = {0, 0, -cap.self_weight->unit_weight * cap.outline->area() * cap.thickness, 0, 0,
                 0};
  weight.note = "cap self-weight";
  it->loads.push_back(weight);
}

}  // namespace

Project read_project(const std::string& path, Piles piles_needed) {
  Diagnostics diag;
  const MergedDocument merged = read_with_includes(path, kProjectShape, diag);
  diag.raise_if_any();
  Project project;
  project.file = path;
  const std::string& main_file = *merged.files.find(path);
  auto it_units = merged.file_units.find(main_file);
  if (it_units == merged.file_units.end())
    diag.error({main_file, 1, 1}, "units: missing; expected 'SI' (kN, m, kPa) or 'US' "
                                  "(kip, ft, ksf)");
  else
    project.units = it_units->second;
  ReadContext ctx(diag, merged.file_units, project.units);

  auto section = [&](const std::string& name) { return merged.section(name); };
  if (const NamedEntry* title = section("title"); title && title->value.is_scalar())
    project.title = title->value.scalar();
  else
    project.title = fs::path(path).stem().string();
  auto required = [&](const std::string& name) {
    const NamedEntry* e = section(name);
    if (!e) diag.error({main_file, 1, 1}, fmt::format("{}: missing; the project needs it", name));
    return e;
  };

  // The sections in the order their problems are reported; each reader returns its values.
  if (const NamedEntry* group = section("group")) project.group = read_group(group->value, ctx);
  if (const NamedEntry* soil = section("soil")) project.soil = read_soil(soil->value, ctx);
  if (const NamedEntry* cap = required("cap")) project.cap = read_cap(cap->value, ctx);
  if (const NamedEntry* types = required("pile_types"))
    project.pile_types = read_pile_types(merged.entries("pile_types"), types->value, ctx,
                                         project.soil.has_value());
  // `cairn design` reads a file whose piles the search will place (read_design.hpp).
  if (const NamedEntry* piles =
          piles_needed == Piles::optional ? section("piles") : required("piles"))
    project.piles = read_piles(piles->value, ctx, project.pile_types);
  if (const NamedEntry* columns = section("columns"))
    project.columns = read_columns(columns->value, ctx, project.cap.thickness);
  // Reactions imported as combinations (loads_from.combinations) may be all the loads.
  const NamedEntry* from = section("loads_from");
  const bool imports_combinations = from && from->value.is_map() &&
                                    from->value.child("combinations").present();
  const NamedEntry* cases = imports_combinations ? section("load_cases") : required("load_cases");
  if (cases)
    project.load_cases = read_load_cases(merged.entries("load_cases"), cases->value, ctx,
                                         project.cap.thickness);
  const NamedEntry* combos =
      imports_combinations ? section("combinations") : required("combinations");
  if (combos) {
    CombinationsRead read =
        read_combinations(merged.entries("combinations"), combos->value, ctx, project.load_cases);
    project.combinations = std::move(read.combinations);
    project.notes = std::move(read.notes);
    project.en1997 = read.en1997;
  }
  if (from) {
    ReactionsRead read = read_reactions(from->value, ctx, project.columns,
                                        std::move(project.load_cases),
                                        std::move(project.combinations));
    project.loads_file = std::move(read.loads_file);
    project.load_cases = std::move(read.load_cases);
    project.combinations = std::move(read.combinations);
    project.notes.insert(project.notes.end(), read.notes.begin(), read.notes.end());
  }
  project.input_files.push_back(path);
  for (const auto& f : merged.files)
    if (f != path && f != project.loads_file) project.input_files.push_back(f);
  if (const NamedEntry* package = section("package"))
    read_package_settings(package->value, project, diag);
  if (const NamedEntry* analysis = section("analysis"))
    read_analysis_settings(analysis->value, project, ctx);
  project.warnings = ctx.take_warnings();
  if (diag.empty()) add_self_weight(project, diag);
  if (diag.empty()) warn_unused_load_cases(project);
  diag.raise_if_any();
  return project;
}

}  // namespace cairn

namespace cairn {
namespace {

// A foundation file's first top-level key other than `title` is `caps`. Only the first
// keys are read here: a project file is parsed once, by read_project.
bool is_foundation(const std::string& text) {
  return first_top_level_key(text, {"title"}) == "caps";
}

}  // namespace

std::vector<std::string> expand_foundation(const std::string& path) {
  std::string text;
  if (!read_text_file(path, text) || !is_foundation(text)) return {path};
  Diagnostics diagnostics;
  const auto doc = parse_yaml(text, path, diagnostics);
  if (!doc) {
    diagnostics.raise_if_any();
    return {path};
  }
  const Located top = Located::of(doc->root, path, "");
  for (const auto& e : top.node->entries)
    if (e.key != "caps" && e.key != "title")
      diagnostics.error(key_location(e, path),
                        fmt::format("{}: unknown key in a foundation file; expected title, caps",
                                    e.key));
  const Located caps = top.child("caps");
  std::vector<std::string> files;
  if (!caps.is_sequence() || caps.size() == 0) {
    diagnostics.error(caps.where(), "caps: expected a list of cap files");
  } else {
    for (std::size_t i = 0; i < caps.size(); ++i) {
      const Located cap = caps.item(i);
      if (!cap.is_scalar()) {
        diagnostics.error(cap.where(), fmt::format("caps[{}]: expected a file path", i));
        continue;
      }
      files.push_back((fs::path(path).parent_path() / cap.scalar()).lexically_normal().string());
    }
  }
  diagnostics.raise_if_any();
  return files;
}

}  // namespace cairn
