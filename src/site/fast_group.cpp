#include "cairn/site/fast_group.hpp"

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <map>

#include "cairn/solver/cap_solver.hpp"

namespace cairn {
namespace {

using Matrix6 = Eigen::Matrix<double, 6, 6>;
using Vector6 = Eigen::Matrix<double, 6, 1>;
using Row6 = Eigen::Matrix<double, 1, 6>;
using Matrix36 = Eigen::Matrix<double, 3, 6>;
using MatrixX = Eigen::Matrix<double, Eigen::Dynamic, Eigen::Dynamic>;

constexpr double kInfinity = std::numeric_limits<double>::infinity();
constexpr double kForceTolerance = 1e-6;  // kN, as checks.cpp
constexpr double kNullShare = 1e-10;
constexpr double kLoadedShare = 1e-9;

struct Caps {
  double compression = 0.0, tension = 0.0, lateral = 0.0, structural = 0.0;  // reciprocals
};

double reciprocal(const std::optional<double>& capacity) {
  return capacity && *capacity > 0 ? 1.0 / *capacity : kInfinity;
}

// One pile as the study uses it.
struct Row {
  Row6 axial_map;     // k_a·aᵀ·T: the axial force per cap movement
  Eigen::Matrix<double, 2, 6> lateral_map;  // k_l·[e₁ e₂]ᵀ·T: the lateral force across the axis
  Eigen::Matrix<double, 6, Eigen::Dynamic, 0, 6, 3> factor;  // K_pile = factor·factorᵀ
  bool lateral = false;
  Matrix6 stiffness;
  std::size_t type = 0;
  bool tension = true;
  PileSpring spring;
};

}  // namespace

struct FastGroup::Impl {
  std::vector<StudyPile> base;
  std::vector<Row> rows;
  Matrix6 stiffness = Matrix6::Zero();  // all base piles
  Eigen::Vector3d c = Eigen::Vector3d::Zero();
  double size = 1.0;
  MatrixX loads;  // 6 × m, about c
  std::vector<std::size_t> load_class;  // per combination
  std::vector<std::vector<Caps>> caps;  // [type][class]
  std::vector<Caps> flat_caps;          // [class · types + type]
  std::vector<double> type_axial, type_lateral;
  std::vector<char> type_tension;

  Row make_row(const StudyPile& p) const {
    Row r;
    Pile pile;
    pile.x = p.x;
    pile.y = p.y;
    pile.batter = p.batter;
    const auto axis = pile.axis();
    const Eigen::Vector3d a(axis[0], axis[1], axis[2]);
    const Eigen::Vector3d rho(p.x - c(0), p.y - c(1), -c(2));
    Matrix36 t = Matrix36::Zero();
    t.block<3, 3>(0, 0).setIdentity();
    Eigen::Matrix3d skew;
    skew << 0, -rho(2), rho(1), rho(2), 0, -rho(0), -rho(1), rho(0), 0;
    t.block<3, 3>(0, 3) = -skew;
    const double ka = type_axial[p.type], kl = type_lateral[p.type];
    const Eigen::Matrix3d aa = a * a.transpose();
    r.axial_map = ka * a.transpose() * t;
    // Two unit vectors across the axis.
    Eigen::Vector3d e1 = a.cross(std::abs(a(2)) < 0.9 ? Eigen::Vector3d::UnitZ() : Eigen::Vector3d::UnitX());
    e1.normalize();
    const Eigen::Vector3d e2 = a.cross(e1);
    Eigen::Matrix<double, 2, 3> across;
    across.row(0) = e1.transpose();
    across.row(1) = e2.transpose();
    r.lateral_map = kl * across * t;
    r.factor.resize(6, kl > 0 ? 3 : 1);
    r.factor.col(0) = std::sqrt(ka) * t.transpose() * a;
    if (kl > 0) {
      r.factor.col(1) = std::sqrt(kl) * t.transpose() * e1;
      r.factor.col(2) = std::sqrt(kl) * t.transpose() * e2;
    }
    r.lateral = kl > 0;
    r.stiffness = t.transpose() * (ka * aa + kl * (Eigen::Matrix3d::Identity() - aa)) * t;
    r.type = p.type;
    r.tension = type_tension[p.type] != 0;
    r.spring = {{p.x, p.y, 0.0}, axis, ka, kl, r.tension};
    return r;
  }

