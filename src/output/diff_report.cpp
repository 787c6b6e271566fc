#include "cairn/output/diff_report.hpp"

#include <cmath>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include "cairn/output/number_text.hpp"

namespace cairn {
namespace {

std::string governing(const CheckRun& run) {
  const auto& s = run.results.summary;
  const Project& p = run.project;
  if (!s.pile || !s.combination) return "-";
  return fmt::format("{} (pile {}, combination {}, {})", fixed_text(s.max_utilization, 3),
                     p.piles[*s.pile].id, p.combinations[*s.combination].id, to_string(s.check));
}

}  // namespace

std::string render_diff(const CheckRun& a, const CheckRun& b, const RevisionDiff& d,
                        const std::string& options, Format format) {
  const UnitSystem u = b.project.units;
  const std::string len = unit_label(u, Quantity::small_length);
  const std::string force = unit_label(u, Quantity::force);
  auto kn = [&](double v) { return from_si(u, Quantity::force, v); };
  if (format == Format::json) {
    nlohmann::json j;
    j["tool"] = {{"name", "cairn"}, {"version", CAIRN_VERSION}};
    j["old"] = a.project.file;
    j["new"] = b.project.file;
    j["command"] = options;
    j["added_piles"] = d.added_piles;
    j["removed_piles"] = d.removed_piles;
    nlohmann::json moved = nlohmann::json::array();
    for (const auto& m : d.moved_piles)
      moved.push_back({{"id", m.id}, {"dx", from_si(u, Quantity::small_length, m.dx)},
                       {"dy", from_si(u, Quantity::small_length, m.dy)}});
    j["moved_piles"] = moved;
    nlohmann::json inputs = nlohmann::json::array();
    for (const auto& k : d.inputs)
      inputs.push_back({{"key", k.key},
                        {"old", k.before ? nlohmann::json(*k.before) : nlohmann::json(nullptr)},
                        {"new", k.after ? nlohmann::json(*k.after) : nlohmann::json(nullptr)}});
    j["inputs"] = inputs;
    nlohmann::json forces = nlohmann::json::array();
    for (const auto& f : d.forces)
      forces.push_back({{"pile", f.pile}, {"combination", f.combination},
                        {"axial_old", kn(f.axial_before)}, {"axial_new", kn(f.axial_after)},
                        {"utilization_old", f.utilization_before},
                        {"utilization_new", f.utilization_after}});
    j["forces"] = forces;
    j["governing_old"] = governing(a);
    j["governing_new"] = governing(b);
    j["old_pass"] = d.old_pass;
    j["new_pass"] = d.new_pass;
    j["newly_failing"] = d.newly_failing;
    j["caution"] = kCaution;
    return j.dump(2) + "\n";
  }
  Table t;
  t.title = "Changes of force and utilization";
  t.headers = {"pile", "combination", fmt::format("axial old ({})", force),
               fmt::format("axial new ({})", force), "utilization old", "utilization new", "change"};
  t.numeric = {false, false, true, true, true, true, true};
  for (const auto& f : d.forces)
    t.rows.push_back({f.pile, f.combination, fixed_text(kn(f.axial_before), 1),
                      fixed_text(kn(f.axial_after), 1), fixed_text(f.utilization_before, 3),
                      fixed_text(f.utilization_after, 3),
                      fixed_text(f.utilization_after - f.utilization_before, 3)});
  if (format == Format::csv) return render_table(t, Format::csv);
  std::string out = fmt::format("## cairn diff: {} → {}\n\n", a.project.file, b.project.file);
  out += fmt::format("`{}`\n\n", options);
  out += d.newly_failing.empty()
             ? (d.new_pass ? "**The new revision passes.**\n\n"
                           : "**The new revision fails, as the old one did; nothing that passed "
                             "now fails.**\n\n")
             : "**The new revision fails a check the old one passed:** " +
                   [&] {
                     std::string s;
                     for (const auto& x : d.newly_failing) s += (s.empty() ? "" : ", ") + x;
                     return s;
                   }() + ".\n\n";
  out += fmt::format("- Governing before: {}\n- Governing after: {}\n", governing(a), governing(b));
  auto list = [&](const char* what, const std::vector<std::string>& ids) {
    if (ids.empty()) return;
    std::string s;
    for (const auto& i : ids) s += (s.empty() ? "" : ", ") + i;
    out += fmt::format("- {}: {}\n", what, s);
  };
  list("Piles added", d.added_piles);
  list("Piles removed", d.removed_piles);
  for (const auto& m : d.moved_piles)
    out += fmt::format("- Pile {} moved by ({}, {}) {}\n", m.id,
                       fixed_text(from_si(u, Quantity::small_length, m.dx), 0),
                       fixed_text(from_si(u, Quantity::small_length, m.dy), 0), len);
  out += "\n";
  if (!d.inputs.empty()) {
    Table k;
    k.title = "Inputs changed";
    k.headers = {"key", "old", "new"};
    k.numeric = {false, false, false};
    for (const auto& c : d.inputs)
      k.rows.push_back({c.key, c.before.value_or("(absent)"), c.after.value_or("(absent)")});
    out += render_table(k, Format::markdown) + "\n";
  }
  out += d.forces.empty() ? "No pile force or utilization changed.\n"
                          : render_table(t, Format::markdown);
  return out + "\n" + kCaution + "\n";
}

}  // namespace cairn
