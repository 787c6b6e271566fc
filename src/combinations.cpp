// combinations.cpp — code load combinations from load case kinds. The tables below are the
// published combinations as recalled (from memory) from ASCE/SEI 7-16 and EN 1990:2002; the
// rules and ids are explained in docs/methods-combinations.md.
#include "cairn/combinations.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <map>
#include <set>
#include <stdexcept>

namespace cairn {
namespace {

// Kind names as they appear in project files; kept here so that this module does not depend
// on model.cpp.
const char* kind_name(LoadKind kind) {
  switch (kind) {
    case LoadKind::dead: return "dead";
    case LoadKind::live: return "live";
    case LoadKind::roof_live: return "roof_live";
    case LoadKind::snow: return "snow";
    case LoadKind::rain: return "rain";
    case LoadKind::wind: return "wind";
    case LoadKind::seismic: return "seismic";
    case LoadKind::earth: return "earth";
    case LoadKind::fluid: return "fluid";
    case LoadKind::temperature: return "temperature";
    case LoadKind::other: return "other";
  }
  return "other";
}

bool is_directional(LoadKind kind) { return kind == LoadKind::wind || kind == LoadKind::seismic; }

// The load cases sorted into what the formulas name: per kind, the case ids in input order;
// for wind and seismic, the directions in order of first appearance.
struct Direction {
  std::string name;
  std::vector<std::string> ids;
};

struct SortedCases {
  std::map<LoadKind, std::vector<std::string>> by_kind;
  std::vector<Direction> wind;
  std::vector<Direction> seismic;

  bool has(LoadKind kind) const { return by_kind.count(kind) > 0; }
  const std::vector<std::string>& ids(LoadKind kind) const {
    static const std::vector<std::string> kNone;
    const auto it = by_kind.find(kind);
    return it == by_kind.end() ? kNone : it->second;
  }
};

SortedCases sort_cases(const std::vector<CaseToCombine>& cases) {
  SortedCases sorted;
  std::set<std::string> seen;
  for (const auto& c : cases) {
    if (c.id.empty()) throw std::invalid_argument("a load case has an empty id");
    if (!seen.insert(c.id).second) {
      throw std::invalid_argument("load case '" + c.id + "' is listed twice");
    }
    sorted.by_kind[c.kind].push_back(c.id);
    if (is_directional(c.kind)) {
      auto& directions = c.kind == LoadKind::wind ? sorted.wind : sorted.seismic;
      const std::string name = c.direction.empty() ? c.id : c.direction;
      const auto it = std::find_if(directions.begin(), directions.end(),
                                   [&](const Direction& d) { return d.name == name; });
      if (it == directions.end() || c.direction.empty()) {
        directions.push_back({name, {c.id}});
      } else {
        it->ids.push_back(c.id);
      }
    }
  }
  return sorted;
}

void require_kinds(std::string_view generator, const std::vector<CaseToCombine>& cases,
                   const std::vector<LoadKind>& accepted, const std::string& hint) {
  for (const auto& c : cases) {
    if (std::find(accepted.begin(), accepted.end(), c.kind) != accepted.end()) continue;
    std::string list;
    for (const LoadKind kind : accepted) list += (list.empty() ? "" : ", ") + std::string(kind_name(kind));
    throw std::invalid_argument("load case '" + c.id + "' has kind '" + kind_name(c.kind) +
                                "', which generator '" + std::string(generator) +
                                "' does not combine (it combines " + list + ")" + hint);
  }
}

// One term of a formula: factor × symbol, acting on the listed cases.
struct Term {
  double factor = 0.0;
  std::string symbol;  // "D", "L", "W(Wx+)", …
  std::vector<std::string> ids;
};

std::string format_factor(double factor) {
  char text[32];
  std::snprintf(text, sizeof text, "%.3f", factor);
  std::string s = text;
  while (s.size() > 1 && s.back() == '0' && s[s.size() - 2] != '.') s.pop_back();
  return s;
}

// Collects combinations, dropping empty ones and keeping ids unique.
class Builder {
 public:
  explicit Builder(LimitState limit_state) : limit_state_(limit_state) {}

