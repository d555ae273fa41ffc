// Mutual inductance and coupling of two coils. References: Neumann's double integral by Boost.Math's
// Gauss-Kronrod quadrature, the magnetic-dipole far field (textbook magnetostatics: the field of a dipole
// m on its axis is mu0 m / (2 pi d^3), in its equatorial plane -mu0 m / (4 pi d^3)), and the filament
// model's inductance of a coil split in two halves (L = L1 + L2 + 2 M).
#include <gtest/gtest.h>

#include <cmath>

#include <boost/math/quadrature/gauss_kronrod.hpp>

#include "libcoil/models/coaxial_mutual.hpp"
#include "libcoil/core/constants.hpp"
#include "libcoil/models/coupling.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/filament.hpp"
#include "libcoil/models/solenoid.hpp"
#include "libcoil/models/wire.hpp"

using namespace libcoil;

namespace {

Wire wire(double bare) { return Wire{bare, 0.03e-3, "test"}; }

Solenoid coil(double mean_diameter, double turns, double pitch, double bare = 0.8e-3) {
    return Solenoid(Solenoid::Params{mean_diameter, turns, pitch, wire(bare), 0});
}

// Neumann: M = mu0 / (4 pi) double integral of a b cos(p1 - p2) / |r1 - r2| over both loops.
double neumann_parallel(double a, double b, double d, double h) {
    using boost::math::quadrature::gauss_kronrod;
    const auto inner = [&](double p2) {
        return gauss_kronrod<double, 61>::integrate(
            [&](double p1) {
                const double dx = d + b * std::cos(p2) - a * std::cos(p1), dy = b * std::sin(p2) - a * std::sin(p1);
                return a * b * std::cos(p1 - p2) / std::sqrt(dx * dx + dy * dy + h * h);
            },
            0.0, 2 * pi, 12, 1e-13);
    };
    return mu0 / (4 * pi) * gauss_kronrod<double, 61>::integrate(inner, 0.0, 2 * pi, 12, 1e-12);
}

}  // namespace

TEST(Coupling, ParallelAxisIntegralAgainstNeumann) {
    struct Case {
        double a, b, d, h;
    };
    for (const Case c : {Case{0.01, 0.01, 0.03, 0.0}, Case{0.01, 0.015, 0.05, 0.004}, Case{0.02, 0.005, 0.012, 0.01},
                         Case{0.01, 0.01, 0.005, 0.002}}) {
        SCOPED_TRACE(c.d);
        const double ours = parallel_filament_mutual_inductance(c.a, c.b, c.d, c.h);
        EXPECT_NEAR(ours / neumann_parallel(c.a, c.b, c.d, c.h), 1, 1e-9);
    }
}

TEST(Coupling, ParallelAxisAtZeroOffsetIsMaxwell) {
    for (double h : {0.002, 0.01, 0.05}) {
        const double coax = coaxial_mutual_inductance(0.01, 0.012, h);
        EXPECT_EQ(parallel_filament_mutual_inductance(0.01, 0.012, 0, h), coax);
        // And continuous into it: at an offset of 1e-7 of the radius.
        EXPECT_NEAR(parallel_filament_mutual_inductance(0.01, 0.012, 1e-9, h) / coax, 1, 1e-9);
    }
}

TEST(Coupling, CoaxialHalvesOfOneCoilAgainstTheFilamentModel) {
    // A 20-turn coil is two 10-turn coils end to end, one winding length apart: L20 = 2 L10 + 2 M.
    const double D = 20e-3, p = 1.5e-3, w = 0.8e-3;
    const Solenoid half = coil(D, 10, p);
    const double m = coil_mutual_inductance(half, half, Arrangement::coaxial, 10 * p);
    const double expected = (filament_inductance(D, 20, p, w) - 2 * filament_inductance(D, 10, p, w)) / 2;
    EXPECT_NEAR(m / expected, 1, 1e-12);  // measured 1.6e-15: the same filaments, summed by other code
}

