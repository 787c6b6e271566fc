// libFuzzer target: a project file (YAML) through read → compute → check → render, as
// `cairn check FILE` runs it. See fuzz_common.hpp for what counts as a finding.
#include "fuzz_common.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string_view bytes(reinterpret_cast<const char*>(data), size);
  const auto path = cairn::fuzz::scratch() / "cap.yaml";
  cairn::fuzz::write_file(path, bytes);
  cairn::fuzz::check_project(path);
  return 0;
}
