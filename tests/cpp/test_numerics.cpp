// The library's internal numerical kernels, tested on their own: the elliptic pair against Boost.Math's
// Carlson forms, the tabulated ring field against the elliptic integrals, the Bessel series against
// Boost.Math, and the bracketed root finder against roots known in closed form.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <numbers>
#include <vector>

#include <boost/math/special_functions/bessel.hpp>
#include <boost/math/special_functions/ellint_rd.hpp>
#include <boost/math/special_functions/ellint_rf.hpp>

#include "models/bessel_ik.hpp"
#include "models/elliptic.hpp"
#include "models/monotone_root.hpp"
#include "models/ring_field.hpp"

namespace {

using libcoil::detail::elliptic_k_and_k_minus_e_over_m;
using libcoil::detail::monotone_root_newton;

// Secant steps only, from the guess and a probe beside it (what bracketed_steps does without slopes).
template <class F>
std::optional<double> monotone_root(const F& f, bool increasing, double guess, libcoil::detail::MonotoneBracket b, int bits) {
    return libcoil::detail::bracketed_steps([&](double x) { return libcoil::detail::RootStep{f(x)}; }, increasing, guess, b, bits);
}

TEST(Numerics, EllipticPairAgainstCarlson) {
    // K = R_F(0, k'^2, 1) and (K - E) / k^2 = R_D(0, k'^2, 1) / 3 (DLMF 19.25.1), Boost.Math at long double.
    double worst = 0;
    for (double kc2 = 1e-12; kc2 < 1; kc2 *= 1.3) {
        const long double mc = kc2;
        const double K = static_cast<double>(boost::math::ellint_rf(0.0L, mc, 1.0L));
        const double kme_m = static_cast<double>(boost::math::ellint_rd(0.0L, mc, 1.0L) / 3);
        const auto p = elliptic_k_and_k_minus_e_over_m(std::sqrt(kc2), 1 - kc2);
        worst = std::max({worst, std::fabs(p.k / K - 1), std::fabs(p.k_minus_e_over_m / kme_m - 1)});
    }
    std::printf("elliptic pair against Carlson: worst %.2g\n", worst);
    EXPECT_LT(worst, 2e-15) << worst;  // measured 4.4e-16
    // k -> 0: K and (K - E)/k^2 go to pi/2 and pi/4 (A&S 17.3.11, 17.3.12), without NaN at subnormal k^2.
    for (double m : {1e-20, 1e-309, 0.0}) {
        const auto p = elliptic_k_and_k_minus_e_over_m(std::sqrt(1 - m), m);
        EXPECT_DOUBLE_EQ(p.k, std::numbers::pi / 2) << m;
        EXPECT_DOUBLE_EQ(p.k_minus_e_over_m, std::numbers::pi / 4) << m;
    }
}

TEST(Numerics, EllipticPairsInLanesMatchTheScalarPair) {
    // Eight lanes at once (and four), one of them in the small-k series and one at k' = 1e-6, against one
    // at a time, with 1/m given and not.
    const double kc[8] = {1e-6, 0.3, 0.999, std::sqrt(1 - 1e-20), 0.05, 0.5, 0.9, 0.9999};
    double m[8], inv_m[8];
    for (int j = 0; j < 8; ++j) m[j] = j == 0 ? 1 - 1e-12 : j == 3 ? 1e-20 : 1 - kc[j] * kc[j];
    for (int j = 0; j < 8; ++j) inv_m[j] = 1 / m[j];
    libcoil::detail::EllipticPair eight[8], given[8], four[4];
    libcoil::detail::elliptic_pairs<8>(kc, m, eight);
    libcoil::detail::elliptic_pairs<8>(kc, m, given, inv_m);
    libcoil::detail::elliptic_pairs<4>(kc, m, four);
    for (int j = 0; j < 8; ++j) {
        const auto one = elliptic_k_and_k_minus_e_over_m(kc[j], m[j]);
        for (const auto* lanes : {eight, given}) {
            EXPECT_NEAR(lanes[j].k / one.k, 1.0, 2e-16) << j;
            EXPECT_NEAR(lanes[j].k_minus_e_over_m / one.k_minus_e_over_m, 1.0, 2e-16) << j;
        }
        if (j < 4) {
            EXPECT_EQ(four[j].k, eight[j].k) << j;
        }
    }
}

TEST(Numerics, MonotoneRootFindsKnownRoots) {
    // x^3 = 2 on [1, 2], rising; exp(-x) = 0.3 on [0, 5], falling (roots in closed form).
    int calls = 0;
    const auto cube = [&](double x) { ++calls; return x * x * x - 2; };
    const auto r = monotone_root(cube, true, 1.3, {1, 2}, 40);
    ASSERT_TRUE(r.has_value());
    EXPECT_NEAR(*r, std::cbrt(2.0), 1e-11);
    std::printf("x^3 = 2 from 1.3: %d evaluations\n", calls);
    EXPECT_LE(calls, 8);  // a guess 3 % off: a handful of secant steps, not a bisection
    const auto fall = monotone_root([](double x) { return std::exp(-x) - 0.3; }, false, 4.9, {0, 5}, 40);
    ASSERT_TRUE(fall.has_value());
    EXPECT_NEAR(*fall, -std::log(0.3), 1e-11);
    // Newton's steps with the exact slope.
    const auto n = monotone_root_newton([](double x) { return std::pair{x * x - 3, 2 * x}; }, true, 1.0, {0.5, 4}, 44);
    ASSERT_TRUE(n.has_value());
    EXPECT_NEAR(*n, std::sqrt(3.0), 1e-13);
}

TEST(Numerics, MonotoneRootSaysWhenThereIsNone) {
    // x^2 + 1 has no root on [0, 3]; neither has x - 5; a root at an end is found there.
    EXPECT_FALSE(monotone_root([](double x) { return x * x + 1; }, true, 1.0, {0, 3}, 40).has_value());
    EXPECT_FALSE(monotone_root([](double x) { return x - 5; }, true, 1.0, {0, 3}, 40).has_value());
    const auto end = monotone_root([](double x) { return x - 3; }, true, 1.0, {0, 3}, 40);
    ASSERT_TRUE(end.has_value());
    EXPECT_NEAR(*end, 3.0, 1e-12);
    // An end value the caller gives is trusted: with f(hi) < 0 for a rising f, there is no root.
    EXPECT_FALSE(monotone_root([](double x) { return x - 1; }, true, 0.5, {0, 3, std::nullopt, -1.0}, 40).has_value());
}

TEST(Numerics, MonotoneRootSurvivesABadGuessAndAStep) {
    // A guess far from the root, on a steep step (tanh): the secant from there leaves the interval, and
    // TOMS 748 finishes on the bracket the steps found (15 evaluations, measured).
    int calls = 0;
    const auto f = [&](double x) { ++calls; return std::tanh(20 * (x - 0.7)); };
    const auto r = monotone_root(f, true, 0.01, {0, 1}, 40);
    ASSERT_TRUE(r.has_value());
    EXPECT_NEAR(*r, 0.7, 1e-11);
    EXPECT_LE(calls, 25);
}

}  // namespace

