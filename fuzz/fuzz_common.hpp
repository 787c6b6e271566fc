// fuzz_common.hpp — what the libFuzzer targets share: a private scratch folder for the
// input file, the run of one project through the whole check, and the test of its results.
//
// A finding is anything a user's file must never cause: a crash or sanitizer report (ASan,
// UBSan, found by the runtime), an exception other than InputError or a method refusing its
// data (std::invalid_argument, exit 2 "cannot compute"), or a NaN in the results. Timeouts
// and memory limits are libFuzzer's (-timeout, -rss_limit_mb; set by scripts/fuzz).
#pragma once

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <stdexcept>
#include <string>
#include <string_view>
#include <set>
#include <typeinfo>
#include <optional>

#include "cairn/app/analysis.hpp"
#include "cairn/core/diagnostics.hpp"
#include "cairn/output/report.hpp"

namespace cairn::fuzz {

// The process's scratch folder, made once and removed at exit.
inline const std::filesystem::path& scratch() {
  struct Folder {
    std::filesystem::path path;
    Folder() {
      std::string pattern =
          (std::filesystem::temp_directory_path() / "cairn-fuzz.XXXXXX").string();
      if (!::mkdtemp(pattern.data())) std::abort();
      path = pattern;
    }
    ~Folder() {
      std::error_code ignored;
      std::filesystem::remove_all(path, ignored);
    }
  };
  static const Folder folder;
  return folder.path;
}

inline void write_file(const std::filesystem::path& path, std::string_view bytes) {
  std::ofstream out(path, std::ios::binary | std::ios::trunc);
  out.write(bytes.data(), static_cast<std::streamsize>(bytes.size()));
  if (!out) std::abort();
}

[[noreturn]] inline void finding(const std::string& what) {
  std::fprintf(stderr, "cairn fuzz finding: %s\n", what.c_str());
  std::abort();
}

inline void check_number(double value, const char* what) {
  if (std::isnan(value)) finding(std::string("NaN in ") + what);
}

// Reads and checks the project at `path` as `cairn check` does, renders the text report,
// and looks for NaN in the numbers a reader sees.
inline void check_project(const std::filesystem::path& path) {
  try {
    const CheckRun run = analyse_project(path.string());
    for (const auto& combination : run.results.combinations) {
      for (const double v : combination.solution.movement.translation) check_number(v, "translation");
      for (const double v : combination.solution.movement.rotation) check_number(v, "rotation");
      for (const auto& pile : combination.piles) {
        check_number(pile.axial, "axial force");
        check_number(pile.lateral, "lateral force");
        check_number(pile.head_moment, "head moment");
        check_number(pile.utilization, "utilization");
      }
    }
    check_number(run.results.summary.max_utilization, "maximum utilization");
    const CheckReport report = make_check_report(run, "check --format text", std::nullopt);
    (void)render_check(report, Format::text);
  } catch (const InputError&) {
    // A located input problem: what bad input should give.
  } catch (const std::invalid_argument&) {
    // A method refused its data (exit 2, "cannot compute").
  }
}

}  // namespace cairn::fuzz
