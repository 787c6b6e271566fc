// The front of the calculation package: the sign-off block and the design-basis page.
#include <algorithm>
#include <cctype>
#include <map>
#include <set>

#include <fmt/format.h>

#include "cairn/core/diagnostics.hpp"
#include "cairn/output/html_package.hpp"
#include "cairn/output/markup.hpp"

namespace cairn {
namespace {

// The code, edition and clauses behind each combination generator (as input/combinations
// applies them).
std::string generator_code(const std::string& generator) {
  if (generator == "asce7-asd") return "ASCE/SEI 7-16 §2.4.1, allowable stress design load combinations";
  if (generator == "asce7-lrfd") return "ASCE/SEI 7-16 §2.3.1, strength design load combinations";
  if (generator == "en1990-str-geo") return "EN 1990:2002 eq. 6.10 with Table A1.2(B), STR/GEO";
  if (generator == "en1997-da1") return "EN 1997-1:2004 design approach 1 (Annex A partial factors)";
  if (generator == "en1997-da2") return "EN 1997-1:2004 design approach 2 (Annex A partial factors)";
  if (generator == "en1997-da3") return "EN 1997-1:2004 design approach 3 (Annex A partial factors)";
  if (generator == "aashto-lrfd")
    return "AASHTO LRFD Bridge Design Specifications, 7th edition (2014), Tables 3.4.1-1 and 3.4.1-2";
  return generator;
}

bool mentions(const std::string& text, const char* word) {
  std::string lower = text;
  std::transform(lower.begin(), lower.end(), lower.begin(),
                 [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
  return lower.find(word) != std::string::npos;
}

std::string list(const std::vector<std::string>& items) {
  if (items.empty()) return "<p>None.</p>\n";
  std::string s = "<ul>\n";
  for (const auto& i : items) s += "<li>" + html_escape(i) + "</li>\n";
  return s + "</ul>\n";
}

}  // namespace

std::string render_sign_off_html(const Project& p) {
  const PackageSettings& k = p.package;
  auto cell = [](const std::string& v) {
    return v.empty() ? std::string("<td class=\"blank\">&nbsp;</td>") : "<td>" + html_escape(v) + "</td>";
  };
  std::string s = "<section class=\"sign-off\" id=\"sign-off\">\n<h2>Sign-off</h2>\n";
  s += "<table class=\"sign-off\">\n<thead><tr><th>revision</th><th>date</th><th>prepared by</th>"
       "<th>checked by</th><th>signature</th></tr></thead>\n<tbody>\n<tr>" +
       cell(k.revision) + cell(k.date) + cell(k.prepared_by) + cell(k.checked_by) +
       "<td class=\"blank\">&nbsp;</td></tr>\n</tbody>\n</table>\n";
  s += "<p class=\"note\">From the project file's <code>package:</code> keys (revision, date, "
       "prepared_by, checked_by); a blank is for the reviewer to fill in.</p>\n";
  return s + "</section>";
}

std::string render_design_basis_html(const CheckReport& r) {
  const Project& p = *r.project;
  std::string s = "<section class=\"design-basis\" id=\"design-basis\">\n<h2>Design basis</h2>\n";

  // Codes and editions.
  std::vector<std::string> codes;
  std::set<std::string> seen;
  for (const auto& c : p.combinations)
    if (!c.generator.empty() && seen.insert(c.generator).second)
      codes.push_back(generator_code(c.generator) + " (generator " + c.generator + ")");
  std::size_t typed = 0;
  for (const auto& c : p.combinations) typed += c.generator.empty() ? 1 : 0;
  if (typed > 0)
    codes.push_back(fmt::format("{} combination{} written in the project file, factors as given",
                                typed, typed == 1 ? "" : "s"));
  bool structural = false;
  std::string computed;
  for (const auto& t : p.pile_types) {
    structural = structural || t.structure.has_value();
    if (t.design.computes_capacity()) computed += (computed.empty() ? "" : ", ") + t.id;
  }
  if (!computed.empty())
    codes.push_back("Single-pile capacity computed from the soil for pile type" +
                    std::string(computed.find(',') == std::string::npos ? " " : "s ") + computed +
                    " by the published methods named in section 1 and worked in section 5");
  if (structural)
    codes.push_back("Structural capacity of the pile section: ACI 318-19 eq. 22.4.2.2 (concrete), "
                    "fy·A (steel)");
  codes.push_back("Load sharing: rigid cap on linear pile-head springs, 6 degrees of freedom "
                  "(Hrennikoff 1949; Saul 1968)");
  s += "<h3>Codes and editions</h3>\n" + list(codes);
  if (!p.notes.empty()) s += "<p>Choices made while generating combinations:</p>\n" + list(p.notes);

  // Load factors: the distinct factors each load case takes, by limit state.
  Table loads;
  loads.title = "Load factors used, per load case";
  loads.headers = {"case", "kind", "service", "strength", "seismic overstrength"};
  loads.numeric = {false, false, false, false, false};
  for (std::size_t i = 0; i < p.load_cases.size(); ++i) {
    std::map<LimitState, std::set<double>> used;
    for (const auto& c : p.combinations)
      for (const auto& [index, factor] : c.factors)
        if (index == i) used[c.limit_state].insert(factor);
    auto text = [&](LimitState ls) {
      const auto it = used.find(ls);
      if (it == used.end()) return std::string("-");
      std::string t;
      for (double f : it->second) t += (t.empty() ? "" : ", ") + fmt::format("{:g}", f);
      return t;
    };
    loads.rows.push_back({p.load_cases[i].id, to_string(p.load_cases[i].kind),
                          text(LimitState::service), text(LimitState::strength),
                          text(LimitState::seismic_overstrength)});
  }
  s += "<h3>Load and resistance factors</h3>\n" + render_table_html(loads);
  s += "<p class=\"note\">Each combination with its factors is listed in section 3.</p>\n";

  Table res;
  res.title = "Resistances: how the capacities were factored";
  res.headers = {"pile type", "service (allowable)", "strength (factored)", "code resistance sets"};
  res.numeric = {false, false, false, false};
  for (std::size_t t = 0; t < p.pile_types.size() && r.resistances && t < r.resistances->size(); ++t) {
    const auto& pr = (*r.resistances)[t];
    std::string sets;
    for (const auto& [set, value] : pr.by_set)
      sets += (sets.empty() ? "" : "; ") + std::string(to_string(set)) + ": " +
              (value.source.empty() ? "-" : value.source);
    const bool same = pr.factored.source == pr.allowable.source && !pr.factored.source.empty();
    res.rows.push_back({p.pile_types[t].id, pr.allowable.source.empty() ? "-" : pr.allowable.source,
                        same ? "as for service" : pr.factored.source.empty() ? "-" : pr.factored.source,
                        sets.empty() ? "-" : sets});
  }
  s += render_table_html(res);

  // Defaults taken: the assumptions that name a default.
  std::vector<std::string> defaults;
  for (const auto& a : r.assumptions)
    if (mentions(a, "default") && !mentions(a, "warning:")) defaults.push_back(a);
  // The group limits where they equal cairn's defaults (GroupSettings, common practice).
  const GroupSettings defaults_of_group;
  const UnitSystem u = p.units;
  if (p.group.min_spacing_factor == defaults_of_group.min_spacing_factor && p.group.min_spacing == 0.0)
    defaults.push_back(fmt::format("Minimum pile spacing {:g} pile widths centre to centre "
                                   "(cairn's default; group.min_spacing).",
                                   defaults_of_group.min_spacing_factor));
  if (p.group.min_edge_distance == defaults_of_group.min_edge_distance && p.cap.outline)
    defaults.push_back(fmt::format("Minimum distance from a pile's face to the cap's edge {:g} {} "
                                   "(cairn's default, AASHTO LRFD 10.7.1.2; group.min_edge_distance).",
                                   from_si(u, Quantity::length, defaults_of_group.min_edge_distance),
                                   unit_label(u, Quantity::length)));
  for (const auto& t : p.pile_types)
    for (const auto& c : t.capacities)
      if (c.basis == CapacityBasis::ultimate && (!c.factor_of_safety || !c.factor_of_safety_tension))
        defaults.push_back(fmt::format("Pile type {}: ultimate capacities given without a factor of "
                                       "safety for {}: {:g} in compression and lateral, {:g} in "
                                       "tension (cairn's defaults).",
                                       t.id, !c.factor_of_safety ? "compression" : "tension",
                                       kDefaultSafetyCompression, kDefaultSafetyTension));
  if (p.combinations.size() > kFullCombinationsLimit)
    defaults.push_back(fmt::format("{} combinations, more than {}: section 4 prints only those that "
                                   "govern, fail, overturn or are named in "
                                   "package.show_combinations; all are in the CSV beside this page.",
                                   p.combinations.size(), kFullCombinationsLimit));
  s += "<h3>Defaults taken</h3>\n" + list(defaults);
  s += "<p class=\"note\">Every assumption is listed in section 1.</p>\n";

  std::vector<std::string> warnings;
  for (const auto& w : p.warnings) {
    Warning shown = w;
    if (!shown.where.file.empty()) shown.where.file = relative_to_project(p, shown.where.file);
    warnings.push_back(warning_note(shown));
  }
  s += "<h3 id=\"warnings\">Warnings</h3>\n" + list(warnings);
  return s + "</section>";
}

}  // namespace cairn
