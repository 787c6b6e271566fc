#include "cairn/input/package_keys.hpp"

#include <algorithm>
#include <vector>

#include <fmt/format.h>

namespace cairn {
namespace {

SourceLocation where_in(const YAML::Node& node, const std::string& file) {
  if (!node.IsDefined() || node.Mark().line < 0) return {file, 0, 0};
  return {file, node.Mark().line + 1, node.Mark().column + 1};
}

std::string shown(const YAML::Node& node) {
  if (node.IsScalar()) return "'" + node.Scalar() + "'";
  if (node.IsSequence()) return "a list";
  if (node.IsMap()) return "a map";
  return "nothing";
}

}  // namespace

void read_package_settings(const YAML::Node& node, const std::string& file, Project& project,
                           Diagnostics& diagnostics) {
  PackageSettings& k = project.package;
  k.where = where_in(node, file);
  if (node.IsNull()) return;
  if (!node.IsMap()) {
    diagnostics.error(k.where, fmt::format("package: expected a map of keys (revision, date, "
                                           "prepared_by, checked_by, show_combinations), got {}",
                                           shown(node)));
    return;
  }
  const std::vector<std::string> keys = {"revision", "date", "prepared_by", "checked_by",
                                         "show_combinations"};
  for (auto it = node.begin(); it != node.end(); ++it) {
    const std::string key = it->first.IsScalar() ? it->first.Scalar() : "";
    const YAML::Node value = it->second;
    const SourceLocation at = where_in(it->first, file);
    if (key == "show_combinations") {
      std::vector<YAML::Node> items;
      if (value.IsSequence())
        for (std::size_t i = 0; i < value.size(); ++i) items.push_back(value[i]);
      else
        items.push_back(value);
      std::vector<std::string> ids;
      for (const auto& c : project.combinations) ids.push_back(c.id);
      for (const auto& item : items) {
        const std::string id = item.IsScalar() ? item.Scalar() : shown(item);
        if (item.IsScalar() && std::find(ids.begin(), ids.end(), id) != ids.end()) {
          k.show_combinations.push_back(id);
          continue;
        }
        const std::string near = closest_match(id, ids);
        diagnostics.error(where_in(item, file),
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
    if (!value.IsScalar()) {
      diagnostics.error(where_in(value, file),
                        fmt::format("package.{}: expected text, got {}", key, shown(value)));
      continue;
    }
    *field = value.Scalar();
  }
}

std::string foundation_title(const std::string& path) {
  try {
    const YAML::Node root = YAML::LoadFile(path);
    if (!root.IsMap() || !root["caps"] || !root["title"] || !root["title"].IsScalar()) return "";
    return root["title"].Scalar();
  } catch (const YAML::Exception&) {
    return "";
  }
}

}  // namespace cairn
