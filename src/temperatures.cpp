#include "vibtherm/temperatures.hpp"

#include <fmt/format.h>

#include <charconv>
#include <cmath>
#include <string>

#include "vibtherm/error.hpp"
#include "vibtherm/limits.hpp"

namespace vibtherm {

namespace {

double parse_number(std::string_view text, std::string_view whole) {
  while (!text.empty() && text.front() == ' ') text.remove_prefix(1);
  while (!text.empty() && text.back() == ' ') text.remove_suffix(1);
  if (!text.empty() && text.front() == '+') text.remove_prefix(1);
  double value = 0.0;
  const auto [end, ec] = std::from_chars(text.data(), text.data() + text.size(), value);
  if (text.empty() || ec != std::errc() || end != text.data() + text.size() || !std::isfinite(value))
    fail({},
         fmt::format("temperature list '{}': '{}' is not a number; expected e.g. 298.15,500 or 300:3000:100",
                     whole, text));
  return value;
}

double positive(double value, std::string_view whole) {
  if (!(value > 0.0))
    fail({}, fmt::format("temperature list '{}': temperatures must be positive, got {} K",
                         limits::display_name(whole), value));
  if (!(value >= limits::min_temperature_K && value <= limits::max_temperature_K))
    fail({},
         fmt::format("temperature list '{}': {:g} K is outside {:g} to {:g} K", limits::display_name(whole),
                     value, limits::min_temperature_K, limits::max_temperature_K));
  return value;
}

}  // namespace

std::vector<double> parse_temperatures(std::string_view text) {
  std::vector<double> temps;
  if (text.find_first_not_of(" ,") == std::string_view::npos)
    fail({}, "temperature list is empty; expected e.g. 298.15,500 or 300:3000:100");
  size_t start = 0;
  while (start <= text.size()) {
    size_t comma = text.find(',', start);
    if (comma == std::string_view::npos) comma = text.size();
    const std::string_view item = text.substr(start, comma - start);
    start = comma + 1;
    if (item.find_first_not_of(' ') == std::string_view::npos) continue;
    const size_t colon = item.find(':');
    if (colon == std::string_view::npos) {
      temps.push_back(positive(parse_number(item, text), text));
      continue;
    }
    const size_t colon2 = item.find(':', colon + 1);
    if (colon2 == std::string_view::npos || item.find(':', colon2 + 1) != std::string_view::npos)
      fail({}, fmt::format("temperature range '{}' must be START:STOP:STEP", item));
    const double first = positive(parse_number(item.substr(0, colon), text), text);
    const double last = positive(parse_number(item.substr(colon + 1, colon2 - colon - 1), text), text);
    const double step = parse_number(item.substr(colon2 + 1), text);
    if (!(step > 0.0) || last < first)
      fail({}, fmt::format("temperature range '{}' needs STOP >= START and a positive STEP", item));
    const double count = std::floor((last - first) / step + 1e-9);
    if (count > 1e6) fail({}, fmt::format("temperature range '{}' has more than a million points", item));
    for (int i = 0; i <= static_cast<int>(count); ++i) temps.push_back(first + i * step);
  }
  return temps;
}

}  // namespace vibtherm
