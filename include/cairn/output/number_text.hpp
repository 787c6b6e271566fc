// number_text.hpp — numbers and counts written for a reader, the same way in every output.
//
// Fixed decimals (fixed_text, general_text) and the quantities with their units and decimals
// live in core/quantity_format.hpp, the one place for them. Counts agree with their noun
// ("1 combination", "2 combinations"). Values below what a format can show (round-off such as
// a rotation of 1e-19 rad) print as 0.
#pragma once

#include <cstddef>
#include <string>

#include "cairn/core/quantity_format.hpp"

namespace cairn {

// "1 combination", "2 combinations", "0 combinations"; `plural` defaults to singular + "s".
std::string count_text(std::size_t count, const std::string& singular,
                       const std::string& plural = "");

// A cap rotation (rad) in scientific notation with 3 decimals ("1.234e-05"), or "0" when
// the rotation moves no point within `reach` m of the origin by as much as `resolution` m
// (the displacements' display resolution): round-off such as 1e-19 rad is not shown.
// Requires: reach > 0, resolution > 0.
std::string rotation_text(double radians, double reach, double resolution);

// The rotation as a number for data outputs (JSON): 0 when rotation_text would print "0".
double rotation_value(double radians, double reach, double resolution);

}  // namespace cairn
