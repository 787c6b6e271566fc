#include "cairn/checks/checks.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <limits>
#include <map>
#include <set>

#include <fmt/format.h>

#include "cairn/core/enum_names.hpp"
#include "cairn/core/quantity_format.hpp"
#include "cairn/geotechnics/code_resistance.hpp"
#include "cairn/geotechnics/lateral.hpp"
#include "cairn/geotechnics/section_moment.hpp"
#include "check_fold.hpp"

namespace cairn {
namespace {

constexpr double kInfinity = std::numeric_limits<double>::infinity();
// Forces below this are taken as zero (kN): round-off of the solve, far below any capacity.
constexpr double kForceTolerance = 1e-6;

// Fills missing values of `into` from `from`.
void fill(std::optional<double>& into, std::optional<double> from) {
  if (!into && from) into = from;
}

}  // namespace

// Names in the order the enum declares its values (enum_names.hpp).
constexpr const char* kDemandNames[] = {"none", "compression", "tension", "lateral", "structural"};
const char* to_string(Demand d) { return name_in(kDemandNames, d); }

constexpr const char* kPileStateNames[] = {"in contact", "dropped out", "overturned"};
const char* to_string(PileState s) { return name_in(kPileStateNames, s); }

constexpr const char* kVerdictNames[] = {"pass", "fail", "overturned"};
const char* to_string(Verdict v) { return name_in(kVerdictNames, v); }

Verdict verdict(const CombinationCheck& check) {
  if (check.solution.overturns) return Verdict::overturned;
  return check.pass ? Verdict::pass : Verdict::fail;
}

std::vector<PileTypeResistance> resolve_resistances(
    const Project& project, const std::vector<std::optional<ComputedResistance>>& computed) {
  std::vector<PileTypeResistance> result(project.pile_types.size());
  for (std::size_t t = 0; t < project.pile_types.size(); ++t) {
    const PileType& type = project.pile_types[t];
    PileTypeResistance& r = result[t];
    auto take_given = [](Resistance& into, const CapacitySet& set, const char* source) {
      into.compression = set.compression;
      into.tension = set.tension;
      into.lateral = set.lateral;
      into.source = source;
    };
    for (const CapacitySet& set : type.capacities) {
      switch (set.basis) {
        case CapacityBasis::allowable:
          take_given(r.allowable, set, "allowable values given");
          break;
        case CapacityBasis::factored:
          take_given(r.factored, set, "factored resistances given");
          break;
        case CapacityBasis::ultimate: break;  // below, so that given bases win
      }
    }
    for (const CapacitySet& set : type.capacities) {
      if (set.basis != CapacityBasis::ultimate) continue;
      const double fs = set.factor_of_safety.value_or(kDefaultSafetyCompression);
      const double fs_t = set.factor_of_safety_tension.value_or(kDefaultSafetyTension);
      auto divide = [](std::optional<double> v, double f) -> std::optional<double> {
        return v ? std::optional<double>(*v / f) : std::nullopt;
      };
      auto times = [](std::optional<double> v, std::optional<double> f) -> std::optional<double> {
        return v && f ? std::optional<double>(*v * *f) : std::nullopt;
      };
      const bool any_allowable = r.allowable.compression || r.allowable.tension;
      fill(r.allowable.compression, divide(set.compression, fs));
      fill(r.allowable.tension, divide(set.tension, fs_t));
      fill(r.allowable.lateral, divide(set.lateral, fs));
      if (!any_allowable)
        r.allowable.source = fmt::format("ultimate given ÷ factor of safety {:g} (tension {:g})",
                                         fs, fs_t);
      const bool any_factored = r.factored.compression || r.factored.tension;
      fill(r.factored.compression, times(set.compression, set.resistance_factor));
      fill(r.factored.tension, times(set.tension, set.resistance_factor_tension));
      fill(r.factored.lateral, times(set.lateral, set.resistance_factor));
      if (!any_factored && set.resistance_factor)
        r.factored.source = fmt::format("ultimate given × resistance factor {:g}",
                                        *set.resistance_factor);
    }
    // A timber section (bending strength only) has no axial capacity here.
    if (type.structure && (type.structure->concrete_strength || type.structure->steel_yield)) {
      // Po = 0.85·f'c·(Ag − As) + fy·As (ACI 318-19 eq. 22.4.2.2), or fy·A for steel.
      const Structure& st = *type.structure;
      double nominal = 0.0;
      if (st.concrete_strength) {
        ConcreteSection section{type.section.area(), st.steel_area.value_or(0.0),
                                *st.concrete_strength, st.steel_yield.value_or(0.0)};
        nominal = concrete_nominal_axial_strength(section);
      } else {
        // A pipe or hollow square: the wall's area unless steel_area is given.
        const double area = st.wall_thickness && *st.wall_thickness < 0.5 * type.section.width
                                ? section_area(type.section.shape, type.section.width,
                                               *st.wall_thickness)
                                : type.section.area();
        nominal = *st.steel_yield * st.steel_area.value_or(area);
      }
      if (st.allowable_factor) {
        r.allowable.structural_axial = *st.allowable_factor * nominal;
        if (st.yield_moment) r.allowable.structural_moment = *st.allowable_factor * *st.yield_moment;
      }
      if (st.resistance_factor) {
        r.factored.structural_axial = *st.resistance_factor * nominal;
        if (st.yield_moment) r.factored.structural_moment = *st.resistance_factor * *st.yield_moment;
      }
    }
    if (t < computed.size() && computed[t]) {
      const ComputedResistance& c = *computed[t];
      const bool had_lateral = r.allowable.lateral.has_value();
      const bool had_factored_lateral = r.factored.lateral.has_value();
      fill(r.allowable.lateral, c.allowable_lateral);
      fill(r.factored.lateral, c.factored_lateral);
      const bool had_allowable = r.allowable.compression.has_value() || !c.allowable_compression;
      const bool had_factored = r.factored.compression.has_value() || !c.factored_compression;
      fill(r.allowable.compression, c.allowable_compression);
      fill(r.factored.compression, c.factored_compression);
      // A compression-only pile drops out of the cap before it takes tension: the uplift
      // computed from the soil is not used (said in the assumptions).
      if (type.tension) {
        fill(r.allowable.tension, c.allowable_tension);
        fill(r.factored.tension, c.factored_tension);
      }
      if (!had_allowable) r.allowable.source = "computed from the soil: " + c.method;
      if (!had_factored) r.factored.source = "computed from the soil: " + c.method;
      auto add = [](std::string& source, const std::string& text) {
        source += (source.empty() ? "" : "; ") + text;
      };
      if (!had_lateral && c.allowable_lateral) add(r.allowable.source, "lateral by " + c.lateral_method);
      if (!had_factored_lateral && c.factored_lateral)
        add(r.factored.source, "lateral by " + c.lateral_method);
      r.aashto_phi = !had_factored && c.aashto_phi;
    }
    // Code resistance sets (EN 1997 R1–R4, AASHTO extreme event): code_resistance.hpp.
    for (const Combination& combo : project.combinations) {
      if (combo.resistance_set == ResistanceSet::basis || r.by_set.count(combo.resistance_set))
        continue;
      const auto none = std::optional<ComputedResistance>{};
      r.by_set[combo.resistance_set] = code_set_resistance(
          project, t, combo.resistance_set, t < computed.size() ? computed[t] : none, r.factored);
    }
  }
  return result;
}

std::vector<Diagnostic> missing_resistances(const Project& project,
                                            const std::vector<PileTypeResistance>& resistances) {
  std::vector<Diagnostic> problems;
  std::set<std::size_t> used;
  for (const Pile& pile : project.piles) used.insert(pile.type);
  // Combinations checked with a code's resistance set (EN 1997, AASHTO extreme event): one
  // problem per set and pile type, at the first combination it concerns.
  std::set<std::pair<ResistanceSet, std::size_t>> reported;
  // The others: one problem per limit state and pile type, at the first combination it
  // concerns and naming the others: a missing capacity is reported once, not once per
  // combination.
  std::map<LimitState, std::vector<const Combination*>> by_state;
  for (const Combination& combo : project.combinations) {
    if (combo.resistance_set == ResistanceSet::basis) {
      by_state[combo.limit_state].push_back(&combo);
      continue;
    }
    for (std::size_t t : used) {
      const auto it = resistances[t].by_set.find(combo.resistance_set);
      if (it != resistances[t].by_set.end() && it->second.compression) continue;
      if (!reported.insert({combo.resistance_set, t}).second) continue;
      problems.push_back(
          {combo.where,
           combo.resistance_set == ResistanceSet::en1997_r3
               ? fmt::format("combinations.{}: a combination of design approach 3 (EN 1997 R3), "
                             "but pile type '{}' has no capacity computed from the soil with "
                             "the soil's strength factored (set M2): give tip_method and "
                             "shaft_method that work from friction_angle and "
                             "undrained_strength (not the SPT methods), with friction angles "
                             "that stay within the method's range after M2",
                             combo.id, project.pile_types[t].id)
               : fmt::format("combinations.{}: a combination checked with {} resistances, but "
                             "pile type '{}' has no ultimate compression capacity to derive "
                             "them from; give capacity with basis: ultimate (taken as "
                             "characteristic), or tip_method and shaft_method with a soil "
                             "profile",
                             combo.id, to_string(combo.resistance_set),
                             project.pile_types[t].id)});
    }
  }
  for (const auto& [state, combos] : by_state) {
    const bool service = state == LimitState::service;
    for (std::size_t t : used) {
      const Resistance& r = service ? resistances[t].allowable : resistances[t].factored;
      if (r.compression) continue;
      constexpr std::size_t kNamed = 3;
      std::string names = combos.front()->id;
      for (std::size_t i = 1; i < std::min(combos.size(), kNamed); ++i) names += ", " + combos[i]->id;
      if (combos.size() > kNamed) names += fmt::format(" and {} more", combos.size() - kNamed);
      const std::string what =
          combos.size() == 1 ? fmt::format("a {} combination is", to_string(state))
                             : fmt::format("{} {} combinations are", combos.size(), to_string(state));
      problems.push_back(
          {combos.front()->where,
           fmt::format("combinations.{}: {} compared with {} capacities, but "
                       "pile type '{}' has no {} compression capacity; give capacity with "
                       "basis: {}{}",
                       names, what, service ? "allowable" : "factored", project.pile_types[t].id,
                       service ? "allowable" : "factored", service ? "allowable" : "factored",
                       service ? " (or basis: ultimate, divided by a factor of safety)"
                               : " (or basis: ultimate with resistance_factor)")});
    }
  }
  return problems;
}

// The fold's arrays (check_fold.hpp), the capacities of each basis met so far, and the
// combination's forces gathered for the pass.
struct CheckAccumulator::Fold {
  detail::FoldState state;
  // Per basis (limit state or code resistance set): every pile's capacities, and whether
  // all its piles can be folded as arrays (no structural check, no moment along the pile).
  std::map<std::pair<int, int>, std::size_t> basis_index;
  std::vector<detail::PileCapacities> capacities;
  std::vector<char> arrays;
  std::vector<double> axial, lateral, utilization;
  std::vector<double> governing;  // Demand, as a number
  bool row_by_row = false;

