#include "vibtherm/error.hpp"

namespace vibtherm {

std::string format_error(const SourceLocation& where, const std::string& message) {
  std::string out;
  if (!where.file.empty()) {
    out += where.file;
    if (where.line > 0) {
      out += ':' + std::to_string(where.line);
      if (where.column > 0) out += ':' + std::to_string(where.column);
    }
    out += ": ";
  }
  out += "error: " + message;
  return out;
}

InputError::InputError(SourceLocation where, const std::string& message)
    : std::runtime_error(format_error(where, message)), where_(std::move(where)), message_(message) {}

void fail(const SourceLocation& where, const std::string& message) { throw InputError(where, message); }

}  // namespace vibtherm
