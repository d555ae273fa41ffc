#include "studies/inductance_fall_screen.hpp"

#include <algorithm>
#include <cmath>
#include <complex>
#include <utility>

#include "studies/fit_features.hpp"

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

// The reduced monomials: the powers (e0, e2, e3) of log gap, 1 / n and log l / D, of degree 4 at most, and for
// each of the fit's 70 terms the reduced monomial its powers of those three make.
struct ReducedPowers {
    std::array<std::array<unsigned char, 3>, fall_row_terms> of{};
    std::array<unsigned char, f::terms> place{};
};
constexpr ReducedPowers reduced = [] {
    ReducedPowers r;
    int count = 0;
    for (int t = 0; t < f::terms; ++t) {
        const std::array<unsigned char, 3> e{f::powers[t][0], f::powers[t][2], f::powers[t][3]};
        int i = 0;
        while (i < count && r.of[static_cast<std::size_t>(i)] != e) ++i;
        if (i == count) r.of[static_cast<std::size_t>(count++)] = e;
        r.place[static_cast<std::size_t>(t)] = static_cast<unsigned char>(i);
    }
    if (count != fall_row_terms) throw "inductance_fall_fit.hpp: not a full quartic in four features";
    return r;
}();

// Feature k scaled to [-1, 1] over its range, its powers to the degree; false outside the range (a NaN too).
bool feature_powers(double x, int k, double (&power)[f::degree + 1]) { return scaled_powers<f::degree>(x, f::low[k], f::high[k], power); }

// The reduced monomials at one coil, unrolled: their powers' indices are constants.
template <std::size_t... M>
void reduced_monomials(const double (&p0)[f::degree + 1], const double (&p2)[f::degree + 1], const double (&p3)[f::degree + 1],
                       std::array<double, fall_row_terms>& out, std::index_sequence<M...>) {
    ((out[M] = p0[reduced.of[M][0]] * p2[reduced.of[M][1]] * p3[reduced.of[M][2]]), ...);
}

// A dot product of the row's length over four running sums: one sum's chain of dependent additions would wait
// out each addition's latency.
double dot(const std::array<double, fall_row_terms>& a, const std::array<double, fall_row_terms>& b) {
    double s[4] = {0, 0, 0, 0};
    std::size_t t = 0;
    for (; t + 4 <= a.size(); t += 4) {
        for (std::size_t k = 0; k < 4; ++k) s[k] += a[t + k] * b[t + k];
    }
    for (; t < a.size(); ++t) s[t % 4] += a[t] * b[t];
    return (s[0] + s[1]) + (s[2] + s[3]);
}

}  // namespace

template <std::size_t K>
FallAtDiameter<K>::FallAtDiameter(const std::array<const double*, K>& polynomials, double diameter) : diameter_(diameter) {
    double p1[f::degree + 1];
    in_range_ = diameter > 0 && feature_powers(std::log(diameter), 1, p1);
    if (!in_range_) return;
    for (std::size_t k = 0; k < K; ++k) {
        for (int t = 0; t < f::terms; ++t) c_[k][reduced.place[static_cast<std::size_t>(t)]] += polynomials[k][t] * p1[f::powers[t][1]];
    }
}

template <std::size_t K>
std::optional<std::array<double, K>> FallAtDiameter<K>::at(double spacing, double turns) const {
    if (!in_range_ || !(spacing > 1) || !(turns > 0)) return std::nullopt;
    const double rings = std::max(1.0, std::floor(turns + 0.5));
    double p0[f::degree + 1], p2[f::degree + 1], p3[f::degree + 1];
    if (!feature_powers(std::log(spacing - 1), 0, p0) || !feature_powers(1 / rings, 2, p2) ||
        !feature_powers(std::log(turns * spacing / diameter_), 3, p3)) {
        return std::nullopt;
    }
    std::array<double, fall_row_terms> m;
    reduced_monomials(p0, p2, p3, m, std::make_index_sequence<fall_row_terms>{});
    std::array<double, K> out;
    for (std::size_t k = 0; k < K; ++k) out[k] = dot(c_[k], m);
    return out;
}

template class FallAtDiameter<1>;
template class FallAtDiameter<f::shapes>;

FallAtDiameter<f::shapes> fall_shapes_at(double diameter) {
    return FallAtDiameter<f::shapes>({f::coefficients[0], f::coefficients[1], f::coefficients[2]}, diameter);
}

FallAtDiameter<1> InductanceFallFit::at_diameter(double diameter) const { return FallAtDiameter<1>({folded_.data()}, in_range_ ? diameter : 0.0); }

double InductanceFallFit::ratio(const FallShapes& shapes, double diameter) const {
    return (weights_[0] * shapes[0] + weights_[1] * shapes[1] + weights_[2] * shapes[2]) / diameter;
}

std::optional<double> InductanceFallFit::ratio(double spacing, double diameter, double turns) const {
    if (!in_range_) return std::nullopt;
    const auto r = at_diameter(diameter).at(spacing, turns);
    if (!r) return std::nullopt;
    return (*r)[0] / diameter;
}

}  // namespace libcoil::detail
