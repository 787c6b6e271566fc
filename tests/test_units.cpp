// Tests of units.hpp: numbers written with a unit ("45 ft", "120 pcf") and plain numbers in
// the project's units, converted to SI (kN, m, kPa, kN/m³, kN/m, kN·m).
//
// Every expected value comes from the exact definitions listed in NIST Special Publication
// 811 (2008 ed.), "Guide for the Use of the International System of Units", Appendix B
// (B.8 factors listed alphabetically, B.9 by kind of quantity):
//   1 ft = 0.3048 m (exact), 1 in = 0.0254 m (exact),
//   1 lbf = 4.448 221 615 260 5 N (exact: 0.453 592 37 kg × 9.806 65 m/s²),
//   1 kip = 1000 lbf, 1 ton-force (2000 lb) = 2000 lbf = 8.896 443 kN,
//   1 kilogram-force = 9.806 65 N (exact), so 1 metric tonne-force = 9.806 65 kN.
// Derived factors printed in Appendix B are quoted beside each check (B.8 rounds them to
// 7 significant digits); the expected values are computed from the exact definitions.
#include <catch2/catch.hpp>

#include <string>

#include "cairn/core/units.hpp"
#include "support.hpp"

using cairn::parse_quantity;
using cairn::Quantity;
using cairn::UnitSystem;

namespace {

// Exact definitions, NIST SP 811 Appendix B.
constexpr double kFootM = 0.3048;
constexpr double kInchM = 0.0254;
constexpr double kLbfKN = 4.4482216152605e-3;
constexpr double kKipKN = 1000.0 * kLbfKN;

// The value in SI, failing the test with the parser's message when parsing failed.
double si(const std::string& text, Quantity quantity, UnitSystem system = UnitSystem::SI) {
  const auto parsed = parse_quantity(text, quantity, system);
  INFO("parsing '" << text << "': " << parsed.error);
  REQUIRE(parsed.si.has_value());
  return *parsed.si;
}

// The error message, failing the test when parsing succeeded.
std::string error_of(const std::string& text, Quantity quantity,
                     UnitSystem system = UnitSystem::SI) {
  const auto parsed = parse_quantity(text, quantity, system);
  INFO("parsing '" << text << "'");
  REQUIRE_FALSE(parsed.si.has_value());
  return parsed.error;
}

// The factors are exact or defined to 14 digits; a relative margin of 1e-12 only absorbs
// floating-point rounding of the products and quotients.
Approx exact(double value) { return cairn::test::close(value, 1e-12, 1e-12); }

}  // namespace

TEST_CASE("units: lengths in feet, inches, metres and millimetres", "[units][published]") {
  // Source: NIST SP 811 (2008), App. B.8, foot = 3.048 E-01 m (exact): 45 ft = 13.716 m.
  CHECK(si("45 ft", Quantity::length) == exact(13.716));
  // Source: NIST SP 811, App. B.8, inch = 2.54 E-02 m (exact): 18 in = 0.4572 m.
  CHECK(si("18 in", Quantity::length) == exact(0.4572));
  CHECK(si("450 mm", Quantity::length) == exact(0.45));
  CHECK(si("45 cm", Quantity::length) == exact(0.45));
  CHECK(si("0.45 m", Quantity::length) == exact(0.45));
  // No space between number and unit, and surrounding blanks, are accepted.
  CHECK(si("45ft", Quantity::length) == exact(13.716));
  CHECK(si("  45 ft  ", Quantity::length) == exact(13.716));
  CHECK(si("-1.5 ft", Quantity::length) == exact(-0.4572));
}

