// Nagaoka's coefficient: the exact inductance of a uniform cylindrical current sheet.
//
// Method:  L = mu0 * pi * r^2 * N^2 / l * K(D/l), with k^2 = D^2 / (D^2 + l^2), k'^2 = 1 - k^2 and
//          K = 4 / (3 pi k') * [ (k'^2 / k^2) (K(k) - E(k)) + E(k) - k ].
//          For D / l <= 9 (t = 1 / (1 + D/l) >= 0.1) the value and its slope come from a table: 32 equal
//          parts in t, each a polynomial of degree 12 interpolating mpmath's 40-digit values at the
//          Chebyshev points (tools/nagaoka_table.py writes src/nagaoka_table.hpp; a test re-runs it).
//          Beyond, K(k) and (K(k) - E(k)) / k^2 come together from the arithmetic-geometric mean
//          (DLMF 19.8.1, 19.8.6; a sum of positive terms). For short coils (k'^2 < 0.1) the bracket
//          cancels to O(k'^2 ln k'), so there the logarithmic series of K and E about k = 1 (Abramowitz &
//          Stegun 17.3.26 and 17.3.36) is summed with the leading terms cancelled analytically.
// Source:  H. Nagaoka, J. Coll. Sci. Tokyo 27 (1909) art. 6; F. W. Grover, "Inductance Calculations" (1946).
// Domain:  any D / l > 0; the library accepts 1e-3 <= l / D <= 1e3.
// Accuracy (tests/python/test_nagaoka.py): measured 5.6e-16 relative against mpmath at 40 digits for
//          D / l = 1e-3 .. 1e3 (4.4e-16 in the table; enforced 2e-15); enforced 1e-12 against scipy
//          (ellipk, ellipe, elliprd) for D / l <= 100, where a double-precision reference can still
//          resolve it. The table and the elliptic integrals agree within 2.9e-15 (test_inductance.cpp).
#pragma once

namespace libcoil {

// Nagaoka's coefficient K as a function of diameter over length. Throws InputError unless D/l > 0.
double nagaoka_coefficient(double diameter_to_length);
// The coefficient and its derivative dK/d(D/l): from the table, or beyond it from the elliptic integrals via
// dK/dk = E/(k k'^2) - K/k and dE/dk = (E - K)/k (DLMF 19.4.1). Newton's steps in the design search and
// first-order sensitivities use it. Measured against mpmath's numerical derivative: 4.4e-16 for
// D/l = 1e-3 .. 9 (the table), 2.2e-14 up to 10 and 1.35e-10 at D/l = 944, where the short coil's bracket
// has cancelled (test_nagaoka.py).
struct NagaokaSlope {
    double value, slope;
};
NagaokaSlope nagaoka_coefficient_and_slope(double diameter_to_length);
namespace detail {
// The coefficient and slope from the elliptic integrals at any D/l, bypassing the table: what the tests
// hold the table against.
NagaokaSlope nagaoka_by_elliptic_integrals(double diameter_to_length);
}  // namespace detail
// Current-sheet inductance in H of N turns of mean diameter D over length l (both in m).
double current_sheet_inductance(double mean_diameter, double length, double turns);

// L = mu0 pi (D/2)^2 N^2 / l * coefficient(D / l), after validating D, l and N: the step from any
// Nagaoka-type coefficient (exact, Lundin's, Wheeler's) to an inductance. `model` names it in errors.
double sheet_inductance(double mean_diameter, double length, double turns, double (*coefficient)(double),
                        const char* model);

}  // namespace libcoil
