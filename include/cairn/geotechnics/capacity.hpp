// capacity.hpp — ultimate axial capacity of a single pile computed from a layered soil
// profile: tip (base) resistance, shaft resistance layer by layer, tension (uplift)
// capacity, allowable values (ultimate / factor of safety) and factored values (φ·R), and
// the capacity against pile length so the engineer can choose a length.
//
// Inputs: a SoilProfile (depths m from the ground surface, unit weights kN/m³, strengths
// and moduli kPa, angles degrees), a PileGeometry (m, kN/m³) and a PileDesign (methods,
// factors). Outputs in kN (forces) and kPa (unit resistances); depths m below the ground.
// Stresses, layers and boundaries come from the soil column (soil.hpp): a tip on a layer
// boundary bears on the layer below; σv from the unit weights, u = γw·(z − zw), σ'v = σv − u.
// Near a boundary the tip follows Meyerhof's (1976) transitions over 10 diameters. Unit tip
// and shaft resistances are limited by the method's own limits, or by a stated default where
// the method's source gives none; max_unit_tip / max_unit_shaft are the engineer's override.
//
// Methods: the tables of methods.hpp (name, soils, inputs, resistance factors, formula
// text, source); each formula is written beside its code here and in
// docs/methods-capacity.md. Beta in sand and meyerhof-spt are limited to 1 tsf (Meyerhof
// 1976; a default where the method's source gives none).
// Shaft friction is integrated along the shaft with Gauss–Legendre quadrature on short
// sub-intervals (≤ 5 cm) split at the water table and at every kink the method introduces,
// so a unit friction proportional to σ'v is integrated exactly.
// Resistance factors: AASHTO LRFD Bridge Design Specifications, Table 10.5.5.2.3-1 (driven
// piles) and Table 10.5.5.2.4-1 (drilled shafts), from memory.
#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "cairn/geotechnics/methods.hpp"
#include "cairn/geotechnics/soil.hpp"
#include "cairn/core/units.hpp"

namespace cairn {

// Shape and position of one pile. The shaft runs from head_depth to head_depth + length.
struct PileGeometry {
  double width = 0.0;         // m: diameter (round) or side (square)
  bool round = true;          // round or square section
  double length = 0.0;        // m, pile head to tip (vertical pile)
  double head_depth = 0.0;    // m, pile head below the ground surface
  double unit_weight = 24.0;  // kN/m³, pile material, for the effective weight in uplift
  UnitSystem units = UnitSystem::SI;  // units of the numbers quoted in notes and messages

