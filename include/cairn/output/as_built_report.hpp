// as_built_report.hpp — the as-built re-check (site/as_built.hpp) as text, Markdown, CSV,
// JSON and as a section of the HTML calculation package, in the project's units.
//
// Per pile: design and as-built head, offset (mm or in) and its direction, the tolerance
// flag, the largest utilization as designed and as built and the change. Per cap: the
// verdict in plain words, the governing combination, the statement that the cap's own
// structural design is not checked, the assumptions of the as-built run and the caution.
// JSON keeps each pile row's `axial` and `lateral` for the as-built geometry (a rejected
// pile carries nothing: 0, state "rejected") and gives `design_axial` and `design_lateral`
// beside them.
#pragma once

#include <string>

#include <nlohmann/json.hpp>

#include "cairn/output/report.hpp"
#include "cairn/site/as_built.hpp"

namespace cairn {

struct AsBuiltReport {
  const AsBuiltProject* model = nullptr;
  const CheckRun* design = nullptr;
  const CheckRun* as_built = nullptr;
  const AsBuiltComparison* comparison = nullptr;
  std::string options;  // the command as run
};

std::string render_as_built(const AsBuiltReport& report, Format format);
nlohmann::json as_built_json(const AsBuiltReport& report);

// The as-built plan as inline SVG: design positions faint, as-built heads drawn and coloured
// by utilization, offsets as arrows exaggerated `exaggeration` times (stated in the legend),
// rejected and abandoned piles crossed out, added piles marked.
std::string render_as_built_plan_svg(const AsBuiltReport& report, double exaggeration = 10.0);

// "<section id=\"as-built\">…</section>" for the calculation package.
std::string as_built_section_html(const AsBuiltReport& report);

}  // namespace cairn
