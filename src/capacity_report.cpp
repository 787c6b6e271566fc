#include "cairn/capacity_report.hpp"

#include <cmath>

#include <fmt/format.h>

#include "cairn/diagnostics.hpp"
#include "cairn/number_text.hpp"

namespace cairn {
namespace {

using nlohmann::json;

struct Fmt {
  UnitSystem u;
  std::string force(double v) const {
    return fixed_text(from_si(u, Quantity::force, v), u == UnitSystem::SI ? 1 : 2);
  }
  std::string length(double v) const {
    return fixed_text(from_si(u, Quantity::length, v), u == UnitSystem::SI ? 2 : 1);
  }
  std::string pressure(double v) const {
    return fixed_text(from_si(u, Quantity::pressure, v), u == UnitSystem::SI ? 1 : 3);
  }
  const char* f() const { return unit_label(u, Quantity::force); }
  const char* l() const { return unit_label(u, Quantity::length); }
  const char* p() const { return unit_label(u, Quantity::pressure); }
};

std::string tip_line(const TipDetails& t, const Fmt& f) {
  std::string text = fmt::format("method {} in '{}' at {} {} below ground: q' = {} {}",
                                 t.method, t.layer, f.length(t.depth), f.l(),
                                 f.pressure(t.q_prime), f.p());
  auto add = [&](const char* name, const std::optional<double>& v, const char* pattern) {
    if (v) text += fmt::format(", {} = {}", name, fmt::format(fmt::runtime(pattern), *v));
  };
  if (t.sigma_o) text += fmt::format(", σ'o = {} {}", f.pressure(*t.sigma_o), f.p());
  add("K0", t.k0, "{:.3f}");
  add("μs", t.poisson_ratio, "{:.3f}");
  add("Δ", t.volumetric_strain, "{:.5f}");
  add("Ir", t.rigidity_index, "{:.1f}");
  add("Irr", t.reduced_rigidity_index, "{:.1f}");
  add("N*σ", t.n_sigma, "{:.2f}");
  add("N*c", t.n_c, "{:.2f}");
  add("N*q", t.n_q, "{:.1f}");
  add("reduction", t.reduction, "{:.3f}");
  if (t.limit) text += fmt::format(", limit = {} {} ({})", f.pressure(*t.limit), f.p(), t.limit_source);
  if (t.layer_unit_tip)
    text += fmt::format(", the layer's own q_p = {} {} before the transition near a boundary",
                        f.pressure(*t.layer_unit_tip), f.p());
  text += fmt::format("; unit tip q_p = {} {}{}", f.pressure(t.unit_tip), f.p(),
                      t.limited ? " (limited by " + t.governed_by + ")"
                                : (t.limit ? " (limit not reached)" : " (no limit)"));
  return text;
}

}  // namespace

json capacities_json(const Project& project, const std::vector<PileTypeCapacity>& capacities,
                     const std::string& options) {
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
    for (const auto& row : c.depth_table)
      table.push_back({{"length", length(row.length)},
                       {"tip", force(row.tip)},
                       {"shaft", force(row.shaft)},
                       {"ultimate", force(row.ultimate)},
                       {"tension", force(row.tension)},
                       {"note", row.note}});
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
           {"unit_tip", pressure(t.unit_tip)},
           {"limited", t.limited},
           {"governed_by", t.governed_by}}},
         {"layers", layers},
         {"limits_governing", r.limits},
         {"depth_table", table},
         {"notes", r.notes}});
  }
  return {{"tool", {{"name", "cairn"}, {"version", CAIRN_VERSION}}},
          {"input", project.file},
          {"command", options},
          {"units",
           {{"system", to_string(u)},
            {"force", unit_label(u, Quantity::force)},
            {"length", unit_label(u, Quantity::length)},
            {"pressure", unit_label(u, Quantity::pressure)}}},
          {"pile_types", types},
          {"caution", kCaution}};
}

std::string render_capacities(const Project& project,
                              const std::vector<PileTypeCapacity>& capacities, Format format,
                              const std::string& options) {
  if (format == Format::json) return capacities_json(project, capacities, options).dump(2) + "\n";
  const Fmt f{project.units};
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
        f.length(type.section.width), f.l(), f.length(type.length), f.l(),
        f.length(project.cap.depth), f.l());
    out += md ? "## " + head + "\n\n" : head + "\n";
    Table layers;
    layers.title = md ? "" : "Shaft resistance by layer";
    layers.headers = {"layer", fmt::format("from ({})", f.l()), fmt::format("to ({})", f.l()),
                      "method", fmt::format("mean unit ({})", f.p()),
                      fmt::format("shaft ({})", f.f()), fmt::format("uplift ({})", f.f())};
    layers.numeric = {false, true, true, false, true, true, true};
    for (const auto& l : r.layers)
      layers.rows.push_back({l.name, f.length(l.top), f.length(l.bottom), l.method,
                             f.pressure(l.unit_average) + (l.limited ? " (limited)" : ""),
                             f.force(l.shaft), f.force(l.uplift)});
    out += render_table(layers, format == Format::markdown ? Format::markdown : Format::text);
    const std::string in = md ? "- " : "  ";
    out += in + "Tip: " + tip_line(r.tip_details, f) + fmt::format("; Q_tip = {} {}\n", f.force(r.tip), f.f());
    for (const auto& l : r.layers)
      if (l.limit)
        out += in + fmt::format("Shaft limit in '{}': unit friction ≤ {} {} ({}); {}\n", l.name,
                                f.pressure(*l.limit), f.p(), l.limit_source,
                                l.limited ? "governed" : "not reached");
    out += in + fmt::format("Ultimate compression = tip + shaft = {} + {} = {} {}\n", f.force(r.tip),
                            f.force(r.shaft), f.force(r.ultimate_compression), f.f());
    out += in + fmt::format("Ultimate tension = shaft in tension + effective pile weight = {} + {} = {} {}\n",
                            f.force(r.uplift_shaft), f.force(r.pile_weight),
                            f.force(r.ultimate_tension), f.f());
    out += in + fmt::format("Allowable: compression {} {} (FS tip {:g}, shaft {:g}), tension {} {} (FS {:g})\n",
                            f.force(r.allowable_compression), f.f(), r.safety_factor_tip,
                            r.safety_factor_shaft, f.force(r.allowable_tension), f.f(),
                            r.safety_factor_tension);
    out += in + fmt::format("Factored: compression {} {} (φ tip {:g}, φ shaft {:.3g}), tension {} {} (φ uplift {:.3g})\n",
                            f.force(r.factored_compression), f.f(), r.phi_tip, r.phi_shaft,
                            f.force(r.factored_tension), f.f(), r.phi_uplift);
    for (const auto& note : r.notes) out += in + "Note: " + note + "\n";
    out += "\n";
    if (!c.depth_table.empty()) {
      Table t;
      t.title = md ? "" : "Capacity with depth (ultimate)";
      t.headers = {fmt::format("length ({})", f.l()), fmt::format("tip ({})", f.f()),
                   fmt::format("shaft ({})", f.f()), fmt::format("compression ({})", f.f()),
                   fmt::format("tension ({})", f.f()), "note"};
      t.numeric = {true, true, true, true, true, false};
      for (const auto& row : c.depth_table)
        t.rows.push_back({f.length(row.length), f.force(row.tip), f.force(row.shaft),
                          f.force(row.ultimate), f.force(row.tension), row.note});
      out += render_table(t, format == Format::markdown ? Format::markdown : Format::text);
    }
  }
  out += md ? std::string("_") + kCaution + "_\n" : std::string(kCaution) + "\n";
  return out;
}

}  // namespace cairn
