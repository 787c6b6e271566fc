// beam_column.hpp — one pile under a lateral head load as a beam-column on nonlinear soil
// springs, by finite differences, with the axial load's P-Δ effect.
//
//     EI·y'''' + Q·y'' + p(y, z) = 0          (z down from the head, Q compression > 0)
//
// on n equal segments of length h with two imaginary nodes beyond each end (Reese & Van
// Impe, "Single Piles and Pile Groups Under Lateral Loading", the difference method; from
// memory). Boundary conditions: at the head the shear EI·y''' + Q·y' = H and either the
// moment EI·y'' = M0 or the slope y' = −θ0 (θ0 in Hetényi's convention: positive when a
// positive H turns a free head; a fixed head has θ0 = 0); at the tip, free: EI·y'' = 0 and
// EI·y''' + Q·y' = 0. The soil acts at every node with p(y) per unit length; the nonlinear
// system is solved by secant-stiffness iteration (k_i = p_i/y_i, the curve's own secant), which
// suits the softening curves of py_curves.hpp (Matlock's has an infinite initial slope).
// Moments M = EI·y'' (kN·m), shears V = EI·y''' + Q·y' (kN).
//
// Units: kN, m, kN·m², kN/m.
#pragma once

#include <functional>
#include <string>
#include <vector>

namespace cairn {

struct BeamColumnPile {
  double bending_stiffness = 0.0;  // EI, kN·m²
  double length = 0.0;             // m, head to tip
  double axial = 0.0;              // Q, kN, compression positive (P-Δ)
  int segments = 200;              // n
  // p(z, y): the soil's resistance per unit length (kN/m) at depth z below the head (m)
  // and deflection y (m); odd in y.
  std::function<double(double, double)> soil;
};

struct BeamColumnHead {
  double shear = 0.0;          // H, kN
  bool fixed_slope = false;    // true: the slope is given (θ0); false: the moment M0 is
  double moment = 0.0;         // M0, kN·m (Hetényi's convention)
  double rotation = 0.0;       // θ0, rad
};

struct BeamColumnResult {
  bool converged = false;
  std::string message;              // why not, in plain words
  int iterations = 0;
  std::vector<double> depth;        // m, at the nodes
  std::vector<double> deflection;   // y, m
  std::vector<double> moment;       // M, kN·m
  double head_deflection = 0.0;     // y0, m
  double head_rotation = 0.0;       // θ0 = −y'(0), rad
  double head_moment = 0.0;         // EI·y''(0), kN·m
  double max_moment = 0.0;          // largest |M|, kN·m
  double max_moment_depth = 0.0;    // m
};

// Solves the pile under the head action. Does not throw on non-convergence (e.g. a load
// beyond the soil's capacity, or Q above the buckling load): `converged` is false and
// `message` says so. Requires EI, L > 0, segments ≥ 8 and a soil function; throws
// std::invalid_argument otherwise.
BeamColumnResult solve_beam_column(const BeamColumnPile& pile, const BeamColumnHead& head);

}  // namespace cairn