// The ascending series of I0, I1, K0, K1 (bessel_ik.hpp) against Boost.Math's rational approximations,
// over (0, 2] where the sheath helix uses them. Measured: 2.2e-16 for I0 and I1, 1.2e-15 for K0 and K1
// (Boost at its default policy, long double inside).
TEST(Numerics, BesselSeriesAgainstBoost) {
    double worst_i = 0, worst_k = 0;
    for (int j = 0; j <= 400; ++j) {
        const double x = 1e-8 * std::pow(2.0 / 1e-8, j / 400.0);
        const auto s = libcoil::detail::bessel_ik01_series(x);
        const auto i = libcoil::detail::bessel_i01_series(x);
        EXPECT_EQ(i.i0, s.i0);
        EXPECT_EQ(i.i1, s.i1);
        const auto rel = [](double a, double b) { return std::fabs(a / b - 1); };
        worst_i = std::max({worst_i, rel(s.i0, boost::math::cyl_bessel_i(0, x)), rel(s.i1, boost::math::cyl_bessel_i(1, x))});
        worst_k = std::max({worst_k, rel(s.k0, boost::math::cyl_bessel_k(0, x)), rel(s.k1, boost::math::cyl_bessel_k(1, x))});
    }
    std::printf("I: %.2e  K: %.2e\n", worst_i, worst_k);
    EXPECT_LE(worst_i, 1e-15);
    EXPECT_LE(worst_k, 5e-15);
}

