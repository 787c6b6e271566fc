// The detail levels of `cairn check --detail` and the long results table, tested against the
// full output of the same run: a level below full shows the full report's numbers, computed
// without keeping a row per pile and combination.
#include <catch2/catch.hpp>

#include <filesystem>
#include <fstream>
#include <iterator>
#include <sstream>
#include <string>

#include <unistd.h>

#include <nlohmann/json.hpp>

#include "cairn/app/analysis.hpp"
#include "cairn/output/output_files.hpp"
#include "cairn/output/report.hpp"

using namespace cairn;

namespace {

const std::string kData = CAIRN_TEST_DATA;
const std::string kDemo = CAIRN_DEMO_DIR;

std::string csv(const Table& t) { return render_table(t, Format::csv); }

std::size_t lines(const std::string& text) {
  std::size_t n = 0;
  for (char c : text) n += c == '\n';
  return n;
}

}  // namespace

TEST_CASE("detail: levels below full show the full run's envelope and summary", "[detail]") {
  // A project without soil (checked as it is solved), one with an overturned combination,
  // and one with soil (Broms needs every pile force first).
  for (const std::string file : {kDemo + "/crane-rail-footing/cap.yaml",
                                 kData + "/outputs/mixed.yaml", kData + "/html/cap.yaml"}) {
    INFO(file);
    const CheckRun full = analyse_project(file);
    const CheckRun brief = analyse_project(file, AnalysisOptions{.pile_rows = false});
    CHECK_FALSE(brief.results.pile_rows);
    for (const auto& cc : brief.results.combinations) {
      CHECK(cc.piles.empty());
      CHECK(cc.solution.piles.empty());
    }
    CheckReport a = make_check_report(full, "", std::nullopt);
    CheckReport b = make_check_report(brief, "", std::nullopt);
    b.detail = Detail::envelope;
    CHECK(csv(check_tables(a).envelope) == csv(check_tables(b).envelope));
    CHECK(csv(check_tables(a).summary) == csv(check_tables(b).summary));
    CHECK(summary_line(a) == summary_line(b));
    CHECK(full.results.summary.overturned == brief.results.summary.overturned);
    REQUIRE(full.group.per_combination.size() == brief.group.per_combination.size());
    for (std::size_t c = 0; c < full.group.per_combination.size(); ++c) {
      CHECK(full.group.per_combination[c].compression == brief.group.per_combination[c].compression);
      CHECK(full.group.per_combination[c].tension == brief.group.per_combination[c].tension);
    }
    CHECK(render_group(a, Format::text) == render_group(b, Format::text));
    // Every format renders at every level without pile rows.
    for (Detail d : {Detail::envelope, Detail::governing, Detail::summary}) {
      b.detail = d;
      for (Format f : {Format::text, Format::csv, Format::markdown, Format::json}) {
        const std::string out = render_check(b, f);
        CHECK(out.find(kCaution) != std::string::npos);
        // Overturned combinations appear at every level.
        for (std::size_t c : brief.results.summary.overturned)
          CHECK(out.find(brief.project.combinations[c].id) != std::string::npos);
      }
      a.detail = d;
      CHECK(render_check(a, Format::csv) == render_check(b, Format::csv));
    }
  }
}

TEST_CASE("detail: the governing combination of each check is the full run's largest", "[detail]") {
  // Service combinations only: the compression check's governing combination is the one of
  // the largest compression, its demand that compression (hand-derived: utilization is
  // demand over one allowable value).
  const CheckRun full = analyse_project(kDemo + "/crane-rail-footing/cap.yaml");
  const auto& r = full.results;
  for (std::size_t i = 0; i < full.project.piles.size(); ++i) {
    const GoverningCheck& g = r.governing[i][0];  // compression
    double largest = 0.0;
    std::optional<std::size_t> where;
    for (const auto& cc : r.combinations)
      if (cc.piles[i].axial > largest) largest = cc.piles[i].axial, where = cc.combination;
    CHECK(g.utilization.combination == where);
    CHECK(g.demand == largest);
    CHECK(r.envelope[i].max_compression.combination == where);
  }
  const CheckRun brief = analyse_project(kDemo + "/crane-rail-footing/cap.yaml", AnalysisOptions{.pile_rows = false});
  CheckReport a = make_check_report(full, "", std::nullopt);
  CheckReport b = make_check_report(brief, "", std::nullopt);
  CHECK(csv(governing_table(a)) == csv(governing_table(b)));
}

