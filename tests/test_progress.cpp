// The progress line of long runs (app/progress.hpp): shown only on a terminal, after the
// delay, rewritten in place and wiped at the end; nothing at all when stderr is a pipe or
// a file (common practice for command-line tools: progress is for a person watching).
#include <catch2/catch.hpp>

#include <chrono>
#include <sstream>
#include <string>
#include <thread>

#include "cairn/app/progress.hpp"

using namespace cairn;
using namespace std::chrono_literals;

TEST_CASE("progress: nothing is written when stderr is not a terminal", "[progress]") {
  std::ostringstream err;
  {
    Progress progress(err, "combinations", false, 0ms);
    progress.phase("reading cap.yaml");
    std::this_thread::sleep_for(300ms);
    progress.callback()(4000, 30000);
    std::this_thread::sleep_for(300ms);
    progress.clear();
  }
  CHECK(err.str().empty());
}

TEST_CASE("progress: on a terminal the phase, then the count, then the line wiped",
          "[progress]") {
  std::ostringstream err;
  {
    Progress progress(err, "combinations", true, 0ms);
    progress.phase("reading cap.yaml");
    std::this_thread::sleep_for(800ms);
    progress.callback()(4000, 30000);
    std::this_thread::sleep_for(800ms);
  }  // cleared when it goes
  const std::string text = err.str();
  const auto reading = text.find("\rcairn: reading cap.yaml");
  const auto count = text.find("\rcairn: 4000 of 30000 combinations checked");
  CHECK(reading != std::string::npos);
  CHECK(count != std::string::npos);
  CHECK(reading < count);
  CHECK(text.size() >= 4);
  CHECK(text.substr(text.size() - 4) == "\r\033[K");
}

TEST_CASE("progress: nothing before the delay", "[progress]") {
  std::ostringstream err;
  {
    Progress progress(err, "caps", true, 10s);
    progress.callback()(1, 500);
    std::this_thread::sleep_for(300ms);
  }
  CHECK(err.str().empty());
}