TEST(Coupling, FarFieldApproachesTheDipoles) {
    const Solenoid a = coil(20e-3, 10, 1.5e-3), b = coil(15e-3, 14, 1.2e-3);
    const double ma = a.turns() * pi * a.mean_radius() * a.mean_radius(), mb = b.turns() * pi * b.mean_radius() * b.mean_radius();
    const double d = 20 * 20e-3;  // 20 diameters
    const double coax = coil_mutual_inductance(a, b, Arrangement::coaxial, d);
    const double side = coil_mutual_inductance(a, b, Arrangement::side_by_side, d);
    EXPECT_NEAR(coax / (mu0 * ma * mb / (2 * pi * d * d * d)), 1, 0.01);
    EXPECT_NEAR(side / (-mu0 * ma * mb / (4 * pi * d * d * d)), 1, 0.01);
    // The corrections are of order (size / d)^2: measured +1.1e-4 (coaxial) and -8.2e-5 (side by side) at
    // 20 D, +1.5e-3 and -1.5e-3 at 5 D.
    EXPECT_NEAR(coax / (mu0 * ma * mb / (2 * pi * d * d * d)), 1, 5e-4);
    EXPECT_NEAR(side / (-mu0 * ma * mb / (4 * pi * d * d * d)), 1, 5e-4);
}

TEST(Coupling, SymmetricAndBelowOne) {
    const Solenoid a = coil(20e-3, 10.5, 1.5e-3), b = coil(30e-3, 6, 2e-3, 1.0e-3);
    for (double d : {0.035, 0.05, 0.1}) {
        for (Arrangement arr : {Arrangement::coaxial, Arrangement::side_by_side}) {
            const double ab = coil_mutual_inductance(a, b, arr, d, 0.003), ba = coil_mutual_inductance(b, a, arr, d, -0.003);
            EXPECT_NEAR(ab / ba, 1, 1e-12);
            const Coupling c = coupling(a, b, arr, d);
            EXPECT_LT(std::fabs(c.coefficient), 1);
            EXPECT_GT(std::fabs(c.coefficient), 0);
        }
    }
    // End to end coaxially, the coupling is strong but still below one (measured 0.229).
    const Coupling touch = coupling(a, a, Arrangement::coaxial, a.winding_length());
    EXPECT_GT(touch.coefficient, 0.1);
    EXPECT_LT(touch.coefficient, 1);
}

TEST(Coupling, OverlapIsAnErrorNamingTheDistance) {
    const Solenoid a = coil(20e-3, 10, 1.5e-3);
    try {
        coil_mutual_inductance(a, a, Arrangement::side_by_side, 0.015);
        FAIL();
    } catch (const InputError& e) {
        EXPECT_EQ(e.field(), "distance");
    }
    EXPECT_THROW(coil_mutual_inductance(a, a, Arrangement::coaxial, 0.01), InputError);
}

TEST(Coupling, CrosstalkOfAWeakCoupling) {
    const Solenoid a = coil(20e-3, 10, 1.5e-3);
    const Coupling c = coupling(a, a, Arrangement::side_by_side, 0.2);
    const double f = 10e6, r = 0.5, rs = 50, rl = 50;
    const Crosstalk x = crosstalk(c, f, r, r, rs, rl);
    const double w = 2 * pi * f;
    EXPECT_NEAR(x.transfer_impedance, w * std::fabs(c.mutual), 1e-15);
    // Weak coupling: |S21| = 2 sqrt(Rs Rl) w |M| / |(Rs + Za)(Rl + Zb)| to first order in k^2 (derived from
    // the two-port equations V_a = Z_a I_a + j w M I_b, V_b = j w M I_a + Z_b I_b by dropping the M^2 term).
    const double za = std::hypot(rs + r, w * c.inductance_a);
    const double first_order = 20 * std::log10(2 * std::sqrt(rs * rl) * w * std::fabs(c.mutual) / (za * za));
    EXPECT_NEAR(x.transfer_db, first_order, 1e-6);
    EXPECT_LT(x.transfer_db, -40);
}
