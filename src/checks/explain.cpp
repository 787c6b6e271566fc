#include "cairn/checks/explain.hpp"

#include <cmath>

namespace cairn {

GroupSection group_section(const std::vector<std::array<double, 2>>& positions) {
  GroupSection s;
  s.count = positions.size();
  if (positions.empty()) return s;
  for (const auto& p : positions) {
    s.centroid_x += p[0];
    s.centroid_y += p[1];
  }
  s.centroid_x /= static_cast<double>(s.count);
  s.centroid_y /= static_cast<double>(s.count);
  for (const auto& p : positions) {
    const double dx = p[0] - s.centroid_x, dy = p[1] - s.centroid_y;
    s.ixx += dy * dy;
    s.iyy += dx * dx;
    s.ixy += dx * dy;
  }
  return s;
}

std::vector<HandCheck> explain_pile(const Project& project, const CheckResults& results,
                                    std::size_t pile, const std::vector<double>& axial_stiffness) {
  std::vector<HandCheck> checks;
  // Applicability that holds for every combination.
  std::string general;
  for (const Pile& p : project.piles)
    if (p.batter) general = "the group has battered piles; the hand formula holds for vertical "
                            "piles only";
  for (const CombinationCheck& cc : results.combinations) {
    HandCheck h;
    h.combination = cc.combination;
    h.solver_axial = cc.piles[pile].axial;
    const auto& solution = cc.solution;
    std::vector<std::array<double, 2>> positions;
    std::optional<double> stiffness;
    std::optional<std::size_t> first_type;
    bool equal = true, one_type = true, from_soil = false;
    for (std::size_t i = 0; i < project.piles.size(); ++i) {
      if (!solution.piles[i].active) continue;
      const Pile& p = project.piles[i];
      positions.push_back({p.x, p.y});
      if (first_type && *first_type != p.type) one_type = false;
      if (!first_type) first_type = p.type;
      // The solver's axial spring is the typed value, else (with a soil profile) one
      // estimated from the soil (stiffness.hpp), else E·A/L. Only the first and last are
      // known here; piles of one type share their spring whatever its source.
      const PileType& type = project.pile_types[p.type];
      const bool known = p.type < axial_stiffness.size();
      if (!known && !type.axial_stiffness && project.soil) {
        from_soil = true;
        continue;
      }
      const double k = known ? axial_stiffness[p.type] : type.axial_stiffness_used();
      if (stiffness && std::abs(k - *stiffness) > 1e-9 * *stiffness) equal = false;
      stiffness = k;
    }
    const bool known_equal = one_type || (equal && !from_soil);
    if (!general.empty()) {
      h.why_not = general;
    } else if (solution.overturns) {
      h.why_not = "the cap overturns in this combination";
    } else if (!known_equal) {
      h.why_not = equal ? "the active piles are of several types with axial springs from the "
                          "soil; the hand formula assumes equal stiffness"
                        : "the active piles have unequal axial stiffness; the hand formula "
                          "assumes equal stiffness";
    } else if (!solution.piles[pile].active) {
      h.why_not = "the pile dropped out (it takes no tension)";
    } else {
      h.section = group_section(positions);
      const GroupSection& s = h.section;
      const double det = s.ixx * s.iyy - s.ixy * s.ixy;
      const double size = std::max(s.ixx + s.iyy, 1e-12);
      if (s.count >= 2 && s.ixx <= 1e-12 * size && s.iyy > 0) h.form = HandCheck::Form::line_x;
      if (s.count >= 2 && s.iyy <= 1e-12 * size && s.ixx > 0) h.form = HandCheck::Form::line_y;
      const bool skew_line = det <= 1e-12 * std::max(1.0, s.ixx * s.iyy) &&
                             h.form == HandCheck::Form::general;
      if (s.count < 2 || skew_line) {
        h.why_not = "the active piles lie on one line askew to x and y; the hand formula is "
                    "written for lines along x or y";
      } else {
        // Moments about the centroid taken from the loads' points (lever arms as
        // differences of coordinates), not moved from the origin: a group far from the
        // origin keeps its digits.
        const Wrench f = combination_load(project, project.combinations[cc.combination],
                                          {s.centroid_x, s.centroid_y, 0.0});
        h.vertical = -f[2];
        for (const PileForce& force : solution.piles) {
          h.heads_moment_x += force.head_forces[3];
          h.heads_moment_y += force.head_forces[4];
        }
        h.moment_x = f[3] - h.heads_moment_x;
        h.moment_y = f[4] - h.heads_moment_y;
        if (std::abs(h.vertical) > 1e-12) {
          h.eccentricity_x = h.moment_y / h.vertical;
          h.eccentricity_y = -h.moment_x / h.vertical;
        }
        const Pile& p = project.piles[pile];
        h.x_local = p.x - s.centroid_x;
        h.y_local = p.y - s.centroid_y;
        h.direct = h.vertical / static_cast<double>(s.count);
        if (h.form == HandCheck::Form::line_x) {
          h.from_moment_y = h.moment_y / s.iyy * h.x_local;
        } else if (h.form == HandCheck::Form::line_y) {
          h.from_moment_x = -h.moment_x / s.ixx * h.y_local;
        } else {
          h.from_moment_y = (h.moment_y * s.ixx + h.moment_x * s.ixy) / det * h.x_local;
          h.from_moment_x = -(h.moment_x * s.iyy + h.moment_y * s.ixy) / det * h.y_local;
        }
        h.axial = h.direct + h.from_moment_y + h.from_moment_x;
        h.available = true;
      }
    }
    checks.push_back(h);
  }
  return checks;
}

}  // namespace cairn
