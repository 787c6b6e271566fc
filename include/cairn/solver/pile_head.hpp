// pile_head.hpp — the full 6×6 stiffness of a pile head held by a rigid cap, and the bending
// moment along the pile.
//
// A pile head moves u (m) and rotates ω (rad) with the cap; the cap acts on the pile with a
// force F (kN) and a moment M (kN·m) at the head. In each bending plane the pile alone relates
// the head shear H and moment M0 to the head deflection y0 and rotation θ0 by its 2×2 head
// stiffness (Hetényi's convention, lateral.hpp: θ0 positive in the sense a positive H turns a
// free head, M0 positive when it gives a positive θ0)
//     H  = k_hh·y0 + k_hm·θ0,    M0 = k_hm·y0 + k_mm·θ0.
// The cap holds the head through a rotational restraint k_r (kN·m/rad): M0 = k_r·(θ_cap − θ0).
// Eliminating the pile's own head rotation θ0 gives the terms the cap sees
//     K_ll = k_hh − k_hm²/(k_mm + k_r)       lateral           (kN/m)
//     K_lr = k_hm·k_r/(k_mm + k_r)           coupling          (kN/rad)
//     K_rr = k_mm·k_r/(k_mm + k_r)           rotational        (kN·m/rad)
// pinned (k_r = 0): K_ll = k_hh − k_hm²/k_mm, K_lr = K_rr = 0 (the classical lateral spring);
// fixed (k_r → ∞): K_ll = k_hh, K_lr = k_hm, K_rr = k_mm. (Hand derivation: static
// condensation of the rotational spring in series with the pile head.)
//
// In 3D, with a the unit axis from head to toe and a lateral unit direction e ⟂ a, the
// bending plane of e has y0 = e·u and θ0 = (e × a)·ω (a right-hand rotation about e × a turns
// the axis toward −e: the pile below the head lags behind a head deflecting along +e, as a
// positive H turns a free head), H = e·F and M0 = (e × a)·M. Summed over two orthogonal e (the sections are round or square, so both
// planes have the same EI), with [a]× the cross-product matrix of a:
//     F = k_a·a·aᵀ·u + K_ll·(I − a·aᵀ)·u + K_lr·[a]×·ω
//     M = K_lr·[a]×ᵀ·u + K_rr·(I − a·aᵀ)·ω + k_t·a·aᵀ·ω
// a symmetric 6×6 matrix (k_a axial, k_t torsional). Its K_ll part is the solver's lateral
// spring; this module adds the K_lr, K_rr and k_t terms (HeadBending), zero for pinned heads.
//
// Head terms of a pile alone (per bending plane):
//  - uniform subgrade modulus k = kh·D (kN/m²), long pile: Hetényi (1946), semi-infinite beam,
//    λ = [k/(4EI)]^(1/4): k_hh = 4EIλ³ = k/λ, k_hm = −2EIλ² = −k/(2λ²), k_mm = 2EIλ = k/(2λ³)
//    (shorter piles: the finite beam of lateral.hpp);
//  - modulus growing linearly with depth, Es = nh·z (nh in kN/m³), long pile: Matlock & Reese
//    (1960), T = (EI/nh)^(1/5), head flexibility y0 = (2.435·H·T³ + 1.623·M0·T²)/EI,
//    θ0 = (1.623·H·T² + 1.750·M0·T)/EI (their coefficients Ay, By, As, Bs at the head of a
//    long pile, from memory), inverted here.
//
// Units: kN, m, rad.
#pragma once

#include <array>
#include <optional>
#include <vector>

#include "cairn/geotechnics/lateral.hpp"

