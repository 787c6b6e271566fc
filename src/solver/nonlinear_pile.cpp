// nonlinear_pile.cpp — one pile's head response on nonlinear soil (nonlinear_pile.hpp).
//
// Lateral: cubic (Hermite) beam elements between the nodes, the soil springs lumped at the
// nodes over their tributary lengths (h, h/2 at the ends: at the same spacing this is the
// difference method of Reese & Van Impe), the P-Δ term as the elements' consistent geometric
// stiffness. Unknowns per node: the deflections v1, v2 in the two bending planes and their
// slopes s1, s2 = dv/dz (z down the axis), so the two planes are solved together and the soil
// acts on the resultant deflection. The rotation of Hetényi's convention is θ = −s.
// Axial: two-node bar elements, t-z springs lumped at the nodes, the Q-z spring at the tip.
// Both systems are solved by Newton's method with the curves' tangents (central differences),
// clipped at zero in the iteration matrix so that it stays positive definite on softening
// curves, with a backtracking line search; a secant step takes over where even that matrix
// is singular. The head action and its tangent come from the converged system: the tangent
// is the Schur complement of the interior unknowns (static condensation onto the head).
#include "cairn/solver/nonlinear_pile.hpp"

#include <algorithm>
#include <cmath>
#include <optional>
#include <stdexcept>

#include <fmt/format.h>

#include "cairn/core/quantity_format.hpp"

namespace cairn {
namespace {

using Vec3 = std::array<double, 3>;

// Deflections below this are "at rest": the curve's secant at this deflection is its initial
// slope (Matlock's and Welch & Reese's curves have an infinite slope at y = 0), m.
constexpr double kTiny = 1e-6;
constexpr int kNewtonLimit = 60;
constexpr int kSecantLimit = 200;
// The last Newton correction relative to the largest movement: with quadratic convergence the
// error left after it is of its square.
constexpr double kTolerance = 1e-8;

double dot(const Vec3& p, const Vec3& q) { return p[0] * q[0] + p[1] * q[1] + p[2] * q[2]; }
Vec3 cross(const Vec3& p, const Vec3& q) {
  return {p[1] * q[2] - p[2] * q[1], p[2] * q[0] - p[0] * q[2], p[0] * q[1] - p[1] * q[0]};
}

// A symmetric banded matrix, upper triangle stored row by row: (i, j) for i ≤ j ≤ i + band.
// From row `inner_from` on the band is `inner_band` (narrower: the head's rows couple farther),
// and only that trailing block is factored and solved.
class Band {
 public:
  Band() = default;
  Band(int size, int band, int inner_from, int inner_band)
      : size_(size),
        band_(band),
        inner_from_(inner_from),
        inner_band_(inner_band),
        a_(static_cast<std::size_t>(size * (band + 1)), 0.0) {}
  int size() const { return size_; }
  double get(int i, int j) const {
    if (j < i) std::swap(i, j);
    if (j - i > band_) return 0.0;
    return a_[index(i, j)];
  }
  void add(int i, int j, double v) {
    if (j < i) std::swap(i, j);
    if (j - i > (i >= inner_from_ ? inner_band_ : band_))
      throw std::logic_error("nonlinear pile: entry outside the band");
    a_[index(i, j)] += v;
  }
  // y = A·x.
  void multiply(const std::vector<double>& x, std::vector<double>& y) const {
    std::fill(y.begin(), y.end(), 0.0);
    for (int i = 0; i < size_; ++i) {
      const double* row = &a_[index(i, i)];
      const double xi = x[static_cast<std::size_t>(i)];
      double yi = y[static_cast<std::size_t>(i)] + row[0] * xi;
      const int last = std::min(size_ - 1, i + (i >= inner_from_ ? inner_band_ : band_));
      for (int j = i + 1; j <= last; ++j) {
        const double v = row[j - i];
        yi += v * x[static_cast<std::size_t>(j)];
        y[static_cast<std::size_t>(j)] += v * xi;
      }
      y[static_cast<std::size_t>(i)] = yi;
    }
  }
  // In place A = Uᵀ·D·U on the trailing block (U unit upper triangular, stored above the
  // diagonal, D on it). False when a pivot is not clearly non-zero (or, with `positive`, not
  // clearly positive) against the diagonal before factoring: the matrix is singular or
  // indefinite.
  bool factor(bool positive) {
    for (int k = inner_from_; k < size_; ++k) {
      double* row = &a_[index(k, k)];
      const double d = row[0];
      const double scale = std::abs(diagonal_before_[static_cast<std::size_t>(k)]);
      if (!std::isfinite(d) || std::abs(d) <= 1e-11 * scale || (positive && d <= 0.0) ||
          scale == 0.0)
        return false;
      const int last = std::min(size_ - 1, k + inner_band_);
      for (int j = k + 1; j <= last; ++j) {
        const double ukj = row[j - k];
        if (ukj == 0.0) continue;
        const double factor_j = ukj / d;
        double* rj = &a_[index(j, j)] - j;
        for (int m = j; m <= last; ++m) rj[m] -= factor_j * row[m - k];
      }
      const double inverse = 1.0 / d;
      for (int j = k + 1; j <= last; ++j) row[j - k] *= inverse;
    }
    return true;
  }
  void remember_diagonal() {
    diagonal_before_.resize(static_cast<std::size_t>(size_));
    for (int i = 0; i < size_; ++i) diagonal_before_[static_cast<std::size_t>(i)] = a_[index(i, i)];
  }
  // Solves the factored trailing block for b (its entries from inner_from on), in place.
  void solve(std::vector<double>& b) const {
    for (int k = inner_from_; k < size_; ++k) {
      const double* row = &a_[index(k, k)];
      const double bk = b[static_cast<std::size_t>(k)];
      const int last = std::min(size_ - 1, k + inner_band_);
      for (int j = k + 1; j <= last; ++j) b[static_cast<std::size_t>(j)] -= row[j - k] * bk;
      b[static_cast<std::size_t>(k)] = bk / row[0];
    }
    for (int k = size_ - 1; k >= inner_from_; --k) {
      const double* row = &a_[index(k, k)];
      const int last = std::min(size_ - 1, k + inner_band_);
      double s = b[static_cast<std::size_t>(k)];
      for (int j = k + 1; j <= last; ++j) s -= row[j - k] * b[static_cast<std::size_t>(j)];
      b[static_cast<std::size_t>(k)] = s;
    }
  }

