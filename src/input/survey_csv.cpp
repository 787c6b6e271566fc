#include "cairn/input/survey_csv.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <charconv>
#include <cmath>
#include <fstream>
#include <sstream>

#include <fmt/format.h>

#include "cairn/input/reactions_csv.hpp"

namespace cairn {
namespace {

constexpr double kPi = 3.14159265358979323846;

std::string lower_trimmed(const std::string& s) {
  const auto a = s.find_first_not_of(" \t");
  if (a == std::string::npos) return {};
  const auto b = s.find_last_not_of(" \t");
  std::string key = s.substr(a, b - a + 1);
  std::transform(key.begin(), key.end(), key.begin(),
                 [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
  return key;
}

// A plain number: [+-] digits [. digits] [e[+-]digits]; nothing else.
std::optional<double> number(const std::string& text) {
  std::string s = text;
  if (!s.empty() && s[0] == '+') s.erase(0, 1);
  if (s.empty() || s.find_first_not_of("0123456789.-eE+") != std::string::npos) return {};
  double v = 0.0;
  const auto [ptr, ec] = std::from_chars(s.data(), s.data() + s.size(), v);
  if (ec != std::errc() || ptr != s.data() + s.size() || !std::isfinite(v) || std::abs(v) > 1e9)
    return {};
  return v;
}

enum Column {
  kCap, kPile, kStatus, kX, kY, kDx, kDy, kBatter, kToward, kCutoff, kTip, kLength,
  kCapacityFactor, kStiffnessFactor, kType, kColumnCount
};
constexpr std::array<const char*, kColumnCount> kNames = {
    "cap", "pile", "status", "x", "y", "dx", "dy", "batter", "batter_toward", "cutoff_level",
    "tip_level", "installed_length", "capacity_factor", "stiffness_factor", "type"};

// The notes before the header: `# grid_origin: E, N` and `# grid_rotation: θ`. Note lines
// are blanked (line numbers stay those of the file).
std::string read_notes(const std::string& text, const std::string& file, UnitSystem units,
                       Survey& survey, Diagnostics& diagnostics) {
  std::string out;
  std::istringstream in(text);
  std::string line;
  int number_of_line = 0;
  SiteGrid grid;
  bool has_origin = false, has_rotation = false;
  const double f = to_si_factor(units, Quantity::length);
  while (std::getline(in, line)) {
    ++number_of_line;
    const auto first = line.find_first_not_of(" \t\xEF\xBB\xBF");
    if (first == std::string::npos || line[first] != '#') {
      out += line + "\n";
      continue;
    }
    out += "\n";
    const std::string body = line.substr(first + 1);
    const auto colon = body.find(':');
    if (colon == std::string::npos) continue;
    const std::string key = lower_trimmed(body.substr(0, colon));
    std::string value = body.substr(colon + 1);
    if (key == "grid_origin") {
      std::replace(value.begin(), value.end(), ',', ' ');
      std::istringstream words(value);
      std::string e, n, extra;
      words >> e >> n >> extra;
      const auto ve = number(e), vn = number(n);
      if (!ve || !vn || !extra.empty()) {
        diagnostics.error({file, number_of_line, static_cast<int>(first) + 1},
                          fmt::format("grid_origin: expected two numbers E, N (the project's "
                                      "origin on the site grid, {}), got '{}'",
                                      unit_label(units, Quantity::length),
                                      lower_trimmed(value)));
        continue;
      }
      grid.origin_e = *ve * f;
      grid.origin_n = *vn * f;
      has_origin = true;
    } else if (key == "grid_rotation") {
      const auto v = number(lower_trimmed(value));
      if (!v || std::abs(*v) > 360.0) {
        diagnostics.error({file, number_of_line, static_cast<int>(first) + 1},
                          fmt::format("grid_rotation: expected an angle in degrees from -360 to "
                                      "360, got '{}'",
                                      lower_trimmed(value)));
        continue;
      }
      grid.rotation_deg = *v;
      has_rotation = true;
    }
  }
  if (has_origin || has_rotation) survey.grid = grid;
  return out;
}

}  // namespace

const char* to_string(PileStatus s) {
  switch (s) {
    case PileStatus::accepted: return "accepted";
    case PileStatus::damaged: return "damaged";
    case PileStatus::rejected: return "rejected";
    case PileStatus::abandoned: return "abandoned";
  }
  return "?";
}

Survey read_survey_csv(const std::string& text, const std::string& file, UnitSystem units,
                       Diagnostics& diagnostics) {
  Survey survey;
  survey.file = file;
  const std::size_t before = diagnostics.list().size();
  const std::string body = read_notes(text, file, units, survey, diagnostics);
  const auto records = parse_csv(body, file, ',', diagnostics);
  if (diagnostics.list().size() != before) return survey;
  if (records.empty()) {
    diagnostics.error({file, 1, 1}, "the survey is empty; expected a header row with at least "
                                    "pile, x, y, status (or pile, dx, dy, status)");
    return survey;
  }
  const CsvRecord& header = records.front();
  std::array<int, kColumnCount> index;
  index.fill(-1);
  for (std::size_t c = 0; c < header.cells.size(); ++c) {
    const std::string key = lower_trimmed(header.cells[c].text);
    for (std::size_t k = 0; k < kColumnCount; ++k)
      if (key == kNames[k]) {
        if (index[k] >= 0)
          diagnostics.error({file, header.line, header.cells[c].column},
                            fmt::format("header: column '{}' appears twice; expected once",
                                        kNames[k]));
        index[k] = static_cast<int>(c);
      }
  }
  std::string found;
  for (const auto& c : header.cells) found += (found.empty() ? "" : ", ") + c.text;
  for (int k : {kPile, kStatus})
    if (index[k] < 0)
      diagnostics.error({file, header.line, 1},
                        fmt::format("header: missing column '{}'; found: {}", kNames[k], found));
  const bool absolute = index[kX] >= 0 || index[kY] >= 0;
  const bool offsets = index[kDx] >= 0 || index[kDy] >= 0;
  if ((index[kX] >= 0) != (index[kY] >= 0) || (index[kDx] >= 0) != (index[kDy] >= 0) ||
      (!absolute && !offsets))
    diagnostics.error({file, header.line, 1},
                      fmt::format("header: expected the surveyed head as columns 'x' and 'y', "
                                  "or offsets from the design position as 'dx' and 'dy'; "
                                  "found: {}",
                                  found));
  if (diagnostics.list().size() != before) return survey;

  const double f = to_si_factor(units, Quantity::length);
  const char* unit = unit_label(units, Quantity::length);
  const double theta = survey.grid ? survey.grid->rotation_deg * kPi / 180.0 : 0.0;
  const double c = std::cos(theta), s = std::sin(theta);
  for (std::size_t r = 1; r < records.size(); ++r) {
    const CsvRecord& record = records[r];
    const int row = static_cast<int>(r) + 1;
    const std::size_t problems = diagnostics.list().size();
    if (record.cells.size() != header.cells.size()) {
      diagnostics.error({file, record.line, 1},
                        fmt::format("row {}: expected {} cells like the header, got {}", row,
                                    header.cells.size(), record.cells.size()));
      continue;
    }
    auto cell = [&](int k) -> const CsvCell* {
      if (index[k] < 0) return nullptr;
      const CsvCell& cl = record.cells[static_cast<std::size_t>(index[k])];
      return cl.text.empty() ? nullptr : &cl;
    };
    auto where = [&](const CsvCell* cl) {
      return SourceLocation{file, cl ? cl->line : record.line, cl ? cl->column : 1};
    };
    auto bad = [&](int k, const std::string& expected) {
      const CsvCell* cl = cell(k);
      diagnostics.error(where(cl), fmt::format("row {}, column '{}': expected {}, got '{}'", row,
                                               kNames[k], expected, cl ? cl->text : ""));
    };
    auto value = [&](int k, const std::string& expected) -> std::optional<double> {
      const CsvCell* cl = cell(k);
      if (!cl) return std::nullopt;
      const auto v = number(cl->text);
      if (!v) bad(k, expected);
      return v;
    };
    SurveyRow out;
    out.where = {file, record.line, record.cells.empty() ? 1 : record.cells.front().column};
    out.row = row;
    if (const CsvCell* cl = cell(kCap)) out.cap = cl->text;
    if (const CsvCell* cl = cell(kPile)) out.pile = cl->text;
    else {
      bad(kPile, "a pile id");
      continue;
    }
    if (const CsvCell* cl = cell(kType)) {
      out.type = cl->text;
      out.where_type = where(cl);
    }
    const std::string status = cell(kStatus) ? lower_trimmed(cell(kStatus)->text) : "";
    if (status == "accepted") out.status = PileStatus::accepted;
    else if (status == "damaged") out.status = PileStatus::damaged;
    else if (status == "rejected") out.status = PileStatus::rejected;
    else if (status == "abandoned") out.status = PileStatus::abandoned;
    else bad(kStatus, "accepted, damaged, rejected or abandoned");
    const std::string length_in = fmt::format("a length in {}", unit);
    const auto x = value(kX, length_in), y = value(kY, length_in);
    const auto dx = value(kDx, length_in), dy = value(kDy, length_in);
    if (x && y) {
      const double e = *x * f - (survey.grid ? survey.grid->origin_e : 0.0);
      const double n = *y * f - (survey.grid ? survey.grid->origin_n : 0.0);
      out.x = c * e + s * n;
      out.y = -s * e + c * n;
    }
    if (dx && dy) {
      out.dx = c * *dx * f + s * *dy * f;
      out.dy = -s * *dx * f + c * *dy * f;
    }
    const int position_column = cell(kX) ? kX : kDx;
    out.where_position = where(cell(position_column));
    if ((cell(kX) == nullptr) != (cell(kY) == nullptr) ||
        (cell(kDx) == nullptr) != (cell(kDy) == nullptr))
      diagnostics.error(out.where_position,
                        fmt::format("row {}, pile '{}': expected both coordinates of the head "
                                    "(x and y, or dx and dy), got one",
                                    row, out.pile));
    if (out.x && out.dx)
      diagnostics.error(out.where_position,
                        fmt::format("row {}, pile '{}': the head is given both as x, y and as "
                                    "offsets dx, dy; give one",
                                    row, out.pile));
    if (const CsvCell* cl = cell(kBatter)) {
      const std::string t = lower_trimmed(cl->text);
      Batter b;
      if (t == "plumb" || t == "vertical") b.ratio = 0.0;
      else if (const auto v = number(t); v && (*v == 0.0 || *v >= 1.0)) b.ratio = *v;
      else bad(kBatter, "n of a batter 1:n (1 horizontal in n vertical, n ≥ 1), or plumb");
      if (const auto toward = value(kToward, "an angle in degrees from +x"))
        b.toward_deg = *toward - (survey.grid ? survey.grid->rotation_deg : 0.0);
      else if (b.ratio > 0.0 && !cell(kToward))
        diagnostics.error(where(cl), fmt::format("row {}, column 'batter_toward': a measured "
                                                 "batter needs its direction in degrees from +x",
                                                 row));
      out.batter = b;
    }
    const std::string level_in = fmt::format("a level in {} on the project's datum", unit);
    if (auto v = value(kCutoff, level_in)) out.cutoff_level = *v * f;
    if (auto v = value(kTip, level_in)) out.tip_level = *v * f;
    if (auto v = value(kLength, "a positive length in " + std::string(unit))) {
      if (*v > 0) out.installed_length = *v * f;
      else bad(kLength, "a positive length in " + std::string(unit));
    }
    if (cell(kTip) || cell(kLength)) {
      out.where_length = where(cell(cell(kLength) ? kLength : kTip));
      out.length_column = kNames[cell(kLength) ? kLength : kTip];
    }
    for (auto [k, target] : {std::pair{int(kCapacityFactor), &out.capacity_factor},
                             std::pair{int(kStiffnessFactor), &out.stiffness_factor}}) {
      if (auto v = value(k, "a share from 0 to 1 (0 excluded)")) {
        if (*v > 0 && *v <= 1) *target = *v;
        else bad(k, "a share from 0 to 1 (0 excluded)");
      }
    }
    if (diagnostics.list().size() == problems) survey.rows.push_back(std::move(out));
  }
  return survey;
}

Survey read_survey_file(const std::string& path, UnitSystem units) {
  std::ifstream in(path, std::ios::binary);
  if (!in) throw InputError({path, 0, 0}, "cannot read the survey file");
  std::ostringstream text;
  text << in.rdbuf();
  Diagnostics diagnostics;
  Survey survey = read_survey_csv(text.str(), path, units, diagnostics);
  diagnostics.raise_if_any();
  return survey;
}

}  // namespace cairn
