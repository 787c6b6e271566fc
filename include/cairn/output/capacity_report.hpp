// capacity_report.hpp — computed single-pile capacities per pile type (project_capacity.hpp),
// rendered as text, Markdown, CSV or JSON in the project's units: the `cairn capacity`
// command. The capacity-with-depth table shows the ultimate, allowable and factored
// capacities, and the tip elevation when the soil profile gives ground_level; with `lengths`
// (capacity_length.hpp) each pile type's shortest length meeting a required capacity. CSV is
// the capacity-with-depth table alone, one row per pile type and length.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "cairn/geotechnics/capacity_length.hpp"
#include "cairn/geotechnics/project_capacity.hpp"
#include "cairn/core/model.hpp"
#include "cairn/output/report.hpp"

namespace cairn {

std::string render_capacities(const Project& project,
                              const std::vector<PileTypeCapacity>& capacities, Format format,
                              const std::string& options,
                              const std::vector<PileTypeLength>& lengths = {});
nlohmann::json capacities_json(const Project& project,
                               const std::vector<PileTypeCapacity>& capacities,
                               const std::string& options,
                               const std::vector<PileTypeLength>& lengths = {});

}  // namespace cairn
