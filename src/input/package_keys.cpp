#include "cairn/input/package_keys.hpp"

#include <algorithm>
#include <vector>

#include <fmt/format.h>

#include "cairn/input/includes.hpp"

namespace cairn {
namespace {

std::string shown(const Located& node) {
  if (node.is_scalar()) return "'" + node.scalar() + "'";
  if (node.is_sequence()) return "a list";
  if (node.is_map()) return "a map";
  return "nothing";
}

}  // namespace

void read_package_settings(const Located& node, Project& project, Diagnostics& diagnostics) {
  PackageSettings& k = project.package;
  k.where = node.where();
  if (!node.present()) return;
  if (!node.is_map()) {
    diagnostics.error(k.where, fmt::format("package: expected a map of keys (revision, date, "
                                           "prepared_by, checked_by, show_combinations), got {}",
                                           shown(node)));
    return;
  }
  const std::vector<std::string> keys = {"revision", "date", "prepared_by", "checked_by",
                                         "show_combinations"};
  for (const auto& e : node.node->entries) {
    const std::string& key = e.key;
    const Located value = node.entry(e);
    const SourceLocation at = key_location(e, *node.file);
    if (key == "show_combinations") {
      std::vector<Located> items;
      if (value.is_sequence())
        for (std::size_t i = 0; i < value.size(); ++i) items.push_back(value.item(i));
      else
        items.push_back(value);
      std::vector<std::string> ids;
      for (const auto& c : project.combinations) ids.push_back(c.id);
      for (const auto& item : items) {
        const std::string id = item.is_scalar() ? item.scalar() : shown(item);
        if (item.is_scalar() && std::find(ids.begin(), ids.end(), id) != ids.end()) {
          k.show_combinations.push_back(id);
          continue;
        }
        const std::string near = closest_match(id, ids);
        diagnostics.error(item.where(),
                          fmt::format("package.show_combinations: combination '{}' does not "
                                      "exist{}",
                                      id, near.empty() ? "" : "; did you mean '" + near + "'?"));
      }
      continue;
    }
    std::string* field = key == "revision"      ? &k.revision
                         : key == "date"        ? &k.date
                         : key == "prepared_by" ? &k.prepared_by
                         : key == "checked_by"  ? &k.checked_by
                                                : nullptr;
    if (!field) {
      const std::string near = closest_match(key, keys);
      diagnostics.error(at, near.empty()
                                ? fmt::format("package.{}: unknown key; expected one of: revision, "
                                              "date, prepared_by, checked_by, show_combinations",
                                              key)
                                : fmt::format("package.{}: unknown key; did you mean '{}'?", key,
                                              near));
      continue;
    }
    if (!value.is_scalar()) {
      diagnostics.error(value.where(),
                        fmt::format("package.{}: expected text, got {}", key, shown(value)));
      continue;
    }
    *field = value.scalar();
  }
}

std::string foundation_title(const std::string& path) {
  std::string text;
  if (!read_text_file(path, text)) return "";
  Diagnostics ignored;
  const auto doc = parse_yaml(text, path, ignored);
  if (!doc || !doc->root) return "";
  const Located top = Located::of(doc->root, path, "");
  const Located title = top.child("title");
  if (!top.is_map() || !top.child("caps").defined() || !title.is_scalar()) return "";
  return title.scalar();
}

}  // namespace cairn
