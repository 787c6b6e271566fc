// Building blocks shared by the renderers of a check: the tables, the group block, the
// header and notes. Private to
// src/output/; the public contract is include/cairn/output/report.hpp.
#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include "cairn/core/quantity_format.hpp"
#include "cairn/output/number_text.hpp"
#include "cairn/output/report.hpp"

namespace cairn::report_detail {

using nlohmann::json;

// Numbers in the project's units: QuantityFormat (core/quantity_format.hpp), the one
// formatter of every output.

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
bool any_fixed_head(const CheckReport& r);
double cap_reach(const Project& p);
double displacement_resolution(UnitSystem u);
std::string tilt_text(const Project& p, double tilt);
std::string mm_or_dash(const QuantityFormat& u, std::optional<double> v);
GroupParts make_group_parts(const CheckReport& r);
std::string group_block(const CheckReport& r, Format format);
json group_json(const CheckReport& r);
Table pile_types_table(const CheckReport& r);
Table piles_table(const CheckReport& r);
Table combinations_table(const CheckReport& r);
Table combination_table(const CheckReport& r, const CombinationCheck& cc);
std::string combination_note(const CheckReport& r, const CombinationCheck& cc);
Table envelope_table(const CheckReport& r);
// The cap's 6×6 stiffness about the origin in project units (rows Fx…Mz, columns ux…rz).
Table cap_stiffness_table(const CheckReport& r);
// The same matrix as numbers in project units, row by row.
std::array<std::array<double, 6>, 6> cap_stiffness_values(const CheckReport& r);
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
// A nonlinear run's parts (report_nonlinear.cpp): its piles per combination, the pushover,
// the block of both with the notes, and the JSON "analysis" member. Require r.nonlinear
// (the block is empty without it; the pushover table needs a pushover).
Table nonlinear_piles_table(const CheckReport& r);
Table pushover_table(const CheckReport& r);
std::string nonlinear_block(const CheckReport& r, Format format);
json nonlinear_json(const CheckReport& r);
// The CSV columns of a nonlinear run's pile values (report_nonlinear.cpp), in this order:
// largest moment along the pile and its depth (only where `with_moment`, i.e. the table does
// not have them yet), head deflection, p-multiplier. Headers in the project's units; cells
// of pile `pile` in `cc` ("-" for the values of an overturned combination). Nothing for a
// linear run.
std::vector<std::string> nonlinear_csv_headers(const CheckReport& r, bool with_moment);
std::vector<std::string> nonlinear_csv_cells(const CheckReport& r, const CombinationCheck& cc,
                                             std::size_t pile, bool with_moment);
// A combination's table (combination_table) with those columns inserted before
// "utilization", for the CSV outputs; unchanged for a linear run.
Table with_nonlinear_columns(const CheckReport& r, const CombinationCheck& cc, Table t);

}  // namespace cairn::report_detail
