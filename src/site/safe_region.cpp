#include "cairn/site/safe_region.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "cairn/core/plan.hpp"
#include "cairn/solver/cap_solver.hpp"

namespace cairn {
namespace {

constexpr double kPi = 3.14159265358979323846;
constexpr double kForceTolerance = 1e-6;  // kN, as checks.cpp

// Keeps the part of `poly` where a·x + b·y ≤ c.
Polygon clip(const Polygon& poly, double a, double b, double c) {
  Polygon out;
  const std::size_t n = poly.size();
  for (std::size_t i = 0; i < n; ++i) {
    const auto& p = poly[i];
    const auto& q = poly[(i + 1) % n];
    const double fp = a * p[0] + b * p[1] - c, fq = a * q[0] + b * q[1] - c;
    if (fp <= 0) out.push_back(p);
    if ((fp < 0 && fq > 0) || (fp > 0 && fq < 0)) {
      const double t = fp / (fp - fq);
      out.push_back({p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])});
    }
  }
  return out;
}

const Resistance& resistance_of(const CheckRun& run, std::size_t type, const Combination& c) {
  const PileTypeResistance& r = run.resistances[type];
  if (c.resistance_set != ResistanceSet::basis) return r.by_set.at(c.resistance_set);
  return c.limit_state == LimitState::service ? r.allowable : r.factored;
}

// Every pile passes (utilization ≤ 1) under the solution.
bool passes(const CheckRun& run, const Combination& combo, const CapSolution& s) {
  if (s.overturns) return false;
  for (std::size_t i = 0; i < s.piles.size(); ++i) {
    const Resistance& r = resistance_of(run, run.project.piles[i].type, combo);
    const double n = s.piles[i].axial, v = s.piles[i].lateral;
    if (n > kForceTolerance && (!r.compression || n > *r.compression)) return false;
    if (-n > kForceTolerance && (!r.tension || -n > *r.tension)) return false;
    if (v > kForceTolerance && (!r.lateral || v > *r.lateral)) return false;
    if (r.structural_axial && *r.structural_axial > 0 && std::abs(n) > *r.structural_axial) return false;
  }
  return true;
}

}  // namespace

double area(const Polygon& p) { return polygon_area(p); }

double signed_distance(const Polygon& p, double x, double y) {
  if (p.size() < 3) return -std::numeric_limits<double>::infinity();
  // Inside by the crossing number (any simple polygon: the traced regions are star-shaped).
  bool inside = false;
  double nearest = std::numeric_limits<double>::infinity();
  for (std::size_t i = 0, j = p.size() - 1; i < p.size(); j = i++) {
    const auto& u = p[i];
    const auto& w = p[j];
    if ((u[1] > y) != (w[1] > y) && x < (w[0] - u[0]) * (y - u[1]) / (w[1] - u[1]) + u[0])
      inside = !inside;
    const double ex = w[0] - u[0], ey = w[1] - u[1];
    const double len2 = ex * ex + ey * ey;
    const double t = len2 > 0 ? std::clamp(((x - u[0]) * ex + (y - u[1]) * ey) / len2, 0.0, 1.0) : 0.0;
    nearest = std::min(nearest, std::hypot(x - u[0] - t * ex, y - u[1] - t * ey));
  }
  return inside ? nearest : -nearest;
}

SafeRegions safe_regions(const CheckRun& run, int rays) {
  SafeRegions out;
  const Project& p = run.project;
  const CapSolver solver(pile_springs(p, run.stiffness));
  bool compression_only = false;
  double cx = 0.0, cy = 0.0, reach = 1.0;
  for (const Pile& pile : p.piles) {
    compression_only = compression_only || !p.pile_types[pile.type].tension;
    cx += pile.x / static_cast<double>(p.piles.size());
    cy += pile.y / static_cast<double>(p.piles.size());
  }
  for (const Pile& pile : p.piles) reach = std::max(reach, std::hypot(pile.x - cx, pile.y - cy));
  // Unit solves about the centroid: force 1 kN down at (cx, cy), then moved by 1 m in x and y.
  auto wrench_at = [&](double x, double y, double load) {
    // Fz = −P at (x, y): moments about the origin M = r × F = (y·Fz, −x·Fz, 0).
    return Wrench{0, 0, -load, -y * load, x * load, 0};
  };
  const CapSolution base = solver.solve_linear(wrench_at(cx, cy, 1.0));
  const CapSolution ex = solver.solve_linear(wrench_at(cx + 1.0, cy, 1.0));
  const CapSolution ey = solver.solve_linear(wrench_at(cx, cy + 1.0, 1.0));
  const double box = 10.0 * reach + 10.0;
  for (std::size_t c = 0; c < p.combinations.size(); ++c) {
    const Combination& combo = p.combinations[c];
    CombinationRegion region;
    region.combination = c;
    const Wrench w = combination_load(p, combo);
    region.load = -w[2];
    if (!(region.load > kForceTolerance)) {
      region.upward = true;
      out.combinations.push_back(region);
      continue;
    }
    region.resultant = {-w[4] / w[2], w[3] / w[2]};
    const double P = region.load;
    Polygon poly = {{cx - box, cy - box}, {cx + box, cy - box}, {cx + box, cy + box}, {cx - box, cy + box}};
    for (std::size_t i = 0; i < p.piles.size() && !poly.empty(); ++i) {
      // N(x, y) = P·(α + β·(x − cx) + γ·(y − cy)).
      const double alpha = base.piles[i].axial;
      const double beta = ex.piles[i].axial - alpha, gamma = ey.piles[i].axial - alpha;
      const Resistance& r = resistance_of(run, p.piles[i].type, combo);
      const double shift = -beta * cx - gamma * cy;
      // N ≤ C:  P·(β·x + γ·y) ≤ C − P·(α + shift)
      if (r.compression) poly = clip(poly, P * beta, P * gamma, *r.compression - P * (alpha + shift));
      // −N ≤ T (or N ≥ 0 when no tension is taken or none is allowed)
      const double tension = p.pile_types[p.piles[i].type].tension && r.tension ? *r.tension : 0.0;
      poly = clip(poly, -P * beta, -P * gamma, tension + P * (alpha + shift));
      if (r.structural_axial && *r.structural_axial > 0)
        poly = clip(poly, P * beta, P * gamma, *r.structural_axial - P * (alpha + shift));
    }
    region.linear = poly;
    if (compression_only && rays > 0) {
      // Bisection along rays from the centroid with the active-set solver.
      auto ok = [&](double x, double y) { return passes(run, combo, solver.solve(wrench_at(x, y, P))); };
      if (ok(cx, cy)) {
        for (int k = 0; k < rays; ++k) {
          const double t = 2 * kPi * k / rays, dx = std::cos(t), dy = std::sin(t);
          double lo = 0.0, hi = 2.0 * reach;
          while (ok(cx + hi * dx, cy + hi * dy) && hi < box) lo = hi, hi *= 2;
          while (hi - lo > 0.001) {
            const double mid = (lo + hi) / 2;
            (ok(cx + mid * dx, cy + mid * dy) ? lo : hi) = mid;
          }
          region.traced.push_back({cx + lo * dx, cy + lo * dy});
        }
      }
    }
    const Polygon& used = region.traced.empty() ? region.linear : region.traced;
    region.margin = signed_distance(used, region.resultant[0], region.resultant[1]);
    region.inside = region.margin >= 0;
    if (!out.smallest || region.margin < out.combinations[*out.smallest].margin)
      out.smallest = out.combinations.size();
    out.combinations.push_back(region);
  }
  return out;
}

}  // namespace cairn
