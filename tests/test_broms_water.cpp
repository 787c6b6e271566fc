// Tests of the effective unit weight fed to Broms' (1964b) cohesionless solution by
// lateral_capacities (project_capacity.hpp): γ' averaged over the depth the mechanism
// mobilizes, from the profile's layers and water table. Tag [lateral].
#include <catch2/catch.hpp>
#include <cmath>
#include <string>

#include "cairn/geotechnics/project_capacity.hpp"
#include "cairn/core/units.hpp"

using namespace cairn;

namespace {

SoilLayer sand(double thickness, double gamma, double gamma_sat) {
  SoilLayer layer;
  layer.name = "sand";
  layer.kind = SoilKind::sand;
  layer.thickness = thickness;
  layer.unit_weight = gamma;
  layer.saturated_unit_weight = gamma_sat;
  layer.friction_angle = 30.0;  // Kp = tan²(60°) = 3
  return layer;
}

// One round pile type, D = 0.5 m, L = 5 m, free (pinned) head at the ground. Broms needs a
// yield moment; the default 1e6 kN·m is far above any short-pile moment here, so the short
// (rigid) mechanism governs, as the hand calculations assume.
Project project_with(SoilProfile soil, std::optional<double> yield_moment = 1e6) {
  Project p;
  p.cap.depth = 0.0;
  p.soil = std::move(soil);
  PileType type;
  type.id = "P";
  type.section.shape = SectionShape::round;
  type.section.width = 0.5;
  type.length = 5.0;
  type.head = HeadFixity::pinned;
  if (yield_moment) {
    type.structure = Structure{};
    type.structure->yield_moment = yield_moment;
  }
  p.pile_types.push_back(type);
  return p;
}

// Broms (1964b), short free-head pile in cohesionless soil, e = 0: H = 0.5·γ'·D·L³·Kp/L.
double short_free_head(double gamma) { return 0.5 * gamma * 0.5 * 125.0 * 3.0 / 5.0; }

}  // namespace

TEST_CASE("broms water: the water table 0.5 m below the head is averaged over the pile",
          "[lateral][published]") {
  SoilProfile soil;
  soil.water_table = 0.5;
  soil.layers = {sand(20.0, 18.0, 20.0)};
  const auto lateral = lateral_capacities(project_with(soil));
  REQUIRE(lateral[0]);
  // Short pile: the soil reacts along the whole 5 m. γ' = [18·0.5 + (20 − 9.81)·4.5]/5 =
  // 10.971 kN/m³; H = 0.5·10.971·0.5·5³·3/5 = 205.70 kN (Broms 1964b; hand calculation).
  // The dry weight alone gave 337.5 kN (+64 %).
  const double gamma = (18.0 * 0.5 + (20.0 - kWaterUnitWeight) * 4.5) / 5.0;
  CHECK(lateral[0]->ultimate == Approx(short_free_head(gamma)).epsilon(1e-9));
  CHECK(lateral[0]->ultimate == Approx(205.70).epsilon(1e-4));
  CHECK(lateral[0]->method.find("γ' = 10.97 kN/m³ averaged over the top 5.00 m (the embedded "
                                "length)") != std::string::npos);
}

TEST_CASE("broms water: dry and submerged profiles keep their single unit weight",
          "[lateral][published]") {
  SoilProfile soil;
  soil.layers = {sand(20.0, 18.0, 20.0)};
  SECTION("no water: γ' = γ = 18") {
    const auto lateral = lateral_capacities(project_with(soil));
    REQUIRE(lateral[0]);
    CHECK(lateral[0]->ultimate == Approx(short_free_head(18.0)).epsilon(1e-9));  // 337.5 kN
  }
  SECTION("water at the head: γ' = γsat − γw = 10.19") {
    soil.water_table = 0.0;
    const auto lateral = lateral_capacities(project_with(soil));
    REQUIRE(lateral[0]);
    CHECK(lateral[0]->ultimate == Approx(short_free_head(20.0 - kWaterUnitWeight)).epsilon(1e-9));
  }
}

TEST_CASE("broms water: layered sand takes the layers' unit weights", "[lateral][published]") {
  // 2 m at γ = 16 over γ = 20, dry: γ' = (16·2 + 20·3)/5 = 18.4 kN/m³ over the 5 m pile;
  // H = 0.5·18.4·0.5·125·3/5 = 345.0 kN (Broms 1964b; hand calculation).
  SoilProfile soil;
  soil.layers = {sand(2.0, 16.0, 18.0), sand(18.0, 20.0, 21.0)};
  const auto lateral = lateral_capacities(project_with(soil));
  REQUIRE(lateral[0]);
  CHECK(lateral[0]->ultimate == Approx(345.0).epsilon(1e-9));
}

TEST_CASE("broms water: a long pile averages down to its maximum moment", "[lateral]") {
  // Long free-head pile, e = 0 (Broms 1964b): H·(2/3)·f = My, f = √[H/(1.5·γ'·D·Kp)], with
  // γ' = [18·0.5 + 10.19·(f − 0.5)]/f averaged over the top f. Checked as a fixed point: the
  // H found satisfies both equations (hand calculation of the consistency).
  SoilProfile soil;
  soil.water_table = 0.5;
  soil.layers = {sand(20.0, 18.0, 20.0)};
  const double my = 60.0;  // kN·m: short-pile moment at 205.7 kN is far above, so long
  const auto lateral = lateral_capacities(project_with(soil, my));
  REQUIRE(lateral[0]);
  REQUIRE(lateral[0]->method.find("long pile") != std::string::npos);
  const double h = lateral[0]->ultimate;
  // Two unknowns (f, γ'): solve by fixed-point iteration here independently.
  double gamma = 18.0, f = 0.0;
  for (int i = 0; i < 200; ++i) {
    f = std::sqrt(h / (1.5 * gamma * 0.5 * 3.0));
    gamma = f > 0.5 ? (18.0 * 0.5 + (20.0 - kWaterUnitWeight) * (f - 0.5)) / f : 18.0;
  }
  CHECK(h * 2.0 / 3.0 * f == Approx(my).epsilon(1e-5));
  CHECK(lateral[0]->method.find("(to the maximum moment)") != std::string::npos);
}