 private:
  std::size_t index(int i, int j) const {
    return static_cast<std::size_t>(i * (band_ + 1) + (j - i));
  }
  int size_ = 0, band_ = 0, inner_from_ = 0, inner_band_ = 0;
  std::vector<double> a_;
  std::vector<double> diagonal_before_;
};

// A curve's value, secant and tangent at r ≥ 0 (central differences; below kTiny the secant
// at kTiny for all three, so an infinite initial slope stays finite).
struct CurvePoint {
  double value = 0.0, secant = 0.0, tangent = 0.0;
};
template <class Curve>
CurvePoint curve_point(const Curve& curve, double r) {
  if (r < kTiny) {
    const double k = curve(kTiny) / kTiny;
    return {k * r, k, k};
  }
  const double value = curve(r);
  const double step = 1e-6 * r;
  return {value, value / r, (curve(r + step) - curve(r - step)) / (2.0 * step)};
}

// The step length along a Newton direction Δ: where the energy Π(d + αΔ) stops falling, its
// slope g(α) = Δ·f(d + αΔ) (f the internal forces, Π's gradient) brought within half of
// g(0) < 0 by regula falsi on [0, 1]. The curves rise monotonically, so Π is convex (below
// buckling) and each step lowers it: Newton cannot cycle between the kinks of piecewise
// curves. `slope(α)` evaluates the forces at d + αΔ; the last α evaluated is returned in
// `evaluated`.
template <class Slope>
double line_search(double g0, Slope&& slope, double& evaluated) {
  evaluated = 1.0;
  const double g1 = slope(1.0);
  if (!(g0 < 0.0) || g1 <= 0.5 * std::abs(g0)) return 1.0;
  double a_lo = 0.0, g_lo = g0, a_hi = 1.0, g_hi = g1;
  double best = 0.5;
  for (int i = 0; i < 12; ++i) {
    const double width = a_hi - a_lo;
    double a = a_lo - g_lo * width / (g_hi - g_lo);
    a = std::clamp(a, a_lo + 0.1 * width, a_hi - 0.1 * width);
    const double g = slope(a);
    evaluated = best = a;
    if (std::abs(g) <= 0.5 * std::abs(g0)) break;
    if (g < 0.0) {
      a_lo = a;
      g_lo = g;
    } else {
      a_hi = a;
      g_hi = g;
    }
  }
  return best;
}

void validate(const NonlinearPileSpec& pile, const HeadMovement& movement, double multiplier) {
  auto positive = [](double v) { return std::isfinite(v) && v > 0.0; };
  if (!(std::isfinite(pile.deflection_limit) && pile.deflection_limit >= 0.0))
    throw std::invalid_argument("nonlinear pile: deflection limit must be ≥ 0");
  if (!positive(pile.length))
    throw std::invalid_argument("nonlinear pile: length must be positive");
  if (!positive(pile.bending_stiffness))
    throw std::invalid_argument("nonlinear pile: bending stiffness EI must be positive");
  if (!positive(pile.axial_rigidity))
    throw std::invalid_argument("nonlinear pile: axial rigidity EA must be positive");
  if (pile.segments < 4 || pile.segments > 100000)
    throw std::invalid_argument("nonlinear pile: segments must be between 4 and 100000");
  if (std::abs(std::sqrt(dot(pile.axis, pile.axis)) - 1.0) > 1e-9)
    throw std::invalid_argument("nonlinear pile: the axis must be a unit vector");
  if (!pile.curves.lateral) throw std::invalid_argument("nonlinear pile: no p-y curves");
  if (pile.restraint.kind == HeadRestraint::Kind::partial && !positive(pile.restraint.stiffness))
    throw std::invalid_argument("nonlinear pile: a partial head restraint needs k_r > 0");
  if (!(std::isfinite(pile.torsional) && pile.torsional >= 0.0))
    throw std::invalid_argument("nonlinear pile: torsional stiffness must be ≥ 0");
  if (!positive(multiplier))
    throw std::invalid_argument("nonlinear pile: p-multiplier must be positive");
  for (double m : movement)
    if (!std::isfinite(m)) throw std::invalid_argument("nonlinear pile: head movement not finite");
}

// ---------------------------------------------------------------------------------------
// Axial: the bar on t-z springs and the tip's Q-z spring.
// ---------------------------------------------------------------------------------------

struct AxialResult {
  bool converged = false;
  std::string message;
  double head_force = 0.0;            // N0, kN, compression positive (into the ground)
  double stiffness = 0.0;             // ∂N0/∂w0, kN/m
  std::vector<double> movement;       // w per node, m, positive into the ground
  std::vector<double> element_force;  // per element, compression positive, kN
  std::vector<double> force_rate;     // ∂N_e/∂w0 per element, kN/m (for the P-Δ tangent)
};

AxialResult solve_axial(const NonlinearPileSpec& pile, double head_movement,
                        const std::vector<double>* start) {
  const int n = pile.segments;
  const double h = pile.length / n, ea = pile.axial_rigidity, k_bar = ea / h;
  const auto& shaft = pile.curves.shaft;
  const auto& tip = pile.curves.tip;
  auto trib = [&](int i) { return (i == 0 || i == n) ? 0.5 * h : h; };
  // Spring force and tangent at node i for movement w (shaft over the tributary length, plus
  // the tip at the last node).
  auto spring = [&](int i, double w, double& force, double& tangent) {
    force = 0.0;
    tangent = 0.0;
    if (shaft) {
      // t(z, w) need not be odd (less friction in tension): evaluated on its own side.
      const double z = i * h;
      if (std::abs(w) < kTiny) {
        const double k = w < 0.0 ? -shaft(z, -kTiny) / kTiny : shaft(z, kTiny) / kTiny;
        force += trib(i) * k * w;
        tangent += trib(i) * k;
      } else {
        const double step = 1e-6 * std::abs(w);
        force += trib(i) * shaft(z, w);
        tangent += trib(i) * (shaft(z, w + step) - shaft(z, w - step)) / (2.0 * step);
      }
    }
    if (i == n && tip) {
      // Q(w) is 0 for w ≤ 0: its slope at rest is the one into the ground.
      if (w > kTiny) {
        const double step = 1e-6 * w;
        force += tip(w);
        tangent += (tip(w + step) - tip(w - step)) / (2.0 * step);
      } else if (w > 0.0) {
        const double k = tip(kTiny) / kTiny;
        force += k * w;
        tangent += k;
      } else {
        tangent += tip(kTiny) / kTiny * (w == 0.0 ? 1.0 : 0.0);
      }
    }
  };
  AxialResult out;
  std::vector<double> w(static_cast<std::size_t>(n + 1), 0.0);
  if (start && start->size() == w.size()) w = *start;
  w[0] = head_movement;
  // Interior unknowns 1 … n: tridiagonal, diagonal d, off-diagonal −EA/h.
  std::vector<double> force(static_cast<std::size_t>(n + 1)),
      tangent(static_cast<std::size_t>(n + 1));
  auto residual = [&](const std::vector<double>& x, std::vector<double>& r) {
    for (int i = 0; i <= n; ++i)
      spring(i, x[static_cast<std::size_t>(i)], force[static_cast<std::size_t>(i)],
             tangent[static_cast<std::size_t>(i)]);
    for (int i = 1; i <= n; ++i) {
      double v = force[static_cast<std::size_t>(i)] +
                 k_bar * (x[static_cast<std::size_t>(i)] - x[static_cast<std::size_t>(i - 1)]);
      if (i < n) v += k_bar * (x[static_cast<std::size_t>(i)] - x[static_cast<std::size_t>(i + 1)]);
      r[static_cast<std::size_t>(i)] = v;
    }
  };
  // Thomas algorithm for the interior system with diagonal `diag` and off-diagonals −EA/h.
  std::vector<double> cprime(static_cast<std::size_t>(n + 1)),
      dprime(static_cast<std::size_t>(n + 1));
  auto tridiagonal = [&](const std::vector<double>& diag, std::vector<double>& b) {
    double denominator = diag[1];
    cprime[1] = -k_bar / denominator;
    dprime[1] = b[1] / denominator;
    for (int i = 2; i <= n; ++i) {
      denominator =
          diag[static_cast<std::size_t>(i)] + k_bar * cprime[static_cast<std::size_t>(i - 1)];
      cprime[static_cast<std::size_t>(i)] = -k_bar / denominator;
      dprime[static_cast<std::size_t>(i)] =
          (b[static_cast<std::size_t>(i)] + k_bar * dprime[static_cast<std::size_t>(i - 1)]) /
          denominator;
    }
    b[static_cast<std::size_t>(n)] = dprime[static_cast<std::size_t>(n)];
    for (int i = n - 1; i >= 1; --i)
      b[static_cast<std::size_t>(i)] =
          dprime[static_cast<std::size_t>(i)] -
          cprime[static_cast<std::size_t>(i)] * b[static_cast<std::size_t>(i + 1)];
  };
  std::vector<double> r(static_cast<std::size_t>(n + 1), 0.0),
      diag(static_cast<std::size_t>(n + 1)), step(static_cast<std::size_t>(n + 1)),
      trial(static_cast<std::size_t>(n + 1)), r_trial(static_cast<std::size_t>(n + 1));
  auto fill_diagonal = [&](bool clipped) {
    for (int i = 1; i <= n; ++i) {
      const double t = tangent[static_cast<std::size_t>(i)];
      diag[static_cast<std::size_t>(i)] =
          (i < n ? 2.0 : 1.0) * k_bar + (clipped ? std::max(t, 0.0) : t);
    }
  };
  residual(w, r);
  for (int iteration = 0; iteration < kNewtonLimit && !out.converged; ++iteration) {
    fill_diagonal(true);
    for (int i = 1; i <= n; ++i)
      step[static_cast<std::size_t>(i)] = -r[static_cast<std::size_t>(i)];
    tridiagonal(diag, step);
    double g0 = 0.0;
    for (int i = 1; i <= n; ++i)
      g0 += step[static_cast<std::size_t>(i)] * r[static_cast<std::size_t>(i)];
    auto slope = [&](double alpha) {
      trial = w;
      for (int i = 1; i <= n; ++i)
        trial[static_cast<std::size_t>(i)] += alpha * step[static_cast<std::size_t>(i)];
      residual(trial, r_trial);
      double g = 0.0;
      for (int i = 1; i <= n; ++i)
        g += step[static_cast<std::size_t>(i)] * r_trial[static_cast<std::size_t>(i)];
      return g;
    };
    double evaluated = 1.0;
    const double alpha = line_search(g0, slope, evaluated);
    if (evaluated != alpha) slope(alpha);
    w = trial;
    r = r_trial;
    double largest = std::abs(head_movement), change = 0.0;
    for (int i = 1; i <= n; ++i) {
      largest = std::max(largest, std::abs(w[static_cast<std::size_t>(i)]));
      change = std::max(change, alpha * std::abs(step[static_cast<std::size_t>(i)]));
    }
    if (change <= kTolerance * largest || largest == 0.0) out.converged = true;
  }
  if (!out.converged) {
    out.message = fmt::format(
        "the axial soil springs did not settle in {} iterations at a head "
        "movement of {} along the pile",
        kNewtonLimit, QuantityFormat(pile.units).text(Shown::displacement, head_movement));
    return out;
  }
  residual(w, r);  // the springs' tangents at the solution
  double f0 = 0.0, t0 = 0.0;
  spring(0, w[0], f0, t0);
  out.head_force = f0 + k_bar * (w[0] - w[1]);
  // k_a = K00 − K01·[K_II⁻¹]_{11}·K10, K01 = −EA/h (static condensation of the interior).
  fill_diagonal(false);
  std::fill(step.begin(), step.end(), 0.0);
  step[1] = 1.0;
  tridiagonal(diag, step);
  out.stiffness = t0 + k_bar - k_bar * k_bar * step[1];
  if (!std::isfinite(out.stiffness)) {
    fill_diagonal(true);
    std::fill(step.begin(), step.end(), 0.0);
    step[1] = 1.0;
    tridiagonal(diag, step);
    out.stiffness = t0 + k_bar - k_bar * k_bar * step[1];
  }
  out.movement = w;
  out.element_force.resize(static_cast<std::size_t>(n));
  out.force_rate.resize(static_cast<std::size_t>(n));
  // ∂w_i/∂w0 = EA/h·[K_II⁻¹]_{i1} (step holds K_II⁻¹·e1), 1 at the head.
  auto rate = [&](int i) { return i == 0 ? 1.0 : k_bar * step[static_cast<std::size_t>(i)]; };
  for (int e = 0; e < n; ++e) {
    out.element_force[static_cast<std::size_t>(e)] =
        k_bar * (w[static_cast<std::size_t>(e)] - w[static_cast<std::size_t>(e + 1)]);
    out.force_rate[static_cast<std::size_t>(e)] = k_bar * (rate(e) - rate(e + 1));
  }
  if (!pile.tension && out.head_force < 0.0) {
    // The pile takes no tension: it leaves the cap.
    out.head_force = 0.0;
    out.stiffness = 0.0;
    std::fill(out.element_force.begin(), out.element_force.end(), 0.0);
    std::fill(out.force_rate.begin(), out.force_rate.end(), 0.0);
  }
  return out;
}

// ---------------------------------------------------------------------------------------
// Lateral: the beam-column in two planes on the resultant p-y springs.
// ---------------------------------------------------------------------------------------

class Lateral {
 public:
  Lateral(const NonlinearPileSpec& pile, const std::vector<double>& axial_force, double multiplier)
      : pile_(pile),
        multiplier_(multiplier),
        n_(pile.segments),
        h_(pile.length / pile.segments),
        fixed_(pile.restraint.kind == HeadRestraint::Kind::fixed),
        first_(4),
        size_((fixed_ ? 4 : 6) + 4 * n_),
        axial_(axial_force) {
    linear_ = Band(size_, kBand, first_, kInnerBand);
    const double ei = pile.bending_stiffness, h = h_;
    for (int plane = 0; plane < 2; ++plane)
      for (int e = 0; e < n_; ++e) {
        const int dofs[4] = {index(e, 2 * plane), index(e, 2 * plane + 1), index(e + 1, 2 * plane),
                             index(e + 1, 2 * plane + 1)};
        double k[4][4];
        element_matrix(ei, h, axial_[static_cast<std::size_t>(e)], k);
        for (int i = 0; i < 4; ++i)
          for (int j = i; j < 4; ++j) linear_.add(dofs[i], dofs[j], k[i][j]);
      }
    if (pile.restraint.kind == HeadRestraint::Kind::partial) {
      const double kr = pile.restraint.stiffness;
      for (int plane = 0; plane < 2; ++plane) {
        const int s = index(0, 2 * plane + 1), phi = 2 + plane;
        linear_.add(s, s, kr);
        linear_.add(phi, phi, kr);
        linear_.add(s, phi, -kr);
      }
    }
  }

