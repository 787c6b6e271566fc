// combinations.hpp — load combinations generated from the kinds of the load cases, by the
// published combination rules of a design code.
//
// Input: the load cases (id, kind, and for wind and seismic an optional direction). Output:
// the combinations, each with its id, limit state, the factor on each load case (by case id)
// and the formula in words. Factors are dimensionless; nothing here touches the loads.
//
// Generators (all as recalled from the standards, i.e. from memory; see
// docs/methods-combinations.md for the tables and the naming of each combination):
//   asce7-asd       ASCE/SEI 7-16 §2.4.1 combinations 1–7 and §2.4.5 seismic combinations
//                   8–10 (allowable stress design) → LimitState::service
//   asce7-lrfd      ASCE/SEI 7-16 §2.3.1 combinations 1–5 and §2.3.6 seismic combinations
//                   6–7 (strength design) → LimitState::strength
//                   Both: the vertical seismic effect Ev = 0.2·SDS·D (§12.4.2.2) added to D
//                   where it adds (6; 8, 9) and subtracted where it relieves (7; 10); earth
//                   pressure H adding (1.6 / 1.0) and, in a second set of ids ending '-Hr',
//                   resisting (0.9 / 0.6 if permanent, else 0)
//   en1990-str-geo  EN 1990:2002 eq. 6.10 with Table A1.2(B) (γG = 1.35 / 1.0, γQ = 1.5) and
//                   ψ0 from Table A1.1, each variable action leading in turn → strength; plus
//                   the characteristic combination eq. 6.14b → service
//   en1997-da1      EN 1997-1:2004 §2.4.7.3.4.2 design approach 1 for piles: combination 1
//                   (A1 + M1 + R1) and combination 2 (A2 + M1 + R4), eq. 6.10 with the action
//                   factors of Table A.3 → strength, checked with resistance set R1 / R4
//   en1997-da2      design approach 2 (A1 + M1 + R2) → strength, resistance set R2
//   en1997-da3      design approach 3: A1 on structural actions, A2 (γG 1.0) on earth
//                   pressure, + M2 + R3 → strength, resistance set R3 (code_resistance.hpp
//                   computes the capacity again with the soil's strength factored by M2)
//   aashto-lrfd     AASHTO LRFD Bridge Design Specifications (7th ed., 2014) Tables 3.4.1-1
//                   and 3.4.1-2: Strength I, III, V (strength), Service I (service), Extreme
//                   Event I and II (strength, extreme-event resistance factors), each with all
//                   permanent loads at their maximum and again at their minimum γp
//
// Rules common to all generators: all cases of one non-directional kind act together (all
// dead cases, all live cases, …). Wind and seismic cases are directions: each direction is
// taken in turn and two directions never appear in one combination. Cases of kind wind or
// seismic that share a non-empty `direction` form one direction and act together; a case
// with an empty `direction` is a direction of its own, named by its id.
#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "cairn/core/model.hpp"

namespace cairn {

// A load case as the generators see it.
struct CaseToCombine {
  std::string id;
  LoadKind kind = LoadKind::other;
  std::string direction;  // wind/seismic: cases with the same direction act together; else unused
};

struct GeneratedCombination {
  std::string id;           // e.g. "LRFD-4(Wx+,S)", "ASD-7(Wy-)", "EN-6.10-L+W(Wx+)"
  LimitState limit_state = LimitState::service;
  ResistanceSet resistance_set = ResistanceSet::basis;  // what the combination is checked with
  std::vector<std::pair<std::string, double>> factors;  // (load case id, factor)
  std::string description;  // the formula, e.g. "0.6D + 0.6W(Wx+)"
};

struct GeneratedCombinations {
  std::vector<GeneratedCombination> combinations;
  std::vector<std::string> notes;  // choices made for the user, for the output to state
};

// Values some generators need besides the load cases (keys of `combinations.generate`).
struct CombinationSettings {
  // ASCE 7 short-period design spectral acceleration SDS (in g, dimensionless), for the
  // vertical seismic effect Ev = 0.2·SDS·D (ASCE/SEI 7-16 §12.4.2.2). Required when an
  // ASCE 7 generator meets seismic cases; 0 leaves Ev out.
  std::optional<double> sds;
  // ASCE 7 earth pressure H where it resists: taken as permanent (factor 0.9 strength, 0.6
  // allowable stress) or, when false, as not permanent (factor 0). §2.3.1 / §2.4.1.
  bool earth_permanent = true;
  // AASHTO γEQ, the live-load factor of Extreme Event I (project-specific; 0.5 suggested in
  // AASHTO LRFD C3.4.1, from memory).
  double gamma_eq = 0.5;
};

// Names of the generators, in the order listed above.
std::vector<std::string> generator_names();

// Builds the combinations of `generator` for `cases`. Combinations whose defining load is
// absent are not generated (e.g. no wind → no wind combinations); every load of a kind the
// combination names is applied in full. Throws std::invalid_argument for an unknown
// generator (the message lists the valid ones), a case kind the generator does not combine
// (naming the case and its kind), an empty or repeated case id, and seismic cases for an
// ASCE 7 generator without settings.sds.
GeneratedCombinations generate_combinations(std::string_view generator,
                                            const std::vector<CaseToCombine>& cases,
                                            const CombinationSettings& settings = {});

}  // namespace cairn
