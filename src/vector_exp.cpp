#include "vector_exp.hpp"

#include <cmath>

#if defined(VIBTHERM_HAVE_LIBMVEC) && defined(__x86_64__)
#include <emmintrin.h>
// libmvec's two-lane forms (x86_64 vector function ABI, SSE2 variant 'b').
extern "C" __m128d _ZGVbN2v_exp(__m128d);
extern "C" __m128d _ZGVbN2v_expm1(__m128d);
#define VIBTHERM_VECTOR_EXP 1
#endif

namespace vibtherm::detail {

namespace {

double scalar_exp(double v) { return std::exp(v); }
double scalar_expm1(double v) { return std::expm1(v); }

#ifdef VIBTHERM_VECTOR_EXP
using VectorFunction = __m128d (*)(__m128d);
#else
using VectorFunction = void*;
#endif

// out[i] = f(−x[i]): pairs through the vector form, a last odd one through the scalar.
void of_negated([[maybe_unused]] VectorFunction vector, double (*scalar)(double), const double* x,
                double* out, std::size_t n) {
  std::size_t i = 0;
#ifdef VIBTHERM_VECTOR_EXP
  const __m128d sign = _mm_set1_pd(-0.0);
  for (; i + 2 <= n; i += 2) _mm_storeu_pd(out + i, vector(_mm_xor_pd(_mm_loadu_pd(x + i), sign)));
#endif
  for (; i < n; ++i) out[i] = scalar(-x[i]);
}

}  // namespace

#ifdef VIBTHERM_VECTOR_EXP
void exp_of_negated(const double* x, double* out, std::size_t n) {
  of_negated(_ZGVbN2v_exp, scalar_exp, x, out, n);
}
void expm1_of_negated(const double* x, double* out, std::size_t n) {
  of_negated(_ZGVbN2v_expm1, scalar_expm1, x, out, n);
}
#else
void exp_of_negated(const double* x, double* out, std::size_t n) {
  of_negated(nullptr, scalar_exp, x, out, n);
}
void expm1_of_negated(const double* x, double* out, std::size_t n) {
  of_negated(nullptr, scalar_expm1, x, out, n);
}
#endif

}  // namespace vibtherm::detail
