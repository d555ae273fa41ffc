#include "libcoil/models/kelvin.hpp"

#include <cmath>
#include <numbers>

#include "libcoil/core/error.hpp"

namespace libcoil {

namespace {

using cd = std::complex<double>;
constexpr double series_limit = 26.0;
const cd rotation = std::polar(1.0, 3 * std::numbers::pi / 4);     // e^(3 pi i / 4)
const cd root_phase = std::polar(1.0, -3 * std::numbers::pi / 8);  // e^(-3 pi i / 8)

// J0, J1 at z = x e^(3 pi i/4) by the power series; -z^2/4 = i x^2/4. Summed in long double: the terms
// reach e^(0.29 x) times the result (2000 at the switch), which the 64-bit mantissa absorbs.
ScaledBesselPair series(double x) {
    using ld = long double;
    using cld = std::complex<ld>;
    const cld t(0.0L, static_cast<ld>(x) * x / 4);
    cld term0 = 1.0L, sum0 = 1.0L;
    cld term1 = 1.0L, sum1 = 1.0L;  // J1 = (z/2) sum t^k / (k! (k+1)!)
    for (int k = 1; k < 300; ++k) {
        term0 *= t / (static_cast<ld>(k) * k);
        term1 *= t / (static_cast<ld>(k) * (k + 1));
        sum0 += term0;
        sum1 += term1;
        if (std::abs(term0) < 1e-21L * std::abs(sum0) && std::abs(term1) < 1e-21L * std::abs(sum1) && k > 2) break;
    }
    // -e^(3 pi i/4) J1(z) = -e^(3 pi i/2) (x/2) sum1 = i (x/2) sum1, exactly.
    const double scale = std::exp(-x / std::numbers::sqrt2);
    return {cd(sum0) * scale, cd(0.0, x / 2) * cd(sum1) * scale};
}

// Hankel's P and Q series for J_nu, nu = 0 or 1 (A&S 9.2.9, 9.2.10), each summed to its smallest term:
// P = sum_{k even} (-1)^(k/2) a_k / z^k, Q = sum_{k odd} (-1)^((k-1)/2) a_k / z^k, with
// a_k = a_{k-1} (4 nu^2 - (2k - 1)^2) / (8 k). The signed coefficients are computed at compile time.
constexpr int hankel_terms = 64;  // enough for x >= series_limit: the terms reach 1e-18 by k = 22 at x = 26
struct HankelCoefficients {
    double c[2][hankel_terms];
};
constexpr HankelCoefficients hankel_coefficients() {
    HankelCoefficients h{};
    for (int nu = 0; nu < 2; ++nu) {
        double a = 1;
        for (int k = 0; k < hankel_terms; ++k) {
            if (k > 0) a *= (4.0 * nu * nu - (2.0 * k - 1) * (2.0 * k - 1)) / (8.0 * k);
            h.c[nu][k] = (k / 2) % 2 == 0 ? a : -a;
        }
    }
    return h;
}
constexpr HankelCoefficients hankel = hankel_coefficients();

void hankel_pq(int nu, cd inv_z, cd& p, cd& q) {
    p = 0;
    q = 0;
    cd power = 1.0;  // 1 / z^k
    double last = INFINITY;  // |term|^2 (squared moduli: no hypot in the loop)
    for (int k = 0; k < hankel_terms; ++k) {
        const cd term = hankel.c[nu][k] * power;
        const double mag2 = std::norm(term);
        if (mag2 > last) break;  // the asymptotic series starts to diverge
        last = mag2;
        if (k % 2 == 0) p += term; else q += term;
        if (mag2 < 1e-36) break;
        power *= inv_z;
    }
}

// Hankel's expansion (A&S 9.2.5) of J0(z) and J1(z) at z = x e^(3 pi i / 4), both multiplied by e^(-Im z):
//   J_nu = sqrt(2 / (pi z)) (P cos chi - Q sin chi),  chi = z - (nu / 2 + 1/4) pi,
// with sqrt(2 / (pi z)) = sqrt(2 / (pi x)) e^(-3 pi i / 8) (the principal root). cos and sin of chi times
// e^(-Im chi) come without overflow from e^(i chi - Im chi) = e^(-2 Im z) e^(i Re chi) and
// e^(-i chi - Im chi) = e^(-i Re chi); chi for nu = 1 is chi for nu = 0 less pi/2.
void hankel_scaled_pair(double x, cd& j0, cd& j1) {
    const cd z = x * rotation, inv_z = std::conj(rotation) / x;
    const cd scale = std::sqrt(2.0 / (std::numbers::pi * x)) * root_phase;
    const double theta = z.real() - 0.25 * std::numbers::pi, c = std::cos(theta), s = std::sin(theta);
    const double small = std::exp(-2 * z.imag());
    const auto cos_sin = [&](double cr, double sr, cd& cos_s, cd& sin_s) {
        const cd up(small * cr, small * sr), down(cr, -sr);
        cos_s = (up + down) * 0.5;
        sin_s = (up - down) * cd(0, -0.5);  // (up - down) / 2i
    };
    cd p, q, cos_s, sin_s;
    hankel_pq(0, inv_z, p, q);
    cos_sin(c, s, cos_s, sin_s);
    j0 = scale * (p * cos_s - q * sin_s);
    hankel_pq(1, inv_z, p, q);
    cos_sin(s, -c, cos_s, sin_s);  // cos(theta - pi/2) = sin theta, sin(theta - pi/2) = -cos theta
    j1 = scale * (p * cos_s - q * sin_s);
}

}  // namespace

ScaledBesselPair scaled_kelvin_bessel(double x) {
    require_non_negative("x", x);
    if (x <= series_limit) return series(x);
    cd j0, j1;
    hankel_scaled_pair(x, j0, j1);
    return {j0, -rotation * j1};
}

KelvinValues kelvin(double x) {
    require_non_negative("x", x);
    if (x > 1000) throw InputError("x", format_value(x) + " is above 1000, where ber and bei overflow; use the scaled form");
    const auto s = scaled_kelvin_bessel(x);
    const double unscale = std::exp(x / std::numbers::sqrt2);
    const cd j0 = s.j0 * unscale, d = s.d * unscale;
    return {j0.real(), j0.imag(), d.real(), d.imag()};
}

}  // namespace libcoil
