// lateral.hpp — a single pile under lateral load at its head, and the structural capacity of
// its section.
//
// Three computations, all for one pile in one soil (no layering inside this module):
//  1. Head stiffness of an elastic pile in a Winkler soil (Hetényi 1946, "Beams on Elastic
//     Foundation", ch. on semi-infinite beams). Inputs: EI (kN·m²), horizontal subgrade
//     modulus kh (kN/m³), width D (m), embedded length L (m), head fixity. Outputs: the 2×2
//     head stiffness (kN/m, kN/rad, kN·m/rad), the lateral spring for the given fixity
//     (kN/m), the fixed-head moment per unit shear (m), and the response to a head shear.
//     Long piles (L > π/λ) use Hetényi's closed forms; shorter piles a finite beam with a free
//     tip, solved exactly (same differential equation, four boundary conditions).
//  2. Ultimate lateral resistance by Broms (1964a, cohesive soil, JSMFD 90(SM2) 27–63;
//     1964b, cohesionless soil, JSMFD 90(SM3) 123–156): short, intermediate and long piles,
//     free and fixed head, load applied at height e above the ground. Inputs: cu (kPa) or
//     γ' (kN/m³) and φ' (degrees), D, L, e (m), yield moment My (kN·m). Outputs: H_ult (kN),
//     governing mechanism, depth and size of the largest moment.
//  3. Axial capacity of the pile section (ACI 318 nominal Po for reinforced concrete, fy·A
//     for steel, each times a factor the caller states) and a linear axial + bending check.
//
// Sign convention for the head (Hetényi): y0 is the head deflection in the direction of the
// head shear H; θ0 is the head rotation, positive in the sense a positive H rotates a
// free-headed pile; the head moment M0 is positive when it produces a positive θ0. With this
// convention the coupling stiffness k_hm is negative for a long pile.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "cairn/core/defaults.hpp"
#include "cairn/core/model.hpp"
#include "cairn/geotechnics/soil.hpp"

