// What goes into the package when there are many combinations, and the full table beside it.
#include <map>

#include "cairn/output/html_package.hpp"
#include "report_parts.hpp"

namespace cairn {

std::vector<bool> combinations_shown(const Project& project, const CheckResults& results) {
  const std::size_t n = results.combinations.size();
  if (n <= kFullCombinationsLimit) return std::vector<bool>(n, true);
  std::vector<bool> shown(n, false);
  // Results are indexed like the combinations they check; map a combination to its row.
  std::map<std::size_t, std::size_t> row_of;
  for (std::size_t i = 0; i < n; ++i) row_of[results.combinations[i].combination] = i;
  auto mark = [&](const std::optional<std::size_t>& combination) {
    if (!combination) return;
    const auto it = row_of.find(*combination);
    if (it != row_of.end()) shown[it->second] = true;
  };
  mark(results.summary.combination);
  // The governing combination of each pile: its largest utilization, compression, tension
  // and lateral force.
  for (const auto& e : results.envelope) {
    mark(e.max_utilization.combination);
    mark(e.max_compression.combination);
    mark(e.max_tension.combination);
    mark(e.max_lateral.combination);
  }
  // The governing combination of each check: the largest utilization that check gives.
  std::map<Demand, std::pair<double, std::size_t>> by_check;
  for (std::size_t i = 0; i < n; ++i) {
    const auto& cc = results.combinations[i];
    if (!cc.pass || cc.solution.overturns) shown[i] = true;  // every failing or overturned one
    if (cc.solution.overturns) continue;
    for (const auto& pc : cc.piles) {
      if (pc.governing == Demand::none) continue;
      auto [it, fresh] = by_check.try_emplace(pc.governing, pc.utilization, i);
      if (!fresh && pc.utilization > it->second.first) it->second = {pc.utilization, i};
    }
  }
  for (const auto& [check, best] : by_check) shown[best.second] = true;
  // Those the engineer names.
  for (const auto& id : project.package.show_combinations)
    for (std::size_t i = 0; i < n; ++i)
      if (project.combinations[results.combinations[i].combination].id == id) shown[i] = true;
  return shown;
}

std::string all_combinations_csv(const CheckReport& report) {
  const CheckTables tables = check_tables(report);
  const Project& p = *report.project;
  Table all;
  for (std::size_t i = 0; i < tables.per_combination.size(); ++i) {
    // A nonlinear run's pile values as in the check's CSV.
    const Table t = report_detail::with_nonlinear_columns(report, report.results->combinations[i],
                                                          tables.per_combination[i]);
    const Combination& c = p.combinations[report.results->combinations[i].combination];
    if (all.headers.empty()) {
      all.headers = {"combination", "limit state", "verdict"};
      all.headers.insert(all.headers.end(), t.headers.begin(), t.headers.end());
      all.numeric = {false, false, false};
      all.numeric.insert(all.numeric.end(), t.numeric.begin(), t.numeric.end());
    }
    for (const auto& row : t.rows) {
      std::vector<std::string> line = {c.id, to_string(c.limit_state),
                                       to_string(verdict(report.results->combinations[i]))};
      line.insert(line.end(), row.begin(), row.end());
      all.rows.push_back(line);
    }
  }
  std::string csv = render_table(all, Format::csv);
  for (const auto& a : report.assumptions) csv += "# assumption: " + a + "\n";
  return csv + "# " + kCaution + "\n";
}

}  // namespace cairn
