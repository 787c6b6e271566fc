// lateral.cpp — Hetényi beam on elastic foundation, Broms' ultimate lateral resistance and
// the pile section's axial capacity. Equations and sources are in lateral.hpp and
// docs/methods-lateral.md.
#include "cairn/geotechnics/lateral.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>
#include <numbers>
#include <stdexcept>
#include <string>
#include <utility>

#include "cairn/core/enum_names.hpp"

namespace cairn {
namespace {

constexpr double kPi = std::numbers::pi;

void require_positive(double value, const char* what) {
  if (!(value > 0.0) || !std::isfinite(value)) {
    throw std::invalid_argument(std::string(what) + " must be a positive number, got " +
                                std::to_string(value));
  }
}

std::string fixed3(double value) {
  char text[64];
  std::snprintf(text, sizeof text, "%.3f", value);
  return text;
}

// ---- Finite or semi-infinite beam on a Winkler foundation ------------------------------
//
// EI·y'''' + k·y = 0, x measured down from the head. The general solution is written with
// functions that decay away from each end, so that long beams stay well conditioned:
//   b1 = g(x), b2 = h(x), b3 = g(L − x), b4 = h(L − x),
//   g(t) = e^(−λt)·cos λt, h(t) = e^(−λt)·sin λt.
// A semi-infinite beam keeps b1 and b2 only (Hetényi 1946).
// Bending moment M = EI·y'', shear V = EI·y'''. At the head EI·y'''(0) = H, and either
// EI·y''(0) = M0 (head free to rotate, M0 applied) or y'(0) = 0 (fixed head). A free tip has
// y''(L) = y'''(L) = 0. The head rotation in the header's convention is θ0 = −y'(0).

// n-th derivative (n = 0..3) of g(t) and h(t) with respect to t.
std::array<double, 2> decaying_derivative(int n, double lambda, double t) {
  const double e = std::exp(-lambda * t);
  const double c = std::cos(lambda * t);
  const double s = std::sin(lambda * t);
  switch (n) {
    case 0: return {e * c, e * s};
    case 1: return {-lambda * e * (c + s), lambda * e * (c - s)};
    case 2: return {2 * lambda * lambda * e * s, -2 * lambda * lambda * e * c};
    default: {
      const double l3 = 2 * lambda * lambda * lambda;
      return {l3 * e * (c - s), l3 * e * (c + s)};
    }
  }
}

struct Beam {
  double lambda = 0.0;
  double bending_stiffness = 0.0;
  double length = 0.0;  // 0 = semi-infinite
  std::array<double, 4> coefficients{};

  bool semi_infinite() const { return length <= 0.0; }

  // Row of basis-function derivatives of order n at depth x.
  std::array<double, 4> basis(int n, double x) const {
    std::array<double, 4> row{};
    const auto near = decaying_derivative(n, lambda, x);
    row[0] = near[0];
    row[1] = near[1];
    if (!semi_infinite()) {
      // d/dx of a function of (L − x) flips the sign once per derivative.
      const auto far = decaying_derivative(n, lambda, length - x);
      const double sign = (n % 2 == 0) ? 1.0 : -1.0;
      row[2] = sign * far[0];
      row[3] = sign * far[1];
    }
    return row;
  }

