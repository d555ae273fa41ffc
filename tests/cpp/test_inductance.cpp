// Inductance models: Nagaoka, Lundin, Wheeler, Rosa and the filament sum.
#include <gtest/gtest.h>

#include <cmath>
#include <numbers>

#include "libcoil/models/coaxial_mutual.hpp"
#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/filament.hpp"
#include "libcoil/models/inductance.hpp"
#include "libcoil/models/lundin.hpp"
#include "libcoil/models/nagaoka.hpp"
#include "libcoil/models/ring_inductance.hpp"
#include "libcoil/models/rosa.hpp"
#include "libcoil/models/wheeler.hpp"

using namespace libcoil;

namespace {
std::vector<double> log_grid(double lo, double hi, int n) {
    std::vector<double> v;
    for (int i = 0; i < n; ++i) v.push_back(lo * std::pow(hi / lo, i / (n - 1.0)));
    return v;
}
}  // namespace

TEST(Nagaoka, PublishedTable) {
    // Nagaoka 1909 / Grover 1946 table of K against D/l, quoted from memory, +-1 in the last digit.
    const std::pair<double, double> table[] = {{0.1, 0.9588}, {0.2, 0.9201}, {0.5, 0.8181}, {1, 0.6884},
                                               {2, 0.5255},   {5, 0.3198},   {10, 0.2033}};
    for (const auto& [rho, k] : table) EXPECT_NEAR(nagaoka_coefficient(rho), k, 1.0e-4) << rho;
}

TEST(Nagaoka, Limits) {
    // Long coil: K = 1 - 4 D / (3 pi l) + D^2 / (8 l^2) + ... (the expansion of the closed form in k,
    // Grover 1946 eq. (114)); at D/l = 1e-4 the next term is 1.25e-9.
    const double rho = 1e-4;
    EXPECT_NEAR(nagaoka_coefficient(rho), 1 - 4 * rho / (3 * pi) + rho * rho / 8, 1e-13);
    // Down to where k^2 = rho^2 / (1 + rho^2) is subnormal (a regression: the elliptic pair once returned
    // NaN there), and at the switch of its small-k branch (k^2 = 1e-16).
    for (double tiny : {1e-155, 1e-160, 1e-300, 1e-8, 0.99e-8, 1.01e-8}) {
        EXPECT_NEAR(nagaoka_coefficient(tiny), 1 - 4 * tiny / (3 * pi), 1e-15) << tiny;
    }
    // Short coil: K = (2 l / (pi D)) (ln(4 D / l) - 1/2) + O((l/D)^3 ln) (Rayleigh and Niven; Grover 1946).
    const double s = 1e-5;
    EXPECT_NEAR(nagaoka_coefficient(1 / s) / (2 * s / pi * (std::log(4 / s) - 0.5)), 1.0, 1e-9);
    EXPECT_THROW(nagaoka_coefficient(0.0), InputError);
    EXPECT_THROW(nagaoka_coefficient(-1.0), InputError);
    EXPECT_THROW(nagaoka_coefficient(std::nan("")), InputError);
}

TEST(Nagaoka, SmoothAcrossTheSwitches) {
    // Within the elliptic-integral form, the short-coil series takes over at k'^2 = 0.1, i.e. D/l = 3. One
    // ulp either side, the two branches agree to rounding (K itself moves by 3e-16 there).
    const auto direct = [](double r) { return libcoil::detail::nagaoka_by_elliptic_integrals(r).value; };
    EXPECT_NEAR(direct(std::nextafter(3.0, 0.0)) / direct(std::nextafter(3.0, 4.0)) - 1, 0.0, 4e-15);
    // The table (D/l <= 9) hands over to the elliptic integrals at D/l = 9: value and slope agree across.
    const NagaokaSlope below = nagaoka_coefficient_and_slope(std::nextafter(9.0, 0.0));
    const NagaokaSlope above = nagaoka_coefficient_and_slope(std::nextafter(9.0, 10.0));
    EXPECT_NEAR(below.value / above.value - 1, 0.0, 1e-15);
    EXPECT_NEAR(below.slope / above.slope - 1, 0.0, 1e-13);  // the elliptic slope is good to 2e-14 there
    // K is monotonic throughout (a property of the current sheet, no source needed).
    double prev = 2;
    for (double r : log_grid(1e-3, 1e3, 2001)) {
        const double k = nagaoka_coefficient(r);
        EXPECT_LT(k, prev) << r;
        prev = k;
    }
}

