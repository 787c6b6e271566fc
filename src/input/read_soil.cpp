// The `soil:` section (sections.hpp): every range check of a layer's keys is here.
#include "cairn/input/sections.hpp"

#include "cairn/geotechnics/pile_soil_curves.hpp"

#include <fmt/format.h>

namespace cairn {
namespace {

using Need = ReadContext::Need;
using Sign = ReadContext::Sign;

}  // namespace

std::optional<SoilProfile> read_soil(const Located& n, ReadContext& ctx) {
  if (!ctx.expect_map(n)) return std::nullopt;
  ctx.check_keys(n, {"water_table", "layers", "ground_level"});
  SoilProfile profile;
  profile.water_table =
      ctx.number(n, "water_table", Quantity::length, Need::optional, Sign::non_negative);
  profile.ground_level = ctx.number(n, "ground_level", Quantity::length, Need::optional, Sign::any);
  const Located layers = n.child("layers");
  if (!layers.present() || !layers.is_sequence() || layers.size() == 0) {
    ctx.error(ctx.at(layers.present() ? layers : n),
                "soil.layers: expected a list of layers from the ground surface down");
    return profile;
  }
  for (std::size_t i = 0; i < layers.size(); ++i) {
    const Located l = layers.item(i);
    if (!ctx.expect_map(l)) continue;
    ctx.check_keys(l, {"name", "kind", "thickness", "unit_weight", "saturated_unit_weight",
                       "undrained_strength", "friction_angle", "soil_modulus", "poisson_ratio",
                       "volumetric_strain", "shaft_k", "shaft_delta", "spt_n60", "max_unit_shaft",
                       "max_unit_tip", "max_unit_shaft_reason", "max_unit_tip_reason",
                       "meyerhof_nq", "lambda", "uplift_factor",
                       "compression_index", "recompression_index", "void_ratio",
                       "preconsolidation", "subgrade_modulus", "modulus_gradient",
                       "lateral_curve", "strain_50"});
    SoilLayer layer;
    layer.line = ctx.at(l).line;
    layer.name = ctx.text(l, "name", Need::optional).value_or(fmt::format("layer {}", i + 1));
    if (auto k = l.child("kind"); k.present()) {
      if (auto v = ctx.choice<SoilKind>(k, {{"clay", SoilKind::clay}, {"sand", SoilKind::sand}}))
        layer.kind = *v;
    } else {
      ctx.error(ctx.at(l), fmt::format("{}.kind: missing; expected clay or sand", l.path));
    }
    layer.thickness = ctx.number(l, "thickness", Quantity::length).value_or(0.0);
    auto opt = [&](const char* key, Quantity q, Sign sign = Sign::positive) {
      return ctx.number(l, key, q, Need::optional, sign);
    };
    layer.unit_weight = opt("unit_weight", Quantity::unit_weight);
    layer.saturated_unit_weight = opt("saturated_unit_weight", Quantity::unit_weight);
    layer.undrained_strength = opt("undrained_strength", Quantity::pressure);
    layer.friction_angle = opt("friction_angle", Quantity::angle);
    layer.soil_modulus = opt("soil_modulus", Quantity::pressure);
    layer.poisson_ratio = opt("poisson_ratio", Quantity::number, Sign::non_negative);
    if (layer.poisson_ratio && *layer.poisson_ratio >= 0.5)
      ctx.error(ctx.at(l.child("poisson_ratio")),
                  fmt::format("{} ('{}').poisson_ratio: expected 0 to less than 0.5, got {:g}", l.path, layer.name,
                              *layer.poisson_ratio));
    layer.volumetric_strain = opt("volumetric_strain", Quantity::number, Sign::non_negative);
    layer.shaft_k = opt("shaft_k", Quantity::number);
    layer.shaft_delta = opt("shaft_delta", Quantity::angle, Sign::non_negative);
    layer.spt_n60 = opt("spt_n60", Quantity::number, Sign::non_negative);
    layer.max_unit_shaft = opt("max_unit_shaft", Quantity::pressure);
    layer.max_unit_tip = opt("max_unit_tip", Quantity::pressure);
    layer.max_unit_shaft_reason = ctx.text(l, "max_unit_shaft_reason", Need::optional);
    layer.max_unit_tip_reason = ctx.text(l, "max_unit_tip_reason", Need::optional);
    for (const char* key : {"max_unit_shaft", "max_unit_tip"})
      if (l.child(std::string(key) + "_reason").present() && !l.child(key).present())
        ctx.error(ctx.at(l.child(std::string(key) + "_reason")),
                    fmt::format("{}.{}_reason: expected {} beside it, got a reason alone", l.path,
                                key, key));
    layer.meyerhof_nq = opt("meyerhof_nq", Quantity::number);
    layer.lambda = opt("lambda", Quantity::number);
    layer.uplift_factor = opt("uplift_factor", Quantity::number);
    layer.compression_index = opt("compression_index", Quantity::number);
    layer.recompression_index = opt("recompression_index", Quantity::number);
    layer.void_ratio = opt("void_ratio", Quantity::number);
    layer.preconsolidation = opt("preconsolidation", Quantity::pressure);
    layer.subgrade_modulus = opt("subgrade_modulus", Quantity::unit_weight);
    layer.modulus_gradient = opt("modulus_gradient", Quantity::unit_weight);
    const std::string who = fmt::format("{} ('{}')", l.path, layer.name);
    if (auto c = l.child("lateral_curve"); c.present()) {
      std::map<std::string, LateralCurve> names;
      for (const LateralCurveInfo& info : lateral_curve_table())
        names.emplace(info.name, info.curve);
      if (auto v = ctx.choice<LateralCurve>(c, names)) {
        layer.lateral_curve = *v;
        const LateralCurveInfo& info = lateral_curve_info(*v);
        if (l.child("kind").present() && info.soil != layer.kind)
          ctx.error(ctx.at(c), fmt::format("{}.lateral_curve: '{}' is a curve for {} layers, "
                                           "this layer is {}",
                                           who, info.name, to_string(info.soil),
                                           to_string(layer.kind)));
      }
    }
    layer.strain_50 = opt("strain_50", Quantity::number);
    if (layer.strain_50 && *layer.strain_50 >= 0.1)
      ctx.error(ctx.at(l.child("strain_50")),
                fmt::format("{}.strain_50: expected a strain below 0.1 (ε50 of clays is 0.004 "
                            "to 0.02), got {:g}",
                            who, *layer.strain_50));
    if (layer.kind == SoilKind::sand && !layer.friction_angle)
      ctx.error(ctx.at(l), fmt::format("{}: a sand layer needs friction_angle", who));
    if (layer.kind == SoilKind::clay && !layer.undrained_strength &&
        !l.child("undrained_strength").present())
      ctx.error(ctx.at(l), fmt::format("{}: a clay layer needs undrained_strength (cu > 0)", who));
    if (layer.friction_angle && (*layer.friction_angle < 20.0 || *layer.friction_angle > 50.0))
      ctx.error(ctx.at(l.child("friction_angle")),
                  fmt::format("{}.friction_angle: expected 20° to 50°, got {}", who,
                              *layer.friction_angle));
    if (!layer.unit_weight && !layer.saturated_unit_weight)
      ctx.error(ctx.at(l), fmt::format("{}: needs unit_weight or saturated_unit_weight", who));
    profile.layers.push_back(layer);
  }
  return profile;
}

}  // namespace cairn
