// Internal to the library: where a value stands in a JSON text (line and column), for the
// located errors of the JSON readers; nlohmann-json keeps no positions in its values.
#pragma once

#include <cstddef>
#include <string>
#include <string_view>
#include <utility>
#include <variant>
#include <vector>

namespace vibtherm {

// One step into a JSON document: an object key or an array index.
using JsonStep = std::variant<std::string, std::size_t>;
using JsonPath = std::vector<JsonStep>;

// The 1-based line and column of byte `offset` of `text` (columns count bytes).
std::pair<int, int> line_column_at(std::string_view text, std::size_t offset);

// The 1-based line and column where the value at `path` starts in `text`, which must be
// valid JSON; the deepest value of the path that exists when the full path does not (a
// missing key is reported at its object), {0, 0} only for an empty text. Scans the text
// again (errors are rare), iteratively below the path, so any nesting depth is safe.
std::pair<int, int> locate_json_value(std::string_view text, const JsonPath& path);

// "molecule.geometry[4]" for messages.
std::string json_path_text(const JsonPath& path);

}  // namespace vibtherm
