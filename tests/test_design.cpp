// Tests of the layout search (design/search.hpp, layouts.hpp), its reader (read_design.hpp)
// and the chosen file (chosen_file.hpp). Fixtures in tests/data/design/.
//
// The search is checked against an exhaustive enumeration: every layout the families give,
// at every length of the grid, run through the full check of `cairn check`; the cheapest
// passing one must be the search's answer. The written file must give the search's numbers
// exactly when it is read and checked again.
#include <catch2/catch.hpp>
#include <fmt/format.h>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <limits>
#include <string>

#include "cairn/app/analysis.hpp"
#include "cairn/app/design_command.hpp"
#include "cairn/design/search.hpp"
#include "cairn/input/chosen_file.hpp"
#include "cairn/input/input.hpp"
#include "cairn/input/read_design.hpp"

using namespace cairn;

namespace {

const std::string kData = std::string(CAIRN_TEST_DATA) + "/design/";

struct Read {
  Project project;
  DesignSpec spec;
};

Read read(const std::string& name) {
  Read r;
  r.project = read_project(kData + name, Piles::optional);
  r.spec = read_design(kData + name, r.project);
  return r;
}

// The cheapest layout over every layout × length, each checked in full (no screen).
std::optional<double> brute_force_cost(const Read& r, const std::vector<double>& lengths,
                                       double thickness) {
  std::optional<double> best;
  for (std::size_t t : r.spec.pile_types) {
    LayoutCounts counts;
    for (const auto& layout :
         generate_layouts(r.project, r.spec, t, resultant_point(r.project), counts))
      for (double length : lengths) {
        Candidate c;
        c.layout = layout;
        c.length = length;
        c.thickness = thickness;
        c.cap_volume = layout.outline.area() * thickness;
        c.cost = candidate_cost(r.project, r.spec, layout.piles.size(), length, c.cap_volume);
        if (best && c.cost >= *best) continue;
        try {
          const CheckRun run = analyse(candidate_project(r.project, r.spec, c));
          if (run.results.summary.pass) best = c.cost;
        } catch (const InputError&) {
          // A load the layout cannot resist at all (a moment on two piles in line): fails.
        }
      }
  }
  return best;
}

}  // namespace

TEST_CASE("design: typed-in capacities need n = ceil(P / Qa) piles", "[design]") {
  const Read r = read("typed.yaml");
  const DesignOutcome o = search_layouts(r.project, r.spec, 2);
  REQUIRE(!o.best.empty());
  // Hand-derived: 1900 kN over piles of 500 kN allowable needs n ≥ 3.8, so 4 piles at 1000
  // each; a centric load on a symmetric group gives P/n = 475 kN, utilization 0.95.
  CHECK(o.best.front().layout.piles.size() == 4);
  CHECK(o.best.front().cost == Approx(4000.0));
  CHECK(o.best.front().max_utilization == Approx(0.95).epsilon(1e-9));
  CHECK(o.best.front().checked_fully);
}

TEST_CASE("design: the search finds the optimum of an exhaustive enumeration", "[design]") {
  SECTION("typed-in capacities, one length") {
    const Read r = read("typed.yaml");
    const DesignOutcome o = search_layouts(r.project, r.spec, 2);
    const auto cost = brute_force_cost(r, {r.project.pile_types[0].length}, r.project.cap.thickness);
    REQUIRE(cost);
    REQUIRE(!o.best.empty());
    CHECK(o.best.front().cost == Approx(*cost).epsilon(1e-12));
  }
  SECTION("capacities from the soil, lengths 8 to 14 m, fixed thickness") {
    Read r = read("soil.yaml");
    r.spec.thickness.reset();  // the cap's own 1.2 m, so the enumeration needs no rule
    const DesignOutcome o = search_layouts(r.project, r.spec, 2);
    const auto cost = brute_force_cost(r, {8, 9, 10, 11, 12, 13, 14}, r.project.cap.thickness);
    REQUIRE(cost);
    REQUIRE(!o.best.empty());
    CHECK(o.best.front().cost == Approx(*cost).epsilon(1e-12));
  }
}

namespace {

// Searches `name`, writes the best layout as --write does, reads it back and checks it.
void check_round_trip(const std::string& name) {
  const Read r = read(name);
  const DesignOutcome o = search_layouts(r.project, r.spec, 2);
  REQUIRE(!o.best.empty());
  const Candidate& best = o.best.front();
  // The candidate's project is the one the full check ran on.
  const CheckRun direct = analyse(candidate_project(r.project, r.spec, best));
  CHECK(direct.results.summary.max_utilization == best.max_utilization);
  // Written as cairn design --write writes it, read again and checked.
  const ChosenLayout chosen = chosen_layout(r.project, kData + name, best);
  const auto dir = std::filesystem::temp_directory_path() / "cairn-test-design";
  std::filesystem::create_directories(dir);
  const auto path = (dir / "best.yaml").string();
  {
    std::ofstream out(path);
    out << chosen_project_text(kData + name, path, chosen);
  }
  const CheckRun again = analyse_project(path);
  CHECK(again.results.summary.pass);
  CHECK(again.results.summary.max_utilization == best.max_utilization);
  REQUIRE(again.results.combinations.size() == direct.results.combinations.size());
  for (std::size_t k = 0; k < again.results.combinations.size(); ++k)
    for (std::size_t p = 0; p < again.results.combinations[k].piles.size(); ++p)
      CHECK(again.results.combinations[k].piles[p].axial ==
            direct.results.combinations[k].piles[p].axial);
  std::filesystem::remove_all(dir);
}

}  // namespace

