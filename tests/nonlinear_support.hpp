// Shared builders of the nonlinear-mode tests (test_nonlinear_package.cpp,
// test_nonlinear_verification.cpp): a project file written from text, and the piles of a
// project on their soil curves (pile_soil_curves.hpp) as the nonlinear cap sees them, with a
// hook that may change each pile's model (a linear p-y curve, a plateau) before it is used.
#pragma once

#include <filesystem>
#include <fstream>
#include <functional>
#include <string>
#include <vector>

#include "cairn/core/model.hpp"
#include "cairn/geotechnics/pile_soil_curves.hpp"
#include "cairn/solver/nonlinear_cap.hpp"
#include "cairn/solver/nonlinear_pile.hpp"

namespace cairn::test {

// `text` written to a file in the temporary folder; its path.
inline std::string write_project_file(const std::string& text, const std::string& name) {
  const auto path = std::filesystem::temp_directory_path() / ("cairn-test-" + name + ".yaml");
  std::ofstream(path) << text;
  return path.string();
}

// The project's piles on their soil curves (nonlinear_pile_spec with `options`), each changed by `change`
// when given; responses and profiles from nonlinear_pile.hpp.
inline NonlinearGroup spec_group(const Project& project,
                                 const std::function<void(NonlinearPileSpec&)>& change = {},
                                 const NonlinearSoilOptions& options = {}) {
  std::vector<NonlinearPileSpec> specs;
  NonlinearGroup group;
  for (std::size_t i = 0; i < project.piles.size(); ++i) {
    NonlinearPileSpec spec = nonlinear_pile_spec(project, i, options);
    if (change) change(spec);
    group.heads.push_back(spec.head);
    group.axes.push_back(spec.axis);
    group.tension.push_back(spec.tension);
    group.names.push_back(project.piles[i].id);
    group.curves.push_back(spec.curves.description);
    specs.push_back(std::move(spec));
  }
  group.response = [specs](std::size_t i, const HeadMovement& m, double pm) {
    return pile_head_response(specs[i], m, pm);
  };
  group.profile = [specs](std::size_t i, const HeadMovement& m, double pm) {
    return pile_profile(specs[i], m, pm);
  };
  return group;
}

}  // namespace cairn::test
