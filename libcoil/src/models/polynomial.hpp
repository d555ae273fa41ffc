// Internal: a polynomial of a table part by Estrin's scheme, and the place of a number in a table over octaves,
// shared by the tabulated kernels (wire_kernels.hpp, ring_field.hpp, helical_line.cpp), whose generators measure
// their tables with this same order of operations.
#pragma once

#include <bit>
#include <cstdint>

#if defined(__SSE2__)
#include <emmintrin.h>
#endif

namespace libcoil::detail {

// One step of Estrin's scheme, c0 + c1 w, and w^2, for a double or an SSE2 pair of doubles. Always inlined:
// left to GCC at -O2 they stayed calls, and the batch's full chain ran 7 % slower (measured).
[[gnu::always_inline]] inline double add_product(double c0, double c1, double w) { return c0 + c1 * w; }
[[gnu::always_inline]] inline double squared(double w) { return w * w; }
#if defined(__SSE2__)
[[gnu::always_inline]] inline __m128d add_product(__m128d c0, __m128d c1, __m128d w) { return _mm_add_pd(c0, _mm_mul_pd(c1, w)); }
[[gnu::always_inline]] inline __m128d squared(__m128d w) { return _mm_mul_pd(w, w); }
#endif

// Lowest power first: pairs c[2i] + c[2i+1] w, then pairs of those with w^2, and so on; a dependency chain
// of about log2(N) steps instead of Horner's N. V is double, or __m128d for two polynomials side by side
// (ring_field.cpp has the AVX form, which needs its target attribute).
template <class V, int N>
inline V estrin(const V (&c)[N], V w) {  // NOLINT(misc-no-recursion): depth log2(N)
    if constexpr (N == 1) {
        return c[0];
    } else {
        // One level: the pairs, then the same on them with w^2 (unrolled: GCC at -O2 left this a loop through
        // the stack, which cost the table half its speed).
        constexpr int M = (N + 1) / 2;
        V v[M];
#pragma GCC unroll 16
        for (int i = 0; i < N / 2; ++i) v[i] = add_product(c[2 * i], c[2 * i + 1], w);
        if constexpr (N % 2 == 1) v[M - 1] = c[N - 1];
        return estrin(v, squared(w));
    }
}

// Two polynomials of the same degree in the same w at once, their coefficients side by side (c[i][0] of the
// first, c[i][1] of the second): one SSE2 instruction does each step of both, in the same order as estrin, so
// the results are estrin's to the bit.
struct PolynomialPair {
    double first, second;
};

template <int N>
inline PolynomialPair estrin_pair(const double (&c)[N][2], double w) {
#if defined(__SSE2__)
    __m128d v[N];
#pragma GCC unroll 16
    for (int i = 0; i < N; ++i) v[i] = _mm_loadu_pd(c[i]);
    const __m128d r = estrin(v, _mm_set1_pd(w));
    return {_mm_cvtsd_f64(r), _mm_cvtsd_f64(_mm_unpackhi_pd(r, r))};
#else
    double a[N], b[N];
    for (int i = 0; i < N; ++i) {
        a[i] = c[i][0];
        b[i] = c[i][1];
    }
    return {estrin(a, w), estrin(b, w)};
#endif
}

// 2^e exactly, for the bounds of a table over octaves (|e| < 63).
constexpr double power_of_two(int e) {
    return e >= 0 ? static_cast<double>(std::uint64_t{1} << e) : 1.0 / static_cast<double>(std::uint64_t{1} << -e);
}

// Tables over octaves (tools/octave_tables.py): each octave [2^e, 2^(e+1)) from 2^low_octave up is cut into
// `parts` equal parts (a power of two). For s = 2^e (1 + y), y in [0, 1), the part's index and w in [-1, 1] on
// it come from the bits of s, all exactly. s must be a normal number at or above 2^low_octave (not checked).
struct OctavePlace {
    int index;
    double w;
};
template <int low_octave, int parts>
inline OctavePlace octave_place(double s) {
    static_assert(parts > 0 && (parts & (parts - 1)) == 0, "parts come in a power of two");
    const auto bits = std::bit_cast<std::uint64_t>(s);
    const int e = static_cast<int>(bits >> 52) - 1023;
    constexpr std::uint64_t mantissa = (std::uint64_t{1} << 52) - 1, one = std::bit_cast<std::uint64_t>(1.0);
    const double y = std::bit_cast<double>((bits & mantissa) | one) - 1;
    const int part = static_cast<int>(y * parts);
    return {(e - low_octave) * parts + part, y * (2 * parts) - (2 * part + 1)};
}

}  // namespace libcoil::detail
