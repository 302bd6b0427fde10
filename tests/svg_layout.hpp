// Test helper: the text boxes of an SVG picture, estimated as svg_plot.hpp does, so tests can
// check that no label overlaps another, none leaves the picture and none is under 12 px.
#pragma once

#include <regex>
#include <string>
#include <vector>

#include "vibtherm/svg_plot.hpp"

namespace vibtherm::test {

struct TextBox {
  double x0, y0, x1, y1, font;
  std::string content;
};

inline std::string unescaped(const std::string& s) {
  static const std::regex entity("&[a-z#0-9]+;");
  return std::regex_replace(s, entity, "e");
}

// Every <text> without a transform (rotated axis titles are checked by position only). Its
// font-size and text-anchor are its own or inherited from the enclosing <g> and <svg> elements.
inline std::vector<TextBox> text_boxes(const std::string& svg_text) {
  static const std::regex element(R"~(<(/?)(svg|g|text)\b([^>]*?)(/?)>(?:([^<]*)</text>)?)~");
  static const std::regex number(R"~(([a-z-]+)="([^"]*)")~");
  struct Inherited {
    double font = svg::font_default;  // what open_svg sets on the root
    std::string anchor = "start";
  };
  std::vector<Inherited> stack{Inherited{}};
  std::vector<TextBox> out;
  for (auto it = std::sregex_iterator(svg_text.begin(), svg_text.end(), element);
       it != std::sregex_iterator(); ++it) {
    const bool closing = (*it)[1].length() > 0, empty = (*it)[4].length() > 0;
    const std::string tag = (*it)[2], attrs = (*it)[3], content = unescaped((*it)[5]);
    if (closing) {
      if (stack.size() > 1) stack.pop_back();
      continue;
    }
    Inherited here = stack.back();
    double x = 0, y = 0;
    bool rotated = false;
    for (auto a = std::sregex_iterator(attrs.begin(), attrs.end(), number); a != std::sregex_iterator();
         ++a) {
      const std::string key = (*a)[1], value = (*a)[2];
      if (key == "x") x = std::stod(value);
      if (key == "y") y = std::stod(value);
      if (key == "font-size") here.font = std::stod(value);
      if (key == "text-anchor") here.anchor = value;
      if (key == "transform") rotated = true;
    }
    if (tag != "text") {
      if (!empty) stack.push_back(here);
      continue;
    }
    if (rotated) continue;
    const double w = svg::text_width(content, here.font);
    const double x0 = here.anchor == "end" ? x - w : here.anchor == "middle" ? x - 0.5 * w : x;
    out.push_back({x0, y - 0.8 * here.font, x0 + w, y + 0.25 * here.font, here.font, content});
  }
  return out;
}

// Pairs of boxes that overlap by more than half a pixel, as "a / b" descriptions.
inline std::vector<std::string> overlaps(const std::vector<TextBox>& boxes) {
  std::vector<std::string> out;
  for (size_t i = 0; i < boxes.size(); ++i)
    for (size_t j = i + 1; j < boxes.size(); ++j) {
      const TextBox &a = boxes[i], &b = boxes[j];
      if (a.x0 < b.x1 - 0.5 && b.x0 < a.x1 - 0.5 && a.y0 < b.y1 - 0.5 && b.y0 < a.y1 - 0.5)
        out.push_back(a.content + " / " + b.content);
    }
  return out;
}

inline double svg_height(const std::string& svg_text) {
  static const std::regex height(R"~(<svg[^>]* height="([0-9.]+)")~");
  std::smatch m;
  return std::regex_search(svg_text, m, height) ? std::stod(m[1]) : 0.0;
}

}  // namespace vibtherm::test
