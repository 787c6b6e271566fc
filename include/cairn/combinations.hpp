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
//   en1990-str-geo  EN 1990:2002 eq. 6.10 with Table A1.2(B) (γG = 1.35 / 1.0, γQ = 1.5) and
//                   ψ0 from Table A1.1, each variable action leading in turn → strength; plus
//                   the characteristic combination eq. 6.14b → service
//
// Rules common to all generators: all cases of one non-directional kind act together (all
// dead cases, all live cases, …). Wind and seismic cases are directions: each direction is
// taken in turn and two directions never appear in one combination. Cases of kind wind or
// seismic that share a non-empty `direction` form one direction and act together; a case
// with an empty `direction` is a direction of its own, named by its id.
#pragma once

#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "cairn/model.hpp"

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
  std::vector<std::pair<std::string, double>> factors;  // (load case id, factor)
  std::string description;  // the formula, e.g. "0.6D + 0.6W(Wx+)"
};

struct GeneratedCombinations {
  std::vector<GeneratedCombination> combinations;
  std::vector<std::string> notes;  // choices made for the user, for the output to state
};

// Names of the generators, in the order listed above.
std::vector<std::string> generator_names();

// Builds the combinations of `generator` for `cases`. Combinations whose defining load is
// absent are not generated (e.g. no wind → no wind combinations); every load of a kind the
// combination names is applied in full. Throws std::invalid_argument for an unknown
// generator (the message lists the valid ones), a case kind the generator does not combine
// (naming the case and its kind), an empty or repeated case id.
GeneratedCombinations generate_combinations(std::string_view generator,
                                            const std::vector<CaseToCombine>& cases);

}  // namespace cairn
