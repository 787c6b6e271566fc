#include "cairn/input/input.hpp"

#include <yaml-cpp/depthguard.h>
#include <yaml-cpp/yaml.h>

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <fstream>
#include <map>
#include <set>
#include <sstream>
#include <unordered_map>

#include <fmt/format.h>

#include "cairn/core/quantity_format.hpp"
#include "cairn/geotechnics/capacity.hpp"
#include "cairn/input/combinations.hpp"
#include "cairn/geotechnics/group.hpp"
#include "cairn/input/package_keys.hpp"
#include "cairn/input/reactions_csv.hpp"

namespace cairn {
namespace {

namespace fs = std::filesystem;

// A YAML node with the file it came from and its key path ("piles[3].x"). A key that is
// absent has no mark of its own; it is located at the nearest parent that is present
// (STYLE: a missing key is reported at its parent's location).
struct Located {
  YAML::Node node;
  const std::string* file = nullptr;
  std::string path;
  YAML::Mark parent_mark = YAML::Mark::null_mark();

  bool present() const { return node.IsDefined() && !node.IsNull(); }
  YAML::Mark mark() const { return node.IsDefined() ? node.Mark() : parent_mark; }
  Located child(const std::string& key) const {
    const YAML::Node& self = node;
    return {self.IsMap() ? valid(self[key]) : absent(), file, joined(key), mark()};
  }
  Located item(std::size_t index) const {
    const YAML::Node& self = node;
    return {self.IsSequence() ? valid(self[index]) : absent(), file,
            fmt::format("{}[{}]", path, index), mark()};
  }

 private:
  std::string joined(const std::string& key) const { return path.empty() ? key : path + "." + key; }
  // yaml-cpp answers a lookup of an absent key with a node on which every question but
  // IsDefined() throws; an undefined node answers them all.
  static YAML::Node absent() { return YAML::Node(YAML::NodeType::Undefined); }
  static YAML::Node valid(const YAML::Node& found) { return found.IsDefined() ? found : absent(); }
};

SourceLocation location_of(const YAML::Mark& mark, const std::string& file) {
  if (mark.line < 0) return {file, 0, 0};
  return {file, mark.line + 1, mark.column + 1};
}

SourceLocation location_of(const YAML::Node& node, const std::string& file) {
  if (!node.IsDefined()) return {file, 0, 0};
  return location_of(node.Mark(), file);
}

std::string scalar_text(const YAML::Node& node) {
  if (node.IsScalar()) return node.Scalar();
  if (node.IsSequence()) return "a list";
  if (node.IsMap()) return "a map";
  return "nothing";
}

// Limits on the shape of a project file (docs/input.md, "Limits"). A project nests about
// six levels deep; yaml-cpp 0.7 itself stops at about 500 levels (its depth guard), so the
// limit is ours and is named in the message.
constexpr int kMaxNesting = 200;
// Nodes a document may stand for with its aliases written out: a base that no hand-written
// file reaches, plus a few per byte, so that the work of every reader stays proportional
// to the size of the file.
constexpr std::size_t kAliasBudgetBase = 100000;
constexpr std::size_t kAliasBudgetPerByte = 4;
// Messages of one kind about the piles (same id, same position, overlap) shown before the
// rest are counted in one line: 5,000 copies of one pile need not print 5,000 lines.
constexpr std::size_t kShownConflicts = 5;

// Where the nesting of lists and maps first goes deeper than kMaxNesting, if it does: a
// scan of the text before yaml-cpp sees it. Block nesting is counted by indentation
// (and by each '- ' of a compact list), flow nesting by open brackets outside quotes and
// comments; block scalars (| and >) are skipped. The count is close to, never far above,
// yaml-cpp's own, which is what matters for a limit this far above real files.
std::optional<SourceLocation> too_deep(const std::string& text, const std::string& file) {
  std::vector<std::size_t> indents;  // block levels open
  int flow = 0;                      // brackets open
  char quote = 0;                    // inside '…' or "…" (may span lines in flow)
  constexpr std::size_t kNone = std::string::npos;
  std::size_t literal_indent = kNone;  // inside a block scalar opened at this indent
  int line_number = 0;
  std::size_t begin = 0;
  while (begin < text.size()) {
    std::size_t end = text.find('\n', begin);
    if (end == std::string::npos) end = text.size();
    const std::string_view line(text.data() + begin, end - begin);
    begin = end + 1;
    ++line_number;
    const std::size_t indent = std::min(line.find_first_not_of(' '), line.size());
    const bool blank = line.find_first_not_of(" \t\r") == std::string_view::npos;
    if (literal_indent != kNone) {
      if (blank || indent > literal_indent) continue;
      literal_indent = kNone;
    }
    std::size_t i = indent;
    if (flow == 0 && quote == 0 && !blank && line[indent] != '#') {
      while (!indents.empty() && indents.back() >= indent) indents.pop_back();
      indents.push_back(indent);
      // A compact list: '- - x' opens a level per dash.
      while (i + 1 < line.size() && line[i] == '-' && line[i + 1] == ' ') {
        i += 2;
        while (i < line.size() && line[i] == ' ') ++i;
        indents.push_back(i);
      }
    }
    if (static_cast<int>(indents.size()) + flow > kMaxNesting)
      return SourceLocation{file, line_number, static_cast<int>(i) + 1};
    for (; i < line.size(); ++i) {
      const char c = line[i];
      if (quote == '"') {
        if (c == '\\') ++i;
        else if (c == '"') quote = 0;
        continue;
      }
      if (quote == '\'') {
        if (c == '\'') quote = 0;  // '' inside reopens at once: the escape of a quote
        continue;
      }
      const bool after_space = i == 0 || line[i - 1] == ' ' || line[i - 1] == '\t';
      const bool starts_value = i == 0 || std::string_view(" \t[{,:").find(line[i - 1]) !=
                                              std::string_view::npos;
      if (c == '#' && after_space) break;
      if ((c == '"' || c == '\'') && starts_value) quote = c;
      else if (c == '[' || c == '{') {
        if (static_cast<int>(indents.size()) + ++flow > kMaxNesting)
          return SourceLocation{file, line_number, static_cast<int>(i) + 1};
      } else if ((c == ']' || c == '}') && flow > 0) --flow;
      else if ((c == '|' || c == '>') && flow == 0 && starts_value) {
        const std::string_view rest = line.substr(i + 1);
        if (rest.find_first_not_of("+-0123456789 \t\r") == std::string_view::npos ||
            rest.find_first_not_of("+-0123456789 \t") == rest.find('#'))
          literal_indent = indent;
      }
    }
  }
  return std::nullopt;
}

// The first tab in the indentation of a line up to `last_line` (1-based), if any: yaml-cpp
// reports a tab there as "illegal map value" or "end of map not found".
std::optional<SourceLocation> tab_in_indentation(const std::string& text, int last_line,
                                                 const std::string& file) {
  int line_number = 1;
  bool at_start = true;
  int column = 1;
  for (const char c : text) {
    if (line_number > last_line) break;
    if (c == '\n') {
      ++line_number;
      at_start = true;
      column = 1;
      continue;
    }
    if (at_start && c == '\t') return SourceLocation{file, line_number, column};
    if (c != ' ') at_start = false;
    ++column;
  }
  return std::nullopt;
}

// One top-level entry of the merged document, remembering its file.
struct Entry {
  std::string name;
  Located value;
  SourceLocation key_where;
};

// The project file merged with its includes. Sections that are maps of named entries are
// merged entry by entry (the including file wins); other sections are replaced whole.
struct Merged {
  std::map<std::string, Entry> sections;
  std::map<std::string, std::vector<Entry>> named;  // pile_types, load_cases, combinations
  // Position of each entry in `named`, by section and name: merging stays linear in the
  // number of entries (a search of the list for each made 500,000 load cases a hang).
  std::map<std::string, std::unordered_map<std::string, std::size_t>> named_index;
  std::map<std::string, UnitSystem> file_units;
  std::set<std::string> files;  // keeps the file names alive for Located::file
};

const std::vector<std::string> kTopKeys = {"title", "units", "include", "cap", "pile_types",
                                           "piles", "soil", "load_cases", "combinations", "columns", "loads_from",
                                           "group", "package", "design"};
const std::set<std::string> kNamedSections = {"pile_types", "load_cases", "combinations"};

const std::map<std::string, LoadKind> kLoadKinds = {
    {"dead", LoadKind::dead},         {"live", LoadKind::live},
    {"roof_live", LoadKind::roof_live}, {"snow", LoadKind::snow},
    {"rain", LoadKind::rain},         {"wind", LoadKind::wind},
    {"seismic", LoadKind::seismic},   {"earth", LoadKind::earth},
    {"fluid", LoadKind::fluid},       {"temperature", LoadKind::temperature},
    {"other", LoadKind::other},       {"wearing_surface", LoadKind::wearing_surface},
    {"vertical_earth", LoadKind::vertical_earth}, {"collision", LoadKind::collision}};

std::string list_of(const std::vector<std::string>& names) {
  std::string text;
  for (const auto& n : names) text += (text.empty() ? "" : ", ") + n;
  return text;
}

template <typename Map>
std::vector<std::string> keys_of(const Map& map) {
  std::vector<std::string> names;
  for (const auto& [name, value] : map) names.push_back(name);
  return names;
}

class Reader {
 public:
  Reader(Diagnostics& diagnostics, Piles piles) : diag_(diagnostics), piles_(piles) {}

  // ---- documents and includes -------------------------------------------------------

