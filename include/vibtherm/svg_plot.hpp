// Drawing primitives shared by every SVG picture (`modes --svg`, the HTML report): one page
// geometry so temperature axes line up, 1-2-5 ticks, curves, legends that wrap instead of
// clipping, the viridis ramp and heat-map rows as one gradient-filled rectangle each.
#pragma once

#include <string>
#include <string_view>
#include <utility>
#include <vector>

namespace vibtherm::svg {

// Every picture is 800 units wide and shown at most at its natural width, so a unit is a
// pixel at 800 px and the type below stays at or above 11 px down to 700 px of page width.
inline constexpr double figure_width = 800.0;
inline constexpr double plot_left = 176.0;   // room for the heat map's row labels
inline constexpr double plot_right = 770.0;  // every picture's plot box spans the same x
inline constexpr double font_tick = 12.0;
inline constexpr double font_label = 13.0;
inline constexpr double font_title = 14.0;

// Viridis (van der Walt & Smith, matplotlib 1.5, 2015): perceptually uniform, readable by
// the common colour-vision deficiencies and in grey; its low end is a dark violet, so a
// frozen mode is as visible as an active one. Linear interpolation between the published
// table's entries 0, 16, ..., 255. `value` is clamped to [0, 1].
std::string viridis_hex(double value);

// A coordinate or length as written in the pictures: rounded to a tenth of a pixel, with no
// trailing ".0", no leading zero ("-.4") and no "-0", so that a page of a thousand species
// stays small. SVG's number grammar reads every form.
std::string num(double value);

// The text size every picture's root element sets (a presentation attribute, inherited):
// `text` leaves out the font-size of text in this size.
inline constexpr double font_default = font_tick;

// Style rules shared by every picture, by class: `halo` (a label over lines or colour, drawn
// with a white outline). A standalone picture carries them in its own <style>; the report
// puts them once in the page's style sheet.
const char* style_rules();

// Width of `text` in `font_px` sans-serif type, estimated generously (0.6 em per character,
// counting UTF-8 code points) so that layouts built on it do not overlap.
double text_width(std::string_view text, double font_px);

// One axis: data values mapped linearly (or in ln) onto a pixel interval.
class Axis {
 public:
  Axis(double low, double high, bool logarithmic, double px_low, double px_high);
  double operator()(double value) const;
  double low() const { return low_; }
  double high() const { return high_; }
  bool logarithmic() const { return log_; }
  // 1, 2, 5 × 10^k inside [low, high] (log), or a 1-2-5 step with at most `max_ticks`
  // intervals (linear); tick labels that would touch the previous one are left out by the drawers.
  std::vector<double> ticks(int max_ticks = 6) const;

 private:
  double low_, high_;
  bool log_;
  double px_low_, px_high_;
};

// A linear data interval widened to 1-2-5 tick marks that contains [low, high].
std::pair<double, double> nice_interval(double low, double high, int max_ticks = 6);

// Text as an SVG element; anchor "start", "middle" or "end". Markup in `text` is escaped.
std::string text(double x, double y, std::string_view content, double font_px,
                 std::string_view anchor = "start", std::string_view extra_attributes = {});

// The points of a curve that keep it within `tolerance_px` of every given point (the
// Ramer-Douglas-Peucker simplification); the first and last always stay.
std::vector<std::pair<double, double>> simplified(const std::vector<std::pair<double, double>>& points,
                                                  double tolerance_px);
inline constexpr double curve_tolerance_px = 0.2;  // a fifth of a pixel: no visible change

// A curve through the points (pixels), simplified to within curve_tolerance_px, as one
// <path> of relative moves between the rounded positions (no drift); stroke width and
// optional dash pattern.
std::string polyline(const std::vector<std::pair<double, double>>& points_px, std::string_view css_class,
                     std::string_view colour, double width, std::string_view dash = {});

std::string line(double x1, double y1, double x2, double y2, std::string_view colour, double width = 1.0,
                 std::string_view dash = {});

// Plot box [plot_left, plot_right] × [top, bottom] with horizontal grid and y tick labels
// (formatted by {:g}) at `y` ticks, vertical grid at `x` ticks, and the y title rotated at
// the left edge. Tick labels closer than their own height are thinned.
void plot_box(std::string& out, const Axis& x, const Axis& y, double top, double bottom,
              std::string_view y_title);

// Temperature tick labels and title under a plot box whose bottom edge is at `y_axis`;
// returns the height used below it.
double x_axis_labels(std::string& out, const Axis& x, double y_axis, std::string_view title);

// A legend entry: a line sample (colour, width, dash), a filled swatch (width 0) or a ring marker.
struct LegendEntry {
  std::string colour;
  double width = 2.0;
  std::string dash;
  std::string label;
  bool ring = false;
};
// Entries flow left to right from x, wrapping before `right`; returns the height used.
double legend(std::string& out, const std::vector<LegendEntry>& entries, double x, double top,
              double right = figure_width - 10.0);

// Heat-map row: one rectangle whose fill is a horizontal gradient through the viridis colours
// of `values` at the x positions (pixels, ascending). Identical rows share one gradient:
// `defs` collects the gradients and `known` remembers them (key = stop list).
struct GradientBook {
  std::string id_prefix;
  std::string defs;
  std::vector<std::pair<std::string, std::string>> known;  // stop list → id
};
std::string heat_row(GradientBook& book, const std::vector<double>& x_px, const std::vector<double>& values,
                     double left, double right, double top, double height);

// A gradient through the viridis colours of `values` at the x positions (pixels, ascending),
// with userSpaceOnUse ends x_from and x_to and a stop wherever the value has moved by
// `resolution` since the last one; the colours past its ends are those of its ends.
std::string viridis_gradient(std::string_view id, const std::vector<double>& x_px,
                             const std::vector<double>& values, double x_from, double x_to,
                             double resolution);

// Heat-map row filled by a gradient shared by rows of one shape, shifted by `shift_px`: a rectangle
// [left, right] × [top, top + height] drawn at x − shift and translated back, so the fill moves
// with the transform and the rectangle stays in place. One element per row, no gradient of its own.
std::string shifted_heat_row(std::string_view gradient_id, double shift_px, double left, double right,
                             double top, double height);

// Opening tag of a picture (root font-size font_default); standalone adds the XML declaration,
// the namespace and the style rules.
std::string open_svg(double height, bool standalone, std::string_view css_class, std::string_view title);

}  // namespace vibtherm::svg
