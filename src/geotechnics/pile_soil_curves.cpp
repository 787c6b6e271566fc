#include "cairn/geotechnics/pile_soil_curves.hpp"

#include <algorithm>
#include <cmath>
#include <memory>
#include <set>
#include <stdexcept>
#include <string>

#include <fmt/format.h>

#include "cairn/core/diagnostics.hpp"
#include "cairn/core/quantity_format.hpp"
#include "cairn/geotechnics/axial_curves.hpp"
#include "cairn/geotechnics/capacity.hpp"
#include "cairn/geotechnics/stiffness.hpp"

namespace cairn {
namespace {

constexpr double kWaterUnitWeight = 9.81;       // kN/m³
constexpr double kPoundPerCubicInch = 271.447;  // kN/m³ per lb/in³ (4.448222 N / 0.0254³ m³)

SoilCurveProblem make_problem(SourceLocation where, std::string message) {
  SoilCurveProblem p;
  p.where = std::move(where);
  p.message = std::move(message);
  return p;
}

std::vector<std::string> clay_problems(const SoilLayer& layer) {
  std::vector<std::string> out;
  if (!layer.undrained_strength) out.push_back("needs undrained_strength (cu)");
  return out;
}

std::vector<std::string> sand_problems(const SoilLayer& layer) {
  std::vector<std::string> out;
  if (!layer.friction_angle) out.push_back("needs friction_angle (φ')");
  return out;
}

double strain_50(const SoilLayer& layer) {
  return layer.strain_50.value_or(default_strain_50(*layer.undrained_strength));
}

// γ' may not be 0 in the curves' formulas (a saturated weight at the water's own).
double positive_weight(double gamma) { return std::max(gamma, 0.1); }

// The curve `py` (its own values set) placed at the site: γ', the width, and p(y) at the
// site's depth.
template <typename Curve>
std::function<double(double)> at_site(Curve py, const CurveSite& site) {
  py.effective_unit_weight = positive_weight(site.effective_unit_weight);
  py.width = site.width;
  const double d = site.depth;
  return [py, d](double y) { return py.resistance(d, y); };
}

std::function<double(double)> build_soft_clay(const CurveSite& site) {
  SoftClayPy py;
  py.undrained_strength = *site.layer->undrained_strength;
  py.strain_50 = strain_50(*site.layer);
  py.loading = site.loading;
  return at_site(py, site);
}

std::function<double(double)> build_stiff_clay_dry(const CurveSite& site) {
  StiffClayDryPy py;
  py.undrained_strength = *site.layer->undrained_strength;
  py.strain_50 = strain_50(*site.layer);
  py.cycles = site.loading == PyLoading::cyclic ? std::max(site.cycles, 1.0) : 1.0;
  return at_site(py, site);
}

std::function<double(double)> build_sand_api(const CurveSite& site) {
  SandApiPy py;
  py.friction_angle = *site.layer->friction_angle;
  py.initial_modulus = site.layer->modulus_gradient.value_or(
      default_sand_modulus(*site.layer->friction_angle, site.below_water));
  py.loading = site.loading;
  return at_site(py, site);
}

// Reese, Cox & Koop (1974) sand: k from modulus_gradient, else the paper's table by the same
// φ' classes as the API chart (loose φ' < 30°, medium to 36°, dense beyond).
std::function<double(double)> build_sand_reese(const CurveSite& site) {
  SandReesePy py;
  const double phi = *site.layer->friction_angle;
  py.friction_angle = phi;
  const SandDensity density =
      phi < 30.0 ? SandDensity::loose : (phi <= 36.0 ? SandDensity::medium : SandDensity::dense);
  py.initial_modulus = site.layer->modulus_gradient.value_or(
      sand_subgrade_modulus(density, site.below_water));
  py.loading = site.loading;
  return at_site(py, site);
}

// Reese, Cox & Koop (1975) stiff clay with free water: the layer's cu taken as uniform (c0 = cu,
// no gradient, so c_a = cu), ε50 by the layer or from cu by the paper's classes, k
// (modulus_gradient) by the layer or from cu and the loading.
std::function<double(double)> build_stiff_clay_wet(const CurveSite& site) {
  StiffClayWetPy py;
  const double cu = *site.layer->undrained_strength;
  py.undrained_strength = cu;
  py.strength_gradient = 0.0;
  py.strain_50 = site.layer->strain_50.value_or(stiff_clay_strain_50(cu));
  py.initial_modulus =
      site.layer->modulus_gradient.value_or(stiff_clay_subgrade_modulus(cu, site.loading));
  py.loading = site.loading;
  return at_site(py, site);
}

const std::vector<LateralCurveInfo> kTable = {
    {LateralCurve::soft_clay, "soft_clay", SoilKind::clay,
     "soft clay below water, Matlock (1970); ε50 by the layer or from cu", clay_problems,
     build_soft_clay},
    {LateralCurve::stiff_clay_dry, "stiff_clay_dry", SoilKind::clay,
     "stiff clay without free water, Welch & Reese (1972); ε50 by the layer or from cu",
     clay_problems, build_stiff_clay_dry},
    {LateralCurve::sand_api, "sand_api", SoilKind::sand,
     "sand, API RP 2GEO (O'Neill & Murchison 1983); k = modulus_gradient or from φ'", sand_problems,
     build_sand_api},
    {LateralCurve::stiff_clay_wet, "stiff_clay_wet", SoilKind::clay,
     "stiff clay with free water, Reese, Cox & Koop (1975); cu uniform in the layer; ε50 and "
     "k = modulus_gradient by the layer or from cu",
     clay_problems, build_stiff_clay_wet},
    {LateralCurve::sand_reese, "sand_reese", SoilKind::sand,
     "sand, Reese, Cox & Koop (1974); k = modulus_gradient or from φ'", sand_problems,
     build_sand_reese},
};

double batter_cosine(const Pile& pile) { return std::abs(pile.axis()[2]); }

PileGeometry geometry(const Project& project, const Pile& pile, const PileType& type) {
  PileGeometry g;
  g.width = type.section.width;
  g.round = type.section.shape == SectionShape::round;
  g.length = type.length * batter_cosine(pile);  // the vertical penetration
  g.head_depth = project.cap.depth;
  g.units = project.units;
  return g;
}

std::string names_list() {
  std::string out;
  for (const LateralCurveInfo& info : kTable)
    out += std::string(out.empty() ? "" : ", ") + info.name;
  return out;
}

// What the soil curves need at a point of the pile: the curve site at ground depth d.
struct SoilField {
  SoilProfile profile;
  double head_depth = 0.0, cosine = 1.0, width = 0.0, perimeter = 0.0, step = 0.0;
  NonlinearSoilOptions options;
  PileGeometry geometry;
  PileDesign design;
  std::vector<std::function<double(double)>> lateral_at_node;
  std::vector<double> shaft_max_at_node;  // t_max·perimeter, kN/m
  std::vector<double> uplift_at_node;     // share in tension
  std::vector<AxialSoil> soil_at_node;

