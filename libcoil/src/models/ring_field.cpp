#include "models/ring_field.hpp"

#include <algorithm>
#include <bit>
#include <cstdint>

#if defined(__x86_64__) && (defined(__GNUC__) || defined(__clang__))
#include <immintrin.h>
#define LIBCOIL_RING_FIELD_AVX 1
#endif

namespace libcoil::detail {

namespace {

// One offset from the tables, added to the running sums.
inline void add_offset(long k, double sigma, double& run_z, double& run_r, double* sz, double* sr) {
    const RingField h = ring_field(static_cast<double>(k) * sigma);
    run_z += h.z;
    run_r += h.r;
    sz[k] = run_z;
    sr[k] = run_r;
}

void running_sums_sse2(double sigma, long first, long n, double& run_z, double& run_r, double* sz, double* sr) {
    for (long k = first; k < n; ++k) add_offset(k, sigma, run_z, run_r, sz, sr);
}

#if defined(LIBCOIL_RING_FIELD_AVX)
// Estrin's scheme on four lanes (b H_z and b H_r of two offsets), in estrin_pair's order: the same bits. AVX
// without FMA, so that no product and sum are fused and every processor gives the same result.
template <int N>
__attribute__((target("avx"))) inline __m256d estrin_avx(const __m256d (&c)[N], __m256d w) {  // NOLINT(misc-no-recursion)
    if constexpr (N == 1) {
        return c[0];
    } else {
        constexpr int M = (N + 1) / 2;
        __m256d v[M];
#pragma GCC unroll 16
        for (int i = 0; i < N / 2; ++i) v[i] = _mm256_add_pd(c[2 * i], _mm256_mul_pd(c[2 * i + 1], w));
        if constexpr (N % 2 == 1) v[M - 1] = c[N - 1];
        return estrin_avx(v, _mm256_mul_pd(w, w));
    }
}

__attribute__((target("avx"))) void running_sums_avx(double sigma, long first, long n, double& run_z, double& run_r, double* sz,
                                                     double* sr) {
    namespace t = ring_field_tables;
    constexpr int terms = t::degree + 1;
    // Two offsets at a time while both lie in the body of the tables (the tail is rare: turns 128 radii apart).
    long body_end = n;
    while (body_end > first && static_cast<double>(body_end - 1) * sigma >= ring_table_high) --body_end;
    // octave_place for both offsets in one register: s = 2^e (1 + y), the part floor(parts y), w on it; the
    // same operations as the scalar form, so the same bits.
    const __m128d sig = _mm_set1_pd(sigma), two = _mm_set1_pd(2), one = _mm_set1_pd(1), parts = _mm_set1_pd(t::parts),
                  twice_parts = _mm_set1_pd(2 * t::parts);
    const __m128i mantissa = _mm_set1_epi64x((std::int64_t{1} << 52) - 1), one_bits = _mm_castpd_si128(one);
    const __m128i bias = _mm_set1_epi32(1023 + t::low_octave);
    __m128d run = _mm_setr_pd(run_z, run_r);
    // In blocks: first every offset's place in the tables (short, independent chains of integer and bit
    // operations), then the polynomials, whose loads no longer wait on those chains. The two were one loop
    // before, and the long chain from an offset to its sum left few offsets in flight at once.
    constexpr long block = 32;
    alignas(16) int index[block];
    alignas(16) double w_at[block];
    long k = first;
    while (k + 1 < body_end) {
        const long count = std::min(block, (body_end - k) & ~1L);  // pairs
        __m128d kv = _mm_setr_pd(static_cast<double>(k), static_cast<double>(k + 1));
        for (long j = 0; j < count; j += 2, kv = _mm_add_pd(kv, two)) {
            const __m128i bits = _mm_castpd_si128(_mm_mul_pd(kv, sig));
            const __m128d y = _mm_sub_pd(_mm_castsi128_pd(_mm_or_si128(_mm_and_si128(bits, mantissa), one_bits)), one);
            const __m128i part = _mm_cvttpd_epi32(_mm_mul_pd(y, parts));  // in the two low 32-bit lanes
            const __m128d odd = _mm_add_pd(_mm_add_pd(_mm_cvtepi32_pd(part), _mm_cvtepi32_pd(part)), one);  // 2 part + 1
            _mm_store_pd(w_at + j, _mm_sub_pd(_mm_mul_pd(y, twice_parts), odd));
            const __m128i octave = _mm_sub_epi32(_mm_shuffle_epi32(_mm_srli_epi64(bits, 52), _MM_SHUFFLE(3, 3, 2, 0)), bias);
            _mm_storel_epi64(reinterpret_cast<__m128i*>(index + j),
                             _mm_add_epi32(_mm_slli_epi32(octave, std::countr_zero(static_cast<unsigned>(t::parts))), part));
        }
        for (long j = 0; j < count; j += 2, k += 2) {
            const auto& c0 = t::body[index[j]];
            const auto& c1 = t::body[index[j + 1]];
            __m256d v[terms];
#pragma GCC unroll 16
            for (int i = 0; i < terms; ++i) v[i] = _mm256_insertf128_pd(_mm256_castpd128_pd256(_mm_loadu_pd(c0[i])), _mm_loadu_pd(c1[i]), 1);
            const __m256d wv = _mm256_setr_pd(w_at[j], w_at[j], w_at[j + 1], w_at[j + 1]);
            const __m256d r = estrin_avx(v, wv);
            run = _mm_add_pd(run, _mm256_castpd256_pd128(r));  // (run_z, run_r) + the first offset's (z, r)
            _mm_storel_pd(sz + k, run);
            _mm_storeh_pd(sr + k, run);
            run = _mm_add_pd(run, _mm256_extractf128_pd(r, 1));
            _mm_storel_pd(sz + k + 1, run);
            _mm_storeh_pd(sr + k + 1, run);
        }
    }
    run_z = _mm_cvtsd_f64(run);
    run_r = _mm_cvtsd_f64(_mm_unpackhi_pd(run, run));
    for (; k < n; ++k) add_offset(k, sigma, run_z, run_r, sz, sr);
}
#endif

}  // namespace

void ring_field_running_sums(double sigma, long first, long n, double& run_z, double& run_r, double* sz, double* sr) {
#if defined(LIBCOIL_RING_FIELD_AVX)
    static const bool avx = __builtin_cpu_supports("avx");
    if (avx) {
        running_sums_avx(sigma, first, n, run_z, run_r, sz, sr);
        return;
    }
#endif
    running_sums_sse2(sigma, first, n, run_z, run_r, sz, sr);
}

}  // namespace libcoil::detail
