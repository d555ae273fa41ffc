#include "libcoil/models/rosa.hpp"

#include <array>
#include <cmath>
#include <utility>

#include <boost/math/special_functions/digamma.hpp>
#include <boost/math/special_functions/polygamma.hpp>
#include <boost/math/special_functions/trigamma.hpp>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/nagaoka.hpp"

namespace libcoil {

namespace {

// f_k = ln(k p / g_k): filament pair at k pitches against strip pair at its geometric mean distance.
double pair_correction(int k) {
    if (k <= 2) {
        const double kk = k;
        const double lg = ((kk + 1) * (kk + 1) * std::log(kk + 1) +
                           (kk > 1 ? (kk - 1) * (kk - 1) * std::log(kk - 1) : 0.0) - 2 * kk * kk * std::log(kk)) / 2 - 1.5;
        return std::log(kk) - lg;
    }
    // sum_{m>=2} 2 / ((2m)(2m-1)(2m-2)) k^(2-2m) = 1/(12k^2) + 1/(60k^4) + 1/(168k^6) + ...
    const double u = 1.0 / (static_cast<double>(k) * k);
    double um = u, sum = 0.0;
    for (int m = 2; m < 60; ++m) {
        const double term = 2.0 / ((2.0 * m) * (2.0 * m - 1) * (2.0 * m - 2)) * um;
        sum += term;
        if (term < 1e-18 * sum) break;
        um *= u;
    }
    return sum;
}

// Prefix sums S0(M) = sum_{k<=M} f_k and S1(M) = sum_{k<=M} k f_k, tabulated up to kTable.
constexpr int kTable = 4096;

struct PrefixSums {
    std::array<double, kTable + 1> s0{}, s1{};
    PrefixSums() {
        for (int k = 1; k <= kTable; ++k) {
            const double f = pair_correction(k);
            s0[k] = s0[k - 1] + f;
            s1[k] = s1[k - 1] + k * f;
        }
    }
};

const PrefixSums& prefix_sums() {
    static const PrefixSums p;
    return p;
}

// Beyond the table f_k = 1/(12k^2) + 1/(60k^4) to 1e-25 relative; its sums over K < k <= M are
// polygamma differences. Out of line: the common case, a table lookup, stays small.
[[gnu::noinline, gnu::cold]] void tail_sums(int M, double& s0, double& s1) {
    const auto& p = prefix_sums();
    using boost::math::digamma;
    using boost::math::polygamma;
    using boost::math::trigamma;
    const double lo = kTable + 1.0, hi = M + 1.0;
    const double inv_k2 = trigamma(lo) - trigamma(hi);                  // sum 1/k^2
    const double inv_k4 = (polygamma(3, lo) - polygamma(3, hi)) / 6.0;  // sum 1/k^4
    const double inv_k = digamma(hi) - digamma(lo);                     // sum 1/k
    const double inv_k3 = (polygamma(2, hi) - polygamma(2, lo)) / 2.0;  // sum 1/k^3
    s0 = p.s0[kTable] + inv_k2 / 12.0 + inv_k4 / 60.0;
    s1 = p.s1[kTable] + inv_k / 12.0 + inv_k3 / 60.0;
}

void sums(int M, double& s0, double& s1) {
    if (M > kTable) return tail_sums(M, s0, s1);
    const auto& p = prefix_sums();
    s0 = p.s0[M];
    s1 = p.s1[M];
}

}  // namespace

double rosa_self_correction(double pitch_to_wire) {
    require_finite("pitch_to_wire", pitch_to_wire);
    require_at_least("pitch_to_wire", pitch_to_wire, 1.0, "the turns would overlap");
    // A root finder on the turns calls this with one pitch many times over: the last value is kept (one
    // per thread), which spares the logarithm and changes no result.
    thread_local double last_x = 0, last_a = 0;
    if (pitch_to_wire != last_x) {
        last_a = 1.25 - std::log(2.0) - std::log(pitch_to_wire);  // log(2 x) would overflow near DBL_MAX
        last_x = pitch_to_wire;
    }
    return last_a;
}

namespace {

// S0 and S1 at M = ceil(N) - 1, the offsets k < N; B = (2 / N) (N S0 - S1) = 2 S0 - 2 S1 / N.
std::pair<double, double> mutual_sums(double turns) {
    require_finite("turns", turns);
    require_at_least("turns", turns, 1.0, "a coil needs at least one turn");
    const double M = std::ceil(turns) - 1.0;  // offsets k < N
    if (M > 2e9) throw InputError("turns", format_value(turns) + " is too many turns to evaluate");
    double s0 = 0, s1 = 0;
    sums(static_cast<int>(M), s0, s1);
    return {s0, s1};
}

}  // namespace

double rosa_mutual_correction(double turns) {
    const auto [s0, s1] = mutual_sums(turns);
    return 2.0 * s0 - 2.0 * s1 / turns;  // (2/N) (N S0 - S1)
}

bool rosa_in_domain(double pitch, double mean_radius) { return pitch <= 0.4 * mean_radius; }

double rosa_inductance(double mean_diameter, double turns, double pitch, double wire_diameter) {
    return rosa_inductance_gradient(mean_diameter, turns, pitch, wire_diameter).inductance;
}

InductanceGradient rosa_inductance_gradient(double mean_diameter, double turns, double pitch, double wire_diameter) {
    require_positive("mean_diameter", mean_diameter);
    require_positive("turns", turns);
    require_positive("pitch", pitch);
    return rosa_inductance_gradient(mean_diameter, turns, pitch, wire_diameter,
                                    nagaoka_coefficient_and_slope(mean_diameter / (turns * pitch)));
}

InductanceGradient rosa_inductance_gradient(double mean_diameter, double turns, double pitch, double wire_diameter,
                                            const NagaokaSlope& sheet) {
    require_positive("mean_diameter", mean_diameter);
    require_positive("pitch", pitch);
    require_positive("wire_diameter", wire_diameter);
    const double A = rosa_self_correction(pitch / wire_diameter);
    const auto [s0, s1] = mutual_sums(turns);
    // L = S (N / p) K(rho) - mu0 a N (A + B), S = mu0 pi a^2, rho = D / (N p), B = 2 S0 - 2 S1 / N;
    // dA/dp = -1/p, and between whole N, dB/dN = 2 S1 / N^2. Two divisions; the rest multiplies.
    const double inv_n = 1 / turns, inv_p = 1 / pitch;
    const double B = 2.0 * s0 - 2.0 * s1 * inv_n;
    const double a = mean_diameter / 2, S = mu0 * pi * a * a, mu0a = mu0 * a;
    const double rho_slope = mean_diameter * inv_n * inv_p * sheet.slope;  // rho dK/drho
    const double sheet_n = S * inv_p, sheet_l = sheet_n * turns * sheet.value;  // S / p, S (N / p) K
    InductanceGradient g;
    g.inductance = finite_result("Rosa's correction", sheet_l - mu0a * turns * (A + B));
    g.d_turns = finite_result("Rosa's correction", sheet_n * (sheet.value - rho_slope) - mu0a * (A + B) - mu0a * 2.0 * s1 * inv_n);
    g.d_pitch = finite_result("Rosa's correction", -sheet_n * turns * inv_p * (sheet.value + rho_slope) + mu0a * turns * inv_p);
    return g;
}

}  // namespace libcoil
