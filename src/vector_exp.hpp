// exp and expm1 of many arguments at once, for the engine's per-temperature loops (one
// exponential per mode or level): glibc's vector math library (libmvec) where the build
// found it, two lanes with the SSE2 every x86-64 has; std::exp/std::expm1 elsewhere. The
// vector forms are within 4 ulp of the scalar ones (glibc manual, "Errors in Math
// Functions"), far below the 1e-12 the engine's results are compared at.
#pragma once

#include <cstddef>

namespace vibtherm::detail {

// out[i] = exp(−x[i]) for i < n (x and out may be the same array).
void exp_of_negated(const double* x, double* out, std::size_t n);
// out[i] = expm1(−x[i]) = e^{−x} − 1, accurate for small x.
void expm1_of_negated(const double* x, double* out, std::size_t n);

}  // namespace vibtherm::detail
