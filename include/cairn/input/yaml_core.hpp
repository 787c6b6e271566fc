// yaml_core.hpp — a YAML document as cairn's own located values, and the helpers every
// section reader uses to read them.
//
// A document is read once, through yaml-cpp's event parser (YAML::Parser with an event
// handler), straight into YamlValue: null, a scalar (its text), a list or a map, each with
// its 1-based line and column. yaml-cpp's node tree is not built (it takes about 80× the
// file's size in memory; DEVELOPERS.md has the measurements). While the events arrive the
// document's shape is checked, so that no user data reaches a yaml-cpp exception later:
// - every key of a map is a name (a scalar): `? [a, b]` is refused;
// - keys are unique (YAML 1.2, section 3.2.1.1); the second is reported, the first kept;
// - an alias never names a map or list that contains it (`x: &p {a: *p}`), and aliases
//   written out stand for at most a budget of values proportional to the file's size (ten
//   nested aliases of ten, 575 bytes, would be 10¹⁰ values). An alias shares the value it
//   names, so reading stays linear in the size of the text;
// - lists and maps nest at most kMaxNesting levels (a scan of the text before parsing).
//
// Located is a value with its file and key path ("piles[3].x"); a key that is absent is
// located at its nearest present parent (a missing key is reported where it belongs).
// ReadContext reads numbers with units, names, flags and choices from Located values,
// adding located diagnostics; the section readers (sections.hpp) are written with it.
#pragma once

#include <array>
#include <deque>
#include <map>
#include <memory>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "cairn/core/diagnostics.hpp"
#include "cairn/core/model.hpp"
#include "cairn/core/units.hpp"

namespace cairn {

// Lists and maps nested deeper than this are refused (docs/input.md, "Limits").
constexpr int kMaxNesting = 200;

struct YamlValue {
  enum class Kind : unsigned char { null, scalar, sequence, map };
  struct Entry {
    std::string key;
    int line = 0, column = 0;  // of the key, 1-based
    const YamlValue* value = nullptr;
  };
  Kind kind = Kind::null;
  int line = 0, column = 0;  // 1-based
  std::string scalar;                   // Kind::scalar
  std::vector<const YamlValue*> items;  // Kind::sequence
  std::vector<Entry> entries;           // Kind::map, in the file's order, keys unique

  // The value of `key`, or nullptr (a linear search: maps of named entries are walked
  // through `entries`, never looked up key by key).
  const YamlValue* find(std::string_view key) const;
};

// The values of one document; an alias is a pointer to the value it names.
struct YamlDocument {
  const YamlValue* root = nullptr;  // nullptr: no document (only comments)
  std::deque<YamlValue> values;     // storage; values never move
};

// Parses the text of `file`. Problems are added to `diagnostics` (malformed YAML, a tab in
// the indentation, nesting, keys, aliases); returns nullptr when the document cannot be
// read further.
std::unique_ptr<YamlDocument> parse_yaml(const std::string& text, const std::string& file,
                                         Diagnostics& diagnostics);

// The first key at the top of the document in `text` that is not in `skip`, read from the
// first events only (the rest of the text is not parsed); nullopt when the top is not a
// map, has no other key, or the text is not well-formed YAML.
std::optional<std::string> first_top_level_key(const std::string& text,
                                               const std::vector<std::string>& skip);

// A value in its file, with its key path.
struct Located {
  const YamlValue* node = nullptr;  // nullptr: the key is absent
  const std::string* file = nullptr;
  std::string path;
  int line = 0, column = 0;  // the value's, or its nearest present parent's when absent

  static Located of(const YamlValue* value, const std::string& file, std::string path);

  bool defined() const { return node != nullptr; }
  bool present() const { return node && node->kind != YamlValue::Kind::null; }
  bool is_scalar() const { return node && node->kind == YamlValue::Kind::scalar; }
  bool is_sequence() const { return node && node->kind == YamlValue::Kind::sequence; }
  bool is_map() const { return node && node->kind == YamlValue::Kind::map; }
  const std::string& scalar() const { return node->scalar; }
  // Items of a list or entries of a map; 0 for anything else.
  std::size_t size() const;
  SourceLocation where() const { return {*file, line, column}; }