TEST(Nagaoka, TableAgreesWithTheEllipticIntegrals) {
    // The table (tools/nagaoka_table.py, from mpmath at 40 digits) against the library's own elliptic
    // integrals at 20 001 points of D/l = 1e-4 .. 9. Measured: values within 2.9e-15, where the elliptic
    // form's own rounding dominates; slopes within 5.7e-12, the elliptic slope's cancellation for long
    // coils (the table is held against mpmath itself to 4.4e-16 in tests/python/test_nagaoka.py).
    double worst_value = 0, worst_slope = 0;
    for (double r : log_grid(1e-4, 9, 20001)) {
        const NagaokaSlope t = nagaoka_coefficient_and_slope(r);
        const NagaokaSlope e = libcoil::detail::nagaoka_by_elliptic_integrals(r);
        worst_value = std::max(worst_value, std::fabs(t.value / e.value - 1));
        worst_slope = std::max(worst_slope, std::fabs(t.slope / e.slope - 1));
        ASSERT_EQ(nagaoka_coefficient(r), t.value) << r;  // one table for both functions
    }
    EXPECT_LT(worst_value, 5e-15);
    EXPECT_LT(worst_slope, 1e-11);
}

TEST(Lundin, WithinThreePpmOfExact) {
    // Lundin 1985 states a maximum error of 3 ppm for his formula over all D/l.
    double worst = 0;
    for (double r : log_grid(1e-3, 1e3, 4001)) {
        worst = std::max(worst, std::fabs(lundin_coefficient(r) / nagaoka_coefficient(r) - 1));
    }
    EXPECT_LE(worst, 3e-6);
    EXPECT_GT(worst, 1e-7);  // it is an approximation: the test would notice an accidental exact branch
    RecordProperty("lundin_worst_ppm", std::to_string(worst * 1e6));
}

TEST(Wheeler, OnePercentForLongCoils) {
    // Wheeler 1928 claims 1 % for l > 0.8 r, i.e. D/l < 2.5.
    double worst = 0;
    for (double r : log_grid(1e-3, 2.5, 2001)) {
        worst = std::max(worst, std::fabs(wheeler_coefficient(r) / nagaoka_coefficient(r) - 1));
    }
    EXPECT_LE(worst, 0.01);
    // Outside the domain it fails as expected: more than 5 % off at D/l = 10.
    EXPECT_GT(std::fabs(wheeler_coefficient(10) / nagaoka_coefficient(10) - 1), 0.05);
    EXPECT_TRUE(wheeler_in_domain(2.4));
    EXPECT_FALSE(wheeler_in_domain(2.6));
}

TEST(Rosa, SelfCorrectionA) {
    // A = 5/4 - ln(2 p / d) (Rosa 1906; Grover 1946 Table 38 gives 0.5568 at p/d = 1, from memory).
    EXPECT_NEAR(rosa_self_correction(1.0), 0.5568, 1e-4);
    EXPECT_NEAR(rosa_self_correction(2.0), 1.25 - std::log(4.0), 1e-15);
    EXPECT_THROW(rosa_self_correction(0.9), InputError);
}

TEST(Rosa, MutualCorrectionBTable) {
    // Rosa's B against the published table (Rosa 1906; Grover 1946 Table 39), quoted from memory.
    const std::pair<double, double> table[] = {{1, 0.0},      {2, 0.1137}, {3, 0.1663}, {4, 0.1973},
                                               {5, 0.2180},   {6, 0.2329}, {7, 0.2443}, {8, 0.2532},
                                               {9, 0.2604},   {10, 0.2664}};
    for (const auto& [n, b] : table) EXPECT_NEAR(rosa_mutual_correction(n), b, 1.0e-4) << n;
}

