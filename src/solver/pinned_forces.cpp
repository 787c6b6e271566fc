#include "pinned_forces.hpp"

#include <algorithm>
#include <cmath>
#include <cstddef>
#include <iterator>

namespace cairn::detail {

void PinnedPiles::add(const double rho[3], const double axis[3], double k_axial,
                      double k_lateral) {
  rho_x.push_back(rho[0]);
  rho_y.push_back(rho[1]);
  rho_z.push_back(rho[2]);
  axis_x.push_back(axis[0]);
  axis_y.push_back(axis[1]);
  axis_z.push_back(axis[2]);
  axial.push_back(k_axial);
  lateral.push_back(k_lateral);
}

namespace {

// One pile, for the piles that dropped out: N = 0 exactly, as the per-pile code writes it.
void one_pile(const PinnedPiles& piles, std::size_t i, const double movement[6], bool active,
              PileForce& row) {
  const double t0 = movement[0], t1 = movement[1], t2 = movement[2];
  const double h0 = movement[3], h1 = movement[4], h2 = movement[5];
  const double ax = piles.axis_x[i], ay = piles.axis_y[i], az = piles.axis_z[i];
  const double kl = piles.lateral[i];
  const double u0 = t0 + (h1 * piles.rho_z[i] - h2 * piles.rho_y[i]);
  const double u1 = t1 + (h2 * piles.rho_x[i] - h0 * piles.rho_z[i]);
  const double u2 = t2 + (h0 * piles.rho_y[i] - h1 * piles.rho_x[i]);
  const double along = (ax * u0 + ay * u1) + az * u2;
  const double w0 = u0 - along * ax, w1 = u1 - along * ay, w2 = u2 - along * az;
  const double n_axial = active ? piles.axial[i] * along : 0.0;
  row.axial = n_axial;
  row.lateral = kl * std::sqrt((w0 * w0 + w1 * w1) + w2 * w2);
  row.active = active;
  row.head_forces = {n_axial * ax + kl * w0, n_axial * ay + kl * w1, n_axial * az + kl * w2,
                     0.0, 0.0, 0.0};
  row.head_moment = 0.0;
}

// The rows of a block of active piles from its arrays, for vector::insert: each row is
// constructed once, in place, and the vector's end is set once per block.
struct Rows {
  using iterator_category = std::forward_iterator_tag;
  using value_type = PileForce;
  using difference_type = std::ptrdiff_t;
  using pointer = const PileForce*;
  using reference = PileForce;
  const double *axial, *lateral, *fx, *fy, *fz;
  std::size_t k;
  PileForce operator*() const {
    return {axial[k], lateral[k], true, {fx[k], fy[k], fz[k], 0.0, 0.0, 0.0}, 0.0};
  }
  Rows& operator++() {
    ++k;
    return *this;
  }
  Rows operator++(int) {
    Rows before = *this;
    ++k;
    return before;
  }
  bool operator==(const Rows& other) const { return k == other.k; }
};

}  // namespace

// Built twice where the compiler can, for processors with AVX2 (four piles at a time) and
// for the others, chosen when the program starts. AVX2 alone, without FMA: every operation
// is the same IEEE operation, rounded the same, so both give the same bits.
#if defined(__x86_64__) && defined(__GNUC__) && !defined(__clang__)
#define CAIRN_PILE_CLONES __attribute__((target_clones("avx2", "default")))
#else
#define CAIRN_PILE_CLONES
#endif

CAIRN_PILE_CLONES
void pinned_forces(const PinnedPiles& piles, const double movement[6],
                   const std::vector<bool>* active, std::vector<PileForce>& out) {
  const double t0 = movement[0], t1 = movement[1], t2 = movement[2];
  const double h0 = movement[3], h1 = movement[4], h2 = movement[5];
  // A block of piles at a time: computed into these arrays (a loop without branches, which
  // the compiler vectorizes), then copied into the pile rows. The piles that dropped out are
  // then written again one by one (their axial force is an exact zero).
  constexpr std::size_t kBlock = 128;
  double axial[kBlock], lateral[kBlock], fx[kBlock], fy[kBlock], fz[kBlock];
  const std::size_t n = piles.size();
  // Each row constructed once, whole (resizing first would write every row twice).
  out.clear();
  out.reserve(n);
  for (std::size_t start = 0; start < n; start += kBlock) {
    const std::size_t len = std::min(kBlock, n - start);
    const double* rx = piles.rho_x.data() + start;
    const double* ry = piles.rho_y.data() + start;
    const double* rz = piles.rho_z.data() + start;
    const double* ax = piles.axis_x.data() + start;
    const double* ay = piles.axis_y.data() + start;
    const double* az = piles.axis_z.data() + start;
    const double* ka = piles.axial.data() + start;
    const double* kl = piles.lateral.data() + start;
    for (std::size_t k = 0; k < len; ++k) {
      // u = t + θ × ρ
      const double u0 = t0 + (h1 * rz[k] - h2 * ry[k]);
      const double u1 = t1 + (h2 * rx[k] - h0 * rz[k]);
      const double u2 = t2 + (h0 * ry[k] - h1 * rx[k]);
      const double along = (ax[k] * u0 + ay[k] * u1) + az[k] * u2;
      const double w0 = u0 - along * ax[k];
      const double w1 = u1 - along * ay[k];
      const double w2 = u2 - along * az[k];
      const double n_axial = ka[k] * along;
      axial[k] = n_axial;
      lateral[k] = kl[k] * std::sqrt((w0 * w0 + w1 * w1) + w2 * w2);
      fx[k] = n_axial * ax[k] + kl[k] * w0;
      fy[k] = n_axial * ay[k] + kl[k] * w1;
      fz[k] = n_axial * az[k] + kl[k] * w2;
    }
    out.insert(out.end(), Rows{axial, lateral, fx, fy, fz, 0}, Rows{axial, lateral, fx, fy, fz, len});
    if (active) {
      for (std::size_t k = 0; k < len; ++k)
        if (!(*active)[start + k]) one_pile(piles, start + k, movement, false, out[start + k]);
    }
  }
}

CAIRN_PILE_CLONES
void pinned_axial_lateral(const PinnedPiles& piles, const double movement[6],
                          const std::vector<bool>* active, double* __restrict axial,
                          double* __restrict lateral) {
  const double t0 = movement[0], t1 = movement[1], t2 = movement[2];
  const double h0 = movement[3], h1 = movement[4], h2 = movement[5];
  const std::size_t n = piles.size();
  const double* __restrict rx = piles.rho_x.data();
  const double* __restrict ry = piles.rho_y.data();
  const double* __restrict rz = piles.rho_z.data();
  const double* __restrict ax = piles.axis_x.data();
  const double* __restrict ay = piles.axis_y.data();
  const double* __restrict az = piles.axis_z.data();
  const double* __restrict ka = piles.axial.data();
  const double* __restrict kl = piles.lateral.data();
  // As pinned_forces' loop, without the head forces.
  for (std::size_t k = 0; k < n; ++k) {
    const double u0 = t0 + (h1 * rz[k] - h2 * ry[k]);
    const double u1 = t1 + (h2 * rx[k] - h0 * rz[k]);
    const double u2 = t2 + (h0 * ry[k] - h1 * rx[k]);
    const double along = (ax[k] * u0 + ay[k] * u1) + az[k] * u2;
    const double w0 = u0 - along * ax[k];
    const double w1 = u1 - along * ay[k];
    const double w2 = u2 - along * az[k];
    axial[k] = ka[k] * along;
    lateral[k] = kl[k] * std::sqrt((w0 * w0 + w1 * w1) + w2 * w2);
  }
  if (active)
    for (std::size_t k = 0; k < n; ++k)
      if (!(*active)[k]) axial[k] = 0.0;
}

}  // namespace cairn::detail