  double area() const;       // m², gross cross-section (also the tip area)
  double perimeter() const;  // m
  double tip_depth() const { return head_depth + length; }  // m below the ground surface
};

// Intermediate values of the tip calculation; a value the method does not use is empty.
struct TipDetails {
  std::string method;  // method name as in to_string(TipMethod); "none" without a method
  std::optional<TipMethod> tip_method;  // the method; empty without one
  // The bearing layer's values the tip was computed from, as the layer gives them (empty
  // where it gives none), so a report needs not look the layer up: φ in degrees, cu and Es
  // in kPa, N60 in blows/0.3 m.
  std::optional<double> friction_angle, undrained_strength, soil_modulus, spt_n60;
  std::string layer;   // bearing layer (the layer the tip ends in)
  SoilKind kind = SoilKind::sand;
  double depth = 0.0;                            // m below the ground surface
  double area = 0.0;                             // m², tip area
  double q_prime = 0.0;                          // q' = σ'v at the tip, kPa
  std::optional<double> sigma_o;                 // σ'o = (1 + 2K0)/3·q', kPa (Vesić sand)
  std::optional<double> k0;                      // K0 = 1 − sin φ (Vesić sand)
  std::optional<double> poisson_ratio;           // μs used (Vesić sand)
  std::optional<double> volumetric_strain;       // Δ used (Vesić sand)
  std::optional<double> rigidity_index;          // Ir
  std::optional<double> reduced_rigidity_index;  // Irr
  std::optional<double> n_sigma;                 // N*σ (Vesić sand)
  std::optional<double> n_c;                     // N*c (clay: Vesić, Meyerhof 9, O'Neill & Reese)
  std::optional<double> n_q;                     // N*q (Meyerhof sand)
  std::optional<double> penetration;             // m, penetration into the bearing layer
  std::optional<double> reduction;               // factor applied (shallow base, wide base)
  std::optional<double> limit;                   // kPa, the limiting unit tip applied
  std::string limit_source;  // where `limit` comes from, in plain words (method, default, engineer)
  bool limit_default = false;  // `limit` is cairn's default (the method's source gives none)
  std::string governed_by;     // the limit that governed the unit tip; empty when none did
  std::optional<double> layer_unit_tip;  // kPa, the bearing layer's own value, when a
                                         // transition near a boundary changed it
  std::string transition;        // the transition applied, in plain words; empty when none
  std::string transition_short;  // the same in a few words, for the capacity-with-depth table
  double unit_tip = 0.0;  // kPa, unit tip resistance used (after every limit and transition)
  bool limited = false;   // a limit governed (governed_by says which)
  std::optional<double> bored_factor;            // bored pile, sand tip by a driven-pile
                                                 // method: Meyerhof's (1976) 1/3
};

// Shaft resistance of the part of one layer crossed by the shaft.
struct LayerShaft {
  std::string name;
  SoilKind kind = SoilKind::sand;
  std::string method;   // to_string(ShaftMethod), or "none"
  std::optional<ShaftMethod> shaft_method;  // the method; empty without one
  std::optional<double> lambda;  // λ used (lambda method: given, or from the chart)
  double top = 0.0;     // m below the ground surface, top of the part crossed
  double bottom = 0.0;  // m below the ground surface
  double shaft = 0.0;   // kN, ultimate, compression
  double uplift = 0.0;  // kN, ultimate shaft resistance in tension = shaft · uplift_factor
  double uplift_factor = 1.0;
  double unit_average = 0.0;  // kPa, shaft / (perimeter · (bottom − top))
  double phi_shaft = 0.0;     // resistance factor used on `shaft`
  double phi_uplift = 0.0;    // resistance factor used on `uplift`
  std::optional<double> limit;  // kPa, limiting unit shaft friction applied; empty: none
  std::string limit_source;     // where `limit` comes from, in plain words
  bool limit_default = false;   // `limit` is cairn's default (the method's source gives none)
  bool limited = false;         // the limit governed somewhere in the layer
};

struct CapacityResult {
  double tip = 0.0;                    // kN, ultimate
  double shaft = 0.0;                  // kN, ultimate, compression
  double ultimate_compression = 0.0;   // kN, tip + shaft
  double uplift_shaft = 0.0;           // kN, ultimate shaft resistance in tension
  double pile_weight = 0.0;            // kN, effective (buoyant below the water table)
  double ultimate_tension = 0.0;       // kN, uplift_shaft + pile_weight
  double allowable_compression = 0.0;  // kN
  double allowable_tension = 0.0;      // kN
  double factored_compression = 0.0;   // kN, φtip·tip + Σ φshaft·shaft
  double factored_tension = 0.0;       // kN, Σ φuplift·uplift (weight not included, see notes)
  double safety_factor_tip = 0.0;      // factors of safety used
  double safety_factor_shaft = 0.0;
  double safety_factor_tension = 0.0;
  double phi_tip = 0.0;     // resistance factors used; phi_shaft and phi_uplift are the
  double phi_shaft = 0.0;   // resistance-weighted means over the layers (each layer's own
  double phi_uplift = 0.0;  // factor is in `layers`)
  TipDetails tip_details;
  std::vector<LayerShaft> layers;  // from the pile head down
  std::vector<std::string> limits;  // every limit that governed, in plain words
  std::vector<std::string> notes;   // choices made for the user, in plain words
};

// One row of the capacity-with-depth table.
struct DepthRow {
  double length = 0.0;     // m, pile head to tip
  double tip_depth = 0.0;  // m below the ground surface
  double tip = 0.0;        // kN, ultimate
  double shaft = 0.0;      // kN, ultimate
  double ultimate = 0.0;   // kN, tip + shaft
  double tension = 0.0;    // kN, ultimate tension (uplift shaft + effective weight)
  std::string note;        // a transition or tip limit that shapes this row, in a few words
  // The same length on the service and strength bases (CapacityResult's fields), kN.
  double allowable_compression = 0.0, allowable_tension = 0.0;
  double factored_compression = 0.0, factored_tension = 0.0;
};

// ---- Profile and design --------------------------------------------------------------

// Problems that stop the computation for this profile, pile and design, in plain words
// naming the layer and the property, e.g. "layer 'dense sand': method 'vesic' needs
// soil_modulus". Shaft properties are checked in the layers the shaft crosses and tip
// properties in the layer the tip ends in and the layers within 10 D of the tip (Meyerhof's
// transitions); with table_min_length (m), for every length of
// capacity_with_depth from that length to the profile's base. Empty when the computation
// can run.
std::vector<std::string> validate_design(const SoilProfile& profile, const PileGeometry& pile,
                                         const PileDesign& design,
                                         std::optional<double> table_min_length = std::nullopt);

// Whether a method applies to a kind of soil (e.g. alpha-api to clay only).
bool applies_to(TipMethod method, SoilKind kind);
bool applies_to(ShaftMethod method, SoilKind kind);

// Valid method names, as written in a project file (and as to_string returns them).
std::vector<std::string> tip_method_names();
std::vector<std::string> shaft_method_names();
// The method named `name`, or empty when no method has that name.
std::optional<TipMethod> parse_tip_method(std::string_view name);
std::optional<ShaftMethod> parse_shaft_method(std::string_view name);

// Layers, water and stresses with depth: SoilColumn (soil.hpp), with its rules for boundaries
// and missing unit weights.

// ---- Tip building blocks (unit resistances in kPa) ------------------------------------

// Vesić (1977) N*σ = 3/(3 − sinφ) · exp[(π/2 − φ)·tanφ] · tan²(45° + φ/2)
//                    · Irr^(4·sinφ / [3·(1 + sinφ)]).  Requires 0 ≤ φ < 90°, Irr ≥ 1.
double vesic_n_sigma(double phi_deg, double irr);
// Vesić (1977) N*c = (N*σ − 1)·cotφ; for φ = 0 the limit N*c = 4/3·(ln Irr + 1) + π/2 + 1.
double vesic_n_c(double phi_deg, double irr);
// Rigidity index of sand, Vesić (1977): Ir = Es / [2·(1 + μs)·q'·tanφ]. Requires q' > 0.
double vesic_rigidity_index_sand(double es, double poisson, double q_prime, double phi_deg);
// Reduced rigidity index, Vesić (1977): Irr = Ir / (1 + Ir·Δ).
double vesic_reduced_rigidity_index(double ir, double volumetric_strain);
// Correlations for sand with φrel = (φ − 25°)/20° clamped to [0, 1] (attributed to Chen &
// Kulhawy 1994, EPRI TR-104601): μs = 0.1 + 0.3·φrel; Δ = 0.005·(1 − φrel)·q'/pa.
double sand_poisson_ratio(double phi_deg);
double sand_volumetric_strain(double phi_deg, double q_prime);
// Fit to O'Neill & Reese's (1999) tabulated Ir for clay: Ir = 347·(cu/pa) − 33, clamped to
// ≤ 300. Throws std::invalid_argument below cu/pa = 0.25, where the fit is not used.
double clay_rigidity_index_fit(double cu);
// O'Neill & Reese (1999) table of Ir against cu (cu/pa = 0.25 → 50, 0.5 → 150, ≥ 1.0 →
// 300, from memory), interpolated linearly. Throws std::invalid_argument below cu/pa = 0.25.
double clay_rigidity_index_table(double cu);

// Meyerhof (1976) N*q against φ (degrees, 20–45; clamped outside), interpolated in
// log N*q between whole degrees from a recalled tabulation of the chart (from memory).
double meyerhof_nq(double phi_deg);
// Meyerhof (1976) limiting unit tip in sand: ql = 0.5·pa·N*q·tanφ, kPa.
double meyerhof_limit(double n_q, double phi_deg);
// Meyerhof (1976) SPT tip in sand: qp = 0.4·pa·N60·Db/D ≤ 4·pa·N60, kPa.
double meyerhof_spt_tip(double n60, double penetration, double width);
// Meyerhof (1976) SPT unit shaft friction: pa·N60/50 (driven, displacement piles) or
// pa·N60/100 (bored), kPa; the driven value is limited to 1 tsf = 95.76 kPa (FHWA-HI-97-013).
double meyerhof_spt_shaft(double n60, Installation installation);
// O'Neill & Reese (1999) drilled-shaft tip in clay: N*c = 1.33·(ln Ir + 1) ≤ 9.
double oneill_reese_n_c(double ir);
// O'Neill & Reese (1999) drilled-shaft tip in sand: qp = 0.6·N60 tsf ≤ 30 tsf (57.46 kPa per
// blow ≤ 2873 kPa; the SI form 0.057·N60 MPa rounds it), kPa, before the wide-base factor.
double oneill_reese_sand_tip(double n60);
// O'Neill & Reese (1999) factor for a base wider than 1.27 m: 1.27/Bb (Bb in m), else 1.
double oneill_reese_wide_base_factor(double base_width);

// ---- Shaft building blocks -------------------------------------------------------------

// API RP 2GEO α: 0.5·ψ^−0.5 (ψ ≤ 1), 0.5·ψ^−0.25 (ψ > 1), α ≤ 1, ψ = cu/σ'v.
// Requires ψ > 0; ψ = +∞ (σ'v = 0) gives 0.
double api_alpha(double psi);
// O'Neill & Reese (1999) α for drilled shafts in clay: 0.55 for cu/pa ≤ 1.5,
// 0.55 − 0.1·(cu/pa − 1.5) up to cu/pa = 2.5; held at 0.45 above (outside the method).
double oneill_reese_alpha(double cu);
// O'Neill & Reese (1999) β for drilled shafts in sand: 1.5 − 0.245·√z (z m below the
// ground surface), 0.25 ≤ β ≤ 1.2, times N60/15 when N60 < 15.
double oneill_reese_beta(double z, double n60);
// Vijayvergiya & Focht (1972) λ against pile penetration (m), from a recalled tabulation
// of their chart (from memory), interpolated linearly; constant (0.110) beyond 70 m.
double vijayvergiya_focht_lambda(double penetration);
// Vijayvergiya & Focht (1972) mean unit shaft friction f = λ·(σ̄'v + 2·c̄u), kPa.
double lambda_unit_shaft(double lambda, double mean_effective_stress, double mean_cu);

// ---- Factors ---------------------------------------------------------------------------

// AASHTO LRFD resistance factors (Table 10.5.5.2.3-1 driven / 10.5.5.2.4-1 drilled shafts,
// from memory) for a tip method, a shaft method in compression and in tension.
double aashto_phi_tip(TipMethod method, SoilKind kind, Installation installation);
double aashto_phi_shaft(ShaftMethod method, SoilKind kind, Installation installation);
double aashto_phi_uplift(ShaftMethod method, SoilKind kind, Installation installation);

// Whether AASHTO LRFD calibrated a resistance factor for this method on this installation:
// the drilled-shaft table (10.5.5.2.4-1) holds O'Neill & Reese's (1999) methods (fhwa,
// alpha-fhwa, beta-fhwa) only, the driven-pile table (10.5.5.2.3-1) the others. Where it did
// not, aashto_phi_* return the factor of the table that holds the method (from memory).
bool aashto_calibrated(TipMethod method, Installation installation);
bool aashto_calibrated(ShaftMethod method, Installation installation);

// Cautions on a pile type whose methods were developed for the other installation, or whose
// default resistance factors were calibrated for another method or installation, in plain
// words ("tip method 'vesic' (sand) on a bored pile: …"). Empty when there is nothing to say.
std::vector<std::string> installation_cautions(const PileDesign& design);

// Meyerhof (1976): a bored pile's unit tip in sand is about 1/3 of a driven pile's, its unit
// shaft friction about 1/2 (from memory). The 1/3 is applied to sand tips computed on a
// bored pile by vesic, meyerhof or meyerhof-spt; the 1/2 is in meyerhof_spt_shaft.
inline constexpr double kMeyerhofBoredTipFactor = 1.0 / 3.0;

// Shaft resistance in tension / in compression when the layer gives none: 1.0 for clay,
// 2/3 for sand (common practice, from memory).
double default_uplift_factor(SoilKind kind);

// ---- The computation -------------------------------------------------------------------

// Capacity of one vertical pile. Requires design.computes_capacity() and an empty
// validate_design(); throws std::invalid_argument otherwise (with the first problem).
CapacityResult pile_capacity(const SoilProfile& profile, const PileGeometry& pile,
                             const PileDesign& design);

// The unit shaft friction in compression (kPa, after the method's limit and the engineer's
// max_unit_shaft) at each of `depths` (m below the ground surface): the function pile_capacity
// integrates, for the nonlinear axial curves (t_max of the t-z curves); the λ method gives its
// mean over the clay it covers. 0 outside the shaft and in a soil without a shaft method.
// Requires an empty validate_design(); throws std::invalid_argument otherwise.
std::vector<double> unit_shaft_at(const SoilProfile& profile, const PileGeometry& pile,
                                  const PileDesign& design, const std::vector<double>& depths);

// The most rows a capacity-with-depth table may have: a table for reading, and a bound on
// the work a step typed on the command line can ask for.
inline constexpr std::size_t kMaxDepthRows = 10000;

// The number of rows of a capacity-with-depth table from `min_length` in steps of `step`
// down to `longest` (all m): 0 when min_length > longest. Requires step > 0.
double depth_table_rows(double longest, double step, double min_length);

// pile_capacity for lengths min_length, min_length + step, … up to the profile's base
// (tip ≤ profile depth). Requires step > 0, min_length > 0, at most kMaxDepthRows rows and
// an empty validate_design(profile, pile, design, min_length); throws std::invalid_argument.
std::vector<DepthRow> capacity_with_depth(const SoilProfile& profile, PileGeometry pile,
                                          const PileDesign& design, double step, double min_length);

}  // namespace cairn
