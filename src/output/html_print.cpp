// The package of one cap put together, with its print style sheet and table of contents.
#include <fmt/format.h>

#include "cairn/output/html_package.hpp"
#include "cairn/output/markup.hpp"

namespace cairn {
namespace {

// Screen: wide tables scroll inside their box, the plan fills the column. Paper (A4 or
// Letter, whichever the printer has: `size: auto`, margins that fit both): each section
// starts a page, no table row, equation or figure is split, and the page margins carry the
// running header (project, cap, page n of N) and the caution.
constexpr const char* kPrintStyle = R"(
@media screen {
  table { display: block; overflow-x: auto; max-width: 100%; }
  section.plan svg.plan { width: 100%; height: auto; }
}
nav.contents ul { list-style: none; padding-left: 12pt; margin: 4pt 0; }
nav.contents li { margin: 1pt 0; }
table.sign-off td.blank { min-width: 28mm; height: 9mm; }
code.digest { font-size: 8pt; word-break: break-all; }
pre.listing .ln { color: #777777; }
.eq { break-inside: avoid; page-break-inside: avoid; }
@media print {
  section { break-before: page; page-break-before: always; }
  section.sign-off, section.design-basis { break-before: auto; page-break-before: auto; }
  nav.contents { break-after: page; page-break-after: always; }
  tr, .eq, .figure, h3 { break-inside: avoid; page-break-inside: avoid; }
  a { color: inherit; text-decoration: none; }
  pre.listing { white-space: pre-wrap; font-size: 7pt; }
  footer .caution { display: none; }
}
)";

}  // namespace

std::string package_print_css(const std::string& project_name, const std::string& cap) {
  const std::string font = "font-family: Helvetica, Arial, sans-serif; color: #444444;";
  std::string css = kPrintStyle;
  css += "@page {\n  size: auto;\n  margin: 18mm 12mm 17mm 12mm;\n";
  css += "  @top-left { content: \"" + css_string_escape(project_name) + "\"; font-size: 8pt; " +
         font + " }\n";
  css += "  @top-center { content: \"" + css_string_escape(cap) + "\"; font-size: 8pt; " + font +
         " }\n";
  css += "  @top-right { content: \"page \" counter(page) \" of \" counter(pages); font-size: 8pt; " +
         font + " }\n";
  css += "  @bottom-center { content: \"" + css_string_escape(kCaution) +
         "\"; font-size: 7.5pt; font-weight: bold; color: #b3261e; font-family: Helvetica, "
         "Arial, sans-serif; }\n}\n";
  return css;
}

std::string table_of_contents_html(const std::string& html) {
  std::string items;
  std::size_t at = 0;
  while ((at = html.find("<section", at)) != std::string::npos) {
    const std::size_t tag_end = html.find('>', at);
    if (tag_end == std::string::npos) break;
    const std::string tag = html.substr(at, tag_end - at);
    at = tag_end;
    const std::size_t id_at = tag.find("id=\"");
    if (id_at == std::string::npos) continue;
    const std::string id = tag.substr(id_at + 4, tag.find('"', id_at + 4) - id_at - 4);
    const std::size_t h2 = html.find("<h2", tag_end);
    const std::size_t next = html.find("<section", tag_end);
    if (h2 == std::string::npos || (next != std::string::npos && next < h2)) continue;
    const std::size_t open_end = html.find('>', h2);
    const std::size_t close = html.find("</h2>", open_end);
    if (open_end == std::string::npos || close == std::string::npos) continue;
    // The heading's text, already escaped; tags inside it dropped.
    std::string text;
    bool in_tag = false;
    for (std::size_t i = open_end + 1; i < close; ++i) {
      if (html[i] == '<') in_tag = true;
      else if (html[i] == '>') in_tag = false;
      else if (!in_tag) text += html[i];
    }
    items += "<li><a href=\"#" + id + "\">" + text + "</a></li>\n";
  }
  return "<nav class=\"contents\" id=\"contents\">\n<h2>Contents</h2>\n<ul>\n" + items +
         "</ul>\n</nav>";
}

std::string render_cap_package_html(const CapPackageInput& input) {
  HtmlReportInput page = input.report;
  if (!page.check || !page.check->project || !page.check->results)
    return render_html_report(page);  // refuses the incomplete report
  const CheckReport& r = *page.check;
  const Project& p = *r.project;
  const std::string contents_mark = "<!--cairn:contents-->";
  page.front_sections_html.insert(page.front_sections_html.begin(),
                                  {render_sign_off_html(p), contents_mark,
                                   render_design_basis_html(r)});
  std::vector<std::string> extras;
  if (r.group) extras.push_back(render_group_section_html(r));
  extras.push_back(render_equilibrium_section_html(r));
  if (input.nonlinear && has_content(*input.nonlinear))
    extras.push_back(render_nonlinear_section_html(*input.nonlinear, p.units));
  extras.insert(extras.end(), page.extra_sections_html.begin(), page.extra_sections_html.end());
  if (!input.inputs.empty()) {
    extras.push_back(render_input_echo_html(r, input.inputs));
    extras.push_back(render_input_appendix_html(r, input.inputs));
  }
  page.extra_sections_html = extras;
  page.extra_style += package_print_css(input.project_name.empty() ? p.title : input.project_name,
                                        p.title);
  page.show_combination = combinations_shown(p, *r.results);
  std::size_t shown = 0;
  for (bool s : page.show_combination) shown += s ? 1 : 0;
  const std::size_t all = page.show_combination.size();
  if (shown < all)
    page.omitted_note = fmt::format(
        "{} combinations: more than {}, so {} have their own table here — the governing "
        "combination of each pile and of each check, every failing or overturned combination "
        "and those named in package.show_combinations. {}",
        all, kFullCombinationsLimit, shown,
        input.all_combinations_file.empty()
            ? std::string("Every combination is in the envelope below; write the full table "
                          "with cairn check --out.")
            : "Every pile in every combination is in " + input.all_combinations_file +
                  ", beside this page.");
  std::string html = render_html_report(page);
  const std::size_t mark = html.find(contents_mark);
  if (mark != std::string::npos)
    html.replace(mark, contents_mark.size(), table_of_contents_html(html));
  return html;
}

}  // namespace cairn
