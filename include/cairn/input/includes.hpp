// includes.hpp — a project file read with the files it includes, merged into one set of
// top-level sections.
//
// `include: file.yaml` (or a list) reads other files first, relative to the including
// file; an include of a file already being read is refused with the chain of files. Each
// file may say its own `units` (plain numbers in it are in those units). Sections that are
// maps of named entries (pile_types, load_cases, combinations) are merged entry by entry,
// the including file winning, through a hash map (linear in the number of entries); every
// other section is replaced whole.
#pragma once

#include <map>
#include <memory>
#include <set>
#include <string>
#include <unordered_map>
#include <vector>

#include "cairn/core/diagnostics.hpp"
#include "cairn/core/units.hpp"
#include "cairn/input/yaml_core.hpp"

namespace cairn {

// One top-level section, or one named entry of a section, remembering its file.
struct NamedEntry {
  std::string name;
  Located value;
  SourceLocation key_where;
};

struct MergedDocument {
  std::map<std::string, NamedEntry> sections;
  std::map<std::string, std::vector<NamedEntry>> named;  // entries of the named sections
  std::map<std::string, std::unordered_map<std::string, std::size_t>> named_index;
  std::map<std::string, UnitSystem> file_units;  // the files that say their units
  std::set<std::string> files;                   // file names, kept alive for Located::file
  std::vector<std::unique_ptr<YamlDocument>> documents;  // the values, kept alive

  const NamedEntry* section(const std::string& name) const;
  // The entries of a named section, in the order of the merged files.
  const std::vector<NamedEntry>& entries(const std::string& name) const;
};

struct DocumentShape {
  std::vector<std::string> top_keys;     // keys allowed at the top of every file
  std::set<std::string> named_sections;  // sections merged entry by entry
};

// Reads `path` and its includes. Problems are added to `diagnostics`.
MergedDocument read_with_includes(const std::string& path, const DocumentShape& shape,
                                  Diagnostics& diagnostics);

// Reads a whole file into `text`; false when it cannot be opened.
bool read_text_file(const std::string& path, std::string& text);

}  // namespace cairn
