// The `combinations:` section (sections.hpp): typed combinations, and those generated
// from the load cases' kinds by `generate:` (combinations.hpp).
#include "cairn/input/sections.hpp"

#include <algorithm>
#include <cmath>
#include <map>
#include <stdexcept>

#include <fmt/format.h>

#include "cairn/input/combinations.hpp"

namespace cairn {
namespace {

using Need = ReadContext::Need;
using Sign = ReadContext::Sign;

// The EN 1997-1 keys of `combinations.generate` (how design resistances are obtained).
void read_en1997_settings(const Located& n, En1997Settings& en, ReadContext& ctx) {
  if (auto kind = n.child("pile_kind"); kind.present()) {
    en.pile_kind = ctx.choice<En1997PileKind>(kind, {{"driven", En1997PileKind::driven},
                                                 {"bored", En1997PileKind::bored},
                                                 {"cfa", En1997PileKind::cfa}});
  }
  if (auto profiles = ctx.number(n, "test_profiles", Quantity::number, Need::optional, Sign::any)) {
    if (*profiles < 1 || *profiles != std::floor(*profiles))
      ctx.error(ctx.at(n.child("test_profiles")),
                  fmt::format("{}.test_profiles: expected a whole number of profiles of ground "
                              "tests (1 or more), got '{}'",
                              n.path, n.child("test_profiles").scalar()));
    else
      en.test_profiles = static_cast<int>(*profiles);
  }
  if (auto rigid = ctx.flag(n, "rigid_cap")) en.rigid_cap = *rigid;
  if (auto factor = ctx.number(n, "model_factor", Quantity::number, Need::optional)) {
    if (*factor < 1.0)
      ctx.error(ctx.at(n.child("model_factor")),
                  fmt::format("{}.model_factor: expected a factor of 1.0 or more, got '{}'",
                              n.path, n.child("model_factor").scalar()));
    else
      en.model_factor = *factor;
  }
}

// `combinations: {generate: asce7-lrfd}` (or a list of generator names), or
// `generate: {codes: …, sds: …, …}` with the values some generators need: code
// combinations built from the load cases' kinds (combinations.hpp).
void generate_combinations_for(const NamedEntry& entry, ReadContext& ctx,
                               const std::vector<LoadCase>& load_cases,
                               const std::map<std::string, std::size_t>& case_index,
                               CombinationsRead& read) {
  const Located& n = entry.value;
  const Located codes = n.is_map() ? n.child("codes") : n;
  CombinationSettings settings;
  if (n.is_map()) {
    ctx.check_keys(n, {"codes", "sds", "earth_permanent", "gamma_eq", "pile_kind", "test_profiles",
                       "rigid_cap", "model_factor"});
    if (!codes.present()) {
      ctx.error(ctx.at(n), fmt::format("{}.codes: missing; expected a generator name or a list "
                                     "({})",
                                     n.path, list_of(generator_names())));
      return;
    }
    settings.sds = ctx.number(n, "sds", Quantity::number, Need::optional, Sign::non_negative);
    if (auto permanent = ctx.flag(n, "earth_permanent")) settings.earth_permanent = *permanent;
    if (auto g = ctx.number(n, "gamma_eq", Quantity::number, Need::optional, Sign::non_negative))
      settings.gamma_eq = *g;
    read_en1997_settings(n, read.en1997, ctx);
  }
  std::vector<Located> names;
  if (codes.is_sequence())
    for (std::size_t i = 0; i < codes.size(); ++i) names.push_back(codes.item(i));
  else
    names.push_back(codes);
  if (n.is_map()) {
    // A key that no listed generator reads is a mistake (a misplaced code, say), not a no-op.
    const std::vector<std::pair<std::string, std::string>> owners = {
        {"sds", "asce7-"},          {"earth_permanent", "asce7-"}, {"gamma_eq", "aashto-"},
        {"pile_kind", "en1997-"},   {"test_profiles", "en1997-"},  {"rigid_cap", "en1997-"},
        {"model_factor", "en1997-"}};
    for (const auto& owner : owners) {
      const std::string& key = owner.first;
      const std::string& prefix = owner.second;  // a plain reference: lambdas may capture it
      const Located k = n.child(key);
      if (!k.present()) continue;
      const bool read = std::any_of(names.begin(), names.end(), [&](const Located& c) {
        return c.is_scalar() && c.scalar().rfind(prefix, 0) == 0;
      });
      if (!read)
        ctx.error(ctx.at(k), fmt::format("{}: applies to the {}* generators only, and codes lists "
                                       "none of them",
                                       k.path, prefix));
    }
  }
  std::vector<CaseToCombine> cases;
  for (const auto& lc : load_cases) cases.push_back({lc.id, lc.kind, lc.direction});
  const auto seismic = std::find_if(load_cases.begin(), load_cases.end(),
                                    [](const LoadCase& lc) { return lc.kind == LoadKind::seismic; });
  const auto is_asce = [](const std::string& g) { return g.rfind("asce7-", 0) == 0; };
  std::vector<std::string> asce;
  for (const auto& name : names)
    if (name.is_scalar() && is_asce(name.scalar())) asce.push_back(name.scalar());
  const bool sds_missing = !asce.empty() && seismic != load_cases.end() && !settings.sds;
  if (sds_missing)
    ctx.error(ctx.at(n), fmt::format("{}.sds: missing; expected SDS (in g) for the vertical "
                                   "seismic effect Ev = 0.2·SDS·D of ASCE/SEI 7-16 §12.4.2.2, "
                                   "because load case '{}' is seismic (write generate: "
                                   "{{codes: [{}], sds: …}}; sds: 0 leaves Ev out)",
                                   n.path, seismic->id, list_of(asce)));
  for (const auto& name : names) {
    const std::string generator = name.is_scalar() ? name.scalar() : scalar_text(name);
    if (sds_missing && is_asce(generator)) continue;
    try {
      const auto generated = generate_combinations(generator, cases, settings);
      for (const auto& g : generated.combinations) {
        Combination combo;
        combo.id = g.id;
        combo.where = ctx.at(name);
        combo.limit_state = g.limit_state;
        combo.resistance_set = g.resistance_set;
        combo.generator = generator;
        for (const auto& [case_id, factor] : g.factors)
          if (auto found = case_index.find(case_id); found != case_index.end())
            combo.factors.emplace_back(found->second, factor);
        read.combinations.push_back(std::move(combo));
      }
      for (const auto& note : generated.notes)
        read.notes.push_back(generator + ": " + note);
    } catch (const std::invalid_argument& e) {
      ctx.error(ctx.at(name), fmt::format("combinations.generate: {}", e.what()));
    }
  }
}

}  // namespace

CombinationsRead read_combinations(const std::vector<NamedEntry>& entries, const Located& whole,
                                   ReadContext& ctx, const std::vector<LoadCase>& load_cases) {
  CombinationsRead read;
  if (!ctx.expect_map(whole)) return read;
  std::map<std::string, std::size_t> case_index;
  for (std::size_t i = 0; i < load_cases.size(); ++i) case_index[load_cases[i].id] = i;
  for (const auto& entry : entries) {
    if (entry.name == "generate") {
      generate_combinations_for(entry, ctx, load_cases, case_index, read);
      continue;
    }
    const Located& n = entry.value;
    Combination combo;
    combo.id = entry.name;
    combo.where = entry.key_where;
    if (!ctx.expect_map(n)) continue;
    ctx.check_keys(n, {"limit_state", "factors", "description"});
    if (auto ls = n.child("limit_state"); ls.present()) {
      if (auto v = ctx.choice<LimitState>(ls, {{"service", LimitState::service},
                                           {"strength", LimitState::strength},
                                           {"seismic-overstrength",
                                            LimitState::seismic_overstrength}}))
        combo.limit_state = *v;
    } else {
      ctx.error(ctx.at(n), fmt::format("{}.limit_state: missing; expected service, strength or seismic-overstrength",
                                     n.path));
    }
    const Located factors = n.child("factors");
    if (!factors.present() || !factors.is_map() || factors.size() == 0) {
      ctx.error(ctx.at(factors.present() ? factors : n),
                  fmt::format("{}: expected a map of load case to factor, e.g. {{D: 1.0, L: 1.0}}",
                              factors.path));
      continue;
    }
    for (const auto& e : factors.node->entries) {
      const std::string& name = e.key;
      const auto factor =
          ctx.number_at(factors, factors.entry(e), Quantity::number, Need::required, Sign::any);
      auto found = case_index.find(name);
      if (found == case_index.end()) {
        const std::string near = closest_match(name, keys_of(case_index));
        ctx.error(key_location(e, *factors.file),
                    fmt::format("{}.{}: load case '{}' does not exist{}", factors.path, name,
                                name,
                                near.empty() ? fmt::format(" (known: {})",
                                                           list_of(keys_of(case_index)))
                                             : fmt::format("; did you mean '{}'?", near)));
        continue;
      }
      if (factor) combo.factors.emplace_back(found->second, *factor);
    }
    read.combinations.push_back(std::move(combo));
  }
  if (read.combinations.empty())
    ctx.error(ctx.at(whole), "combinations: expected at least one combination");
  return read;
}

}  // namespace cairn
