// combinations.cpp — code load combinations from load case kinds. The tables below are the
// published combinations as recalled (from memory) from ASCE/SEI 7-16 and EN 1990:2002; the
// rules and ids are explained in docs/methods-combinations.md.
#include "cairn/input/combinations.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <map>
#include <set>
#include <stdexcept>

#include <fmt/format.h>

namespace cairn {
namespace {

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
    for (const LoadKind kind : accepted)
      list += (list.empty() ? "" : ", ") + std::string(to_string(kind));
    throw std::invalid_argument("load case '" + c.id + "' has kind '" + to_string(c.kind) +
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
// Two terms on one case (D and its vertical seismic effect 0.2·SDS·D) add into one factor.
class Builder {
 public:
  explicit Builder(LimitState limit_state, ResistanceSet resistance_set = ResistanceSet::basis)
      : limit_state_(limit_state), resistance_set_(resistance_set) {}

  void add(const std::string& id, std::vector<Term> terms) {
    GeneratedCombination combination;
    combination.limit_state = limit_state_;
    combination.resistance_set = resistance_set_;
    for (const auto& term : terms) {
      if (term.ids.empty() || term.factor == 0.0) continue;
      if (!combination.description.empty()) combination.description += term.factor < 0 ? " − " : " + ";
      else if (term.factor < 0) combination.description += "−";
      combination.description += format_factor(std::abs(term.factor)) + term.symbol;
      for (const auto& case_id : term.ids) {
        auto same = std::find_if(combination.factors.begin(), combination.factors.end(),
                                 [&](const auto& f) { return f.first == case_id; });
        if (same == combination.factors.end()) combination.factors.emplace_back(case_id, term.factor);
        else same->second = std::round((same->second + term.factor) * 1e9) / 1e9;
      }
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
  ResistanceSet resistance_set_;
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

// A product of factors rounded to clean decimals (1.5 × 0.7 is 1.0499999… in binary).
double product(double a, double b) { return std::round(a * b * 1e9) / 1e9; }

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

const std::vector<LoadKind> kAsceKinds = {
    LoadKind::dead,  LoadKind::live,  LoadKind::roof_live,      LoadKind::snow,
    LoadKind::rain,  LoadKind::wind,  LoadKind::seismic,        LoadKind::earth,
    LoadKind::fluid, LoadKind::wearing_surface, LoadKind::vertical_earth};
const std::string kAsceHint =
    "; ASCE 7-16 §2.3.1/§2.4.1 give no basic combination for it — write that combination by hand";

// Dead load D: the dead cases, and the AASHTO kinds that are self-weight (wearing surfaces,
// the weight of soil), which ASCE 7 and EN 1990 count as dead/permanent load.
std::vector<std::string> dead_ids(const SortedCases& c) {
  std::vector<std::string> ids = c.ids(LoadKind::dead);
  for (const LoadKind kind : {LoadKind::wearing_surface, LoadKind::vertical_earth})
    for (const auto& id : c.ids(kind)) ids.push_back(id);
  return ids;
}

// ASCE/SEI 7-16 §2.3.1 / §2.4.1 (and §2.3.6 / §2.4.5) on earth pressure H (from memory):
// where H adds to the primary variable load, factor 1.6 (strength) / 1.0 (allowable stress);
// where it resists, 0.9 / 0.6 if H is permanent, else 0.
constexpr double kEarthAddsStrength = 1.6;
constexpr double kEarthAddsAllowable = 1.0;
constexpr double kEarthResistsStrength = 0.9;
constexpr double kEarthResistsAllowable = 0.6;
// ASCE/SEI 7-16 §12.4.2.2 (from memory): vertical seismic load effect Ev = 0.2·SDS·D.
constexpr double kVerticalSeismicCoefficient = 0.2;

// One pass over a set of ASCE combinations: D's cases, SDS, and H's factor in this pass.
struct AscePass {
  const SortedCases& c;
  std::vector<std::string> dead;
  double sds = 0.0;
  double earth = 0.0;
  std::string suffix;  // "" when H adds, "-Hr" when it resists
};

std::vector<std::string> asce_notes(const SortedCases& c, bool strength,
                                    const CombinationSettings& settings) {
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
    const double adds = strength ? kEarthAddsStrength : kEarthAddsAllowable;
    const double resists = !settings.earth_permanent ? 0.0
                           : strength                ? kEarthResistsStrength
                                                     : kEarthResistsAllowable;
    notes.push_back(fmt::format(
        "earth pressure H at {:g} where it adds (every combination) and again at {:g} where it "
        "resists (the same combination with '-Hr' after its id; H taken as {}), ASCE/SEI 7-16 "
        "§{}",
        adds, resists, settings.earth_permanent ? "permanent" : "not permanent",
        strength ? "2.3.1 and §2.3.6" : "2.4.1 and §2.4.5"));
  }
  if (c.has(LoadKind::fluid)) {
    notes.push_back("fluid load F takes the dead-load factor in every combination (without Ev)");
  }
  if (c.has(LoadKind::wearing_surface) || c.has(LoadKind::vertical_earth)) {
    notes.push_back("wearing surfaces and the weight of soil (kinds wearing_surface, "
                    "vertical_earth) are dead load D");
  }
  if (!c.seismic.empty()) {
    const double sds = settings.sds.value_or(0.0);
    notes.push_back(
        sds > 0
            ? fmt::format("E is the horizontal seismic load effect Eh as given in each case; the "
                          "vertical effect Ev = 0.2·SDS·D = {:g}·D (SDS = {:g}, ASCE/SEI 7-16 "
                          "§12.4.2.2) adds to D in {} and relieves it in {}",
                          kVerticalSeismicCoefficient * sds, sds, strength ? "combination 6" : "combinations 8 and 9",
                          strength ? "combination 7 (uplift)" : "combination 10 (uplift)")
            : "E is the seismic load effect as given in each case; SDS = 0 given, so the vertical "
              "effect Ev = 0.2·SDS·D is not added");
  }
  return notes;
}

// Permanent part: D and F at the dead-load factor, H at this pass's factor.
std::vector<Term> permanent(const AscePass& p, double dead_factor) {
  return {{dead_factor, "D", p.dead},
          {dead_factor, "F", p.c.ids(LoadKind::fluid)},
          {p.earth, "H", p.c.ids(LoadKind::earth)}};
}

// The vertical seismic effect at `seismic_factor` × Ev, adding (sign +1) or relieving (−1):
// ±seismic_factor·0.2·SDS on every dead case.
Term vertical_seismic(const AscePass& p, double seismic_factor, double sign) {
  return {sign * product(seismic_factor, kVerticalSeismicCoefficient * p.sds), "D(Ev)", p.dead};
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
//   3. D + (Lr or S or R)        8. D + 0.7Ev + 0.7Eh
//   4. D + 0.75L + 0.75(Lr or S or R)   9. D + 0.525Ev + 0.525Eh + 0.75L + 0.75S
//   5. D + 0.6W                 10. 0.6D − 0.7Ev + 0.7Eh
// F (fluid) with D's factor in each; H per pass.
void asce_asd(Builder& b, const AscePass& p) {
  const SortedCases& c = p.c;
  const auto full = permanent(p, 1.0);
  const auto reduced = permanent(p, 0.6);
  const auto& live = c.ids(LoadKind::live);
  const auto roofs = roof_alternatives(c);
  const std::string& s = p.suffix;
  b.add("ASD-1" + s, full);
  if (!live.empty()) b.add("ASD-2" + s, with(full, {{1.0, "L", live}}));
  for (const auto& r : roofs) b.add("ASD-3" + choice({r.symbol}) + s, with(full, {{1.0, r.symbol, c.ids(r.kind)}}));
  if (!live.empty()) {
    for (const auto& r : roofs) {
      b.add("ASD-4" + choice({r.symbol}) + s, with(full, {{0.75, "L", live}, {0.75, r.symbol, c.ids(r.kind)}}));
    }
  }
  for (const auto& w : c.wind) b.add("ASD-5" + choice({w.name}) + s, with(full, {directional(0.6, "W", w)}));
  for (const auto& w : c.wind) {
    // Without L and (Lr or S or R), 6 reduces to D + 0.45W, which 5 already bounds.
    if (roofs.empty() && !live.empty()) {
      b.add("ASD-6" + choice({w.name}) + s, with(full, {{0.75, "L", live}, directional(0.45, "W", w)}));
    }
    for (const auto& r : roofs) {
      b.add("ASD-6" + choice({w.name, r.symbol}) + s,
            with(full, {{0.75, "L", live}, directional(0.45, "W", w), {0.75, r.symbol, c.ids(r.kind)}}));
    }
  }
  for (const auto& w : c.wind) b.add("ASD-7" + choice({w.name}) + s, with(reduced, {directional(0.6, "W", w)}));
  for (const auto& e : c.seismic) {
    b.add("ASD-8" + choice({e.name}) + s,
          with(full, {vertical_seismic(p, 0.7, +1), directional(0.7, "E", e)}));
  }
  // Without L and S, 9 reduces to D + 0.525(Ev + Eh), which 8 already bounds.
  const bool live_or_snow = !live.empty() || c.has(LoadKind::snow);
  for (const auto& e : live_or_snow ? c.seismic : std::vector<Direction>{}) {
    b.add("ASD-9" + choice({e.name}) + s,
          with(full, {vertical_seismic(p, 0.525, +1), directional(0.525, "E", e),
                      {0.75, "L", live}, {0.75, "S", c.ids(LoadKind::snow)}}));
  }
  for (const auto& e : c.seismic) {
    b.add("ASD-10" + choice({e.name}) + s,
          with(reduced, {vertical_seismic(p, 0.7, -1), directional(0.7, "E", e)}));
  }
}

// ASCE/SEI 7-16 §2.3.1 and §2.3.6, strength design (from memory):
//   1. 1.4D
//   2. 1.2D + 1.6L + 0.5(Lr or S or R)
//   3. 1.2D + 1.6(Lr or S or R) + (L or 0.5W)
//   4. 1.2D + 1.0W + L + 0.5(Lr or S or R)
//   5. 0.9D + 1.0W
//   6. 1.2D + Ev + Eh + L + 0.2S
//   7. 0.9D − Ev + Eh
// F (fluid) with D's factor in each; H per pass.
void asce_lrfd(Builder& b, const AscePass& p) {
  const SortedCases& c = p.c;
  const auto& live = c.ids(LoadKind::live);
  const auto roofs = roof_alternatives(c);
  const std::string& s = p.suffix;
  b.add("LRFD-1" + s, permanent(p, 1.4));
  const auto d12 = permanent(p, 1.2);
  const auto d09 = permanent(p, 0.9);
  if (!live.empty()) {
    if (roofs.empty()) b.add("LRFD-2" + s, with(d12, {{1.6, "L", live}}));
    for (const auto& r : roofs) {
      b.add("LRFD-2" + choice({r.symbol}) + s, with(d12, {{1.6, "L", live}, {0.5, r.symbol, c.ids(r.kind)}}));
    }
  }
  for (const auto& r : roofs) {
    const Term roof{1.6, r.symbol, c.ids(r.kind)};
    if (live.empty() && c.wind.empty()) b.add("LRFD-3" + choice({r.symbol}) + s, with(d12, {roof}));
    if (!live.empty()) b.add("LRFD-3" + choice({r.symbol, "L"}) + s, with(d12, {roof, {1.0, "L", live}}));
    for (const auto& w : c.wind) {
      b.add("LRFD-3" + choice({r.symbol, w.name}) + s, with(d12, {roof, directional(0.5, "W", w)}));
    }
  }
  for (const auto& w : c.wind) {
    if (roofs.empty()) b.add("LRFD-4" + choice({w.name}) + s, with(d12, {directional(1.0, "W", w), {1.0, "L", live}}));
    for (const auto& r : roofs) {
      b.add("LRFD-4" + choice({w.name, r.symbol}) + s,
            with(d12, {directional(1.0, "W", w), {1.0, "L", live}, {0.5, r.symbol, c.ids(r.kind)}}));
    }
  }
  for (const auto& w : c.wind) b.add("LRFD-5" + choice({w.name}) + s, with(d09, {directional(1.0, "W", w)}));
  for (const auto& e : c.seismic) {
    b.add("LRFD-6" + choice({e.name}) + s,
          with(d12, {vertical_seismic(p, 1.0, +1), directional(1.0, "E", e), {1.0, "L", live},
                     {0.2, "S", c.ids(LoadKind::snow)}}));
  }
  for (const auto& e : c.seismic) {
    b.add("LRFD-7" + choice({e.name}) + s,
          with(d09, {vertical_seismic(p, 1.0, -1), directional(1.0, "E", e)}));
  }
}

// Both passes of one ASCE method: H adding, then (when there is H) H resisting.
std::vector<GeneratedCombination> asce(const SortedCases& c, bool strength,
                                       const CombinationSettings& settings) {
  Builder b(strength ? LimitState::strength : LimitState::service);
  AscePass pass{c, dead_ids(c), settings.sds.value_or(0.0),
                strength ? kEarthAddsStrength : kEarthAddsAllowable, ""};
  strength ? asce_lrfd(b, pass) : asce_asd(b, pass);
  if (c.has(LoadKind::earth)) {
    pass.earth = !settings.earth_permanent ? 0.0
                 : strength                ? kEarthResistsStrength
                                           : kEarthResistsAllowable;
    pass.suffix = "-Hr";
    strength ? asce_lrfd(b, pass) : asce_asd(b, pass);
  }
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


const std::vector<LoadKind> kEnKinds = {
    LoadKind::dead, LoadKind::earth, LoadKind::live,        LoadKind::roof_live,
    LoadKind::snow, LoadKind::wind,  LoadKind::temperature, LoadKind::wearing_surface,
    LoadKind::vertical_earth};
const std::string kEnHint =
    "; EN 1990 eq. 6.10 as generated here has no ψ factor or design situation for it (seismic: "
    "eq. 6.12b; accidental: 6.11b) — write that combination by hand";

// One set of partial factors on actions and what the combinations it builds are called and
// checked with: EN 1990 set B / EN 1997-1 set A1 (γG 1.35 / 1.0, γQ 1.5) or EN 1997-1 set A2
// (γG 1.0 / 1.0, γQ 1.3).
struct ActionSet {
  double gamma_g_sup = kGammaGSup;
  double gamma_g_inf = kGammaGInf;
  double gamma_q = kGammaQ;
  std::string prefix;  // "EN-6.10", "DA1-C1", …
  ResistanceSet resistance_set = ResistanceSet::basis;
  bool service = true;  // also the characteristic combinations eq. 6.14b
  // Earth pressure's own γG (unfavourable and favourable) when it differs from the other
  // permanent actions: design approach 3 takes geotechnical actions at A2 (γG = 1.0).
  std::optional<double> gamma_earth;
};

// EN 1997-1:2004 Table A.4, set A2 (from memory): γG = 1.0 unfavourable and favourable,
// γQ = 1.3 unfavourable (0 favourable).
constexpr double kGammaGA2 = 1.0;
constexpr double kGammaQA2 = 1.3;

std::vector<GeneratedCombination> en1990(const SortedCases& c, const ActionSet& set,
                                         std::vector<std::string>& notes) {
  notes.push_back("ψ0 from EN 1990 Table A1.1: imposed loads categories A–D 0.7, roofs "
                  "(category H) 0, snow 0.5 (sites up to 1000 m), wind 0.6, temperature 0.6");
  notes.push_back(fmt::format("each leading action is also combined with favourable permanent "
                              "actions (γG = {:g}) and no accompanying actions",
                              set.gamma_g_inf));
  if (c.has(LoadKind::earth)) notes.push_back("earth pressure taken as a permanent action (γG)");
  if (c.has(LoadKind::roof_live)) {
    notes.push_back("roof imposed load leading: snow and wind are not combined with it "
                    "(EN 1991-1-1 §3.3.2)");
  }

  if (c.has(LoadKind::wearing_surface) || c.has(LoadKind::vertical_earth))
    notes.push_back("wearing surfaces and the weight of soil (kinds wearing_surface, "
                    "vertical_earth) taken as permanent actions (γG)");
  std::vector<std::string> permanent_ids = dead_ids(c);
  if (!set.gamma_earth)
    for (const auto& id : c.ids(LoadKind::earth)) permanent_ids.push_back(id);
  // Geotechnical permanent actions at their own factor (design approach 3), else none.
  const Term earth{set.gamma_earth.value_or(0.0), "H", set.gamma_earth ? c.ids(LoadKind::earth)
                                                                       : std::vector<std::string>{}};

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

  Builder uls(LimitState::strength, set.resistance_set);
  Builder sls(LimitState::service);
  const std::string& prefix = set.prefix;
  uls.add(prefix + "-G", {{set.gamma_g_sup, "G", permanent_ids}, earth});
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
      std::vector<Term> ultimate{{set.gamma_g_sup, "G", permanent_ids}, earth,
                                 {set.gamma_q, lead.symbol, lead.ids}};
      std::vector<Term> service{{1.0, "G", permanent_ids}, {1.0, lead.symbol, lead.ids}};
      auto accompanying = others;
      if (wind) accompanying.insert(accompanying.begin(), wind);
      for (const VariableAction* a : accompanying) {
        ultimate.push_back({product(set.gamma_q, a->psi0), a->symbol, a->ids});
        service.push_back({a->psi0, a->symbol, a->ids});
      }
      uls.add(prefix + "-" + id, std::move(ultimate));
      sls.add("EN-6.14b-" + id, std::move(service));
    }
    // With γG,inf = γG,sup (set A2) and nothing accompanying, '-inf' would repeat the above.
    const bool alone = others.empty() && winds.size() == 1 && winds.front() == nullptr;
    if (!(alone && set.gamma_g_inf == set.gamma_g_sup))
      uls.add(prefix + "-" + lead.name + "-inf",
              {{set.gamma_g_inf, "G", permanent_ids}, earth, {set.gamma_q, lead.symbol, lead.ids}});
  }
  auto out = uls.take();
  if (!set.service) return out;
  auto service = sls.take();
  out.insert(out.end(), std::make_move_iterator(service.begin()), std::make_move_iterator(service.end()));
  return out;
}

// ---- AASHTO LRFD -----------------------------------------------------------------------

// AASHTO LRFD Bridge Design Specifications, 7th ed. (2014), Table 3.4.1-2 (from memory):
// load factors for permanent loads γp, maximum / minimum.
struct PermanentFactor {
  LoadKind kind;
  const char* symbol;
  double max, min;
};
const std::vector<PermanentFactor> kAashtoPermanent = {
    {LoadKind::dead, "DC", 1.25, 0.90},             // components and attachments
    {LoadKind::wearing_surface, "DW", 1.50, 0.65},  // wearing surfaces and utilities
    {LoadKind::earth, "EH", 1.50, 0.90},            // horizontal earth pressure, active
    {LoadKind::vertical_earth, "EV", 1.35, 1.00},   // vertical earth, retaining walls and abutments
};

// AASHTO LRFD 7th ed. (2014) Table 3.4.1-1 (from memory), the columns cairn's kinds map to:
// LL (live, with IM, BR, CE, PL, LS), WA (fluid: water load and stream pressure), WS (wind on
// the structure), TU (temperature; the smaller value, for force effects), EQ (seismic),
// CT/CV (collision). A negative value marks "not in this combination"; γEQ comes from the
// settings.
struct AashtoRow {
  const char* id;
  LimitState limit_state;
  ResistanceSet resistance_set;
  double live, fluid, wind, temperature;
  bool permanent_range;  // γp max and min (Service I: 1.0)
};
constexpr double kNone = -1.0;
constexpr double kGammaEqMarker = -2.0;  // live factor is γEQ
const std::vector<AashtoRow> kAashtoRows = {
    {"STR-I", LimitState::strength, ResistanceSet::basis, 1.75, 1.0, kNone, 0.5, true},
    {"STR-III", LimitState::strength, ResistanceSet::basis, kNone, 1.0, 1.4, 0.5, true},
    {"STR-V", LimitState::strength, ResistanceSet::basis, 1.35, 1.0, 0.4, 0.5, true},
    {"SER-I", LimitState::service, ResistanceSet::basis, 1.0, 1.0, 0.3, 1.0, false},
    {"EXT-I", LimitState::strength, ResistanceSet::aashto_extreme, kGammaEqMarker, 1.0, kNone,
     kNone, true},
    {"EXT-II", LimitState::strength, ResistanceSet::aashto_extreme, 0.5, 1.0, kNone, kNone, true},
};

const std::vector<LoadKind> kAashtoKinds = {
    LoadKind::dead, LoadKind::wearing_surface, LoadKind::earth,     LoadKind::vertical_earth,
    LoadKind::live, LoadKind::fluid,           LoadKind::wind,      LoadKind::seismic,
    LoadKind::temperature, LoadKind::collision};
const std::string kAashtoHint =
    "; AASHTO LRFD Table 3.4.1-1 as generated here has no column for it (a building's roof, snow "
    "and rain loads belong to ASCE 7) — write that combination by hand";

std::vector<std::string> aashto_notes(const SortedCases& c, const CombinationSettings& settings) {
  std::vector<std::string> notes;
  notes.push_back("AASHTO LRFD Bridge Design Specifications, 7th edition (2014), Tables 3.4.1-1 "
                  "and 3.4.1-2, as recalled from the standard; later editions changed the wind "
                  "factors together with the wind speeds (WS 1.0 in Strength III, Strength V and "
                  "Service I, each with its own wind speed)");
  notes.push_back("every combination with all permanent loads at their maximum γp ('-max') and "
                  "again at their minimum ('-min'): DC 1.25/0.90, DW 1.50/0.65, EH (active) "
                  "1.50/0.90, EV (retaining walls and abutments) 1.35/1.00; mixes of maximum and "
                  "minimum across permanent loads are not generated");
  notes.push_back("kinds taken as AASHTO loads: dead = DC, wearing_surface = DW, earth = EH, "
                  "vertical_earth = EV, live = LL (with IM, BR, CE, PL, LS), fluid = WA, wind = "
                  "WS, temperature = TU (factor 0.5 strength, 1.0 service: force effects), "
                  "seismic = EQ, collision = CT/CV; WL, FR, SE, TG and IC are not generated");
  if (!c.seismic.empty())
    notes.push_back(fmt::format("Extreme Event I: live load at γEQ = {:g} (project-specific; "
                                "AASHTO LRFD C3.4.1)",
                                settings.gamma_eq));
  if (!c.seismic.empty() || c.has(LoadKind::collision))
    notes.push_back("Extreme Event combinations are checked with the extreme-event resistance "
                    "factors φ = 1.0 in compression and lateral, 0.80 in uplift (AASHTO LRFD "
                    "§10.5.5.3.3, from memory) on the ultimate capacities");
  return notes;
}

std::vector<GeneratedCombination> aashto(const SortedCases& c, const CombinationSettings& settings) {
  std::vector<GeneratedCombination> out;
  std::set<std::string> taken;
  const auto& live = c.ids(LoadKind::live);
  // The event a row stands for: a wind direction, a seismic direction, a collision case, or
  // nothing (Strength I, and Service I without wind).
  struct Event {
    std::string name;
    std::string symbol;
    std::vector<std::string> ids;
  };
  for (const AashtoRow& row : kAashtoRows) {
    const std::string id(row.id);
    std::vector<Event> events;
    if (row.wind > 0) {
      for (const auto& w : c.wind) events.push_back({w.name, "WS(" + w.name + ")", w.ids});
      if (events.empty() && id != "SER-I") continue;  // Strength III and V are wind combinations
      if (events.empty()) events.push_back({});
    } else if (id == "EXT-I") {
      for (const auto& e : c.seismic) events.push_back({e.name, "EQ(" + e.name + ")", e.ids});
    } else if (id == "EXT-II") {
      for (const auto& x : c.ids(LoadKind::collision)) events.push_back({x, "CT/CV(" + x + ")", {x}});
    } else {
      events.push_back({});
    }
    const double live_factor = row.live == kGammaEqMarker ? settings.gamma_eq : row.live;
    for (const Event& event : events) {
      for (const bool maximum : row.permanent_range ? std::vector<bool>{true, false}
                                                    : std::vector<bool>{true}) {
        std::vector<Term> terms;
        for (const auto& p : kAashtoPermanent) {
          const double factor = !row.permanent_range ? 1.0 : maximum ? p.max : p.min;
          terms.push_back({factor, p.symbol, c.ids(p.kind)});
        }
        if (live_factor > 0) terms.push_back({live_factor, "LL", live});
        terms.push_back({row.fluid, "WA", c.ids(LoadKind::fluid)});
        if (row.temperature > 0) terms.push_back({row.temperature, "TU", c.ids(LoadKind::temperature)});
        if (!event.ids.empty()) {
          const double factor = row.wind > 0 ? row.wind : 1.0;
          terms.push_back({factor, event.symbol, event.ids});
        }
        Builder b(row.limit_state, row.resistance_set);
        const std::string range = row.permanent_range ? (maximum ? "-max" : "-min") : "";
        b.add(id + range + choice({event.name}), std::move(terms));
        for (auto& g : b.take()) {
          for (int n = 2; !taken.insert(g.id).second; ++n) g.id = id + range + "#" + std::to_string(n);
          out.push_back(std::move(g));
        }
      }
    }
  }
  return out;
}

}  // namespace

std::vector<std::string> generator_names() {
  return {"asce7-asd",  "asce7-lrfd", "en1990-str-geo",
          "en1997-da1", "en1997-da2", "en1997-da3", "aashto-lrfd"};
}

GeneratedCombinations generate_combinations(std::string_view generator,
                                            const std::vector<CaseToCombine>& cases,
                                            const CombinationSettings& settings) {
  GeneratedCombinations out;
  if (generator == "asce7-asd" || generator == "asce7-lrfd") {
    require_kinds(generator, cases, kAsceKinds, kAsceHint);
    const SortedCases sorted = sort_cases(cases);
    if (!sorted.seismic.empty() && !settings.sds) {
      throw std::invalid_argument(
          "load case '" + sorted.seismic.front().ids.front() +
          "' is seismic: generator '" + std::string(generator) +
          "' needs SDS for the vertical seismic effect Ev = 0.2·SDS·D (ASCE/SEI 7-16 "
          "§12.4.2.2); write generate: {codes: [...], sds: ...} (sds: 0 leaves Ev out)");
    }
    const bool strength = generator == "asce7-lrfd";
    out.combinations = asce(sorted, strength, settings);
    out.notes = asce_notes(sorted, strength, settings);
    return out;
  }
  if (generator == "en1990-str-geo") {
    require_kinds(generator, cases, kEnKinds, kEnHint);
    const SortedCases sorted = sort_cases(cases);
    out.notes.push_back("EN 1990:2002 eq. 6.10 with Table A1.2(B) (γG = 1.35 unfavourable, 1.0 "
                        "favourable; γQ = 1.5) and characteristic combinations eq. 6.14b; values "
                        "recommended in the standard, as recalled — a national annex may change "
                        "them");
    out.combinations = en1990(sorted, ActionSet{kGammaGSup, kGammaGInf, kGammaQ, "EN-6.10",
                                                ResistanceSet::basis, true, std::nullopt},
                              out.notes);
    return out;
  }
  if (generator == "en1997-da1" || generator == "en1997-da2") {
    require_kinds(generator, cases, kEnKinds, kEnHint);
    const SortedCases sorted = sort_cases(cases);
    const bool da1 = generator == "en1997-da1";
    out.notes.push_back(
        da1 ? "EN 1997-1:2004 §2.4.7.3.4.2 design approach 1 for piles: combination 1 (DA1-C1) "
              "A1 + M1 + R1, combination 2 (DA1-C2) A2 + M1 + R4; EN 1990 eq. 6.10 with the "
              "action factors of EN 1997-1 Tables A.3 (A1: γG = 1.35 unfavourable, 1.0 "
              "favourable, γQ = 1.5) and A.4 (A2: γG = 1.0, γQ = 1.3); values recommended in the "
              "standards, as recalled — a national annex may change them"
            : "EN 1997-1:2004 §2.4.7.3.4.3 design approach 2 for piles (DA2): A1 + M1 + R2; "
              "EN 1990 eq. 6.10 with the action factors of EN 1997-1 Table A.3 (γG = 1.35 "
              "unfavourable, 1.0 favourable, γQ = 1.5); values recommended in the standards, as "
              "recalled — a national annex may change them");
    out.notes.push_back("variable actions are left out where they are favourable (γQ = 0)");
    std::vector<std::string> ignored;  // the ψ0 and favourable notes, once
    if (da1) {
      out.combinations = en1990(sorted, ActionSet{kGammaGSup, kGammaGInf, kGammaQ, "DA1-C1",
                                                  ResistanceSet::en1997_r1, false, std::nullopt},
                                out.notes);
      auto second = en1990(sorted, ActionSet{kGammaGA2, kGammaGA2, kGammaQA2, "DA1-C2",
                                             ResistanceSet::en1997_r4, false, std::nullopt},
                           ignored);
      out.combinations.insert(out.combinations.end(), std::make_move_iterator(second.begin()),
                              std::make_move_iterator(second.end()));
    } else {
      out.combinations = en1990(sorted, ActionSet{kGammaGSup, kGammaGInf, kGammaQ, "DA2",
                                                  ResistanceSet::en1997_r2, false, std::nullopt},
                                out.notes);
    }
    return out;
  }
  if (generator == "en1997-da3") {
    require_kinds(generator, cases, kEnKinds, kEnHint);
    const SortedCases sorted = sort_cases(cases);
    out.notes.push_back(
        "EN 1997-1:2004 §2.4.7.3.4.4 design approach 3 for piles (DA3): A1 on structural actions "
        "(γG = 1.35 unfavourable, 1.0 favourable, γQ = 1.5, Table A.3) and A2 on geotechnical "
        "actions (earth pressure γG = 1.0, Table A.4) + M2 + R3; values recommended in the "
        "standards, as recalled — a national annex may change them");
    out.notes.push_back("variable actions are left out where they are favourable (γQ = 0)");
    ActionSet set{kGammaGSup, kGammaGInf, kGammaQ, "DA3", ResistanceSet::en1997_r3, false,
                  kGammaGA2};
    out.combinations = en1990(sorted, set, out.notes);
    return out;
  }
  if (generator == "aashto-lrfd") {
    require_kinds(generator, cases, kAashtoKinds, kAashtoHint);
    const SortedCases sorted = sort_cases(cases);
    out.combinations = aashto(sorted, settings);
    out.notes = aashto_notes(sorted, settings);
    return out;
  }
  std::string valid;
  for (const auto& name : generator_names()) valid += (valid.empty() ? "" : ", ") + name;
  throw std::invalid_argument("unknown combination generator '" + std::string(generator) +
                              "' (valid: " + valid + ")");
}

}  // namespace cairn
