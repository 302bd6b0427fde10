#include "vibtherm/ordered_map.hpp"

#include <doctest/doctest.h>

#include <atomic>
#include <stdexcept>
#include <string>
#include <vector>

using namespace vibtherm;

TEST_CASE("ordered_map hands results over in item order for any thread count") {
  for (unsigned threads : {1u, 2u, 3u, 8u}) {
    std::vector<std::size_t> seen;
    ordered_map<std::string>(
        500, threads, [](std::size_t i) { return std::to_string(i * i); },
        [&](std::size_t i, std::string& r) {
          CHECK(r == std::to_string(i * i));
          seen.push_back(i);
        });
    REQUIRE(seen.size() == 500);
    for (std::size_t i = 0; i < seen.size(); ++i) CHECK(seen[i] == i);
  }
}

TEST_CASE("ordered_map keeps workers within the window") {
  std::atomic<std::size_t> consumed{0};
  std::atomic<std::size_t> worst_lead{0};
  ordered_map<int>(
      2000, 4,
      [&](std::size_t i) {
        const std::size_t lead = i - std::min(i, consumed.load());
        std::size_t prev = worst_lead.load();
        while (lead > prev && !worst_lead.compare_exchange_weak(prev, lead)) {
        }
        return static_cast<int>(i);
      },
      [&](std::size_t i, int&) { consumed = i + 1; }, 8);
  CHECK(worst_lead.load() <= 8);
}

TEST_CASE("ordered_map reports the error of the lowest failing item") {
  for (unsigned threads : {1u, 2u, 5u}) {
    std::size_t last = 0;
    CHECK_THROWS_WITH(ordered_map<int>(
                          300, threads,
                          [](std::size_t i) {
                            if (i == 40 || i == 41 || i == 250) throw std::runtime_error(std::to_string(i));
                            return 0;
                          },
                          [&](std::size_t i, int&) { last = i; }),
                      "40");
    CHECK(last == 39);
  }
}