  double utilization(std::size_t type, std::size_t combo, double n, double v) const {
    const Caps& k = flat_caps[load_class[combo] * type_axial.size() + type];
    double u = 0.0;
    if (n > kForceTolerance) u = n * k.compression;
    else if (-n > kForceTolerance) u = -n * k.tension;
    if (v > kForceTolerance) u = std::max(u, v * k.lateral);
    if (k.structural > 0 && k.structural < kInfinity) u = std::max(u, std::abs(n) * k.structural);
    return u;
  }

  // The pseudo-inverse of K (directions with no stiffness left out) and the combinations
  // that load such a direction.
  struct Space {
    Matrix6 flexibility;
    std::vector<char> unstable;
  };
  Space space(const Matrix6& K) const {
    Space sp;
    const std::size_t m = static_cast<std::size_t>(loads.cols());
    Vector6 d;
    for (int k = 0; k < 6; ++k) d(k) = K(k, k) > 0 ? 1.0 / std::sqrt(K(k, k)) : 0.0;
    const Matrix6 ks = d.asDiagonal() * K * d.asDiagonal();
    Eigen::SelfAdjointEigenSolver<Matrix6> eig(ks);
    const Vector6 lambda = eig.eigenvalues();
    const double top = std::max(lambda.maxCoeff(), 0.0);
    Vector6 inverse;
    std::vector<int> null;
    for (int k = 0; k < 6; ++k) {
      if (top > 0 && lambda(k) > kNullShare * top) inverse(k) = 1.0 / lambda(k);
      else {
        inverse(k) = 0.0;
        null.push_back(k);
      }
    }
    const Matrix6 vecs = eig.eigenvectors();
    sp.flexibility = d.asDiagonal() * vecs * inverse.asDiagonal() * vecs.transpose() * d.asDiagonal();
    sp.unstable.assign(m, 0);
    for (std::size_t j = 0; j < m; ++j) {
      Vector6 f = loads.col(static_cast<Eigen::Index>(j));
      for (int k = 3; k < 6; ++k) f(k) /= size;
      const double scale = f.cwiseAbs().maxCoeff();
      if (scale == 0) continue;
      // Loaded directions with no spring at all, then directions the springs cannot hold.
      for (int k = 0; k < 6; ++k)
        if (d(k) == 0 && std::abs(f(k)) > kLoadedShare * scale) sp.unstable[j] = 1;
      const Vector6 fs = d.asDiagonal() * loads.col(static_cast<Eigen::Index>(j));
      const double fscale = fs.norm();
      for (int k : null)
        if (fscale > 0 && std::abs(vecs.col(k).dot(fs)) > kLoadedShare * fscale) sp.unstable[j] = 1;
    }
    return sp;
  }

  // The worst utilization of the arrangement `use`; `forces(j, axial, shear)` fills the
  // linear forces of combination j (n values each).
  template <class Forces>
  StudyOutcome judge(const Space& sp, const std::vector<const Row*>& use,
                     std::vector<double>* per_pile, Forces&& forces) const {
    StudyOutcome out;
    const std::size_t m = static_cast<std::size_t>(loads.cols());
    const std::size_t n = use.size();
    if (per_pile) per_pile->assign(n, 0.0);
    std::vector<double> axial(n), shear(n);
    std::unique_ptr<CapSolver> exact;  // built when a compression-only pile would pull
    out.max_utilization = -1.0;
    auto raise = [&](double u, std::size_t j, std::size_t i) {
      if (u > out.max_utilization) {
        out.max_utilization = u;
        out.combination = j;
        out.pile = i;
      }
    };
    for (std::size_t j = 0; j < m; ++j) {
      const auto jj = static_cast<Eigen::Index>(j);
      if (sp.unstable[j]) {
        out.unstable = true;
        raise(kInfinity, j, 0);
        continue;
      }
      forces(j, axial, shear);
      bool pulls = false;
      for (std::size_t i = 0; i < n && !pulls; ++i)
        pulls = !use[i]->tension && axial[i] < -kForceTolerance;
      if (pulls) {
        // The active-set solution for this arrangement and combination.
        if (!exact) {
          std::vector<PileSpring> springs;
          for (const Row* r : use) springs.push_back(r->spring);
          exact = std::make_unique<CapSolver>(std::move(springs));
        }
        ++out.resolved;
        const auto& ref = exact->reference();
        const Eigen::Vector3d arm(ref[0] - c(0), ref[1] - c(1), ref[2] - c(2));
        const Eigen::Vector3d force = loads.block<3, 1>(0, jj);
        const Eigen::Vector3d moment = Eigen::Vector3d(loads.block<3, 1>(3, jj)) - arm.cross(force);
        const CapSolution s = exact->solve(
            CapLoad(Wrench{force(0), force(1), force(2), moment(0), moment(1), moment(2)}));
        if (s.overturns) {
          raise(kInfinity, j, 0);
          continue;
        }
        for (std::size_t i = 0; i < n; ++i) {
          axial[i] = s.piles[i].axial;
          shear[i] = s.piles[i].lateral;
        }
      }
      for (std::size_t i = 0; i < n; ++i) {
        const double ui = utilization(use[i]->type, j, axial[i], shear[i]);
        if (per_pile) (*per_pile)[i] = std::max((*per_pile)[i], ui);
        raise(ui, j, i);
      }
    }
    if (out.max_utilization < 0) out.max_utilization = 0.0;
    return out;
  }

