#include "cairn/site/studies.hpp"

#include <algorithm>
#include <atomic>
#include <thread>
#include <cmath>
#include <random>

namespace cairn {
namespace {

constexpr double kPi = 3.14159265358979323846;

std::size_t base_index(const std::vector<char>& keep, std::size_t k, std::size_t n) {
  // The k-th kept base pile (piles after the base are added ones: returned past n).
  std::size_t seen = 0;
  for (std::size_t i = 0; i < n; ++i)
    if (keep.empty() || keep[i]) {
      if (seen == k) return i;
      ++seen;
    }
  return n + (k - seen);
}

bool better(const Placement& a, const Placement& b) {
  if (a.pass() != b.pass()) return a.pass();
  if (a.outcome.max_utilization != b.outcome.max_utilization)
    return a.outcome.max_utilization < b.outcome.max_utilization;
  return a.distance < b.distance;
}

double nearest(const std::vector<std::array<double, 2>>& lost, double x, double y) {
  double d = lost.empty() ? 0.0 : std::numeric_limits<double>::infinity();
  for (const auto& l : lost) d = std::min(d, std::hypot(x - l[0], y - l[1]));
  return d;
}

}  // namespace

LossStudy each_pile_lost(const FastGroup& group, bool pairs) {
  LossStudy study;
  const std::size_t n = group.piles();
  study.intact = group.evaluate({}, {});
  std::vector<char> keep(n, 1);
  auto consider = [&](std::vector<std::size_t> lost, std::vector<LossCase>& list,
                      std::optional<std::size_t>& worst) {
    for (std::size_t i : lost) keep[i] = 0;
    LossCase c;
    c.outcome = group.evaluate(keep, {});
    c.governing_pile = base_index(keep, c.outcome.pile, n);
    for (std::size_t i : lost) keep[i] = 1;
    c.lost = std::move(lost);
    list.push_back(std::move(c));
    if (!worst || list.back().outcome.max_utilization > list[*worst].outcome.max_utilization)
      worst = list.size() - 1;
  };
  // Single losses on every core: each evaluation is independent (FastGroup is read only).
  study.single.resize(n);
  {
    std::atomic<std::size_t> next{0};
    auto work = [&] {
      std::vector<char> mask(n, 1);
      for (std::size_t i = next++; i < n; i = next++) {
        mask[i] = 0;
        LossCase& c = study.single[i];
        c.lost = {i};
        c.outcome = group.evaluate(mask, {});
        c.governing_pile = base_index(mask, c.outcome.pile, n);
        mask[i] = 1;
      }
    };
    const unsigned threads = std::max(1u, std::min(std::thread::hardware_concurrency(), 8u));
    std::vector<std::thread> pool;
    for (unsigned t = 1; t < threads && t < n; ++t) pool.emplace_back(work);
    work();
    for (auto& t : pool) t.join();
  }
  for (std::size_t i = 0; i < n; ++i)
    if (!study.worst_single ||
        study.single[i].outcome.max_utilization > study.single[*study.worst_single].outcome.max_utilization)
      study.worst_single = i;
  if (pairs)
    for (std::size_t i = 0; i < n; ++i)
      for (std::size_t j = i + 1; j < n; ++j) consider({i, j}, study.pairs, study.worst_pair);
  return study;
}

SearchResult search_added_piles(const FastGroup& group, const std::vector<char>& keep,
                                const SearchSettings& s, std::size_t keep_best) {
  SearchResult result;
  result.before = group.evaluate(keep, {});
  double x0 = std::numeric_limits<double>::infinity(), y0 = x0, x1 = -x0, y1 = -x0;
  for (const auto& c : s.outline.polygon) {
    x0 = std::min(x0, c[0]);
    x1 = std::max(x1, c[0]);
    y0 = std::min(y0, c[1]);
    y1 = std::max(y1, c[1]);
  }
  auto clear = [&](double x, double y) {
    for (const ObstaclePile& o : s.in_ground) {
      const double need = std::max(s.min_spacing, s.spacing_factor * std::max(s.width, o.width));
      if (std::hypot(x - o.x, y - o.y) < need - 1e-9) return false;
    }
    return true;
  };
  std::vector<std::array<double, 2>> spots;
  // The grid runs from the outline's lower-left corner in steps of `step`.
  const auto nx = static_cast<long>(std::floor((x1 - x0) / s.step + 1e-9));
  const auto ny = static_cast<long>(std::floor((y1 - y0) / s.step + 1e-9));
  for (long i = 0; i <= nx; ++i)
    for (long j = 0; j <= ny; ++j) {
      const double x = x0 + static_cast<double>(i) * s.step, y = y0 + static_cast<double>(j) * s.step;
      if (!s.outline.contains(x, y)) continue;
      if (s.outline.distance_to_edge(x, y) < s.edge_distance + s.width / 2 - 1e-9) continue;
      if (!clear(x, y)) continue;
      spots.push_back({x, y});
    }
  result.candidates = spots.size();
  std::vector<Placement> singles;
  singles.reserve(spots.size());
  for (const auto& at : spots) {
    Placement p;
    p.at = {at};
    p.outcome = group.evaluate(keep, {StudyPile{at[0], at[1], std::nullopt, s.type}});
    p.distance = nearest(s.lost, at[0], at[1]);
    singles.push_back(std::move(p));
  }
  std::sort(singles.begin(), singles.end(), better);
  result.piles = 1;
  if ((singles.empty() || !singles.front().pass()) && s.most >= 2 && singles.size() >= 2) {
    const std::size_t k = std::min(s.pairs_from, singles.size());
    std::vector<Placement> pairs;
    const double need = std::max(s.min_spacing, s.spacing_factor * s.width);
    for (std::size_t a = 0; a < k; ++a)
      for (std::size_t b = a + 1; b < k; ++b) {
        const auto& pa = singles[a].at[0];
        const auto& pb = singles[b].at[0];
        if (std::hypot(pa[0] - pb[0], pa[1] - pb[1]) < need - 1e-9) continue;
        Placement p;
        p.at = {pa, pb};
        p.outcome = group.evaluate(keep, {StudyPile{pa[0], pa[1], std::nullopt, s.type},
                                          StudyPile{pb[0], pb[1], std::nullopt, s.type}});
        p.distance = nearest(s.lost, pa[0], pa[1]) + nearest(s.lost, pb[0], pb[1]);
        pairs.push_back(std::move(p));
      }
    std::sort(pairs.begin(), pairs.end(), better);
    if (!pairs.empty() && (pairs.front().pass() || pairs.front().outcome.max_utilization <
                                                       singles.front().outcome.max_utilization)) {
      singles = std::move(pairs);
      result.piles = 2;
    }
  }
  if (singles.size() > keep_best) singles.resize(keep_best);
  result.best = std::move(singles);
  return result;
}

ToleranceStudy tolerance_study(const FastGroup& group, const ToleranceSettings& s) {
  ToleranceStudy study;
  const std::vector<StudyPile>& base = group.base();
  study.design = group.evaluate({}, {}).max_utilization;
  std::mt19937_64 random(s.seed);
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  std::normal_distribution<double> gauss(0.0, 1.0);
  auto slope_of = [](const std::optional<Batter>& b) -> std::array<double, 2> {
    if (!b || b->ratio <= 0) return {0.0, 0.0};
    const double t = b->toward_deg * kPi / 180.0;
    return {std::cos(t) / b->ratio, std::sin(t) / b->ratio};
  };
  auto with_slope = [](std::array<double, 2> sl) -> std::optional<Batter> {
    const double m = std::hypot(sl[0], sl[1]);
    if (m < 1e-12) return std::nullopt;
    return Batter{1.0 / m, std::atan2(sl[1], sl[0]) * 180.0 / kPi};
  };
  // One random offset within a circle of radius r (uniform) or with σ = r/2 per axis.
  auto offset = [&](double r) -> std::array<double, 2> {
    if (s.normal) return {gauss(random) * r / 2, gauss(random) * r / 2};
    const double radius = r * std::sqrt(unit(random)), angle = 2 * kPi * unit(random);
    return {radius * std::cos(angle), radius * std::sin(angle)};
  };
  std::vector<StudyPile> moved = base;
  study.samples.reserve(s.trials);
  std::vector<StudyPile> worst_trial = base;
  study.worst_random.max_utilization = -1;
  for (std::size_t t = 0; t < s.trials; ++t) {
    for (std::size_t i = 0; i < base.size(); ++i) {
      const auto d = offset(s.plan);
      moved[i] = base[i];
      moved[i].x += d[0];
      moved[i].y += d[1];
      if (s.batter) {
        const auto b = offset(*s.batter);
        const auto sl = slope_of(base[i].batter);
        moved[i].batter = with_slope({sl[0] + b[0], sl[1] + b[1]});
      }
    }
    const StudyOutcome o = group.evaluate_moved(moved);
    study.samples.push_back(o.max_utilization);
    if (o.max_utilization > study.worst_random.max_utilization) {
      study.worst_random = o;
      worst_trial = moved;
    }
  }
  std::sort(study.samples.begin(), study.samples.end());
  auto quantile = [&](double q) {
    if (study.samples.empty()) return study.design;
    const double pos = q * static_cast<double>(study.samples.size() - 1);
    const auto lo = static_cast<std::size_t>(std::floor(pos));
    const std::size_t hi = std::min(lo + 1, study.samples.size() - 1);
    return study.samples[lo] + (pos - static_cast<double>(lo)) * (study.samples[hi] - study.samples[lo]);
  };
  study.median = quantile(0.5);
  study.p95 = quantile(0.95);
  study.max = study.samples.empty() ? study.design : study.samples.back();
  // Local search: each pile in turn to the point of its tolerance circle (16 directions, or
  // where it stands) that raises the largest utilization most.
  std::vector<StudyPile> worst = study.samples.empty() ? base : worst_trial;
  StudyOutcome best = group.evaluate_moved(worst);
  const int rounds = base.size() > 60 ? 1 : s.search_rounds;
  for (int round = 0; round < rounds; ++round) {
    bool improved = false;
    for (std::size_t i = 0; i < base.size(); ++i) {
      const StudyPile kept = worst[i];
      StudyPile best_here = kept;
      for (int k = 0; k < 16; ++k) {
        const double angle = 2 * kPi * k / 16.0;
        worst[i] = kept;
        worst[i].x = base[i].x + s.plan * std::cos(angle);
        worst[i].y = base[i].y + s.plan * std::sin(angle);
        const StudyOutcome o = group.evaluate_moved(worst);
        if (o.max_utilization > best.max_utilization + 1e-12) {
          best = o;
          best_here = worst[i];
          improved = true;
        }
      }
      worst[i] = best_here;
    }
    if (!improved) break;
  }
  study.worst = worst;
  study.worst_outcome = best;
  study.governing_pile = best.pile;
  study.margin = std::max(best.max_utilization, study.max) - study.design;
  return study;
}

}  // namespace cairn
