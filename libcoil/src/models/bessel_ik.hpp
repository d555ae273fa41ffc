// Internal: the modified Bessel functions I0, I1, K0 and K1 of one small real argument together.
//
// The sheath helix's dispersion and its energy shares (helical_line.cpp) ask for these at gamma a, which
// for a coil below its self-resonance is mostly well under 2. There the ascending series converge in 10
// to 16 terms, summed by Horner's rule over coefficients computed at compile time, and one pass serves
// all four, where four calls to Boost.Math would each pay for a rational approximation and the checks of
// a general order.
//   I0 = sum t^k / (k!)^2,  I1 = (x/2) sum t^k / (k! (k+1)!),  t = x^2 / 4        (A&S 9.6.10)
//   K0 = -(ln(x/2) + gamma) I0 + sum H_k t^k / (k!)^2                              (A&S 9.6.13)
//   K1 = 1/x + ln(x/2) I1 - (x/4) sum (psi(k+1) + psi(k+2)) t^k / (k! (k+1)!)     (A&S 9.6.11, n = 1)
// with H_k the harmonic numbers and psi(k+1) = H_k - gamma. Below x = 2 the K series cancel by one digit
// at most. Measured against Boost.Math over (0, 2] (tests/cpp/test_numerics.cpp): 2.2e-16 for I0 and
// I1, 1.2e-15 for K0 and K1.
#pragma once

#include <cmath>
#include <numbers>

namespace libcoil::detail {

// Where the series serve; the caller takes Boost.Math above.
constexpr double bessel_series_below = 2.0;

struct BesselI01 {
    double i0, i1;
};
struct BesselIK01 {
    double i0, i1, k0, k1;
};

namespace bessel_series {

constexpr int terms = 16;  // t^15 / (15!)^2 < 1e-24 at t = 1 (x = 2)

// The series' coefficients: 1/(k!)^2, 1/(k!(k+1)!), H_k/(k!)^2 and (psi(k+1) + psi(k+2) + 2 gamma)/(k!(k+1)!)
// = (2 H_k + 1/(k+1))/(k!(k+1)!), computed once at compile time.
struct Coefficients {
    double i0[terms], i1[terms], k0[terms], k1[terms];
};
constexpr Coefficients coefficients() {
    Coefficients c{};
    double f = 1, h = 0;  // k!, H_k
    for (int k = 0; k < terms; ++k) {
        if (k > 0) {
            f *= k;
            h += 1.0 / k;
        }
        c.i0[k] = 1 / (f * f);
        c.i1[k] = 1 / (f * f * (k + 1));
        c.k0[k] = h * c.i0[k];
        c.k1[k] = (2 * h + 1.0 / (k + 1)) * c.i1[k];
    }
    return c;
}
inline constexpr Coefficients coef = coefficients();

// Horner's rule over the first n coefficients: four independent chains.
inline void sums(double t, int n, double& s0, double& s1, double& h0, double& h1) {
    s0 = coef.i0[n - 1], s1 = coef.i1[n - 1], h0 = coef.k0[n - 1], h1 = coef.k1[n - 1];
    for (int k = n - 2; k >= 0; --k) {
        s0 = s0 * t + coef.i0[k];
        s1 = s1 * t + coef.i1[k];
        h0 = h0 * t + coef.k0[k];
        h1 = h1 * t + coef.k1[k];
    }
}

// Terms enough for 1e-17 of the sum, the first left out being t^n / (n!)^2: 6e-18 for n = 8 at t = 0.1
// (x = 0.63), 4.5e-19 for n = 10 at t = 0.3 (x = 1.1).
inline int terms_for(double t) { return t <= 0.1 ? 8 : t <= 0.3 ? 10 : terms; }

}  // namespace bessel_series

// I0 and I1 for 0 <= x <= bessel_series_below.
inline BesselI01 bessel_i01_series(double x) {
    const double t = 0.25 * x * x;
    const int n = bessel_series::terms_for(t);
    double s0 = bessel_series::coef.i0[n - 1], s1 = bessel_series::coef.i1[n - 1];
    for (int k = n - 2; k >= 0; --k) {
        s0 = s0 * t + bessel_series::coef.i0[k];
        s1 = s1 * t + bessel_series::coef.i1[k];
    }
    return {s0, 0.5 * x * s1};
}

// I0, I1, K0 and K1 for 0 < x <= bessel_series_below.
inline BesselIK01 bessel_ik01_series(double x) {
    const double t = 0.25 * x * x, lg = std::log(0.5 * x), g = std::numbers::egamma;
    double s0, s1, h0, h1;
    bessel_series::sums(t, bessel_series::terms_for(t), s0, s1, h0, h1);
    const double i0 = s0, i1 = 0.5 * x * s1;
    // psi(k+1) + psi(k+2) = 2 H_k + 1/(k+1) - 2 gamma
    return {i0, i1, -(lg + g) * i0 + h0, 1 / x + lg * i1 - 0.25 * x * (h1 - 2 * g * s1)};
}

}  // namespace libcoil::detail