  // The element's bending and geometric stiffness on (v1, s1, v2, s2), axial force N
  // compression positive: EI/h³·[12 6h −12 6h; …] − N/(30h)·[36 3h −36 3h; …] (the cubic
  // beam element and its consistent geometric stiffness; any text on the stiffness method).
  static void element_matrix(double ei, double h, double n, double (&k)[4][4]) {
    const double b = ei / (h * h * h), g = n / (30.0 * h);
    const double kb[4][4] = {{12, 6 * h, -12, 6 * h},
                             {6 * h, 4 * h * h, -6 * h, 2 * h * h},
                             {-12, -6 * h, 12, -6 * h},
                             {6 * h, 2 * h * h, -6 * h, 4 * h * h}};
    const double kg[4][4] = {{36, 3 * h, -36, 3 * h},
                             {3 * h, 4 * h * h, -3 * h, -h * h},
                             {-36, -3 * h, 36, -3 * h},
                             {3 * h, -h * h, -3 * h, 4 * h * h}};
    for (int i = 0; i < 4; ++i)
      for (int j = 0; j < 4; ++j) k[i][j] = b * kb[i][j] - g * kg[i][j];
  }

  // Index of component `comp` (0: v1, 1: s1, 2: v2, 3: s2) of node `node`. The head's
  // deflections and the cap's slopes φ come first (the prescribed unknowns); a fixed head's
  // slopes are the cap's.
  int index(int node, int comp) const {
    if (node == 0) {
      if (comp == 0) return 0;
      if (comp == 2) return 1;
      const int plane = comp / 2;
      return fixed_ ? 2 + plane : 4 + plane;
    }
    return (fixed_ ? 4 : 6) + 4 * (node - 1) + comp;
  }