TEST_CASE("units: forces in kip, lbf, tons of both kinds and newtons", "[units][published]") {
  // Source: NIST SP 811, App. B.8, kip (1 kip = 1000 lbf) = 4.448 222 E+03 N; exact value
  // from lbf = 4.448 221 615 260 5 N: 300 kip = 1334.466 484 578 kN.
  CHECK(si("300 kip", Quantity::force) == exact(1334.46648457815));
  CHECK(si("300 kips", Quantity::force) == exact(1334.46648457815));
  // Source: NIST SP 811, App. B.8, pound-force = 4.448 221 615 260 5 E+00 N (exact).
  CHECK(si("1000 lbf", Quantity::force) == exact(4.4482216152605));
  CHECK(si("1000 lb", Quantity::force) == exact(4.4482216152605));

  SECTION("tonf is the US short ton-force of 2000 lbf") {
    // Source: NIST SP 811, App. B.8, ton-force (2000 lb) = 8.896 443 E+03 N:
    // 2.5 tonf = 5000 lbf = 22.241 108 kN.
    CHECK(si("2.5 tonf", Quantity::force) == exact(22.2411080763025));
    CHECK(si("2.5 tonf", Quantity::force) == Approx(22.241).epsilon(1e-4));
  }
  SECTION("tf is the metric tonne-force of 1000 kgf") {
    // Source: NIST SP 811, App. B.8, kilogram-force = 9.806 65 E+00 N (exact), so
    // 1 tf = 1000 kgf = 9.806 65 kN and 2.5 tf = 24.516 625 kN.
    CHECK(si("2.5 tf", Quantity::force) == exact(24.516625));
  }
  CHECK(si("1500 N", Quantity::force) == exact(1.5));
  CHECK(si("1.5 MN", Quantity::force) == exact(1500.0));
  CHECK(si("250 kN", Quantity::force) == exact(250.0));
}

TEST_CASE("units: moments in kip·ft with any joiner", "[units][published]") {
  // Source: NIST SP 811, App. B.8, pound-force foot = 1.355 818 E+00 N·m; exact value
  // 4.448 221 615 260 5 × 0.3048 = 1.355 817 948 331 4 N·m, so 1 kip·ft = 1.355 818 kN·m.
  const double kip_ft = kKipKN * kFootM;
  CHECK(kip_ft == Approx(1.355818).epsilon(1e-6));
  for (const char* text : {"100 kip·ft", "100 kip-ft", "100 kip*ft", "100 kip ft", "100 kip.ft"}) {
    INFO(text);
    CHECK(si(text, Quantity::moment) == exact(100.0 * kip_ft));
  }
  CHECK(si("250 kN·m", Quantity::moment) == exact(250.0));
  CHECK(si("250 kN-m", Quantity::moment) == exact(250.0));
  CHECK(si("250000 N·m", Quantity::moment) == exact(250.0));
}

TEST_CASE("units: unit weights in pcf and kN/m3 with any exponent spelling",
          "[units][published]") {
  // Source: NIST SP 811, App. B.9 (force divided by volume), pound-force per cubic foot =
  // 1.570 875 E+02 N/m³; exact value 4.448 221 615 260 5 / 0.3048³ = 157.087 463 8 N/m³,
  // so 120 pcf = 18.850 50 kN/m³.
  CHECK(si("120 pcf", Quantity::unit_weight) == exact(120.0 * kLbfKN / (kFootM * kFootM * kFootM)));
  CHECK(si("120 pcf", Quantity::unit_weight) == Approx(18.8505).epsilon(1e-5));
  CHECK(si("120 lb/ft3", Quantity::unit_weight) == Approx(18.8505).epsilon(1e-5));
  CHECK(si("120 lbf/ft^3", Quantity::unit_weight) == Approx(18.8505).epsilon(1e-5));
  // Source: NIST SP 811, App. B.9: kip per cubic foot = 1000 pcf = 157.087 5 kN/m³.
  CHECK(si("0.12 kcf", Quantity::unit_weight) == Approx(18.8505).epsilon(1e-5));
  for (const char* text : {"24 kN/m3", "24 kN/m^3", "24 kN/m³", "24 kN / m3"}) {
    INFO(text);
    CHECK(si(text, Quantity::unit_weight) == exact(24.0));
  }
}

