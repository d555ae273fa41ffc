// Internal: the root of a monotone function from a good first guess.
//
// Secant steps from the guess and a probe beside it (or Newton's steps, where the caller has the slope)
// converge superlinearly, so a guess good to 1e-3 reaches 1e-12 in three to five evaluations, where a
// bracketing solver started on a wide interval needs ten or more. Every evaluation narrows a bracket
// (the sign of f says on which side the root lies). When a step would leave the bracket, or the steps do
// not settle, TOMS 748 (Boost.Math) finishes on it. The ends of [lo, hi] are evaluated only when the
// iteration reaches them, so a caller whose guess is good pays for no end at all, and still learns when
// there is no root in [lo, hi] (std::nullopt).
#pragma once

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <optional>
#include <utility>

#include <boost/math/tools/roots.hpp>

namespace libcoil::detail {

struct MonotoneBracket {
    double lo, hi;                      // the search interval, lo < hi
    std::optional<double> f_lo = std::nullopt, f_hi = std::nullopt;  // f at the ends, where the caller knows it
};

// What one evaluation gives: f(x), and the step f / f' where a slope is known (NaN for a secant step).
// `exact` says the slope is the true derivative, so that the step is Newton's.
struct RootStep {
    double f, step = NAN;
    bool exact = false;
};

// `eval(x)` returns a RootStep. After a secant step the iteration stops at the last point it evaluated
// once the next step is below the tolerance (the root then lies within that step of it), or at the next
// point once the product of the last two steps says that point is within it. After a Newton step s from
// x it stops at x when |s| is below the tolerance, or at x - s, unevaluated, when C (s / x)^2 is: Newton's
// error after the step is (f'' / 2 f') s^2, and `curvature` is a bound C on |x f'' / (2 f')| near the
// root. The default, 100, suits any smooth function of moderate curvature; a caller that knows its
// function's shape may give a tighter bound and save an evaluation.
template <class Eval>
std::optional<double> bracketed_steps(const Eval& eval, bool increasing, double guess, MonotoneBracket b, int bits,
                                      double curvature = 100) {
    constexpr double probe = 1e-4;  // the secant's second point, as a share of the guess or the interval
    const double tol = std::ldexp(1.0, 1 - bits), newton_done = std::sqrt(tol / curvature);
    // `below` is the lower end of the bracket, where the root lies above; `above` the upper end.
    double below = b.lo, above = b.hi;
    std::optional<double> f_below = b.f_lo, f_above = b.f_hi;
    const auto root_is_above = [&](double fx) { return (fx < 0) == increasing; };
    const auto none_unless_zero = [](double fx, double x) { return fx == 0 ? std::optional(x) : std::nullopt; };
    if (f_below && !root_is_above(*f_below)) return none_unless_zero(*f_below, below);
    if (f_above && root_is_above(*f_above)) return none_unless_zero(*f_above, above);
    const auto record = [&](double x, double fx) {
        if (root_is_above(fx)) {
            below = x;
            f_below = fx;
        } else {
            above = x;
            f_above = fx;
        }
    };
    const auto inside = [&](double x) { return x >= below && x <= above; };

    double x0 = std::clamp(guess, b.lo, b.hi);
    const RootStep r0 = eval(x0);
    double f0 = r0.f;
    if (f0 == 0) return x0;
    record(x0, f0);
    double x1;
    if (std::isfinite(r0.step)) {
        x1 = x0 - r0.step;
        if (r0.exact && inside(x1)) {
            if (std::fabs(r0.step) <= tol * std::fabs(x0)) return x0;
            if (std::fabs(r0.step) <= newton_done * std::fabs(x0)) return x1;
        }
    } else {
        const double dx = std::max(std::fabs(x0), b.hi - b.lo) * probe;
        x1 = root_is_above(f0) ? x0 + dx : x0 - dx;
    }
    x1 = std::clamp(x1, below, above);
    for (int step = 0; step < 12 && x1 != x0; ++step) {
        const RootStep r1 = eval(x1);
        const double f1 = r1.f;
        if (f1 == 0) return x1;
        record(x1, f1);
        const double x2 = std::isfinite(r1.step) ? x1 - r1.step : f1 != f0 ? x1 - f1 * (x1 - x0) / (f1 - f0) : below;
        if (inside(x2)) {
            if (r1.exact) {
                if (std::fabs(r1.step) <= tol * std::fabs(x1)) return x1;
                if (std::fabs(r1.step) <= newton_done * std::fabs(x1)) return x2;
            } else {
                if (std::fabs(x2 - x1) <= tol * std::fabs(x2)) return x1;
                // Secant steps converge as e2 ~ C e1 e0 with e1 ~ |x2 - x1| and e0 ~ |x2 - x0|: with C |x|
                // up to 10, x2 is then within the tolerance without another evaluation.
                if (std::fabs(x2 - x1) * std::fabs(x2 - x0) <= 0.1 * tol * x2 * x2) return x2;
            }
        }
        if (!(x2 > below && x2 < above)) break;  // outside the bracket: finish by bracketing
        x0 = x1;
        f0 = f1;
        x1 = x2;
    }
    // Evaluate the ends still unknown; they say whether a root exists at all.
    if (!f_below) {
        f_below = eval(below).f;
        if (!root_is_above(*f_below)) return none_unless_zero(*f_below, below);
    }
    if (!f_above) {
        f_above = eval(above).f;
        if (root_is_above(*f_above)) return none_unless_zero(*f_above, above);
    }
    // A function that went non-finite, or that Boost's bracketing finds no sign change in, has no root
    // here that this finder can vouch for: the caller decides (each has a fallback or a DomainError).
    if (!std::isfinite(*f_below) || !std::isfinite(*f_above)) return std::nullopt;
    std::uintmax_t it = 100;
    try {
        const auto r = boost::math::tools::toms748_solve([&](double x) { return eval(x).f; }, below, above, *f_below,
                                                         *f_above, boost::math::tools::eps_tolerance<double>(bits), it);
        return 0.5 * (r.first + r.second);
    } catch (const std::exception&) {
        return std::nullopt;
    }
}

// The root of f on [b.lo, b.hi], f monotone (rising if `increasing`), to a relative tolerance 2^(1 - bits),
// by Newton's steps: `fd(x)` returns {f(x), f'(x)}.
template <class FD>
std::optional<double> monotone_root_newton(const FD& fd, bool increasing, double guess, MonotoneBracket b, int bits) {
    return bracketed_steps(
        [&](double x) {
            const auto [f, slope] = fd(x);
            return RootStep{f, slope != 0 ? f / slope : NAN, true};
        },
        increasing, guess, b, bits);
}

}  // namespace libcoil::detail
