#include "vibtherm/svg_plot.hpp"

#include <doctest/doctest.h>

#include <string>

#include "svg_layout.hpp"

using namespace vibtherm;

TEST_CASE("viridis: the published table's ends and middle, clamped outside [0, 1]") {
  // matplotlib _viridis_data entries 0, 128 and 255 (van der Walt & Smith 2015), as 8-bit sRGB.
  CHECK(svg::viridis_hex(0.0) == "#440154");
  CHECK(svg::viridis_hex(0.5) == "#21918c");
  CHECK(svg::viridis_hex(1.0) == "#fde725");
  CHECK(svg::viridis_hex(-3.0) == "#440154");
  CHECK(svg::viridis_hex(7.0) == "#fde725");
  // The low end is dark, so a frozen mode is not near-white: the mean channel of 0.05 is
  // below a quarter of white.
  const std::string low = svg::viridis_hex(0.05);
  int sum = 0;
  for (int channel = 0; channel < 3; ++channel) sum += std::stoi(low.substr(1 + 2 * channel, 2), nullptr, 16);
  CHECK(sum < 3 * 70);
}

TEST_CASE("axis ticks: 1-2-5 on a log axis, a 1-2-5 step on a linear one") {
  const svg::Axis log(200.0, 3000.0, true, 0.0, 100.0);
  CHECK(log.ticks() == std::vector<double>{200.0, 500.0, 1000.0, 2000.0});
  CHECK(log(200.0) == doctest::Approx(0.0));
  CHECK(log(3000.0) == doctest::Approx(100.0));
  const svg::Axis lin(-0.6, 0.6, false, 100.0, 0.0);
  CHECK(lin.ticks(4) == std::vector<double>{-0.5, 0.0, 0.5});
  CHECK(lin(0.0) == doctest::Approx(50.0));
  CHECK(svg::nice_interval(3.0, 87.0, 5) == std::pair{0.0, 100.0});
}

TEST_CASE("legend entries wrap before the right edge and never overlap") {
  std::vector<svg::LegendEntry> entries;
  for (int i = 0; i < 8; ++i)
    entries.push_back({"#000000", 2.0, "", "a fairly long legend label " + std::to_string(i)});
  std::string out;
  const double height = svg::legend(out, entries, 176.0, 0.0, 790.0);
  CHECK(height > 60.0);
  const auto boxes = test::text_boxes(out);
  CHECK(boxes.size() == 8);
  for (const auto& b : boxes) CHECK(b.x1 <= 790.0);
  CHECK(test::overlaps(boxes).empty());
}

TEST_CASE("heat rows: one rectangle each, identical rows share one gradient, flat rows no gradient") {
  svg::GradientBook book{"p-", {}, {}};
  const std::vector<double> x{10, 20, 30, 40}, rising{0.0, 0.3, 0.6, 1.0}, flat{0.0, 0.0, 0.0, 0.0};
  const std::string a = svg::heat_row(book, x, rising, 10, 40, 0, 16);
  const std::string b = svg::heat_row(book, x, rising, 10, 40, 16, 16);
  const std::string c = svg::heat_row(book, x, flat, 10, 40, 32, 16);
  CHECK(a.find("url(#p-row1)") != std::string::npos);
  CHECK(b.find("url(#p-row1)") != std::string::npos);
  CHECK(c.find("fill=\"#440154\"") != std::string::npos);
  CHECK(book.known.size() == 1);
  CHECK(book.defs.find("<stop offset=\"0\" stop-color=\"#440154\"/>") != std::string::npos);
  CHECK(book.defs.find("<stop offset=\"1\" stop-color=\"#fde725\"/>") != std::string::npos);
}

TEST_CASE("compact numbers, simplified curves, shifted rows") {
  CHECK(svg::num(176.0) == "176");
  CHECK(svg::num(-0.44) == "-.4");
  CHECK(svg::num(0.04) == "0");
  CHECK(svg::num(-0.04) == "0");
  CHECK(svg::num(12.25) == "12.3");
  // A straight run loses its inner points; a corner stays (Ramer-Douglas-Peucker, common practice).
  const std::vector<std::pair<double, double>> line{{0, 0}, {1, 1.05}, {2, 2}, {3, 3}, {4, 0}};
  const auto kept = svg::simplified(line, 0.2);
  CHECK(kept == std::vector<std::pair<double, double>>{{0, 0}, {3, 3}, {4, 0}});
  // Relative moves between the rounded points: 0,0 → 3,3 → 4,0.
  CHECK(svg::polyline(line, "c", "#000", 1).find(R"(d="M0 0l3 3 1-3")") != std::string::npos);
  const std::string row = svg::shifted_heat_row("g", 123.44, 176, 770, 40, 16);
  CHECK(row.find(R"(x="52.6")") != std::string::npos);  // 52.6 + 123.4 = 176
  CHECK(row.find(R"~(transform="translate(123.4)")~") != std::string::npos);
}
