// number_text.hpp — numbers and counts written for a reader, the same way in every output.
//
// One formatter for fixed decimals, so that no output prints "-0.000": the sign is dropped
// after rounding when the rounded text is zero. Counts agree with their noun ("1 combination",
// "2 combinations"). Values below what a format can show (round-off such as a rotation of
// 1e-19 rad) print as 0.
#pragma once

#include <cstddef>
#include <string>

namespace cairn {

// `value` with `decimals` fixed decimals; a value that rounds to zero prints without a minus
// sign ("0.000", never "-0.000"). Infinity and NaN print as "inf" and "nan".
// Requires: 0 <= decimals <= 12.
std::string fixed_text(double value, int decimals);

// `value` in %g style (shortest of fixed and scientific, 6 significant digits) without a
// minus sign on zero.
std::string general_text(double value);

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