  // Solves for the head's prescribed deflections y0 and cap slopes φ = −θ_cap per plane.
  bool solve(const std::array<double, 4>& boundary, const std::vector<double>* start,
             std::string& message) {
    d_.assign(static_cast<std::size_t>(size_), 0.0);
    if (start && start->size() == d_.size()) d_ = *start;
    for (int i = 0; i < 4; ++i)
      d_[static_cast<std::size_t>(i)] = boundary[static_cast<std::size_t>(i)];
    std::vector<double> f(static_cast<std::size_t>(size_)), step(static_cast<std::size_t>(size_)),
        trial(static_cast<std::size_t>(size_)), f_trial(static_cast<std::size_t>(size_));
    forces(d_, f);
    bool secant_mode = false;
    int iterations = 0;
    const int limit = kNewtonLimit + kSecantLimit;
    for (; iterations < limit; ++iterations) {
      if (iterations >= kNewtonLimit) secant_mode = true;
      Band k = linear_;
      if (!secant_mode) {
        add_soil(k, Tangent::clipped);
        k.remember_diagonal();
        if (!k.factor(true)) secant_mode = true;
      }
      if (secant_mode) {
        k = linear_;
        add_soil(k, Tangent::secant);
        k.remember_diagonal();
        if (!k.factor(true)) {
          message = unstable_message();
          return false;
        }
      }
      // Newton: K_II·Δ = −f_I. Secant: K_II(d)·d_I = −K_IB·d_B, i.e. Δ = −K_II⁻¹·f_I(d)
      // with f from the secant matrix, which is the same since f = K_sec·d.
      std::fill(step.begin(), step.end(), 0.0);
      for (int i = first_; i < size_; ++i)
        step[static_cast<std::size_t>(i)] = -f[static_cast<std::size_t>(i)];
      k.solve(step);
      double g0 = 0.0;
      for (int i = first_; i < size_; ++i)
        g0 += step[static_cast<std::size_t>(i)] * f[static_cast<std::size_t>(i)];
      auto slope = [&](double alpha) {
        for (int i = 0; i < size_; ++i)
          trial[static_cast<std::size_t>(i)] =
              d_[static_cast<std::size_t>(i)] +
              (i >= first_ ? alpha * step[static_cast<std::size_t>(i)] : 0.0);
        forces(trial, f_trial);
        double g = 0.0;
        for (int i = first_; i < size_; ++i)
          g += step[static_cast<std::size_t>(i)] * f_trial[static_cast<std::size_t>(i)];
        return g;
      };
      double evaluated = 1.0;
      const double alpha = secant_mode ? 1.0 : line_search(g0, slope, evaluated);
      if (secant_mode)
        slope(1.0);
      else if (evaluated != alpha)
        slope(alpha);
      d_.swap(trial);
      f.swap(f_trial);
      double largest = 0.0, change = 0.0;
      for (int node = 0; node <= n_; ++node)
        for (int comp = 0; comp < 4; ++comp) {
          const int i = index(node, comp);
          const double scale = (comp % 2 == 0) ? 1.0 : h_;  // slopes as h·s
          largest = std::max(largest, scale * std::abs(d_[static_cast<std::size_t>(i)]));
          if (i >= first_)
            change = std::max(change, scale * alpha * std::abs(step[static_cast<std::size_t>(i)]));
        }
      if (largest == 0.0 || change <= kTolerance * largest) {
        converged_ = true;
        break;
      }
      if (largest > 1e3 * pile_.length) {
        message = "the deflection grows without bound: the soil cannot hold the pile (a mechanism)";
        return false;
      }
    }
    if (!converged_) {
      message = fmt::format("the lateral soil springs did not settle in {} iterations", limit);
      return false;
    }
    f_ = f;
    return true;
  }