  void load(const std::string& path, const SourceLocation& included_from,
            std::vector<std::string>& stack, Merged& merged) {
    std::error_code ec;
    const fs::path canonical = fs::weakly_canonical(fs::absolute(path), ec);
    const std::string key = canonical.string();
    if (std::find(stack.begin(), stack.end(), key) != stack.end()) {
      // Name the files as the user wrote them, not as absolute paths of this machine.
      std::string chain;
      for (const auto& name : reading_) chain += name + " → ";
      diag_.error(included_from,
                  fmt::format("include: '{}' includes itself ({}{})", path, chain, path));
      return;
    }
    std::ifstream in(path, std::ios::binary);
    if (!in) {
      if (stack.empty())
        diag_.error({path, 0, 0}, "cannot open the project file (does it exist?)");
      else
        diag_.error(included_from, fmt::format("include: cannot open '{}'", path));
      return;
    }
    std::stringstream buffer;
    buffer << in.rdbuf();
    const std::string text = buffer.str();
    const std::string& file = *merged.files.insert(path).first;
    if (text.find_first_not_of(" \t\r\n") == std::string::npos) {
      diag_.error({file, 1, 1}, "the file is empty; expected a project (title, units, cap, "
                                "pile_types, piles, load_cases, combinations)");
      return;
    }
    if (const auto deep = too_deep(text, file)) {
      diag_.error(*deep, fmt::format("lists and maps nested deeper than {} levels; a project "
                                     "needs fewer than ten",
                                     kMaxNesting));
      return;
    }
    YAML::Node root;
    try {
      root = YAML::Load(text);
    } catch (const YAML::DeepRecursion& e) {
      diag_.error({file, e.mark.line + 1, e.mark.column + 1},
                  fmt::format("lists and maps nested deeper than {} levels; a project needs "
                              "fewer than ten",
                              kMaxNesting));
      return;
    } catch (const YAML::ParserException& e) {
      if (const auto tab = tab_in_indentation(text, e.mark.line + 1, file))
        diag_.error(*tab, "tab character in indentation; YAML indents with spaces");
      else
        diag_.error({file, e.mark.line + 1, e.mark.column + 1},
                    fmt::format("malformed YAML: {}", e.msg));
      return;
    }
    if (root.IsNull()) {  // nothing but comments
      diag_.error({file, 1, 1}, "the file is empty; expected a project (title, units, cap, "
                                "pile_types, piles, load_cases, combinations)");
      return;
    }
    if (!root.IsMap()) {
      diag_.error({file, 1, 1}, fmt::format("expected a map of keys (title, units, cap, …) at "
                                            "the top of the file, got {}",
                                            scalar_text(root)));
      return;
    }
    if (!check_structure(root, file, text)) return;
    const Located top{root, &file, ""};
    check_keys(top, kTopKeys);
    if (auto units = top.child("units"); units.present()) {
      const std::string u = units.node.IsScalar() ? units.node.Scalar() : "";
      if (u == "SI") merged.file_units[file] = UnitSystem::SI;
      else if (u == "US") merged.file_units[file] = UnitSystem::US;
      else
        diag_.error(location_of(units.node, file),
                    fmt::format("units: expected 'SI' or 'US', got '{}'", scalar_text(units.node)));
    }
    stack.push_back(key);
    reading_.push_back(path);
    if (auto includes = top.child("include"); includes.present()) {
      std::vector<Located> list;
      if (includes.node.IsSequence()) {
        for (std::size_t i = 0; i < includes.node.size(); ++i) list.push_back(includes.item(i));
      } else {
        list.push_back(includes);
      }
      for (const auto& inc : list) {
        if (!inc.node.IsScalar()) {
          diag_.error(location_of(inc.node, file),
                      fmt::format("{}: expected a file path, got {}", inc.path,
                                  scalar_text(inc.node)));
          continue;
        }
        const fs::path target = fs::path(file).parent_path() / inc.node.Scalar();
        load(target.lexically_normal().string(), location_of(inc.node, file), stack, merged);
      }
    }
    stack.pop_back();
    reading_.pop_back();
    for (auto it = root.begin(); it != root.end(); ++it) {
      const std::string name = it->first.as<std::string>();
      if (name == "include") continue;
      const Located value{it->second, &file, name};
      const SourceLocation where = location_of(it->first, file);
      if (kNamedSections.count(name) && value.node.IsMap()) {
        auto& entries = merged.named[name];
        auto& index = merged.named_index[name];
        for (auto e = value.node.begin(); e != value.node.end(); ++e) {
          const std::string entry_name = e->first.as<std::string>();
          Entry entry{entry_name, {e->second, &file, name + "." + entry_name},
                      location_of(e->first, file)};
          const auto [same, fresh] = index.emplace(entry_name, entries.size());
          if (fresh) entries.push_back(entry);
          else entries[same->second] = entry;
        }
        merged.sections[name] = {name, value, where};
      } else {
        merged.sections[name] = {name, value, where};
        merged.named.erase(name);
        merged.named_index.erase(name);
      }
    }
  }

  // The shape of a document, checked before any value is read (STYLE: user data never
  // reaches yaml-cpp's own exceptions):
  // - every key of a mapping is a name (a scalar): `? [a, b]` is refused;
  // - keys are unique: YAML 1.2 (section 3.2.1.1) requires it, but yaml-cpp accepts a
  //   repeated key and a lookup then finds the first value while the entry-by-entry merge
  //   keeps the last; either way one value would be silently dropped;
  // - an alias never names a node that contains it (`x: &p {a: *p}`), and aliases written
  //   out stand for at most a budget of nodes proportional to the file's size, so that
  //   ten nested aliases of ten (575 bytes, 10¹⁰ nodes) are refused, not expanded.
  // An anchored node is walked once however many aliases name it; its size with aliases
  // written out is remembered. The walk is therefore linear in the size of the text.
  // Returns false when the document cannot be read further.
  bool check_structure(const YAML::Node& root, const std::string& file, const std::string& text) {
    StructureWalk walk{diag_, file, text, kAliasBudgetBase + kAliasBudgetPerByte * text.size(),
                       false, {}};
    walk.walk(root, "", location_of(root, file), 0);
    return !walk.fatal;
  }

  struct StructureWalk {
    Diagnostics& diag;
    const std::string& file;
    const std::string& text;
    std::size_t budget;  // nodes, with every alias written out
    bool fatal = false;
    // Anchored nodes by their offset in the text: expanded size, or kWalking while the walk
    // is inside them (meeting one then is a cycle). Only anchored nodes can be aliased.
    std::unordered_map<int, std::vector<std::pair<YAML::Node, std::size_t>>> anchored;
    static constexpr std::size_t kWalking = static_cast<std::size_t>(-1);

    // yaml-cpp marks a node where its properties begin, so an anchored node starts with '&'
    // (or with a tag '!' that may precede the anchor).
    // yaml-cpp does not count a UTF-8 byte-order mark in its offsets.
    bool is_anchored(const YAML::Node& node) const {
      const std::size_t bom = text.rfind("\xEF\xBB\xBF", 0) == 0 ? 3 : 0;
      const int pos = node.Mark().pos;
      if (pos < 0 || static_cast<std::size_t>(pos) + bom >= text.size()) return false;
      const char c = text[static_cast<std::size_t>(pos) + bom];
      return c == '&' || c == '!';
    }

    // The number of nodes `node` stands for with its aliases written out (0 after a fatal
    // problem). `reached_at` locates the key or list that leads to it.
    std::size_t walk(const YAML::Node& node, const std::string& path,
                     const SourceLocation& reached_at, int depth) {
      if (fatal) return 0;
      if (!node.IsMap() && !node.IsSequence()) return 1;
      const std::string shown = path.empty() ? "the top level" : path;
      // A cycle the anchor test missed still ends here; the nesting pre-scan keeps real
      // documents far shallower.
      if (depth > kMaxNesting) {
        diag.error(reached_at, fmt::format("lists and maps nested deeper than {} levels "
                                           "through aliases (does an alias name a map or list "
                                           "that contains it?)", kMaxNesting));
        fatal = true;
        return 0;
      }
      const bool remember = is_anchored(node);
      const int pos = node.Mark().pos;
      if (remember) {
        for (const auto& [known, size] : anchored[pos]) {
          if (!known.is(node)) continue;
          if (size == kWalking) {
            diag.error(reached_at, fmt::format("{}: an alias refers to a map or list that "
                                               "contains it (a cycle); an alias may only "
                                               "repeat a complete earlier value", shown));
            fatal = true;
            return 0;
          }
          return size;
        }
        anchored[pos].emplace_back(node, kWalking);
      }
      std::size_t total = 1;
      if (node.IsSequence()) {
        const SourceLocation here = location_of(node, file);
        for (std::size_t i = 0; i < node.size() && !fatal; ++i) {
          total += walk(node[i], fmt::format("{}[{}]", path, i), here, depth + 1);
          if (over_budget(total, node, shown)) return 0;
        }
      } else {
        std::unordered_map<std::string, int> first_line;
        for (auto it = node.begin(); it != node.end() && !fatal; ++it) {
          const SourceLocation here = location_of(it->first, file);
          if (!it->first.IsScalar()) {
            diag.error(here, fmt::format("{}expected a name as a key, got {}",
                                         path.empty() ? "" : path + ": ", scalar_text(it->first)));
            fatal = true;
            return 0;
          }
          const std::string key = it->first.Scalar();
          const std::string where = path.empty() ? key : path + "." + key;
          const auto [seen, added] = first_line.emplace(key, here.line);
          if (!added) {
            diag.error(here, fmt::format("{}: given twice (first at line {})", where, seen->second));
            continue;
          }
          total += 1 + walk(it->second, where, here, depth + 1);
          if (over_budget(total, node, shown)) return 0;
        }
      }
      if (remember)
        for (auto& [known, size] : anchored[pos])
          if (known.is(node)) size = total;
      return total;
    }

    bool over_budget(std::size_t total, const YAML::Node& node, const std::string& shown) {
      if (fatal) return true;
      if (total <= budget) return false;
      diag.error(location_of(node, file),
                 fmt::format("{}: aliases expand this to more than {} values, the limit for a "
                             "file of {} bytes; write the values out or nest fewer aliases",
                             shown, budget, text.size()));
      fatal = true;
      return true;
    }
  };

  // ---- values -----------------------------------------------------------------------

  SourceLocation at(const Located& n) const { return location_of(n.mark(), *n.file); }

  UnitSystem units_of(const Located& n) const {
    auto it = file_units_->find(*n.file);
    return it != file_units_->end() ? it->second : project_units_;
  }

  void check_keys(const Located& map, const std::vector<std::string>& allowed) {
    if (!map.node.IsMap()) return;
    for (auto it = map.node.begin(); it != map.node.end(); ++it) {
      const std::string key = it->first.Scalar();
      if (std::find(allowed.begin(), allowed.end(), key) != allowed.end()) continue;
      const std::string near = closest_match(key, allowed);
      const std::string where = map.path.empty() ? key : map.path + "." + key;
      diag_.error(location_of(it->first, *map.file),
                  near.empty() ? fmt::format("{}: unknown key; expected one of: {}", where,
                                             list_of(allowed))
                               : fmt::format("{}: unknown key; did you mean '{}'?", where, near));
    }
  }

  bool expect_map(const Located& n) {
    if (n.node.IsMap()) return true;
    diag_.error(at(n), fmt::format("{}: expected a map of keys, got {}", n.path,
                                   n.present() ? "'" + scalar_text(n.node) + "'" : "nothing"));
    return false;
  }

  enum class Need { optional, required };
  enum class Sign { any, positive, non_negative };

  std::optional<double> number(const Located& parent, const std::string& key, Quantity q,
                               Need need = Need::required, Sign sign = Sign::positive) {
    return number_at(parent, parent.child(key), q, need, sign);
  }

