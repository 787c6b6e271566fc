// The `analysis:` section (analysis_keys.hpp).
#include "cairn/input/analysis_keys.hpp"

#include <algorithm>
#include <string>
#include <vector>

#include <fmt/format.h>

namespace cairn {

void read_analysis_settings(const Located& n, Project& project, ReadContext& ctx) {
  AnalysisSettings& a = project.analysis;
  a.where = ctx.at(n);
  if (!ctx.expect_map(n)) return;
  ctx.check_keys(n, {"soil_response", "p_multipliers", "pushover", "pushover_limit",
                     "pushover_displacement", "lateral_loading", "load_cycles"});
  if (auto s = n.child("soil_response"); s.present())
    if (auto v = ctx.choice<SoilResponse>(
            s, {{"linear", SoilResponse::linear}, {"nonlinear", SoilResponse::nonlinear}}))
      a.soil_response = *v;
  if (auto m = n.child("p_multipliers"); m.present())
    if (auto v = ctx.choice<GroupMultipliers>(m, {{"by_direction", GroupMultipliers::by_direction},
                                                  {"reversing", GroupMultipliers::reversing},
                                                  {"none", GroupMultipliers::none}}))
      a.p_multipliers = *v;
  if (auto p = n.child("pushover"); p.present()) {
    std::vector<std::string> ids;
    for (const auto& c : project.combinations) ids.push_back(c.id);
    const std::string id = p.is_scalar() ? p.scalar() : scalar_text(p);
    if (p.is_scalar() && std::find(ids.begin(), ids.end(), id) != ids.end()) {
      a.pushover = id;
    } else {
      const std::string near = closest_match(id, ids);
      ctx.error(ctx.at(p), fmt::format("analysis.pushover: combination '{}' does not exist{}", id,
                                       near.empty() ? "" : "; did you mean '" + near + "'?"));
    }
  }
  if (auto l = ctx.number(n, "pushover_limit", Quantity::number, ReadContext::Need::optional)) {
    if (*l < 1.0 || *l > 100.0)
      ctx.error(ctx.at(n.child("pushover_limit")),
                fmt::format("analysis.pushover_limit: expected a load factor from 1 to 100, got {}", *l));
    else
      a.pushover_limit = *l;
  }
  a.pushover_displacement =
      ctx.number(n, "pushover_displacement", Quantity::small_length, ReadContext::Need::optional);
  if (auto l = n.child("lateral_loading"); l.present())
    if (auto v = ctx.choice<LateralLoading>(
            l, {{"static", LateralLoading::static_load}, {"cyclic", LateralLoading::cyclic}}))
      a.lateral_loading = *v;
  if (auto c = ctx.number(n, "load_cycles", Quantity::number, ReadContext::Need::optional)) {
    if (!(*c >= 1.0 && *c <= 1e8))
      ctx.error(ctx.at(n.child("load_cycles")),
                fmt::format("analysis.load_cycles: expected a number of load cycles from 1 to "
                            "100000000, got {}",
                            *c));
    else if (a.lateral_loading != LateralLoading::cyclic)
      ctx.error(ctx.at(n.child("load_cycles")),
                "analysis.load_cycles: counts the cycles of cyclic p-y curves; give it with "
                "lateral_loading: cyclic (the static curves have no cycles)");
    else
      a.load_cycles = *c;
  }
}

}  // namespace cairn
