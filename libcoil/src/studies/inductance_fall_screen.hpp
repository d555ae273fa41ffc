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

// The fit's monomials at a coil of bare p / d `spacing`, D / d `diameter` and `turns`; nothing outside the
// fit's range. (One coil's fall at several frequencies shares them.)
using FallTerms = std::array<double, inductance_fall_fit::terms>;
std::optional<FallTerms> fall_terms(double spacing, double diameter, double turns);

// The fit's three polynomials (A, B, C) at a coil's monomials, which every x weighs alike: one coil's fall at
// several frequencies takes them once.
using FallShapes = std::array<double, inductance_fall_fit::shapes>;
FallShapes fall_shapes(const FallTerms& terms);

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
    // The same from the coil's monomials (fall_terms) and D / d; the fit in range.
    double ratio(const FallTerms& terms, double diameter) const;
    // The same from the coil's polynomials (fall_shapes) and D / d; the fit in range.
    double ratio(const FallShapes& shapes, double diameter) const;

private:
    bool in_range_;
    FallShapes weights_{};  // 1 - the internal inductance ratio, P, P^2
    FallTerms folded_{};
};

}  // namespace libcoil::detail
