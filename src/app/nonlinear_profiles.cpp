#include "cairn/app/nonlinear_profiles.hpp"

#include <algorithm>
#include <optional>
#include <utility>

namespace cairn {
namespace {

// The checked combination of index c, when it reached equilibrium.
const CombinationCheck* equilibrium(const CheckResults& results, std::size_t c) {
  for (const CombinationCheck& check : results.combinations)
    if (check.combination == c) return check.solution.overturns ? nullptr : &check;
  return nullptr;
}

// The head movement (u, ω) of the pile at `head` when the cap moved as `m`.
HeadMovement head_movement(const CapMovement& m, const std::array<double, 3>& head) {
  const auto& t = m.translation_at_reference;
  const auto& r = m.rotation;
  const std::array<double, 3> d = {head[0] - m.reference[0], head[1] - m.reference[1],
                                   head[2] - m.reference[2]};
  return {t[0] + r[1] * d[2] - r[2] * d[1], t[1] + r[2] * d[0] - r[0] * d[2],
          t[2] + r[0] * d[1] - r[1] * d[0], r[0], r[1], r[2]};
}

}  // namespace

std::vector<GoverningPileProfile> governing_pile_profiles(const Project& project,
                                                          const CheckResults& results,
                                                          const NonlinearRun& run,
                                                          const NonlinearGroup& group) {
  std::vector<GoverningPileProfile> out;
  if (!group.profile) return out;
  const std::size_t n = std::min(project.piles.size(), group.heads.size());
  // (pile, combination) of the bending check and of the largest head deflection.
  std::optional<std::pair<std::size_t, std::size_t>> bending, deflection;
  double worst = -1.0;
  const auto structural = static_cast<std::size_t>(Demand::structural) - 1;
  for (std::size_t i = 0; i < n && i < results.governing.size(); ++i) {
    const Extreme& u = results.governing[i][structural].utilization;
    if (u.combination && equilibrium(results, *u.combination) && u.value > worst) {
      worst = u.value;
      bending = {{i, *u.combination}};
    }
  }
  double largest_moment = -1.0, largest_deflection = -1.0;
  std::optional<std::pair<std::size_t, std::size_t>> moment;
  for (std::size_t c = 0; c < run.combinations.size(); ++c) {
    if (!equilibrium(results, c)) continue;
    const auto& piles = run.combinations[c].piles;
    for (std::size_t i = 0; i < n && i < piles.size(); ++i) {
      if (piles[i].max_moment > largest_moment) {
        largest_moment = piles[i].max_moment;
        moment = {{i, c}};
      }
      if (piles[i].head_deflection > largest_deflection) {
        largest_deflection = piles[i].head_deflection;
        deflection = {{i, c}};
      }
    }
  }
  if (!bending) bending = moment;
  for (const auto& chosen : {bending, deflection}) {
    if (!chosen) continue;
    const auto [i, c] = *chosen;
    if (!out.empty() && out.front().pile == project.piles[i].id &&
        out.front().combination == project.combinations[c].id)
      continue;
    const CombinationCheck* check = equilibrium(results, c);
    const double multiplier = i < run.combinations[c].piles.size()
                                  ? run.combinations[c].piles[i].p_multiplier
                                  : 1.0;
    out.push_back({project.piles[i].id, project.combinations[c].id,
                   group.profile(i, head_movement(check->solution.movement, group.heads[i]),
                                 multiplier)});
  }
  return out;
}

}  // namespace cairn
