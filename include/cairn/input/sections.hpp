// sections.hpp — one reader per section of a project file, each returning what it read.
//
// A section reader takes the section's Located value (or its named entries, for the
// sections merged entry by entry), a ReadContext for numbers, names, diagnostics and
// warnings, and the values of earlier sections it depends on, by const reference. It
// returns its values; it never writes into a Project (input.cpp assembles the Project in
// the order below, so that problems are reported in the order of that list). Every range
// check of a key lives in its reader, and only there.
//
// | section                 | reader                   | file                        |
// |-------------------------|--------------------------|-----------------------------|
// | group                   | read_group               | src/input/read_group.cpp    |
// | soil                    | read_soil                | src/input/read_soil.cpp     |
// | cap                     | read_cap                 | src/input/read_cap.cpp      |
// | pile_types              | read_pile_types          | src/input/read_pile_types.cpp |
// | piles                   | read_piles               | src/input/read_piles.cpp    |
// | columns                 | read_columns             | src/input/read_loads.cpp    |
// | load_cases              | read_load_cases          | src/input/read_loads.cpp    |
// | combinations (+generate)| read_combinations        | src/input/read_combinations.cpp |
// | loads_from              | read_reactions           | src/input/read_reactions.cpp |
//
// Units are SI in what the readers return.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "cairn/core/model.hpp"
#include "cairn/geotechnics/soil.hpp"
#include "cairn/input/includes.hpp"
#include "cairn/input/yaml_core.hpp"

namespace cairn {

// `group:` — efficiency method, spacing and edge limits, settlement.
GroupSettings read_group(const Located& n, ReadContext& ctx);

// `soil:` — the layers from the ground surface down, water table, ground level.
std::optional<SoilProfile> read_soil(const Located& n, ReadContext& ctx);

// `cap:` — thickness, depth, outline (rectangle or polygon, corners counter-clockwise),
// self-weight.
Cap read_cap(const Located& n, ReadContext& ctx);

// The entries of a section of named maps, one T each: `read_one(n, item)` fills an item
// whose id and place are set already. A section or entry that is not a map is reported and
// its items left out.
template <class T, class ReadOne>
std::vector<T> read_named_entries(const std::vector<NamedEntry>& entries, const Located& whole,
                                  ReadContext& ctx, ReadOne read_one) {
  std::vector<T> items;
  if (!ctx.expect_map(whole)) return items;
  for (const auto& entry : entries) {
    T item;
    item.id = entry.name;
    item.where = entry.key_where;
    if (!ctx.expect_map(entry.value)) continue;
    read_one(entry.value, item);
    items.push_back(std::move(item));
  }
  return items;
}

// `pile_types:` — one PileType per named entry; `has_soil` says whether methods that
// compute capacities from the soil can be used. Installation cautions are warnings.
std::vector<PileType> read_pile_types(const std::vector<NamedEntry>& entries,
                                      const Located& whole, ReadContext& ctx, bool has_soil);

// `piles:` — positions, types (by name among `types`), batter; ids unique; no two piles
// at one position or overlapping.
std::vector<Pile> read_piles(const Located& n, ReadContext& ctx,
                             const std::vector<PileType>& types);

// `columns:` — where the reactions of `loads_from` act (z defaults to the cap's top).
std::vector<Column> read_columns(const Located& n, ReadContext& ctx, double cap_thickness);

// `load_cases:` — one LoadCase per named entry (z of a load defaults to the cap's top).
std::vector<LoadCase> read_load_cases(const std::vector<NamedEntry>& entries,
                                      const Located& whole, ReadContext& ctx,
                                      double cap_thickness);

// `combinations:` — the typed combinations and those generated from load-case kinds
// (`generate:`), with the notes of the generators and the EN 1997 settings.
struct CombinationsRead {
  std::vector<Combination> combinations;
  std::vector<std::string> notes;
  En1997Settings en1997;
};
CombinationsRead read_combinations(const std::vector<NamedEntry>& entries, const Located& whole,
                                   ReadContext& ctx, const std::vector<LoadCase>& load_cases);

// `loads_from:` — column reactions from a CSV file (reactions_csv.hpp), added to the load
// cases, or imported as already-factored combinations. Returns the load cases and
// combinations with the reactions added.
struct ReactionsRead {
  std::string loads_file;
  std::vector<LoadCase> load_cases;
  std::vector<Combination> combinations;
  std::vector<std::string> notes;
};
ReactionsRead read_reactions(const Located& n, ReadContext& ctx,
                             const std::vector<Column>& columns,
                             std::vector<LoadCase> load_cases,
                             std::vector<Combination> combinations);

}  // namespace cairn
