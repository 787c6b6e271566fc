// Benchmarks of the site studies (site/studies.hpp): each pile lost in turn on a large
// group, the added pile search on a small cap at a 50 mm step, and the installation
// tolerance study. Groups are built in code (invented); run with build/bench_site.
#include <benchmark/benchmark.h>

#include <cmath>
#include <random>
#include <string>

#include "cairn/app/analysis.hpp"
#include "cairn/site/fast_group.hpp"
#include "cairn/site/studies.hpp"

namespace {

using cairn::Project;

// A rectangular grid of `nx` × `ny` vertical piles at 1.2 m, every pile taking tension with a
// lateral spring, and `combinations` combinations of six load cases.
Project grid_project(int nx, int ny, std::size_t combinations) {
  Project p;
  p.title = "benchmark grid";
  p.cap.thickness = 2.0;
  cairn::PileType t;
  t.id = "T";
  t.section = {cairn::SectionShape::square, 0.4};
  t.length = 20;
  t.elastic_modulus = 3.0e7;
  t.lateral_stiffness = 2.0e4;
  t.capacities = {{cairn::CapacityBasis::allowable, 2000.0, 600.0, 80.0, {}, {}, {}, {}, {}},
                  {cairn::CapacityBasis::factored, 3000.0, 900.0, 120.0, {}, {}, {}, {}, {}}};
  p.pile_types = {t};
  const double s = 1.2;
  for (int i = 0; i < nx; ++i)
    for (int j = 0; j < ny; ++j) {
      cairn::Pile pile;
      pile.id = "P" + std::to_string(i * ny + j + 1);
      pile.x = (i - (nx - 1) / 2.0) * s;
      pile.y = (j - (ny - 1) / 2.0) * s;
      p.piles.push_back(pile);
    }
  const double hx = nx * s / 2 + 0.6, hy = ny * s / 2 + 0.6;
  cairn::Outline o;
  o.rectangle = true;
  o.polygon = {{-hx, -hy}, {hx, -hy}, {hx, hy}, {-hx, hy}};
  p.cap.outline = o;
  const double n = static_cast<double>(p.piles.size());
  auto load = [&](const char* id, cairn::LoadKind kind, cairn::Wrench w, double x, double y) {
    cairn::LoadCase lc;
    lc.id = id;
    lc.kind = kind;
    cairn::PointLoad pl;
    pl.at = {x, y, 2.0};
    pl.load = w;
    lc.loads.push_back(pl);
    return lc;
  };
  using cairn::LoadKind;
  p.load_cases = {load("D", LoadKind::dead, {0, 0, -500 * n, 0, 0, 0}, 0.1, -0.1),
                  load("L", LoadKind::live, {0, 0, -200 * n, 0, 0, 0}, 0.4, 0.2),
                  load("Wx", LoadKind::wind, {10 * n, 0, 0, 0, 40 * n, 0}, 0, 0),
                  load("Wy", LoadKind::wind, {0, 10 * n, 0, -40 * n, 0, 0}, 0, 0),
                  load("E", LoadKind::seismic, {12 * n, 5 * n, 0, -20 * n, 50 * n, 5 * n}, 0, 0),
                  load("T", LoadKind::temperature, {2 * n, -2 * n, -10 * n, 0, 0, 0}, 0.5, 0.5)};
  std::mt19937 random(7);
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  for (std::size_t c = 0; c < combinations; ++c) {
    cairn::Combination combo;
    combo.id = "C" + std::to_string(c + 1);
    combo.limit_state = c % 2 ? cairn::LimitState::strength : cairn::LimitState::service;
    combo.factors = {{0, 0.9 + 0.5 * unit(random)}, {1, 1.6 * unit(random)}};
    for (std::size_t lc = 2; lc < p.load_cases.size(); ++lc)
      combo.factors.emplace_back(lc, (unit(random) - 0.5) * 2.0);
    p.combinations.push_back(combo);
  }
  return p;
}

void BM_EachPileLost(benchmark::State& state) {
  const cairn::CheckRun run = cairn::analyse(grid_project(25, 20, 1000));
  const cairn::FastGroup group(run);
  for (auto _ : state) {
    const auto study = cairn::each_pile_lost(group, false);
    benchmark::DoNotOptimize(study.single.data());
  }
  state.counters["piles"] = static_cast<double>(group.piles());
  state.counters["combinations"] = static_cast<double>(group.combinations());
}
BENCHMARK(BM_EachPileLost)->Unit(benchmark::kMillisecond);

void BM_AddedPileSearch(benchmark::State& state) {
  const cairn::CheckRun run = cairn::analyse(grid_project(3, 3, 200));
  const cairn::FastGroup group(run);
  cairn::SearchSettings s;
  s.step = 0.05;
  s.outline = *run.project.cap.outline;
  s.edge_distance = 0.225;
  s.width = 0.4;
  s.spacing_factor = 1.5;  // a close infill, so that many positions remain
  for (const auto& p : run.project.piles) s.in_ground.push_back({p.x, p.y, 0.4});
  std::vector<char> keep(run.project.piles.size(), 1);
  keep[4] = 0;
  s.lost = {{run.project.piles[4].x, run.project.piles[4].y}};
  s.most = 1;
  std::size_t candidates = 0;
  for (auto _ : state) {
    const auto r = cairn::search_added_piles(group, keep, s);
    candidates = r.candidates;
    benchmark::DoNotOptimize(r.best.data());
  }
  state.counters["positions"] = static_cast<double>(candidates);
  state.counters["combinations"] = static_cast<double>(group.combinations());
}
BENCHMARK(BM_AddedPileSearch)->Unit(benchmark::kMillisecond);

void BM_ToleranceStudy(benchmark::State& state) {
  const cairn::CheckRun run = cairn::analyse(grid_project(3, 3, 100));
  const cairn::FastGroup group(run);
  cairn::ToleranceSettings s;
  s.trials = 10000;
  for (auto _ : state) {
    const auto study = cairn::tolerance_study(group, s);
    benchmark::DoNotOptimize(study.samples.data());
  }
  state.counters["piles"] = static_cast<double>(group.piles());
  state.counters["combinations"] = static_cast<double>(group.combinations());
  state.counters["trials"] = static_cast<double>(s.trials);
}
BENCHMARK(BM_ToleranceStudy)->Unit(benchmark::kMillisecond);

}  // namespace

BENCHMARK_MAIN();
