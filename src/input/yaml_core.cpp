#include "cairn/input/yaml_core.hpp"

#include <yaml-cpp/depthguard.h>
#include <yaml-cpp/eventhandler.h>
#include <yaml-cpp/exceptions.h>
#include <yaml-cpp/mark.h>
#include <yaml-cpp/parser.h>

#include <algorithm>
#include <cmath>
#include <sstream>
#include <unordered_map>

#include <fmt/format.h>

namespace cairn {
namespace {

// Values a document may stand for with its aliases written out: a base that no
// hand-written file reaches, plus a few per byte, so that the work of every reader stays
// proportional to the size of the file.
constexpr std::size_t kAliasBudgetBase = 100000;
constexpr std::size_t kAliasBudgetPerByte = 4;

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

std::string kind_text(const YamlValue& v) {
  switch (v.kind) {
    case YamlValue::Kind::scalar: return v.scalar;
    case YamlValue::Kind::sequence: return "a list";
    case YamlValue::Kind::map: return "a map";
    case YamlValue::Kind::null: break;
  }
  return "nothing";
}

// Builds the values from yaml-cpp's events and checks the document's shape on the way.
// Shape problems are kept in `problems` and reported only when the whole text parsed
// (a malformed file gets the one message of the parser, as with yaml-cpp's own loader).
class Builder : public YAML::EventHandler {
 public:
  Builder(YamlDocument& doc, const std::string& file, std::size_t budget, std::size_t bytes)
      : doc_(doc), file_(file), budget_(budget), bytes_(bytes) {}

  std::vector<Diagnostic> problems;
  bool fatal = false;

  void OnDocumentStart(const YAML::Mark&) override {}
  void OnDocumentEnd() override {}

  void OnNull(const YAML::Mark& mark, YAML::anchor_t anchor) override {
    if (fatal) return;
    if (skipping()) return;
    if (awaiting_key()) return refuse_key(mark.line + 1, mark.column + 1, "nothing");
    YamlValue* v = make(mark);
    remember(anchor, v, 1);
    add(v, 1);
  }

  void OnScalar(const YAML::Mark& mark, const std::string&, YAML::anchor_t anchor,
                const std::string& value) override {
    if (skipping()) return;
    if (awaiting_key()) {
      if (anchor) {  // an anchored key is a value an alias may repeat
        YamlValue* v = make(mark);
        v->kind = YamlValue::Kind::scalar;
        v->scalar = value;
        remember(anchor, v, 1);
      }
      return take_key(value, mark.line + 1, mark.column + 1);
    }
    YamlValue* v = make(mark);
    v->kind = YamlValue::Kind::scalar;
    v->scalar = value;
    remember(anchor, v, 1);
    add(v, 1);
  }

  void OnAlias(const YAML::Mark&, YAML::anchor_t anchor) override {
    if (skipping()) return;
    if (anchor >= anchored_.size() || !anchored_[anchor].value) return;  // the parser refuses
    const Anchored& a = anchored_[anchor];
    if (awaiting_key()) {
      if (a.value->kind != YamlValue::Kind::scalar)
        return refuse_key(a.value->line, a.value->column, kind_text(*a.value));
      return take_key(a.value->scalar, a.value->line, a.value->column);
    }
    if (a.size == kOpen) {
      const std::string shown = child_path();
      error(reached_at(), fmt::format("{}: an alias refers to a map or list that contains it "
                                      "(a cycle); an alias may only repeat a complete earlier "
                                      "value",
                                      shown.empty() ? "the top level" : shown));
      fatal = true;
      return;
    }
    if (static_cast<int>(stack_.size()) + a.height > kMaxNesting + 1) {
      error(reached_at(), fmt::format("lists and maps nested deeper than {} levels through "
                                      "aliases (does an alias name a map or list that "
                                      "contains it?)",
                                      kMaxNesting));
      fatal = true;
      return;
    }
    add(a.value, a.size, a.height);
  }

