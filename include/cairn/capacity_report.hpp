// capacity_report.hpp — computed single-pile capacities per pile type (project_capacity.hpp),
// rendered as text, Markdown or JSON in the project's units: the `cairn capacity` command.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "cairn/project_capacity.hpp"
#include "cairn/model.hpp"
#include "cairn/report.hpp"

namespace cairn {

std::string render_capacities(const Project& project,
                              const std::vector<PileTypeCapacity>& capacities, Format format,
                              const std::string& options);
nlohmann::json capacities_json(const Project& project,
                               const std::vector<PileTypeCapacity>& capacities,
                               const std::string& options);

}  // namespace cairn
