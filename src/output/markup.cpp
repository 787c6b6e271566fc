#include "cairn/output/markup.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <stdexcept>

#include <fmt/format.h>

namespace cairn {

std::string xml_escape(std::string_view text) {
  std::string out;
  out.reserve(text.size());
  for (char c : text) {
    switch (c) {
      case '&': out += "&amp;"; break;
      case '<': out += "&lt;"; break;
      case '>': out += "&gt;"; break;
      case '"': out += "&quot;"; break;
      case '\'': out += "&#39;"; break;
      default: out += c;
    }
  }
  return out;
}

namespace {

// viridis (van der Walt & Smith 2015, mpl-colormaps, CC0): entries 0, 32, 64, 96, 128, 160,
// 192, 224 and 255 of the published 256-entry table, sRGB in 0…1.
constexpr double kViridis[9][3] = {
    {0.267004, 0.004874, 0.329415}, {0.278826, 0.175490, 0.483397},
    {0.229739, 0.322361, 0.545706}, {0.172719, 0.448791, 0.557885},
    {0.127568, 0.566949, 0.550556}, {0.157851, 0.683765, 0.501686},
    {0.369214, 0.788888, 0.382914}, {0.678489, 0.863742, 0.189503},
    {0.993248, 0.906157, 0.143936}};

// The colour at t in [0, 1] along the scale, sRGB 0…1.
std::array<double, 3> scale_rgb(double t) {
  t = std::clamp(t, 0.0, 1.0);
  const double position = t * 8.0;
  const int i = std::min(7, static_cast<int>(position));
  const double f = position - i;
  std::array<double, 3> rgb{};
  for (int c = 0; c < 3; ++c) rgb[c] = kViridis[i][c] + f * (kViridis[i + 1][c] - kViridis[i][c]);
  return rgb;
}

std::string hex(const std::array<double, 3>& rgb) {
  auto byte = [](double v) { return static_cast<int>(std::lround(std::clamp(v, 0.0, 1.0) * 255.0)); };
  return fmt::format("#{:02x}{:02x}{:02x}", byte(rgb[0]), byte(rgb[1]), byte(rgb[2]));
}

double scale_position(double u, double scale_max) {
  if (!(scale_max > 0)) throw std::invalid_argument("utilization scale: the top must be positive");
  return std::isinf(u) ? 1.0 : u / scale_max;
}

}  // namespace

std::string utilization_colour(double u, double scale_max) {
  if (std::isnan(u)) return kUncheckedColour;
  return hex(scale_rgb(scale_position(u, scale_max)));
}

const char* utilization_text_colour(double u, double scale_max) {
  if (std::isnan(u)) return "#000000";
  const auto rgb = scale_rgb(scale_position(u, scale_max));
  // Relative luminance (WCAG 2.x, sRGB linearised); below 0.179 white text has the higher
  // contrast ratio, above it black.
  double y = 0.0;
  const double weight[3] = {0.2126, 0.7152, 0.0722};
  for (int c = 0; c < 3; ++c) {
    const double v = rgb[c] <= 0.04045 ? rgb[c] / 12.92 : std::pow((rgb[c] + 0.055) / 1.055, 2.4);
    y += weight[c] * v;
  }
  return y < 0.179 ? "#ffffff" : "#000000";
}

// xml_escape, then the line breaks and tabs as character references (the entities
// xml_escape writes hold none of them).
std::string attribute_escape(std::string_view text) {
  std::string out;
  for (char c : xml_escape(text)) {
    if (c == '\n') out += "&#10;";
    else if (c == '\r') out += "&#13;";
    else if (c == '\t') out += "&#9;";
    else out += c;
  }
  return out;
}

std::string css_string_escape(std::string_view text) {
  std::string out;
  for (char c : text) {
    switch (c) {
      case '\\': out += "\\\\"; break;
      case '"': out += "\\\""; break;
      case '\n': out += "\\A "; break;
      case '\r': break;
      case '<': out += "\\3C "; break;
      default: out += c;
    }
  }
  return out;
}

}  // namespace cairn