  // number() for a child `n` of `parent` already found (yaml-cpp looks a key up by a
  // linear search, so a loop over a map's entries passes each entry's node).
  std::optional<double> number_at(const Located& parent, const Located& n, Quantity q,
                                  Need need = Need::required, Sign sign = Sign::positive) {
    const UnitSystem units = units_of(parent);
    const std::string sign_word = sign == Sign::positive       ? "a positive "
                                  : sign == Sign::non_negative ? "a non-negative "
                                                               : "";
    std::string expected = describe(q, units);
    if (!sign_word.empty()) expected = sign_word + expected.substr(expected.find(' ') + 1);
    if (!n.present()) {
      if (need == Need::required)
        diag_.error(at(parent), fmt::format("{}: missing; expected {}", n.path, expected));
      return std::nullopt;
    }
    if (!n.node.IsScalar()) {
      diag_.error(at(n), fmt::format("{}: expected {}, got {}", n.path, expected,
                                     scalar_text(n.node)));
      return std::nullopt;
    }
    const auto parsed = parse_quantity(n.node.Scalar(), q, units);
    if (!parsed.si) {
      diag_.error(at(n), fmt::format("{}: {}", n.path, parsed.error));
      return std::nullopt;
    }
    const double v = *parsed.si;
    if ((sign == Sign::positive && !(v > 0)) || (sign == Sign::non_negative && v < 0)) {
      diag_.error(at(n),
                  fmt::format("{}: expected {}, got '{}'", n.path, expected, n.node.Scalar()));
      return std::nullopt;
    }
    if (sign == Sign::positive && v < smallest_plausible(q)) {
      const double shown = q == Quantity::angle ? smallest_plausible(q)
                                                : from_si(units, q, smallest_plausible(q));
      diag_.error(at(n), fmt::format("{}: expected {} of at least {:g}, got '{}'", n.path,
                                     expected, shown, n.node.Scalar()));
      return std::nullopt;
    }
    return v;
  }

  std::optional<std::string> text(const Located& parent, const std::string& key,
                                  Need need = Need::required) {
    const Located n = parent.child(key);
    if (!n.present()) {
      if (need == Need::required)
        diag_.error(at(parent), fmt::format("{}: missing; expected a name", n.path));
      return std::nullopt;
    }
    if (!n.node.IsScalar()) {
      diag_.error(at(n), fmt::format("{}: expected a name, got {}", n.path, scalar_text(n.node)));
      return std::nullopt;
    }
    return n.node.Scalar();
  }

  std::optional<bool> flag(const Located& parent, const std::string& key) {
    const Located n = parent.child(key);
    if (!n.present()) return std::nullopt;
    const std::string s = n.node.IsScalar() ? n.node.Scalar() : "";
    if (s == "true" || s == "yes") return true;
    if (s == "false" || s == "no") return false;
    diag_.error(at(n), fmt::format("{}: expected true or false, got '{}'", n.path,
                                   scalar_text(n.node)));
    return std::nullopt;
  }

  // A choice among fixed names.
  template <typename T>
  std::optional<T> choice(const Located& n, const std::map<std::string, T>& options) {
    const std::string s = n.node.IsScalar() ? n.node.Scalar() : scalar_text(n.node);
    auto it = options.find(s);
    if (it != options.end()) return it->second;
    diag_.error(at(n), fmt::format("{}: expected one of {}, got '{}'", n.path,
                                   list_of(keys_of(options)), s));
    return std::nullopt;
  }

  // A list of 2 (or 3 when allowed) coordinates.
  std::optional<std::array<double, 3>> point(const Located& n, bool allow_z) {
    const bool ok = n.node.IsSequence() &&
                    (n.node.size() == 2 || (allow_z && n.node.size() == 3));
    if (!ok) {
      diag_.error(at(n), fmt::format("{}: expected [x, y]{} in {}, got {}", n.path,
                                     allow_z ? " or [x, y, z]" : "",
                                     unit_label(units_of(n), Quantity::length),
                                     n.present() ? scalar_text(n.node) : "nothing"));
      return std::nullopt;
    }
    std::array<double, 3> p{0.0, 0.0, std::nan("")};
    for (std::size_t i = 0; i < n.node.size(); ++i) {
      const Located c = n.item(i);
      const auto parsed = parse_quantity(c.node.IsScalar() ? c.node.Scalar() : "", Quantity::length,
                                         units_of(n));
      if (!parsed.si) {
        diag_.error(at(c), fmt::format("{}: {}", c.path, parsed.error));
        return std::nullopt;
      }
      p[i] = *parsed.si;
    }
    return p;
  }

  // ---- sections ---------------------------------------------------------------------

  Project read(const std::string& path) {
    Merged merged;
    std::vector<std::string> stack;
    load(path, {path, 0, 0}, stack, merged);
    diag_.raise_if_any();
    file_units_ = &merged.file_units;
    files_ = &merged.files;
    Project project;
    project.file = path;
    auto section = [&](const std::string& name) -> const Entry* {
      auto it = merged.sections.find(name);
      return it == merged.sections.end() ? nullptr : &it->second;
    };
    const std::string& main_file = *merged.files.find(path);
    auto it_units = merged.file_units.find(main_file);
    if (it_units == merged.file_units.end()) {
      diag_.error({main_file, 1, 1}, "units: missing; expected 'SI' (kN, m, kPa) or 'US' "
                                     "(kip, ft, ksf)");
    } else {
      project_units_ = it_units->second;
    }
    project.units = project_units_;
    if (const Entry* title = section("title"); title && title->value.node.IsScalar())
      project.title = title->value.node.Scalar();
    else
      project.title = fs::path(path).stem().string();

    auto required = [&](const std::string& name) -> const Entry* {
      const Entry* e = section(name);
      if (!e) diag_.error({main_file, 1, 1}, fmt::format("{}: missing; the project needs it", name));
      return e;
    };
    if (const Entry* group = section("group")) read_group(group->value, project);
    if (const Entry* soil = section("soil")) project.soil = read_soil(soil->value);
    if (const Entry* cap = required("cap")) read_cap(cap->value, project);
    if (required("pile_types")) read_pile_types(merged.named["pile_types"],
                                                section("pile_types")->value, project);
    // `cairn design` reads a file whose piles the search will place (read_design.hpp).
    if (const Entry* piles = piles_ == Piles::optional ? section("piles") : required("piles"))
      read_piles(piles->value, project);
    if (const Entry* columns = section("columns")) read_columns(columns->value, project);
    // Reactions imported as combinations (loads_from.combinations) may be all the loads.
    const Entry* from = section("loads_from");
    const bool imports_combinations =
        from && from->value.node.IsMap() && from->value.child("combinations").present();
    if (imports_combinations ? section("load_cases") != nullptr : required("load_cases") != nullptr)
      read_load_cases(merged.named["load_cases"], section("load_cases")->value, project);
    if (imports_combinations ? section("combinations") != nullptr
                             : required("combinations") != nullptr)
      read_combinations(merged.named["combinations"], section("combinations")->value, project);
    if (from) read_reactions(from->value, project);
    project.input_files.push_back(path);
    for (const auto& f : merged.files)
      if (f != path && f != project.loads_file) project.input_files.push_back(f);
    if (const Entry* package = section("package"))
      read_package_settings(package->value.node, *package->value.file, project, diag_);
    if (diag_.empty()) add_self_weight(project);
    if (diag_.empty()) warn_unused_load_cases(project);
    diag_.raise_if_any();
    return project;
  }

  void read_group(const Located& n, Project& project) {
    if (!expect_map(n)) return;
    check_keys(n, {"efficiency", "efficiency_on", "min_spacing", "min_spacing_absolute",
                   "min_edge_distance", "settlement"});
    GroupSettings& g = project.group;
    g.where = at(n);
    if (auto e = n.child("efficiency"); e.present()) {
      const std::string name = e.node.IsScalar() ? e.node.Scalar() : scalar_text(e.node);
      if (!efficiency_method_from_string(name)) {
        diag_.error(at(e), fmt::format("group.efficiency: unknown method '{}'; expected one of {}",
                                       name, list_of(efficiency_method_names())));
      } else {
        g.efficiency = name;
      }
    }
    if (auto on = n.child("efficiency_on"); on.present())
      if (auto v = choice<bool>(on, {{"whole", false}, {"shaft", true}})) g.efficiency_shaft_only = *v;
    if (auto s = number(n, "min_spacing", Quantity::number, Need::optional)) g.min_spacing_factor = *s;
    if (auto s = number(n, "min_spacing_absolute", Quantity::length, Need::optional)) g.min_spacing = *s;
    if (auto s = number(n, "min_edge_distance", Quantity::length, Need::optional, Sign::non_negative))
      g.min_edge_distance = *s;
    if (auto st = n.child("settlement"); st.present()) {
      g.settlement = true;
      if (st.node.IsScalar() && (st.node.Scalar() == "true" || st.node.Scalar() == "yes")) return;
      if (st.node.IsScalar() && (st.node.Scalar() == "false" || st.node.Scalar() == "no")) {
        g.settlement = false;
        return;
      }
      if (!expect_map(st)) return;
      check_keys(st, {"limit", "tip_share"});
      g.settlement_limit = number(st, "limit", Quantity::small_length, Need::optional);
      g.tip_share = number(st, "tip_share", Quantity::number, Need::optional, Sign::non_negative);
      if (g.tip_share && *g.tip_share > 1.0)
        diag_.error(at(st.child("tip_share")), "group.settlement.tip_share: expected a share from 0 to 1");
    }
  }

  void read_cap(const Located& n, Project& project) {
    if (!expect_map(n)) return;
    check_keys(n, {"thickness", "outline", "self_weight", "depth"});
    Cap& cap = project.cap;
    cap.thickness = number(n, "thickness", Quantity::length).value_or(0.0);
    cap.depth = number(n, "depth", Quantity::length, Need::optional, Sign::non_negative)
                    .value_or(0.0);
    if (auto o = n.child("outline"); o.present() && expect_map(o)) {
      Outline outline;
      if (o.child("polygon").present()) {
        check_keys(o, {"polygon"});
        const Located poly = o.child("polygon");
        if (!poly.node.IsSequence() || poly.node.size() < 3) {
          diag_.error(at(poly), fmt::format("{}: expected a list of at least 3 corners [x, y]",
                                            poly.path));
        } else {
          for (std::size_t i = 0; i < poly.node.size(); ++i)
            if (auto p = point(poly.item(i), false)) outline.polygon.push_back({(*p)[0], (*p)[1]});
          outline.rectangle = false;
          // Keep corners counter-clockwise.
          double twice = 0.0;
          for (std::size_t i = 0; i < outline.polygon.size(); ++i) {
            const auto& a = outline.polygon[i];
            const auto& b = outline.polygon[(i + 1) % outline.polygon.size()];
            twice += a[0] * b[1] - b[0] * a[1];
          }
          if (twice < 0) std::reverse(outline.polygon.begin(), outline.polygon.end());
          if (std::abs(twice) < 1e-12)
            diag_.error(at(poly), fmt::format("{}: the polygon has no area", poly.path));
        }
      } else {
        check_keys(o, {"width", "length", "center"});
        const double w = number(o, "width", Quantity::length).value_or(0.0);
        const double l = number(o, "length", Quantity::length).value_or(0.0);
        std::array<double, 3> c{0.0, 0.0, 0.0};
        if (o.child("center").present())
          if (auto p = point(o.child("center"), false)) c = *p;
        outline.polygon = {{c[0] - w / 2, c[1] - l / 2},
                           {c[0] + w / 2, c[1] - l / 2},
                           {c[0] + w / 2, c[1] + l / 2},
                           {c[0] - w / 2, c[1] + l / 2}};
      }
      cap.outline = outline;
    }
    if (auto sw = n.child("self_weight"); sw.present() && expect_map(sw)) {
      check_keys(sw, {"unit_weight", "case"});
      SelfWeight self;
      self.unit_weight = number(sw, "unit_weight", Quantity::unit_weight).value_or(0.0);
      self.load_case = text(sw, "case").value_or("");
      self.where = at(sw);
      if (!n.child("outline").present())
        diag_.error(at(sw), "cap.self_weight: needs cap.outline to know the cap's plan area");
      cap.self_weight = self;
    }
  }

