#include "cairn/solver/pile_head.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>
#include <string>

namespace cairn {
namespace {

void require_positive(double value, const char* what) {
  if (!(value > 0.0) || !std::isfinite(value))
    throw std::invalid_argument(std::string(what) + " must be a positive number");
}

// Matlock & Reese (1960): head deflection and slope coefficients of a long pile (Zmax ≥ 5)
// whose modulus grows linearly with depth, Ay = 2.435, By = 1.623, As = −1.623, Bs = −1.750
// (from memory). Their slope is dy/dz (z down), the negative of Hetényi's θ0, hence the
// positive signs in the header's flexibility.
constexpr double kAy = 2.435, kBy = 1.623, kAs = 1.623, kBs = 1.750;

}  // namespace

PlaneStiffness hetenyi_long_pile(double bending_stiffness, double winkler_modulus) {
  require_positive(bending_stiffness, "bending stiffness EI");
  require_positive(winkler_modulus, "Winkler modulus k");
  const double ei = bending_stiffness;
  const double lambda = std::pow(winkler_modulus / (4.0 * ei), 0.25);
  return {4.0 * ei * lambda * lambda * lambda, -2.0 * ei * lambda * lambda, 2.0 * ei * lambda};
}

PlaneStiffness matlock_reese_long_pile(double bending_stiffness, double modulus_gradient) {
  require_positive(bending_stiffness, "bending stiffness EI");
  require_positive(modulus_gradient, "modulus gradient nh");
  const double ei = bending_stiffness;
  const double t = std::pow(ei / modulus_gradient, 0.2);
  // Flexibility [[f_hh, f_hm], [f_hm, f_mm]] (Maxwell: By = As), then its inverse.
  const double f_hh = kAy * t * t * t / ei, f_hm = kBy * t * t / ei, f_mm = kBs * t / ei;
  static_assert(kBy == kAs, "Maxwell's reciprocity: By = As");
  const double det = f_hh * f_mm - f_hm * f_hm;
  return {f_mm / det, -f_hm / det, f_hh / det};
}

RestrainedHead restrained_head(const PlaneStiffness& pile, const HeadRestraint& restraint) {
  RestrainedHead out;
  switch (restraint.kind) {
    case HeadRestraint::Kind::pinned:
      out.lateral = pile.k_hh - pile.k_hm * pile.k_hm / pile.k_mm;
      break;
    case HeadRestraint::Kind::fixed:
      out.lateral = pile.k_hh;
      out.bending.coupling = pile.k_hm;
      out.bending.rotational = pile.k_mm;
      break;
    case HeadRestraint::Kind::partial: {
      require_positive(restraint.stiffness, "head restraint k_r");
      const double sum = pile.k_mm + restraint.stiffness;
      out.lateral = pile.k_hh - pile.k_hm * pile.k_hm / sum;
      out.bending.coupling = pile.k_hm * restraint.stiffness / sum;
      out.bending.rotational = pile.k_mm * restraint.stiffness / sum;
      break;
    }
  }
  return out;
}

Matrix6Rows head_stiffness_matrix(const std::array<double, 3>& a, double axial, double lateral,
                                  const HeadBending& b) {
  Matrix6Rows k{};
  // [a]×: the matrix with [a]×·v = a × v.
  const double skew[3][3] = {{0, -a[2], a[1]}, {a[2], 0, -a[0]}, {-a[1], a[0], 0}};
  for (int i = 0; i < 3; ++i)
    for (int j = 0; j < 3; ++j) {
      const double aa = a[i] * a[j], perpendicular = (i == j ? 1.0 : 0.0) - aa;
      k[i][j] = axial * aa + lateral * perpendicular;
      k[i][j + 3] = b.coupling * skew[i][j];
      k[i + 3][j] = b.coupling * skew[j][i];
      k[i + 3][j + 3] = b.rotational * perpendicular + b.torsional * aa;
    }
  return k;
}

MomentPeak largest_moment_along(const MomentInfluence& influence, const std::array<double, 3>& a,
                                const std::array<double, 6>& action) {
  // Two lateral unit directions: e1 ⟂ a (from the plan axis least aligned with a), e2 = a × e1.
  std::array<double, 3> e1{};
  if (std::abs(a[0]) <= std::abs(a[1]) && std::abs(a[0]) <= std::abs(a[2])) e1 = {1, 0, 0};
  else if (std::abs(a[1]) <= std::abs(a[2])) e1 = {0, 1, 0};
  else e1 = {0, 0, 1};
  const double along = e1[0] * a[0] + e1[1] * a[1] + e1[2] * a[2];
  for (int j = 0; j < 3; ++j) e1[static_cast<std::size_t>(j)] -= along * a[static_cast<std::size_t>(j)];
  const double norm = std::sqrt(e1[0] * e1[0] + e1[1] * e1[1] + e1[2] * e1[2]);
  for (auto& v : e1) v /= norm;
  auto cross = [](const std::array<double, 3>& p, const std::array<double, 3>& q) {
    return std::array<double, 3>{p[1] * q[2] - p[2] * q[1], p[2] * q[0] - p[0] * q[2],
                                 p[0] * q[1] - p[1] * q[0]};
  };
  auto dot = [](const std::array<double, 3>& p, const double* q) {
    return p[0] * q[0] + p[1] * q[1] + p[2] * q[2];
  };
  const std::array<double, 3> e2 = cross(a, e1);
  // Plane of e: H = e·F, M0 = (e × a)·M (Hetényi's convention, header).
  const double h1 = dot(e1, action.data()), m1 = dot(cross(e1, a), action.data() + 3);
  const double h2 = dot(e2, action.data()), m2 = dot(cross(e2, a), action.data() + 3);
  const std::size_t n = influence.depth.size();
  if (n == 0) throw std::logic_error("largest_moment_along: no samples");
  auto squared = [&](std::size_t i) {
    const double p = h1 * influence.per_shear[i] + m1 * influence.per_moment[i];
    const double q = h2 * influence.per_shear[i] + m2 * influence.per_moment[i];
    return p * p + q * q;
  };
  MomentPeak peak;
  peak.head = std::sqrt(squared(0));
  std::size_t best = 0;
  double best_value = squared(0);
  for (std::size_t i = 1; i < n; ++i)
    if (const double v = squared(i); v > best_value) {
      best_value = v;
      best = i;
    }
  peak.value = std::sqrt(best_value);
  peak.depth = influence.depth[best];
  // An interior peak: the vertex of the parabola through its neighbours (equal steps).
  if (best > 0 && best + 1 < n) {
    const double lo = squared(best - 1), mid = best_value, hi = squared(best + 1);
    const double curvature = lo - 2.0 * mid + hi;
    if (curvature < 0.0) {
      const double shift = 0.5 * (lo - hi) / curvature;  // in steps, within ±½
      const double step = influence.depth[best + 1] - influence.depth[best];
      peak.value = std::sqrt(std::max(mid - 0.125 * (lo - hi) * (lo - hi) / curvature, mid));
      peak.depth = influence.depth[best] + shift * step;
    }
  }
  return peak;
}

}  // namespace cairn
