#include "cairn/geotechnics/stiffness.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>

#include <fmt/format.h>

#include "cairn/core/quantity_format.hpp"
#include "cairn/geotechnics/group.hpp"
#include "cairn/geotechnics/lateral.hpp"
#include "cairn/solver/beam_column.hpp"

namespace cairn {
namespace {

// Davisson (1970) for stiff clay: kh ≈ 67·cu/D (from memory).
constexpr double kDavissonFactor = 67.0;
// Vesić (1961) correlation coefficient.
constexpr double kVesicSubgradeFactor = 0.65;
constexpr double kDefaultPoisson = 0.3;  // common practice when a layer gives none

// Half-height of the tip's zone of influence, in pile widths: 1.5·D above and below the tip,
// the zone over which the LCPC method averages the cone resistance for the tip
// (Bustamante & Gianeselli 1982, from memory). Es and μs at the tip are averaged over it, so
// the tip's spring and settlement change smoothly as the tip passes a layer boundary.
constexpr double kTipZoneDiameters = 1.5;

struct Subgrade {
  double kh = 0.0;  // kN/m³
  std::string source;
};

std::optional<Subgrade> subgrade_modulus(const SoilLayer& layer, const PileType& type,
                                         UnitSystem units) {
  const double d = type.section.width;
  // kh in the project's units: kN/m³ or pcf.
  auto kh_text = [&](double kh) {
    return QuantityFormat(units).text(Shown::subgrade, kh);
  };
  if (layer.subgrade_modulus)
    return Subgrade{*layer.subgrade_modulus,
                    fmt::format("kh = {} given for layer '{}'", kh_text(*layer.subgrade_modulus),
                                layer.name)};
  if (layer.soil_modulus && type.elastic_modulus > 0) {
    const double es = *layer.soil_modulus;
    const double mu = layer.poisson_ratio.value_or(kDefaultPoisson);
    const double ei = type.elastic_modulus * type.material_inertia();
    const double k = kVesicSubgradeFactor * std::pow(es * std::pow(d, 4) / ei, 1.0 / 12.0) * es /
                     (1.0 - mu * mu);
    return Subgrade{k / d, fmt::format("kh = {} from Vesić (1961) with Es of layer '{}'",
                                       kh_text(k / d), layer.name)};
  }
  if (layer.kind == SoilKind::clay && layer.undrained_strength)
    return Subgrade{kDavissonFactor * *layer.undrained_strength / d,
                    fmt::format("kh = 67·cu/D = {} (Davisson 1970, from memory) for layer '{}'",
                                kh_text(kDavissonFactor * *layer.undrained_strength / d), layer.name)};
  return std::nullopt;
}

// The terms a fixed or partially fixed head gives the cap (pile_head.hpp), from the pile's
// own head stiffness in one plane, and the pile kept for the moment along it.
void restrain(const PileType& type, PileTypeStiffness& s, const PlaneStiffness& plane,
              MomentInfluence influence) {
  HeadRestraint restraint;
  restraint.kind = HeadRestraint::Kind::fixed;
  if (type.head == HeadFixity::partial) {
    restraint.kind = HeadRestraint::Kind::partial;
    restraint.stiffness = type.head_restraint.value_or(0.0);
  }
  const RestrainedHead head = restrained_head(plane, restraint);
  s.lateral = head.lateral;
  s.bending = head.bending;
  s.bending.torsional = type.torsional_stiffness.value_or(0.0);
  s.influence = std::move(influence);
}

// Matlock & Reese (1960): a long pile's closed form; a shorter one, and the moment along the
// pile, from the finite-difference beam on springs nh·z (a unit head shear and a unit head
// moment, the head free to rotate).
struct GradientPile {
  PlaneStiffness plane;
  MomentInfluence influence;
  bool long_pile = true;
  double t = 0.0;  // T, m
};
GradientPile gradient_pile(double ei, double nh, double length) {
  GradientPile out;
  out.t = std::pow(ei / nh, 0.2);
  // Matlock & Reese: Zmax = L/T ≥ 5 behaves as a long pile (from memory).
  out.long_pile = length >= 5.0 * out.t;
  BeamColumnPile fd;
  fd.bending_stiffness = ei;
  fd.length = length;
  fd.segments = 200;
  fd.soil = [nh](double z, double y) { return nh * z * y; };
  const BeamColumnResult shear = solve_beam_column(fd, {1.0, false, 0.0, 0.0});
  const BeamColumnResult moment = solve_beam_column(fd, {0.0, false, 1.0, 0.0});
  if (!shear.converged || !moment.converged)
    throw std::invalid_argument("the pile on the modulus gradient has no stable solution");
  out.influence = {shear.depth, shear.moment, moment.moment};
  if (out.long_pile) {
    out.plane = matlock_reese_long_pile(ei, nh);
  } else {
    const double f_hh = shear.head_deflection, f_mm = moment.head_rotation;
    const double f_hm = 0.5 * (shear.head_rotation + moment.head_deflection);  // Maxwell
    const double det = f_hh * f_mm - f_hm * f_hm;
    out.plane = {f_mm / det, -f_hm / det, f_hh / det};
  }
  return out;
}

}  // namespace

std::optional<VesicPile> vesic_pile(const Project& project, std::size_t t,
                                    std::vector<std::string>* missing) {
  // Es along the shaft is the thickness-weighted mean over the shaft; Es and μs at the tip
  // the thickness-weighted means over the tip's zone of influence (below the profile's base
  // the last layer continues).
  const PileType& type = project.pile_types[t];
  const SoilColumn column(*project.soil);
  VesicPile pile;
  pile.width = type.section.width;
  pile.round = type.section.shape == SectionShape::round;
  pile.length = type.length;
  pile.pile_modulus = type.elastic_modulus;
  pile.material_area = type.material_area();
  const double head = project.cap.depth, tip = head + type.length;
  const double zone = kTipZoneDiameters * pile.width;
  std::vector<std::size_t> lacking;
  auto modulus = [](const SoilLayer& l) { return l.soil_modulus; };
  const auto shaft = type.length > 0 ? column.mean(head, tip, modulus, &lacking) : std::nullopt;
  const auto at_tip = pile.width > 0 ? column.mean(tip - zone, tip + zone, modulus, &lacking)
                                     : std::nullopt;
  std::sort(lacking.begin(), lacking.end());
  lacking.erase(std::unique(lacking.begin(), lacking.end()), lacking.end());
  if (missing)
    for (std::size_t i : lacking)
      missing->push_back(fmt::format("layer '{}' needs soil_modulus", column.layer(i).name));
  if (type.elastic_modulus <= 0 && missing)
    missing->push_back(fmt::format("pile type '{}' needs elastic_modulus", type.id));
  if (!shaft || !at_tip || type.elastic_modulus <= 0) return std::nullopt;
  pile.soil_modulus_shaft = *shaft;
  pile.soil_modulus_tip = *at_tip;
  pile.poisson_ratio = *column.mean(tip - zone, tip + zone, [](const SoilLayer& l) {
    return std::optional<double>(l.poisson_ratio.value_or(kDefaultPoisson));
  });
  return pile;
}

double section_inertia(const Section& s) {
  return s.shape == SectionShape::square ? std::pow(s.width, 4) / 12.0
                                         : std::numbers::pi * std::pow(s.width, 4) / 64.0;
}

std::vector<PileTypeStiffness> pile_type_stiffness(const Project& project,
                                                   const std::vector<PileTypeCapacity>& capacities) {
  std::vector<PileTypeStiffness> out(project.pile_types.size());
  const UnitSystem u = project.units;
  for (std::size_t t = 0; t < project.pile_types.size(); ++t) {
    const PileType& type = project.pile_types[t];
    PileTypeStiffness& s = out[t];
    s.head = type.head;
    const PileTypeCapacity* capacity = nullptr;
    for (const auto& c : capacities)
      if (c.type == t) capacity = &c;
    // Axial.
    if (type.axial_stiffness) {
      s.axial = *type.axial_stiffness;
      s.axial_source = "given";
    } else {
      s.axial = type.axial_stiffness_used();
      s.axial_source = "E·A/L (elastic shortening of the whole pile, no soil)";
      if (project.soil && capacity && type.elastic_modulus > 0) {
        if (const auto pile = vesic_pile(project, t)) {
          const double q = capacity->result.allowable_compression;
          double tip_ult = capacity->result.tip, shaft_ult = capacity->result.shaft;
          if (project.group.tip_share) {
            tip_ult = *project.group.tip_share;
            shaft_ult = 1.0 - *project.group.tip_share;
          }
          if (q > 0 && tip_ult + shaft_ult > 0) {
            const SecantStiffness k = axial_head_stiffness(*pile, q, tip_ult, shaft_ult);
            s.axial = k.stiffness;
            s.axial_source = fmt::format(
                "secant Q/s from Vesić (1977) settlement at the allowable load: {} over {}",
                QuantityFormat(u).text(Shown::force, q),
                QuantityFormat(u).text(Shown::displacement, k.settlement));
          }
        } else {
          s.axial_source += "; the soil profile lacks soil_modulus for a settlement-based value";
        }
      }
    }
    // Lateral.
    if (type.lateral_stiffness) {
      s.lateral = *type.lateral_stiffness;
      s.lateral_source = "given";
      const double ei = type.elastic_modulus * type.material_inertia();
      if (type.head != HeadFixity::pinned && ei > 0.0 && s.lateral > 0.0 &&
          type.section.width > 0.0) {
        // k_hh = 4EIλ³ (Hetényi 1946, long pile, head held against rotation).
        const double lambda = std::cbrt(s.lateral / (4.0 * ei));
        const double k = 4.0 * ei * std::pow(lambda, 4);
        ElasticPile pile;
        pile.bending_stiffness = ei;
        pile.subgrade_modulus = k / type.section.width;
        pile.width = type.section.width;
        pile.head = HeadFixity::fixed;
        restrain(type, s, hetenyi_long_pile(ei, k), moment_influence(pile));
        s.lateral_source += fmt::format(
            " as the fixed-head stiffness of a long pile on Hetényi's (1946) elastic foundation "
            "(λ = {:.4f} 1/{} from k_hh = 4EIλ³){}",
            lambda / from_si(u, Quantity::length, 1.0), unit_label(u, Quantity::length),
            type.head == HeadFixity::partial ? "; condensed with the head restraint" : "");
      } else if (type.head != HeadFixity::pinned) {
        s.lateral_source += "; no elastic_modulus: the head takes no moment (pinned terms)";
      }
    } else {
      s.lateral = 0.0;
      s.lateral_source = "0 (axial-only pile, the classical assumption)";
      if (project.soil && type.elastic_modulus > 0) {
        const SoilColumn column(*project.soil);
        if (const SoilLayer* top = &column.layer(column.layer_at(project.cap.depth))) {
          if (top->modulus_gradient && *top->modulus_gradient > 0 && type.length > 0) {
            const double ei = type.elastic_modulus * type.material_inertia();
            const GradientPile g = gradient_pile(ei, *top->modulus_gradient, type.length);
            const auto& k = g.plane;
            s.lateral = k.k_hh - k.k_hm * k.k_hm / k.k_mm;
            if (type.head == HeadFixity::fixed) s.head_moment_per_shear = std::abs(k.k_hm) / k.k_hh;
            if (type.head != HeadFixity::pinned) restrain(type, s, k, g.influence);
            s.lateral_source = fmt::format(
                "Matlock & Reese (1960) modulus growing with depth, {} head, nh = {:.0f} {} given "
                "for layer '{}', T = {:.3f} {}{}",
                to_string(type.head), from_si(u, Quantity::unit_weight, *top->modulus_gradient),
                unit_label(u, Quantity::unit_weight), top->name,
                from_si(u, Quantity::length, g.t), unit_label(u, Quantity::length),
                g.long_pile ? "" : " (L < 5T: finite-difference beam)");
          } else if (auto kh = subgrade_modulus(*top, type, u)) {
            ElasticPile pile;
            pile.bending_stiffness = type.elastic_modulus * type.material_inertia();
            pile.subgrade_modulus = kh->kh;
            pile.width = type.section.width;
            pile.embedded_length = type.length;
            pile.head = type.head;
            if (pile.head == HeadFixity::partial) pile.head = HeadFixity::fixed;
            const LateralHeadStiffness k = lateral_head_stiffness(pile);
            s.lateral = k.lateral_stiffness;
            s.head_moment_per_shear = type.head == HeadFixity::fixed ? k.head_moment_per_shear : 0.0;
            if (type.head != HeadFixity::pinned) {
              ElasticPile free_head = pile;
              free_head.head = HeadFixity::pinned;  // the moment influence is of the free head
              restrain(type, s, {k.k_hh, k.k_hm, k.k_mm}, moment_influence(free_head));
            }
            s.lateral_source = fmt::format("Hetényi (1946) beam on elastic foundation, {} head, {}{}",
                                           to_string(type.head),
                                           kh->source, k.long_pile ? "" : " (short pile: finite beam)");
          } else {
            s.lateral_source += "; the layer at the pile head gives no subgrade_modulus, "
                                "soil_modulus or undrained_strength";
          }
        }
      }
    }
  }
  return out;
}

std::vector<PileSpring> pile_springs(const Project& project,
                                     const std::vector<PileTypeStiffness>& stiffness) {
  std::vector<PileSpring> springs;
  springs.reserve(project.piles.size());
  for (const auto& pile : project.piles) {
    const auto& type = project.pile_types.at(pile.type);
    springs.push_back({{pile.x, pile.y, 0.0},
                       pile.axis(),
                       stiffness.at(pile.type).axial,
                       stiffness.at(pile.type).lateral,
                       type.tension,
                       stiffness.at(pile.type).bending});
  }
  return springs;
}

}  // namespace cairn