  void read_capacity_set(const Located& n, CapacitySet& set) {
    if (!expect_map(n)) return;
    check_keys(n, {"basis", "compression", "tension", "lateral", "factor_of_safety",
                   "factor_of_safety_tension", "resistance_factor", "resistance_factor_tension"});
    set.where = at(n);
    if (auto b = n.child("basis"); b.present()) {
      if (auto v = choice<CapacityBasis>(b, {{"allowable", CapacityBasis::allowable},
                                             {"factored", CapacityBasis::factored},
                                             {"ultimate", CapacityBasis::ultimate}}))
        set.basis = *v;
    }
    set.compression = number(n, "compression", Quantity::force, Need::optional);
    // 0 is a tension capacity too: any tension then fails the pile (checks.hpp).
    set.tension = number(n, "tension", Quantity::force, Need::optional, Sign::non_negative);
    set.lateral = number(n, "lateral", Quantity::force, Need::optional);
    set.factor_of_safety = number(n, "factor_of_safety", Quantity::number, Need::optional);
    set.factor_of_safety_tension =
        number(n, "factor_of_safety_tension", Quantity::number, Need::optional);
    set.resistance_factor = number(n, "resistance_factor", Quantity::number, Need::optional);
    set.resistance_factor_tension =
        number(n, "resistance_factor_tension", Quantity::number, Need::optional);
    const bool factors = set.factor_of_safety || set.factor_of_safety_tension ||
                         set.resistance_factor || set.resistance_factor_tension;
    if (factors && set.basis != CapacityBasis::ultimate)
      diag_.error(at(n), fmt::format("{}: factors of safety and resistance factors apply to "
                                     "capacities with basis: ultimate only",
                                     n.path));
    if (!set.compression && !set.tension && !set.lateral)
      diag_.error(at(n), fmt::format("{}: expected at least one of compression, tension, "
                                     "lateral",
                                     n.path));
  }


  void read_section(const Located& n, Section& section) {
    if (!expect_map(n)) return;
    const auto shape = text(n, "shape");
    if (shape == "square") {
      check_keys(n, {"shape", "width"});
      section.shape = SectionShape::square;
      section.width = number(n, "width", Quantity::length).value_or(0.0);
    } else if (shape == "round") {
      check_keys(n, {"shape", "diameter"});
      section.shape = SectionShape::round;
      section.width = number(n, "diameter", Quantity::length).value_or(0.0);
    } else if (shape) {
      diag_.error(at(n.child("shape")),
                  fmt::format("{}.shape: expected 'square' or 'round', got '{}'", n.path, *shape));
    }
  }

  template <typename T>
  void read_method(const Located& n, const std::map<std::string, T>& names,
                   std::optional<T>& for_clay, std::optional<T>& for_sand) {
    if (n.node.IsMap()) {
      check_keys(n, {"clay", "sand"});
      if (auto c = n.child("clay"); c.present()) for_clay = choice<T>(c, names);
      if (auto s = n.child("sand"); s.present()) for_sand = choice<T>(s, names);
    } else if (auto v = choice<T>(n, names)) {
      // One name for both kinds of soil: used wherever the method applies.
      if (applies_to(*v, SoilKind::clay)) for_clay = v;
      if (applies_to(*v, SoilKind::sand)) for_sand = v;
    }
  }

  void read_pile_types(const std::vector<Entry>& entries, const Located& whole, Project& project) {
    if (!expect_map(whole)) return;
    for (const auto& entry : entries) {
      const Located& n = entry.value;
      PileType type;
      type.id = entry.name;
      type.where = entry.key_where;
      if (!expect_map(n)) continue;
      check_keys(n, {"section", "length", "elastic_modulus", "axial_stiffness",
                     "lateral_stiffness", "tension", "head", "head_restraint", "torsional_stiffness", "structure", "capacity", "installation", "tip_method",
                     "shaft_method", "critical_depth", "factor_of_safety",
                     "factor_of_safety_tip", "factor_of_safety_shaft", "factor_of_safety_tension",
                     "resistance_factor_tip", "resistance_factor_shaft",
                     "resistance_factor_uplift"});
      if (auto s = n.child("section"); s.present()) read_section(s, type.section);
      else diag_.error(at(n), fmt::format("{}.section: missing; expected {{shape: square, width: …}} "
                                          "or {{shape: round, diameter: …}}", n.path));
      type.length = number(n, "length", Quantity::length).value_or(0.0);
      type.elastic_modulus =
          number(n, "elastic_modulus", Quantity::pressure, Need::optional).value_or(0.0);
      type.axial_stiffness = number(n, "axial_stiffness", Quantity::stiffness, Need::optional);
      type.lateral_stiffness = number(n, "lateral_stiffness", Quantity::stiffness, Need::optional,
                                      Sign::non_negative);
      if (!type.axial_stiffness && type.elastic_modulus <= 0.0 &&
          !n.child("elastic_modulus").present())
        diag_.error(at(n), fmt::format("{}: needs elastic_modulus (for the default axial "
                                       "stiffness E·A/L) or axial_stiffness",
                                       n.path));
      type.tension = flag(n, "tension").value_or(true);
      if (auto st = n.child("structure"); st.present() && expect_map(st)) {
        check_keys(st, {"concrete_strength", "steel_yield", "steel_area", "yield_moment",
                        "allowable_factor", "resistance_factor", "wall_thickness", "bar_count",
                        "cover_to_bar_center", "bending_strength"});
        Structure structure;
        structure.where = at(st);
        structure.concrete_strength = number(st, "concrete_strength", Quantity::pressure, Need::optional);
        structure.steel_yield = number(st, "steel_yield", Quantity::pressure, Need::optional);
        structure.steel_area = number(st, "steel_area", Quantity::area, Need::optional, Sign::non_negative);
        structure.yield_moment = number(st, "yield_moment", Quantity::moment, Need::optional);
        structure.allowable_factor = number(st, "allowable_factor", Quantity::number, Need::optional);
        structure.resistance_factor = number(st, "resistance_factor", Quantity::number, Need::optional);
        // What the yield moment is computed from (section_moment.hpp).
        structure.wall_thickness = number(st, "wall_thickness", Quantity::length, Need::optional);
        if (const auto bars = number(st, "bar_count", Quantity::number, Need::optional)) {
          if (*bars == std::floor(*bars) && *bars <= 1000) structure.bar_count = static_cast<int>(*bars);
          else diag_.error(at(st.child("bar_count")),
                           fmt::format("{}.structure.bar_count: expected a whole number of bars, got '{}'",
                                       n.path, scalar_text(st.child("bar_count").node)));
        }
        structure.cover_to_bar_center =
            number(st, "cover_to_bar_center", Quantity::length, Need::optional);
        structure.bending_strength = number(st, "bending_strength", Quantity::pressure, Need::optional);
        if (!structure.concrete_strength && !structure.steel_yield && !structure.bending_strength)
          diag_.error(at(st), fmt::format("{}.structure: expected concrete_strength (f'c), "
                                          "steel_yield (fy) or bending_strength (timber Fb)", n.path));
        // The factors scale the axial capacity, which a timber section (Fb only) does not get.
        if ((structure.concrete_strength || structure.steel_yield) &&
            !structure.allowable_factor && !structure.resistance_factor)
          diag_.error(at(st), fmt::format("{}.structure: expected allowable_factor (service) and/or "
                                          "resistance_factor (strength)", n.path));
        type.structure = structure;
      }
      if (auto h = n.child("head"); h.present())
        if (auto v = choice<HeadFixity>(h, {{"pinned", HeadFixity::pinned},
                                            {"fixed", HeadFixity::fixed},
                                            {"partial", HeadFixity::partial}}))
          type.head = *v;
      type.head_restraint = number(n, "head_restraint", Quantity::rotational_stiffness, Need::optional);
      type.torsional_stiffness =
          number(n, "torsional_stiffness", Quantity::rotational_stiffness, Need::optional);
      if ((type.head == HeadFixity::partial) != type.head_restraint.has_value())
        diag_.error(at(n), fmt::format("{}: {}", n.path, type.head == HeadFixity::partial
                                           ? "head: partial needs head_restraint"
                                           : "head_restraint is for head: partial"));
      if (auto c = n.child("capacity"); c.present()) {
        if (c.node.IsSequence()) {
          for (std::size_t i = 0; i < c.node.size(); ++i) {
            CapacitySet set;
            read_capacity_set(c.item(i), set);
            type.capacities.push_back(set);
          }
        } else {
          CapacitySet set;
          read_capacity_set(c, set);
          type.capacities.push_back(set);
        }
        // `tension: false` (compression only) and a tension capacity contradict each other;
        // 0 agrees with it.
        for (std::size_t i = 0; i < type.capacities.size() && !type.tension; ++i) {
          const Located t = (c.node.IsSequence() ? c.item(i) : c).child("tension");
          if (type.capacities[i].tension.value_or(0.0) > 0.0)
            diag_.error(at(t), fmt::format(
                "{}: expected 0 or no tension capacity with tension: false (the pile drops out "
                "of the cap rather than take tension), got '{}'; which did you mean: a pile "
                "that takes tension up to this capacity (remove 'tension: false') or a "
                "compression-only pile (remove {})?",
                t.path, scalar_text(t.node), t.path));
        }
        std::set<CapacityBasis> bases;
        for (const auto& set : type.capacities)
          if (!bases.insert(set.basis).second)
            diag_.error(set.where, fmt::format("{}.capacity: basis '{}' is given twice", n.path,
                                               to_string(set.basis)));
      }
      PileDesign& design = type.design;
      if (auto inst = n.child("installation"); inst.present())
        if (auto v = choice<Installation>(inst, {{"driven", Installation::driven},
                                                 {"bored", Installation::bored}}))
          design.installation = *v;
      if (auto tip = n.child("tip_method"); tip.present())
        read_method<TipMethod>(tip, tip_method_choices(), design.tip_clay, design.tip_sand);
      if (auto shaft = n.child("shaft_method"); shaft.present())
        read_method<ShaftMethod>(shaft, shaft_method_choices(), design.shaft_clay,
                                 design.shaft_sand);
      design.critical_depth_diameters =
          number(n, "critical_depth", Quantity::number, Need::optional);
      design.safety_factor = number(n, "factor_of_safety", Quantity::number, Need::optional);
      design.safety_factor_tip = number(n, "factor_of_safety_tip", Quantity::number, Need::optional);
      design.safety_factor_shaft =
          number(n, "factor_of_safety_shaft", Quantity::number, Need::optional);
      design.safety_factor_tension =
          number(n, "factor_of_safety_tension", Quantity::number, Need::optional);
      design.phi_tip = number(n, "resistance_factor_tip", Quantity::number, Need::optional);
      design.phi_shaft = number(n, "resistance_factor_shaft", Quantity::number, Need::optional);
      design.phi_uplift = number(n, "resistance_factor_uplift", Quantity::number, Need::optional);
      for (const char* key : {"factor_of_safety", "factor_of_safety_tip", "factor_of_safety_shaft",
                              "factor_of_safety_tension"}) {
        const Located f = n.child(key);
        if (f.present() && f.node.IsScalar()) {
          const auto v = parse_quantity(f.node.Scalar(), Quantity::number, units_of(n));
          if (v.si && *v.si < 1.0)
            diag_.error(at(f), fmt::format("{}: expected a factor of safety of at least 1, got '{}'",
                                           f.path, f.node.Scalar()));
        }
      }
      for (const char* key : {"resistance_factor_tip", "resistance_factor_shaft",
                              "resistance_factor_uplift"}) {
        const Located f = n.child(key);
        if (f.present() && f.node.IsScalar()) {
          const auto v = parse_quantity(f.node.Scalar(), Quantity::number, units_of(n));
          if (v.si && *v.si > 1.0)
            diag_.error(at(f), fmt::format("{}: expected a resistance factor φ from 0 to 1, got '{}'",
                                           f.path, f.node.Scalar()));
        }
      }
      if (design.computes_capacity() && !project.soil)
        diag_.error(at(n), fmt::format("{}: tip_method and shaft_method need a soil profile "
                                       "(soil: {{layers: …}})",
                                       n.path));
      if (type.capacities.empty() && !design.computes_capacity())
        diag_.error(at(n), fmt::format("{}: no capacity; give capacity: {{compression: …, "
                                       "tension: …, lateral: …}} or tip_method and shaft_method "
                                       "with a soil profile",
                                       n.path));
      // Methods or default resistance factors that belong to the other installation.
      for (const auto& caution : installation_cautions(design))
        project.warnings.push_back({at(n), fmt::format("{}: {}", n.path, caution)});
      project.pile_types.push_back(type);
    }
  }

