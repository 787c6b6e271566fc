#include "cairn/core/quantity_format.hpp"

#include <cmath>
#include <stdexcept>

#include <fmt/format.h>

namespace cairn {

std::string fixed_text(double value, int decimals) {
  if (decimals < 0 || decimals > 12) throw std::logic_error("fixed_text: decimals out of range");
  std::string text = fmt::format("{:.{}f}", value, decimals);
  // Rounded to zero: "-0.000" and "-0" lose the sign.
  if (text.front() == '-' && text.find_first_not_of("-0.") == std::string::npos) text.erase(0, 1);
  return text;
}

std::string general_text(double value) {
  std::string text = fmt::format("{:g}", value);
  if (text == "-0") text = "0";
  return text;
}

namespace {

// The input quantity whose unit a shown quantity uses (area: see below).
Quantity measured(Shown what) {
  switch (what) {
    case Shown::force: return Quantity::force;
    case Shown::moment: return Quantity::moment;
    case Shown::length:
    case Shown::depth: return Quantity::length;
    case Shown::displacement: return Quantity::small_length;
    case Shown::pressure: return Quantity::pressure;
    case Shown::unit_weight:
    case Shown::subgrade: return Quantity::unit_weight;
    case Shown::stiffness: return Quantity::stiffness;
    case Shown::rotational_stiffness: return Quantity::rotational_stiffness;
    case Shown::angle: return Quantity::angle;
    case Shown::area:  // length squared, handled by the callers
    case Shown::utilization:
    case Shown::factor:
    case Shown::code_factor:
    case Shown::bearing_factor:
    case Shown::index:
    case Shown::strain: return Quantity::number;
  }
  return Quantity::number;
}

bool stiffness_like(Shown what) {
  return what == Shown::stiffness || what == Shown::rotational_stiffness;
}

}  // namespace

std::string QuantityFormat::label(Shown what) const {
  // Areas of a plan or a section are the length unit squared (ft² in a US project, where an
  // input area without a unit is in², units.hpp).
  if (what == Shown::area) return system_ == UnitSystem::SI ? "m²" : "ft²";
  return unit_label(system_, measured(what));
}

int QuantityFormat::decimals(Shown what) const {
  const bool si = system_ == UnitSystem::SI;
  switch (what) {
    case Shown::force:
    case Shown::moment: return si ? 1 : 2;
    case Shown::length: return si ? 3 : 2;
    case Shown::depth: return si ? 2 : 1;
    case Shown::displacement: return 3;
    case Shown::pressure: return si ? 1 : 3;
    case Shown::unit_weight: return 2;
    case Shown::subgrade: return 0;
    case Shown::stiffness:
    case Shown::rotational_stiffness: return -1;
    case Shown::area: return 4;
    case Shown::angle: return 1;
    case Shown::utilization:
    case Shown::factor: return 3;
    case Shown::code_factor:
    case Shown::bearing_factor: return 2;
    case Shown::index: return 1;
    case Shown::strain: return 5;
  }
  return 3;
}

double QuantityFormat::value(Quantity what, double si) const {
  const double v = from_si(system_, what, si);
  return std::abs(v) < 5e-7 ? 0.0 : v;
}

double QuantityFormat::value(Shown what, double si) const {
  if (what == Shown::area) {
    const double f = to_si_factor(system_, Quantity::length);
    const double v = si / (f * f);
    return std::abs(v) < 5e-7 ? 0.0 : v;
  }
  return value(measured(what), si);
}

std::string QuantityFormat::number(Shown what, double si) const {
  if (what == Shown::utilization) return utilization(si);
  const double v = value(what, si);
  if (stiffness_like(what))
    return std::abs(v) >= 1e4 ? fmt::format("{:.0f}", v) : fmt::format("{:.4g}", v);
  return fixed_text(v, decimals(what));
}

std::string QuantityFormat::text(Shown what, double si) const {
  const std::string n = number(what, si);
  const std::string unit = label(what);
  if (unit.empty()) return n;
  if (what == Shown::angle) return n + unit;
  return n + " " + unit;
}

std::string QuantityFormat::utilization(double u) {
  return std::isinf(u) ? std::string("no capacity") : fixed_text(u, 3);
}

std::string QuantityFormat::plain(Shown what, double v) {
  return QuantityFormat(UnitSystem::SI).number(what, v);
}

}  // namespace cairn