  // The head action per plane (H1, H2 and the forces on the cap slopes φ1, φ2) and the 4×4
  // tangent on (y0_1, y0_2, φ1, φ2), the static condensation of the interior unknowns.
  // `force_rate` (∂N_e/∂w0) gives `axial_coupling`, the rate of the four head forces with the
  // head's axial movement w0 through P-Δ: ∂f_B/∂w0 = g_B − K_BI·K_II⁻¹·g_I with
  // g = Σ_e ∂N_e/∂w0·(∂K_e/∂N)·d_e.
  bool condense(std::array<double, 4>& action, std::array<std::array<double, 4>, 4>& tangent,
                const std::vector<double>& force_rate, std::array<double, 4>& axial_coupling,
                std::string& message) const {
    for (int i = 0; i < 4; ++i)
      action[static_cast<std::size_t>(i)] = f_[static_cast<std::size_t>(i)];
    Band k = linear_;
    add_soil(k, Tangent::full);
    Band factored = k;
    factored.remember_diagonal();
    if (!factored.factor(false)) {
      // The true tangent is singular (every spring at its ultimate with a pinned head: the pile
      // turns as a rigid body); try the clipped one, else say so.
      factored = linear_;
      add_soil(factored, Tangent::clipped);
      k = factored;
      factored.remember_diagonal();
      if (!factored.factor(true)) {
        message = unstable_message();
        return false;
      }
    }
    std::vector<double> column(static_cast<std::size_t>(size_));
    for (int b = 0; b < 4; ++b) {
      std::fill(column.begin(), column.end(), 0.0);
      bool any = false;
      for (int i = first_; i < std::min(size_, first_ + kBand + 4); ++i) {
        column[static_cast<std::size_t>(i)] = k.get(b, i);
        any = any || column[static_cast<std::size_t>(i)] != 0.0;
      }
      if (any) factored.solve(column);
      for (int a = 0; a < 4; ++a) {
        double s = k.get(a, b);
        if (any)
          for (int i = first_; i < std::min(size_, first_ + kBand + 4); ++i)
            s -= k.get(a, i) * column[static_cast<std::size_t>(i)];
        tangent[static_cast<std::size_t>(a)][static_cast<std::size_t>(b)] = s;
      }
    }
    axial_coupling = {};
    if (std::any_of(force_rate.begin(), force_rate.end(), [](double v) { return v != 0.0; })) {
      std::vector<double> g(static_cast<std::size_t>(size_), 0.0);
      double unit[4][4];
      element_matrix(0.0, h_, -1.0, unit);  // −∂K_e/∂N
      for (int plane = 0; plane < 2; ++plane)
        for (int e = 0; e < n_; ++e) {
          const double rate = force_rate[static_cast<std::size_t>(e)];
          if (rate == 0.0) continue;
          const int dofs[4] = {index(e, 2 * plane), index(e, 2 * plane + 1),
                               index(e + 1, 2 * plane), index(e + 1, 2 * plane + 1)};
          for (int i = 0; i < 4; ++i)
            for (int j = 0; j < 4; ++j)
              g[static_cast<std::size_t>(dofs[i])] -=
                  rate * unit[i][j] * d_[static_cast<std::size_t>(dofs[j])];
        }
      std::vector<double> y = g;
      factored.solve(y);
      for (int a = 0; a < 4; ++a) {
        double s = g[static_cast<std::size_t>(a)];
        for (int i = first_; i < std::min(size_, first_ + kBand + 4); ++i)
          s -= k.get(a, i) * y[static_cast<std::size_t>(i)];
        axial_coupling[static_cast<std::size_t>(a)] = s;
      }
    }
    return true;
  }