  void read_piles(const Located& n, Project& project) {
    if (!n.node.IsSequence()) {
      diag_.error(at(n), fmt::format("piles: expected a list of piles {{id, x, y, type}}, got {}",
                                     scalar_text(n.node)));
      return;
    }
    std::map<std::string, std::size_t> type_index;
    for (std::size_t i = 0; i < project.pile_types.size(); ++i)
      type_index[project.pile_types[i].id] = i;
    std::set<std::string> ids;
    std::size_t repeated_ids = 0;
    std::vector<std::size_t> item_of;  // index in the file's list of each pile read
    for (std::size_t i = 0; i < n.node.size(); ++i) {
      const Located p = n.item(i);
      if (!expect_map(p)) continue;
      check_keys(p, {"id", "x", "y", "type", "batter"});
      Pile pile;
      pile.where = at(p);
      pile.id = text(p, "id").value_or(fmt::format("#{}", i + 1));
      if (!ids.insert(pile.id).second && ++repeated_ids <= kShownConflicts)
        diag_.error(at(p.child("id")), fmt::format("{}.id: pile '{}' is listed twice", p.path,
                                                   pile.id));
      pile.x = number(p, "x", Quantity::length, Need::required, Sign::any).value_or(0.0);
      pile.y = number(p, "y", Quantity::length, Need::required, Sign::any).value_or(0.0);
      if (auto t = text(p, "type")) {
        auto it = type_index.find(*t);
        if (it == type_index.end()) {
          const std::string near = closest_match(*t, keys_of(type_index));
          diag_.error(at(p.child("type")),
                      fmt::format("{}.type: pile type '{}' does not exist{}", p.path, *t,
                                  near.empty() ? fmt::format(" (known: {})",
                                                             list_of(keys_of(type_index)))
                                               : fmt::format("; did you mean '{}'?", near)));
        } else {
          pile.type = it->second;
        }
      }
      if (auto b = p.child("batter"); b.present() && expect_map(b)) {
        check_keys(b, {"ratio", "toward"});
        Batter batter;
        batter.ratio = number(b, "ratio", Quantity::number).value_or(1.0);
        batter.toward_deg =
            number(b, "toward", Quantity::angle, Need::required, Sign::any).value_or(0.0);
        pile.batter = batter;
      }
      project.piles.push_back(pile);
      item_of.push_back(i);
    }
    if (repeated_ids > kShownConflicts)
      diag_.error(at(n), fmt::format("piles: … and {} more piles with an id already used",
                                     repeated_ids - kShownConflicts));
    if (project.piles.empty())
      diag_.error(at(n), "piles: the list is empty; expected at least one pile");
    report_overlapping_piles(n, project, item_of);
  }

  // Two piles at one position, or closer than their widths allow. Each pile is compared
  // only with the earlier piles in the 3 × 3 cells of a grid as wide as the widest pile
  // (a spatial hash), and reports its first conflict; after kShownConflicts of each kind the
  // rest are counted in one line. 5,000 piles at one point once gave 12.5 million lines.
  void report_overlapping_piles(const Located& list, const Project& project,
                                const std::vector<std::size_t>& item_of) {
    double cell = 0.0;
    for (const auto& type : project.pile_types) cell = std::max(cell, type.section.width);
    if (!(cell > 0.0)) return;
    auto key = [&](long long cx, long long cy) { return std::make_pair(cx, cy); };
    std::map<std::pair<long long, long long>, std::vector<std::size_t>> cells;
    std::size_t same = 0, overlapping = 0;
    const UnitSystem u = project.units;
    for (std::size_t j = 0; j < project.piles.size(); ++j) {
      const Pile& b = project.piles[j];
      if (b.type >= project.pile_types.size()) continue;
      const auto cx = static_cast<long long>(std::floor(b.x / cell));
      const auto cy = static_cast<long long>(std::floor(b.y / cell));
      std::optional<std::size_t> first;  // the earliest pile b conflicts with
      for (long long dx = -1; dx <= 1; ++dx)
        for (long long dy = -1; dy <= 1; ++dy) {
          auto found = cells.find(key(cx + dx, cy + dy));
          if (found == cells.end()) continue;
          for (const std::size_t i : found->second) {
            if (first && i > *first) break;
            const Pile& a = project.piles[i];
            const double distance = std::hypot(a.x - b.x, a.y - b.y);
            const double touching = 0.5 * (project.pile_types[a.type].section.width +
                                           project.pile_types[b.type].section.width);
            if (distance < touching - 1e-9) {
              first = i;
              break;
            }
          }
        }
      cells[key(cx, cy)].push_back(j);
      if (!first) continue;
      const Pile& a = project.piles[*first];
      const double distance = std::hypot(a.x - b.x, a.y - b.y);
      const std::string where = fmt::format("piles[{}]", item_of[j]);
      if (distance < 1e-9) {
        if (++same <= kShownConflicts)
          diag_.error(b.where, fmt::format("{}: pile '{}' is at the same position as pile '{}'",
                                           where, b.id, a.id));
        continue;
      }
      if (++overlapping > kShownConflicts) continue;
      const double touching = 0.5 * (project.pile_types[a.type].section.width +
                                     project.pile_types[b.type].section.width);
      diag_.error(b.where, fmt::format(
          "{}: piles '{}' and '{}' overlap: centres {} apart, closer than their width ({})",
          where, a.id, b.id, QuantityFormat(u).text(Shown::length, distance),
          QuantityFormat(u).text(Shown::length, touching)));
    }
    if (same > kShownConflicts)
      diag_.error(at(list), fmt::format("piles: … and {} more piles at positions already used",
                                        same - kShownConflicts));
    if (overlapping > kShownConflicts)
      diag_.error(at(list), fmt::format("piles: … and {} more piles overlapping an earlier pile",
                                        overlapping - kShownConflicts));
  }

  void read_load_cases(const std::vector<Entry>& entries, const Located& whole, Project& project) {
    if (!expect_map(whole)) return;
    for (const auto& entry : entries) {
      const Located& n = entry.value;
      LoadCase lc;
      lc.id = entry.name;
      lc.where = entry.key_where;
      if (!expect_map(n)) continue;
      check_keys(n, {"kind", "loads", "description", "direction"});
      if (auto d = text(n, "direction", Need::optional)) lc.direction = *d;
      if (auto k = n.child("kind"); k.present()) {
        if (auto v = choice<LoadKind>(k, kLoadKinds)) lc.kind = *v;
      } else {
        diag_.error(at(n), fmt::format("{}.kind: missing; expected one of {}", n.path,
                                       list_of(keys_of(kLoadKinds))));
      }
      const Located loads = n.child("loads");
      if (loads.present() && !loads.node.IsSequence()) {
        diag_.error(at(loads), fmt::format("{}: expected a list of loads {{at: [x, y], Fz: …}}",
                                           loads.path));
      } else if (loads.present()) {
        for (std::size_t i = 0; i < loads.node.size(); ++i) {
          const Located l = loads.item(i);
          if (!expect_map(l)) continue;
          check_keys(l, {"at", "Fx", "Fy", "Fz", "Mx", "My", "Mz", "note"});
          PointLoad load;
          load.where = at(l);
          if (auto a = point(l.child("at"), true)) load.at = *a;
          load.on_top = std::isnan(load.at[2]);
          if (load.on_top) load.at[2] = project.cap.thickness;
          bool any = false;
          for (std::size_t c = 0; c < 6; ++c) {
            const auto v = number(l, kWrenchNames[c], c < 3 ? Quantity::force : Quantity::moment,
                                  Need::optional, Sign::any);
            load.load[c] = v.value_or(0.0);
            any = any || l.child(kWrenchNames[c]).present();
          }
          if (!any)
            diag_.error(at(l), fmt::format("{}: expected at least one of Fx, Fy, Fz, Mx, My, Mz",
                                           l.path));
          if (auto note = text(l, "note", Need::optional)) load.note = *note;
          lc.loads.push_back(load);
        }
      }
      project.load_cases.push_back(lc);
    }
  }

