// Tests of quantity_format.hpp, the one formatter of every output: each quantity's unit label
// and decimals in SI and US projects, the conversion it applies, and the exact unit factors
// of units.hpp.
//
// Unit factors: NIST Special Publication 811 (2008 ed.), "Guide for the Use of the
// International System of Units", Appendix B: 1 ft = 0.3048 m (exact), 1 in = 0.0254 m
// (exact), 1 lbf = 4.448 221 615 260 5 N (exact: 0.453 592 37 kg × 9.806 65 m/s²),
// 1 kip = 1000 lbf, 1 ton-force (2000 lb) = 8.896 443 kN (B.8, 7 digits), 1 kilogram-force
// = 9.806 65 N (exact). Derived factors (tsf, pcf, ft²) are computed by hand from the exact
// definitions; the B.8 values quoted beside them are from memory.
// The precisions are cairn's own choice (docs/user-guide.md, "Units and precision").
#include <catch2/catch.hpp>

#include <cmath>
#include <limits>
#include <string>

#include "cairn/core/quantity_format.hpp"
#include "cairn/core/units.hpp"

using cairn::QuantityFormat;
using cairn::Shown;
using cairn::UnitSystem;
namespace unit_si = cairn::unit_si;

TEST_CASE("unit factors are the exact definitions of NIST SP 811", "[quantity_format][published]") {
  // NIST SP 811 (2008), Appendix B.8: foot = 3.048 E-01 m exactly.
  CHECK(unit_si::foot == 0.3048);
  // NIST SP 811 (2008), Appendix B.8: inch = 2.54 E-02 m exactly (1 ft = 12 in).
  CHECK(unit_si::inch == Approx(0.0254).epsilon(1e-15));
  // NIST SP 811 (2008), Appendix B.8: pound-force = 4.448 221 615 260 5 E+00 N exactly.
  CHECK(unit_si::pound_force == 4.4482216152605e-3);
  // NIST SP 811 (2008), Appendix B.8: kip (1 kip = 1000 lbf) = 4.448 222 E+03 N.
  CHECK(unit_si::kip == Approx(4.448222).epsilon(1e-7));
  // NIST SP 811 (2008), Appendix B.8: ton-force (2000 lbf) = 8.896 443 E+03 N.
  CHECK(unit_si::short_ton_force == Approx(8.896443).epsilon(1e-7));
  // NIST SP 811 (2008), Appendix B.8: kilogram-force = 9.806 65 N exactly; tonne-force 1000 kgf.
  CHECK(unit_si::tonne_force == 9.80665);
  // 1 tsf = 2000 lbf/ft² = 2000 × 4.448 221 615 260 5 N / 0.092 903 04 m² = 95.760 52 kPa
  // (hand-derived from the exact definitions; NIST SP 811 (2008), B.8 lists 1 lbf/ft² as
  // 47.880 26 Pa, from memory).
  CHECK(unit_si::ton_per_square_foot == Approx(95.76052).epsilon(1e-7));
}

TEST_CASE("each quantity's unit label in SI and US projects", "[quantity_format]") {
  const QuantityFormat si(UnitSystem::SI), us(UnitSystem::US);
  struct Row {
    Shown what;
    const char* si;
    const char* us;
  };
  // cairn's choice of display units (common practice in each system).
  const Row rows[] = {
      {Shown::force, "kN", "kip"},         {Shown::moment, "kN·m", "kip·ft"},
      {Shown::length, "m", "ft"},          {Shown::depth, "m", "ft"},
      {Shown::displacement, "mm", "in"},   {Shown::pressure, "kPa", "ksf"},
      {Shown::unit_weight, "kN/m³", "pcf"}, {Shown::subgrade, "kN/m³", "pcf"},
      {Shown::stiffness, "kN/m", "kip/in"}, {Shown::rotational_stiffness, "kN·m/rad", "kip·ft/rad"},
      {Shown::area, "m²", "ft²"},          {Shown::angle, "°", "°"},
      {Shown::utilization, "", ""},        {Shown::factor, "", ""},
      {Shown::code_factor, "", ""},
      {Shown::bearing_factor, "", ""},     {Shown::index, "", ""},
      {Shown::strain, "", ""},
  };
  for (const auto& row : rows) {
    CHECK(si.label(row.what) == row.si);
    CHECK(us.label(row.what) == row.us);
  }
}

