// Internal: the complete elliptic integrals K(k) and K(k) - E(k) that Nagaoka's coefficient, Maxwell's
// mutual inductance and the proximity ring field need, from the complementary modulus k'.
//
// Every caller knows k' (or k'^2 = 1 - k^2) more accurately than k itself, as it comes straight from the
// geometry. Boost.Math's Carlson forms, K = R_F(0, k'^2, 1) and K - E = (k^2 / 3) R_D(0, k'^2, 1)
// (DLMF 19.25.1), give the same to an ulp or two; the pair below takes 35 ns where the two take 50, and a
// design search spends a tenth of its time here.
#pragma once

#include <cmath>
#include <cstddef>

#if defined(__SSE2__)
#include <emmintrin.h>
#endif

#include "libcoil/core/constants.hpp"

namespace libcoil::detail {

// K(k) and (K(k) - E(k)) / k^2 together by the arithmetic-geometric mean (DLMF 19.8.1 and 19.8.6), for a
// caller that knows both k' and m = k^2 without cancellation:
//   K = pi / (2 M(1, k')),  K - E = K sum_{n>=0} 2^(n-1) c_n^2,  c_0 = k,  c_{n+1} = (a_n - b_n) / 2.
// The sum is of positive terms, carried as c_n^2 / m so that nothing underflows at tiny k. a_n - b_n
// cancels only where c_n is already small beside c_0, so the sum keeps its digits (1 ulp or so). It
// converges quadratically: four to six square roots, about 35 ns where R_F and R_D take 50.
struct EllipticPair {
    double k, k_minus_e_over_m;
};
// `kc` is k' = sqrt(m'), which callers often have at hand.
inline EllipticPair elliptic_k_and_k_minus_e_over_m(double kc, double m) {
    // Below m = 1e-16 the series' first terms are exact in double (and 1/m could overflow).
    if (m < 1e-16) return {pi / 2 * (1 + m / 4), pi / 4 * (1 + 3 * m / 8)};
    const double inv_m = 1 / m;
    double a = 1, b = kc, w = 0.5, sum = 0.5;  // w = 2^(n-1)
    for (int n = 0; n < 60; ++n) {
        const double c = 0.5 * (a - b);  // c_{n+1}
        const double next = 0.5 * (a + b);
        b = std::sqrt(a * b);
        a = next;
        w *= 2;
        const double term = w * c * c * inv_m;
        sum += term;
        if (term <= 1e-17 * sum) break;  // the terms fall quadratically: the rest is below 1e-34 of the sum
    }
    return {pi / (2 * a), pi / (2 * a) * sum};
}

// The same for `lanes` independent moduli at once (an even number). The square roots of one AGM wait on
// each other; those of several interleave, two to an SSE2 instruction where the target has it (every
// x86-64 does), so eight pairs take about half as long each as one alone. A lane that has converged
// keeps iterating harmlessly: its terms no longer change the sum. `reciprocal_m`, where given, holds
// 1 / m (a caller that has it spares the divisions).
template <std::size_t lanes>
void elliptic_pairs(const double* kc, const double* m, EllipticPair* out, const double* reciprocal_m = nullptr) {
    static_assert(lanes % 2 == 0, "lanes come in pairs");
    bool small = false;  // a lane below m = 1e-16 takes the scalar form's series at the end
#if defined(__SSE2__)
    constexpr std::size_t v = lanes / 2;
    __m128d a[v], b[v], sum[v], im[v];
    const __m128d half = _mm_set1_pd(0.5), one = _mm_set1_pd(1), eps = _mm_set1_pd(1e-17), tiny = _mm_set1_pd(1e-16);
    for (std::size_t j = 0; j < v; ++j) {
        const __m128d mj = _mm_loadu_pd(m + 2 * j), below = _mm_cmplt_pd(mj, tiny);
        small = small || _mm_movemask_pd(below) != 0;
        const __m128d r = reciprocal_m ? _mm_loadu_pd(reciprocal_m + 2 * j) : _mm_div_pd(one, mj);
        im[j] = _mm_andnot_pd(below, r);  // 0 in a small lane, whose sum is replaced below
        a[j] = one;
        b[j] = _mm_loadu_pd(kc + 2 * j);
        sum[j] = half;
    }
    double w = 0.5;
    for (int n = 0; n < 60; ++n) {
        w *= 2;
        const __m128d wv = _mm_set1_pd(w);
        int going = 0;
        for (std::size_t j = 0; j < v; ++j) {
            const __m128d c = _mm_mul_pd(half, _mm_sub_pd(a[j], b[j]));
            const __m128d next = _mm_mul_pd(half, _mm_add_pd(a[j], b[j]));
            b[j] = _mm_sqrt_pd(_mm_mul_pd(a[j], b[j]));
            a[j] = next;
            const __m128d term = _mm_mul_pd(_mm_mul_pd(wv, _mm_mul_pd(c, c)), im[j]);
            sum[j] = _mm_add_pd(sum[j], term);
            going |= _mm_movemask_pd(_mm_cmpgt_pd(term, _mm_mul_pd(eps, sum[j])));
        }
        if (!going) break;
    }
    const __m128d half_pi = _mm_set1_pd(pi / 2);
    for (std::size_t j = 0; j < v; ++j) {
        const __m128d k = _mm_div_pd(half_pi, a[j]), kme = _mm_mul_pd(k, sum[j]);
        _mm_storel_pd(&out[2 * j].k, k);
        _mm_storel_pd(&out[2 * j].k_minus_e_over_m, kme);
        _mm_storeh_pd(&out[2 * j + 1].k, k);
        _mm_storeh_pd(&out[2 * j + 1].k_minus_e_over_m, kme);
    }
#else
    double a[lanes], b[lanes], sum[lanes], inv_m[lanes];
    for (std::size_t j = 0; j < lanes; ++j) {
        small = small || m[j] < 1e-16;
        inv_m[j] = m[j] < 1e-16 ? 0 : reciprocal_m ? reciprocal_m[j] : 1 / m[j];
        a[j] = 1;
        b[j] = kc[j];
        sum[j] = 0.5;
    }
    double w = 0.5;
    for (int n = 0; n < 60; ++n) {
        w *= 2;
        int going = 0;
        for (std::size_t j = 0; j < lanes; ++j) {
            const double c = 0.5 * (a[j] - b[j]);
            const double next = 0.5 * (a[j] + b[j]);
            b[j] = std::sqrt(a[j] * b[j]);
            a[j] = next;
            const double term = w * c * c * inv_m[j];
            sum[j] += term;
            going |= term > 1e-17 * sum[j];
        }
        if (!going) break;
    }
    for (std::size_t j = 0; j < lanes; ++j) {
        const double k = pi / (2 * a[j]);
        out[j] = EllipticPair{k, k * sum[j]};
    }
#endif
    if (small) {
        for (std::size_t j = 0; j < lanes; ++j) {
            if (m[j] < 1e-16) out[j] = elliptic_k_and_k_minus_e_over_m(kc[j], m[j]);
        }
    }
}

}  // namespace libcoil::detail