TEST_CASE("detail: the long results table holds every row of the per-combination tables", "[detail]") {
  for (const std::string file : {kDemo + "/crane-rail-footing/cap.yaml", kData + "/outputs/mixed.yaml"}) {
    INFO(file);
    const CheckRun run = analyse_project(file);
    const CheckReport report = make_check_report(run, "", std::nullopt);
    const std::string table = render_long_csv(report);
    const std::size_t n = run.project.piles.size(), m = run.project.combinations.size();
    CHECK(lines(table) == 1 + n * m + report.assumptions.size() + 1);
    const CheckTables tables = check_tables(report);
    std::istringstream in(table);
    std::string line;
    std::getline(in, line);
    CHECK(line == "combination,pile,axial (kN),lateral (kN),utilization,check,state,result");
    for (std::size_t c = 0; c < m; ++c)
      for (std::size_t i = 0; i < n; ++i) {
        std::getline(in, line);
        // The per-combination row: pile, x, y, axial, lateral, utilization, check, state, result.
        const auto& row = tables.per_combination[c].rows[i];
        CHECK(line == run.project.combinations[c].id + "," + row[0] + "," + row[3] + "," + row[4] +
                          "," + row[5] + "," + row[6] + "," + row[7] + "," + row[8]);
      }
  }
}

TEST_CASE("detail: the streamed JSON is the document tree's text", "[detail]") {
  for (const std::string file : {kDemo + "/crane-rail-footing/cap.yaml",
                                 kDemo + "/conveyor-pier-us/cap.yaml",
                                 kDemo + "/pier-fixed-heads/cap.yaml",  // head moments
                                 kData + "/bending/fixed_heads.yaml",
                                 kData + "/outputs/mixed.yaml", kData + "/html/cap.yaml"}) {
    INFO(file);
    const CheckRun run = analyse_project(file);
    CheckReport report = make_check_report(run, "cairn check", std::nullopt);
    for (Detail d : {Detail::full, Detail::envelope, Detail::governing, Detail::summary}) {
      report.detail = d;
      std::ostringstream streamed;
      write_check(report, Format::json, streamed);
      CHECK(streamed.str() == check_json(report).dump(2) + "\n");
    }
  }
}

TEST_CASE("detail: streamed output files are all written or none", "[detail]") {
  namespace fs = std::filesystem;
  const fs::path dir = fs::temp_directory_path() / ("cairn-detail-" + std::to_string(::getpid()));
  fs::remove_all(dir);
  const CheckRun run = analyse_project(kDemo + "/crane-rail-footing/cap.yaml");
  const CheckReport report = make_check_report(run, "", std::nullopt);
  write_files_atomically(dir.string(), check_outputs(report));
  // The same bytes as the files rendered in memory, and the manifest's sizes and hashes.
  const auto manifest = nlohmann::json::parse(std::ifstream(dir / kManifestName));
  std::size_t n = 0;
  for (const auto& [name, content] : check_files(report)) {
    std::ifstream in(dir / name, std::ios::binary);
    const std::string written((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
    CHECK(written == content);
    CHECK(manifest["files"][n]["name"] == name);
    CHECK(manifest["files"][n]["bytes"] == content.size());
    CHECK(manifest["files"][n]["sha256"] == sha256_hex(content));
    ++n;
  }
  // A writer that fails midway leaves the folder as it was.
  const fs::path other = dir / "again";
  std::vector<OutputFile> failing = {
      {"a.txt", [](std::ostream& out) { out << "complete\n"; }},
      {"b.txt", [](std::ostream& out) {
         out << "half";
         throw std::runtime_error("stopped");
       }}};
  CHECK_THROWS_AS(write_files_atomically(other.string(), failing), std::runtime_error);
  CHECK_FALSE(fs::exists(other));
  fs::remove_all(dir);
}
