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

#ifdef VIBTHERM_VECTOR_EXP
template <__m128d (*f)(__m128d), double (*scalar)(double)>
void apply(const double* x, double* out, std::size_t n) {
  const __m128d sign = _mm_set1_pd(-0.0);
  std::size_t i = 0;
  for (; i + 2 <= n; i += 2) _mm_storeu_pd(out + i, f(_mm_xor_pd(_mm_loadu_pd(x + i), sign)));
  for (; i < n; ++i) out[i] = scalar(-x[i]);
}
#endif

double scalar_exp(double v) { return std::exp(v); }
double scalar_expm1(double v) { return std::expm1(v); }

}  // namespace

void exp_of_negated(const double* x, double* out, std::size_t n) {
#ifdef VIBTHERM_VECTOR_EXP
  apply<_ZGVbN2v_exp, scalar_exp>(x, out, n);
#else
  for (std::size_t i = 0; i < n; ++i) out[i] = scalar_exp(-x[i]);
#endif
}

void expm1_of_negated(const double* x, double* out, std::size_t n) {
#ifdef VIBTHERM_VECTOR_EXP
  apply<_ZGVbN2v_expm1, scalar_expm1>(x, out, n);
#else
  for (std::size_t i = 0; i < n; ++i) out[i] = scalar_expm1(-x[i]);
#endif
}

}  // namespace vibtherm::detail
