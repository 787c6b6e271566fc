// checks.hpp — each pile's demand against its capacity, per combination, with envelopes
// and the governing pile and combination.
//
// Service combinations are compared with allowable capacities (ultimate / factor of
// safety); strength combinations with factored resistances (φ·R). The two bases are never
// mixed: a combination whose basis a pile type lacks is an input problem, reported before
// anything is computed.
//
// Utilization of a pile in a combination is the largest of
//     compression / allowable compression   (axial > 0)
//     tension / allowable tension            (axial < 0)
//     lateral shear / allowable lateral
// and the pile passes when it is at most 1. A demand with no capacity to compare against
// (tension in a pile type without a tension capacity, say) fails: it cannot be shown safe.
//
// Units: kN.
#pragma once

#include <array>
#include <cstddef>
#include <map>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "cairn/core/defaults.hpp"
#include "cairn/solver/cap_solver.hpp"
#include "cairn/core/diagnostics.hpp"
#include "cairn/core/model.hpp"

namespace cairn {

// Capacities of one pile type on one basis, after factors were applied. kN.
struct Resistance {
  std::optional<double> compression, tension, lateral;
  // Structural: the section's axial capacity (kN) and moment capacity (kN·m) on this basis.
  std::optional<double> structural_axial, structural_moment;
  std::string source;  // where the numbers came from, for the report
};

struct PileTypeResistance {
  Resistance allowable;  // for service combinations
  Resistance factored;   // for strength combinations
  // For combinations a code generator tagged with a resistance set (code_resistance.hpp).
  std::map<ResistanceSet, Resistance> by_set;
  // The factored resistance uses cairn's AASHTO LRFD φ defaults (computed from the soil, no
  // phi_* given): load factors of another code meet AASHTO's resistance factors.
  bool aashto_phi = false;
};

// Capacity computed from the soil for one pile type (see capacity.hpp), kN.
struct ComputedResistance {
  std::optional<double> allowable_compression, allowable_tension;
  std::optional<double> factored_compression, factored_tension;
  std::string method;  // e.g. "vesic tip + beta shaft"
  // Lateral by Broms (1964) from the soil at the pile head, when computed.
  std::optional<double> allowable_lateral, factored_lateral;
  std::string lateral_method;
  // Ultimate (unfactored) values, for code resistance sets (code_resistance.hpp).
  std::optional<double> ultimate_tip, ultimate_shaft, ultimate_uplift, ultimate_lateral;
  // The same with the soil's strength factored by EN 1997-1 set M2 (design approach 3).
  std::optional<double> m2_tip, m2_shaft, m2_uplift;
  bool aashto_phi = false;  // factored_* use AASHTO φ defaults (no phi_* given)
};

// Default factors of safety for capacities given as ultimate: kDefaultSafetyCompression and
// kDefaultSafetyTension (core/defaults.hpp; see docs/methods.md).

// Resistances per pile type: typed-in capacities win, value by value, over computed ones
// (`computed` is indexed like Project::pile_types; an empty optional = nothing computed).
std::vector<PileTypeResistance> resolve_resistances(
    const Project& project, const std::vector<std::optional<ComputedResistance>>& computed);

// Combinations that need a basis (or a code resistance set) some pile type in use lacks;
// empty when all can be checked.
std::vector<Diagnostic> missing_resistances(const Project& project,
                                            const std::vector<PileTypeResistance>& resistances);

// The checks a pile's utilization comes from: the one list every output names them by.
// `none` when the pile carries no demand at all (or no forces exist: the cap overturned).
enum class Demand { none, compression, tension, lateral, structural };
// "none", "compression", "tension", "lateral", "structural": the word every output prints.
const char* to_string(Demand);

// What a pile does in one combination: the one list of states every output uses.
//   in_contact   the pile carries its share (compression, or tension where allowed)
//   dropped_out  a compression-only pile that would be in tension; its axial spring is
//                removed and the load redistributed (cap_solver.hpp)
//   overturned   no equilibrium exists in the combination: the cap overturns or is unstable,
//                so the pile has no force to speak of and the pile fails with the combination
enum class PileState { in_contact, dropped_out, overturned };
// "in contact", "dropped out", "overturned": the word every output prints (JSON included).
const char* to_string(PileState);

// The verdict on a combination: pass, fail (some pile over capacity or without one), or
// overturned (no equilibrium). An overturned combination fails.
enum class Verdict { pass, fail, overturned };
// "pass", "fail", "overturned".
const char* to_string(Verdict);

struct PileCheck {
  double axial = 0.0;    // kN, compression positive (0 when overturned: no forces exist)
  double lateral = 0.0;  // kN
  double head_moment = 0.0;  // kN·m, fixed heads (0 for pinned)
  double max_moment = 0.0;   // kN·m, largest along the pile (= head_moment without a pile model)
  double max_moment_depth = 0.0;  // m below the head
  bool active = true;    // false: dropped out, takes no tension
  PileState state = PileState::in_contact;
  double utilization = 0.0;   // infinity when a demand has no capacity
  Demand governing = Demand::none;
  bool pass = true;      // false in an overturned combination, whatever the forces
};

struct CombinationCheck {
  std::size_t combination = 0;  // index into Project::combinations
  CapSolution solution;
  std::vector<PileCheck> piles;
  bool pass = true;
  double max_utilization = 0.0;
  std::optional<std::size_t> governing_pile;
  Demand governing = Demand::none;
  // Σ of the piles' compressions and Σ of their tensions (kN, magnitudes), for the group
  // checks; kept when `piles` is not (a run that keeps no pile rows).
  double total_compression = 0.0, total_tension = 0.0;
};

// The verdict on one checked combination.
Verdict verdict(const CombinationCheck& check);

// The largest value of a quantity over all combinations and where it occurs. No combination
// is named when the value is zero in every combination (a pile never in tension has no
// combination of largest tension). Overturned combinations have no forces and are left out.
struct Extreme {
  double value = 0.0;
  std::optional<std::size_t> combination;
};

struct PileEnvelope {
  Extreme max_compression;  // kN, ≥ 0
  Extreme max_tension;      // kN, ≥ 0 (magnitude)
  Extreme max_lateral;      // kN
  Extreme max_utilization;
  Demand governing = Demand::none;  // the check that gives max_utilization
  bool pass = true;  // false when the pile fails in any combination, overturned ones included
};

struct CheckSummary {
  bool pass = true;
  double max_utilization = 0.0;
  std::optional<std::size_t> pile, combination;
  Demand check = Demand::none;
  std::size_t failed_combinations = 0;
  std::vector<std::size_t> overturned;  // combinations with no equilibrium
};

// For one pile and one check (compression, tension, lateral, structural): the combination
// with the largest utilization of that check alone, its demand (kN; kN for structural: the
// axial force) and the utilization. No combination when the check never has a demand.
struct GoverningCheck {
  Extreme utilization;
  double demand = 0.0;
};
// Indexed by Demand − 1: compression, tension, lateral, structural.
using PileGoverning = std::array<GoverningCheck, 4>;

struct CheckResults {
  std::vector<CombinationCheck> combinations;
  std::vector<PileEnvelope> envelope;  // per pile
  std::vector<PileGoverning> governing;  // per pile
  CheckSummary summary;
  // false: the combinations carry no pile rows (CombinationCheck::piles and the solution's
  // pile forces are empty); the envelope, governing checks and summary are complete.
  bool pile_rows = true;
};

// Checks combination by combination, folding the envelope, the governing checks and the
// summary as it goes; with keep_pile_rows false, memory grows with piles + combinations and
// not their product. check_piles() is this over all solutions.
class CheckAccumulator {
 public:
  // `head_moment_per_shear` and `moment_influence` as for check_piles() below.
  CheckAccumulator(const Project& project, const std::vector<PileTypeResistance>& resistances,
                   const std::vector<double>& head_moment_per_shear, bool keep_pile_rows,
                   const std::vector<std::optional<MomentInfluence>>& moment_influence = {});
  ~CheckAccumulator();
  CheckAccumulator(const CheckAccumulator&) = delete;
  CheckAccumulator& operator=(const CheckAccumulator&) = delete;
  // The combination's solution (combinations in order, index c).
  void add(std::size_t c, CapSolution solution);
  // The same with each pile's head moment and largest moment along it given (per pile, as
  // Project::piles: a nonlinear run's pile profiles); they take the place of the moment
  // influence and of the moment per shear.
  void add(std::size_t c, CapSolution solution, const std::vector<MomentPeak>& along);
  // The same with the piles' forces as arrays, axial[i] and lateral[i] (kN), as
  // solve_combinations hands them over (null when the solution has its pile rows);
  // `solution` needs its rows when needs_rows(c) or it overturns. The same results as
  // add(c, solution) with the rows.
  void add(std::size_t c, CapSolution solution, const double* axial, const double* lateral);
  // Whether combination c is checked pile by pile and so needs the solution's pile rows
  // (full detail, a structural check or a moment along the pile on its basis).
  bool needs_rows(std::size_t c);
  CheckResults finish();
  // Combinations whose piles have no structural check and no moment along the pile are
  // folded in one pass over arrays of the piles' values (check_fold.hpp), the others pile
  // by pile; both give the same bits. true: every combination pile by pile (for the tests).
  void fold_row_by_row(bool on);

