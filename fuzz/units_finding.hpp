// units_finding.hpp — one input of the unit-parser fuzz target, shared with the replay of
// its findings in tests/test_fuzz_regressions.cpp. The first byte picks the quantity and
// the unit system; the rest is the text, as a project file would hold it ("45 ft").
#pragma once

#include <cmath>
#include <optional>
#include <string>
#include <string_view>

#include "cairn/core/units.hpp"

namespace cairn::fuzz {

// What is wrong with parse_quantity's answer for `bytes`, or nothing: a value must be
// finite, and a missing value must come with a message. Exceptions pass to the caller.
inline std::optional<std::string> units_finding(std::string_view bytes) {
  if (bytes.empty()) return std::nullopt;
  constexpr int kQuantities = static_cast<int>(Quantity::number) + 1;
  const auto first = static_cast<unsigned char>(bytes.front());
  const auto quantity = static_cast<Quantity>(first % kQuantities);
  const auto system = (first / kQuantities) % 2 == 0 ? UnitSystem::SI : UnitSystem::US;
  const ParsedQuantity parsed = parse_quantity(std::string(bytes.substr(1)), quantity, system);
  if (parsed.si && !std::isfinite(*parsed.si)) return "a value that is not finite";
  if (!parsed.si && parsed.error.empty()) return "no value and no error message";
  return std::nullopt;
}

}  // namespace cairn::fuzz
