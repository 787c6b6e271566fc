#include "cairn/core/diagnostics.hpp"

#include <algorithm>
#include <numeric>

namespace cairn {
namespace {

std::string join_lines(const std::vector<Diagnostic>& list) {
  std::string text;
  for (const auto& d : list) {
    if (!text.empty()) text += '\n';
    text += d.format();
  }
  return text;
}

std::size_t edit_distance(const std::string& a, const std::string& b) {
  std::vector<std::size_t> row(b.size() + 1);
  std::iota(row.begin(), row.end(), 0);
  for (std::size_t i = 1; i <= a.size(); ++i) {
    std::size_t diagonal = row[0];
    row[0] = i;
    for (std::size_t j = 1; j <= b.size(); ++j) {
      const std::size_t above = row[j];
      row[j] = std::min({row[j] + 1, row[j - 1] + 1, diagonal + (a[i - 1] == b[j - 1] ? 0 : 1)});
      diagonal = above;
    }
  }
  return row[b.size()];
}

std::string located(const SourceLocation& where) {
  std::string text = where.file.empty() ? std::string("<input>") : where.file;
  if (where.line > 0) text += ":" + std::to_string(where.line);
  if (where.column > 0) text += ":" + std::to_string(where.column);
  return text;
}

}  // namespace

std::string Diagnostic::format() const { return located(where) + ": error: " + message; }

std::string format_warning(const Warning& warning) {
  return located(warning.where) + ": warning: " + warning.message;
}

std::string warning_note(const Warning& warning) {
  return "Warning: " + warning.message + " (" + located(warning.where) + ")";
}

InputError::InputError(std::vector<Diagnostic> diagnostics)
    : std::runtime_error(join_lines(diagnostics)), diagnostics_(std::move(diagnostics)) {}

InputError::InputError(SourceLocation where, std::string message)
    : InputError(std::vector<Diagnostic>{{std::move(where), std::move(message)}}) {}

void Diagnostics::error(const SourceLocation& where, std::string message) {
  list_.push_back({where, std::move(message)});
}

void Diagnostics::raise_if_any() const {
  if (!list_.empty()) throw InputError(list_);
}

std::string closest_match(const std::string& word, const std::vector<std::string>& candidates) {
  std::string best;
  std::size_t best_distance = 3;
  for (const auto& c : candidates) {
    const std::size_t d = edit_distance(word, c);
    // A suggestion must share at least half of the longer name: 'W' is not a typo of 'D',
    // but 'LL' may be one of 'L' and 'PC54' of 'PC45'.
    if (2 * d > std::max(word.size(), c.size())) continue;
    if (d < best_distance) {
      best_distance = d;
      best = c;
    }
  }
  return best;
}

}  // namespace cairn
