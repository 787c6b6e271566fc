// methods.cpp — the tables of tip, shaft and efficiency methods (see methods.hpp).
#include "cairn/geotechnics/methods.hpp"

#include <stdexcept>

namespace cairn {

namespace {

constexpr LayerInput kSoilModulus{"soil_modulus", &SoilLayer::soil_modulus};
constexpr LayerInput kSptN60{"spt_n60", &SoilLayer::spt_n60};
constexpr LayerInput kShaftK{"shaft_k", &SoilLayer::shaft_k};
constexpr LayerInput kShaftDelta{"shaft_delta", &SoilLayer::shaft_delta};

constexpr Installation kDriven = Installation::driven;
constexpr Installation kBored = Installation::bored;

// φ for both kinds of soil.
constexpr PhiBySoil both(double phi) { return {phi, phi}; }

}  // namespace

// Resistance factors, AASHTO LRFD Table 10.5.5.2.3-1 (driven piles), from memory: end
// bearing in clay (Skempton) 0.40; SPT methods 0.30; sand tips by φ (Vesić, Meyerhof) take
// the φ-based static analysis row (Nordlund/Thurman) 0.45, the table having no Vesić row.
// Table 10.5.5.2.4-1 (drilled shafts), from memory: tip in clay 0.40, in sand 0.50.
const std::vector<TipMethodInfo>& tip_methods() {
  // One row a method, laid out by hand.
  // clang-format off
  static const std::vector<TipMethodInfo> table = {
      {TipMethod::vesic, "vesic", true, true, {}, {kSoilModulus}, true, kDriven,
       {0.40, 0.45}, {0.40, 0.45}, "q_p = cu·N*c", "q_p = σ'o·N*σ", "Vesić 1977"},
      {TipMethod::meyerhof, "meyerhof", true, true, {}, {}, false, kDriven,
       {0.40, 0.45}, {0.40, 0.45}, "q_p = 9·cu", "q_p = q'·N*q", "Meyerhof 1976"},
      {TipMethod::meyerhof_spt, "meyerhof-spt", false, true, {}, {kSptN60}, false, kDriven,
       {0.40, 0.30}, {0.40, 0.30}, "", "q_p = 0.4·pa·N60·Db/D", "Meyerhof 1976"},
      {TipMethod::fhwa, "fhwa", true, true, {}, {kSptN60}, true, kBored,
       {0.40, 0.30}, {0.40, 0.50}, "q_p = N*c·cu", "q_p = 0.6·N60 tsf", "O'Neill & Reese 1999"},
  };
  // clang-format on
  return table;
}

// Own limits on the unit shaft friction (from memory): beta-fhwa 2 tsf (O'Neill & Reese
// 1999); meyerhof-spt 1 tsf on driven piles (Meyerhof 1976; FHWA-HI-97-013 quotes it as
// 2 ksf). Beta and meyerhof-spt on bored piles take 1 tsf in sand by default.
// Shaft, AASHTO LRFD Table 10.5.5.2.3-1 (driven piles), from memory: compression α 0.35,
// β 0.25, λ 0.40, SPT 0.30; tension α 0.25, β 0.20, λ 0.30, SPT 0.25. Table 10.5.5.2.4-1
// (drilled shafts), from memory: side in clay 0.45, in sand 0.55; tension clay 0.35, sand
// 0.45.
const std::vector<ShaftMethodInfo>& shaft_methods() {
  // One row a method, laid out by hand.
  // clang-format off
  static const std::vector<ShaftMethodInfo> table = {
      {ShaftMethod::beta, "beta", true, true, {kShaftK, kShaftDelta}, kDriven, both(0.25),
       both(0.25), both(0.20), both(0.20), "f = K·σ'v·tan δ", "effective-stress (β) method",
       {}, {}, "", true},
      {ShaftMethod::alpha_api, "alpha-api", true, false, {}, kDriven, both(0.35), both(0.35),
       both(0.25), both(0.25),
       "f = α·cu, α = 0.5·ψ^−0.5 (ψ ≤ 1) or 0.5·ψ^−0.25 (ψ > 1) ≤ 1, ψ = cu/σ'v", "API RP 2GEO",
       {}, {}, "", false},
      {ShaftMethod::alpha_fhwa, "alpha-fhwa", true, false, {}, kBored, both(0.35), {0.45, 0.55},
       both(0.25), {0.35, 0.45}, "f = α·cu, α = 0.55 (cu/pa ≤ 1.5), 0.55 − 0.1·(cu/pa − 1.5)",
       "O'Neill & Reese 1999", {}, {}, "", false},
      {ShaftMethod::lambda, "lambda", true, false, {}, kDriven, both(0.40), both(0.40),
       both(0.30), both(0.30), "f = λ·(σ̄'v + 2·c̄u)", "Vijayvergiya & Focht 1972",
       {}, {}, "", false},
      {ShaftMethod::beta_fhwa, "beta-fhwa", false, true, {kSptN60}, kBored, both(0.25),
       {0.45, 0.55}, both(0.20), {0.35, 0.45}, "f = β·σ'v, β = 1.5 − 0.245·√z, 0.25 ≤ β ≤ 1.2",
       "O'Neill & Reese 1999", 2.0 * kTsf, 2.0 * kTsf, "O'Neill & Reese (1999) limit 2 tsf",
       false},
      {ShaftMethod::meyerhof_spt, "meyerhof-spt", false, true, {kSptN60}, kDriven, both(0.30),
       both(0.30), both(0.25), both(0.25), "f = pa·N60/50 (driven) or pa·N60/100 (bored)",
       "Meyerhof 1976", 1.0 * kTsf, std::nullopt, "Meyerhof (1976) limit 1 tsf for driven piles",
       true},
  };
  // clang-format on
  return table;
}

const std::vector<EfficiencyMethodInfo>& efficiency_methods() {
  // One row a method, laid out by hand.
  // clang-format off
  static const std::vector<EfficiencyMethodInfo> table = {
      {EfficiencyMethod::none, "none", false, "η = 1", "no reduction for group action"},
      {EfficiencyMethod::converse_labarre, "converse-labarre", true,
       "η = 1 − θ[(n1−1)n2 + (n2−1)n1]/(90 n1 n2), θ = atan(D/s) in degrees",
       "Converse–Labarre formula"},
      {EfficiencyMethod::los_angeles, "los-angeles", true,
       "η = 1 − D/(π s m n)·[m(n−1) + n(m−1) + √2 (m−1)(n−1)]",
       "Los Angeles Group Action formula"},
      {EfficiencyMethod::feld, "feld", true,
       "each pile loses 1/16 of its capacity per adjacent pile (orthogonal or diagonal)",
       "Feld 1943"},
      {EfficiencyMethod::block_perimeter, "block-perimeter", true,
       "η = min(1, 2(Bg + Lg)/(n·p)), p the perimeter of one pile",
       "Das, Principles of Foundation Engineering"},
  };
  // clang-format on
  return table;
}

const TipMethodInfo& method_info(TipMethod method) {
  for (const auto& row : tip_methods())
    if (row.method == method) return row;
  throw std::logic_error("internal error: tip method without a row in the method table");
}

const ShaftMethodInfo& method_info(ShaftMethod method) {
  for (const auto& row : shaft_methods())
    if (row.method == method) return row;
  throw std::logic_error("internal error: shaft method without a row in the method table");
}

const EfficiencyMethodInfo& method_info(EfficiencyMethod method) {
  for (const auto& row : efficiency_methods())
    if (row.method == method) return row;
  throw std::logic_error("internal error: efficiency method without a row in the method table");
}

namespace {

template <class Table>
auto find_in(const Table& table, std::string_view name)
    -> std::optional<decltype(table.front().method)> {
  for (const auto& row : table)
    if (name == row.name) return row.method;
  return std::nullopt;
}

template <class Table>
auto choices_of(const Table& table) {
  std::map<std::string, decltype(table.front().method)> choices;
  for (const auto& row : table) choices.emplace(row.name, row.method);
  return choices;
}

}  // namespace

std::optional<TipMethod> find_tip_method(std::string_view name) {
  return find_in(tip_methods(), name);
}
std::optional<ShaftMethod> find_shaft_method(std::string_view name) {
  return find_in(shaft_methods(), name);
}
std::optional<EfficiencyMethod> find_efficiency_method(std::string_view name) {
  return find_in(efficiency_methods(), name);
}

std::map<std::string, TipMethod> tip_method_choices() { return choices_of(tip_methods()); }
std::map<std::string, ShaftMethod> shaft_method_choices() { return choices_of(shaft_methods()); }

std::vector<std::string> efficiency_method_names() {
  std::vector<std::string> names;
  for (const auto& row : efficiency_methods()) names.emplace_back(row.name);
  return names;
}

}  // namespace cairn
