// axial_curves.hpp — the axial load-transfer curves of API RP 2GEO for a pile's nonlinear
// axial response: t-z along the shaft, Q-z at the tip (from memory of the practice's tables).
//
// t-z (shaft friction t, kPa, mobilized by the local movement z of the pile, m, of diameter
// D): as a share of the unit friction t_max,
//   clay: z/D = 0, 0.0016, 0.0031, 0.0057, 0.0080, 0.0100, 0.0200, beyond
//         t/tmax = 0, 0.30, 0.50, 0.75, 0.90, 1.00, then the residual share (0.70 to 0.90,
//         the engineer's choice; 0.9 here by default) from z/D = 0.02 on
//   sand: t = t_max·z/0.0025 m up to z = 2.5 mm (0.1 in), t_max beyond.
// Q-z (tip resistance Q as a share of Q_p, the tip capacity, against the tip movement z):
//   z/D = 0, 0.002, 0.013, 0.042, 0.073, 0.100 → Q/Qp = 0, 0.25, 0.50, 0.75, 0.90, 1.00,
//   Qp beyond. Between the points: straight lines. Tension moves the pile's shaft the other
//   way (t odd in z); the tip takes no tension (Q = 0 for z < 0).
// Units: m, and the same force or stress unit in and out.
#pragma once

namespace cairn {

enum class AxialSoil { clay, sand };

// t/t_max at a pile movement z (m) for diameter D (m); odd in z. Requires D > 0 and
// 0 < residual ≤ 1 (clay only).
double shaft_transfer(AxialSoil soil, double diameter, double movement, double residual = 0.9);

// Q/Q_p at a tip movement z (m, positive into the ground) for diameter D (m). Requires D > 0.
double tip_transfer(double diameter, double movement);

}  // namespace cairn
