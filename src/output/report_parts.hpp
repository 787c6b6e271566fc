// Building blocks shared by the renderers of a check: the tables, the group block, the
// header and notes, and the formatting of numbers in the project's units. Private to
// src/output/; the public contract is include/cairn/output/report.hpp.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include "cairn/output/number_text.hpp"
#include "cairn/output/report.hpp"

namespace cairn::report_detail {

using nlohmann::json;

// Numbers in the project's units with a precision that suits each quantity.
class Units {
 public:
  explicit Units(UnitSystem system) : u_(system) {}
  std::string label(Quantity q) const { return unit_label(u_, q); }
  // The value in the project's unit; a negative zero (or a round-off below the printed
  // precision) prints as 0.
  double value(Quantity q, double si) const {
    const double v = from_si(u_, q, si);
    return std::abs(v) < 5e-7 ? 0.0 : v;
  }
  std::string force(double si) const { return fixed(value(Quantity::force, si), digits(Quantity::force)); }
  std::string length(double si) const { return fixed(value(Quantity::length, si), digits(Quantity::length)); }
  std::string moment(double si) const { return fixed(value(Quantity::moment, si), digits(Quantity::moment)); }
  std::string small(double si) const { return fixed(value(Quantity::small_length, si), 3); }
  // Fixed decimals without a minus sign on a value that rounds to zero.
  static std::string fixed(double v, int decimals) { return fixed_text(v, decimals); }
  std::string stiffness(double si) const {
    const double v = value(Quantity::stiffness, si);
    return std::abs(v) >= 1e4 ? fmt::format("{:.0f}", v) : fmt::format("{:.4g}", v);
  }
  std::string area(double si) const {
    const double f = to_si_factor(u_, Quantity::length);
    return fixed_text(si / (f * f), 4);
  }
  std::string area_label() const { return label(Quantity::length) + "²"; }
  UnitSystem system() const { return u_; }

 private:
  int digits(Quantity q) const {
    if (q == Quantity::length) return u_ == UnitSystem::SI ? 3 : 2;
    return u_ == UnitSystem::SI ? 1 : 2;
  }
  UnitSystem u_;
};

std::size_t width(const std::string& s);
std::string pad(const std::string& s, std::size_t w, bool right);
std::string csv_cell(const std::string& s);
std::string utilization_text(double u);
const char* result_text(const PileCheck& p);
std::string overturned_ids(const CheckReport& r);
const std::string& combo_id(const CheckReport& r, std::optional<std::size_t> c);
json number_or_null(double v);
double axial_stiffness(const CheckReport& r, std::size_t type);
double lateral_stiffness(const CheckReport& r, std::size_t type);
double head_moment(const CheckReport& r, std::size_t pile, double lateral);
bool any_fixed_head(const CheckReport& r);
double cap_reach(const Project& p);
double displacement_resolution(UnitSystem u);
std::string tilt_text(const Project& p, double tilt);
std::string mm_or_dash(const Units& u, std::optional<double> v);
GroupParts make_group_parts(const CheckReport& r);
std::string group_block(const CheckReport& r, Format format);
json group_json(const CheckReport& r);
Table pile_types_table(const CheckReport& r);
Table piles_table(const CheckReport& r);
Table combinations_table(const CheckReport& r);
Table combination_table(const CheckReport& r, const CombinationCheck& cc);
std::string combination_note(const CheckReport& r, const CombinationCheck& cc);
Table envelope_table(const CheckReport& r);
std::vector<std::string> failure_reasons(const CheckReport& r);
std::string joined(const std::vector<std::string>& items, const char* separator);
Table summary_table(const CheckReport& r);
std::string header(const CheckReport& r, Format format);
// render_check below full detail (report_detail.cpp).
std::string render_check_brief(const CheckReport& r, Format format);
// The JSON document of check_json() written as a stream (report_json.cpp).
void write_check_json(const CheckReport& r, std::ostream& out);
std::string assumptions_block(const CheckReport& r, Format format);
std::string explain_block(const CheckReport& r, Format format);

}  // namespace cairn::report_detail
