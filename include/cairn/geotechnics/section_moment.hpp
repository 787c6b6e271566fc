// section_moment.hpp — the bending capacity of a pile section: the yield moment My that
// Broms' (1964) long and intermediate mechanisms need.
//
// Sections are square or round, solid or hollow (a wall thickness t), bent about an axis
// parallel to a side (square) or a diameter (round). Units: m, kPa, kN, kN·m; axial force P
// compression positive.
//   steel     fully plastic moment, fy·Z at P = 0, reduced for P by the fully plastic stress
//             distribution (±fy about a shifted neutral axis) — plastic, because Broms'
//             mechanisms assume a hinge that turns at constant moment, which a compact
//             section develops (Neal 1977, The Plastic Methods of Structural Analysis, ch. 1
//             and 6, from memory). Plastic moduli: solid square b³/4, hollow square
//             (b³ − (b−2t)³)/4, solid round D³/6, pipe (D³ − (D−2t)³)/6.
//   concrete  nominal moment Mn at P by strain compatibility with the ACI 318-19 rectangular
//             stress block: εcu = 0.003 (22.2.2.1), 0.85·f'c over a = β1·c (22.2.2.4.1),
//             β1 from Table 22.2.2.4.3, bars elastic–perfectly plastic with Es = 200 GPa
//             (20.2.2.2) (all from memory). Unfactored: Broms' H_ult is factored later.
//   timber    Fb·S, S the elastic modulus (timber breaks in bending without a plastic
//             reserve): square b³/6, round πD³/32; the axial force is not included.
#pragma once

#include <optional>
#include <string>

#include "cairn/core/model.hpp"

namespace cairn {

// Modulus of elasticity of structural steel, kPa: 200 GPa (AISC 360-16 uses 29 000 ksi; from
// memory). For the bars' strain and the compactness limits.
inline constexpr double kSteelModulus = 200e6;

// The axis a square section is bent about: parallel to a side, or its diagonal (weaker for
// the elastic modulus by √2 and for the plastic modulus by 2√2/3). Ignored for round sections.
enum class BendingAxis { side, diagonal };

// Area (m²), plastic modulus Z (m³) and elastic modulus S = I/c (m³) of a square or round
// section of width (side or diameter) b and wall t; t = 0 means solid. Diagonal of a solid
// square: Z = b³/(3√2), S = √2·b³/12. Requires b > 0 and 0 ≤ t < b/2; throws
// std::invalid_argument otherwise.
double section_area(SectionShape shape, double width, double wall = 0.0);
double plastic_modulus(SectionShape shape, double width, double wall = 0.0,
                       BendingAxis axis = BendingAxis::side);
double elastic_modulus(SectionShape shape, double width, double wall = 0.0,
                       BendingAxis axis = BendingAxis::side);

// Fully plastic moment of a steel section under axial force P (either sign), kN·m:
// M = fy·2·Q(y0), Q(y0) the first moment about the centroid of the part above the neutral
// axis y0, chosen so that fy·(A_above − A_below) = P. Equals fy·Z at P = 0 and 0 at
// |P| = fy·A. Requires fy > 0; returns 0 when |P| ≥ fy·A.
double steel_plastic_moment(SectionShape shape, double width, double wall, double yield_stress,
                            double axial, BendingAxis axis = BendingAxis::side);

// ACI 318-19 Table 22.2.2.4.3: β1 = 0.85 for f'c ≤ 28 MPa, less 0.05 per 7 MPa above it, not
// below 0.65 (from memory). f'c in kPa.
double stress_block_beta1(double concrete_strength);

// A reinforced concrete pile section: bars of equal size, evenly spaced on a circle
// (round) or around the perimeter of a square starting at a corner (square), their centres
// `cover_to_bar_center` in from the face.
struct ReinforcedSection {
  SectionShape shape = SectionShape::round;
  double width = 0.0;                // m, side or diameter
  double concrete_strength = 0.0;    // f'c, kPa
  double steel_yield = 0.0;          // fy of the bars, kPa
  double steel_area = 0.0;           // As, m², all bars together
  int bar_count = 0;                 // number of bars
  double cover_to_bar_center = 0.0;  // m, from the face to the bar centres
};

// Nominal moment capacity Mn at axial force P (compression positive), kN·m, by strain
// compatibility (see the header), bent about `axis` (square). The least over the bar layout's
// orientations is returned: compression on either face, and for a round section a bar on the
// bending plane or two bars either side of it. Returns 0 when P lies outside the section's
// axial range (below −As·fy or above the largest compression). Requires b, f'c, fy, As > 0,
// bar_count ≥ 2 (≥ 4 for a square), 0 < cover < b/2.
double concrete_moment_capacity(const ReinforcedSection& section, double axial,
                                BendingAxis axis = BendingAxis::side);

// The axial forces a pile type carries, kN (compression positive), for a yield moment that
// depends on them. Absent: not known (P = 0 is used, and said).
struct AxialRange {
  double least = 0.0;     // smallest (most tensile) force over all combinations
  double greatest = 0.0;  // largest compressive force
};

// The yield moment of a pile type for Broms, with how it was found in plain words.
struct SectionYieldMoment {
  std::optional<double> value;  // kN·m; absent when the section does not define it
  double axial = 0.0;           // kN, the axial force value was computed at
  std::string basis;            // how it was found, e.g. "My = … for the pipe steel section: …"
  std::string missing;          // why there is no value (when value is absent)
};

// My of a pile type: structure.yield_moment when given; else from the section and material
// (steel, reinforced concrete, timber, see the header) at the least favourable axial force of
// `axial` — both ends of the range are tried, since M(P) is concave, and the lesser kept — and,
// for a square, about the weaker of its side and diagonal axes (the lateral load may come
// from any direction).
// `basis` and `missing` quote forces and moments in `units`.
SectionYieldMoment section_yield_moment(const PileType& type,
                                        const std::optional<AxialRange>& axial,
                                        UnitSystem units);

}  // namespace cairn
