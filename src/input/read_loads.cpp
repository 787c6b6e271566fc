// The `columns:` and `load_cases:` sections (sections.hpp).
#include "cairn/input/sections.hpp"

#include <cmath>
#include <map>

#include <fmt/format.h>

namespace cairn {
namespace {

using Need = ReadContext::Need;
using Sign = ReadContext::Sign;

const std::map<std::string, LoadKind> kLoadKinds = {
    {"dead", LoadKind::dead},         {"live", LoadKind::live},
    {"roof_live", LoadKind::roof_live}, {"snow", LoadKind::snow},
    {"rain", LoadKind::rain},         {"wind", LoadKind::wind},
    {"seismic", LoadKind::seismic},   {"earth", LoadKind::earth},
    {"fluid", LoadKind::fluid},       {"temperature", LoadKind::temperature},
    {"other", LoadKind::other},       {"wearing_surface", LoadKind::wearing_surface},
    {"vertical_earth", LoadKind::vertical_earth}, {"collision", LoadKind::collision}};

}  // namespace

std::vector<Column> read_columns(const Located& n, ReadContext& ctx, double cap_thickness) {
  std::vector<Column> columns;
  if (!n.is_sequence()) {
    ctx.error(ctx.at(n), "columns: expected a list of columns {id, at: [x, y], support}");
    return columns;
  }
  std::map<std::string, std::string> support_owner;
  for (std::size_t i = 0; i < n.size(); ++i) {
    const Located c = n.item(i);
    if (!ctx.expect_map(c)) continue;
    ctx.check_keys(c, {"id", "at", "support"});
    Column column;
    column.where = ctx.at(c);
    column.id = ctx.text(c, "id").value_or(fmt::format("#{}", i + 1));
    if (auto a = ctx.point(c.child("at"), true)) column.at = *a;
    column.on_top = std::isnan(column.at[2]);
    if (column.on_top) column.at[2] = cap_thickness;
    column.support = ctx.text(c, "support").value_or("");
    if (!column.support.empty()) {
      auto [it, fresh] = support_owner.emplace(column.support, column.id);
      if (!fresh)
        ctx.error(ctx.at(c.child("support")),
                    fmt::format("{}.support: support '{}' is mapped twice (columns '{}' and '{}')",
                                c.path, column.support, it->second, column.id));
    }
    columns.push_back(std::move(column));
  }
  return columns;
}

std::vector<LoadCase> read_load_cases(const std::vector<NamedEntry>& entries,
                                      const Located& whole, ReadContext& ctx,
                                      double cap_thickness) {
  return read_named_entries<LoadCase>(entries, whole, ctx, [&](const Located& n, LoadCase& lc) {
    ctx.check_keys(n, {"kind", "loads", "description", "direction"});
    if (auto d = ctx.text(n, "direction", Need::optional)) lc.direction = *d;
    if (auto k = n.child("kind"); k.present()) {
      if (auto v = ctx.choice<LoadKind>(k, kLoadKinds)) lc.kind = *v;
    } else {
      ctx.error(ctx.at(n), fmt::format("{}.kind: missing; expected one of {}", n.path,
                                     list_of(keys_of(kLoadKinds))));
    }
    const Located loads = n.child("loads");
    if (loads.present() && !loads.is_sequence()) {
      ctx.error(ctx.at(loads), fmt::format("{}: expected a list of loads {{at: [x, y], Fz: …}}",
                                         loads.path));
    } else if (loads.present()) {
      for (std::size_t i = 0; i < loads.size(); ++i) {
        const Located l = loads.item(i);
        if (!ctx.expect_map(l)) continue;
        ctx.check_keys(l, {"at", "Fx", "Fy", "Fz", "Mx", "My", "Mz", "note"});
        PointLoad load;
        load.where = ctx.at(l);
        if (auto a = ctx.point(l.child("at"), true)) load.at = *a;
        load.on_top = std::isnan(load.at[2]);
        if (load.on_top) load.at[2] = cap_thickness;
        bool any = false;
        for (std::size_t c = 0; c < 6; ++c) {
          const auto v = ctx.number(l, kWrenchNames[c], c < 3 ? Quantity::force : Quantity::moment,
                                Need::optional, Sign::any);
          load.load[c] = v.value_or(0.0);
          any = any || l.child(kWrenchNames[c]).present();
        }
        if (!any)
          ctx.error(ctx.at(l), fmt::format("{}: expected at least one of Fx, Fy, Fz, Mx, My, Mz",
                                         l.path));
        if (auto note = ctx.text(l, "note", Need::optional)) load.note = *note;
        lc.loads.push_back(load);
      }
    }
  });
}

}  // namespace cairn
