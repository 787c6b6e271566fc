// soil.hpp — plain data for a layered soil profile and for how a pile type's capacity is
// to be computed from it (installation, tip and shaft methods, factors).
//
// Units (SI inside, as everywhere in cairn): depths and thicknesses m, unit weights kN/m³,
// strengths and moduli kPa, angles degrees. Depths are measured down from the ground
// surface; a pile's head lies at Cap::depth below it.
#pragma once

#include <optional>
#include <string>
#include <vector>

namespace cairn {

// clay: undrained, total stress (cu); sand: drained, effective stress (φ').
enum class SoilKind { clay, sand };

struct SoilLayer {
  std::string name;
  SoilKind kind = SoilKind::sand;
  double thickness = 0.0;                       // m
  std::optional<double> unit_weight;            // kN/m³, above the water table
  std::optional<double> saturated_unit_weight;  // kN/m³, below it
  std::optional<double> undrained_strength;     // cu, kPa (clay)
  std::optional<double> friction_angle;         // φ', degrees (sand)
  std::optional<double> soil_modulus;           // Es, kPa
  std::optional<double> poisson_ratio;          // μs
  std::optional<double> volumetric_strain;      // Δ, for the reduced rigidity index
  std::optional<double> shaft_k;                // K, lateral earth pressure coefficient
  std::optional<double> shaft_delta;            // δ, pile–soil friction angle, degrees
  std::optional<double> spt_n60;                // N60, blows/0.3 m
  std::optional<double> max_unit_shaft;         // limit on unit shaft friction, kPa
  std::optional<double> max_unit_tip;           // limit on unit tip resistance, kPa
  std::optional<double> meyerhof_nq;            // N*q given instead of the chart
  std::optional<double> lambda;                 // λ given instead of the chart
  std::optional<double> uplift_factor;          // shaft resistance in tension / in compression
  // Consolidation (clay), for the group settlement of issue 4.
  std::optional<double> compression_index;      // Cc
  std::optional<double> recompression_index;    // Cr
  std::optional<double> void_ratio;             // e0
  std::optional<double> preconsolidation;       // σ'p, kPa
  std::optional<double> subgrade_modulus;       // kh, horizontal, kN/m³
  int line = 0;                                 // 1-based line in the project file, for messages
};

struct SoilProfile {
  std::optional<double> water_table;  // depth below the ground surface, m; none = no water
  std::vector<SoilLayer> layers;      // from the ground surface down
  // Elevation of the ground surface on the project's datum, m (positive up); none = tip
  // elevations are not shown. Depths stay measured from the ground surface.
  std::optional<double> ground_level;
  double depth() const;               // m, total thickness
};

enum class Installation { driven, bored };

enum class TipMethod { vesic, meyerhof, meyerhof_spt, fhwa };
enum class ShaftMethod { beta, alpha_api, alpha_fhwa, lambda, beta_fhwa, meyerhof_spt };

// How a pile type's capacity is computed from the soil. Absent methods: no computed capacity.
struct PileDesign {
  Installation installation = Installation::driven;
  std::optional<TipMethod> tip_clay, tip_sand;
  std::optional<ShaftMethod> shaft_clay, shaft_sand;
  std::optional<double> critical_depth_diameters;  // optional critical depth for β, in D
  // Factors of safety for service checks (defaults: common practice, see docs/methods.md).
  std::optional<double> safety_factor;              // one global factor, compression
  std::optional<double> safety_factor_tip, safety_factor_shaft;
  std::optional<double> safety_factor_tension;
  // Resistance factors φ for strength checks; defaults from AASHTO LRFD section 10.
  std::optional<double> phi_tip, phi_shaft, phi_uplift;

  bool computes_capacity() const {
    return tip_clay || tip_sand || shaft_clay || shaft_sand;
  }
};

const char* to_string(SoilKind);
const char* to_string(Installation);
const char* to_string(TipMethod);
const char* to_string(ShaftMethod);

}  // namespace cairn
