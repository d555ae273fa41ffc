// Maxwell's mutual inductance of coaxial circles and the ring self-inductance.
#include <gtest/gtest.h>

#include <cmath>

#include <boost/math/quadrature/gauss_kronrod.hpp>

#include "libcoil/models/coaxial_mutual.hpp"
#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/ring_inductance.hpp"

using namespace libcoil;

namespace {

// Neumann's formula for two coaxial circles, M = (mu0 / 4 pi) oint oint dl1 . dl2 / R, reduced by symmetry
// to M = mu0 a b int_0^pi cos(phi) / sqrt(a^2 + b^2 + z^2 - 2 a b cos(phi)) dphi and integrated by adaptive
// Gauss-Kronrod (Boost.Math), independently of the elliptic integrals.
double neumann(double a, double b, double z) {
    // 1 - cos(phi) = 2 sin^2(phi/2) keeps the denominator accurate where the loops nearly touch; the
    // integrand peaks at phi = 0 with a width of about w = sqrt((a-b)^2 + z^2) / sqrt(a b), so the range
    // is split there.
    auto f = [&](double phi) {
        const double s = std::sin(phi / 2);
        return std::cos(phi) / std::sqrt((a - b) * (a - b) + z * z + 4 * a * b * s * s);
    };
    using GK = boost::math::quadrature::gauss_kronrod<double, 61>;
    const double w = std::min(pi / 2, std::sqrt((a - b) * (a - b) + z * z) / std::sqrt(a * b));
    double I = 0;
    double edges[] = {0.0, w / 10, w, 10 * w, pi};
    for (int i = 0; i < 4; ++i) {
        const double lo = std::min(edges[i], pi), hi = std::min(edges[i + 1], pi);
        if (hi > lo) I += GK::integrate(f, lo, hi, 12, 1e-15);
    }
    return mu0 * a * b * I;
}

}  // namespace

TEST(Maxwell, AgainstNeumannIntegral) {
    const double cases[][3] = {{1, 1, 0.01}, {1, 1, 0.1}, {1, 1, 1},   {1, 1, 5},  {1, 2, 0},
                               {1, 2, 0.5},  {0.3, 1, 2},  {1, 0.05, 0}, {1, 1, 40}, {0.01, 0.02, 0.003}};
    for (const auto& c : cases) {
        const double m = coaxial_mutual_inductance(c[0], c[1], c[2]);
        EXPECT_NEAR(m / neumann(c[0], c[1], c[2]), 1.0, 1e-11) << c[0] << " " << c[1] << " " << c[2];
    }
}

TEST(Maxwell, FarFieldDipoleLimit) {
    // Two magnetic dipoles on a common axis: M = mu0 pi a^2 b^2 / (2 z^3) (1 + O((a/z)^2)).
    const double a = 0.01, b = 0.02, z = 10.0;
    EXPECT_NEAR(coaxial_mutual_inductance(a, b, z) / (mu0 * pi * a * a * b * b / (2 * z * z * z)), 1.0, 1e-5);
}

TEST(Maxwell, SymmetryAndDomain) {
    EXPECT_DOUBLE_EQ(coaxial_mutual_inductance(0.1, 0.3, 0.2), coaxial_mutual_inductance(0.3, 0.1, 0.2));
    EXPECT_DOUBLE_EQ(coaxial_mutual_inductance(0.1, 0.3, 0.2), coaxial_mutual_inductance(0.1, 0.3, -0.2));
    EXPECT_THROW(coaxial_mutual_inductance(0.1, 0.1, 0.0), InputError);
    EXPECT_THROW(coaxial_mutual_inductance(-0.1, 0.1, 0.1), InputError);
    // Continuous across the series switch at k^2 = 0.2 (no source needed: one function, two formulas).
    // k^2 = 0.2 for a = b = 1 at z = 4; one ulp either side M itself moves by about 1e-15.
    EXPECT_NEAR(coaxial_mutual_inductance(1, 1, std::nextafter(4.0, 0.0)) /
                    coaxial_mutual_inductance(1, 1, std::nextafter(4.0, 5.0)),
                1.0, 4e-15);
}

