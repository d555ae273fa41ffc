#include "libcoil/models/helical_line.hpp"

#include <algorithm>
#include <bit>
#include <cmath>
#include <cstdint>
#include <limits>
#include <numbers>
#include <optional>

#include <boost/math/special_functions/bessel.hpp>
#include <boost/math/tools/roots.hpp>

#include "models/bessel_ik.hpp"
#include "models/helix_tables.hpp"
#include "models/polynomial.hpp"
#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "models/monotone_root.hpp"

namespace libcoil {

namespace {

// Double-precision evaluation throughout: Boost promotes double to long double by default, which costs
// a factor of 2-3 here for digits the dispersion does not need (it is solved to 1e-13).
using fast = boost::math::policies::policy<boost::math::policies::promote_double<false>>;

// Above this argument the ratios come from the asymptotic series (I0 overflows near 713).
constexpr double asymptotic_from = 500.0;

// sum_k (+-1)^k a_k(nu) / x^k, a_k(nu) = prod_{j<=k} (4 nu^2 - (2j - 1)^2) / (k! 8^k); Abramowitz &
// Stegun 9.7.1 and 9.7.2. At x >= 500 eight terms leave an error far below 1e-16.
double hankel_sum(int nu, double x, double sign) {
    double term = 1, sum = 1;
    for (int k = 1; k <= 8; ++k) {
        term *= (4.0 * nu * nu - (2.0 * k - 1) * (2.0 * k - 1)) / (k * 8.0 * x) * sign;
        sum += term;
    }
    return sum;
}

// Below this argument the leading small-argument forms hold to 1e-16 (and K1 ~ 1/x would overflow near 1e-308).
constexpr double small_from = 1e-8;

double ratio_i(double x) {  // I1(x) / I0(x)
    if (x < small_from) return x / 2;  // A&S 9.6.7: I0 ~ 1, I1 ~ x/2
    if (x <= detail::bessel_series_below) {
        const auto b = detail::bessel_i01_series(x);
        return b.i1 / b.i0;
    }
    if (x >= asymptotic_from) return hankel_sum(1, x, -1) / hankel_sum(0, x, -1);
    return boost::math::cyl_bessel_i(1, x, fast()) / boost::math::cyl_bessel_i(0, x, fast());
}

double ratio_k(double x) {  // K1(x) / K0(x)
    if (x < small_from) return 1 / (x * (std::log(2 / x) - std::numbers::egamma));  // A&S 9.6.8, 9.6.9
    if (x <= detail::bessel_series_below) {
        const auto b = detail::bessel_ik01_series(x);
        return b.k1 / b.k0;
    }
    if (x >= asymptotic_from) return hankel_sum(1, x, 1) / hankel_sum(0, x, 1);
    return boost::math::cyl_bessel_k(1, x, fast()) / boost::math::cyl_bessel_k(0, x, fast());
}

// I_n(x) exp(-x) for n = 0, 1: Boost below the asymptotic switch, Hankel's series above.
double scaled_i(int n, double x) {
    if (x >= asymptotic_from) return hankel_sum(n, x, -1) / std::sqrt(2 * pi * x);
    return boost::math::cyl_bessel_i(n, x, fast()) * std::exp(-x);
}

constexpr std::uintmax_t max_iterations = 200;

template <class F>
double root_between(F f, double lo, double hi, double f_lo, double f_hi) {
    std::uintmax_t it = max_iterations;
    try {
        const auto r = boost::math::tools::toms748_solve(f, lo, hi, f_lo, f_hi,
                                                         boost::math::tools::eps_tolerance<double>(44), it);
        return 0.5 * (r.first + r.second);
    } catch (const std::exception&) {  // Boost's: the dispersion went non-finite inside the bracket
        throw DomainError("sheath helix: the dispersion cannot be evaluated at this scale (radius x wavenumber)");
    }
}

// In a uniform medium (e1 = e2) the dispersion reads x^2 (1 + tan^2(psi) Q(x)) = (beta a)^2 with
// Q = I0 K0 / (I1 K1) and x = a sqrt(beta^2 - e k^2): one function of one variable, which helix_tables.hpp
// holds with its slope (tools/helix_tables.py, within 3.9e-16 of mpmath on [2^-10, 64)). x^2 Q(x) rises from 0
// (Q ~ 2 ln(2 / x) at small x) and Q falls towards 1, so there is one root in (0, beta a); Newton's steps reach
// it from x = beta a in two or three steps (tan^2(psi) is small), to a relative `tolerance`. Returns (x, Q(x)), or
// nothing where x leaves the tables (the caller solves the general dispersion there).
constexpr double q_table_low = detail::power_of_two(detail::helix_tables::low_octave);
constexpr double q_table_high = detail::power_of_two(detail::helix_tables::high_octave);

detail::PolynomialPair q_and_slope(double x) {  // q_table_low <= x < q_table_high
    namespace t = detail::helix_tables;
    const detail::OctavePlace at = detail::octave_place<t::low_octave, t::parts>(x);
    return detail::estrin_pair(t::body[at.index], at.w);
}

// a where c holds, else b, without a branch (the lanes below must not wait on one another's tests).
inline double pick(bool c, double a, double b) {
    const std::uint64_t m = std::uint64_t{0} - static_cast<std::uint64_t>(c);
    return std::bit_cast<double>((std::bit_cast<std::uint64_t>(a) & m) | (std::bit_cast<std::uint64_t>(b) & ~m));
}

struct UniformRoot {
    double x = 0, q = 0;
    bool found = false;
};

// The root for up to `max_lanes` helices at once, in lockstep: each lane takes exactly the steps it would take
// alone, and one that has stopped (or left the tables, found = false) leaves the rounds to the rest. Alone, one
// helix's steps are a single chain of lookups and divisions that the processor can only wait on; side by side,
// the chains of several overlap. So no lane's test may branch: a round steps every lane on its list (a lane
// that has left the tables at a point clamped into them, its step discarded), keeps each result by selection,
// and lists afresh the lanes that go on.
constexpr std::size_t max_lanes = 8;

void uniform_medium_roots(const double* big_x, const double* tan2, double tolerance, std::size_t count, UniformRoot* out) {
    const double top = std::nextafter(q_table_high, 0.0);
    double x[max_lanes];
    std::size_t active[max_lanes];  // the lanes still stepping, listed afresh after each round
    std::size_t left = count;
    for (std::size_t j = 0; j < count; ++j) {
        x[j] = big_x[j];
        active[j] = j;
        out[j] = {};
    }
    for (int i = 0; i < 40 && left > 0; ++i) {
        std::size_t still = 0;
        for (std::size_t m = 0; m < left; ++m) {
            const std::size_t j = active[m];
            const bool inside = x[j] >= q_table_low && x[j] < q_table_high;
            const double at = std::clamp(x[j], q_table_low, top);
            const detail::PolynomialPair q = q_and_slope(at);
            const double lift = 1 + tan2[j] * q.first;
            const double step = (at * at * lift - big_x[j] * big_x[j]) / (2 * at * lift + tan2[j] * at * at * q.second);
            const double next = at - step;
            // Newton's relative error squares and halves with each step here (the dispersion is x^2 times a
            // slowly varying function), so after a step of relative size r the root lies within about r^2 / 2;
            // Q moves to first order with it, which leaves Q within Q'' (r x)^2 / 2 and k within
            // (x^2 Q'' / (4 Q)) r^2 <= 0.51 r^2 (x^2 Q'' below 2.04 and Q above 1 on the tables, by mpmath). A
            // step with r^2 <= tolerance / 2 leaves k within about the tolerance (compared as squares, without
            // a division; measured within 0.245 of it in test_self_resonance.py).
            const bool stops = inside && step * step <= 0.5 * tolerance * (next * next);
            out[j].x = pick(stops, next, out[j].x);
            out[j].q = pick(stops, q.first - q.second * step, out[j].q);
            out[j].found = stops;
            x[j] = next;  // read again only while the lane steps on
            active[still] = j;  // kept where it steps on: written always, counted only then
            still += static_cast<std::size_t>(inside && !stops);
        }
        left = still;
    }
}

// One helix alone (see above): (x, Q(x)), or nothing where x leaves the tables.
std::optional<std::pair<double, double>> uniform_medium_root(double big_x, double tan2, double tolerance) {
    UniformRoot r;
    uniform_medium_roots(&big_x, &tan2, tolerance, 1, &r);
    if (!r.found) return std::nullopt;
    return std::pair{r.x, r.q};
}

}  // namespace

SheathHelix::SheathHelix(double radius, double pitch_angle, HelixMedium medium)
    : SheathHelix(radius, std::tan(require_positive("pitch_angle", pitch_angle)), medium, 0) {
    if (!(pitch_angle < pi / 2)) throw InputError("pitch_angle", format_value(pitch_angle) + " rad; expected below pi/2");
}

SheathHelix::SheathHelix(double radius, double tangent, HelixMedium medium, int)
    : a_(require_positive("radius", radius)), tan_(tangent), tan2_(tangent * tangent), m_(medium) {
    require_at_least("medium.inner", require_finite("medium.inner", m_.inner), 1.0, "a relative permittivity");
    require_at_least("medium.outer", require_finite("medium.outer", m_.outer), 1.0, "a relative permittivity");
}

SheathHelix SheathHelix::with_pitch_tangent(double radius, double tangent, HelixMedium medium) {
    return {radius, require_positive("tangent", require_finite("tangent", tangent)), medium, 0};
}

double SheathHelix::dispersion(double beta, double k) const {
    const double x1 = a_ * std::sqrt(beta * beta - m_.inner * k * k);
    const double x2 = a_ * std::sqrt(beta * beta - m_.outer * k * k);
    if (!(x1 > 0) || !(x2 > 0)) throw DomainError("sheath helix: beta must exceed k sqrt(e) (a slow wave)");
    const double ri = ratio_i(x1), rk = ratio_k(x2), ka = k * a_;
    return tan2_ * (x1 / ri + x2 / rk) - ka * ka * (m_.inner * ri / x1 + m_.outer * rk / x2);
}

std::pair<double, double> SheathHelix::dispersion_and_slope(double beta, double k) const {
    const double a2 = a_ * a_;
    const double x1 = a_ * std::sqrt(beta * beta - m_.inner * k * k);
    const double x2 = a_ * std::sqrt(beta * beta - m_.outer * k * k);
    if (!(x1 > 0) || !(x2 > 0)) throw DomainError("sheath helix: beta must exceed k sqrt(e) (a slow wave)");
    const double ri = ratio_i(x1), rk = ratio_k(x2), ka2 = k * k * a2;
    // From I0' = I1, I1' = I0 - I1/x, K0' = -K1, K1' = -K0 - K1/x (A&S 9.6.27, 9.6.28):
    const double dri = 1 - ri / x1 - ri * ri, drk = -1 - rk / x2 + rk * rk;
    const double dx1 = -a2 * m_.inner * k / x1, dx2 = -a2 * m_.outer * k / x2;  // dx/dk
    const double f = tan2_ * (x1 / ri + x2 / rk) - ka2 * (m_.inner * ri / x1 + m_.outer * rk / x2);
    const double df = tan2_ * ((ri - x1 * dri) / (ri * ri) * dx1 + (rk - x2 * drk) / (rk * rk) * dx2) -
                      2 * k * a2 * (m_.inner * ri / x1 + m_.outer * rk / x2) -
                      ka2 * (m_.inner * (x1 * dri - ri) / (x1 * x1) * dx1 + m_.outer * (x2 * drk - rk) / (x2 * x2) * dx2);
    return {f, df};
}

double SheathHelix::slow_wave_estimate(double beta) const {
    require_positive("beta", beta);
    // gamma = beta in both regions makes the dispersion explicit in k:
    // (k a)^2 = tan^2(psi) x^2 (1/rI + 1/rK) / (e1 rI + e2 rK), x = beta a.
    const double x = beta * a_, ri = ratio_i(x), rk = ratio_k(x);
    return std::sqrt(tan2_ * (1 / ri + 1 / rk) / (m_.inner * ri + m_.outer * rk)) * x / a_;
}

double SheathHelix::wavenumber_for(double beta) const { return wavenumber_for(beta, 0); }

double SheathHelix::full_bracket(double beta) const {
    const double k_max = beta / std::sqrt(std::max(m_.inner, m_.outer)) * (1 - 1e-13);
    const auto g = [&](double k) { return dispersion(beta, k); };
    // At k -> 0 the function is tan^2(psi) (x/rI + x/rK) > 0; at the light line it is negative for a slow wave.
    const double lo = k_max * 1e-12, g_lo = g(lo), g_hi = g(k_max);
    if (!(g_hi < 0)) {
        throw DomainError("sheath helix: no slow wave at this pitch angle (" + format_value(pitch_angle() * 180 / pi) +
                          " deg) and permittivity; the helical-line model does not hold");
    }
    if (!(g_lo > 0)) throw DomainError("sheath helix: the pitch angle is too small to resolve the wave");
    return finite_result("sheath helix", root_between(g, lo, k_max, g_lo, g_hi));
}

static void check_tolerance(double tolerance) {
    if (!(tolerance >= 1e-15 && tolerance <= 1e-3)) throw InputError("tolerance", format_value(tolerance) + "; expected 1e-15 .. 1e-3");
}

// One permittivity: the tabulated dispersion. k a from e (k a)^2 = (beta a)^2 - x^2 = tan^2(psi) x^2 Q(x), which
// does not cancel.
double SheathHelix::uniform_wavenumber(double x, double q) const { return x * std::sqrt(tan2_ * q / m_.inner) / a_; }

void SheathHelix::tabulated_wavenumbers(std::span<const SheathHelix> helices, std::span<const double> beta, double tolerance, std::span<double> k) {
    check_tolerance(tolerance);
    if (beta.size() != helices.size() || k.size() != helices.size()) throw InputError("beta", "arrays of different lengths");
    for (std::size_t begin = 0; begin < helices.size(); begin += max_lanes) {
        const std::size_t count = std::min(max_lanes, helices.size() - begin);
        double big_x[max_lanes], tan2[max_lanes];
        for (std::size_t j = 0; j < count; ++j) {
            const SheathHelix& h = helices[begin + j];
            const double b = beta[begin + j];
            big_x[j] = b > 0 && std::isfinite(b) ? b * h.a_ : 0.0;  // 0 lies below the tables: not found
            tan2[j] = h.tan2_;
        }
        UniformRoot roots[max_lanes];
        uniform_medium_roots(big_x, tan2, tolerance, count, roots);
        for (std::size_t j = 0; j < count; ++j) {
            const SheathHelix& h = helices[begin + j];
            const double v = h.uniform_wavenumber(roots[j].x, roots[j].q);
            const bool fits = h.m_.inner == h.m_.outer && roots[j].found && std::isfinite(v);
            k[begin + j] = fits ? v : std::numeric_limits<double>::quiet_NaN();
        }
    }
}

double SheathHelix::wavenumber_for(double beta, double guess, double tolerance) const {
    require_positive("beta", beta);
    check_tolerance(tolerance);
    if (m_.inner == m_.outer) {
        if (const auto root = uniform_medium_root(beta * a_, tan2_, tolerance)) {
            return finite_result("sheath helix", uniform_wavenumber(root->first, root->second));
        }
    }
    const int bits = 1 - static_cast<int>(std::floor(std::log2(tolerance)));
    const double k_max = beta / std::sqrt(std::max(m_.inner, m_.outer)) * (1 - 1e-13);
    if (!(guess > 0)) guess = slow_wave_estimate(beta);
    if (guess < k_max) {
        // Newton's steps from the guess, kept in the bracket (the dispersion falls through the root).
        const auto k = detail::monotone_root_newton([&](double x) { return dispersion_and_slope(beta, x); }, false,
                                                    guess, {k_max * 1e-12, k_max}, bits);
        if (k) return finite_result("sheath helix", *k);
    }
    return full_bracket(beta);
}

double SheathHelix::axial_wavenumber(double k) const {
    require_positive("k", k);
    const double lo = k * std::sqrt(std::max(m_.inner, m_.outer)) * (1 + 1e-13);
    const auto g = [&](double beta) { return dispersion(beta, k); };
    const double g_lo = g(lo);
    if (!(g_lo < 0)) {
        throw DomainError("sheath helix: no slow wave at this pitch angle (" + format_value(pitch_angle() * 180 / pi) +
                          " deg) and permittivity; the helical-line model does not hold");
    }
    double hi = 2 * lo, g_hi = g(hi);
    for (int i = 0; i < 2000 && !(g_hi > 0); ++i) {
        hi *= 2;
        g_hi = g(hi);
    }
    if (!(g_hi > 0)) throw DomainError("sheath helix: the axial wavenumber could not be bracketed");
    return finite_result("sheath helix", root_between(g, lo, hi, g_lo, g_hi));
}

double SheathHelix::phase_velocity(double beta) const { return speed_of_light * wavenumber_for(beta) / beta; }

double sheath_inner_energy_share(double a, double r_in, double r_out, double gamma, double beta) {
    require_positive("a", a);
    require_non_negative("r_in", r_in);
    require_positive("gamma", gamma);
    require_positive("beta", beta);
    if (!(r_in < r_out) || r_out > a) throw InputError("r_out", "expected r_in < r_out <= a");
    const double b2 = (beta / gamma) * (beta / gamma), ua = gamma * a;
    // Antiderivatives of r I0(g r)^2 and r I1(g r)^2, times g^2 (which cancels in the share):
    // u^2/2 (I0^2 - I1^2) and u^2/2 (I1^2 - I0 I2), u = g r, I2 = I0 - 2 I1 / u. Any common factor
    // cancels in the share: below u = 300 the plain I_n serve (I0^2 stays below 1e260); above, all are
    // scaled by exp(-2 g a) through e_n(u) = I_n(u) exp(-u), so nothing overflows.
    const bool scaled = ua >= 300;
    const auto energy = [&](double r) {
        const double u = gamma * r;
        if (u == 0) return 0.0;
        const detail::BesselI01 b = scaled                              ? detail::BesselI01{scaled_i(0, u), scaled_i(1, u)}
                                    : u <= detail::bessel_series_below ? detail::bessel_i01_series(u)
                                                                       : detail::BesselI01{boost::math::cyl_bessel_i(0, u, fast()),
                                                                                           boost::math::cyl_bessel_i(1, u, fast())};
        const double e0 = b.i0, e1 = b.i1;
        const double e2 = e0 - 2 * e1 / u;  // I2 = I0 - 2 I1 / u (A&S 9.6.26)
        const double w = u * u / 2 * ((e0 * e0 - e1 * e1) + b2 * (e1 * e1 - e0 * e2));
        return scaled ? w * std::exp(2 * (u - ua)) : w;
    };
    const double total = energy(a);
    if (!(total > 0) || !std::isfinite(total)) {
        throw DomainError("sheath helix: the inner field energy could not be evaluated");
    }
    const double share = (energy(r_out) - energy(r_in)) / total;
    return std::clamp(share, 0.0, 1.0);
}

double kandoian_sichak_velocity_factor(double diameter, double pitch, double wavelength) {
    require_positive("diameter", diameter);
    require_positive("pitch", pitch);
    require_positive("wavelength", wavelength);
    const double v = 1 / std::sqrt(1 + 20 * std::pow(diameter / pitch, 2.5) * std::sqrt(diameter / wavelength));
    return finite_result("Kandoian & Sichak", v);
}

}  // namespace libcoil
