// code_resistance.hpp — design resistances for the combinations a code generator tags with a
// resistance set (model.hpp: ResistanceSet): the partial resistance factors of EN 1997-1 for
// piles, with the correlation and model factors, and AASHTO LRFD's extreme-event resistance
// factors.
//
// Inputs: a pile type's ultimate resistances — typed in (capacity basis `ultimate`, taken as
// characteristic) or computed from the soil (tip, shaft and uplift separately) — and the
// project's EN 1997 settings. Output: a Resistance (checks.hpp), kN.
//
// EN 1997-1:2004 (recommended values, from memory; a national annex may change them):
//   compression, computed   R_c;d = (R_b;cal/γb + R_s;cal/γs) / (ξ · γRd)      eq. 7.6, 7.7
//   tension, computed       R_t;d = R_s;t;cal / (γs;t · ξ · γRd)                 eq. 7.12
//   compression, typed in   R_c;d = R_c;k / γt;   tension R_t;k / γs;t;   lateral R_tr;k / γt
// ξ (§7.6.2.3(5), Table A.10) applies when the number of profiles of ground tests is given:
// cairn computes one profile and takes it as both the mean and the minimum, so
// ξ = max(ξ3, ξ4) = ξ3, divided by 1.1 for a cap stiff enough to move load from weak to
// strong piles (§7.6.2.3(7)). Without test profiles, the characteristic resistance comes
// from the soil parameters directly (§7.6.2.3(8)) and a model factor γRd corrects it
// (default 1.4: UK National Annex to BS EN 1997-1, A.3.3.2, from memory).
// R3 (design approach 3) applies to the capacity computed with set M2 (tan φ' ÷ 1.25,
// cu ÷ 1.4), never to a typed-in resistance.
// AASHTO LRFD 7th ed. (2014) §10.5.5.3.3 (from memory): extreme event φ = 1.0 on the
// ultimate resistance, except 0.80 in uplift.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "cairn/checks/checks.hpp"
#include "cairn/core/model.hpp"

namespace cairn {

// EN 1997-1:2004 Tables A.6 (driven), A.7 (bored) and A.8 (CFA): partial resistance factors.
struct En1997PileFactors {
  double base = 1.0;           // γb
  double shaft = 1.0;          // γs, compression
  double total = 1.0;          // γt, total or combined compression
  double shaft_tension = 1.0;  // γs;t
};

// The factors of set `set` (en1997_r1 … en1997_r4) for `kind`. Throws std::logic_error for a
// set that is not an EN 1997 one.
En1997PileFactors en1997_pile_factors(En1997PileKind kind, ResistanceSet set);

// EN 1997-1:2004 Table A.10: ξ3 and ξ4 for n profiles of tests (n = 1, 2, 3, 4, 5, 7, ≥ 10).
// Between tabulated n the value of the next smaller n is taken (conservative; common
// practice). Requires profiles ≥ 1.
double en1997_xi3(int profiles);
double en1997_xi4(int profiles);

// The correlation factor cairn divides a computed resistance by: max(ξ3, ξ4), ÷ 1.1 for a
// rigid cap, never below 1.0; 1.0 when no test profiles are given.
double en1997_correlation_factor(const En1997Settings& settings);
// γRd: the value given, else 1.4 without test profiles and 1.0 with them.
double en1997_model_factor(const En1997Settings& settings);
inline constexpr double kEn1997DefaultModelFactor = 1.4;
inline constexpr double kEn1997StiffCapDivisor = 1.1;

// AASHTO LRFD §10.5.5.3.3 (from memory).
inline constexpr double kAashtoExtremePhi = 1.0;
inline constexpr double kAashtoExtremePhiUplift = 0.80;

// The pile kind EN 1997 tables are read for: the settings' pile_kind, else the installation.
En1997PileKind en1997_pile_kind(const Project& project, const PileType& type);

// Resistance of pile type `type` in set `set` (not basis). Typed-in ultimate values win over
// computed ones, value by value, as on the other bases; the structural capacity is the
// factored one (`factored`). Values that cannot be derived stay empty.
Resistance code_set_resistance(const Project& project, std::size_t type, ResistanceSet set,
                               const std::optional<ComputedResistance>& computed,
                               const Resistance& factored);

// What a resistance of the whole group computed from the soil (block failure, block uplift)
// is divided by in set `set`: EN 1997 γt·ξ·γRd in compression, γs;t·ξ·γRd in tension (the
// block taken like one pile of `type`'s kind), and for R3 also 1.4 (compression, clay block)
// or 1.25 (tension) for set M2; AASHTO extreme event 1/φ.
double code_set_soil_divisor(const Project& project, const PileType& type, ResistanceSet set,
                             bool tension);

// EN 1997-1:2004 Table A.4, set M2 (from memory): γφ' = 1.25 on tan φ' (and on tan δ of the
// shaft), γcu = 1.4 on cu; unit weights unchanged (γγ = 1.0).
inline constexpr double kEn1997GammaPhi = 1.25;
inline constexpr double kEn1997GammaCu = 1.4;

// The profile with set M2 applied: φ'd = atan(tan φ' / 1.25), δd = atan(tan δ / 1.25),
// cu,d = cu / 1.4; every other property as given.
SoilProfile en1997_m2_profile(const SoilProfile& profile);

// Whether a design computes its capacity from φ' and cu only, so that set M2 can factor it
// (false for the SPT-based methods: meyerhof-spt, the fhwa tip and beta-fhwa in sand).
bool en1997_m2_applies(const PileDesign& design);

// Plain-words assumptions for the resistance sets in use, and where load factors of one code
// meet resistance factors of another (e.g. ASCE 7 loads with AASHTO φ).
std::vector<std::string> code_resistance_assumptions(
    const Project& project, const std::vector<PileTypeResistance>& resistances);

}  // namespace cairn
