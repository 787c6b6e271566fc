// html_nonlinear.hpp — the section of the calculation package that shows the nonlinear soil
// response: the deflection, bending moment and shear diagrams of the governing piles against
// depth, a table of each governing pile's largest moment, its depth and the head deflection,
// and the group's load–displacement (pushover) curve (charts.hpp draws the diagrams).
//
// The analysis fills NonlinearSection (SI: m, kN, kN·m, as nonlinear_pile.hpp and
// pushover.hpp give them); the section shows it in the project's units. Returns escaped HTML
// and writes nothing. The package places the section only when data are given
// (CapPackageInput::nonlinear, html_package.hpp), so a linear run's package is unchanged.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "cairn/core/units.hpp"
#include "cairn/output/charts.hpp"
#include "cairn/solver/pushover.hpp"

namespace cairn {

// What the nonlinear analysis hands to the package.
struct NonlinearSection {
  // The governing piles, each with the combination it governs in and its profile along its
  // length (a pile that did not converge is listed with its message and left out of the
  // diagrams).
  std::vector<GoverningPileProfile> piles;
  // The group's pushover curve, when one was computed.
  std::optional<PushoverCurve> pushover;
};

// Whether `section` holds anything to show (a governing pile or a pushover curve).
bool has_content(const NonlinearSection& section);

// The section "<section class=\"nonlinear\" id=\"nonlinear\">…</section>": heading, a plain
// explanation with the caution, the governing piles' table, the three depth diagrams and the
// pushover chart with its end reason, in the units of `units`. Empty string when
// has_content(section) is false.
std::string render_nonlinear_section_html(const NonlinearSection& section, UnitSystem units);

}  // namespace cairn
