// package.hpp — the files of `cairn report`: the calculation package of every cap analysed,
// and index.html when there are several.
//
// One cap: <stem>.html (the project file's name without .yaml). Several caps (several files
// or a foundation file): one page per cap named from the cap's title (letters and digits,
// lower case, words joined by '-'); a cap without a title key takes its folder's name, else
// its file's; a numeric suffix ("-2") only where two names still collide; and index.html
// linking them. Beside a page, <page>-all-combinations.csv holds every pile in every
// combination when the page shows only some (html_package.hpp, kFullCombinationsLimit).
// The files each cap was read from are read again here for the input echo and appendix.
#pragma once

#include <string>
#include <utility>
#include <vector>

#include "cairn/app/analysis.hpp"

namespace cairn {

struct PackageRequest {
  std::string command;          // as run, for every page
  std::string out_dir;          // where the files go (for the listing)
  bool plan_svg = false;        // also <page>-plan.svg
  bool tables = false;          // also <page>/ with the check's text, Markdown, JSON, CSV
  std::string foundation_title; // running header of every page, when given
  // Per cap, in the order of the outcomes (empty: none): sections added after the results
  // (the as-built section), and the verdict that replaces the check's (the as-built one).
  std::vector<std::vector<std::string>> extra_sections;
  std::vector<bool> pass_override;
  // Files read besides each cap's own (the pile survey): path and role, for the input echo.
  std::vector<std::pair<std::string, std::string>> extra_inputs;
};

struct PackageFiles {
  std::vector<std::pair<std::string, std::string>> files;  // (name, content)
  std::string listing;  // one line per cap: file, verdict, page
  bool pass = true;
};

// Requires every outcome to hold a run.
PackageFiles package_files(const std::vector<CapOutcome>& outcomes, const PackageRequest& request);

// Page names for the caps of `projects` (without ".html"), as described above.
std::vector<std::string> package_page_names(const std::vector<const Project*>& projects);

}  // namespace cairn
