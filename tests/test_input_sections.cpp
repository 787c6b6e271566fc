// Tests of yaml_core.hpp, includes.hpp and sections.hpp: the YAML read into located values
// through yaml-cpp's event parser, the shape checks made on the way, the section readers
// returning their values, and errors by kind (a user's data error is located in its file;
// a problem with a whole file names the file without a line, never "file:0:0").
#include <catch2/catch.hpp>

#include <cstdio>
#include <fstream>
#include <string>

#include "cairn/core/diagnostics.hpp"
#include "cairn/input/input.hpp"
#include "cairn/input/sections.hpp"
#include "cairn/input/yaml_core.hpp"

using namespace cairn;

namespace {

const std::string kFile = "test.yaml";

// The messages of the diagnostics, one per line.
std::string messages(const Diagnostics& diag) {
  std::string text;
  for (const auto& d : diag.list()) text += d.format() + "\n";
  return text;
}

// A document parsed from text, kept alive with the reading context of its sections.
struct Parsed {
  Diagnostics diag;
  std::unique_ptr<YamlDocument> doc;
  std::map<std::string, UnitSystem> units{{kFile, UnitSystem::SI}};
  ReadContext ctx{diag, units, UnitSystem::SI};
  explicit Parsed(const std::string& text) : doc(parse_yaml(text, kFile, diag)) {}
  Located top() const { return Located::of(doc->root, kFile, ""); }
};

// A file written for one test and removed after it.
struct TempFile {
  std::string path;
  TempFile(const std::string& name, const std::string& text) : path(name) {
    std::ofstream(path) << text;
  }
  ~TempFile() { std::remove(path.c_str()); }
};

}  // namespace

TEST_CASE("yaml core: values with their lines and columns, keys in the file's order",
          "[input_sections]") {
  Parsed p("a: 1\nb:\n  - x\n  - {c: 2.5}\nd:\n");
  REQUIRE(p.doc);
  CHECK(p.diag.empty());
  const Located top = p.top();
  REQUIRE(top.is_map());
  REQUIRE(top.size() == 3);
  CHECK(top.node->entries[0].key == "a");
  CHECK(top.node->entries[2].key == "d");
  const Located a = top.child("a");
  CHECK(a.is_scalar());
  CHECK(a.scalar() == "1");
  CHECK(a.where().line == 1);
  CHECK(a.where().column == 4);
  const Located c = top.child("b").item(1).child("c");
  CHECK(c.path == "b[1].c");
  CHECK(c.scalar() == "2.5");
  CHECK(c.where().line == 4);
  // `d:` with nothing is defined but not present; an absent key is located at its parent.
  CHECK(top.child("d").defined());
  CHECK_FALSE(top.child("d").present());
  const Located missing = top.child("b").item(1).child("e");
  CHECK_FALSE(missing.defined());
  CHECK(missing.path == "b[1].e");
  CHECK(missing.where().line == 4);
  CHECK(missing.where().column == 5);
}

TEST_CASE("yaml core: shape problems found while the events arrive", "[input_sections]") {
  SECTION("a key given twice is reported at the second, the first kept") {
    Parsed p("a: 1\nb: 2\na: 3\n");
    REQUIRE(p.doc);
    CHECK(messages(p.diag) == "test.yaml:3:1: error: a: given twice (first at line 1)\n");
    CHECK(p.top().child("a").scalar() == "1");
  }
  SECTION("a list as a key") {
    Parsed p("? [a, b]\n: 1\n");
    CHECK_FALSE(p.doc);
    CHECK(messages(p.diag) == "test.yaml:1:3: error: expected a name as a key, got a list\n");
  }
  SECTION("an alias naming the map that contains it") {
    Parsed p("x: &p\n  a: *p\n");
    CHECK_FALSE(p.doc);
    CHECK(messages(p.diag) ==
          "test.yaml:2:3: error: x.a: an alias refers to a map or list that contains it (a "
          "cycle); an alias may only repeat a complete earlier value\n");
  }
  SECTION("an alias shares the value it repeats") {
    Parsed p("a: &w {x: 1}\nb: *w\n");
    REQUIRE(p.doc);
    CHECK(p.top().child("a").node == p.top().child("b").node);
    CHECK(p.top().child("b").child("x").path == "b.x");
  }
  SECTION("malformed YAML gets the parser's one message") {
    Parsed p("a: [1, 2\n");
    CHECK_FALSE(p.doc);
    REQUIRE(p.diag.list().size() == 1);
    CHECK(p.diag.list()[0].message.rfind("malformed YAML: ", 0) == 0);
  }
  SECTION("comments only: no document") {
    Parsed p("# nothing\n");
    REQUIRE(p.doc);
    CHECK(p.doc->root == nullptr);
  }
}

