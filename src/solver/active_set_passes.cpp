#include "active_set_passes.hpp"

#include <algorithm>
#include <bit>
#include <cmath>
#include <cstdint>

namespace cairn::detail {

// Built twice, as pinned_forces.cpp: AVX2 alone (never FMA) and the baseline, the same bits.
#if defined(__x86_64__) && defined(__GNUC__) && !defined(__clang__)
#define CAIRN_PASS_CLONES __attribute__((target_clones("avx2", "default")))
#else
#define CAIRN_PASS_CLONES
#endif

CAIRN_PASS_CLONES
double head_movements_along(const PinnedPiles& piles, const double movement[6],
                            double* __restrict along) {
  const double t0 = movement[0], t1 = movement[1], t2 = movement[2];
  const double h0 = movement[3], h1 = movement[4], h2 = movement[5];
  const std::size_t n = piles.size();
  // A block of piles at a time: a, and |u|² into a buffer (a loop without branches, which
  // the compiler vectorizes), then the largest |u|² kept per lane of four. max is exact in
  // any order, and (m < x ? x : m) passes over a NaN as std::max(m, x) does. One square root
  // at the end: √ is correctly rounded and so never decreasing, and the largest of √x_i is
  // √ of the largest x_i, the same number.
  constexpr std::size_t kBlock = 128, kLanes = 4;
  double squared[kBlock];
  double largest[kLanes] = {0.0, 0.0, 0.0, 0.0};
  for (std::size_t start = 0; start < n; start += kBlock) {
    const std::size_t len = std::min(kBlock, n - start);
    const double* __restrict rx = piles.rho_x.data() + start;
    const double* __restrict ry = piles.rho_y.data() + start;
    const double* __restrict rz = piles.rho_z.data() + start;
    const double* __restrict ax = piles.axis_x.data() + start;
    const double* __restrict ay = piles.axis_y.data() + start;
    const double* __restrict az = piles.axis_z.data() + start;
    double* __restrict out = along + start;
    for (std::size_t k = 0; k < len; ++k) {
      const double u0 = t0 + (h1 * rz[k] - h2 * ry[k]);
      const double u1 = t1 + (h2 * rx[k] - h0 * rz[k]);
      const double u2 = t2 + (h0 * ry[k] - h1 * rx[k]);
      out[k] = (ax[k] * u0 + ay[k] * u1) + az[k] * u2;
      squared[k] = (u0 * u0 + u1 * u1) + u2 * u2;
    }
    std::size_t k = 0;
    for (; k + kLanes <= len; k += kLanes)
      for (std::size_t j = 0; j < kLanes; ++j)
        largest[j] = largest[j] < squared[k + j] ? squared[k + j] : largest[j];
    for (; k < len; ++k) largest[0] = largest[0] < squared[k] ? squared[k] : largest[0];
  }
  double result = 0.0;
  for (const double m : largest) result = result < m ? m : result;
  return std::sqrt(result);
}

CAIRN_PASS_CLONES
void sum_stiffness(std::size_t n, const double* __restrict with,
                   const double* __restrict without, const std::vector<bool>& active,
                   double out[36]) {
  // The 36 sums held in registers (nine of four with AVX2: the inner loop unrolled), one
  // pile's terms added at a time.
  double k[36] = {};
  for (std::size_t i = 0; i < n; ++i) {
    const double* __restrict term = (active[i] ? with : without) + 36 * i;
#pragma GCC unroll 36
    for (std::size_t e = 0; e < 36; ++e) k[e] += term[e];
  }
  for (std::size_t e = 0; e < 36; ++e) out[e] = k[e];
}

CAIRN_PASS_CLONES
bool active_set_moves(std::size_t n, const double* __restrict along,
                      const std::uint8_t* __restrict state, double tolerance,
                      std::uint8_t* __restrict moves) {
  std::uint8_t any = 0;
  for (std::size_t i = 0; i < n; ++i) {
    const std::uint8_t move = ((state[i] == kInContact) & (along[i] < -tolerance)) |
                              ((state[i] == kDroppedOut) & (along[i] > tolerance));
    moves[i] = move;
    any |= move;
  }
  return any != 0;
}

CAIRN_PASS_CLONES
void pinned_imbalance(const PinnedPiles& piles, const double movement[6],
                      const std::vector<bool>& active, const double load[6], double sum[6]) {
  const double t0 = movement[0], t1 = movement[1], t2 = movement[2];
  const double h0 = movement[3], h1 = movement[4], h2 = movement[5];
  const std::size_t n = piles.size();
  double s0 = load[0], s1 = load[1], s2 = load[2], s3 = load[3], s4 = load[4], s5 = load[5];
  // A block of piles' terms at a time (a loop without branches), then their sum in order.
  constexpr std::size_t kBlock = 128;
  double fx[kBlock], fy[kBlock], fz[kBlock], mx[kBlock], my[kBlock], mz[kBlock];
  std::uint64_t on[kBlock];
  for (std::size_t start = 0; start < n; start += kBlock) {
    const std::size_t len = std::min(kBlock, n - start);
    for (std::size_t k = 0; k < len; ++k) on[k] = active[start + k] ? ~std::uint64_t{0} : 0;
    const double* __restrict rx = piles.rho_x.data() + start;
    const double* __restrict ry = piles.rho_y.data() + start;
    const double* __restrict rz = piles.rho_z.data() + start;
    const double* __restrict ax = piles.axis_x.data() + start;
    const double* __restrict ay = piles.axis_y.data() + start;
    const double* __restrict az = piles.axis_z.data() + start;
    const double* __restrict ka = piles.axial.data() + start;
    const double* __restrict kl = piles.lateral.data() + start;
    for (std::size_t k = 0; k < len; ++k) {
      const double u0 = t0 + (h1 * rz[k] - h2 * ry[k]);
      const double u1 = t1 + (h2 * rx[k] - h0 * rz[k]);
      const double u2 = t2 + (h0 * ry[k] - h1 * rx[k]);
      const double s = (ax[k] * u0 + ay[k] * u1) + az[k] * u2;
      // (active ? k_a·s : 0)·a + k_l·(u − s·a), as cap_solver.cpp's pile_force.
      // k_a·s kept or made +0 by a mask of all ones or none (a branch would stop the
      // compiler computing several piles at once).
      const double axial =
          std::bit_cast<double>(std::bit_cast<std::uint64_t>(ka[k] * s) & on[k]);
      const double f0 = axial * ax[k] + kl[k] * (u0 - s * ax[k]);
      const double f1 = axial * ay[k] + kl[k] * (u1 - s * ay[k]);
      const double f2 = axial * az[k] + kl[k] * (u2 - s * az[k]);
      fx[k] = f0;
      fy[k] = f1;
      fz[k] = f2;
      // ρ × f + 0 (the head moment of a pinned head, over L, is an exact zero).
      mx[k] = (ry[k] * f2 - rz[k] * f1) + 0.0;
      my[k] = (rz[k] * f0 - rx[k] * f2) + 0.0;
      mz[k] = (rx[k] * f1 - ry[k] * f0) + 0.0;
    }
    for (std::size_t k = 0; k < len; ++k) {
      s0 -= fx[k];
      s1 -= fy[k];
      s2 -= fz[k];
      s3 -= mx[k];
      s4 -= my[k];
      s5 -= mz[k];
    }
  }
  sum[0] = s0, sum[1] = s1, sum[2] = s2, sum[3] = s3, sum[4] = s4, sum[5] = s5;
}

}  // namespace cairn::detail
