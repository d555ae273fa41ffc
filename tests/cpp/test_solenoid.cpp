// Solenoid geometry: derived quantities and validation.
#include <gtest/gtest.h>

#include <cmath>
#include <numbers>

#include <boost/math/quadrature/gauss_kronrod.hpp>

#include "libcoil/core/error.hpp"
#include "libcoil/models/solenoid.hpp"

using namespace libcoil;

namespace {

Wire wire(double d = 1e-3, double ins = 0.04e-3) { return Wire{d, ins, "test"}; }

std::string field_of(const Solenoid::Params& p) {
    try {
        Solenoid s(p);
    } catch (const InputError& e) {
        return e.field();
    }
    return "(no error)";
}

}  // namespace

TEST(Solenoid, DerivedQuantities) {
    const Solenoid s = Solenoid::on_form(20e-3, 10, 1.5e-3, wire(), 0.1);
    EXPECT_DOUBLE_EQ(s.mean_diameter(), 20e-3 + 1e-3 + 2 * 0.04e-3);  // the convention of docs/models.md
    EXPECT_DOUBLE_EQ(s.form_diameter(), 20e-3);
    EXPECT_DOUBLE_EQ(s.winding_length(), 15e-3);
    EXPECT_DOUBLE_EQ(s.outer_diameter(), 20e-3 + 2 * 1.08e-3);
    EXPECT_NEAR(s.pitch_angle(), std::atan(1.5e-3 / (std::numbers::pi * 21.08e-3)), 1e-15);
    EXPECT_DOUBLE_EQ(s.wire_length(), s.helix_length() + 0.1);
}

TEST(Solenoid, HelixLengthAgainstArcLengthIntegral) {
    // Arc length of r(t) = (a cos t, a sin t, p t / 2 pi) over t in [0, 2 pi N], integrated numerically
    // (Boost.Math Gauss-Kronrod) from |r'(t)| rather than taken from the closed form.
    for (double N : {1.0, 7.25, 40.0}) {
        const Solenoid s(Solenoid::Params{30e-3, N, 3e-3, wire(), 0});
        const double a = s.mean_radius(), p = s.pitch();
        auto speed = [&](double t) {
            const double dx = -a * std::sin(t), dy = a * std::cos(t), dz = p / (2 * std::numbers::pi);
            return std::sqrt(dx * dx + dy * dy + dz * dz);
        };
        const double len = boost::math::quadrature::gauss_kronrod<double, 61>::integrate(
            speed, 0.0, 2 * std::numbers::pi * N, 10, 1e-14);
        EXPECT_NEAR(s.helix_length() / len, 1.0, 1e-13) << N;
    }
}

TEST(Solenoid, ValidationNamesTheField) {
    const Solenoid::Params ok{21e-3, 10, 1.5e-3, wire(), 0};
    EXPECT_EQ(field_of(ok), "(no error)");
    auto p = ok;
    p.pitch = 1.0e-3;  // less than the insulated 1.08 mm: turns overlap
    EXPECT_EQ(field_of(p), "pitch");
    p = ok;
    p.pitch = -1e-3;
    EXPECT_EQ(field_of(p), "pitch");
    p = ok;
    p.turns = 0.5;
    EXPECT_EQ(field_of(p), "turns");
    p = ok;
    p.turns = std::nan("");
    EXPECT_EQ(field_of(p), "turns");
    p = ok;
    p.mean_diameter = std::numeric_limits<double>::infinity();
    EXPECT_EQ(field_of(p), "mean_diameter");
    p = ok;
    p.mean_diameter = 1.0e-3;  // no room for a former inside a 1.08 mm wire
    EXPECT_EQ(field_of(p), "mean_diameter");
    p = ok;
    p.wire.bare_diameter = 0;
    EXPECT_EQ(field_of(p), "wire.diameter");
    p = ok;
    p.wire.insulation = -1e-6;
    EXPECT_EQ(field_of(p), "wire.insulation");
    p = ok;
    p.lead_length = -1;
    EXPECT_EQ(field_of(p), "lead_length");
}

TEST(Solenoid, ExtremeAspectRatiosAllowedWithinRange) {
    // l / D = 1e-3: one turn of 0.1 mm wire at 0.1 mm pitch on a 100 mm diameter.
    EXPECT_NO_THROW(Solenoid(Solenoid::Params{0.1, 1, 0.1e-3, wire(0.1e-3, 0), 0}));
    // l / D = 1e3: 1000 turns of 0.2 mm wire at 1 mm pitch on a 1 mm mean diameter.
    EXPECT_NO_THROW(Solenoid(Solenoid::Params{1e-3, 1000, 1e-3, wire(0.2e-3, 0), 0}));
    EXPECT_THROW(Solenoid(Solenoid::Params{1e-3, 2000, 1e-3, wire(0.2e-3, 0), 0}), InputError);
    EXPECT_THROW(Solenoid(Solenoid::Params{0.2, 1, 0.1e-3, wire(0.1e-3, 0), 0}), InputError);
}
