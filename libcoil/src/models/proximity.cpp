#include "libcoil/models/proximity.hpp"

#include <cmath>
#include <complex>
#include <vector>

#include "models/ring_field.hpp"
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
    const double b = c.mean_radius(), sigma = c.pitch() / (2 * b);  // offset k is at s = k sigma (ring_field.hpp)
    // Prefix sums over offsets k = 1 .. n-1 of the field of one turn at another, in units of 1 / b (in
    // buffers each thread keeps, so that a search does not allocate for every coil).
    thread_local std::vector<double> sz, sr;
    if (sz.size() < static_cast<std::size_t>(n)) {
        sz.resize(n);
        sr.resize(n);
    }
    sz[0] = sr[0] = 0;
    double run_z = 0, run_r = 0;  // the prefix sums so far, kept in registers
    // Turns closer than the tables begin (s = 2^-10: a thousandth of the diameter) by the elliptic integrals.
    long first_tabled = static_cast<long>(std::min(static_cast<double>(n), std::ceil(detail::ring_table_low / sigma)));
    while (first_tabled < n && static_cast<double>(first_tabled) * sigma < detail::ring_table_low) ++first_tabled;  // rounding
    constexpr long lanes = 8;
    for (long k = 1; k < first_tabled; k += lanes) {
        double s[lanes];
        detail::RingField h[lanes];
        const long count = std::min(lanes, first_tabled - k);
        for (long j = 0; j < lanes; ++j) s[j] = static_cast<double>(k + std::min(j, count - 1)) * sigma;
        detail::ring_fields_exact<lanes>(s, h);
        for (long j = 0; j < count; ++j) {
            run_z += h[j].z;
            run_r += h[j].r;
            sz[k + j] = run_z;
            sr[k + j] = run_r;
        }
    }
    detail::ring_field_running_sums(sigma, std::max(1L, first_tabled), n, run_z, run_r, sz.data(), sr.data());
    // The turn's own curvature field, uniform over its wire: (1 / (4 pi b)) (ln(8 b / r) - c). Averaging the
    // ring's exact field over its own cross-section gives c = 0; c = 1.75 is fitted to the cross-section
    // solver (docs/models.md), which the uniform-field picture otherwise overestimates for spaced turns.
    const double own = (std::log(8 * b / c.wire().radius()) - own_field_constant) / (4 * pi);
    // Turn i and turn n-1-i see the same |H| (mirror images): the first half, twice, and the middle once.
    double sum_z = 0, sum_r = 0;  // two sums, so that the additions do not wait on each other
    for (long i = 0; i < n / 2; ++i) {
        const double hz = own + sz[i] + sz[n - 1 - i];  // turns below and above add axially
        const double hr = sr[i] - sr[n - 1 - i];  // and oppose radially
        sum_z += hz * hz;
        sum_r += hr * hr;
    }
    double sum = 2 * (sum_z + sum_r);
    if (n % 2 == 1) {
        const double hz = own + 2 * sz[n / 2];
        sum += hz * hz;
    }
    return sum / (static_cast<double>(n) * b * b);
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
