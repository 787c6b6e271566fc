// bench_cap_solver.cpp — wall time of solve_combinations on a large pile group.
//
// The group: 400 piles on a 20 × 20 grid at 1.2 m, the outer two rings battered outward
// (1H:6V along x or y, 1H:8V on the diagonals at the corners), the battered piles
// compression-only; 12 load cases (dead, live, wind and seismic in ±x and ±y, with moments
// from horizontal loads at the top of a 2.0 m cap and eccentric column loads); 5000
// combinations with factors drawn from a fixed seed, a share of them lifting piles so the
// compression-only iteration runs. The Project is built in code (no input file).
//
// Run: bench_cap_solver [--benchmark_repetitions=5]
#include <benchmark/benchmark.h>

#include <algorithm>
#include <cmath>
#include <cstddef>
#include <random>
#include <string>
#include <utility>
#include <vector>

#include "cairn/checks/checks.hpp"
#include "cairn/solver/cap_solver.hpp"
#include "cairn/core/model.hpp"

namespace {

using cairn::Project;

constexpr int kGridSide = 20;           // 20 × 20 = 400 piles
constexpr double kSpacing = 1.2;        // m
constexpr double kCapThickness = 2.0;   // m
constexpr std::size_t kCombinations = 5000;

cairn::PileType pile_type(const std::string& id, double axial, double lateral, bool tension) {
  cairn::PileType type;
  type.id = id;
  type.section = {cairn::SectionShape::square, 0.4};
  type.length = 20.0;
  type.elastic_modulus = 30e6;
  type.axial_stiffness = axial;
  type.lateral_stiffness = lateral;
  type.tension = tension;
  return type;
}

cairn::LoadCase load_case(const std::string& id, cairn::LoadKind kind,
                          std::vector<cairn::PointLoad> loads) {
  cairn::LoadCase lc;
  lc.id = id;
  lc.kind = kind;
  lc.loads = std::move(loads);
  return lc;
}

cairn::PointLoad at(double x, double y, cairn::Wrench load) {
  cairn::PointLoad p;
  p.at = {x, y, kCapThickness};
  p.load = load;
  return p;
}

Project large_project() {
  Project project;
  project.title = "benchmark: 400 piles, 5000 combinations";
  project.cap.thickness = kCapThickness;
  project.pile_types = {
      pile_type("vertical", 4.0e5, 2.0e4, true),     // interior, takes tension
      pile_type("raked", 3.5e5, 1.5e4, false),       // outer rings, compression only
      pile_type("raked-corner", 3.0e5, 0.0, false),  // corners, axial only
  };
  const double half = (kGridSide - 1) * kSpacing / 2.0;
  for (int i = 0; i < kGridSide; ++i) {
    for (int j = 0; j < kGridSide; ++j) {
      cairn::Pile pile;
      pile.id = "P" + std::to_string(i * kGridSide + j + 1);
      pile.x = i * kSpacing - half;
      pile.y = j * kSpacing - half;
      const int ring = std::min(std::min(i, j), std::min(kGridSide - 1 - i, kGridSide - 1 - j));
      const bool corner_x = i < 2 || i >= kGridSide - 2;
      const bool corner_y = j < 2 || j >= kGridSide - 2;
      if (ring < 2) {
        const double toward = std::atan2(pile.y, pile.x) * 180.0 / 3.141592653589793;
        if (corner_x && corner_y) {
          pile.type = 2;
          pile.batter = cairn::Batter{8.0, toward};
        } else {
          pile.type = 1;
          // Outward along the nearer edge's normal.
          const double edge = std::abs(pile.x) > std::abs(pile.y) ? (pile.x > 0 ? 0.0 : 180.0)
                                                                  : (pile.y > 0 ? 90.0 : 270.0);
          pile.batter = cairn::Batter{6.0, edge};
        }
      }
      project.piles.push_back(pile);
    }
  }

  using cairn::LoadKind;
  project.load_cases = {
      load_case("D", LoadKind::dead, {at(0.3, -0.2, {0, 0, -60000, 0, 0, 0})}),
      load_case("SDL", LoadKind::dead, {at(-1.0, 0.5, {0, 0, -8000, 0, 0, 0})}),
      load_case("L", LoadKind::live, {at(2.5, 1.0, {0, 0, -15000, 0, 0, 0})}),
      load_case("S", LoadKind::snow, {at(-2.0, -3.0, {0, 0, -4000, 0, 0, 0})}),
      load_case("Wx+", LoadKind::wind, {at(0, 0, {2500, 0, 0, 0, 120000, 0})}),
      load_case("Wx-", LoadKind::wind, {at(0, 0, {-2500, 0, 0, 0, -120000, 0})}),
      load_case("Wy+", LoadKind::wind, {at(0, 0, {0, 2500, 0, -120000, 0, 3000})}),
      load_case("Wy-", LoadKind::wind, {at(0, 0, {0, -2500, 0, 120000, 0, -3000})}),
      load_case("Ex", LoadKind::seismic, {at(1.0, 0, {4000, 600, 0, -20000, 180000, 8000})}),
      load_case("Ey", LoadKind::seismic, {at(0, 1.0, {600, 4000, 0, -180000, 20000, -8000})}),
      load_case("H", LoadKind::earth, {at(-11.4, 0, {1800, 0, 0, 0, 0, 0})}),
      load_case("T", LoadKind::temperature, {at(5.0, 5.0, {300, -300, -500, 0, 0, 0})}),
  };

  std::mt19937 random(20240611);
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  for (std::size_t c = 0; c < kCombinations; ++c) {
    cairn::Combination combination;
    combination.id = "C" + std::to_string(c + 1);
    combination.limit_state = c % 2 ? cairn::LimitState::strength : cairn::LimitState::service;
    combination.factors.emplace_back(0, 0.9 + 0.5 * unit(random));  // dead always present
    combination.factors.emplace_back(1, 0.9 + 0.5 * unit(random));
    for (std::size_t lc = 2; lc < project.load_cases.size(); ++lc)
      if (unit(random) < 0.4) combination.factors.emplace_back(lc, 1.6 * unit(random));
    project.combinations.push_back(std::move(combination));
  }
  return project;
}

void BM_SolveCombinations(benchmark::State& state) {
  const Project project = large_project();
  const cairn::CapSolver solver(cairn::pile_springs(project));
  std::size_t lifted = 0, overturned = 0;
  for (auto _ : state) {
    const auto solutions = cairn::solve_combinations(project, solver);
    lifted = overturned = 0;
    for (const auto& s : solutions) {
      lifted += s.dropped.empty() ? 0 : 1;
      overturned += s.overturns ? 1 : 0;
    }
    benchmark::DoNotOptimize(solutions.data());
  }
  state.counters["piles"] = static_cast<double>(project.piles.size());
  state.counters["combinations"] = static_cast<double>(project.combinations.size());
  state.counters["with_lifted_piles"] = static_cast<double>(lifted);
  state.counters["overturned"] = static_cast<double>(overturned);
}
BENCHMARK(BM_SolveCombinations)->Unit(benchmark::kMillisecond)->UseRealTime();

void BM_BuildSolver(benchmark::State& state) {
  const Project project = large_project();
  for (auto _ : state) {
    cairn::CapSolver solver(cairn::pile_springs(project));
    benchmark::DoNotOptimize(&solver);
  }
}
BENCHMARK(BM_BuildSolver)->Unit(benchmark::kMillisecond)->UseRealTime();

// The linear case of bench/compare.py: 500 vertical piles that take tension on a 25 × 20
// grid at 1.5 m, 10,000 combinations of the same load cases, streamed (no solution kept).
Project linear_project() {
  Project project = large_project();
  project.title = "benchmark: 500 vertical piles, 10,000 combinations, linear";
  project.pile_types = {pile_type("vertical", 2.5e5, 8.0e3, true)};
  project.piles.clear();
  for (int i = 0; i < 25; ++i)
    for (int j = 0; j < 20; ++j) {
      cairn::Pile pile;
      pile.id = "P" + std::to_string(i * 20 + j + 1);
      pile.x = (i - 12) * 1.5;
      pile.y = (j - 9.5) * 1.5;
      pile.type = 0;
      project.piles.push_back(pile);
    }
  const auto first = project.combinations;
  project.combinations.clear();
  for (std::size_t c = 0; c < 10000; ++c) {
    project.combinations.push_back(first[c % first.size()]);
    project.combinations.back().id = "C" + std::to_string(c + 1);
  }
  return project;
}

void BM_SolveLinear500x10000(benchmark::State& state) {
  const Project project = linear_project();
  const cairn::CapSolver solver(cairn::pile_springs(project));
  for (auto _ : state) {
    double sum = 0.0;
    cairn::solve_combinations(project, solver, [&](std::size_t, cairn::CapSolution&& s) {
      sum += s.piles.front().axial;
    });
    benchmark::DoNotOptimize(sum);
  }
}
BENCHMARK(BM_SolveLinear500x10000)->Unit(benchmark::kMillisecond)->UseRealTime();

// The same solve with the piles' forces as arrays only (axial and lateral of every pile in
// every combination, what the numpy peer's core computes), each combination's arrays
// overwriting the last's: no pile rows, no head actions.
void BM_SolveLinearArrays500x10000(benchmark::State& state) {
  const Project project = linear_project();
  const cairn::CapSolver solver(cairn::pile_springs(project));
  for (auto _ : state) {
    double sum = 0.0;
    cairn::solve_combinations(
        project, solver, [](std::size_t) { return false; },
        [&](std::size_t, cairn::CapSolution&&, const double* axial, const double* lateral) {
          sum += axial[0] + lateral[0];
        });
    benchmark::DoNotOptimize(sum);
  }
}
BENCHMARK(BM_SolveLinearArrays500x10000)->Unit(benchmark::kMillisecond)->UseRealTime();

// The same into arrays of every pile and combination (n·m axial and lateral forces, 80 MB
// kept, as the peer keeps them): like for like with the peer's core.
void BM_SolveLinearKept500x10000(benchmark::State& state) {
  const Project project = linear_project();
  const cairn::CapSolver solver(cairn::pile_springs(project));
  const std::size_t n = project.piles.size(), m = project.combinations.size();
  std::vector<double> all_axial(n * m), all_lateral(n * m);
  for (auto _ : state) {
    cairn::solve_combinations(
        project, solver, [](std::size_t) { return false; },
        [&](std::size_t c, cairn::CapSolution&&, const double* axial, const double* lateral) {
          std::copy(axial, axial + n, all_axial.begin() + static_cast<std::ptrdiff_t>(c * n));
          std::copy(lateral, lateral + n, all_lateral.begin() + static_cast<std::ptrdiff_t>(c * n));
        });
    benchmark::DoNotOptimize(all_axial.data());
    benchmark::DoNotOptimize(all_lateral.data());
    benchmark::ClobberMemory();
  }
}
BENCHMARK(BM_SolveLinearKept500x10000)->Unit(benchmark::kMillisecond)->UseRealTime();

// The same solve with the checks folded in as each combination is solved, as
// `--detail envelope` runs them: each pile's utilization, envelope and governing
// combinations (invented capacities: 1,500 kN compression, 600 kN tension, 80 kN lateral,
// on both bases); the n·m rows are not kept.
void BM_CheckEnvelope500x10000(benchmark::State& state) {
  const Project project = linear_project();
  const cairn::CapSolver solver(cairn::pile_springs(project));
  cairn::PileTypeResistance r;
  for (cairn::Resistance* basis : {&r.allowable, &r.factored}) {
    basis->compression = 1500.0;
    basis->tension = 600.0;
    basis->lateral = 80.0;
  }
  const std::vector<cairn::PileTypeResistance> resistances(project.pile_types.size(), r);
  for (auto _ : state) {
    cairn::CheckAccumulator checks(project, resistances, {}, false);
    cairn::solve_combinations(
        project, solver, [&](std::size_t c) { return checks.needs_rows(c); },
        [&](std::size_t c, cairn::CapSolution&& s, const double* axial, const double* lateral) {
          checks.add(c, std::move(s), axial, lateral);
        });
    const cairn::CheckResults results = checks.finish();
    benchmark::DoNotOptimize(results.summary.max_utilization);
  }
}
BENCHMARK(BM_CheckEnvelope500x10000)->Unit(benchmark::kMillisecond)->UseRealTime();

// The compression-only case of bench/compare.py: 500 vertical piles that take no tension on
// a 25 × 20 grid at 1.5 m, six load cases (bench/make_cases.py's: dead, live, wind and
// seismic along x and y, 2 m above the heads) and 10,000 service combinations of the dead
// load with factors in [−1, 1] on three of the others (a fixed seed): about a third of them
// lift piles, so the active set runs.
Project compression_only_project() {
  Project project;
  project.title = "benchmark: 500 compression-only piles, 10,000 combinations";
  project.cap.thickness = kCapThickness;
  project.pile_types = {pile_type("P40", 2.5e5, 8.0e3, false)};
  constexpr int kColumns = 25, kRows = 20;
  for (int r = 0; r < kRows; ++r)
    for (int c = 0; c < kColumns; ++c) {
      cairn::Pile pile;
      pile.id = "P" + std::to_string(r * kColumns + c + 1);
      pile.x = (c - (kColumns - 1) / 2.0) * 1.5;
      pile.y = (r - (kRows - 1) / 2.0) * 1.5;
      pile.type = 0;
      project.piles.push_back(pile);
    }
  const double n = 500.0, width = kColumns * 1.5, length = kRows * 1.5;
  const double wind = 1.3 * 600 * n;
  using cairn::LoadKind;
  project.load_cases = {
      load_case("D", LoadKind::dead, {at(0.3, -0.2, {0, 0, -600 * n, 0, 0, 0})}),
      load_case("L", LoadKind::live, {at(-0.5, 0.4, {0, 0, -150 * n, 15 * n, 0, 0})}),
      load_case("WX", LoadKind::wind, {at(0, 0, {wind * 0.25, 0, 0, 0, wind * width / 12, 0})}),
      load_case("WY", LoadKind::wind, {at(0, 0, {0, wind * 0.25, 0, -wind * length / 12, 0, 0})}),
      load_case("EX", LoadKind::seismic,
                {at(0, 0, {wind * 0.2, 0, 0, 0, wind * width / 10, 8 * n})}),
      load_case("EY", LoadKind::seismic, {at(0, 0, {0, wind * 0.2, 0, -wind * length / 10, 0, 0})}),
  };
  std::mt19937 random(11);
  std::uniform_real_distribution<double> factor(-1.0, 1.0);
  for (std::size_t c = 0; c < 10000; ++c) {
    cairn::Combination combination;
    combination.id = "C" + std::to_string(c + 1);
    combination.limit_state = cairn::LimitState::service;
    combination.factors.emplace_back(0, 1.0);
    std::vector<std::size_t> others = {1, 2, 3, 4, 5};
    std::shuffle(others.begin(), others.end(), random);
    others.resize(3);
    std::sort(others.begin(), others.end());
    for (const std::size_t lc : others)
      combination.factors.emplace_back(lc, std::round(100.0 * factor(random)) / 100.0);
    project.combinations.push_back(std::move(combination));
  }
  return project;
}

void BM_SolveCompressionOnly500x10000(benchmark::State& state) {
  const Project project = compression_only_project();
  const cairn::CapSolver solver(cairn::pile_springs(project));
  std::size_t lifted = 0;
  for (auto _ : state) {
    double sum = 0.0;
    lifted = 0;
    cairn::solve_combinations(project, solver, [&](std::size_t, cairn::CapSolution&& s) {
      sum += s.piles.front().axial;
      lifted += s.dropped.empty() ? 0 : 1;
    });
    benchmark::DoNotOptimize(sum);
  }
  state.counters["with_lifted_piles"] = static_cast<double>(lifted);
}
BENCHMARK(BM_SolveCompressionOnly500x10000)->Unit(benchmark::kMillisecond)->UseRealTime();

// The same with the checks folded in, as `--detail envelope` runs them (compression
// 1,600 kN, lateral 250 kN, no tension: bench/make_cases.py's capacities).
void BM_CheckEnvelopeCompressionOnly500x10000(benchmark::State& state) {
  const Project project = compression_only_project();
  const cairn::CapSolver solver(cairn::pile_springs(project));
  cairn::PileTypeResistance r;
  for (cairn::Resistance* basis : {&r.allowable, &r.factored}) {
    basis->compression = 1600.0;
    basis->lateral = 250.0;
  }
  const std::vector<cairn::PileTypeResistance> resistances(project.pile_types.size(), r);
  for (auto _ : state) {
    cairn::CheckAccumulator checks(project, resistances, {}, false);
    cairn::solve_combinations(
        project, solver, [&](std::size_t c) { return checks.needs_rows(c); },
        [&](std::size_t c, cairn::CapSolution&& s, const double* axial, const double* lateral) {
          checks.add(c, std::move(s), axial, lateral);
        });
    const cairn::CheckResults results = checks.finish();
    benchmark::DoNotOptimize(results.summary.max_utilization);
  }
}
BENCHMARK(BM_CheckEnvelopeCompressionOnly500x10000)->Unit(benchmark::kMillisecond)->UseRealTime();

// The floor of that case: writing its n·m = 5,000,000 results (axial and lateral, 16 bytes
// each) once to memory.
void BM_WriteFloor500x10000(benchmark::State& state) {
  std::vector<double> results(2 * 500 * 10000);
  double x = 1.0;
  for (auto _ : state) {
    for (double& r : results) r = (x += 1e-9);
    benchmark::DoNotOptimize(results.data());
    benchmark::ClobberMemory();
  }
}
BENCHMARK(BM_WriteFloor500x10000)->Unit(benchmark::kMillisecond)->UseRealTime();

}  // namespace

BENCHMARK_MAIN();
