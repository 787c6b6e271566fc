// safe_region.hpp — where the resultant of a combination's vertical load may stand in plan
// with every pile passing: compression and tension within capacity and, for piles that take
// no tension, staying in contact.
//
// The vertical load P (the combination's −Fz) is placed at a plan point (x, y) with no other
// load. For piles acting linearly each pile force is linear in the position,
//     Nᵢ(x, y) = αᵢ + βᵢ·x + γᵢ·y
// (three solves of the rigid cap: P at the origin, and the moments P·y about x and −P·x about
// y per unit length), so each limit −Tᵢ ≤ Nᵢ ≤ Cᵢ is a half-plane and the region is their
// intersection: a convex polygon, clipped exactly from a large square (Sutherland & Hodgman
// 1974 clipping of a convex polygon by one line at a time). For four equal vertical piles at
// the corners of a square of half-side a taking no tension it is the square's kern
// |x| + |y| ≤ a.
//
// Where compression-only piles may drop out (and the cap still stands on the rest), the true
// region is larger than the linear one (which keeps every pile in contact): it is traced by
// bisection along rays from the group's centroid with the active-set solver (cap_solver.hpp),
// 1 mm resolution, and reported beside the linear one.
//
// A combination's resultant stands at x = −My/Fz, y = Mx/Fz (moments about the origin,
// including those of the horizontal forces); its margin is its distance to the region's edge,
// positive inside. Units: m, kN.
#pragma once

#include <array>
#include <cstddef>
#include <optional>
#include <vector>

#include "cairn/app/analysis.hpp"

namespace cairn {

using Polygon = std::vector<std::array<double, 2>>;

struct CombinationRegion {
  std::size_t combination = 0;
  double load = 0.0;                 // kN, P = −Fz (downward positive)
  std::array<double, 2> resultant{};  // m
  Polygon linear;                     // every pile in contact; empty: no such region
  Polygon traced;                     // with compression-only piles dropping out (when any)
  double margin = 0.0;                // m, of the resultant to the edge used (traced if any)
  bool inside = false;
  bool upward = false;                // P ≤ 0: no region for an uplifting load
};

struct SafeRegions {
  std::vector<CombinationRegion> combinations;
  std::optional<std::size_t> smallest;  // index of the smallest margin
};

// `rays`: number of rays for the traced region (0: linear only).
SafeRegions safe_regions(const CheckRun& run, int rays = 72);

// Signed distance of a point to a convex polygon's edge (positive inside), m.
double signed_distance(const Polygon& polygon, double x, double y);
double area(const Polygon& polygon);

}  // namespace cairn
