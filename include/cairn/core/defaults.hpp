// defaults.hpp — the values cairn assumes when a project file leaves them out, each defined
// once here: default factors of safety and the tolerable settlement. Reports name the value
// used and say that it is a default.
#pragma once

namespace cairn {

// Factors of safety on ultimate capacities for service checks when a pile type or a given
// capacity names none (common practice): compression (and lateral) 2.5, tension 3.0.
inline constexpr double kDefaultSafetyCompression = 2.5;
inline constexpr double kDefaultSafetyTension = 3.0;
// Factor of safety on Broms' ultimate lateral load for service (common practice).
inline constexpr double kLateralFactorOfSafety = 2.5;
// Factor of safety on the block capacity of a group for service when the pile type gives
// none: the compression default.
inline constexpr double kDefaultBlockSafety = kDefaultSafetyCompression;
// Tolerable total settlement, m, when the file sets none (common practice: 25 mm, Terzaghi &
// Peck for footings on sand).
inline constexpr double kDefaultSettlementLimit = 0.025;

}  // namespace cairn