  double derivative(int n, double x) const {
    const auto row = basis(n, x);
    double sum = 0.0;
    for (int i = 0; i < 4; ++i) sum += row[i] * coefficients[i];
    return sum;
  }
  double moment(double x) const { return bending_stiffness * derivative(2, x); }
  double shear(double x) const { return bending_stiffness * derivative(3, x); }
};

// Solves A·c = b for a small dense system by Gaussian elimination with partial pivoting.
template <std::size_t N>
std::array<double, N> solve_dense(std::array<std::array<double, N>, N> a, std::array<double, N> b) {
  for (std::size_t col = 0; col < N; ++col) {
    std::size_t pivot = col;
    for (std::size_t row = col + 1; row < N; ++row) {
      if (std::abs(a[row][col]) > std::abs(a[pivot][col])) pivot = row;
    }
    if (a[pivot][col] == 0.0) throw std::logic_error("lateral: singular beam system");
    std::swap(a[pivot], a[col]);
    std::swap(b[pivot], b[col]);
    for (std::size_t row = col + 1; row < N; ++row) {
      const double m = a[row][col] / a[col][col];
      for (std::size_t k = col; k < N; ++k) a[row][k] -= m * a[col][k];
      b[row] -= m * b[col];
    }
  }
  std::array<double, N> x{};
  for (std::size_t i = N; i-- > 0;) {
    double sum = b[i];
    for (std::size_t k = i + 1; k < N; ++k) sum -= a[i][k] * x[k];
    x[i] = sum / a[i][i];
  }
  return x;
}

// Beam under head shear H and either head moment M0 (pinned) or no head rotation (fixed).
Beam solve_beam(double lambda, double bending_stiffness, double length, HeadFixity head,
                double shear, double head_moment) {
  Beam beam{lambda, bending_stiffness, length, {}};
  // Each condition is y^(n)(x) = value; rows are scaled by 1/λ^n to balance the system.
  struct Condition { int order; double x; double value; };
  std::array<Condition, 4> conditions{};
  conditions[0] = {3, 0.0, shear / bending_stiffness};
  conditions[1] = head == HeadFixity::fixed ? Condition{1, 0.0, 0.0}
                                            : Condition{2, 0.0, head_moment / bending_stiffness};
  conditions[2] = {2, length, 0.0};
  conditions[3] = {3, length, 0.0};
  if (beam.semi_infinite()) {
    std::array<std::array<double, 2>, 2> a{};
    std::array<double, 2> b{};
    for (std::size_t i = 0; i < 2; ++i) {
      const double scale = std::pow(lambda, -conditions[i].order);
      const auto row = beam.basis(conditions[i].order, conditions[i].x);
      a[i] = {row[0] * scale, row[1] * scale};
      b[i] = conditions[i].value * scale;
    }
    const auto c = solve_dense<2>(a, b);
    beam.coefficients = {c[0], c[1], 0.0, 0.0};
    return beam;
  }
  std::array<std::array<double, 4>, 4> a{};
  std::array<double, 4> b{};
  for (std::size_t i = 0; i < 4; ++i) {
    const double scale = std::pow(lambda, -conditions[i].order);
    const auto row = beam.basis(conditions[i].order, conditions[i].x);
    for (std::size_t k = 0; k < 4; ++k) a[i][k] = row[k] * scale;
    b[i] = conditions[i].value * scale;
  }
  beam.coefficients = solve_dense<4>(a, b);
  return beam;
}

// Largest |M| along the beam and where: the head, or a point of zero shear found by scanning
// for a sign change of V and bisecting. A semi-infinite beam is scanned over 2π/λ, past its
// first and largest moment peak (the envelope decays as e^(−λx)).
std::array<double, 2> largest_moment(const Beam& beam) {
  const double end = beam.semi_infinite() ? 2.0 * kPi / beam.lambda : beam.length;
  double best = std::abs(beam.moment(0.0));
  double best_x = 0.0;
  constexpr int kSteps = 800;
  double x0 = 0.0;
  double v0 = beam.shear(x0);
  for (int i = 1; i <= kSteps; ++i) {
    const double x1 = end * i / kSteps;
    const double v1 = beam.shear(x1);
    if ((v0 < 0.0) != (v1 < 0.0)) {
      double lo = x0, hi = x1, vlo = v0;
      for (int k = 0; k < 60; ++k) {
        const double mid = 0.5 * (lo + hi);
        const double vmid = beam.shear(mid);
        if ((vmid < 0.0) == (vlo < 0.0)) { lo = mid; vlo = vmid; } else { hi = mid; }
      }
      const double x = 0.5 * (lo + hi);
      const double m = std::abs(beam.moment(x));
      if (m > best) { best = m; best_x = x; }
    }
    x0 = x1;
    v0 = v1;
  }
  return {best, best_x};
}

void check_elastic_pile(const ElasticPile& pile) {
  require_positive(pile.bending_stiffness, "bending stiffness EI");
  require_positive(pile.subgrade_modulus, "subgrade modulus kh");
  require_positive(pile.width, "pile width D");
  if (!(pile.embedded_length >= 0.0) || !std::isfinite(pile.embedded_length)) {
    throw std::invalid_argument("embedded length must be zero (unknown) or positive");
  }
}

LateralHeadStiffness stiffness_basics(const ElasticPile& pile) {
  LateralHeadStiffness out;
  out.winkler_modulus = pile.subgrade_modulus * pile.width;                         // k = kh·D
  out.lambda = std::pow(out.winkler_modulus / (4.0 * pile.bending_stiffness), 0.25);  // Hetényi
  out.long_pile_length = kPi / out.lambda;
  out.long_pile = pile.embedded_length <= 0.0 || pile.embedded_length > out.long_pile_length;
  return out;
}

void finish_stiffness(LateralHeadStiffness& out, HeadFixity head) {
  if (head == HeadFixity::pinned) {
    out.lateral_stiffness = out.k_hh - out.k_hm * out.k_hm / out.k_mm;
    out.head_moment_per_shear = 0.0;
  } else {
    out.lateral_stiffness = out.k_hh;
    out.head_moment_per_shear = std::abs(out.k_hm) / out.k_hh;
  }
}

// Length of beam the solver treats as semi-infinite for a long pile.
double beam_length_for(const ElasticPile& pile, const LateralHeadStiffness& basics) {
  return basics.long_pile ? 0.0 : pile.embedded_length;
}

}  // namespace

LateralHeadStiffness finite_pile_head_stiffness(const ElasticPile& pile) {
  check_elastic_pile(pile);
  require_positive(pile.embedded_length, "embedded length L");
  LateralHeadStiffness out = stiffness_basics(pile);
  const double length = pile.embedded_length;
  // Flexibility from two unit head actions, then its inverse.
  const Beam unit_shear =
      solve_beam(out.lambda, pile.bending_stiffness, length, HeadFixity::pinned, 1.0, 0.0);
  const Beam unit_moment =
      solve_beam(out.lambda, pile.bending_stiffness, length, HeadFixity::pinned, 0.0, 1.0);
  const double f_hh = unit_shear.derivative(0, 0.0);
  const double f_mm = -unit_moment.derivative(1, 0.0);
  // Maxwell: the two off-diagonal terms are equal; average the round-off away.
  const double f_hm = 0.5 * (-unit_shear.derivative(1, 0.0) + unit_moment.derivative(0, 0.0));
  const double det = f_hh * f_mm - f_hm * f_hm;
  out.k_hh = f_mm / det;
  out.k_hm = -f_hm / det;
  out.k_mm = f_hh / det;
  finish_stiffness(out, pile.head);
  return out;
}

LateralHeadStiffness lateral_head_stiffness(const ElasticPile& pile) {
  check_elastic_pile(pile);
  LateralHeadStiffness out = stiffness_basics(pile);
  if (!out.long_pile) {
    const double long_value = pile.head == HeadFixity::pinned
                                  ? out.winkler_modulus / (2.0 * out.lambda)
                                  : out.winkler_modulus / out.lambda;
    out = finite_pile_head_stiffness(pile);
    out.notes.push_back("pile is not long for Hetényi's closed form (L = " +
                        fixed3(pile.embedded_length) + " m ≤ π/λ = " +
                        fixed3(out.long_pile_length) +
                        " m): solved as a finite beam with a free tip; the long-pile value "
                        "would be " + fixed3(long_value) + " kN/m");
    return out;
  }
  const double k = out.winkler_modulus;
  const double l = out.lambda;
  // Hetényi (1946), semi-infinite beam loaded at its end.
  out.k_hh = k / l;
  out.k_hm = -k / (2.0 * l * l);
  out.k_mm = k / (2.0 * l * l * l);
  finish_stiffness(out, pile.head);
  if (pile.embedded_length <= 0.0) {
    out.notes.push_back("embedded length not given: the pile is taken as long (L > π/λ = " +
                        fixed3(out.long_pile_length) + " m)");
  }
  return out;
}

LateralHeadResponse lateral_head_response(const ElasticPile& pile, double shear) {
  check_elastic_pile(pile);
  if (!std::isfinite(shear)) throw std::invalid_argument("head shear must be a finite number");
  const LateralHeadStiffness basics = stiffness_basics(pile);
  const Beam beam = solve_beam(basics.lambda, pile.bending_stiffness,
                               beam_length_for(pile, basics), pile.head, shear, 0.0);
  LateralHeadResponse out;
  out.deflection = beam.derivative(0, 0.0);
  out.rotation = pile.head == HeadFixity::fixed ? 0.0 : -beam.derivative(1, 0.0);
  out.head_moment = pile.head == HeadFixity::fixed ? std::abs(beam.moment(0.0)) : 0.0;
  const auto peak = largest_moment(beam);
  out.max_moment = peak[0];
  out.max_moment_depth = peak[1];
  return out;
}

MomentInfluence moment_influence(const ElasticPile& pile, int samples) {
  check_elastic_pile(pile);
  if (samples < 2) throw std::invalid_argument("moment influence needs at least 2 samples");
  const LateralHeadStiffness basics = stiffness_basics(pile);
  const double length = beam_length_for(pile, basics);
  const Beam unit_shear =
      solve_beam(basics.lambda, pile.bending_stiffness, length, HeadFixity::pinned, 1.0, 0.0);
  const Beam unit_moment =
      solve_beam(basics.lambda, pile.bending_stiffness, length, HeadFixity::pinned, 0.0, 1.0);
  double end = 2.0 * kPi / basics.lambda;
  if (length > 0.0) end = length;
  else if (pile.embedded_length > 0.0) end = std::min(end, pile.embedded_length);
  MomentInfluence out;
  for (int i = 0; i <= samples; ++i) {
    const double z = end * i / samples;
    out.depth.push_back(z);
    out.per_shear.push_back(unit_shear.moment(z));
    out.per_moment.push_back(unit_moment.moment(z));
  }
  return out;
}

// ---- Broms (1964) ----------------------------------------------------------------------

double broms_beta(double subgrade_modulus, double width, double bending_stiffness) {
  require_positive(subgrade_modulus, "subgrade modulus kh");
  require_positive(width, "pile width D");
  require_positive(bending_stiffness, "bending stiffness EI");
  return std::pow(subgrade_modulus * width / (4.0 * bending_stiffness), 0.25);
}

double broms_eta(double modulus_gradient, double bending_stiffness) {
  require_positive(modulus_gradient, "modulus gradient nh");
  require_positive(bending_stiffness, "bending stiffness EI");
  return std::pow(modulus_gradient / bending_stiffness, 0.2);
}

PileLengthClass classify_cohesive(double beta_times_length) {
  if (beta_times_length < 1.5) return PileLengthClass::short_pile;
  if (beta_times_length > 2.5) return PileLengthClass::long_pile;
  return PileLengthClass::intermediate;
}

PileLengthClass classify_cohesionless(double eta_times_length) {
  if (eta_times_length < 2.0) return PileLengthClass::short_pile;
  if (eta_times_length > 4.0) return PileLengthClass::long_pile;
  return PileLengthClass::intermediate;
}

namespace {

// Positive root of a·x² + b·x + c = 0 with a > 0 and c ≤ 0.
double positive_root(double a, double b, double c) {
  return (-b + std::sqrt(b * b - 4.0 * a * c)) / (2.0 * a);
}

// Cohesive soil (Broms 1964a): no reaction over the top 1.5D, then 9cu·D. With a = 9cu·D,
// f = H/a, g = L − 1.5D − f.
BromsResult broms_cohesive(const BromsInput& in) {
  const double d = in.width;
  const double e = in.eccentricity;
  const double a = 9.0 * in.undrained_strength * d;
  const double l1 = in.embedded_length - 1.5 * d;  // length that reacts
  if (!(l1 > 0.0)) {
    throw std::invalid_argument("Broms (cohesive soil) needs an embedded length above 1.5·D");
  }
  BromsResult out;
  const auto set = [&](double h, BromsMode mode, double max_moment, double depth) {
    out.ultimate_load = h;
    out.mode = mode;
    out.reaction_length = h / a;
    out.max_moment = max_moment;
    out.max_moment_depth = depth;
  };
  const double b = e + 1.5 * d;
  if (in.head == HeadFixity::pinned) {
    // Short: H(e + 1.5D + 0.5f) = 2.25·D·g²·cu = a·g²/4, a quadratic in H:
    // H² + 4a·c·H − a²·L1² = 0 with c = e + 1.5D + L1/2.
    const double c = b + 0.5 * l1;
    const double h_short = positive_root(1.0, 4.0 * a * c, -a * a * l1 * l1);
    const double m_short = h_short * (b + 0.5 * h_short / a);
    if (!in.yield_moment || m_short <= *in.yield_moment) {
      set(h_short, BromsMode::short_pile, m_short, 1.5 * d + h_short / a);
      return out;
    }
    // Long: My = H(e + 1.5D + 0.5f) → H²/(2a) + b·H − My = 0.
    const double my = *in.yield_moment;
    const double h_long = positive_root(0.5 / a, b, -my);
    set(h_long, BromsMode::long_pile, my, 1.5 * d + h_long / a);
    return out;
  }
  // Fixed head. Short: the pile translates, H = 9cu·D·(L − 1.5D), head moment
  // H(e + 0.5L + 0.75D) — the resultant acts at mid-length of the reacting part.
  const double h_short = a * l1;
  const double m_short = h_short * (e + 0.75 * d + 0.5 * in.embedded_length);
  if (!in.yield_moment || m_short <= *in.yield_moment) {
    set(h_short, BromsMode::short_pile, m_short, -e);
    return out;
  }
  const double my = *in.yield_moment;
  // Intermediate: yield at the head, then rotation: H(e + 1.5D + 0.5f) − My = a·g²/4,
  // i.e. H² + 4a·c·H − (a²·L1² + 4a·My) = 0.
  const double c = b + 0.5 * l1;
  const double h_int = positive_root(1.0, 4.0 * a * c, -(a * a * l1 * l1 + 4.0 * a * my));
  const double g = l1 - h_int / a;
  const double m_positive = 0.25 * a * g * g;  // 2.25·cu·D·g², at depth 1.5D + f
  if (m_positive <= my) {
    set(h_int, BromsMode::intermediate, my, -e);
    return out;
  }
  // Long: hinges at the head and at depth: H(e + 1.5D + 0.5f) = 2My.
  const double h_long = positive_root(0.5 / a, b, -2.0 * my);
  set(h_long, BromsMode::long_pile, my, -e);
  return out;
}

// H with H·(e + (2/3)·f(H)) = target, f = √[H/(1.5·q)], q = γ'·D·Kp; the left side rises
// monotonically with H, so bisection between 0 and an upper bound is safe.
double sand_load_for_moment(double q, double e, double target, double upper) {
  const auto moment = [&](double h) { return h * (e + 2.0 / 3.0 * std::sqrt(h / (1.5 * q))); };
  double hi = upper;
  while (moment(hi) < target) hi *= 2.0;
  double lo = 0.0;
  for (int i = 0; i < 200 && hi - lo > 1e-12 * hi; ++i) {
    const double mid = 0.5 * (lo + hi);
    (moment(mid) < target ? lo : hi) = mid;
  }
  return 0.5 * (lo + hi);
}

// Cohesionless soil (Broms 1964b): reaction 3Kp·γ'·D·z; q = γ'·D·Kp.
BromsResult broms_cohesionless(const BromsInput& in) {
  const double phi = in.friction_angle * kPi / 180.0;
  const double kp = std::pow(std::tan(kPi / 4.0 + phi / 2.0), 2);
  const double q = in.effective_unit_weight * in.width * kp;
  const double l = in.embedded_length;
  const double e = in.eccentricity;
  const auto zero_shear_depth = [&](double h) { return std::sqrt(h / (1.5 * q)); };
  BromsResult out;
  out.passive_coefficient = kp;
  const auto set = [&](double h, BromsMode mode, double max_moment, double depth,
                       double reaction_length) {
    out.ultimate_load = h;
    out.mode = mode;
    out.reaction_length = reaction_length;
    out.max_moment = max_moment;
    out.max_moment_depth = depth;
  };
  if (in.head == HeadFixity::pinned) {
    // Short: moments about the toe, H = 0.5·γ'·D·L³·Kp/(e + L); Mmax = H(e + 2f/3).
    const double h_short = 0.5 * q * l * l * l / (e + l);
    const double f = zero_shear_depth(h_short);
    const double m_short = h_short * (e + 2.0 * f / 3.0);
    if (!in.yield_moment || m_short <= *in.yield_moment) {
      set(h_short, BromsMode::short_pile, m_short, f, f);
      return out;
    }
    const double my = *in.yield_moment;
    const double h_long = sand_load_for_moment(q, e, my, h_short);  // H(e + 2f/3) = My
    set(h_long, BromsMode::long_pile, my, zero_shear_depth(h_long), zero_shear_depth(h_long));
    return out;
  }
  // Fixed head. Short: translation, H = 1.5·γ'·L²·D·Kp, head moment H(e + 2L/3).
  const double h_short = 1.5 * q * l * l;
  const double m_short = h_short * (e + 2.0 * l / 3.0);
  if (!in.yield_moment || m_short <= *in.yield_moment) {
    set(h_short, BromsMode::short_pile, m_short, -e, l);
    return out;
  }
  const double my = *in.yield_moment;
  // Intermediate: yield at the head, rotation about the toe:
  // H(e + L) − My = 0.5·γ'·D·L³·Kp.
  const double h_int = (0.5 * q * l * l * l + my) / (e + l);
  const double f_int = zero_shear_depth(h_int);
  const double m_positive = h_int * (e + 2.0 * f_int / 3.0) - my;  // at depth f
  if (m_positive <= my) {
    set(h_int, BromsMode::intermediate, my, -e, f_int);
    return out;
  }
  const double h_long = sand_load_for_moment(q, e, 2.0 * my, h_int);  // H(e + 2f/3) = 2My
  set(h_long, BromsMode::long_pile, my, -e, zero_shear_depth(h_long));
  return out;
}

}  // namespace

BromsResult broms_ultimate_lateral(const BromsInput& input) {
  require_positive(input.width, "pile width D");
  require_positive(input.embedded_length, "embedded length L");
  if (!(input.eccentricity >= 0.0) || !std::isfinite(input.eccentricity)) {
    throw std::invalid_argument("eccentricity e must be zero or positive");
  }
  if (input.yield_moment) require_positive(*input.yield_moment, "yield moment My");
  BromsResult out;
  if (input.soil == SoilKind::clay) {
    require_positive(input.undrained_strength, "undrained strength cu");
    out = broms_cohesive(input);
  } else {
    require_positive(input.effective_unit_weight, "effective unit weight γ'");
    if (!(input.friction_angle > 0.0 && input.friction_angle < 90.0)) {
      throw std::invalid_argument("friction angle φ' must lie between 0 and 90 degrees");
    }
    out = broms_cohesionless(input);
  }
  if (!input.yield_moment) {
    out.notes.push_back("yield moment not given: the pile is taken not to yield (short-pile "
                        "mechanism only)");
  }
  if (input.head == HeadFixity::fixed && input.eccentricity > 0.0) {
    out.notes.push_back("fixed head above the ground (e = " + fixed3(input.eccentricity) +
                        " m): Broms gives fixed-head solutions for e = 0; the same soil "
                        "reactions are used with e added to the lever arms");
  }
  return out;
}

double allowable_lateral_load(double ultimate_load, double factor_of_safety) {
  if (!(ultimate_load >= 0.0) || !std::isfinite(ultimate_load)) {
    throw std::invalid_argument("ultimate lateral load must be zero or positive");
  }
  if (!(factor_of_safety >= 1.0) || !std::isfinite(factor_of_safety)) {
    throw std::invalid_argument("factor of safety must be at least 1");
  }
  return ultimate_load / factor_of_safety;
}

// ---- Section capacity ------------------------------------------------------------------

double concrete_nominal_axial_strength(const ConcreteSection& s) {
  require_positive(s.gross_area, "gross area Ag");
  require_positive(s.concrete_strength, "concrete strength f'c");
  if (!(s.steel_area >= 0.0 && s.steel_area < s.gross_area)) {
    throw std::invalid_argument("steel area must be zero or positive and less than Ag");
  }
  if (!(s.steel_yield >= 0.0)) throw std::invalid_argument("steel yield fy must not be negative");
  // ACI 318-19 eq. 22.4.2.2: Po = 0.85·f'c·(Ag − Ast) + fy·Ast.
  return 0.85 * s.concrete_strength * (s.gross_area - s.steel_area) + s.steel_yield * s.steel_area;
}

namespace {
void require_factor(double factor) {
  if (!(factor > 0.0 && factor <= 1.0)) {
    throw std::invalid_argument("capacity factor must lie in (0, 1], got " + std::to_string(factor));
  }
}
}  // namespace

double concrete_axial_capacity(const ConcreteSection& section, double factor) {
  require_factor(factor);
  return factor * concrete_nominal_axial_strength(section);
}

double steel_axial_capacity(double area, double yield_stress, double factor) {
  require_positive(area, "steel area A");
  require_positive(yield_stress, "steel yield fy");
  require_factor(factor);
  return factor * yield_stress * area;
}

double axial_bending_utilization(double axial, double axial_capacity, double moment,
                                 double moment_capacity) {
  require_positive(axial_capacity, "axial capacity Pc");
  require_positive(moment_capacity, "moment capacity Mc");
  return std::abs(axial) / axial_capacity + std::abs(moment) / moment_capacity;
}

// Names in the order the enum declares its values (enum_names.hpp).
constexpr const char* kHeadFixityNames[] = {"pinned", "fixed", "partially fixed"};
const char* to_string(HeadFixity head) { return name_in(kHeadFixityNames, head, "pinned"); }

// Broms modes and length classes share their names (short_pile, intermediate, long_pile).
constexpr const char* kShortToLongNames[] = {"short", "intermediate", "long"};
const char* to_string(BromsMode mode) { return name_in(kShortToLongNames, mode); }

const char* to_string(PileLengthClass length_class) {
  return name_in(kShortToLongNames, length_class);
}

}  // namespace cairn
