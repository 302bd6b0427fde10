// Escaping of text and attribute values for the markup the writers produce (SVG, HTML):
// & < > " and ' become entities valid in both XML and HTML.
#pragma once

#include <string>
#include <string_view>

namespace vibtherm {

std::string escape_markup(std::string_view text);

}  // namespace vibtherm
