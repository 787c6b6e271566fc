// site_report.hpp — the site studies (site/studies.hpp) as text, Markdown, CSV or JSON, and
// their plans as SVG, in the project's units. Each output names the command, states the
// method in one line and ends with the caution.
#pragma once

#include <string>
#include <vector>

#include "cairn/core/model.hpp"
#include "cairn/output/report.hpp"
#include "cairn/site/safe_region.hpp"
#include "cairn/site/studies.hpp"

namespace cairn {

struct SiteStudyHeader {
  const Project* project = nullptr;
  std::string options;  // the command as run
};

std::string render_pile_loss(const SiteStudyHeader& header, const LossStudy& study, Format format);
// The plan with each pile coloured by the largest utilization when it is lost.
std::string render_pile_loss_svg(const Project& project, const LossStudy& study);

std::string render_added_piles(const SiteStudyHeader& header, const SearchResult& result,
                               const std::vector<std::string>& standing_ids, Format format);
// The plan with the standing piles, the lost ones crossed, and the best placement marked.
std::string render_added_piles_svg(const Project& project, const SearchResult& result,
                                   const std::vector<char>& keep);

std::string render_tolerance(const SiteStudyHeader& header, const ToleranceSettings& settings,
                             const ToleranceStudy& study, Format format);

std::string render_safe_regions(const SiteStudyHeader& header, const SafeRegions& regions,
                                Format format);
// The plan with the region of the smallest margin and every combination's resultant, marked
// inside (filled) or outside (ringed red) its own region.
std::string render_safe_regions_svg(const Project& project, const SafeRegions& regions);

}  // namespace cairn
