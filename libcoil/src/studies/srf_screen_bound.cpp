#include "studies/srf_screen_bound.hpp"

#include <array>
#include <cmath>
#include <cstddef>

#include "studies/fit_features.hpp"
#include "studies/srf_screen_envelope.hpp"

namespace libcoil::detail {

namespace {

namespace e = srf_screen_envelope;

int bin_of(double value, const double* edges, int bins) {
    int i = 0;
    while (i < bins - 1 && value >= edges[i]) ++i;
    return i;
}

// The fits are cubics (the script's DEGREE): each term a product of at most three powers of the features.
constexpr bool cubic(const auto& powers) {
    for (const auto& term : powers) {
        int degree = 0;
        for (unsigned char e : term) degree += e;
        if (degree > 3) return false;
    }
    return true;
}
static_assert(cubic(e::bare_powers) && cubic(e::former_powers) && cubic(e::mounted_powers), "srf_screen_envelope.hpp: a fit of degree above 3");

// Each term's factors as places in Fit::bound's table of powers (feature k's e-th power at 4 k + e), in the
// order of the features, three to a term, the missing ones place 0 (feature 0's zeroth power, 1: exact).
// A term so takes three products where one per feature took eight (a design search screens with a former
// fit of 165 terms for each candidate that reaches its SRF check), and the same products in the same order.
template <int features, int terms>
constexpr std::array<std::array<unsigned char, 3>, terms> factor_places(const unsigned char (&powers)[terms][features]) {
    std::array<std::array<unsigned char, 3>, terms> out{};
    for (int t = 0; t < terms; ++t) {
        int slot = 0;
        for (int k = 0; k < features; ++k) {
            if (powers[t][k] > 0) out[static_cast<std::size_t>(t)][static_cast<std::size_t>(slot++)] = static_cast<unsigned char>(4 * k + powers[t][k]);
        }
    }
    return out;
}
constexpr auto bare_factors = factor_places(e::bare_powers);
constexpr auto former_factors = factor_places(e::former_powers);
constexpr auto mounted_factors = factor_places(e::mounted_powers);

using Offsets = double[e::turns_bins][e::spacing_bins][e::length_bins];

// The offset of the coil's bin (by N, p / d and l / D).
double bin_offset(const Offsets& offset, const ScreenedCoil& c) {
    return offset[bin_of(c.turns, e::turns_edges, e::turns_bins)][bin_of(c.spacing, e::spacing_edges, e::spacing_bins)]
                 [bin_of(c.length, e::length_edges, e::length_bins)];
}

// The features a design screen varies within one wire on one form: log l / D, 1 / N and the log gap (the
// bare fit's order, which the former fits share); the rest (enamel over d, D / d, the former's) stay fixed.
constexpr std::array<int, 3> varied = {1, 3, 4};
constexpr bool is_varied(int k) { return k == varied[0] || k == varied[1] || k == varied[2]; }
static_assert(!is_varied(0), "a term's missing factors read feature 0's zeroth power, which the fold sets only for a fixed feature 0");
// The cubic's monomials in the three varied features: their powers, and a monomial's place by its powers.
constexpr int folded_terms = 20;
constexpr auto folded_powers = [] {
    std::array<std::array<unsigned char, 3>, folded_terms> out{};
    int i = 0;
    for (int a = 0; a <= 3; ++a) {
        for (int b = 0; a + b <= 3; ++b) {
            for (int c = 0; a + b + c <= 3; ++c) out[static_cast<std::size_t>(i++)] = {static_cast<unsigned char>(a), static_cast<unsigned char>(b), static_cast<unsigned char>(c)};
        }
    }
    return out;
}();
constexpr int folded_place(int a, int b, int c) {
    for (int i = 0; i < folded_terms; ++i) {
        const auto& p = folded_powers[static_cast<std::size_t>(i)];
        if (p[0] == a && p[1] == b && p[2] == c) return i;
    }
    return -1;
}

// Each term of a fit as the fold takes it: the place of its varied features' monomial, and its fixed
// features' factors as places in the table of powers (0, feature 0's zeroth power, 1: for none).
struct FoldedTerm {
    std::size_t place = 0;
    std::array<unsigned char, 3> fixed{};
};
template <int terms>
const std::array<FoldedTerm, terms>& folded_map(const std::array<std::array<unsigned char, 3>, terms>& factors) {
    static const std::array<FoldedTerm, terms> map = [&] {
        std::array<FoldedTerm, terms> out{};
        for (std::size_t t = 0; t < out.size(); ++t) {
            int e[3] = {0, 0, 0}, slot = 0;
            for (unsigned char place : factors[t]) {
                const int k = place / 4, p = place % 4;
                if (p == 0) continue;
                if (is_varied(k)) {
                    e[k == varied[0] ? 0 : k == varied[1] ? 1 : 2] = p;
                } else {
                    out[t].fixed[static_cast<std::size_t>(slot++)] = place;
                }
            }
            out[t].place = static_cast<std::size_t>(folded_place(e[0], e[1], e[2]));
        }
        return out;
    }();
    return map;
}

// A fit with the fixed features folded into the coefficients of a cubic in the varied three: 20 terms where
// the fit has up to 165.
struct FoldedFit {
    bool in_range = false;
    std::array<double, folded_terms> c{};
    const Offsets* offset = nullptr;
    double low[3] = {}, high[3] = {};
};

// One of the generated fits: its features' range, its terms' factors, and each mounting's coefficients and
// offsets.
template <int features, int terms>
struct Fit {
    const double (&low)[features];
    const double (&high)[features];
    const std::array<std::array<unsigned char, 3>, terms>& factors;
    const double (&floating)[terms];
    const Offsets& floating_offset;
    const double (&grounded)[terms];
    const Offsets& grounded_offset;

