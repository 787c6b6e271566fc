// Robustness of the project reader: inputs that once crashed, hung or ended in an internal
// error (aliases in a cycle or nested as a "bomb", nesting thousands deep, keys that are
// lists, absurd numbers, tabs) are each a located input error, pinned verbatim. The
// fixtures are in tests/data/robust/; the deep ones are written here, into a temporary
// folder, since they are large.
#include <catch2/catch.hpp>

#include <chrono>
#include <filesystem>
#include <fstream>
#include <string>

#include "cairn/app/analysis.hpp"
#include "cairn/geotechnics/capacity.hpp"
#include "cairn/input/input.hpp"
#include "cairn/core/units.hpp"

using namespace cairn;

namespace {

const std::string kRobust = std::string(CAIRN_TEST_DATA) + "/robust/";

// The message read_project raises for a file.
std::string error_for(const std::string& path) {
  try {
    read_project(path);
  } catch (const InputError& e) {
    return e.what();
  }
  FAIL("no InputError for " << path);
  return {};
}

// A file in a fresh temporary folder, removed with the object.
struct TemporaryFile {
  std::filesystem::path path;
  explicit TemporaryFile(const std::string& name, const std::string& text) {
    path = std::filesystem::temp_directory_path() /
           ("cairn-robust-" + std::to_string(std::chrono::steady_clock::now().time_since_epoch().count()));
    std::filesystem::create_directories(path);
    path /= name;
    std::ofstream(path, std::ios::binary) << text;
  }
  ~TemporaryFile() { std::filesystem::remove_all(path.parent_path()); }
  std::string name() const { return path.string(); }
};

std::string repeated(const std::string& piece, std::size_t times) {
  std::string text;
  text.reserve(piece.size() * times);
  for (std::size_t i = 0; i < times; ++i) text += piece;
  return text;
}

}  // namespace

TEST_CASE("robustness: aliases are walked once, never in a cycle or beyond a budget",
          "[robustness]") {
  SECTION("an alias naming the map that contains it") {
    CHECK(error_for(kRobust + "alias_cycle.yaml") ==
          kRobust + "alias_cycle.yaml:3:8: error: x.a: an alias refers to a map or list that "
                    "contains it (a cycle); an alias may only repeat a complete earlier value");
  }
  SECTION("ten nested aliases of ten (10^10 values in 659 bytes)") {
    // Refused while walking, not after expanding (expanding would take hours).
    CHECK(error_for(kRobust + "alias_bomb.yaml") ==
          kRobust + "alias_bomb.yaml:6:5: error: a4: aliases expand this to more than 102636 "
                    "values, the limit for a file of 659 bytes; write the values out or nest "
                    "fewer aliases");
  }
  SECTION("an alias used as intended reads as the value it repeats") {
    const Project p = read_project(kRobust + "alias_ok.yaml");
    REQUIRE(p.load_cases.size() == 2);
    CHECK(p.load_cases[1].loads.size() == 1);
    CHECK(p.load_cases[1].loads[0].load[2] == -2400.0);
  }
}

TEST_CASE("robustness: nesting deeper than the limit is refused by name, without recursion",
          "[robustness]") {
  const std::size_t depth = 100000;
  SECTION("flow lists") {
    const TemporaryFile f("deep.yaml", "x: " + repeated("[", depth) + repeated("]", depth) + "\n");
    CHECK(error_for(f.name()) == f.name() + ":1:203: error: lists and maps nested deeper than "
                                            "200 levels; a project needs fewer than ten");
  }
  SECTION("flow maps") {
    const TemporaryFile f("deep.yaml", "x: " + repeated("{a: ", depth) + "1" + repeated("}", depth) + "\n");
    CHECK(error_for(f.name()) == f.name() + ":1:800: error: lists and maps nested deeper than "
                                            "200 levels; a project needs fewer than ten");
  }
  SECTION("block lists, by indentation") {
    std::string text = "x:\n";
    for (std::size_t i = 0; i < 3000; ++i) text += std::string(i + 1, ' ') + "-\n";
    const TemporaryFile f("deep.yaml", text);
    CHECK(error_for(f.name()) == f.name() + ":201:201: error: lists and maps nested deeper "
                                            "than 200 levels; a project needs fewer than ten");
  }
  SECTION("brackets inside quotes, comments and block text are not nesting") {
    const std::string brackets = repeated("[", 500);
    const TemporaryFile f("quoted.yaml", "a: '" + brackets + "'\nb: \"" + brackets + "\"\n# " +
                                             brackets + "\nc: |\n  " + brackets + "\nd: 1\n");
    // Read past the pre-scan: the first problem is the project's, not the nesting.
    CHECK(error_for(f.name()).find("nested deeper") == std::string::npos);
  }
}

