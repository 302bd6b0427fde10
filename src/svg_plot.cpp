#include "vibtherm/svg_plot.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <array>
#include <cmath>

#include "vibtherm/markup.hpp"

namespace vibtherm::svg {

namespace {

// Entries 0, 16, 32, ..., 240, 255 of the 256-entry viridis table (matplotlib's
// _cm_listed._viridis_data), as 8-bit sRGB.
constexpr std::array<std::array<int, 3>, 17> viridis_table{{
    {68, 1, 84},
    {72, 24, 106},
    {71, 45, 123},
    {66, 64, 134},
    {59, 82, 139},
    {51, 99, 141},
    {44, 114, 142},
    {38, 130, 142},
    {33, 145, 140},
    {31, 159, 136},
    {39, 173, 129},
    {61, 188, 116},
    {92, 200, 99},
    {129, 211, 77},
    {170, 220, 50},
    {213, 226, 26},
    {253, 231, 37},
}};

std::string attributes(std::string_view extra) {
  return extra.empty() ? std::string() : " " + std::string(extra);
}

std::string dash_attribute(std::string_view dash) {
  return dash.empty() ? std::string() : fmt::format(R"( stroke-dasharray="{}")", dash);
}

}  // namespace

std::string viridis_hex(double value) {
  value = std::isfinite(value) ? std::clamp(value, 0.0, 1.0) : 0.0;
  const double at = value * static_cast<double>(viridis_table.size() - 1);
  const size_t k = std::min(static_cast<size_t>(at), viridis_table.size() - 2);
  const double f = at - static_cast<double>(k);
  std::array<int, 3> c{};
  for (size_t i = 0; i < 3; ++i)
    c[i] = static_cast<int>(
        std::lround(viridis_table[k][i] + f * (viridis_table[k + 1][i] - viridis_table[k][i])));
  return fmt::format("#{:02x}{:02x}{:02x}", c[0], c[1], c[2]);
}

double text_width(std::string_view content, double font_px) {
  size_t code_points = 0;
  for (const char ch : content)
    if ((static_cast<unsigned char>(ch) & 0xC0) != 0x80) ++code_points;
  return 0.6 * font_px * static_cast<double>(code_points);
}

Axis::Axis(double low, double high, bool logarithmic, double px_low, double px_high)
    : low_(low), high_(high), log_(logarithmic), px_low_(px_low), px_high_(px_high) {}

double Axis::operator()(double value) const {
  const double f = log_ ? (std::log(value) - std::log(low_)) / (std::log(high_) - std::log(low_))
                        : (value - low_) / (high_ - low_);
  return px_low_ + f * (px_high_ - px_low_);
}

namespace {

double step_for(double span, int max_ticks) {
  const double raw = span / std::max(1, max_ticks);
  const double magnitude = std::pow(10.0, std::floor(std::log10(raw)));
  for (double m : {1.0, 2.0, 5.0, 10.0})
    if (m * magnitude >= raw * (1 - 1e-9)) return m * magnitude;
  return 10.0 * magnitude;
}

}  // namespace

std::vector<double> Axis::ticks(int max_ticks) const {
  std::vector<double> out;
  if (log_) {
    for (int k = static_cast<int>(std::floor(std::log10(low_)));
         k <= static_cast<int>(std::ceil(std::log10(high_))); ++k)
      for (double m : {1.0, 2.0, 5.0}) {
        const double t = m * std::pow(10.0, k);
        if (t >= low_ * (1 - 1e-9) && t <= high_ * (1 + 1e-9)) out.push_back(t);
      }
    return out;
  }
  const double step = step_for(high_ - low_, max_ticks);
  for (double k = std::ceil(low_ / step - 1e-9); k * step <= high_ + 1e-9 * step; k += 1.0) {
    const double t = k * step;
    out.push_back(std::abs(t) < 1e-12 * step ? 0.0 : t);
  }
  return out;
}

std::pair<double, double> nice_interval(double low, double high, int max_ticks) {
  if (!(high > low)) {
    const double pad = std::max(std::abs(low) * 0.05, 1e-3);
    low -= pad;
    high += pad;
  }
  const double step = step_for(high - low, max_ticks);
  return {std::floor(low / step + 1e-9) * step, std::ceil(high / step - 1e-9) * step};
}

std::string num(double value) {
  long tenths = std::isfinite(value) ? std::lround(value * 10.0) : 0;
  std::string out = tenths < 0 ? "-" : "";
  const unsigned long magnitude = static_cast<unsigned long>(tenths < 0 ? -tenths : tenths);
  if (magnitude >= 10) out += fmt::format("{}", magnitude / 10);
  if (magnitude % 10 != 0) out += fmt::format(".{}", magnitude % 10);
  if (magnitude == 0) out = "0";
  return out;
}

const char* style_rules() { return ".halo{stroke:#fff;stroke-width:3px;paint-order:stroke;fill:#444}"; }

std::string text(double x, double y, std::string_view content, double font_px, std::string_view anchor,
                 std::string_view extra_attributes) {
  return fmt::format(R"(<text x="{}" y="{}"{}{}{}>{}</text>)", num(x), num(y),
                     font_px == font_default ? std::string() : fmt::format(R"( font-size="{:g}")", font_px),
                     anchor == "start" ? std::string() : fmt::format(R"( text-anchor="{}")", anchor),
                     attributes(extra_attributes), escape_markup(content));
}

std::vector<std::pair<double, double>> simplified(const std::vector<std::pair<double, double>>& points,
                                                  double tolerance_px) {
  if (points.size() < 3) return points;
  // Ramer-Douglas-Peucker (Ramer 1972; Douglas & Peucker 1973), with an explicit stack.
  std::vector<char> keep(points.size(), 0);
  keep.front() = keep.back() = 1;
  std::vector<std::pair<size_t, size_t>> spans{{0, points.size() - 1}};
  while (!spans.empty()) {
    const auto [a, b] = spans.back();
    spans.pop_back();
    const auto [ax, ay] = points[a];
    const auto [bx, by] = points[b];
    const double length = std::hypot(bx - ax, by - ay);
    double farthest = -1.0;
    size_t at = a;
    for (size_t i = a + 1; i < b; ++i) {
      const auto [px, py] = points[i];
      const double d = length > 0.0 ? std::abs((bx - ax) * (ay - py) - (ax - px) * (by - ay)) / length
                                    : std::hypot(px - ax, py - ay);
      if (d > farthest) {
        farthest = d;
        at = i;
      }
    }
    if (farthest > tolerance_px) {
      keep[at] = 1;
      spans.emplace_back(a, at);
      spans.emplace_back(at, b);
    }
  }
  std::vector<std::pair<double, double>> out;
  for (size_t i = 0; i < points.size(); ++i)
    if (keep[i]) out.push_back(points[i]);
  return out;
}

std::string polyline(const std::vector<std::pair<double, double>>& all_points_px, std::string_view css_class,
                     std::string_view colour, double width, std::string_view dash) {
  const auto points_px = simplified(all_points_px, curve_tolerance_px);
  std::string out = fmt::format(R"(<path class="{}" fill="none" stroke="{}" stroke-width="{:g}"{} d=")",
                                css_class, colour, width, dash_attribute(dash));
  // Relative moves between positions rounded to tenths: short, and exact (no rounding drift).
  long px = 0, py = 0;
  for (size_t i = 0; i < points_px.size(); ++i) {
    const long x = std::lround(points_px[i].first * 10.0), y = std::lround(points_px[i].second * 10.0);
    if (i == 0) {
      out += "M" + num(x / 10.0) + " " + num(y / 10.0) + (points_px.size() > 1 ? "l" : "");
    } else {
      const std::string dx = num((x - px) / 10.0), dy = num((y - py) / 10.0);
      if (i > 1 && dx[0] != '-') out += ' ';  // a sign separates numbers, a point might not everywhere
      out += dx;
      if (dy[0] != '-') out += ' ';
      out += dy;
    }
    px = x;
    py = y;
  }
  return out + "\"/>\n";
}

