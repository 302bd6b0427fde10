// Escaping for the markup the writers produce: text and attribute values of SVG and HTML
// (& < > " ' become entities valid in both), and CSV fields (RFC 4180 quoting).
#pragma once

#include <string>
#include <string_view>

namespace vibtherm {

std::string escape_markup(std::string_view text);

// A CSV field per RFC 4180: as is, or in double quotes (inner quotes doubled) when it
// holds a comma, a quote or a line break.
std::string csv_field(std::string_view text);

}  // namespace vibtherm