TEST_CASE("robustness: every value is located, and absurd numbers are input errors",
          "[robustness]") {
  SECTION("a map key that is a list") {
    CHECK(error_for(kRobust + "list_key.yaml") ==
          kRobust + "list_key.yaml:3:3: error: expected a name as a key, got a list");
  }
  SECTION("a column without 'at' is reported at the column") {
    CHECK(error_for(kRobust + "column_without_at.yaml") ==
          kRobust + "column_without_at.yaml:24:5: error: columns[0].at: expected [x, y] or "
                    "[x, y, z] in m, got nothing");
  }
  SECTION("a load of 1e300 kN, and '-1e308 kip', which overflows when converted") {
    CHECK(error_for(kRobust + "huge_loads.yaml") ==
          kRobust + "huge_loads.yaml:19:44: error: load_cases.D.loads[0].Fz: expected a force "
                    "in kN no larger than 1e+12 in magnitude, got '-1e300'\n" +
              kRobust + "huge_loads.yaml:20:44: error: load_cases.L.loads[0].Fz: expected a "
                        "force in kN no larger than 1e+12 in magnitude, got '-1e308 kip'");
  }
  SECTION("a positive length too small to be a pile") {
    CHECK(error_for(kRobust + "tiny_length.yaml") ==
          kRobust + "tiny_length.yaml:10:13: error: pile_types.PC45.length: expected a positive "
                    "length in m of at least 0.001, got '1e-30'");
  }
  SECTION("a tab in the indentation is called a tab") {
    CHECK(error_for(kRobust + "tab_indent.yaml") ==
          kRobust + "tab_indent.yaml:5:1: error: tab character in indentation; YAML indents "
                    "with spaces");
  }
}

TEST_CASE("robustness: the unit parser bounds every quantity, after conversion", "[robustness]") {
  // 1 kip = 4.4482216152605 kN (NIST SP 811, Appendix B): 1e308 kip overflows a double.
  CHECK_FALSE(parse_quantity("1e308 kip", Quantity::force, UnitSystem::SI).si);
  CHECK_FALSE(parse_quantity("1e13", Quantity::force, UnitSystem::SI).si);
  CHECK(parse_quantity("1e12", Quantity::force, UnitSystem::SI).si);
  CHECK_FALSE(parse_quantity("inf", Quantity::length, UnitSystem::SI).si);
  CHECK_FALSE(parse_quantity("nan", Quantity::length, UnitSystem::SI).si);
  // Survey grid coordinates of ~1e7 m are real input (common practice: UTM northings).
  CHECK(parse_quantity("9999999.5", Quantity::length, UnitSystem::SI).si);
  CHECK(parse_quantity("1e13", Quantity::force, UnitSystem::US).error ==
        "expected a force in kip no larger than 2.24809e+11 in magnitude, got '1e13'");
}

TEST_CASE("robustness: the capacity-with-depth table is bounded", "[robustness]") {
  // 3 m to 28 m: 51 rows at 0.5 m; 25,000,000,001 rows at 1e-9 m.
  CHECK(depth_table_rows(28.0, 0.5, 3.0) == 51.0);
  CHECK(depth_table_rows(28.0, 1e-9, 3.0) > static_cast<double>(kMaxDepthRows));
  CHECK(depth_table_rows(28.0, 0.5, 30.0) == 0.0);
}

TEST_CASE("robustness: piles at one position are reported a few at a time, counted after",
          "[robustness]") {
  // 5,000 piles at one point once printed 12.5 million lines, one per pair.
  std::string text =
      "title: One point\nunits: SI\ncap: {thickness: 1.2}\npile_types:\n"
      "  P: {section: {shape: square, width: 0.45}, length: 18, elastic_modulus: 3.0e7, "
      "capacity: {compression: 1400}}\npiles:\n";
  for (int i = 0; i < 5000; ++i) text += "  - {id: P" + std::to_string(i) + ", x: 0, y: 0, type: P}\n";
  text += "load_cases:\n  D: {kind: dead, loads: [{at: [0, 0], Fz: -100}]}\n"
          "combinations:\n  S1: {limit_state: service, factors: {D: 1.0}}\n";
  const TemporaryFile f("same.yaml", text);
  try {
    read_project(f.name());
    FAIL("expected an InputError");
  } catch (const InputError& e) {
    const auto& list = e.diagnostics();
    REQUIRE(list.size() == 6);
    CHECK(list[0].format() == f.name() + ":8:5: error: piles[1]: pile 'P1' is at the same "
                                         "position as pile 'P0'");
    CHECK(list[5].format() == f.name() + ":7:3: error: piles: … and 4994 more piles at "
                                         "positions already used");
  }
}

TEST_CASE("robustness: a missing capacity is one problem, not one per combination",
          "[robustness]") {
  // asce7-lrfd gives two strength combinations of D and L (ASCE 7-16, section 2.3.1).
  std::string message;
  try {
    analyse_project(kRobust + "missing_factored_once.yaml");
  } catch (const InputError& e) {
    message = e.what();
  }
  CHECK(message ==
        kRobust + "missing_factored_once.yaml:23:13: error: combinations.LRFD-1, LRFD-2: 2 "
                  "strength combinations are compared with factored capacities, but pile type "
                  "'PC45' has no factored compression capacity; give capacity with basis: "
                  "factored (or basis: ultimate with resistance_factor)");
}
