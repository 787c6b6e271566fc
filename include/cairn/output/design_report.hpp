// design_report.hpp — the output of `cairn design`: the search's basis, the best layouts
// (cost, piles, type, length, spacing, cap size, largest utilization and what governs), the
// Pareto front of cost against largest utilization, the rejected layouts counted by reason
// (the explanation when none passes), and the notes (the cap's own structural design is not
// searched; the usual caution). Text, CSV, Markdown or JSON, like `check`. Lengths in the
// project's units; costs in the engineer's currency.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "cairn/core/model.hpp"
#include "cairn/design/design_spec.hpp"
#include "cairn/design/search.hpp"
#include "cairn/output/report.hpp"

namespace cairn {

struct DesignReport {
  const Project* project = nullptr;  // the design file as read
  const DesignSpec* spec = nullptr;
  const DesignOutcome* outcome = nullptr;
  std::vector<std::string> basis;     // design_basis()
  std::string options;                // the command as run
  std::optional<std::string> written;  // file the chosen layout was written to
};

// Note printed with every design output.
inline constexpr const char* kCapNotSearched =
    "The cap's own structural design (bending, shear, punching) is not part of the search: "
    "design the cap for the chosen layout separately.";

std::string render_design(const DesignReport& report, Format format);

}  // namespace cairn
