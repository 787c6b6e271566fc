// index.html of a package of several caps: one row per cap, linked to its page.
#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include "cairn/output/html_package.hpp"
#include "cairn/output/markup.hpp"
#include "cairn/output/number_text.hpp"

namespace cairn {

std::string render_package_index_html(const std::vector<PackageIndexRow>& rows,
                                      const std::string& command) {
  std::size_t failing = 0;
  double top = 1.2;
  for (const auto& row : rows) {
    failing += row.pass ? 0 : 1;
    if (std::isfinite(row.max_utilization)) top = std::max(top, row.max_utilization);
  }
  std::string s = "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n"
                  "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n"
                  "<meta name=\"generator\" content=\"cairn " + html_escape(CAIRN_VERSION) + "\">\n"
                  "<title>Calculation package: " + std::to_string(rows.size()) + " caps</title>\n";
  s += R"(<style>
body { font-family: Helvetica, Arial, sans-serif; font-size: 10.5pt; color: #111;
       max-width: 260mm; margin: 10mm auto; padding: 0 6mm; }
h1 { font-size: 18pt; }
.wide { overflow-x: auto; }
table { border-collapse: collapse; margin: 6pt 0 12pt; font-size: 9.5pt; }
th, td { border: 1px solid #999; padding: 2pt 6pt; text-align: left; vertical-align: top; }
th { background: #eee; }
td.num { text-align: right; font-variant-numeric: tabular-nums; }
td.fail { color: #b3261e; font-weight: bold; }
td.ok { color: #1e7b34; }
tr { break-inside: avoid; page-break-inside: avoid; }
.caution { border: 2px solid #b3261e; padding: 8pt; font-weight: bold; }
@page { size: auto; margin: 14mm 12mm; }
</style>
</head>
<body>
)";
  s += "<h1>Calculation package</h1>\n<table class=\"meta\">\n<tr><th>tool</th><td>cairn " +
       html_escape(CAIRN_VERSION) + "</td></tr>\n<tr><th>command</th><td><code>" +
       html_escape(command) + "</code></td></tr>\n" +
       fmt::format("<tr><th>caps</th><td>{} ({} failing)</td></tr>\n</table>\n", rows.size(), failing);
  s += "<div class=\"wide\"><table class=\"index\">\n<caption>One page per cap</caption>\n"
       "<thead><tr><th>page</th><th>cap</th><th>source file</th><th>verdict</th>"
       "<th>max utilization</th><th>governing pile</th><th>governing combination</th></tr>"
       "</thead>\n<tbody>\n";
  for (const auto& row : rows) {
    const std::string u = std::isinf(row.max_utilization) ? std::string("no capacity")
                                                          : fixed_text(row.max_utilization, 3);
    s += "<tr><td><a href=\"" + attribute_escape(row.page) + "\">" + html_escape(row.page) +
         "</a></td><td>" + html_escape(row.title) + "</td><td><code class=\"source\">" + html_escape(row.source) +
         "</code></td><td class=\"" + (row.pass ? "ok" : "fail") + "\">" +
         html_escape(row.verdict) + "</td>" +
         fmt::format("<td class=\"num\" style=\"background:{};color:{}\">{}</td>",
                     utilization_colour(row.max_utilization, top),
                     utilization_text_colour(row.max_utilization, top), html_escape(u)) +
         "<td>" + html_escape(row.pile) + "</td><td>" + html_escape(row.combination) + "</td></tr>\n";
  }
  s += "</tbody>\n</table></div>\n";
  s += "<p>Each page is the calculation package of one cap: its sign-off block, design basis, "
       "checks, equilibrium, inputs with their SHA-256 digests, and the input text.</p>\n";
  s += "<p class=\"caution\" id=\"caution\">" + html_escape(kCaution) + "</p>\n</body>\n</html>\n";
  return s;
}

}  // namespace cairn
