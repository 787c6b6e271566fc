// methods.hpp — one table per kind of method a project file can name: the tip methods, the
// shaft methods and the group efficiency methods. Each row holds the method's name (the key
// word written in a project file and printed in every output), the soils it applies to, the
// layer values it needs, its default resistance factors where it has them, and its formula in
// words for the reports. The input reader, the capacity computation (capacity.cpp), the
// group computation (group.cpp) and the renderers all read these tables: a new method is a
// new enum value, a new row here, its formula in capacity.cpp or group.cpp, and its tests.
//
// Methods and sources (equations beside their code in capacity.cpp and group.cpp, and in
// docs/methods-capacity.md and docs/methods-group.md):
//   tip   vesic        Vesić (1977), NCHRP Synthesis 42: cavity expansion, N*σ and N*c;
//                      sand limited by default to Meyerhof's (1976) 0.5·pa·N*q·tanφ
//         meyerhof     Meyerhof (1976), JGED 102(GT3): q'·N*q ≤ 0.5·pa·N*q·tanφ; clay 9·cu
//         meyerhof-spt Meyerhof (1976): 0.4·pa·N60·Db/D ≤ 4·pa·N60 (sand)
//         fhwa         O'Neill & Reese (1999), FHWA-IF-99-025, drilled shafts
//   shaft beta         f = K·σ'v·tanδ;  alpha-api  API RP 2GEO α(ψ);  lambda  Vijayvergiya
//                      & Focht (1972);  alpha-fhwa / beta-fhwa  O'Neill & Reese (1999);
//                      meyerhof-spt  f = pa·N60/50 (driven) or /100 (bored)
//   efficiency         none; Converse–Labarre; Los Angeles Group Action; Feld (1943);
//                      block-perimeter rule (Das, Principles of Foundation Engineering)
// Resistance factors: AASHTO LRFD Bridge Design Specifications, Table 10.5.5.2.3-1 (driven
// piles) and Table 10.5.5.2.4-1 (drilled shafts), from memory. A method developed for one
// installation and used on the other takes the factor of the driven-pile table's row for its
// kind of analysis (the values in the rows below).
#pragma once

#include <map>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "cairn/core/units.hpp"
#include "cairn/geotechnics/soil.hpp"

namespace cairn {

// 1 short ton-force per square foot in kPa: 2000 lbf · 4.4482216152605 N/lbf / (0.3048 m)²
// (NIST SP 811 (2008), Appendix B: 1 lbf = 4.4482216152605 N, 1 ft = 0.3048 m). O'Neill &
// Reese (1999) and Meyerhof (1976) state their limits in tsf.
inline constexpr double kTsf = unit_si::ton_per_square_foot;

enum class EfficiencyMethod { none, converse_labarre, los_angeles, feld, block_perimeter };

// A value a method needs from a layer: its key in the project file and the layer's field.
struct LayerInput {
  const char* key;
  std::optional<double> SoilLayer::*field;
};

// A resistance factor φ for each kind of soil.
struct PhiBySoil {
  double clay = 0.0;
  double sand = 0.0;
  double of(SoilKind kind) const { return kind == SoilKind::clay ? clay : sand; }
};

struct TipMethodInfo {
  TipMethod method;
  const char* name;                 // as written in a project file: "vesic"
  bool clay = false, sand = false;  // the soils it applies to
  // Values needed in the layer the tip bears on (and the layers within Meyerhof's 10 D).
  std::vector<LayerInput> needs_clay, needs_sand;
  // Clay: soil_modulus needed below cu/pa = 0.25, where the tabulated Ir starts.
  bool clay_modulus_below_quarter_pa = false;
  Installation developed_for = Installation::driven;
  PhiBySoil phi_driven, phi_bored;  // default φ on a driven / a bored pile
  const char* formula_clay = "";  // unit tip in words, "q_p = cu·N*c"; "" where it does not apply
  const char* formula_sand = "";
  const char* source = "";  // "Vesić 1977"
  const char* formula(SoilKind kind) const {
    return kind == SoilKind::clay ? formula_clay : formula_sand;
  }
};

struct ShaftMethodInfo {
  ShaftMethod method;
  const char* name;                 // as written in a project file: "alpha-api"
  bool clay = false, sand = false;  // the soils it applies to
  std::vector<LayerInput> needs;    // values needed in every layer the shaft crosses
  Installation developed_for = Installation::driven;
  PhiBySoil phi_driven, phi_bored;                // default φ in compression
  PhiBySoil phi_uplift_driven, phi_uplift_bored;  // default φ in tension
  const char* formula = "";  // unit shaft friction in words, "f = K·σ'v·tan δ"
  const char* source = "";
  // The method's own limit on the unit shaft friction, kPa, on a driven / a bored pile
  // (empty: its source gives none), and where it comes from.
  std::optional<double> limit_driven, limit_bored;
  const char* limit_source = "";
  // Where the source gives no limit, sand takes Meyerhof's (1976) 1 tsf by default.
  bool default_limit_in_sand = false;
};

struct EfficiencyMethodInfo {
  EfficiencyMethod method;
  const char* name;          // as written in a project file: "converse-labarre"
  bool needs_grid = true;    // applies to a regular grid of equal piles only
  const char* formula = "";  // η in words
  const char* source = "";
};

// The tables, in the order of the enums (the order names are listed in messages).
const std::vector<TipMethodInfo>& tip_methods();
const std::vector<ShaftMethodInfo>& shaft_methods();
const std::vector<EfficiencyMethodInfo>& efficiency_methods();

// The row of a method.
const TipMethodInfo& method_info(TipMethod method);
const ShaftMethodInfo& method_info(ShaftMethod method);
const EfficiencyMethodInfo& method_info(EfficiencyMethod method);

// The method written `name` in a project file, or empty.
std::optional<TipMethod> find_tip_method(std::string_view name);
std::optional<ShaftMethod> find_shaft_method(std::string_view name);
std::optional<EfficiencyMethod> find_efficiency_method(std::string_view name);

// Name → method, for the input reader's choices.
std::map<std::string, TipMethod> tip_method_choices();
std::map<std::string, ShaftMethod> shaft_method_choices();
// The efficiency names, in the table's order.
std::vector<std::string> efficiency_method_names();

}  // namespace cairn
