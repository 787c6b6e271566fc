#include "report_parts.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <set>
#include <sstream>
#include <stdexcept>

namespace cairn {

using namespace report_detail;

std::string render_group(const CheckReport& report, Format format) {
  return report.group ? group_block(report, format) : std::string();
}

GroupParts group_parts(const CheckReport& report) {
  return report.group ? make_group_parts(report) : GroupParts{};
}

std::string render_table(const Table& table, Format format) {
  std::string out;
  switch (format) {
    case Format::csv: {
      auto line = [](const std::vector<std::string>& cells) {
        std::string s;
        for (std::size_t i = 0; i < cells.size(); ++i) s += (i ? "," : "") + csv_cell(cells[i]);
        return s + "\n";
      };
      out += line(table.headers);
      for (const auto& row : table.rows) out += line(row);
      return out;
    }
    case Format::markdown: {
      if (!table.title.empty()) out += "## " + table.title + "\n\n";
      auto line = [](const std::vector<std::string>& cells) {
        std::string s = "|";
        for (const auto& c : cells) s += " " + c + " |";
        return s + "\n";
      };
      out += line(table.headers);
      std::string rule = "|";
      for (std::size_t i = 0; i < table.headers.size(); ++i)
        rule += (i < table.numeric.size() && table.numeric[i]) ? " ---: |" : " --- |";
      out += rule + "\n";
      for (const auto& row : table.rows) out += line(row);
      return out + "\n";
    }
    case Format::text:
    case Format::json: {
      std::vector<std::size_t> w(table.headers.size());
      for (std::size_t i = 0; i < w.size(); ++i) w[i] = width(table.headers[i]);
      for (const auto& row : table.rows)
        for (std::size_t i = 0; i < row.size() && i < w.size(); ++i) w[i] = std::max(w[i], width(row[i]));
      if (!table.title.empty()) out += table.title + "\n";
      auto line = [&](const std::vector<std::string>& cells) {
        std::string s = " ";
        for (std::size_t i = 0; i < cells.size(); ++i) {
          const bool right = i < table.numeric.size() && table.numeric[i];
          s += " " + pad(cells[i], w[i], right);
        }
        while (!s.empty() && s.back() == ' ') s.pop_back();
        return s + "\n";
      };
      out += line(table.headers);
      std::size_t total = 1;
      for (auto x : w) total += x + 1;
      out += "  " + std::string(total - 2, '-') + "\n";
      for (const auto& row : table.rows) out += line(row);
      return out + "\n";
    }
  }
  return out;
}

std::string combination_formula(const Project& project, const Combination& combination) {
  std::string text;
  for (const auto& [index, factor] : combination.factors) {
    if (!text.empty()) text += factor < 0 ? " − " : " + ";
    else if (factor < 0) text += "−";
    const double f = std::abs(factor);
    text += f == std::round(f) ? fmt::format("{:.1f}·{}", f, project.load_cases[index].id)
                               : fmt::format("{:g}·{}", f, project.load_cases[index].id);
  }
  return text;
}

std::string summary_line(const CheckReport& r) {
  const Project& p = *r.project;
  const CheckSummary& s = r.results->summary;
  const std::string where =
      fmt::format("pile {}, combination {}, {}", s.pile ? p.piles[*s.pile].id : "-",
                  combo_id(r, s.combination), to_string(s.check));
  if (s.pass)
    return fmt::format("PASS: {} in {}; max utilization {} ({})",
                       count_text(p.piles.size(), "pile"),
                       count_text(p.combinations.size(), "combination"),
                       utilization_text(s.max_utilization), where);
  const std::string overturned = overturned_ids(r);
  const bool group_fails = r.group && !r.group->pass;
  const std::string utilization =
      s.combination ? fmt::format("; max utilization {} ({})", utilization_text(s.max_utilization), where)
                    : std::string();
  // "1 of 3 combinations fails", "2 of 3 combinations fail".
  return fmt::format("FAIL: {} of {} {}{}{}{}", s.failed_combinations,
                     count_text(p.combinations.size(), "combination"),
                     s.failed_combinations == 1 ? "fails" : "fail",
                     overturned.empty() ? ""
                     : r.nonlinear      ? "; no equilibrium (a mechanism) in " + overturned
                                        : "; the cap overturns in " + overturned,
                     utilization,
                     group_fails ? "; group checks fail (see Group checks)" : "");
}
void write_check(const CheckReport& r, Format format, std::ostream& out) {
  if (format == Format::json) return write_check_json(r, out);
  if (r.detail != Detail::full) {
    out << render_check_brief(r, format);
    return;
  }
  if (!r.results->pile_rows)
    throw std::logic_error("render_check: full detail of a run that kept no pile rows");
  if (format == Format::csv) {
    // One CSV stream: sections separated by a blank line, each headed by a comment line.
    out << "# summary\n" << render_table(summary_table(r), Format::csv) << "\n";
    out << "# envelope\n" << render_table(envelope_table(r), Format::csv);
    for (const auto& cc : r.results->combinations) {
      Table t = with_nonlinear_columns(r, cc, combination_table(r, cc));
      out << "\n# " << t.title << "\n";
      t.title.clear();
      out << render_table(t, Format::csv);
    }
    out << "\n";
    for (const auto& a : r.assumptions) out << "# assumption: " << a << "\n";
    out << "# " << kCaution << "\n";
    return;
  }
  out << header(r, format);
  out << render_table(pile_types_table(r), format);
  out << render_table(piles_table(r), format);
  out << render_table(combinations_table(r), format);
  for (const auto& cc : r.results->combinations) {
    std::string table = render_table(combination_table(r, cc), format);
    // Markdown: the note is its own paragraph after the table's blank line, or a renderer
    // would take it for one more table row.
    if (format == Format::markdown)
      table += combination_note(r, cc) + "\n\n";
    else
      table.insert(table.size() - 1, "  " + combination_note(r, cc) + "\n");
    out << table;
  }
  out << render_table(envelope_table(r), format);
  if (r.cap_stiffness) out << render_table(cap_stiffness_table(r), format);
  if (r.group) out << group_block(r, format);
  if (r.explain_pile) out << explain_block(r, format);
  out << nonlinear_block(r, format);
  out << assumptions_block(r, format);
  const std::string line = summary_line(r);
  out << (format == Format::markdown ? "**" + line + "**\n\n" : line + "\n\n");
  out << (format == Format::markdown ? std::string("_") + kCaution + "_\n" : kCaution + std::string("\n"));
}

std::string render_check(const CheckReport& r, Format format) {
  std::ostringstream out;
  write_check(r, format, out);
  return std::move(out).str();
}

namespace {

// summary.csv and, by detail, envelope.csv or governing.csv.
std::vector<std::pair<std::string, std::string>> check_files_small(const CheckReport& r) {
  std::vector<std::pair<std::string, std::string>> files;
  std::string trailer;
  for (const auto& a : r.assumptions) trailer += "# assumption: " + a + "\n";
  trailer += std::string("# ") + kCaution + "\n";
  Table summary = summary_table(r);
  summary.title.clear();
  files.emplace_back("summary.csv", render_table(summary, Format::csv) + trailer);
  if (r.detail == Detail::full || r.detail == Detail::envelope) {
    Table envelope = envelope_table(r);
    envelope.title.clear();
    files.emplace_back("envelope.csv", render_table(envelope, Format::csv) + trailer);
  }
  if (r.detail == Detail::governing) {
    Table governing = governing_table(r);
    governing.title.clear();
    files.emplace_back("governing.csv", render_table(governing, Format::csv) + trailer);
  }
  return files;
}

}  // namespace

std::vector<std::pair<std::string, std::string>> check_files(const CheckReport& r) {
  std::vector<std::pair<std::string, std::string>> files;
  files.emplace_back("report.txt", render_check(r, Format::text));
  files.emplace_back("report.md", render_check(r, Format::markdown));
  files.emplace_back("results.json", render_check(r, Format::json));
  for (auto& file : check_files_small(r)) files.push_back(std::move(file));
  // One long table of every combination and pile, instead of a file per combination.
  if (r.detail == Detail::full) files.emplace_back("results.csv", render_long_csv(r));
  return files;
}


std::vector<OutputFile> check_outputs(const CheckReport& r) {
  std::vector<OutputFile> files;
  files.push_back({"report.txt", [&r](std::ostream& out) { write_check(r, Format::text, out); }});
  files.push_back({"report.md", [&r](std::ostream& out) { write_check(r, Format::markdown, out); }});
  files.push_back({"results.json", [&r](std::ostream& out) { write_check(r, Format::json, out); }});
  // The small tables as they are; the long one streamed.
  for (auto& [name, content] : check_files_small(r))
    files.push_back({name, [content = std::move(content)](std::ostream& out) { out << content; }});
  if (r.detail == Detail::full)
    files.push_back({"results.csv", [&r](std::ostream& out) { write_long_csv(r, out); }});
  return files;
}

CheckTables check_tables(const CheckReport& r) {
  CheckTables t;
  t.pile_types = pile_types_table(r);
  t.piles = piles_table(r);
  t.combinations = combinations_table(r);
  for (const auto& cc : r.results->combinations) {
    if (!r.results->pile_rows) break;  // a run that kept no pile rows
    t.per_combination.push_back(combination_table(r, cc));
    t.per_combination_notes.push_back(combination_note(r, cc));
  }
  t.envelope = envelope_table(r);
  t.summary = summary_table(r);
  return t;
}

std::string hand_check_text(const CheckReport& r) {
  return r.explain_pile ? explain_block(r, Format::text) : std::string();
}

}  // namespace cairn
