#include "cairn/input/reactions_csv.hpp"

#include <algorithm>
#include <cctype>
#include <charconv>
#include <cmath>
#include <optional>

#include <fmt/format.h>

namespace cairn {
namespace {

// Largest magnitude accepted for a reaction, in the file's units: far above any real
// foundation load, low enough that no later sum overflows (common practice: refuse, do
// not carry, a value no model produces).
constexpr double kLargestValue = 1e12;

bool is_blank(char c, char delimiter) { return c == ' ' || (c == '\t' && delimiter != '\t'); }

std::string trimmed(const std::string& s) {
  const auto a = s.find_first_not_of(" \t");
  if (a == std::string::npos) return {};
  const auto b = s.find_last_not_of(" \t");
  return s.substr(a, b - a + 1);
}

// Header names are compared without regard to case and surrounding spaces.
std::string header_key(const std::string& s) {
  std::string key = trimmed(s);
  std::transform(key.begin(), key.end(), key.begin(),
                 [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
  return key;
}

std::string delimiter_name(char c) {
  if (c == '\t') return "a tab";
  return fmt::format("'{}'", c);
}

bool all_digits(const std::string& s, std::size_t from, std::size_t to) {
  if (from >= to) return false;
  for (std::size_t i = from; i < to; ++i)
    if (!std::isdigit(static_cast<unsigned char>(s[i]))) return false;
  return true;
}

// "1,850.0", "-12 400", "2.400,5": digits in groups of three after a first group of one to
// three, separated by `separator`, then optionally the decimal mark and digits.
bool grouped_number(const std::string& s, char separator, char decimal) {
  std::size_t i = (!s.empty() && (s[0] == '+' || s[0] == '-')) ? 1 : 0;
  const std::size_t end_decimal = s.find(decimal, i);
  const std::size_t end = end_decimal == std::string::npos ? s.size() : end_decimal;
  if (end_decimal != std::string::npos && !all_digits(s, end_decimal + 1, s.size())) return false;
  std::size_t first = s.find(separator, i);
  if (first == std::string::npos || first >= end) return false;
  if (first - i < 1 || first - i > 3 || !all_digits(s, i, first)) return false;
  for (std::size_t p = first; p < end; p += 4) {
    if (s[p] != separator || p + 4 > end || !all_digits(s, p + 1, p + 4)) return false;
  }
  return true;
}

// A plain number with `decimal` as its decimal mark: [+-] digits [mark digits] [e[+-]digits].
std::optional<double> plain_number(const std::string& s, char decimal) {
  std::size_t i = 0;
  if (i < s.size() && (s[i] == '+' || s[i] == '-')) ++i;
  std::size_t digits = 0;
  while (i < s.size() && std::isdigit(static_cast<unsigned char>(s[i]))) ++i, ++digits;
  if (i < s.size() && s[i] == decimal) {
    ++i;
    while (i < s.size() && std::isdigit(static_cast<unsigned char>(s[i]))) ++i, ++digits;
  }
  if (digits == 0) return std::nullopt;
  if (i < s.size() && (s[i] == 'e' || s[i] == 'E')) {
    ++i;
    if (i < s.size() && (s[i] == '+' || s[i] == '-')) ++i;
    if (!all_digits(s, i, s.size())) return std::nullopt;
    i = s.size();
  }
  if (i != s.size()) return std::nullopt;
  std::string c = s;
  if (decimal != '.') std::replace(c.begin(), c.end(), decimal, '.');
  if (c[0] == '+') c.erase(0, 1);
  double value = 0.0;
  const auto [ptr, ec] = std::from_chars(c.data(), c.data() + c.size(), value);
  if (ec != std::errc() || ptr != c.data() + c.size() || !std::isfinite(value)) return std::nullopt;
  return value;
}

struct Number {
  std::optional<double> value;
  std::string problem;  // why not, with a hint
};

Number read_number(const std::string& s, char decimal) {
  if (auto v = plain_number(s, decimal)) {
    if (std::abs(*v) > kLargestValue) return {std::nullopt, "expected at most 1e12 in magnitude"};
    return {v, {}};
  }
  const char other = decimal == '.' ? ',' : '.';
  for (char separator : {other, ' ', '\''})
    if (grouped_number(s, separator, decimal))
      return {std::nullopt,
              decimal == '.' && separator == ','
                  ? "a number with a thousands separator (or a decimal comma) is not read; "
                    "export numbers without thousands separators, or set loads_from.decimal: "
                    "',' if the comma is the decimal mark"
                  : "a number with a thousands separator is not read; export numbers without "
                    "thousands separators"};
  if (plain_number(s, other))
    return {std::nullopt,
            decimal == '.' ? "a decimal comma is not read with loads_from.decimal '.'; set "
                             "loads_from.decimal: ',' (and loads_from.delimiter: ';')"
                           : "a decimal point is not read with loads_from.decimal ','; set "
                             "loads_from.decimal: '.'"};
  return {std::nullopt, {}};
}

bool short_group(const CsvCell& c) {
  const std::size_t i = (!c.text.empty() && (c.text[0] == '-' || c.text[0] == '+')) ? 1 : 0;
  // A leading group of one to three digits, not starting with 0.
  return !c.quoted && c.text.size() - i >= 1 && c.text.size() - i <= 3 &&
         all_digits(c.text, i, c.text.size()) && c.text[i] != '0';
}

bool three_digits_on(const CsvCell& c) {
  if (c.quoted || c.text.size() < 3 || !all_digits(c.text, 0, 3)) return false;
  return c.text.size() == 3 || ((c.text[3] == '.' || c.text[3] == ',') && all_digits(c.text, 4, c.text.size())) ||
         (c.text[3] == '.' && c.text.size() == 4);
}

// Why a row has more or fewer cells than the header, and where to look.
std::pair<std::string, int> ragged_hint(const CsvRecord& r, std::size_t expected,
                                        char delimiter) {
  const auto& cells = r.cells;
  if (cells.size() > expected) {
    if (cells.size() == expected + 1 && cells.back().text.empty() && !cells.back().quoted)
      return {fmt::format("the row ends with a trailing {}; remove it (or add a column to the "
                          "header)",
                          delimiter_name(delimiter)),
              std::max(1, cells.back().column - 1)};
    for (std::size_t i = 0; i + 1 < cells.size(); ++i)
      if (short_group(cells[i]) && three_digits_on(cells[i + 1]))
        return {fmt::format("'{}{}{}' looks like one number written with a thousands "
                            "separator; export numbers without thousands separators, or quote "
                            "the cell",
                            cells[i].text, delimiter == '\t' ? std::string("\\t")
                                                             : std::string(1, delimiter),
                            cells[i + 1].text),
                cells[i].column};
    return {fmt::format("a cell holding {} must be quoted", delimiter_name(delimiter)),
            cells.front().column};
  }
  return {"a cell is missing", cells.front().column};
}

}  // namespace

std::vector<CsvRecord> parse_csv(const std::string& text, const std::string& file,
                                 char delimiter, Diagnostics& diagnostics) {
  enum class State { cell_start, unquoted, quoted, after_quote };
  std::vector<CsvRecord> records;
  CsvRecord record;
  CsvCell cell;
  State state = State::cell_start;
  int line = 1, column = 1;
  bool reported_after_quote = false;
  std::size_t i = text.rfind("\xEF\xBB\xBF", 0) == 0 ? 3 : 0;  // UTF-8 byte-order mark
  bool record_open = false;

  auto finish_cell = [&] {
    if (!cell.quoted) cell.text = trimmed(cell.text);
    record.cells.push_back(std::move(cell));
    cell = CsvCell{};
    state = State::cell_start;
  };
  auto finish_record = [&] {
    finish_cell();
    const bool blank = std::all_of(record.cells.begin(), record.cells.end(),
                                   [](const CsvCell& c) { return c.text.empty() && !c.quoted; });
    if (!blank) records.push_back(std::move(record));
    record = CsvRecord{};
    record_open = false;
    reported_after_quote = false;
  };

  for (; i < text.size(); ++i) {
    const char c = text[i];
    const bool line_end = c == '\n' || c == '\r';
    if (!record_open) {
      record.line = line;
      record_open = true;
    }
    if (state == State::cell_start && cell.line == 0) {
      cell.line = line;
      cell.column = column;
    }
    if (line_end && state != State::quoted) {
      finish_record();
    } else {
      switch (state) {
        case State::cell_start:
          if (is_blank(c, delimiter)) {
            // Leading spaces: the cell starts at its first character.
            cell.line = 0;
          } else if (c == '"') {
            cell.quoted = true;
            state = State::quoted;
          } else if (c == delimiter) {
            finish_cell();
          } else {
            cell.text += c;
            state = State::unquoted;
          }
          break;
        case State::unquoted:
          if (c == delimiter) finish_cell();
          else cell.text += c;
          break;
        case State::quoted:
          if (c == '"' && i + 1 < text.size() && text[i + 1] == '"') {
            cell.text += '"';
            ++i;
            ++column;
          } else if (c == '"') {
            state = State::after_quote;
          } else if (!line_end) {
            cell.text += c;  // a line break inside quotes is added below, as '\n'
          }
          break;
        case State::after_quote:
          if (c == delimiter) {
            finish_cell();
          } else if (!is_blank(c, delimiter) && !reported_after_quote) {
            diagnostics.error({file, line, column},
                              fmt::format("row {}: unexpected '{}' after a closing quote; a "
                                          "quote inside a quoted cell is written twice (\"\")",
                                          record.line, c));
            reported_after_quote = true;
          }
          break;
      }
    }
    // Positions count characters, not bytes; CRLF is one line end.
    if (line_end) {
      if (c == '\r' && i + 1 < text.size() && text[i + 1] == '\n') ++i;
      if (state == State::quoted) cell.text += '\n';
      ++line;
      column = 1;
    } else if ((static_cast<unsigned char>(c) & 0xC0) != 0x80) {
      ++column;
    }
  }
  if (state == State::quoted)
    diagnostics.error({file, cell.line, cell.column},
                      fmt::format("row {}: the quote opened here is never closed", record.line));
  else if (record_open)
    finish_record();
  return records;
}

std::vector<ReactionRow> read_reactions_csv(const std::string& text, const std::string& file,
                                            const ReactionsLayout& layout,
                                            Diagnostics& diagnostics) {
  const std::size_t before = diagnostics.list().size();
  const auto records = parse_csv(text, file, layout.delimiter, diagnostics);
  if (diagnostics.list().size() != before) return {};
  if (records.empty()) {
    diagnostics.error({file, 1, 1}, "the reactions file is empty; expected a header row "
                                    "support,case,Fx,Fy,Fz,Mx,My,Mz");
    return {};
  }
  const CsvRecord& header = records.front();
  std::string found;
  for (const auto& c : header.cells) found += (found.empty() ? "" : ", ") + c.text;

  // A header separated by another delimiter reads as one wide cell: say so instead of
  // reporting every column missing.
  for (char other : {',', ';', '\t'}) {
    if (other == layout.delimiter || header.cells.size() >= kReactionColumns.size()) continue;
    const bool inside = std::any_of(header.cells.begin(), header.cells.end(), [&](const CsvCell& c) {
      return c.text.find(other) != std::string::npos;
    });
    if (inside) {
      diagnostics.error(
          {file, header.line, 1},
          fmt::format("header: the columns are separated by {}, not {}; set loads_from.delimiter: "
                      "'{}'{}",
                      delimiter_name(other), delimiter_name(layout.delimiter),
                      other == '\t' ? std::string("tab") : std::string(1, other),
                      other == ';' ? " (and loads_from.decimal: ',' if the numbers use a decimal "
                                     "comma)"
                                   : ""));
      return {};
    }
  }

  std::array<std::size_t, kReactionColumns.size()> index{};
  bool complete = true;
  for (std::size_t k = 0; k < kReactionColumns.size(); ++k) {
    const std::string ours = kReactionColumns[k];
    const auto mapped = layout.headers.find(ours);
    const std::string theirs = mapped == layout.headers.end() ? ours : mapped->second;
    std::vector<std::size_t> hits;
    for (std::size_t c = 0; c < header.cells.size(); ++c)
      if (header_key(header.cells[c].text) == header_key(theirs)) hits.push_back(c);
    const std::string named = mapped == layout.headers.end()
                                  ? fmt::format("'{}'", ours)
                                  : fmt::format("'{}' (for {}, loads_from.headers)", theirs, ours);
    if (hits.empty()) {
      diagnostics.error({file, header.line, 1},
                        fmt::format("header: missing column {}; found: {}{}", named, found,
                                    mapped == layout.headers.end()
                                        ? "; name the file's own columns with loads_from.headers, "
                                          "e.g. headers: {support: Node, case: Load Case}"
                                        : ""));
      complete = false;
    } else if (hits.size() > 1) {
      diagnostics.error({file, header.line, header.cells[hits[1]].column},
                        fmt::format("header: column {} appears {} times; expected once",
                                    named, hits.size()));
      complete = false;
    } else {
      index[k] = hits.front();
      for (std::size_t j = 0; j < k; ++j)
        if (index[j] == index[k] && complete) {
          diagnostics.error({file, header.line, header.cells[index[k]].column},
                            fmt::format("header: column '{}' is read for both {} and {}; map "
                                        "each to its own column (loads_from.headers)",
                                        header.cells[index[k]].text, kReactionColumns[j], ours));
          complete = false;
        }
    }
  }
  if (!complete) return {};

  std::vector<ReactionRow> rows;
  for (std::size_t r = 1; r < records.size(); ++r) {
    const CsvRecord& record = records[r];
    if (record.cells.size() != header.cells.size()) {
      const auto [hint, column] = ragged_hint(record, header.cells.size(), layout.delimiter);
      diagnostics.error({file, record.line, column},
                        fmt::format("row {}: found {} cells, expected {} as in the header; {}",
                                    record.line, record.cells.size(), header.cells.size(), hint));
      continue;
    }
    auto named = [&](std::size_t k) {
      const std::string& theirs = header.cells[index[k]].text;
      return header_key(theirs) == header_key(kReactionColumns[k])
                 ? fmt::format("'{}'", theirs)
                 : fmt::format("'{}' ({})", theirs, kReactionColumns[k]);
    };
    ReactionRow row;
    row.where = {file, record.line, record.cells.front().column};
    row.support = record.cells[index[0]].text;
    row.load_case = record.cells[index[1]].text;
    bool ok = true;
    for (std::size_t k = 0; k < 2; ++k) {
      const CsvCell& cell = record.cells[index[k]];
      if (!cell.text.empty()) continue;
      diagnostics.error({file, cell.line, cell.column},
                        fmt::format("row {}, column {}: expected a {} name, got ''", record.line,
                                    named(k), k == 0 ? "support" : "load case"));
      ok = false;
    }
    for (std::size_t c = 0; c < 6; ++c) {
      const CsvCell& cell = record.cells[index[c + 2]];
      const Quantity q = c < 3 ? Quantity::force : Quantity::moment;
      const Number n = read_number(cell.text, layout.decimal);
      if (!n.value) {
        diagnostics.error({file, cell.line, cell.column},
                          fmt::format("row {}, column {}: expected a number ({}), got '{}'{}",
                                      record.line, named(c + 2), describe(q, layout.units),
                                      cell.text, n.problem.empty() ? "" : "; " + n.problem));
        ok = false;
        continue;
      }
      row.values[c] = *n.value * to_si_factor(layout.units, q);
    }
    if (ok) rows.push_back(std::move(row));
  }
  return rows;
}

bool matches_pattern(const std::string& pattern, const std::string& name) {
  // Iterative wildcard match: remember the last '*' and retry from one character further.
  std::size_t p = 0, n = 0, star = std::string::npos, resume = 0;
  while (n < name.size()) {
    if (p < pattern.size() && (pattern[p] == '?' || pattern[p] == name[n])) {
      ++p;
      ++n;
    } else if (p < pattern.size() && pattern[p] == '*') {
      star = p++;
      resume = n;
    } else if (star != std::string::npos) {
      p = star + 1;
      n = ++resume;
    } else {
      return false;
    }
  }
  while (p < pattern.size() && pattern[p] == '*') ++p;
  return p == pattern.size();
}

}  // namespace cairn
