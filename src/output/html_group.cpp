#include "cairn/output/html_package.hpp"

#include "cairn/output/html_report.hpp"
#include "cairn/output/markup.hpp"

namespace cairn {

std::string render_group_section_html(const CheckReport& report) {
  if (!report.group) return "";
  const GroupParts parts = group_parts(report);
  std::string html = "<section id=\"group\"><h2>Group checks and settlement</h2>\n";
  auto lines = [&](const std::vector<std::string>& list) {
    if (list.empty()) return;
    html += "<ul>\n";
    for (const auto& line : list) html += "<li>" + html_escape(line) + "</li>\n";
    html += "</ul>\n";
  };
  lines(parts.layout);
  html += render_table_html(parts.efficiency);
  lines(parts.checks);
  html += render_table_html(parts.demand);
  lines(parts.notes);
  return html + "</section>";
}

}  // namespace cairn
