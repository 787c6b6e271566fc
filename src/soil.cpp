// soil.cpp — names of the soil and design enumerations, and the profile's total depth.
#include "cairn/soil.hpp"

namespace cairn {

double SoilProfile::depth() const {
  double total = 0.0;
  for (const SoilLayer& layer : layers) total += layer.thickness;
  return total;
}

const char* to_string(SoilKind kind) {
  switch (kind) {
    case SoilKind::clay: return "clay";
    case SoilKind::sand: return "sand";
  }
  return "?";
}

const char* to_string(Installation installation) {
  switch (installation) {
    case Installation::driven: return "driven";
    case Installation::bored: return "bored";
  }
  return "?";
}

// The names are the ones written in a project file (tip_method: vesic).
const char* to_string(TipMethod method) {
  switch (method) {
    case TipMethod::vesic: return "vesic";
    case TipMethod::meyerhof: return "meyerhof";
    case TipMethod::meyerhof_spt: return "meyerhof-spt";
    case TipMethod::fhwa: return "fhwa";
  }
  return "?";
}

const char* to_string(ShaftMethod method) {
  switch (method) {
    case ShaftMethod::beta: return "beta";
    case ShaftMethod::alpha_api: return "alpha-api";
    case ShaftMethod::alpha_fhwa: return "alpha-fhwa";
    case ShaftMethod::lambda: return "lambda";
    case ShaftMethod::beta_fhwa: return "beta-fhwa";
    case ShaftMethod::meyerhof_spt: return "meyerhof-spt";
  }
  return "?";
}

}  // namespace cairn
