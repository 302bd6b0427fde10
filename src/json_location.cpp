// Locating values in a JSON text; see json_location.hpp.
#include "json_location.hpp"

#include <algorithm>

namespace vibtherm {
namespace {

bool is_space(char c) { return c == ' ' || c == '\t' || c == '\n' || c == '\r'; }

class Scanner {
 public:
  explicit Scanner(std::string_view text) : text_(text) {}

  std::size_t locate(const JsonPath& path) {
    skip_space();
    std::size_t found = pos_;
    for (const JsonStep& step : path) {
      if (pos_ >= text_.size()) return found;
      const char open = text_[pos_];
      const std::string* key = std::get_if<std::string>(&step);
      if ((open == '{' && key && enter_member(*key)) ||
          (open == '[' && !key && enter_element(std::get<std::size_t>(step))))
        found = pos_;
      else
        return found;
    }
    return found;
  }

 private:
  void skip_space() {
    while (pos_ < text_.size() && is_space(text_[pos_])) ++pos_;
  }

  // The decoded text of the string at pos_ (escapes other than \uXXXX kept as the escaped
  // character; keys needing \u escapes are compared as written); pos_ moves past it.
  std::string read_string() {
    std::string out;
    ++pos_;  // the opening quote
    while (pos_ < text_.size() && text_[pos_] != '"') {
      if (text_[pos_] == '\\' && pos_ + 1 < text_.size()) {
        ++pos_;
        const char c = text_[pos_];
        out += c == 'n' ? '\n' : c == 't' ? '\t' : c == 'r' ? '\r' : c == 'b' ? '\b' : c == 'f' ? '\f' : c;
      } else {
        out += text_[pos_];
      }
      ++pos_;
    }
    ++pos_;  // the closing quote
    return out;
  }

  // Moves past the value at pos_, any depth, without recursion.
  void skip_value() {
    int depth = 0;
    do {
      skip_space();
      if (pos_ >= text_.size()) return;
      const char c = text_[pos_];
      if (c == '"') {
        read_string();
      } else if (c == '{' || c == '[') {
        ++depth;
        ++pos_;
      } else if (c == '}' || c == ']') {
        --depth;
        ++pos_;
      } else if (c == ',' || c == ':') {
        ++pos_;
      } else {
        while (pos_ < text_.size() && !is_space(text_[pos_]) && text_[pos_] != ',' && text_[pos_] != '}' &&
               text_[pos_] != ']')
          ++pos_;
      }
    } while (depth > 0);
  }

  // pos_ at '{': moves to the value of `key` and returns true, or returns false.
  bool enter_member(const std::string& key) {
    const std::size_t object = pos_;
    ++pos_;
    for (;;) {
      skip_space();
      if (pos_ >= text_.size() || text_[pos_] != '"') break;
      const std::string name = read_string();
      skip_space();
      ++pos_;  // ':'
      skip_space();
      if (name == key) return true;
      skip_value();
      skip_space();
      if (pos_ >= text_.size() || text_[pos_] != ',') break;
      ++pos_;
    }
    pos_ = object;
    return false;
  }

  // pos_ at '[': moves to element `index` and returns true, or returns false.
  bool enter_element(std::size_t index) {
    const std::size_t array = pos_;
    ++pos_;
    skip_space();
    if (pos_ < text_.size() && text_[pos_] == ']') {
      pos_ = array;
      return false;
    }
    for (std::size_t i = 0; i < index; ++i) {
      skip_value();
      skip_space();
      if (pos_ >= text_.size() || text_[pos_] != ',') {
        pos_ = array;
        return false;
      }
      ++pos_;
      skip_space();
    }
    return true;
  }

  std::string_view text_;
  std::size_t pos_ = 0;
};

}  // namespace

std::pair<int, int> line_column_at(std::string_view text, std::size_t offset) {
  offset = std::min(offset, text.size());
  int line = 1;
  std::size_t line_start = 0;
  for (std::size_t i = 0; i < offset; ++i)
    if (text[i] == '\n') ++line, line_start = i + 1;
  return {line, static_cast<int>(offset - line_start) + 1};
}

std::pair<int, int> locate_json_value(std::string_view text, const JsonPath& path) {
  if (text.empty()) return {0, 0};
  return line_column_at(text, Scanner(text).locate(path));
}

std::string json_path_text(const JsonPath& path) {
  std::string out;
  for (const JsonStep& step : path) {
    if (const std::string* key = std::get_if<std::string>(&step))
      out += (out.empty() ? "" : ".") + *key;
    else
      out += "[" + std::to_string(std::get<std::size_t>(step)) + "]";
  }
  return out;
}

}  // namespace vibtherm