TEST_CASE("each quantity's decimals in SI and US projects", "[quantity_format]") {
  const QuantityFormat si(UnitSystem::SI), us(UnitSystem::US);
  // Exact conversions (NIST SP 811, 2008, Appendix B): 1 kip = 4.4482216152605 kN,
  // 1 ft = 0.3048 m, 1 in = 25.4 mm, 1 ksf = 1000 lbf/ft².
  const double kip = unit_si::kip, ft = unit_si::foot, inch = unit_si::inch;
  const double ksf = kip / (ft * ft);
  CHECK(si.force(1234.56) == "1234.6");
  CHECK(us.force(1234.56 * kip) == "1234.56");
  CHECK(si.moment(-12.34) == "-12.3");
  CHECK(us.moment(-12.3456 * kip * ft) == "-12.35");
  CHECK(si.length(1.23456) == "1.235");
  CHECK(us.length(1.23456 * ft) == "1.23");
  CHECK(si.depth(12.345678) == "12.35");
  CHECK(us.depth(12.345678 * ft) == "12.3");
  CHECK(si.small(0.0123456) == "12.346");      // m → mm
  CHECK(us.small(0.123456 * inch) == "0.123");
  CHECK(si.pressure(95.76052) == "95.8");
  CHECK(us.pressure(2.0 * ksf) == "2.000");
  CHECK(si.number(Shown::unit_weight, 18.5) == "18.50");
  CHECK(si.number(Shown::subgrade, 21234.4) == "21234");
  CHECK(si.area(0.785398) == "0.7854");
  CHECK(us.area(ft * ft) == "1.0000");          // areas are the length unit squared
  CHECK(si.number(Shown::angle, 30.0) == "30.0");
  CHECK(si.text(Shown::angle, 30.0) == "30.0°");
  CHECK(si.text(Shown::force, 1200.0) == "1200.0 kN");
  CHECK(us.text(Shown::force, 300.0 * kip) == "300.00 kip");
  CHECK(QuantityFormat::factor(0.8) == "0.800");
  CHECK(QuantityFormat::code_factor(0.6) == "0.60");
  CHECK(QuantityFormat::bearing_factor(9.0) == "9.00");
  CHECK(QuantityFormat::index(123.456) == "123.5");
  CHECK(QuantityFormat::strain(0.0123456) == "0.01235");
  CHECK(si.decimals(Shown::force) == 1);
  CHECK(us.decimals(Shown::force) == 2);
  CHECK(si.decimals(Shown::length) == 3);
  CHECK(us.decimals(Shown::length) == 2);
}

TEST_CASE("stiffnesses print with significant digits, whole numbers from 10^4", "[quantity_format]") {
  const QuantityFormat si(UnitSystem::SI);
  CHECK(si.stiffness(123456.7) == "123457");
  CHECK(si.stiffness(1234.567) == "1235");
  CHECK(si.stiffness(12.34567) == "12.35");
  CHECK(si.number(Shown::rotational_stiffness, 98765.4) == "98765");
}

TEST_CASE("utilizations, zeros and round-off", "[quantity_format]") {
  const QuantityFormat si(UnitSystem::SI);
  CHECK(QuantityFormat::utilization(0.7344) == "0.734");
  CHECK(QuantityFormat::utilization(std::numeric_limits<double>::infinity()) == "no capacity");
  CHECK(si.number(Shown::utilization, 1.0) == "1.000");
  // A value that rounds to zero never prints a minus sign.
  CHECK(si.force(-0.01) == "0.0");
  CHECK(si.length(-1e-12) == "0.000");
  CHECK(si.small(-1e-9) == "0.000");
  // Round-off below 5e-7 of the unit is 0 in data outputs.
  CHECK(si.value(Shown::force, 4e-7) == 0.0);
  CHECK(si.value(Shown::force, 6e-7) == 6e-7);
}

TEST_CASE("values in the project's unit", "[quantity_format][published]") {
  const QuantityFormat us(UnitSystem::US);
  // 1 kN = 1/4.4482216152605 kip = 0.224 809 kip (NIST SP 811 (2008), B.8, exact lbf).
  CHECK(us.value(Shown::force, 1.0) == Approx(1.0 / 4.4482216152605).epsilon(1e-12));
  // 1 m = 1/0.3048 ft = 3.280 840 ft (NIST SP 811 (2008), B.8, exact foot).
  CHECK(us.value(Shown::length, 1.0) == Approx(3.280839895).epsilon(1e-9));
  // 1 kN/m³ = 1000/157.087 464 pcf = 6.365 88 pcf (hand-derived: 1 lbf/ft³ =
  // 4.448 221 615 260 5 N / 0.3048³ m³ = 157.087 464 N/m³, exact definitions of NIST SP 811).
  CHECK(us.value(Shown::unit_weight, 1.0) ==
        Approx(0.3048 * 0.3048 * 0.3048 / 4.4482216152605e-3).epsilon(1e-12));
  // 1 m² = 10.763 91 ft² (hand-derived: 1 ft² = 0.3048² m² = 0.092 903 04 m² exactly).
  CHECK(us.value(Shown::area, 1.0) == Approx(1.0 / 0.09290304).epsilon(1e-12));
}
