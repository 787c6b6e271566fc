// progress.hpp — a line of progress on stderr for long runs: "cairn: reading cap.yaml",
// "cairn: 4000 of 30000 combinations checked", "cairn: writing out/", rewritten in place
// about five times a second by a thread of its own, once the run has taken more than a
// second, and only when stderr is a terminal: a pipe or a file never receives it.
#pragma once

#include <atomic>
#include <chrono>
#include <condition_variable>
#include <cstddef>
#include <functional>
#include <mutex>
#include <ostream>
#include <string>
#include <thread>

namespace cairn {

class Progress {
 public:
  // `what` names the things counted ("caps", "combinations"). Shown on stderr only when it
  // is a terminal.
  Progress(std::ostream& err, std::string what);
  // The same with `terminal` given (for the tests) and the delay before anything is shown.
  Progress(std::ostream& err, std::string what, bool terminal,
           std::chrono::milliseconds delay = std::chrono::seconds(1));
  ~Progress();
  Progress(const Progress&) = delete;
  Progress& operator=(const Progress&) = delete;

  // What the run is doing before it counts ("reading cap.yaml").
  void phase(std::string text);
  // Called with the number done and the total: "done of total <what> checked".
  std::function<void(std::size_t, std::size_t)> callback();
  // Stops, and wipes the line if one was shown. Call before writing anything else to stderr
  // or to the same terminal.
  void clear();

 private:
  void run();

  std::ostream& err_;
  std::string what_;
  const std::chrono::milliseconds delay_;
  const std::chrono::steady_clock::time_point start_ = std::chrono::steady_clock::now();
  std::mutex lock_;
  std::condition_variable wake_;
  bool stop_ = false;
  std::string text_;
  std::atomic<std::size_t> done_{0}, total_{0};
  std::atomic<bool> counting_{false};
  bool shown_ = false;
  std::thread ticker_;
};

}  // namespace cairn
