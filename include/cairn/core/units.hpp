// units.hpp — the two unit systems of a project and the conversion of numbers written
// with a unit ("45 ft", "120 pcf", "300 kip", "2.5 tonf").
//
// Inside, cairn computes in SI: kN, m, kPa, kN/m³, kN/m, kN·m. A plain number in a project
// file is in the project's units (the defaults below); a number written as a string with a
// unit is converted from that unit. Units are parsed from factors of force and length
// (N, kN, MN, lb, lbf, kip, tonf, tf; mm, cm, m, in, ft) joined by '·', '*', '-' or '/',
// with exponents written 2, 3, ^2, ^3, ², ³; plus named pressures and unit weights
// (Pa, kPa, MPa, GPa, psf, ksf, psi, ksi, tsf, pcf, kcf).
//
// Conversion factors are exact definitions: 1 ft = 0.3048 m (international foot),
// 1 lbf = 4.4482216152605 N (NIST SP 811, Appendix B), 1 short ton-force = 2000 lbf,
// 1 metric tonne-force = 9.80665 kN.
#pragma once

#include <optional>
#include <string>

namespace cairn {

enum class UnitSystem { SI, US };

// One unit in SI, each defined once here and used everywhere (NIST SP 811 (2008),
// Appendix B; the international foot and the avoirdupois pound are exact definitions).
namespace unit_si {
inline constexpr double foot = 0.3048;                       // m, exact
inline constexpr double inch = 0.0254;                       // m, exact (foot / 12)
inline constexpr double pound_force = 4.4482216152605e-3;    // kN, exact (0.45359237 kg × 9.80665 m/s²)
inline constexpr double kip = 1000.0 * pound_force;          // kN
inline constexpr double short_ton_force = 2000.0 * pound_force;  // kN (US ton, 2000 lbf)
inline constexpr double tonne_force = 9.80665;               // kN (metric tonne-force), exact
inline constexpr double ton_per_square_foot = short_ton_force / (foot * foot);  // kPa (tsf)
}  // namespace unit_si

// What a number measures; decides the default unit and which written units are accepted.
enum class Quantity {
  length,               // SI m; US ft
  small_length,         // SI mm; US in (settlements, displacements)
  force,                // SI kN; US kip
  moment,               // SI kN·m; US kip·ft
  pressure,             // SI kPa; US ksf (stresses, moduli, strengths)
  unit_weight,          // SI kN/m³; US pcf
  stiffness,            // SI kN/m; US kip/in
  rotational_stiffness, // SI kN·m/rad; US kip·ft/rad
  area,                 // SI m²; US in² (section and reinforcement areas)
  angle,                // degrees in both systems
  number,               // no unit
};

// Factor from the project's default unit of `quantity` to SI: si = value · factor.
double to_si_factor(UnitSystem system, Quantity quantity);

// Label of the project's default unit, e.g. "kN", "kip·ft".
const char* unit_label(UnitSystem system, Quantity quantity);

const char* to_string(UnitSystem system);

// Converts an SI value to the project's default unit of `quantity`.
inline double from_si(UnitSystem system, Quantity quantity, double si) {
  return si / to_si_factor(system, quantity);
}

struct ParsedQuantity {
  std::optional<double> si;  // value in SI, when parsing succeeded
  std::string error;         // otherwise what went wrong, in plain words
};

// The largest magnitude, in SI, that a value of `quantity` may have in a project: far
// beyond any foundation (1e7 m, 1e12 kN, 1e15 kN·m, 1e9 kPa, …; docs/input.md, "Limits"),
// and small enough that products of such values stay finite in double precision.
double largest_plausible(Quantity quantity);

// The smallest SI value a quantity that must be positive may have (1 mm for a length, 1 Pa
// for a pressure, 1e-6 for a plain number, …): a pile 1e-30 m long is a typo, and its
// stiffness E·A/L would overflow.
double smallest_plausible(Quantity quantity);

// Parses "<number> <unit>" (or a bare number, taken in the project's default unit) as a
// `quantity` and returns the value in SI. Errors: not a number, unknown unit, unit of the
// wrong kind ("expected a length, got a force unit 'kip'"), a value larger in magnitude
// than largest_plausible(), before or after conversion ("1e308 kip").
ParsedQuantity parse_quantity(const std::string& text, Quantity quantity, UnitSystem system);

// Plain name of a quantity for messages: "a length in m".
std::string describe(Quantity quantity, UnitSystem system);

// Standard atmospheric pressure, kPa: the reference pressure pa of the capacity correlations.
inline constexpr double kAtmosphericPressure = 101.325;
// Unit weight of water, kN/m³ (62.4 pcf).
inline constexpr double kWaterUnitWeight = 9.81;

}  // namespace cairn