TEST_CASE("section readers return their values", "[input_sections]") {
  SECTION("cap: thickness and a rectangle turned into corners") {
    Parsed p("cap: {thickness: 1.2, outline: {width: 4, length: 2}}\n");
    const Cap cap = read_cap(p.top().child("cap"), p.ctx);
    CHECK(p.diag.empty());
    CHECK(cap.thickness == 1.2);
    REQUIRE(cap.outline);
    CHECK(cap.outline->polygon.size() == 4);
    CHECK(cap.outline->area() == Approx(8.0));  // 4 m × 2 m, hand-derived
  }
  SECTION("soil: a sand layer") {
    Parsed p("soil:\n  layers:\n    - {name: sand, kind: sand, thickness: 6, unit_weight: 19, "
             "friction_angle: 32}\n");
    const auto soil = read_soil(p.top().child("soil"), p.ctx);
    CHECK(p.diag.empty());
    REQUIRE(soil);
    REQUIRE(soil->layers.size() == 1);
    CHECK(*soil->layers[0].friction_angle == 32.0);
    CHECK(soil->layers[0].line == 3);
  }
  SECTION("the friction angle's range is checked by the soil reader, once") {
    Parsed p("soil:\n  layers:\n    - {name: sand, kind: sand, thickness: 6, unit_weight: 19, "
             "friction_angle: 55}\n");
    read_soil(p.top().child("soil"), p.ctx);
    CHECK(messages(p.diag) == "test.yaml:3:79: error: soil.layers[0] ('sand').friction_angle: "
                              "expected 20° to 50°, got 55\n");
  }
  SECTION("piles: a pile type that does not exist, with a suggestion") {
    Parsed p("piles:\n  - {id: A, x: 0, y: 0, type: PC4}\n");
    PileType type;
    type.id = "PC45";
    type.section.width = 0.45;
    const auto piles = read_piles(p.top().child("piles"), p.ctx, {type});
    CHECK(piles.size() == 1);
    CHECK(messages(p.diag) == "test.yaml:2:31: error: piles[0].type: pile type 'PC4' does not "
                              "exist; did you mean 'PC45'?\n");
  }
}

TEST_CASE("errors by kind: a whole file is named without a line, never file:0:0",
          "[input_sections]") {
  CHECK(Diagnostic{whole_file("a.yaml"), "cannot open"}.format() == "a.yaml: error: cannot open");
  try {
    read_project("no-such-project.yaml");
    FAIL("no InputError");
  } catch (const InputError& e) {
    CHECK(std::string(e.what()) ==
          "no-such-project.yaml: error: cannot open the project file (does it exist?)");
    CHECK(std::string(e.what()).find(":0:0") == std::string::npos);
  }
}

TEST_CASE("foundation files: recognised from their first keys", "[input_sections]") {
  const TempFile foundation("test_foundation.yaml", "title: yard\ncaps: [a.yaml, b.yaml]\n");
  CHECK(expand_foundation(foundation.path) == std::vector<std::string>{"a.yaml", "b.yaml"});
  const TempFile project("test_not_foundation.yaml", "title: cap\nunits: SI\ncap: {}\n");
  CHECK(expand_foundation(project.path) == std::vector<std::string>{project.path});
  const TempFile bad("test_bad_foundation.yaml", "caps: [a.yaml]\nunits: SI\n");
  try {
    expand_foundation(bad.path);
    FAIL("no InputError");
  } catch (const InputError& e) {
    CHECK(std::string(e.what()) == "test_bad_foundation.yaml:2:1: error: units: unknown key in a "
                                   "foundation file; expected title, caps");
  }
}