  void OnSequenceStart(const YAML::Mark& mark, const std::string&, YAML::anchor_t anchor,
                       YAML::EmitterStyle::value) override {
    open(mark, anchor, YamlValue::Kind::sequence, "a list");
  }
  void OnSequenceEnd() override { close(); }
  void OnMapStart(const YAML::Mark& mark, const std::string&, YAML::anchor_t anchor,
                  YAML::EmitterStyle::value) override {
    open(mark, anchor, YamlValue::Kind::map, "a map");
  }
  void OnMapEnd() override { close(); }

 private:
  static constexpr std::size_t kOpen = static_cast<std::size_t>(-1);
  static constexpr std::size_t kIndexed = 16;

  struct Frame {
    YamlValue* value = nullptr;
    std::string path;
    std::size_t total = 1;  // values, with every alias written out
    int height = 1;         // levels of lists and maps, this one included
    YAML::anchor_t anchor = 0;
    bool quiet = false;     // inside a value given twice: its shape is not checked
    // A map between a key and its value:
    bool has_key = false;
    bool skip_value = false;  // the key was given twice
    std::string key;
    int key_line = 0, key_column = 0;
    std::unordered_map<std::string, int> first_line;  // keys at their line, in big maps
  };
  struct Anchored {
    YamlValue* value = nullptr;
    std::size_t size = 0;  // kOpen while the value is being read
    int height = 0;
  };

  YamlValue* make(const YAML::Mark& mark) {
    YamlValue& v = doc_.values.emplace_back();
    v.line = mark.line + 1;
    v.column = mark.column + 1;
    return &v;
  }

  void remember(YAML::anchor_t anchor, YamlValue* v, std::size_t size, int height = 0) {
    if (!anchor) return;
    if (anchored_.size() <= anchor) anchored_.resize(anchor + 1);
    anchored_[anchor] = {v, size, height};
  }

  // After a fatal problem nothing more is read; a list or map given as a key is passed over.
  bool skipping() const { return fatal || ignored_ > 0; }

  bool awaiting_key() const {
    return !stack_.empty() && stack_.back().value->kind == YamlValue::Kind::map &&
           !stack_.back().has_key;
  }

  void error(const SourceLocation& where, std::string message) {
    if (!stack_.empty() && stack_.back().quiet) return;
    problems.push_back({where, std::move(message)});
  }

  void refuse_key(int line, int column, const std::string& found) {
    Frame& f = stack_.back();
    error({file_, line, column},
          fmt::format("{}expected a name as a key, got {}", f.path.empty() ? "" : f.path + ": ",
                      found));
    if (!f.quiet) fatal = true;
    f.has_key = true;  // (inside a value given twice) its value is passed over
    f.skip_value = true;
  }

  void take_key(const std::string& key, int line, int column) {
    Frame& f = stack_.back();
    f.has_key = true;
    f.key = key;
    f.key_line = line;
    f.key_column = column;
    // The line of the same key earlier in this map, if any: small maps are searched, a map
    // of kIndexed keys or more is indexed (a map of 100,000 combinations stays linear).
    int earlier = 0;
    const auto& entries = f.value->entries;
    if (entries.size() < kIndexed) {
      for (const auto& e : entries)
        if (e.key == key) {
          earlier = e.line;
          break;
        }
    } else {
      if (f.first_line.empty())
        for (const auto& e : entries) f.first_line.emplace(e.key, e.line);
      const auto [seen, added] = f.first_line.emplace(key, line);
      if (!added) earlier = seen->second;
    }
    f.skip_value = earlier > 0;
    if (f.skip_value)
      error({file_, line, column},
            fmt::format("{}: given twice (first at line {})", child_path(), earlier));
  }

  // The path of the value about to be added to the innermost list or map.
  std::string child_path() const {
    if (stack_.empty()) return "";
    const Frame& f = stack_.back();
    if (f.value->kind == YamlValue::Kind::map) return f.path.empty() ? f.key : f.path + "." + f.key;
    return fmt::format("{}[{}]", f.path, f.value->items.size());
  }

  // Where the value about to be added is reached from: its key, or the list holding it.
  SourceLocation reached_at() const {
    if (stack_.empty()) return {file_, 1, 1};
    const Frame& f = stack_.back();
    if (f.value->kind == YamlValue::Kind::map) return {file_, f.key_line, f.key_column};
    return {file_, f.value->line, f.value->column};
  }