  double ground_depth(double z) const { return head_depth + z * cosine; }

  std::function<double(double)> lateral_at(double z) const {
    const SoilColumn column(profile);
    const double d = ground_depth(z);
    const std::size_t i = column.layer_at(d);
    const SoilLayer& layer = column.layer(i);
    CurveSite site;
    site.layer = &layer;
    site.depth = d;
    site.effective_stress = column.effective_stress(d);
    site.below_water = column.below_water(d);
    const double own = column.unit_weight(i, site.below_water).value_or(0.0) -
                       (site.below_water ? kWaterUnitWeight : 0.0);
    site.effective_unit_weight = d > 1e-9 ? site.effective_stress / d : own;
    site.width = width;
    site.loading = options.loading.value_or(PyLoading::static_load);
    site.cycles = options.cycles.value_or(1.0);
    return lateral_curve_info(*layer.lateral_curve).build(site);
  }

  void shaft_at(double z, double& t_max, double& uplift, AxialSoil& soil) const {
    const SoilColumn column(profile);
    const double d = ground_depth(z);
    const SoilLayer& layer = column.layer(column.layer_at(d));
    t_max = unit_shaft_at(profile, geometry, design, {d}).front() * perimeter;
    uplift = layer.uplift_factor.value_or(default_uplift_factor(layer.kind));
    soil = layer.kind == SoilKind::clay ? AxialSoil::clay : AxialSoil::sand;
  }