TEST(Rosa, GradientMatchesCentralDifferences) {
    // Consistency with the value: dL/dN and dL/dp against central differences of rosa_inductance (step
    // 1e-4 turn, within one whole-number interval, and 1e-5 p; their truncation is below 1e-8 relative).
    // Nagaoka's slope itself is checked against mpmath in tests/python/test_nagaoka.py.
    struct Case {
        double D, N, p, d;
    };
    for (const Case& c : {Case{25e-3, 12.3, 2.0e-3, 1.3e-3}, Case{12e-3, 3.4, 1.1e-3, 1.0e-3},
                          Case{40e-3, 37.6, 1.5e-3, 0.5e-3}, Case{8e-3, 151.7, 0.3e-3, 0.25e-3},
                          Case{60e-3, 2.5, 6e-3, 2e-3}}) {
        const InductanceGradient g = rosa_inductance_gradient(c.D, c.N, c.p, c.d);
        // The value is Rosa's composition of the current sheet and the two corrections, A and B.
        const double composed = current_sheet_inductance(c.D, c.N * c.p, c.N) -
                                mu0 * c.D / 2 * c.N * (rosa_self_correction(c.p / c.d) + rosa_mutual_correction(c.N));
        EXPECT_NEAR(g.inductance / composed, 1.0, 1e-14);
        const double hn = 1e-4, hp = 1e-5 * c.p;
        const double dn = (rosa_inductance(c.D, c.N + hn, c.p, c.d) - rosa_inductance(c.D, c.N - hn, c.p, c.d)) / (2 * hn);
        const double dp = (rosa_inductance(c.D, c.N, c.p + hp, c.d) - rosa_inductance(c.D, c.N, c.p - hp, c.d)) / (2 * hp);
        EXPECT_NEAR(g.d_turns / dn, 1.0, 1e-7) << c.N;
        EXPECT_NEAR(g.d_pitch / dp, 1.0, 1e-7) << c.N;
        // The form with a coefficient the caller already has gives the same.
        const InductanceGradient h = rosa_inductance_gradient(c.D, c.N, c.p, c.d, nagaoka_coefficient_and_slope(c.D / (c.N * c.p)));
        EXPECT_EQ(h.inductance, g.inductance);
        EXPECT_EQ(h.d_pitch, g.d_pitch);
    }
}

TEST(Rosa, LargeTurnCountsMatchDirectSum) {
    // Beyond 4096 offsets the sum switches to polygamma tails. Check it against the direct sum in long
    // double: the closed form of the pair term for k <= 8 (long double keeps 15 digits there), and six
    // terms of its Taylor series in 1/k^2 beyond (truncation below 1e-15), and that B tends to
    // 2 * sum f_k = 0.33788 (the limit of the definition; no published value is relied on).
    for (double N : {4097.0, 5000.5, 20000.0}) {
        long double s = 0;
        for (long k = 1; k < static_cast<long>(std::ceil(N)); ++k) {
            long double f;
            if (k <= 8) {
                const long double kk = k;
                f = std::log(kk) - (((kk + 1) * (kk + 1) * std::log(kk + 1) +
                                     (kk > 1 ? (kk - 1) * (kk - 1) * std::log(kk - 1) : 0.0L) -
                                     2 * kk * kk * std::log(kk)) / 2 - 1.5L);
            } else {
                const long double u = 1.0L / ((long double)k * k);
                f = u * (1.0L / 12 + u * (1.0L / 60 + u * (1.0L / 168 + u * (1.0L / 360 + u * (1.0L / 660 + u / 1092)))));
            }
            s += (N - k) * f;
        }
        EXPECT_NEAR(rosa_mutual_correction(N), static_cast<double>(2 * s / N), 1e-12) << N;
    }
    EXPECT_NEAR(rosa_mutual_correction(1e8), 0.33788, 2e-5);
    // Fractional turns: continuous and increasing (no source needed: the weights N - k grow with N).
    EXPECT_NEAR(rosa_mutual_correction(7.0 + 1e-9), rosa_mutual_correction(7.0), 1e-8);
    EXPECT_LT(rosa_mutual_correction(7.25), rosa_mutual_correction(7.5));
}

