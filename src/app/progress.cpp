#include "cairn/app/progress.hpp"

#include <unistd.h>

#include <utility>

namespace cairn {

Progress::Progress(std::ostream& err, std::string what)
    : Progress(err, std::move(what), isatty(STDERR_FILENO) != 0) {}

Progress::Progress(std::ostream& err, std::string what, bool terminal,
                   std::chrono::milliseconds delay)
    : err_(err), what_(std::move(what)), delay_(delay) {
  if (terminal) ticker_ = std::thread([this] { run(); });
}

Progress::~Progress() { clear(); }

void Progress::phase(std::string text) {
  const std::lock_guard<std::mutex> hold(lock_);
  text_ = std::move(text);
  counting_ = false;
}

std::function<void(std::size_t, std::size_t)> Progress::callback() {
  return [this](std::size_t done, std::size_t total) {
    done_ = done;
    total_ = total;
    counting_ = true;
  };
}

void Progress::run() {
  std::unique_lock<std::mutex> hold(lock_);
  std::string last;
  while (!wake_.wait_for(hold, std::chrono::milliseconds(200), [this] { return stop_; })) {
    if (std::chrono::steady_clock::now() - start_ < delay_) continue;
    const std::string line =
        counting_ ? "cairn: " + std::to_string(done_.load()) + " of " +
                        std::to_string(total_.load()) + " " + what_ + " checked"
        : text_.empty() ? std::string()
                        : "cairn: " + text_;
    if (line.empty() || line == last) continue;
    err_ << "\r" << line << "\033[K" << std::flush;
    last = line;
    shown_ = true;
  }
}

void Progress::clear() {
  if (!ticker_.joinable()) return;
  {
    const std::lock_guard<std::mutex> hold(lock_);
    stop_ = true;
  }
  wake_.notify_all();
  ticker_.join();
  if (shown_) err_ << "\r\033[K" << std::flush;
  shown_ = false;
}

}  // namespace cairn
