// Tests for capacity_report.hpp: the `cairn capacity` outputs (text, Markdown, CSV, JSON) of
// computed single-pile capacities, in the project's units. The numbers printed are the
// capacity module's; what is checked here is that each output shows them, converted and
// labelled in the project's units, and that the sums printed add up (hand-derived:
// ultimate = tip + shaft, tension = shaft in tension + effective weight).
#include <catch2/catch.hpp>

#include <sstream>
#include <string>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include "cairn/core/units.hpp"
#include "cairn/geotechnics/project_capacity.hpp"
#include "cairn/input/input.hpp"
#include "cairn/output/capacity_report.hpp"
#include "support.hpp"

using namespace cairn;
using cairn::test::close;
using cairn::test::contains;

namespace {

// The SI fixture: clay over sand, Vesić tip, API α and β shaft, with a depth table.
struct Soil {
  Project project = read_project(std::string(CAIRN_TEST_DATA) + "/e2e/soil.yaml");
  std::vector<PileTypeCapacity> capacities = compute_capacities(project, 1.0, 10.0);
};

std::size_t lines_starting(const std::string& text, const std::string& start) {
  std::size_t n = 0;
  std::istringstream in(text);
  for (std::string line; std::getline(in, line);)
    if (line.rfind(start, 0) == 0) ++n;
  return n;
}

}  // namespace

TEST_CASE("capacity_report: text shows the layers, the tip and sums that add up",
          "[capacity_report]") {
  Soil s;
  REQUIRE(s.capacities.size() == 1);
  const CapacityResult& r = s.capacities[0].result;
  const std::string text = render_capacities(s.project, s.capacities, Format::text, "capacity");
  CHECK(contains(text, "Pile type PC45: driven, square 0.45 m, length 18.00 m"));
  CHECK(contains(text, "Shaft resistance by layer"));
  for (const auto& layer : r.layers) {
    INFO(layer.name);
    CHECK(contains(text, layer.name));
    CHECK(contains(text, layer.method));
  }
  CHECK(contains(text, "Tip: method vesic in 'dense sand'"));
  CHECK(
      contains(text, fmt::format("Ultimate compression = tip + shaft = {:.1f} + {:.1f} = {:.1f} kN",
                                 r.tip, r.shaft, r.ultimate_compression)));
  CHECK(r.ultimate_compression == close(r.tip + r.shaft, 1e-12));
  CHECK(contains(text, fmt::format("Ultimate tension = shaft in tension + effective pile weight = "
                                   "{:.1f} + {:.1f} = {:.1f} kN",
                                   r.uplift_shaft, r.pile_weight, r.ultimate_tension)));
  CHECK(contains(text, "Capacity with depth (ultimate, allowable and factored)"));
  for (const auto& note : r.notes) CHECK(contains(text, "Note: " + note));
  CHECK(text.substr(text.size() - std::string(kCaution).size() - 1) ==
        std::string(kCaution) + "\n");
}

TEST_CASE("capacity_report: Markdown and CSV carry the same table", "[capacity_report]") {
  Soil s;
  const auto& table = s.capacities[0].depth_table;
  REQUIRE(table.size() > 3);
  const std::string md = render_capacities(s.project, s.capacities, Format::markdown, "capacity");
  CHECK(md.rfind("# Pile capacity: Soil cap", 0) == 0);
  CHECK(contains(md, "## Pile type PC45"));
  CHECK(contains(md, "_" + std::string(kCaution) + "_"));
  // The depth table: a header, a rule and one row per length (the layer table has fewer).
  CHECK(lines_starting(md, "| ") >= table.size() + 2);

  const std::string csv = render_capacities(s.project, s.capacities, Format::csv, "capacity");
  CHECK(csv.rfind("pile type,length (m),tip depth (m),", 0) == 0);
  CHECK(lines_starting(csv, "PC45,") == table.size());
  CHECK(contains(csv, fmt::format("PC45,{:.2f},", table.front().length)));
  CHECK(contains(csv, "# " + std::string(kCaution)));
  for (const auto& note : s.capacities[0].result.notes)
    CHECK(contains(csv, "# PC45: note: " + note));
}

TEST_CASE("capacity_report: JSON holds the result's values and the method's details",
          "[capacity_report]") {
  Soil s;
  const CapacityResult& r = s.capacities[0].result;
  const nlohmann::json doc = capacities_json(s.project, s.capacities, "capacity");
  CHECK(doc["units"]["system"] == "SI");
  CHECK(doc["caution"] == kCaution);
  REQUIRE(doc["pile_types"].size() == 1);
  const auto& type = doc["pile_types"][0];
  CHECK(type["id"] == "PC45");
  CHECK(type["tip"].get<double>() == close(r.tip, 1e-12));
  CHECK(type["shaft"].get<double>() == close(r.shaft, 1e-12));
  CHECK(type["ultimate"].get<double>() == close(r.ultimate_compression, 1e-12));
  CHECK(type["tip_details"]["method"] == "vesic");
  CHECK(type["tip_details"]["layer"] == "dense sand");
  CHECK(type["tip_details"]["N_sigma"].get<double>() == close(*r.tip_details.n_sigma, 1e-12));
  CHECK(type["layers"].size() == r.layers.size());
  CHECK(type["depth_table"].size() == s.capacities[0].depth_table.size());
  CHECK(type["factors"]["phi_tip"].get<double>() == r.phi_tip);
}

TEST_CASE("capacity_report: a US project prints kip, ft and ksf", "[capacity_report]") {
  const Project project = read_project(std::string(CAIRN_DEMO_DIR) + "/conveyor-pier-us/cap.yaml");
  const auto capacities = compute_capacities(project, 5.0 * 0.3048, 20.0 * 0.3048);
  REQUIRE_FALSE(capacities.empty());
  const CapacityResult& r = capacities[0].result;
  const std::string text = render_capacities(project, capacities, Format::text, "capacity");
  CHECK(contains(text, "mean unit (ksf)"));
  CHECK(contains(text, "shaft (kip)"));
  CHECK(contains(text, "length (ft)"));
  // 1 kip = 4.4482216152605 kN (NIST SP 811 (2008), Appendix B).
  const double kip = 4.4482216152605;
  CHECK(contains(text,
                 fmt::format("Ultimate compression = tip + shaft = {:.2f} + {:.2f} = {:.2f} kip",
                             r.tip / kip, r.shaft / kip, r.ultimate_compression / kip)));
  const nlohmann::json doc = capacities_json(project, capacities, "capacity");
  CHECK(doc["units"]["force"] == "kip");
  CHECK(doc["pile_types"][0]["ultimate"].get<double>() ==
        close(r.ultimate_compression / kip, 1e-12));
}

TEST_CASE("capacity_report: a project without computed capacities says so", "[capacity_report]") {
  const Project project = read_project(std::string(CAIRN_TEST_DATA) + "/e2e/pass.yaml");
  const std::string text = render_capacities(project, {}, Format::text, "capacity");
  CHECK(contains(text, "No pile type asks for a computed capacity"));
  CHECK(contains(text, kCaution));
}
