// chosen_file.hpp — the project file `cairn design --write` writes for the chosen layout.
//
// The file is the design file itself (read again with yaml-cpp, so every section the
// engineer wrote is kept as written, numbers as their text) with the `design:` section
// removed, `cap:` given the chosen thickness and outline, `piles:` the chosen layout, and
// the chosen pile type's `length` set (the type's entry copied from an included file when
// it lives there). Paths of includes and of loads_from.file are rewritten relative to the
// new file's folder. Comments of the design file are not carried over. Numbers are written
// in the file's length unit at full precision, so reading the file gives back the very
// numbers the search used (layouts.hpp).
#pragma once

#include <array>
#include <optional>
#include <string>
#include <vector>

#include "cairn/core/model.hpp"

namespace cairn {

// The chosen layout in the file's length unit.
struct ChosenLayout {
  std::string pile_type;
  std::string length_text;  // with its unit, e.g. "14.5 m"
  std::string thickness_text;  // a number in the file's unit, or with its unit
  // Outline: none (keep the file's), a rectangle, or a polygon.
  bool keep_outline = false;
  std::optional<std::array<double, 4>> rectangle;  // width, length, centre x, centre y
  std::vector<std::array<double, 2>> polygon;
  struct Head {
    std::string id;
    double x = 0.0, y = 0.0;
    std::optional<Batter> batter;
  };
  std::vector<Head> piles;
  std::vector<std::string> header;  // comment lines at the top (without '#')
};

// The text of the chosen project file. `design_file` is read again; `output_path` decides
// the relative paths. Throws InputError when the pile type's entry cannot be found or
// lives in a file of other units.
std::string chosen_project_text(const std::string& design_file, const std::string& output_path,
                                const ChosenLayout& chosen);

}  // namespace cairn
