// enum_names.hpp — an enum's display names as one array in the order the enum declares its
// values, read by one lookup, instead of a switch statement per enum.
#pragma once

#include <cstddef>

namespace cairn {

// The name of `value` in `names` (one name per enum value, in declaration order); `fallback`
// for a value past the end of the array.
template <class E, std::size_t N>
constexpr const char* name_in(const char* const (&names)[N], E value, const char* fallback = "?") {
  const auto index = static_cast<std::size_t>(value);
  return index < N ? names[index] : fallback;
}

}  // namespace cairn
