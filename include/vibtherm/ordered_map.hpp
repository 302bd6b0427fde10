// Runs one job per item on N threads of the standard library and hands the results to a
// consumer strictly in item order, holding at most a bounded window of finished results,
// so that a batch streams through in constant memory and the output is the same for any N.
#pragma once

#include <cstddef>
#include <functional>

namespace vibtherm {

// The threads to use when the user asks for none in particular: every core the system
// reports (at least 1).
unsigned default_thread_count();

// Calls produce(i) for i = 0..count−1 on `threads` threads (1: on the caller's thread)
// and consume(i, result) on the calling thread in ascending i. A worker runs at most
// `window` items ahead of the consumer (0: 4 per thread). An exception from produce or
// consume stops the run after the items in flight and is rethrown here: the one of the
// lowest item wins, so which error is reported does not depend on the thread count.
template <class Result>
void ordered_map(std::size_t count, unsigned threads, const std::function<Result(std::size_t)>& produce,
                 const std::function<void(std::size_t, Result&)>& consume, std::size_t window = 0);

}  // namespace vibtherm

#include "vibtherm/ordered_map_impl.hpp"
