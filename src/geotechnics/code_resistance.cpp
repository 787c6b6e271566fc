// code_resistance.cpp — design resistances for code resistance sets; the factors and their
// sources are listed in code_resistance.hpp and docs/methods-combinations.md.
#include "cairn/geotechnics/code_resistance.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <array>
#include <set>
#include <stdexcept>

#include <fmt/format.h>

#include "cairn/core/quantity_format.hpp"
#include "cairn/geotechnics/methods.hpp"

namespace cairn {
namespace {

// EN 1997-1:2004 Annex A, recommended values (from memory). Rows: R1, R2, R3, R4.
//                                       γb    γs    γt    γs;t
// Table A.6 driven piles
constexpr std::array<En1997PileFactors, 4> kDriven = {{{1.00, 1.00, 1.00, 1.25},
                                                        {1.10, 1.10, 1.10, 1.15},
                                                        {1.00, 1.00, 1.00, 1.10},
                                                        {1.30, 1.30, 1.30, 1.60}}};
// Table A.7 bored piles
constexpr std::array<En1997PileFactors, 4> kBored = {{{1.25, 1.00, 1.15, 1.25},
                                                       {1.10, 1.10, 1.10, 1.15},
                                                       {1.00, 1.00, 1.00, 1.10},
                                                       {1.60, 1.30, 1.50, 1.60}}};
// Table A.8 continuous flight auger (CFA) piles
constexpr std::array<En1997PileFactors, 4> kCfa = {{{1.10, 1.00, 1.10, 1.25},
                                                     {1.10, 1.10, 1.10, 1.15},
                                                     {1.00, 1.00, 1.00, 1.10},
                                                     {1.45, 1.30, 1.40, 1.60}}};

// EN 1997-1:2004 Table A.10 (from memory): correlation factors for n profiles of tests.
struct XiRow {
  int profiles;
  double xi3, xi4;
};
constexpr std::array<XiRow, 7> kXi = {{{1, 1.40, 1.40},
                                       {2, 1.35, 1.27},
                                       {3, 1.33, 1.23},
                                       {4, 1.31, 1.20},
                                       {5, 1.29, 1.15},
                                       {7, 1.27, 1.12},
                                       {10, 1.25, 1.08}}};

const XiRow& xi_row(int profiles) {
  if (profiles < 1) throw std::invalid_argument("the number of test profiles must be ≥ 1");
  const XiRow* row = &kXi.front();
  for (const XiRow& r : kXi)
    if (r.profiles <= profiles) row = &r;
  return *row;
}

bool is_en1997(ResistanceSet set) {
  return set == ResistanceSet::en1997_r1 || set == ResistanceSet::en1997_r2 ||
         set == ResistanceSet::en1997_r3 || set == ResistanceSet::en1997_r4;
}

std::optional<double> scaled(std::optional<double> value, double factor) {
  return value ? std::optional<double>(*value * factor) : std::nullopt;
}

const char* generator_code(const std::string& generator) {
  if (generator == "asce7-lrfd") return "ASCE 7";
  if (generator == "en1990-str-geo") return "EN 1990";
  return nullptr;
}

}  // namespace

En1997PileFactors en1997_pile_factors(En1997PileKind kind, ResistanceSet set) {
  if (!is_en1997(set)) throw std::logic_error("en1997_pile_factors: not an EN 1997 set");
  const std::size_t row = set == ResistanceSet::en1997_r1   ? 0
                          : set == ResistanceSet::en1997_r2 ? 1
                          : set == ResistanceSet::en1997_r3 ? 2
                                                            : 3;
  switch (kind) {
    case En1997PileKind::driven: return kDriven[row];
    case En1997PileKind::bored: return kBored[row];
    case En1997PileKind::cfa: return kCfa[row];
  }
  return kDriven[row];
}

double en1997_xi3(int profiles) { return xi_row(profiles).xi3; }
double en1997_xi4(int profiles) { return xi_row(profiles).xi4; }

double en1997_correlation_factor(const En1997Settings& settings) {
  if (!settings.test_profiles) return 1.0;
  // One computed profile is both the mean and the minimum: R_k = R_cal / max(ξ3, ξ4).
  double xi = std::max(en1997_xi3(*settings.test_profiles), en1997_xi4(*settings.test_profiles));
  if (settings.rigid_cap) xi /= kEn1997StiffCapDivisor;
  return std::max(xi, 1.0);
}

double en1997_model_factor(const En1997Settings& settings) {
  if (settings.model_factor) return *settings.model_factor;
  return settings.test_profiles ? 1.0 : kEn1997DefaultModelFactor;
}

En1997PileKind en1997_pile_kind(const Project& project, const PileType& type) {
  if (project.en1997.pile_kind) return *project.en1997.pile_kind;
  return type.design.installation == Installation::bored ? En1997PileKind::bored
                                                         : En1997PileKind::driven;
}

Resistance code_set_resistance(const Project& project, std::size_t type, ResistanceSet set,
                               const std::optional<ComputedResistance>& computed,
                               const Resistance& factored) {
  const PileType& pile_type = project.pile_types.at(type);
  Resistance r;
  r.structural_axial = factored.structural_axial;
  r.structural_moment = factored.structural_moment;
  const CapacitySet* typed = nullptr;
  for (const CapacitySet& c : pile_type.capacities)
    if (c.basis == CapacityBasis::ultimate) typed = &c;

  std::vector<std::string> parts;
  if (set == ResistanceSet::aashto_extreme) {
    if (typed) {
      r.compression = scaled(typed->compression, kAashtoExtremePhi);
      r.tension = scaled(typed->tension, kAashtoExtremePhiUplift);
      r.lateral = scaled(typed->lateral, kAashtoExtremePhi);
    }
    if (computed) {
      if (!r.compression && computed->ultimate_tip && computed->ultimate_shaft)
        r.compression = kAashtoExtremePhi * (*computed->ultimate_tip + *computed->ultimate_shaft);
      if (!r.tension) r.tension = scaled(computed->ultimate_uplift, kAashtoExtremePhiUplift);
      if (!r.lateral) r.lateral = scaled(computed->ultimate_lateral, kAashtoExtremePhi);
    }
    r.source = fmt::format("{} × φ {:g} (compression, lateral), {:g} (uplift), AASHTO LRFD "
                           "§10.5.5.3.3",
                           typed ? "ultimate given" : "ultimate computed from the soil",
                           kAashtoExtremePhi, kAashtoExtremePhiUplift);
    return r;
  }

  const En1997PileKind kind = en1997_pile_kind(project, pile_type);
  const En1997PileFactors f = en1997_pile_factors(kind, set);
  if (set == ResistanceSet::en1997_r3) {
    // Design approach 3: the resistance is computed with the soil's strength factored (M2);
    // a typed-in characteristic resistance has no M2 in it and is not used.
    if (computed && computed->m2_tip && computed->m2_shaft) {
      const double divisor = en1997_correlation_factor(project.en1997) *
                             en1997_model_factor(project.en1997);
      r.compression = (*computed->m2_tip / f.base + *computed->m2_shaft / f.shaft) / divisor;
      if (computed->m2_uplift) r.tension = *computed->m2_uplift / (f.shaft_tension * divisor);
      // Broms from the unfactored soil ÷ 1.4: exact M2 for clay (linear in cu), on the safe side
      // for sand (Kp and its cube root fall by less than 1.4 when tan φ' ÷ 1.25).
      if (computed->ultimate_lateral)
        r.lateral = *computed->ultimate_lateral / (kEn1997GammaCu * f.total);
      r.source = fmt::format(
          "{} pile factors (EN 1997-1 Table {}); computed from the soil with set M2 (tan φ' and "
          "tan δ ÷ 1.25, cu ÷ 1.4): base ÷ γb {:g}, shaft ÷ γs {:g}, tension shaft ÷ γs;t {:g}, "
          "each ÷ ξ {:.3g} × γRd {:g}{}",
          to_string(kind),
          kind == En1997PileKind::driven ? "A.6" : kind == En1997PileKind::bored ? "A.7" : "A.8",
          f.base, f.shaft, f.shaft_tension, en1997_correlation_factor(project.en1997),
          en1997_model_factor(project.en1997),
          r.lateral ? fmt::format("; lateral (Broms) ÷ 1.4 for M2 ÷ γt {:g}", f.total) : "");
    } else {
      r.source = "design approach 3 needs the capacity computed from the soil with set M2";
    }
    return r;
  }
  if (typed) {
    r.compression = scaled(typed->compression, 1.0 / f.total);
    r.tension = scaled(typed->tension, 1.0 / f.shaft_tension);
    r.lateral = scaled(typed->lateral, 1.0 / f.total);
    parts.push_back(fmt::format("ultimate given taken as characteristic: compression and lateral "
                                "÷ γt {:g}, tension ÷ γs;t {:g}",
                                f.total, f.shaft_tension));
  }
  if (computed && (!r.compression || !r.tension)) {
    const double xi = en1997_correlation_factor(project.en1997);
    const double model = en1997_model_factor(project.en1997);
    const double divisor = xi * model;
    bool used = false;
    if (!r.compression && computed->ultimate_tip && computed->ultimate_shaft) {
      // EN 1997-1 eq. 7.6/7.7: R_c;d = R_b;k/γb + R_s;k/γs, R_k = R_cal / (ξ·γRd).
      r.compression = (*computed->ultimate_tip / f.base + *computed->ultimate_shaft / f.shaft) / divisor;
      used = true;
    }
    if (!r.tension && computed->ultimate_uplift) {
      r.tension = *computed->ultimate_uplift / (f.shaft_tension * divisor);  // eq. 7.12
      used = true;
    }
    if (used)
      parts.push_back(fmt::format("computed from the soil: base ÷ γb {:g}, shaft ÷ γs {:g}, "
                                  "tension shaft ÷ γs;t {:g} (pile weight not counted), each "
                                  "÷ ξ {:.3g} × γRd {:g}",
                                  f.base, f.shaft, f.shaft_tension, xi, model));
  }
  if (!r.lateral && computed && computed->ultimate_lateral) {
    r.lateral = *computed->ultimate_lateral / f.total;
    parts.push_back(fmt::format("lateral (Broms) ÷ γt {:g}", f.total));
  }
  std::string source = fmt::format("{} pile factors (EN 1997-1 Table {})", to_string(kind),
                                   kind == En1997PileKind::driven  ? "A.6"
                                   : kind == En1997PileKind::bored ? "A.7"
                                                                   : "A.8");
  for (const auto& p : parts) source += "; " + p;
  r.source = source;
  return r;
}

SoilProfile en1997_m2_profile(const SoilProfile& profile) {
  constexpr double kDegree = std::numbers::pi / 180.0;
  auto factored_angle = [&](double degrees) {
    return std::atan(std::tan(degrees * kDegree) / kEn1997GammaPhi) / kDegree;
  };
  SoilProfile m2 = profile;
  for (SoilLayer& layer : m2.layers) {
    if (layer.friction_angle) layer.friction_angle = factored_angle(*layer.friction_angle);
    if (layer.shaft_delta) layer.shaft_delta = factored_angle(*layer.shaft_delta);
    if (layer.undrained_strength) layer.undrained_strength = *layer.undrained_strength / kEn1997GammaCu;
  }
  return m2;
}

bool en1997_m2_applies(const PileDesign& design) {
  // SPT methods: those whose row in the method table (methods.hpp) needs N60.
  auto spt = [](const std::vector<LayerInput>& needs) {
    return std::any_of(needs.begin(), needs.end(),
                       [](const LayerInput& input) { return input.field == &SoilLayer::spt_n60; });
  };
  const bool spt_tip = design.tip_sand && spt(method_info(*design.tip_sand).needs_sand);
  const bool spt_shaft = (design.shaft_sand && spt(method_info(*design.shaft_sand).needs)) ||
                         (design.shaft_clay && spt(method_info(*design.shaft_clay).needs));
  return !spt_tip && !spt_shaft;
}

double code_set_soil_divisor(const Project& project, const PileType& type, ResistanceSet set,
                             bool tension) {
  if (set == ResistanceSet::aashto_extreme)
    return 1.0 / (tension ? kAashtoExtremePhiUplift : kAashtoExtremePhi);
  const En1997PileFactors f = en1997_pile_factors(en1997_pile_kind(project, type), set);
  // R3 (design approach 3) goes with M2: the clay block (cu·perimeter + 9cu·area) is linear in
  // cu, so ÷ 1.4 is M2 exactly; the uplift block's whole resistance ÷ 1.25 errs on the safe
  // side (its weight needs no factor).
  const double m2 = set != ResistanceSet::en1997_r3 ? 1.0 : tension ? kEn1997GammaPhi : kEn1997GammaCu;
  return m2 * (tension ? f.shaft_tension : f.total) * en1997_correlation_factor(project.en1997) *
         en1997_model_factor(project.en1997);
}

std::vector<std::string> code_resistance_assumptions(
    const Project& project, const std::vector<PileTypeResistance>& resistances) {
  std::vector<std::string> list;
  std::set<std::size_t> used;
  for (const Pile& pile : project.piles) used.insert(pile.type);
  std::set<ResistanceSet> sets;
  std::set<std::string> strength_codes;  // codes of generated strength combinations
  for (const Combination& c : project.combinations) {
    if (c.resistance_set != ResistanceSet::basis) sets.insert(c.resistance_set);
    else if (c.limit_state != LimitState::service)
      if (const char* code = generator_code(c.generator)) strength_codes.insert(code);
  }
  bool any_en = false;
  for (const ResistanceSet set : sets) {
    any_en = any_en || is_en1997(set);
    for (const std::size_t t : used) {
      if (t >= resistances.size()) continue;
      const auto it = resistances[t].by_set.find(set);
      if (it == resistances[t].by_set.end()) continue;
      const Resistance& r = it->second;
      const UnitSystem u = project.units;
      std::string values;
      for (const auto& [name, value] : {std::pair{"compression", r.compression},
                                        std::pair{"tension", r.tension},
                                        std::pair{"lateral", r.lateral}}) {
        if (!value) continue;
        values += fmt::format("{}{} {}", values.empty() ? "" : ", ", name,
                              QuantityFormat(u).text(Shown::force, *value));
      }
      list.push_back(fmt::format("Pile type {}: {} resistances{}: {}.", project.pile_types[t].id,
                                 to_string(set), values.empty() ? "" : " " + values, r.source));
    }
  }
  if (any_en) {
    const En1997Settings& en = project.en1997;
    list.push_back(
        "EN 1997 combinations are checked with design resistances: capacities given with basis "
        "ultimate are taken as characteristic values and divided by the set's γt (compression) "
        "and γs;t (tension); the structural capacity is the factored one.");
    if (en.test_profiles)
      list.push_back(fmt::format(
          "EN 1997: resistance computed from the soil with {} profile(s) of ground tests: the one "
          "computed profile is taken as both mean and minimum, ξ = max(ξ3 {:g}, ξ4 {:g}){} = "
          "{:.3g} (EN 1997-1 §7.6.2.3(5), Table A.10); model factor γRd {:g}{}.",
          *en.test_profiles, en1997_xi3(*en.test_profiles), en1997_xi4(*en.test_profiles),
          en.rigid_cap ? " ÷ 1.1 for the rigid cap (§7.6.2.3(7))" : "",
          en1997_correlation_factor(en), en1997_model_factor(en),
          en.model_factor ? " (given)" : " (default with ξ)"));
    else
      list.push_back(fmt::format(
          "EN 1997: resistance computed from the soil parameters (§7.6.2.3(8)), no correlation "
          "factor ξ (give test_profiles for ξ3/ξ4); model factor γRd {:g}{}.",
          en1997_model_factor(en),
          en.model_factor ? " (given)"
                          : " (default: UK National Annex to BS EN 1997-1, A.3.3.2, from memory)"));
  }
  for (const std::string& code : strength_codes) {
    for (const std::size_t t : used) {
      if (t >= resistances.size() || !resistances[t].aashto_phi) continue;
      list.push_back(fmt::format(
          "Pile type {}: the strength combinations' load factors come from {} but the resistance "
          "factors φ from AASHTO LRFD §10.5.5.2 (cairn's defaults for capacity computed from the "
          "soil); AASHTO calibrated its φ with its own load factors, so confirm they suit {} "
          "loads or give phi_tip, phi_shaft and phi_uplift.",
          project.pile_types[t].id, code, code));
    }
  }
  return list;
}

}  // namespace cairn
