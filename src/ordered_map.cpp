// See ordered_map.hpp; the template lives in ordered_map_impl.hpp.
#include "vibtherm/ordered_map.hpp"

#include <thread>

namespace vibtherm {

unsigned default_thread_count() {
  const unsigned n = std::thread::hardware_concurrency();
  return n == 0 ? 1 : n;
}

}  // namespace vibtherm
