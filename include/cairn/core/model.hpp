// model.hpp — the plain data cairn works on: one pile cap, its piles and pile types,
// its load cases and combinations, as read from a project file.
//
// Every value is held in SI units inside: kN, m, kPa, kN/m³, kN/m, kN·m, angles in degrees
// only where the field name says so. Conversion from the project's units happens once, in
// the section readers of src/input/ (sections.hpp); conversion back happens once, in
// report.cpp.
//
// Axes: x and y in plan, z up. Pile heads lie at z = 0 (underside of the cap); the top of
// the cap is at z = thickness. Loads act on the cap in global axes; moments follow the
// right-hand rule. A downward column load is a negative Fz.
#pragma once

#include <array>
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "cairn/core/defaults.hpp"
#include "cairn/geotechnics/soil.hpp"
#include "cairn/core/units.hpp"

namespace cairn {

// Where a value came from in the user's files; line and column are 1-based, 0 = unknown.
struct SourceLocation {
  std::string file;
  int line = 0;
  int column = 0;
};

enum class SectionShape { square, round };

struct Section {
  SectionShape shape = SectionShape::square;
  double width = 0.0;  // m: side of a square, diameter of a round section
  double area() const;       // m²
  double perimeter() const;  // m
};

// Limit state a combination belongs to; capacities are compared on the matching basis only:
// service → allowable; strength and seismic overstrength (loads amplified by Ω0) → factored.
enum class LimitState { service, strength, seismic_overstrength };

// What a capacity number means.
//   allowable: ultimate already divided by a factor of safety (service checks)
//   factored:  φ·R, the factored resistance (strength checks)
//   ultimate:  unfactored; cairn applies the factor of safety or resistance factor
enum class CapacityBasis { allowable, factored, ultimate };

// One set of capacities for a pile, all on one basis. Values in kN, positive.
struct CapacitySet {
  CapacityBasis basis = CapacityBasis::allowable;
  std::optional<double> compression;
  std::optional<double> tension;
  std::optional<double> lateral;
  // For basis ultimate only: factors of safety (service) and resistance factors φ (strength).
  std::optional<double> factor_of_safety;           // compression and lateral
  std::optional<double> factor_of_safety_tension;
  std::optional<double> resistance_factor;          // compression and lateral
  std::optional<double> resistance_factor_tension;
  SourceLocation where;
};

// The pile section's material, for its structural capacity (service: factor × Po;
// strength: φ × Po, with Po = 0.85·f'c·(Ag − As) + fy·As, ACI 318-19 eq. 22.4.2.2, or
// fy·A for a steel section), and its yield moment for Broms' long piles and the combined
// axial + head moment check of fixed heads.
struct Structure {
  std::optional<double> concrete_strength;  // f'c, kPa
  std::optional<double> steel_yield;        // fy, kPa
  std::optional<double> steel_area;         // As, m² (steel section: defaults to the gross area)
  std::optional<double> yield_moment;       // My, kN·m; absent: from the section (section_moment.hpp)
  std::optional<double> wall_thickness;     // t, m: a steel pipe (round) or hollow square
  std::optional<int> bar_count;             // reinforced concrete: number of longitudinal bars
  std::optional<double> cover_to_bar_center;  // m, from the face to the bar centres
  std::optional<double> bending_strength;   // Fb, kPa: timber
  std::optional<double> allowable_factor;   // service: P_allow = factor·Po, M_allow = factor·My
  std::optional<double> resistance_factor;  // strength: φ·Po, φ·My
  SourceLocation where;
};

// How a pile head is connected to the cap, for its lateral stiffness and head moment:
// pinned (free to rotate), fixed (turns with the cap), partial (held by the rotational
// restraint `head_restraint`, kN·m/rad).
enum class HeadFixity { pinned, fixed, partial };

struct PileType {
  std::string id;
  SourceLocation where;
  Section section;
  double length = 0.0;           // m, pile head to tip along the axis
  double elastic_modulus = 0.0;  // kPa, pile material
  std::optional<double> axial_stiffness;    // kN/m as given; default E·A/L
  std::optional<double> lateral_stiffness;  // kN/m as given; default 0 (axial-only pile)
  bool tension = true;                      // false: compression only
  HeadFixity head = HeadFixity::pinned;     // for the lateral, coupling and rotational terms
  std::optional<double> head_restraint;     // k_r, kN·m/rad: head partial only
  std::optional<double> torsional_stiffness;  // kN·m/rad about the axis: fixed/partial heads
  std::vector<CapacitySet> capacities;      // as given by the geotechnical engineer
  PileDesign design;                        // installation and methods for soil-based capacity
  std::optional<Structure> structure;       // material strength, for the structural check

