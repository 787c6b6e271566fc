// diff_report.hpp — the comparison of two revisions (site/revision_diff.hpp) as a Markdown
// summary fit for a review comment (text and markdown formats), CSV of the force changes, or
// JSON; in the units of the new revision.
#pragma once

#include <string>

#include "cairn/output/report.hpp"
#include "cairn/site/revision_diff.hpp"

namespace cairn {

std::string render_diff(const CheckRun& old_run, const CheckRun& new_run, const RevisionDiff& diff,
                        const std::string& options, Format format);

}  // namespace cairn
