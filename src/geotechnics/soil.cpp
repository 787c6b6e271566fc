// soil.cpp — the soil column (layers, water, stresses with depth), names of the soil and
// design enumerations, and the profile's total depth.
#include "cairn/geotechnics/soil.hpp"

#include <algorithm>
#include <cstdio>
#include <stdexcept>

#include "cairn/core/enum_names.hpp"
#include "cairn/core/units.hpp"
#include "cairn/geotechnics/methods.hpp"

namespace cairn {

namespace {

std::string quoted(const SoilLayer& layer) { return "layer '" + layer.name + "'"; }

}  // namespace

SoilColumn::SoilColumn(const SoilProfile& profile) : profile_(profile) {
  if (profile.layers.empty()) throw std::invalid_argument("the soil profile has no layers");
  boundaries_.push_back(0.0);
  for (const SoilLayer& layer : profile.layers) {
    if (!(layer.thickness > 0.0))
      throw std::invalid_argument(quoted(layer) + ": thickness must be positive");
    boundaries_.push_back(boundaries_.back() + layer.thickness);
  }
}

bool SoilColumn::contains(double z) const {
  return z >= -kBoundaryTolerance && z <= depth() + kBoundaryTolerance;
}

// The boundary rule: z within the tolerance of the top of layer i belongs to layer i.
std::size_t SoilColumn::layer_at(double z) const {
  for (std::size_t i = size(); i-- > 1;)
    if (z >= boundaries_[i] - kBoundaryTolerance) return i;
  return 0;
}

std::optional<double> SoilColumn::water_level() const {
  if (!profile_.water_table) return std::nullopt;
  return std::max(*profile_.water_table, 0.0);
}

bool SoilColumn::below_water(double z) const {
  const std::optional<double> water = water_level();
  return water && z > *water + kBoundaryTolerance;
}

std::optional<double> SoilColumn::unit_weight(std::size_t i, bool below) const {
  const SoilLayer& l = layer(i);
  const std::optional<double>& own = below ? l.saturated_unit_weight : l.unit_weight;
  const std::optional<double>& other = below ? l.unit_weight : l.saturated_unit_weight;
  return own ? own : other;
}

std::optional<std::string> SoilColumn::weight_substitution(std::size_t i, bool below) const {
  const SoilLayer& l = layer(i);
  if (below && !l.saturated_unit_weight && l.unit_weight)
    return quoted(l) + ": no saturated_unit_weight, unit_weight used below the water table";
  if (!below && !l.unit_weight && l.saturated_unit_weight)
    return quoted(l) + ": no unit_weight, saturated_unit_weight used above the water table";
  return std::nullopt;
}

std::vector<std::string> SoilColumn::weight_substitutions(double z) const {
  std::vector<std::string> notes;
  for (const Piece& p : pieces(0.0, std::min(z, depth()), true))
    if (auto note = weight_substitution(p.layer, p.below_water);
        note && std::find(notes.begin(), notes.end(), *note) == notes.end())
      notes.push_back(*note);
  return notes;
}

// σv = Σ γ·Δz over the pieces above z, γ by the weights rule.
double SoilColumn::total_stress(double z) const {
  if (!contains(z)) {
    char text[64];
    std::snprintf(text, sizeof text, "%.3f", z);
    throw std::invalid_argument(std::string("depth ") + text + " m lies outside the soil profile");
  }
  double sigma = 0.0;
  for (const Piece& p : pieces(0.0, std::clamp(z, 0.0, depth()), true)) {
    const std::optional<double> gamma = unit_weight(p.layer, p.below_water);
    if (!gamma)
      throw std::invalid_argument(quoted(layer(p.layer)) +
                                  ": needs unit_weight or saturated_unit_weight");
    sigma += *gamma * (p.bottom - p.top);
  }
  return sigma;
}

double SoilColumn::pore_pressure(double z) const {
  const std::optional<double> water = water_level();
  return water ? kWaterUnitWeight * std::max(0.0, z - *water) : 0.0;
}

double SoilColumn::effective_stress(double z) const { return total_stress(z) - pore_pressure(z); }

std::vector<SoilColumn::Piece> SoilColumn::pieces(double from, double to,
                                                  bool split_at_water) const {
  std::vector<double> cuts{from, to};
  for (double z : boundaries_)
    if (z > from + kBoundaryTolerance && z < to - kBoundaryTolerance) cuts.push_back(z);
  const std::optional<double> water = water_level();
  if (split_at_water && water && *water > from + kBoundaryTolerance &&
      *water < to - kBoundaryTolerance)
    cuts.push_back(*water);
  std::sort(cuts.begin(), cuts.end());
  std::vector<Piece> result;
  for (std::size_t i = 1; i < cuts.size(); ++i) {
    if (cuts[i] - cuts[i - 1] <= 0.0) continue;
    const double mid = 0.5 * (cuts[i - 1] + cuts[i]);
    result.push_back({layer_at(mid), cuts[i - 1], cuts[i], below_water(mid)});
  }
  return result;
}

std::vector<SoilColumn::Span> SoilColumn::spans(double from, double to) const {
  std::vector<Span> result;
  for (const Piece& p : pieces(from, to, false)) result.push_back({p.layer, p.top, p.bottom});
  return result;
}

double SoilProfile::depth() const {
  double total = 0.0;
  for (const SoilLayer& layer : layers) total += layer.thickness;
  return total;
}

// Names in the order the enum declares its values (enum_names.hpp).
constexpr const char* kSoilKindNames[] = {"clay", "sand"};
const char* to_string(SoilKind kind) { return name_in(kSoilKindNames, kind); }

constexpr const char* kInstallationNames[] = {"driven", "bored"};
const char* to_string(Installation installation) {
  return name_in(kInstallationNames, installation);
}

// The names are the ones written in a project file (tip_method: vesic), from the method
// tables (methods.hpp).
const char* to_string(TipMethod method) { return method_info(method).name; }

const char* to_string(ShaftMethod method) { return method_info(method).name; }

}  // namespace cairn
