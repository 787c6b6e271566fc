// cap_solver.hpp — the rigid-cap equilibrium of a pile group.
//
// The cap is a rigid body with six degrees of freedom (translations ux, uy, uz and rotations
// rx, ry, rz about the global origin). Each pile head, at its true position and along its
// true axis (batter included), is a pair of linear springs: an axial spring k_a along the
// unit axis a (pointing from head to toe) and a lateral spring k_l across it (pinned head).
// A pile head at p moves u = t + r × p; its force on the cap is
//     R = −[k_a·a·aᵀ + k_l·(I − a·aᵀ)]·u
// and the cap stiffness is the sum of Tᵀ·K_pile·T with T = [I | −[p]×]. Solving K·U = F for
// the applied force and moment F (about the origin) gives U, then each pile's
//     axial force  N = k_a·(a·u)   (compression positive: the cap pushes the pile along a)
//     lateral shear V = k_l·|u − (a·u)·a|.
// This is the classical rigid-cap analysis of pile groups with battered piles (Hrennikoff
// 1949; Saul 1968); for vertical piles of equal stiffness it reduces to
//     P_i = P/n ± M_y·x_i/Σx² ± M_x·y_i/Σy² (with the product term for unsymmetric groups).
//
// Piles that take no tension are handled by an active set: piles in tension drop out (their
// axial spring is removed; the lateral spring stays, since the soil still holds the pile
// across its axis), the cap is solved again, and dropped piles that would close again come
// back, until the set settles. When the remaining piles cannot hold the load the combination overturns.
//
// Units: kN, m, kN·m, kN/m, radians.
#pragma once

#include <array>
#include <cstddef>
#include <memory>
#include <string>
#include <vector>

#include "cairn/model.hpp"

namespace cairn {

struct PileSpring {
  std::array<double, 3> head{};  // m
  std::array<double, 3> axis{};  // unit vector, head → toe
  double axial = 0.0;            // kN/m
  double lateral = 0.0;          // kN/m
  bool tension = true;           // false: compression only
};

// Springs of every pile of the project, in the order of Project::piles.
std::vector<PileSpring> pile_springs(const Project& project);

struct PileForce {
  double axial = 0.0;    // kN, compression positive
  double lateral = 0.0;  // kN, resultant shear across the pile axis
  bool active = true;    // false: dropped out (would be in tension, takes none); its
                         // lateral spring still acts
};

struct CapMovement {
  std::array<double, 3> translation{};  // m
  std::array<double, 3> rotation{};     // rad, about the global axes through the origin
};

struct CapSolution {
  CapMovement movement;
  std::vector<PileForce> piles;
  bool overturns = false;  // no equilibrium with the compression-only piles left
  std::string failure;     // plain words, when overturns
  std::vector<std::size_t> dropped;  // piles that dropped out (indices)
  int iterations = 0;                // solves of the active-set loop (1 = linear)
  double residual = 0.0;             // |Σ pile forces + load| / |load|, scaled
};

// A load component the piles cannot resist at all.
struct UnresistedLoad {
  std::string component;  // "Fx", …, "Mz"
  std::string reason;     // e.g. "no battered piles and no lateral stiffness"
};

// Rigid-cap solver for one set of pile springs. Construction assembles and decomposes the
// stiffness of the full group once; each solve is then cheap.
class CapSolver {
 public:
  explicit CapSolver(std::vector<PileSpring> springs);
  ~CapSolver();
  CapSolver(CapSolver&&) noexcept;
  CapSolver& operator=(CapSolver&&) noexcept;

  // Components of `load` that act along a direction with no stiffness (empty when none).
  std::vector<UnresistedLoad> unresisted(const Wrench& load) const;

  // Linear solution with every pile active (tension allowed in all). Requires
  // unresisted(load) to be empty.
  CapSolution solve_linear(const Wrench& load) const;

  // Solution honouring compression-only piles (the active-set iteration). A load that the
  // remaining piles cannot hold gives a solution with `overturns` set.
  CapSolution solve(const Wrench& load) const;

  // Superposes linear solutions: Σ factor_i·solution_i (movements and pile forces).
  CapSolution superpose(const std::vector<std::pair<const CapSolution*, double>>& parts,
                        const Wrench& load) const;

  // True when some compression-only pile is in tension in `solution`.
  bool needs_redistribution(const CapSolution& solution) const;

  const std::vector<PileSpring>& springs() const { return springs_; }

 private:
  struct Impl;
  std::vector<PileSpring> springs_;
  std::unique_ptr<Impl> impl_;
};

// Load cases that push along a direction nothing resists, as messages located at the load
// case ("load case 'W': Fx cannot be resisted: no battered piles and no lateral stiffness").
struct UnresistedCase {
  std::size_t load_case = 0;
  UnresistedLoad load;
};
std::vector<UnresistedCase> unresisted_cases(const Project& project, const CapSolver& solver);

// Solves every combination of the project: each load case once, superposed by the factors;
// a combination in which a compression-only pile would be in tension is solved again on its
// own with the active-set iteration. Requires unresisted_cases() to be empty.
// Throws std::logic_error when equilibrium is missed by more than 1e-6 of the load.
std::vector<CapSolution> solve_combinations(const Project& project, const CapSolver& solver);

// Total load of a combination as a wrench about the origin.
Wrench combination_load(const Project& project, const Combination& combination);

}  // namespace cairn
