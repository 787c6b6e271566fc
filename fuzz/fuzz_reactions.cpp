// libFuzzer target: the reactions CSV of `loads_from`. A fixed project (reactions-cap.yaml:
// two columns, supports 101 and 102, on three piles) takes its load cases D and W from the
// fuzzed CSV and runs as `cairn check` runs it. See fuzz_common.hpp.
#include "fuzz_common.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string_view bytes(reinterpret_cast<const char*>(data), size);
  static const auto project = [] {
    const auto path = cairn::fuzz::scratch() / "cap.yaml";
    std::filesystem::copy_file(CAIRN_FUZZ_DIR "/reactions-cap.yaml", path);
    return path;
  }();
  cairn::fuzz::write_file(cairn::fuzz::scratch() / "reactions.csv", bytes);
  cairn::fuzz::check_project(project);
  return 0;
}
