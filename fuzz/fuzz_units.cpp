// libFuzzer target: numbers written with a unit ("45 ft", "2.5 tonf/m2"), as parse_quantity
// reads every value of a project file. A finding: a crash or sanitizer report, an exception
// (the parser returns its errors), or what units_finding.hpp names.
#include <cstdint>

#include "fuzz_common.hpp"
#include "units_finding.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string_view bytes(reinterpret_cast<const char*>(data), size);
  if (const auto what = cairn::fuzz::units_finding(bytes)) cairn::fuzz::finding(*what);
  return 0;
}