 private:
  void add_checked(std::size_t c, CapSolution solution, const std::vector<MomentPeak>* along);
  struct Fold;
  void add_rows(std::size_t c, CombinationCheck& check, const std::vector<MomentPeak>* along);
  bool add_arrays(std::size_t c, CombinationCheck& check);
  void fold_arrays(std::size_t c, CombinationCheck& check, const double* axial,
                   const double* lateral);
  void finish_combination(CombinationCheck check);
  std::size_t basis_of(std::size_t c);  // the fold's basis of combination c (made when new)
  const Project& project_;
  const std::vector<PileTypeResistance>& resistances_;
  std::vector<double> head_moment_per_shear_;
  std::vector<std::optional<MomentInfluence>> moment_influence_;
  CheckResults results_;
  std::unique_ptr<Fold> fold_;
};

// Checks every pile in every combination. `solutions` is indexed like the combinations.
// `head_moment_per_shear` (m, per pile type; empty = all pinned) gives fixed heads their
// head moment M = V·(moment per shear) for the combined axial + bending check
// |P|/Pc + |M|/Mc ≤ 1 (common practice; lateral.hpp). `moment_influence` (per pile type;
// empty or absent for pinned heads) takes its place where given: the head moment is then the
// solver's (part of the cap's equilibrium, pile_head.hpp) and the check takes the largest
// moment along the pile (Hetényi 1946) with the axial force at the head, by the same linear
// rule — conservative inside the section's P–M diagram.
CheckResults check_piles(
    const Project& project, const std::vector<CapSolution>& solutions,
    const std::vector<PileTypeResistance>& resistances,
    const std::vector<double>& head_moment_per_shear = {},
    const std::vector<std::optional<MomentInfluence>>& moment_influence = {});

// The assumptions behind the results, in plain words, for every output; the warnings found
// while reading (project.warnings) come first, as "Warning: … (file:line:col)".
// `stiffness` gives each pile type's springs and their sources (stiffness.hpp); it is
// declared there, so only the sources are passed here: (axial source, lateral source).
std::vector<std::string> assumptions(
    const Project& project, const std::vector<PileTypeResistance>& resistances,
    const std::vector<std::pair<std::string, std::string>>& stiffness_sources);

inline constexpr const char* kCaution =
    "Results are for checking by a qualified engineer; local codes and licensed practice "
    "govern.";

}  // namespace cairn