TEST(Numerics, RingFieldTablesAgainstTheEllipticIntegrals) {
    // The tables (tools/ring_field_tables.py, measured there within 6.3e-16 of mpmath) against the same fields
    // from the arithmetic-geometric mean (elliptic.hpp, itself within an ulp or two of Boost's Carlson forms
    // above), over the octaves below s = 1 and across the joints of their parts. Beyond, the elliptic form of
    // b H_r is a difference of terms near pi / 2 that cancels to 3 / (64 s^4) and loses digits (2e-14 at s = 1,
    // 5e-12 at 4, 2e-7 at 64; measured), which is why the tables take over from it: the generator measures
    // those octaves against mpmath at raised precision.
    using libcoil::detail::RingField;
    double worst_z = 0, worst_r = 0;
    int points = 0;
    for (double s = libcoil::detail::ring_table_low; s < 1; s *= 1.0037) {
        for (const double at : {s, std::nextafter(s, 0.0)}) {
            if (at < libcoil::detail::ring_table_low) continue;
            const RingField t = libcoil::detail::ring_field(at);
            double lanes[2] = {at, at};
            RingField e[2];
            libcoil::detail::ring_fields_exact<2>(lanes, e);
            worst_z = std::max(worst_z, std::fabs(t.z / e[0].z - 1));
            worst_r = std::max(worst_r, std::fabs(t.r / e[0].r - 1));
            ++points;
        }
    }
    EXPECT_GT(points, 1500);
    EXPECT_LT(worst_z, 2e-15) << worst_z;  // measured 8.9e-16
    EXPECT_LT(worst_r, 6e-15) << worst_r;  // measured 4.0e-15, mostly the elliptic form's rounding
    // Far out, the dipole's field (Jackson 5.56, from memory): b H_z -> 1 / (16 s^3), b H_r -> 3 / (64 s^4).
    const RingField far = libcoil::detail::ring_field(1e5);
    EXPECT_NEAR(far.z * 16e15, 1.0, 1e-9);
    EXPECT_NEAR(far.r * 64e20 / 3, 1.0, 1e-9);
}

TEST(Numerics, RingFieldRunningSumsAreTheTableBitForBit) {
    // ring_field_running_sums takes two offsets to an AVX instruction where the processor has AVX; lane by lane
    // it does ring_field's operations, so its sums must be those of ring_field one offset at a time, to the bit
    // (no fused multiply-add on either path). Offsets from just above the tables' start into their tail.
    for (const double sigma : {0.00098, 0.0137, 0.21, 0.9, 3.3}) {
        const long first = static_cast<long>(std::ceil(libcoil::detail::ring_table_low / sigma)) + 1, n = first + 101;
        std::vector<double> sz(n, 0.0), sr(n, 0.0);
        double run_z = 0.25, run_r = -0.5;
        libcoil::detail::ring_field_running_sums(sigma, first, n, run_z, run_r, sz.data(), sr.data());
        double z = 0.25, r = -0.5;
        for (long k = first; k < n; ++k) {
            const libcoil::detail::RingField h = libcoil::detail::ring_field(static_cast<double>(k) * sigma);
            z += h.z;
            r += h.r;
            ASSERT_EQ(sz[k], z) << sigma << " " << k;
            ASSERT_EQ(sr[k], r) << sigma << " " << k;
        }
        EXPECT_EQ(run_z, z);
        EXPECT_EQ(run_r, r);
    }
}
