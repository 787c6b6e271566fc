#include "cairn/app/analysis.hpp"

#include <algorithm>
#include <atomic>
#include <mutex>
#include <numbers>
#include <stdexcept>
#include <thread>
#include <tuple>

#include <fmt/format.h>

#include "cairn/solver/cap_solver.hpp"
#include "cairn/checks/explain.hpp"
#include "cairn/input/input.hpp"

namespace cairn {

CheckRun analyse_project(const std::string& file, const AnalysisOptions& options) {
  Project project = read_project(file);
  try {
    return analyse(std::move(project), {}, options);
  } catch (const std::invalid_argument& e) {
    // A method refused the file's data (outside its range of validity): a problem with the
    // input, named with its file.
    throw InputError(whole_file(file), std::string("cannot compute: ") + e.what());
  }
}

namespace {
void scale(Resistance& r, double f) {
  for (auto* v : {&r.compression, &r.tension, &r.lateral, &r.structural_axial, &r.structural_moment})
    if (*v) **v *= f;
}

// Each pile's head moment and largest moment along it in a nonlinear combination.
std::vector<MomentPeak> nonlinear_moments(const NonlinearRun& run, std::size_t c,
                                          const CapSolution& solution) {
  std::vector<MomentPeak> along;
  const auto& piles = run.combinations[c].piles;
  for (std::size_t i = 0; i < piles.size() && i < solution.piles.size(); ++i)
    along.push_back({solution.piles[i].head_moment, piles[i].max_moment, piles[i].max_moment_depth});
  return along;
}

// The profiles of the governing piles of a nonlinear run (NonlinearRun::profiles).
void add_governing_profiles(CheckRun& run, const NonlinearCapSolver& solver) {
  NonlinearRun& nl = *run.nonlinear;
  std::vector<std::tuple<std::size_t, std::size_t, std::string>> picks;
  const CheckSummary& s = run.results.summary;
  if (s.pile && s.combination) picks.emplace_back(*s.pile, *s.combination, "largest utilization");
  std::optional<std::pair<std::size_t, std::size_t>> moment, deflection;
  double most_moment = 0.0, most_deflection = 0.0;
  for (const CombinationCheck& cc : run.results.combinations) {
    if (cc.solution.overturns) continue;
    const auto& piles = nl.combinations[cc.combination].piles;
    for (std::size_t i = 0; i < piles.size(); ++i) {
      if (piles[i].max_moment > most_moment) {
        most_moment = piles[i].max_moment;
        moment = {i, cc.combination};
      }
      if (piles[i].head_deflection > most_deflection) {
        most_deflection = piles[i].head_deflection;
        deflection = {i, cc.combination};
      }
    }
  }
  if (moment) picks.emplace_back(moment->first, moment->second, "largest moment");
  if (deflection) picks.emplace_back(deflection->first, deflection->second, "largest deflection");
  for (const auto& pick : picks) {
    // Named copies, not structured bindings: clang 14 cannot capture those in a lambda.
    const std::size_t pile = std::get<0>(pick), c = std::get<1>(pick);
    const auto& why = std::get<2>(pick);
    const bool seen = std::any_of(nl.profiles.begin(), nl.profiles.end(), [&](const NonlinearProfile& p) {
      return p.pile == pile && p.combination == c;
    });
    if (seen) continue;
    const double pm = nl.combinations[c].piles[pile].p_multiplier;
    nl.profiles.push_back(
        {pile, c, why, pile_profile_at(solver, pile, run.results.combinations[c].solution.movement, pm)});
  }
}

// What a nonlinear run assumed, in plain words, for every output.
std::vector<std::string> nonlinear_assumptions(const Project& project, const NonlinearRun& run) {
  std::vector<std::string> notes;
  notes.push_back(
      "Soil response: nonlinear. Each pile is a beam-column on the soil's p-y curves with t-z "
      "and Q-z curves along its axis; the cap's six movements are found by Newton iteration on "
      "the piles' head responses in load steps, each combination on its own loads (no "
      "superposition); a combination with no equilibrium fails (docs/methods-nonlinear.md).");
  for (std::size_t t = 0; t < project.pile_types.size() && t < run.curves.size(); ++t)
    if (!run.curves[t].empty())
      notes.push_back(fmt::format("Curves of pile type '{}': {}.", project.pile_types[t].id,
                                  run.curves[t]));
  const double axis_deg = run.multiplier_axis * 180.0 / std::numbers::pi;
  const std::string axes =
      run.multiplier_axis == 0.0
          ? std::string("the group's plan axes x and y")
          : fmt::format("the group's plan axes at {:.1f}° and {:.1f}° from +x", axis_deg,
                        axis_deg + 90.0);
  switch (run.rule) {
    case GroupMultipliers::by_direction:
      notes.push_back(fmt::format(
          "p-multipliers: AASHTO LRFD Table 10.7.2.4-1 by row and spacing, rows along {}, the "
          "leading row the one farthest along the horizontal resultant's component; a "
          "resultant at ψ from the first axis gives each pile P_a·cos²ψ + P_b·sin²ψ of its "
          "multipliers along the two axes (analysis.p_multipliers: by_direction).",
          axes));
      break;
    case GroupMultipliers::reversing:
      notes.push_back(fmt::format(
          "p-multipliers: AASHTO LRFD Table 10.7.2.4-1 by row and spacing, rows along {}, "
          "each pile the smaller of its multipliers for the two opposite directions along "
          "each axis, for loads that reverse; a resultant at ψ from the first axis gives "
          "P_a·cos²ψ + P_b·sin²ψ of those (analysis.p_multipliers: reversing).",
          axes));
      break;
    case GroupMultipliers::none:
      notes.push_back("p-multipliers: none; every pile's p-y curves as for a single pile "
                      "(analysis.p_multipliers: none).");
      break;
  }
  return notes;
}
}  // namespace

CheckRun analyse(Project project_in, const TypeAdjustments& adjust,
                 const AnalysisOptions& options) {
  CheckRun run;
  run.project = std::move(project_in);
  const Project& project = run.project;
  if (options.depth_tables) {
    const DepthTableRange range = report_depth_table(project);
    run.capacities = compute_capacities(project, range.step, range.from);
  } else {
    run.capacities = compute_capacities(project);
  }
  run.stiffness = pile_type_stiffness(project, run.capacities);
  // The whole head stiffness of a damaged pile × f: its axial and lateral springs and, for a
  // held head, the coupling, rotational and torsional terms with them (the lateral term alone
  // × f < 1/2 would leave a fixed head's Hetényi matrix indefinite: K_ll·K_rr < K_lr²). The
  // moment along the pile per head shear and moment is that of the pile scaled as a whole:
  // unchanged.
  for (std::size_t t = 0; t < adjust.stiffness_factor.size() && t < run.stiffness.size(); ++t) {
    const double f = adjust.stiffness_factor[t];
    run.stiffness[t].axial *= f;
    run.stiffness[t].lateral *= f;
    run.stiffness[t].bending.coupling *= f;
    run.stiffness[t].bending.rotational *= f;
    run.stiffness[t].bending.torsional *= f;
  }
  const CapSolver solver(pile_springs(project, run.stiffness));
  run.cap_stiffness = solver.stiffness_about({0.0, 0.0, 0.0});
  const bool nonlinear =
      options.soil_response.value_or(project.analysis.soil_response) == SoilResponse::nonlinear;
  Diagnostics problems;
  // A nonlinear run has p-y curves along every pile, so no load goes unresisted by the
  // linear springs' rule; a load the piles cannot carry is a combination without
  // equilibrium instead.
  if (!nonlinear)
    for (const auto& u : unresisted_cases(project, solver)) {
      const LoadCase& lc = project.load_cases[u.load_case];
      // Point at the first load that has the component, else at the load case.
      SourceLocation where = lc.where;
      const auto component = static_cast<std::size_t>(
          std::find(kWrenchNames.begin(), kWrenchNames.end(), u.load.component) - kWrenchNames.begin());
      for (const auto& load : lc.loads)
        if (component < 6 && load.load[component] != 0.0) {
          where = load.where;
          break;
        }
      problems.error(where, fmt::format("load_cases.{}: {} cannot be resisted: {}", lc.id,
                                        u.load.component, u.load.reason));
    }
  // The cap's pile forces depend on the springs only, so they are known before the
  // resistances; Broms' yield moment is taken at the least favourable of them.
  // (Not when a load cannot be resisted at all: that is reported first.)
  // Without a soil profile nothing computed depends on the pile forces: a run that keeps no
  // pile rows then checks each combination as it is solved and keeps none of them.
  const bool streamed =
      !nonlinear && !options.pile_rows && !(project.soil && !project.soil->layers.empty());
  std::vector<CapSolution> solutions;
  std::optional<NonlinearCapSolver> nonlinear_solver;
  if (nonlinear) {
    // A damaged pile keeps the share stiffness_factor of its soil's resistance at every
    // movement (docs/methods-nonlinear.md §7), as its springs in a linear run.
    const bool factored =
        std::any_of(adjust.stiffness_factor.begin(), adjust.stiffness_factor.end(),
                    [](double f) { return f != 1.0; });
    if (options.nonlinear_piles && factored)
      throw std::logic_error(
          "analyse: a pile model given by the caller cannot take stiffness factors");
    NonlinearGroup group = options.nonlinear_piles
                               ? options.nonlinear_piles(project)
                               : project_nonlinear_group(project, adjust.stiffness_factor,
                                                         options.nonlinear_pile_change);
    run.nonlinear.emplace();
    run.nonlinear->curves.assign(project.pile_types.size(), std::string());
    for (std::size_t i = 0; i < project.piles.size() && i < group.curves.size(); ++i)
      run.nonlinear->curves[project.piles[i].type] = group.curves[i];
    nonlinear_solver.emplace(std::move(group));
    solve_nonlinear_combinations(project, *nonlinear_solver, project.analysis.p_multipliers,
                                 *run.nonlinear, [&](std::size_t, CapSolution&& solution) {
                                   solutions.push_back(std::move(solution));
                                 });
  } else if (problems.empty() && !streamed) {
    solutions = solve_combinations(project, solver);
  }
  const auto lateral = lateral_capacities(project, axial_ranges(project, solutions));
  for (const auto& d : lateral_input_problems(project, lateral, solutions)) problems.error(d.where, d.message);
  run.resistances =
      resolve_resistances(project, computed_resistances(project, run.capacities, lateral));
  for (std::size_t t = 0; t < adjust.capacity_factor.size() && t < run.resistances.size(); ++t) {
    const double f = adjust.capacity_factor[t];
    scale(run.resistances[t].allowable, f);
    scale(run.resistances[t].factored, f);
    for (auto& [set, r] : run.resistances[t].by_set) scale(r, f);
  }
  for (const auto& d : missing_resistances(project, run.resistances))
    problems.error(d.where, d.message);
  for (const auto& d : group_input_problems(project, run.capacities))
    problems.error(d.where, d.message);
  problems.raise_if_any();
  std::vector<double> moment_per_shear;
  for (const auto& k : run.stiffness) moment_per_shear.push_back(k.head_moment_per_shear);
  std::vector<std::optional<MomentInfluence>> influence;
  for (const auto& k : run.stiffness) influence.push_back(k.influence);
  CheckAccumulator accumulator(project, run.resistances, moment_per_shear, options.pile_rows,
                               influence);
  const std::size_t total = project.combinations.size();
  auto report = [&](std::size_t c) {
    if (options.progress && (c + 1) % 1000 == 0) options.progress(c + 1, total);
  };
  if (streamed)
    // The piles' forces as arrays, straight into the checks' pass over arrays; pile rows
    // only for the combinations checked pile by pile.
    solve_combinations(
        project, solver, [&](std::size_t c) { return accumulator.needs_rows(c); },
        [&](std::size_t c, CapSolution&& solution, const double* axial, const double* lateral) {
          accumulator.add(c, std::move(solution), axial, lateral);
          report(c);
        });
  else
    for (std::size_t c = 0; c < solutions.size(); ++c) {
      if (run.nonlinear) {
        const std::vector<MomentPeak> along = nonlinear_moments(*run.nonlinear, c, solutions[c]);
        accumulator.add(c, std::move(solutions[c]), along);
      } else
        accumulator.add(c, std::move(solutions[c]));
      if (!options.pile_rows) std::vector<PileForce>().swap(solutions[c].piles);
      report(c);
    }
  run.results = accumulator.finish();
  run.group = evaluate_group(project, run.results, run.resistances, run.capacities);
  if (!run.group.pass) run.results.summary.pass = false;
  std::vector<std::pair<std::string, std::string>> sources;
  for (const auto& k : run.stiffness) sources.emplace_back(k.axial_source, k.lateral_source);
  run.assumptions = assumptions(project, run.resistances, sources);
  if (run.nonlinear) {
    const auto& s = run.results.summary;
    std::optional<std::size_t> pushed;
    for (std::size_t c = 0; c < project.combinations.size(); ++c)
      if (project.combinations[c].id == project.analysis.pushover) pushed = c;
    if (!pushed) pushed = s.combination;
    if (!pushed && !s.overturned.empty()) pushed = s.overturned.front();
    if (pushed)
      run.nonlinear->pushover = push_combination(project, *nonlinear_solver,
                                                 project.analysis.p_multipliers, *pushed,
                                                 project.analysis);
    add_governing_profiles(run, *nonlinear_solver);
    const auto notes = nonlinear_assumptions(project, *run.nonlinear);
    run.assumptions.insert(run.assumptions.end(), notes.begin(), notes.end());
  }
  return run;
}

std::vector<CapOutcome> analyse_projects(
    const std::vector<std::string>& files, unsigned threads, const AnalysisOptions& options,
    const std::function<void(std::size_t, std::size_t)>& progress,
    const std::function<void(CapOutcome&)>& reduce) {
  std::vector<CapOutcome> outcomes(files.size());
  std::atomic<std::size_t> next{0};
  std::size_t done = 0;
  std::mutex progress_lock;
  auto work = [&] {
    for (std::size_t i = next++; i < files.size(); i = next++) {
      outcomes[i].file = files[i];
      try {
        outcomes[i].run = analyse_project(files[i], options);
      } catch (const InputError& e) {
        outcomes[i].problems = e.diagnostics();
      }
      if (reduce) reduce(outcomes[i]);
      if (progress) {
        const std::lock_guard<std::mutex> hold(progress_lock);
        progress(++done, files.size());
      }
    }
  };
  std::vector<std::thread> pool;
  const unsigned n = std::max(1u, std::min<unsigned>(threads, static_cast<unsigned>(files.size())));
  for (unsigned t = 1; t < n; ++t) pool.emplace_back(work);
  work();
  for (auto& t : pool) t.join();
  return outcomes;
}

CheckReport make_check_report(const CheckRun& run, const std::string& options,
                              const std::optional<std::string>& explain) {
  CheckReport report;
  report.project = &run.project;
  report.results = &run.results;
  report.resistances = &run.resistances;
  report.assumptions = run.assumptions;
  report.stiffness = &run.stiffness;
  report.group = &run.group;
  report.cap_stiffness = run.cap_stiffness;
  if (run.nonlinear) report.nonlinear = &*run.nonlinear;
  report.options = options;
  if (explain) {
    const auto& piles = run.project.piles;
    auto it = std::find_if(piles.begin(), piles.end(),
                           [&](const Pile& p) { return p.id == *explain; });
    if (it == piles.end()) {
      std::vector<std::string> ids;
      for (const auto& p : piles) ids.push_back(p.id);
      const std::string near = closest_match(*explain, ids);
      throw InputError(whole_file(run.project.file),
                       fmt::format("--explain: pile '{}' does not exist{}", *explain,
                                   near.empty() ? "" : "; did you mean '" + near + "'?"));
    }
    report.explain_pile = static_cast<std::size_t>(it - piles.begin());
    std::vector<double> springs;
    for (const auto& k : run.stiffness) springs.push_back(k.axial);
    report.hand_checks = explain_pile(run.project, run.results, *report.explain_pile, springs);
  }
  return report;
}

}  // namespace cairn
