// group.hpp — how a group of piles under a rigid cap acts as a whole: its plan layout
// (grid, spacing, edge distance), its efficiency, block failure in clay, group uplift,
// and its settlement (single pile by Vesić, group by Vesić's rule and by an equivalent
// footing), plus the axial pile-head stiffness taken as a secant from the settlement.
//
// Inputs are plain values: pile positions and widths in plan (m), a SoilProfile
// (soil.hpp: depths m, unit weights kN/m³, strengths and moduli kPa), loads in kN.
// Outputs are plain structs in SI (m, kN, kPa, kN/m); settlements are in m. Every choice
// made for the caller (a default, a cap, a method that does not apply) is a text note.
//
// Methods and sources (equations in docs/methods-group.md):
//   efficiency   Converse–Labarre; Los Angeles Group Action; Feld (1943); block-perimeter
//                rule (Das, Principles of Foundation Engineering, from memory)
//   block        Terzaghi & Peck block failure with Skempton (1951) Nc
//   settlement   Vesić (1977) NCHRP Synthesis 42; equivalent footing at 2/3 depth with a
//                2V:1H spread (FHWA 1996); Terzaghi one-dimensional consolidation
// Nothing here prints, reads files or keeps state.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "cairn/core/defaults.hpp"
#include "cairn/geotechnics/methods.hpp"
#include "cairn/geotechnics/soil.hpp"
#include "cairn/core/units.hpp"

