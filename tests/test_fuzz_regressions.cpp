// Replays the unit-parser inputs the fuzz target found (tests/data/fuzz-regressions/fuzz_units),
// with the fuzz target's own test of the answer. Project and reactions findings are replayed
// by tests/end_to_end.sh, each in its own process, so that a crash fails one check only.
#include <catch2/catch.hpp>

#include <filesystem>
#include <fstream>
#include <sstream>

#include "../fuzz/units_finding.hpp"

TEST_CASE("fuzz regressions: unit texts the fuzzer found", "[fuzz_regressions]") {
  const std::filesystem::path folder = CAIRN_TEST_DATA "/fuzz-regressions/fuzz_units";
  if (!std::filesystem::exists(folder)) return;
  for (const auto& entry : std::filesystem::directory_iterator(folder)) {
    std::ifstream in(entry.path(), std::ios::binary);
    std::ostringstream bytes;
    bytes << in.rdbuf();
    INFO(entry.path().filename().string());
    CHECK(cairn::fuzz::units_finding(bytes.str()) == std::nullopt);
  }
}
