// html_package.hpp — the sections of the calculation package (html_report.hpp) that go
// beyond the check tables, each rendered on its own so that the package, its tests and other
// renderers can call them one by one. Every function returns a complete, escaped HTML
// fragment ("<section …>…</section>") and writes nothing.
#pragma once

#include <cstddef>
#include <string>
#include <vector>

#include "cairn/output/html_report.hpp"
#include "cairn/output/report.hpp"

namespace cairn {

// The group checks and settlement (group_checks.hpp) as a section; empty when report.group
// is null.
std::string render_group_section_html(const CheckReport& report);

// The combinations whose equilibrium the package shows (indices into results.combinations,
// ascending): the largest utilization's, the largest compression's, tension's and lateral
// force's over all piles, and every overturned one.
std::vector<std::size_t> governing_combinations(const CheckResults& results);

// For the governing combinations, the forces on the pile heads (global axes, battered
// piles' horizontal components included) and their moments about the origin, summed beside
// the applied resultant (combination_load) with the residual; then the hand check of the
// governing pile: the closed form of explain.hpp where it is exact, else the rigid cap's
// general 6-DOF equations with the numbers substituted. Empty when nothing was checked.
std::string render_equilibrium_section_html(const CheckReport& report);

// The calculation package of one cap as `cairn report` writes it: render_html_report with
// the group checks and settlement first among the extra sections.
std::string render_cap_package_html(const HtmlReportInput& input);

}  // namespace cairn
