#include "studies/inductance_fall_screen.hpp"

#include <algorithm>
#include <cmath>
#include <complex>
#include <utility>

namespace libcoil::detail {

namespace f = inductance_fall_fit;

double transverse_screening(double x) {
    const std::complex<double> z = std::complex<double>(1, -1) * (x / std::sqrt(2.0));
    // r_m = J_m / J_(m-1) = z / (2 m - z r_(m+1)): the minimal solution, stable downwards from r = 0 far above |z|.
    std::complex<double> r = 0, r1 = 0, r2 = 0;
    for (int m = 40 + static_cast<int>(2 * std::min(x, 1e3)); m >= 1; --m) {
        r = z / (2.0 * m - z * r);
        if (m == 2) r2 = r;
    }
    r1 = r;
    return -(r1 * r2).real();
}

InductanceFallFit::InductanceFallFit(double x, double internal_ratio) : in_range_(x >= f::x_low && x <= f::x_high) {
    if (!in_range_) return;
    const double p = transverse_screening(x);
    weights_ = {1 - internal_ratio, p, p * p};
    for (int t = 0; t < f::terms; ++t) {
        for (int k = 0; k < f::shapes; ++k) folded_[static_cast<std::size_t>(t)] += weights_[static_cast<std::size_t>(k)] * f::coefficients[k][t];
    }
}

namespace {

// Each monomial as the product of its features' powers, unrolled: the powers' indices are constants, and the
// factors of power 0 (exactly 1) drop out of the product without changing it.
template <std::size_t... T>
void monomials(const double (&power)[f::features][f::degree + 1], FallTerms& out, std::index_sequence<T...>) {
    ((out[T] = power[0][f::powers[T][0]] * power[1][f::powers[T][1]] * power[2][f::powers[T][2]] * power[3][f::powers[T][3]]), ...);
}

// A dot product of the fit's length over four running sums: one sum's chain of dependent additions would
// wait out each addition's latency (the screen took a tenth of its time here so).
double dot(const double* a, const FallTerms& b) {
    double s[4] = {0, 0, 0, 0};
    std::size_t t = 0;
    for (; t + 4 <= b.size(); t += 4) {
        for (std::size_t k = 0; k < 4; ++k) s[k] += a[t + k] * b[t + k];
    }
    for (; t < b.size(); ++t) s[t % 4] += a[t] * b[t];
    return (s[0] + s[1]) + (s[2] + s[3]);
}

}  // namespace

std::optional<FallTerms> fall_terms(double spacing, double diameter, double turns) {
    if (!(spacing > 1) || !(diameter > 0) || !(turns > 0)) return std::nullopt;
    const double rings = std::max(1.0, std::floor(turns + 0.5));
    const double x[f::features] = {std::log(spacing - 1), std::log(diameter), 1 / rings, std::log(turns * spacing / diameter)};
    double power[f::features][f::degree + 1];
    for (int k = 0; k < f::features; ++k) {
        if (!(x[k] >= f::low[k] && x[k] <= f::high[k])) return std::nullopt;
        const double s = (2 * x[k] - f::low[k] - f::high[k]) / (f::high[k] - f::low[k]);
        power[k][0] = 1;
        for (int e = 1; e <= f::degree; ++e) power[k][e] = power[k][e - 1] * s;
    }
    FallTerms out;
    monomials(power, out, std::make_index_sequence<f::terms>{});
    return out;
}

FallShapes fall_shapes(const FallTerms& terms) {
    FallShapes out;
    for (std::size_t k = 0; k < out.size(); ++k) out[k] = dot(f::coefficients[k], terms);
    return out;
}

double InductanceFallFit::ratio(const FallTerms& terms, double diameter) const { return dot(folded_.data(), terms) / diameter; }

double InductanceFallFit::ratio(const FallShapes& shapes, double diameter) const {
    return (weights_[0] * shapes[0] + weights_[1] * shapes[1] + weights_[2] * shapes[2]) / diameter;
}

std::optional<double> InductanceFallFit::ratio(double spacing, double diameter, double turns) const {
    if (!in_range_) return std::nullopt;
    const auto terms = fall_terms(spacing, diameter, turns);
    if (!terms) return std::nullopt;
    return ratio(*terms, diameter);
}

}  // namespace libcoil::detail
