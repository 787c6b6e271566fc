// plan.hpp — points in plan (cap outlines, pile heads): the box around them, the area they
// enclose.
#pragma once

#include <algorithm>
#include <array>
#include <cmath>
#include <cstddef>
#include <vector>

namespace cairn {

// In the points' unit; x0 > x1 and y0 > y1 for no points.
struct Box {
  double x0 = 1e300, x1 = -1e300, y0 = 1e300, y1 = -1e300;
};

inline Box bounding_box(const std::vector<std::array<double, 2>>& points) {
  Box box;
  for (const auto& q : points) {
    box.x0 = std::min(box.x0, q[0]);
    box.x1 = std::max(box.x1, q[0]);
    box.y0 = std::min(box.y0, q[1]);
    box.y1 = std::max(box.y1, q[1]);
  }
  return box;
}

// The area of a simple polygon given by its corners in order (either sense), by the shoelace
// formula; in the corners' unit squared.
inline double polygon_area(const std::vector<std::array<double, 2>>& corners) {
  double twice = 0.0;
  for (std::size_t i = 0; i < corners.size(); ++i) {
    const auto& p = corners[i];
    const auto& q = corners[(i + 1) % corners.size()];
    twice += p[0] * q[1] - q[0] * p[1];
  }
  return std::abs(twice) / 2.0;
}

}  // namespace cairn
