#include "cairn/site/as_built.hpp"

#include <algorithm>
#include <cmath>
#include <map>

#include <fmt/format.h>

#include "cairn/core/enum_names.hpp"

namespace cairn {
namespace {

constexpr double kPi = 3.14159265358979323846;
// A length differing from the design by less than this is the design length (m).
constexpr double kLengthTolerance = 0.001;

// Horizontal slope of a pile axis per unit vertical, in plan.
std::array<double, 2> slope(const std::optional<Batter>& b) {
  if (!b || b->ratio <= 0.0) return {0.0, 0.0};
  const double t = b->toward_deg * kPi / 180.0;
  return {std::cos(t) / b->ratio, std::sin(t) / b->ratio};
}

double cosine_of(const std::optional<Batter>& b) {
  const auto s = slope(b);
  return 1.0 / std::sqrt(1.0 + s[0] * s[0] + s[1] * s[1]);
}

std::string small(UnitSystem u, double m) {
  return fmt::format("{:.0f} {}", from_si(u, Quantity::small_length, m),
                     unit_label(u, Quantity::small_length));
}
std::string length_text(UnitSystem u, double m) {
  return fmt::format("{:.2f} {}", from_si(u, Quantity::length, m), unit_label(u, Quantity::length));
}

}  // namespace

SiteTolerances default_tolerances(UnitSystem units) {
  SiteTolerances t;
  t.plan = units == UnitSystem::SI ? 0.075 : 3.0 * 0.0254;
  t.batter = 1.0 / 50.0;
  return t;
}

// Names in the order the enum declares its values (enum_names.hpp).
constexpr const char* kSiteVerdictNames[] = {
    "accept as built", "accept, deviations taken by the piles", "remedial work needed"};
const char* to_string(SiteVerdict v) { return name_in(kSiteVerdictNames, v); }

AsBuiltProject build_as_built(const Project& design, const Survey& survey,
                              const std::string& cap_name, const SiteTolerances& tolerances) {
  AsBuiltProject out;
  out.tolerances = tolerances;
  out.survey_file = survey.file;
  out.grid = survey.grid;
  const UnitSystem u = design.units;
  Diagnostics problems;
  // The rows of this cap, by pile id.
  std::map<std::string, const SurveyRow*> rows;
  std::vector<const SurveyRow*> order;
  for (const SurveyRow& row : survey.rows) {
    if (!row.cap.empty() && !cap_name.empty() && row.cap != cap_name) continue;
    const auto [it, fresh] = rows.emplace(row.pile, &row);
    if (!fresh) {
      problems.error(row.where, fmt::format("pile '{}': a second row for the pile (the first "
                                            "is on line {}); expected one row per pile",
                                            row.pile, it->second->where.line));
      continue;
    }
    order.push_back(&row);
  }
  std::vector<std::string> type_ids;
  for (const auto& t : design.pile_types) type_ids.push_back(t.id);
  auto find_type = [&](const SurveyRow& row) -> std::optional<std::size_t> {
    for (std::size_t t = 0; t < design.pile_types.size(); ++t)
      if (design.pile_types[t].id == row.type) return t;
    const std::string near = closest_match(row.type, type_ids);
    problems.error(row.where_type,
                   fmt::format("pile '{}', column 'type': no pile type '{}' in the design{}",
                               row.pile, row.type,
                               near.empty() ? "" : "; did you mean '" + near + "'?"));
    return std::nullopt;
  };

  Project& p = out.project;
  p = design;
  p.piles.clear();
  const std::optional<double> head_level =
      design.soil && design.soil->ground_level
          ? std::optional<double>(*design.soil->ground_level - design.cap.depth)
          : std::nullopt;

  auto place = [&](const SurveyRow* row, const Pile* designed, std::size_t design_index) {
    AsBuiltPile a;
    a.id = row ? row->pile : designed->id;
    a.design = designed ? std::optional<std::size_t>(design_index) : std::nullopt;
    a.added = designed == nullptr;
    a.status = row->status;
    Pile pile = designed ? *designed : Pile{};
    pile.where = row->where;
    if (a.added) {
      pile.id = row->pile;
      if (row->type.empty()) {
        problems.error(row->where,
                       fmt::format("pile '{}' is not in the design; a pile added on site needs "
                                   "its pile type (column 'type'){}",
                                   row->pile,
                                   [&] {
                                     std::vector<std::string> ids;
                                     for (const auto& d : design.piles) ids.push_back(d.id);
                                     const std::string near = closest_match(row->pile, ids);
                                     return near.empty() ? std::string()
                                                         : "; or did you mean '" + near + "'?";
                                   }()));
        return;
      }
      if (row->status == PileStatus::rejected || row->status == PileStatus::abandoned) {
        // An added pile that was itself lost: in the ground, carrying nothing.
      }
    }
    if (!row->type.empty()) {
      const auto t = find_type(*row);
      if (!t) return;
      pile.type = *t;
    }
    a.type = pile.type;
    const bool lost = row->status == PileStatus::rejected || row->status == PileStatus::abandoned;
    if (row->x) {
      pile.x = *row->x;
      pile.y = *row->y;
    } else if (row->dx) {
      if (a.added) {
        problems.error(row->where_position,
                       fmt::format("pile '{}' is not in the design, so it has no design "
                                   "position to be offset from; give x and y",
                                   row->pile));
        return;
      }
      pile.x += *row->dx;
      pile.y += *row->dy;
    } else if (!lost) {
      problems.error(row->where_position,
                     fmt::format("pile '{}' is {}: expected its surveyed head (x and y, or dx "
                                 "and dy)",
                                 row->pile, to_string(row->status)));
      return;
    }
    a.design_x = designed ? designed->x : pile.x;
    a.design_y = designed ? designed->y : pile.y;
    a.x = pile.x;
    a.y = pile.y;
    a.offset = std::hypot(a.x - a.design_x, a.y - a.design_y);
    a.direction_deg = a.offset > 0 ? std::atan2(a.y - a.design_y, a.x - a.design_x) * 180.0 / kPi : 0.0;
    if (a.direction_deg < 0) a.direction_deg += 360.0;
    if (!a.added && a.offset > tolerances.plan) {
      a.out_of_tolerance = true;
      a.remarks.push_back(fmt::format("offset {} beyond the plan tolerance of {}",
                                      small(u, a.offset), small(u, tolerances.plan)));
    }
    if (row->batter) {
      const std::optional<Batter> measured =
          row->batter->ratio > 0 ? std::optional<Batter>(*row->batter) : std::nullopt;
      const auto sd = slope(designed ? designed->batter : std::nullopt), sm = slope(measured);
      a.batter_deviation = std::hypot(sm[0] - sd[0], sm[1] - sd[1]);
      pile.batter = measured;
      if (!a.added && *a.batter_deviation > tolerances.batter * (1 + 1e-9)) {
        a.out_of_tolerance = true;
        a.remarks.push_back(fmt::format("batter off by 1 in {:.0f}, beyond the tolerance of 1 "
                                        "in {:.0f}",
                                        1.0 / *a.batter_deviation, 1.0 / tolerances.batter));
      }
    }
    // The installed length.
    const PileType& type = design.pile_types[pile.type];
    const double c = cosine_of(pile.batter);
    std::optional<double> length = row->installed_length;
    if (!length && row->tip_level) {
      const std::optional<double> top = row->cutoff_level ? row->cutoff_level : head_level;
      if (!top) {
        problems.error(row->where_length,
                       fmt::format("pile '{}', column 'tip_level': a level needs the project's "
                                   "elevation datum (soil.ground_level, with cap.depth) or the "
                                   "pile's cutoff_level in the same row",
                                   row->pile));
        return;
      }
      length = (*top - *row->tip_level) / c;
      if (!(*length > 0)) {
        problems.error(row->where_length,
                       fmt::format("pile '{}', column 'tip_level': the tip is not below the "
                                   "head ({} above it)",
                                   row->pile, length_text(u, -*length * c)));
        return;
      }
    }
    if (row->cutoff_level && head_level && !lost &&
        std::abs(*row->cutoff_level - *head_level) > kLengthTolerance)
      a.remarks.push_back(fmt::format("cut-off {} {} the design level (the pile head is taken "
                                      "at the underside of the cap)",
                                      small(u, std::abs(*row->cutoff_level - *head_level)),
                                      *row->cutoff_level < *head_level ? "below" : "above"));
    a.capacity_factor = row->capacity_factor;
    a.stiffness_factor = row->stiffness_factor;
    if (row->status == PileStatus::damaged && !row->capacity_factor && !row->stiffness_factor) {
      problems.error(row->where,
                     fmt::format("pile '{}' is damaged: expected capacity_factor and/or "
                                 "stiffness_factor (the share of the design capacity and "
                                 "stiffness it keeps); cairn does not guess them",
                                 row->pile));
      return;
    }
    bool derived = row->capacity_factor || row->stiffness_factor;
    PileType derived_type = type;
    if (length && std::abs(*length - type.length) > kLengthTolerance) {
      a.design_length = type.length;
      a.length = length;
      const bool short_pile = *length < type.length;
      if (short_pile && !lost) {
        a.remarks.push_back(fmt::format("installed {} short of its design length of {}",
                                        length_text(u, type.length - *length),
                                        length_text(u, type.length)));
        if (!type.capacities.empty() && !row->capacity_factor) {
          problems.error(row->where_length,
                         fmt::format("row {}, column '{}': pile '{}' was installed {} short "
                                     "of its design length of {}, and the capacity of pile "
                                     "type '{}' was typed in by hand (not computed from the "
                                     "soil): give capacity_factor, the share of the design "
                                     "capacity the short pile keeps; cairn does not guess it",
                                     row->row, row->length_column, row->pile, length_text(u, type.length - *length),
                                     length_text(u, type.length), type.id));
          return;
        }
      }
      derived_type.length = *length;
      derived = true;
    }
    if (row->status == PileStatus::damaged) a.remarks.push_back("damaged");
    if (lost) {
      a.remarks.push_back(fmt::format("{}: carries nothing, left in the ground",
                                      to_string(row->status)));
      out.piles.push_back(std::move(a));
      return;
    }
    if (a.added) a.remarks.push_back("added on site");
    if (derived) {
      derived_type.id = type.id + "/" + pile.id;
      p.pile_types.push_back(derived_type);
      pile.type = p.pile_types.size() - 1;
      out.adjust.capacity_factor.resize(p.pile_types.size(), 1.0);
      out.adjust.stiffness_factor.resize(p.pile_types.size(), 1.0);
      out.adjust.capacity_factor[pile.type] = row->capacity_factor.value_or(1.0);
      out.adjust.stiffness_factor[pile.type] = row->stiffness_factor.value_or(1.0);
    }
    a.as_built = p.piles.size();
    p.piles.push_back(pile);
    out.piles.push_back(std::move(a));
  };

  for (std::size_t i = 0; i < design.piles.size(); ++i) {
    const Pile& d = design.piles[i];
    const auto it = rows.find(d.id);
    if (it == rows.end()) {
      problems.error({survey.file, 1, 1},
                     fmt::format("pile '{}' of the design{} has no row in the survey; expected "
                                 "one row per pile (status accepted, damaged, rejected or "
                                 "abandoned)",
                                 d.id, cap_name.empty() ? "" : " (cap '" + cap_name + "')"));
      continue;
    }
    place(it->second, &d, i);
  }
  for (const SurveyRow* row : order) {
    const bool in_design = std::any_of(design.piles.begin(), design.piles.end(),
                                       [&](const Pile& d) { return d.id == row->pile; });
    if (!in_design) place(row, nullptr, 0);
  }
  problems.raise_if_any();
  if (p.piles.empty())
    throw InputError({survey.file, 1, 1}, "no pile of the cap is left standing in the survey");
  // Spacing to every pile, the lost ones left in the ground included.
  const double spacing_factor = design.group.min_spacing_factor;
  for (std::size_t i = 0; i < out.piles.size(); ++i) {
    AsBuiltPile& a = out.piles[i];
    if (!a.as_built) continue;
    const double width = design.pile_types[a.type].section.width;
    for (std::size_t j = 0; j < out.piles.size(); ++j) {
      if (j == i) continue;
      const AsBuiltPile& b = out.piles[j];
      if (b.as_built && !a.added) continue;  // between standing piles: the group checks say it
      const double need =
          std::max(design.group.min_spacing,
                   spacing_factor * std::max(width, design.pile_types[b.type].section.width));
      const double d = std::hypot(a.x - b.x, a.y - b.y);
      if (d < need - 1e-9)
        a.remarks.push_back(fmt::format("{} from {} pile {} (minimum spacing {})",
                                        length_text(u, d),
                                        b.as_built ? "pile" : to_string(b.status), b.id,
                                        length_text(u, need)));
    }
  }
  p.notes.push_back(fmt::format("As built, from the survey {}.", survey.file));
  return out;
}

AsBuiltComparison compare_as_built(const AsBuiltProject& model, const CheckRun& design,
                                   const CheckRun& as_built) {
  AsBuiltComparison c;
  const std::size_t n = model.piles.size();
  c.design_utilization.assign(n, std::nullopt);
  c.as_built_utilization.assign(n, std::nullopt);
  for (std::size_t i = 0; i < n; ++i) {
    const AsBuiltPile& a = model.piles[i];
    if (a.design) c.design_utilization[i] = design.results.envelope[*a.design].max_utilization.value;
    if (a.as_built)
      c.as_built_utilization[i] = as_built.results.envelope[*a.as_built].max_utilization.value;
    if (a.out_of_tolerance) c.any_out_of_tolerance = true;
    if (a.out_of_tolerance || a.added || a.status != PileStatus::accepted || a.length ||
        a.capacity_factor || a.stiffness_factor)
      c.any_deviation = true;
  }
  c.design_max = design.results.summary.max_utilization;
  c.as_built_max = as_built.results.summary.max_utilization;
  c.design_governing_combination = design.results.summary.combination;
  c.governing_combination = as_built.results.summary.combination;
  // The failing combination with the largest utilization governs a failed cap.
  if (!as_built.results.summary.pass) {
    double worst = -1.0;
    for (const auto& cc : as_built.results.combinations)
      if (!cc.pass && (cc.solution.overturns ? 1e300 : cc.max_utilization) > worst) {
        worst = cc.solution.overturns ? 1e300 : cc.max_utilization;
        c.governing_combination = cc.combination;
      }
  }
  c.verdict = !as_built.results.summary.pass ? SiteVerdict::remedial
              : c.any_deviation              ? SiteVerdict::accept_with_deviations
                                             : SiteVerdict::accept;
  return c;
}

}  // namespace cairn
