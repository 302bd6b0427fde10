// libFuzzer entry point for the NASA-7/NASA-9 reader. A malformed input must end in an
// InputError; any other exception, a crash or a sanitizer report is a bug. Whatever the
// reader accepts must be evaluable inside its own range.
#include <cstddef>
#include <cstdint>
#include <string>

#include "vibtherm/error.hpp"
#include "vibtherm/read_nasa.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  try {
    for (const auto& polynomial : vibtherm::read_nasa(text, "fuzz.dat")) {
      if (vibtherm::polynomial_name(polynomial).empty()) __builtin_trap();
      const double low = vibtherm::polynomial_T_min_K(polynomial);
      const double high = vibtherm::polynomial_T_max_K(polynomial);
      if (!(low > 0.0) || !(high >= low)) __builtin_trap();
      (void)vibtherm::polynomial_at(polynomial, 0.5 * (low + high));
    }
  } catch (const vibtherm::InputError&) {
  }
  return 0;
}
