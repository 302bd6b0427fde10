// One error type for every bad input: it carries the file, line and column where the
// reader knows them, and formats as `FILE:LINE:COL: error: message`.
#pragma once

#include <stdexcept>
#include <string>

namespace vibtherm {

struct SourceLocation {
  std::string file;  // empty when not from a file
  int line = 0;      // 1-based; 0 when unknown
  int column = 0;    // 1-based; 0 when unknown
};

class InputError : public std::runtime_error {
 public:
  InputError(SourceLocation where, const std::string& message);
  const SourceLocation& where() const { return where_; }
  const std::string& message() const { return message_; }

 private:
  SourceLocation where_;
  std::string message_;
};

// "file:line:col: error: message", omitting the parts that are unknown.
std::string format_error(const SourceLocation& where, const std::string& message);

[[noreturn]] void fail(const SourceLocation& where, const std::string& message);

}  // namespace vibtherm
