// stiffness.hpp — pile-head springs per pile type: typed in, or estimated from the soil.
//
// Axial (kN/m): the value given; else, with a soil profile, the secant k = Q/s of Vesić's
// (1977) single-pile settlement (elastic shortening + tip + shaft terms, group.hpp) at the
// allowable load, the load split between tip and shaft by their computed ultimate values;
// else E·A/L, the elastic shortening of the whole pile.
// Lateral (kN/m): the value given; else, with a soil profile, Hetényi's (1946) beam on an
// elastic foundation (lateral.hpp) with the horizontal subgrade modulus kh of the layer at
// the pile head: the layer's `subgrade_modulus`, else Vesić's (1961) correlation
//     k = 0.65·(Es·D⁴/(Ep·Ip))^(1/12)·Es/(1 − μs²),  kh = k/D
// when the layer gives Es, else for clay Davisson's (1970) kh ≈ 67·cu/D (from memory);
// else 0 (axial-only pile, the classical assumption). Fixed heads: k/λ and a head moment
// M = V/(2λ) per unit of head shear; pinned heads: k/(2λ). Fixed and partially fixed heads
// also get the coupling and rotational terms of pile_head.hpp (Hetényi's k_hm, k_mm,
// condensed with the restraint `head_restraint`); a lateral stiffness given for such a head
// is read as the fixed-head k_hh = 4EIλ³ of a long pile on Hetényi's foundation, which fixes
// λ and so k_hm = −2EIλ² and k_mm = 2EIλ (needs elastic_modulus).
// A layer at the pile head that gives `modulus_gradient` nh (Es = nh·z, z from the pile head)
// takes Matlock & Reese's (1960) long-pile terms instead (L ≥ 5T, T = (EI/nh)^(1/5)); a
// shorter pile, and the moment along any such pile, come from the finite-difference beam of
// beam_column.hpp on linear springs nh·z.
// Each value carries its source in plain words for the output.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "cairn/solver/cap_solver.hpp"
#include "cairn/geotechnics/group.hpp"
#include "cairn/geotechnics/lateral.hpp"
#include "cairn/geotechnics/project_capacity.hpp"
#include "cairn/core/model.hpp"

namespace cairn {

struct PileTypeStiffness {
  double axial = 0.0;    // kN/m
  double lateral = 0.0;  // kN/m
  std::string axial_source, lateral_source;
  HeadFixity head = HeadFixity::pinned;
  double head_moment_per_shear = 0.0;  // m; fixed heads only (0 for pinned)
  // Fixed and partially fixed heads: the coupling, rotational and torsional terms the cap
  // sees (pile_head.hpp), and the elastic pile they come from, for the moment along it.
  // Pinned heads: zero terms and no pile (the two springs alone, as always).
  HeadBending bending;
  std::optional<MomentInfluence> influence;
};

// Springs of every pile type (indexed like Project::pile_types). `capacities` are the
// computed capacities (for the tip/shaft split of the axial secant); may be empty.
std::vector<PileTypeStiffness> pile_type_stiffness(const Project& project,
                                                   const std::vector<PileTypeCapacity>& capacities);

// Springs of every pile, in the order of Project::piles.
std::vector<PileSpring> pile_springs(const Project& project,
                                     const std::vector<PileTypeStiffness>& stiffness);

// The pile of type `t` as Vesić's (1977) settlement method sees it: Es along the shaft (the
// thickness-weighted mean over the layers crossed), Es and μs at the tip as thickness-weighted
// means over the tip's zone of influence, 1.5·D above and below the tip (the LCPC method's
// zone, Bustamante & Gianeselli 1982, from memory; μs 0.3 where a layer gives none, common
// practice), so the spring and settlement change smoothly as the tip passes a boundary. Absent when data is missing; each missing item is
// then added to `missing` in plain words ("layer 'sand' needs soil_modulus").
// Requires a soil profile.
std::optional<VesicPile> vesic_pile(const Project& project, std::size_t t,
                                    std::vector<std::string>* missing = nullptr);

// Second moment of area of a pile section about a centroidal axis, m⁴
// (square w⁴/12, round πD⁴/64).
double section_inertia(const Section& section);

}  // namespace cairn
