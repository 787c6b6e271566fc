// py_curves.hpp — nonlinear lateral soil resistance p(y) along a pile: the p-y curves of two
// published models, static and cyclic.
//
// p is the soil's resistance per unit length of pile (kN/m) at a lateral deflection y (m), at
// depth z (m) below the ground surface, for a pile of width b (m). Each curve is odd in y
// (p(−y) = −p(y)) and gives its ultimate resistance pu (kN/m).
//
//  - Soft clay below water, Matlock (1970), "Correlations for design of laterally loaded
//    piles in soft clay", OTC 1204 (from memory):
//        pu = min[(3 + γ'z/c + J·z/b)·c·b, 9·c·b],  y50 = 2.5·ε50·b
//        static:  p = 0.5·pu·(y/y50)^(1/3) up to y = 8·y50, pu beyond
//        cyclic:  the same up to 3·y50 (0.72·pu there); beyond, 0.72·pu at depths z ≥ zr, and
//                 above zr falling linearly to 0.72·pu·z/zr at 15·y50 and constant after it,
//                 zr = 6·c·b/(γ'·b + J·c)
//    J = 0.5 for soft clay (0.25 for medium clay, Matlock's field tests), ε50 the strain at
//    half the peak deviator stress (0.020 soft, 0.010 medium, 0.005 stiff: Matlock's table).
//  - Stiff clay without free water, Welch & Reese (1972), "Laterally loaded behavior of drilled
//    shafts", Research Report 3-5-65-89, Center for Highway Research, University of Texas
//    (from memory): pu as Matlock's with J = 0.5, y50 = 2.5·ε50·b,
//        static:  p = 0.5·pu·(y/y50)^(1/4) up to y = 16·y50, pu beyond
//        cyclic (N cycles): the deflection at a given p grows to y_s + 9.6·(p/pu)⁴·y50·log10 N
//  - Sand, the hyperbolic-tangent form of O'Neill & Murchison (1983) adopted by API RP 2GEO
//    (from memory):
//        p = A·pu·tanh(k·z·y/(A·pu)),  A = max(3 − 0.8·z/b, 0.9) static, 0.9 cyclic
//        pu = min[(C1·z + C2·b)·γ'·z, C3·b·γ'·z]
//    with C1, C2, C3 from φ' by the wedge and flow expressions of Reese, Cox & Koop (1974):
//        α = φ'/2, β = 45° + φ'/2, K0 = 0.4, Ka = tan²(45° − φ'/2)
//        C1 = K0·tanφ'·sinβ/(tan(β−φ')·cosα) + tan²β·tanα/tan(β−φ') + K0·tanβ·(tanφ'·sinβ − tanα)
//        C2 = tanβ/tan(β−φ') − Ka
//        C3 = Ka·(tan⁸β − 1) + K0·tanφ'·tan⁴β
//    k (kN/m³) the initial modulus of subgrade reaction, given by the engineer.
// Units: kN, m, kPa, kN/m³, degrees where named.
#pragma once

namespace cairn {

enum class PyLoading { static_load, cyclic };

// Matlock (1970) soft clay. Requires c, γ', b, ε50, J > 0 and z ≥ 0.
struct SoftClayPy {
  double undrained_strength = 0.0;     // c, kPa
  double effective_unit_weight = 0.0;  // γ', kN/m³
  double width = 0.0;                  // b, m
  double strain_50 = 0.02;             // ε50
  double j = 0.5;                      // J
  PyLoading loading = PyLoading::static_load;
  double ultimate(double depth) const;         // pu, kN/m
  double y50() const;                          // m
  double transition_depth() const;             // zr, m
  double resistance(double depth, double y) const;  // p, kN/m
};

// Welch & Reese (1972) stiff clay without free water. `cycles` ≥ 1 (1: the static curve).
// Requires c, γ', b, ε50 > 0 and z ≥ 0.
struct StiffClayDryPy {
  double undrained_strength = 0.0;     // c, kPa
  double effective_unit_weight = 0.0;  // γ', kN/m³
  double width = 0.0;                  // b, m
  double strain_50 = 0.005;            // ε50
  double cycles = 1.0;                 // N
  double ultimate(double depth) const;  // pu, kN/m
  double y50() const;                   // m
  // Deflection at resistance p (0 ≤ p ≤ pu), the curve written the way the paper gives it.
  double deflection(double depth, double p) const;
  double resistance(double depth, double y) const;  // p, kN/m
};

// API RP 2GEO sand (O'Neill & Murchison 1983). Requires 0 < φ' < 90, γ', b, k > 0, z ≥ 0.
struct SandApiPy {
  double friction_angle = 0.0;         // φ', degrees
  double effective_unit_weight = 0.0;  // γ', kN/m³
  double width = 0.0;                  // b, m
  double initial_modulus = 0.0;        // k, kN/m³
  PyLoading loading = PyLoading::static_load;
  double c1() const;
  double c2() const;
  double c3() const;
  double ultimate(double depth) const;         // pu, kN/m
  double factor(double depth) const;           // A
  double resistance(double depth, double y) const;  // p, kN/m
};

}  // namespace cairn
