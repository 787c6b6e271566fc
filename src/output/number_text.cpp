#include "cairn/output/number_text.hpp"

#include <cmath>
#include <stdexcept>

#include <fmt/format.h>

namespace cairn {

std::string count_text(std::size_t count, const std::string& singular, const std::string& plural) {
  const std::string& noun = count == 1 ? singular : (plural.empty() ? singular + "s" : plural);
  return fmt::format("{} {}", count, noun);
}

double rotation_value(double radians, double reach, double resolution) {
  if (!(reach > 0) || !(resolution > 0)) throw std::logic_error("rotation_value: reach and resolution must be positive");
  // A rotation θ moves a point at distance r by θ·r; below half the resolution it is not seen.
  return std::abs(radians) * reach < 0.5 * resolution ? 0.0 : radians;
}

std::string rotation_text(double radians, double reach, double resolution) {
  const double shown = rotation_value(radians, reach, resolution);
  return shown == 0.0 ? std::string("0") : fmt::format("{:.3e}", shown);
}

}  // namespace cairn
