// markup.hpp — the small helpers every HTML and SVG renderer shares: escaping user text for
// element content and for attribute values, and the utilization colour scale of the plan,
// the result tables and the index of a package.
//
// Escaping follows the HTML Living Standard and XML 1.0 (Fifth Edition) §2.4: &, <, >, " and
// ' become character references, so that any text can sit inside an element or a quoted
// attribute. In attribute values line breaks and tabs also become references (&#10;, &#13;,
// &#9;), which attribute-value normalisation (XML 1.0 §3.3.3) would otherwise turn into
// spaces.
//
// The colour scale is viridis, a perceptually uniform sequential colour map that stays
// ordered in grayscale and for the common colour-vision deficiencies (van der Walt & Smith
// 2015, "mpl-colormaps", released CC0), sampled at 9 anchors (entries 0, 32, …, 224, 255 of
// its published 256-entry table) and interpolated linearly between them in sRGB.
#pragma once

#include <string>
#include <string_view>

namespace cairn {

// `text` with &, <, >, " and ' replaced by character references, for XML and HTML content.
std::string xml_escape(std::string_view text);

// The same, for HTML element content.
inline std::string html_escape(std::string_view text) { return xml_escape(text); }

// `text` for a quoted attribute value: as html_escape, and line feed, carriage return and
// tab as numeric references.
std::string attribute_escape(std::string_view text);

// `text` as the body of a double-quoted CSS string (CSS Syntax Level 3 §4.3.5): backslash
// and quote escaped, line breaks as \A, and < as \3C so that no "</style>" can close the
// style element early.
std::string css_string_escape(std::string_view text);

// The utilization colour scale from 0 (dark violet #440154) to `scale_max` (yellow
// #fde725); utilizations above it (infinity included: a demand with no capacity) take the
// top colour. Returns a CSS colour "#rrggbb"; NaN gives kUncheckedColour.
// Requires: scale_max > 0 (std::invalid_argument otherwise).
std::string utilization_colour(double utilization, double scale_max = 1.2);

// Black or white, whichever has the higher contrast (WCAG 2.x relative luminance) on
// utilization_colour(utilization, scale_max): the lower part of the scale is dark.
const char* utilization_text_colour(double utilization, double scale_max = 1.2);

// Colour of a pile with no check results.
inline constexpr const char* kUncheckedColour = "#d9d9d9";

}  // namespace cairn
