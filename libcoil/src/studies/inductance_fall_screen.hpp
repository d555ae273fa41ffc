// Internal: the design screen's estimate of how far a coil's inductance falls from DC to the target frequency,
// as the analysis's wire-harmonic solver computes it (inductance_fall_fit.hpp, written by
// tools/inductance_fall_fit.py from random coils). Method: the fall over L_dc as (d / D) times the skin
// effect's internal-inductance shape, the transverse screening P(x) and P(x)^2, each weighted by a quartic
// in the geometry (log gap, log D / d, 1 / rounded N, log l / D), least squares. Accuracy measured on coils
// the fit did not see: |estimate - fall| within 0.005 % of L_dc at the median, 0.25 % at the 99th
// percentile (the internal inductance alone, the estimate before: 0.9 % and 10 %). The design screen aims
// with it; the confirmation retargets every kept design with the solver itself.
#pragma once

#include <array>
#include <optional>

#include "studies/inductance_fall_fit.hpp"

namespace libcoil::detail {

// Re(-J2(z) / J0(z)) at z = (1 - j) x / sqrt(2), x = sqrt(2) r / delta: the in-phase part of the dipole a
// round wire's eddy currents set against a uniform field across it, over a perfect conductor's (0 at DC,
// 1 when they expel the field). Backward recurrence of J_m / J_(m-1), to the rounding error for x <= 1e3.
double transverse_screening(double x);

// The fit's polynomials with D / d fixed (one wire on one form, as the design screen takes a row of pitch ratios):
// each polynomial's powers of log D / d folded into the coefficients of a quartic in the other three features,
// 35 terms where the whole polynomial has 70, and the logarithm of D / d taken once. `K` polynomials share the
// monomials: the fit at one x (InductanceFallFit::at_diameter), or its three shapes (fall_shapes_at).
inline constexpr int fall_row_terms = 35;
template <std::size_t K>
class FallAtDiameter {
public:
    FallAtDiameter() = default;
    // Each of `polynomials` 70 coefficients in inductance_fall_fit's order; D / d `diameter`.
    FallAtDiameter(const std::array<const double*, K>& polynomials, double diameter);
    // The K polynomials at bare p / d `spacing` and `turns` (not yet over D / d); nothing outside the fit's range.
    std::optional<std::array<double, K>> at(double spacing, double turns) const;

private:
    bool in_range_ = false;
    double diameter_ = 0;
    std::array<std::array<double, fall_row_terms>, K> c_{};
};

// The fit's three polynomials (A, B, C), which every x weighs alike, at D / d `diameter`.
using FallShapes = std::array<double, inductance_fall_fit::shapes>;
FallAtDiameter<inductance_fall_fit::shapes> fall_shapes_at(double diameter);

// The fit at one x (one wire at one frequency): the three shapes folded into one polynomial's coefficients.
class InductanceFallFit {
public:
    // x = sqrt(2) r / delta and the skin effect's internal-inductance ratio there (skin_effect.hpp's
    // skin_ratios). Outside the sampled range of x the fit is never taken.
    InductanceFallFit(double x, double internal_ratio);
    bool in_range() const { return in_range_; }

    // The fall of L from DC over L_dc (positive) for a coil of bare p / d `spacing`, D / d `diameter` and
    // `turns`; nothing outside the fit's range.
    std::optional<double> ratio(double spacing, double diameter, double turns) const;
    // The same from the coil's polynomials (fall_shapes_at) and D / d; the fit in range.
    double ratio(const FallShapes& shapes, double diameter) const;
    // The fit with D / d fixed: its polynomial (the fall over L_dc times D / d) for a row of coils; the fit in range.
    FallAtDiameter<1> at_diameter(double diameter) const;
    // 1 - the internal inductance ratio, P and P^2, which the fit's coefficients are a function of.
    const FallShapes& weights() const { return weights_; }

private:
    bool in_range_;
    FallShapes weights_{};
    std::array<double, inductance_fall_fit::terms> folded_{};
};

}  // namespace libcoil::detail
