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

std::string text(double x, double y, std::string_view content, double font_px, std::string_view anchor,
                 std::string_view extra_attributes) {
  return fmt::format(R"(<text x="{:.1f}" y="{:.1f}" font-size="{:g}"{}{}>{}</text>)", x, y, font_px,
                     anchor == "start" ? std::string() : fmt::format(R"( text-anchor="{}")", anchor),
                     attributes(extra_attributes), escape_markup(content));
}

std::string polyline(const std::vector<std::pair<double, double>>& points_px, std::string_view css_class,
                     std::string_view colour, double width, std::string_view dash) {
  std::string out =
      fmt::format(R"(<polyline class="{}" fill="none" stroke="{}" stroke-width="{:g}"{} points=")", css_class,
                  colour, width, dash_attribute(dash));
  for (size_t i = 0; i < points_px.size(); ++i)
    out += fmt::format("{}{:.1f},{:.1f}", i ? " " : "", points_px[i].first, points_px[i].second);
  return out + "\"/>\n";
}

std::string line(double x1, double y1, double x2, double y2, std::string_view colour, double width,
                 std::string_view dash) {
  return fmt::format(R"(<line x1="{:.1f}" y1="{:.1f}" x2="{:.1f}" y2="{:.1f}" stroke="{}"{}{}/>)", x1, y1, x2,
                     y2, colour, width == 1.0 ? std::string() : fmt::format(R"( stroke-width="{:g}")", width),
                     dash_attribute(dash));
}

void plot_box(std::string& out, const Axis& x, const Axis& y, double top, double bottom,
              std::string_view y_title) {
  // The grid as one path: a few dozen lines per picture, each a short path command.
  std::string grid;
  for (double t : x.ticks()) grid += fmt::format("M{:.1f} {:.1f}V{:.1f}", x(t), top, bottom);
  for (double v : y.ticks(5)) grid += fmt::format("M{:.1f} {:.1f}H{:.1f}", plot_left, y(v), plot_right);
  out += fmt::format(R"(<path class="grid" d="{}" stroke="#dddddd" fill="none"/>)", grid);
  out += "\n<g class=\"y-axis\">";
  double last = 1e300;
  for (double v : y.ticks(5)) {
    const double py = y(v);
    if (std::abs(last - py) < font_tick + 2) continue;
    out += text(plot_left - 6, py + 4, fmt::format("{:g}", v), font_tick, "end");
    last = py;
  }
  out += fmt::format(R"~(<text transform="translate({:.1f},{:.1f}) rotate(-90)" text-anchor="middle" )~"
                     R"(font-size="{:g}">{}</text>)",
                     plot_left - 58, 0.5 * (top + bottom), font_label, escape_markup(y_title));
  out += "</g>\n";
  out +=
      fmt::format(R"(<rect class="frame" x="{:.1f}" y="{:.1f}" width="{:.1f}" height="{:.1f}" fill="none" )"
                  R"(stroke="#333333"/>)",
                  plot_left, top, plot_right - plot_left, bottom - top);
  out += '\n';
}

double x_axis_labels(std::string& out, const Axis& x, double y_axis, std::string_view title) {
  out += R"(<g class="x-axis">)";
  double right_edge = -1e300;
  std::string marks;
  for (double t : x.ticks()) {
    const std::string label = fmt::format("{:g}", t);
    const double w = text_width(label, font_tick);
    if (x(t) - 0.5 * w < right_edge + 6) continue;
    marks += fmt::format("M{:.1f} {:.1f}v4", x(t), y_axis);
    out += text(x(t), y_axis + 17, label, font_tick, "middle");
    right_edge = x(t) + 0.5 * w;
  }
  if (!marks.empty()) out += fmt::format(R"(<path d="{}" stroke="#333333"/>)", marks);
  out += text(0.5 * (plot_left + plot_right), y_axis + 36, title, font_label, "middle");
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
      out +=
          fmt::format(R"(<circle cx="{:.1f}" cy="{:.1f}" r="4" fill="none" stroke="{}" stroke-width="1.5"/>)",
                      cx + 0.5 * sample, cy, e.colour);
    else if (e.width <= 0.0)
      out += fmt::format(R"(<rect x="{:.1f}" y="{:.1f}" width="{:g}" height="10" fill="{}"/>)", cx, cy - 5,
                         sample, e.colour);
    else
      out += line(cx, cy, cx + sample, cy, e.colour, e.width, e.dash);
    out += text(cx + sample + gap, cy + 4, e.label, font_tick);
    cx += w + spacing;
  }
  out += "</g>\n";
  return cy - top + 14;
}

std::string heat_row(GradientBook& book, const std::vector<double>& x_px, const std::vector<double>& values,
                     double left, double right, double top, double height) {
  // Stops where the value has moved by a fiftieth since the last stop (and at both ends):
  // the browser interpolates between them, so a row is a few dozen stops, not a cell per sample.
  std::string stops, first_colour;
  bool uniform = true;
  double last = -1.0;
  for (size_t i = 0; i < values.size(); ++i) {
    const double v = std::clamp(values[i], 0.0, 1.0);
    const bool end = i == 0 || i + 1 == values.size();
    if (!end && std::abs(v - last) < 0.02) continue;
    const std::string colour = viridis_hex(v);
    if (first_colour.empty()) first_colour = colour;
    uniform = uniform && colour == first_colour;
    stops += fmt::format(R"(<stop offset="{:.4f}" stop-color="{}"/>)",
                         std::clamp((x_px[i] - left) / (right - left), 0.0, 1.0), colour);
    last = v;
  }
  std::string fill = first_colour;
  if (!uniform) {
    auto it =
        std::find_if(book.known.begin(), book.known.end(), [&](const auto& k) { return k.first == stops; });
    if (it == book.known.end()) {
      const std::string id = fmt::format("{}row{}", book.id_prefix, book.known.size() + 1);
      book.defs += fmt::format(
          R"(<linearGradient id="{}" gradientUnits="userSpaceOnUse" x1="{:.1f}" y1="0" x2="{:.1f}" y2="0">{})"
          "</linearGradient>\n",
          escape_markup(id), left, right, stops);
      book.known.emplace_back(stops, id);
      it = book.known.end() - 1;
    }
    fill = fmt::format("url(#{})", escape_markup(it->second));
  }
  return fmt::format(R"(<rect x="{:.1f}" y="{:.1f}" width="{:.1f}" height="{:.1f}" fill="{}"/>)", left, top,
                     right - left, height, fill);
}

std::string open_svg(double height, bool standalone, std::string_view css_class, std::string_view title) {
  std::string out = standalone ? "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n" : "";
  out += fmt::format(R"(<svg{} class="{}" width="{:.0f}" height="{:.0f}" viewBox="0 0 {:.0f} {:.0f}" )"
                     R"(font-family="DejaVu Sans, Verdana, sans-serif" role="img">)",
                     standalone ? R"( xmlns="http://www.w3.org/2000/svg")" : "", css_class, figure_width,
                     std::ceil(height), figure_width, std::ceil(height));
  out += fmt::format("\n<title>{}</title>\n", escape_markup(title));
  out += R"(<rect width="100%" height="100%" fill="white"/>)";
  out += '\n';
  return out;
}

}  // namespace vibtherm::svg
