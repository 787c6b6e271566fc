#include "cairn/output/html_report.hpp"

#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <stdexcept>

#include <fmt/format.h>

#include "cairn/geotechnics/methods.hpp"
#include "cairn/output/html_package.hpp"
#include "cairn/output/markup.hpp"
#include "cairn/output/number_text.hpp"
#include "cairn/output/plan_svg.hpp"

namespace cairn {
namespace {

std::string esc(const std::string& s) { return xml_escape(s); }

const char* kStyle = R"(
:root { --ok: #1e7b34; --fail: #b3261e; }
body { font-family: Helvetica, Arial, sans-serif; font-size: 10.5pt; color: #111;
       max-width: 190mm; margin: 10mm auto; padding: 0 6mm; line-height: 1.35; }
h1 { font-size: 18pt; margin: 0 0 4pt; }
h2 { font-size: 13.5pt; border-bottom: 1.5px solid #333; margin: 18pt 0 6pt;
     page-break-after: avoid; break-after: avoid; }
h3 { font-size: 11pt; margin: 10pt 0 4pt; page-break-after: avoid; break-after: avoid; }
table { border-collapse: collapse; margin: 4pt 0 10pt; font-size: 9.5pt; }
caption { text-align: left; font-weight: bold; padding: 2pt 0; caption-side: top; }
th, td { border: 1px solid #999; padding: 2pt 5pt; vertical-align: top; }
th { background: #eee; text-align: left; }
td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
td.ok { color: var(--ok); }
td.fail { color: var(--fail); font-weight: bold; }
thead { display: table-header-group; }
tr { page-break-inside: avoid; break-inside: avoid; }
table.meta td, table.meta th { border: none; padding: 1pt 8pt 1pt 0; }
table.meta th { background: none; }
.status { padding: 6pt 10pt; font-weight: bold; font-size: 12pt; border: 2px solid; margin: 8pt 0; }
.status.pass { color: var(--ok); border-color: var(--ok); background: #e8f5ea; }
.status.fail { color: var(--fail); border-color: var(--fail); background: #fbe9e7; }
.note { margin: 2pt 0 8pt; font-size: 9.5pt; }
.note.fail { color: var(--fail); font-weight: bold; }
.eq { font-family: "DejaVu Serif", Georgia, "Times New Roman", serif; margin: 2pt 0 2pt 12pt; }
.figure { page-break-inside: avoid; break-inside: avoid; margin: 6pt 0; }
svg { max-width: 100%; height: auto; }
pre { font-size: 8pt; white-space: pre; overflow-x: auto; background: #f7f7f7; padding: 6pt; }
.caution { border: 2px solid var(--fail); padding: 8pt; font-weight: bold; margin-top: 16pt;
           page-break-inside: avoid; break-inside: avoid; }
.combination { page-break-inside: avoid; break-inside: avoid; }
@page { size: auto; margin: 14mm 12mm; }
@media print {
  body { margin: 0; padding: 0; max-width: none; font-size: 9.5pt; }
  h2 { margin-top: 12pt; }
  pre { white-space: pre-wrap; font-size: 7pt; }
  section.plan, section.capacity { page-break-before: always; break-before: page; }
}
)";

bool contains(const std::string& s, const char* what) { return s.find(what) != std::string::npos; }

// Parses a cell such as "0.734"; "no capacity" counts as infinite.
double parse_utilization(const std::string& cell, bool& ok) {
  ok = true;
  if (cell == "no capacity") return INFINITY;
  char* end = nullptr;
  const double v = std::strtod(cell.c_str(), &end);
  ok = end != cell.c_str() && *end == '\0';
  return v;
}

std::string list_html(const std::vector<std::string>& items) {
  std::string s = "<ul>\n";
  for (const auto& i : items) s += "<li>" + esc(i) + "</li>\n";
  return s + "</ul>\n";
}

std::string eq(const std::string& text) { return "<div class=\"eq\">" + esc(text) + "</div>\n"; }

std::string units_text(UnitSystem u) {
  const QuantityFormat f(u);
  return fmt::format("{} ({}, {}, {}, {})", to_string(u), f.label(Shown::force),
                     f.label(Shown::length), f.label(Shown::pressure), f.label(Shown::moment));
}

// ---- Sections ---------------------------------------------------------------------------

std::string title_block(const CheckReport& r) {
  const Project& p = *r.project;
  std::string s = "<header>\n<h1>Pile cap check: " + esc(p.title) + "</h1>\n";
  s += "<table class=\"meta\">\n";
  s += "<tr><th>tool</th><td>cairn " + esc(CAIRN_VERSION) + "</td></tr>\n";
  s += "<tr><th>input</th><td><code>" + esc(p.file) + "</code></td></tr>\n";
  s += "<tr><th>command</th><td><code>" + esc(r.options) + "</code></td></tr>\n";
  s += "<tr><th>units</th><td>" + esc(units_text(p.units)) + "</td></tr>\n";
  s += fmt::format("<tr><th>piles</th><td>{}</td></tr>\n<tr><th>combinations</th><td>{}</td></tr>\n",
                   p.piles.size(), p.combinations.size());
  s += "</table>\n";
  const bool pass = r.results->summary.pass;
  s += fmt::format("<p class=\"status {}\" id=\"status\">{}</p>\n", pass ? "pass" : "fail",
                   esc(summary_line(r)));
  // An overturned combination at a glance: named on its own line under the verdict.
  std::string overturned;
  for (auto c : r.results->summary.overturned)
    overturned += (overturned.empty() ? "" : ", ") + p.combinations[c].id;
  if (!overturned.empty())
    s += std::string("<p class=\"status fail overturned\" id=\"overturned\">") +
         (r.nonlinear ? "No equilibrium (a mechanism): " : "Overturned: ") + esc(overturned) +
         " — the cap has no equilibrium on its piles; no pile forces exist and every pile fails "
         "in " + (r.results->summary.overturned.size() == 1 ? "it" : "them") + ".</p>\n";
  return s + "</header>\n";
}

std::string capacity_set_text(const Project& p, const CapacitySet& c) {
  const QuantityFormat u(p.units);
  std::string s = std::string(to_string(c.basis)) + ":";
  auto add = [&](const char* name, const std::optional<double>& v) {
    if (v) s += fmt::format(" {} {} {}", name, u.force(*v), u.label(Quantity::force));
  };
  add("compression", c.compression);
  add("tension", c.tension);
  add("lateral", c.lateral);
  if (c.factor_of_safety) s += fmt::format(", FS {:g}", *c.factor_of_safety);
  if (c.factor_of_safety_tension) s += fmt::format(", FS tension {:g}", *c.factor_of_safety_tension);
  if (c.resistance_factor) s += fmt::format(", φ {:g}", *c.resistance_factor);
  if (c.resistance_factor_tension) s += fmt::format(", φ tension {:g}", *c.resistance_factor_tension);
  if (c.where.line > 0) s += fmt::format(" (given at {}:{})", c.where.file, c.where.line);
  return s;
}

std::string design_text(const PileType& type) {
  const PileDesign& d = type.design;
  if (!d.computes_capacity()) return "-";
  std::string s = std::string(to_string(d.installation)) + "; tip:";
  auto methods = [](const auto& clay, const auto& sand) {
    std::string m;
    if (clay) m += fmt::format(" {} (clay)", to_string(*clay));
    if (sand) m += fmt::format("{} {} (sand)", clay ? "," : "", to_string(*sand));
    return m.empty() ? std::string(" none") : m;
  };
  s += methods(d.tip_clay, d.tip_sand) + "; shaft:" + methods(d.shaft_clay, d.shaft_sand);
  return s;
}

std::string basis_section(const CheckReport& r, const CheckTables& tables) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  std::string s = "<section class=\"basis\" id=\"basis\">\n<h2>1. Basis</h2>\n";
  s += "<p>Units: " + esc(units_text(p.units)) +
       ". Axes: x and y in plan, z up; pile heads at z = 0 (underside of the cap); loads act on "
       "the cap in global axes, a downward load is a negative Fz, moments follow the "
       "right-hand rule.</p>\n";

  Table caps;
  caps.title = "Capacities used (" + u.label(Quantity::force) + ")";
  caps.headers = {"pile type", "service: allowable C / T / L", "source",
                  "strength: factored C / T / L", "source"};
  caps.numeric = {false, false, false, false, false};
  auto triple = [&](const Resistance& res) {
    auto one = [&](std::optional<double> v) { return v ? u.force(*v) : std::string("-"); };
    return one(res.compression) + " / " + one(res.tension) + " / " + one(res.lateral);
  };
  for (std::size_t t = 0; t < p.pile_types.size() && t < r.resistances->size(); ++t) {
    const auto& res = (*r.resistances)[t];
    caps.rows.push_back({p.pile_types[t].id, triple(res.allowable),
                         res.allowable.source.empty() ? "-" : res.allowable.source,
                         triple(res.factored), res.factored.source.empty() ? "-" : res.factored.source});
  }
  s += render_table_html(caps);

  Table methods;
  methods.title = "Where the capacities come from";
  methods.headers = {"pile type", "given in the file", "computed from the soil"};
  methods.numeric = {false, false, false};
  for (const PileType& type : p.pile_types) {
    std::string given;
    for (const auto& c : type.capacities) given += (given.empty() ? "" : "; ") + capacity_set_text(p, c);
    methods.rows.push_back({type.id, given.empty() ? "-" : given, design_text(type)});
  }
  s += render_table_html(methods);

  std::size_t generated = 0;
  std::vector<std::string> generators;
  for (const auto& c : p.combinations) {
    if (c.generator.empty()) continue;
    ++generated;
    if (std::find(generators.begin(), generators.end(), c.generator) == generators.end())
      generators.push_back(c.generator);
  }
  std::string codes;
  for (const auto& g : generators) codes += (codes.empty() ? " by " : ", ") + g;
  s += fmt::format("<p>Combinations: {} given in the file, {} generated from the load cases' "
                   "kinds{} (listed with their factors in section 3). Service combinations are "
                   "compared with allowable capacities, strength combinations with factored "
                   "resistances.</p>\n",
                   p.combinations.size() - generated, generated, esc(codes));
  s += "<h3>Assumptions</h3>\n" + list_html(r.assumptions);
  s += render_table_html(tables.pile_types);
  s += render_table_html(tables.piles);
  return s + "</section>\n";
}

std::string plan_section(const CheckReport& r) {
  std::string s = "<section class=\"plan\" id=\"plan\">\n<h2>2. Cap plan</h2>\n";
  s += "<div class=\"figure\">\n" +
       render_plan_svg(*r.project, r.results, r.resistances) + "</div>\n";
  s += "<p class=\"note\">Piles are coloured by their largest utilization over all "
       "combinations on a continuous scale (viridis: dark violet at 0, yellow at the top of the "
       "bar, 1.0 marked); a pile that fails in any combination also has a bold outline and a "
       "cross. Hover over a pile for its values.</p>\n";
  return s + "</section>\n";
}

// Where a load was read: its file relative to the project file's folder, and the line (a
// row of a reactions CSV, a line of YAML); "-" for loads cairn made (the cap's self-weight).
std::string source_text(const Project& p, const SourceLocation& where) {
  if (where.file.empty()) return "-";
  const std::string file = relative_to_project(p, where.file);
  return where.line > 0 ? fmt::format("{}:{}", file, where.line) : file;
}

std::string loads_section(const CheckReport& r, const CheckTables& tables) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  const std::string l = u.label(Quantity::length), f = u.label(Quantity::force),
                    m = u.label(Quantity::moment);
  std::string s = "<section class=\"loads\" id=\"loads\">\n<h2>3. Load cases and combinations</h2>\n";
  Table t;
  t.title = "Loads on the cap per load case";
  t.headers = {"case", "kind", "load", "x (" + l + ")", "y (" + l + ")", "z (" + l + ")",
               "Fx (" + f + ")", "Fy (" + f + ")", "Fz (" + f + ")", "Mx (" + m + ")",
               "My (" + m + ")", "Mz (" + m + ")", "source"};
  t.numeric = {false, false, false, true, true, true, true, true, true, true, true, true, false};
  for (const LoadCase& lc : p.load_cases) {
    for (const PointLoad& pl : lc.loads) {
      t.rows.push_back({lc.id, to_string(lc.kind), pl.note.empty() ? "-" : pl.note,
                        u.length(pl.at[0]), u.length(pl.at[1]), u.length(pl.at[2]),
                        u.force(pl.load[0]), u.force(pl.load[1]), u.force(pl.load[2]),
                        u.moment(pl.load[3]), u.moment(pl.load[4]), u.moment(pl.load[5]),
                        source_text(p, pl.where)});
    }
    if (lc.loads.empty()) t.rows.push_back({lc.id, to_string(lc.kind), "(no loads)", "", "", "", "", "", "", "", "", "", source_text(p, lc.where)});
  }
  s += render_table_html(t);
  s += render_table_html(tables.combinations);  // with each combination's source
  return s + "</section>\n";
}

std::string results_section(const CheckReport& r, const CheckTables& tables,
                            const std::vector<bool>& shown, const std::string& omitted_note) {
  std::string s = "<section class=\"results\" id=\"results\">\n<h2>4. Pile forces and "
                  "utilizations</h2>\n";
  s += "<p>Axial force positive in compression. Utilization = demand / capacity on the "
       "combination's basis; a pile passes at 1.000 or less. Check: the check that gives the "
       "utilization (compression, tension, lateral, structural). State: in contact, dropped out "
       "(a compression-only pile that would be in tension) or overturned (no equilibrium: no "
       "pile forces, every pile fails).</p>\n";
  const double scale_max = utilization_scale_max(r.results);
  if (!omitted_note.empty()) s += "<p class=\"note omitted\">" + esc(omitted_note) + "</p>\n";
  for (std::size_t i = 0; i < tables.per_combination.size(); ++i) {
    if (i < shown.size() && !shown[i]) continue;
    const CombinationCheck& cc = r.results->combinations[i];
    s += "<div class=\"combination\">\n" + render_table_html(tables.per_combination[i], scale_max);
    if (i < tables.per_combination_notes.size())
      s += fmt::format("<p class=\"note{}\">{}</p>\n", cc.pass ? "" : " fail",
                       esc(tables.per_combination_notes[i]));
    s += "</div>\n";
  }
  s += render_table_html(tables.envelope, scale_max);
  s += render_table_html(tables.summary, scale_max);
  return s + "</section>\n";
}

// ---- Capacity breakdown -------------------------------------------------------------------

// The shaft method's formula, from the method table (methods.hpp).
std::string shaft_formula(const std::optional<ShaftMethod>& method) {
  return method ? method_info(*method).formula : "-";
}

// The tip equations of TipDetails with the numbers substituted, one line each; the method,
// its formula and the soil values come with the details (no look-up of the layer).
std::vector<std::string> tip_lines(const Project& p, const TipDetails& d, double tip,
                                   double width) {
  const QuantityFormat u(p.units);
  const std::string kpa = u.label(Quantity::pressure), f = u.label(Quantity::force);
  const double phi = d.friction_angle.value_or(0.0);
  const double cu = d.undrained_strength.value_or(0.0);
  const std::optional<TipMethod> m = d.tip_method;
  const std::string formula = m ? method_info(*m).formula(d.kind) : "";
  const std::string pa = u.pressure(kAtmosphericPressure);
  std::vector<std::string> lines;
  lines.push_back(fmt::format("Tip in layer '{}' ({}) at {} {} below the ground; method {}.", d.layer,
                              to_string(d.kind), u.length(d.depth), u.label(Quantity::length),
                              d.method));
  lines.push_back(fmt::format("q' = σ'v at the tip = {} {}", u.pressure(d.q_prime), kpa));
  double expression = NAN;  // the method's unit tip before limits and reductions, kPa
  if (m == TipMethod::vesic && d.n_sigma && d.sigma_o && d.k0) {
    lines.push_back(fmt::format("K0 = 1 − sin φ = 1 − sin {} = {}", u.text(Shown::angle, phi), QuantityFormat::factor(*d.k0)));
    lines.push_back(fmt::format("σ'o = (1 + 2·K0)/3·q' = (1 + 2·{})/3·{} = {} {}", QuantityFormat::factor(*d.k0),
                                u.pressure(d.q_prime), u.pressure(*d.sigma_o), kpa));
    if (d.rigidity_index && d.poisson_ratio && d.soil_modulus)
      lines.push_back(fmt::format("Ir = Es/[2·(1 + μs)·q'·tan φ] = {}/[2·(1 + {})·{}·tan {}] = {}",
                                  u.pressure(*d.soil_modulus), QuantityFormat::factor(*d.poisson_ratio),
                                  u.pressure(d.q_prime), u.text(Shown::angle, phi), QuantityFormat::index(*d.rigidity_index)));
    if (d.reduced_rigidity_index && d.rigidity_index && d.volumetric_strain)
      lines.push_back(fmt::format("Irr = Ir/(1 + Ir·Δ) = {}/(1 + {}·{}) = {}",
                                  QuantityFormat::index(*d.rigidity_index), QuantityFormat::index(*d.rigidity_index),
                                  QuantityFormat::strain(*d.volumetric_strain),
                                  QuantityFormat::index(*d.reduced_rigidity_index)));
    lines.push_back(fmt::format("N*σ = 3/(3 − sin φ)·exp[(π/2 − φ)·tan φ]·tan²(45° + φ/2)·"
                                "Irr^(4·sin φ/[3·(1 + sin φ)]) = {}   (Vesić 1977)",
                                QuantityFormat::bearing_factor(*d.n_sigma)));
    expression = *d.sigma_o * *d.n_sigma;
    lines.push_back(fmt::format("{} = {}·{} = {} {}", formula, u.pressure(*d.sigma_o),
                                QuantityFormat::bearing_factor(*d.n_sigma), u.pressure(expression), kpa));
  } else if (m == TipMethod::vesic && d.n_c && d.reduced_rigidity_index) {
    if (d.soil_modulus && d.rigidity_index)
      lines.push_back(fmt::format("Ir = Es/(3·cu) = {}/(3·{}) = {}; Irr = Ir",
                                  u.pressure(*d.soil_modulus), u.pressure(cu), QuantityFormat::index(*d.rigidity_index)));
    else if (d.rigidity_index)
      lines.push_back(fmt::format("Ir = 347·(cu/pa) − 33 ≤ 300 = {}; Irr = Ir", QuantityFormat::index(*d.rigidity_index)));
    lines.push_back(fmt::format("N*c = 4/3·(ln Irr + 1) + π/2 + 1 = 4/3·(ln {} + 1) + π/2 + 1 = {}   "
                                "(Vesić 1977)",
                                QuantityFormat::index(*d.reduced_rigidity_index), QuantityFormat::bearing_factor(*d.n_c)));
    expression = cu * *d.n_c;
    lines.push_back(fmt::format("{} = {}·{} = {} {}", formula, u.pressure(cu), QuantityFormat::bearing_factor(*d.n_c),
                                u.pressure(expression), kpa));
  } else if (m == TipMethod::meyerhof && d.n_q) {
    lines.push_back(fmt::format("N*q = {} (φ = {}, Meyerhof 1976)", QuantityFormat::index(*d.n_q), u.text(Shown::angle, phi)));
    expression = d.q_prime * *d.n_q;
    lines.push_back(fmt::format("{} = {}·{} = {} {}", formula, u.pressure(d.q_prime), QuantityFormat::index(*d.n_q),
                                u.pressure(expression), kpa));
    if (d.limit)
      lines.push_back(fmt::format("limit q_l = 0.5·pa·N*q·tan φ = 0.5·{}·{}·tan {} = {} {}",
                                  pa, QuantityFormat::index(*d.n_q), u.text(Shown::angle, phi), u.pressure(*d.limit), kpa));
  } else if (m == TipMethod::meyerhof && d.n_c) {
    expression = *d.n_c * cu;
    lines.push_back(fmt::format("{} = {:g}·{} = {} {}   (Meyerhof 1976)", formula, *d.n_c, u.pressure(cu),
                                u.pressure(expression), kpa));
  } else if (m == TipMethod::meyerhof_spt && d.penetration && d.spt_n60) {
    expression = 0.4 * kAtmosphericPressure * *d.spt_n60 * *d.penetration / width;
    lines.push_back(fmt::format("{} = 0.4·{}·{:g}·{}/{} = {} {}   (Meyerhof 1976)", formula,
                                pa, *d.spt_n60, u.length(*d.penetration), u.length(width),
                                u.pressure(expression), kpa));
    if (d.limit)
      lines.push_back(fmt::format("limit 4·pa·N60 = 4·{}·{:g} = {} {}", pa, *d.spt_n60,
                                  u.pressure(*d.limit), kpa));
  } else if (m == TipMethod::fhwa && d.n_c) {
    if (d.rigidity_index) lines.push_back(fmt::format("Ir = {}", QuantityFormat::index(*d.rigidity_index)));
    lines.push_back(fmt::format("N*c = 1.33·(ln Ir + 1) ≤ 9 = {}   (O'Neill & Reese 1999)", QuantityFormat::bearing_factor(*d.n_c)));
    expression = cu * *d.n_c;
    lines.push_back(fmt::format("{} = {}·{} = {} {}", formula, QuantityFormat::bearing_factor(*d.n_c), u.pressure(cu),
                                u.pressure(expression), kpa));
    if (d.reduction)
      lines.push_back(fmt::format("shallow base: × 2/3·(1 + Z/6D) = × {}", QuantityFormat::factor(*d.reduction)));
  } else if (m == TipMethod::fhwa && d.spt_n60) {
    expression = 0.6 * *d.spt_n60 * kTsf;
    lines.push_back(fmt::format("{} = 0.6·{:g}·{} = {} {}   (O'Neill & Reese 1999)", formula,
                                *d.spt_n60, u.pressure(kTsf), u.pressure(expression), kpa));
    if (d.limit) lines.push_back(fmt::format("limit 30 tsf = {} {}", u.pressure(*d.limit), kpa));
    if (d.reduction) lines.push_back(fmt::format("wide base: × 1.27/Bb = × {}", QuantityFormat::factor(*d.reduction)));
  } else if (!m) {
    lines.push_back("No tip method for this soil: the tip resistance is taken as 0.");
  }
  if (d.bored_factor) {
    lines.push_back(fmt::format("bored pile, driven-pile method in sand: × {}   (Meyerhof 1976)",
                                QuantityFormat::factor(*d.bored_factor)));
    if (d.reduction) lines.push_back(fmt::format("wide base: × 1.27/Bb = × {}", QuantityFormat::factor(*d.reduction)));
  }
  if (m) {
    if (std::isnan(expression) || std::abs(expression - d.unit_tip) > 1e-6 * std::max(1.0, d.unit_tip))
      lines.push_back(fmt::format("q_p used = {} {}{}", u.pressure(d.unit_tip), kpa,
                                  d.limited ? " (a limit governs)" : ""));
    lines.push_back(fmt::format("Q_tip = q_p·A_tip = {}·{} = {} {}", u.pressure(d.unit_tip),
                                u.area(d.area), u.force(tip), f));
  }
  return lines;
}

std::string capacity_section(const Project& p, const std::vector<PileTypeCapacity>* capacities) {
  std::string s = "<section class=\"capacity\" id=\"capacity\">\n<h2>5. Single-pile capacity</h2>\n";
  if (!capacities || capacities->empty()) {
    s += "<p>No capacity was computed from the soil: the capacities used are those given in the "
         "file (section 1).</p>\n";
    return s + "</section>\n";
  }
  const QuantityFormat u(p.units);
  const std::string f = u.label(Quantity::force), l = u.label(Quantity::length),
                    kpa = u.label(Quantity::pressure);
  const PileTypeCapacity& sample = capacities->front();
  const CapacityResult& c = sample.result;
  const PileGeometry& g = sample.geometry;
  const std::string type_id = sample.type < p.pile_types.size() ? p.pile_types[sample.type].id : "?";
  s += fmt::format("<p>Sample pile type <b>{}</b>: {} {} {}, length {} {}, head {} {} below the "
                   "ground; tip area A_tip = {} {}, perimeter p = {} {}.",
                   esc(type_id), g.round ? "round" : "square", u.length(g.width), l,
                   u.length(g.length), l, u.length(g.head_depth), l, u.area(g.area()),
                   esc(u.area_label()), u.length(g.perimeter()), l);
  if (capacities->size() > 1) {
    std::string others;
    for (std::size_t i = 1; i < capacities->size(); ++i) {
      const std::size_t t = (*capacities)[i].type;
      others += (others.empty() ? "" : ", ") + (t < p.pile_types.size() ? p.pile_types[t].id : "?");
    }
    s += " Other pile types computed the same way: " + esc(others) + ".";
  }
  s += "</p>\n<h3>Tip (base) resistance</h3>\n";
  for (const auto& line : tip_lines(p, c.tip_details, c.tip, g.width)) s += eq(line);

  s += "<h3>Shaft resistance, layer by layer</h3>\n";
  Table t;
  t.title = "Shaft resistance: Q_s,i = f̄_i·p·ΔL_i";
  t.headers = {"layer", "method", "unit friction", "from (" + l + ")", "to (" + l + ")",
               "ΔL (" + l + ")", "f̄ (" + kpa + ")", "Q_s (" + f + ")", "uplift factor",
               "Q_up (" + f + ")"};
  t.numeric = {false, false, false, true, true, true, true, true, true, true};
  for (const auto& layer : c.layers)
    t.rows.push_back({layer.name, layer.method, shaft_formula(layer.shaft_method), u.length(layer.top),
                      u.length(layer.bottom), u.length(layer.bottom - layer.top),
                      u.pressure(layer.unit_average), u.force(layer.shaft),
                      QuantityFormat::factor(layer.uplift_factor), u.force(layer.uplift)});
  s += render_table_html(t);
  if (!c.layers.empty()) {
    const LayerShaft& first = c.layers.front();
    s += eq(fmt::format("e.g. '{}': Q_s = f̄·p·ΔL = {}·{}·{} = {} {}", first.name,
                        u.pressure(first.unit_average), u.length(g.perimeter()),
                        u.length(first.bottom - first.top), u.force(first.shaft), f));
  }
  std::string sum;
  for (const auto& layer : c.layers) sum += (sum.empty() ? "" : " + ") + u.force(layer.shaft);
  s += eq(fmt::format("Q_s = Σ Q_s,i = {} = {} {}", sum.empty() ? "0" : sum, u.force(c.shaft), f));

  s += "<h3>Totals</h3>\n";
  s += eq(fmt::format("Q_ult = Q_tip + Q_s = {} + {} = {} {}", u.force(c.tip), u.force(c.shaft),
                      u.force(c.ultimate_compression), f));
  s += eq(fmt::format("T_ult = Q_up + W' = {} + {} = {} {}   (W' effective pile weight)",
                      u.force(c.uplift_shaft), u.force(c.pile_weight), u.force(c.ultimate_tension), f));
  s += eq(fmt::format("allowable compression = Q_tip/FS_tip + Q_s/FS_s = {}/{:g} + {}/{:g} = {} {}",
                      u.force(c.tip), c.safety_factor_tip, u.force(c.shaft), c.safety_factor_shaft,
                      u.force(c.allowable_compression), f));
  s += eq(fmt::format("allowable tension = T_ult/FS_t = {}/{:g} = {} {}", u.force(c.ultimate_tension),
                      c.safety_factor_tension, u.force(c.allowable_tension), f));
  s += eq(fmt::format("factored compression = φ_tip·Q_tip + Σ φ_s,i·Q_s,i = {}·{} + {}·{} = {} {}",
                      QuantityFormat::code_factor(c.phi_tip), u.force(c.tip), QuantityFormat::factor(c.phi_shaft), u.force(c.shaft),
                      u.force(c.factored_compression), f));
  s += eq(fmt::format("factored tension = Σ φ_up,i·Q_up,i = {}·{} = {} {}", QuantityFormat::factor(c.phi_uplift),
                      u.force(c.uplift_shaft), u.force(c.factored_tension), f));
  if (!c.notes.empty()) s += "<h3>Notes</h3>\n" + list_html(c.notes);

  // The chart: the sample's depth table, else the first type that has one.
  const PileTypeCapacity* charted = nullptr;
  for (const auto& cap : *capacities)
    if (!cap.depth_table.empty()) {
      charted = &cap;
      break;
    }
  if (charted && charted->type < p.pile_types.size())
    s += "<h3>Capacity with depth, pile type " + esc(p.pile_types[charted->type].id) + "</h3>\n";
  else
    s += "<h3>Capacity with depth</h3>\n";
  if (charted)
    s += "<div class=\"figure\">\n" + render_depth_chart_svg(p, *charted) + "</div>\n";
  else
    s += "<p class=\"note\">No capacity-with-depth table was computed for this report.</p>\n";
  return s + "</section>\n";
}

// 1, 2 or 5 × 10^k at or above `raw`.
double nice_step(double raw) {
  if (!(raw > 0)) return 1.0;
  const double power = std::pow(10.0, std::floor(std::log10(raw)));
  const double m = raw / power;
  return (m <= 1.0 ? 1.0 : m <= 2.0 ? 2.0 : m <= 5.0 ? 5.0 : 10.0) * power;
}

std::string hand_check_section(const CheckReport& r) {
  if (!r.explain_pile) return "";
  return "<section class=\"hand-check\" id=\"hand-check\">\n<h2>6. Hand check</h2>\n<pre>" +
         esc(hand_check_text(r)) + "</pre>\n</section>\n";
}

}  // namespace

std::string render_table_html(const Table& table, double scale_max) {
  std::string s = "<table>\n";
  if (!table.title.empty()) s += "<caption>" + esc(table.title) + "</caption>\n";
  s += "<thead><tr>";
  for (const auto& h : table.headers) s += "<th>" + esc(h) + "</th>";
  s += "</tr></thead>\n<tbody>\n";
  for (const auto& row : table.rows) {
    s += "<tr>";
    for (std::size_t i = 0; i < row.size(); ++i) {
      const std::string& cell = row[i];
      const std::string header = i < table.headers.size() ? table.headers[i] : "";
      const bool numeric = i < table.numeric.size() && table.numeric[i];
      std::string cls = numeric ? "num" : "";
      std::string style;
      if (contains(header, "utilization")) {
        bool ok = false;
        const double u = parse_utilization(cell, ok);
        if (ok)
          style = fmt::format(" style=\"background:{};color:{}\"", utilization_colour(u, scale_max),
                              utilization_text_colour(u, scale_max));
      }
      if (header == "state" || header == "status" || header == "result") {
        const bool failing = cell == "fail" || cell == "overturned" || cell.rfind("FAIL", 0) == 0;
        const bool passing = cell == "pass";
        if (failing) cls += cls.empty() ? "fail" : " fail";
        if (passing) cls += cls.empty() ? "ok" : " ok";
      }
      s += "<td" + (cls.empty() ? std::string() : " class=\"" + cls + "\"") + style + ">" +
           esc(cell) + "</td>";
    }
    s += "</tr>\n";
  }
  return s + "</tbody>\n</table>\n";
}

std::string render_depth_chart_svg(const Project& p, const PileTypeCapacity& capacity) {
  const auto& rows = capacity.depth_table;
  if (rows.empty()) return "";
  const QuantityFormat u(p.units);
  const double force_of = from_si(p.units, Quantity::force, 1.0);
  const double length_of = from_si(p.units, Quantity::length, 1.0);
  double max_force = 0.0, max_length = 0.0;
  for (const auto& r : rows) {
    max_force = std::max({max_force, r.ultimate * force_of, r.tension * force_of});
    max_length = std::max(max_length, r.length * length_of);
  }
  max_length = std::max(max_length, capacity.geometry.length * length_of);
  const double fstep = nice_step(max_force / 6.0), lstep = nice_step(max_length / 8.0);
  const double fmax = std::max(fstep, std::ceil(max_force / fstep) * fstep);
  const double lmax = std::max(lstep, std::ceil(max_length / lstep) * lstep);
  // Plot area in px.
  const double left = 70, top = 40, width = 460, height = 400;
  auto X = [&](double force) { return left + width * force / fmax; };
  auto Y = [&](double length) { return top + height * length / lmax; };
  const std::string type_id =
      capacity.type < p.pile_types.size() ? p.pile_types[capacity.type].id : "?";
  std::string s = fmt::format(
      "<svg xmlns=\"http://www.w3.org/2000/svg\" class=\"depth-chart\" width=\"640\" "
      "height=\"{:.0f}\" viewBox=\"0 0 640 {:.0f}\" font-family=\"Helvetica, Arial, sans-serif\" "
      "font-size=\"11\" role=\"img\" aria-label=\"Capacity with pile length\">\n",
      top + height + 60, top + height + 60);
  s += "<title>Ultimate capacity against pile length, pile type " + esc(type_id) + "</title>\n";
  s += "<rect x=\"0\" y=\"0\" width=\"640\" height=\"100%\" fill=\"#ffffff\"/>\n";
  // Grid and ticks.
  s += "<g class=\"grid\" stroke=\"#dddddd\" stroke-width=\"1\">\n";
  for (double v = 0; v <= fmax + 1e-9 * fmax; v += fstep)
    s += fmt::format("<line x1=\"{0:.2f}\" y1=\"{1:.2f}\" x2=\"{0:.2f}\" y2=\"{2:.2f}\"/>\n", X(v), top,
                     top + height);
  for (double v = 0; v <= lmax + 1e-9 * lmax; v += lstep)
    s += fmt::format("<line x1=\"{1:.2f}\" y1=\"{0:.2f}\" x2=\"{2:.2f}\" y2=\"{0:.2f}\"/>\n", Y(v), left,
                     left + width);
  s += "</g>\n<g class=\"ticks\" fill=\"#333333\">\n";
  for (double v = 0; v <= fmax + 1e-9 * fmax; v += fstep)
    s += fmt::format("<text x=\"{:.2f}\" y=\"{:.2f}\" text-anchor=\"middle\">{:g}</text>\n", X(v),
                     top - 6, v);
  for (double v = 0; v <= lmax + 1e-9 * lmax; v += lstep)
    s += fmt::format("<text x=\"{:.2f}\" y=\"{:.2f}\" text-anchor=\"end\">{:g}</text>\n", left - 6,
                     Y(v) + 4, v);
  s += "</g>\n";
  s += fmt::format("<rect x=\"{}\" y=\"{}\" width=\"{}\" height=\"{}\" fill=\"none\" "
                   "stroke=\"#333333\"/>\n",
                   left, top, width, height);
  s += fmt::format("<text x=\"{:.0f}\" y=\"16\" text-anchor=\"middle\">ultimate capacity ({})</text>\n",
                   left + width / 2, u.label(Quantity::force));
  s += fmt::format("<text x=\"18\" y=\"{0:.0f}\" text-anchor=\"middle\" transform=\"rotate(-90 18 "
                   "{0:.0f})\">pile length, head to tip ({1})</text>\n",
                   top + height / 2, u.label(Quantity::length));
  auto line = [&](auto value, const char* colour, const char* dash, const char* cls) {
    std::string points;
    for (const auto& r : rows)
      points += fmt::format("{}{:.2f},{:.2f}", points.empty() ? "" : " ", X(value(r) * force_of),
                            Y(r.length * length_of));
    return fmt::format("<polyline class=\"{}\" points=\"{}\" fill=\"none\" stroke=\"{}\" "
                       "stroke-width=\"2\"{}/>\n",
                       cls, points, colour, dash);
  };
  s += line([](const DepthRow& r) { return r.ultimate; }, "#1f4e9a", "", "compression");
  s += line([](const DepthRow& r) { return r.tension; }, "#d2691e", " stroke-dasharray=\"6 4\"",
            "tension");
  // The type's length.
  const double chosen = capacity.geometry.length * length_of;
  s += fmt::format("<line x1=\"{}\" y1=\"{:.2f}\" x2=\"{}\" y2=\"{:.2f}\" stroke=\"#b3261e\" "
                   "stroke-dasharray=\"3 3\"/>\n<text x=\"{}\" y=\"{:.2f}\" fill=\"#b3261e\" "
                   "text-anchor=\"end\">{} length {:g} {}</text>\n",
                   left, Y(chosen), left + width, Y(chosen), left + width - 4, Y(chosen) - 4,
                   esc(type_id), chosen, u.label(Quantity::length));
  // Legend below the plot.
  const double ly = top + height + 30;
  s += fmt::format("<line x1=\"{0}\" y1=\"{1:.0f}\" x2=\"{2}\" y2=\"{1:.0f}\" stroke=\"#1f4e9a\" "
                   "stroke-width=\"2\"/><text x=\"{3}\" y=\"{4:.0f}\">ultimate compression</text>\n",
                   left, ly, left + 30, left + 36, ly + 4);
  s += fmt::format("<line x1=\"{0}\" y1=\"{1:.0f}\" x2=\"{2}\" y2=\"{1:.0f}\" stroke=\"#d2691e\" "
                   "stroke-width=\"2\" stroke-dasharray=\"6 4\"/><text x=\"{3}\" y=\"{4:.0f}\">"
                   "ultimate tension</text>\n",
                   left + 200, ly, left + 230, left + 236, ly + 4);
  s += "</svg>\n";
  return s;
}

std::string render_html_report(const HtmlReportInput& input) {
  const CheckReport* r = input.check;
  if (!r || !r->project || !r->results || !r->resistances)
    throw std::invalid_argument("render_html_report: the check report is incomplete");
  const CheckTables tables = check_tables(*r);
  std::string s = "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n";
  s += "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n";
  s += "<meta name=\"generator\" content=\"cairn " + esc(CAIRN_VERSION) + "\">\n";
  s += "<title>Pile cap check: " + esc(r->project->title) + "</title>\n";
  s += std::string("<style>") + kStyle + input.extra_style + "</style>\n</head>\n<body>\n";
  s += title_block(*r);
  for (const auto& front : input.front_sections_html) s += front + "\n";
  s += basis_section(*r, tables);
  s += plan_section(*r);
  s += loads_section(*r, tables);
  s += results_section(*r, tables, input.show_combination, input.omitted_note);
  s += capacity_section(*r->project, input.capacities);
  s += hand_check_section(*r);
  for (const auto& extra : input.extra_sections_html) s += extra + "\n";
  s += fmt::format("<footer>\n<p class=\"status {}\">{}</p>\n<p class=\"caution\" id=\"caution\">{}</p>\n</footer>\n",
                   r->results->summary.pass ? "pass" : "fail", esc(summary_line(*r)),
                   esc(kCaution));
  s += "</body>\n</html>\n";
  return s;
}

}  // namespace cairn