  // A pile's envelope and governing checks from the arrays, for the results.
  static Extreme extreme(double value, std::int64_t at) {
    return at < 0 ? Extreme{} : Extreme{value, static_cast<std::size_t>(at)};
  }
  PileEnvelope envelope(std::size_t i) const {
    PileEnvelope e;
    e.max_compression = extreme(state.compression[i], state.compression_at[i]);
    e.max_tension = extreme(state.tension[i], state.tension_at[i]);
    e.max_lateral = extreme(state.lateral[i], state.lateral_at[i]);
    e.max_utilization = extreme(state.utilization[i], state.utilization_at[i]);
    e.governing = static_cast<Demand>(static_cast<int>(state.governing[i]));
    e.pass = state.failed[i] == 0;
    return e;
  }
  PileGoverning governing_checks(std::size_t i) const {
    PileGoverning g;
    for (std::size_t k = 0; k < 4; ++k) {
      g[k].utilization = extreme(state.check_value[k][i], state.check_at[k][i]);
      g[k].demand = state.check_demand[k][i];
    }
    return g;
  }
};

namespace {

// The capacities a pile is checked against in a combination.
const Resistance& resistance_for(const std::vector<PileTypeResistance>& resistances,
                                 std::size_t type, const Combination& combo) {
  return combo.resistance_set != ResistanceSet::basis
             ? resistances[type].by_set.at(combo.resistance_set)
         : combo.limit_state == LimitState::service ? resistances[type].allowable
                                                     : resistances[type].factored;
}

}  // namespace

CheckAccumulator::CheckAccumulator(const Project& project,
                                   const std::vector<PileTypeResistance>& resistances,
                                   const std::vector<double>& head_moment_per_shear,
                                   bool keep_pile_rows,
                                   const std::vector<std::optional<MomentInfluence>>& moment_influence)
    : project_(project),
      resistances_(resistances),
      head_moment_per_shear_(head_moment_per_shear),
      moment_influence_(moment_influence),
      fold_(std::make_unique<Fold>()) {
  results_.pile_rows = keep_pile_rows;
  results_.combinations.reserve(project.combinations.size());
  const std::size_t n = project.piles.size();
  fold_->state.resize(n);
  fold_->axial.resize(n);
  fold_->lateral.resize(n);
  fold_->utilization.resize(n);
  fold_->governing.resize(n);
}

CheckAccumulator::~CheckAccumulator() = default;

void CheckAccumulator::fold_row_by_row(bool on) { fold_->row_by_row = on; }

void CheckAccumulator::add(std::size_t c, CapSolution solution) {
  add_checked(c, std::move(solution), nullptr);
}

void CheckAccumulator::add(std::size_t c, CapSolution solution,
                           const std::vector<MomentPeak>& along) {
  add_checked(c, std::move(solution), &along);
}

void CheckAccumulator::add_checked(std::size_t c, CapSolution solution,
                                   const std::vector<MomentPeak>* along) {
  CombinationCheck check;
  check.combination = c;
  check.solution = std::move(solution);
  // A nonlinear run's moments along the piles (`along`) are the row-by-row code's.
  if (check.solution.overturns || fold_->row_by_row || along || !add_arrays(c, check))
    add_rows(c, check, along);
  finish_combination(std::move(check));
}

// The combination's verdict into the summary; its rows dropped unless they are kept.
void CheckAccumulator::finish_combination(CombinationCheck check) {
  CheckResults& results = results_;
  CheckSummary& summary = results.summary;
  const std::size_t c = check.combination;
  if (check.solution.overturns) {
    check.pass = false;
    summary.overturned.push_back(c);
  }
  if (!check.pass) ++summary.failed_combinations;
  // An overturned combination has no pile forces to speak of: it fails on its own line
  // and does not name a governing pile.
  if (!check.solution.overturns &&
      (!summary.combination || check.max_utilization > summary.max_utilization)) {
    summary.max_utilization = check.max_utilization;
    summary.combination = c;
    summary.pile = check.governing_pile;
    summary.check = check.governing;
  }
  if (!results.pile_rows) {
    // Only what a summary needs: the verdict, its governing pile, the movement.
    std::vector<PileCheck>().swap(check.piles);
    std::vector<PileForce>().swap(check.solution.piles);
  }
  results.combinations.push_back(std::move(check));
}

// The combination folded in one pass over arrays (check_fold.hpp), then the pile rows (full
// detail), the combination's governing pile and its sums pile by pile, in pile order as the
// row-by-row code does. false, with nothing done, when some pile needs the row-by-row code.
std::size_t CheckAccumulator::basis_of(std::size_t c) {
  Fold& fold = *fold_;
  const Project& project = project_;
  const Combination& combo = project.combinations[c];
  const std::pair<int, int> basis{
      static_cast<int>(combo.resistance_set),
      combo.resistance_set != ResistanceSet::basis ? 0
      : combo.limit_state == LimitState::service   ? 1
                                                    : 2};
  auto found = fold.basis_index.find(basis);
  if (found == fold.basis_index.end()) {
    detail::PileCapacities caps;
    bool arrays = true;
    auto positive = [](const std::optional<double>& v) { return v && *v > 0 ? *v : 0.0; };
    for (const Pile& pile : project.piles) {
      const Resistance& r = resistance_for(resistances_, pile.type, combo);
      caps.compression.push_back(positive(r.compression));
      caps.tension.push_back(positive(r.tension));
      caps.lateral.push_back(positive(r.lateral));
      if ((r.structural_axial && *r.structural_axial > 0) ||
          (pile.type < moment_influence_.size() && moment_influence_[pile.type]))
        arrays = false;
    }
    fold.capacities.push_back(std::move(caps));
    fold.arrays.push_back(arrays ? 1 : 0);
    found = fold.basis_index.emplace(basis, fold.capacities.size() - 1).first;
  }
  return found->second;
}

bool CheckAccumulator::needs_rows(std::size_t c) {
  return results_.pile_rows || fold_->row_by_row || !fold_->arrays[basis_of(c)];
}

void CheckAccumulator::add(std::size_t c, CapSolution solution, const double* axial,
                           const double* lateral) {
  if (solution.overturns || needs_rows(c) || !axial) {
    add_checked(c, std::move(solution), nullptr);
    return;
  }
  CombinationCheck check;
  check.combination = c;
  check.solution = std::move(solution);
  fold_arrays(c, check, axial, lateral);
  finish_combination(std::move(check));
}

bool CheckAccumulator::add_arrays(std::size_t c, CombinationCheck& check) {
  Fold& fold = *fold_;
  const std::size_t n = project_.piles.size();
  if (!fold.arrays[basis_of(c)]) return false;
  const std::vector<PileForce>& forces = check.solution.piles;
  for (std::size_t i = 0; i < n; ++i) {
    fold.axial[i] = forces[i].axial;
    fold.lateral[i] = forces[i].lateral;
  }
  fold_arrays(c, check, fold.axial.data(), fold.lateral.data());
  return true;
}

void CheckAccumulator::fold_arrays(std::size_t c, CombinationCheck& check,
                                   const double* axial, const double* lateral) {
  Fold& fold = *fold_;
  const Project& project = project_;
  const std::size_t n = project.piles.size();
  const bool failed =
      detail::fold_piles(n, axial, lateral, fold.capacities[basis_of(c)], kForceTolerance,
                         static_cast<std::int64_t>(c), fold.state, fold.utilization.data(),
                         fold.governing.data());
  check.pass = !failed;
  const double* u = fold.utilization.data();
  for (std::size_t i = 0; i < n; ++i) {
    // Sums in pile order, as the row-by-row code adds them (adding 0 changes no bit).
    const double a = axial[i];
    check.total_compression += a > 0 ? a : 0.0;
    check.total_tension -= a > 0 ? 0.0 : a;
    if (i == 0 || u[i] > check.max_utilization) {
      check.max_utilization = u[i];
      check.governing_pile = i;
      check.governing = static_cast<Demand>(static_cast<int>(fold.governing[i]));
    }
  }
  if (results_.pile_rows) {
    const std::vector<PileForce>& forces = check.solution.piles;
    check.piles.resize(n);
    for (std::size_t i = 0; i < n; ++i) {
      PileCheck& p = check.piles[i];
      const Pile& pile = project.piles[i];
      p.axial = forces[i].axial;
      p.lateral = forces[i].lateral;
      p.active = forces[i].active;
      p.state = forces[i].active ? PileState::in_contact : PileState::dropped_out;
      if (pile.type < head_moment_per_shear_.size()) {
        p.head_moment = p.lateral * head_moment_per_shear_[pile.type];
        p.max_moment = p.head_moment;
      }
      p.utilization = u[i];
      p.governing = static_cast<Demand>(static_cast<int>(fold.governing[i]));
      p.pass = p.utilization <= 1.0;
    }
  }
}

// Pile by pile: every case, and the reference for the pass over arrays.
void CheckAccumulator::add_rows(std::size_t c, CombinationCheck& check,
                                const std::vector<MomentPeak>* along) {
  const Project& project = project_;
  const auto& resistances = resistances_;
  const auto& head_moment_per_shear = head_moment_per_shear_;
  CheckResults& results = results_;
  Fold& fold = *fold_;
  const std::size_t n = project.piles.size();
  const Combination& combo = project.combinations[c];
  // Pile rows are kept for full detail only; otherwise each pile's row is built in `row`,
  // folded into the envelope and the summary, and dropped.
  if (results.pile_rows) check.piles.resize(n);
  PileCheck row;
  const bool overturns = check.solution.overturns;
  for (std::size_t i = 0; i < n; ++i) {
    if (!results.pile_rows) row = PileCheck{};
    PileCheck& p = results.pile_rows ? check.piles[i] : row;
    // The pile's envelope and governing checks, in place in the fold's arrays (a value of 0
    // with combination −1 while none is named).
    detail::FoldState& e = fold.state;
    if (overturns) {
      // No equilibrium: the solver's forces mean nothing, and no pile can be shown safe.
      p.active = check.solution.piles[i].active;
      p.state = PileState::overturned;
      p.pass = false;
      e.failed[i] = 1;
      continue;
    }
    const PileForce& force = check.solution.piles[i];
    const Pile& pile = project.piles[i];
    const Resistance& r = resistance_for(resistances, pile.type, combo);
    p.axial = force.axial;
    p.lateral = force.lateral;
    p.active = force.active;
    p.state = force.active ? PileState::in_contact : PileState::dropped_out;
    // The governing combination of one check: the first of its largest utilization.
    auto govern = [&](Demand kind, double u, double demand) {
      const std::size_t k = static_cast<std::size_t>(kind) - 1;
      double& value = e.check_value[k][i];
      std::int64_t& at = e.check_at[k][i];
      if (u > 0.0 && (at < 0 || u > value)) {
        value = u;
        at = static_cast<std::int64_t>(c);
        e.check_demand[k][i] = demand;
      }
    };
    auto consider = [&](double demand, std::optional<double> capacity, Demand kind) {
      if (demand <= kForceTolerance) return;
      const double u = capacity && *capacity > 0 ? demand / *capacity : kInfinity;
      govern(kind, u, demand);
      if (u > p.utilization || p.governing == Demand::none) {
        p.utilization = std::max(u, p.utilization);
        p.governing = kind;
      }
    };
    consider(p.axial, r.compression, Demand::compression);
    consider(-p.axial, r.tension, Demand::tension);
    consider(p.lateral, r.lateral, Demand::lateral);
    if (along && i < along->size()) {
      p.head_moment = (*along)[i].head;
      p.max_moment = (*along)[i].value;
      p.max_moment_depth = (*along)[i].depth;
    } else if (pile.type < moment_influence_.size() && moment_influence_[pile.type]) {
      const MomentPeak peak =
          largest_moment_along(*moment_influence_[pile.type], pile.axis(), force.head_forces);
      p.head_moment = peak.head;
      p.max_moment = peak.value;
      p.max_moment_depth = peak.depth;
    } else if (pile.type < head_moment_per_shear.size()) {
      p.head_moment = p.lateral * head_moment_per_shear[pile.type];
      p.max_moment = p.head_moment;
    }
    if (r.structural_axial && *r.structural_axial > 0) {
      double u = std::abs(p.axial) / *r.structural_axial;
      if (p.max_moment > 0 && r.structural_moment && *r.structural_moment > 0)
        u = axial_bending_utilization(p.axial, *r.structural_axial, p.max_moment,
                                      *r.structural_moment);
      govern(Demand::structural, u, p.axial);
      if (u > p.utilization) {
        p.utilization = u;
        p.governing = Demand::structural;
      }
    }
    if (p.axial > 0) check.total_compression += p.axial;
    else check.total_tension -= p.axial;
    p.pass = p.utilization <= 1.0;
    if (!p.pass) {
      check.pass = false;
      e.failed[i] = 1;
    }
    if (!check.governing_pile || p.utilization > check.max_utilization) {
      check.max_utilization = p.utilization;
      check.governing_pile = i;
      check.governing = p.governing;
    }
    // A zero value names no combination: "max tension 0.0 in S1" of a pile never in
    // tension would point the reader at nothing.
    auto raise = [&](double& value, std::int64_t& at, double v, double tolerance) {
      if (v > tolerance && (at < 0 || v > value)) {
        value = v;
        at = static_cast<std::int64_t>(c);
      }
    };
    raise(e.compression[i], e.compression_at[i], p.axial, kForceTolerance);
    raise(e.tension[i], e.tension_at[i], -p.axial, kForceTolerance);
    raise(e.lateral[i], e.lateral_at[i], p.lateral, kForceTolerance);
    if (p.utilization > 0.0 && (e.utilization_at[i] < 0 || p.utilization > e.utilization[i]))
      e.governing[i] = static_cast<double>(static_cast<int>(p.governing));
    raise(e.utilization[i], e.utilization_at[i], p.utilization, 0.0);
  }
}

CheckResults CheckAccumulator::finish() {
  results_.summary.pass = results_.summary.failed_combinations == 0;
  const std::size_t n = project_.piles.size();
  results_.envelope.resize(n);
  results_.governing.resize(n);
  for (std::size_t i = 0; i < n; ++i) {
    results_.envelope[i] = fold_->envelope(i);
    results_.governing[i] = fold_->governing_checks(i);
  }
  return std::move(results_);
}

CheckResults check_piles(const Project& project, const std::vector<CapSolution>& solutions,
                         const std::vector<PileTypeResistance>& resistances,
                         const std::vector<double>& head_moment_per_shear,
                         const std::vector<std::optional<MomentInfluence>>& moment_influence) {
  CheckAccumulator accumulator(project, resistances, head_moment_per_shear, true,
                               moment_influence);
  for (std::size_t c = 0; c < project.combinations.size(); ++c) accumulator.add(c, solutions[c]);
  return accumulator.finish();
}

std::vector<std::string> assumptions(
    const Project& project, const std::vector<PileTypeResistance>& resistances,
    const std::vector<std::pair<std::string, std::string>>& stiffness_sources) {
  std::vector<std::string> list;
  for (const auto& warning : project.warnings) list.push_back(warning_note(warning));
  list.push_back("The cap is rigid: it moves as one body with six degrees of freedom.");
  const bool all_pinned = std::all_of(project.piles.begin(), project.piles.end(), [&](const Pile& p) {
    return project.pile_types[p.type].head == HeadFixity::pinned;
  });
  list.push_back(all_pinned
                     ? "Pile heads act on the cap as an axial spring along the pile and a lateral "
                       "spring across it; no moment is transferred to the cap."
                     : "Pinned pile heads act on the cap as an axial spring along the pile and a "
                       "lateral spring across it; fixed and partially fixed heads add their "
                       "coupled lateral and rotational stiffness, so the cap and the piles "
                       "exchange moments.");
  std::set<std::size_t> used;
  for (const Pile& pile : project.piles) used.insert(pile.type);
  for (std::size_t t = 0; t < project.pile_types.size(); ++t) {
    const PileType& type = project.pile_types[t];
    if (!used.count(t)) continue;  // a type from a shared file that no pile uses
    if (t < stiffness_sources.size()) {
      list.push_back(fmt::format("Pile type {}: axial stiffness {}.", type.id,
                                 stiffness_sources[t].first));
      list.push_back(fmt::format("Pile type {}: lateral stiffness {}.", type.id,
                                 stiffness_sources[t].second));
    }
    if (type.head != HeadFixity::pinned)
      list.push_back(fmt::format(
          "Pile type {}: {} heads; the head moments are part of the cap's equilibrium "
          "(coupled lateral and rotational head stiffness), and the structural check takes the "
          "largest moment along the pile with |P|/Pc + |M|/Mc ≤ 1.",
          type.id, type.head == HeadFixity::fixed ? "fixed" : "partially fixed"));
    list.push_back(fmt::format(
        "Pile type {}: {}.", type.id,
        type.tension ? "takes tension"
        : type.design.computes_capacity() && project.soil
            ? "takes no tension (compression only: it drops out of the cap rather than take "
              "tension; the uplift capacity computed from the soil is not used)"
            : "takes no tension (compression only: it drops out of the cap rather than take "
              "tension)"));
    if (t < resistances.size()) {
      const auto& r = resistances[t];
      if (!r.allowable.source.empty())
        list.push_back(fmt::format("Pile type {}: allowable capacities: {}.", type.id,
                                   r.allowable.source));
      if (!r.factored.source.empty())
        list.push_back(fmt::format("Pile type {}: factored resistances: {}.", type.id,
                                   r.factored.source));
      const UnitSystem u = project.units;
      auto structural = [&](const Resistance& res, const char* basis) {
        if (!res.structural_axial) return;
        std::string text = fmt::format(
            "Pile type {}: structural {} axial capacity {} ({} × the factor given)",
            type.id, basis, QuantityFormat(u).text(Shown::force, *res.structural_axial),
            type.structure && type.structure->concrete_strength
                ? "Po = 0.85·f'c·(Ag − As) + fy·As, ACI 318-19 eq. 22.4.2.2"
                : "fy·A of the steel section");
        if (res.structural_moment)
          text += fmt::format(", moment capacity {}; fixed heads: |P|/Pc + |M|/Mc ≤ 1",
                              QuantityFormat(u).text(Shown::moment, *res.structural_moment));
        list.push_back(text + ".");
      };
      structural(r.allowable, "allowable");
      structural(r.factored, "factored");
    }
  }
  if (project.cap.self_weight)
    list.push_back(fmt::format("The cap's self-weight is included in load case {}.",
                               project.cap.self_weight->load_case));
  else
    list.push_back("The cap's self-weight is not included (unless it is in the loads given).");
  list.push_back("Service combinations are checked against allowable capacities, strength "
                 "combinations against factored resistances.");
  for (const auto& note : project.notes) list.push_back("Combinations " + note);
  for (auto& text : code_resistance_assumptions(project, resistances)) list.push_back(std::move(text));
  return list;
}

}  // namespace cairn
