// Tolerance spread: Monte Carlo against first-order propagation, reproducibility, long-coil limits.
#include <gtest/gtest.h>

#include <cmath>

#include "libcoil/core/constants.hpp"
#include "libcoil/models/inductance.hpp"
#include "libcoil/studies/spread.hpp"

using namespace libcoil;

namespace {
const Solenoid demo{Solenoid::Params{26.4e-3, 18, 1.9e-3, Wire{1.29e-3, 0.05e-3, "AWG 16"}, 0.08}};
}

TEST(Spread, MonteCarloMatchesFirstOrderForSmallTolerances) {
    // For small tolerances the spread is linear: sd(L) = L sqrt(sum (S_i sigma_i / x_i)^2) (first-order
    // propagation, GUM JCGM 100:2008 eq. 10). 20000 samples carry a statistical error near 0.5 %.
    const BuildTolerances small{0.02e-3, 0.004e-3, 0.001, 0.02};
    const double L = recommended_inductance(demo);
    const Spread s = tolerance_spread(demo, L, 0.02, {}, {}, small, 20000, 42);
    EXPECT_EQ(s.samples + s.left_out, 20000u);
    EXPECT_NEAR(s.inductance.standard_deviation / s.first_order_inductance_deviation, 1.0, 0.03);
    EXPECT_NEAR(s.inductance.mean / L, 1.0, 1e-4);
    EXPECT_LT(s.inductance.low, s.inductance.mean);
    EXPECT_GT(s.inductance.high, s.inductance.mean);
    // A normal spread puts its 95 % interval at about +-1.96 sd.
    EXPECT_NEAR((s.inductance.high - s.inductance.low) / (2 * 1.96 * s.inductance.standard_deviation), 1.0, 0.05);
    EXPECT_GT(s.within_tolerance, 0.99);
}

TEST(Spread, SeededAndReproducible) {
    const double L = recommended_inductance(demo);
    const Spread a = tolerance_spread(demo, L, 0.01, {}, {}, {}, 500, 7);
    const Spread b = tolerance_spread(demo, L, 0.01, {}, {}, {}, 500, 7);
    const Spread c = tolerance_spread(demo, L, 0.01, {}, {}, {}, 500, 8);
    EXPECT_EQ(a.inductance.mean, b.inductance.mean);
    EXPECT_EQ(a.self_resonance.standard_deviation, b.self_resonance.standard_deviation);
    EXPECT_NE(a.inductance.mean, c.inductance.mean);
    EXPECT_GE(a.within_tolerance, 0.0);
    EXPECT_LE(a.within_tolerance, 1.0);
}

TEST(Spread, LongCoilSensitivities) {
    // A long coil: L = mu0 N^2 pi a^2 / (N p) (the long-solenoid limit, any text), so L ~ N / p: the
    // sensitivity to turns is +1 and to pitch -1 at fixed pitch and turns; to the mean diameter +2, so to
    // the form diameter 2 D_form / D_mean. Rosa's round-wire correction, -mu0 a N (A + B) with
    // A = 5/4 - ln(2 p / d) (Rosa 1906, as in Grover), adds p / (pi a) to the pitch sensitivity (0.064
    // here). Nagaoka's end correction and Rosa's B(N) at l/D = 40 move the turns' sensitivity by 0.011 and
    // the diameter's by 0.002 (measured).
    const Solenoid s(Solenoid::Params{10e-3, 400, 1.0e-3, Wire{0.5e-3, 0.02e-3, "0.5 mm"}, 0});  // l/D = 40
    const Spread sp = tolerance_spread(s, recommended_inductance(s), 0.02, {}, {}, {}, 50, 1);
    ASSERT_EQ(sp.sensitivities.size(), 4u);
    EXPECT_NEAR(sp.sensitivities[0].inductance, 2 * s.form_diameter() / s.mean_diameter(), 0.005);
    EXPECT_NEAR(sp.sensitivities[1].inductance, -1.0 + s.pitch() / (pi * s.mean_radius()), 0.01);
    EXPECT_NEAR(sp.sensitivities[3].inductance, 1.0, 0.02);
    // SRF: spacing the turns out raises it (common practice), so its pitch sensitivity is positive.
    EXPECT_GT(sp.sensitivities[1].self_resonance, 0);
}
