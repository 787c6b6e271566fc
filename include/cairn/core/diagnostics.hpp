// diagnostics.hpp — problems in the user's input, located in their file.
//
// Input problems are collected while a project file is read (every problem in one run),
// then raised together as one InputError. The format is the one compilers use, location
// first, 1-based:
//   project.yaml:14:9: error: piles[3].x: expected a length in m, got 'abc'
// Our own bugs are not diagnostics: they are assertions or std::logic_error.
#pragma once

#include <stdexcept>
#include <string>
#include <vector>

#include "cairn/core/model.hpp"

namespace cairn {

// A problem with a whole file or with the command line rather than with a place in a file
// (a file that cannot be opened, an option): no line and column, written "file: error: …"
// (or "<input>: error: …" without a file). A location is never written "file:0:0".
inline SourceLocation whole_file(const std::string& file) { return {file, 0, 0}; }

struct Diagnostic {
  SourceLocation where;
  std::string message;  // "<key path>: <what was expected>, got '<what was found>'"
  std::string format() const;  // "file:line:col: error: message"
};

// One or more problems with the input; the command exits with status 2.
class InputError : public std::runtime_error {
 public:
  explicit InputError(std::vector<Diagnostic> diagnostics);
  InputError(SourceLocation where, std::string message);
  const std::vector<Diagnostic>& diagnostics() const { return diagnostics_; }

 private:
  std::vector<Diagnostic> diagnostics_;
};

// Collects diagnostics while input is read.
class Diagnostics {
 public:
  void error(const SourceLocation& where, std::string message);
  bool empty() const { return list_.empty(); }
  // Throws InputError when anything was collected.
  void raise_if_any() const;
  const std::vector<Diagnostic>& list() const { return list_; }

 private:
  std::vector<Diagnostic> list_;
};

// A warning as the terminal shows it: "file:line:col: warning: message".
std::string format_warning(const Warning& warning);

// A warning as the notes of a report show it: "Warning: message (file:line:col)".
std::string warning_note(const Warning& warning);

// The closest of `candidates` to `word` (edit distance ≤ 2), or "" when none is close.
std::string closest_match(const std::string& word, const std::vector<std::string>& candidates);

}  // namespace cairn