  Located child(std::string_view key) const;
  Located item(std::size_t index) const;
  Located entry(const YamlValue::Entry& e) const;  // an entry of this map
};

// "a list", "a map", "nothing", or the scalar's text: what a message says was found.
std::string scalar_text(const Located& n);

// The location of a map's key.
inline SourceLocation key_location(const YamlValue::Entry& e, const std::string& file) {
  return {file, e.line, e.column};
}

// "a, b, c".
std::string list_of(const std::vector<std::string>& names);

template <typename Map>
std::vector<std::string> keys_of(const Map& map) {
  std::vector<std::string> names;
  for (const auto& [name, value] : map) names.push_back(name);
  return names;
}

// Reports every key of the map `n` not in `allowed`, suggesting the closest one.
void check_keys(const Located& n, const std::vector<std::string>& allowed,
                Diagnostics& diagnostics);

// The shared state of the section readers: the diagnostics, the warnings, and the units
// of each file (plain numbers are in the units of the file they are written in).
class ReadContext {
 public:
  ReadContext(Diagnostics& diagnostics, const std::map<std::string, UnitSystem>& file_units,
              UnitSystem project_units)
      : diag_(diagnostics), file_units_(file_units), project_units_(project_units) {}

  enum class Need { optional, required };
  enum class Sign { any, positive, non_negative };

  Diagnostics& diagnostics() { return diag_; }
  void error(const SourceLocation& where, std::string message) {
    diag_.error(where, std::move(message));
  }
  // Warnings, in the order found; the assembly moves them into Project::warnings.
  void warn(const SourceLocation& where, std::string message) {
    warnings_.push_back({where, std::move(message)});
  }
  std::vector<Warning> take_warnings() { return std::move(warnings_); }
  bool has_errors() const { return !diag_.empty(); }

  SourceLocation at(const Located& n) const { return n.where(); }
  UnitSystem units_of(const Located& n) const;
  UnitSystem project_units() const { return project_units_; }

  void check_keys(const Located& map, const std::vector<std::string>& allowed) {
    cairn::check_keys(map, allowed, diag_);
  }
  bool expect_map(const Located& n);

  // A number of quantity `q` at `parent.key`, converted to SI.
  std::optional<double> number(const Located& parent, std::string_view key, Quantity q,
                               Need need = Need::required, Sign sign = Sign::positive) {
    return number_at(parent, parent.child(key), q, need, sign);
  }
  // number() for a child `n` of `parent` already found.
  std::optional<double> number_at(const Located& parent, const Located& n, Quantity q,
                                  Need need = Need::required, Sign sign = Sign::positive);
  std::optional<std::string> text(const Located& parent, std::string_view key,
                                  Need need = Need::required);
  std::optional<bool> flag(const Located& parent, std::string_view key);

  // A choice among fixed names.
  template <typename T>
  std::optional<T> choice(const Located& n, const std::map<std::string, T>& options) {
    const std::string s = n.is_scalar() ? n.scalar() : scalar_text(n);
    auto it = options.find(s);
    if (it != options.end()) return it->second;
    diag_.error(at(n), choice_message(n, keys_of(options), s));
    return std::nullopt;
  }

  // A list of 2 (or 3 when allowed) coordinates; z is NaN when not given.
  std::optional<std::array<double, 3>> point(const Located& n, bool allow_z);

 private:
  static std::string choice_message(const Located& n, const std::vector<std::string>& names,
                                    const std::string& got);

  Diagnostics& diag_;
  const std::map<std::string, UnitSystem>& file_units_;
  UnitSystem project_units_;
  std::vector<Warning> warnings_;
};

}  // namespace cairn
