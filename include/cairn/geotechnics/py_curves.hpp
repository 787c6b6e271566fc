// py_curves.hpp — nonlinear lateral soil resistance p(y) along a pile: the p-y curves of the
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
//  - Sand, Reese, Cox & Koop (1974), "Analysis of laterally loaded piles in sand", OTC 2080
//    (from memory; a different model from the tanh form above):
//        p_s = min[(C1·z + C2·b)·γ'·z, C3·b·γ'·z]   (the same wedge and flow as above)
//        p_u = A·p_s at y_u = 3b/80,  p_m = B·p_s at y_m = b/60
//        A = A_s (static) or A_c (cyclic), B = B_s or B_c: the paper's empirical factors against
//        z/b, read from its chart (from memory, tabulated in py_curves.cpp; constant beyond
//        z/b = 5: A = 0.88, B_s = 0.50, B_c = 0.55)
//        initial line p = k·z·y; parabola p = C̄·y^(1/n) from y_k to y_m with
//        m = (p_u − p_m)/(y_u − y_m), n = p_m/(m·y_m), C̄ = p_m/y_m^(1/n),
//        y_k = (C̄/(k·z))^(n/(n−1)); straight line from (y_m, p_m) to (y_u, p_u); p_u beyond.
//    k from the paper's table by density (sand_subgrade_modulus).
//  - Stiff clay with free water, Reese, Cox & Koop (1975), "Field testing and analysis of
//    laterally loaded piles in stiff clay", OTC 2312 (from memory):
//        p_c = min(2·c_a·b + γ'·b·z + 2.83·c_a·z, 11·c·b)   c_a: the average strength over z
//        y50 = ε50·b (no 2.5 here), initial line p = k·z·y (k_s static, k_c cyclic)
//        static, from the initial line's intersection:
//          p = 0.5·p_c·(y/y50)^0.5                                     up to A_s·y50
//          p = 0.5·p_c·(y/y50)^0.5 − 0.055·p_c·((y − A_s·y50)/(A_s·y50))^1.25   to 6·A_s·y50
//          p = 0.5·p_c·(6·A_s)^0.5 − 0.411·p_c − 0.0625·p_c·(y − 6·A_s·y50)/y50  to 18·A_s·y50
//          p = p_c·(1.225·A_s^0.5 − 0.75·A_s − 0.411)                 beyond
//        cyclic, y_p = 4.1·A_c·y50:
//          p = A_c·p_c·(1 − |(y − 0.45·y_p)/(0.45·y_p)|^2.5)           up to 0.6·y_p
//          p = 0.936·A_c·p_c − 0.085·p_c·(y − 0.6·y_p)/y50              to 1.8·y_p
//          p = 0.936·A_c·p_c − 0.102·p_c·y_p/y50                       beyond
//        A_s, A_c against z/b from the paper's chart (from memory, tabulated in py_curves.cpp;
//        0.60 and 0.30 at depth). The static curve softens after its peak, and near the surface
//        (A_s < 0.223) its residual would turn negative: cairn holds p ≥ 0.
//    The initial line takes over wherever it lies below the rest of the curve: p = min(k·z·y,
//    curve), which is the papers' "from the intersection with the initial straight line".
// Units: kN, m, kPa, kN/m³, degrees where named. Depths z are below the ground surface.
// initial_slope(z) (kN/m², p per metre of deflection) is the tangent at y = 0, the spring a
// linear analysis with the same soil would use; Matlock's and Welch & Reese's curves start
// vertical and have none.
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
  double initial_slope(double depth) const;          // k·z, kN/m²
};

// Reese, Cox & Koop (1974) sand. Requires 0 < φ' < 90, γ', b, k > 0, z ≥ 0.
struct SandReesePy {
  double friction_angle = 0.0;         // φ', degrees
  double effective_unit_weight = 0.0;  // γ', kN/m³
  double width = 0.0;                  // b, m
  double initial_modulus = 0.0;        // k, kN/m³
  PyLoading loading = PyLoading::static_load;
  double theoretical(double depth) const;  // p_s = min(wedge, flow), kN/m
  double factor_a(double depth) const;     // A_s or A_c
  double factor_b(double depth) const;     // B_s or B_c
  double ultimate(double depth) const;     // p_u = A·p_s, kN/m
  double y_m() const;                      // b/60, m
  double y_u() const;                      // 3b/80, m
  double initial_slope(double depth) const;  // k·z, kN/m²
  double resistance(double depth, double y) const;  // p, kN/m
};

// Reese, Cox & Koop (1974), k for sand by relative density (from memory): below the water
// table 5.4, 16.3, 34 MN/m³ (20, 60, 125 lb/in³) for loose, medium, dense; above it 6.8, 24.4,
// 61 MN/m³ (25, 90, 225 lb/in³). Returns kN/m³.
enum class SandDensity { loose, medium, dense };
double sand_subgrade_modulus(SandDensity density, bool below_water_table);

// Reese, Cox & Koop (1975) stiff clay with free water. The strength grows linearly with depth,
// c(z) = c0 + g·z, so the average above z is c_a = c0 + g·z/2. Requires c0, γ', b, ε50, k > 0,
// g ≥ 0, z ≥ 0.
struct StiffClayWetPy {
  double undrained_strength = 0.0;     // c0, kPa, at the ground surface
  double strength_gradient = 0.0;      // g, kPa/m
  double effective_unit_weight = 0.0;  // γ', kN/m³
  double width = 0.0;                  // b, m
  double strain_50 = 0.005;            // ε50
  double initial_modulus = 0.0;        // k_s (static) or k_c (cyclic), kN/m³
  PyLoading loading = PyLoading::static_load;
  double strength(double depth) const;          // c, kPa
  double average_strength(double depth) const;  // c_a, kPa
  double ultimate(double depth) const;          // p_c, kN/m
  double y50() const;                           // ε50·b, m
  double factor_a(double depth) const;          // A_s or A_c
  // k·z, kN/m²; cyclic: the lesser of k·z and the parabola's own slope 2.5·p_c/(1.845·y50).
  double initial_slope(double depth) const;
  double resistance(double depth, double y) const;  // p, kN/m
};

// Reese, Cox & Koop (1975) defaults by the average undrained strength c_a (kPa), from memory:
// k_s = 135, 270, 540 MN/m³ and k_c = 55, 110, 217 MN/m³ (500, 1000, 2000 and 200, 400, 800
// lb/in³) for c_a of 50–100, 100–200, 200–400 kPa; ε50 = 0.007, 0.005, 0.004. Between the
// classes' middles (75, 150, 300 kPa) cairn interpolates on a straight line and holds the end
// values outside. Returns kN/m³ and the strain.
double stiff_clay_subgrade_modulus(double average_strength, PyLoading loading);
double stiff_clay_strain_50(double average_strength);

}  // namespace cairn