  // The node holding z, or −1 (the solver asks at the nodes of `options.segments`).
  int node_of(double z) const {
    const double at = z / step;
    const long node = std::lround(at);
    if (std::abs(at - static_cast<double>(node)) > 1e-9 || node < 0 ||
        node >= static_cast<long>(lateral_at_node.size()))
      return -1;
    return static_cast<int>(node);
  }
};

}  // namespace

const std::vector<LateralCurveInfo>& lateral_curve_table() { return kTable; }

const LateralCurveInfo& lateral_curve_info(LateralCurve curve) {
  for (const LateralCurveInfo& info : kTable)
    if (info.curve == curve) return info;
  throw std::logic_error("lateral_curve_info: a curve without its row");
}

std::optional<LateralCurve> parse_lateral_curve(std::string_view name) {
  for (const LateralCurveInfo& info : kTable)
    if (name == info.name) return info.curve;
  return std::nullopt;
}

const char* to_string(LateralCurve curve) { return lateral_curve_info(curve).name; }

double default_strain_50(double cu) {
  // Reese & Van Impe (2001), after Reese, Cox & Koop (1975) and Peck, Hanson & Thornburn's
  // consistency classes (from memory).
  if (cu < 24.0) return 0.020;
  if (cu < 48.0) return 0.010;
  if (cu < 96.0) return 0.007;
  if (cu < 192.0) return 0.005;
  return 0.004;
}

double default_sand_modulus(double phi, bool below_water) {
  // API RP 2GEO's chart of k against relative density, by its classes (from memory).
  double pci = 0.0;
  if (phi < 30.0)
    pci = below_water ? 20.0 : 25.0;
  else if (phi <= 36.0)
    pci = below_water ? 60.0 : 90.0;
  else
    pci = below_water ? 125.0 : 225.0;
  return pci * kPoundPerCubicInch;
}

std::vector<SoilCurveProblem> nonlinear_soil_problems(const Project& project) {
  std::vector<SoilCurveProblem> out;
  if (!project.soil) {
    out.push_back(
        make_problem(SourceLocation{project.file, 0, 0},
                     "soil: missing; the nonlinear soil response needs the soil profile"));
    return out;
  }
  const SoilProfile& profile = *project.soil;
  const SoilColumn column(profile);
  std::set<std::size_t> layers, types;
  for (const Pile& pile : project.piles) {
    const PileType& type = project.pile_types.at(pile.type);
    const PileGeometry g = geometry(project, pile, type);
    for (std::size_t i = 0; i < column.size(); ++i)
      if (column.bottom(i) > g.head_depth + kBoundaryTolerance &&
          column.top(i) < g.tip_depth() + kBoundaryTolerance)
        layers.insert(i);
    layers.insert(column.layer_at(std::min(g.tip_depth(), column.depth())));
    if (!types.insert(pile.type).second) continue;
    auto problem = [&](std::string message) {
      out.push_back(make_problem(type.where, fmt::format("pile_types.{}: {}", type.id, message)));
    };
    if (!(type.elastic_modulus > 0.0))
      problem(
          "elastic_modulus: missing; the nonlinear soil response needs the pile's E for "
          "EI and EA");
    if (!type.design.computes_capacity()) {
      problem(
          "the nonlinear soil response needs the pile type's tip and shaft methods "
          "(tip_clay/tip_sand, shaft_clay/shaft_sand) for its t-z and Q-z curves");
      continue;
    }
    for (const std::string& p : validate_design(profile, g, type.design)) problem(p);
  }
  for (const std::size_t i : layers) {
    const SoilLayer& layer = profile.layers[i];
    const SourceLocation where{project.file, layer.line, 0};
    const std::string who = fmt::format("soil.layers[{}] ('{}')", i, layer.name);
    if (!layer.lateral_curve) {
      out.push_back(make_problem(where, fmt::format("{}.lateral_curve: missing; the nonlinear "
                                                    "soil response needs the p-y curve of every "
                                                    "layer the piles cross, one of {}",
                                                    who, names_list())));
      continue;
    }
    const LateralCurveInfo& info = lateral_curve_info(*layer.lateral_curve);
    if (info.soil != layer.kind)
      out.push_back(make_problem(where, fmt::format("{}.lateral_curve: '{}' is a curve for {} "
                                                    "layers",
                                                    who, info.name, to_string(info.soil))));
    for (const std::string& p : info.problems(layer))
      out.push_back(
          make_problem(where, fmt::format("{}: lateral_curve '{}' {}", who, info.name, p)));
    if (*layer.lateral_curve == LateralCurve::stiff_clay_dry &&
        project.analysis.lateral_loading == LateralLoading::cyclic &&
        !project.analysis.load_cycles)
      out.push_back(make_problem(
          project.analysis.where,
          fmt::format("analysis.load_cycles: missing; the cyclic curve of {} (Welch & Reese "
                      "1972, stiff clay without free water) grows with the number of load "
                      "cycles N: give it (e.g. load_cycles: 100)",
                      who)));
  }
  return out;
}

void require_nonlinear_soil(const Project& project) {
  const std::vector<SoilCurveProblem> problems = nonlinear_soil_problems(project);
  if (problems.empty()) return;
  std::vector<Diagnostic> diagnostics;
  for (const SoilCurveProblem& p : problems) diagnostics.push_back({p.where, p.message});
  throw InputError(std::move(diagnostics));
}

NonlinearPileSpec nonlinear_pile_spec(const Project& project, std::size_t index,
                                      const NonlinearSoilOptions& asked) {
  // The loading and cycles the caller leaves open are the project's.
  NonlinearSoilOptions options = asked;
  if (!options.loading)
    options.loading = project.analysis.lateral_loading == LateralLoading::cyclic
                          ? PyLoading::cyclic
                          : PyLoading::static_load;
  if (!options.cycles) options.cycles = project.analysis.load_cycles.value_or(1.0);
  if (const auto problems = nonlinear_soil_problems(project); !problems.empty())
    throw std::invalid_argument(problems.front().message);
  if (options.segments < 4) throw std::invalid_argument("nonlinear pile: at least 4 segments");
  const Pile& pile = project.piles.at(index);
  const PileType& type = project.pile_types.at(pile.type);
  NonlinearPileSpec spec;
  spec.head = {pile.x, pile.y, 0.0};
  spec.axis = pile.axis();
  spec.length = type.length;
  spec.bending_stiffness = type.elastic_modulus * type.material_inertia();
  spec.axial_rigidity = type.elastic_modulus * type.material_area();
  spec.width = type.section.width;
  switch (type.head) {
    case HeadFixity::pinned: spec.restraint.kind = HeadRestraint::Kind::pinned; break;
    case HeadFixity::fixed: spec.restraint.kind = HeadRestraint::Kind::fixed; break;
    case HeadFixity::partial:
      spec.restraint.kind = HeadRestraint::Kind::partial;
      spec.restraint.stiffness = type.head_restraint.value_or(0.0);
      break;
  }
  spec.torsional = type.head == HeadFixity::pinned ? 0.0 : type.torsional_stiffness.value_or(0.0);
  spec.tension = type.tension;
  spec.segments = options.segments;

  auto field = std::make_shared<SoilField>();
  field->profile = *project.soil;
  field->head_depth = project.cap.depth;
  field->cosine = batter_cosine(pile);
  field->width = type.section.width;
  field->perimeter = type.section.perimeter();
  field->step = type.length / options.segments;
  field->options = options;
  field->geometry = geometry(project, pile, type);
  field->design = type.design;
  const std::size_t nodes = static_cast<std::size_t>(options.segments) + 1;
  std::vector<double> depths;
  for (std::size_t i = 0; i < nodes; ++i) {
    const double z = static_cast<double>(i) * field->step;
    field->lateral_at_node.push_back(field->lateral_at(z));
    depths.push_back(field->ground_depth(z));
  }
  const std::vector<double> unit =
      unit_shaft_at(field->profile, field->geometry, field->design, depths);
  const SoilColumn column(field->profile);
  for (std::size_t i = 0; i < nodes; ++i) {
    const SoilLayer& layer = column.layer(column.layer_at(depths[i]));
    field->shaft_max_at_node.push_back(unit[i] * field->perimeter);
    field->uplift_at_node.push_back(
        layer.uplift_factor.value_or(default_uplift_factor(layer.kind)));
    field->soil_at_node.push_back(layer.kind == SoilKind::clay ? AxialSoil::clay : AxialSoil::sand);
  }
  const double width = type.section.width;
  spec.curves.lateral = [field](double z, double y) {
    const int node = field->node_of(z);
    if (node >= 0) return field->lateral_at_node[static_cast<std::size_t>(node)](y);
    return field->lateral_at(z)(y);
  };
  spec.curves.shaft = [field, width](double z, double w) {
    double t_max = 0.0, uplift = 1.0;
    AxialSoil soil = AxialSoil::clay;
    if (const int node = field->node_of(z); node >= 0) {
      t_max = field->shaft_max_at_node[static_cast<std::size_t>(node)];
      uplift = field->uplift_at_node[static_cast<std::size_t>(node)];
      soil = field->soil_at_node[static_cast<std::size_t>(node)];
    } else {
      field->shaft_at(z, t_max, uplift, soil);
    }
    const double t = t_max * shaft_transfer(soil, width, w);
    return w < 0.0 ? uplift * t : t;
  };
  const double tip = pile_capacity(field->profile, field->geometry, field->design).tip;
  spec.curves.tip = [tip, width](double w) { return tip * tip_transfer(width, w); };
  std::string lateral;
  std::set<std::size_t> seen;
  for (double d : depths) {
    const std::size_t i = column.layer_at(d);
    if (!seen.insert(i).second) continue;
    const SoilLayer& layer = column.layer(i);
    lateral += fmt::format("{}'{}': {}", lateral.empty() ? "" : "; ", layer.name,
                           lateral_curve_info(*layer.lateral_curve).description);
  }
  spec.curves.description = fmt::format(
      "p-y ({}): {}; t-z and Q-z: API RP 2GEO, t_max from the shaft method, Q_p = "
      "{} from the tip method",
      options.loading == PyLoading::cyclic
          ? (options.cycles && *options.cycles > 1.0 ? fmt::format("cyclic, N = {:g}", *options.cycles)
                                                       : std::string("cyclic"))
          : std::string("static"),
      lateral,
      QuantityFormat(project.units).text(Shown::force, tip));
  spec.units = project.units;
  return spec;
}

PileCurves scaled_curves(const PileCurves& curves, double factor) {
  if (!(factor > 0.0)) throw std::logic_error("scaled_curves: expected a positive factor");
  if (factor == 1.0) return curves;
  PileCurves out;
  out.lateral = [lateral = curves.lateral, factor](double z, double y) {
    return factor * lateral(z, y);
  };
  out.shaft = [shaft = curves.shaft, factor](double z, double w) { return factor * shaft(z, w); };
  out.tip = [tip = curves.tip, factor](double w) { return factor * tip(w); };
  // A factor of the survey prints as given.
  out.description =
      fmt::format("{}; p, t and Q × {:g} (as built: stiffness_factor)", curves.description, factor);
  return out;
}

NonlinearPileSpec scaled_pile(NonlinearPileSpec pile, double factor) {
  if (!(factor > 0.0)) throw std::logic_error("scaled_pile: expected a positive factor");
  if (factor == 1.0) return pile;
  const std::string described = pile.curves.description;
  pile.curves = scaled_curves(pile.curves, factor);
  pile.curves.description = fmt::format(
      "{}; p, t, Q and the pile's own stiffness × {:g} (as built: stiffness_factor)", described,
      factor);
  pile.bending_stiffness *= factor;
  pile.axial_rigidity *= factor;
  pile.torsional *= factor;
  pile.restraint.stiffness *= factor;  // k_r of a partial head (0 otherwise)
  return pile;
}

}  // namespace cairn
