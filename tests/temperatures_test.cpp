#include "vibtherm/temperatures.hpp"

#include <doctest/doctest.h>

#include "vibtherm/error.hpp"

using namespace vibtherm;

TEST_CASE("temperature lists") {
  CHECK(parse_temperatures("298.15,500") == std::vector<double>{298.15, 500.0});
  CHECK(parse_temperatures("300:600:100") == std::vector<double>{300, 400, 500, 600});
  CHECK(parse_temperatures("300:650:100") == std::vector<double>{300, 400, 500, 600});
  CHECK(parse_temperatures("298.15, 300:500:100") == std::vector<double>{298.15, 300, 400, 500});
  CHECK_THROWS_AS(parse_temperatures("0,300"), InputError);
  CHECK_THROWS_AS(parse_temperatures("-5"), InputError);
  CHECK_THROWS_AS(parse_temperatures("abc"), InputError);
  CHECK_THROWS_AS(parse_temperatures(""), InputError);
  CHECK_THROWS_AS(parse_temperatures("300:200:10"), InputError);
  CHECK_THROWS_AS(parse_temperatures("300:400:0"), InputError);
  CHECK_THROWS_AS(parse_temperatures("nan"), InputError);
}
