// pile_soil_curves.hpp — what the soil gives one pile of a project for the nonlinear soil
// response: its p-y, t-z and Q-z curves, built from the soil profile and the pile type, as a
// NonlinearPileSpec for pile_head_response (nonlinear_pile.hpp).
//
// Lateral: each layer names its p-y curve (`lateral_curve:`, one row of lateral_curve_table();
// a new curve is one value in LateralCurve, soil.hpp, and one row here):
//   soft_clay       Matlock (1970), clay below water
//   stiff_clay_dry  Welch & Reese (1972), stiff clay without free water
//   sand_api        API RP 2GEO sand (O'Neill & Murchison 1983)
//   stiff_clay_wet  Reese, Cox & Koop (1975), stiff clay with free water (cu uniform in the
//                   layer; ε50 and k from cu by the paper's classes unless given)
//   sand_reese      Reese, Cox & Koop (1974) sand (k from φ' by the paper's density classes
//                   unless modulus_gradient is given)
// The curve at a point of the pile is the one of the layer at that point's depth below the
// ground surface, d = Cap::depth + z·cos i (z along the pile from its head, i the batter
// angle), with the curve's depth d and γ' = σ'v(d)/d (the mean effective unit weight above
// it: σ'v from the soil column, water included). Defaults (from memory):
//   ε50 from cu (Reese & Van Impe 2001's table after Reese, Cox & Koop 1975 and Peck, Hanson
//   & Thornburn's consistency classes): cu < 24 kPa 0.020, < 48 0.010, < 96 0.007,
//   < 192 0.005, beyond 0.004;
//   k of API sand (modulus_gradient, kN/m³: the initial slope of p-y grows as k·d) from φ' by
//   the relative-density classes of API RP 2GEO's chart (O'Neill & Murchison 1983): loose
//   (φ' < 30°) 20 lb/in³ below the water table, 25 above; medium (30° ≤ φ' ≤ 36°) 60 and 90;
//   dense (φ' > 36°) 125 and 225; 1 lb/in³ = 271.447 kN/m³.
// Axial: API RP 2GEO t-z (clay or sand, by the layer's kind) with t_max = the unit shaft
// friction of the pile type's shaft method at that depth (unit_shaft_at, capacity.hpp) times
// the perimeter, in tension times the layer's uplift factor (default_uplift_factor when it
// gives none); Q-z with Q_p the ultimate tip resistance of the pile type's tip method
// (pile_capacity). Both curves are the ultimate ones, without factors.
// Pile: EI = E·I and EA = E·A of the section's material (PileType::material_inertia and
// material_area: a pipe's wall with structure.wall_thickness), the head
// restraint, torsional stiffness and tension of the pile type.
//
// Units: kN, m, kPa, kN/m³.
#pragma once

#include <cstddef>
#include <functional>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "cairn/core/model.hpp"
#include "cairn/geotechnics/py_curves.hpp"
#include "cairn/geotechnics/soil.hpp"
#include "cairn/solver/nonlinear_pile.hpp"

namespace cairn {

// Where one p-y curve is built: a layer, a depth below the ground surface and its stresses.
struct CurveSite {
  const SoilLayer* layer = nullptr;
  double depth = 0.0;                  // d, m below the ground surface
  double effective_stress = 0.0;       // σ'v at d, kPa
  double effective_unit_weight = 0.0;  // γ' = σ'v/d (the layer's own at d = 0), kN/m³
  bool below_water = false;
  double width = 0.0;  // b, m
  PyLoading loading = PyLoading::static_load;
  double cycles = 1.0;  // N, for the cyclic curves that count cycles
};

// One p-y model: its name in the project file, its soil, source, and how it is built.
struct LateralCurveInfo {
  LateralCurve curve;
  const char* name;         // the value of `lateral_curve:`
  SoilKind soil;            // the layers it is for
  const char* description;  // in plain words, with the source
  // The layer's problems for this curve (missing values with no default), in plain words
  // naming the key ("needs undrained_strength").
  std::vector<std::string> (*problems)(const SoilLayer& layer);
  // p(y) at the site (kN/m, odd in y). Requires problems(layer) empty.
  std::function<double(double)> (*build)(const CurveSite& site);
};

// Every p-y model, in the order of LateralCurve.
const std::vector<LateralCurveInfo>& lateral_curve_table();
const LateralCurveInfo& lateral_curve_info(LateralCurve curve);
std::optional<LateralCurve> parse_lateral_curve(std::string_view name);
const char* to_string(LateralCurve curve);

// ε50 for a clay of undrained strength cu (kPa), the table in the header (from memory).
double default_strain_50(double undrained_strength);
// k of API sand (kN/m³) for φ' (degrees) above or below the water table (from memory).
double default_sand_modulus(double friction_angle, bool below_water);

// Choices for the curves that are not properties of the soil.
struct NonlinearSoilOptions {
  // Static or cyclic p-y curves; none: the project's analysis.lateral_loading.
  std::optional<PyLoading> loading;
  // N for Welch & Reese's cyclic stiff clay; none: the project's analysis.load_cycles (1 when
  // it gives none: the curves that need N are a located problem then, nonlinear_soil_problems).
  std::optional<double> cycles;
  int segments = 60;  // finite-difference segments along the pile
};

// A value the nonlinear mode needs and the project lacks, located at the layer or pile type.
struct SoilCurveProblem {
  SourceLocation where;
  std::string message;  // "soil layer 'clay': lateral_curve: missing; expected one of …"
};

// Every problem that stops nonlinear_pile_spec for the project's piles: the layers the piles
// cross (head to tip, by depth below the ground) without lateral_curve or with a curve lacking
// a value; pile types without elastic_modulus or without tip and shaft methods (the axial
// curves come from them) or whose capacity cannot be computed. Empty when every pile can be
// built. Locations: the project file with the layer's or pile type's line.
std::vector<SoilCurveProblem> nonlinear_soil_problems(const Project& project);

// The same problems raised as one InputError (exit status 2); nothing when there are none.
void require_nonlinear_soil(const Project& project);

// Pile `pile` of the project (index into Project::piles) on its soil curves: head at (x, y, 0),
// axis, length, EI, EA, width, restraint, torsion, tension, and the curves of the header.
// Requires a soil profile and an empty nonlinear_soil_problems(); throws std::invalid_argument
// otherwise (naming the first problem).
NonlinearPileSpec nonlinear_pile_spec(const Project& project, std::size_t pile,
                                      const NonlinearSoilOptions& options = {});

// The curves of a pile that keeps the share `factor` of its design stiffness (a damaged pile
// of the as-built survey, stiffness_factor; site/as_built.hpp): every resistance multiplied by
// the factor at every displacement,
//   p_f(z, y) = f·p(z, y),   t_f(z, w) = f·t(z, w),   Q_f(w) = f·Q(w).
// The description says so. Requires factor > 0; a factor of 1 returns the curves unchanged.
PileCurves scaled_curves(const PileCurves& curves, double factor);

// A damaged pile that keeps the share `factor` of its design stiffness: its curves scaled
// (scaled_curves) and its own stiffnesses too (EI, EA, the head's rotational restraint k_r,
// the torsional k_t), so the pile and its soil are one system scaled by f: at every head
// movement the pile takes the same deflected shape and its head action, its tangent and every
// internal force along it (the axial force of its P-Δ term included) are f times the sound
// pile's (docs/methods-nonlinear.md §7), as a linear run multiplies its head stiffness by f.
// Requires factor > 0; a factor of 1 returns the pile unchanged.
NonlinearPileSpec scaled_pile(NonlinearPileSpec pile, double factor);

}  // namespace cairn
