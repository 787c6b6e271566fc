// quantity_format.hpp — the one place that decides how a quantity is printed: its unit label
// and its decimals in each unit system. Every output (text, Markdown, CSV, HTML, SVG labels)
// and every message that shows a computed value reads it from here.
//
// A value is converted from SI to the project's unit (units.hpp) and written with fixed
// decimals; a value that rounds to zero prints without a minus sign ("0.000", never
// "-0.000"). The decimals suit each quantity's size and the precision of its data:
//
//   shown as        SI              US               what
//   force           kN, 1           kip, 2           loads, pile forces, capacities
//   moment          kN·m, 1         kip·ft, 2        moments
//   length          m, 3            ft, 2            positions, plan dimensions, distances
//   depth           m, 2            ft, 1            depths, elevations, pile lengths in a soil profile
//   displacement    mm, 3           in, 3            cap movements, settlements
//   pressure        kPa, 1          ksf, 3           stresses, strengths, moduli
//   unit_weight     kN/m³, 2        pcf, 2           unit weights
//   subgrade        kN/m³, 0        pcf, 0           subgrade moduli (kN/m³ of the order of 10⁴)
//   stiffness       kN/m            kip/in           4 significant digits; no decimals from 10⁴
//   rotational_st.  kN·m/rad        kip·ft/rad       as stiffness
//   area            m², 4           ft², 4           plan and section areas (length squared)
//   angle           °, 1            °, 1             friction angles, directions
//   utilization     -, 3            -, 3             demand / capacity; "no capacity" when infinite
//   factor          -, 3            -, 3             η, K0, μs, reductions, weighted φ of a shaft
//   code_factor     -, 2            -, 2             factors read from a code table: φ, β1
//   bearing_factor  -, 2            -, 2             N*σ, N*c, Skempton Nc
//   index           -, 1            -, 1             Ir, Irr, N*q, widths
//   strain          -, 5            -, 5             volumetric strain Δ
#pragma once

#include <string>

#include "cairn/core/units.hpp"

namespace cairn {

// `value` with `decimals` fixed decimals; a value that rounds to zero prints without a minus
// sign ("0.000", never "-0.000"). Infinity and NaN print as "inf" and "nan".
// Requires: 0 <= decimals <= 12.
std::string fixed_text(double value, int decimals);

// `value` in %g style (shortest of fixed and scientific, 6 significant digits) without a
// minus sign on zero: factors as given in the file (FS 2.5, φ 0.45), command-line values.
std::string general_text(double value);

// What a printed number is; decides its unit and decimals (table above).
enum class Shown {
  force,
  moment,
  length,
  depth,
  displacement,
  pressure,
  unit_weight,
  subgrade,
  stiffness,
  rotational_stiffness,
  area,
  angle,
  utilization,
  factor,
  code_factor,
  bearing_factor,
  index,
  strain,
};

// The quantities of a project in its unit system.
class QuantityFormat {
 public:
  explicit QuantityFormat(UnitSystem system) : system_(system) {}
  UnitSystem system() const { return system_; }

  // The unit's label ("kN", "kip·ft", "ft²"); "" for a plain number, "°" for an angle.
  std::string label(Shown what) const;
  // The project unit's label of an input quantity (units.hpp).
  std::string label(Quantity what) const { return unit_label(system_, what); }
  // Fixed decimals of `what` (stiffnesses: -1, they print with significant digits).
  int decimals(Shown what) const;
  // The SI value in the project's unit; a round-off below 5e-7 of the unit is 0 (data outputs
  // such as JSON carry this number).
  double value(Shown what, double si) const;
  double value(Quantity what, double si) const;
  // The number as printed, without its unit ("1200.0").
  std::string number(Shown what, double si) const;
  // The number and its unit ("1200.0 kN"; an angle "30.0°"; a plain number alone).
  std::string text(Shown what, double si) const;

  // Shorthands of number() for the quantities most tables print.
  std::string force(double si) const { return number(Shown::force, si); }
  std::string moment(double si) const { return number(Shown::moment, si); }
  std::string length(double si) const { return number(Shown::length, si); }
  std::string depth(double si) const { return number(Shown::depth, si); }
  std::string small(double si) const { return number(Shown::displacement, si); }
  std::string pressure(double si) const { return number(Shown::pressure, si); }
  std::string stiffness(double si) const { return number(Shown::stiffness, si); }
  std::string area(double si) const { return number(Shown::area, si); }
  std::string area_label() const { return label(Shown::area); }

  // Dimensionless values, the same in both systems.
  static std::string utilization(double u);  // 3 decimals; "no capacity" when infinite
  static std::string factor(double v) { return plain(Shown::factor, v); }
  static std::string code_factor(double v) { return plain(Shown::code_factor, v); }
  static std::string bearing_factor(double v) { return plain(Shown::bearing_factor, v); }
  static std::string index(double v) { return plain(Shown::index, v); }
  static std::string strain(double v) { return plain(Shown::strain, v); }
  static std::string plain(Shown what, double v);  // a dimensionless `what` with its decimals
  static std::string fixed(double v, int decimals) { return fixed_text(v, decimals); }

 private:
  UnitSystem system_;
};

}  // namespace cairn
