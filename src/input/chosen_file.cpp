#include "cairn/input/chosen_file.hpp"

#include <filesystem>

#include <fmt/format.h>
#include <yaml-cpp/yaml.h>

#include "cairn/core/diagnostics.hpp"

namespace cairn {
namespace {

namespace fs = std::filesystem;

std::string number(double v) { return fmt::format("{}", v == 0.0 ? 0.0 : v); }

YAML::Node flow_pair(double a, double b) {
  YAML::Node n;
  n.push_back(number(a));
  n.push_back(number(b));
  n.SetStyle(YAML::EmitterStyle::Flow);
  return n;
}

// A path written in `from_file` as it must be written in a file in `to_dir`.
std::string moved_path(const std::string& path, const std::string& from_file, const fs::path& to_dir) {
  const fs::path p(path);
  if (p.is_absolute()) return path;
  const fs::path target = fs::absolute(fs::path(from_file).parent_path() / p).lexically_normal();
  const fs::path rel = target.lexically_relative(fs::absolute(to_dir).lexically_normal());
  return rel.empty() ? target.string() : rel.generic_string();
}

// The pile type's entry in `file` or the files it includes, with the file it was found in.
std::optional<std::pair<YAML::Node, std::string>> find_type(const std::string& file,
                                                            const std::string& id, int depth) {
  if (depth > 20) return std::nullopt;
  YAML::Node root;
  try {
    root = YAML::LoadFile(file);
  } catch (const YAML::Exception&) {
    return std::nullopt;
  }
  if (!root.IsMap()) return std::nullopt;
  if (root["pile_types"] && root["pile_types"].IsMap() && root["pile_types"][id])
    return std::make_pair(YAML::Clone(root["pile_types"][id]), file);
  if (const YAML::Node inc = root["include"]) {
    std::vector<std::string> list;
    if (inc.IsSequence())
      for (const auto& i : inc) list.push_back(i.Scalar());
    else if (inc.IsScalar())
      list.push_back(inc.Scalar());
    // The last include wins in a merge only for entries the including file lacks; the first
    // file found is the one the reader takes for a type defined once.
    for (const auto& i : list)
      if (auto found = find_type((fs::path(file).parent_path() / i).lexically_normal().string(), id,
                                 depth + 1))
        return found;
  }
  return std::nullopt;
}

}  // namespace

std::string chosen_project_text(const std::string& design_file, const std::string& output_path,
                                const ChosenLayout& chosen) {
  YAML::Node root = YAML::LoadFile(design_file);
  root.remove("design");
  const fs::path out_dir = fs::path(output_path).parent_path();
  // Paths relative to the new file.
  if (YAML::Node inc = root["include"]) {
    if (inc.IsSequence()) {
      for (std::size_t i = 0; i < inc.size(); ++i)
        inc[i] = moved_path(inc[i].Scalar(), design_file, out_dir);
    } else if (inc.IsScalar()) {
      root["include"] = moved_path(inc.Scalar(), design_file, out_dir);
    }
  }
  if (YAML::Node from = root["loads_from"]; from && from.IsMap() && from["file"] && from["file"].IsScalar())
    from["file"] = moved_path(from["file"].Scalar(), design_file, out_dir);
  // The chosen pile type's length.
  YAML::Node types = root["pile_types"];
  if (!types || !types.IsMap() || !types[chosen.pile_type]) {
    const auto found = find_type(design_file, chosen.pile_type, 0);
    if (!found)
      throw InputError({design_file, 0, 0},
                       fmt::format("--write: cannot find pile type '{}' to set its length",
                                   chosen.pile_type));
    const YAML::Node main = YAML::LoadFile(design_file);
    const YAML::Node other = YAML::LoadFile(found->second);
    const std::string main_units = main["units"] ? main["units"].Scalar() : "";
    if (other["units"] && other["units"].Scalar() != main_units)
      throw InputError({found->second, 0, 0},
                       fmt::format("--write: pile type '{}' is written in {} units, the project "
                                   "in {}; copy it into the project file to write the layout",
                                   chosen.pile_type, other["units"].Scalar(), main_units));
    root["pile_types"][chosen.pile_type] = found->first;
  }
  root["pile_types"][chosen.pile_type]["length"] = chosen.length_text;
  // The cap.
  YAML::Node cap = root["cap"];
  cap["thickness"] = chosen.thickness_text;
  if (!chosen.keep_outline) {
    YAML::Node outline;
    if (chosen.rectangle) {
      outline["width"] = number((*chosen.rectangle)[0]);
      outline["length"] = number((*chosen.rectangle)[1]);
      outline["center"] = flow_pair((*chosen.rectangle)[2], (*chosen.rectangle)[3]);
    } else {
      YAML::Node corners;
      for (const auto& p : chosen.polygon) corners.push_back(flow_pair(p[0], p[1]));
      outline["polygon"] = corners;
    }
    outline.SetStyle(YAML::EmitterStyle::Flow);
    cap["outline"] = outline;
  }
  // The piles.
  YAML::Node piles(YAML::NodeType::Sequence);
  for (const auto& h : chosen.piles) {
    YAML::Node p;
    p["id"] = h.id;
    p["x"] = number(h.x);
    p["y"] = number(h.y);
    p["type"] = chosen.pile_type;
    if (h.batter) {
      YAML::Node b;
      b["ratio"] = number(h.batter->ratio);
      b["toward"] = number(h.batter->toward_deg);
      p["batter"] = b;
    }
    p.SetStyle(YAML::EmitterStyle::Flow);
    piles.push_back(p);
  }
  root["piles"] = piles;
  YAML::Emitter emitter;
  emitter << root;
  std::string text;
  for (const auto& line : chosen.header) text += line.empty() ? "#\n" : "# " + line + "\n";
  return text + emitter.c_str() + "\n";
}

}  // namespace cairn