  // The arrangement `use` (rows) with stiffness K, solved directly.
  StudyOutcome run(const Matrix6& K, const std::vector<const Row*>& use,
                   std::vector<double>* per_pile) const {
    const Space sp = space(K);
    const std::size_t n = use.size();
    const MatrixX u = sp.flexibility * loads;  // 6 × m
    MatrixX axial_maps(static_cast<Eigen::Index>(n), 6);
    std::vector<std::size_t> with_lateral;
    for (std::size_t i = 0; i < n; ++i) {
      axial_maps.row(static_cast<Eigen::Index>(i)) = use[i]->axial_map;
      if (use[i]->lateral) with_lateral.push_back(i);
    }
    const MatrixX axial = axial_maps * u;  // n × m
    MatrixX lateral;
    if (!with_lateral.empty()) {
      MatrixX maps(static_cast<Eigen::Index>(2 * with_lateral.size()), 6);
      for (std::size_t k = 0; k < with_lateral.size(); ++k)
        maps.block<2, 6>(static_cast<Eigen::Index>(2 * k), 0) = use[with_lateral[k]]->lateral_map;
      lateral = maps * u;
    }
    return judge(sp, use, per_pile, [&](std::size_t j, std::vector<double>& a, std::vector<double>& v) {
      const auto jj = static_cast<Eigen::Index>(j);
      for (std::size_t i = 0; i < n; ++i) {
        a[i] = axial(static_cast<Eigen::Index>(i), jj);
        v[i] = 0.0;
      }
      for (std::size_t k = 0; k < with_lateral.size(); ++k)
        v[with_lateral[k]] = lateral.block<2, 1>(static_cast<Eigen::Index>(2 * k), jj).norm();
    });
  }

