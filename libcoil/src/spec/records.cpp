#include "libcoil/spec/records.hpp"

#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"

namespace libcoil {

void validate_band(const BandSpec& b) {
    require_positive("band.low", b.low);
    require_positive("band.ceiling", b.ceiling);
    if (!(b.ceiling > b.low)) {
        throw InputError("band.ceiling", format_quantity(b.ceiling, Dimension::frequency) + " is not above band.low (" +
                                             format_quantity(b.low, Dimension::frequency) + "); expected the top of the band");
    }
    if (b.srf_margin) {
        require_finite("band.srf_margin", *b.srf_margin);
        require_at_least("band.srf_margin", *b.srf_margin, 1.0,
                         "the self-resonance must lie at least at the ceiling (a factor >= 1)");
    }
    if (b.max_deviation) require_positive("band.max_deviation", *b.max_deviation);
    if (b.min_impedance) require_positive("band.min_impedance", *b.min_impedance);
}

void validate_tolerances(const BuildTolerances& t, const Solenoid& coil) {
    // A build tolerance is a small share of what it scatters; past a quarter of the nominal the normal law's
    // tails (and the samples drawn from it) mean nothing: common practice, no source.
    const auto plausible = [](const char* field, double sd, double nominal, std::string (*say)(double)) {
        require_non_negative(field, sd);
        if (sd > nominal / 4) {
            const std::string told = say(sd), whole = say(nominal);
            throw InputError(field, told + " is more than a quarter of the nominal " + whole + "; expected a build tolerance (one standard deviation)");
        }
    };
    const auto length = [](double v) { return format_quantity(v, Dimension::length); };
    plausible("tolerances.form_diameter", t.form_diameter, coil.form_diameter(), length);
    plausible("tolerances.pitch", t.pitch, coil.pitch(), length);
    plausible("tolerances.wire_diameter", t.wire_diameter, 1.0, [](double v) { return format_value(100 * v) + " %"; });
    plausible("tolerances.turns", t.turns, coil.turns(), [](double v) { return format_value(v) + " turns"; });
}

}  // namespace libcoil