  void read_combinations(const std::vector<Entry>& entries, const Located& whole,
                         Project& project) {
    if (!expect_map(whole)) return;
    std::map<std::string, std::size_t> case_index;
    for (std::size_t i = 0; i < project.load_cases.size(); ++i)
      case_index[project.load_cases[i].id] = i;
    for (const auto& entry : entries) {
      if (entry.name == "generate") {
        generate_combinations_for(entry, project);
        continue;
      }
      const Located& n = entry.value;
      Combination combo;
      combo.id = entry.name;
      combo.where = entry.key_where;
      if (!expect_map(n)) continue;
      check_keys(n, {"limit_state", "factors", "description"});
      if (auto ls = n.child("limit_state"); ls.present()) {
        if (auto v = choice<LimitState>(ls, {{"service", LimitState::service},
                                             {"strength", LimitState::strength},
                                             {"seismic-overstrength",
                                              LimitState::seismic_overstrength}}))
          combo.limit_state = *v;
      } else {
        diag_.error(at(n), fmt::format("{}.limit_state: missing; expected service, strength or seismic-overstrength",
                                       n.path));
      }
      const Located factors = n.child("factors");
      if (!factors.present() || !factors.node.IsMap() || factors.node.size() == 0) {
        diag_.error(at(factors.present() ? factors : n),
                    fmt::format("{}: expected a map of load case to factor, e.g. {{D: 1.0, L: 1.0}}",
                                factors.path));
        continue;
      }
      for (auto it = factors.node.begin(); it != factors.node.end(); ++it) {
        const std::string name = it->first.Scalar();
        const Located entry{it->second, factors.file, factors.path + "." + name, factors.mark()};
        const auto factor = number_at(factors, entry, Quantity::number, Need::required, Sign::any);
        auto found = case_index.find(name);
        if (found == case_index.end()) {
          const std::string near = closest_match(name, keys_of(case_index));
          diag_.error(location_of(it->first, *factors.file),
                      fmt::format("{}.{}: load case '{}' does not exist{}", factors.path, name,
                                  name,
                                  near.empty() ? fmt::format(" (known: {})",
                                                             list_of(keys_of(case_index)))
                                               : fmt::format("; did you mean '{}'?", near)));
          continue;
        }
        if (factor) combo.factors.emplace_back(found->second, *factor);
      }
      project.combinations.push_back(combo);
    }
    if (project.combinations.empty())
      diag_.error(at(whole), "combinations: expected at least one combination");
  }

  void read_columns(const Located& n, Project& project) {
    if (!n.node.IsSequence()) {
      diag_.error(at(n), "columns: expected a list of columns {id, at: [x, y], support}");
      return;
    }
    std::map<std::string, std::string> support_owner;
    for (std::size_t i = 0; i < n.node.size(); ++i) {
      const Located c = n.item(i);
      if (!expect_map(c)) continue;
      check_keys(c, {"id", "at", "support"});
      Column column;
      column.where = at(c);
      column.id = text(c, "id").value_or(fmt::format("#{}", i + 1));
      if (auto a = point(c.child("at"), true)) column.at = *a;
      column.on_top = std::isnan(column.at[2]);
      if (column.on_top) column.at[2] = project.cap.thickness;
      column.support = text(c, "support").value_or("");
      if (!column.support.empty()) {
        auto [it, fresh] = support_owner.emplace(column.support, column.id);
        if (!fresh)
          diag_.error(at(c.child("support")),
                      fmt::format("{}.support: support '{}' is mapped twice (columns '{}' and '{}')",
                                  c.path, column.support, it->second, column.id));
      }
      project.columns.push_back(column);
    }
  }

  // Column reactions exported from the structural model (the file is read by
  // reactions_csv.hpp): one row per support and load case, or — with `combinations` — per
  // support and already-factored combination.
  void read_reactions(const Located& n, Project& project) {
    if (!expect_map(n)) return;
    check_keys(n, {"file", "sign", "units", "headers", "delimiter", "decimal", "combinations"});
    const auto file = text(n, "file");
    const auto sign = text(n, "sign");
    if (!file || !sign) return;
    double factor = 1.0;
    if (*sign == "reaction") factor = -1.0;
    else if (*sign != "load") {
      diag_.error(at(n.child("sign")), fmt::format("loads_from.sign: expected 'reaction' (the CSV "
                                                   "holds support reactions) or 'load' (forces on "
                                                   "the foundation), got '{}'",
                                                   *sign));
      return;
    }
    ReactionsLayout layout;
    layout.units = units_of(n);
    if (auto u = text(n, "units", Need::optional)) {
      if (*u == "SI") layout.units = UnitSystem::SI;
      else if (*u == "US") layout.units = UnitSystem::US;
      else
        diag_.error(at(n.child("units")),
                    fmt::format("loads_from.units: expected 'SI' or 'US', got '{}'", *u));
    }
    if (auto d = text(n, "delimiter", Need::optional)) {
      if (*d == "," || *d == ";") layout.delimiter = d->front();
      else if (*d == "tab" || *d == "\t") layout.delimiter = '\t';
      else
        diag_.error(at(n.child("delimiter")),
                    fmt::format("loads_from.delimiter: expected ',', ';' or tab, got '{}'", *d));
    }
    if (auto d = text(n, "decimal", Need::optional)) {
      if (*d == "." || *d == ",") layout.decimal = d->front();
      else
        diag_.error(at(n.child("decimal")),
                    fmt::format("loads_from.decimal: expected '.' or ',', got '{}'", *d));
      if (layout.decimal == ',' && layout.delimiter == ',')
        diag_.error(at(n.child("decimal")),
                    "loads_from.decimal: a decimal comma needs another delimiter; set "
                    "loads_from.delimiter: ';'");
    }
    if (const Located headers = n.child("headers"); headers.present() && expect_map(headers)) {
      check_keys(headers, {kReactionColumns.begin(), kReactionColumns.end()});
      for (const char* ours : kReactionColumns)
        if (auto theirs = text(headers, ours, Need::optional)) layout.headers[ours] = *theirs;
    }
    if (project.columns.empty()) {
      diag_.error(at(n), "loads_from: needs columns: [{id, at, support}] to place the reactions");
      return;
    }
    const std::string path = (fs::path(*n.file).parent_path() / *file).lexically_normal().string();
    project.loads_file = path;
    std::ifstream in(path, std::ios::binary);
    if (!in) {
      diag_.error(at(n.child("file")), fmt::format("loads_from.file: cannot open '{}'", path));
      return;
    }
    std::stringstream content;
    content << in.rdbuf();
    const std::string& csv_name = *files_->insert(path).first;
    const std::size_t problems_before = diag_.list().size();
    const auto rows = read_reactions_csv(content.str(), csv_name, layout, diag_);
    const bool file_read = diag_.list().size() == problems_before;

    std::map<std::string, std::size_t> column_of;
    for (std::size_t i = 0; i < project.columns.size(); ++i)
      column_of[project.columns[i].support] = i;
    const Located combinations = n.child("combinations");
    const char* what = combinations.present() ? "combination" : "load case";
    std::vector<ReactionRow> mapped;  // rows of this cap's supports
    std::set<std::string> seen_supports;
    std::map<std::pair<std::string, std::string>, int> seen_rows;  // (support, case) → row
    for (const auto& row : rows) {
      if (!column_of.count(row.support)) continue;  // another cap's support
      seen_supports.insert(row.support);
      auto [earlier, fresh] = seen_rows.emplace(std::make_pair(row.support, row.load_case),
                                                row.where.line);
      if (!fresh) {
        diag_.error(row.where,
                    fmt::format("row {}: support '{}' and {} '{}' were already given in "
                                "row {}; expected one row per support and {}",
                                row.where.line, row.support, what, row.load_case,
                                earlier->second, what));
        continue;
      }
      mapped.push_back(row);
    }
    auto load_of = [&](const ReactionRow& row) {
      const Column& column = project.columns[column_of[row.support]];
      PointLoad load;
      load.where = row.where;
      load.at = column.at;
      load.on_top = column.on_top;
      load.note = "column " + column.id;
      for (std::size_t c = 0; c < 6; ++c) load.load[c] = factor * row.values[c];
      return load;
    };
    if (combinations.present()) {
      import_combinations(combinations, mapped, load_of, project);
    } else {
      std::map<std::string, std::size_t> case_of;
      for (std::size_t i = 0; i < project.load_cases.size(); ++i)
        case_of[project.load_cases[i].id] = i;
      for (const auto& row : mapped) {
        auto lc = case_of.find(row.load_case);
        if (lc == case_of.end()) {
          diag_.error(row.where,
                      fmt::format("row {}: load case '{}' is not listed under load_cases; add it "
                                  "with its kind (e.g. {}: {{kind: dead}}), or import the file's "
                                  "cases as combinations (loads_from.combinations)",
                                  row.where.line, row.load_case, row.load_case));
          continue;
        }
        project.load_cases[lc->second].loads.push_back(load_of(row));
      }
    }
    if (!file_read) return;  // a support in a row with a problem is not missing
    for (const auto& column : project.columns)
      if (!column.support.empty() && !seen_supports.count(column.support))
        diag_.error(column.where, fmt::format("columns: support '{}' of column '{}' does not "
                                              "appear in '{}'",
                                              column.support, column.id, path));
  }

