// The template part of ordered_map.hpp: a ring of result slots guarded by one mutex.
#pragma once

#include <condition_variable>
#include <exception>
#include <mutex>
#include <optional>
#include <thread>
#include <vector>

namespace vibtherm {

template <class Result>
void ordered_map(std::size_t count, unsigned threads, const std::function<Result(std::size_t)>& produce,
                 const std::function<void(std::size_t, Result&)>& consume, std::size_t window) {
  if (threads <= 1 || count <= 1) {
    for (std::size_t i = 0; i < count; ++i) {
      Result r = produce(i);
      consume(i, r);
    }
    return;
  }
  if (window == 0) window = 4 * static_cast<std::size_t>(threads);
  struct Slot {
    std::optional<Result> value;
    std::exception_ptr error;
    bool done = false;
  };
  std::vector<Slot> ring(window);
  std::mutex mutex;
  std::condition_variable ready, room;
  std::size_t next = 0;      // next item to hand to a worker
  std::size_t consumed = 0;  // items consumed so far
  bool stop = false;

  auto worker = [&] {
    while (true) {
      std::size_t i = 0;
      {
        std::unique_lock lock(mutex);
        room.wait(lock, [&] { return stop || next >= count || next < consumed + window; });
        if (stop || next >= count) return;
        i = next++;
      }
      Slot result;
      try {
        result.value.emplace(produce(i));
      } catch (...) {
        result.error = std::current_exception();
      }
      result.done = true;
      {
        std::lock_guard lock(mutex);
        ring[i % window] = std::move(result);
      }
      ready.notify_all();
    }
  };
  std::vector<std::thread> pool;
  pool.reserve(threads);
  for (unsigned t = 0; t < threads; ++t) pool.emplace_back(worker);

  std::exception_ptr failure;
  for (std::size_t i = 0; i < count && !failure; ++i) {
    Slot slot;
    {
      std::unique_lock lock(mutex);
      ready.wait(lock, [&] { return ring[i % window].done; });
      slot = std::move(ring[i % window]);
      ring[i % window] = Slot{};
    }
    if (slot.error) {
      failure = slot.error;
    } else {
      try {
        consume(i, *slot.value);
      } catch (...) {
        failure = std::current_exception();
      }
    }
    {
      std::lock_guard lock(mutex);
      consumed = i + 1;
      if (failure) stop = true;
    }
    room.notify_all();
  }
  for (auto& t : pool) t.join();
  if (failure) std::rethrow_exception(failure);
}

}  // namespace vibtherm
