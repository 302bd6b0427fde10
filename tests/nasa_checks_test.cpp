#include "vibtherm/nasa_checks.hpp"

#include <doctest/doctest.h>

using namespace vibtherm;

namespace {
// Ar as a NASA-7 record: Cp/R = 5/2 (common practice), a6, a7 from the GRI-Mech 3.0 record (from memory).
Nasa7 argon() {
  Nasa7 n;
  n.name = "AR";
  n.T_low_K = 300;
  n.T_mid_K = 1000;
  n.T_high_K = 5000;
  n.low = {2.5, 0, 0, 0, 0, -745.375, 4.366};
  n.high = n.low;
  return n;
}
bool has(const std::vector<std::string>& w, const std::string& part) {
  for (const auto& s : w)
    if (s.find(part) != std::string::npos) return true;
  return false;
}
}  // namespace

TEST_CASE("a sound polynomial has no findings") { CHECK(nasa_sanity_warnings(argon()).empty()); }

TEST_CASE("jumps at T_mid") {
  Nasa7 n = argon();
  n.high[0] = 2.6;                    // Cp jumps by 4 %
  n.high[5] = -745.375 + 0.1 * 1000;  // with a1, H/R moves by 200 K
  const auto w = nasa_sanity_warnings(n);
  CHECK(has(w, "Cp jumps by 4 % at T_mid 1000 K"));
  CHECK(has(w, "H jumps by"));
  CHECK(has(w, "S jumps by"));
}

TEST_CASE("Cp below 5/2 R for a gas, negative anywhere") {
  Nasa7 n = argon();
  n.low[0] = n.high[0] = 2.0;
  CHECK(has(nasa_sanity_warnings(n), "below 5/2 R"));
  n.phase = 'S';  // a solid may have less
  CHECK(!has(nasa_sanity_warnings(n), "below 5/2 R"));
  n.low[0] = n.high[0] = -1.0;
  CHECK(has(nasa_sanity_warnings(n), "Cp is negative"));
}

TEST_CASE("implausible entropy, inverted and empty ranges") {
  Nasa7 n = argon();
  n.low[6] = n.high[6] = 2000.0;
  CHECK(has(nasa_sanity_warnings(n), "implausibly large"));
  n.low[6] = n.high[6] = -100.0;
  CHECK(has(nasa_sanity_warnings(n), "S is not positive"));
  n = argon();
  n.T_high_K = 200;
  CHECK(has(nasa_sanity_warnings(n), "inverted"));
  n.T_high_K = 300;
  CHECK(has(nasa_sanity_warnings(n), "empty"));
  Nasa9 m;
  m.name = "X";
  m.ranges.push_back({1000, 500, {0, 0, 2.5, 0, 0, 0, 0}, 0, 5});
  CHECK(has(nasa_sanity_warnings(m), "interval 1 (1000-500 K) is inverted"));
}
