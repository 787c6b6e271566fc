#include "report_parts.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <set>

namespace cairn {

using namespace report_detail;


std::string render_cap_summary(const std::vector<CapSummaryRow>& rows, Format format,
                               const std::string& options) {
  std::size_t failing = 0;
  for (const auto& r : rows) failing += r.pass ? 0 : 1;
  if (format == Format::json) {
    json caps = json::array();
    for (const auto& r : rows) {
      const QuantityFormat u(r.units);
      caps.push_back({{"file", r.file},
                      {"title", r.title},
                      {"units", to_string(r.units)},
                      {"piles", r.piles},
                      {"combinations", r.combinations},
                      {"max_utilization", number_or_null(r.max_utilization)},
                      {"governing", {{"pile", r.pile}, {"combination", r.combination}, {"check", r.check}}},
                      {"settlement", r.settlement ? json(u.value(Quantity::small_length, *r.settlement)) : json(nullptr)},
                      {"settlement_unit", u.label(Quantity::small_length)},
                      {"status", r.status},
                      {"pass", r.pass}});
    }
    json doc = {{"tool", {{"name", "cairn"}, {"version", CAIRN_VERSION}}},
                {"command", options},
                {"caps", caps},
                {"summary", {{"pass", failing == 0}, {"caps", rows.size()}, {"failing", failing}}},
                {"caution", kCaution}};
    return doc.dump(2) + "\n";
  }
  Table t;
  t.title = format == Format::csv ? "" : "Caps";
  t.headers = {"cap", "file", "piles", "combinations", "max utilization", "pile", "combination",
               "check", "settlement", "status"};
  t.numeric = {false, false, true, true, true, false, false, false, true, false};
  for (const auto& r : rows) {
    const QuantityFormat u(r.units);
    t.rows.push_back({r.title, r.file, std::to_string(r.piles), std::to_string(r.combinations),
                      utilization_text(r.max_utilization), r.pile, r.combination, r.check,
                      r.settlement ? u.small(*r.settlement) + " " + u.label(Quantity::small_length)
                                   : std::string("-"),
                      r.status});
  }
  if (format == Format::csv) return render_table(t, Format::csv) + "# " + kCaution + "\n";
  std::string out = format == Format::markdown
                        ? fmt::format("# Foundation check\n\n- tool: cairn {}\n- command: `{}`\n\n",
                                      CAIRN_VERSION, options)
                        : fmt::format("cairn {} — foundation check\ncommand: {}\n\n", CAIRN_VERSION,
                                      options);
  out += render_table(t, format);
  const std::string line =
      failing == 0 ? (rows.size() == 1 ? std::string("PASS: the cap passes")
                                       : fmt::format("PASS: all {} caps pass", rows.size()))
                   : fmt::format("FAIL: {} of {} {}", failing, count_text(rows.size(), "cap"),
                                 failing == 1 ? "fails" : "fail");
  out += format == Format::markdown ? "**" + line + "**\n\n_" + kCaution + "_\n"
                                    : line + "\n\n" + kCaution + "\n";
  return out;
}

}  // namespace cairn
