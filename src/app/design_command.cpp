#include "cairn/app/design_command.hpp"

#include <chrono>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <mutex>
#include <ostream>
#include <thread>

#include <fmt/format.h>
#include <unistd.h>

#include "cairn/core/diagnostics.hpp"
#include "cairn/design/search.hpp"
#include "cairn/input/chosen_file.hpp"
#include "cairn/input/input.hpp"
#include "cairn/input/read_design.hpp"
#include "cairn/output/design_report.hpp"
#include "cairn/output/output_files.hpp"

namespace cairn {
namespace {

namespace fs = std::filesystem;

// A length as the file will hold it: a plain number in the file's unit when it reads back
// as the same double, else the SI value with its unit (exact: "x m" reads as x).
std::string length_text(double metres, UnitSystem units, bool with_unit) {
  const double unit = to_si_factor(units, Quantity::length);
  const double v = std::round(metres / unit * 1e6) / 1e6;
  const auto back = parse_quantity(fmt::format("{}", v), Quantity::length, units);
  const char* label = unit_label(units, Quantity::length);
  if (back.si && *back.si == metres) return with_unit ? fmt::format("{} {}", v, label) : fmt::format("{}", v);
  return fmt::format("{} m", metres);
}

}  // namespace

ChosenLayout chosen_layout(const Project& project, const std::string& file, const Candidate& c) {
  ChosenLayout chosen;
  chosen.pile_type = project.pile_types[c.layout.type].id;
  chosen.length_text = length_text(c.length, project.units, true);
  chosen.thickness_text = length_text(c.thickness, project.units, false);
  chosen.keep_outline = c.layout.outline_given;
  if (!c.layout.outline_given) {
    if (c.layout.polygon_file.empty())
      chosen.rectangle = std::array<double, 4>{c.layout.width_file, c.layout.length_file,
                                               c.layout.center_x_file, c.layout.center_y_file};
    else
      chosen.polygon = c.layout.polygon_file;
  }
  for (std::size_t i = 0; i < c.layout.piles.size(); ++i)
    chosen.piles.push_back({fmt::format("P{}", i + 1), c.layout.piles_file[i][0],
                            c.layout.piles_file[i][1], c.layout.piles[i].batter});
  chosen.header = {
      fmt::format("{} — layout chosen by `cairn design {}`:", project.title,
                  fs::path(file).filename().string()),
      fmt::format("{} piles of type {}, {}; cost {:.0f}.", c.layout.piles.size(), chosen.pile_type,
                  c.layout.describe(), c.cost),
      "The cap's own structural design (bending, shear, punching) was not part of the search.",
      "Check it with `cairn check` and `cairn report`; results are for checking by a qualified",
      "engineer, and local codes and licensed practice govern."};
  return chosen;
}

int run_design(const Options& options, std::ostream& out, std::ostream& err) {
  if (options.files.size() != 1) throw InputError({}, "design: expected one project file");
  const std::string& file = options.files.front();
  if (options.write_file) {
    std::error_code ec1, ec2;
    if (fs::exists(*options.write_file) &&
        fs::equivalent(fs::path(*options.write_file), fs::path(file), ec1) && !ec1)
      throw InputError({}, fmt::format("--write: '{}' is the design file itself; give another "
                                       "name for the chosen layout", *options.write_file));
    (void)ec2;
  }
  const Project project = read_project(file, Piles::optional);
  for (const auto& w : project.warnings) err << "cairn: " << format_warning(w) << "\n";
  const DesignSpec spec = read_design(file, project);
  // Progress on a terminal only, and only once the search has run for a second.
  const bool terminal = isatty(fileno(stderr)) != 0;
  const auto start = std::chrono::steady_clock::now();
  std::mutex lock;
  bool shown = false;
  double last = 0.0;  // s, when the bar was last drawn
  DesignProgress progress = [&](std::size_t done, std::size_t total) {
    if (!terminal) return;
    const double elapsed =
        std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
    std::lock_guard<std::mutex> guard(lock);
    if (elapsed < 1.0 && !shown) return;  // a search shorter than a second shows no bar
    if (done < total && elapsed < last + 0.1) return;  // ten updates a second at most
    last = elapsed;
    const int width = 30;
    const int filled = total ? static_cast<int>(width * done / total) : width;
    err << fmt::format("\rcairn design: [{}{}] {}/{} layouts", std::string(filled, '#'),
                       std::string(width - filled, ' '), done, total)
        << (done >= total ? "\n" : "") << std::flush;
    shown = true;
  };
  const DesignOutcome outcome = search_layouts(
      project, spec, std::max(1u, std::thread::hardware_concurrency()), progress);
  DesignReport report;
  report.project = &project;
  report.spec = &spec;
  report.outcome = &outcome;
  report.basis = design_basis(project, spec);
  report.options = options.command_line.empty() ? "cairn design " + file : options.command_line;
  if (options.write_file && !outcome.best.empty()) report.written = *options.write_file;
  const std::string rendered = render_design(report, options.format);
  if (options.write_file && !outcome.best.empty()) {
    const fs::path target(*options.write_file);
    const std::string folder = target.has_parent_path() ? target.parent_path().string() : ".";
    const std::string text = chosen_project_text(
        file, (fs::path(folder) / target.filename()).string(),
        chosen_layout(project, file, outcome.best.front()));
    // Beside it, the search itself in Markdown (basis, runners-up, rejections) for the
    // calculation package.
    const std::string search_name = target.stem().string() + "-search.md";
    write_files_atomically(folder, {{target.filename().string(), text},
                                    {search_name, render_design(report, Format::markdown)}});
  }
  out << rendered;
  return outcome.best.empty() ? kExitFail : kExitPass;
}

}  // namespace cairn
