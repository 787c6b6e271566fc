// explain.hpp — the hand check of one pile's axial force, for a reviewer.
//
// For a group of vertical piles of equal axial stiffness under a rigid cap, the axial force
// in pile i follows from the group's section properties about its centroid (x̄, ȳ):
//     Ixx = Σ(y − ȳ)², Iyy = Σ(x − x̄)², Ixy = Σ(x − x̄)(y − ȳ)   (m², over the active piles)
//     P_i = V/n + (M_y·Ixx + M_x·Ixy)/(Ixx·Iyy − Ixy²)·x'_i − (M_x·Iyy + M_y·Ixy)/(Ixx·Iyy − Ixy²)·y'_i
// with V = −ΣFz the downward load, M_x and M_y the applied moments about the centroid at the
// pile heads (right-hand rule, z up), x'_i = x_i − x̄, y'_i = y_i − ȳ. With Ixy = 0 this is
// the familiar P/n ± M·x/Σx² (e.g. Bowles, Foundation Analysis and Design, 5th ed., §18-14;
// USACE EM 1110-2-2906, ch. 4). Equivalent eccentricities e_x = M_y/V, e_y = −M_x/V.
//
// The explanation is offered where the formula is exact: vertical piles of equal axial
// stiffness (compression-only piles that dropped out are left out of the sums). Piles on
// one line along x or y (a two-pile cap, a single row) use the one-way form
// P = V/n + My·x'/Σx'² or P = V/n − Mx·y'/Σy'².
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "cairn/checks/checks.hpp"
#include "cairn/core/model.hpp"

namespace cairn {

struct GroupSection {
  std::size_t count = 0;          // active piles
  double centroid_x = 0.0, centroid_y = 0.0;  // m
  double ixx = 0.0, iyy = 0.0, ixy = 0.0;     // m²
};

struct HandCheck {
  std::size_t combination = 0;
  bool available = false;
  std::string why_not;  // when not available
  GroupSection section;
  double vertical = 0.0;            // V, kN (downward positive)
  double moment_x = 0.0, moment_y = 0.0;  // about the centroid, kN·m, less the heads' below
  // Fixed and partially fixed heads: Σ of the moments the cap puts on the pile heads
  // (head_forces), kN·m. The axial forces carry the applied moments less these.
  double heads_moment_x = 0.0, heads_moment_y = 0.0;
  double eccentricity_x = 0.0, eccentricity_y = 0.0;  // m
  double x_local = 0.0, y_local = 0.0;  // x'_i, y'_i, m
  double direct = 0.0;            // V/n, kN
  double from_moment_y = 0.0;     // (M_y·Ixx + M_x·Ixy)/det·x'_i, kN
  double from_moment_x = 0.0;     // −(M_x·Iyy + M_y·Ixy)/det·y'_i, kN
  double axial = 0.0;             // the sum, kN
  // Which form applies: the general one, or the piles on one line along x (Ixx = 0:
  // P = V/n + My·x'/Iyy) or along y (Iyy = 0: P = V/n − Mx·y'/Ixx).
  enum class Form { general, line_x, line_y } form = Form::general;
  double solver_axial = 0.0;      // the rigid-cap solver's result, kN
};

// The hand check of pile `pile` in every combination. `axial_stiffness` gives the solver's
// axial spring per pile type (kN/m, stiffness.hpp); when empty, springs are judged equal
// only where that is certain without them (one pile type, or equal typed or E·A/L values).
// Requires pile < project.piles.size().
std::vector<HandCheck> explain_pile(const Project& project, const CheckResults& results,
                                    std::size_t pile,
                                    const std::vector<double>& axial_stiffness = {});

// The section properties of a set of pile positions (all weights 1).
GroupSection group_section(const std::vector<std::array<double, 2>>& positions);

}  // namespace cairn
