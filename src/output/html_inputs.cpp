// The input echo of the calculation package: every file that fed the run with its size and
// SHA-256 (FIPS 180-4, output_files.hpp), and the files' text in an appendix.
#include <filesystem>

#include <fmt/format.h>

#include "cairn/output/html_package.hpp"
#include "cairn/output/markup.hpp"
#include "cairn/output/output_files.hpp"

namespace cairn {
namespace {

// The appendix prints up to this many lines of one file; the digest identifies the rest.
constexpr std::size_t kAppendixLines = 3000;

std::string anchor(std::size_t i) { return fmt::format("input-{}", i + 1); }

}  // namespace

std::string relative_to_project(const Project& project, const std::string& path) {
  namespace fs = std::filesystem;
  fs::path base = fs::path(project.file).parent_path();
  fs::path target(path);
  if (base.empty()) base = ".";
  if (base.is_absolute() != target.is_absolute()) {
    std::error_code ec;
    base = fs::absolute(base, ec);
    target = fs::absolute(target, ec);
  }
  const fs::path rel = target.lexically_normal().lexically_relative(base.lexically_normal());
  return rel.empty() ? path : rel.generic_string();
}

std::string render_input_echo_html(const CheckReport& r, const std::vector<InputFileText>& inputs) {
  const Project& p = *r.project;
  std::string s = "<section class=\"inputs\" id=\"inputs\">\n<h2>Inputs</h2>\n";
  s += "<p>Every file that fed this run, its path relative to the project file's folder, its "
       "size and its SHA-256 digest (FIPS 180-4). In that folder, <code>sha256sum FILE</code> "
       "prints the same digest for the same file; the text of each is in the appendix.</p>\n";
  s += "<table class=\"input-echo\">\n<caption>Input files</caption>\n<thead><tr><th>file</th>"
       "<th>role</th><th>bytes</th><th>SHA-256</th></tr></thead>\n<tbody>\n";
  for (std::size_t i = 0; i < inputs.size(); ++i) {
    const auto& f = inputs[i];
    s += fmt::format("<tr><td><a href=\"#{}\"><code>{}</code></a></td><td>{}</td><td class=\"num\">"
                     "{}</td><td><code class=\"digest\">{}</code></td></tr>\n",
                     anchor(i), html_escape(relative_to_project(p, f.path)), html_escape(f.role),
                     f.content.size(), sha256_hex(f.content));
  }
  s += "</tbody>\n</table>\n";
  s += "<table class=\"meta\">\n<tr><th>tool</th><td>cairn " + html_escape(CAIRN_VERSION) +
       "</td></tr>\n<tr><th>command</th><td><code>" + html_escape(r.options) +
       "</code></td></tr>\n</table>\n";
  s += "<p class=\"note\">The loads table (section 3) gives the file and line each load was "
       "read from: a line of a YAML file, or a row of a reactions CSV.</p>\n";
  return s + "</section>";
}

std::string render_input_appendix_html(const CheckReport& r, const std::vector<InputFileText>& inputs) {
  const Project& p = *r.project;
  std::string s = "<section class=\"appendix\" id=\"appendix\">\n<h2>Appendix: input text</h2>\n";
  for (std::size_t i = 0; i < inputs.size(); ++i) {
    const auto& f = inputs[i];
    s += "<h3 id=\"" + anchor(i) + "\">" + html_escape(relative_to_project(p, f.path)) + " (" +
         html_escape(f.role) + ")</h3>\n<pre class=\"listing\">";
    std::size_t line = 0, at = 0;
    while (at < f.content.size() && line < kAppendixLines) {
      std::size_t end = f.content.find('\n', at);
      if (end == std::string::npos) end = f.content.size();
      std::string text = f.content.substr(at, end - at);
      if (!text.empty() && text.back() == '\r') text.pop_back();
      s += fmt::format("<span class=\"ln\">{:>4}</span> {}\n", ++line, html_escape(text));
      at = end + 1;
    }
    s += "</pre>\n";
    if (at < f.content.size())
      s += fmt::format("<p class=\"note\">Only the first {} lines are printed; the digest in "
                       "Inputs identifies the whole file.</p>\n",
                       kAppendixLines);
  }
  return s + "</section>";
}

}  // namespace cairn
