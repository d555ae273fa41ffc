#include "libcoil/models/proximity.hpp"

#include <cmath>
#include <complex>
#include <vector>

#include "models/elliptic.hpp"
#include "libcoil/core/constants.hpp"
#include "libcoil/models/dc_resistance.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/kelvin.hpp"
#include "models/wire_kernels.hpp"
#include "libcoil/models/skin_effect.hpp"
#include "models/wire_bessel.hpp"

namespace libcoil {

namespace {

using cd = std::complex<double>;

// Field per ampere of a ring of radius b at a point of the same radius, axial distance z != 0
// (Smythe, "Static and Dynamic Electricity" (1950) 7.10; Jackson 5.37):
//   H_z = 1 / (2 pi sqrt(4 b^2 + z^2)) [K - E],
//   H_r = z / (2 pi b sqrt(4 b^2 + z^2)) [-K + (2 b^2 + z^2) / z^2 E],  k^2 = 4 b^2 / (4 b^2 + z^2),
// for `lanes` spacings z[j] at once (elliptic.hpp: their AGMs interleave).
template <std::size_t lanes>
void ring_fields(double b, const double* z, const double* inv_z2, double* hz, double* hr) {
    // Written to spare divisions, which cost more here than the square roots: two per ring (the caller
    // gives 1/z^2).
    const double b2 = b * b, inv_4b2 = 1 / (4 * b2), inv_2pi = 1 / (2 * pi), inv_2pib = inv_2pi / b;
    double inv_root[lanes], kc[lanes], m[lanes], inv_m[lanes];
    for (std::size_t j = 0; j < lanes; ++j) {
        const double s = 4 * b2 + z[j] * z[j];
        inv_root[j] = 1 / std::sqrt(s);
        m[j] = 4 * b2 * inv_root[j] * inv_root[j];  // k^2
        inv_m[j] = s * inv_4b2;
        kc[j] = z[j] * inv_root[j];  // k'
    }
    detail::EllipticPair e[lanes];
    detail::elliptic_pairs<lanes>(kc, m, e, inv_m);
    for (std::size_t j = 0; j < lanes; ++j) {
        const double kme = m[j] * e[j].k_minus_e_over_m;  // K - E
        const double E = e[j].k - kme;
        hz[j] = kme * inv_root[j] * inv_2pi;
        hr[j] = z[j] * inv_root[j] * inv_2pib * (-e[j].k + (1 + 2 * b2 * inv_z2[j]) * E);
    }
}

// 1/k^2 for the first offsets, so that the ring fields take 1/z^2 = (1/p^2)(1/k^2) without a division.
constexpr long reciprocal_squares = 1024;
struct ReciprocalSquares {
    double v[reciprocal_squares];
};
constexpr ReciprocalSquares make_reciprocal_squares() {
    ReciprocalSquares r{};
    for (long k = 1; k < reciprocal_squares; ++k) r.v[k] = 1.0 / (static_cast<double>(k) * static_cast<double>(k));
    return r;
}
constexpr ReciprocalSquares inv_k2 = make_reciprocal_squares();

constexpr double own_field_constant = 1.75;

}  // namespace

double proximity_loss_function(double x) {
    require_non_negative("x", x);
    return finite_result("proximity loss function", detail::wire_kernels(x).proximity);
}

double proximity_loss_function_series(double x) {
    require_non_negative("x", x);
    // Below x = 0.05 the closed form takes lambda from a small imaginary part and loses digits (2.5e-10 at
    // x = 1e-3); the series G = (x^4/16)(1 - 11 x^4/384 + ...) is used instead, its next term
    // 8.6e-4 x^8 (both coefficients checked against mpmath quadrature in tests/python/test_proximity.py).
    if (x < 0.05) {
        const double x4 = x * x * x * x;
        return x4 / 16 * (1 - 11 * x4 / 384);
    }
    return detail::proximity_loss_from(scaled_kelvin_bessel(x), x);
}

double detail::proximity_loss_from(const ScaledBesselPair& s, double x) {
    // u = x e^(-i pi/4): J0(u) = ber + i bei (J0 is even), J1(u) = d e^(-3 pi i/4); scaled alike.
    static const cd quarter = std::polar(1.0, -pi / 4), three_quarters = std::polar(1.0, -3 * pi / 4);
    const cd u = x * quarter;
    const cd j0 = s.j0;
    const cd j1 = s.d * three_quarters;
    const cd j1p = j0 - j1 / u;
    const double lambda = -(std::conj(u) * j1 * std::conj(j1p)).imag() / (x * x);
    return finite_result("proximity loss function", x * x * lambda / std::norm(j0));
}

double mean_square_field_per_ampere(const Solenoid& c) {
    const long n = std::max(1L, std::lround(c.turns()));
    if (n > 10'000'000) throw InputError("turns", "too many turns for the proximity field sum");
    const double b = c.mean_radius(), p = c.pitch();
    // Prefix sums over offsets k = 1 .. n-1 of the field of one turn at another (in buffers each thread
    // keeps, so that a search does not allocate for every coil).
    thread_local std::vector<double> sz, sr;
    sz.assign(n, 0.0);
    sr.assign(n, 0.0);
    constexpr long lanes = 8;
    const double inv_p2 = 1 / (p * p);
    double run_z = 0, run_r = 0;  // the prefix sums so far, kept in registers
    for (long k = 1; k < n; k += lanes) {
        double z[lanes], inv_z2[lanes], hz[lanes], hr[lanes];
        const long count = std::min(lanes, n - k);
        for (long j = 0; j < lanes; ++j) {
            const long kj = k + std::min(j, count - 1);
            z[j] = static_cast<double>(kj) * p;
            inv_z2[j] = kj < reciprocal_squares ? inv_p2 * inv_k2.v[kj] : 1 / (z[j] * z[j]);
        }
        ring_fields<lanes>(b, z, inv_z2, hz, hr);
        for (long j = 0; j < count; ++j) {
            run_z += hz[j];
            run_r += hr[j];
            sz[k + j] = run_z;
            sr[k + j] = run_r;
        }
    }
    // The turn's own curvature field, uniform over its wire: (1 / (4 pi a)) (ln(8 a / r) - c). Averaging the
    // ring's exact field over its own cross-section gives c = 0; c = 1.75 is fitted to the cross-section
    // solver (docs/models.md), which the uniform-field picture otherwise overestimates for spaced turns.
    const double own = (std::log(8 * b / c.wire().radius()) - own_field_constant) / (4 * pi * b);
    // Turn i and turn n-1-i see the same |H| (mirror images): the first half, twice, and the middle once.
    double sum = 0;
    for (long i = 0; i < n / 2; ++i) {
        const double hz = own + sz[i] + sz[n - 1 - i];  // turns below and above add axially
        const double hr = sr[i] - sr[n - 1 - i];  // and oppose radially
        sum += hz * hz + hr * hr;
    }
    sum *= 2;
    if (n % 2 == 1) {
        const double hz = own + 2 * sz[n / 2];
        sum += hz * hz;
    }
    return sum / static_cast<double>(n);
}

AcResistance ac_resistance(const Solenoid& c, const Conductor& cond, double temperature, double frequency) {
    return ac_resistance(c, cond, temperature, frequency, frequency > 0 ? mean_square_field_per_ampere(c) : 0.0);
}

AcResistance ac_resistance(const Solenoid& c, const Conductor& cond, double temperature, double frequency,
                           double mean_square_field) {
    require_non_negative("frequency", frequency);
    require_non_negative("mean_square_field", mean_square_field);
    AcResistance r;
    r.frequency = frequency;
    const double d = c.wire().bare_diameter;
    const double per_m = dc_resistance_per_length(cond, d, temperature);
    const double helix = per_m * c.helix_length(), leads = per_m * c.lead_length();
    r.dc = helix + leads;
    if (frequency == 0) {
        r.resistance = r.dc;
        return r;
    }
    const double rho = cond.resistivity_at(temperature);
    const double x = std::sqrt(2.0) * c.wire().radius() / skin_depth(rho, frequency, cond.relative_permeability);
    // One lookup in the tables serves both ratios and G.
    const detail::WireKernels k = detail::wire_kernels(x);
    const double g = k.proximity;
    r.skin_ratio = k.resistance;
    r.internal_inductance_ratio = k.internal_inductance;
    const double rw = c.wire().radius();
    r.proximity_ratio = 4 * pi * pi * rw * rw * g * mean_square_field;
    r.resistance = finite_result("AC resistance", helix * (r.skin_ratio + r.proximity_ratio) + leads * r.skin_ratio);
    return r;
}

}  // namespace libcoil