  const std::vector<double>& state() const { return d_; }
  // The resultant head shear: the forces on the head deflections (its own soil included).
  double head_shear() const { return std::hypot(f_[0], f_[1]); }
  int segments() const { return n_; }
  double step_length() const { return h_; }

  // End forces of element e in plane `plane` (the element's own matrix times its unknowns).
  std::array<double, 4> element_forces(int e, int plane) const {
    double k[4][4];
    element_matrix(pile_.bending_stiffness, h_, axial_[static_cast<std::size_t>(e)], k);
    const int dofs[4] = {index(e, 2 * plane), index(e, 2 * plane + 1), index(e + 1, 2 * plane),
                         index(e + 1, 2 * plane + 1)};
    std::array<double, 4> out{};
    for (int i = 0; i < 4; ++i)
      for (int j = 0; j < 4; ++j)
        out[static_cast<std::size_t>(i)] += k[i][j] * d_[static_cast<std::size_t>(dofs[j])];
    return out;
  }

 private:
  // The head's rows reach 9 places right; from the first interior unknown on, 5 (node i's
  // v1 to node i + 1's s1).
  static constexpr int kBand = 9, kInnerBand = 5;
  enum class Tangent { full, clipped, secant };

  double tributary(int node) const { return (node == 0 || node == n_) ? 0.5 * h_ : h_; }

  CurvePoint soil(int node, double r) const {
    const double z = node * h_;
    const auto& p = pile_.curves.lateral;
    CurvePoint c = curve_point([&](double y) { return p(z, y); }, r);
    const double scale = multiplier_ * tributary(node);
    c.value *= scale;
    c.secant *= scale;
    c.tangent *= scale;
    return c;
  }

  // The soil's secant p(r)/r at node `node` (one evaluation of the curve), kN/m per m.
  double soil_secant(int node, double r) const {
    const double z = node * h_, scale = multiplier_ * tributary(node);
    const double at = std::max(r, kTiny);
    return scale * pile_.curves.lateral(z, at) / at;
  }

