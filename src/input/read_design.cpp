#include "cairn/input/read_design.hpp"

#include <algorithm>
#include <map>

#include <fmt/format.h>
#include <yaml-cpp/yaml.h>

#include "cairn/core/diagnostics.hpp"
#include "cairn/core/units.hpp"

namespace cairn {

const char* to_string(Family family) {
  switch (family) {
    case Family::single: return "single";
    case Family::pair: return "pair";
    case Family::grid: return "grid";
    case Family::staggered: return "staggered";
    case Family::ring: return "ring";
    case Family::ring_centre: return "ring_centre";
  }
  return "grid";
}

namespace {

const std::vector<Family> kFamilies = {Family::single,    Family::pair, Family::grid,
                                       Family::staggered, Family::ring, Family::ring_centre};

// Reads one section's keys with their locations; every problem goes to `diag`.
class DesignReader {
 public:
  DesignReader(const std::string& file, UnitSystem units, Diagnostics& diag)
      : file_(file), units_(units), diag_(diag) {}

  SourceLocation at(const YAML::Node& n) const {
    const auto mark = n.Mark();
    return {file_, mark.line >= 0 ? mark.line + 1 : 0, mark.column >= 0 ? mark.column + 1 : 0};
  }

  bool expect_map(const YAML::Node& n, const std::string& path) {
    if (n.IsMap()) return true;
    diag_.error(at(n), fmt::format("{}: expected a map of keys", path));
    return false;
  }

  void check_keys(const YAML::Node& n, const std::string& path,
                  const std::vector<std::string>& allowed) {
    for (auto it = n.begin(); it != n.end(); ++it) {
      const std::string key = it->first.as<std::string>();
      if (std::find(allowed.begin(), allowed.end(), key) != allowed.end()) continue;
      const std::string near = closest_match(key, allowed);
      std::string list;
      for (const auto& a : allowed) list += (list.empty() ? "" : ", ") + a;
      diag_.error(at(it->first),
                  fmt::format("{}.{}: unknown key{}", path, key,
                              near.empty() ? "; expected one of " + list
                                           : "; did you mean '" + near + "'?"));
    }
  }

  // A map {min, max, step}: min and max of `q`, the step a length; each given replaces its
  // default.
  void range(const YAML::Node& n, const std::string& path, Quantity q, double& min, double& max,
             double& step) {
    check_keys(n, path, {"min", "max", "step"});
    if (auto v = number(n, "min", path, q)) min = *v;
    if (auto v = number(n, "max", path, q)) max = *v;
    if (auto v = number(n, "step", path, Quantity::length)) step = *v;
  }

  // A positive (or non-negative) number of `q`, converted to SI.
  std::optional<double> number(const YAML::Node& parent, const std::string& key,
                               const std::string& path, Quantity q, bool allow_zero = false) {
    const YAML::Node n = parent[key];
    if (!n) return std::nullopt;
    const std::string where = path + "." + key;
    const std::string text = n.IsScalar() ? n.Scalar() : "";
    const auto parsed = parse_quantity(text, q, units_);
    if (!parsed.si) {
      diag_.error(at(n), fmt::format("{}: {}", where, n.IsScalar() ? parsed.error
                                                                   : "expected " + describe(q, units_)));
      return std::nullopt;
    }
    if (*parsed.si < 0 || (!allow_zero && *parsed.si == 0)) {
      diag_.error(at(n), fmt::format("{}: expected a {} number, got '{}'", where,
                                     allow_zero ? "non-negative" : "positive", text));
      return std::nullopt;
    }
    return parsed.si;
  }

  std::optional<bool> flag(const YAML::Node& parent, const std::string& key,
                           const std::string& path) {
    const YAML::Node n = parent[key];
    if (!n) return std::nullopt;
    const std::string text = n.IsScalar() ? n.Scalar() : "";
    if (text == "true" || text == "yes") return true;
    if (text == "false" || text == "no") return false;
    diag_.error(at(n), fmt::format("{}.{}: expected true or false, got '{}'", path, key, text));
    return std::nullopt;
  }

  std::optional<std::size_t> count(const YAML::Node& parent, const std::string& key,
                                   const std::string& path, std::size_t largest) {
    const YAML::Node n = parent[key];
    if (!n) return std::nullopt;
    const std::string text = n.IsScalar() ? n.Scalar() : "";
    std::size_t used = 0;
    long value = 0;
    try {
      value = std::stol(text, &used);
    } catch (const std::exception&) {
      used = 0;
    }
    if (used != text.size() || text.empty() || value < 1 || static_cast<std::size_t>(value) > largest) {
      diag_.error(at(n), fmt::format("{}.{}: expected a whole number from 1 to {}, got '{}'", path,
                                     key, largest, text));
      return std::nullopt;
    }
    return static_cast<std::size_t>(value);
  }

