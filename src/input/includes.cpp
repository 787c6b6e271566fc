#include "cairn/input/includes.hpp"

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <sstream>

#include <fmt/format.h>

namespace cairn {
namespace {

namespace fs = std::filesystem;

const char* const kEmptyFile =
    "the file is empty; expected a project (title, units, cap, pile_types, piles, load_cases, "
    "combinations)";

class IncludeReader {
 public:
  IncludeReader(const DocumentShape& shape, Diagnostics& diag, MergedDocument& merged)
      : shape_(shape), diag_(diag), merged_(merged) {}

  void load(const std::string& path, const SourceLocation& included_from) {
    std::error_code ec;
    const fs::path canonical = fs::weakly_canonical(fs::absolute(path), ec);
    const std::string key = canonical.string();
    if (std::find(stack_.begin(), stack_.end(), key) != stack_.end()) {
      // Name the files as the user wrote them, not as absolute paths of this machine.
      std::string chain;
      for (const auto& name : reading_) chain += name + " → ";
      diag_.error(included_from,
                  fmt::format("include: '{}' includes itself ({}{})", path, chain, path));
      return;
    }
    std::string text;
    if (!read_text_file(path, text)) {
      if (stack_.empty())
        diag_.error(whole_file(path), "cannot open the project file (does it exist?)");
      else
        diag_.error(included_from, fmt::format("include: cannot open '{}'", path));
      return;
    }
    const std::string& file = *merged_.files.insert(path).first;
    if (text.find_first_not_of(" \t\r\n") == std::string::npos) {
      diag_.error({file, 1, 1}, kEmptyFile);
      return;
    }
    auto doc = parse_yaml(text, file, diag_);
    if (!doc) return;
    const YamlValue* root = doc->root;
    merged_.documents.push_back(std::move(doc));
    if (!root || root->kind == YamlValue::Kind::null) {  // nothing but comments
      diag_.error({file, 1, 1}, kEmptyFile);
      return;
    }
    const Located top = Located::of(root, file, "");
    if (!top.is_map()) {
      diag_.error({file, 1, 1}, fmt::format("expected a map of keys (title, units, cap, …) at "
                                            "the top of the file, got {}",
                                            scalar_text(top)));
      return;
    }
    check_keys(top, shape_.top_keys, diag_);
    if (auto units = top.child("units"); units.present()) {
      const std::string u = units.is_scalar() ? units.scalar() : "";
      if (u == "SI") merged_.file_units[file] = UnitSystem::SI;
      else if (u == "US") merged_.file_units[file] = UnitSystem::US;
      else
        diag_.error(units.where(),
                    fmt::format("units: expected 'SI' or 'US', got '{}'", scalar_text(units)));
    }
    stack_.push_back(key);
    reading_.push_back(path);
    if (auto includes = top.child("include"); includes.present()) {
      std::vector<Located> list;
      if (includes.is_sequence()) {
        for (std::size_t i = 0; i < includes.size(); ++i) list.push_back(includes.item(i));
      } else {
        list.push_back(includes);
      }
      for (const auto& inc : list) {
        if (!inc.is_scalar()) {
          diag_.error(inc.where(), fmt::format("{}: expected a file path, got {}", inc.path,
                                               scalar_text(inc)));
          continue;
        }
        const fs::path target = fs::path(file).parent_path() / inc.scalar();
        load(target.lexically_normal().string(), inc.where());
      }
    }
    stack_.pop_back();
    reading_.pop_back();
    merge(top, file);
  }

 private:
  void merge(const Located& top, const std::string& file) {
    for (const auto& e : top.node->entries) {
      const std::string& name = e.key;
      if (name == "include") continue;
      const Located value = top.entry(e);
      const SourceLocation where = key_location(e, file);
      if (shape_.named_sections.count(name) && value.is_map()) {
        auto& entries = merged_.named[name];
        auto& index = merged_.named_index[name];
        for (const auto& item : value.node->entries) {
          NamedEntry entry{item.key, value.entry(item), key_location(item, file)};
          const auto [same, fresh] = index.emplace(item.key, entries.size());
          if (fresh) entries.push_back(std::move(entry));
          else entries[same->second] = std::move(entry);
        }
      } else {
        merged_.named.erase(name);
        merged_.named_index.erase(name);
      }
      merged_.sections[name] = {name, value, where};
    }
  }

  const DocumentShape& shape_;
  Diagnostics& diag_;
  MergedDocument& merged_;
  std::vector<std::string> stack_;    // canonical paths of the files being read
  std::vector<std::string> reading_;  // the same files, as written, outermost first
};

}  // namespace

const NamedEntry* MergedDocument::section(const std::string& name) const {
  auto it = sections.find(name);
  return it == sections.end() ? nullptr : &it->second;
}

const std::vector<NamedEntry>& MergedDocument::entries(const std::string& name) const {
  static const std::vector<NamedEntry> kNone;
  auto it = named.find(name);
  return it == named.end() ? kNone : it->second;
}

bool read_text_file(const std::string& path, std::string& text) {
  std::ifstream in(path, std::ios::binary);
  if (!in) return false;
  std::stringstream buffer;
  buffer << in.rdbuf();
  text = buffer.str();
  return true;
}

MergedDocument read_with_includes(const std::string& path, const DocumentShape& shape,
                                  Diagnostics& diagnostics) {
  MergedDocument merged;
  IncludeReader reader(shape, diagnostics, merged);
  reader.load(path, whole_file(path));
  return merged;
}

}  // namespace cairn