  // f = K_lin·d + the soil's nodal forces (p along the resultant deflection).
  void forces(const std::vector<double>& d, std::vector<double>& f) const {
    linear_.multiply(d, f);
    for (int node = 0; node <= n_; ++node) {
      const int i1 = index(node, 0), i2 = index(node, 2);
      const double y1 = d[static_cast<std::size_t>(i1)], y2 = d[static_cast<std::size_t>(i2)];
      const double r = std::hypot(y1, y2);
      if (r == 0.0) continue;
      const double secant = soil_secant(node, r);
      f[static_cast<std::size_t>(i1)] += secant * y1;
      f[static_cast<std::size_t>(i2)] += secant * y2;
    }
  }

  // Adds each node's soil matrix: k_sec·(I − ŷŷᵀ) + k_tan·ŷŷᵀ (k_tan ≥ 0 when clipped; the
  // secant k_sec·I for a secant step).
  void add_soil(Band& k, Tangent kind) const {
    for (int node = 0; node <= n_; ++node) {
      const int i1 = index(node, 0), i2 = index(node, 2);
      const double y1 = d_[static_cast<std::size_t>(i1)], y2 = d_[static_cast<std::size_t>(i2)];
      const double r = std::hypot(y1, y2);
      const CurvePoint c = soil(node, r);
      double tangent = c.tangent;
      if (kind == Tangent::clipped) tangent = std::max(tangent, 0.0);
      if (kind == Tangent::secant || r < kTiny) tangent = c.secant;
      const double u1 = r > 0.0 ? y1 / r : 1.0, u2 = r > 0.0 ? y2 / r : 0.0;
      const double diff = tangent - c.secant;
      k.add(i1, i1, c.secant + diff * u1 * u1);
      k.add(i2, i2, c.secant + diff * u2 * u2);
      k.add(i1, i2, diff * u1 * u2);
    }
  }

  std::string unstable_message() const {
    const double largest = axial_.empty() ? 0.0 : *std::max_element(axial_.begin(), axial_.end());
    if (largest > 0.0)
      return fmt::format(
          "no stable equilibrium: the axial force ({}) exceeds the "
          "buckling load of the pile in this soil, or the soil along the pile "
          "is at its ultimate resistance (a mechanism)",
          QuantityFormat(pile_.units).text(Shown::force, largest));
    return "no stable equilibrium: the soil along the pile is at its ultimate resistance and "
           "the pile turns as a rigid body (a mechanism); the head can take no more lateral load";
  }