  // Adds a finished value (standing for `size` values) to the innermost list or map.
  void add(const YamlValue* v, std::size_t size, int height = 0) {
    if (stack_.empty()) {
      doc_.root = v;
      return;
    }
    Frame& f = stack_.back();
    f.height = std::max(f.height, height + 1);
    if (f.value->kind == YamlValue::Kind::sequence) {
      f.value->items.push_back(v);
      f.total += size;
    } else {
      f.has_key = false;
      if (f.skip_value) return;
      f.value->entries.push_back({std::move(f.key), f.key_line, f.key_column, v});
      f.total += 1 + size;
    }
    if (f.total > budget_ && !fatal) {
      error({file_, f.value->line, f.value->column},
            fmt::format("{}: aliases expand this to more than {} values, the limit for a file "
                        "of {} bytes; write the values out or nest fewer aliases",
                        f.path.empty() ? "the top level" : f.path, budget_, bytes_));
      fatal = true;
    }
  }

  void open(const YAML::Mark& mark, YAML::anchor_t anchor, YamlValue::Kind kind,
            const char* what) {
    if (skipping()) {
      ++ignored_;
      return;
    }
    if (awaiting_key()) {
      refuse_key(mark.line + 1, mark.column + 1, what);
      ++ignored_;
      return;
    }
    const bool quiet = !stack_.empty() && (stack_.back().quiet || (stack_.back().value->kind ==
                                                                       YamlValue::Kind::map &&
                                                                   stack_.back().skip_value));
    std::string path = child_path();
    YamlValue* v = make(mark);
    v->kind = kind;
    remember(anchor, v, kOpen);
    Frame& f = stack_.emplace_back();
    f.value = v;
    f.path = std::move(path);
    f.anchor = anchor;
    f.quiet = quiet;
  }

  void close() {
    if (ignored_ > 0) {
      --ignored_;
      return;
    }
    if (fatal || stack_.empty()) return;
    Frame f = std::move(stack_.back());
    stack_.pop_back();
    if (f.anchor) remember(f.anchor, f.value, f.total, f.height);
    add(f.value, f.total, f.height);
  }

  YamlDocument& doc_;
  const std::string& file_;
  std::size_t budget_, bytes_;
  std::vector<Frame> stack_;
  std::vector<Anchored> anchored_;
  int ignored_ = 0;  // lists and maps opened after a fatal problem, still to close
};

// Stops the parser at the first top-level key not in `skip` (or at anything showing that
// the top is not a map).
class FirstKey : public YAML::EventHandler {
 public:
  explicit FirstKey(const std::vector<std::string>& skip) : skip_(skip) {}
  struct Decided {
    std::optional<std::string> key;
  };
  void OnDocumentStart(const YAML::Mark&) override {}
  void OnDocumentEnd() override {}
  void OnNull(const YAML::Mark&, YAML::anchor_t) override { value_done(); }
  void OnAlias(const YAML::Mark&, YAML::anchor_t) override { value_done(); }
  void OnScalar(const YAML::Mark&, const std::string&, YAML::anchor_t,
                const std::string& value) override {
    if (depth_ == 1 && top_is_map_ && awaiting_key_) {
      if (std::find(skip_.begin(), skip_.end(), value) == skip_.end()) throw Decided{value};
      awaiting_key_ = false;
      return;
    }
    value_done();
  }
  void OnSequenceStart(const YAML::Mark&, const std::string&, YAML::anchor_t,
                       YAML::EmitterStyle::value) override {
    if (depth_ == 0) throw Decided{std::nullopt};
    ++depth_;
  }
  void OnSequenceEnd() override { close(); }
  void OnMapStart(const YAML::Mark&, const std::string&, YAML::anchor_t,
                  YAML::EmitterStyle::value) override {
    if (depth_ == 0) top_is_map_ = true;
    ++depth_;
  }
  void OnMapEnd() override { close(); }