namespace cairn {

// The head-bending terms one pile adds to its axial and lateral springs (see above). All zero
// for a pinned head: the pile then acts exactly as the two springs alone.
struct HeadBending {
  double coupling = 0.0;    // K_lr, kN/rad (negative for a long pile in Hetényi's convention)
  double rotational = 0.0;  // K_rr, kN·m/rad, per bending plane
  double torsional = 0.0;   // k_t, kN·m/rad, about the pile axis
  bool any() const { return coupling != 0.0 || rotational != 0.0 || torsional != 0.0; }
};

// The 2×2 head stiffness of a pile alone in one bending plane (Hetényi's sign convention).
struct PlaneStiffness {
  double k_hh = 0.0;  // kN/m
  double k_hm = 0.0;  // kN/rad
  double k_mm = 0.0;  // kN·m/rad
};

// Hetényi (1946), long pile in a uniform Winkler soil k = kh·D (kN/m²):
// k_hh = 4EIλ³, k_hm = −2EIλ², k_mm = 2EIλ, λ = [k/(4EI)]^(1/4). Requires EI, k > 0.
PlaneStiffness hetenyi_long_pile(double bending_stiffness, double winkler_modulus);

// Matlock & Reese (1960), long pile in a soil whose modulus grows linearly with depth,
// Es = nh·z: the inverse of the head flexibility in the header (T = (EI/nh)^(1/5)):
// k_hh ≈ 1.0755·EI/T³, k_hm ≈ −0.9975·EI/T², k_mm ≈ 1.4965·EI/T. Requires EI, nh > 0.
PlaneStiffness matlock_reese_long_pile(double bending_stiffness, double modulus_gradient);

// The rotational restraint of the head: none (pinned), rigid (fixed), or k_r (kN·m/rad).
struct HeadRestraint {
  enum class Kind { pinned, fixed, partial } kind = Kind::pinned;
  double stiffness = 0.0;  // k_r, kN·m/rad, partial only (> 0)
};

// The terms the cap sees for a pile of head stiffness `pile` held by `restraint` (the
// condensation in the header). `lateral` is K_ll (the solver's lateral spring, kN/m);
// `bending` holds K_lr and K_rr (torsion is the caller's: 0 here).
struct RestrainedHead {
  double lateral = 0.0;  // K_ll, kN/m
  HeadBending bending;
};
RestrainedHead restrained_head(const PlaneStiffness& pile, const HeadRestraint& restraint);

// The global 6×6 head stiffness of one pile, row-major, acting on (u, ω) and giving the
// action of the cap on the pile (F, M) at the head: the matrix of the header with axial
// stiffness k_a, lateral K_ll and the bending terms. Requires |axis| = 1.
using Matrix6Rows = std::array<std::array<double, 6>, 6>;
Matrix6Rows head_stiffness_matrix(const std::array<double, 3>& axis, double axial, double lateral,
                                  const HeadBending& bending);

// The part of the head action that the bending terms add, for head movement u (m) and
// rotation ω (rad): force K_lr·(a × ω) (kN) and moment K_lr·(u × a) + K_rr·(ω − (a·ω)·a)
// + k_t·(a·ω)·a (kN·m). Written for any floating type, so the solver can check its
// equilibrium in extended precision.
template <typename Real>
void head_bending_action(const std::array<double, 3>& axis, const HeadBending& bending,
                         const Real (&u)[3], const Real (&w)[3], Real (&force)[3],
                         Real (&moment)[3]) {
  const Real a[3] = {Real(axis[0]), Real(axis[1]), Real(axis[2])};
  const Real klr = Real(bending.coupling), krr = Real(bending.rotational),
             kt = Real(bending.torsional);
  const Real along = a[0] * w[0] + a[1] * w[1] + a[2] * w[2];
  // a × ω and u × a.
  const Real axw[3] = {a[1] * w[2] - a[2] * w[1], a[2] * w[0] - a[0] * w[2],
                       a[0] * w[1] - a[1] * w[0]};
  const Real uxa[3] = {u[1] * a[2] - u[2] * a[1], u[2] * a[0] - u[0] * a[2],
                       u[0] * a[1] - u[1] * a[0]};
  for (int j = 0; j < 3; ++j) {
    force[j] = klr * axw[j];
    moment[j] = klr * uxa[j] + krr * (w[j] - along * a[j]) + kt * along * a[j];
  }
}

// ---------------------------------------------------------------------------------------
// Bending moment along the pile
// ---------------------------------------------------------------------------------------

// The largest resultant bending moment along the pile and its depth (MomentInfluence of
// lateral.hpp), from the head action
// (F, M) of the cap on the pile (global axes, kN and kN·m) on a pile of axis `axis`: the two
// bending planes are combined as √(M₁² + M₂²) at each depth; the peak between samples is
// found by a parabola through the three samples around it.
struct MomentPeak {
  double head = 0.0;   // |M| at the head, kN·m
  double value = 0.0;  // largest |M|, kN·m
  double depth = 0.0;  // m below the head
};
MomentPeak largest_moment_along(const MomentInfluence& influence, const std::array<double, 3>& axis,
                                const std::array<double, 6>& head_action);

}  // namespace cairn