  const NonlinearPileSpec& pile_;
  double multiplier_;
  int n_;
  double h_;
  bool fixed_;
  int first_;
  int size_;
  std::vector<double> axial_;
  Band linear_;
  std::vector<double> d_, f_;
  bool converged_ = false;
};

// Two lateral unit directions: e1 ⟂ a (from the global axis least aligned with a, as
// largest_moment_along does), e2 = a × e1.
void lateral_directions(const Vec3& a, Vec3& e1, Vec3& e2) {
  if (std::abs(a[0]) <= std::abs(a[1]) && std::abs(a[0]) <= std::abs(a[2]))
    e1 = {1, 0, 0};
  else if (std::abs(a[1]) <= std::abs(a[2]))
    e1 = {0, 1, 0};
  else
    e1 = {0, 0, 1};
  const double along = dot(e1, a);
  for (int j = 0; j < 3; ++j)
    e1[static_cast<std::size_t>(j)] -= along * a[static_cast<std::size_t>(j)];
  const double norm = std::sqrt(dot(e1, e1));
  for (auto& v : e1) v /= norm;
  e2 = cross(a, e1);
}

// The whole solve: axial first (its force along the pile is the P-Δ load), then lateral.
struct Solved {
  bool converged = false;
  std::string message;
  AxialResult axial;
  std::optional<Lateral> lateral;
  Vec3 e1{}, e2{}, g1{}, g2{};  // bending plane directions and their rotation axes g = e × a
};

void solve_pile(const NonlinearPileSpec& pile, const HeadMovement& movement, double multiplier,
                DeflectedShape* state, Solved& out) {
  validate(pile, movement, multiplier);
  const Vec3& a = pile.axis;
  const Vec3 u{movement[0], movement[1], movement[2]}, w{movement[3], movement[4], movement[5]};
  const double limit = pile.deflection_limit > 0.0 ? pile.deflection_limit
                       : pile.width > 0.0          ? pile.width
                                                   : 0.1 * pile.length;
  const double across = std::sqrt(std::max(dot(u, u) - dot(u, a) * dot(u, a), 0.0));
  if (across > limit) {
    out.message = fmt::format(
        "the head deflection ({}) is beyond {} ({}): the "
        "p-y curves are not meant for movements this large; the pile "
        "has passed its lateral capacity",
        QuantityFormat(pile.units).text(Shown::displacement, across),
        QuantityFormat(pile.units).text(Shown::displacement, limit),
        pile.deflection_limit > 0.0 ? "the limit given"
        : pile.width > 0.0          ? "the pile's width"
                                    : "a tenth of the pile's length");
    return;
  }
  out.axial = solve_axial(pile, dot(u, a), state ? &state->axial : nullptr);
  if (!out.axial.converged) {
    out.message = out.axial.message;
    return;
  }
  lateral_directions(a, out.e1, out.e2);
  out.g1 = cross(out.e1, a);
  out.g2 = cross(out.e2, a);
  // Hetényi's θ0 = (e × a)·ω per plane; the slope is −θ.
  const std::array<double, 4> boundary{dot(out.e1, u), dot(out.e2, u), -dot(out.g1, w),
                                       -dot(out.g2, w)};
  out.lateral.emplace(pile, out.axial.element_force, multiplier);
  if (!out.lateral->solve(boundary, state ? &state->lateral : nullptr, out.message)) return;
  out.converged = true;
  if (state) {
    state->axial = out.axial.movement;
    state->lateral = out.lateral->state();
  }
}

}  // namespace

PileHeadResponse pile_head_response(const NonlinearPileSpec& pile, const HeadMovement& movement,
                                    double p_multiplier) {
  return pile_head_response(pile, movement, p_multiplier, nullptr);
}

PileHeadResponse pile_head_response(const NonlinearPileSpec& pile, const HeadMovement& movement,
                                    double p_multiplier, DeflectedShape* state) {
  PileHeadResponse out;
  Solved s;
  solve_pile(pile, movement, p_multiplier, state, s);
  if (!s.converged) {
    out.message = s.message;
    return out;
  }
  std::array<double, 4> plane_action{};
  std::array<std::array<double, 4>, 4> plane_tangent{};
  std::array<double, 4> axial_coupling{};
  if (!s.lateral->condense(plane_action, plane_tangent, s.axial.force_rate, axial_coupling,
                           out.message))
    return out;
  // The plane unknowns (y0_1, y0_2, φ1, φ2) from the global (u, ω): rows of B, 4×6.
  const Vec3& a = pile.axis;
  double b[4][6] = {};
  for (int j = 0; j < 3; ++j) {
    b[0][j] = s.e1[static_cast<std::size_t>(j)];
    b[1][j] = s.e2[static_cast<std::size_t>(j)];
    b[2][j + 3] = -s.g1[static_cast<std::size_t>(j)];
    b[3][j + 3] = -s.g2[static_cast<std::size_t>(j)];
  }
  // action = Bᵀ·(plane forces) + axial + torsion; tangent = Bᵀ·T·B + k_a·aaᵀ + k_t·aaᵀ.
  const double along_w = a[0] * movement[3] + a[1] * movement[4] + a[2] * movement[5];
  for (int i = 0; i < 6; ++i) {
    double v = 0.0;
    for (int k = 0; k < 4; ++k) v += b[k][i] * plane_action[static_cast<std::size_t>(k)];
    if (i < 3)
      v += s.axial.head_force * a[static_cast<std::size_t>(i)];
    else
      v += pile.torsional * along_w * a[static_cast<std::size_t>(i - 3)];
    out.action[static_cast<std::size_t>(i)] = v;
  }
  for (int i = 0; i < 6; ++i)
    for (int j = 0; j < 6; ++j) {
      double v = 0.0;
      for (int k = 0; k < 4; ++k)
        for (int l = 0; l < 4; ++l)
          v += b[k][i] * plane_tangent[static_cast<std::size_t>(k)][static_cast<std::size_t>(l)] *
               b[l][j];
      if (i < 3 && j < 3)
        v += s.axial.stiffness * a[static_cast<std::size_t>(i)] * a[static_cast<std::size_t>(j)];
      // P-Δ: the lateral forces change with the axial force, w0 = a·u.
      if (j < 3)
        for (int k = 0; k < 4; ++k)
          v += b[k][i] * axial_coupling[static_cast<std::size_t>(k)] *
               a[static_cast<std::size_t>(j)];
      if (i >= 3 && j >= 3)
        v += pile.torsional * a[static_cast<std::size_t>(i - 3)] *
             a[static_cast<std::size_t>(j - 3)];
      out.tangent[static_cast<std::size_t>(i)][static_cast<std::size_t>(j)] = v;
    }
  out.converged = true;
  return out;
}

PileProfile pile_profile(const NonlinearPileSpec& pile, const HeadMovement& movement,
                         double p_multiplier) {
  PileProfile out;
  Solved s;
  solve_pile(pile, movement, p_multiplier, nullptr, s);
  if (!s.converged) {
    out.message = s.message;
    return out;
  }
  const Lateral& lateral = *s.lateral;
  const int n = lateral.segments();
  const double h = lateral.step_length();
  const auto& d = lateral.state();
  for (int node = 0; node <= n; ++node) {
    out.depth.push_back(node * h);
    out.deflection.push_back(std::hypot(d[static_cast<std::size_t>(lateral.index(node, 0))],
                                        d[static_cast<std::size_t>(lateral.index(node, 2))]));
    // The bending moment and shear at the node from the element below it (the last node: from
    // the element above): the element's end forces are (−V, −M) at its start, (V, M) at its end
    // for M = EI·v'' and V = dM/dz − … (only their sizes are reported).
    double m2 = 0.0, v2 = 0.0;
    for (int plane = 0; plane < 2; ++plane) {
      const bool last = node == n;
      const auto f = lateral.element_forces(last ? n - 1 : node, plane);
      const double m = last ? f[3] : f[1], v = last ? f[2] : f[0];
      m2 += m * m;
      v2 += v * v;
    }
    out.moment.push_back(std::sqrt(m2));
    out.shear.push_back(node == 0 ? lateral.head_shear() : std::sqrt(v2));
    const auto& ef = s.axial.element_force;
    out.axial.push_back(node == 0   ? s.axial.head_force
                        : node == n ? ef[static_cast<std::size_t>(n - 1)]
                                    : 0.5 * (ef[static_cast<std::size_t>(node - 1)] +
                                             ef[static_cast<std::size_t>(node)]));
    if (out.moment.back() > out.max_moment) {
      out.max_moment = out.moment.back();
      out.max_moment_depth = node * h;
    }
  }
  out.head_deflection = out.deflection.front();
  out.converged = true;
  return out;
}

}  // namespace cairn