TEST(Rosa, AgreesWithFilamentModel) {
    // Acceptance bound: 0.5 % for N >= 5 and mean radius >= 10 wire radii, inside Rosa's domain p <= 0.4 a.
    // Two independent routes to the same physics: the corrected current sheet, and the sum of Maxwell's
    // mutual inductances.
    double worst = 0;
    int cases = 0;
    for (double N : {5.0, 8.0, 13.0, 20.0, 50.0, 200.0}) {
        for (double p_over_d : {1.0, 1.2, 1.5, 2.0, 3.0, 5.0}) {
            for (double a_over_r : {10.0, 20.0, 50.0, 200.0}) {
                const double d = 1e-3, D = a_over_r * d, p = p_over_d * d;
                if (!rosa_in_domain(p, D / 2)) continue;
                ++cases;
                const double rosa = rosa_inductance(D, N, p, d);
                const double fil = filament_inductance(D, N, p, d);
                const double rel = std::fabs(rosa / fil - 1);
                worst = std::max(worst, rel);
                EXPECT_LE(rel, 0.005) << "N=" << N << " p/d=" << p_over_d << " a/r=" << a_over_r;
            }
        }
    }
    EXPECT_GE(cases, 100);
    RecordProperty("rosa_vs_filament_worst_percent", std::to_string(worst * 100));
    std::printf("Rosa vs filament, worst over %d coils: %.4f %%\n", cases, worst * 100);
}

TEST(Rosa, DomainLimitIsReal) {
    // Beyond p = 0.4 a the correction degrades (about 3 % (p/a)^2): at p = 0.8 a it is more than 1 % off,
    // so the recommended value must be the filament sum there, and say so.
    const double d = 1e-3, a = 12.5e-3, p = 0.8 * a;
    EXPECT_GT(std::fabs(rosa_inductance(2 * a, 5, p, d) / filament_inductance(2 * a, 5, p, d) - 1), 0.01);
    const auto r = inductance(Solenoid(Solenoid::Params{2 * a, 5, p, Wire{d, 0, "1 mm"}, 0}));
    EXPECT_EQ(r.method, "filament");
    EXPECT_DOUBLE_EQ(r.recommended, r.by_method.filament);
    EXPECT_DOUBLE_EQ(recommended_inductance(Solenoid(Solenoid::Params{2 * a, 5, p, Wire{d, 0, "1 mm"}, 0})),
                     r.by_method.filament);
    ASSERT_FALSE(r.warnings.empty());
    EXPECT_NE(r.warnings.back().find("filament sum instead"), std::string::npos);
}

TEST(Filament, LanesMatchTheTermByTermSum) {
    // The near offsets go through the elliptic integrals eight at a time; the sum must equal Maxwell's
    // formula term by term (coaxial_mutual.hpp, itself checked against mpmath) to rounding.
    for (double n : {2.0, 3.5, 12.0, 40.25, 300.0}) {
        for (double p_over_a : {0.05, 0.4, 1.5}) {
            const double a = 10e-3, p = p_over_a * a, d = 0.5e-3;
            double mutual = 0;
            for (long k = static_cast<long>(std::ceil(n)) - 1; k >= 1; --k) mutual += (n - k) * coaxial_mutual_inductance(a, a, k * p);
            const double ref = n * ring_self_inductance(a, d / 2) + 2 * mutual;
            EXPECT_NEAR(filament_inductance(2 * a, n, p, d) / ref, 1.0, 1e-14) << n << " " << p_over_a;
        }
    }
}

TEST(Filament, SingleTurnIsTheRing) {
    EXPECT_DOUBLE_EQ(filament_inductance(0.1, 1.0, 1e-3, 1e-3), ring_self_inductance(0.05, 0.5e-3));
}

TEST(Inductance, AggregateAndWarnings) {
    const Wire w{1e-3, 0.04e-3, "1 mm"};
    const auto r = inductance(Solenoid(Solenoid::Params{21.08e-3, 10, 1.5e-3, w, 0}));
    EXPECT_DOUBLE_EQ(r.recommended, r.by_method.rosa);
    EXPECT_LT(r.by_method.rosa, r.by_method.nagaoka);  // round wire has less inductance than the sheet here
    EXPECT_TRUE(r.warnings.empty());
    // A short, fat coil: Wheeler is outside its domain and says so.
    const auto flat = inductance(Solenoid(Solenoid::Params{100e-3, 5, 1.5e-3, w, 0}));
    ASSERT_FALSE(flat.warnings.empty());
    EXPECT_NE(flat.warnings[0].find("Wheeler"), std::string::npos);
    // Thick wire on a small diameter: the round-wire models warn.
    const auto thick = inductance(Solenoid(Solenoid::Params{6e-3, 10, 1.5e-3, w, 0}));
    ASSERT_FALSE(thick.warnings.empty());
    EXPECT_NE(thick.warnings.back().find("wire radii"), std::string::npos);
}
