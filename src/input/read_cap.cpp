// The `cap:` section (sections.hpp).
#include "cairn/input/sections.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

namespace cairn {

Cap read_cap(const Located& n, ReadContext& ctx) {
  Cap cap;
  if (!ctx.expect_map(n)) return cap;
  ctx.check_keys(n, {"thickness", "outline", "self_weight", "depth"});
  cap.thickness = ctx.number(n, "thickness", Quantity::length).value_or(0.0);
  cap.depth = ctx.number(n, "depth", Quantity::length, ReadContext::Need::optional,
                         ReadContext::Sign::non_negative)
                  .value_or(0.0);
  if (auto o = n.child("outline"); o.present() && ctx.expect_map(o)) {
    Outline outline;
    if (o.child("polygon").present()) {
      ctx.check_keys(o, {"polygon"});
      const Located poly = o.child("polygon");
      if (!poly.is_sequence() || poly.size() < 3) {
        ctx.error(ctx.at(poly), fmt::format("{}: expected a list of at least 3 corners [x, y]",
                                          poly.path));
      } else {
        for (std::size_t i = 0; i < poly.size(); ++i)
          if (auto p = ctx.point(poly.item(i), false)) outline.polygon.push_back({(*p)[0], (*p)[1]});
        outline.rectangle = false;
        // Keep corners counter-clockwise.
        double twice = 0.0;
        for (std::size_t i = 0; i < outline.polygon.size(); ++i) {
          const auto& a = outline.polygon[i];
          const auto& b = outline.polygon[(i + 1) % outline.polygon.size()];
          twice += a[0] * b[1] - b[0] * a[1];
        }
        if (twice < 0) std::reverse(outline.polygon.begin(), outline.polygon.end());
        if (std::abs(twice) < 1e-12)
          ctx.error(ctx.at(poly), fmt::format("{}: the polygon has no area", poly.path));
      }
    } else {
      ctx.check_keys(o, {"width", "length", "center"});
      const double w = ctx.number(o, "width", Quantity::length).value_or(0.0);
      const double l = ctx.number(o, "length", Quantity::length).value_or(0.0);
      std::array<double, 3> c{0.0, 0.0, 0.0};
      if (o.child("center").present())
        if (auto p = ctx.point(o.child("center"), false)) c = *p;
      outline.polygon = {{c[0] - w / 2, c[1] - l / 2},
                         {c[0] + w / 2, c[1] - l / 2},
                         {c[0] + w / 2, c[1] + l / 2},
                         {c[0] - w / 2, c[1] + l / 2}};
    }
    cap.outline = outline;
  }
  if (auto sw = n.child("self_weight"); sw.present() && ctx.expect_map(sw)) {
    ctx.check_keys(sw, {"unit_weight", "case"});
    SelfWeight self;
    self.unit_weight = ctx.number(sw, "unit_weight", Quantity::unit_weight).value_or(0.0);
    self.load_case = ctx.text(sw, "case").value_or("");
    self.where = ctx.at(sw);
    if (!n.child("outline").present())
      ctx.error(ctx.at(sw), "cap.self_weight: needs cap.outline to know the cap's plan area");
    cap.self_weight = self;
  }
  return cap;
}

}  // namespace cairn
