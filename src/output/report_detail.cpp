// The check at the detail levels below full (envelope, governing, summary) and the long CSV
// table of every combination and pile. Built from the same tables as the full report, so the
// numbers are the full report's; none of it needs the per-pile rows except the long table.
#include "report_parts.hpp"

#include <cmath>
#include <sstream>

namespace cairn {

using namespace report_detail;

const char* to_string(Detail d) {
  switch (d) {
    case Detail::full: return "full";
    case Detail::envelope: return "envelope";
    case Detail::governing: return "governing";
    case Detail::summary: return "summary";
  }
  return "full";
}

Table governing_table(const CheckReport& r) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  Table t;
  t.title = "Governing combination per pile and check";
  if (!r.results->summary.overturned.empty())
    t.title += " (overturned, without pile forces, left out: " + overturned_ids(r) + ")";
  t.headers = {"pile", "check", "demand (" + u.label(Quantity::force) + ")", "utilization",
               "combination", "result"};
  t.numeric = {false, false, true, true, false, false};
  for (std::size_t i = 0; i < p.piles.size() && i < r.results->governing.size(); ++i) {
    const PileGoverning& g = r.results->governing[i];
    for (std::size_t k = 0; k < g.size(); ++k) {
      if (!g[k].utilization.combination) continue;
      const double v = g[k].utilization.value;
      t.rows.push_back({p.piles[i].id, to_string(static_cast<Demand>(k + 1)),
                        u.force(g[k].demand), utilization_text(v),
                        combo_id(r, g[k].utilization.combination), v <= 1.0 ? "pass" : "fail"});
    }
  }
  return t;
}

namespace {

// The overturned or unstable combinations, listed at every detail level.
Table overturned_table(const CheckReport& r) {
  const Project& p = *r.project;
  Table t;
  t.title = "Overturned combinations";
  t.headers = {"combination", "limit state", "factors", "result", "reason"};
  t.numeric = {false, false, false, false, false};
  for (std::size_t c : r.results->summary.overturned) {
    const Combination& combo = p.combinations[c];
    const CombinationCheck& cc = r.results->combinations[c];
    t.rows.push_back({combo.id, to_string(combo.limit_state), combination_formula(p, combo),
                      to_string(Verdict::overturned), cc.solution.failure});
  }
  return t;
}

std::string overturned_block(const CheckReport& r, Format format) {
  if (r.results->summary.overturned.empty()) return {};
  std::string out;
  if (format == Format::markdown) out += "## Overturned combinations\n\n";
  else out += "Overturned combinations\n";
  for (std::size_t c : r.results->summary.overturned) {
    const CombinationCheck& cc = r.results->combinations[c];
    const Combination& combo = r.project->combinations[cc.combination];
    out += fmt::format("{}Combination {} ({}): {} — {}\n", format == Format::markdown ? "- " : "  ",
                       combo.id, to_string(combo.limit_state),
                       combination_formula(*r.project, combo), to_string(verdict(cc)));
    out += (format == Format::markdown ? "  " : "    ") + combination_note(r, cc) + "\n";
  }
  return out + "\n";
}

std::string trailer(const CheckReport& r) {
  std::string text;
  for (const auto& a : r.assumptions) text += "# assumption: " + a + "\n";
  return text + "# " + kCaution + "\n";
}

}  // namespace

// render_check below full detail.
std::string report_detail::render_check_brief(const CheckReport& r, Format format) {
  if (format == Format::csv) {
    std::string out = "# summary\n" + render_table(summary_table(r), Format::csv);
    if (!r.results->summary.overturned.empty())
      out += "\n# overturned\n" + render_table(overturned_table(r), Format::csv);
    if (r.detail == Detail::envelope)
      out += "\n# envelope\n" + render_table(envelope_table(r), Format::csv);
    if (r.detail == Detail::governing)
      out += "\n# governing\n" + render_table(governing_table(r), Format::csv);
    return out + "\n" + trailer(r);
  }
  std::string out = header(r, format);
  if (r.detail != Detail::summary) {
    out += render_table(pile_types_table(r), format);
    out += render_table(piles_table(r), format);
  }
  out += overturned_block(r, format);
  if (r.detail == Detail::envelope) out += render_table(envelope_table(r), format);
  if (r.detail == Detail::governing) out += render_table(governing_table(r), format);
  if (r.detail == Detail::summary) out += render_table(summary_table(r), format);
  if (r.group && r.detail != Detail::summary) out += group_block(r, format);
  if (r.explain_pile) out += explain_block(r, format);
  out += nonlinear_block(r, format);
  out += assumptions_block(r, format);
  const std::string line = summary_line(r);
  out += format == Format::markdown ? "**" + line + "**\n\n" : line + "\n\n";
  out += format == Format::markdown ? std::string("_") + kCaution + "_\n" : kCaution + std::string("\n");
  return out;
}

void write_long_csv(const CheckReport& r, std::ostream& stream) {
  const Project& p = *r.project;
  const QuantityFormat u(p.units);
  const bool moments = any_fixed_head(r);
  std::string out = "combination,pile,axial (" + u.label(Quantity::force) + "),lateral (" +
                    u.label(Quantity::force) + "),";
  if (moments) out += csv_cell("head moment (" + u.label(Quantity::moment) + ")") + ",";
  // A nonlinear run: the largest moment along each pile and its depth, the head deflection and
  // the p-multiplier (none of them in a linear run's table, which stays as it was).
  for (const auto& h : nonlinear_csv_headers(r, true)) out += csv_cell(h) + ",";
  out += "utilization,check,state,result\n";
  std::vector<std::string> ids;
  ids.reserve(p.piles.size());
  for (const auto& pile : p.piles) ids.push_back(csv_cell(pile.id));
  // Rows go into one buffer, handed on a combination at a time.
  for (const auto& cc : r.results->combinations) {
    const std::string combo = csv_cell(p.combinations[cc.combination].id);
    for (std::size_t i = 0; i < cc.piles.size(); ++i) {
      const PileCheck& pc = cc.piles[i];
      const bool none = pc.state == PileState::overturned;
      out += combo;
      out += ',';
      out += ids[i];
      out += ',';
      out += none ? "-" : u.force(pc.axial);
      out += ',';
      out += none ? "-" : u.force(pc.lateral);
      out += ',';
      if (moments) {
        out += none ? "-" : u.moment(pc.head_moment);
        out += ',';
      }
      if (r.nonlinear)
        for (const auto& cell : nonlinear_csv_cells(r, cc, i, true)) {
          out += cell;
          out += ',';
        }
      out += none ? "-" : utilization_text(pc.utilization);
      out += ',';
      out += to_string(pc.governing);
      out += ',';
      out += to_string(pc.state);
      out += ',';
      out += result_text(pc);
      out += '\n';
    }
    if (out.size() > (1u << 16)) {
      stream << out;
      out.clear();
    }
  }
  stream << out << trailer(r);
}

std::string render_long_csv(const CheckReport& r) {
  std::ostringstream out;
  write_long_csv(r, out);
  return std::move(out).str();
}

}  // namespace cairn
