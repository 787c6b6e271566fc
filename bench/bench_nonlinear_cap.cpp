// bench_nonlinear_cap.cpp — wall time of a nonlinear check's solving: a 20-pile cap on sand
// with 50 combinations, each solved on its own by Newton iteration on the piles' head
// responses (solver/nonlinear_combinations.hpp), p-multipliers by the load's direction.
//
// The group: 5 × 4 round concrete piles, 0.6 m, 24 m long, at 1.8 m (3 widths), fixed heads;
// API sand p-y curves (φ' 35°, γ' 10 kN/m³, k 20 000 kN/m³), API t-z sand (t_max 60 kPa) and
// Q-z (Q_p 2000 kN). 50 combinations of a vertical load of 9–13 MN and a horizontal load of
// up to 1.2 MN in directions all around, at the top of a 1.5 m cap, with moments. Invented
// data built in code (no input file). Target (issue 15): under 2 s.
//
// Run: bench_nonlinear_cap [--benchmark_repetitions=3]
#include <benchmark/benchmark.h>

#include <cmath>
#include <cstddef>
#include <numbers>
#include <random>
#include <string>

#include "cairn/core/model.hpp"
#include "cairn/geotechnics/axial_curves.hpp"
#include "cairn/geotechnics/py_curves.hpp"
#include "cairn/solver/nonlinear_combinations.hpp"

namespace {

using cairn::Project;

constexpr int kColumns = 5, kRows = 4;
constexpr double kSpacing = 1.8, kWidth = 0.6, kLength = 24.0, kThickness = 1.5;
constexpr std::size_t kCombinations = 50;

Project bench_project() {
  Project project;
  project.title = "benchmark: 20 piles, 50 combinations, nonlinear";
  project.cap.thickness = kThickness;
  cairn::PileType type;
  type.id = "P60";
  type.section = {cairn::SectionShape::round, kWidth};
  type.length = kLength;
  type.elastic_modulus = 30e6;
  type.head = cairn::HeadFixity::fixed;
  project.pile_types.push_back(type);
  for (int i = 0; i < kColumns; ++i)
    for (int j = 0; j < kRows; ++j) {
      cairn::Pile pile;
      pile.id = "P" + std::to_string(i * kRows + j + 1);
      pile.x = (i - 2.0) * kSpacing;
      pile.y = (j - 1.5) * kSpacing;
      project.piles.push_back(pile);
    }
  std::mt19937 random(15);
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  for (std::size_t c = 0; c < kCombinations; ++c) {
    cairn::LoadCase lc;
    lc.id = "L" + std::to_string(c + 1);
    const double angle = 2.0 * std::numbers::pi * static_cast<double>(c) / kCombinations;
    const double h = 1200.0 * unit(random);
    cairn::PointLoad load;
    load.at = {0.4 * unit(random), -0.3 * unit(random), kThickness};
    load.load = {h * std::cos(angle), h * std::sin(angle), -9000.0 - 4000.0 * unit(random),
                 500.0 * unit(random), -500.0 * unit(random), 100.0 * unit(random)};
    lc.loads.push_back(load);
    project.load_cases.push_back(lc);
    cairn::Combination combination;
    combination.id = "C" + std::to_string(c + 1);
    combination.limit_state = cairn::LimitState::strength;
    combination.factors = {{c, 1.0}};
    project.combinations.push_back(combination);
  }
  return project;
}

cairn::NonlinearGroup bench_group(const Project& project) {
  cairn::SandApiPy sand;
  sand.friction_angle = 35.0;
  sand.effective_unit_weight = 10.0;
  sand.width = kWidth;
  sand.initial_modulus = 20000.0;
  constexpr double kShaftMax = 60.0 * std::numbers::pi * kWidth;  // t_max·perimeter, kN/m
  constexpr double kTipMax = 2000.0;                              // Q_p, kN
  std::vector<cairn::NonlinearPileSpec> specs;
  for (const auto& pile : project.piles) {
    cairn::NonlinearPileSpec s;
    s.head = {pile.x, pile.y, 0.0};
    s.axis = {0.0, 0.0, -1.0};
    s.length = kLength;
    s.bending_stiffness = 30e6 * std::numbers::pi * std::pow(kWidth, 4) / 64.0;
    s.axial_rigidity = 30e6 * std::numbers::pi * kWidth * kWidth / 4.0;
    s.width = kWidth;
    s.restraint = {cairn::HeadRestraint::Kind::fixed, 0.0};
    s.curves.lateral = [sand](double z, double y) { return sand.resistance(z, y); };
    s.curves.shaft = [](double, double w) {
      return kShaftMax * cairn::shaft_transfer(cairn::AxialSoil::sand, kWidth, w);
    };
    s.curves.tip = [](double w) { return kTipMax * cairn::tip_transfer(kWidth, w); };
    s.curves.description = "API sand p-y, t-z and Q-z";
    specs.push_back(s);
  }
  return cairn::nonlinear_group(std::move(specs));
}

void nonlinear_combinations(benchmark::State& state) {
  const Project project = bench_project();
  int failed = 0;
  for (auto _ : state) {
    const cairn::NonlinearCapSolver solver(bench_group(project));
    cairn::NonlinearRun run;
    failed = 0;
    cairn::solve_nonlinear_combinations(
        project, solver, cairn::GroupMultipliers::by_direction, run,
        [&](std::size_t, cairn::CapSolution&& s) { failed += s.overturns ? 1 : 0; });
    benchmark::DoNotOptimize(run);
  }
  state.counters["no_equilibrium"] = failed;
}
BENCHMARK(nonlinear_combinations)->Unit(benchmark::kMillisecond)->UseRealTime();

}  // namespace

BENCHMARK_MAIN();
