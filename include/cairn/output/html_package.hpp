// html_package.hpp — the sections of the calculation package (html_report.hpp) that go
// beyond the check tables, each rendered on its own so that the package, its tests and other
// renderers can call them one by one. Every function returns a complete, escaped HTML
// fragment ("<section …>…</section>") and writes nothing.
#pragma once

#include <string>

#include "cairn/output/html_report.hpp"
#include "cairn/output/report.hpp"

namespace cairn {

// The group checks and settlement (group_checks.hpp) as a section; empty when report.group
// is null.
std::string render_group_section_html(const CheckReport& report);

// The calculation package of one cap as `cairn report` writes it: render_html_report with
// the group checks and settlement first among the extra sections.
std::string render_cap_package_html(const HtmlReportInput& input);

}  // namespace cairn
