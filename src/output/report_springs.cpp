#include "report_parts.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <set>

namespace cairn {
namespace {
// The input file's word for a head fixity.
const char* head_word(HeadFixity head) {
  return head == HeadFixity::fixed ? "fixed" : head == HeadFixity::partial ? "partial" : "pinned";
}
}  // namespace


using namespace report_detail;


std::string render_springs(const Project& project, const std::vector<PileTypeStiffness>& stiffness,
                           Format format, const std::string& options) {
  const QuantityFormat u(project.units);
  const std::string k = u.label(Quantity::stiffness), l = u.label(Quantity::length);
  if (format == Format::json) {
    json piles = json::array();
    for (const Pile& pile : project.piles) {
      const PileTypeStiffness& s = stiffness[pile.type];
      const auto a = pile.axis();
      piles.push_back({{"id", pile.id},
                       {"type", project.pile_types[pile.type].id},
                       {"x", u.value(Quantity::length, pile.x)},
                       {"y", u.value(Quantity::length, pile.y)},
                       {"axis", {a[0], a[1], a[2]}},
                       {"axial_stiffness", u.value(Quantity::stiffness, s.axial)},
                       {"lateral_stiffness", u.value(Quantity::stiffness, s.lateral)},
                       {"head", head_word(s.head)},
                       {"axial_source", s.axial_source},
                       {"lateral_source", s.lateral_source}});
    }
    json doc = {{"tool", {{"name", "cairn"}, {"version", CAIRN_VERSION}}},
                {"input", project.file},
                {"command", options},
                {"units", {{"stiffness", k}, {"length", l}}},
                {"piles", piles},
                {"caution", kCaution}};
    return doc.dump(2) + "\n";
  }
  Table t;
  t.title = format == Format::csv ? "" : "Pile-head springs";
  t.headers = {"pile", "type", "x (" + l + ")", "y (" + l + ")", "axis x", "axis y", "axis z",
               "axial (" + k + ")", "lateral (" + k + ")", "head"};
  t.numeric = {false, false, true, true, true, true, true, true, true, false};
  for (const Pile& pile : project.piles) {
    const PileTypeStiffness& s = stiffness[pile.type];
    const auto a = pile.axis();
    t.rows.push_back({pile.id, project.pile_types[pile.type].id, u.length(pile.x), u.length(pile.y),
                      fixed_text(a[0], 4), fixed_text(a[1], 4),
                      fixed_text(a[2], 4), u.stiffness(s.axial), u.stiffness(s.lateral),
                      head_word(s.head)});
  }
  if (format == Format::csv) return render_table(t, Format::csv) + "# " + kCaution + "\n";
  const bool md = format == Format::markdown;
  std::string out = md ? fmt::format("# Pile-head springs: {}\n\n- tool: cairn {}\n- input: `{}`\n- command: `{}`\n\n",
                                     project.title, CAIRN_VERSION, project.file, options)
                       : fmt::format("cairn {} — pile-head springs: {}\ninput: {}\ncommand: {}\n\n",
                                     CAIRN_VERSION, project.title, project.file, options);
  out += render_table(t, format);
  out += md ? "Sources:\n\n" : "Sources\n";
  for (std::size_t i = 0; i < project.pile_types.size(); ++i) {
    out += fmt::format("{}{}: axial {}; lateral {}\n", md ? "- " : "  ", project.pile_types[i].id,
                       stiffness[i].axial_source, stiffness[i].lateral_source);
  }
  out += "\nAxis: unit vector from pile head to toe. Springs act at the pile heads (underside of "
         "the cap).\n\n";
  out += kCaution + std::string("\n");
  return out;
}

}  // namespace cairn
