#include "check_fold.hpp"


namespace cairn::detail {

void FoldState::resize(std::size_t n) {
  for (auto* v : {&compression, &tension, &lateral, &utilization}) v->assign(n, 0.0);
  for (auto* v : {&compression_at, &tension_at, &lateral_at, &utilization_at}) v->assign(n, -1);
  governing.assign(n, 0.0);
  failed.assign(n, 0);
  for (std::size_t k = 0; k < 4; ++k) {
    check_value[k].assign(n, 0.0);
    check_demand[k].assign(n, 0.0);
    check_at[k].assign(n, -1);
  }
}

// Built twice where the compiler can, for processors with AVX2 (four piles at a time) and
// for the others, chosen when the program starts; AVX2 without FMA, so both give the same
// bits (as src/solver/pinned_forces.cpp).
#if defined(__x86_64__) && defined(__GNUC__) && !defined(__clang__)
#define CAIRN_FOLD_CLONES __attribute__((target_clones("avx2", "default")))
#else
#define CAIRN_FOLD_CLONES
#endif

namespace {

// `yes` when `m`, else `no`: both computed beforehand, nothing evaluated conditionally.
template <class T>
inline T pick(bool m, T yes, T no) {
  return m ? yes : no;
}

}  // namespace

CAIRN_FOLD_CLONES
bool fold_piles(std::size_t n, const double* __restrict axial, const double* __restrict lateral,
                const PileCapacities& capacity, double tolerance, std::int64_t c,
                FoldState& state, double* __restrict utilization,
                double* __restrict governing) {
  // Demand's values: 1 compression, 2 tension, 3 lateral (0 none).
  const double* __restrict cap_c = capacity.compression.data();
  const double* __restrict cap_t = capacity.tension.data();
  const double* __restrict cap_l = capacity.lateral.data();
  double* __restrict env_c = state.compression.data();
  double* __restrict env_t = state.tension.data();
  double* __restrict env_l = state.lateral.data();
  double* __restrict env_u = state.utilization.data();
  std::int64_t* __restrict at_c = state.compression_at.data();
  std::int64_t* __restrict at_t = state.tension_at.data();
  std::int64_t* __restrict at_l = state.lateral_at.data();
  std::int64_t* __restrict at_u = state.utilization_at.data();
  double* __restrict env_g = state.governing.data();
  std::int64_t* __restrict failed = state.failed.data();
  double* __restrict gv_c = state.check_value[0].data();
  double* __restrict gv_t = state.check_value[1].data();
  double* __restrict gv_l = state.check_value[2].data();
  double* __restrict gd_c = state.check_demand[0].data();
  double* __restrict gd_t = state.check_demand[1].data();
  double* __restrict gd_l = state.check_demand[2].data();
  std::int64_t* __restrict ga_c = state.check_at[0].data();
  std::int64_t* __restrict ga_t = state.check_at[1].data();
  std::int64_t* __restrict ga_l = state.check_at[2].data();
  std::int64_t any_failed = 0;
  // A block of piles at a time, in three short loops without branches (one long loop is
  // left unvectorized by the compiler): the utilizations, the governing check of each kind,
  // the envelope.
  constexpr std::size_t kBlock = 256;
  double uc[kBlock], ut[kBlock], ul[kBlock];
  for (std::size_t start = 0; start < n; start += kBlock) {
    const std::size_t len = n - start < kBlock ? n - start : kBlock;
    const double* __restrict ax = axial + start;
    const double* __restrict lat = lateral + start;
    const double* __restrict cc = cap_c + start;
    const double* __restrict ct = cap_t + start;
    const double* __restrict cl = cap_l + start;
    double* __restrict uo = utilization + start;
    double* __restrict go = governing + start;
    // Each check as checks.cpp's consider(): no demand at or below the tolerance; u = demand
    // / capacity, ∞ without a positive capacity (stored as 0: any demand above the tolerance
    // over 0 is +∞, as the row-by-row code gives); the pile's utilization raised to it, and its governing check named, when it
    // exceeds the utilization so far or none is named yet. Every comparison is made, joined
    // by & and | rather than && and ||: nothing is evaluated conditionally.
    for (std::size_t k = 0; k < len; ++k) {
      const double a = ax[k], v = lat[k];
      // Nothing is named before the first check (g == 0): a check with a demand is then
      // taken whatever its u. Tracked as flags, not by comparing g (which stops the compiler).
      double u = 0.0;
      const bool has_c = !(a <= tolerance);
      const double u_c = a / cc[k];
      const bool take_c = has_c;
      u = pick(take_c, pick(u_c < u, u, u_c), u);
      const bool has_t = !(-a <= tolerance);
      const double u_t = -a / ct[k];
      const bool take_t = has_t & ((u_t > u) | !take_c);
      u = pick(take_t, pick(u_t < u, u, u_t), u);
      const bool has_l = !(v <= tolerance);
      const double u_l = v / cl[k];
      const bool take_l = has_l & ((u_l > u) | (!take_c & !take_t));
      u = pick(take_l, pick(u_l < u, u, u_l), u);
      const double g = pick(take_l, 3.0, pick(take_t, 2.0, pick(take_c, 1.0, 0.0)));
      uo[k] = u;
      go[k] = g;
      // Each check's own utilization, 0 (never above the value kept) without a demand.
      uc[k] = pick(has_c, u_c, 0.0);
      ut[k] = pick(has_t, u_t, 0.0);
      ul[k] = pick(has_l, u_l, 0.0);
    }
    // The governing combination of each check: the first of its largest utilization (u > 0
    // and above the value so far, which is 0 while none is named).
    auto govern = [&](const double* __restrict uk, double* __restrict value,
                      double* __restrict demand, std::int64_t* __restrict at, double sign,
                      const double* __restrict d) {
      for (std::size_t k = 0; k < len; ++k) {
        const bool take = (uk[k] > 0.0) & (uk[k] > value[k]);
        value[k] = pick(take, uk[k], value[k]);
        demand[k] = pick(take, sign * d[k], demand[k]);
        at[k] = pick(take, c, at[k]);
      }
    };
    govern(uc, gv_c + start, gd_c + start, ga_c + start, 1.0, ax);
    govern(ut, gv_t + start, gd_t + start, ga_t + start, -1.0, ax);
    govern(ul, gv_l + start, gd_l + start, ga_l + start, 1.0, lat);
    // The envelope: a value above the tolerance (zero for the utilization) and above the
    // value so far (0 while no combination is named, and above the tolerance once one is);
    // the pile fails unless u ≤ 1.
    auto raise = [&](const double* __restrict x, double sign, double tol,
                     double* __restrict value, std::int64_t* __restrict at) {
      for (std::size_t k = 0; k < len; ++k) {
        const double y = sign * x[k];
        const bool take = (y > tol) & (y > value[k]);
        value[k] = pick(take, y, value[k]);
        at[k] = pick(take, c, at[k]);
      }
    };
    raise(ax, 1.0, tolerance, env_c + start, at_c + start);
    raise(ax, -1.0, tolerance, env_t + start, at_t + start);
    raise(lat, 1.0, tolerance, env_l + start, at_l + start);
    {
      double* __restrict value = env_u + start;
      std::int64_t* __restrict at = at_u + start;
      double* __restrict gov = env_g + start;
      std::int64_t* __restrict fail = failed + start;
      for (std::size_t k = 0; k < len; ++k) {
        const double u = uo[k];
        const bool take = (u > 0.0) & (u > value[k]);
        value[k] = pick(take, u, value[k]);
        at[k] = pick(take, c, at[k]);
        gov[k] = pick(take, go[k], gov[k]);
        const std::int64_t fails = !(u <= 1.0);
        fail[k] |= fails;
        any_failed |= fails;
      }
    }
  }
  return any_failed != 0;
}

}  // namespace cairn::detail