  // `loads_from.combinations`: each case of the CSV is an already-factored combination. It
  // becomes a load case holding the reactions (factor 1) and a combination of that case plus
  // the load cases typed in the file (the cap's self-weight among them), each with the factor
  // the engineer gives for the combination's limit state. No factor is assumed.
  template <typename LoadOf>
  void import_combinations(const Located& n, const std::vector<ReactionRow>& rows,
                           const LoadOf& load_of, Project& project) {
    if (!expect_map(n)) return;
    check_keys(n, {"limit_state", "factors"});
    const std::map<std::string, LimitState> states = {
        {"service", LimitState::service},
        {"strength", LimitState::strength},
        {"seismic-overstrength", LimitState::seismic_overstrength}};
    struct Rule {
      std::string pattern;
      LimitState state;
    };
    std::vector<Rule> rules;  // exact names and patterns, in the file's order
    std::optional<LimitState> for_all;
    const Located ls = n.child("limit_state");
    if (!ls.present()) {
      diag_.error(at(n), fmt::format("{}.limit_state: missing; expected service, strength or "
                                     "seismic-overstrength for every imported combination, or a "
                                     "map of combination name or pattern to limit state, e.g. "
                                     "{{\"ULS*\": strength, \"SLS*\": service}}",
                                     n.path));
      return;
    }
    if (ls.node.IsMap()) {
      for (auto it = ls.node.begin(); it != ls.node.end(); ++it) {
        const std::string key = it->first.Scalar();
        if (auto v = choice<LimitState>(ls.child(key), states)) rules.push_back({key, *v});
      }
    } else if (auto v = choice<LimitState>(ls, states)) {
      for_all = *v;
    } else {
      return;
    }
    constexpr std::size_t kNone = static_cast<std::size_t>(-1);  // a combination not built
    const std::size_t typed = project.load_cases.size();  // cases typed in the YAML
    std::map<std::string, std::size_t> typed_index, combination_of;
    for (std::size_t i = 0; i < typed; ++i) typed_index[project.load_cases[i].id] = i;
    std::set<std::string> existing;
    for (const auto& c : project.combinations) existing.insert(c.id);
    std::set<LimitState> occurring;
    for (const auto& row : rows) {
      auto found = combination_of.find(row.load_case);
      if (found == combination_of.end()) {
        combination_of[row.load_case] = kNone;
        if (typed_index.count(row.load_case) || existing.count(row.load_case)) {
          diag_.error(row.where,
                      fmt::format("row {}: combination '{}' has the name of a {} typed in the "
                                  "file; with loads_from.combinations the CSV's cases are "
                                  "combinations, so the names must differ",
                                  row.where.line, row.load_case,
                                  typed_index.count(row.load_case) ? "load case" : "combination"));
          continue;
        }
        const auto state = limit_state_of(row, for_all, rules, ls);
        if (!state) continue;
        LoadCase lc;
        lc.id = row.load_case;
        lc.where = row.where;
        lc.kind = LoadKind::other;
        project.load_cases.push_back(lc);
        Combination combo;
        combo.id = row.load_case;
        combo.where = row.where;
        combo.limit_state = *state;
        combo.factors.emplace_back(project.load_cases.size() - 1, 1.0);
        combination_of[row.load_case] = project.combinations.size();
        project.combinations.push_back(combo);
        occurring.insert(*state);
        found = combination_of.find(row.load_case);
      }
      if (found->second == kNone) continue;
      const std::size_t own_case = project.combinations[found->second].factors.front().first;
      project.load_cases[own_case].loads.push_back(load_of(row));
    }

    // The factors of the typed cases, per limit state that occurs.
    const Located factors = n.child("factors");
    if (factors.present() && !expect_map(factors)) return;
    if (factors.present()) check_keys(factors, keys_of(states));
    std::vector<std::string> typed_names;
    for (std::size_t i = 0; i < typed; ++i) typed_names.push_back(project.load_cases[i].id);
    std::vector<std::string> imported, added_text;
    for (const auto& [id, index] : combination_of)
      if (index != kNone) imported.push_back(id);
    for (const auto& [name, state] : states) {
      const Located given = factors.present() ? factors.child(name) : Located{};
      if (!occurring.count(state)) {
        if (given.present())
          project.warnings.push_back(
              {at(given), fmt::format("{}: no imported combination is a {} combination; these "
                                      "factors are not used",
                                      given.path, name)});
        continue;
      }
      if (typed == 0) continue;
      if (!given.present()) {
        std::string example;
        for (const auto& id : typed_names) example += (example.empty() ? "" : ", ") + id + ": …";
        diag_.error(at(factors.present() ? factors : n),
                    fmt::format("{}.factors.{}: missing; the imported {} combinations need a "
                                "factor for each load case typed in the file, e.g. {}: {{{}}}; "
                                "write 0 to leave a case out",
                                n.path, name, name, name, example));
        continue;
      }
      if (!expect_map(given)) continue;
      check_keys(given, typed_names);
      std::vector<std::pair<std::size_t, double>> added;
      std::string text;
      for (std::size_t i = 0; i < typed; ++i) {
        const auto f = number(given, typed_names[i], Quantity::number, Need::required,
                              Sign::non_negative);
        if (f && *f != 0.0) added.emplace_back(i, *f);
        if (f) text += fmt::format("{}{:g}·{}", text.empty() ? "" : " + ", *f, typed_names[i]);
      }
      added_text.push_back(fmt::format("{} combination: {}", name, text));
      for (auto& combo : project.combinations) {
        auto own = combination_of.find(combo.id);
        if (combo.limit_state == state && own != combination_of.end() && own->second != kNone)
          combo.factors.insert(combo.factors.end(), added.begin(), added.end());
      }
    }
    if (imported.empty()) return;
    std::string note = fmt::format("{} imported from {} as already factored (reactions at 1.0)",
                                   list_of(imported), rows.front().where.file);
    for (const auto& t : added_text) note += "; added to each " + t;
    project.notes.push_back(note + ".");
  }

  // The limit state of an imported combination: the one given for all, else the entry with
  // its exact name, else every matching pattern (which must agree).
  template <typename Rules>
  std::optional<LimitState> limit_state_of(const ReactionRow& row,
                                           const std::optional<LimitState>& for_all,
                                           const Rules& rules, const Located& ls) {
    if (for_all) return for_all;
    for (const auto& r : rules)
      if (r.pattern == row.load_case) return r.state;
    std::optional<LimitState> state;
    std::string first;
    for (const auto& r : rules) {
      if (!matches_pattern(r.pattern, row.load_case)) continue;
      if (state && *state != r.state) {
        diag_.error(row.where, fmt::format("row {}: combination '{}' matches '{}' ({}) and '{}' "
                                           "({}) in {}; make the patterns exclusive or name the "
                                           "combination",
                                           row.where.line, row.load_case, first,
                                           to_string(*state), r.pattern, to_string(r.state),
                                           ls.path));
        return std::nullopt;
      }
      if (!state) first = r.pattern;
      state = r.state;
    }
    if (!state) {
      std::vector<std::string> patterns;
      for (const auto& r : rules) patterns.push_back(r.pattern);
      diag_.error(row.where, fmt::format("row {}: combination '{}' matches nothing in {} ({}); "
                                         "add its name or a pattern with its limit state",
                                         row.where.line, row.load_case, ls.path,
                                         list_of(patterns)));
    }
    return state;
  }

  // `combinations: {generate: asce7-lrfd}` (or a list of generator names), or
  // `generate: {codes: …, sds: …, …}` with the values some generators need: code
  // combinations built from the load cases' kinds (combinations.hpp).
  void generate_combinations_for(const Entry& entry, Project& project) {
    const Located& n = entry.value;
    // (A Located is built, never assigned: assigning a YAML::Node writes into the document.)
    const Located codes = n.node.IsMap() ? n.child("codes") : n;
    CombinationSettings settings;
    if (n.node.IsMap()) {
      check_keys(n, {"codes", "sds", "earth_permanent", "gamma_eq", "pile_kind", "test_profiles",
                     "rigid_cap", "model_factor"});
      if (!codes.present()) {
        diag_.error(at(n), fmt::format("{}.codes: missing; expected a generator name or a list "
                                       "({})",
                                       n.path, list_of(generator_names())));
        return;
      }
      settings.sds = number(n, "sds", Quantity::number, Need::optional, Sign::non_negative);
      if (auto permanent = flag(n, "earth_permanent")) settings.earth_permanent = *permanent;
      if (auto g = number(n, "gamma_eq", Quantity::number, Need::optional, Sign::non_negative))
        settings.gamma_eq = *g;
      read_en1997_settings(n, project.en1997);
    }
    std::vector<Located> names;
    if (codes.node.IsSequence())
      for (std::size_t i = 0; i < codes.node.size(); ++i) names.push_back(codes.item(i));
    else
      names.push_back(codes);
    if (n.node.IsMap()) {
      // A key that no listed generator reads is a mistake (a misplaced code, say), not a no-op.
      const std::vector<std::pair<std::string, std::string>> owners = {
          {"sds", "asce7-"},          {"earth_permanent", "asce7-"}, {"gamma_eq", "aashto-"},
          {"pile_kind", "en1997-"},   {"test_profiles", "en1997-"},  {"rigid_cap", "en1997-"},
          {"model_factor", "en1997-"}};
      for (const auto& owner : owners) {
        const std::string& key = owner.first;
        const std::string& prefix = owner.second;  // a plain reference: lambdas may capture it
        const Located k = n.child(key);
        if (!k.present()) continue;
        const bool read = std::any_of(names.begin(), names.end(), [&](const Located& c) {
          return c.node.IsScalar() && c.node.Scalar().rfind(prefix, 0) == 0;
        });
        if (!read)
          diag_.error(at(k), fmt::format("{}: applies to the {}* generators only, and codes lists "
                                         "none of them",
                                         k.path, prefix));
      }
    }
    std::vector<CaseToCombine> cases;
    for (const auto& lc : project.load_cases) cases.push_back({lc.id, lc.kind, lc.direction});
    const auto seismic = std::find_if(project.load_cases.begin(), project.load_cases.end(),
                                      [](const LoadCase& lc) { return lc.kind == LoadKind::seismic; });
    const auto is_asce = [](const std::string& g) { return g.rfind("asce7-", 0) == 0; };
    std::vector<std::string> asce;
    for (const auto& name : names)
      if (name.node.IsScalar() && is_asce(name.node.Scalar())) asce.push_back(name.node.Scalar());
    const bool sds_missing = !asce.empty() && seismic != project.load_cases.end() && !settings.sds;
    if (sds_missing)
      diag_.error(at(n), fmt::format("{}.sds: missing; expected SDS (in g) for the vertical "
                                     "seismic effect Ev = 0.2·SDS·D of ASCE/SEI 7-16 §12.4.2.2, "
                                     "because load case '{}' is seismic (write generate: "
                                     "{{codes: [{}], sds: …}}; sds: 0 leaves Ev out)",
                                     n.path, seismic->id, list_of(asce)));
    for (const auto& name : names) {
      const std::string generator = name.node.IsScalar() ? name.node.Scalar() : scalar_text(name.node);
      if (sds_missing && is_asce(generator)) continue;
      try {
        const auto generated = generate_combinations(generator, cases, settings);
        for (const auto& g : generated.combinations) {
          Combination combo;
          combo.id = g.id;
          combo.where = at(name);
          combo.limit_state = g.limit_state;
          combo.resistance_set = g.resistance_set;
          combo.generator = generator;
          for (const auto& [case_id, factor] : g.factors) {
            for (std::size_t i = 0; i < project.load_cases.size(); ++i)
              if (project.load_cases[i].id == case_id) combo.factors.emplace_back(i, factor);
          }
          project.combinations.push_back(combo);
        }
        for (const auto& note : generated.notes)
          project.notes.push_back(generator + ": " + note);
      } catch (const std::invalid_argument& e) {
        diag_.error(at(name), fmt::format("combinations.generate: {}", e.what()));
      }
    }
  }

