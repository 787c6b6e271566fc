// The `piles:` section (sections.hpp): positions, types, batter; repeated ids and
// overlapping piles.
#include "cairn/input/sections.hpp"

#include "cairn/core/quantity_format.hpp"

#include <cmath>
#include <map>
#include <set>

#include <fmt/format.h>

namespace cairn {
namespace {

using Need = ReadContext::Need;
using Sign = ReadContext::Sign;

// Messages of one kind about the piles (same id, same position, overlap) shown before the
// rest are counted in one line: 5,000 copies of one pile need not print 5,000 lines.
constexpr std::size_t kShownConflicts = 5;

// Two piles at one position, or closer than their widths allow. Each pile is compared
// only with the earlier piles in the 3 × 3 cells of a grid as wide as the widest pile
// (a spatial hash), and reports its first conflict; after kShownConflicts of each kind the
// rest are counted in one line. 5,000 piles at one point once gave 12.5 million lines.
void report_overlapping_piles(const Located& list, const std::vector<Pile>& piles,
                              const std::vector<PileType>& types, ReadContext& ctx,
                              const std::vector<std::size_t>& item_of) {
  double cell = 0.0;
  for (const auto& type : types) cell = std::max(cell, type.section.width);
  if (!(cell > 0.0)) return;
  auto key = [&](long long cx, long long cy) { return std::make_pair(cx, cy); };
  std::map<std::pair<long long, long long>, std::vector<std::size_t>> cells;
  std::size_t same = 0, overlapping = 0;
  const UnitSystem u = ctx.project_units();
  for (std::size_t j = 0; j < piles.size(); ++j) {
    const Pile& b = piles[j];
    if (b.type >= types.size()) continue;
    const auto cx = static_cast<long long>(std::floor(b.x / cell));
    const auto cy = static_cast<long long>(std::floor(b.y / cell));
    std::optional<std::size_t> first;  // the earliest pile b conflicts with
    for (long long dx = -1; dx <= 1; ++dx)
      for (long long dy = -1; dy <= 1; ++dy) {
        auto found = cells.find(key(cx + dx, cy + dy));
        if (found == cells.end()) continue;
        for (const std::size_t i : found->second) {
          if (first && i > *first) break;
          const Pile& a = piles[i];
          const double distance = std::hypot(a.x - b.x, a.y - b.y);
          const double touching = 0.5 * (types[a.type].section.width +
                                         types[b.type].section.width);
          if (distance < touching - 1e-9) {
            first = i;
            break;
          }
        }
      }
    cells[key(cx, cy)].push_back(j);
    if (!first) continue;
    const Pile& a = piles[*first];
    const double distance = std::hypot(a.x - b.x, a.y - b.y);
    const std::string where = fmt::format("piles[{}]", item_of[j]);
    if (distance < 1e-9) {
      if (++same <= kShownConflicts)
        ctx.error(b.where, fmt::format("{}: pile '{}' is at the same position as pile '{}'",
                                         where, b.id, a.id));
      continue;
    }
    if (++overlapping > kShownConflicts) continue;
    const double touching = 0.5 * (types[a.type].section.width +
                                   types[b.type].section.width);
    ctx.error(b.where, fmt::format(
        "{}: piles '{}' and '{}' overlap: centres {} apart, closer than their width ({})",
        where, a.id, b.id, QuantityFormat(u).text(Shown::length, distance),
        QuantityFormat(u).text(Shown::length, touching)));
  }
  if (same > kShownConflicts)
    ctx.error(ctx.at(list), fmt::format("piles: … and {} more piles at positions already used",
                                      same - kShownConflicts));
  if (overlapping > kShownConflicts)
    ctx.error(ctx.at(list), fmt::format("piles: … and {} more piles overlapping an earlier pile",
                                      overlapping - kShownConflicts));
}

}  // namespace

std::vector<Pile> read_piles(const Located& n, ReadContext& ctx,
                             const std::vector<PileType>& types) {
  std::vector<Pile> piles;
  if (!n.is_sequence()) {
    ctx.error(ctx.at(n), fmt::format("piles: expected a list of piles {{id, x, y, type}}, got {}",
                                   scalar_text(n)));
    return piles;
  }
  std::map<std::string, std::size_t> type_index;
  for (std::size_t i = 0; i < types.size(); ++i)
    type_index[types[i].id] = i;
  std::set<std::string> ids;
  std::size_t repeated_ids = 0;
  std::vector<std::size_t> item_of;  // index in the file's list of each pile read
  for (std::size_t i = 0; i < n.size(); ++i) {
    const Located p = n.item(i);
    if (!ctx.expect_map(p)) continue;
    ctx.check_keys(p, {"id", "x", "y", "type", "batter"});
    Pile pile;
    pile.where = ctx.at(p);
    pile.id = ctx.text(p, "id").value_or(fmt::format("#{}", i + 1));
    if (!ids.insert(pile.id).second && ++repeated_ids <= kShownConflicts)
      ctx.error(ctx.at(p.child("id")), fmt::format("{}.id: pile '{}' is listed twice", p.path,
                                                 pile.id));
    pile.x = ctx.number(p, "x", Quantity::length, Need::required, Sign::any).value_or(0.0);
    pile.y = ctx.number(p, "y", Quantity::length, Need::required, Sign::any).value_or(0.0);
    if (auto t = ctx.text(p, "type")) {
      auto it = type_index.find(*t);
      if (it == type_index.end()) {
        const std::string near = closest_match(*t, keys_of(type_index));
        ctx.error(ctx.at(p.child("type")),
                    fmt::format("{}.type: pile type '{}' does not exist{}", p.path, *t,
                                near.empty() ? fmt::format(" (known: {})",
                                                           list_of(keys_of(type_index)))
                                             : fmt::format("; did you mean '{}'?", near)));
      } else {
        pile.type = it->second;
      }
    }
    if (auto b = p.child("batter"); b.present() && ctx.expect_map(b)) {
      ctx.check_keys(b, {"ratio", "toward"});
      Batter batter;
      batter.ratio = ctx.number(b, "ratio", Quantity::number).value_or(1.0);
      batter.toward_deg =
          ctx.number(b, "toward", Quantity::angle, Need::required, Sign::any).value_or(0.0);
      pile.batter = batter;
    }
    piles.push_back(pile);
    item_of.push_back(i);
  }
  if (repeated_ids > kShownConflicts)
    ctx.error(ctx.at(n), fmt::format("piles: … and {} more piles with an id already used",
                                   repeated_ids - kShownConflicts));
  if (piles.empty())
    ctx.error(ctx.at(n), "piles: the list is empty; expected at least one pile");
  report_overlapping_piles(n, piles, types, ctx, item_of);
  return piles;
}

}  // namespace cairn
