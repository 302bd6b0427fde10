// libFuzzer entry point for the NASA-7/NASA-9 reader. A malformed input must end in an
// InputError or a listed bad record; any other exception, a crash or a sanitizer report
// is a bug. Whatever the reader accepts must be evaluable and checkable.
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <string>

#include "vibtherm/error.hpp"
#include "vibtherm/nasa_checks.hpp"
#include "vibtherm/read_nasa.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  try {
    const auto file = vibtherm::read_nasa_records(text, "fuzz.dat");
    if (file.lines.size() != file.species.size()) __builtin_trap();
    for (const auto& polynomial : file.species) {
      if (vibtherm::polynomial_name(polynomial).empty()) __builtin_trap();
      const double low = vibtherm::polynomial_T_min_K(polynomial);
      const double high = vibtherm::polynomial_T_max_K(polynomial);
      if (!(low > 0.0) || !(high > 0.0)) __builtin_trap();
      (void)vibtherm::polynomial_at(polynomial, 0.5 * (low + high));
      (void)vibtherm::nasa_sanity_warnings(polynomial);
    }
  } catch (const vibtherm::InputError&) {
  }
  return 0;
}