TEST(Gmd, Rectangle) {
    // Maxwell's values: a square of side s has GMD 0.44705 s, a thin strip of width w has w e^(-3/2)
    // (Maxwell 1873 art. 692; Grover 1946 ch. 2, quoted from memory).
    EXPECT_NEAR(rectangle_gmd(1.0, 1.0), 0.44705, 1e-5);
    EXPECT_NEAR(rectangle_gmd(1.0, 1e-6) / std::exp(-1.5), 1.0, 1e-5);
    EXPECT_DOUBLE_EQ(rectangle_gmd(2.0, 0.5), rectangle_gmd(0.5, 2.0));  // symmetric in its sides
    EXPECT_DOUBLE_EQ(rectangle_gmd(3.0, 1.5), 3.0 * rectangle_gmd(1.0, 0.5));  // scales with size
    EXPECT_THROW(rectangle_gmd(0.0, 1.0), InputError);
}

namespace {

// ln GMD of two rectangles by the midpoint rule on n x n points in each (the check value: plain numerical
// quadrature, common practice; it converges as 1/n^2 for rectangles that do not overlap).
double midpoint_log_gmd(double x0, double x1, double z0, double z1, double u0, double u1, double w0, double w1, int n) {
    double sum = 0;
    for (int i = 0; i < n; ++i) {
        for (int j = 0; j < n; ++j) {
            const double x = x0 + (x1 - x0) * (i + 0.5) / n, z = z0 + (z1 - z0) * (j + 0.5) / n;
            for (int k = 0; k < n; ++k) {
                for (int l = 0; l < n; ++l) {
                    const double u = u0 + (u1 - u0) * (k + 0.5) / n, w = w0 + (w1 - w0) * (l + 0.5) / n;
                    sum += 0.5 * std::log((x - u) * (x - u) + (z - w) * (z - w));
                }
            }
        }
    }
    return sum / std::pow(n, 4);
}

}  // namespace

TEST(Gmd, RectanglePairs) {
    // The same rectangle twice is Rosa's self-GMD; far apart, the centroids' distance; in between, plain
    // quadrature (measured: adjacent squares 1.0065498 by both, to 1e-8).
    EXPECT_NEAR(rectangles_gmd(0, 1, 0, 1, 0, 1, 0, 1) / rectangle_gmd(1, 1), 1.0, 1e-12);
    EXPECT_NEAR(rectangles_gmd(0, 65, 0, 1e-3, 0, 65, 0, 1e-3) / rectangle_gmd(65, 1e-3), 1.0, 1e-9);  // thin: no lost digits
    EXPECT_NEAR(rectangles_gmd(0, 1, 0, 1, 100, 101, 0, 1) / 100, 1.0, 1e-5);
    EXPECT_NEAR(std::log(rectangles_gmd(0, 1, 0, 1, 1, 2, 0, 1)), midpoint_log_gmd(0, 1, 0, 1, 1, 2, 0, 1, 40), 1e-6);
    EXPECT_NEAR(std::log(rectangles_gmd(0, 3, 0, 0.5, 1, 2.5, 1, 1.2)), midpoint_log_gmd(0, 3, 0, 0.5, 1, 2.5, 1, 1.2, 40), 1e-4);
    EXPECT_DOUBLE_EQ(rectangles_gmd(0, 2, 0, 1, 3, 4, 5, 7), rectangles_gmd(3, 4, 5, 7, 0, 2, 0, 1));  // symmetric
    EXPECT_THROW(rectangles_gmd(0, 0, 0, 1, 0, 1, 0, 1), InputError);
}

TEST(Ring, MatchesMaxwellAtTheGeometricMeanDistance) {
    // Maxwell's method of geometric mean distances: a ring of round wire with uniform current has, to first
    // order in r/a, the mutual inductance of two filaments at the GMD r e^(-1/4) of its cross-section
    // (Maxwell 1873 art. 691-692; Grover 1946 ch. 2).
    const double a = 1.0, r = 1e-4;
    EXPECT_NEAR(ring_self_inductance(a, r) / coaxial_mutual_inductance(a, a, r * std::exp(-0.25)), 1.0, 1e-6);
    EXPECT_THROW(ring_self_inductance(1.0, 1.0), InputError);
}
