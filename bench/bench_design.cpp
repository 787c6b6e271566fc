// bench_design.cpp — rate of the layout search of `cairn design` (search.hpp).
//
// The project: one pile type with typed-in capacities (no soil, so the rate is the search's
// own: layouts, rigid-cap screen, full checks of the best), six load cases (dead, live, wind
// ±x and ±y with moments from horizontal loads on top of a 1.5 m cap, an eccentric column
// load) and 50 service combinations with factors drawn from a fixed seed. The design: every
// family, spacings 2.5 to 6 pile widths in 0.05 m steps, up to 25 piles, battered outer
// rows, shifted layouts. The Project and DesignSpec are built in code (no input file).
//
// Reported: layouts screened per second (counter `layouts_per_s`) and layouts × combinations
// per second (`layout_combinations_per_s`), on the threads given (Arg).
// Run: bench_design [--benchmark_repetitions=3]
#include <benchmark/benchmark.h>

#include <random>
#include <string>

#include "cairn/design/search.hpp"
#include "cairn/core/model.hpp"

namespace {

cairn::PointLoad at(double x, double y, cairn::Wrench load) {
  cairn::PointLoad p;
  p.at = {x, y, 1.5};
  p.load = load;
  return p;
}

cairn::Project project() {
  cairn::Project p;
  p.title = "benchmark: design search, 50 combinations";
  p.cap.thickness = 1.5;
  cairn::PileType t;
  t.id = "P45";
  t.section = {cairn::SectionShape::square, 0.45};
  t.length = 18.0;
  t.elastic_modulus = 30e6;
  t.lateral_stiffness = 8000.0;
  t.tension = true;
  cairn::CapacitySet allowable;
  allowable.basis = cairn::CapacityBasis::allowable;
  allowable.compression = 1400.0;
  allowable.tension = 350.0;
  allowable.lateral = 90.0;
  t.capacities.push_back(allowable);
  p.pile_types.push_back(t);
  auto lc = [&](const std::string& id, cairn::LoadKind kind, std::vector<cairn::PointLoad> loads) {
    cairn::LoadCase c;
    c.id = id;
    c.kind = kind;
    c.loads = std::move(loads);
    p.load_cases.push_back(c);
  };
  lc("D", cairn::LoadKind::dead, {at(0.0, 0.0, {0, 0, -6000, 0, 0, 0}), at(0.6, 0.0, {0, 0, -1200, 0, 0, 0})});
  lc("L", cairn::LoadKind::live, {at(0.0, 0.3, {0, 0, -2500, 300, 0, 0})});
  lc("WX", cairn::LoadKind::wind, {at(0.0, 0.0, {250, 0, 0, 0, 1200, 0})});
  lc("WY", cairn::LoadKind::wind, {at(0.0, 0.0, {0, 250, 0, -1200, 0, 0})});
  lc("EX", cairn::LoadKind::seismic, {at(0.0, 0.0, {400, 0, 0, 0, 2000, 0})});
  lc("EY", cairn::LoadKind::seismic, {at(0.0, 0.0, {0, 400, 0, -2000, 0, 0})});
  std::mt19937 random(20261202);
  std::uniform_real_distribution<double> live(0.0, 1.0), lateral(-1.0, 1.0);
  for (int k = 0; k < 50; ++k) {
    cairn::Combination c;
    c.id = "S" + std::to_string(k + 1);
    c.limit_state = cairn::LimitState::service;
    c.factors = {{0, 1.0}, {1, live(random)}, {2, 0.6 * lateral(random)}, {3, 0.6 * lateral(random)},
                 {4, 0.7 * lateral(random)}, {5, 0.7 * lateral(random)}};
    p.combinations.push_back(c);
  }
  return p;
}

cairn::DesignSpec spec() {
  cairn::DesignSpec s;
  s.pile_types = {0};
  s.families = {cairn::Family::single, cairn::Family::pair, cairn::Family::grid,
                cairn::Family::staggered, cairn::Family::ring, cairn::Family::ring_centre};
  s.min_spacing_factor = 2.5;
  s.max_spacing_factor = 6.0;
  s.spacing_step = 0.05;
  s.max_piles = 25;
  s.batter_ratio = 6.0;
  s.cost = {1200.0, 95.0, 250.0, 0.0, ""};
  return s;
}

void search(benchmark::State& state) {
  const cairn::Project p = project();
  const cairn::DesignSpec s = spec();
  std::size_t layouts = 0;
  for (auto _ : state) {
    const cairn::DesignOutcome o = cairn::search_layouts(p, s, static_cast<unsigned>(state.range(0)));
    layouts += o.layouts;
    benchmark::DoNotOptimize(o.best.data());
  }
  state.counters["layouts_per_s"] =
      benchmark::Counter(static_cast<double>(layouts), benchmark::Counter::kIsRate);
  state.counters["layout_combinations_per_s"] =
      benchmark::Counter(static_cast<double>(layouts) * 50.0, benchmark::Counter::kIsRate);
}
// Wall time, not the main thread's CPU time: the search runs on several threads.
BENCHMARK(search)->Arg(1)->Arg(2)->Unit(benchmark::kMillisecond)->UseRealTime();

}  // namespace

BENCHMARK_MAIN();