namespace cairn {

// ---------------------------------------------------------------------------------------
// Layout
// ---------------------------------------------------------------------------------------

struct PlanPoint {
  double x = 0.0;  // m
  double y = 0.0;  // m
};

// One pile head in plan. Square sections are taken with their sides parallel to x and y.
struct PilePlan {
  std::string id;
  double x = 0.0;      // m, centre of the pile head
  double y = 0.0;      // m
  double width = 0.0;  // m, diameter (round) or side (square)
  bool round = true;
};

// Default tolerance on positions and spacings when detecting a grid, m (common practice:
// coordinates copied from a drawing agree to the millimetre; 10 mm leaves room for rounding).
inline constexpr double kGridTolerance = 0.010;
// Minimum centre-to-centre spacing, in pile widths: kMinSpacingFactor (core/defaults.hpp).
// Minimum clear distance from the side of a pile to the cap edge, m (AASHTO LRFD
// 10.7.1.2: 9 in = 225 mm, from memory).
inline constexpr double kMinEdgeDistance = 0.225;

// A rectangular grid aligned with x and y: `rows` lines of constant y, `columns` lines of
// constant x, equal spacing along each axis.
struct GridLayout {
  bool regular = false;
  std::size_t rows = 0;     // number of distinct y positions (m in the efficiency formulas)
  std::size_t columns = 0;  // number of distinct x positions (n)
  double spacing_x = 0.0;   // m, centre-to-centre between columns (0 for one column)
  double spacing_y = 0.0;   // m, between rows (0 for one row)
  std::string reason;       // why the layout is not a grid; empty when regular
};

// Detects a full rectangular grid aligned with x and y: every row/column crossing holds
// exactly one pile and spacings are uniform, all within `tolerance` (m). Grids rotated in
// plan are reported as irregular. Throws std::invalid_argument for no piles or tolerance ≤ 0.
// `units`: the system the notes and reasons quote lengths in (computation stays in SI).
GridLayout detect_grid(const std::vector<PilePlan>& piles, double tolerance = kGridTolerance,
                       UnitSystem units = UnitSystem::SI);

struct SpacingViolation {
  std::string first, second;  // pile ids
  double distance = 0.0;      // m, centre to centre
  double required = 0.0;      // m
  // Battered piles: where the axes come closest, m below the pile heads (distance is then
  // the closest approach of the axes); absent for the centre-to-centre distance at the heads.
  std::optional<double> depth;
};

struct SpacingCheck {
  double smallest = 0.0;  // m, smallest centre-to-centre distance (0 for a single pile)
  std::vector<SpacingViolation> violations;
  std::vector<std::string> notes;
};

// Checks every pair against required = max(factor · max(wi, wj), absolute_minimum), the
// larger width of the two governing. Requires factor > 0, absolute_minimum ≥ 0.
SpacingCheck check_spacing(const std::vector<PilePlan>& piles,
                           double factor = kMinSpacingFactor, double absolute_minimum = 0.0,
                           UnitSystem units = UnitSystem::SI);

struct EdgeDistance {
  std::string id;
  double distance = 0.0;  // m, clear distance from the pile face to the nearest cap edge;
                          // negative when the pile section crosses the edge
  bool ok = true;         // distance ≥ minimum
};

struct EdgeCheck {
  double minimum = 0.0;              // m
  std::vector<EdgeDistance> piles;   // in the order given
  std::vector<std::string> offenders;  // ids of piles closer than the minimum
};

// Clear distance from each pile face to the cap outline (a simple polygon, corners in
// either order, m). Throws std::invalid_argument when the outline has fewer than 3
// corners or a pile centre lies outside it (naming the pile).
EdgeCheck check_edge_distance(const std::vector<PilePlan>& piles,
                              const std::vector<PlanPoint>& outline,
                              double minimum = kMinEdgeDistance);

// Outer-to-outer plan dimensions of the group (pile width included), m: width ≤ length.
struct BlockPlan {
  double width = 0.0;   // Bg
  double length = 0.0;  // Lg
};

// Bg × Lg of the rectangle, aligned with x and y, that encloses all pile sections.
// Throws std::invalid_argument for no piles.
BlockPlan block_plan(const std::vector<PilePlan>& piles);

// ---------------------------------------------------------------------------------------
// Efficiency
// ---------------------------------------------------------------------------------------

// EfficiencyMethod and its table (name, formula, source): methods.hpp.
// Names used in input and output: "none", "converse-labarre", "los-angeles", "feld",
// "block-perimeter".
const char* to_string(EfficiencyMethod method);
std::optional<EfficiencyMethod> efficiency_method_from_string(const std::string& name);

struct Efficiency {
  EfficiencyMethod method = EfficiencyMethod::none;
  std::optional<double> value;  // η; absent when the method does not apply
  std::string note;             // why it does not apply, or the choice made (may be empty)
};

struct EfficiencySummary {
  GridLayout grid;
  std::vector<Efficiency> all;  // one per method, in the enum's order
};

// η of the group by one method. Grid methods (all but `none`) need a regular grid and
// equal pile widths; otherwise value is absent and note says "does not apply: …".
//   converse-labarre  η = 1 − θ[(n1−1)n2 + (n2−1)n1]/(90 n1 n2), θ = atan(D/s) in degrees
//   los-angeles       η = 1 − D/(π s m n)·[m(n−1) + n(m−1) + √2 (m−1)(n−1)]
//   feld              each pile loses 1/16 per adjacent pile (orthogonal or diagonal)
//   block-perimeter   η = min(1, 2(Bg + Lg) / (n·p)), p = perimeter of one pile
// With unequal x and y spacings the smaller spacing is used (noted).
Efficiency group_efficiency(EfficiencyMethod method, const std::vector<PilePlan>& piles,
                            double tolerance = kGridTolerance, UnitSystem units = UnitSystem::SI);

// Every method side by side, with the grid they were computed on.
EfficiencySummary all_efficiencies(const std::vector<PilePlan>& piles,
                                   double tolerance = kGridTolerance,
                                   UnitSystem units = UnitSystem::SI);

// Which part of the single-pile capacity η reduces.
enum class EfficiencyApplies { whole, shaft_only };

// Σ capacity after efficiency, kN: η(ΣQp + ΣQs) for `whole`, ΣQp + η ΣQs for `shaft_only`.
// Requires sums ≥ 0 and 0 < η.
double efficient_capacity(double sum_tip, double sum_shaft, double efficiency,
                          EfficiencyApplies applies = EfficiencyApplies::whole);

// ---------------------------------------------------------------------------------------
// Block failure and group capacity
// ---------------------------------------------------------------------------------------

// Skempton (1951) bearing capacity factor for a rectangular footing in clay (φ = 0):
// Nc = 5 (1 + 0.2 B/L)(1 + 0.2 D/B), D/B capped at 2.5 (so Nc ≤ 7.5 (1 + 0.2 B/L)).
// Requires 0 ≤ B/L ≤ 1 and D/B ≥ 0.
double skempton_nc(double width_over_length, double depth_over_width);

struct BlockCapacity {
  bool applies = false;    // false when the soil below the tips is not clay
  double capacity = 0.0;   // kN, Q_block = base + perimeter
  double base = 0.0;       // kN, Bg·Lg·cu(base)·Nc
  double perimeter = 0.0;  // kN, 2(Bg + Lg)·Σ cu·ΔL
  double nc = 0.0;         // Skempton Nc used
  double base_strength = 0.0;  // kPa, cu of the layer below the tips
  std::vector<std::string> notes;
};

// Block failure of the group in clay (Terzaghi & Peck; UFC 3-220-20 (2025) Eq. 6-38): Q_block =
// Bg·Lg·cu(base)·Nc + 2(Bg + Lg)·Σ cu·ΔL over the layers between the pile heads
// (head_depth) and the tips (tip_depth), depths below the ground surface in m, Nc by
// Skempton with D = tip_depth. Sand layers crossed add no perimeter shear (noted).
// Throws std::invalid_argument when the tips lie below the profile or a clay layer used
// has no undrained_strength.
BlockCapacity block_capacity_clay(const SoilProfile& profile, const BlockPlan& plan,
                                  double head_depth, double tip_depth);

enum class GroupGoverning { efficiency, block };

struct GroupCapacity {
  double efficient_sum = 0.0;     // kN, η·Σ single (as from efficient_capacity)
  std::optional<double> block;    // kN, when block failure applies
  double capacity = 0.0;          // kN, min of the two
  GroupGoverning governs = GroupGoverning::efficiency;
};

// Group capacity = min(η·Σ single, Q_block) (UFC 3-220-20 (2025) Eq. 6-37); the block is ignored when it
// does not apply. Requires efficient_sum ≥ 0.
GroupCapacity group_capacity(double efficient_sum, const BlockCapacity& block);

struct GroupUplift {
  double weight = 0.0;           // kN, effective weight of the soil block Bg·Lg·Σγ'ΔL
  double perimeter_shear = 0.0;  // kN, 2(Bg + Lg)·Σ τ·ΔL
  double resistance = 0.0;       // kN, weight + perimeter_shear
  double tension = 0.0;          // kN, total tension applied to the group
  std::optional<double> factor_of_safety;  // resistance / tension; absent when tension = 0
  std::vector<std::string> notes;
};

// Uplift of the soil–pile block between head_depth and tip_depth (m below ground): the
// effective weight of the block (γ above the water table, γsat − γw below) plus shear on
// its perimeter, cu in clay and K0·σ'v·tanφ' in sand (K0 = 1 − sinφ', Jaky).
// The piles' weight in excess of the soil they replace is ignored (conservative, noted).
// Throws std::invalid_argument naming the layer and field when data is missing, or when
// the tips lie below the profile or tension < 0.
GroupUplift group_uplift(const SoilProfile& profile, const BlockPlan& plan,
                         double head_depth, double tip_depth, double tension);

// ---------------------------------------------------------------------------------------
// Settlement
// ---------------------------------------------------------------------------------------

// Tolerable total settlement when none is given: kDefaultSettlementLimit, 25 mm
// (core/defaults.hpp).

// A single pile for Vesić's (1977) settlement method.
struct VesicPile {
  double width = 0.0;        // D, m (diameter or side)
  bool round = true;         // Ap = πD²/4 and p = πD; square: D² and 4D
  double length = 0.0;       // L, m, embedded length
  double pile_modulus = 0.0; // Ep, kPa
  double material_area = 0.0;  // m², of the section's material for the shortening (a pipe's
                               // wall); 0: the gross area
  double soil_modulus_tip = 0.0;    // Es below the tip, kPa (elastic route only)
  double soil_modulus_shaft = 0.0;  // Es along the shaft, kPa (elastic route only)
  double poisson_ratio = 0.3;       // μs of the soil
  // ξ for the distribution of shaft friction: 0.5 uniform or parabolic, 0.67 triangular
  // with zero at the head, 0.33 triangular with maximum at the head (Vesić 1977).
  double xi = 0.5;
};

struct WorkingLoadSplit {
  double tip = 0.0;    // Qwp, kN
  double shaft = 0.0;  // Qws, kN
};

// Splits a working load between tip and shaft in proportion to their ultimate values:
// Qwp = Q·Qpu/(Qpu + Qsu). Requires Q ≥ 0, ultimates ≥ 0 with a positive sum.
WorkingLoadSplit split_working_load(double working_load, double ultimate_tip,
                                    double ultimate_shaft);

struct VesicSettlement {
  double shortening = 0.0;  // s1, m
  double tip = 0.0;         // s2, m
  double shaft = 0.0;       // s3, m
  double total = 0.0;       // m
  double tip_load = 0.0;    // Qwp, kN
  double shaft_load = 0.0;  // Qws, kN
  std::vector<std::string> notes;
};

// Vesić (1977), elastic route:
//   s1 = (Qwp + ξ Qws) L / (Ap Ep)
//   s2 = qwp D (1 − μs²) Iwp / Es,tip,          qwp = Qwp/Ap, Iwp = 0.85
//   s3 = (Qws / (p L)) (D / Es,shaft)(1 − μs²) Iws,   Iws = 2 + 0.35 √(L/D)
// Requires positive D, L, Ep, Es (tip, shaft), loads ≥ 0, 0 ≤ μs < 0.5, 0 ≤ ξ ≤ 1.
VesicSettlement vesic_settlement(const VesicPile& pile, const WorkingLoadSplit& load);

// Vesić (1977), empirical route for s2 and s3 (s1 as above):
//   s2 = Qwp Cp / (D qp),  s3 = Qws Cs / (L qp),  Cs = (0.93 + 0.16 √(L/D)) Cp
// with qp the ultimate unit tip resistance (kPa). Requires Cp > 0, qp > 0.
VesicSettlement vesic_settlement_empirical(const VesicPile& pile, const WorkingLoadSplit& load,
                                           double cp, double unit_tip_resistance);

// Vesić's group rule: sg = s·√(Bg/D), Bg the group width (outer to outer), m.
// Requires s ≥ 0, Bg > 0, D > 0.
double vesic_group_settlement(double single_settlement, double group_width, double pile_width);

// Vertical stress added at depth z (m) below an equivalent footing Bg × Lg carrying `load`
// (kN), spread 2V:1H: Δσ = Q/((Bg + z)(Lg + z)), kPa (FHWA 1996). Requires z ≥ 0, load ≥ 0.
double spread_stress(double load, const BlockPlan& plan, double depth_below_footing);

// Where the equivalent footing is placed.
enum class FootingLevel {
  bearing_stratum,  // 2/3 of the pile length within the layer holding the tips (FHWA 1996)
  embedment,        // 2/3 of the whole embedded length below the pile heads
};

struct EquivalentFootingOptions {
  FootingLevel level = FootingLevel::bearing_stratum;
  double sublayer_thickness = 0.5;  // m, largest sublayer (split also at layer boundaries
                                    // and the water table)
  // Stop where Δσ < cutoff·σ'v0 at a sublayer's middle (common practice, 10 %); 0 = never.
  double stress_ratio_cutoff = 0.10;
  std::optional<double> max_depth;  // m below the footing; absent = bottom of the profile
  UnitSystem units = UnitSystem::SI;  // the system the notes quote depths in
};

struct Sublayer {
  std::string layer;         // name of the soil layer
  SoilKind kind = SoilKind::sand;
  double top = 0.0;          // m below ground
  double bottom = 0.0;       // m below ground
  double initial_stress = 0.0;  // σ'v0 at the middle, kPa
  double added_stress = 0.0;    // Δσ at the middle, kPa
  double settlement = 0.0;      // m
  std::string branch;  // "elastic", "recompression", "recompression + virgin", "virgin"
};

// A field a computation needed and the profile did not give.
struct MissingField {
  std::string layer;  // layer name
  int line = 0;       // the layer's line in the project file (0 = unknown)
  std::string field;  // soil.hpp field name, e.g. "compression_index"
  std::string message;  // plain text naming layer and field
};

struct EquivalentFootingSettlement {
  double footing_depth = 0.0;  // m below ground
  double width = 0.0;          // Bg at the footing, m
  double length = 0.0;         // Lg at the footing, m
  double bottom = 0.0;         // m below ground, where the summation stopped
  std::vector<Sublayer> sublayers;
  std::optional<double> total;  // m; absent when data is missing
  std::vector<MissingField> missing;
  std::vector<std::string> notes;
};

// Settlement of the group as an equivalent footing Bg × Lg carrying `load` (kN) at the
// level chosen in `options`, the stress spread 2V:1H below it (Δσ = Q/((Bg+z)(Lg+z))).
// Sublayers: sand Δs = Δσ·h/Es; clay by one-dimensional consolidation with Cc, Cr, e0, σ'p
// (normally and over-consolidated branches). Missing soil data is listed in `missing`
// (every layer and field found), and `total` is then absent. Throws std::invalid_argument
// for load < 0, tips below the profile, or bad options.
EquivalentFootingSettlement equivalent_footing_settlement(
    const SoilProfile& profile, const BlockPlan& plan, double head_depth, double tip_depth,
    double load, const EquivalentFootingOptions& options = {});

struct SettlementCheck {
  double settlement = 0.0;  // m
  double limit = 0.0;       // m
  bool ok = true;
  std::vector<std::string> notes;
};

// Compares a settlement with the tolerable value; without a limit, 25 mm is used and noted.
// Requires settlement ≥ 0 and limit > 0.
SettlementCheck check_settlement(double settlement, std::optional<double> limit = std::nullopt,
                                 UnitSystem units = UnitSystem::SI);

// ---------------------------------------------------------------------------------------
// Axial pile-head stiffness
// ---------------------------------------------------------------------------------------

struct SecantStiffness {
  double load = 0.0;        // kN, service load
  double settlement = 0.0;  // m, Vesić single-pile settlement under it
  double stiffness = 0.0;   // kN/m, k = Q/s
  std::vector<std::string> notes;
};

// Axial head stiffness as the secant k = Q/s from Vesić's single-pile settlement (elastic
// route) at the service load, split between tip and shaft by their ultimate values.
// Requires service_load > 0 (plus vesic_settlement's requirements).
SecantStiffness axial_head_stiffness(const VesicPile& pile, double service_load,
                                     double ultimate_tip, double ultimate_shaft);

}  // namespace cairn
