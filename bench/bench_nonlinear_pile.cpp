// bench_nonlinear_pile.cpp — time of one pile_head_response (nonlinear_pile.hpp): the call the
// nonlinear cap analysis makes for every pile at every Newton iteration of every combination
// (20 piles × 50 combinations × ~5 iterations = 5000 calls must take well under 2 s).
//
// The pile: 0.6 m round concrete, 25 m, fixed head, 60 segments, in Matlock's (1970) soft
// clay (cu = 30 kPa, γ' = 8 kN/m³, ε50 = 0.01) and API clay t-z / Q-z curves; the head moved
// 20 mm and 10 mm across, 5 mm down and turned 0.002 rad (the soil well into its nonlinear
// range). A second case: API sand (φ' = 35°, k = 20 MN/m³), pinned head.
//
// Run: bench_nonlinear_pile [--benchmark_repetitions=5]
#include <benchmark/benchmark.h>

#include <cmath>
#include <numbers>

#include "cairn/geotechnics/axial_curves.hpp"
#include "cairn/geotechnics/py_curves.hpp"
#include "cairn/solver/nonlinear_pile.hpp"

namespace {

cairn::NonlinearPileSpec pile_in(bool sand) {
  cairn::NonlinearPileSpec pile;
  pile.axis = {0.0, 0.0, -1.0};
  pile.length = 25.0;
  pile.bending_stiffness = 30e6 * std::numbers::pi * std::pow(0.6, 4) / 64.0;
  pile.axial_rigidity = 30e6 * std::numbers::pi * 0.36 / 4.0;
  pile.width = 0.6;
  pile.segments = 60;
  const double perimeter = std::numbers::pi * 0.6;
  if (sand) {
    pile.restraint.kind = cairn::HeadRestraint::Kind::pinned;
    cairn::SandApiPy py;
    py.friction_angle = 35.0;
    py.effective_unit_weight = 10.0;
    py.width = 0.6;
    py.initial_modulus = 20000.0;
    pile.curves.lateral = [py](double z, double y) { return py.resistance(z, y); };
    pile.curves.shaft = [perimeter](double z, double w) {
      return (5.0 + 3.0 * z) * perimeter * cairn::shaft_transfer(cairn::AxialSoil::sand, 0.6, w);
    };
  } else {
    pile.restraint.kind = cairn::HeadRestraint::Kind::fixed;
    cairn::SoftClayPy py;
    py.undrained_strength = 30.0;
    py.effective_unit_weight = 8.0;
    py.width = 0.6;
    py.strain_50 = 0.01;
    pile.curves.lateral = [py](double z, double y) { return py.resistance(z, y); };
    pile.curves.shaft = [perimeter](double, double w) {
      return 25.0 * perimeter * cairn::shaft_transfer(cairn::AxialSoil::clay, 0.6, w);
    };
  }
  pile.curves.tip = [](double w) { return 800.0 * cairn::tip_transfer(0.6, w); };
  return pile;
}

void head_response(benchmark::State& state, bool sand) {
  const cairn::NonlinearPileSpec pile = pile_in(sand);
  const cairn::HeadMovement movement{0.02, 0.01, -0.005, 0.0, 0.002, 0.0};
  for (auto _ : state) {
    const auto response = cairn::pile_head_response(pile, movement);
    if (!response.converged) state.SkipWithError(response.message.c_str());
    benchmark::DoNotOptimize(response.action);
  }
}

void BM_head_response_soft_clay(benchmark::State& state) { head_response(state, false); }
void BM_head_response_sand(benchmark::State& state) { head_response(state, true); }
BENCHMARK(BM_head_response_soft_clay)->Unit(benchmark::kMicrosecond);
BENCHMARK(BM_head_response_sand)->Unit(benchmark::kMicrosecond);

// The cap's Newton iteration keeps each pile's state: a call starting from the state of a
// movement 2 % away.
void BM_head_response_warm_soft_clay(benchmark::State& state) {
  const cairn::NonlinearPileSpec pile = pile_in(false);
  const cairn::HeadMovement before{0.02, 0.01, -0.005, 0.0, 0.002, 0.0};
  cairn::HeadMovement after = before;
  for (double& m : after) m *= 1.02;
  cairn::DeflectedShape start;
  cairn::pile_head_response(pile, before, 1.0, &start);
  for (auto _ : state) {
    cairn::DeflectedShape warm = start;
    const auto response = cairn::pile_head_response(pile, after, 1.0, &warm);
    if (!response.converged) state.SkipWithError(response.message.c_str());
    benchmark::DoNotOptimize(response.action);
  }
}
BENCHMARK(BM_head_response_warm_soft_clay)->Unit(benchmark::kMicrosecond);

void BM_profile_soft_clay(benchmark::State& state) {
  const cairn::NonlinearPileSpec pile = pile_in(false);
  const cairn::HeadMovement movement{0.02, 0.01, -0.005, 0.0, 0.002, 0.0};
  for (auto _ : state) benchmark::DoNotOptimize(cairn::pile_profile(pile, movement).max_moment);
}
BENCHMARK(BM_profile_soft_clay)->Unit(benchmark::kMicrosecond);

}  // namespace

BENCHMARK_MAIN();
