// capacity_length.cpp — the shortest pile length meeting a required capacity (see
// capacity_length.hpp).
#include "cairn/geotechnics/capacity_length.hpp"

#include <cmath>
#include <stdexcept>

#include <fmt/format.h>

#include "cairn/core/diagnostics.hpp"
#include "cairn/core/quantity_format.hpp"
#include "cairn/geotechnics/soil.hpp"

namespace cairn {
namespace {

// Tolerance on depths, m, as in capacity.cpp: a tip within 1 µm of a boundary is on it.
constexpr double kDepthTolerance = 1e-6;

DepthRow row_at(const SoilProfile& profile, PileGeometry pile, const PileDesign& design,
                double length) {
  pile.length = length;
  const CapacityResult r = pile_capacity(profile, pile, design);
  DepthRow row{pile.length, pile.tip_depth(), r.tip, r.shaft, r.ultimate_compression,
               r.ultimate_tension, {}};
  row.allowable_compression = r.allowable_compression;
  row.allowable_tension = r.allowable_tension;
  row.factored_compression = r.factored_compression;
  row.factored_tension = r.factored_tension;
  return row;
}

// The one of three values that belongs to `basis`.
double on_basis(CapacityBasis basis, double allowable, double factored, double ultimate) {
  switch (basis) {
    case CapacityBasis::allowable: return allowable;
    case CapacityBasis::factored: return factored;
    case CapacityBasis::ultimate: return ultimate;
  }
  return 0.0;
}

}  // namespace

double compression_on(const DepthRow& row, CapacityBasis basis) {
  return on_basis(basis, row.allowable_compression, row.factored_compression, row.ultimate);
}

double tension_on(const DepthRow& row, CapacityBasis basis) {
  return on_basis(basis, row.allowable_tension, row.factored_tension, row.tension);
}

bool meets(const DepthRow& row, const LengthNeed& need) {
  if (need.compression && compression_on(row, need.basis) < *need.compression) return false;
  if (need.tension && tension_on(row, need.basis) < *need.tension) return false;
  return true;
}

LengthChoice shortest_length(const SoilProfile& profile, PileGeometry pile,
                             const PileDesign& design, const LengthNeed& need, double step,
                             double min_length, double resolution) {
  if (!need.compression && !need.tension)
    throw std::invalid_argument("required length: give a compression or a tension");
  if (!(resolution > 0.0))
    throw std::invalid_argument("required length: resolution must be positive");
  pile.length = min_length;
  const std::vector<DepthRow> rows = capacity_with_depth(profile, pile, design, step, min_length);
  LengthChoice choice;
  choice.need = need;
  choice.resolution = resolution;
  std::size_t first = 0;
  while (first < rows.size() && !meets(rows[first], need)) ++first;
  if (first == rows.size()) {
    if (!rows.empty()) choice.longest = rows.back();
    return choice;
  }

  DepthRow found = rows[first];
  if (first == 0) {
    choice.at_shortest = true;
  } else {
    // Bisection on the grid L_short + j·resolution between the row that falls short (j = 0)
    // and the row that meets the need (j = n): the invariant is "lo falls short, hi meets".
    const double short_length = rows[first - 1].length;
    const int n = std::max(1, static_cast<int>(std::ceil((found.length - short_length) /
                                                          resolution - 1e-9)));
    auto length_of = [&](int j) {
      return j >= n ? found.length : short_length + j * resolution;
    };
    int lo = 0, hi = n;
    while (hi - lo > 1) {
      const int mid = (lo + hi) / 2;
      const DepthRow row = row_at(profile, pile, design, length_of(mid));
      if (meets(row, need)) {
        hi = mid;
        found = row;
      } else {
        lo = mid;
      }
    }
  }
  // With --from or --step off the resolution's grid, the length found is rounded up to it,
  // so that the length printed (to the resolution) is never shorter than the one that works.
  const double rounded = std::ceil(found.length / resolution - 1e-9) * resolution;
  if (!choice.at_shortest && rounded > found.length + kDepthTolerance &&
      rounded <= profile.depth() - pile.head_depth + kDepthTolerance) {
    const DepthRow row = row_at(profile, pile, design, rounded);
    if (meets(row, need)) found = row;
  }
  choice.length = found.length;
  choice.at = found;

  // The tip's layer (by the soil column's rule: a tip on a boundary bears on the layer below)
  // and the first boundary below it.
  const SoilColumn column(profile);
  const std::size_t tip_index = column.layer_at(found.tip_depth);
  choice.tip_layer = column.layer(tip_index).name;
  if (tip_index > 0) choice.tip_layer_top = column.top(tip_index);
  if (tip_index + 1 < column.size()) {
    choice.next_boundary = column.bottom(tip_index);
    choice.next_layer = column.layer(tip_index + 1).name;
  }
  for (std::size_t i = first + 1; i < rows.size(); ++i)
    if (!meets(rows[i], need)) {
      choice.falls_short_again = rows[i].length;
      break;
    }
  return choice;
}

double length_resolution(UnitSystem units) {
  return units == UnitSystem::SI ? 0.01 : 0.1 * to_si_factor(units, Quantity::length);
}

std::optional<double> tip_elevation(const SoilProfile& profile, double tip_depth) {
  if (!profile.ground_level) return std::nullopt;
  return *profile.ground_level - tip_depth;
}

std::vector<PileTypeLength> choose_lengths(const Project& project,
                                           const std::vector<PileTypeCapacity>& capacities,
                                           const LengthNeed& need, double step,
                                           double min_length) {
  std::vector<PileTypeLength> list;
  if (!project.soil) return list;
  for (const auto& c : capacities)
    list.push_back({c.type, shortest_length(*project.soil, c.geometry,
                                            project.pile_types[c.type].design, need, step,
                                            min_length, length_resolution(project.units))});
  return list;
}

void require_table_within_profile(const Project& project, double min_length,
                                  const std::string& option) {
  if (!project.soil || project.soil->layers.empty()) return;
  const double longest = project.soil->depth() - project.cap.depth;
  if (min_length <= longest + kDepthTolerance) return;
  const UnitSystem u = project.units;
  const char* unit = unit_label(u, Quantity::length);
  auto length = [&](double v) { return general_text(from_si(u, Quantity::length, v)); };
  throw InputError(
      {}, fmt::format("{}: expected a pile length whose tip lies within the soil profile (at "
                      "most {} {}: profile {} {} deep, pile heads {} {} below the ground), got "
                      "'{}'",
                      option, length(longest), unit, length(project.soil->depth()), unit,
                      length(project.cap.depth), unit, length(min_length)));
}

}  // namespace cairn
