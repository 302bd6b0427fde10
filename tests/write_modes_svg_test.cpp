#include "vibtherm/write_modes_svg.hpp"

#include <doctest/doctest.h>

#include <array>
#include <cmath>
#include <regex>
#include <string>

#include "svg_layout.hpp"
#include "test_species.hpp"

using namespace vibtherm;

namespace {

size_t count_of(const std::string& text, const std::string& what) {
  size_t n = 0;
  for (size_t at = text.find(what); at != std::string::npos; at = text.find(what, at + what.size())) ++n;
  return n;
}

// A nonlinear gas with `n` vibrations spread from 40 to 3600 cm^-1 and `rotors` hindered
// rotors, sampled like the pictures are (the values need only be plausible for layout).
ModesReport synthetic(int n, int rotors = 0) {
  ModesReport r;
  r.name = "synthetic";
  r.rotor = RotorType::nonlinear;
  r.classical = {3, 3, 2.0 * n, 1.0 * rotors, 6.0 + 2.0 * n + rotors, 0};
  for (int i = 0; i < n; ++i) {
    ModeConstants m;
    m.index = i + 1;
    m.input_position = n - i;
    m.wavenumber_cm1 = 40.0 * std::pow(90.0, n > 1 ? static_cast<double>(i) / (n - 1) : 0.5);
    m.theta_K = 1.4388 * m.wavenumber_cm1;  // hc/k in cm K (CODATA 2018, rounded)
    m.half_active_at_K = m.theta_K / 2.8;
    r.modes.push_back(m);
  }
  for (int k = 0; k < rotors; ++k) r.rotors.push_back({k + 1, {1, 2 + k}, 3, 250.0});
  for (double T : log_spaced_temperatures(200.0, 3000.0, 97)) {
    ModesPoint p;
    p.T_K = T;
    p.dof = {3, 3, 0, 0, 6, 0};
    for (const auto& m : r.modes) {
      const double cv = einstein_Cv_over_R(m.theta_K / T);
      p.modes.push_back({cv, cv < 0.1   ? ModeState::frozen
                             : cv > 0.9 ? ModeState::active
                                        : ModeState::partial});
      p.dof.vibration += 2 * cv;
    }
    for (int k = 0; k < rotors; ++k) p.rotors_Cv_over_R.push_back(0.5 + 0.5 * std::exp(-T / 600.0));
    p.dof.hindered_rotors = rotors * (1.0 + std::exp(-T / 600.0));
    p.dof.total = 6 + p.dof.vibration + p.dof.hindered_rotors;
    r.points.push_back(p);
  }
  return r;
}

struct HeatRow {
  double x = 0, shift = 0;
  std::string fill;
};

// The rectangles of the heat-map group: x, the translation of a shifted row, the fill.
std::vector<HeatRow> heat_rows(const std::string& svg) {
  std::vector<HeatRow> out;
  const size_t from = svg.find("<g class=\"heat-map\""), to = svg.find("</g>", from);
  static const std::regex rect(
      R"~(<rect x="([-0-9.]+)"[^>]*?(?:transform="translate\(([-0-9.]+)\)")? fill="([^"]*)")~");
  const std::string group = svg.substr(from, to - from);
  for (auto it = std::sregex_iterator(group.begin(), group.end(), rect); it != std::sregex_iterator(); ++it)
    out.push_back({std::stod((*it)[1]), (*it)[2].matched ? std::stod((*it)[2]) : 0.0, (*it)[3]});
  return out;
}

// Colour of a userSpaceOnUse gradient `id` at x (pixels), interpolated in sRGB between its stops
// and padded by its end colours, as a renderer draws it.
std::array<double, 3> gradient_colour(const std::string& svg, const std::string& id, double x) {
  const size_t at = svg.find("<linearGradient id=\"" + id + "\"");
  const std::string g = svg.substr(at, svg.find("</linearGradient>", at) - at);
  std::smatch m;
  static const std::regex ends(R"~(x1="([-0-9.]+)" y1="0" x2="([-0-9.]+)")~");
  std::regex_search(g, m, ends);
  const double x1 = std::stod(m[1]), x2 = std::stod(m[2]);
  static const std::regex stop(R"~(<stop offset="([0-9.]+)" stop-color="#([0-9a-f]{6})"/>)~");
  std::vector<std::pair<double, std::array<double, 3>>> stops;
  for (auto it = std::sregex_iterator(g.begin(), g.end(), stop); it != std::sregex_iterator(); ++it) {
    const std::string hex = (*it)[2];
    std::array<double, 3> c{};
    for (int k = 0; k < 3; ++k)
      c[static_cast<size_t>(k)] = std::stoi(hex.substr(2 * static_cast<size_t>(k), 2), nullptr, 16);
    stops.emplace_back(std::stod((*it)[1]), c);
  }
  const double f = (x - x1) / (x2 - x1);
  if (f <= stops.front().first) return stops.front().second;
  for (size_t i = 1; i < stops.size(); ++i)
    if (f <= stops[i].first) {
      const double w = (f - stops[i - 1].first) / (stops[i].first - stops[i - 1].first);
      std::array<double, 3> c{};
      for (size_t k = 0; k < 3; ++k)
        c[k] = stops[i - 1].second[k] + w * (stops[i].second[k] - stops[i - 1].second[k]);
      return c;
    }
  return stops.back().second;
}

}  // namespace

TEST_CASE("modes picture: a shifted harmonic row shows each mode's own Cv/R") {
  // Every harmonic row shares one gradient (the Einstein function, Einstein 1907); read back at
  // each sampled temperature it must give the colour of that mode's Cv/R there (viridis_hex).
  const ModesReport r = synthetic(25);
  const std::string svg = modes_to_svg({r});
  const auto rows = heat_rows(svg);
  REQUIRE(rows.size() == 25);
  const svg::Axis x(r.points.front().T_K, r.points.back().T_K, true, svg::plot_left, svg::plot_right);
  double worst = 0;
  for (size_t i = 0; i < rows.size(); ++i) {
    CHECK(rows[i].fill == "url(#h1)");
    for (const ModesPoint& p : r.points) {
      const auto shown = gradient_colour(svg, "h1", x(p.T_K) - rows[i].shift);
      const std::string hex = svg::viridis_hex(p.modes[i].Cv_over_R);
      for (size_t k = 0; k < 3; ++k)
        worst = std::max(worst, std::abs(shown[k] - std::stoi(hex.substr(1 + 2 * k, 2), nullptr, 16)));
    }
  }
  CHECK(worst <= 6.0);  // of 255 per channel: below a step the eye sees on the ramp
}

TEST_CASE("modes picture: labels never overlap, stay inside, and are at least 12 px, for 1 to 60 modes") {
  for (const auto& [modes, rotors] :
       std::vector<std::pair<int, int>>{{1, 0}, {3, 0}, {25, 0}, {60, 0}, {12, 2}}) {
    CAPTURE(modes);
    CAPTURE(rotors);
    const std::string svg = modes_to_svg({synthetic(modes, rotors)});
    const auto boxes = test::text_boxes(svg);
    const double height = test::svg_height(svg);
    CHECK(boxes.size() > static_cast<size_t>(modes));
    for (const auto& b : boxes) {
      CAPTURE(b.content);
      CHECK(b.font >= 12.0);
      CHECK(b.x0 >= 0.0);
      CHECK(b.x1 <= svg::figure_width);
      CHECK(b.y0 >= 0.0);
      CHECK(b.y1 <= height);
    }
    const auto clashes = test::overlaps(boxes);
    CHECK_MESSAGE(clashes.empty(), (clashes.empty() ? std::string() : clashes.front()));
    // Every vibration and rotor has its labelled row, each a single rectangle over the plot box.
    const auto rows = heat_rows(svg);
    CHECK(rows.size() == static_cast<size_t>(modes + rotors));
    for (const auto& r : rows) CHECK(r.x + r.shift == doctest::Approx(svg::plot_left).epsilon(1e-9));
    CHECK(count_of(svg, "<g") == count_of(svg, "</g>"));
  }
}

TEST_CASE("modes picture: rows are single rectangles with shared gradients, not cells") {
  const std::string svg = modes_to_svg({synthetic(60)});
  // 60 rows + the heat map frame + the colour bar + background + F(T) frame.
  CHECK(count_of(svg, "<rect ") <= 60 + 6);
  CHECK(svg.size() < 120000);
  CHECK(svg.find("mode · cm⁻¹ · input #") != std::string::npos);
  CHECK(svg.find(">60 · 3600 · #1<") != std::string::npos);  // ascending, input position shown
}

TEST_CASE("modes picture of a real species: rotor rows and curve, escaped names, axis title") {
  const auto prepared = prepare_species(test::water());
  auto water = analyse_modes(prepared, log_spaced_temperatures(100.0, 5000.0, 40));
  water.name = "H2O <bent> & co";
  const auto svg = modes_to_svg({water});
  CHECK(svg.rfind("<?xml", 0) == 0);
  CHECK(count_of(svg, "<svg ") == 1);
  CHECK(svg.find("H2O &lt;bent&gt; &amp; co") != std::string::npos);
  CHECK(svg.find("<bent>") == std::string::npos);
  CHECK(count_of(svg, "class=\"total\"") == 1);
  CHECK(svg.find("12 all motions classical") != std::string::npos);
  CHECK(svg.find("temperature T / K (logarithmic scale)") != std::string::npos);
  const auto with_rotors = modes_to_svg({synthetic(5, 2)});
  CHECK(count_of(with_rotors, "class=\"hindered-rotors\"") == 1);
  CHECK(with_rotors.find("rotor 1–2, σ = 3") != std::string::npos);
  CHECK(with_rotors.find("2 per rotor as oscillators → 1 as free rotors") != std::string::npos);
}

TEST_CASE("SVG temperature span") {
  CHECK(svg_temperature_span_K({50.0, 3000.0}) == std::pair{50.0, 3000.0});
  const auto [low, high] = svg_temperature_span_K({298.15});
  CHECK(high / low == doctest::Approx(10.0));
  CHECK(std::sqrt(low * high) == doctest::Approx(298.15));
}
