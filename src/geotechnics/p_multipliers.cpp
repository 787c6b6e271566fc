#include "cairn/geotechnics/p_multipliers.hpp"

#include <algorithm>
#include <cmath>
#include <cstddef>
#include <limits>
#include <numbers>
#include <numeric>
#include <stdexcept>

namespace cairn {
namespace {

// AASHTO LRFD Table 10.7.2.4-1 (from memory): P_m at 3B and at 5B, rows 1, 2, 3+.
constexpr std::array<double, 3> kAt3B{0.80, 0.40, 0.30};
constexpr std::array<double, 3> kAt5B{1.00, 0.85, 0.70};

}  // namespace

double p_multiplier_row(int row, double s) {
  if (row < 1) throw std::invalid_argument("p-multiplier: the row must be 1 or more");
  if (!(s > 0.0) || !std::isfinite(s))
    throw std::invalid_argument("p-multiplier: the spacing must be a positive number of widths");
  const std::size_t i = static_cast<std::size_t>(std::min(row, 3) - 1);
  // Below 3B: the 3B values held. Beyond 5B: the table's straight line continued up to 1.
  const double t = (std::max(s, kPMultiplierSmallestSpacing) - kPMultiplierSmallestSpacing) /
                   (kPMultiplierLargestSpacing - kPMultiplierSmallestSpacing);
  return std::min(1.0, kAt3B[i] + (kAt5B[i] - kAt3B[i]) * t);
}

bool p_multiplier_in_table(double s) { return s >= kPMultiplierSmallestSpacing; }

std::vector<PMultiplierRow> p_multiplier_rows(const std::vector<std::array<double, 2>>& heads,
                                              double width, double direction) {
  if (!(width > 0.0) || !std::isfinite(width))
    throw std::invalid_argument("p-multipliers: the pile width must be positive");
  if (!std::isfinite(direction))
    throw std::invalid_argument("p-multipliers: the load direction must be a finite angle");
  const double dx = std::cos(direction), dy = std::sin(direction);
  const std::size_t n = heads.size();
  std::vector<double> along(n);
  for (std::size_t i = 0; i < n; ++i) {
    if (!std::isfinite(heads[i][0]) || !std::isfinite(heads[i][1]))
      throw std::invalid_argument("p-multipliers: pile positions must be finite");
    along[i] = heads[i][0] * dx + heads[i][1] * dy;
  }
  // Foremost first: the leading side is the one the load pushes toward.
  std::vector<std::size_t> order(n);
  std::iota(order.begin(), order.end(), std::size_t{0});
  std::stable_sort(order.begin(), order.end(),
                   [&](std::size_t a, std::size_t b) { return along[a] > along[b]; });
  // Rows: a pile within half a width of its row's foremost pile belongs to that row (measured
  // from the foremost pile, not the previous one, so a row cannot creep backward pile by pile).
  std::vector<int> row_of(n, 0);
  std::vector<double> row_sum, row_count;
  double row_front = 0.0;
  const double tolerance = 0.5 * width;
  for (std::size_t k = 0; k < n; ++k) {
    const std::size_t i = order[k];
    if (k == 0 || row_front - along[i] > tolerance) {
      row_front = along[i];
      row_sum.push_back(0.0);
      row_count.push_back(0.0);
    }
    row_of[i] = static_cast<int>(row_sum.size());
    row_sum.back() += along[i];
    row_count.back() += 1.0;
  }
  const std::size_t rows = row_sum.size();
  std::vector<double> spacing(rows, 0.0);
  for (std::size_t r = 0; r + 1 < rows; ++r) {
    const double gap = (row_sum[r] / row_count[r] - row_sum[r + 1] / row_count[r + 1]) / width;
    spacing[r + 1] = gap;       // a trailing row: the row ahead of it
    if (r == 0) spacing[0] = gap;  // the leading row: the row behind it
  }
  std::vector<PMultiplierRow> out(n);
  for (std::size_t i = 0; i < n; ++i) {
    const int r = row_of[i];
    out[i].row = r;
    out[i].spacing_over_width = rows > 1 ? spacing[static_cast<std::size_t>(r - 1)] : 0.0;
    out[i].multiplier = rows > 1 ? p_multiplier_row(r, out[i].spacing_over_width) : 1.0;
  }
  return out;
}

namespace {

// The number of rows across `direction` (the row rule of p_multiplier_rows).
std::size_t row_count(const std::vector<std::array<double, 2>>& heads, double width,
                      double direction) {
  std::size_t rows = 0;
  for (const PMultiplierRow& r : p_multiplier_rows(heads, width, direction))
    rows = std::max(rows, static_cast<std::size_t>(r.row));
  return rows;
}

// Each pile's multiplier for loads along `direction` (`reversing`: the smaller of it and the
// opposite direction).
std::vector<double> along_axis(const std::vector<std::array<double, 2>>& heads, double width,
                               double direction, bool reversing) {
  const auto ahead = p_multiplier_rows(heads, width, direction);
  std::vector<double> out(heads.size());
  for (std::size_t i = 0; i < heads.size(); ++i) out[i] = ahead[i].multiplier;
  if (reversing) {
    const auto back = p_multiplier_rows(heads, width, direction + std::numbers::pi);
    for (std::size_t i = 0; i < heads.size(); ++i) out[i] = std::min(out[i], back[i].multiplier);
  }
  return out;
}

}  // namespace

double p_multiplier_axis(const std::vector<std::array<double, 2>>& heads, double width) {
  if (!(width > 0.0) || !std::isfinite(width))
    throw std::invalid_argument("p-multipliers: the pile width must be positive");
  const std::size_t n = heads.size();
  for (const auto& h : heads)
    if (!std::isfinite(h[0]) || !std::isfinite(h[1]))
      throw std::invalid_argument("p-multipliers: pile positions must be finite");
  if (n < 2) return 0.0;
  constexpr double quarter = std::numbers::pi / 2.0;
  // Candidates: the cap's x axis, and the directions to each pile's nearest neighbours (those
  // within 1 % of the nearest distance), folded into [0, 90°).
  std::vector<double> candidates{0.0};
  for (std::size_t i = 0; i < n; ++i) {
    double nearest = std::numeric_limits<double>::infinity();
    for (std::size_t j = 0; j < n; ++j)
      if (j != i)
        nearest = std::min(nearest, std::hypot(heads[j][0] - heads[i][0], heads[j][1] - heads[i][1]));
    if (!(nearest > 0.0)) continue;  // two piles at one point: no direction between them
    for (std::size_t j = 0; j < n; ++j) {
      const double dx = heads[j][0] - heads[i][0], dy = heads[j][1] - heads[i][1];
      if (j == i || std::hypot(dx, dy) > 1.01 * nearest) continue;
      double a = std::fmod(std::atan2(dy, dx), quarter);
      if (a < 0.0) a += quarter;
      // Within 1e-9 rad of the cap's axes is on them (rounding of the positions).
      if (a < 1e-9 || quarter - a < 1e-9) a = 0.0;
      candidates.push_back(a);
    }
  }
  std::sort(candidates.begin(), candidates.end());
  candidates.erase(std::unique(candidates.begin(), candidates.end(),
                               [](double a, double b) { return b - a < 1e-9; }),
                   candidates.end());
  // Fewest rows along the pair; ties to the direction nearest the cap's axes, then the smaller.
  double best = 0.0;
  std::size_t best_rows = std::numeric_limits<std::size_t>::max();
  double best_off = 0.0;
  for (const double a : candidates) {
    const std::size_t rows = row_count(heads, width, a) + row_count(heads, width, a + quarter);
    const double off = std::min(a, quarter - a);
    if (rows < best_rows || (rows == best_rows && off < best_off)) {
      best = a;
      best_rows = rows;
      best_off = off;
    }
  }
  return best;
}

std::vector<double> p_multipliers(const std::vector<std::array<double, 2>>& heads, double width,
                                  double direction, double axis, bool reversing) {
  if (!std::isfinite(direction) || !std::isfinite(axis))
    throw std::invalid_argument("p-multipliers: the load direction must be a finite angle");
  const double psi = direction - axis;
  const double c = std::cos(psi), s = std::sin(psi);
  const double first = c >= 0.0 ? axis : axis + std::numbers::pi;
  const double second = s >= 0.0 ? axis + std::numbers::pi / 2.0 : axis - std::numbers::pi / 2.0;
  // Along an axis the other's weight is zero or below rounding (cos 90° ≈ 6e-17): the
  // table's value, not a blend.
  const double wa = c * c, wb = s * s;
  std::vector<double> out = along_axis(heads, width, first, reversing);
  if (wb < 1e-15) return out;
  const std::vector<double> b = along_axis(heads, width, second, reversing);
  if (wa < 1e-15) return b;
  for (std::size_t i = 0; i < out.size(); ++i) out[i] = wa * out[i] + wb * b[i];
  return out;
}

std::vector<double> p_multipliers(const std::vector<std::array<double, 2>>& heads, double width,
                                  double direction, bool reversing) {
  return p_multipliers(heads, width, direction, p_multiplier_axis(heads, width), reversing);
}

}  // namespace cairn
