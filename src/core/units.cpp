#include "cairn/core/units.hpp"

#include <cctype>
#include <charconv>
#include <cmath>
#include <stdexcept>
#include <string_view>

#include <fmt/format.h>

namespace cairn {
namespace {

// The units in SI (units.hpp).
constexpr double kFoot = unit_si::foot;                   // m
constexpr double kInch = unit_si::inch;                   // m
constexpr double kPoundForce = unit_si::pound_force;      // kN
constexpr double kKip = unit_si::kip;                     // kN
constexpr double kShortTonForce = unit_si::short_ton_force;  // kN (US ton, 2000 lbf)
constexpr double kTonneForce = unit_si::tonne_force;      // kN (metric tonne-force)

// A unit as powers of force and length with a factor to kN and m.
struct Dim {
  int force = 0;
  int length = 0;
  double factor = 1.0;
};

Dim expected_dim(Quantity quantity) {
  switch (quantity) {
    case Quantity::length:
    case Quantity::small_length: return {0, 1};
    case Quantity::force: return {1, 0};
    case Quantity::moment:
    case Quantity::rotational_stiffness: return {1, 1};
    case Quantity::pressure: return {1, -2};
    case Quantity::area: return {0, 2};
    case Quantity::unit_weight: return {1, -3};
    case Quantity::stiffness: return {1, -1};
    case Quantity::angle:
    case Quantity::number: return {0, 0};
  }
  return {};
}

// Base factors of force and length and named compound units.
std::optional<Dim> base_unit(std::string_view name) {
  struct Entry {
    std::string_view name;
    Dim dim;
  };
  static constexpr Entry kTable[] = {
      {"N", {1, 0, 1e-3}},        {"kN", {1, 0, 1.0}},         {"MN", {1, 0, 1e3}},
      {"lb", {1, 0, kPoundForce}}, {"lbf", {1, 0, kPoundForce}}, {"kip", {1, 0, kKip}},
      {"kips", {1, 0, kKip}},     {"k", {1, 0, kKip}},          {"tonf", {1, 0, kShortTonForce}},
      {"tf", {1, 0, kTonneForce}}, {"mm", {0, 1, 1e-3}},        {"cm", {0, 1, 1e-2}},
      {"m", {0, 1, 1.0}},         {"in", {0, 1, kInch}},        {"ft", {0, 1, kFoot}},
      {"Pa", {1, -2, 1e-3}},      {"kPa", {1, -2, 1.0}},       {"MPa", {1, -2, 1e3}},
      {"GPa", {1, -2, 1e6}},      {"psf", {1, -2, kPoundForce / (kFoot * kFoot)}},
      {"ksf", {1, -2, kKip / (kFoot * kFoot)}}, {"psi", {1, -2, kPoundForce / (kInch * kInch)}},
      {"ksi", {1, -2, kKip / (kInch * kInch)}},
      {"tsf", {1, -2, kShortTonForce / (kFoot * kFoot)}},
      {"pcf", {1, -3, kPoundForce / (kFoot * kFoot * kFoot)}},
      {"kcf", {1, -3, kKip / (kFoot * kFoot * kFoot)}},
      // The radian is dimensionless, so "kN·m/rad" (the label of a rotational stiffness)
      // reads as kN·m.
      {"rad", {0, 0, 1.0}},
  };
  for (const auto& entry : kTable)
    if (entry.name == name) return entry.dim;
  return std::nullopt;
}

// Parses a unit such as "kN·m", "kip-ft", "kN/m3", "lb/ft^3", "kN/m²". Returns nullopt and
// sets `bad` to the offending piece when a factor is unknown.
std::optional<Dim> parse_unit(std::string_view text, std::string& bad) {
  Dim total;
  int sign = 1;
  std::size_t i = 0;
  while (i < text.size()) {
    // Separators: '·' (UTF-8 C2 B7), '*', '-', '.', ' ' multiply; '/' divides the rest.
    if (text[i] == '/') {
      sign = -1;
      ++i;
      continue;
    }
    if (text[i] == '*' || text[i] == '-' || text[i] == ' ' || text[i] == '.') {
      ++i;
      continue;
    }
    if (static_cast<unsigned char>(text[i]) == 0xC2 && i + 1 < text.size() &&
        static_cast<unsigned char>(text[i + 1]) == 0xB7) {
      i += 2;
      continue;
    }
    std::size_t start = i;
    while (i < text.size() && std::isalpha(static_cast<unsigned char>(text[i]))) ++i;
    if (start == i) {
      bad = std::string(text.substr(start));
      return std::nullopt;
    }
    std::string_view name = text.substr(start, i - start);
    int power = 1;
    if (i < text.size() && text[i] == '^') ++i;
    if (i < text.size() && (text[i] == '2' || text[i] == '3')) {
      power = text[i] - '0';
      ++i;
    } else if (i + 1 < text.size() && static_cast<unsigned char>(text[i]) == 0xC2 &&
               (static_cast<unsigned char>(text[i + 1]) == 0xB2 ||
                static_cast<unsigned char>(text[i + 1]) == 0xB3)) {
      power = static_cast<unsigned char>(text[i + 1]) == 0xB2 ? 2 : 3;
      i += 2;
    }
    auto dim = base_unit(name);
    if (!dim) {
      bad = std::string(name);
      return std::nullopt;
    }
    total.force += sign * power * dim->force;
    total.length += sign * power * dim->length;
    total.factor *= std::pow(dim->factor, sign * power);
  }
  return total;
}

std::string_view trim(std::string_view s) {
  while (!s.empty() && std::isspace(static_cast<unsigned char>(s.front()))) s.remove_prefix(1);
  while (!s.empty() && std::isspace(static_cast<unsigned char>(s.back()))) s.remove_suffix(1);
  return s;
}

// The kind of a unit with its article, for "got a force unit 'kip'".
const char* kind_name(int force, int length) {
  if (force == 0 && length == 0) return "a dimensionless";
  if (force == 0 && length == 1) return "a length";
  if (force == 0 && length == 2) return "an area";
  if (force == 0 && length == 3) return "a volume";
  if (force == 1 && length == 0) return "a force";
  if (force == 1 && length == 1) return "a moment";
  if (force == 1 && length == -2) return "a pressure";
  if (force == 1 && length == -3) return "a unit weight";
  if (force == 1 && length == -1) return "a stiffness";
  return "an unrelated";
}

}  // namespace

double largest_plausible(Quantity quantity) {
  switch (quantity) {
    case Quantity::length:
    case Quantity::small_length: return 1e7;  // m: survey grid coordinates (UTM northings < 1e7 m)
    case Quantity::force: return 1e12;        // kN
    case Quantity::moment: return 1e15;       // kN·m: the largest force at 1 km
    case Quantity::pressure: return 1e9;      // kPa: 5000 × the modulus of steel
    case Quantity::unit_weight: return 1e9;   // kN/m³ (also subgrade moduli)
    case Quantity::stiffness: return 1e15;    // kN/m
    case Quantity::rotational_stiffness: return 1e18;  // kN·m/rad
    case Quantity::area: return 1e6;          // m²
    case Quantity::angle: return 3600.0;      // degrees: ten turns
    case Quantity::number: return 1e9;        // factors, ratios, counts
  }
  return 0.0;
}

double smallest_plausible(Quantity quantity) {
  switch (quantity) {
    case Quantity::length: return 1e-3;                // m: 1 mm
    case Quantity::small_length: return 1e-6;          // m: 1 µm
    case Quantity::force: return 1e-6;                 // kN: 1 mN
    case Quantity::moment: return 1e-6;                // kN·m
    case Quantity::pressure: return 1e-3;              // kPa: 1 Pa
    case Quantity::unit_weight: return 1e-3;           // kN/m³
    case Quantity::stiffness: return 1e-3;             // kN/m
    case Quantity::rotational_stiffness: return 1e-3;  // kN·m/rad
    case Quantity::area: return 1e-8;                  // m²: 0.01 mm²
    case Quantity::angle: return 1e-3;                 // degrees
    case Quantity::number: return 1e-6;
  }
  return 0.0;
}

double to_si_factor(UnitSystem system, Quantity quantity) {
  if (system == UnitSystem::SI) {
    return quantity == Quantity::small_length ? 1e-3 : 1.0;
  }
  switch (quantity) {
    case Quantity::length: return kFoot;
    case Quantity::small_length: return kInch;
    case Quantity::force: return kKip;
    case Quantity::moment:
    case Quantity::rotational_stiffness: return kKip * kFoot;
    case Quantity::pressure: return kKip / (kFoot * kFoot);
    case Quantity::unit_weight: return kPoundForce / (kFoot * kFoot * kFoot);
    case Quantity::area: return kInch * kInch;
    case Quantity::stiffness: return kKip / kInch;
    case Quantity::angle:
    case Quantity::number: return 1.0;
  }
  return 1.0;
}

const char* unit_label(UnitSystem system, Quantity quantity) {
  const bool si = system == UnitSystem::SI;
  switch (quantity) {
    case Quantity::length: return si ? "m" : "ft";
    case Quantity::small_length: return si ? "mm" : "in";
    case Quantity::force: return si ? "kN" : "kip";
    case Quantity::moment: return si ? "kN·m" : "kip·ft";
    case Quantity::pressure: return si ? "kPa" : "ksf";
    case Quantity::unit_weight: return si ? "kN/m³" : "pcf";
    case Quantity::area: return si ? "m²" : "in²";
    case Quantity::stiffness: return si ? "kN/m" : "kip/in";
    case Quantity::rotational_stiffness: return si ? "kN·m/rad" : "kip·ft/rad";
    case Quantity::angle: return "°";
    case Quantity::number: return "";
  }
  return "";
}

const char* to_string(UnitSystem system) { return system == UnitSystem::SI ? "SI" : "US"; }

std::string describe(Quantity quantity, UnitSystem system) {
  const char* what = nullptr;  // followed by " in " and the unit
  switch (quantity) {
    case Quantity::length:
    case Quantity::small_length: what = "a length"; break;
    case Quantity::force: what = "a force"; break;
    case Quantity::moment: what = "a moment"; break;
    case Quantity::pressure: what = "a pressure or modulus"; break;
    case Quantity::unit_weight: what = "a unit weight"; break;
    case Quantity::area: what = "an area"; break;
    case Quantity::stiffness: what = "a stiffness"; break;
    case Quantity::rotational_stiffness: what = "a rotational stiffness"; break;
    case Quantity::angle: return "an angle in degrees";
    case Quantity::number: return "a number";
  }
  if (!what) return "a number";
  return std::string(what) + " in " + unit_label(system, quantity);
}

namespace {

// The value, or an error when it is beyond largest_plausible() in size (checked in SI, so
// that a conversion which overflows, "1e308 kip", is caught as well).
ParsedQuantity bounded(double si, const std::string& text, Quantity quantity, UnitSystem system) {
  const double limit = largest_plausible(quantity);
  if (std::isfinite(si) && std::abs(si) <= limit) return {si, {}};
  const double shown = quantity == Quantity::angle ? limit : from_si(system, quantity, limit);
  return {std::nullopt, fmt::format("expected {} no larger than {:g} in magnitude, got '{}'",
                                    describe(quantity, system), shown, text)};
}

}  // namespace

ParsedQuantity parse_quantity(const std::string& text, Quantity quantity, UnitSystem system) {
  std::string_view s = trim(text);
  if (s.empty()) return {std::nullopt, "expected " + describe(quantity, system) + ", got nothing"};
  // Number part: everything strtod accepts.
  const char* begin = s.data();
  char* end = nullptr;
  std::string copy(s);
  double value = std::strtod(copy.c_str(), &end);
  std::size_t used = static_cast<std::size_t>(end - copy.c_str());
  (void)begin;
  if (used == 0 || !std::isfinite(value)) {
    return {std::nullopt, "expected " + describe(quantity, system) + ", got '" + copy + "'"};
  }
  std::string_view unit = trim(s.substr(used));
  if (unit.empty()) return bounded(value * to_si_factor(system, quantity), copy, quantity, system);
  if (quantity == Quantity::angle) {
    if (unit == "deg" || unit == "°" || unit == "degrees") return bounded(value, copy, quantity, system);
    return {std::nullopt, "expected an angle in degrees ('deg'), got unit '" + std::string(unit) + "'"};
  }
  if (quantity == Quantity::number) {
    return {std::nullopt, "expected a plain number without a unit, got '" + copy + "'"};
  }
  std::string bad;
  auto dim = parse_unit(unit, bad);
  if (!dim) {
    return {std::nullopt, "unknown unit '" + std::string(unit) + "' (did not understand '" + bad +
                              "'); known: N kN MN lb lbf kip tonf (US short ton, 2000 lbf) tf "
                              "(metric tonne-force) mm cm m in ft Pa kPa MPa GPa psf ksf psi ksi "
                              "tsf pcf kcf, joined with '·', '-', '*' or '/'"};
  }
  Dim want = expected_dim(quantity);
  if (dim->force != want.force || dim->length != want.length) {
    return {std::nullopt, "expected " + describe(quantity, system) + ", got " +
                              kind_name(dim->force, dim->length) + " unit '" + std::string(unit) +
                              "'"};
  }
  return bounded(value * dim->factor, copy, quantity, system);
}

}  // namespace cairn