  void add(const std::string& id, std::vector<Term> terms) {
    GeneratedCombination combination;
    combination.limit_state = limit_state_;
    for (const auto& term : terms) {
      if (term.ids.empty() || term.factor == 0.0) continue;
      if (!combination.description.empty()) combination.description += " + ";
      combination.description += format_factor(term.factor) + term.symbol;
      for (const auto& case_id : term.ids) combination.factors.emplace_back(case_id, term.factor);
    }
    if (combination.factors.empty()) return;
    // A direction named like another id part could repeat an id; number the repeats.
    combination.id = id;
    for (int n = 2; !ids_.insert(combination.id).second; ++n) combination.id = id + "#" + std::to_string(n);
    out_.push_back(std::move(combination));
  }

  std::vector<GeneratedCombination> take() { return std::move(out_); }

 private:
  LimitState limit_state_;
  std::set<std::string> ids_;
  std::vector<GeneratedCombination> out_;
};

// An identifier suffix "(a,b)" from the non-empty parts.
std::string choice(std::initializer_list<std::string> parts) {
  std::string inner;
  for (const auto& part : parts) {
    if (part.empty()) continue;
    inner += (inner.empty() ? "" : ",") + part;
  }
  return inner.empty() ? "" : "(" + inner + ")";
}

// ---- ASCE/SEI 7-16 ---------------------------------------------------------------------

// Roof live, snow or rain: the "(Lr or S or R)" alternative of ASCE 7-16 §2.3.1 and §2.4.1.
struct RoofAlternative {
  LoadKind kind;
  std::string symbol;
};

std::vector<RoofAlternative> roof_alternatives(const SortedCases& c) {
  std::vector<RoofAlternative> out;
  if (c.has(LoadKind::roof_live)) out.push_back({LoadKind::roof_live, "Lr"});
  if (c.has(LoadKind::snow)) out.push_back({LoadKind::snow, "S"});
  if (c.has(LoadKind::rain)) out.push_back({LoadKind::rain, "R"});
  return out;
}

const std::vector<LoadKind> kAsceKinds = {LoadKind::dead,  LoadKind::live,    LoadKind::roof_live,
                                          LoadKind::snow,  LoadKind::rain,    LoadKind::wind,
                                          LoadKind::seismic, LoadKind::earth, LoadKind::fluid};
const std::string kAsceHint =
    "; ASCE 7-16 §2.3.1/§2.4.1 give no basic combination for it — write that combination by hand";

std::vector<std::string> asce_notes(const SortedCases& c, bool strength) {
  std::vector<std::string> notes;
  notes.push_back(strength ? "ASCE/SEI 7-16 §2.3.1 combinations 1–5 and §2.3.6 combinations 6–7, "
                             "strength design; factors as recalled from the standard"
                           : "ASCE/SEI 7-16 §2.4.1 combinations 1–7 and §2.4.5 combinations 8–10, "
                             "allowable stress design; factors as recalled from the standard");
  if (strength && c.has(LoadKind::live)) {
    notes.push_back("live load factor 1.0 in combinations 3, 4 and 6 (the reduction to 0.5 "
                    "permitted for light occupancies is not taken)");
  }
  if (c.has(LoadKind::earth)) {
    notes.push_back(std::string("earth pressure H taken as adding to the other loads (factor ") +
                    (strength ? "1.6" : "1.0") +
                    " in every combination); where H resists, write that combination by hand");
  }
  if (c.has(LoadKind::fluid)) {
    notes.push_back("fluid load F takes the dead-load factor in every combination");
  }
  if (!c.seismic.empty()) {
    notes.push_back("E is the seismic load effect as given in each case (vertical effect Ev = "
                    "0.2·SDS·D not added by cairn)");
  }
  return notes;
}

// Permanent part: dead and fluid at the dead-load factor, earth at its adding factor.
std::vector<Term> permanent(const SortedCases& c, double dead_factor, double earth_factor) {
  return {{dead_factor, "D", c.ids(LoadKind::dead)},
          {dead_factor, "F", c.ids(LoadKind::fluid)},
          {earth_factor, "H", c.ids(LoadKind::earth)}};
}

std::vector<Term> with(std::vector<Term> terms, std::initializer_list<Term> more) {
  terms.insert(terms.end(), more.begin(), more.end());
  return terms;
}

Term directional(double factor, const char* symbol, const Direction& d) {
  return {factor, std::string(symbol) + "(" + d.name + ")", d.ids};
}

// ASCE/SEI 7-16 §2.4.1 and §2.4.5, allowable stress design (from memory):
//   1. D                         6. D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R)
//   2. D + L                     7. 0.6D + 0.6W
//   3. D + (Lr or S or R)        8. D + 0.7E
//   4. D + 0.75L + 0.75(Lr or S or R)   9. D + 0.525E + 0.75L + 0.75S
//   5. D + 0.6W                 10. 0.6D + 0.7E
// H (earth) at 1.0 and F (fluid) with D's factor in each.
std::vector<GeneratedCombination> asce_asd(const SortedCases& c) {
  Builder b(LimitState::service);
  const auto full = permanent(c, 1.0, 1.0);
  const auto reduced = permanent(c, 0.6, 1.0);
  const auto& live = c.ids(LoadKind::live);
  const auto roofs = roof_alternatives(c);
  b.add("ASD-1", full);
  if (!live.empty()) b.add("ASD-2", with(full, {{1.0, "L", live}}));
  for (const auto& r : roofs) b.add("ASD-3" + choice({r.symbol}), with(full, {{1.0, r.symbol, c.ids(r.kind)}}));
  if (!live.empty()) {
    for (const auto& r : roofs) {
      b.add("ASD-4" + choice({r.symbol}), with(full, {{0.75, "L", live}, {0.75, r.symbol, c.ids(r.kind)}}));
    }
  }
  for (const auto& w : c.wind) b.add("ASD-5" + choice({w.name}), with(full, {directional(0.6, "W", w)}));
  for (const auto& w : c.wind) {
    // Without L and (Lr or S or R), 6 reduces to D + 0.45W, which 5 already bounds.
    if (roofs.empty() && !live.empty()) {
      b.add("ASD-6" + choice({w.name}), with(full, {{0.75, "L", live}, directional(0.45, "W", w)}));
    }
    for (const auto& r : roofs) {
      b.add("ASD-6" + choice({w.name, r.symbol}),
            with(full, {{0.75, "L", live}, directional(0.45, "W", w), {0.75, r.symbol, c.ids(r.kind)}}));
    }
  }
  for (const auto& w : c.wind) b.add("ASD-7" + choice({w.name}), with(reduced, {directional(0.6, "W", w)}));
  for (const auto& e : c.seismic) b.add("ASD-8" + choice({e.name}), with(full, {directional(0.7, "E", e)}));
  // Without L and S, 9 reduces to D + 0.525E, which 8 already bounds.
  const bool live_or_snow = !live.empty() || c.has(LoadKind::snow);
  for (const auto& e : live_or_snow ? c.seismic : std::vector<Direction>{}) {
    b.add("ASD-9" + choice({e.name}), with(full, {directional(0.525, "E", e), {0.75, "L", live},
                                                  {0.75, "S", c.ids(LoadKind::snow)}}));
  }
  for (const auto& e : c.seismic) b.add("ASD-10" + choice({e.name}), with(reduced, {directional(0.7, "E", e)}));
  return b.take();
}

// ASCE/SEI 7-16 §2.3.1 and §2.3.6, strength design (from memory):
//   1. 1.4D
//   2. 1.2D + 1.6L + 0.5(Lr or S or R)
//   3. 1.2D + 1.6(Lr or S or R) + (L or 0.5W)
//   4. 1.2D + 1.0W + L + 0.5(Lr or S or R)
//   5. 0.9D + 1.0W
//   6. 1.2D + 1.0E + L + 0.2S
//   7. 0.9D + 1.0E
// H (earth) at 1.6 and F (fluid) with D's factor in each.
std::vector<GeneratedCombination> asce_lrfd(const SortedCases& c) {
  Builder b(LimitState::strength);
  const auto& live = c.ids(LoadKind::live);
  const auto roofs = roof_alternatives(c);
  b.add("LRFD-1", permanent(c, 1.4, 1.6));
  const auto d12 = permanent(c, 1.2, 1.6);
  const auto d09 = permanent(c, 0.9, 1.6);
  if (!live.empty()) {
    if (roofs.empty()) b.add("LRFD-2", with(d12, {{1.6, "L", live}}));
    for (const auto& r : roofs) {
      b.add("LRFD-2" + choice({r.symbol}), with(d12, {{1.6, "L", live}, {0.5, r.symbol, c.ids(r.kind)}}));
    }
  }
  for (const auto& r : roofs) {
    const Term roof{1.6, r.symbol, c.ids(r.kind)};
    if (live.empty() && c.wind.empty()) b.add("LRFD-3" + choice({r.symbol}), with(d12, {roof}));
    if (!live.empty()) b.add("LRFD-3" + choice({r.symbol, "L"}), with(d12, {roof, {1.0, "L", live}}));
    for (const auto& w : c.wind) {
      b.add("LRFD-3" + choice({r.symbol, w.name}), with(d12, {roof, directional(0.5, "W", w)}));
    }
  }
  for (const auto& w : c.wind) {
    if (roofs.empty()) b.add("LRFD-4" + choice({w.name}), with(d12, {directional(1.0, "W", w), {1.0, "L", live}}));
    for (const auto& r : roofs) {
      b.add("LRFD-4" + choice({w.name, r.symbol}),
            with(d12, {directional(1.0, "W", w), {1.0, "L", live}, {0.5, r.symbol, c.ids(r.kind)}}));
    }
  }
  for (const auto& w : c.wind) b.add("LRFD-5" + choice({w.name}), with(d09, {directional(1.0, "W", w)}));
  for (const auto& e : c.seismic) {
    b.add("LRFD-6" + choice({e.name}),
          with(d12, {directional(1.0, "E", e), {1.0, "L", live}, {0.2, "S", c.ids(LoadKind::snow)}}));
  }
  for (const auto& e : c.seismic) b.add("LRFD-7" + choice({e.name}), with(d09, {directional(1.0, "E", e)}));
  return b.take();
}

// ---- EN 1990:2002 ----------------------------------------------------------------------

// A variable action as EN 1990 sees it: all cases of a kind, or one wind direction.
struct VariableAction {
  LoadKind kind;
  std::string symbol;     // as printed in descriptions: "L", "Lr", "S", "T", "W(Wx+)"
  std::string name;       // as printed in ids: "L", "Lr", "S", "T", "W(Wx+)"
  double psi0 = 0.0;      // EN 1990 Table A1.1 (recommended values)
  std::vector<std::string> ids;
};

// ψ0, EN 1990:2002 Table A1.1 (from memory): imposed loads in buildings, categories A–D 0.7;
// category H roofs 0; snow, sites at altitude H ≤ 1000 m a.s.l. (outside Finland, Iceland,
// Norway, Sweden) 0.5; wind 0.6; temperature (non-fire) 0.6.
constexpr double kPsi0Imposed = 0.7;
constexpr double kPsi0Roof = 0.0;
constexpr double kPsi0Snow = 0.5;
constexpr double kPsi0Wind = 0.6;
constexpr double kPsi0Temperature = 0.6;
// EN 1990:2002 Table A1.2(B), STR/GEO set B (from memory): γG,sup = 1.35, γG,inf = 1.00,
// γQ = 1.50 (0 where favourable). The same values appear in EN 1997-1 Table A.3, set A1.
constexpr double kGammaGSup = 1.35;
constexpr double kGammaGInf = 1.0;
constexpr double kGammaQ = 1.5;

// γQ·ψ0 rounded to clean decimals (1.5 × 0.7 is 1.0499999… in binary).
double product(double a, double b) { return std::round(a * b * 1e9) / 1e9; }

const std::vector<LoadKind> kEnKinds = {LoadKind::dead, LoadKind::earth,    LoadKind::live,
                                        LoadKind::roof_live, LoadKind::snow, LoadKind::wind,
                                        LoadKind::temperature};
const std::string kEnHint =
    "; EN 1990 eq. 6.10 as generated here has no ψ factor or design situation for it (seismic: "
    "eq. 6.12b; accidental: 6.11b) — write that combination by hand";

std::vector<GeneratedCombination> en1990(const SortedCases& c, std::vector<std::string>& notes) {
  notes.push_back("EN 1990:2002 eq. 6.10 with Table A1.2(B) (γG = 1.35 unfavourable, 1.0 "
                  "favourable; γQ = 1.5) and characteristic combinations eq. 6.14b; values "
                  "recommended in the standard, as recalled — a national annex may change them");
  notes.push_back("ψ0 from EN 1990 Table A1.1: imposed loads categories A–D 0.7, roofs "
                  "(category H) 0, snow 0.5 (sites up to 1000 m), wind 0.6, temperature 0.6");
  notes.push_back("each leading action is also combined with favourable permanent actions "
                  "(γG = 1.0) and no accompanying actions");
  if (c.has(LoadKind::earth)) notes.push_back("earth pressure taken as a permanent action (γG)");
  if (c.has(LoadKind::roof_live)) {
    notes.push_back("roof imposed load leading: snow and wind are not combined with it "
                    "(EN 1991-1-1 §3.3.2)");
  }

  std::vector<std::string> permanent_ids = c.ids(LoadKind::dead);
  for (const auto& id : c.ids(LoadKind::earth)) permanent_ids.push_back(id);

  std::vector<VariableAction> actions;
  const auto add_kind = [&](LoadKind kind, const char* symbol, double psi0) {
    if (c.has(kind)) actions.push_back({kind, symbol, symbol, psi0, c.ids(kind)});
  };
  add_kind(LoadKind::live, "L", kPsi0Imposed);
  add_kind(LoadKind::roof_live, "Lr", kPsi0Roof);
  add_kind(LoadKind::snow, "S", kPsi0Snow);
  add_kind(LoadKind::temperature, "T", kPsi0Temperature);
  for (const auto& w : c.wind) {
    const std::string symbol = "W(" + w.name + ")";
    actions.push_back({LoadKind::wind, symbol, symbol, kPsi0Wind, w.ids});
  }

  Builder uls(LimitState::strength);
  Builder sls(LimitState::service);
  uls.add("EN-6.10-G", {{kGammaGSup, "G", permanent_ids}});
  sls.add("EN-6.14b-G", {{1.0, "G", permanent_ids}});

  for (const auto& lead : actions) {
    // Accompanying actions: every other non-wind action with ψ0 > 0, and one wind direction
    // at a time (none when wind leads). Roof imposed load excludes snow and wind.
    const bool roof_leads = lead.kind == LoadKind::roof_live;
    std::vector<const VariableAction*> others;
    for (const auto& a : actions) {
      if (&a == &lead || a.kind == LoadKind::wind || a.psi0 == 0.0) continue;
      if (roof_leads && a.kind == LoadKind::snow) continue;
      others.push_back(&a);
    }
    std::vector<const VariableAction*> winds{nullptr};  // nullptr: no accompanying wind
    if (lead.kind != LoadKind::wind && !roof_leads && !c.wind.empty()) {
      winds.clear();
      for (const auto& a : actions) {
        if (a.kind == LoadKind::wind) winds.push_back(&a);
      }
    }
    for (const VariableAction* wind : winds) {
      const std::string id = lead.name + (wind ? "+" + wind->name : "");
      std::vector<Term> ultimate{{kGammaGSup, "G", permanent_ids}, {kGammaQ, lead.symbol, lead.ids}};
      std::vector<Term> service{{1.0, "G", permanent_ids}, {1.0, lead.symbol, lead.ids}};
      auto accompanying = others;
      if (wind) accompanying.insert(accompanying.begin(), wind);
      for (const VariableAction* a : accompanying) {
        ultimate.push_back({product(kGammaQ, a->psi0), a->symbol, a->ids});
        service.push_back({a->psi0, a->symbol, a->ids});
      }
      uls.add("EN-6.10-" + id, std::move(ultimate));
      sls.add("EN-6.14b-" + id, std::move(service));
    }
    uls.add("EN-6.10-" + lead.name + "-inf",
            {{kGammaGInf, "G", permanent_ids}, {kGammaQ, lead.symbol, lead.ids}});
  }
  auto out = uls.take();
  auto service = sls.take();
  out.insert(out.end(), std::make_move_iterator(service.begin()), std::make_move_iterator(service.end()));
  return out;
}

}  // namespace

std::vector<std::string> generator_names() { return {"asce7-asd", "asce7-lrfd", "en1990-str-geo"}; }

GeneratedCombinations generate_combinations(std::string_view generator,
                                            const std::vector<CaseToCombine>& cases) {
  GeneratedCombinations out;
  if (generator == "asce7-asd" || generator == "asce7-lrfd") {
    require_kinds(generator, cases, kAsceKinds, kAsceHint);
    const SortedCases sorted = sort_cases(cases);
    const bool strength = generator == "asce7-lrfd";
    out.combinations = strength ? asce_lrfd(sorted) : asce_asd(sorted);
    out.notes = asce_notes(sorted, strength);
    return out;
  }
  if (generator == "en1990-str-geo") {
    require_kinds(generator, cases, kEnKinds, kEnHint);
    const SortedCases sorted = sort_cases(cases);
    out.combinations = en1990(sorted, out.notes);
    return out;
  }
  std::string valid;
  for (const auto& name : generator_names()) valid += (valid.empty() ? "" : ", ") + name;
  throw std::invalid_argument("unknown combination generator '" + std::string(generator) +
                              "' (valid: " + valid + ")");
}

}  // namespace cairn
