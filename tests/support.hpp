// support.hpp — what the unit tests share: the one approximate-equality helper and the
// builders of small projects (piles, loads on the cap, one load case and one combination)
// and of their solution. Tests only; nothing here is part of cairn.
#pragma once

#include <catch2/catch.hpp>

#include <array>
#include <cmath>
#include <cstddef>
#include <numbers>
#include <string>
#include <utility>
#include <vector>

#include "cairn/core/model.hpp"
#include "cairn/geotechnics/capacity.hpp"
#include "cairn/solver/cap_solver.hpp"

namespace cairn::test {

// The one comparison helper: `relative` is the margin the comparison allows and follows the
// rounding of the value compared with (a published value to 6 digits gets 1e-5 or 1e-6; say
// why beside each use); `absolute` covers values that are exactly zero, where only rounding
// noise (~1e-12 of the loads) remains.
inline Approx close(double value, double relative, double absolute = 1e-9) {
  return Approx(value).epsilon(relative).margin(absolute);
}

// Text checks on rendered outputs: whether `what` occurs in `text`, and how often.
inline bool has(const std::string& text, const std::string& what) {
  return text.find(what) != std::string::npos;
}

inline std::size_t count(const std::string& text, const std::string& what) {
  std::size_t n = 0;
  for (auto at = text.find(what); at != std::string::npos; at = text.find(what, at + 1)) ++n;
  return n;
}

// Cap thickness of the builders' projects, m: loads act at the top of the cap, z = 1.5.
inline constexpr double kCapThickness = 1.5;

// Unit axis of a pile battered 1 horizontal in `ratio` vertical, toe toward `toward_deg`:
// (cos θ, sin θ, −ratio)/√(1 + ratio²), written out here independently of Pile::axis().
inline std::array<double, 3> batter_axis(double ratio, double toward_deg) {
  const double t = toward_deg * std::numbers::pi / 180.0;
  const double n = std::sqrt(1.0 + ratio * ratio);
  return {std::cos(t) / n, std::sin(t) / n, -ratio / n};
}

// A spring at pile head (x, y, 0) along `axis`, axial and lateral stiffness kN/m.
inline PileSpring spring(double x, double y, double axial, double lateral = 0.0,
                         bool tension = true, std::array<double, 3> axis = {0.0, 0.0, -1.0}) {
  return {{x, y, 0.0}, axis, axial, lateral, tension};
}

// A load of `force` (Fx, Fy, Fz) and couple `moment` acting at plan point (x, y) on the top
// of the cap, as an input file would give it.
inline PointLoad on_top(double x, double y, std::array<double, 3> force,
                        std::array<double, 3> moment = {0.0, 0.0, 0.0}) {
  PointLoad p;
  p.at = {x, y, kCapThickness};
  p.load = {force[0], force[1], force[2], moment[0], moment[1], moment[2]};
  return p;
}

// Load case "LC1" of the given loads.
inline LoadCase load_case(std::vector<PointLoad> loads) {
  LoadCase lc;
  lc.id = "LC1";
  lc.loads = std::move(loads);
  return lc;
}

// A project with the cap thickness above, one load case "LC1" of the given loads and one
// combination "C1" = 1.0 × LC1.
inline Project one_case_project(std::vector<PileType> types, std::vector<Pile> piles,
                                std::vector<PointLoad> loads) {
  Project project;
  project.cap.thickness = kCapThickness;
  project.pile_types = std::move(types);
  project.piles = std::move(piles);
  project.load_cases.push_back(load_case(std::move(loads)));
  Combination combination;
  combination.id = "C1";
  combination.factors = {{0, 1.0}};
  project.combinations.push_back(combination);
  return project;
}

// Solves the single combination of a project the way the program does; it must not overturn.
inline CapSolution solve_project(const Project& project) {
  const CapSolver solver(pile_springs(project));
  REQUIRE(unresisted_cases(project, solver).empty());
  const auto solutions = solve_combinations(project, solver);
  REQUIRE(solutions.size() == 1);
  REQUIRE_FALSE(solutions[0].overturns);
  return solutions[0];
}

// A round pile of the given diameter and length (m), head at the ground surface.
inline PileGeometry round_pile(double diameter, double length) {
  PileGeometry pile;
  pile.width = diameter;
  pile.round = true;
  pile.length = length;
  return pile;
}

// Whether `text` holds `part`; whether any of `lines` holds `part` (notes, problems).
inline bool contains(const std::string& text, const std::string& part) {
  return text.find(part) != std::string::npos;
}
inline bool contains(const std::vector<std::string>& lines, const std::string& part) {
  for (const auto& line : lines)
    if (contains(line, part)) return true;
  return false;
}

// How many times `what` occurs in `text` (elements of a drawing, rows of a report).
inline std::size_t occurrences(const std::string& text, const std::string& what) {
  std::size_t n = 0;
  for (auto at = text.find(what); at != std::string::npos; at = text.find(what, at + 1)) ++n;
  return n;
}

}  // namespace cairn::test
