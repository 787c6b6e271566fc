#include "cairn/output/html_nonlinear.hpp"

#include <fmt/format.h>

#include "cairn/checks/checks.hpp"
#include "cairn/core/quantity_format.hpp"
#include "cairn/output/html_report.hpp"
#include "cairn/output/markup.hpp"

namespace cairn {
namespace {

std::string figure(const std::string& svg) {
  return svg.empty() ? std::string() : "<div class=\"figure\">\n" + svg + "</div>\n";
}

// Each governing pile's largest moment, its depth and the head deflection.
std::string piles_table(const NonlinearSection& section, const QuantityFormat& shown) {
  Table t;
  t.title = "Governing piles: largest bending moment along the pile and head deflection";
  t.headers = {"pile", "combination", "max moment (" + shown.label(Shown::moment) + ")",
               "depth of max moment (" + shown.label(Shown::depth) + ")",
               "head deflection (" + shown.label(Shown::displacement) + ")"};
  t.numeric = {false, false, true, true, true};
  std::string failed;
  for (const auto& g : section.piles) {
    if (!g.profile.converged) {
      t.rows.push_back({g.pile, g.combination, "-", "-", "-"});
      failed += "<p class=\"note fail\">Pile " + html_escape(g.pile) + " in " +
                html_escape(g.combination) + ": the pile's solution did not converge" +
                (g.profile.message.empty() ? std::string()
                                           : " (" + html_escape(g.profile.message) + ")") +
                "; it is left out of the diagrams.</p>\n";
      continue;
    }
    t.rows.push_back({g.pile, g.combination, shown.moment(g.profile.max_moment),
                      shown.depth(g.profile.max_moment_depth),
                      shown.small(g.profile.head_deflection)});
  }
  return render_table_html(t) + failed;
}

std::string pushover_summary(const PushoverCurve& curve, const QuantityFormat& shown) {
  const PushoverMarks marks = pushover_marks(curve);
  std::string html = "<ul>\n";
  if (!curve.combination.empty())
    html += "<li>Combination pushed: " + html_escape(curve.combination) + ".</li>\n";
  if (marks.factored_load)
    html += "<li>Factored load (λ = 1): " + shown.text(Shown::force, *marks.factored_load) +
            (marks.factored_displacement
                 ? ", reached at a cap displacement of " +
                       shown.text(Shown::displacement, *marks.factored_displacement) + "."
                 : std::string(", not reached: the group has no equilibrium at the factored "
                               "load.")) +
            "</li>\n";
  if (marks.capacity_point) {
    const PushoverPoint& c = curve.points[*marks.capacity_point];
    html += "<li>Capacity: λ = " + QuantityFormat::factor(curve.capacity_factor) + ", " +
            shown.text(Shown::force, c.load) + " at " +
            shown.text(Shown::displacement, c.displacement) + ".</li>\n";
  }
  html += "<li>" + html_escape(pushover_end_text(curve)) + ".</li>\n";
  return html + "</ul>\n";
}

}  // namespace

bool has_content(const NonlinearSection& section) {
  return !section.piles.empty() || section.pushover.has_value();
}

std::string render_nonlinear_section_html(const NonlinearSection& section, UnitSystem units) {
  if (!has_content(section)) return "";
  const QuantityFormat shown(units);
  std::string html =
      "<section class=\"nonlinear\" id=\"nonlinear\">\n<h2>Nonlinear soil "
      "response: pile diagrams and pushover curve</h2>\n";
  html +=
      "<p>These results come from the nonlinear analysis, in which the soil's resistance "
      "follows curves that soften as the pile moves instead of straight springs. Each "
      "governing pile was solved along its length under the cap's movement in the "
      "combination named; the diagrams show, against depth below the pile head, how far "
      "the pile moves sideways (deflection), how much it bends (bending moment, its "
      "largest value and depth marked) and the shear force, as the resultants of the two "
      "bending planes. The pushover curve shows how far the cap moves along the load as "
      "the combination's loads are scaled by a growing factor λ: λ = 1 is the load the "
      "combination gives, and the largest λ at which the group still finds equilibrium is "
      "its capacity, so the gap between the two is the group's reserve against lateral "
      "failure. Every number depends on the soil curves chosen and should be checked "
      "against the site's data.</p>\n";
  html += "<p class=\"caution\">" + html_escape(kCaution) + "</p>\n";
  if (!section.piles.empty()) {
    html += "<h3>Governing piles</h3>\n";
    html += piles_table(section, shown);
    html += figure(render_profile_chart_svg(ProfileQuantity::deflection, section.piles, units));
    html += figure(render_profile_chart_svg(ProfileQuantity::moment, section.piles, units));
    html += figure(render_profile_chart_svg(ProfileQuantity::shear, section.piles, units));
  }
  if (section.pushover) {
    html += "<h3>Pushover curve of the group</h3>\n";
    html += pushover_summary(*section.pushover, shown);
    const std::string chart = render_pushover_chart_svg(*section.pushover, units);
    html += chart.empty() ? std::string(
                                "<p class=\"note\">The curve has fewer than two points: "
                                "nothing to draw.</p>\n")
                          : figure(chart);
  }
  return html + "</section>";
}

}  // namespace cairn
