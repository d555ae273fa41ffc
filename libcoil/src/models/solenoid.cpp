#include "libcoil/models/solenoid.hpp"

#include <cmath>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"

namespace libcoil {

Solenoid::Solenoid(const Params& p) : p_(p) {
    require_positive("wire.diameter", p.wire.bare_diameter);
    require_non_negative("wire.insulation", p.wire.insulation);
    require_positive("mean_diameter", p.mean_diameter);
    require_finite("turns", p.turns);
    require_at_least("turns", p.turns, 1.0, "a coil needs at least one turn");
    require_positive("pitch", p.pitch);
    require_non_negative("lead_length", p.lead_length);

    const double dw = p.wire.insulated_diameter();
    if (p.pitch < dw * (1 - 1e-12)) {
        throw InputError("pitch", format_value(p.pitch * 1e3) + " mm is less than the insulated wire diameter " +
                                      format_value(dw * 1e3) + " mm, so the turns would overlap; expected a pitch of at least " +
                                      format_value(dw * 1e3) + " mm");
    }
    if (p.mean_diameter <= dw) {
        throw InputError("mean_diameter", format_value(p.mean_diameter * 1e3) +
                                              " mm is not larger than the insulated wire diameter " +
                                              format_value(dw * 1e3) + " mm, which leaves no former");
    }
    const double l_over_d = winding_length() / p.mean_diameter;
    // A relative 1e-12 of slack, as for the pitch: a coil at an end of the range, written back from its form
    // diameter, reads back a rounding away from it (found by tests/fuzz, fuzz_spec's round trip).
    if (l_over_d < min_length_to_diameter * (1 - 1e-12) || l_over_d > max_length_to_diameter * (1 + 1e-12)) {
        throw InputError("turns", "winding length / mean diameter = " + format_value(l_over_d) +
                                      " is outside the supported range 0.001 .. 1000 (turns " + format_value(p.turns) +
                                      ", pitch " + format_value(p.pitch * 1e3) + " mm, mean diameter " +
                                      format_value(p.mean_diameter * 1e3) + " mm)");
    }
}

Solenoid Solenoid::on_form(double form_diameter, double turns, double pitch, const Wire& wire, double lead_length) {
    require_positive("form_diameter", form_diameter);
    require_positive("wire.diameter", wire.bare_diameter);
    require_non_negative("wire.insulation", wire.insulation);
    return Solenoid(Params{form_diameter + wire.insulated_diameter(), turns, pitch, wire, lead_length});
}

double Solenoid::pitch_tangent() const { return p_.pitch / (pi * p_.mean_diameter); }
double Solenoid::pitch_angle() const { return std::atan(pitch_tangent()); }

// A plain root of the sum of squares: the figures are a few metres at most, far from overflow, and
// std::hypot's care for that costs a design search more than the rest of this.
double Solenoid::helix_length() const {
    const double around = pi * p_.mean_diameter;
    return p_.turns * std::sqrt(around * around + p_.pitch * p_.pitch);
}

}  // namespace libcoil
