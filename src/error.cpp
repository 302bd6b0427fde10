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
  // A message repeats what it found; a 50 MB name must not make a 50 MB line, so the
  // middle of a long message is cut.
  constexpr std::size_t keep_head = 600, keep_tail = 200;
  out += "error: ";
  if (message.size() <= keep_head + keep_tail + 40) {
    out += message;
  } else {
    // Cut at character boundaries (never inside a UTF-8 sequence).
    auto continuation = [&](std::size_t i) {
      return (static_cast<unsigned char>(message[i]) & 0xC0) == 0x80;
    };
    std::size_t head = keep_head, tail = message.size() - keep_tail;
    while (head > 0 && continuation(head)) --head;
    while (tail < message.size() && continuation(tail)) ++tail;
    out += message.substr(0, head);
    out += " ... (" + std::to_string(tail - head) + " bytes cut) ... ";
    out += message.substr(tail);
  }
  for (char& c : out)
    if (c == '\n' || c == '\r') c = ' ';  // one line, whatever the message quoted
  return out;
}

InputError::InputError(SourceLocation where, const std::string& message)
    : std::runtime_error(format_error(where, message)), where_(std::move(where)), message_(message) {}

void fail(const SourceLocation& where, const std::string& message) { throw InputError(where, message); }

}  // namespace vibtherm
