#include "vibtherm/markup.hpp"

#include <doctest/doctest.h>

using namespace vibtherm;

TEST_CASE("escape_markup covers the five XML specials") {
  CHECK(escape_markup(R"(a<b>&"c'd)") == "a&lt;b&gt;&amp;&quot;c&#39;d");
  CHECK(escape_markup("ΔfH° plain") == "ΔfH° plain");
}
