// DC resistance and the wire's skin effect.
#include <gtest/gtest.h>

#include <cmath>

#include "libcoil/models/dc_resistance.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/kelvin.hpp"
#include "libcoil/models/skin_effect.hpp"

using namespace libcoil;

TEST(DcResistance, Iec60028Copper) {
    const Conductor& cu = conductor("copper");
    // IEC 60028: 1 m of 1 mm^2 annealed copper is 1/58 ohm at 20 degC; the tabulated 1.7241e-8 ohm m is
    // 1/58 rounded to five digits (2.2e-5 relative).
    const double d_for_1mm2 = std::sqrt(4e-6 / M_PI);
    EXPECT_NEAR(dc_resistance(cu, d_for_1mm2, 1.0, 293.15), 1.0 / 58, 3e-5 / 58);
    EXPECT_DOUBLE_EQ(dc_resistance(cu, d_for_1mm2, 1.0, 293.15), 1.7241e-2);
    // alpha20 = 0.00393 /K: at 75 degC, 1 + 0.00393 * 55.
    EXPECT_NEAR(dc_resistance(cu, 1e-3, 2.0, 348.15) / dc_resistance(cu, 1e-3, 2.0, 293.15), 1 + 0.00393 * 55, 1e-14);
    EXPECT_THROW(dc_resistance(cu, -1e-3, 1.0, 293.15), InputError);
    EXPECT_THROW(dc_resistance(cu, 1e-3, 1.0, 10.0), InputError);  // rho would go negative: outside the law
    // The geometric factor alone, times the resistivity, is the same resistance (the thermal balance's form).
    EXPECT_NEAR(resistance_per_resistivity(1e-3, 2.0) * cu.resistivity_at(348.15) / dc_resistance(cu, 1e-3, 2.0, 348.15), 1.0, 1e-15);
    EXPECT_THROW(resistance_per_resistivity(0.0, 1.0), InputError);
}

TEST(Skin, KelvinSmallArgumentSeries) {
    // ber x = 1 - (x/2)^4 / (2!)^2 + ..., bei x = (x/2)^2 - (x/2)^6 / (3!)^2 + ... (A&S 9.9.10).
    const double x = 0.3, q = x / 2;
    const auto k = kelvin(x);
    EXPECT_NEAR(k.ber, 1 - std::pow(q, 4) / 4 + std::pow(q, 8) / 576, 1e-15);
    EXPECT_NEAR(k.bei, q * q - std::pow(q, 6) / 36 + std::pow(q, 10) / 14400, 1e-15);
    EXPECT_EQ(kelvin(0.0).ber, 1.0);
    EXPECT_EQ(kelvin(0.0).bei, 0.0);
}

TEST(Skin, ContinuousAcrossTheAsymptoticSwitch) {
    // Series below x = 26, Hankel's expansion above; one ulp apart they agree (no source needed).
    const auto a = skin_ratios(std::nextafter(26.0, 0.0)), b = skin_ratios(std::nextafter(26.0, 30.0));
    EXPECT_NEAR(a.resistance / b.resistance, 1.0, 1e-14);
    EXPECT_NEAR(a.internal_inductance / b.internal_inductance, 1.0, 1e-14);
}

TEST(Skin, RatiosAreMonotonic) {
    // R_ac/R_dc rises and L_int falls with frequency (physics of the skin effect; no source needed).
    double r = 0.999, l = 1.001;
    for (double x = 0.01; x < 200; x *= 1.05) {
        const auto s = skin_ratios(x);
        EXPECT_GT(s.resistance, r) << x;
        EXPECT_LT(s.internal_inductance, l) << x;
        r = s.resistance;
        l = s.internal_inductance;
    }
    EXPECT_EQ(wire_skin_ratios(0.5e-3, 1.7e-8, 0.0).resistance, 1.0);
}