  // The section's material for the pile's stiffness: with structure.wall_thickness (below half
  // the width) the wall of a pipe or hollow square, else the solid section. Round:
  // A = π/4·(D² − d²), I = π/64·(D⁴ − d⁴); square: A = b² − b_i², I = (b⁴ − b_i⁴)/12, with
  // d = D − 2t and b_i = b − 2t (the gross section stays the one of capacity: a plugged tip).
  double material_area() const;     // m²
  double material_inertia() const;  // m⁴, about a centroidal axis (the same for both axes)

  // Stiffness without soil: the value given, else E·A/L (axial, A the material area) and 0
  // (lateral).
  double axial_stiffness_used() const;    // kN/m
  double lateral_stiffness_used() const;  // kN/m
};

// Batter: 1 horizontal in `ratio` vertical, the toe displaced toward the plan direction
// `toward_deg` (degrees from +x, counter-clockwise).
struct Batter {
  double ratio = 0.0;
  double toward_deg = 0.0;
};

struct Pile {
  std::string id;
  SourceLocation where;
  double x = 0.0;  // m, head position in plan
  double y = 0.0;  // m
  std::size_t type = 0;  // index into Project::pile_types
  std::optional<Batter> batter;

  // Unit vector along the pile axis, from head toward toe (pointing down).
  std::array<double, 3> axis() const;
};

struct Outline {
  bool rectangle = true;  // given as {width, length, center}; otherwise a polygon
  std::vector<std::array<double, 2>> polygon;  // m, corners counter-clockwise
  double area() const;                          // m²
  std::array<double, 2> centroid() const;       // m
  bool contains(double x, double y) const;
  // Shortest distance from a point inside the outline to its edge, m.
  double distance_to_edge(double x, double y) const;
};

struct SelfWeight {
  double unit_weight = 0.0;  // kN/m³
  std::string load_case;
  SourceLocation where;
};

struct Cap {
  double thickness = 0.0;  // m
  std::optional<Outline> outline;
  std::optional<SelfWeight> self_weight;
  double depth = 0.0;  // m, depth of the pile heads below the ground surface
};

// Components of a force and moment: Fx, Fy, Fz (kN), Mx, My, Mz (kN·m).
using Wrench = std::array<double, 6>;
inline constexpr std::array<const char*, 6> kWrenchNames = {"Fx", "Fy", "Fz", "Mx", "My", "Mz"};

struct PointLoad {
  SourceLocation where;
  std::array<double, 3> at{};  // m; z defaults to the top of the cap
  Wrench load{};               // forces and moments acting on the cap
  std::string note;            // e.g. "cap self-weight", or a column id
  bool on_top = false;         // z not given: on the top of the cap (moves with its thickness)
};

// A column meeting the cap, for loads imported from the structural model.
struct Column {
  std::string id;
  SourceLocation where;
  std::array<double, 3> at{};  // m; z defaults to the top of the cap
  std::string support;         // support name in the imported reactions
  bool on_top = false;         // z not given: on the top of the cap
};

// wearing_surface (AASHTO DW), vertical_earth (AASHTO EV) and collision (AASHTO CT/CV) are
// for the AASHTO generator; ASCE 7 and EN 1990 take the first two as dead load.
enum class LoadKind {
  dead, live, roof_live, snow, rain, wind, seismic, earth, fluid, temperature, other,
  wearing_surface, vertical_earth, collision
};

struct LoadCase {
  std::string id;
  SourceLocation where;
  LoadKind kind = LoadKind::other;
  std::string direction;  // wind/seismic: cases sharing a direction act together
  std::vector<PointLoad> loads;
};

// The resistances a combination is compared with. `basis`: the limit state's own basis
// (allowable for service, factored for strength). The others belong to code-generated
// combinations (code_resistance.hpp): EN 1997-1 resistance sets R1–R4 (Annex A, Tables
// A.6–A.8), and AASHTO LRFD's extreme-event resistance factors (§10.5.5.3.3).
enum class ResistanceSet { basis, en1997_r1, en1997_r2, en1997_r3, en1997_r4, aashto_extreme };

// Pile kinds of EN 1997-1 Annex A (Tables A.6 driven, A.7 bored, A.8 continuous flight auger).
enum class En1997PileKind { driven, bored, cfa };

// How EN 1997-1 design resistances are obtained (`combinations.generate` keys; defaults in
// code_resistance.hpp, every one printed as an assumption).
struct En1997Settings {
  std::optional<En1997PileKind> pile_kind;  // all pile types; default: from each installation
  std::optional<int> test_profiles;         // n of Table A.10: ξ3/ξ4 apply when given
  bool rigid_cap = false;                   // ξ ÷ 1.1, EN 1997-1 §7.6.2.3(7)
  std::optional<double> model_factor;       // γRd on resistances computed from the soil
};

struct Combination {
  std::string id;
  SourceLocation where;
  LimitState limit_state = LimitState::service;
  ResistanceSet resistance_set = ResistanceSet::basis;
  std::vector<std::pair<std::size_t, double>> factors;  // (load case index, factor)
  std::string generator;  // the code generator that built it ("asce7-asd"), or empty
};

// Group checks asked for in the file (`group:`). Defaults are common practice (docs).
struct GroupSettings {
  std::string efficiency = "none";    // method applied to the group capacity
  bool efficiency_shaft_only = false;  // apply η to the shaft component only
  double min_spacing_factor = kMinSpacingFactor;  // minimum c/c spacing, in pile widths
  double min_spacing = 0.0;            // m, absolute minimum c/c spacing
  double min_edge_distance = 0.225;    // m, pile face to cap edge (AASHTO 10.7.1.2)
  bool settlement = false;             // settlement asked for
  std::optional<double> settlement_limit;  // m; default kDefaultSettlementLimit (defaults.hpp)
  std::optional<double> tip_share;     // share of the working load carried by the tip
  SourceLocation where;
};

// Something in the input that is valid but probably not what the engineer meant (a load
// case no combination uses). Carried to stderr and to the notes of every output; never
// changes the exit status.
struct Warning {
  SourceLocation where;
  std::string message;  // "<key path>: <what was found>; <its consequence>"
};

// The calculation package's sign-off block and choices (`package:` in the project file):
// revision, date, prepared by and checked by as the engineer writes them, and the
// combinations always printed in full however many there are.
struct PackageSettings {
  std::string revision, date, prepared_by, checked_by;
  std::vector<std::string> show_combinations;  // combination ids
  SourceLocation where;
};

// How the piles' soil is modelled in `check` (`analysis:` in the project file; docs/user-guide.md):
// linear springs (the default), or nonlinear p-y, t-z and Q-z curves with each combination solved
// on its own (solver/nonlinear_cap.hpp).
enum class SoilResponse { linear, nonlinear };
// Group action on the p-y curves in a nonlinear run (geotechnics/p_multipliers.hpp): rows by
// the direction of each combination's horizontal resultant, by both directions of it (loads
// that reverse: the smaller multiplier), or none (every multiplier 1).
enum class GroupMultipliers { by_direction, reversing, none };
// The p-y curves' loading in a nonlinear run: the published static curves, or their cyclic
// forms (the resistance left after repeated loading).
enum class LateralLoading { static_load, cyclic };

struct AnalysisSettings {
  SoilResponse soil_response = SoilResponse::linear;
  GroupMultipliers p_multipliers = GroupMultipliers::by_direction;
  std::string pushover;               // combination pushed; empty: the governing one
  double pushover_limit = 5.0;        // the largest load factor λ of the pushover
  std::optional<double> pushover_displacement;  // m, the cap's movement that ends it
  LateralLoading lateral_loading = LateralLoading::static_load;
  std::optional<double> load_cycles;  // N, for the cyclic curves that count cycles
  SourceLocation where;
};

struct Project {
  std::string file;  // path of the project file as given
  std::string title;
  UnitSystem units = UnitSystem::SI;
  Cap cap;
  std::optional<SoilProfile> soil;
  std::vector<PileType> pile_types;
  std::vector<Pile> piles;
  std::vector<Column> columns;
  std::vector<LoadCase> load_cases;
  std::vector<Combination> combinations;
  std::string loads_file;  // reactions CSV the loads came from, if any
  GroupSettings group;
  std::vector<std::string> notes;  // choices made while reading (e.g. by a combination generator)
  En1997Settings en1997;           // used by combinations with an EN 1997 resistance set
  std::vector<Warning> warnings;   // cautions found while reading, in the order found
  // Every YAML file read: the project file first, then its includes (paths as opened);
  // the reactions CSV is loads_file.
  std::vector<std::string> input_files;
  PackageSettings package;
  AnalysisSettings analysis;
};

const char* to_string(LimitState);
const char* to_string(CapacityBasis);
const char* to_string(LoadKind);
const char* to_string(ResistanceSet);
const char* to_string(En1997PileKind);
const char* to_string(SectionShape);
const char* to_string(SoilResponse);
const char* to_string(GroupMultipliers);
const char* to_string(LateralLoading);

// Sum of all loads in a case as forces and moments about `point`: M = Σ (at − point) × F + M,
// each lever arm the difference of input coordinates (no digits lost far from the origin).
Wrench resultant_about(const LoadCase& load_case, const std::array<double, 3>& point);

// Sum of all loads in a case, as a wrench about the global origin (0, 0, 0).
Wrench resultant_about_origin(const LoadCase& load_case);

}  // namespace cairn