  // The EN 1997-1 keys of `combinations.generate` (how design resistances are obtained).
  void read_en1997_settings(const Located& n, En1997Settings& en) {
    if (auto kind = n.child("pile_kind"); kind.present()) {
      en.pile_kind = choice<En1997PileKind>(kind, {{"driven", En1997PileKind::driven},
                                                   {"bored", En1997PileKind::bored},
                                                   {"cfa", En1997PileKind::cfa}});
    }
    if (auto profiles = number(n, "test_profiles", Quantity::number, Need::optional, Sign::any)) {
      if (*profiles < 1 || *profiles != std::floor(*profiles))
        diag_.error(at(n.child("test_profiles")),
                    fmt::format("{}.test_profiles: expected a whole number of profiles of ground "
                                "tests (1 or more), got '{}'",
                                n.path, n.child("test_profiles").node.Scalar()));
      else
        en.test_profiles = static_cast<int>(*profiles);
    }
    if (auto rigid = flag(n, "rigid_cap")) en.rigid_cap = *rigid;
    if (auto factor = number(n, "model_factor", Quantity::number, Need::optional)) {
      if (*factor < 1.0)
        diag_.error(at(n.child("model_factor")),
                    fmt::format("{}.model_factor: expected a factor of 1.0 or more, got '{}'",
                                n.path, n.child("model_factor").node.Scalar()));
      else
        en.model_factor = *factor;
    }
  }

  std::optional<SoilProfile> read_soil(const Located& n) {
    if (!expect_map(n)) return std::nullopt;
    check_keys(n, {"water_table", "layers", "ground_level"});
    SoilProfile profile;
    profile.water_table =
        number(n, "water_table", Quantity::length, Need::optional, Sign::non_negative);
    profile.ground_level = number(n, "ground_level", Quantity::length, Need::optional, Sign::any);
    const Located layers = n.child("layers");
    if (!layers.present() || !layers.node.IsSequence() || layers.node.size() == 0) {
      diag_.error(at(layers.present() ? layers : n),
                  "soil.layers: expected a list of layers from the ground surface down");
      return profile;
    }
    for (std::size_t i = 0; i < layers.node.size(); ++i) {
      const Located l = layers.item(i);
      if (!expect_map(l)) continue;
      check_keys(l, {"name", "kind", "thickness", "unit_weight", "saturated_unit_weight",
                     "undrained_strength", "friction_angle", "soil_modulus", "poisson_ratio",
                     "volumetric_strain", "shaft_k", "shaft_delta", "spt_n60", "max_unit_shaft",
                     "max_unit_tip", "max_unit_shaft_reason", "max_unit_tip_reason",
                     "meyerhof_nq", "lambda", "uplift_factor",
                     "compression_index", "recompression_index", "void_ratio",
                     "preconsolidation", "subgrade_modulus", "modulus_gradient"});
      SoilLayer layer;
      layer.line = at(l).line;
      layer.name = text(l, "name", Need::optional).value_or(fmt::format("layer {}", i + 1));
      if (auto k = l.child("kind"); k.present()) {
        if (auto v = choice<SoilKind>(k, {{"clay", SoilKind::clay}, {"sand", SoilKind::sand}}))
          layer.kind = *v;
      } else {
        diag_.error(at(l), fmt::format("{}.kind: missing; expected clay or sand", l.path));
      }
      layer.thickness = number(l, "thickness", Quantity::length).value_or(0.0);
      auto opt = [&](const char* key, Quantity q, Sign sign = Sign::positive) {
        return number(l, key, q, Need::optional, sign);
      };
      layer.unit_weight = opt("unit_weight", Quantity::unit_weight);
      layer.saturated_unit_weight = opt("saturated_unit_weight", Quantity::unit_weight);
      layer.undrained_strength = opt("undrained_strength", Quantity::pressure);
      layer.friction_angle = opt("friction_angle", Quantity::angle);
      layer.soil_modulus = opt("soil_modulus", Quantity::pressure);
      layer.poisson_ratio = opt("poisson_ratio", Quantity::number, Sign::non_negative);
      if (layer.poisson_ratio && *layer.poisson_ratio >= 0.5)
        diag_.error(at(l.child("poisson_ratio")),
                    fmt::format("{} ('{}').poisson_ratio: expected 0 to less than 0.5, got {:g}", l.path, layer.name,
                                *layer.poisson_ratio));
      layer.volumetric_strain = opt("volumetric_strain", Quantity::number, Sign::non_negative);
      layer.shaft_k = opt("shaft_k", Quantity::number);
      layer.shaft_delta = opt("shaft_delta", Quantity::angle, Sign::non_negative);
      layer.spt_n60 = opt("spt_n60", Quantity::number, Sign::non_negative);
      layer.max_unit_shaft = opt("max_unit_shaft", Quantity::pressure);
      layer.max_unit_tip = opt("max_unit_tip", Quantity::pressure);
      layer.max_unit_shaft_reason = text(l, "max_unit_shaft_reason", Need::optional);
      layer.max_unit_tip_reason = text(l, "max_unit_tip_reason", Need::optional);
      for (const char* key : {"max_unit_shaft", "max_unit_tip"})
        if (l.child(std::string(key) + "_reason").present() && !l.child(key).present())
          diag_.error(at(l.child(std::string(key) + "_reason")),
                      fmt::format("{}.{}_reason: expected {} beside it, got a reason alone", l.path,
                                  key, key));
      layer.meyerhof_nq = opt("meyerhof_nq", Quantity::number);
      layer.lambda = opt("lambda", Quantity::number);
      layer.uplift_factor = opt("uplift_factor", Quantity::number);
      layer.compression_index = opt("compression_index", Quantity::number);
      layer.recompression_index = opt("recompression_index", Quantity::number);
      layer.void_ratio = opt("void_ratio", Quantity::number);
      layer.preconsolidation = opt("preconsolidation", Quantity::pressure);
      layer.subgrade_modulus = opt("subgrade_modulus", Quantity::unit_weight);
      layer.modulus_gradient = opt("modulus_gradient", Quantity::unit_weight);
      const std::string who = fmt::format("{} ('{}')", l.path, layer.name);
      if (layer.kind == SoilKind::sand && !layer.friction_angle)
        diag_.error(at(l), fmt::format("{}: a sand layer needs friction_angle", who));
      if (layer.kind == SoilKind::clay && !layer.undrained_strength &&
          !l.child("undrained_strength").present())
        diag_.error(at(l), fmt::format("{}: a clay layer needs undrained_strength (cu > 0)", who));
      if (layer.friction_angle && (*layer.friction_angle < 20.0 || *layer.friction_angle > 50.0))
        diag_.error(at(l.child("friction_angle")),
                    fmt::format("{}.friction_angle: expected 20° to 50°, got {}", who,
                                *layer.friction_angle));
      if (!layer.unit_weight && !layer.saturated_unit_weight)
        diag_.error(at(l), fmt::format("{}: needs unit_weight or saturated_unit_weight", who));
      profile.layers.push_back(layer);
    }
    return profile;
  }

  // A load case no combination takes (with a factor other than 0) is never checked: say so.
  static void warn_unused_load_cases(Project& project) {
    std::vector<bool> used(project.load_cases.size(), false);
    for (const auto& combo : project.combinations)
      for (const auto& [index, factor] : combo.factors)
        if (factor != 0.0) used[index] = true;
    for (std::size_t i = 0; i < project.load_cases.size(); ++i)
      if (!used[i])
        project.warnings.push_back(
            {project.load_cases[i].where,
             fmt::format("load_cases.{}: no combination uses this load case; its loads are not "
                         "checked",
                         project.load_cases[i].id)});
  }

  // The cap's own weight, added to its load case at the outline's centroid, mid-thickness.
  void add_self_weight(Project& project) {
    const Cap& cap = project.cap;
    if (!cap.self_weight || !cap.outline) return;
    auto it = std::find_if(project.load_cases.begin(), project.load_cases.end(),
                           [&](const LoadCase& lc) { return lc.id == cap.self_weight->load_case; });
    if (it == project.load_cases.end()) {
      diag_.error(cap.self_weight->where,
                  fmt::format("cap.self_weight.case: load case '{}' does not exist",
                              cap.self_weight->load_case));
      return;
    }
    const auto c = cap.outline->centroid();
    PointLoad weight;
    weight.where = cap.self_weight->where;
    weight.at = {c[0], c[1], cap.thickness / 2.0};
    weight.load = {0, 0, -cap.self_weight->unit_weight * cap.outline->area() * cap.thickness, 0, 0,
                   0};
    weight.note = "cap self-weight";
    it->loads.push_back(weight);
  }

 private:
  Diagnostics& diag_;
  Piles piles_ = Piles::required;
  UnitSystem project_units_ = UnitSystem::SI;
  const std::map<std::string, UnitSystem>* file_units_ = nullptr;
  std::set<std::string>* files_ = nullptr;  // keeps file names alive for locations
  std::vector<std::string> reading_;  // files being read, outermost first, as written
};

}  // namespace

Project read_project(const std::string& path, Piles piles) {
  Diagnostics diagnostics;
  Reader reader(diagnostics, piles);
  return reader.read(path);
}

}  // namespace cairn

namespace cairn {

std::vector<std::string> expand_foundation(const std::string& path) {
  YAML::Node root;
  try {
    root = YAML::LoadFile(path);
  } catch (const YAML::Exception&) {
    return {path};  // read_project reports the problem with its location
  }
  if (!root.IsMap() || !root["caps"]) return {path};
  Diagnostics diagnostics;
  for (auto it = root.begin(); it != root.end(); ++it) {
    const std::string key = it->first.Scalar();
    if (key != "caps" && key != "title")
      diagnostics.error(location_of(it->first, path),
                        fmt::format("{}: unknown key in a foundation file; expected title, caps", key));
  }
  const YAML::Node caps = root["caps"];
  std::vector<std::string> files;
  if (!caps.IsSequence() || caps.size() == 0) {
    diagnostics.error(location_of(caps, path), "caps: expected a list of cap files");
  } else {
    for (std::size_t i = 0; i < caps.size(); ++i) {
      if (!caps[i].IsScalar()) {
        diagnostics.error(location_of(caps[i], path),
                          fmt::format("caps[{}]: expected a file path", i));
        continue;
      }
      files.push_back((fs::path(path).parent_path() / caps[i].Scalar()).lexically_normal().string());
    }
  }
  diagnostics.raise_if_any();
  return files;
}

}  // namespace cairn