 private:
  void value_done() {
    if (depth_ == 0) throw Decided{std::nullopt};
    if (depth_ == 1) awaiting_key_ = true;
  }
  void close() {
    if (--depth_ == 1) awaiting_key_ = true;
  }
  const std::vector<std::string>& skip_;
  int depth_ = 0;
  bool top_is_map_ = false;
  bool awaiting_key_ = true;
};

}  // namespace

const YamlValue* YamlValue::find(std::string_view key) const {
  for (const auto& e : entries)
    if (e.key == key) return e.value;
  return nullptr;
}

std::unique_ptr<YamlDocument> parse_yaml(const std::string& text, const std::string& file,
                                         Diagnostics& diag) {
  if (const auto deep = too_deep(text, file)) {
    diag.error(*deep, fmt::format("lists and maps nested deeper than {} levels; a project "
                                  "needs fewer than ten",
                                  kMaxNesting));
    return nullptr;
  }
  auto doc = std::make_unique<YamlDocument>();
  Builder builder(*doc, file, kAliasBudgetBase + kAliasBudgetPerByte * text.size(), text.size());
  try {
    std::istringstream stream(text);
    YAML::Parser parser(stream);
    parser.HandleNextDocument(builder);
  } catch (const YAML::DeepRecursion& e) {
    diag.error({file, e.mark.line + 1, e.mark.column + 1},
               fmt::format("lists and maps nested deeper than {} levels; a project needs "
                           "fewer than ten",
                           kMaxNesting));
    return nullptr;
  } catch (const YAML::ParserException& e) {
    if (const auto tab = tab_in_indentation(text, e.mark.line + 1, file))
      diag.error(*tab, "tab character in indentation; YAML indents with spaces");
    else
      diag.error({file, e.mark.line + 1, e.mark.column + 1},
                 fmt::format("malformed YAML: {}", e.msg));
    return nullptr;
  }
  for (auto& p : builder.problems) diag.error(p.where, std::move(p.message));
  if (builder.fatal) return nullptr;
  return doc;
}

std::optional<std::string> first_top_level_key(const std::string& text,
                                               const std::vector<std::string>& skip) {
  FirstKey test(skip);
  try {
    std::istringstream stream(text);
    YAML::Parser parser(stream);
    parser.HandleNextDocument(test);
  } catch (const FirstKey::Decided& d) {
    return d.key;
  } catch (const YAML::Exception&) {
    return std::nullopt;  // the file's reader reports the problem with its location
  }
  return std::nullopt;
}

// ---- located values ---------------------------------------------------------------------

Located Located::of(const YamlValue* value, const std::string& file, std::string path) {
  Located n{value, &file, std::move(path)};
  if (value) {
    n.line = value->line;
    n.column = value->column;
  }
  return n;
}

std::size_t Located::size() const {
  if (is_sequence()) return node->items.size();
  if (is_map()) return node->entries.size();
  return 0;
}

Located Located::child(std::string_view key) const {
  const std::string joined = path.empty() ? std::string(key) : path + "." + std::string(key);
  const YamlValue* found = is_map() ? node->find(key) : nullptr;
  Located c{found, file, joined, line, column};
  if (found) {
    c.line = found->line;
    c.column = found->column;
  }
  return c;
}

Located Located::item(std::size_t index) const {
  const YamlValue* found =
      is_sequence() && index < node->items.size() ? node->items[index] : nullptr;
  Located c{found, file, fmt::format("{}[{}]", path, index), line, column};
  if (found) {
    c.line = found->line;
    c.column = found->column;
  }
  return c;
}

Located Located::entry(const YamlValue::Entry& e) const {
  return {e.value, file, path.empty() ? e.key : path + "." + e.key, e.value->line,
          e.value->column};
}

std::string scalar_text(const Located& n) { return n.node ? kind_text(*n.node) : "nothing"; }

std::string list_of(const std::vector<std::string>& names) {
  std::string text;
  for (const auto& n : names) text += (text.empty() ? "" : ", ") + n;
  return text;
}

void check_keys(const Located& map, const std::vector<std::string>& allowed, Diagnostics& diag) {
  if (!map.is_map()) return;
  for (const auto& e : map.node->entries) {
    if (std::find(allowed.begin(), allowed.end(), e.key) != allowed.end()) continue;
    const std::string near = closest_match(e.key, allowed);
    const std::string where = map.path.empty() ? e.key : map.path + "." + e.key;
    diag.error(key_location(e, *map.file),
               near.empty()
                   ? fmt::format("{}: unknown key; expected one of: {}", where, list_of(allowed))
                   : fmt::format("{}: unknown key; did you mean '{}'?", where, near));
  }
}

// ---- the readers' helpers -----------------------------------------------------------------

UnitSystem ReadContext::units_of(const Located& n) const {
  auto it = file_units_.find(*n.file);
  return it != file_units_.end() ? it->second : project_units_;
}

bool ReadContext::expect_map(const Located& n) {
  if (n.is_map()) return true;
  diag_.error(at(n), fmt::format("{}: expected a map of keys, got {}", n.path,
                                 n.present() ? "'" + scalar_text(n) + "'" : "nothing"));
  return false;
}

std::optional<double> ReadContext::number_at(const Located& parent, const Located& n, Quantity q,
                                             Need need, Sign sign) {
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
  if (!n.is_scalar()) {
    diag_.error(at(n), fmt::format("{}: expected {}, got {}", n.path, expected, scalar_text(n)));
    return std::nullopt;
  }
  const auto parsed = parse_quantity(n.scalar(), q, units);
  if (!parsed.si) {
    diag_.error(at(n), fmt::format("{}: {}", n.path, parsed.error));
    return std::nullopt;
  }
  const double v = *parsed.si;
  if ((sign == Sign::positive && !(v > 0)) || (sign == Sign::non_negative && v < 0)) {
    diag_.error(at(n), fmt::format("{}: expected {}, got '{}'", n.path, expected, n.scalar()));
    return std::nullopt;
  }
  if (sign == Sign::positive && v < smallest_plausible(q)) {
    const double shown = q == Quantity::angle ? smallest_plausible(q)
                                              : from_si(units, q, smallest_plausible(q));
    diag_.error(at(n), fmt::format("{}: expected {} of at least {:g}, got '{}'", n.path, expected,
                                   shown, n.scalar()));
    return std::nullopt;
  }
  return v;
}

std::optional<std::string> ReadContext::text(const Located& parent, std::string_view key,
                                             Need need) {
  const Located n = parent.child(key);
  if (!n.present()) {
    if (need == Need::required)
      diag_.error(at(parent), fmt::format("{}: missing; expected a name", n.path));
    return std::nullopt;
  }
  if (!n.is_scalar()) {
    diag_.error(at(n), fmt::format("{}: expected a name, got {}", n.path, scalar_text(n)));
    return std::nullopt;
  }
  return n.scalar();
}

std::optional<bool> ReadContext::flag(const Located& parent, std::string_view key) {
  const Located n = parent.child(key);
  if (!n.present()) return std::nullopt;
  const std::string s = n.is_scalar() ? n.scalar() : "";
  if (s == "true" || s == "yes") return true;
  if (s == "false" || s == "no") return false;
  diag_.error(at(n), fmt::format("{}: expected true or false, got '{}'", n.path, scalar_text(n)));
  return std::nullopt;
}

std::string ReadContext::choice_message(const Located& n, const std::vector<std::string>& names,
                                        const std::string& got) {
  return fmt::format("{}: expected one of {}, got '{}'", n.path, list_of(names), got);
}

std::optional<std::array<double, 3>> ReadContext::point(const Located& n, bool allow_z) {
  const bool ok = n.is_sequence() && (n.size() == 2 || (allow_z && n.size() == 3));
  if (!ok) {
    diag_.error(at(n), fmt::format("{}: expected [x, y]{} in {}, got {}", n.path,
                                   allow_z ? " or [x, y, z]" : "",
                                   unit_label(units_of(n), Quantity::length),
                                   n.present() ? scalar_text(n) : "nothing"));
    return std::nullopt;
  }
  std::array<double, 3> p{0.0, 0.0, std::nan("")};
  for (std::size_t i = 0; i < n.size(); ++i) {
    const Located c = n.item(i);
    const auto parsed =
        parse_quantity(c.is_scalar() ? c.scalar() : "", Quantity::length, units_of(n));
    if (!parsed.si) {
      diag_.error(at(c), fmt::format("{}: {}", c.path, parsed.error));
      return std::nullopt;
    }
    p[i] = *parsed.si;
  }
  return p;
}

}  // namespace cairn
