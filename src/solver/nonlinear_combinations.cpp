#include "cairn/solver/nonlinear_combinations.hpp"

#include <algorithm>
#include <cmath>
#include <utility>

#include "cairn/geotechnics/p_multipliers.hpp"
#include "cairn/geotechnics/pile_soil_curves.hpp"

namespace cairn {

NonlinearGroup project_nonlinear_group(const Project& project,
                                       const std::vector<double>& stiffness_factor,
                                       const std::function<void(NonlinearPileSpec&)>& change) {
  require_nonlinear_soil(project);
  std::vector<NonlinearPileSpec> specs;
  specs.reserve(project.piles.size());
  for (std::size_t i = 0; i < project.piles.size(); ++i) {
    NonlinearPileSpec spec = nonlinear_pile_spec(project, i);
    if (change) change(spec);
    const std::size_t type = project.piles[i].type;
    if (type < stiffness_factor.size() && stiffness_factor[type] != 1.0)
      spec = scaled_pile(std::move(spec), stiffness_factor[type]);
    specs.push_back(std::move(spec));
  }
  NonlinearGroup group = nonlinear_group(std::move(specs));
  for (const Pile& pile : project.piles) group.names.push_back(pile.id);
  return group;
}

namespace {

// The plan positions of the project's pile heads and the widest pile section: what the rows
// of the p-multipliers are formed from.
std::pair<std::vector<std::array<double, 2>>, double> row_geometry(const Project& project) {
  std::vector<std::array<double, 2>> heads;
  double width = 0.0;
  for (const Pile& pile : project.piles) {
    heads.push_back({pile.x, pile.y});
    width = std::max(width, project.pile_types.at(pile.type).section.width);
  }
  return {std::move(heads), width};
}

}  // namespace

double project_multiplier_axis(const Project& project) {
  if (project.piles.size() < 2) return 0.0;
  const auto geometry = row_geometry(project);
  return p_multiplier_axis(geometry.first, geometry.second);
}

std::vector<double> combination_multipliers(const Project& project, const Wrench& load,
                                            GroupMultipliers rule,
                                            std::optional<double>* direction) {
  const std::size_t n = project.piles.size();
  const double horizontal = std::hypot(load[0], load[1]);
  const bool pushed = horizontal > 0.0 && horizontal > 1e-9 * std::abs(load[2]);
  if (direction) *direction = pushed ? std::optional<double>(std::atan2(load[1], load[0])) : std::nullopt;
  if (rule == GroupMultipliers::none || !pushed || n < 2) return std::vector<double>(n, 1.0);
  const auto geometry = row_geometry(project);
  return p_multipliers(geometry.first, geometry.second, std::atan2(load[1], load[0]),
                       rule == GroupMultipliers::reversing);
}

void solve_nonlinear_combinations(const Project& project, const NonlinearCapSolver& solver,
                                  GroupMultipliers rule, NonlinearRun& run,
                                  const std::function<void(std::size_t, CapSolution&&)>& each) {
  run.rule = rule;
  run.multiplier_axis = project_multiplier_axis(project);
  run.combinations.assign(project.combinations.size(), NonlinearCombination{});
  for (std::size_t c = 0; c < project.combinations.size(); ++c) {
    const Combination& combo = project.combinations[c];
    const Wrench load = combination_load(project, combo, solver.reference());
    NonlinearCombination& out = run.combinations[c];
    const std::vector<double> multipliers =
        combination_multipliers(project, load, rule, &out.direction);
    NonlinearCapResult result = solver.solve(CapLoad(load), multipliers, combo.id);
    out.reached = result.reached;
    out.steps = result.steps;
    out.iterations = result.iterations;
    out.piles = std::move(result.piles);
    each(c, std::move(result.solution));
  }
}

PileProfile pile_profile_at(const NonlinearCapSolver& solver, std::size_t pile,
                            const CapMovement& movement, double p_multiplier) {
  const NonlinearGroup& group = solver.group();
  if (!group.profile || pile >= group.heads.size()) {
    PileProfile none;
    none.message = "no profile with depth for this pile model";
    return none;
  }
  // u = t + r × (p − c), ω = r.
  const auto& t = movement.translation_at_reference;
  const auto& r = movement.rotation;
  const auto& c = movement.reference;
  const auto& p = group.heads[pile];
  const std::array<double, 3> d = {p[0] - c[0], p[1] - c[1], p[2] - c[2]};
  const HeadMovement m = {t[0] + r[1] * d[2] - r[2] * d[1], t[1] + r[2] * d[0] - r[0] * d[2],
                          t[2] + r[0] * d[1] - r[1] * d[0], r[0], r[1], r[2]};
  return group.profile(pile, m, p_multiplier);
}

PushoverCurve push_combination(const Project& project, const NonlinearCapSolver& solver,
                               GroupMultipliers rule, std::size_t c,
                               const AnalysisSettings& settings) {
  const Combination& combo = project.combinations.at(c);
  const Wrench load = combination_load(project, combo, solver.reference());
  PushoverLimits limits;
  limits.largest_factor = settings.pushover_limit;
  limits.displacement = settings.pushover_displacement.value_or(0.0);
  limits.units = project.units;
  return solver.pushover(CapLoad(load), combination_multipliers(project, load, rule), combo.id,
                         limits);
}

}  // namespace cairn