  DesignSpec read(const YAML::Node& d, const YAML::Node& key, const Project& project) {
    DesignSpec spec;
    spec.where = at(key);
    spec.layout_unit = to_si_factor(units_, Quantity::length);
    spec.spacing_step = units_ == UnitSystem::SI ? 0.1 : 0.25 * spec.layout_unit;
    spec.length_step = units_ == UnitSystem::SI ? 0.5 : 1.0 * spec.layout_unit;
    spec.min_length = units_ == UnitSystem::SI ? 3.0 : 10.0 * spec.layout_unit;
    spec.max_length = units_ == UnitSystem::SI ? 30.0 : 100.0 * spec.layout_unit;
    if (!expect_map(d, "design")) return spec;
    check_keys(d, "design",
               {"pile_types", "families", "cap", "spacing", "edge_distance", "length",
                "max_piles", "batter", "shift_to_resultant", "tilt_limit", "cost", "keep"});
    // Pile types, by name.
    const YAML::Node types = d["pile_types"];
    std::vector<YAML::Node> names;
    if (!types) {
      diag_.error(at(d), "design.pile_types: missing; expected the candidate pile types by name");
    } else if (types.IsSequence()) {
      for (const auto& t : types) names.push_back(t);
    } else {
      names.push_back(types);
    }
    std::vector<std::string> ids;
    for (const auto& t : project.pile_types) ids.push_back(t.id);
    for (const auto& t : names) {
      const std::string name = t.IsScalar() ? t.Scalar() : "";
      const auto it = std::find(ids.begin(), ids.end(), name);
      if (it == ids.end()) {
        const std::string near = closest_match(name, ids);
        diag_.error(at(t), fmt::format("design.pile_types: pile type '{}' does not exist{}", name,
                                       near.empty() ? "" : "; did you mean '" + near + "'?"));
        continue;
      }
      const auto index = static_cast<std::size_t>(it - ids.begin());
      if (std::find(spec.pile_types.begin(), spec.pile_types.end(), index) == spec.pile_types.end())
        spec.pile_types.push_back(index);
    }
    if (types && names.empty())
      diag_.error(at(types), "design.pile_types: the list is empty; expected at least one pile type");
    // Families.
    if (const YAML::Node f = d["families"]) {
      std::vector<YAML::Node> list;
      if (f.IsSequence())
        for (const auto& x : f) list.push_back(x);
      else
        list.push_back(f);
      std::vector<std::string> known;
      for (auto fam : kFamilies) known.emplace_back(to_string(fam));
      for (const auto& x : list) {
        const std::string name = x.IsScalar() ? x.Scalar() : "";
        const auto it = std::find(known.begin(), known.end(), name);
        if (it == known.end()) {
          std::string all;
          for (const auto& k : known) all += (all.empty() ? "" : ", ") + k;
          diag_.error(at(x), fmt::format("design.families: unknown family '{}'; expected one of {}",
                                         name, all));
          continue;
        }
        spec.families.push_back(kFamilies[static_cast<std::size_t>(it - known.begin())]);
      }
      if (list.empty())
        diag_.error(at(f), "design.families: the list is empty; expected at least one family");
    } else {
      spec.families = kFamilies;
    }
    // Cap.
    if (const YAML::Node c = d["cap"]; c && expect_map(c, "design.cap")) {
      check_keys(c, "design.cap", {"outline", "thickness", "min_width", "min_length"});
      spec.min_cap_width = number(c, "min_width", "design.cap", Quantity::length).value_or(0.0);
      spec.min_cap_length = number(c, "min_length", "design.cap", Quantity::length).value_or(0.0);
      if (const YAML::Node o = c["outline"]) {
        const std::string v = o.IsScalar() ? o.Scalar() : "";
        if (v == "fixed") spec.outline_fixed = true;
        else if (v != "fit")
          diag_.error(at(o), fmt::format("design.cap.outline: expected 'fit' (the cap around the "
                                         "piles, inside cap.outline) or 'fixed' (cap.outline as "
                                         "given), got '{}'", v));
        if (spec.outline_fixed && !project.cap.outline)
          diag_.error(at(o), "design.cap.outline: 'fixed' needs cap.outline");
      }
      if (const YAML::Node t = c["thickness"]; t && expect_map(t, "design.cap.thickness")) {
        check_keys(t, "design.cap.thickness", {"minimum", "base", "per_spacing", "per_width"});
        ThicknessRule rule;
        const std::string p = "design.cap.thickness";
        rule.minimum = number(t, "minimum", p, Quantity::length, true).value_or(0.0);
        rule.base = number(t, "base", p, Quantity::length, true).value_or(0.0);
        rule.per_spacing = number(t, "per_spacing", p, Quantity::number, true).value_or(0.0);
        rule.per_width = number(t, "per_width", p, Quantity::number, true).value_or(0.0);
        if (rule.thickness(0.0, 0.0) <= 0.0 && rule.per_spacing == 0.0 && rule.per_width == 0.0)
          diag_.error(at(t), "design.cap.thickness: gives no thickness; expected a minimum or "
                             "a base");
        spec.thickness = rule;
      }
    }
    // Spacing, in pile widths; the step as a length.
    if (const YAML::Node s = d["spacing"]; s && expect_map(s, "design.spacing")) {
      range(s, "design.spacing", Quantity::number, spec.min_spacing_factor,
            spec.max_spacing_factor, spec.spacing_step);
      if (spec.spacing_step < 0.001)
        diag_.error(at(s["step"]), "design.spacing.step: expected at least 1 mm");
      if (spec.min_spacing_factor > spec.max_spacing_factor)
        diag_.error(at(s), fmt::format("design.spacing: the smallest spacing ({:g} pile widths) is "
                                       "larger than the largest ({:g}); no layout can meet both",
                                       spec.min_spacing_factor, spec.max_spacing_factor));
    }
    if (spec.min_spacing_factor < project.group.min_spacing_factor)
      diag_.error(d["spacing"] ? at(d["spacing"]) : at(d),
                  fmt::format("design.spacing.min: {:g} pile widths is below the group check's "
                              "minimum group.min_spacing ({:g}); every layout would fail it",
                              spec.min_spacing_factor, project.group.min_spacing_factor));
    spec.edge_distance = number(d, "edge_distance", "design", Quantity::length, true);
    if (const YAML::Node l = d["length"]; l && expect_map(l, "design.length")) {
      range(l, "design.length", Quantity::length, spec.min_length, spec.max_length,
            spec.length_step);
      if (spec.length_step < 0.001)
        diag_.error(at(l["step"]), "design.length.step: expected at least 1 mm");
      else if (spec.min_length > spec.max_length)
        diag_.error(at(l), "design.length: the shortest pile is longer than the longest");
      else if ((spec.max_length - spec.min_length) / spec.length_step > 2000)
        diag_.error(at(l), "design.length: more than 2000 lengths from min to max; use a larger step");
    }
    if (auto v = count(d, "max_piles", "design", 100)) spec.max_piles = *v;
    spec.batter_ratio = number(d, "batter", "design", Quantity::number);
    if (auto v = flag(d, "shift_to_resultant", "design")) spec.shift_to_resultant = *v;
    spec.tilt_limit = number(d, "tilt_limit", "design", Quantity::number);
    if (const YAML::Node c = d["cost"]; !c) {
      diag_.error(at(d), "design.cost: missing; expected per_pile, per_length and per_cap_volume");
    } else if (expect_map(c, "design.cost")) {
      check_keys(c, "design.cost",
                 {"per_pile", "per_length", "per_cap_volume", "utilization_weight", "currency"});
      const std::string p = "design.cost";
      spec.cost.per_pile = number(c, "per_pile", p, Quantity::number, true).value_or(0.0);
      spec.cost.per_length = number(c, "per_length", p, Quantity::number, true).value_or(0.0);
      spec.cost.per_cap_volume = number(c, "per_cap_volume", p, Quantity::number, true).value_or(0.0);
      spec.cost.utilization_weight =
          number(c, "utilization_weight", p, Quantity::number, true).value_or(0.0);
      if (const YAML::Node cur = c["currency"]; cur && cur.IsScalar()) spec.cost.currency = cur.Scalar();
      if (spec.cost.per_pile == 0 && spec.cost.per_length == 0 && spec.cost.per_cap_volume == 0)
        diag_.error(at(c), "design.cost: every price is zero; the layouts cannot be ranked");
    }
    if (auto v = count(d, "keep", "design", 50)) spec.keep = *v;
    return spec;
  }

 private:
  std::string file_;
  UnitSystem units_;
  Diagnostics& diag_;
};

}  // namespace

DesignSpec read_design(const std::string& path, const Project& project) {
  Diagnostics diag;
  YAML::Node root;
  try {
    root = YAML::LoadFile(path);
  } catch (const YAML::Exception& e) {
    throw InputError({path, e.mark.line + 1, e.mark.column + 1},
                     fmt::format("malformed YAML: {}", e.msg));
  }
  YAML::Node key, value;
  if (root.IsMap())
    for (auto it = root.begin(); it != root.end(); ++it)
      if (it->first.as<std::string>() == "design") {
        key = it->first;
        value = it->second;
      }
  if (!value)
    throw InputError({path, 1, 1}, "design: missing; `cairn design` needs the section with the "
                                   "candidate pile types, limits and cost model");
  DesignReader reader(path, project.units, diag);
  DesignSpec spec = reader.read(value, key, project);
  if (project.pile_types.empty()) diag.error({path, 1, 1}, "pile_types: missing");
  diag.raise_if_any();
  return spec;
}

}  // namespace cairn
