// defaults.hpp — the values cairn assumes when a project file leaves them out, each defined
// once here: default factors of safety, the minimum pile spacing and the tolerable settlement. Reports name the value
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
// Minimum centre-to-centre spacing of piles, in pile widths, when the file sets none (common
// practice; AASHTO LRFD 10.7.1.2 asks for 2.5 D and at least 750 mm for driven piles, from
// memory).
inline constexpr double kMinSpacingFactor = 2.5;
// Tolerable total settlement, m, when the file sets none (common practice: 25 mm, Terzaghi &
// Peck for footings on sand).
inline constexpr double kDefaultSettlementLimit = 0.025;

}  // namespace cairn