    // exp(the polynomial in the scaled features plus the bin's offset) for the coil's mounting, or 0 outside
    // the range (a NaN too).
    double bound(const double (&x)[features], const ScreenedCoil& c) const {
        const double(&coefficients)[terms] = c.grounded ? grounded : floating;
        const Offsets& offset = c.grounded ? grounded_offset : floating_offset;
        double power[4 * features];
        for (int k = 0; k < features; ++k) {
            if (!scaled_powers<3>(x[k], low[k], high[k], power + 4 * k)) return 0;
        }
        double sum = 0;
        for (int t = 0; t < terms; ++t) {
            const auto& f = factors[static_cast<std::size_t>(t)];
            sum += coefficients[t] * power[f[0]] * power[f[1]] * power[f[2]];
        }
        return std::exp(sum + bin_offset(offset, c));
    }

    // The fit with every feature but the varied three fixed at x's (those three of x are not read).
    FoldedFit fold(const double (&x)[features], bool grounded_mounting) const {
        FoldedFit out;
        const double(&coefficients)[terms] = grounded_mounting ? grounded : floating;
        out.offset = grounded_mounting ? &grounded_offset : &floating_offset;
        double power[4 * features];
        for (int k = 0; k < features; ++k) {  // the fixed ones (a missing factor reads place 0: feature 0, fixed)
            if (!is_varied(k) && !scaled_powers<3>(x[k], low[k], high[k], power + 4 * k)) return out;
        }
        for (int v = 0; v < 3; ++v) {
            out.low[v] = low[varied[static_cast<std::size_t>(v)]];
            out.high[v] = high[varied[static_cast<std::size_t>(v)]];
        }
        const auto& map = folded_map<terms>(factors);
        for (int t = 0; t < terms; ++t) {
            const auto& m = map[static_cast<std::size_t>(t)];
            out.c[m.place] += coefficients[t] * power[m.fixed[0]] * power[m.fixed[1]] * power[m.fixed[2]];
        }
        out.in_range = true;
        return out;
    }
};

// A folded fit's bound at the varied features x (l / D, 1 / N, gap as bare_features has them); 0 outside.
double folded_bound(const FoldedFit& f, const double (&x)[3], const ScreenedCoil& c) {
    if (!f.in_range) return 0;
    double power[3][4];
    for (int v = 0; v < 3; ++v) {
        if (!scaled_powers<3>(x[v], f.low[v], f.high[v], power[v])) return 0;
    }
    double sum[4] = {0, 0, 0, 0};  // four running sums: their additions need not wait on each other
    for (int m = 0; m < folded_terms; ++m) {
        const auto& e = folded_powers[static_cast<std::size_t>(m)];
        sum[m % 4] += f.c[static_cast<std::size_t>(m)] * power[0][e[0]] * power[1][e[1]] * power[2][e[2]];
    }
    return std::exp((sum[0] + sum[1]) + (sum[2] + sum[3]) + bin_offset(*f.offset, c));
}

constexpr Fit<e::bare_features, e::bare_terms> bare_fit{e::bare_low, e::bare_high, bare_factors, e::floating_bare_fit,
                                                       e::floating_bare_offset, e::grounded_bare_fit, e::grounded_bare_offset};
constexpr Fit<e::former_features, e::former_terms> former_fit{e::former_low, e::former_high, former_factors, e::floating_former_fit,
                                                             e::floating_former_offset, e::grounded_former_fit, e::grounded_former_offset};
static_assert(e::mounted_features == e::former_features, "the mounted fit takes the former's features");
constexpr Fit<e::former_features, e::mounted_terms> mounted_fit{e::mounted_low, e::mounted_high, mounted_factors, e::floating_mounted_fit,
                                                               e::floating_mounted_offset, e::grounded_mounted_fit, e::grounded_mounted_offset};

// The bare fit's features (the script's FEATURES), the former's three after them.
void bare_features(const ScreenedCoil& c, double* x) {
    x[0] = c.coat;
    x[1] = std::log(c.length);
    x[2] = std::log(c.diameter);
    x[3] = 1 / c.turns;
    x[4] = std::log(c.spacing / (1 + 2 * c.coat) - 1);
}

// The former fits' features: the bare fit's five, then the former's permittivity, log wall / D and fill.
void former_features(const ScreenedCoil& c, double permittivity, double wall, double fill, double* x) {
    bare_features(c, x);
    x[5] = permittivity;
    x[6] = std::log(wall);
    x[7] = fill;
}

}  // namespace

double network_over_screen_bound(const ScreenedCoil& c, bool by_helix) {
    const int i = bin_of(c.spacing, e::spacing_edges, e::spacing_bins), j = bin_of(c.length, e::length_edges, e::length_bins);
    const double envelope = (c.grounded ? e::grounded : e::floating)[i][j];
    if (!by_helix) return envelope;
    double x[e::bare_features];
    bare_features(c, x);
    const double fitted = bare_fit.bound(x, c);
    return fitted > 0 ? std::fmin(envelope, fitted) : envelope;
}

double former_shift_bound(const ScreenedCoil& c, double permittivity, double wall, double fill) {
    double x[e::former_features];
    former_features(c, permittivity, wall, fill, x);
    return former_fit.bound(x, c);
}

double network_over_mounted_bound(const ScreenedCoil& c, double permittivity, double wall, double fill) {
    double x[e::former_features];
    former_features(c, permittivity, wall, fill, x);
    // The design screen asks for many coils of one wire on one form: the fit folded at their fixed features,
    // kept per thread by its exact key (the fold is a function of it alone).
    struct Memo {
        double coat = NAN, diameter = NAN, permittivity = NAN, wall = NAN, fill = NAN;
        bool grounded = false;
        FoldedFit fit;
    };
    thread_local Memo memo;
    if (!(memo.coat == c.coat && memo.diameter == c.diameter && memo.permittivity == permittivity && memo.wall == wall &&
          memo.fill == fill && memo.grounded == c.grounded)) {
        memo = {c.coat, c.diameter, permittivity, wall, fill, c.grounded, mounted_fit.fold(x, c.grounded)};
    }
    return folded_bound(memo.fit, {x[varied[0]], x[varied[1]], x[varied[2]]}, c);
}

}  // namespace libcoil::detail
