// pushover.hpp — the load–displacement curve of a pile group on nonlinear soil: a
// combination's loads scaled by a growing load factor λ, the cap's displacement at each step,
// up to the factored load (λ = 1) and beyond until the group forms a mechanism (no
// equilibrium found) or a stated limit is reached. Filled by the nonlinear cap analysis,
// drawn by the report.
//
// Units: kN, m, rad (internal SI).
#pragma once

#include <array>
#include <string>
#include <vector>

namespace cairn {

struct PushoverPoint {
  double load_factor = 0.0;                  // λ: the load is λ times the combination
  std::array<double, 6> cap_movement{};      // (t, r) of the cap at its reference point
  double displacement = 0.0;                 // m, the cap's movement along the load's direction
  double load = 0.0;                         // kN, λ times the combination's horizontal
                                             // resultant (vertical when there is none)
};

struct PushoverCurve {
  std::string combination;                   // the combination pushed
  std::array<double, 3> direction{};         // unit, of the load plotted
  std::vector<PushoverPoint> points;         // λ increasing, the first at λ = 0
  bool mechanism = false;                    // true: the last step found no equilibrium
  std::string end_reason;                    // why the curve stops, in plain words
  double capacity_factor = 0.0;              // the largest λ with equilibrium
};

}  // namespace cairn
