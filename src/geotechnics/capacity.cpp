// capacity.cpp — single-pile axial capacity from a layered soil profile (see capacity.hpp).
#include "cairn/geotechnics/capacity.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>
#include <numbers>
#include <stdexcept>
#include <utility>

#include "cairn/core/defaults.hpp"
#include "cairn/core/units.hpp"
#include "cairn/geotechnics/methods.hpp"

namespace cairn {

namespace {

constexpr double kPi = std::numbers::pi;
constexpr double kPa = kAtmosphericPressure;
// Tolerance on depths, m: the soil column's (a tip within 1 µm of a boundary is on it).
constexpr double kDepthTolerance = kBoundaryTolerance;
// Meyerhof (1976): the unit tip develops over about 10 diameters of penetration into a
// stronger layer, and a weaker layer less than about 10 diameters below the tip reduces it.
constexpr double kTransitionDiameters = 10.0;
// Meyerhof's (1976) limiting unit shaft friction of driven displacement piles in sand,
// 1 tsf (FHWA-HI-97-013 quotes it as 2 ksf), from memory. cairn applies it by default to
// shaft methods whose source gives no limit in sand (beta; meyerhof-spt on bored piles).
constexpr double kMeyerhofShaftLimit = 1.0 * kTsf;
// Shaft uplift in sand / compression shaft when the layer gives none (common practice,
// from memory; ratios of about 0.5–0.8 are used in the trade).
constexpr double kSandUpliftFactor = 2.0 / 3.0;
// O'Neill & Reese (1999): top 1.5 m of a drilled shaft in clay carries no side resistance.
constexpr double kAlphaFhwaTopExclusion = 1.5;
// AASHTO LRFD 10.8.3.5.1c limit on drilled-shaft unit tip in clay, 80 ksf = 3.83 MPa (from
// memory).
constexpr double kFhwaClayTipLimit = 40.0 * kTsf;
// Longest sub-interval of the shaft quadrature, m.
constexpr double kQuadratureStep = 0.05;

double radians(double degrees) { return degrees * kPi / 180.0; }

std::string format(const char* pattern, double value) {
  char buffer[64];
  std::snprintf(buffer, sizeof buffer, pattern, value);
  return buffer;
}

std::string quoted(const SoilLayer& layer) { return "layer '" + layer.name + "'"; }

// The words for the engineer's limit (max_unit_tip, max_unit_shaft), quoting the reason.
std::string engineer_limit(const char* key, const std::optional<std::string>& reason) {
  return std::string(key) + " given, " + (reason ? "reason: '" + *reason + "'" : "no reason stated");
}

// A depth or pressure quoted in a note, in the project's units ("12.50 m", "3.2 ksf").
std::string length_text(double metres, UnitSystem units) {
  return format("%.2f", from_si(units, Quantity::length, metres)) + " " +
         unit_label(units, Quantity::length);
}
std::string pressure_text(double kilopascals, UnitSystem units) {
  return format(units == UnitSystem::SI ? "%.0f" : "%.2f",
                from_si(units, Quantity::pressure, kilopascals)) +
         " " + unit_label(units, Quantity::pressure);
}

// Three-point Gauss–Legendre rule on [a, b] split into pieces ≤ kQuadratureStep; exact for
// polynomials up to degree 5 on each piece.
template <class F>
double integrate(F&& f, double a, double b) {
  if (b <= a) return 0.0;
  const int pieces = std::max(1, static_cast<int>(std::ceil((b - a) / kQuadratureStep)));
  const double h = (b - a) / pieces;
  const double offset = std::sqrt(0.6) * h / 2.0;
  double sum = 0.0;
  for (int i = 0; i < pieces; ++i) {
    const double mid = a + (i + 0.5) * h;
    sum += 5.0 * f(mid - offset) + 8.0 * f(mid) + 5.0 * f(mid + offset);
  }
  return sum * h / 18.0;
}

// Integral of f over [a, b], split at the given depths so that every kink lies on a piece
// boundary.
template <class F>
double integrate_split(F&& f, double a, double b, std::vector<double> splits) {
  splits.push_back(a);
  splits.push_back(b);
  std::sort(splits.begin(), splits.end());
  double sum = 0.0;
  for (std::size_t i = 0; i + 1 < splits.size(); ++i) {
    const double lo = std::clamp(splits[i], a, b);
    const double hi = std::clamp(splits[i + 1], a, b);
    sum += integrate(f, lo, hi);
  }
  return sum;
}

double interpolate(const double (*table)[2], std::size_t rows, double x) {
  if (x <= table[0][0]) return table[0][1];
  for (std::size_t i = 1; i < rows; ++i) {
    if (x <= table[i][0]) {
      const double t = (x - table[i - 1][0]) / (table[i][0] - table[i - 1][0]);
      return table[i - 1][1] + t * (table[i][1] - table[i - 1][1]);
    }
  }
  return table[rows - 1][1];
}

// Developed for drilled shafts (bored piles), by the method table.
template <class Method>
bool is_bored_method(Method method) {
  return method_info(method).developed_for == Installation::bored;
}

// "tip method 'vesic' (sand)"
std::string fmt_method(const char* part, const char* method, const char* kind) {
  return std::string(part) + " method '" + method + "' (" + kind + ")";
}

// Whether a method applies to a kind of soil, by the method table.
template <class Method>
bool applies(Method method, SoilKind kind) {
  const auto& info = method_info(method);
  return kind == SoilKind::clay ? info.clay : info.sand;
}

std::optional<TipMethod> tip_method_for(const PileDesign& design, SoilKind kind) {
  return kind == SoilKind::clay ? design.tip_clay : design.tip_sand;
}

std::optional<ShaftMethod> shaft_method_for(const PileDesign& design, SoilKind kind) {
  return kind == SoilKind::clay ? design.shaft_clay : design.shaft_sand;
}

void add_note(std::vector<std::string>& notes, std::string note) {
  if (std::find(notes.begin(), notes.end(), note) == notes.end()) notes.push_back(std::move(note));
}

// Effective vertical stress with the optional critical depth: constant below z_c.
struct StressField {
  const SoilColumn& column;
  std::optional<double> critical_depth;
  double operator()(double z) const {
    if (critical_depth && z > *critical_depth) z = *critical_depth;
    return column.effective_stress(z);
  }
};

}  // namespace

// ---- Geometry ---------------------------------------------------------------------------

double PileGeometry::area() const { return round ? kPi * width * width / 4.0 : width * width; }
double PileGeometry::perimeter() const { return round ? kPi * width : 4.0 * width; }

// ---- Method names -----------------------------------------------------------------------

// From the method tables (methods.hpp).
std::vector<std::string> tip_method_names() {
  std::vector<std::string> names;
  for (const auto& row : tip_methods()) names.emplace_back(row.name);
  return names;
}

std::vector<std::string> shaft_method_names() {
  std::vector<std::string> names;
  for (const auto& row : shaft_methods()) names.emplace_back(row.name);
  return names;
}

std::optional<TipMethod> parse_tip_method(std::string_view name) { return find_tip_method(name); }

std::optional<ShaftMethod> parse_shaft_method(std::string_view name) {
  return find_shaft_method(name);
}

// ---- Vesić (1977), NCHRP Synthesis 42 ---------------------------------------------------

// N*σ = 3/(3 − sinφ) · exp[(π/2 − φ) tanφ] · tan²(45° + φ/2) · Irr^(4 sinφ / [3(1 + sinφ)]).
// The tan² factor is what makes (N*σ − 1)·cotφ tend to the φ = 0 form (limit of Vesić's (1977) closed form).
double vesic_n_sigma(double phi_deg, double irr) {
  if (!(phi_deg >= 0.0 && phi_deg < 90.0))
    throw std::invalid_argument("vesic: φ must lie in [0°, 90°)");
  if (!(irr >= 1.0)) throw std::invalid_argument("vesic: Irr must be at least 1");
  const double phi = radians(phi_deg);
  const double s = std::sin(phi);
  const double t = std::tan(kPi / 4.0 + phi / 2.0);
  return 3.0 / (3.0 - s) * std::exp((kPi / 2.0 - phi) * std::tan(phi)) * t * t *
         std::pow(irr, 4.0 * s / (3.0 * (1.0 + s)));
}

// N*c = (N*σ − 1) cotφ; φ = 0: N*c = 4/3 (ln Irr + 1) + π/2 + 1. Below φ = 0.01° the limit
// is used, where the difference form loses precision.
double vesic_n_c(double phi_deg, double irr) {
  if (!(irr >= 1.0)) throw std::invalid_argument("vesic: Irr must be at least 1");
  if (phi_deg < 0.01) return 4.0 / 3.0 * (std::log(irr) + 1.0) + kPi / 2.0 + 1.0;
  return (vesic_n_sigma(phi_deg, irr) - 1.0) / std::tan(radians(phi_deg));
}

// Ir = Es / [2 (1 + μs) q' tanφ] (Vesić 1977), with q' the vertical effective stress.
double vesic_rigidity_index_sand(double es, double poisson, double q_prime, double phi_deg) {
  if (!(q_prime > 0.0)) throw std::invalid_argument("vesic: q' must be positive");
  return es / (2.0 * (1.0 + poisson) * q_prime * std::tan(radians(phi_deg)));
}

// Irr = Ir / (1 + Ir Δ) (Vesić 1977).
double vesic_reduced_rigidity_index(double ir, double volumetric_strain) {
  return ir / (1.0 + ir * volumetric_strain);
}

// μs = 0.1 + 0.3 φrel, φrel = (φ − 25°)/20° in [0, 1] (Chen & Kulhawy 1994, from memory).
double sand_poisson_ratio(double phi_deg) {
  const double rel = std::clamp((phi_deg - 25.0) / 20.0, 0.0, 1.0);
  return 0.1 + 0.3 * rel;
}

// Δ = 0.005 (1 − φrel) q'/pa (Chen & Kulhawy 1994, from memory).
double sand_volumetric_strain(double phi_deg, double q_prime) {
  const double rel = std::clamp((phi_deg - 25.0) / 20.0, 0.0, 1.0);
  return 0.005 * (1.0 - rel) * q_prime / kPa;
}

// Ir = 347 (cu/pa) − 33 ≤ 300: a fit to O'Neill & Reese's (1999) table (computed from the
// fit: within ±8 % of the table for cu/pa 0.25–1.0; negative below cu = 9.6 kPa).
double clay_rigidity_index_fit(double cu) {
  if (!(cu / kPa >= 0.25 - 1e-12))
    throw std::invalid_argument("the Ir fit is not used below cu/pa = 0.25 (give soil_modulus)");
  return std::min(347.0 * cu / kPa - 33.0, 300.0);
}

// O'Neill & Reese (1999), Table of Ir against su (from memory; also
// Brown et al. (2010), FHWA NHI-10-016 GEC-10):
// su/pa 0.25 → 50, 0.5 → 150, ≥ 1.0 → 250–300; the upper value 300 is taken because the
// table prints N*c = 9.0 there.
double clay_rigidity_index_table(double cu) {
  if (!(cu / kPa >= 0.25 - 1e-12))
    throw std::invalid_argument("the Ir table starts at cu/pa = 0.25 (give soil_modulus)");
  static constexpr double kTable[][2] = {{0.25, 50.0}, {0.5, 150.0}, {1.0, 300.0}};
  return interpolate(kTable, 3, cu / kPa);
}

// ---- Meyerhof (1976) --------------------------------------------------------------------

// N*q at whole degrees 20°–45°: Meyerhof's (1976) chart as tabulated in textbooks (e.g.
// Das, Principles of Foundation Engineering, "interpolated values of N*q based on
// Meyerhof's theory"). All values from memory; check against print before relying on them.
double meyerhof_nq(double phi_deg) {
  static constexpr std::array<double, 26> kNq = {
      12.4, 13.8,  15.5,  17.9,  21.4,  26.0,  29.5,  34.0,  39.7,  46.5,  56.7,  68.2,  81.0,
      96.0, 115.0, 143.0, 168.0, 194.0, 231.0, 276.0, 346.0, 420.0, 525.0, 650.0, 780.0, 930.0};
  const double x = std::clamp(phi_deg, 20.0, 45.0) - 20.0;
  const auto i = std::min(static_cast<std::size_t>(x), kNq.size() - 2);
  const double t = x - static_cast<double>(i);
  return std::exp((1.0 - t) * std::log(kNq[i]) + t * std::log(kNq[i + 1]));
}

// ql = 0.5 pa N*q tanφ (Meyerhof 1976).
double meyerhof_limit(double n_q, double phi_deg) {
  return 0.5 * kPa * n_q * std::tan(radians(phi_deg));
}

// qp = 0.4 pa N60 Db/D ≤ 4 pa N60 (Meyerhof 1976; FHWA-HI-97-013: 0.8 N' Db/b ≤ 8 N' ksf).
double meyerhof_spt_tip(double n60, double penetration, double width) {
  if (!(width > 0.0)) throw std::invalid_argument("meyerhof-spt: width must be positive");
  return std::min(0.4 * kPa * n60 * penetration / width, 4.0 * kPa * n60);
}

// f = pa N60/50 displacement piles, pa N60/100 non-displacement (Meyerhof 1976); driven
// limited to 2 ksf = 1 tsf (FHWA-HI-97-013).
double meyerhof_spt_shaft(double n60, Installation installation) {
  if (installation == Installation::driven) return std::min(kPa * n60 / 50.0, kTsf);
  return kPa * n60 / 100.0;
}

// ---- O'Neill & Reese (1999), FHWA-IF-99-025 ---------------------------------------------

// N*c = 1.33 (ln Ir + 1) ≤ 9.
double oneill_reese_n_c(double ir) {
  if (!(ir >= 1.0)) throw std::invalid_argument("fhwa: Ir must be at least 1");
  return std::min(1.33 * (std::log(ir) + 1.0), 9.0);
}

// qp = 0.6 N60 tsf ≤ 30 tsf (O'Neill & Reese 1999, from memory). The
// quoted form 0.057·pa·N60 is ten times low (0.057·N60 MPa is the SI form).
double oneill_reese_sand_tip(double n60) { return std::min(0.6 * n60, 30.0) * kTsf; }

// qp,reduced = (1.27/Bb) qp for Bb > 1.27 m (50 in).
double oneill_reese_wide_base_factor(double base_width) {
  return base_width > 1.27 ? 1.27 / base_width : 1.0;
}

// α = 0.55 (su/pa ≤ 1.5); 0.55 − 0.1 (su/pa − 1.5) (1.5 ≤ su/pa ≤ 2.5).
double oneill_reese_alpha(double cu) {
  const double ratio = std::min(cu / kPa, 2.5);
  return ratio <= 1.5 ? 0.55 : 0.55 - 0.1 * (ratio - 1.5);
}

// β = 1.5 − 0.245 √z, 0.25 ≤ β ≤ 1.2, × N60/15 for N60 < 15.
double oneill_reese_beta(double z, double n60) {
  const double beta = std::clamp(1.5 - 0.245 * std::sqrt(std::max(z, 0.0)), 0.25, 1.2);
  return n60 < 15.0 ? beta * n60 / 15.0 : beta;
}

// ---- API RP 2GEO; Vijayvergiya & Focht (1972) --------------------------------------------

// α = 0.5 ψ^−0.5 (ψ ≤ 1), 0.5 ψ^−0.25 (ψ > 1), α ≤ 1 (API RP 2GEO, after Randolph & Murphy
// 1985).
double api_alpha(double psi) {
  if (!(psi > 0.0)) throw std::invalid_argument("alpha-api: ψ = cu/σ'v must be positive");
  if (std::isinf(psi)) return 0.0;
  const double alpha = psi <= 1.0 ? 0.5 / std::sqrt(psi) : 0.5 * std::pow(psi, -0.25);
  return std::min(alpha, 1.0);
}

// λ against penetration L (m): Vijayvergiya & Focht's (1972) chart as tabulated in
// textbooks (e.g. Das, Principles of Foundation Engineering). From memory.
double vijayvergiya_focht_lambda(double penetration) {
  static constexpr double kTable[][2] = {{0.0, 0.500},  {5.0, 0.336},  {10.0, 0.245}, {15.0, 0.200},
                                         {20.0, 0.173}, {25.0, 0.150}, {30.0, 0.136}, {35.0, 0.132},
                                         {40.0, 0.127}, {50.0, 0.118}, {60.0, 0.113}, {70.0, 0.110},
                                         {90.0, 0.110}};
  return interpolate(kTable, 13, penetration);
}

// f_av = λ (σ̄'v + 2 c̄u).
double lambda_unit_shaft(double lambda, double mean_effective_stress, double mean_cu) {
  return lambda * (mean_effective_stress + 2.0 * mean_cu);
}

// ---- Factors ----------------------------------------------------------------------------

// AASHTO LRFD Table 10.5.5.2.3-1 (driven piles) and 10.5.5.2.4-1 (drilled shafts), from
// memory: the values are in the method tables (methods.cpp), per installation and soil.
double aashto_phi_tip(TipMethod method, SoilKind kind, Installation installation) {
  const TipMethodInfo& info = method_info(method);
  return (installation == Installation::bored ? info.phi_bored : info.phi_driven).of(kind);
}

double aashto_phi_shaft(ShaftMethod method, SoilKind kind, Installation installation) {
  const ShaftMethodInfo& info = method_info(method);
  return (installation == Installation::bored ? info.phi_bored : info.phi_driven).of(kind);
}

double aashto_phi_uplift(ShaftMethod method, SoilKind kind, Installation installation) {
  const ShaftMethodInfo& info = method_info(method);
  return (installation == Installation::bored ? info.phi_uplift_bored : info.phi_uplift_driven)
      .of(kind);
}

bool aashto_calibrated(TipMethod method, Installation installation) {
  return method_info(method).developed_for == installation;
}
bool aashto_calibrated(ShaftMethod method, Installation installation) {
  return method_info(method).developed_for == installation;
}

std::vector<std::string> installation_cautions(const PileDesign& design) {
  std::vector<std::string> cautions;
  const Installation installation = design.installation;
  const bool bored = installation == Installation::bored;
  const char* other = bored ? "driven" : "bored (drilled-shaft)";
  const char* here = bored ? "a bored" : "a driven";
  const char* table = bored ? "10.5.5.2.3-1 (driven piles)" : "10.5.5.2.4-1 (drilled shafts)";
  auto check = [&](const auto& method, const char* part, const char* kind, bool phi_given) {
    if (!method || aashto_calibrated(*method, installation)) return;
    std::string text = fmt_method(part, to_string(*method), kind) + " on " + here +
                       " pile: the method was developed for " + other + " piles";
    if (bored && std::string(part) == "tip" && std::string(kind) == "sand")
      text += "; its unit tip is taken as 1/3 of the driven value (Meyerhof 1976)";
    if (!phi_given)
      text += std::string("; its default resistance factor comes from AASHTO LRFD Table ") +
              table + ", calibrated on " + other +
              " piles, not for this installation; give the resistance factor from a load test "
              "or local calibration";
    cautions.push_back(text);
  };
  check(design.tip_clay, "tip", "clay", design.phi_tip.has_value());
  check(design.tip_sand, "tip", "sand", design.phi_tip.has_value());
  check(design.shaft_clay, "shaft", "clay", design.phi_shaft && design.phi_uplift);
  check(design.shaft_sand, "shaft", "sand", design.phi_shaft && design.phi_uplift);
  return cautions;
}

double default_uplift_factor(SoilKind kind) {
  return kind == SoilKind::clay ? 1.0 : kSandUpliftFactor;
}

// ---- Validation -------------------------------------------------------------------------

namespace {

// The weights rule is the soil column's (soil.hpp): one of the two unit weights suffices.
// The ranges of the friction angle (20° to 50°), Poisson's ratio and the volumetric strain
// are checked where the project file is read (read_soil.cpp), once.
void check_layer_basics(const SoilLayer& layer, std::vector<std::string>& problems) {
  const std::string who = quoted(layer);
  if (!(layer.thickness > 0.0)) problems.push_back(who + ": thickness must be positive");
  if (!layer.unit_weight && !layer.saturated_unit_weight)
    problems.push_back(who + ": needs unit_weight or saturated_unit_weight");
  if (layer.kind == SoilKind::sand) {
    if (!layer.friction_angle)
      problems.push_back(who + ": a sand layer needs friction_angle");
  } else {
    if (!layer.undrained_strength)
      problems.push_back(who + ": a clay layer needs undrained_strength");
    else if (!(*layer.undrained_strength > 0.0))
      problems.push_back(who + ": undrained_strength must be positive");
  }
  auto positive = [&](const std::optional<double>& value, const char* key) {
    if (value && !(*value > 0.0)) problems.push_back(who + ": " + key + " must be positive");
  };
  positive(layer.soil_modulus, "soil_modulus");
  positive(layer.shaft_k, "shaft_k");
  positive(layer.spt_n60, "spt_n60");
  positive(layer.max_unit_shaft, "max_unit_shaft");
  positive(layer.max_unit_tip, "max_unit_tip");
  positive(layer.meyerhof_nq, "meyerhof_nq");
  positive(layer.lambda, "lambda");
  if (layer.shaft_delta && !(*layer.shaft_delta > 0.0 && *layer.shaft_delta < 90.0))
    problems.push_back(who + ": shaft_delta must lie between 0 and 90 degrees");
  if (layer.uplift_factor && !(*layer.uplift_factor >= 0.0 && *layer.uplift_factor <= 1.0))
    problems.push_back(who + ": uplift_factor must lie between 0 and 1");
}

void check_layer_methods(const SoilLayer& layer, const PileDesign& design, bool shaft_layer,
                         bool tip_layer, std::vector<std::string>& problems) {
  const std::string who = quoted(layer);
  auto need = [&](const std::optional<double>& value, const char* method, const char* key) {
    if (!value) problems.push_back(who + ": method '" + method + "' needs " + key);
  };
  const bool low_cu = layer.kind == SoilKind::clay && layer.undrained_strength &&
                      *layer.undrained_strength / kPa < 0.25;
  const auto tip = tip_method_for(design, layer.kind);
  if (tip_layer && tip && applies(*tip, layer.kind)) {
    const TipMethodInfo& info = method_info(*tip);
    const char* name = info.name;
    for (const LayerInput& input : layer.kind == SoilKind::sand ? info.needs_sand : info.needs_clay)
      need(layer.*input.field, name, input.key);
    if (layer.kind == SoilKind::clay && info.clay_modulus_below_quarter_pa && !layer.soil_modulus &&
        low_cu) {
      problems.push_back(who + ": method '" + name + "' needs soil_modulus (cu/pa = " +
                         format("%.3f", *layer.undrained_strength / kPa) +
                         " is below 0.25, where the tabulated Ir is not used)");
    }
  }
  const auto shaft = shaft_method_for(design, layer.kind);
  if (shaft_layer && shaft && applies(*shaft, layer.kind)) {
    const ShaftMethodInfo& info = method_info(*shaft);
    for (const LayerInput& input : info.needs) need(layer.*input.field, info.name, input.key);
  }
}

}  // namespace

bool applies_to(TipMethod method, SoilKind kind) { return applies(method, kind); }
bool applies_to(ShaftMethod method, SoilKind kind) { return applies(method, kind); }

std::vector<std::string> validate_design(const SoilProfile& profile, const PileGeometry& pile,
                                         const PileDesign& design,
                                         std::optional<double> table_min_length) {
  std::vector<std::string> problems;
  if (!design.computes_capacity()) problems.push_back("no tip or shaft method is given");
  if (profile.layers.empty()) problems.push_back("the soil profile has no layers");
  if (!(pile.width > 0.0)) problems.push_back("pile width must be positive");
  if (!(pile.length > 0.0)) problems.push_back("pile length must be positive");
  if (!(pile.head_depth >= 0.0)) problems.push_back("pile head depth must not be negative");
  if (!(pile.unit_weight >= 0.0)) problems.push_back("pile unit weight must not be negative");
  if (pile.tip_depth() > profile.depth() + kDepthTolerance)
    problems.push_back("the pile tip (" + length_text(pile.tip_depth(), pile.units) +
                       " below the ground) lies below the soil profile's base (" +
                       length_text(profile.depth(), pile.units) + ")");

  auto method_applies = [&](const auto& method, SoilKind kind, const char* key) {
    if (method && !applies(*method, kind))
      problems.push_back(std::string("method '") + to_string(*method) + "' (" + key +
                         ") does not apply to " + to_string(kind));
  };
  method_applies(design.tip_clay, SoilKind::clay, "tip, clay");
  method_applies(design.tip_sand, SoilKind::sand, "tip, sand");
  method_applies(design.shaft_clay, SoilKind::clay, "shaft, clay");
  method_applies(design.shaft_sand, SoilKind::sand, "shaft, sand");

  auto positive = [&](const std::optional<double>& value, const char* key) {
    if (value && !(*value > 0.0)) problems.push_back(std::string(key) + " must be positive");
  };
  positive(design.critical_depth_diameters, "critical_depth");
  positive(design.safety_factor, "safety_factor");
  positive(design.safety_factor_tip, "safety_factor_tip");
  positive(design.safety_factor_shaft, "safety_factor_shaft");
  positive(design.safety_factor_tension, "safety_factor_tension");
  for (const auto& [value, key] :
       {std::pair{design.phi_tip, "phi_tip"}, std::pair{design.phi_shaft, "phi_shaft"},
        std::pair{design.phi_uplift, "phi_uplift"}})
    if (value && !(*value > 0.0 && *value <= 1.0))
      problems.push_back(std::string(key) + " must lie in (0, 1]");

  // Shaft properties are needed in every layer the shaft may cross (down to the base when a
  // depth table is asked for); tip properties where the tip may end and in the layers within
  // the transition zone, 10 D above (on the shaft) and below the tip (tip_resistance).
  const double shallowest_tip = pile.head_depth + table_min_length.value_or(pile.length);
  const double deepest_tip = table_min_length ? profile.depth() : pile.tip_depth();
  const double zone = kTransitionDiameters * std::max(pile.width, 0.0);
  double top = 0.0;
  for (const SoilLayer& layer : profile.layers) {
    const double bottom = top + layer.thickness;
    check_layer_basics(layer, problems);
    const bool shaft_layer =
        bottom > pile.head_depth + kDepthTolerance && top < deepest_tip - kDepthTolerance;
    const bool tip_layer = bottom > pile.head_depth + kDepthTolerance &&
                           bottom > shallowest_tip - zone + kDepthTolerance &&
                           top < deepest_tip + zone - kDepthTolerance;
    check_layer_methods(layer, design, shaft_layer, tip_layer, problems);
    top = bottom;
  }
  return problems;
}

// ---- The computation --------------------------------------------------------------------

namespace {

// A bored pile's sand tip by a method derived for driven (displacement) piles: Meyerhof
// (1976) puts a bored pile's unit tip in sand at about 1/3 of a driven pile's (from memory),
// applied after the method's own limit. Its base is then held to what it mobilizes at a
// settlement of about 5 % of the base width, as O'Neill & Reese (1999) do for drilled shafts:
// for a base wider than 1.27 m (50 in), q × 1.27/Bb (from memory). Clay tips (9cu, Vesić's
// N*c) are undrained bearing values that hold for bored piles too (Skempton 1959).
void bored_pile_tip(const PileDesign& design, const SoilLayer& layer, TipMethod method,
                    const PileGeometry& pile, TipDetails& d, double& q,
                    std::vector<std::string>& notes) {
  if (design.installation != Installation::bored || layer.kind != SoilKind::sand ||
      is_bored_method(method))
    return;
  d.bored_factor = kMeyerhofBoredTipFactor;
  q *= kMeyerhofBoredTipFactor;
  add_note(notes, std::string("bored pile: the ") + to_string(method) +
                      " tip in sand (a driven-pile method) is taken as 1/3 of the driven value "
                      "(Meyerhof 1976, from memory)");
  const double wide = oneill_reese_wide_base_factor(pile.width);
  if (wide < 1.0) {
    d.reduction = wide;
    q *= wide;
    add_note(notes, "bored pile: base wider than 1.27 m, tip reduced by 1.27/Bb to what it "
                    "mobilizes at a settlement of about 5 % of a 1.27 m base (O'Neill & Reese "
                    "1999, from memory)");
  }
}

// Unit tip resistance of layer `index` for a tip at depth z (m) in it, by the design's
// method for the layer's kind, after the method's own limit, the default limit where the
// method's source gives none, and the engineer's max_unit_tip; fills details and notes.
// meyerhof-spt gives its full value 4·pa·N60 here: its development with penetration,
// 0.4·pa·N60·Db/D, is Meyerhof's transition, applied in tip_resistance.
TipDetails layer_tip(const SoilColumn& column, std::size_t index, double z,
                     const PileGeometry& pile, const PileDesign& design,
                     std::vector<std::string>& notes) {
  TipDetails d;
  d.depth = z;
  d.area = pile.area();
  const SoilLayer& layer = column.layer(index);
  d.layer = layer.name;
  d.kind = layer.kind;
  d.q_prime = column.effective_stress(d.depth);
  d.friction_angle = layer.friction_angle;
  d.undrained_strength = layer.undrained_strength;
  d.soil_modulus = layer.soil_modulus;
  d.spt_n60 = layer.spt_n60;
  const std::optional<TipMethod> method = tip_method_for(design, layer.kind);
  if (!method) {
    d.method = "none";
    add_note(notes, "no tip method for " + std::string(to_string(layer.kind)) + ": the tip in " +
                        quoted(layer) + " is taken as 0");
    return d;
  }
  d.method = to_string(*method);
  d.tip_method = *method;
  if (is_bored_method(*method) && design.installation == Installation::driven)
    add_note(notes,
             "tip method 'fhwa' was developed for drilled shafts; used here on a driven pile");
  const double cu = layer.undrained_strength.value_or(0.0);
  const double phi = layer.friction_angle.value_or(0.0);
  double q = 0.0;

  switch (*method) {
    case TipMethod::vesic:
      if (layer.kind == SoilKind::sand) {
        // Vesić (1977): qp = σ'o N*σ, σ'o = (1 + 2K0)/3 q', K0 = 1 − sinφ.
        d.k0 = 1.0 - std::sin(radians(phi));
        d.sigma_o = (1.0 + 2.0 * *d.k0) / 3.0 * d.q_prime;
        d.poisson_ratio = layer.poisson_ratio.value_or(sand_poisson_ratio(phi));
        d.volumetric_strain =
            layer.volumetric_strain.value_or(sand_volumetric_strain(phi, d.q_prime));
        if (!layer.poisson_ratio)
          add_note(notes, quoted(layer) + ": μs = 0.1 + 0.3·(φ − 25°)/20° = " +
                              format("%.3f", *d.poisson_ratio) +
                              " (correlation, Chen & Kulhawy 1994)");
        if (!layer.volumetric_strain)
          add_note(notes, quoted(layer) + ": Δ = 0.005·(1 − (φ − 25°)/20°)·q'/pa = " +
                              format("%.5f", *d.volumetric_strain) +
                              " (correlation, Chen & Kulhawy 1994)");
        if (phi < 25.0 || phi > 45.0)
          add_note(
              notes,
              quoted(layer) +
                  ": φ outside 25°–45°, the μs and Δ correlations are held at their end values");
        d.rigidity_index =
            vesic_rigidity_index_sand(*layer.soil_modulus, *d.poisson_ratio, d.q_prime, phi);
        d.reduced_rigidity_index =
            std::max(1.0, vesic_reduced_rigidity_index(*d.rigidity_index, *d.volumetric_strain));
        d.n_sigma = vesic_n_sigma(phi, *d.reduced_rigidity_index);
        q = *d.sigma_o * *d.n_sigma;
        // Vesić (1977) gives no limiting value. Default: Meyerhof's (1976) limiting unit tip
        // ql = 0.5·pa·N*q·tanφ, the limit FHWA's Nordlund method also applies to a static
        // tip in sand (FHWA-HI-97-013, from memory); max_unit_tip replaces it.
        if (!layer.max_unit_tip) {
          d.limit = meyerhof_limit(layer.meyerhof_nq.value_or(meyerhof_nq(phi)), phi);
          d.limit_source = "default: Meyerhof (1976) limit 0.5·pa·N*q·tanφ";
          d.limit_default = true;
        }
      } else {
        // Vesić (1977), φ = 0: qp = cu N*c, Irr = Ir = Es/(3 cu). The overburden term σo·1 is
        // left out (net resistance; balanced by the pile's weight, common practice).
        if (layer.soil_modulus) {
          d.rigidity_index = *layer.soil_modulus / (3.0 * cu);
        } else {
          d.rigidity_index = clay_rigidity_index_fit(cu);
          add_note(notes, quoted(layer) + ": Ir = 347·(cu/pa) − 33 ≤ 300 = " +
                              format("%.1f", *d.rigidity_index) +
                              " (fit to O'Neill & Reese's 1999 table; no soil_modulus given)");
        }
        d.reduced_rigidity_index = std::max(1.0, *d.rigidity_index);
        d.n_c = vesic_n_c(0.0, *d.reduced_rigidity_index);
        q = cu * *d.n_c;
      }
      if (d.reduced_rigidity_index &&
          (*d.reduced_rigidity_index < 10.0 || *d.reduced_rigidity_index > 500.0))
        add_note(notes, "Vesić tip: Irr = " + format("%.1f", *d.reduced_rigidity_index) +
                            " lies outside the published table's range 10–500");
      break;

    case TipMethod::meyerhof:
      if (layer.kind == SoilKind::sand) {
        // Meyerhof (1976): qp = q' N*q ≤ 0.5 pa N*q tanφ.
        d.n_q = layer.meyerhof_nq.value_or(meyerhof_nq(phi));
        if (!layer.meyerhof_nq)
          add_note(notes, quoted(layer) + ": N*q = " + format("%.1f", *d.n_q) +
                              " from Meyerhof's (1976) chart, tabulated values from memory");
        if (phi > 45.0 && !layer.meyerhof_nq)
          add_note(notes, quoted(layer) + ": φ above 45°, N*q held at the chart's 45° value");
        d.limit = meyerhof_limit(*d.n_q, phi);
        d.limit_source = "Meyerhof (1976) limit 0.5·pa·N*q·tanφ";
        q = d.q_prime * *d.n_q;
      } else {
        d.n_c = 9.0;  // Meyerhof (1976); also Skempton (1951) deep footing
        q = 9.0 * cu;
      }
      break;

    case TipMethod::meyerhof_spt: {
      // Meyerhof (1976): qp = 0.4 pa N60 Db/D ≤ 4 pa N60, Db the penetration into the layer;
      // the full value here, the development with Db in tip_resistance.
      d.limit = 4.0 * kPa * *layer.spt_n60;
      d.limit_source = "Meyerhof (1976) limit 4·pa·N60";
      q = *d.limit;
      d.limited = true;  // reached at Db ≥ 10·D; tip_resistance clears it for a shorter Db
      d.governed_by = d.limit_source;
      add_note(notes, "Meyerhof SPT tip: N60 of " + quoted(layer) +
                          " used as given (no averaging near the tip, no overburden correction)");
      break;
    }

    case TipMethod::fhwa:
      if (layer.kind == SoilKind::clay) {
        // O'Neill & Reese (1999): qp = N*c su, N*c = 1.33 (ln Ir + 1) ≤ 9, Ir = Es/(3 su).
        if (layer.soil_modulus) {
          d.rigidity_index = *layer.soil_modulus / (3.0 * cu);
        } else {
          d.rigidity_index = clay_rigidity_index_table(cu);
          add_note(notes, quoted(layer) + ": Ir = " + format("%.1f", *d.rigidity_index) +
                              " from O'Neill & Reese's (1999) table (values from memory)");
        }
        d.n_c = oneill_reese_n_c(std::max(1.0, *d.rigidity_index));
        q = *d.n_c * cu;
        // Shallow base, Z < 3D: × 2/3 (1 + Z/(6D)) (O'Neill & Reese 1999, from memory).
        if (d.depth < 3.0 * pile.width) {
          d.reduction = 2.0 / 3.0 * (1.0 + d.depth / (6.0 * pile.width));
          q *= *d.reduction;
          add_note(notes, "fhwa tip: base less than 3 diameters deep, reduced by 2/3·(1 + Z/6D)");
        }
        d.limit = kFhwaClayTipLimit;
        d.limit_source = "AASHTO LRFD 10.8.3.5.1c limit 80 ksf for drilled shafts in clay";
      } else {
        // O'Neill & Reese (1999): qp = 0.6 N60 tsf ≤ 30 tsf; × 1.27/Bb for Bb > 1.27 m.
        const double n60 = *layer.spt_n60;
        if (n60 > 50.0)
          add_note(notes, quoted(layer) +
                              ": N60 above 50, outside O'Neill & Reese's sand tip (treat as IGM)");
        d.limit = 30.0 * kTsf;
        d.limit_source = "O'Neill & Reese (1999) limit 30 tsf";
        q = 0.6 * n60 * kTsf;
        const double factor = oneill_reese_wide_base_factor(pile.width);
        if (factor < 1.0) {
          d.reduction = factor;
          add_note(notes, "fhwa tip: base wider than 1.27 m, reduced by 1.27/Bb");
        }
      }
      break;
  }

  if (d.limit && q > *d.limit) {
    q = *d.limit;
    d.limited = true;
    d.governed_by = d.limit_source;
  }
  if (d.reduction && !(layer.kind == SoilKind::clay && *method == TipMethod::fhwa))
    q *= *d.reduction;  // the wide-base factor applies to the limited value
  bored_pile_tip(design, layer, *method, pile, d, q, notes);
  if (layer.max_unit_tip) {
    const std::string engineer = engineer_limit("max_unit_tip", layer.max_unit_tip_reason);
    if (!d.limit || *layer.max_unit_tip < *d.limit) {
      d.limit = *layer.max_unit_tip;
      d.limit_source = engineer;
      d.limit_default = false;
    }
    if (q > *layer.max_unit_tip) {
      q = *layer.max_unit_tip;
      d.limited = true;
      d.governed_by = engineer;
    }
  }
  d.unit_tip = q;
  return d;
}

// Meyerhof's (1976) transitions near layer boundaries, around the bearing layer's own value:
//   into a stronger layer   qp = q0 + (q1 − q0)·Db/(10·D) ≤ q1   (Db < 10·D)
//   above a weaker layer    qp = q2 + (q1 − q2)·H/(10·D)  ≤ q1   (H < 10·D)
// q1 the bearing layer's unit tip at the tip, q0 the unit tip of the layer above at the
// boundary (on the shaft only; 0 when it has no tip method), q2 the weaker layer's at its
// top, Db the penetration into the bearing layer (from the pile head when that lies in
// it), H the distance from the tip down to the weaker layer. meyerhof-spt always develops
// from q0 (0 without a layer above on the shaft), which is its own 0.4·pa·N60·Db/D. Both are
// continuous at the boundaries: a tip on a boundary (in the layer below, by the soil
// column's rule) gets q0 or q2, the value just above it.
TipDetails tip_resistance(const SoilColumn& column, const PileGeometry& pile,
                          const PileDesign& design, std::vector<std::string>& notes) {
  const double z = pile.tip_depth();
  const std::size_t k = column.layer_at(z);
  TipDetails d = layer_tip(column, k, z, pile, design, notes);
  if (!d.tip_method) return d;
  const UnitSystem u = pile.units;
  const double zone = kTransitionDiameters * pile.width;
  const double start = std::max(column.top(k), pile.head_depth);
  std::vector<std::string> scratch;  // the neighbours' notes are not the bearing layer's
  double q = d.unit_tip;
  d.penetration = z - start;

  // A neighbour without a tip method (tip taken as 0 there) gives no transition: the note
  // on the missing method stands for it.
  auto has_tip_method = [&](std::size_t i) {
    const bool has = tip_method_for(design, column.layer(i).kind).has_value();
    if (!has)
      add_note(notes, "no tip transition with " + quoted(column.layer(i)) + " (within 10·D of the "
                      "tip): it has no tip method");
    return has;
  };
  const bool layer_above = k > 0 && column.top(k) > pile.head_depth + kDepthTolerance &&
                           *d.penetration < zone - kDepthTolerance && has_tip_method(k - 1);
  const bool spt = d.tip_method == TipMethod::meyerhof_spt;
  if (*d.penetration < zone - kDepthTolerance && (layer_above || spt)) {
    const double q0 =
        layer_above ? layer_tip(column, k - 1, column.top(k), pile, design, scratch).unit_tip
                    : 0.0;
    if (q > q0) {
      d.layer_unit_tip = q;
      q = q0 + (q - q0) * *d.penetration / zone;
      d.limited = false;  // the value lies below the layer's limited value
      d.governed_by.clear();
      const std::string from =
          layer_above ? "the unit tip of " + quoted(column.layer(k - 1)) + " at the boundary"
                      : "0 (no layer above on the shaft)";
      d.transition = "tip " + length_text(*d.penetration, u) + " into " + quoted(column.layer(k)) +
                     ", less than 10·D = " + length_text(zone, u) + ": q_p = q0 + (q1 − q0)·Db/(10·D) = " +
                     pressure_text(q0, u) + " + (" + pressure_text(*d.layer_unit_tip, u) + " − " +
                     pressure_text(q0, u) + ")·" + format("%.3f", *d.penetration / zone) + " = " +
                     pressure_text(q, u) + ", q0 " + from + " (Meyerhof 1976, from memory)";
      d.transition_short = "Db < 10·D in '" + column.layer(k).name + "'";
    }
  }

  double reduced = q;
  for (std::size_t j = k + 1; j < column.size() && column.top(j) < z + zone - kDepthTolerance;
       ++j) {
    const double h = column.top(j) - z;
    if (!has_tip_method(j)) continue;
    const double q2 = layer_tip(column, j, column.top(j), pile, design, scratch).unit_tip;
    if (q2 >= q) continue;
    const double candidate = q2 + (q - q2) * h / zone;
    if (candidate >= reduced) continue;
    reduced = candidate;
    if (!d.layer_unit_tip) d.layer_unit_tip = q;
    d.limited = false;
    d.governed_by.clear();
    const std::string text =
        "weaker " + quoted(column.layer(j)) + " " + length_text(h, u) + " below the tip, less than 10·D = " +
        length_text(zone, u) + ": q_p = q2 + (q1 − q2)·H/(10·D) = " + pressure_text(q2, u) + " + (" +
        pressure_text(q, u) + " − " + pressure_text(q2, u) + ")·" + format("%.3f", h / zone) + " = " +
        pressure_text(candidate, u) + " (Meyerhof 1976, from memory)";
    d.transition = d.transition.empty() ? text : d.transition + "; then " + text;
    d.transition_short += std::string(d.transition_short.empty() ? "" : "; ") + "weaker '" +
                          column.layer(j).name + "' < 10·D below";
  }
  if (z + zone > column.depth() + kDepthTolerance)
    add_note(notes, "the soil profile ends " + length_text(column.depth() - z, u) +
                        " below the tip, less than 10·D: the last layer is taken to continue");
  d.unit_tip = reduced;
  if (!d.transition.empty()) add_note(notes, "tip transition: " + d.transition);
  return d;
}


// Unit shaft friction f(z), kPa, for the methods that vary continuously with depth, before
// the limit of shaft_limit.
double unit_shaft(ShaftMethod method, const SoilLayer& layer, double z, const StressField& stress,
                  const SoilColumn& column, const PileGeometry& pile, Installation installation) {
  switch (method) {
    case ShaftMethod::beta:  // f = K σ'v tanδ
      return *layer.shaft_k * stress(z) * std::tan(radians(*layer.shaft_delta));
    case ShaftMethod::alpha_api: {  // f = α cu, α(ψ), ψ = cu/σ'v
      const double sigma = column.effective_stress(z);
      const double cu = *layer.undrained_strength;
      return api_alpha(sigma > 0.0 ? cu / sigma : INFINITY) * cu;
    }
    case ShaftMethod::alpha_fhwa: {  // f = α cu, none in the top 1.5 m and the bottom 1 D
      if (z < pile.head_depth + kAlphaFhwaTopExclusion || z > pile.tip_depth() - pile.width)
        return 0.0;
      return oneill_reese_alpha(*layer.undrained_strength) * *layer.undrained_strength;
    }
    case ShaftMethod::beta_fhwa:  // f = β(z) σ'v
      return oneill_reese_beta(z, *layer.spt_n60) * column.effective_stress(z);
    case ShaftMethod::meyerhof_spt:  // f = pa N60/50 (driven), pa N60/100 (bored)
      return kPa * *layer.spt_n60 / (installation == Installation::driven ? 50.0 : 100.0);
    case ShaftMethod::lambda: break;  // handled over the whole clay penetration
  }
  throw std::logic_error("unit_shaft: method without a depth-wise unit friction");
}

struct ShaftLimit {
  std::optional<double> value;  // kPa
  std::string source;
  bool is_default = false;
};

// The limit on unit shaft friction for a method in a layer: the method's own, from its row in
// the method table (beta-fhwa 2 tsf, O'Neill & Reese 1999; meyerhof-spt 1 tsf on driven
// piles, Meyerhof 1976); where the source gives none in sand (beta; meyerhof-spt on bored
// piles) Meyerhof's 1 tsf by default; max_unit_shaft replaces the default and lowers any
// other. Clay methods need none: α·cu ≤ cu, and λ is a mean over the clay.
ShaftLimit shaft_limit(ShaftMethod method, const SoilLayer& layer, Installation installation) {
  const ShaftMethodInfo& info = method_info(method);
  const std::optional<double> own =
      installation == Installation::driven ? info.limit_driven : info.limit_bored;
  ShaftLimit limit;
  if (own) {
    limit = {*own, info.limit_source, false};
  } else if (info.default_limit_in_sand && layer.kind == SoilKind::sand && !layer.max_unit_shaft) {
    limit = {kMeyerhofShaftLimit,
             "default: Meyerhof (1976) limit 1 tsf for driven piles in sand, from memory", true};
  }
  if (layer.max_unit_shaft && (!limit.value || *layer.max_unit_shaft < *limit.value))
    limit = {*layer.max_unit_shaft, engineer_limit("max_unit_shaft", layer.max_unit_shaft_reason),
             false};
  return limit;
}

// The λ method's sums over the clay crossed with it between the depths head and tip: the
// length, ∫σ'v dz and ∫cu dz (their means are the sums over the length).
struct LambdaSums {
  double length = 0.0, stress = 0.0, cu = 0.0;
};
LambdaSums lambda_sums(const SoilColumn& column, const PileDesign& design, double head,
                       double tip) {
  const std::vector<double>& z = column.boundaries();
  LambdaSums out;
  for (std::size_t i = 0; i < column.size(); ++i) {
    const SoilLayer& layer = column.layer(i);
    const double a = std::max(z[i], head), b = std::min(z[i + 1], tip);
    if (b <= a || shaft_method_for(design, layer.kind) != ShaftMethod::lambda) continue;
    std::vector<double> splits;
    if (const auto water = column.water_level()) splits.push_back(*water);
    out.length += b - a;
    out.stress +=
        integrate_split([&](double x) { return column.effective_stress(x); }, a, b, splits);
    out.cu += *layer.undrained_strength * (b - a);
  }
  return out;
}

}  // namespace

std::vector<double> unit_shaft_at(const SoilProfile& profile, const PileGeometry& pile,
                                  const PileDesign& design, const std::vector<double>& depths) {
  if (const auto problems = validate_design(profile, pile, design); !problems.empty())
    throw std::invalid_argument(problems.front());
  const SoilColumn column(profile);
  const double head = pile.head_depth, tip = pile.tip_depth();
  StressField stress{column, std::nullopt};
  if (design.critical_depth_diameters)
    stress.critical_depth = *design.critical_depth_diameters * pile.width;
  // λ: the mean over the clay crossed with it, as in pile_capacity.
  const auto [lambda_length, lambda_stress, lambda_cu] = lambda_sums(column, design, head, tip);
  std::vector<double> out;
  out.reserve(depths.size());
  for (const double depth : depths) {
    if (depth < head - kDepthTolerance || depth > tip + kDepthTolerance) {
      out.push_back(0.0);
      continue;
    }
    const SoilLayer& layer = column.layer(column.layer_at(depth));
    const std::optional<ShaftMethod> method = shaft_method_for(design, layer.kind);
    if (!method) {
      out.push_back(0.0);
      continue;
    }
    const double limit = shaft_limit(*method, layer, design.installation).value.value_or(INFINITY);
    double f = 0.0;
    if (*method == ShaftMethod::lambda) {
      const double lambda = layer.lambda.value_or(vijayvergiya_focht_lambda(pile.length));
      f = lambda_length > 0.0
              ? lambda_unit_shaft(lambda, lambda_stress / lambda_length, lambda_cu / lambda_length)
              : 0.0;
    } else {
      f = unit_shaft(*method, layer, depth, stress, column, pile, design.installation);
    }
    out.push_back(std::min(f, limit));
  }
  return out;
}

CapacityResult pile_capacity(const SoilProfile& profile, const PileGeometry& pile,
                             const PileDesign& design) {
  if (const auto problems = validate_design(profile, pile, design); !problems.empty())
    throw std::invalid_argument(problems.front());

  CapacityResult r;
  std::vector<std::string>& notes = r.notes;
  const Installation installation = design.installation;
  const double perimeter = pile.perimeter();
  const double head = pile.head_depth, tip = pile.tip_depth();
  const SoilColumn column(profile);
  const std::vector<double>& z = column.boundaries();
  const std::optional<double> water = column.water_level();
  for (const std::string& note : column.weight_substitutions(tip)) add_note(notes, note);

  // ---- Tip
  r.tip_details = tip_resistance(column, pile, design, notes);
  r.tip = r.tip_details.unit_tip * r.tip_details.area;
  const UnitSystem u = pile.units;
  if (r.tip_details.limited)
    r.limits.push_back("unit tip in " + quoted(column.layer(column.layer_at(tip))) +
                       " limited to " + pressure_text(*r.tip_details.limit, u) + " (" +
                       r.tip_details.governed_by + ")");

  // ---- Shaft, layer by layer
  StressField stress{column, std::nullopt};
  if (design.critical_depth_diameters) {
    stress.critical_depth = *design.critical_depth_diameters * pile.width;
    add_note(notes, "beta shaft: σ'v held constant below the critical depth " +
                        length_text(*stress.critical_depth, pile.units) +
                        " below the ground surface");
  }
  // λ method: one mean unit friction over all clay crossed with that method
  // (Vijayvergiya & Focht 1972): f_av = λ (σ̄'v + 2 c̄u), λ from the penetration L.
  const auto [lambda_length, lambda_stress, lambda_cu] = lambda_sums(column, design, head, tip);

  for (std::size_t i = 0; i < profile.layers.size(); ++i) {
    const SoilLayer& layer = profile.layers[i];
    const double a = std::max(z[i], head), b = std::min(z[i + 1], tip);
    if (b - a <= kDepthTolerance) continue;
    LayerShaft s;
    s.name = layer.name;
    s.kind = layer.kind;
    s.top = a;
    s.bottom = b;
    const std::optional<ShaftMethod> method = shaft_method_for(design, layer.kind);
    if (!method) {
      s.method = "none";
      add_note(notes, "no shaft method for " + std::string(to_string(layer.kind)) + ": " +
                          quoted(layer) + " adds no shaft resistance");
      r.layers.push_back(s);
      continue;
    }
    s.method = to_string(*method);
    s.shaft_method = *method;
    if (is_bored_method(*method) && installation == Installation::driven)
      add_note(notes, std::string("shaft method '") + s.method +
                          "' was developed for drilled shafts; used here on a driven pile");
    const ShaftLimit shaft_cap = shaft_limit(*method, layer, installation);
    const double limit = shaft_cap.value.value_or(INFINITY);
    s.limit = shaft_cap.value;
    s.limit_source = shaft_cap.source;
    s.limit_default = shaft_cap.is_default;
    if (*method == ShaftMethod::lambda) {
      const double penetration = pile.length;
      const double lambda = layer.lambda.value_or(vijayvergiya_focht_lambda(penetration));
      s.lambda = lambda;
      if (!layer.lambda)
        add_note(notes,
                 "lambda shaft: λ = " + format("%.3f", lambda) + " at a penetration of " +
                     length_text(penetration, pile.units) +
                     ", from Vijayvergiya & Focht's (1972) chart, tabulated values from memory");
      double f =
          lambda_unit_shaft(lambda, lambda_stress / lambda_length, lambda_cu / lambda_length);
      if (f > limit) {
        f = limit;
        s.limited = true;
      }
      s.shaft = f * perimeter * (b - a);
    } else {
      std::vector<double> splits;
      if (water) splits.push_back(*water);
      if (stress.critical_depth) splits.push_back(*stress.critical_depth);
      if (*method == ShaftMethod::alpha_fhwa) {
        splits.push_back(head + kAlphaFhwaTopExclusion);
        splits.push_back(tip - pile.width);
        add_note(notes,
                 "alpha-fhwa shaft: the top 1.5 m and the bottom 1 D of the shaft carry no side "
                 "resistance (O'Neill & Reese 1999)");
        if (*layer.undrained_strength / kPa > 2.5)
          add_note(notes,
                   quoted(layer) +
                       ": cu/pa above 2.5, beyond O'Neill & Reese's α (IGM); α held at 0.45");
      }
      bool limited = false;
      const double integral = integrate_split(
          [&](double x) {
            const double f = unit_shaft(*method, layer, x, stress, column, pile, installation);
            if (f > limit) {
              limited = true;
              return limit;
            }
            return f;
          },
          a, b, splits);
      s.shaft = integral * perimeter;
      s.limited = limited;
    }
    if (s.limited)
      r.limits.push_back("unit shaft friction in " + quoted(layer) + " limited to " +
                         pressure_text(limit, u) + " (" + s.limit_source + ")");
    s.unit_average = s.shaft / (perimeter * (b - a));
    s.uplift_factor = layer.uplift_factor.value_or(default_uplift_factor(layer.kind));
    if (!layer.uplift_factor && layer.kind == SoilKind::sand)
      add_note(notes,
               "uplift in sand: shaft resistance in tension taken as 2/3 of that in compression "
               "(common practice, from memory)");
    s.uplift = s.shaft * s.uplift_factor;
    s.phi_shaft = design.phi_shaft.value_or(aashto_phi_shaft(*method, layer.kind, installation));
    s.phi_uplift = design.phi_uplift.value_or(aashto_phi_uplift(*method, layer.kind, installation));
    r.layers.push_back(s);
  }

  // ---- Totals
  double factored_shaft = 0.0, factored_uplift = 0.0;
  for (const LayerShaft& s : r.layers) {
    r.shaft += s.shaft;
    r.uplift_shaft += s.uplift;
    factored_shaft += s.phi_shaft * s.shaft;
    factored_uplift += s.phi_uplift * s.uplift;
  }
  r.ultimate_compression = r.tip + r.shaft;

  // Effective weight: γp above the water table, γp − γw below it (buoyant).
  const double wet_top = water ? std::clamp(*water, head, tip) : tip;
  r.pile_weight = pile.area() * (pile.unit_weight * (wet_top - head) +
                                 (pile.unit_weight - kWaterUnitWeight) * (tip - wet_top));
  r.ultimate_tension = r.uplift_shaft + r.pile_weight;

  // ---- Service: allowable = ultimate / FS
  const double global = design.safety_factor.value_or(kDefaultSafetyCompression);
  r.safety_factor_tip = design.safety_factor_tip.value_or(global);
  r.safety_factor_shaft = design.safety_factor_shaft.value_or(global);
  r.safety_factor_tension = design.safety_factor_tension.value_or(kDefaultSafetyTension);
  if (!design.safety_factor && !(design.safety_factor_tip && design.safety_factor_shaft))
    add_note(notes, "factor of safety in compression 2.5 (default, common practice)");
  if (!design.safety_factor_tension)
    add_note(notes, "factor of safety in tension 3.0 (default, common practice)");
  r.allowable_compression = r.tip / r.safety_factor_tip + r.shaft / r.safety_factor_shaft;
  r.allowable_tension = r.ultimate_tension / r.safety_factor_tension;

  // ---- Strength: factored = φ R
  const std::optional<TipMethod> tip_method = tip_method_for(design, r.tip_details.kind);
  r.phi_tip =
      tip_method
          ? design.phi_tip.value_or(aashto_phi_tip(*tip_method, r.tip_details.kind, installation))
          : 0.0;
  r.factored_compression = r.phi_tip * r.tip + factored_shaft;
  r.factored_tension = factored_uplift;
  r.phi_shaft = r.shaft > 0.0 ? factored_shaft / r.shaft : design.phi_shaft.value_or(0.0);
  r.phi_uplift =
      r.uplift_shaft > 0.0 ? factored_uplift / r.uplift_shaft : design.phi_uplift.value_or(0.0);
  if (!design.phi_tip || !design.phi_shaft || !design.phi_uplift)
    add_note(notes, std::string("resistance factors from AASHTO LRFD Table ") +
                        (!installation_cautions(design).empty()
                             ? "10.5.5.2.3-1 (driven piles) or 10.5.5.2.4-1 (drilled shafts), "
                               "the one that holds each method"
                         : installation == Installation::driven ? "10.5.5.2.3-1 (driven piles)"
                                                                : "10.5.5.2.4-1 (drilled shafts)") +
                        ", from memory; confirm against the edition in force");
  add_note(notes,
           "factored tension excludes the pile's weight, which LRFD counts as a permanent load");
  for (const std::string& limit : r.limits) add_note(notes, "limit governed: " + limit);
  for (auto& caution : installation_cautions(design)) add_note(notes, std::move(caution));
  return r;
}

double depth_table_rows(double longest, double step, double min_length) {
  if (min_length > longest + kDepthTolerance) return 0.0;
  return std::floor((longest + kDepthTolerance - min_length) / step) + 1.0;
}

std::vector<DepthRow> capacity_with_depth(const SoilProfile& profile, PileGeometry pile,
                                          const PileDesign& design, double step,
                                          double min_length) {
  if (!(step > 0.0)) throw std::invalid_argument("capacity with depth: step must be positive");
  if (!(min_length > 0.0))
    throw std::invalid_argument("capacity with depth: minimum length must be positive");
  if (const auto problems = validate_design(profile, pile, design, min_length); !problems.empty())
    throw std::invalid_argument(problems.front());
  std::vector<DepthRow> rows;
  const double longest = profile.depth() - pile.head_depth;
  if (depth_table_rows(longest, step, min_length) > static_cast<double>(kMaxDepthRows))
    throw std::invalid_argument("capacity with depth: more than " +
                                std::to_string(kMaxDepthRows) + " rows; use a longer step");
  for (int i = 0;; ++i) {
    pile.length = min_length + i * step;
    if (pile.length > longest + kDepthTolerance) break;
    const CapacityResult r = pile_capacity(profile, pile, design);
    const TipDetails& t = r.tip_details;
    std::string note = t.transition_short;
    if (t.limited)
      note += (note.empty() ? "" : "; ") + std::string("tip at its limit (") +
              (t.limit_default ? "default" : t.governed_by.rfind("max_unit_tip", 0) == 0
                                                 ? "max_unit_tip"
                                                 : "method's") +
              ")";
    rows.push_back({pile.length, pile.tip_depth(), r.tip, r.shaft, r.ultimate_compression,
                    r.ultimate_tension, note});
    rows.back().allowable_compression = r.allowable_compression;
    rows.back().allowable_tension = r.allowable_tension;
    rows.back().factored_compression = r.factored_compression;
    rows.back().factored_tension = r.factored_tension;
  }
  return rows;
}

}  // namespace cairn
