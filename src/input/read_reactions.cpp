// The `loads_from:` section (sections.hpp): column reactions from a CSV file
// (reactions_csv.hpp) added to the load cases, or imported as already-factored
// combinations.
#include "cairn/input/sections.hpp"

#include <filesystem>
#include <fstream>
#include <map>
#include <set>
#include <sstream>

#include <fmt/format.h>

#include "cairn/input/reactions_csv.hpp"

namespace cairn {
namespace {

namespace fs = std::filesystem;
using Need = ReadContext::Need;
using Sign = ReadContext::Sign;

// The limit state of an imported combination: the one given for all, else the entry with
// its exact name, else every matching pattern (which must agree).
template <typename Rules>
std::optional<LimitState> limit_state_of(const ReactionRow& row,
                                         const std::optional<LimitState>& for_all,
                                         const Rules& rules, const Located& ls,
                                         ReadContext& ctx) {
  if (for_all) return for_all;
  for (const auto& r : rules)
    if (r.pattern == row.load_case) return r.state;
  std::optional<LimitState> state;
  std::string first;
  for (const auto& r : rules) {
    if (!matches_pattern(r.pattern, row.load_case)) continue;
    if (state && *state != r.state) {
      ctx.error(row.where, fmt::format("row {}: combination '{}' matches '{}' ({}) and '{}' "
                                         "({}) in {}; make the patterns exclusive or name the "
                                         "combination",
                                         row.where.line, row.load_case, first,
                                         to_string(*state), r.pattern, to_string(r.state),
                                         ls.path));
      return std::nullopt;
    }
    if (!state) first = r.pattern;
    state = r.state;
  }
  if (!state) {
    std::vector<std::string> patterns;
    for (const auto& r : rules) patterns.push_back(r.pattern);
    ctx.error(row.where, fmt::format("row {}: combination '{}' matches nothing in {} ({}); "
                                       "add its name or a pattern with its limit state",
                                       row.where.line, row.load_case, ls.path,
                                       list_of(patterns)));
  }
  return state;
}

// `loads_from.combinations`: each case of the CSV is an already-factored combination. It
// becomes a load case holding the reactions (factor 1) and a combination of that case plus
// the load cases typed in the file (the cap's self-weight among them), each with the factor
// the engineer gives for the combination's limit state. No factor is assumed.
template <typename LoadOf>
void import_combinations(const Located& n, const std::vector<ReactionRow>& rows,
                         const LoadOf& load_of, ReadContext& ctx, ReactionsRead& out) {
  if (!ctx.expect_map(n)) return;
  ctx.check_keys(n, {"limit_state", "factors"});
  const std::map<std::string, LimitState> states = {
      {"service", LimitState::service},
      {"strength", LimitState::strength},
      {"seismic-overstrength", LimitState::seismic_overstrength}};
  struct Rule {
    std::string pattern;
    LimitState state;
  };
  std::vector<Rule> rules;  // exact names and patterns, in the file's order
  std::optional<LimitState> for_all;
  const Located ls = n.child("limit_state");
  if (!ls.present()) {
    ctx.error(ctx.at(n), fmt::format("{}.limit_state: missing; expected service, strength or "
                                   "seismic-overstrength for every imported combination, or a "
                                   "map of combination name or pattern to limit state, e.g. "
                                   "{{\"ULS*\": strength, \"SLS*\": service}}",
                                   n.path));
    return;
  }
  if (ls.is_map()) {
    for (const auto& e : ls.node->entries) {
      if (auto v = ctx.choice<LimitState>(ls.entry(e), states)) rules.push_back({e.key, *v});
    }
  } else if (auto v = ctx.choice<LimitState>(ls, states)) {
    for_all = *v;
  } else {
    return;
  }
  constexpr std::size_t kNone = static_cast<std::size_t>(-1);  // a combination not built
  const std::size_t typed = out.load_cases.size();  // cases typed in the YAML
  std::map<std::string, std::size_t> typed_index, combination_of;
  for (std::size_t i = 0; i < typed; ++i) typed_index[out.load_cases[i].id] = i;
  std::set<std::string> existing;
  for (const auto& c : out.combinations) existing.insert(c.id);
  std::set<LimitState> occurring;
  for (const auto& row : rows) {
    auto found = combination_of.find(row.load_case);
    if (found == combination_of.end()) {
      combination_of[row.load_case] = kNone;
      if (typed_index.count(row.load_case) || existing.count(row.load_case)) {
        ctx.error(row.where,
                    fmt::format("row {}: combination '{}' has the name of a {} typed in the "
                                "file; with loads_from.combinations the CSV's cases are "
                                "combinations, so the names must differ",
                                row.where.line, row.load_case,
                                typed_index.count(row.load_case) ? "load case" : "combination"));
        continue;
      }
      const auto state = limit_state_of(row, for_all, rules, ls, ctx);
      if (!state) continue;
      LoadCase lc;
      lc.id = row.load_case;
      lc.where = row.where;
      lc.kind = LoadKind::other;
      out.load_cases.push_back(lc);
      Combination combo;
      combo.id = row.load_case;
      combo.where = row.where;
      combo.limit_state = *state;
      combo.factors.emplace_back(out.load_cases.size() - 1, 1.0);
      combination_of[row.load_case] = out.combinations.size();
      out.combinations.push_back(combo);
      occurring.insert(*state);
      found = combination_of.find(row.load_case);
    }
    if (found->second == kNone) continue;
    const std::size_t own_case = out.combinations[found->second].factors.front().first;
    out.load_cases[own_case].loads.push_back(load_of(row));
  }

  // The factors of the typed cases, per limit state that occurs.
  const Located factors = n.child("factors");
  if (factors.present() && !ctx.expect_map(factors)) return;
  if (factors.present()) ctx.check_keys(factors, keys_of(states));
  std::vector<std::string> typed_names;
  for (std::size_t i = 0; i < typed; ++i) typed_names.push_back(out.load_cases[i].id);
  std::vector<std::string> imported, added_text;
  for (const auto& [id, index] : combination_of)
    if (index != kNone) imported.push_back(id);
  for (const auto& [name, state] : states) {
    const Located given = factors.present() ? factors.child(name) : Located{};
    if (!occurring.count(state)) {
      if (given.present())
        ctx.warn(ctx.at(given), fmt::format("{}: no imported combination is a {} combination; "
                                            "these factors are not used",
                                            given.path, name));
      continue;
    }
    if (typed == 0) continue;
    if (!given.present()) {
      std::string example;
      for (const auto& id : typed_names) example += (example.empty() ? "" : ", ") + id + ": …";
      ctx.error(ctx.at(factors.present() ? factors : n),
                  fmt::format("{}.factors.{}: missing; the imported {} combinations need a "
                              "factor for each load case typed in the file, e.g. {}: {{{}}}; "
                              "write 0 to leave a case out",
                              n.path, name, name, name, example));
      continue;
    }
    if (!ctx.expect_map(given)) continue;
    ctx.check_keys(given, typed_names);
    std::vector<std::pair<std::size_t, double>> added;
    std::string text;
    for (std::size_t i = 0; i < typed; ++i) {
      const auto f = ctx.number(given, typed_names[i], Quantity::number, Need::required,
                            Sign::non_negative);
      if (f && *f != 0.0) added.emplace_back(i, *f);
      if (f) text += fmt::format("{}{:g}·{}", text.empty() ? "" : " + ", *f, typed_names[i]);
    }
    added_text.push_back(fmt::format("{} combination: {}", name, text));
    for (auto& combo : out.combinations) {
      auto own = combination_of.find(combo.id);
      if (combo.limit_state == state && own != combination_of.end() && own->second != kNone)
        combo.factors.insert(combo.factors.end(), added.begin(), added.end());
    }
  }
  if (imported.empty()) return;
  std::string note = fmt::format("{} imported from {} as already factored (reactions at 1.0)",
                                 list_of(imported), rows.front().where.file);
  for (const auto& t : added_text) note += "; added to each " + t;
  out.notes.push_back(note + ".");
}

}  // namespace

// Column reactions exported from the structural model (the file is read by
// reactions_csv.hpp): one row per support and load case, or — with `combinations` — per
// support and already-factored combination.
ReactionsRead read_reactions(const Located& n, ReadContext& ctx,
                             const std::vector<Column>& columns,
                             std::vector<LoadCase> typed_cases,
                             std::vector<Combination> typed_combinations) {
  ReactionsRead out{"", std::move(typed_cases), std::move(typed_combinations), {}};
  if (!ctx.expect_map(n)) return out;
  ctx.check_keys(n, {"file", "sign", "units", "headers", "delimiter", "decimal", "combinations"});
  const auto file = ctx.text(n, "file");
  const auto sign = ctx.text(n, "sign");
  if (!file || !sign) return out;
  double factor = 1.0;
  if (*sign == "reaction") factor = -1.0;
  else if (*sign != "load") {
    ctx.error(ctx.at(n.child("sign")), fmt::format("loads_from.sign: expected 'reaction' (the CSV "
                                                 "holds support reactions) or 'load' (forces on "
                                                 "the foundation), got '{}'",
                                                 *sign));
    return out;
  }
  ReactionsLayout layout;
  layout.units = ctx.units_of(n);
  if (auto u = ctx.text(n, "units", Need::optional)) {
    if (*u == "SI") layout.units = UnitSystem::SI;
    else if (*u == "US") layout.units = UnitSystem::US;
    else
      ctx.error(ctx.at(n.child("units")),
                  fmt::format("loads_from.units: expected 'SI' or 'US', got '{}'", *u));
  }
  if (auto d = ctx.text(n, "delimiter", Need::optional)) {
    if (*d == "," || *d == ";") layout.delimiter = d->front();
    else if (*d == "tab" || *d == "\t") layout.delimiter = '\t';
    else
      ctx.error(ctx.at(n.child("delimiter")),
                  fmt::format("loads_from.delimiter: expected ',', ';' or tab, got '{}'", *d));
  }
  if (auto d = ctx.text(n, "decimal", Need::optional)) {
    if (*d == "." || *d == ",") layout.decimal = d->front();
    else
      ctx.error(ctx.at(n.child("decimal")),
                  fmt::format("loads_from.decimal: expected '.' or ',', got '{}'", *d));
    if (layout.decimal == ',' && layout.delimiter == ',')
      ctx.error(ctx.at(n.child("decimal")),
                  "loads_from.decimal: a decimal comma needs another delimiter; set "
                  "loads_from.delimiter: ';'");
  }
  if (const Located headers = n.child("headers"); headers.present() && ctx.expect_map(headers)) {
    ctx.check_keys(headers, {kReactionColumns.begin(), kReactionColumns.end()});
    for (const char* ours : kReactionColumns)
      if (auto theirs = ctx.text(headers, ours, Need::optional)) layout.headers[ours] = *theirs;
  }
  if (columns.empty()) {
    ctx.error(ctx.at(n), "loads_from: needs columns: [{id, at, support}] to place the reactions");
    return out;
  }
  const std::string path = (fs::path(*n.file).parent_path() / *file).lexically_normal().string();
  out.loads_file = path;
  std::ifstream in(path, std::ios::binary);
  if (!in) {
    ctx.error(ctx.at(n.child("file")), fmt::format("loads_from.file: cannot open '{}'", path));
    return out;
  }
  std::stringstream content;
  content << in.rdbuf();
  Diagnostics& diag = ctx.diagnostics();
  const std::size_t problems_before = diag.list().size();
  const auto rows = read_reactions_csv(content.str(), path, layout, diag);
  const bool file_read = diag.list().size() == problems_before;

  std::map<std::string, std::size_t> column_of;
  for (std::size_t i = 0; i < columns.size(); ++i)
    column_of[columns[i].support] = i;
  const Located combinations = n.child("combinations");
  const char* what = combinations.present() ? "combination" : "load case";
  std::vector<ReactionRow> mapped;  // rows of this cap's supports
  std::set<std::string> seen_supports;
  std::map<std::pair<std::string, std::string>, int> seen_rows;  // (support, case) → row
  for (const auto& row : rows) {
    if (!column_of.count(row.support)) continue;  // another cap's support
    seen_supports.insert(row.support);
    auto [earlier, fresh] = seen_rows.emplace(std::make_pair(row.support, row.load_case),
                                              row.where.line);
    if (!fresh) {
      ctx.error(row.where,
                  fmt::format("row {}: support '{}' and {} '{}' were already given in "
                              "row {}; expected one row per support and {}",
                              row.where.line, row.support, what, row.load_case,
                              earlier->second, what));
      continue;
    }
    mapped.push_back(row);
  }
  auto load_of = [&](const ReactionRow& row) {
    const Column& column = columns[column_of[row.support]];
    PointLoad load;
    load.where = row.where;
    load.at = column.at;
    load.on_top = column.on_top;
    load.note = "column " + column.id;
    for (std::size_t c = 0; c < 6; ++c) load.load[c] = factor * row.values[c];
    return load;
  };
  if (combinations.present()) {
    import_combinations(combinations, mapped, load_of, ctx, out);
  } else {
    std::map<std::string, std::size_t> case_of;
    for (std::size_t i = 0; i < out.load_cases.size(); ++i)
      case_of[out.load_cases[i].id] = i;
    for (const auto& row : mapped) {
      auto lc = case_of.find(row.load_case);
      if (lc == case_of.end()) {
        ctx.error(row.where,
                    fmt::format("row {}: load case '{}' is not listed under load_cases; add it "
                                "with its kind (e.g. {}: {{kind: dead}}), or import the file's "
                                "cases as combinations (loads_from.combinations)",
                                row.where.line, row.load_case, row.load_case));
        continue;
      }
      out.load_cases[lc->second].loads.push_back(load_of(row));
    }
  }
  if (!file_read) return out;  // a support in a row with a problem is not missing
  for (const auto& column : columns)
    if (!column.support.empty() && !seen_supports.count(column.support))
      ctx.error(column.where, fmt::format("columns: support '{}' of column '{}' does not "
                                            "appear in '{}'",
                                            column.support, column.id, path));
  return out;
}

}  // namespace cairn
