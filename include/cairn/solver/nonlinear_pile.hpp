// nonlinear_pile.hpp — one pile held by the cap, on nonlinear soil: the action of the cap on
// the pile head for a given head movement, its tangent stiffness, and the pile's profile with
// depth (deflection, moment, shear, axial force). The building block of the nonlinear group
// analysis (nonlinear_cap.hpp): the cap's six displacements are found by Newton iteration on
// the sum of these head responses.
//
// Conventions (the same as pile_head.hpp and cap_solver.hpp): global axes x, y, z (z up);
// the pile axis a is the unit vector from head to toe; the head moves u (m) and the cap
// rotates ω (rad); the action of the cap on the pile at its head is (F, M) in global axes
// (kN, kN·m about the head): a pile pushed into the ground has F·a > 0. Depths z along the
// pile are measured from the head (m), deflections across the axis.
//
// Lateral: the pile is a beam-column on p-y springs in two orthogonal bending planes (round or
// square sections: the same EI in both), solved with the head deflection prescribed and the
// head rotation held by the cap through the head restraint (pinned: no moment; fixed: the
// cap's rotation; partial: a rotational spring k_r). Axial: the pile is a bar of axial
// rigidity EA on t-z springs along the shaft and a Q-z spring at the tip, the head movement
// along the axis prescribed. Torsion: the linear torsional stiffness where given.
//
// Method (docs/methods-bending.md §8.1):
//  - EI·y'''' + N·y'' + p = 0 on `segments` cubic beam elements, the soil lumped at the nodes
//    over their tributary lengths (at the same spacing, Reese & Van Impe's difference method),
//    P-Δ through the elements' geometric stiffness with N from the axial solution;
//  - the p-y curve acts on the RESULTANT deflection r = |y| of the two planes, along it: nodal
//    force p(z, r)·ŷ, tangent k_sec·(I − ŷŷᵀ) + k_tan·ŷŷᵀ (k_sec = p/r, k_tan = dp/dr), so a
//    skewed deflection meets the same soil as one along an axis;
//  - Newton's method with the curves' tangents (central differences; below 1 µm the secant at
//    1 µm), clipped at 0 in the iteration matrix, the step chosen so the energy falls, a secant
//    step where that matrix is singular; banded LDLᵀ (O(segments) per iteration);
//  - the tangent is the static condensation of the converged tangent system onto the head
//    (not differences of whole solves), with the P-Δ rate of the lateral head forces with the
//    axial movement (the axial force does not depend on the lateral movement: the tangent is
//    not symmetric when N ≠ 0).
// Results that cannot be had (buckling, a head deflection beyond `deflection_limit`, springs
// that do not settle) come back as converged = false with a message; malformed specs throw
// std::invalid_argument.
//
// Units: kN, m, rad.
#pragma once

#include <array>
#include <functional>
#include <string>
#include <vector>

#include "cairn/core/units.hpp"
#include "cairn/solver/pile_head.hpp"

namespace cairn {

// What the soil gives one pile, depths along the pile from its head (m).
struct PileCurves {
  // p(z, y): lateral resistance per unit length (kN/m) at deflection y (m); odd in y. Any
  // p-multiplier for group action is applied by the caller of pile_head_response, not here.
  std::function<double(double, double)> lateral;
  // t(z, w): shaft resistance per unit length of pile (kN/m: unit friction times perimeter)
  // at a movement w (m) of the pile relative to the soil, positive into the ground; t(z, 0) = 0,
  // rising with |w| on each side (not necessarily odd: less friction in tension).
  std::function<double(double, double)> shaft;
  // Q(w): tip resistance (kN) at a tip movement w (m) into the ground; 0 for w ≤ 0.
  std::function<double(double)> tip;
  std::string description;  // which curves, in plain words, for the report
};

struct NonlinearPileSpec {
  std::array<double, 3> head{};  // m, global
  std::array<double, 3> axis{};  // unit, head → toe
  double length = 0.0;             // m, along the axis
  double bending_stiffness = 0.0;  // EI, kN·m²
  double axial_rigidity = 0.0;     // EA, kN
  double width = 0.0;              // b, m (for the report)
  HeadRestraint restraint;         // pinned, fixed or partial (k_r)
  double torsional = 0.0;          // k_t, kN·m/rad, linear
  bool tension = true;             // false: the pile takes no tension (no axial action < 0)
  PileCurves curves;
  int segments = 60;               // segments along the pile (≥ 4)
  UnitSystem units = UnitSystem::SI;  // for the numbers in messages only (computed in SI)
  // The largest head deflection (resultant across the axis, m) the curves are used for;
  // beyond it pile_head_response returns converged = false (the pile has reached its lateral
  // capacity). 0: the pile's width, or L/10 without a width.
  double deflection_limit = 0.0;
};

// The head movement of one pile: u (m) and ω (rad), global.
using HeadMovement = std::array<double, 6>;

struct PileHeadResponse {
  bool converged = false;
  std::string message;             // why not, in plain words
  std::array<double, 6> action{};  // (F, M) of the cap on the pile at its head, global
  Matrix6Rows tangent{};           // ∂action/∂movement, global (symmetric in the linear limit)
};

// The head action for a head movement, with every p-y spring scaled by `p_multiplier` (group
// action, 1 for a single pile). Does not throw on non-convergence.
PileHeadResponse pile_head_response(const NonlinearPileSpec& pile, const HeadMovement& movement,
                                    double p_multiplier = 1.0);

// The converged deflected shape of one pile (the solver's unknowns), kept by the caller
// between calls for the same pile and multiplier: a call given the state of a nearby movement
// starts its Newton iteration from it instead of from rest (a few iterations instead of about
// ten). Empty, or from another pile: ignored. Updated on convergence only.
struct DeflectedShape {
  std::vector<double> lateral;  // deflections and slopes of the nodes, both planes
  std::vector<double> axial;    // movements of the nodes along the axis
};
PileHeadResponse pile_head_response(const NonlinearPileSpec& pile, const HeadMovement& movement,
                                    double p_multiplier, DeflectedShape* state);

// The pile along its length at a head movement: the resultant of the two bending planes.
struct PileProfile {
  bool converged = false;
  std::string message;
  std::vector<double> depth;       // m from the head
  std::vector<double> deflection;  // m, resultant across the axis
  std::vector<double> moment;      // kN·m, resultant bending moment
  std::vector<double> shear;       // kN, resultant shear
  std::vector<double> axial;       // kN, compression positive
  double max_moment = 0.0;         // kN·m
  double max_moment_depth = 0.0;   // m
  double head_deflection = 0.0;    // m
};
PileProfile pile_profile(const NonlinearPileSpec& pile, const HeadMovement& movement,
                         double p_multiplier = 1.0);

}  // namespace cairn