namespace cairn {

// How the cap holds the pile head: pinned = free to rotate (no head moment); fixed = no
// rotation (the cap takes the head moment).
// HeadFixity (pinned | fixed) is declared in model.hpp.

// ---------------------------------------------------------------------------------------
// 1. Beam on elastic foundation (Hetényi 1946)
// ---------------------------------------------------------------------------------------

struct ElasticPile {
  double bending_stiffness = 0.0;  // EI, kN·m²
  double subgrade_modulus = 0.0;   // kh, horizontal modulus of subgrade reaction, kN/m³
  double width = 0.0;              // D, m (diameter or side facing the load)
  double embedded_length = 0.0;    // L, m; 0 = not known, the pile is taken as long (noted)
  HeadFixity head = HeadFixity::pinned;
};

struct LateralHeadStiffness {
  double winkler_modulus = 0.0;   // k = kh·D, kN/m²
  double lambda = 0.0;            // λ = [k/(4EI)]^(1/4), 1/m
  double long_pile_length = 0.0;  // π/λ, m: a pile longer than this is "long"
  bool long_pile = true;          // L > π/λ (or L not given)
  // Head stiffness matrix relating (H, M0) to (y0, θ0), see the sign convention above.
  double k_hh = 0.0;  // kN/m
  double k_hm = 0.0;  // kN/rad (= kN·m/m)
  double k_mm = 0.0;  // kN·m/rad
  // Lateral spring for the head fixity: pinned k_hh − k_hm²/k_mm; fixed k_hh. kN/m.
  double lateral_stiffness = 0.0;
  // Fixed head: magnitude of the head moment per unit head shear, m (1/(2λ) for a long
  // pile); pinned: 0.
  double head_moment_per_shear = 0.0;
  std::vector<std::string> notes;
};

// Head stiffness of a pile on a Winkler foundation. Long pile (Hetényi 1946, semi-infinite
// beam): k_hh = k/λ, k_hm = −k/(2λ²), k_mm = k/(2λ³); pinned head k/(2λ), fixed head k/λ
// with head moment H/(2λ). A pile with L ≤ π/λ is solved as a finite beam with a free tip
// (noted). Requires EI, kh, D > 0 and L ≥ 0; throws std::invalid_argument otherwise.
LateralHeadStiffness lateral_head_stiffness(const ElasticPile& pile);

// Head stiffness of a finite beam of length L on a Winkler foundation with a free tip (no
// moment, no shear), whatever its length. Exposed for checks; lateral_head_stiffness()
// picks the long-pile closed form or this. Requires EI, kh, D, L > 0.
LateralHeadStiffness finite_pile_head_stiffness(const ElasticPile& pile);

struct LateralHeadResponse {
  double deflection = 0.0;        // y0, m
  double rotation = 0.0;          // θ0, rad (0 for a fixed head)
  double head_moment = 0.0;       // magnitude of the fixing moment, kN·m (0 for a pinned head)
  double max_moment = 0.0;        // largest |M| along the pile, kN·m
  double max_moment_depth = 0.0;  // m below the head where it occurs
};

// Response of the pile to a head shear H (kN) with the head fixity of `pile`. Long pile
// (Hetényi 1946): pinned y0 = 2Hλ/k, θ0 = 2Hλ²/k, Mmax = 0.3224·H/λ at z = π/(4λ); fixed
// y0 = Hλ/k, M0 = H/(2λ). Shorter piles: the finite beam, moments found along it.
// Requires the same as lateral_head_stiffness().
LateralHeadResponse lateral_head_response(const ElasticPile& pile, double shear);

// The bending moment along a pile under a unit head shear and under a unit head moment
// (each with the head free to rotate; Hetényi's convention), sampled at `samples` + 1 depths
// from the head to the tip (a long pile: to 2π/λ, past its first and largest peak): any head
// action (H, M0) in a plane gives M(z) = H·per_shear(z) + M0·per_moment(z) (superposition,
// Hetényi 1946). Requires the same as lateral_head_stiffness() and samples ≥ 2.
struct MomentInfluence {
  std::vector<double> depth;       // m below the head
  std::vector<double> per_shear;   // m (kN·m per kN)
  std::vector<double> per_moment;  // kN·m per kN·m
};
MomentInfluence moment_influence(const ElasticPile& pile, int samples = 400);

// ---------------------------------------------------------------------------------------
// 2. Broms (1964) ultimate lateral resistance
// ---------------------------------------------------------------------------------------

// Broms' relative stiffness for cohesive soil: β = [kh·D/(4EI)]^(1/4), 1/m (Broms 1964a).
// Requires all inputs > 0.
double broms_beta(double subgrade_modulus, double width, double bending_stiffness);

// Broms' relative stiffness for cohesionless soil: η = (nh/EI)^(1/5), 1/m, nh the rate of
// increase of the horizontal subgrade modulus with depth, kN/m³ (Broms 1964b).
// Requires both inputs > 0.
double broms_eta(double modulus_gradient, double bending_stiffness);

enum class PileLengthClass { short_pile, intermediate, long_pile };

// Broms' classification. Cohesive: βL < 1.5 short, βL > 2.5 long. Cohesionless: ηL < 2
// short, ηL > 4 long. Between: intermediate. (Broms 1964a/b; from memory.)
PileLengthClass classify_cohesive(double beta_times_length);
PileLengthClass classify_cohesionless(double eta_times_length);

// The mechanism that governs the ultimate lateral load.
//   short_pile:   the pile rotates (free head) or translates (fixed head) as a rigid body
//   intermediate: fixed head only — yield at the head, the pile then rotates
//   long_pile:    yield in the pile below the ground (and at the head if fixed)
enum class BromsMode { short_pile, intermediate, long_pile };

struct BromsInput {
  SoilKind soil = SoilKind::clay;     // clay: cohesive (cu); sand: cohesionless (γ', φ')
  double undrained_strength = 0.0;    // cu, kPa (clay)
  double effective_unit_weight = 0.0; // γ', kN/m³ (sand)
  double friction_angle = 0.0;        // φ', degrees (sand)
  double width = 0.0;                 // D, m
  double embedded_length = 0.0;       // L, m
  double eccentricity = 0.0;          // e, m: height of the applied H above the ground
  std::optional<double> yield_moment; // My, kN·m; absent: the short-pile mechanism only, an
                                      // upper bound for checks of the formulas — cairn's
                                      // pipeline always gives My (section_moment.hpp)
  HeadFixity head = HeadFixity::pinned;
};

struct BromsResult {
  double ultimate_load = 0.0;     // H_ult, kN
  BromsMode mode = BromsMode::short_pile;
  double reaction_length = 0.0;   // Broms' f, m: clay f = H/(9cu·D) (below 1.5D);
                                  // sand f = √[H/(1.5γ'·D·Kp)] (depth of zero shear)
  double max_moment = 0.0;        // largest moment in the pile at H_ult, kN·m
  double max_moment_depth = 0.0;  // m below the ground; negative = at the head above it
  double passive_coefficient = 0.0;  // Kp = tan²(45° + φ'/2) (sand), else 0
  std::vector<std::string> notes;
};

// Ultimate lateral resistance of a single pile by Broms (1964a, b). Cohesive: soil reaction
// 9cu·D below 1.5D. Cohesionless: 3Kp·γ'·D·z. Formulas in docs/methods-lateral.md
// (Broms 1964a/b). Requires D, L > 0, e ≥ 0, cu > 0 (clay) or γ' > 0 and 0 < φ' < 90
// (sand), L > 1.5D (clay), My > 0 when given; throws std::invalid_argument otherwise.
BromsResult broms_ultimate_lateral(const BromsInput& input);

// Factor of safety applied to Broms' ultimate load when no other is given:
// kLateralFactorOfSafety, 2.5 (core/defaults.hpp). Common practice (2.0 with load tests,
// 2.5–3.0 from calculation alone).

// Allowable lateral load H_ult / FS, kN. Requires ultimate ≥ 0 and FS ≥ 1.
double allowable_lateral_load(double ultimate_load,
                              double factor_of_safety = kLateralFactorOfSafety);

// ---------------------------------------------------------------------------------------
// 3. Structural capacity of the pile section
// ---------------------------------------------------------------------------------------

struct ConcreteSection {
  double gross_area = 0.0;          // Ag, m²
  double steel_area = 0.0;          // Ast, m² of longitudinal reinforcement
  double concrete_strength = 0.0;   // f'c, kPa
  double steel_yield = 0.0;         // fy, kPa (may be 0 when Ast = 0)
};

// Nominal axial strength of a reinforced concrete section, kN:
// Po = 0.85·f'c·(Ag − Ast) + fy·Ast (ACI 318-19 eq. 22.4.2.2, from memory). Requires
// Ag > 0, 0 ≤ Ast < Ag, f'c > 0, fy ≥ 0.
double concrete_nominal_axial_strength(const ConcreteSection& section);

// factor · Po, kN. The factor is the caller's: e.g. φ·0.80 = 0.65 × 0.80 for a tied
// section in ACI 318-19 (Table 22.4.2.1, 21.2.2; from memory), or an allowable-stress
// factor. Requires 0 < factor ≤ 1.
double concrete_axial_capacity(const ConcreteSection& section, double factor);

// factor · fy · A, kN, for a steel section of area A (m²) and yield stress fy (kPa), e.g.
// factor = 0.5 for an allowable stress 0.5·fy. Requires A, fy > 0 and 0 < factor ≤ 1.
double steel_axial_capacity(double area, double yield_stress, double factor);

// Utilization of a section under axial load P and moment M: |P|/Pc + |M|/Mc, the straight
// line between pure axial capacity Pc (kN) and pure bending capacity Mc (kN·m). Common
// practice, conservative inside the usual interaction curves. Requires Pc, Mc > 0.
double axial_bending_utilization(double axial, double axial_capacity, double moment,
                                 double moment_capacity);

const char* to_string(HeadFixity head);
const char* to_string(BromsMode mode);
const char* to_string(PileLengthClass length_class);

}  // namespace cairn
