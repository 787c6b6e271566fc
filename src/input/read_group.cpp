// The `group:` section (sections.hpp).
#include "cairn/input/sections.hpp"

#include <vector>

#include "cairn/geotechnics/group.hpp"

#include <fmt/format.h>

#include "cairn/geotechnics/methods.hpp"

namespace cairn {
namespace {

using Need = ReadContext::Need;
using Sign = ReadContext::Sign;

}  // namespace

GroupSettings read_group(const Located& n, ReadContext& ctx) {
  GroupSettings g;
  if (!ctx.expect_map(n)) return g;
  ctx.check_keys(n, {"efficiency", "efficiency_on", "min_spacing", "min_spacing_absolute",
                     "min_edge_distance", "settlement"});
  g.where = ctx.at(n);
  if (auto e = n.child("efficiency"); e.present()) {
    const std::string name = e.is_scalar() ? e.scalar() : scalar_text(e);
    if (!efficiency_method_from_string(name)) {
      ctx.error(ctx.at(e), fmt::format("group.efficiency: unknown method '{}'; expected one of {}",
                                     name, list_of(efficiency_method_names())));
    } else {
      g.efficiency = name;
    }
  }
  if (auto on = n.child("efficiency_on"); on.present())
    if (auto v = ctx.choice<bool>(on, {{"whole", false}, {"shaft", true}})) g.efficiency_shaft_only = *v;
  if (auto s = ctx.number(n, "min_spacing", Quantity::number, Need::optional)) g.min_spacing_factor = *s;
  if (auto s = ctx.number(n, "min_spacing_absolute", Quantity::length, Need::optional)) g.min_spacing = *s;
  if (auto s = ctx.number(n, "min_edge_distance", Quantity::length, Need::optional, Sign::non_negative))
    g.min_edge_distance = *s;
  if (auto st = n.child("settlement"); st.present()) {
    g.settlement = true;
    if (st.is_scalar() && (st.scalar() == "true" || st.scalar() == "yes")) return g;
    if (st.is_scalar() && (st.scalar() == "false" || st.scalar() == "no")) {
      g.settlement = false;
      return g;
    }
    if (!ctx.expect_map(st)) return g;
    ctx.check_keys(st, {"limit", "tip_share"});
    g.settlement_limit = ctx.number(st, "limit", Quantity::small_length, Need::optional);
    g.tip_share = ctx.number(st, "tip_share", Quantity::number, Need::optional, Sign::non_negative);
    if (g.tip_share && *g.tip_share > 1.0)
      ctx.error(ctx.at(st.child("tip_share")), "group.settlement.tip_share: expected a share from 0 to 1");
  }
  return g;
}

}  // namespace cairn