  // The intact group's linear solution, for the low-rank updates of lost piles.
  bool intact_ready = false;
  MatrixX intact_u, intact_axial, intact_lateral;  // 6 × m, n × m, 2n × m
  void prepare_intact() {
    const Space sp = space(stiffness);
    intact_u = sp.flexibility * loads;
    MatrixX a(static_cast<Eigen::Index>(rows.size()), 6), l(static_cast<Eigen::Index>(2 * rows.size()), 6);
    for (std::size_t i = 0; i < rows.size(); ++i) {
      a.row(static_cast<Eigen::Index>(i)) = rows[i].axial_map;
      l.block<2, 6>(static_cast<Eigen::Index>(2 * i), 0) = rows[i].lateral_map;
    }
    intact_axial = a * intact_u;
    intact_lateral = l * intact_u;
    intact_ready = true;
  }
};

FastGroup::FastGroup(const CheckRun& run) : impl_(std::make_unique<Impl>()) {
  Impl& s = *impl_;
  const Project& p = run.project;
  for (std::size_t t = 0; t < p.pile_types.size(); ++t) {
    s.type_axial.push_back(run.stiffness.at(t).axial);
    s.type_lateral.push_back(run.stiffness.at(t).lateral);
    s.type_tension.push_back(p.pile_types[t].tension ? 1 : 0);
  }
  for (const Pile& pile : p.piles) {
    s.base.push_back({pile.x, pile.y, pile.batter, pile.type});
    s.c(0) += pile.x / static_cast<double>(p.piles.size());
    s.c(1) += pile.y / static_cast<double>(p.piles.size());
  }
  for (const Pile& pile : p.piles)
    s.size = std::max(s.size, std::hypot(pile.x - s.c(0), pile.y - s.c(1)));
  for (const StudyPile& b : s.base) {
    s.rows.push_back(s.make_row(b));
    s.stiffness += s.rows.back().stiffness;
  }
  // Loads about c; the resistance each combination is compared with.
  const std::size_t m = p.combinations.size();
  s.loads.resize(6, static_cast<Eigen::Index>(m));
  std::map<std::pair<int, int>, std::size_t> classes;
  std::vector<std::pair<int, int>> class_keys;
  for (std::size_t j = 0; j < m; ++j) {
    const Combination& combo = p.combinations[j];
    const Wrench w = combination_load(p, combo, {s.c(0), s.c(1), s.c(2)});
    for (int k = 0; k < 6; ++k) s.loads(k, static_cast<Eigen::Index>(j)) = w[static_cast<std::size_t>(k)];
    const std::pair<int, int> key{static_cast<int>(combo.resistance_set),
                                  combo.limit_state == LimitState::service ? 0 : 1};
    const auto [it, fresh] = classes.emplace(key, class_keys.size());
    if (fresh) class_keys.push_back(key);
    s.load_class.push_back(it->second);
  }
  s.caps.assign(p.pile_types.size(), std::vector<Caps>(class_keys.size()));
  for (std::size_t t = 0; t < p.pile_types.size(); ++t)
    for (std::size_t k = 0; k < class_keys.size(); ++k) {
      const auto set = static_cast<ResistanceSet>(class_keys[k].first);
      const PileTypeResistance& pr = run.resistances.at(t);
      const Resistance* r = nullptr;
      if (set != ResistanceSet::basis) {
        const auto it = pr.by_set.find(set);
        if (it != pr.by_set.end()) r = &it->second;
      } else {
        r = class_keys[k].second == 0 ? &pr.allowable : &pr.factored;
      }
      Caps& c = s.caps[t][k];
      if (!r) {
        c = {kInfinity, kInfinity, kInfinity, 0.0};
        continue;
      }
      c.compression = reciprocal(r->compression);
      c.tension = reciprocal(r->tension);
      c.lateral = reciprocal(r->lateral);
      c.structural = r->structural_axial && *r->structural_axial > 0 ? 1.0 / *r->structural_axial : 0.0;
    }
  for (std::size_t k = 0; k < class_keys.size(); ++k)
    for (std::size_t t = 0; t < p.pile_types.size(); ++t) s.flat_caps.push_back(s.caps[t][k]);
  s.prepare_intact();
}

FastGroup::~FastGroup() = default;
FastGroup::FastGroup(FastGroup&&) noexcept = default;

std::size_t FastGroup::piles() const { return impl_->base.size(); }
std::size_t FastGroup::combinations() const {
  return static_cast<std::size_t>(impl_->loads.cols());
}
const std::vector<StudyPile>& FastGroup::base() const { return impl_->base; }

StudyOutcome FastGroup::evaluate(const std::vector<char>& keep,
                                 const std::vector<StudyPile>& extra) const {
  const Impl& s = *impl_;
  if (extra.empty() && !keep.empty() && s.intact_ready) {
    // Lost piles only: the intact forces plus a low-rank change. With K' = K − Σ Bⱼ·Bⱼᵀ
    // (Bⱼ: 6 × 1 for an axial-only pile, 6 × 3 with a lateral spring), U' − U = K'⁺·B·(Bᵀ·U),
    // so each pile's forces change by (G·K'⁺·B)·(Bᵀ·U): r values per combination, not six.
    Matrix6 k = s.stiffness;
    std::vector<const Row*> use;
    std::vector<std::size_t> kept;
    int r = 0;
    for (std::size_t i = 0; i < s.rows.size(); ++i) {
      if (keep[i]) {
        use.push_back(&s.rows[i]);
        kept.push_back(i);
      } else {
        k -= s.rows[i].stiffness;
        r += static_cast<int>(s.rows[i].factor.cols());
      }
    }
    if (r == 0) return s.run(k, use, nullptr);
    MatrixX b(6, r);
    int col = 0;
    for (std::size_t i = 0; i < s.rows.size(); ++i)
      if (!keep[i]) {
        b.middleCols(col, s.rows[i].factor.cols()) = s.rows[i].factor;
        col += static_cast<int>(s.rows[i].factor.cols());
      }
    const Impl::Space sp = s.space(k);
    const MatrixX w = b.transpose() * s.intact_u;  // r × m
    const MatrixX kb = sp.flexibility * b;         // 6 × r
    const std::size_t n = kept.size();
    MatrixX pa(static_cast<Eigen::Index>(n), r), pl(static_cast<Eigen::Index>(2 * n), r);
    for (std::size_t q = 0; q < n; ++q) {
      pa.row(static_cast<Eigen::Index>(q)) = s.rows[kept[q]].axial_map * kb;
      pl.block(static_cast<Eigen::Index>(2 * q), 0, 2, r) = s.rows[kept[q]].lateral_map * kb;
    }
    // Row-major copies for a tight loop: r values per pile and combination.
    const Eigen::Matrix<double, Eigen::Dynamic, Eigen::Dynamic, Eigen::RowMajor> par = pa, plr = pl;
    const std::size_t rr = static_cast<std::size_t>(r);
    std::vector<char> lateral(n);
    for (std::size_t q = 0; q < n; ++q) lateral[q] = use[q]->lateral;
    return s.judge(sp, use, nullptr, [&](std::size_t j, std::vector<double>& a, std::vector<double>& v) {
      const double* wj = w.data() + j * rr;  // column j of the column-major r × m matrix
      const double* na = s.intact_axial.data() + j * static_cast<std::size_t>(s.intact_axial.rows());
      const double* nl = s.intact_lateral.data() + j * static_cast<std::size_t>(s.intact_lateral.rows());
      for (std::size_t q = 0; q < n; ++q) {
        const std::size_t i = kept[q];
        const double* ra = par.data() + q * rr;
        double sum = na[i];
        for (std::size_t k = 0; k < rr; ++k) sum += ra[k] * wj[k];
        a[q] = sum;
        if (lateral[q]) {
          const double* rx = plr.data() + 2 * q * rr;
          const double* ry = rx + rr;
          double vx = nl[2 * i], vy = nl[2 * i + 1];
          for (std::size_t k = 0; k < rr; ++k) {
            vx += rx[k] * wj[k];
            vy += ry[k] * wj[k];
          }
          v[q] = std::sqrt(vx * vx + vy * vy);
        } else {
          v[q] = 0.0;
        }
      }
    });
  }
  Matrix6 k = s.stiffness;
  std::vector<const Row*> use;
  use.reserve(s.rows.size() + extra.size());
  for (std::size_t i = 0; i < s.rows.size(); ++i) {
    if (keep.empty() || keep[i]) use.push_back(&s.rows[i]);
    else k -= s.rows[i].stiffness;  // the lost pile's term taken out
  }
  std::vector<Row> added;
  added.reserve(extra.size());
  for (const StudyPile& e : extra) {
    added.push_back(s.make_row(e));
    k += added.back().stiffness;  // the added pile's term put in
  }
  for (const Row& r : added) use.push_back(&r);
  return s.run(k, use, nullptr);
}

std::vector<double> FastGroup::pile_utilizations(const std::vector<char>& keep,
                                                 const std::vector<StudyPile>& extra) const {
  const Impl& s = *impl_;
  Matrix6 k = s.stiffness;
  std::vector<const Row*> use;
  for (std::size_t i = 0; i < s.rows.size(); ++i) {
    if (keep.empty() || keep[i]) use.push_back(&s.rows[i]);
    else k -= s.rows[i].stiffness;
  }
  std::vector<Row> added;
  added.reserve(extra.size());
  for (const StudyPile& e : extra) {
    added.push_back(s.make_row(e));
    k += added.back().stiffness;
  }
  for (const Row& r : added) use.push_back(&r);
  std::vector<double> per_pile;
  s.run(k, use, &per_pile);
  return per_pile;
}

StudyOutcome FastGroup::evaluate_moved(const std::vector<StudyPile>& moved) const {
  const Impl& s = *impl_;
  Matrix6 k = Matrix6::Zero();
  std::vector<Row> rows;
  rows.reserve(moved.size());
  for (const StudyPile& p : moved) {
    rows.push_back(s.make_row(p));
    k += rows.back().stiffness;
  }
  std::vector<const Row*> use;
  for (const Row& r : rows) use.push_back(&r);
  return s.run(k, use, nullptr);
}

}  // namespace cairn