std::string line(double x1, double y1, double x2, double y2, std::string_view colour, double width,
                 std::string_view dash) {
  return fmt::format(R"(<line x1="{}" y1="{}" x2="{}" y2="{}" stroke="{}"{}{}/>)", num(x1), num(y1), num(x2),
                     num(y2), colour,
                     width == 1.0 ? std::string() : fmt::format(R"( stroke-width="{:g}")", width),
                     dash_attribute(dash));
}

void plot_box(std::string& out, const Axis& x, const Axis& y, double top, double bottom,
              std::string_view y_title) {
  // The grid as one path: a few dozen lines per picture, each a short path command.
  std::string grid;
  for (double t : x.ticks()) grid += "M" + num(x(t)) + " " + num(top) + "V" + num(bottom);
  for (double v : y.ticks(5)) grid += "M" + num(plot_left) + " " + num(y(v)) + "H" + num(plot_right);
  out += fmt::format(R"(<path class="grid" d="{}" stroke="#ddd" fill="none"/>)", grid);
  out += "\n<g class=\"y-axis\" text-anchor=\"end\">";
  double last = 1e300;
  for (double v : y.ticks(5)) {
    const double py = y(v);
    if (std::abs(last - py) < font_tick + 2) continue;
    out += text(plot_left - 6, py + 4, fmt::format("{:g}", v), font_tick);  // the group's anchor
    last = py;
  }
  out += fmt::format(R"~(<text transform="translate({},{}) rotate(-90)" text-anchor="middle" )~"
                     R"(font-size="{:g}">{}</text>)",
                     num(plot_left - 58), num(0.5 * (top + bottom)), font_label, escape_markup(y_title));
  out += "</g>\n";
  out +=
      fmt::format(R"(<rect class="frame" x="{}" y="{}" width="{}" height="{}" fill="none" stroke="#333"/>)",
                  num(plot_left), num(top), num(plot_right - plot_left), num(bottom - top));
  out += '\n';
}

double x_axis_labels(std::string& out, const Axis& x, double y_axis, std::string_view title) {
  out += R"(<g class="x-axis" text-anchor="middle">)";
  double right_edge = -1e300;
  std::string marks;
  for (double t : x.ticks()) {
    const std::string label = fmt::format("{:g}", t);
    const double w = text_width(label, font_tick);
    if (x(t) - 0.5 * w < right_edge + 6) continue;
    marks += "M" + num(x(t)) + " " + num(y_axis) + "v4";
    out += text(x(t), y_axis + 17, label, font_tick);
    right_edge = x(t) + 0.5 * w;
  }
  if (!marks.empty()) out += fmt::format(R"(<path d="{}" stroke="#333"/>)", marks);
  out += text(0.5 * (plot_left + plot_right), y_axis + 36, title, font_label);
  out += "</g>\n";
  return 44.0;
}

double legend(std::string& out, const std::vector<LegendEntry>& entries, double x, double top, double right) {
  if (entries.empty()) return 0.0;
  constexpr double sample = 30.0, gap = 8.0, spacing = 22.0, row = 20.0;
  double cx = x, cy = top + 10;
  out += R"(<g class="legend">)";
  for (const auto& e : entries) {
    const double w = sample + gap + text_width(e.label, font_tick);
    if (cx > x && cx + w > right) {
      cx = x;
      cy += row;
    }
    if (e.ring)
      out += fmt::format(R"(<circle cx="{}" cy="{}" r="4" fill="none" stroke="{}" stroke-width="1.5"/>)",
                         num(cx + 0.5 * sample), num(cy), e.colour);
    else if (e.width <= 0.0)
      out += fmt::format(R"(<rect x="{}" y="{}" width="{:g}" height="10" fill="{}"/>)", num(cx), num(cy - 5),
                         sample, e.colour);
    else
      out += line(cx, cy, cx + sample, cy, e.colour, e.width, e.dash);
    out += text(cx + sample + gap, cy + 4, e.label, font_tick);
    cx += w + spacing;
  }
  out += "</g>\n";
  return cy - top + 14;
}

std::string viridis_gradient(std::string_view id, const std::vector<double>& x_px,
                             const std::vector<double>& values, double x_from, double x_to,
                             double resolution) {
  std::string stops;
  double last = -1.0;
  for (size_t i = 0; i < values.size(); ++i) {
    const double v = std::clamp(values[i], 0.0, 1.0);
    const bool end = i == 0 || i + 1 == values.size();
    if (!end && std::abs(v - last) < resolution) continue;
    const long thousandths = std::lround(1000.0 * std::clamp((x_px[i] - x_from) / (x_to - x_from), 0.0, 1.0));
    const std::string offset = thousandths == 0      ? std::string("0")
                               : thousandths == 1000 ? std::string("1")
                                                     : fmt::format(".{:03d}", thousandths);
    stops += fmt::format(R"(<stop offset="{}" stop-color="{}"/>)", offset, viridis_hex(v));
    last = v;
  }
  return fmt::format(
      R"(<linearGradient id="{}" gradientUnits="userSpaceOnUse" x1="{}" y1="0" x2="{}" y2="0">{})"
      "</linearGradient>\n",
      escape_markup(id), num(x_from), num(x_to), stops);
}

std::string heat_row(GradientBook& book, const std::vector<double>& x_px, const std::vector<double>& values,
                     double left, double right, double top, double height) {
  // Stops where the value has moved by a fiftieth since the last stop (and at both ends):
  // the browser interpolates between them, so a row is a few dozen stops, not a cell per sample.
  const std::string first = viridis_hex(values.empty() ? 0.0 : values.front());
  bool uniform = true;
  for (const double v : values) uniform = uniform && viridis_hex(v) == first;
  std::string fill = first;
  if (!uniform) {
    // The stop list without the id is the key: identical rows share one gradient.
    const std::string key = viridis_gradient("", x_px, values, left, right, 0.02);
    auto it =
        std::find_if(book.known.begin(), book.known.end(), [&](const auto& k) { return k.first == key; });
    if (it == book.known.end()) {
      const std::string id = fmt::format("{}row{}", book.id_prefix, book.known.size() + 1);
      book.defs += viridis_gradient(id, x_px, values, left, right, 0.02);
      book.known.emplace_back(key, id);
      it = book.known.end() - 1;
    }
    fill = fmt::format("url(#{})", escape_markup(it->second));
  }
  return fmt::format(R"(<rect x="{}" y="{}" width="{}" height="{}" fill="{}"/>)", num(left), num(top),
                     num(right - left), num(height), fill);
}

std::string shifted_heat_row(std::string_view gradient_id, double shift_px, double left, double right,
                             double top, double height) {
  const double shift = std::round(10.0 * shift_px) / 10.0;  // x + shift is `left` to the tenth
  return fmt::format(
      R"~(<rect x="{}" y="{}" width="{}" height="{}" transform="translate({})" fill="url(#{})"/>)~",
      num(left - shift), num(top), num(right - left), num(height), num(shift), escape_markup(gradient_id));
}

std::string open_svg(double height, bool standalone, std::string_view css_class, std::string_view title) {
  std::string out = standalone ? "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n" : "";
  out += fmt::format(R"(<svg{} class="{}" width="{:.0f}" height="{:.0f}" viewBox="0 0 {:.0f} {:.0f}" )"
                     R"(font-family="DejaVu Sans, Verdana, sans-serif" font-size="{:g}" role="img">)",
                     standalone ? R"( xmlns="http://www.w3.org/2000/svg")" : "", css_class, figure_width,
                     std::ceil(height), figure_width, std::ceil(height), font_default);
  out += fmt::format("\n<title>{}</title>\n", escape_markup(title));
  if (standalone) out += fmt::format("<style>{}</style>\n", style_rules());
  out += R"(<rect width="100%" height="100%" fill="white"/>)";
  out += '\n';
  return out;
}

}  // namespace vibtherm::svg
