#include "cairn/output/capacity_report.hpp"

#include <array>
#include <cmath>

#include <fmt/format.h>

#include "cairn/core/diagnostics.hpp"
#include "cairn/output/number_text.hpp"

namespace cairn {
namespace {

using nlohmann::json;

std::string tip_line(const TipDetails& t, const QuantityFormat& f) {
  std::string text = fmt::format("method {} in '{}' at {} {} below ground: q' = {} {}",
                                 t.method, t.layer, f.depth(t.depth), f.label(Shown::depth),
                                 f.pressure(t.q_prime), f.label(Shown::pressure));
  auto add = [&](const char* name, const std::optional<double>& v, Shown shown) {
    if (v) text += fmt::format(", {} = {}", name, QuantityFormat::plain(shown, *v));
  };
  if (t.sigma_o) text += fmt::format(", σ'o = {} {}", f.pressure(*t.sigma_o), f.label(Shown::pressure));
  add("K0", t.k0, Shown::factor);
  add("μs", t.poisson_ratio, Shown::factor);
  add("Δ", t.volumetric_strain, Shown::strain);
  add("Ir", t.rigidity_index, Shown::index);
  add("Irr", t.reduced_rigidity_index, Shown::index);
  add("N*σ", t.n_sigma, Shown::bearing_factor);
  add("N*c", t.n_c, Shown::bearing_factor);
  add("N*q", t.n_q, Shown::index);
  add("reduction", t.reduction, Shown::factor);
  add("bored", t.bored_factor, Shown::factor);
  if (t.limit) text += fmt::format(", limit = {} {} ({})", f.pressure(*t.limit), f.label(Shown::pressure), t.limit_source);
  if (t.layer_unit_tip)
    text += fmt::format(", the layer's own q_p = {} {} before the transition near a boundary",
                        f.pressure(*t.layer_unit_tip), f.label(Shown::pressure));
  text += fmt::format("; unit tip q_p = {} {}{}", f.pressure(t.unit_tip), f.label(Shown::pressure),
                      t.limited ? " (limited by " + t.governed_by + ")"
                                : (t.limit ? " (limit not reached)" : " (no limit)"));
  return text;
}

const PileTypeLength* length_for(const std::vector<PileTypeLength>& lengths, std::size_t type) {
  for (const auto& l : lengths)
    if (l.type == type) return &l;
  return nullptr;
}

// "1200.0 kN compression and 300.0 kN tension (allowable)"
std::string need_text(const LengthNeed& need, const QuantityFormat& f) {
  std::string text;
  if (need.compression) text += fmt::format("{} {} compression", f.force(*need.compression), f.label(Shown::force));
  if (need.tension)
    text += fmt::format("{}{} {} tension", text.empty() ? "" : " and ", f.force(*need.tension),
                        f.label(Shown::force));
  return text + fmt::format(" ({})", to_string(need.basis));
}

// A depth below the ground, with its elevation when the profile gives the datum.
std::string depth_text(const SoilProfile& soil, double depth, const QuantityFormat& f) {
  std::string text = fmt::format("{} {} below the ground", f.depth(depth), f.label(Shown::depth));
  if (const auto elevation = tip_elevation(soil, depth))
    text += fmt::format(" (elevation {} {})", f.depth(*elevation), f.label(Shown::depth));
  return text;
}

// The answer to "what length do I need", in plain words (one or more lines, no prefix).
std::vector<std::string> length_lines(const Project& project, const PileType& type,
                                      const LengthChoice& c, const QuantityFormat& f) {
  std::vector<std::string> lines;
  const LengthNeed& need = c.need;
  const std::string asked = "Length needed for " + need_text(need, f) + ": ";
  if (!c.length || !c.at) {
    std::string longest;
    if (c.longest)
      longest = fmt::format(" (the longest, {} {}, gives {} compression {} {}, tension {} {})",
                            f.depth(c.longest->length), f.label(Shown::depth), to_string(need.basis),
                            f.force(compression_on(*c.longest, need.basis)), f.label(Shown::force),
                            f.force(tension_on(*c.longest, need.basis)), f.label(Shown::force));
    lines.push_back(asked + "no length within the soil profile meets it" + longest);
    return lines;
  }
  const DepthRow& row = *c.at;
  std::string capacities;
  if (need.compression)
    capacities += fmt::format("{} compression {} {}", to_string(need.basis),
                              f.force(compression_on(row, need.basis)), f.label(Shown::force));
  if (need.tension)
    capacities += fmt::format("{}{} tension {} {}", capacities.empty() ? "" : ", ",
                              to_string(need.basis), f.force(tension_on(row, need.basis)), f.label(Shown::force));
  lines.push_back(asked + fmt::format("length {} {}, tip {} in '{}'; {}", f.depth(*c.length), f.label(Shown::depth),
                                      depth_text(*project.soil, row.tip_depth, f), c.tip_layer,
                                      capacities));
  if (c.at_shortest)
    lines.push_back("  the shortest length searched (--from) already meets it; a shorter pile "
                    "may too");
  else
    lines.push_back(fmt::format("  found in the table, then refined by bisection to {} {}",
                                f.depth(c.resolution), f.label(Shown::depth)));
  if (c.next_boundary)
    lines.push_back(fmt::format(
        "  next layer boundary to watch: top of '{}' at {}, {} {} ({} pile widths) below "
        "the tip",
        c.next_layer, depth_text(*project.soil, *c.next_boundary, f),
        f.depth(*c.next_boundary - row.tip_depth), f.label(Shown::depth),
        QuantityFormat::index((*c.next_boundary - row.tip_depth) / type.section.width)));
  else
    lines.push_back("  no layer boundary below the tip: the profile's base is the limit of the "
                    "information");
  // Meyerhof (1976): a tip develops its full resistance about 10 D into a stronger layer.
  if (c.tip_layer_top && row.tip_depth - *c.tip_layer_top < 10.0 * type.section.width)
    lines.push_back(fmt::format(
        "  caution: the tip is only {} {} ({} pile widths) below the top of '{}' at {}; "
        "check the bearing layer's top and the resistance near it (Meyerhof 1976: the full tip "
        "resistance develops over about 10 widths into a stronger layer)",
        f.depth(row.tip_depth - *c.tip_layer_top), f.label(Shown::depth),
        QuantityFormat::index((row.tip_depth - *c.tip_layer_top) / type.section.width), c.tip_layer,
        depth_text(*project.soil, *c.tip_layer_top, f)));
  if (c.falls_short_again)
    lines.push_back(fmt::format(
        "  caution: a longer pile of {} {} falls short again (capacity with depth drops, e.g. "
        "a tip entering a weaker layer); read the table",
        f.depth(*c.falls_short_again), f.label(Shown::depth)));
  return lines;
}

// The capacity-with-depth table with ultimate, allowable and factored capacities; the tip
// elevation when the datum is known; the pile type's id first when `with_type`.
Table depth_table(const Project& project, const PileTypeCapacity& c, const QuantityFormat& f,
                  const LengthChoice* choice, bool with_type) {
  const bool datum = project.soil && project.soil->ground_level.has_value();
  Table t;
  if (with_type) t.headers.push_back("pile type");
  t.headers.push_back(fmt::format("length ({})", f.label(Shown::depth)));
  t.headers.push_back(fmt::format("tip depth ({})", f.label(Shown::depth)));
  if (datum) t.headers.push_back(fmt::format("tip elevation ({})", f.label(Shown::depth)));
  // Text and Markdown shorten the names (C compression, T tension; a legend follows).
  static constexpr std::array<const char*, 8> kLong = {
      "tip", "shaft", "ultimate compression", "ultimate tension", "allowable compression",
      "allowable tension", "factored compression", "factored tension"};
  static constexpr std::array<const char*, 8> kShort = {
      "tip", "shaft", "ultimate C", "ultimate T", "allowable C", "allowable T", "factored C",
      "factored T"};
  for (const char* name : with_type ? kLong : kShort)
    t.headers.push_back(fmt::format("{} ({})", name, f.label(Shown::force)));
  if (choice) t.headers.push_back("meets need");
  t.headers.push_back("note");  // a transition near a boundary or a tip limit shaping the row
  t.numeric.assign(t.headers.size(), true);
  if (with_type) t.numeric.front() = false;
  if (choice) t.numeric[t.numeric.size() - 2] = false;
  t.numeric.back() = false;
  for (const auto& row : c.depth_table) {
    std::vector<std::string> cells;
    if (with_type) cells.push_back(project.pile_types[c.type].id);
    cells.push_back(f.depth(row.length));
    cells.push_back(f.depth(row.tip_depth));
    if (datum) cells.push_back(f.depth(*tip_elevation(*project.soil, row.tip_depth)));
    for (double v : {row.tip, row.shaft, row.ultimate, row.tension, row.allowable_compression,
                     row.allowable_tension, row.factored_compression, row.factored_tension})
      cells.push_back(f.force(v));
    if (choice) cells.push_back(meets(row, choice->need) ? "yes" : "no");
    cells.push_back(row.note);
    t.rows.push_back(std::move(cells));
  }
  return t;
}

// CSV: the capacity-with-depth tables of every pile type in one table, then the answers,
// the notes and the caution as comment lines.
std::string capacities_csv(const Project& project, const std::vector<PileTypeCapacity>& capacities,
                           const std::vector<PileTypeLength>& lengths, const std::string& options) {
  const QuantityFormat f(project.units);
  std::string out;
  Table all;
  for (const auto& c : capacities) {
    const PileTypeLength* l = length_for(lengths, c.type);
    Table t = depth_table(project, c, f, l ? &l->choice : nullptr, true);
    if (all.headers.empty()) all.headers = t.headers;
    for (auto& row : t.rows) all.rows.push_back(std::move(row));
  }
  if (!all.headers.empty()) out += render_table(all, Format::csv);
  out += fmt::format("# cairn {}, input {}, options: {}\n", CAIRN_VERSION, project.file, options);
  for (const auto& c : capacities) {
    const PileType& type = project.pile_types[c.type];
    if (const PileTypeLength* l = length_for(lengths, c.type))
      for (const auto& line : length_lines(project, type, l->choice, f))
        out += "# " + type.id + ": " + line + "\n";
    for (const auto& note : c.result.notes) out += "# " + type.id + ": note: " + note + "\n";
  }
  for (const auto& w : project.warnings) out += "# " + warning_note(w) + "\n";
  return out + "# " + kCaution + "\n";
}

}  // namespace

json capacities_json(const Project& project, const std::vector<PileTypeCapacity>& capacities,
                     const std::string& options, const std::vector<PileTypeLength>& lengths) {
  const UnitSystem u = project.units;
  auto force = [&](double v) { return from_si(u, Quantity::force, v); };
  auto length = [&](double v) { return from_si(u, Quantity::length, v); };
  auto pressure = [&](double v) { return from_si(u, Quantity::pressure, v); };
  auto opt = [&](const std::optional<double>& v, Quantity q) {
    return v ? json(from_si(u, q, *v)) : json(nullptr);
  };
  json types = json::array();
  for (const auto& c : capacities) {
    const CapacityResult& r = c.result;
    const TipDetails& t = r.tip_details;
    json layers = json::array();
    for (const auto& l : r.layers)
      layers.push_back({{"name", l.name},
                        {"method", l.method},
                        {"top", length(l.top)},
                        {"bottom", length(l.bottom)},
                        {"shaft", force(l.shaft)},
                        {"uplift", force(l.uplift)},
                        {"unit_average", pressure(l.unit_average)},
                        {"limit", opt(l.limit, Quantity::pressure)},
                        {"limit_source", l.limit_source},
                        {"limit_default", l.limit_default},
                        {"limited", l.limited}});
    json table = json::array();
    for (const auto& row : c.depth_table) {
      table.push_back({{"length", length(row.length)},
                       {"tip", force(row.tip)},
                       {"shaft", force(row.shaft)},
                       {"ultimate", force(row.ultimate)},
                       {"tension", force(row.tension)},
                       {"note", row.note}});
      json& added = table.back();
      added["tip_depth"] = length(row.tip_depth);
      added["tip_elevation"] = project.soil ? opt(tip_elevation(*project.soil, row.tip_depth),
                                                  Quantity::length)
                                            : json(nullptr);
      added["allowable_compression"] = force(row.allowable_compression);
      added["allowable_tension"] = force(row.allowable_tension);
      added["factored_compression"] = force(row.factored_compression);
      added["factored_tension"] = force(row.factored_tension);
    }
    types.push_back(
        {{"id", project.pile_types[c.type].id},
         {"tip", force(r.tip)},
         {"shaft", force(r.shaft)},
         {"ultimate", force(r.ultimate_compression)},
         {"uplift", force(r.ultimate_tension)},
         {"uplift_shaft", force(r.uplift_shaft)},
         {"pile_weight", force(r.pile_weight)},
         {"allowable_compression", force(r.allowable_compression)},
         {"allowable_tension", force(r.allowable_tension)},
         {"factored_compression", force(r.factored_compression)},
         {"factored_tension", force(r.factored_tension)},
         {"factors",
          {{"safety_tip", r.safety_factor_tip},
           {"safety_shaft", r.safety_factor_shaft},
           {"safety_tension", r.safety_factor_tension},
           {"phi_tip", r.phi_tip},
           {"phi_shaft", r.phi_shaft},
           {"phi_uplift", r.phi_uplift}}},
         {"tip_details",
          {{"method", t.method},
           {"layer", t.layer},
           {"depth", length(t.depth)},
           {"q_prime", pressure(t.q_prime)},
           {"sigma_o", opt(t.sigma_o, Quantity::pressure)},
           {"K0", t.k0 ? json(*t.k0) : json(nullptr)},
           {"poisson_ratio", t.poisson_ratio ? json(*t.poisson_ratio) : json(nullptr)},
           {"volumetric_strain", t.volumetric_strain ? json(*t.volumetric_strain) : json(nullptr)},
           {"Ir", t.rigidity_index ? json(*t.rigidity_index) : json(nullptr)},
           {"Irr", t.reduced_rigidity_index ? json(*t.reduced_rigidity_index) : json(nullptr)},
           {"N_sigma", t.n_sigma ? json(*t.n_sigma) : json(nullptr)},
           {"N_c", t.n_c ? json(*t.n_c) : json(nullptr)},
           {"N_q", t.n_q ? json(*t.n_q) : json(nullptr)},
           {"limit", opt(t.limit, Quantity::pressure)},
           {"limit_source", t.limit_source},
           {"limit_default", t.limit_default},
           {"layer_unit_tip", opt(t.layer_unit_tip, Quantity::pressure)},
           {"transition", t.transition},
           {"bored_factor", t.bored_factor ? json(*t.bored_factor) : json(nullptr)},
           {"unit_tip", pressure(t.unit_tip)},
           {"limited", t.limited},
           {"governed_by", t.governed_by}}},
         {"layers", layers},
         {"limits_governing", r.limits},
         {"depth_table", table},
         {"notes", r.notes}});
    if (const PileTypeLength* l = length_for(lengths, c.type)) {
      const LengthChoice& lc = l->choice;
      types.back()["length_needed"] = {
          {"basis", to_string(lc.need.basis)},
          {"compression", opt(lc.need.compression, Quantity::force)},
          {"tension", opt(lc.need.tension, Quantity::force)},
          {"length", opt(lc.length, Quantity::length)},
          {"tip_depth", lc.at ? json(length(lc.at->tip_depth)) : json(nullptr)},
          {"tip_elevation", lc.at && project.soil ? opt(tip_elevation(*project.soil, lc.at->tip_depth),
                                                        Quantity::length)
                                                  : json(nullptr)},
          {"tip_layer", lc.tip_layer},
          {"at_shortest", lc.at_shortest},
          {"resolution", length(lc.resolution)},
          {"next_boundary", opt(lc.next_boundary, Quantity::length)},
          {"next_layer", lc.next_layer},
          {"falls_short_again", opt(lc.falls_short_again, Quantity::length)}};
    }
  }
  return {{"tool", {{"name", "cairn"}, {"version", CAIRN_VERSION}}},
          {"input", project.file},
          {"command", options},
          {"units",
           {{"system", to_string(u)},
            {"force", unit_label(u, Quantity::force)},
            {"length", unit_label(u, Quantity::length)},
            {"pressure", unit_label(u, Quantity::pressure)}}},
          {"ground_level", project.soil ? opt(project.soil->ground_level, Quantity::length)
                                        : json(nullptr)},
          {"pile_types", types},
          {"caution", kCaution}};
}

std::string render_capacities(const Project& project,
                              const std::vector<PileTypeCapacity>& capacities, Format format,
                              const std::string& options,
                              const std::vector<PileTypeLength>& lengths) {
  if (format == Format::json)
    return capacities_json(project, capacities, options, lengths).dump(2) + "\n";
  if (format == Format::csv) return capacities_csv(project, capacities, lengths, options);
  const QuantityFormat f(project.units);
  const bool md = format == Format::markdown;
  std::string out =
      md ? fmt::format("# Pile capacity: {}\n\n- tool: cairn {}\n- input: `{}`\n- command: `{}`\n\n",
                       project.title, CAIRN_VERSION, project.file, options)
         : fmt::format("cairn {} — pile capacity: {}\ninput: {}\ncommand: {}\n\n", CAIRN_VERSION,
                       project.title, project.file, options);
  if (capacities.empty())
    out += "No pile type asks for a computed capacity (tip_method / shaft_method with a soil "
           "profile).\n\n";
  for (const auto& c : capacities) {
    const PileType& type = project.pile_types[c.type];
    const CapacityResult& r = c.result;
    const std::string head = fmt::format(
        "Pile type {}: {}, {} {} {}, length {} {}, head {} {} below ground", type.id,
        to_string(type.design.installation), to_string(type.section.shape),
        f.depth(type.section.width), f.label(Shown::depth), f.depth(type.length), f.label(Shown::depth),
        f.depth(project.cap.depth), f.label(Shown::depth));
    out += md ? "## " + head + "\n\n" : head + "\n";
    Table layers;
    layers.title = md ? "" : "Shaft resistance by layer";
    layers.headers = {"layer", fmt::format("from ({})", f.label(Shown::depth)), fmt::format("to ({})", f.label(Shown::depth)),
                      "method", fmt::format("mean unit ({})", f.label(Shown::pressure)),
                      fmt::format("shaft ({})", f.label(Shown::force)), fmt::format("uplift ({})", f.label(Shown::force))};
    layers.numeric = {false, true, true, false, true, true, true};
    for (const auto& l : r.layers)
      layers.rows.push_back({l.name, f.depth(l.top), f.depth(l.bottom), l.method,
                             f.pressure(l.unit_average) + (l.limited ? " (limited)" : ""),
                             f.force(l.shaft), f.force(l.uplift)});
    out += render_table(layers, format == Format::markdown ? Format::markdown : Format::text);
    const std::string in = md ? "- " : "  ";
    out += in + "Tip: " + tip_line(r.tip_details, f) + fmt::format("; Q_tip = {} {}\n", f.force(r.tip), f.label(Shown::force));
    for (const auto& l : r.layers)
      if (l.limit)
        out += in + fmt::format("Shaft limit in '{}': unit friction ≤ {} {} ({}); {}\n", l.name,
                                f.pressure(*l.limit), f.label(Shown::pressure), l.limit_source,
                                l.limited ? "governed" : "not reached");
    out += in + fmt::format("Ultimate compression = tip + shaft = {} + {} = {} {}\n", f.force(r.tip),
                            f.force(r.shaft), f.force(r.ultimate_compression), f.label(Shown::force));
    out += in + fmt::format("Ultimate tension = shaft in tension + effective pile weight = {} + {} = {} {}\n",
                            f.force(r.uplift_shaft), f.force(r.pile_weight),
                            f.force(r.ultimate_tension), f.label(Shown::force));
    out += in + fmt::format("Allowable: compression {} {} (FS tip {:g}, shaft {:g}), tension {} {} (FS {:g})\n",
                            f.force(r.allowable_compression), f.label(Shown::force), r.safety_factor_tip,
                            r.safety_factor_shaft, f.force(r.allowable_tension), f.label(Shown::force),
                            r.safety_factor_tension);
    out += in + fmt::format("Factored: compression {} {} (φ tip {:g}, φ shaft {:.3g}), tension {} {} (φ uplift {:.3g})\n",
                            f.force(r.factored_compression), f.label(Shown::force), r.phi_tip, r.phi_shaft,
                            f.force(r.factored_tension), f.label(Shown::force), r.phi_uplift);
    for (const auto& note : r.notes) out += in + "Note: " + note + "\n";
    const PileTypeLength* needed = length_for(lengths, c.type);
    if (needed) out += "\n";
    if (needed)
      for (const auto& line : length_lines(project, type, needed->choice, f))
        out += (line.starts_with("  ") ? (md ? "  - " + line.substr(2) : in + line) : in + line) +
               "\n";
    out += "\n";
    if (!c.depth_table.empty()) {
      Table t = depth_table(project, c, f, needed ? &needed->choice : nullptr, false);
      t.title = md ? "" : "Capacity with depth (ultimate, allowable and factored)";
      out += render_table(t, format == Format::markdown ? Format::markdown : Format::text);
      out.insert(out.size() - 1,
                 in + "C compression, T tension (tension includes the pile's effective weight, "
                      "except factored)\n");
    }
  }
  out += md ? std::string("_") + kCaution + "_\n" : std::string(kCaution) + "\n";
  return out;
}

}  // namespace cairn
