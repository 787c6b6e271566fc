// The CSV outputs of a nonlinear run (report.hpp): the full check's per-combination tables
// (`--format csv`), the long table results.csv and the package's all-combinations CSV carry
// each pile's largest moment along it and its depth, head deflection and p-multiplier, equal to
// the JSON document's values to the printed precision; a linear run's CSV has none of them.
#include <catch2/catch.hpp>

#include <cmath>
#include <map>
#include <sstream>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "cairn/app/analysis.hpp"
#include "cairn/output/html_package.hpp"
#include "cairn/output/report.hpp"
#include "support.hpp"

namespace {

const std::string kData = CAIRN_TEST_DATA;

std::vector<std::string> cells_of(const std::string& line) {
  // The values compared here hold no commas or quotes (ids, numbers, words).
  std::vector<std::string> cells;
  std::stringstream in(line);
  std::string cell;
  while (std::getline(in, cell, ',')) cells.push_back(cell);
  if (!line.empty() && line.back() == ',') cells.emplace_back();
  return cells;
}

// A CSV table as rows of header → cell, from the header line that starts with `first`.
std::vector<std::map<std::string, std::string>> rows_after(std::istream& in,
                                                           const std::string& first) {
  std::vector<std::map<std::string, std::string>> rows;
  std::string line;
  while (std::getline(in, line))
    if (line.rfind(first, 0) == 0) break;
  const std::vector<std::string> headers = cells_of(line);
  while (std::getline(in, line) && !line.empty() && line[0] != '#') {
    const std::vector<std::string> cells = cells_of(line);
    std::map<std::string, std::string> row;
    for (std::size_t k = 0; k < headers.size() && k < cells.size(); ++k) row[headers[k]] = cells[k];
    rows.push_back(row);
  }
  return rows;
}

// A printed number equals the full one to within half its last printed digit.
bool printed(const std::string& text, double value) {
  const auto dot = text.find('.');
  const int decimals = dot == std::string::npos ? 0 : static_cast<int>(text.size() - dot - 1);
  return std::abs(std::stod(text) - value) <= 0.5 * std::pow(10.0, -decimals) + 1e-12;
}

}  // namespace

TEST_CASE("nonlinear CSV: the pile values equal the JSON document's", "[nonlinear_csv]") {
  for (const char* name : {"lateral_si.yaml", "lateral_us.yaml"}) {
    CAPTURE(name);
    const cairn::CheckRun run = cairn::analyse_project(kData + "/nonlinear/" + name);
    REQUIRE(run.nonlinear);
    const cairn::CheckReport report = cairn::make_check_report(run, "check", std::nullopt);
    const nlohmann::json doc = cairn::check_json(report);
    const bool si = run.project.units == cairn::UnitSystem::SI;
    const std::string moment = si ? "largest moment (kN·m)" : "largest moment (kip·ft)";
    const std::string depth = si ? "at depth (m)" : "at depth (ft)";
    const std::string deflection = si ? "head deflection (mm)" : "head deflection (in)";
    // The full check's CSV: one table per combination, in order.
    std::istringstream full(cairn::render_check(report, cairn::Format::csv));
    // The long table of --out (results.csv).
    std::istringstream long_table(cairn::render_long_csv(report));
    const auto long_rows = rows_after(long_table, "combination,pile,");
    std::size_t long_row = 0;
    for (const auto& combination : doc["combinations"]) {
      const auto rows = rows_after(full, "pile,x (");
      const auto& piles = combination["piles"];
      REQUIRE(rows.size() == piles.size());
      for (std::size_t i = 0; i < rows.size(); ++i, ++long_row) {
        const auto& pile = piles[i];
        CAPTURE(combination["id"].get<std::string>(), pile["id"].get<std::string>());
        REQUIRE(long_row < long_rows.size());
        for (const auto* row : {&rows[i], &long_rows[long_row]}) {
          CHECK(row->at("pile") == pile["id"].get<std::string>());
          CHECK(printed(row->at(moment), pile["max_moment"].get<double>()));
          CHECK(printed(row->at(depth), pile["max_moment_depth"].get<double>()));
          CHECK(printed(row->at(deflection), pile["head_deflection"].get<double>()));
          CHECK(printed(row->at("p-multiplier"), pile["p_multiplier"].get<double>()));
        }
        CHECK(long_rows[long_row].at("combination") == combination["id"].get<std::string>());
      }
    }
    CHECK(long_row == long_rows.size());
    // The package's table of every combination has the same columns.
    std::istringstream all(cairn::all_combinations_csv(report));
    const auto all_rows = rows_after(all, "combination,");
    REQUIRE(all_rows.size() == long_rows.size());
    for (std::size_t k = 0; k < all_rows.size(); ++k) {
      CHECK(all_rows[k].at(deflection) == long_rows[k].at(deflection));
      CHECK(all_rows[k].at("p-multiplier") == long_rows[k].at("p-multiplier"));
      CHECK(all_rows[k].at(moment) == long_rows[k].at(moment));
    }
  }
}

TEST_CASE("nonlinear CSV: an overturned combination prints dashes, its multipliers stay",
          "[nonlinear_csv]") {
  const cairn::CheckRun run = cairn::analyse_project(kData + "/nonlinear/mechanism.yaml");
  REQUIRE(run.nonlinear);
  REQUIRE_FALSE(run.results.summary.overturned.empty());
  const cairn::CheckReport report = cairn::make_check_report(run, "check", std::nullopt);
  std::istringstream long_table(cairn::render_long_csv(report));
  const auto rows = rows_after(long_table, "combination,pile,");
  const std::string failed = run.project.combinations[run.results.summary.overturned.front()].id;
  bool seen = false;
  for (const auto& row : rows)
    if (row.at("combination") == failed) {
      seen = true;
      CHECK(row.at("head deflection (mm)") == "-");
      CHECK(row.at("largest moment (kN·m)") == "-");
      CHECK(row.at("p-multiplier") != "-");
    }
  CHECK(seen);
}

TEST_CASE("nonlinear CSV: a linear run's CSV has no nonlinear columns", "[nonlinear_csv]") {
  for (const char* file : {"/nonlinear/lateral_si.yaml", "/base.yaml"}) {
    CAPTURE(file);
    cairn::AnalysisOptions options;
    options.soil_response = cairn::SoilResponse::linear;
    const cairn::CheckRun run = cairn::analyse_project(kData + file, options);
    const cairn::CheckReport report = cairn::make_check_report(run, "check", std::nullopt);
    for (const std::string& csv :
         {cairn::render_check(report, cairn::Format::csv), cairn::render_long_csv(report)}) {
      CHECK_FALSE(cairn::test::has(csv, "head deflection"));
      CHECK_FALSE(cairn::test::has(csv, "p-multiplier"));
    }
  }
}
