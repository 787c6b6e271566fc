#include "cairn/solver/beam_column.hpp"

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <stdexcept>

#include <fmt/format.h>

namespace cairn {

BeamColumnResult solve_beam_column(const BeamColumnPile& pile, const BeamColumnHead& head) {
  if (!(pile.bending_stiffness > 0.0) || !(pile.length > 0.0) || pile.segments < 8 || !pile.soil)
    throw std::invalid_argument("beam-column: needs EI > 0, L > 0, at least 8 segments and a soil");
  const int n = pile.segments;
  const double h = pile.length / n, ei = pile.bending_stiffness, q = pile.axial;
  // Unknowns: y at nodes −2 … n + 2, stored at index node + 2.
  const int size = n + 5;
  auto at = [](int node) { return node + 2; };
  Eigen::MatrixXd base = Eigen::MatrixXd::Zero(size, size);
  Eigen::VectorXd right = Eigen::VectorXd::Zero(size);
  const double a = ei / std::pow(h, 4), b = q / (h * h);
  // Rows 0 … n: the differential equation at each node (the soil diagonal added per step).
  for (int i = 0; i <= n; ++i) {
    const int r = i;
    base(r, at(i - 2)) += a;
    base(r, at(i - 1)) += -4.0 * a + b;
    base(r, at(i)) += 6.0 * a - 2.0 * b;
    base(r, at(i + 1)) += -4.0 * a + b;
    base(r, at(i + 2)) += a;
  }
  // Shear at a node i: EI·(y[i+2] − 2y[i+1] + 2y[i−1] − y[i−2])/(2h³) + Q·(y[i+1] − y[i−1])/(2h).
  auto shear_row = [&](int r, int i) {
    const double s = ei / (2.0 * h * h * h), t = q / (2.0 * h);
    base(r, at(i + 2)) += s;
    base(r, at(i + 1)) += -2.0 * s + t;
    base(r, at(i - 1)) += 2.0 * s - t;
    base(r, at(i - 2)) += -s;
  };
  auto moment_row = [&](int r, int i) {
    const double s = ei / (h * h);
    base(r, at(i - 1)) += s;
    base(r, at(i)) += -2.0 * s;
    base(r, at(i + 1)) += s;
  };
  shear_row(n + 1, 0);
  right(n + 1) = head.shear;
  if (head.fixed_slope) {
    // y'(0) = (y1 − y−1)/(2h) = −θ0, scaled by EI/h: EI·(y1 − y−1)/(2h²) = −θ0·EI/h.
    base(n + 2, at(1)) = ei / (2.0 * h * h);
    base(n + 2, at(-1)) = -ei / (2.0 * h * h);
    right(n + 2) = -head.rotation * ei / h;
  } else {
    moment_row(n + 2, 0);
    right(n + 2) = head.moment;
  }
  moment_row(n + 3, n);
  shear_row(n + 4, n);

  BeamColumnResult out;
  std::vector<double> secant(static_cast<std::size_t>(n + 1), 0.0);
  // Start from a small trial deflection: the secant at 1e-6·b-like movements (1e-6 m).
  constexpr double kTrial = 1e-6;
  for (int i = 0; i <= n; ++i)
    secant[static_cast<std::size_t>(i)] = pile.soil(i * h, kTrial) / kTrial;
  Eigen::VectorXd y = Eigen::VectorXd::Zero(size);
  constexpr int kLimit = 300;
  constexpr double kTolerance = 1e-9;
  for (int iteration = 1; iteration <= kLimit; ++iteration) {
    Eigen::MatrixXd k = base;
    for (int i = 0; i <= n; ++i) k(i, at(i)) += secant[static_cast<std::size_t>(i)];
    const Eigen::PartialPivLU<Eigen::MatrixXd> lu(k);
    const Eigen::VectorXd next = lu.solve(right);
    if (!next.allFinite()) {
      out.message = "the pile has no stable solution under this load (the soil and the pile "
                    "cannot hold it, or the axial load exceeds the buckling load)";
      out.iterations = iteration;
      return out;
    }
    const double largest = std::max(next.cwiseAbs().maxCoeff(), 1e-300);
    const double change = (next - y).cwiseAbs().maxCoeff() / largest;
    y = next;
    // New secants, each at its node's deflection (the curve's value over it).
    for (int i = 0; i <= n; ++i) {
      const double yi = y(at(i));
      const double z = i * h;
      secant[static_cast<std::size_t>(i)] =
          std::abs(yi) > kTrial ? pile.soil(z, yi) / yi : pile.soil(z, kTrial) / kTrial;
    }
    out.iterations = iteration;
    if (change < kTolerance && iteration > 1) {
      out.converged = true;
      break;
    }
    if (largest > 1e3 * pile.length) {
      out.message = "the deflection grows without bound: the soil cannot hold the load "
                    "(a mechanism)";
      return out;
    }
  }
  if (!out.converged) {
    out.message = fmt::format("the soil springs did not settle in {} iterations", kLimit);
    return out;
  }
  for (int i = 0; i <= n; ++i) {
    out.depth.push_back(i * h);
    out.deflection.push_back(y(at(i)));
    const double m = ei * (y(at(i - 1)) - 2.0 * y(at(i)) + y(at(i + 1))) / (h * h);
    out.moment.push_back(m);
    if (std::abs(m) > out.max_moment) {
      out.max_moment = std::abs(m);
      out.max_moment_depth = i * h;
    }
  }
  out.head_deflection = y(at(0));
  out.head_rotation = -(y(at(1)) - y(at(-1))) / (2.0 * h);
  out.head_moment = out.moment.front();
  return out;
}

}  // namespace cairn
