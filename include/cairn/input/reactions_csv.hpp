// reactions_csv.hpp — support reactions exported from a structural model, read from CSV.
//
// The file is a header row, then one row per support and load case (or per support and
// combination). Columns are found by name — `support`, `case`, `Fx`, `Fy`, `Fz`, `Mx`, `My`,
// `Mz`, or the file's own names mapped onto these — compared without regard to case and
// surrounding spaces; other columns are ignored. The text follows RFC 4180 (Shafranovich,
// 2005): quoted cells may hold the delimiter, line breaks and doubled quotes; CRLF or LF line
// ends; a UTF-8 byte-order mark is skipped.
//
// Nothing is guessed: a row with more or fewer cells than the header, a number written with
// a thousands separator, a decimal comma where a point is expected, or a header separated by
// another delimiter is a located problem (file:line:column, 1-based), never a shifted column.
// Values are returned in SI (kN, kN·m) exactly as signed in the file.
#pragma once

#include <array>
#include <map>
#include <string>
#include <vector>

#include "cairn/core/diagnostics.hpp"
#include "cairn/core/model.hpp"
#include "cairn/core/units.hpp"

namespace cairn {

// One cell as written: text without the quotes (unquoted cells trimmed of spaces), and where
// it starts.
struct CsvCell {
  std::string text;
  int line = 0;    // 1-based
  int column = 0;  // 1-based, in characters of the line (the byte-order mark not counted)
  bool quoted = false;
};

// One record (row); `line` is the line it starts on.
struct CsvRecord {
  std::vector<CsvCell> cells;
  int line = 0;
};

// The records of `text` split by `delimiter` (RFC 4180 quoting). Blank lines are skipped.
// Problems (an unclosed quote, text after a closing quote) go to `diagnostics`, located in
// `file`.
std::vector<CsvRecord> parse_csv(const std::string& text, const std::string& file,
                                 char delimiter, Diagnostics& diagnostics);

// The columns cairn reads, in this order.
inline constexpr std::array<const char*, 8> kReactionColumns = {"support", "case", "Fx", "Fy",
                                                                "Fz",      "Mx",   "My", "Mz"};

// How to read a reactions file.
struct ReactionsLayout {
  char delimiter = ',';  // ',', ';' or '\t'
  char decimal = '.';    // '.' or ','
  // The file's header name for a cairn column (key one of kReactionColumns); a column not
  // listed here is looked for under its own name.
  std::map<std::string, std::string> headers;
  UnitSystem units = UnitSystem::SI;  // units of the numbers: kN, kN·m or kip, kip·ft
};

// One row of the file.
struct ReactionRow {
  SourceLocation where;  // the row's first cell
  std::string support;
  std::string load_case;  // a load case or, when imported as combinations, a combination
  Wrench values{};        // Fx, Fy, Fz (kN), Mx, My, Mz (kN·m), as signed in the file
};

// Every row of the reactions file whose content is `text` (named `file` in messages).
// Requires: `layout.headers` keys are names from kReactionColumns. Problems go to
// `diagnostics`; rows with a problem are left out of the result.
std::vector<ReactionRow> read_reactions_csv(const std::string& text, const std::string& file,
                                            const ReactionsLayout& layout,
                                            Diagnostics& diagnostics);

// Whether `name` matches `pattern`, where `*` stands for any run of characters and `?` for
// one character; other characters match themselves (case-sensitive).
bool matches_pattern(const std::string& pattern, const std::string& name);

}  // namespace cairn