TEST_CASE("units: pressures in ksf, psf, psi, ksi, tsf, Pa, kPa, MPa", "[units][published]") {
  // Source: NIST SP 811, App. B.8, kip per square inch (ksi) = 6.894 757 E+06 Pa and
  // pound-force per square inch (psi) = 6.894 757 E+03 Pa.
  CHECK(si("100 psi", Quantity::pressure) == Approx(689.4757).epsilon(1e-7));
  CHECK(si("1 ksi", Quantity::pressure) == Approx(6894.757).epsilon(1e-7));
  // Source: NIST SP 811, App. B.8, pound-force per square foot = 4.788 026 E+01 Pa, so
  // 1 ksf = 47.880 26 kPa.
  CHECK(si("2 ksf", Quantity::pressure) == Approx(95.76052).epsilon(1e-7));
  CHECK(si("2 ksf", Quantity::pressure) == exact(2.0 * kKipKN / (kFootM * kFootM)));
  CHECK(si("2000 psf", Quantity::pressure) == exact(2.0 * kKipKN / (kFootM * kFootM)));
  CHECK(si("2 kip/ft2", Quantity::pressure) == exact(2.0 * kKipKN / (kFootM * kFootM)));
  CHECK(si("100 lbf/in²", Quantity::pressure) == exact(100.0 * kLbfKN / (kInchM * kInchM)));
  // 1 tsf = 2000 psf = 95.760 52 kPa (short ton-force per square foot).
  CHECK(si("1 tsf", Quantity::pressure) == Approx(95.76052).epsilon(1e-7));
  CHECK(si("30 MPa", Quantity::pressure) == exact(30000.0));
  CHECK(si("30 GPa", Quantity::pressure) == exact(3.0e7));
  CHECK(si("150 kPa", Quantity::pressure) == exact(150.0));
  CHECK(si("150000 Pa", Quantity::pressure) == exact(150.0));
  CHECK(si("150 kN/m2", Quantity::pressure) == exact(150.0));
}

TEST_CASE("units: stiffnesses and small lengths", "[units][published]") {
  // Source: NIST SP 811, App. B exact definitions: 1 kip/in = 4.448 221 615 260 5 kN / 0.0254 m
  // = 175.126 835 kN/m.
  CHECK(si("10 kip/in", Quantity::stiffness) == exact(1751.26835246476));
  CHECK(si("2.0e5 kN/m", Quantity::stiffness) == exact(2.0e5));
  CHECK(si("200 MN/m", Quantity::stiffness) == exact(2.0e5));
  CHECK(si("1 in", Quantity::small_length) == exact(0.0254));
  CHECK(si("25 mm", Quantity::small_length) == exact(0.025));
  // A rotational stiffness may be written with its label, "/rad" being dimensionless.
  CHECK(si("5000 kN·m/rad", Quantity::rotational_stiffness) == exact(5000.0));
  CHECK(si("100 kip·ft/rad", Quantity::rotational_stiffness) == exact(100.0 * kKipKN * kFootM));
}

TEST_CASE("units: plain numbers are in the project's units", "[units][published]") {
  SECTION("SI: kN, m, kPa, kN/m³, kN/m, kN·m are SI already; small lengths in mm") {
    CHECK(si("13.716", Quantity::length) == exact(13.716));
    CHECK(si("-2400", Quantity::force) == exact(-2400.0));
    CHECK(si("180", Quantity::moment) == exact(180.0));
    CHECK(si("3.0e7", Quantity::pressure) == exact(3.0e7));
    CHECK(si("24", Quantity::unit_weight) == exact(24.0));
    CHECK(si("2.0e5", Quantity::stiffness) == exact(2.0e5));
    CHECK(si("25", Quantity::small_length) == exact(0.025));
    CHECK(si("90", Quantity::angle) == exact(90.0));
    CHECK(si("6", Quantity::number) == exact(6.0));
  }
  SECTION("US: kip, ft, ksf, pcf, kip/in, kip·ft; small lengths in in") {
    // Source: NIST SP 811, App. B exact definitions (see the head of this file).
    const UnitSystem us = UnitSystem::US;
    CHECK(si("45", Quantity::length, us) == exact(13.716));
    CHECK(si("300", Quantity::force, us) == exact(1334.46648457815));
    CHECK(si("100", Quantity::moment, us) == exact(100.0 * kKipKN * kFootM));
    CHECK(si("2", Quantity::pressure, us) == exact(2.0 * kKipKN / (kFootM * kFootM)));
    CHECK(si("120", Quantity::unit_weight, us) == Approx(18.8505).epsilon(1e-5));
    CHECK(si("10", Quantity::stiffness, us) == exact(1751.26835246476));
    CHECK(si("1", Quantity::small_length, us) == exact(0.0254));
    CHECK(si("90", Quantity::angle, us) == exact(90.0));
    CHECK(si("6", Quantity::number, us) == exact(6.0));
  }
  SECTION("a written unit overrides the project's units") {
    CHECK(si("4 m", Quantity::length, UnitSystem::US) == exact(4.0));
    CHECK(si("45 ft", Quantity::length, UnitSystem::SI) == exact(13.716));
  }
}