TEST_CASE("design: the written file reproduces the search's numbers exactly", "[design]") {
  SECTION("SI, capacities from the soil, a thickness rule, loads on top of the cap") {
    check_round_trip("soil.yaml");
  }
  SECTION("US units: coordinates in ft converted as the reader converts them") {
    check_round_trip("us.yaml");
  }
  SECTION("US units, the cap's outline fixed as the file gives it") {
    check_round_trip("us_fixed.yaml");
  }
}

TEST_CASE("design: piles too short for the load are explained, not an empty table", "[design]") {
  const Read r = read("too_short.yaml");
  const DesignOutcome o = search_layouts(r.project, r.spec, 2);
  CHECK(o.best.empty());
  REQUIRE(!o.rejected.empty());
  CHECK(o.rejected.front().first ==
        "pile capacity: no length up to design.length.max carries the load");
  REQUIRE(o.closest_utilization);
  CHECK(*o.closest_utilization > 1.0);
}

TEST_CASE("design: contradictory limits and unknown names are located input errors", "[design]") {
  const std::string file = kData + "bad_spacing.yaml";
  const Project p = read_project(file, Piles::optional);
  try {
    read_design(file, p);
    FAIL("expected an InputError");
  } catch (const InputError& e) {
    std::vector<std::string> messages;
    for (const auto& d : e.diagnostics()) messages.push_back(d.format());
    REQUIRE(messages.size() == 3);
    CHECK(messages[0] == file + ":16:21: error: design.pile_types: pile type 'P45' does not "
                               "exist; did you mean 'P40'?");
    CHECK(messages[1] == file + ":17:12: error: design.spacing: the smallest spacing (4 pile "
                               "widths) is larger than the largest (3); no layout can meet both");
    CHECK(messages[2] == file + ":18:26: error: design.cost.per_pille: unknown key; did you "
                               "mean 'per_pile'?");
  }
}

TEST_CASE("design: check needs the piles a design file may leave out", "[design]") {
  CHECK_THROWS_AS(read_project(kData + "typed.yaml"), InputError);
  CHECK_NOTHROW(read_project(kData + "typed.yaml", Piles::optional));
}

TEST_CASE("design: layouts keep the spacing limits and the outline", "[design]") {
  const Read r = read("soil.yaml");
  LayoutCounts counts;
  const auto layouts = generate_layouts(r.project, r.spec, 0, {0.0, 0.0}, counts);
  REQUIRE(!layouts.empty());
  const double width = 0.45;
  for (const auto& l : layouts) {
    if (l.piles.size() > 1) {
      CHECK(l.spacing >= 3.0 * width - 1e-9);
      CHECK(l.spacing <= 3.5 * width + 1e-9);
    }
    for (const auto& q : l.outline.polygon) {
      CHECK(std::abs(q[0]) <= 3.0 + 1e-6);  // inside the 6 m × 6 m cap.outline
      CHECK(std::abs(q[1]) <= 3.0 + 1e-6);
    }
    // Pile face to the cap's edge at least the group check's 0.225 m (common practice,
    // AASHTO LRFD 10.7.1.2 as the check applies it).
    for (const auto& q : l.piles)
      CHECK(l.outline.distance_to_edge(q.x, q.y) >= width / 2 + 0.225 - 1e-9);
  }
}

TEST_CASE("design: rings put n piles at R = s / (2 sin(pi/n)) from their centre", "[design]") {
  Read r = read("typed.yaml");
  r.spec.families = {Family::ring};
  r.spec.max_piles = 8;
  LayoutCounts counts;
  const auto layouts = generate_layouts(r.project, r.spec, 0, {0.0, 0.0}, counts);
  REQUIRE(!layouts.empty());
  for (const auto& l : layouts) {
    REQUIRE(l.family == Family::ring);
    const double n = static_cast<double>(l.piles.size());
    // Hand-derived: neighbours on a circle of radius R are 2R·sin(π/n) apart; R is the
    // chord formula's radius rounded up to the 0.1 m step, heads kept to 0.1 mm.
    const double radius = l.spacing_y;
    for (const auto& q : l.piles)
      CHECK(std::hypot(q.x - l.shift_x, q.y - l.shift_y) == Approx(radius).margin(2e-4));
    CHECK(l.spacing == Approx(2 * radius * std::sin(3.14159265358979323846 / n)).margin(3e-4));
    CHECK(l.spacing >= 3.0 * 0.4 - 1e-9);
  }
}
