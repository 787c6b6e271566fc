// soil.hpp — plain data for a layered soil profile and for how a pile type's capacity is
// to be computed from it (installation, tip and shaft methods, factors).
//
// Units (SI inside, as everywhere in cairn): depths and thicknesses m, unit weights kN/m³,
// strengths and moduli kPa, angles degrees. Depths are measured down from the ground
// surface; a pile's head lies at Cap::depth below it.
//
// SoilColumn is the one place that answers questions about the profile with depth: layer
// boundaries, the layer at a depth, the water table, unit weights, total and effective
// vertical stress and pore pressure. Capacity, springs, settlement, block failure, group
// uplift and Broms all ask it, so they share two rules:
//   Boundaries  a depth on the boundary between two layers belongs to the layer BELOW it
//               (the layer a pile tip standing on the boundary bears on); the ground surface
//               belongs to the first layer and the profile's base to the last. Depths within
//               kBoundaryTolerance of a boundary are on it.
//   Weights     above the water table a layer weighs unit_weight, below it
//               saturated_unit_weight; a layer that gives only one of the two uses it on both
//               sides, and weight_substitution() says so in plain words (the input requires
//               at least one). Pore pressure is hydrostatic below the water table,
//               u = γw·(z − zw); water above the ground adds equally to σv and u and is left
//               out of both.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

namespace cairn {

// clay: undrained, total stress (cu); sand: drained, effective stress (φ').
enum class SoilKind { clay, sand };

// The p-y curve of a layer for the nonlinear soil response (pile_soil_curves.hpp holds each
// curve's name in the project file, soil, source and what it needs).
enum class LateralCurve { soft_clay, stiff_clay_dry, sand_api };

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
  // Why the engineer set the limit above, quoted in the output.
  std::optional<std::string> max_unit_shaft_reason, max_unit_tip_reason;
  std::optional<double> meyerhof_nq;            // N*q given instead of the chart
  std::optional<double> lambda;                 // λ given instead of the chart
  std::optional<double> uplift_factor;          // shaft resistance in tension / in compression
  // Consolidation (clay), for the group settlement of issue 4.
  std::optional<double> compression_index;      // Cc
  std::optional<double> recompression_index;    // Cr
  std::optional<double> void_ratio;             // e0
  std::optional<double> preconsolidation;       // σ'p, kPa
  std::optional<double> subgrade_modulus;       // kh, horizontal, kN/m³
  std::optional<double> modulus_gradient;       // nh, kN/m³: Es = nh·z below the pile head
  // Nonlinear soil response (pile_soil_curves.hpp): the layer's p-y curve and ε50 (clay).
  std::optional<LateralCurve> lateral_curve;
  std::optional<double> strain_50;              // ε50, strain at half the peak deviator stress
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

// Depths closer than this to a layer boundary are on it, m (1 µm: round-off in sums of
// thicknesses, never a real distance).
inline constexpr double kBoundaryTolerance = 1e-6;

// The profile seen as a column of soil with depth (rules in the header comment). Holds a
// reference to the profile, which must outlive it. Throws std::invalid_argument when the
// profile has no layers or a layer's thickness is not positive.
class SoilColumn {
 public:
  explicit SoilColumn(const SoilProfile& profile);

  // A part of the column inside one layer, on one side of the water table.
  struct Piece {
    std::size_t layer = 0;
    double top = 0.0;     // m below the ground surface
    double bottom = 0.0;  // m
    bool below_water = false;
  };

  const SoilProfile& profile() const { return profile_; }
  std::size_t size() const { return profile_.layers.size(); }
  const SoilLayer& layer(std::size_t i) const { return profile_.layers.at(i); }
  double top(std::size_t i) const { return boundaries_.at(i); }         // m
  double bottom(std::size_t i) const { return boundaries_.at(i + 1); }  // m
  double depth() const { return boundaries_.back(); }                   // m, the base
  // Top of every layer and the base (size() + 1 values), m.
  const std::vector<double>& boundaries() const { return boundaries_; }
  bool contains(double z) const;  // 0 ≤ z ≤ depth(), within the tolerance

  // Index of the layer holding depth z; on a boundary, the layer below. Depths above the
  // ground give the first layer, below the base the last (callers that must not extend the
  // profile check contains() first).
  std::size_t layer_at(double z) const;

  // The water table used for stresses, m below the ground (clamped at 0); empty: no water.
  std::optional<double> water_level() const;
  bool below_water(double z) const;  // strictly below the water table

  // Total unit weight of layer i above (false) or below (true) the water table, kN/m³, by
  // the weights rule; empty when the layer gives neither weight.
  std::optional<double> unit_weight(std::size_t i, bool below_water) const;
  // The plain-words note when layer i uses its other weight on that side of the water
  // table ("layer 'sand': no saturated_unit_weight, unit_weight used below the water table").
  std::optional<std::string> weight_substitution(std::size_t i, bool below_water) const;
  // Every substitution used between the ground surface and depth z.
  std::vector<std::string> weight_substitutions(double z) const;

  // σv = Σ γ·Δz from the ground surface, u = γw·max(0, z − zw), σ'v = σv − u, at depth z,
  // kPa. Throw std::invalid_argument when z lies outside the profile or a layer above z gives
  // no unit weight.
  double total_stress(double z) const;
  double pore_pressure(double z) const;
  double effective_stress(double z) const;

  // [from, to] cut at the layer boundaries and, when split_at_water, at the water table.
  std::vector<Piece> pieces(double from, double to, bool split_at_water) const;

  // Thickness-weighted mean of a layer property over [from, to] (m; parts below the base
  // take the last layer, above the ground the first). Empty when a layer crossed lacks it;
  // then `lacking` (if given) receives that layer's index. Requires from < to.
  template <class Get>
  std::optional<double> mean(double from, double to, Get&& get,
                             std::vector<std::size_t>* lacking = nullptr) const {
    double sum = 0.0;
    bool ok = true;
    for (const auto& [i, a, b] : spans(from, to)) {
      const std::optional<double> value = get(layer(i));
      if (!value) {
        ok = false;
        if (lacking) lacking->push_back(i);
        continue;
      }
      sum += *value * (b - a);
    }
    if (!ok) return std::nullopt;
    return sum / (to - from);
  }

 private:
  struct Span {
    std::size_t layer;
    double top, bottom;
  };
  // [from, to] cut at the boundaries, extended beyond the ground and the base.
  std::vector<Span> spans(double from, double to) const;

  const SoilProfile& profile_;
  std::vector<double> boundaries_;
};

const char* to_string(SoilKind);
const char* to_string(Installation);
const char* to_string(TipMethod);
const char* to_string(ShaftMethod);

}  // namespace cairn