TEST_CASE("units: default unit labels and factors", "[units]") {
  CHECK(std::string(cairn::unit_label(UnitSystem::SI, Quantity::moment)) == "kN·m");
  CHECK(std::string(cairn::unit_label(UnitSystem::US, Quantity::moment)) == "kip·ft");
  CHECK(std::string(cairn::unit_label(UnitSystem::US, Quantity::pressure)) == "ksf");
  CHECK(std::string(cairn::unit_label(UnitSystem::US, Quantity::unit_weight)) == "pcf");
  CHECK(cairn::from_si(UnitSystem::US, Quantity::length, 13.716) == exact(45.0));
  CHECK(cairn::describe(Quantity::length, UnitSystem::US) == "a length in ft");
  CHECK(std::string(cairn::to_string(UnitSystem::US)) == "US");
}

TEST_CASE("units: angles in degrees", "[units]") {
  CHECK(si("90 deg", Quantity::angle) == exact(90.0));
  CHECK(si("90°", Quantity::angle) == exact(90.0));
  CHECK(error_of("1.2 rad", Quantity::angle) ==
        "expected an angle in degrees ('deg'), got unit 'rad'");
}

TEST_CASE("units: errors name what was expected and what was found", "[units]") {
  SECTION("not a number") {
    CHECK(error_of("abc", Quantity::length) == "expected a length in m, got 'abc'");
    CHECK(error_of("ft 45", Quantity::length, UnitSystem::US) ==
          "expected a length in ft, got 'ft 45'");
    CHECK(error_of("", Quantity::force) == "expected a force in kN, got nothing");
    CHECK(error_of("   ", Quantity::force) == "expected a force in kN, got nothing");
    CHECK(error_of("nan", Quantity::force) == "expected a force in kN, got 'nan'");
    CHECK(error_of("inf", Quantity::force) == "expected a force in kN, got 'inf'");
  }
  SECTION("unknown unit, including an ambiguous 'ton'") {
    const std::string known =
        "; known: N kN MN lb lbf kip tonf (US short ton, 2000 lbf) tf (metric tonne-force) mm "
        "cm m in ft Pa kPa MPa GPa psf ksf psi ksi tsf pcf kcf, joined with '·', '-', '*' or '/'";
    CHECK(error_of("45 furlong", Quantity::length) ==
          "unknown unit 'furlong' (did not understand 'furlong')" + known);
    CHECK(error_of("2.5 ton", Quantity::force) ==
          "unknown unit 'ton' (did not understand 'ton')" + known);
    CHECK(error_of("10 KN", Quantity::force) ==
          "unknown unit 'KN' (did not understand 'KN')" + known);
    CHECK(error_of("5 kN/m4", Quantity::unit_weight) ==
          "unknown unit 'kN/m4' (did not understand '4')" + known);
  }
  SECTION("a unit of the wrong kind") {
    CHECK(error_of("300 kip", Quantity::length) ==
          "expected a length in m, got a force unit 'kip'");
    CHECK(error_of("45 ft", Quantity::force, UnitSystem::US) ==
          "expected a force in kip, got a length unit 'ft'");
    CHECK(error_of("120 pcf", Quantity::pressure) ==
          "expected a pressure or modulus in kPa, got a unit weight unit 'pcf'");
    CHECK(error_of("2 ksf", Quantity::unit_weight, UnitSystem::US) ==
          "expected a unit weight in pcf, got a pressure unit 'ksf'");
    CHECK(error_of("100 kip·ft", Quantity::force) ==
          "expected a force in kN, got a moment unit 'kip·ft'");
    CHECK(error_of("10 kN/m", Quantity::moment) ==
          "expected a moment in kN·m, got a stiffness unit 'kN/m'");
    CHECK(error_of("6 m", Quantity::number) == "expected a plain number without a unit, got '6 m'");
    CHECK(error_of("5 m2", Quantity::length) == "expected a length in m, got an area unit 'm2'");
    CHECK(error_of("5 kN·m2", Quantity::moment) ==
          "expected a moment in kN·m, got an unrelated unit 'kN·m2'");
  }
}
